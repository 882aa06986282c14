package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Medium;

/**
 * Counts per pixel to a wavelength solution on rendered neon exposures ({@link LampScene}):
 * the solution's accuracy against the known cubic, and whether its stated uncertainties hold.
 */
class CalibrationEndToEndTest {

    private static final LampMatcher.Prior ROUGH = new LampMatcher.Prior(300, 1000, 0.08, 0.3);

    /** RMS over all pixels of (fitted - true wavelength) / true dispersion, in pixels. */
    private static double rmsPixelsFromTruth(DispersionSolution solution) {
        double sum = 0;
        for (int p = 0; p < LampScene.PIXELS; p++) {
            double e = (solution.wavelengthAt(p) - LampScene.truthAt(p)) / LampScene.truthDispersionAt(p);
            sum += e * e;
        }
        return Math.sqrt(sum / LampScene.PIXELS);
    }

    @Test
    void countsToSolutionWithinAFewHundredthsOfAPixel() {
        LampScene scene = new LampScene(40, 7, 8);
        double[] counts = scene.exposure(1);
        // The flow of the package documentation.
        Peaks peaks = PeakFinder.defaults().find(counts);
        LampLines neon = LampLines.of(LampScene.NEON_NM, LampScene.NEON_INTENSITY, null, Medium.air());
        LampMatch match = LampMatcher.defaults().withPrior(ROUGH).match(peaks, neon);
        DispersionSolution solution = match.fit(DispersionFit.automatic(5));

        assertTrue(match.size() >= 40, "pairs " + match.size());
        assertTrue(match.inlierFraction() >= 0.6, "inliers " + match.inlierFraction());
        double rms = rmsPixelsFromTruth(solution);
        assertTrue(rms < 0.05, "RMS from the truth over the detector: " + rms + " px");
        // The unresolved Ne pairs (865.44/865.55 and 867.95/868.19 nm) pull their centroids by
        // tenths of a pixel, far beyond their uncertainties: clipping must take them out.
        assertTrue(solution.rejectedCount() >= 2, "rejected " + solution.rejectedCount());
        for (int i = 0; i < solution.size(); i++) {
            if (Math.abs(solution.wavelength(i) - 868.19211) < 1e-6) {
                assertTrue(solution.isRejected(i), "868.19 nm (blended with 867.95) is rejected");
            }
        }
        assertEquals(Medium.air(), solution.medium());
        double nm = solution.wavelengthAt(1234.5);
        assertEquals(LampScene.truthAt(1234.5), nm, 4 * solution.wavelengthSigmaAt(1234.5));
        assertEquals(1234.5, solution.pixelAt(nm), 1e-8);
    }

