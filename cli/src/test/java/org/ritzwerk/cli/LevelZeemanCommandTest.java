package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.refdata.DataContext;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code levels --hyperfine --state STATE --field-tesla B}: one level's Zeeman states, checked against the
 * Breit-Rabi formula written out here (G. Breit and I. I. Rabi, Phys. Rev. 38, 2082 (1931); common practice),
 * not the engine's diagonalisation.
 */
class LevelZeemanCommandTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();
    /** Rb-87 5s A, MHz (hyperfine-constants.csv: Bize et al. 1999); I = 3/2, so the splitting is 2A. */
    private static final double A_MHZ = 3417.34130545215;
    /** The free electron's g factor, CODATA 2018 (from memory): the Lande value of an s1/2 level. */
    private static final double G_J = 2.00231930436256;

    private static List<JsonNode> rows(String out) {
        List<JsonNode> rows = new ArrayList<>();
        for (String line : out.strip().split("\\R")) {
            rows.add(JSON.readTree(line));
        }
        return rows;
    }

    /** mu_B / h, MHz per tesla: e / (4 pi m_e). */
    private static double bohr() {
        return PhysicalConstants.ELEMENTARY_CHARGE.value() / (4 * Math.PI * PhysicalConstants.ELECTRON_MASS.value())
                / 1e6;
    }

    /**
     * The Breit-Rabi energy of the F = I +- 1/2 state with m_F = m, MHz from the hyperfine-free level:
     * -dE / (2 (2I + 1)) + g_I mu_B m B +- (dE / 2) sqrt(1 + 4 m x / (2I + 1) + x^2), x = (g_J - g_I) mu_B B / dE;
     * for |m| = I + 1/2 the stretched state's root is taken with its sign, 1 + x or 1 - x.
     */
    private static double breitRabi(boolean upper, int twoM, double gI, double tesla) {
        double splitting = 2 * A_MHZ;
        double m = twoM / 2.0;
        double x = (G_J - gI) * bohr() * tesla / splitting;
        double base = -splitting / 8 + gI * bohr() * m * tesla;
        if (Math.abs(twoM) == 4) {
            return base + splitting / 2 * (1 + Math.signum(twoM) * x);
        }
        double root = Math.sqrt(1 + 4 * m * x / 4 + x * x);
        return base + (upper ? 1 : -1) * splitting / 2 * root;
    }

    private static double gI() {
        // g_I in units of mu_B from the nuclear moment of the built-in isotope table (mu_I / (I mu_N) m_e / m_p)
        double moment = DataContext.builtIn().nucleus(Species.parse("Rb-87 I")).magneticMoment().getAsDouble();
        return -moment / 1.5 * PhysicalConstants.ELECTRON_MASS.value() / PhysicalConstants.PROTON_MASS.value();
    }

    @Test
    void groundStatesFollowTheBreitRabiFormula() {
        double gI = gI();
        for (double tesla : new double[] {1e-5, 1e-4, 0.03, 1}) {
            CliTest.Run run = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--state", "5s1/2",
                    "--field-tesla", Double.toString(tesla), "--format", "json");
            assertEquals(0, run.code(), run.err());
            List<JsonNode> rows = rows(run.out());
            assertEquals(8, rows.size(), run.out());
            for (JsonNode r : rows) {
                int twoF = (int) Math.round(2 * Double.parseDouble(r.get("hyperfine_f").asString()));
                int twoM = (int) Math.round(2 * fraction(r.get("m_f").asString()));
                double expected = breitRabi(twoF == 4, twoM, gI, tesla);
                assertEquals(expected, r.get("shift_mhz").asDouble(), 2e-7, tesla + " T " + r);
                // the slope against the closed form's central difference
                double h = tesla * 1e-4;
                double slope = (breitRabi(twoF == 4, twoM, gI, tesla + h) - breitRabi(twoF == 4, twoM, gI, tesla - h))
                        / (2 * h) * 1e6;
                assertEquals(slope, r.get("field_slope_hz_per_t").asDouble(), 1e-5 * Math.abs(slope) + 2e3,
                        tesla + " T " + r);
                assertEquals(tesla, r.get("field_tesla").asDouble(), 0);
            }
        }
    }

    /**
     * The field's uncertainty enters in quadrature as |dE/dB| u(B): the stretched state F = 2, m_F = 2 moves by
     * (g_J / 2 + 3 g_I / 2) mu_B per tesla at any field, about 14.0 MHz per mT.
     */
    @Test
    void aFieldUncertaintyAddsItsSlopeTimesItInQuadrature() {
        CliTest.Run exact = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--state", "5s1/2",
                "--field-tesla", "1e-4", "--format", "json");
        CliTest.Run known = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--state", "5s1/2",
                "--field-tesla", "1e-4", "--field-uncertainty-tesla", "1e-7", "--format", "json");
        assertEquals(0, known.code(), known.err());
        JsonNode a = rows(exact.out()).get(7);
        JsonNode b = rows(known.out()).get(7);
        assertEquals("2", a.get("m_f").asString(), exact.out());
        double slope = (G_J / 2 + 1.5 * gI()) * bohr() * 1e6;
        assertEquals(slope, b.get("field_slope_hz_per_t").asDouble(), 1e-9 * slope);
        assertEquals(Math.hypot(a.get("shift_uncertainty_mhz").asDouble(), slope * 1e-7 / 1e6),
                b.get("shift_uncertainty_mhz").asDouble(), 1e-12, known.out());
        assertEquals(1e-7, b.get("field_uncertainty_tesla").asDouble(), 0);
        assertTrue(known.err().contains("|dE/dB| times the field's"), known.err());
    }

    /**
     * A Rydberg level's hyperfine structure is tiny (Rb-87 60s: A about 0.1 MHz), so 10 G is deep in the
     * Paschen-Back regime: each state is one |m_J m_I> and moves by (g_J m_J + g_I m_I) mu_B per tesla.
     */
    @Test
    void aRydbergLevelIsInThePaschenBackRegimeAtTenGauss() {
        CliTest.Run run = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--state", "60s1/2",
                "--field-tesla", "1e-3", "--format", "json");
        assertEquals(0, run.code(), run.err());
        for (JsonNode r : rows(run.out())) {
            assertTrue(r.get("weight").asDouble() > 0.999, r.toString());
            double mJ = fraction(r.get("m_j").asString());
            double mI = fraction(r.get("m_i").asString());
            double slope = (G_J * mJ + gI() * mI) * bohr() * 1e6;
            assertEquals(slope, r.get("field_slope_hz_per_t").asDouble(), 1e-3 * Math.abs(slope), r.toString());
        }
    }

    /**
     * A Rydberg series' row that gives no B (Rb-87 nP3/2) leaves B's uncertainty out, as the ladders do, so that
     * the A constant's and the field's still count: every state has a finite uncertainty of at least |dE/dB| u(B).
     * Before, the unstated B made every state's uncertainty "-", the field's too. Without the option, no column.
     */
    @Test
    void aRowWithoutBStillGivesEachStateAnUncertainty() {
        CliTest.Run run = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--state", "30p3/2",
                "--field-tesla", "1e-3", "--field-uncertainty-tesla", "1e-7", "--format", "json");
        assertEquals(0, run.code(), run.err());
        List<JsonNode> rows = rows(run.out());
        assertEquals(16, rows.size(), run.out());
        for (JsonNode r : rows) {
            assertTrue(r.get("shift_uncertainty_mhz").isNumber(), r.toString());
            double field = Math.abs(r.get("field_slope_hz_per_t").asDouble()) * 1e-7 / 1e6;
            assertTrue(r.get("shift_uncertainty_mhz").asDouble() >= field * (1 - 1e-12), r.toString());
        }
        CliTest.Run exact = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--state", "30p3/2",
                "--field-tesla", "1e-3", "--format", "json");
        assertTrue(rows(exact.out()).get(0).get("field_uncertainty_tesla") == null, exact.out());
        assertTrue(exact.err().contains("taken as exact"), exact.err());
    }

    @Test
    void theFieldOptionsAreRefusedWhereTheyDoNothingOrAreBad() {
        refused("a listing option", "--n-max has no effect with --state", "levels", "--species", "Rb-87 I",
                "--hyperfine", "--state", "5s1/2", "--field-tesla", "1e-4", "--n-max", "3");
        refused("needs --state", "--field-tesla has no effect without --state", "levels", "--species", "Rb-87 I",
                "--hyperfine", "--field-tesla", "1e-4");
        refused("uncertainty alone", "--field-uncertainty-tesla has no effect without --field-tesla", "levels",
                "--species", "Rb-87 I", "--hyperfine", "--state", "5s1/2", "--field-uncertainty-tesla", "1e-7");
        refused("negative", "--field-tesla must be a field of 0 to 1000 T, got -1", "levels", "--species",
                "Rb-87 I", "--hyperfine", "--state", "5s1/2", "--field-tesla", "-1");
        refused("unit", "--field-tesla takes the field in tesla as a plain number", "levels", "--species",
                "Rb-87 I", "--hyperfine", "--state", "5s1/2", "--field-tesla", "1mT");
        refused("NaN uncertainty", "--field-uncertainty-tesla must be", "levels", "--species", "Rb-87 I",
                "--hyperfine", "--state", "5s1/2", "--field-tesla", "1e-4", "--field-uncertainty-tesla", "NaN");
        refused("no constants", "no hyperfine constants for 9f7/2 of Rb-87 I (measured constants here for 5s1/2, "
                + "5p1/2, 5p3/2, 6s1/2;", "levels", "--species", "Rb-87 I", "--hyperfine", "--state", "9f7/2",
                "--field-tesla", "1e-4");
    }

    private static void refused(String what, String message, String... args) {
        CliTest.Run run = CliTest.run(args);
        assertEquals(2, run.code(), what + ": " + run.out() + run.err());
        assertTrue(run.err().contains(message), what + ": " + run.err());
        assertTrue(run.out().isEmpty(), what + ": " + run.out());
    }

    private static double fraction(String text) {
        int slash = text.indexOf('/');
        return slash < 0 ? Double.parseDouble(text)
                : Double.parseDouble(text.substring(0, slash)) / Double.parseDouble(text.substring(slash + 1));
    }
}
