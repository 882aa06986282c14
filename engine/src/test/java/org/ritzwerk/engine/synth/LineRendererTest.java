package org.ritzwerk.engine.synth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;

import java.util.Arrays;
import org.junit.jupiter.api.Test;

/** Pixel integration against closed forms, flux conservation, the instrument, bad input. */
class LineRendererTest {

    @Test
    void lorentzianPixelsMatchTheArctangentExactly() {
        // The flux of a Lorentzian in [a, b] is (atan((b - c) / g) - atan((a - c) / g)) / pi,
        // g the half width (common practice): every pixel to 1e-10 of the line flux.
        qt().withFixedSeed(21L).withExamples(30)
                .forAll(doubles().between(500, 510), doubles().between(0.001, 0.5), doubles().between(0.001, 0.2))
                .checkAssert((centre, fwhm, pixel) -> {
                    PixelGrid grid = PixelGrid.linear(495, 515, (int) Math.ceil(20 / pixel));
                    double[] out = new double[grid.pixels()];
                    new LineRenderer(grid, Instrument.ideal(), 1e5)
                            .render(new double[] {centre}, new double[] {2.5}, new double[] {0}, new double[] {fwhm}, out);
                    double half = fwhm / 2;
                    for (int p = 0; p < grid.pixels(); p++) {
                        double exact = 2.5 * (Math.atan((grid.edge(p + 1) - centre) / half)
                                - Math.atan((grid.edge(p) - centre) / half)) / Math.PI;
                        assertEquals(exact, out[p], 1e-10 * 2.5, "pixel " + p);
                    }
                });
    }

    @Test
    void gaussianFluxIsConserved() {
        qt().withFixedSeed(22L).withExamples(30)
                .forAll(doubles().between(-3, 3), doubles().between(0.01, 2), doubles().between(0.005, 3))
                .checkAssert((centre, fwhm, pixel) -> {
                    PixelGrid grid = PixelGrid.linear(-20, 20, (int) Math.ceil(40 / pixel));
                    double[] out = new double[grid.pixels()];
                    new LineRenderer(grid, Instrument.ideal(), LineRenderer.DEFAULT_WINDOW)
                            .render(new double[] {centre}, new double[] {7}, new double[] {fwhm}, new double[] {0}, out);
                    assertEquals(7, Arrays.stream(out).sum(), 7e-9);
                });
    }

    @Test
    void voigtFluxIsConservedUpToTheWingsBeyondTheGrid() {
        // Far out (x >> Gaussian width) a Voigt wing is the Lorentzian wing to O((g / x)^2), so
        // the flux inside +-X is 1 - (1 - 2 atan(2X / l) / pi) to better than 1e-9 here.
        qt().withFixedSeed(23L).withExamples(20)
                .forAll(doubles().between(0.05, 1), doubles().between(0.01, 1))
                .checkAssert((g, l) -> {
                    double x = 2000;
                    PixelGrid grid = PixelGrid.linear(-x, x, 40_000);
                    double[] out = new double[grid.pixels()];
                    new LineRenderer(grid, Instrument.ideal(), 1e6)
                            .render(new double[] {0}, new double[] {1}, new double[] {g}, new double[] {l}, out);
                    double inside = 2 / Math.PI * Math.atan(x / (l / 2));
                    assertEquals(inside, Arrays.stream(out).sum(), 1e-6, "g " + g + " l " + l);
                });
    }

    @Test
    void truncationStaysWithinItsStatedBound() {
        qt().withFixedSeed(24L).withExamples(30)
                .forAll(doubles().between(0, 1), doubles().between(0.01, 1), doubles().between(1, 60))
                .checkAssert((g, l, window) -> {
                    PixelGrid grid = PixelGrid.linear(-200, 200, 20_000);
                    double[] out = new double[grid.pixels()];
                    new LineRenderer(grid, Instrument.ideal(), window)
                            .render(new double[] {0}, new double[] {1}, new double[] {g}, new double[] {l}, out);
                    double fwhm = org.ritzwerk.engine.profile.Profiles.voigtFwhm(g, l);
                    double lost = 1 - Arrays.stream(out).sum();
                    assertTrue(lost >= -1e-9 && lost <= LineRenderer.truncationBound(g, l, window * fwhm) + 1e-9,
                            "lost " + lost + " bound " + LineRenderer.truncationBound(g, l, window * fwhm));
                });
    }

