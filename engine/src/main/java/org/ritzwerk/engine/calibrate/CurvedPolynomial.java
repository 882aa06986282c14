package org.ritzwerk.engine.calibrate;

/**
 * The lamp matcher's polynomial: a least-squares fit of wavelength against the scaled pixel
 * x in [-1, 1] with Gaussian priors on the curvature terms, so that a handful of close pairs
 * already gives a usable polynomial and an honest prediction uncertainty far from them.
 *
 * <p><b>Model.</b> y = sum a_m x^m, m = 0 .. D, with independent Gaussian errors of standard
 * deviation {@code noise} on y, a flat prior on a_0 and a_1, and a_m ~ N(0, s_m^2) for m &gt;= 2.
 * The posterior is Gaussian with precision A = X^T X / noise^2 + diag(0, 0, 1/s_2^2, ...) and
 * mean A^-1 X^T y / noise^2; the prediction at x has variance phi(x)^T A^-1 phi(x), phi(x) =
 * (1, x, x^2, ...). This is Bayesian linear regression with a Gaussian prior (ridge on the
 * curvature terms only); C. M. Bishop, Pattern Recognition and Machine Learning (Springer, 2006),
 * section 3.3, eqs. 3.53-3.54 and 3.58-3.59. Solved by Cholesky factorisation of the (D+1)^2
 * precision matrix; no object is made per point.
 *
 * <p>Not thread-safe (scratch arrays); one per search.
 */
final class CurvedPolynomial {

    private final int terms;
    private final double[][] precision;
    private final double[][] factor;
    private final double[] rhs;
    private final double[] mean;
    private final double[] phi;
    private final double[] work;
    private double weight;

    /** @param degree D, 1 to 5 */
    CurvedPolynomial(int degree) {
        terms = degree + 1;
        precision = new double[terms][terms];
        factor = new double[terms][terms];
        rhs = new double[terms];
        mean = new double[terms];
        phi = new double[terms];
        work = new double[terms];
    }

    /**
     * Starts a fit with no points: {@link #add} and {@link #remove} points, then {@link #solveNow}
     * (again after every change; the normal equations are updated, not rebuilt).
     *
     * @param noise      standard deviation of y, &gt; 0
     * @param priorSigma s_m for m = 0 .. D; entries 0 and 1 are ignored (flat), others &gt; 0
     */
    void reset(double noise, double[] priorSigma) {
        weight = 1 / (noise * noise);
        for (int r = 0; r < terms; r++) {
            java.util.Arrays.fill(precision[r], 0);
            rhs[r] = 0;
        }
        for (int m = 2; m < terms; m++) {
            precision[m][m] += 1 / (priorSigma[m] * priorSigma[m]);
        }
    }

    /** Adds the point (x, y) to the incremental fit. */
    void add(double x, double y) {
        update(x, y, weight);
    }

    /** Removes a point added before. */
    void remove(double x, double y) {
        update(x, y, -weight);
    }

    private void update(double x, double y, double w) {
        double power = 1;
        for (int r = 0; r < terms; r++) {
            phi[r] = power;
            power *= x;
        }
        for (int r = 0; r < terms; r++) {
            rhs[r] += w * phi[r] * y;
            for (int c = 0; c <= r; c++) {
                precision[r][c] += w * phi[r] * phi[c];
            }
        }
    }

    /** @return whether the incremental fit's points determine a_0 and a_1 (then solved) */
    boolean solveNow() {
        return factorAndSolve();
    }

    /** Cholesky factorisation of the precision matrix, then the posterior mean. */
    private boolean factorAndSolve() {
        // Cholesky: precision = L L^T, lower triangle in factor.
        for (int r = 0; r < terms; r++) {
            for (int c = 0; c <= r; c++) {
                double sum = precision[r][c];
                for (int k = 0; k < c; k++) {
                    sum -= factor[r][k] * factor[c][k];
                }
                if (r == c) {
                    if (!(sum > 1e-12 * Math.max(1e-300, precision[r][r]))) {
                        return false;
                    }
                    factor[r][r] = Math.sqrt(sum);
                } else {
                    factor[r][c] = sum / factor[c][c];
                }
            }
        }
        solve(rhs, mean);
        return true;
    }

    /** Solves L L^T v = b. */
    private void solve(double[] b, double[] v) {
        for (int r = 0; r < terms; r++) {
            double sum = b[r];
            for (int k = 0; k < r; k++) {
                sum -= factor[r][k] * work[k];
            }
            work[r] = sum / factor[r][r];
        }
        for (int r = terms - 1; r >= 0; r--) {
            double sum = work[r];
            for (int k = r + 1; k < terms; k++) {
                sum -= factor[k][r] * v[k];
            }
            v[r] = sum / factor[r][r];
        }
    }

    /** @return the posterior mean coefficients (a copy) */
    double[] coefficients() {
        return mean.clone();
    }

    /** @return a_1 of the last fit */
    double slope() {
        return mean[1];
    }

    /** @param x scaled abscissa @return the posterior mean at x */
    double value(double x) {
        return PolynomialLeastSquares.evaluate(mean, x);
    }

    /** @param x scaled abscissa @return the derivative of the posterior mean in x */
    double derivative(double x) {
        return PolynomialLeastSquares.derivative(mean, x);
    }

    /** @param x scaled abscissa @return the standard deviation of the prediction at x */
    double sigma(double x) {
        // phi^T A^-1 phi = |L^-1 phi|^2
        double power = 1;
        double sum = 0;
        for (int r = 0; r < terms; r++) {
            phi[r] = power;
            power *= x;
        }
        for (int r = 0; r < terms; r++) {
            double s = phi[r];
            for (int k = 0; k < r; k++) {
                s -= factor[r][k] * work[k];
            }
            work[r] = s / factor[r][r];
            sum += work[r] * work[r];
        }
        return Math.sqrt(sum);
    }
}
