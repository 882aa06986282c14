package org.ritzwerk.engine.calibrate;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import org.ritzwerk.data.CalibrationRecord;

/**
 * The calibration job: from a lamp exposure to a pixel-to-wavelength solution, in four steps.
 * <ol>
 *   <li>find the peaks ({@link PeakFinder}: baseline, noise, S/N threshold, Gaussian centroids
 *       with uncertainties);</li>
 *   <li>pair the strongest peaks with the lamp's lines with no starting solution, or within the
 *       problem's prior ({@link LampMatcher});</li>
 *   <li>refine: every peak, placed by that first solution, is assigned to the lamp lines by the
 *       line identifier's optimal one-to-one assignment ({@link IdentifierRefinement}), except the
 *       peaks the matcher explained as second-order images of lamp lines; a peak that
 *       looks like an unresolved blend weighs only as much as its centroid can be trusted;</li>
 *   <li>fit a weighted polynomial with outlier clipping ({@link DispersionFit}).</li>
 * </ol>
 * The command line's {@code calibrate} runs exactly this; the defaults here are its defaults.
 *
 * <p>Configured with {@code withX} methods that return new solvers; immutable, reusable and
 * thread-safe: one instance may be shared by any number of threads, and calibrations run
 * concurrently give what they give run one after another, bit for bit (CalibratorConcurrencyTest).
 * The same problem gives the same result bit for bit (nothing random).
 */
public final class Calibrator {

    /** Default pairing tolerance, pixels. */
    public static final double DEFAULT_TOLERANCE = 3;
    /**
     * Default ceiling on a solution's stated standard uncertainty, pixels, anywhere between its
     * first and last fitted line ({@link #withUncertaintyCeiling}). A solution stating more is
     * refused by default: a scale that may be a pixel or more off between its lines (two groups of
     * lines with a long gap between them, a polynomial bent to an end line a second-order image
     * or a foreign line may have taken) is more often wrong than useful. In seeded lamp sweeps the
     * runs accepted more than a pixel off stated 7 and 27 pixels, and the ceiling refuses 1 of the
     * 47 runs of seeds 1 to 400 accepted 0.1 to 1 pixel off.
     */
    public static final double DEFAULT_UNCERTAINTY_CEILING = 1;
    /** Default fraction of the strongest peaks that a solution must pair. */
    public static final double DEFAULT_MIN_MATCHED = 0.6;
    /**
     * Default highest degree of the automatically chosen polynomial. Degrees above the usual
     * cubic are taken only when the cubic leaves more scatter than the stated uncertainties allow
     * and the higher degree fits significantly better, also without either end line
     * ({@link DispersionFit}); otherwise a solution still behaves as with 3. (With 3, a quartic
     * dispersion term of 0.18 nm across 2048 pixels was fitted by a cubic whose errors reached 5.2
     * stated uncertainties, 2.3 RMS; one of 0.53 nm, 2.8 RMS; one of 1.8 nm was refused.)
     */
    public static final int DEFAULT_MAX_DEGREE = 5;
    /**
     * Default largest reduced chi-square of the final fit that is accepted. In seeded sweeps of
     * curved, blended, contaminated lamp spectra (refdata's CalibrationSweepTest) right solutions
     * gave at most 7 and wrong pairings that slipped past the matcher 68 and more.
     */
    public static final double DEFAULT_MAX_REDUCED_CHI_SQUARE = 25;

    private final double threshold;
    private final double saturation;
    private final boolean negativeCountsAllowed;
    private final double tolerance;
    private final double minMatched;
    private final double clip;
    private final int degree;
    private final int maxDegree;
    private final double maxChi2;
    private final boolean secondOrder;
    private final double requiredPrecision;
    private final boolean uncheckedEnds;
    /** The detector's gain in counts per photo-electron and read noise in counts, NaN when not given. */
    private final double gain;
    private final double readNoise;
    /** The largest stated standard uncertainty, pixels, a solution is returned with (infinite: none). */
    private final double ceiling;

    private Calibrator(double threshold, double saturation, boolean negativeCountsAllowed, double tolerance,
            double minMatched, double clip, int degree, int maxDegree, double maxChi2, boolean secondOrder,
            double requiredPrecision, boolean uncheckedEnds, double gain, double readNoise, double ceiling) {
        this.threshold = threshold;
        this.saturation = saturation;
        this.negativeCountsAllowed = negativeCountsAllowed;
        this.tolerance = tolerance;
        this.minMatched = minMatched;
        this.clip = clip;
        this.degree = degree;
        this.maxDegree = maxDegree;
        this.maxChi2 = maxChi2;
        this.secondOrder = secondOrder;
        this.requiredPrecision = requiredPrecision;
        this.uncheckedEnds = uncheckedEnds;
        this.gain = gain;
        this.readNoise = readNoise;
        this.ceiling = ceiling;
    }

