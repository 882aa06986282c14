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
 * Identification beside the naive all-pairs scan (every peak against every line), in the same
 * run, at sizes the naive scan can finish: 10,000 peaks against 100,000 lines. Per-peak ratios
 * carry over to larger peak counts, since both grow linearly in peaks.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(2)
public class IdentifyNaiveBenchmark {

    /** Number of peaks. */
    @Param({"10000"})
    public int peaks;

    private IdentifyScene scene;
    private Identifier identifier;

    /** Builds the scene (100,000 lines) from a fixed seed. */
    @Setup
    public void setUp() {
        scene = new IdentifyScene(100_000, peaks, 1L);
        identifier = Identifier.of(Tolerance.absolute(0.5e-12));
    }

    /** @return the identification */
    @Benchmark
    public Identification identify() {
        return identifier.identify(scene.peaks, scene.lines);
    }

    /** @return the matched count of the naive scan */
    @Benchmark
    public long naiveAllPairs() {
        return BareMerge.allPairs(scene.peakWavelengths, scene.lineWavelengths, 0.5e-12);
    }
}
