package org.ritzwerk.engine.hydrogenic;

/**
 * Spectroscopic labels and series names of one-electron levels and lines (common practice).
 * Stateless.
 */
public final class Notation {

    /** Orbital letters s, p, d, f, then alphabetical without j (common practice). */
    private static final String LETTERS = "spdfghiklmnoqrtuvwxyz";
    private static final String[] SERIES = {"Lyman", "Balmer", "Paschen", "Brackett", "Pfund", "Humphreys"};
    private static final String[] GREEK = {"alpha", "beta", "gamma", "delta", "epsilon"};

    private Notation() {
    }

    /**
     * @param l orbital quantum number, at least 0
     * @return the lower-case letter, e.g. {@code p} for 1, or {@code [l=25]} beyond the alphabet
     */
    public static String orbital(int l) {
        return l < LETTERS.length() ? String.valueOf(LETTERS.charAt(l)) : "[l=" + l + "]";
    }

    /**
     * @param n    principal quantum number
     * @param l    orbital quantum number, or -1 for the whole shell
     * @param twoJ twice j, or -1 when not resolved
     * @param twoF twice F, or -1 when not resolved
     * @return e.g. {@code "2p 2P3/2"}, {@code "1s 2S1/2 F=1"}, {@code "3d"}, {@code "n=3"}
     */
    public static String level(int n, int l, int twoJ, int twoF) {
        if (l < 0) {
            return "n=" + n;
        }
        StringBuilder label = new StringBuilder().append(n).append(orbital(l));
        if (twoJ > 0) {
            String term = orbital(l).toUpperCase(java.util.Locale.ROOT);
            label.append(" 2").append(term).append(half(twoJ));
        }
        if (twoF >= 0) {
            label.append(" F=").append(half(twoF));
        }
        return label.toString();
    }

    /**
     * @param twice twice an angular momentum, not negative
     * @return the angular momentum as text: {@code "2"}, {@code "3/2"}
     */
    public static String half(int twice) {
        return (twice & 1) == 0 ? Integer.toString(twice / 2) : twice + "/2";
    }

    /**
     * @param nUpper upper principal quantum number
     * @param nLower lower principal quantum number, less than nUpper
     * @return the series line name for lower levels 1 to 6 and steps of 1 to 5
     *         ({@code "Balmer alpha"}, {@code "Lyman 7-1"} beyond epsilon), otherwise the
     *         recombination-line notation {@code "109 alpha"} (lower n and step)
     */
    public static String line(int nUpper, int nLower) {
        int step = nUpper - nLower;
        if (step < 1) {
            return "n=" + nUpper + "-" + nLower;
        }
        if (nLower <= SERIES.length) {
            return SERIES[nLower - 1] + " " + (step <= GREEK.length ? GREEK[step - 1] : nUpper + "-" + nLower);
        }
        return nLower + " " + (step <= GREEK.length ? GREEK[step - 1] : "step " + step);
    }
}
