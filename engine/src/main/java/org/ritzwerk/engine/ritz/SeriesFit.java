package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.apache.commons.numbers.gamma.RegularizedGamma;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/**
 * The result of a {@link SeriesFitter}: the series limit and each series' quantum-defect
 * coefficients with their covariance, the members' residuals, chi^2, and every model tried with its
 * information criterion; predictions of members not measured. Where the criterion chose the terms,
 * the limit, the defects and the predictions also averaged over the models tried
 * ({@link #modelAveragedLimit()}, {@link #modelAveragedDefects}, {@link #modelAveragedPredictions}),
 * whose uncertainties include that choice. Energies in cm^-1 above the ground level.
 *
 * <p><b>Goodness of fit.</b> The stated uncertainties ({@link #covariance()}) hold only when the
 * model and the data are right: the members follow the Rydberg-Ritz formula with the chosen terms
 * and their stated uncertainties. The result says when that is doubtful: the chance of a chi^2 at
 * least as large for data that follow the model ({@link #chiSquareProbability()},
 * {@code Q(dof / 2, chi^2 / 2)}, the chi-square distribution's upper tail, common practice),
 * improbable below {@value #IMPROBABLE_PROBABILITY}; the scale factor
 * {@code S = sqrt(chi^2 / dof)} when above 1 ({@link #uncertaintyScale()}: common practice, the
 * Birge ratio, as the Particle Data Group scales inconsistent data), by which the uncertainties
 * would grow if every member's uncertainty were understated alike (it does not rescue a wrong
 * member or a wrong model); and every member whose normalised residual {@code (E - E_fit) / u}
 * exceeds {@value #OUTLIER_SIGMA} in size ({@link #isOutlier}, common practice: 3 standard
 * uncertainties, a chance of 0.27 % per member for a normal error). An improbable fit also carries
 * the best refit without one member ({@link #bestDeletion()}). {@link #notes()} puts these into
 * sentences for a reader. Immutable and thread-safe (accessors return copies).
 *
 * <p><b>Repeated measurements.</b> A level measured more than once (two members of one n in a series)
 * gives one residual per measurement (member indices as in {@link RydbergSeries}), counts once per
 * measurement in chi^2, the degrees of freedom and the information criterion, and is predicted once
 * ({@link #predictions}); pairs whose difference exceeds {@value #REPEAT_SIGMA} of its standard uncertainty
 * are named ({@link #repeatedMeasurements()}, {@link #notes()}).
 */
public final class SeriesFit {

    /** A member whose |residual / u| exceeds this is flagged as an outlier (common practice). */
    public static final double OUTLIER_SIGMA = 3;
    /** A fit whose chi-square probability is below this is improbable (common practice: 0.1 %). */
    public static final double IMPROBABLE_PROBABILITY = 1e-3;
    /**
     * A fit whose chance of a chi^2 at most as large is below this is too good: the stated
     * uncertainties look overstated (common practice: the lower tail at the same 0.1 %).
     */
    public static final double TOO_GOOD_PROBABILITY = 1e-3;
    /**
     * Models that give no member at an n and together carry less than this BIC weight are left out of
     * the averaged prediction there ({@link #modelAveragedPredictions}); with more it is withheld (our
     * choice: a model left out with weight w moves the average by about w times its distance from it).
     */
    public static final double NEGLIGIBLE_WEIGHT = 1e-3;
    /**
     * A model with more terms than the chosen one that carries at least this BIC weight and moves the limit by
     * more than {@value #UNSETTLED_SHIFT} of the chosen model's stated standard uncertainty makes the choice of
     * terms unsettled ({@link #unsettledTerms()}; our choice: on strongly perturbed series the criterion drops a
     * needed term while the larger model keeps a weight of 0.1-0.5).
     */
    public static final double UNSETTLED_WEIGHT = 0.05;
    /** The shift, in the chosen model's stated standard uncertainties, above which a larger model unsettles it. */
    public static final double UNSETTLED_SHIFT = 1;
    /**
     * Two measurements of one level whose difference exceeds this many of its standard uncertainties
     * {@code sqrt(u_1^2 + u_2^2)} disagree ({@link Repeat#disagrees()}; common practice: 3 standard
     * uncertainties, as for {@link #OUTLIER_SIGMA}, a chance of 0.27 % per pair for normal errors).
     */
    public static final double REPEAT_SIGMA = 3;

    /**
     * One model the fitter tried.
     *
     * @param terms                 the number of defect terms of each series
     * @param chiSquare             its chi^2
     * @param bic                   its Bayesian information criterion {@code chi^2 + p ln N}
     * @param limitPerCm            its series limit, cm^-1
     * @param limitUncertaintyPerCm that limit's standard uncertainty (stated, unscaled), cm^-1
     */
    public record Candidate(List<Integer> terms, double chiSquare, double bic, double limitPerCm,
            double limitUncertaintyPerCm) {
    }

    /**
     * The series limit averaged over the models tried ({@link #modelAveragedLimit()}).
     *
     * @param limitPerCm       the averaged limit, cm^-1
     * @param uncertaintyPerCm its standard uncertainty, with the spread between the models, cm^-1
     * @param weights          each candidate's weight, in the order of {@link #candidates()}, summing to 1
     */
    public record ModelAverage(double limitPerCm, double uncertaintyPerCm, List<Double> weights) {
    }

    /**
     * A member of a series computed from the fit, with its whole standard uncertainty and its two parts.
     *
     * @param n                   principal quantum number
     * @param energyPerCm         its energy above the ground level, cm^-1
     * @param fitUncertaintyPerCm the standard uncertainty from the fit's covariance alone (stated, unscaled),
     *                            cm^-1
     * @param truncationPerCm     the standard uncertainty for the truncation of the defect expansion below the
     *                            lowest measured member ({@link #predictions}), cm^-1; 0 at or above it
     * @param quantumDefect       delta(n) of the fit
     */
    public record Member(int n, double energyPerCm, double fitUncertaintyPerCm, double truncationPerCm,
            double quantumDefect) {

        /** @return the whole standard uncertainty {@code sqrt(u_fit^2 + u_truncation^2)}, cm^-1 */
        public double uncertaintyPerCm() {
            return uncertaintyPerCm(1);
        }

        /**
         * @param scale the factor for the fit's part (1, or {@link SeriesFit#uncertaintyScale()}), at least 0
         * @return {@code sqrt((scale u_fit)^2 + u_truncation^2)}, cm^-1
         */
        public double uncertaintyPerCm(double scale) {
            return Math.hypot(scale * fitUncertaintyPerCm, truncationPerCm);
        }
    }

    /**
     * A prediction asked of one series ({@link #predictions}, {@link #prediction(int, int)}): the member where
     * the fitted series is physically ordered there, and a note where it is not or where the defect expansion
     * is extrapolated below the lowest measured member.
     *
     * @param series the series index
     * @param n      the principal quantum number asked
     * @param member the predicted member, its uncertainty including the truncation below the measured members;
     *               empty where the prediction is withheld
     * @param note   why there is no member, or that the prediction lies below the measured members; empty
     *               otherwise
     */
    public record Prediction(int series, int n, Optional<Member> member, Optional<String> note) {

        /**
         * @return the member
         * @throws IllegalStateException where the prediction is withheld, with the note saying why
         */
        public Member memberOrThrow() {
            return member.orElseThrow(() -> new IllegalStateException(note.orElse("n = " + n + " is withheld")));
        }
    }

