package org.ritzwerk.refdata;

import org.ritzwerk.RitzwerkException;

/** A request the reference data cannot answer, or a built-in data file that is broken. */
public final class ReferenceDataException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: the isotope asked for is not in the data set. */
    public static final String UNKNOWN_ISOTOPE = "refdata.unknown-isotope";
    /** Code: no provider offers a data set with that id. */
    public static final String UNKNOWN_DATA_SET = "refdata.unknown-data-set";
    /**
     * Code: a name that looks like a file (a folder in it, or a file extension) is neither an
     * existing file nor a data set's id.
     */
    public static final String NO_SUCH_FILE = "refdata.no-such-file";
    /** Code: a provider failed to list or load its data. */
    public static final String PROVIDER_FAILED = "refdata.provider-failed";
    /** Code: a data set was asked for as a kind it is not (a level table where a line list is needed). */
    public static final String WRONG_KIND = "refdata.wrong-kind";
    /** Code: a built-in data file does not read (a packaging bug). */
    public static final String BAD_BUILT_IN = "refdata.bad-built-in";
    /**
     * Code: a species' data cannot give what was asked because a quantity is missing, such as a
     * level list without transition probabilities where lines must be ranked or rendered.
     */
    public static final String MISSING_QUANTITY = "refdata.missing-quantity";
    /**
     * Code: a data set's rows contradict themselves or each other, such as a level whose label
     * names another J than its J column.
     */
    public static final String INCONSISTENT = "refdata.inconsistent";
    /** Code: a data set holds something its file format cannot hold, so it is not written. */
    public static final String NOT_WRITABLE = "refdata.not-writable";

    /**
     * @param code    one of the codes above
     * @param message what was asked and what the data set has instead
     */
    public ReferenceDataException(String code, String message) {
        super(code, message);
    }
}
