/**
 * Atoms and ions: elements, species (isotope and charge state), nuclei, and the fine-structure
 * states {@code n l j} of one-valence-electron atoms in their level notation (e.g.
 * {@code 60s1/2}; {@link org.ritzwerk.atom.State}). Masses in kg, lengths in metres, magnetic
 * moments in nuclear magnetons; quantum numbers are integers, with j given doubled
 * ({@code twoJ}). Everything here is immutable and thread-safe.
 */
package org.ritzwerk.atom;
