package org.ritzwerk.engine.identify;

import java.util.ArrayList;
import java.util.List;
import org.ritzwerk.atom.Species;

/**
 * The result of {@link Identifier#identify}: per peak (in the peaks' order) the status, the line
 * it is matched to, the residual and the cost, the runner-up line, why an ambiguous peak is
 * ambiguous and the line it is weighed against; and the summaries a report
 * needs: unexplained peaks, strong lines that are missing, and the presence of each species.
 * Immutable and thread-safe.
 */
public final class Identification {

    /** Status: no candidate line within the tolerance was left for this peak. */
    public static final byte UNEXPLAINED = 0;
    /**
     * Status: matched, with posterior odds of at least the identifier's threshold (default 20 to
     * 1) against the best assignment in which the peak explains another line.
     */
    public static final byte MATCHED = 1;
    /**
     * Status: matched, but an assignment in which the peak explains another line has posterior
     * odds within the identifier's threshold (see {@link Identifier}); or the line's species does
     * not show its strong lines in the peaks' range beyond chance ({@link #speciesNotShown}: none
     * of them explains a peak, or no more than chance gives and fewer than a present species
     * would show), so that a line from outside the catalogue is as likely an explanation
     * ({@link #speciesPresence} counts those strong lines); or a stray peak explains it about as
     * well ({@link #mayBeStray}). {@link #ambiguity} says which of these flag a peak.
     */
    public static final byte AMBIGUOUS = 2;

    private final PeakList peaks;
    private final LineCatalog lines;
    /** The line plus one (0 for none), negative when ambiguous by the posterior odds. */
    private final int[] linePlusOne;
    /**
     * The species' presence and the peaks it casts doubt on, worked out on first request (status,
     * presence) and then kept: a shift search's many trial identifications never need them.
     */
    private volatile Presence presence;
    /** ln of the identifier's ambiguity odds. */
    private final double logOdds;
    /** The stray density, worked out once ({@link #strayDensity}); NaN until then. */
    private volatile double strayDensity = Double.NaN;
    private final boolean[] used;
    /**
     * The rival line plus one where the peak is ambiguous by the odds, else 0 ({@link #rival});
     * null when no peak is.
     */
    private final int[] rivalPlusOne;
    /** ln of the odds against the rival where the peak is ambiguous by the odds, else 0; null as above. */
    private final double[] rivalLogOdds;
    private final int greedyComponents;
    private final double strongLine;
    private final Tolerance tolerance;
    private final double strengthWeight;
    private final Identifier.IntensityTerm intensityTerm;
    /**
     * The span over which a shift search moved the lines before this identification kept the
     * best shift: a relative part (2 v / c, times the wavelength) and an absolute part in metres
     * (twice the offset searched); both 0 without a search.
     */
    private final double searchRelativeSpan;
    private final double searchSpan;

    Identification(PeakList peaks, LineCatalog lines, Identifier.Results results, double strongLine,
            Tolerance tolerance, double strengthWeight, Identifier.IntensityTerm intensityTerm, double logOdds) {
        this(peaks, lines, results.linePlusOne, results.used, results.rivalPlusOne(), results.rivalLogOdds(),
                results.greedy.get(), strongLine, tolerance, strengthWeight, intensityTerm, logOdds, 0, 0);
    }

    private Identification(PeakList peaks, LineCatalog lines, int[] linePlusOne, boolean[] used, int[] rivalPlusOne,
            double[] rivalLogOdds, int greedyComponents, double strongLine, Tolerance tolerance, double strengthWeight,
            Identifier.IntensityTerm intensityTerm, double logOdds, double searchRelativeSpan, double searchSpan) {
        this.logOdds = logOdds;
        this.peaks = peaks;
        this.lines = lines;
        this.linePlusOne = linePlusOne;
        this.used = used;
        this.rivalPlusOne = rivalPlusOne;
        this.rivalLogOdds = rivalLogOdds;
        this.greedyComponents = greedyComponents;
        this.strongLine = strongLine;
        this.tolerance = tolerance;
        this.strengthWeight = strengthWeight;
        this.intensityTerm = intensityTerm;
        this.searchRelativeSpan = searchRelativeSpan;
        this.searchSpan = searchSpan;
    }

    /**
     * @param relativeSpan the span a velocity search moved the lines over, relative to their
     *                     wavelength (2 v / c; 0 without one)
     * @param span         the span an offset search moved them over, metres (twice the offset;
     *                     0 without one)
     * @return this identification with its chance figures taken over that search (see
     *         {@link #speciesPresence}), the relative span taken at the peaks' middle
     */
    Identification searchedOver(double relativeSpan, double span) {
        return new Identification(peaks, lines, linePlusOne, used, rivalPlusOne, rivalLogOdds, greedyComponents,
                strongLine, tolerance, strengthWeight, intensityTerm, logOdds, relativeSpan, span);
    }

    /**
     * @return the intensity scale ln A the second pass used (median of ln I - ln S over the first
     *         matches), NaN when the observed intensities were not used
     */
    public double intensityScale() {
        return intensityTerm.weight() == 0 ? Double.NaN : intensityTerm.scale();
    }

