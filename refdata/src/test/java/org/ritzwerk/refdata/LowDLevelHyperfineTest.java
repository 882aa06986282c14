package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;

/**
 * Measured hyperfine constants of the low d levels of ladder and two-photon excitation (issue 17), read in the
 * abstracts named beside each check: their F levels against the Casimir formula evaluated here, apart from the
 * library's, with the published A and B, and the ladders through them resolved into F -> F' -> F'' paths.
 */
class LowDLevelHyperfineTest {

    private static final DataContext CONTEXT = DataContext.builtIn();
    private static final Species RB85 = Species.parse("Rb-85 I");
    private static final Species CS = Species.parse("Cs-133 I");

    /**
     * Hyperfine energy of level F (MHz): A K/2 + B (3K(K+1)/2 - 2I(I+1)J(J+1)) / (4I(2I-1)J(2J-1)),
     * K = F(F+1) - I(I+1) - J(J+1) (the Casimir formula; Arimondo, Inguscio and Violino, Rev. Mod. Phys. 49, 31
     * (1977), from memory; common practice), written here apart from the engine's.
     */
    static double casimir(double a, double b, double i, double j, double f) {
        double k = f * (f + 1) - i * (i + 1) - j * (j + 1);
        return a * k / 2 + b * (1.5 * k * (k + 1) - 2 * i * (i + 1) * j * (j + 1))
                / (4 * i * (2 * i - 1) * j * (2 * j - 1));
    }

    /** The library's F-level shifts from the hyperfine-free level, MHz, by 2F. */
    static Map<Integer, Double> shiftsMhz(Species species, State state) {
        double centroid = CONTEXT.alkaliAtom(species).level(state).energyPerCm();
        Map<Integer, Double> out = new HashMap<>();
        for (AlkaliHyperfine.FLevel f : CONTEXT.hyperfineLevels(species, state)) {
            out.put(f.twoF(), (f.energyPerCm() - centroid) * 100 * PhysicalConstants.C / 1e6);
        }
        return out;
    }

    /**
     * Rb-85 4d 2D3/2 (I = 5/2): A = 7.419(35) MHz and B = 4.19(19) MHz (A. Duspayev and G. Raithel, arXiv:2305.00265
     * (2023), read in the abstract, which gives the constants fitted to the four resolved F'' levels, not the
     * intervals). By the Casimir formula the intervals are 2A - 0.8B = 11.486 MHz, 3A - 0.45B = 20.3715 MHz and
     * 4A + 0.8B = 33.028 MHz (hand: the B factors 0.7, -0.1, -0.55, 0.25 for F = 1 to 4). Before these constants
     * the level had none and was listed unsplit.
     */
    @Test
    void rubidium85FourD32SplitsWithThePublishedConstants() {
        State d32 = State.of(4, 2, 3);
        HyperfineConstants c = CONTEXT.hyperfineConstants(RB85, d32).orElseThrow();
        assertEquals(7.419e6, c.aHertz(), 1e-3);
        assertEquals(4.19e6, c.bHertz(), 1e-3);
        assertEquals(0.035e6, c.aUncertaintyHertz(), 1e-3);
        assertEquals(0.19e6, c.bUncertaintyHertz(), 1e-3);
        assertTrue(c.source().contains("arXiv:2305.00265"), c.source());
        assertEquals("measured", CONTEXT.hyperfineConstantsOrigin(RB85, d32).orElseThrow());
        Map<Integer, Double> shift = shiftsMhz(RB85, d32);
        assertEquals(4, shift.size(), shift.toString());
        for (int f = 1; f <= 4; f++) {
            assertEquals(casimir(7.419, 4.19, 2.5, 1.5, f), shift.get(2 * f), 1e-6, "F = " + f);
        }
        assertEquals(11.486, shift.get(4) - shift.get(2), 1e-6);
        assertEquals(20.3715, shift.get(6) - shift.get(4), 1e-6);
        assertEquals(33.028, shift.get(8) - shift.get(6), 1e-6);
    }

    /**
     * Rb 6s 2S1/2: A = 239.18(3) MHz (Rb-85, I = 5/2) and 807.66(8) MHz (Rb-87, I = 3/2) (A. Perez Galvan, Y. Zhao
     * and L. A. Orozco, Phys. Rev. A 78, 012502 (2008), read in the abstract): the F splitting is A (I + 1/2),
     * 717.54 and 1615.32 MHz. The same abstract gives the isotopes' hyperfine anomaly difference, -0.0036(2): the
     * ratio of the two A against the ratio of the nuclear g factors of the built-in isotope table must show it.
     * Before these constants the level had none.
     */
    @Test
    void rubidiumSixSSplitsWithThePublishedConstants() {
        State s6 = State.of(6, 0, 1);
        Species rb87 = Species.parse("Rb-87 I");
        Map<Integer, Double> r85 = shiftsMhz(RB85, s6);
        Map<Integer, Double> r87 = shiftsMhz(rb87, s6);
        assertEquals(717.54, r85.get(6) - r85.get(4), 1e-6);
        assertEquals(1615.32, r87.get(4) - r87.get(2), 1e-6);
        assertEquals("measured", CONTEXT.hyperfineConstantsOrigin(rb87, s6).orElseThrow());
        // A / (g_I) of the two isotopes: 1 + anomaly difference; g_I = mu / I
        double g85 = CONTEXT.nucleus(RB85).magneticMoment().getAsDouble() / 2.5;
        double g87 = CONTEXT.nucleus(rb87).magneticMoment().getAsDouble() / 1.5;
        assertEquals(-0.0036, (807.66 / 239.18) / (g87 / g85) - 1, 0.0004);
    }

