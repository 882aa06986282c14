package org.ritzwerk.atom;

import org.ritzwerk.RitzwerkException;

/**
 * Text that does not name a state {@code n l j}, with the input and the reason; thrown by
 * {@link State#parse(String)}, as {@link SpeciesParseException} is by {@link Species#parse(String)}.
 */
public final class StateParseException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: the text does not have the form n, the letter of l, j (e.g. {@code 5s1/2}). */
    public static final String MALFORMED = "state.malformed";
    /** Code: the form is right but the quantum numbers are impossible (l &gt;= n, j not l +- 1/2). */
    public static final String IMPOSSIBLE = "state.impossible";

    /**
     * @param code   one of the codes above
     * @param input  the text that was read
     * @param reason what is wrong
     */
    public StateParseException(String code, String input, String reason) {
        super(code, "cannot read state \"" + input + "\": " + reason);
    }
}
