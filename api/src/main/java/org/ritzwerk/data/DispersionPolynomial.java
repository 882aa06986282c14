package org.ritzwerk.data;

import java.util.Arrays;
import java.util.Objects;
import org.ritzwerk.medium.Medium;

/**
 * A detector's pixel-to-wavelength polynomial as data: the coefficients in the scaled pixel
 * variable
 * <pre>
 *   x = (p - centrePixel) / halfRange,     lambda(p) = sum_j a_j x^j   (nm)
 * </pre>
 * their covariance, the pixel range the polynomial was fitted over and the medium of the
 * wavelengths, and optionally a higher-degree polynomial fitted to the same lines with its
 * covariance, which bounds the uncertainty beyond the fitted range (see below). This record only
 * holds and checks the numbers; evaluating them (wavelength with
 * uncertainty at a pixel, the inverse, the dispersion, the monotonicity check) is the engine's
 * {@code org.ritzwerk.engine.calibrate.DispersionSolution}.
 *
 * <p><b>Beyond the fitted range.</b> Between its first and last fitted line a polynomial is held
 * by the lines; beyond them it is extrapolated, and a polynomial of higher degree that fits the
 * same lines as well may run elsewhere. A fit therefore keeps such a polynomial
 * ({@link #higherDegreeCoefficients()}, {@link #higherDegreeCovariance()}; the engine's fit keeps
 * the usual degree 3, or the next degree from 3 up), and the engine states the uncertainty beyond
 * the range so that it covers it (its own uncertainty plus its distance from this polynomial).
 * Both are null when the lines did not determine it, and for polynomials made before it was kept.
 *
 * <p><b>Between the fitted lines.</b> When the degree was chosen automatically and the higher
 * polynomial is of the next degree, {@link #higherDegreeWeight()} is that degree's Akaike weight
 * against the chosen one: how much support the lines give it. The engine then states, between the
 * lines too, at least the unconditional uncertainty of the choice between the two degrees (the
 * model-selection uncertainty of S. T. Buckland, K. P. Burnham and N. H. Augustin, Biometrics 53,
 * 603 (1997)). NaN when not known (a fixed degree, another higher degree, older polynomials).
 *
 * <p><b>Units.</b> Pixels are 0-based with pixel i centred at i. Coefficients in nm, covariance
 * in nm^2, the wavelengths in the {@link #medium()} given.
 *
 * <p>Immutable and thread-safe: the arrays are copied in and out; {@code equals} compares them
 * element by element (exactly, as {@link Arrays#equals(double[], double[])} does).
 *
 * @param medium       the medium of the wavelengths
 * @param centrePixel  the pixel at which x = 0; finite
 * @param halfRange    pixels per unit of x; finite and positive
 * @param coefficients a_0 .. a_d in nm; at least two, finite
 * @param covariance   their (d + 1) x (d + 1) covariance in nm^2, symmetric, finite and positive
 *                     semidefinite; or null when unknown
 * @param lowestPixel  the lowest pixel of the range the polynomial is valid for; finite
 * @param highestPixel the highest pixel of that range; finite, above the lowest
 * @param higherDegreeCoefficients b_0 .. b_e in nm in the same scaled variable, e &gt; d: a
 *                                 polynomial of higher degree fitted to the same lines; null
 *                                 when not known
 * @param higherDegreeCovariance   their (e + 1) x (e + 1) covariance in nm^2, with the same checks
 *                                 as the covariance; null exactly when the coefficients are
 * @param higherDegreeWeight       the Akaike weight of the higher degree e = d + 1 against degree
 *                                 d, 0 to 1, when the degree was chosen automatically; NaN when
 *                                 not known (always NaN without a higher degree, or when e &gt; d + 1)
 */
