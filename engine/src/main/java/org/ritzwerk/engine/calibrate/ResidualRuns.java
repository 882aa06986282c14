package org.ritzwerk.engine.calibrate;

import org.apache.commons.numbers.gamma.LogGamma;

/**
 * The runs test of a sequence of signs (A. Wald and J. Wolfowitz, Ann. Math. Statist. 11, 147
 * (1940); F. S. Swed and C. Eisenhart, Ann. Math. Statist. 14, 66 (1943); common practice): with
 * n1 signs of one kind and n2 of the other in random order, every arrangement is equally likely,
 * and the number R of runs (maximal stretches of one sign) has the exact distribution
 * <pre>
 *   P(R = 2k)     = 2 C(n1 - 1, k - 1) C(n2 - 1, k - 1) / C(n1 + n2, n1)
 *   P(R = 2k + 1) = [C(n1 - 1, k) C(n2 - 1, k - 1) + C(n1 - 1, k - 1) C(n2 - 1, k)] / C(n1 + n2, n1)
 * </pre>
 * Residuals that follow a smooth curve the fit does not (a quartic term under a cubic) come in
 * long stretches of one sign, so too few runs.
 *
 * <p>Stateless and thread-safe.
 */
final class ResidualRuns {

    private ResidualRuns() {
    }

    /**
     * @param signs the signs in order, true for a positive (or zero) value
     * @return the number of runs, 0 for no signs
     */
    static int count(boolean[] signs) {
        int runs = 0;
        for (int i = 0; i < signs.length; i++) {
            runs += i == 0 || signs[i] != signs[i - 1] ? 1 : 0;
        }
        return runs;
    }

    /**
     * @param n1   signs of one kind, &gt;= 0
     * @param n2   signs of the other kind, &gt;= 0
     * @param runs the observed number of runs
     * @return the chance of at most that many runs in a random arrangement, exact; 1 when one kind
     *         is absent (one run is then the only arrangement)
     */
    static double lowerTailProbability(int n1, int n2, int runs) {
        if (n1 < 0 || n2 < 0) {
            throw new IllegalArgumentException("sign counts must be >= 0, got " + n1 + " and " + n2);
        }
        if (n1 == 0 || n2 == 0) {
            return 1;
        }
        double sum = 0;
        for (int r = 2; r <= runs; r++) {
            sum += probability(n1, n2, r);
        }
        return Math.min(1, sum);
    }

    /** P(R = r) for n1, n2 &gt;= 1. */
    static double probability(int n1, int n2, int r) {
        double total = logBinomial(n1 + n2, n1);
        int k = r / 2;
        if (r % 2 == 0) {
            return 2 * Math.exp(logBinomial(n1 - 1, k - 1) + logBinomial(n2 - 1, k - 1) - total);
        }
        return Math.exp(logBinomial(n1 - 1, k) + logBinomial(n2 - 1, k - 1) - total)
                + Math.exp(logBinomial(n1 - 1, k - 1) + logBinomial(n2 - 1, k) - total);
    }

    /** ln C(n, k); negative infinity when k is outside 0 .. n. */
    private static double logBinomial(int n, int k) {
        if (k < 0 || k > n) {
            return Double.NEGATIVE_INFINITY;
        }
        return LogGamma.value(n + 1.0) - LogGamma.value(k + 1.0) - LogGamma.value(n - k + 1.0);
    }
}
