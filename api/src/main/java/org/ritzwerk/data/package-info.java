/**
 * Reference data as values, and the service-provider interface through which data sets are
 * found: {@link org.ritzwerk.data.ReferenceDataProvider}, discovered with
 * {@link java.util.ServiceLoader}. Every data set carries its provenance. Positions and energies
 * are kept in the unit their source states them in (so nothing is rounded on the way through);
 * typed accessors convert. Everything here is immutable and thread-safe, except that a
 * provider's own thread-safety is the provider's promise.
 */
package org.ritzwerk.data;
