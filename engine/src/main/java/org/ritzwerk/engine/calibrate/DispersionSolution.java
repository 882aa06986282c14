package org.ritzwerk.engine.calibrate;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.ritzwerk.data.CalibrationRecord;
import org.ritzwerk.data.DispersionPolynomial;
import org.ritzwerk.medium.Medium;

/**
 * A pixel-to-wavelength solution: a polynomial in the scaled pixel variable
 * <pre>
 *   x = (p - centre) / halfRange,     lambda(p) = sum_j a_j x^j   (nm)
 * </pre>
 * with the covariance of a_j, and (when it came from a {@link DispersionFit}) the pairs it was
 * fitted to, their residuals and which were rejected by clipping.
 *
 * <p><b>Units and conventions.</b> Pixels are 0-based with pixel i centred at i (edges at
 * i -+ 1/2). Wavelengths are in nm in the {@link #medium() medium} of the line list used (air for
 * the usual lamp tables). Dispersion is in nm per pixel.
 *
 * <p><b>Uncertainty.</b> {@link #wavelengthSigmaAt(double)} is sqrt(v^T C v) with
 * v = (1, x, x^2, ...) and C the coefficients' covariance: the standard uncertainty of the
 * solution itself at that pixel, not of a single new measurement there. Outside the fitted range
 * [{@link #lowestPixel()}, {@link #highestPixel()}] the polynomial is extrapolated, and the
 * covariance alone assumes that the terms above its degree vanish there too, which the lines say
 * nothing about. A fit therefore also keeps a polynomial of higher degree e fitted to the same
 * used pairs, with its own covariance (Birge-scaled like this one's): e is the usual degree 3 for
 * a solution below it (the next degree alone misses a cubic whose inflection lies inside a narrow
 * range), and d + 1 from 3 up. Outside the range the stated variance is the larger of v^T C v and
 * that polynomial's variance plus its squared distance from this one,
 * u^2 = sigma_e^2 + (lambda_e - lambda_d)^2, the measure {@link DispersionFit} uses between the
 * pairs for a low degree. It is a cautious bound rather than a calibrated standard uncertainty:
 * in refdata's seeded lamp sweep (ExtrapolationCoverageTest) 93 % of the extrapolated errors lie
 * within one stated uncertainty (94 % on the sweep's exposures before 2026-12-05), where 68 % would
 * be exact, and all but 0.13 % within three; with the covariance alone 67 % lay within one, and a
 * straight line fitted over pixels 421 to 692 of 1024 was 5.6 pixels off at pixel 0 while stating
 * 0.17 (now 4.7). Where the pairs do not determine a higher degree with a degree of freedom to
 * spare, and for stored coefficients without it, only the covariance is used.
 *
 * <p><b>The choice of degree, between the lines.</b> When the degree d was chosen automatically
 * (from the usual cubic up, or at the highest degree allowed) and the next degree has some support
 * without being significant, the lines cannot decide between the two, and the covariance of d
 * alone states the wavelength as if d were certainly right. The stated uncertainty between the
 * first and last fitted line is then at least the unconditional standard error over the two
 * degrees, with Akaike (AICc) weights w_d = 1 - w and w_(d+1) = w ({@link #nextDegreeWeight()}):
 * <pre>
 *   u(p) = (1 - w) sigma_d(p) + w sqrt(sigma_(d+1)^2(p) + (lambda_(d+1)(p) - lambda_d(p))^2)
 * </pre>
 * (S. T. Buckland, K. P. Burnham and N. H. Augustin, Biometrics 53, 603 (1997); Burnham and
 * Anderson, Model Selection and Multimodel Inference, 2nd ed., Springer 2002, sec. 4.3: their
 * [sum_i w_i sqrt(var_i + (theta_i - theta_avg)^2)], as secondary accounts quote it, here with the
 * chosen polynomial, the estimate reported, in place of the model average theta_avg, so the
 * wavelengths stay the chosen polynomial's), where sigma_d is this solution's own uncertainty
 * (after {@link #modelSelectionScale()}, which matches the spread of all degrees tried only on
 * average over the range) and the next degree's polynomial is the one kept for beyond the range.
 * Neon exposures with a quartic term of 0.18 nm across 2048 pixels, 40 seeds (refdata's
 * QuarticDispersionTest): runs without a note on structure had errors up to 4.5 stated
 * uncertainties, 1.11 RMS, where a cubic was kept that the lines could not tell from a quartic;
 * now at most 3.6, 1.02 RMS. For an exactly cubic dispersion the share of errors within one
 * stated uncertainty goes from 77 % to 80 % (68 % would be exact).
 *
 * <p><b>Data and evaluation.</b> The polynomial as plain data is the api's
 * {@link DispersionPolynomial} ({@link #polynomial()}, {@link #of(DispersionPolynomial)}), and a
 * saved calibration is a {@link CalibrationRecord} ({@link #toRecord}); this class evaluates them
 * (wavelength and its uncertainty, dispersion, inverse, {@link #checkAcross(int, double) the check
 * across a detector}) and carries a fit's pairs and statistics.
 *
 * <p>Immutable and thread-safe; array accessors return copies. Apply one solution to any number
 * of spectra taken with the same set-up via {@link #pixelCentreWavelengths(int)},
 * {@link #pixelEdgeWavelengths(int)} or {@link #wavelengthsAt(double[], double[])}.
 */
