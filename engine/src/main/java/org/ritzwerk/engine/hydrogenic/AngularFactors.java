package org.ritzwerk.engine.hydrogenic;

/**
 * Wigner 6j symbols by Racah's formula (A. R. Edmonds, Angular Momentum in Quantum Mechanics
 * (1957), eq. 6.3.7), with log-factorials so that l up to a few thousand stays in range.
 * Arguments are doubled (2j) so half-integers are exact. Stateless and thread-safe.
 */
final class AngularFactors {

    private static final int TABLE_SIZE = 8192;
    private static final double[] LN_FACTORIAL = new double[TABLE_SIZE];

    static {
        for (int i = 2; i < TABLE_SIZE; i++) {
            LN_FACTORIAL[i] = LN_FACTORIAL[i - 1] + Math.log(i);
        }
    }

    private AngularFactors() {
    }

    /**
     * @return {j1 j2 j3; j4 j5 j6} with every argument given doubled; 0 when a triangle fails
     */
    static double sixJ(int a, int b, int c, int d, int e, int f) {
        if (!triangle(a, b, c) || !triangle(a, e, f) || !triangle(d, b, f) || !triangle(d, e, c)) {
            return 0;
        }
        int a1 = (a + b + c) / 2;
        int a2 = (a + e + f) / 2;
        int a3 = (d + b + f) / 2;
        int a4 = (d + e + c) / 2;
        int b1 = (a + b + d + e) / 2;
        int b2 = (b + c + e + f) / 2;
        int b3 = (c + a + f + d) / 2;
        double lnDelta = lnDelta(a, b, c) + lnDelta(a, e, f) + lnDelta(d, b, f) + lnDelta(d, e, c);
        int tMin = Math.max(Math.max(a1, a2), Math.max(a3, a4));
        int tMax = Math.min(b1, Math.min(b2, b3));
        double sum = 0;
        for (int t = tMin; t <= tMax; t++) {
            double term = Math.exp(lnDelta + lnFactorial(t + 1) - lnFactorial(t - a1) - lnFactorial(t - a2)
                    - lnFactorial(t - a3) - lnFactorial(t - a4) - lnFactorial(b1 - t) - lnFactorial(b2 - t)
                    - lnFactorial(b3 - t));
            sum += (t & 1) == 0 ? term : -term;
        }
        return sum;
    }

    private static boolean triangle(int a, int b, int c) {
        return ((a + b + c) & 1) == 0 && c >= Math.abs(a - b) && c <= a + b;
    }

    /** ln of Racah's triangle coefficient, arguments doubled. */
    private static double lnDelta(int a, int b, int c) {
        return 0.5 * (lnFactorial((a + b - c) / 2) + lnFactorial((a - b + c) / 2) + lnFactorial((-a + b + c) / 2)
                - lnFactorial((a + b + c) / 2 + 1));
    }

    private static double lnFactorial(int k) {
        if (k < TABLE_SIZE) {
            return LN_FACTORIAL[k];
        }
        throw new IllegalArgumentException("angular momentum too large for the factorial table: " + k);
    }

    /**
     * The share of a one-electron line strength carried by the fine-structure component
     * {@code l j -> l' j'}: {@code (2j+1)(2j'+1) {l j 1/2; j' l' 1}^2}; the shares of all
     * components of {@code l -> l'} add up to 2 = 2s + 1 (Edmonds eq. 7.1.8 with the
     * orthogonality of 6j symbols).
     */
    static double fineStructureShare(int l, int twoJ, int l2, int twoJ2) {
        double sixJ = sixJ(2 * l, twoJ, 1, twoJ2, 2 * l2, 2);
        return (twoJ + 1) * (twoJ2 + 1) * sixJ * sixJ;
    }
}
