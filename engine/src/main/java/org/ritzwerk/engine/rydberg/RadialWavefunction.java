package org.ritzwerk.engine.rydberg;

import java.util.Objects;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.ModelPotential;
import org.ritzwerk.engine.internal.radial.ModelPotentials;

/**
 * A normalised radial wavefunction {@code R(r)} in the Coulomb approximation, from Numerov
 * integration on a square-root grid. Immutable and thread-safe.
 *
 * <p>Method (M. L. Zimmerman, M. G. Littman, M. M. Kash and D. Kleppner, Phys. Rev. A 20, 2251
 * (1979); the square-root variable as in S. A. Bhatti, C. L. Cromer and W. E. Cooke, Phys. Rev. A
 * 24, 161 (1981) and in T. F. Gallagher, Rydberg Atoms (1994), ch. 2): in reduced atomic units
 * (lengths in {@code a_mu = a0 m_e / mu}, energies in {@code 2 R_M}) the radial equation
 * {@code P'' = [2 (V - W) + l(l+1)/r^2] P} with {@code P = r R}, {@code V = -1/r} and the
 * level's own energy {@code W = -1 / (2 n*^2)} becomes, with {@code r = x^2} and
 * {@code P = x^(1/2) X},
 * <pre>
 *   X''(x) = g(x) X(x),   g(x) = -8 + 4 x^2 / n*^2 + (2l + 1/2)(2l + 3/2) / x^2 ,
 * </pre>
 * whose solutions oscillate with a period in x that does not depend on n, so one step h serves
 * every state. Numerov's three-term recursion (B. Numerov 1924; error O(h^6) per step)
 * {@code (1 - h^2 g_{k-1}/12) X_{k-1} = 2 (1 + 5 h^2 g_k/12) X_k - (1 - h^2 g_{k+1}/12) X_{k+1}}
 * runs inward from {@code r_max = 2 n*^2 + 20 n*^(4/3) + 20}, beyond the outer turning point
 * {@code 2 n*^2} by the distance over which the bound solution decays by about e^-35 (the
 * Airy-function tail of a linear potential slope {@code 1/r_t^2}), starting from a WKB-decaying
 * pair. It stops at the core radius
 * {@code alpha_d^(1/3)} (when the core polarizability is known), or, for l &gt; 0, inside the
 * inner classical turning point as soon as |X| starts to grow again (the irregular solution
 * taking over, as it must at a non-integer n*). The function is normalised by
 * {@code 2 h sum X_k^2 x_k^2 = 1} (the integral of R^2 r^2 dr) and is positive in its outermost
 * lobe, at large r, whatever happens at the core: the sign of a matrix element then does not
 * depend on the inner cut-off or on the potential used there. (For hydrogen this differs from the
 * positive-near-the-origin convention of {@link org.ritzwerk.engine.internal.radial.RadialIntegrals}
 * by {@code (-1)^(n-l-1)}.)
 *
 * <p>Accuracy: for zero quantum defects the dipole integrals agree with the closed form to about
 * 1e-8 relative with the default step h = 0.01 (see the tests); the Coulomb approximation itself
 * (no core potential) limits matrix elements of the lowest states to a few per cent.
 */
public final class RadialWavefunction {

    private final State state;
    private final double effectiveN;
    private final double step;
    private final int first;
    private final double[] chi;
    private final double lengthScale;

    private RadialWavefunction(State state, double effectiveN, double step, int first, double[] chi,
            double lengthScale) {
        this.state = state;
        this.effectiveN = effectiveN;
        this.step = step;
        this.first = first;
        this.chi = chi;
        this.lengthScale = lengthScale;
    }

    /**
     * Integrates one state.
     *
     * @param state        the state (its l is used)
     * @param effectiveN   n*, positive and finite
     * @param innerRadius  where to stop at the latest, in reduced units a_mu; 0 for the origin
     * @param step         the grid step h in x = sqrt(r / a_mu); positive
     * @param lengthScale  a_mu / a0, to report radii in Bohr radii
     * @return the normalised function
     */
    static RadialWavefunction integrate(State state, double effectiveN, double innerRadius, double step,
            double lengthScale) {
        return integrate(state, effectiveN, innerRadius, step, lengthScale, null);
    }

