package org.ritzwerk.cli;

import org.ritzwerk.medium.Medium;

/** The --medium option of the commands that print or draw wavelengths: vacuum or standard air. */
final class AxisMedium {

    private AxisMedium() {
    }

    /**
     * @param option the --medium value
     * @return true for air, false for vacuum
     * @throws IllegalArgumentException for anything else
     */
    static boolean isAir(String option) {
        return switch (option) {
            case "air" -> true;
            case "vacuum" -> false;
            default -> throw new IllegalArgumentException("--medium must be vacuum or air, got '" + option + "'");
        };
    }

    /**
     * @param option the --medium value
     * @return standard air or vacuum
     */
    static Medium of(String option) {
        return isAir(option) ? Medium.air() : Medium.vacuum();
    }
}