    /**
     * Presence of one species among the identified lines, weighed against chance (see
     * {@link Identification#speciesPresence()} for the formulas).
     *
     * @param species           the species
     * @param matched           its lines that explain a peak
     * @param matchedByChance   how many of its lines a peak would lie within the tolerance of
     *                          by chance alone, at the local peak density (sum of p_j)
     * @param strongInRange     its strong lines inside the peaks' range
     * @param strongMatched     those that explain a peak
     * @param strongByChance    how many of those a peak would lie near by chance alone
     * @param chanceProbability the probability that chance alone gives what was found: twice the
     *                          smaller of the probabilities that it matches at least
     *                          {@code strongMatched} of the strong lines and at least
     *                          {@code matched} of all the species' lines (the significance; small
     *                          is significant; see {@link Identification#speciesPresence()}), at
     *                          most 1; NaN without strong lines
     * @param presence          the share of the strong lines that the species explains beyond
     *                          chance, at its one-sided 99 % lower bound, in [0, 1]; NaN without
     *                          strong lines
     */
    public record SpeciesPresence(Species species, int matched, double matchedByChance, int strongInRange,
            int strongMatched, double strongByChance, double chanceProbability, double presence) {

        /**
         * @return the share of the species' strong lines in the observed range that were found,
         *         in [0, 1], without regard to chance; NaN when it has no strong line in range
         */
        public double foundShare() {
            return strongInRange == 0 ? Double.NaN : (double) strongMatched / strongInRange;
        }
    }

    /** @return the peaks */
    public PeakList peaks() {
        return peaks;
    }

    /** @return the lines */
    public LineCatalog lines() {
        return lines;
    }

    /**
     * @param i peak index
     * @return {@link #MATCHED}, {@link #AMBIGUOUS} or {@link #UNEXPLAINED}
     */
    public int status(int i) {
        int v = linePlusOne[i];
        return v == 0 ? UNEXPLAINED : v > 0 && !presence().notShown[lines.speciesIndex(v - 1)] && !mayBeStray(i)
                ? MATCHED : AMBIGUOUS;
    }

    /**
     * Why a peak is {@link #AMBIGUOUS}: the three rules, any of which flags a matched peak
     * ({@link #ambiguity}). Each has a stable {@link #id()} for files and a few words for tables.
     */
    public enum Ambiguity {
        /**
         * Another line explains the peak about as well: the best assignment in which the peak
         * explains a different line ({@link #rival}) has posterior odds within the identifier's
         * threshold of the chosen one ({@link #rivalOdds}). More or better peaks of either line,
         * smaller uncertainties or an excitation temperature can settle it.
         */
        CLOSE_RIVAL("close_rival", "close rival"),
        /**
         * The line's species does not show its strong lines in the peaks' range beyond chance
         * ({@link #speciesNotShown}): the peak may come from something not offered. Look for the
         * species' strong lines ({@link #missingStrongLines}), or offer the gas that may be there.
         */
        SPECIES_NOT_SHOWN("species_not_shown", "species not shown"),
        /**
         * A stray peak explains the peak about as well as its line ({@link #mayBeStray}): it lies
         * far from its line for its uncertainty, among unexplained peaks.
         */
        MAY_BE_STRAY("may_be_stray", "may be stray");

        private final String id;
        private final String words;

        Ambiguity(String id, String words) {
            this.id = id;
            this.words = words;
        }

        /** @return the stable identifier, e.g. {@code close_rival} */
        public String id() {
            return id;
        }

        /** @return a few words for a table, e.g. {@code close rival} */
        public String words() {
            return words;
        }
    }

    /**
     * @param i peak index
     * @return why the peak is {@link #AMBIGUOUS}: every rule that flags it, in the order of
     *         {@link Ambiguity}; empty exactly when it is not ambiguous (a new set each call)
     */
    public java.util.Set<Ambiguity> ambiguity(int i) {
        java.util.EnumSet<Ambiguity> why = java.util.EnumSet.noneOf(Ambiguity.class);
        if (linePlusOne[i] < 0) {
            why.add(Ambiguity.CLOSE_RIVAL);
        }
        if (speciesNotShown(i)) {
            why.add(Ambiguity.SPECIES_NOT_SHOWN);
        }
        if (mayBeStray(i)) {
            why.add(Ambiguity.MAY_BE_STRAY);
        }
        return why;
    }

    /**
     * The line a peak that is ambiguous by the odds ({@link Ambiguity#CLOSE_RIVAL}) explains in
     * the best assignment in which it explains a different line: the assignment its odds are
     * weighed against (see {@link Identifier}). For a peak alone among its candidates this is
     * its cheapest other candidate ({@link #runnerUp}); where other peaks compete for the same
     * lines it is the line the peak takes when the group is solved again with the peak barred
     * from its own, which may be another.
     *
     * @param i peak index
     * @return the rival line's index in {@link #lines()}, or -1 when the peak is not ambiguous by
     *         the odds
     */
    public int rival(int i) {
        java.util.Objects.checkIndex(i, linePlusOne.length);
        return rivalPlusOne == null ? -1 : rivalPlusOne[i] - 1;
    }

    /**
     * @param i peak index
     * @return the posterior odds of the peak's assignment against its {@link #rival}'s
     *         (exp of their cost difference, below the identifier's threshold), NaN when the peak
     *         is not ambiguous by the odds
     */
    public double rivalOdds(int i) {
        java.util.Objects.checkIndex(i, linePlusOne.length);
        return rivalPlusOne == null || rivalPlusOne[i] == 0 ? Double.NaN : Math.exp(rivalLogOdds[i]);
    }

