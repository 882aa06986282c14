package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.pair.PairPotentialResult;
import org.ritzwerk.engine.pair.PairPotentials;
import org.ritzwerk.engine.pair.PairState;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.DataContext;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code rydberg pair-potential}: its rows against the library, its plot, and its refusals. */
class PairPotentialCommandTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();
    private static final AlkaliAtom RB = DataContext.builtIn().alkaliAtom(Species.parse("Rb-87 I"));

    private static List<JsonNode> rows(CliTest.Run run) {
        assertEquals(0, run.code(), run.err());
        List<JsonNode> rows = new ArrayList<>();
        for (String line : run.out().strip().split("\\R")) {
            rows.add(JSON.readTree(line));
        }
        return rows;
    }

    /** Every eigenvalue at each distance is the library's, with its share; the rows come distance by distance. */
    @Test
    void rowsAreTheLibrarysPotentials(@TempDir Path dir) throws IOException {
        Path png = dir.resolve("pair.png");
        List<JsonNode> rows = rows(CliTest.run("rydberg", "pair-potential", "--species", "Rb-87 I", "--state",
                "60s1/2", "--r-min", "3", "--r-max", "6", "--steps", "3", "--n-range", "1", "--l-max", "2",
                "--window", "10", "--angle", "30", "--format", "json", "--plot", png.toString()));
        State s = State.of(60, 0, 1);
        double[] distances = {3e-6, 4e-6, 5e-6, 6e-6};
        PairPotentialResult expected = PairPotentials.of(RB).withBasis(1, 2, 10e9).withAngle(Math.toRadians(30))
                .potentials(new PairState(s, 1, s, 1), distances);
        assertEquals(expected.basisSize() * distances.length, rows.size());
        int k = 0;
        for (int r = 0; r < distances.length; r++) {
            double[] e = expected.energiesHz(r);
            double[] c = expected.shares(r);
            double groupExpected = 0;
            double groupGot = 0;
            for (int i = 0; i < e.length; i++, k++) {
                JsonNode row = rows.get(k);
                assertEquals(distances[r] * 1e6, row.get("distance_um").asDouble(), 1e-12);
                assertEquals(e[i] / 1e9, row.get("energy_ghz").asDouble(), 1e-9 * Math.max(1, Math.abs(e[i] / 1e9)));
                // shares summed over each group of degenerate eigenstates (within 1 kHz): inside such a group
                // rounding may share out the pair state differently, the group's sum is fixed
                groupExpected += c[i];
                groupGot += row.get("share").asDouble();
                if (i == e.length - 1 || e[i + 1] - e[i] > 1e3) {
                    assertEquals(groupExpected, groupGot, 1e-9, "R = " + distances[r] + " m, eigenvalue " + i);
                    groupExpected = 0;
                    groupGot = 0;
                }
            }
        }
        byte[] head = Arrays.copyOf(Files.readAllBytes(png), 4);
        assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G'}, head);
    }

    /**
     * Far apart, the eigenstate holding most of 60S+60S sits at the library's C6 / R^6 (the engine's
     * PairPotentialsTest checks that against the perturbative C6); --min-share keeps only such rows.
     */
    @Test
    void minShareKeepsTheEigenstatesOfThePair() {
        CliTest.Run csv = CliTest.run("rydberg", "pair-potential", "--species", "Rb-87 I", "--state", "60s1/2",
                "--partner", "60s1/2", "--partner-mj", "1/2", "--r-min", "8", "--r-max", "8", "--steps", "1",
                "--min-share", "0.5", "--format", "csv");
        assertEquals(0, csv.code(), csv.err());
        String[] lines = csv.out().strip().split("\\R");
        assertEquals(2, lines.length, csv.out());
        assertTrue(lines[0].startsWith("distance_um,energy_ghz,share"), lines[0]);
        CliTest.Run run = CliTest.run("rydberg", "pair-potential", "--species", "Rb-87 I", "--state", "60s1/2",
                "--r-min", "8", "--r-max", "8", "--steps", "1", "--min-share", "0.5", "--format", "json");
        List<JsonNode> kept = rows(run);
        assertEquals(1, kept.size(), run.out());
        State s = State.of(60, 0, 1);
        PairPotentialResult expected = PairPotentials.of(RB).potentials(new PairState(s, 1, s, 1), new double[] {8e-6});
        assertEquals(expected.targetEnergyHz(0) / 1e9, kept.get(0).get("energy_ghz").asDouble(), 1e-9);
        assertTrue(kept.get(0).get("share").asDouble() >= 0.5);
    }

    @Test
    void badOptionsExitTwoWithOneMessage() {
        String[] base = {"rydberg", "pair-potential", "--species", "Rb-87 I", "--state", "60s1/2"};
        List<String[]> bad = List.of(
                new String[] {"--r-min", "5"},
                new String[] {"--r-min", "5", "--r-max", "4"},
                new String[] {"--r-min", "5", "--r-max", "5", "--steps", "3"},
                new String[] {"--r-min", "0", "--r-max", "5"},
                new String[] {"--r-min", "1", "--r-max", "5", "--angle", "200"},
                new String[] {"--r-min", "1", "--r-max", "5", "--steps", "0"},
                new String[] {"--r-min", "1", "--r-max", "5", "--n-range", "11"},
                new String[] {"--r-min", "1", "--r-max", "5", "--l-max", "-1"},
                new String[] {"--r-min", "1", "--r-max", "5", "--window", "0"},
                new String[] {"--r-min", "1", "--r-max", "5", "--min-share", "1.5"},
                new String[] {"--r-min", "1", "--r-max", "5", "--mj", "3/2"},
                new String[] {"--r-min", "1", "--r-max", "5", "--partner", "60d5/2", "--l-max", "1"},
                new String[] {"--r-min", "1", "--r-max", "5", "--partner", "60p3/2", "--partner-mj", "5/2"},
                new String[] {"--r-min", "1", "--r-max", "5", "--partner", "60x3/2"},
                new String[] {"--r-min", "1", "--r-max", "5", "--n-range", "10", "--l-max", "10", "--window", "1000"});
        for (String[] extra : bad) {
            String[] args = concat(base, extra);
            CliTest.Run run = CliTest.run(args);
            assertEquals(2, run.code(), String.join(" ", args) + "\n" + run.err());
            String[] lines = run.err().strip().split("\\R");
            assertTrue(lines.length == 1 || lines.length == 2 && lines[1].contains("--help"), run.err());
            assertTrue(lines[0].startsWith("ritzwerk rydberg pair-potential"), run.err());
            assertFalse(run.err().contains("Exception") || run.err().contains("\tat "), run.err());
        }
    }

    /** The values that break naive readers: exit 0 or 2, never NaN or Infinity, never a stack trace. */
    @Test
    void numericOptionsHoldTheContract() {
        String[] base = {"rydberg", "pair-potential", "--species", "Rb-87 I", "--state", "40s1/2", "--n-range", "0",
            "--l-max", "1", "--window", "5", "--steps", "1"};
        String[][] options = {{"--r-min", "--r-max", "2"}, {"--r-max", "--r-min", "1"}, {"--angle", "--r-min", "1",
            "--r-max", "2"}, {"--window", "--r-min", "1", "--r-max", "2"}, {"--min-share", "--r-min", "1", "--r-max",
            "2"}};
        for (String[] option : options) {
            for (String value : new String[] {"NaN", "Infinity", "-Infinity", "-1", "0", "1e400", "4.9e-324", "x"}) {
                String[] args = concat(concat(base, Arrays.copyOfRange(option, 1, option.length)),
                        new String[] {option[0], value});
                CliTest.Run run = CliTest.run(args);
                String all = String.join(" ", args);
                assertTrue(run.code() == 0 || run.code() == 2, all + "\n" + run.err());
                assertFalse(run.out().contains("NaN") || run.out().contains("Infinity"), all + "\n" + run.out());
                assertFalse(run.err().contains("\tat "), all + "\n" + run.err());
            }
        }
    }

    private static String[] concat(String[] a, String[] b) {
        String[] all = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, all, a.length, b.length);
        return all;
    }
}