    /**
     * A member of a series averaged over the models tried ({@link #modelAveragedPredictions}).
     *
     * @param series           the series index
     * @param n                the principal quantum number asked
     * @param energyPerCm      {@code E = sum w_k E_k} over the models that give the member, cm^-1 above the
     *                         ground level; empty where withheld
     * @param uncertaintyPerCm its unconditional standard uncertainty {@code sqrt(sum w_k (u_k^2 + (E_k - E)^2))},
     *                         u_k each model's own (covariance and, below the lowest member, truncation), cm^-1;
     *                         empty where withheld
     * @param leftOutWeight    the weight of the models that give no member at n, 0 to 1 (left out of the average
     *                         while below {@link #NEGLIGIBLE_WEIGHT})
     * @param note             why it is withheld, that it lies below the measured members, or which models were
     *                         left out; empty otherwise
     */
    public record AveragedPrediction(int series, int n, OptionalDouble energyPerCm, OptionalDouble uncertaintyPerCm,
            double leftOutWeight, Optional<String> note) {
    }

    /**
     * One series' quantum-defect coefficients averaged over the models tried
     * ({@link #modelAveragedDefects(int)}), with their unconditional standard uncertainties.
     *
     * @param defects       d0, d2, ... up to the most terms any model tried gave the series
     * @param uncertainties their standard uncertainties, dimensionless, in the same order
     */
    public record DefectAverage(double[] defects, double[] uncertainties) {

        /**
         * Copies both arrays.
         *
         * @param defects       d0, d2, ...
         * @param uncertainties their standard uncertainties
         */
        public DefectAverage {
            defects = defects.clone();
            uncertainties = uncertainties.clone();
        }

        /** @return a copy of the averaged coefficients d0, d2, ... */
        @Override
        public double[] defects() {
            return defects.clone();
        }

        /** @return a copy of their standard uncertainties */
        @Override
        public double[] uncertainties() {
            return uncertainties.clone();
        }

        /** Equal when both arrays are equal element by element. */
        @Override
        public boolean equals(Object other) {
            return other instanceof DefectAverage a && Arrays.equals(defects, a.defects)
                    && Arrays.equals(uncertainties, a.uncertainties);
        }

        /** @return a hash of both arrays */
        @Override
        public int hashCode() {
            return 31 * Arrays.hashCode(defects) + Arrays.hashCode(uncertainties);
        }

        /** @return both arrays as text */
        @Override
        public String toString() {
            return "DefectAverage[defects=" + Arrays.toString(defects) + ", uncertainties="
                    + Arrays.toString(uncertainties) + "]";
        }
    }

    /**
     * The refit without one member ({@link #bestDeletion()}): the member left out and what the fit
     * then gives.
     *
     * @param series                the member's series index
     * @param index                 its index in that series
     * @param n                     its n
     * @param where                 where it was read
     * @param chiSquare             the refit's chi^2
     * @param degreesOfFreedom      the refit's degrees of freedom
     * @param probability           the refit's chi-square probability (1 without degrees of freedom)
     * @param limitPerCm            the refit's limit, cm^-1
     * @param limitUncertaintyPerCm its standard uncertainty, cm^-1
     * @param terms                 the refit's terms per series
     */
    public record Deletion(int series, int index, int n, String where, double chiSquare, int degreesOfFreedom,
            double probability, double limitPerCm, double limitUncertaintyPerCm, List<Integer> terms) {
    }

    /**
     * A larger model that unsettles the choice of terms ({@link #unsettledTerms()}).
     *
     * @param terms                    that model's terms per series
     * @param weight                   its BIC weight, 0 to 1
     * @param limitPerCm               its limit, cm^-1
     * @param limitUncertaintyPerCm    that limit's stated standard uncertainty, cm^-1
     * @param limitShiftPerCm          its limit minus the chosen model's, cm^-1
     * @param limitShiftInUncertainties that shift over the chosen model's stated limit uncertainty
     * @param moved                    how it moves each series' d0, and each further coefficient of the chosen
     *                                 model it moves by more than {@value #UNSETTLED_SHIFT} stated uncertainty, as
     *                                 text: name, shift and shift over the chosen model's uncertainty
     */
    public record UnsettledTerms(List<Integer> terms, double weight, double limitPerCm, double limitUncertaintyPerCm,
            double limitShiftPerCm, double limitShiftInUncertainties, List<String> moved) {

        /**
         * Copies the lists.
         *
         * @param terms                     that model's terms per series
         * @param weight                    its BIC weight
         * @param limitPerCm                its limit, cm^-1
         * @param limitUncertaintyPerCm     that limit's stated standard uncertainty, cm^-1
         * @param limitShiftPerCm           its limit minus the chosen model's, cm^-1
         * @param limitShiftInUncertainties that shift over the chosen model's stated limit uncertainty
         * @param moved                     how it moves the coefficients, as text
         */
        public UnsettledTerms {
            terms = List.copyOf(terms);
            moved = List.copyOf(moved);
        }
    }

    /**
     * Two measurements of the same level, one n of one series ({@link #repeatedMeasurements()}): how far
     * apart they lie in the standard uncertainty of their difference. This does not depend on the fit:
     * both measure one energy, so their difference is 0 up to their errors.
     *
     * @param series                   the series index
     * @param n                        the level's n
     * @param first                    the earlier member's index in the series (in the order given)
     * @param second                   the later member's index
     * @param firstWhere               where the earlier was read (a file's line, or a label)
     * @param secondWhere              where the later was read
     * @param differencePerCm          the later's energy minus the earlier's, cm^-1
     * @param combinedUncertaintyPerCm the difference's standard uncertainty {@code sqrt(u_1^2 + u_2^2)}, cm^-1
     * @param identical                whether both give the same energy and the same uncertainty
     */
    public record Repeat(int series, int n, int first, int second, String firstWhere, String secondWhere,
            double differencePerCm, double combinedUncertaintyPerCm, boolean identical) {

        /** @return the difference in its standard uncertainty, {@code (E_2 - E_1) / sqrt(u_1^2 + u_2^2)} */
        public double pull() {
            return differencePerCm / combinedUncertaintyPerCm;
        }

        /** @return whether |{@link #pull()}| exceeds {@value SeriesFit#REPEAT_SIGMA} */
        public boolean disagrees() {
            return Math.abs(pull()) > REPEAT_SIGMA;
        }
    }

    private final SeriesFitter.Model model;
    private final SeriesFitter.Solution chosen;
    private final int[] terms;
    private final double[] parameters;
    private final double[][] covariance;
    private final double chiSquare;
    private final int points;
    /** Every model tried, in the order of {@link #candidates}, the chosen one among them. */
    private final List<SeriesFitter.Solution> tried;
    private final List<Candidate> candidates;
    private final Deletion deletion;
    /**
     * Per model tried and series, the next coefficient and its uncertainty with one more term there (empty:
     * none), computed on first use ({@link #truncationPerCm}).
     */
    private final java.util.concurrent.ConcurrentHashMap<Integer, double[]> nextTerms =
            new java.util.concurrent.ConcurrentHashMap<>();

    SeriesFit(SeriesFitter.Model model, SeriesFitter.Solution chosen, int points, List<SeriesFitter.Solution> tried,
            Deletion deletion) {
        this.model = model;
        this.chosen = chosen;
        this.terms = chosen.terms;
        this.parameters = chosen.parameters;
        this.covariance = chosen.covariance;
        this.chiSquare = chosen.chiSquare;
        this.points = points;
        this.tried = List.copyOf(tried);
        List<Candidate> c = new ArrayList<>();
        for (SeriesFitter.Solution t : tried) {
            c.add(t.candidate(points, model.offset));
        }
        this.candidates = List.copyOf(c);
        this.deletion = deletion;
    }

    /** @return this fit with the deletion diagnostic (null: none) */
    SeriesFit withDeletion(Deletion d) {
        return new SeriesFit(model, chosen, points, tried, d);
    }

    /**
     * For an improbable fit only: the refit (same settings, terms chosen again where the criterion
     * chooses them) without the one member whose removal gives the most probable chi^2. When that
     * refit is consistent, that member alone is the likeliest wrong one; when it is still improbable,
     * more than one member, or the model, is wrong.
     *
     * @return the best refit without one member, or empty for a fit that is not improbable (or where
     *         no refit was possible)
     */
    public Optional<Deletion> bestDeletion() {
        return Optional.ofNullable(deletion);
    }

