package org.ritzwerk.engine.ritz;

/**
 * The level held in a system of levels that no chain of measured lines joins to the main reference
 * level of a {@link MeasuredLines} problem, for {@link LevelOptimizer#withSeparateSystems}: either
 * floating (its system's energies are quoted relative to it, {@code E = value + x} with x unknown,
 * the usual convention of evaluators; common practice) or anchored at a known energy above the ground
 * level with its standard uncertainty (e.g. from a series limit or another measurement), which makes
 * the system's energies absolute. Immutable and thread-safe.
 *
 * @param label            the level's label (compared as {@link MeasuredLines} compares labels: ends
 *                         stripped, internal white space one blank)
 * @param energyPerCm      its energy above the ground level, cm^-1, finite and not negative; NaN when floating
 * @param uncertaintyPerCm the standard uncertainty of that energy, cm^-1, finite and not negative; NaN when
 *                         floating
 */
public record SystemReference(String label, double energyPerCm, double uncertaintyPerCm) {

    /**
     * Validates the components.
     *
     * @param label            the level's label
     * @param energyPerCm      its energy above the ground level, cm^-1; NaN when floating
     * @param uncertaintyPerCm its standard uncertainty, cm^-1; NaN when floating
     * @throws IllegalArgumentException for a blank label, an energy that is neither NaN nor finite and not
     *                                  negative, an uncertainty that is not finite and not negative for an
     *                                  anchored level, or one given for a floating level
     */
    public SystemReference {
        if (label == null || label.isBlank()) {
            throw new IllegalArgumentException("a system reference needs a level label, got '" + label + "'");
        }
        if (Double.isNaN(energyPerCm)) {
            if (!Double.isNaN(uncertaintyPerCm)) {
                throw new IllegalArgumentException("system reference '" + label + "': an uncertainty ("
                        + uncertaintyPerCm + " cm-1) without an energy");
            }
        } else {
            if (!(energyPerCm >= 0) || Double.isInfinite(energyPerCm)) {
                throw new IllegalArgumentException("system reference '" + label + "': the energy must be finite and "
                        + "not negative cm-1, got " + energyPerCm);
            }
            if (!(uncertaintyPerCm >= 0) || Double.isInfinite(uncertaintyPerCm)) {
                throw new IllegalArgumentException("system reference '" + label + "': the uncertainty must be "
                        + "finite and not negative cm-1, got " + uncertaintyPerCm);
            }
        }
    }

    /**
     * @param label the level whose system is quoted relative to it
     * @return a floating reference: the system's energies are relative to this level's unknown energy
     */
    public static SystemReference floating(String label) {
        return new SystemReference(label, Double.NaN, Double.NaN);
    }

    /**
     * @param label            the level
     * @param energyPerCm      its known energy above the ground level, cm^-1, finite, not negative
     * @param uncertaintyPerCm its standard uncertainty, cm^-1, finite, not negative (0: exact)
     * @return a reference that makes its system's energies absolute, their uncertainties including this one
     */
    public static SystemReference at(String label, double energyPerCm, double uncertaintyPerCm) {
        return new SystemReference(label, energyPerCm, uncertaintyPerCm);
    }

    /** @return whether the level has a known energy (anchored), rather than floating */
    public boolean isAbsolute() {
        return !Double.isNaN(energyPerCm);
    }
}
