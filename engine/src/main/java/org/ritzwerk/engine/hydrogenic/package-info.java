/**
 * One-electron ions: level energies under selectable model tiers, hydrogen radial dipole
 * integrals, electric-dipole lines with line strengths, oscillator strengths, Einstein A
 * coefficients, lifetimes and branching ratios. Energies in joules, frequencies in hertz, rates
 * in s^-1. Everything here is immutable (or stateless) and thread-safe.
 */
package org.ritzwerk.engine.hydrogenic;
