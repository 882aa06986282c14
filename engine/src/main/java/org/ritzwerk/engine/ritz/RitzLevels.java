package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.apache.commons.math4.legacy.linear.Array2DRowRealMatrix;
import org.apache.commons.math4.legacy.linear.EigenDecomposition;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.quantity.Unit;

/**
 * The energy levels of one species that lines are computed from by the Ritz combination
 * principle: per level a label, its energy above the ground level (cm^-1), its standard uncertainty
 * where known (a level at energy 0 without one, the zero of the scale, is exact: 0), and what the
 * label says about parity, term and J ({@link LevelDesignation}); and,
 * where given, the covariance of the energies (cm^-2), e.g. from a level optimisation
 * ({@link LevelOptimum#levels}), so that the uncertainties of line wavenumbers take the
 * correlations into account.
 *
 * <p>Immutable and thread-safe; labels are unique within a set.
 */
public final class RitzLevels {

    private final Species species;
    private final Optional<DataSetInfo> info;
    private final String[] label;
    private final double[] energy;
    private final double[] sigma;
    private final LevelDesignation[] designation;
    private final double[][] covariance;
    private final Map<String, Integer> index;

    private RitzLevels(Species species, Optional<DataSetInfo> info, String[] label, double[] energy, double[] sigma,
            LevelDesignation[] designation, double[][] covariance) {
        this.species = species;
        this.info = info;
        this.label = label;
        this.energy = energy;
        this.sigma = sigma;
        this.designation = designation;
        this.covariance = covariance;
        this.index = new HashMap<>();
        for (int i = 0; i < label.length; i++) {
            if (index.putIfAbsent(label[i], i) != null) {
                throw new IllegalArgumentException("level '" + label[i] + "' of " + species.notation()
                        + " is given twice");
            }
        }
    }

    /**
     * @param species the species
     * @return a builder for its levels
     */
    public static Builder builder(Species species) {
        return new Builder(Objects.requireNonNull(species, "species"));
    }

    /**
     * The rows of one species in a level list, energies and uncertainties converted to cm^-1, with
     * the covariance the list gives (its correlations {@code r_ij u_i u_j} plus the products
     * {@code sum_c v_ic v_jc} of the contributions of the uncertainty components two levels share;
     * {@link LevelList}), when it gives any for the species.
     *
     * @param list    a level list (any wavenumber or energy unit)
     * @param species one of its species
     * @return that species' levels, in the list's order, with the list's info as their data set
     * @throws IllegalArgumentException when the list has no row of the species, or a label's J
     *                                  disagrees with its j column (naming the level)
     */
    public static RitzLevels of(LevelList list, Species species) {
        Objects.requireNonNull(list, "list");
        Objects.requireNonNull(species, "species");
        double[] factor = {1.0};
        SpectralArrays.convert(factor, list.unit(), null, Unit.PER_CENTIMETRE, null, factor);
        Builder b = builder(species).info(list.info());
        int[] place = new int[list.size()];
        for (int i = 0; i < list.size(); i++) {
            place[i] = -1;
            if (list.species(i).equals(species)) {
                place[i] = b.labels.size();
                OptionalDouble u = list.uncertainty(i);
                b.add(list.label(i), list.energy(i) * factor[0],
                        u.isPresent() ? u.getAsDouble() * factor[0] : Double.NaN,
                        list.twoJ(i));
            }
        }
        if (b.labels.isEmpty()) {
            throw new IllegalArgumentException("level list " + list.info().id() + " has no level of "
                    + species.notation());
        }
        RitzLevels levels = b.build();
        double[][] v = null;
        for (int k = 0; k < list.correlationCount(); k++) {
            int i = place[list.correlationRow(k)];
            int j = place[list.correlationOtherRow(k)];
            if (i < 0) {
                continue;
            }
            if (v == null) {
                v = levels.diagonalCovariance();
            }
            v[i][j] += list.correlation(k) * levels.sigma[i] * levels.sigma[j];
            v[j][i] = v[i][j];
        }
        // shared uncertainty components: sum_c v_ic v_jc off the diagonal (the diagonal stays u_i^2, the
        // contributions being parts of it); a pair with a correlation shares no component (LevelList)
        Map<String, List<double[]>> byComponent = new LinkedHashMap<>();
        for (int k = 0; k < list.shareCount(); k++) {
            int i = place[list.shareRow(k)];
            if (i >= 0) {
                byComponent.computeIfAbsent(list.shareComponent(k), c -> new ArrayList<>())
                        .add(new double[] {i, list.share(k) * factor[0]});
            }
        }
        for (List<double[]> members : byComponent.values()) {
            if (v == null) {
                v = levels.diagonalCovariance();
            }
            for (int a = 0; a < members.size(); a++) {
                int i = (int) members.get(a)[0];
                for (int c = a + 1; c < members.size(); c++) {
                    int j = (int) members.get(c)[0];
                    v[i][j] += members.get(a)[1] * members.get(c)[1];
                    v[j][i] = v[i][j];
                }
            }
        }
        return v == null ? levels : levels.withCovariance(v);
    }

