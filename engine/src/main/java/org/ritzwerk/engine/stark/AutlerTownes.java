package org.ritzwerk.engine.stark;

import java.util.Objects;
import org.ritzwerk.atom.State;

/**
 * A resonant microwave field on one transition and the Autler-Townes splitting it makes,
 * {@code Delta f = Omega / (2 pi) = |d| E / h}, with the element {@code d = <upper m'|d_q|lower m>}
 * of the polarisation q stated. Immutable.
 *
 * @param lower         the lower state of the transition
 * @param twoMLower     twice its m_j
 * @param upper         the upper state
 * @param twoMUpper     twice its m_j ({@code = twoMLower + 2q})
 * @param polarisation  q: 0 for a field along the quantisation axis (pi), +1 or -1 for circular
 * @param dipoleEa0     the element {@code <upper m'|d_q|lower m>}, e a0 (its sign is the phase convention's)
 * @param fieldVPerM    the field amplitude of that polarisation component, V/m
 * @param splittingHz   the splitting {@code Omega / (2 pi)}, Hz
 */
public record AutlerTownes(State lower, int twoMLower, State upper, int twoMUpper, int polarisation,
        double dipoleEa0, double fieldVPerM, double splittingHz) {

    /**
     * Validates the components.
     *
     * @param lower        the lower state
     * @param twoMLower    twice its m_j
     * @param upper        the upper state
     * @param twoMUpper    twice its m_j
     * @param polarisation q, -1 to 1
     * @param dipoleEa0    the element, e a0, finite and not zero
     * @param fieldVPerM   the field, V/m, finite and not negative
     * @param splittingHz  the splitting, Hz, finite and not negative
     */
    public AutlerTownes {
        Objects.requireNonNull(lower, "lower");
        Objects.requireNonNull(upper, "upper");
        if (!Double.isFinite(dipoleEa0) || dipoleEa0 == 0 || !(fieldVPerM >= 0) || !(splittingHz >= 0)
                || Double.isInfinite(fieldVPerM) || Double.isInfinite(splittingHz)) {
            throw new IllegalArgumentException("Autler-Townes record needs a finite non-zero dipole and finite "
                    + "non-negative field and splitting, got d = " + dipoleEa0 + " e a0, E = " + fieldVPerM
                    + " V/m, splitting = " + splittingHz + " Hz");
        }
    }

    /** @return the Rabi frequency Omega = |d| E / hbar, rad/s */
    public double rabiRadPerS() {
        return 2 * Math.PI * splittingHz;
    }
}
