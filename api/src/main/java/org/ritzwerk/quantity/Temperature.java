package org.ritzwerk.quantity;

import org.ritzwerk.constants.PhysicalConstants;

/**
 * A thermodynamic temperature, held in kelvin; finite, not negative. It converts to the thermal
 * energy {@code kT} (and an energy back to a temperature with {@link Energy#toTemperature()}).
 * Immutable and thread-safe.
 */
public final class Temperature extends AbstractQuantity implements Quantity {

    private Temperature(double kelvin, double uncertaintyKelvin) {
        super(kelvin, uncertaintyKelvin);
    }

    /**
     * @param value the temperature in {@code unit}; finite, not negative
     * @param unit  a temperature unit
     * @return the temperature, without uncertainty
     */
    public static Temperature of(double value, Unit unit) {
        unit.requireKind(Kind.TEMPERATURE);
        checkValue("temperature", value, unit, false);
        return create(unit.toSi(value), Double.NaN);
    }

    /**
     * @param value       the temperature in {@code unit}; finite, not negative
     * @param uncertainty its standard uncertainty in {@code unit}; finite, not negative
     * @param unit        a temperature unit
     * @return the temperature
     */
    public static Temperature of(double value, double uncertainty, Unit unit) {
        Temperature t = of(value, unit);
        return create(t.si, checkedUncertainty("temperature", uncertainty, unit));
    }

    /**
     * @param kelvin temperature in K; finite, not negative
     * @return the temperature
     */
    public static Temperature ofKelvin(double kelvin) {
        return of(kelvin, Unit.KELVIN);
    }

    static Temperature create(double kelvin, double uncertaintyKelvin) {
        if (!(kelvin >= 0) || !Double.isFinite(kelvin)) {
            throw new IllegalArgumentException("temperature must be finite and >= 0 K, got " + shown(kelvin) + (Double.isFinite(kelvin) ? " K" : ""));
        }
        return new Temperature(kelvin, uncertaintyKelvin);
    }

    /** @return the temperature in K */
    public double inKelvin() {
        return si;
    }

    /** @return the thermal energy {@code kT} */
    public Energy toThermalEnergy() {
        return Energy.create(si * PhysicalConstants.K, u * PhysicalConstants.K);
    }

    @Override
    public Kind kind() {
        return Kind.TEMPERATURE;
    }

    @Override
    Unit displayUnit() {
        return Unit.KELVIN;
    }
}