    /**
     * The ladder of the measurement, 5s1/2 -> 5p1/2 (795 nm) -> 4d3/2 (1476 nm): every F -> F' -> F'' path (F = 2,
     * 3; F' = 2, 3; F'' = 1 to 4; Delta F = 0, +-1 per step: 12 paths). The two steps of a path add up to the
     * F -> F'' two-photon frequency whatever F' (the intermediate shift cancels), and two paths from the same F and
     * F' differ in their second step by the 4d3/2 interval of the published constants. Before these constants the
     * ladder refused to resolve (no hyperfine constants for 4d3/2).
     */
    @Test
    void theFourD32LadderResolvesIntoFPaths() {
        List<AlkaliHyperfine.LadderComponent> paths = AlkaliHyperfine.ladderComponents(CONTEXT, RB85,
                State.of(5, 0, 1), State.of(5, 1, 1), State.of(4, 2, 3));
        assertEquals(12, paths.size(), paths.toString());
        Map<String, Double> twoPhoton = new HashMap<>();
        for (AlkaliHyperfine.LadderComponent p : paths) {
            double sum = p.firstHertz() + p.secondHertz();
            Double seen = twoPhoton.putIfAbsent(p.twoFLower() + "-" + p.twoFUpper(), sum);
            if (seen != null) {
                assertEquals(seen, sum, 1.0, // Hz, against rounding of 4e14 Hz sums
                        "F = " + p.twoFLower() / 2 + " -> F'' = " + p.twoFUpper() / 2);
            }
            assertTrue(Double.isFinite(p.secondUncertaintyHertz()) && p.secondUncertaintyHertz() > 0, p.toString());
        }
        double f3 = second(paths, 4, 4, 6);
        double f2 = second(paths, 4, 4, 4);
        assertEquals(casimir(7.419, 4.19, 2.5, 1.5, 3) - casimir(7.419, 4.19, 2.5, 1.5, 2), (f3 - f2) / 1e6, 1e-6);
    }

    /**
     * Cs-133 6d (I = 7/2): 6d3/2 A = 16.34(5) MHz, B = -0.1(3) MHz and 6d5/2 A = -4.66(4) MHz, B = 0.9(6) MHz (A.
     * Kortyna, N. Masluk and T. Bragdon, APS DAMOP 2005 meeting abstract D6.8, read in the abstract). 6d5/2 is
     * inverted (A &lt; 0): F = 1 highest; its F = 6 - 5 interval is 6A + 18B/35 by the Casimir formula (hand),
     * -27.4971 MHz (make_d_lines.py's splittings column). Before, both levels had no constants.
     */
    @Test
    void caesiumSixDSplitsWithThePublishedConstants() {
        State d32 = State.of(6, 2, 3);
        State d52 = State.of(6, 2, 5);
        HyperfineConstants c32 = CONTEXT.hyperfineConstants(CS, d32).orElseThrow();
        HyperfineConstants c52 = CONTEXT.hyperfineConstants(CS, d52).orElseThrow();
        assertEquals(16.34e6, c32.aHertz(), 1e-3);
        assertEquals(-0.1e6, c32.bHertz(), 1e-3);
        assertEquals(-4.66e6, c52.aHertz(), 1e-3);
        assertEquals(0.9e6, c52.bHertz(), 1e-3);
        assertEquals(0.04e6, c52.aUncertaintyHertz(), 1e-3);
        assertEquals(0.6e6, c52.bUncertaintyHertz(), 1e-3);
        assertTrue(c52.source().contains("DAMOP 2005"), c52.source());
        Map<Integer, Double> s32 = shiftsMhz(CS, d32);
        assertEquals(4, s32.size(), s32.toString());
        for (int f = 2; f <= 5; f++) {
            assertEquals(casimir(16.34, -0.1, 3.5, 1.5, f), s32.get(2 * f), 1e-6, "6d3/2 F = " + f);
        }
        Map<Integer, Double> s52 = shiftsMhz(CS, d52);
        assertEquals(6, s52.size(), s52.toString());
        for (int f = 1; f <= 6; f++) {
            assertEquals(casimir(-4.66, 0.9, 3.5, 2.5, f), s52.get(2 * f), 1e-6, "6d5/2 F = " + f);
        }
        assertEquals(-27.4971, s52.get(12) - s52.get(10), 1e-4);
        assertTrue(s52.get(2) > s52.get(12), s52.toString());
    }

    /**
     * The 917 nm ladder 6s1/2 -> 6p3/2 (852 nm) -> 6d5/2: F = 3, 4; F' = 2 to 5; F'' = 1 to 6; Delta F = 0, +-1
     * per step: 18 paths. The second steps from F' = 5 to F'' = 6 and 5 differ by the 6d5/2 F = 6 - 5 interval of
     * the published constants.
     */
    @Test
    void theCaesium917NanometreLadderResolvesIntoFPaths() {
        List<AlkaliHyperfine.LadderComponent> paths = AlkaliHyperfine.ladderComponents(CONTEXT, CS,
                State.of(6, 0, 1), State.of(6, 1, 3), State.of(6, 2, 5));
        assertEquals(18, paths.size(), paths.toString());
        assertEquals(casimir(-4.66, 0.9, 3.5, 2.5, 6) - casimir(-4.66, 0.9, 3.5, 2.5, 5),
                (second(paths, 8, 10, 12) - second(paths, 8, 10, 10)) / 1e6, 1e-6);
    }

    private static double second(List<AlkaliHyperfine.LadderComponent> paths, int twoF, int twoF1, int twoF2) {
        return paths.stream().filter(p -> p.twoFLower() == twoF && p.twoFIntermediate() == twoF1
                && p.twoFUpper() == twoF2).findFirst().orElseThrow().secondHertz();
    }
}
