package org.ritzwerk.engine.synth;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.longs;

import java.util.Arrays;
import java.util.Map;
import java.util.SplittableRandom;
import org.apache.commons.numbers.gamma.Erf;
import org.junit.jupiter.api.Test;
import org.ritzwerk.testing.Golden;

/**
 * The Fourier-space renderer against closed forms and against the exact windowed renderer: the
 * stated bound is 1e-4 of the strongest line's peak pixel; the tests ask for 3e-5 (the worst
 * case seen in these tests is 1.3e-5, from the width nodes), so a regression shows before the
 * bound is reached.
 */
class FastLineRendererTest {

    /** The error these tests allow, as a fraction of the brightest pixel. */
    private static final double TOLERANCE = 3e-5;

    @Test
    void gaussianPixelsMatchTheErrorFunction() {
        // The flux of a Gaussian in [a, b] is (erf((b - c) / (sigma sqrt 2)) - erf((a - c) / (sigma sqrt 2))) / 2
        // (common practice).
        qt().withFixedSeed(41L).withExamples(25)
                .forAll(doubles().between(500, 510), doubles().between(0.01, 1), doubles().between(0.002, 0.2))
                .checkAssert((centre, fwhm, pixel) -> {
                    PixelGrid grid = PixelGrid.linear(495, 515, (int) Math.ceil(20 / pixel));
                    double[] out = new double[grid.pixels()];
                    new FastLineRenderer(grid, Instrument.ideal())
                            .render(new double[] {centre}, new double[] {3}, new double[] {fwhm}, new double[] {0}, out);
                    double root2Sigma = fwhm / (2 * Math.sqrt(2 * Math.log(2))) * Math.sqrt(2);
                    double[] exact = new double[out.length];
                    for (int p = 0; p < grid.pixels(); p++) {
                        exact[p] = 3 * 0.5 * (Erf.value((grid.edge(p + 1) - centre) / root2Sigma)
                                - Erf.value((grid.edge(p) - centre) / root2Sigma));
                    }
                    assertClose(exact, out, TOLERANCE);
                });
    }

    @Test
    void lorentzianPixelsMatchTheArctangent() {
        // The flux of a Lorentzian in [a, b] is (atan((b - c) / g) - atan((a - c) / g)) / pi,
        // g the half width (common practice).
        qt().withFixedSeed(42L).withExamples(25)
                .forAll(doubles().between(500, 510), doubles().between(0.01, 1), doubles().between(0.002, 0.2))
                .checkAssert((centre, fwhm, pixel) -> {
                    PixelGrid grid = PixelGrid.linear(495, 515, (int) Math.ceil(20 / pixel));
                    double[] out = new double[grid.pixels()];
                    new FastLineRenderer(grid, Instrument.ideal())
                            .render(new double[] {centre}, new double[] {2.5}, new double[] {0}, new double[] {fwhm}, out);
                    double half = fwhm / 2;
                    double[] exact = new double[out.length];
                    for (int p = 0; p < grid.pixels(); p++) {
                        exact[p] = 2.5 * (Math.atan((grid.edge(p + 1) - centre) / half)
                                - Math.atan((grid.edge(p) - centre) / half)) / Math.PI;
                    }
                    assertClose(exact, out, TOLERANCE);
                });
    }

    @Test
    void fluxIsConservedForGaussianLines() {
        qt().withFixedSeed(43L).withExamples(25)
                .forAll(doubles().between(-3, 3), doubles().between(0.05, 2), doubles().between(0.005, 1))
                .checkAssert((centre, fwhm, pixel) -> {
                    PixelGrid grid = PixelGrid.linear(-20, 20, (int) Math.ceil(40 / pixel));
                    double[] out = new double[grid.pixels()];
                    new FastLineRenderer(grid, Instrument.ideal())
                            .render(new double[] {centre}, new double[] {7}, new double[] {fwhm}, new double[] {0}, out);
                    assertEquals(7, Arrays.stream(out).sum(), 7e-9);
                });
    }

