package org.ritzwerk.engine.pair;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.internal.angular.WignerSymbols;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.engine.internal.units.AtomicUnits;
import org.ritzwerk.engine.stark.StarkException;

/**
 * Dipole-dipole interactions of two atoms of one species at a distance R along a unit vector
 * {@code n} at the angle theta to the quantisation axis z (in the x-z plane):
 * <pre>
 *   V = [d1 . d2 - 3 (d1 . n)(d2 . n)] / R^3 = (1 / R^3) sum_{q1,q2} w(q1, q2) d1_q1 d2_q2,
 *   w(q1, q2) = (-1)^q1 delta(q1, -q2) - 3 (-1)^(q1 + q2) n_-q1 n_-q2,
 *   n_0 = cos theta, n_+1 = -sin theta / sqrt 2, n_-1 = sin theta / sqrt 2
 * </pre>
 * (atomic units; the spherical components of the dipole operators as in
 * {@link AlkaliAtom#dipole(State, int, State, int, int)}, {@code a . b = sum_q (-1)^q a_q b_-q};
 * M. Saffman, T. G. Walker and K. Moelmer, Rev. Mod. Phys. 82, 2313 (2010), from memory; at theta = 0, w(0,0) = -2 and w(+-1,-+1) = -1, which the tests check).
 *
 * <p><b>C3</b> ({@link #c3Au}): the first-order coupling {@code R^3 <b|V|a>} of two pair states,
 * e.g. |nS, nP> and |nP, nS>, a product of two dipole elements. <b>C6</b> ({@link #c6}): the
 * second-order shift of a pair state |A> = |a1 m1; a2 m2>,
 * {@code dE = C6 / R^6, C6 = - sum_k |R^3 <k|V|A>|^2 / Delta_k}, over the product states
 * {@code |k> = |k1 m1'; k2 m2'>} whose atoms are dipole-coupled to a1 and a2 (l' = l +- 1,
 * n' within n +- range, every m'), with the Foerster defects
 * {@code Delta_k = E_k1 + E_k2 - E_a1 - E_a2} (T. G. Walker and M. Saffman, Phys. Rev. A 77,
 * 032723 (2008); K. Singer, J. Stanojevic, M. Weidemueller and R. Cote, J. Phys. B 38, S295
 * (2005); from memory). A channel at zero defect (an exact Foerster resonance) is refused
 * ({@link StarkException#DEGENERATE}); near one, C6 is large and changes sign across it. The
 * result is valid where |A> is not mixed with another pair state of the same energy at second
 * order (it is not, at theta = 0, for a pair whose M = m1 + m2 is shared by no other
 * combination of the two levels, e.g. two nS1/2 with m = 1/2).
 *
 * <p>Immutable and thread-safe.
 */
public final class PairInteractions {

    /** The default n' range, n - 6 to n + 6 (the tests show nS C6 converged to 1e-3 there). */
    public static final int DEFAULT_RANGE = 6;

    private final AlkaliAtom atom;
    private final int range;
    private final double angle;

    private PairInteractions(AlkaliAtom atom, int range, double angle) {
        this.atom = atom;
        this.range = range;
        this.angle = angle;
    }

    /**
     * @param atom the atom (both atoms are of this species)
     * @return the interactions with the default range, the axis along z (theta = 0)
     */
    public static PairInteractions of(AlkaliAtom atom) {
        return new PairInteractions(Objects.requireNonNull(atom, "atom"), DEFAULT_RANGE, 0);
    }

    /**
     * @param newRange n' runs from n - range to n + range for each atom; 1 to 50
     * @return the same with that range
     */
    public PairInteractions withNeighbourRange(int newRange) {
        if (newRange < 1 || newRange > 50) {
            throw new IllegalArgumentException("neighbour range must be 1 to 50, got " + newRange);
        }
        return new PairInteractions(atom, newRange, angle);
    }

    /**
     * @param thetaRadians the angle between the interatomic axis and the quantisation axis, 0 to pi
     * @return the same with that angle
     */
    public PairInteractions withAngle(double thetaRadians) {
        if (!(thetaRadians >= 0 && thetaRadians <= Math.PI)) {
            throw new IllegalArgumentException("angle must be 0 to pi rad, got " + thetaRadians);
        }
        return new PairInteractions(atom, range, thetaRadians);
    }

