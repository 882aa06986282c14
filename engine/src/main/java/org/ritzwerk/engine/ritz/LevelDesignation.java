package org.ritzwerk.engine.ritz;

import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * What a level's label says about the quantum numbers that the electric-dipole selection rules
 * need: the parity, the LS term (2S + 1 and L) where one is written, and J.
 *
 * <p>A label is read as a configuration followed by a term, the notation of atomic spectroscopy
 * (common practice; e.g. {@code 1s2p 3P1}, {@code 2p6.3s 2S1/2}, {@code 5s5p 3P*1},
 * {@code 4p 2Po3/2}, {@code 6p 2P3/2}):
 * <ul>
 * <li>the term is the last blank-separated word of the form multiplicity, letter of L, an optional
 *     odd-parity mark ({@code o}, {@code *} or the degree sign) and an optional J ({@code 1},
 *     {@code 3/2}); the letters are S P D F G H I K L M N O Q R T U V (no J);</li>
 * <li>the configuration is the rest: orbitals n l with an optional occupation ({@code 1s2},
 *     {@code 2p6}, {@code 5s5p}, separated or not by dots or blanks); its parity is
 *     {@code (-1)^(sum of l times occupation)}. Only physically valid readings count: n from 1
 *     without a leading zero, l below n, an occupation from 1 to 2(2l + 1) (the Pauli principle;
 *     common practice). Where the digits run together, every valid reading is tried: {@code 5p20s}
 *     is 5p 20s (5p2 0s has n = 0), {@code 1s22s} is 1s2 2s or 1s 22s (both even); where two valid
 *     readings give different parities ({@code 2p63s}: 2p6 3s, even, or 2p 63s, odd) the parity is
 *     not known;</li>
 * <li>the parity is the term's odd mark where it has one, else the configuration's; a term without a
 *     mark and without a configuration gives no parity (a label such as {@code 3P1} alone may be
 *     either);</li>
 * <li>J is the term's where written, else the {@code twoJ} given.</li>
 * </ul>
 * Anything that cannot be read is left unknown, never guessed.
 *
 * @param parity       +1 (even), -1 (odd), or 0 when not known
 * @param multiplicity 2S + 1, or 0 when not known
 * @param l            the term's L, or -1 when not known
 * @param twoJ         twice J, or -1 when not known
 */
public record LevelDesignation(int parity, int multiplicity, int l, int twoJ) {

    private static final String TERM_LETTERS = "SPDFGHIKLMNOQRTUV";
    private static final String ORBITAL_LETTERS = "spdfghik";
    private static final Pattern TERM = Pattern.compile("(\\d{1,2})([SPDFGHIKLMNOQRTUV])(o|\\*|\u00b0)?(\\d{1,3}(?:/2)?)?");
    /** The most digits of an n (Rydberg levels up to n = 999) and of an occupation (14, a full f shell). */
    private static final int N_DIGITS = 3;
    private static final int OCCUPATION_DIGITS = 2;
    private static final int EVEN = 1;
    private static final int ODD = 2;

    /**
     * Validates the values.
     *
     * @param parity       +1 (even), -1 (odd), or 0 when not known
     * @param multiplicity 2S + 1, or 0 when not known
     * @param l            the term's L, or -1 when not known
     * @param twoJ         twice J, or -1 when not known
     */
    public LevelDesignation {
        if (parity < -1 || parity > 1 || multiplicity < 0 || l < -1 || twoJ < -1) {
            throw new IllegalArgumentException("a designation needs parity -1, 0 or 1, 2S+1 >= 0, L >= -1 and "
                    + "2J >= -1, got " + parity + ", " + multiplicity + ", " + l + ", " + twoJ);
        }
    }

