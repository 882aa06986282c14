package org.ritzwerk.engine.hyperfine;

import java.util.OptionalDouble;

/**
 * One F -> F' electric-dipole component of a line at zero field. Immutable and thread-safe.
 *
 * <p>NaN policy: {@code frequencyUncertaintyHertz} is NaN when not estimated (the centroid's or a needed
 * hyperfine constant's uncertainty is not stated).
 *
 * @param twoFLower                 2 F of the lower level
 * @param twoFUpper                 2 F' of the upper level
 * @param frequencyHertz            the component's frequency, Hz: the line's hyperfine-free centroid plus the
 *                                  upper F' level's shift minus the lower F level's shift
 * @param relativeStrength          its share of the fine-structure line strength, (2F+1)(2F'+1)
 *                                  {J F I; F' J' 1}^2 / (2I+1); the shares of all components of a line sum to 1
 * @param frequencyUncertaintyHertz the frequency's standard uncertainty on its own, Hz (the centroid's and the
 *                                  two F levels' shifts' in quadrature; {@link HyperfineStructure#components}),
 *                                  or NaN when not estimated
 */
public record HyperfineComponent(int twoFLower, int twoFUpper, double frequencyHertz, double relativeStrength,
        double frequencyUncertaintyHertz) {

    /**
     * A component without an uncertainty.
     *
     * @param twoFLower        2 F of the lower level
     * @param twoFUpper        2 F' of the upper level
     * @param frequencyHertz   the component's frequency, Hz
     * @param relativeStrength its share of the fine-structure line strength
     */
    public HyperfineComponent(int twoFLower, int twoFUpper, double frequencyHertz, double relativeStrength) {
        this(twoFLower, twoFUpper, frequencyHertz, relativeStrength, Double.NaN);
    }

    /** @return the frequency's standard uncertainty, Hz, or empty when not estimated */
    public OptionalDouble frequencyUncertainty() {
        return Double.isNaN(frequencyUncertaintyHertz) ? OptionalDouble.empty()
                : OptionalDouble.of(frequencyUncertaintyHertz);
    }
}
