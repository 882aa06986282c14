package org.ritzwerk.engine.hyperfine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

class ZeemanStructureTest {

    private static final HyperfineConstants RB87_5S = HyperfineConstants.ofMegahertz(3417.34130545215, 0, "x");
    private static final HyperfineConstants CS_6P32 = HyperfineConstants.ofMegahertz(50.28827, -0.4934, "x");
    private static final HyperfineConstants CS_6S = HyperfineConstants.ofMegahertz(2298.1579425, 0, "x");
    private static final double G_J = 2.00233113; // Rb 5s g_J (from memory; any value serves these identities)
    private static final double G_I = -0.0009951414;

    /**
     * The diamagnetic shift e^2 B^2 (2/3) r2 a0^2 / (8 m_e h) against the same formula with scipy 1.17.1's
     * scipy.constants (CODATA 2022; the engine has CODATA 2018, a difference below 1e-9 here), computed offline:
     * {@code python3 -c "from scipy import constants as c; a0 = c.physical_constants['Bohr radius'][0];
     * print(c.e**2 * B**2 * (2/3) * r2 * a0**2 / (8 * c.m_e * c.h))"}.
     */
    @Test
    void diamagneticShiftAgainstScipyConstants() {
        assertEquals(293757.1811831305, ZeemanStructure.diamagneticShiftHertz(29.6, 1.0), 293757.18 * 1e-8);
        assertEquals(5855.29516547456, ZeemanStructure.diamagneticShiftHertz(59.0, 0.1), 5855.3 * 1e-8);
        assertEquals(9.924229094024678, ZeemanStructure.diamagneticShiftHertz(1000.0, 1e-3), 9.92 * 1e-8);
        assertEquals(0.0, ZeemanStructure.diamagneticShiftHertz(29.6, 0));
        assertThrows(IllegalArgumentException.class, () -> ZeemanStructure.diamagneticShiftHertz(-1, 1));
        assertThrows(IllegalArgumentException.class, () -> ZeemanStructure.diamagneticShiftHertz(1, 1001));
    }

    @Test
    void constantsFromCodata2018() {
        // CODATA 2018: mu_B/h = 13.996 244 936 1(42) GHz/T; g_e = -2.002 319 304 362 56(35) (from memory)
        assertEquals(13.9962449361e9, ZeemanStructure.bohrMagnetonHertzPerTesla(), 5);
        assertEquals(2.00231930436256, ZeemanStructure.electronSpinG(), 1e-14);
        // Lande: p1/2 = (4 - g_S)/3 ... = 2/3 - (g_S - 2)/3; p3/2 = 4/3 + (g_S - 2)/3
        double gs = ZeemanStructure.electronSpinG();
        assertEquals((4 - gs) / 3, ZeemanStructure.landeG(1, 1), 1e-15);
        assertEquals((2 + gs) / 3, ZeemanStructure.landeG(1, 3), 1e-15);
        assertEquals(gs, ZeemanStructure.landeG(0, 1), 1e-15);
    }

    @Test
    void breitRabiMatchesTheDiagonalisedHamiltonian() {
        double split = HyperfineStructure.splittingHertz(3, 1, RB87_5S);
        for (double tesla : new double[] {0, 1e-5, 1e-3, 0.05, 0.2441, 1, 10}) {
            List<ZeemanState> states = ZeemanStructure.eigenstates(3, 1, RB87_5S, G_J, G_I, tesla);
            assertEquals(8, states.size());
            for (ZeemanState s : states) {
                double br = ZeemanStructure.breitRabiHertz(3, s.twoF(), s.twoMF(), split, G_J, G_I, tesla);
                assertEquals(br, s.energyHertz(), 1e-3,
                        "B = " + tesla + " T, F = " + s.fLabel() + ", mF = " + s.mFLabel());
            }
        }
        // Cs-133 ground level (I = 7/2), too
        double cs = HyperfineStructure.splittingHertz(7, 1, CS_6S);
        for (double tesla : new double[] {1e-4, 0.3, 3}) {
            for (ZeemanState s : ZeemanStructure.eigenstates(7, 1, CS_6S, G_J, -0.00039885395, tesla)) {
                assertEquals(ZeemanStructure.breitRabiHertz(7, s.twoF(), s.twoMF(), cs, G_J, -0.00039885395, tesla),
                        s.energyHertz(), 1e-3);
            }
        }
    }

