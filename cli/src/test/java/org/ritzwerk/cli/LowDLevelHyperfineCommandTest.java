package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The low d levels of ladder and two-photon excitation with measured hyperfine constants (issue 17), from the
 * command line: {@code levels --hyperfine --state} and {@code lines --ladder ... --hyperfine}.
 */
class LowDLevelHyperfineCommandTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    private static List<JsonNode> rows(String out) {
        List<JsonNode> rows = new ArrayList<>();
        for (String line : out.strip().split("\\R")) {
            rows.add(JSON.readTree(line));
        }
        return rows;
    }

    private static Map<String, JsonNode> byF(String out) {
        Map<String, JsonNode> rows = new HashMap<>();
        for (JsonNode row : rows(out)) {
            rows.put(row.get("hyperfine_f").asString(), row);
        }
        return rows;
    }

    /** The Casimir formula (MHz), written apart from the library's; see {@code RydbergHyperfineLevelsTest}. */
    private static double casimir(double a, double b, double i, double j, double f) {
        double k = f * (f + 1) - i * (i + 1) - j * (j + 1);
        return a * k / 2 + b * (1.5 * k * (k + 1) - 2 * i * (i + 1) * j * (j + 1))
                / (4 * i * (2 * i - 1) * j * (2 * j - 1));
    }

    /**
     * Rb-85 4d3/2: A = 7.419(35) MHz, B = 4.19(19) MHz (A. Duspayev and G. Raithel, arXiv:2305.00265 (2023), read
     * in the abstract); I = 5/2, F = 1 to 4. Before, the command refused the level (no hyperfine constants).
     */
    @Test
    void rubidium85FourD32PrintsItsFourFLevels() {
        CliTest.Run run = CliTest.run("levels", "--species", "Rb-85 I", "--hyperfine", "--state", "4d3/2",
                "--format", "json");
        assertEquals(0, run.code(), run.err());
        Map<String, JsonNode> f = byF(run.out());
        assertEquals(4, f.size(), run.out());
        for (int upper = 1; upper <= 4; upper++) {
            JsonNode row = f.get(String.valueOf(upper));
            assertEquals(casimir(7.419, 4.19, 2.5, 1.5, upper), row.get("shift_mhz").asDouble(), 1e-5, run.out());
            assertEquals(7.419, row.get("a_mhz").asDouble(), 1e-9);
            assertEquals(0.035, row.get("a_uncertainty_mhz").asDouble(), 1e-9);
            assertEquals(4.19, row.get("b_mhz").asDouble(), 1e-9);
            assertEquals(0.19, row.get("b_uncertainty_mhz").asDouble(), 1e-9);
            assertTrue(row.get("constants").asString().contains("arXiv:2305.00265"), row.toString());
        }
        // 4A + 0.8B between F = 4 and F = 3 (hand)
        assertEquals(33.028, f.get("4").get("shift_mhz").asDouble() - f.get("3").get("shift_mhz").asDouble(), 2e-5);
    }

    /**
     * The measurement's ladder 5s1/2 -> 5p1/2 -> 4d3/2: twelve F -> F' -> F'' paths; the second steps from F' = 3
     * to F'' = 4 and 3 differ by the 4d3/2 interval 4A + 0.8B = 33.028 MHz of the published constants.
     */
    @Test
    void theFourD32LadderPrintsItsFPaths() {
        CliTest.Run run = CliTest.run("lines", "--species", "Rb-85 I", "--ladder", "5s1/2,5p1/2,4d3/2", "--hyperfine",
                "--format", "json");
        assertEquals(0, run.code(), run.err());
        List<JsonNode> paths = rows(run.out());
        assertEquals(12, paths.size(), run.out());
        Map<String, Double> second = new HashMap<>();
        for (JsonNode p : paths) {
            second.put(p.get("lower_f").asString() + p.get("intermediate_f").asString() + p.get("upper_f").asString(),
                    p.get("second_frequency_hz").asDouble());
        }
        assertEquals(33.028, (second.get("234") - second.get("233")) / 1e6, 1e-3, second.toString());
    }

    /**
     * Cs-133 6d5/2: A = -4.66(4) MHz, B = 0.9(6) MHz (A. Kortyna, N. Masluk and T. Bragdon, APS DAMOP 2005 meeting
     * abstract D6.8, read in the abstract); I = 7/2, F = 1 to 6, inverted. And the 917 nm ladder through it.
     */
    @Test
    void caesiumSixD52PrintsItsSixFLevelsAndLadder() {
        CliTest.Run run = CliTest.run("levels", "--species", "Cs-133 I", "--hyperfine", "--state", "6d5/2",
                "--format", "json");
        assertEquals(0, run.code(), run.err());
        Map<String, JsonNode> f = byF(run.out());
        assertEquals(6, f.size(), run.out());
        for (int upper = 1; upper <= 6; upper++) {
            JsonNode row = f.get(String.valueOf(upper));
            assertEquals(casimir(-4.66, 0.9, 3.5, 2.5, upper), row.get("shift_mhz").asDouble(), 1e-5, run.out());
            assertTrue(row.get("constants").asString().contains("DAMOP 2005"), row.toString());
        }
        CliTest.Run d32 = CliTest.run("levels", "--species", "Cs-133 I", "--hyperfine", "--state", "6d3/2",
                "--format", "json");
        assertEquals(0, d32.code(), d32.err());
        assertEquals(4, byF(d32.out()).size(), d32.out());
        CliTest.Run ladder = CliTest.run("lines", "--species", "Cs-133 I", "--ladder", "6s1/2,6p3/2,6d5/2",
                "--hyperfine", "--format", "json");
        assertEquals(0, ladder.code(), ladder.err());
        assertEquals(18, rows(ladder.out()).size(), ladder.out());
    }
}
