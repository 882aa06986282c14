package org.ritzwerk.engine.ritz;

import org.ritzwerk.RitzwerkException;

/**
 * Input that a Ritz computation, a level optimisation or a series fit refuses, with what was wrong
 * and where in the message; {@link #code()} tells the kind.
 */
public final class RitzException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** Code: a level covariance that is not square, symmetric or of the levels' size. */
    public static final String BAD_COVARIANCE = "ritz.bad-covariance";
    /** Code: a line assigned to a level that the problem does not know, or to one level twice. */
    public static final String BAD_ASSIGNMENT = "ritz.bad-assignment";
    /** Code: levels that no chain of lines connects to the fixed reference level. */
    public static final String UNCONNECTED = "ritz.unconnected";
    /**
     * Code: a connected level system whose least-squares problem is numerically singular (the lines'
     * uncertainties span too many orders of magnitude).
     */
    public static final String SINGULAR = "ritz.singular";
    /**
     * Code: a system reference ({@link LevelOptimizer#withSeparateSystems}) that is not a level of any line,
     * lies in the system of the problem's reference, or shares its system with another.
     */
    public static final String BAD_REFERENCE = "ritz.bad-reference";
    /** Code: too few points (or members) for the parameters asked. */
    public static final String TOO_FEW = "ritz.too-few";
    /** Code: a fit that did not converge. */
    public static final String NO_CONVERGENCE = "ritz.no-convergence";
    /** Code: a value out of its range (a wavenumber, uncertainty, n, energy). */
    public static final String BAD_VALUE = "ritz.bad-value";

    /**
     * @param code    one of the codes above
     * @param message what was wrong and where
     */
    public RitzException(String code, String message) {
        super(code, message);
    }
}
