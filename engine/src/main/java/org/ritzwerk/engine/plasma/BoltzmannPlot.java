package org.ritzwerk.engine.plasma;

import java.util.Optional;
import org.ritzwerk.constants.PhysicalConstants;

/**
 * The excitation temperature of a gas in local thermodynamic equilibrium from the intensities
 * of its optically thin lines: a straight-line fit of
 * <pre>
 *   y = ln(I / (g_u A))          (intensities counted in photons)
 *   y = ln(I / (g_u A nu))       (intensities in energy)
 * </pre>
 * against the upper-level energy E_u, whose slope is -1 / (k T) (common practice). With
 * intensity uncertainties the fit is weighted by 1 / sigma_y^2, sigma_y = sigma_I / I, and the
 * slope's uncertainty comes from those weights; without them every point weighs the same and
 * the uncertainty comes from the scatter about the line (n - 2 degrees of freedom), as in an
 * ordinary least-squares fit. The temperature's uncertainty is carried to first order,
 * sigma_T = sigma_slope / (k slope^2).
 */
public final class BoltzmannPlot {

    /** How the intensities were measured. */
    public enum Counting {
        /** Photon counts or photon flux: I proportional to g A exp(-E/kT). */
        PHOTONS,
        /** Energy flux (radiance): I proportional to g A nu exp(-E/kT). */
        ENERGY
    }

    /**
     * The fit.
     *
     * @param temperature            excitation temperature in K
     * @param temperatureUncertainty its standard uncertainty in K
     * @param slope                  fitted slope in J^-1
     * @param slopeUncertainty       its standard uncertainty in J^-1
     * @param intercept              fitted intercept
     * @param chiSquare              sum of squared (weighted) residuals
     * @param lines                  number of lines fitted
     */
    public record Fit(double temperature, double temperatureUncertainty, double slope, double slopeUncertainty,
            double intercept, double chiSquare, int lines) {
    }

    private BoltzmannPlot() {
    }

    /** Upper energies closer than this share of their size are one energy (common practice). */
    private static final double SAME_ENERGY = 1e-12;

    /**
     * @param counting           how the intensities were measured
     * @param intensity          line intensities, finite and positive, any common scale
     * @param intensitySigma     their standard uncertainties (finite, positive), or null
     * @param upperEnergy        upper-level energies in J
     * @param upperWeight        upper-level statistical weights g_u, positive
     * @param einsteinA          Einstein A in s^-1, positive
     * @param frequency          line frequencies in Hz, positive; needed for {@link Counting#ENERGY},
     *                           may be null for photons
     * @return the fitted temperature with its uncertainty
     * @throws IllegalArgumentException naming the line and the field that is unusable, when the
     *         arrays differ in length, when there are fewer than 3 lines (2 with uncertainties),
     *         when all upper energies coincide, or when the slope is not negative (no
     *         positive temperature explains the intensities)
     */
    public static Fit fit(Counting counting, double[] intensity, double[] intensitySigma, double[] upperEnergy,
            double[] upperWeight, double[] einsteinA, double[] frequency) {
        Fit fit = fitOrRising(counting, intensity, intensitySigma, upperEnergy, upperWeight, einsteinA, frequency);
        if (fit.slope() >= 0) {
            throw new IllegalArgumentException("the Boltzmann plot rises with upper-level energy (slope " + fit.slope()
                    + " J^-1): no positive excitation temperature fits these intensities");
        }
        return fit;
    }

    /**
     * As {@link #fit}, for intensities that may come from a measurement: a plot that does not fall
     * with upper-level energy (no positive temperature explains the intensities, as measured
     * intensities of a few lines can give) is an answer, not a broken precondition.
     *
     * @param counting       how the intensities were measured
     * @param intensity      line intensities, finite and positive, any common scale
     * @param intensitySigma their standard uncertainties (finite, positive), or null
     * @param upperEnergy    upper-level energies in J
     * @param upperWeight    upper-level statistical weights g_u, positive
     * @param einsteinA      Einstein A in s^-1, positive
     * @param frequency      line frequencies in Hz, positive; needed for {@link Counting#ENERGY}
     * @return the fit, or empty when its slope is not negative
     * @throws IllegalArgumentException as {@link #fit} does, except for the slope
     */
    public static Optional<Fit> fitIfFalling(Counting counting, double[] intensity, double[] intensitySigma,
            double[] upperEnergy, double[] upperWeight, double[] einsteinA, double[] frequency) {
        Fit fit = fitOrRising(counting, intensity, intensitySigma, upperEnergy, upperWeight, einsteinA, frequency);
        return fit.slope() < 0 ? Optional.of(fit) : Optional.empty();
    }

