package org.ritzwerk.engine.calibrate;

import java.util.Arrays;
import java.util.Objects;
import org.ritzwerk.medium.Medium;

/**
 * Fits a {@link DispersionSolution} to (pixel, wavelength) pairs: weighted least squares of a
 * polynomial in the scaled pixel x = (p - centre) / halfRange, where centre and halfRange map the
 * pairs' pixel range onto [-1, 1] (for conditioning), with iterative sigma clipping.
 *
 * <p><b>Weights.</b> Pair i weighs 1 / s_i^2 with
 * {@code s_i^2 = (D(p_i) sigma_p,i)^2 + sigma_lambda,i^2}: the centroid's standard uncertainty
 * carried through the local dispersion D = d lambda / d p (first order), combined with the
 * line's own uncertainty. D comes from the previous pass (an unweighted fit first; the weights
 * are then updated twice). Without any uncertainties (both arrays null) every pair weighs the
 * same and the covariance comes from the scatter alone.
 *
 * <p><b>Covariance.</b> (A^T W A)^-1 multiplied by max(1, chi^2 / (n - k)) (n used pairs, k
 * coefficients): stated uncertainties are trusted unless the scatter shows they are too small,
 * in which case all are inflated by the Birge ratio squared (R. T. Birge, Phys. Rev. 40, 207
 * (1932); common practice). Unweighted fits are always scaled by chi^2 / (n - k).
 *
 * <p><b>Degree.</b> Either fixed ({@link #ofDegree(int)}) or chosen from 1 .. maxDegree by the
 * corrected Akaike information criterion ({@link #automatic(int)}), in its form for residuals of
 * unknown overall scale, {@code AICc = n ln(chi^2 / n) + 2k + 2k(k + 1) / (n - k - 1)}
 * (C. M. Hurvich and C.-L. Tsai, Biometrika 76, 297 (1989); K. P. Burnham and D. R. Anderson,
 * Model Selection and Multimodel Inference, 2nd ed., Springer 2002, sec. 2.4), so an overall
 * error in the stated uncertainties does not change the choice. A degree is tried only when
 * n &gt;= k + 2. AICc is preferred to BIC for the small samples of lamp calibrations (tens of
 * lines), where BIC tends to underfit (Burnham and Anderson, sec. 6.4).
 *
 * <p><b>Degrees above the usual cubic.</b> A degree d above {@value #USUAL_DEGREE} is tried only
 * when the cubic's pairs scatter more than their stated uncertainties allow (reduced chi-square
 * above 1, so the Birge factor is taking up a misfit), and may be chosen only when it fits
 * significantly better than degree d - 1 (the F-test of {@link DispersionSolution#nextDegreeProbability()}
 * below {@value DispersionSolution#STRUCTURE_PROBABILITY}), still does with the outermost pair at
 * either end left out, and every degree between was eligible; then AICc chooses among the eligible
 * degrees. Tried degrees enter the model-selection scale below with their Akaike weights. Free
 * AICc up to 5 took a quartic or quintic in seeded sweeps of exactly cubic dispersions
 * (CalibrationSweep, seeds 1 to 400) where blends and foreign lines left structure below the
 * stated scatter, and bent a quintic to one wrong end pair, 1.5 pixels off at 35 stated
 * uncertainties (solved 302 instead of 328); with these conditions the sweep's outcome is that of
 * a cubic limit, while a quartic term of 0.18 nm across 2048 pixels is taken up in most neon
 * exposures (refdata's QuarticDispersionTest).
 *
 * <p><b>Clipping.</b> After each fit the normalised residuals z_i = r_i / s_i of the used pairs
 * are divided by sqrt(1 - h_i), h_i = w_i phi_i^T (A^T W A)^-1 phi_i being the pair's leverage
 * (studentized residuals; R. D. Cook and S. Weisberg, Residuals and Influence in Regression,
 * Chapman and Hall 1982; common practice), so a lone line at one end that the polynomial bends to
 * take is judged by how far off it really is; they are then scaled by
 * t = max(1, 1.4826 median |r_i / s_i|) (robust, so outliers do not hide themselves); the single worst
 * pair with |z| &gt; k t is rejected and the fit repeated (the degree is chosen afresh when
 * automatic), at most maxIterations times, and never below k + 2 used pairs. Rejecting one pair
 * per pass keeps a gross outlier from dragging good pairs out with it. Rejected pairs stay in the
 * solution, flagged.
 *
 * <p><b>Uncertainty of the degree choice.</b> When the degree is chosen automatically and another
 * degree has real support (AICc within a few units of the chosen one's), the chosen polynomial's
 * covariance alone would understate its uncertainty: the choice itself is uncertain. The
 * covariance is then multiplied by a factor that makes the chosen polynomial's stated
 * uncertainty match, on average between its first and last used pair, the unconditional
 * uncertainty over the degrees tried (each degree's own uncertainty plus its distance from the
 * chosen polynomial, weighed by Akaike weights; S. T. Buckland, K. P. Burnham and N. H. Augustin,
 * Biometrics 53, 603 (1997); Burnham and Anderson, sec. 4.3). The factor is
 * {@link DispersionSolution#modelSelectionScale()}; it is 1 when one degree has all the support,
 * and always 1 for a fixed degree. A single factor cannot follow the unconditional uncertainty
 * pixel by pixel, so it matches it on average over the used range. (Seeded sweeps of curved lamp
 * spectra, refdata's CalibrationSweep, seed 122 on the exposures of 2026-12-05, a neon lamp on 2048
 * pixels from 798 to 990 nm: AICc chose a quadratic for a cubic dispersion, and the true error,
 * 0.30 pixel at its largest over the fitted range (10 pairs), reached 4.4 standard uncertainties of the
 * covariance alone, 3.3 with this factor (1.83 on the covariance, so 1.35 on the uncertainty) and 1.65 with
 * the next degree's widening below as well (7.14 on the covariance in all). On the exposures before
 * that date seed 61 showed the same, 3.9 before this factor and 3.2 after; it is now fitted with a
 * cubic, 0.043 pixel off at most, 1.4 stated uncertainties.) A degree chosen below
 * {@value #USUAL_DEGREE} is widened further, pixel by pixel
 * in effect, to cover what the next degree's fit leaves open between the pairs
 * ({@link #nextDegreeScale}); the factor of both is {@link DispersionSolution#modelSelectionScale()}.
 * From the usual degree up, where that widening does not apply, the fit keeps the next degree's
 * Akaike weight against the chosen one ({@link DispersionSolution#nextDegreeWeight()}), computed
 * also when the next degree was not tried for the choice, and the stated uncertainty follows the
 * unconditional standard error over the two degrees pixel by pixel where it exceeds the factor's
 * ({@link DispersionSolution}).
 *
 * <p>Immutable and thread-safe.
 */
