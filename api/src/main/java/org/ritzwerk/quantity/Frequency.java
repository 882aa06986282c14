package org.ritzwerk.quantity;

import java.util.Objects;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Medium;

/**
 * A frequency, held in hertz; finite and positive. Immutable and thread-safe.
 */
public final class Frequency extends AbstractQuantity implements SpectralQuantity {

    private Frequency(double hertz, double uncertaintyHertz) {
        super(hertz, uncertaintyHertz);
    }

    /**
     * @param value the frequency in {@code unit}; finite and positive
     * @param unit  a frequency unit
     * @return the frequency, without uncertainty
     */
    public static Frequency of(double value, Unit unit) {
        unit.requireKind(Kind.FREQUENCY);
        checkValue("frequency", value, unit, true);
        return create(unit.toSi(value), Double.NaN);
    }

    /**
     * @param value       the frequency in {@code unit}; finite and positive
     * @param uncertainty its standard uncertainty in {@code unit}; finite, not negative
     * @param unit        a frequency unit
     * @return the frequency
     */
    public static Frequency of(double value, double uncertainty, Unit unit) {
        Frequency f = of(value, unit);
        return create(f.si, checkedUncertainty("frequency", uncertainty, unit));
    }

    /**
     * @param hertz frequency in Hz; finite and positive
     * @return the frequency
     */
    public static Frequency ofHertz(double hertz) {
        return of(hertz, Unit.HERTZ);
    }

    static Frequency create(double hertz, double uncertaintyHertz) {
        if (!(hertz > 0) || !Double.isFinite(hertz)) {
            throw new ConversionException(ConversionException.NOT_A_PHOTON,
                    "a photon frequency must be finite and positive, got " + shown(hertz) + (Double.isFinite(hertz) ? " Hz" : ""));
        }
        return new Frequency(hertz, uncertaintyHertz);
    }

    /** @return the frequency in Hz */
    public double inHertz() {
        return si;
    }

    @Override
    public Kind kind() {
        return Kind.FREQUENCY;
    }

    @Override
    Unit displayUnit() {
        return Unit.HERTZ;
    }

    @Override
    public Frequency toFrequency() {
        return this;
    }

    @Override
    public Wavelength toWavelength(Medium medium) {
        Objects.requireNonNull(medium, "medium");
        double vacuum = PhysicalConstants.C / si;
        return Wavelength.fromVacuum(vacuum, vacuum * relativeUncertainty(), medium);
    }

    @Override
    public Wavenumber toWavenumber() {
        double perMetre = si / PhysicalConstants.C;
        return Wavenumber.create(perMetre, perMetre * relativeUncertainty());
    }

    @Override
    public Energy toEnergy() {
        double joules = si * PhysicalConstants.H;
        return Energy.create(joules, joules * relativeUncertainty());
    }
}