    @Test
    void lowFieldIsLinearWithGF() {
        // E = E_F + g_F m_F mu_B B, g_F = g_J [F(F+1) - I(I+1) + J(J+1)] / 2F(F+1) + g_I [F(F+1) + I(I+1) - J(J+1)] / 2F(F+1)
        double tesla = 1e-7;
        double mub = ZeemanStructure.bohrMagnetonHertzPerTesla() * tesla;
        double gJ = ZeemanStructure.landeG(1, 3);
        for (ZeemanState s : ZeemanStructure.eigenstates(7, 3, CS_6P32, gJ, G_I, tesla)) {
            double f = s.twoF() / 2.0;
            double i = 3.5;
            double j = 1.5;
            double gF = gJ * (f * (f + 1) - i * (i + 1) + j * (j + 1)) / (2 * f * (f + 1))
                    + G_I * (f * (f + 1) + i * (i + 1) - j * (j + 1)) / (2 * f * (f + 1));
            double expected = HyperfineStructure.shiftHertz(7, 3, s.twoF(), CS_6P32) + gF * s.twoMF() / 2.0 * mub;
            assertEquals(expected, s.energyHertz(), 0.05, "F = " + s.fLabel() + ", mF = " + s.mFLabel());
        }
    }

    @Test
    void zeroFieldEigenvaluesAreTheCasimirLevels() {
        for (ZeemanState s : ZeemanStructure.eigenstates(7, 3, CS_6P32, 1.33, G_I, 0)) {
            assertEquals(HyperfineStructure.shiftHertz(7, 3, s.twoF(), CS_6P32), s.energyHertz(), 1e-4);
        }
    }

    @Test
    void zeemanComponentSharesSumToOneAtAnyField() {
        double gJ1 = ZeemanStructure.landeG(0, 1);
        double gJ2 = ZeemanStructure.landeG(1, 3);
        for (double tesla : new double[] {0, 1e-4, 0.01, 0.5}) {
            List<ZeemanComponent> comps = ZeemanStructure.components(7, 1, CS_6S, gJ1, 3, CS_6P32, gJ2, G_I, 0, tesla);
            assertEquals(1, comps.stream().mapToDouble(ZeemanComponent::relativeStrength).sum(), 1e-10, "B = " + tesla);
        }
        // at zero field the m_F components of F -> F' add up to the zero-field F -> F' share
        List<ZeemanComponent> zero = ZeemanStructure.components(7, 1, CS_6S, gJ1, 3, CS_6P32, gJ2, G_I, 0, 0);
        for (HyperfineComponent hc : HyperfineStructure.components(7, 1, CS_6S, 3, CS_6P32, 0)) {
            double sum = zero.stream().filter(z -> z.twoFLower() == hc.twoFLower() && z.twoFUpper() == hc.twoFUpper())
                    .mapToDouble(ZeemanComponent::relativeStrength).sum();
            assertEquals(hc.relativeStrength(), sum, 1e-10);
        }
    }

