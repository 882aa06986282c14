package org.ritzwerk.engine.calibrate;

import org.ritzwerk.RitzwerkException;

/**
 * A wavelength calibration that cannot be made from the data given: too few peaks or lines, no
 * solution within the stated prior, or a lamp line list that does not explain the spectrum. The
 * {@link #code() code} tells which; the message gives the figures (counts, ranges, inlier
 * fractions) and, where the search found one, the solution that lies outside the prior.
 *
 * <p>Plain precondition violations (NaN counts, arrays of different lengths) are reported with
 * {@link IllegalArgumentException} instead.
 */
public final class CalibrationException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: fewer peaks than a solution needs (at least 4; 3 for a three-line lamp). */
    public static final String TOO_FEW_PEAKS = "calibrate.too-few-peaks";
    /** Code: fewer lamp lines within the prior's wavelength range than a solution needs (at least 3). */
    public static final String TOO_FEW_LINES = "calibrate.too-few-lines";
    /** Code: the best pairing matched fewer than 4 peaks to lines. */
    public static final String TOO_FEW_MATCHES = "calibrate.too-few-matches";
    /** Code: no solution within the prior; a solution outside it explains the peaks (named in the message). */
    public static final String OUTSIDE_PRIOR = "calibrate.outside-prior";
    /** Code: no solution, within the prior or outside it, explains enough of the strongest peaks. */
    public static final String LAMP_MISMATCH = "calibrate.lamp-mismatch";
    /**
     * Code: the fitted solution is not plausible: its wavelength does not run one way across the
     * detector, or its reduced chi-square is above the accepted limit (figures in the message).
     */
    public static final String IMPLAUSIBLE_FIT = "calibrate.implausible-fit";
    /**
     * Code: the solution's stated standard uncertainty exceeds the required precision somewhere
     * between its first and last fitted line ({@link Calibrator#withRequiredPrecision}).
     */
    public static final String IMPRECISE = "calibrate.imprecise";
    /**
     * Code: an outermost fitted line is checked by no other pair (too few remain for the degree
     * without it), and solutions resting on such a pairing were not accepted
     * ({@link Calibrator#withUncheckedEndsAccepted}).
     */
    public static final String UNCHECKED_END = "calibrate.unchecked-end";
    /**
     * Code: the counts cannot be searched for peaks: too few pixels, every pixel the same or
     * saturated, or negative counts where none are allowed.
     */
    public static final String UNUSABLE_COUNTS = "calibrate.unusable-counts";

    /**
     * @param code    one of the codes above
     * @param message what failed, with the figures
     */
    public CalibrationException(String code, String message) {
        super(code, message);
    }

    /**
     * @param code    one of the codes above
     * @param message what failed, with the figures
     * @param cause   the underlying failure
     */
    public CalibrationException(String code, String message, Throwable cause) {
        super(code, message, cause);
    }
}
