package org.ritzwerk.engine.rydberg;

import org.ritzwerk.RitzwerkException;

/** A state the model refuses to give a value for, with the reason in the message. */
public final class RydbergException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: the level lies below a series' validity and has no measured energy. */
    public static final String NO_LEVEL = "rydberg.no-level";
    /** Code: the state does not exist in this atom (its orbital is filled by the core). */
    public static final String NO_SUCH_STATE = "rydberg.no-such-state";
    /** Code: the two states are not connected by an electric-dipole transition. */
    public static final String NOT_DIPOLE = "rydberg.not-dipole";

    /**
     * @param code    one of the codes above
     * @param message what was asked and why it is refused
     */
    public RydbergException(String code, String message) {
        super(code, message);
    }
}
