package org.ritzwerk.benchmarks;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
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
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LevelTable;
import org.ritzwerk.engine.hydrogenic.Tier;

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

    /** One level as an object, for the baselines. */
    public record Level(int n, int l, int twoJ, double energy) {
    }

    /** Builds the model for the proton (CODATA 2018 mass, moment and radius). */
    @Setup
    public void setUp() {
        Nucleus proton = new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1, OptionalDouble.of(2.79284734463),
                OptionalDouble.of(0.8414e-15), "CODATA 2018");
        model = HydrogenLikeModel.of(proton, Tier.QED);
    }

    /** @return all levels up to nMax, in columns */
    @Benchmark
    public LevelTable levelsColumnar() {
        return model.levels(nMax);
    }

    /** @return all levels up to nMax, one object each */
    @Benchmark
    public List<Level> levelsBaselineObjects() {
        return objectLevels();
    }

    private List<Level> objectLevels() {
        List<Level> levels = new ArrayList<>();
        for (int n = 1; n <= nMax; n++) {
            for (int l = 0; l < n; l++) {
                for (int twoJ = Math.max(2 * l - 1, 1); twoJ <= 2 * l + 1; twoJ += 2) {
                    levels.add(new Level(n, l, twoJ, model.energy(n, l, twoJ)));
                }
            }
        }
        return levels;
    }
}
