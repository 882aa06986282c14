package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import org.apache.commons.math4.legacy.core.Pair;
import org.apache.commons.math4.legacy.exception.MathIllegalStateException;
import org.apache.commons.math4.legacy.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math4.legacy.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math4.legacy.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math4.legacy.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math4.legacy.linear.Array2DRowRealMatrix;
import org.apache.commons.math4.legacy.linear.ArrayRealVector;
import org.apache.commons.math4.legacy.linear.RealMatrix;
import org.apache.commons.math4.legacy.linear.SingularValueDecomposition;
import org.apache.commons.math4.legacy.linear.SingularMatrixException;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/**
 * Rydberg-Ritz fits of measured series: the series limit and the quantum-defect expansion of each
 * series, from the members' energies, by weighted least squares (Levenberg-Marquardt, Apache
 * Commons Math). The model is the modified Rydberg-Ritz formula of
 * {@link AlkaliAtom#rydbergRitzEnergy} (T. F. Gallagher, Rydberg Atoms (1994), eq. 16.19),
 * {@code E(n) = E_limit - R_M / (n - delta(n))^2},
 * {@code delta(n) = d0 + d2 / (n - d0)^2 + d4 / (n - d0)^4 + ...}, with the species' reduced-mass
 * Rydberg constant R_M given by the caller. Several series may share one limit (each with its own
 * defects).
 *
 * <p><b>Number of terms.</b> Unless fixed ({@link #withTerms}), each series starts with d0 alone and
 * gains terms (up to {@link #withMaxTerms}, 3 unless set: d0, d2, d4) one at a time, each time in the
 * series where the gain lowers the Bayesian information criterion
 * {@code BIC = chi^2 + p ln N} the most (G. Schwarz, Ann. Statist. 6, 461 (1978); with Gaussian
 * errors of known size, -2 ln L is chi^2 up to a constant), until no added term lowers it. Every
 * model tried is in the result ({@link SeriesFit#candidates()}), with its own limit.
 *
 * <p><b>Coverage after the choice.</b> The chosen model's uncertainties ignore that the data chose
 * it: on seeded synthetic series (two series, n = 20-60 in steps of 2, u = 0.002 cm^-1, true model two
 * terms each; 600 trials for each of the seeds 1, 2, 3; a spurious third term in 9-11 % of trials) the
 * limit's rms pull is 1.07-1.08 (|pull| &lt; 1 in 64-67 %, against 68.3 % for a normal), d0's 1.07-1.16
 * (within 1.96 in 90-93 %), d2's 1.07-1.17, a member predicted at n = 70 1.03-1.07 (within 1.96 in
 * 93-94 %). The result also gives each averaged over the models tried with BIC weights
 * ({@link SeriesFit#modelAveragedLimit()}, {@link SeriesFit#modelAveragedDefects},
 * {@link SeriesFit#modelAveragedPredictions}; Buckland, Burnham &amp; Augustin 1997, Burnham &amp; Anderson
 * 2002), whose uncertainty includes the spread between the models: on the same trials rms pull 0.92-0.94
 * for the limit (within 1.96 in 96-97 %), 0.95-0.99 for n = 70 (96-97 %), and 0.72-0.77 for d0 (99-100 %)
 * and 0.48-0.54 for d2: the defects' averages are conservative, since a model with a spurious term,
 * whose lower terms are far less certain, enters with its weight (about 0.15 each here). Seed 1's
 * figures are checked in {@code SeriesFitterTest}. Where the truth needs a term the data barely show (a
 * strongly perturbed series), the criterion may drop it and neither the chosen nor the averaged limit covers
 * at the stated rate; {@link SeriesFit#unsettledTerms()} then says so where a larger model tried moves the
 * limit (README, series section, for the figures on a series shaped like Sr-88 5snd 1D2).
 *
 * <p><b>Repeated measurements.</b> A level measured more than once (members of one n given several times,
 * each from its own place: {@link RydbergSeries}) enters with every measurement as an independent datum of
 * its own weight {@code 1 / u^2}, as weighted least squares takes any set of independent data (common
 * practice). The parameters are then those of a fit to the measurements' weighted mean
 * {@code (sum E_i / u_i^2) / (sum 1 / u_i^2)} with uncertainty {@code (sum 1 / u_i^2)^-1/2} in the level's
 * place (the sum of squares differs by a term free of the parameters), while chi^2, the degrees of freedom and
 * the information criterion count every measurement, and each keeps its residual. {@link SeriesFit} names
 * pairs of measurements that disagree.
 *
 * <p><b>Known limit.</b> A limit known from elsewhere (a published ionization energy with its
 * standard uncertainty, {@link #withLimit}) enters the fit as one more datum, {@code (E_limit - L) / u_L},
 * beside the members; it counts as a datum in the information criterion and the degrees of freedom.
 *
 * <p><b>Uncertainties.</b> The covariance is {@code (J^T W J)^-1} at the optimum, from the members'
 * stated uncertainties (not scaled by chi^2 / dof; the result gives the chance probability of chi^2, the
 * scale factor and the members beyond 3 sigma, and says when the fit is improbable: {@link SeriesFit}).
 * Predicted members carry {@code u(E) = sqrt(g^T C g)}, g the gradient of E(n) in the parameters.
 * With the number of terms fixed ({@link #withTerms}), as many data as parameters are accepted: the
 * fit then interpolates (chi^2 = 0, no degrees of freedom), and the covariance carries the data's
 * uncertainties alone, nothing of the formula's truncation (the caller must add that).
 *
 * <p>Refused with a {@link RitzException}: fewer data (members, and the known limit where given) than
 * parameters plus one, or than parameters with fixed terms ({@link RitzException#TOO_FEW}), a fit
 * that does not converge ({@link RitzException#NO_CONVERGENCE}). Immutable and thread-safe.
 */
