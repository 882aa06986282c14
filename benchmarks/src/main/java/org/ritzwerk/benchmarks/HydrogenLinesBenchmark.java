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
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.hydrogenic.RadialIntegrals;
import org.ritzwerk.engine.hydrogenic.Tier;

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

    /** One level as an object, for the baselines. */
    public record Level(int n, int l, int twoJ, double energy) {
    }

    /** Builds the model for the proton (CODATA 2018 mass, moment and radius). */
    @Setup
    public void setUp() {
        Nucleus proton = new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1, OptionalDouble.of(2.79284734463),
                OptionalDouble.of(0.8414e-15), "CODATA 2018");
        model = HydrogenLikeModel.of(proton, Tier.QED);
        lines = HydrogenLikeLines.of(model);
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

    /** @return every E1 component with upper n up to nMax */
    @Benchmark
    public LineTable linesGenerator() {
        return lines.components(nMax, 0, Double.MAX_VALUE);
    }

    /** @return the summed line strength (in Bohr-radius units) from every allowed pair of levels, brute force */
    @Benchmark
    public double linesBaselineAllPairs() {
        List<Level> levels = objectLevels();
        double total = 0;
        for (Level upper : levels) {
            for (Level lower : levels) {
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
