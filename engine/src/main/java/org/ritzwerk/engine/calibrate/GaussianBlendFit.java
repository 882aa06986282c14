package org.ritzwerk.engine.calibrate;

import org.apache.commons.math4.legacy.core.Pair;
import org.apache.commons.math4.legacy.exception.MathIllegalStateException;
import org.apache.commons.math4.legacy.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math4.legacy.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math4.legacy.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math4.legacy.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math4.legacy.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math4.legacy.linear.Array2DRowRealMatrix;
import org.apache.commons.math4.legacy.linear.ArrayRealVector;
import org.apache.commons.math4.legacy.linear.RealMatrix;
import org.apache.commons.math4.legacy.linear.RealVector;
import org.apache.commons.math4.legacy.linear.SingularMatrixException;
import org.apache.commons.numbers.gamma.ErfDifference;

/**
 * One weighted least-squares fit of K pixel-integrated Gaussians of common width on a local
 * straight-line baseline (package-private helper of {@link PeakFinder}):
 * <pre>
 *   m(i) = b0 + b1 (i - mid) / half
 *        + sum_k A_k [Phi((i + 1/2 - c_k) / s) - Phi((i - 1/2 - c_k) / s)]
 * </pre>
 * where Phi is the standard normal distribution function, so A_k is the flux (counts summed over
 * all pixels), c_k the centre in pixels and s the Gaussian's standard deviation in pixels before
 * integration over the pixel [i - 1/2, i + 1/2). The Jacobian is analytic. Minimised with the
 * Levenberg-Marquardt method of Commons Math 4.0-beta1 (Mor&eacute;'s MINPACK form: J. J. Mor&eacute;,
 * "The Levenberg-Marquardt algorithm: implementation and theory", in Numerical Analysis, ed.
 * G. A. Watson, Springer, vol. 630, 105-116 (1978), doi:10.1007/BFb0067700) on residuals divided by the pixel standard deviations, so the returned
 * covariance (J^T J)^-1 is that of the weighted problem, unscaled.
 *
 * <p>Parameter vector: {@code [b0, b1, s, A_1, c_1, ..., A_K, c_K]}. The width s may be held
 * fixed ({@link #fitFixedWidth}): it is then left out of the minimisation and its row and column
 * of the returned covariance are 0.
 */
final class GaussianBlendFit {

    static final int B0 = 0;
    static final int B1 = 1;
    static final int WIDTH = 2;
    static final int FIRST = 3;

