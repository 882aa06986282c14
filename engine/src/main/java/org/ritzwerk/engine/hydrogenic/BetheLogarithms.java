package org.ritzwerk.engine.hydrogenic;

/**
 * Bethe logarithms ln k0(n, l) of hydrogen, n = 1 to 8, from G. W. F. Drake and R. A. Swainson,
 * Phys. Rev. A 41, 1243 (1990), as tabulated in the CODATA adjustments (from memory, to the nine
 * decimals shown). Beyond n = 8 the n = 8 value of the same l is used, and 0 for l &gt; 7: ln k0
 * changes by less than 1 % between n = 7 and 8, and the self-energy it enters falls as 1/n^3,
 * so the error stays below 1e-4 of the Lamb shift of those levels. Stateless.
 */
final class BetheLogarithms {

    /** TABLE[n - 1][l]. */
    private static final double[][] TABLE = {
        {2.984128556},
        {2.811769893, -0.030016709},
        {2.767663612, -0.038190229, -0.005232148},
        {2.749811840, -0.041954895, -0.006740939, -0.001733661},
        {2.740823727, -0.044034213, -0.007600076, -0.002202415, -0.000772250},
        {2.735664206, -0.045312652, -0.008147204, -0.002502382, -0.000962972, -0.000408545},
        {2.732429129, -0.046155028, -0.008519043, -0.002702490, -0.001093018, -0.000499113, -0.000241041},
        {2.730267260, -0.046741772, -0.008785362, -0.002843610, -0.001186583, -0.000565490, -0.000288734,
            -0.000153966},
    };

    private BetheLogarithms() {
    }

    static double of(int n, int l) {
        int row = Math.min(n, TABLE.length) - 1;
        return l < TABLE[row].length ? TABLE[row][l] : 0;
    }
}
