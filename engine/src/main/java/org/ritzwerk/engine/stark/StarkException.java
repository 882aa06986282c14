package org.ritzwerk.engine.stark;

import org.ritzwerk.RitzwerkException;

/**
 * A field calculation that cannot be done as asked, with the reason and the figures in the
 * message; the {@link #code() code} tells which. Plain precondition violations (NaN fields, a
 * negative range) are reported with {@link IllegalArgumentException} instead.
 */
public final class StarkException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /**
     * Code: a dipole-coupled state has the same energy as the state asked for, so second-order
     * perturbation theory does not hold (diagonalise instead: {@link StarkMap}).
     */
    public static final String DEGENERATE = "stark.degenerate";
    /** Code: a basis that holds no state, or not the state asked for. */
    public static final String BAD_BASIS = "stark.bad-basis";
    /** Code: the transition asked for has no dipole element for the polarisation and projections given. */
    public static final String NO_COUPLING = "stark.no-coupling";

    /**
     * @param code    one of the codes above
     * @param message what failed, with the figures
     */
    public StarkException(String code, String message) {
        super(code, message);
    }
}