    /**
     * The estimate of the fine-structure mixing left out, against the exact two-level problem of
     * an m_j = 1/2 state of a p term: |3/2, 1/2> and |1/2, 1/2>, dE_fs apart, with Zeeman diagonal
     * g_j m_j mu_B B and off-diagonal (g_S - 1) mu_B B sqrt(2) / 3 (common practice, from the
     * Clebsch-Gordan coefficients of l = 1, s = 1/2). Li 2p (10.05 GHz) at 832 G: about 30 MHz
     * (29 MHz exactly).
     */
    @Test
    void fineStructureMixingEstimateMatchesTheTwoLevelProblem() {
        double fs = 10.05e9;
        double gS = ZeemanStructure.electronSpinG();
        // second order: within 0.1 % at 10 G, 5 % at 832 G (mu_B B = 1.2 GHz, a ninth of the splitting)
        for (double[] at : new double[][] {{1e-3, 0.001}, {0.0832, 0.05}}) {
            double tesla = at[0];
            double mub = ZeemanStructure.bohrMagnetonHertzPerTesla() * tesla;
            double a = fs + ZeemanStructure.landeG(1, 3) * mub / 2;
            double b = ZeemanStructure.landeG(1, 1) * mub / 2;
            double c = (gS - 1) * mub * Math.sqrt(2) / 3;
            double upper = (a + b) / 2 + Math.sqrt((a - b) * (a - b) / 4 + c * c);
            double exact = upper - a;
            double estimate = ZeemanStructure.fineStructureMixingHertz(1, fs, tesla);
            assertEquals(exact, estimate, at[1] * exact, "B = " + tesla + " T");
        }
        assertEquals(30e6, ZeemanStructure.fineStructureMixingHertz(1, fs, 0.0832), 1e6);
        assertEquals(0, ZeemanStructure.fineStructureMixingHertz(0, 1e9, 1));
        assertThrows(IllegalArgumentException.class, () -> ZeemanStructure.fineStructureMixingHertz(1, 0, 1));
    }

    // Li-6 (I = 1) 2s and 2p constants (Arimondo et al. 1977, from memory; any values serve the
    // identities below) and its 2p fine-structure splitting, 10.053 GHz (from memory)
    private static final HyperfineConstants LI6_2S = HyperfineConstants.ofMegahertz(152.1368407, 0, "x");
    private static final HyperfineConstants LI6_2P12 = HyperfineConstants.ofMegahertz(17.386, 0, "x");
    private static final HyperfineConstants LI6_2P32 = HyperfineConstants.ofMegahertz(-1.155, -0.010, "x");
    private static final double LI_FS = 10.053e9;
    private static final double LI6_G_I = -0.0004476540;

    private static List<ZeemanComponent> term(int twoJUpper, double centroid, double tesla) {
        return ZeemanStructure.termComponents(2, LI6_2S, 1, LI6_2P12, LI6_2P32, LI_FS, twoJUpper, LI6_G_I, centroid,
                tesla);
    }

    private static List<ZeemanComponent> perLevel(int twoJUpper, double centroid, double tesla) {
        return ZeemanStructure.components(2, 1, LI6_2S, ZeemanStructure.landeG(0, 1), twoJUpper,
                twoJUpper == 1 ? LI6_2P12 : LI6_2P32, ZeemanStructure.landeG(1, twoJUpper), LI6_G_I, centroid, tesla);
    }

    /**
     * The whole-term diagonalisation gives the per-level components where the two J do not mix: at
     * zero field exactly, and at 1 G within the mixing they leave out (43 Hz, and shares within
     * about mu_B B / dE_fs = 1.4e-4 relative).
     */
    @Test
    void theWholeTermAgreesWithEachLevelWhereTheyDoNotMix() {
        for (double tesla : new double[] {0, 1e-4}) {
            for (int twoJ : new int[] {1, 3}) {
                double centroid = twoJ == 1 ? 446.789e12 : 446.789e12 + LI_FS;
                List<ZeemanComponent> whole = term(twoJ, centroid, tesla);
                List<ZeemanComponent> each = perLevel(twoJ, centroid, tesla);
                assertEquals(each.size(), whole.size(), "B = " + tesla + ", 2J' = " + twoJ);
                for (int k = 0; k < each.size(); k++) {
                    ZeemanComponent a = each.get(k);
                    ZeemanComponent b = whole.get(k);
                    double mixing = ZeemanStructure.fineStructureMixingHertz(1, LI_FS, tesla);
                    assertEquals(a.frequencyHertz(), b.frequencyHertz(), tesla == 0 ? 1e-3 : 1.5 * mixing,
                            a + " / " + b);
                    assertEquals(a.relativeStrength(), b.relativeStrength(), tesla == 0 ? 1e-9
                            : 1e-3 * a.relativeStrength() + 1e-6, a + " / " + b);
                    assertEquals(a.twoFUpper(), b.twoFUpper());
                    assertEquals(a.twoMFUpper(), b.twoMFUpper());
                }
            }
        }
    }

