package org.ritzwerk.engine.ritz;

import java.util.Locale;
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
 *     {@code (-1)^(sum of l times occupation)};</li>
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
    private static final Pattern ORBITAL = Pattern.compile("(\\d{1,2})([spdfghik])(\\d{1,2}(?![spdfghik]))?");
    private static final Pattern CONFIGURATION = Pattern.compile("((\\d{1,2})([spdfghik])(\\d{1,2}(?![spdfghik]))?[.\\s]*)+");

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
        if (parity == 0 && !configuration.isEmpty()
                && CONFIGURATION.matcher(configuration.toLowerCase(Locale.ROOT)).matches()
                && configuration.equals(configuration.toLowerCase(Locale.ROOT))) {
            int sum = 0;
            Matcher orbital = ORBITAL.matcher(configuration);
            while (orbital.find()) {
                int occupation = orbital.group(3) == null ? 1 : Integer.parseInt(orbital.group(3));
                sum += ORBITAL_LETTERS.indexOf(orbital.group(2).charAt(0)) * occupation;
            }
            parity = sum % 2 == 0 ? 1 : -1;
        }
        if (labelTwoJ >= 0 && twoJ >= 0 && labelTwoJ != twoJ) {
            throw new IllegalArgumentException("level '" + label + "' has J = " + half(labelTwoJ)
                    + " in its label but J = " + half(twoJ) + " beside it");
        }
        return new LevelDesignation(parity, multiplicity, l, labelTwoJ >= 0 ? labelTwoJ : twoJ);
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