    /** @return the n' range */
    public int neighbourRange() {
        return range;
    }

    /** @return the angle theta, radians */
    public double angleRadians() {
        return angle;
    }

    /**
     * The angular weight w(q1, q2) of the class comment.
     *
     * @param q1 spherical component of the first atom's dipole, -1 to 1
     * @param q2 spherical component of the second atom's dipole, -1 to 1
     * @return the weight at this angle
     */
    public double weight(int q1, int q2) {
        double s = Math.sin(angle) / Math.sqrt(2);
        double[] n = {s, Math.cos(angle), -s}; // n_-1, n_0, n_+1
        double w = (q1 == -q2 ? sign(q1) : 0) - 3 * sign(q1 + q2) * n[1 - q1] * n[1 - q2];
        return w;
    }

    private static double sign(int k) {
        return (k & 1) == 0 ? 1 : -1;
    }

    /**
     * @param bra the final pair state
     * @param ket the initial pair state
     * @return {@code R^3 <bra|V|ket>} in atomic units, E_h a0^3 (a C3 coefficient when bra and ket
     *         are the two orderings of a dipole-coupled pair, e.g. |nS, nP> and |nP, nS>)
     * @throws RydbergException when the model refuses a level or the states are not dipole-coupled
     */
    public double c3Au(PairState bra, PairState ket) {
        Objects.requireNonNull(bra, "bra");
        Objects.requireNonNull(ket, "ket");
        int q1 = (bra.twoM1() - ket.twoM1()) / 2;
        int q2 = (bra.twoM2() - ket.twoM2()) / 2;
        if (Math.abs(q1) > 1 || Math.abs(q2) > 1) {
            return 0;
        }
        double d1 = atom.dipole(bra.first(), bra.twoM1(), ket.first(), ket.twoM1(), q1);
        double d2 = atom.dipole(bra.second(), bra.twoM2(), ket.second(), ket.twoM2(), q2);
        return weight(q1, q2) * d1 * d2;
    }

    /**
     * @param c3Au a C3 coefficient, E_h a0^3
     * @return the same over h, Hz m^3
     */
    public static double c3HzM3(double c3Au) {
        return c3Au * AtomicUnits.HARTREE_HZ * Math.pow(AtomicUnits.BOHR_METRES, 3);
    }

    /** One dipole-coupled state with its projection: the element {@code <k m'|d_q|a m>} and its energy. */
    private record Channel(State state, int twoM, int q, double dipole, double energyHartree) {
    }

    /** Every {@code |k m'>} coupled to {@code |a m>} by d_q, with n' within the range. */
    private List<Channel> channels(State a, int twoM) {
        List<Channel> out = new ArrayList<>();
        for (int l2 = a.l() - 1; l2 <= a.l() + 1; l2 += 2) {
            if (l2 < 0) {
                continue;
            }
            for (int twoJ2 = 2 * l2 - 1; twoJ2 <= 2 * l2 + 1; twoJ2 += 2) {
                if (twoJ2 < 1 || Math.abs(twoJ2 - a.twoJ()) > 2) {
                    continue;
                }
                for (int n2 = Math.max(l2 + 1, a.n() - range); n2 <= a.n() + range; n2++) {
                    State k = new State(n2, l2, twoJ2);
                    double e;
                    try {
                        e = AtomicUnits.hartreeFromPerCm(atom.energyPerCm(k));
                    } catch (RydbergException noLevel) {
                        continue; // below the model's validity: far from a Rydberg pair, left out
                    }
                    double reduced = atom.reducedDipole(k, a);
                    if (reduced == 0) {
                        continue;
                    }
                    for (int twoM2 = Math.max(-twoJ2, twoM - 2); twoM2 <= Math.min(twoJ2, twoM + 2); twoM2 += 2) {
                        int q = (twoM2 - twoM) / 2;
                        // <k m'|d_q|a m> = (-1)^(j' - m') (j' 1 j; -m' q m) <k||d||a>, AlkaliAtom's convention
                        double threeJ = WignerSymbols.threeJ(twoJ2, 2, a.twoJ(), -twoM2, 2 * q, twoM);
                        if (threeJ == 0) {
                            continue;
                        }
                        double d = sign((twoJ2 - twoM2) / 2) * threeJ * reduced;
                        out.add(new Channel(k, twoM2, q, d, e));
                    }
                }
            }
        }
        return out;
    }

