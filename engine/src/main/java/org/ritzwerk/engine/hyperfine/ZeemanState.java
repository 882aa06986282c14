package org.ritzwerk.engine.hyperfine;

import org.ritzwerk.engine.hydrogenic.Notation;

/**
 * One eigenstate of a level's hyperfine-Zeeman Hamiltonian at a given field. m_F = m_J + m_I is
 * exact at every field; F is the zero-field label the state connects to (within one m_F, states
 * do not cross, so the k-th lowest state of an m_F block is the k-th lowest F level that has that
 * m_F). Immutable and thread-safe: the amplitudes are copied in and out.
 *
 * @param twoMF         2 m_F
 * @param twoF          2 F of the zero-field level it connects to
 * @param energyHertz   energy / h relative to the level's hyperfine-free centroid at zero field, Hz
 * @param amplitudes    the eigenvector in the |m_J m_I> basis: index (m_J + J) (2I + 1) + (m_I + I),
 *                      m_J and m_I ascending; real, normalised
 */
public record ZeemanState(int twoMF, int twoF, double energyHertz, double[] amplitudes) {

    /**
     * Copies the amplitudes.
     *
     * @param twoMF         2 m_F
     * @param twoF          2 F of the zero-field level it connects to
     * @param energyHertz   energy / h relative to the level's hyperfine-free centroid at zero field, Hz
     * @param amplitudes    the eigenvector in the |m_J m_I> basis: index (m_J + J) (2I + 1) + (m_I + I),
     *                      m_J and m_I ascending; real, normalised
     */
    public ZeemanState {
        amplitudes = amplitudes.clone();
    }

    /** @return a copy of the amplitudes */
    @Override
    public double[] amplitudes() {
        return amplitudes.clone();
    }

    /** @return m_F as text: {@code -1} or {@code 3/2} */
    public String mFLabel() {
        return Notation.half(twoMF);
    }

    /** @return F as text */
    public String fLabel() {
        return Notation.half(twoF);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ZeemanState s && s.twoMF == twoMF && s.twoF == twoF
                && Double.compare(s.energyHertz, energyHertz) == 0 && java.util.Arrays.equals(s.amplitudes, amplitudes);
    }

    @Override
    public int hashCode() {
        return java.util.Objects.hash(twoMF, twoF, energyHertz, java.util.Arrays.hashCode(amplitudes));
    }

    @Override
    public String toString() {
        return "ZeemanState[F=" + fLabel() + ", mF=" + mFLabel() + ", " + energyHertz + " Hz]";
    }
}
