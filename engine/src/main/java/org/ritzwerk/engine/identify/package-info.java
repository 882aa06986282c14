/**
 * Line identification: which catalogued line (if any) explains each measured peak, with a
 * global one-to-one assignment, velocity and offset searches, and a report of matched,
 * ambiguous and unexplained peaks, missing strong lines and species presence. Positions are
 * vacuum wavelengths in metres inside; inputs in other units and media are converted once. No
 * object per peak on the hot path. Inputs are immutable; everything here is thread-safe.
 */
package org.ritzwerk.engine.identify;