    /**
     * As {@link #integrate(State, double, double, double, double)}, with {@code V = V_l(r)} of a
     * model potential instead of -1/r when {@code model} is not null (radii in a0 there; the
     * reduced-mass scaling of the potential is neglected).
     */
    static RadialWavefunction integrate(State state, double effectiveN, double innerRadius, double step,
            double lengthScale, ModelPotential model) {
        Objects.requireNonNull(state, "state");
        if (!(effectiveN > 0) || Double.isInfinite(effectiveN)) {
            throw new IllegalArgumentException("effective principal quantum number must be finite and positive, got "
                    + effectiveN + " for " + state);
        }
        int l = state.l();
        // outer turning point 2 n*^2 plus the distance over which the Airy-like tail decays by about
        // e^-35: (2/3) d^(3/2) sqrt(2) / r_t = 35 gives d = (37 r_t)^(2/3) ~ 17.7 n*^(4/3)
        double rMax = 2 * effectiveN * effectiveN + 20 * Math.pow(effectiveN, 4.0 / 3) + 20;
        int last = (int) Math.ceil(Math.sqrt(rMax) / step);
        int innermost = Math.max(1, (int) Math.floor(Math.sqrt(innerRadius) / step));
        double centrifugal = (2 * l + 0.5) * (2 * l + 1.5);
        double a = 4 / (effectiveN * effectiveN);
        double h12 = step * step / 12;
        double ll = l * (l + 1.0);
        double nn = effectiveN * effectiveN;
        // inner turning point of -1/r + l(l+1)/(2 r^2) = -1/(2 n*^2)
        double turning = l == 0 ? 0 : nn * (1 - Math.sqrt(Math.max(0, 1 - ll / nn)));
        double xTurning = Math.sqrt(turning);
        double[] values = new double[last + 1];
        double xLast = last * step;
        double gLast = g(xLast, a, centrifugal, l, model, lengthScale);
        values[last] = 1e-10;
        values[last - 1] = values[last] * Math.exp(step * Math.sqrt(Math.max(gLast, 0)));
        double xk = (last - 1) * step;
        double gNext = gLast;
        double gK = g(xk, a, centrifugal, l, model, lengthScale);
        int stop = innermost;
        for (int k = last - 1; k > innermost; k--) {
            double xPrev = (k - 1) * step;
            double gPrev = model == null ? -8 + a * xPrev * xPrev + centrifugal / (xPrev * xPrev)
                    : g(xPrev, a, centrifugal, l, model, lengthScale);
            double next = (2 * (1 + 5 * h12 * gK) * values[k] - (1 - h12 * gNext) * values[k + 1]) / (1 - h12 * gPrev);
            if (l > 0 && xPrev < xTurning && Math.abs(next) > Math.abs(values[k])) {
                stop = k;
                break;
            }
            values[k - 1] = next;
            gNext = gK;
            gK = gPrev;
        }
        double sum = 0;
        for (int k = stop; k <= last; k++) {
            double x = k * step;
            sum += values[k] * values[k] * x * x;
        }
        // the inward start is positive, so the function is positive in its outermost lobe
        double norm = Math.sqrt(2 * step * sum);
        double[] chi = new double[last - stop + 1];
        for (int k = stop; k <= last; k++) {
            chi[k - stop] = values[k] / norm;
        }
        return new RadialWavefunction(state, effectiveN, step, stop, chi, lengthScale);
    }

    /** g(x) = 8 x^2 (V - W) + (2l + 1/2)(2l + 3/2) / x^2 with W = -1/(2 n*^2), i.e. a = 4 / n*^2. */
    private static double g(double x, double a, double centrifugal, int l, ModelPotential model, double lengthScale) {
        double x2 = x * x;
        if (model == null) {
            return -8 + a * x2 + centrifugal / x2;
        }
        return 8 * x2 * ModelPotentials.potential(model, l, x2 * lengthScale) + a * x2 + centrifugal / x2;
    }

