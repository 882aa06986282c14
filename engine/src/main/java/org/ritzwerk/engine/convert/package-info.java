/**
 * Bulk conversions of spectral positions over {@code double[]} columns: one unit and medium in,
 * another out, no object per element. Values are in the units the caller names. Stateless and
 * thread-safe; arrays are the caller's to guard.
 */
package org.ritzwerk.engine.convert;
