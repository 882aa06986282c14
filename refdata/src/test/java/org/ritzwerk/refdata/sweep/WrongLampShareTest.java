package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationException;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.medium.Medium;
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
        double[] counts = Scene.builder(PixelGrid.dispersion(c, 3648)).medium(Medium.air())
                .instrument(Instrument.ofResolvingPower(1188.6)).temperature(500).peakCounts(3000)
                .lineList(data.lampLines(Species.parse("Cd I")), data::nucleus)
                .lineList(data.lampLines(Species.parse("Zn I")), data::nucleus)
                .noise(4.63, 8).build().render(1).counts();
        LampSet wrong = LampSet.of(List.of(data.lampLines(Species.parse("Ne I")),
                data.lampLines(Species.parse("Ar I"))), Medium.air());
        for (double share : new double[] {0.6, 0.5, 0.3}) {
            CalibrationException e = assertThrows(CalibrationException.class, () -> Calibrator.defaults()
                    .withMinMatchedFraction(share).calibrate(CalibrationProblem.builder(counts).lamp(wrong).build()),
                    "share " + share);
            assertEquals(CalibrationException.LAMP_MISMATCH, e.code(), e.getMessage());
        }
        LampSet right = LampSet.of(List.of(data.lampLines(Species.parse("Cd I")),
                data.lampLines(Species.parse("Zn I"))), Medium.air());
        Calibration solved = Calibrator.defaults().calibrate(CalibrationProblem.builder(counts).lamp(right).build());
        for (double p = solved.lowestUsedPixel(); p <= solved.highestUsedPixel(); p += 50) {
            double truth = c[0] + c[1] * p + c[2] * p * p;
            double error = Math.abs(solved.solution().wavelengthAt(p) - truth) / (c[1] + 2 * c[2] * p);
            assertTrue(error < 0.1, "error " + error + " px at " + p);
        }
    }
}
