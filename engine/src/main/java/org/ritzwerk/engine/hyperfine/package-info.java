/**
 * Hyperfine and Zeeman structure of alkali levels: the hyperfine constants A and B of a level, its
 * F levels (Casimir formula), the F -> F' electric-dipole components of a line with their relative
 * strengths (6j factors), the Breit-Rabi formula of a J = 1/2 level and the full hyperfine-Zeeman
 * Hamiltonian of any level in the |m_J m_I> basis (diagonalised with Commons Math), with the
 * m_F-resolved components of a line in a magnetic field.
 *
 * <p>Units: every energy is a frequency, energy / h, in Hz; magnetic fields in tesla; g factors and
 * strengths are dimensionless. Angular momenta are given doubled ({@code twoI}, {@code twoJ},
 * {@code twoF}, {@code twoM}) so half-integers are exact. Sign convention of the Zeeman term:
 * H_B = mu_B B (g_J m_J + g_I m_I), with g_J about +2 for an s electron and g_I = -mu_I / (I mu_B)
 * (negative for a positive nuclear moment), as in the alkali data sheets and
 * E. Arimondo, M. Inguscio and P. Violino, Rev. Mod. Phys. 49, 31 (1977).
 *
 * <p>Every type is immutable and thread-safe; the classes with static methods hold no state.
 */
package org.ritzwerk.engine.hyperfine;