    @Test
    void fluxIsConservedOnALogarithmicGrid() {
        PixelGrid grid = PixelGrid.logarithmic(400, 700, 30_000);
        double[] out = new double[grid.pixels()];
        new FastLineRenderer(grid, Instrument.ideal()).render(new double[] {450, 520, 650}, new double[] {1, 2, 4},
                new double[] {0.05, 0.03, 0.08}, new double[] {0, 0, 0}, out);
        assertEquals(7, Arrays.stream(out).sum(), 7e-9);
    }

    /**
     * One Lorentzian-winged line 1 nm inside the low end of a 100 nm grid: the wing that leaves the
     * grid below must not come back in at the high end (a circular convolution's wrap-around put
     * 1.9 % too much light in the last pixels and 1.7e-5 of the line's flux too much in the grid).
     * Exact values: golden/fast-wings.csv (scipy.special.voigt_profile integrated over the pixels,
     * cross-checked by mpmath there), tolerances as its header declares.
     */
    @Test
    void aWingLeavingOneEndDoesNotComeBackAtTheOther() {
        double gauss = 0.02517829616677491;  // the golden file's FWHM_G, nm
        PixelGrid grid = PixelGrid.linear(500, 600, 5000);
        double[] out = new double[grid.pixels()];
        new FastLineRenderer(grid, Instrument.ideal()).render(new double[] {501.0}, new double[] {1},
                new double[] {gauss}, new double[] {0.5}, out);
        double relative = Golden.tolerance("fast-wings.csv");
        double total = Golden.absoluteTolerance("fast-wings.csv", "total");
        int rows = 0;
        for (Map<String, String> row : Golden.rows("fast-wings.csv")) {
            int first = Integer.parseInt(row.get("first_pixel"));
            int last = Integer.parseInt(row.get("last_pixel"));
            double expected = Double.parseDouble(row.get("flux"));
            double sum = 0;
            for (int p = first; p <= last; p++) {
                sum += out[p];
            }
            boolean whole = first == 0 && last == grid.pixels() - 1;
            assertEquals(expected, sum, whole ? total : relative * expected, row.toString());
            rows++;
        }
        assertEquals(22, rows);
    }

    /**
     * The tail integral G(x) = 1 - x f(x) of the wings' transform, against mpmath 1.3.0 at 40
     * digits: 1 - x (Ci(x) sin x - (Si(x) - pi / 2) cos x) (Abramowitz and Stegun 5.2.6), which
     * agreed with mpmath's quadrature of 2 t exp(-x t) / (1 + t^2)^2 to 20 digits; on both sides
     * of the switch from quadrature to the asymptotic series (20 pi).
     */
    @Test
    void theWingIntegralAgreesWithMpmath() {
        double[][] values = {{1, 0.11677036312582455247}, {2, 0.040904745420745188344},
            {5, 0.0077512190201755134794}, {11, 0.0016583062486528577975}, {12, 0.0013955982398258743587},
            {13, 0.0011905908976018935393}, {19, 0.00055946128224775716254},
            {20, 0.00050507756036328697758}, {100, 0.000020261773641218143738}, {1e6, 2.0264236728442915931e-13}};
        assertEquals(1, FastLineRenderer.wingIntegral(0));
        for (double[] v : values) {
            assertEquals(v[1], FastLineRenderer.wingIntegral(Math.PI * v[0]), 1e-13 * v[1], "q " + v[0]);
        }
    }

