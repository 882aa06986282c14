package org.ritzwerk.engine.hydrogenic;

/**
 * Bethe logarithms ln k0(n, l) of hydrogen, n = 1 to 8 and every l (36 values), to nine
 * decimals. The published tabulation is G. W. F. Drake and R. A. Swainson, Phys. Rev. A 41, 1243
 * (1990), used in the CODATA adjustments' theory of hydrogen levels (e.g. P. J. Mohr,
 * B. N. Taylor and D. B. Newell, Rev. Mod. Phys. 84, 1527 (2012)). No readable copy of either
 * table was found for this project, so the values were recomputed from the definition (H. A.
 * Bethe, Phys. Rev. 72, 339 (1947); the normalisation of those tables for l &gt; 0) by
 * {@code engine/src/test/resources/golden/make_bethe_golden.py} with mpmath 1.2.1: exact sums
 * over the bound states, exact integrals over the continuum, two working precisions agreeing to
 * 1e-11 and the sum rule holding to 1e-12; its output {@code bethe-logarithms.csv} keeps 15
 * digits. Each value below is that recomputation rounded to nine decimals, and
 * {@code BetheLogarithmsTest} checks all 36 digit by digit. (An earlier version of this table,
 * written from memory, had 24 of the 36 wrong in the seventh to ninth decimal, all at n &gt;= 5.)
 *
 * <p>Beyond n = 8 the n = 8 value of the same l is used, and 0 for l &gt; 7. Between n = 7 and 8,
 * ln k0 changes by 0.08 % for s levels; for l &gt;= 1 the values are small (|ln k0| &lt; 0.05)
 * but change by up to 21 % at high l. The self-energy they enter falls as 1/n^3, so the error
 * this makes is below 1e-10 of the energies of those levels. Stateless.
 */
final class BetheLogarithms {

    /** TABLE[n - 1][l]. */
    private static final double[][] TABLE = {
        {2.984128556},
        {2.811769893, -0.030016709},
        {2.767663612, -0.038190229, -0.005232148},
        {2.749811840, -0.041954895, -0.006740939, -0.001733661},
        {2.740823728, -0.044034696, -0.007600751, -0.002202168, -0.000772099},
        {2.735664207, -0.045312198, -0.008147204, -0.002502180, -0.000962797, -0.000407926},
        {2.732429129, -0.046155177, -0.008519223, -0.002709096, -0.001094473, -0.000499702, -0.000240908},
        {2.730267261, -0.046741352, -0.008785043, -0.002859115, -0.001190432, -0.000566533, -0.000290426, -0.000153865},
    };

    private BetheLogarithms() {
    }

    static double of(int n, int l) {
        int row = Math.min(n, TABLE.length) - 1;
        return l < TABLE[row].length ? TABLE[row][l] : 0;
    }
}
