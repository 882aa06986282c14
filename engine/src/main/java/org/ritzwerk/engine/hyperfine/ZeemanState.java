package org.ritzwerk.engine.hyperfine;

import java.util.Arrays;
import java.util.Objects;
import java.util.OptionalDouble;
import org.ritzwerk.engine.hydrogenic.Notation;

/**
 * One eigenstate of a level's hyperfine-Zeeman Hamiltonian at a given field. m_F = m_J + m_I is
 * exact at every field; F is the zero-field label the state connects to (within one m_F, states
 * do not cross, so the k-th lowest state of an m_F block is the k-th lowest F level that has that
 * m_F). Immutable and thread-safe: the amplitudes are copied in and out.
 *
 * <p>NaN policy: {@code energyUncertaintyHertz} is NaN when not estimated (an uncertainty of A or B that
 * the energy depends on is not stated). {@code fieldSlopeHertzPerTesla} is always finite.
 *
 * @param twoMF                  2 m_F
 * @param twoF                   2 F of the zero-field level it connects to
 * @param energyHertz            energy / h relative to the level's hyperfine-free centroid at zero field, Hz
 * @param amplitudes             the eigenvector in the |m_J m_I> basis: index (m_J + J) (2I + 1) + (m_I + I),
 *                               m_J and m_I ascending; real, normalised
 * @param energyUncertaintyHertz the energy's standard uncertainty from the stated uncertainties of the level's
 *                               A and B (first order, Hellmann-Feynman: {@link ZeemanStructure#eigenstates}), and
 *                               of the field where one is given, Hz; NaN when not estimated
 * @param dominant               the largest |m_J m_I> component and its weight
 * @param fieldSlopeHertzPerTesla the energy's first derivative by the field at this field, dE/dB / h, Hz per tesla:
 *                               exactly {@code <psi|M|psi>} with M the Zeeman operator per tesla, mu_B (g_J J_z +
 *                               g_I I_z) / h (Hellmann-Feynman); positive when the state rises with the field; at
 *                               zero field g_F m_F mu_B / h, in the Paschen-Back limit (g_J m_J + g_I m_I) mu_B / h
 */
public record ZeemanState(int twoMF, int twoF, double energyHertz, double[] amplitudes,
        double energyUncertaintyHertz, UncoupledLabel dominant, double fieldSlopeHertzPerTesla) {

    /**
     * Copies the amplitudes.
     *
     * @param twoMF                  2 m_F
     * @param twoF                   2 F of the zero-field level it connects to
     * @param energyHertz            energy / h relative to the level's hyperfine-free centroid at zero field, Hz
     * @param amplitudes             the eigenvector in the |m_J m_I> basis; real, normalised
     * @param energyUncertaintyHertz the energy's standard uncertainty, Hz; NaN when not estimated
     * @param dominant               the largest |m_J m_I> component and its weight; not null
     * @param fieldSlopeHertzPerTesla dE/dB / h, Hz per tesla; finite
     */
    public ZeemanState {
        amplitudes = amplitudes.clone();
        Objects.requireNonNull(dominant, "dominant");
        if (!Double.isFinite(fieldSlopeHertzPerTesla)) {
            throw new IllegalArgumentException("a state's field slope must be finite (Hz per tesla), got "
                    + fieldSlopeHertzPerTesla);
        }
    }

    /** @return a copy of the amplitudes */
    @Override
    public double[] amplitudes() {
        return amplitudes.clone();
    }

    /** @return the energy's standard uncertainty, Hz, or empty when not estimated */
    public OptionalDouble energyUncertainty() {
        return Double.isNaN(energyUncertaintyHertz) ? OptionalDouble.empty()
                : OptionalDouble.of(energyUncertaintyHertz);
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
                && Double.compare(s.energyHertz, energyHertz) == 0 && Arrays.equals(s.amplitudes, amplitudes)
                && Double.compare(s.energyUncertaintyHertz, energyUncertaintyHertz) == 0
                && s.dominant.equals(dominant)
                && Double.compare(s.fieldSlopeHertzPerTesla, fieldSlopeHertzPerTesla) == 0;
    }

    @Override
    public int hashCode() {
        return Objects.hash(twoMF, twoF, energyHertz, Arrays.hashCode(amplitudes), energyUncertaintyHertz, dominant,
                fieldSlopeHertzPerTesla);
    }

    @Override
    public String toString() {
        return "ZeemanState[F=" + fLabel() + ", mF=" + mFLabel() + ", " + energyHertz + " Hz, u "
                + energyUncertaintyHertz + " Hz, dE/dB " + fieldSlopeHertzPerTesla + " Hz/T, |mJ=" + dominant.mJLabel()
                + " mI=" + dominant.mILabel() + "> "
                + dominant.weight() + "]";
    }
}
