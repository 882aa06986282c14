package org.ritzwerk.engine.hyperfine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The field slopes dE/dB of Zeeman states and d nu/dB of components (Hellmann-Feynman), against closed forms:
 * g_F m_F mu_B at weak field, (g_J m_J + g_I m_I) mu_B in the Paschen-Back limit, the stretched states' exact
 * slope, the derivative of the Breit-Rabi formula, and the quadratic Zeeman shift of the Cs clock transition;
 * and the field's uncertainty added in first order.
 */
class ZeemanFieldSlopeTest {

    // Rb-87 5s, 5p1/2, 5p3/2 and Cs-133 6s, 6p3/2 constants (Arimondo et al. 1977 and later, from memory; any
    // values serve the identities below), u(A), u(B) as the data files state them
    private static final HyperfineConstants RB87_5S = HyperfineConstants.ofMegahertz(3417.34130545215, 5e-11, 0,
            Double.NaN, "x");
    private static final HyperfineConstants RB87_5P12 = HyperfineConstants.ofMegahertz(408.328, 0.015, 0, Double.NaN,
            "x");
    private static final HyperfineConstants RB87_5P32 = HyperfineConstants.ofMegahertz(84.7185, 0.002, 12.4965, 0.0037,
            "x");
    private static final HyperfineConstants CS_6S = HyperfineConstants.ofMegahertz(2298.1579425, 0, "x");
    private static final HyperfineConstants CS_6P32 = HyperfineConstants.ofMegahertz(50.28827, 0.00023, -0.4934,
            0.0017, "x");
    private static final double RB_G_I = -0.0009951414; // from memory; only its use matters here
    private static final double CS_G_I = -0.00039885395; // from memory
    private static final double RB_FS = 7.123e12; // Rb 5p fine structure, Hz (from memory)
    private static final double MU_B = ZeemanStructure.bohrMagnetonHertzPerTesla();
    private static final double G_S = ZeemanStructure.electronSpinG();

    /** g_F of a hyperfine level (common practice: the projection theorem); 0 for F = 0. */
    private static double gF(int twoJ, int twoI, int twoF, double gJ, double gI) {
        if (twoF == 0) {
            return 0;
        }
        double f = twoF / 2.0;
        double i = twoI / 2.0;
        double j = twoJ / 2.0;
        double ff = f * (f + 1);
        return gJ * (ff + j * (j + 1) - i * (i + 1)) / (2 * ff) + gI * (ff + i * (i + 1) - j * (j + 1)) / (2 * ff);
    }

    /**
     * At zero field each state's slope is its F level's first-order Zeeman shift per tesla, g_F m_F mu_B
     * (common practice; the states of one m_F are not degenerate there, so first-order perturbation theory holds
     * and Hellmann-Feynman gives it exactly); at 1e-9 T it has moved by the second-order part, about
     * (mu_B)^2 B / dE_hfs (dE_hfs the F-level interval), below 1e-6 of mu_B.
     */
    @Test
    void weakFieldSlopeIsGFmFMuB() {
        double gJ = ZeemanStructure.landeG(1, 3);
        for (double tesla : new double[] {0, 1e-9}) {
            double tol = (tesla == 0 ? 1e-12 : 1e-6) * MU_B;
            for (ZeemanState s : ZeemanStructure.eigenstates(7, 3, CS_6P32, gJ, CS_G_I, tesla)) {
                assertEquals(gF(3, 7, s.twoF(), gJ, CS_G_I) * s.twoMF() / 2.0 * MU_B, s.fieldSlopeHertzPerTesla(), tol,
                        "Cs 6p3/2 at " + tesla + " T: " + s);
            }
            for (ZeemanState s : ZeemanStructure.eigenstates(3, 1, RB87_5S, G_S, RB_G_I, tesla)) {
                assertEquals(gF(1, 3, s.twoF(), G_S, RB_G_I) * s.twoMF() / 2.0 * MU_B, s.fieldSlopeHertzPerTesla(), tol,
                        "Rb 5s at " + tesla + " T: " + s);
            }
        }
        // a component's slope at zero field: (g_F' m_F' - g_F m_F) mu_B, here through the whole p term (D1 and D2)
        for (int twoJ : new int[] {1, 3}) {
            double gJp = ZeemanStructure.landeG(1, twoJ);
            for (ZeemanComponent c : ZeemanStructure.termComponents(3, RB87_5S, 1, RB87_5P12, RB87_5P32, RB_FS, twoJ,
                    RB_G_I, 3.8e14, 0)) {
                double expected = (gF(twoJ, 3, c.twoFUpper(), gJp, RB_G_I) * c.twoMFUpper()
                        - gF(1, 3, c.twoFLower(), G_S, RB_G_I) * c.twoMFLower()) / 2.0 * MU_B;
                // 1e-9: the term's matrix holds the 7 THz fine structure, so its eigenvectors carry errors of 1e-11
                assertEquals(expected, c.fieldSlopeHertzPerTesla(), 1e-9 * MU_B, "2J' = " + twoJ + ": " + c);
            }
        }
    }

