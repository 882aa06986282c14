package org.ritzwerk.engine.pair;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.TestAtoms;

class PairPotentialsTest {

    private static final AlkaliAtom RB = TestAtoms.rubidium();

    /** Far apart, the 60S + 60S potential is C6 / R^6 of the perturbative sum; shares add up to 1. */
    @Test
    void farApartThePotentialIsTheVanDerWaalsShift() {
        State s = State.of(60, 0, 1);
        PairState pair = new PairState(s, 1, s, 1);
        double[] r = {6e-6, 8e-6, 12e-6};
        PairPotentialResult result = PairPotentials.of(RB).withBasis(2, 2, 30e9).potentials(pair, r);
        double c6 = PairInteractions.of(RB).withNeighbourRange(2).c6(pair).c6HzM6();
        for (int i = 0; i < r.length; i++) {
            double expected = c6 / Math.pow(r[i], 6);
            // the pair basis holds fewer channels (l <= 2, within 30 GHz) than the sum: within 5 %
            assertEquals(expected, result.targetEnergyHz(i), 0.05 * Math.abs(expected), "R = " + r[i]);
            assertEquals(1, Arrays.stream(result.shares(i)).sum(), 1e-9);
        }
        assertTrue(result.basisSize() > 20, "basis " + result.basisSize());
    }

    @Test
    void badInputIsRefused() {
        State s = State.of(60, 0, 1);
        PairState pair = new PairState(s, 1, s, 1);
        assertThrows(IllegalArgumentException.class, () -> PairPotentials.of(RB).potentials(pair, new double[] {0}));
        assertThrows(IllegalArgumentException.class, () -> PairPotentials.of(RB).withBasis(2, 2, -1));
        State f = State.of(60, 3, 7);
        assertThrows(org.ritzwerk.engine.stark.StarkException.class,
                () -> PairPotentials.of(RB).withBasis(1, 2, 1e9).potentials(new PairState(f, 1, f, 1),
                        new double[] {1e-5}));
    }
}
