package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;

/** Peak detection and LM centroids on spectra with known line positions. */
class CalibrationPeakFinderTest {

    /**
     * Renders Gaussian lines on a grid whose pixel i covers [i - 1/2, i + 1/2), so positions are
     * in pixels, on a constant baseline. The renderer integrates each pixel by Gauss-Legendre
     * quadrature to about 1e-10 (its Javadoc): an independent check of the fit's erf model.
     */
    static double[] render(int pixels, double baseline, double[] centre, double[] flux, double fwhm) {
        PixelGrid grid = PixelGrid.linear(-0.5, pixels - 0.5, pixels);
        double[] out = new double[pixels];
        Arrays.fill(out, baseline);
        double[] widths = new double[centre.length];
        Arrays.fill(widths, fwhm);
        new LineRenderer(grid, Instrument.ideal(), 20).render(centre, flux, widths, new double[centre.length], out);
        return out;
    }

    @Test
    void noiselessGaussianCentroidIsExact() {
        for (double centre : new double[] {50, 50.25, 50.5, 50.7317, 37.0901}) {
            double[] counts = render(101, 100, new double[] {centre}, new double[] {1e4}, 3.1);
            Peaks peaks = PeakFinder.defaults().find(counts);
            assertEquals(1, peaks.size(), "one line at " + centre);
            assertEquals(centre, peaks.centre(0), 1e-6, "centroid");
            assertEquals(3.1, peaks.fwhm(0), 1e-5, "FWHM");
            assertEquals(1e4, peaks.flux(0), 1e-5 * 1e4, "flux");
            // Height: the flux in a pixel centred on the line, flux erf(1 / (2 sqrt 2 s)); the value
            // below is that for s = 3.1 / 2.35482 pixels, from the standard normal table.
            double s = 3.1 / (2 * Math.sqrt(2 * Math.log(2)));
            assertEquals(1e4 * (2 * normalCdf(0.5 / s) - 1), peaks.height(0), 1e-3, "height");
            // Exact, but its stated uncertainty is the noise model's (one fit's zero scatter never
            // narrows it): near the Gaussian's standard deviation over the square root of the
            // counts, 1.316 / 100 pixel (common practice), a little more for the pixel sampling.
            assertEquals(s / Math.sqrt(1e4), peaks.centreSigma(0), 0.3 * s / Math.sqrt(1e4), "the model's uncertainty");
            assertTrue(peaks.flags(0).isEmpty(), "no flags: " + peaks.flags(0));
            assertEquals(0, peaks.unfitted().length);
        }
    }

    /** Eight isolated lines of assorted strength per spectrum, at known sub-pixel positions. */
    static final double[] ISOLATED = {40.3, 95.55, 150.81, 207.02, 261.7, 318.45, 371.13, 430.9};
    static final double[] ISOLATED_FLUX = {3e3, 1e4, 5e4, 2e3, 2e4, 8e3, 1.5e3, 3e4};

    @Test
    void centroidUncertaintiesMatchTheScatter() {
        // Over 60 exposures the normalised errors (found - true) / sigma should have unit RMS,
        // whether the pixel variances are modelled or given; a 10 % band allows for the 480
        // samples (RMS known to about 3 %) and the pooled scale's own error.
        double[] expected = render(470, 400, ISOLATED, ISOLATED_FLUX, 3.0);
        double[] sigma = new double[expected.length];
        for (int i = 0; i < sigma.length; i++) {
            sigma[i] = Math.sqrt(expected[i] + 16);
        }
        for (boolean given : new boolean[] {false, true}) {
            double sumSquares = 0;
            double scaleSum = 0;
            int n = 0;
            double[] counts = new double[expected.length];
            for (long seed = 1; seed <= 60; seed++) {
                Noise.apply(expected, 4, seed, counts);
                Peaks peaks = given ? PeakFinder.defaults().find(counts, sigma) : PeakFinder.defaults().find(counts);
                assertEquals(ISOLATED.length, peaks.size(), "seed " + seed);
                assertEquals(given, peaks.pixelSigmasGiven());
                for (int k = 0; k < peaks.size(); k++) {
                    double z = (peaks.centre(k) - ISOLATED[k]) / peaks.centreSigma(k);
                    sumSquares += z * z;
                    n++;
                }
                if (given) {
                    assertEquals(1, peaks.noiseScale());
                }
                scaleSum += peaks.noiseScale();
            }
            double rms = Math.sqrt(sumSquares / n);
            assertTrue(rms > 0.9 && rms < 1.1, (given ? "given" : "modelled") + " sigmas: RMS of z = " + rms);
            // Poisson counts with gain 1: the modelled variances are right on average, so the
            // pooled scale averages near 1 (one spectrum's scatters by some 30 %: 8 fits, and a
            // background noise measured on 400 pixels).
            double meanScale = scaleSum / 60;
            assertTrue(meanScale > 0.85 && meanScale < 1.15, "mean pooled scale " + meanScale);
        }
    }

