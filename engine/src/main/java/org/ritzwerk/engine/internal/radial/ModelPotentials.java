package org.ritzwerk.engine.internal.radial;

import org.ritzwerk.data.ModelPotential;

/**
 * Evaluates the l-dependent core model potential of M. Marinescu, H. R. Sadeghpour and
 * A. Dalgarno, Phys. Rev. A 49, 982 (1994), eqs. 5 to 7, whose parameters a {@link ModelPotential}
 * holds, in atomic units (lengths in a0, energies in hartree):
 * <pre>
 *   V_l(r) = -Z_l(r) / r - alpha_c / (2 r^4) [1 - exp(-(r / r_c)^6)],
 *   Z_l(r) = 1 + (Z - 1) exp(-a1 r) - r (a3 + a4 r) exp(-a2 r),
 * </pre>
 * with the parameters of l (the last set for every higher l). Spin-orbit coupling is not included.
 * Stateless and thread-safe.
 */
public final class ModelPotentials {

    private ModelPotentials() {
    }

    /**
     * @param potential the parameters
     * @param l         orbital quantum number, not negative
     * @param r         radius in a0, positive
     * @return V_l(r) in hartree
     * @throws IllegalArgumentException for a negative l
     */
    public static double potential(ModelPotential potential, int l, double r) {
        ModelPotential.Parameters p = potential.parametersFor(l);
        int z = potential.z();
        double zl = 1 + (z - 1) * Math.exp(-p.a1() * r) - r * (p.a3() + p.a4() * r) * Math.exp(-p.a2() * r);
        double r2 = r * r;
        double x = r / p.rc();
        double x3 = x * x * x;
        return -zl / r - potential.alphaC() / (2 * r2 * r2) * (1 - Math.exp(-x3 * x3));
    }
}
