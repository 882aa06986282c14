package org.ritzwerk.engine.hyperfine;

/**
 * One m_F-resolved electric-dipole component of a line in a magnetic field. Immutable and
 * thread-safe.
 *
 * @param twoFLower        2 F of the lower state (zero-field label)
 * @param twoMFLower       2 m_F of the lower state
 * @param twoFUpper        2 F' of the upper state (zero-field label)
 * @param twoMFUpper       2 m_F' of the upper state
 * @param q                the photon's angular momentum along the field, m_F' - m_F: -1 (sigma-), 0 (pi), +1 (sigma+)
 * @param frequencyHertz   frequency, Hz: the line's hyperfine-free centroid plus the upper state's
 *                         energy minus the lower state's
 * @param relativeStrength |&lt;upper|d_q|lower&gt;|^2 / ((2I+1) S_JJ'): the shares of all components of
 *                         a line, at any field, sum to 1
 */
public record ZeemanComponent(int twoFLower, int twoMFLower, int twoFUpper, int twoMFUpper, int q,
        double frequencyHertz, double relativeStrength) {
}
