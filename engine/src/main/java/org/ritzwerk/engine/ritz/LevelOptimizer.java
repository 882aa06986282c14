package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import org.apache.commons.math4.legacy.linear.Array2DRowRealMatrix;
import org.apache.commons.math4.legacy.linear.ArrayRealVector;
import org.apache.commons.math4.legacy.linear.CholeskyDecomposition;
import org.apache.commons.math4.legacy.linear.NonPositiveDefiniteMatrixException;
import org.apache.commons.math4.legacy.linear.QRDecomposition;
import org.apache.commons.math4.legacy.linear.RealMatrix;
import org.apache.commons.math4.legacy.linear.SingularMatrixException;

/**
 * Level energies from measured line wavenumbers by weighted least squares: each line is an
 * observation {@code sigma_k = E_upper(k) - E_lower(k)} with weight {@code 1 / u_k^2}, one reference
 * level is held at its given energy, and the energies E minimise
 * {@code chi^2 = sum_k ((sigma_k - E_upper(k) + E_lower(k)) / u_k)^2}. Their covariance is
 * {@code (A^T W A)^-1}; every line's Ritz wavenumber and its standard uncertainty follow from the
 * energies and that covariance, correlations included. This is weighted linear least squares
 * applied to the Ritz combination principle, the way evaluators of atomic spectra optimise level
 * energies (common practice): the normal equations {@code (A^T W A) E = A^T W sigma}, A the
 * incidence matrix of lines and levels (+1 upper, -1 lower), and the first-order propagation of
 * the covariance to each Ritz wavenumber, {@code u^2 = a^T (A^T W A)^-1 a} (JCGM 100:2008, eq. 13);
 * lines that alone determine a level are told apart (our naming and formats).
 *
 * <p>Solved with Apache Commons Math's QR decomposition of the weighted design matrix; the
 * covariance by its Cholesky decomposition of {@code A^T W A}.
 *
 * <p><b>Outliers.</b> Each line's residual {@code r_k = sigma_k - sigma_Ritz,k} is compared with
 * its own standard deviation {@code sqrt(u_k^2 - u_Ritz,k^2)}: the normalised residual of weighted
 * least squares with known uncertainties, which equals the leave-one-out (deleted) residual
 * {@code r_k / (1 - h_k)} over its standard deviation {@code u_k / sqrt(1 - h_k)}, h_k =
 * {@code u_Ritz,k^2 / u_k^2} the line's leverage (Cook and Weisberg, <i>Residuals and Influence in
 * Regression</i>, 1982, ch. 2, from memory; with the variance known, the internally and externally studentised
 * residuals coincide). Outliers are found the way evaluators and surveyors do (iterative data
 * snooping, W. Baarda 1968, from memory; common practice): the line with the largest normalised residual beyond
 * {@link #withOutlierThreshold the threshold} (3 unless set) is left out and the levels are fitted
 * again, until no kept line exceeds it. A misassigned line drags the levels it touches, so the other
 * lines' residuals are only meaningful once it is out; one line at a time keeps an honest line from
 * being left out with it. Between removals the fit is not redone from scratch but downdated by one
 * line (a rank-one update of the covariance, exact but for rounding); once no line exceeds the
 * threshold the kept lines are fitted from scratch and judged again, so the result is that of a fit
 * of the lines kept. The levels, their covariance, chi^2 and the degrees of freedom come from the
 * lines kept; every line, kept or not, has its residual against that final fit. A line left out is
 * flagged {@link LevelOptimum.LineFlag#OUTLIER} ({@link LevelOptimum#leftOut()} in the order they
 * were left out) and its normalised residual is {@code r_k / sqrt(u_k^2 + u_Ritz,k^2)}, a prediction
 * from levels it did not touch; it is not taken back in, even if that later falls within the
 * threshold. When the worst line's residual is perfectly correlated with other kept lines' (with
 * it they alone join part of the level system to the rest: the only two lines of a level, two
 * measurements of one line, the lines of a single loop), their normalised residuals are equal in
 * size whatever the data, so nothing tells which is wrong. The least precise of them (the latest on
 * a tie) is left out all the same, so that their disagreement stops pulling the other levels, and
 * the ones kept are flagged {@link LevelOptimum.LineFlag#UNRESOLVED} ({@link
 * LevelOptimum#unresolvedWith} names the line left out in their place): the user must choose.
 * A kept line that alone determines a level ({@code u_Ritz = u}, residual 0) cannot be
 * checked and is flagged {@link LevelOptimum.LineFlag#DETERMINES_LEVEL} (it is never left out, so
 * every level stays connected); the others are {@link LevelOptimum.LineFlag#FITTED}.
 *
 * <p>Refused with a {@link RitzException}: levels that no chain of lines connects to the
 * reference ({@link RitzException#UNCONNECTED}, naming them); an uncertainty below 1e-12 of the
 * energy scale (the reference energy plus the largest wavenumber) or more than 1e10 times smaller than
 * the largest ({@link RitzException#BAD_VALUE}, naming the line: double precision does not carry such
 * weights through the fit); a line whose fitted upper level does not lie above its lower level
 * ({@link RitzException#BAD_ASSIGNMENT}, naming the line, both labels and energies: its assignment is
 * reversed or wrong); a level fitted more than 3 of its standard uncertainties below 0, the ground
 * level, since the reference energy is an energy above the ground level unless {@link
 * #withLevelsBelowZero} allows them ({@link
 * RitzException#BAD_ASSIGNMENT}, naming the level and the lines that set it: a line that alone sets a
 * level, entered with upper and lower swapped, puts it there). Immutable and thread-safe.
 */
