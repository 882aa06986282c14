/**
 * Interactions of two alkali Rydberg atoms: the resonant dipole-dipole coefficient C3 of
 * dipole-coupled pair states, the van der Waals coefficient C6 by second-order perturbation theory
 * over pair states with their Foerster defects and the angular factors for an interatomic axis at
 * an angle to the quantisation axis ({@link org.ritzwerk.engine.pair.PairInteractions}), and the
 * blockade radius for a Rabi frequency. Built on the public API of
 * {@link org.ritzwerk.engine.rydberg.AlkaliAtom}.
 *
 * <p>Units: C3 in atomic units (E_h a0^3) and in Hz m^3 (energy over h), C6 in E_h a0^6 and in
 * Hz m^6, distances in m, Rabi frequencies in rad/s, angles in radians. The sign convention is
 * {@code dE = C3 / R^3} and {@code dE = C6 / R^6}: a positive coefficient is repulsive.
 *
 * <p>Everything here is immutable and thread-safe.
 */
package org.ritzwerk.engine.pair;
