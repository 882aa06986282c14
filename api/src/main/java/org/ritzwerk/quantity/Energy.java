package org.ritzwerk.quantity;

import org.ritzwerk.constants.PhysicalConstants;

/**
 * An energy (of a photon, a level or thermal), held in joules; finite, of either sign (level
 * energies below a limit are negative). Only a positive energy converts to a photon quantity.
 * Immutable and thread-safe.
 */
public final class Energy extends AbstractQuantity implements SpectralQuantity {

    private Energy(double joules, double uncertaintyJoules) {
        super(joules, uncertaintyJoules);
    }

    /**
     * @param value the energy in {@code unit}; finite
     * @param unit  an energy unit
     * @return the energy, without uncertainty
     */
    public static Energy of(double value, Unit unit) {
        unit.requireKind(Kind.ENERGY);
        checkValue("energy", value, unit, false);
        return create(unit.toSi(value), Double.NaN);
    }

    /**
     * @param value       the energy in {@code unit}; finite
     * @param uncertainty its standard uncertainty in {@code unit}; finite, not negative
     * @param unit        an energy unit
     * @return the energy
     */
    public static Energy of(double value, double uncertainty, Unit unit) {
        Energy e = of(value, unit);
        return create(e.si, checkedUncertainty("energy", uncertainty, unit));
    }

    /**
     * @param electronVolts energy in eV; finite
     * @return the energy
     */
    public static Energy ofElectronVolts(double electronVolts) {
        return of(electronVolts, Unit.ELECTRONVOLT);
    }

    /**
     * @param joules energy in J; finite
     * @return the energy
     */
    public static Energy ofJoules(double joules) {
        return of(joules, Unit.JOULE);
    }

    static Energy create(double joules, double uncertaintyJoules) {
        if (!Double.isFinite(joules)) {
            throw new IllegalArgumentException("energy must be finite, got " + shown(joules) + (Double.isFinite(joules) ? " J" : ""));
        }
        return new Energy(joules, uncertaintyJoules);
    }

    /** @return the energy in J */
    public double inJoules() {
        return si;
    }

    /** @return the energy in eV */
    public double inElectronVolts() {
        return Unit.ELECTRONVOLT.fromSi(si);
    }

    /**
     * @return the temperature {@code T = E / k} at which {@code kT} equals this energy
     * @throws ConversionException when this energy is negative
     */
    public Temperature toTemperature() {
        if (si < 0) {
            throw new ConversionException(ConversionException.INCOMPATIBLE,
                    "a negative energy (" + inElectronVolts() + " eV) has no temperature equivalent");
        }
        double kelvin = si / PhysicalConstants.K;
        return Temperature.create(kelvin, u / PhysicalConstants.K);
    }

    @Override
    public Kind kind() {
        return Kind.ENERGY;
    }

    @Override
    Unit displayUnit() {
        return Unit.ELECTRONVOLT;
    }

    @Override
    public Frequency toFrequency() {
        if (!(si > 0)) {
            throw new ConversionException(ConversionException.NOT_A_PHOTON,
                    "an energy of " + inElectronVolts() + " eV is not positive, so no photon has it");
        }
        double hertz = si / PhysicalConstants.H;
        return Frequency.create(hertz, hertz * relativeUncertainty());
    }

    @Override
    public Wavenumber toWavenumber() {
        double perMetre = si / (PhysicalConstants.H * PhysicalConstants.C);
        return Wavenumber.create(perMetre, u / (PhysicalConstants.H * PhysicalConstants.C));
    }

    @Override
    public Energy toEnergy() {
        return this;
    }
}