    @Test
    void instrumentWidensAnUnresolvedLineIntoItsResponse() {
        // A line with no width of its own takes the instrument's Gaussian: the pixel variance is
        // sigma^2 + h^2 / 12 (Sheppard's correction; common practice).
        double fwhm = 0.8;
        double h = 0.01;
        PixelGrid grid = PixelGrid.linear(-10, 10, 2000);
        double[] out = new double[grid.pixels()];
        new LineRenderer(grid, Instrument.ofFwhm(fwhm), LineRenderer.DEFAULT_WINDOW)
                .render(new double[] {0.123}, new double[] {1}, new double[] {0}, new double[] {0}, out);
        double mean = 0;
        for (int p = 0; p < out.length; p++) {
            mean += out[p] * grid.centre(p);
        }
        double variance = 0;
        for (int p = 0; p < out.length; p++) {
            variance += out[p] * Math.pow(grid.centre(p) - mean, 2);
        }
        double sigma = fwhm / (2 * Math.sqrt(2 * Math.log(2)));
        assertEquals(0.123, mean, 1e-9);
        assertEquals(sigma * sigma + h * h / 12, variance, 1e-9);
        // Resolving power: FWHM = position / R.
        assertEquals(0.5, Instrument.ofResolvingPower(1000).fwhmAt(500), 1e-15);
    }

    @Test
    void refusesUnusableLines() {
        PixelGrid grid = PixelGrid.linear(0, 1, 10);
        LineRenderer renderer = new LineRenderer(grid, Instrument.ideal(), 10);
        double[] out = new double[10];
        assertEquals("line 1: flux must be finite and not negative, got -1.0",
                assertThrows(IllegalArgumentException.class, () -> renderer.render(new double[] {0.5, 0.5},
                        new double[] {1, -1}, new double[] {0.1, 0.1}, new double[] {0, 0}, out)).getMessage());
        assertEquals("line 0: position must be finite, got NaN",
                assertThrows(IllegalArgumentException.class, () -> renderer.render(new double[] {Double.NaN},
                        new double[] {1}, new double[] {0.1}, new double[] {0}, out)).getMessage());
        assertTrue(assertThrows(IllegalArgumentException.class, () -> renderer.render(new double[] {0.5},
                new double[] {1}, new double[] {0}, new double[] {0}, out)).getMessage().startsWith("line 0 has no width"));
        // A refused call draws nothing, not even the good lines before the bad one.
        assertThrows(IllegalArgumentException.class, () -> renderer.render(new double[] {0.5, 0.5},
                new double[] {1, Double.NaN}, new double[] {0.1, 0.1}, new double[] {0, 0}, out));
        assertEquals(0, Arrays.stream(out).sum(), 0);
        assertTrue(assertThrows(IllegalArgumentException.class, () -> renderer.render(new double[] {0.5},
                new double[] {1}, new double[] {0.1}, new double[] {0}, new double[3])).getMessage()
                .contains("one value per pixel (10)"));
    }

    @Test
    void manyThreadsGiveTheSameSpectrumBitForBit() {
        // Lines overlapping each other and the block borders, with Lorentzian wings across the
        // whole grid, so every pixel sums many lines: the order of the sums must not change.
        java.util.SplittableRandom random = new java.util.SplittableRandom(31);
        int lines = 400;
        double[] position = new double[lines];
        double[] flux = new double[lines];
        double[] gauss = new double[lines];
        double[] lorentz = new double[lines];
        for (int i = 0; i < lines; i++) {
            position[i] = 395 + 30 * random.nextDouble();
            flux[i] = random.nextDouble() * 1e3;
            gauss[i] = 0.001 + 0.05 * random.nextDouble();
            lorentz[i] = i % 3 == 0 ? 0 : 0.02 * random.nextDouble();
        }
        PixelGrid grid = PixelGrid.logarithmic(400, 420, 8_011);
        LineRenderer renderer = new LineRenderer(grid, Instrument.ofResolvingPower(20_000), 100);
        double[] single = new double[grid.pixels()];
        renderer.render(position, flux, gauss, lorentz, single);
        for (int threads : new int[] {1, 2, 3, 8}) {
            double[] parallel = new double[grid.pixels()];
            java.util.List<Double> told = new java.util.ArrayList<>();
            renderer.render(position, flux, gauss, lorentz, parallel, threads, told::add);
            assertEquals(1.0, told.get(told.size() - 1));
            assertTrue(told.size() >= 16, "progress told " + told.size() + " times");
            for (int p = 0; p < single.length; p++) {
                assertEquals(Double.doubleToRawLongBits(single[p]), Double.doubleToRawLongBits(parallel[p]),
                        threads + " threads, pixel " + p);
            }
        }
    }

    @Test
    void aRefusedParallelCallLeavesTheOutputAlone() {
        PixelGrid grid = PixelGrid.linear(0, 10, 100);
        double[] out = new double[100];
        LineRenderer renderer = new LineRenderer(grid, Instrument.ideal(), 10);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> renderer.render(
                new double[] {5, 6}, new double[] {1, Double.NaN}, new double[] {0.1, 0.1}, new double[] {0, 0}, out, 2));
        assertTrue(e.getMessage().contains("line 1: flux"), e.getMessage());
        assertTrue(Arrays.stream(out).allMatch(v -> v == 0));
        assertThrows(IllegalArgumentException.class, () -> renderer.render(
                new double[] {5}, new double[] {1}, new double[] {0.1}, new double[] {0}, out, 0));
    }
}
