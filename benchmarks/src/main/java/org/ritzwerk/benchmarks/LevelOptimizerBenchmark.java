package org.ritzwerk.benchmarks;

import java.util.Random;
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
import org.ritzwerk.engine.ritz.LevelOptimizer;
import org.ritzwerk.engine.ritz.LevelOptimum;
import org.ritzwerk.engine.ritz.MeasuredLines;

/**
 * Level optimisation with outlier removal: {@link LevelOptimizer}'s rank-one downdate of the fit after
 * each line left out, beside the naive baseline that fits the lines kept from scratch after each one
 * ({@link LevelOptimizer#withFullRefits()}). Both leave out the same lines and give the same levels
 * (LevelOptimizerTest). The problem is a seeded synthetic network (invented levels 100 to 1000 cm^-1
 * apart, a chain joining every level to the reference and the other lines between random pairs, u
 * 0.001 to 0.01 cm^-1) in which one line in {@code outlierEvery} is moved by 20 to 200 of its
 * uncertainties, so about {@code lines / outlierEvery} lines are left out one at a time.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(2)
public class LevelOptimizerBenchmark {

    /** Number of levels, the reference included. */
    @Param({"50", "200"})
    public int levels;

    /** Lines per level. */
    @Param({"4"})
    public int linesPerLevel;

    /** One line in this many is moved (an outlier). */
    @Param({"33"})
    public int outlierEvery;

    MeasuredLines problem;

    @Setup
    public void setUp() {
        Random r = new Random(2121L);
        double[] truth = new double[levels];
        for (int i = 1; i < levels; i++) {
            truth[i] = truth[i - 1] + 100 + 900 * r.nextDouble();
        }
        MeasuredLines.Builder b = MeasuredLines.builder("L0", 0);
        int lines = levels * linesPerLevel;
        for (int k = 0; k < lines; k++) {
            int u = k < levels - 1 ? k + 1 : 1 + r.nextInt(levels - 1);
            int l = k < levels - 1 ? k : r.nextInt(u);
            double sigma = 0.001 * (1 + 9 * r.nextDouble());
            double shift = k % outlierEvery == 7 ? sigma * (20 + 180 * r.nextDouble()) : 0;
            b.add("L" + u, "L" + l, truth[u] - truth[l] + sigma * r.nextGaussian() + shift, sigma);
        }
        problem = b.build();
    }

    /** @return the optimum, downdating after each line left out */
    @Benchmark
    public LevelOptimum downdate() {
        return LevelOptimizer.defaults().optimize(problem);
    }

    /** @return the optimum, refitting from scratch after each line left out (naive baseline) */
    @Benchmark
    public LevelOptimum fullRefits() {
        return LevelOptimizer.defaults().withFullRefits().optimize(problem);
    }
}
