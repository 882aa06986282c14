package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Medium;

/**
 * CalibratedPeaks as the one place where peak pixels become wavelengths: its dispersions, and the
 * identifier refinement of a calibration pairing peaks where it puts them.
 */
class CalibratedPeaksDispersionTest {

    private static Peaks peaks() {
        return CalibratedPeaksTest.peaks();
    }

    @Test
    void dispersionsAreTheSlopeAtEachPeak() {
        Peaks peaks = peaks();
        // lambda = 400 + 0.07 p - 2e-5 p^2 nm: slope 0.07 - 4e-5 p nm per pixel.
        DispersionSolution curved = DispersionSolution.of(0, 1, new double[] {400, 0.07, -2e-5}, null, 0, 599,
                Medium.vacuum());
        CalibratedPeaks c = CalibratedPeaks.of(peaks, curved);
        for (int k = 0; k < 2; k++) {
            assertEquals(0.07 - 4e-5 * peaks.centre(k), c.dispersionsNmPerPixel()[k], 1e-15);
            assertEquals(Math.abs(c.dispersionsNmPerPixel()[k]) * peaks.centreSigma(k), c.wavelengthSigmasNm()[k], 1e-15);
        }
    }

    @Test
    void refinementPairsPeaksWhereCalibratedPeaksPutThem() {
        // The refinement's peak wavelengths are CalibratedPeaks': each pair's line lies within the
        // tolerance (3 pixels at the widest dispersion) of its peak's calibrated wavelength.
        LampScene scene = new LampScene(40, 7, 8);
        Peaks peaks = PeakFinder.defaults().find(scene.exposure(2));
        LampLines neon = LampLines.of(LampScene.NEON_NM, LampScene.NEON_INTENSITY, null, Medium.air());
        LampMatch first = LampMatcher.defaults().withPrior(new LampMatcher.Prior(300, 1000, 0.08, 0.3)).match(peaks, neon);
        DispersionSolution solution = first.fit(DispersionFit.automatic(5));
        org.ritzwerk.atom.Species[] species = new org.ritzwerk.atom.Species[neon.size()];
        java.util.Arrays.fill(species, org.ritzwerk.atom.Species.parse("Ne I"));
        LampMatch refined = IdentifierRefinement.refine(first, solution, peaks, neon, species, 3);
        CalibratedPeaks calibrated = CalibratedPeaks.of(peaks, solution);
        double widest = 0;
        for (double slope : calibrated.dispersionsNmPerPixel()) {
            widest = Math.max(widest, Math.abs(slope));
        }
        assertTrue(refined.size() >= 39, "pairs " + refined.size());
        for (int i = 0; i < refined.size(); i++) {
            double peakNm = calibrated.wavelengthsNm()[refined.peakIndex(i)];
            assertTrue(Math.abs(peakNm - refined.wavelength(i)) < 3 * widest, "pair " + i + ": peak at " + peakNm
                    + " nm, line " + refined.wavelength(i) + " nm");
        }
    }
}