public final class DispersionSolution {

    private final double centre;
    private final double halfRange;
    private final double[] coefficients;
    private final double[][] covariance;
    private final double covarianceScale;
    private final double modelSelectionScale;
    private final Medium medium;
    private final double chiSquare;
    private final int degreesOfFreedom;
    private final double lowestPixel;
    private final double highestPixel;
    private final double[] pixel;
    private final double[] wavelength;
    private final double[] sigma;
    private final double[] residual;
    private final boolean[] rejected;
    private final double[] criterion;
    private final String[] pairFlags;
    private final double[] higherCoefficients;
    private final double[][] higherCovariance;
    /** The F-test's chance that the next degree fits this much better by chance; NaN when not fitted. */
    private final double nextDegreeProbability;
    /** The Akaike weight of the higher degree (d + 1) against d; NaN when not known. */
    private final double higherDegreeWeight;

    /**
     * A fitted solution; higherCoefficients and higherCovariance (both null when not
     * determined) are a higher degree's polynomial fitted to the same used pairs and its scaled
     * covariance (see the class comment).
     */
    DispersionSolution(double centre, double halfRange, double[] coefficients, double[][] covariance,
            double covarianceScale, double modelSelectionScale, Medium medium, double chiSquare,
            int degreesOfFreedom, double lowestPixel, double highestPixel, double[] pixel, double[] wavelength,
            double[] sigma, double[] residual, boolean[] rejected, double[] criterion, double[] higherCoefficients,
            double[][] higherCovariance, double nextDegreeProbability, double higherDegreeWeight) {
        this(centre, halfRange, coefficients, covariance, covarianceScale, modelSelectionScale, medium, chiSquare,
                degreesOfFreedom, lowestPixel, highestPixel, pixel, wavelength, sigma, residual, rejected, criterion,
                null, higherCoefficients, higherCovariance, nextDegreeProbability, higherDegreeWeight);
    }

    private DispersionSolution(double centre, double halfRange, double[] coefficients, double[][] covariance,
            double covarianceScale, double modelSelectionScale, Medium medium, double chiSquare,
            int degreesOfFreedom, double lowestPixel, double highestPixel, double[] pixel, double[] wavelength,
            double[] sigma, double[] residual, boolean[] rejected, double[] criterion, String[] pairFlags,
            double[] higherCoefficients, double[][] higherCovariance, double nextDegreeProbability,
            double higherDegreeWeight) {
        this.nextDegreeProbability = nextDegreeProbability;
        this.higherDegreeWeight = higherDegreeWeight;
        this.pairFlags = pairFlags;
        this.higherCoefficients = higherCoefficients;
        this.higherCovariance = higherCovariance;
        this.centre = centre;
        this.halfRange = halfRange;
        this.coefficients = coefficients;
        this.covariance = covariance;
        this.covarianceScale = covarianceScale;
        this.modelSelectionScale = modelSelectionScale;
        this.medium = medium;
        this.chiSquare = chiSquare;
        this.degreesOfFreedom = degreesOfFreedom;
        this.lowestPixel = lowestPixel;
        this.highestPixel = highestPixel;
        this.pixel = pixel;
        this.wavelength = wavelength;
        this.sigma = sigma;
        this.residual = residual;
        this.rejected = rejected;
        this.criterion = criterion;
    }

    /**
     * A solution from stored coefficients (for example read back from a calibration file), with
     * no fitted pairs: {@link #size()} is 0 and the fit statistics are NaN.
     *
     * @param centrePixel  the centre of the scaled variable in pixels, finite
     * @param halfRange    the scale of the scaled variable in pixels, finite and positive
     * @param coefficients a_0 .. a_d in nm, finite, at least two
     * @param covariance   their (d + 1) x (d + 1) covariance in nm^2, symmetric, finite; or null
     *                     for unknown (then {@link #wavelengthSigmaAt(double)} is NaN)
     * @param lowestPixel  lowest pixel of the range the solution is valid for
     * @param highestPixel highest pixel of that range, above the lowest
     * @param medium       the medium of the wavelengths
     * @return the solution
     * @throws IllegalArgumentException naming the first unusable argument
     */
    public static DispersionSolution of(double centrePixel, double halfRange, double[] coefficients,
            double[][] covariance, double lowestPixel, double highestPixel, Medium medium) {
        Objects.requireNonNull(medium, "medium");
        return of(new DispersionPolynomial(medium, centrePixel, halfRange, coefficients, covariance, lowestPixel,
                highestPixel));
    }

