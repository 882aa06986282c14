package org.ritzwerk.engine.hydrogenic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.arbitrary;
import static org.quicktheories.generators.SourceDSL.integers;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.constants.PhysicalConstants;

/**
 * Identities of one-electron ions on seeded random inputs (QuickTheories): Ritz combination, Z^2
 * scaling, the non-relativistic limit, the angular sum rule, branching ratios, the oscillator-
 * strength sum, and the refusal of impossible quantum numbers.
 */
class HydrogenLikePropertiesTest {

    private static final long SEED = 1913L;

    @Test
    void everyLineIsTheDifferenceOfTwoLevels() {
        // Ritz combination principle: frequencies from the line generator equal level differences
        // from the level table (a separate code path), for every tier.
        qt().withFixedSeed(SEED).withExamples(8).forAll(arbitrary().enumValues(Tier.class), integers().between(1, 8))
                .checkAssert((tier, z) -> {
                    HydrogenLikeModel model = HydrogenLikeModel.of(z == 1 ? Nuclei.PROTON : Nuclei.infinitelyHeavy(z),
                            z == 1 ? tier : (tier == Tier.BOHR ? Tier.BOHR : Tier.DIRAC));
                    LevelTable levels = model.levels(6);
                    Map<String, Double> energy = new HashMap<>();
                    for (int i = 0; i < levels.size(); i++) {
                        if (levels.twoF(i) < 0) {
                            energy.put(levels.n(i) + "," + levels.l(i) + "," + levels.twoJ(i), levels.energy(i));
                        }
                    }
                    LineTable lines = HydrogenLikeLines.of(model).components(6, 0, 1e20);
                    assertTrue(lines.size() > 0);
                    for (int i = 0; i < lines.size(); i++) {
                        Double upper = energy.get(lines.upperN(i) + "," + lines.upperL(i) + "," + lines.upperTwoJ(i));
                        Double lower = energy.get(lines.lowerN(i) + "," + lines.lowerL(i) + "," + lines.lowerTwoJ(i));
                        if (upper == null || lower == null) {
                            continue; // hyperfine-split s levels are listed by F
                        }
                        double expected = (upper - lower) / PhysicalConstants.H;
                        assertEquals(expected, lines.frequency(i), 1e-9 * expected);
                    }
                });
    }

    @Test
    void bohrLevelsScaleAsZSquared() {
        qt().withFixedSeed(SEED).forAll(integers().between(1, 118), integers().between(1, 1000)).checkAssert((z, n) -> {
            double hydrogen = HydrogenLikeModel.of(Nuclei.infinitelyHeavy(1), Tier.BOHR).energy(n, 0, 1);
            double ion = HydrogenLikeModel.of(Nuclei.infinitelyHeavy(z), Tier.BOHR).energy(n, 0, 1);
            assertEquals((double) z * z * hydrogen, ion, 1e-14 * Math.abs(ion));
        });
    }

    @Test
    void diracTendsToBohrAsAlphaVanishes() {
        qt().withFixedSeed(SEED).forAll(integers().between(1, 92), integers().between(1, 30), integers().between(0, 29))
                .checkAssert((z, n, k) -> {
                    int l = k % n;
                    HydrogenLikeModel dirac = HydrogenLikeModel.of(Nuclei.infinitelyHeavy(z), Tier.DIRAC);
                    double bohr = HydrogenLikeModel.of(Nuclei.infinitelyHeavy(z), Tier.BOHR).energy(n, l, 2 * l + 1);
                    double previous = Double.POSITIVE_INFINITY;
                    for (double alpha : new double[] {1e-3, 1e-4, 1e-5}) {
                        double difference = Math.abs(dirac.withFineStructureConstant(alpha).energy(n, l, 2 * l + 1)
                                - bohr) / Math.abs(bohr);
                        assertTrue(difference < previous, "shrinks as alpha falls");
                        previous = difference;
                    }
                    // The fine structure is of relative order (Z alpha)^2: at alpha = 1e-5, below 1e-6.
                    assertTrue(previous < 1e-6, "relative difference " + previous);
                });
    }

    @Test
    void fineStructureSharesAddUpToTheSpinMultiplicity() {
        // sum over j, j' of (2j+1)(2j'+1){l j 1/2; j' l' 1}^2 = 2s + 1 = 2 (6j orthogonality, Edmonds eq. 6.2.9).
        qt().withFixedSeed(SEED).forAll(integers().between(1, 3000)).checkAssert(l -> {
            double sum = 0;
            for (int twoJ = 2 * l - 1; twoJ <= 2 * l + 1; twoJ += 2) {
                for (int twoJ2 = Math.max(2 * l - 3, 1); twoJ2 <= 2 * l - 1; twoJ2 += 2) {
                    sum += AngularFactors.fineStructureShare(l, twoJ, l - 1, twoJ2);
                }
            }
            assertEquals(2, sum, 1e-9);
        });
    }

