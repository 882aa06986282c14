package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;

import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.AlkaliLines;
import org.ritzwerk.engine.rydberg.LadderExcitation;
import org.ritzwerk.engine.rydberg.Level;
import org.ritzwerk.engine.rydberg.LevelOrigin;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.testing.Golden;

/**
 * Standard uncertainties of the built-in alkali levels and lines: against a hand propagation of the
 * published numbers (golden/alkali-uncertainties.csv, made offline by make_alkali_uncertainty_golden.py
 * with mpmath: numerical derivatives, the sources named in its docstring), "not estimated" where a
 * source states none, and the invariants of the combination.
 */
class AlkaliUncertaintyTest {

    private static final String GOLDEN = "alkali-uncertainties.csv";
    private static final DataContext DATA = DataContext.builtIn();

    /**
     * Formula levels just above their series' valid-from-n are marked, because there the stated uncertainty
     * (published limit and defects) is far below the formula's miss of the tabulated level: Rb-87 10s, the
     * tabulated 31362.33 cm-1 (NIST ASD, Rb I levels, from memory, as levels-rb-87.csv's source) is 0.026 cm-1
     * from the formula, about 9 stated uncertainties. Tabulated levels and levels further up are not marked.
     */
    @Test
    void formulaLevelsNearTheirSeriesEdgeAreMarked() {
        AlkaliAtom rb = DATA.alkaliAtom(Species.parse("Rb-87 I"));
        Level s10 = rb.level(State.parse("10s1/2"));
        double miss = Math.abs(s10.energyPerCm() - 31362.33);
        assertTrue(miss > 5 * s10.energyUncertaintyPerCm().getAsDouble(), "the case the mark is for: " + miss);
        assertEquals(10, rb.seriesEdge(State.parse("10s1/2")).getAsInt());
        assertEquals(10, rb.seriesEdge(State.parse("13s1/2")).getAsInt());
        assertTrue(rb.seriesEdge(State.parse("14s1/2")).isEmpty());
        assertTrue(rb.seriesEdge(State.parse("9s1/2")).isEmpty(), "tabulated");
        assertTrue(rb.seriesEdge(State.parse("60d5/2")).isEmpty());
        assertTrue(rb.seriesEdge(State.parse("5s1/2")).isEmpty(), "the ground level");
        assertTrue(rb.seriesEdge(State.parse("30h11/2")).isEmpty(), "core-polarization level, no series");
        for (Species species : DATA.alkaliSpecies()) {
            AlkaliAtom atom = DATA.alkaliAtom(species);
            for (var series : atom.quantumDefects().series()) {
                int from = series.validFromN();
                State edge = new State(from, series.l(), series.twoJ());
                boolean tabulated = atom.measuredLevels().stream().anyMatch(m -> m.state().equals(edge));
                assertEquals(tabulated, atom.seriesEdge(edge).isEmpty(), species + " " + edge);
                assertTrue(atom.seriesEdge(new State(from + AlkaliAtom.SERIES_EDGE_WINDOW, series.l(), series.twoJ()))
                        .isEmpty(), species + " " + edge);
            }
        }
    }

    /** Every level names where its energy comes from (the files' own sources, as the data files give them). */
    @Test
    void everyLevelNamesItsSource() {
        AlkaliAtom rb = DATA.alkaliAtom(Species.parse("Rb-87 I"));
        assertTrue(rb.energySource(State.parse("5p3/2")).startsWith("d-lines: D2 centroid 384230484.4685(0.0062) MHz,"
                + " J. Ye"), rb.energySource(State.parse("5p3/2")));
        assertTrue(rb.energySource(State.parse("4d5/2")).startsWith("levels-rb-87 (from memory: NIST Atomic Spectra"),
                rb.energySource(State.parse("4d5/2")));
        assertTrue(rb.energySource(State.parse("60s1/2")).startsWith("Rydberg-Ritz formula of quantum-defects-rb-87 "
                + "(from memory: J. Han"), rb.energySource(State.parse("60s1/2")));
        assertEquals("core-polarization formula with the core polarizabilities of quantum-defects-rb-87",
                rb.energySource(State.parse("30h11/2")));
    }

