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
 * The Stark-map size on one core: Rb-87 at m_j = 1/2 with every l in n = 60 to nMax
 * (nMax = 67: 1,008 basis states, half-bandwidth 23) at {@code fields} field values (100, from
 * 5 to 500 V/m), on the calling thread only. {@code energies}: every energy (band reduction, then
 * LAPACK's {@code DSTERF}); {@code windowed}: every energy and the shares of 61D5/2 in the
 * eigenstates within {@code windowGHz} of it ({@code DSTEMR} over their index range), as the
 * {@code rydberg stark-map} command solves. The naive baseline, Commons Math's dense symmetric
 * {@code EigenDecomposition} of the whole matrix (every eigenvector accumulated), takes seconds a
 * field, so 100 fields would take minutes an iteration: {@code naiveDenseOneField} times it at one
 * field (250 V/m), and the figure for the map is 100 times that (the dense work does not depend on
 * the field). The basis, its levels and couplings are built once in the setup. The paths agree to
 * 1e-9 cm^-1 (StarkAndPairBenchmarksTest).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
@Fork(2)
public class StarkMapOneCoreBenchmark {

    /** Highest n of the basis (from 60). */
    @Param({"67"})
    public int nMax;

    /** How many fields per map. */
    @Param({"100"})
    public int fields;

    /** Half-width of the share window of {@code windowed}, GHz (the stark-map command's default). */
    @Param({"20"})
    public double windowGHz;

    StarkMap map;
    StarkMap windowedMap;
    double[] fieldValues;
    double[] oneField;
    org.ritzwerk.atom.State reference;

    @Setup
    public void setUp() {
        map = StarkMap.builder(RubidiumFixture.rubidium()).projection(1).principalRange(60, nMax).build();
        fieldValues = StarkMapBenchmark.fieldGrid(fields);
        oneField = new double[] {250.0};
        reference = org.ritzwerk.atom.State.of(61, 2, 5);
        windowedMap = map.withShareWindowHz(-windowGHz * 1e9, windowGHz * 1e9);
    }

    /** @return every energy at every field, one thread */
    @Benchmark
    public StarkMapResult energies() {
        return map.solveEnergies(fieldValues, reference);
    }

    /** @return every energy and the shares within the window at every field, one thread */
    @Benchmark
    public StarkMapResult windowed() {
        return windowedMap.solve(fieldValues, reference);
    }

    /** @return the dense baseline at one field (times 100 for the map) */
    @Benchmark
    public StarkMapResult naiveDenseOneField() {
        return map.solveDense(oneField, reference);
    }
}
