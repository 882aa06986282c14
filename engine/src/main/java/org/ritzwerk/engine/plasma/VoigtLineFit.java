package org.ritzwerk.engine.plasma;

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
import org.ritzwerk.engine.profile.Profiles;

/**
 * A least-squares fit of one spectral line as a Voigt profile whose Gaussian width is known (the
 * instrument and Doppler parts) and whose Lorentzian width is sought (the Stark width, for
 * example), on a straight baseline. Unresolved companions (an isotope's line, say) can ride along
 * at fixed offsets and fixed flux ratios, sharing the widths. Levenberg-Marquardt (Apache
 * Commons Math) with a central-difference Jacobian; parameter uncertainties from the covariance
 * scaled by the reduced chi-square.
 *
 * <p>The model value of a pixel is the profile at its centre times its width (the flux in it to
 * second order in the pixel width over the line width). Stateless and thread-safe.
 */
final class VoigtLineFit {

    private static final int FLUX = 0;
    private static final int CENTRE = 1;
    private static final int LORENTZ = 2;
    private static final int B0 = 3;
    private static final int B1 = 4;

    /**
     * The fit.
     *
     * @param flux                  line flux (companions excluded), in y times x units
     * @param fluxSigma             its standard uncertainty
     * @param centre                line centre, x units
     * @param centreSigma           its standard uncertainty
     * @param lorentzFwhm           Lorentzian FWHM, x units
     * @param lorentzFwhmSigma      its standard uncertainty
     * @param reducedChiSquare      chi-square per degree of freedom
     */
    public record Result(double flux, double fluxSigma, double centre, double centreSigma, double lorentzFwhm,
            double lorentzFwhmSigma, double reducedChiSquare) {
    }

    private VoigtLineFit() {
    }

    /**
     * @param x                 pixel centres (e.g. nm), increasing, at least 8
     * @param y                 values (e.g. counts)
     * @param sigma             standard uncertainties of y, positive; or null for equal weights
     * @param gaussianFwhm      the known Gaussian FWHM, x units, not negative
     * @param companionOffsets  companions' offsets from the line, x units (empty for none)
     * @param companionRatios   companions' fluxes relative to the line's, not negative
     * @param centreGuess       a starting centre
     * @return the fit
     * @throws IllegalArgumentException for unusable input, or when the fit does not converge
     */
    public static Result fit(double[] x, double[] y, double[] sigma, double gaussianFwhm, double[] companionOffsets,
            double[] companionRatios, double centreGuess) {
        int n = x.length;
        if (n < 8 || y.length != n || (sigma != null && sigma.length != n)) {
            throw new IllegalArgumentException("need at least 8 points with one value (and sigma) each, got " + n);
        }
        if (companionOffsets.length != companionRatios.length) {
            throw new IllegalArgumentException("one ratio per companion offset: " + companionOffsets.length + " and "
                    + companionRatios.length);
        }
        if (!(gaussianFwhm >= 0) || Double.isInfinite(gaussianFwhm)) {
            throw new IllegalArgumentException("Gaussian FWHM must be finite and >= 0, got " + gaussianFwhm);
        }
        double[] w = new double[n];
        double[] width = new double[n];
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(x[i]) || !Double.isFinite(y[i]) || (i > 0 && !(x[i] > x[i - 1]))) {
                throw new IllegalArgumentException("point " + i + ": x must rise and x, y be finite");
            }
            w[i] = sigma == null ? 1 : 1 / sigma[i];
            if (!(w[i] > 0) || Double.isInfinite(w[i])) {
                throw new IllegalArgumentException("point " + i + ": sigma must be finite and positive");
            }
            width[i] = 0.5 * ((i + 1 < n ? x[i + 1] : x[i]) - (i > 0 ? x[i - 1] : x[i])) * (i > 0 && i + 1 < n ? 1 : 2);
        }
        double mid = 0.5 * (x[0] + x[n - 1]);
        double half = 0.5 * (x[n - 1] - x[0]);
        double edge = Math.min(y[0], y[n - 1]);
        double area = 0;
        for (int i = 0; i < n; i++) {
            area += (y[i] - edge) * width[i];
        }
        double total = 1;
        for (double r : companionRatios) {
            total += r;
        }
        double[] start = {Math.max(area / total, 1e-12), centreGuess, Math.max(0.5 * gaussianFwhm, 0.01 * half), edge,
            0};
        double[] target = new double[n];
        for (int i = 0; i < n; i++) {
            target[i] = y[i] * w[i];
        }
        MultivariateJacobianFunction model = point -> {
            double[] q = point.toArray();
            double[] value = values(q, x, width, mid, half, gaussianFwhm, companionOffsets, companionRatios);
            double[][] jacobian = new double[n][q.length];
            for (int j = 0; j < q.length; j++) {
                double step = 1e-6 * Math.max(Math.abs(q[j]), j == CENTRE || j == LORENTZ ? half * 1e-3 : 1);
                double[] up = q.clone();
                double[] down = q.clone();
                up[j] += step;
                down[j] -= step;
                double[] vu = values(up, x, width, mid, half, gaussianFwhm, companionOffsets, companionRatios);
                double[] vd = values(down, x, width, mid, half, gaussianFwhm, companionOffsets, companionRatios);
                for (int i = 0; i < n; i++) {
                    jacobian[i][j] = (vu[i] - vd[i]) / (2 * step) * w[i];
                }
            }
            for (int i = 0; i < n; i++) {
                value[i] *= w[i];
            }
            return new Pair<RealVector, RealMatrix>(new ArrayRealVector(value, false),
                    new Array2DRowRealMatrix(jacobian, false));
        };
        LeastSquaresProblem problem = new LeastSquaresBuilder().start(start).target(target).model(model)
                .parameterValidator(point -> {
                    point.setEntry(LORENTZ, Math.max(1e-9 * half, Math.abs(point.getEntry(LORENTZ))));
                    return point;
                })
                .maxEvaluations(5000).maxIterations(1000).lazyEvaluation(false).build();
        try {
            LeastSquaresOptimizer.Optimum optimum = new LevenbergMarquardtOptimizer().optimize(problem);
            double[] q = optimum.getPoint().toArray();
            double chiSquare = optimum.getResiduals().dotProduct(optimum.getResiduals());
            double reduced = chiSquare / Math.max(1, n - q.length);
            double[][] covariance = optimum.getCovariances(1e-14).getData();
            double scale = sigma == null ? reduced : Math.max(1, reduced);
            return new Result(q[FLUX], Math.sqrt(covariance[FLUX][FLUX] * scale), q[CENTRE],
                    Math.sqrt(covariance[CENTRE][CENTRE] * scale), q[LORENTZ],
                    Math.sqrt(covariance[LORENTZ][LORENTZ] * scale), reduced);
        } catch (MathIllegalStateException | SingularMatrixException e) {
            throw new IllegalArgumentException("the Voigt fit did not converge: " + e.getMessage(), e);
        }
    }

    private static double[] values(double[] q, double[] x, double[] width, double mid, double half, double g,
            double[] offsets, double[] ratios) {
        double[] v = new double[x.length];
        double l = Math.abs(q[LORENTZ]);
        for (int i = 0; i < x.length; i++) {
            double profile = Profiles.voigt(x[i] - q[CENTRE], g, l);
            for (int k = 0; k < offsets.length; k++) {
                profile += ratios[k] * Profiles.voigt(x[i] - q[CENTRE] - offsets[k], g, l);
            }
            v[i] = q[B0] + q[B1] * (x[i] - mid) / half + q[FLUX] * profile * width[i];
        }
        return v;
    }
}
