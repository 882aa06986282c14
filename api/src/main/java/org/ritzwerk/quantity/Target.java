package org.ritzwerk.quantity;

import java.util.Objects;
import org.ritzwerk.medium.Medium;

/**
 * What a quantity should be converted to: a unit and, for a wavelength unit, a medium.
 *
 * <p>Spectral quantities convert into one another through h and c. A temperature and a spectral
 * quantity convert through the thermal energy {@code E = kT} (e.g. {@code 300 K} is
 * {@code 208.5 cm-1}). Immutable and thread-safe.
 *
 * @param unit   the wanted unit
 * @param medium the wanted medium when {@code unit} is a wavelength unit, else {@code null}
 */
public record Target(Unit unit, Medium medium) {

    /**
     * Validates that a medium is given exactly for wavelength units.
     *
     * @param unit   the wanted unit
     * @param medium the wanted medium when {@code unit} is a wavelength unit, else {@code null}
     */
    public Target {
        Objects.requireNonNull(unit, "unit");
        if ((unit.kind() == Kind.WAVELENGTH) != (medium != null)) {
            throw new IllegalArgumentException(unit.kind() == Kind.WAVELENGTH
                    ? "a wavelength target needs a medium" : "only a wavelength target has a medium");
        }
    }

    /**
     * @param unit a unit that is not a wavelength unit
     * @return the target
     */
    public static Target of(Unit unit) {
        return new Target(unit, null);
    }

    /**
     * @param quantity the quantity to convert
     * @return the quantity as this target's kind (and medium)
     * @throws ConversionException when the value has no equivalent (e.g. a negative energy as a
     *                             wavelength)
     * @throws org.ritzwerk.medium.MediumException outside an air model's validity range
     */
    public Quantity convert(Quantity quantity) {
        if (quantity instanceof Temperature) {
            Temperature temperature = (Temperature) quantity;
            return unit.kind() == Kind.TEMPERATURE ? temperature : temperature.toThermalEnergy().to(unit, medium);
        }
        SpectralQuantity spectral = (SpectralQuantity) quantity;
        if (unit.kind() == Kind.TEMPERATURE) {
            return spectral.toEnergy().toTemperature();
        }
        return spectral.to(unit, medium);
    }
}
