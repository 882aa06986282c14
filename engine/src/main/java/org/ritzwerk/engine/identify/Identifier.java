package org.ritzwerk.engine.identify;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * Matches measured peaks to catalogued lines.
 *
 * <p><b>Candidates.</b> A line is a candidate for a peak when their vacuum wavelengths differ by
 * at most the {@link Tolerance}'s half-width h; a blend with declared components is seen at the
 * nearest of its centroid (unresolved) and the centroids of the groups of components that lie
 * more than h apart (resolved, as far as the peak's precision tells them apart), and its
 * residual r is taken from there ({@link LineCatalog#nearestPosition}). Peaks and lines are walked together
 * in wavelength order (a sorted merge), so finding every candidate costs O(N + M + candidates)
 * after sorting the peaks (skipped when they come sorted).
 *
 * <p><b>Score.</b> Each candidate gets the cost
 * {@code c = (r / s)^2 / 2 - w ln(S)}: the negative log-likelihood of the residual r against the
 * scoring uncertainty s (Gaussian), plus the negative log of the line's relative expected strength
 * S in (0, 1] weighted by w (default {@value #DEFAULT_STRENGTH_WEIGHT}, {@link #withStrengthWeight}; 0 ignores
 * strengths). The strength is a fair prior (w = 1) only where each line shows a peak about in proportion to
 * its strength, as near the detection limit; in a bright spectrum every line above the noise shows, weak
 * ones too, and the full prior then gave confident wrong labels: on crowded scenes where lines show as
 * 0.95 S^0.3, 1.43 % of unflagged peaks had the wrong line (w = 1/2: 0.57 %), and 0.76 % where every line
 * shows alike (0.46 %); where the prior is fair, w = 1/2 keeps 0.21 % (0.24 %) but flags more peaks, 1857
 * instead of 1561 of 2798 (IdentificationRulesTest). So the default tempers the prior: a line 100 times
 * stronger is favoured 10 to 1, not 100 to 1. When every peak states an
 * intensity I, a second pass adds {@code v (ln I - ln A - ln S)^2 / (2 t^2)}: the observed
 * intensity against the expected one, with the scale ln A and spread t (at least ln 3) taken
 * robustly (median and MAD) from the first pass's matches, weighted by v (default 1; 0 ignores
 * intensities). Lower is better.
 *
 * <p><b>Assignment.</b> Each peak explains at most one line and each ordinary line at most one
 * peak. Peaks that share candidate lines form a component; every component is solved exactly as
 * a minimum-cost assignment that first maximises the number of matched peaks (Hungarian method,
 * H. W. Kuhn, Naval Res. Logist. Q. 2, 83 (1955), with potentials; for an absolute tolerance a
 * dynamic programme over the non-crossing assignments, see below), except that a component of
 * more than {@link #MAX_EXACT_COMPONENT} peaks falls back to a greedy choice by cost, counted in
 * {@link Identification#greedyComponents()}. Small components take exact shortcuts: one peak
 * (its cheapest candidate), one line (its cheapest peak), two ordinary lines (the best pair of
 * distinct peaks, O(peaks)), and, without blends, lines spanning at most six indices (dynamic
 * programming over the set of lines taken, after dropping every peak whose only candidate line
 * has a cheaper such peak, which no optimum needs).
 *
 * <p><b>Blends.</b> A declared blend (an unresolved multiplet) may explain several peaks, but
 * only peaks it can explain together: the shortest and the longest of them, at x_a &lt;= x_b,
 * must satisfy {@code x_b - x_a <= D + h(x_a; sigma_a, sigma_b)}, where D is the blend's
 * spread (the span of its components' wavelengths, {@link LineCatalog#blendSpread}; 0 when not
 * declared) and h the tolerance's half-width applied to the difference of two positions
 * (absolute: the width; relative: the fraction times x_a; k-sigma:
 * {@code k sqrt(sigma_a^2 + sigma_b^2)}). Peaks further apart than that would need two
 * components further apart than the blend has, so the blend explains at most one group of
 * them and the rest compete for the other candidates. A component whose optimum breaks the
 * rule is solved again for each choice of the group's shortest peak a (the blend kept only for
 * peaks within reach of a), and the best of these is taken (exact; past
 * {@value Component#SOLVE_BUDGET} solves a component keeps each blend for the window of its
 * cheapest peak instead and counts as greedy).
 *
 * <p><b>Ambiguity.</b> With the cost c as the negative log of likelihood times prior, the
 * posterior probability of an assignment of the component is proportional to exp(-sum c)
 * (Bayes' rule; the Gaussian normalisation 1/s is left out, exact when a peak's candidates
 * share the scoring uncertainty, as under absolute and relative tolerances). A matched peak's
 * odds are those of the optimal assignment against the best assignment with as many matched
 * peaks in which the peak explains a different line: {@code odds = exp(C_runner-up - C_best)}.
 * The peak is ambiguous when the odds are below the threshold (default
 * {@value #DEFAULT_AMBIGUITY_ODDS} to 1, {@link #withAmbiguityOdds}): an unflagged peak's
 * line is at least 20 times as probable as its runner-up under the tempered prior (on seeded crowded
 * scenes, IdentificationRulesTest, under 1 % of unflagged peaks are wrong whether lines show in
 * proportion to their strength, as S^0.3, or alike). A peak alone in its component compares its two cheapest
 * candidates; otherwise the component is solved again with the peak barred from its line,
 * except where a bound settles it (no other peak wants the line: the alternative costs at
 * least the peak's own cost difference). The line the peak explains in that other assignment
 * and the odds are kept for the peaks they flag ({@link Identification#rival},
 * {@link Identification#rivalOdds}). A peak that has no other candidate is never
 * ambiguous; which of several peaks a line belongs to is not ambiguity (the others are left
 * unexplained). The catalogue holds only the species offered, so a peak from anything else (a
 * foreign gas, an impurity) takes the nearest line it finds: a peak matched to a line of a
 * species that has strong lines in the peaks' range but does not show them beyond chance (none
 * found, or no more than chance gives and fewer than a present species would show;
 * {@link Identification#speciesNotShown}) is flagged ambiguous too
 * ({@link Identification#AMBIGUOUS}). So is a matched peak that a stray peak explains about as
 * well as its line, at the density of stray peaks the unexplained peaks show
 * ({@link Identification#mayBeStray}). Foreign peaks that land close to a line of a species that
 * is present are not caught: the unflagged error rate grows with their share.
 *
 * <p>Immutable and thread-safe; no object is made per peak or candidate.
 */
public final class Identifier {

    /** Components with more peaks than this are assigned greedily. */
    public static final int MAX_EXACT_COMPONENT = 300;

    /** The default weight w of the strength prior: 1/2, a tempered prior (see the class comment). */
    public static final double DEFAULT_STRENGTH_WEIGHT = 0.5;

    /** The default posterior odds below which a matched peak is ambiguous: 20 to 1. */
    public static final double DEFAULT_AMBIGUITY_ODDS = 20;

    /** The cost of leaving a peak unmatched: above any real cost (at most a few hundred), small
     *  enough that the potentials keep their precision. */
    private static final double UNMATCHED = 1e6;

    private final Tolerance tolerance;
    private final double strengthWeight;
    /** ln of the ambiguity odds. */
    private final double logOdds;
    private final double strongLine;

    private final double intensityWeight;

    private Identifier(Tolerance tolerance, double strengthWeight, double logOdds, double strongLine,
            double intensityWeight) {
        this.tolerance = Objects.requireNonNull(tolerance, "tolerance");
        this.strengthWeight = strengthWeight;
        this.logOdds = logOdds;
        this.strongLine = strongLine;
        this.intensityWeight = intensityWeight;
    }

    /**
     * @param tolerance how far a peak may lie from its line
     * @return an identifier with strength weight 1/2, intensity weight 1, ambiguity odds 20 to 1
     *         and strong lines those with relative strength at least 0.3
     */
    public static Identifier of(Tolerance tolerance) {
        return new Identifier(tolerance, DEFAULT_STRENGTH_WEIGHT, Math.log(DEFAULT_AMBIGUITY_ODDS), 0.3, 1);
    }

    /**
     * @param weight w in the cost, finite and >= 0
     * @return a copy with that weight
     */
    public Identifier withStrengthWeight(double weight) {
        check("strength weight", weight);
        return new Identifier(tolerance, weight, logOdds, strongLine, intensityWeight);
    }

    /**
     * @param odds posterior odds of a peak's assignment against its runner-up below which the
     *             peak is ambiguous; finite and at least 1 (1 flags only exact ties)
     * @return a copy with that threshold
     */
    public Identifier withAmbiguityOdds(double odds) {
        if (!(odds >= 1) || Double.isInfinite(odds)) {
            throw new IllegalArgumentException("ambiguity odds must be finite and >= 1, got " + odds);
        }
        return new Identifier(tolerance, strengthWeight, Math.log(odds), strongLine, intensityWeight);
    }

    /** @return the posterior odds below which a matched peak is ambiguous */
    public double ambiguityOdds() {
        return Math.exp(logOdds);
    }

    /**
     * @param threshold relative strength from which a line counts as strong, in (0, 1]
     * @return a copy
     */
    public Identifier withStrongLineThreshold(double threshold) {
        if (!(threshold > 0 && threshold <= 1)) {
            throw new IllegalArgumentException("strong-line threshold must be in (0, 1], got " + threshold);
        }
        return new Identifier(tolerance, strengthWeight, logOdds, threshold, intensityWeight);
    }

    /**
     * @param weight v in the intensity term of the cost, finite and &gt;= 0 (0 ignores the
     *               observed intensities)
     * @return a copy with that weight
     */
    public Identifier withIntensityWeight(double weight) {
        check("intensity weight", weight);
        return new Identifier(tolerance, strengthWeight, logOdds, strongLine, weight);
    }

    private static void check(String what, double value) {
        if (!(value >= 0) || Double.isInfinite(value)) {
            throw new IllegalArgumentException(what + " must be finite and >= 0, got " + value);
        }
    }

    /** @return the tolerance */
    public Tolerance tolerance() {
        return tolerance;
    }

    /**
     * @param peaks the measured peaks
     * @param lines the candidate lines
     * @return the identification of every peak, in the peaks' order
     * @throws IdentificationException when a k-sigma tolerance meets peaks and lines that both
     *                                  lack uncertainties (the window would be empty), or two
     *                                  peaks lie at the same position
     */
    public Identification identify(PeakList peaks, LineCatalog lines) {
        Objects.requireNonNull(peaks, "peaks");
        Objects.requireNonNull(lines, "lines");
        double[] pw = peaks.wavelengths();
        double[] ps = peaks.sigmas();
        identifyChecks(peaks, lines);
        // Peaks usually come sorted; the pass checks that as it goes and, the first time a peak
        // is out of order, starts again over a sorted permutation.
        IntensityTerm none = IntensityTerm.NONE;
        Results results = new Results(peaks.size(), lines.size());
        int[] order = null;
        if (!run(peaks, lines, null, results, 0, peaks.size(), none)) {
            order = sortedOrder(pw);
            results = new Results(peaks.size(), lines.size());
            run(peaks, lines, order, results, 0, peaks.size(), none);
        }
        IntensityTerm term = IntensityTerm.from(peaks, lines, results.linePlusOne, intensityWeight);
        if (term != IntensityTerm.NONE) {
            results = new Results(peaks.size(), lines.size());
            run(peaks, lines, order, results, 0, peaks.size(), term);
        }
        return new Identification(peaks, lines, results, strongLine, tolerance, strengthWeight, term, logOdds);
    }

    /**
     * The intensity part of the cost: off when weight, intensities or matches are missing.
     *
     * @param weight v
     * @param scale  ln A, the median of ln I - ln S over the first matches
     * @param spread t, the robust spread of those differences, at least ln 3
     */
    record IntensityTerm(double weight, double scale, double spread) {

        static final IntensityTerm NONE = new IntensityTerm(0, 0, 1);

        double cost(double logIntensity, double negativeLogStrength) {
            if (weight == 0 || Double.isNaN(logIntensity)) {
                return 0;
            }
            double d = (logIntensity - scale + negativeLogStrength) / spread;
            return weight * 0.5 * d * d;
        }

        static IntensityTerm from(PeakList peaks, LineCatalog lines, int[] linePlusOne, double weight) {
            if (weight == 0 || Double.isNaN(peaks.intensity(0))) {
                return NONE;
            }
            double[] differences = new double[peaks.size()];
            int count = 0;
            for (int i = 0; i < peaks.size(); i++) {
                double intensity = peaks.intensity(i);
                if (Double.isNaN(intensity)) {
                    return NONE; // only when every peak states one
                }
                int j = linePlusOne[i] - 1;
                if (j >= 0 && intensity > 0) {
                    differences[count++] = Math.log(intensity) + lines.negativeLogStrengths()[j];
                }
            }
            if (count < 3) {
                return NONE;
            }
            double[] sorted = Arrays.copyOf(differences, count);
            Arrays.sort(sorted);
            double median = sorted[count / 2];
            for (int k = 0; k < count; k++) {
                sorted[k] = Math.abs(sorted[k] - median);
            }
            Arrays.sort(sorted);
            double spread = Math.max(1.4826 * sorted[count / 2], Math.log(3));
            return new IntensityTerm(weight, median, spread);
        }
    }

    /**
     * The same identification as {@link #identify}, bit for bit, computed on several threads:
     * the sorted peaks are cut where no line can be a candidate of peaks on both sides, and the
     * parts run in parallel on the common fork-join pool.
     *
     * @param peaks the measured peaks
     * @param lines the candidate lines
     * @param parts how many parts to aim for (e.g. the number of cores), at least 1
     * @return the identification, equal to {@link #identify}'s
     * @throws IdentificationException as {@link #identify}
     */
    public Identification identifyInParallel(PeakList peaks, LineCatalog lines, int parts) {
        if (parts < 1) {
            throw new IllegalArgumentException("parts must be at least 1, got " + parts);
        }
        identifyChecks(peaks, lines);
        double[] pw = peaks.wavelengths();
        double[] ps = peaks.sigmas();
        int n = peaks.size();
        int[] order = sortedOrder(pw);
        refuseRepeatedPositions(pw, order);
        List<Integer> cuts = new ArrayList<>();
        cuts.add(0);
        for (int part = 1; part < parts; part++) {
            int k = Math.max((int) ((long) n * part / parts), cuts.get(cuts.size() - 1) + 1);
            for (; k < n; k++) {
                int a = order == null ? k - 1 : order[k - 1];
                int b = order == null ? k : order[k];
                double reachA = tolerance.halfWidth(pw[a], ps[a], lines.maxSigma()) + lines.partsBelow();
                double reachB = tolerance.halfWidth(pw[b], ps[b], lines.maxSigma()) + lines.partsAbove();
                if (pw[b] - reachB > pw[a] + reachA) {
                    break; // no line can lie within reach of both
                }
            }
            if (k < n) {
                cuts.add(k);
            }
        }
        cuts.add(n);
        Results first = new Results(n, lines.size());
        java.util.stream.IntStream.range(0, cuts.size() - 1).parallel()
                .forEach(c -> run(peaks, lines, order, first, cuts.get(c), cuts.get(c + 1), IntensityTerm.NONE));
        IntensityTerm term = IntensityTerm.from(peaks, lines, first.linePlusOne, intensityWeight);
        Results results = term == IntensityTerm.NONE ? first : new Results(n, lines.size());
        if (term != IntensityTerm.NONE) {
            java.util.stream.IntStream.range(0, cuts.size() - 1).parallel()
                    .forEach(c -> run(peaks, lines, order, results, cuts.get(c), cuts.get(c + 1), term));
        }
        return new Identification(peaks, lines, results, strongLine, tolerance, strengthWeight, term, logOdds);
    }

    /**
     * One pass in wavelength order: the candidates of each peak come from a sorted merge; peaks
     * that share candidate lines gather in a small component buffer, which is solved and written
     * out as soon as the next peak cannot share a line with it.
     *
     * @param order   the sorted permutation of the peaks, or null to take them as given
     * @param results where to write, shared by parts that never share a line
     * @param from    first sorted position of this part
     * @param to      end of this part (exclusive)
     * @param term    the intensity part of the cost
     * @return false when order is null and the peaks turn out unsorted (results then partial)
     */
    private boolean run(PeakList peaks, LineCatalog lines, int[] order, Results results, int from, int to,
            IntensityTerm term) {
        int m = lines.size();
        double[] pw = peaks.wavelengths();
        double[] ps = peaks.sigmas();
        double[] lw = lines.wavelengths();
        Component component = new Component(lines.blends(), lines.blendSpreads(), tolerance);
        double[] penalty = lines.negativeLogStrengths();
        boolean exactReach = tolerance.kind() != Tolerance.Kind.K_SIGMA;
        int lo = 0;
        double w = strengthWeight;
        boolean fixed = tolerance.kind() == Tolerance.Kind.ABSOLUTE;
        double fixedReach = fixed ? tolerance.value() : 0;
        double fixedInverse = fixed ? 1 / tolerance.scoringSigma(1, 0, 0) : 0;
        double maxLineSigma = lines.maxSigma();
        boolean withIntensity = term.weight() != 0;
        // Blends with declared components are seen at their nearest component too: the window
        // over the lines' own wavelengths widens by the farthest component on either side.
        double below = lines.partsBelow();
        double above = lines.partsAbove();
        boolean withParts = below > 0 || above > 0;
        double previous = Double.NEGATIVE_INFINITY;
        if (from > 0) {
            int first = order == null ? from : order[from];
            lo = lowerBound(lw, pw[first] - tolerance.halfWidth(pw[first], ps[first], maxLineSigma) - above);
        }
        int previousPeak = -1;
        for (int k = from; k < to; k++) {
            int i = order == null ? k : order[k];
            double x = pw[i];
            if (x <= previous) {
                if (x == previous) {
                    throw repeatedPeak(previousPeak, i, x);
                }
                return false;
            }
            previous = x;
            previousPeak = i;
            // An absolute tolerance needs no uncertainties: not reading them saves memory traffic.
            double sigma = fixed ? 0 : ps[i];
            // For absolute and relative tolerances the window and scoring width depend on the
            // peak alone (for absolute ones not even on that), so the inner loop needs no
            // per-line work beyond the cost.
            double reach = fixed ? fixedReach : tolerance.halfWidth(x, sigma, maxLineSigma);
            double inverse = fixed ? fixedInverse : exactReach ? 1 / tolerance.scoringSigma(x, sigma, 0) : 0;
            double logIntensity = withIntensity ? Math.log(peaks.intensity(i)) : Double.NaN;
            while (lo < m && lw[lo] < x - reach - above) {
                lo++;
            }
            int firstLine = -1;
            int before = component.size;
            for (int j = lo; j < m && lw[j] <= x + reach + below; j++) {
                // (a blend's groups part at the tolerance of this peak and this line)
                double r = x - (withParts ? lines.nearestPosition(j, x, exactReach ? reach
                        : tolerance.halfWidth(x, sigma, lines.sigma(j))) : lw[j]);
                double z;
                if (withParts && exactReach && Math.abs(r) > reach) {
                    continue;
                }
                if (exactReach) {
                    z = r * inverse;
                } else {
                    double lineSigma = lines.sigma(j);
                    if (Math.abs(r) > tolerance.halfWidth(x, sigma, lineSigma)) {
                        continue;
                    }
                    double s = tolerance.scoringSigma(x, sigma, lineSigma);
                    z = s > 0 ? r / s : 0;
                }
                if (firstLine < 0) {
                    firstLine = j;
                    // (with components, only once no line of the open component can reach this peak)
                    if (component.peaks > 0 && j > component.maxLine
                            && (!withParts || lw[component.maxLine] + above < x - reach)) {
                        finish(component, results, pw, ps, order);
                        before = 0;
                    }
                }
                double c = 0.5 * z * z + w * penalty[j];
                component.addCandidate(j, withIntensity ? c + term.cost(logIntensity, penalty[j]) : c);
            }
            if (firstLine >= 0) {
                component.closePeak(k, before);
            }
            // A peak without candidates leaves the open component open: the peaks on either
            // side of it may still share a line; its result is the default, unexplained.
        }
        if (component.peaks > 0) {
            finish(component, results, pw, ps, order);
        }
        return true;
    }

    /** How many single steps {@link #lowerBound(double[], double, int)} takes before it halves instead. */
    private static final int GUESS_STEPS = 8;

    /**
     * As {@link #lowerBound(double[], double)}, walking from a guess instead of halving: the same
     * index, found in a few steps when the guess lies near it, as for keys that rise slowly from
     * call to call. (A binary search's branches are unpredictable; in the presence figures, one
     * search per line in range of each peak list, they took a fifth of the time.)
     *
     * @param guess an index from 0 to sorted.length, such as the last call's answer
     * @return the first index whose value is not below key; a guess more than a few steps off
     *         falls back to the binary search
     */
    static int lowerBound(double[] sorted, double key, int guess) {
        int i = Math.max(0, Math.min(guess, sorted.length));
        for (int step = 0; step < GUESS_STEPS; step++) {
            if (i < sorted.length && sorted[i] < key) {
                i++;
            } else if (i > 0 && !(sorted[i - 1] < key)) {
                i--;
            } else {
                return i;
            }
        }
        return lowerBound(sorted, key);
    }

    /** @return the first index whose value is not below key (sorted ascending) */
    static int lowerBound(double[] sorted, double key) {
        int lo = 0;
        int hi = sorted.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] < key) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** Solves the buffered component, writes its peaks' results and empties the buffer. */
    private void finish(Component c, Results results, double[] pw, double[] ps, int[] order) {
        if (c.peaks == 1) {
            // One peak: its cheapest candidate; the posterior odds against the runner-up are
            // exp(cost difference).
            int k = c.peakOrder[0];
            int i = order == null ? k : order[k];
            int best = 0;
            for (int q = 1; q < c.size; q++) {
                if (c.cost[q] < c.cost[best]) {
                    best = q;
                }
            }
            int runnerUp = -1;
            double second = Double.POSITIVE_INFINITY;
            for (int q = 0; q < c.size; q++) {
                if (q != best && c.cost[q] < second) {
                    second = c.cost[q];
                    runnerUp = c.line[q];
                }
            }
            int j = c.line[best];
            results.used[j] = true;
            results.write(i, j, runnerUp, second - c.cost[best], logOdds);
            c.clear();
            return;
        }
        if (c.minLine == c.maxLine && !c.isBlend(c.minLine)) {
            // One ordinary line wanted by several peaks: the cheapest peak takes it. No peak has
            // another line to turn to, so the one matched is not ambiguous between lines.
            int best = 0;
            for (int q = 1; q < c.size; q++) {
                if (c.cost[q] < c.cost[best]) {
                    best = q;
                }
            }
            int k = c.peakOrder[c.peakOf(best)];
            int i = order == null ? k : order[k];
            results.used[c.minLine] = true;
            results.linePlusOne[i] = c.minLine + 1;
            c.clear();
            return;
        }
        if (c.blend == null && c.maxLine == c.minLine + 1) {
            c.twoLines(results, order, logOdds);
            c.clear();
            return;
        }
        if (c.blend != null) {
            c.prepare(pw, ps, order);
        } else {
            c.pruneSingleCandidatePeaks();
        }
        c.solves = 0;
        c.inexact = false;
        c.solve(false);
        if (c.inexact) {
            results.greedy.incrementAndGet();
        }
        double optimum = c.objective();
        int[] chosen = c.optimal();
        for (int p = 0; p < c.peaks; p++) {
            int k = c.peakOrder[p];
            int i = order == null ? k : order[k];
            int j = chosen[p];
            if (j < 0) {
                continue;
            }
            results.used[j] = true;
            double odds = c.logOddsAgainstRunnerUp(p, j, chosen, optimum, logOdds);
            results.write(i, j, c.rival, odds, logOdds);
        }
        c.clear();
    }

    /**
     * The output columns, in the peaks' order, and nothing written for an unexplained peak: the
     * line plus one (0 for none), negative when the match is ambiguous by the posterior odds; and
     * for such a peak its rival (the line it explains in the best other assignment) plus one and
     * the log odds against it, in two columns made at the first such peak (most scenes have few or
     * none, so that four bytes a peak remain the rule; 16 with them). Residuals, costs and the
     * cheapest other candidates are derived on request.
     */
    static final class Results {
        final int[] linePlusOne;
        final boolean[] used;
        final java.util.concurrent.atomic.AtomicInteger greedy = new java.util.concurrent.atomic.AtomicInteger();
        private final int n;
        /**
         * The rival line plus one where the peak is ambiguous by the odds, else 0; null until the
         * first such peak. Written last when made, so that a thread that sees it sees
         * {@link #rivalLogOdds} too (parts of a parallel run write disjoint peaks).
         */
        private volatile int[] rivalPlusOne;
        /** ln of the odds against the rival where the peak is ambiguous by the odds, else 0; as above. */
        private double[] rivalLogOdds;

        Results(int n, int m) {
            this.n = n;
            linePlusOne = new int[n];
            used = new boolean[m];
        }

        /**
         * Writes peak i's line j: ambiguous, with its rival and log odds kept, when the odds
         * against the rival are below the threshold.
         */
        void write(int i, int j, int rival, double odds, double threshold) {
            boolean ambiguous = odds < threshold;
            linePlusOne[i] = ambiguous ? -(j + 1) : j + 1;
            if (ambiguous) {
                int[] rivals = rivals();
                rivals[i] = rival + 1;
                rivalLogOdds[i] = odds;
            }
        }

        private int[] rivals() {
            int[] rivals = rivalPlusOne;
            if (rivals == null) {
                synchronized (this) {
                    rivals = rivalPlusOne;
                    if (rivals == null) {
                        rivalLogOdds = new double[n];
                        rivals = new int[n];
                        rivalPlusOne = rivals;
                    }
                }
            }
            return rivals;
        }

        /** @return the rivals' column, null when no peak is ambiguous by the odds */
        int[] rivalPlusOne() {
            return rivalPlusOne;
        }

        /** @return the log odds' column, null when no peak is ambiguous by the odds */
        double[] rivalLogOdds() {
            return rivalLogOdds;
        }

        void unexplained(int i) {
            // The defaults already say so.
        }
    }

    /**
     * The peaks of one component and their candidates, reused from one component to the next:
     * candidates of the p-th peak are {@code line/cost[start[p] .. start[p+1])}. A candidate is
     * switched off for a re-solve by setting its cost to {@link #OFF}.
     */
    private static final class Component {
        /** The cost of a candidate that a re-solve may not use. */
        static final double OFF = Double.POSITIVE_INFINITY;
        /** Re-solves allowed per component for the blend rule before it falls back to a greedy repair. */
        static final int SOLVE_BUDGET = 256;

        /** The catalog's blend flags, or null when there is no blend. */
        final boolean[] blend;
        /** The catalog's blend spreads, metres. */
        private final double[] spread;
        private final Tolerance tolerance;

        Component(boolean[] blend, double[] spread, Tolerance tolerance) {
            this.blend = blend;
            this.spread = spread;
            this.tolerance = tolerance;
        }

        boolean isBlend(int j) {
            return blend != null && blend[j];
        }

        /** For each peak the cheapest blended candidate (line, or -1) and its cost. */
        private int[] blendLine = new int[16];
        private double[] blendCost = new double[16];

        /** Fills blendLine and blendCost for the peaks of the component. */
        private void cheapestBlends() {
            if (blendLine.length < peaks) {
                blendLine = new int[2 * peaks];
                blendCost = new double[2 * peaks];
            }
            for (int p = 0; p < peaks; p++) {
                blendLine[p] = -1;
                blendCost[p] = Double.POSITIVE_INFINITY;
                if (blend == null) {
                    continue;
                }
                for (int q = start[p]; q < start[p + 1]; q++) {
                    if (blend[line[q]] && cost[q] < blendCost[p]) {
                        blendCost[p] = cost[q];
                        blendLine[p] = line[q];
                    }
                }
            }
        }

        int[] peakOrder = new int[16];
        int[] start = new int[17];
        int[] chosen = new int[16];
        int[] line = new int[64];
        double[] cost = new double[64];
        /** Position and uncertainty of each peak of the component (metres), set by {@link #prepare}. */
        double[] x = new double[16];
        double[] sigma = new double[16];
        int peaks;
        int size;
        int maxLine = -1;
        int minLine = Integer.MAX_VALUE;
        int solves;
        boolean inexact;
        private final Assignment solver = new Assignment();

        void addCandidate(int j, double c) {
            if (size == line.length) {
                line = Arrays.copyOf(line, 2 * size);
                cost = Arrays.copyOf(cost, 2 * size);
            }
            line[size] = j;
            cost[size] = c;
            size++;
            maxLine = Math.max(maxLine, j);
            minLine = Math.min(minLine, j);
        }

        /** Ends the candidates of the peak at sorted position k, whose first candidate is at {@code from}. */
        void closePeak(int k, int from) {
            if (peaks + 1 >= peakOrder.length) {
                peakOrder = Arrays.copyOf(peakOrder, 2 * peakOrder.length);
                start = Arrays.copyOf(start, 2 * start.length);
                chosen = Arrays.copyOf(chosen, 2 * chosen.length);
            }
            peakOrder[peaks] = k;
            start[peaks] = from;
            peaks++;
            start[peaks] = size;
        }

        void clear() {
            peaks = 0;
            size = 0;
            maxLine = -1;
            minLine = Integer.MAX_VALUE;
        }

        private double[] first = new double[16];
        private double[] second = new double[16];

        /**
         * The exact assignment and posterior odds of a component of two ordinary lines, in
         * O(peaks): with two or more peaks able to take them, the best pair of distinct peaks;
         * else the cheapest single match. A matched peak's runner-up explains the other line,
         * its own line going to the best other peak when the pair must stay matched.
         */
        void twoLines(Results results, int[] order, double logOdds) {
            if (first.length < peaks) {
                first = new double[2 * peaks];
                second = new double[2 * peaks];
            }
            int best0 = -1;
            int next0 = -1;
            int best1 = -1;
            int next1 = -1;
            for (int p = 0; p < peaks; p++) {
                first[p] = Double.POSITIVE_INFINITY;
                second[p] = Double.POSITIVE_INFINITY;
                for (int q = start[p]; q < start[p + 1]; q++) {
                    if (line[q] == minLine) {
                        first[p] = cost[q];
                    } else {
                        second[p] = cost[q];
                    }
                }
                if (first[p] < Double.POSITIVE_INFINITY) {
                    if (best0 < 0 || first[p] < first[best0]) {
                        next0 = best0;
                        best0 = p;
                    } else if (next0 < 0 || first[p] < first[next0]) {
                        next0 = p;
                    }
                }
                if (second[p] < Double.POSITIVE_INFINITY) {
                    if (best1 < 0 || second[p] < second[best1]) {
                        next1 = best1;
                        best1 = p;
                    } else if (next1 < 0 || second[p] < second[next1]) {
                        next1 = p;
                    }
                }
            }
            int a = -1;
            int b = -1;
            if (best0 >= 0 && best1 >= 0) {
                if (best0 != best1) {
                    a = best0;
                    b = best1;
                } else {
                    double viaNext1 = next1 < 0 ? Double.POSITIVE_INFINITY : first[best0] + second[next1];
                    double viaNext0 = next0 < 0 ? Double.POSITIVE_INFINITY : first[next0] + second[best1];
                    if (viaNext1 <= viaNext0 && next1 >= 0) {
                        a = best0;
                        b = next1;
                    } else if (next0 >= 0) {
                        a = next0;
                        b = best1;
                    }
                }
            }
            if (a >= 0 && b >= 0) {
                // Both lines matched. Runner-up of a: a explains the second line, the first goes
                // to the best peak other than a (the pair stays matched).
                double aAlternative = second[a] + (a == best0 ? (next0 < 0 ? Double.POSITIVE_INFINITY : first[next0])
                        : first[best0]);
                double bAlternative = first[b] + (b == best1 ? (next1 < 0 ? Double.POSITIVE_INFINITY : second[next1])
                        : second[best1]);
                double optimum = first[a] + second[b];
                write(results, order, a, minLine, maxLine, aAlternative - optimum, logOdds);
                write(results, order, b, maxLine, minLine, bAlternative - optimum, logOdds);
                return;
            }
            // One match: the cheapest candidate of any peak; its runner-up is its other line.
            int p = best0;
            boolean onFirst = true;
            if (best1 >= 0 && (best0 < 0 || second[best1] < first[best0])) {
                p = best1;
                onFirst = false;
            }
            double own = onFirst ? first[p] : second[p];
            double other = onFirst ? second[p] : first[p];
            write(results, order, p, onFirst ? minLine : maxLine, onFirst ? maxLine : minLine, other - own, logOdds);
        }

        private void write(Results results, int[] order, int p, int j, int rival, double odds, double threshold) {
            int k = peakOrder[p];
            int i = order == null ? k : order[k];
            results.used[j] = true;
            results.write(i, j, rival, odds, threshold);
        }

        private int[] cheapestSingle = new int[16];

        /**
         * Among the peaks whose only candidate is the same ordinary line, only the cheapest can
         * be in an optimal assignment, or in the best one with any peak barred from any line
         * (swapping it for another such peak never costs more and keeps the count): the others'
         * candidates are switched off, so that the solves see fewer peaks. Without blends only.
         */
        void pruneSingleCandidatePeaks() {
            int span = maxLine - minLine + 1;
            if (cheapestSingle.length < span) {
                cheapestSingle = new int[Math.max(2 * cheapestSingle.length, span)];
            }
            Arrays.fill(cheapestSingle, 0, span, -1);
            for (int p = 0; p < peaks; p++) {
                if (start[p + 1] - start[p] == 1) {
                    int q = start[p];
                    int l = line[q] - minLine;
                    int held = cheapestSingle[l];
                    if (held < 0 || cost[q] < cost[held]) {
                        if (held >= 0) {
                            cost[held] = OFF;
                        }
                        cheapestSingle[l] = q;
                    } else {
                        cost[q] = OFF;
                    }
                }
            }
        }

        /** Reads the positions and uncertainties of the component's peaks. */
        void prepare(double[] pw, double[] ps, int[] order) {
            if (x.length < peaks) {
                x = new double[2 * peaks];
                sigma = new double[2 * peaks];
            }
            for (int p = 0; p < peaks; p++) {
                int i = order == null ? peakOrder[p] : order[peakOrder[p]];
                x[p] = pw[i];
                sigma[p] = ps[i];
            }
        }

        /**
         * Solves the component into {@link #chosen}: the most matches at the least cost, with no
         * blend given peaks it cannot explain together.
         *
         * @param modified whether some costs were changed (switched off or lowered), which rules
         *                 out the non-crossing shortcut
         */
        void solve(boolean modified) {
            solveOnce(modified);
            if (blend == null) {
                return;
            }
            int b = violatedBlend();
            if (b < 0) {
                return;
            }
            if (solves >= SOLVE_BUDGET) {
                repairGreedily();
                return;
            }
            // Branch: the peaks that blend b explains together have some shortest peak a, and
            // all of them lie within b's reach of it. Try every a, keep the best.
            double bestObjective = Double.POSITIVE_INFINITY;
            int[] best = null;
            double[] saved = Arrays.copyOf(cost, size);
            for (int a = 0; a < peaks; a++) {
                if (candidate(a, b) < 0) {
                    continue;
                }
                int off = 0;
                for (int p = 0; p < peaks; p++) {
                    int q = candidate(p, b);
                    if (q >= 0 && cost[q] != OFF && !(p >= a && together(b, a, p))) {
                        cost[q] = OFF;
                        off++;
                    }
                }
                if (off > 0) {
                    solves++;
                    solve(true);
                    double objective = objective();
                    if (objective < bestObjective) {
                        bestObjective = objective;
                        best = Arrays.copyOf(chosen, peaks);
                    }
                }
                System.arraycopy(saved, 0, cost, 0, size);
            }
            if (best == null) {
                repairGreedily();
            } else {
                System.arraycopy(best, 0, chosen, 0, peaks);
            }
        }

        /** Past the budget: keep each overfull blend for the window of its cheapest peak, then re-solve. */
        private void repairGreedily() {
            inexact = true;
            double[] saved = Arrays.copyOf(cost, size);
            for (int b = violatedBlend(); b >= 0; b = violatedBlend()) {
                int a = -1;
                for (int p = 0; p < peaks; p++) {
                    if (chosen[p] == b && (a < 0 || cost[candidate(p, b)] < cost[candidate(a, b)])) {
                        a = p;
                    }
                }
                int off = 0;
                for (int p = 0; p < peaks; p++) {
                    int q = candidate(p, b);
                    if (q >= 0 && cost[q] != OFF && !(p == a || together(b, Math.min(a, p), Math.max(a, p)))) {
                        cost[q] = OFF;
                        off++;
                    }
                }
                if (off == 0) {
                    break; // cannot happen: the violating pair includes a peak away from a
                }
                solveOnce(true);
            }
            System.arraycopy(saved, 0, cost, 0, size);
        }

        /**
         * @return whether blend b can explain peaks p &lt;= r together: their separation is at
         *         most b's spread plus the tolerance of a difference of two positions
         */
        private boolean together(int b, int p, int r) {
            return x[r] - x[p] <= spread[b] + tolerance.halfWidth(x[p], sigma[p], sigma[r]);
        }

        /** @return a blend whose shortest and longest peaks it cannot explain together, or -1 */
        private int violatedBlend() {
            for (int p = 0; p < peaks; p++) {
                int b = chosen[p];
                if (b < 0 || !isBlend(b)) {
                    continue;
                }
                int last = p;
                for (int r = p + 1; r < peaks; r++) {
                    last = chosen[r] == b ? r : last;
                }
                if (last > p && !together(b, p, last)) {
                    return b;
                }
            }
            return -1;
        }

        /** @return the candidate index of line j for peak p, or -1 */
        int candidate(int p, int j) {
            for (int q = start[p]; q < start[p + 1]; q++) {
                if (line[q] == j) {
                    return q;
                }
            }
            return -1;
        }

        /** @return the sum over matched peaks of (cost - UNMATCHED) under the current costs */
        double objective() {
            double sum = 0;
            for (int p = 0; p < peaks; p++) {
                if (chosen[p] >= 0) {
                    sum += cost[candidate(p, chosen[p])] - UNMATCHED;
                }
            }
            return sum;
        }

        private int[] optimal = new int[16];
        private double[] savedCost = new double[64];

        /** @return a copy of {@link #chosen} in a buffer reused between components */
        int[] optimal() {
            if (optimal.length < peaks) {
                optimal = new int[2 * peaks];
            }
            System.arraycopy(chosen, 0, optimal, 0, peaks);
            return optimal;
        }

        /** Lines a component may span for {@link #solveBySubsets}. */
        static final int SUBSET_LINES = 4;

        private double[] subsetCost = new double[0];
        private int[] subsetChoice = new int[0];

        /**
         * The exact assignment of a component without blends whose lines span at most
         * {@value #SUBSET_LINES} indices, by dynamic programming over the peaks and the set of
         * lines already taken (common practice): O(peaks x 2^lines x candidates), for any costs.
         */
        private void solveBySubsets() {
            int span = maxLine - minLine + 1;
            int states = 1 << span;
            int cells = (peaks + 1) * states;
            if (subsetCost.length < cells) {
                subsetCost = new double[2 * cells];
                subsetChoice = new int[2 * cells];
            }
            // Row p holds the least cost of peaks 0..p-1 for each set of lines taken (+infinity
            // when unreachable); row p+1 starts as row p (peak p unmatched), then each candidate
            // of peak p relaxes the sets without its line.
            double[] table = subsetCost;
            int[] choice = subsetChoice;
            table[0] = 0;
            for (int mask = 1; mask < states; mask++) {
                table[mask] = Double.POSITIVE_INFINITY;
            }
            for (int p = 0; p < peaks; p++) {
                int from = p * states;
                int to = from + states;
                // (plain loops: the rows are a few elements long)
                for (int mask = 0; mask < states; mask++) {
                    table[to + mask] = table[from + mask];
                    choice[to + mask] = -1;
                }
                for (int q = start[p]; q < start[p + 1]; q++) {
                    if (cost[q] == OFF) {
                        continue;
                    }
                    int bit = 1 << (line[q] - minLine);
                    double value = cost[q] - UNMATCHED;
                    for (int mask = 0; mask < states; mask++) {
                        if ((mask & bit) == 0) {
                            double candidate = table[from + mask] + value;
                            if (candidate < table[to + (mask | bit)]) {
                                table[to + (mask | bit)] = candidate;
                                choice[to + (mask | bit)] = q;
                            }
                        }
                    }
                }
            }
            int last = peaks * states;
            int mask = 0;
            for (int m = 1; m < states; m++) {
                if (table[last + m] < table[last + mask]) {
                    mask = m;
                }
            }
            for (int p = peaks; p > 0; p--) {
                int q = choice[p * states + mask];
                if (q < 0) {
                    chosen[p - 1] = -1;
                } else {
                    chosen[p - 1] = line[q];
                    mask &= ~(1 << (line[q] - minLine));
                }
            }
        }

        private void solveOnce(boolean modified) {
            if (eachPeakBestDistinct()) {
                // Every peak matched to its own cheapest line: the most matches at the least cost.
            } else if (blend == null && maxLine - minLine < SUBSET_LINES && peaks <= 64) {
                solveBySubsets();
            } else if (!modified && peaks <= MAX_EXACT_COMPONENT && tolerance.kind() == Tolerance.Kind.ABSOLUTE) {
                solveNonCrossing();
            } else if (peaks <= MAX_EXACT_COMPONENT) {
                solver.solve(this);
            } else {
                inexact = true;
                solveGreedily();
            }
        }

        /**
         * The log posterior odds of peak p's assignment to line j against the best assignment
         * of the component in which p explains another line (ln of the ratio of the two
         * assignments' likelihood-times-prior products, i.e. their cost difference).
         *
         * @param chosen  the optimal assignment
         * @param optimum its objective
         * @param enough  log odds above which the exact value is not needed
         * @return the log odds, +infinity when p has no other line it could explain with as many
         *         peaks matched; the line p explains in that other assignment is left in
         *         {@link #rival} (-1 when none)
         */
        double logOddsAgainstRunnerUp(int p, int j, int[] chosen, double optimum, double enough) {
            rival = -1;
            double local = Double.POSITIVE_INFINITY;
            int localLine = -1;
            double own = cost[candidate(p, j)];
            boolean anyBlend = isBlend(j);
            for (int q = start[p]; q < start[p + 1]; q++) {
                if (line[q] != j) {
                    anyBlend |= isBlend(line[q]);
                    if (cost[q] - own < local) {
                        local = cost[q] - own;
                        localLine = line[q];
                    }
                }
            }
            if (localLine < 0) {
                return Double.POSITIVE_INFINITY;
            }
            if (!anyBlend && !sharedWithOthers(p, j)) {
                // Nobody else wants j, so moving p to another line j' cannot help the others:
                // every alternative costs at least its own difference, and exactly that when j'
                // was free.
                if (local >= enough || !usedByOthers(localLine, p, chosen)) {
                    rival = localLine;
                    return local;
                }
            }
            // Re-solve with p barred from j and kept matched (its other candidates made cheaper
            // by 2 UNMATCHED, more than any other peak's match is worth).
            if (savedCost.length < size) {
                savedCost = new double[2 * size];
            }
            System.arraycopy(cost, start[p], savedCost, start[p], start[p + 1] - start[p]);
            for (int q = start[p]; q < start[p + 1]; q++) {
                cost[q] = line[q] == j ? OFF : cost[q] - 2 * UNMATCHED;
            }
            solve(true);
            double alternative = objective() + (this.chosen[p] >= 0 ? 2 * UNMATCHED : 0);
            rival = this.chosen[p];
            System.arraycopy(savedCost, start[p], cost, start[p], start[p + 1] - start[p]);
            return alternative - optimum;
        }

        /** The line of the last {@link #logOddsAgainstRunnerUp}'s other assignment, or -1. */
        int rival = -1;

        private boolean sharedWithOthers(int p, int j) {
            for (int r = 0; r < peaks; r++) {
                int q = r == p ? -1 : candidate(r, j);
                if (q >= 0 && cost[q] != OFF) {
                    return true;
                }
            }
            return false;
        }

        private boolean usedByOthers(int j, int p, int[] chosen) {
            for (int r = 0; r < peaks; r++) {
                if (r != p && chosen[r] == j) {
                    return true;
                }
            }
            return false;
        }

        /**
         * Gives each peak its cheapest candidate.
         *
         * @return whether those lines are all different, in which case this is the optimal assignment
         */
        boolean eachPeakBestDistinct() {
            for (int p = 0; p < peaks; p++) {
                int best = -1;
                double bestCost = Double.POSITIVE_INFINITY;
                for (int q = start[p]; q < start[p + 1]; q++) {
                    if (cost[q] < bestCost) {
                        bestCost = cost[q];
                        best = line[q];
                    }
                }
                chosen[p] = best;
            }
            for (int p = 0; p < peaks; p++) {
                for (int r = p + 1; r < peaks; r++) {
                    if (chosen[p] >= 0 && chosen[p] == chosen[r] && !isBlend(chosen[p])) {
                        return false;
                    }
                }
            }
            return true;
        }

        private double[] table = new double[0];

        /**
         * The exact assignment when the cost is a convex function of the distance plus a
         * per-line term and every peak's candidates are a run of lines that moves up with the
         * peaks (an absolute tolerance): such costs are Monge, so some optimal assignment never
         * crosses, and dynamic programming over peaks and lines in order finds it in
         * O(peaks x lines) (A. J. Hoffman, Proc. Symp. Pure Math. 7, 317 (1963); common practice).
         */
        void solveNonCrossing() {
            int lineMin = minLine;
            int lines = maxLine - lineMin + 1;
            int width = lines + 1;
            if (table.length < (peaks + 1) * width) {
                table = new double[Math.max((peaks + 1) * width, 2 * table.length)];
            }
            // table[p][l]: least cost of the first p peaks and first l lines, a match costing
            // (its cost - UNMATCHED) so that more matches always win. Blended lines may serve
            // any number of peaks, so they are no column here: a peak that takes none of the
            // ordinary lines takes its cheapest blend, if it has one (the "skip" cost); the
            // blend rule is checked afterwards.
            cheapestBlends();
            for (int l = 0; l <= lines; l++) {
                table[l] = 0;
            }
            for (int p = 1; p <= peaks; p++) {
                int row = p * width;
                double skip = blendLine[p - 1] >= 0 ? blendCost[p - 1] - UNMATCHED : 0;
                table[row] = table[row - width] + skip;
                int q = start[p - 1];
                int qEnd = start[p];
                for (int l = 1; l <= lines; l++) {
                    double best = Math.min(table[row - width + l] + skip, table[row + l - 1]);
                    while (q < qEnd && line[q] - lineMin < l - 1) {
                        q++;
                    }
                    if (q < qEnd && line[q] - lineMin == l - 1 && !isBlend(line[q])) {
                        best = Math.min(best, table[row - width + l - 1] + cost[q] - UNMATCHED);
                    }
                    table[row + l] = best;
                }
            }
            // Walk back to read the matches.
            int p = peaks;
            int l = lines;
            Arrays.fill(chosen, 0, peaks, -1);
            while (p > 0) {
                int row = p * width;
                double here = table[row + l];
                double skip = blendLine[p - 1] >= 0 ? blendCost[p - 1] - UNMATCHED : 0;
                if (here == table[row - width + l] + skip) {
                    chosen[p - 1] = blendLine[p - 1];
                    p--;
                } else if (l > 0 && here == table[row + l - 1]) {
                    l--;
                } else {
                    chosen[p - 1] = lineMin + l - 1;
                    p--;
                    l--;
                }
            }
        }

        void solveGreedily() {
            Integer[] byCost = new Integer[size];
            for (int q = 0; q < size; q++) {
                byCost[q] = q;
            }
            Arrays.sort(byCost, (a, b) -> Double.compare(cost[a], cost[b]));
            Arrays.fill(chosen, 0, peaks, -1);
            java.util.Set<Integer> taken = new java.util.HashSet<>();
            for (int q : byCost) {
                int p = peakOf(q);
                if (cost[q] != OFF && chosen[p] < 0 && (isBlend(line[q]) || taken.add(line[q]))) {
                    chosen[p] = line[q];
                }
            }
        }

        int peakOf(int candidate) {
            int lo = 0;
            int hi = peaks - 1;
            while (lo < hi) {
                int mid = (lo + hi + 1) >>> 1;
                if (start[mid] <= candidate) {
                    lo = mid;
                } else {
                    hi = mid - 1;
                }
            }
            return lo;
        }
    }

    private void identifyChecks(PeakList peaks, LineCatalog lines) {
        if (tolerance.kind() == Tolerance.Kind.K_SIGMA && lines.maxSigma() == 0) {
            if (!anyPositive(peaks.sigmas())) {
                throw new IdentificationException(IdentificationException.NO_WINDOW, "a k-sigma tolerance needs uncertainties, but neither the peaks nor "
                        + "the lines have any; give them, or use an absolute or relative tolerance");
            }
        }
    }

    /**
     * The parallel path's check (the serial one finds repeats as it walks the sorted peaks, at no
     * extra cost, and names the same pair).
     *
     * @param pw    the peaks' positions
     * @param order the permutation sorting them, or null when they are sorted
     * @throws IdentificationException naming the first two peaks (in sorted order) at one position
     */
    private static void refuseRepeatedPositions(double[] pw, int[] order) {
        for (int k = 1; k < pw.length; k++) {
            int a = order == null ? k - 1 : order[k - 1];
            int b = order == null ? k : order[k];
            if (pw[a] == pw[b]) {
                throw repeatedPeak(a, b, pw[a]);
            }
        }
    }

    private static IdentificationException repeatedPeak(int a, int b, double position) {
        return new IdentificationException(IdentificationException.REPEATED_PEAK, String.format(Locale.ROOT,
                "peaks %d and %d (in the order given) lie at the same position, %.9g nm in vacuum: a peak list "
                + "holds each peak once, and a repeated one would count its lines twice", Math.min(a, b) + 1,
                Math.max(a, b) + 1, position * 1e9));
    }

    private static boolean anyPositive(double[] values) {
        for (double v : values) {
            if (v > 0) {
                return true;
            }
        }
        return false;
    }

    /** @return the permutation sorting the positions, or null when already sorted */
    private static int[] sortedOrder(double[] positions) {
        boolean sorted = true;
        for (int i = 1; i < positions.length && sorted; i++) {
            sorted = positions[i] >= positions[i - 1];
        }
        if (sorted) {
            return null;
        }
        Integer[] boxed = new Integer[positions.length];
        for (int i = 0; i < boxed.length; i++) {
            boxed[i] = i;
        }
        Arrays.sort(boxed, (a, b) -> Double.compare(positions[a], positions[b]));
        int[] order = new int[boxed.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = boxed[i];
        }
        return order;
    }

    @Override
    public String toString() {
        return String.format(Locale.ROOT, "Identifier[%s %s, w=%s, odds=%s]", tolerance.kind(), tolerance.value(),
                strengthWeight, ambiguityOdds());
    }

    /**
     * Minimum-cost assignment of a component's peaks (rows) to its lines or to "unmatched"
     * (one dummy column per peak at a cost larger than any real one), by the Hungarian method
     * with potentials, O(rows^2 columns). Reuses its arrays between components.
     */
    static final class Assignment {
        private double[] matrix = new double[0];

        void solve(Component c) {
            int rows = c.peaks;
            int lineMin = Integer.MAX_VALUE;
            int lineMax = Integer.MIN_VALUE;
            for (int q = 0; q < c.size; q++) {
                lineMin = Math.min(lineMin, c.line[q]);
                lineMax = Math.max(lineMax, c.line[q]);
            }
            int lines = lineMax - lineMin + 1;
            int cols = lines + rows;
            if (matrix.length < rows * cols) {
                matrix = new double[rows * cols];
            }
            Arrays.fill(matrix, 0, rows * cols, UNMATCHED * 100);
            c.cheapestBlends();
            for (int r = 0; r < rows; r++) {
                for (int q = c.start[r]; q < c.start[r + 1]; q++) {
                    if (!c.isBlend(c.line[q]) && c.cost[q] != Component.OFF) {
                        matrix[r * cols + c.line[q] - lineMin] = c.cost[q];
                    }
                }
                // A row's own dummy column: its cheapest blend (which may serve every row), or nothing.
                matrix[r * cols + lines + r] = c.blendLine[r] >= 0 ? c.blendCost[r] : UNMATCHED;
            }
            int[] rowOfColumn = hungarian(rows, cols);
            Arrays.fill(c.chosen, 0, rows, -1);
            for (int col = 0; col < cols; col++) {
                int r = rowOfColumn[col];
                if (r < 0 || matrix[r * cols + col] >= UNMATCHED) {
                    continue;
                }
                c.chosen[r] = col < lines ? col + lineMin : c.blendLine[r];
            }
        }

        private double[] u = new double[0];
        private double[] v = new double[0];
        private int[] p = new int[0];
        private int[] way = new int[0];
        private double[] minv = new double[0];
        private boolean[] usedCol = new boolean[0];
        private int[] rowOfColumn = new int[0];

        /** @return for each column the row assigned to it, or -1 (rows &lt;= cols); reused between calls */
        private int[] hungarian(int rows, int cols) {
            if (v.length < cols + 1 || u.length < rows + 1) {
                u = new double[Math.max(rows + 1, 2 * u.length)];
                v = new double[Math.max(cols + 1, 2 * v.length)];
                p = new int[v.length];
                way = new int[v.length];
                minv = new double[v.length];
                usedCol = new boolean[v.length];
                rowOfColumn = new int[v.length];
            }
            Arrays.fill(u, 0, rows + 1, 0);
            Arrays.fill(v, 0, cols + 1, 0);
            Arrays.fill(p, 0, cols + 1, 0);
            Arrays.fill(way, 0, cols + 1, 0);
            for (int i = 1; i <= rows; i++) {
                p[0] = i;
                int j0 = 0;
                Arrays.fill(minv, 0, cols + 1, Double.POSITIVE_INFINITY);
                Arrays.fill(usedCol, 0, cols + 1, false);
                do {
                    usedCol[j0] = true;
                    int i0 = p[j0];
                    double delta = Double.POSITIVE_INFINITY;
                    int j1 = 0;
                    for (int j = 1; j <= cols; j++) {
                        if (!usedCol[j]) {
                            double cur = matrix[(i0 - 1) * cols + (j - 1)] - u[i0] - v[j];
                            if (cur < minv[j]) {
                                minv[j] = cur;
                                way[j] = j0;
                            }
                            if (minv[j] < delta) {
                                delta = minv[j];
                                j1 = j;
                            }
                        }
                    }
                    for (int j = 0; j <= cols; j++) {
                        if (usedCol[j]) {
                            u[p[j]] += delta;
                            v[j] -= delta;
                        } else {
                            minv[j] -= delta;
                        }
                    }
                    j0 = j1;
                } while (p[j0] != 0);
                do {
                    int j1 = way[j0];
                    p[j0] = p[j1];
                    j0 = j1;
                } while (j0 != 0);
            }
            for (int j = 1; j <= cols; j++) {
                rowOfColumn[j - 1] = p[j] - 1;
            }
            return rowOfColumn;
        }
    }
}