    @Test
    void refinementThroughTheIdentifierKeepsOnlyTrueLampLines() {
        // Eight contaminants and the unresolved Ne pairs: the identifier's one-to-one assignment
        // must pair no contaminant and no line with the wrong peak, and the refit stays accurate.
        LampScene scene = new LampScene(40, 7, 8);
        Peaks peaks = PeakFinder.defaults().find(scene.exposure(2));
        LampLines neon = LampLines.of(LampScene.NEON_NM, LampScene.NEON_INTENSITY, null, Medium.air());
        LampMatch first = LampMatcher.defaults().withPrior(ROUGH).match(peaks, neon);
        DispersionFit fit = DispersionFit.automatic(5);
        org.ritzwerk.atom.Species[] species = new org.ritzwerk.atom.Species[neon.size()];
        java.util.Arrays.fill(species, org.ritzwerk.atom.Species.parse("Ne I"));
        LampMatch refined = IdentifierRefinement.refine(first, first.fit(fit), peaks, neon, species, 3);
        // 41 of the 43 lines fall on the detector; the identifier leaves out peaks whose
        // assignment it flags ambiguous (posterior odds under 20:1), as near the unresolved pairs.
        assertTrue(refined.size() >= 39, "pairs " + refined.size());
        for (int i = 0; i < refined.size(); i++) {
            double truePixel = LampScene.truthPixelOf(refined.wavelength(i));
            // A line with another lamp line within the 0.4 nm resolution is an unresolved blend
            // whose centroid is pulled by up to about a pixel; clipping deals with those.
            boolean blended = false;
            for (double other : LampScene.NEON_NM) {
                blended |= other != refined.wavelength(i) && Math.abs(other - refined.wavelength(i)) < 0.45;
            }
            assertTrue(Math.abs(refined.pixel(i) - truePixel) < (blended ? 1.5 : 0.5), "pair " + i + ": peak at "
                    + refined.pixel(i) + " paired with " + refined.wavelength(i) + " nm, which lies at pixel " + truePixel);
        }
        assertTrue(rmsPixelsFromTruth(refined.fit(fit)) < 0.05);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> IdentifierRefinement.refine(first, first.fit(fit), peaks, neon, new org.ritzwerk.atom.Species[2], 3));
        assertTrue(e.getMessage().contains("but 2 species"), e.getMessage());
    }

    @Test
    void statedWavelengthUncertaintiesHoldOverManyExposures() {
        // 50 noise draws of one scene; at 10 pixels across the detector the fraction of
        // |error| / sigma below 2 should be near 0.954 for Gaussian errors with correct sigmas.
        // The errors at the 10 pixels of one exposure are correlated, so the band is wide.
        LampScene scene = new LampScene(40, 7, 8);
        LampLines neon = LampLines.of(LampScene.NEON_NM, LampScene.NEON_INTENSITY, null, Medium.air());
        LampMatcher matcher = LampMatcher.defaults().withPrior(ROUGH);
        int inside = 0;
        int total = 0;
        double worstRms = 0;
        for (long seed = 1000; seed < 1050; seed++) {
            Peaks peaks = PeakFinder.defaults().find(scene.exposure(seed));
            DispersionSolution solution = matcher.match(peaks, neon).fit(DispersionFit.automatic(5));
            for (int p = 200; p < LampScene.PIXELS; p += 400) {
                double z = (solution.wavelengthAt(p) - LampScene.truthAt(p)) / solution.wavelengthSigmaAt(p);
                if (Math.abs(z) < 2) {
                    inside++;
                }
                total++;
            }
            worstRms = Math.max(worstRms, rmsPixelsFromTruth(solution));
        }
        double coverage = (double) inside / total;
        assertTrue(coverage >= 0.9 && coverage <= 0.99, "coverage of 2 sigma: " + coverage);
        assertTrue(worstRms < 0.05, "worst RMS from the truth: " + worstRms + " px");
    }

    @Test
    void saturatedLinesAreFlaggedAndTheSolutionHolds() {
        // Brighter exposure: the strongest lines (heights ~ 5e4 counts) are cut at 2e4.
        LampScene scene = new LampScene(400, 7, 8);
        double level = 20000;
        double[] counts = scene.exposure(5);
        int cut = 0;
        for (int i = 0; i < counts.length; i++) {
            if (counts[i] >= level) {
                counts[i] = level;
                cut++;
            }
        }
        assertTrue(cut > 5, "the scene needs saturated pixels, got " + cut);
        Peaks peaks = PeakFinder.defaults().withSaturationLevel(level).find(counts);
        int saturated = 0;
        for (int k = 0; k < peaks.size(); k++) {
            if (peaks.has(k, PeakFlag.SATURATED)) {
                saturated++;
            }
        }
        assertTrue(saturated >= 2, "saturated peaks " + saturated);
        LampLines neon = LampLines.of(LampScene.NEON_NM, LampScene.NEON_INTENSITY, null, Medium.air());
        DispersionSolution solution = LampMatcher.defaults().withPrior(ROUGH).match(peaks, neon)
                .fit(DispersionFit.ofDegree(3));
        double rms = rmsPixelsFromTruth(solution);
        assertTrue(rms < 0.05, "RMS from the truth: " + rms + " px");
        // The job pairs the saturated peaks, lists them and leaves them out of the fit.
        Calibration calibration = Calibrator.defaults().withSaturationLevel(level).calibrate(
                CalibrationProblem.builder(counts).lamp(LampSet.of(java.util.List.of(CalibratorTest.neonList(Medium.air())),
                        Medium.air())).build());
        LampMatch left = calibration.saturatedPairs();
        assertTrue(left.size() >= 1, "saturated pairs " + left.size());
        for (int i = 0; i < left.size(); i++) {
            assertTrue(calibration.peaks().has(left.peakIndex(i), PeakFlag.SATURATED));
            // Paired within the 3-pixel tolerance, judged against the solution it took no part in.
            assertTrue(Math.abs(calibration.saturatedResidualPixels(i)) < Calibrator.DEFAULT_TOLERANCE,
                    "saturated pair " + i + ": " + calibration.saturatedResidualPixels(i) + " px");
        }
        LampMatch fitted = calibration.match();
        for (int i = 0; i < fitted.size(); i++) {
            assertTrue(!calibration.peaks().has(fitted.peakIndex(i), PeakFlag.SATURATED), "pair " + i + " is saturated");
        }
        assertEquals(fitted.size(), calibration.solution().size());
        assertTrue(rmsPixelsFromTruth(calibration.solution()) < 0.05);
    }

    @Test
    void argonListDoesNotCalibrateANeonLamp() {
        LampScene scene = new LampScene(40, 7, 8);
        Peaks peaks = PeakFinder.defaults().find(scene.exposure(2));
        CalibrationException e = assertThrows(CalibrationException.class,
                () -> LampMatcher.defaults().withPrior(ROUGH).match(peaks, CalibrationLampMatcherTest.ARGON));
        assertEquals(CalibrationException.LAMP_MISMATCH, e.code(), e.getMessage());
    }

    @Test
    void aWrongPriorIsReportedWithTheSolutionOutsideIt() {
        LampScene scene = new LampScene(40, 7, 8);
        Peaks peaks = PeakFinder.defaults().find(scene.exposure(3));
        LampLines neon = LampLines.of(LampScene.NEON_NM, LampScene.NEON_INTENSITY, null, Medium.air());
        LampMatcher red = LampMatcher.defaults().withPrior(new LampMatcher.Prior(600, 1100, 0.05, 0.12));
        CalibrationException e = assertThrows(CalibrationException.class, () -> red.match(peaks, neon));
        assertEquals(CalibrationException.OUTSIDE_PRIOR, e.code(), e.getMessage());
        assertNamesTheTrueRange(e.getMessage());
    }

    /** The message names the solution outside the prior: 460 to 940 nm over the detector. */
    static void assertNamesTheTrueRange(String message) {
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("([0-9.]+) to ([0-9.]+) nm over pixels")
                .matcher(message);
        assertTrue(m.find(), message);
        assertEquals(460, Double.parseDouble(m.group(1)), 0.1, message);
        assertEquals(940, Double.parseDouble(m.group(2)), 0.1, message);
    }

    @Test
    void aDarkFrameHasTooFewPeaks() {
        LampScene scene = new LampScene(0, 7, 0); // baseline and noise only
        Peaks peaks = PeakFinder.defaults().find(scene.exposure(4));
        LampLines neon = LampLines.of(LampScene.NEON_NM, LampScene.NEON_INTENSITY, null, Medium.air());
        CalibrationException e = assertThrows(CalibrationException.class,
                () -> LampMatcher.defaults().match(peaks, neon));
        assertEquals(CalibrationException.TOO_FEW_PEAKS, e.code());
    }
}
