package org.ritzwerk.refdata;

import java.io.BufferedOutputStream;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ThreadLocalRandom;
import org.ritzwerk.RitzwerkException;

/**
 * Writes output files so that nothing the user had is lost: the content goes to a temporary file
 * in the same folder, which is moved over the target only once it is completely written. A failure
 * (or a killed process) leaves the old file untouched; a failure removes the temporary file (a
 * killed process can leave a hidden {@code .NAME.*.part} file beside the target).
 *
 * <p>Content is streamed: a writer of rows never needs the whole file in memory. A new file gets
 * the folder's default permissions; a replaced file keeps its POSIX permissions. A target that is
 * a symbolic link to a file is written through the link (the link stays).
 *
 * <p>{@link #check} looks at a command's outputs before any work: two outputs naming the same file,
 * an output naming an input, a missing folder, a folder that cannot be written, a folder where a
 * file should go, or a read-only file are refused. {@link Batch} writes several outputs and moves
 * them into place together at the end.
 *
 * <p>An interrupted process (Ctrl-C, {@code kill}) removes its temporary files too: every
 * temporary file not yet moved or removed is listed in one process-wide set, and a shutdown hook,
 * installed with the first one, removes what is left in it. Only {@code kill -9} or a crash of the
 * JVM can leave a hidden {@code .NAME.*.part} file.
 *
 * <p>Thread-safe (two writers of the same target: the last move wins).
 */
public final class OutputFiles {

    private OutputFiles() {
    }

    /** Temporary files written and not yet moved or removed, for the shutdown hook. */
    private static final class Pending {
        static final Set<Path> FILES = ConcurrentHashMap.newKeySet();

        static {
            Runtime.getRuntime().addShutdownHook(new Thread(Pending::removeAll, "ritzwerk-output-cleanup"));
        }

        static void removeAll() {
            for (Path temporary : FILES) {
                try {
                    Files.deleteIfExists(temporary);
                } catch (IOException e) {
                    // the process is ending; nothing more can be done
                }
            }
        }
    }

    /** @return the temporary files written and not yet moved or removed (for tests) */
    static Set<Path> pendingTemporaries() {
        return Set.copyOf(Pending.FILES);
    }

    /** Writes text to a stream of characters. */
    @FunctionalInterface
    public interface TextContent {
        /**
         * @param out where to write; buffered, closed by the caller
         * @throws IOException when writing fails
         */
        void writeTo(Writer out) throws IOException;
    }

    /** Writes bytes to a stream. */
    @FunctionalInterface
    public interface ByteContent {
        /**
         * @param out where to write; buffered, closed by the caller
         * @throws IOException when writing fails
         */
        void writeTo(OutputStream out) throws IOException;
    }

    /**
     * @param file where to write
     * @param text the whole content, written as UTF-8
     * @throws IOException when the folder cannot be written or the move fails
     */
    public static void writeString(Path file, CharSequence text) throws IOException {
        writeText(file, out -> out.append(text));
    }

    /**
     * @param file    where to write
     * @param content writes the content, as UTF-8 text
     * @throws IOException when the folder cannot be written, the content fails or the move fails
     */
    public static void writeText(Path file, TextContent content) throws IOException {
        try (Batch batch = new Batch()) {
            batch.text(file, content);
            batch.commit();
        }
    }

    /**
     * @param file    where to write
     * @param content writes the content
     * @throws IOException when the folder cannot be written, the content fails or the move fails
     */
    public static void writeBytes(Path file, ByteContent content) throws IOException {
        try (Batch batch = new Batch()) {
            batch.bytes(file, content);
            batch.commit();
        }
    }

    /**
     * Several outputs written to temporary files first and moved into place together by
     * {@link #commit()}; {@link #close()} removes whatever was not committed. Not thread-safe.
     */
    public static final class Batch implements AutoCloseable {
        private final Map<Path, Path> staged = new LinkedHashMap<>();   // target -> temporary

        /** An empty batch. */
        public Batch() {
        }

