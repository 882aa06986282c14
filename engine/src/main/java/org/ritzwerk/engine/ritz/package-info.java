/**
 * Lines and levels of any atom from its measured levels and lines: the Ritz combination principle
 * under the electric-dipole selection rules ({@link org.ritzwerk.engine.ritz.RitzLines} over
 * {@link org.ritzwerk.engine.ritz.RitzLevels}, giving
 * {@link org.ritzwerk.engine.ritz.RitzTransitions}), level energies optimised from measured line
 * wavenumbers by weighted least squares ({@link org.ritzwerk.engine.ritz.LevelOptimizer}), and
 * Rydberg-Ritz fits of series of levels ({@link org.ritzwerk.engine.ritz.SeriesFitter}).
 *
 * <p>Units: level energies and wavenumbers in cm^-1 (above the species' ground level), their
 * covariances in cm^-2, wavelengths in nm (vacuum unless a medium is named), Einstein A in
 * s^-1. Quantities that are not known are absent ({@code OptionalDouble}), never NaN, in the
 * public accessors.
 *
 * <p>Everything here is immutable and thread-safe, except the builders.
 */
package org.ritzwerk.engine.ritz;