    /**
     * A photon-counting exposure: no background and no read noise, so most pixels hold no count
     * and the background noise measures zero. The lines' centroids and fluxes still come out right
     * with honest uncertainties (over 60 exposures the normalised errors have unit RMS within 15 %:
     * 0.96 when written; every flux within 5 of its standard uncertainties). The first fit had
     * weighted each empty pixel beside a line as if it were exactly known, and put a faint line
     * pixels off; then the pooled scale, a median of chi-squares made mostly of empty pixels,
     * understated the uncertainties by a third (RMS 1.32) or, over the pixels holding counts only,
     * overstated them by a half (0.65). A counted exposure's variances are its expected counts.
     */
    @Test
    void photonCountingExposuresWithoutBackgroundAreCentredHonestly() {
        double[] flux = new double[ISOLATED_FLUX.length];
        for (int k = 0; k < flux.length; k++) {
            flux[k] = ISOLATED_FLUX[k] / 5;
        }
        double[] expected = render(470, 0, ISOLATED, flux, 2.2);
        double sumSquares = 0;
        int n = 0;
        double[] counts = new double[expected.length];
        for (long seed = 1; seed <= 60; seed++) {
            Noise.apply(expected, 0, seed, counts);
            Peaks peaks = PeakFinder.defaults().find(counts);
            assertEquals(ISOLATED.length, peaks.size(), "seed " + seed);
            assertEquals(1, peaks.noiseScale(), "counted photons need no scale");
            for (int k = 0; k < peaks.size(); k++) {
                double z = (peaks.centre(k) - ISOLATED[k]) / peaks.centreSigma(k);
                sumSquares += z * z;
                n++;
                assertEquals(flux[k], peaks.flux(k), 5 * Math.sqrt(flux[k]), "seed " + seed + ", line " + k);
            }
        }
        double rms = Math.sqrt(sumSquares / n);
        assertTrue(rms > 0.85 && rms < 1.15, "RMS of z = " + rms);
    }

    /**
     * Normalised centroid errors over 60 seeded exposures of the eight isolated lines at a flux
     * of ISOLATED_FLUX / divisor photo-electrons, after Poisson and read noise (counts rounded to
     * whole electrons, optionally clamped at 0, then times the gain); each found peak is compared
     * with the nearest true line. Returns {RMS of z, largest |z|, smallest stated sigma in pixels}.
     */
    private static double[] normalisedErrors(double divisor, double readNoise, boolean clampAtZero, double gain,
            java.util.function.Consumer<Peaks> check) {
        double[] flux = new double[ISOLATED_FLUX.length];
        for (int k = 0; k < flux.length; k++) {
            flux[k] = ISOLATED_FLUX[k] / divisor;
        }
        double[] expected = render(470, 0, ISOLATED, flux, 2.2);
        double[] counts = new double[expected.length];
        double sumSquares = 0;
        double largest = 0;
        double smallestSigma = Double.POSITIVE_INFINITY;
        int n = 0;
        for (long seed = 1; seed <= 60; seed++) {
            Noise.apply(expected, readNoise, seed, counts);
            for (int i = 0; i < counts.length; i++) {
                double electrons = Math.rint(counts[i]);
                counts[i] = gain * (clampAtZero ? Math.max(0, electrons) : electrons);
            }
            Peaks peaks = PeakFinder.defaults().withNegativeCountsAllowed(true).find(counts);
            check.accept(peaks);
            for (int k = 0; k < peaks.size(); k++) {
                int nearest = 0;
                for (int j = 1; j < ISOLATED.length; j++) {
                    if (Math.abs(ISOLATED[j] - peaks.centre(k)) < Math.abs(ISOLATED[nearest] - peaks.centre(k))) {
                        nearest = j;
                    }
                }
                double sigma = peaks.centreSigma(k);
                assertTrue(sigma > 0 && Double.isFinite(sigma), "seed " + seed + ": sigma " + sigma);
                double z = (peaks.centre(k) - ISOLATED[nearest]) / sigma;
                sumSquares += z * z;
                largest = Math.max(largest, Math.abs(z));
                smallestSigma = Math.min(smallestSigma, sigma);
                n++;
            }
        }
        assertTrue(n > 200, "peaks found: " + n);
        return new double[] {Math.sqrt(sumSquares / n), largest, smallestSigma};
    }

