package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.hyperfine.HyperfineComponent;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.hyperfine.HyperfineStructure;
import org.ritzwerk.engine.levels.LevelQuery;
import org.ritzwerk.engine.levels.LevelSet;
import org.ritzwerk.testing.Golden;

/**
 * Standard uncertainties of hyperfine F-level shifts, D-line F -> F' components and F -> F' -> F'' ladder steps,
 * against golden files written offline by {@code make_hyperfine_uncertainty_golden.py} (sympy's symbolic
 * derivatives of the Casimir formula and mpmath's numerical ones of the Rydberg energies, from the published
 * numbers named in the script; not the project's code), and the model column that tells measured hyperfine
 * constants from scaled ones.
 */
class HyperfineUncertaintyTest {

    private static final DataContext DATA = DataContext.builtIn();
    private static final String SHIFTS = "hyperfine-shift-uncertainties.csv";
    private static final String COMPONENTS = "hyperfine-component-uncertainties.csv";
    private static final String LADDERS = "hyperfine-ladder-uncertainties.csv";

    @Test
    void levelShiftsAndTheirUncertaintiesFromTheConstants() {
        double tol = Golden.tolerance(SHIFTS);
        double uTol = Golden.tolerance(SHIFTS, "uncertainty");
        List<Map<String, String>> rows = Golden.rows(SHIFTS);
        assertEquals(24, rows.size());
        for (Map<String, String> row : rows) {
            Species species = Species.parse(row.get("species"));
            State state = State.parse(row.get("level"));
            int twoF = Integer.parseInt(row.get("twice_f"));
            String what = row.get("species") + " " + state.label() + " 2F = " + twoF;
            HyperfineConstants c = DATA.hyperfineConstants(species, state).orElseThrow();
            close(row, "a_hz", c.aHertz(), tol, what);
            close(row, "a_uncertainty_hz", c.aUncertaintyHertz(), uTol, what);
            if (state.twoJ() > 1 && !state.equals(State.parse("60d5/2"))) {
                close(row, "b_hz", c.bHertz(), tol, what);
                close(row, "b_uncertainty_hz", c.bUncertaintyHertz(), uTol, what);
            }
            int twoI = DATA.nucleus(species).twiceSpin();
            close(row, "shift_hz", HyperfineStructure.shiftHertz(twoI, state.twoJ(), twoF, c), tol, what);
            // the Rb-87 nD5/2 row gives no B: only the stated uncertainty of A enters (the golden file's u_B = 0)
            close(row, "shift_uncertainty_hz", HyperfineStructure.shiftUncertaintyHertz(twoI, state.twoJ(), twoF,
                    c.withStatedUncertaintiesOnly()), uTol, what);
        }
        // the row without B leaves the quadrupole term's uncertainty unstated, so the plain propagation says NaN
        HyperfineConstants d52 = DATA.hyperfineConstants(Species.parse("Rb-87 I"), State.parse("60d5/2")).orElseThrow();
        assertTrue(Double.isNaN(d52.bUncertaintyHertz()));
        assertTrue(Double.isNaN(HyperfineStructure.shiftUncertaintyHertz(3, 5, 4, d52)));
    }

    @Test
    void dLineComponentsCarryTheirOwnUncertainty() {
        double tol = Golden.tolerance(COMPONENTS);
        double uTol = Golden.tolerance(COMPONENTS, "uncertainty");
        List<Map<String, String>> rows = Golden.rows(COMPONENTS);
        assertEquals(16, rows.size());
        for (Map<String, String> row : rows) {
            Species species = Species.parse(row.get("species"));
            State ground = DATA.alkaliAtom(species).groundState();
            State upper = State.of(ground.n(), 1, row.get("line").equals("D1") ? 1 : 3);
            int twoF = Integer.parseInt(row.get("twice_f_lower"));
            int twoFUpper = Integer.parseInt(row.get("twice_f_upper"));
            String what = row.get("species") + " " + row.get("line") + " " + twoF + " -> " + twoFUpper;
            HyperfineComponent c = DATA.alkaliHyperfine().components(DATA, species, ground, upper).stream()
                    .filter(x -> x.twoFLower() == twoF && x.twoFUpper() == twoFUpper).findFirst().orElseThrow();
            close(row, "frequency_hz", c.frequencyHertz(), tol, what);
            close(row, "uncertainty_hz", c.frequencyUncertaintyHertz(), uTol, what);
        }
    }

