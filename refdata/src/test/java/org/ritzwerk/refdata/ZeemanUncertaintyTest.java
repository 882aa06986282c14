package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.hydrogenic.Notation;
import org.ritzwerk.engine.hyperfine.HyperfineComponent;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.hyperfine.UncoupledLabel;
import org.ritzwerk.engine.hyperfine.ZeemanComponent;
import org.ritzwerk.engine.hyperfine.ZeemanState;
import org.ritzwerk.engine.hyperfine.ZeemanStructure;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.testing.Golden;

/**
 * Standard uncertainties and |m_J m_I> labels of Zeeman components and states, against golden files written
 * offline by {@code make_zeeman_uncertainty_golden.py}: the Hamiltonians built there in the fully uncoupled
 * basis |m_L m_S m_I> from ladder operators, diagonalised by mpmath at 40 digits, the energies' derivatives by A,
 * B and the field taken by central differences (not the Hellmann-Feynman expectations the engine uses), and the
 * |J m_J m_I> weights from sympy's Clebsch-Gordan coefficients; from the published numbers named in the script.
 */
class ZeemanUncertaintyTest {

    private static final DataContext DATA = DataContext.builtIn();
    private static final String COMPONENTS = "zeeman-component-uncertainties.csv";
    private static final String STATES = "zeeman-state-uncertainties.csv";
    private static final Species RB87 = Species.parse("Rb-87 I");
    private static final Species CS133 = Species.parse("Cs-133 I");

    @Test
    void rubidiumDLineComponentsInAFieldCarryTheirUncertaintyAndLabels() {
        double tol = Golden.tolerance(COMPONENTS);
        double uTol = Golden.tolerance(COMPONENTS, "uncertainty");
        double wTol = Golden.absoluteTolerance(COMPONENTS, "weight");
        double sTol = Golden.tolerance(COMPONENTS, "field_slope");
        double sFloor = Golden.absoluteTolerance(COMPONENTS, "field_slope_floor");
        List<Map<String, String>> rows = Golden.rows(COMPONENTS);
        assertEquals(408, rows.size());
        AlkaliAtom atom = DATA.alkaliAtom(RB87);
        State ground = atom.groundState();
        State p12 = State.of(5, 1, 1);
        State p32 = State.of(5, 1, 3);
        AlkaliHyperfine data = DATA.alkaliHyperfine();
        double gI = ZeemanStructure.nuclearG(DATA.nucleus(RB87).magneticMoment().getAsDouble(), 3);
        int checked = 0;
        for (double tesla : new double[] {0, 1e-4, 0.01, 1}) {
            for (State upper : List.of(p12, p32)) {
                String line = upper.twoJ() == 1 ? "D1" : "D2";
                List<Map<String, String>> expected = rows.stream().filter(r -> Double.parseDouble(
                        r.get("field_tesla")) == tesla && r.get("line").equals(line)).toList();
                List<ZeemanComponent> actual = data.zeemanComponents(DATA, RB87, ground, upper, tesla);
                // a field known to 1e-6 T (10 mG): each u takes |d nu/dB| 1e-6 T in quadrature
                List<ZeemanComponent> fieldKnown = data.zeemanComponents(DATA, RB87, ground, upper, tesla, 1e-6);
                // the hyperfine part alone: the centroid's uncertainty taken as 0
                List<ZeemanComponent> hyperfineOnly = ZeemanStructure.termComponents(3, constants(RB87, ground), 1,
                        constants(RB87, p12), constants(RB87, p32), atom.frequencyHz(p12, p32), upper.twoJ(), gI,
                        atom.frequencyHz(ground, upper), 0, tesla);
                assertEquals(expected.size(), actual.size(), line + " at " + tesla + " T");
                for (Map<String, String> row : expected) {
                    String what = line + " at " + tesla + " T, 2F " + row.get("twice_f_lower") + " 2mF "
                            + row.get("twice_mf_lower") + " -> 2F' " + row.get("twice_f_upper") + " 2mF' "
                            + row.get("twice_mf_upper");
                    ZeemanComponent c = find(actual, row);
                    close(row, "frequency_hz", c.frequencyHertz(), tol, what);
                    close(row, "uncertainty_hz", c.frequencyUncertaintyHertz(), uTol, what);
                    close(row, "hyperfine_uncertainty_hz", find(hyperfineOnly, row).frequencyUncertaintyHertz(), uTol,
                            what);
                    assertEquals(Double.parseDouble(row.get("relative_strength")), c.relativeStrength(), wTol, what);
                    double slope = Double.parseDouble(row.get("field_slope_hz_per_t"));
                    assertEquals(slope, c.fieldSlopeHertzPerTesla(), sTol * Math.abs(slope) + sFloor, what + " slope");
                    double withField = Math.hypot(Double.parseDouble(row.get("uncertainty_hz")), slope * 1e-6);
                    assertEquals(withField, find(fieldKnown, row).frequencyUncertaintyHertz(), uTol * withField,
                            what + " with u(B) = 1e-6 T");
                    label(row, "lower_", c.lowerDominant(), wTol, what);
                    label(row, "upper_", c.upperDominant(), wTol, what);
                    if (tesla == 0) { // Clebsch-Gordan weights by sympy's CG
                        assertEquals(Double.parseDouble(row.get("lower_cg_weight")), c.lowerDominant().weight(), wTol,
                                what);
                        assertEquals(Double.parseDouble(row.get("upper_cg_weight")), c.upperDominant().weight(), wTol,
                                what);
                    }
                    checked++;
                }
            }
        }
        assertEquals(408, checked);
    }

