package org.ritzwerk.data;

import java.util.Objects;
import java.util.OptionalDouble;
import org.ritzwerk.atom.State;

/**
 * A measured level energy handed to the model, which uses it instead of any formula.
 *
 * <p>NaN policy: the uncertainty is NaN when the source states none ({@link #statedUncertaintyPerCm()}
 * is then empty); every other NaN or infinity is refused. Immutable and thread-safe.
 *
 * @param state            the state
 * @param energyPerCm      energy above the ground level in cm^-1; finite, not negative
 * @param source           where the value comes from; not blank
 * @param uncertaintyPerCm the energy's standard uncertainty in cm^-1, finite and not negative, or NaN
 *                         when the source states none
 */
public record MeasuredLevel(State state, double energyPerCm, String source, double uncertaintyPerCm) {

    /**
     * Validates the components.
     *
     * @param state            the state
     * @param energyPerCm      energy above the ground level in cm^-1; finite, not negative
     * @param source           where the value comes from; not blank
     * @param uncertaintyPerCm the energy's standard uncertainty in cm^-1, finite and not negative, or
     *                         NaN when the source states none
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
        if (!Double.isNaN(uncertaintyPerCm)
                && !(uncertaintyPerCm >= 0 && uncertaintyPerCm < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("uncertainty of measured level " + state + " must be finite and >= 0"
                    + " cm-1 (or NaN for none stated), got " + uncertaintyPerCm);
        }
    }

    /**
     * A measured level whose source states no uncertainty.
     *
     * @param state       the state
     * @param energyPerCm energy above the ground level in cm^-1; finite, not negative
     * @param source      where the value comes from; not blank
     */
    public MeasuredLevel(State state, double energyPerCm, String source) {
        this(state, energyPerCm, source, Double.NaN);
    }

    /** @return the energy's standard uncertainty in cm^-1, or empty when the source states none */
    public OptionalDouble statedUncertaintyPerCm() {
        return Double.isNaN(uncertaintyPerCm) ? OptionalDouble.empty() : OptionalDouble.of(uncertaintyPerCm);
    }
}
