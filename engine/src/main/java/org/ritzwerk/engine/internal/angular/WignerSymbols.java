package org.ritzwerk.engine.internal.angular;

/**
 * Wigner 3j and 6j symbols by Racah's closed formulas (A. R. Edmonds, Angular Momentum in Quantum
 * Mechanics (1957), eqs. 3.7.3 and 6.3.7), summed with log-factorials so that angular momenta up
 * to a few thousand stay in range. Every argument is given doubled ({@code 2j}, {@code 2m}) so
 * half-integers are exact. A symbol whose triangle or projection rules fail is exactly 0.
 * Accuracy: a few units in the last place for the small arguments of dipole transitions; the
 * alternating sums lose relative accuracy only when the result is far smaller than its terms
 * (arguments of many hundreds). Stateless and thread-safe.
 */
public final class WignerSymbols {

    private static final int TABLE_SIZE = 8192;
    private static final double[] LN_FACTORIAL = new double[TABLE_SIZE];

    static {
        for (int i = 2; i < TABLE_SIZE; i++) {
            LN_FACTORIAL[i] = LN_FACTORIAL[i - 1] + Math.log(i);
        }
    }

    private WignerSymbols() {
    }

    /**
     * The 3j symbol {@code (j1 j2 j3; m1 m2 m3)}, Racah's formula (Edmonds eq. 3.7.3).
     *
     * @param twoJ1 2 j1, not negative
     * @param twoJ2 2 j2, not negative
     * @param twoJ3 2 j3, not negative
     * @param twoM1 2 m1
     * @param twoM2 2 m2
     * @param twoM3 2 m3
     * @return the symbol; 0 when m1 + m2 + m3 != 0, |m| > j, a j and its m differ in parity, or
     *         the triangle rule fails
     * @throws IllegalArgumentException for a negative j or one beyond the factorial table (about 4000)
     */
    public static double threeJ(int twoJ1, int twoJ2, int twoJ3, int twoM1, int twoM2, int twoM3) {
        if (twoJ1 < 0 || twoJ2 < 0 || twoJ3 < 0) {
            throw new IllegalArgumentException("3j symbol needs j >= 0, got 2j = " + twoJ1 + ", " + twoJ2 + ", "
                    + twoJ3);
        }
        if (twoM1 + twoM2 + twoM3 != 0 || Math.abs(twoM1) > twoJ1 || Math.abs(twoM2) > twoJ2
                || Math.abs(twoM3) > twoJ3 || ((twoJ1 + twoM1) & 1) != 0 || ((twoJ2 + twoM2) & 1) != 0
                || ((twoJ3 + twoM3) & 1) != 0 || !triangle(twoJ1, twoJ2, twoJ3)) {
            return 0;
        }
        // All the combinations below are integers once halved.
        int a = (twoJ1 + twoJ2 - twoJ3) / 2;
        int b = (twoJ1 - twoM1) / 2;
        int c = (twoJ2 + twoM2) / 2;
        int d = (twoJ3 - twoJ2 + twoM1) / 2;
        int e = (twoJ3 - twoJ1 - twoM2) / 2;
        int tMin = Math.max(0, Math.max(-d, -e));
        int tMax = Math.min(a, Math.min(b, c));
        double lnPrefactor = lnDelta(twoJ1, twoJ2, twoJ3) + 0.5 * (lnFactorial((twoJ1 + twoM1) / 2)
                + lnFactorial((twoJ1 - twoM1) / 2) + lnFactorial((twoJ2 + twoM2) / 2)
                + lnFactorial((twoJ2 - twoM2) / 2) + lnFactorial((twoJ3 + twoM3) / 2)
                + lnFactorial((twoJ3 - twoM3) / 2));
        double sum = 0;
        for (int t = tMin; t <= tMax; t++) {
            double term = Math.exp(lnPrefactor - lnFactorial(t) - lnFactorial(a - t) - lnFactorial(b - t)
                    - lnFactorial(c - t) - lnFactorial(d + t) - lnFactorial(e + t));
            sum += (t & 1) == 0 ? term : -term;
        }
        // overall phase (-1)^(j1 - j2 - m3)
        int phase = (twoJ1 - twoJ2 - twoM3) / 2;
        return (phase & 1) == 0 ? sum : -sum;
    }

    /**
     * The 6j symbol {@code {j1 j2 j3; j4 j5 j6}}, Racah's formula (Edmonds eq. 6.3.7).
     *
     * @param twoJ1 2 j1; the symbol is 0 when it is negative
     * @param twoJ2 2 j2; the symbol is 0 when it is negative
     * @param twoJ3 2 j3; the symbol is 0 when it is negative
     * @param twoJ4 2 j4; the symbol is 0 when it is negative
     * @param twoJ5 2 j5; the symbol is 0 when it is negative
     * @param twoJ6 2 j6; the symbol is 0 when it is negative
     * @return the symbol with every argument given doubled; 0 when a triangle fails
     * @throws IllegalArgumentException for an argument beyond the factorial table (about 4000)
     */
    public static double sixJ(int twoJ1, int twoJ2, int twoJ3, int twoJ4, int twoJ5, int twoJ6) {
        int a = twoJ1;
        int b = twoJ2;
        int c = twoJ3;
        int d = twoJ4;
        int e = twoJ5;
        int f = twoJ6;
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
        return a >= 0 && b >= 0 && c >= 0 && ((a + b + c) & 1) == 0 && c >= Math.abs(a - b) && c <= a + b;
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
}