public final class DispersionFit {

    /** The highest degree accepted. */
    public static final int MAX_DEGREE = 9;
    /** Default clipping threshold in (robustly scaled) standard deviations. */
    public static final double DEFAULT_CLIP = 3.5;
    /** Default most pairs rejected (clipping passes). */
    public static final int DEFAULT_CLIP_ITERATIONS = 20;

    private static final double CHI_FLOOR = 1e-20;

    /**
     * The degree a grating spectrometer's dispersion is usually described to (common practice):
     * below it, an automatic choice states the uncertainty the next degree would leave
     * ({@link #nextDegreeScale}).
     */
    static final int USUAL_DEGREE = 3;

    private final int degree;
    private final int maxDegree;
    private final double clip;
    private final int clipIterations;

    private DispersionFit(int degree, int maxDegree, double clip, int clipIterations) {
        this.degree = degree;
        this.maxDegree = maxDegree;
        this.clip = clip;
        this.clipIterations = clipIterations;
    }

    /**
     * @param degree the polynomial degree, 1 to {@value #MAX_DEGREE}
     * @return a fit of that degree with the default clipping (3.5, 20 passes)
     */
    public static DispersionFit ofDegree(int degree) {
        checkDegree(degree);
        return new DispersionFit(degree, degree, DEFAULT_CLIP, DEFAULT_CLIP_ITERATIONS);
    }

    /**
     * @param maxDegree the highest degree tried, 1 to {@value #MAX_DEGREE}
     * @return a fit choosing its degree by AICc, with the default clipping
     */
    public static DispersionFit automatic(int maxDegree) {
        checkDegree(maxDegree);
        return new DispersionFit(-1, maxDegree, DEFAULT_CLIP, DEFAULT_CLIP_ITERATIONS);
    }

    private static void checkDegree(int degree) {
        if (degree < 1 || degree > MAX_DEGREE) {
            throw new IllegalArgumentException("dispersion degree must be 1 to " + MAX_DEGREE + ", got " + degree);
        }
    }