public final class LevelOptimizer {

    private static final LevelOptimizer DEFAULTS = new LevelOptimizer(3.0, false, true);
    /** An uncertainty below this fraction of the energy scale is refused (see the class comment). */
    static final double RELATIVE_FLOOR = 1e-12;
    /** Uncertainties more than this factor apart are refused (see the class comment). */
    static final double SPREAD_LIMIT = 1e10;

    private final double threshold;
    private final boolean relative;
    private final boolean downdate;

    private LevelOptimizer(double threshold, boolean relative, boolean downdate) {
        this.threshold = threshold;
        this.relative = relative;
        this.downdate = downdate;
    }

    /**
     * The plain method, for comparisons (tests and the {@code LevelOptimizerBenchmark} baseline): the
     * same outlier removal with a fit from scratch after every line left out instead of a rank-one
     * downdate. Same lines left out, levels and chi^2 (equal in the tests).
     *
     * @return this optimizer refitting from scratch after every line left out
     */
    public LevelOptimizer withFullRefits() {
        return new LevelOptimizer(threshold, relative, false);
    }

    /** @return an optimizer leaving out lines beyond 3 standard deviations, one at a time */
    public static LevelOptimizer defaults() {
        return DEFAULTS;
    }

    /**
     * @param deviations the normalised residual beyond which the worst line is left out, finite, positive
     * @return this optimizer with that threshold
     */
    public LevelOptimizer withOutlierThreshold(double deviations) {
        if (!(deviations > 0) || Double.isInfinite(deviations)) {
            throw new IllegalArgumentException("the outlier threshold must be finite and positive, got " + deviations);
        }
        return new LevelOptimizer(deviations, relative, downdate);
    }

    /**
     * @param allowed true: the reference energy is a level's energy relative to some other zero, so levels
     *                may come out below 0 (a reference that is not the lowest level); false (the default):
     *                it is an energy above the ground level, and a level fitted more than 3 of its standard
     *                uncertainties below 0 is refused
     * @return this optimizer with that setting
     */
    public LevelOptimizer withLevelsBelowZero(boolean allowed) {
        return new LevelOptimizer(threshold, allowed, downdate);
    }

    /** @return whether levels may come out below 0 ({@link #withLevelsBelowZero}) */
    public boolean levelsBelowZero() {
        return relative;
    }

    /** @return the outlier threshold, standard deviations */
    public double outlierThreshold() {
        return threshold;
    }