    /**
     * At Li-6's 832 G the two J mix: the whole term moves the components to m_J' = +-1/2 by about
     * the mixing estimate (29-30 MHz), each line's shares still sum to 1 (from the whole ground level
     * every p state takes the same strength, however the field mixes them: the sum over the s
     * level's states of d_q |s><s| d_q is a multiple of the identity on p; common practice), and at
     * 1000 T (mu_B B = 14 THz, far beyond
     * the 10 GHz splitting: the Paschen-Back regime) the pi components sit at the term's centroid
     * (Delta m_l = Delta m_s = 0: no Zeeman shift; common practice) within the hyperfine and
     * fine-structure energies, where the per-level method puts them terahertz away.
     */
    @Test
    void theTwoLevelsMixInStrongFields() {
        double d1 = 446.789e12;
        double d2 = d1 + LI_FS;
        double estimate = ZeemanStructure.fineStructureMixingHertz(1, LI_FS, 0.0832);
        double largest = 0;
        for (int twoJ : new int[] {1, 3}) {
            List<ZeemanComponent> whole = term(twoJ, twoJ == 1 ? d1 : d2, 0.0832);
            List<ZeemanComponent> each = perLevel(twoJ, twoJ == 1 ? d1 : d2, 0.0832);
            for (ZeemanComponent a : each) {
                for (ZeemanComponent b : whole) {
                    if (a.twoFLower() == b.twoFLower() && a.twoMFLower() == b.twoMFLower()
                            && a.twoFUpper() == b.twoFUpper() && a.twoMFUpper() == b.twoMFUpper()) {
                        largest = Math.max(largest, Math.abs(a.frequencyHertz() - b.frequencyHertz()));
                    }
                }
            }
        }
        assertEquals(estimate, largest, 0.15 * estimate, "largest move against the estimate " + estimate);
        for (double tesla : new double[] {0.0832, 1, 1000}) {
            assertEquals(1, term(1, d1, tesla).stream().mapToDouble(ZeemanComponent::relativeStrength).sum(), 1e-9,
                    "D1 at B = " + tesla);
            assertEquals(1, term(3, d2, tesla).stream().mapToDouble(ZeemanComponent::relativeStrength).sum(), 1e-9,
                    "D2 at B = " + tesla);
        }
        double centroid = (d1 + 2 * d2) / 3;
        int pi = 0;
        for (int twoJ : new int[] {1, 3}) {
            for (ZeemanComponent c : term(twoJ, twoJ == 1 ? d1 : d2, 1000)) {
                if (c.q() == 0 && c.relativeStrength() > 1e-3) {
                    pi++;
                    assertEquals(centroid, c.frequencyHertz(), 0.02e12, c.toString());
                }
            }
            for (ZeemanComponent c : perLevel(twoJ, twoJ == 1 ? d1 : d2, 1000)) {
                if (c.q() == 0 && c.relativeStrength() > 1e-3) {
                    assertTrue(Math.abs(c.frequencyHertz() - centroid) > 1e12, "per level: " + c);
                }
            }
        }
        assertTrue(pi >= 6, "strong pi components at 1000 T: " + pi);
    }

