package org.ritzwerk.engine.synth;

import java.util.Optional;
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

    /** @serial the lines on the grid and why each carries no light, for {@link #NO_LIGHT}; else null */
    private final DarkLines darkLines;

    /**
     * @param code    one of the codes above
     * @param message what failed, with the figures
     */
    public SceneException(String code, String message) {
        this(code, message, null);
    }

    /**
     * @param code      one of the codes above
     * @param message   what failed, with the figures
     * @param darkLines for {@link #NO_LIGHT}: the lines on the grid (every one of them dark, since
     *                  none gives light) with their causes; null otherwise
     */
    public SceneException(String code, String message, DarkLines darkLines) {
        super(code, message);
        this.darkLines = darkLines;
    }

    /**
     * @return for {@link #NO_LIGHT} from {@link Scene#render}: the lines whose centre lies on the
     *         grid, every one dark, each with its {@link DarkLines.Cause} (none when no line lies
     *         there at all, {@link DarkLines#onGrid()} 0); empty otherwise
     */
    public Optional<DarkLines> darkLines() {
        return Optional.ofNullable(darkLines);
    }
}
