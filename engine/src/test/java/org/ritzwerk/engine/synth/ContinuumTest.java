package org.ritzwerk.engine.synth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.constants.PhysicalConstants;

/** Planck's law against the CODATA 2018 Wien and Stefan-Boltzmann constants. */
class ContinuumTest {

    @Test
    void peakFollowsWiensDisplacementLaw() {
        // b = 2.897771955e-3 m K (CODATA 2018, exact given h, c, k).
        for (double t : new double[] {300, 5772, 20_000}) {
            double lo = 0.2e-3 / t;
            double hi = 10e-3 / t;
            for (int k = 0; k < 200; k++) {
                double m1 = lo + (hi - lo) / 3;
                double m2 = hi - (hi - lo) / 3;
                if (Continuum.planckPerWavelength(m1, t) < Continuum.planckPerWavelength(m2, t)) {
                    lo = m1;
                } else {
                    hi = m2;
                }
            }
            assertEquals(2.897771955e-3 / t, lo, 1e-7 * lo, "T " + t);
        }
    }

    @Test
    void pixelsAddUpToStefanBoltzmann() {
        // Integral of B_lambda = sigma T^4 / pi, sigma = 5.670374419e-8 W m^-2 K^-4 (CODATA 2018).
        double t = 6000;
        PixelGrid grid = PixelGrid.logarithmic(20e-9, 2e-3, 20_000);
        double[] out = new double[grid.pixels()];
        Continuum.render(grid, x -> Continuum.planckPerWavelength(x, t), out);
        double total = 0;
        for (double v : out) {
            total += v;
        }
        assertEquals(5.670374419e-8 * Math.pow(t, 4) / Math.PI, total, 1e-8 * total);
    }

    @Test
    void perFrequencyAndPerWavelengthAgree() {
        // B_nu = B_lambda lambda^2 / c (common practice).
        double lambda = 500e-9;
        double nu = PhysicalConstants.C / lambda;
        assertEquals(Continuum.planckPerWavelength(lambda, 4000) * lambda * lambda / PhysicalConstants.C,
                Continuum.planckPerFrequency(nu, 4000), 1e-12 * Continuum.planckPerFrequency(nu, 4000));
    }

    /**
     * The photon form: 3.04745043687602e31 photons s^-1 m^-3 sr^-1 at 500 nm and 5000 K (mpmath
     * 1.3.0 at 30 digits with scipy 1.17.1's h, c, k, exact in the SI), and B lambda / (h c) at any
     * wavelength (common practice).
     */
    @Test
    void thePhotonFormIsTheEnergyFormOverThePhotonEnergy() {
        assertEquals(3.04745043687602e31, Continuum.planckPhotonsPerWavelength(500e-9, 5000), 1e-12 * 3.05e31);
        for (double lambda : new double[] {200e-9, 656e-9, 2e-6}) {
            double photons = Continuum.planckPerWavelength(lambda, 8000) * lambda
                    / (PhysicalConstants.H * PhysicalConstants.C);
            assertEquals(photons, Continuum.planckPhotonsPerWavelength(lambda, 8000), 1e-12 * photons);
        }
    }

    @Test
    void refusesNegativeContinuaAndTemperatures() {
        PixelGrid grid = PixelGrid.linear(0, 1, 4);
        double[] out = new double[4];
        assertTrue(assertThrows(IllegalArgumentException.class,
                () -> Continuum.render(grid, x -> 0.5 - x, out)).getMessage().startsWith("pixel 2:"));
        assertEquals(0, out[0] + out[1], 0, "a refused call adds nothing, not even to the good pixels");
        // The message names the pixel's integral as an integral and the density as the density
        // (a density of -1 over a pixel 0.25 wide integrates to -0.25).
        String negative = assertThrows(IllegalArgumentException.class, () -> Continuum.render(grid, x -> -1, out))
                .getMessage();
        assertTrue(negative.matches("pixel 0: the continuum density integrates to -0\\.2500+\\d* over the pixel, from"
                + " 0\\.0 to 0\\.25 \\(the density at its centre is -1\\.0\\); a density must be finite and not"
                + " negative"), negative);
        assertEquals("temperature must be finite and positive, got 0.0 K",
                assertThrows(IllegalArgumentException.class, () -> Continuum.planckPerWavelength(1e-6, 0)).getMessage());
    }
}
