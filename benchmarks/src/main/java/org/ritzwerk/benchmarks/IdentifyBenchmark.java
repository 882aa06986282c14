package org.ritzwerk.benchmarks;

import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.Tolerance;

/**
 * Identifying sorted peaks against 100,000 lines (absolute tolerance 0.5 pm) beside the practical
 * floor: a bare sorted-merge loop that walks both arrays and counts the pairs within the
 * tolerance, in the same run. The naive all-pairs scan is in {@link IdentifyNaiveBenchmark}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 4, time = 2)
@Fork(2)
public class IdentifyBenchmark {

    /** Number of peaks (the first 100,000 of them real). */
    @Param({"100000", "1000000"})
    public int peaks;

    /** Number of lines. */
    @Param({"100000"})
    public int lines;

    private IdentifyScene scene;
    private Identifier identifier;

    /** Builds the scene from a fixed seed. */
    @Setup
    public void setUp() {
        scene = new IdentifyScene(lines, peaks, 1L);
        identifier = Identifier.of(Tolerance.absolute(0.5e-12));
    }

    /** @return the identification: candidates, scores, one-to-one assignment, ambiguity */
    @Benchmark
    public Identification identify() {
        return identifier.identify(scene.peaks, scene.lines);
    }

    /** @return the same identification on two parts in parallel (this machine has two cores) */
    @Benchmark
    public Identification identifyInParallel() {
        return identifier.identifyInParallel(scene.peaks, scene.lines, 2);
    }

    /** @return the number of peak-line pairs within the tolerance, by one walk over both arrays */
    @Benchmark
    public long bareMerge() {
        return BareMerge.pairs(scene.peakWavelengths, scene.lineWavelengths, 0.5e-12);
    }
}
