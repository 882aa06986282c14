package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;

/**
 * Sweep seed 206 (an invented 4096-pixel spectrometer, 708 to 911 nm, slope change +45 %, mercury
 * and neon): the first solution comes from neon lines at 813 to 886 nm, the last third of the
 * detector. Extrapolated from there to the bright neon lines at 717.39 and 724.52 nm it missed
 * them by 13 and 11 pixels, beyond the fixed 3-pixel window, though its own stated uncertainty
 * there was 10 and 8 pixels; the accepted solution covered 32 % of the detector and was
 * extrapolated over the rest. The refinement's window now widens with the first solution's
 * uncertainty, so both lines pair and the solution covers most of the detector, right to 0.1 pixel
 * against the exposure's truth.
 */
class ExtrapolatedFirstSolutionTest {

    @Test
    void linesWhereTheFirstSolutionIsExtrapolatedArePaired() {
        LampExposures.Exposure exposure = new LampExposures().exposure(206, 0.6);
        Calibration calibration = Calibrator.defaults().calibrate(CalibrationProblem.builder(exposure.counts())
                .lamp(exposure.lamp()).build());
        boolean low = false;
        boolean next = false;
        for (int i = 0; i < calibration.solution().size(); i++) {
            low |= calibration.pairLabel(i).contains("717.39381");
            next |= calibration.pairLabel(i).contains("724.51666");
        }
        assertTrue(low && next, calibration.pairLabels().toString());
        assertTrue(calibration.coverage() > 0.8, "coverage " + calibration.coverage());
        double error = CalibrationSweep.largestError(exposure, calibration.solution(), calibration);
        assertTrue(error < 0.1, "largest error " + error + " pixels");
    }
}
