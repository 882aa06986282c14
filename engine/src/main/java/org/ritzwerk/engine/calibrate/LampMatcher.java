package org.ritzwerk.engine.calibrate;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.function.IntToDoubleFunction;
import org.apache.commons.numbers.gamma.RegularizedGamma;
import org.ritzwerk.medium.Medium;

/**
 * Pairs detected peaks with a lamp's reference lines without a starting solution: which peak is
 * which line, and a first pixel-to-wavelength polynomial, for straight and strongly curved
 * dispersions alike.
 *
 * <p><b>Seeds.</b> The strongest {@code strongPeaks} peaks (by flux) and the strongest
 * {@code strongLines} lines within the prior's wavelength range (by relative intensity) are each
 * sorted by position. Every triplet of nearby peaks (the outer two at most four strong peaks
 * apart) is compared with every triplet of nearby lines (the outer two at most
 * eight strong lines apart, in the order the dispersion's sign implies): the
 * ratio of the inner gap to the outer gap is invariant under a linear map, so a triplet pair whose
 * middle line lies within {@code tolerance + 0.005 span + maxCurvature span^2 / (8 N)} pixels of
 * where the outer pair puts it (the last term is how far a dispersion whose slope changes by
 * {@code maxCurvature} over the N pixels bends away from a straight line over the span), and whose
 * dispersion lies in the prior, seeds a hypothesis. (Local triplets tolerate the
 * curvature of the dispersion, which distant pairs would not. The idea is the one-dimensional form
 * of matching point lists by figures whose shape is invariant under the transformation sought:
 * similar triangles, E. J. Groth, Astron. J. 91, 1244 (1986); ratios of sides as the invariant,
 * F. G. Valdes, L. E. Campusano, J. D. Velasquez and P. B. Stetson, Publ. Astron. Soc. Pac. 107,
 * 1119 (1995).)
 *
 * <p><b>Growth with a curvature prior.</b> A seed is grown one pair at a time. Its polynomial
 * (degree {@code maxDegree}) is a Bayesian least-squares fit ({@link CurvedPolynomial}) in which
 * each pair scatters by a sixth of the tolerance and the curvature terms have Gaussian priors: the
 * quadratic term allows the slope d lambda / d p to change by up to {@code maxCurvature} (default
 * 1, that is 100 %) from one end of the detector to the other, the cubic and higher terms less.
 * Three close pairs therefore predict well near themselves and ever more loosely away from them,
 * and the prediction's own standard deviation says how far: each unpaired strong peak has the
 * window tolerance + 3 sigma of its prediction. A peak with no lamp line in its window is set
 * aside as foreign (another gas, a second-order ghost); of the peaks with exactly one free line in
 * their window (or a nearest one that every other trails by more than the tolerance), the one with
 * the narrowest window is paired and the polynomial refitted, and the pair is dropped again (the
 * peak set aside) when the refitted polynomial still misses it by more than half the tolerance;
 * peaks with several lines in their window wait until the polynomial is surer. Only the frontier
 * is looked at (the open peaks between the pairs and three beyond each end). Growth ends when no
 * peak can be paired. To keep the cost near that of a straight-line search, a seed is grown only
 * when its straight line puts a lamp line near a neighbouring strong peak (allowing for the bend),
 * seeds that reach the same four pairs are grown once, and growths with under half the pairs of
 * the best so far are not verified. No extrapolation is trusted beyond what the prior and the pairs so far
 * support, so a curved dispersion is followed, not overshot.
 *
 * <p><b>Second-order images.</b> A grating without an order-sorting filter puts the second order
 * of a line of wavelength lambda where the first order of 2 lambda falls (m lambda = const for the
 * same angles; the grating equation), so such spectrometers show ghosts of the lamp's violet and
 * ultraviolet lines among its red ones. Unless switched off ({@link #withSecondOrder(boolean)}),
 * the window of lines searched holds, beside each line, its image at twice its wavelength. The
 * images never seed a hypothesis (their strength is unknown: nothing at all behind a filter),
 * are never paired during growth and never bend the polynomial; a peak is an image when no
 * first-order line lies within the tolerance of where the polynomial puts it, or when an image
 * lies less than half as far from it as that line (and growth then
 * leaves that peak alone). A peak so explained
 * counts as matched (a strong peak matched, a term of the score, a precise match of the chance
 * test, whose line density counts the images too, so chance is judged against the denser
 * window) and is listed in {@link LampMatch#secondOrderPeaks()}; it is not a pair of the match,
 * and a solution needs at least {@value #MIN_MATCHES} first-order pairs. (Seeded sweeps of curved
 * lamp spectra, refdata's CalibrationSweepTest: exposures whose strongest peaks were partly
 * ghosts, refused before because the right seeds died in the neighbour test, the share of strong
 * peaks stayed below the required one, or the chance test saw too few matches, are solved.)
 *
 * <p><b>Verification and score.</b> The grown polynomial must be monotonic in the seed's
 * direction over the whole detector, inside the prior, and (for air wavelengths) above 200 nm,
 * where the air model starts. Then every peak, not only the strong ones, is matched to its
 * nearest line within the tolerance (one-to-one, the closer peak wins), the polynomial refitted on
 * those pairs and the peaks matched again. The score is a log-likelihood ratio: each matched peak
 * adds max(0, -r^2 / (2 s^2) - ln(s sqrt(2 pi) rho)), its residual r against a scatter s of a sixth
 * of the tolerance, weighed against rho, the density of lamp lines (per pixel) around it, which is
 * what a peak at a random place would meet; so a match in a sparse part of the list, at a small
 * residual, counts for much, and a match that chance would give in a dense part counts for
 * little. The highest score wins (ties: more strong peaks matched). The search is exhaustive and
 * has no random part: the same input gives the same answer.
 *
 * <p><b>Acceptance.</b> The winner must (1) match at least {@value #MIN_MATCHES} strong peaks
 * (all three when the lamp has only three lines in range: a three-line lamp calibrates with a
 * straight line), (2) match at least {@code minInlierFraction} of the strong peaks, and (3) match
 * more strong peaks than chance explains: with lambda = sum over the strong peaks of
 * min(1, 2 tolerance rho) the number of chance matches expected, the Poisson probability
 * P(X &gt;= matched) times the number of distinct grown hypotheses must not exceed
 * {@value #MAX_FALSE_ALARM}, and (4) the pairs must scatter about the refined polynomial as their
 * centroid uncertainties allow: (1.4826 median |residual| / median centroid uncertainty)^2, a
 * robust reduced chi-square, at most {@value #MAX_ROBUST_CHI_SQUARE} (a pairing that is right in
 * one part of the detector and one line off in another bends the polynomial and fails here). The
 * third and fourth tests do not depend on any setting, so lowering
 * {@code minInlierFraction} never lets a chance pairing through. The figures are kept in the
 * {@link LampMatch} ({@link LampMatch#chanceMatches()}, {@link LampMatch#chanceProbability()}).
 *
 * <p><b>Limits.</b> The seeds come from the strongest peaks and lines only: when lines that are
 * not in the list (other gases, second order) take most of the strongest places, or the lamp's
 * relative intensities differ much from the table's, widen the search with
 * {@link #withStrongest(int, int)}. A dispersion whose slope changes by more than
 * {@code maxCurvature} across the detector needs {@link #withMaxCurvature(double)}.
 *
 * <p><b>Refinement.</b> The winner is grown again over every peak, weak ones included, in the same
 * way (where the strong peaks left gaps), then re-matched against every peak and every line and
 * refitted until the pairs stop changing (at most 10 passes). Last, every pair must be confirmed
 * by the others (leave one out): the polynomial fitted to the other pairs, with the curvature prior,
 * must put its line within the tolerance of its peak. A pair the others do not confirm, most often a
 * lone foreign line or ghost beyond the other pairs that a lamp line a few pixels away was given to
 * and the polynomial bent to take, is dropped (the worst first, refitting after each); the figures
 * and the acceptance tests then judge the pairs that remain. (The error of each observation's
 * prediction from the others as its check: cross-validation, M. Stone, J. R. Stat. Soc. B 36, 111
 * (1974); common practice.)
 *
 * <p><b>Failures</b> ({@link CalibrationException}): fewer than 3 peaks
 * ({@link CalibrationException#TOO_FEW_PEAKS}) or lines within the prior
 * ({@link CalibrationException#TOO_FEW_LINES}); otherwise, when no solution in the prior passes
 * the acceptance tests, the search is repeated without the prior: a good solution there gives
 * {@link CalibrationException#OUTSIDE_PRIOR} (the message names its range and dispersion); else
 * too few pairs anywhere gives {@link CalibrationException#TOO_FEW_MATCHES} and more gives
 * {@link CalibrationException#LAMP_MISMATCH}; the message gives the best pairing's figures, the
 * chance expectation and what was searched.
 *
 * <p>Immutable and thread-safe.
 */
public final class LampMatcher {

