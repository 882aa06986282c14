package org.ritzwerk.engine.pair;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.apache.commons.math4.legacy.linear.Array2DRowRealMatrix;
import org.apache.commons.math4.legacy.linear.EigenDecomposition;
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
 * result is one potential's where |A> is not mixed with another pair state of the same energy at second
 * order (it is not, at theta = 0, for a pair whose M = m1 + m2 is shared by no other
 * combination of the two levels, e.g. two nS1/2 with m = 1/2, or the stretched pair of two nD5/2
 * with m = 5/2). Elsewhere it is the diagonal element of a degenerate manifold's C6 matrix, and
 * {@link #c6Manifold} gives that matrix's eigenvalues, the C6 of the potentials the pair state splits
 * into (two Rb 60d5/2 with m = 1/2: three, from a factor 15 apart).
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

    /** One atom's state with its projection (a key for an intermediate state's atom). */
    private record Single(State state, int twoM) {
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
     * The C6 matrix of the degenerate manifold of a pair state and its eigenvalues (second-order
     * perturbation theory in the degenerate Zeeman manifold, T. G. Walker and M. Saffman, Phys. Rev. A
     * 77, 032723 (2008), from memory): over the pair states B of the same two levels (every m_j, both
     * orderings of two different levels, only B with the pair's M at theta = 0, where V conserves M),
     * {@code C6_AB = - sum_k <A|R^3 V|k><k|R^3 V|B> / Delta_k} with the intermediate states and
     * Foerster defects of {@link #c6}. Its diagonal element at the pair state is {@link #c6}'s C6.
     *
     * @param pair the pair state
     * @return the manifold, its eigenvalues and the pair state's share in each eigenvector
     * @throws IllegalArgumentException for two different levels that are dipole-coupled (their pair states
     *                                  couple at first order, C3: {@link #c3Au})
     * @throws RydbergException         when the model has no level for either atom's state
     * @throws StarkException           ({@link StarkException#DEGENERATE}) at an exact Foerster resonance
     */
    public DispersionManifold c6Manifold(PairState pair) {
        Objects.requireNonNull(pair, "pair");
        State a = pair.first();
        State b = pair.second();
        if (!a.equals(b) && Math.abs(a.l() - b.l()) == 1) {
            throw new IllegalArgumentException(pair.label() + ": the two levels are dipole-coupled, so the pair "
                    + "states couple at first order (C3), not through C6");
        }
        boolean axial = angle == 0;
        int twoMTotal = pair.twoM1() + pair.twoM2();
        List<PairState> states = new ArrayList<>();
        for (State[] order : a.equals(b) ? new State[][] {{a, b}} : new State[][] {{a, b}, {b, a}}) {
            for (int m1 = -order[0].twoJ(); m1 <= order[0].twoJ(); m1 += 2) {
                for (int m2 = -order[1].twoJ(); m2 <= order[1].twoJ(); m2 += 2) {
                    if (!axial || m1 + m2 == twoMTotal) {
                        states.add(new PairState(order[0], m1, order[1], m2));
                    }
                }
            }
        }
        int size = states.size();
        double e0 = AtomicUnits.hartreeFromPerCm(atom.energyPerCm(a) + atom.energyPerCm(b));
        // The intermediate states |k1 m1'; k2 m2'> grouped by the first atom's |k1 m1'>, one group at a time,
        // so that the amplitudes <k|R^3 V|A> held at once stay few (one group's second-atom states).
        Map<String, List<Channel>> cache = new HashMap<>();
        List<List<Channel>> seconds = new ArrayList<>();
        Map<Single, List<int[]>> byFirst = new LinkedHashMap<>();   // |k1 m1'> -> {manifold index, channel index}
        List<List<Channel>> firsts = new ArrayList<>();
        for (int i = 0; i < size; i++) {
            PairState s = states.get(i);
            List<Channel> first = cache.computeIfAbsent(s.first().label() + "|" + s.twoM1(),
                    key -> channels(s.first(), s.twoM1()));
            firsts.add(first);
            seconds.add(cache.computeIfAbsent(s.second().label() + "|" + s.twoM2(),
                    key -> channels(s.second(), s.twoM2())));
            for (int c = 0; c < first.size(); c++) {
                byFirst.computeIfAbsent(new Single(first.get(c).state(), first.get(c).twoM()),
                        key -> new ArrayList<>()).add(new int[] {i, c});
            }
        }
        double[][] c6 = new double[size][size];
        for (List<int[]> group : byFirst.values()) {
            Map<Single, double[]> amplitudes = new HashMap<>();
            Map<Single, Double> defects = new HashMap<>();
            for (int[] member : group) {
                int i = member[0];
                Channel c1 = firsts.get(i).get(member[1]);
                for (Channel c2 : seconds.get(i)) {
                    double v = weight(c1.q(), c2.q()) * c1.dipole() * c2.dipole();
                    if (v == 0) {
                        continue;
                    }
                    double defect = c1.energyHartree() + c2.energyHartree() - e0;
                    if (Math.abs(defect) < 1e-14) {
                        throw new StarkException(StarkException.DEGENERATE, states.get(i).label() + " is in exact "
                                + "Foerster resonance with " + new PairState(c1.state(), c1.twoM(), c2.state(),
                                c2.twoM()).label() + " in this model; second-order perturbation theory does not "
                                + "hold there");
                    }
                    Single k2 = new Single(c2.state(), c2.twoM());
                    amplitudes.computeIfAbsent(k2, key -> new double[size])[i] += v;
                    defects.put(k2, defect);
                }
            }
            for (Map.Entry<Single, double[]> e : amplitudes.entrySet()) {
                double[] v = e.getValue();
                double inverse = 1 / defects.get(e.getKey());
                for (int i = 0; i < size; i++) {
                    if (v[i] == 0) {
                        continue;
                    }
                    for (int j = 0; j < size; j++) {
                        c6[i][j] -= v[i] * v[j] * inverse;
                    }
                }
            }
        }
        int target = states.indexOf(pair);
        double[] values;
        double[] shares = new double[size];
        if (size == 1) {
            values = new double[] {c6[0][0]};
            shares[0] = 1;
        } else {
            for (int i = 0; i < size; i++) {
                for (int j = 0; j < i; j++) {
                    double mean = (c6[i][j] + c6[j][i]) / 2;
                    c6[i][j] = mean;
                    c6[j][i] = mean;
                }
            }
            EigenDecomposition eigen = new EigenDecomposition(new Array2DRowRealMatrix(c6, false));
            double[] raw = eigen.getRealEigenvalues();
            Integer[] order = new Integer[size];
            for (int i = 0; i < size; i++) {
                order[i] = i;
            }
            Arrays.sort(order, (x, y) -> Double.compare(raw[x], raw[y]));
            values = new double[size];
            for (int i = 0; i < size; i++) {
                values[i] = raw[order[i]];
                double overlap = eigen.getEigenvector(order[i]).getEntry(target);
                shares[i] = overlap * overlap;
            }
        }
        return new DispersionManifold(pair, states, values, shares, c6[target][target]);
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
