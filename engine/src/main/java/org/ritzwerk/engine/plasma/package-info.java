/**
 * Plasma diagnostics from identified lines: the excitation temperature from a Boltzmann plot,
 * Saha ionisation balance, Voigt line fits, the estimate from identified peaks
 * ({@code PlasmaEstimate}), the Balmer-line fit of a calibrated spectrum ({@code BalmerPlasmaFit}:
 * temperature in K, electron density in m^-3) and isotope pairs of one-electron species
 * ({@code IsotopePairs}). Wavelengths are in nm unless a name says metres. Every class is
 * stateless or immutable, and thread-safe.
 */
package org.ritzwerk.engine.plasma;
