package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
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
 * <p><b>Flags.</b> Each line's residual {@code r_k = sigma_k - sigma_Ritz,k} is compared with its
 * own standard deviation {@code sqrt(u_k^2 - u_Ritz,k^2)} (the standardised residual of weighted
 * least squares; common practice): beyond {@link #withOutlierThreshold the threshold} (3 unless
 * set) the line is flagged {@link LevelOptimum.LineFlag#OUTLIER}, a likely misassignment or blend. A
 * line that alone determines a level ({@code u_Ritz = u}, residual 0) cannot be checked and is
 * flagged {@link LevelOptimum.LineFlag#DETERMINES_LEVEL}. Flagged lines are not removed: the caller
 * decides.
 *
 * <p>Refused with a {@link RitzException}: levels that no chain of lines connects to the
 * reference ({@link RitzException#UNCONNECTED}, naming them). Immutable and thread-safe.
 */
public final class LevelOptimizer {

    private static final LevelOptimizer DEFAULTS = new LevelOptimizer(3.0);

    private final double threshold;

    private LevelOptimizer(double threshold) {
        this.threshold = threshold;
    }

    /** @return an optimizer flagging lines beyond 3 standard deviations */
    public static LevelOptimizer defaults() {
        return DEFAULTS;
    }

    /**
     * @param deviations the standardised residual beyond which a line is flagged, finite, positive
     * @return this optimizer with that threshold
     */
    public LevelOptimizer withOutlierThreshold(double deviations) {
        if (!(deviations > 0) || Double.isInfinite(deviations)) {
            throw new IllegalArgumentException("the outlier threshold must be finite and positive, got " + deviations);
        }
        return new LevelOptimizer(deviations);
    }

    /** @return the outlier threshold, standard deviations */
    public double outlierThreshold() {
        return threshold;
    }

    /**
     * @param problem the measured lines and the reference level
     * @return the optimised levels, their covariance and every line's Ritz wavenumber and flag
     * @throws RitzException ({@link RitzException#UNCONNECTED}) naming the levels not connected to the reference;
     *                       ({@link RitzException#TOO_FEW}) for a problem without lines
     */
    public LevelOptimum optimize(MeasuredLines problem) {
        Objects.requireNonNull(problem, "problem");
        if (problem.size() == 0) {
            throw new RitzException(RitzException.TOO_FEW, "no measured lines: the levels need at least one line "
                    + "joining them to the reference level");
        }
        int levels = problem.levels().size();
        int lines = problem.size();
        checkConnected(problem);
        int p = levels - 1;                     // unknowns: every level but the reference (index 0)
        double ref = problem.referencePerCm();
        double[][] a = new double[lines][p];
        double[] b = new double[lines];
        for (int k = 0; k < lines; k++) {
            double w = 1 / problem.uncertaintyPerCm(k);
            int u = problem.upper(k);
            int l = problem.lower(k);
            double rhs = problem.wavenumberPerCm(k);
            if (u == 0) {
                rhs -= ref;
            } else {
                a[k][u - 1] += w;
            }
            if (l == 0) {
                rhs += ref;
            } else {
                a[k][l - 1] -= w;
            }
            b[k] = rhs * w;
        }
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
        double[] energy = new double[levels];
        double[][] covariance = new double[levels][levels];
        energy[0] = ref;
        for (int i = 1; i < levels; i++) {
            energy[i] = solution[i - 1];
            for (int j = 1; j < levels; j++) {
                covariance[i][j] = 0.5 * (inverse[i - 1][j - 1] + inverse[j - 1][i - 1]);
            }
        }
        double[] ritz = new double[lines];
        double[] ritzSigma = new double[lines];
        double[] standardised = new double[lines];
        LevelOptimum.LineFlag[] flags = new LevelOptimum.LineFlag[lines];
        double chi2 = 0;
        for (int k = 0; k < lines; k++) {
            int u = problem.upper(k);
            int l = problem.lower(k);
            ritz[k] = energy[u] - energy[l];
            double v = Math.max(0, covariance[u][u] + covariance[l][l] - 2 * covariance[u][l]);
            ritzSigma[k] = Math.sqrt(v);
            double s = problem.uncertaintyPerCm(k);
            double r = problem.wavenumberPerCm(k) - ritz[k];
            chi2 += r * r / (s * s);
            double rest = s * s - v;
            if (rest <= 1e-9 * s * s) {
                standardised[k] = Double.NaN;
                flags[k] = LevelOptimum.LineFlag.DETERMINES_LEVEL;
            } else {
                standardised[k] = r / Math.sqrt(rest);
                flags[k] = Math.abs(standardised[k]) > threshold ? LevelOptimum.LineFlag.OUTLIER
                        : LevelOptimum.LineFlag.FITTED;
            }
        }
        return new LevelOptimum(problem, energy, covariance, ritz, ritzSigma, standardised, flags, chi2, lines - p,
                threshold);
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
        return "LevelOptimizer[outliers beyond " + threshold + " standard deviations]";
    }
}
