/**
 * Line profiles: Gaussian, Lorentzian and Voigt (through the Faddeeva function), normalised
 * to unit area. Arguments and widths share one unit (any: nm, Hz, cm-1); densities are per that
 * unit. {@link org.ritzwerk.engine.profile.Broadening} gives Doppler and natural widths in Hz.
 * Stateless and thread-safe.
 */
package org.ritzwerk.engine.profile;
