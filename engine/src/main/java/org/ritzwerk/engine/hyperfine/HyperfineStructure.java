package org.ritzwerk.engine.hyperfine;

import static org.ritzwerk.engine.hydrogenic.Notation.half;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.ritzwerk.engine.internal.angular.WignerSymbols;

/**
 * Hyperfine levels of a fine-structure level and the F -> F' components of a line between two
 * levels, at zero magnetic field. Stateless and thread-safe.
 *
 * <p><b>F levels</b> (Casimir formula; E. Arimondo, M. Inguscio and P. Violino, Rev. Mod. Phys. 49, 31
 * (1977), and common practice): with K = F(F+1) - I(I+1) - J(J+1),
 * <pre>
 *   E_F / h = A K / 2 + B [3/2 K (K+1) - 2 I(I+1) J(J+1)] / [4 I (2I-1) J (2J-1)]
 * </pre>
 * the B term only for I &gt;= 1 and J &gt;= 1. F runs from |I - J| to I + J. The (2F+1)-weighted mean
 * of the E_F is 0, so the shifts are relative to the hyperfine-free centroid of the level.
 *
 * <p><b>Components</b> (common practice; e.g. A. R. Edmonds, Angular Momentum in Quantum Mechanics
 * (1957), eq. 7.1.8): the reduced dipole element between hyperfine levels is
 * {@code <J I F||d||J' I F'> = (-1)^(J+I+F'+1) sqrt((2F+1)(2F'+1)) {J F I; F' J' 1} <J||d||J'>}, so the
 * component's line strength is S_FF' = (2F+1)(2F'+1) {J F I; F' J' 1}^2 S_JJ', and the sum over all F, F'
 * is (2I+1) S_JJ'. {@link HyperfineComponent#relativeStrength()} is S_FF' / ((2I+1) S_JJ'), so the
 * components of a line sum to 1 (the nuclear-spin degeneracy divided out): multiply by the
 * fine-structure line strength to get each component's strength. Allowed: |F - F'| &lt;= 1, not
 * F = F' = 0 (the 6j symbol is 0 otherwise).
 */
public final class HyperfineStructure {

    private HyperfineStructure() {
    }

    /**
     * @param twoI 2 I, the nuclear spin doubled; 0 to 40
     * @param twoJ 2 J; 1 to 40
     * @param constants the level's A and B
     * @return the F levels, F ascending
     * @throws IllegalArgumentException for a spin out of range
     */
    public static List<HyperfineLevel> levels(int twoI, int twoJ, HyperfineConstants constants) {
        Objects.requireNonNull(constants, "constants");
        checkSpins(twoI, twoJ);
        List<HyperfineLevel> out = new ArrayList<>();
        for (int twoF = Math.abs(twoI - twoJ); twoF <= twoI + twoJ; twoF += 2) {
            out.add(new HyperfineLevel(twoF, shiftHertz(twoI, twoJ, twoF, constants)));
        }
        return List.copyOf(out);
    }

    /**
     * The Casimir formula (see the class comment).
     *
     * @param twoI 2 I; 0 to 40
     * @param twoJ 2 J; 1 to 40
     * @param twoF 2 F; |2I - 2J| to 2I + 2J in steps of 2
     * @param constants A and B
     * @return E_F / h relative to the level's hyperfine-free centroid, Hz
     * @throws IllegalArgumentException for an F that I and J cannot make
     */
    public static double shiftHertz(int twoI, int twoJ, int twoF, HyperfineConstants constants) {
        double[] d = partials(twoI, twoJ, twoF);
        return constants.aHertz() * d[0] + constants.bHertz() * d[1];
    }

