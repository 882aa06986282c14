package org.ritzwerk.engine.calibrate;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Finds emission peaks in counts per pixel and measures their centroids with uncertainties.
 *
 * <p><b>Pixel coordinates.</b> Pixel i (0-based) covers [i - 1/2, i + 1/2) and has its centre
 * at i.
 *
 * <p><b>Steps.</b>
 * <ol>
 * <li>Noise: sigma = 1.4826 MAD / sqrt 2 of the first differences, for the first pass.</li>
 * <li>Baseline: an iteratively 3-sigma-clipped running median over {@link #withBaselineWindow
 * baselineWindow} pixels, interpolated between nodes; then the local background noise
 * sigma_bg(i), 1.4826 times the running median of |counts - baseline| over the pixels the
 * clipping kept, in windows of 4 baseline windows or an eighth of the spectrum, whichever is
 * wider (common practice; see {@link Peaks#noise()}).</li>
 * <li>Candidates: local maxima of the baseline-subtracted counts smoothed by a Gaussian of
 * {@link #withSmoothing smoothing} pixels (standard deviation), at least half the threshold
 * (threshold times sigma_bg) high. Of two neighbouring maxima, the lower is merged into the higher
 * unless the dip between them is at least 2 local standard deviations deep.</li>
 * <li>Fit: around each candidate a window of +-{@link #withFitHalfWidth fitHalfWidth} times a
 * first FWHM estimate (at least 3 pixels); candidates whose windows overlap are fitted together
 * (at most {@link #withMaxBlend maxBlend} per fit; a longer chain is split at its widest gap) as
 * a sum of pixel-integrated Gaussians of one common width on a local straight line, by
 * Levenberg-Marquardt (see {@code GaussianBlendFit}). The common width assumes the instrument
 * profile varies little over a blend (common practice). Lines closer than about 1.3 FWHM show no
 * dip and are fitted as one (wider) line; the fit's chi-square then usually flags it
 * {@link PeakFlag#POOR_FIT}.</li>
 * <li>Accept: a component is kept when its height (the counts it puts in a pixel centred on it)
 * is at least threshold times sigma_bg, its flux at least threshold times the flux's own
 * standard uncertainty (which keeps one-pixel noise spikes out), its centre inside its window
 * and its width between 0.15 pixel and half the window; otherwise the weakest offending
 * component is dropped and the rest refitted. A second pass refits every chain whose width came
 * out below half the median fitted width of the spectrum (a fit collapsed
 * onto two pixels' counts, its centre on their boundary with an uncertainty near 0), or whose fit
 * failed or had no finite covariance: with that floor, and when it still collapses with the width
 * held at the median ({@link Peaks#fwhmSigma} 0). A peak whose centroid uncertainty is not finite
 * and positive is reported unfitted, never returned.
 * Candidates whose fit fails outright are reported in {@link Peaks#unfitted()}.</li>
 * </ol>
 *
 * <p><b>Uncertainties.</b> With per-pixel standard uncertainties ({@link #find(double[],
 * double[])}) the fit is weighted by them and the centroid's standard uncertainty is the square
 * root of the diagonal of (J^T W J)^-1, not rescaled: the caller's uncertainties are trusted.
 * Without them ({@link #find(double[])}), each pixel is given the Poisson-like variance
 * sigma_bg(i)^2 + h max(line counts, 0): the local background noise (measured) plus the line's own
 * counts as if counted in detected photo-electrons (h counts each, see below). The fit is made
 * once with the observed counts in that variance and once more with the fitted model's. Since
 * the gain need not be h and the background noise is an estimate, the covariance is then multiplied by the
 * spectrum's pooled reduced chi-square F: the median over all fits of chi^2 / (n - p), divided by
 * the median of a chi-square variable over its degrees of freedom, (1 - 2/(9 nu))^3 (Wilson and
 * Hilferty, PNAS 17, 684 (1931)), so that F is 1 when the variances are right. One pooled F has
 * hundreds of degrees of freedom; each fit's own chi^2 / (n - p), with a dozen, would scatter the
 * uncertainties by some 20 % and understate them on average (Student's t). With fewer than 5
 * fits each is scaled by its own reduced chi-square instead, but never below 1 (a handful of
 * degrees of freedom may widen the model's variances, not narrow them). {@link Peaks#noiseScale()} reports F.
 * Counts that all lie on a step h above the lowest (whole photo-electrons times a gain) are
 * taken as h counts per photo-electron: the line's variance is h times its counts (h above 1
 * only; a finer step is taken as rounding). An exposure with such a step and no background noise
 * counted photons: its variances are h times its expected counts and F is 1; the first fit's
 * variance is at least one photon there (Neyman's modified chi-square, common practice), or an
 * empty pixel beside a line would pin it, and the second's at least 0.1 photon. Counts clamped
 * at their lowest value (at least a tenth of the pixels there) take their noise from the pixels
 * above the clamp (see {@code Baseline}), and their F is at least 1. {@link Peaks#countsPerPhoton()},
 * {@link Peaks#countedPhotons()} and {@link Peaks#clampLevel()} report what was assumed.
 *
 * <p><b>The gain h.</b> Given ({@link #withGain}, from the detector's data sheet or a
 * photon-transfer measurement), it is used as given. Otherwise the common step above, when it is
 * not 1. Otherwise (counts on no common step, as from a camera of 3.7 counts per photo-electron,
 * or on a step of 1) it is estimated from the bright lines' own fit residuals (see
 * {@code GainEstimate}: where the line's counts dominate a pixel's variance, the squared residual
 * over the counts estimates h): the peaks are found and fitted with h = 1, the estimate made, and
 * when it is clearly above 1 (beyond the chi-square quantile at 3 standard deviations, so gain-1
 * exposures keep h = 1 and their results) found and fitted again with it, the estimate then made
 * once more from those fits and a third pass made when it moved by more than its own standard
 * deviation. An estimate below 1 is never used (it would narrow the uncertainties), nor one from
 * fewer than 5 bright, well-fitted, unsaturated fits: h is then 1, and {@link Peaks#gainNote()}
 * says why. {@link Peaks#gainSource()} and {@link Peaks#gainStatement()} report which it was. A
 * read noise given ({@link #withReadNoise}, in counts) is a floor under the measured background
 * noise sigma_bg(i), which stays where larger: it holds the baseline's own photon noise, and the
 * baseline may hold a bias offset that is no photons, so the gain times the baseline is not added.
 *
 * <p><b>Poor fits.</b> In both modes, a fit whose chi-square (over F) exceeds the 99th percentile
 * of the chi-square distribution (Wilson-Hilferty approximation) has its peaks' covariance
 * scaled by its own reduced chi-square instead, and its peaks flagged {@link PeakFlag#POOR_FIT}:
 * the scatter shows the model does not describe them (an unresolved blend, most often).
 *
 * <p><b>Saturation.</b> Pixels at or above {@link #withSaturationLevel the saturation level} are
 * left out of the baseline, the noise estimate and the fits; peaks within one FWHM of one are
 * flagged {@link PeakFlag#SATURATED}.
 *
 * <p>Immutable and thread-safe; configure with the {@code withX} methods, each returning a copy.
 */
public final class PeakFinder {

    /** Default signal-to-noise threshold on the fitted height. */
    public static final double DEFAULT_THRESHOLD = 5;
    /** Default baseline window in pixels. */
    public static final int DEFAULT_BASELINE_WINDOW = 101;
    /** Default standard deviation of the smoothing Gaussian for the candidate search, in pixels. */
    public static final double DEFAULT_SMOOTHING = 0.5;
    /** Default half-width of a fit window in first-estimate FWHMs. */
    public static final double DEFAULT_FIT_HALF_WIDTH = 2.5;
    /** Default largest number of peaks fitted together. */
    public static final int DEFAULT_MAX_BLEND = 8;
    /**
     * How many combined standard uncertainties a peak's FWHM must exceed the instrument's near it
     * to be flagged {@link PeakFlag#WIDE}. At 3, a clean peak is flagged with probability 0.0013
     * (one-sided normal tail, common practice), about once in 40 exposures of 20 lines; a flagged
     * peak only loses weight in a dispersion fit.
     */
    public static final double WIDE_SIGMAS = 3;
    /** Fewest well-fitted peaks from which the instrument's width across the detector is modelled. */
    static final int MIN_WIDTH_PEAKS = 6;
    /** Fewest pixels a spectrum must have. */
    public static final int MIN_PIXELS = 8;

    private static final double PROMINENCE = 2;
    private static final double FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.log(2));
    private static final double SQRT_2PI = Math.sqrt(2 * Math.PI);
    private static final double MIN_WIDTH = 0.15;
    /**
     * The narrowest width a line may take, as a share of the spectrum's median fitted width: a
     * profile half as wide as the instrument's is no line (a noise spike, or a fit collapsed onto
     * two pixels' counts, which puts its centre on their boundary with an absurdly small
     * uncertainty). A choice, not a measured constant: widths across one detector rarely vary by
     * a factor two between neighbours.
     */
    static final double WIDTH_FLOOR = 0.5;
    /**
     * Least variance, in photons, of a counted pixel in a fit with the model's variances. A count
     * of 1 where the model expects m near 0 costs (1 - m)^2 / m in chi-square, without bound,
     * where Poisson's likelihood costs only log(1/m): the floor caps it near 8 (a choice; an
     * empty pixel costs nothing either way, and pixels expecting less than 0.1 photon carry
     * little of a centroid's information).
     */
    static final double LEAST_PHOTONS = 0.1;
    /** Fewest first-pass fits whose median width sets the floor. */
    static final int MIN_REFERENCE_FITS = 3;
    /** Share of the pixels at the lowest value from which a spectrum counts as clamped there. */
    static final double CLAMPED_SHARE = 0.1;
    private static final double MAX_FWHM_ESTIMATE = 50;

    private final double threshold;
    private final int baselineWindow;
    private final double smoothing;
    private final double fitHalfWidth;
    private final int maxBlend;
    private final double saturationLevel;
    private final boolean negativeAllowed;
    /** The detector's gain in counts per photo-electron, NaN when not given. */
    private final double gain;
    /** The detector's read noise in counts (RMS), NaN when not given. */
    private final double readNoise;

    private PeakFinder(double threshold, int baselineWindow, double smoothing, double fitHalfWidth, int maxBlend,
            double saturationLevel, boolean negativeAllowed, double gain, double readNoise) {
        this.threshold = threshold;
        this.baselineWindow = baselineWindow;
        this.smoothing = smoothing;
        this.fitHalfWidth = fitHalfWidth;
        this.maxBlend = maxBlend;
        this.saturationLevel = saturationLevel;
        this.negativeAllowed = negativeAllowed;
        this.gain = gain;
        this.readNoise = readNoise;
    }

    /**
     * @return a finder with threshold 5, baseline window 101 pixels, smoothing 0.5 pixel, fit
     *         half-width 2.5 FWHM, at most 8 peaks per blend, no saturation level, negative counts
     *         refused
     */
    public static PeakFinder defaults() {
        return new PeakFinder(DEFAULT_THRESHOLD, DEFAULT_BASELINE_WINDOW, DEFAULT_SMOOTHING, DEFAULT_FIT_HALF_WIDTH,
                DEFAULT_MAX_BLEND, Double.POSITIVE_INFINITY, false, Double.NaN, Double.NaN);
    }

    /**
     * @param snr smallest fitted height accepted, in units of the background noise; finite, &gt; 0
     * @return a copy with that threshold
     */
    public PeakFinder withThreshold(double snr) {
        if (!(snr > 0) || Double.isInfinite(snr)) {
            throw new IllegalArgumentException("threshold must be a finite signal-to-noise ratio > 0, got " + snr);
        }
        return new PeakFinder(snr, baselineWindow, smoothing, fitHalfWidth, maxBlend, saturationLevel, negativeAllowed,
                gain, readNoise);
    }

    /**
     * @param pixels width of the running-median window in pixels, at least 5; several times the
     *               widest line (or blend) so lines never fill a window
     * @return a copy with that window
     */
    public PeakFinder withBaselineWindow(int pixels) {
        if (pixels < 5) {
            throw new IllegalArgumentException("baseline window must be at least 5 pixels, got " + pixels);
        }
        return new PeakFinder(threshold, pixels, smoothing, fitHalfWidth, maxBlend, saturationLevel, negativeAllowed,
                gain, readNoise);
    }

    /**
     * @param sigmaPixels standard deviation in pixels of the Gaussian that smooths the data for
     *                    the candidate search only (fits use the raw counts); 0 for none, at most 10
     * @return a copy with that smoothing
     */
    public PeakFinder withSmoothing(double sigmaPixels) {
        if (!(sigmaPixels >= 0 && sigmaPixels <= 10)) {
            throw new IllegalArgumentException("smoothing must be 0 to 10 pixels, got " + sigmaPixels);
        }
        return new PeakFinder(threshold, baselineWindow, sigmaPixels, fitHalfWidth, maxBlend, saturationLevel,
                negativeAllowed, gain, readNoise);
    }

    /**
     * @param fwhms half-width of a fit window in first-estimate FWHMs, 1 to 10
     * @return a copy with that window
     */
    public PeakFinder withFitHalfWidth(double fwhms) {
        if (!(fwhms >= 1 && fwhms <= 10)) {
            throw new IllegalArgumentException("fit half-width must be 1 to 10 FWHM, got " + fwhms);
        }
        return new PeakFinder(threshold, baselineWindow, smoothing, fwhms, maxBlend, saturationLevel, negativeAllowed,
                gain, readNoise);
    }

    /**
     * @param peaks largest number of peaks fitted together, 1 to 20
     * @return a copy with that limit
     */
    public PeakFinder withMaxBlend(int peaks) {
        if (peaks < 1 || peaks > 20) {
            throw new IllegalArgumentException("max blend must be 1 to 20 peaks, got " + peaks);
        }
        return new PeakFinder(threshold, baselineWindow, smoothing, fitHalfWidth, peaks, saturationLevel,
                negativeAllowed, gain, readNoise);
    }

    /**
     * @param counts the detector's saturation level in counts (pixels at or above it are
     *               saturated); above 0, or positive infinity for none
     * @return a copy with that level
     * @throws IllegalArgumentException for NaN or a level at or below 0 (every pixel would be
     *                                  saturated)
     */
    public PeakFinder withSaturationLevel(double counts) {
        if (!(counts > 0)) {
            throw new IllegalArgumentException("saturation level must be above 0 counts, or +infinity for none, got "
                    + counts + " (every pixel would be saturated)");
        }
        return new PeakFinder(threshold, baselineWindow, smoothing, fitHalfWidth, maxBlend, counts, negativeAllowed,
                gain, readNoise);
    }

    /**
     * @param allowed whether negative counts are accepted (bias-subtracted data); by default they
     *                are refused as a sign of a wrong input
     * @return a copy with that policy
     */
    public PeakFinder withNegativeCountsAllowed(boolean allowed) {
        return new PeakFinder(threshold, baselineWindow, smoothing, fitHalfWidth, maxBlend, saturationLevel, allowed,
                gain, readNoise);
    }

    /**
     * The detector's gain, from its data sheet or a photon-transfer measurement: the line's part of
     * each pixel's variance is then this times its counts, instead of the gain the counts' step
     * gives or the finder estimates (see the class comment). Pixel uncertainties given to
     * {@link #find(double[], double[])} are still used as given.
     *
     * @param countsPerElectron counts per photo-electron, finite and &gt; 0 (3.7 for a camera of
     *                          0.27 electrons per count)
     * @return a copy with that gain
     * @throws IllegalArgumentException naming the gain when it is not finite and positive
     */
    public PeakFinder withGain(double countsPerElectron) {
        if (!(countsPerElectron > 0) || Double.isInfinite(countsPerElectron)) {
            throw new IllegalArgumentException("gain must be a finite number of counts per photo-electron > 0, got "
                    + countsPerElectron);
        }
        return new PeakFinder(threshold, baselineWindow, smoothing, fitHalfWidth, maxBlend, saturationLevel,
                negativeAllowed, countsPerElectron, readNoise);
    }

    /**
     * The detector's read noise: each pixel's background noise is then at least this, where the
     * measured background noise is smaller (see the class comment).
     *
     * @param counts read noise in counts RMS (not electrons), finite and &gt;= 0
     * @return a copy with that read noise
     * @throws IllegalArgumentException naming the read noise when it is negative, NaN or infinite
     */
    public PeakFinder withReadNoise(double counts) {
        if (!(counts >= 0) || Double.isInfinite(counts)) {
            throw new IllegalArgumentException("read noise must be a finite number of counts (RMS) >= 0, got "
                    + counts);
        }
        return new PeakFinder(threshold, baselineWindow, smoothing, fitHalfWidth, maxBlend, saturationLevel,
                negativeAllowed, gain, counts);
    }

    /** @return the gain given in counts per photo-electron, NaN when none was given */
    public double gain() {
        return gain;
    }

    /** @return the read noise given in counts RMS, NaN when none was given */
    public double readNoise() {
        return readNoise;
    }

    /**
     * Finds peaks with modelled pixel variances (see the class comment).
     *
     * @param counts counts per pixel, finite (and not negative unless allowed), at least
     *               {@value #MIN_PIXELS} pixels, not all equal
     * @return the peaks, sorted by centroid
     * @throws CalibrationException ({@link CalibrationException#UNUSABLE_COUNTS}) for an empty,
     *         short or constant spectrum, naming the first NaN, infinite or (when not allowed)
     *         negative pixel, or when every pixel is saturated
     */
    public Peaks find(double[] counts) {
        return find(counts, null);
    }

    /**
     * Finds peaks with the caller's per-pixel standard uncertainties.
     *
     * @param counts counts per pixel, as for {@link #find(double[])}
     * @param sigma  standard uncertainty of each pixel in counts, finite and positive; or null to
     *               model them
     * @return the peaks, sorted by centroid
     * @throws CalibrationException as for {@link #find(double[])}, and naming the first pixel whose
     *         uncertainty is not finite and positive
     * @throws IllegalArgumentException for an uncertainty array of another length
     */
    public Peaks find(double[] counts, double[] sigma) {
        int n = counts.length;
        check(counts, sigma);
        boolean[] saturated = new boolean[n];
        int saturatedCount = 0;
        for (int i = 0; i < n; i++) {
            if (counts[i] >= saturationLevel) {
                saturated[i] = true;
                saturatedCount++;
            }
        }
        if (saturatedCount == n) {
            throw new CalibrationException(CalibrationException.UNUSABLE_COUNTS, "all " + n + " pixels are saturated (at or above " + saturationLevel
                    + " counts)");
        }
        double firstNoise = Baseline.noise(counts, saturated);
        double largest = 0;
        for (double c : counts) {
            largest = Math.max(largest, Math.abs(c));
        }
        // A noiseless spectrum has no noise to measure: a floor far below any count keeps the
        // variances positive, and every local maximum then counts.
        double floor = 1e-12 * largest;
        double step = Baseline.latticeStep(counts, saturated);
        boolean counted = firstNoise <= floor && step > 0;
        // Clamped: not counted, and at least CLAMPED_SHARE of the pixels sit exactly at the lowest
        // value (negative counts set to 0 after a dark subtraction). The MAD of a sample more than
        // half of whose values are tied is 0; the noise then comes from the pixels above the clamp.
        double clamp = Double.NaN;
        if (!counted) {
            double lowest = Double.POSITIVE_INFINITY;
            for (int i = 0; i < n; i++) {
                lowest = saturated[i] ? lowest : Math.min(lowest, counts[i]);
            }
            int at = 0;
            for (int i = 0; i < n; i++) {
                at += !saturated[i] && counts[i] == lowest ? 1 : 0;
            }
            if (at >= CLAMPED_SHARE * (n - saturatedCount)) {
                clamp = lowest;
                firstNoise = Baseline.censoredNoise(counts, saturated, clamp, step);
            }
        }
        firstNoise = Math.max(firstNoise, floor);
        int window = Math.min(baselineWindow, n);
        Baseline.Estimate estimate = Baseline.estimate(counts, saturated, window, firstNoise);
        for (int pass = 0; pass < 3 && !Double.isNaN(clamp); pass++) {
            // The first censored estimate read its upper quantile partly on lines and their wings:
            // again over the pixels the baseline kept, whose mask then tightens, until it settles.
            double again = Math.max(floor, Baseline.censoredNoise(counts, estimate.mask(), clamp, step));
            if (Math.abs(again - firstNoise) < 0.02 * firstNoise) {
                break;
            }
            firstNoise = again;
            estimate = Baseline.estimate(counts, saturated, window, firstNoise);
        }
        double[] baseline = estimate.baseline();
        // A median of |deviations| over a baseline window (~100 pixels) scatters by some 12 %;
        // the noise changes more slowly than the baseline, so it is taken over wider windows.
        int noiseWindow = Math.min(n, Math.max(4 * window, n / 8));
        double[] noise = Double.isNaN(clamp) ? Baseline.localNoise(counts, estimate, noiseWindow, firstNoise)
                : Baseline.localCensoredNoise(counts, estimate, noiseWindow, firstNoise, clamp, step);
        double[] line = new double[n];
        // A read noise given is a floor under the measured background noise (which also holds the
        // baseline's own photon noise and any other noise the detector adds).
        double readFloor = Double.isNaN(readNoise) ? 0 : readNoise;
        for (int i = 0; i < n; i++) {
            noise[i] = Math.max(Math.max(noise[i], floor), readFloor);
            line[i] = counts[i] - baseline[i];
        }
        double[] smooth = smooth(line, smoothing);
        boolean clamped = !Double.isNaN(clamp);
        double share = clampedShare(counts, estimate, clamp);
        // The gain: given; or the counts' common step when it is not 1 (whole photo-electrons times
        // a gain: a Poisson variance of that step times their counts); or, for modelled variances,
        // estimated from the bright lines' residuals, 1 when too few lines allow it or when the
        // estimate is not clearly above 1 (GainEstimate.exceedsOne).
        double stepGain = counted || step > 1 ? step : 1;
        if (!Double.isNaN(gain) || stepGain != 1 || sigma != null) {
            double used = Double.isNaN(gain) ? stepGain : gain;
            Peaks.GainSource source = !Double.isNaN(gain) ? Peaks.GainSource.GIVEN
                    : stepGain != 1 ? Peaks.GainSource.STEP : Peaks.GainSource.ASSUMED;
            Run run = run(counts, sigma, saturated, noise, counted, used, clamped, baseline, line, smooth, false);
            return run.peaks().withNoiseModel(counted, used, clamp, share)
                    .withGain(source, GainEstimate.NONE, readNoise);
        }
        Run first = run(counts, sigma, saturated, noise, counted, 1, clamped, baseline, line, smooth, true);
        GainEstimate estimated = first.estimate();
        if (!estimated.exceedsOne()) {
            return first.peaks().withNoiseModel(counted, 1, clamp, share)
                    .withGain(Peaks.GainSource.ASSUMED, estimated, readNoise);
        }
        // Fitted again with the estimated gain's variances, the lines' residuals estimate it once
        // more with the right weights; a third pass only when that moves it by more than its own
        // standard deviation.
        Run second = run(counts, sigma, saturated, noise, counted, estimated.value(), clamped, baseline, line, smooth,
                true);
        Run last = second;
        GainEstimate again = second.estimate();
        if (again.exceedsOne() && Math.abs(again.value() - estimated.value()) > again.sigma()) {
            last = run(counts, sigma, saturated, noise, counted, again.value(), clamped, baseline, line, smooth, false);
            estimated = again;
        }
        return last.peaks().withNoiseModel(counted, estimated.value(), clamp, share)
                .withGain(Peaks.GainSource.ESTIMATED, estimated, readNoise);
    }

    /** One search and fit of the peaks with one gain, and the gain the fits' residuals estimate when asked. */
    private record Run(Peaks peaks, GainEstimate estimate) {
    }

    private Run run(double[] counts, double[] sigma, boolean[] saturated, double[] noise, boolean counted,
            double gain, boolean clamped, double[] baseline, double[] line, double[] smooth, boolean estimate) {
        int[] candidates = candidates(line, smooth, saturated, sigma, noise, gain);
        return fitAll(counts, sigma, saturated, noise, counted, gain, clamped, baseline, line, candidates, estimate);
    }

    /** The share of the baseline's unmasked pixels that sit at the clamp, or NaN when not clamped. */
    private static double clampedShare(double[] counts, Baseline.Estimate estimate, double clamp) {
        if (Double.isNaN(clamp)) {
            return Double.NaN;
        }
        int at = 0;
        int all = 0;
        for (int i = 0; i < counts.length; i++) {
            if (!estimate.mask()[i]) {
                all++;
                at += counts[i] == clamp ? 1 : 0;
            }
        }
        return all == 0 ? Double.NaN : (double) at / all;
    }

    private void check(double[] counts, double[] sigma) {
        int n = counts.length;
        if (n == 0) {
            throw new CalibrationException(CalibrationException.UNUSABLE_COUNTS, "the spectrum is empty");
        }
        if (n < MIN_PIXELS) {
            throw new CalibrationException(CalibrationException.UNUSABLE_COUNTS, "a spectrum needs at least "
                    + MIN_PIXELS + " pixels, got " + n);
        }
        for (int i = 0; i < n; i++) {
            double c = counts[i];
            if (!Double.isFinite(c)) {
                throw new CalibrationException(CalibrationException.UNUSABLE_COUNTS, "pixel " + i
                        + ": counts must be finite, got " + c);
            }
            if (c < 0 && !negativeAllowed) {
                throw new CalibrationException(CalibrationException.UNUSABLE_COUNTS, "pixel " + i
                        + ": counts must not be negative, got " + c
                        + " (allow them with withNegativeCountsAllowed(true) for bias-subtracted data)");
            }
        }
        boolean constant = true;
        for (int i = 1; i < n && constant; i++) {
            constant = counts[i] == counts[0];
        }
        if (constant) {
            throw new CalibrationException(CalibrationException.UNUSABLE_COUNTS, "the spectrum is constant (all " + n + " pixels are " + counts[0]
                    + " counts): it has no peaks and no noise to measure");
        }
        if (sigma != null) {
            if (sigma.length != n) {
                throw new IllegalArgumentException("the uncertainties need one value per pixel (" + n + "), got "
                        + sigma.length);
            }
            for (int i = 0; i < n; i++) {
                if (!(sigma[i] > 0) || Double.isInfinite(sigma[i])) {
                    throw new CalibrationException(CalibrationException.UNUSABLE_COUNTS, "pixel " + i
                            + ": uncertainty must be finite and positive, got " + sigma[i]);
                }
            }
        }
    }

    /** Gaussian smoothing with the kernel renormalised at the ends. */
    private static double[] smooth(double[] y, double sigma) {
        int n = y.length;
        if (sigma == 0) {
            return y.clone();
        }
        int h = (int) Math.ceil(3 * sigma);
        double[] kernel = new double[2 * h + 1];
        for (int k = -h; k <= h; k++) {
            kernel[k + h] = Math.exp(-0.5 * k * k / (sigma * sigma));
        }
        double[] out = new double[n];
        for (int i = 0; i < n; i++) {
            double sum = 0;
            double weight = 0;
            for (int k = Math.max(-h, -i); k <= Math.min(h, n - 1 - i); k++) {
                sum += kernel[k + h] * y[i + k];
                weight += kernel[k + h];
            }
            out[i] = sum / weight;
        }
        return out;
    }

    /**
     * A pixel's standard deviation: the caller's, or the background noise and the line's Poisson
     * variance, gain times its counts (gain the counts per photon: 1 unless counted, see find).
     */
    private static double localSigma(double[] sigma, double[] noise, double lineCounts, int i, double gain) {
        return sigma != null ? sigma[i] : Math.sqrt(noise[i] * noise[i] + gain * Math.max(0, lineCounts));
    }

    private int[] candidates(double[] line, double[] smooth, boolean[] saturated, double[] sigma, double[] noise,
            double gain) {
        int n = line.length;
        List<Integer> found = new ArrayList<>();
        for (int i = 1; i + 1 < n; i++) {
            if (smooth[i] > smooth[i - 1] && smooth[i] >= smooth[i + 1] && smooth[i] >= 0.5 * threshold * noise[i]) {
                found.add(i);
            }
        }
        // Merge maxima that are not separated by a real dip (noise on one line's top or wings).
        boolean merged = true;
        while (merged && found.size() > 1) {
            merged = false;
            for (int k = 0; k + 1 < found.size(); k++) {
                int a = found.get(k);
                int b = found.get(k + 1);
                double dip = Double.POSITIVE_INFINITY;
                // One saturated plateau (noise-free flat top) when every pixel between is saturated;
                // two saturated lines with unsaturated pixels between are two peaks.
                boolean flat = true;
                for (int i = a; i <= b; i++) {
                    dip = Math.min(dip, smooth[i]);
                    flat &= saturated[i];
                }
                boolean aLower = smooth[a] < smooth[b];
                int lower = aLower ? a : b;
                if (flat || smooth[lower] - dip < PROMINENCE * localSigma(sigma, noise, smooth[lower], lower, gain)) {
                    found.remove(aLower ? k : k + 1);
                    merged = true;
                    break;
                }
            }
        }
        int[] out = new int[found.size()];
        for (int k = 0; k < out.length; k++) {
            out[k] = found.get(k);
        }
        return out;
    }

    /** A first FWHM from the half-height crossings of the baseline-subtracted counts. */
    private static double fwhmEstimate(double[] line, int c, int left, int right) {
        int n = line.length;
        double top = line[c];
        if (c > 0) {
            top = Math.max(top, line[c - 1]);
        }
        if (c + 1 < n) {
            top = Math.max(top, line[c + 1]);
        }
        double half = top / 2;
        double lo = c;
        int i = c;
        while (i > left && line[i] > half) {
            i--;
        }
        if (line[i] <= half && i < c) {
            lo = i + (half - line[i]) / (line[i + 1] - line[i]);
        } else {
            lo = i;
        }
        int j = c;
        while (j < right && line[j] > half) {
            j++;
        }
        double hi;
        if (line[j] <= half && j > c) {
            hi = j - (half - line[j]) / (line[j - 1] - line[j]);
        } else {
            hi = j;
        }
        return Math.max(1, Math.min(MAX_FWHM_ESTIMATE, hi - lo));
    }

    /** What every fit of one spectrum reads: the counts and their noise model, and the candidates. */
    private record Frame(double[] counts, double[] sigma, boolean[] saturated, double[] noise, boolean counted,
            double gain,
            double[] line, int[] candidates, double[] start, double[] fwhm, int[] halfWindow, boolean estimate) {
    }

    /**
     * Fits every chain of overlapping candidates twice if need be. The first pass allows any width
     * from {@value #MIN_WIDTH} pixel up. Its fits give the instrument's width s_ref, their median
     * width (at least {@value #MIN_REFERENCE_FITS} fits; common practice). A chain whose fit
     * collapsed below {@value #WIDTH_FLOOR} s_ref, or whose covariance was singular or not finite,
     * is fitted again with that floor: a fit that still ends below it, or has no finite positive
     * variances, is refitted with the width held at s_ref, then accepted as any other (see the
     * class comment).
     */
    private Run fitAll(double[] counts, double[] sigma, boolean[] saturated, double[] noise, boolean counted,
            double gain, boolean clamped, double[] baseline, double[] line, int[] candidates, boolean estimate) {
        int n = counts.length;
        int m = candidates.length;
        double[] fwhm = new double[m];
        double[] start = new double[m];
        int[] halfWindow = new int[m];
        for (int k = 0; k < m; k++) {
            int c = candidates[k];
            int left = k > 0 ? (candidates[k - 1] + c) / 2 : Math.max(0, c - (int) MAX_FWHM_ESTIMATE);
            int right = k + 1 < m ? (candidates[k + 1] + c) / 2 : Math.min(n - 1, c + (int) MAX_FWHM_ESTIMATE);
            fwhm[k] = fwhmEstimate(line, c, left, right);
            start[k] = startCentre(line, saturated, c);
            halfWindow[k] = Math.max(3, (int) Math.ceil(fitHalfWidth * fwhm[k]));
        }
        Frame frame = new Frame(counts, sigma, saturated, noise, counted, gain, line, candidates, start, fwhm,
                halfWindow, estimate);
        List<int[]> chains = new ArrayList<>();
        int k = 0;
        while (k < m) {
            int end = k + 1;
            while (end < m && candidates[end] - halfWindow[end] <= candidates[end - 1] + halfWindow[end - 1]) {
                end++;
            }
            chains.add(new int[] {k, end});
            k = end;
        }
        Collector[] parts = new Collector[chains.size()];
        double[] widths = new double[m];
        int fitted = 0;
        for (int c = 0; c < parts.length; c++) {
            parts[c] = new Collector(chains.get(c)[1] - chains.get(c)[0], counted);
            fitChain(chains.get(c)[0], chains.get(c)[1], frame, MIN_WIDTH, Double.NaN, parts[c]);
            for (int f = 0; f < parts[c].fits; f++) {
                widths[fitted++] = parts[c].fitWidth[f];
            }
        }
        double reference = fitted >= MIN_REFERENCE_FITS ? Baseline.median(widths, fitted) : Double.NaN;
        double floor = Double.isNaN(reference) ? MIN_WIDTH : Math.max(MIN_WIDTH, WIDTH_FLOOR * reference);
        Collector out = new Collector(m, counted);
        for (int c = 0; c < parts.length; c++) {
            if (!Double.isNaN(reference) && (parts[c].degenerate || parts[c].narrowest() < floor)) {
                parts[c] = new Collector(chains.get(c)[1] - chains.get(c)[0], counted);
                fitChain(chains.get(c)[0], chains.get(c)[1], frame, floor, reference, parts[c]);
            }
            out.absorb(parts[c]);
        }
        Peaks peaks = out.build(n, noise, baseline, sigma != null, clamped);
        return new Run(peaks, estimate ? out.estimateGain(gain, counted) : GainEstimate.NONE);
    }

    /** Splits a chain of overlapping candidates [from, to) into blends of at most maxBlend. */
    private void fitChain(int from, int to, Frame frame, double floor, double reference, Collector out) {
        int[] candidates = frame.candidates();
        if (to - from > maxBlend) {
            int cut = from + 1;
            int widest = -1;
            for (int k = from + 1; k < to; k++) {
                int gap = candidates[k] - candidates[k - 1];
                if (gap > widest) {
                    widest = gap;
                    cut = k;
                }
            }
            fitChain(from, cut, frame, floor, reference, out);
            fitChain(cut, to, frame, floor, reference, out);
            return;
        }
        List<Integer> members = new ArrayList<>();
        for (int k = from; k < to; k++) {
            members.add(k);
        }
        fitBlend(members, frame, floor, reference, out);
    }

    private static double startCentre(double[] line, boolean[] saturated, int c) {
        int n = line.length;
        if (saturated[c]) {
            int a = c;
            int b = c;
            while (a > 0 && saturated[a - 1]) {
                a--;
            }
            while (b + 1 < n && saturated[b + 1]) {
                b++;
            }
            return 0.5 * (a + b);
        }
        if (c == 0 || c == n - 1) {
            return c;
        }
        double l = line[c - 1];
        double mid = line[c];
        double r = line[c + 1];
        double curvature = l - 2 * mid + r;
        if (curvature >= 0) {
            return c;
        }
        double shift = 0.5 * (l - r) / curvature;
        return c + Math.max(-0.5, Math.min(0.5, shift));
    }

    /**
     * A fit with the variances modelled from the observed counts (s, kept), then, when the caller
     * gave none, once more with the line's Poisson variance from the fitted model, not the noisy data.
     */
    private static GaussianBlendFit.Result fitTwice(double[] x, double[] y, double[] s, double[] q0, double mid,
            double half, int lo, int hi, double maxWidth, boolean fixedWidth, Frame frame, double[] used) {
        GaussianBlendFit.Result fit = fixedWidth ? GaussianBlendFit.fitFixedWidth(x, y, s, q0, mid, half, lo, hi)
                : GaussianBlendFit.fit(x, y, s, q0, mid, half, lo, hi, maxWidth);
        System.arraycopy(s, 0, used, 0, s.length);
        if (fit == null || frame.sigma() != null) {
            return fit;
        }
        double[] noise = frame.noise();
        double[] model = new double[x.length];
        // Counted photons: no pixel's variance below one photon's (gain^2 counts^2), as in the first
        // pass; the model's far wings would otherwise weigh an empty pixel as known to 1e-11 counts
        // and a stray count there as a chi-square of 1e20, which pins the fit.
        double least = frame.counted() ? LEAST_PHOTONS * frame.gain() * frame.gain() : 0;
        for (int i = 0; i < x.length; i++) {
            int pixel = (int) x[i];
            model[i] = Math.sqrt(noise[pixel] * noise[pixel]
                    + Math.max(least, frame.gain() * Math.max(0, GaussianBlendFit.linesAt(fit.parameters(), x[i]))));
        }
        System.arraycopy(model, 0, used, 0, model.length);
        return fixedWidth ? GaussianBlendFit.fitFixedWidth(x, y, model, fit.parameters(), mid, half, lo, hi)
                : GaussianBlendFit.fit(x, y, model, fit.parameters(), mid, half, lo, hi, maxWidth);
    }

    /** Whether every flux and centre of a fit has a finite, positive variance. */
    private static boolean finiteVariances(GaussianBlendFit.Result fit, int kCount) {
        double[][] c = fit.covariance();
        for (int j = 0; j < 2 * kCount; j++) {
            double v = c[GaussianBlendFit.FIRST + j][GaussianBlendFit.FIRST + j];
            if (!(v > 0) || Double.isInfinite(v)) {
                return false;
            }
        }
        return true;
    }

    /**
     * Fits one blend; drops its weakest member and refits while a member fails (see the class
     * comment). With a reference width (the second pass), a fit whose width ends below the floor or
     * whose covariance is not finite is refitted with the width held at the reference.
     */
    private void fitBlend(List<Integer> members, Frame frame, double floor, double reference, Collector out) {
        double[] counts = frame.counts();
        double[] sigma = frame.sigma();
        boolean[] saturated = frame.saturated();
        double[] noise = frame.noise();
        double[] line = frame.line();
        int[] candidates = frame.candidates();
        double[] start = frame.start();
        double[] fwhm = frame.fwhm();
        int[] halfWindow = frame.halfWindow();
        double gain = frame.gain();
        int n = counts.length;
        while (!members.isEmpty()) {
            int first = members.get(0);
            int last = members.get(members.size() - 1);
            int lo = Math.max(0, candidates[first] - halfWindow[first]);
            int hi = Math.min(n - 1, candidates[last] + halfWindow[last]);
            int kCount = members.size();
            int p = GaussianBlendFit.FIRST + 2 * kCount;
            int used = 0;
            for (int i = lo; i <= hi; i++) {
                if (!saturated[i]) {
                    used++;
                }
            }
            if (used < p + 2) {
                if (kCount == 1) {
                    out.unfitted(candidates[first]);
                    return;
                }
                int weak = weakest(members, line, candidates);
                out.unfitted(candidates[weak]);
                members.remove(Integer.valueOf(weak));
                continue;
            }
            double[] x = new double[used];
            double[] y = new double[used];
            double[] s = new double[used];
            int u = 0;
            for (int i = lo; i <= hi; i++) {
                if (!saturated[i]) {
                    x[u] = i;
                    y[u] = line[i];
                    // First pass: the observed counts stand in for the line's Poisson variance, at
                    // least one count (Neyman's modified chi-square, common practice): a pixel with no
                    // counts where the line still puts some would otherwise pin the fit.
                    s[u] = localSigma(sigma, noise, Math.max(gain, line[i]), i, gain);
                    u++;
                }
            }
            double[] q0 = new double[p];
            double width = 0;
            for (int k : members) {
                width += fwhm[k];
            }
            width = width / kCount / FWHM_PER_SIGMA;
            q0[GaussianBlendFit.WIDTH] = Math.max(0.5, width);
            for (int j = 0; j < kCount; j++) {
                int k = members.get(j);
                double height = Math.max(line[candidates[k]], noise[candidates[k]]);
                q0[GaussianBlendFit.FIRST + 2 * j] = height * q0[GaussianBlendFit.WIDTH] * SQRT_2PI;
                q0[GaussianBlendFit.FIRST + 2 * j + 1] = start[k];
            }
            double mid = 0.5 * (lo + hi);
            double half = Math.max(1, 0.5 * (hi - lo));
            double maxWidth = Math.max(1, 0.5 * (hi - lo));
            double[] fitSigma = new double[used];
            GaussianBlendFit.Result fit = fitTwice(x, y, s, q0, mid, half, lo, hi, maxWidth, false, frame, fitSigma);
            boolean fixed = false;
            if (fit == null || !finiteVariances(fit, kCount)) {
                out.degenerate = true;
            }
            if (!Double.isNaN(reference) && (fit == null || fit.parameters()[GaussianBlendFit.WIDTH] < floor
                    || !finiteVariances(fit, kCount))) {
                q0[GaussianBlendFit.WIDTH] = reference;
                for (int j = 0; j < kCount; j++) {
                    int a = GaussianBlendFit.FIRST + 2 * j;
                    q0[a] = Math.max(line[candidates[members.get(j)]], noise[candidates[members.get(j)]])
                            * reference * SQRT_2PI;
                }
                fit = fitTwice(x, y, s, q0, mid, half, lo, hi, maxWidth, true, frame, fitSigma);
                fixed = true;
            }
            if (fit != null && !finiteVariances(fit, kCount)) {
                fit = null;
            }
            if (fit == null) {
                if (kCount == 1) {
                    out.unfitted(candidates[first]);
                    return;
                }
                int weak = weakest(members, line, candidates);
                out.unfitted(candidates[weak]);
                members.remove(Integer.valueOf(weak));
                continue;
            }
            double[] q = fit.parameters();
            double s0 = q[GaussianBlendFit.WIDTH];
            boolean widthOk = fixed || (s0 > floor * 1.0001 && s0 < maxWidth * 0.9999);
            // The weakest offending component goes first; a bad width condemns the weakest of all.
            int drop = -1;
            boolean failure = false;
            double dropFlux = Double.POSITIVE_INFINITY;
            for (int j = 0; j < kCount; j++) {
                double flux = q[GaussianBlendFit.FIRST + 2 * j];
                double centre = q[GaussianBlendFit.FIRST + 2 * j + 1];
                double height = topPixel(flux, s0);
                boolean inside = centre >= lo - 0.5 && centre <= hi + 0.5;
                boolean ok = widthOk && flux > 0 && inside;
                double fluxSigma = Math.sqrt(fit.covariance()[GaussianBlendFit.FIRST + 2 * j][GaussianBlendFit.FIRST + 2 * j]);
                boolean strong = inside && height >= threshold * noise[nearest(centre, n)]
                        && flux >= threshold * fluxSigma;
                if ((!ok || !strong) && flux < dropFlux) {
                    dropFlux = flux;
                    drop = j;
                    failure = !ok;
                }
            }
            if (drop < 0) {
                int dof = fit.points() - p;
                int group = out.newFit(fit.chiSquare(), dof, fixed ? Double.POSITIVE_INFINITY : s0);
                if (frame.estimate() && !fixed) {
                    boolean clear = true;
                    for (int i = lo; i <= hi; i++) {
                        clear &= !saturated[i];
                    }
                    if (clear) {
                        out.gainPixels(group, GainEstimate.pixels(fit, x, y, fitSigma, noise, mid, half));
                    }
                }
                for (int j = 0; j < kCount; j++) {
                    int a = GaussianBlendFit.FIRST + 2 * j;
                    double flux = q[a];
                    double centre = q[a + 1];
                    double fw = FWHM_PER_SIGMA * s0;
                    double height = topPixel(flux, s0);
                    int flags = 0;
                    if (kCount > 1) {
                        flags |= PeakFlag.BLENDED.bit();
                    }
                    int k = members.get(j);
                    if (candidates[k] - halfWindow[k] < 0 || candidates[k] + halfWindow[k] > n - 1) {
                        flags |= PeakFlag.EDGE.bit();
                    }
                    int from = Math.max(0, (int) Math.floor(centre - fw));
                    int to = Math.min(n - 1, (int) Math.ceil(centre + fw));
                    for (int i = from; i <= to; i++) {
                        if (saturated[i]) {
                            flags |= PeakFlag.SATURATED.bit();
                            break;
                        }
                    }
                    out.add(group, centre, fit.covariance()[a + 1][a + 1], flux, fit.covariance()[a][a], height, fw,
                            height / noise[nearest(centre, n)], flags,
                            FWHM_PER_SIGMA * FWHM_PER_SIGMA * fit.covariance()[GaussianBlendFit.WIDTH][GaussianBlendFit.WIDTH]);
                }
                return;
            }
            // A failed width condemns the blend's weakest member; it is refitted without it.
            if (failure) {
                out.unfitted(candidates[members.get(drop)]);
            }
            members.remove(drop);
        }
    }

    /**
     * The counts a line puts into a pixel centred on it: flux (Phi(1/(2s)) - Phi(-1/(2s))). Unlike
     * the continuous profile's top, flux / (s sqrt(2 pi)), this cannot exceed the flux, so a
     * one-pixel noise spike fitted by a very narrow Gaussian does not pass for a strong line.
     */
    private static double topPixel(double flux, double s) {
        return flux * org.apache.commons.numbers.gamma.Erf.value(0.5 / (s * Math.sqrt(2)));
    }

    private static int nearest(double pixel, int n) {
        return (int) Math.max(0, Math.min(n - 1, Math.round(pixel)));
    }

    private static int weakest(List<Integer> members, double[] line, int[] candidates) {
        int weakest = members.get(0);
        for (int k : members) {
            if (line[candidates[k]] < line[candidates[weakest]]) {
                weakest = k;
            }
        }
        return weakest;
    }

    /**
     * The Wilson-Hilferty approximation to a quantile of chi-square over its degrees of freedom:
     * (1 - 2/(9 nu) + z sqrt(2/(9 nu)))^3 for the standard normal quantile z (E. B. Wilson and
     * M. M. Hilferty, PNAS 17, 684 (1931)).
     */
    static double reducedChiSquareQuantile(double z, int dof) {
        double a = 2.0 / (9 * dof);
        double b = 1 - a + z * Math.sqrt(a);
        return b * b * b;
    }

    /**
     * Flags {@link PeakFlag#WIDE} every peak whose FWHM S exceeds the instrument's width there by
     * more than {@value #WIDE_SIGMAS} standard uncertainties. The instrument's width across the
     * detector is a weighted quadratic in the pixel (weights 1 / u(S)^2, u(S) from each profile
     * fit's covariance) fitted to the peaks that are neither poorly fitted nor saturated, the worst
     * outlier beyond 3 standard uncertainties removed and the fit repeated, at most a third of the
     * peaks; the test's uncertainty is sqrt(u(S)^2 + u(m)^2) (u(m) the model's at that pixel from
     * its covariance), times sqrt of the model's reduced chi-square when above 1, so a width trend
     * the quadratic does not follow makes the test more cautious, not more eager. Needs at least
     * {@value #MIN_WIDTH_PEAKS} such peaks; with fewer nothing is flagged. A two-line blend of
     * separation d and flux shares f, 1 - f adds f (1 - f) d^2 to the profile's variance (second
     * moments of a mixture, common practice), so this catches a pair about half a FWHM apart with
     * comparable fluxes at S/N of a few tens; a faint partner, or one a fraction of a pixel away,
     * changes the width too little to be seen, and no profile test can tell it from one line.
     *
     * @param pixels    detector pixels
     * @param centre    centroids
     * @param fwhm      fitted FWHMs
     * @param fwhmSigma their standard uncertainties
     * @param flags     the flags, updated in place
     */
    static void flagWide(int pixels, double[] centre, double[] fwhm, double[] fwhmSigma, int[] flags) {
        int n = centre.length;
        double half = Math.max(0.5, 0.5 * (pixels - 1));
        double[] x = new double[n];
        double[] weight = new double[n];
        boolean[] use = new boolean[n];
        int used = 0;
        for (int k = 0; k < n; k++) {
            x[k] = (centre[k] - half) / half;
            boolean usable = Double.isFinite(fwhm[k]) && fwhmSigma[k] > 0 && Double.isFinite(fwhmSigma[k]);
            weight[k] = usable ? 1 / (fwhmSigma[k] * fwhmSigma[k]) : 0;
            use[k] = usable && (flags[k] & (PeakFlag.POOR_FIT.bit() | PeakFlag.SATURATED.bit())) == 0;
            used += use[k] ? 1 : 0;
        }
        if (used < MIN_WIDTH_PEAKS) {
            return;
        }
        int removable = used / 3;
        PolynomialLeastSquares.Solution model;
        double scale;
        while (true) {
            model = PolynomialLeastSquares.fit(x, fwhm, weight, use, 2);
            if (model == null) {
                return;
            }
            scale = Math.max(1, model.chiSquare() / (used - 3));
            int worst = -1;
            double worstZ = 3;
            for (int k = 0; k < n; k++) {
                if (use[k]) {
                    double z = Math.abs(fwhm[k] - PolynomialLeastSquares.evaluate(model.coefficients(), x[k]))
                            / (fwhmSigma[k] * Math.sqrt(scale));
                    if (z > worstZ) {
                        worstZ = z;
                        worst = k;
                    }
                }
            }
            if (worst < 0 || removable == 0) {
                break;
            }
            use[worst] = false;
            used--;
            removable--;
        }
        double[][] c = model.covariance();
        for (int k = 0; k < n; k++) {
            if (weight[k] == 0 || (flags[k] & PeakFlag.SATURATED.bit()) != 0) {
                continue;
            }
            double[] g = {1, x[k], x[k] * x[k]};
            double modelVariance = 0;
            for (int i = 0; i < 3; i++) {
                for (int j = 0; j < 3; j++) {
                    modelVariance += g[i] * c[i][j] * g[j];
                }
            }
            double excess = fwhm[k] - PolynomialLeastSquares.evaluate(model.coefficients(), x[k]);
            if (excess > WIDE_SIGMAS * Math.sqrt(scale * (fwhmSigma[k] * fwhmSigma[k] + modelVariance))) {
                flags[k] |= PeakFlag.WIDE.bit();
            }
        }
    }

    /** Gathers accepted peaks, their fits and unfitted candidates, then scales and sorts them into {@link Peaks}. */
    private static final class Collector {
        private static final double Z99 = 2.3263478740408408;
        private static final int MIN_FITS_TO_POOL = 5;

        private double[][] columns;
        private int[] flags;
        private int[] fitOf;
        private int size;
        private double[] fitChiSquare = new double[8];
        private int[] fitDof = new int[8];
        /** Each fit's width s in pixels; +infinity where it was held fixed. */
        private double[] fitWidth = new double[8];
        private int fits;
        /** Whether a fit failed or had a covariance without finite, positive variances. */
        private boolean degenerate;
        private int[] unfitted = new int[4];
        private int unfittedSize;
        /** Per fit, the pixels from which the gain is estimated ({@link GainEstimate#pixels}); null when none. */
        private double[][][] gainPixels = new double[8][][];

        /** Whether the exposure counted photons (see find): the Poisson variances need no scale. */
        private final boolean counted;

        Collector(int capacity, boolean counted) {
            this.counted = counted;
            columns = new double[8][Math.max(1, capacity)];
            flags = new int[Math.max(1, capacity)];
            fitOf = new int[Math.max(1, capacity)];
        }

        /** @return the index of a new fit */
        int newFit(double chiSquare, int dof, double width) {
            if (fits == fitDof.length) {
                fitChiSquare = Arrays.copyOf(fitChiSquare, 2 * fits);
                fitDof = Arrays.copyOf(fitDof, 2 * fits);
                fitWidth = Arrays.copyOf(fitWidth, 2 * fits);
                gainPixels = Arrays.copyOf(gainPixels, 2 * fits);
            }
            fitChiSquare[fits] = chiSquare;
            fitDof[fits] = dof;
            fitWidth[fits] = width;
            return fits++;
        }

        /** Keeps a fit's pixels for the gain estimate. */
        void gainPixels(int fit, double[][] pixels) {
            gainPixels[fit] = pixels;
        }

        /**
         * @param gain    the gain the fits' variances assumed
         * @param counted whether the exposure counted photons
         * @return the gain the fits' residuals estimate (see {@link GainEstimate#of})
         */
        GainEstimate estimateGain(double gain, boolean counted) {
            return GainEstimate.of(Arrays.copyOf(gainPixels, fits), Arrays.copyOf(fitDof, fits), gain, counted);
        }

        /** @return the smallest free width of the fits, +infinity when none */
        double narrowest() {
            double narrowest = Double.POSITIVE_INFINITY;
            for (int f = 0; f < fits; f++) {
                narrowest = Math.min(narrowest, fitWidth[f]);
            }
            return narrowest;
        }

        /** Appends another collector's fits, peaks and unfitted candidates. */
        void absorb(Collector other) {
            int offset = fits;
            for (int f = 0; f < other.fits; f++) {
                gainPixels(newFit(other.fitChiSquare[f], other.fitDof[f], other.fitWidth[f]), other.gainPixels[f]);
            }
            for (int r = 0; r < other.size; r++) {
                double[][] c = other.columns;
                add(offset + other.fitOf[r], c[0][r], c[1][r], c[2][r], c[3][r], c[4][r], c[5][r], c[6][r],
                        other.flags[r], c[7][r]);
            }
            for (int u = 0; u < other.unfittedSize; u++) {
                unfitted(other.unfitted[u]);
            }
        }

        void add(int fit, double centre, double centreVariance, double flux, double fluxVariance, double height,
                double fwhm, double snr, int flag, double fwhmVariance) {
            if (size == flags.length) {
                for (int c = 0; c < columns.length; c++) {
                    columns[c] = Arrays.copyOf(columns[c], 2 * size);
                }
                flags = Arrays.copyOf(flags, 2 * size);
                fitOf = Arrays.copyOf(fitOf, 2 * size);
            }
            double[] row = {centre, centreVariance, flux, fluxVariance, height, fwhm, snr, fwhmVariance};
            for (int c = 0; c < row.length; c++) {
                columns[c][size] = row[c];
            }
            flags[size] = flag;
            fitOf[size] = fit;
            size++;
        }

        void unfitted(int pixel) {
            if (unfittedSize == unfitted.length) {
                unfitted = Arrays.copyOf(unfitted, 2 * unfittedSize);
            }
            unfitted[unfittedSize++] = pixel;
        }

        /**
         * @param clamped whether the counts were clamped: the pooled scale is then at least 1, since
         *                the clamped pixels in the fits' wings scatter less than the background noise
         *                and would narrow every uncertainty
         */
        Peaks build(int pixels, double[] noise, double[] baseline, boolean sigmasGiven, boolean clamped) {
            // The pooled scale F (see the class comment), then each fit's scale.
            double pooled = 1;
            boolean perFit = false;
            if (!sigmasGiven && !counted) {
                if (fits >= MIN_FITS_TO_POOL) {
                    double[] reduced = new double[fits];
                    int[] dofs = Arrays.copyOf(fitDof, fits);
                    for (int f = 0; f < fits; f++) {
                        reduced[f] = fitChiSquare[f] / fitDof[f];
                    }
                    double medianDof = Baseline.median(Arrays.stream(dofs).asDoubleStream().toArray(), fits);
                    pooled = Baseline.median(reduced, fits) / reducedChiSquareQuantile(0, (int) Math.round(medianDof));
                    pooled = clamped ? Math.max(1, pooled) : pooled;
                } else {
                    perFit = true;
                    pooled = Double.NaN;
                }
            }
            double[] scale = new double[fits];
            boolean[] poor = new boolean[fits];
            for (int f = 0; f < fits; f++) {
                double reduced = fitChiSquare[f] / fitDof[f];
                if (perFit) {
                    // A fit's own reduced chi-square has a handful of degrees of freedom: it may
                    // widen the model's variances but never narrow them.
                    scale[f] = Math.max(1, reduced);
                } else if (reduced / pooled > reducedChiSquareQuantile(Z99, fitDof[f])) {
                    scale[f] = reduced;
                    poor[f] = true;
                } else {
                    scale[f] = pooled;
                }
            }
            // No peak leaves without a finite, positive centroid uncertainty (a fit scaled by an
            // infinite or zero chi-square): such a peak is reported unfitted instead.
            int kept = 0;
            Integer[] order = new Integer[size];
            for (int i = 0; i < size; i++) {
                double variance = columns[1][i] * scale[fitOf[i]];
                if (variance > 0 && Double.isFinite(variance) && Double.isFinite(columns[0][i])) {
                    order[kept++] = i;
                } else {
                    unfitted((int) Math.max(0, Math.min(pixels - 1, Math.round(columns[0][i]))));
                }
            }
            order = Arrays.copyOf(order, kept);
            int size = kept;
            double[] centres = columns[0];
            Arrays.sort(order, (a, b) -> Double.compare(centres[a], centres[b]));
            double[][] sorted = new double[columns.length + 1][size];
            int[] sortedFlags = new int[size];
            for (int i = 0; i < size; i++) {
                int k = order[i];
                for (int c = 0; c < columns.length; c++) {
                    sorted[c][i] = columns[c][k];
                }
                int f = fitOf[k];
                sorted[1][i] = Math.sqrt(columns[1][k] * scale[f]);
                sorted[3][i] = Math.sqrt(columns[3][k] * scale[f]);
                sorted[7][i] = Math.sqrt(columns[7][k] * scale[f]);
                sorted[8][i] = fitChiSquare[f] / fitDof[f];
                sortedFlags[i] = flags[k] | (poor[f] ? PeakFlag.POOR_FIT.bit() : 0);
            }
            flagWide(pixels, sorted[0], sorted[5], sorted[7], sortedFlags);
            int[] unfittedSorted = Arrays.copyOf(unfitted, unfittedSize);
            Arrays.sort(unfittedSorted);
            return new Peaks(pixels, sorted[0], sorted[1], sorted[2], sorted[3], sorted[4], sorted[5], sorted[7],
                    sorted[6], sorted[8], sortedFlags, noise, pooled, baseline, unfittedSorted, sigmasGiven);
        }
    }
}
