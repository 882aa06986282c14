package org.ritzwerk.engine.calibrate;

import java.util.Arrays;
import java.util.HashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;

/**
 * Pairs detected peaks with a lamp's reference lines without a starting solution: which peak is
 * which line, and a first pixel-to-wavelength polynomial.
 *
 * <p><b>Search.</b> The strongest {@code strongPeaks} peaks (by flux) and the strongest
 * {@code strongLines} lines within the prior's wavelength range (by relative intensity) are each
 * sorted by position. Every triplet of nearby peaks (the second and third among the next four
 * strong peaks) is compared with every triplet of nearby lines (among the next six strong lines,
 * in the order the dispersion's sign implies): the ratio of the inner gap to the outer gap is
 * invariant under a linear map, so a triplet pair whose middle peak lies within
 * {@code tolerance + 0.02 span} pixels of where the outer pair puts the middle line, and whose
 * dispersion lies in the prior, seeds a hypothesis. (Local triplets tolerate the curvature of the
 * dispersion, which distant pairs would not. The idea is the one-dimensional form of matching
 * point lists by figures whose shape is invariant under the transformation sought: similar
 * triangles, E. J. Groth, Astron. J. 91, 1244 (1986); ratios of sides as the invariant,
 * F. G. Valdes, L. E. Campusano, J. D. Velasquez and P. B. Stetson, Publ. Astron. Soc. Pac.
 * 107, 1119 (1995).) Each seed is grown: a straight line through the three
 * pairs predicts the strong peaks in a window twice as wide as the span matched so far, each
 * predicted peak is matched to the nearest line of the whole list (one-to-one, the closer peak
 * wins) when within {@code tolerance} pixels, and a polynomial of degree 1, then 2, then up to
 * {@code maxDegree} (as matches and span allow) is refitted, until the window covers the detector
 * and the matches stop changing. The grown hypothesis that matches most of all the peaks wins
 * (ties: more strong peaks, then the smaller RMS); counting every peak, not only the strong ones
 * that seeded the search, keeps strong contaminating lines from steering the choice. The search is exhaustive and has no random part: the same input gives the same
 * answer.
 *
 * <p><b>Limits.</b> The seeds come from the strongest peaks and lines only: when lines that are
 * not in the list (other gases, second order) take a large share of the strongest places, or the
 * lamp's relative intensities differ much from the table's, widen the search with
 * {@link #withStrongest(int, int)} (in trials, ten contaminants among the 25 strongest peaks of a
 * neon spectrum needed 40 and 40). Chance pairings of a wrong lamp list explained 20 to 44 % of
 * the strongest peaks in trials, hence the default minimum of 50 %.
 *
 * <p><b>Refinement.</b> The winner is re-matched against every peak and every line, and
 * refitted, until the pairs stop changing (at most 10 passes).
 *
 * <p><b>Failures</b> ({@link CalibrationException}): fewer than 4 peaks
 * ({@link CalibrationException#TOO_FEW_PEAKS}) or lines within the prior
 * ({@link CalibrationException#TOO_FEW_LINES}); otherwise, when no solution in the prior explains
 * at least {@code minInlierFraction} of the strong peaks with at least 4 pairs, the search is
 * repeated without the prior: a good solution there gives {@link CalibrationException#OUTSIDE_PRIOR}
 * (the message names its range and dispersion); else fewer than 4 pairs anywhere gives
 * {@link CalibrationException#TOO_FEW_MATCHES} and more gives
 * {@link CalibrationException#LAMP_MISMATCH} (the message gives the best inlier fraction).
 *
 * <p>Immutable and thread-safe.
 */
public final class LampMatcher {

    /** Fewest pairs a solution needs. */
    public static final int MIN_MATCHES = 4;
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

    private static final int PEAK_NEIGHBOURS = 4;
    private static final int LINE_NEIGHBOURS = 6;
    private static final double SPAN_TOLERANCE = 0.02;
    private static final int MAX_GROW_ROUNDS = 30;
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

