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

    /**
     * Hyperfine energy of level F (MHz): A K/2 + B (3K(K+1)/2 - 2I(I+1)J(J+1)) / (4I(2I-1)J(2J-1)),
     * K = F(F+1) - I(I+1) - J(J+1) (the Casimir formula; Arimondo, Inguscio and Violino, Rev. Mod. Phys. 49, 31
     * (1977), from memory; common practice), computed here apart from the library's.
     */
    private static double casimir(double a, double b, double i, double j, double f) {
        double k = f * (f + 1) - i * (i + 1) - j * (j + 1);
        double e = a * k / 2;
        if (b != 0) {
            e += b * (1.5 * k * (k + 1) - 2 * i * (i + 1) * j * (j + 1)) / (4 * i * (2 * i - 1) * j * (2 * j - 1));
        }
        return e;
    }

    @Test
    void caesiumSevenPSplitsWithItsMeasuredConstants() {
        // 7p3/2: A = 16.605(6) MHz, B = -0.15(3) MHz (E. Arimondo, M. Inguscio and P. Violino, Rev. Mod. Phys. 49,
        // 31 (1977), from memory); I = 7/2. The n*^-3-scaled Rydberg-range row (Song et al. 2024) gave A = 18.17 MHz,
        // B = -2.13 MHz and put F' = 5 7.7 MHz too high.
        CliTest.Run run = CliTest.run("levels", "--species", "Cs-133 I", "--hyperfine", "--state", "7p3/2",
                "--format", "json");
        assertEquals(0, run.code(), run.err());
        Map<String, JsonNode> f = byF(run.out());
        assertEquals(4, f.size(), run.out());
        for (int upper = 3; upper <= 5; upper++) {
            double interval = f.get(String.valueOf(upper)).get("shift_mhz").asDouble()
                    - f.get(String.valueOf(upper - 1)).get("shift_mhz").asDouble();
            double expected = casimir(16.605, -0.15, 3.5, 1.5, upper) - casimir(16.605, -0.15, 3.5, 1.5, upper - 1);
            assertEquals(expected, interval, 1e-6, "F' = " + upper + " - " + (upper - 1) + ": " + run.out());
        }
        // F' = 5 - 4 = 5A + (5/7)B = 82.918 MHz
        assertEquals(82.918, f.get("5").get("shift_mhz").asDouble() - f.get("4").get("shift_mhz").asDouble(), 1e-3);
        // F' = 5 lies 5.25 A + B/4 = 87.14 MHz above the centroid (the scaled row put it at 94.88 MHz)
        assertEquals(casimir(16.605, -0.15, 3.5, 1.5, 5), f.get("5").get("shift_mhz").asDouble(), 1e-6, run.out());
        String source = f.get("5").get("constants").asString();
        assertTrue(source.contains("Rev. Mod. Phys. 49") && !source.contains("n*^-3"), source);
        // 7p1/2: A = 94.38(6) MHz (Compact 459 nm Cs cell optical frequency standard, arXiv:2206.09409, read in the
        // abstract): F' = 4 - 3 = 4A = 377.52 MHz (the scaled row gave 391.7 MHz)
        CliTest.Run half = CliTest.run("levels", "--species", "Cs-133 I", "--hyperfine", "--state", "7p1/2",
                "--format", "json");
        assertEquals(0, half.code(), half.err());
        Map<String, JsonNode> h = byF(half.out());
        assertEquals(4 * 94.38, h.get("4").get("shift_mhz").asDouble() - h.get("3").get("shift_mhz").asDouble(), 1e-6);
        assertTrue(h.get("4").get("constants").asString().contains("arXiv:2206.09409"), half.out());
        // the ladder through 7p3/2 takes the same F' levels: step 1 from F = 4 to F' = 5 and to F' = 4
        CliTest.Run ladder = CliTest.run("lines", "--species", "Cs-133 I", "--ladder", "6s1/2,7p3/2,60s1/2",
                "--hyperfine", "--format", "json");
        assertEquals(0, ladder.code(), ladder.err());
        double to5 = Double.NaN;
        double to4 = Double.NaN;
        for (String line : ladder.out().strip().split("\\R")) {
            JsonNode row = JSON.readTree(line);
            if (row.get("lower_f").asString().equals("4") && row.get("intermediate_f").asString().equals("5")) {
                to5 = row.get("first_offset_mhz").asDouble();
            } else if (row.get("lower_f").asString().equals("4") && row.get("intermediate_f").asString().equals("4")) {
                to4 = row.get("first_offset_mhz").asDouble();
            }
        }
        assertEquals(82.918, to5 - to4, 1e-3, ladder.out());
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
        // u(A) carries the n*^-3 law's own error: 60s is 53 n above the measured 7s, so the s series' cap 0.0995 of
        // A (RydbergHyperfineScalingLawTest: Cs 6s - 7s); no B for j = 1/2: null
        assertEquals(0.0995148 * a, f.get("2").get("a_uncertainty_mhz").asDouble(), 1e-6 * a, run.out());
        assertTrue(f.get("2").get("b_uncertainty_mhz").isNull(), run.out());
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
            {"--species", "Rb-87 I", "--hyperfine", "--state", "2001s1/2"},
            {"--species", "Rb-87 I", "--hyperfine", "--state", "0s1/2"},
            {"--species", "Rb-87 I", "--hyperfine", "--n-max", "2001"},
        };
        String[] expected = {"--state: no hyperfine constants for 60f7/2 of Rb-87 I", "--state has no effect",
            "--state: cannot read state", "--state: ", "has no effect",
            "--state: 2001s 2S1/2 has n = 2001; states are computed for n up to 2000", "--state: cannot read state",
            "--n-max must be 1 to 2000"};
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