    /**
     * @param k             threshold in robustly scaled standard deviations, finite and &gt;= 1
     * @param maxIterations most clipping passes (one pair rejected per pass), &gt;= 0; 0 for none
     * @return a copy with that clipping
     */
    public DispersionFit withClipping(double k, int maxIterations) {
        if (!(k >= 1) || Double.isInfinite(k)) {
            throw new IllegalArgumentException("clipping threshold must be finite and >= 1, got " + k);
        }
        if (maxIterations < 0) {
            throw new IllegalArgumentException("clipping passes must be >= 0, got " + maxIterations);
        }
        return new DispersionFit(degree, maxDegree, k, maxIterations);
    }

    /** @return a copy that rejects nothing */
    public DispersionFit withoutClipping() {
        return new DispersionFit(degree, maxDegree, clip, 0);
    }

    /** @return the fixed degree, or -1 when chosen automatically */
    public int degree() {
        return degree;
    }

    /** @return the highest degree tried (the fixed degree when fixed) */
    public int maxDegree() {
        return maxDegree;
    }

    /**
     * @param pixel             centroids in pixels (pixel i centred at i), finite
     * @param pixelSigma        their standard uncertainties in pixels (&gt;= 0), or null
     * @param wavelengthNm      the reference wavelengths in nm, finite and positive
     * @param wavelengthSigmaNm their standard uncertainties in nm (&gt;= 0), or null
     * @param medium            the medium of the reference wavelengths
     * @return the solution
     * @throws IllegalArgumentException for arrays of different lengths, naming the first
     *         unusable element, for a pair whose combined uncertainty is 0 when uncertainties are
     *         given, or for too few pairs or distinct pixels for the degree (k + 1 pairs at least)
     */
    public DispersionSolution fit(double[] pixel, double[] pixelSigma, double[] wavelengthNm,
            double[] wavelengthSigmaNm, Medium medium) {
        Objects.requireNonNull(medium, "medium");
        int n = pixel.length;
        check(pixel, pixelSigma, wavelengthNm, wavelengthSigmaNm);
        boolean weighted = pixelSigma != null || wavelengthSigmaNm != null;
        int lowestDegree = degree > 0 ? degree : 1;
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double p : pixel) {
            lo = Math.min(lo, p);
            hi = Math.max(hi, p);
        }
        long distinct = Arrays.stream(pixel).distinct().count();
        if (n < lowestDegree + 2 || distinct < lowestDegree + 1) {
            throw new IllegalArgumentException("a degree-" + lowestDegree + " dispersion fit needs at least "
                    + (lowestDegree + 2) + " pairs at " + (lowestDegree + 1) + " distinct pixels, got " + n
                    + " pairs at " + distinct);
        }
        double centre = 0.5 * (lo + hi);
        double half = Math.max(0.5, 0.5 * (hi - lo));
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = (pixel[i] - centre) / half;
        }
        boolean[] use = new boolean[n];
        Arrays.fill(use, true);
        int used = n;
        Pass pass = null;
        double[] criterion = new double[0];
        Pass[] tried = new Pass[0];
        for (int iteration = 0; ; iteration++) {
            if (degree > 0) {
                pass = weightedFit(x, pixelSigma, wavelengthNm, wavelengthSigmaNm, use, degree, half, weighted);
            } else {
                criterion = new double[maxDegree + 1];
                Arrays.fill(criterion, Double.NaN);
                tried = new Pass[maxDegree + 1];
                pass = null;
                boolean eligible = true;
                for (int d = 1; d <= maxDegree && used >= d + 3; d++) {
                    if (d > USUAL_DEGREE && !exceedsStatedScatter(tried[USUAL_DEGREE], used, weighted)) {
                        break;
                    }
                    Pass candidate = weightedFit(x, pixelSigma, wavelengthNm, wavelengthSigmaNm, use, d, half,
                            weighted);
                    if (candidate == null) {
                        break;
                    }
                    // Above the usual degree, a degree may be chosen only when it fits significantly
                    // better than the one below (and that one was eligible); it still enters the
                    // model-selection scale below with its Akaike weight.
                    eligible &= d <= USUAL_DEGREE || significantlyBetter(tried[d - 1], candidate, x, pixelSigma,
                            wavelengthNm, wavelengthSigmaNm, use, used, half, weighted);
                    tried[d] = candidate;
                    criterion[d] = aicc(candidate.solution.chiSquare(), used, d + 1); // used >= d + 3
                    if (eligible && (pass == null || criterion[d] < criterion[pass.degree()])) {
                        pass = candidate;
                    }
                }
                if (pass == null) {
                    pass = weightedFit(x, pixelSigma, wavelengthNm, wavelengthSigmaNm, use, 1, half, weighted);
                }
            }
            if (pass == null) {
                throw new IllegalArgumentException("the pairs do not determine a degree-" + lowestDegree
                        + " polynomial (too few distinct pixels among the " + used + " used)");
            }
            if (iteration >= clipIterations || used - 1 < pass.degree() + 3) {
                break;
            }
            int worst = worstOutlier(pass, x, wavelengthNm, use);
            if (worst < 0) {
                break;
            }
            use[worst] = false;
            used--;
        }
        double[] a = pass.solution.coefficients();
        int k = a.length;
        int dof = used - k;
        double chi = pass.solution.chiSquare();
        double reduced = dof > 0 ? chi / dof : Double.NaN;
        double scale;
        if (weighted) {
            scale = dof > 0 ? Math.max(1, reduced) : 1;
        } else {
            scale = dof > 0 ? reduced : Double.NaN;
        }
        double[][] covariance = new double[k][k];
        for (int r = 0; r < k; r++) {
            for (int j = 0; j < k; j++) {
                covariance[r][j] = pass.solution.covariance()[r][j] * scale;
            }
        }
        double usedLo = Double.POSITIVE_INFINITY;
        double usedHi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < n; i++) {
            if (use[i]) {
                usedLo = Math.min(usedLo, pixel[i]);
                usedHi = Math.max(usedHi, pixel[i]);
            }
        }
        double modelScale = degree > 0 ? 1
                : modelSelectionScale(pass, covariance, tried, criterion, used, weighted,
                        (usedLo - centre) / half, (usedHi - centre) / half);
        if (modelScale > 1) {
            for (double[] row : covariance) {
                for (int j = 0; j < k; j++) {
                    row[j] *= modelScale;
                }
            }
        }
        NextDegree next = higherDegree(pass.degree() + 1, x, pixelSigma, wavelengthNm, wavelengthSigmaNm, use, used,
                half, weighted);
        // Beyond the used pairs: at least the usual degree, for a low degree's fit assumed away
        // the terms a grating's dispersion usually has, and the next degree alone may miss them (a
        // cubic's inflection in the middle of a narrow range looks straight and not curved).
        NextDegree beyond = next;
        for (int d = Math.max(pass.degree() + 1, USUAL_DEGREE); d > pass.degree() + 1; d--) {
            NextDegree higher = higherDegree(d, x, pixelSigma, wavelengthNm, wavelengthSigmaNm, use, used, half,
                    weighted);
            if (higher != null) {
                beyond = higher;
                break;
            }
        }
        double nextScale = degree > 0 || pass.degree() >= Math.min(maxDegree, USUAL_DEGREE) ? 1
                : nextDegreeScale(pass, covariance, next, (usedLo - centre) / half, (usedHi - centre) / half);
        if (nextScale > 1) {
            for (double[] row : covariance) {
                for (int j = 0; j < k; j++) {
                    row[j] *= nextScale;
                }
            }
            modelScale = Math.max(1, modelScale) * nextScale;
        }
        // The next degree's F-test on the same pairs (DispersionSolution.nextDegreeProbability).
        double nextProbability = Double.NaN;
        if (next != null && dof - 1 > 0) {
            double chiNext = Math.max(next.chiSquare, CHI_FLOOR * used);
            nextProbability = DispersionSolution.fTestProbability((chi - chiNext) / (chiNext / (dof - 1)), dof - 1);
        }
        // The next degree's support against the chosen one, for the unconditional uncertainty between
        // the pairs (DispersionSolution.wavelengthSigmaAt): when the degree was chosen, the polynomial
        // kept beyond the range is that next degree, and nextDegreeScale, which covers it already
        // (at its largest ratio over the range), did not apply.
        double nextWeight = degree > 0 || pass.degree() < Math.min(maxDegree, USUAL_DEGREE) || beyond == null
                || beyond != next ? Double.NaN : nextDegreeWeight(chi, next.chiSquare, used, k);
        double[] residual = new double[n];
        double[] sigma = new double[n];
        boolean[] rejected = new boolean[n];
        for (int i = 0; i < n; i++) {
            residual[i] = wavelengthNm[i] - PolynomialLeastSquares.evaluate(a, x[i]);
            sigma[i] = weighted ? 1 / Math.sqrt(pass.weight[i]) : Double.NaN;
            rejected[i] = !use[i];
        }
        return new DispersionSolution(centre, half, a, covariance, scale, modelScale, medium, chi, dof, usedLo,
                usedHi, pixel.clone(), wavelengthNm.clone(), sigma, residual, rejected, criterion,
                beyond == null ? null : beyond.coefficients, beyond == null ? null : beyond.scaledCovariance(),
                nextProbability, nextWeight);
    }

    /**
     * The Akaike weight of the next degree against the chosen one on the same used pairs,
     * w = 1 / (1 + exp((AICc_(d+1) - AICc_d) / 2)), with AICc in its form for residuals of unknown
     * scale (see the class comment; Burnham and Anderson, sec. 2.9 for the weights). Computed
     * also when the next degree was not tried for the choice (a cubic whose pairs scatter no more
     * than stated): its support decides how uncertain the choice is, not whether it was allowed.
     *
     * @return the weight, 0 to 1; NaN when either criterion is not finite
     */
    static double nextDegreeWeight(double chiChosen, double chiNext, int used, int k) {
        double chosen = aicc(chiChosen, used, k);
        double next = aicc(chiNext, used, k + 1);
        double weight = 1 / (1 + Math.exp(0.5 * (next - chosen)));
        return Double.isFinite(chosen) && Double.isFinite(next) ? weight : Double.NaN;
    }

    /** AICc for k coefficients and a weighted chi-square over n used pairs (see the class comment). */
    private static double aicc(double chi, int n, int k) {
        if (n - k - 1 <= 0) {
            return Double.NaN;
        }
        return n * Math.log(Math.max(chi, CHI_FLOOR * n) / n) + 2 * k + 2.0 * k * (k + 1) / (n - k - 1);
    }

    /**
     * Whether a fit of degree d fits the used pairs significantly better than degree d - 1 (the
     * F-test's probability below {@value DispersionSolution#STRUCTURE_PROBABILITY}), and still does
     * with the outermost pair at either end left out: a single end pair (a foreign line or a
     * blend at the edge of the lines) must not carry a higher degree, which would then bend to
     * it where no other line checks it (a sweep exposure with a wrong last pair 40 pixels beyond
     * the others was taken by a quintic 1.5 pixels off, at 35 stated uncertainties).
     */
    private static boolean significantlyBetter(Pass low, Pass high, double[] x, double[] pixelSigma,
            double[] wavelengthNm, double[] lineSigma, boolean[] use, int used, double half, boolean weighted) {
        int d = high.degree();
        if (low == null || !(DispersionSolution.fTestProbability(fRatio(low, high, used), used - d - 1)
                < DispersionSolution.STRUCTURE_PROBABILITY)) {
            return false;
        }
        if (used - 1 < d + 3) {
            return false;
        }
        for (boolean top : new boolean[] {false, true}) {
            int end = -1;
            for (int i = 0; i < x.length; i++) {
                if (use[i] && (end < 0 || (top ? x[i] > x[end] : x[i] < x[end]))) {
                    end = i;
                }
            }
            boolean[] without = use.clone();
            without[end] = false;
            Pass lowWithout = weightedFit(x, pixelSigma, wavelengthNm, lineSigma, without, d - 1, half, weighted);
            Pass highWithout = weightedFit(x, pixelSigma, wavelengthNm, lineSigma, without, d, half, weighted);
            if (lowWithout == null || highWithout == null) {
                return false;
            }
            double probability = DispersionSolution.fTestProbability(fRatio(lowWithout, highWithout, used - 1),
                    used - d - 2);
            if (!(probability < DispersionSolution.STRUCTURE_PROBABILITY)) {
                return false;
            }
        }
        return true;
    }

    /**
     * Whether a fit's pairs scatter about it more than their stated uncertainties allow (reduced
     * chi-square above 1, so the Birge factor widens its uncertainty to take up the misfit); always
     * for an unweighted fit, false for a missing one.
     */
    private static boolean exceedsStatedScatter(Pass pass, int used, boolean weighted) {
        if (pass == null) {
            return false;
        }
        int dof = used - pass.solution.coefficients().length;
        return !weighted || dof > 0 && pass.solution.chiSquare() / dof > 1;
    }

    /**
     * The F ratio of a fit one degree higher against a lower one on the same used pairs,
     * (chi^2_low - chi^2_high) / (chi^2_high / (used - k_high)) (see
     * {@link DispersionSolution#nextDegreeProbability()}); 0 when the lower one is missing.
     */
    private static double fRatio(Pass low, Pass high, int used) {
        if (low == null) {
            return 0;
        }
        double chiHigh = Math.max(high.solution.chiSquare(), CHI_FLOOR * used);
        return (low.solution.chiSquare() - chiHigh) / (chiHigh / (used - high.solution.coefficients().length));
    }

    /**
     * The factor by which the chosen degree's covariance grows so that its variance matches, on
     * average between the first and last used pair, the unconditional variance of the choice
     * among the degrees tried: with Akaike weights
     * w_d = exp(-Delta_d / 2) / sum exp(-Delta / 2), Delta_d = AICc_d - min AICc,
     * {@code u^2(x) = sum_d w_d [sigma_d^2(x) + (lambda_d(x) - lambda_chosen(x))^2]}
     * (S. T. Buckland, K. P. Burnham and N. H. Augustin, Biometrics 53, 603 (1997); Burnham and
     * Anderson, Model Selection and Multimodel Inference, 2nd ed., Springer 2002, sec. 4.3; from
     * memory), and the factor is max(1, mean of u^2(x) / sigma_chosen^2(x)) over 65 evenly spaced
     * points of the used range. (The mean, not the largest ratio: a single factor cannot follow
     * u(x) exactly, and the largest ratio over-covers elsewhere; CalibrationEndToEndTest holds the
     * 2-sigma coverage of many exposures between 0.90 and 0.99.) It is 1 when one degree has all
     * the weight. Each degree's sigma_d carries its own Birge scaling, as the chosen one's does.
     */
    private static double modelSelectionScale(Pass chosen, double[][] chosenCovariance, Pass[] tried,
            double[] criterion, int used, boolean weighted, double xLo, double xHi) {
        double best = Double.POSITIVE_INFINITY;
        int models = 0;
        for (int d = 1; d < tried.length; d++) {
            if (tried[d] != null && Double.isFinite(criterion[d])) {
                best = Math.min(best, criterion[d]);
                models++;
            }
        }
        if (models < 2) {
            return 1;
        }
        double[] weight = new double[tried.length];
        double total = 0;
        for (int d = 1; d < tried.length; d++) {
            if (tried[d] != null && Double.isFinite(criterion[d])) {
                weight[d] = Math.exp(-0.5 * (criterion[d] - best));
                total += weight[d];
            }
        }
        double[][][] covariance = new double[tried.length][][];
        for (int d = 1; d < tried.length; d++) {
            if (weight[d] > 0) {
                int dof = used - (d + 1);
                double reduced = dof > 0 ? tried[d].solution.chiSquare() / dof : Double.NaN;
                double s = weighted ? (dof > 0 ? Math.max(1, reduced) : 1) : reduced;
                if (!(s > 0) || Double.isInfinite(s)) {
                    return 1;
                }
                double[][] own = tried[d].solution.covariance();
                covariance[d] = new double[own.length][own.length];
                for (int r = 0; r < own.length; r++) {
                    for (int j = 0; j < own.length; j++) {
                        covariance[d][r][j] = own[r][j] * s;
                    }
                }
            }
        }
        double[] a = chosen.solution.coefficients();
        double factor = 0;
        for (int step = 0; step <= 64; step++) {
            double x = xLo + (xHi - xLo) * step / 64.0;
            double own = PolynomialLeastSquares.quadraticForm(chosenCovariance, x);
            if (!(own > 0) || Double.isInfinite(own)) {
                return 1;
            }
            double lambda = PolynomialLeastSquares.evaluate(a, x);
            double unconditional = 0;
            for (int d = 1; d < tried.length; d++) {
                if (weight[d] > 0) {
                    double shift = PolynomialLeastSquares.evaluate(tried[d].solution.coefficients(), x) - lambda;
                    unconditional += weight[d] / total
                            * (PolynomialLeastSquares.quadraticForm(covariance[d], x) + shift * shift);
                }
            }
            factor += unconditional / own / 65;
        }
        return Double.isFinite(factor) ? Math.max(1, factor) : 1;
    }

    /**
     * The factor by which the chosen degree's covariance grows so that, everywhere between its
     * first and last used pair, its stated variance covers what the next degree's fit to the same
     * pairs says there: that fit's own variance (with its Birge scaling) plus the squared distance
     * between the two polynomials, u^2(x) = sigma_(d+1)^2(x) + (lambda_(d+1)(x) - lambda_d(x))^2;
     * the factor is max(1, largest u^2(x) / sigma_d^2(x)) over 65 evenly spaced points.
     *
     * <p>Applied when the degree was chosen automatically below {@value #USUAL_DEGREE} (and below
     * the highest allowed), so the fit assumed away a term real dispersions usually have, and the
     * pairs determine degree d + 1 with a degree of freedom to spare (d + 3 pairs). Where the pairs
     * leave the shape between them open (a long gap between two groups of lines, a lone end line),
     * AICc's small-sample penalty makes the lower degree's choice look certain: seeded lamp sweeps
     * (refdata's CalibrationSweep and CadmiumZincLampSweepTest) had quadratics 0.3 to 0.6 pixel off
     * in such gaps while stating 0.1, up to 8.5 of their stated standard uncertainties; with the
     * factor, at most 3.0. Right solutions of a lower degree state 1.4 to 4 times more than before.
     * Not applied from the usual degree up: a largest ratio over the range grows with the higher
     * degree's variance at the ends even where the data fix the shape (40 neon lines fitted by a
     * cubic under automatic(5) then covered every error within two stated uncertainties, where 95 %
     * is right; CalibrationEndToEndTest).
     */
    private static double nextDegreeScale(Pass chosen, double[][] chosenCovariance, NextDegree next, double xLo,
            double xHi) {
        if (next == null) {
            return 1;
        }
        double[] a = chosen.solution.coefficients();
        double factor = 1;
        for (int step = 0; step <= 64; step++) {
            double at = xLo + (xHi - xLo) * step / 64.0;
            double stated = PolynomialLeastSquares.quadraticForm(chosenCovariance, at);
            if (!(stated > 0) || Double.isInfinite(stated)) {
                return 1;
            }
            double shift = PolynomialLeastSquares.evaluate(next.coefficients, at)
                    - PolynomialLeastSquares.evaluate(a, at);
            factor = Math.max(factor, (PolynomialLeastSquares.quadraticForm(next.covariance, at) * next.scale
                    + shift * shift) / stated);
        }
        return Double.isFinite(factor) ? factor : 1;
    }

    /**
     * A polynomial of a degree above the chosen one fitted to the same used pairs, with its
     * covariance scaled as the chosen one's is (Birge ratio squared, at least 1 for a weighted
     * fit): null when the pairs do not determine it with a degree of freedom to spare (degree + 2
     * pairs) or its scaling is not finite. It measures what the chosen degree assumed away: the
     * next degree between the pairs for a low degree ({@link #nextDegreeScale}), and the next or
     * the usual degree beyond them for every degree ({@link DispersionSolution#wavelengthSigmaAt}).
     */
    private static NextDegree higherDegree(int next, double[] x, double[] pixelSigma, double[] wavelengthNm,
            double[] lineSigma, boolean[] use, int used, double half, boolean weighted) {
        if (used < next + 2) {
            return null;
        }
        Pass higher = weightedFit(x, pixelSigma, wavelengthNm, lineSigma, use, next, half, weighted);
        if (higher == null) {
            return null;
        }
        int dof = used - (next + 1);
        double reduced = higher.solution.chiSquare() / dof;
        double s = weighted ? Math.max(1, reduced) : reduced;
        if (!(s > 0) || Double.isInfinite(s)) {
            return null;
        }
        return new NextDegree(higher.solution.coefficients(), higher.solution.covariance(), s,
                higher.solution.chiSquare());
    }

    /**
     * A higher degree's coefficients, their unscaled covariance and its scale (see
     * {@link #higherDegree}).
     */
    private record NextDegree(double[] coefficients, double[][] covariance, double scale, double chiSquare) {

        double[][] scaledCovariance() {
            double[][] scaled = new double[covariance.length][];
            for (int r = 0; r < scaled.length; r++) {
                scaled[r] = covariance[r].clone();
                for (int j = 0; j < scaled[r].length; j++) {
                    scaled[r][j] *= scale;
                }
            }
            return scaled;
        }
    }

    private record Pass(PolynomialLeastSquares.Solution solution, double[] weight) {
        int degree() {
            return solution.coefficients().length - 1;
        }
    }

    /**
     * An unweighted fit, then two passes with weights from the dispersion of the pass before.
     * Weights are computed for every pair (used or not), so rejected pairs can be judged.
     */
    private static Pass weightedFit(double[] x, double[] pixelSigma, double[] wavelengthNm, double[] lineSigma,
            boolean[] use, int degree, double half, boolean weighted) {
        PolynomialLeastSquares.Solution solution = PolynomialLeastSquares.fit(x, wavelengthNm, null, use, degree);
        if (solution == null) {
            return null;
        }
        int n = x.length;
        double[] weight = new double[n];
        if (!weighted) {
            Arrays.fill(weight, 1);
            return new Pass(solution, weight);
        }
        for (int pass = 0; pass < 2; pass++) {
            for (int i = 0; i < n; i++) {
                double dispersion = PolynomialLeastSquares.derivative(solution.coefficients(), x[i]) / half;
                double sp = pixelSigma == null ? 0 : pixelSigma[i] * dispersion;
                double sl = lineSigma == null ? 0 : lineSigma[i];
                weight[i] = 1 / (sp * sp + sl * sl);
            }
            PolynomialLeastSquares.Solution next = PolynomialLeastSquares.fit(x, wavelengthNm, weight, use, degree);
            if (next == null) {
                return null;
            }
            solution = next;
        }
        return new Pass(solution, weight);
    }

    private int worstOutlier(Pass pass, double[] x, double[] wavelengthNm, boolean[] use) {
        int n = x.length;
        double[] z = new double[n];
        double[] absolute = new double[n];
        int m = 0;
        double[][] covariance = pass.solution.covariance();
        for (int i = 0; i < n; i++) {
            z[i] = (wavelengthNm[i] - PolynomialLeastSquares.evaluate(pass.solution.coefficients(), x[i]))
                    * Math.sqrt(pass.weight[i]);
            if (use[i]) {
                absolute[m++] = Math.abs(z[i]);
                // A used pair pulls the fit towards itself, the more so the fewer pairs are near it
                // (its leverage h = w phi^T (A^T W A)^-1 phi): judged by its residual divided by
                // sqrt(1 - h), a lone end line the polynomial bends to take is seen as far off as
                // it is (studentized residual; common practice, e.g. R. D. Cook and S. Weisberg,
                // Residuals and Influence in Regression, 1982).
                double leverage = pass.weight[i] * PolynomialLeastSquares.quadraticForm(covariance, x[i]);
                z[i] /= Math.sqrt(Math.max(1e-6, 1 - leverage));
            }
        }
        double scale = Math.max(1, Baseline.MAD_TO_SIGMA * Baseline.median(absolute, m));
        int worst = -1;
        double worstZ = clip * scale;
        for (int i = 0; i < n; i++) {
            if (use[i] && Math.abs(z[i]) > worstZ) {
                worstZ = Math.abs(z[i]);
                worst = i;
            }
        }
        return worst;
    }

    private static void check(double[] pixel, double[] pixelSigma, double[] wavelengthNm, double[] wavelengthSigma) {
        int n = pixel.length;
        if (wavelengthNm.length != n || (pixelSigma != null && pixelSigma.length != n)
                || (wavelengthSigma != null && wavelengthSigma.length != n)) {
            throw new IllegalArgumentException("pixels, pixel uncertainties, wavelengths and wavelength uncertainties "
                    + "must have one value per pair: " + n + ", " + (pixelSigma == null ? "-" : pixelSigma.length)
                    + ", " + wavelengthNm.length + ", " + (wavelengthSigma == null ? "-" : wavelengthSigma.length));
        }
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(pixel[i])) {
                throw new IllegalArgumentException("pair " + i + ": pixel must be finite, got " + pixel[i]);
            }
            if (!(wavelengthNm[i] > 0) || Double.isInfinite(wavelengthNm[i])) {
                throw new IllegalArgumentException("pair " + i + ": wavelength must be finite and positive (nm), got "
                        + wavelengthNm[i]);
            }
            double sp = pixelSigma == null ? 0 : pixelSigma[i];
            double sl = wavelengthSigma == null ? 0 : wavelengthSigma[i];
            if (!(sp >= 0) || Double.isInfinite(sp)) {
                throw new IllegalArgumentException("pair " + i + ": pixel uncertainty must be finite and >= 0, got "
                        + sp);
            }
            if (!(sl >= 0) || Double.isInfinite(sl)) {
                throw new IllegalArgumentException("pair " + i + ": wavelength uncertainty must be finite and >= 0 (nm), "
                        + "got " + sl);
            }
            if ((pixelSigma != null || wavelengthSigma != null) && sp == 0 && sl == 0) {
                throw new IllegalArgumentException("pair " + i + " has no uncertainty (pixel and wavelength "
                        + "uncertainties both 0): give one, or pass null for both to fit unweighted");
            }
        }
    }
}
