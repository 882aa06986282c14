package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A folder given where a file is expected, and a byte that is not UTF-8, are input errors: exit
 * code 2 and one line naming the path (and the line and column of the byte), never an internal
 * error.
 */
class InputErrorsTest {

    @Test
    void aFolderWhereAFileIsExpected(@TempDir Path dir) {
        for (String[] args : new String[][] {
            {"identify", dir.toString(), "--species", "H"},
            {"data", "check", dir.toString()},
            {"calibrate", dir.toString(), "--lamp", "Ne I"},
            {"convert", "--input", dir.toString(), "--to", "THz"}}) {
            CliTest.Run run = CliTest.run(args);
            assertEquals(2, run.code(), String.join(" ", args) + ": " + run.err());
            assertTrue(run.err().contains(dir.toString()) && !run.err().contains("internal error"), run.err());
        }
    }

    @Test
    void aByteThatIsNotUtf8(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("list.txt");
        Files.write(file, new byte[] {'6', '5', '6', ' ', 'n', 'm', ' ', 'a', 'i', 'r', '\n', 'x', (byte) 0xff, '\n'});
        CliTest.Run run = CliTest.run("convert", "--input", file.toString(), "--to", "THz");
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains(file + ":2:2") && run.err().contains("0xFF"), run.err());
    }

    @Test
    void aMistypedCommandLineGivesOneErrorAHintAndNoUsageDump() {
        CliTest.Run typo = CliTest.run("lines", "--specis", "H");
        assertEquals(2, typo.code());
        assertTrue(typo.err().contains("did you mean: --species?"), typo.err());
        assertTrue(typo.err().contains("see 'ritzwerk lines --help'") && !typo.err().contains("Usage:"), typo.err());
        assertTrue(typo.err().lines().count() <= 4, typo.err());
        CliTest.Run negative = CliTest.run("convert", "-656 nm", "--to", "THz");
        assertEquals(2, negative.code());
        assertTrue(negative.err().contains("starts with '-'") && !negative.err().contains("Usage:"), negative.err());
        CliTest.Run command = CliTest.run("convret");
        assertEquals(2, command.code());
        assertTrue(command.err().contains("did you mean: convert?"), command.err());
    }

    @Test
    void aFullDeviceIsAnInputErrorWithoutAStackTrace(@TempDir Path dir) {
        Path full = Path.of("/dev/full");
        org.junit.jupiter.api.Assumptions.assumeTrue(Files.exists(full) && !Files.isRegularFile(full),
                "a system with /dev/full");
        CliTest.Run run = CliTest.run("synth", "--lines", "lamp-ne-i", "--from", "600 nm air", "--to", "700 nm air",
                "--pixels", "2000", "--medium", "air", "--temperature", "300", "--resolving-power", "4000",
                "--seed", "1", "--out", dir.resolve("s.csv").toString(), "--plot", full.toString());
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains("No space left") && !run.err().contains("Exception"), run.err());
        assertTrue(!Files.isRegularFile(full), "/dev/full is still a device");
    }

    @Test
    void aZeroUncertaintyUnderASigmaToleranceIsExplained(@TempDir Path dir) throws IOException {
        Path peaks = dir.resolve("zero.csv");
        Files.writeString(peaks, "# ritzwerk-peaks 1\n# id: zero\n# title: t\n# source: invented\n# provenance: measured\n"
                + "# version: 1\n# position-unit: nm\n# medium: air\nposition,uncertainty\n656.28,0.004\n486.13,0\n");
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H");
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains(peaks + ":11:") && run.err().contains("uncertainty is 0"), run.err());
        // With a width tolerance the same file is fine.
        assertEquals(0, CliTest.run("identify", peaks.toString(), "--species", "H", "--tolerance", "0.02 nm").code());
    }
}
