package org.ritzwerk.engine.ritz;

/**
 * The QR factorisation of a weighted design matrix {@code A_w = Q R P^T} (rows already scaled by their
 * weights' roots) for {@link LevelOptimizer}: the least-squares solution, the covariance {@code (A_w^T
 * A_w)^-1 = P R^-1 R^-T P^T}, and, for a row {@code a} of differences of unknowns, the variance {@code a^T
 * (A_w^T A_w)^-1 a = ||R^-T P^T a||^2} by one forward substitution, without forming the difference of
 * variances that the covariance would give.
 *
 * <p>Householder QR with column pivoting (the column of largest remaining norm first; Businger and Golub
 * 1965; Golub and Van Loan, <i>Matrix Computations</i>, 4th ed., alg. 5.4.1, from memory) on rows sorted
 * by decreasing weight (the caller's order). For weighted least squares whose weights are many orders of
 * magnitude apart, this ordering makes the factorisation backward stable row by row: the computed R is that
 * of a matrix whose every row, the loose ones included, is within a few units in the last place of its own
 * size (Powell and Reid 1969; Cox and Higham, BIT 38 (1998) 21-45; N. J. Higham, <i>Accuracy and Stability
 * of Numerical Algorithms</i>, 2nd ed., section 19.4; all from memory). Without it a loose row is only
 * carried within rounding of the precise ones, which costs the variance along it a factor of the weights'
 * spread (measured: 1e-7 of the variance of a level hung on the reference by a line 1e9 times looser than
 * the others, against 4e-15 with the ordering). The forward substitution {@code R^T y = P^T a} is backward
 * stable too (Higham, ch. 8), so such a variance is that of a problem whose lines' weights are off by a few
 * parts in 1e16: measured (PreciseGroupsTest, against sympy and mpmath) within 1e-12 of itself at a spread
 * of 1e10, 2e-15 at 2.5e8.
 *
 * <p>Not thread-safe while being built; immutable after, and only used inside one optimisation.
 */
final class WeightedQr {

    /** The unknowns in pivot order: {@code order[j]} is the unknown in position j. */
    private final int[] order;
    /** The position of each unknown: the inverse of {@link #order}. */
    private final int[] position;
    /** R, upper triangular, p x p, in pivot order; r[i][j] for j >= i. */
    private final double[][] r;
    /** The Householder vectors: {@code householder[j][j..m)} is the j-th, v with H = I - v v^T / (v^T v / 2). */
    private final double[][] householder;
    /** Work space for the forward substitution. */
    private final double[] work;

    private WeightedQr(int[] order, double[][] r, double[][] householder) {
        this.order = order;
        this.r = r;
        this.householder = householder;
        int p = order.length;
        this.position = new int[p];
        for (int j = 0; j < p; j++) {
            position[order[j]] = j;
        }
        this.work = new double[p];
    }

    /**
     * Factorises the design matrix.
     *
     * @param columns the design matrix by columns, {@code columns[c][i]} the entry of row i in unknown c
     *                (rows sorted by decreasing weight); taken over (it ends holding the Householder vectors)
     * @return the factorisation, or null when the matrix is numerically rank-deficient (a diagonal of R below
     *         {@code 2^-52} of the first, or not finite)
     */
    static WeightedQr of(double[][] columns) {
        int p = columns.length;
        int m = p == 0 ? 0 : columns[0].length;
        int[] order = new int[p];
        for (int c = 0; c < p; c++) {
            order[c] = c;
        }
        double[][] r = new double[p][p];
        double first = 0;
        for (int j = 0; j < p; j++) {
            // pivot: the remaining column of largest norm over rows j..m-1 (recomputed: O(m p) a step)
            int best = j;
            double bestNorm = -1;
            for (int c = j; c < p; c++) {
                double n = norm(columns[c], j, m);
                if (n > bestNorm) {
                    bestNorm = n;
                    best = c;
                }
            }
            if (best != j) {
                double[] t = columns[j];
                columns[j] = columns[best];
                columns[best] = t;
                int o = order[j];
                order[j] = order[best];
                order[best] = o;
                for (int i = 0; i < j; i++) {
                    double s = r[i][j];
                    r[i][j] = r[i][best];
                    r[i][best] = s;
                }
            }
            double[] x = columns[j];
            double alpha = x[j] > 0 ? -bestNorm : bestNorm;
            if (j == 0) {
                first = bestNorm;
            }
            if (!(bestNorm > 0x1p-52 * first) || Double.isInfinite(bestNorm)) {
                return null;
            }
            // Householder vector v = x - alpha e_j, kept in x[j..m); H = I - v v^T / beta, beta = v^T v / 2
            x[j] -= alpha;
            double beta = -alpha * x[j];
            for (int c = j + 1; c < p; c++) {
                double[] y = columns[c];
                double d = 0;
                for (int i = j; i < m; i++) {
                    d += x[i] * y[i];
                }
                d /= beta;
                for (int i = j; i < m; i++) {
                    y[i] -= d * x[i];
                }
                r[j][c] = y[j];
            }
            r[j][j] = alpha;
        }
        return new WeightedQr(order, r, columns);
    }

