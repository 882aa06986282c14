package org.ritzwerk.engine.hyperfine;

/**
 * One F -> F' electric-dipole component of a line at zero field. Immutable and thread-safe.
 *
 * @param twoFLower        2 F of the lower level
 * @param twoFUpper        2 F' of the upper level
 * @param frequencyHertz   the component's frequency, Hz: the line's hyperfine-free centroid plus the
 *                         upper F' level's shift minus the lower F level's shift
 * @param relativeStrength its share of the fine-structure line strength, (2F+1)(2F'+1) {J F I; F' J' 1}^2
 *                         / (2I+1); the shares of all components of a line sum to 1
 */
public record HyperfineComponent(int twoFLower, int twoFUpper, double frequencyHertz, double relativeStrength) {
}
