package org.ritzwerk.quantity;

import java.util.Locale;
import java.util.Objects;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Medium;

/**
 * A wavelength in a stated medium, held in metres; finite and positive. A wavelength created
 * without a medium does not exist: the factories take one, and the parser reads a missing medium
 * as vacuum. Immutable and thread-safe; {@code equals} compares value, uncertainty and medium
 * exactly.
 */
public final class Wavelength extends AbstractQuantity implements SpectralQuantity {

    private final Medium medium;

    private Wavelength(double metres, double uncertaintyMetres, Medium medium) {
        super(metres, uncertaintyMetres);
        this.medium = medium;
    }

    /**
     * @param value  the wavelength in {@code unit}; finite and positive
     * @param unit   a wavelength unit
     * @param medium vacuum or air under a model
     * @return the wavelength, without uncertainty
     */
    public static Wavelength of(double value, Unit unit, Medium medium) {
        unit.requireKind(Kind.WAVELENGTH);
        checkValue("wavelength", value, unit, true);
        return create(unit.toSi(value), Double.NaN, medium);
    }

    /**
     * @param value       the wavelength in {@code unit}; finite and positive
     * @param uncertainty its standard uncertainty in {@code unit}; finite, not negative
     * @param unit        a wavelength unit
     * @param medium      vacuum or air under a model
     * @return the wavelength
     */
    public static Wavelength of(double value, double uncertainty, Unit unit, Medium medium) {
        Wavelength w = of(value, unit, medium);
        return create(w.si, checkedUncertainty("wavelength", uncertainty, unit), medium);
    }

    /**
     * @param nanometres wavelength in nm; finite and positive
     * @param medium     vacuum or air under a model
     * @return the wavelength
     */
    public static Wavelength ofNanometres(double nanometres, Medium medium) {
        return of(nanometres, Unit.NANOMETRE, medium);
    }

    /**
     * @param metres wavelength in m; finite and positive
     * @param medium vacuum or air under a model
     * @return the wavelength
     */
    public static Wavelength ofMetres(double metres, Medium medium) {
        return of(metres, Unit.METRE, medium);
    }

    private static Wavelength create(double metres, double uncertaintyMetres, Medium medium) {
        Objects.requireNonNull(medium, "medium");
        if (!(metres > 0) || !Double.isFinite(metres)) {
            throw new IllegalArgumentException("wavelength must be finite and positive, got " + shown(metres) + (Double.isFinite(metres) ? " m" : ""));
        }
        return new Wavelength(metres, uncertaintyMetres, medium);
    }

    /** From a vacuum wavelength (and its uncertainty, NaN for none) to a wavelength in {@code medium}. */
    static Wavelength fromVacuum(double vacuumMetres, double uncertaintyMetres, Medium medium) {
        double metres = medium.fromVacuum(vacuumMetres);
        double u = Double.isNaN(uncertaintyMetres) ? Double.NaN
                : uncertaintyMetres * medium.slopeFromVacuum(vacuumMetres);
        return create(metres, u, medium);
    }

    /** @return the medium this wavelength is stated in */
    public Medium medium() {
        return medium;
    }

    /** @return the wavelength in metres, in its medium */
    public double inMetres() {
        return si;
    }

    /** @return the wavelength in nanometres, in its medium */
    public double inNanometres() {
        return Unit.NANOMETRE.fromSi(si);
    }

    /**
     * @return the vacuum wavelength in metres
     * @throws org.ritzwerk.medium.MediumException outside the air model's validity range
     */
    public double vacuumMetres() {
        return medium.toVacuum(si);
    }

    @Override
    public Kind kind() {
        return Kind.WAVELENGTH;
    }

    @Override
    Unit displayUnit() {
        return Unit.NANOMETRE;
    }

    @Override
    public Frequency toFrequency() {
        double vacuum = medium.toVacuum(si);
        double hertz = PhysicalConstants.C / vacuum;
        return Frequency.create(hertz, hertz * vacuumUncertainty(vacuum) / vacuum);
    }

    @Override
    public Wavelength toWavelength(Medium target) {
        Objects.requireNonNull(target, "target");
        if (target.equals(medium)) {
            return this;
        }
        double vacuum = medium.toVacuum(si);
        return fromVacuum(vacuum, vacuumUncertainty(vacuum), target);
    }

    @Override
    public Wavenumber toWavenumber() {
        double vacuum = medium.toVacuum(si);
        double perMetre = 1 / vacuum;
        return Wavenumber.create(perMetre, perMetre * vacuumUncertainty(vacuum) / vacuum);
    }

    /** The standard uncertainty carried to the vacuum wavelength, NaN for none. */
    private double vacuumUncertainty(double vacuumMetres) {
        return Double.isNaN(u) ? Double.NaN : u / medium.slopeFromVacuum(vacuumMetres);
    }

    @Override
    boolean sameFrame(AbstractQuantity other) {
        return medium.equals(((Wavelength) other).medium);
    }

    @Override
    public int hashCode() {
        return 31 * super.hashCode() + medium.hashCode();
    }

    @Override
    public boolean equals(Object o) {
        return super.equals(o);
    }

    @Override
    public String toString() {
        String base = super.toString();
        return String.format(Locale.ROOT, "%s %s]", base.substring(0, base.length() - 1), medium.spec());
    }
}
