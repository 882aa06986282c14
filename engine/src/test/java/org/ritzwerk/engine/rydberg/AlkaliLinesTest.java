package org.ritzwerk.engine.rydberg;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;

/** Lines of an alkali atom in a window: selection rules, ordering, and the f-A relation. */
class AlkaliLinesTest {

    @Test
    void theResonanceLinesOfRubidiumAreInTheirWindow() {
        AlkaliAtom rb = TestAtoms.rubidium();
        // 770-800 nm vacuum: the D1 (5p1/2 - 5s1/2) and D2 (5p3/2 - 5s1/2) lines.
        double low = PhysicalConstants.C / 800e-9;
        double high = PhysicalConstants.C / 770e-9;
        double[] seen = new double[1];
        List<AlkaliLines.Line> lines = AlkaliLines.window(rb, low, high, 12, 3, 0, f -> seen[0] = f);
        assertEquals(1.0, seen[0], "progress reaches 1");
        assertTrue(lines.stream().anyMatch(l -> l.label().equals("5p 2P3/2 - 5s 2S1/2")), lines.toString());
        assertTrue(lines.stream().anyMatch(l -> l.label().equals("5p 2P1/2 - 5s 2S1/2")), lines.toString());
        for (int i = 0; i < lines.size(); i++) {
            AlkaliLines.Line l = lines.get(i);
            assertTrue(l.frequency() >= low && l.frequency() <= high);
            assertTrue(AlkaliLines.isElectricDipole(l.upper(), l.lower()));
            assertEquals(rb.frequencyHz(l.lower(), l.upper()), l.frequency(), 0.0);
            if (i > 0) {
                assertTrue(lines.get(i - 1).frequency() >= l.frequency(), "highest frequency first");
            }
            // g_l f = g_u A m_e c eps0 lambda^2 / (2 pi e^2) = g_u A m_e lambda^2 / (4 pi alpha h), the
            // absorption-emission relation (common practice; e.g. Hilborn, Am. J. Phys. 50, 982 (1982)).
            double lambda = l.vacuumWavelengthMetres();
            double expected = (l.upper().twoJ() + 1.0) / (l.lower().twoJ() + 1) * l.einsteinA()
                    * PhysicalConstants.ELECTRON_MASS.value() * lambda * lambda
                    / (4 * Math.PI * PhysicalConstants.FINE_STRUCTURE.value() * PhysicalConstants.H);
            assertEquals(expected, l.oscillatorStrength(), 1e-6 * expected, l.label());
        }
    }

    @Test
    void theLineBetweenTwoStatesTakesTheHigherAsUpper() {
        AlkaliAtom rb = TestAtoms.rubidium();
        State s = State.parse("5s1/2");
        State p = State.parse("5p3/2");
        assertEquals(AlkaliLines.line(rb, p, s), AlkaliLines.between(rb, s, p));
        assertEquals(AlkaliLines.line(rb, p, s), AlkaliLines.between(rb, p, s));
        // 50d5/2 lies above 51p3/2: effective quantum numbers 50 - 1.35 = 48.65 and 51 - 2.64 =
        // 48.36 with the rubidium d and p quantum defects (T. F. Gallagher, Rydberg Atoms
        // (Cambridge, 1994), ch. 2; recalled, from memory; the model's own defects give the order).
        AlkaliLines.Line rydberg = AlkaliLines.between(rb, State.parse("51p3/2"), State.parse("50d5/2"));
        assertEquals(State.parse("50d5/2"), rydberg.upper());
        assertEquals(State.parse("51p3/2"), rydberg.lower());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> AlkaliLines.between(rb, s, State.parse("6s1/2")));
        assertEquals("5s 2S1/2 and 6s 2S1/2 are not joined by an electric-dipole line (needs Delta l = 1, Delta j <= 1)",
                e.getMessage());
    }

    @Test
    void selectionRulesAndBadWindows() {
        assertTrue(AlkaliLines.isElectricDipole(State.parse("5s1/2"), State.parse("5p3/2")));
        assertFalse(AlkaliLines.isElectricDipole(State.parse("5s1/2"), State.parse("6s1/2")));
        assertFalse(AlkaliLines.isElectricDipole(State.parse("5p1/2"), State.parse("4d5/2")), "Delta j = 2");
        assertThrows(IllegalArgumentException.class,
                () -> AlkaliLines.window(TestAtoms.rubidium(), 2e14, 1e14, 10, 3, 0, f -> { }));
        assertThrows(IllegalArgumentException.class,
                () -> AlkaliLines.window(TestAtoms.rubidium(), 1e14, 2e14, 0, 3, 0, f -> { }));
    }
}