    /**
     * The standard uncertainty of one F level's shift ({@link #shiftHertz}) from the stated uncertainties of
     * A and B, first order (the shift is linear in A and B, so it is exact):
     * {@code u = sqrt((K/2 u_A)^2 + (c_B u_B)^2)}, with c_B the factor of B in the Casimir formula (class
     * comment). A and B of one level are taken as uncorrelated: sources state no covariance (GUM, JCGM
     * 100:2008, eq. 10, from memory; common practice). The B term counts only where the quadrupole term applies
     * (I &gt;= 1 and J &gt;= 1), and the A term only where K is not 0.
     *
     * @param twoI 2 I; 0 to 40
     * @param twoJ 2 J; 1 to 40
     * @param twoF 2 F; |2I - 2J| to 2I + 2J in steps of 2
     * @param constants A and B with their uncertainties
     * @return the shift's standard uncertainty, Hz; NaN when an uncertainty it needs is not stated (NaN)
     * @throws IllegalArgumentException for an F that I and J cannot make
     */
    public static double shiftUncertaintyHertz(int twoI, int twoJ, int twoF, HyperfineConstants constants) {
        double[] d = partials(twoI, twoJ, twoF);
        // an F whose Casimir factor K is 0 does not move with A: A's uncertainty, stated or not, does not enter
        double a = d[0] == 0 ? 0 : d[0] * constants.aUncertaintyHertz();
        if (d[1] == 0) {
            return Math.abs(a); // no quadrupole term for this F (or this level): B's uncertainty does not enter
        }
        return Math.hypot(a, d[1] * constants.bUncertaintyHertz());
    }

    /** The factors of A and of B in the Casimir formula for this F: {K/2, c_B}, c_B 0 without a quadrupole term. */
    private static double[] partials(int twoI, int twoJ, int twoF) {
        checkF(twoI, twoJ, twoF);
        double i = twoI / 2.0;
        double j = twoJ / 2.0;
        double f = twoF / 2.0;
        double k = f * (f + 1) - i * (i + 1) - j * (j + 1);
        double b = 0;
        if (twoI >= 2 && twoJ >= 2) {
            b = (1.5 * k * (k + 1) - 2 * i * (i + 1) * j * (j + 1)) / (4 * i * (2 * i - 1) * j * (2 * j - 1));
        }
        return new double[] {k / 2, b};
    }

    /**
     * The hyperfine splitting between the highest and the lowest F of a level (for J = 1/2 the
     * ground-state splitting, A (I + 1/2)).
     *
     * @param twoI 2 I; 0 to 40
     * @param twoJ 2 J; 1 to 40
     * @param constants A and B
     * @return E(F = I + J) - E(F = |I - J|), Hz (negative for an inverted level such as K-40's ground)
     */
    public static double splittingHertz(int twoI, int twoJ, HyperfineConstants constants) {
        return shiftHertz(twoI, twoJ, twoI + twoJ, constants) - shiftHertz(twoI, twoJ, Math.abs(twoI - twoJ), constants);
    }

    /**
     * Every allowed F -> F' component of the line between a lower and an upper level.
     *
     * @param twoI            2 I; 0 to 40
     * @param twoJLower       2 J of the lower level
     * @param lower           the lower level's A and B
     * @param twoJUpper       2 J' of the upper level; |J - J'| &lt;= 1 and not both 0
     * @param upper           the upper level's A and B
     * @param centroidHertz   the line's hyperfine-free centroid frequency, Hz; finite
     * @return the components, by F then F', each with its frequency and share of the line strength
     * @throws IllegalArgumentException when J and J' are not joined by a dipole transition
     */
    public static List<HyperfineComponent> components(int twoI, int twoJLower, HyperfineConstants lower,
            int twoJUpper, HyperfineConstants upper, double centroidHertz) {
        return components(twoI, twoJLower, lower, twoJUpper, upper, centroidHertz, Double.NaN);
    }