public final class SeriesFitter {

    private static final SeriesFitter DEFAULTS = new SeriesFitter(3, null, null);

    private final int maxTerms;
    private final int[] fixedTerms;
    /** The known limit and its standard uncertainty, cm^-1, or null. */
    private final double[] knownLimit;

    private SeriesFitter(int maxTerms, int[] fixedTerms, double[] knownLimit) {
        this.maxTerms = maxTerms;
        this.fixedTerms = fixedTerms;
        this.knownLimit = knownLimit;
    }

    /** @return up to 3 terms per series, chosen by the information criterion */
    public static SeriesFitter defaults() {
        return DEFAULTS;
    }

    /**
     * @param terms the most terms per series (d0 alone is 1), 1 to 6
     * @return this fitter with that limit
     */
    public SeriesFitter withMaxTerms(int terms) {
        if (terms < 1 || terms > 6) {
            throw new IllegalArgumentException("the number of defect terms must be 1 to 6, got " + terms);
        }
        return new SeriesFitter(terms, null, knownLimit);
    }

    /**
     * @param terms the number of terms of each series, in the order the series are given, 1 to 6 each
     * @return this fitter with those fixed (no selection)
     */
    public SeriesFitter withTerms(int... terms) {
        for (int t : terms) {
            if (t < 1 || t > 6) {
                throw new IllegalArgumentException("the number of defect terms must be 1 to 6, got " + t);
            }
        }
        return new SeriesFitter(maxTerms, terms.clone(), knownLimit);
    }

    /**
     * @param limitPerCm       a known series limit above the ground level (e.g. a published ionization
     *                         energy), cm^-1, finite, positive
     * @param uncertaintyPerCm its standard uncertainty, cm^-1, finite, positive
     * @return this fitter with the limit as one more datum of the fit
     */
    public SeriesFitter withLimit(double limitPerCm, double uncertaintyPerCm) {
        if (!(limitPerCm > 0) || Double.isInfinite(limitPerCm)) {
            throw new IllegalArgumentException("the known limit must be finite and positive cm-1, got " + limitPerCm);
        }
        if (!(uncertaintyPerCm > 0) || Double.isInfinite(uncertaintyPerCm)) {
            throw new IllegalArgumentException("the known limit's uncertainty must be finite and positive cm-1, got "
                    + uncertaintyPerCm);
        }
        return new SeriesFitter(maxTerms, fixedTerms == null ? null : fixedTerms.clone(),
                new double[] {limitPerCm, uncertaintyPerCm});
    }

