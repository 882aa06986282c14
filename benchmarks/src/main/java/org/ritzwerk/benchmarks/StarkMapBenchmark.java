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
 * half-bandwidth about 30), diagonalised at {@code fields} field values from 0 to 5 V/cm: the
 * engine's path (Givens band reduction, then Commons Math's symmetric tridiagonal
 * {@code EigenDecomposition}) beside the naive baseline, Commons Math's dense symmetric
 * {@code EigenDecomposition} of the whole matrix at each field. The basis, its levels and its
 * couplings are built once in the setup; only the per-field work is timed. Both give the same
 * energies to 1e-9 cm^-1 (StarkAndPairBenchmarksTest). Single-shot timing: one map takes seconds.
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

    StarkMap map;
    double[] fieldValues;
    org.ritzwerk.atom.State reference;

    @Setup
    public void setUp() {
        map = StarkMap.builder(RubidiumFixture.rubidium()).projection(1).principalRange(60, nMax).build();
        fieldValues = new double[fields];
        for (int i = 0; i < fields; i++) {
            fieldValues[i] = 500.0 * (i + 1) / fields;
        }
        reference = org.ritzwerk.atom.State.of(61, 2, 5);
    }

    /** @return the map, banded path */
    @Benchmark
    public StarkMapResult banded() {
        return map.solve(fieldValues, reference);
    }

    /** @return the map, dense baseline */
    @Benchmark
    public StarkMapResult naiveDense() {
        return map.solveDense(fieldValues, reference);
    }
}
