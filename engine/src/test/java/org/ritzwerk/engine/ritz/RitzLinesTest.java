package org.ritzwerk.engine.ritz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;

import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;

class RitzLinesTest {

    private static final long SEED = 0x5172_2026L;
    private static final Species X = Species.parse("Sr I");
    private static final String[] TERMS = {"S", "P", "D", "F"};

    @Test
    void labelsTellParityTermAndJ() {
        assertEquals(new LevelDesignation(-1, 3, 1, 2), LevelDesignation.parse("1s2p 3P1", -1));
        assertEquals(new LevelDesignation(1, 1, 0, 0), LevelDesignation.parse("1s2 1S0", -1));
        assertEquals(new LevelDesignation(-1, 3, 1, 2), LevelDesignation.parse("5s5p 3P*1", -1));
        assertEquals(new LevelDesignation(-1, 2, 1, 3), LevelDesignation.parse("4p 2Po3/2", -1));
        assertEquals(new LevelDesignation(-1, 2, 1, 3), LevelDesignation.parse("4p 2P\u00b03/2", 3));
        assertEquals(new LevelDesignation(1, 2, 0, 1), LevelDesignation.parse("2p6.3s 2S1/2", -1));
        assertEquals(new LevelDesignation(1, 2, 0, 1), LevelDesignation.parse("1s22s 2S1/2", -1));
        assertEquals(new LevelDesignation(-1, 2, 1, 3), LevelDesignation.parse("6p 2P3/2", 3), "alkali style");
        assertEquals(new LevelDesignation(1, 1, 2, 4), LevelDesignation.parse("5p2 1D", 4), "J beside the label");
        assertEquals(new LevelDesignation(0, 3, 1, 2), LevelDesignation.parse("3P1", -1), "no configuration: no parity");
        assertEquals(new LevelDesignation(0, 0, -1, -1), LevelDesignation.parse("level 7", -1), "nothing readable");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> LevelDesignation.parse("1s2p 3P1", 4));
        assertTrue(e.getMessage().contains("'1s2p 3P1'") && e.getMessage().contains("J = 2"), e.getMessage());
    }

    @Test
    void theZeroOfTheScaleIsExactWhenNoUncertaintyIsGiven() {
        // Sr I 5s2 1S0 at 0 without an uncertainty, 5s5p 1P1 21698.452(5) cm-1 (levels-sr-i): the line
        // between them has u = 0.005 cm-1, the upper level's alone (the zero is exact by definition)
        RitzLevels levels = RitzLevels.builder(X).add("5s2 1S0", 0, Double.NaN, -1)
                .add("5s5p 1P1", 21698.452, 0.005, -1).add("5s6s 1S0", 30591.825, Double.NaN, -1).build();
        assertEquals(0.0, levels.uncertaintyPerCm(0).orElseThrow(), "the zero of the scale");
        assertTrue(levels.uncertaintyPerCm(2).isEmpty(), "another level without u stays unknown");
        RitzTransitions lines = RitzLines.defaults().compute(levels);
        int ground = -1;
        for (int i = 0; i < lines.size(); i++) {
            if (lines.lower(i) == 0) {
                ground = i;
            }
        }
        assertTrue(ground >= 0, "5s5p 1P1 - 5s2 1S0 is listed");
        assertEquals(0.005, lines.wavenumberUncertaintyPerCm(ground).orElseThrow(), 1e-15);
        // 460.73 nm: u(lambda) = u(sigma) / sigma^2 = 0.005 / 21698.452^2 cm = 1.06e-4 nm
        assertEquals(0.005 / 21698.452 / 21698.452 * 1e7, lines.wavelengthUncertaintyNm(ground, Medium.vacuum())
                .orElseThrow(), 1e-12);
    }

    /** Random levels: parity, J, term drawn at random, some of them unknown. */
    private static RitzLevels randomLevels(long seed) {
        Random r = new Random(seed);
        RitzLevels.Builder b = RitzLevels.builder(X);
        int n = 2 + r.nextInt(14);
        for (int i = 0; i < n; i++) {
            int twoJ = r.nextInt(8) == 0 ? -1 : 2 * r.nextInt(4);
            int mult = 1 + 2 * r.nextInt(2);
            String term = mult + TERMS[r.nextInt(4)];
            String parity = r.nextInt(6) == 0 ? "" : (r.nextBoolean() ? "o" : "e");
            // a configuration of one electron over a closed shell gives the parity; "e" means even, no mark;
            // the level's index in the configuration (or in an unreadable first word) keeps labels unique. (The
            // index used to follow the term as a last word " #i", so no term and no parity was read and no
            // random set gave a line: see someRandomSetsGiveLines.)
            String label = (parity.isEmpty() ? "level" + i + " " : parity.equals("o") ? "5s" + (5 + i) + "p "
                    : "5s" + (6 + i) + "s ") + term + (parity.equals("o") && r.nextBoolean() ? "o" : "");
            b.add(label, 1000 * r.nextDouble() * 20, r.nextDouble() * 0.01, twoJ);
        }
        return b.build();
    }

    @Test
    void everyLineObeysTheRulesAndEveryAllowedPairGivesOne() {
        qt().withFixedSeed(SEED).withExamples(200).forAll(integers().between(0, 1_000_000), integers().between(0, 1))
                .checkAssert((seed, ls) -> {
                    RitzLevels levels = randomLevels(seed);
                    RitzTransitions lines = RitzLines.defaults().withLsRules(ls == 1).compute(levels);
                    Set<Long> pairs = new HashSet<>();
                    for (int i = 0; i < lines.size(); i++) {
                        LevelDesignation u = levels.designation(lines.upper(i));
                        LevelDesignation l = levels.designation(lines.lower(i));
                        assertTrue(u.hasParity() && l.hasParity() && u.parity() != l.parity(), "parity changes");
                        assertTrue(Math.abs(u.twoJ() - l.twoJ()) <= 2 && !(u.twoJ() == 0 && l.twoJ() == 0),
                                "Delta J = 0, +-1, not 0 - 0");
                        if (ls == 1 && u.hasTerm() && l.hasTerm()) {
                            assertEquals(u.multiplicity(), l.multiplicity(), "Delta S = 0");
                            assertTrue(Math.abs(u.l() - l.l()) <= 1 && !(u.l() == 0 && l.l() == 0), "Delta L");
                        }
                        assertTrue(lines.wavenumberPerCm(i) > 0);
                        assertEquals(levels.energyPerCm(lines.upper(i)) - levels.energyPerCm(lines.lower(i)),
                                lines.wavenumberPerCm(i), 0.0);
                        if (i > 0) {
                            assertTrue(lines.wavenumberPerCm(i) >= lines.wavenumberPerCm(i - 1), "rising");
                        }
                        pairs.add(lines.upper(i) * 1000L + lines.lower(i));
                    }
                    for (int a = 0; a < levels.size(); a++) {
                        for (int b = 0; b < levels.size(); b++) {
                            boolean expected = levels.energyPerCm(a) > levels.energyPerCm(b)
                                    && RitzLines.allowed(levels.designation(a), levels.designation(b), ls == 1);
                            assertEquals(expected, pairs.contains(a * 1000L + b), "seed " + seed + " pair " + a + ", " + b);
                        }
                    }
                });
    }

    @Test
    void someRandomSetsGiveLines() {
        // the property test above is only as strong as its levels: most random sets must give lines,
        // and read parities and terms
        int withLines = 0;
        int withTerms = 0;
        for (long seed = 0; seed < 50; seed++) {
            RitzLevels levels = randomLevels(seed);
            withLines += RitzLines.defaults().compute(levels).size() > 0 ? 1 : 0;
            withTerms += levels.designation(0).hasTerm() ? 1 : 0;
        }
        assertTrue(withLines > 25, withLines + " of 50 random sets give lines");
        assertEquals(50, withTerms, "every random level's term is read");
    }

    @Test
    void noLineBetweenEqualParitiesNorBetweenJZeroLevels() {
        // energies near Sr I's lowest levels (from memory, rounded); only the rules are checked here
        RitzLevels levels = RitzLevels.builder(X)
                .add("5s2 1S0", 0, 0, -1)
                .add("5s6s 1S0", 30591.8, 0.1, -1)      // even - even: none
                .add("5s5p 3P0", 14317.5, 0.1, -1)      // J 0 - 0 with both S0 levels: none
                .add("5s5p 3P1", 14504.3, 0.1, -1)
                .add("5s5p 1P1", 21698.5, 0.1, -1)
                .build();
        RitzTransitions lines = RitzLines.defaults().compute(levels);
        Set<String> got = new HashSet<>();
        for (int i = 0; i < lines.size(); i++) {
            got.add(levels.label(lines.upper(i)) + " - " + levels.label(lines.lower(i)));
        }
        assertEquals(Set.of("5s5p 3P1 - 5s2 1S0", "5s5p 1P1 - 5s2 1S0", "5s6s 1S0 - 5s5p 3P1", "5s6s 1S0 - 5s5p 1P1"),
                got, "3P0 - 6s 1S0 is J 0 - 0");
        assertFalse(got.contains("5s6s 1S0 - 5s2 1S0"));
        assertFalse(got.contains("5s5p 3P0 - 5s2 1S0"));
        // LS rules drop the intercombination lines
        RitzTransitions ls = RitzLines.defaults().withLsRules(true).compute(levels);
        Set<String> kept = new HashSet<>();
        for (int i = 0; i < ls.size(); i++) {
            kept.add(levels.label(ls.upper(i)) + " - " + levels.label(ls.lower(i)));
        }
        assertEquals(Set.of("5s5p 1P1 - 5s2 1S0", "5s6s 1S0 - 5s5p 1P1"), kept);
    }

    @Test
    void intercombinationLinesKeepTheOrbitalRules() {
        // invented levels: a spin-changing line with Delta L = 1 (3P1 - 1S0) is let through, a
        // Delta L = 3 line of the same spin (4s5g 3G3 - 4s4p 3P2: parity changes, Delta J = 1) is not
        // (LS rules, common practice; Cowan 1981)
        RitzLevels levels = RitzLevels.builder(X).add("4s2 1S0", 0, 1e-3, -1).add("4s4p 3P1", 15210, 1e-3, -1)
                .add("4s4p 3P2", 15316, 1e-3, -1).add("4s5g 3G3", 42000, 1e-3, -1).build();
        Set<String> got = new HashSet<>();
        RitzTransitions lines = RitzLines.defaults().withLsRules(true).withIntercombination(true).compute(levels);
        for (int i = 0; i < lines.size(); i++) {
            got.add(levels.label(lines.upper(i)) + " - " + levels.label(lines.lower(i)));
        }
        assertEquals(Set.of("4s4p 3P1 - 4s2 1S0"), got);
        assertTrue(RitzLines.allowed(LevelDesignation.parse("4s5g 3G3", -1), LevelDesignation.parse("4s4p 3P2", -1),
                false), "the E1 rules alone let the Delta L = 3 pair through");
    }

    @Test
    void uncertaintiesFollowTheCovariance() {
        RitzLevels plain = RitzLevels.builder(X).add("5s2 1S0", 0, 0.003, -1).add("5s5p 1P1", 21698.452, 0.004, -1)
                .build();
        RitzTransitions one = RitzLines.defaults().compute(plain);
        assertEquals(1, one.size());
        assertEquals(0.005, one.wavenumberUncertaintyPerCm(0).getAsDouble(), 1e-15, "sqrt(3^2 + 4^2) mcm-1");
        // fully correlated levels: the difference is certain to sqrt(9 + 16 - 2 * 0.9 * 12) mcm-1
        RitzLevels correlated = plain.withCovariance(new double[][] {{9e-6, 10.8e-6}, {10.8e-6, 16e-6}});
        double expected = Math.sqrt(9e-6 + 16e-6 - 2 * 10.8e-6);
        RitzTransitions two = RitzLines.defaults().compute(correlated);
        assertEquals(expected, two.wavenumberUncertaintyPerCm(0).getAsDouble(), 1e-15);
        double nm = two.vacuumWavelengthNm(0);
        assertEquals(1e7 / 21698.452, nm, 1e-12);
        assertEquals(expected / 21698.452 * nm, two.wavelengthUncertaintyNm(0, Medium.vacuum()).getAsDouble(), 1e-15);
        double air = two.wavelengthNm(0, Medium.air());
        assertTrue(air < nm);
        assertEquals(two.wavelengthUncertaintyNm(0, Medium.vacuum()).getAsDouble(),
                two.wavelengthUncertaintyNm(0, Medium.air()).getAsDouble(), 1e-3 * expected / 21698.452 * nm,
                "air changes the uncertainty by its slope, within 1e-3 here");
        RitzException bad = assertThrows(RitzException.class,
                () -> plain.withCovariance(new double[][] {{1, 2}, {3, 1}}));
        assertEquals(RitzException.BAD_COVARIANCE, bad.code());
        assertTrue(bad.getMessage().contains("'5s5p 1P1' and '5s2 1S0'"), bad.getMessage());
        assertThrows(RitzException.class, () -> plain.withCovariance(new double[][] {{1}}));
        // a level above the zero without an uncertainty leaves its lines' unknown (the zero itself is exact:
        // theZeroOfTheScaleIsExactWhenNoUncertaintyIsGiven)
        RitzLevels unknown = RitzLevels.builder(X).add("5s5p 3P1", 14504.334, Double.NaN, -1)
                .add("5s6s 3S1", 29038.773, 0.004, -1).build();
        assertTrue(RitzLines.defaults().compute(unknown).wavenumberUncertaintyPerCm(0).isEmpty());
    }

    @Test
    void oscillatorStrengthFollowsFromACompanionA() {
        // the relation f = 1.4992e-16 lambda^2[A] (g_u / g_l) A (common practice, the usual
        // numerical form with lambda in angstrom) checks the constants in RitzLines; A invented
        Species na = Species.parse("Na I");
        RitzLevels levels = RitzLevels.builder(na).add("3s 2S1/2", 0, 0, -1).add("3p 2P3/2", 16973.366, 0.001, -1)
                .build();
        DataSetInfo info = new DataSetInfo("test-a", DataKind.LINES, "test A", "1", Provenance.fromMemory("test"),
                List.of(na));
        LineList companion = LineList.builder(info, Unit.NANOMETRE, Medium.vacuum(), "")
                .add(na, 589.16, Double.NaN, Double.NaN, null, 6.0e7, "3s 2S1/2", "3p 2P3/2", null).build();
        RitzTransitions lines = RitzLines.defaults().withEinsteinA(companion).compute(levels);
        double angstrom = 1e8 / 16973.366;
        assertEquals(6.0e7, lines.einsteinA(0).getAsDouble(), 0.0);
        assertEquals(1.4992e-16 * angstrom * angstrom * 2 * 6.0e7, lines.oscillatorStrength(0).getAsDouble(),
                2e-4 * 0.63);
    }

    @Test
    void levelListsGiveLinesThroughTheLineQuery() {
        // energies near Sr I's (from memory, rounded); the adapter's columns are checked, not the values
        DataSetInfo info = new DataSetInfo("test-sr-levels", DataKind.LEVELS, "test levels", "1",
                Provenance.fromMemory("test"), List.of(X));
        LevelList list = LevelList.builder(info, Unit.PER_CENTIMETRE, "")
                .add(X, "5s2 1S0", 0, 0, 0, null)
                .add(X, "5s5p 3P1", 14504.3, 0.1, 2, null)
                .add(X, "5s5p 1P1", 21698.5, 0.1, 2, null)
                .build();
        // The parity and J rules only: the intercombination line 3P1 - 1S0 passes.
        LineSet all = LineQuery.defaults().run(LineSources.none().withLevelList(list, RitzLines.defaults()));
        assertEquals(2, all.size());
        assertEquals("5s5p 1P1 - 5s2 1S0", all.name(0), "by falling frequency");
        assertEquals("ritz", all.source(0).model());
        assertEquals("test-sr-levels", all.source(0).dataSet().orElseThrow().id());
        assertEquals(1e7 / 21698.5, all.vacuumWavelengthNm(0), 1e-9);
        assertEquals(0.1 / 21698.5 / 21698.5 / 100, all.vacuumWavelengthUncertaintyMetres(0).getAsDouble(),
                1e-18);
        assertEquals(3, all.upperWeight(0).getAsInt());
        assertEquals(1, all.lowerWeight(0).getAsInt());
        LineSet window = LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(600, Medium.air()), Wavelength.ofNanometres(700, Medium.air()))
                .run(LineSources.none().withLevelList(list, RitzLines.defaults()));
        assertEquals(1, window.size());
        assertEquals("5s5p 3P1 - 5s2 1S0", window.name(0));
        // By default the LS rules apply where both labels give a term (as DataLines and the lines
        // command apply them): the spin-changing 3P1 - 1S0 is left out, the 1P1 - 1S0 line stays.
        LineSet ls = LineQuery.defaults().run(LineSources.none().withLevelList(list));
        assertEquals(List.of("5s5p 1P1 - 5s2 1S0"), List.of(ls.name(0)));
        assertEquals(1, ls.size());
    }
}
