package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * The two tests behind {@link DispersionSolution#residualsStructured()}: the runs test's exact
 * distribution ({@link ResidualRuns}) and the F-test's tail ({@link DispersionSolution#fTestProbability}).
 */
class ResidualStructureTest {

    /** Every arrangement of n1 trues and n2 falses, counted by runs: the distribution by its definition. */
    private static double[] enumerated(int n1, int n2) {
        int n = n1 + n2;
        double[] count = new double[n + 2];
        double total = 0;
        for (int mask = 0; mask < 1 << n; mask++) {
            if (Integer.bitCount(mask) != n1) {
                continue;
            }
            boolean[] signs = new boolean[n];
            for (int i = 0; i < n; i++) {
                signs[i] = (mask >> i & 1) == 1;
            }
            count[ResidualRuns.count(signs)]++;
            total++;
        }
        for (int r = 0; r < count.length; r++) {
            count[r] /= total;
        }
        return count;
    }

    @Test
    void theRunsDistributionIsThatOfEveryArrangementEquallyLikely() {
        for (int n1 = 1; n1 <= 8; n1++) {
            for (int n2 = 1; n2 <= 8; n2++) {
                double[] p = enumerated(n1, n2);
                double cumulative = 0;
                for (int r = 2; r <= n1 + n2; r++) {
                    cumulative += p[r];
                    assertEquals(p[r], ResidualRuns.probability(n1, n2, r), 1e-12, n1 + "," + n2 + " runs " + r);
                    assertEquals(cumulative, ResidualRuns.lowerTailProbability(n1, n2, r), 1e-12);
                }
            }
        }
    }

    @Test
    void theRunsDistributionHasWaldAndWolfowitzsMeanAndVarianceForManySigns() {
        // E R = 1 + 2 n1 n2 / n, Var R = 2 n1 n2 (2 n1 n2 - n) / (n^2 (n - 1)) (Wald and Wolfowitz
        // 1940; common practice): checks the exact formula where enumeration is out of reach
        int n1 = 23;
        int n2 = 31;
        int n = n1 + n2;
        double mean = 0;
        double square = 0;
        double total = 0;
        for (int r = 2; r <= n; r++) {
            double p = ResidualRuns.probability(n1, n2, r);
            total += p;
            mean += r * p;
            square += (double) r * r * p;
        }
        assertEquals(1, total, 1e-12);
        assertEquals(1 + 2.0 * n1 * n2 / n, mean, 1e-9);
        assertEquals(2.0 * n1 * n2 * (2.0 * n1 * n2 - n) / ((double) n * n * (n - 1)), square - mean * mean, 1e-9);
        assertEquals(1, ResidualRuns.lowerTailProbability(5, 0, 1));
    }

    @Test
    void theFTestsTailMatchesTabulatedCriticalValues() {
        // upper 1 % points of F(1, nu): 10.04 for nu = 10, 8.10 for 20 (standard F tables, from
        // memory; scipy 1.17.1 stats.f.isf(0.01, 1, nu) gives 10.0443 and 8.0960), and for large nu
        // the square of the normal's two-sided 1 % point, 2.5758^2 = 6.635 (common practice)
        assertEquals(0.01, DispersionSolution.fTestProbability(10.0443, 10), 1e-5);
        assertEquals(0.01, DispersionSolution.fTestProbability(8.0960, 20), 1e-5);
        assertEquals(0.01, DispersionSolution.fTestProbability(2.5758293 * 2.5758293, 1_000_000), 1e-5);
        assertEquals(1, DispersionSolution.fTestProbability(0, 10));
        assertEquals(1, DispersionSolution.fTestProbability(-3, 10));
    }
}
