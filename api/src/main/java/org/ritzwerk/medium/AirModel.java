package org.ritzwerk.medium;

/**
 * A refractive-index model of air: the phase refractive index as a function of the vacuum
 * wavelength, with the range over which the model is valid.
 *
 * <p>Implementations are immutable and thread-safe values with exact {@code equals}; a third
 * party may add its own. Callers convert through {@link Medium.Air}, which enforces the validity
 * range; {@link #refractiveIndex(double)} itself evaluates the formula without a range check.
 */
public interface AirModel {

    /**
     * @return the model and its conditions as text that {@link AirModels#parse(String)} reads
     *         back into an equal model, e.g. {@code "standard"} or
     *         {@code "ciddor1996:T=293.15K,p=101325Pa,RH=40%,CO2=450ppm"}
     */
    String spec();

    /** @return a one-line human-readable description naming the formula and conditions */
    String description();

    /** @return the publication the formula comes from */
    String citation();

    /**
     * Evaluates the formula without checking the validity range.
     *
     * @param vacuumWavelengthMetres vacuum wavelength in metres; finite and positive
     * @return the phase refractive index n (dimensionless, slightly above 1)
     */
    double refractiveIndex(double vacuumWavelengthMetres);

    /** @return the shortest vacuum wavelength, in metres, at which the model is valid */
    double minVacuumWavelengthMetres();

    /** @return the longest vacuum wavelength, in metres, at which the model is valid */
    double maxVacuumWavelengthMetres();
}
