package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;
import static org.quicktheories.generators.SourceDSL.longs;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The matcher's fast coefficients-only fit against the QR fit. */
class PolynomialLeastSquaresTest {

    @Test
    void normalEquationsAgreeWithQr() {
        qt().withFixedSeed(71L).withExamples(300)
                .forAll(integers().between(0, 6), integers().between(0, 40), longs().all())
                .checkAssert((degree, extra, seed) -> {
                    SplittableRandom random = new SplittableRandom(seed);
                    int n = degree + 1 + extra;
                    double[] x = new double[n];
                    double[] y = new double[n];
                    for (int i = 0; i < n; i++) {
                        x[i] = -1 + 2 * random.nextDouble();
                        y[i] = 500 + 100 * x[i] - 3 * x[i] * x[i] + random.nextGaussian();
                    }
                    double[] fast = PolynomialLeastSquares.coefficients(x, y, degree);
                    PolynomialLeastSquares.Solution qr = PolynomialLeastSquares.fit(x, y, null, null, degree);
                    if (qr == null) {
                        return; // a nearly singular draw; both must agree only where QR solves
                    }
                    for (double at = -1; at <= 1; at += 0.25) {
                        assertEquals(PolynomialLeastSquares.evaluate(qr.coefficients(), at),
                                PolynomialLeastSquares.evaluate(fast, at), 1e-8, "degree " + degree + ", n " + n);
                    }
                });
    }

    @Test
    void tooFewOrRepeatedPointsAreSingular() {
        assertNull(PolynomialLeastSquares.coefficients(new double[] {0.1, 0.2}, new double[] {1, 2}, 2));
        assertNull(PolynomialLeastSquares.coefficients(new double[] {0.3, 0.3, 0.3}, new double[] {1, 2, 3}, 1));
    }
}