    /** @return the variances on the diagonal, 0 elsewhere, cm^-2 */
    private double[][] diagonalCovariance() {
        double[][] v = new double[size()][size()];
        for (int i = 0; i < v.length; i++) {
            v[i][i] = sigma[i] * sigma[i];
        }
        return v;
    }

    /**
     * These levels as a level list of one species in cm^-1: each level's energy and standard
     * uncertainty, and, where a covariance is given, the correlation coefficient
     * {@code r_ij = V_ij / (u_i u_j)} of every pair with a covariance other than 0 and both
     * uncertainties above 0 ({@link LevelList.Builder#correlate}), so that the list gives the
     * covariance back within rounding (a few units in the last place of each entry).
     *
     * @param set what the list is (kind levels); its species should be this set's
     * @return the level list, j where the label gives it, no notes
     * @throws IllegalArgumentException when a level has no uncertainty while a covariance is given
     *                                  (cannot happen: {@link #withCovariance} sets every one)
     */
    public LevelList toLevelList(DataSetInfo set) {
        LevelList.Builder b = LevelList.builder(set, Unit.PER_CENTIMETRE, "");
        for (int i = 0; i < size(); i++) {
            b.add(species, label[i], energy[i], sigma[i], designation[i].twoJ(), null);
        }
        if (covariance != null) {
            for (int i = 0; i < size(); i++) {
                for (int j = i + 1; j < size(); j++) {
                    if (covariance[i][j] != 0 && sigma[i] > 0 && sigma[j] > 0) {
                        double r = covariance[i][j] / (sigma[i] * sigma[j]);
                        b.correlate(i, j, Math.max(-1, Math.min(1, r)));
                    }
                }
            }
        }
        return b.build();
    }

