package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.medium.Medium;

/**
 * Peaks put on a wavelength axis: on a straight dispersion lambda = 400 nm + 0.07 nm p the
 * wavelength, its uncertainty and the FWHM follow by hand from first-order propagation (common
 * practice): 0.07 nm per pixel times the pixel values, the solution's own uncertainty added in
 * quadrature.
 */
class CalibratedPeaksTest {

    /** Two invented Gaussian peaks on a flat background, at pixels 200.3 and 401.7. */
    static Peaks peaks() {
        double[] counts = new double[600];
        for (int p = 0; p < counts.length; p++) {
            counts[p] = 100 + 5000 * Math.exp(-0.5 * Math.pow((p - 200.3) / 2.0, 2))
                    + 3000 * Math.exp(-0.5 * Math.pow((p - 401.7) / 3.0, 2));
        }
        return PeakFinder.defaults().find(counts);
    }

    @Test
    void aStraightDispersionScalesPositionsUncertaintiesAndWidths() {
        Peaks peaks = peaks();
        assertEquals(2, peaks.size());
        DispersionSolution line = DispersionSolution.of(0, 1, new double[] {400, 0.07}, null, 0, 599, Medium.air());
        CalibratedPeaks c = CalibratedPeaks.of(peaks, line);
        assertEquals(Medium.air(), c.medium());
        for (int k = 0; k < 2; k++) {
            assertEquals(400 + 0.07 * peaks.centre(k), c.wavelengthsNm()[k], 1e-12);
            // No covariance: only the centre's uncertainty.
            assertEquals(0.07 * peaks.centreSigma(k), c.wavelengthSigmasNm()[k], 1e-15);
            assertEquals(0.07 * peaks.fwhm(k), c.fwhmsNm()[k], 1e-12);
            assertEquals(peaks.flux(k), c.fluxes(0)[k], 0);
            assertEquals(peaks.fluxSigma(k), c.fluxSigmas()[k], 0);
        }
        // A Gaussian of sigma 2 pixels has FWHM 2 sqrt(2 ln 2) 2 = 4.7096 pixels = 0.3297 nm.
        assertEquals(0.07 * 2 * Math.sqrt(2 * Math.log(2)) * 2, c.fwhmsNm()[0], 0.01);
        // The solution's own uncertainty (0.002 nm in a_0, so everywhere) adds in quadrature.
        DispersionSolution uncertain = DispersionSolution.of(0, 1, new double[] {400, 0.07},
                new double[][] {{4e-6, 0}, {0, 0}}, 0, 599, Medium.air());
        CalibratedPeaks u = CalibratedPeaks.of(peaks, uncertain);
        assertEquals(Math.hypot(0.07 * peaks.centreSigma(0), 0.002), u.wavelengthSigmasNm()[0], 1e-15);
        PeakList list = u.toPeakList(1e-9);
        assertEquals(2, list.size());
        // The peak list is in vacuum metres: the air wavelength moved to vacuum is longer.
        assertTrue(list.wavelength(0) > u.wavelengthsNm()[0] * 1e-9);
        // A floor above a flux replaces it; below, the flux stands.
        assertEquals(1e9, c.fluxes(1e9)[0], 0);
        assertEquals(peaks.flux(0), c.fluxes(1)[0], 0);
    }
}
