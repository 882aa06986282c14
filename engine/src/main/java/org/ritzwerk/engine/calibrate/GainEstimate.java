package org.ritzwerk.engine.calibrate;

/**
 * A detector's effective gain (counts per photo-electron) estimated from the residuals of the
 * bright lines' profile fits (package-private helper of {@link PeakFinder}).
 *
 * <p><b>The idea</b> is the photon-transfer method's (common practice): in a pixel whose variance
 * is dominated by the line's own counts m (in counts), the variance is g m for a gain of g counts
 * per photo-electron, so the residuals' squares over the modelled counts estimate g. Each fitted
 * pixel i gives e_i = r_i^2 / (1 - h_i) - b_i^2, whose expectation is g m_i when the model is
 * right: r_i is the fit's residual, h_i its leverage (the diagonal of the weighted hat matrix,
 * (J_i / s_i) C (J_i / s_i)^T with C the fit's unscaled covariance and s_i the pixel's standard
 * deviation in the fit: a fitted residual is smaller than the noise by sqrt(1 - h_i)), and b_i the
 * background noise. g is the weighted least-squares slope of e on m, weights m^2 / (2 V^2) with
 * V = b^2 + g m (a squared normal deviate of variance V has variance 2 V^2), iterated to
 * convergence. Its standard deviation is the larger of the weights' (widened by the pixels'
 * scatter about g m where that is larger) and the fits' scatter about the common value (a
 * sandwich estimate over independent fits, which holds the correlation of one fit's residuals).
 * The estimate carries its degrees of freedom k, the sum of 1 - h over its pixels: a narrow line
 * fitted with three parameters leaves its few bright pixels one or two. A profile that is not
 * quite the fitted Gaussian (or a blend that passed) leaves residuals in proportion to the counts,
 * whose squares grow as m^2: e is therefore also fitted as g m + c m^2, and a c beyond
 * {@value #SIGNIFICANCE} of its standard deviations marks the estimate as the profile's
 * ({@link #profile()}), never used. Bright lines of a seeded lamp sweep whose counts are whole
 * photo-electrons had been taken to gains of 1.4 to 17 by the quantile rule alone (27 of the 400
 * exposures of refdata's lamp sweep); with the rules of {@link #exceedsOne} none is.
 *
 * <p><b>Which pixels and fits.</b> Pixels dominated by the line (g m at least b^2 and m at least
 * {@value #LEAST_ELECTRONS} photo-electrons) with a leverage below {@value #MAX_LEVERAGE}; fits
 * with a free width, no saturated pixel in their window (the caller leaves the others out) and a
 * chi-square, under the first value of g, below the 99.9th percentile of its distribution (an
 * unresolved blend or a profile that is not a Gaussian inflates the residuals: not well fitted).
 * The first value, which chooses the pixels and fits so that the choice does not follow the
 * estimate, is the median of the fits' own estimates, each divided by the median of chi-square
 * over its degrees of freedom (a fit's own estimate scatters like chi-square, skewed;
 * Wilson-Hilferty as in PeakFinder). At least {@value #MIN_FITS} such fits are needed ("bright
 * peaks"); with fewer there is no estimate.
 *
 * @param value   the gain in counts per photo-electron, NaN when there is no estimate
 * @param sigma   its standard deviation, NaN when there is no estimate
 * @param fits    how many bright, well-fitted, unsaturated fits it came from (or, with no
 *                estimate, were found)
 * @param freedom its degrees of freedom k, NaN when there is no estimate
 * @param profile whether the residuals' squares grow faster than the counts (as m^2, see above):
 *                the excess is then the profile's, and the estimate is not used
 */
record GainEstimate(double value, double sigma, int fits, double freedom, boolean profile) {

    /** Fewest bright, well-fitted fits from which the gain is estimated. */
    static final int MIN_FITS = 5;
    /**
     * The standard normal quantile (3, one-sided: probability 0.00135) whose chi-square
     * counterpart an estimate must exceed to be used instead of gain 1: under gain 1 the estimate
     * scatters like chi-square over its k degrees of freedom, so exposures whose gain is 1 keep
     * their results.
     */
    static final double SIGNIFICANCE = 3;
    /** Pixels whose leverage is at least this are left out: their residual says little of the noise. */
    static final double MAX_LEVERAGE = 0.9;
    /** Fewest photo-electrons a pixel's line counts must hold to enter the estimate. */
    static final double LEAST_ELECTRONS = 5;
    /** The range an estimate is held to, counts per photo-electron. */
    private static final double LOWEST = 1e-3;
    private static final double HIGHEST = 1e6;
    /** The standard normal quantile of 0.999. */
    private static final double Z999 = 3.090232306167813;

