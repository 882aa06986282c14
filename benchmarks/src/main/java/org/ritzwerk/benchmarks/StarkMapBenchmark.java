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
import org.ritzwerk.engine.stark.StarkMap;
import org.ritzwerk.engine.stark.StarkMapResult;

/**
 * A Stark map of Rb-87 at m_j = 1/2 with every l in n = 60 to nMax (nMax = 67: 1,008 basis states,
 * half-bandwidth 23), diagonalised at {@code fields} field values up to 5 V/cm: the engine's
 * paths (Givens band reduction, then LAPACK's tridiagonal {@code DSTEMR} with the characters,
 * {@code banded}, or {@code DSTERF} for the energies alone, {@code bandedEnergies}, or every energy by
 * {@code DSTERF} and the characters of the eigenstates within {@code windowGHz} of 61D5/2 alone by
 * inverse iteration ({@code DSTEIN}; {@code DSTEMR} over their index range for a wide window),
 * {@code bandedWindowed}, as the stark-map command solves) beside the naive
 * baseline, Commons Math's dense symmetric {@code EigenDecomposition} of the whole matrix at each
 * field, which accumulates every eigenvector (the engine's earlier banded path, Commons Math's
 * tridiagonal decomposition, ran at the dense path's speed, ratio 1.04). The basis, its levels and
 * its couplings are built once in the setup; only the per-field work is timed. The paths give the
 * same energies to 1e-9 cm^-1 (StarkAndPairBenchmarksTest, StarkMapTest). Single-shot timing: one
 * map takes seconds. {@code threads} spreads the fields over threads ({@link StarkMap#withThreads}).
 * The size, 100 fields on one core, is {@link StarkMapOneCoreBenchmark}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
@Fork(2)
public class StarkMapBenchmark {

    /** Highest n of the basis (from 60). */
    @Param({"63", "67"})
    public int nMax;

    /** How many fields per map. */
    @Param({"2"})
    public int fields;

    /** Threads per solve (the baseline always uses one). */
    @Param({"1"})
    public int threads;

    /** Half-width of the share window of {@code bandedWindowed}, GHz (the stark-map command's default). */
    @Param({"20"})
    public double windowGHz;

    StarkMap map;
    StarkMap windowedMap;
    double[] fieldValues;
    org.ritzwerk.atom.State reference;

    @Setup
    public void setUp() {
        map = StarkMap.builder(RubidiumFixture.rubidium()).projection(1).principalRange(60, nMax).build()
                .withThreads(threads);
        fieldValues = fieldGrid(fields);
        reference = org.ritzwerk.atom.State.of(61, 2, 5);
        windowedMap = map.withShareWindowHz(-windowGHz * 1e9, windowGHz * 1e9);
    }

    /** @return the map, banded path */
    @Benchmark
    public StarkMapResult banded() {
        return map.solve(fieldValues, reference);
    }

    /** @return the map's energies, with characters only within the window, banded path */
    @Benchmark
    public StarkMapResult bandedWindowed() {
        return windowedMap.solve(fieldValues, reference);
    }

    /** @return the map's energies only, banded path */
    @Benchmark
    public StarkMapResult bandedEnergies() {
        return map.solveEnergies(fieldValues, reference);
    }

    /** @return the map, dense baseline (one thread) */
    @Benchmark
    public StarkMapResult naiveDense() {
        return map.withThreads(1).solveDense(fieldValues, reference);
    }

    /**
     * @param fields how many
     * @return the fields of both Stark-map benchmarks: 500 / fields to 500 V/m in equal steps
     */
    static double[] fieldGrid(int fields) {
        double[] values = new double[fields];
        for (int i = 0; i < fields; i++) {
            values[i] = 500.0 * (i + 1) / fields;
        }
        return values;
    }
}
