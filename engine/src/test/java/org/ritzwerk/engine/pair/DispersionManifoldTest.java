package org.ritzwerk.engine.pair;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.TestAtoms;

/**
 * The C6 matrix of a degenerate pair manifold (an atom-sensor review: two Rb 60d5/2 with m = 1/2 split into
 * three potentials at 10 um whose share-weighted mean is the perturbative C6 / R^6, so that C6 is a diagonal
 * element, not a potential's).
 */
class DispersionManifoldTest {

    private static final AlkaliAtom RB = TestAtoms.rubidium();
    private static final State D = State.of(60, 2, 5);

    /**
     * The eigenvalues over R^6 are the long-range limit of the diagonalised pair potentials: at 10 um every
     * potential holding at least 2 % of the pair state lies within 3 % of an eigenvalue's C6 / R^6 with the
     * pair state's share there within 0.02, and the share-weighted mean of the eigenvalues is the C6 of
     * {@link PairInteractions#c6} (its diagonal element) to rounding.
     */
    @Test
    void theEigenvaluesAreThePotentialsFarApart() {
        PairState pair = new PairState(D, 1, D, 1);
        PairInteractions interactions = PairInteractions.of(RB);
        DispersionManifold m = interactions.c6Manifold(pair);
        assertEquals(5, m.states().size(), m.toString()); // M = 1: (5/2,-3/2) ... (-3/2,5/2)
        assertFalse(m.isEigenstate(), m.toString());
        double[] c6 = m.c6Au();
        double[] shares = m.shares();
        assertEquals(1, Arrays.stream(shares).sum(), 1e-9);
        double mean = 0;
        for (int i = 0; i < c6.length; i++) {
            mean += shares[i] * c6[i];
        }
        double diagonal = interactions.c6(pair).c6Au();
        assertEquals(diagonal, mean, 1e-9 * Math.abs(diagonal));
        assertEquals(diagonal, m.diagonalAu(), 1e-9 * Math.abs(diagonal));
        double r = 10e-6;
        PairPotentialResult potentials = PairPotentials.of(RB).potentials(pair, new double[] {r});
        double[] e = potentials.energiesHz(0);
        double[] s = potentials.shares(0);
        double[] hz = Arrays.stream(c6).map(c -> c * DispersionCoefficient.AU_HZ_M6 / Math.pow(r, 6)).toArray();
        int matched = 0;
        for (int k = 0; k < e.length; k++) {
            if (s[k] < 0.02) {
                continue;
            }
            boolean found = false;
            for (int i = 0; i < hz.length; i++) {
                found |= Math.abs(e[k] - hz[i]) <= 0.03 * Math.abs(hz[i]) && Math.abs(s[k] - shares[i]) <= 0.02;
            }
            assertTrue(found, "potential " + e[k] + " Hz, share " + s[k] + " vs " + Arrays.toString(hz) + " "
                    + Arrays.toString(shares));
            matched++;
        }
        assertTrue(matched >= 2, "the pair state splits: " + matched);
        // the spread the pair command reports: the C6 of the potentials range over a factor of more than 10
        double low = Double.POSITIVE_INFINITY;
        double high = 0;
        for (int i = 0; i < c6.length; i++) {
            if (shares[i] > 0.02) {
                low = Math.min(low, Math.abs(c6[i]));
                high = Math.max(high, Math.abs(c6[i]));
            }
        }
        assertTrue(high / low > 10, low + " to " + high);
    }

    /** The stretched pair (m = 5/2 each, M = 5 held by no other pair state) and two nS1/2 are eigenstates. */
    @Test
    void aPairAloneInItsManifoldIsAnEigenstate() {
        PairInteractions interactions = PairInteractions.of(RB);
        PairState stretched = new PairState(D, 5, D, 5);
        DispersionManifold m = interactions.c6Manifold(stretched);
        assertEquals(1, m.states().size());
        assertTrue(m.isEigenstate());
        assertEquals(interactions.c6(stretched).c6Au(), m.c6Au()[0], 1e-12 * Math.abs(m.c6Au()[0]));
        State s = State.of(60, 0, 1);
        DispersionManifold ss = interactions.c6Manifold(new PairState(s, 1, s, 1));
        assertEquals(1, ss.states().size());
        assertTrue(ss.isEigenstate());
        // off axis M is not conserved: the whole manifold of the two levels enters
        DispersionManifold tilted = interactions.withAngle(Math.PI / 2).c6Manifold(new PairState(s, 1, s, 1));
        assertEquals(4, tilted.states().size());
    }

    @Test
    void dipoleCoupledLevelsAreRefused() {
        PairState sp = new PairState(State.of(60, 0, 1), 1, State.of(60, 1, 1), 1);
        assertTrue(assertThrows(IllegalArgumentException.class, () -> PairInteractions.of(RB).c6Manifold(sp))
                .getMessage().contains("first order"));
    }
}
