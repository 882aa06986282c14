/**
 * The built-in data providers and their file reading, not part of the API: the nuclear, lamp,
 * one-electron, Rydberg and level-list providers that {@code DataRegistry.builtIn()} ranks and
 * the module declares as {@code ReferenceDataProvider} services, the built-in Rydberg data they
 * serve, and the strict reader of the built-in CSV files. Not exported from the module; library
 * users reach this data through {@code DataContext} and {@code DataRegistry}. Every class is
 * immutable and thread-safe. Listing reads the built-in files' headers only; a file's rows are read
 * when its set is first used, once per JVM, and the set shared by every registry ({@code BuiltInFiles}).
 */
package org.ritzwerk.refdata.internal;
