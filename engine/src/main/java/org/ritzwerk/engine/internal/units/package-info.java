/**
 * Atomic-unit conversion factors (hartree, bohr radius, atomic unit of field, dipole and
 * polarizability) derived from the CODATA constants in {@code org.ritzwerk.constants}, shared by
 * the Stark, electrometry and pair-interaction code. Constants only; thread-safe. Not exported
 * from the module.
 */
package org.ritzwerk.engine.internal.units;
