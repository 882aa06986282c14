/**
 * Typed quantities: {@link org.ritzwerk.quantity.Wavelength} (with its medium),
 * {@link org.ritzwerk.quantity.Wavenumber}, {@link org.ritzwerk.quantity.Frequency},
 * {@link org.ritzwerk.quantity.Energy} and {@link org.ritzwerk.quantity.Temperature}, their units,
 * conversions with first-order uncertainty propagation, and their text form.
 *
 * <p>Each quantity holds one {@code double} in its canonical SI unit (m, m^-1, Hz, J, K).
 * Everything here is immutable and thread-safe.
 */
package org.ritzwerk.quantity;
