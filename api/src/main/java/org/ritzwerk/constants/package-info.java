/**
 * The physical constants and the name of their edition (CODATA 2018). Values are in SI units;
 * everything here is immutable and thread-safe.
 */
package org.ritzwerk.constants;