    /**
     * At zero field the Hellmann-Feynman derivatives are the Casimir factors, so each state's energy uncertainty
     * is its F level's shift uncertainty and each component's that of its F -> F' component (common practice:
     * the two propagations describe the same linear dependence on A and B); per level and for the p term.
     */
    @Test
    void zeroFieldUncertaintiesAreTheZeroFieldOnes() {
        HyperfineConstants s = HyperfineConstants.ofMegahertz(2298.1579425, 0.0001, 0, Double.NaN, "x");
        HyperfineConstants p12 = HyperfineConstants.ofMegahertz(291.9309, 0.0012, 0, Double.NaN, "x");
        HyperfineConstants p32 = HyperfineConstants.ofMegahertz(50.28827, 0.00023, -0.4934, 0.0017, "x");
        for (ZeemanState st : ZeemanStructure.eigenstates(7, 3, p32, 1.33, G_I, 0)) {
            assertEquals(HyperfineStructure.shiftUncertaintyHertz(7, 3, st.twoF(), p32), st.energyUncertaintyHertz(),
                    1e-9 * st.energyUncertaintyHertz(), st.toString());
        }
        double gS = ZeemanStructure.electronSpinG();
        for (int twoJ : new int[] {1, 3}) {
            HyperfineConstants up = twoJ == 1 ? p12 : p32;
            List<HyperfineComponent> f = HyperfineStructure.components(7, 1, s, twoJ, up, 3.5e14, 5100);
            List<ZeemanComponent> perLevel = ZeemanStructure.components(7, 1, s, gS, twoJ, up,
                    ZeemanStructure.landeG(1, twoJ), G_I, 3.5e14, 5100, 0);
            List<ZeemanComponent> term = ZeemanStructure.termComponents(7, s, 1, p12, p32, 1.6e13, twoJ, G_I, 3.5e14,
                    5100, 0);
            assertEquals(perLevel.size(), term.size());
            for (List<ZeemanComponent> list : List.of(perLevel, term)) {
                for (ZeemanComponent c : list) {
                    HyperfineComponent h = f.stream().filter(x -> x.twoFLower() == c.twoFLower()
                            && x.twoFUpper() == c.twoFUpper()).findFirst().orElseThrow();
                    assertEquals(h.frequencyUncertaintyHertz(), c.frequencyUncertaintyHertz(),
                            1e-9 * h.frequencyUncertaintyHertz(), c.toString());
                }
            }
        }
    }

    /** NaN policy: an unstated uncertainty that a state depends on gives NaN; one it does not depend on, nothing. */
    @Test
    void unstatedUncertaintiesGiveNaNOnlyWhereTheyEnter() {
        HyperfineConstants s = HyperfineConstants.ofMegahertz(3417.34130545215, 0.0001, 0, Double.NaN, "x");
        // J = 1/2: B does not enter, so its unstated uncertainty does not matter
        for (ZeemanState st : ZeemanStructure.eigenstates(3, 1, s, G_J, G_I, 0.1)) {
            assertTrue(Double.isFinite(st.energyUncertaintyHertz()), st.toString());
        }
        HyperfineConstants noB = HyperfineConstants.ofMegahertz(84.7185, 0.002, 12.4965, Double.NaN, "x");
        for (ZeemanState st : ZeemanStructure.eigenstates(3, 3, noB, 1.33, G_I, 0.1)) {
            assertTrue(Double.isNaN(st.energyUncertaintyHertz()), st.toString());
            assertTrue(st.energyUncertainty().isEmpty());
        }
        // a centroid without an uncertainty: every component's is NaN (the old overload)
        assertTrue(ZeemanStructure.components(3, 1, s, G_J, 3, noB, 1.33, G_I, 3.8e14, 0.1).stream()
                .allMatch(c -> c.frequencyUncertainty().isEmpty()));
        assertThrows(IllegalArgumentException.class,
                () -> ZeemanStructure.components(3, 1, s, G_J, 3, noB, 1.33, G_I, 3.8e14, -1, 0.1));
    }

