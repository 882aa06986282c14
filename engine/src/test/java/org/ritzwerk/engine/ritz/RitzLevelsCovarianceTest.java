package org.ritzwerk.engine.ritz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;

/** What {@link RitzLevels#withCovariance} accepts: a symmetric, positive semidefinite matrix (invented levels). */
class RitzLevelsCovarianceTest {

    private static RitzLevels levels(int n) {
        RitzLevels.Builder b = RitzLevels.builder(Species.parse("Fe I"));
        for (int i = 0; i < n; i++) {
            b.add("L" + i, 1000.0 * i, 0.01, 0);
        }
        return b.build();
    }

    private static RitzException refused(RitzLevels levels, double[][] v) {
        RitzException e = assertThrows(RitzException.class, () -> levels.withCovariance(v));
        assertEquals(RitzException.BAD_COVARIANCE, e.code());
        return e;
    }

    @Test
    void aCorrelationBeyondOneIsRefusedNamingTheEntry() {
        // closed form: [[1, 2], [2, 1]] has eigenvalues 3 and -1; |V_12| > sqrt(V_11 V_22)
        RitzException e = refused(levels(2), new double[][] {{1, 2}, {2, 1}});
        assertTrue(e.getMessage().contains("'L1' and 'L0' (row 2, column 1)")
                && e.getMessage().contains("not positive semidefinite"), e.getMessage());
        refused(levels(2), new double[][] {{1, 1 + 1e-6}, {1 + 1e-6, 1}});
        // within rounding (1e-13 beyond a perfect correlation, eigenvalue -1e-13): accepted
        RitzLevels edge = levels(2).withCovariance(new double[][] {{1, 1 + 1e-13}, {1 + 1e-13, 1}});
        assertEquals(1.0, edge.uncertaintyPerCm(1).getAsDouble(), 0.0);
    }

    @Test
    void anIndefiniteMatrixWithinEveryPairsBoundIsRefusedNamingTheFirstLevelAtFault() {
        // closed form: correlations 0.9, 0.9 and -0.9 cannot hold together (determinant -2.888 < 0), though
        // each pair alone is allowed; the fourth level, uncorrelated, is fine
        double[][] v = {{1, 0.9, 0.9, 0}, {0.9, 1, -0.9, 0}, {0.9, -0.9, 1, 0}, {0, 0, 0, 4}};
        RitzException e = refused(levels(4), v);
        assertTrue(e.getMessage().contains("with level 'L2' (row 3) the first 3 levels"), e.getMessage());
        // the same block behind a harmless first level: named by its own row
        double[][] w = {{4, 0, 0, 0}, {0, 1, 0.9, 0.9}, {0, 0.9, 1, -0.9}, {0, 0.9, -0.9, 1}};
        assertTrue(refused(levels(4), w).getMessage().contains("'L3' (row 4)"));
    }