    /**
     * 200 lines with Lorentzian wings spread over a 100 nm grid: the pixels at both ends against
     * the exact renderer with a window reaching across the whole grid (so it leaves out only
     * wings beyond the grid, which do not belong in it). The wrap-around put 1e-3 to 3e-3 of the
     * local counts too much there.
     */
    @Test
    void manyWingedLinesLeaveNoWrappedLightAtTheEnds() {
        PixelGrid grid = PixelGrid.linear(500, 600, 5000);
        SplittableRandom random = new SplittableRandom(11);
        int n = 200;
        double[] x = new double[n];
        double[] f = new double[n];
        double[] g = new double[n];
        double[] l = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = random.nextDouble(500, 600);
            f[i] = random.nextDouble(0.1, 1);
            g[i] = random.nextDouble(0.002, 0.01);
            l[i] = 0.02;
        }
        Instrument instrument = Instrument.ofResolvingPower(20_000);
        double[] fast = new double[grid.pixels()];
        new FastLineRenderer(grid, instrument).render(x, f, g, l, fast);
        double[] exact = new double[grid.pixels()];
        new LineRenderer(grid, instrument, 10_000).render(x, f, g, l, exact);
        double worst = 0;
        int at = -1;
        for (int p = 0; p < grid.pixels(); p++) {
            if (p < 25 || p >= grid.pixels() - 25) {
                double d = Math.abs(fast[p] - exact[p]) / exact[p];
                if (d > worst) {
                    worst = d;
                    at = p;
                }
            }
        }
        assertTrue(worst < 1e-4, "worst relative difference " + worst + " at pixel " + at);
        assertEquals(Arrays.stream(exact).sum(), Arrays.stream(fast).sum(), 1e-9 * Arrays.stream(exact).sum());
    }

    @Test
    void randomScenesAgreeWithTheExactRendererOnALinearGrid() {
        qt().withFixedSeed(44L).withExamples(8).forAll(longs().all()).checkAssert(seed -> {
            PixelGrid grid = PixelGrid.linear(500, 520, 4000);
            compareWithExact(grid, Instrument.ideal(), seed, 0.01, 0.03, 0.03);
        });
    }

    @Test
    void randomScenesAgreeWithTheExactRendererOnALogarithmicGrid() {
        qt().withFixedSeed(45L).withExamples(4).forAll(longs().all()).checkAssert(seed -> {
            PixelGrid grid = PixelGrid.logarithmic(500, 520, 3000);
            compareWithExact(grid, Instrument.ofResolvingPower(40_000), seed, 0.01, 0.03, 0.03);
        });
    }

    @Test
    void randomScenesAgreeWithTheExactRendererOnADispersionGrid() {
        qt().withFixedSeed(46L).withExamples(4).forAll(longs().all()).checkAssert(seed -> {
            PixelGrid grid = PixelGrid.dispersion(new double[] {500, 0.006, 1e-7}, 3000);
            compareWithExact(grid, Instrument.ofFwhm(0.01), seed, 0.01, 0.03, 0.03);
        });
    }

    @Test
    void linesNarrowerThanAPixelAgreeWithTheExactRenderer() {
        qt().withFixedSeed(47L).withExamples(4).forAll(longs().all()).checkAssert(seed -> {
            PixelGrid grid = PixelGrid.linear(500, 520, 1000);
            compareWithExact(grid, Instrument.ideal(), seed, 0.006, 0.02, 0.02);
        });
    }

    @Test
    void theResultDoesNotDependOnTheThreadCount() {
        PixelGrid grid = PixelGrid.linear(500, 520, 5000);
        SplittableRandom random = new SplittableRandom(9);
        int n = 300;
        double[] x = new double[n];
        double[] f = new double[n];
        double[] g = new double[n];
        double[] l = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = random.nextDouble(499, 521);
            f[i] = random.nextDouble(0, 10);
            g[i] = random.nextDouble(0.01, 0.03);
            l[i] = random.nextDouble(0.005, 0.02);
        }
        FastLineRenderer renderer = new FastLineRenderer(grid, Instrument.ofResolvingPower(30_000));
        double[] one = new double[grid.pixels()];
        renderer.render(x, f, g, l, one, 1);
        for (int threads : new int[] {2, 3, 8}) {
            double[] many = new double[grid.pixels()];
            renderer.render(x, f, g, l, many, threads);
            assertArrayEquals(one, many, "threads " + threads);
        }
    }

    @Test
    void badLinesAreRefusedAndLeaveTheOutputAlone() {
        PixelGrid grid = PixelGrid.linear(0, 10, 100);
        FastLineRenderer renderer = new FastLineRenderer(grid, Instrument.ideal());
        double[] out = new double[100];
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> renderer.render(
                new double[] {1, 2}, new double[] {1, -1}, new double[] {1, 1}, new double[] {0, 0}, out));
        assertEquals("line 1: flux must be finite and not negative, got -1.0", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> renderer.render(
                new double[] {1}, new double[] {1}, new double[] {0}, new double[] {0}, out));
        assertTrue(e.getMessage().startsWith("line 0 has no width"), e.getMessage());
        assertEquals(0, Arrays.stream(out).sum());
    }

    /**
     * A random scene of 20 to 60 lines with Gaussian FWHMs up to {@code maxGauss} and Lorentzian
     * ones up to {@code maxLorentz} (nm, some zero), against the exact renderer with a window
     * of 1000 FWHMs (beyond it a Lorentzian is below 2.5e-7 of its peak).
     */
    private static void compareWithExact(PixelGrid grid, Instrument instrument, long seed, double minWidth,
            double maxGauss, double maxLorentz) {
        SplittableRandom random = new SplittableRandom(seed);
        int n = random.nextInt(20, 61);
        double[] x = new double[n];
        double[] f = new double[n];
        double[] g = new double[n];
        double[] l = new double[n];
        double lo = grid.edge(0);
        double hi = grid.edge(grid.pixels());
        for (int i = 0; i < n; i++) {
            x[i] = random.nextDouble(lo - 1, hi + 1);
            f[i] = Math.exp(random.nextDouble(0, 5));
            g[i] = random.nextInt(4) == 0 ? 0 : random.nextDouble(minWidth, maxGauss);
            l[i] = random.nextInt(3) == 0 ? 0 : random.nextDouble(minWidth, maxLorentz);
            if (g[i] == 0 && l[i] == 0 && instrument.fwhmAt(x[i]) == 0) {
                l[i] = minWidth;
            }
        }
        double[] exact = new double[grid.pixels()];
        new LineRenderer(grid, instrument, 1000).render(x, f, g, l, exact);

        double[] fast = new double[grid.pixels()];
        new FastLineRenderer(grid, instrument).render(x, f, g, l, fast);
        assertClose(exact, fast, TOLERANCE);
    }

    private static void assertClose(double[] expected, double[] actual, double fraction) {
        double peak = 0;
        for (double v : expected) {
            peak = Math.max(peak, Math.abs(v));
        }
        double worst = 0;
        int at = -1;
        for (int p = 0; p < expected.length; p++) {
            double d = Math.abs(expected[p] - actual[p]);
            if (d > worst) {
                worst = d;
                at = p;
            }
        }
        assertTrue(worst <= fraction * peak, "pixel " + at + " differs by " + worst / peak
                + " of the peak (allowed " + fraction + "): " + expected[Math.max(at, 0)] + " vs "
                + actual[Math.max(at, 0)]);
    }

    /**
     * A rendering whose arrays cannot fit in the heap is refused with both sizes, before it allocates
     * (a library user saw a bare OutOfMemoryError at -Xmx64m: 200,000 pixels of Lorentzian lines); the
     * estimate holds at least the batch of spread grids the rendering allocates.
     */
    @Test
    void aRenderingTooBigForTheHeapIsRefusedWithItsSize() {
        PixelGrid grid = PixelGrid.linear(380, 900, 200_000);
        int lines = 400;
        double[] position = new double[lines];
        double[] flux = new double[lines];
        double[] gaussian = new double[lines];
        double[] lorentz = new double[lines];
        for (int i = 0; i < lines; i++) {
            position[i] = 381 + 518.0 * i / lines;
            flux[i] = 1;
            gaussian[i] = 0.002 + 0.00001 * i;
            lorentz[i] = 0.001 + 0.00002 * i;
        }
        long[] size = new FastLineRenderer(grid, Instrument.ideal()).size(position, flux, gaussian, lorentz);
        long bytes = FastLineRenderer.bytes(size[0], size[1], grid.pixels());
        assertTrue(bytes >= 8 * size[0] * Math.min(size[1], (1L << 23) / size[0]), bytes + " " + Arrays.toString(size));
        String refusal = FastLineRenderer.tooBig(size[0], size[1], grid.pixels(), 64L << 20);
        assertTrue(refusal != null && refusal.startsWith("the fast renderer would need about ")
                && refusal.contains("internal grid of " + size[0] + " points and " + size[1] + " width pairs")
                && refusal.endsWith("more than the JVM's largest heap of 67 MB (-Xmx): use the exact renderer, or a "
                        + "larger heap"), refusal);
        assertEquals(null, FastLineRenderer.tooBig(size[0], size[1], grid.pixels(), 1L << 36));
    }
}
