package org.ritzwerk.engine.calibrate;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * Finds an end of the fitted range whose pairing the other lines do not decide: a group of the
 * {@value #MAX_GROUP} or fewer outermost pairs (often beyond a long gap without lamp lines) that
 * pairs about as well with other lamp lines as with its own. The other pairs, fitted alone at the
 * solution's degree, predict each peak of the group with an uncertainty; every lamp line within
 * three of those uncertainties (or the tolerance, if wider) of the prediction is a candidate for
 * that peak. Each other assignment of the group to candidates (distinct lines, in the order of the
 * peaks, each neighbouring spacing within a factor {@value #SPACING} of the chosen lines') is fitted
 * together with the other pairs at the solution's degree without clipping, as is the chosen one.
 * With equal prior weight on every assignment, the chosen pairing's posterior odds against the
 * others are exp(-chi2/2) of the chosen over the sum of the others' (counting only others whose
 * solution runs one way, lies more than {@value #DEPARTURE} stated standard uncertainties from
 * the chosen one somewhere across the group, and explains as many of the detected peaks beyond the
 * other pairs). Below {@value #ODDS} to 1 the group's pairing is a guess: the calibration leaves it
 * out, with a note. (An argon lamp from 400 to 844 nm on 1024 pixels: two weak blue peaks 565
 * pixels beyond the red lines were paired with 430.01 and 426.63 nm where they were 419.83 and
 * 415.86 nm; the two pairs' spacings agree, each pair checked the other in the leave-one-out check,
 * and the solution was accepted 24 pixels off while stating 0.15 pixel. In one such exposure the
 * wrong pairing fitted better than the right one by odds of 23 to 1, so 20 to 1, the identifier's
 * threshold for an ambiguous peak, is not enough here, where a wrong group costs tens of pixels;
 * with 100 to 1 none of 24 such exposures is accepted wrong (refdata's ArgonGapTest). Of the 375
 * accepted runs of the calibration sweep over seeds 1 to 400, on the exposures before 2026-12-05,
 * one (seed 61) left a group out, a right one, its solution still right to 0.1 pixel over the
 * lines it kept; on the exposures of that date none of the 373 accepted runs leaves one out.)
 *
 * <p>Stateless.
 */
final class EndGroups {

    /** The most pairs an end group may hold. */
    static final int MAX_GROUP = 3;
    /** Posterior odds below which the chosen pairing of a group is not decided. */
    static final double ODDS = 100;
    /** Stated standard uncertainties beyond which another pairing's solution differs materially. */
    static final double DEPARTURE = 3;
    /** The most candidate lines taken per peak, the nearest to its prediction first. */
    static final int MAX_CANDIDATES = 40;
    /** The most alternative assignments fitted per group. */
    static final int MAX_FITS = 20000;
    /** How much the spacing of two neighbouring group lines may differ from the chosen pair's, as a factor. */
    static final double SPACING = 2;

    private EndGroups() {
    }

    /**
     * An end group whose pairing is undecided.
     *
     * @param pairs       the group's pair indices in the match, outermost first
     * @param alternative for each, the lamp line index of the best other pairing
     * @param chiSquare   the chosen pairing's chi-square, all pairs at the solution's degree
     * @param altChiSquare the other pairing's
     */
    record Undecided(int[] pairs, int[] alternative, double chiSquare, double altChiSquare) {
    }

    /**
     * @param match           the pairs fitted
     * @param solution        their solution (its degree and rejected pairs are used)
     * @param lines           the lamp's lines
     * @param tolerancePixels the pairing tolerance, pixels
     * @param high            the end at the highest pixel, else the lowest
     * @return the smallest undecided group at that end, or null when every group is decided (or the
     *         other pairs are too few to predict it)
     */
    static Undecided find(LampMatch match, DispersionSolution solution, LampLines lines, Peaks peaks,
            double tolerancePixels, boolean high) {
        int degree = solution.degree();
        Integer[] used = usedByPixel(match, solution, high);
        for (int k = 1; k <= MAX_GROUP && used.length - k >= degree + 2; k++) {
            Undecided u = tryGroup(match, solution, lines, peaks, tolerancePixels, Arrays.copyOf(used, k),
                    Arrays.copyOfRange(used, k, used.length), degree, high);
            if (u != null) {
                return u;
            }
        }
        return null;
    }

    /** @return the used pairs' indices, the outermost at that end first */
    private static Integer[] usedByPixel(LampMatch match, DispersionSolution solution, boolean high) {
        List<Integer> used = new ArrayList<>();
        for (int i = 0; i < match.size(); i++) {
            if (!solution.isRejected(i)) {
                used.add(i);
            }
        }
        Integer[] order = used.toArray(new Integer[0]);
        Arrays.sort(order, (a, b) -> high ? Double.compare(match.pixel(b), match.pixel(a))
                : Double.compare(match.pixel(a), match.pixel(b)));
        return order;
    }

    private static Undecided tryGroup(LampMatch match, DispersionSolution solution, LampLines lines, Peaks peaks,
            double tolerancePixels, Integer[] group, Integer[] rest, int degree, boolean high) {
        DispersionFit fixed = DispersionFit.ofDegree(degree).withoutClipping();
        DispersionSolution others;
        try {
            others = fit(match, lines, rest, null, null, fixed, solution);
        } catch (IllegalArgumentException e) {
            return null; // the others alone do not fix a solution of this degree
        }
        int k = group.length;
        int[][] candidates = new int[k][];
        boolean any = false;
        for (int g = 0; g < k; g++) {
            double p = match.pixel(group[g]);
            double centre = others.wavelengthAt(p);
            double reach = Math.max(3 * others.covarianceSigmaAt(p),
                    tolerancePixels * Math.abs(others.dispersionAt(p)));
            if (!(reach > 0) || Double.isInfinite(reach)) {
                return null;
            }
            candidates[g] = nearest(lines, centre, reach);
            any |= candidates[g].length > 1
                    || candidates[g].length == 1 && candidates[g][0] != match.lineIndex(group[g]);
        }
        if (!any) {
            return null;
        }
        double chosen;
        DispersionSolution own;
        try {
            own = fit(match, lines, rest, group, null, fixed, solution);
            chosen = own.chiSquare();
        } catch (IllegalArgumentException e) {
            return null;
        }
        // the part of the detector beyond the other pairs, where the group decides the solution
        double edge = match.pixel(group[k - 1]);
        double from = high ? edge : -0.5;
        double to = high ? peaks.pixels() - 0.5 : edge;
        int explained = explained(own, peaks, lines, tolerancePixels, from, to);
        if (Arrays.stream(candidates).anyMatch(c -> c.length == 0)) {
            return null;
        }
        Search search = new Search(match, lines, peaks, tolerancePixels, group, rest, candidates, fixed, solution,
                own, from, to, explained);
        search.walk(0, new int[k]);
        int[] best = search.best;
        double bestChi = search.bestChi;
        if (best == null || !(search.odds >= 1 / ODDS)) {
            return null;
        }
        int[] pairs = new int[k];
        for (int g = 0; g < k; g++) {
            pairs[g] = group[g];
        }
        return new Undecided(pairs, best, chosen, bestChi);
    }

    /**
     * Every other assignment of the group's peaks to their candidate lines, depth first: distinct
     * lines, in the order of the peaks, each step's spacing within a factor {@value #SPACING} of the
     * chosen pairing's (a small group's local dispersion changes less), at most {@value #MAX_FITS}
     * fits; keeps the one with the lowest chi-square that runs one way, departs from the chosen
     * solution and explains as many peaks beyond the other pairs.
     */
    private static final class Search {
        private final LampMatch match;
        private final LampLines lines;
        private final Peaks peaks;
        private final double tolerancePixels;
        private final Integer[] group;
        private final Integer[] rest;
        private final int[][] candidates;
        private final DispersionFit fixed;
        private final DispersionSolution solution;
        private final DispersionSolution own;
        private final double from;
        private final double to;
        private final int explained;
        private int fits;
        int[] best;
        double bestChi = Double.POSITIVE_INFINITY;
        /** The others' likelihoods summed, over the chosen pairing's. */
        double odds;

        Search(LampMatch match, LampLines lines, Peaks peaks, double tolerancePixels, Integer[] group,
                Integer[] rest, int[][] candidates, DispersionFit fixed, DispersionSolution solution,
                DispersionSolution own, double from, double to, int explained) {
            this.match = match;
            this.lines = lines;
            this.peaks = peaks;
            this.tolerancePixels = tolerancePixels;
            this.group = group;
            this.rest = rest;
            this.candidates = candidates;
            this.fixed = fixed;
            this.solution = solution;
            this.own = own;
            this.from = from;
            this.to = to;
            this.explained = explained;
        }

        void walk(int g, int[] pick) {
            if (g == group.length) {
                evaluate(pick);
                return;
            }
            for (int j : candidates[g]) {
                pick[g] = j;
                if (fits < MAX_FITS && fits(pick, g)) {
                    walk(g + 1, pick);
                }
            }
        }

        /** @return whether line pick[g] may follow the picks before it */
        private boolean fits(int[] pick, int g) {
            for (int r : rest) {
                if (match.lineIndex(r) == pick[g]) {
                    return false;
                }
            }
            for (int b = 0; b < g; b++) {
                if (pick[b] == pick[g]) {
                    return false;
                }
            }
            if (g == 0) {
                return true;
            }
            double chosen = match.wavelength(group[g]) - match.wavelength(group[g - 1]);
            double picked = lines.wavelength(pick[g]) - lines.wavelength(pick[g - 1]);
            double ratio = picked / chosen;
            return ratio >= 1 / SPACING && ratio <= SPACING;
        }

        private void evaluate(int[] pick) {
            boolean same = true;
            for (int g = 0; g < group.length; g++) {
                same &= pick[g] == match.lineIndex(group[g]);
            }
            if (same) {
                return;
            }
            fits++;
            try {
                DispersionSolution alt = fit(match, lines, rest, group, pick, fixed, solution);
                if (runsOneWay(alt, match) && departs(alt, own, solution, match, group)
                        && explained(alt, peaks, lines, tolerancePixels, from, to) >= explained) {
                    odds += Math.exp(-(alt.chiSquare() - own.chiSquare()) / 2);
                    if (alt.chiSquare() < bestChi) {
                        bestChi = alt.chiSquare();
                        best = pick.clone();
                    }
                }
            } catch (IllegalArgumentException e) {
                // this assignment gives no solution; try the next
            }
        }
    }

    /**
     * @return whether the other pairing's solution lies more than {@value #DEPARTURE} of the
     *         solution's stated standard uncertainties from the chosen pairing's somewhere across the
     *         group: an alternative within them is covered by what the solution states (two lines of
     *         a blend or of two gases swapped on a peak whose uncertainty spans both)
     */
    private static boolean departs(DispersionSolution alt, DispersionSolution own, DispersionSolution solution,
            LampMatch match, Integer[] group) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int g : group) {
            lo = Math.min(lo, match.pixel(g));
            hi = Math.max(hi, match.pixel(g));
        }
        for (int step = 0; step <= 32; step++) {
            double p = lo + (hi - lo) * step / 32;
            double sigma = solution.covarianceSigmaAt(p);
            if (!(Math.abs(alt.wavelengthAt(p) - own.wavelengthAt(p)) <= DEPARTURE * sigma)) {
                return true;
            }
        }
        return false;
    }

    /**
     * @return how many detected peaks from pixel {@code from} to {@code to} lie within the tolerance
     *         of a lamp line's place under the solution: another pairing of the group that explains
     *         fewer of the peaks there than the chosen one is no equal to it
     */
    private static int explained(DispersionSolution s, Peaks peaks, LampLines lines, double tolerancePixels,
            double from, double to) {
        double a = s.wavelengthAt(from);
        double b = s.wavelengthAt(to);
        double lo = Math.min(a, b);
        double hi = Math.max(a, b);
        double[] at = new double[lines.size()];
        int m = 0;
        for (int j = 0; j < lines.size(); j++) {
            if (lines.wavelength(j) >= lo && lines.wavelength(j) <= hi) {
                at[m++] = s.pixelAt(lines.wavelength(j));
            }
        }
        int count = 0;
        for (int q = 0; q < peaks.size(); q++) {
            double p = peaks.centre(q);
            if (p < from || p > to) {
                continue;
            }
            for (int j = 0; j < m; j++) {
                if (Math.abs(at[j] - p) <= tolerancePixels) {
                    count++;
                    break;
                }
            }
        }
        return count;
    }

    /** @return up to {@value #MAX_CANDIDATES} lamp lines within reach of the centre, the nearest first */
    private static int[] nearest(LampLines lines, double centre, double reach) {
        List<Integer> in = new ArrayList<>();
        for (int j = 0; j < lines.size(); j++) {
            if (Math.abs(lines.wavelength(j) - centre) <= reach) {
                in.add(j);
            }
        }
        in.sort((a, b) -> Double.compare(Math.abs(lines.wavelength(a) - centre),
                Math.abs(lines.wavelength(b) - centre)));
        return in.stream().limit(MAX_CANDIDATES).mapToInt(Integer::intValue).toArray();
    }

    /** @return whether the solution's dispersion keeps one sign over the pairs' range */
    private static boolean runsOneWay(DispersionSolution s, LampMatch match) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < match.size(); i++) {
            lo = Math.min(lo, match.pixel(i));
            hi = Math.max(hi, match.pixel(i));
        }
        double first = s.dispersionAt(lo);
        for (int step = 0; step <= 32; step++) {
            if (!(s.dispersionAt(lo + (hi - lo) * step / 32) * first > 0)) {
                return false;
            }
        }
        return true;
    }

    /**
     * Fits the rest and, when given, the group (with its own lines, or the picked ones).
     *
     * @throws IllegalArgumentException when the pairs fix no solution of the degree
     */
    private static DispersionSolution fit(LampMatch match, LampLines lines, Integer[] rest, Integer[] group,
            int[] pick, DispersionFit fit, DispersionSolution solution) {
        int n = rest.length + (group == null ? 0 : group.length);
        double[] pixel = new double[n];
        double[] pixelSigma = new double[n];
        double[] nm = new double[n];
        double[] nmSigma = new double[n];
        int k = 0;
        for (int r : rest) {
            pixel[k] = match.pixel(r);
            pixelSigma[k] = match.pixelSigma(r);
            nm[k] = match.wavelength(r);
            nmSigma[k] = match.wavelengthSigma(r);
            k++;
        }
        for (int g = 0; group != null && g < group.length; g++) {
            pixel[k] = match.pixel(group[g]);
            pixelSigma[k] = match.pixelSigma(group[g]);
            nm[k] = pick == null ? match.wavelength(group[g]) : lines.wavelength(pick[g]);
            nmSigma[k] = pick == null ? match.wavelengthSigma(group[g]) : lines.sigma(pick[g]);
            k++;
        }
        return fit.fit(pixel, pixelSigma, nm, lines.sigmasGiven() ? nmSigma : null, solution.medium());
    }

    /**
     * @param u     an undecided group
     * @param match the pairs
     * @param lines the lamp's lines
     * @param label each line's label
     * @return the note that says it was left out and why
     */
    static String note(Undecided u, LampMatch match, LampLines lines, java.util.function.IntFunction<String> label) {
        StringBuilder peaks = new StringBuilder();
        StringBuilder chosen = new StringBuilder();
        StringBuilder other = new StringBuilder();
        for (int g = 0; g < u.pairs().length; g++) {
            String sep = g == 0 ? "" : ", ";
            peaks.append(sep).append(String.format(Locale.ROOT, "%.1f", match.pixel(u.pairs()[g])));
            chosen.append(sep).append(label.apply(match.lineIndex(u.pairs()[g])));
            other.append(sep).append(label.apply(u.alternative()[g]));
        }
        return String.format(Locale.ROOT, "the %s at pixel%s %s pair%s as well with %s as with %s (chi-square %.3g"
                + " against %.3g: the other lines do not tell them apart), so %s left out and the solution is"
                + " extrapolated there; a lamp line between them and the rest, a second gas or a prior would decide",
                u.pairs().length == 1 ? "peak" : "peaks", u.pairs().length == 1 ? "" : "s", peaks,
                u.pairs().length == 1 ? "s" : "", other, chosen, u.altChiSquare(), u.chiSquare(),
                u.pairs().length == 1 ? "it is" : "they are");
    }
}
