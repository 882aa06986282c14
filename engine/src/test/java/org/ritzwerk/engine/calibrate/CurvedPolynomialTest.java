package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;
import static org.quicktheories.generators.SourceDSL.longs;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The lamp matcher's Bayesian polynomial against the QR least-squares fit: with priors far wider
 * than the data need, the posterior mean is the least-squares solution and the prediction's
 * variance is noise^2 phi^T (A^T A)^-1 phi (Bishop 2006, eqs. 3.53-3.59 with a vanishing prior).
 */
class CurvedPolynomialTest {

    @Test
    void aVanishingPriorGivesTheLeastSquaresFit() {
        qt().withFixedSeed(71L).withExamples(200)
                .forAll(integers().between(1, 5), integers().between(0, 40), longs().all())
                .checkAssert((degree, extra, seed) -> {
                    SplittableRandom random = new SplittableRandom(seed);
                    int n = degree + 1 + extra;
                    double[] x = new double[n];
                    double[] y = new double[n];
                    for (int i = 0; i < n; i++) {
                        x[i] = -1 + 2 * random.nextDouble();
                        y[i] = 500 + 100 * x[i] - 3 * x[i] * x[i] + random.nextGaussian();
                    }
                    PolynomialLeastSquares.Solution qr = PolynomialLeastSquares.fit(x, y, null, null, degree);
                    if (qr == null) {
                        return; // a nearly singular draw; both must agree only where QR solves
                    }
                    double[] wide = new double[degree + 1];
                    java.util.Arrays.fill(wide, 1e9);
                    double noise = 0.5;
                    CurvedPolynomial p = new CurvedPolynomial(degree);
                    p.reset(noise, wide);
                    for (int i = 0; i < n; i++) {
                        p.add(x[i], y[i]);
                    }
                    assertTrue(p.solveNow());
                    for (double at = -1; at <= 1; at += 0.25) {
                        String where = "degree " + degree + ", n " + n + ", x " + at;
                        assertEquals(PolynomialLeastSquares.evaluate(qr.coefficients(), at), p.value(at), 1e-6,
                                where);
                        double[] phi = new double[degree + 1];
                        for (int j = 0; j <= degree; j++) {
                            phi[j] = Math.pow(at, j);
                        }
                        double variance = 0;
                        for (int r = 0; r <= degree; r++) {
                            for (int c = 0; c <= degree; c++) {
                                variance += phi[r] * qr.covariance()[r][c] * phi[c];
                            }
                        }
                        assertEquals(noise * Math.sqrt(variance), p.sigma(at), 1e-6 * (1 + p.sigma(at)), where);
                    }
                });
    }

    @Test
    void removingAPointUndoesAddingIt() {
        CurvedPolynomial p = new CurvedPolynomial(3);
        double[] prior = {0, 0, 2, 1};
        p.reset(0.1, prior);
        p.add(-0.8, 400);
        p.add(0.1, 500);
        p.add(0.9, 580);
        assertTrue(p.solveNow());
        double[] before = p.coefficients();
        p.add(0.5, 900);
        assertTrue(p.solveNow());
        p.remove(0.5, 900);
        assertTrue(p.solveNow());
        assertArrayEquals(before, p.coefficients(), 1e-9);
    }

    @Test
    void oneDistinctAbscissaDoesNotDetermineTheLine() {
        CurvedPolynomial p = new CurvedPolynomial(2);
        p.reset(1, new double[] {0, 0, 1});
        p.add(0.3, 1);
        p.add(0.3, 2);
        assertFalse(p.solveNow());
    }
}