    /**
     * @return S/N threshold {@value PeakFinder#DEFAULT_THRESHOLD}, no saturation level, negative
     *         counts allowed (dark-subtracted exposures), tolerance {@value #DEFAULT_TOLERANCE}
     *         pixels, at least {@value #DEFAULT_MIN_MATCHED} of the strongest peaks paired,
     *         clipping at {@value DispersionFit#DEFAULT_CLIP} robust standard deviations, degree
     *         chosen by AICc up to {@value #DEFAULT_MAX_DEGREE} (above the usual cubic only when the
     *         lines show it: see {@link DispersionFit})
     */
    public static Calibrator defaults() {
        return new Calibrator(PeakFinder.DEFAULT_THRESHOLD, Double.NaN, true, DEFAULT_TOLERANCE, DEFAULT_MIN_MATCHED,
                DispersionFit.DEFAULT_CLIP, -1, DEFAULT_MAX_DEGREE, DEFAULT_MAX_REDUCED_CHI_SQUARE, true,
                Double.POSITIVE_INFINITY, false, Double.NaN, Double.NaN, DEFAULT_UNCERTAINTY_CEILING);
    }

    /**
     * @param snr the signal-to-noise ratio a peak needs (see {@link PeakFinder#withThreshold})
     * @return a solver with that threshold
     */
    public Calibrator withThreshold(double snr) {
        PeakFinder.defaults().withThreshold(snr); // validates
        return new Calibrator(snr, saturation, negativeCountsAllowed, tolerance, minMatched, clip, degree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * @param counts the counts at which the detector saturates; such peaks are flagged and left out
     *               of the fit (see {@link PeakFinder#withSaturationLevel})
     * @return a solver with that saturation level
     */
    public Calibrator withSaturationLevel(double counts) {
        PeakFinder.defaults().withSaturationLevel(counts); // validates
        return new Calibrator(threshold, counts, negativeCountsAllowed, tolerance, minMatched, clip, degree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * @param allowed whether negative counts (dark-subtracted data) are accepted
     * @return a solver with that setting
     */
    public Calibrator withNegativeCountsAllowed(boolean allowed) {
        return new Calibrator(threshold, saturation, allowed, tolerance, minMatched, clip, degree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * @param pixels how far (pixels) a peak may lie from a line's predicted place to pair; positive
     * @return a solver with that tolerance
     */
    public Calibrator withTolerance(double pixels) {
        LampMatcher.defaults().withTolerance(pixels); // validates
        return new Calibrator(threshold, saturation, negativeCountsAllowed, pixels, minMatched, clip, degree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * @param fraction the fraction of the strongest peaks a solution must pair with lamp lines,
     *                 0 to 1; lower it for lamps with many lines missing from the set
     * @return a solver with that fraction
     */
    public Calibrator withMinMatchedFraction(double fraction) {
        LampMatcher.defaults().withMinInlierFraction(fraction); // validates
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, fraction, clip, degree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * @param k reject pairs beyond k robust standard deviations, one at a time; positive
     * @return a solver with that clipping
     */
    public Calibrator withClipping(double k) {
        DispersionFit.automatic(1).withClipping(k, DispersionFit.DEFAULT_CLIP_ITERATIONS); // validates
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, minMatched, k, degree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * @param fixedDegree the polynomial degree, 1 to {@value DispersionFit#MAX_DEGREE}
     * @return a solver that fits that degree
     */
    public Calibrator withDegree(int fixedDegree) {
        DispersionFit.ofDegree(fixedDegree); // validates
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, minMatched, clip, fixedDegree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * @param highest the highest degree AICc may choose, 1 to {@value DispersionFit#MAX_DEGREE}
     * @return a solver that chooses the degree
     */
    public Calibrator withAutomaticDegree(int highest) {
        DispersionFit.automatic(highest); // validates
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, minMatched, clip, -1, highest,
                maxChi2, secondOrder, requiredPrecision, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * @param limit the largest reduced chi-square of the final fit (residuals against the stated
     *              centroid and line uncertainties) that is accepted, finite and &gt;= 1; a
     *              larger value means pairs the polynomial cannot explain, usually a wrong pairing
     * @return a solver with that limit
     */
    public Calibrator withMaxReducedChiSquare(double limit) {
        if (!(limit >= 1) || Double.isInfinite(limit)) {
            throw new IllegalArgumentException("the largest accepted reduced chi-square must be finite and >= 1, got "
                    + limit);
        }
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, minMatched, clip, degree,
                maxDegree, limit, secondOrder, requiredPrecision, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * @param considered whether peaks may be explained as second-order images of the lamp's lines
     *                   (see {@link LampMatcher#withSecondOrder(boolean)}); true by default, switch
     *                   it off for a spectrometer with an order-sorting filter
     * @return a solver with that setting
     */
    public Calibrator withSecondOrder(boolean considered) {
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, minMatched, clip, degree,
                maxDegree, maxChi2, considered, requiredPrecision, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * Requires a precision: a solution whose stated standard uncertainty exceeds the given number
     * of pixels anywhere from its lowest to its highest fitted line
     * ({@link Calibration#largestSigmaPixels()}) is refused with a {@link CalibrationException}
     * ({@link CalibrationException#IMPRECISE}) that says where, instead of being returned. For work
     * that needs every wavelength within 0.1 pixel, 0.05 (two standard uncertainties) is the usual
     * choice. None by default: the solution comes with its uncertainty, and the caller judges it.
     *
     * @param pixels the largest accepted standard uncertainty in pixels, positive and finite
     * @return a solver with that requirement
     */
    public Calibrator withRequiredPrecision(double pixels) {
        if (!(pixels > 0) || Double.isInfinite(pixels)) {
            throw new IllegalArgumentException("the required precision must be a positive, finite number of pixels, got "
                    + pixels);
        }
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, minMatched, clip, degree,
                maxDegree, maxChi2, secondOrder, pixels, uncheckedEnds, gain, readNoise, ceiling);
    }

    /**
     * A ceiling on the stated standard uncertainty (pixels) anywhere between the first and last
     * fitted line ({@link Calibration#largestSigmaPixels()}): a solution stating more is refused
     * ({@link CalibrationException#IMPRECISE}, saying where and what would help) instead of being
     * returned. {@value #DEFAULT_UNCERTAINTY_CEILING} pixel by default; infinity returns every
     * solution with whatever uncertainty it states. Unlike {@link #withRequiredPrecision} it does not
     * ask the other lines to check each end line.
     *
     * @param pixels the ceiling in pixels, positive (infinity for none)
     * @return a solver with that ceiling
     * @throws IllegalArgumentException naming the ceiling when it is not positive
     */
    public Calibrator withUncertaintyCeiling(double pixels) {
        if (!(pixels > 0)) {
            throw new IllegalArgumentException("the uncertainty ceiling must be a positive number of pixels (or"
                    + " infinity for none), got " + pixels);
        }
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, minMatched, clip, degree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, uncheckedEnds, gain, readNoise, pixels);
    }

    /** @return the ceiling on the stated standard uncertainty, pixels; infinite when there is none */
    public double uncertaintyCeiling() {
        return ceiling;
    }

    /** @return the largest accepted stated standard uncertainty in pixels; infinite when none is required */
    public double requiredPrecision() {
        return requiredPrecision;
    }

    /**
     * Whether a solution may rest on an end pairing that no other pair checks: when too few pairs
     * remain for the degree without the outermost one ({@link Calibration#endConfirmationPixels}
     * is NaN: three pairs for a straight line, four for a quadratic, five for a cubic), a foreign
     * line within the tolerance of a missing lamp line there would be taken for it and show in no
     * residual. A mercury window of three lines with 404.66 nm replaced by an invented line 1.3
     * to 2.9 pixels away was accepted that far off while stating 0.04 pixel, in half the
     * exposures. By default such a solution is refused, naming the line; a user who knows the
     * lamp's lines there are clean (a three-line lamp has no others) accepts it with this, and the
     * calibration's notes still say that the end rests on its pairing.
     *
     * @param accepted whether to accept such solutions
     * @return a solver with that choice
     */
    public Calibrator withUncheckedEndsAccepted(boolean accepted) {
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, minMatched, clip, degree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, accepted, gain, readNoise, ceiling);
    }

    /**
     * The detector's gain, from its data sheet or a photon-transfer measurement, for the peaks'
     * noise model (see {@link PeakFinder#withGain}); without it the gain is the counts' common
     * step, or estimated from the bright lines' fit residuals, or 1 ({@link Peaks#gainSource()}).
     *
     * @param countsPerElectron counts per photo-electron, finite and &gt; 0
     * @return a solver with that gain
     * @throws IllegalArgumentException naming the gain when it is not finite and positive
     */
    public Calibrator withGain(double countsPerElectron) {
        PeakFinder.defaults().withGain(countsPerElectron); // validates
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, minMatched, clip, degree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, uncheckedEnds, countsPerElectron, readNoise,
                ceiling);
    }

    /**
     * The detector's read noise, a floor under the measured background noise of each pixel (see
     * {@link PeakFinder#withReadNoise}).
     *
     * @param counts read noise in counts RMS, finite and &gt;= 0
     * @return a solver with that read noise
     * @throws IllegalArgumentException naming the read noise when it is negative, NaN or infinite
     */
    public Calibrator withReadNoise(double counts) {
        PeakFinder.defaults().withReadNoise(counts); // validates
        return new Calibrator(threshold, saturation, negativeCountsAllowed, tolerance, minMatched, clip, degree,
                maxDegree, maxChi2, secondOrder, requiredPrecision, uncheckedEnds, gain, counts, ceiling);
    }

    /** @return the detector's gain given in counts per photo-electron, NaN when none was given */
    public double gain() {
        return gain;
    }

    /** @return the detector's read noise given in counts RMS, NaN when none was given */
    public double readNoise() {
        return readNoise;
    }

    /** @return whether solutions resting on an unchecked end pairing are accepted */
    public boolean uncheckedEndsAccepted() {
        return uncheckedEnds;
    }

    /** @return whether peaks may be explained as second-order images of the lamp's lines */
    public boolean secondOrder() {
        return secondOrder;
    }

    /** @return the largest accepted reduced chi-square of the final fit */
    public double maxReducedChiSquare() {
        return maxChi2;
    }

    /** @return the S/N threshold */
    public double threshold() {
        return threshold;
    }

    /** @return the saturation level in counts, NaN when none */
    public double saturationLevel() {
        return saturation;
    }

    /** @return the pairing tolerance, pixels */
    public double tolerance() {
        return tolerance;
    }

    /** @return the fraction of the strongest peaks a solution must pair */
    public double minMatchedFraction() {
        return minMatched;
    }

    /** @return the clipping threshold, robust standard deviations */
    public double clipping() {
        return clip;
    }

    /** @return the fixed degree, or -1 when AICc chooses it */
    public int degree() {
        return degree;
    }

    /** @return the highest degree AICc may choose */
    public int maxDegree() {
        return maxDegree;
    }

    /**
     * Runs the four steps.
     *
     * @param problem the exposure, lamp and prior
     * @return the calibration: peaks, pairs, solution and the settings used
     * @throws CalibrationException when the exposure cannot be calibrated, with a stable
     *         {@link CalibrationException#code() code} and a message that names the exposure:
     *         {@link CalibrationException#UNUSABLE_COUNTS} for unusable counts (empty, fewer than
     *         {@value PeakFinder#MIN_PIXELS} pixels, a NaN, infinite or, when not allowed, negative
     *         pixel, named, a constant spectrum such as all zero, every pixel saturated, a pixel
     *         uncertainty that is not finite and positive); otherwise no or too few peaks, too few
     *         lines in the prior, no solution within the prior, a lamp that does not explain the
     *         spectrum, an implausible fit, an unchecked end, or a solution less precise than
     *         required
     * @throws NullPointerException when the problem is null
     */
    public Calibration calibrate(CalibrationProblem problem) {
        Objects.requireNonNull(problem, "problem");
        PeakFinder finder = PeakFinder.defaults().withThreshold(threshold)
                .withNegativeCountsAllowed(negativeCountsAllowed);
        finder = Double.isNaN(gain) ? finder : finder.withGain(gain);
        finder = Double.isNaN(readNoise) ? finder : finder.withReadNoise(readNoise);
        double inferred = Double.isNaN(saturation) ? inferredSaturation(problem.countsView()) : Double.NaN;
        if (!Double.isNaN(saturation)) {
            finder = finder.withSaturationLevel(saturation);
        } else if (!Double.isNaN(inferred)) {
            finder = finder.withSaturationLevel(inferred);
        }
        Peaks peaks;
        try {
            peaks = finder.find(problem.countsView(), problem.sigmasView());
        } catch (CalibrationException e) {
            throw new CalibrationException(e.code(), problem.source() + ": " + e.getMessage(), e);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(problem.source() + ": " + e.getMessage(), e);
        }
        try {
            return solve(problem, peaks, inferred);
        } catch (CalibrationException e) {
            // name the exposure in every refusal, as the peak finder's are named
            throw e.getMessage().startsWith(problem.source() + ": ") ? e
                    : new CalibrationException(e.code(), problem.source() + ": " + e.getMessage(), e);
        }
    }

    /** Pairs, fits and checks the solution of peaks found in the problem's exposure. */
    private Calibration solve(CalibrationProblem problem, Peaks peaks, double inferredSaturation) {
        LampSet lamp = problem.lamp();
        LampMatcher matcher = LampMatcher.defaults().withTolerance(tolerance).withPrior(problem.prior())
                .withMinInlierFraction(minMatched).withSecondOrder(secondOrder);
        LampMatch first = matcher.match(peaks, lamp.lines());
        DispersionFit fit = fit();
        requirePairsForDegree(first);
        LampMatch refined = IdentifierRefinement.refine(first, first.fit(fit), peaks, lamp.lines(),
                lamp.speciesArray(), tolerance);
        // Saturated peaks are centred from their wings: they are paired (and reported) but left
        // out of the fit, unless too few pairs would remain for the degree the whole set takes
        // (its degree plus three: the automatic choice needs that room; with fewer it fell back to
        // a straight line through a curved dispersion and refused a right pairing).
        boolean[] unsaturated = new boolean[refined.size()];
        int kept = 0;
        for (int i = 0; i < refined.size(); i++) {
            unsaturated[i] = !peaks.has(refined.peakIndex(i), PeakFlag.SATURATED);
            kept += unsaturated[i] ? 1 : 0;
        }
        int room = kept == refined.size() ? 0 : refined.fit(fit).degree() + 3;
        LampMatch fitted = kept == refined.size() || kept < Math.max(LampMatcher.MIN_FEW_LINE_MATCHES, room)
                ? refined : refined.subset(unsaturated);
        boolean[] saturatedOnly = new boolean[refined.size()];
        for (int i = 0; i < saturatedOnly.length; i++) {
            saturatedOnly[i] = fitted != refined && !unsaturated[i];
        }
        requirePairsForDegree(fitted);
        DispersionSolution solution = fitted.fit(fit);
        checkPlausible(problem, solution);
        // An end group that pairs as well with other lamp lines is left out, with a note.
        List<String> undecided = new ArrayList<>();
        for (boolean high : new boolean[] {false, true}) {
            EndGroups.Undecided u = EndGroups.find(fitted, solution, lamp.lines(), peaks, tolerance, high);
            if (u == null) {
                continue;
            }
            undecided.add(EndGroups.note(u, fitted, lamp.lines(), lamp::label));
            boolean[] keep = new boolean[fitted.size()];
            Arrays.fill(keep, true);
            for (int i : u.pairs()) {
                keep[i] = false;
            }
            fitted = fitted.subset(keep);
            requirePairsForDegree(fitted);
            solution = fitted.fit(fit);
            checkPlausible(problem, solution);
        }
        // Pairs whose peaks look like unresolved blends carry the note "blend" into the saved record.
        String[] notes = new String[fitted.size()];
        boolean any = false;
        for (int i = 0; i < notes.length; i++) {
            boolean blend = Calibration.blendBound(fitted, peaks, i) > 0;
            boolean saturated = peaks.has(fitted.peakIndex(i), PeakFlag.SATURATED);
            notes[i] = blend ? CalibrationRecord.FittedLine.BLEND : saturated ? CalibrationRecord.FittedLine.SATURATED
                    : "";
            any |= blend || saturated;
        }
        if (any) {
            solution = solution.withPairFlags(notes);
        }
        Calibration calibration = new Calibration(problem, this, peaks, first, fitted, refined.subset(saturatedOnly),
                solution, inferredSaturation, undecided);
        checkEndsChecked(calibration);
        checkPrecision(calibration);
        return calibration;
    }

    /** Pixels at exactly the exposure's highest count from which that count is taken as a clipping level. */
    static final int CLIPPED_PIXELS = 3;

    /**
     * The level at which the exposure looks clipped when no saturation level was given: its
     * highest count, when at least {@value #CLIPPED_PIXELS} pixels hold exactly it (a detector's
     * converter or a capped file saturates at one value; counts with noise repeat their maximum
     * that often only when cut off). A cadmium-zinc exposure capped at 65535 without a
     * saturation level was accepted 1.3 to 1.4 pixels off, 8 to 11 of its stated uncertainties:
     * the flat tops' centroids were taken at face value.
     *
     * @return the level, or NaN when the exposure does not look clipped
     */
    static double inferredSaturation(double[] counts) {
        double max = Double.NEGATIVE_INFINITY;
        for (double c : counts) {
            max = Math.max(max, c);
        }
        if (!(max > 0) || Double.isInfinite(max)) {
            return Double.NaN;
        }
        int at = 0;
        for (double c : counts) {
            at += c == max ? 1 : 0;
        }
        return at >= CLIPPED_PIXELS ? max : Double.NaN;
    }

    /** Refuses a solution with an end no other pair checks, unless such solutions are accepted. */
    private void checkEndsChecked(Calibration calibration) {
        if (uncheckedEnds) {
            return;
        }
        for (boolean high : new boolean[] {false, true}) {
            if (Double.isNaN(calibration.endConfirmationPixels(high))) {
                DispersionSolution solution = calibration.solution();
                throw new CalibrationException(CalibrationException.UNCHECKED_END, String.format(Locale.ROOT,
                        "%s: the outermost fitted line at pixel %.1f is checked by no other line (%d pairs for a"
                                + " degree-%d solution: without it too few remain for the degree), so a foreign line"
                                + " within the tolerance of a missing lamp line there would be taken for it and show"
                                + " in no residual. More lamp lines in the window would check it; if the lamp's lines"
                                + " there are known to be clean (a lamp of only these lines), accept unchecked ends",
                        calibration.problem().source(), calibration.endConfirmationAtPixel(high),
                        solution.usedCount(), solution.degree()));
            }
        }
    }

    /** Refuses a solution less precise than required, saying where and what would help. */
    private void checkPrecision(Calibration calibration) {
        double sigma = calibration.largestSigmaPixels();
        if (sigma > ceiling) {
            throw new CalibrationException(CalibrationException.IMPRECISE, String.format(Locale.ROOT,
                    "%s, above the %.4g pixel%s a solution is accepted with, so its scale may be a pixel or more off"
                            + " there; %s. To take it as it is, raise the uncertainty ceiling",
                    largestUncertainty(calibration, "states a standard uncertainty of"), ceiling,
                    ceiling == 1 ? "" : "s", tighten(calibration, calibration.largestSigmaAtPixel())));
        }
        if (Double.isInfinite(requiredPrecision)) {
            return;
        }
        if (Double.isNaN(sigma)) {
            throw new CalibrationException(CalibrationException.IMPRECISE, calibration.problem().source()
                    + ": the solution states no uncertainty (no covariance), so it cannot meet the required "
                    + String.format(Locale.ROOT, "%.4g", requiredPrecision) + " pixels");
        }
        if (!(sigma <= requiredPrecision)) {
            throw new CalibrationException(CalibrationException.IMPRECISE, String.format(Locale.ROOT,
                    "%s, above the required %.4g pixels; %s",
                    largestUncertainty(calibration, "has a stated standard uncertainty of"), requiredPrecision,
                    tighten(calibration, calibration.largestSigmaAtPixel())));
        }
        // Each outermost line must be checked by the others: a wrong pairing there (a foreign line
        // beside a missing lamp line) would move the solution by its offset and show in no residual.
        for (boolean high : new boolean[] {false, true}) {
            double check = calibration.endConfirmationPixels(high);
            if (!(check <= CONFIRMATION_FACTOR * requiredPrecision)) {
                double at = calibration.endConfirmationAtPixel(high);
                throw new CalibrationException(CalibrationException.IMPRECISE, String.format(Locale.ROOT,
                        "%s: the outermost fitted line at pixel %.1f is checked by the other lines %s, so a wrong"
                                + " pairing there (a foreign line beside a missing lamp line) would not show; the"
                                + " solution cannot promise %.4g pixels near it. %s",
                        calibration.problem().source(), at,
                        Double.isNaN(check) ? "not at all (too few lines remain for the degree)"
                                : String.format(Locale.ROOT, "only to +-%.3g pixels (needed: %.3g, %.0f times the"
                                        + " requirement)", check, CONFIRMATION_FACTOR * requiredPrecision,
                                        CONFIRMATION_FACTOR), requiredPrecision,
                        calibration.solution().degree() > 1 ? "A lamp line closer to it, or a lower degree, would"
                                + " check it" : "A lamp line closer to it would check it (only the other lines"
                                + " check an end)"));
            }
        }
    }

    /** Where and how large the solution's largest stated uncertainty is, for a refusal's message. */
    private static String largestUncertainty(Calibration calibration, String verb) {
        double at = calibration.largestSigmaAtPixel();
        DispersionSolution solution = calibration.solution();
        return String.format(Locale.ROOT, "%s: the solution (degree %d, %d lines from pixel %.1f to %.1f) %s %.4g"
                + " pixels (%.3g nm) near pixel %.1f", calibration.problem().source(), solution.degree(),
                solution.usedCount(), calibration.lowestUsedPixel(), calibration.highestUsedPixel(), verb,
                calibration.largestSigmaPixels(), solution.wavelengthSigmaAt(at), at);
    }

    /** What would tighten the solution where its stated uncertainty is largest. */
    private static String tighten(Calibration calibration, double at) {
        double lo = calibration.lowestUsedPixel();
        double hi = calibration.highestUsedPixel();
        boolean nearEnd = at - lo < 0.1 * (hi - lo) || hi - at < 0.1 * (hi - lo);
        return nearEnd ? "lamp lines near that end, a longer exposure (more counts in the weak lines) or a lower degree"
                + " would tighten it"
                : "lamp lines in the gap around that pixel (a second gas) or a longer exposure would tighten it";
    }

    /**
     * Under a required precision q the others must predict each outermost line's pixel to 6 q:
     * a wrong pairing of that line by 18 q or more (0.9 pixel at q = 0.05: a foreign line a pixel
     * or two away) then shows as a three-sigma miss. (With 3 q, the sweep of seeds 1-400 refused
     * 26 to 29 more right solutions at q = 0.05 to 0.1 than with 6 q and caught no more wrong ones.)
     */
    static final double CONFIRMATION_FACTOR = 6;

    /**
     * Refuses a fitted solution whose wavelength does not run one way across the detector, or
     * whose reduced chi-square exceeds the limit.
     */
    private void checkPlausible(CalibrationProblem problem, DispersionSolution solution) {
        int pixels = problem.pixels();
        double first = solution.dispersionAt(0);
        for (int s = 0; s <= 64; s++) {
            double p = (pixels - 1) * s / 64.0;
            double d = solution.dispersionAt(p);
            if (!(d * first > 0)) {
                throw new CalibrationException(CalibrationException.IMPLAUSIBLE_FIT, String.format(Locale.ROOT,
                        "%s: the fitted degree-%d solution does not run one way across the detector (its dispersion "
                                + "changes sign near pixel %.0f); the pairing is not trustworthy. Give a prior "
                                + "(range and dispersion) or a lower degree", problem.source(), solution.degree(), p));
            }
        }
        double chi2 = solution.reducedChiSquare();
        checkFitWhereTheDegreeIsCapped(problem.source(), solution);
        checkWithinPrior(problem, solution);
        if (chi2 > maxChi2) {
            boolean priorGiven = !problem.prior().equals(LampMatcher.Prior.none());
            String help = priorGiven ? "check the prior and the lamp's lines" : "give a prior";
            String cause = degree > 0
                    ? String.format(Locale.ROOT, "the pairs disagree with the fixed degree-%d polynomial by far more "
                            + "than their uncertainties: a dispersion more curved than that degree can follow (let the "
                            + "degree be chosen, or fix a higher one), or a wrong pairing or lamp list (%s)",
                            degree, help)
                    : solution.degree() >= maxDegree && maxDegree < DispersionFit.MAX_DEGREE
                            ? String.format(Locale.ROOT, "the pairs disagree with every degree up to the highest"
                                    + " allowed, %d, by far more than their uncertainties: a dispersion more curved"
                                    + " than that (allow a higher degree), or a wrong pairing or lamp list (%s)",
                                    maxDegree, help)
                    : "the pairs disagree with any smooth dispersion by far more than their uncertainties, which means "
                            + "a wrong pairing or a wrong lamp list: " + help;
            throw new CalibrationException(CalibrationException.IMPLAUSIBLE_FIT, String.format(Locale.ROOT,
                    "%s: the fitted solution's reduced chi-square is %.3g (%d pairs, RMS %.3g pixels), above the "
                            + "accepted %.3g: %s; raise the accepted limit (a library setting) only if the centroid "
                            + "uncertainties are known to be too small",
                    problem.source(), chi2, solution.usedCount(), solution.rmsPixels(), maxChi2, cause));
        }
    }

    /**
     * Below this chance probability of a chi-square as large as the fit's, for pairs that follow
     * the polynomial with their stated uncertainties, a fit with few degrees of freedom, or whose
     * degree the pair count capped, is refused ({@link #checkFitWhereTheDegreeIsCapped}).
     */
    static final double LACK_OF_FIT_PROBABILITY = 1e-3;

    /** At most this many degrees of freedom, a fit of any degree must pass the lack-of-fit test. */
    static final int FEW_DEGREES_OF_FREEDOM = 3;

    /**
     * A fit with few degrees of freedom must pass a lack-of-fit test: the chance of a chi-square
     * at least as large, for pairs that follow it with their stated uncertainties,
     * Q(dof / 2, chi^2 / 2) (the chi-square distribution's upper tail, common practice), must be
     * at least {@value #LACK_OF_FIT_PROBABILITY}. It applies when the degree is chosen
     * automatically but too few pairs remain to try the next one (AICc needs d + 4 pairs for
     * degree d + 1), and to any fit, fixed degree too, with at most
     * {@value #FEW_DEGREES_OF_FREEDOM} degrees of freedom, where the general limit on the reduced
     * chi-square (25) stands for a probability below 1e-15 and so never fires on evidence. Nothing
     * else can show there that a pair is wrong or the polynomial too simple: a straight line through
     * four pairs of a curved dispersion was accepted with a reduced chi-square of 11.7 (2 degrees of
     * freedom), 5.5 pixels off at its last pair while stating 0.27; a fixed cubic through six pairs,
     * one of them a zinc peak paired with a cadmium line, with 12.7, 4.3 pixels off while stating
     * 0.08.
     */
    void checkFitWhereTheDegreeIsCapped(String source, DispersionSolution solution) {
        int dof = solution.degreesOfFreedom();
        int d = solution.degree();
        boolean capped = degree <= 0 && d < maxDegree && solution.usedCount() < d + 4;
        if (dof <= 0 || !(capped || dof <= FEW_DEGREES_OF_FREEDOM) || !Double.isFinite(solution.chiSquare())) {
            return;
        }
        double probability = solution.lackOfFitProbability();
        if (!(probability < LACK_OF_FIT_PROBABILITY)) {
            return;
        }
        String why = degree > 0
                ? String.format(Locale.ROOT, "a pairing is wrong, or the dispersion is more curved than the fixed"
                        + " degree %d can follow. More lamp lines in the window, or a degree chosen automatically,"
                        + " would settle it", d)
                : capped ? String.format(Locale.ROOT, "the automatic choice weighs degree %d only from %d pairs (a"
                        + " fixed degree %d needs %d): the"
                        + " dispersion is more curved than the pairs can show, or a pairing is wrong. More lamp lines"
                        + " in the window, or a degree fixed one higher (if the pairing is known to be right), would"
                        + " settle it", d + 1, d + 4, d + 1, d + 3)
                : "a pairing is wrong, or the dispersion is more curved than the pairs can show. More lamp lines in"
                        + " the window, or a degree fixed one higher (if the pairing is known to be right), would"
                        + " settle it";
        throw new CalibrationException(CalibrationException.IMPLAUSIBLE_FIT, String.format(Locale.ROOT,
                "%s: the %d fitted pairs disagree with the degree-%d polynomial (reduced chi-square %.3g with %d "
                        + "degrees of freedom: probability %.2g for pairs that follow it, below %.2g); %s",
                source, solution.usedCount(), d, solution.reducedChiSquare(), dof, probability,
                LACK_OF_FIT_PROBABILITY, why));
    }

    /**
     * Refuses a fitted solution that sees wavelengths or dispersions the prior excludes (with the
     * matcher's margins: 2 % of the range, 5 % of the dispersion bound): the matcher keeps its
     * search inside the prior, but the final fit, of another degree or with other pairs, can leave
     * it (a fixed cubic through a wrong pair ran to 685 nm under a prior ending at 670 nm).
     */
    private void checkWithinPrior(CalibrationProblem problem, DispersionSolution solution) {
        LampMatcher.Prior prior = problem.prior();
        if (prior.equals(LampMatcher.Prior.none())) {
            return;
        }
        int pixels = problem.pixels();
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        boolean outside = false;
        for (int s = 0; s <= 64; s++) {
            double p = (pixels - 1) * s / 64.0;
            double nm = solution.evaluate(p);
            lo = Math.min(lo, nm);
            hi = Math.max(hi, nm);
            outside |= !prior.admits(nm, solution.dispersionAt(p), Double.NEGATIVE_INFINITY);
        }
        if (outside) {
            throw new CalibrationException(CalibrationException.OUTSIDE_PRIOR, String.format(Locale.ROOT,
                    "%s: the fitted solution (degree %d, %d lines) runs from %.2f to %.2f nm over pixels 0 to %d "
                            + "(%.4g to %.4g nm/pixel), outside the prior (%s): the prior or a pairing is wrong; "
                            + "widen the prior if the solution is right",
                    problem.source(), solution.degree(), solution.usedCount(), lo, hi, pixels - 1,
                    solution.dispersionAt(0), solution.dispersionAt(pixels - 1), prior));
        }
    }

    /**
     * A fixed degree needs two pairs more than it has coefficients' worth of freedom (k + 2): with
     * fewer, the refusal says so in the user's terms (it was the fit's precondition error).
     */
    private void requirePairsForDegree(LampMatch pairs) {
        if (degree > 0 && pairs.size() < degree + 2) {
            throw new CalibrationException(CalibrationException.TOO_FEW_MATCHES, "a degree-" + degree
                    + " solution needs at least " + (degree + 2) + " paired lines; " + pairs.size()
                    + " were paired (saturated ones left out of the fit): lower the degree or let it be chosen");
        }
    }

    /** @return the dispersion fit these settings make */
    public DispersionFit fit() {
        DispersionFit fit = degree > 0 ? DispersionFit.ofDegree(degree) : DispersionFit.automatic(maxDegree);
        return fit.withClipping(clip, DispersionFit.DEFAULT_CLIP_ITERATIONS);
    }

    @Override
    public String toString() {
        return "Calibrator[threshold=" + threshold + ", saturation=" + saturation + ", tolerance=" + tolerance
                + " px, minMatched=" + minMatched + ", clip=" + clip + ", degree="
                + (degree > 0 ? Integer.toString(degree) : "auto<=" + maxDegree) + ", maxReducedChiSquare=" + maxChi2
                + ", secondOrder=" + secondOrder + ", requiredPrecision=" + requiredPrecision
                + " px, uncertaintyCeiling=" + ceiling + " px, uncheckedEnds="
                + uncheckedEnds + "]";
    }
}