    /** Fewest pairs a solution needs when the lamp has at least this many lines in range. */
    public static final int MIN_MATCHES = 4;
    /** Fewest pairs a solution of a three-line lamp needs. */
    public static final int MIN_FEW_LINE_MATCHES = 3;
    /** Default largest relative change of the slope across the detector the search allows. */
    public static final double DEFAULT_MAX_CURVATURE = 1.0;
    /**
     * Largest accepted robust reduced chi-square of the pairs about the matcher's polynomial
     * (see the class comment); the calibration job's final fit has the same default limit.
     */
    public static final double MAX_ROBUST_CHI_SQUARE = 25;
    /** Largest accepted probability (times the hypotheses tried) that chance explains the pairs. */
    public static final double MAX_FALSE_ALARM = 0.01;
    /** Default matching tolerance in pixels. */
    public static final double DEFAULT_TOLERANCE = 3;
    /** Default number of strongest peaks searched. */
    public static final int DEFAULT_STRONG_PEAKS = 25;
    /** Default number of strongest lines searched. */
    public static final int DEFAULT_STRONG_LINES = 120;
    /** Default highest degree of the matcher's polynomial. */
    public static final int DEFAULT_MAX_DEGREE = 3;
    /** Default smallest share of the strongest peaks a solution must explain. */
    public static final double DEFAULT_MIN_INLIER_FRACTION = 0.5;

    /**
     * A second-order image explains a peak instead of a first-order line within the tolerance when
     * it lies closer than this share of that line's distance: a ghost taken for a faint lamp line
     * a few pixels away bends the polynomial and shows in no residual, while an image taken for a
     * real line only loses a pair.
     */
    private static final double IMAGE_PREFERENCE = 0.5;
    private static final int PEAK_NEIGHBOURS = 4;
    private static final int LINE_NEIGHBOURS = 8;
    private static final double SPAN_TOLERANCE = 0.005;
    /** Most matchings of every peak while verifying a grown polynomial. */
    private static final int VERIFY_PASSES = 4;
    /** Pairs that offset, slope and curvature can always be made to meet; not evidence. */
    private static final int FITTED_PAIRS = 3;
    /** Pairs that offset and slope can always be made to meet. */
    private static final int LINE_PAIRS = 2;
    /** Open strong peaks beyond each end of the pairs that growth looks at. */
    private static final int FRONTIER = 3;
    /** Pairs at which a growth is compared with those already made. */
    private static final int MEMO_PAIRS = 4;
    /** Half-width, in tolerances, of the region over which the line density is counted. */
    private static final double DENSITY_HALF_WIDTH = 10;
    /** Lowest wavelength of the air model, nm. */
    private static final double AIR_MODEL_LOWEST_NM = 200;
    private static final int MAX_REFINE_PASSES = 10;

    /**
     * What is known before the search.
     *
     * @param minWavelengthNm lowest wavelength (nm) any detector pixel may see
     * @param maxWavelengthNm highest wavelength (nm) any detector pixel may see
     * @param minDispersion   lowest local dispersion d lambda / d p, nm per pixel (negative when
     *                        wavelength falls with pixel)
     * @param maxDispersion   highest local dispersion, nm per pixel; an interval containing 0
     *                        searches both directions
     */
    public record Prior(double minWavelengthNm, double maxWavelengthNm, double minDispersion, double maxDispersion) {

        /**
         * Validates the range.
         *
         * @param minWavelengthNm lowest wavelength (nm) any detector pixel may see
         * @param maxWavelengthNm highest wavelength (nm) any detector pixel may see
         * @param minDispersion   lowest local dispersion, nm per pixel
         * @param maxDispersion   highest local dispersion, nm per pixel
         * @throws IllegalArgumentException unless 0 &lt;= min &lt; max wavelength (max may be
         *         infinite) and min &lt; max dispersion, both finite
         */
        public Prior {
            if (!(minWavelengthNm >= 0 && maxWavelengthNm > minWavelengthNm) || Double.isInfinite(minWavelengthNm)) {
                throw new IllegalArgumentException("the prior's wavelength range must satisfy 0 <= min < max (nm), got "
                        + minWavelengthNm + " to " + maxWavelengthNm);
            }
            if (!(Double.isFinite(minDispersion) && Double.isFinite(maxDispersion) && minDispersion < maxDispersion)) {
                throw new IllegalArgumentException("the prior's dispersion range must be finite with min < max "
                        + "(nm/pixel), got " + minDispersion + " to " + maxDispersion);
            }
        }

        /**
         * @return no prior beyond the stated bounds: any wavelengths, a dispersion of either sign
         *         up to 1000 nm per pixel
         */
        public static Prior none() {
            return new Prior(0, Double.POSITIVE_INFINITY, -1000, 1000);
        }

        boolean allowsDirection(int sign) {
            return sign > 0 ? maxDispersion > 0 : minDispersion < 0;
        }

        double margin() {
            return Double.isInfinite(maxWavelengthNm) ? 0 : 0.02 * (maxWavelengthNm - minWavelengthNm);
        }

        /**
         * Whether a solution that sees {@code nm} with local dispersion {@code dispersion} at a
         * pixel stays inside the prior, with its margins: 2 % of the wavelength range
         * ({@link #margin()}), 5 % of the larger dispersion bound.
         *
         * @param nm         the wavelength there, nm
         * @param dispersion the dispersion there, nm per pixel
         * @param floorNm    a lowest wavelength besides the prior's (the air model's), or -infinity
         * @return whether both lie inside
         */
        boolean admits(double nm, double dispersion, double floorNm) {
            double margin = margin();
            double slack = 0.05 * Math.max(Math.abs(minDispersion), Math.abs(maxDispersion));
            return !(dispersion < minDispersion - slack || dispersion > maxDispersion + slack)
                    && nm > Math.max(minWavelengthNm - margin, floorNm) && !(nm > maxWavelengthNm + margin);
        }

        @Override
        public String toString() {
            String range = minWavelengthNm <= 0 && Double.isInfinite(maxWavelengthNm) ? "any wavelength"
                    : Double.isInfinite(maxWavelengthNm)
                            ? String.format(Locale.ROOT, "from %.6g nm up", minWavelengthNm)
                            : String.format(Locale.ROOT, "%.6g to %.6g nm", minWavelengthNm, maxWavelengthNm);
            // The open dispersion bounds of none() are no one's statement: not printed.
            return minDispersion == -1000 && maxDispersion == 1000 ? range + ", any dispersion"
                    : String.format(Locale.ROOT, "%s, %.6g to %.6g nm/pixel", range, minDispersion, maxDispersion);
        }
    }

    private final Prior prior;
    private final double tolerance;
    private final int strongPeaks;
    private final int strongLines;
    private final int maxDegree;
    private final double minInlierFraction;
    private final double maxCurvature;
    private final boolean secondOrder;

    private LampMatcher(Prior prior, double tolerance, int strongPeaks, int strongLines, int maxDegree,
            double minInlierFraction, double maxCurvature, boolean secondOrder) {
        this.prior = prior;
        this.tolerance = tolerance;
        this.strongPeaks = strongPeaks;
        this.strongLines = strongLines;
        this.maxDegree = maxDegree;
        this.minInlierFraction = minInlierFraction;
        this.maxCurvature = maxCurvature;
        this.secondOrder = secondOrder;
    }

    /**
     * @return a matcher with no prior ({@link Prior#none()}), tolerance 3 pixels, the 25 strongest
     *         peaks and 120 strongest lines, polynomials up to degree 3 and a minimum inlier
     *         fraction of 0.5
     */
    public static LampMatcher defaults() {
        return new LampMatcher(Prior.none(), DEFAULT_TOLERANCE, DEFAULT_STRONG_PEAKS, DEFAULT_STRONG_LINES,
                DEFAULT_MAX_DEGREE, DEFAULT_MIN_INLIER_FRACTION, DEFAULT_MAX_CURVATURE, true);
    }

    /**
     * @param prior what is known of the range and dispersion
     * @return a copy with that prior
     */
    public LampMatcher withPrior(Prior prior) {
        return new LampMatcher(Objects.requireNonNull(prior, "prior"), tolerance, strongPeaks, strongLines, maxDegree,
                minInlierFraction, maxCurvature, secondOrder);
    }

    /**
     * @param pixels how far (in pixels) a peak may lie from where the current polynomial puts its
     *               line, finite and &gt; 0; larger than the centroid errors and what the polynomial
     *               of the moment leaves unmodelled
     * @return a copy with that tolerance
     */
    public LampMatcher withTolerance(double pixels) {
        if (!(pixels > 0) || Double.isInfinite(pixels)) {
            throw new IllegalArgumentException("tolerance must be finite and > 0 pixels, got " + pixels);
        }
        return new LampMatcher(prior, pixels, strongPeaks, strongLines, maxDegree, minInlierFraction, maxCurvature,
                secondOrder);
    }