public record DispersionPolynomial(Medium medium, double centrePixel, double halfRange, double[] coefficients,
        double[][] covariance, double lowestPixel, double highestPixel, double[] higherDegreeCoefficients,
        double[][] higherDegreeCovariance, double higherDegreeWeight) {

    /**
     * A polynomial without a higher degree's (see the class comment).
     *
     * @param medium       the medium of the wavelengths
     * @param centrePixel  the pixel at which x = 0; finite
     * @param halfRange    pixels per unit of x; finite and positive
     * @param coefficients a_0 .. a_d in nm; at least two, finite
     * @param covariance   their (d + 1) x (d + 1) covariance in nm^2, or null when unknown
     * @param lowestPixel  the lowest pixel of the range the polynomial is valid for; finite
     * @param highestPixel the highest pixel of that range; finite, above the lowest
     * @throws IllegalArgumentException naming the first unusable component
     */
    public DispersionPolynomial(Medium medium, double centrePixel, double halfRange, double[] coefficients,
            double[][] covariance, double lowestPixel, double highestPixel) {
        this(medium, centrePixel, halfRange, coefficients, covariance, lowestPixel, highestPixel, null, null);
    }

    /**
     * A polynomial with a higher degree's whose weight is not known (NaN; see the class comment).
     *
     * @param medium       the medium of the wavelengths
     * @param centrePixel  the pixel at which x = 0; finite
     * @param halfRange    pixels per unit of x; finite and positive
     * @param coefficients a_0 .. a_d in nm; at least two, finite
     * @param covariance   their (d + 1) x (d + 1) covariance in nm^2, or null when unknown
     * @param lowestPixel  the lowest pixel of the range the polynomial is valid for; finite
     * @param highestPixel the highest pixel of that range; finite, above the lowest
     * @param higherDegreeCoefficients b_0 .. b_e in nm, e &gt; d, finite; or null
     * @param higherDegreeCovariance   their covariance in nm^2; null exactly when the coefficients are
     * @throws IllegalArgumentException naming the first unusable component
     */
    public DispersionPolynomial(Medium medium, double centrePixel, double halfRange, double[] coefficients,
            double[][] covariance, double lowestPixel, double highestPixel, double[] higherDegreeCoefficients,
            double[][] higherDegreeCovariance) {
        this(medium, centrePixel, halfRange, coefficients, covariance, lowestPixel, highestPixel,
                higherDegreeCoefficients, higherDegreeCovariance, Double.NaN);
    }

    /**
     * Validates and copies.
     *
     * @param medium       the medium of the wavelengths
     * @param centrePixel  the pixel at which x = 0; finite
     * @param halfRange    pixels per unit of x; finite and positive
     * @param coefficients a_0 .. a_d in nm; at least two, finite
     * @param covariance   their (d + 1) x (d + 1) covariance in nm^2, symmetric, finite and positive
     *                     semidefinite; or null when unknown
     * @param lowestPixel  the lowest pixel of the range the polynomial is valid for; finite
     * @param highestPixel the highest pixel of that range; finite, above the lowest
     * @param higherDegreeCoefficients b_0 .. b_e in nm, e &gt; d, finite: a higher degree's
     *                                 polynomial fitted to the same lines; or null
     * @param higherDegreeCovariance   their covariance in nm^2; null exactly when the coefficients are
     * @param higherDegreeWeight       the next degree's Akaike weight, 0 to 1, or NaN when not known;
     *                                 NaN unless the higher degree is d + 1
     * @throws IllegalArgumentException naming the first unusable component
     */
    public DispersionPolynomial {
        Objects.requireNonNull(medium, "medium");
        Objects.requireNonNull(coefficients, "coefficients");
        if (!Double.isFinite(centrePixel)) {
            throw new IllegalArgumentException("centre pixel must be finite, got " + centrePixel);
        }
        if (!(halfRange > 0) || Double.isInfinite(halfRange)) {
            throw new IllegalArgumentException("half range must be finite and positive (pixels), got " + halfRange);
        }
        if (coefficients.length < 2) {
            throw new IllegalArgumentException("a dispersion polynomial needs at least two coefficients, got "
                    + coefficients.length);
        }
        for (int j = 0; j < coefficients.length; j++) {
            if (!Double.isFinite(coefficients[j])) {
                throw new IllegalArgumentException("coefficient a" + j + " is not finite: " + coefficients[j]);
            }
        }
        coefficients = coefficients.clone();
        int k = coefficients.length;
        if (covariance != null) {
            checkCovariance(covariance, k, "");
            covariance = copy(covariance);
        }
        if ((higherDegreeCoefficients == null) != (higherDegreeCovariance == null)) {
            throw new IllegalArgumentException("the higher degree's coefficients and covariance come together: got "
                    + (higherDegreeCoefficients == null ? "a covariance without coefficients"
                            : "coefficients without a covariance"));
        }
        if (higherDegreeCoefficients != null) {
            if (higherDegreeCoefficients.length <= k) {
                throw new IllegalArgumentException("the higher degree's polynomial needs more coefficients than the "
                        + "polynomial's " + k + ", got " + higherDegreeCoefficients.length);
            }
            for (int j = 0; j < higherDegreeCoefficients.length; j++) {
                if (!Double.isFinite(higherDegreeCoefficients[j])) {
                    throw new IllegalArgumentException("higher-degree coefficient b" + j + " is not finite: "
                            + higherDegreeCoefficients[j]);
                }
            }
            higherDegreeCoefficients = higherDegreeCoefficients.clone();
            checkCovariance(higherDegreeCovariance, higherDegreeCoefficients.length, "higher-degree ");
            higherDegreeCovariance = copy(higherDegreeCovariance);
        }
        if (!Double.isNaN(higherDegreeWeight)) {
            if (!(higherDegreeWeight >= 0 && higherDegreeWeight <= 1)) {
                throw new IllegalArgumentException("the higher degree's weight must be 0 to 1 (or NaN when not known),"
                        + " got " + higherDegreeWeight);
            }
            if (higherDegreeCoefficients == null || higherDegreeCoefficients.length != k + 1) {
                throw new IllegalArgumentException("the higher degree's weight " + higherDegreeWeight + " needs a"
                        + " higher degree of d + 1 = " + k + ", got " + (higherDegreeCoefficients == null ? "none"
                                : "degree " + (higherDegreeCoefficients.length - 1)));
            }
        }
        if (!(Double.isFinite(lowestPixel) && Double.isFinite(highestPixel) && highestPixel > lowestPixel)) {
            throw new IllegalArgumentException("the valid range needs finite lowest < highest pixel, got "
                    + lowestPixel + " to " + highestPixel);
        }
    }

    private static void checkCovariance(double[][] covariance, int k, String which) {
        if (covariance.length != k) {
            throw new IllegalArgumentException("the " + which + "covariance must be " + k + " x " + k + ", got "
                    + covariance.length + " rows");
        }
        for (int i = 0; i < k; i++) {
            if (covariance[i].length != k) {
                throw new IllegalArgumentException(which + "covariance row " + i + " must have " + k + " entries, got "
                        + covariance[i].length);
            }
        }
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                if (!Double.isFinite(covariance[i][j]) || covariance[i][j] != covariance[j][i]) {
                    throw new IllegalArgumentException(which + "covariance entry (" + i + ", " + j
                            + ") must be finite and symmetric, got " + covariance[i][j]);
                }
            }
        }
        checkPositiveSemidefinite(covariance, which);
    }

    /**
     * A covariance has no negative variances and no negative combination: its correlation matrix
     * (zero-variance rows left out, which must then be zero throughout) has no Cholesky pivot below
     * -1e-9 (rounding of a fit's covariance stays far inside that).
     */
    private static void checkPositiveSemidefinite(double[][] covariance, String which) {
        int k = covariance.length;
        double[] scale = new double[k];
        for (int i = 0; i < k; i++) {
            if (covariance[i][i] < 0) {
                throw new IllegalArgumentException(which + "covariance entry (" + i + ", " + i
                        + ") is a variance and must not be negative, got " + covariance[i][i]);
            }
            scale[i] = Math.sqrt(covariance[i][i]);
            for (int j = 0; j < k; j++) {
                if (scale[i] == 0 && covariance[i][j] != 0) {
                    throw new IllegalArgumentException(which + "covariance row " + i + " has variance 0 but covariance "
                            + covariance[i][j] + " with coefficient " + j);
                }
            }
        }
        double[][] l = new double[k][k];
        for (int j = 0; j < k; j++) {
            if (scale[j] == 0) {
                continue;
            }
            double pivot = 1;
            for (int m = 0; m < j; m++) {
                pivot -= l[j][m] * l[j][m];
            }
            if (pivot < -1e-9) {
                throw new IllegalArgumentException("the " + which + "covariance is not positive semidefinite (a "
                        + "combination of the coefficients would have a negative variance; pivot " + pivot
                        + " at coefficient " + j + ")");
            }
            double d = Math.sqrt(Math.max(pivot, 0));
            l[j][j] = d;
            for (int i = j + 1; i < k; i++) {
                if (scale[i] == 0) {
                    continue;
                }
                double sum = covariance[i][j] / (scale[i] * scale[j]);
                for (int m = 0; m < j; m++) {
                    sum -= l[i][m] * l[j][m];
                }
                l[i][j] = d > 1e-12 ? sum / d : 0;
            }
        }
    }

    private static double[][] copy(double[][] matrix) {
        double[][] copy = new double[matrix.length][];
        for (int i = 0; i < copy.length; i++) {
            copy[i] = matrix[i].clone();
        }
        return copy;
    }

    /** @return a_0 .. a_d in nm, a copy */
    @Override
    public double[] coefficients() {
        return coefficients.clone();
    }

    /** @return the covariance in nm^2, a copy; null when unknown */
    @Override
    public double[][] covariance() {
        return covariance == null ? null : copy(covariance);
    }

    /** @return b_0 .. b_(d+1) in nm, a copy; null when not known */
    @Override
    public double[] higherDegreeCoefficients() {
        return higherDegreeCoefficients == null ? null : higherDegreeCoefficients.clone();
    }

    /** @return their covariance in nm^2, a copy; null when not known */
    @Override
    public double[][] higherDegreeCovariance() {
        return higherDegreeCovariance == null ? null : copy(higherDegreeCovariance);
    }

    /** @return whether the covariance is known */
    public boolean hasCovariance() {
        return covariance != null;
    }

    /** @return the polynomial degree d */
    public int degree() {
        return coefficients.length - 1;
    }

    /**
     * The same polynomial in the raw pixel, lambda(p) = sum_j b_j p^j (the binomial expansion of
     * ((p - c) / h)^j). Badly conditioned for high degrees: prefer the scaled form for anything
     * that is computed again.
     *
     * @return b_0 .. b_d in nm per pixel^j
     */
    public double[] powerCoefficients() {
        return powerCoefficients(coefficients, centrePixel, halfRange);
    }

    /**
     * {@link #powerCoefficients()} for coefficients not (yet) in a record.
     *
     * @param scaled      a_0 .. a_d of the polynomial in x = (p - centrePixel) / halfRange, nm
     * @param centrePixel the centre of x, pixels
     * @param halfRange   the scale of x, pixels
     * @return b_0 .. b_d in nm per pixel^j
     */
    public static double[] powerCoefficients(double[] scaled, double centrePixel, double halfRange) {
        int k = scaled.length;
        double[] b = new double[k];
        // (p - c)^j / h^j expanded by the binomial theorem.
        for (int j = 0; j < k; j++) {
            double scale = scaled[j] / Math.pow(halfRange, j);
            double binomial = 1;
            for (int m = 0; m <= j; m++) {
                // term: C(j, m) p^m (-c)^(j - m)
                b[m] += scale * binomial * Math.pow(-centrePixel, j - m);
                binomial = binomial * (j - m) / (m + 1);
            }
        }
        return b;
    }

    @Override
    public boolean equals(Object other) {
        return other instanceof DispersionPolynomial that && medium.equals(that.medium)
                && Double.compare(centrePixel, that.centrePixel) == 0 && Double.compare(halfRange, that.halfRange) == 0
                && Arrays.equals(coefficients, that.coefficients) && Arrays.deepEquals(covariance, that.covariance)
                && Double.compare(lowestPixel, that.lowestPixel) == 0
                && Double.compare(highestPixel, that.highestPixel) == 0
                && Arrays.equals(higherDegreeCoefficients, that.higherDegreeCoefficients)
                && Arrays.deepEquals(higherDegreeCovariance, that.higherDegreeCovariance)
                && Double.compare(higherDegreeWeight, that.higherDegreeWeight) == 0;
    }

    @Override
    public int hashCode() {
        return Objects.hash(medium, centrePixel, halfRange, Arrays.hashCode(coefficients),
                Arrays.deepHashCode(covariance), lowestPixel, highestPixel, Arrays.hashCode(higherDegreeCoefficients),
                Arrays.deepHashCode(higherDegreeCovariance), higherDegreeWeight);
    }

    @Override
    public String toString() {
        return "DispersionPolynomial[medium=" + medium.spec() + ", centrePixel=" + centrePixel + ", halfRange="
                + halfRange + ", coefficients=" + Arrays.toString(coefficients) + ", covariance="
                + Arrays.deepToString(covariance) + ", lowestPixel=" + lowestPixel + ", highestPixel=" + highestPixel
                + ", higherDegreeCoefficients=" + Arrays.toString(higherDegreeCoefficients)
                + ", higherDegreeCovariance=" + Arrays.deepToString(higherDegreeCovariance) + ", higherDegreeWeight="
                + higherDegreeWeight + "]";
    }
}
