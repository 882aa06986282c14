package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.levels.LevelQuery;
import org.ritzwerk.engine.levels.LevelSet;
import org.ritzwerk.engine.levels.LevelSources;

/** The level query over a data context: the README's example and the F levels against published splittings. */
class DataLevelsTest {

    private static final DataContext DATA = DataContext.builtIn();

    @Test
    void theCaesiumGroundSplittingIsTheSiSecondsTransition() {
        // README "Using the library", levels:
        LevelSet cs = LevelQuery.defaults().withMaxN(7).withMaxL(1).withLifetimes(true).withHyperfine(true)
                .run(DataLevels.sources(DATA, List.of(Species.parse("Cs-133 I")), Tier.QED));
        // 6s1/2 F = 3 and F = 4 first, then 6p1/2 F = 3, 4, 6p3/2 F = 2 to 5, 7s1/2 F = 3, 4, ...

        assertEquals("6s 2S1/2", cs.label(0));
        assertEquals(7, cs.statisticalWeight(0).getAsInt());
        assertEquals(9, cs.statisticalWeight(1).getAsInt());
        // Delta nu_Cs = 9 192 631 770 Hz exactly (SI Brochure, 9th edition, 2019: a defining constant)
        double hertz = (cs.energyPerCm(1) - cs.energyPerCm(0)) * PhysicalConstants.C * 100;
        assertEquals(9_192_631_770.0, hertz, 10);
        assertTrue(cs.lifetimeSeconds(0).isEmpty(), "the ground level does not decay");
        int p32 = indexOf(cs, "6p 2P3/2");
        assertEquals(2 * 2 + 1, cs.statisticalWeight(p32).getAsInt(), "F = 2 first");
        // 6p3/2: 30.460(38) ns (Young et al., Phys. Rev. A 50, 2174 (1994), from memory), within 1 %
        assertEquals(30.46e-9, cs.lifetimeSeconds(p32).getAsDouble(), 0.01 * 30.46e-9);
    }

    @Test
    void rubidium87GroundSplittingAndBlackBodyLifetimes() {
        Species rb87 = Species.parse("Rb-87 I");
        LevelSources sources = DataLevels.sources(DATA, List.of(rb87), Tier.QED);
        LevelSet rb = LevelQuery.defaults().withMaxN(60).withMaxL(1).withHyperfine(true).run(sources);
        int f1 = indexOf(rb, "5s 2S1/2");
        // 6 834 682 610.904 Hz (Bize et al., Europhys. Lett. 45, 558 (1999), from memory)
        assertEquals(6_834_682_610.904, (rb.energyPerCm(f1 + 1) - rb.energyPerCm(f1)) * PhysicalConstants.C * 100,
                1.0);
        int s60 = indexOf(rb, "60s 2S1/2");
        List<org.ritzwerk.refdata.AlkaliHyperfine.FLevel> expected = DATA.hyperfineLevels(rb87, State.of(60, 0, 1));
        assertEquals(2, expected.size(), "60s has n*^-3-scaled constants");
        for (int k = 0; k < expected.size(); k++) {
            assertEquals(expected.get(k).twoF(), rb.twoF(s60 + k).getAsInt());
            assertEquals(expected.get(k).energyPerCm(), rb.energyPerCm(s60 + k), "the context's own F levels, bit for bit");
        }
        LevelSet lives = LevelQuery.defaults().withMaxN(12).withMaxL(1).withLifetimes(true)
                .withBlackBodyTemperature(300).run(sources);
        int s12 = indexOf(lives, "12s 2S1/2");
        assertTrue(lives.effectiveLifetimeSeconds(s12).getAsDouble() < lives.lifetimeSeconds(s12).getAsDouble(),
                "300 K black body shortens a Rydberg level's life");
        assertTrue(lives.effectiveLifetimeSeconds(0).isEmpty(), "the ground level has none");
    }

    @Test
    void levelListsAreListedAsTheyAreAndUnknownSpeciesNamed() {
        Species he = Species.parse("He I");
        LevelSources sources = DataLevels.sources(DATA, List.of(Species.parse("H I"), he), Tier.DIRAC);
        assertEquals(List.of(Species.parse("H I"), he), sources.species());
        LevelSet set = LevelQuery.defaults().withMaxN(2).withLifetimes(true).run(sources);
        var list = DataLines.levels(DATA, he);
        assertEquals(4 + list.size(), set.size());
        assertEquals(list.label(0), set.label(4));
        assertEquals(list.energyPerCm(list.size() - 1), set.energyPerCm(set.size() - 1));
        assertTrue(set.model(4).startsWith("level list "), set.model(4));
        assertTrue(set.lifetimeSeconds(4).isEmpty(), "a level list gives no lifetimes");
        assertEquals("dirac", set.model(0));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> DataLevels.sources(DATA, List.of(Species.parse("Fe I")), Tier.QED));
        assertTrue(e.getMessage().startsWith("Fe I has no levels in this data context"), e.getMessage());
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
