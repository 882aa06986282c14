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
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.internal.radial.RadialIntegrals;

/**
 * Hydrogen lines (QED tier) with upper n up to 10 and 20: {@link HydrogenLikeLines#components}
 * over the whole spectrum beside the naive baseline that tests every pair of levels for the
 * selection rules and computes a radial integral per allowed pair, in the same run.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(2)
public class HydrogenLinesBenchmark {

    /** Highest principal quantum number. */
    @Param({"10", "20"})
    public int nMax;

    private HydrogenLikeModel model;
    private HydrogenLikeLines lines;

    /** Builds the hydrogen model (QED tier, CODATA 2018 proton). */
    @Setup
    public void setUp() {
        model = HydrogenFixture.hydrogen();
        lines = HydrogenLikeLines.of(model);
    }

    /** @return every E1 component with upper n up to nMax */
    @Benchmark
    public LineTable linesGenerator() {
        return lines.components(nMax, 0, Double.MAX_VALUE);
    }

    /** @return the summed line strength (in Bohr-radius units) from every allowed pair of levels, brute force */
    @Benchmark
    public double linesBaselineAllPairs() {
        List<HydrogenFixture.Level> levels = HydrogenFixture.objectLevels(model, nMax);
        double total = 0;
        for (HydrogenFixture.Level upper : levels) {
            for (HydrogenFixture.Level lower : levels) {
                if (upper.energy() > lower.energy() && Math.abs(upper.l() - lower.l()) == 1
                        && Math.abs(upper.twoJ() - lower.twoJ()) <= 2) {
                    double radial = RadialIntegrals.dipole(upper.n(), upper.l(), lower.n(), lower.l());
                    total += radial * radial;
                }
            }
        }
        return total;
    }
}