    @Test
    void branchingRatiosAddUpToOne() {
        qt().withFixedSeed(SEED).withExamples(30).forAll(integers().between(2, 12), integers().between(0, 11),
                arbitrary().pick(List.of(-1, 1))).assuming((n, l, sign) -> l < n && 2 * l + sign > 0
                        && !(n == 2 && l == 0)).checkAssert((n, l, sign) -> {
                            HydrogenLikeLines lines = HydrogenLikeLines.of(HydrogenLikeModel.of(Nuclei.PROTON, Tier.QED));
                            LineTable decays = lines.decays(n, l, 2 * l + sign);
                            double lifetime = lines.lifetime(n, l, 2 * l + sign);
                            double sum = 0;
                            for (int i = 0; i < decays.size(); i++) {
                                sum += decays.einsteinA(i) * lifetime;
                            }
                            assertEquals(1, sum, 1e-12);
                        });
    }

    @Test
    void boundOscillatorStrengthSumFromTheGroundState() {
        // Thomas-Reiche-Kuhn: all f from 1s add up to 1; the bound part, sum over n of f(1s -> np),
        // is 0.5650 and the continuum 0.4350 (H. A. Bethe and E. E. Salpeter, Quantum Mechanics of
        // One- and Two-Electron Atoms (Springer, 1957), table 13; digits recalled). Checked
        // independently with the bound_bound and bound_free integrals of
        // engine/src/test/resources/golden/make_bethe_golden.py (mpmath 1.2.1, run by hand): bound
        // 0.5650042, continuum 0.4349958, total 1 to 1e-24. The bound sum up to n = 200 plus its n^-2 tail
        // must land there.
        HydrogenLikeLines lines = HydrogenLikeLines.of(HydrogenLikeModel.of(Nuclei.infinitelyHeavy(1), Tier.BOHR));
        LineTable lyman = lines.multiplets(200, 2.4e15, 3.3e15);
        double sum = 0;
        double last = 0;
        for (int i = 0; i < lyman.size(); i++) {
            if (lyman.lowerN(i) == 1) {
                sum += lyman.oscillatorStrength(i);
                last = Math.max(last, lyman.upperN(i));
            }
        }
        assertEquals(199, (int) last - 1);
        // f(1s -> np) ~ 1.6 / n^3 for large n (Kramers), so the tail beyond 200 is ~ 0.8 / 200^2 = 2e-5.
        assertEquals(0.5650, sum, 5e-4);
    }

    @Test
    void refusesImpossibleQuantumNumbers() {
        HydrogenLikeModel model = HydrogenLikeModel.of(Nuclei.PROTON, Tier.QED);
        assertMessage(() -> model.energy(0, 0, 1), "principal quantum number n must be >= 1, got 0");
        assertMessage(() -> model.energy(2, 2, 5), "orbital quantum number l must be 0 to n - 1 = 1, got 2");
        assertMessage(() -> model.energy(2, 1, 5), "j = 5/2 is impossible for l = 1: j must be l +- 1/2 and positive");
        assertMessage(() -> model.energy(1, 0, -1), "j = -1/2 is impossible for l = 0: j must be l +- 1/2 and positive");
        assertMessage(() -> HydrogenLikeModel.of(Nuclei.PROTON, Tier.HYPERFINE).energy(1, 0, 1, 4),
                "F = 2 is impossible for j = 1/2 and nuclear spin I = 1/2: F runs from |j - I| to j + I");
        assertMessage(() -> HydrogenLikeModel.of(Nuclei.infinitelyHeavy(2), Tier.DIRAC).withFineStructureConstant(0.5),
                "the dirac tier needs Z alpha < 1, got Z alpha = 1.0 for Z = 2");
        assertMessage(() -> HydrogenLikeModel.of(Nuclei.infinitelyHeavy(2), Tier.QED),
                "the qed tier needs the nuclear charge radius of He-4, which is not given");
        assertMessage(() -> HydrogenLikeLines.of(model).components(0, 0, 1),
                "n-max must be 1 to 2000, got 0");
    }

    private static void assertMessage(org.junit.jupiter.api.function.Executable call, String message) {
        assertEquals(message, assertThrows(IllegalArgumentException.class, call).getMessage());
    }
}