    /** At zero field each m_F component's uncertainty is that of its F -> F' component (the existing propagation). */
    @Test
    void atZeroFieldTheUncertaintiesAreTheHyperfineComponents() {
        for (Species species : List.of(RB87, Species.parse("Rb-85 I"), CS133, Species.parse("K-40 I"),
                Species.parse("Li-6 I"), Species.parse("Na-23 I"))) {
            AlkaliAtom atom = DATA.alkaliAtom(species);
            State ground = atom.groundState();
            for (int twoJ : new int[] {1, 3}) {
                State upper = State.of(ground.n(), 1, twoJ);
                List<HyperfineComponent> f = DATA.alkaliHyperfine().components(DATA, species, ground, upper);
                List<ZeemanComponent> m = DATA.alkaliHyperfine().zeemanComponents(DATA, species, ground, upper, 0);
                // a field uncertainty of 0 changes nothing, to the bit, at any field
                for (double tesla : new double[] {0, 1e-4, 1}) {
                    assertEquals(DATA.alkaliHyperfine().zeemanComponents(DATA, species, ground, upper, tesla),
                            DATA.alkaliHyperfine().zeemanComponents(DATA, species, ground, upper, tesla, 0));
                }
                for (ZeemanComponent c : m) {
                    HyperfineComponent h = f.stream().filter(x -> x.twoFLower() == c.twoFLower()
                            && x.twoFUpper() == c.twoFUpper()).findFirst().orElseThrow();
                    String what = species.notation() + " " + upper.label() + " " + c;
                    assertTrue(Double.isFinite(c.frequencyUncertaintyHertz()), what);
                    assertEquals(h.frequencyUncertaintyHertz(), c.frequencyUncertaintyHertz(),
                            1e-9 * h.frequencyUncertaintyHertz(), what);
                }
            }
        }
    }

    @Test
    void caesiumP32StatesCarryTheirEnergyUncertaintyAndLabels() {
        double eTol = Golden.absoluteTolerance(STATES, "");
        double uTol = Golden.tolerance(STATES, "uncertainty");
        double wTol = Golden.absoluteTolerance(STATES, "weight");
        double sTol = Golden.tolerance(STATES, "field_slope");
        double sFloor = Golden.absoluteTolerance(STATES, "field_slope_floor");
        List<Map<String, String>> rows = Golden.rows(STATES);
        assertEquals(128, rows.size());
        State p32 = State.of(6, 1, 3);
        double gI = ZeemanStructure.nuclearG(DATA.nucleus(CS133).magneticMoment().getAsDouble(), 7);
        for (Map<String, String> row : rows) {
            double tesla = Double.parseDouble(row.get("field_tesla"));
            int twoF = Integer.parseInt(row.get("twice_f"));
            int twoMF = Integer.parseInt(row.get("twice_mf"));
            ZeemanState s = ZeemanStructure.eigenstates(7, 3, constants(CS133, p32), ZeemanStructure.landeG(1, 3), gI,
                    tesla).stream().filter(x -> x.twoF() == twoF && x.twoMF() == twoMF).findFirst().orElseThrow();
            String what = "Cs-133 6p3/2 at " + tesla + " T: " + s;
            assertEquals(Double.parseDouble(row.get("energy_hz")), s.energyHertz(), eTol, what);
            close(row, "energy_uncertainty_hz", s.energyUncertaintyHertz(), uTol, what);
            double slope = Double.parseDouble(row.get("field_slope_hz_per_t"));
            assertEquals(slope, s.fieldSlopeHertzPerTesla(), sTol * Math.abs(slope) + sFloor, what + " slope");
            assertEquals(row.get("m_j"), s.dominant().mJLabel(), what);
            assertEquals(row.get("m_i"), s.dominant().mILabel(), what);
            assertEquals(Double.parseDouble(row.get("weight")), s.dominant().weight(), wTol, what);
            if (tesla == 0) {
                assertEquals(Double.parseDouble(row.get("cg_weight")), s.dominant().weight(), wTol, what);
            }
        }
    }

    private static HyperfineConstants constants(Species species, State state) {
        return DATA.alkaliHyperfine().constants(species, state).orElseThrow().constants();
    }

    private static ZeemanComponent find(List<ZeemanComponent> list, Map<String, String> row) {
        int f = Integer.parseInt(row.get("twice_f_lower"));
        int mf = Integer.parseInt(row.get("twice_mf_lower"));
        int g = Integer.parseInt(row.get("twice_f_upper"));
        int mg = Integer.parseInt(row.get("twice_mf_upper"));
        List<ZeemanComponent> hits = list.stream().filter(c -> c.twoFLower() == f && c.twoMFLower() == mf
                && c.twoFUpper() == g && c.twoMFUpper() == mg).toList();
        assertEquals(1, hits.size(), "one component " + row);
        return hits.get(0);
    }

    private static void label(Map<String, String> row, String side, UncoupledLabel label, double wTol, String what) {
        assertEquals(row.get(side + "m_j"), label.mJLabel(), what + " " + side + "m_j");
        assertEquals(row.get(side + "m_i"), label.mILabel(), what + " " + side + "m_i");
        assertEquals(Double.parseDouble(row.get(side + "weight")), label.weight(), wTol, what + " " + side + "weight");
        assertEquals(Notation.half(label.twoMJ()), label.mJLabel());
    }

    private static void close(Map<String, String> row, String column, double actual, double relTol, String what) {
        double expected = Double.parseDouble(row.get(column));
        assertEquals(expected, actual, relTol * Math.abs(expected), what + " " + column);
    }
}