    /**
     * @param rydbergPerCm the species' reduced-mass Rydberg constant R_M, cm^-1, finite, positive
     * @param series       one or more series sharing the limit
     * @return the fit
     * @throws RitzException when there are too few members (or a series has none) or the fit does not
     *                       converge
     * @throws IllegalArgumentException for R_M not finite and positive, term counts that do not match
     *                                  the series, or two series of one name
     */
    public SeriesFit fit(double rydbergPerCm, List<RydbergSeries> series) {
        SeriesFit fit = fitOnce(rydbergPerCm, series);
        return fit.isImprobable() ? fit.withDeletion(bestDeletion(rydbergPerCm, series)) : fit;
    }

    /**
     * For an improbable fit: refits (with these settings) without each member in turn, and keeps the
     * refit whose chi^2 probability is highest (the lowest reduced chi^2 where probabilities underflow),
     * a deletion diagnostic (common practice: the deleted residual of one observation at a time).
     * Members whose removal leaves too few data are skipped.
     *
     * @return the best refit, or null when none converged
     */
    private SeriesFit.Deletion bestDeletion(double rydbergPerCm, List<RydbergSeries> series) {
        SeriesFit.Deletion best = null;
        for (int s = 0; s < series.size(); s++) {
            RydbergSeries one = series.get(s);
            for (int i = 0; i < one.size(); i++) {
                if (one.size() == 1) {
                    continue;
                }
                RydbergSeries.Builder b = RydbergSeries.builder(one.name());
                for (int k = 0; k < one.size(); k++) {
                    if (k != i) {
                        b.add(one.n(k), one.energyPerCm(k), one.uncertaintyPerCm(k), one.where(k));
                    }
                }
                List<RydbergSeries> without = new ArrayList<>(series);
                without.set(s, b.build());
                SeriesFit refit;
                try {
                    refit = fitOnce(rydbergPerCm, without);
                } catch (RitzException e) {
                    continue;
                }
                double p = refit.chiSquareProbability().orElse(1);
                double reduced = refit.reducedChiSquare().orElse(0);
                if (best == null || p > best.probability() || (p == best.probability()
                        && reduced < best.chiSquare() / Math.max(1, best.degreesOfFreedom()))) {
                    List<Integer> terms = new ArrayList<>();
                    for (int k = 0; k < series.size(); k++) {
                        terms.add(refit.terms(k));
                    }
                    best = new SeriesFit.Deletion(s, i, one.n(i), one.where(i), refit.chiSquare(),
                            refit.degreesOfFreedom(), p, refit.limitPerCm(), refit.limitUncertaintyPerCm(),
                            List.copyOf(terms));
                }
            }
        }
        return best;
    }

