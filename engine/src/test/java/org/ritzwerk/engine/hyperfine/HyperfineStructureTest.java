package org.ritzwerk.engine.hyperfine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;

import java.util.List;
import org.junit.jupiter.api.Test;

class HyperfineStructureTest {

    private static final HyperfineConstants RB87_5S = HyperfineConstants.ofMegahertz(3417.34130545215, 0,
            "S. Bize et al., Europhys. Lett. 45, 558 (1999) (from memory)");
    private static final HyperfineConstants RB87_5P32 = HyperfineConstants.ofMegahertz(84.7185, 12.4965,
            "J. Ye et al., Opt. Lett. 21, 1280 (1996) (from memory)");

    @Test
    void rb87GroundSplittingIsTwoA() {
        // S. Bize et al., Europhys. Lett. 45, 558 (1999): 6 834.682 610 904 29(9) MHz (from memory)
        assertEquals(6834.68261090429e6, HyperfineStructure.splittingHertz(3, 1, RB87_5S), 1e-3);
    }

    @Test
    void rb87FiveP32IntervalsFromAAndB() {
        // intervals of the Casimir formula, by hand: E(F') = A K/2 + B (3/2 K(K+1) - 2 I(I+1)J(J+1)) / (4 I(2I-1) J(2J-1))
        // F'=3-2: 3A + B; F'=2-1: 2A - B; F'=1-0: A - B
        List<HyperfineLevel> levels = HyperfineStructure.levels(3, 3, RB87_5P32);
        assertEquals(4, levels.size());
        assertEquals((3 * 84.7185 + 12.4965) * 1e6, levels.get(3).shiftHertz() - levels.get(2).shiftHertz(), 1e-3);
        assertEquals((2 * 84.7185 - 12.4965) * 1e6, levels.get(2).shiftHertz() - levels.get(1).shiftHertz(), 1e-3);
        assertEquals((84.7185 - 12.4965) * 1e6, levels.get(1).shiftHertz() - levels.get(0).shiftHertz(), 1e-3);
    }

    @Test
    void weightedCentroidOfTheFLevelsIsZero() {
        qt().withFixedSeed(17L).forAll(integers().between(0, 9), integers().between(1, 7), integers().between(-500, 500),
                integers().between(-200, 200)).checkAssert((twoI, twoJ, a, b) -> {
                    HyperfineConstants c = HyperfineConstants.ofMegahertz(a, b, "test values");
                    double sum = 0;
                    double scale = 0;
                    for (HyperfineLevel f : HyperfineStructure.levels(twoI, twoJ, c)) {
                        sum += (f.twoF() + 1) * f.shiftHertz();
                        scale += (f.twoF() + 1) * Math.abs(f.shiftHertz());
                    }
                    assertEquals(0, sum, 1e-12 * Math.max(1, scale));
                });
    }

    @Test
    void componentSharesSumToOneAndPerLowerF() {
        // sum over F, F' of (2F+1)(2F'+1){J F I; F' J' 1}^2 = 2I+1 (Edmonds eq. 6.2.9 orthogonality)
        qt().withFixedSeed(1931L).forAll(integers().between(0, 9), integers().between(0, 2), integers().between(0, 2))
                .checkAssert((twoI, l, step) -> {
                    int twoJ = 2 * l + 1;
                    int twoJp = twoJ + 2 * step - 2;
                    if (twoJp < 1) {
                        return;
                    }
                    HyperfineConstants c = HyperfineConstants.ofMegahertz(100, 10, "test values");
                    List<HyperfineComponent> comps = HyperfineStructure.components(twoI, twoJ, c, twoJp, c, 0);
                    double total = comps.stream().mapToDouble(HyperfineComponent::relativeStrength).sum();
                    assertEquals(1, total, 1e-12);
                    for (HyperfineLevel f : HyperfineStructure.levels(twoI, twoJ, c)) {
                        double perF = comps.stream().filter(x -> x.twoFLower() == f.twoF())
                                .mapToDouble(HyperfineComponent::relativeStrength).sum();
                        assertEquals((f.twoF() + 1.0) / ((twoJ + 1.0) * (twoI + 1.0)), perF, 1e-12);
                    }
                });
    }

