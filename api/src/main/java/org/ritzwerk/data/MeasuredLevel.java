package org.ritzwerk.data;

import java.util.Objects;
import org.ritzwerk.atom.State;

/**
 * A measured level energy handed to the model, which uses it instead of any formula.
 *
 * @param state       the state
 * @param energyPerCm energy above the ground level in cm^-1; finite, not negative
 * @param source      where the value comes from; not blank
 */
public record MeasuredLevel(State state, double energyPerCm, String source) {

    /**
     * Validates the components.
     *
     * @param state       the state
     * @param energyPerCm energy above the ground level in cm^-1; finite, not negative
     * @param source      where the value comes from; not blank
     */
    public MeasuredLevel {
        Objects.requireNonNull(state, "state");
        Objects.requireNonNull(source, "source");
        if (!(energyPerCm >= 0) || Double.isInfinite(energyPerCm)) {
            throw new IllegalArgumentException("measured energy of " + state + " must be finite and >= 0 cm-1, got "
                    + energyPerCm);
        }
        if (source.isBlank()) {
            throw new IllegalArgumentException("measured level " + state + " needs a source");
        }
    }
}