    /** No estimate was made. */
    static final GainEstimate NONE = new GainEstimate(Double.NaN, Double.NaN, 0, Double.NaN, false);

    /** @return whether there is an estimate */
    boolean isAvailable() {
        return !Double.isNaN(value);
    }

    /**
     * Whether the estimate shows a gain above 1: it exceeds the quantile of chi-square over k at
     * {@value #SIGNIFICANCE} standard normal deviates (Wilson-Hilferty), where an estimate from
     * gain-1 counts falls with probability 0.00135; it exceeds 1 by {@value #SIGNIFICANCE} of its
     * standard deviations (which hold the fits' scatter about it: fits that disagree, as lines
     * with a profile or blend the fit misses do, widen it); and its residuals do not grow faster
     * than the counts ({@link #profile()}). An estimate below 1 is never used: it would narrow the
     * uncertainties on the residuals' word alone (a gain given does).
     *
     * @return whether to use the estimate
     */
    boolean exceedsOne() {
        return isAvailable() && !profile && value > PeakFinder.reducedChiSquareQuantile(SIGNIFICANCE,
                (int) Math.max(1, Math.round(freedom))) && value - 1 > SIGNIFICANCE * sigma;
    }

    /**
     * What one fit gives the estimate: per pixel, the line's modelled counts m, the squared
     * residual r^2, the leverage h and the background variance b^2.
     *
     * @param fit   the accepted fit (free width)
     * @param x     its pixels
     * @param y     its counts minus the spectrum's baseline
     * @param sigma each pixel's standard deviation in that fit
     * @param noise the spectrum's background noise per pixel
     * @param mid   the fit's baseline reference pixel
     * @param half  the fit's baseline scale
     * @return {m, r^2, h, b^2}, each one value per pixel
     */
    static double[][] pixels(GaussianBlendFit.Result fit, double[] x, double[] y, double[] sigma, double[] noise,
            double mid, double half) {
        int n = x.length;
        double[] q = fit.parameters();
        int p = q.length;
        double[] value = new double[n];
        double[][] jacobian = new double[n][p];
        GaussianBlendFit.evaluate(q, x, mid, half, value, jacobian);
        double[][] c = fit.covariance();
        double[][] out = new double[4][n];
        for (int i = 0; i < n; i++) {
            double h = 0;
            for (int j = 0; j < p; j++) {
                double row = 0;
                for (int k = 0; k < p; k++) {
                    row += c[j][k] * jacobian[i][k];
                }
                h += jacobian[i][j] * row;
            }
            double r = y[i] - value[i];
            double b = noise[(int) x[i]];
            out[0][i] = Math.max(0, GaussianBlendFit.linesAt(q, x[i]));
            out[1][i] = r * r;
            out[2][i] = h / (sigma[i] * sigma[i]);
            out[3][i] = b * b;
        }
        return out;
    }

