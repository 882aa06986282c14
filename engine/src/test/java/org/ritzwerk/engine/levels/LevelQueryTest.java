package org.ritzwerk.engine.levels;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.hyperfine.HyperfineLevel;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.TestAtoms;
import org.junit.jupiter.api.Test;

class LevelQueryTest {

    /** CODATA 2018 proton mass, moment and radius. */
    private static final Nucleus PROTON = new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1,
            OptionalDouble.of(2.79284734463), OptionalDouble.of(0.8414e-15), "CODATA 2018");
    private static final Species H = Species.parse("H I");

    @Test
    void hydrogenLevelsCountEveryJAndGiveThe2pLifetime() {
        LevelSet set = LevelQuery.defaults().withMaxN(3).withLifetimes(true)
                .run(LevelSources.none().withHydrogenLike(H, HydrogenLikeModel.of(PROTON, Tier.QED)));
        // n = 1: 1s; n = 2: 2s, 2p1/2, 2p3/2; n = 3: 3s, 3p x2, 3d x2 (common practice: n - 1 l's, two j's each but s)
        assertEquals(1 + 3 + 5, set.size());
        assertEquals(0.0, set.energyPerCm(0));
        assertTrue(set.lifetimeSeconds(0).isEmpty(), "1s has no E1 decay");
        int p12 = 2;
        assertEquals(1, set.l(p12).getAsInt());
        assertEquals(1, set.twoJ(p12).getAsInt());
        // A(2p -> 1s) = 6.2649e8 s^-1 (Wiese & Fuhr, J. Phys. Chem. Ref. Data 38, 565 (2009), from memory): 1.5962 ns
        assertEquals(1.5962e-9, set.lifetimeSeconds(p12).getAsDouble(), 0.0005e-9);
        // H I 2s1/2 lies 82 258.9544 cm^-1 above 1s (NIST ASD H I levels, Kramida 2010, from memory)
        assertEquals(82258.9544, set.energyPerCm(1), 0.001);
        assertEquals("qed", set.model(0));
        assertTrue(set.twoF(0).isEmpty());
        assertTrue(set.effectiveLifetimeSeconds(p12).isEmpty(), "no black body asked for");
    }

    @Test
    void theHyperfineTierGivesFLevelsWithTheirWeights() {
        LevelSet set = LevelQuery.defaults().withMaxN(1)
                .run(LevelSources.none().withHydrogenLike(H, HydrogenLikeModel.of(PROTON, Tier.HYPERFINE)));
        assertEquals(2, set.size());
        assertEquals(1, set.statisticalWeight(0).getAsInt(), "F = 0");
        assertEquals(3, set.statisticalWeight(1).getAsInt(), "F = 1");
        // 1s F = 0 -> F = 1: 1420.405751768 MHz (hydrogen maser, Hellwig et al. 1970, from memory);
        // the model's leading-order splitting is within 0.1 % of it (common practice for this tier)
        double hertz = (set.energyPerCm(1) - set.energyPerCm(0)) * PhysicalConstants.C * 100;
        assertEquals(1420.405751768e6, hertz, 1.5e6);
    }

    @Test
    void alkaliLevelsBelowTheirSeriesValidityAreNamedNotExtrapolated() {
        AlkaliAtom rb = TestAtoms.rubidium();
        LevelSet set = LevelQuery.defaults().withMaxN(12).withMaxL(3).run(LevelSources.none().withAlkali(rb));
        assertEquals(1, set.omissions().size());
        LevelSet.Omission omitted = set.omissions().get(0);
        // Counted by hand: 6-9s, 6-12p (two j), 5-9d (two j), 5-6f (two j) have no measured energy
        // and lie below their series' validity (n = 10, 15, 15, 10, 10, 7, 7 in the test atom).
        assertEquals(4 + 7 + 7 + 5 + 5 + 2 + 2, omitted.count());
        assertEquals(State.of(5, 2, 3).notation(), omitted.first());
        for (int i = 0; i < set.size(); i++) {
            State state = State.of(set.n(i).getAsInt(), set.l(i).getAsInt(), set.twoJ(i).getAsInt());
            assertEquals(rb.level(state).energyPerCm(), set.energyPerCm(i), state.notation());
            assertEquals(state.notation(), set.label(i));
        }
        assertEquals("4d 2D3/2", set.label(0), "lowest n first");
        assertEquals(0.0, set.energyPerCm(indexOf(set, "5s 2S1/2")));
    }

    @Test
    void hyperfineSplitsOnlyWhenAskedAndKeepsTheCentroid() {
        AlkaliAtom rb = TestAtoms.rubidium();
        State ground = State.of(5, 0, 1);
        // Two F levels of 5s with Rb-87's I = 3/2, weights 3 and 5, shifts -5/8 and +3/8 of 6.8 GHz
        List<HyperfineLevel> split = List.of(new HyperfineLevel(2, -0.625 * 6.8e9), new HyperfineLevel(4, 0.375 * 6.8e9));
        LevelSources sources = LevelSources.none().withAlkali(rb, s -> s.equals(ground) ? split : List.of());
        LevelQuery query = LevelQuery.defaults().withMaxN(5).withMaxL(1);
        LevelSet plain = query.run(sources);
        LevelSet fine = query.withHyperfine(true).run(sources);
        assertEquals(plain.size() + 1, fine.size());
        assertEquals(2, fine.twoF(0).getAsInt());
        assertEquals(5, fine.statisticalWeight(1).getAsInt());
        double centroid = (3 * fine.energyPerCm(0) + 5 * fine.energyPerCm(1)) / 8;
        assertEquals(0.0, centroid, 1e-12);
        assertEquals(6.8e9, (fine.energyPerCm(1) - fine.energyPerCm(0)) * PhysicalConstants.C * 100, 1e-3);
        assertTrue(fine.model(0).endsWith(", hyperfine A, B"));
        assertFalse(plain.twoF(0).isPresent());
    }

    @Test
    void partsDeliveredAsFoundMakeTheWholeSet() {
        LevelSources sources = LevelSources.none()
                .withHydrogenLike(H, HydrogenLikeModel.of(PROTON, Tier.DIRAC))
                .withAlkali(TestAtoms.rubidium())
                .withLevels(RitzLevels.builder(Species.parse("He I")).add("1s2 1S0", 0, 0.001, 0)
                        .add("1s2s 3S1", 159855.9745, 0.0005, 2).build());
        // n <= 5, l <= 1: the test atom's 5s and 5p (its 6s has no energy, so no lifetimes here:
        // refdata's DataLevelsTest checks lifetimes with the built-in atoms)
        LevelQuery query = LevelQuery.defaults().withMaxN(5).withMaxL(1);
        List<LevelSet> parts = new ArrayList<>();
        List<Double> reported = new ArrayList<>();
        query.run(sources, (species, fraction) -> reported.add(fraction), parts::add);
        assertEquals(5 + 5 + 1, parts.size(), "a part per shell, per alkali n, and the level list");
        LevelSet whole = query.run(sources);
        LevelSet joined = LevelSet.concat(parts);
        assertEquals(whole.size(), joined.size());
        for (int i = 0; i < whole.size(); i++) {
            assertEquals(whole.label(i), joined.label(i));
            assertEquals(whole.energyPerCm(i), joined.energyPerCm(i));
            assertEquals(whole.lifetimeSeconds(i), joined.lifetimeSeconds(i));
            assertEquals(whole.effectiveLifetimeSeconds(i), joined.effectiveLifetimeSeconds(i));
        }
        assertEquals(1.0, reported.get(reported.size() - 1));
        int listed = whole.size() - 2;
        assertEquals("level list", whole.model(listed));
        assertEquals(0.001, whole.energyUncertaintyPerCm(listed).getAsDouble());
        assertTrue(whole.n(listed).isEmpty());
        assertEquals(3, whole.statisticalWeight(listed + 1).getAsInt());
        assertArrayEquals(new Object[] {H, Species.parse("Rb-87 I"), Species.parse("He I")},
                sources.species().toArray());
    }

    @Test
    void badLimitsAreRefusedWithTheirRange() {
        LevelQuery query = LevelQuery.defaults();
        assertEquals("the highest n must be 1 to 2000, got 0",
                assertThrows(IllegalArgumentException.class, () -> query.withMaxN(0)).getMessage());
        assertThrows(IllegalArgumentException.class, () -> query.withMaxN(2001));
        assertThrows(IllegalArgumentException.class, () -> query.withMaxL(-1));
        assertThrows(IllegalArgumentException.class, () -> query.withMaxL(51));
        for (double bad : new double[] {-1, -Double.MIN_VALUE, 1e5, Double.NaN, Double.POSITIVE_INFINITY}) {
            assertThrows(IllegalArgumentException.class, () -> query.withBlackBodyTemperature(bad), "T = " + bad);
        }
        // 0 K is no black-body radiation, as AlkaliAtom.effectiveLifetime takes it (it was refused here)
        assertTrue(query.withBlackBodyTemperature(0).toString().contains("black body 0.0 K"), query.toString());
        assertThrows(IllegalArgumentException.class, () -> LevelSources.none().withHydrogenLike(Species.parse("He II"),
                HydrogenLikeModel.of(PROTON, Tier.QED)));
    }

    private static int indexOf(LevelSet set, String label) {
        for (int i = 0; i < set.size(); i++) {
            if (set.label(i).equals(label)) {
                return i;
            }
        }
        throw new AssertionError(label + " not in " + set);
    }
}