    /**
     * @param label a level label (see the class comment)
     * @param twoJ  twice J from elsewhere (a level list's j column), or -1; where the label also
     *              gives J, the two must agree
     * @return what the label says
     * @throws IllegalArgumentException when the label's J and {@code twoJ} disagree
     */
    public static LevelDesignation parse(String label, int twoJ) {
        String text = label.strip();
        int parity = 0;
        int multiplicity = 0;
        int l = -1;
        int labelTwoJ = -1;
        String configuration = text;
        int blank = text.lastIndexOf(' ');
        String last = blank < 0 ? text : text.substring(blank + 1);
        Matcher term = TERM.matcher(last);
        if (term.matches()) {
            multiplicity = Integer.parseInt(term.group(1));
            l = TERM_LETTERS.indexOf(term.group(2).charAt(0));
            if (term.group(3) != null) {
                parity = -1;
            }
            if (term.group(4) != null) {
                String j = term.group(4);
                labelTwoJ = j.endsWith("/2") ? Integer.parseInt(j.substring(0, j.length() - 2))
                        : 2 * Integer.parseInt(j);
            }
            configuration = blank < 0 ? "" : text.substring(0, blank).strip();
        }
        if (parity == 0 && !configuration.isEmpty()) {
            parity = configurationParity(configuration);
        }
        if (labelTwoJ >= 0 && twoJ >= 0 && labelTwoJ != twoJ) {
            throw new IllegalArgumentException("level '" + label + "' has J = " + half(labelTwoJ)
                    + " in its label but J = " + half(twoJ) + " beside it");
        }
        return new LevelDesignation(parity, multiplicity, l, labelTwoJ >= 0 ? labelTwoJ : twoJ);
    }

    /**
     * The parity of a configuration written as in the class comment, from its valid readings only.
     *
     * @param configuration orbitals such as {@code 1s2.2s}, {@code 5s5p} or {@code 5p20s}, in lower case
     * @return +1 (even) or -1 (odd) where every valid reading gives that parity, 0 where there is no
     *         valid reading or two valid readings disagree
     */
    static int configurationParity(String configuration) {
        int possible = EVEN;
        for (String word : configuration.strip().split("[.\\s]+")) {
            int own = wordParities(word);
            if (own == 0) {
                return 0;
            }
            int next = 0;
            for (int a : new int[] {EVEN, ODD}) {
                for (int b : new int[] {EVEN, ODD}) {
                    if ((possible & a) != 0 && (own & b) != 0) {
                        next |= a == b ? EVEN : ODD;
                    }
                }
            }
            possible = next;
        }
        return possible == EVEN ? 1 : possible == ODD ? -1 : 0;
    }

    /**
     * The parities of every valid reading of one word of orbitals written together, by dynamic
     * programming over the positions: {@code reach[p]} holds the parities (bits {@link #EVEN},
     * {@link #ODD}) of the valid readings of the first p characters.
     */
    private static int wordParities(String word) {
        int length = word.length();
        int[] reach = new int[length + 1];
        reach[0] = EVEN;
        for (int p = 0; p < length; p++) {
            if (reach[p] == 0 || word.charAt(p) < '1' || word.charAt(p) > '9') {
                continue;
            }
            for (int nEnd = p + 1; nEnd <= Math.min(length - 1, p + N_DIGITS) && isDigit(word, nEnd - 1); nEnd++) {
                int n = Integer.parseInt(word.substring(p, nEnd));
                int l = ORBITAL_LETTERS.indexOf(word.charAt(nEnd));
                if (l < 0 || l >= n) {
                    continue;
                }
                int after = nEnd + 1;
                reach[after] |= l % 2 == 0 ? reach[p] : shift(reach[p]);
                if (after < length && word.charAt(after) >= '1' && word.charAt(after) <= '9') {
                    for (int end = after + 1; end <= Math.min(length, after + OCCUPATION_DIGITS)
                            && isDigit(word, end - 1); end++) {
                        int occupation = Integer.parseInt(word.substring(after, end));
                        if (occupation <= 2 * (2 * l + 1)) {
                            reach[end] |= l * occupation % 2 == 0 ? reach[p] : shift(reach[p]);
                        }
                    }
                }
            }
        }
        return reach[length];
    }

    /** @return the parities with even and odd swapped (one more odd electron) */
    private static int shift(int parities) {
        return ((parities & EVEN) != 0 ? ODD : 0) | ((parities & ODD) != 0 ? EVEN : 0);
    }

    private static boolean isDigit(String word, int i) {
        return word.charAt(i) >= '0' && word.charAt(i) <= '9';
    }

    /** @return whether the parity is known */
    public boolean hasParity() {
        return parity != 0;
    }

    /** @return whether the LS term (2S + 1 and L) is known */
    public boolean hasTerm() {
        return multiplicity > 0 && l >= 0;
    }

    /** @return whether J is known */
    public boolean hasJ() {
        return twoJ >= 0;
    }

    private static String half(int twoJ) {
        return twoJ % 2 == 0 ? Integer.toString(twoJ / 2) : twoJ + "/2";
    }
}
