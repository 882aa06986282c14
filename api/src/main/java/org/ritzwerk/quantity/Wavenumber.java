package org.ritzwerk.quantity;

import java.util.Objects;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Medium;

/**
 * A wavenumber {@code sigma = 1 / lambda_vac}, held in inverse metres; finite, of either sign
 * (level energies over hc may be zero or negative). Only a positive wavenumber converts to a
 * photon quantity. Immutable and thread-safe.
 */
public final class Wavenumber extends AbstractQuantity implements SpectralQuantity {

    private Wavenumber(double perMetre, double uncertaintyPerMetre) {
        super(perMetre, uncertaintyPerMetre);
    }

    /**
     * @param value the wavenumber in {@code unit}; finite
     * @param unit  a wavenumber unit
     * @return the wavenumber, without uncertainty
     */
    public static Wavenumber of(double value, Unit unit) {
        unit.requireKind(Kind.WAVENUMBER);
        checkValue("wavenumber", value, unit, false);
        return create(unit.toSi(value), Double.NaN);
    }

    /**
     * @param value       the wavenumber in {@code unit}; finite
     * @param uncertainty its standard uncertainty in {@code unit}; finite, not negative
     * @param unit        a wavenumber unit
     * @return the wavenumber
     */
    public static Wavenumber of(double value, double uncertainty, Unit unit) {
        Wavenumber w = of(value, unit);
        return create(w.si, checkedUncertainty("wavenumber", uncertainty, unit));
    }

    /**
     * @param perCentimetre wavenumber in cm^-1; finite
     * @return the wavenumber
     */
    public static Wavenumber ofPerCentimetre(double perCentimetre) {
        return of(perCentimetre, Unit.PER_CENTIMETRE);
    }

    static Wavenumber create(double perMetre, double uncertaintyPerMetre) {
        if (!Double.isFinite(perMetre)) {
            throw new IllegalArgumentException("wavenumber must be finite, got " + shown(perMetre) + (Double.isFinite(perMetre) ? " m-1" : ""));
        }
        return new Wavenumber(perMetre, uncertaintyPerMetre);
    }

    /** @return the wavenumber in cm^-1 */
    public double inPerCentimetre() {
        return si / 100;
    }

    /** @return the wavenumber in m^-1 */
    public double inPerMetre() {
        return si;
    }

    @Override
    public Kind kind() {
        return Kind.WAVENUMBER;
    }

    @Override
    Unit displayUnit() {
        return Unit.PER_CENTIMETRE;
    }

    @Override
    public Frequency toFrequency() {
        requirePositive();
        double hertz = si * PhysicalConstants.C;
        return Frequency.create(hertz, hertz * relativeUncertainty());
    }

    @Override
    public Wavelength toWavelength(Medium medium) {
        Objects.requireNonNull(medium, "medium");
        requirePositive();
        double vacuum = 1 / si;
        return Wavelength.fromVacuum(vacuum, vacuum * relativeUncertainty(), medium);
    }

    @Override
    public Wavenumber toWavenumber() {
        return this;
    }

    @Override
    public Energy toEnergy() {
        double joules = si * (PhysicalConstants.H * PhysicalConstants.C);
        return Energy.create(joules, u * (PhysicalConstants.H * PhysicalConstants.C));
    }

    private void requirePositive() {
        if (!(si > 0)) {
            throw new ConversionException(ConversionException.NOT_A_PHOTON,
                    "a wavenumber of " + inPerCentimetre() + " cm-1 is not positive, so no photon has it");
        }
    }
}
