package org.ritzwerk.engine.stark;

import java.util.Objects;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.internal.units.AtomicUnits;

/**
 * The static dipole polarizability of one fine-structure state, {@code dE(m_j) = -alpha(m_j) F^2 / 2}
 * in a field F along the quantisation axis, with
 * {@code alpha(m_j) = alpha_0 + alpha_2 [3 m_j^2 - j(j+1)] / [j (2j - 1)]} (the tensor part only for
 * j &gt; 1/2). Immutable.
 *
 * @param state          the state
 * @param scalarAu       alpha_0 in atomic units (e^2 a0^2 / E_h)
 * @param tensorAu       alpha_2 in atomic units; 0 for j = 1/2
 * @param statesSummed   how many dipole-coupled states (n' l' j') entered the sum
 * @param neighbourRange the n' range used: n - range to n + range
 */
public record Polarizability(State state, double scalarAu, double tensorAu, int statesSummed, int neighbourRange) {

    /**
     * Validates the components.
     *
     * @param state          the state
     * @param scalarAu       alpha_0, atomic units, finite
     * @param tensorAu       alpha_2, atomic units, finite
     * @param statesSummed   how many states entered the sum, not negative
     * @param neighbourRange the n' range used, not negative
     */
    public Polarizability {
        Objects.requireNonNull(state, "state");
        if (!Double.isFinite(scalarAu) || !Double.isFinite(tensorAu)) {
            throw new IllegalArgumentException("polarizability of " + state.label() + " must be finite, got alpha_0 = "
                    + scalarAu + ", alpha_2 = " + tensorAu + " a.u.");
        }
    }

    /**
     * @param twoMj twice m_j, a projection of the state's j
     * @return alpha(m_j) in atomic units
     */
    public double forProjectionAu(int twoMj) {
        if (Math.abs(twoMj) > state.twoJ() || ((twoMj + state.twoJ()) & 1) != 0) {
            throw new IllegalArgumentException("2m_j = " + twoMj + " is not a projection of j = " + state.twoJ()
                    + "/2 of " + state.label());
        }
        if (state.twoJ() == 1) {
            return scalarAu;
        }
        double j = state.j();
        double m = twoMj / 2.0;
        return scalarAu + tensorAu * (3 * m * m - j * (j + 1)) / (j * (2 * j - 1));
    }

    /** @return alpha_0 / h in MHz/(V/cm)^2, the unit most Rydberg measurements quote */
    public double scalarMHzPerVPerCmSquared() {
        return scalarAu * AtomicUnits.POLARIZABILITY_HZ_PER_V2M2 * 1e4 / 1e6;
    }

    /** @return alpha_2 / h in MHz/(V/cm)^2 */
    public double tensorMHzPerVPerCmSquared() {
        return tensorAu * AtomicUnits.POLARIZABILITY_HZ_PER_V2M2 * 1e4 / 1e6;
    }

    /**
     * @param twoMj        twice m_j
     * @param fieldVPerM   the static field, V/m, finite
     * @return the quadratic Stark shift {@code -alpha(m_j) F^2 / (2h)} in Hz
     */
    public double shiftHz(int twoMj, double fieldVPerM) {
        if (!Double.isFinite(fieldVPerM)) {
            throw new IllegalArgumentException("field must be finite, got " + fieldVPerM + " V/m");
        }
        return -0.5 * forProjectionAu(twoMj) * AtomicUnits.POLARIZABILITY_HZ_PER_V2M2 * fieldVPerM * fieldVPerM;
    }
}