    /**
     * @param problem the measured lines and the reference level
     * @return the optimised levels (from the lines kept), their covariance and every line's Ritz
     *         wavenumber, residual and flag
     * @throws RitzException ({@link RitzException#UNCONNECTED}) naming the levels not connected to the reference;
     *                       ({@link RitzException#TOO_FEW}) for a problem without lines;
     *                       ({@link RitzException#BAD_ASSIGNMENT}) naming a line whose fitted upper level is not
     *                       above its lower level, or a level fitted below the ground level with its lines;
     *                       ({@link RitzException#BAD_VALUE}) naming a line whose uncertainty double precision
     *                       cannot carry (see the class comment)
     */
    public LevelOptimum optimize(MeasuredLines problem) {
        Objects.requireNonNull(problem, "problem");
        if (problem.size() == 0) {
            throw new RitzException(RitzException.TOO_FEW, "no measured lines: the levels need at least one line "
                    + "joining them to the reference level");
        }
        int lines = problem.size();
        checkConnected(problem);
        checkPrecision(problem);
        boolean[] kept = new boolean[lines];
        Arrays.fill(kept, true);
        List<Integer> leftOut = new ArrayList<>();
        int[] partner = new int[lines];
        Arrays.fill(partner, -1);
        Fit fit = solve(problem, kept);
        boolean fresh = true;
        // iterative data snooping: leave out the worst line beyond the threshold, fit again
        while (true) {
            int worst = -1;
            double largest = threshold;
            for (int k = 0; k < lines; k++) {
                double z = kept[k] ? Math.abs(fit.normalised(problem, k, true)) : Double.NaN;
                if (z > largest) {
                    largest = z;
                    worst = k;
                }
            }
            if (worst < 0) {
                if (fresh) {
                    break;
                }
                // the downdated fit carries rounding: judge the lines kept once more on a fit from scratch
                fit = solve(problem, kept);
                fresh = true;
                continue;
            }
            List<Integer> mirrors = fit.mirrors(problem, kept, worst);
            if (!mirrors.isEmpty()) {
                // the data cannot tell which of these is wrong: leave out the least precise (the latest on a
                // tie), so the discrepancy stops pulling the other levels, and flag the ones kept
                mirrors.add(worst);
                int drop = worst;
                for (int m : mirrors) {
                    double um = problem.uncertaintyPerCm(m);
                    double ud = problem.uncertaintyPerCm(drop);
                    if (um > ud || (um == ud && m > drop)) {
                        drop = m;
                    }
                }
                for (int m : mirrors) {
                    if (m != drop) {
                        partner[m] = drop;
                    }
                }
                worst = drop;
            }
            kept[worst] = false;
            leftOut.add(worst);
            Fit next = downdate ? fit.without(problem, worst) : null;
            fresh = next == null;
            fit = fresh ? solve(problem, kept) : next;
        }
        double[] ritz = new double[lines];
        double[] ritzSigma = new double[lines];
        double[] standardised = new double[lines];
        LevelOptimum.LineFlag[] flags = new LevelOptimum.LineFlag[lines];
        double chi2 = 0;
        int used = 0;
        for (int k = 0; k < lines; k++) {
            int u = problem.upper(k);
            int l = problem.lower(k);
            ritz[k] = fit.energy[u] - fit.energy[l];
            if (!(ritz[k] > 0)) {
                throw new RitzException(RitzException.BAD_ASSIGNMENT, String.format(Locale.ROOT,
                        "line %d (%s): its upper level '%s' came out at %.6f cm-1, not above its lower level '%s' "
                        + "at %.6f cm-1 (Ritz wavenumber %.6f cm-1); the assignment is reversed or wrong",
                        k + 1, problem.name(k), problem.levels().get(u), fit.energy[u], problem.levels().get(l),
                        fit.energy[l], ritz[k]));
            }
            ritzSigma[k] = Math.sqrt(fit.variance(u, l));
            double s = problem.uncertaintyPerCm(k);
            standardised[k] = fit.normalised(problem, k, kept[k]);
            if (!kept[k]) {
                flags[k] = LevelOptimum.LineFlag.OUTLIER;
                continue;
            }
            double r = problem.wavenumberPerCm(k) - ritz[k];
            chi2 += r * r / (s * s);
            used++;
            if (partner[k] >= 0) {
                flags[k] = LevelOptimum.LineFlag.UNRESOLVED;
            } else if (Double.isNaN(standardised[k])) {
                flags[k] = LevelOptimum.LineFlag.DETERMINES_LEVEL;
            } else {
                flags[k] = LevelOptimum.LineFlag.FITTED;
            }
        }
        if (!relative) {
            checkAboveGround(problem, fit, kept);
        }
        return new LevelOptimum(problem, fit.energy, fit.covariance, ritz, ritzSigma, standardised, flags, chi2,
                used - (problem.levels().size() - 1), threshold, leftOut, partner);
    }