    /**
     * @param peaks how many of the strongest peaks seed and score the search, 4 to 200
     * @param lines how many of the strongest lines seed it, 4 to 500
     * @return a copy with those numbers (the cost grows as their product)
     */
    public LampMatcher withStrongest(int peaks, int lines) {
        if (peaks < 4 || peaks > 200) {
            throw new IllegalArgumentException("strong peaks must be 4 to 200, got " + peaks);
        }
        if (lines < 4 || lines > 500) {
            throw new IllegalArgumentException("strong lines must be 4 to 500, got " + lines);
        }
        return new LampMatcher(prior, tolerance, peaks, lines, maxDegree, minInlierFraction, maxCurvature, secondOrder);
    }

    /**
     * @param degree highest degree of the matcher's own polynomial, 1 to 5
     * @return a copy with that limit
     */
    public LampMatcher withMaxDegree(int degree) {
        if (degree < 1 || degree > 5) {
            throw new IllegalArgumentException("matcher degree must be 1 to 5, got " + degree);
        }
        return new LampMatcher(prior, tolerance, strongPeaks, strongLines, degree, minInlierFraction, maxCurvature,
                secondOrder);
    }

    /**
     * @param fraction smallest share of the strongest peaks a solution must match, 0 to 1
     * @return a copy with that limit
     */
    public LampMatcher withMinInlierFraction(double fraction) {
        if (!(fraction >= 0 && fraction <= 1)) {
            throw new IllegalArgumentException("minimum inlier fraction must be 0 to 1, got " + fraction);
        }
        return new LampMatcher(prior, tolerance, strongPeaks, strongLines, maxDegree, fraction, maxCurvature,
                secondOrder);
    }

    /**
     * @param fraction the largest relative change of the slope d lambda / d p from one end of the
     *                 detector to the other that the search allows for (the width of its prior
     *                 on the quadratic term), 0.01 to 10; 1 (the default) is 100 %
     * @return a copy with that limit
     */
    public LampMatcher withMaxCurvature(double fraction) {
        if (!(fraction >= 0.01 && fraction <= 10)) {
            throw new IllegalArgumentException("maximum slope change across the detector must be 0.01 to 10 (1 = "
                    + "100 %), got " + fraction);
        }
        return new LampMatcher(prior, tolerance, strongPeaks, strongLines, maxDegree, minInlierFraction, fraction,
                secondOrder);
    }

    /**
     * @param considered whether a peak may be explained as the second-order image of a lamp line
     *                   (at twice its wavelength, where a grating without an order-sorting filter
     *                   puts it); true by default. Such peaks count as matched in the figures and
     *                   the acceptance tests, and give no pair to the dispersion fit. Switch it off
     *                   for a spectrometer with an order-sorting filter, where they cannot occur
     *                   and would only add chance matches.
     * @return a copy with that setting
     */
    public LampMatcher withSecondOrder(boolean considered) {
        return new LampMatcher(prior, tolerance, strongPeaks, strongLines, maxDegree, minInlierFraction, maxCurvature,
                considered);
    }

    /** @return whether second-order images of the lines are considered */
    public boolean secondOrder() {
        return secondOrder;
    }

    /**
     * @param peaks peaks from a {@link PeakFinder}; their fluxes rank them
     * @param lines the lamp's lines
     * @return the pairing
     * @throws CalibrationException see the class comment
     */
    public LampMatch match(Peaks peaks, LampLines lines) {
        return match(peaks.centres(), peaks.centreSigmas(), peaks.fluxes(), peaks.pixels(), lines);
    }

    /**
     * @param centre      peak centroids in pixels (pixel i centred at i), finite, within the
     *                    detector
     * @param centreSigma their standard uncertainties in pixels, finite and &gt; 0
     * @param intensity   their intensities (any scale; they rank the peaks), finite and &gt;= 0
     * @param pixels      the detector's number of pixels, &gt;= 2
     * @param lines       the lamp's lines
     * @return the pairing
     * @throws IllegalArgumentException for arrays of different lengths or naming the first
     *         unusable value
     * @throws CalibrationException see the class comment
     */
    public LampMatch match(double[] centre, double[] centreSigma, double[] intensity, int pixels, LampLines lines) {
        Objects.requireNonNull(lines, "lines");
        int n = centre.length;
        if (centreSigma.length != n || intensity.length != n) {
            throw new IllegalArgumentException("centroids, uncertainties and intensities must have one value per peak: "
                    + n + ", " + centreSigma.length + ", " + intensity.length);
        }
        if (pixels < 2) {
            throw new IllegalArgumentException("a detector needs at least two pixels, got " + pixels);
        }
        for (int i = 0; i < n; i++) {
            if (!(centre[i] >= -0.5 && centre[i] <= pixels - 0.5)) {
                throw new IllegalArgumentException("peak " + i + ": centroid must lie on the detector (-0.5 to "
                        + (pixels - 0.5) + " pixels), got " + centre[i]);
            }
            if (!(centreSigma[i] > 0) || Double.isInfinite(centreSigma[i])) {
                throw new IllegalArgumentException("peak " + i + ": centroid uncertainty must be finite and > 0 "
                        + "pixels, got " + centreSigma[i]);
            }
            if (!(intensity[i] >= 0) || Double.isInfinite(intensity[i])) {
                throw new IllegalArgumentException("peak " + i + ": intensity must be finite and >= 0, got "
                        + intensity[i]);
            }
        }
        if (n < MIN_FEW_LINE_MATCHES) {
            throw new CalibrationException(CalibrationException.TOO_FEW_PEAKS, "found " + n + " peak" + (n == 1 ? "" : "s") + "; a calibration "
                    + "needs at least " + MIN_FEW_LINE_MATCHES + " (" + MIN_MATCHES + " unless the lamp has only "
                    + MIN_FEW_LINE_MATCHES + " lines)");
        }
        int inPrior = linesWithin(lines, prior);
        if (inPrior < MIN_FEW_LINE_MATCHES) {
            throw new CalibrationException(CalibrationException.TOO_FEW_LINES, "the lamp list has " + inPrior + " of its "
                    + lines.size() + " lines (" + span(lines) + ") within the prior's range " + prior
                    + "; a calibration needs at least " + MIN_FEW_LINE_MATCHES);
        }
        int needed = Math.min(MIN_MATCHES, inPrior);
        if (n < needed) {
            throw new CalibrationException(CalibrationException.TOO_FEW_PEAKS, "found " + n + " peak" + (n == 1 ? "" : "s") + "; with "
                    + inPrior + " lamp lines in range a calibration needs at least " + needed);
        }
        Search inside = new Search(centre, intensity, pixels, lines, prior);
        Candidate found = inside.run();
        Refined best = found == null ? null : inside.refine(found, centreSigma);
        if (acceptable(best, inside, needed)) {
            return best.match();
        }
        Search anywhere = prior.equals(Prior.none()) ? inside : new Search(centre, intensity, pixels, lines,
                Prior.none());
        Candidate foundFree = anywhere == inside ? found : anywhere.run();
        Refined free = anywhere == inside ? best : foundFree == null ? null : anywhere.refine(foundFree, centreSigma);
        if (anywhere != inside && acceptable(free, anywhere, Math.min(MIN_MATCHES, linesWithin(lines, Prior.none())))) {
            LampMatch outside = free.match();
            throw new CalibrationException(CalibrationException.OUTSIDE_PRIOR, String.format(Locale.ROOT,
                    "no solution within the prior (%s) matches at least %d peaks and %.0f%% of the %d strongest; "
                            + "one outside it does: %.2f to %.2f nm over pixels 0 to %d (%.4g nm/pixel), "
                            + "%d of %d strong peaks matched",
                    prior, needed, 100 * minInlierFraction, inside.strong.length, outside.firstWavelength(),
                    outside.lastWavelength(), pixels - 1,
                    (outside.lastWavelength() - outside.firstWavelength()) / (pixels - 1), outside.strongMatched(),
                    outside.strongPeaks()));
        }
        Refined shownRefined = free != null && (best == null || free.measured().score > best.measured().score) ? free
                : best;
        Search shownSearch = shownRefined == free ? anywhere : inside;
        Candidate shown = shownRefined == null ? null : shownRefined.measured();
        if (shown == null || shown.strongMatched < needed) {
            throw new CalibrationException(CalibrationException.TOO_FEW_MATCHES, "the best pairing of " + n
                    + " peaks with " + lines.size() + " lamp lines matches " + (shown == null ? 0 : shown.strongMatched)
                    + " of the " + inside.strong.length + " strongest peaks, " + where(inside, anywhere) + "; "
                    + "a calibration needs at least " + needed);
        }
        throw new CalibrationException(CalibrationException.LAMP_MISMATCH, String.format(Locale.ROOT,
                "the lamp lines (%s) do not explain the spectrum (%s): the best pairing matches %d of the %d strongest "
                        + "peaks (%.0f%%; %.0f%% required), and %d of all %d peaks lie within %.2f pixels of its lines"
                        + " where chance "
                        + "alone would put %.1f (probability %.2g for one pairing, so %.2g expected by chance"
                        + " among the %d distinct solutions tried; at most %.2g accepted), %s",
                span(lines), failed(shown, shownRefined, shownSearch), shown.strongMatched, shownSearch.strong.length,
                100.0 * shown.strongMatched / shownSearch.strong.length, 100 * minInlierFraction, shown.preciseMatched,
                n, shown.preciseTolerance, shown.chance, chanceProbability(shown),
                chanceProbability(shown) * Math.max(1, shownSearch.evaluated), shownSearch.evaluated,
                MAX_FALSE_ALARM, where(inside, anywhere))
                + String.format(Locale.ROOT, "; the pairs scatter about its polynomial with a robust reduced "
                        + "chi-square of %.3g (at most %.3g accepted)", shownRefined.robustChiSquare(),
                        MAX_ROBUST_CHI_SQUARE) + onlyTheShare(shown, shownRefined, shownSearch));
    }

