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
import org.ritzwerk.engine.pair.PairInteractions;
import org.ritzwerk.engine.pair.PairState;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.internal.units.AtomicUnits;

/**
 * C6 of the Rb-87 pair nS1/2 + nS1/2 (m = 1/2 each) near n = 70, n' within n +- 6, a fresh atom
 * per call (so every radial integral is computed): the engine's sum, which computes each atom's
 * reduced elements once and the m-resolved elements from 3j symbols, beside the naive baseline,
 * which walks every pair of intermediate states and projections and asks
 * {@link AlkaliAtom#dipole} for both elements of each (re-integrating the radial overlap each
 * time). Both give the same C6 to 1e-9 relative (StarkAndPairBenchmarksTest; they differ by 3e-10, the
 * order of summation).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(2)
public class PairC6Benchmark {

    /** Principal quantum number of the pair. */
    @Param({"70"})
    public int n;

    /** The n' range. */
    static final int RANGE = 6;

    org.ritzwerk.atom.State s;

    @Setup
    public void setUp() {
        s = org.ritzwerk.atom.State.of(n, 0, 1);
    }

    /** @return C6 in atomic units, engine */
    @Benchmark
    public double engine() {
        return PairInteractions.of(RubidiumFixture.rubidium()).withNeighbourRange(RANGE)
                .c6(new PairState(s, 1, s, 1)).c6Au();
    }

    /** @return C6 in atomic units, naive */
    @Benchmark
    public double naive() {
        AlkaliAtom atom = RubidiumFixture.rubidium();
        PairInteractions weights = PairInteractions.of(atom);
        double e0 = 2 * AtomicUnits.hartreeFromPerCm(atom.energyPerCm(s));
        double c6 = 0;
        for (org.ritzwerk.atom.State k1 : neighbours(s)) {
            for (org.ritzwerk.atom.State k2 : neighbours(s)) {
                double defect = AtomicUnits.hartreeFromPerCm(atom.energyPerCm(k1) + atom.energyPerCm(k2)) - e0;
                for (int m1 = -k1.twoJ(); m1 <= k1.twoJ(); m1 += 2) {
                    for (int m2 = -k2.twoJ(); m2 <= k2.twoJ(); m2 += 2) {
                        int q1 = (m1 - 1) / 2;
                        int q2 = (m2 - 1) / 2;
                        if (Math.abs(m1 - 1) > 2 || Math.abs(m2 - 1) > 2) {
                            continue;
                        }
                        double v = weights.weight(q1, q2) * atom.dipole(k1, m1, s, 1, q1)
                                * atom.dipole(k2, m2, s, 1, q2);
                        if (v != 0) {
                            c6 -= v * v / defect;
                        }
                    }
                }
            }
        }
        return c6;
    }

    private java.util.List<org.ritzwerk.atom.State> neighbours(org.ritzwerk.atom.State a) {
        java.util.List<org.ritzwerk.atom.State> out = new java.util.ArrayList<>();
        for (int twoJ = 1; twoJ <= 3; twoJ += 2) {
            for (int k = a.n() - RANGE; k <= a.n() + RANGE; k++) {
                out.add(org.ritzwerk.atom.State.of(k, 1, twoJ));
            }
        }
        return out;
    }
}