        @Override
        public String toString() {
            return String.format(Locale.ROOT, "%.6g to %.6g nm, %.6g to %.6g nm/pixel", minWavelengthNm,
                    maxWavelengthNm, minDispersion, maxDispersion);
        }
    }

    private final Prior prior;
    private final double tolerance;
    private final int strongPeaks;
    private final int strongLines;
    private final int maxDegree;
    private final double minInlierFraction;

    private LampMatcher(Prior prior, double tolerance, int strongPeaks, int strongLines, int maxDegree,
            double minInlierFraction) {
        this.prior = prior;
        this.tolerance = tolerance;
        this.strongPeaks = strongPeaks;
        this.strongLines = strongLines;
        this.maxDegree = maxDegree;
        this.minInlierFraction = minInlierFraction;
    }

    /**
     * @return a matcher with no prior ({@link Prior#none()}), tolerance 3 pixels, the 25 strongest
     *         peaks and 120 strongest lines, polynomials up to degree 3 and a minimum inlier
     *         fraction of 0.5
     */
    public static LampMatcher defaults() {
        return new LampMatcher(Prior.none(), DEFAULT_TOLERANCE, DEFAULT_STRONG_PEAKS, DEFAULT_STRONG_LINES,
                DEFAULT_MAX_DEGREE, DEFAULT_MIN_INLIER_FRACTION);
    }

    /** @param prior what is known of the range and dispersion @return a copy with that prior */
    public LampMatcher withPrior(Prior prior) {
        return new LampMatcher(Objects.requireNonNull(prior, "prior"), tolerance, strongPeaks, strongLines, maxDegree,
                minInlierFraction);
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
        return new LampMatcher(prior, pixels, strongPeaks, strongLines, maxDegree, minInlierFraction);
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
        return new LampMatcher(prior, tolerance, peaks, lines, maxDegree, minInlierFraction);
    }

    /**
     * @param degree highest degree of the matcher's own polynomial, 1 to 5
     * @return a copy with that limit
     */
    public LampMatcher withMaxDegree(int degree) {
        if (degree < 1 || degree > 5) {
            throw new IllegalArgumentException("matcher degree must be 1 to 5, got " + degree);
        }
        return new LampMatcher(prior, tolerance, strongPeaks, strongLines, degree, minInlierFraction);
    }

    /**
     * @param fraction smallest share of the strongest peaks a solution must match, 0 to 1
     * @return a copy with that limit
     */
    public LampMatcher withMinInlierFraction(double fraction) {
        if (!(fraction >= 0 && fraction <= 1)) {
            throw new IllegalArgumentException("minimum inlier fraction must be 0 to 1, got " + fraction);
        }
        return new LampMatcher(prior, tolerance, strongPeaks, strongLines, maxDegree, fraction);
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
        if (n < MIN_MATCHES) {
            throw new CalibrationException(CalibrationException.TOO_FEW_PEAKS, "found " + n + " peaks; a calibration "
                    + "needs at least " + MIN_MATCHES);
        }
        int inPrior = linesWithin(lines, prior);
        if (inPrior < MIN_MATCHES) {
            throw new CalibrationException(CalibrationException.TOO_FEW_LINES, "the lamp list has " + inPrior + " of its "
                    + lines.size() + " lines (" + span(lines) + ") within the prior's range " + prior
                    + "; a calibration needs at least " + MIN_MATCHES);
        }
        Search inside = new Search(centre, intensity, pixels, lines, prior);
        Candidate best = inside.run();
        if (acceptable(best, inside)) {
            return inside.refine(best, centreSigma);
        }
        Search anywhere = prior.equals(Prior.none()) ? inside : new Search(centre, intensity, pixels, lines,
                Prior.none());
        Candidate free = anywhere == inside ? best : anywhere.run();
        if (anywhere != inside && acceptable(free, anywhere)) {
            LampMatch outside = anywhere.refine(free, centreSigma);
            throw new CalibrationException(CalibrationException.OUTSIDE_PRIOR, String.format(Locale.ROOT,
                    "no solution within the prior (%s) matches at least %d peaks and %.0f%% of the %d strongest; "
                            + "one outside it does: %.2f to %.2f nm over pixels 0 to %d (%.4g nm/pixel), "
                            + "%d of %d strong peaks matched",
                    prior, MIN_MATCHES, 100 * minInlierFraction, inside.strong.length, outside.firstWavelength(),
                    outside.lastWavelength(), pixels - 1,
                    (outside.lastWavelength() - outside.firstWavelength()) / (pixels - 1), outside.strongMatched(),
                    outside.strongPeaks()));
        }
        int bestCount = Math.max(best == null ? 0 : best.strongMatched, free == null ? 0 : free.strongMatched);
        if (bestCount < MIN_MATCHES) {
            throw new CalibrationException(CalibrationException.TOO_FEW_MATCHES, "the best pairing of " + n
                    + " peaks with " + lines.size() + " lamp lines matches " + bestCount + " of the "
                    + inside.strong.length + " strongest peaks, " + where() + "; "
                    + "a calibration needs at least " + MIN_MATCHES);
        }
        Candidate shown = free != null && (best == null || free.strongMatched > best.strongMatched) ? free : best;
        throw new CalibrationException(CalibrationException.LAMP_MISMATCH, String.format(Locale.ROOT,
                "the lamp lines (%s) do not explain the spectrum: the best pairing matches %d of the %d strongest "
                        + "peaks (%.0f%%), below the %.0f%% required, %s",
                span(lines), shown.strongMatched, inside.strong.length,
                100.0 * shown.strongMatched / inside.strong.length, 100 * minInlierFraction, where()));
    }

    /** Where the search looked, for messages. */
    private String where() {
        return prior.equals(Prior.none()) ? "searching every wavelength and dispersion"
                : "within the prior (" + prior + ") or outside it";
    }

    private boolean acceptable(Candidate c, Search search) {
        return c != null && c.strongMatched >= MIN_MATCHES
                && c.strongMatched >= minInlierFraction * search.strong.length;
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

    private static String span(LampLines lines) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < lines.size(); i++) {
            lo = Math.min(lo, lines.wavelength(i));
            hi = Math.max(hi, lines.wavelength(i));
        }
        return String.format(Locale.ROOT, "%d lines, %.6g to %.6g nm", lines.size(), lo, hi);
    }

    /** The pairs a seed matched in its first round (per strong peak, a line or -1), and the direction. */
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

    /** One grown hypothesis: the polynomial and how many strong peaks it matches. */
    private record Candidate(double[] coefficients, int strongMatched, int allMatched, double rms, int sign) {
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
        /** Line indices within the prior's range, sorted by wavelength, and their wavelengths. */
        private final int[] window;
        private final double[] windowNm;
        /** Strong line indices within the range, sorted by wavelength. */
        private final int[] strongLine;
        private final double mid;
        private final double half;
        private long hypotheses;
        private final Map<GrowthKey, Candidate> grown = new HashMap<>();
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
            int count = linesWithin(lines, searchPrior);
            int[] inside = new int[count];
            int m = 0;
            for (int i = 0; i < lines.size(); i++) {
                double w = lines.wavelength(i);
                if (w >= searchPrior.minWavelengthNm() && w <= searchPrior.maxWavelengthNm()) {
                    inside[m++] = i;
                }
            }
            window = sortBy(inside, lines::wavelength);
            windowNm = new double[window.length];
            for (int k = 0; k < window.length; k++) {
                windowNm[k] = lines.wavelength(window[k]);
            }
            int[] strongOfWindow = strongest(window.length, strongLines, k -> lines.intensity(window[k]),
                    k -> windowNm[k]);
            strongLine = new int[strongOfWindow.length];
            for (int k = 0; k < strongLine.length; k++) {
                strongLine[k] = window[strongOfWindow[k]];
            }
        }

        Candidate run() {
            Candidate best = null;
            for (int sign : new int[] {1, -1}) {
                if (!searchPrior.allowsDirection(sign)) {
                    continue;
                }
                double[] nm = new double[strongLine.length];
                for (int k = 0; k < nm.length; k++) {
                    nm[k] = lines.wavelength(strongLine[sign > 0 ? k : nm.length - 1 - k]);
                }
                best = better(best, searchDirection(nm, sign));
            }
            return best;
        }

        private Candidate searchDirection(double[] nm, int sign) {
            Candidate best = null;
            int np = strongPixel.length;
            int nl = nm.length;
            double[] seedPixel = new double[3];
            double[] seedNm = new double[3];
            for (int i = 0; i + 2 < np; i++) {
                for (int j = i + 1; j < np && j <= i + PEAK_NEIGHBOURS; j++) {
                    for (int k = j + 1; k < np && k <= i + PEAK_NEIGHBOURS; k++) {
                        double spanPixels = strongPixel[k] - strongPixel[i];
                        if (!(spanPixels > 0)) {
                            continue;
                        }
                        double allowed = tolerance + SPAN_TOLERANCE * spanPixels;
                        for (int a = 0; a + 2 < nl; a++) {
                            for (int b = a + 1; b < nl && b <= a + LINE_NEIGHBOURS; b++) {
                                for (int c = b + 1; c < nl && c <= a + LINE_NEIGHBOURS; c++) {
                                    double dispersion = (nm[c] - nm[a]) / spanPixels;
                                    if (dispersion < searchPrior.minDispersion()
                                            || dispersion > searchPrior.maxDispersion() || dispersion == 0) {
                                        continue;
                                    }
                                    double predicted = strongPixel[i] + (nm[b] - nm[a]) / dispersion;
                                    if (Math.abs(predicted - strongPixel[j]) > allowed) {
                                        continue;
                                    }
                                    hypotheses++;
                                    seedPixel[0] = strongPixel[i];
                                    seedPixel[1] = strongPixel[j];
                                    seedPixel[2] = strongPixel[k];
                                    seedNm[0] = nm[a];
                                    seedNm[1] = nm[b];
                                    seedNm[2] = nm[c];
                                    best = better(best, grow(seedPixel, seedNm, sign));
                                }
                            }
                        }
                    }
                }
            }
            return best;
        }

        private Candidate better(Candidate a, Candidate b) {
            if (b == null) {
                return a;
            }
            if (a == null || b.allMatched > a.allMatched
                    || (b.allMatched == a.allMatched && b.strongMatched > a.strongMatched)
                    || (b.allMatched == a.allMatched && b.strongMatched == a.strongMatched && b.rms < a.rms)) {
                return b;
            }
            return a;
        }

        /** Grows a seed of three pairs over the detector; null when it dies or leaves the prior. */
        private Candidate grow(double[] seedPixel, double[] seedNm, int sign) {
            double[] x = new double[3];
            for (int k = 0; k < 3; k++) {
                x[k] = (seedPixel[k] - mid) / half;
            }
            double[] a = PolynomialLeastSquares.coefficients(x, seedNm, 1);
            if (a == null) {
                return null;
            }
            double lo = seedPixel[0];
            double hi = seedPixel[2];
            int[] matchedLine = new int[strongPixel.length];
            int previous = -1;
            boolean previousCovered = false;
            int count = 0;
            GrowthKey key = null;
            for (int round = 0; round < MAX_GROW_ROUNDS; round++) {
                double extend = Math.max(hi - lo, pixels / 20.0);
                double from = lo - extend;
                double to = hi + extend;
                count = assign(a, strongPixel, from, to, matchedLine);
                // A seed that explains no fourth peak near itself is not worth growing further;
                // the right solution is also seeded elsewhere, where peaks are denser.
                if (count < (round == 0 ? MIN_MATCHES : 3)) {
                    return null;
                }
                if (round == 0) {
                    // From here on the growth depends only on the pairs matched, so seeds that
                    // match the same pairs end in the same candidate: grow it once.
                    key = new GrowthKey(sign, matchedLine.clone());
                    if (grown.containsKey(key)) {
                        return grown.get(key);
                    }
                }
                double first = Double.POSITIVE_INFINITY;
                double last = Double.NEGATIVE_INFINITY;
                double[] px = new double[count];
                double[] py = new double[count];
                int m = 0;
                for (int k = 0; k < strongPixel.length; k++) {
                    if (matchedLine[k] >= 0) {
                        first = Math.min(first, strongPixel[k]);
                        last = Math.max(last, strongPixel[k]);
                        px[m] = (strongPixel[k] - mid) / half;
                        py[m] = windowNm[matchedLine[k]];
                        m++;
                    }
                }
                int degree = degreeFor(count, (last - first) / pixels);
                double[] next = PolynomialLeastSquares.coefficients(px, py, degree);
                if (next == null) {
                    return null;
                }
                a = next;
                lo = first;
                hi = last;
                boolean covered = from <= 0 && to >= pixels - 1;
                if (covered && previousCovered && count == previous) {
                    break;
                }
                previous = count;
                previousCovered = covered;
            }
            Candidate result = null;
            if (withinPrior(a, sign)) {
                double sum = 0;
                for (int k = 0; k < strongPixel.length; k++) {
                    if (matchedLine[k] >= 0) {
                        double r = residualPixels(a, strongPixel[k], windowNm[matchedLine[k]]);
                        sum += r * r;
                    }
                }
                int all = assign(a, centre, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY,
                        new int[centre.length]);
                result = new Candidate(a, count, all, Math.sqrt(sum / count), sign);
            }
            grown.put(key, result);
            return result;
        }

        private int degreeFor(int count, double spanFraction) {
            int degree = 1;
            if (count >= 5 && spanFraction >= 0.2) {
                degree = 2;
            }
            if (count >= 8 && spanFraction >= 0.5) {
                degree = 3;
            }
            if (count >= 12 && spanFraction >= 0.7) {
                degree = maxDegree;
            }
            return Math.min(degree, maxDegree);
        }

        /** Where the polynomial puts a line, as a pixel residual (first order). */
        private double residualPixels(double[] a, double pixel, double nm) {
            double x = (pixel - mid) / half;
            double slope = PolynomialLeastSquares.derivative(a, x) / half;
            return (PolynomialLeastSquares.evaluate(a, x) - nm) / slope;
        }

        /**
         * Matches the peaks within [from, to] to their nearest lines of the window, one-to-one.
         *
         * @param matched receives, per peak, the index into the window's lines, or -1
         * @return the number matched
         */
        private int assign(double[] a, double[] peakPixel, double from, double to, int[] matched) {
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
                double p = peakPixel[k];
                if (p < from || p > to) {
                    continue;
                }
                double x = (p - mid) / half;
                double nm = PolynomialLeastSquares.evaluate(a, x);
                double slope = Math.abs(PolynomialLeastSquares.derivative(a, x) / half);
                int line = nearest(nm);
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

        /** Monotonic in the hypothesis' direction over the detector, and inside the prior. */
        private boolean withinPrior(double[] a, int sign) {
            double margin = searchPrior.margin();
            double slack = 0.05 * Math.max(Math.abs(searchPrior.minDispersion()),
                    Math.abs(searchPrior.maxDispersion()));
            int samples = 64;
            for (int s = 0; s <= samples; s++) {
                double p = (pixels - 1) * (double) s / samples;
                double x = (p - mid) / half;
                double dispersion = PolynomialLeastSquares.derivative(a, x) / half;
                if (!(dispersion * sign > 0)) {
                    return false;
                }
                if (dispersion < searchPrior.minDispersion() - slack
                        || dispersion > searchPrior.maxDispersion() + slack) {
                    return false;
                }
                double nm = PolynomialLeastSquares.evaluate(a, x);
                if (nm < searchPrior.minWavelengthNm() - margin || nm > searchPrior.maxWavelengthNm() + margin) {
                    return false;
                }
            }
            return true;
        }

        /** Re-matches the winner against every peak and line until the pairs settle. */
        LampMatch refine(Candidate best, double[] centreSigma) {
            double[] a = best.coefficients;
            int n = centre.length;
            int[] matched = new int[n];
            int count = 0;
            int[] previous = null;
            for (int pass = 0; pass < MAX_REFINE_PASSES; pass++) {
                count = assign(a, centre, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, matched);
                if (previous != null && Arrays.equals(previous, matched)) {
                    break;
                }
                previous = matched.clone();
                double[] px = new double[count];
                double[] py = new double[count];
                double first = Double.POSITIVE_INFINITY;
                double last = Double.NEGATIVE_INFINITY;
                int m = 0;
                for (int k = 0; k < n; k++) {
                    if (matched[k] >= 0) {
                        px[m] = (centre[k] - mid) / half;
                        py[m] = windowNm[matched[k]];
                        first = Math.min(first, centre[k]);
                        last = Math.max(last, centre[k]);
                        m++;
                    }
                }
                PolynomialLeastSquares.Solution next = PolynomialLeastSquares.fit(px, py, null, null,
                        degreeFor(count, (last - first) / pixels));
                if (next == null) {
                    break;
                }
                a = next.coefficients();
            }
            int[] strongMatchedLine = new int[strongPixel.length];
            int strongMatched = assign(a, strongPixel, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY,
                    strongMatchedLine);
            int[] order = sortBy(indicesOf(matched), k -> centre[k]);
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
            return new LampMatch(peakIndex, lineIndex, pixel, pixelSigma, nm, nmSigma, lines.sigmasGiven(), residual,
                    strongPixel.length, strongMatched, a.length - 1, hypotheses, firstNm, lastNm, lines.medium());
        }
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
    private static int[] strongest(int n, int limit, java.util.function.IntToDoubleFunction rank,
            java.util.function.IntToDoubleFunction key) {
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

    private static int[] sortBy(int[] indices, java.util.function.IntToDoubleFunction key) {
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
