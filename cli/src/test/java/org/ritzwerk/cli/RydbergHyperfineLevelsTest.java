package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.refdata.DataContext;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code levels --hyperfine --state}: the F levels of one alkali level, Rydberg levels included. */
class RydbergHyperfineLevelsTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    private static Map<String, JsonNode> byF(String out) {
        Map<String, JsonNode> rows = new HashMap<>();
        for (String line : out.strip().split("\\R")) {
            JsonNode row = JSON.readTree(line);
            rows.put(row.get("hyperfine_f").asString(), row);
        }
        return rows;
    }

    @Test
    void caesiumSevenSSplitsAsMeasured() {
        CliTest.Run run = CliTest.run("levels", "--species", "Cs-133 I", "--hyperfine", "--state", "7s1/2",
                "--format", "json");
        assertEquals(0, run.code(), run.err());
        Map<String, JsonNode> f = byF(run.out());
        assertEquals(2, f.size(), run.out());
        // G. Yang et al., arXiv:1601.02749 (2016), read in the abstract: the 7S1/2 hyperfine splitting
        // 2183.273(62) MHz; to 0.1 MHz.
        double split = f.get("4").get("shift_mhz").asDouble() - f.get("3").get("shift_mhz").asDouble();
        assertEquals(2183.273, split, 0.1, run.out());
        // the shifts are about the hyperfine-free level: sum over F of (2F + 1) shift = 0
        double weighted = 7 * f.get("3").get("shift_mhz").asDouble() + 9 * f.get("4").get("shift_mhz").asDouble();
        assertEquals(0, weighted, 1e-6, run.out());
        assertEquals(9, f.get("4").get("g").asInt());
    }

    @Test
    void aRydbergLevelSplitsWithItsScaledConstant() {
        CliTest.Run run = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--state", "60s1/2",
                "--format", "json");
        assertEquals(0, run.code(), run.err());
        Map<String, JsonNode> f = byF(run.out());
        DataContext context = DataContext.builtIn();
        double a = context.rydbergHyperfine().constants(context, Species.parse("Rb-87 I"), State.of(60, 0, 1))
                .orElseThrow().aHertz() / 1e6;
        // I = 3/2, J = 1/2: F = 2 lies A (I + 1/2) = 2A above F = 1 (Casimir formula; common practice)
        double split = f.get("2").get("shift_mhz").asDouble() - f.get("1").get("shift_mhz").asDouble();
        assertEquals(2 * a, split, 1e-6, run.out());
        assertEquals(a, f.get("2").get("a_mhz").asDouble(), 1e-9);
        // A n*^3 of the 7s row is 18.34 GHz (rydberg-hyperfine.csv); n* of 60s is about 56.87
        assertEquals(18.34e3 / Math.pow(56.87, 3), a, 0.02 * a);
        assertTrue(f.get("2").get("constants").asString().contains("n*^-3"), run.out());
        // text and CSV carry the same rows
        CliTest.Run csv = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--state", "60s1/2",
                "--format", "csv");
        assertEquals(0, csv.code(), csv.err());
        assertEquals(3, csv.out().strip().split("\\R").length, csv.out());
        CliTest.Run text = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--state", "60s1/2");
        assertEquals(0, text.code(), text.err());
    }

    @Test
    void theLevelListSplitsRydbergLevelsToo() {
        CliTest.Run run = CliTest.run("levels", "--species", "Cs-133 I", "--n-max", "9", "--l-max", "0",
                "--hyperfine", "--format", "json");
        assertEquals(0, run.code(), run.err());
        int nineS = 0;
        for (String line : run.out().strip().split("\\R")) {
            JsonNode row = JSON.readTree(line);
            nineS += row.get("label").asString().equals("9s 2S1/2") && !row.get("hyperfine_f").isNull() ? 1 : 0;
        }
        assertEquals(2, nineS, run.out());
    }

    @Test
    void aLevelWithoutConstantsOrABadOptionIsOneLineExitTwo() {
        String[][] cases = {
            {"--species", "Rb-87 I", "--hyperfine", "--state", "60f7/2"},
            {"--species", "Rb-87 I", "--state", "60s1/2"},
            {"--species", "Rb-87 I", "--hyperfine", "--state", "60x1/2"},
            {"--species", "Rb-87 I", "--hyperfine", "--state", "3s1/2"},
            {"--species", "H", "--hyperfine", "--state", "2s1/2"},
        };
        String[] expected = {"--state: no hyperfine constants for 60f7/2 of Rb-87 I", "--state has no effect",
            "--state: cannot read state", "--state: ", "has no effect"};
        for (int i = 0; i < cases.length; i++) {
            String[] args = new String[cases[i].length + 1];
            args[0] = "levels";
            System.arraycopy(cases[i], 0, args, 1, cases[i].length);
            CliTest.Run run = CliTest.run(args);
            assertEquals(2, run.code(), String.join(" ", args) + ": " + run.err());
            assertTrue(run.err().contains(expected[i]), run.err());
            assertEquals(1, run.err().strip().split("\\R").length, run.err());
            assertTrue(run.out().isEmpty(), run.out());
        }
    }
}
