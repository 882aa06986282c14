/**
 * The library's jobs as Apache Spark Dataset operations, for survey-scale work: identification
 * ({@link org.ritzwerk.spark.SurveyIdentification}), calibration and its application
 * ({@link org.ritzwerk.spark.SurveyCalibration}) and synthesis
 * ({@link org.ritzwerk.spark.SurveySynthesis}). Each takes a DataFrame of the documented schema
 * ({@link org.ritzwerk.spark.Schemas}) and a serialisable parameter record, broadcasts the
 * parameters once, and maps every partition with the same engine calls a single JVM makes, so
 * every number equals the library's bit for bit. The per-partition setup (line catalogue, lamp
 * set, solver, level models) is made once per partition; no loop over rows runs on the driver.
 *
 * <p>Units are named in every column (nm, m/s, K, m^-3). The operations are lazy Spark
 * transformations; the parameter records are immutable and thread-safe.
 */
package org.ritzwerk.spark;
