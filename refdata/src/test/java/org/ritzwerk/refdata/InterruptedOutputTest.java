package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A process stopped while it writes an output (Ctrl-C sends SIGINT, {@code kill} SIGTERM) leaves
 * the user's old file as it was and no temporary file beside it. The child stages a file, says so,
 * and waits to be stopped; no timing is involved.
 */
class InterruptedOutputTest {

    /** The child: stages {@code args[0]} in a batch, half-written, and waits forever. */
    public static final class StagesAndWaits {
        public static void main(String[] args) throws Exception {
            OutputFiles.Batch batch = new OutputFiles.Batch();
            batch.text(Path.of(args[0]), (Writer w) -> w.write("new, half-written\n"));
            System.out.println("staged " + OutputFiles.pendingTemporaries().size());
            System.out.flush();
            Thread.sleep(TimeUnit.MINUTES.toMillis(5));
        }
    }

    @Test
    void aStoppedRunLeavesTheOldFileAndNoTemporaryFile(@TempDir Path folder) throws Exception {
        for (String signal : List.of("INT", "TERM")) {
            Path target = folder.resolve("spectrum-" + signal + ".csv");
            Files.writeString(target, "old\n");
            Process child = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                    "-cp", classPath(), StagesAndWaits.class.getName(), target.toString())
                    .redirectErrorStream(true).start();
            try (BufferedReader out = new BufferedReader(new InputStreamReader(child.getInputStream(),
                    StandardCharsets.UTF_8))) {
                assertEquals("staged 1", out.readLine());
                assertEquals(1, temporaries(folder), "the half-written file exists while the child runs");
                stop(child, signal);
                assertTrue(child.waitFor(1, TimeUnit.MINUTES), "the child did not stop");
            }
            assertEquals("old\n", Files.readString(target), signal);
            assertEquals(0, temporaries(folder), signal + ": a temporary file was left");
        }
    }

    @Test
    void committedAndClosedBatchesLeaveNothingPending(@TempDir Path folder) throws IOException {
        try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
            batch.text(folder.resolve("a.txt"), w -> w.write("a"));
            batch.text(folder.resolve("b.txt"), w -> w.write("b"));
            assertEquals(2, OutputFiles.pendingTemporaries().stream().filter(p -> p.startsWith(folder)).count());
            batch.commit();
        }
        try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
            batch.text(folder.resolve("c.txt"), w -> w.write("c"));
        }
        assertFalse(OutputFiles.pendingTemporaries().stream().anyMatch(p -> p.startsWith(folder)));
        assertFalse(Files.exists(folder.resolve("c.txt")));
        assertEquals(0, temporaries(folder));
    }

    /** The test's class path, with the module path when the tests run as modules (all on the class path). */
    private static String classPath() {
        String modules = System.getProperty("jdk.module.path");
        return System.getProperty("java.class.path") + (modules == null ? "" : java.io.File.pathSeparator + modules);
    }

    private static void stop(Process child, String signal) throws Exception {
        Path kill = Path.of("/bin/kill");
        if (Files.isExecutable(kill)) {
            assertEquals(0, new ProcessBuilder(kill.toString(), "-" + signal, Long.toString(child.pid())).start()
                    .waitFor());
        } else {
            child.destroy();
        }
    }

    private static long temporaries(Path folder) throws IOException {
        try (Stream<Path> files = Files.list(folder)) {
            return files.filter(p -> p.getFileName().toString().endsWith(".part")).count();
        }
    }
}
