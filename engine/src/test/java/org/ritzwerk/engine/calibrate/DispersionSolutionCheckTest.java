package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.data.DispersionPolynomial;
import org.ritzwerk.medium.Medium;

/** The engine's side of a stored polynomial: evaluation of the api record, and the check across a detector. */
class DispersionSolutionCheckTest {

    private static DispersionSolution stored(double... coefficients) {
        return DispersionSolution.of(new DispersionPolynomial(Medium.air(), 49.5, 49.5, coefficients, null, 0, 99));
    }

    @Test
    void aMonotonicSolutionHasNoDefect() {
        assertTrue(stored(500, 5, 0.5).checkAcross(100, 1e9).isEmpty());
        assertTrue(stored(500, -5).checkAcross(100, 1e9).isEmpty());
    }

    @Test
    void eachDefectIsFoundWhereItIs() {
        // 500 + 5 x + 3 x^2 has its minimum at x = -5/6, pixel 49.5 - 41.25 = 8.25: it turns back at pixel 9.
        DispersionSolution.DetectorDefect turns = stored(500, 5, 3).checkAcross(100, 1e9).orElseThrow();
        assertEquals(DispersionSolution.DetectorDefect.Kind.TURNS_BACK, turns.kind());
        assertEquals(9, turns.pixel());
        DispersionSolution.DetectorDefect negative = stored(10, 50).checkAcross(100, 1e9).orElseThrow();
        assertEquals(DispersionSolution.DetectorDefect.Kind.WAVELENGTH_OUT_OF_RANGE, negative.kind());
        assertEquals(0, negative.pixel());
        assertEquals(-40, negative.wavelengthNm(), 1e-12);
        DispersionSolution.DetectorDefect tooLong = stored(500, 5).checkAcross(100, 502).orElseThrow();
        assertEquals(DispersionSolution.DetectorDefect.Kind.WAVELENGTH_OUT_OF_RANGE, tooLong.kind());
        assertEquals(70, tooLong.pixel()); // 500 + 5 (p - 49.5) / 49.5 reaches 502 nm at p = 69.3
        // A polynomial flat to the last bit: a slope of 1e-300 nm per unit x cannot move 500 nm.
        DispersionSolution.DetectorDefect still = stored(500, 1e-300).checkAcross(100, 1e9).orElseThrow();
        assertEquals(DispersionSolution.DetectorDefect.Kind.STANDS_STILL, still.kind());
        assertEquals(1, still.pixel());
    }

    @Test
    void aSolutionKeepsItsPolynomial() {
        DispersionPolynomial polynomial = new DispersionPolynomial(Medium.vacuum(), 10, 20, new double[] {300, 2, 0.1},
                new double[][] {{1e-6, 0, 0}, {0, 1e-7, 1e-9}, {0, 1e-9, 1e-8}}, -3, 40);
        DispersionSolution solution = DispersionSolution.of(polynomial);
        assertEquals(polynomial, solution.polynomial());
        assertEquals(300 + 2 * 0.5 + 0.1 * 0.25, solution.wavelengthAt(20), 1e-12);
        assertEquals(java.util.Arrays.toString(polynomial.powerCoefficients()),
                java.util.Arrays.toString(solution.powerCoefficients()));
    }

    @Test
    void extrapolationIsToldAndANonPhysicalWavelengthIsRefused() {
        // 500 + 5 x nm with x = (p - 49.5) / 49.5, fitted over pixels 0 to 99.
        DispersionSolution solution = stored(500, 5);
        assertTrue(solution.isWithinFittedRange(0) && solution.isWithinFittedRange(99));
        assertTrue(!solution.isWithinFittedRange(-0.5) && !solution.isWithinFittedRange(1e6)
                && !solution.isWithinFittedRange(Double.NaN));
        // Extrapolated, still a wavelength: 500 + 5 (200 - 49.5) / 49.5 nm, given (not refused).
        assertEquals(500 + 5 * (200 - 49.5) / 49.5, solution.wavelengthAt(200), 1e-12);
        // Far out it falls below 0 (at p = 49.5 - 99 * 49.5): refused, naming the pixel and the range.
        IllegalArgumentException e = org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                () -> solution.wavelengthAt(-1e6));
        assertTrue(e.getMessage().startsWith("pixel -1000000.0: the dispersion solution gives -100515.1"),
                e.getMessage());
        assertTrue(e.getMessage().contains("fitted over pixels 0.0 to 99.0"), e.getMessage());
        assertTrue(Double.isNaN(solution.wavelengthAt(Double.NaN)));
        org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class, () -> solution.pixelAt(-3));
        org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class, () -> solution.pixelAt(0));
        assertEquals(99, solution.pixelAt(505), 1e-9);
    }
}
