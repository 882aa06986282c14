package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;

/**
 * The result of a {@link SeriesFitter}: the series limit and each series' quantum-defect
 * coefficients with their covariance, the members' residuals, chi^2, and every model tried with its
 * information criterion; predictions of members not measured. Energies in cm^-1 above the ground
 * level. Immutable and thread-safe (accessors return copies).
 */
public final class SeriesFit {

    /**
     * One model the fitter tried.
     *
     * @param terms     the number of defect terms of each series
     * @param chiSquare its chi^2
     * @param bic       its Bayesian information criterion {@code chi^2 + p ln N}
     */
    public record Candidate(List<Integer> terms, double chiSquare, double bic) {
    }

    /**
     * A member of a series computed from the fit.
     *
     * @param n                principal quantum number
     * @param energyPerCm      its energy above the ground level, cm^-1
     * @param uncertaintyPerCm the standard uncertainty from the fit's covariance, cm^-1
     * @param quantumDefect    delta(n) of the fit
     */
    public record Member(int n, double energyPerCm, double uncertaintyPerCm, double quantumDefect) {
    }

    private final SeriesFitter.Model model;
    private final int[] terms;
    private final double[] parameters;
    private final double[][] covariance;
    private final double chiSquare;
    private final int points;
    private final List<Candidate> candidates;

    SeriesFit(SeriesFitter.Model model, int[] terms, double[] parameters, double[][] covariance, double chiSquare,
            int points, List<Candidate> candidates) {
        this.model = model;
        this.terms = terms;
        this.parameters = parameters;
        this.covariance = covariance;
        this.chiSquare = chiSquare;
        this.points = points;
        this.candidates = List.copyOf(candidates);
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

    /** @return members minus parameters */
    public int degreesOfFreedom() {
        return points - parameters.length;
    }

    /** @return every model tried, in order, the chosen one among them */
    public List<Candidate> candidates() {
        return candidates;
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
     * @param s series index
     * @param n principal quantum number (measured or not), above the series' d0
     * @return the member's energy, its uncertainty from the covariance, and delta(n)
     * @throws IllegalArgumentException for a series index out of range, n below 1, or an n where the
     *                                  fitted defect leaves no positive effective n (no member there)
     */
    public Member predict(int s, int n) {
        if (s < 0 || s >= model.series.size()) {
            throw new IllegalArgumentException("series index " + s + " out of range: the fit has "
                    + model.series.size() + " series");
        }
        if (n < 1) {
            throw new IllegalArgumentException("n must be at least 1, got " + n);
        }
        Member member = member(s, n);
        if (!(n - member.quantumDefect() > 0) || !Double.isFinite(member.energyPerCm())) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT, "series %s has no member at n = %d:"
                    + " its fitted defect %.4f leaves no positive effective n", model.series.get(s).name(), n,
                    member.quantumDefect()));
        }
        return member;
    }

    private Member member(int s, int n) {
        double[] q = parameters;
        List<Double> c = SeriesFitter.Model.coefficients(q, first(s), terms[s]);
        double[] g = new double[terms[s]];
        double e = model.energy(q[0], c, n, g);
        double[] full = new double[q.length];
        full[0] = 1;
        System.arraycopy(g, 0, full, first(s), g.length);
        double v = 0;
        for (int a = 0; a < full.length; a++) {
            for (int b = 0; b < full.length; b++) {
                v += full[a] * covariance[a][b] * full[b];
            }
        }
        double defect = org.ritzwerk.engine.rydberg.AlkaliAtom.rydbergRitzDefect(c, n);
        return new Member(n, model.offset + e, Math.sqrt(Math.max(0, v)), defect);
    }

    private int first(int s) {
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
