package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.RitzwerkException;

/**
 * Output files are replaced only when completely written, no temporary file is left, and a
 * command's outputs are checked before any work.
 */
class OutputFilesTest {

    @Test
    void replacesAnExistingFileAndLeavesNothingElse(@TempDir Path folder) throws IOException {
        Path target = folder.resolve("out.csv");
        Files.writeString(target, "old", StandardCharsets.UTF_8);
        OutputFiles.writeString(target, "new\n");
        assertEquals("new\n", Files.readString(target));
        try (var files = Files.list(folder)) {
            assertEquals(1, files.count());
        }
    }

    @Test
    void aFailedWriteLeavesTheOldFileAlone(@TempDir Path folder) throws IOException {
        Path target = folder.resolve("keep.csv");
        Files.writeString(target, "precious", StandardCharsets.UTF_8);
        // A folder where the file should be: the move fails, and the old content must survive.
        Path blocked = folder.resolve("blocked");
        Files.createDirectory(blocked);
        Files.writeString(blocked.resolve("inside"), "x");
        assertThrows(IOException.class, () -> OutputFiles.writeString(blocked, "new"));
        assertEquals("precious", Files.readString(target));
        assertThrows(IOException.class, () -> OutputFiles.writeString(folder.resolve("no/such/folder/f.csv"), "x"));
        try (var files = Files.list(folder)) {
            assertEquals(2, files.count(), "no temporary file left");
        }
    }

    @Test
    void aBatchMovesEverythingAtTheEndOrNothing(@TempDir Path folder) throws IOException {
        Path one = folder.resolve("one.csv");
        Path two = folder.resolve("two.png");
        Files.writeString(one, "old one");
        Files.writeString(two, "old two");
        try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
            batch.text(one, out -> out.write("new one"));
            assertThrows(IOException.class, () -> batch.bytes(two, out -> {
                out.write(1);
                throw new IOException("disk full (simulated)");
            }));
            // No commit: both old files stay.
        }
        assertEquals("old one", Files.readString(one));
        assertEquals("old two", Files.readString(two));
        try (var files = Files.list(folder)) {
            assertEquals(2, files.count(), "no temporary file left");
        }
        try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
            batch.text(one, out -> out.write("new one"));
            batch.bytes(two, out -> out.write(new byte[] {1, 2}));
            batch.commit();
        }
        assertEquals("new one", Files.readString(one));
        assertEquals(2, Files.size(two));
    }

    @Test
    void aReplacedFileKeepsItsPermissions(@TempDir Path folder) throws IOException {
        Path target = folder.resolve("shared.csv");
        Files.writeString(target, "old");
        Files.setPosixFilePermissions(target, PosixFilePermissions.fromString("rw-r-----"));
        OutputFiles.writeString(target, "new");
        assertEquals("rw-r-----", PosixFilePermissions.toString(Files.getPosixFilePermissions(target)));
    }

    @Test
    void outputsAreCheckedBeforeAnyWork(@TempDir Path folder) throws IOException {
        Path a = folder.resolve("a.csv");
        Path input = folder.resolve("in.csv");
        Files.writeString(input, "x");
        RitzwerkException same = assertThrows(RitzwerkException.class, () -> OutputFiles.check(
                List.of(new OutputFiles.Named("--out", a), new OutputFiles.Named("--truth",
                        folder.resolve("sub/../a.csv"))), List.of()));
        assertEquals("--out and --truth name the same file: " + folder.resolve("sub/../a.csv")
                + "; give each output its own file", same.getMessage());
        RitzwerkException overInput = assertThrows(RitzwerkException.class, () -> OutputFiles.check(
                List.of(new OutputFiles.Named("--plot", input)), List.of(new OutputFiles.Named("--data", input))));
        assertEquals("--plot " + input + " is the input given with --data; writing it would destroy the input",
                overInput.getMessage());
        // "-" would be a file of that name (many tools read it as standard output)
        RitzwerkException dash = assertThrows(RitzwerkException.class, () -> OutputFiles.check(
                List.of(new OutputFiles.Named("--out", java.nio.file.Path.of("-"))), List.of()));
        assertTrue(dash.getMessage().startsWith("--out -: a file named '-' would be written"), dash.getMessage());
        RitzwerkException noFolder = assertThrows(RitzwerkException.class, () -> OutputFiles.check(
                List.of(new OutputFiles.Named("--out", folder.resolve("none/a.csv"))), List.of()));
        assertEquals("--out " + folder.resolve("none/a.csv") + ": the folder " + folder.resolve("none")
                + " does not exist", noFolder.getMessage());
        RitzwerkException notFolder = assertThrows(RitzwerkException.class, () -> OutputFiles.check(
                List.of(new OutputFiles.Named("--out", input.resolve("a.csv"))), List.of()));
        assertTrue(notFolder.getMessage().endsWith(input + " is not a folder"), notFolder.getMessage());
        RitzwerkException isFolder = assertThrows(RitzwerkException.class, () -> OutputFiles.check(
                List.of(new OutputFiles.Named("--out", folder)), List.of()));
        assertEquals("--out " + folder + ": is a folder, not a file", isFolder.getMessage());
        // A folder no file can be created in (here /proc, which even root cannot write to).
        if (Files.isDirectory(Path.of("/proc/self"))) {
            RitzwerkException locked = assertThrows(RitzwerkException.class, () -> OutputFiles.check(
                    List.of(new OutputFiles.Named("--out", Path.of("/proc/a.csv"))), List.of()));
            assertTrue(locked.getMessage().startsWith("--out /proc/a.csv: cannot write in the folder /proc ("),
                    locked.getMessage());
        }
        // Sound outputs pass and leave nothing behind; an input that does not exist is no conflict.
        OutputFiles.check(List.of(new OutputFiles.Named("--out", a), new OutputFiles.Named("--truth", null)),
                List.of(new OutputFiles.Named("--lines", folder.resolve("absent.csv"))));
        try (var files = Files.list(folder)) {
            assertEquals(1, files.count(), "the probe file is removed");
        }
    }

    @Test
    void aDeviceIsWrittenIntoNotReplaced() throws IOException {
        Path devNull = Path.of("/dev/null");
        org.junit.jupiter.api.Assumptions.assumeTrue(Files.exists(devNull), "a system with /dev/null");
        OutputFiles.writeString(devNull, "discarded");
        assertFalse(Files.isRegularFile(devNull), "/dev/null is still a device, not a file put in its place");
        try (var files = Files.list(Path.of("/dev"))) {
            assertTrue(files.noneMatch(f -> f.getFileName().toString().startsWith(".null.")), "no temporary file");
        }
    }
}
