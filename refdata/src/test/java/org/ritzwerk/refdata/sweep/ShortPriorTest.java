package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.CalibrationException;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.LampMatcher;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.refdata.DataContext;

/**
 * A cadmium-zinc exposure on an invented 2048-pixel spectrometer (202.5 + 0.1857 p + 2.44e-5 p^2
 * nm, so 202.5 to 684.9 nm; R = 662) calibrated under a prior that ends too early, at 670 nm.
 * With the degree fixed at 3 a zinc peak was paired with a cadmium line and the solution accepted
 * 4.3 pixels off while stating 0.08 (reduced chi-square 12.7 with 2 degrees of freedom, under the
 * general limit of 25); with the degree fixed at 2 the right solution ran to 684.9 nm, outside the
 * prior, without a word. Now the first fails the lack-of-fit test and the second is refused as
 * outside the prior, naming its range; with a prior that holds it, it is accepted.
 */
class ShortPriorTest {

    @Test
    void aFitOutsideThePriorOrWithoutFitIsRefused() {
        DataContext data = DataContext.builtIn();
        double[] c = {202.499397, 0.1856893055, 2.440705203e-05};
        double[] counts = LampExposures.cadmiumZinc(data, c, 2048, 500, 661.6, 10_000, 6.97, 1);
        LampSet lamp = LampExposures.lamp(data, "Cd I", "Zn I");
        LampMatcher.Prior shortPrior = new LampMatcher.Prior(200, 670, -1000, 1000);
        CalibrationProblem problem = CalibrationProblem.builder(counts).lamp(lamp).prior(shortPrior).build();
        CalibrationException cubic = assertThrows(CalibrationException.class,
                () -> Calibrator.defaults().withDegree(3).calibrate(problem));
        assertEquals(CalibrationException.IMPLAUSIBLE_FIT, cubic.code(), cubic.getMessage());
        CalibrationException quadratic = assertThrows(CalibrationException.class,
                () -> Calibrator.defaults().withDegree(2).calibrate(problem));
        assertEquals(CalibrationException.OUTSIDE_PRIOR, quadratic.code(), quadratic.getMessage());
        assertTrue(quadratic.getMessage().contains("runs from 202.50 to 684.90 nm"), quadratic.getMessage());
        CalibrationProblem wide = CalibrationProblem.builder(counts).lamp(lamp)
                .prior(new LampMatcher.Prior(200, 690, -1000, 1000)).build();
        double error = Math.abs(Calibrator.defaults().withDegree(2).calibrate(wide).solution().wavelengthAt(1000)
                - (c[0] + c[1] * 1000 + c[2] * 1e6)) / (c[1] + 2 * c[2] * 1000);
        assertTrue(error < 0.1, "error " + error + " px");
    }
}