    /**
     * Deep in the hyperfine Paschen-Back regime each state's slope tends to (g_J m_J + g_I m_I) mu_B of its
     * largest |m_J m_I> component (common practice), the rest falling as (A / (mu_B B))^2: Rb 5s at 1000 T, Cs
     * 6p3/2 and Rb 5p3/2 (each on its own) at 10 T.
     */
    @Test
    void paschenBackSlopeIsGJmJPlusGImI() {
        record Case(int twoI, int twoJ, HyperfineConstants c, double gJ, double gI, double tesla) {
        }
        for (Case k : List.of(new Case(3, 1, RB87_5S, G_S, RB_G_I, 1000),
                new Case(7, 3, CS_6P32, ZeemanStructure.landeG(1, 3), CS_G_I, 10),
                new Case(3, 3, RB87_5P32, ZeemanStructure.landeG(1, 3), RB_G_I, 10))) {
            for (ZeemanState s : ZeemanStructure.eigenstates(k.twoI(), k.twoJ(), k.c(), k.gJ(), k.gI(), k.tesla())) {
                UncoupledLabel d = s.dominant();
                assertTrue(d.weight() > 0.999, s.toString());
                double expected = (k.gJ() * d.twoMJ() / 2.0 + k.gI() * d.twoMI() / 2.0) * MU_B;
                assertEquals(expected, s.fieldSlopeHertzPerTesla(), 1e-5 * MU_B, k + ": " + s);
            }
        }
    }

    /**
     * A stretched state (|m_F| = I + J) is alone in its m_F block, so its slope is (g_J J + g_I I) mu_B at every
     * field; in the whole p term the state m_F = I + 3/2 is |m_L = 1, m_S = 1/2, m_I = I>, slope
     * (1 + g_S / 2 + g_I I) mu_B, so the cycling component F = I + 1/2, m_F = F -> F' = I + 3/2, m_F' = F' moves by
     * exactly mu_B / h per tesla (g_L = 1; common practice: 1.4 MHz/G).
     */
    @Test
    void stretchedStatesSlopeIsExactAtAnyField() {
        for (double tesla : new double[] {0, 1e-4, 0.01, 1, 100, 1000}) {
            for (ZeemanState s : ZeemanStructure.eigenstates(3, 1, RB87_5S, G_S, RB_G_I, tesla)) {
                if (Math.abs(s.twoMF()) == 4) {
                    assertEquals(Math.signum(s.twoMF()) * (G_S / 2 + RB_G_I * 1.5) * MU_B, s.fieldSlopeHertzPerTesla(),
                            1e-14 * MU_B, tesla + " T: " + s);
                }
            }
            double gJ = ZeemanStructure.landeG(1, 3);
            for (ZeemanState s : ZeemanStructure.eigenstates(7, 3, CS_6P32, gJ, CS_G_I, tesla)) {
                if (Math.abs(s.twoMF()) == 10) {
                    assertEquals(Math.signum(s.twoMF()) * (gJ * 1.5 + CS_G_I * 3.5) * MU_B, s.fieldSlopeHertzPerTesla(),
                            1e-14 * MU_B, tesla + " T: " + s);
                }
            }
            ZeemanComponent cycling = ZeemanStructure.termComponents(3, RB87_5S, 1, RB87_5P12, RB87_5P32, RB_FS, 3,
                    RB_G_I, 3.8e14, tesla).stream().filter(c -> c.twoMFLower() == 4 && c.twoMFUpper() == 6)
                    .findFirst().orElseThrow();
            assertEquals(MU_B, cycling.fieldSlopeHertzPerTesla(), 1e-14 * MU_B, tesla + " T: " + cycling);
        }
    }

