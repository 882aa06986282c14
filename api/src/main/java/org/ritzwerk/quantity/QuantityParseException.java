package org.ritzwerk.quantity;

import org.ritzwerk.RitzwerkException;

/**
 * Text that does not read as a quantity. The message quotes the input, names the 1-based column
 * and says what was expected there.
 */
public final class QuantityParseException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: the input is empty or blank. */
    public static final String EMPTY = "quantity.empty";
    /** Code: no number where the value should start. */
    public static final String NO_NUMBER = "quantity.no-number";
    /** Code: NaN, infinity, or a number too large (or, not zero, too small) for a double in SI units. */
    public static final String NOT_FINITE = "quantity.not-finite";
    /** Code: a negative value. */
    public static final String NEGATIVE = "quantity.negative";
    /** Code: zero where only positive values make sense (wavelength, frequency). */
    public static final String NOT_POSITIVE = "quantity.not-positive";
    /** Code: the number has no unit after it. */
    public static final String MISSING_UNIT = "quantity.missing-unit";
    /** Code: the unit is not one Ritzwerk knows. */
    public static final String UNKNOWN_UNIT = "quantity.unknown-unit";
    /** Code: a medium after a unit that is not a wavelength unit. */
    public static final String MEDIUM_NOT_ALLOWED = "quantity.medium-not-allowed";
    /** Code: the medium is neither vacuum nor a known air model. */
    public static final String UNKNOWN_MEDIUM = "quantity.unknown-medium";
    /** Code: the uncertainty is missing, unreadable, negative or given twice. */
    public static final String BAD_UNCERTAINTY = "quantity.bad-uncertainty";
    /** Code: text left over after the quantity. */
    public static final String TRAILING_TEXT = "quantity.trailing-text";
    /** Code: the quantity is of another kind than the caller asked for. */
    public static final String WRONG_KIND = "quantity.wrong-kind";

    /** The whole text that was read. */
    private final String input;
    /** The 1-based column where the problem starts. */
    private final int column;

    /**
     * @param code   one of the codes above
     * @param input  the whole text that was read
     * @param column 1-based column where the problem starts
     * @param reason what is wrong there
     */
    public QuantityParseException(String code, String input, int column, String reason) {
        super(code, "cannot read \"" + input + "\" (column " + column + "): " + reason);
        this.input = input;
        this.column = column;
    }

    /** @return the text that was read */
    public String input() {
        return input;
    }

    /** @return the 1-based column where the problem starts */
    public int column() {
        return column;
    }
}