    @Test
    void rb87D2CyclingComponent() {
        // F = 2 -> F' = 3 carries 7/10 of the F = 2 strength (common practice; alkali D-line data sheets,
        // from memory); its share of the whole line is 7/10 * 5/8
        List<HyperfineComponent> comps = HyperfineStructure.components(3, 1, RB87_5S, 3, RB87_5P32, 384.2304844685e12);
        assertEquals(6, comps.size());
        HyperfineComponent cycling = comps.stream().filter(c -> c.twoFLower() == 4 && c.twoFUpper() == 6).findFirst()
                .orElseThrow();
        assertEquals(0.7 * 5 / 8, cycling.relativeStrength(), 1e-14);
        // frequency = centroid + shift of F' = 3 - shift of F = 2; F = 2 lies 3A/4 above the ground centroid
        double upper3 = HyperfineStructure.shiftHertz(3, 3, 6, RB87_5P32);
        double lower2 = HyperfineStructure.shiftHertz(3, 1, 4, RB87_5S);
        assertEquals(384.2304844685e12 + upper3 - lower2, cycling.frequencyHertz(), 1e-3);
        assertEquals(3417.34130545215e6 * 0.75, lower2, 1e-3);
    }

    @Test
    void shiftUncertaintiesFromTheConstantsUncertainties() {
        // Rb-87 5p3/2, A = 84.7185(20) MHz, B = 12.4965(37) MHz (J. Ye et al., Opt. Lett. 21, 1280 (1996), from
        // memory); by hand from the Casimir formula (I = J = 3/2): K = F(F+1) - 15/2, the factor of A is K/2 and
        // that of B is (3/2 K(K+1) - 2 (15/4)^2) / 36: F' = 3: K = 9/2, 9/4 and 1/4; F' = 0: K = -15/2, -15/4 and
        // 5/4; GUM eq. 10 (JCGM 100:2008, from memory), A and B uncorrelated
        HyperfineConstants c = HyperfineConstants.ofMegahertz(84.7185, 0.0020, 12.4965, 0.0037, "Ye et al. 1996");
        assertEquals(Math.hypot(9.0 / 4 * 2000, 1.0 / 4 * 3700), HyperfineStructure.shiftUncertaintyHertz(3, 3, 6, c),
                1e-9);
        assertEquals(Math.hypot(15.0 / 4 * 2000, 5.0 / 4 * 3700), HyperfineStructure.shiftUncertaintyHertz(3, 3, 0, c),
                1e-9);
        // J = 1/2: only A's (5s F = 2: 3/4 A), and B's unstated uncertainty does not matter there
        HyperfineConstants ground = HyperfineConstants.ofMegahertz(3417.34130545215, 1e-6, 0, Double.NaN, "x");
        assertEquals(0.75 * 1, HyperfineStructure.shiftUncertaintyHertz(3, 1, 4, ground), 1e-12);
        // not stated: NaN, and a component with such a level or centroid has none either
        assertTrue(Double.isNaN(HyperfineStructure.shiftUncertaintyHertz(3, 3, 6, RB87_5P32)));
        assertTrue(Double.isNaN(HyperfineStructure.shiftUncertaintyHertz(3, 3, 6,
                HyperfineConstants.ofMegahertz(84.7185, 0.0020, 12.4965, Double.NaN, "x"))));
        assertTrue(HyperfineStructure.components(3, 1, ground, 3, c, 384.2304844685e12).stream()
                .allMatch(x -> x.frequencyUncertainty().isEmpty()), "no centroid uncertainty given");
        // the cooling component F = 2 -> F' = 3 with the D2 centroid's 6.2 kHz (Ye et al. 1996, from memory)
        HyperfineComponent cooling = HyperfineStructure.components(3, 1, ground, 3, c, 384.2304844685e12, 6200).stream()
                .filter(x -> x.twoFLower() == 4 && x.twoFUpper() == 6).findFirst().orElseThrow();
        assertEquals(Math.sqrt(6200.0 * 6200 + 0.75 * 0.75 + 4500.0 * 4500 + 925.0 * 925),
                cooling.frequencyUncertaintyHertz(), 1e-6);
        // stated-only: the unstated ones taken as 0
        assertEquals(9.0 / 4 * 2000, HyperfineStructure.shiftUncertaintyHertz(3, 3, 6,
                HyperfineConstants.ofMegahertz(84.7185, 0.0020, 0, Double.NaN, "x").withStatedUncertaintiesOnly()),
                1e-9);
        assertThrows(IllegalArgumentException.class, () -> HyperfineConstants.ofMegahertz(1, -1, 0, 0, "x"));
        assertThrows(IllegalArgumentException.class, () -> HyperfineConstants.ofMegahertz(1, 0, 0,
                Double.POSITIVE_INFINITY, "x"));
        assertThrows(IllegalArgumentException.class, () -> HyperfineStructure.components(3, 1, ground, 3, c, 1e14,
                -1));
    }

