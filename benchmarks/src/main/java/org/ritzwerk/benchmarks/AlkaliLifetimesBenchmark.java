package org.ritzwerk.benchmarks;

import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.levels.LevelQuery;
import org.ritzwerk.engine.levels.LevelSet;
import org.ritzwerk.engine.levels.LevelSources;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.refdata.DataContext;

/**
 * Rb-87 levels with lifetimes and their model-spread uncertainties up to n = {@link #nMax}, l <= 2, as
 * {@code levels --lifetimes} lists them: {@link #levelQuery} is the library's query, which computes the states of
 * each n side by side on the machine's cores, beside the naive baseline {@link #oneByOne}, the same calls for one
 * state after the other (as the query did before). Each pass starts from a new data context's atom (no
 * wavefunction cached), as a command does; single shots, so the figure is the time of one listing.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2)
@Measurement(iterations = 5)
@Fork(1)
public class AlkaliLifetimesBenchmark {

    /** The highest n listed. */
    @Param({"60"})
    public int nMax;

    private AlkaliAtom atom;

    /** A new context's atom for each pass: its wavefunction cache starts empty. */
    @Setup(Level.Iteration)
    public void setUp() {
        atom = DataContext.builtIn().alkaliAtom(Species.parse("Rb-87 I"));
    }

    /** @return the sum of the lifetimes and their uncertainties, seconds, from the library's query */
    @Benchmark
    public double levelQuery() {
        LevelSet set = LevelQuery.defaults().withMaxN(nMax).withMaxL(2).withLifetimes(true)
                .run(LevelSources.none().withAlkali(atom));
        double sum = 0;
        for (int i = 0; i < set.size(); i++) {
            sum += set.lifetimeSeconds(i).orElse(0) + set.lifetimeUncertaintySeconds(i).orElse(0);
        }
        return sum;
    }

    /** @return the same sum, each state's calls made one after the other (the naive baseline) */
    @Benchmark
    public double oneByOne() {
        double sum = 0;
        for (int n = 1; n <= nMax; n++) {
            for (int l = 0; l <= Math.min(2, n - 1); l++) {
                for (int twoJ = Math.max(1, 2 * l - 1); twoJ <= 2 * l + 1; twoJ += 2) {
                    org.ritzwerk.atom.State state = org.ritzwerk.atom.State.of(n, l, twoJ);
                    if (n < atom.lowestN(l) || state.equals(atom.groundState())) {
                        continue;
                    }
                    try {
                        atom.level(state);
                    } catch (RydbergException e) {
                        continue; // no level: the query skips it too
                    }
                    sum += atom.radiativeLifetime(state) + atom.radiativeLifetimeUncertainty(state).orElse(0);
                }
            }
        }
        return sum;
    }
}
