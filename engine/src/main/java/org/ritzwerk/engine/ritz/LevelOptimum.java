package org.ritzwerk.engine.ritz;

import java.util.List;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Species;

/**
 * The result of a {@link LevelOptimizer}: the optimised level energies with their covariance, and
 * per measured line its Ritz wavenumber with uncertainty, residual, standardised residual and flag;
 * chi^2 and degrees of freedom. Immutable and thread-safe (accessors return copies).
 */
public final class LevelOptimum {

    /** What the optimisation says about a line. */
    public enum LineFlag {
        /** Fitted within the threshold. */
        FITTED,
        /** Its standardised residual is beyond the threshold: a misassignment, blend or bad measurement. */
        OUTLIER,
        /** It alone determines a level, so nothing checks it (residual 0). */
        DETERMINES_LEVEL
    }

    private final MeasuredLines problem;
    private final double[] energy;
    private final double[][] covariance;
    private final double[] ritz;
    private final double[] ritzSigma;
    private final double[] standardised;
    private final LineFlag[] flags;
    private final double chiSquare;
    private final int degreesOfFreedom;
    private final double threshold;

    LevelOptimum(MeasuredLines problem, double[] energy, double[][] covariance, double[] ritz, double[] ritzSigma,
            double[] standardised, LineFlag[] flags, double chiSquare, int degreesOfFreedom, double threshold) {
        this.problem = problem;
        this.energy = energy;
        this.covariance = covariance;
        this.ritz = ritz;
        this.ritzSigma = ritzSigma;
        this.standardised = standardised;
        this.flags = flags;
        this.chiSquare = chiSquare;
        this.degreesOfFreedom = degreesOfFreedom;
        this.threshold = threshold;
    }

    /** @return the problem solved */
    public MeasuredLines problem() {
        return problem;
    }

    /** @return the level labels, the reference first */
    public List<String> levelLabels() {
        return problem.levels();
    }

    /**
     * @param i level index in {@link #levelLabels()}
     * @return its optimised energy, cm^-1
     */
    public double energyPerCm(int i) {
        return energy[i];
    }

    /**
     * @param i level index
     * @return its standard uncertainty, cm^-1 (0 for the reference, held fixed)
     */
    public double uncertaintyPerCm(int i) {
        return Math.sqrt(covariance[i][i]);
    }

    /** @return the covariance of the energies, cm^-2, in the order of {@link #levelLabels()} (a copy) */
    public double[][] covariance() {
        double[][] copy = new double[covariance.length][];
        for (int i = 0; i < copy.length; i++) {
            copy[i] = covariance[i].clone();
        }
        return copy;
    }

    /**
     * @param k line index in the problem
     * @return its Ritz wavenumber {@code E_upper - E_lower}, cm^-1
     */
    public double ritzPerCm(int k) {
        return ritz[k];
    }

    /**
     * @param k line index
     * @return the standard uncertainty of the Ritz wavenumber, cm^-1, from the covariance
     */
    public double ritzUncertaintyPerCm(int k) {
        return ritzSigma[k];
    }

    /**
     * @param k line index
     * @return measured minus Ritz wavenumber, cm^-1
     */
    public double residualPerCm(int k) {
        return problem.wavenumberPerCm(k) - ritz[k];
    }

    /**
     * @param k line index
     * @return the residual over its own standard deviation {@code sqrt(u^2 - u_Ritz^2)}; absent for a
     *         line that alone determines a level
     */
    public OptionalDouble standardisedResidual(int k) {
        return Double.isNaN(standardised[k]) ? OptionalDouble.empty() : OptionalDouble.of(standardised[k]);
    }

    /**
     * @param k line index
     * @return its flag
     */
    public LineFlag flag(int k) {
        return flags[k];
    }

    /** @return the weighted sum of squared residuals */
    public double chiSquare() {
        return chiSquare;
    }

    /** @return lines minus free levels */
    public int degreesOfFreedom() {
        return degreesOfFreedom;
    }

    /** @return the outlier threshold used, standard deviations */
    public double outlierThreshold() {
        return threshold;
    }

    /**
     * @param species the species the levels belong to
     * @return the optimised levels with their covariance, for {@link RitzLines} (J from the labels)
     * @throws RitzException ({@link RitzException#BAD_VALUE}) when a level came out below 0, i.e. below
     *         the ground level (the reference held was not the ground level, or at the wrong energy)
     */
    public RitzLevels levels(Species species) {
        RitzLevels.Builder b = RitzLevels.builder(species);
        for (int i = 0; i < energy.length; i++) {
            if (energy[i] < 0) {
                throw new RitzException(RitzException.BAD_VALUE, "level '" + problem.levels().get(i) + "' came out at "
                        + energy[i] + " cm-1, below the ground level; hold the ground level (or give the reference "
                        + "its energy above it) to make a level list");
            }
            b.add(problem.levels().get(i), energy[i], uncertaintyPerCm(i), -1);
        }
        return b.build().withCovariance(covariance);
    }

    @Override
    public String toString() {
        return "LevelOptimum[" + energy.length + " levels from " + ritz.length + " lines, chi2 " + chiSquare + " for "
                + degreesOfFreedom + " degrees of freedom]";
    }
}
