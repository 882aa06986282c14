package org.ritzwerk.quantity;

import org.ritzwerk.medium.Medium;

/**
 * A position in a spectrum: a wavelength (in its medium), a wavenumber, a frequency or a photon
 * energy, each convertible to the others with the exact SI values of h and c:
 * {@code nu = c / lambda_vac = c sigma = E / h}.
 *
 * <p>A stated standard uncertainty travels through every conversion to first order
 * ({@code u_y = |dy/dx| u_x}). Round trips agree to about 1e-15 relative. Immutable and
 * thread-safe.
 */
public sealed interface SpectralQuantity extends Quantity permits Wavelength, Wavenumber, Frequency, Energy {

    /**
     * @return the frequency of a photon at this spectral position
     * @throws ConversionException when this value is not positive (no photon has it)
     */
    Frequency toFrequency();

    /**
     * @param medium the medium of the wanted wavelength
     * @return the wavelength in that medium
     * @throws ConversionException when this value is not positive
     * @throws org.ritzwerk.medium.MediumException when outside the air model's validity range
     */
    default Wavelength toWavelength(Medium medium) {
        return toFrequency().toWavelength(medium);
    }

    /** @return the (vacuum) wavenumber {@code sigma = 1 / lambda_vac} */
    default Wavenumber toWavenumber() {
        return toFrequency().toWavenumber();
    }

    /** @return the photon energy {@code E = h nu} */
    default Energy toEnergy() {
        return toFrequency().toEnergy();
    }

    /**
     * @param unit   the wanted unit, of kind wavelength, wavenumber, frequency or energy
     * @param medium the medium when {@code unit} is a wavelength unit; ignored otherwise
     * @return this position as a quantity of that unit's kind
     * @throws IllegalArgumentException when the unit is a temperature unit
     */
    default SpectralQuantity to(Unit unit, Medium medium) {
        switch (unit.kind()) {
            case WAVELENGTH:
                return toWavelength(medium);
            case WAVENUMBER:
                return toWavenumber();
            case FREQUENCY:
                return toFrequency();
            case ENERGY:
                return toEnergy();
            default:
                throw new IllegalArgumentException("a spectral position does not convert to a "
                        + unit.kind().noun() + " (" + unit.symbol() + ")");
        }
    }
}
