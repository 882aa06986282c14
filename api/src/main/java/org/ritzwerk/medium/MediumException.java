package org.ritzwerk.medium;

import org.ritzwerk.RitzwerkException;

/**
 * A medium or air-model failure: an unknown model, a condition outside a model's range, or a
 * wavelength outside the range in which a model is valid.
 */
public final class MediumException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: the air-model text names no known model. */
    public static final String UNKNOWN_MODEL = "medium.unknown-air-model";
    /** Code: a condition (temperature, pressure, ...) is missing, unreadable or out of range. */
    public static final String BAD_CONDITION = "medium.bad-condition";
    /** Code: a wavelength lies outside the air model's validity range. */
    public static final String OUTSIDE_VALIDITY = "medium.outside-validity";

    /**
     * @param code    one of the codes above
     * @param message message naming the value, unit and allowed range
     */
    public MediumException(String code, String message) {
        super(code, message);
    }
}