    private SeriesFit fitOnce(double rydbergPerCm, List<RydbergSeries> series) {
        Objects.requireNonNull(series, "series");
        if (!(rydbergPerCm > 0) || Double.isInfinite(rydbergPerCm)) {
            throw new IllegalArgumentException("R_M must be finite and positive cm-1, got " + rydbergPerCm);
        }
        if (series.isEmpty()) {
            throw new RitzException(RitzException.TOO_FEW, "no series to fit");
        }
        if (fixedTerms != null && fixedTerms.length != series.size()) {
            throw new IllegalArgumentException(fixedTerms.length + " term counts for " + series.size() + " series");
        }
        java.util.Set<String> names = new java.util.HashSet<>();
        for (RydbergSeries one : series) {
            if (!names.add(Objects.requireNonNull(one, "series").name())) {
                throw new IllegalArgumentException("two series named '" + one.name() + "': the same members would "
                        + "count twice; give each series once, under its own name");
            }
            if (one.size() == 0) {
                throw new RitzException(RitzException.TOO_FEW, "series '" + one.name() + "' has no members");
            }
        }
        int members = series.stream().mapToInt(RydbergSeries::size).sum();
        int total = members + (knownLimit == null ? 0 : 1);
        Model model = new Model(rydbergPerCm, series, knownLimit);
        int[] terms = fixedTerms != null ? fixedTerms.clone() : filled(series.size(), 1);
        int p = 1 + Arrays.stream(terms).sum();
        int needed = fixedTerms != null ? p : p + 1;
        if (total < needed) {
            throw new RitzException(RitzException.TOO_FEW, "a fit with " + p + " parameters needs at least " + needed
                    + (knownLimit == null ? " members; the series have " + members
                    : " data; the series have " + members + " members and the known limit is one more"));
        }
        List<Solution> tried = new ArrayList<>();
        double[] start = model.start(terms);
        Solution best = model.solve(terms, start);
        if (best == null) {
            throw new RitzException(RitzException.NO_CONVERGENCE, "the Rydberg-Ritz fit of " + names(series)
                    + " did not converge (are the n values and energies of one series?)");
        }
        tried.add(best);
        if (fixedTerms == null) {
            while (true) {
                Solution next = null;
                for (int s = 0; s < series.size(); s++) {
                    if (best.terms[s] >= maxTerms || total < 1 + Arrays.stream(best.terms).sum() + 2) {
                        continue;
                    }
                    int[] more = best.terms.clone();
                    more[s]++;
                    Solution trial = model.solve(more, model.extend(best, more));
                    if (trial == null) {
                        continue;
                    }
                    tried.add(trial);
                    if (trial.bic(total) < (next == null ? best.bic(total) : next.bic(total))) {
                        next = trial;
                    }
                }
                if (next == null) {
                    break;
                }
                best = next;
            }
        }
        return new SeriesFit(model, best, total, tried, null);
    }

    private static int[] filled(int n, int value) {
        int[] a = new int[n];
        Arrays.fill(a, value);
        return a;
    }

    private static String names(List<RydbergSeries> series) {
        return series.stream().map(s -> "'" + s.name() + "'").toList().toString();
    }

    @Override
    public String toString() {
        return "SeriesFitter[" + (fixedTerms == null ? "up to " + maxTerms + " terms by BIC"
                : "terms " + Arrays.toString(fixedTerms))
                + (knownLimit == null ? "" : ", known limit " + knownLimit[0] + " +- " + knownLimit[1] + " cm-1") + "]";
    }

    /** One converged fit: one model tried. */
    static final class Solution {
        final int[] terms;
        final double[] parameters;
        final double[][] covariance;
        final double chiSquare;

        Solution(int[] terms, double[] parameters, double[][] covariance, double chiSquare) {
            this.terms = terms;
            this.parameters = parameters;
            this.covariance = covariance;
            this.chiSquare = chiSquare;
        }

        double bic(int points) {
            return chiSquare + parameters.length * Math.log(points);
        }

        SeriesFit.Candidate candidate(int points, double offset) {
            return new SeriesFit.Candidate(List.of(Arrays.stream(terms).boxed().toArray(Integer[]::new)), chiSquare,
                    bic(points), offset + parameters[0], Math.sqrt(covariance[0][0]));
        }
    }

    /**
     * The model over all series: parameters {@code [limit - offset, d0, d2, ... of series 0, d0, ... of
     * series 1, ...]}, energies measured from {@code offset} (the highest member) for conditioning.
     */
    static final class Model {
        final double rydberg;
        final List<RydbergSeries> series;
        final double offset;
        /** The known limit and its uncertainty, cm^-1, or null. */
        final double[] knownLimit;