    /** Which of the acceptance tests the shown pairing fails, for the head of the refusal. */
    private String failed(Candidate shown, Refined refined, Search search) {
        List<String> failed = new ArrayList<>(3);
        if (shown.strongMatched < minInlierFraction * search.strong.length) {
            failed.add("too small a share of the strongest peaks paired");
        }
        if (chanceProbability(shown) * Math.max(1, search.evaluated) > MAX_FALSE_ALARM) {
            failed.add("chance could do as well");
        }
        if (!(refined.robustChiSquare() <= MAX_ROBUST_CHI_SQUARE)) {
            failed.add("the pairs scatter too much");
        }
        return failed.isEmpty() ? "too few pairs left after the leave-one-out check"
                : "failed: " + String.join("; ", failed);
    }

    /**
     * When the pairing beats chance and scatters as it should, so that only the share of strong
     * peaks paired is short (foreign lines among the strongest peaks), the message says so.
     */
    private String onlyTheShare(Candidate shown, Refined refined, Search search) {
        boolean chance = chanceProbability(shown) * Math.max(1, search.evaluated) <= MAX_FALSE_ALARM;
        boolean scatter = refined.robustChiSquare() <= MAX_ROBUST_CHI_SQUARE;
        if (!chance || !scatter || shown.strongMatched >= minInlierFraction * search.strong.length) {
            return "";
        }
        return ". Only the share of strong peaks paired is short: the pairing beats chance, so foreign lines may"
                + " hold the other strongest places; a lower required share (the min-matched setting) accepts it"
                + " when the lamp is known to be right";
    }

    /** Where the search looked and what it tried, for messages. */
    private String where(Search inside, Search anywhere) {
        long seeds = inside.hypotheses + (anywhere == inside ? 0 : anywhere.hypotheses);
        String tried = String.format(Locale.ROOT, "after %d seed triplets (the %d strongest peaks against the %d "
                + "strongest lines, slope changes up to %.0f%% across the detector)", seeds, inside.strong.length,
                inside.strongLine.length, 100 * maxCurvature);
        return (prior.equals(Prior.none()) ? "searching every wavelength and dispersion "
                : "within the prior (" + prior + ") and outside it ") + tried;
    }

    private boolean acceptable(Refined refined, Search search, int needed) {
        if (refined == null) {
            return false;
        }
        Candidate c = refined.measured();
        return c.strongMatched >= needed && refined.match().size() >= needed
                && refined.robustChiSquare() <= MAX_ROBUST_CHI_SQUARE
                && c.strongMatched >= minInlierFraction * search.strong.length
                && (needed < MIN_MATCHES || chanceProbability(c) * Math.max(1, search.evaluated) <= MAX_FALSE_ALARM);
    }

    /**
     * The probability that chance alone puts at least as many strong peaks within the precise
     * tolerance of a line, beyond the pairs the polynomial can be made to meet (its free pairs:
     * {@value #LINE_PAIRS} when a straight line meets them all, {@value #FITTED_PAIRS} for a
     * quadratic, or a cubic a quadratic does as well as, else 4): Poisson with the candidate's
     * expected chance matches, P(X &gt;= m) = P(m, lambda), the regularised lower incomplete gamma
     * function (common practice).
     */
    static double chanceProbability(Candidate c) {
        int beyondFit = c.preciseMatched - c.freePairs;
        if (beyondFit <= 0) {
            return 1;
        }
        return RegularizedGamma.P.value(beyondFit, Math.max(c.chance, 1e-9));
    }

    private static int linesWithin(LampLines lines, Prior prior) {
        int count = 0;
        for (int i = 0; i < lines.size(); i++) {
            double w = lines.wavelength(i);
            if (w >= prior.minWavelengthNm() && w <= prior.maxWavelengthNm()) {
                count++;
            }
        }
        return count;
    }

    /** The number of lines whose second-order image (twice the wavelength) lies within the prior's range. */
    private static int imagesWithin(LampLines lines, Prior prior) {
        int count = 0;
        for (int i = 0; i < lines.size(); i++) {
            double w = 2 * lines.wavelength(i);
            if (w >= prior.minWavelengthNm() && w <= prior.maxWavelengthNm()) {
                count++;
            }
        }
        return count;
    }

