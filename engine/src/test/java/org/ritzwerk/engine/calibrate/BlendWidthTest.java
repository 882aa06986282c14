package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.medium.Medium;

/**
 * The width test for unresolved blends ({@link PeakFlag#WIDE}): a peak wider than the
 * instrument's profile, modelled across the detector from the other peaks, is flagged even when
 * its profile fit passes the chi-square test, and the calibration widens its centroid's
 * uncertainty; single lines are not flagged. All scenes are invented.
 */
class BlendWidthTest {

    /** Sixteen single lines, FWHM 3 pixels, fluxes from S/N about 15 to 300 on a baseline of 400 counts. */
    private static final double[] SINGLE = {40.3, 95.55, 150.81, 207.02, 261.7, 318.45, 371.13, 430.9, 488.2, 547.6,
        602.35, 661.1, 719.8, 771.45, 830.05, 889.7};
    private static final double[] SINGLE_FLUX = {3e3, 1e4, 5e4, 2e3, 2e4, 8e3, 1.5e3, 3e4, 6e3, 4e4, 2.5e3, 1.2e4,
        7e3, 2e4, 4e3, 9e3};
    /** Two equal lines 1.5 pixels (half a FWHM) apart, between single lines. */
    private static final double BLEND_LEFT = 515.2;
    private static final double BLEND_SEPARATION = 1.5;

    private static double[] render(long seed) {
        int pixels = 930;
        int n = SINGLE.length + 2;
        double[] centre = Arrays.copyOf(SINGLE, n);
        double[] flux = Arrays.copyOf(SINGLE_FLUX, n);
        centre[n - 2] = BLEND_LEFT;
        centre[n - 1] = BLEND_LEFT + BLEND_SEPARATION;
        flux[n - 2] = 6e3;
        flux[n - 1] = 6e3;
        double[] widths = new double[n];
        Arrays.fill(widths, 3.0);
        double[] expected = new double[pixels];
        Arrays.fill(expected, 400);
        new LineRenderer(PixelGrid.linear(-0.5, pixels - 0.5, pixels), Instrument.ideal(), 20).render(centre, flux,
                widths, new double[n], expected);
        double[] counts = new double[pixels];
        Noise.apply(expected, 5, seed, counts);
        return counts;
    }

    private static int nearest(Peaks peaks, double pixel) {
        int best = 0;
        for (int k = 1; k < peaks.size(); k++) {
            if (Math.abs(peaks.centre(k) - pixel) < Math.abs(peaks.centre(best) - pixel)) {
                best = k;
            }
        }
        return best;
    }

    @Test
    void aBlendHalfAWidthApartIsFlaggedAndSingleLinesAreNot() {
        int flagged = 0;
        int poorFit = 0;
        int singleFlagged = 0;
        int seeds = 40;
        for (long seed = 1; seed <= seeds; seed++) {
            Peaks peaks = PeakFinder.defaults().find(render(seed));
            assertEquals(SINGLE.length + 1, peaks.size(), "seed " + seed + ": the blend is one peak");
            int blend = nearest(peaks, BLEND_LEFT + BLEND_SEPARATION / 2);
            flagged += peaks.has(blend, PeakFlag.WIDE) ? 1 : 0;
            poorFit += peaks.has(blend, PeakFlag.POOR_FIT) ? 1 : 0;
            for (int k = 0; k < peaks.size(); k++) {
                singleFlagged += k != blend && peaks.has(k, PeakFlag.WIDE) ? 1 : 0;
            }
        }
        // Every seed flags the blend; the chi-square test alone (POOR_FIT) catches it in 2 of the 40.
        assertEquals(seeds, flagged, "blend flagged WIDE");
        assertTrue(poorFit <= 5, poorFit + " of the blends fail the chi-square test");
        // 640 single peaks; at 3 standard uncertainties about 0.8 false flags are expected.
        assertTrue(singleFlagged <= 2, singleFlagged + " single lines flagged WIDE");
    }

    /**
     * A neon exposure (LampScene) with a line that is not in the lamp list 0.2 nm (half the 0.4 nm
     * FWHM) to the red of Ne I 692.94673 nm, at 0.7 of its intensity: one peak whose centroid sits
     * between them, about 0.6 pixel from the neon line. The calibration flags it and gives the
     * pair the blend's offset bound; no other pair gets one unless its fit was poor, and the
     * solution stays within 0.1 pixel of the truth.
     */
    @Test
    void aCalibrationWidensAFlaggedBlend() {
        double[] nm = Arrays.copyOf(LampScene.NEON_NM, LampScene.NEON_NM.length + 1);
        double[] intensity = Arrays.copyOf(LampScene.NEON_INTENSITY, nm.length);
        nm[nm.length - 1] = 692.94673 + 0.2;
        intensity[nm.length - 1] = 700;
        double[] counts = new LampScene(nm, intensity, 40, 7, 0).exposure(3);
        LampSet lamp = LampSet.of(List.of(CalibratorTest.neonList(Medium.air())), Medium.air());
        Calibration calibration = Calibrator.defaults().calibrate(CalibrationProblem.builder(counts).lamp(lamp)
                .build());
        LampMatch match = calibration.match();
        int blended = -1;
        for (int i = 0; i < match.size(); i++) {
            Peaks peaks = calibration.peaks();
            int k = match.peakIndex(i);
            if (Math.abs(match.wavelength(i) - 692.94673) < 1e-6) {
                blended = i;
                assertTrue(peaks.has(k, PeakFlag.WIDE), "flags " + peaks.flags(k));
                assertTrue(calibration.blendOffsetBound(i) > 0.3, "bound " + calibration.blendOffsetBound(i));
                assertTrue(match.pixelSigma(i) > 0.3, "sigma " + match.pixelSigma(i));
            } else if (!peaks.has(k, PeakFlag.POOR_FIT)) {
                assertFalse(peaks.has(k, PeakFlag.WIDE), match.wavelength(i) + " nm flagged " + peaks.flags(k));
                assertEquals(0, calibration.blendOffsetBound(i), match.wavelength(i) + " nm");
            }
        }
        assertTrue(blended >= 0, "692.94673 nm paired");
        DispersionSolution solution = calibration.solution();
        for (int p = (int) calibration.lowestUsedPixel(); p <= calibration.highestUsedPixel(); p += 16) {
            double error = (solution.wavelengthAt(p) - LampScene.truthAt(p)) / LampScene.truthDispersionAt(p);
            assertTrue(Math.abs(error) < 0.1, "error " + error + " px at " + p);
        }
    }
}
