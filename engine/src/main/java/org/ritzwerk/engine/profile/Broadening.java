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

    /**
     * The largest emitter mass taken, 1e-20 kg (about 6e6 u): far above any atom (the heaviest
     * are about 300 u, 5e-25 kg) and any molecule whose lines are drawn (common practice); a larger
     * number is a unit slip, most often a mass in u (1.00783 for hydrogen) given as kg.
     */
    public static final double MAX_EMITTER_MASS_KG = 1e-20;
    /**
     * The smallest emitter mass taken, the electron mass 9.1093837e-31 kg (CODATA 2018): nothing
     * lighter emits lines.
     */
    public static final double MIN_EMITTER_MASS_KG = PhysicalConstants.ELECTRON_MASS.value();

    private Broadening() {
    }

    /**
     * @param frequency   line frequency in Hz, finite and positive
     * @param temperature kinetic temperature of the emitters in K, finite and positive
     * @param mass        emitter mass in kg, {@link #MIN_EMITTER_MASS_KG} (the electron's) to
     *                    {@value #MAX_EMITTER_MASS_KG} (far above any atom's: a larger value is a
     *                    mass in u given as kg)
     * @return the Doppler FWHM in Hz
     * @throws IllegalArgumentException naming the argument that is out of range (for a mass, with
     *         the likely unit slip)
     */
    public static double dopplerFwhm(double frequency, double temperature, double mass) {
        positive("line frequency", frequency, "Hz");
        positive("temperature", temperature, "K");
        positive("emitter mass", mass, "kg");
        if (mass > MAX_EMITTER_MASS_KG || mass < MIN_EMITTER_MASS_KG) {
            double u = PhysicalConstants.ATOMIC_MASS_CONSTANT.value();
            throw new IllegalArgumentException("emitter mass must be " + MIN_EMITTER_MASS_KG + " (an electron) to "
                    + MAX_EMITTER_MASS_KG + " kg (far above any atom), got " + mass + " kg"
                    + (mass > MAX_EMITTER_MASS_KG ? "; a mass in u? multiply it by the atomic mass constant, " + u
                            + " kg (" + mass + " u = " + String.format(java.util.Locale.ROOT, "%.4g", mass * u) + " kg)"
                            : ""));
        }
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