    /**
     * @param i peak index
     * @return where the {@link #rival} line is seen, vacuum, metres: its wavelength, or for a
     *         blend with declared components the nearest of its centroid and components to the
     *         peak, as {@link #matchedPosition}; NaN when the peak has no rival
     */
    public double rivalPosition(int i) {
        int j = rival(i);
        return j < 0 ? Double.NaN : lines.nearestPosition(j, peaks.wavelength(i),
                tolerance.halfWidth(peaks.wavelength(i), peaks.sigma(i), lines.sigma(j)));
    }

    /**
     * Whether a stray peak (one no line of the catalogue made: dust, a ghost, a gas not offered)
     * explains the peak about as well as its line, which makes a matched peak {@link #AMBIGUOUS}
     * whatever its odds against the other lines. Strays are taken to fall uniformly at the density
     * the unexplained peaks show: their number over the length of the peaks' range that no line's
     * tolerance window covers (with the median peak uncertainty for a k-sigma tolerance; {@link
     * #strayDensity}). A peak at residual r from its line, scored against s, has the likelihood
     * exp(-(r/s)^2/2) / (s sqrt(2 pi)) per unit wavelength from its line and the stray density from
     * a stray; it is flagged when the first is below the identifier's ambiguity odds times the
     * second (Bayes' rule with equal priors; every line is taken to show one peak). Without
     * unexplained peaks, or where the lines' windows cover nearly the whole range (less than a
     * hundredth of it left), no density is estimated and nothing is flagged this way.
     *
     * <p>Measured (IdentificationRulesTest): in crowded invented scenes (lines 4 pm apart, 1 pm peaks)
     * with 10 % spurious peaks, 149 of the 204 strays that took a line are flagged, against 102 by
     * the other rules alone, and the unflagged wrong labels fall from 10.4 % to 8.6 %; the price
     * there is 315 more real peaks flagged (of about 2,800), as a peak 1.5 sigma from a line among
     * such strays could be one. In a review's sparser scenes of real species (0.05 nm peaks, 5 %
     * strays) 22 strays stayed unflagged instead of 33, for 27 more real peaks flagged of 4,300.
     * The strays left unflagged lie close to a line, where nothing tells them from its peak.
     *
     * @param i peak index
     * @return true when the peak has a line and a stray explains it within the ambiguity odds
     */
    public boolean mayBeStray(int i) {
        int v = linePlusOne[i];
        if (v == 0) {
            return false;
        }
        double density = strayDensity();
        if (!(density > 0)) {
            return false;
        }
        int j = Math.abs(v) - 1;
        double x = peaks.wavelength(i);
        double s = tolerance.scoringSigma(x, peaks.sigma(i), lines.sigma(j));
        if (!(s > 0)) {
            return false;
        }
        double z = residual(i) / s;
        double fromLine = Math.exp(-0.5 * z * z) / (s * Math.sqrt(2 * Math.PI));
        return fromLine < Math.exp(logOdds) * density;
    }

    /**
     * @param i peak index
     * @return whether the peak is {@link #AMBIGUOUS} only because a stray explains it about as well
     *         ({@link #mayBeStray}): matched by its odds, and its species shown
     */
    public boolean ambiguousAsStray(int i) {
        return matchedByOdds(i) && !speciesNotShown(i) && mayBeStray(i);
    }

    /**
     * @return the density of stray peaks per metre of vacuum wavelength that the unexplained peaks
     *         show ({@link #mayBeStray}), 0 when none is estimated
     */
    public double strayDensity() {
        double known = strayDensity;
        if (Double.isNaN(known)) {
            known = estimateStrayDensity();
            strayDensity = known;
        }
        return known;
    }

    private double estimateStrayDensity() {
        int unexplained = 0;
        for (int v : linePlusOne) {
            unexplained += v == 0 ? 1 : 0;
        }
        if (unexplained == 0 || peaks.size() < 2) {
            return 0;
        }
        double[] sorted = ascending(peaks.wavelengths());
        double lo = sorted[0];
        double hi = sorted[sorted.length - 1];
        double typicalSigma = peaks.medianSigma();
        // The union of the lines' windows within [lo, hi]: the windows' starts and ends sorted apart,
        // then swept, the length counted where some window is open (no object per window).
        int n = 0;
        double[] starts = new double[16];
        double[] ends = new double[16];
        for (int j = 0; j < lines.size(); j++) {
            double w = lines.wavelength(j);
            double h = tolerance.halfWidth(w, typicalSigma, lines.sigma(j));
            for (double at : lines.positions(j, h)) {
                if (at + h > lo && at - h < hi) {
                    if (n == starts.length) {
                        starts = java.util.Arrays.copyOf(starts, 2 * n);
                        ends = java.util.Arrays.copyOf(ends, 2 * n);
                    }
                    starts[n] = Math.max(lo, at - h);
                    ends[n++] = Math.min(hi, at + h);
                }
            }
        }
        java.util.Arrays.sort(starts, 0, n);
        java.util.Arrays.sort(ends, 0, n);
        double covered = 0;
        int open = 0;
        double since = lo;
        for (int a = 0, b = 0; b < n;) {
            if (a < n && starts[a] <= ends[b]) {
                if (open++ == 0) {
                    since = starts[a];
                }
                a++;
            } else {
                if (--open == 0) {
                    covered += ends[b] - since;
                }
                b++;
            }
        }
        double free = (hi - lo) - covered;
        return free > 0.01 * (hi - lo) ? unexplained / free : 0;
    }

