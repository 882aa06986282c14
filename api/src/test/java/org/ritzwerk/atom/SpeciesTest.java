package org.ritzwerk.atom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;

import org.junit.jupiter.api.Test;

/** Species notation (spectroscopic notation and short forms are common practice). */
class SpeciesTest {

    @Test
    void readsSpectroscopicNotation() {
        assertEquals(new Species(1, 0, 0), Species.parse("H I"));
        assertEquals(new Species(1, 2, 0), Species.parse("D I"));
        assertEquals(new Species(1, 3, 0), Species.parse("T I"));
        assertEquals(new Species(2, 0, 1), Species.parse("He II"));
        assertEquals(new Species(6, 0, 5), Species.parse("C VI"));
        assertEquals(new Species(8, 0, 7), Species.parse("O VIII"));
        assertEquals(new Species(37, 87, 0), Species.parse("Rb-87 I"));
        assertEquals(new Species(92, 238, 91), Species.parse("U-238 XCII"));
        assertEquals(new Species(53, 0, 0), Species.parse("I I"));
    }

    @Test
    void readsShortForms() {
        assertEquals(new Species(1, 0, 0), Species.parse("H"));
        assertEquals(new Species(1, 2, 0), Species.parse("D"));
        assertEquals(new Species(2, 0, 1), Species.parse("He+"));
        assertEquals(new Species(2, 0, 1), Species.parse("He1+"));
        assertEquals(new Species(3, 0, 2), Species.parse("Li++"));
        assertEquals(new Species(6, 0, 5), Species.parse("C5+"));
        assertEquals(new Species(37, 87, 0), Species.parse("87Rb"));
        assertEquals(new Species(26, 56, 25), Species.parse("Fe-56 25+"));
    }

    @Test
    void notationReadsBack() {
        qt().withFixedSeed(118L).forAll(integers().between(1, 118), integers().between(0, 300),
                integers().between(0, 117)).checkAssert((z, k, m) -> {
                    int a = k % 3 == 0 ? 0 : z + k % (Species.MAX_MASS_NUMBER - z + 1);
                    Species species = new Species(z, a, m % z);
                    assertEquals(species, Species.parse(species.notation()), species::notation);
                });
        assertEquals("He II", Species.parse("He+").notation());
        assertEquals("D I", Species.parse("H-2 I").notation());
        assertTrue(Species.parse("C VI").isHydrogenLike());
    }

    @Test
    void refusesUnknownElements() {
        refuses("Xx I", SpeciesParseException.UNKNOWN_ELEMENT, "cannot read species \"Xx I\": unknown element 'Xx'");
        refuses("he II", SpeciesParseException.MALFORMED, "cannot read species \"he II\": expected spectroscopic "
                + "notation such as 'He II' or 'Rb-87 I', or a short form such as 'He+' or 'C5+'");
    }

    @Test
    void refusesImpossibleIsotopes() {
        refuses("C-3 I", SpeciesParseException.IMPOSSIBLE_ISOTOPE,
                "cannot read species \"C-3 I\": mass number 3 is impossible for C (Z = 6): it must be 6 to 300");
        refuses("D-2 I", SpeciesParseException.MALFORMED,
                "cannot read species \"D-2 I\": D already names an isotope; write H-2 or D");
    }

    @Test
    void refusesImpossibleCharges() {
        refuses("H II", SpeciesParseException.IMPOSSIBLE_CHARGE, "cannot read species \"H II\": charge 1 (spectrum II)"
                + " is impossible for H, which has 1 electron: the highest is I");
        refuses("C7+", SpeciesParseException.IMPOSSIBLE_CHARGE, "cannot read species \"C7+\": charge 7 (spectrum VIII)"
                + " is impossible for C, which has 6 electrons: the highest is VI");
        refuses("He IIII", SpeciesParseException.MALFORMED, "cannot read species \"He IIII\": 'IIII' is not a Roman "
                + "numeral in canonical form (I, II, ..., IX, X, ...)");
    }

    private static void refuses(String text, String code, String message) {
        SpeciesParseException e = assertThrows(SpeciesParseException.class, () -> Species.parse(text));
        assertEquals(code, e.code());
        assertEquals(message, e.getMessage());
    }

    /** A null argument names the parameter, as every other refusal names what was wrong. */
    @Test
    void nullArgumentsNameTheParameter() {
        assertEquals("text", assertThrows(NullPointerException.class, () -> Species.parse(null)).getMessage());
        org.ritzwerk.quantity.Wavelength line = org.ritzwerk.quantity.Wavelength.ofNanometres(656.28,
                org.ritzwerk.medium.Medium.air());
        assertEquals("target", assertThrows(NullPointerException.class, () -> line.toWavelength(null)).getMessage());
        assertEquals("medium", assertThrows(NullPointerException.class,
                () -> line.toFrequency().toWavelength(null)).getMessage());
        assertEquals("medium", assertThrows(NullPointerException.class,
                () -> line.toWavenumber().toWavelength(null)).getMessage());
    }
}
