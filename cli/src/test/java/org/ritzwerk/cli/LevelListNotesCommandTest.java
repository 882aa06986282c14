package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code lines} and {@code levels} say what a level list leaves out instead of dropping it
 * silently: levels whose labels give no parity or J, lines without A under --min-a, and options
 * that have no effect on a level list.
 */
class LevelListNotesCommandTest {

    /** Invented Ne I and Ca I levels (only the notes are checked): jK labels and free text. */
    private static Path file(Path dir) throws IOException {
        Path file = dir.resolve("levels.csv");
        StringBuilder rows = new StringBuilder("Ne I,2p6 1S0,0,0,0,\nNe I,2p5.3s 1P1,134459.2871,0.001,1,\n");
        for (int k = 1; k <= 7; k++) {
            rows.append("Ne I,2p5(2P3/2)3s [3/2]").append(k).append(',').append(134000 + k).append(",0.001,1,\n");
        }
        rows.append("Ne I,mystery level,140000,0.01,,\n");
        Files.writeString(file, "# ritzwerk-levels 1\n# id: my-ne\n# title: test\n# source: invented for a test\n"
                + "# provenance: from-memory\n# version: 1\n# energy-unit: cm-1\n"
                + "species,label,energy,uncertainty,j,note\n" + rows);
        return file;
    }

    @Test
    void levelsThatGiveNoLinesAreNamedWithTheReason(@TempDir Path dir) throws IOException {
        String data = file(dir).toString();
        for (String[] args : new String[][] {
            {"lines", "--data", data, "--species", "Ne I", "--from", "50 nm", "--to", "100 nm"},
            {"levels", "--data", data, "--species", "Ne I"}}) {
            CliTest.Run run = CliTest.run(args);
            assertEquals(0, run.code(), run.err());
            // 8 of 10 levels: the 7 jK labels (no parity) and 'mystery level' (no parity, no J); 5 named
            assertTrue(run.err().contains("note: Ne I: 8 of 10 level(s) give no lines"), run.err());
            assertTrue(run.err().contains("'2p5(2P3/2)3s [3/2]1' (no parity)"), run.err());
            assertTrue(run.err().contains(" and 3 more"), run.err());
            assertFalse(run.err().contains("2p5.3s 1P1"), "a level that gives lines is not named: " + run.err());
        }
        CliTest.Run lines = CliTest.run("lines", "--data", data, "--species", "Ne I", "--from", "50 nm",
                "--to", "100 nm");
        // 2p5.3s 1P1 (odd, J = 1, singlet) - 2p6 1S0 (even, J = 0): 1e7 / 134459.2871 = 74.37 nm, the one line
        assertTrue(lines.out().contains("2p5.3s 1P1 - 2p6 1S0"), lines.out());
    }

    @Test
    void aMinimumAOnLinesWithoutASaysHowManyItLeavesOut() {
        // levels-sr-i has no companion list of A values: every line in the window has none
        CliTest.Run all = CliTest.run("lines", "--species", "Sr I", "--from", "400nm", "--to", "700nm",
                "--format", "csv");
        assertEquals(0, all.code(), all.err());
        long count = all.out().strip().lines().count() - 1;
        assertTrue(count > 10, all.out());
        CliTest.Run run = CliTest.run("lines", "--species", "Sr I", "--from", "400nm", "--to", "700nm", "--min-a", "1");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.err().contains(count + " of " + count + " Sr I line(s) in the window are left out for having"
                + " no Einstein A (no line of its level list has one)"), run.err());
        // He I has A values for its lines (lines-he-i): none is left out for want of one in 580-600 nm
        CliTest.Run helium = CliTest.run("lines", "--species", "He I", "--from", "580nm", "--to", "600nm",
                "--min-a", "1");
        assertEquals(0, helium.code(), helium.err());
        assertFalse(helium.err().contains("no Einstein A"), helium.err());
    }

    @Test
    void optionsWithoutEffectOnALevelListAreRefusedInItsWords() {
        CliTest.Run levels = CliTest.run("levels", "--species", "He I", "--n-max", "3");
        assertEquals(2, levels.code(), levels.out());
        assertTrue(levels.err().contains("--n-max has no effect for species with a level list [He I]"), levels.err());
        CliTest.Run lines = CliTest.run("lines", "--species", "He I", "--from", "400nm", "--to", "700nm",
                "--n-max", "3");
        assertEquals(2, lines.code(), lines.out());
        assertTrue(lines.err().contains("--n-max has no effect for species with a level list [He I]"), lines.err());
        CliTest.Run multiplets = CliTest.run("lines", "--species", "He I", "--from", "400nm", "--to", "700nm",
                "--multiplets");
        assertEquals(2, multiplets.code(), multiplets.out());
        assertTrue(multiplets.err().contains("--multiplets has no effect for species with a level list [He I]"),
                multiplets.err());
        assertFalse(multiplets.err().contains("alkali"), multiplets.err());
        // with a one-electron ion too, --n-max limits that ion's lines; a note says the list's are not limited
        CliTest.Run mixed = CliTest.run("lines", "--species", "He I,H I", "--from", "400nm", "--to", "500nm",
                "--n-max", "5");
        assertEquals(0, mixed.code(), mixed.err());
        assertTrue(mixed.err().contains("not those of [He I]"), mixed.err());
        assertTrue(mixed.out().contains("1s7d 1D2 - 1s2p 1P1"), "He I n = 7 lines stay: " + mixed.out());
    }

    @Test
    void synthAndIdentifyRefuseNMaxForALevelListAlone(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir)
            throws java.io.IOException {
        // a review found both accepting --n-max 5 for He I and drawing the n = 6-10 lines all the same
        CliTest.Run synth = CliTest.run("synth", "--species", "He I", "--from", "380 nm", "--to", "500 nm",
                "--temperature", "20000", "--n-max", "5", "--no-noise", "--out", dir.resolve("he.csv").toString());
        assertEquals(2, synth.code(), synth.out());
        assertTrue(synth.err().contains("--n-max has no effect for species with a level list [He I]"), synth.err());
        java.nio.file.Path peaks = dir.resolve("peaks.csv");
        java.nio.file.Files.writeString(peaks, "# ritzwerk-peaks 1\n# id: he\n# title: invented\n# source: invented"
                + "\n# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: air\nposition,uncertainty\n"
                + "587.5621,0.002\n667.8152,0.002\n");
        CliTest.Run identify = CliTest.run("identify", peaks.toString(), "--species", "He I", "--n-max", "5");
        assertEquals(2, identify.code(), identify.out());
        assertTrue(identify.err().contains("--n-max has no effect for species with a level list [He I]"),
                identify.err());
        CliTest.Run mixed = CliTest.run("identify", peaks.toString(), "--species", "He I,H I", "--n-max", "5");
        assertEquals(0, mixed.code(), mixed.err());
        assertTrue(mixed.err().contains("not those of [He I]") || mixed.out().contains("not those of [He I]"),
                mixed.err());
    }
}
