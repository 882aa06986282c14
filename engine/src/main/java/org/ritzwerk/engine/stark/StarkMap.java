package org.ritzwerk.engine.stark;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.apache.commons.math4.legacy.linear.Array2DRowRealMatrix;
import org.apache.commons.math4.legacy.linear.ArrayRealVector;
import org.apache.commons.math4.legacy.linear.EigenDecomposition;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.internal.angular.WignerSymbols;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.RadialWavefunction;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.engine.internal.units.AtomicUnits;

/**
 * One atom in a static electric field F along the quantisation axis z: the Hamiltonian
 * <pre>
 *   H = H_0 + F z,   &lt;a|H_0|b&gt; = E_a delta_ab,
 *   &lt;a m|z|b m&gt; = (-1)^(j_a - m) (j_a 1 j_b; -m 0 m) &lt;a||d||b&gt;
 * </pre>
 * (atomic units; the electron's potential energy {@code +e F z}; the reduced element in
 * {@link AlkaliAtom}'s convention) in a truncated basis of states {@code |n l j m_j>} with one
 * m_j (the field conserves it), n from nMin to nMax, l from the lowest that holds m_j up to
 * {@code min(n - 1, lMax)}, both j; zero-field energies from the atom's levels (quantum-defect
 * fits, the core-polarization formula or hydrogenic for high l), couplings from its radial
 * functions. Diagonalised at each field (see {@link #solve}): the band matrix is reduced to
 * tridiagonal form by Givens rotations and Commons Math's symmetric tridiagonal
 * {@link EigenDecomposition} (implicit QL) solves that; avoided crossings are resolved as the basis
 * allows.
 *
 * <p><b>Basis and structure</b>: the states are ordered by l, then j, then n, so that the field
 * couples only neighbouring l blocks and the matrix is banded with a half-bandwidth of about
 * {@code 2 (nMax - nMin + 1)} ({@link #halfBandwidth()}); the couplings are computed once, held
 * as a sparse list, and the matrix at each field is filled from them. Commons Math has no banded
 * symmetric solver; it takes a tridiagonal matrix, so the band is reduced to that first
 * ({@link #solveDense} keeps the plain dense decomposition as the baseline). The reduction is
 * O(n^2 b), but Commons Math's tridiagonal solver still accumulates all n eigenvectors (O(n^3)),
 * and that dominates: StarkMapBenchmark finds the two paths equally fast at 1,000 states (about
 * 10 s per field on one core of the test machine). An eigenvalue-only tridiagonal solver would
 * remove that cost; Commons Math has none.
 *
 * <p><b>Accuracy</b>: a state's energy converges as the n range grows around it (see the tests:
 * hydrogen's linear Stark effect, {@code (3/2) n (n1 - n2) F}, within 1e-6 n^2 of the slope in one manifold; the Rb
 * 50S shift against the second-order polarizability). States at the edges of the n range are
 * not converged; keep a few n on each side of the states of interest.
 *
 * <p>Immutable and thread-safe.
 */
public final class StarkMap {

    private final AlkaliAtom atom;
    private final int twoMj;
    private final List<State> basis;
    /** Zero-field energies, cm^-1 above the ground level. */
    private final double[] energiesPerCm;
    /** Couplings z_ab, a0, as rows, columns and values (upper triangle). */
    private final int[] rows;
    private final int[] columns;
    private final double[] values;
    private final int halfBandwidth;

    private StarkMap(AlkaliAtom atom, int twoMj, List<State> basis, double[] energiesPerCm, int[] rows,
            int[] columns, double[] values, int halfBandwidth) {
        this.atom = atom;
        this.twoMj = twoMj;
        this.basis = basis;
        this.energiesPerCm = energiesPerCm;
        this.rows = rows;
        this.columns = columns;
        this.values = values;
        this.halfBandwidth = halfBandwidth;
    }

    /**
     * The usual n range of a map around one state: its own n and its nearest hydrogenic
     * manifold, round(n*), and one more n on each side.
     *
     * @param atom  the atom
     * @param state the state the map is about
     * @return {lowest n, highest n}
     * @throws RydbergException when the atom has no energy for the state
     */
    public static int[] principalRangeAround(AlkaliAtom atom, State state) {
        int nearest = (int) Math.round(atom.level(state).effectiveN());
        return new int[] {Math.max(1, Math.min(state.n(), nearest) - 1), Math.max(state.n(), nearest) + 1};
    }

    /**
     * @param atom the atom
     * @return a builder of the basis
     */
    public static Builder builder(AlkaliAtom atom) {
        return new Builder(Objects.requireNonNull(atom, "atom"));
    }

    /** Chooses the basis; {@link #build()} computes the levels and couplings. Not thread-safe. */
    public static final class Builder {
        private final AlkaliAtom atom;
        private int twoMj = 1;
        private int nMin = -1;
        private int nMax = -1;
        private int lMax = Integer.MAX_VALUE;

        private Builder(AlkaliAtom atom) {
            this.atom = atom;
        }

