package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;

/**
 * Sweep seed 94 on the exposures of 2026-12-05 (an invented 1024-pixel spectrometer, 795.9 to
 * 990.0 nm, mercury and krypton): the first solution comes from 9 pairs between pixels 49 and 405,
 * the first 35 % of the detector. Extrapolated from there to Kr 975.176 nm near pixel 933 it is 6.5
 * pixels off, beyond a fixed 3-pixel window, and states 140 pixels there. The refinement's window
 * widens with the first solution's uncertainty, so the line pairs and the solution covers 86 % of
 * the detector, right to 0.1 pixel against the exposure's truth. (Before those exposures the case
 * was seed 206, Hg+Ne, whose neon lines at 717.39 and 724.52 nm were missed by 13 and 11 pixels with
 * the fixed window.)
 */
class ExtrapolatedFirstSolutionTest {

    @Test
    void linesWhereTheFirstSolutionIsExtrapolatedArePaired() {
        LampExposures.Exposure exposure = new LampExposures().exposure(94, 0.6);
        Calibration calibration = Calibrator.defaults().calibrate(CalibrationProblem.builder(exposure.counts())
                .lamp(exposure.lamp()).build());
        double firstHighest = 0;
        for (int i = 0; i < calibration.firstMatch().size(); i++) {
            firstHighest = Math.max(firstHighest, calibration.firstMatch().pixel(i));
        }
        assertTrue(firstHighest < 0.4 * exposure.counts().length, "first solution's lines up to pixel " + firstHighest);
        boolean far = false;
        for (int i = 0; i < calibration.solution().size(); i++) {
            far |= calibration.pairLabel(i).contains("975.1761");
        }
        assertTrue(far, calibration.pairLabels().toString());
        assertTrue(calibration.coverage() > 0.8, "coverage " + calibration.coverage());
        double error = CalibrationSweep.largestError(exposure, calibration.solution(), calibration);
        assertTrue(error < 0.1, "largest error " + error + " pixels");
    }
}
