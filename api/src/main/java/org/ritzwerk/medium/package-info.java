/**
 * Optical media: vacuum, and air under a named refractive-index model (standard air after
 * Morton 2000, Ciddor 1996 at given conditions, or a third party's {@link AirModel}).
 * Wavelengths are in metres. Everything here is immutable and thread-safe.
 */
package org.ritzwerk.medium;
