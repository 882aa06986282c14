package org.ritzwerk.engine.hydrogenic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.quantity.Unit;

/**
 * Level energies as typed quantities and a line found by its two levels, checked against
 * published hydrogen values and against the line tables the generator already gives.
 */
class TypedLevelsAndLinesTest {

    /** The proton of the other hydrogen tests (CODATA 2018; see Nuclei). */
    private static final HydrogenLikeModel HYDROGEN = HydrogenLikeModel.of(Nuclei.PROTON, Tier.QED);

    @Test
    void levelEnergiesAreTypedAndPositive() {
        // H I ionisation energy 109678.77174307 cm-1 (A. E. Kramida, At. Data Nucl. Data Tables 96,
        // 586 (2010); recalled, and within 1e-9 of the model as PublishedHydrogenTest checks).
        assertEquals(109678.77174307, HYDROGEN.ionisationEnergy(1, 0, 1).toWavenumber().valueIn(Unit.PER_CENTIMETRE),
                1e-9 * 109678.77174307);
        // 2p3/2 at 82259.2850014 cm-1 above 1s (Kramida 2010, as in PublishedHydrogenTest).
        assertEquals(82259.2850014, HYDROGEN.excitationEnergy(2, 1, 3).toWavenumber().valueIn(Unit.PER_CENTIMETRE),
                1e-9 * 82259.2850014);
        assertEquals(0, HYDROGEN.excitationEnergy(1, 0, 1).inJoules(), 0.0);
        // The two add up to the ground level's ionisation energy (identity of the definitions).
        double sum = HYDROGEN.excitationEnergy(3, 2, 5).inJoules() + HYDROGEN.ionisationEnergy(3, 2, 5).inJoules();
        assertEquals(HYDROGEN.ionisationEnergy(1, 0, 1).inJoules(), sum, 1e-15 * sum);
    }

    @Test
    void aLineByItsTwoLevelsIsTheSameRowAsInTheDecayTable() {
        HydrogenLikeLines lines = HydrogenLikeLines.of(HYDROGEN);
        LineTable one = lines.line(3, 2, 5, 2, 1, 3);   // the strongest H-alpha component
        assertEquals(1, one.size());
        LineTable decays = lines.decays(3, 2, 5);
        boolean found = false;
        for (int i = 0; i < decays.size(); i++) {
            if (decays.lowerN(i) == 2 && decays.lowerL(i) == 1 && decays.lowerTwoJ(i) == 3) {
                assertEquals(decays.frequency(i), one.frequency(0), 0.0);
                assertEquals(decays.einsteinA(i), one.einsteinA(0), 0.0);
                assertEquals(decays.oscillatorStrength(i), one.oscillatorStrength(0), 0.0);
                found = true;
            }
        }
        assertTrue(found);
        // A(3d5/2 -> 2p3/2) = 6.4651e7 s^-1 (W. L. Wiese and J. R. Fuhr, J. Phys. Chem. Ref. Data 38,
        // 565 (2009); recalled; the model's exact E1 rates agree with that table to 2e-5, see
        // PublishedHydrogenTest).
        assertEquals(6.4651e7, one.einsteinA(0), 1e-3 * 6.4651e7);
    }

    @Test
    void levelsNotJoinedByALineAreRefusedNamingThem() {
        HydrogenLikeLines lines = HydrogenLikeLines.of(HYDROGEN);
        IllegalArgumentException noE1 = assertThrows(IllegalArgumentException.class, () -> lines.line(3, 2, 5, 2, 0, 1));
        assertTrue(noE1.getMessage().contains("3d 2D5/2") && noE1.getMessage().contains("2s 2S1/2"), noE1.getMessage());
        IllegalArgumentException below = assertThrows(IllegalArgumentException.class, () -> lines.line(2, 1, 3, 3, 2, 5));
        assertTrue(below.getMessage().contains("does not lie above"), below.getMessage());
        assertThrows(IllegalArgumentException.class, () -> lines.line(3, 3, 5, 2, 1, 3));
    }
}