    /** The energies and covariance from the kept lines. */
    private static final class Fit {
        final double[] energy;
        final double[][] covariance;

        Fit(double[] energy, double[][] covariance) {
            this.energy = energy;
            this.covariance = covariance;
        }

        /**
         * The fit without line k by a rank-one downdate of the covariance (Sherman-Morrison, from memory;
         * the leave-one-out update of least squares, Cook and Weisberg 1982, ch. 2): with {@code g = C a},
         * {@code h = w a^T C a}, {@code w = 1 / u_k^2} and the residual r, {@code C' = C + g g^T w / (1 - h)}
         * and {@code E' = E - g w r / (1 - h)}; O(levels^2) where a refit costs a QR of lines x levels.
         *
         * @return the downdated fit, or null where {@code 1 - h < 1e-3} (a line close to alone setting a level:
         *         the update would lose digits, so the caller refits)
         */
        Fit without(MeasuredLines problem, int k) {
            int u = problem.upper(k);
            int l = problem.lower(k);
            double s = problem.uncertaintyPerCm(k);
            double w = 1 / (s * s);
            int n = energy.length;
            double[] g = new double[n];
            for (int i = 0; i < n; i++) {
                g[i] = covariance[i][u] - covariance[i][l];
            }
            double h = w * (g[u] - g[l]);
            if (!(1 - h >= 1e-3)) {
                return null;
            }
            double f = w / (1 - h);
            double r = problem.wavenumberPerCm(k) - (energy[u] - energy[l]);
            double[] e = energy.clone();
            double[][] c = new double[n][n];
            for (int i = 0; i < n; i++) {
                e[i] -= g[i] * f * r;
                for (int j = 0; j < n; j++) {
                    c[i][j] = covariance[i][j] + f * g[i] * g[j];
                }
            }
            return new Fit(e, c);
        }

        /** @return the variance of {@code E_u - E_l}, cm^-2 (rounding below 0 taken as 0) */
        double variance(int u, int l) {
            return Math.max(0, covariance[u][u] + covariance[l][l] - 2 * covariance[u][l]);
        }

        /**
         * @return the other kept lines whose residuals are perfectly correlated with line k's (correlation
         *         +-1 within 1e-9: with k they alone join one part of the level system to the rest, so
         *         their normalised residuals are equal in size whatever the data); a new mutable list
         */
        List<Integer> mirrors(MeasuredLines problem, boolean[] kept, int k) {
            List<Integer> found = new ArrayList<>();
            int uk = problem.upper(k);
            int lk = problem.lower(k);
            double sk = problem.uncertaintyPerCm(k);
            double vk = sk * sk - variance(uk, lk);
            for (int j = 0; j < kept.length; j++) {
                if (j == k || !kept[j]) {
                    continue;
                }
                int uj = problem.upper(j);
                int lj = problem.lower(j);
                double sj = problem.uncertaintyPerCm(j);
                double vj = sj * sj - variance(uj, lj);
                if (vj <= 1e-9 * sj * sj) {
                    continue;
                }
                // cov(r_j, r_k) = -a_j^T C a_k for two different lines (r = (I - A C A^T W) sigma)
                double c = covariance[uj][uk] - covariance[uj][lk] - covariance[lj][uk] + covariance[lj][lk];
                if (Math.abs(c) >= (1 - 1e-9) * Math.sqrt(vj * vk)) {
                    found.add(j);
                }
            }
            return found;
        }

        /**
         * @param kept whether line k took part in this fit
         * @return its residual over its standard deviation: {@code sqrt(u^2 - u_Ritz^2)} for a kept line
         *         (NaN when it alone determines a level), {@code sqrt(u^2 + u_Ritz^2)} for one left out
         */
        double normalised(MeasuredLines problem, int k, boolean kept) {
            int u = problem.upper(k);
            int l = problem.lower(k);
            double r = problem.wavenumberPerCm(k) - (energy[u] - energy[l]);
            double s = problem.uncertaintyPerCm(k);
            double v = variance(u, l);
            if (!kept) {
                return r / Math.sqrt(s * s + v);
            }
            double rest = s * s - v;
            return rest <= 1e-9 * s * s ? Double.NaN : r / Math.sqrt(rest);
        }
    }

