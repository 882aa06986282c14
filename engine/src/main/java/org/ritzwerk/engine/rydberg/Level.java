package org.ritzwerk.engine.rydberg;

import java.util.Objects;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;

/**
 * A level as the model gives it.
 *
 * @param state       the state
 * @param energyPerCm energy above the ground level, cm^-1
 * @param effectiveN  the effective principal quantum number {@code n* = sqrt(R_M / (E_limit - E))}
 * @param origin      where the energy comes from
 */
public record Level(State state, double energyPerCm, double effectiveN, LevelOrigin origin) {

    /**
     * Validates the components.
     *
     * @param state       the state
     * @param energyPerCm energy above the ground level, cm^-1
     * @param effectiveN  the effective principal quantum number
     * @param origin      where the energy comes from
     */
    public Level {
        Objects.requireNonNull(state, "state");
        Objects.requireNonNull(origin, "origin");
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
