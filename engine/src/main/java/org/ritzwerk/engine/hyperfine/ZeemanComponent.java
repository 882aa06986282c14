package org.ritzwerk.engine.hyperfine;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * One m_F-resolved electric-dipole component of a line in a magnetic field. Immutable and
 * thread-safe.
 *
 * <p>NaN policy: {@code frequencyUncertaintyHertz} is NaN when not estimated (the centroid's, or an
 * uncertainty of A or B that a state's energy depends on, is not stated). {@code fieldSlopeHertzPerTesla} is
 * always finite.
 *
 * @param twoFLower                 2 F of the lower state (zero-field label)
 * @param twoMFLower                2 m_F of the lower state
 * @param twoFUpper                 2 F' of the upper state (zero-field label)
 * @param twoMFUpper                2 m_F' of the upper state
 * @param q                         the photon's angular momentum along the field, m_F' - m_F: -1 (sigma-), 0 (pi),
 *                                  +1 (sigma+)
 * @param frequencyHertz            frequency, Hz: the line's hyperfine-free centroid plus the upper state's
 *                                  energy minus the lower state's
 * @param relativeStrength          |&lt;upper|d_q|lower&gt;|^2 / ((2I+1) S_JJ'): the shares of all components
 *                                  of a line, at any field, sum to 1
 * @param frequencyUncertaintyHertz the frequency's standard uncertainty on its own, Hz: the centroid's and the
 *                                  two states' energy uncertainties (from the stated u(A), u(B) of the levels,
 *                                  first order by the Hellmann-Feynman theorem) in quadrature, as
 *                                  {@link HyperfineComponent#frequencyUncertaintyHertz} at zero field, which it
 *                                  equals there; where a field uncertainty u(B) is given, also
 *                                  |d nu/dB| u(B) in quadrature (first order; the same field error moves both
 *                                  states, so the component's slope enters, not the states' own); NaN when not
 *                                  estimated
 * @param lowerDominant             the lower state's largest |m_J m_I> component and its weight
 * @param upperDominant             the upper state's largest |m_J m_I> component and its weight
 * @param fieldSlopeHertzPerTesla   the frequency's first derivative by the field at this field, d nu/dB, Hz per
 *                                  tesla: the upper state's {@link ZeemanState#fieldSlopeHertzPerTesla} minus the
 *                                  lower's (each exact by the Hellmann-Feynman theorem); positive when the
 *                                  component moves up with the field, near 0 for a field-insensitive component
 */
public record ZeemanComponent(int twoFLower, int twoMFLower, int twoFUpper, int twoMFUpper, int q,
        double frequencyHertz, double relativeStrength, double frequencyUncertaintyHertz,
        UncoupledLabel lowerDominant, UncoupledLabel upperDominant, double fieldSlopeHertzPerTesla) {

    /**
     * Checks the labels are there.
     *
     * @param twoFLower                 2 F of the lower state
     * @param twoMFLower                2 m_F of the lower state
     * @param twoFUpper                 2 F' of the upper state
     * @param twoMFUpper                2 m_F' of the upper state
     * @param q                         m_F' - m_F
     * @param frequencyHertz            frequency, Hz
     * @param relativeStrength          share of the line strength
     * @param frequencyUncertaintyHertz its standard uncertainty, Hz, or NaN when not estimated
     * @param lowerDominant             the lower state's largest |m_J m_I> component; not null
     * @param upperDominant             the upper state's largest |m_J m_I> component; not null
     * @param fieldSlopeHertzPerTesla   d nu/dB, Hz per tesla; finite
     */
    public ZeemanComponent {
        Objects.requireNonNull(lowerDominant, "lowerDominant");
        Objects.requireNonNull(upperDominant, "upperDominant");
        if (!Double.isFinite(fieldSlopeHertzPerTesla)) {
            throw new IllegalArgumentException("a component's field slope must be finite (Hz per tesla), got "
                    + fieldSlopeHertzPerTesla);
        }
    }

    /** @return the frequency's standard uncertainty, Hz, or empty when not estimated */
    public OptionalDouble frequencyUncertainty() {
        return Double.isNaN(frequencyUncertaintyHertz) ? OptionalDouble.empty()
                : OptionalDouble.of(frequencyUncertaintyHertz);
    }
}