    /**
     * The Breit-Rabi formula (Breit and Rabi, Phys. Rev. 38, 2082 (1931)) differentiated by the field here, in
     * closed form: with x = (g_J - g_I) mu_B B / dE, {@code dE/dB = g_I m mu_B +- (g_J - g_I) mu_B (2m / (2I+1) + x)
     * / (2 sqrt(1 + 4 m x / (2I+1) + x^2))}, the stretched states (g_J / 2 + g_I I) mu_B in sign of m.
     */
    @Test
    void slopesAreTheBreitRabiDerivative() {
        record Level(int twoI, HyperfineConstants c, double gJ, double gI) {
        }
        for (Level k : List.of(new Level(3, RB87_5S, G_S, RB_G_I), new Level(7, CS_6S, 2.00254032, CS_G_I))) {
            double split = HyperfineStructure.splittingHertz(k.twoI(), 1, k.c());
            for (double tesla : new double[] {1e-5, 3.229e-4, 1e-3, 0.05, 0.2441, 1, 10}) {
                for (ZeemanState s : ZeemanStructure.eigenstates(k.twoI(), 1, k.c(), k.gJ(), k.gI(), tesla)) {
                    double m = s.twoMF() / 2.0;
                    double expected;
                    if (Math.abs(s.twoMF()) == k.twoI() + 1) {
                        expected = Math.signum(m) * (k.gJ() / 2 + k.gI() * k.twoI() / 2.0) * MU_B;
                    } else {
                        double x = (k.gJ() - k.gI()) * MU_B * tesla / split;
                        double n = k.twoI() + 1;
                        double sign = s.twoF() == k.twoI() + 1 ? 1 : -1;
                        expected = k.gI() * m * MU_B + sign * (k.gJ() - k.gI()) * MU_B * (2 * m / n + x)
                                / (2 * Math.sqrt(1 + 4 * m * x / n + x * x));
                    }
                    assertEquals(expected, s.fieldSlopeHertzPerTesla(), 1e-10 * MU_B,
                            "2I = " + k.twoI() + " at " + tesla + " T: " + s);
                }
            }
        }
    }

    /**
     * Field-insensitive transitions. The Cs-133 clock transition |4, 0> - |3, 0> has slope 0 at zero field and
     * 2 K B beside it, K = (g_J - g_I)^2 (mu_B / h)^2 / (2 dE) = 427.45 Hz/G^2 (common practice; the value from
     * memory, and the formula from the Breit-Rabi expansion); the Rb-87 two-photon transition |1, -1> - |2, 1>
     * turns over near 3.23 G (from memory), its slope changing sign between 3.1 and 3.4 G.
     */
    @Test
    void clockTransitionsAreFieldInsensitive() {
        assertEquals(0, slope(7, CS_6S, 2.00254032, CS_G_I, 0, 8, 0, 6, 0), 1e-13 * MU_B);
        double k = 427.45 * 1e8; // Hz / T^2
        assertEquals(2 * k * 1e-4, slope(7, CS_6S, 2.00254032, CS_G_I, 1e-4, 8, 0, 6, 0), 2 * k * 1e-4 * 1e-4);
        assertTrue(slope(3, RB87_5S, G_S, RB_G_I, 3.1e-4, 4, 2, 2, -2) < 0);
        assertTrue(slope(3, RB87_5S, G_S, RB_G_I, 3.4e-4, 4, 2, 2, -2) > 0);
        assertTrue(Math.abs(slope(3, RB87_5S, G_S, RB_G_I, 3.229e-4, 4, 2, 2, -2)) < 1e-3 * MU_B * 1e-2);
    }

    /** d(E_a - E_b)/dB of two states of one level, Hz per tesla. */
    private static double slope(int twoI, HyperfineConstants c, double gJ, double gI, double tesla, int twoFa,
            int twoMFa, int twoFb, int twoMFb) {
        List<ZeemanState> states = ZeemanStructure.eigenstates(twoI, 1, c, gJ, gI, tesla);
        return state(states, twoFa, twoMFa).fieldSlopeHertzPerTesla()
                - state(states, twoFb, twoMFb).fieldSlopeHertzPerTesla();
    }

    private static ZeemanState state(List<ZeemanState> states, int twoF, int twoMF) {
        return states.stream().filter(s -> s.twoF() == twoF && s.twoMF() == twoMF).findFirst().orElseThrow();
    }