    @Test
    void deltaFTwoAndZeroToZeroAreAbsent() {
        HyperfineConstants c = HyperfineConstants.ofMegahertz(100, 5, "test values");
        for (HyperfineComponent x : HyperfineStructure.components(3, 1, c, 3, c, 0)) {
            assertTrue(Math.abs(x.twoFLower() - x.twoFUpper()) <= 2);
        }
        // I = 1/2, J = 1/2 -> J' = 1/2: F = 0 -> F' = 0 is forbidden
        assertTrue(HyperfineStructure.components(1, 1, c, 1, c, 0).stream()
                .noneMatch(x -> x.twoFLower() == 0 && x.twoFUpper() == 0));
    }

    @Test
    void badInputsAreRefused() {
        HyperfineConstants c = HyperfineConstants.ofMegahertz(1, 0, "x");
        assertThrows(IllegalArgumentException.class, () -> HyperfineStructure.levels(-1, 1, c));
        assertThrows(IllegalArgumentException.class, () -> HyperfineStructure.levels(3, 0, c));
        assertThrows(IllegalArgumentException.class, () -> HyperfineStructure.shiftHertz(3, 1, 6, c));
        assertThrows(IllegalArgumentException.class, () -> HyperfineStructure.components(3, 1, c, 5, c, 0));
        assertThrows(IllegalArgumentException.class, () -> HyperfineConstants.ofMegahertz(Double.NaN, 0, "x"));
        assertThrows(IllegalArgumentException.class, () -> HyperfineConstants.ofMegahertz(1, 0, " "));
    }

    /**
     * An F level whose Casimir factor K is 0 does not move with A (I = 3, J = 3/2, F = 7/2:
     * K = 63/4 - 12 - 15/4 = 0; and every level of I = 0), so A's uncertainty does not enter its
     * shift's, stated or not, as the diagonalised Hamiltonian's derivative says at zero field
     * (ZeemanStructure.eigenstates, Hellmann-Feynman). It gave NaN when u(A) was not stated.
     */
    @Test
    void anFWhoseShiftDoesNotDependOnAIgnoresItsUncertainty() {
        HyperfineConstants noUA = HyperfineConstants.ofMegahertz(10, Double.NaN, 2, 0.1, "x");
        double expected = Math.abs(HyperfineStructure.shiftHertz(6, 3, 7, HyperfineConstants.ofMegahertz(0, 1, "x")))
                * 0.1e6 / 1e6;
        assertEquals(expected, HyperfineStructure.shiftUncertaintyHertz(6, 3, 7, noUA), 1e-9 * expected);
        assertEquals(0, HyperfineStructure.shiftUncertaintyHertz(0, 1, 1, noUA), 0.0);
        for (ZeemanState state : ZeemanStructure.eigenstates(6, 3, noUA, 0.8, 0, 0)) {
            if (state.twoF() == 7) {
                assertEquals(expected, state.energyUncertaintyHertz(), 1e-6 * expected, state.toString());
            }
        }
    }
}
