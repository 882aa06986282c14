package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.refdata.DataContext;

/**
 * Cd 467.8149 and Zn 468.0138 nm, 3.3 pixels apart on an invented 3648-pixel spectrometer
 * (545.70 - 0.0514 p - 3.97e-6 p^2 nm, falling; R = 1739, FWHM 4.4 pixels), make one peak whose
 * profile passes as single. Paired with the zinc line at its statistical uncertainty (0.045 pixel,
 * its centroid 1.25 pixels off), it pulled a fixed cubic 2.2 pixels off, 12 stated standard
 * uncertainties. With the neighbouring line's bound on its centroid the pair weighs as little as
 * it can be trusted, and the solution is right.
 */
class NeighbouringLineTest {

    @Test
    void aPeakHidingTwoLampLinesOfTwoGasesDoesNotPullTheFit() {
        DataContext data = DataContext.builtIn();
        double[] c = {545.7021753, -0.05141008677, -3.967234784e-06};
        double[] counts = LampExposures.cadmiumZinc(data, c, 3648, 500, 1738.8, 3000, 2.98, 44);
        LampSet lamp = LampExposures.lamp(data, "Cd I", "Zn I");
        Calibration cubic = Calibrator.defaults().withDegree(3).calibrate(CalibrationProblem.builder(counts)
                .lamp(lamp).build());
        boolean flagged = false;
        for (int i = 0; i < cubic.solution().size(); i++) {
            flagged |= cubic.pairLabel(i).contains("468.0138") && cubic.blendOffsetBound(i) > 1;
        }
        assertTrue(flagged, "the Zn 468.0138 pair carries the neighbouring Cd line's bound");
        for (double p = cubic.lowestUsedPixel(); p <= cubic.highestUsedPixel(); p += 25) {
            double truth = c[0] + c[1] * p + c[2] * p * p;
            double error = Math.abs(cubic.solution().wavelengthAt(p) - truth);
            assertTrue(error < 3 * cubic.solution().wavelengthSigmaAt(p) && error < 0.1 * Math.abs(c[1]),
                    "pixel " + p + ": error " + error + " nm, stated " + cubic.solution().wavelengthSigmaAt(p));
        }
    }
}