    /**
     * @param pixels  per fit its {@link #pixels}, or null for a fit that cannot enter (fixed width,
     *                saturated pixels)
     * @param dof     per fit its degrees of freedom
     * @param assumed the gain the fits' variances assumed
     * @param counted whether the exposure counted photons (no background noise: a pixel's variance
     *                is then at least {@value PeakFinder#LEAST_PHOTONS} photon's, as in the fits)
     * @return the estimate, or one with NaN value and sigma and the number of bright, well-fitted
     *         fits found when fewer than {@value #MIN_FITS}
     */
    static GainEstimate of(double[][][] pixels, int[] dof, double assumed, boolean counted) {
        int fits = pixels.length;
        double[] own = new double[fits];
        int n = 0;
        for (int f = 0; f < fits; f++) {
            Sums sums = pixels[f] == null || dof[f] <= 0 ? null : Sums.of(pixels[f], assumed, assumed, counted);
            if (sums != null) {
                int k = (int) Math.max(1, Math.round(sums.freedom()));
                own[n++] = sums.num() / sums.den() / PeakFinder.reducedChiSquareQuantile(0, k);
            }
        }
        if (n == 0) {
            return NONE;
        }
        double select = Math.max(LOWEST, Math.min(HIGHEST, Baseline.median(own, n)));
        boolean[] use = new boolean[fits];
        for (int f = 0; f < fits; f++) {
            if (pixels[f] == null || dof[f] <= 0 || Sums.of(pixels[f], select, select, counted) == null) {
                continue;
            }
            double[][] px = pixels[f];
            double chiSquare = 0;
            for (int i = 0; i < px[0].length; i++) {
                chiSquare += px[1][i] / variance(px[0][i], px[3][i], select, counted);
            }
            use[f] = chiSquare / dof[f] <= PeakFinder.reducedChiSquareQuantile(Z999, dof[f]);
        }
        double g = select;
        Sums[] perFit = new Sums[fits];
        for (int inner = 0; inner < 100; inner++) {
            double num = 0;
            double den = 0;
            for (int f = 0; f < fits; f++) {
                perFit[f] = use[f] ? Sums.of(pixels[f], g, select, counted) : null;
                if (perFit[f] != null) {
                    num += perFit[f].num();
                    den += perFit[f].den();
                }
            }
            if (!(den > 0)) {
                return NONE;
            }
            double next = Math.max(LOWEST, Math.min(HIGHEST, num / den));
            boolean settled = Math.abs(next - g) <= 1e-9 * g;
            g = next;
            if (settled) {
                break;
            }
        }
        int count = 0;
        Sums all = Sums.NONE;
        double between = 0;
        for (int f = 0; f < fits; f++) {
            if (perFit[f] != null) {
                count++;
                all = all.plus(perFit[f]);
                double d = perFit[f].num() - g * perFit[f].den();
                between += d * d;
            }
        }
        double num = all.num();
        double den = all.den();
        if (count < MIN_FITS || !(den > 0)) {
            return new GainEstimate(Double.NaN, Double.NaN, count, Double.NaN, false);
        }
        int points = all.used();
        double overdispersion = points > 1 ? Math.max(1, all.scatter() / (points - 1)) : 1;
        double model = overdispersion / den;
        double sandwich = count / (count - 1.0) * between / (den * den);
        double sigma = Math.sqrt(Math.max(model, sandwich));
        // A profile that is not quite the fitted Gaussian (or a blend that passed) leaves residuals
        // in proportion to the line's counts, so their squares grow as m^2 where the photon noise
        // grows as m: fitted as e = g m + c m^2, a c beyond SIGNIFICANCE of its standard
        // deviations says the excess is the profile's, and the estimate is not to be used.
        double det = den * all.fourth() - all.cube() * all.cube();
        boolean profile = false;
        if (det > 0) {
            double c = (den * all.squareE() - all.cube() * num) / det;
            profile = c > SIGNIFICANCE * Math.sqrt(overdispersion * den / det);
        }
        return new GainEstimate(g, sigma, count, all.freedom(), profile);
    }

    /** A pixel's variance under gain g: background plus the line's photon noise, floored as in the fits. */
    private static double variance(double m, double b2, double g, boolean counted) {
        return b2 + Math.max(counted ? PeakFinder.LEAST_PHOTONS * g * g : 0, g * m);
    }

    /**
     * Weighted sums over the pixels dominated by a line, with w = 1 / (2 V^2) and e a pixel's squared
     * residual corrected for leverage, less its background variance.
     *
     * @param num     sum w m e
     * @param den     sum w m^2
     * @param scatter sum w (e - g m)^2
     * @param used    pixels summed
     * @param freedom sum (1 - h), their share of the degrees of freedom
     * @param cube    sum w m^3
     * @param fourth  sum w m^4
     * @param squareE sum w m^2 e
     */
    private record Sums(double num, double den, double scatter, int used, double freedom, double cube,
            double fourth, double squareE) {

        static final Sums NONE = new Sums(0, 0, 0, 0, 0, 0, 0, 0);

        Sums plus(Sums o) {
            return new Sums(num + o.num, den + o.den, scatter + o.scatter, used + o.used, freedom + o.freedom,
                    cube + o.cube, fourth + o.fourth, squareE + o.squareE);
        }

        /**
         * One fit's sums over its pixels dominated by the line under gain {@code select}, with
         * weights under gain g; null when it has no such pixel.
         */
        static Sums of(double[][] px, double g, double select, boolean counted) {
            Sums sums = NONE;
            for (int i = 0; i < px[0].length; i++) {
                double m = px[0][i];
                double h = px[2][i];
                double b2 = px[3][i];
                if (select * m < b2 || m < LEAST_ELECTRONS * select || !(h < MAX_LEVERAGE)) {
                    continue;
                }
                double v = variance(m, b2, g, counted);
                double w = 1 / (2 * v * v);
                double e = px[1][i] / (1 - h) - b2;
                sums = sums.plus(new Sums(w * m * e, w * m * m, w * (e - g * m) * (e - g * m), 1, 1 - h,
                        w * m * m * m, w * m * m * m * m, w * m * m * e));
            }
            return sums.used == 0 ? null : sums;
        }
    }
}
