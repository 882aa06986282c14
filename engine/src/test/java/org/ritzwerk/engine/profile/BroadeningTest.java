package org.ritzwerk.engine.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;

import org.junit.jupiter.api.Test;
import org.ritzwerk.constants.PhysicalConstants;

/** Doppler and natural widths against the usual handbook forms. */
class BroadeningTest {

    private static final double U = PhysicalConstants.ATOMIC_MASS_CONSTANT.value();

    @Test
    void dopplerWidthFollowsTheHandbookCoefficient() {
        // FWHM / nu = 7.162e-7 sqrt(T / A), T in K and A the mass in u: the Doppler width
        // (nu / c) sqrt(8 k T ln 2 / m) (common practice), whose coefficient
        // sqrt(8 k ln 2 / (m_u c^2)) = 7.16233e-7 K^-1/2 follows from CODATA 2018 k, m_u and c
        // (computed with Debian scipy 1.10.1's scipy.constants); four digits are kept.
        qt().withFixedSeed(11L).withExamples(30)
                .forAll(doubles().between(1e13, 3e15), doubles().between(1, 1e6), doubles().between(1, 250))
                .checkAssert((nu, t, a) -> assertEquals(7.162e-7 * Math.sqrt(t / a) * nu,
                        Broadening.dopplerFwhm(nu, t, a * U), 2e-4 * 7.162e-7 * Math.sqrt(t / a) * nu));
    }

    @Test
    void naturalWidthOfLymanAlphaIsAbout100Megahertz() {
        // A(2p -> 1s) = 6.2649e8 s^-1 (Wiese & Fuhr 2009), ground state stable: 99.71 MHz.
        assertEquals(99.71e6, Broadening.naturalFwhm(6.2649e8, 0), 0.01e6);
        // Both levels decaying add their rates (common practice).
        assertEquals((1e8 + 3e7) / (2 * Math.PI), Broadening.naturalFwhm(1e8, 3e7), 1e-6);
    }

    @Test
    void refusesNonPhysicalArguments() {
        assertEquals("temperature must be finite and positive, got -5.0 K",
                assertThrows(IllegalArgumentException.class, () -> Broadening.dopplerFwhm(1e15, -5, U)).getMessage());
        assertEquals("emitter mass must be finite and positive, got NaN kg",
                assertThrows(IllegalArgumentException.class, () -> Broadening.dopplerFwhm(1e15, 300, Double.NaN))
                        .getMessage());
        assertEquals("lower-level decay rate must be finite and not negative, got -1.0 s^-1",
                assertThrows(IllegalArgumentException.class, () -> Broadening.naturalFwhm(1e8, -1)).getMessage());
    }

    @Test
    void aMassInAtomicUnitsIsRefusedWithTheLikelySlip() {
        // 1.00783 (hydrogen's mass in u) given as kg: above 1e-20 kg, far above any atom's.
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Broadening.dopplerFwhm(4.5e14, 5000, 1.00783));
        assertEquals("emitter mass must be 9.1093837015E-31 (an electron) to 1.0E-20 kg (far above any atom), got"
                + " 1.00783 kg; a mass in u? multiply it by the atomic mass constant, 1.6605390666E-27 kg (1.00783 u ="
                + " 1.674e-27 kg)", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Broadening.dopplerFwhm(4.5e14, 5000, 1e-31));
        // An electron and a 300 u atom (the heaviest, common practice) are taken.
        Broadening.dopplerFwhm(4.5e14, 5000, PhysicalConstants.ELECTRON_MASS.value());
        Broadening.dopplerFwhm(4.5e14, 5000, 300 * PhysicalConstants.ATOMIC_MASS_CONSTANT.value());
    }
}
