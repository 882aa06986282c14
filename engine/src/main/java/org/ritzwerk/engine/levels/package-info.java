/**
 * Levels of every species with a level model, as one columnar set:
 * {@link org.ritzwerk.engine.levels.LevelQuery} asks explicitly given
 * {@link org.ritzwerk.engine.levels.LevelSources} (one-electron ions in any tier, alkali atoms with
 * their quantum-defect models and, where given, hyperfine constants, and level lists) for their
 * levels up to a principal quantum number, with radiative and black-body lifetimes on request, and
 * returns a {@link org.ritzwerk.engine.levels.LevelSet}: the same rows the {@code levels} command
 * prints.
 *
 * <p>Units: energies in cm^-1 above the species' ground level (alkali atoms: above the ground
 * level's hyperfine-free centroid; level lists: as listed), lifetimes in seconds. Quantities a
 * source does not give are absent ({@code OptionalInt}, {@code OptionalDouble}), never NaN or a
 * sentinel.
 *
 * <p>Everything here is immutable and thread-safe.
 */
package org.ritzwerk.engine.levels;
