package org.ritzwerk.engine.rydberg;

import java.util.Objects;
import org.ritzwerk.atom.State;

/**
 * One electric-dipole channel out of a state.
 *
 * @param from         the state that decays (or is driven)
 * @param to           the state reached
 * @param frequencyHz  the transition frequency |E_to - E_from| / h, Hz
 * @param ratePerSecond the rate in s^-1 (spontaneous, or black-body-induced, as the method says)
 */
public record DecayChannel(State from, State to, double frequencyHz, double ratePerSecond) {

    /**
     * Validates the components.
     *
     * @param from          the state that decays (or is driven)
     * @param to            the state reached
     * @param frequencyHz   the transition frequency |E_to - E_from| / h, Hz
     * @param ratePerSecond the rate in s^-1
     */
    public DecayChannel {
        Objects.requireNonNull(from, "from");
        Objects.requireNonNull(to, "to");
    }
}