    /**
     * Faint counted lines (10 to 167 photons): a free width could collapse onto two pixels' counts,
     * its centre on their boundary with a near-zero uncertainty (largest |z| 11.7, RMS 1.33 before
     * the width floor). A line's centroid cannot be known better than its width over the square
     * root of its photons, here at least 0.93 / sqrt(167) = 0.07 pixel (common practice); 0.05 is
     * asked. Over 480 normal variates |z| above 4.5 has probability 0.003 (normal tail).
     */
    @Test
    void faintCountedLinesKeepAPlausibleWidthAndUncertainty() {
        double[] r = normalisedErrors(300, 0, false, 1, peaks -> assertTrue(peaks.countedPhotons()));
        assertTrue(r[0] > 0.85 && r[0] < 1.15, "RMS of z = " + r[0]);
        assertTrue(r[1] < 4.5, "largest |z| = " + r[1]);
        assertTrue(r[2] > 0.05, "smallest centroid sigma " + r[2] + " pixel");
    }

    /**
     * Photons counted at 16 counts each (a gain; no background, no read noise): taken as gain 1
     * the variances were 16 times too small (RMS of z 2.5, largest 23). The counts' common step
     * is the gain.
     */
    @Test
    void countsSharingAStepAreThatManyCountsPerPhoton() {
        double[] r = normalisedErrors(50, 0, false, 16, peaks -> {
            assertTrue(peaks.countedPhotons());
            assertEquals(16, peaks.countsPerPhoton(), "the counts' common step");
        });
        assertTrue(r[0] > 0.85 && r[0] < 1.15, "RMS of z = " + r[0]);
        assertTrue(r[1] < 4.5, "largest |z| = " + r[1]);
    }

    /**
     * Dark-subtracted counts with negatives set to 0 (read noise 4 electrons, gain 2: about 60 % of
     * the background pixels at 0): the MAD of the background is then 0. Before, the noise came out
     * near 1e-9 counts, fits returned NaN uncertainties (a calibration crashed on them) and the
     * normalised errors had an RMS of 2.6. The censored estimate finds the read noise, 8 counts:
     * on average over the 60 exposures within 5 %, each within 40 % (a quantile estimate from some
     * 350 background pixels half of them clamped, on a lattice of 2 counts, scatters by 10 %: a
     * simulation of such samples, so 40 % is 4 of its standard deviations).
     */
    @Test
    void clampedCountsGiveTheirNoiseAndFiniteUncertainties() {
        double[] noiseSum = new double[1];
        double[] r = normalisedErrors(10, 4, true, 2, peaks -> {
            assertEquals(0, peaks.clampLevel(), "clamped at 0");
            assertTrue(peaks.clampedShare() > 0.4 && peaks.clampedShare() < 0.7, "share " + peaks.clampedShare());
            assertEquals(2, peaks.countsPerPhoton(), "the counts' common step");
            assertEquals(8, peaks.noise()[235], 0.4 * 8, "background noise in counts");
            noiseSum[0] += peaks.noise()[235];
        });
        assertEquals(8, noiseSum[0] / 60, 0.05 * 8, "mean background noise in counts");
        assertTrue(r[0] > 0.85 && r[0] < 1.15, "RMS of z = " + r[0]);
        assertTrue(r[1] < 4.5, "largest |z| = " + r[1]);
    }

    @Test
    void closePeaksAreFittedTogether() {
        // Two lines 4 px apart with FWHM 3 px: resolved maxima, overlapping wings.
        double[] truth = {100.2, 104.35};
        double[] expected = render(200, 200, truth, new double[] {2e4, 8e3}, 3.0);
        double[] counts = new double[expected.length];
        Noise.apply(expected, 3, 11, counts);
        Peaks peaks = PeakFinder.defaults().find(counts);
        assertEquals(2, peaks.size());
        for (int k = 0; k < 2; k++) {
            assertTrue(peaks.has(k, PeakFlag.BLENDED), "peak " + k + " flagged blended");
            double z = (peaks.centre(k) - truth[k]) / peaks.centreSigma(k);
            assertTrue(Math.abs(z) < 4, "peak " + k + ": " + peaks.centre(k) + " +- " + peaks.centreSigma(k));
            assertEquals(3.0, peaks.fwhm(k), 0.15);
        }
        assertEquals(2e4, peaks.flux(0), 4 * peaks.fluxSigma(0));
        assertEquals(8e3, peaks.flux(1), 4 * peaks.fluxSigma(1));
    }