        Model(double rydberg, List<RydbergSeries> series, double[] knownLimit) {
            this.rydberg = rydberg;
            this.series = List.copyOf(series);
            this.knownLimit = knownLimit == null ? null : knownLimit.clone();
            double high = 0;
            for (RydbergSeries s : series) {
                for (int i = 0; i < s.size(); i++) {
                    high = Math.max(high, s.energyPerCm(i));
                }
            }
            this.offset = high;
        }

        /** Energy (from the offset) of member n of a series with these coefficients, and its gradient. */
        double energy(double limit, List<Double> c, int n, double[] gradient) {
            double e = AlkaliAtom.rydbergRitzEnergy(limit, rydberg, c, n);
            if (gradient != null) {
                double d0 = c.get(0);
                double x = 1 / ((n - d0) * (n - d0));
                double nu = n - AlkaliAtom.rydbergRitzDefect(c, n);
                double dEdDelta = -2 * rydberg / (nu * nu * nu);
                double dDeltaDd0 = 1;
                double power = 1;
                for (int k = 1; k < c.size(); k++) {
                    dDeltaDd0 += c.get(k) * k * power * 2 / ((n - d0) * (n - d0) * (n - d0));
                    power *= x;
                }
                gradient[0] = dEdDelta * dDeltaDd0;
                power = x;
                for (int k = 1; k < c.size(); k++) {
                    gradient[k] = dEdDelta * power;
                    power *= x;
                }
            }
            return e;
        }

        /** A start: per series the best d0 on a grid with its own limit; the limits averaged. */
        double[] start(int[] terms) {
            double[] q = new double[1 + Arrays.stream(terms).sum()];
            double sumW = 0;
            double sumL = 0;
            int at = 1;
            for (int s = 0; s < series.size(); s++) {
                RydbergSeries one = series.get(s);
                int lowest = Integer.MAX_VALUE;
                for (int i = 0; i < one.size(); i++) {
                    lowest = Math.min(lowest, one.n(i));
                }
                double bestChi = Double.POSITIVE_INFINITY;
                double bestD0 = 0;
                double bestL = 0;
                double bestW = 0;
                for (double d0 = -1; d0 < lowest - 0.05; d0 += 0.001) {
                    double w = 0;
                    double wl = 0;
                    for (int i = 0; i < one.size(); i++) {
                        double nu = one.n(i) - d0;
                        double wi = 1 / (one.uncertaintyPerCm(i) * one.uncertaintyPerCm(i));
                        w += wi;
                        wl += wi * (one.energyPerCm(i) - offset + rydberg / (nu * nu));
                    }
                    double limit = wl / w;
                    double chi = 0;
                    for (int i = 0; i < one.size(); i++) {
                        double nu = one.n(i) - d0;
                        double r = (one.energyPerCm(i) - offset + rydberg / (nu * nu) - limit) / one.uncertaintyPerCm(i);
                        chi += r * r;
                    }
                    if (chi < bestChi) {
                        bestChi = chi;
                        bestD0 = d0;
                        bestL = limit;
                        bestW = w;
                    }
                }
                q[at] = bestD0;
                at += terms[s];
                sumW += bestW;
                sumL += bestW * bestL;
            }
            q[0] = knownLimit != null ? knownLimit[0] - offset : sumL / sumW;
            return q;
        }

        /** The previous solution's parameters with a zero for each new term. */
        double[] extend(Solution previous, int[] terms) {
            double[] q = new double[1 + Arrays.stream(terms).sum()];
            q[0] = previous.parameters[0];
            int from = 1;
            int to = 1;
            for (int s = 0; s < terms.length; s++) {
                System.arraycopy(previous.parameters, from, q, to, previous.terms[s]);
                from += previous.terms[s];
                to += terms[s];
            }
            return q;
        }

