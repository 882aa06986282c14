package org.ritzwerk.quantity;

import org.ritzwerk.RitzwerkException;

/** A conversion that has no answer, e.g. a non-positive energy to a wavelength. */
public final class ConversionException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: a zero or negative wavenumber or energy was converted to a photon quantity. */
    public static final String NOT_A_PHOTON = "quantity.not-a-photon";
    /** Code: the two kinds do not convert into each other (e.g. a temperature to a wavelength). */
    public static final String INCOMPATIBLE = "quantity.incompatible-kinds";
    /** Code: a converted standard uncertainty is too large for a double (it would be infinite). */
    public static final String UNCERTAINTY_OVERFLOW = "quantity.uncertainty-overflow";

    /**
     * @param code    one of the codes above
     * @param message what was converted to what, and why it cannot be
     */
    public ConversionException(String code, String message) {
        super(code, message);
    }
}
