package org.ritzwerk.engine.pair;

import java.util.Objects;
import org.ritzwerk.atom.State;

/**
 * A product state {@code |n1 l1 j1 m1; n2 l2 j2 m2>} of two atoms. Immutable.
 *
 * @param first   the first atom's state
 * @param twoM1   twice m_j of the first atom
 * @param second  the second atom's state
 * @param twoM2   twice m_j of the second atom
 */
public record PairState(State first, int twoM1, State second, int twoM2) {

    /**
     * Validates the components.
     *
     * @param first  the first atom's state
     * @param twoM1  twice m_j of the first atom, a projection of its j
     * @param second the second atom's state
     * @param twoM2  twice m_j of the second atom, a projection of its j
     */
    public PairState {
        Objects.requireNonNull(first, "first");
        Objects.requireNonNull(second, "second");
        check(first, twoM1);
        check(second, twoM2);
    }

    private static void check(State s, int twoM) {
        if (Math.abs(twoM) > s.twoJ() || ((twoM + s.twoJ()) & 1) != 0) {
            throw new IllegalArgumentException("2m_j = " + twoM + " is not a projection of j = " + s.twoJ() + "/2 of "
                    + s.label());
        }
    }

    /** @return the same pair with the atoms exchanged */
    public PairState swapped() {
        return new PairState(second, twoM2, first, twoM1);
    }

    /** @return e.g. {@code 60s1/2(m=1/2) 60s1/2(m=1/2)} */
    public String label() {
        return first.label() + "(m=" + twoM1 + "/2) " + second.label() + "(m=" + twoM2 + "/2)";
    }
}
