package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/**
 * The n*^-3 law's own error (every series' measured levels in the data) is worked out once per data context, however
 * many levels ask, and every figure is the same, bit for bit, as when it is worked out anew for each level (the
 * plain method, {@link RydbergHyperfine#recomputingLaw()}, as the code did before the context kept it). No timing
 * here: the benchmark {@code RydbergHyperfineBenchmark} measures the gain.
 */
class RydbergHyperfineMemoTest {

    private static final Species CS = Species.parse("Cs-133 I");

    /** Every level n = 7..80, l <= 3 of Cs-133 asks once: the law is worked out once, and the same object kept. */
    @Test
    void theLawIsWorkedOutOncePerContext() {
        DataContext context = DataContext.builtIn();
        RydbergHyperfine data = context.rydbergHyperfine();
        assertEquals(0, context.scalingLawsWorkedOut());
        RydbergHyperfine.ScalingLawError first = data.scalingLawError(context);
        int scaled = 0;
        for (State state : states(context.alkaliAtom(CS), 7, 80)) {
            scaled += context.hyperfineConstants(CS, state).isPresent() ? 1 : 0;
            context.hyperfineLevels(CS, state);
        }
        assertTrue(scaled > 300, "levels with constants: " + scaled);
        assertSame(first, data.scalingLawError(context));
        assertEquals(1, context.scalingLawsWorkedOut());
        // another context works it out once for itself (a user's file could change the atoms' levels)
        DataContext other = DataContext.builtIn();
        assertNotSame(first, other.rydbergHyperfine().scalingLawError(other));
        assertEquals(first, other.rydbergHyperfine().scalingLawError(other));
        assertEquals(1, other.scalingLawsWorkedOut());
        assertEquals(1, context.scalingLawsWorkedOut());
        // the plain method keeps nothing in the context
        assertNotSame(first, data.recomputingLaw().scalingLawError(context));
        assertEquals(1, context.scalingLawsWorkedOut());
    }

    /** Many threads asking a new context at once: worked out once, and every thread gets the same object. */
    @Test
    void manyThreadsAskingAtOnceGetOneLaw() throws Exception {
        DataContext context = DataContext.builtIn();
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Callable<RydbergHyperfine.ScalingLawError>> tasks = new ArrayList<>();
            for (int i = 0; i < 16; i++) {
                int n = 20 + i;
                tasks.add(() -> {
                    context.hyperfineConstants(CS, State.of(n, 1, 3));
                    return context.rydbergHyperfine().scalingLawError(context);
                });
            }
            RydbergHyperfine.ScalingLawError first = null;
            for (Future<RydbergHyperfine.ScalingLawError> f : pool.invokeAll(tasks)) {
                first = first == null ? f.get() : first;
                assertSame(first, f.get());
            }
        } finally {
            pool.shutdownNow();
        }
        assertEquals(1, context.scalingLawsWorkedOut());
    }

    /**
     * Every level n <= 80, l <= 3 of every alkali isotope of the built-in data (own rows and borrowed ones): the
     * constants, their uncertainties, the law's relative uncertainty and the origin are those of the plain method,
     * which works the law out anew for each level (record equality: each double compared exactly).
     */
    @Test
    void everyFigureIsThatOfThePlainMethodForEverySpecies() {
        DataContext context = DataContext.builtIn();
        RydbergHyperfine kept = context.rydbergHyperfine();
        RydbergHyperfine plain = kept.recomputingLaw();
        int compared = 0;
        int withLaw = 0;
        for (Species species : context.alkaliSpecies()) {
            for (State state : states(context.alkaliAtom(species), 1, 80)) {
                Optional<HyperfineConstants> expected = plain.constants(context, species, state);
                assertEquals(expected, kept.constants(context, species, state), species.notation() + " " + state);
                Optional<Double> law = kept.scalingLawRelativeUncertainty(context, species, state);
                assertEquals(plain.scalingLawRelativeUncertainty(context, species, state), law,
                        species.notation() + " " + state);
                assertEquals(plain.origin(context, species, state), kept.origin(context, species, state));
                compared += expected.isPresent() ? 1 : 0;
                withLaw += law.orElse(0.0) > 0 ? 1 : 0;
            }
        }
        assertTrue(compared > 2400, "levels with constants compared: " + compared);
        assertTrue(withLaw > 2000, "levels with a law error compared: " + withLaw);
        assertEquals(plain.scalingLawError(context), kept.scalingLawError(context));
        assertEquals(1, context.scalingLawsWorkedOut());
    }

    /** The levels of an atom from n = from to to, l <= 3, that exist in its model. */
    private static List<State> states(AlkaliAtom atom, int from, int to) {
        List<State> out = new ArrayList<>();
        for (int n = from; n <= to; n++) {
            for (int l = 0; l <= Math.min(3, n - 1); l++) {
                for (int twoJ = Math.max(1, 2 * l - 1); twoJ <= 2 * l + 1; twoJ += 2) {
                    if (n >= atom.lowestN(l)) {
                        out.add(State.of(n, l, twoJ));
                    }
                }
            }
        }
        return out;
    }
}
