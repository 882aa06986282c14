package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Medium;

/**
 * The lack-of-fit test for a solution whose degree the pair count capped: four pairs let AICc try
 * only a straight line, so only the chi-square can tell that the dispersion curves. The pairs
 * below sit on an invented spectrometer's dispersion, lambda(p) = 402 + 0.13 p + c2 p^2 nm, at
 * pixels 20, 540, 600 and 810 with centroid uncertainties of 0.02 pixel (0.05 for the last), each
 * displaced by a fixed fraction of its uncertainty. The chi-square tail is checked against its
 * closed form for two degrees of freedom, exp(-chi^2 / 2) (common practice).
 */
class CappedDegreeTest {

    private static final double[] PIXEL = {20, 540, 600, 810};
    private static final double[] SIGMA_PX = {0.02, 0.02, 0.02, 0.05};
    private static final double[] OFFSET = {0.3, -0.5, 0.4, -0.2};

    private static DispersionSolution straightLineThrough(double c2) {
        double[] nm = new double[PIXEL.length];
        double[] sigmaNm = new double[PIXEL.length];
        for (int i = 0; i < nm.length; i++) {
            double p = PIXEL[i] + OFFSET[i] * SIGMA_PX[i];
            nm[i] = 402 + 0.13 * p + c2 * p * p;
            sigmaNm[i] = 0;
        }
        return DispersionFit.automatic(3).fit(PIXEL, SIGMA_PX, nm, sigmaNm, Medium.air());
    }

    @Test
    void aStraightLineThroughACurvedDispersionIsRefusedWhenNoHigherDegreeCouldBeTried() {
        // c2 = 2e-7 nm/px^2: the chord misses the middle pairs by about 0.1 pixel, five of their
        // uncertainties; the general limit (reduced chi-square 25) does not see it.
        DispersionSolution curved = straightLineThrough(2e-7);
        assertEquals(1, curved.degree());
        assertEquals(2, curved.degreesOfFreedom());
        assertTrue(curved.reducedChiSquare() > 4 && curved.reducedChiSquare() < 25, "" + curved.reducedChiSquare());
        assertTrue(Math.exp(-curved.chiSquare() / 2) < Calibrator.LACK_OF_FIT_PROBABILITY,
                "closed form for 2 degrees of freedom");
        CalibrationException e = assertThrows(CalibrationException.class,
                () -> Calibrator.defaults().checkFitWhereTheDegreeIsCapped("four.csv", curved));
        assertEquals(CalibrationException.IMPLAUSIBLE_FIT, e.code());
        assertTrue(e.getMessage().startsWith("four.csv: the 4 fitted pairs disagree with the degree-1 polynomial"),
                e.getMessage());
        assertTrue(e.getMessage().contains("the automatic choice weighs degree 2 only from 5 pairs (a fixed degree 2"
                + " needs 4)"), e.getMessage());
    }

    /**
     * A straight dispersion passes. A fixed degree with two degrees of freedom is tested too (the
     * general limit of 25 never fires there on evidence), with a message for a fixed degree.
     */
    @Test
    void aStraightDispersionPassesAndAFixedDegreeWithFewDegreesOfFreedomIsTestedToo() {
        DispersionSolution straight = straightLineThrough(0);
        assertTrue(Math.exp(-straight.chiSquare() / 2) > Calibrator.LACK_OF_FIT_PROBABILITY);
        assertDoesNotThrow(() -> Calibrator.defaults().checkFitWhereTheDegreeIsCapped("four.csv", straight));
        assertDoesNotThrow(() -> Calibrator.defaults().withDegree(1).checkFitWhereTheDegreeIsCapped("four.csv",
                straight));
        DispersionSolution curved = straightLineThrough(2e-7);
        CalibrationException e = assertThrows(CalibrationException.class, () -> Calibrator.defaults().withDegree(1)
                .checkFitWhereTheDegreeIsCapped("four.csv", curved));
        assertTrue(e.getMessage().contains("more curved than the fixed degree 1 can follow"), e.getMessage());
    }

    /** An exposure looks clipped when three or more pixels hold exactly its highest count. */
    @Test
    void aClippingLevelIsTakenFromRepeatedMaximaOnly() {
        assertEquals(4095.0, Calibrator.inferredSaturation(new double[] {10, 4095, 4095, 300, 4095, 12}));
        assertTrue(Double.isNaN(Calibrator.inferredSaturation(new double[] {10, 4095, 4095, 300, 4094.5, 12})));
        assertTrue(Double.isNaN(Calibrator.inferredSaturation(new double[] {0, 0, 0, 0})), "all zero: no level");
    }
}
