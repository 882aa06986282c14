package org.ritzwerk.engine.stark;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.apache.commons.math4.legacy.linear.Array2DRowRealMatrix;
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
 * tridiagonal form by Givens rotations and reference LAPACK's tridiagonal solvers (in their
 * pure-Java translation, {@code dev.ludovic.netlib:lapack}) solve that; avoided crossings are
 * resolved as the basis allows.
 *
 * <p><b>Basis and structure</b>: the states are ordered by l, then j, then n, so that the field
 * couples only neighbouring l blocks and the matrix is banded with a half-bandwidth of about
 * {@code 2 (nMax - nMin + 1)} ({@link #halfBandwidth()}); the couplings do not depend on the field:
 * they are computed once, when the map is built, held as a sparse list, and the matrix at each
 * field is filled from them. The band is reduced to a tridiagonal matrix (O(n^2 b)); LAPACK's
 * {@code DSTEMR} gives all its eigenvalues and eigenvectors in O(n^2) ({@link #solve}), its
 * {@code DSTERF} the eigenvalues alone ({@link #solveEnergies}); {@link #solveDense} keeps Commons
 * Math's dense decomposition, which accumulates every eigenvector by rotations (O(n^3)), as the
 * baseline. Profiling the dense and the earlier banded path (Commons Math's tridiagonal
 * decomposition) at 1,008 states put 96 % of the time in that accumulation and under 5 % in
 * building the matrix and reducing the band. StarkMapBenchmark and StarkMapOneCoreBenchmark measure
 * the paths side by side. H(F) = H_0 + F z: what does not depend on the field (the levels, the
 * couplings, the diagonal relative to the reference, one band workspace per thread) is made once,
 * and each field only loads F times the couplings into the band and reduces it. Timing the steps
 * of the windowed solve at 1,008 states (2026-12-04, with a JFR profile of DSTEMR) put about 60 %
 * of a field in the band reduction, 10 % in {@code DSTERF} and 30 % in {@code DSTEMR}, mostly its
 * bisection for the window's eigenvalues; the
 * reduction now holds the upper band only and the window's vectors come from inverse iteration.
 * Fields are independent; {@link #withThreads} spreads them over threads. A map looked at in an
 * energy window around the state of interest needs the shares only there:
 * {@link #withShareWindowHz} keeps every energy ({@code DSTERF}) and computes the eigenvectors of
 * the eigenstates in the window alone (inverse iteration, {@code DSTEIN}, from those eigenvalues,
 * or {@code DSTEMR} over their index range when the window holds many or the matrix splits).
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
    private final int threads;
    /** The share window, Hz relative to the reference's zero-field energy; null when every share is computed. */
    private final double[] shareWindowHz;

    private StarkMap(AlkaliAtom atom, int twoMj, List<State> basis, double[] energiesPerCm, int[] rows,
            int[] columns, double[] values, int halfBandwidth, int threads, double[] shareWindowHz) {
        this.atom = atom;
        this.twoMj = twoMj;
        this.basis = basis;
        this.energiesPerCm = energiesPerCm;
        this.rows = rows;
        this.columns = columns;
        this.values = values;
        this.halfBandwidth = halfBandwidth;
        this.threads = threads;
        this.shareWindowHz = shareWindowHz;
    }

    /**
     * The usual n range of a map around one state: its own n and its nearest hydrogenic
     * manifold, round(n*), and one more n on each side; widened so that every state whose
     * effective principal number lies within 1 of the state's own is in the basis, whatever its
     * quantum defect. The upper end takes the largest defect, the s series' (Rb 50d5/2, n* = 48.65,
     * is coupled most strongly to 52p3/2, n* = 49.36: n from 48 to 52, where n from 48 to 51 gave
     * polarisabilities a factor 2.6 off and of the wrong sign at some m_j).
     *
     * @param atom  the atom
     * @param state the state the map is about
     * @return {lowest n, highest n}
     * @throws RydbergException when the atom has no energy for the state
     */
    public static int[] principalRangeAround(AlkaliAtom atom, State state) {
        double nStar = atom.level(state).effectiveN();
        int nearest = (int) Math.round(nStar);
        int low = Math.max(1, Math.min(Math.min(state.n(), nearest) - 1, (int) Math.ceil(nStar - 1)));
        int high = Math.max(state.n(), nearest) + 1;
        // the s series has the largest defect; its members up to n* + 1 are in the basis
        int probe = Math.max(state.n(), nearest) + 4;
        double sDefect = probe - atom.level(State.of(probe, 0, 1)).effectiveN();
        high = Math.max(high, (int) Math.floor(nStar + 1 + Math.max(0, sDefect)));
        return new int[] {low, high};
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
         * The usual basis for a map around one state ({@link StarkMap#principalRangeAround}): its
         * own n and its nearest hydrogenic manifold, round(n*), and one more n on each side (for Rb
         * 50S, n* = 46.9, the n = 47 manifold lies below n - 2, so it must be taken in), and every
         * state within 1 of its n*.
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
                    Arrays.copyOf(c, count), Arrays.copyOf(v, count), band, 1, null);
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
     * The same map solved with {@code threads} threads, each taking whole fields (the fields are
     * independent; the results do not depend on the number of threads). A pool of that many threads
     * is made for each solve and shut down after it.
     *
     * @param threads at least 1 (the default: the calling thread only)
     * @return a map that solves with that many threads
     */
    public StarkMap withThreads(int threads) {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be >= 1, got " + threads);
        }
        return new StarkMap(atom, twoMj, basis, energiesPerCm, rows, columns, values, halfBandwidth, threads,
                shareWindowHz);
    }

    /** @return the number of threads a solve uses */
    public int threads() {
        return threads;
    }

    /**
     * The same map, whose {@link #solve} computes every eigenstate's energy but the reference's share
     * only in the eigenstates whose energy lies in a window: from {@code lowerHz} to {@code upperHz}
     * (both included) relative to the reference state's zero-field energy, the scale of
     * {@link StarkMapResult#energiesRelativeHz}. The energies come from LAPACK's {@code DSTERF}; the
     * eigenvectors of the eigenstates in the window only: by inverse iteration from their eigenvalues
     * ({@code DSTEIN}) for up to 150 of them when no off-diagonal element of the tridiagonal matrix is
     * negligible, else from {@code DSTEMR} with an index range ({@code RANGE = 'I'}); the two agree to
     * 1e-9 in the shares (WindowedSharesTest), and a map whose window holds k of its n states costs
     * about k / n of the vectors. The result says which eigenstates carry a share ({@link StarkMapResult#hasShare}) and
     * refuses to give one it has not computed. {@link #solveEnergies} computes no share and
     * {@link #solveDense}, the baseline, every share, whatever the window.
     *
     * @param lowerHz the window's lower edge, Hz relative to the reference's zero-field energy; finite
     * @param upperHz its upper edge, Hz, finite and above {@code lowerHz}
     * @return a map that solves with that window
     * @throws IllegalArgumentException when an edge is not finite or the edges are not in order
     */
    public StarkMap withShareWindowHz(double lowerHz, double upperHz) {
        requireFiniteEdge("lower", lowerHz);
        requireFiniteEdge("upper", upperHz);
        if (!(lowerHz < upperHz)) {
            throw new IllegalArgumentException("the share window's lower edge (" + lowerHz + " Hz) must be below its"
                    + " upper edge (" + upperHz + " Hz)");
        }
        return new StarkMap(atom, twoMj, basis, energiesPerCm, rows, columns, values, halfBandwidth, threads,
                new double[] {lowerHz, upperHz});
    }

    private static void requireFiniteEdge(String which, double hz) {
        if (Double.isNaN(hz)) {
            throw new IllegalArgumentException("the share window's " + which + " edge must be a finite frequency in"
                    + " Hz, got a value that is not a number");
        }
        if (Double.isInfinite(hz)) {
            throw new IllegalArgumentException("the share window's " + which + " edge must be a finite frequency in"
                    + " Hz, got " + (hz > 0 ? "" : "minus ") + "a value too large for a double");
        }
    }

    /**
     * @return the same map computing every share in {@link #solve} (the default)
     */
    public StarkMap withoutShareWindow() {
        return new StarkMap(atom, twoMj, basis, energiesPerCm, rows, columns, values, halfBandwidth, threads, null);
    }

    /** @return whether {@link #solve} computes shares only within a window ({@link #withShareWindowHz}) */
    public boolean hasShareWindow() {
        return shareWindowHz != null;
    }

    /**
     * @return the share window's lower edge, Hz relative to the reference's zero-field energy
     * @throws IllegalStateException when the map has no share window
     */
    public double shareWindowLowerHz() {
        return requireWindow()[0];
    }

    /**
     * @return the share window's upper edge, Hz relative to the reference's zero-field energy
     * @throws IllegalStateException when the map has no share window
     */
    public double shareWindowUpperHz() {
        return requireWindow()[1];
    }

    private double[] requireWindow() {
        if (shareWindowHz == null) {
            throw new IllegalStateException("this Stark map has no share window; see withShareWindowHz");
        }
        return shareWindowHz;
    }

    /**
     * Diagonalises at every field: the banded Hamiltonian is reduced to tridiagonal form by Givens
     * rotations (O(n^2 b), see {@code BandReduction}), which are applied to the reference state's
     * unit vector as well; LAPACK's {@code DSTEMR} (multiple relatively robust representations,
     * O(n^2)) gives the eigenvalues and the tridiagonal eigenvectors, and the reference's share in
     * each eigenstate is the squared product of those with the rotated reference vector. A map with
     * a share window ({@link #withShareWindowHz}) computes every eigenvalue with {@code DSTERF} and the
     * eigenvectors, and so the shares, of the eigenstates in the window only ({@code DSTEIN} or
     * {@code DSTEMR}, see there).
     *
     * @param fieldsVPerM the fields, V/m, finite; at least one
     * @param reference   the zero-field state whose share in each eigenstate is reported (a basis state)
     * @return energies and characters at every field
     * @throws StarkException ({@link StarkException#BAD_BASIS}) when the reference is not in the basis
     */
    public StarkMapResult solve(double[] fieldsVPerM, State reference) {
        return solve(fieldsVPerM, reference, shareWindowHz == null ? Path.BANDED : Path.WINDOWED);
    }

    /**
     * As {@link #solve(double[], State)} without the characters: after the band reduction only
     * the eigenvalues are computed (LAPACK's {@code DSTERF}, O(n^2)). The result's
     * {@link StarkMapResult#hasCharacters()} is false.
     *
     * @param fieldsVPerM the fields, V/m, finite; at least one
     * @param reference   the zero-field state the energies are given relative to (a basis state)
     * @return energies at every field
     * @throws StarkException ({@link StarkException#BAD_BASIS}) when the reference is not in the basis
     */
    public StarkMapResult solveEnergies(double[] fieldsVPerM, State reference) {
        return solve(fieldsVPerM, reference, Path.ENERGIES);
    }

    /**
     * As {@link #solve(double[], State)}, with the dense symmetric decomposition of Commons Math on
     * the whole matrix (Householder tridiagonalisation and implicit QL, all eigenvectors
     * accumulated; O(n^3) per field): the reference the banded path is tested and benchmarked
     * against.
     *
     * @param fieldsVPerM the fields, V/m, finite; at least one
     * @param reference   the zero-field state whose share in each eigenstate is reported
     * @return energies and characters at every field
     */
    public StarkMapResult solveDense(double[] fieldsVPerM, State reference) {
        return solve(fieldsVPerM, reference, Path.DENSE);
    }

    /** How one field is diagonalised. */
    private enum Path {
        BANDED, WINDOWED, ENERGIES, DENSE
    }

    private StarkMapResult solve(double[] fieldsVPerM, State reference, Path path) {
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
        double[] fields = fieldsVPerM.clone();
        double[][] energies = new double[fields.length][];
        double[][] characters = path == Path.ENERGIES ? null : new double[fields.length][];
        int[] firstShared = path == Path.WINDOWED ? new int[fields.length] : null;
        // Field-independent parts, made once per solve: the diagonal (H_0, hartree relative to the
        // reference) and, per thread, the band workspace; each field only scales the couplings (F z).
        double[] diagonal = new double[basis.size()];
        for (int i = 0; i < diagonal.length; i++) {
            diagonal[i] = AtomicUnits.hartreeFromPerCm(energiesPerCm[i] - origin);
        }
        if (threads == 1 || fields.length == 1) {
            BandReduction workspace = path == Path.DENSE ? null : new BandReduction(basis.size(), halfBandwidth);
            for (int f = 0; f < fields.length; f++) {
                solveOne(fields, f, ref, origin, diagonal, workspace, path, energies, characters, firstShared);
            }
        } else {
            ThreadLocal<BandReduction> workspaces = ThreadLocal.withInitial(
                    () -> path == Path.DENSE ? null : new BandReduction(basis.size(), halfBandwidth));
            ExecutorService pool = Executors.newFixedThreadPool(Math.min(threads, fields.length), runnable -> {
                Thread t = new Thread(runnable, "stark-map");
                t.setDaemon(true);
                return t;
            });
            try {
                List<Future<?>> done = new ArrayList<>();
                for (int f = 0; f < fields.length; f++) {
                    int field = f;
                    done.add(pool.submit(() -> solveOne(fields, field, ref, origin, diagonal, workspaces.get(), path,
                            energies, characters, firstShared)));
                }
                for (Future<?> future : done) {
                    future.get();
                }
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException("interrupted while solving the Stark map", e);
            } catch (ExecutionException e) {
                Throwable cause = e.getCause();
                if (cause instanceof RuntimeException) {
                    throw (RuntimeException) cause;
                }
                if (cause instanceof Error) {
                    throw (Error) cause;
                }
                throw new IllegalStateException(cause);
            } finally {
                pool.shutdownNow();
            }
        }
        if (path == Path.WINDOWED) {
            return new StarkMapResult(basis, twoMj, reference, origin, fields, energies, characters,
                    shareWindowHz.clone(), firstShared);
        }
        return new StarkMapResult(basis, twoMj, reference, origin, fields, energies, characters, null, null);
    }

    /**
     * Diagonalises at field {@code f} and stores its energies (cm^-1) and characters; on the windowed
     * path the characters are those of the eigenstates {@code firstShared[f]} onwards, in the window.
     */
    private void solveOne(double[] fields, int f, int ref, double origin, double[] diagonal, BandReduction workspace,
            Path path, double[][] energies, double[][] characters, int[] firstShared) {
        int n = basis.size();
        double fieldAu = fields[f] / AtomicUnits.FIELD_V_PER_M;
        double[] e = new double[n];
        double[] c = new double[n];
        if (path == Path.DENSE) {
            double[][] h = hamiltonian(fieldAu, origin);
            EigenDecomposition eigen = new EigenDecomposition(new Array2DRowRealMatrix(h, false));
            double[] values = eigen.getRealEigenvalues();
            Integer[] order = new Integer[n];
            for (int i = 0; i < n; i++) {
                order[i] = i;
            }
            Arrays.sort(order, (x, y) -> Double.compare(values[x], values[y]));
            for (int i = 0; i < n; i++) {
                e[i] = values[order[i]];
                double overlap = eigen.getEigenvector(order[i]).getEntry(ref);
                c[i] = overlap * overlap;
            }
        } else {
            // the energies alone need no tracked vector
            double[] w = path == Path.ENERGIES ? null : new double[n];
            if (w != null) {
                w[ref] = 1;
            }
            BandReduction reduction = workspace.load(diagonal, rows, columns, values, fieldAu, w);
            reduction.reduce();
            double[] d = reduction.diagonal();
            double[] off = reduction.offDiagonal();
            if (path == Path.WINDOWED) {
                windowed(d, off, w, f, origin, energies, characters, firstShared);
                return;
            }
            e = path == Path.ENERGIES ? TridiagonalEigen.eigenvalues(d, off)
                    : TridiagonalEigen.eigenvaluesAndShares(d, off, w, c);
        }
        for (int i = 0; i < n; i++) {
            e[i] = e[i] * AtomicUnits.HARTREE_PER_CM + origin;
        }
        energies[f] = e;
        if (characters != null) {
            characters[f] = c;
        }
    }

    /**
     * The windowed path at one field: every eigenvalue by {@code DSTERF}, the index range of those
     * in the share window (judged on {@link StarkMapResult#energiesRelativeHz}'s scale, so the result
     * and its window agree state by state), and the vectors for that range alone: by inverse iteration
     * from those eigenvalues ({@code DSTEIN}) when the window holds few and the matrix does not split,
     * else (or when {@code DSTEIN} does not converge) by {@code DSTEMR} over the index range.
     */
    private void windowed(double[] d, double[] off, double[] tracked, int f, double origin, double[][] energies,
            double[][] characters, int[] firstShared) {
        int n = d.length;
        double[] hartree = TridiagonalEigen.eigenvalues(d.clone(), off.clone());
        double[] e = new double[n];
        int first = -1;
        int last = -2;
        for (int i = 0; i < n; i++) {
            e[i] = hartree[i] * AtomicUnits.HARTREE_PER_CM + origin;
            double hz = StarkMapResult.relativeHz(e[i], origin);
            if (hz >= shareWindowHz[0] && hz <= shareWindowHz[1]) {
                if (first < 0) {
                    first = i;
                }
                last = i;
            }
        }
        energies[f] = e;
        if (first < 0) {
            firstShared[f] = 0;
            characters[f] = new double[0];
        } else {
            firstShared[f] = first;
            double[] shares = TridiagonalEigen.sharesByInverseIteration(d, off, tracked, hartree, first, last);
            characters[f] = shares != null ? shares : TridiagonalEigen.sharesOfIndexRange(d, off, tracked, first, last);
        }
    }
}
