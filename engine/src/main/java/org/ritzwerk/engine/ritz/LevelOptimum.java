package org.ritzwerk.engine.ritz;

import java.util.List;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.ritzwerk.atom.Species;

/**
 * The result of a {@link LevelOptimizer}: the optimised level energies with their covariance (from
 * the lines kept), and per measured line, kept or left out, its Ritz wavenumber with uncertainty,
 * its residual against that fit, its normalised residual and flag; the lines left out as outliers;
 * chi^2 and degrees of freedom of the lines kept. Immutable and thread-safe (accessors return
 * copies).
 */
public final class LevelOptimum {

    /** What the optimisation says about a line. */
    public enum LineFlag {
        /** Fitted within the threshold. */
        FITTED,
        /**
         * Left out of the fit: its normalised residual was the largest beyond the threshold when it was
         * left out (a misassignment, blend or bad measurement); see {@link LevelOptimum#leftOut()}.
         */
        OUTLIER,
        /**
         * Kept, but its residual and that of a line left out were perfectly correlated (with it they alone
         * joined part of the level system to the rest, e.g. the only two lines of a level, or two
         * measurements of one line), so the data could not tell which was wrong; the least precise was
         * left out. See {@link LevelOptimum#unresolvedWith}.
         */
        UNRESOLVED,
        /** Kept, and it alone determines a level, so nothing checks it (residual 0). */
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
    private final List<Integer> leftOut;
    private final int[] partner;

    LevelOptimum(MeasuredLines problem, double[] energy, double[][] covariance, double[] ritz, double[] ritzSigma,
            double[] standardised, LineFlag[] flags, double chiSquare, int degreesOfFreedom, double threshold,
            List<Integer> leftOut, int[] partner) {
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
        this.leftOut = List.copyOf(leftOut);
        this.partner = partner;
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
     * @return measured minus Ritz wavenumber, cm^-1, against the final fit (also for a line left out)
     */
    public double residualPerCm(int k) {
        return problem.wavenumberPerCm(k) - ritz[k];
    }

    /**
     * @param k line index
     * @return the residual over its own standard deviation against the final fit: {@code sqrt(u^2 -
     *         u_Ritz^2)} for a kept line (the leave-one-out normalised residual), {@code sqrt(u^2 +
     *         u_Ritz^2)} for a line left out; absent for a kept line that alone determines a level
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

    /**
     * @param k line index
     * @return whether the line took part in the final fit (not left out as an outlier)
     */
    public boolean isKept(int k) {
        return flags[k] != LineFlag.OUTLIER;
    }

    /** @return the indices of the lines left out as outliers, in the order they were left out */
    public List<Integer> leftOut() {
        return leftOut;
    }

    /**
     * @param k line index
     * @return for a line {@link LineFlag#UNRESOLVED}, the line left out that it could not be told apart
     *         from; otherwise empty
     */
    public OptionalInt unresolvedWith(int k) {
        return partner[k] < 0 ? OptionalInt.empty() : OptionalInt.of(partner[k]);
    }

    /** @return the weighted sum of squared residuals of the lines kept */
    public double chiSquare() {
        return chiSquare;
    }

    /** @return lines kept minus free levels */
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
        return "LevelOptimum[" + energy.length + " levels from " + (ritz.length - leftOut.size()) + " of "
                + ritz.length + " lines, chi2 " + chiSquare + " for " + degreesOfFreedom + " degrees of freedom]";
    }
}
