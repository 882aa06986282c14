package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * The renderer and its naive baseline draw the same scene: on a small one their pixels agree to
 * within the renderer's window truncation and the difference between a pixel's integral and its
 * centre sample, h^2 f'' / 24: for lines 3 pixels wide (sigma 1.27 pixels) up to 2.6 % of a line's
 * peak, so 4 % of the brightest pixel is allowed.
 */
class RenderBenchmarkTest {

    @Test
    void rendererAndNaiveBaselineAgree() {
        RenderNaiveBenchmark benchmark = new RenderNaiveBenchmark();
        benchmark.size = "200x5000";
        benchmark.setUp();
        double[] rendered = benchmark.render().clone();
        double[] naive = benchmark.naiveEveryPixel();
        double brightest = 0;
        double renderedTotal = 0;
        double naiveTotal = 0;
        for (int p = 0; p < rendered.length; p++) {
            brightest = Math.max(brightest, naive[p]);
            renderedTotal += rendered[p];
            naiveTotal += naive[p];
        }
        for (int p = 0; p < rendered.length; p++) {
            assertEquals(naive[p], rendered[p], 0.04 * brightest, "pixel " + p);
        }
        assertEquals(naiveTotal, renderedTotal, 2e-3 * naiveTotal);
    }
}
