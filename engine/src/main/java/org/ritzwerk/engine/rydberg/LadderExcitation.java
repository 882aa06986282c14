package org.ritzwerk.engine.rydberg;

import java.util.Objects;
import java.util.OptionalDouble;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Medium;

/**
 * Two-photon ladder excitation {@code lower -> intermediate -> upper} with the two laser
 * frequencies on resonance (no detuning, no light shifts, no hyperfine structure).
 *
 * @param lower        the start (usually the ground state)
 * @param intermediate the intermediate state
 * @param upper        the Rydberg state
 * @param firstHz      frequency of the first photon, Hz
 * @param secondHz     frequency of the second photon, Hz
 * @param firstUncertaintyHz  standard uncertainty of {@code firstHz}, Hz, or NaN when not estimated
 * @param secondUncertaintyHz standard uncertainty of {@code secondHz}, Hz, or NaN when not estimated
 */
public record LadderExcitation(State lower, State intermediate, State upper, double firstHz, double secondHz,
        double firstUncertaintyHz, double secondUncertaintyHz) {

    /**
     * Validates the components.
     *
     * @param lower        the start (usually the ground state)
     * @param intermediate the intermediate state
     * @param upper        the Rydberg state
     * @param firstHz      frequency of the first photon, Hz
     * @param secondHz     frequency of the second photon, Hz
     * @param firstUncertaintyHz  standard uncertainty of {@code firstHz}, Hz, or NaN when not estimated
     * @param secondUncertaintyHz standard uncertainty of {@code secondHz}, Hz, or NaN when not estimated
     */
    public LadderExcitation {
        Objects.requireNonNull(lower, "lower");
        Objects.requireNonNull(intermediate, "intermediate");
        Objects.requireNonNull(upper, "upper");
    }

    /**
     * A ladder without uncertainties.
     *
     * @param lower        the start (usually the ground state)
     * @param intermediate the intermediate state
     * @param upper        the Rydberg state
     * @param firstHz      frequency of the first photon, Hz
     * @param secondHz     frequency of the second photon, Hz
     */
    public LadderExcitation(State lower, State intermediate, State upper, double firstHz, double secondHz) {
        this(lower, intermediate, upper, firstHz, secondHz, Double.NaN, Double.NaN);
    }

    /** @return the first photon's frequency uncertainty, Hz, or empty when not estimated */
    public OptionalDouble firstUncertainty() {
        return Double.isNaN(firstUncertaintyHz) ? OptionalDouble.empty() : OptionalDouble.of(firstUncertaintyHz);
    }

    /** @return the second photon's frequency uncertainty, Hz, or empty when not estimated */
    public OptionalDouble secondUncertainty() {
        return Double.isNaN(secondUncertaintyHz) ? OptionalDouble.empty() : OptionalDouble.of(secondUncertaintyHz);
    }

    /** @return the vacuum wavelength of the first photon, metres */
    public double firstVacuumMetres() {
        return PhysicalConstants.C / firstHz;
    }

    /** @return the vacuum wavelength of the second photon, metres */
    public double secondVacuumMetres() {
        return PhysicalConstants.C / secondHz;
    }

    /**
     * @param medium vacuum or air under a refractive-index model
     * @return the first photon's wavelength in that medium, metres
     * @throws org.ritzwerk.medium.MediumException outside the air model's validity range
     */
    public double firstMetres(Medium medium) {
        return medium.fromVacuum(firstVacuumMetres());
    }

    /**
     * @param medium vacuum or air under a refractive-index model
     * @return the second photon's wavelength in that medium, metres
     * @throws org.ritzwerk.medium.MediumException outside the air model's validity range
     */
    public double secondMetres(Medium medium) {
        return medium.fromVacuum(secondVacuumMetres());
    }
}