    /** @return the series fitted, in the order given */
    public List<RydbergSeries> series() {
        return model.series;
    }

    /** @return the reduced-mass Rydberg constant used, cm^-1 */
    public double rydbergPerCm() {
        return model.rydberg;
    }

    /** @return the series limit above the ground level, cm^-1 */
    public double limitPerCm() {
        return model.offset + parameters[0];
    }

    /** @return the limit's standard uncertainty, cm^-1 */
    public double limitUncertaintyPerCm() {
        return Math.sqrt(covariance[0][0]);
    }

    /**
     * The known limit's residual in its own standard uncertainty, {@code (E_limit - L) / u_L}, where
     * the fit was given one ({@link SeriesFitter#withLimit}). The fitted limit is drawn towards L, so
     * a residual beyond about 3 means the members alone put the limit elsewhere: the known limit, its
     * uncertainty or the members' assignment is wrong.
     *
     * @return the normalised residual, or empty without a known limit
     */
    public OptionalDouble knownLimitResidualSigma() {
        double[] known = model.knownLimit;
        return known == null ? OptionalDouble.empty() : OptionalDouble.of((limitPerCm() - known[0]) / known[1]);
    }

    /**
     * @param s series index
     * @return its number of defect terms (1: d0 alone)
     */
    public int terms(int s) {
        return terms[s];
    }

    /**
     * @param s series index
     * @return its coefficients d0, d2, d4, ...
     */
    public double[] defects(int s) {
        return Arrays.copyOfRange(parameters, first(s), first(s) + terms[s]);
    }

    /**
     * @param s series index
     * @return the standard uncertainties of d0, d2, ...
     */
    public double[] defectUncertainties(int s) {
        double[] u = new double[terms[s]];
        for (int k = 0; k < u.length; k++) {
            u[k] = Math.sqrt(covariance[first(s) + k][first(s) + k]);
        }
        return u;
    }

    /**
     * @return the parameter names in the order of {@link #covariance()}: {@code limit}, then per
     *         series {@code <name> d0}, {@code <name> d2}, ...
     */
    public List<String> parameterNames() {
        List<String> names = new ArrayList<>();
        names.add("limit");
        for (int s = 0; s < terms.length; s++) {
            for (int k = 0; k < terms[s]; k++) {
                names.add(model.series.get(s).name() + " d" + 2 * k);
            }
        }
        return names;
    }

    /** @return the parameters' covariance (cm^-2 for the limit, cm^-1 across, 1 among defects), a copy */
    public double[][] covariance() {
        double[][] copy = new double[covariance.length][];
        for (int i = 0; i < copy.length; i++) {
            copy[i] = covariance[i].clone();
        }
        return copy;
    }

    /** @return the weighted sum of squared residuals */
    public double chiSquare() {
        return chiSquare;
    }

    /**
     * @return the number of levels measured: the distinct n of each series, summed over the series (at most
     *         the number of measurements, fewer where a level was measured more than once)
     */
    public int levelsMeasured() {
        return series().stream().mapToInt(one -> one.principalNumbers().length).sum();
    }

    /**
     * @return data minus parameters: every member counts, each measurement of a level measured several times
     *         once (not each distinct n), and the known limit where given
     */
    public int degreesOfFreedom() {
        return points - parameters.length;
    }

    /**
     * @return chi^2 / dof, or empty without degrees of freedom
     */
    public OptionalDouble reducedChiSquare() {
        int dof = degreesOfFreedom();
        return dof > 0 ? OptionalDouble.of(chiSquare / dof) : OptionalDouble.empty();
    }

    /**
     * The chance of a chi^2 at least this large for members that follow the fitted model with their
     * stated uncertainties, {@code Q(dof / 2, chi^2 / 2)} (the regularized upper incomplete gamma
     * function, Apache Commons Numbers 1.1 {@code RegularizedGamma.Q}; common practice). It ignores
     * that the terms were chosen by the data, which makes it somewhat too large.
     *
     * @return the probability, 0 to 1 (0 where it underflows double precision), or empty without
     *         degrees of freedom
     */
    public OptionalDouble chiSquareProbability() {
        int dof = degreesOfFreedom();
        return dof > 0 ? OptionalDouble.of(RegularizedGamma.Q.value(dof / 2.0, chiSquare / 2))
                : OptionalDouble.empty();
    }

    /**
     * @return whether the chi-square probability is below {@value #IMPROBABLE_PROBABILITY}: the model
     *         or the data (a member, its n, its uncertainty) are wrong, and the stated uncertainties do
     *         not hold
     */
    public boolean isImprobable() {
        return chiSquareProbability().orElse(1) < IMPROBABLE_PROBABILITY;
    }

    /**
     * The chance of a chi^2 at most this large for members that follow the fitted model with their
     * stated uncertainties, {@code P(dof / 2, chi^2 / 2)} (the regularized lower incomplete gamma
     * function, Apache Commons Numbers 1.1 {@code RegularizedGamma.P}; common practice).
     *
     * @return the probability, 0 to 1, or empty without degrees of freedom
     */
    public OptionalDouble lowerChiSquareProbability() {
        int dof = degreesOfFreedom();
        return dof > 0 ? OptionalDouble.of(RegularizedGamma.P.value(dof / 2.0, chiSquare / 2))
                : OptionalDouble.empty();
    }

    /**
     * @return whether a chi^2 this small has a chance below {@value #TOO_GOOD_PROBABILITY}
     *         ({@link #lowerChiSquareProbability()}): the members agree with the model far better than
     *         their stated uncertainties allow, so those look overstated (or the members are not
     *         independent measurements, e.g. computed); the stated uncertainties of the fit are then
     *         too large, and {@link #uncertaintyScale()} does not shrink them
     */
    public boolean isTooGood() {
        return lowerChiSquareProbability().orElse(1) < TOO_GOOD_PROBABILITY;
    }

    /**
     * The scale factor {@code S = sqrt(chi^2 / dof)} where above 1, else 1 (and 1 without degrees of
     * freedom): common practice (the Birge ratio; the Particle Data Group's scale factor) multiplies
     * every stated uncertainty by S when the data scatter more than their uncertainties say. It
     * assumes the model right and every uncertainty understated by one factor; it does not rescue an
     * outlier or a wrong model. An S below 1 is not applied (common practice, as the Particle Data
     * Group does): a fit better than its uncertainties is flagged instead ({@link #isTooGood()}).
     *
     * @return S, at least 1
     */
    public double uncertaintyScale() {
        return Math.max(1, Math.sqrt(reducedChiSquare().orElse(1)));
    }

    /**
     * @param s series index
     * @param i member index in that series
     * @return the member's residual in its stated standard uncertainty, {@code (E - E_fit) / u}
     */
    public double normalisedResidual(int s, int i) {
        return residualPerCm(s, i) / model.series.get(s).uncertaintyPerCm(i);
    }

    /**
     * @param s series index
     * @param i member index in that series
     * @return whether |{@link #normalisedResidual}| exceeds {@value #OUTLIER_SIGMA}
     */
    public boolean isOutlier(int s, int i) {
        return Math.abs(normalisedResidual(s, i)) > OUTLIER_SIGMA;
    }