    /**
     * Deep in the hyperfine Paschen-Back regime each ground state of Rb-87 tends to one |m_J m_I>, and the
     * Breit-Rabi formula's states go over to E = g_J m_J mu_B B + A m_J m_I + g_I m_I mu_B B (Breit and Rabi
     * 1931; common practice): the upper F = I + 1/2 branch to m_J = +1/2, m_I = m_F - 1/2, except its stretched
     * state m_F = -(I + 1/2), which has m_J = -1/2; the F = I - 1/2 branch to m_J = -1/2, m_I = m_F + 1/2. At
     * 1 T (mu_B B about 8 times the 6.8 GHz splitting) every weight exceeds 0.98, at 3 T 0.998.
     */
    @Test
    void paschenBackLabelsFollowTheBreitRabiBranches() {
        double split = HyperfineStructure.splittingHertz(3, 1, RB87_5S);
        for (double tesla : new double[] {1, 3}) {
            for (ZeemanState st : ZeemanStructure.eigenstates(3, 1, RB87_5S, G_J, G_I, tesla)) {
                assertEquals(ZeemanStructure.breitRabiHertz(3, st.twoF(), st.twoMF(), split, G_J, G_I, tesla),
                        st.energyHertz(), 1e-3);
                int twoMJ = st.twoF() == 4 && st.twoMF() != -4 ? 1 : -1;
                UncoupledLabel d = st.dominant();
                assertEquals(1, d.twoJ());
                assertEquals(twoMJ, d.twoMJ(), st.toString());
                assertEquals(st.twoMF() - twoMJ, d.twoMI(), st.toString());
                assertTrue(d.weight() > (tesla == 1 ? 0.98 : 0.998), st.toString());
                // the energy's sign follows m_J at high field
                assertEquals(twoMJ > 0, st.energyHertz() > 0, st.toString());
            }
        }
        // at zero field |F = 1, m_F = 0> is (|1/2, -1/2> - |-1/2, 1/2>) / sqrt 2: a tie, to the lower m_J
        ZeemanState tie = ZeemanStructure.eigenstates(3, 1, RB87_5S, G_J, G_I, 0).stream()
                .filter(x -> x.twoF() == 2 && x.twoMF() == 0).findFirst().orElseThrow();
        assertEquals(-1, tie.dominant().twoMJ());
        assertEquals(1, tie.dominant().twoMI());
        assertEquals(0.5, tie.dominant().weight(), 1e-12);
    }

    @Test
    void badFieldIsRefused() {
        assertThrows(IllegalArgumentException.class, () -> ZeemanStructure.eigenstates(3, 1, RB87_5S, 2, 0, -1));
        assertThrows(IllegalArgumentException.class, () -> ZeemanStructure.eigenstates(3, 1, RB87_5S, 2, 0, Double.NaN));
        assertThrows(IllegalArgumentException.class,
                () -> ZeemanStructure.breitRabiHertz(3, 6, 0, 1e9, 2, 0, 1));
    }

    /**
     * Fields far too weak to move any energy by a representable amount (below 1e-20 T, where
     * mu_B B is 1.4e-10 Hz against level energies whose last binary digit is worth about 1e-7 Hz)
     * give the zero-field components: the same count and the same frequencies, per level and for
     * the whole term. Such fields made the eigensolver fail to converge (1e-160 T) or lose every
     * component (1e-200 T) when their Zeeman terms entered the matrices.
     */
    @Test
    void fieldsTooWeakToResolveGiveTheZeroFieldComponents() {
        double gS = ZeemanStructure.electronSpinG();
        HyperfineConstants p12 = HyperfineConstants.ofMegahertz(291.9309, 0, "x");
        double gJ2 = ZeemanStructure.landeG(1, 3);
        List<ZeemanComponent> perLevel = ZeemanStructure.components(7, 1, CS_6S, gS, 3, CS_6P32, gJ2, G_I, 3.5e14, 0);
        List<ZeemanComponent> term = ZeemanStructure.termComponents(7, CS_6S, 1, p12, CS_6P32, 1.6e13, 3, G_I, 3.5e14,
                0);
        for (double tesla : new double[] {1e-21, 1e-160, 1e-200, 1e-300, Double.MIN_VALUE}) {
            List<ZeemanComponent> weakLevel = ZeemanStructure.components(7, 1, CS_6S, gS, 3, CS_6P32, gJ2, G_I,
                    3.5e14, tesla);
            List<ZeemanComponent> weakTerm = ZeemanStructure.termComponents(7, CS_6S, 1, p12, CS_6P32, 1.6e13, 3,
                    G_I, 3.5e14, tesla);
            assertEquals(perLevel.size(), weakLevel.size(), "per level at " + tesla + " T");
            assertEquals(term.size(), weakTerm.size(), "term at " + tesla + " T");
            for (int k = 0; k < term.size(); k++) {
                assertEquals(perLevel.get(k).frequencyHertz(), weakLevel.get(k).frequencyHertz(), 0.0);
                assertEquals(term.get(k).frequencyHertz(), weakTerm.get(k).frequencyHertz(), 0.0);
            }
        }
    }
}
