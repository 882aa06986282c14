/**
 * One line model for every source of lines: {@link org.ritzwerk.engine.lines.LineSet}, an
 * immutable columnar set (one primitive array per column, no object per line), its adapters from
 * one-electron ions (every tier), alkali atoms and line lists, and
 * {@link org.ritzwerk.engine.lines.LineQuery}, which asks explicitly given
 * {@link org.ritzwerk.engine.lines.LineSources} for the lines in a window, of a series, above a
 * strength, or of one transition.
 *
 * <p>Units: wavelengths in metres (vacuum unless a medium is named; accessors ending in
 * {@code Nm} give nanometres), frequencies in Hz, wavenumbers in cm^-1, energies in joules above
 * the species' ground level, Einstein A in s^-1, line strengths S in atomic units (e a0)^2.
 * Quantities a source does not give are absent ({@code OptionalDouble}, {@code OptionalInt},
 * {@code Optional}), never NaN or a sentinel.
 *
 * <p>Everything here is immutable and thread-safe, except the builders.
 */
package org.ritzwerk.engine.lines;
