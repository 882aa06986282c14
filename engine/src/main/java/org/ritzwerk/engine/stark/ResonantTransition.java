package org.ritzwerk.engine.stark;

import java.util.Objects;
import org.ritzwerk.atom.State;

/**
 * A dipole transition from a given state, as found near a requested frequency. Immutable.
 *
 * @param from               the given state
 * @param to                 the other state (l differing by one)
 * @param frequencyHz        {@code |E_to - E_from| / h}, Hz
 * @param detuningHz         {@code frequencyHz - requested}, Hz
 * @param reducedDipoleEa0   {@code <to||d||from>}, e a0 (AlkaliAtom's convention)
 * @param radialDipoleBohr   {@code <to|r|from>}, a0
 */
public record ResonantTransition(State from, State to, double frequencyHz, double detuningHz,
        double reducedDipoleEa0, double radialDipoleBohr) {

    /**
     * Validates the components.
     *
     * @param from             the given state
     * @param to               the other state
     * @param frequencyHz      the transition frequency, Hz
     * @param detuningHz       the detuning from the request, Hz
     * @param reducedDipoleEa0 the reduced element, e a0
     * @param radialDipoleBohr the radial integral, a0
     */
    public ResonantTransition {
        Objects.requireNonNull(from, "from");
        Objects.requireNonNull(to, "to");
    }
}