    /**
     * A solution from a stored polynomial (for example a calibration file's, read by
     * {@code org.ritzwerk.refdata.CalibrationFiles}), with no fitted pairs: {@link #size()} is 0
     * and the fit statistics are NaN.
     *
     * @param polynomial the polynomial; its covariance may be unknown (then
     *                   {@link #wavelengthSigmaAt(double)} is NaN)
     * @return the solution
     */
    public static DispersionSolution of(DispersionPolynomial polynomial) {
        double[] coefficients = polynomial.coefficients();
        int k = coefficients.length;
        double[][] c = polynomial.covariance();
        if (c == null) {
            c = new double[k][k];
            for (double[] row : c) {
                java.util.Arrays.fill(row, Double.NaN);
            }
        }
        return new DispersionSolution(polynomial.centrePixel(), polynomial.halfRange(), coefficients, c, 1, 1,
                polynomial.medium(), Double.NaN, 0, polynomial.lowestPixel(), polynomial.highestPixel(), new double[0],
                new double[0], new double[0], new double[0], new boolean[0], new double[0],
                polynomial.higherDegreeCoefficients(), polynomial.higherDegreeCovariance(), Double.NaN,
                polynomial.higherDegreeWeight());
    }

    /**
     * @return the solution's polynomial as data: coefficients, covariance (null when this solution
     *         has none, as for stored coefficients without one), fitted range, medium, and the
     *         higher degree's polynomial when known (it bounds the uncertainty beyond the range)
     */
    public DispersionPolynomial polynomial() {
        boolean known = hasCovariance();
        return new DispersionPolynomial(medium, centre, halfRange, coefficients, known ? covariance : null,
                lowestPixel, highestPixel, known ? higherCoefficients : null, known ? higherCovariance : null,
                known && higherCoefficients != null ? higherDegreeWeight : Double.NaN);
    }

    private boolean hasCovariance() {
        for (double[] row : covariance) {
            for (double v : row) {
                if (Double.isNaN(v)) {
                    return false;
                }
            }
        }
        return true;
    }

    /**
     * @param flags one note per fitted pair ("" for none), as {@link CalibrationRecord.FittedLine#flag}
     * @return the same solution carrying those notes
     */
    DispersionSolution withPairFlags(String[] flags) {
        if (flags.length != size()) {
            throw new IllegalArgumentException(size() + " fitted pairs but " + flags.length + " flags");
        }
        return new DispersionSolution(centre, halfRange, coefficients, covariance, covarianceScale,
                modelSelectionScale, medium, chiSquare, degreesOfFreedom, lowestPixel, highestPixel, pixel, wavelength,
                sigma, residual, rejected, criterion, flags.clone(), higherCoefficients, higherCovariance,
                nextDegreeProbability, higherDegreeWeight);
    }

    /**
     * @param i a fitted pair
     * @return its note ({@link CalibrationRecord.FittedLine#BLEND} for a peak that looks like an
     *         unresolved blend, whose uncertainty was widened; {@link CalibrationRecord.FittedLine#SATURATED}
     *         for a saturated peak kept in the fit), "" when none
     */
    public String pairFlag(int i) {
        Objects.checkIndex(i, size());
        return pairFlags == null ? "" : pairFlags[i];
    }

    /**
     * The solution as a calibration record, as a calibration file saves it: the polynomial, the
     * quality figures ({@link #rmsNm()}, {@link #rmsPixels()}, {@link #reducedChiSquare()}, NaN
     * when not known) and every fitted pair with its label and its note ({@link #pairFlag}).
     *
     * @param pixels      the detector's pixel count, at least 2
     * @param description free text: what the calibration came from
     * @param lineLabels  one label per fitted pair ({@link #size()} of them)
     * @param saturated   pairs left out of the fit because their peaks saturated
     * @return the record
     * @throws IllegalArgumentException when the labels do not match the pairs, the detector is too
     *         short to hold the fitted range, or a figure is not finite where the record needs it to be
     */
    public CalibrationRecord toRecord(int pixels, String description, List<String> lineLabels,
            List<CalibrationRecord.SaturatedLine> saturated) {
        if (pixels - 1 < highestPixel) {
            throw new IllegalArgumentException("a detector of " + pixels + " pixels (0 to " + (pixels - 1) + ") cannot "
                    + "hold the solution's fitted range, up to pixel " + highestPixel);
        }
        if (lineLabels.size() != size()) {
            throw new IllegalArgumentException(size() + " fitted pairs but " + lineLabels.size() + " labels");
        }
        List<CalibrationRecord.FittedLine> lines = new ArrayList<>(size());
        for (int i = 0; i < size(); i++) {
            lines.add(new CalibrationRecord.FittedLine(pixel[i], wavelength[i], sigma[i], residual[i],
                    residualPixels(i), !rejected[i], lineLabels.get(i), pairFlag(i)));
        }
        return new CalibrationRecord(description, pixels, polynomial(), finiteOrNaN(rmsNm()),
                finiteOrNaN(rmsPixels()), finiteOrNaN(reducedChiSquare()), lines, saturated);
    }

