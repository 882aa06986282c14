package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Output files are replaced only when completely written, and no temporary file is left. */
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
}
