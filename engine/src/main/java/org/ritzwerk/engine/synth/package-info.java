/**
 * Synthetic spectra: pixel grids (linear, logarithmic, dispersion polynomial) and the windowed
 * rendering of many lines into pixel fluxes, each pixel receiving the flux that falls into it
 * ({@link org.ritzwerk.engine.synth.LineRenderer}, exact; {@link org.ritzwerk.engine.synth.FastLineRenderer},
 * through the Fourier domain, for large line lists), and scenes built from emitters and line
 * lists, including lists of millions of lines held as primitive columns
 * ({@link org.ritzwerk.engine.synth.LineColumns}). Stateless renderers over primitive arrays;
 * thread-safe.
 */
package org.ritzwerk.engine.synth;
