package org.ritzwerk.engine.pair;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
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
 * Pair potentials by diagonalisation: the Hamiltonian {@code H = E_1 + E_2 + V(R)} of two atoms
 * with the dipole-dipole operator V of {@link PairInteractions} (at the same angle theta), in a
 * basis of product states {@code |a m_a; b m_b>} whose single-atom states have n within
 * {@code n +- range} of the target's, l up to lMax, and whose pair energy lies within a window of
 * the target pair's; at theta = 0 only pair states with the target's {@code M = m_a + m_b} enter
 * (V conserves it there). Diagonalised at each distance with Commons Math's dense symmetric
 * {@link EigenDecomposition} (the basis is small: a few hundred pair states). Far apart, the
 * eigenvalue that holds most of the target follows {@code C6 / R^6} of
 * {@link PairInteractions#c6} (see the tests); closer in, the potentials mix and cross as the
 * basis allows. Quadrupole and higher terms are left out.
 *
 * <p>Immutable and thread-safe.
 */
public final class PairPotentials {

    private final AlkaliAtom atom;
    private final int range;
    private final int lMax;
    private final double windowHz;
    private final PairInteractions weights;

    private PairPotentials(AlkaliAtom atom, int range, int lMax, double windowHz, PairInteractions weights) {
        this.atom = atom;
        this.range = range;
        this.lMax = lMax;
        this.windowHz = windowHz;
        this.weights = weights;
    }

    /**
     * @param atom the atom
     * @return potentials with n +- 2, l up to 3, a window of 25 GHz, theta = 0
     */
    public static PairPotentials of(AlkaliAtom atom) {
        Objects.requireNonNull(atom, "atom");
        return new PairPotentials(atom, 2, 3, 25e9, PairInteractions.of(atom));
    }

    /**
     * @param newRange n within n +- range of the target's, 0 to 10
     * @param newLMax  the highest l, 0 to 10
     * @param newWindowHz the window of pair energies around the target's, Hz, positive and finite
     * @return the same with that basis
     */
    public PairPotentials withBasis(int newRange, int newLMax, double newWindowHz) {
        if (newRange < 0 || newRange > 10 || newLMax < 0 || newLMax > 10 || !(newWindowHz > 0)
                || Double.isInfinite(newWindowHz)) {
            throw new IllegalArgumentException("pair basis needs range 0 to 10, l max 0 to 10 and a positive finite "
                    + "window; got " + newRange + ", " + newLMax + ", " + newWindowHz + " Hz");
        }
        return new PairPotentials(atom, newRange, newLMax, newWindowHz, weights);
    }

    /**
     * @param thetaRadians the angle between the interatomic and the quantisation axes, 0 to pi
     * @return the same at that angle
     */
    public PairPotentials withAngle(double thetaRadians) {
        return new PairPotentials(atom, range, lMax, windowHz, weights.withAngle(thetaRadians));
    }

    /** One state with its projection and energy. */
    private record Single(State state, int twoM, double energyHartree) {
    }

    /**
     * @param target          the pair state whose potentials are wanted (in the basis)
     * @param distancesMetres the distances R, m, positive and finite; at least one
     * @return the eigenvalues at each distance and the target's share in each eigenstate
     * @throws StarkException   ({@link StarkException#BAD_BASIS}) when the basis is too large (over 2000 pair states)
     * @throws RydbergException when the model has no level for the target's states
     */
    public PairPotentialResult potentials(PairState target, double[] distancesMetres) {
        Objects.requireNonNull(target, "target");
        Objects.requireNonNull(distancesMetres, "distancesMetres");
        if (distancesMetres.length == 0) {
            throw new IllegalArgumentException("no distance given");
        }
        for (double r : distancesMetres) {
            if (!(r > 0) || Double.isInfinite(r)) {
                throw new IllegalArgumentException("distance must be positive and finite, got " + r + " m");
            }
        }
        double e0 = AtomicUnits.hartreeFromPerCm(atom.energyPerCm(target.first()) + atom.energyPerCm(target.second()));
        List<Single> singles = new ArrayList<>();
        int nLow = Math.min(target.first().n(), target.second().n()) - range;
        int nHigh = Math.max(target.first().n(), target.second().n()) + range;
        for (int n = Math.max(1, nLow); n <= nHigh; n++) {
            for (int l = 0; l <= Math.min(lMax, n - 1); l++) {
                for (int twoJ = Math.max(1, 2 * l - 1); twoJ <= 2 * l + 1; twoJ += 2) {
                    State s = new State(n, l, twoJ);
                    double e;
                    try {
                        e = AtomicUnits.hartreeFromPerCm(atom.energyPerCm(s));
                    } catch (RydbergException noLevel) {
                        continue;
                    }
                    for (int twoM = -twoJ; twoM <= twoJ; twoM += 2) {
                        singles.add(new Single(s, twoM, e));
                    }
                }
            }
        }
        double window = windowHz / AtomicUnits.HARTREE_HZ;
        boolean axial = weights.angleRadians() == 0;
        int twoMTotal = target.twoM1() + target.twoM2();
        List<int[]> pairs = new ArrayList<>();
        int targetIndex = -1;
        for (int a = 0; a < singles.size(); a++) {
            for (int b = 0; b < singles.size(); b++) {
                Single sa = singles.get(a);
                Single sb = singles.get(b);
                if (Math.abs(sa.energyHartree() + sb.energyHartree() - e0) > window) {
                    continue;
                }
                if (axial && sa.twoM() + sb.twoM() != twoMTotal) {
                    continue;
                }
                if (sa.state().equals(target.first()) && sa.twoM() == target.twoM1()
                        && sb.state().equals(target.second()) && sb.twoM() == target.twoM2()) {
                    targetIndex = pairs.size();
                }
                pairs.add(new int[] {a, b});
            }
        }
        if (targetIndex < 0) {
            throw new StarkException(StarkException.BAD_BASIS, target.label() + " is not in its own pair basis "
                    + "(are its l above l max " + lMax + "?)");
        }
        int size = pairs.size();
        if (size > 2000) {
            throw new StarkException(StarkException.BAD_BASIS, "the pair basis holds " + size + " states, more than "
                    + "2000: narrow the window, the n range or l max");
        }
        double[][] d = dipoles(singles);
        double[][] v = new double[size][size];
        double[] diagonal = new double[size];
        for (int i = 0; i < size; i++) {
            int[] pi = pairs.get(i);
            diagonal[i] = singles.get(pi[0]).energyHartree() + singles.get(pi[1]).energyHartree() - e0;
            for (int k = i + 1; k < size; k++) {
                int[] pk = pairs.get(k);
                double d1 = d[pi[0]][pk[0]];
                double d2 = d[pi[1]][pk[1]];
                if (d1 == 0 || d2 == 0) {
                    continue;
                }
                int q1 = (singles.get(pi[0]).twoM() - singles.get(pk[0]).twoM()) / 2;
                int q2 = (singles.get(pi[1]).twoM() - singles.get(pk[1]).twoM()) / 2;
                double value = weights.weight(q1, q2) * d1 * d2;
                v[i][k] = value;
                v[k][i] = value;
            }
        }
        double[][] energies = new double[distancesMetres.length][];
        double[][] shares = new double[distancesMetres.length][];
        for (int r = 0; r < distancesMetres.length; r++) {
            double rBohr = distancesMetres[r] / AtomicUnits.BOHR_METRES;
            double scale = 1 / (rBohr * rBohr * rBohr);
            double[][] h = new double[size][size];
            for (int i = 0; i < size; i++) {
                for (int k = 0; k < size; k++) {
                    h[i][k] = v[i][k] * scale;
                }
                h[i][i] = diagonal[i];
            }
            EigenDecomposition eigen = new EigenDecomposition(new Array2DRowRealMatrix(h, false));
            double[] values = eigen.getRealEigenvalues();
            Integer[] order = new Integer[size];
            for (int i = 0; i < size; i++) {
                order[i] = i;
            }
            Arrays.sort(order, (x, y) -> Double.compare(values[x], values[y]));
            double[] e = new double[size];
            double[] c = new double[size];
            for (int i = 0; i < size; i++) {
                e[i] = values[order[i]] * AtomicUnits.HARTREE_HZ;
                double overlap = eigen.getEigenvector(order[i]).getEntry(targetIndex);
                c[i] = overlap * overlap;
            }
            energies[r] = e;
            shares[r] = c;
        }
        return new PairPotentialResult(target, size, distancesMetres.clone(), energies, shares);
    }

    /** {@code <a m|d_q|b m'>} for every two single states (q fixed by the projections), e a0. */
    private double[][] dipoles(List<Single> singles) {
        int n = singles.size();
        double[][] d = new double[n][n];
        java.util.Map<String, Double> radial = new java.util.HashMap<>();
        for (int a = 0; a < n; a++) {
            Single sa = singles.get(a);
            for (int b = 0; b < n; b++) {
                Single sb = singles.get(b);
                int twoQ = sa.twoM() - sb.twoM();
                if (Math.abs(sa.state().l() - sb.state().l()) != 1 || Math.abs(twoQ) > 2) {
                    continue;
                }
                double threeJ = WignerSymbols.threeJ(sa.state().twoJ(), 2, sb.state().twoJ(), -sa.twoM(), twoQ,
                        sb.twoM());
                if (threeJ == 0) {
                    continue;
                }
                double angular = AlkaliAtom.reducedDipoleAngular(sa.state(), sb.state());
                if (angular == 0) {
                    continue;
                }
                String key = sa.state().label() + "|" + sb.state().label();
                double r = radial.computeIfAbsent(key, k -> atom.radialDipoleBohr(sa.state(), sb.state()));
                int phase = (sa.state().twoJ() - sa.twoM()) / 2;
                d[a][b] = ((phase & 1) == 0 ? 1 : -1) * threeJ * angular * r;
            }
        }
        return d;
    }
}
