/**
 * Plasma diagnostics from identified lines: the excitation temperature from a Boltzmann plot.
 * Stateless and thread-safe.
 */
package org.ritzwerk.engine.plasma;
