/**
 * Rydberg states of alkali atoms (Li, Na, K, Rb, Cs) from quantum-defect parameters: levels with
 * their provenance (measured, Rydberg-Ritz fit, core-polarization estimate, hydrogenic), radial
 * wavefunctions by Numerov integration in the Coulomb approximation on a square-root grid,
 * radial and reduced dipole matrix elements, spontaneous and black-body-induced rates,
 * lifetimes, transition frequencies and two-photon ladder wavelengths.
 *
 * <p>The states ({@link org.ritzwerk.atom.State}) and the parameters the models take (quantum
 * defects, measured levels, core polarizabilities, model-potential parameters; in
 * {@code org.ritzwerk.data}) are value types of the api module; this package computes with them
 * ({@link org.ritzwerk.engine.internal.radial.ModelPotentials} evaluates a model potential).
 *
 * <p>Units: level energies in cm^-1 above the ground level (and joules where the method name
 * says so), frequencies in Hz, wavelengths in metres, radii and radial integrals in Bohr radii
 * a0, dipole matrix elements in e a0, rates in s^-1, lifetimes in s, temperatures in K,
 * polarizabilities in atomic units (a0^3, a0^5). Quantum numbers are integers with j given
 * doubled ({@code twoJ}).
 *
 * <p>Everything here is immutable and thread-safe; nothing is cached between calls, so
 * wavefunctions are recomputed per call (about a millisecond at n = 100).
 */
package org.ritzwerk.engine.rydberg;