    /**
     * Sentences for a reader on what the fit does not support: an improbable chi^2 (with its
     * probability, the reduced chi^2 and the scale factor), members beyond {@value #OUTLIER_SIGMA}
     * standard uncertainties (series, n, where read, residual / u), members at or above the fitted
     * limit, terms chosen by the criterion under an improbable fit, and an unsettled choice of terms
     * ({@link #unsettledTerms()}: the larger model, its weight, how far it moves the limit and the defects in
     * cm^-1 and in stated uncertainties, and what to quote instead).
     *
     * @return the notes, empty for a fit that gives no cause
     */
    public List<String> notes() {
        List<String> notes = new ArrayList<>();
        if (isImprobable()) {
            notes.add(String.format(Locale.ROOT, "the fit is improbable: chi2 = %.4g for %d degrees of freedom "
                    + "(reduced chi2 %.4g) has a chance of %s for members that follow the Rydberg-Ritz formula "
                    + "with their stated uncertainties. The stated uncertainties assume the model and the data "
                    + "are right, which they are not; scaled by sqrt(reduced chi2) = %.4g they would hold only "
                    + "if every member's uncertainty were understated alike. Check the flagged members (their n, "
                    + "series and energy) and the uncertainties", chiSquare, degreesOfFreedom(),
                    reducedChiSquare().orElseThrow(), probabilityText(chiSquareProbability().orElseThrow()),
                    uncertaintyScale()));
            if (candidates.size() > 1) {
                notes.add("the terms " + Arrays.toString(terms) + " were chosen by the information criterion "
                        + "from an improbable fit: extra terms may only absorb a wrong member; fix them (--terms, "
                        + "SeriesFitter.withTerms) once the data are mended");
            }
        }
        unsettledTerms().ifPresent(u -> {
            ModelAverage average = modelAveragedLimit();
            String larger = u.terms().toString().replace(" ", "");
            String moved = u.moved().isEmpty() ? "" : " and " + String.join(", ", u.moved());
            notes.add(String.format(Locale.ROOT, "the choice of terms %s is unsettled: the model with terms %s, which "
                    + "carries %.2f of the BIC weight (%.2f or more counts), moves the limit by %+.3g cm-1 "
                    + "(%+.2g u)%s, where u is the chosen model's stated standard uncertainty (limit %.6f +- %.2g "
                    + "cm-1): that uncertainty leaves out the choice. Quote the fit with the terms fixed (--terms %s, "
                    + "SeriesFitter.withTerms): limit %.6f +- %.2g cm-1; the model-averaged limit %.6f +- %.2g cm-1 "
                    + "carries only part of the choice", Arrays.toString(terms).replace(" ", ""), larger, u.weight(),
                    UNSETTLED_WEIGHT, u.limitShiftPerCm(), u.limitShiftInUncertainties(), moved, limitPerCm(),
                    limitUncertaintyPerCm(), larger.substring(1, larger.length() - 1), u.limitPerCm(),
                    u.limitUncertaintyPerCm(), average.limitPerCm(), average.uncertaintyPerCm()));
        });
        if (isTooGood()) {
            notes.add(String.format(Locale.ROOT, "the fit is too good: chi2 = %.4g for %d degrees of freedom has a "
                    + "chance of %s of being this small for members that follow the Rydberg-Ritz formula with "
                    + "their stated uncertainties: the uncertainties look overstated (or the members are not "
                    + "independent measurements, e.g. computed), and so do the fit's; S below 1 is not applied",
                    chiSquare, degreesOfFreedom(), probabilityText(lowerChiSquareProbability().orElseThrow())));
        }
        if (deletion != null) {
            boolean consistent = deletion.probability() >= IMPROBABLE_PROBABILITY;
            notes.add(String.format(Locale.ROOT, "refitted without %s n = %d (%s) alone, the fit is %s: chi2 = %.4g "
                    + "for %d degrees of freedom (probability %s), limit %.6f +- %.2g cm-1, terms %s%s",
                    model.series.get(deletion.series()).name(), deletion.n(), deletion.where(),
                    consistent ? "consistent" : "still improbable", deletion.chiSquare(), deletion.degreesOfFreedom(),
                    probabilityText(deletion.probability()), deletion.limitPerCm(), deletion.limitUncertaintyPerCm(),
                    deletion.terms(), consistent ? "; that member is the likeliest wrong one"
                            : "; no single member explains the misfit (several are wrong, or the model)"));
        }
        List<int[]> outliers = new ArrayList<>();
        List<String> above = new ArrayList<>();
        for (int s = 0; s < model.series.size(); s++) {
            RydbergSeries one = model.series.get(s);
            for (int i = 0; i < one.size(); i++) {
                if (isOutlier(s, i)) {
                    outliers.add(new int[] {s, i});
                }
                if (!(one.energyPerCm(i) < limitPerCm())) {
                    above.add(one.name() + " n = " + one.n(i) + " (" + one.where(i) + ")");
                }
            }
        }
        if (!outliers.isEmpty()) {
            // the largest first: one wrong member drags the fit, and with it the others' residuals
            outliers.sort((a, b) -> Double.compare(Math.abs(normalisedResidual(b[0], b[1])),
                    Math.abs(normalisedResidual(a[0], a[1]))));
            List<String> flagged = new ArrayList<>();
            for (int[] o : outliers) {
                RydbergSeries one = model.series.get(o[0]);
                flagged.add(String.format(Locale.ROOT, "%s n = %d (%s, residual/u = %.3g)", one.name(), one.n(o[1]),
                        one.where(o[1]), normalisedResidual(o[0], o[1])));
            }
            notes.add(flagged.size() + (flagged.size() == 1 ? " member lies" : " members lie") + " beyond "
                    + (int) OUTLIER_SIGMA + " standard uncertainties of the fit, the largest first: "
                    + String.join("; ", flagged));
        }
        if (!above.isEmpty()) {
            notes.add(String.format(Locale.ROOT, "%s at or above the fitted limit %.6f cm-1, where no member of "
                    + "a series lies: %s", above.size() == 1 ? "a member is" : above.size() + " members are",
                    limitPerCm(), String.join("; ", above)));
        }
        notes.addAll(repeatNotes());
        return notes;
    }

    /** @return the notes on repeated measurements: pairs that disagree, and pairs given identically */
    private List<String> repeatNotes() {
        List<String> notes = new ArrayList<>();
        List<Repeat> repeats = repeatedMeasurements();
        List<Repeat> disagreeing = new ArrayList<>(repeats.stream().filter(Repeat::disagrees).toList());
        if (!disagreeing.isEmpty()) {
            disagreeing.sort((a, b) -> Double.compare(Math.abs(b.pull()), Math.abs(a.pull())));
            List<String> pairs = new ArrayList<>();
            for (Repeat r : disagreeing) {
                pairs.add(String.format(Locale.ROOT, "%s n = %d (%s and %s: difference %+.3g cm-1, %.3g times its "
                        + "standard uncertainty %.3g cm-1)", model.series.get(r.series()).name(), r.n(), r.firstWhere(),
                        r.secondWhere(), r.differencePerCm(), Math.abs(r.pull()), r.combinedUncertaintyPerCm()));
            }
            notes.add((pairs.size() == 1 ? "two measurements of one level disagree" : pairs.size()
                    + " pairs of measurements of one level disagree") + " by more than " + (int) REPEAT_SIGMA
                    + " standard uncertainties of their difference sqrt(u1^2 + u2^2), the largest first: "
                    + String.join("; ", pairs) + ". Both of each pair enter the fit with their own weights, which "
                    + "assumes their stated uncertainties: one of them, its n or its uncertainty is wrong");
        }
        for (Repeat r : repeats) {
            if (r.identical()) {
                notes.add(String.format(Locale.ROOT, "%s n = %d is given twice with the same energy and uncertainty "
                        + "(%s and %s): both count in the fit as independent measurements; if they are one "
                        + "measurement given twice, remove one, or it weighs double", model.series.get(r.series())
                        .name(), r.n(), r.firstWhere(), r.secondWhere()));
            }
        }
        return notes;
    }

