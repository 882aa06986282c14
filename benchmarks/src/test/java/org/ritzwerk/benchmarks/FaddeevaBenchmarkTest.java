package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.profile.Faddeeva;

/**
 * The engine's Faddeeva function against its baseline, the previous implementation (itself tested
 * against mpmath to 1e-10 complex and 2e-8 in the real part), over a wide grid of the whole plane,
 * and the benchmark's argument sets. The engine's own test compares both regions with mpmath.
 */
class FaddeevaBenchmarkTest {

    /** |z| log-uniform from 1e-3 to 1e5, the argument uniform over the plane, both signs of y. */
    @Test
    void agreesWithTheBaselineOverTheWholePlane() {
        qt().withFixedSeed(19L).withExamples(20_000)
                .forAll(doubles().between(-3, 5), doubles().between(-Math.PI, Math.PI))
                .checkAssert((logModulus, angle) -> compare(Math.pow(10, logModulus) * Math.cos(angle),
                        Math.pow(10, logModulus) * Math.sin(angle)));
    }

    /** Near the real axis, where the real part is small: y from 1e-14 to 1, |x| from 1e-3 to 1e4. */
    @Test
    void agreesWithTheBaselineNearTheRealAxis() {
        qt().withFixedSeed(20L).withExamples(20_000)
                .forAll(doubles().between(-3, 4), doubles().between(-14, 0), doubles().between(-1, 1))
                .checkAssert((logX, logY, sign) -> compare(Math.copySign(Math.pow(10, logX), sign),
                        Math.pow(10, logY)));
    }

    /** Around the boundary |z| = 8 between the rational approximation and the asymptotic series. */
    @Test
    void agreesWithTheBaselineAcrossTheSeriesBoundary() {
        qt().withFixedSeed(21L).withExamples(20_000)
                .forAll(doubles().between(7.9, 8.1), doubles().between(0, Math.PI))
                .checkAssert((modulus, angle) -> compare(modulus * Math.cos(angle), modulus * Math.sin(angle)));
    }

    private static void compare(double x, double y) {
        double[] w = Faddeeva.w(x, y);
        double[] b = FaddeevaBaseline.w(x, y);
        double size = Math.hypot(b[0], b[1]);
        if (!Double.isFinite(size)) {
            return; // beyond double range below the axis (exp(-z^2) overflows): both overflow
        }
        // The baseline's own errors against mpmath: 1e-10 complex, 2e-8 in the real part.
        assertTrue(Math.hypot(w[0] - b[0], w[1] - b[1]) <= 2e-10 * size, () -> "w(" + x + " + " + y + "i) = "
                + w[0] + " + " + w[1] + "i, baseline " + b[0] + " + " + b[1] + "i");
        if (y > 0 && Math.abs(b[0]) > 1e-300) {
            assertEquals(b[0], w[0], 4e-8 * Math.abs(b[0]), () -> "Re w(" + x + " + " + y + "i)");
        }
    }

    @Test
    void benchmarkArgumentsAreTheRenderersAndBothImplementationsSumAlike() {
        double[][] renderer = FaddeevaBenchmark.rendererArguments();
        int far = 0;
        for (int i = 0; i < renderer[0].length; i++) {
            if (Math.hypot(renderer[0][i], renderer[1][i]) > 8) {
                far++;
            }
        }
        int points = renderer[0].length;
        assertTrue(points > 1400 && points < 1700, "points per line " + points);
        assertEquals(0.8, (double) far / points, 0.05, "share beyond |z| = 8");
        for (String arguments : new String[] {"renderer", "core", "wing"}) {
            FaddeevaBenchmark benchmark = new FaddeevaBenchmark();
            benchmark.arguments = arguments;
            benchmark.setUp();
            double a = benchmark.faddeeva();
            double b = benchmark.baseline();
            assertEquals(b, a, 1e-10 * Math.abs(b), arguments);
        }
    }
}