    /** Weighted least squares over the kept lines (they connect every level to the reference). */
    private static Fit solve(MeasuredLines problem, boolean[] kept) {
        int levels = problem.levels().size();
        int p = levels - 1;                     // unknowns: every level but the reference (index 0)
        int rows = 0;
        for (boolean k : kept) {
            rows += k ? 1 : 0;
        }
        double ref = problem.referencePerCm();
        double[][] a = new double[rows][p];
        double[] b = new double[rows];
        int row = 0;
        for (int k = 0; k < kept.length; k++) {
            if (!kept[k]) {
                continue;
            }
            double w = 1 / problem.uncertaintyPerCm(k);
            int u = problem.upper(k);
            int l = problem.lower(k);
            double rhs = problem.wavenumberPerCm(k);
            if (u == 0) {
                rhs -= ref;
            } else {
                a[row][u - 1] += w;
            }
            if (l == 0) {
                rhs += ref;
            } else {
                a[row][l - 1] -= w;
            }
            b[row] = rhs * w;
            row++;
        }
        double[] energy = new double[levels];
        double[][] covariance = new double[levels][levels];
        energy[0] = ref;
        RealMatrix design = new Array2DRowRealMatrix(a, false);
        double[] solution;
        double[][] inverse;
        try {
            solution = new QRDecomposition(design).getSolver().solve(new ArrayRealVector(b, false)).toArray();
            RealMatrix normal = design.transpose().multiply(design);
            inverse = new CholeskyDecomposition(normal, 1e-12, 1e-14).getSolver().getInverse().getData();
        } catch (SingularMatrixException | NonPositiveDefiniteMatrixException e) {
            // connectivity was checked, so this is a numerically degenerate system (uncertainties far apart)
            throw new RitzException(RitzException.UNCONNECTED, "the level system is numerically singular: "
                    + "uncertainties span too many orders of magnitude for the lines given");
        }
        for (int i = 1; i < levels; i++) {
            energy[i] = solution[i - 1];
            for (int j = 1; j < levels; j++) {
                covariance[i][j] = 0.5 * (inverse[i - 1][j - 1] + inverse[j - 1][i - 1]);
            }
        }
        return new Fit(energy, covariance);
    }

    /**
     * Refuses uncertainties a double cannot carry through the fit: below {@value #RELATIVE_FLOOR} of
     * the problem's energy scale (the reference energy plus the largest wavenumber: the size of the level
     * energies, rounded in double precision to about 1.1e-16 of it), or more than {@value #SPREAD_LIMIT}
     * times smaller than the largest uncertainty (weights spread beyond 1e20). Measured on a three-level
     * loop (two lines of u on 100 cm-1, one of 1 cm-1 off by 0.005 cm-1; exact chi^2 2.5e-5): the chi^2
     * is off by 3e-5 of itself at u = 5e-12 of the scale, 3e-3 at 5e-13 (the error grows as the square of
     * the inverse), so the floor keeps it near 1e-3 at worst; a spread of 1e10 alone (u = 1e-6 and
     * 1e4 cm-1) leaves it right to 1e-11. Beyond these the residuals are rounding, and weights of
     * u = 1e-300 overflow.
     */
    private static void checkPrecision(MeasuredLines problem) {
        double largestWavenumber = 0;
        double largestU = 0;
        int loosest = 0;
        for (int k = 0; k < problem.size(); k++) {
            largestWavenumber = Math.max(largestWavenumber, problem.wavenumberPerCm(k));
            if (problem.uncertaintyPerCm(k) > largestU) {
                largestU = problem.uncertaintyPerCm(k);
                loosest = k;
            }
        }
        double scale = Math.abs(problem.referencePerCm()) + largestWavenumber;
        for (int k = 0; k < problem.size(); k++) {
            double u = problem.uncertaintyPerCm(k);
            if (u < RELATIVE_FLOOR * scale) {
                throw new RitzException(RitzException.BAD_VALUE, String.format(Locale.ROOT, "line %d (%s): its "
                        + "uncertainty %.3g cm-1 is below %.0e of the level energies' scale %.6g cm-1 "
                        + "(reference energy plus the largest wavenumber), finer than double precision carries through "
                        + "the fit; "
                        + "give an uncertainty of at least %.3g cm-1", k + 1, problem.name(k), u, RELATIVE_FLOOR,
                        scale, RELATIVE_FLOOR * scale));
            }
            if (largestU / u > SPREAD_LIMIT) {
                throw new RitzException(RitzException.BAD_VALUE, String.format(Locale.ROOT, "line %d (%s): its "
                        + "uncertainty %.3g cm-1 is more than %.0e times smaller than that of line %d (%s), %.3g cm-1: "
                        + "weights that far apart leave the fit to rounding; leave out the loose line or give "
                        + "uncertainties within a factor %.0e", k + 1, problem.name(k), u, SPREAD_LIMIT, loosest + 1,
                        problem.name(loosest), largestU, SPREAD_LIMIT));
            }
        }
    }

