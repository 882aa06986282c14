package org.ritzwerk.engine.hyperfine;

import org.ritzwerk.engine.hydrogenic.Notation;

/**
 * The largest component of a hyperfine-Zeeman eigenstate in the uncoupled basis |J m_J m_I>, and its
 * weight: the label that stays meaningful at high field (the hyperfine Paschen-Back regime), where F is
 * no longer a good quantum number and each state tends to one |m_J m_I>. At zero field the weights of
 * a state |F m_F> are the squared Clebsch-Gordan coefficients {@code <J m_J I m_I|F m_F>^2} (common
 * practice). Immutable and thread-safe.
 *
 * <p>Ties (equal weights within 1e-9, as at zero field for some |F m_F>, e.g. Rb-87 5s F = 1, m_F = 0)
 * go to the basis state listed first: J ascending, then m_J ascending, then m_I ascending.
 *
 * @param twoJ   2 J of the basis state (the level's own J, except for a p term diagonalised as a whole
 *               ({@link ZeemanStructure#termComponents}), where it may be the partner level's at very high field)
 * @param twoMJ  2 m_J
 * @param twoMI  2 m_I
 * @param weight the squared amplitude of that basis state in the eigenstate, 0 to 1
 */
public record UncoupledLabel(int twoJ, int twoMJ, int twoMI, double weight) {

    /** Weights closer than this count as equal when choosing the largest. */
    static final double TIE = 1e-9;

    /** @return m_J as text: {@code 1/2} or {@code -3/2} */
    public String mJLabel() {
        return Notation.half(twoMJ);
    }

    /** @return m_I as text: {@code 3/2} or {@code -1} */
    public String mILabel() {
        return Notation.half(twoMI);
    }
}
