package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationException;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.refdata.DataContext;

/**
 * A cadmium-zinc exposure (an invented 3648-pixel spectrometer, 201.4 + 0.1158 p + 5.5e-6 p^2 nm,
 * R = 1189) calibrated against neon and argon, the wrong gases. With the share lowered to 0.5 a
 * cubic through seven of its peaks met seven Ne/Ar lines within 0.04 pixel and was accepted
 * 3,587 pixels off (Zn 213.86 nm read as Ne 633.44 nm): the chance test counted the pairs beyond
 * three as evidence, while a cubic meets four by itself. Counting beyond the polynomial's free
 * pairs, the wrong lamp is refused at any share; the right lamp still solves it.
 */
class WrongLampShareTest {

    @Test
    void aLoweredShareDoesNotLetTheWrongLampThrough() {
        DataContext data = DataContext.builtIn();
        double[] c = {201.4192528, 0.1157934584, 5.495407762e-06};
        double[] counts = LampExposures.cadmiumZinc(data, c, 3648, 500, 1188.6, 3000, 4.63, 8);
        LampSet wrong = LampExposures.lamp(data, "Ne I", "Ar I");
        for (double share : new double[] {0.6, 0.5, 0.3}) {
            CalibrationException e = assertThrows(CalibrationException.class, () -> Calibrator.defaults()
                    .withMinMatchedFraction(share).calibrate(CalibrationProblem.builder(counts).lamp(wrong).build()),
                    "share " + share);
            assertEquals(CalibrationException.LAMP_MISMATCH, e.code(), e.getMessage());
        }
        LampSet right = LampExposures.lamp(data, "Cd I", "Zn I");
        Calibration solved = Calibrator.defaults().calibrate(CalibrationProblem.builder(counts).lamp(right).build());
        for (double p = solved.lowestUsedPixel(); p <= solved.highestUsedPixel(); p += 50) {
            double truth = c[0] + c[1] * p + c[2] * p * p;
            double error = Math.abs(solved.solution().wavelengthAt(p) - truth) / (c[1] + 2 * c[2] * p);
            assertTrue(error < 0.1, "error " + error + " px at " + p);
        }
    }
}
