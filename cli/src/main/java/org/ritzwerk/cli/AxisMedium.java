package org.ritzwerk.cli;

import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.QuantityParseException;
import org.ritzwerk.quantity.QuantityText;
import org.ritzwerk.quantity.SpectralQuantity;

/** The --medium option of the commands that print or draw wavelengths: vacuum or standard air. */
final class AxisMedium {

    private AxisMedium() {
    }

    /**
     * @param option the --medium value
     * @return true for air, false for vacuum
     * @throws OptionException for anything else
     */
    static boolean isAir(String option) {
        return switch (option) {
            case "air" -> true;
            case "vacuum" -> false;
            default -> throw new OptionException("--medium must be vacuum or air, got '" + option + "'");
        };
    }

    /**
     * @param option the --medium value
     * @return standard air or vacuum
     */
    static Medium of(String option) {
        return isAir(option) ? Medium.air() : Medium.vacuum();
    }

    /**
     * @param option   the option's name, e.g. "--from", for the message
     * @param quantity its value in any spectral unit, e.g. "656 nm air" or "15000 cm-1"
     * @return the quantity
     * @throws OptionException naming the option when the value cannot be read
     */
    static SpectralQuantity spectral(String option, String quantity) {
        try {
            return QuantityText.standard().parseSpectral(quantity);
        } catch (QuantityParseException e) {
            throw new OptionException(option + ": " + e.getMessage());
        }
    }

    /**
     * @param option   the option's name, e.g. "--from", for the message
     * @param quantity its value in any spectral unit, e.g. "656 nm air" or "15000 cm-1"
     * @param medium   the medium of the wavelength wanted
     * @return the wavelength in nm in that medium
     * @throws OptionException naming the option when the value cannot be read
     */
    static double nanometres(String option, String quantity, Medium medium) {
        double hertz = spectral(option, quantity).toFrequency().inHertz();
        return medium.fromVacuum(PhysicalConstants.C / hertz) * 1e9;
    }
}