    /**
     * Refuses a level fitted below the ground level: the reference energy is an energy above the ground
     * level, so every level lies at 0 or above. The lowest level more than 3 of its standard uncertainties
     * below 0 is named with the kept lines that set it (a line that alone sets a level and is entered with
     * upper and lower swapped puts it there, with nothing to contradict it).
     */
    private static void checkAboveGround(MeasuredLines problem, Fit fit, boolean[] kept) {
        int i = -1;
        for (int j = 1; j < fit.energy.length; j++) {
            double uj = Math.sqrt(Math.max(0, fit.covariance[j][j]));
            if (fit.energy[j] + 3 * uj < 0 && (i < 0 || fit.energy[j] < fit.energy[i])) {
                i = j;
            }
        }
        if (i >= 0) {
            double u = Math.sqrt(Math.max(0, fit.covariance[i][i]));
            List<String> setting = new ArrayList<>();
            for (int k = 0; k < problem.size(); k++) {
                if (kept[k] && (problem.upper(k) == i || problem.lower(k) == i)) {
                    setting.add(String.format(Locale.ROOT, "line %d (%s: upper '%s', lower '%s', %.6f cm-1)", k + 1,
                            problem.name(k), problem.levels().get(problem.upper(k)),
                            problem.levels().get(problem.lower(k)), problem.wavenumberPerCm(k)));
                }
            }
            throw new RitzException(RitzException.BAD_ASSIGNMENT, String.format(Locale.ROOT, "level '%s' came out "
                    + "at %.6f +- %.2g cm-1, below the ground level (energies are above the ground level, the "
                    + "reference '%s' at %.6f cm-1), set by %s; the assignment may be reversed (upper and lower "
                    + "swapped) or wrong", problem.levels().get(i), fit.energy[i], u, problem.reference(),
                    problem.referencePerCm(), String.join(", ", setting)));
        }
    }

    private static void checkConnected(MeasuredLines problem) {
        int n = problem.levels().size();
        int[] parent = new int[n];
        for (int i = 0; i < n; i++) {
            parent[i] = i;
        }
        for (int k = 0; k < problem.size(); k++) {
            int a = root(parent, problem.upper(k));
            int b = root(parent, problem.lower(k));
            parent[a] = b;
        }
        List<String> loose = new ArrayList<>();
        int reference = root(parent, 0);
        for (int i = 1; i < n; i++) {
            if (root(parent, i) != reference) {
                loose.add("'" + problem.levels().get(i) + "'");
            }
        }
        if (!loose.isEmpty()) {
            throw new RitzException(RitzException.UNCONNECTED, String.format(Locale.ROOT,
                    "%d level%s not connected to the reference level '%s' by any chain of lines: %s", loose.size(),
                    loose.size() == 1 ? " is" : "s are", problem.reference(), String.join(", ", loose)));
        }
    }

    private static int root(int[] parent, int i) {
        while (parent[i] != i) {
            parent[i] = parent[parent[i]];
            i = parent[i];
        }
        return i;
    }

    @Override
    public String toString() {
        return "LevelOptimizer[outliers beyond " + threshold + " standard deviations" + (relative
                ? ", levels below 0 allowed]" : "]");
    }
}
