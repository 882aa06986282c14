package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.internal.RydbergData;

/**
 * The built-in ionisation limits, per isotope, against their publications, and the file keys that
 * keep a limit in its publication's unit and digits ({@code limit}, {@code limit-from}). The
 * limits are above the hyperfine centroid of the ground level.
 */
class IonisationLimitsTest {

    private static final RydbergData DATA = RydbergData.builtIn();
    private static final double HZ_PER_CM = PhysicalConstants.C * 100;

    private static AlkaliAtom atom(String species) {
        return DATA.atom(Species.parse(species));
    }

    @Test
    void publishedLimitsAreReadWithTheirOwnDigits() {
        // J. Deiglmayr et al., Phys. Rev. A 93, 013424 (2016): 31 406.467 732 5(14) cm-1 (read in the paper)
        assertEquals(31406.4677325, atom("Cs-133 I").ionisationLimitPerCm(), 0.0);
        // M. Peper et al., Phys. Rev. A 100, 012501 (2019): 35 009.813 971 0(22) cm-1 (read in its abstract);
        // the limit used before, 35 009.813 937 5 (a weighted average of Lorenzen and Niemax 1983's series
        // limits, from memory), is 1.0 MHz lower and fails here
        assertEquals(35009.8139710, atom("K-39 I").ionisationLimitPerCm(), 0.0);
        // NIST ASD ionisation energy of Na I, 41 449.451 cm-1 (from memory; checked: it is the 0.011 cm-1 = 330
        // MHz above the earlier 41 449.44 by which issue 17 found the latter low); the old value fails here
        assertEquals(41449.451, atom("Na-23 I").ionisationLimitPerCm(), 0.0);
        // W. Li et al., Phys. Rev. A 67, 052502 (2003): 33 690.798 90 cm-1 (from memory, unchanged)
        assertEquals(33690.79890, atom("Rb-85 I").ionisationLimitPerCm(), 0.0);
        // C.-J. Lorenzen and K. Niemax, Phys. Scr. 27, 300 (1983): 43 487.15 cm-1 (from memory, unchanged)
        assertEquals(43487.15, atom("Li-7 I").ionisationLimitPerCm(), 0.0);
    }

    @Test
    void rubidium87IsReadInGigahertzFromTheGroundLevelF1() {
        // M. Mack et al., Phys. Rev. A 83, 052515 (2011): 1 010 029.1646(3) GHz from 5S1/2 F = 1 (from memory),
        // which lies 5/8 of the ground splitting 6 834.682 610 904 MHz below the centroid (S. Bize et al.,
        // Europhys. Lett. 45, 558 (1999), from memory): back from the centroid to F = 1, the published digits
        // return to a few kHz (the double's resolution at 1e15 Hz is 0.1 Hz).
        double fromF1Hz = atom("Rb-87 I").ionisationLimitPerCm() * HZ_PER_CM + 5.0 / 8 * 6834.682610904e6;
        assertEquals(1010029.1646e9, fromF1Hz, 1e3);
        // the two Rb isotopes now have limits of their own: 87 lies 0.0050 cm-1 (150 MHz) above 85, close to the
        // normal mass shift's 0.0050 cm-1 (R_M ratio)
        double shift = atom("Rb-87 I").ionisationLimitPerCm() - atom("Rb-85 I").ionisationLimitPerCm();
        double normal = 33690.79890 * (DATA.atom(Species.parse("Rb-87 I")).rydbergPerCm()
                / DATA.atom(Species.parse("Rb-85 I")).rydbergPerCm() - 1);
        assertEquals(normal, shift, 0.002);
    }

    @Test
    void isotopesWithoutAPublishedLimitTakeTheirPartnersWithTheNormalMassShift() {
        // Li-6 from Li-7, K-40 and K-41 from K-39: L = L(partner) R_M / R_M(partner) (common practice); K-40
        // lies 370 MHz, K-41 721 MHz above K-39, Li-6 17.0 GHz below Li-7
        String[][] pairs = {{"Li-6 I", "Li-7 I"}, {"K-40 I", "K-39 I"}, {"K-41 I", "K-39 I"}};
        double[] expectedMHz = {-16963.0, 369.9, 720.8};
        for (int i = 0; i < pairs.length; i++) {
            AlkaliAtom isotope = atom(pairs[i][0]);
            AlkaliAtom partner = atom(pairs[i][1]);
            double ratio = isotope.rydbergPerCm() / partner.rydbergPerCm();
            assertEquals(partner.ionisationLimitPerCm() * ratio, isotope.ionisationLimitPerCm(), 1e-9, pairs[i][0]);
            assertEquals(expectedMHz[i], (isotope.ionisationLimitPerCm() - partner.ionisationLimitPerCm()) * HZ_PER_CM
                    / 1e6, 0.1, pairs[i][0]);
            // its Rydberg levels use its own limit and R_M: with the shared quantum defects every formula level,
            // and every measured level but the resonance ones (its own D lines), is the partner's times the ratio
            // (the measured ones to the half unit of the three decimals added in the file, 5e-6 cm-1 for Li)
            for (State s : new State[] {State.of(60, 0, 1), State.of(45, 1, 3), State.of(30, 2, 5), State.of(20, 3, 7),
                State.of(isotope.groundState().n() + 1, 0, 1)}) {
                assertEquals(partner.energyPerCm(s) * ratio, isotope.energyPerCm(s), 5.1e-6, pairs[i][0] + " " + s);
            }
        }
    }