    /**
     * Every allowed F -&gt; F' component of the line between a lower and an upper level, each with its
     * frequency's standard uncertainty: the centroid's and the two F levels' shift uncertainties
     * ({@link #shiftUncertaintyHertz}) in quadrature, the centroid and the constants of the two levels taken
     * as independent (sources state no covariance). That is each component's own uncertainty: two components
     * sharing a level share its constants' errors, so their difference is known better than the two
     * uncertainties combined.
     *
     * @param twoI                     2 I; 0 to 40
     * @param twoJLower                2 J of the lower level
     * @param lower                    the lower level's A and B
     * @param twoJUpper                2 J' of the upper level; |J - J'| &lt;= 1 and not both 0
     * @param upper                    the upper level's A and B
     * @param centroidHertz            the line's hyperfine-free centroid frequency, Hz; finite
     * @param centroidUncertaintyHertz its standard uncertainty, Hz; not negative, or NaN when not estimated
     * @return the components, by F then F', each with its frequency, uncertainty (NaN when the centroid's or
     *         a needed constant's is not stated) and share of the line strength
     * @throws IllegalArgumentException when J and J' are not joined by a dipole transition
     */
    public static List<HyperfineComponent> components(int twoI, int twoJLower, HyperfineConstants lower,
            int twoJUpper, HyperfineConstants upper, double centroidHertz, double centroidUncertaintyHertz) {
        checkCentroidUncertainty(centroidUncertaintyHertz);
        Objects.requireNonNull(lower, "lower");
        Objects.requireNonNull(upper, "upper");
        checkSpins(twoI, twoJLower);
        checkSpins(twoI, twoJUpper);
        if (Math.abs(twoJLower - twoJUpper) > 2 || !Double.isFinite(centroidHertz)) {
            throw new IllegalArgumentException("no dipole line from J = " + half(twoJLower) + " to J' = "
                    + half(twoJUpper) + " at centroid " + centroidHertz + " Hz");
        }
        List<HyperfineComponent> out = new ArrayList<>();
        for (HyperfineLevel f : levels(twoI, twoJLower, lower)) {
            for (HyperfineLevel g : levels(twoI, twoJUpper, upper)) {
                if (Math.abs(f.twoF() - g.twoF()) > 2 || f.twoF() == 0 && g.twoF() == 0) {
                    continue;
                }
                double six = WignerSymbols.sixJ(twoJLower, f.twoF(), twoI, g.twoF(), twoJUpper, 2);
                double share = (f.twoF() + 1) * (g.twoF() + 1) * six * six / (twoI + 1);
                if (share == 0) {
                    continue;
                }
                double u = componentUncertainty(centroidUncertaintyHertz,
                        shiftUncertaintyHertz(twoI, twoJLower, f.twoF(), lower),
                        shiftUncertaintyHertz(twoI, twoJUpper, g.twoF(), upper));
                out.add(new HyperfineComponent(f.twoF(), g.twoF(), centroidHertz + g.shiftHertz() - f.shiftHertz(),
                        share, u));
            }
        }
        return List.copyOf(out);
    }

    private static void checkF(int twoI, int twoJ, int twoF) {
        checkSpins(twoI, twoJ);
        if (twoF < Math.abs(twoI - twoJ) || twoF > twoI + twoJ || ((twoF + twoI + twoJ) & 1) != 0) {
            throw new IllegalArgumentException("F = " + half(twoF) + " cannot be made from I = " + half(twoI)
                    + " and J = " + half(twoJ));
        }
    }

    /**
     * A component's own standard uncertainty: its centroid's and its two levels' (or states') in quadrature,
     * taken as independent; NaN when any is (not stated). At zero field and in a field alike.
     */
    static double componentUncertainty(double centroid, double lower, double upper) {
        return Math.sqrt(centroid * centroid + lower * lower + upper * upper);
    }

    /** Refuses a centroid uncertainty that is negative or infinite (NaN: not estimated). */
    static void checkCentroidUncertainty(double hertz) {
        if (hertz < 0 || hertz == Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("the centroid's uncertainty must be finite and not negative (Hz; NaN"
                    + " for not estimated), got " + hertz);
        }
    }

    static void checkSpins(int twoI, int twoJ) {
        if (twoI < 0 || twoI > 40) {
            throw new IllegalArgumentException("nuclear spin 2I must be 0 to 40, got " + twoI);
        }
        if (twoJ < 1 || twoJ > 40) {
            throw new IllegalArgumentException("electronic angular momentum 2J must be 1 to 40, got " + twoJ);
        }
    }
}
