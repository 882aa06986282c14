/**
 * Atoms and ions: elements, species (isotope and charge state) and nuclei. Masses in kg,
 * lengths in metres, magnetic moments in nuclear magnetons. Everything here is immutable and
 * thread-safe.
 */
package org.ritzwerk.atom;
