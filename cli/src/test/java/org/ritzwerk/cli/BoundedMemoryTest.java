package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.BufferedWriter;
import java.io.File;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Output streams in bounded memory: the biggest documented runs go through a child JVM whose heap
 * is capped at 256 MiB, and must finish with every row. Before the table writer streamed, the
 * identify run needed about 1.7 GiB and the levels run failed at 2 GiB. The output is counted as
 * it arrives, never kept.
 */
class BoundedMemoryTest {

    private static final String HEAP = "-Xmx256m";

    /** Lines, bytes, the last line and standard error of a child run. */
    private record Outcome(int code, long lines, long bytes, String last, String err) {
    }

    private static Outcome runChild(Path folder, String... args) throws IOException, InterruptedException {
        return runWithHeap(folder, HEAP, args);
    }

    private static Outcome runWithHeap(Path folder, String heap, String... args) throws IOException,
            InterruptedException {
        List<String> command = new ArrayList<>(List.of(
                Path.of(System.getProperty("java.home"), "bin", "java").toString(), heap,
                "-cp", System.getProperty("java.class.path"), Main.class.getName()));
        command.addAll(List.of(args));
        Path err = folder.resolve("stderr.txt");
        Process process = new ProcessBuilder(command).directory(folder.toFile())
                .redirectError(err.toFile()).redirectInput(ProcessBuilder.Redirect.from(new File("/dev/null")))
                .start();
        long lines = 0;
        long bytes = 0;
        String last = "";
        try (BufferedReader out = new BufferedReader(new InputStreamReader(process.getInputStream(),
                StandardCharsets.UTF_8), 1 << 16)) {
            for (String line = out.readLine(); line != null; line = out.readLine()) {
                lines++;
                bytes += line.length() + 1;
                last = line;
            }
        }
        if (!process.waitFor(5, TimeUnit.MINUTES)) {
            process.destroyForcibly();
            throw new AssertionError("the child run did not end: " + command);
        }
        return new Outcome(process.exitValue(), lines, bytes, last, Files.readString(err));
    }

    @Test
    void runningOutOfMemoryIsOneLineAndLeavesNoFile(@TempDir Path folder) throws Exception {
        // 50 million pixels need 400 MB for one array; the child has 32 MiB.
        // The ends are air wavelengths (a bare 400nm on an air axis is read as vacuum, with a note).
        Outcome run = runWithHeap(folder, "-Xmx32m", "synth", "--lines", "lamp-ne-i", "--from", "400 nm air", "--to",
                "900 nm air", "--pixels", "50000000", "--temperature", "300", "--medium", "air", "--out", "big.csv");
        assertEquals(1, run.code(), run.err());
        assertTrue(run.err().startsWith("ritzwerk: out of memory: the job needs more than the 32 MiB"), run.err());
        assertEquals(1, run.err().strip().split("\n").length, run.err());
        assertTrue(!Files.exists(folder.resolve("big.csv")), "no output file");
    }

    @Test
    void identifiesOneMillionPeaksIn256MiB(@TempDir Path folder) throws Exception {
        Path peaks = folder.resolve("peaks.csv");
        SplittableRandom random = new SplittableRandom(15);
        try (BufferedWriter w = Files.newBufferedWriter(peaks)) {
            w.write("# ritzwerk-peaks 1\n# id: many-peaks\n# title: a million invented peaks\n"
                    + "# source: BoundedMemoryTest\n# provenance: measured\n# version: 1\n# position-unit: nm\n"
                    + "# medium: vacuum\nposition,uncertainty,intensity,width,note\n");
            StringBuilder row = new StringBuilder();
            for (int i = 0; i < 1_000_000; i++) {
                // 400 to 700 nm in steps of 1e-6 nm, each step once (a peak list holds each peak
                // once): i times a multiplier prime to 300,000,000, modulo it, visits distinct steps
                // in a scattered order
                int micro = (int) ((long) i * 7_919_993L % 300_000_000L);
                String fraction = Integer.toString(1_000_000 + micro % 1_000_000).substring(1);
                row.setLength(0);
                row.append(400 + micro / 1_000_000).append('.').append(fraction).append(",0.002,")
                        .append(1 + random.nextInt(1000)).append(",0.05,\n");
                w.append(row);
            }
        }
        Outcome run = runChild(folder, "identify", peaks.toString(), "--species", "H I", "--format", "csv");
        assertEquals(0, run.code(), run.err());
        assertEquals(1_000_001, run.lines(), "a header and one row a peak");
        assertTrue(run.last().startsWith("1000000,1000009,"), run.last());
        assertTrue(run.err().startsWith("1000000 peaks: "), run.err());
    }

    @Test
    void writesFourMillionLevelsAsCsvIn256MiB(@TempDir Path folder) throws Exception {
        Outcome run = runChild(folder, "levels", "--species", "H I", "--n-max", "2000", "--format", "csv");
        assertEquals(0, run.code(), run.err());
        // n^2 levels n l j up to n = 2000, plus the header.
        assertEquals(2000L * 2000 + 1, run.lines());
        assertTrue(run.last().startsWith("\"H I\",\"2000[l=1999] 2[L=1999]3999/2\",2000,1999,3999/2,,4000,"),
                run.last());
        assertEquals("", run.err());
    }
}