    /**
     * Whether the peak's line belongs to a species that does not show its strong lines in the
     * peaks' range beyond chance, which makes a matched peak {@link #AMBIGUOUS} whatever its odds
     * against the other lines: the catalogue holds only the species offered, so a peak from
     * anything else (a gas not offered, an impurity) takes the nearest line it finds, and a line
     * of a species that is not shown to be there is no better an explanation than a line the
     * catalogue lacks. A species is not shown when it has strong lines in range
     * ({@link SpeciesPresence#strongInRange()} n above 0) and either none of them explains a
     * peak, or its presence is 0 (chance gives what was found) and it shows fewer of them than a
     * present species would: with c the strong lines in range that have some peak within the
     * tolerance window of the chance model (whatever line that peak was assigned to), the share
     * beyond chance (c - mu) / (n - mu) at the one-sided 99 % upper bound of c,
     * (c - mu + 2.326 sqrt(v)) / (n - mu) (mu and v as in {@link #speciesPresence}; the
     * counterpart of its lower bound), stays below {@value #PRESENT_SHARE}. A species with no
     * strong line in range is not judged.
     *
     * <p>c, not the lines matched, is what the chance model predicts: where peaks lie densely the
     * species' lines compete for them, and a present species is matched to fewer strong lines than
     * chance alone would put a peak near. There presence is 0 for species that are there too,
     * but c is high and their matches keep their status: the rule flags a species where the data
     * speak against it, not merely where they cannot confirm it (on seeded crowded scenes,
     * flagging on presence 0 alone turned 9 in 10 unflagged matches ambiguous, and bounding the
     * lines matched instead of c still 1 in 40).
     *
     * @param i peak index
     * @return true when the peak has a line and that line's species is not shown
     */
    public boolean speciesNotShown(int i) {
        int j = line(i);
        return j >= 0 && presence().notShown[lines.speciesIndex(j)];
    }

    /**
     * @param i peak index
     * @return whether the peak is matched with posterior odds of at least the threshold against
     *         its runner-up, whatever its species shows elsewhere: the shift searches fit from
     *         these (a species' other lines must not decide where its lines are looked for), and
     *         so does a lamp calibration (an instrument's response, not absence, dims a lamp
     *         gas's strong lines at one end of the detector)
     */
    public boolean matchedByOdds(int i) {
        return linePlusOne[i] > 0;
    }

    /**
     * @param i peak index
     * @return the matched line's index in {@link #lines()}, or -1
     */
    public int line(int i) {
        return Math.abs(linePlusOne[i]) - 1;
    }

    /**
     * @param i peak index
     * @return the other line within the tolerance of the peak with the lowest cost (found on
     *         request), or -1
     */
    public int runnerUp(int i) {
        int chosen = line(i);
        for (int j : rankedCandidates(i)) {
            if (j != chosen) {
                return j;
            }
        }
        return -1;
    }

    /**
     * @param i peak index
     * @return every line within the tolerance of the peak, cheapest first (by the cost the
     *         identifier used, found on request); the assigned line need not be first, since the
     *         assignment is one-to-one over all peaks
     */
    public int[] rankedCandidates(int i) {
        double x = peaks.wavelength(i);
        double sigma = peaks.sigma(i);
        double reach = reach(i);
        int j = Identifier.lowerBound(lines.wavelengths(), x - reach - lines.partsAbove());
        List<double[]> found = new ArrayList<>();
        for (; j < lines.size() && lines.wavelength(j) <= x + reach + lines.partsBelow(); j++) {
            double r = x - lines.nearestPosition(j, x, tolerance.halfWidth(x, sigma, lines.sigma(j)));
            if (Math.abs(r) > tolerance.halfWidth(x, sigma, lines.sigma(j))) {
                continue;
            }
            double s = tolerance.scoringSigma(x, sigma, lines.sigma(j));
            double z = s > 0 ? r / s : 0;
            double penalty = -Math.log(lines.strength(j));
            double logIntensity = intensityTerm.weight() == 0 ? Double.NaN : Math.log(peaks.intensity(i));
            found.add(new double[] {0.5 * z * z + strengthWeight * penalty + intensityTerm.cost(logIntensity, penalty), j});
        }
        found.sort((p, q) -> Double.compare(p[0], q[0]));
        return found.stream().mapToInt(c -> (int) c[1]).toArray();
    }

    /**
     * @param i peak index
     * @return where the peak's line is seen, vacuum, metres: the line's wavelength, or for a blend
     *         with declared components the nearest of its centroid and components
     *         ({@link LineCatalog#nearestPosition}); NaN when unexplained
     */
    public double matchedPosition(int i) {
        int j = line(i);
        return j < 0 ? Double.NaN : lines.nearestPosition(j, peaks.wavelength(i),
                tolerance.halfWidth(peaks.wavelength(i), peaks.sigma(i), lines.sigma(j)));
    }

    /** The tolerance's half-width at peak i for any line, as the identifier took it for its candidates. */
    private double reach(int i) {
        return tolerance.halfWidth(peaks.wavelength(i), peaks.sigma(i), lines.maxSigma());
    }

    /**
     * @param i peak index
     * @return peak minus {@link #matchedPosition}, metres; NaN when unexplained
     */
    public double residual(int i) {
        return line(i) < 0 ? Double.NaN : peaks.wavelength(i) - matchedPosition(i);
    }

    /**
     * @param i peak index
     * @return the residual over its scoring uncertainty; NaN when unexplained
     */
    public double normalizedResidual(int i) {
        if (line(i) < 0) {
            return Double.NaN;
        }
        double s = tolerance.scoringSigma(peaks.wavelength(i), peaks.sigma(i), lines.sigma(line(i)));
        return s > 0 ? residual(i) / s : 0;
    }

