package org.ritzwerk.data;

import java.util.List;
import java.util.Objects;

/**
 * The parameters of the l-dependent core model potential of M. Marinescu, H. R. Sadeghpour and
 * A. Dalgarno, Phys. Rev. A 49, 982 (1994), eqs. 5 to 7, in atomic units (lengths in a0, energies
 * in hartree):
 * <pre>
 *   V_l(r) = -Z_l(r) / r - alpha_c / (2 r^4) [1 - exp(-(r / r_c)^6)],
 *   Z_l(r) = 1 + (Z - 1) exp(-a1 r) - r (a3 + a4 r) exp(-a2 r),
 * </pre>
 * with one parameter set per l (the last one serves every higher l). This record only describes
 * the potential; the engine evaluates it ({@code org.ritzwerk.engine.internal.radial.ModelPotentials}).
 * Immutable and thread-safe.
 *
 * @param z      nuclear charge Z
 * @param alphaC core dipole polarizability alpha_c, a0^3
 * @param sets   parameters (a1, a2, a3, a4, r_c) for l = 0, 1, 2, ...; at least one
 * @param source where the parameters come from; not blank
 */
public record ModelPotential(int z, double alphaC, List<Parameters> sets, String source) {

    /**
     * One l's parameters.
     *
     * @param a1 a1 of Z_l(r): the decay rate of the (Z - 1) term, a0^-1; finite
     * @param a2 a2 of Z_l(r): the decay rate of the r (a3 + a4 r) term, a0^-1; finite
     * @param a3 a3 of Z_l(r), a0^-1; finite
     * @param a4 a4 of Z_l(r), a0^-2; finite
     * @param rc cut-off radius r_c of the polarization term, a0; finite, positive
     */
    public record Parameters(double a1, double a2, double a3, double a4, double rc) {
        /**
         * Validates the parameters.
         *
         * @param a1 a1 of Z_l(r): the decay rate of the (Z - 1) term, a0^-1; finite
         * @param a2 a2 of Z_l(r): the decay rate of the r (a3 + a4 r) term, a0^-1; finite
         * @param a3 a3 of Z_l(r), a0^-1; finite
         * @param a4 a4 of Z_l(r), a0^-2; finite
         * @param rc cut-off radius r_c of the polarization term, a0; finite, positive
         */
        public Parameters {
            if (!Double.isFinite(a1) || !Double.isFinite(a2) || !Double.isFinite(a3) || !Double.isFinite(a4)
                    || !(rc > 0) || Double.isInfinite(rc)) {
                throw new IllegalArgumentException("model-potential parameters must be finite and r_c > 0, got "
                        + a1 + ", " + a2 + ", " + a3 + ", " + a4 + ", " + rc);
            }
        }
    }

    /**
     * Validates the components.
     *
     * @param z      nuclear charge Z
     * @param alphaC core dipole polarizability alpha_c, a0^3
     * @param sets   parameters (a1, a2, a3, a4, r_c) for l = 0, 1, 2, ...; at least one
     * @param source where the parameters come from; not blank
     */
    public ModelPotential {
        Objects.requireNonNull(source, "source");
        sets = List.copyOf(sets);
        if (z < 1 || !(alphaC >= 0) || Double.isInfinite(alphaC) || sets.isEmpty() || source.isBlank()) {
            throw new IllegalArgumentException("model potential needs Z >= 1, finite alpha_c >= 0, at least one "
                    + "parameter set and a source; got Z = " + z + ", alpha_c = " + alphaC + ", " + sets.size() + " sets");
        }
    }

    /**
     * @param l orbital quantum number, not negative
     * @return the parameters that serve l: those of l, or the last set when l is beyond it
     * @throws IllegalArgumentException for a negative l
     */
    public Parameters parametersFor(int l) {
        if (l < 0) {
            throw new IllegalArgumentException("orbital quantum number l must be >= 0, got " + l);
        }
        return sets.get(Math.min(l, sets.size() - 1));
    }
}