    @Test
    void otherFaultsAreRefusedAndEveryCovarianceMatrixIsAccepted() {
        RitzLevels two = levels(2);
        assertTrue(refused(two, new double[][] {{1, 0.5}, {0.4, 1}}).getMessage().contains("not symmetric"));
        assertTrue(refused(two, new double[][] {{-1, 0}, {0, 1}}).getMessage().contains("'L0' with itself"));
        refused(two, new double[][] {{1, Double.NaN}, {Double.NaN, 1}});
        refused(two, new double[][] {{1, 0}});
        refused(two, new double[][] {{1, 0}, {0}});
        // a singular matrix (rank one: perfectly correlated levels) is a covariance: accepted, and the
        // difference of the two levels then has the closed-form uncertainty |a - b|
        double a = 3e-3;
        double b = 4e-3;
        RitzLevels one = two.withCovariance(new double[][] {{a * a, a * b}, {a * b, b * b}});
        assertEquals(b - a, one.differenceSigma(1, 0), 1e-12);
        // seeded experiment: sample covariances S = X^T X / m of random data are semidefinite by construction
        Random r = new Random(31);
        for (int t = 0; t < 50; t++) {
            int n = 2 + r.nextInt(8);
            int m = 1 + r.nextInt(n + 2);               // fewer samples than levels: singular, still accepted
            double[][] x = new double[m][n];
            for (double[] row : x) {
                for (int j = 0; j < n; j++) {
                    row[j] = Math.pow(10, -3 * r.nextDouble()) * r.nextGaussian();
                }
            }
            double[][] s = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    for (double[] row : x) {
                        s[i][j] += row[i] * row[j] / m;
                    }
                }
            }
            RitzLevels ok = levels(n).withCovariance(s);
            assertEquals(Math.sqrt(s[n - 1][n - 1]), ok.uncertaintyPerCm(n - 1).getAsDouble(), 0.0);
        }
    }

    @Test
    void aLevelListCarriesTheCovarianceBackWithinRounding() {
        // a random positive definite covariance B B^T + 1e-8 I (seeded), through toLevelList's correlations
        // r_ij = V_ij / (u_i u_j) and back by RitzLevels.of as r_ij u_i u_j: equal within a few ulps
        // (common practice: each product and quotient rounds once, relative error <= 2^-53 each)
        Random random = new Random(2121L);
        int n = 7;
        double[][] b = new double[n][n];
        for (double[] row : b) {
            for (int j = 0; j < n; j++) {
                row[j] = random.nextGaussian() * 1e-3;
            }
        }
        double[][] v = new double[n][n];
        for (int i = 0; i < n; i++) {
            v[i][i] = 1e-8;
            for (int j = 0; j < n; j++) {
                for (int k = 0; k < n; k++) {
                    v[i][j] += b[i][k] * b[j][k];
                }
            }
        }
        RitzLevels.Builder builder = RitzLevels.builder(Species.parse("Fe I"));
        for (int i = 0; i < n; i++) {
            builder.add("3d6 4s" + (i + 4) + "s 5D" + (i % 5), 20000.0 + 1000.0 * i, 0.01, -1);
        }
        RitzLevels original = builder.build().withCovariance(v);
        org.ritzwerk.data.LevelList list = original.toLevelList(new org.ritzwerk.data.DataSetInfo("fit",
                org.ritzwerk.data.DataKind.LEVELS, "fitted", "1",
                org.ritzwerk.data.Provenance.computedBy("the test"), java.util.List.of(original.species())));
        assertEquals(n * (n - 1) / 2, list.correlationCount());
        RitzLevels back = RitzLevels.of(list, original.species());
        assertTrue(back.hasCovariance());
        for (int i = 0; i < n; i++) {
            assertEquals(original.energyPerCm(i), back.energyPerCm(i), 0.0);
            for (int j = 0; j < n; j++) {
                assertEquals(v[i][j], back.covariance(i, j), 1e-15 * Math.sqrt(v[i][i] * v[j][j]), i + "," + j);
                assertEquals(original.differenceSigma(i, j), back.differenceSigma(i, j),
                        1e-9 * original.differenceSigma(i, j) + 1e-15, "line " + i + " - " + j);
            }
        }
    }

    @Test
    void theFirstIndefiniteLevelIsFound() {
        // [[1, .9, .9], [.9, 1, -.9], [.9, -.9, 1]]: the first two levels are fine (|r| < 1), the third makes the
        // determinant 1 - 3 (0.81) - 2 (0.729) < 0 (closed form)
        assertEquals(2, RitzLevels.firstIndefiniteLevel(new double[][] {{1, .9, .9}, {.9, 1, -.9}, {.9, -.9, 1}}));
        assertEquals(-1, RitzLevels.firstIndefiniteLevel(new double[][] {{1, .9, .9}, {.9, 1, .9}, {.9, .9, 1}}));
        assertEquals(-1, RitzLevels.firstIndefiniteLevel(new double[0][0]));
    }
}
