package org.ritzwerk.refdata;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * Writes output files so that nothing the user had is lost: the text goes to a temporary file in
 * the same folder, which is moved over the target only once it is completely written. A failure
 * leaves the old file untouched and removes the temporary one.
 *
 * <p>Stateless and thread-safe (two writers of the same target: the last move wins).
 */
public final class OutputFiles {

    private OutputFiles() {
    }

    /**
     * @param file where to write
     * @param text the whole content, written as UTF-8
     * @throws IOException when the folder cannot be written or the move fails
     */
    public static void writeString(Path file, CharSequence text) throws IOException {
        Path target = file.toAbsolutePath();
        Path folder = target.getParent();
        Path temporary = Files.createTempFile(folder, "." + target.getFileName() + ".", ".part");
        try {
            Files.writeString(temporary, text, StandardCharsets.UTF_8);
            try {
                Files.move(temporary, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(temporary, target, StandardCopyOption.REPLACE_EXISTING);
            }
        } finally {
            Files.deleteIfExists(temporary);
        }
    }
}
