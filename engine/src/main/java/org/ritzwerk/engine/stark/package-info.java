/**
 * Alkali Rydberg atoms in electric fields: static scalar and tensor polarizabilities by
 * second-order perturbation theory ({@link org.ritzwerk.engine.stark.PolarizabilityCalculator}),
 * Stark maps by diagonalisation in a truncated basis ({@link org.ritzwerk.engine.stark.StarkMap}),
 * and microwave electrometry: Autler-Townes splittings, the field a measured splitting means, and
 * the dipole transitions near a frequency ({@link org.ritzwerk.engine.stark.Electrometry}). All of
 * it is built on the public API of {@link org.ritzwerk.engine.rydberg.AlkaliAtom} (levels, radial
 * functions, dipole matrix elements).
 *
 * <p>Units: fields in V/m at the API (atomic units, 1 E_h / (e a0) = 5.142e11 V/m, inside),
 * energies in cm^-1 above the ground level as {@code AlkaliAtom} gives them, frequencies in Hz,
 * dipole elements in e a0, polarizabilities in atomic units (e^2 a0^2 / E_h = 4 pi eps0 a0^3) with
 * conversions to Hz/(V/m)^2 named by their unit. The energy shift in a field F is
 * {@code dE = -alpha F^2 / 2}.
 *
 * <p>Everything here is immutable and thread-safe.
 */
package org.ritzwerk.engine.stark;