    /**
     * The normalised residual as a user reads it beside a residual in the peaks' own unit
     * (position minus line position in that unit): {@link #normalizedResidual(int)}, which is the
     * wavelength's, with its sign turned for a unit that falls as wavelength rises (wavenumber,
     * frequency, energy, temperature), so that both share one sign.
     *
     * @param i    peak index
     * @param unit the unit the peaks' positions are given in
     * @return the normalised residual in that unit's direction; NaN when unexplained
     */
    public double normalizedResidual(int i, org.ritzwerk.quantity.Unit unit) {
        double z = normalizedResidual(i);
        return unit.kind() == org.ritzwerk.quantity.Kind.WAVELENGTH ? z : -z;
    }

    /**
     * @param i peak index
     * @return the cost of the chosen candidate (see {@link Identifier}); NaN when unexplained
     */
    public double cost(int i) {
        if (line(i) < 0) {
            return Double.NaN;
        }
        double z = normalizedResidual(i);
        double penalty = -Math.log(lines.strength(line(i)));
        double logIntensity = intensityTerm.weight() == 0 ? Double.NaN : Math.log(peaks.intensity(i));
        return 0.5 * z * z + strengthWeight * penalty + intensityTerm.cost(logIntensity, penalty);
    }

    /** @return how many components were too large for the exact assignment */
    public int greedyComponents() {
        return greedyComponents;
    }

    /**
     * @param wanted a status
     * @return how many peaks have it
     */
    public int count(int wanted) {
        int count = 0;
        for (int i = 0; i < linePlusOne.length; i++) {
            count += status(i) == wanted ? 1 : 0;
        }
        return count;
    }

    /** @return indices of the unexplained peaks, ascending */
    public int[] unexplained() {
        return indices(UNEXPLAINED);
    }

    /** @return indices of the ambiguous peaks, ascending */
    public int[] ambiguous() {
        return indices(AMBIGUOUS);
    }

    private int[] indices(int wanted) {
        int[] out = new int[count(wanted)];
        int k = 0;
        for (int i = 0; i < linePlusOne.length; i++) {
            if (status(i) == wanted) {
                out[k++] = i;
            }
        }
        return out;
    }

    /**
     * @return indices of the strong lines (relative strength at least the identifier's threshold)
     *         inside the range of the peaks that no peak explains, ascending: lines that should
     *         have been seen
     */
    public int[] missingStrongLines() {
        double lo = peaks.shortestWavelength();
        double hi = peaks.longestWavelength();
        List<Integer> missing = new ArrayList<>();
        for (int j = 0; j < lines.size(); j++) {
            double w = lines.wavelength(j);
            if (w >= lo && w <= hi && lines.strength(j) >= strongLine && !used[j]) {
                missing.add(j);
            }
        }
        return missing.stream().mapToInt(Integer::intValue).toArray();
    }

    /** Nearest peaks counted for the local peak density. */
    static final int DENSITY_NEIGHBOURS = 16;
    /**
     * One-sided 99 % point of the standard normal distribution, Phi^-1(0.99) (scipy.stats.norm.ppf
     * of Debian python3-scipy 1.17; a test checks 1 - Phi(z) = 0.01 with Commons Numbers' Erfc).
     */
    static final double Z_99 = 2.3263478740408408;
    /** Above this many (lines x matches) the chance probability uses the normal approximation. */
    static final long EXACT_TAIL_WORK = 20_000_000L;

    /**
     * How many independent shifts a velocity or offset search tried: the span it searched, at
     * the peaks' middle, over the tolerance window there (at least 1); 1 without a search. The
     * chance probabilities of {@link #speciesPresence} are taken over them; the expected chance
     * counts ({@code matchedByChance}, {@code strongByChance}) are those of one shift.
     *
     * @return the shifts, at least 1
     */
    public double shiftsTried() {
        return shiftsTried(ascending(peaks.wavelengths()), peaks.medianSigma());
    }

    /** {@link #shiftsTried()} from the peaks' sorted wavelengths and their typical uncertainty. */
    private double shiftsTried(double[] sorted, double typicalSigma) {
        double middle = sorted[sorted.length / 2];
        double searched = searchRelativeSpan * middle + searchSpan;
        return searched > 0 ? Math.max(1, searched / (2 * tolerance.halfWidth(middle, typicalSigma, 0))) : 1;
    }