    private static final String HEAD = "# ritzwerk-quantum-defects 1\n# id: qd-test\n# title: t\n# species: Rb-87 I\n"
            + "# source: s\n# provenance: from-memory\n# version: 1\n# limit-provenance: from-memory\n"
            + "# limit-source: s\n";
    private static final String ROWS = String.join(",", QuantumDefectFiles.COLUMNS) + "\n"
            + "0,1/2,3.1311807,0.1787,0,0,0,10,from-memory,s,c\n";

    private static QuantumDefectFiles.Content read(String limitLines) {
        return QuantumDefectFiles.read(new ByteArrayInputStream((HEAD + limitLines + ROWS)
                .getBytes(StandardCharsets.UTF_8)), "qd-test.csv");
    }

    @Test
    void aLimitInItsOwnUnitIsConvertedExactly() {
        assertEquals(33690.9, read("# limit-per-cm: 33690.9\n").defects().limitPerCm(), 0.0);
        assertEquals(33690.9, read("# limit: 33690.9 cm-1\n").defects().limitPerCm(), 0.0);
        assertEquals(1010029.1646e9 / HZ_PER_CM, read("# limit: 1010029.1646 GHz\n").defects().limitPerCm(), 0.0);
        assertEquals(1010029164.6e6 / HZ_PER_CM, read("# limit: 1010029164.6 MHz\n").defects().limitPerCm(), 1e-9);
        assertEquals(1010.0291646e12 / HZ_PER_CM, read("# limit: 1010.0291646 THz\n").defects().limitPerCm(), 1e-9);
        assertEquals((1010029.1646e9 - 4271.676631815e6) / HZ_PER_CM,
                read("# limit: 1010029.1646 GHz\n# limit-from: -4271.676631815 MHz\n").defects().limitPerCm(), 1e-9);
        assertEquals(33690.9 + 1e6 / HZ_PER_CM, read("# limit: 33690.9 cm-1\n# limit-from: 1000 kHz\n").defects()
                .limitPerCm(), 1e-9);
    }

    @Test
    void aBadLimitIsRefusedWithItsLineAndKey() {
        expectProblem("# limit: 1010029.1646 PHz\n", "qd.bad-limit", 10, "limit must be a decimal number and one of "
                + "the units cm-1, THz, GHz, MHz, kHz");
        expectProblem("# limit: 1010029.1646\n", "qd.bad-limit", 10, "got '1010029.1646'");
        expectProblem("# limit: NaN GHz\n", "qd.bad-limit", 10, "got 'NaN GHz'");
        expectProblem("# limit: 1e6 GHz\n", "qd.bad-limit", 10, "got '1e6 GHz'");
        expectProblem("# limit: 1010029.1646 GHz\n# limit-from: -4271 mHz\n", "qd.bad-limit", 11, "limit-from must be");
        expectProblem("# limit-per-cm: 33690.9\n# limit: 1010029.1646 GHz\n", "qd.two-limits", 11, "not both");
        expectProblem("# limit-per-cm: 33690.9\n# limit-from: 1 MHz\n", "qd.bad-limit", 11, "'limit-from' goes with");
        expectProblem("", "qd.missing-key", 0, "header key 'limit-per-cm' (or 'limit' with its unit) is missing");
    }

    private static void expectProblem(String limitLines, String code, int line, String text) {
        DataFileException e = assertThrows(DataFileException.class, () -> read(limitLines));
        DataProblem p = e.problems().get(0);
        assertEquals(code, p.code(), e.getMessage());
        if (line > 0) {
            assertEquals(line, p.line(), e.getMessage());
        }
        assertTrue(p.reason().contains(text), p.reason());
        assertTrue(e.getMessage().contains("qd-test.csv"), e.getMessage());
    }
}