    @Test
    void transitionsAgainstHandPropagation() {
        double fTol = Golden.tolerance(GOLDEN);
        double uTol = Golden.tolerance(GOLDEN, "uncertainty");
        List<Map<String, String>> rows = Golden.rows(GOLDEN);
        for (Map<String, String> row : rows) {
            AlkaliAtom atom = DATA.alkaliAtom(Species.parse(row.get("species")));
            State lower = State.parse(row.get("lower"));
            State upper = State.parse(row.get("upper"));
            double hz = Double.parseDouble(row.get("frequency_hz"));
            double u = Double.parseDouble(row.get("uncertainty_hz"));
            String what = row.get("species") + " " + lower + " -> " + upper;
            assertEquals(hz, atom.frequencyHz(lower, upper), fTol * hz, what);
            assertEquals(u, atom.frequencyUncertaintyHz(lower, upper).getAsDouble(), uTol * u, what);
            if (!AlkaliLines.isElectricDipole(lower, upper)) {
                continue; // 5s -> ns: a two-photon transition, no E1 line
            }
            // the line between them says the same, and so does its wavelength column (c u / nu^2)
            AlkaliLines.Line line = AlkaliLines.between(atom, lower, upper);
            assertEquals(u, line.frequencyUncertaintyHz(), uTol * u, what);
            LineSet set = LineSet.ofAlkali(atom, List.of(line));
            double nu = line.frequency();
            assertEquals(PhysicalConstants.C * u / (nu * nu), set.vacuumWavelengthUncertaintyMetres(0).getAsDouble(),
                    uTol * PhysicalConstants.C * u / (nu * nu), what);
        }
        // Rb-87 D2: the measured centroid's own 6.2 kHz (Ye et al. 1996, as d-lines.csv holds it), the
        // ground level being the exact zero
        AlkaliAtom rb = DATA.alkaliAtom(Species.parse("Rb-87 I"));
        assertEquals(6200.0, rb.frequencyUncertaintyHz(State.parse("5s1/2"), State.parse("5p3/2")).getAsDouble(),
                1e-6);
        // the ladder's second step (golden row 5p3/2 -> 60d5/2) and first step (D2)
        LadderExcitation ladder = rb.ladder(State.parse("5s1/2"), State.parse("5p3/2"), State.parse("60d5/2"));
        Map<String, String> step = rows.stream().filter(r -> r.get("upper").equals("60d5/2")).findFirst().orElseThrow();
        double u2 = Double.parseDouble(step.get("uncertainty_hz"));
        assertEquals(u2, ladder.secondUncertainty().getAsDouble(), uTol * u2);
        assertEquals(6200.0, ladder.firstUncertainty().getAsDouble(), 1e-6);
    }

    @Test
    void notEstimatedWhereNoSourceStatesOne() {
        // Li-7 s: Goy et al. 1986 defects without recalled uncertainties and no measured level at
        // n >= valid-from-n to derive one from (Na, K, Rb-85 s and Li d now carry a residual-derived one:
        // ResidualDerivedUncertaintyTest)
        AlkaliAtom li = DATA.alkaliAtom(Species.parse("Li-7 I"));
        assertTrue(li.level(State.parse("30s1/2")).energyUncertaintyPerCm().isEmpty());
        assertTrue(li.frequencyUncertaintyHz(State.parse("2s1/2"), State.parse("30s1/2")).isEmpty());
        assertTrue(Double.isNaN(AlkaliLines.between(li, State.parse("2s1/2"), State.parse("30p1/2"))
                .frequencyUncertaintyHz()));
        // but Na's measured D line has one (d-lines.csv: 1.3 MHz)
        AlkaliAtom na = DATA.alkaliAtom(Species.parse("Na-23 I"));
        assertEquals(1.3e6, na.frequencyUncertaintyHz(State.parse("3s1/2"), State.parse("3p3/2")).getAsDouble(),
                1e-3);
        // Rb-85 p: defects stated, the limit's uncertainty ours (from the residuals: check R limit), so the level
        // has one, the limit's 0.064 cm-1 nearly all of it (ResidualDerivedUncertaintyTest)
        AlkaliAtom rb85 = DATA.alkaliAtom(Species.parse("Rb-85 I"));
        assertEquals(0.064, rb85.level(State.parse("40p3/2")).energyUncertaintyPerCm().getAsDouble(), 0.001);
        // Rb-87 g levels (core polarization): not estimated
        AlkaliAtom rb = DATA.alkaliAtom(Species.parse("Rb-87 I"));
        assertTrue(rb.level(State.parse("40g7/2")).energyUncertaintyPerCm().isEmpty());
        // and a line set carries none for such a line
        LineSet set = LineSet.ofAlkali(rb, List.of(AlkaliLines.between(rb, State.parse("40g7/2"),
                State.parse("40f5/2"))));
        assertFalse(set.vacuumWavelengthUncertaintyMetres(0).isPresent());
    }

