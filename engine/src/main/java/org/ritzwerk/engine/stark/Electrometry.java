package org.ritzwerk.engine.stark;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.engine.internal.units.AtomicUnits;

/**
 * Microwave electrometry with Rydberg atoms: a resonant field of amplitude E on the transition
 * {@code |lower m> -> |upper m'>} drives it at the Rabi frequency {@code Omega = |d| E / hbar},
 * {@code d = <upper m'|d_q|lower m>} (e a0 times {@code e a0} in SI), and splits a probe line
 * sharing one of the two states into an Autler-Townes doublet {@code Delta f = Omega / (2 pi)}
 * apart; so a measured splitting gives {@code E = h Delta f / |d|} (common practice; J. A. Sedlacek
 * et al., Nature Phys. 8, 819 (2012), from memory). In a Doppler-broadened vapour with a ladder
 * probe-coupling scheme the optical doublet seen on the probe is {@code Delta f} times
 * {@code lambda_coupling / lambda_probe} (same source); that factor is the caller's to apply. The
 * polarisation q and the projections fix which element is used; the tests check the identity and
 * the scaling with |d|.
 *
 * <p>Immutable and thread-safe.
 */
public final class Electrometry {

    private static final double H = PhysicalConstants.H;

    private final AlkaliAtom atom;

    private Electrometry(AlkaliAtom atom) {
        this.atom = atom;
    }

    /**
     * @param atom the atom
     * @return the electrometry of that atom
     */
    public static Electrometry of(AlkaliAtom atom) {
        return new Electrometry(Objects.requireNonNull(atom, "atom"));
    }

    /**
     * @param lower      the lower state
     * @param twoMLower  twice its m_j
     * @param upper      the upper state (l differing by one)
     * @param twoMUpper  twice its m_j; {@code q = (twoMUpper - twoMLower) / 2} must be -1, 0 or 1
     * @param fieldVPerM the field amplitude of polarisation q, V/m, finite, not negative
     * @return the splitting with the element used
     * @throws StarkException   ({@link StarkException#NO_COUPLING}) when the element is zero (j or m do not couple)
     * @throws RydbergException when l does not change by one or a level is refused
     */
    public AutlerTownes splitting(State lower, int twoMLower, State upper, int twoMUpper, double fieldVPerM) {
        if (!(fieldVPerM >= 0) || Double.isInfinite(fieldVPerM)) {
            throw new IllegalArgumentException("field must be finite and >= 0, got " + fieldVPerM + " V/m");
        }
        double d = element(lower, twoMLower, upper, twoMUpper);
        double hz = Math.abs(d) * AtomicUnits.DIPOLE_C_M * fieldVPerM / H;
        return new AutlerTownes(lower, twoMLower, upper, twoMUpper, (twoMUpper - twoMLower) / 2, d, fieldVPerM, hz);
    }

    /**
     * The inverse: the field amplitude a measured splitting means.
     *
     * @param lower       the lower state
     * @param twoMLower   twice its m_j
     * @param upper       the upper state
     * @param twoMUpper   twice its m_j
     * @param splittingHz the measured splitting Omega / (2 pi), Hz, finite, not negative
     * @return the field with the element used
     * @throws StarkException   ({@link StarkException#NO_COUPLING}) when the element is zero
     * @throws RydbergException when l does not change by one or a level is refused
     */
    public AutlerTownes field(State lower, int twoMLower, State upper, int twoMUpper, double splittingHz) {
        if (!(splittingHz >= 0) || Double.isInfinite(splittingHz)) {
            throw new IllegalArgumentException("splitting must be finite and >= 0, got " + splittingHz + " Hz");
        }
        double d = element(lower, twoMLower, upper, twoMUpper);
        double field = H * splittingHz / (Math.abs(d) * AtomicUnits.DIPOLE_C_M);
        return new AutlerTownes(lower, twoMLower, upper, twoMUpper, (twoMUpper - twoMLower) / 2, d, field,
                splittingHz);
    }

    private double element(State lower, int twoMLower, State upper, int twoMUpper) {
        Objects.requireNonNull(lower, "lower");
        Objects.requireNonNull(upper, "upper");
        int twoQ = twoMUpper - twoMLower;
        if (Math.abs(twoQ) > 2) {
            throw new StarkException(StarkException.NO_COUPLING, "m_j changes by " + twoQ + "/2 from " + lower.label()
                    + " to " + upper.label() + "; a dipole changes it by at most 1");
        }
        double d = atom.dipole(upper, twoMUpper, lower, twoMLower, twoQ / 2);
        if (d == 0) {
            throw new StarkException(StarkException.NO_COUPLING, lower.label() + " (2m = " + twoMLower + ") -> "
                    + upper.label() + " (2m = " + twoMUpper + ") has no dipole element for q = " + twoQ / 2);
        }
        return d;
    }

    /**
     * The dipole transitions from a state near a frequency: every {@code |n' l' j'>} with
     * {@code l' = l +- 1}, j' coupled to j and {@code |n' - n| <= nRange} whose frequency lies within
     * the window, nearest first. States the model has no level for are skipped.
     *
     * @param from        the state
     * @param frequencyHz the requested frequency, Hz, positive and finite
     * @param windowHz    the half-width of the window, Hz, positive and finite
     * @param nRange      how far n' may be from n, 1 to 100
     * @return the transitions, nearest first (possibly none)
     */
    public List<ResonantTransition> transitionsNear(State from, double frequencyHz, double windowHz, int nRange) {
        Objects.requireNonNull(from, "from");
        if (!(frequencyHz > 0) || Double.isInfinite(frequencyHz)) {
            throw new IllegalArgumentException("frequency must be positive and finite, got " + frequencyHz + " Hz");
        }
        if (!(windowHz > 0) || Double.isInfinite(windowHz)) {
            throw new IllegalArgumentException("window must be positive and finite, got " + windowHz + " Hz");
        }
        if (nRange < 1 || nRange > 100) {
            throw new IllegalArgumentException("n range must be 1 to 100, got " + nRange);
        }
        List<ResonantTransition> out = new ArrayList<>();
        for (int l2 = from.l() - 1; l2 <= from.l() + 1; l2 += 2) {
            if (l2 < 0) {
                continue;
            }
            for (int twoJ2 = 2 * l2 - 1; twoJ2 <= 2 * l2 + 1; twoJ2 += 2) {
                if (twoJ2 < 1 || Math.abs(twoJ2 - from.twoJ()) > 2) {
                    continue;
                }
                for (int n2 = Math.max(l2 + 1, from.n() - nRange); n2 <= from.n() + nRange; n2++) {
                    State to = new State(n2, l2, twoJ2);
                    double nu;
                    try {
                        nu = Math.abs(atom.frequencyHz(from, to));
                    } catch (RydbergException noLevel) {
                        continue;
                    }
                    if (Math.abs(nu - frequencyHz) > windowHz) {
                        continue;
                    }
                    double radial = atom.radialDipoleBohr(to, from);
                    double reduced = AlkaliAtom.reducedDipoleAngular(to, from) * radial;
                    out.add(new ResonantTransition(from, to, nu, nu - frequencyHz, reduced, radial));
                }
            }
        }
        out.sort(Comparator.comparingDouble(t -> Math.abs(t.detuningHz())));
        return out;
    }
}