    private static void requireSameGrid(RadialWavefunction a, RadialWavefunction b) {
        if (a.step != b.step) {
            throw new IllegalArgumentException("wavefunctions on different grids: h = " + a.step + " and " + b.step);
        }
    }

    /**
     * {@code integral R_a(r) R_b(r) r^(2 + power) dr} on the common grid, in reduced units a_mu^power.
     */
    static double overlap(RadialWavefunction a, RadialWavefunction b, int power) {
        requireSameGrid(a, b);
        int from = Math.max(a.first, b.first);
        int to = Math.min(a.first + a.chi.length, b.first + b.chi.length) - 1;
        double sum = 0;
        double h = a.step;
        for (int k = from; k <= to; k++) {
            double x2 = (k * h) * (k * h);
            double weight;
            switch (power) {
                case 0:
                    weight = x2;
                    break;
                case 1:
                    weight = x2 * x2;
                    break;
                case 2:
                    weight = x2 * x2 * x2;
                    break;
                default:
                    weight = Math.pow(x2, power + 1);
            }
            sum += a.chi[k - a.first] * b.chi[k - b.first] * weight;
        }
        return 2 * h * sum;
    }

    /**
     * {@code integral R_a(r) R_b(r) r^3 [1 - (alpha_d / r^3) (1 - exp(-(r / r_c)^3))] dr}: the radial
     * dipole integral with the core-polarization correction of the dipole operator (see
     * {@link AlkaliAtom#withCorePolarizedDipole(org.ritzwerk.data.ModelPotential)}), all lengths in reduced units a_mu.
     *
     * @param alpha  the core dipole polarizability alpha_d in a_mu^3, not negative (0: the bare r)
     * @param cutoff the cut-off radius r_c in a_mu, positive
     */
    static double polarizedDipoleOverlap(RadialWavefunction a, RadialWavefunction b, double alpha, double cutoff) {
        requireSameGrid(a, b);
        int from = Math.max(a.first, b.first);
        int to = Math.min(a.first + a.chi.length, b.first + b.chi.length) - 1;
        double sum = 0;
        double h = a.step;
        double rc3 = cutoff * cutoff * cutoff;
        for (int k = from; k <= to; k++) {
            double r = (k * h) * (k * h);
            double r3 = r * r * r;
            // the weight of the bare dipole in overlap(a, b, 1), x^4 = r^2, times the operator's factor
            // 1 - (alpha / r^3) (1 - exp(-(r / r_c)^3)); expm1 keeps it exact where r << r_c
            double factor = 1 + alpha / r3 * Math.expm1(-r3 / rc3);
            sum += a.chi[k - a.first] * b.chi[k - b.first] * r * r * factor;
        }
        return 2 * h * sum;
    }

    /** @return the state */
    public State state() {
        return state;
    }

    /** @return the effective principal quantum number the function was integrated at */
    public double effectiveN() {
        return effectiveN;
    }

    /** @return the number of grid points kept */
    public int size() {
        return chi.length;
    }

    /**
     * @param i point index, 0 (innermost) to size() - 1
     * @return its radius in Bohr radii a0
     */
    public double radiusBohr(int i) {
        double x = (first + i) * step;
        return x * x * lengthScale;
    }

    /**
     * @param i point index, 0 (innermost) to size() - 1
     * @return R(r) at that point in a0^(-3/2), normalised so that the integral of R^2 r^2 dr is 1
     */
    public double value(int i) {
        double x = (first + i) * step;
        return chi[i] / (x * Math.sqrt(x)) / Math.pow(lengthScale, 1.5);
    }

    /**
     * @param power k, from -2 up; (r^-1 and r^-2 are only as good as the cut-off near the core)
     * @return the expectation value {@code <r^k>} in a0^k
     */
    public double expectationBohr(int power) {
        return overlap(this, this, power) * Math.pow(lengthScale, power);
    }

    /** @return the grid step h in x = sqrt(r / a_mu) */
    public double step() {
        return step;
    }
}
