package org.ritzwerk.benchmarks;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.synth.LineColumns;
import org.ritzwerk.refdata.LineListFiles;

/**
 * Reading a line-list file of a million lines (the most the whole-file reader takes) into
 * columns as it streams from the disk ({@link LineListFiles#readColumns}) beside the whole-file
 * reader, the baseline ({@link LineListFiles#read(Path, DataKind)}, one {@code LineList} with its
 * text held whole), in the same run. Run with {@code -prof gc} for the bytes allocated per line.
 * The file: seeded Ne I, Ar I and Fe II lines between 600 and 700 nm (air) with intensities, as
 * a line-list generator writes them ({@link #write}).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1, time = 5)
@Measurement(iterations = 3, time = 5)
@Fork(value = 2, jvmArgs = "-Xmx2g")
public class LineColumnsBenchmark {

    /** Lines in the file. */
    @Param({"1000000"})
    public int lines;

    Path file;

    /** Writes the file into a temporary folder. */
    @Setup(Level.Trial)
    public void setUp() {
        try {
            file = Files.createTempFile("ritzwerk-lines-", ".csv");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        write(file, lines, 17L);
    }

    /** Deletes the file. */
    @TearDown(Level.Trial)
    public void tearDown() throws IOException {
        Files.deleteIfExists(file);
    }

    /** @return the lines read as columns, streaming */
    @Benchmark
    public LineColumns columns() {
        return LineListFiles.readColumns(file, DataKind.LINES);
    }

    /** @return the lines read whole (the baseline) */
    @Benchmark
    public LineList whole() {
        return LineListFiles.read(file, DataKind.LINES);
    }

    /**
     * Writes a line-list file (ritzwerk-lines 1, CSV) of seeded lines.
     *
     * @param file  where
     * @param lines how many
     * @param seed  the random seed
     */
    static void write(Path file, int lines, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        String[] species = {"Ne I", "Ar I", "Fe II"};
        try (BufferedWriter out = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            out.write("# ritzwerk-lines 1\n# id: generated\n# title: generated lines\n# source: the benchmark's"
                    + " generator\n# provenance: computed\n# version: 1\n# position-unit: nm\n# medium: air\n"
                    + "species,position,intensity\n");
            StringBuilder row = new StringBuilder();
            for (int i = 0; i < lines; i++) {
                row.setLength(0);
                row.append(species[random.nextInt(3)]).append(',').append(600 + 100 * random.nextDouble()).append(',')
                        .append(random.nextDouble(0, 1000)).append('\n');
                out.append(row);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
