package org.ritzwerk.cli;

import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.QuantityText;

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
     * @param quantity a --from or --to value in any spectral unit, e.g. "656 nm air" or "15000 cm-1"
     * @param medium   the medium of the wavelength wanted
     * @return the wavelength in nm in that medium
     */
    static double nanometres(String quantity, Medium medium) {
        double hertz = QuantityText.standard().parseSpectral(quantity).toFrequency().inHertz();
        return medium.fromVacuum(PhysicalConstants.C / hertz) * 1e9;
    }
}
