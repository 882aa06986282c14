package org.ritzwerk.atom;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A fine-structure state {@code n l j} of a one-valence-electron atom. Immutable; equality is
 * exact.
 *
 * @param n    principal quantum number, at least 1
 * @param l    orbital quantum number, 0 to n - 1
 * @param twoJ twice j: 2l - 1 or 2l + 1 (1 for l = 0)
 */
public record State(int n, int l, int twoJ) {

    private static final String LETTERS = "spdfghiklmnoqrtuv";
    /** n, then the letter of l or {@code (l=<l>)} (as {@link #label()} writes l beyond the letters), then 2j. */
    private static final Pattern TEXT = Pattern.compile("(\\d{1,10})(?:([a-z])|\\(l=(\\d{1,10})\\))(\\d{1,10})/2");
    private static final Pattern NO_J = Pattern.compile("\\d{1,9}[spdfghiklmnoqrtuv]");

    /**
     * Validates the quantum numbers.
     *
     * @param n    principal quantum number, at least 1
     * @param l    orbital quantum number, 0 to n - 1
     * @param twoJ twice j: 2l - 1 or 2l + 1 (1 for l = 0)
     */
    public State {
        if (n < 1) {
            throw new IllegalArgumentException("principal quantum number n must be >= 1, got " + n);
        }
        if (l < 0 || l >= n) {
            throw new IllegalArgumentException("orbital quantum number l must be 0 to n - 1 = " + (n - 1) + ", got " + l);
        }
        if (twoJ < 1 || Math.abs(twoJ - 2 * l) != 1) {
            throw new IllegalArgumentException("j must be l +- 1/2 (and 1/2 for l = 0); got l = " + l + ", 2j = " + twoJ);
        }
    }

    /**
     * @param n    principal quantum number
     * @param l    orbital quantum number
     * @param twoJ twice j
     * @return the state
     * @throws IllegalArgumentException naming the bad quantum number
     */
    public static State of(int n, int l, int twoJ) {
        return new State(n, l, twoJ);
    }

    /**
     * @param text the form {@link #label()} writes, e.g. {@code 5s1/2}, {@code 43d5/2}, {@code 60p3/2},
     *             and for l beyond the letters {@code 60(l=40)81/2}; every label reads back
     * @return the state
     * @throws StateParseException ({@link StateParseException#MALFORMED}) when the text has another
     *         form, ({@link StateParseException#IMPOSSIBLE}) for impossible quantum numbers; the
     *         message names the text and what is wrong
     */
    public static State parse(String text) {
        String input = java.util.Objects.requireNonNull(text, "text").strip();
        Matcher m = TEXT.matcher(input.toLowerCase(Locale.ROOT));
        if (!m.matches() || (m.group(2) != null && LETTERS.indexOf(m.group(2).charAt(0)) < 0)) {
            String hint = NO_J.matcher(input.toLowerCase(Locale.ROOT)).matches() ? "j is missing (write e.g. "
                    + input + (input.toLowerCase(Locale.ROOT).endsWith("s") ? "1/2" : "3/2") + "); " : "";
            throw new StateParseException(StateParseException.MALFORMED, input, hint
                    + "expected n, the letter of l and j, e.g. 5s1/2, 43d5/2, 60p3/2");
        }
        int n = quantumNumber(input, "n", m.group(1));
        int l = m.group(2) != null ? LETTERS.indexOf(m.group(2).charAt(0)) : quantumNumber(input, "l", m.group(3));
        int twoJ = quantumNumber(input, "2j", m.group(4));
        try {
            return new State(n, l, twoJ);
        } catch (IllegalArgumentException e) {
            throw new StateParseException(StateParseException.IMPOSSIBLE, input, e.getMessage());
        }
    }

    private static int quantumNumber(String input, String name, String digits) {
        long value = Long.parseLong(digits);
        if (value > Integer.MAX_VALUE) {
            throw new StateParseException(StateParseException.IMPOSSIBLE, input,
                    name + " = " + digits + " is larger than " + Integer.MAX_VALUE);
        }
        return (int) value;
    }

    /** @return j as a number */
    public double j() {
        return twoJ / 2.0;
    }

    /**
     * @return e.g. {@code 43d5/2}, the form {@link #parse(String)} reads; for l beyond the letters
     *         (l &gt;= 17) {@code 60(l=40)81/2}
     */
    public String label() {
        return n + letter(false) + twoJ + "/2";
    }

    /** @return spectroscopic notation, e.g. {@code 43d 2D5/2} */
    public String notation() {
        return n + letter(false) + " 2" + letter(true) + twoJ + "/2";
    }

    private String letter(boolean upper) {
        if (l >= LETTERS.length()) {
            return "(l=" + l + ")";
        }
        char c = LETTERS.charAt(l);
        return String.valueOf(upper ? Character.toUpperCase(c) : c);
    }

    @Override
    public String toString() {
        return label();
    }
}