        Solution solve(int[] terms, double[] start) {
            int points = series.stream().mapToInt(RydbergSeries::size).sum() + (knownLimit == null ? 0 : 1);
            int p = start.length;
            double[] target = new double[points];
            int row = 0;
            for (RydbergSeries s : series) {
                for (int i = 0; i < s.size(); i++) {
                    target[row++] = (s.energyPerCm(i) - offset) / s.uncertaintyPerCm(i);
                }
            }
            if (knownLimit != null) {
                target[row] = (knownLimit[0] - offset) / knownLimit[1];
            }
            MultivariateJacobianFunction f = point -> {
                double[] q = point.toArray();
                double[] value = new double[points];
                double[][] jacobian = new double[points][p];
                evaluate(terms, q, value, jacobian, true);
                return new Pair<>(new ArrayRealVector(value, false), new Array2DRowRealMatrix(jacobian, false));
            };
            try {
                LeastSquaresOptimizer.Optimum optimum = new LevenbergMarquardtOptimizer()
                        .optimize(new LeastSquaresBuilder().start(start).model(f).target(target)
                                .maxEvaluations(10_000).maxIterations(10_000).build());
                double[] q = optimum.getPoint().toArray();
                for (double v : q) {
                    if (!Double.isFinite(v)) {
                        return null;
                    }
                }
                double[][] covariance = covariance(optimum.getJacobian());
                if (covariance == null) {
                    return null;
                }
                double chi = optimum.getRMS() * optimum.getRMS() * points;
                return new Solution(terms.clone(), q, covariance, chi);
            } catch (MathIllegalStateException | SingularMatrixException | ArithmeticException e) {
                return null;
            }
        }

        /**
         * The covariance {@code (J^T W J)^-1} from the singular value decomposition of the weighted
         * Jacobian, {@code V S^-2 V^T}: forming {@code J^T W J} first squares the condition number, which
         * data of very different uncertainties (a level known to 5e-8 cm^-1 beside a limit known to 1e-3)
         * make large enough to cost digits. Null when J is singular (a singular value below 1e-14 of the
         * largest).
         */
        static double[][] covariance(RealMatrix jacobian) {
            SingularValueDecomposition svd = new SingularValueDecomposition(jacobian);
            double[] s = svd.getSingularValues();
            int p = s.length;
            if (p == 0 || !(s[p - 1] > 1e-14 * s[0])) {
                return null;
            }
            double[][] v = svd.getV().getData();
            double[][] c = new double[p][p];
            for (int a = 0; a < p; a++) {
                for (int b = 0; b < p; b++) {
                    double sum = 0;
                    for (int k = 0; k < p; k++) {
                        sum += v[a][k] * v[b][k] / (s[k] * s[k]);
                    }
                    c[a][b] = sum;
                }
            }
            return c;
        }

        /** Fills values (from the offset) and the Jacobian; weighted by 1 / u when asked. */
        void evaluate(int[] terms, double[] q, double[] value, double[][] jacobian, boolean weighted) {
            int row = 0;
            int at = 1;
            for (int s = 0; s < series.size(); s++) {
                RydbergSeries one = series.get(s);
                List<Double> c = coefficients(q, at, terms[s]);
                double[] g = new double[terms[s]];
                for (int i = 0; i < one.size(); i++) {
                    double w = weighted ? 1 / one.uncertaintyPerCm(i) : 1;
                    value[row] = energy(q[0], c, one.n(i), g) * w;
                    jacobian[row][0] = w;
                    for (int k = 0; k < terms[s]; k++) {
                        jacobian[row][at + k] = g[k] * w;
                    }
                    row++;
                }
                at += terms[s];
            }
            if (knownLimit != null) {
                double w = weighted ? 1 / knownLimit[1] : 1;
                value[row] = q[0] * w;
                jacobian[row][0] = w;
            }
        }

        static List<Double> coefficients(double[] q, int at, int count) {
            Double[] c = new Double[count];
            for (int k = 0; k < count; k++) {
                c[k] = q[at + k];
            }
            return List.of(c);
        }
    }
}
