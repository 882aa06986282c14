package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * The fast renderer and its baseline draw the same small scene. They differ by the wings the
 * exact renderer's window of 50 FWHMs leaves out (a Lorentzian of a tenth of the Gaussian width
 * holds 6e-4 of its flux beyond it, spread thinly: 2.7e-5 of the brightest pixel here) and by the
 * fast renderer's own error (5.5e-7 of the brightest pixel against the exact renderer with a
 * 2000-FWHM window, measured once): 1e-4 of the brightest pixel is allowed. The totals agree to
 * the window's truncation bound, 1.2e-3.
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
            assertEquals(exact[p], fast[p], 1e-4 * brightest, "pixel " + p);
        }
        assertEquals(fastTotal, exactTotal, 1.2e-3 * fastTotal);
    }
}
