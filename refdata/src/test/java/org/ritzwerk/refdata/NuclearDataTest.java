package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.data.Isotope;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;

/** The built-in nuclear data against the constants and published values named beside each check. */
class NuclearDataTest {

    private final NuclearData data = NuclearData.builtIn();

    @Test
    void protonAndDeuteronMassesAgreeWithCodata2018() {
        // The nuclear mass from the AME2020 atomic mass minus the electron (and its 13.6 eV
        // binding) must be the CODATA 2018 proton and deuteron masses (Tiesinga et al. 2021),
        // two independent evaluations: agreement to 1e-10 relative.
        Nucleus proton = data.nucleus(Species.parse("H I"));
        assertEquals(PhysicalConstants.PROTON_MASS.value(), proton.massKg(), 1e-10 * proton.massKg());
        Nucleus deuteron = data.nucleus(Species.parse("D I"));
        assertEquals(PhysicalConstants.DEUTERON_MASS.value(), deuteron.massKg(), 1e-10 * deuteron.massKg());
    }

    @Test
    void hydrogenIsotopesCarrySpinMomentAndRadius() {
        Isotope hydrogen = data.isotope(Species.parse("H"));
        assertEquals(1, hydrogen.twiceSpin());
        // CODATA 2018: mu_p / mu_N = 2.79284734463(82), r_p = 0.8414(19) fm.
        assertEquals(2.79284734463, hydrogen.magneticMoment().getAsDouble(), 1e-11);
        assertEquals(0.8414, hydrogen.chargeRadiusFm().getAsDouble(), 1e-4);
        assertEquals(2, data.isotope(Species.parse("D")).twiceSpin());
        assertTrue(hydrogen.source().contains("AME2020"), hydrogen.source());
    }

    @Test
    void aSpeciesWithoutMassNumberMeansTheMostAbundantIsotope() {
        assertEquals(4, data.isotope(Species.parse("He II")).massNumber());
        assertEquals(12, data.isotope(Species.parse("C VI")).massNumber());
        assertEquals(238, data.isotope(Species.parse("U XCII")).massNumber());
        assertEquals(87, data.isotope(Species.parse("Rb-87 I")).massNumber());
    }

    @Test
    void everyRowReadsIntoANucleus() {
        assertTrue(data.isotopes().size() >= 88);
        for (Isotope isotope : data.isotopes()) {
            Nucleus nucleus = isotope.nucleus();
            // Atomic mass to within 0.1 u of the mass number (common practice).
            assertEquals(isotope.massNumber(), isotope.atomicMass(), 0.1, () -> isotope.toString());
            assertTrue(nucleus.twiceSpin() == 0 || isotope.magneticMoment().isPresent(), isotope::toString);
        }
    }

    @Test
    void unknownIsotopesAreRefusedWithTheKnownOnes() {
        ReferenceDataException e = assertThrows(ReferenceDataException.class,
                () -> data.nucleus(Species.parse("Fe-60 I")));
        assertEquals(ReferenceDataException.UNKNOWN_ISOTOPE, e.code());
        assertEquals("no nuclear data for Fe-60; isotopes of Fe in the built-in set: 54, 56, 57, 58", e.getMessage());
        ReferenceDataException none = assertThrows(ReferenceDataException.class,
                () -> data.nucleus(Species.parse("Og I")));
        assertTrue(none.getMessage().endsWith("isotopes of Og in the built-in set: none"), none.getMessage());
    }
}
