package org.ritzwerk.benchmarks;

import java.util.List;
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
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LevelTable;

/**
 * Hydrogen levels (QED tier) up to n = 100 and 1000: {@link HydrogenLikeModel#levels(int)} in
 * columns beside the naive baseline of one object per level in a list, in the same run.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(2)
public class HydrogenLevelsBenchmark {

    /** Highest principal quantum number. */
    @Param({"100", "1000"})
    public int nMax;

    private HydrogenLikeModel model;

    /** Builds the hydrogen model (QED tier, CODATA 2018 proton). */
    @Setup
    public void setUp() {
        model = HydrogenFixture.hydrogen();
    }

    /** @return all levels up to nMax, in columns */
    @Benchmark
    public LevelTable levelsColumnar() {
        return model.levels(nMax);
    }

    /** @return all levels up to nMax, one object each */
    @Benchmark
    public List<HydrogenFixture.Level> levelsBaselineObjects() {
        return HydrogenFixture.objectLevels(model, nMax);
    }
}