    /**
     * Presence of each species of the catalog, weighed against the coincidences that chance
     * alone would give.
     *
     * <p><b>Chance matches.</b> Around each line j the local density of peaks rho_j is the
     * k-nearest-neighbour estimate (k - 1) / L with k = {@value #DENSITY_NEIGHBOURS} (unbiased
     * for a Poisson process; common practice): L is the length of the shortest window around
     * the line that holds k peaks, within the peaks' range and leaving out the line's own
     * tolerance window (so that the line's own peak does not count); fewer peaks give
     * (their number) / (the range's length). The line's tolerance window has width
     * w_j = 2 h_j (h_j the tolerance's half-width at the line, with the median peak
     * uncertainty for a k-sigma tolerance), so the chance that some unrelated peak falls in it
     * is p_j = 1 - exp(-rho_j w_j) (Poisson statistics); for a blend with declared components,
     * which a peak may match at its centroid or at a group of its components, w_j is the length
     * of the union of the windows around them ({@link LineCatalog#nearestPosition}). A species' expected chance
     * matches are the sum of p_j over its lines; for the strong lines in range (relative strength
     * at least the identifier's threshold: the lines a present species must show; in range means
     * between the outermost peaks, or matched by a peak, so that a line matched by an outermost
     * peak that lies just inside it still counts) that sum is mu with variance
     * v = sum p_j (1 - p_j).
     *
     * <p><b>Significance.</b> The number N of strong lines matched by chance is a sum of
     * independent Bernoulli(p_j) (Poisson-binomial); P_s = P(N &gt;= k) for the observed count
     * k, by exact recursion over the lines, or, when lines times k exceed
     * {@value #EXACT_TAIL_WORK}, by the normal approximation with continuity correction
     * 1 - Phi((k - 1/2 - mu) / sqrt(v)) (Lyapunov's central limit theorem; common practice).
     * P_a is the same for all the species' lines counted above and all its matched lines: a
     * species with one strong line in range but many weaker lines matched (He II 468.6 nm and 15
     * more where chance expects 0.7) is told from chance by them. {@code chanceProbability} is
     * min(1, 2 min(P_s, P_a)) (two tests, Bonferroni's bound; common practice); P_a is worked out
     * only where 2 P_s exceeds 0.01, elsewhere the figure is 2 P_s.
     *
     * <p><b>After a shift search.</b> When a velocity or offset search moved the lines over a span
     * W (at the peaks' middle) and kept the best shift, chance had about T = W / (2 h) independent
     * tries (h the tolerance's half-width there), so P_s and P_a are each 1 - (1 - P)^T of the
     * single-position P (look-elsewhere; common practice) and presence is 0 when
     * {@code chanceProbability} exceeds 0.01. The expected chance counts stay those of one
     * position.
     *
     * <p><b>Presence.</b> Of n strong lines, a species that truly shows a share f of them is
     * expected to match k = n f + (n - n f) p of them, p the chance rate, so
     * f = (k - mu) / (n - mu) (method of moments, derived here; the same form as the chance
     * correction of J. Cohen, Educ. Psychol. Meas. 20, 37 (1960), cited from memory).
     * {@code presence} takes k at its one-sided 99 % lower bound (normal approximation),
     * {@code (k - mu - 2.326 sqrt(v)) / (n - mu)}, clipped to [0, 1], and is 0 when n - mu is
     * not positive (chance alone explains every strong line) or when chance gives what was found
     * more often than 1 % of the time ({@code chanceProbability} above 0.01: the normal
     * bound alone gave random peaks presence 0.2 where chance expects 0.03 matches and one came).
     * Random peaks thus give presence 0 in at least 99 % of cases whatever their density; a
     * species whose strong lines are all found among sparse peaks gets nearly 1. Limits: the chance model treats peaks as a Poisson
     * process of the local density and lines as independent; with few strong lines in range
     * the bound is loose (one strong line found where chance expects 0.01 or 0.001 gives 0.77
     * or 0.93).
     *
     * @return per species of the catalog, in {@link LineCatalog#speciesList()} order (unmodifiable)
     */
    public List<SpeciesPresence> speciesPresence() {
        return presence().species();
    }

    /**
     * A species that is there shows at least this share of its strong lines in the peaks' range
     * ({@link #speciesNotShown}). A judgement of this project, not a derived figure: strong lines
     * are those a present species must show, and one half leaves room for an instrument's
     * response and for excitation conditions unlike those of the line list's strengths.
     */
    public static final double PRESENT_SHARE = 0.5;

    /** Each species' presence, and per species whether it is not shown ({@link #speciesNotShown}). */
    private record Presence(List<SpeciesPresence> species, boolean[] notShown) {
    }

    /** @return the presence, worked out once (a race only works it out twice, to the same values) */
    private Presence presence() {
        Presence known = presence;
        if (known == null) {
            known = weighPresence();
            presence = known;
        }
        return known;
    }

