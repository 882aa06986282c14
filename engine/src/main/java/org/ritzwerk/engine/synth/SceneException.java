package org.ritzwerk.engine.synth;

import org.ritzwerk.RitzwerkException;

/**
 * A scene that cannot be rendered from what it was given: its {@link #code() code} tells why, so
 * a caller can react without reading the message. Plain precondition violations (a negative
 * temperature, arrays of different lengths) are {@link IllegalArgumentException}s instead.
 */
public final class SceneException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: no line puts light into the grid and there is no continuum. */
    public static final String NO_LIGHT = "synth.no-light";
    /** Code: the continuum given is zero at every pixel of the grid. */
    public static final String DARK_CONTINUUM = "synth.dark-continuum";
    /** Code: a species' lines carry no transition probability, so they give no light to render. */
    public static final String NO_RATES = "synth.no-rates";

    /**
     * @param code    one of the codes above
     * @param message what failed, with the figures
     */
    public SceneException(String code, String message) {
        super(code, message);
    }
}
