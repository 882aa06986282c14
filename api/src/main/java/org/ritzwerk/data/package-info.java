/**
 * Reference data as values, and the service-provider interface through which data sets are
 * found: {@link org.ritzwerk.data.ReferenceDataProvider}, discovered with
 * {@link java.util.ServiceLoader}. Every data set carries its provenance. Positions and energies
 * are kept in the unit their source states them in (so nothing is rounded on the way through);
 * typed accessors convert. The parameter records that describe an alkali-like atom's data state
 * their units in their names or Javadoc: quantum-defect sets ({@link org.ritzwerk.data.QuantumDefects},
 * limit and Rydberg constant in cm^-1), measured levels ({@link org.ritzwerk.data.MeasuredLevel},
 * cm^-1 above the ground level), core polarizabilities
 * ({@link org.ritzwerk.data.CorePolarizability}, atomic units a0^3 and a0^5) and model-potential
 * parameters ({@link org.ritzwerk.data.ModelPotential}, atomic units: a0, a0^-1, a0^-2, a0^3);
 * the engine computes with them. A saved wavelength calibration is data too:
 * {@link org.ritzwerk.data.CalibrationRecord} (pixels, description, fit figures and pairs) holding
 * a {@link org.ritzwerk.data.DispersionPolynomial} (coefficients in nm of a scaled pixel variable,
 * covariance in nm^2, valid pixel range, medium), readable without the engine, which evaluates
 * it. Everything here is immutable and thread-safe, except that a
 * provider's own thread-safety is the provider's promise.
 */
package org.ritzwerk.data;