    /**
     * Every pair of measurements of the same n in one series (a level measured more than once: two runs, two
     * papers, two lines reaching it), in series order, then by the earlier member's index, then the later's.
     * Each measurement is an independent datum of the fit with its own residual ({@link #residualPerCm}); the
     * pair's own consistency, which needs no model, is its difference over {@code sqrt(u_1^2 + u_2^2)}
     * ({@link Repeat#pull()}); {@link #notes()} names the pairs beyond {@value #REPEAT_SIGMA} and those given
     * identically (same energy and uncertainty: counted twice, as two measurements, which is wrong if they
     * are one measurement copied).
     *
     * @return the pairs, empty where no n is measured twice
     */
    public List<Repeat> repeatedMeasurements() {
        List<Repeat> out = new ArrayList<>();
        for (int s = 0; s < model.series.size(); s++) {
            RydbergSeries one = model.series.get(s);
            for (int i = 0; i < one.size(); i++) {
                for (int j = i + 1; j < one.size(); j++) {
                    if (one.n(i) != one.n(j)) {
                        continue;
                    }
                    double ui = one.uncertaintyPerCm(i);
                    double uj = one.uncertaintyPerCm(j);
                    double difference = one.energyPerCm(j) - one.energyPerCm(i);
                    out.add(new Repeat(s, one.n(i), i, j, one.where(i), one.where(j), difference, Math.hypot(ui, uj),
                            difference == 0 && ui == uj));
                }
            }
        }
        return out;
    }

    /**
     * Whether the information criterion's choice of terms is unsettled: among the models tried, one whose
     * terms include the chosen model's and more (in any series) carries a BIC weight of at least
     * {@value #UNSETTLED_WEIGHT} ({@link #modelAveragedLimit()}) and moves the limit by more than
     * {@value #UNSETTLED_SHIFT} of the chosen model's stated standard uncertainty, which then leaves out an
     * error of about its own size. On series shaped like Sr-88 5snd 1D2 (d0, d2, d4 of C. L. Vaillant et al.
     * 2012, n = 20-60 step 2, u = 0.001 cm^-1) the criterion drops d4 in about a third of seeded trials, and
     * the chosen limit then lies typically 2-4 stated uncertainties from the truth (README, series section).
     *
     * <p>Only the limit decides. A larger model moves the defects by several of their own uncertainties on
     * nearly every fit, since d0, d2 and d4 are strongly correlated (on a clean two-term series of that shape
     * d0 by about 3 and d2 by more), so a test on them would speak always. The limit test is not sure either
     * way: a model with one superfluous term moves the limit by a random amount of about 1.2 chosen
     * uncertainties on that shape (so a clean series can get the note), and where the data barely ask for
     * the missing term the larger model may move it little though the chosen limit is off (so the note can
     * be missing). Of such models the one of most weight is given. With the terms fixed there is one model
     * and the choice is settled.
     *
     * @return the larger model that unsettles the choice, or empty
     */
    public Optional<UnsettledTerms> unsettledTerms() {
        double[] w = weights();
        UnsettledTerms found = null;
        double chosenLimitU = limitUncertaintyPerCm();
        for (int m = 0; m < tried.size(); m++) {
            SeriesFitter.Solution t = tried.get(m);
            if (t == chosen || w[m] < UNSETTLED_WEIGHT || !includes(t.terms, terms)
                    || (found != null && w[m] <= found.weight())) {
                continue;
            }
            double limitShift = t.parameters[0] - parameters[0];
            if (!(Math.abs(limitShift) > UNSETTLED_SHIFT * chosenLimitU)) {
                continue;
            }
            List<String> moved = new ArrayList<>();
            for (int s = 0; s < terms.length; s++) {
                for (int k = 0; k < terms[s]; k++) {
                    double shift = t.parameters[first(t.terms, s) + k] - parameters[first(s) + k];
                    double u = Math.sqrt(covariance[first(s) + k][first(s) + k]);
                    if (k == 0 || Math.abs(shift) > UNSETTLED_SHIFT * u) {
                        moved.add(String.format(Locale.ROOT, "%s d%d by %+.3g (%+.2g u)", model.series.get(s).name(),
                                2 * k, shift, shift / u));
                    }
                }
            }
            Candidate c = candidates.get(m);
            found = new UnsettledTerms(c.terms(), w[m], c.limitPerCm(), c.limitUncertaintyPerCm(), limitShift,
                    limitShift / chosenLimitU, moved);
        }
        return Optional.ofNullable(found);
    }

    /** @return whether every series of {@code larger} has at least the terms of {@code smaller}, and one more */
    private static boolean includes(int[] larger, int[] smaller) {
        boolean more = false;
        for (int s = 0; s < smaller.length; s++) {
            if (larger[s] < smaller[s]) {
                return false;
            }
            more |= larger[s] > smaller[s];
        }
        return more;
    }

    /** @return every model tried, in order, the chosen one among them */
    public List<Candidate> candidates() {
        return candidates;
    }

    /**
     * The limit averaged over the models tried, with BIC weights
     * {@code w_k = exp(-(BIC_k - BIC_min) / 2) / sum}, the average {@code L = sum w_k L_k} and the
     * unconditional standard uncertainty {@code u = sqrt(sum w_k (u_k^2 + (L_k - L)^2))} (K. P. Burnham and
     * D. R. Anderson, Model Selection and Multimodel Inference, 2nd ed. (2002), the form that squares
     * inside the sum, which they give beside S. T. Buckland, K. P. Burnham and N. H. Augustin, Biometrics
     * 53, 603 (1997), eq. 9, {@code u = sum w_k sqrt(u_k^2 + (L_k - L)^2)}; both from memory). The
     * defects and predictions are averaged the same way ({@link #modelAveragedDefects},
     * {@link #modelAveragedPredictions}); for the limit the two forms differ little (rms pull 0.92-0.94
     * against 0.93-0.95 on the seeded series of {@link SeriesFitter}). It carries the uncertainty of the
     * choice of terms, which {@link #limitUncertaintyPerCm()} (the chosen model's alone) leaves out: see
     * {@link SeriesFitter} for the coverage of both on seeded series. The models are those the stepwise
     * search tried, not every combination of terms; with the terms fixed there is one, and the average is
     * the fit's own limit.
     *
     * @return the averaged limit, its uncertainty and the weights
     */
    public ModelAverage modelAveragedLimit() {
        double[] w = weights();
        double[] x = new double[w.length];
        double[] v = new double[w.length];
        boolean[] all = new boolean[w.length];
        List<Double> weights = new ArrayList<>();
        for (int k = 0; k < w.length; k++) {
            Candidate c = candidates.get(k);
            x[k] = c.limitPerCm();
            v[k] = c.limitUncertaintyPerCm() * c.limitUncertaintyPerCm();
            all[k] = true;
            weights.add(w[k]);
        }
        double[] a = mixture(w, x, v, all);
        return new ModelAverage(a[0], a[1], List.copyOf(weights));
    }

    /** @return the BIC weight of each model tried, in the order of {@link #candidates()}, summing to 1 */
    private double[] weights() {
        double lowest = Double.POSITIVE_INFINITY;
        for (Candidate c : candidates) {
            lowest = Math.min(lowest, c.bic());
        }
        double[] w = new double[candidates.size()];
        double sum = 0;
        for (int k = 0; k < w.length; k++) {
            w[k] = Math.exp(-(candidates.get(k).bic() - lowest) / 2);
            sum += w[k];
        }
        for (int k = 0; k < w.length; k++) {
            w[k] /= sum;
        }
        return w;
    }

    /**
     * The mixture mean and unconditional standard uncertainty over the models: {@code x = sum w_k x_k},
     * {@code u = sqrt(sum w_k (v_k + (x_k - x)^2))}, the weights renormalised over the models taken.
     *
     * @param w     each model's weight
     * @param x     each model's value
     * @param v     each model's variance
     * @param taken which models to take
     * @return {x, u}
     */
    private static double[] mixture(double[] w, double[] x, double[] v, boolean[] taken) {
        double sum = 0;
        double mean = 0;
        for (int k = 0; k < w.length; k++) {
            if (taken[k]) {
                sum += w[k];
                mean += w[k] * x[k];
            }
        }
        mean /= sum;
        double variance = 0;
        for (int k = 0; k < w.length; k++) {
            if (taken[k]) {
                double spread = x[k] - mean;
                variance += w[k] / sum * (v[k] + spread * spread);
            }
        }
        return new double[] {mean, Math.sqrt(variance)};
    }

