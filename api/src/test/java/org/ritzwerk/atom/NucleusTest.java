package org.ritzwerk.atom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.constants.PhysicalConstants;

/** The nuclear mass from an atomic mass, against a nucleus whose mass CODATA gives directly. */
class NucleusTest {

    @Test
    void helium4AtomicMassGivesTheAlphaParticleMass() {
        // 4He atomic mass 4.00260325413(16) u (AME2020, M. Wang et al., Chin. Phys. C 45, 030003
        // (2021), as in refdata's isotopes.csv); alpha-particle mass 6.6446573357(20)e-27 kg
        // (CODATA 2018, Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021); the value scipy 1.10.1
        // carries). The electron binding (79.0 eV, fit 75.7 eV) is 2.1e-8 of the mass; the fit's
        // 3.3 eV shortfall leaves 9e-10.
        double alpha = 6.6446573357e-27;
        double mass = Nucleus.nuclearMassKg(2, 4.00260325413);
        assertEquals(alpha, mass, 1.5e-9 * alpha);
        double withoutBinding = 4.00260325413 * PhysicalConstants.ATOMIC_MASS_CONSTANT.value()
                - 2 * PhysicalConstants.ELECTRON_MASS.value();
        assertTrue(Math.abs(withoutBinding - alpha) > 1.5e-8 * alpha, "the binding term must matter here");
    }
}
