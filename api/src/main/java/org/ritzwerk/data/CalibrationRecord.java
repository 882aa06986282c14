package org.ritzwerk.data;

import java.util.List;
import java.util.Objects;

/**
 * A saved wavelength calibration, as a calibration file ({@code ritzwerk-calibration}) holds it:
 * the detector's pixel count, a free-text description, the {@link DispersionPolynomial}, and the
 * record of how it was made (the fit's quality figures, the fitted pairs and the pairs left out
 * because their peaks saturated). Plain data: a user reads one without the engine; the engine's
 * {@code DispersionSolution.of(DispersionPolynomial)} evaluates the polynomial.
 *
 * <p>Figures that follow from the others are methods, not components: {@link #degree()},
 * {@link #linesUsed()}, {@link #linesRejected()} and {@link DispersionPolynomial#powerCoefficients()}.
 *
 * <p><b>Units.</b> Pixels 0-based (pixel i centred at i); wavelengths in nm in the polynomial's
 * medium. Immutable and thread-safe.
 *
 * @param description      free text: what the calibration came from; not null
 * @param pixels           the detector's pixel count it was made for; at least 2
 * @param polynomial       the pixel-to-wavelength polynomial; its valid range lies on the detector
 *                         (pixels -0.5 to {@code pixels} - 0.5) and, when some line is used,
 *                         within the pixels of the used lines (the fitted range)
 * @param rmsNm            root mean square of the used pairs' residuals, nm; NaN when not known
 * @param rmsPixels        the same in pixels; NaN when not known
 * @param reducedChiSquare the fit's chi-square per degree of freedom; NaN when not known
 * @param lines            the fitted pairs, rejected ones included; empty for stored coefficients
 * @param saturatedLines   pairs left out of the fit because their peaks saturated
 */