    /**
     * The quantum-defect coefficients of series s averaged over the models tried, with the BIC weights of
     * {@link #modelAveragedLimit()}: {@code d = sum w_k d_k} and the unconditional standard uncertainty
     * {@code u = sqrt(sum w_k (u_k^2 + (d_k - d)^2))}, a term a model lacks taken as 0 with no
     * uncertainty in that model (K. P. Burnham and D. R. Anderson, Model Selection and Multimodel
     * Inference, 2nd ed. (2002), the unconditional variance of a model-averaged estimate over all the
     * models, the form that squares inside the sum; after S. T. Buckland, K. P. Burnham and N. H.
     * Augustin, Biometrics 53, 603 (1997); from memory). It carries the uncertainty of the choice of
     * terms, which {@link #defectUncertainties} (the chosen model's alone) leaves out, and a term only
     * some models hold is drawn towards 0 by the weight of those that lack it. Coverage on seeded series:
     * see {@link SeriesFitter}. With the terms fixed there is one model and these are the fit's own.
     *
     * @param s series index
     * @return d0, d2, ... up to the most terms any model tried gave series s
     * @throws IllegalArgumentException for a series index out of range
     */
    public double[] modelAveragedDefects(int s) {
        return averagedDefects(s)[0];
    }

    /**
     * @param s series index
     * @return the unconditional standard uncertainties of {@link #modelAveragedDefects}, dimensionless
     * @throws IllegalArgumentException for a series index out of range
     */
    public double[] modelAveragedDefectUncertainties(int s) {
        return averagedDefects(s)[1];
    }

    /**
     * {@link #modelAveragedDefects} and {@link #modelAveragedDefectUncertainties} from one averaging.
     *
     * @param s series index
     * @return series s's averaged defect coefficients and their uncertainties
     * @throws IllegalArgumentException for a series index out of range
     */
    public DefectAverage modelAveragedDefectsWithUncertainties(int s) {
        double[][] a = averagedDefects(s);
        return new DefectAverage(a[0], a[1]);
    }

    /** @return {values, uncertainties} of series s's averaged defect coefficients */
    private double[][] averagedDefects(int s) {
        checkSeries(s);
        int most = 0;
        for (SeriesFitter.Solution t : tried) {
            most = Math.max(most, t.terms[s]);
        }
        double[] w = weights();
        boolean[] all = new boolean[w.length];
        Arrays.fill(all, true);
        double[][] out = new double[2][most];
        for (int k = 0; k < most; k++) {
            double[] x = new double[w.length];
            double[] v = new double[w.length];
            for (int m = 0; m < w.length; m++) {
                SeriesFitter.Solution t = tried.get(m);
                if (k < t.terms[s]) {
                    int at = first(t.terms, s) + k;
                    x[m] = t.parameters[at];
                    v[m] = t.covariance[at][at];
                }
            }
            double[] a = mixture(w, x, v, all);
            out[0][k] = a[0];
            out[1][k] = a[1];
        }
        return out;
    }

    /**
     * Every asked member of every series averaged over the models tried, in series order then in the
     * order asked: each model's prediction ({@link #predictions}, with its safeguards: withheld where
     * that model's series is not physically ordered or lies below the ground level, below the lowest
     * member widened by that model's truncation or withheld for a model with d0 alone) weighted by the
     * BIC weights of {@link #modelAveragedLimit()}, {@code E = sum w_k E_k},
     * {@code u = sqrt(sum w_k (u_k^2 + (E_k - E)^2))} with u_k that model's whole uncertainty (its
     * covariance's and its truncation's in quadrature; Burnham and Anderson 2002, as for
     * {@link #modelAveragedDefects}). Models that give no member at an n are left out there (the rest
     * renormalised, the weight left out given) while together they carry less than
     * {@value #NEGLIGIBLE_WEIGHT} of the weight; with more the averaged prediction is withheld, so it
     * is withheld wherever the chosen model's is (the chosen model carries the most weight, at least
     * 1 / the number of models). With the terms fixed there is one model and these are
     * {@link #predictions}.
     *
     * @param n principal quantum numbers, each at least 1
     * @return the averaged predictions
     * @throws IllegalArgumentException for an n below 1
     */
    public List<AveragedPrediction> modelAveragedPredictions(int... n) {
        checkN(n);
        double[] w = weights();
        List<AveragedPrediction> out = new ArrayList<>();
        for (int s = 0; s < model.series.size(); s++) {
            for (int k : n) {
                out.add(averagedPrediction(w, s, k));
            }
        }
        return out;
    }

    private AveragedPrediction averagedPrediction(double[] w, int s, int k) {
        Prediction mine = prediction(chosen, s, k);
        double[] x = new double[w.length];
        double[] v = new double[w.length];
        boolean[] taken = new boolean[w.length];
        double leftOut = 0;
        List<String> lacking = new ArrayList<>();
        String firstReason = null;
        for (int m = 0; m < w.length; m++) {
            Prediction p = tried.get(m) == chosen ? mine : prediction(tried.get(m), s, k);
            if (p.member().isPresent()) {
                x[m] = p.member().get().energyPerCm();
                double u = p.member().get().uncertaintyPerCm();
                v[m] = u * u;
                taken[m] = true;
            } else {
                leftOut += w[m];
                lacking.add(candidates.get(m).terms().toString().replace(" ", ""));
                firstReason = firstReason == null ? p.note().orElse("") : firstReason;
            }
        }
        String name = model.series.get(s).name();
        if (mine.member().isEmpty()) {
            return new AveragedPrediction(s, k, OptionalDouble.empty(), OptionalDouble.empty(), leftOut, mine.note());
        }
        if (leftOut >= NEGLIGIBLE_WEIGHT) {
            return new AveragedPrediction(s, k, OptionalDouble.empty(), OptionalDouble.empty(), leftOut, Optional.of(
                    String.format(Locale.ROOT, "the model-averaged %s n = %d is withheld: the models with terms %s, "
                    + "%.3g of the weight, give no member there (%s)", name, k, String.join(", ", lacking), leftOut,
                    firstReason)));
        }
        double[] a = mixture(w, x, v, taken);
        Optional<String> note = mine.note();
        if (leftOut > 0) {
            String more = String.format(Locale.ROOT, "the models with terms %s, %.2g of the weight, give no member "
                    + "of %s at n = %d and are left out of its average", String.join(", ", lacking), leftOut, name, k);
            note = Optional.of(note.map(t -> t + "; " + more).orElse(more));
        }
        return new AveragedPrediction(s, k, OptionalDouble.of(a[0]), OptionalDouble.of(a[1]), leftOut, note);
    }

    /**
     * @param s series index
     * @param i member index in that series
     * @return measured minus fitted energy, cm^-1
     */
    public double residualPerCm(int s, int i) {
        RydbergSeries one = model.series.get(s);
        return one.energyPerCm(i) - member(s, one.n(i)).energyPerCm();
    }

    /**
     * @param s series index
     * @param i member index
     * @return the member's effective quantum defect {@code n - sqrt(R_M / (E_limit - E))}, from its
     *         measured energy and the fitted limit (for a plot of delta against n); a member at or
     *         above the fitted limit, which a converged fit does not leave, gives n
     */
    public double measuredDefect(int s, int i) {
        RydbergSeries one = model.series.get(s);
        double binding = limitPerCm() - one.energyPerCm(i);
        return binding > 0 ? one.n(i) - Math.sqrt(model.rydberg / binding) : one.n(i);
    }

    /**
     * @param p a probability
     * @return it with two digits, or {@code below 1e-300} where it underflowed to 0
     */
    public static String probabilityText(double p) {
        return p > 0 ? String.format(Locale.ROOT, "%.2g", p) : "below 1e-300";
    }

