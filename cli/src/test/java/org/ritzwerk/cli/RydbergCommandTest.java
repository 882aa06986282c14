package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.pair.PairInteractions;
import org.ritzwerk.engine.pair.PairState;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.stark.PolarizabilityCalculator;
import org.ritzwerk.refdata.DataContext;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code rydberg}: each subcommand's JSON against the library, and its refusals. */
class RydbergCommandTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();
    private static final AlkaliAtom RB = DataContext.builtIn().alkaliAtom(Species.parse("Rb-87 I"));

    private static JsonNode only(CliTest.Run run) {
        assertEquals(0, run.code(), run.err());
        String[] lines = run.out().strip().split("\\R");
        assertEquals(1, lines.length, run.out());
        return JSON.readTree(lines[0]);
    }

    @Test
    void polarizabilityIsTheLibrarysValue() {
        JsonNode row = only(CliTest.run("rydberg", "polarizability", "--species", "Rb-87 I", "--state", "60s1/2",
                "--format", "json"));
        double expected = PolarizabilityCalculator.of(RB).compute(State.of(60, 0, 1)).scalarAu();
        assertEquals(expected, row.get("alpha0_au").asDouble(), 1e-9 * expected);
        assertEquals(0, row.get("alpha2_au").asDouble());
    }

    @Test
    void pairGivesC6WithItsChannelAndTheBlockadeRadius() {
        JsonNode row = only(CliTest.run("rydberg", "pair", "--species", "Rb-87 I", "--state", "70s1/2", "--rabi", "1",
                "--format", "json"));
        State s = State.of(70, 0, 1);
        var c6 = PairInteractions.of(RB).c6(new PairState(s, 1, s, 1));
        assertEquals(c6.c6GHzUm6(), row.get("c6_ghz_um6").asDouble(), 1e-9 * c6.c6GHzUm6());
        assertEquals(c6.blockadeRadiusMetres(2 * Math.PI * 1e6) * 1e6, row.get("blockade_radius_um").asDouble(), 1e-9);
        assertEquals("69p3/2(m=1/2) 70p3/2(m=1/2)", row.get("strongest_channel").asString());
        JsonNode c3 = only(CliTest.run("rydberg", "pair", "--species", "Rb-87 I", "--state", "60s1/2", "--partner",
                "60p3/2", "--partner-mj", "3/2", "--format", "json"));
        PairState ket = new PairState(State.of(60, 0, 1), 1, State.of(60, 1, 3), 3);
        assertEquals(PairInteractions.of(RB).c3Au(ket.swapped(), ket), c3.get("c3_au").asDouble(), 1e-3);
    }

    @Test
    void microwaveFieldAndSplittingAreInverse() {
        JsonNode field = only(CliTest.run("rydberg", "microwave", "--species", "Rb-87 I", "--state", "50d5/2", "--to",
                "51p3/2", "--splitting", "10", "--format", "json"));
        double volts = field.get("field_v_per_m").asDouble();
        JsonNode back = only(CliTest.run("rydberg", "microwave", "--species", "Rb-87 I", "--state", "50d5/2", "--to",
                "51p3/2", "--field", Double.toString(volts), "--format", "json"));
        assertEquals(10, back.get("splitting_mhz").asDouble(), 1e-9);
        assertEquals("0", back.get("q").asString());
        CliTest.Run near = CliTest.run("rydberg", "microwave", "--species", "Rb-87 I", "--state", "50d5/2", "--near", "17",
                "--window", "1", "--format", "json");
        assertEquals(0, near.code(), near.err());
        assertEquals("51p3/2", JSON.readTree(near.out().strip().split("\\R")[0]).get("to").asString(), near.out());
    }

    @Test
    void starkMapRowsAndPlot(@TempDir Path dir) throws IOException {
        Path png = dir.resolve("map.png");
        CliTest.Run run = CliTest.run("rydberg", "stark-map", "--species", "Rb-87 I", "--state", "40d5/2", "--n-min", "39",
                "--n-max", "41", "--l-max", "6", "--field-max", "1", "--steps", "2", "--window", "5", "--format", "json",
                "--plot", png.toString());
        assertEquals(0, run.code(), run.err());
        int atZero = 0;
        for (String line : run.out().strip().split("\\R")) {
            JsonNode row = JSON.readTree(line);
            if (row.get("field_v_per_cm").asDouble() == 0 && row.get("share").asDouble() > 0.5) {
                atZero++;
                assertEquals(0, row.get("energy_ghz").asDouble(), 1e-9, line);
                assertEquals(1, row.get("share").asDouble(), 1e-9, line);
            }
        }
        assertEquals(1, atZero, run.out());
        byte[] head = Arrays.copyOf(Files.readAllBytes(png), 4);
        assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G'}, head);
    }

    @Test
    void badOptionsExitTwoWithOneMessage() {
        List<String[]> bad = List.of(
                new String[] {"rydberg", "stark-map", "--species", "Rb-87 I", "--state", "50s1/2"},
                new String[] {"rydberg", "stark-map", "--species", "Rb-87 I", "--state", "50d5/2", "--mj", "7/2",
                    "--field-max", "1"},
                new String[] {"rydberg", "stark-map", "--species", "Rb-87 I", "--state", "50d5/2", "--mj", "x",
                    "--field-max", "1"},
                new String[] {"rydberg", "stark-map", "--species", "Rb-87 I", "--state", "50d5/2", "--field-max", "1",
                    "--n-min", "52"},
                new String[] {"rydberg", "pair", "--species", "Rb-87 I", "--state", "70s1/2", "--angle", "200"},
                new String[] {"rydberg", "pair", "--species", "Rb-87 I", "--state", "70s1/2", "--partner-mj", "1/2"},
                new String[] {"rydberg", "pair", "--species", "Rb-87 I", "--state", "70s1/2", "--partner", "70d5/2"},
                new String[] {"rydberg", "pair", "--species", "H I", "--state", "70s1/2"},
                new String[] {"rydberg", "pair", "--species", "Rb-87 I", "--state", "70q1/2"},
                new String[] {"rydberg", "microwave", "--species", "Rb-87 I", "--state", "50d5/2", "--to", "51p3/2"},
                new String[] {"rydberg", "microwave", "--species", "Rb-87 I", "--state", "50d5/2", "--to", "51p1/2",
                    "--field", "1"},
                new String[] {"rydberg", "microwave", "--species", "Rb-87 I", "--state", "50d5/2", "--to", "51p3/2",
                    "--field", "1", "--window", "2"},
                new String[] {"rydberg", "polarizability", "--species", "Rb-87 I", "--state", "3s1/2"});
        for (String[] args : bad) {
            CliTest.Run run = CliTest.run(args);
            assertEquals(2, run.code(), String.join(" ", args) + "\n" + run.err());
            String[] lines = run.err().strip().split("\\R");
            // one line naming the problem; picocli's own usage errors add a line pointing to --help
            assertTrue(lines.length == 1 || lines.length == 2 && lines[1].contains("--help"), run.err());
            assertTrue(lines[0].startsWith("ritzwerk rydberg "), run.err());
            assertFalse(run.err().contains("Exception") || run.err().contains("\tat "), run.err());
        }
    }

    /** Every numeric option with the values that break naive readers: exit 0 or 2, never NaN or Infinity. */
    @Test
    void numericOptionsHoldTheContract() {
        String[][] cases = {
            {"stark-map", "--field-max", "--state", "40s1/2", "--n-min", "39", "--n-max", "40", "--l-max", "3"},
            {"stark-map", "--window", "--state", "40s1/2", "--n-min", "39", "--n-max", "40", "--l-max", "3",
                "--field-max", "1", "--steps", "1"},
            {"stark-map", "--steps", "--state", "40s1/2", "--n-min", "39", "--n-max", "40", "--l-max", "3",
                "--field-max", "1"},
            {"pair", "--angle", "--state", "40s1/2"}, {"pair", "--rabi", "--state", "40s1/2"},
            {"pair", "--range", "--state", "40s1/2"}, {"polarizability", "--range", "--state", "40s1/2"},
            {"microwave", "--field", "--state", "40d5/2", "--to", "41p3/2"},
            {"microwave", "--splitting", "--state", "40d5/2", "--to", "41p3/2"},
            {"microwave", "--near", "--state", "40d5/2"}};
        for (String[] c : cases) {
            for (String value : new String[] {"NaN", "Infinity", "-Infinity", "-1", "0", "1e400", "4.9e-324",
                "2147483648", "x"}) {
                String[] args = new String[c.length + 5];
                args[0] = "rydberg";
                args[1] = c[0];
                args[2] = "--species";
                args[3] = "Rb-87 I";
                System.arraycopy(c, 2, args, 4, c.length - 2);
                args[c.length + 2] = c[1];
                args[c.length + 3] = value;
                args = Arrays.copyOf(args, c.length + 4);
                CliTest.Run run = CliTest.run(args);
                String all = String.join(" ", args);
                assertTrue(run.code() == 0 || run.code() == 2, all + "\n" + run.err());
                assertFalse(run.out().contains("NaN") || run.out().contains("Infinity"), all + "\n" + run.out());
                assertFalse(run.err().contains("\tat "), all + "\n" + run.err());
            }
        }
    }

    /** A state beyond n = 2000 (the range of levels and lines) is refused by its n, however many digits it has. */
    @Test
    void statesBeyondTheComputedRangeAreRefusedByTheirN() {
        for (String state : new String[] {"2001s1/2", "10000s1/2"}) {
            CliTest.Run run = CliTest.run("rydberg", "polarizability", "--species", "Rb-87 I", "--state", state);
            assertEquals(2, run.code(), state);
            assertTrue(run.err().contains("--state: " + state.substring(0, state.indexOf('s')) + "s 2S1/2 has n = "
                    + state.substring(0, state.indexOf('s')) + "; states are computed for n up to 2000"), run.err());
        }
    }

    /**
     * An Autler-Townes splitting far above the transition frequency (1 V/m on a 0.4 MHz transition
     * at n = 2000) is no physical figure: the command says so; an ordinary one carries no note.
     */
    @Test
    void aSplittingBeyondTheTwoLevelPictureIsNoted() {
        CliTest.Run wild = CliTest.run("rydberg", "microwave", "--species", "Rb-87 I", "--state", "2000s1/2", "--to",
                "2000p3/2", "--field", "1");
        assertEquals(0, wild.code(), wild.err());
        assertTrue(wild.err().contains("times the transition frequency; the two-level, rotating-wave picture"),
                wild.err());
        CliTest.Run usual = CliTest.run("rydberg", "microwave", "--species", "Rb-87 I", "--state", "51p3/2", "--to",
                "50d5/2", "--splitting", "10");
        assertEquals(0, usual.code(), usual.err());
        assertTrue(!usual.err().contains("note:"), usual.err());
    }

    /**
     * A pair state that shares its energy and M with other pair states (two Rb 60d5/2 with m = 1/2) gets a note
     * naming them, with the eigenvalues of the manifold's C6 matrix and the blockade radius range (an atom-sensor
     * review: the printed C6 -331.29 GHz um^6 was the diagonal element, the potentials' C6 about -506, -140 and
     * -34, as pair-potential shows at 10 um); a pair alone in its manifold (70s1/2, m = 1/2) gets none.
     */
    @Test
    void aPairStateThatMixesInItsDegenerateManifoldIsSaid() {
        CliTest.Run d = CliTest.run("rydberg", "pair", "--species", "Rb-87 I", "--state", "60d5/2", "--rabi", "1");
        assertEquals(0, d.code(), d.err());
        assertTrue(d.err().contains("note: 60d5/2(m=1/2) 60d5/2(m=1/2) is degenerate with 4 other pair states of "
                + "the same M") && d.err().contains("60d5/2(m=5/2) 60d5/2(m=-3/2)")
                && d.err().contains("see rydberg pair-potential"), d.err());
        java.util.regex.Matcher c6 = java.util.regex.Pattern.compile("C6 = (-?[0-9.]+) \\(share ([0-9.]+)\\), "
                + "(-?[0-9.]+) \\(share ([0-9.]+)\\), (-?[0-9.]+) \\(share ([0-9.]+)\\) GHz um\\^6").matcher(d.err());
        assertTrue(c6.find(), d.err());
        double mean = 0;
        for (int k = 0; k < 3; k++) {
            mean += Double.parseDouble(c6.group(2 * k + 1)) * Double.parseDouble(c6.group(2 * k + 2));
        }
        // the share-weighted mean of the eigenvalues is the printed C6 (to the note's rounding: shares to 1e-4)
        assertEquals(-331.293, mean, 0.1);
        assertEquals(-506.2, Double.parseDouble(c6.group(1)), 1);
        assertEquals(-34.2, Double.parseDouble(c6.group(5)), 0.5);
        assertTrue(d.err().contains("the blockade radius for those lies from 5.69") && d.err().contains("to 8.92"),
                d.err());
        CliTest.Run stretched = CliTest.run("rydberg", "pair", "--species", "Rb-87 I", "--state", "60d5/2", "--mj",
                "5/2");
        assertEquals(0, stretched.code(), stretched.err());
        assertFalse(stretched.err().contains("degenerate"), stretched.err());
        CliTest.Run s = CliTest.run("rydberg", "pair", "--species", "Rb-87 I", "--state", "70s1/2");
        assertEquals(0, s.code(), s.err());
        assertFalse(s.err().contains("degenerate"), s.err());
    }
}