    /**
     * @param pair the pair state
     * @return its C6 coefficient, with the strongest channel and its Foerster defect
     * @throws RydbergException when the model has no level for either atom's state
     * @throws StarkException   ({@link StarkException#DEGENERATE}) at an exact Foerster resonance
     */
    public DispersionCoefficient c6(PairState pair) {
        Objects.requireNonNull(pair, "pair");
        double e0 = AtomicUnits.hartreeFromPerCm(atom.energyPerCm(pair.first()) + atom.energyPerCm(pair.second()));
        List<Channel> first = channels(pair.first(), pair.twoM1());
        List<Channel> second = pair.second().equals(pair.first()) && pair.twoM2() == pair.twoM1() ? first
                : channels(pair.second(), pair.twoM2());
        double[][] w = new double[3][3];
        for (int q1 = -1; q1 <= 1; q1++) {
            for (int q2 = -1; q2 <= 1; q2++) {
                w[q1 + 1][q2 + 1] = weight(q1, q2);
            }
        }
        double c6 = 0;
        int count = 0;
        double strongestValue = 0;
        Channel best1 = null;
        Channel best2 = null;
        double bestDefect = 0;
        for (Channel c1 : first) {
            for (Channel c2 : second) {
                double v = w[c1.q() + 1][c2.q() + 1] * c1.dipole() * c2.dipole();
                if (v == 0) {
                    continue;
                }
                double defect = c1.energyHartree() + c2.energyHartree() - e0;
                if (Math.abs(defect) < 1e-14) {
                    throw new StarkException(StarkException.DEGENERATE, pair.label() + " is in exact Foerster "
                            + "resonance with " + c1.state().label() + " + " + c2.state().label()
                            + " in this model; second-order perturbation theory does not hold there");
                }
                double term = -v * v / defect;
                c6 += term;
                count++;
                if (Math.abs(term) > Math.abs(strongestValue)) {
                    strongestValue = term;
                    best1 = c1;
                    best2 = c2;
                    bestDefect = defect;
                }
            }
        }
        if (best1 == null) {
            throw new StarkException(StarkException.NO_COUPLING, pair.label()
                    + " couples to no pair state within n +- " + range);
        }
        PairState strongest = new PairState(best1.state(), best1.twoM(), best2.state(), best2.twoM());
        return new DispersionCoefficient(pair, c6, angle, range, count, strongest, bestDefect * AtomicUnits.HARTREE_HZ,
                strongestValue / c6);
    }

    /**
     * The blockade radius {@code R_b = (|C6| / (hbar Omega))^(1/6)}, where the interaction equals the
     * Rabi frequency (common practice; M. Saffman, T. G. Walker and K. Moelmer, Rev. Mod. Phys. 82,
     * 2313 (2010)).
     *
     * @param c6HzM6      C6 / h, Hz m^6; finite, not zero
     * @param rabiRadPerS Omega, rad/s; positive and finite
     * @return R_b, m
     */
    public static double blockadeRadiusMetres(double c6HzM6, double rabiRadPerS) {
        if (!Double.isFinite(c6HzM6) || c6HzM6 == 0) {
            throw new IllegalArgumentException("C6 must be finite and not 0, got " + c6HzM6 + " Hz m^6");
        }
        if (!(rabiRadPerS > 0) || Double.isInfinite(rabiRadPerS)) {
            throw new IllegalArgumentException("Rabi frequency must be positive and finite, got " + rabiRadPerS
                    + " rad/s");
        }
        return Math.pow(2 * Math.PI * Math.abs(c6HzM6) / rabiRadPerS, 1.0 / 6);
    }
}