    private static double finiteOrNaN(double value) {
        return Double.isFinite(value) ? value : Double.NaN;
    }

    /** @return the polynomial degree */
    public int degree() {
        return coefficients.length - 1;
    }

    /** @return the pixel at which the scaled variable x is 0 */
    public double centrePixel() {
        return centre;
    }

    /** @return the pixels per unit of the scaled variable x */
    public double halfRange() {
        return halfRange;
    }

    /** @return a_0 .. a_d of the polynomial in the scaled variable, nm, a copy */
    public double[] scaledCoefficients() {
        return coefficients.clone();
    }

    /**
     * The same polynomial in the raw pixel, lambda(p) = sum_j b_j p^j, for tools that want it
     * (such as {@code PixelGrid.dispersion}). Badly conditioned for high degrees: prefer the
     * scaled form for anything that is computed again.
     *
     * @return b_0 .. b_d in nm per pixel^j
     */
    public double[] powerCoefficients() {
        return DispersionPolynomial.powerCoefficients(coefficients, centre, halfRange);
    }

    /**
     * @return the covariance of the scaled coefficients in nm^2, as reported (after
     *         {@link #covarianceScale()} and {@link #modelSelectionScale()}), a copy
     */
    public double[][] covariance() {
        double[][] copy = new double[covariance.length][];
        for (int i = 0; i < copy.length; i++) {
            copy[i] = covariance[i].clone();
        }
        return copy;
    }

    /**
     * @return the factor the weighted least-squares covariance was multiplied by: max(1, reduced
     *         chi-square) for a weighted fit, the reduced chi-square for an unweighted one, 1 for
     *         stored coefficients
     */
    public double covarianceScale() {
        return covarianceScale;
    }

    /**
     * @return the further factor the covariance was multiplied by so that the stated uncertainty
     *         covers the uncertainty of an automatic degree choice over the fitted range, and, for
     *         a degree chosen below 3, what the next degree's fit leaves open between the pairs
     *         (see {@link DispersionFit}): 1 when one degree had all the support and the pairs fix
     *         the shape, for a fixed degree and for stored coefficients
     */
    public double modelSelectionScale() {
        return modelSelectionScale;
    }

    /** @return the medium of the wavelengths */
    public Medium medium() {
        return medium;
    }

    /** @return the lowest pixel of the fitted (valid) range */
    public double lowestPixel() {
        return lowestPixel;
    }

    /** @return the highest pixel of the fitted (valid) range */
    public double highestPixel() {
        return highestPixel;
    }

    private double scaled(double p) {
        return (p - centre) / halfRange;
    }

    /**
     * @param pixel a pixel position (fractional; pixel i centred at i)
     * @return whether it lies in the fitted (valid) range [{@link #lowestPixel()},
     *         {@link #highestPixel()}], ends included; false for NaN
     */
    public boolean isWithinFittedRange(double pixel) {
        return pixel >= lowestPixel && pixel <= highestPixel;
    }

