package org.ritzwerk.engine.pair;

import java.util.Arrays;
import java.util.List;
import java.util.Objects;

/**
 * The van der Waals interaction of a pair state within its degenerate manifold: the C6 matrix
 * {@code C6_AB = - sum_k <A|R^3 V|k><k|R^3 V|B> / Delta_k} over the pair states A, B of the same two
 * levels (every m_j, both orderings, the same {@code M = m1 + m2} at theta = 0) and its eigenvalues,
 * the C6 coefficients of the potentials that connect to the manifold at large R (second-order
 * perturbation theory in the degenerate Zeeman manifold: T. G. Walker and M. Saffman, Phys. Rev. A
 * 77, 032723 (2008), from memory). The C6 of {@link PairInteractions#c6} is the pair state's diagonal
 * element {@code sum_i share_i C6_i}; where the pair state is not an eigenvector it splits into
 * several potentials. Immutable: the accessors return copies.
 *
 * @param pair        the pair state asked
 * @param states      the pair states of the manifold, the asked one among them
 * @param c6Au        the eigenvalues of the C6 matrix, ascending, E_h a0^6
 * @param shares      the asked pair state's share {@code |<v_i|pair>|^2} in each eigenvector, summing to 1
 * @param diagonalAu  the asked pair state's diagonal element, E_h a0^6 (the C6 of {@link PairInteractions#c6})
 */
public record DispersionManifold(PairState pair, List<PairState> states, double[] c6Au, double[] shares,
        double diagonalAu) {

    /** The relative spread below which the pair state counts as an eigenvector ({@link #isEigenstate}). */
    public static final double EIGENSTATE_TOLERANCE = 1e-6;

    /**
     * Validates and copies the components.
     *
     * @param pair       the pair state
     * @param states     the manifold, at least the pair state
     * @param c6Au       the eigenvalues, one per state, finite
     * @param shares     the pair state's shares, one per eigenvalue
     * @param diagonalAu the diagonal element, finite
     */
    public DispersionManifold {
        Objects.requireNonNull(pair, "pair");
        states = List.copyOf(states);
        c6Au = c6Au.clone();
        shares = shares.clone();
        if (c6Au.length != states.size() || shares.length != states.size() || !states.contains(pair)) {
            throw new IllegalArgumentException("a manifold needs one eigenvalue and one share per state, the pair "
                    + pair.label() + " among them; got " + states.size() + " states, " + c6Au.length
                    + " eigenvalues, " + shares.length + " shares");
        }
    }

    /** @return the eigenvalues of the C6 matrix, ascending, E_h a0^6 (a copy) */
    @Override
    public double[] c6Au() {
        return c6Au.clone();
    }

    /** @return the pair state's share in each eigenvector, in the order of {@link #c6Au()} (a copy) */
    @Override
    public double[] shares() {
        return shares.clone();
    }

    /** @return the eigenvalues over h, GHz um^6, ascending */
    public double[] c6GHzUm6() {
        return Arrays.stream(c6Au).map(c -> c * DispersionCoefficient.AU_HZ_M6 * 1e36 / 1e9).toArray();
    }

    /**
     * @return the share-weighted spread of the eigenvalues about the diagonal element,
     *         {@code sqrt(sum_i share_i (C6_i - C6_diag)^2)}, E_h a0^6: 0 for an eigenstate
     */
    public double spreadAu() {
        double v = 0;
        for (int i = 0; i < c6Au.length; i++) {
            v += shares[i] * (c6Au[i] - diagonalAu) * (c6Au[i] - diagonalAu);
        }
        return Math.sqrt(v);
    }

    /**
     * @return true when the pair state is an eigenvector of the C6 matrix (its spread at most
     *         {@link #EIGENSTATE_TOLERANCE} of the largest |eigenvalue|), so its C6 is one potential's;
     *         false when it splits into several
     */
    public boolean isEigenstate() {
        double largest = 0;
        for (double c : c6Au) {
            largest = Math.max(largest, Math.abs(c));
        }
        return spreadAu() <= EIGENSTATE_TOLERANCE * largest;
    }

    @Override
    public boolean equals(Object other) {
        return other instanceof DispersionManifold m && pair.equals(m.pair) && states.equals(m.states)
                && Arrays.equals(c6Au, m.c6Au) && Arrays.equals(shares, m.shares)
                && Double.compare(diagonalAu, m.diagonalAu) == 0;
    }

    @Override
    public int hashCode() {
        return Objects.hash(pair, states, Arrays.hashCode(c6Au), Arrays.hashCode(shares), diagonalAu);
    }

    @Override
    public String toString() {
        return "DispersionManifold[" + pair.label() + ", " + states.size() + " states, C6 " + Arrays.toString(c6Au)
                + " a.u., shares " + Arrays.toString(shares) + "]";
    }
}
