package org.ritzwerk.engine.profile;

import org.ritzwerk.constants.PhysicalConstants;

/**
 * Line widths from physical conditions, as full widths at half maximum in frequency (Hz); the
 * relative widths carry over to wavelength and wavenumber for lines narrow against their
 * position.
 * <pre>
 *   Doppler (Gaussian):   FWHM_D = nu sqrt(8 k T ln 2 / (m c^2))
 *   natural (Lorentzian): FWHM_N = (Gamma_upper + Gamma_lower) / (2 pi)
 * </pre>
 * Both are common practice; Gamma is the total decay rate (the sum of the Einstein A of every
 * channel out of the level, zero for a ground state).
 */
public final class Broadening {

    private static final double KELVIN_TO_SQUARED_SPEED = 8 * Math.log(2) * PhysicalConstants.K;

    private Broadening() {
    }

    /**
     * @param frequency   line frequency in Hz, finite and positive
     * @param temperature kinetic temperature of the emitters in K, finite and positive
     * @param mass        emitter mass in kg, finite and positive
     * @return the Doppler FWHM in Hz
     * @throws IllegalArgumentException naming the argument that is out of range
     */
    public static double dopplerFwhm(double frequency, double temperature, double mass) {
        positive("line frequency", frequency, "Hz");
        positive("temperature", temperature, "K");
        positive("emitter mass", mass, "kg");
        return frequency * Math.sqrt(KELVIN_TO_SQUARED_SPEED * temperature / mass) / PhysicalConstants.C;
    }

    /**
     * @param upperDecayRate total decay rate of the upper level in s^-1, finite and not negative
     * @param lowerDecayRate total decay rate of the lower level in s^-1 (0 for a ground state)
     * @return the natural (radiative) FWHM in Hz
     * @throws IllegalArgumentException naming the rate that is out of range
     */
    public static double naturalFwhm(double upperDecayRate, double lowerDecayRate) {
        notNegative("upper-level decay rate", upperDecayRate);
        notNegative("lower-level decay rate", lowerDecayRate);
        return (upperDecayRate + lowerDecayRate) / (2 * Math.PI);
    }

    private static void positive(String what, double value, String unit) {
        if (!(Double.isFinite(value) && value > 0)) {
            throw new IllegalArgumentException(what + " must be finite and positive, got " + value + " " + unit);
        }
    }

    private static void notNegative(String what, double value) {
        if (!(Double.isFinite(value) && value >= 0)) {
            throw new IllegalArgumentException(what + " must be finite and not negative, got " + value + " s^-1");
        }
    }
}