public record CalibrationRecord(String description, int pixels, DispersionPolynomial polynomial, double rmsNm,
        double rmsPixels, double reducedChiSquare, List<FittedLine> lines, List<SaturatedLine> saturatedLines) {

    /**
     * Validates and copies.
     *
     * @param description      free text: what the calibration came from; not null
     * @param pixels           the detector's pixel count it was made for; at least 2
     * @param polynomial       the pixel-to-wavelength polynomial; its valid range on the detector and
     *                         within the used lines' pixels
     * @param rmsNm            root mean square of the used pairs' residuals, nm; NaN when not known
     * @param rmsPixels        the same in pixels; NaN when not known
     * @param reducedChiSquare the fit's chi-square per degree of freedom; NaN when not known
     * @param lines            the fitted pairs, rejected ones included; empty for stored coefficients
     * @param saturatedLines   pairs left out of the fit because their peaks saturated
     * @throws IllegalArgumentException naming the first unusable component
     */
    public CalibrationRecord {
        Objects.requireNonNull(description, "description");
        Objects.requireNonNull(polynomial, "polynomial");
        if (pixels < 2) {
            throw new IllegalArgumentException("a detector needs at least 2 pixels, got " + pixels);
        }
        notInfinite("rms_nm", rmsNm);
        notInfinite("rms_pixels", rmsPixels);
        notInfinite("reduced chi-square", reducedChiSquare);
        lines = List.copyOf(lines);
        saturatedLines = List.copyOf(saturatedLines);
        if (polynomial.lowestPixel() < -0.5 || polynomial.highestPixel() > pixels - 0.5) {
            throw new IllegalArgumentException("the valid range, pixels " + polynomial.lowestPixel() + " to "
                    + polynomial.highestPixel() + ", reaches beyond the detector of " + pixels + " pixels (-0.5 to "
                    + (pixels - 0.5) + ")");
        }
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (FittedLine line : lines) {
            if (line.used()) {
                lo = Math.min(lo, line.pixel());
                hi = Math.max(hi, line.pixel());
            }
        }
        if (lo <= hi && (polynomial.lowestPixel() < lo - 1e-9 * (1 + Math.abs(lo))
                || polynomial.highestPixel() > hi + 1e-9 * (1 + Math.abs(hi)))) {
            throw new IllegalArgumentException("the valid range, pixels " + polynomial.lowestPixel() + " to "
                    + polynomial.highestPixel() + ", reaches beyond the used lines, pixels " + lo + " to " + hi
                    + ": beyond them the wavelengths are extrapolated");
        }
    }

    /**
     * A calibration of stored coefficients alone: no quality figures, no pairs.
     *
     * @param description free text; not null
     * @param pixels      the detector's pixel count; at least 2
     * @param polynomial  the polynomial
     * @return the record
     */
    public static CalibrationRecord of(String description, int pixels, DispersionPolynomial polynomial) {
        return new CalibrationRecord(description, pixels, polynomial, Double.NaN, Double.NaN, Double.NaN, List.of(),
                List.of());
    }

    private static void notInfinite(String name, double value) {
        if (Double.isInfinite(value) || value < 0) {
            throw new IllegalArgumentException(name + " must be a finite number >= 0 or NaN (not known), got " + value);
        }
    }

    /** @return the polynomial degree */
    public int degree() {
        return polynomial.degree();
    }

    /** @return how many fitted pairs the final fit used */
    public int linesUsed() {
        int n = 0;
        for (FittedLine line : lines) {
            if (line.used()) {
                n++;
            }
        }
        return n;
    }

    /** @return how many fitted pairs clipping rejected */
    public int linesRejected() {
        return lines.size() - linesUsed();
    }

    /**
     * One fitted (pixel, wavelength) pair.
     *
     * @param pixel          the peak's centroid, pixels; finite
     * @param wavelengthNm   the reference line's wavelength, nm; finite
     * @param sigmaNm        the pair's standard uncertainty used as its weight, nm; positive, or
     *                       NaN when not known
     * @param residualNm     reference minus fitted wavelength, nm; finite
     * @param residualPixels the residual in pixels; finite
     * @param used           whether the final fit used the pair (false: clipping rejected it)
     * @param line           the line's label; not null
     * @param flag           a note on the pair, empty when none; {@value #BLEND} when its peak looks
     *                       like an unresolved blend and its uncertainty was widened for that,
     *                       {@value #SATURATED} when it saturated and was kept in the fit; not null
     */
    public record FittedLine(double pixel, double wavelengthNm, double sigmaNm, double residualNm,
            double residualPixels, boolean used, String line, String flag) {

        /** The flag of a pair whose peak looks like an unresolved blend (its uncertainty widened). */
        public static final String BLEND = "blend";

        /**
         * The flag of a pair whose peak saturated but which was kept in the fit (without the
         * saturated pairs too few would remain for the degree); its centroid comes from the wings.
         */
        public static final String SATURATED = "saturated";

        /**
         * A pair with no flag.
         *
         * @param pixel          the peak's centroid, pixels; finite
         * @param wavelengthNm   the reference line's wavelength, nm; finite
         * @param sigmaNm        the pair's standard uncertainty used as its weight, nm; positive, or
         *                       NaN when not known
         * @param residualNm     reference minus fitted wavelength, nm; finite
         * @param residualPixels the residual in pixels; finite
         * @param used           whether the final fit used the pair (false: clipping rejected it)
         * @param line           the line's label; not null
         */
        public FittedLine(double pixel, double wavelengthNm, double sigmaNm, double residualNm,
                double residualPixels, boolean used, String line) {
            this(pixel, wavelengthNm, sigmaNm, residualNm, residualPixels, used, line, "");
        }

        /**
         * Validates.
         *
         * @param pixel          the peak's centroid, pixels; finite
         * @param wavelengthNm   the reference line's wavelength, nm; finite
         * @param sigmaNm        the pair's standard uncertainty used as its weight, nm; positive, or
         *                       NaN when not known
         * @param residualNm     reference minus fitted wavelength, nm; finite
         * @param residualPixels the residual in pixels; finite
         * @param used           whether the final fit used the pair (false: clipping rejected it)
         * @param line           the line's label; not null
         * @param flag           a note on the pair, empty when none; not null
         */
        public FittedLine {
            Objects.requireNonNull(line, "line");
            Objects.requireNonNull(flag, "flag");
            finite("pixel", pixel);
            finite("wavelength_nm", wavelengthNm);
            if (!Double.isNaN(sigmaNm) && !(sigmaNm >= 0 && sigmaNm < Double.POSITIVE_INFINITY)) {
                throw new IllegalArgumentException("sigma_nm of line '" + line + "' must be finite and >= 0 or NaN"
                        + " (not known), got " + sigmaNm);
            }
            finite("residual_nm", residualNm);
            finite("residual_pixels", residualPixels);
        }

        private static void finite(String name, double value) {
            if (!Double.isFinite(value)) {
                throw new IllegalArgumentException(name + " of a fitted line must be finite, got " + value);
            }
        }
    }

    /**
     * A pair whose peak reached the detector's saturation level: paired with its line but left out
     * of the fit.
     *
     * @param pixel        the peak's centroid, pixels; finite
     * @param wavelengthNm the line's wavelength, nm, in the polynomial's medium; finite
     * @param line         the line's label; not null
     */
    public record SaturatedLine(double pixel, double wavelengthNm, String line) {

        /**
         * Validates.
         *
         * @param pixel        the peak's centroid, pixels; finite
         * @param wavelengthNm the line's wavelength, nm, in the polynomial's medium; finite
         * @param line         the line's label; not null
         */
        public SaturatedLine {
            Objects.requireNonNull(line, "line");
            if (!Double.isFinite(pixel) || !Double.isFinite(wavelengthNm)) {
                throw new IllegalArgumentException("a saturated line needs a finite pixel and wavelength, got " + pixel
                        + " px, " + wavelengthNm + " nm");
            }
        }
    }
}