        /**
         * @param file    where the text goes on commit
         * @param content writes the content, as UTF-8 text
         * @throws IOException when the temporary file cannot be created or written
         */
        public void text(Path file, TextContent content) throws IOException {
            bytes(file, out -> {
                Writer writer = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8), 1 << 16);
                content.writeTo(writer);
                writer.flush();
            });
        }

        /**
         * @param file    where the bytes go on commit
         * @param content writes the content
         * @throws IOException when the temporary file cannot be created or written
         * @throws IllegalArgumentException when the batch already holds this target
         */
        public void bytes(Path file, ByteContent content) throws IOException {
            if (isSpecial(file)) {
                // A device, pipe or socket (/dev/stdout, a named pipe): nothing there to lose and
                // nothing to rename over; write straight into it.
                try (OutputStream out = new BufferedOutputStream(Files.newOutputStream(file), 1 << 16)) {
                    content.writeTo(out);
                }
                return;
            }
            Path target = target(file);
            if (staged.containsKey(target)) {
                throw new IllegalArgumentException("two outputs name the same file: " + file);
            }
            Path temporary = temporaryFor(file, target);
            Pending.FILES.add(temporary);
            staged.put(target, temporary);
            try (OutputStream out = new BufferedOutputStream(Files.newOutputStream(temporary), 1 << 16)) {
                content.writeTo(out);
            }
        }

        /**
         * Moves every staged file over its target, in the order staged.
         *
         * @throws IOException when a move fails (targets moved before it stay replaced)
         */
        public void commit() throws IOException {
            List<Map.Entry<Path, Path>> entries = new ArrayList<>(staged.entrySet());
            for (Map.Entry<Path, Path> entry : entries) {
                Path target = entry.getKey();
                Path temporary = entry.getValue();
                keepPermissions(target, temporary);
                try {
                    Files.move(temporary, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(temporary, target, StandardCopyOption.REPLACE_EXISTING);
                }
                staged.remove(target);
                Pending.FILES.remove(temporary);
            }
        }

        /** Removes the temporary files of whatever was not committed. */
        @Override
        public void close() throws IOException {
            IOException failure = null;
            for (Path temporary : staged.values()) {
                try {
                    Files.deleteIfExists(temporary);
                    Pending.FILES.remove(temporary);
                } catch (IOException e) {
                    failure = failure == null ? e : failure;
                }
            }
            staged.clear();
            if (failure != null) {
                throw failure;
            }
        }
    }

    /** Error code of an output path refused by {@link #check}: bad input, not a failure of the disk. */
    public static final String REFUSED = "output.refused";

    private static RitzwerkException refused(String message) {
        return new RitzwerkException(REFUSED, message);
    }

    /** A path a command reads or writes, with the option that named it (for messages). */
    public record Named(String option, Path path) {
    }

    /**
     * Checks a command's outputs before any work is done.
     *
     * @param outputs the files the command will write (null paths are skipped)
     * @param inputs  the files the command reads (null paths and files that do not exist are skipped)
     * @throws RitzwerkException with code {@link #REFUSED}, naming the option(s) and the path: when two outputs are the
     *         same file, an output is an input or is "-" (which would be a file of that name, not
     *         standard output), an output's folder does not exist, is not a folder
     *         or cannot be written (a file is created and removed there to find out), or the output
     *         exists and is a folder or is read-only
     */
    public static void check(List<Named> outputs, List<Named> inputs) {
        List<Named> seen = new ArrayList<>();
        List<Path> seenIds = new ArrayList<>();
        for (Named output : outputs) {
            if (output.path() == null) {
                continue;
            }
            if (output.path().toString().equals("-")) {
                // read by many tools as standard output; here it would be a file named "-"
                throw refused(output.option() + " -: a file named '-' would be written; leave " + output.option()
                        + " out to see the result on standard output, or name a file (./- for one really named so)");
            }
            Path id = identity(output.path());
            for (int k = 0; k < seen.size(); k++) {
                if (seenIds.get(k).equals(id)) {
                    throw refused(seen.get(k).option() + " and " + output.option()
                            + " name the same file: " + output.path() + "; give each output its own file");
                }
            }
            for (Named input : inputs) {
                if (input.path() != null && Files.exists(input.path()) && identity(input.path()).equals(id)) {
                    throw refused(output.option() + " " + output.path() + " is the input given with "
                            + input.option() + "; writing it would destroy the input");
                }
            }
            writable(output);
            seen.add(output);
            seenIds.add(id);
        }
    }

    private static void writable(Named output) {
        Path file = output.path();
        Path target = target(file);
        Path folder = target.getParent();
        String where = output.option() + " " + file + ": ";
        if (!Files.exists(folder)) {
            throw refused(where + "the folder " + folder + " does not exist");
        }
        if (!Files.isDirectory(folder)) {
            throw refused(where + folder + " is not a folder");
        }
        if (Files.isDirectory(target)) {
            throw refused(where + "is a folder, not a file");
        }
        if (Files.exists(target) && !Files.isWritable(target)) {
            throw refused(where + "the file is read-only");
        }
        try {
            Files.delete(temporaryBeside(target));
        } catch (IOException e) {
            String reason = e instanceof java.nio.file.AccessDeniedException ? "permission denied"
                    : e instanceof java.nio.file.FileSystemException f && f.getReason() != null ? f.getReason()
                    : "no file can be created there";
            throw refused(where + "cannot write in the folder " + folder + " (" + reason + ")");
        }
    }

    /** @return the file a path names: links resolved, the folder's real path where the file does not exist */
    private static Path identity(Path file) {
        try {
            if (Files.exists(file)) {
                return file.toRealPath();
            }
            Path absolute = file.toAbsolutePath().normalize();
            Path parent = absolute.getParent();
            return parent != null && Files.exists(parent) ? parent.toRealPath().resolve(absolute.getFileName()) : absolute;
        } catch (IOException | InvalidPathException e) {
            return file.toAbsolutePath().normalize();
        }
    }

    /** @return whether the path exists and is neither a regular file nor a folder (following links) */
    private static boolean isSpecial(Path file) {
        return Files.exists(file) && !Files.isRegularFile(file) && !Files.isDirectory(file);
    }

    /** @return where the content goes: the file a link points to, else the absolute path */
    private static Path target(Path file) {
        Path absolute = file.toAbsolutePath();
        if (Files.isSymbolicLink(absolute) && Files.isRegularFile(absolute)) {
            try {
                return absolute.toRealPath();
            } catch (IOException e) {
                return absolute;
            }
        }
        return absolute;
    }

    /**
     * The temporary file of {@link Batch#bytes}; a failure names the file asked for, not the
     * temporary one: a missing folder ({@link java.nio.file.NoSuchFileException}), a path whose
     * folder is a file ({@link java.nio.file.NotDirectoryException}), a folder that cannot be
     * written ({@link java.nio.file.AccessDeniedException}).
     */
    private static Path temporaryFor(Path file, Path target) throws IOException {
        Path folder = target.getParent();
        if (!Files.exists(folder)) {
            throw new java.nio.file.NoSuchFileException(file.toString(), null, "cannot write it: the folder "
                    + folder + " does not exist");
        }
        if (!Files.isDirectory(folder)) {
            throw new java.nio.file.NotDirectoryException(file + ": cannot write it: " + folder + " is not a folder");
        }
        try {
            return temporaryBeside(target);
        } catch (java.nio.file.AccessDeniedException e) {
            throw new java.nio.file.AccessDeniedException(file.toString(), null, "cannot write it: no file can be"
                    + " created in the folder " + folder + " (permission denied)");
        }
    }

    /** Creates an empty hidden file beside the target, with the folder's default permissions. */
    private static Path temporaryBeside(Path target) throws IOException {
        Path folder = target.getParent();
        String name = "." + target.getFileName() + ".";
        for (int attempt = 0; ; attempt++) {
            Path candidate = folder.resolve(name + Long.toHexString(ThreadLocalRandom.current().nextLong() >>> 1)
                    + ".part");
            try {
                return Files.createFile(candidate);
            } catch (FileAlreadyExistsException e) {
                if (attempt > 100) {
                    throw e;
                }
            }
        }
    }

    private static void keepPermissions(Path target, Path temporary) {
        PosixFileAttributeView from = Files.getFileAttributeView(target, PosixFileAttributeView.class,
                LinkOption.NOFOLLOW_LINKS);
        PosixFileAttributeView to = Files.getFileAttributeView(temporary, PosixFileAttributeView.class);
        if (from == null || to == null || !Files.isRegularFile(target, LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        try {
            to.setPermissions(from.readAttributes().permissions());
        } catch (IOException | UnsupportedOperationException e) {
            // Best effort: the new content matters more than the old mode bits.
        }
    }
}