    private Presence weighPresence() {
        int count = lines.speciesList().size();
        int[] matched = new int[count];
        double[] matchedByChance = new double[count];
        int[] strong = new int[count];
        int[] strongMatched = new int[count];
        int[] strongCovered = new int[count];
        double[] strongByChance = new double[count];
        double[] strongVariance = new double[count];
        // Each species' strong-line rates in catalogue order (unboxed; lengths in strong[]), and
        // the rates of all its lines counted (lengths in counted[]).
        double[][] strongRates = new double[count][];
        double[][] allRates = new double[count][];
        int[] counted = new int[count];
        double[] allVariance = new double[count];
        double[] sorted = ascending(peaks.wavelengths());
        double typicalSigma = peaks.medianSigma();
        double lo = sorted[0];
        double hi = sorted[sorted.length - 1];
        double trials = shiftsTried(sorted, typicalSigma);
        // Where the last line's searches ended: the lines come in ascending order, so the next
        // line's searches start there (Identifier.lowerBound with a guess).
        int windowStart = 0;
        int nearStart = 0;
        for (int j = 0; j < lines.size(); j++) {
            int s = lines.speciesIndex(j);
            matched[s] += used[j] ? 1 : 0;
            double w = lines.wavelength(j);
            double h = tolerance.halfWidth(w, typicalSigma, lines.sigma(j));
            if (!used[j] && (w < lo - h || w > hi + h)) {
                continue;
            }
            windowStart = Identifier.lowerBound(sorted, w - h, windowStart);
            double p = chanceRate(sorted, w, h, lines.windowLength(j, h), windowStart);
            matchedByChance[s] += p;
            allVariance[s] += p * (1 - p);
            allRates[s] = grown(allRates[s], counted[s]);
            allRates[s][counted[s]++] = p;
            // a matched line counts even where it lies just beyond the outermost peak
            if ((w >= lo && w <= hi || used[j]) && lines.strength(j) >= strongLine) {
                strong[s]++;
                strongMatched[s] += used[j] ? 1 : 0;
                if (!used[j]) {
                    nearStart = Identifier.lowerBound(sorted, w - h - lines.partsBelow(), nearStart);
                }
                strongCovered[s] += used[j] || peakWithin(sorted, j, h, nearStart) ? 1 : 0;
                strongByChance[s] += p;
                strongVariance[s] += p * (1 - p);
                strongRates[s] = grown(strongRates[s], strong[s] - 1);
                strongRates[s][strong[s] - 1] = p;
            }
        }
        List<SpeciesPresence> presence = new ArrayList<>();
        boolean[] notShown = new boolean[count];
        for (int s = 0; s < count; s++) {
            int n = strong[s];
            int k = strongMatched[s];
            double mu = strongByChance[s];
            double chance = n == 0 ? Double.NaN
                    : lookElsewhere(chanceProbability(strongRates[s], n, k, mu, strongVariance[s]), trials);
            if (n > 0) {
                // Two tests, the strong lines found and all lines matched: twice the smaller
                // probability (Bonferroni); the second is worked out only where it can matter.
                chance = Math.min(1, 2 * chance);
                if (chance > 0.01 && matched[s] > 0) {
                    chance = Math.min(chance, 2 * lookElsewhere(chanceProbability(allRates[s], counted[s],
                            matched[s], matchedByChance[s], allVariance[s]), trials));
                }
            }
            double share = Double.NaN;
            if (n > 0) {
                // Counts that chance gives more often than 1 % of the time show nothing: 0, whatever the
                // normal approximation of the bound below says where chance expects a fraction of a line.
                share = n - mu > 1e-12 && !(chance > 0.01)
                        ? (k - mu - Z_99 * Math.sqrt(strongVariance[s])) / (n - mu) : 0;
                share = Math.max(0, Math.min(1, share));
                // Not shown: none of its strong lines found, or no more than chance gives and, at
                // the upper bound of the lines with a peak near them, fewer than a present species shows.
                notShown[s] = k == 0 || share == 0 && n - mu > 1e-12
                        && (strongCovered[s] - mu + Z_99 * Math.sqrt(strongVariance[s])) / (n - mu) < PRESENT_SHARE;
            }
            presence.add(new SpeciesPresence(lines.speciesList().get(s), matched[s], matchedByChance[s], n, k, mu,
                    chance, share));
        }
        return new Presence(List.copyOf(presence), notShown);
    }

    /**
     * @param sorted the peaks' vacuum wavelengths, ascending, metres
     * @param j      a line
     * @param h      its tolerance half-width as the chance model takes it, metres
     * @param from   the first peak not below w - h - {@link LineCatalog#partsBelow()}
     * @return whether some peak lies within h of one of the line's positions
     *         ({@link LineCatalog#nearestPosition}), whatever line that peak was assigned to
     */
    private boolean peakWithin(double[] sorted, int j, double h, int from) {
        double w = lines.wavelength(j);
        for (int i = from; i < sorted.length && sorted[i] <= w + h + lines.partsAbove(); i++) {
            if (Math.abs(sorted[i] - lines.nearestPosition(j, sorted[i], h)) <= h) {
                return true;
            }
        }
        return false;
    }

    /** After a shift search the best of about T independent shifts was kept: 1 - (1 - P)^T (look-elsewhere). */
    private static double lookElsewhere(double chance, double trials) {
        return trials > 1 && !Double.isNaN(chance) ? -Math.expm1(trials * Math.log1p(-Math.min(chance, 1))) : chance;
    }

    /** @return the array, or a new one, with room for index {@code at} */
    private static double[] grown(double[] rates, int at) {
        if (rates == null) {
            return new double[16];
        }
        return at < rates.length ? rates : java.util.Arrays.copyOf(rates, 2 * rates.length);
    }

    /**
     * @return whether some species shows its strong lines beyond chance ({@link #speciesPresence}
     *         above 0). After a velocity or offset search, false means the shift kept is no better
     *         than chance: the true one may lie outside the range searched, or no species offered
     *         is there. Without a search, false means the matches may rest on coincidences: the
     *         peaks may come from a gas or impurity not offered, or lie too densely for the
     *         strong lines found to be told from chance.
     */
    public boolean someSpeciesBeyondChance() {
        for (SpeciesPresence presence : speciesPresence()) {
            if (presence.presence() > 0) {
                return true;
            }
        }
        return false;
    }

    /**
     * @return the values in ascending order: the array itself when it already is (it is then
     *         only read), else a sorted copy
     */
    private static double[] ascending(double[] values) {
        for (int i = 1; i < values.length; i++) {
            // Double.compare orders as Arrays.sort does (-0.0 before 0.0), so a copy is sorted
            // whenever the sort could change the array.
            if (Double.compare(values[i - 1], values[i]) > 0) {
                double[] sorted = values.clone();
                java.util.Arrays.sort(sorted);
                return sorted;
            }
        }
        return values;
    }