    /**
     * Replaces the levels' uncertainties by a covariance of their energies.
     *
     * <p>A covariance matrix must be symmetric and positive semidefinite (common practice: every
     * variance of a combination {@code a^T V a}, such as a line's {@code V_uu + V_ll - 2 V_ul}, is then
     * not negative). Checked within rounding, in this order, the first failure refused: the shape;
     * every entry finite; symmetry, {@code |V_ij - V_ji| <= 1e-12 max(|V_ij|, |V_ji|)}; a diagonal not
     * below 0; every pair within the Cauchy-Schwarz bound, {@code |V_ij| <= sqrt(V_ii V_jj) + tol};
     * then every eigenvalue of the matrix at or above {@code -tol}, with {@code tol = 1e-10 n max_i V_ii}
     * (n levels; the eigenvalues of a symmetric matrix are computed to about machine precision times
     * its norm, which is at most {@code n max_i V_ii}). A failure there names the first level whose row
     * makes the matrix indefinite (the smallest leading block of levels that is not semidefinite).
     * Eigenvalues by Apache Commons Math's {@code EigenDecomposition} of the symmetrised matrix.
     * The diagonal need not agree with the uncertainties given before: it replaces them.
     *
     * @param cm2 the covariance of the level energies in cm^-2, n by n in this set's order
     * @return these levels with that covariance (a copy); the standard uncertainties become the
     *         square roots of its diagonal
     * @throws RitzException ({@link RitzException#BAD_COVARIANCE}) naming the levels or entry at fault
     */
    public RitzLevels withCovariance(double[][] cm2) {
        Objects.requireNonNull(cm2, "cm2");
        int n = size();
        if (cm2.length != n) {
            throw new RitzException(RitzException.BAD_COVARIANCE, "the covariance has " + cm2.length
                    + " rows for " + n + " levels");
        }
        double[][] copy = new double[n][];
        for (int i = 0; i < n; i++) {
            if (cm2[i] == null || cm2[i].length != n) {
                throw new RitzException(RitzException.BAD_COVARIANCE, "covariance row " + (i + 1) + " has "
                        + (cm2[i] == null ? 0 : cm2[i].length) + " entries for " + n + " levels");
            }
            copy[i] = cm2[i].clone();
        }
        double maxDiagonal = 0;
        double[] s = new double[n];
        for (int i = 0; i < n; i++) {
            if (!(copy[i][i] >= 0) || Double.isInfinite(copy[i][i])) {
                throw new RitzException(RitzException.BAD_COVARIANCE, "covariance of level '" + label[i]
                        + "' with itself (row " + (i + 1) + ") must be finite and not negative, got " + copy[i][i]);
            }
            s[i] = Math.sqrt(copy[i][i]);
            maxDiagonal = Math.max(maxDiagonal, copy[i][i]);
            for (int j = 0; j < i; j++) {
                double a = copy[i][j];
                double b = copy[j][i];
                if (!Double.isFinite(a) || !Double.isFinite(b)
                        || Math.abs(a - b) > 1e-12 * Math.max(Math.abs(a), Math.abs(b))) {
                    throw new RitzException(RitzException.BAD_COVARIANCE, "covariance of levels '" + label[i]
                            + "' and '" + label[j] + "' (row " + (i + 1) + ", column " + (j + 1)
                            + ") is not symmetric and finite: " + a + " and " + b);
                }
            }
        }
        double tol = 1e-10 * n * maxDiagonal;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < i; j++) {
                double bound = s[i] * s[j];
                if (Math.abs(copy[i][j]) > bound + tol) {
                    throw new RitzException(RitzException.BAD_COVARIANCE, String.format(Locale.ROOT,
                            "covariance of levels '%s' and '%s' (row %d, column %d) is %s cm-2, beyond "
                            + "sqrt(%s * %s) = %s cm-2 that their variances allow (correlation %.6g): the matrix is "
                            + "not positive semidefinite", label[i], label[j], i + 1, j + 1, copy[i][j], copy[i][i],
                            copy[j][j], bound, copy[i][j] / bound));
                }
            }
        }
        int at = firstIndefiniteLevel(copy);
        if (at >= 0) {
            int lo = at + 1;
            throw new RitzException(RitzException.BAD_COVARIANCE, String.format(Locale.ROOT,
                    "the covariance is not positive semidefinite: with level '%s' (row %d) the first %d levels "
                    + "have an eigenvalue %s cm-2, below -%s cm-2 (rounding); check its covariances with the "
                    + "levels before it", label[lo - 1], lo, lo, smallestEigenvalue(copy, lo), tol));
        }
        return new RitzLevels(species, info, label, energy, s, designation, copy);
    }

    /**
     * Where a symmetric matrix stops being positive semidefinite: the smallest leading block of it
     * with an eigenvalue below {@code -1e-10 n max_i V_ii} (the rounding tolerance of
     * {@link #withCovariance}); once a leading block is indefinite every larger one is, so the last
     * row of that block is the first level whose covariances with the levels before it cannot be.
     *
     * @param cm2 a square matrix, symmetric within rounding (cm^-2, or any unit squared)
     * @return the 0-based index of that level, or -1 when the whole matrix is positive semidefinite
     *         within the tolerance
     */
    public static int firstIndefiniteLevel(double[][] cm2) {
        int n = cm2.length;
        double maxDiagonal = 0;
        for (int i = 0; i < n; i++) {
            maxDiagonal = Math.max(maxDiagonal, cm2[i][i]);
        }
        double tol = 1e-10 * n * maxDiagonal;
        if (n == 0 || shiftedCholeskySucceeds(cm2, tol) || smallestEigenvalue(cm2, n) >= -tol) {
            return -1;
        }
        int lo = 1;
        int hi = n;
        while (lo < hi) {
            int mid = (lo + hi) / 2;
            if (smallestEigenvalue(cm2, mid) < -tol) {
                hi = mid;
            } else {
                lo = mid + 1;
            }
        }
        return lo - 1;
    }

    /**
     * The fast way to the common answer: the Cholesky decomposition of {@code V + tol I} succeeds (every
     * pivot above 0) exactly when every eigenvalue of V lies above {@code -tol} (common practice: a
     * symmetric matrix is positive definite if and only if it has a Cholesky factor; the factorisation
     * is backward stable, its rounding of order n eps max V_ii far below tol). When it fails, the
     * eigenvalues decide (a matrix on the boundary, or one to report).
     *
     * @return whether V + tol I has a Cholesky factor (symmetrised from the lower triangle)
     */
    private static boolean shiftedCholeskySucceeds(double[][] v, double tol) {
        int n = v.length;
        double[][] l = new double[n][];
        for (int i = 0; i < n; i++) {
            l[i] = new double[i + 1];
            for (int j = 0; j <= i; j++) {
                double sum = 0.5 * (v[i][j] + v[j][i]) + (i == j ? tol : 0);
                double[] li = l[i];
                double[] lj = l[j];
                for (int k = 0; k < j; k++) {
                    sum -= li[k] * lj[k];
                }
                if (i == j) {
                    if (!(sum > 0)) {
                        return false;
                    }
                    li[i] = Math.sqrt(sum);
                } else {
                    li[j] = sum / lj[j];
                }
            }
        }
        return true;
    }

    /** @return the smallest eigenvalue of the leading m by m block of the (symmetric within rounding) v */
    private static double smallestEigenvalue(double[][] v, int m) {
        double[][] block = new double[m][m];
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < m; j++) {
                block[i][j] = 0.5 * (v[i][j] + v[j][i]);
            }
        }
        double[] eigen = new EigenDecomposition(new Array2DRowRealMatrix(block, false)).getRealEigenvalues();
        double min = Double.POSITIVE_INFINITY;
        for (double e : eigen) {
            min = Math.min(min, e);
        }
        return min;
    }

    /**
     * @param other the species to give these levels (e.g. an isotope for a natural element's list)
     * @return the same levels under that species
     */
    public RitzLevels withSpecies(Species other) {
        return new RitzLevels(Objects.requireNonNull(other, "other"), info, label, energy, sigma, designation,
                covariance);
    }

    /** @return the species */
    public Species species() {
        return species;
    }

    /** @return the data set the levels come from, where known */
    public Optional<DataSetInfo> info() {
        return info;
    }

    /** @return the number of levels */
    public int size() {
        return label.length;
    }

    /**
     * @param i level index
     * @return its label
     */
    public String label(int i) {
        return label[i];
    }

    /**
     * @param text a label
     * @return its index, or -1 when no level has it
     */
    public int indexOf(String text) {
        Integer i = index.get(text);
        return i == null ? -1 : i;
    }

    /**
     * @param i level index
     * @return its energy above the ground level, cm^-1
     */
    public double energyPerCm(int i) {
        return energy[i];
    }

    /**
     * @param i level index
     * @return the standard uncertainty of its energy, cm^-1, where known
     */
    public OptionalDouble uncertaintyPerCm(int i) {
        return Double.isNaN(sigma[i]) ? OptionalDouble.empty() : OptionalDouble.of(sigma[i]);
    }

    /**
     * @param i level index
     * @return what its label says about parity, term and J
     */
    public LevelDesignation designation(int i) {
        return designation[i];
    }

    /** @return whether a covariance was given */
    public boolean hasCovariance() {
        return covariance != null;
    }

    /**
     * @param i a level
     * @param j another (or the same) level
     * @return the covariance of their energies, cm^-2: the given covariance, else the variance on
     *         the diagonal and 0 off it; NaN when an uncertainty is not known (internal use)
     */
    double covariance(int i, int j) {
        if (covariance != null) {
            return covariance[i][j];
        }
        return i == j ? sigma[i] * sigma[i] : (Double.isNaN(sigma[i]) || Double.isNaN(sigma[j]) ? Double.NaN : 0);
    }

    /**
     * @param upper a level
     * @param lower another level
     * @return the standard uncertainty of {@code E_upper - E_lower}, cm^-1,
     *         {@code sqrt(V_uu + V_ll - 2 V_ul)}; NaN when an uncertainty is not known
     */
    double differenceSigma(int upper, int lower) {
        double v = covariance(upper, upper) + covariance(lower, lower) - 2 * covariance(upper, lower);
        return Double.isNaN(v) ? Double.NaN : Math.sqrt(Math.max(0, v));
    }

    @Override
    public String toString() {
        return "RitzLevels[" + species.notation() + ", " + size() + " levels" + (covariance == null ? "" : ", covariance")
                + "]";
    }

    /** Collects levels; not thread-safe. */
    public static final class Builder {
        private final Species species;
        private DataSetInfo info;
        private final List<String> labels = new ArrayList<>();
        private final List<double[]> values = new ArrayList<>();
        private final List<LevelDesignation> designations = new ArrayList<>();

        private Builder(Species species) {
            this.species = species;
        }

        /**
         * @param set the data set the levels come from
         * @return this builder
         */
        public Builder info(DataSetInfo set) {
            this.info = Objects.requireNonNull(set, "set");
            return this;
        }

        /**
         * @param label   the level's label (see {@link LevelDesignation}), not blank, unique
         * @param perCm   its energy above the ground level, cm^-1, finite, not negative
         * @param sigmaCm its standard uncertainty, cm^-1, finite and not negative, or NaN when not known;
         *                a level at energy exactly 0 given no uncertainty is the zero of the scale (the
         *                reference level the other energies are measured from), exact by definition, so
         *                it gets 0
         * @param twoJ    twice J, or -1 to take J from the label (or leave it unknown)
         * @return this builder
         * @throws IllegalArgumentException naming the level and the bad value
         */
        public Builder add(String label, double perCm, double sigmaCm, int twoJ) {
            if (label == null || label.isBlank()) {
                throw new IllegalArgumentException("level " + (labels.size() + 1) + ": the label must not be blank");
            }
            if (!(perCm >= 0) || Double.isInfinite(perCm)) {
                throw new IllegalArgumentException("level '" + label + "': energy must be finite and not negative "
                        + "cm-1, got " + perCm);
            }
            if (!Double.isNaN(sigmaCm) && (!(sigmaCm >= 0) || Double.isInfinite(sigmaCm))) {
                throw new IllegalArgumentException("level '" + label + "': uncertainty must be finite and not "
                        + "negative cm-1, got " + sigmaCm);
            }
            designations.add(LevelDesignation.parse(label, twoJ));
            labels.add(label);
            values.add(new double[] {perCm, perCm == 0 && Double.isNaN(sigmaCm) ? 0 : sigmaCm});
            return this;
        }

        /**
         * @return the levels
         * @throws IllegalArgumentException when a label is given twice
         */
        public RitzLevels build() {
            int n = labels.size();
            double[] e = new double[n];
            double[] s = new double[n];
            for (int i = 0; i < n; i++) {
                e[i] = values.get(i)[0];
                s[i] = values.get(i)[1];
            }
            return new RitzLevels(species, Optional.ofNullable(info), labels.toArray(new String[0]), e, s,
                    designations.toArray(new LevelDesignation[0]), null);
        }
    }
}
