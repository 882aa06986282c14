package org.ritzwerk.engine.synth;

import java.util.function.DoubleUnaryOperator;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Medium;

/**
 * Continuum emission: Planck's law, and the pixel integral of any smooth continuum density
 * (flat, blackbody, or the caller's own) over a {@link PixelGrid}.
 */
public final class Continuum {

    private static final double H = PhysicalConstants.H;
    private static final double C = PhysicalConstants.C;
    private static final double K = PhysicalConstants.K;

    private Continuum() {
    }

    /**
     * Planck's law per unit wavelength, B = 2 h c^2 / lambda^5 / (exp(h c / (lambda k T)) - 1).
     *
     * @param wavelength  vacuum wavelength in m, positive
     * @param temperature temperature in K, positive
     * @return spectral radiance in W m^-3 sr^-1
     */
    public static double planckPerWavelength(double wavelength, double temperature) {
        positive("wavelength", wavelength, "m");
        positive("temperature", temperature, "K");
        double x = H * C / (wavelength * K * temperature);
        return 2 * H * C * C / Math.pow(wavelength, 5) / Math.expm1(x);
    }

    /**
     * Planck's law as a photon rate per unit wavelength, N = B lambda / (h c) =
     * 2 c / lambda^4 / (exp(h c / (lambda k T)) - 1): the shape a photon-counting detector sees,
     * and the one to give a scene whose lines are photon counts (the energy form
     * {@link #planckPerWavelength} is tilted by a factor lambda against it).
     *
     * @param wavelength  vacuum wavelength in m, positive
     * @param temperature temperature in K, positive
     * @return photon radiance in photons s^-1 m^-3 sr^-1
     */
    public static double planckPhotonsPerWavelength(double wavelength, double temperature) {
        positive("wavelength", wavelength, "m");
        positive("temperature", temperature, "K");
        double x = H * C / (wavelength * K * temperature);
        return 2 * C / Math.pow(wavelength, 4) / Math.expm1(x);
    }

    /**
     * A blackbody continuum as a scene takes it ({@link Scene.Builder#continuum}): the photon form
     * of Planck's law ({@link #planckPhotonsPerWavelength}) as a function of a grid's wavelength
     * in nm in its axis medium, converted to vacuum before the law is applied.
     *
     * @param axisMedium  the medium of the grid's wavelengths
     * @param temperature temperature in K, positive
     * @return the density, photon radiance per unit wavelength
     */
    public static DoubleUnaryOperator blackbodyPhotons(Medium axisMedium, double temperature) {
        positive("temperature", temperature, "K");
        return nm -> planckPhotonsPerWavelength(axisMedium.toVacuum(nm * 1e-9), temperature);
    }

    /**
     * Planck's law per unit frequency, B = 2 h nu^3 / c^2 / (exp(h nu / (k T)) - 1).
     *
     * @param frequency   frequency in Hz, positive
     * @param temperature temperature in K, positive
     * @return spectral radiance in W m^-2 Hz^-1 sr^-1
     */
    public static double planckPerFrequency(double frequency, double temperature) {
        positive("frequency", frequency, "Hz");
        positive("temperature", temperature, "K");
        double x = H * frequency / (K * temperature);
        return 2 * H * frequency * frequency * frequency / (C * C) / Math.expm1(x);
    }

    /**
     * Adds to each pixel the integral of a continuum density over it (8-node Gauss-Legendre per
     * pixel; a continuum that changes little across a pixel is integrated to about 1e-12).
     *
     * @param grid    the pixels
     * @param density flux per unit of the grid's axis, as a function of position
     * @param out     pixel fluxes, one per pixel, added to; untouched when the density is refused
     * @throws IllegalArgumentException when the density is not finite or negative somewhere,
     *         naming the pixel
     */
    public static void render(PixelGrid grid, DoubleUnaryOperator density, double[] out) {
        if (out.length != grid.pixels()) {
            throw new IllegalArgumentException("the output needs one value per pixel (" + grid.pixels() + "), got "
                    + out.length);
        }
        // Every pixel is integrated and checked before any is added, so a refused call leaves out as it was.
        double[] fluxes = new double[grid.pixels()];
        for (int p = 0; p < fluxes.length; p++) {
            double a = Math.min(grid.edge(p), grid.edge(p + 1));
            double b = Math.max(grid.edge(p), grid.edge(p + 1));
            double flux = GaussLegendre.integrate(density, a, b);
            if (!(Double.isFinite(flux) && flux >= 0)) {
                throw new IllegalArgumentException("pixel " + p + ": the continuum density integrates to " + flux
                        + " over the pixel, from " + a + " to " + b + " (the density at its centre is "
                        + density.applyAsDouble(0.5 * (a + b)) + "); a density must be finite and not negative");
            }
            fluxes[p] = flux;
        }
        for (int p = 0; p < fluxes.length; p++) {
            out[p] += fluxes[p];
        }
    }

    private static void positive(String what, double value, String unit) {
        if (!(Double.isFinite(value) && value > 0)) {
            throw new IllegalArgumentException(what + " must be finite and positive, got " + value + " " + unit);
        }
    }
}