    /**
     * @param b the right-hand side, per row (in the rows' order); not changed
     * @return the least-squares solution of {@code min ||A x - b||}, per unknown (not in pivot order): Q^T
     *         applied by the stored reflections, then back substitution in R
     */
    double[] solve(double[] b) {
        int p = order.length;
        double[] c = b.clone();
        for (int j = 0; j < p; j++) {
            double[] v = householder[j];
            double d = 0;
            for (int i = j; i < c.length; i++) {
                d += v[i] * c[i];
            }
            d /= -r[j][j] * v[j];
            for (int i = j; i < c.length; i++) {
                c[i] -= d * v[i];
            }
        }
        double[] z = new double[p];
        for (int i = p - 1; i >= 0; i--) {
            double s = c[i];
            for (int j = i + 1; j < p; j++) {
                s -= r[i][j] * z[j];
            }
            z[i] = s / r[i][i];
        }
        double[] solution = new double[p];
        for (int j = 0; j < p; j++) {
            solution[order[j]] = z[j];
        }
        return solution;
    }

    private static double norm(double[] x, int from, int to) {
        double scale = 0;
        for (int i = from; i < to; i++) {
            scale = Math.max(scale, Math.abs(x[i]));
        }
        if (scale == 0 || Double.isInfinite(scale)) {
            return scale;
        }
        double sum = 0;
        for (int i = from; i < to; i++) {
            double t = x[i] / scale;
            sum += t * t;
        }
        return scale * Math.sqrt(sum);
    }

    /** @return the number of unknowns */
    int size() {
        return order.length;
    }

    /**
     * The covariance {@code P R^-1 R^-T P^T}: R inverted by back substitution, then multiplied by its transpose
     * (O(p^3 / 3)). Each entry carries about the precision of the larger of its two variances, so a difference
     * of entries (the variance of a difference of unknowns) loses the ratio of the unknowns' variances to it;
     * {@link #differenceVariance} does not.
     *
     * @return the covariance of the unknowns, per unknown (not in pivot order), a new symmetric array
     */
    double[][] covariance() {
        int p = order.length;
        double[][] z = new double[p][p];           // R^-1, upper triangular
        for (int c = 0; c < p; c++) {
            z[c][c] = 1 / r[c][c];
            for (int i = c - 1; i >= 0; i--) {
                double s = 0;
                for (int t = i + 1; t <= c; t++) {
                    s += r[i][t] * z[t][c];
                }
                z[i][c] = -s / r[i][i];
            }
        }
        double[][] covariance = new double[p][p];
        for (int i = 0; i < p; i++) {
            for (int j = i; j < p; j++) {
                double s = 0;
                for (int t = j; t < p; t++) {
                    s += z[i][t] * z[j][t];
                }
                covariance[order[i]][order[j]] = s;
                covariance[order[j]][order[i]] = s;
            }
        }
        return covariance;
    }

    /**
     * @param plus  the unknown with coefficient +1 in the row, or -1 for none (a level held)
     * @param minus the unknown with coefficient -1, or -1 for none
     * @return the variance of {@code x_plus - x_minus}, {@code ||R^-T P^T a||^2}, by forward substitution
     *         from the first position the row touches (O((p - position)^2 / 2))
     */
    double differenceVariance(int plus, int minus) {
        double[] y = solveTransposed(plus, minus, work);
        double sum = 0;
        for (double v : y) {
            sum += v * v;
        }
        return sum;
    }

    /**
     * @param plus  as for {@link #differenceVariance}, for the first row
     * @param minus as for {@link #differenceVariance}, for the first row
     * @param y     {@code R^-T P^T a} of the second row (from {@link #transformed})
     * @return the covariance of the first row's difference with the second's, {@code y_1 . y_2}
     */
    double differenceCovariance(int plus, int minus, double[] y) {
        double[] x = solveTransposed(plus, minus, work);
        double sum = 0;
        for (int i = 0; i < x.length; i++) {
            sum += x[i] * y[i];
        }
        return sum;
    }

    /**
     * @param plus  as for {@link #differenceVariance}
     * @param minus as for {@link #differenceVariance}
     * @return {@code R^-T P^T a}, a new array (its squared norm the row's variance)
     */
    double[] transformed(int plus, int minus) {
        return solveTransposed(plus, minus, new double[order.length]);
    }

    private double[] solveTransposed(int plus, int minus, double[] y) {
        int p = order.length;
        int qp = plus < 0 ? p : position[plus];
        int qm = minus < 0 ? p : position[minus];
        int start = Math.min(qp, qm);
        java.util.Arrays.fill(y, 0, Math.min(start, p), 0.0);
        for (int i = start; i < p; i++) {
            double s = (i == qp ? 1 : 0) - (i == qm ? 1 : 0);
            for (int j = start; j < i; j++) {
                s -= r[j][i] * y[j];
            }
            y[i] = s / r[i][i];
        }
        return y;
    }
}