        /**
         * @param twice twice m_j, odd (the atoms here have one electron's half-integer j)
         * @return this builder
         */
        public Builder projection(int twice) {
            if ((twice & 1) == 0) {
                throw new IllegalArgumentException("2m_j must be odd, got " + twice);
            }
            this.twoMj = twice;
            return this;
        }

        /**
         * The usual basis for a map around one state: its own n and its nearest hydrogenic
         * manifold, round(n*), and one more n on each side (for Rb 50S, n* = 46.9, the n = 47
         * manifold lies below n - 2, so it must be taken in).
         *
         * @param state the state the map is about
         * @return this builder, with that n range
         * @throws RydbergException when the atom has no energy for the state
         */
        public Builder principalRangeAround(State state) {
            int[] range = StarkMap.principalRangeAround(atom, state);
            return principalRange(range[0], range[1]);
        }

        /**
         * @param from the lowest n, at least 1
         * @param to   the highest n, at least {@code from}, at most from + 60
         * @return this builder
         */
        public Builder principalRange(int from, int to) {
            if (from < 1 || to < from || to - from > 60) {
                throw new IllegalArgumentException("n range must satisfy 1 <= nMin <= nMax <= nMin + 60, got " + from
                        + " to " + to);
            }
            this.nMin = from;
            this.nMax = to;
            return this;
        }

        /**
         * @param highest the highest l in the basis, not negative (default: n - 1 for each n)
         * @return this builder
         */
        public Builder maxOrbital(int highest) {
            if (highest < 0) {
                throw new IllegalArgumentException("highest l must be >= 0, got " + highest);
            }
            this.lMax = highest;
            return this;
        }

        /**
         * @return the map's basis with its energies and couplings
         * @throws StarkException   ({@link StarkException#BAD_BASIS}) when no n range was given or the
         *                          basis holds no state
         * @throws RydbergException when the atom has no level for a basis state (raise nMin)
         */
        public StarkMap build() {
            if (nMin < 0) {
                throw new StarkException(StarkException.BAD_BASIS, "no n range given for the Stark-map basis");
            }
            List<State> states = new ArrayList<>();
            int lLow = (Math.abs(twoMj) - 1) / 2;
            int lHigh = Math.min(nMax - 1, lMax);
            for (int l = lLow; l <= lHigh; l++) {
                for (int twoJ = 2 * l - 1; twoJ <= 2 * l + 1; twoJ += 2) {
                    if (twoJ < Math.abs(twoMj)) {
                        continue;
                    }
                    for (int n = Math.max(nMin, l + 1); n <= nMax; n++) {
                        if (n < atom.lowestN(l)) {
                            continue; // filled by the core
                        }
                        states.add(new State(n, l, twoJ));
                    }
                }
            }
            if (states.isEmpty()) {
                throw new StarkException(StarkException.BAD_BASIS, "the basis n = " + nMin + " to " + nMax + ", l <= "
                        + lMax + ", 2m_j = " + twoMj + " holds no state");
            }
            int size = states.size();
            double[] energies = new double[size];
            RadialWavefunction[] functions = new RadialWavefunction[size];
            for (int i = 0; i < size; i++) {
                energies[i] = atom.energyPerCm(states.get(i));
                functions[i] = atom.wavefunction(states.get(i));
            }
            int[] r = new int[16];
            int[] c = new int[16];
            double[] v = new double[16];
            int count = 0;
            int band = 0;
            for (int a = 0; a < size; a++) {
                State sa = states.get(a);
                for (int b = a + 1; b < size; b++) {
                    State sb = states.get(b);
                    if (Math.abs(sa.l() - sb.l()) != 1) {
                        continue;
                    }
                    double threeJ = WignerSymbols.threeJ(sa.twoJ(), 2, sb.twoJ(), -twoMj, 0, twoMj);
                    if (threeJ == 0) {
                        continue;
                    }
                    double angular = AlkaliAtom.reducedDipoleAngular(sa, sb);
                    if (angular == 0) {
                        continue;
                    }
                    int phase = (sa.twoJ() - twoMj) / 2;
                    double z = ((phase & 1) == 0 ? 1 : -1) * threeJ * angular
                            * atom.radialDipoleBohr(functions[a], functions[b]);
                    if (count == r.length) {
                        r = Arrays.copyOf(r, 2 * count);
                        c = Arrays.copyOf(c, 2 * count);
                        v = Arrays.copyOf(v, 2 * count);
                    }
                    r[count] = a;
                    c[count] = b;
                    v[count] = z;
                    count++;
                    band = Math.max(band, b - a);
                }
            }
            return new StarkMap(atom, twoMj, Collections.unmodifiableList(states), energies, Arrays.copyOf(r, count),
                    Arrays.copyOf(c, count), Arrays.copyOf(v, count), band);
        }
    }

    /** @return the atom */
    public AlkaliAtom atom() {
        return atom;
    }

    /** @return twice m_j */
    public int projection() {
        return twoMj;
    }

    /** @return the basis states, in the matrix's order (l, j, n); immutable */
    public List<State> basis() {
        return basis;
    }

    /** @return the number of basis states */
    public int size() {
        return basis.size();
    }