    /**
     * The wavelength at a pixel. Outside the fitted range [{@link #lowestPixel()},
     * {@link #highestPixel()}] ({@link #isWithinFittedRange}) the polynomial is extrapolated, with
     * no flag: its error grows quickly there ({@link #wavelengthSigmaAt}), and far out the
     * polynomial gives numbers that are no wavelength at all, which are refused.
     *
     * @param pixel a pixel position (fractional; pixel i centred at i)
     * @return the wavelength there in nm; NaN for NaN
     * @throws IllegalArgumentException when the polynomial gives no positive finite wavelength
     *         there (only possible outside the fitted range of an accepted calibration)
     */
    public double wavelengthAt(double pixel) {
        double nm = evaluate(pixel);
        if (!(nm > 0 && nm < Double.POSITIVE_INFINITY) && !Double.isNaN(pixel)) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT, "pixel %s: the dispersion"
                    + " solution gives %s nm there, which is not a wavelength; it was fitted over pixels %s to %s"
                    + " and is extrapolated beyond them (see isWithinFittedRange)", pixel, nm, lowestPixel,
                    highestPixel));
        }
        return nm;
    }

    /** The polynomial at a pixel, unchecked (for the calibration's own search and checks). */
    double evaluate(double pixel) {
        return PolynomialLeastSquares.evaluate(coefficients, scaled(pixel));
    }

    /**
     * @param pixel a pixel position
     * @return the standard uncertainty of {@link #wavelengthAt(double)} in nm: from the
     *         coefficients' covariance within the fitted range, at least the unconditional
     *         uncertainty of the choice between this degree and the next when the next has a weight
     *         ({@link #nextDegreeWeight()}), and beyond the range at least what the higher degree's
     *         polynomial leaves open (see the class comment); NaN for stored coefficients without
     *         covariance
     */
    public double wavelengthSigmaAt(double pixel) {
        double x = scaled(pixel);
        double variance = PolynomialLeastSquares.quadraticForm(covariance, x);
        boolean within = isWithinFittedRange(pixel);
        if (higherCoefficients != null && (!within || higherDegreeWeight > 0)) {
            double shift = PolynomialLeastSquares.evaluate(higherCoefficients, x)
                    - PolynomialLeastSquares.evaluate(coefficients, x);
            double higher = PolynomialLeastSquares.quadraticForm(higherCovariance, x) + shift * shift;
            if (!within) {
                variance = Math.max(variance, higher);
            } else {
                // the unconditional standard error over degrees d and d + 1 (see the class comment)
                double unconditional = (1 - higherDegreeWeight) * Math.sqrt(Math.max(0, variance))
                        + higherDegreeWeight * Math.sqrt(higher);
                variance = Math.max(variance, unconditional * unconditional);
            }
        }
        return Math.sqrt(Math.max(0, variance));
    }

    /**
     * @return the Akaike weight of the next degree d + 1 against this degree d on the same used
     *         pairs, w = exp(-AICc_(d+1) / 2) / (exp(-AICc_d / 2) + exp(-AICc_(d+1) / 2)), 0 to 1:
     *         how much support the lines give the next degree (see {@link #wavelengthSigmaAt}); NaN
     *         when not known (a fixed degree, a degree chosen below 2, too few pairs for the next
     *         degree, stored coefficients without it)
     */
    public double nextDegreeWeight() {
        return higherDegreeWeight;
    }

    /**
     * The uncertainty from the covariance alone, also beyond the fitted range: the measure the
     * calibration's own search and checks were tuned with (a solution of some lines predicting
     * where the others should be).
     */
    double covarianceSigmaAt(double pixel) {
        return Math.sqrt(Math.max(0, PolynomialLeastSquares.quadraticForm(covariance, scaled(pixel))));
    }

    /**
     * @param pixel a pixel position
     * @return d lambda / d p in nm per pixel (negative when wavelength falls with pixel)
     */
    public double dispersionAt(double pixel) {
        return PolynomialLeastSquares.derivative(coefficients, scaled(pixel)) / halfRange;
    }

    /**
     * The pixel at which the solution reaches a wavelength, by Newton's method started from the
     * linear term (to 1e-9 pixel). A wavelength beyond those of the fitted range gives a pixel
     * outside it, by extrapolating the polynomial, with no flag: check the result with
     * {@link #isWithinFittedRange}.
     *
     * @param wavelengthNm a wavelength in nm in this solution's medium, finite and above 0
     * @return the pixel position
     * @throws IllegalArgumentException when the wavelength is not finite or not above 0, or Newton's
     *         method does not converge (the polynomial does not reach it, or turns back, near the
     *         fitted range)
     */
    public double pixelAt(double wavelengthNm) {
        if (!(wavelengthNm > 0) || !Double.isFinite(wavelengthNm)) {
            throw new IllegalArgumentException("wavelength must be finite and above 0, got " + wavelengthNm + " nm");
        }
        double x = (wavelengthNm - coefficients[0]) / coefficients[1];
        for (int iteration = 0; iteration < 100; iteration++) {
            double f = PolynomialLeastSquares.evaluate(coefficients, x) - wavelengthNm;
            double slope = PolynomialLeastSquares.derivative(coefficients, x);
            double step = f / slope;
            if (!Double.isFinite(step)) {
                break;
            }
            x -= step;
            if (Math.abs(step) * halfRange < 1e-9) {
                return centre + x * halfRange;
            }
        }
        throw new IllegalArgumentException("the dispersion solution does not reach " + wavelengthNm
                + " nm: Newton's method found no pixel (solution fitted over pixels " + lowestPixel + " to "
                + highestPixel + ", " + evaluate(lowestPixel) + " to " + evaluate(highestPixel) + " nm)");
    }

    /**
     * @param pixels pixel positions
     * @param out    receives their wavelengths in nm (may be {@code pixels} itself)
     */
    public void wavelengthsAt(double[] pixels, double[] out) {
        if (out.length != pixels.length) {
            throw new IllegalArgumentException("the output needs one value per pixel (" + pixels.length + "), got "
                    + out.length);
        }
        for (int i = 0; i < pixels.length; i++) {
            out[i] = wavelengthAt(pixels[i]);
        }
    }

    /**
     * @param pixels number of detector pixels, at least 1
     * @return the wavelength in nm of each pixel centre 0 .. pixels - 1
     */
    public double[] pixelCentreWavelengths(int pixels) {
        if (pixels < 1) {
            throw new IllegalArgumentException("a detector needs at least one pixel, got " + pixels);
        }
        double[] out = new double[pixels];
        for (int i = 0; i < pixels; i++) {
            out[i] = wavelengthAt(i);
        }
        return out;
    }

    /**
     * @param pixels number of detector pixels, at least 1
     * @return the standard uncertainty in nm of each pixel centre's wavelength 0 .. pixels - 1
     *         (as {@link #wavelengthSigmaAt})
     */
    public double[] pixelCentreWavelengthSigmas(int pixels) {
        if (pixels < 1) {
            throw new IllegalArgumentException("a detector needs at least one pixel, got " + pixels);
        }
        double[] out = new double[pixels];
        for (int i = 0; i < pixels; i++) {
            out[i] = wavelengthSigmaAt(i);
        }
        return out;
    }

    /**
     * @param pixels number of detector pixels, at least 1
     * @return the wavelengths in nm of the pixels + 1 edges at -1/2, 1/2, ..., pixels - 1/2
     */
    public double[] pixelEdgeWavelengths(int pixels) {
        if (pixels < 1) {
            throw new IllegalArgumentException("a detector needs at least one pixel, got " + pixels);
        }
        double[] out = new double[pixels + 1];
        for (int i = 0; i <= pixels; i++) {
            out[i] = wavelengthAt(i - 0.5);
        }
        return out;
    }

    /**
     * What {@link #checkAcross(int, double)} found wrong first.
     *
     * @param kind         what is wrong
     * @param pixel        the pixel where it was found
     * @param wavelengthNm the solution's wavelength there, nm (may be NaN or infinite)
     */
    public record DetectorDefect(Kind kind, double pixel, double wavelengthNm) {

        /** The kinds of defect, in the order they are looked for at each pixel. */
        public enum Kind {
            /** the wavelength is not finite, or not above 0 and below the largest allowed */
            WAVELENGTH_OUT_OF_RANGE,
            /** the solution has a covariance, but its uncertainty there is not finite or too large */
            UNCERTAINTY_OUT_OF_RANGE,
            /** the wavelength does not change from the pixel sampled before */
            STANDS_STILL,
            /** the wavelength turns back (the solution is not monotonic) */
            TURNS_BACK
        }
    }

    /**
     * Checks the solution across a whole detector: every pixel must get a finite wavelength above
     * 0 and below {@code maxWavelengthNm}, with an uncertainty in [0, maxWavelengthNm) when the
     * solution has a covariance, and the wavelength must rise or fall throughout (a dispersion
     * solution is monotonic). Checked at every pixel up to a million pixels, and at a million
     * evenly spaced ones (first and last included) beyond.
     *
     * @param pixels          the detector's pixel count, at least 2
     * @param maxWavelengthNm the largest wavelength allowed, nm
     * @return the first defect found, pixel by pixel; empty when there is none
     */
    public Optional<DetectorDefect> checkAcross(int pixels, double maxWavelengthNm) {
        if (pixels < 2) {
            throw new IllegalArgumentException("a detector needs at least 2 pixels, got " + pixels);
        }
        boolean withCovariance = hasCovariance();
        int samples = Math.min(pixels, 1_000_000);
        double step = (pixels - 1) / (double) (samples - 1);
        double previous = Double.NaN;
        int direction = 0;
        for (int k = 0; k < samples; k++) {
            double p = k == samples - 1 ? pixels - 1 : k * step;
            double nm = evaluate(p);
            if (!(nm > 0 && nm < maxWavelengthNm)) {
                return Optional.of(new DetectorDefect(DetectorDefect.Kind.WAVELENGTH_OUT_OF_RANGE, p, nm));
            }
            double sigma = wavelengthSigmaAt(p);
            if (withCovariance && !(sigma >= 0 && sigma < maxWavelengthNm)) {
                return Optional.of(new DetectorDefect(DetectorDefect.Kind.UNCERTAINTY_OUT_OF_RANGE, p, nm));
            }
            if (k > 0) {
                int sign = (int) Math.signum(nm - previous);
                if (sign == 0 || (direction != 0 && sign != direction)) {
                    return Optional.of(new DetectorDefect(sign == 0 ? DetectorDefect.Kind.STANDS_STILL
                            : DetectorDefect.Kind.TURNS_BACK, p, nm));
                }
                direction = sign;
            }
            previous = nm;
        }
        return Optional.empty();
    }

    /** @return the number of (pixel, wavelength) pairs fitted, rejected ones included */
    public int size() {
        return pixel.length;
    }

    /**
     * @param i pair index
     * @return the pair's pixel (the peak's centroid), pixels
     */
    public double pixel(int i) {
        return pixel[i];
    }

    /**
     * @param i pair index
     * @return the pair's reference wavelength in nm
     */
    public double wavelength(int i) {
        return wavelength[i];
    }

    /**
     * @param i pair index
     * @return the pair's standard uncertainty in nm used as its weight: the centroid's uncertainty
     *         times the local dispersion, combined in quadrature with the line's own
     */
    public double sigmaNm(int i) {
        return sigma[i];
    }

    /**
     * @param i pair index
     * @return reference minus fitted wavelength, nm
     */
    public double residualNm(int i) {
        return residual[i];
    }

    /**
     * @param i pair index
     * @return the residual in pixels (nm residual over the local dispersion)
     */
    public double residualPixels(int i) {
        return residual[i] / Math.abs(dispersionAt(pixel[i]));
    }

    /**
     * @param i pair index
     * @return whether clipping left the pair out of the final fit
     */
    public boolean isRejected(int i) {
        return rejected[i];
    }

    /** @return how many pairs the final fit used */
    public int usedCount() {
        int n = 0;
        for (boolean r : rejected) {
            if (!r) {
                n++;
            }
        }
        return n;
    }

    /** @return how many pairs clipping rejected */
    public int rejectedCount() {
        return pixel.length - usedCount();
    }

    /** @return root mean square of the used pairs' residuals in nm (unweighted); NaN without pairs */
    public double rmsNm() {
        double sum = 0;
        int n = 0;
        for (int i = 0; i < pixel.length; i++) {
            if (!rejected[i]) {
                sum += residual[i] * residual[i];
                n++;
            }
        }
        return n == 0 ? Double.NaN : Math.sqrt(sum / n);
    }

    /** @return root mean square of the used pairs' residuals in pixels; NaN without pairs */
    public double rmsPixels() {
        double sum = 0;
        int n = 0;
        for (int i = 0; i < pixel.length; i++) {
            if (!rejected[i]) {
                double r = residualPixels(i);
                sum += r * r;
                n++;
            }
        }
        return n == 0 ? Double.NaN : Math.sqrt(sum / n);
    }

    /** @return the weighted sum of squared residuals of the used pairs; NaN without pairs */
    public double chiSquare() {
        return chiSquare;
    }

    /** @return used pairs minus coefficients */
    public int degreesOfFreedom() {
        return degreesOfFreedom;
    }

    /** @return chi-square per degree of freedom; NaN without pairs */
    public double reducedChiSquare() {
        return degreesOfFreedom > 0 ? chiSquare / degreesOfFreedom : Double.NaN;
    }

    /**
     * Below this chance, for the residuals' runs and for the chi-square alike, the residuals are
     * taken to show structure the polynomial does not follow ({@link #residualsStructured()}).
     */
    public static final double STRUCTURE_PROBABILITY = 0.01;

    /**
     * The runs of one sign among the used pairs' residuals taken in pixel order (a run is a
     * maximal stretch of residuals of one sign; a zero residual counts as positive).
     *
     * @return the number of runs, 0 without used pairs
     */
    public int residualRuns() {
        return ResidualRuns.count(usedSignsInPixelOrder());
    }

    /**
     * The runs test of the used pairs' residuals along the detector (A. Wald and J. Wolfowitz,
     * Ann. Math. Statist. 11, 147 (1940); common practice): the exact chance that residuals of
     * these signs in random order make at most {@link #residualRuns()} runs. Residuals that follow
     * a curve the polynomial cannot (a quartic term under a cubic) come in long stretches of one
     * sign and make this small; independent ones make it small only by chance.
     *
     * @return the probability, 0 to 1; 1 when all residuals have one sign, NaN without used pairs
     */
    public double residualRunsProbability() {
        boolean[] signs = usedSignsInPixelOrder();
        if (signs.length == 0) {
            return Double.NaN;
        }
        int positive = 0;
        for (boolean s : signs) {
            positive += s ? 1 : 0;
        }
        return ResidualRuns.lowerTailProbability(positive, signs.length - positive, ResidualRuns.count(signs));
    }

    /**
     * The chance of a chi-square at least as large as the fit's for pairs that follow the
     * polynomial with their stated uncertainties, Q(dof / 2, chi^2 / 2) (the chi-square
     * distribution's upper tail; common practice).
     *
     * @return the probability, 0 to 1; NaN for an unweighted fit, without degrees of freedom, or
     *         for stored coefficients
     */
    public double lackOfFitProbability() {
        if (degreesOfFreedom <= 0 || !Double.isFinite(chiSquare) || sigma.length == 0 || Double.isNaN(sigma[0])) {
            return Double.NaN;
        }
        return org.apache.commons.numbers.gamma.RegularizedGamma.Q.value(degreesOfFreedom / 2.0, chiSquare / 2);
    }

    /**
     * The F-test of the next degree against this one on the same used pairs (common practice; P. R.
     * Bevington and D. K. Robinson, Data Reduction and Error Analysis for the Physical Sciences, 3rd
     * ed., McGraw-Hill 2003, sec. 11.4, from memory): with chi^2_d and chi^2_(d+1) the two fits'
     * (weighted) sums of squared residuals and nu = n - d - 2 the next degree's degrees of freedom,
     * F = (chi^2_d - chi^2_(d+1)) / (chi^2_(d+1) / nu), and the chance of an F at least that large
     * when the extra term is zero is P(F(1, nu) &gt;= F) = I_(nu / (nu + F))(nu / 2, 1 / 2) (the
     * regularized incomplete beta function). Free of the overall scale of the stated uncertainties,
     * as the automatic choice's criterion is.
     *
     * @return the probability, 0 to 1; NaN when the pairs do not determine the next degree with a
     *         degree of freedom to spare, and for stored coefficients
     */
    public double nextDegreeProbability() {
        return nextDegreeProbability;
    }

    /**
     * The chance P(F(1, nu) &gt;= f) of the F distribution with 1 and nu degrees of freedom
     * (see {@link #nextDegreeProbability()}); 1 for f &lt;= 0.
     */
    static double fTestProbability(double f, int nu) {
        if (!(f > 0)) {
            return 1;
        }
        if (Double.isInfinite(f)) {
            return 0;
        }
        return org.apache.commons.numbers.gamma.RegularizedBeta.value(nu / (nu + f), nu / 2.0, 0.5);
    }

    /**
     * Whether the residuals show structure along the detector that the polynomial does not
     * follow: the next degree fits significantly better ({@link #nextDegreeProbability()} below
     * {@value #STRUCTURE_PROBABILITY}), or, for structure no single extra term takes up, both the
     * runs test ({@link #residualRunsProbability()}) and the chi-square
     * ({@link #lackOfFitProbability()}) fall below it. The stated
     * uncertainty is then widened by one factor, the Birge ratio, which cannot follow residuals
     * that are large in some stretches and small in others: between the lines the true error
     * can exceed it several times. (A Birge-scaled chi-square above 1 with residuals of random
     * signs, centroid uncertainties that are simply too small, is not structure.) A quartic
     * dispersion term of 0.18 nm at the last of 2048 pixels fitted by a cubic through 19 neon
     * lines had a reduced chi-square of about 1.9 and true errors of 2.3 stated uncertainties RMS,
     * up to 5.2 (refdata's QuarticDispersionTest).
     *
     * @return whether the residuals are structured; false for an unweighted fit or stored
     *         coefficients
     */
    public boolean residualsStructured() {
        return nextDegreeProbability < STRUCTURE_PROBABILITY || lackOfFitProbability() < STRUCTURE_PROBABILITY
                && residualRunsProbability() < STRUCTURE_PROBABILITY;
    }

    private boolean[] usedSignsInPixelOrder() {
        Integer[] order = new Integer[pixel.length];
        int m = 0;
        for (int i = 0; i < pixel.length; i++) {
            if (!rejected[i]) {
                order[m++] = i;
            }
        }
        Integer[] used = java.util.Arrays.copyOf(order, m);
        java.util.Arrays.sort(used, (a, b) -> Double.compare(pixel[a], pixel[b]));
        boolean[] signs = new boolean[m];
        for (int j = 0; j < m; j++) {
            signs[j] = residual[used[j]] >= 0;
        }
        return signs;
    }

    /**
     * @param degree a polynomial degree
     * @return the corrected Akaike information criterion of that degree on the final pairs, when
     *         the degree was chosen automatically and this degree was tried; NaN otherwise
     */
    public double aicc(int degree) {
        return degree >= 0 && degree < criterion.length ? criterion[degree] : Double.NaN;
    }
}