    /**
     * The field's uncertainty enters in first order, |slope| u(B) in quadrature, for states and components (the
     * component's own slope, not its states' in quadrature), and a u(B) of 0 changes nothing, to the bit.
     */
    @Test
    void fieldUncertaintyAddsItsSlopeInQuadrature() {
        double ub = 2e-7;
        for (double tesla : new double[] {0, 1e-4, 0.01, 1}) {
            List<ZeemanState> exact = ZeemanStructure.eigenstates(7, 3, CS_6P32, 1.334, CS_G_I, tesla);
            assertEquals(exact, ZeemanStructure.eigenstates(7, 3, CS_6P32, 1.334, CS_G_I, tesla, 0));
            List<ZeemanState> with = ZeemanStructure.eigenstates(7, 3, CS_6P32, 1.334, CS_G_I, tesla, ub);
            for (int k = 0; k < exact.size(); k++) {
                ZeemanState a = exact.get(k);
                ZeemanState b = with.get(k);
                assertEquals(a.energyHertz(), b.energyHertz(), 0.0);
                assertEquals(a.fieldSlopeHertzPerTesla(), b.fieldSlopeHertzPerTesla(), 0.0);
                assertEquals(Math.hypot(a.energyUncertaintyHertz(), a.fieldSlopeHertzPerTesla() * ub),
                        b.energyUncertaintyHertz(), 1e-15 * b.energyUncertaintyHertz(), b.toString());
            }
            List<ZeemanComponent> term = ZeemanStructure.termComponents(3, RB87_5S, 1, RB87_5P12, RB87_5P32, RB_FS, 3,
                    RB_G_I, 3.8e14, 6200, tesla);
            assertEquals(term, ZeemanStructure.termComponents(3, RB87_5S, 1, RB87_5P12, RB87_5P32, RB_FS, 3, RB_G_I,
                    3.8e14, 6200, tesla, 0));
            List<ZeemanComponent> termU = ZeemanStructure.termComponents(3, RB87_5S, 1, RB87_5P12, RB87_5P32, RB_FS, 3,
                    RB_G_I, 3.8e14, 6200, tesla, ub);
            List<ZeemanComponent> level = ZeemanStructure.components(3, 1, RB87_5S, G_S, 3, RB87_5P32, 1.334, RB_G_I,
                    3.8e14, 6200, tesla);
            assertEquals(level, ZeemanStructure.components(3, 1, RB87_5S, G_S, 3, RB87_5P32, 1.334, RB_G_I, 3.8e14,
                    6200, tesla, 0));
            List<ZeemanComponent> levelU = ZeemanStructure.components(3, 1, RB87_5S, G_S, 3, RB87_5P32, 1.334, RB_G_I,
                    3.8e14, 6200, tesla, ub);
            for (List<List<ZeemanComponent>> pair : List.of(List.of(term, termU), List.of(level, levelU))) {
                for (int k = 0; k < pair.get(0).size(); k++) {
                    ZeemanComponent a = pair.get(0).get(k);
                    ZeemanComponent b = pair.get(1).get(k);
                    assertEquals(a.frequencyHertz(), b.frequencyHertz(), 0.0);
                    assertEquals(a.fieldSlopeHertzPerTesla(), b.fieldSlopeHertzPerTesla(), 0.0);
                    assertEquals(Math.hypot(a.frequencyUncertaintyHertz(), a.fieldSlopeHertzPerTesla() * ub),
                            b.frequencyUncertaintyHertz(), 1e-15 * b.frequencyUncertaintyHertz(), b.toString());
                    if (Math.abs(a.fieldSlopeHertzPerTesla()) > 1e9) { // 200 Hz and more: it shows
                        assertNotEquals(a.frequencyUncertaintyHertz(), b.frequencyUncertaintyHertz(), b.toString());
                    }
                }
            }
        }
        // an uncertainty not estimated stays so
        assertTrue(ZeemanStructure.components(3, 1, RB87_5S, G_S, 3, RB87_5P32, 1.334, RB_G_I, 3.8e14, Double.NaN,
                0.01, ub).stream().allMatch(c -> c.frequencyUncertainty().isEmpty()));
    }

    @Test
    void badFieldUncertaintyIsRefused() {
        for (double bad : new double[] {-1e-9, Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                    () -> ZeemanStructure.eigenstates(3, 1, RB87_5S, G_S, RB_G_I, 0.01, bad));
            assertTrue(e.getMessage().contains("field's standard uncertainty"), e.getMessage());
            assertThrows(IllegalArgumentException.class, () -> ZeemanStructure.components(3, 1, RB87_5S, G_S, 3,
                    RB87_5P32, 1.334, RB_G_I, 3.8e14, 6200, 0.01, bad));
            assertThrows(IllegalArgumentException.class, () -> ZeemanStructure.termComponents(3, RB87_5S, 1,
                    RB87_5P12, RB87_5P32, RB_FS, 3, RB_G_I, 3.8e14, 6200, 0.01, bad));
        }
    }
}