    /**
     * Property: a level's uncertainty is absent or finite and >= 0; a transition's at least each
     * level's, but between two formula levels at most the two combined as independent.
     */
    @Test
    void transitionUncertaintyAtLeastEachLevels() {
        List<AlkaliAtom> atoms = DATA.alkaliSpecies().stream().map(DATA::alkaliAtom).toList();
        // the last source gives both l (0 to 4): l1 = ls / 5, l2 = ls % 5
        qt().withFixedSeed(17L).withExamples(400).forAll(integers().between(0, atoms.size() - 1),
                integers().between(1, 120), integers().between(1, 120), integers().between(0, 24))
                .checkAssert((a, n1, n2, ls) -> {
                    AlkaliAtom atom = atoms.get(a);
                    Level one = levelOrNull(atom, n1, ls / 5);
                    Level two = levelOrNull(atom, n2, ls % 5);
                    if (one == null || two == null) {
                        return;
                    }
                    for (Level level : new Level[] {one, two}) {
                        OptionalDouble u = level.energyUncertaintyPerCm();
                        assertTrue(u.isEmpty() || (u.getAsDouble() >= 0 && Double.isFinite(u.getAsDouble())),
                                level.toString());
                    }
                    OptionalDouble t = atom.frequencyUncertaintyHz(one.state(), two.state());
                    boolean both = one.energyUncertaintyPerCm().isPresent() && two.energyUncertaintyPerCm().isPresent();
                    assertEquals(both, t.isPresent(), one + " " + two);
                    if (both) {
                        double hzPerCm = PhysicalConstants.C * 100;
                        assertTrue(Double.isFinite(t.getAsDouble()) && t.getAsDouble() >= 0, t.toString());
                        if (one.origin() == LevelOrigin.QUANTUM_DEFECT_FIT
                                && two.origin() == LevelOrigin.QUANTUM_DEFECT_FIT) {
                            // shared inputs (the limit, a series' defects) move both levels the same
                            // way, so their difference is known better than two independent levels'
                            assertTrue(t.getAsDouble() <= Math.hypot(one.uncertaintyPerCm(), two.uncertaintyPerCm())
                                    * hzPerCm * (1 + 1e-12), one + " " + two + " " + t);
                        } else {
                            assertTrue(t.getAsDouble() >= one.uncertaintyPerCm() * hzPerCm * (1 - 1e-15),
                                    one + " " + t);
                            assertTrue(t.getAsDouble() >= two.uncertaintyPerCm() * hzPerCm * (1 - 1e-15),
                                    two + " " + t);
                        }
                    }
                });
    }

    private static Level levelOrNull(AlkaliAtom atom, int n, int l) {
        if (l >= n || n < atom.lowestN(l)) {
            return null;
        }
        try {
            return atom.level(State.of(n, l, 2 * l + 1));
        } catch (RydbergException e) {
            return null;
        }
    }
}