    @Test
    void saturatedPeakIsFlaggedAndCentredFromItsWings() {
        double truth = 80.37;
        double[] counts = render(160, 300, new double[] {truth, 30.4}, new double[] {3e5, 2e4}, 3.4);
        double level = 30000; // the strong line peaks near 8e4 counts: its top 3 pixels are cut
        int cut = 0;
        for (int i = 0; i < counts.length; i++) {
            if (counts[i] >= level) {
                counts[i] = level;
                cut++;
            }
        }
        assertTrue(cut >= 2, "the test needs a saturated top, got " + cut + " pixels");
        Peaks peaks = PeakFinder.defaults().withSaturationLevel(level).find(counts);
        assertEquals(2, peaks.size());
        assertFalse(peaks.has(0, PeakFlag.SATURATED));
        assertTrue(peaks.has(1, PeakFlag.SATURATED));
        assertEquals(truth, peaks.centre(1), 1e-6, "the wings fix a noiseless centroid");
        assertEquals(3e5, peaks.flux(1), 1e-3 * 3e5, "and the flux");
    }

    @Test
    void pureNoiseHasNoPeaks() {
        double[] expected = new double[4096];
        Arrays.fill(expected, 500);
        double[] counts = new double[expected.length];
        Noise.apply(expected, 5, 99, counts);
        Peaks peaks = PeakFinder.defaults().find(counts);
        assertEquals(0, peaks.size(), "a 5-sigma threshold lets no noise through in 4096 pixels");
        double noise = peaks.noise()[2000];
        assertEquals(Math.sqrt(525), noise, 0.1 * Math.sqrt(525), "background noise");
    }

    @Test
    void thresholdDecidesWhichLinesCount() {
        // Heights of about 3 and 12 background sigmas: only the second passes a threshold of 5.
        double[] expected = render(300, 400, new double[] {100, 200}, new double[] {220, 880}, 3.0);
        double[] counts = new double[expected.length];
        Noise.apply(expected, 0, 5, counts);
        Peaks peaks = PeakFinder.defaults().find(counts);
        assertEquals(1, peaks.size());
        assertEquals(200, peaks.centre(0), 5 * peaks.centreSigma(0));
        assertTrue(peaks.signalToNoise(0) > 5);
        Peaks lower = PeakFinder.defaults().withThreshold(1.5).find(counts);
        assertTrue(lower.size() >= 2, "a lower threshold finds the weak line too");
    }

    @Test
    void badInputsAreNamed() {
        PeakFinder finder = PeakFinder.defaults();
        assertUnusable("the spectrum is empty", () -> finder.find(new double[0]));
        assertUnusable("at least 8 pixels", () -> finder.find(new double[5]));
        double[] counts = render(64, 100, new double[] {30}, new double[] {1e3}, 3);
        double[] nan = counts.clone();
        nan[17] = Double.NaN;
        assertUnusable("pixel 17: counts must be finite", () -> finder.find(nan));
        double[] negative = counts.clone();
        negative[3] = -2;
        assertUnusable("pixel 3: counts must not be negative", () -> finder.find(negative));
        assertEquals(1, finder.withNegativeCountsAllowed(true).find(negative).size(), "allowed when asked");
        double[] constant = new double[64];
        Arrays.fill(constant, 7);
        assertUnusable("the spectrum is constant (all 64 pixels are 7.0 counts)", () -> finder.find(constant));
        assertUnusable("all 64 pixels are saturated (at or above 50.0 counts)",
                () -> finder.withSaturationLevel(50).find(counts));
        assertMessage("one value per pixel (64), got 3", () -> finder.find(counts, new double[3]));
        double[] sigma = new double[64];
        Arrays.fill(sigma, 1);
        sigma[5] = 0;
        assertUnusable("pixel 5: uncertainty must be finite and positive", () -> finder.find(counts, sigma));
        assertMessage("threshold must be", () -> finder.withThreshold(Double.NaN));
        assertMessage("baseline window must be at least 5", () -> finder.withBaselineWindow(4));
    }

    /** The standard normal distribution function, by the erf series of Abramowitz and Stegun 7.1.5 (to 1e-15 here). */
    static double normalCdf(double x) {
        double z = x / Math.sqrt(2);
        double term = z;
        double sum = z;
        for (int k = 1; k < 60; k++) {
            term *= -z * z / k;
            sum += term / (2 * k + 1);
        }
        return 0.5 + sum / Math.sqrt(Math.PI);
    }

    /** Counts that hold nothing to search are bad input (a CalibrationException with its code), not a broken precondition. */
    static void assertUnusable(String fragment, org.junit.jupiter.api.function.Executable call) {
        CalibrationException e = assertThrows(CalibrationException.class, call);
        assertEquals(CalibrationException.UNUSABLE_COUNTS, e.code());
        assertTrue(e.getMessage().contains(fragment), "message '" + e.getMessage() + "' lacks '" + fragment + "'");
    }

    static void assertMessage(String fragment, org.junit.jupiter.api.function.Executable call) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call);
        assertTrue(e.getMessage().contains(fragment), "message '" + e.getMessage() + "' lacks '" + fragment + "'");
    }
}
