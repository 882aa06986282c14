package org.ritzwerk.engine.calibrate;

import java.util.Arrays;
import java.util.Objects;
import org.ritzwerk.medium.Medium;

/**
 * A calibration lamp's reference lines in columns: wavelength in nm (in one {@link #medium()
 * medium}), relative intensity, standard uncertainty in nm. The engine reads no files: the
 * caller builds this from a lamp table (for example one of the refdata lamp sets).
 *
 * <p>Immutable and thread-safe.
 */
public final class LampLines {

    private final double[] wavelength;
    private final double[] intensity;
    private final double[] sigma;
    private final boolean sigmasGiven;
    private final Medium medium;

    private LampLines(double[] wavelength, double[] intensity, double[] sigma, boolean sigmasGiven, Medium medium) {
        this.wavelength = wavelength;
        this.intensity = intensity;
        this.sigma = sigma;
        this.sigmasGiven = sigmasGiven;
        this.medium = medium;
    }

    /**
     * @param wavelengthNm      wavelengths in nm, finite and positive, at least one (copied)
     * @param relativeIntensity relative intensities (any scale), finite and &gt;= 0; or null when
     *                          unknown (then every line counts as equally strong)
     * @param sigmaNm           standard uncertainties in nm, finite and &gt;= 0; or null when unknown
     *                          (then 0)
     * @param medium            the medium of the wavelengths (air for the usual lamp tables)
     * @return the lines
     * @throws IllegalArgumentException for an empty list, lengths that differ, or naming the first
     *         unusable value
     */
    public static LampLines of(double[] wavelengthNm, double[] relativeIntensity, double[] sigmaNm, Medium medium) {
        Objects.requireNonNull(medium, "medium");
        int n = wavelengthNm.length;
        if (n == 0) {
            throw new IllegalArgumentException("the lamp line list is empty");
        }
        if ((relativeIntensity != null && relativeIntensity.length != n) || (sigmaNm != null && sigmaNm.length != n)) {
            throw new IllegalArgumentException("wavelengths, intensities and uncertainties must have one value per line: "
                    + n + ", " + (relativeIntensity == null ? "-" : relativeIntensity.length) + ", "
                    + (sigmaNm == null ? "-" : sigmaNm.length));
        }
        double[] intensity = new double[n];
        double[] sigma = new double[n];
        for (int i = 0; i < n; i++) {
            if (!(wavelengthNm[i] > 0) || Double.isInfinite(wavelengthNm[i])) {
                throw new IllegalArgumentException("line " + i + ": wavelength must be finite and positive (nm), got "
                        + wavelengthNm[i]);
            }
            intensity[i] = relativeIntensity == null ? 1 : relativeIntensity[i];
            if (!(intensity[i] >= 0) || Double.isInfinite(intensity[i])) {
                throw new IllegalArgumentException("line " + i + ": relative intensity must be finite and >= 0, got "
                        + intensity[i]);
            }
            sigma[i] = sigmaNm == null ? 0 : sigmaNm[i];
            if (!(sigma[i] >= 0) || Double.isInfinite(sigma[i])) {
                throw new IllegalArgumentException("line " + i + ": uncertainty must be finite and >= 0 (nm), got "
                        + sigma[i]);
            }
        }
        return new LampLines(wavelengthNm.clone(), intensity, sigma, sigmaNm != null, medium);
    }

    /** @return the number of lines */
    public int size() {
        return wavelength.length;
    }

    /**
     * @param i line index
     * @return its wavelength in nm
     */
    public double wavelength(int i) {
        return wavelength[i];
    }

    /**
     * @param i line index
     * @return its relative intensity (1 for every line when none were given)
     */
    public double intensity(int i) {
        return intensity[i];
    }

    /**
     * @param i line index
     * @return its standard uncertainty in nm (0 when none were given)
     */
    public double sigma(int i) {
        return sigma[i];
    }

    /** @return whether uncertainties were given */
    public boolean sigmasGiven() {
        return sigmasGiven;
    }

    /** @return the medium of the wavelengths */
    public Medium medium() {
        return medium;
    }

    /** @return the wavelengths in nm, a copy */
    public double[] wavelengths() {
        return wavelength.clone();
    }

    @Override
    public String toString() {
        double lo = Arrays.stream(wavelength).min().orElse(Double.NaN);
        double hi = Arrays.stream(wavelength).max().orElse(Double.NaN);
        return "LampLines[" + wavelength.length + " lines, " + lo + " to " + hi + " nm, " + medium.spec() + "]";
    }
}