    @Test
    void ladderStepsCarryTheirOwnUncertainty() {
        double tol = Golden.tolerance(LADDERS);
        double uTol = Golden.tolerance(LADDERS, "uncertainty");
        List<Map<String, String>> rows = Golden.rows(LADDERS);
        assertEquals(24, rows.size());
        for (Map<String, String> row : rows) {
            Species species = Species.parse(row.get("species"));
            State upper = State.parse(row.get("upper"));
            int f = Integer.parseInt(row.get("twice_f_lower"));
            int f1 = Integer.parseInt(row.get("twice_f_intermediate"));
            int f2 = Integer.parseInt(row.get("twice_f_upper"));
            String what = row.get("species") + " -> " + upper.label() + " " + f + "," + f1 + "," + f2;
            AlkaliHyperfine.LadderComponent p = AlkaliHyperfine.ladderComponents(DATA, species,
                    State.parse(row.get("lower")), State.parse(row.get("intermediate")), upper).stream()
                    .filter(x -> x.twoFLower() == f && x.twoFIntermediate() == f1 && x.twoFUpper() == f2)
                    .findFirst().orElseThrow();
            close(row, "first_hz", p.firstHertz(), tol, what);
            close(row, "first_uncertainty_hz", p.firstUncertaintyHertz(), uTol, what);
            close(row, "second_hz", p.secondHertz(), tol, what);
            close(row, "second_uncertainty_hz", p.secondUncertaintyHertz(), uTol, what);
        }
        // by hand, the cooling step 5s F = 2 -> 5p3/2 F' = 3 of Rb-87: the D2 centroid's 6.2 kHz (Ye et al. 1996,
        // as d-lines.csv holds it) with 5p3/2 F' = 3's shift, 9/4 A + 1/4 B, from u_A = 2.0 kHz and u_B = 3.7 kHz
        // (the same paper, hyperfine-constants.csv): sqrt(6200^2 + (9/4 2000)^2 + (1/4 3700)^2) = 7716.58 Hz (the
        // ground level's A, known to 5e-11 MHz, adds nothing)
        AlkaliHyperfine.LadderComponent lock = AlkaliHyperfine.ladderComponents(DATA, Species.parse("Rb-87 I"),
                State.parse("5s1/2"), State.parse("5p3/2"), State.parse("60s1/2")).stream()
                .filter(x -> x.twoFLower() == 4 && x.twoFIntermediate() == 6).findFirst().orElseThrow();
        assertEquals(Math.sqrt(6200.0 * 6200 + 4500.0 * 4500 + 925.0 * 925), lock.firstUncertainty().getAsDouble(),
                1e-3);
    }

    @Test
    void theModelColumnTellsMeasuredConstantsFromScaledOnes() {
        for (String[] c : new String[][] {
            {"Rb-87 I", "5s 2S1/2", "measured, hyperfine A, B measured"},
            {"Rb-87 I", "7s 2S1/2", "measured, hyperfine A, B measured"}, // the level the nS row was measured at
            {"Rb-87 I", "8s 2S1/2", "measured, hyperfine A, B scaled as n*^-3 from 7s 2S1/2"},
            {"Rb-87 I", "20s 2S1/2", "quantum-defect-fit, hyperfine A, B scaled as n*^-3 from 7s 2S1/2"},
            {"Rb-85 I", "8d 2D5/2", "measured, hyperfine A, B scaled as n*^-3 from 7d 2D5/2 of Rb-87 I times the "
                    + "isotope ratio"},
            {"Cs-133 I", "7p 2P3/2", "measured, hyperfine A, B measured"},
            {"Cs-133 I", "20p 2P3/2", "quantum-defect-fit, hyperfine A, B scaled as n*^-3 from a published scaled "
                    + "constant"}}) {
            LevelSet set = LevelQuery.defaults().withMaxN(20).withMaxL(2).withHyperfine(true)
                    .run(DataLevels.sources(DATA, List.of(Species.parse(c[0])), Tier.QED));
            int at = -1;
            for (int i = 0; i < set.size() && at < 0; i++) {
                at = set.label(i).equals(c[1]) ? i : -1;
            }
            assertTrue(at >= 0, c[1]);
            assertTrue(set.twoF(at).isPresent(), c[1] + " is split");
            assertEquals(c[2], set.model(at), c[0] + " " + c[1]);
        }
        // the constants' source says the same for the level a series was measured at
        assertTrue(DATA.hyperfineConstants(Species.parse("Rb-87 I"), State.parse("7s1/2")).orElseThrow().source()
                .endsWith(", measured at this level"));
        assertTrue(DATA.hyperfineConstants(Species.parse("Rb-87 I"), State.parse("60s1/2")).orElseThrow().source()
                .endsWith(", scaled as n*^-3"));
    }

    private static void close(Map<String, String> row, String column, double actual, double relTol, String what) {
        double expected = Double.parseDouble(row.get(column));
        assertEquals(expected, actual, relTol * Math.abs(expected), what + " " + column);
    }
}
