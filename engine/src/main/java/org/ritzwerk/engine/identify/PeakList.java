package org.ritzwerk.engine.identify;

import java.util.Arrays;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * Measured peaks in columns: vacuum wavelength and its standard uncertainty (metres) and an
 * optional intensity, in the order given. Immutable and thread-safe.
 */
public final class PeakList {

    private final double[] wavelength;
    private final double[] sigma;
    private final double[] intensity;
    /** The shortest and the longest vacuum wavelength, metres. */
    private final double shortest;
    private final double longest;
    /**
     * The median uncertainty, worked out when first asked (null until then). Threads that race
     * work out the same value; a Double is immutable, so none sees a half-made one.
     */
    private Double medianSigma;

    private PeakList(double[] wavelength, double[] sigma, double[] intensity) {
        this.wavelength = wavelength;
        this.sigma = sigma;
        this.intensity = intensity;
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double w : wavelength) {
            lo = Math.min(lo, w);
            hi = Math.max(hi, w);
        }
        this.shortest = lo;
        this.longest = hi;
    }

    /** @return the shortest vacuum wavelength among the peaks, metres */
    public double shortestWavelength() {
        return shortest;
    }

    /** @return the longest vacuum wavelength among the peaks, metres */
    public double longestWavelength() {
        return longest;
    }

    /**
     * @param positions   peak positions in {@code unit} (and {@code medium} for wavelengths)
     * @param sigmas      their standard uncertainties in the same unit, or null when unknown
     *                    (then 0; use an absolute or relative tolerance); NaN marks one peak's as
     *                    unknown, as the peak-file readers give it
     * @param intensities observed intensities (any relative unit), or null; NaN where unknown
     * @param unit        the unit of the positions: wavelength, wavenumber, frequency or energy
     * @param medium      the medium of wavelength positions; ignored for other units
     * @return the peaks, converted to vacuum wavelength
     * @throws IllegalArgumentException naming the first bad element (non-finite or non-positive
     *                                  position, negative or infinite uncertainty or intensity),
     *                                  for mismatched lengths or an empty list
     */
    public static PeakList of(double[] positions, double[] sigmas, double[] intensities, Unit unit, Medium medium) {
        int n = positions.length;
        if (n == 0) {
            throw new IllegalArgumentException("the peak list is empty");
        }
        if (sigmas != null && sigmas.length != n || intensities != null && intensities.length != n) {
            throw new IllegalArgumentException("positions, uncertainties and intensities differ in length: " + n + ", "
                    + (sigmas == null ? "-" : sigmas.length) + ", " + (intensities == null ? "-" : intensities.length));
        }
        if (unit.kind() == Kind.TEMPERATURE) {
            throw new IllegalArgumentException("peak positions cannot be temperatures (" + unit.symbol() + ")");
        }
        double[] wavelength = new double[n];
        SpectralArrays.convert(positions, unit, medium, Unit.METRE, Medium.vacuum(), wavelength);
        double[] sigma = new double[n];
        if (sigmas != null) {
            // First order: the uncertainty scales with |d lambda / d x| at the peak, from the
            // positions x -+ dx. They are converted in one call (the conversion is element by
            // element, so each value is the one a call per peak gives); should that call fail,
            // each peak is converted on its own, in order, so that the first bad peak is named.
            double[] pairs = new double[2 * n];
            for (int i = 0; i < n; i++) {
                double x = positions[i];
                double dx = x * 1e-7;
                pairs[2 * i] = x - dx;
                pairs[2 * i + 1] = x + dx;
            }
            double[] converted = new double[2 * n];
            try {
                SpectralArrays.convert(pairs, unit, medium, Unit.METRE, Medium.vacuum(), converted);
            } catch (RuntimeException e) {
                converted = null;
            }
            for (int i = 0; i < n; i++) {
                double u = sigmas[i];
                if (Double.isNaN(u)) {
                    continue; // not given: 0, as for a list without uncertainties
                }
                if (!(u >= 0) || Double.isInfinite(u)) {
                    throw new IllegalArgumentException("peak " + i + ": uncertainty must be finite and >= 0, got " + u);
                }
                double x = positions[i];
                double dx = x * 1e-7;
                double[] out = converted == null ? new double[2] : null;
                if (out != null) {
                    SpectralArrays.convert(new double[] {x - dx, x + dx}, unit, medium, Unit.METRE, Medium.vacuum(),
                            out);
                }
                double low = out == null ? converted[2 * i] : out[0];
                double high = out == null ? converted[2 * i + 1] : out[1];
                sigma[i] = Math.abs(high - low) / (2 * dx) * u;
            }
        }
        double[] intensity = new double[n];
        if (intensities == null) {
            Arrays.fill(intensity, Double.NaN);
        } else {
            for (int i = 0; i < n; i++) {
                if (!Double.isNaN(intensities[i]) && (!(intensities[i] >= 0) || Double.isInfinite(intensities[i]))) {
                    throw new IllegalArgumentException("peak " + i + ": intensity must be finite and >= 0, got "
                            + intensities[i]);
                }
                intensity[i] = intensities[i];
            }
        }
        return new PeakList(wavelength, sigma, intensity);
    }

    /**
     * @param vacuumMetres vacuum wavelengths in metres (copied)
     * @param sigmaMetres  standard uncertainties in metres, or null
     * @return the peaks
     */
    public static PeakList ofVacuumMetres(double[] vacuumMetres, double[] sigmaMetres) {
        return of(vacuumMetres, sigmaMetres, null, Unit.METRE, Medium.vacuum());
    }

    /** @return the number of peaks */
    public int size() {
        return wavelength.length;
    }

    /**
     * @param i peak index
     * @return vacuum wavelength in metres
     */
    public double wavelength(int i) {
        return wavelength[i];
    }

    /**
     * @param i peak index
     * @return standard uncertainty in metres (0 when unknown)
     */
    public double sigma(int i) {
        return sigma[i];
    }

    /**
     * @param i peak index
     * @return intensity, NaN when not given
     */
    public double intensity(int i) {
        return intensity[i];
    }

    double[] wavelengths() {
        return wavelength;
    }

    double[] sigmas() {
        return sigma;
    }

    /** @return the peaks' median uncertainty (the upper one of an even count), metres */
    double medianSigma() {
        Double median = medianSigma;
        if (median == null) {
            double[] sorted = sigma;
            for (int i = 1; i < sorted.length; i++) {
                if (sorted[i - 1] > sorted[i]) {
                    sorted = sigma.clone();
                    Arrays.sort(sorted);
                    break;
                }
            }
            median = sorted[sorted.length / 2];
            medianSigma = median;
        }
        return median;
    }
}
