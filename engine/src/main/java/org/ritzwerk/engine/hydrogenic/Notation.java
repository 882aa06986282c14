package org.ritzwerk.engine.hydrogenic;

import java.util.Locale;
import java.util.Optional;
import org.ritzwerk.medium.Medium;

/**
 * Spectroscopic labels and series names of one-electron levels and lines (common practice).
 * Hydrogen (H I, D I, T I; nuclear charge 1) keeps its series names (Lyman, Balmer, Paschen,
 * Brackett, Pfund, Humphreys) and line names such as {@code "Balmer alpha"}. Every other
 * one-electron ion is named as spectroscopists name it: by its wavelength and its two shells,
 * e.g. {@code "4686 (4-3)"} for the He II line known as He II 4686 or the 4-3 line; He II lines
 * ending on n = 3 form the Fowler series and those ending on n = 4 the Pickering series. Stateless.
 */
public final class Notation {

    /** Orbital letters s, p, d, f, then alphabetical without j (common practice). */
    private static final String LETTERS = "spdfghiklmnoqrtuvwxyz";
    private static final String[] SERIES = {"Lyman", "Balmer", "Paschen", "Brackett", "Pfund", "Humphreys"};
    private static final String[] GREEK = {"alpha", "beta", "gamma", "delta", "epsilon"};
    /** Between these vacuum wavelengths (m) lines are named by air wavelength, elsewhere by vacuum. */
    private static final double AIR_FROM_METRES = 200e-9;
    private static final double AIR_UP_TO_METRES = 2e-6;
    /** Beyond this vacuum wavelength (m) a line is named by its shells only. */
    private static final double WAVELENGTH_NAME_UP_TO_METRES = 10e-6;

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
     * @param twice twice an angular momentum or its projection (any sign)
     * @return the angular momentum as text: {@code "2"}, {@code "3/2"}, {@code "-1/2"}
     */
    public static String half(int twice) {
        return (twice & 1) == 0 ? Integer.toString(twice / 2) : twice + "/2";
    }

    /**
     * @param nUpper upper principal quantum number
     * @param nLower lower principal quantum number
     * @return the two shells, e.g. {@code "4-3"} (upper first)
     */
    public static String shells(int nUpper, int nLower) {
        return nUpper + "-" + nLower;
    }

    /**
     * The series a line belongs to, where spectroscopists have a name for it.
     *
     * @param z      nuclear charge of the one-electron ion (1 for H, D, T; 2 for He II)
     * @param nLower lower principal quantum number
     * @return hydrogen: Lyman, Balmer, Paschen, Brackett, Pfund or Humphreys for lower n 1 to 6;
     *         He II: Fowler for lower n 3, Pickering for lower n 4; otherwise empty
     */
    public static Optional<String> series(int z, int nLower) {
        if (z == 1 && nLower >= 1 && nLower <= SERIES.length) {
            return Optional.of(SERIES[nLower - 1]);
        }
        if (z == 2 && nLower == 3) {
            return Optional.of("Fowler");
        }
        if (z == 2 && nLower == 4) {
            return Optional.of("Pickering");
        }
        return Optional.empty();
    }

    /**
     * The name of a line as spectroscopists write it after the spectrum symbol.
     *
     * @param z              nuclear charge of the one-electron ion (1 for H, D, T)
     * @param nUpper         upper principal quantum number
     * @param nLower         lower principal quantum number, less than nUpper
     * @param vacuumMetres   the line's vacuum wavelength in m (used when z is not 1)
     * @return hydrogen: {@link #hydrogenLine(int, int)} ({@code "Balmer alpha"}); any other ion:
     *         the wavelength label and the shells, {@code "4686 (4-3)"}, or the shells alone
     *         ({@code "12-11"}) beyond 10 um
     */
    public static String line(int z, int nUpper, int nLower, double vacuumMetres) {
        if (z == 1) {
            return hydrogenLine(nUpper, nLower);
        }
        if (!(vacuumMetres > 0) || vacuumMetres > WAVELENGTH_NAME_UP_TO_METRES) {
            return shells(nUpper, nLower);
        }
        return wavelengthLabel(vacuumMetres) + " (" + shells(nUpper, nLower) + ")";
    }

    /**
     * The wavelength by which a line is named (common practice in spectroscopy and astronomy):
     * in angstrom, in standard air ({@link Medium#air()}) from 200 nm to 2 um and in vacuum
     * outside that range, rounded to a whole angstrom from 1000 A on, to 0.1 A from 100 A, and to
     * four significant digits below. Some traditional names
     * truncate instead (He II 5411 for 5411.5 A in air); this method always rounds.
     *
     * @param vacuumMetres vacuum wavelength in m, positive and finite
     * @return e.g. {@code "4686"} for 468.57 nm in air, {@code "1640"}, {@code "303.8"}
     */
    public static String wavelengthLabel(double vacuumMetres) {
        if (!(vacuumMetres > 0) || Double.isInfinite(vacuumMetres)) {
            throw new IllegalArgumentException("vacuum wavelength must be positive and finite, got " + vacuumMetres
                    + " m");
        }
        double metres = vacuumMetres >= AIR_FROM_METRES && vacuumMetres <= AIR_UP_TO_METRES
                ? Medium.air().fromVacuum(vacuumMetres) : vacuumMetres;
        double angstrom = metres * 1e10;
        if (angstrom >= 1000) {
            return Long.toString(Math.round(angstrom));
        }
        // Below 100 A four significant digits, so that the X-ray lines of heavy ions keep a name
        // of their own (0.1240, not 0.1).
        return angstrom >= 100 ? String.format(Locale.ROOT, "%.1f", angstrom)
                : new java.math.BigDecimal(angstrom).round(new java.math.MathContext(4)).toPlainString();
    }

    /**
     * @param nUpper upper principal quantum number
     * @param nLower lower principal quantum number, less than nUpper
     * @return the hydrogen line name for lower levels 1 to 6 and steps of 1 to 5
     *         ({@code "Balmer alpha"}, {@code "Lyman 7-1"} beyond epsilon), otherwise the
     *         recombination-line notation {@code "109 alpha"} (lower n and step)
     */
    public static String hydrogenLine(int nUpper, int nLower) {
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
