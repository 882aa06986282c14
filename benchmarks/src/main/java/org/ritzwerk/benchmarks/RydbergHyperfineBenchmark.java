package org.ritzwerk.benchmarks;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
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
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.AlkaliHyperfine;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.RydbergHyperfine;

/**
 * The hyperfine constants of the Cs-133 levels n = {@link #nFrom} to {@link #nMax}, l <= 3, as {@code levels
 * --hyperfine} asks for them: {@link #keptLaw} through {@link DataContext#hyperfineConstants}, whose n*^-3 law's
 * error (from every series' measured levels) the context works out once and keeps, beside the naive baseline
 * {@link #lawPerLevel}, the same constants from {@link RydbergHyperfine#recomputingLaw()}, which works the law out
 * anew for each scaled level (every series' drift and the caps of each l: more than the code before the memo
 * did per level, which worked out the overall figures and the one series' drift). One shared context, its atoms
 * assembled in the set-up; the
 * kept law is worked out in the first call and reused after, so the figure is a warm context's listing.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(2)
public class RydbergHyperfineBenchmark {

    /** The lowest n listed. */
    @Param({"7"})
    public int nFrom;

    /** The highest n listed. */
    @Param({"80"})
    public int nMax;

    private DataContext context;
    private RydbergHyperfine plain;
    private AlkaliHyperfine measured;
    private Species cs;
    private List<org.ritzwerk.atom.State> states;

    /** One context, its Cs atom and the atoms of every series' isotope assembled. */
    @Setup
    public void setUp() {
        context = DataContext.builtIn();
        cs = Species.parse("Cs-133 I");
        plain = context.rydbergHyperfine().recomputingLaw();
        measured = context.alkaliHyperfine();
        for (RydbergHyperfine.Series s : context.rydbergHyperfine().series()) {
            context.alkaliAtom(s.species());
        }
        AlkaliAtom atom = context.alkaliAtom(cs);
        states = new ArrayList<>();
        for (int n = nFrom; n <= nMax; n++) {
            for (int l = 0; l <= Math.min(3, n - 1); l++) {
                for (int twoJ = Math.max(1, 2 * l - 1); twoJ <= 2 * l + 1; twoJ += 2) {
                    if (n >= atom.lowestN(l)) {
                        states.add(org.ritzwerk.atom.State.of(n, l, twoJ));
                    }
                }
            }
        }
    }

    /** @return the sum of A and u(A) over the levels with constants, Hz, the law kept by the context */
    @Benchmark
    public double keptLaw() {
        double sum = 0;
        for (org.ritzwerk.atom.State state : states) {
            Optional<HyperfineConstants> c = context.hyperfineConstants(cs, state);
            if (c.isPresent()) {
                sum += c.get().aHertz() + c.get().aUncertaintyHertz();
            }
        }
        return sum;
    }

    /** @return the same sum, the law worked out anew for each scaled level (the naive baseline) */
    @Benchmark
    public double lawPerLevel() {
        double sum = 0;
        for (org.ritzwerk.atom.State state : states) {
            Optional<AlkaliHyperfine.LevelConstants> low = measured.constants(cs, state);
            Optional<HyperfineConstants> c = low.isPresent() ? Optional.of(low.get().constants())
                    : plain.constants(context, cs, state);
            if (c.isPresent()) {
                sum += c.get().aHertz() + c.get().aUncertaintyHertz();
            }
        }
        return sum;
    }
}
