package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.ritzwerk.atom.Species;

/**
 * The result of a {@link LevelOptimizer}: the optimised level energies with their covariance (from
 * the lines kept), and per measured line, kept or left out, its Ritz wavenumber with uncertainty,
 * its residual against that fit, its normalised residual and flag; the lines left out as outliers;
 * chi^2 and degrees of freedom of the lines kept; the systems of levels that chains of lines join
 * ({@link #systems()}: one, unless {@link LevelOptimizer#withSeparateSystems} allowed more), each with
 * the level held in it and whether its energies are absolute or relative to that level. Immutable and
 * thread-safe (accessors return copies).
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

    /** How the energies of a system of levels stand. */
    public enum Standing {
        /** The system of the problem's reference level, held at its given energy: energies absolute. */
        MAIN,
        /** A separate system whose reference level was given an energy: energies absolute. */
        ANCHORED,
        /**
         * A separate system whose reference energy is unknown: energies relative to that level, {@code E =
         * value + x} with x unknown (common practice), uncertainties and covariance relative to it.
         */
        FLOATING
    }

    /**
     * One system of levels: levels that chains of measured lines join, and no line joins to another
     * system.
     *
     * @param index                      its place in {@link #systems()}, 0 for the main system
     * @param reference                  the label of the level held in it
     * @param referenceLevel             that level's index in {@link #levelLabels()}
     * @param standing                   whether its energies are absolute or relative to the reference
     * @param named                      whether the reference was given (the problem's, or a {@link
     *                                   SystemReference}); false: a floating system's lowest level, chosen
     * @param referencePerCm             the reference's energy, cm^-1: given (main, anchored), 0 when floating
     * @param referenceUncertaintyPerCm  its standard uncertainty, cm^-1: an anchor's, else 0
     * @param levels                     the indices of its levels, in order
     * @param lines                      the number of its lines kept in the fit
     * @param chiSquare                  the weighted sum of squared residuals of those lines
     * @param degreesOfFreedom           those lines minus its free levels
     */
    public record LevelSystem(int index, String reference, int referenceLevel, Standing standing, boolean named,
            double referencePerCm, double referenceUncertaintyPerCm, List<Integer> levels, int lines,
            double chiSquare, int degreesOfFreedom) {

        /**
         * Copies the list of levels.
         *
         * @param index                     the system's number
         * @param reference                 its reference level's label
         * @param referenceLevel            that level's index
         * @param standing                  absolute or relative to the reference
         * @param named                     whether the reference was given
         * @param referencePerCm            the reference's energy, cm^-1
         * @param referenceUncertaintyPerCm its standard uncertainty, cm^-1
         * @param levels                    the indices of its levels
         * @param lines                     its lines kept in the fit
         * @param chiSquare                 their weighted sum of squared residuals
         * @param degreesOfFreedom          those lines minus its free levels
         */
        public LevelSystem {
            levels = List.copyOf(levels);
        }

        /** @return whether its energies are absolute (main or anchored), not relative to its reference */
        public boolean isAbsolute() {
            return standing != Standing.FLOATING;
        }
    }

    /** The relative error of a Ritz uncertainty from the covariance beyond which a level list is refused. */
    static final double CARRIED = 1e-6;

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
    private final int[] system;
    private final List<LevelSystem> systems;

    LevelOptimum(MeasuredLines problem, double[] energy, double[][] covariance, double[] ritz, double[] ritzSigma,
            double[] standardised, LineFlag[] flags, double chiSquare, int degreesOfFreedom, double threshold,
            List<Integer> leftOut, int[] partner, int[] system, List<LevelSystem> systems) {
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
        this.system = system;
        this.systems = List.copyOf(systems);
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
     * @return its optimised energy, cm^-1: above the ground level in the main and anchored systems,
     *         relative to its system's reference in a floating one ({@link #isAbsolute})
     */
    public double energyPerCm(int i) {
        return energy[i];
    }

    /**
     * @param i level index
     * @return its standard uncertainty, cm^-1 (0 for the reference, held fixed, and for a floating system's
     *         reference; relative to the reference in a floating system; including the anchor's in an anchored
     *         one, whose reference has the anchor's)
     */
    public double uncertaintyPerCm(int i) {
        return Math.sqrt(covariance[i][i]);
    }

    /**
     * @return the systems of levels, the main system (the problem's reference's) first, then in order of
     *         their first level; one unless {@link LevelOptimizer#withSeparateSystems} allowed more
     */
    public List<LevelSystem> systems() {
        return systems;
    }

    /**
     * @param i level index
     * @return the index of its system in {@link #systems()}
     */
    public int systemOf(int i) {
        return system[i];
    }

    /**
     * @param i level index
     * @return whether its energy is absolute (above the ground level), not relative to its system's
     *         floating reference
     */
    public boolean isAbsolute(int i) {
        return systems.get(system[i]).isAbsolute();
    }

    /**
     * The covariance of the energies, from the factorisation of the final fit ({@code P R^-1 R^-T P^T}, see
     * {@link LevelOptimizer}): each entry carries a few parts in 1e16 of the larger of its two variances, so a
     * difference of entries, such as the variance of a line joining two levels, loses the ratio of the levels'
     * variances to it (a precise group of levels hung on the reference by much looser lines). Take lines'
     * uncertainties from {@link #ritzUncertaintyPerCm}, which keeps them.
     *
     * @return the covariance of the energies, cm^-2, in the order of {@link #levelLabels()} (a copy); 0
     *         between levels of different systems (each system fitted on its own, an anchor independent of
     *         the lines), relative to the reference within a floating system
     */
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
     * @return the standard uncertainty of the Ritz wavenumber, cm^-1: {@code ||R^-T P^T a||} from the final
     *         fit's factorisation (see {@link LevelOptimizer}), within about 1e-12 of itself however much
     *         more loosely its levels are known (not from {@link #covariance()})
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
     * @return the optimised levels with their covariance, for {@link RitzLines} (J from the labels); with
     *         anchored systems, lines between systems have the uncertainty of both systems' levels, the
     *         anchors' included
     * @throws RitzException ({@link RitzException#BAD_VALUE}) when a level came out below 0, i.e. below
     *         the ground level (the reference held was not the ground level, or at the wrong energy);
     *         ({@link RitzException#SINGULAR}) naming a measured line whose Ritz uncertainty the levels'
     *         covariance gives off by more than {@value #CARRIED} of itself (a precise group hung on the
     *         reference by much looser lines: see {@link #covariance()});
     *         ({@link RitzException#UNCONNECTED}) when a system floats: its energies are relative, so lines
     *         between it and another system cannot be predicted ({@link #absoluteLevels}, {@link #systemLevels})
     */
    public RitzLevels levels(Species species) {
        List<String> floating = new ArrayList<>();
        for (LevelSystem s : systems) {
            if (!s.isAbsolute()) {
                floating.add("'" + s.reference() + "' (" + s.levels().size() + " levels)");
            }
        }
        if (!floating.isEmpty()) {
            throw new RitzException(RitzException.UNCONNECTED, "the energies of the system" + (floating.size() == 1
                    ? " " : "s ") + "of " + String.join(", ", floating) + " are relative to " + (floating.size() == 1
                    ? "its" : "their") + " reference, so lines between systems cannot be predicted; give the "
                    + "reference an energy (SystemReference.at), or take absoluteLevels or systemLevels");
        }
        return subset(species, null);
    }

    /**
     * @param species the species the levels belong to
     * @return the levels of the main and anchored systems with their covariance (those of floating systems
     *         left out: lines to them cannot be predicted)
     * @throws RitzException ({@link RitzException#BAD_VALUE}) when a level came out below 0;
     *         ({@link RitzException#SINGULAR}) as for {@link #levels}
     */
    public RitzLevels absoluteLevels(Species species) {
        boolean[] take = new boolean[systems.size()];
        for (LevelSystem s : systems) {
            take[s.index()] = s.isAbsolute();
        }
        return subset(species, take);
    }

    /**
     * The levels of one system, for the Ritz lines within it: exact in a floating system too, since they
     * are differences (the levels' energies are then relative to the reference, and so are the lines'
     * upper energies).
     *
     * @param species the species the levels belong to
     * @param index   the system's index in {@link #systems()}
     * @return its levels with their covariance
     * @throws IndexOutOfBoundsException for an index not in {@link #systems()}
     * @throws RitzException ({@link RitzException#BAD_VALUE}) when a level came out below 0 (below the
     *         ground level, or in a floating system below its reference: name the lowest level as reference);
     *         ({@link RitzException#SINGULAR}) as for {@link #levels}
     */
    public RitzLevels systemLevels(Species species, int index) {
        Objects.checkIndex(index, systems.size());
        boolean[] take = new boolean[systems.size()];
        take[index] = true;
        return subset(species, take);
    }

    /** @param take per system, whether its levels are taken; null: all */
    private RitzLevels subset(Species species, boolean[] take) {
        List<Integer> in = new ArrayList<>();
        for (int i = 0; i < energy.length; i++) {
            if (take == null || take[system[i]]) {
                in.add(i);
            }
        }
        RitzLevels.Builder b = RitzLevels.builder(species);
        for (int i : in) {
            if (energy[i] < 0) {
                LevelSystem s = systems.get(system[i]);
                throw new RitzException(RitzException.BAD_VALUE, "level '" + problem.levels().get(i) + "' came out at "
                        + energy[i] + " cm-1, " + (s.isAbsolute() ? "below the ground level; hold the ground level "
                        + "(or give the reference its energy above it) to make a level list" : "below its system's "
                        + "reference '" + s.reference() + "'; name the system's lowest level as its reference to "
                        + "make a level list"));
            }
            b.add(problem.levels().get(i), energy[i], uncertaintyPerCm(i), -1);
        }
        double[][] v = new double[in.size()][in.size()];
        for (int a = 0; a < v.length; a++) {
            for (int c = 0; c < v.length; c++) {
                v[a][c] = covariance[in.get(a)][in.get(c)];
            }
        }
        checkCarried(take);
        return b.build().withCovariance(v);
    }

    /**
     * Refuses a level list whose covariance cannot carry the Ritz uncertainty of a measured line between its
     * levels: a level list gives a line's uncertainty as {@code sqrt(V_uu + V_ll - 2 V_ul)}, a difference that
     * loses about {@code (V_uu + V_ll) / u_Ritz^2} parts in 1e16 (a precise group of levels hung on the
     * reference by much looser lines: 1e-8 of itself when they are 1e4 times looser, 1 to 30 per cent or 0 from
     * 1e7), where {@link #ritzUncertaintyPerCm} keeps its digits. Off by more than {@value #CARRIED} of itself,
     * the list is refused, naming the line.
     */
    private void checkCarried(boolean[] take) {
        for (int k = 0; k < ritz.length; k++) {
            int u = problem.upper(k);
            int l = problem.lower(k);
            if (take != null && !(take[system[u]] && take[system[l]])) {
                continue;
            }
            double fromCovariance = Math.sqrt(Math.max(0, covariance[u][u] + covariance[l][l] - 2 * covariance[u][l]));
            if (!(Math.abs(fromCovariance - ritzSigma[k]) <= CARRIED * ritzSigma[k])) {
                throw new RitzException(RitzException.SINGULAR, String.format(Locale.ROOT, "line %d (%s): "
                        + "a level list cannot carry its Ritz uncertainty %.3g cm-1 in double precision: from the "
                        + "levels' covariance it comes out %.3g cm-1, since the levels it joins, '%s' and '%s', are "
                        + "known %.1e times less precisely (a precise group of levels joined to the reference only by "
                        + "much looser lines); take the Ritz uncertainties from the fit, or fit that group as a "
                        + "system of its own (leave out the loose lines joining it and fit separate systems) for a "
                        + "level list", k + 1, problem.name(k), ritzSigma[k], fromCovariance,
                        problem.levels().get(u), problem.levels().get(l),
                        Math.sqrt(Math.max(covariance[u][u], covariance[l][l])) / ritzSigma[k]));
            }
        }
    }

    @Override
    public String toString() {
        return "LevelOptimum[" + energy.length + " levels from " + (ritz.length - leftOut.size()) + " of "
                + ritz.length + " lines, chi2 " + chiSquare + " for " + degreesOfFreedom + " degrees of freedom"
                + (systems.size() == 1 ? "" : ", " + systems.size() + " systems") + "]";
    }
}