    private static final double SQRT2 = Math.sqrt(2);
    private static final double INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI);
    private static final double MIN_WIDTH = 0.15;

    /** A converged fit. */
    record Result(double[] parameters, double[][] covariance, double chiSquare, int points) {
    }

    private GaussianBlendFit() {
    }

    /**
     * @param x      pixel indices fitted (saturated pixels already left out)
     * @param y      counts minus the estimated baseline at those pixels
     * @param sigma  standard deviations of y, positive
     * @param start  starting parameters, see the class comment
     * @param mid    the baseline's reference pixel
     * @param half   the baseline's scale in pixels, positive
     * @param lo     lowest centre allowed (pixels)
     * @param hi     highest centre allowed (pixels)
     * @param maxWidth largest s allowed (pixels)
     * @return the fit, or null when it did not converge or its covariance is singular
     */
    static Result fit(double[] x, double[] y, double[] sigma, double[] start, double mid, double half, double lo,
            double hi, double maxWidth) {
        return fit(x, y, sigma, start, mid, half, lo, hi, maxWidth, false);
    }

    /**
     * As {@link #fit}, with the width held at {@code start[WIDTH]}: for a line whose free width
     * collapsed below what the instrument allows (see {@link PeakFinder}).
     *
     * @return the fit (the width's row and column of the covariance are 0), or null as for fit
     */
    static Result fitFixedWidth(double[] x, double[] y, double[] sigma, double[] start, double mid, double half,
            double lo, double hi) {
        return fit(x, y, sigma, start, mid, half, lo, hi, start[WIDTH], true);
    }

    private static Result fit(double[] x, double[] y, double[] sigma, double[] full, double mid, double half,
            double lo, double hi, double maxWidth, boolean fixedWidth) {
        int n = x.length;
        int p = full.length;
        double width = full[WIDTH];
        // With a fixed width the optimiser sees the parameters without it (r = q less q[WIDTH]).
        int shift = fixedWidth ? 1 : 0;
        int pr = p - shift;
        double[] start = reduce(full, fixedWidth);
        double[] target = new double[n];
        for (int i = 0; i < n; i++) {
            target[i] = y[i] / sigma[i];
        }
        MultivariateJacobianFunction model = point -> {
            double[] q = expand(point.toArray(), fixedWidth, width);
            double[] value = new double[n];
            double[][] jacobian = new double[n][p];
            evaluate(q, x, mid, half, value, jacobian);
            double[][] reduced = new double[n][];
            for (int i = 0; i < n; i++) {
                double w = 1 / sigma[i];
                value[i] *= w;
                for (int j = 0; j < p; j++) {
                    jacobian[i][j] *= w;
                }
                reduced[i] = reduce(jacobian[i], fixedWidth);
            }
            return new Pair<RealVector, RealMatrix>(new ArrayRealVector(value, false),
                    new Array2DRowRealMatrix(reduced, false));
        };
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(start)
                .target(target)
                .model(model)
                .parameterValidator(point -> {
                    // Keep the width positive and the centres near their window, so that a
                    // wandering step cannot leave the data; a fit pinned there is refused later.
                    if (!fixedWidth) {
                        point.setEntry(WIDTH, Math.min(maxWidth, Math.max(MIN_WIDTH, point.getEntry(WIDTH))));
                    }
                    for (int j = FIRST + 1 - shift; j < pr; j += 2) {
                        point.setEntry(j, Math.min(hi + 1, Math.max(lo - 1, point.getEntry(j))));
                    }
                    return point;
                })
                .maxEvaluations(2000)
                .maxIterations(500)
                .lazyEvaluation(false)
                .build();
        LevenbergMarquardtOptimizer optimizer = new LevenbergMarquardtOptimizer()
                .withCostRelativeTolerance(1e-12)
                .withParameterRelativeTolerance(1e-12)
                .withOrthoTolerance(1e-12);
        try {
            LeastSquaresOptimizer.Optimum optimum = optimizer.optimize(problem);
            double[] q = expand(optimum.getPoint().toArray(), fixedWidth, width);
            double[][] reducedCovariance = optimum.getCovariances(1e-14).getData();
            double[][] covariance = new double[p][];
            for (int j = 0; j < p; j++) {
                covariance[j] = fixedWidth && j == WIDTH ? new double[p]
                        : expand(reducedCovariance[j - (fixedWidth && j > WIDTH ? 1 : 0)], fixedWidth, 0);
            }
            double chiSquare = optimum.getResiduals().dotProduct(optimum.getResiduals());
            return new Result(q, covariance, chiSquare, n);
        } catch (MathIllegalStateException | SingularMatrixException e) {
            return null;
        }
    }

    /** The parameters without the width when it is fixed, else a copy. */
    private static double[] reduce(double[] q, boolean fixedWidth) {
        if (!fixedWidth) {
            return q.clone();
        }
        double[] r = new double[q.length - 1];
        System.arraycopy(q, 0, r, 0, WIDTH);
        System.arraycopy(q, WIDTH + 1, r, WIDTH, q.length - WIDTH - 1);
        return r;
    }

    /** The full parameters from reduced ones, the width (or its covariance entry) set to {@code width}. */
    private static double[] expand(double[] r, boolean fixedWidth, double width) {
        if (!fixedWidth) {
            return r.clone();
        }
        double[] q = new double[r.length + 1];
        System.arraycopy(r, 0, q, 0, WIDTH);
        q[WIDTH] = width;
        System.arraycopy(r, WIDTH, q, WIDTH + 1, r.length - WIDTH);
        return q;
    }

    /**
     * The model and its Jacobian (unweighted).
     *
     * @param q        parameters
     * @param x        pixels
     * @param mid      baseline reference pixel
     * @param half     baseline scale
     * @param value    receives m(x_i)
     * @param jacobian receives dm/dq, or null
     */
    static void evaluate(double[] q, double[] x, double mid, double half, double[] value, double[][] jacobian) {
        int p = q.length;
        double s = q[WIDTH];
        for (int i = 0; i < x.length; i++) {
            double t = (x[i] - mid) / half;
            double m = q[B0] + q[B1] * t;
            double dWidth = 0;
            for (int j = FIRST; j < p; j += 2) {
                double flux = q[j];
                double centre = q[j + 1];
                double uPlus = (x[i] + 0.5 - centre) / s;
                double uMinus = (x[i] - 0.5 - centre) / s;
                // Phi(b) - Phi(a) = (erf(b / sqrt 2) - erf(a / sqrt 2)) / 2; Commons Numbers' ErfDifference
                // switches to erfc in the tails, where the plain difference would cancel.
                double share = 0.5 * ErfDifference.value(uMinus / SQRT2, uPlus / SQRT2);
                m += flux * share;
                if (jacobian != null) {
                    double phiPlus = INV_SQRT_2PI * Math.exp(-0.5 * uPlus * uPlus);
                    double phiMinus = INV_SQRT_2PI * Math.exp(-0.5 * uMinus * uMinus);
                    jacobian[i][j] = share;
                    jacobian[i][j + 1] = flux / s * (phiMinus - phiPlus);
                    dWidth += flux / s * (uMinus * phiMinus - uPlus * phiPlus);
                }
            }
            value[i] = m;
            if (jacobian != null) {
                jacobian[i][B0] = 1;
                jacobian[i][B1] = t;
                jacobian[i][WIDTH] = dWidth;
            }
        }
    }

    /**
     * @param q parameters
     * @param x pixel
     * @return the lines' part of the model at x (no baseline)
     */
    static double linesAt(double[] q, double x) {
        double s = q[WIDTH];
        double sum = 0;
        for (int j = FIRST; j < q.length; j += 2) {
            double uPlus = (x + 0.5 - q[j + 1]) / s;
            double uMinus = (x - 0.5 - q[j + 1]) / s;
            sum += q[j] * 0.5 * ErfDifference.value(uMinus / SQRT2, uPlus / SQRT2);
        }
        return sum;
    }
}
