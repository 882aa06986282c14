package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * Level energies from measured line wavenumbers by weighted least squares: each line is an
 * observation {@code sigma_k = E_upper(k) - E_lower(k)} with weight {@code 1 / u_k^2}, one reference
 * level is held at its given energy, and the energies E minimise
 * {@code chi^2 = sum_k ((sigma_k - E_upper(k) + E_lower(k)) / u_k)^2}. Their covariance is
 * {@code (A^T W A)^-1}; every line's Ritz wavenumber and its standard uncertainty follow from the
 * energies and that covariance, correlations included. This is weighted linear least squares
 * applied to the Ritz combination principle, the way evaluators of atomic spectra optimise level
 * energies (common practice): the normal equations {@code (A^T W A) E = A^T W sigma}, A the
 * incidence matrix of lines and levels (+1 upper, -1 lower), and the first-order propagation of
 * the covariance to each Ritz wavenumber, {@code u^2 = a^T (A^T W A)^-1 a} (JCGM 100:2008, eq. 13);
 * lines that alone determine a level are told apart (our naming and formats).
 *
 * <p><b>How it is solved.</b> The weighted design matrix {@code A_w = W^1/2 A} (the unknowns are the levels
 * not held) is factorised {@code A_w = Q R P^T} by Householder QR with column pivoting, its rows the most
 * precise lines first (the ordering that keeps each loose line's own digits: Powell and Reid 1969, Cox and
 * Higham 1998, from memory). The energies are its least-squares solution with one step of iterative
 * refinement; their covariance is {@code P R^-1 R^-T P^T} (no normal matrix {@code A^T W A} is formed: that
 * would square the condition number, which reaches the spread of the uncertainties); and each line's Ritz
 * variance is {@code u^2 = a^T (A_w^T A_w)^-1 a = ||R^-T P^T a||^2}, one forward substitution for its row
 * {@code a = e_upper - e_lower} (a level held drops out), never the difference {@code C_uu + C_ll - 2 C_ul}
 * of the covariance (see the precision paragraph below). Cost, for m lines and p unknowns: O(m p^2) for the
 * factorisation (the pivot column's norm recomputed at each step), O(p^3) for the covariance, and O(m p^2)
 * for the Ritz variances (each substitution starts at the first unknown its row touches: about p^2 / 6 on
 * average), the same order as the factorisation; a downdate after a line left out costs O(p^2) and the
 * residuals against it O(m).
 *
 * <p><b>Outliers.</b> Each line's residual {@code r_k = sigma_k - sigma_Ritz,k} is compared with
 * its own standard deviation {@code sqrt(u_k^2 - u_Ritz,k^2)}: the normalised residual of weighted
 * least squares with known uncertainties, which equals the leave-one-out (deleted) residual
 * {@code r_k / (1 - h_k)} over its standard deviation {@code u_k / sqrt(1 - h_k)}, h_k =
 * {@code u_Ritz,k^2 / u_k^2} the line's leverage (Cook and Weisberg, <i>Residuals and Influence in
 * Regression</i>, 1982, ch. 2, from memory; with the variance known, the internally and externally studentised
 * residuals coincide). Outliers are found the way evaluators and surveyors do (iterative data
 * snooping, W. Baarda 1968, from memory; common practice): the line with the largest normalised residual beyond
 * {@link #withOutlierThreshold the threshold} (3 unless set) is left out and the levels are fitted
 * again, until no kept line exceeds it. A misassigned line drags the levels it touches, so the other
 * lines' residuals are only meaningful once it is out; one line at a time keeps an honest line from
 * being left out with it. Between removals the fit is not redone from scratch but downdated by one
 * line (a rank-one update of the covariance, exact but for rounding), as long as the downdated covariance
 * carries the Ritz variances the next round judges by: no level's variance more than {@value
 * #DOWNDATE_LIMIT} times the smallest Ritz variance of a kept line in the last fit from scratch (Ritz
 * variances only grow as lines are left out, so that bounds them all; the differences of the covariance then
 * lose at most about 1e-10 of themselves). Beyond it (a precise group hung on much looser lines) the lines
 * kept are fitted from scratch after each line left out, whose Ritz variances and correlations come from the
 * factorisation. Once no line exceeds the threshold the kept lines are fitted from scratch and judged again,
 * so the result is that of a fit of the lines kept: the levels, their covariance, chi^2, the degrees of
 * freedom and every line's Ritz uncertainty come from the lines kept and that final factorisation; every
 * line, kept or not, has its residual against that final fit. A line left out is
 * flagged {@link LevelOptimum.LineFlag#OUTLIER} ({@link LevelOptimum#leftOut()} in the order they
 * were left out) and its normalised residual is {@code r_k / sqrt(u_k^2 + u_Ritz,k^2)}, a prediction
 * from levels it did not touch; it is not taken back in, even if that later falls within the
 * threshold. When the worst line's residual is perfectly correlated with other kept lines' (with
 * it they alone join part of the level system to the rest: the only two lines of a level, two
 * measurements of one line, the lines of a single loop), their normalised residuals are equal in
 * size whatever the data, so nothing tells which is wrong. The least precise of them (the latest on
 * a tie) is left out all the same, so that their disagreement stops pulling the other levels, and
 * the ones kept are flagged {@link LevelOptimum.LineFlag#UNRESOLVED} ({@link
 * LevelOptimum#unresolvedWith} names the line left out in their place): the user must choose.
 * A kept line that alone determines a level ({@code u_Ritz = u}, residual 0) cannot be
 * checked and is flagged {@link LevelOptimum.LineFlag#DETERMINES_LEVEL} (it is never left out, so
 * every level stays connected); the others are {@link LevelOptimum.LineFlag#FITTED}.
 *
 * <p><b>Systems no line joins.</b> Levels that no chain of lines connects to the reference are refused
 * unless {@link #withSeparateSystems} allows them; then each such system is fitted on its own, its
 * energies relative to one of its levels or, where that level's energy is given, absolute (see there).
 *
 * <p><b>Precision of small Ritz uncertainties.</b> The covariance is of the energies above the reference, so
 * for a line far more precise than the levels it joins (a precise group of levels hung on the reference by
 * much looser lines, k times looser) the difference {@code C_uu + C_ll - 2 C_ul} would be of numbers k^2
 * times larger than the result and lose about that many parts in 1e16 (measured on a loop of three lines
 * of one uncertainty hung on a line 1e4, 1e5 and 1e6 times looser: 1e-8, 2e-6 and 4e-4 of itself; from 1e7
 * 1 to 30 per cent, or 0, which such fits were once refused for). The forward substitution does not form
 * that difference, and with the rows in order of weight the factorisation is that of lines whose weights
 * are off by a few parts in 1e16 each, which moves a Ritz variance by about as much: measured against the
 * closed form sqrt(2/3) u of that loop (PreciseGroupsTest, derived there and by sympy) within 4e-15 of
 * itself for k from 1e4 to 1e8, 1.5e-13 at 1e9 and 9e-13 at 1e10, the largest spread accepted (the error
 * grows as (1e-16 k)^2: the loose line's rounding reaches the loop at second order), and within 2e-15 on a
 * network of groups of lines of 2e-9 to 5e-9 cm-1 hung on lines of 0.5 to 10 cm-1 (against mpmath). The
 * levels' own uncertainties keep their digits the same way (within 2e-15 there). What stays limited is the
 * rounding of the energies: a Ritz wavenumber {@code E_u - E_l} carries that of energies of the problem's
 * scale (about 1e-16 of it; the floor of 1e-12 of the scale on uncertainties keeps it near 1e-4 of any), and
 * a group's common offset, set by the loose lines alone, carries about 1e-16 k of its uncertainty (measured
 * 1.6e-8 at k = 2.5e8). The covariance the result reports ({@link LevelOptimum#covariance()}) carries each
 * entry to a few parts in 1e16 of the larger of its variances, so differences taken from it lose the digits
 * above; a level list made from the result ({@link LevelOptimum#levels}) is refused where they would (see
 * there). A fit stays refused as {@link RitzException#SINGULAR} only where R itself is numerically
 * rank-deficient (a diagonal below 2^-52 of the first), which the limits on uncertainties below keep out of
 * reach for connected systems, and, naming the line, where a line's Ritz variance came out 0 or not finite.
 *
 * <p>Refused with a {@link RitzException}: levels that no chain of lines connects to the
 * reference, unless allowed ({@link RitzException#UNCONNECTED}, naming them and the option); an
 * uncertainty below 1e-12 of the energy scale (the largest energy held, the reference's or an anchor's,
 * plus the largest wavenumber) or more than 1e10 times smaller than the largest ({@link
 * RitzException#BAD_VALUE}, naming the line: double precision does not carry such weights through the
 * fit); a system that is numerically singular though connected ({@link RitzException#SINGULAR}, above: not
 * met within those limits); a
 * line whose fitted upper level does not lie above its lower level
 * ({@link RitzException#BAD_ASSIGNMENT}, naming the line, both labels and energies: its assignment is
 * reversed or wrong); a level fitted more than 3 of its standard uncertainties below 0, the ground
 * level, since the reference energy is an energy above the ground level unless {@link
 * #withLevelsBelowZero} allows them ({@link
 * RitzException#BAD_ASSIGNMENT}, naming the level and the lines that set it: a line that alone sets a
 * level, entered with upper and lower swapped, puts it there). Immutable and thread-safe.
 */
public final class LevelOptimizer {

    private static final LevelOptimizer DEFAULTS = new LevelOptimizer(3.0, false, true, null);
    /** An uncertainty below this fraction of the energy scale is refused (see the class comment). */
    static final double RELATIVE_FLOOR = 1e-12;
    /** Uncertainties more than this factor apart are refused (see the class comment). */
    static final double SPREAD_LIMIT = 1e10;
    /**
     * A downdated fit is used only while no level's variance exceeds this many times the smallest Ritz variance
     * of a kept line (else the next fit is from scratch): its covariance differences then keep their digits
     * but for about this many parts in 1e16 (see the class comment).
     */
    static final double DOWNDATE_LIMIT = 1e6;

    private final double threshold;
    private final boolean relative;
    private final boolean downdate;
    /** The references of systems not joined to the main reference; null: such systems are refused. */
    private final List<SystemReference> systems;

    private LevelOptimizer(double threshold, boolean relative, boolean downdate, List<SystemReference> systems) {
        this.threshold = threshold;
        this.relative = relative;
        this.downdate = downdate;
        this.systems = systems;
    }

    /**
     * The plain method, for comparisons (tests and the {@code LevelOptimizerBenchmark} baseline): the
     * same outlier removal with a fit from scratch after every line left out instead of a rank-one
     * downdate. Same lines left out, levels and chi^2 (equal in the tests).
     *
     * @return this optimizer refitting from scratch after every line left out
     */
    public LevelOptimizer withFullRefits() {
        return new LevelOptimizer(threshold, relative, false, systems);
    }

    /** @return an optimizer leaving out lines beyond 3 standard deviations, one at a time */
    public static LevelOptimizer defaults() {
        return DEFAULTS;
    }

    /**
     * @param deviations the normalised residual beyond which the worst line is left out, finite, positive
     * @return this optimizer with that threshold
     */
    public LevelOptimizer withOutlierThreshold(double deviations) {
        if (!(deviations > 0) || Double.isInfinite(deviations)) {
            throw new IllegalArgumentException("the outlier threshold must be finite and positive, got " + deviations);
        }
        return new LevelOptimizer(deviations, relative, downdate, systems);
    }

    /**
     * @param allowed true: the reference energy is a level's energy relative to some other zero, so levels
     *                may come out below 0 (a reference that is not the lowest level); false (the default):
     *                it is an energy above the ground level, and a level fitted more than 3 of its standard
     *                uncertainties below 0 is refused
     * @return this optimizer with that setting
     */
    public LevelOptimizer withLevelsBelowZero(boolean allowed) {
        return new LevelOptimizer(threshold, allowed, downdate, systems);
    }

    /**
     * Allows levels that fall into systems no chain of measured lines joins, as evaluators handle them
     * (common practice): e.g. the singlets and triplets of He I when no intercombination line was
     * measured, or a group of high levels seen only among themselves. The system of the problem's
     * reference level (the main system) is fitted as before; every other system is fitted on its own
     * with one of its levels held: the level a reference here names, or by default its lowest level.
     * A floating reference ({@link SystemReference#floating}, and the default) makes its system's
     * energies relative to that level, {@code E = value + x} with x unknown, and their uncertainties and
     * covariance relative to it (the reference itself at 0 with uncertainty 0); an anchored one
     * ({@link SystemReference#at}) holds the level at its known energy, so the system's energies are
     * absolute and the anchor's variance is added to every entry of the system's covariance block (each
     * level's uncertainty includes the anchor's; differences within the system, and so its lines' Ritz
     * wavenumbers and uncertainties, are unchanged by it). The fit is one weighted least squares in which
     * the systems share no line, so it is the separate fit of each system (its levels, residuals and
     * outliers are those of the system alone); the covariance between levels of different systems is 0.
     * See {@link LevelOptimum#systems()}.
     *
     * <p>Refused by {@link #optimize} ({@link RitzException#BAD_REFERENCE}, naming the label): a
     * reference whose label is not a level of any line, one in the main system (that system already
     * holds the problem's reference; the reference level itself included), and two references in one
     * system. A problem whose reference level is in no line is refused ({@link
     * RitzException#BAD_ASSIGNMENT}): no level would be absolute.
     *
     * @param references the references of some (or none) of the other systems; the rest float on their
     *                   lowest level
     * @return this optimizer accepting separate systems with those references
     */
    public LevelOptimizer withSeparateSystems(List<SystemReference> references) {
        List<SystemReference> copy = List.copyOf(Objects.requireNonNull(references, "references"));
        return new LevelOptimizer(threshold, relative, downdate, copy);
    }

    /** @return whether systems not joined to the main reference are fitted ({@link #withSeparateSystems}) */
    public boolean separateSystems() {
        return systems != null;
    }

    /** @return the system references given to {@link #withSeparateSystems}; empty without it */
    public List<SystemReference> systemReferences() {
        return systems == null ? List.of() : systems;
    }

    /** @return whether levels may come out below 0 ({@link #withLevelsBelowZero}) */
    public boolean levelsBelowZero() {
        return relative;
    }

    /** @return the outlier threshold, standard deviations */
    public double outlierThreshold() {
        return threshold;
    }

    /**
     * @param problem the measured lines and the reference level
     * @return the optimised levels (from the lines kept), their covariance and every line's Ritz
     *         wavenumber, residual and flag
     * @throws RitzException ({@link RitzException#UNCONNECTED}) naming the levels not connected to the reference,
     *                       unless {@link #withSeparateSystems} allows them;
     *                       ({@link RitzException#BAD_REFERENCE}) for a system reference that is not a level
     *                       of any line, lies in the main system or shares a system with another;
     *                       ({@link RitzException#BAD_ASSIGNMENT}) for separate systems when the reference
     *                       level is in no line;
     *                       ({@link RitzException#TOO_FEW}) for a problem without lines;
     *                       ({@link RitzException#SINGULAR}) for a connected system whose least-squares
     *                       problem is numerically singular (uncertainties many orders of magnitude apart);
     *                       ({@link RitzException#BAD_ASSIGNMENT}) naming a line whose fitted upper level is not
     *                       above its lower level, or a level fitted below the ground level with its lines;
     *                       ({@link RitzException#BAD_VALUE}) naming a line whose uncertainty double precision
     *                       cannot carry (see the class comment)
     */
    public LevelOptimum optimize(MeasuredLines problem) {
        Objects.requireNonNull(problem, "problem");
        if (problem.size() == 0) {
            throw new RitzException(RitzException.TOO_FEW, "no measured lines: the levels need at least one line "
                    + "joining them to the reference level");
        }
        int lines = problem.size();
        Partition part = partition(problem);
        checkPrecision(problem, part);
        boolean[] kept = new boolean[lines];
        Arrays.fill(kept, true);
        List<Integer> leftOut = new ArrayList<>();
        int[] partner = new int[lines];
        Arrays.fill(partner, -1);
        Fit fit = solve(problem, kept, part);
        boolean fresh = true;
        // the smallest Ritz variance of a kept line in the last fit from scratch: removing lines only widens
        // variances, so it bounds every later one from below (see DOWNDATE_LIMIT)
        double floor = fit.smallestKeptVariance(kept);
        // iterative data snooping: leave out the worst line beyond the threshold, fit again
        while (true) {
            int worst = -1;
            double largest = threshold;
            for (int k = 0; k < lines; k++) {
                double z = kept[k] ? Math.abs(fit.normalised(problem, k, true)) : Double.NaN;
                if (z > largest) {
                    largest = z;
                    worst = k;
                }
            }
            if (worst < 0) {
                if (fresh) {
                    break;
                }
                // the downdated fit carries rounding: judge the lines kept once more on a fit from scratch
                fit = solve(problem, kept, part);
                fresh = true;
                floor = fit.smallestKeptVariance(kept);
                continue;
            }
            List<Integer> mirrors = fit.mirrors(problem, kept, worst);
            if (!mirrors.isEmpty()) {
                // the data cannot tell which of these is wrong: leave out the least precise (the latest on a
                // tie), so the discrepancy stops pulling the other levels, and flag the ones kept
                mirrors.add(worst);
                int drop = worst;
                for (int m : mirrors) {
                    double um = problem.uncertaintyPerCm(m);
                    double ud = problem.uncertaintyPerCm(drop);
                    if (um > ud || (um == ud && m > drop)) {
                        drop = m;
                    }
                }
                for (int m : mirrors) {
                    if (m != drop) {
                        partner[m] = drop;
                    }
                }
                worst = drop;
            }
            kept[worst] = false;
            leftOut.add(worst);
            Fit next = downdate ? fit.without(problem, worst) : null;
            if (next != null && !(next.largestLevelVariance() <= DOWNDATE_LIMIT * floor)) {
                next = null;                    // its covariance would not carry the Ritz variances: refit
            }
            fresh = next == null;
            fit = fresh ? solve(problem, kept, part) : next;
            if (fresh) {
                floor = fit.smallestKeptVariance(kept);
            }
        }
        if (part.holdLowest(fit.energy)) {
            // a floating system is quoted relative to its lowest level: fitted with that level held, its
            // covariance is relative to it without a difference of larger numbers (same levels and residuals)
            fit = solve(problem, kept, part);
        }
        double[] ritz = new double[lines];
        double[] ritzSigma = new double[lines];
        double[] standardised = new double[lines];
        LevelOptimum.LineFlag[] flags = new LevelOptimum.LineFlag[lines];
        double chi2 = 0;
        int used = 0;
        double[] systemChi2 = new double[part.count];
        int[] systemLines = new int[part.count];
        for (int k = 0; k < lines; k++) {
            int u = problem.upper(k);
            int l = problem.lower(k);
            ritz[k] = fit.energy[u] - fit.energy[l];
            if (!(ritz[k] > 0)) {
                throw new RitzException(RitzException.BAD_ASSIGNMENT, String.format(Locale.ROOT,
                        "line %d (%s): its upper level '%s' came out at %.6f cm-1, not above its lower level '%s' "
                        + "at %.6f cm-1 (Ritz wavenumber %.6f cm-1); the assignment is reversed or wrong",
                        k + 1, problem.name(k), problem.levels().get(u), fit.energy[u], problem.levels().get(l),
                        fit.energy[l], ritz[k]));
            }
            ritzSigma[k] = Math.sqrt(fit.variance(problem, k));
            if (!(ritzSigma[k] > 0) || Double.isInfinite(ritzSigma[k])) {
                throw new RitzException(RitzException.SINGULAR, String.format(Locale.ROOT, "line %d (%s): double "
                        + "precision cannot give its Ritz uncertainty (it came out %s): the weighted least-squares "
                        + "problem is numerically singular along it", k + 1, problem.name(k), ritzSigma[k]));
            }
            double s = problem.uncertaintyPerCm(k);
            standardised[k] = fit.normalised(problem, k, kept[k]);
            if (!kept[k]) {
                flags[k] = LevelOptimum.LineFlag.OUTLIER;
                continue;
            }
            double r = problem.wavenumberPerCm(k) - ritz[k];
            chi2 += r * r / (s * s);
            used++;
            systemChi2[part.system[u]] += r * r / (s * s);
            systemLines[part.system[u]]++;
            if (partner[k] >= 0) {
                flags[k] = LevelOptimum.LineFlag.UNRESOLVED;
            } else if (Double.isNaN(standardised[k])) {
                flags[k] = LevelOptimum.LineFlag.DETERMINES_LEVEL;
            } else {
                flags[k] = LevelOptimum.LineFlag.FITTED;
            }
        }
        double[] energy = fit.energy.clone();
        double[][] covariance = new double[energy.length][];
        for (int i = 0; i < energy.length; i++) {
            covariance[i] = fit.covariance[i].clone();
        }
        part.finish(energy, covariance);
        if (!relative) {
            checkAboveGround(problem, part, energy, covariance, kept);
        }
        return new LevelOptimum(problem, energy, covariance, ritz, ritzSigma, standardised, flags, chi2,
                used - (problem.levels().size() - part.count), threshold, leftOut, partner, part.system,
                part.describe(problem, systemLines, systemChi2));
    }

    /**
     * Which system of levels (joined by chains of lines) each level belongs to, the main system (that of
     * the problem's reference) numbered 0 and the others in order of their first level; the level held in
     * each and its energy.
     */
    private static final class Partition {
        /** Per level, its system. */
        final int[] system;
        /** The number of systems. */
        final int count;
        /** Per system, its levels in order. */
        final int[][] members;
        /** Per system, the level held (for a system without a named reference, its first until finish). */
        final int[] held;
        /** Per system, the reference named for it; null for the main system and a system without one. */
        final SystemReference[] named;
        /** Per level, the energy it is held at, cm^-1; NaN for a fitted level. */
        final double[] fixed;

        Partition(int[] system, int count, SystemReference[] named, int[] held, double referencePerCm) {
            this.system = system;
            this.count = count;
            this.named = named;
            this.held = held;
            int[] sizes = new int[count];
            for (int s : system) {
                sizes[s]++;
            }
            members = new int[count][];
            for (int s = 0; s < count; s++) {
                members[s] = new int[sizes[s]];
                sizes[s] = 0;
            }
            for (int i = 0; i < system.length; i++) {
                members[system[i]][sizes[system[i]]++] = i;
            }
            fixed = new double[system.length];
            Arrays.fill(fixed, Double.NaN);
            fixed[held[0]] = referencePerCm;
            for (int s = 1; s < count; s++) {
                fixed[held[s]] = named[s] != null && named[s].isAbsolute() ? named[s].energyPerCm() : 0;
            }
        }

        /** @return the largest energy held, cm^-1 */
        double largestHeld() {
            double largest = 0;
            for (int s = 0; s < count; s++) {
                largest = Math.max(largest, Math.abs(fixed[held[s]]));
            }
            return largest;
        }

        boolean isAbsolute(int s) {
            return s == 0 || (named[s] != null && named[s].isAbsolute());
        }

        /**
         * Holds the lowest level of each system without a named reference instead of its first, so that a fit
         * with these held gives energies and a covariance relative to it directly (the change of zero in
         * {@link #finish} is a difference of covariances, which loses digits where the system holds a precise
         * group far from its first level).
         *
         * @param energy the fitted energies, cm^-1
         * @return whether any system's held level changed (the caller fits again)
         */
        boolean holdLowest(double[] energy) {
            boolean changed = false;
            for (int s = 1; s < count; s++) {
                if (named[s] != null) {
                    continue;
                }
                int low = held[s];
                for (int i : members[s]) {
                    if (energy[i] < energy[low]) {
                        low = i;
                    }
                }
                if (low != held[s]) {
                    fixed[held[s]] = Double.NaN;
                    fixed[low] = 0;
                    held[s] = low;
                    changed = true;
                }
            }
            return changed;
        }

        /**
         * Brings the fitted energies and covariance to the systems' references: a system without a named
         * reference is made relative to its lowest level ({@code E'_i = E_i - E_m}, {@code C'_ij = C_ij - C_im
         * - C_mj + C_mm}, exact: a linear change of the zero; after {@link #holdLowest} and a fit with it held
         * there is nothing left to move but a tie in rounding), and an anchored system's covariance block takes
         * the anchor's variance on every entry ({@code E_i = E_anchor + d_i}, the anchor independent of the
         * lines). Differences within a system, and so the lines' Ritz wavenumbers, are unchanged.
         */
        void finish(double[] energy, double[][] covariance) {
            for (int s = 1; s < count; s++) {
                int[] in = members[s];
                if (named[s] == null) {
                    int low = held[s];
                    for (int i : in) {
                        if (energy[i] < energy[low]) {
                            low = i;
                        }
                    }
                    if (low == held[s]) {
                        continue;
                    }
                    double zero = energy[low];
                    double[] withLow = new double[in.length];
                    for (int a = 0; a < in.length; a++) {
                        withLow[a] = covariance[in[a]][low];
                    }
                    double lowVariance = covariance[low][low];
                    for (int a = 0; a < in.length; a++) {
                        energy[in[a]] -= zero;
                        for (int b = 0; b < in.length; b++) {
                            covariance[in[a]][in[b]] += lowVariance - withLow[a] - withLow[b];
                        }
                    }
                    for (int i : in) {
                        covariance[low][i] = 0;
                        covariance[i][low] = 0;
                    }
                    energy[low] = 0;
                    held[s] = low;
                } else if (named[s].isAbsolute()) {
                    double v = named[s].uncertaintyPerCm() * named[s].uncertaintyPerCm();
                    for (int i : in) {
                        for (int j : in) {
                            covariance[i][j] += v;
                        }
                    }
                }
            }
        }

        List<LevelOptimum.LevelSystem> describe(MeasuredLines problem, int[] lines, double[] chi2) {
            List<LevelOptimum.LevelSystem> out = new ArrayList<>();
            for (int s = 0; s < count; s++) {
                LevelOptimum.Standing standing = s == 0 ? LevelOptimum.Standing.MAIN
                        : isAbsolute(s) ? LevelOptimum.Standing.ANCHORED : LevelOptimum.Standing.FLOATING;
                double at = s == 0 ? problem.referencePerCm() : isAbsolute(s) ? named[s].energyPerCm() : 0;
                double u = isAbsolute(s) && s > 0 ? named[s].uncertaintyPerCm() : 0;
                List<Integer> levels = new ArrayList<>();
                for (int i : members[s]) {
                    levels.add(i);
                }
                out.add(new LevelOptimum.LevelSystem(s, problem.levels().get(held[s]), held[s], standing,
                        s == 0 || named[s] != null, at, u, levels, lines[s], chi2[s],
                        lines[s] - (members[s].length - 1)));
            }
            return List.copyOf(out);
        }
    }

    /**
     * @return the systems of the problem's levels with the level held in each
     * @throws RitzException ({@link RitzException#UNCONNECTED}) when there is more than one system and
     *                       separate systems are not allowed; ({@link RitzException#BAD_ASSIGNMENT}) for a
     *                       system reference that is not a level, lies in the main system or shares its
     *                       system with another, and for a reference level in no line
     */
    private Partition partition(MeasuredLines problem) {
        int n = problem.levels().size();
        int[] parent = new int[n];
        for (int i = 0; i < n; i++) {
            parent[i] = i;
        }
        for (int k = 0; k < problem.size(); k++) {
            int a = root(parent, problem.upper(k));
            int b = root(parent, problem.lower(k));
            parent[a] = b;
        }
        int[] ofRoot = new int[n];
        Arrays.fill(ofRoot, -1);
        int[] system = new int[n];
        List<Integer> first = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            int r = root(parent, i);
            if (ofRoot[r] < 0) {
                ofRoot[r] = first.size();
                first.add(i);
            }
            system[i] = ofRoot[r];
        }
        int count = first.size();
        if (count > 1 && systems == null) {
            List<String> loose = new ArrayList<>();
            for (int i = 1; i < n; i++) {
                if (system[i] != 0) {
                    loose.add("'" + problem.levels().get(i) + "'");
                }
            }
            throw new RitzException(RitzException.UNCONNECTED, String.format(Locale.ROOT,
                    "%d level%s not connected to the reference level '%s' by any chain of lines: %s; to fit each "
                    + "system of levels joined by lines on its own, with its energies relative to one of its levels "
                    + "unless that level's energy is known, allow separate systems "
                    + "(LevelOptimizer.withSeparateSystems)", loose.size(), loose.size() == 1 ? " is" : "s are",
                    problem.reference(), String.join(", ", loose)));
        }
        if (count > 1) {
            boolean touched = false;
            for (int i = 1; i < n && !touched; i++) {
                touched = system[i] == 0;
            }
            if (!touched) {
                throw new RitzException(RitzException.BAD_ASSIGNMENT, "the reference level '" + problem.reference()
                        + "' is in no measured line, so no level is tied to it");
            }
        }
        SystemReference[] named = new SystemReference[count];
        int[] held = new int[count];
        for (int s = 0; s < count; s++) {
            held[s] = first.get(s);
        }
        for (SystemReference r : systems == null ? List.<SystemReference>of() : systems) {
            String label = MeasuredLines.normaliseLabel(r.label());
            int i = problem.levels().indexOf(label);
            if (i < 0) {
                throw new RitzException(RitzException.BAD_REFERENCE, "system reference '" + label
                        + "' is not a level of any measured line");
            }
            if (i == 0) {
                throw new RitzException(RitzException.BAD_REFERENCE, "system reference '" + label + "' is the "
                        + "reference level itself, held in the main system; a system reference is for a system that "
                        + "no line joins to it");
            }
            int s = system[i];
            if (s == 0) {
                throw new RitzException(RitzException.BAD_REFERENCE, "system reference '" + label + "' is joined "
                        + "by lines to the reference level '" + problem.reference() + "', whose system already holds "
                        + "that reference; a system reference is for a system that no line joins to it");
            }
            if (named[s] != null) {
                throw new RitzException(RitzException.BAD_REFERENCE, "system references '"
                        + MeasuredLines.normaliseLabel(named[s].label()) + "' and '" + label + "' are in one system "
                        + "(joined by lines); give one reference per system");
            }
            named[s] = r;
            held[s] = i;
        }
        return new Partition(system, count, named, held, problem.referencePerCm());
    }

    /**
     * The energies and covariance from the kept lines; from a fit from scratch also the factorisation of its
     * weighted design matrix and every line's Ritz variance from it.
     */
    private static final class Fit {
        final double[] energy;
        final double[][] covariance;
        /** The factorisation, for a fit from scratch; null for a downdated one. */
        final WeightedQr factor;
        /** Per level, its unknown in the factorisation, or -1 for a level held; null for a downdated fit. */
        final int[] column;
        /** Per line, its Ritz variance from the factorisation, cm^-2; null for a downdated fit. */
        final double[] ritzVariance;

        Fit(double[] energy, double[][] covariance, WeightedQr factor, int[] column, double[] ritzVariance) {
            this.energy = energy;
            this.covariance = covariance;
            this.factor = factor;
            this.column = column;
            this.ritzVariance = ritzVariance;
        }

        /**
         * The fit without line k by a rank-one downdate of the covariance (Sherman-Morrison, from memory;
         * the leave-one-out update of least squares, Cook and Weisberg 1982, ch. 2): with {@code g = C a},
         * {@code h = w a^T C a}, {@code w = 1 / u_k^2} and the residual r, {@code C' = C + g g^T w / (1 - h)}
         * and {@code E' = E - g w r / (1 - h)}; O(levels^2) where a refit costs a QR of lines x levels.
         *
         * @return the downdated fit, or null where {@code 1 - h < 1e-3} (a line close to alone setting a level:
         *         the update would lose digits, so the caller refits)
         */
        Fit without(MeasuredLines problem, int k) {
            int u = problem.upper(k);
            int l = problem.lower(k);
            double s = problem.uncertaintyPerCm(k);
            double w = 1 / (s * s);
            int n = energy.length;
            double[] g = new double[n];
            for (int i = 0; i < n; i++) {
                g[i] = covariance[i][u] - covariance[i][l];
            }
            double h = w * variance(problem, k);
            if (!(1 - h >= 1e-3)) {
                return null;
            }
            double f = w / (1 - h);
            double r = problem.wavenumberPerCm(k) - (energy[u] - energy[l]);
            double[] e = energy.clone();
            double[][] c = new double[n][n];
            for (int i = 0; i < n; i++) {
                e[i] -= g[i] * f * r;
                for (int j = 0; j < n; j++) {
                    c[i][j] = covariance[i][j] + f * g[i] * g[j];
                }
            }
            return new Fit(e, c, null, null, null);
        }

        /**
         * @return the Ritz variance of line k, the variance of {@code E_u - E_l}, cm^-2: from the factorisation
         *         in a fit from scratch, else the difference {@code C_uu + C_ll - 2 C_ul} of the covariance
         *         (rounding below 0 taken as 0), which the caller uses only where that difference keeps its
         *         digits (see {@link #DOWNDATE_LIMIT})
         */
        double variance(MeasuredLines problem, int k) {
            if (ritzVariance != null) {
                return ritzVariance[k];
            }
            int u = problem.upper(k);
            int l = problem.lower(k);
            return Math.max(0, covariance[u][u] + covariance[l][l] - 2 * covariance[u][l]);
        }

        /** @return the largest variance of a level, cm^-2 */
        double largestLevelVariance() {
            double largest = 0;
            for (int i = 0; i < energy.length; i++) {
                largest = Math.max(largest, covariance[i][i]);
            }
            return largest;
        }

        /** @return the smallest Ritz variance of a kept line, cm^-2 (a fit from scratch) */
        double smallestKeptVariance(boolean[] kept) {
            double smallest = Double.POSITIVE_INFINITY;
            for (int k = 0; k < kept.length; k++) {
                if (kept[k]) {
                    smallest = Math.min(smallest, ritzVariance[k]);
                }
            }
            return smallest;
        }

        /**
         * @return the other kept lines whose residuals are perfectly correlated with line k's (correlation
         *         +-1 within 1e-9: with k they alone join one part of the level system to the rest, so
         *         their normalised residuals are equal in size whatever the data); a new mutable list
         */
        List<Integer> mirrors(MeasuredLines problem, boolean[] kept, int k) {
            List<Integer> found = new ArrayList<>();
            int uk = problem.upper(k);
            int lk = problem.lower(k);
            double sk = problem.uncertaintyPerCm(k);
            double vk = sk * sk - variance(problem, k);
            double[] yk = factor == null ? null : factor.transformed(column[uk], column[lk]);
            for (int j = 0; j < kept.length; j++) {
                if (j == k || !kept[j]) {
                    continue;
                }
                int uj = problem.upper(j);
                int lj = problem.lower(j);
                double sj = problem.uncertaintyPerCm(j);
                double vj = sj * sj - variance(problem, j);
                if (vj <= 1e-9 * sj * sj) {
                    continue;
                }
                // cov(r_j, r_k) = -a_j^T C a_k for two different lines (r = (I - A C A^T W) sigma); from the
                // factorisation y_j . y_k, y = R^-T P^T a, in a fit from scratch
                double c = yk != null ? factor.differenceCovariance(column[uj], column[lj], yk)
                        : covariance[uj][uk] - covariance[uj][lk] - covariance[lj][uk] + covariance[lj][lk];
                if (Math.abs(c) >= (1 - 1e-9) * Math.sqrt(vj * vk)) {
                    found.add(j);
                }
            }
            return found;
        }

        /**
         * @param kept whether line k took part in this fit
         * @return its residual over its standard deviation: {@code sqrt(u^2 - u_Ritz^2)} for a kept line
         *         (NaN when it alone determines a level), {@code sqrt(u^2 + u_Ritz^2)} for one left out
         */
        double normalised(MeasuredLines problem, int k, boolean kept) {
            int u = problem.upper(k);
            int l = problem.lower(k);
            double r = problem.wavenumberPerCm(k) - (energy[u] - energy[l]);
            double s = problem.uncertaintyPerCm(k);
            double v = variance(problem, k);
            if (!kept) {
                return r / Math.sqrt(s * s + v);
            }
            double rest = s * s - v;
            return rest <= 1e-9 * s * s ? Double.NaN : r / Math.sqrt(rest);
        }
    }

    /**
     * Weighted least squares over the kept lines (they connect every level to the level held in its system):
     * the unknowns are the levels not held, numbered in order; covariance 0 between systems. The weighted
     * design matrix is factorised by {@link WeightedQr} with its rows in order of decreasing weight (the
     * most precise lines first, the order that keeps a loose line's own digits); every line's Ritz variance,
     * kept or not, comes from that factorisation.
     */
    private static Fit solve(MeasuredLines problem, boolean[] kept, Partition part) {
        int levels = problem.levels().size();
        int[] column = new int[levels];
        int p = 0;                              // unknowns: every level but those held (the reference: index 0)
        for (int i = 0; i < levels; i++) {
            column[i] = Double.isNaN(part.fixed[i]) ? p++ : -1;
        }
        List<Integer> rows = new ArrayList<>();
        for (int k = 0; k < kept.length; k++) {
            if (kept[k]) {
                rows.add(k);
            }
        }
        // the most precise first (a stable sort: equal uncertainties keep the lines' order)
        rows.sort((x, y) -> Double.compare(problem.uncertaintyPerCm(x), problem.uncertaintyPerCm(y)));
        double[][] a = new double[p][rows.size()];
        double[] b = new double[rows.size()];
        for (int row = 0; row < rows.size(); row++) {
            int k = rows.get(row);
            double w = 1 / problem.uncertaintyPerCm(k);
            int u = problem.upper(k);
            int l = problem.lower(k);
            double rhs = problem.wavenumberPerCm(k);
            if (column[u] < 0) {
                rhs -= part.fixed[u];
            } else {
                a[column[u]][row] += w;
            }
            if (column[l] < 0) {
                rhs += part.fixed[l];
            } else {
                a[column[l]][row] -= w;
            }
            b[row] = rhs * w;
        }
        WeightedQr factor = WeightedQr.of(a);
        if (factor == null) {
            // connectivity was checked, so this is a numerically degenerate system (uncertainties far apart)
            throw new RitzException(RitzException.SINGULAR, "the level system is numerically singular: "
                    + "uncertainties span too many orders of magnitude for the lines given");
        }
        double[] energy = new double[levels];
        double[] solution = factor.solve(b);
        for (int i = 0; i < levels; i++) {
            energy[i] = column[i] < 0 ? part.fixed[i] : solution[column[i]];
        }
        // one step of iterative refinement: the right-hand side of a precise line is its wavenumber over its
        // uncertainty (1e10 for 20 cm-1 known to 2e-9), whose rounding in the reflections reaches the other
        // lines; the residuals are of the order of 1. Measured on PreciseGroupsTest's network: its precise
        // lines' Ritz wavenumbers within 1.3e-13 cm-1 (the rounding of energies near 1000 cm-1) instead of
        // 3.4e-13, their normalised residuals within 5e-5 instead of 3.5e-4
        for (int row = 0; row < rows.size(); row++) {
            int k = rows.get(row);
            b[row] = (problem.wavenumberPerCm(k) - (energy[problem.upper(k)] - energy[problem.lower(k)]))
                    / problem.uncertaintyPerCm(k);
        }
        double[] correction = factor.solve(b);
        for (int i = 0; i < levels; i++) {
            energy[i] += column[i] < 0 ? 0 : correction[column[i]];
        }
        double[][] inverse = factor.covariance();
        double[][] covariance = new double[levels][levels];
        for (int i = 0; i < levels; i++) {
            int ci = column[i];
            if (ci < 0) {
                continue;
            }
            for (int j = 0; j < levels; j++) {
                int cj = column[j];
                if (cj >= 0 && part.system[i] == part.system[j]) {
                    covariance[i][j] = inverse[ci][cj];
                }
            }
        }
        double[] ritzVariance = new double[kept.length];
        for (int k = 0; k < kept.length; k++) {
            ritzVariance[k] = factor.differenceVariance(column[problem.upper(k)], column[problem.lower(k)]);
        }
        return new Fit(energy, covariance, factor, column, ritzVariance);
    }

    /**
     * Refuses uncertainties a double cannot carry through the fit: below {@value #RELATIVE_FLOOR} of
     * the problem's energy scale (the largest energy held plus the largest wavenumber: the size of the level
     * energies, rounded in double precision to about 1.1e-16 of it), or more than {@value #SPREAD_LIMIT}
     * times smaller than the largest uncertainty (weights spread beyond 1e20). Measured on a three-level
     * loop (two lines of u on 100 cm-1, one of 1 cm-1 off by 0.005 cm-1; exact chi^2 2.5e-5): the chi^2
     * is off by 3e-5 of itself at u = 5e-12 of the scale, 3e-3 at 5e-13 (the error grows as the square of
     * the inverse), so the floor keeps it near 1e-3 at worst; a spread of 1e10 alone (u = 1e-6 and
     * 1e4 cm-1) leaves it right to 1e-11. Beyond these the residuals are rounding, and weights of
     * u = 1e-300 overflow.
     */
    private static void checkPrecision(MeasuredLines problem, Partition part) {
        double largestWavenumber = 0;
        double largestU = 0;
        int loosest = 0;
        for (int k = 0; k < problem.size(); k++) {
            largestWavenumber = Math.max(largestWavenumber, problem.wavenumberPerCm(k));
            if (problem.uncertaintyPerCm(k) > largestU) {
                largestU = problem.uncertaintyPerCm(k);
                loosest = k;
            }
        }
        double scale = part.largestHeld() + largestWavenumber;
        for (int k = 0; k < problem.size(); k++) {
            double u = problem.uncertaintyPerCm(k);
            if (u < RELATIVE_FLOOR * scale) {
                throw new RitzException(RitzException.BAD_VALUE, String.format(Locale.ROOT, "line %d (%s): its "
                        + "uncertainty %.3g cm-1 is below %.0e of the level energies' scale %.6g cm-1 "
                        + "(energy held plus the largest wavenumber), finer than double precision carries through "
                        + "the fit; "
                        + "give an uncertainty of at least %.3g cm-1", k + 1, problem.name(k), u, RELATIVE_FLOOR,
                        scale, RELATIVE_FLOOR * scale));
            }
            if (largestU / u > SPREAD_LIMIT) {
                throw new RitzException(RitzException.BAD_VALUE, String.format(Locale.ROOT, "line %d (%s): its "
                        + "uncertainty %.3g cm-1 is more than %.0e times smaller than that of line %d (%s), %.3g cm-1: "
                        + "weights that far apart leave the fit to rounding; leave out the loose line or give "
                        + "uncertainties within a factor %.0e", k + 1, problem.name(k), u, SPREAD_LIMIT, loosest + 1,
                        problem.name(loosest), largestU, SPREAD_LIMIT));
            }
        }
    }

    /**
     * Refuses a level fitted below the ground level: the reference energy (and an anchor's) is an energy
     * above the ground level, so every level of the main and anchored systems lies at 0 or above (floating
     * systems are relative, so not checked). The lowest level more than 3 of its standard uncertainties
     * below 0 is named with the kept lines that set it (a line that alone sets a level and is entered with
     * upper and lower swapped puts it there, with nothing to contradict it).
     */
    private static void checkAboveGround(MeasuredLines problem, Partition part, double[] energy,
            double[][] covariance, boolean[] kept) {
        int i = -1;
        for (int j = 0; j < energy.length; j++) {
            if (!part.isAbsolute(part.system[j]) || j == part.held[part.system[j]]) {
                continue;
            }
            double uj = Math.sqrt(Math.max(0, covariance[j][j]));
            if (energy[j] + 3 * uj < 0 && (i < 0 || energy[j] < energy[i])) {
                i = j;
            }
        }
        if (i >= 0) {
            double u = Math.sqrt(Math.max(0, covariance[i][i]));
            List<String> setting = new ArrayList<>();
            for (int k = 0; k < problem.size(); k++) {
                if (kept[k] && (problem.upper(k) == i || problem.lower(k) == i)) {
                    setting.add(String.format(Locale.ROOT, "line %d (%s: upper '%s', lower '%s', %.6f cm-1)", k + 1,
                            problem.name(k), problem.levels().get(problem.upper(k)),
                            problem.levels().get(problem.lower(k)), problem.wavenumberPerCm(k)));
                }
            }
            int held = part.held[part.system[i]];
            throw new RitzException(RitzException.BAD_ASSIGNMENT, String.format(Locale.ROOT, "level '%s' came out "
                    + "at %.6f +- %.2g cm-1, below the ground level (energies are above the ground level, the "
                    + "reference '%s' at %.6f cm-1), set by %s; the assignment may be reversed (upper and lower "
                    + "swapped) or wrong", problem.levels().get(i), energy[i], u, problem.levels().get(held),
                    part.fixed[held], String.join(", ", setting)));
        }
    }

    private static int root(int[] parent, int i) {
        while (parent[i] != i) {
            parent[i] = parent[parent[i]];
            i = parent[i];
        }
        return i;
    }

    @Override
    public String toString() {
        return "LevelOptimizer[outliers beyond " + threshold + " standard deviations" + (relative
                ? ", levels below 0 allowed" : "") + (systems == null ? "" : ", separate systems"
                + (systems.isEmpty() ? "" : " with references " + systems)) + "]";
    }
}
