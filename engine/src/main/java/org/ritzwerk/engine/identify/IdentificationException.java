package org.ritzwerk.engine.identify;

import org.ritzwerk.RitzwerkException;

/**
 * An identification that cannot be made from what it was given (bad input, not a bug): its
 * {@link #code() code} tells why, so a caller can react without reading the message. Plain
 * precondition violations (arrays of different lengths, a negative width) are
 * {@link IllegalArgumentException}s instead.
 */
public final class IdentificationException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: a tolerance's text cannot be read, or its value is not finite and positive. */
    public static final String BAD_TOLERANCE = "identify.bad-tolerance";
    /** Code: no candidate line lies in the range of the peaks. */
    public static final String NO_CANDIDATES = "identify.no-candidates";
    /** Code: a k-sigma tolerance meets peaks and lines without uncertainties, so no window is open. */
    public static final String NO_WINDOW = "identify.no-window";
    /** Code: no peak lies within the shift search's range of any line. */
    public static final String NO_PAIRS = "identify.no-pairs";
    /** Code: two peaks lie at the same position (a peak list holds each peak once). */
    public static final String REPEATED_PEAK = "identify.repeated-peak";

    /**
     * @param code    one of the codes above
     * @param message what failed, with the figures
     */
    public IdentificationException(String code, String message) {
        super(code, message);
    }

    /**
     * @param code    one of the codes above
     * @param message what failed, with the figures
     * @param cause   the underlying refusal
     */
    public IdentificationException(String code, String message, Throwable cause) {
        super(code, message, cause);
    }
}