    /** The fit; for a slope that is not negative, temperature and its uncertainty are NaN. */
    private static Fit fitOrRising(Counting counting, double[] intensity, double[] intensitySigma,
            double[] upperEnergy, double[] upperWeight, double[] einsteinA, double[] frequency) {
        java.util.Objects.requireNonNull(counting, "counting");
        int n = java.util.Objects.requireNonNull(intensity, "intensity").length;
        sameLength("upper energies", upperEnergy, n);
        sameLength("statistical weights", upperWeight, n);
        sameLength("Einstein A values", einsteinA, n);
        if (intensitySigma != null) {
            sameLength("intensity uncertainties", intensitySigma, n);
        }
        if (counting == Counting.ENERGY) {
            if (frequency == null) {
                throw new IllegalArgumentException("energy-flux intensities need the line frequencies");
            }
            sameLength("frequencies", frequency, n);
        }
        boolean weighted = intensitySigma != null;
        int needed = weighted ? 2 : 3;
        if (n < needed) {
            throw new IllegalArgumentException("a Boltzmann plot needs at least " + needed + " lines"
                    + (weighted ? "" : " without intensity uncertainties") + ", got " + n);
        }
        double sw = 0;
        double sx = 0;
        double sy = 0;
        double[] x = new double[n];
        double[] y = new double[n];
        double[] w = new double[n];
        for (int i = 0; i < n; i++) {
            positive("intensity", intensity[i], i);
            finite("upper energy", upperEnergy[i], i);
            positive("statistical weight", upperWeight[i], i);
            positive("Einstein A", einsteinA[i], i);
            double scale = upperWeight[i] * einsteinA[i];
            if (counting == Counting.ENERGY) {
                positive("frequency", frequency[i], i);
                scale *= frequency[i];
            }
            x[i] = upperEnergy[i];
            y[i] = Math.log(intensity[i]) - Math.log(scale);
            if (weighted) {
                positive("intensity uncertainty", intensitySigma[i], i);
                double sigmaY = intensitySigma[i] / intensity[i];
                w[i] = 1 / (sigmaY * sigmaY);
            } else {
                w[i] = 1;
            }
            sw += w[i];
            sx += w[i] * x[i];
            sy += w[i] * y[i];
        }
        // Equal energies (to rounding: the weighted mean of equal numbers need not be one of them,
        // which left a spread of 1e-34 J and a slope of 1e18 J^-1) give no plot.
        double lowest = Double.POSITIVE_INFINITY;
        double highest = Double.NEGATIVE_INFINITY;
        for (double e : x) {
            lowest = Math.min(lowest, e);
            highest = Math.max(highest, e);
        }
        if (!(highest - lowest > SAME_ENERGY * Math.max(Math.abs(lowest), Math.abs(highest)))) {
            throw new IllegalArgumentException("all lines share one upper-level energy (" + lowest + " J, within "
                    + SAME_ENERGY + " of it); a Boltzmann plot needs lines from upper levels of different energies");
        }
        // Centre on the weighted means, so that energies of 1e-18 J and logs of 1e1 stay well
        // conditioned.
        double mx = sx / sw;
        double my = sy / sw;
        double sxx = 0;
        double sxy = 0;
        for (int i = 0; i < n; i++) {
            double dx = x[i] - mx;
            sxx += w[i] * dx * dx;
            sxy += w[i] * dx * (y[i] - my);
        }
        double slope = sxy / sxx;
        double intercept = my - slope * mx;
        double chiSquare = 0;
        for (int i = 0; i < n; i++) {
            double r = y[i] - intercept - slope * x[i];
            chiSquare += w[i] * r * r;
        }
        double slopeVariance = weighted ? 1 / sxx : chiSquare / (n - 2) / sxx;
        double slopeSigma = Math.sqrt(slopeVariance);
        if (!(slope < 0)) {
            return new Fit(Double.NaN, Double.NaN, slope, slopeSigma, intercept, chiSquare, n);
        }
        double k = PhysicalConstants.K;
        double temperature = -1 / (k * slope);
        double temperatureSigma = slopeSigma / (k * slope * slope);
        return new Fit(temperature, temperatureSigma, slope, slopeSigma, intercept, chiSquare, n);
    }

    private static void sameLength(String what, double[] values, int n) {
        if (values == null || values.length != n) {
            throw new IllegalArgumentException("the " + what + " must match the " + n + " intensities, got "
                    + (values == null ? "none" : String.valueOf(values.length)));
        }
    }

    private static void positive(String what, double value, int line) {
        if (!(Double.isFinite(value) && value > 0)) {
            throw new IllegalArgumentException("line " + line + ": " + what + " must be finite and positive, got " + value);
        }
    }

    private static void finite(String what, double value, int line) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("line " + line + ": " + what + " must be finite, got " + value);
        }
    }
}