    /**
     * The standard uncertainty of {@link #measuredDefect} from the member's energy uncertainty alone,
     * {@code u(delta) = n*^3 u(E) / (2 R_M)} with {@code n* = sqrt(R_M / (E_limit - E))}
     * (the derivative of {@code n - sqrt(R_M / (E_limit - E))} in E). The limit's uncertainty, common
     * to all members of all series, is left out.
     *
     * @param s series index
     * @param i member index
     * @return u(delta), dimensionless, or empty for a member at or above the fitted limit
     */
    public OptionalDouble measuredDefectUncertainty(int s, int i) {
        RydbergSeries one = model.series.get(s);
        double binding = limitPerCm() - one.energyPerCm(i);
        if (!(binding > 0)) {
            return OptionalDouble.empty();
        }
        double nStar = Math.sqrt(model.rydberg / binding);
        return OptionalDouble.of(nStar * nStar * nStar * one.uncertaintyPerCm(i) / (2 * model.rydberg));
    }

    /**
     * The fitted quantum defect as a smooth function of n,
     * {@code delta(n) = d0 + d2 / (n - d0)^2 + d4 / (n - d0)^4 + ...} (for drawing the fitted curve).
     *
     * @param s series index
     * @param n principal quantum number, real, above the series' d0
     * @return delta(n), dimensionless
     * @throws IllegalArgumentException for n not finite or not above d0
     */
    public double fittedDefect(int s, double n) {
        double[] d = defects(s);
        if (!(n > d[0]) || Double.isInfinite(n)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "n must be finite and above d0 = %.6f of "
                    + "series %s, got %s", d[0], model.series.get(s).name(), n));
        }
        return AlkaliAtom.rydbergRitzDefect(Arrays.stream(d).boxed().toList(), n);
    }

    /**
     * Every asked member of every series, in series order then in the order asked. A prediction is
     * given only where the fitted series is physically ordered: from the asked n up through the
     * series' fitted members (or from them up to it) every member's effective n {@code n - delta(n)}
     * is positive, its energy lies below the limit (binding energy positive) and rises with n, and the
     * asked member lies at or above 0, the ground level. Elsewhere the prediction has no member and a
     * note naming the series, n and the reason, and the other series are still predicted.
     *
     * <p><b>Below the lowest measured member</b> the defect expansion is extrapolated downwards, where
     * its truncation dominates: the terms left out grow as {@code (n - d0)^-2} per order. The
     * prediction then carries, in quadrature with the fit's uncertainty ({@link
     * Member#uncertaintyPerCm()}), the error a first omitted term {@code c / (n - d0)^(2k)} leaves at n
     * after the fit has absorbed what it can of it at the members (first-order propagation through the
     * weighted fit), with |c| the smaller of the common-practice bound (the first omitted term no larger
     * than the last kept one at n, {@code |d_last| (n - d0)^2}) and what the fit with one more term says of
     * c ({@code sqrt(c'^2 + u'^2)}). Far below the members this is about the last kept term's size at n
     * carried to energy, {@code |d_last / (n - d0)^(2k-2)| 2 R_M / (n - delta(n))^3}, as before; just below
     * them, and where the data show how large the next term is, it is smaller. On seeded series (README,
     * series section) the whole uncertainty covers at about the nominal rate where the model lacks a term the
     * truth has (rms pull 0.8-1.05, |error| within 2 u in 97-98 %), and conservatively where it lacks none (rms
     * pull 0.27-0.61), where the covariance alone (rms 1.1-1.2) would do; the former rule gave rms pulls of
     * 0.004-0.25. A series fitted with d0 alone gives no such estimate, and its members below the lowest
     * measured one are withheld. Checked on Rb-87 nS1/2 and nD5/2 members n = 20-40 (the README's example):
     * 5s, 6s, 4d5/2, 5d5/2 and 6d5/2 then come out within their stated uncertainty of the known levels (from
     * memory), and 4s, below the ground level, is withheld ({@code SeriesFitterTest}).
     *
     * @param n principal quantum numbers, each at least 1
     * @return the predictions
     * @throws IllegalArgumentException for an n below 1
     */
    public List<Prediction> predictions(int... n) {
        checkN(n);
        List<Prediction> out = new ArrayList<>();
        for (int s = 0; s < model.series.size(); s++) {
            for (int k : n) {
                out.add(prediction(chosen, s, k));
            }
        }
        return out;
    }

    private static void checkN(int... n) {
        for (int k : n) {
            if (k < 1) {
                throw new IllegalArgumentException("n must be at least 1, got " + k);
            }
        }
    }

    /** The prediction of member n of series s by one model tried, with the safeguards of {@link #predictions}. */
    private Prediction prediction(SeriesFitter.Solution t, int s, int k) {
        RydbergSeries one = model.series.get(s);
        int lowest = Integer.MAX_VALUE;
        int highest = Integer.MIN_VALUE;
        for (int i = 0; i < one.size(); i++) {
            lowest = Math.min(lowest, one.n(i));
            highest = Math.max(highest, one.n(i));
        }
        Member member;
        try {
            member = checkedMember(t, s, k);
        } catch (IllegalArgumentException e) {
            return withheld(s, k, e.getMessage() + "; not predicted");
        }
        String disorder = disorder(t, s, Math.min(k, lowest), Math.max(k, highest));
        if (disorder != null) {
            return withheld(s, k, String.format(Locale.ROOT, "series %s is not physically ordered from "
                    + "n = %d to %d in the fit: %s; n = %d not predicted", one.name(), Math.min(k, lowest),
                    Math.max(k, highest), disorder, k));
        }
        if (member.energyPerCm() < 0) {
            return withheld(s, k, String.format(Locale.ROOT, "series %s at n = %d comes out below the "
                    + "ground level (energies are above it): no such level; not predicted", one.name(), k));
        }
        if (k >= lowest) {
            return new Prediction(s, k, Optional.of(member), Optional.empty());
        }
        if (t.terms[s] < 2) {
            return withheld(s, k, String.format(Locale.ROOT, "n = %d lies below the lowest member of %s "
                    + "(n = %d) and the series was fitted with d0 alone: the truncation of the defect "
                    + "expansion extrapolated downwards cannot be estimated; not predicted", k, one.name(),
                    lowest));
        }
        double truncation = truncationPerCm(t, s, k, member.quantumDefect());
        Member whole = new Member(k, member.energyPerCm(), member.fitUncertaintyPerCm(), truncation,
                member.quantumDefect());
        return new Prediction(s, k, Optional.of(whole), Optional.of(String.format(Locale.ROOT,
                "n = %d lies below the lowest member of %s (n = %d): the defect expansion is extrapolated "
                + "downwards there; its uncertainty includes %.3g cm-1 for the truncation (the part the fit "
                + "cannot absorb of a next term as large as the last fitted one at n = %d allows, or as the data "
                + "show it)", k, one.name(), lowest, truncation, k)));
    }

    private static Prediction withheld(int s, int n, String note) {
        return new Prediction(s, n, Optional.empty(), Optional.of(note));
    }

    /**
     * @return why the series as one model fits it is not physically ordered from n = from to n = to (a
     *         member with no positive effective n, at or above the limit, or not above the one below
     *         it), or null
     */
    private String disorder(SeriesFitter.Solution t, int s, int from, int to) {
        List<Double> c = SeriesFitter.Model.coefficients(t.parameters, first(t.terms, s), t.terms[s]);
        double below = Double.NEGATIVE_INFINITY;
        double limit = model.offset + t.parameters[0];
        for (int m = from; m <= to; m++) {
            double delta = AlkaliAtom.rydbergRitzDefect(c, m);
            if (!(m - delta > 0)) {
                return String.format(Locale.ROOT, "n = %d has no positive effective n (delta %.4g)", m, delta);
            }
            double e = limit - model.rydberg / ((m - delta) * (m - delta));
            if (!(e < limit)) {
                return String.format(Locale.ROOT, "n = %d lies at or above the limit", m);
            }
            if (!(e > below)) {
                return String.format(Locale.ROOT, "the energy does not rise from n = %d to %d (delta %.4g at n = %d)",
                        m - 1, m, delta, m);
            }
            below = e;
        }
        return null;
    }

    /**
     * The truncation's standard uncertainty at n below the lowest member (see {@link #predictions}):
     * {@code u_trunc = c_max |r(n)|}, the part r(n) of a first omitted term {@code c / (n - d0)^(2k)} (k the
     * series' number of terms) that the fit cannot absorb, times the size c_max its coefficient may have.
     *
     * <p><b>What the fit absorbs.</b> An omitted term h_i at the members moves the weighted fit's parameters by
     * {@code C J^T W h} (first order: C the covariance, J the Jacobian, W the weights) and so its prediction at n
     * by {@code a(n) = G(n)^T C J^T W h}, G(n) the gradient of E(n) in the parameters; the prediction then misses
     * the term by {@code r(n) = h(n) - a(n)}. Far below the members a(n) is small beside h(n); just below them
     * the limit, d0 and the kept terms take up most of the term, and r(n) is a fraction of h(n).
     *
     * <p><b>How large the coefficient may be.</b> The smaller of two sizes: the first omitted term taken as no
     * larger than the last kept one at n (common practice), {@code |c| <= |d_last| (n - d0)^2}; and, where the
     * fit with one more term in this series converges, what the data say of that term's coefficient c' with its
     * standard uncertainty u', the root mean square {@code sqrt(c'^2 + u'^2)}. So a term the data show
     * enters at about its own size, and one they do not show no larger than the common-practice bound.
     *
     * @return the truncation's standard uncertainty at n, cm^-1
     */
    private double truncationPerCm(SeriesFitter.Solution t, int s, int n, double delta) {
        int at = first(t.terms, s);
        int count = t.terms[s];
        double d0 = t.parameters[at];
        double last = t.parameters[at + count - 1];
        // the omitted term with coefficient 1, at each member of series s, weighted: J^T W h
        int p = t.parameters.length;
        double[] value = new double[points];
        double[][] jacobian = new double[points][p];
        model.evaluate(t.terms, t.parameters, value, jacobian, true);
        double[] jtwh = new double[p];
        int row = 0;
        for (int k = 0; k < model.series.size(); k++) {
            RydbergSeries one = model.series.get(k);
            for (int i = 0; i < one.size(); i++, row++) {
                if (k != s) {
                    continue;
                }
                double h = omittedTerm(t, s, one.n(i), count) / one.uncertaintyPerCm(i);
                for (int j = 0; j < p; j++) {
                    jtwh[j] += jacobian[row][j] * h;
                }
            }
        }
        double[] g = new double[count];
        model.energy(t.parameters[0], SeriesFitter.Model.coefficients(t.parameters, at, count), n, g);
        double[] gradient = new double[p];
        gradient[0] = 1;
        System.arraycopy(g, 0, gradient, at, count);
        double absorbed = 0;
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                absorbed += gradient[a] * t.covariance[a][b] * jtwh[b];
            }
        }
        double left = omittedTerm(t, s, n, count) - absorbed;
        double size = Math.abs(last) * (n - d0) * (n - d0);
        double[] shown = nextTerm(t, s);
        if (shown != null) {
            size = Math.min(size, Math.hypot(shown[0], shown[1]));
        }
        return size * Math.abs(left);
    }

    /**
     * @return series s's next coefficient and its standard uncertainty in the fit of model t with one more
     *         term there (a model tried, or fitted now and kept), or null where that fit has no degree of
     *         freedom or does not converge
     */
    private double[] nextTerm(SeriesFitter.Solution t, int s) {
        int index = 0;
        while (tried.get(index) != t) {
            index++;
        }
        double[] found = nextTerms.computeIfAbsent(index * model.series.size() + s, key -> {
            int[] more = t.terms.clone();
            more[s]++;
            if (points < 1 + Arrays.stream(more).sum() + 1) {
                return new double[0];
            }
            SeriesFitter.Solution larger = null;
            for (SeriesFitter.Solution u : tried) {
                larger = Arrays.equals(u.terms, more) ? u : larger;
            }
            larger = larger != null ? larger : model.solve(more, model.extend(t, more));
            if (larger == null) {
                return new double[0];
            }
            int at = first(more, s) + more[s] - 1;
            return new double[] {larger.parameters[at], Math.sqrt(larger.covariance[at][at])};
        });
        return found.length == 0 ? null : found;
    }

    /** @return the energy of a defect term {@code 1 / (n - d0)^(2 order)} in series s at n, cm^-1 */
    private double omittedTerm(SeriesFitter.Solution t, int s, int n, int order) {
        int at = first(t.terms, s);
        List<Double> c = SeriesFitter.Model.coefficients(t.parameters, at, t.terms[s]);
        double d0 = c.get(0);
        double nu = n - AlkaliAtom.rydbergRitzDefect(c, n);
        return -2 * model.rydberg / (nu * nu * nu) * Math.pow((n - d0) * (n - d0), -order);
    }

    /**
     * One member of one series, by the one rule of {@link #predictions}: withheld (an empty member and a note)
     * where the fitted series is not physically ordered, and below the lowest measured member with the
     * truncation of the defect expansion in its uncertainty. {@code prediction(s, n)} is
     * {@code predictions(n).get(s)}.
     *
     * @param s series index
     * @param n principal quantum number (measured or not), at least 1
     * @return the prediction
     * @throws IllegalArgumentException for a series index out of range or n below 1
     */
    public Prediction prediction(int s, int n) {
        checkSeries(s);
        checkN(n);
        return prediction(chosen, s, n);
    }

    private void checkSeries(int s) {
        if (s < 0 || s >= model.series.size()) {
            throw new IllegalArgumentException("series index " + s + " out of range: the fit has "
                    + model.series.size() + " series");
        }
    }

    private Member checkedMember(SeriesFitter.Solution t, int s, int n) {
        Member member = member(t, s, n);
        if (!(n - member.quantumDefect() > 0) || !Double.isFinite(member.energyPerCm())) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "series %s has no member at n = %d:"
                    + " its fitted defect %.4f leaves no positive effective n", model.series.get(s).name(), n,
                    member.quantumDefect()));
        }
        return member;
    }

    private Member member(int s, int n) {
        return member(chosen, s, n);
    }

    /** Member n of series s as model t gives it, its uncertainty {@code sqrt(g^T C g)} from t's covariance. */
    private Member member(SeriesFitter.Solution t, int s, int n) {
        double[] q = t.parameters;
        int at = first(t.terms, s);
        List<Double> c = SeriesFitter.Model.coefficients(q, at, t.terms[s]);
        double[] g = new double[t.terms[s]];
        double e = model.energy(q[0], c, n, g);
        double[] full = new double[q.length];
        full[0] = 1;
        System.arraycopy(g, 0, full, at, g.length);
        double v = 0;
        for (int a = 0; a < full.length; a++) {
            for (int b = 0; b < full.length; b++) {
                v += full[a] * t.covariance[a][b] * full[b];
            }
        }
        double defect = AlkaliAtom.rydbergRitzDefect(c, n);
        return new Member(n, model.offset + e, Math.sqrt(Math.max(0, v)), 0, defect);
    }

    private int first(int s) {
        return first(terms, s);
    }

    /** @return the index of series s's d0 in a parameter vector of these terms */
    private static int first(int[] terms, int s) {
        int at = 1;
        for (int k = 0; k < s; k++) {
            at += terms[k];
        }
        return at;
    }

    @Override
    public String toString() {
        return "SeriesFit[limit " + limitPerCm() + " +- " + limitUncertaintyPerCm() + " cm-1, terms "
                + Arrays.toString(terms) + ", chi2 " + chiSquare + " for " + degreesOfFreedom() + " dof]";
    }
}
