package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Isotope;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.refdata.internal.NuclearProvider;

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

    @Test
    void everyNuclearFileCarriesTheStandardHeaderKeys() throws IOException {
        DataSetInfo isotopes = data.info();
        assertEquals(NuclearData.DATA_SET_ID, isotopes.id());
        assertEquals(Provenance.Kind.PUBLISHED, isotopes.provenance().kind());
        assertTrue(isotopes.provenance().detail().startsWith("M. Wang et al., Chin. Phys. C 45, 030003 (2021)"),
                isotopes.provenance().detail());
        assertTrue(isotopes.title().contains(data.isotopes().size() + " isotopes"), isotopes.title());
        assertEquals(isotopes, data.table().info());
        assertEquals(List.of(isotopes), new NuclearProvider().dataSets());
        DataSetInfo defaults = data.defaultsInfo();
        assertEquals(NuclearData.DEFAULTS_ID, defaults.id());
        assertEquals(Provenance.Kind.FROM_MEMORY, defaults.provenance().kind());
        assertTrue(defaults.provenance().detail().contains("Pure Appl. Chem. 88, 293 (2016)"),
                defaults.provenance().detail());
        // elements.csv is not read by the library; its header must still be sound.
        try (BufferedReader reader = new BufferedReader(new InputStreamReader(
                NuclearData.class.getResourceAsStream("nuclear/elements.csv"), StandardCharsets.UTF_8))) {
            List<NuclearData.Row> rows = new ArrayList<>();
            DataSetInfo elements = NuclearData.read(reader, "nuclear/elements.csv", "nuclear-elements", rows);
            assertEquals(118, rows.size());
            assertEquals(Provenance.Kind.PUBLISHED, elements.provenance().kind());
        }
    }

    @Test
    void aNuclearFileWithABadHeaderIsRefusedWithFileAndLine() {
        String good = "# id: nuclear-x\n# title: t\n# source: s\n# provenance: published\n# version: 1\nz,a\n1,1\n";
        refused(good.replace("# source: s\n", ""), "x.csv:1: required header '# source: ...' is missing or empty");
        refused(good.replace("# version: 1", "# version: "), "x.csv:1: required header '# version: ...' is missing");
        refused(good.replace("nuclear-x", "nuclear-y"), "x.csv:1: header id 'nuclear-y', expected 'nuclear-x'");
        refused(good.replace("published", "copied"), "x.csv:1: unknown provenance 'copied'");
        refused(good + "# title: again\n", "x.csv:8: header key after the data");
        refused(good.replace("# version: 1\n", "# version: 1\n# title: twice\n"),
                "x.csv:6: header key 'title' is given twice");
    }

    private static void refused(String text, String start) {
        ReferenceDataException e = assertThrows(ReferenceDataException.class, () -> NuclearData.read(
                new BufferedReader(new StringReader(text)), "x.csv", "nuclear-x", new ArrayList<>()));
        assertEquals(ReferenceDataException.BAD_BUILT_IN, e.code());
        assertTrue(e.getMessage().startsWith(start), e.getMessage());
    }
}
