package org.ritzwerk.engine.rydberg;

import java.util.Objects;
import org.ritzwerk.atom.State;

/**
 * A published reduced electric-dipole matrix element between two low-lying states, which an atom
 * built with {@link AlkaliAtom#withPublishedDipoles(java.util.List)} uses instead of its computed
 * one for exactly this pair of states.
 *
 * <p>Convention: the magnitude {@code |<lower||r||upper>|} in Bohr radii a0 (the reduced element in
 * units of e a0), in the convention of {@link AlkaliAtom}'s class comment (A. R. Edmonds (1957)),
 * which is symmetric up to sign; the element carries the sign of the computed one. Immutable and
 * thread-safe.
 *
 * @param lower          the lower state
 * @param upper          the upper state, with l differing by one from the lower state's
 * @param reducedBohr    {@code |<lower||r||upper>|}, a0; finite and positive
 * @param uncertaintyBohr its standard uncertainty, a0; finite, not negative (0 when not given)
 * @param source         where the value comes from (publication, and how it was obtained)
 */
public record PublishedDipole(State lower, State upper, double reducedBohr, double uncertaintyBohr, String source) {

    /**
     * Validates the components.
     *
     * @param lower           the lower state
     * @param upper           the upper state
     * @param reducedBohr     the magnitude of the reduced element, a0
     * @param uncertaintyBohr its standard uncertainty, a0
     * @param source          its source
     * @throws IllegalArgumentException when l does not change by one, j's do not couple, or a
     *                                  number is not finite and positive (not negative for the
     *                                  uncertainty)
     */
    public PublishedDipole {
        Objects.requireNonNull(lower, "lower");
        Objects.requireNonNull(upper, "upper");
        Objects.requireNonNull(source, "source");
        if (Math.abs(lower.l() - upper.l()) != 1 || Math.abs(lower.twoJ() - upper.twoJ()) > 2) {
            throw new IllegalArgumentException(lower.label() + " - " + upper.label()
                    + " is not an electric-dipole pair (l must change by one, j by at most one)");
        }
        if (!(reducedBohr > 0) || Double.isInfinite(reducedBohr)) {
            throw new IllegalArgumentException("reduced dipole element of " + lower.label() + " - " + upper.label()
                    + " must be finite and > 0 a0, got " + reducedBohr);
        }
        if (!(uncertaintyBohr >= 0) || Double.isInfinite(uncertaintyBohr)) {
            throw new IllegalArgumentException("uncertainty of " + lower.label() + " - " + upper.label()
                    + " must be finite and >= 0 a0, got " + uncertaintyBohr);
        }
    }

    /**
     * @param a a state
     * @param b another state
     * @return whether this element is the one between a and b (in either order)
     */
    public boolean connects(State a, State b) {
        return lower.equals(a) && upper.equals(b) || lower.equals(b) && upper.equals(a);
    }
}