    /** @return the number of non-zero couplings above the diagonal */
    public int couplings() {
        return values.length;
    }

    /** @return the largest distance of a coupling from the diagonal */
    public int halfBandwidth() {
        return halfBandwidth;
    }

    /**
     * @param state a basis state
     * @return its index in {@link #basis()}
     * @throws StarkException ({@link StarkException#BAD_BASIS}) when it is not in the basis
     */
    public int indexOf(State state) {
        int i = basis.indexOf(state);
        if (i < 0) {
            throw new StarkException(StarkException.BAD_BASIS, state.label() + " with 2m_j = " + twoMj
                    + " is not in the Stark-map basis (" + basis.size() + " states)");
        }
        return i;
    }

    /**
     * The Hamiltonian at one field, hartree, relative to {@code originPerCm}: a dense symmetric matrix
     * filled from the sparse couplings.
     *
     * @param fieldAu     F in atomic units
     * @param originPerCm the energy subtracted on the diagonal, cm^-1
     * @return the matrix, row-major
     */
    public double[][] hamiltonian(double fieldAu, double originPerCm) {
        int n = basis.size();
        double[][] h = new double[n][n];
        for (int i = 0; i < n; i++) {
            h[i][i] = AtomicUnits.hartreeFromPerCm(energiesPerCm[i] - originPerCm);
        }
        for (int k = 0; k < values.length; k++) {
            double x = fieldAu * values[k];
            h[rows[k]][columns[k]] = x;
            h[columns[k]][rows[k]] = x;
        }
        return h;
    }

    /**
     * Diagonalises at every field: the banded Hamiltonian is reduced to tridiagonal form by Givens
     * rotations (O(n^2 b), see {@code BandReduction}), and Commons Math's symmetric tridiagonal
     * {@link EigenDecomposition#EigenDecomposition(double[], double[])} gives the eigenvalues and
     * the tridiagonal eigenvectors; the reference's share in each eigenstate is the squared
     * product of those with the rotated reference vector.
     *
     * @param fieldsVPerM the fields, V/m, finite; at least one
     * @param reference   the zero-field state whose share in each eigenstate is reported (a basis state)
     * @return energies and characters at every field
     * @throws StarkException ({@link StarkException#BAD_BASIS}) when the reference is not in the basis
     */
    public StarkMapResult solve(double[] fieldsVPerM, State reference) {
        return solve(fieldsVPerM, reference, false);
    }

    /**
     * As {@link #solve(double[], State)}, with the dense symmetric decomposition of Commons Math on
     * the whole matrix (O(n^3) per field): the reference the banded path is tested and benchmarked
     * against.
     *
     * @param fieldsVPerM the fields, V/m, finite; at least one
     * @param reference   the zero-field state whose share in each eigenstate is reported
     * @return energies and characters at every field
     */
    public StarkMapResult solveDense(double[] fieldsVPerM, State reference) {
        return solve(fieldsVPerM, reference, true);
    }

    private StarkMapResult solve(double[] fieldsVPerM, State reference, boolean dense) {
        Objects.requireNonNull(fieldsVPerM, "fieldsVPerM");
        if (fieldsVPerM.length == 0) {
            throw new IllegalArgumentException("no field given");
        }
        for (double f : fieldsVPerM) {
            if (!Double.isFinite(f)) {
                throw new IllegalArgumentException("field must be finite, got " + f + " V/m");
            }
        }
        int ref = indexOf(Objects.requireNonNull(reference, "reference"));
        double origin = energiesPerCm[ref];
        int n = basis.size();
        double[][] energies = new double[fieldsVPerM.length][];
        double[][] characters = new double[fieldsVPerM.length][];
        for (int f = 0; f < fieldsVPerM.length; f++) {
            double[][] h = hamiltonian(fieldsVPerM[f] / AtomicUnits.FIELD_V_PER_M, origin);
            double[] w = new double[n];
            w[ref] = 1;
            EigenDecomposition eigen;
            if (dense) {
                eigen = new EigenDecomposition(new Array2DRowRealMatrix(h, false));
            } else {
                BandReduction reduction = new BandReduction(h, halfBandwidth, w);
                reduction.reduce();
                eigen = new EigenDecomposition(reduction.diagonal(), reduction.offDiagonal());
            }
            double[] values = eigen.getRealEigenvalues();
            Integer[] order = new Integer[n];
            for (int i = 0; i < n; i++) {
                order[i] = i;
            }
            Arrays.sort(order, (x, y) -> Double.compare(values[x], values[y]));
            double[] e = new double[n];
            double[] c = new double[n];
            for (int i = 0; i < n; i++) {
                e[i] = values[order[i]] * AtomicUnits.HARTREE_PER_CM + origin;
                double overlap = eigen.getEigenvector(order[i]).dotProduct(new ArrayRealVector(w, false));
                c[i] = overlap * overlap;
            }
            energies[f] = e;
            characters[f] = c;
        }
        return new StarkMapResult(basis, twoMj, reference, origin, fieldsVPerM.clone(), energies, characters);
    }
}
