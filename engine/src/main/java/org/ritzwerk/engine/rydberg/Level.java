package org.ritzwerk.engine.rydberg;

import java.util.Objects;
import java.util.OptionalDouble;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;

/**
 * A level as the model gives it. Immutable and thread-safe.
 *
 * <p>NaN policy: {@code uncertaintyPerCm} is NaN when the model states no uncertainty for the
 * energy ({@link #energyUncertaintyPerCm()} is then empty); see {@link AlkaliAtom} for which levels
 * have one.
 *
 * @param state            the state
 * @param energyPerCm      energy above the ground level, cm^-1
 * @param effectiveN       the effective principal quantum number {@code n* = sqrt(R_M / (E_limit - E))}
 * @param origin           where the energy comes from
 * @param uncertaintyPerCm the energy's standard uncertainty, cm^-1 (finite, not negative), or NaN
 *                         when not estimated
 */
public record Level(State state, double energyPerCm, double effectiveN, LevelOrigin origin,
        double uncertaintyPerCm) {

    /**
     * Validates the components.
     *
     * @param state            the state
     * @param energyPerCm      energy above the ground level, cm^-1
     * @param effectiveN       the effective principal quantum number
     * @param origin           where the energy comes from
     * @param uncertaintyPerCm the energy's standard uncertainty, cm^-1, or NaN when not estimated
     */
    public Level {
        Objects.requireNonNull(state, "state");
        Objects.requireNonNull(origin, "origin");
        if (!Double.isNaN(uncertaintyPerCm)
                && !(uncertaintyPerCm >= 0 && uncertaintyPerCm < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("the uncertainty of " + state.notation() + " must be finite and >= 0"
                    + " cm-1 (NaN for not estimated), got " + uncertaintyPerCm);
        }
    }

    /**
     * A level without an estimated uncertainty.
     *
     * @param state       the state
     * @param energyPerCm energy above the ground level, cm^-1
     * @param effectiveN  the effective principal quantum number
     * @param origin      where the energy comes from
     */
    public Level(State state, double energyPerCm, double effectiveN, LevelOrigin origin) {
        this(state, energyPerCm, effectiveN, origin, Double.NaN);
    }

    /** @return the energy's standard uncertainty in cm^-1, or empty when it is not estimated */
    public OptionalDouble energyUncertaintyPerCm() {
        return Double.isNaN(uncertaintyPerCm) ? OptionalDouble.empty() : OptionalDouble.of(uncertaintyPerCm);
    }

    /** @return the energy above the ground level in joules */
    public double energyJoules() {
        return energyPerCm * 100 * PhysicalConstants.H * PhysicalConstants.C;
    }

    /** @return the quantum defect {@code n - n*} */
    public double quantumDefect() {
        return state.n() - effectiveN;
    }
}
