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
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.CorePolarizability;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/**
 * One radial dipole integral between two Rb Rydberg states near n = 100 ({@code ns1/2} and
 * {@code np3/2}), both wavefunctions integrated per call: the engine's Numerov on the square-root
 * grid x = sqrt(r) (step 0.01, about 16,000 points per state) beside the naive baseline, the
 * same Numerov recursion and stopping rules on a uniform grid in r. The baseline's step, 0.5 a0
 * (about 42,000 points per state), is the coarsest of 2, 1 and 0.5 a0 that matches the square-root
 * grid's accuracy on hydrogen at n = 100: both within about 1.5e-9 of the closed form
 * (RadialIntegrals), where 1 a0 is off by 1.4e-8. For Rb the two agree to 3e-8 (the core cut-off
 * falls on different grid points); RydbergDipoleBenchmarkTest checks 1e-7.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(2)
public class RydbergDipoleBenchmark {

    /** Principal quantum number of both states. */
    @Param({"100"})
    public int n;

    /** The uniform step in r of the baseline, a0. */
    static final double UNIFORM_STEP = 0.5;

    AlkaliAtom rubidium;
    org.ritzwerk.atom.State s;
    org.ritzwerk.atom.State p;
    double sStar;
    double pStar;
    double coreRadius;
    double lengthScale;

    /** Builds Rb-87 from the Mack 2011 / Li 2003 series (as in refdata's built-in set). */
    @Setup
    public void setUp() {
        double rInf = PhysicalConstants.RYDBERG.value() / 100;
        double electronU = 5.48579909065e-4;
        double rydberg = rInf / (1 + electronU / (86.909180529 - electronU));
        Species rb87 = new Species(37, 87, 0);
        QuantumDefects defects = new QuantumDefects(new DataSetInfo("bench-rb-87", DataKind.QUANTUM_DEFECTS,
                "benchmark set", "1", Provenance.published("Mack et al. 2011; Li et al. 2003"), List.of(rb87)),
                rb87, 33690.804799, rydberg, List.of(new QuantumDefects.Series(0, 1, List.of(3.1311807, 0.1787), 10),
                        new QuantumDefects.Series(1, 3, List.of(2.6416737, 0.2950), 15)));
        rubidium = AlkaliAtom.of(defects, List.of(), new CorePolarizability(9.116, 38.4, "benchmark"));
        s = org.ritzwerk.atom.State.of(n, 0, 1);
        p = org.ritzwerk.atom.State.of(n, 1, 3);
        sStar = rubidium.level(s).effectiveN();
        pStar = rubidium.level(p).effectiveN();
        lengthScale = rInf / rydberg;
        coreRadius = Math.cbrt(9.116) / lengthScale;
    }

    /** @return {@code <ns|r|np>} in a0, square-root grid */
    @Benchmark
    public double numerovSquareRootGrid() {
        // A fresh atom each time: the atom keeps the wavefunctions it computed, and the baseline
        // integrates both states anew on every call too.
        return rubidium.withStep(AlkaliAtom.DEFAULT_STEP).radialDipoleBohr(s, p);
    }

    /** @return {@code <ns|r|np>} in a0, uniform grid in r */
    @Benchmark
    public double naiveUniformGrid() {
        double[] a = uniform(sStar, 0, coreRadius, UNIFORM_STEP);
        double[] b = uniform(pStar, 1, coreRadius, UNIFORM_STEP);
        return overlap(a, b, UNIFORM_STEP) * lengthScale;
    }

    /**
     * P(r) = r R(r) on r_k = k dr by Numerov, inward from the same r_max as the engine, with the
     * same stopping rules (core radius; for l > 0, |P| growing inside the inner turning point),
     * normalised by the trapezoid rule. Entries below the stop are zero.
     */
    static double[] uniform(double nStar, int l, double inner, double dr) {
        double rMax = 2 * nStar * nStar + 20 * Math.pow(nStar, 4.0 / 3) + 20;
        int last = (int) Math.ceil(rMax / dr);
        int innermost = Math.max(1, (int) Math.floor(inner / dr));
        double ll = l * (l + 1.0);
        double e = 1 / (nStar * nStar);
        double turning = l == 0 ? 0 : nStar * nStar * (1 - Math.sqrt(Math.max(0, 1 - ll / (nStar * nStar))));
        double h12 = dr * dr / 12;
        double[] y = new double[last + 1];
        double gLast = ll / (rMax * rMax) - 2 / rMax + e;
        y[last] = 1e-10;
        y[last - 1] = y[last] * Math.exp(dr * Math.sqrt(Math.max(gLast, 0)));
        int stop = innermost;
        for (int k = last - 1; k > innermost; k--) {
            double r = k * dr;
            double rPrev = (k - 1) * dr;
            double rNext = (k + 1) * dr;
            double g = ll / (r * r) - 2 / r + e;
            double gPrev = ll / (rPrev * rPrev) - 2 / rPrev + e;
            double gNext = ll / (rNext * rNext) - 2 / rNext + e;
            double next = (2 * (1 + 5 * h12 * g) * y[k] - (1 - h12 * gNext) * y[k + 1]) / (1 - h12 * gPrev);
            if (l > 0 && rPrev < turning && Math.abs(next) > Math.abs(y[k])) {
                stop = k;
                break;
            }
            y[k - 1] = next;
        }
        for (int k = 0; k < stop; k++) {
            y[k] = 0;
        }
        double sum = 0;
        for (int k = stop; k <= last; k++) {
            sum += y[k] * y[k];
        }
        double norm = Math.sqrt(sum * dr); // positive at large r, as in the engine
        for (int k = stop; k <= last; k++) {
            y[k] /= norm;
        }
        return y;
    }

    /** integral P_a P_b r dr on the common uniform grid. */
    static double overlap(double[] a, double[] b, double dr) {
        int to = Math.min(a.length, b.length);
        double sum = 0;
        for (int k = 1; k < to; k++) {
            sum += a[k] * b[k] * (k * dr);
        }
        return sum * dr;
    }
}
