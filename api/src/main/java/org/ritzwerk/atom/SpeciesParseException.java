package org.ritzwerk.atom;

import org.ritzwerk.RitzwerkException;

/** Text that does not name a species, with the input and the reason. */
public final class SpeciesParseException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: the text does not have the form of a species. */
    public static final String MALFORMED = "species.malformed";
    /** Code: the element symbol is not known. */
    public static final String UNKNOWN_ELEMENT = "species.unknown-element";
    /** Code: the mass number cannot belong to the element. */
    public static final String IMPOSSIBLE_ISOTOPE = "species.impossible-isotope";
    /** Code: the charge leaves no electron, or is negative. */
    public static final String IMPOSSIBLE_CHARGE = "species.impossible-charge";

    /**
     * @param code   one of the codes above
     * @param input  the text that was read
     * @param reason what is wrong
     */
    public SpeciesParseException(String code, String input, String reason) {
        super(code, "cannot read species \"" + input + "\": " + reason);
    }
}
