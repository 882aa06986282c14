package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * The fast renderer and its baseline draw the same small scene: pixels agree within the fast
 * renderer's bound (1e-4 of the brightest pixel) plus the wings the exact renderer's window of
 * 50 FWHMs leaves out (a Lorentzian of a tenth of the Gaussian width holds 6e-4 of its flux beyond
 * it, spread thinly: under 1e-4 of the brightest pixel here), so 2e-4 of the brightest pixel is
 * allowed; the totals agree to the window's truncation bound, 1.2e-3.
 */
class FastRenderBenchmarkTest {

    @Test
    void fastRendererAndItsBaselineAgree() {
        FastRenderBenchmark benchmark = new FastRenderBenchmark();
        benchmark.size = "200x5000";
        benchmark.setUp();
        double[] exact = benchmark.exact().clone();
        double[] fast = benchmark.fast();
        double brightest = 0;
        double exactTotal = 0;
        double fastTotal = 0;
        for (int p = 0; p < exact.length; p++) {
            brightest = Math.max(brightest, exact[p]);
            exactTotal += exact[p];
            fastTotal += fast[p];
        }
        for (int p = 0; p < exact.length; p++) {
            assertEquals(exact[p], fast[p], 2e-4 * brightest, "pixel " + p);
        }
        assertEquals(fastTotal, exactTotal, 1.2e-3 * fastTotal);
    }
}
