/**
 * Synthetic spectra: pixel grids (linear, logarithmic, dispersion polynomial) and the windowed
 * rendering of many lines into pixel fluxes, each pixel receiving the flux that falls into it.
 * Stateless renderers over primitive arrays; thread-safe.
 */
package org.ritzwerk.engine.synth;