    /**
     * @param sorted the peaks' vacuum wavelengths, ascending, metres
     * @param w      the line, metres
     * @param h      its tolerance half-width, metres
     * @return p = 1 - exp(-rho w) for the local density rho of peaks outside [w - h, w + h]
     */
    static double chanceRate(double[] sorted, double w, double h) {
        return chanceRate(sorted, w, h, 2 * h);
    }

    /**
     * As {@link #chanceRate(double[], double, double)}, for a line seen over a window of the given
     * length (a blend with components: the union of the windows around them).
     *
     * @param window the window's length, metres
     * @return p = 1 - exp(-rho window)
     */
    static double chanceRate(double[] sorted, double w, double h, double window) {
        return chanceRate(sorted, w, h, window, Identifier.lowerBound(sorted, w - h));
    }

    /** As {@link #chanceRate(double[], double, double, double)}, given the first peak not below w - h. */
    private static double chanceRate(double[] sorted, double w, double h, double window, int first) {
        double lo = sorted[0];
        double hi = sorted[sorted.length - 1];
        int right = first;
        while (right < sorted.length && sorted[right] <= w + h) {
            right++;
        }
        int left = first - 1;
        int counted = Math.min(DENSITY_NEIGHBOURS, left + 1 + sorted.length - right);
        double density;
        double excluded = overlap(w - h, w + h, lo, hi);
        if (counted == DENSITY_NEIGHBOURS) {
            double radius = nearest(sorted, w, left, right, DENSITY_NEIGHBOURS);
            double length = overlap(w - radius, w + radius, lo, hi) - excluded;
            density = length > 0 ? (counted - 1) / length : Double.POSITIVE_INFINITY;
        } else {
            double length = (hi - lo) - excluded;
            density = counted == 0 || !(length > 0) ? Double.POSITIVE_INFINITY : counted / length;
        }
        // (every peak inside the window, or a density that cannot be told from a single point,
        // counts as infinite: chance explains everything there)
        double rate = density * window;
        return rate > 0 ? -Math.expm1(-rate) : 0;
    }

    /**
     * The distance from w of the k-th nearest peak outside a window: the k-th smallest of the
     * distances below it (w - sorted[left], w - sorted[left - 1], ...) and above it
     * (sorted[right] - w, ...), both ascending, found by halving the split between them rather
     * than by merging k steps (whose branches are unpredictable; this runs for every line of every
     * presence figure).
     *
     * @param left  the nearest peak below the window (-1 when none)
     * @param right the nearest peak above it (sorted.length when none)
     * @param k     how many, at most the peaks on both sides together
     * @return the k-th smallest distance
     */
    static double nearest(double[] sorted, double w, int left, int right, int k) {
        int below = left + 1;
        int above = sorted.length - right;
        // a peaks from below and k - a from above: the least a whose a-th distance below is not
        // smaller than the (k - a)-th above, as in a merge of the two.
        int lo = Math.max(0, k - above);
        int hi = Math.min(k, below);
        while (lo < hi) {
            int a = (lo + hi) >>> 1;
            if (w - sorted[left - a] < sorted[right + k - a - 1] - w) {
                lo = a + 1;
            } else {
                hi = a;
            }
        }
        double fromBelow = lo > 0 ? w - sorted[left - lo + 1] : Double.NEGATIVE_INFINITY;
        double fromAbove = k - lo > 0 ? sorted[right + k - lo - 1] - w : Double.NEGATIVE_INFINITY;
        return Math.max(fromBelow, fromAbove);
    }

    private static double overlap(double a, double b, double lo, double hi) {
        return Math.max(0, Math.min(b, hi) - Math.max(a, lo));
    }

    /**
     * @return P(N &gt;= k) for N a sum of independent Bernoulli(p_j): exact recursion, or the
     *         normal approximation with continuity correction for large problems
     */
    static double chanceProbability(List<Double> rates, int k, double mu, double variance) {
        double[] values = new double[rates.size()];
        for (int j = 0; j < values.length; j++) {
            values[j] = rates.get(j);
        }
        return chanceProbability(values, values.length, k, mu, variance);
    }

    /** As {@link #chanceProbability(List, int, double, double)}, for the first {@code count} rates of an array. */
    static double chanceProbability(double[] rates, int count, int k, double mu, double variance) {
        if (k == 0) {
            return 1;
        }
        if ((long) count * k > EXACT_TAIL_WORK) {
            if (variance <= 0) {
                return k - 0.5 <= mu ? 1 : 0;
            }
            double z = (k - 0.5 - mu) / Math.sqrt(variance);
            return 0.5 * org.apache.commons.numbers.gamma.Erfc.value(z / Math.sqrt(2));
        }
        // f[c] = P(c matched so far) for c < k; f[k] = P(at least k).
        double[] f = new double[k + 1];
        f[0] = 1;
        for (int j = 0; j < count; j++) {
            double p = rates[j];
            f[k] += f[k - 1] * p;
            for (int c = k - 1; c >= 1; c--) {
                f[c] = f[c] * (1 - p) + f[c - 1] * p;
            }
            f[0] *= 1 - p;
        }
        return Math.min(1, Math.max(0, f[k]));
    }

    /** @return the counts at a glance, e.g. {@code Identification[50 peaks: 45 matched, 2 ambiguous, 3 unexplained]} */
    @Override
    public String toString() {
        return "Identification[" + peaks.size() + " peaks: " + count(MATCHED) + " matched, " + count(AMBIGUOUS)
                + " ambiguous, " + count(UNEXPLAINED) + " unexplained]";
    }
}