    private static String span(LampLines lines) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < lines.size(); i++) {
            lo = Math.min(lo, lines.wavelength(i));
            hi = Math.max(hi, lines.wavelength(i));
        }
        return String.format(Locale.ROOT, "%d lines, %.6g to %.6g nm", lines.size(), lo, hi);
    }

    /** The pairs a grown hypothesis ended with (per strong peak, a window line or -1), and the direction. */
    private record GrowthKey(int sign, int[] lines) {
        @Override
        public boolean equals(Object other) {
            return other instanceof GrowthKey k && k.sign == sign && Arrays.equals(k.lines, lines);
        }

        @Override
        public int hashCode() {
            return 31 * sign + Arrays.hashCode(lines);
        }

        @Override
        public String toString() {
            return "GrowthKey[" + sign + ", " + Arrays.toString(lines) + "]";
        }
    }

    /**
     * One verified hypothesis: the polynomial, how many strong peaks and peaks it matches, its
     * score (see the class comment), how many strong peaks lie within the precise tolerance and
     * how many chance alone would put there, and the direction.
     */
    record Candidate(double[] coefficients, int strongMatched, double score, int preciseMatched,
            double preciseTolerance, double chance, int sign, int freePairs) {
    }

    /** A refined winner: its figures after refinement, and the pairs. */
    private record Refined(Candidate measured, LampMatch match) {

        /**
         * The pairs' robust scatter about the matcher's polynomial (1.4826 x the median absolute
         * residual) over their typical centroid uncertainty (the median, at least
         * {@value #SIGMA_FLOOR} pixel), squared: a robust reduced chi-square.
         */
        double robustChiSquare() {
            int n = match.size();
            if (n == 0) {
                return Double.POSITIVE_INFINITY;
            }
            double[] r = new double[n];
            double[] sigma = new double[n];
            for (int i = 0; i < n; i++) {
                r[i] = Math.abs(match.residualPixels(i));
                sigma[i] = match.pixelSigma(i);
            }
            Arrays.sort(r);
            Arrays.sort(sigma);
            double scatter = 1.4826 * r[(n - 1) / 2];
            double typical = Math.max(SIGMA_FLOOR, sigma[(n - 1) / 2]);
            return scatter * scatter / (typical * typical);
        }

        /** Smallest centroid uncertainty the plausibility test assumes, pixels. */
        static final double SIGMA_FLOOR = 0.1;
    }

    /** The search over one prior. */
    private final class Search {
        private final double[] centre;
        private final int pixels;
        private final LampLines lines;
        private final Prior searchPrior;
        /** Strong peak indices sorted by pixel, and their pixels. */
        final int[] strong;
        private final double[] strongPixel;
        /**
         * Lines within the prior's range, sorted by wavelength, and their wavelengths: a line index
         * for a line seen in the first order, -1 - the line index for a second-order image (at
         * twice the line's wavelength).
         */
        private final int[] window;
        private final double[] windowNm;
        /** Strong first-order lines as indices into the window, sorted by wavelength. */
        private final int[] strongLine;
        /** How many window entries are first-order lines. */
        private final int firstOrderLines;
        private final double mid;
        private final double half;
        private final double[] priorSigma;
        private final CurvedPolynomial polynomial;
        private long hypotheses;
        /** Distinct solutions verified (see {@link #signature}): the trials the chance test counts. */
        private int evaluated;
        private final Set<List<Long>> solutions = new HashSet<>();
        private int mostPairs;
        private int[] takenMark = new int[0];
        private int stamp;
        private final Map<GrowthKey, Candidate> verified = new HashMap<>();
        private final Set<GrowthKey> started = new HashSet<>();
        private int[] owner = new int[0];
        private double[] distance = new double[0];

        Search(double[] centre, double[] intensity, int pixels, LampLines lines, Prior searchPrior) {
            this.centre = centre;
            this.pixels = pixels;
            this.lines = lines;
            this.searchPrior = searchPrior;
            this.mid = 0.5 * (pixels - 1);
            this.half = Math.max(0.5, 0.5 * (pixels - 1));
            strong = strongest(centre.length, strongPeaks, i -> intensity[i], i -> centre[i]);
            strongPixel = new double[strong.length];
            for (int k = 0; k < strong.length; k++) {
                strongPixel[k] = centre[strong[k]];
            }
            // The window: every line within the prior's range in the first order, and (unless
            // switched off) every line whose second-order image, at twice its wavelength, lies
            // there. Entries are coded as line index (first order) or -1 - line index (second).
            int count = linesWithin(lines, searchPrior);
            int images = secondOrder ? imagesWithin(lines, searchPrior) : 0;
            int[] inside = new int[count + images];
            int m = 0;
            for (int i = 0; i < lines.size(); i++) {
                double w = lines.wavelength(i);
                if (w >= searchPrior.minWavelengthNm() && w <= searchPrior.maxWavelengthNm()) {
                    inside[m++] = i;
                }
                if (secondOrder && 2 * w >= searchPrior.minWavelengthNm() && 2 * w <= searchPrior.maxWavelengthNm()) {
                    inside[m++] = -1 - i;
                }
            }
            window = sortBy(inside, this::entryWavelength);
            windowNm = new double[window.length];
            for (int k = 0; k < window.length; k++) {
                windowNm[k] = entryWavelength(window[k]);
            }
            firstOrderLines = count;
            // Seeds come from first-order lines only: the images are weaker by an unknown factor
            // (nothing at all behind an order-sorting filter), so they explain peaks but never
            // start a hypothesis.
            int[] firstOrder = new int[count];
            int f = 0;
            for (int k = 0; k < window.length; k++) {
                if (window[k] >= 0) {
                    firstOrder[f++] = k;
                }
            }
            int[] chosen = strongest(count, strongLines, j -> lines.intensity(window[firstOrder[j]]), j -> j);
            strongLine = new int[chosen.length];
            for (int j = 0; j < chosen.length; j++) {
                strongLine[j] = firstOrder[chosen[j]];
            }
            takenMark = new int[window.length];
            int degree = Math.max(1, maxDegree);
            polynomial = new CurvedPolynomial(degree);
            // Prior widths of the curvature terms relative to a_1 (scaled pixel): a slope change of
            // maxCurvature from one end of the detector to the other is 4 a_2 / a_1; the cubic and
            // higher terms get a third and a tenth of that.
            priorSigma = new double[degree + 1];
            for (int d = 2; d <= degree; d++) {
                priorSigma[d] = maxCurvature * (d == 2 ? 0.25 : d == 3 ? 0.08 : 0.025);
            }
        }

        Candidate run() {
            Candidate best = null;
            for (int sign : new int[] {1, -1}) {
                if (!searchPrior.allowsDirection(sign)) {
                    continue;
                }
                int[] order = new int[strongLine.length];
                for (int k = 0; k < order.length; k++) {
                    order[k] = strongLine[sign > 0 ? k : order.length - 1 - k];
                }
                best = better(best, searchDirection(order, sign));
            }
            return best;
        }

        /**
         * Every triplet of nearby strong peaks against every triplet of nearby strong lines taken in
         * the direction's order (window indices in {@code order}).
         */
        private Candidate searchDirection(int[] order, int sign) {
            Candidate best = null;
            int np = strongPixel.length;
            int nl = order.length;
            int[] seedPeak = new int[3];
            int[] seedLine = new int[3];
            for (int i = 0; i + 2 < np; i++) {
                for (int k = i + 2; k < np && k <= i + PEAK_NEIGHBOURS; k++) {
                    double spanPixels = strongPixel[k] - strongPixel[i];
                    if (!(spanPixels > 0)) {
                        continue;
                    }
                    // The middle peak of three lies off the straight line through the outer two by
                    // up to (slope change across the triplet) x span / 8.
                    double allowed = tolerance + SPAN_TOLERANCE * spanPixels
                            + maxCurvature * spanPixels * spanPixels / (8 * pixels);
                    for (int j = i + 1; j < k; j++) {
                        double ratio = (strongPixel[j] - strongPixel[i]) / spanPixels;
                        for (int a = 0; a + 2 < nl; a++) {
                            double nmA = windowNm[order[a]];
                            for (int c = a + 2; c < nl && c <= a + LINE_NEIGHBOURS; c++) {
                                double nmC = windowNm[order[c]];
                                double dispersion = (nmC - nmA) / spanPixels;
                                if (dispersion < searchPrior.minDispersion()
                                        || dispersion > searchPrior.maxDispersion() || dispersion == 0) {
                                    continue;
                                }
                                double target = nmA + ratio * (nmC - nmA);
                                double allowedNm = allowed * Math.abs(dispersion);
                                for (int b = a + 1; b < c; b++) {
                                    if (Math.abs(windowNm[order[b]] - target) > allowedNm) {
                                        continue;
                                    }
                                    hypotheses++;
                                    if (!neighbourAgrees(i, k, order[a], order[c], dispersion, sign)) {
                                        continue;
                                    }
                                    seedPeak[0] = i;
                                    seedPeak[1] = j;
                                    seedPeak[2] = k;
                                    seedLine[0] = order[a];
                                    seedLine[1] = order[b];
                                    seedLine[2] = order[c];
                                    best = better(best, grow(seedPeak, seedLine, sign));
                                }
                            }
                        }
                    }
                }
            }
            return best;
        }

        /**
         * A cheap test before growing a seed: the straight line through its outer pairs must put a
         * lamp line near the strong peak just before or just after the seed, within the tolerance
         * plus the bend a dispersion of slope change maxCurvature can make over that distance.
         * A seed whose neighbours are both foreign lines dies here; the solution is also seeded
         * elsewhere.
         */
        private boolean neighbourAgrees(int i, int k, int lineA, int lineC, double dispersion, int sign) {
            double pixelA = strongPixel[i];
            double nmA = windowNm[lineA];
            double span = strongPixel[k] - pixelA;
            if (i == 0 && k == strongPixel.length - 1) {
                return true; // no neighbour to ask
            }
            for (int n : new int[] {i - 1, k + 1}) {
                if (n < 0 || n >= strongPixel.length) {
                    continue;
                }
                double gap = n < i ? pixelA - strongPixel[n] : strongPixel[n] - strongPixel[k];
                double bend = maxCurvature * gap * (gap + span) / (2 * pixels);
                double predicted = nmA + (strongPixel[n] - pixelA) * dispersion;
                double widthNm = (tolerance + bend) * Math.abs(dispersion);
                for (int l = lowerBound(predicted - widthNm); l < windowNm.length
                        && windowNm[l] <= predicted + widthNm; l++) {
                    if (window[l] >= 0) { // a first-order line; an image does not vouch for a seed
                        return true;
                    }
                }
            }
            return false;
        }

        private Candidate better(Candidate a, Candidate b) {
            if (b == null) {
                return a;
            }
            if (a == null || b.score > a.score || (b.score == a.score && b.strongMatched > a.strongMatched)) {
                return b;
            }
            return a;
        }

        /**
         * Grows a seed of three pairs over the strong peaks, most certain prediction first, then
         * verifies the result over every peak; null when it dies or leaves the prior.
         */
        private Candidate grow(int[] seedPeak, int[] seedLine, int sign) {
            int np = strongPixel.length;
            int[] lineOf = new int[np];
            Arrays.fill(lineOf, -1);
            for (int s = 0; s < 3; s++) {
                lineOf[seedPeak[s]] = seedLine[s];
            }
            double slopeGuess = (windowNm[seedLine[2]] - windowNm[seedLine[0]])
                    / ((strongPixel[seedPeak[2]] - strongPixel[seedPeak[0]]) / half);
            if (!fitOn(strongPixel, lineOf, slopeGuess)) {
                return null;
            }
            int pairs = extend(strongPixel, lineOf, sign, true);
            if (pairs < 0) {
                return null;
            }
            // A growth that stopped at a few pairs, or at under half of the best growth so
            // far, cannot win: not worth verifying.
            if (pairs < Math.min(MIN_MATCHES, firstOrderLines) || pairs < 0.5 * mostPairs) {
                return null;
            }
            mostPairs = Math.max(mostPairs, pairs);
            GrowthKey key = new GrowthKey(sign, lineOf);
            if (verified.containsKey(key)) {
                return verified.get(key);
            }
            Candidate result = verify(polynomial.coefficients(), sign);
            verified.put(key, result);
            if (result != null && solutions.add(signature(result.coefficients))) {
                evaluated++;
            }
            return result;
        }

        /**
         * Pairs the peaks at {@code peakPixel} one at a time, the narrowest prediction window with
         * exactly one free line first, refitting after each (see the class comment), starting from
         * the pairs in {@code lineOf} and the polynomial fitted to them.
         *
         * @param memo whether to stop (returning -1) when the pairs reach a set already grown
         * @return the number of pairs, or -1 when the growth stopped
         */
        private int extend(double[] peakPixel, int[] lineOf, int sign, boolean memo) {
            int np = peakPixel.length;
            markTaken(lineOf);
            boolean[] closed = new boolean[np];
            int pairs = 0;
            for (int l : lineOf) {
                pairs += l >= 0 ? 1 : 0;
            }
            while (true) {
                int pick = -1;
                int pickLine = -1;
                double pickWidth = Double.POSITIVE_INFINITY;
                // Only the frontier can hold the narrowest window: the open peaks between the
                // paired ones, and the nearest few open peaks beyond each end (windows widen with
                // the distance from the pairs).
                int first = -1;
                int last = -1;
                for (int k = 0; k < np; k++) {
                    if (lineOf[k] >= 0) {
                        first = first < 0 ? k : first;
                        last = k;
                    }
                }
                for (int side = 0; side < 3; side++) {
                    int k = side == 0 ? first : side == 1 ? first - 1 : last + 1;
                    int step = side == 1 ? -1 : 1;
                    int end = side == 0 ? last : side == 1 ? -1 : np;
                    int beyond = 0;
                    for (; k != end && (side == 0 ? k <= last : beyond < FRONTIER); k += step) {
                        if (lineOf[k] >= 0 || closed[k]) {
                            continue;
                        }
                        if (side != 0) {
                            beyond++;
                        }
                        double x = (peakPixel[k] - mid) / half;
                        double slopeNm = polynomial.derivative(x) / half;
                        if (!(slopeNm * sign > 0)) {
                            closed[k] = true; // the polynomial folds here: no prediction
                            continue;
                        }
                        double predicted = polynomial.value(x);
                        double widthNm = tolerance * Math.abs(slopeNm) + 3 * polynomial.sigma(x);
                        int only = onlyFreeLine(predicted, widthNm, tolerance * Math.abs(slopeNm), lineOf);
                        if (only == NONE) {
                            closed[k] = true; // no lamp line can be this peak: a foreign line or a ghost
                        } else if (only >= 0 && widthNm / Math.abs(slopeNm) < pickWidth) {
                            pick = k;
                            pickLine = only;
                            pickWidth = widthNm / Math.abs(slopeNm);
                        }
                    }
                }
                if (pick < 0) {
                    return pairs;
                }
                lineOf[pick] = pickLine;
                takenMark[pickLine] = stamp;
                double xPick = (peakPixel[pick] - mid) / half;
                polynomial.add(xPick, windowNm[pickLine]);
                if (!polynomial.solveNow()) {
                    return -1;
                }
                double residual = Math.abs(polynomial.value(xPick) - windowNm[pickLine])
                        / Math.abs(polynomial.derivative(xPick) / half);
                if (residual > 3 * scatter()) {
                    // The polynomial bends to take this pair but cannot follow it: not this line.
                    lineOf[pick] = -1;
                    takenMark[pickLine] = 0;
                    closed[pick] = true;
                    polynomial.remove(xPick, windowNm[pickLine]);
                    if (!polynomial.solveNow()) {
                        return -1;
                    }
                    continue;
                }
                if (++pairs == MEMO_PAIRS && memo) {
                    // From here on the growth depends only on the pairs so far (up to the peaks set
                    // aside): seeds that reach the same four pairs end alike, so grow each set once.
                    if (!started.add(new GrowthKey(sign, lineOf.clone()))) {
                        return -1;
                    }
                }
            }
        }

        /** Scatter of a pair about the polynomial, pixels: a sixth of the tolerance. */
        private double scatter() {
            return tolerance / 6;
        }

        /** Marker of {@link #onlyFreeLine}: no free line in the window. */
        private static final int NONE = -1;
        /** Marker of {@link #onlyFreeLine}: more than one. */
        private static final int SEVERAL = -2;

        /**
         * The window line within widthNm of nm that no peak has taken, when it is the only one or
         * every other lies more than a tolerance further away; else NONE or SEVERAL.
         */
        private int onlyFreeLine(double nm, double widthNm, double toleranceNm, int[] lineOf) {
            int from = lowerBound(nm - widthNm);
            int nearest = NONE;
            double d1 = Double.POSITIVE_INFINITY;
            double d2 = Double.POSITIVE_INFINITY;
            double image = Double.POSITIVE_INFINITY;
            for (int l = from; l < windowNm.length && windowNm[l] <= nm + widthNm; l++) {
                if (window[l] < 0) { // images are never paired while growing
                    image = Math.min(image, Math.abs(windowNm[l] - nm));
                    continue;
                }
                if (taken(l)) {
                    continue;
                }
                double d = Math.abs(windowNm[l] - nm);
                if (d < d1) {
                    d2 = d1;
                    d1 = d;
                    nearest = l;
                } else if (d < d2) {
                    d2 = d;
                }
            }
            // One free line, or a nearest one that the others trail by more than a tolerance; a
            // second-order image much nearer than that line may be what the peak is: not grown.
            if (nearest != NONE && image < IMAGE_PREFERENCE * d1) {
                return SEVERAL;
            }
            return nearest == NONE || d2 - d1 > toleranceNm ? nearest : SEVERAL;
        }

        private boolean taken(int line) {
            return takenMark[line] == stamp;
        }

        /** Starts a new growth: marks the lines of lineOf as taken (and no other). */
        private void markTaken(int[] lineOf) {
            if (++stamp == Integer.MAX_VALUE) {
                Arrays.fill(takenMark, 0);
                stamp = 1;
            }
            for (int l : lineOf) {
                if (l >= 0) {
                    takenMark[l] = stamp;
                }
            }
        }

        /** The wavelength (nm) of a window entry: a line, or twice it for a second-order image (-1 - line). */
        private double entryWavelength(int entry) {
            return entry >= 0 ? lines.wavelength(entry) : 2 * lines.wavelength(-1 - entry);
        }

        /** The first window index whose wavelength is &gt;= nm. */
        private int lowerBound(double nm) {
            int k = Arrays.binarySearch(windowNm, nm);
            if (k < 0) {
                return -k - 1;
            }
            while (k > 0 && windowNm[k - 1] == nm) {
                k--;
            }
            return k;
        }

        /**
         * Fits the pairs of the peaks at peakPixel, its scatter and curvature prior scaled by the
         * slope a_1 given; the fit stays open for {@link #extend} to add and remove pairs with the
         * same scaling. False when the fit fails.
         */
        private boolean fitOn(double[] peakPixel, int[] lineOf, double slope) {
            double a1 = Math.abs(slope);
            if (!(a1 > 0) || Double.isInfinite(a1)) {
                return false;
            }
            polynomial.reset(scatter() * a1 / half, scaledPrior(a1));
            for (int k = 0; k < lineOf.length; k++) {
                if (lineOf[k] >= 0 && window[lineOf[k]] >= 0) { // images explain peaks, never bend the fit
                    polynomial.add((peakPixel[k] - mid) / half, windowNm[lineOf[k]]);
                }
            }
            return polynomial.solveNow();
        }

        private double[] scaledPrior(double a1) {
            double[] sigma = priorSigma.clone();
            for (int d = 2; d < sigma.length; d++) {
                sigma[d] *= a1;
            }
            return sigma;
        }

        /**
         * Verifies a grown polynomial over the detector: monotonic and inside the prior, then every
         * peak matched within the tolerance and the polynomial refitted on those pairs, until the
         * pairs settle (at most {@value #VERIFY_PASSES} matchings), and scored.
         */
        private Candidate verify(double[] a, int sign) {
            if (!withinPrior(a, sign)) {
                return null;
            }
            int[] matched = new int[centre.length];
            int[] previous = new int[centre.length];
            for (int pass = 0; pass < VERIFY_PASSES; pass++) {
                int count = assign(a, centre, matched);
                if (count < MIN_FEW_LINE_MATCHES) {
                    return null;
                }
                if (pass == VERIFY_PASSES - 1 || (pass > 0 && Arrays.equals(previous, matched))) {
                    break;
                }
                System.arraycopy(matched, 0, previous, 0, matched.length);
                if (!fitOn(centre, matched, a[1])) {
                    return null;
                }
                a = polynomial.coefficients();
                if (!withinPrior(a, sign)) {
                    return null;
                }
            }
            double scatter = scatter();
            double score = 0;
            for (int k = 0; k < centre.length; k++) {
                if (matched[k] >= 0) {
                    double x = (centre[k] - mid) / half;
                    double slope = Math.abs(PolynomialLeastSquares.derivative(a, x) / half);
                    double r = residualPixels(a, centre[k], windowNm[matched[k]]) / scatter;
                    double density = lineDensity(windowNm[matched[k]], slope);
                    // log of [Gaussian density of the residual] / [density of lamp lines there]
                    double gain = -0.5 * r * r - Math.log(scatter * Math.sqrt(2 * Math.PI) * density);
                    score += Math.max(0, gain);
                }
            }
            return measure(a, sign, score);
        }

        /** The strong-peak figures of a polynomial, and its chance expectation, as a candidate. */
        private Candidate measure(double[] a, int sign, double score) {
            int[] strongLineOf = new int[strongPixel.length];
            int strongMatched = assign(a, strongPixel, strongLineOf);
            // Chance, judged over every peak at the precision the pairs reach: the peaks within
            // three robust standard deviations of their lines (at least a thirtieth of the
            // tolerance), against the matches chance gives within that distance.
            int[] lineOf = new int[centre.length];
            int matched = assign(a, centre, lineOf);
            double[] absResidual = new double[matched];
            int m = 0;
            for (int k = 0; k < centre.length; k++) {
                if (lineOf[k] >= 0) {
                    absResidual[m++] = Math.abs(residualPixels(a, centre[k], windowNm[lineOf[k]]));
                }
            }
            Arrays.sort(absResidual);
            double robustSigma = matched == 0 ? tolerance : 1.4826 * absResidual[(matched - 1) / 2];
            double precise = Math.min(tolerance, Math.max(3 * robustSigma, tolerance / 30));
            int preciseMatched = 0;
            for (double r : absResidual) {
                if (r <= precise) {
                    preciseMatched++;
                }
            }
            double chance = 0;
            for (int k = 0; k < centre.length; k++) {
                double x = (centre[k] - mid) / half;
                double slope = Math.abs(PolynomialLeastSquares.derivative(a, x) / half);
                chance += Math.min(1, 2 * precise * lineDensity(PolynomialLeastSquares.evaluate(a, x), slope));
            }
            int free = freePairs(a, lineOf, precise, preciseMatched);
            return new Candidate(a, strongMatched, score, preciseMatched, precise,
                    free == LINE_PAIRS ? chance + seedOdds(precise) : chance, sign, free);
        }

        /**
         * How many of the precise pairs the polynomial could have been made to meet whatever the
         * lines: its coefficients' count, unless a polynomial of lower degree meets every precise
         * pair within the same distance: then that one's count, {@value #FITTED_PAIRS} for a
         * quadratic and {@value #LINE_PAIRS} for a straight line. A cubic meets four pairs exactly,
         * so with it only the pairs beyond four are evidence (a zinc and cadmium spectrum was
         * paired with neon and argon lines by a cubic through seven peaks and accepted under a
         * lowered share, 3,587 pixels off); where a quadratic does as well the cubic term is not
         * what made the pairs meet, and where a straight line does, no curvature is. (With a
         * straight line the seed's middle pair, chosen because it lay near the line through the
         * outer two, is counted at its own odds: see {@link #seedOdds}.)
         */
        private int freePairs(double[] a, int[] lineOf, double precise, int preciseMatched) {
            int n = centre.length;
            double[] x = new double[n];
            double[] nm = new double[n];
            boolean[] use = new boolean[n];
            int used = 0;
            for (int k = 0; k < n; k++) {
                x[k] = (centre[k] - mid) / half;
                if (lineOf[k] >= 0) {
                    nm[k] = windowNm[lineOf[k]];
                    use[k] = Math.abs(residualPixels(a, centre[k], nm[k])) <= precise;
                    used += use[k] ? 1 : 0;
                }
            }
            int own = Math.max(a.length, FITTED_PAIRS);
            for (int degree = 1; degree + 1 < own && used > degree + 1; degree++) {
                PolynomialLeastSquares.Solution lower = PolynomialLeastSquares.fit(x, nm, null, use, degree);
                if (lower == null) {
                    continue;
                }
                int met = 0;
                for (int k = 0; k < n; k++) {
                    if (use[k] && Math.abs(residualPixels(lower.coefficients(), centre[k], nm[k])) <= precise) {
                        met++;
                    }
                }
                if (met >= preciseMatched) {
                    return degree + 1;
                }
            }
            return own;
        }

        /**
         * The chance that a seed's middle pair lies within {@code precise} pixels of the straight
         * line through the outer two, given that the seed was chosen because it lay within the
         * seed tolerance ({@link #tolerance} at least): at most precise / tolerance, as for a
         * position spread evenly over the window it was chosen from (common practice). A straight
         * line's free pairs ({@value #LINE_PAIRS}) leave that pair as evidence; these odds, not
         * the line density's, are its chance.
         */
        private double seedOdds(double precise) {
            return Math.min(1, precise / tolerance);
        }

        /**
         * Lamp lines per pixel near nm: the window's entries (lines, and second-order images when
         * considered) within DENSITY_HALF_WIDTH tolerances either side, counting at least one.
         */
        private double lineDensity(double nm, double slope) {
            double halfWidthNm = DENSITY_HALF_WIDTH * tolerance * slope;
            int from = lowerBound(nm - halfWidthNm);
            int to = lowerBound(nm + halfWidthNm);
            return Math.max(1, to - from) / (2 * DENSITY_HALF_WIDTH * tolerance);
        }

        /** Where the polynomial puts a line, as a pixel residual (first order). */
        private double residualPixels(double[] a, double pixel, double nm) {
            double x = (pixel - mid) / half;
            double slope = PolynomialLeastSquares.derivative(a, x) / half;
            return (PolynomialLeastSquares.evaluate(a, x) - nm) / slope;
        }

        /**
         * Matches peaks to their nearest lines of the window within the tolerance, one-to-one (the
         * closer peak wins a line).
         *
         * @param matched receives, per peak, the index into the window's lines, or -1
         * @return the number matched
         */
        private int assign(double[] a, double[] peakPixel, int[] matched) {
            int n = peakPixel.length;
            // Scratch arrays reused across the many hypotheses of one search (one thread).
            if (owner.length != window.length) {
                owner = new int[window.length];
            }
            if (distance.length < n) {
                distance = new double[n];
            }
            Arrays.fill(owner, -1);
            Arrays.fill(matched, -1);
            for (int k = 0; k < n; k++) {
                double x = (peakPixel[k] - mid) / half;
                double nm = PolynomialLeastSquares.evaluate(a, x);
                double slope = Math.abs(PolynomialLeastSquares.derivative(a, x) / half);
                int line = nearestFirstOrder(nm, tolerance * slope);
                if (line < 0) {
                    continue;
                }
                double d = Math.abs(windowNm[line] - nm) / slope;
                if (!(d <= tolerance)) {
                    continue;
                }
                int other = owner[line];
                if (other >= 0) {
                    if (distance[other] <= d) {
                        continue;
                    }
                    matched[other] = -1;
                }
                owner[line] = k;
                matched[k] = line;
                distance[k] = d;
            }
            int count = 0;
            for (int k = 0; k < n; k++) {
                if (matched[k] >= 0) {
                    count++;
                }
            }
            return count;
        }

        /**
         * The nearest first-order line within reachNm of nm; when there is none, or the nearest
         * entry is a second-order image less than IMAGE_PREFERENCE of that line's
         * distance away, the nearest entry (an image, or a line beyond the reach).
         */
        private int nearestFirstOrder(double nm, double reachNm) {
            int line = nearest(nm);
            if (line < 0 || window[line] >= 0) {
                return line;
            }
            int best = -1;
            double bestDistance = reachNm;
            for (int step : new int[] {-1, 1}) {
                for (int j = line + step; j >= 0 && j < windowNm.length && Math.abs(windowNm[j] - nm) <= reachNm;
                        j += step) {
                    if (window[j] >= 0) {
                        if (Math.abs(windowNm[j] - nm) <= bestDistance) {
                            bestDistance = Math.abs(windowNm[j] - nm);
                            best = j;
                        }
                        break;
                    }
                }
            }
            if (best >= 0 && Math.abs(windowNm[line] - nm) < IMAGE_PREFERENCE * bestDistance) {
                return line;
            }
            return best >= 0 ? best : line;
        }

        private int nearest(double nm) {
            int k = Arrays.binarySearch(windowNm, nm);
            if (k >= 0) {
                return k;
            }
            int above = -k - 1;
            if (above == 0) {
                return windowNm.length == 0 ? -1 : 0;
            }
            if (above == windowNm.length) {
                return above - 1;
            }
            return nm - windowNm[above - 1] <= windowNm[above] - nm ? above - 1 : above;
        }

        /**
         * Monotonic in the hypothesis' direction over the detector, inside the prior, and within
         * the reach of the lamp's lines and of the lines' medium.
         */
        private boolean withinPrior(double[] a, int sign) {
            double floor = lines.medium() instanceof Medium.Air ? AIR_MODEL_LOWEST_NM : 0;
            int samples = 64;
            for (int s = 0; s <= samples; s++) {
                double p = (pixels - 1) * (double) s / samples;
                double x = (p - mid) / half;
                double dispersion = PolynomialLeastSquares.derivative(a, x) / half;
                if (!(dispersion * sign > 0)
                        || !searchPrior.admits(PolynomialLeastSquares.evaluate(a, x), dispersion, floor)) {
                    return false;
                }
            }
            return true;
        }

        /**
         * Leave-one-out check of the pairs: each pair's line must lie within the tolerance of where
         * the polynomial fitted to the other pairs (with the curvature prior) puts it. A pair the
         * others do not confirm (typically a lone line beyond the rest that the polynomial bends to
         * take) is dropped, the worst first, and the polynomial refitted, until every pair left is
         * confirmed. The figures and the match are then taken without the dropped pairs.
         *
         * @param matched per peak, its window line or -1; dropped pairs are set to -1
         * @return the polynomial fitted to the pairs kept (a unchanged when nothing was dropped)
         */
        private double[] dropUnconfirmed(double[] a, int[] matched, int sign) {
            for (int pass = 0; pass < centre.length; pass++) {
                if (!fitOn(centre, matched, a[1])) {
                    return a;
                }
                int worst = -1;
                double worstMiss = tolerance;
                for (int k = 0; k < centre.length; k++) {
                    if (matched[k] < 0 || window[matched[k]] < 0 || pinnedByPrior(k, matched)) {
                        continue;
                    }
                    double x = (centre[k] - mid) / half;
                    double nm = windowNm[matched[k]];
                    polynomial.remove(x, nm);
                    if (polynomial.solveNow()) {
                        double slope = polynomial.derivative(x) / half;
                        double miss = Math.abs(polynomial.value(x) - nm) / Math.abs(slope);
                        if (slope * sign > 0 && miss > worstMiss) {
                            worstMiss = miss;
                            worst = k;
                        }
                    }
                    polynomial.add(x, nm);
                }
                if (worst < 0) {
                    return a;
                }
                matched[worst] = -1;
                if (!fitOn(centre, matched, a[1])) {
                    return a;
                }
                a = polynomial.coefficients();
            }
            return a;
        }

        /**
         * Whether the prior's dispersion bounds, from the nearest other pair, leave this pair's
         * line the only lamp line its peak can be: every wavelength the peak may see, from that
         * pair's line with any local dispersion the prior admits (with its 5 % slack) plus the
         * tolerance, holds no other line of the window. Such a pair is not dropped for want of
         * confirmation by the other pairs: in a window of four lines with a tight prior, the one
         * line far from the rest is unconfirmable by them, yet nothing else can be there. (The
         * calibration's end check then states that the solution near it rests on that pairing.)
         * False without a pair to start from or when the bounds allow either direction.
         */
        private boolean pinnedByPrior(int k, int[] matched) {
            double slack = 0.05
                    * Math.max(Math.abs(searchPrior.minDispersion()), Math.abs(searchPrior.maxDispersion()));
            double low = searchPrior.minDispersion() - slack;
            double high = searchPrior.maxDispersion() + slack;
            if (low * high <= 0) {
                return false;
            }
            int nearest = -1;
            for (int j = 0; j < centre.length; j++) {
                if (j != k && matched[j] >= 0 && window[matched[j]] >= 0
                        && (nearest < 0 || Math.abs(centre[j] - centre[k]) < Math.abs(centre[nearest] - centre[k]))) {
                    nearest = j;
                }
            }
            if (nearest < 0) {
                return false;
            }
            double step = centre[k] - centre[nearest];
            double from = windowNm[matched[nearest]] + Math.min(low * step, high * step) - tolerance * Math.abs(high);
            double to = windowNm[matched[nearest]] + Math.max(low * step, high * step) + tolerance * Math.abs(high);
            double own = windowNm[matched[k]];
            if (own < from || own > to) {
                return false;
            }
            for (int l = lowerBound(from); l < windowNm.length && windowNm[l] <= to; l++) {
                if (l != matched[k] && window[l] >= 0) {
                    return false;
                }
            }
            return true;
        }

        /**
         * Where a verified polynomial puts five pixels across the detector (its ends, quarters
         * and middle), in units of the tolerance at its mid-detector dispersion, rounded: two
         * pairings whose solutions agree within about a tolerance everywhere are one trial of the
         * chance test, not two (seeds of one solution grow into many pairings). Rounding may
         * split one solution into two trials, and never merges two whose places differ by a
         * tolerance or more at one of the five pixels.
         */
        private List<Long> signature(double[] a) {
            double unit = tolerance * Math.abs(PolynomialLeastSquares.derivative(a, 0) / half);
            List<Long> key = new ArrayList<>(5);
            for (int q = 0; q <= 4; q++) {
                key.add(Math.round(PolynomialLeastSquares.evaluate(a, -1 + 0.5 * q) / unit));
            }
            return key;
        }

        /** Re-matches the winner against every peak and line until the pairs settle. */
        Refined refine(Candidate best, double[] centreSigma) {
            double[] a = best.coefficients;
            int n = centre.length;
            int[] matched = new int[n];
            // Grow the winner over every peak, weak ones included, under the curvature prior: where
            // the strong peaks left gaps, the fixed-tolerance matching below could not reach.
            int[] sortedLineOf = new int[n];
            int[] byPixel = sortBy(identity(n), k -> centre[k]);
            double[] sortedPixel = new double[n];
            assign(a, centre, matched);
            for (int i = 0; i < n; i++) {
                sortedPixel[i] = centre[byPixel[i]];
                sortedLineOf[i] = matched[byPixel[i]];
            }
            if (fitOn(sortedPixel, sortedLineOf, a[1]) && extend(sortedPixel, sortedLineOf, best.sign, false) > 0
                    && fitOn(sortedPixel, sortedLineOf, polynomial.slope())
                    && withinPrior(polynomial.coefficients(), best.sign)) {
                a = polynomial.coefficients();
            }
            int[] previous = null;
            for (int pass = 0; pass < MAX_REFINE_PASSES; pass++) {
                int count = assign(a, centre, matched);
                if (previous != null && Arrays.equals(previous, matched)) {
                    break;
                }
                previous = matched.clone();
                if (count < MIN_FEW_LINE_MATCHES || !fitOn(centre, matched, a[1])
                        || !withinPrior(polynomial.coefficients(), best.sign)) {
                    break;
                }
                a = polynomial.coefficients();
            }
            assign(a, centre, matched);
            a = dropUnconfirmed(a, matched, best.sign);
            Candidate measured = measure(a, best.sign, best.score);
            // Peaks explained as second-order images count as matched in the figures above; the
            // pairs handed on to the dispersion fit are the first-order ones.
            int[] firstOrder = matched.clone();
            int[] image = new int[n];
            Arrays.fill(image, -1);
            for (int k = 0; k < n; k++) {
                if (firstOrder[k] >= 0 && window[firstOrder[k]] < 0) {
                    image[k] = firstOrder[k];
                    firstOrder[k] = -1;
                }
            }
            int[] secondOrderPeaks = indicesOf(image);
            int[] order = sortBy(indicesOf(firstOrder), k -> centre[k]);
            int size = order.length;
            int[] peakIndex = new int[size];
            int[] lineIndex = new int[size];
            double[] pixel = new double[size];
            double[] pixelSigma = new double[size];
            double[] nm = new double[size];
            double[] nmSigma = new double[size];
            double[] residual = new double[size];
            for (int i = 0; i < size; i++) {
                int k = order[i];
                peakIndex[i] = k;
                lineIndex[i] = window[matched[k]];
                pixel[i] = centre[k];
                pixelSigma[i] = centreSigma[k];
                nm[i] = windowNm[matched[k]];
                nmSigma[i] = lines.sigma(lineIndex[i]);
                residual[i] = -residualPixels(a, centre[k], nm[i]);
            }
            double firstNm = PolynomialLeastSquares.evaluate(a, (0 - mid) / half);
            double lastNm = PolynomialLeastSquares.evaluate(a, (pixels - 1 - mid) / half);
            return new Refined(measured, new LampMatch(peakIndex, lineIndex, pixel, pixelSigma, nm, nmSigma,
                    lines.sigmasGiven(), residual, strongPixel.length, measured.strongMatched, a.length - 1, hypotheses,
                    firstNm, lastNm, lines.medium(), measured.chance, chanceProbability(measured), evaluated,
                    secondOrderPeaks));
        }
    }

    private static int[] identity(int n) {
        int[] out = new int[n];
        for (int i = 0; i < n; i++) {
            out[i] = i;
        }
        return out;
    }

    private static int[] indicesOf(int[] matched) {
        int count = 0;
        for (int m : matched) {
            if (m >= 0) {
                count++;
            }
        }
        int[] out = new int[count];
        int c = 0;
        for (int k = 0; k < matched.length; k++) {
            if (matched[k] >= 0) {
                out[c++] = k;
            }
        }
        return out;
    }

    /** The indices 0 .. n-1 of the {@code limit} largest by {@code rank} (ties: lower index), sorted by {@code key}. */
    private static int[] strongest(int n, int limit, IntToDoubleFunction rank, IntToDoubleFunction key) {
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> {
            int c = Double.compare(rank.applyAsDouble(b), rank.applyAsDouble(a));
            return c != 0 ? c : Integer.compare(a, b);
        });
        int m = Math.min(n, limit);
        int[] chosen = new int[m];
        for (int i = 0; i < m; i++) {
            chosen[i] = order[i];
        }
        return sortBy(chosen, key);
    }

    private static int[] sortBy(int[] indices, IntToDoubleFunction key) {
        Integer[] boxed = new Integer[indices.length];
        for (int i = 0; i < indices.length; i++) {
            boxed[i] = indices[i];
        }
        Arrays.sort(boxed, (a, b) -> {
            int c = Double.compare(key.applyAsDouble(a), key.applyAsDouble(b));
            return c != 0 ? c : Integer.compare(a, b);
        });
        int[] out = new int[indices.length];
        for (int i = 0; i < out.length; i++) {
            out[i] = boxed[i];
        }
        return out;
    }
}
