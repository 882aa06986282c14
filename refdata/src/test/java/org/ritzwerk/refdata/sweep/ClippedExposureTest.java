package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationException;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.refdata.DataContext;

/**
 * Cadmium-zinc exposures on an invented 3648-pixel spectrometer (300 + 0.11 p - 2e-6 p^2 nm,
 * R = 4000, 200,000 counts at the brightest pixel), cut at 65535 as a 16-bit converter cuts them,
 * calibrated without a saturation level: the flat tops' centroids were taken at face value, and
 * all 12 seeds were accepted 1.3 to 1.4 pixels off at 8 to 11 stated standard uncertainties.
 * The exposure now shows its own clipping level (several pixels hold exactly its highest count),
 * which is taken as the saturation level: every seed is solved honestly or refused.
 */
class ClippedExposureTest {

    @Test
    void aClippedExposureIsTakenAsSaturatedAtItsClippingLevel() {
        DataContext data = DataContext.builtIn();
        double[] c = {300, 0.11, -2e-6};
        LampSet lamp = LampExposures.lamp(data, "Cd I", "Zn I");
        int solved = 0;
        for (long seed = 1; seed <= 6; seed++) {
            double[] counts = LampExposures.cadmiumZinc(data, c, 3648, 400, 4000, 200_000, 5, seed);
            for (int i = 0; i < counts.length; i++) {
                counts[i] = Math.min(counts[i], 65535);
            }
            Calibration calibration;
            try {
                calibration = Calibrator.defaults().calibrate(CalibrationProblem.builder(counts).lamp(lamp).build());
            } catch (CalibrationException refused) {
                continue;
            }
            assertEquals(65535, calibration.inferredSaturationLevel(), "seed " + seed);
            for (double p = calibration.lowestUsedPixel(); p <= calibration.highestUsedPixel(); p += 25) {
                double truth = c[0] + c[1] * p + c[2] * p * p;
                double error = Math.abs(calibration.solution().wavelengthAt(p) - truth);
                assertTrue(error < 3 * calibration.solution().wavelengthSigmaAt(p), "seed " + seed + " pixel " + p
                        + ": error " + error + " nm, stated " + calibration.solution().wavelengthSigmaAt(p));
            }
            solved++;
        }
        assertTrue(solved >= 4, solved + " of 6 solved");
    }
}
