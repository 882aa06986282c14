package org.ritzwerk.engine.identify;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.Species;

/**
 * Candidate lines in columns, sorted by vacuum wavelength: position and standard uncertainty
 * (metres), the species, a relative expected strength in (0, 1] (1 for the strongest line of its
 * species, or for every line when no strengths are known), and a label. Immutable and
 * thread-safe; one object per line only for the labels.
 */
public final class LineCatalog {

    private final double[] wavelength;
    private final double[] sigma;
    private final double[] strength;
    /** -ln(strength), computed once for the identifier's cost. */
    private final double[] negativeLogStrength;
    private final int[] species;
    private final String[] label;
    private final boolean[] blend;
    /** Per blend, the wavelength span of its components (metres; 0 for other lines). */
    private final double[] spread;
    /**
     * Per blend with declared components, their wavelengths minus the line's (metres), ascending;
     * null for every other line, or null altogether when no line has components.
     */
    private final double[][] parts;
    /** The components' relative strengths, in the order of {@link #parts}. */
    private final double[][] partWeights;
    /** The largest distance of a component below its line's wavelength, and above it (metres). */
    private final double partsBelow;
    private final double partsAbove;
    /**
     * Per line with two or more components, the distinct gaps between neighbouring components,
     * widest first; null for every other line, or null altogether when no line has components.
     */
    private final double[][] gapLevels;
    /**
     * Per line of {@link #gapLevels}: at index L - 1, the weighted centres of the groups its
     * components form when parted at the L widest distinct gaps (metres, ascending).
     */
    private final double[][][] groupCentres;
    /** The lines at least as strong as a threshold, ascending; found on first use (one object, so threads agree). */
    private volatile StrongLines strongLines;

    private record StrongLines(double threshold, int[] lines) {
    }
    private final List<Species> speciesList;
    private final double maxSigma;

    private LineCatalog(double[] wavelength, double[] sigma, double[] strength, int[] species, String[] label,
            boolean[] blend, double[] spread, double[][] parts, double[][] partWeights, List<Species> speciesList) {
        this.blend = blend;
        this.spread = spread;
        this.parts = parts;
        this.partWeights = partWeights;
        double below = 0;
        double above = 0;
        if (parts != null) {
            for (double[] offsets : parts) {
                for (double d : offsets == null ? new double[0] : offsets) {
                    below = Math.max(below, -d);
                    above = Math.max(above, d);
                }
            }
        }
        this.partsBelow = below;
        this.partsAbove = above;
        this.gapLevels = parts == null ? null : new double[parts.length][];
        this.groupCentres = parts == null ? null : new double[parts.length][][];
        for (int j = 0; parts != null && j < parts.length; j++) {
            if (parts[j] != null && parts[j].length >= 2) {
                gapLevels[j] = distinctGapsWidestFirst(parts[j]);
                groupCentres[j] = new double[gapLevels[j].length][];
                for (int level = 1; level <= gapLevels[j].length; level++) {
                    groupCentres[j][level - 1] = groupCentres(wavelength[j], parts[j], partWeights[j],
                            gapLevels[j][level - 1]);
                }
            }
        }
        this.wavelength = wavelength;
        this.sigma = sigma;
        this.strength = strength;
        this.negativeLogStrength = new double[strength.length];
        for (int j = 0; j < strength.length; j++) {
            negativeLogStrength[j] = -Math.log(strength[j]);
        }
        this.species = species;
        this.label = label;
        this.speciesList = speciesList;
        double max = 0;
        for (double s : sigma) {
            max = Math.max(max, s);
        }
        this.maxSigma = max;
    }

    /** @return a builder; lines may be added in any order */
    public static Builder builder() {
        return new Builder();
    }

    /** @return the number of lines */
    public int size() {
        return wavelength.length;
    }

    /**
     * @param j line index
     * @return vacuum wavelength in metres
     */
    public double wavelength(int j) {
        return wavelength[j];
    }

    /**
     * @param j line index
     * @return standard uncertainty in metres (0 when not known)
     */
    public double sigma(int j) {
        return sigma[j];
    }

    /**
     * @param j line index
     * @return relative expected strength in (0, 1]
     */
    public double strength(int j) {
        return strength[j];
    }

    /**
     * @param j line index
     * @return the species
     */
    public Species species(int j) {
        return speciesList.get(species[j]);
    }

    /**
     * @param j line index
     * @return index of the species in {@link #speciesList()}
     */
    public int speciesIndex(int j) {
        return species[j];
    }

    /**
     * @param j line index
     * @return the label given when the line was added
     */
    public String label(int j) {
        return label[j];
    }

    /**
     * @param j line index
     * @return whether the line was declared a blend, which may explain several peaks
     */
    public boolean isBlend(int j) {
        return blend[j];
    }

    /**
     * @param j line index
     * @return for a blend, the wavelength span of its components (longest minus shortest),
     *         metres, 0 when not declared; 0 for every other line
     */
    public double blendSpread(int j) {
        return spread[j];
    }

    double[] blendSpreads() {
        return spread;
    }

    /**
     * Where line j would be seen by a peak at x whose tolerance has half-width h: for a blend
     * with declared components
     * ({@link Builder#addBlend(Species, double, double, double, String, double[], double[])}),
     * the nearest to x of its wavelength (the components' weighted centroid, where the
     * instrument does not resolve them) and the weighted centroids of the groups its components
     * form when parted at every gap wider than h (the groups a peak of that precision can tell
     * apart, where the instrument resolves them: a peak on one group lies beyond the tolerance of
     * the next); with one group, the wavelength alone; for every other line its wavelength.
     *
     * @param j     line index
     * @param x     a peak's vacuum wavelength, metres
     * @param reach the tolerance's half-width h at the peak, metres
     * @return that position, metres
     */
    public double nearestPosition(int j, double x, double reach) {
        double best = wavelength[j];
        int level = partition(j, reach);
        if (level == 0) {
            return best; // one group: the instrument sees the centroid
        }
        for (double at : groupCentres[j][level - 1]) {
            if (Math.abs(x - at) < Math.abs(x - best)) {
                best = at;
            }
        }
        return best;
    }

    /**
     * How line j's components part at half-width h: into the groups left by every gap wider
     * than h, which are the L widest distinct gaps. (Parting only at gaps wider than 2 h, where no
     * peak lies within h of two groups, lost a resolved group: He I 587.6 nm's J = 0 component,
     * 34.5 pm from the rest, went unexplained for peaks of 5 pm at 5 sigma, 25 pm; a peak between
     * the groups is still matched to the nearest of them or the centroid.)
     *
     * @return L, or 0 where they form one group (or the line has fewer than two components)
     */
    private int partition(int j, double h) {
        double[] gaps = gapLevels == null ? null : gapLevels[j];
        if (gaps == null || gaps[0] <= h) {
            return 0;
        }
        int level = 1;
        while (level < gaps.length && gaps[level] > h) {
            level++;
        }
        return level;
    }

    /** @return the distinct gaps between neighbouring offsets (ascending), widest first */
    private static double[] distinctGapsWidestFirst(double[] offsets) {
        double[] gaps = new double[offsets.length - 1];
        for (int k = 1; k < offsets.length; k++) {
            gaps[k - 1] = offsets[k] - offsets[k - 1];
        }
        Arrays.sort(gaps);
        double[] distinct = new double[gaps.length];
        int n = 0;
        for (int k = gaps.length - 1; k >= 0; k--) {
            if (n == 0 || gaps[k] != distinct[n - 1]) {
                distinct[n++] = gaps[k];
            }
        }
        return Arrays.copyOf(distinct, n);
    }

    /**
     * @param centroid the line's wavelength, metres
     * @param offsets  its components' offsets from it, ascending, metres
     * @param weights  their relative strengths
     * @param cut      the narrowest gap that parts the groups
     * @return the groups' strength-weighted centres, ascending, metres
     */
    private static double[] groupCentres(double centroid, double[] offsets, double[] weights, double cut) {
        double[] at = new double[offsets.length];
        int n = 0;
        double sum = 0;
        double weighted = 0;
        for (int k = 0; k < offsets.length; k++) {
            sum += weights[k];
            weighted += weights[k] * offsets[k];
            if (k == offsets.length - 1 || offsets[k + 1] - offsets[k] >= cut) {
                at[n++] = centroid + weighted / sum;
                sum = 0;
                weighted = 0;
            }
        }
        return Arrays.copyOf(at, n);
    }

    /**
     * @param j     line index
     * @param reach a tolerance's half-width h, metres
     * @return every position a peak may see line j at ({@link #nearestPosition}): its wavelength,
     *         then its component groups' centroids where they part at that h; metres
     */
    double[] positions(int j, double reach) {
        int level = partition(j, reach);
        if (level == 0) {
            return new double[] {wavelength[j]};
        }
        double[] centres = groupCentres[j][level - 1];
        double[] at = new double[centres.length + 1];
        at[0] = wavelength[j];
        System.arraycopy(centres, 0, at, 1, centres.length);
        return at;
    }

    /**
     * @param j line index
     * @return the line's components' vacuum wavelengths (metres) as declared, ascending, or an
     *         empty array for a line without declared components
     */
    public double[] componentPositions(int j) {
        double[] offsets = parts == null ? null : parts[j];
        if (offsets == null) {
            return new double[0];
        }
        double[] at = new double[offsets.length];
        for (int k = 0; k < at.length; k++) {
            at[k] = wavelength[j] + offsets[k];
        }
        return at;
    }

    /** @return how far below its wavelength some line's component lies, metres (0 when none) */
    double partsBelow() {
        return partsBelow;
    }

    /** @return how far above its wavelength some line's component lies, metres (0 when none) */
    double partsAbove() {
        return partsAbove;
    }

    /**
     * The length of wavelength within h of line j's {@link #positions}: 2 h for a line seen at
     * one position, the union of the windows around each for a blend whose components part.
     *
     * @param j line index
     * @param h a half-width, metres
     * @return the length, metres
     */
    double windowLength(int j, double h) {
        int level = partition(j, h);
        if (level == 0) {
            return 2 * h; // one group: seen at the centroid only
        }
        // The positions in ascending order without allocating (this runs for every line of every
        // presence figure): the centroid slotted in before the first group centre not below it.
        double centroid = wavelength[j];
        boolean centroidPlaced = false;
        double previous = Double.NaN;
        double length = 0;
        for (double at : groupCentres[j][level - 1]) {
            if (!centroidPlaced && centroid <= at) {
                length += windowStep(previous, centroid, h);
                previous = centroid;
                centroidPlaced = true;
            }
            length += windowStep(previous, at, h);
            previous = at;
        }
        return centroidPlaced ? length : length + windowStep(previous, centroid, h);
    }

    /**
     * @return what a window of half-width h at {@code at} adds to the union of windows at
     *         positions up to {@code previous} (NaN: none yet)
     */
    private static double windowStep(double previous, double at, double h) {
        return Double.isNaN(previous) ? 2 * h : Math.min(2 * h, at - previous);
    }

    /**
     * @param threshold a relative strength
     * @return the lines at least that strong, ascending (the last threshold's list is kept)
     */
    int[] linesAtLeast(double threshold) {
        StrongLines found = strongLines;
        if (found == null || found.threshold() != threshold) {
            found = new StrongLines(threshold, java.util.stream.IntStream.range(0, strength.length)
                    .filter(j -> strength[j] >= threshold).toArray());
            strongLines = found;
        }
        return found.lines();
    }

    /** @return the blend flags, or null when no line is a blend */
    boolean[] blends() {
        for (boolean b : blend) {
            if (b) {
                return blend;
            }
        }
        return null;
    }

    /** @return the distinct species, in the order first added */
    public List<Species> speciesList() {
        return speciesList;
    }

    /** @return the largest line uncertainty, metres */
    double maxSigma() {
        return maxSigma;
    }

    double[] wavelengths() {
        return wavelength;
    }

    double[] negativeLogStrengths() {
        return negativeLogStrength;
    }

    /**
     * @param redshift z; every wavelength is multiplied by 1 + z (the Doppler shift of a source
     *                 moving away at v = c z for |z| much less than 1)
     * @return the catalog as observed from such a source
     */
    public LineCatalog shifted(double redshift) {
        if (!(redshift > -1) || Double.isInfinite(redshift)) {
            throw new IllegalArgumentException("redshift must be finite and above -1, got " + redshift);
        }
        double[] moved = new double[wavelength.length];
        double[] movedSigma = new double[wavelength.length];
        double[] movedSpread = new double[wavelength.length];
        double[][] movedParts = parts == null ? null : new double[parts.length][];
        for (int j = 0; j < moved.length; j++) {
            moved[j] = wavelength[j] * (1 + redshift);
            movedSigma[j] = sigma[j] * (1 + redshift);
            movedSpread[j] = spread[j] * (1 + redshift);
            if (movedParts != null && parts[j] != null) {
                movedParts[j] = new double[parts[j].length];
                for (int k = 0; k < parts[j].length; k++) {
                    movedParts[j][k] = parts[j][k] * (1 + redshift);
                }
            }
        }
        return new LineCatalog(moved, movedSigma, strength, species, label, blend, movedSpread, movedParts,
                partWeights, speciesList);
    }

    /**
     * @param metres added to every wavelength (a constant offset of the instrument's scale)
     * @return the catalog as seen through that offset
     */
    public LineCatalog offset(double metres) {
        if (!Double.isFinite(metres)) {
            throw new IllegalArgumentException("offset must be finite, got " + metres);
        }
        double[] moved = new double[wavelength.length];
        for (int j = 0; j < moved.length; j++) {
            moved[j] = wavelength[j] + metres;
            if (!(moved[j] > 0)) {
                throw new IllegalArgumentException("offset " + metres + " m moves line " + j + " below zero");
            }
        }
        return new LineCatalog(moved, sigma, strength, species, label, blend, spread, parts, partWeights,
                speciesList);
    }

    /** Collects lines; not thread-safe. */
    public static final class Builder {
        private final List<Species> speciesList = new ArrayList<>();
        private double[] wavelength = new double[64];
        private double[] sigma = new double[64];
        private double[] strength = new double[64];
        private int[] species = new int[64];
        private String[] label = new String[64];
        private boolean[] blend = new boolean[64];
        private double[] spread = new double[64];
        private double[][] parts = new double[64][];
        private double[][] partWeights = new double[64][];
        private int size;

        private Builder() {
        }

        /**
         * @param s          species
         * @param vacuumMetres vacuum wavelength in metres; finite, positive
         * @param sigmaMetres  standard uncertainty in metres, 0 when not known; finite, not negative
         * @param expected   expected intensity in any relative unit (e.g. g A), NaN or 0 when not
         *                   known; normalised per species so the strongest is 1
         * @param name       a label such as {@code "3d 2D5/2 - 2p 2P3/2"}, or null
         * @return this builder
         */
        public Builder add(Species s, double vacuumMetres, double sigmaMetres, double expected, String name) {
            return add(s, vacuumMetres, sigmaMetres, expected, name, false);
        }

        /**
         * Adds a line that may explain several peaks: an unresolved blend or multiplet, whose parts
         * an instrument may show as separate peaks, with no declared spread of its components (so
         * it explains several peaks only when they lie within the tolerance of one another; see
         * {@link Identifier}). Parameters as for
         * {@link #add(Species, double, double, double, String)}.
         *
         * @param s            species
         * @param vacuumMetres vacuum wavelength in metres
         * @param sigmaMetres  standard uncertainty in metres
         * @param expected     expected intensity, or NaN
         * @param name         label, or null
         * @return this builder
         */
        public Builder addBlend(Species s, double vacuumMetres, double sigmaMetres, double expected, String name) {
            return addBlend(s, vacuumMetres, sigmaMetres, expected, name, 0);
        }

        /**
         * Adds a blend whose components span {@code spreadMetres} of vacuum wavelength (longest
         * minus shortest component): it may explain several peaks only when they lie within that
         * spread plus the tolerance of one another (see {@link Identifier}).
         *
         * @param s            species
         * @param vacuumMetres vacuum wavelength in metres (e.g. the weighted mean of the components)
         * @param sigmaMetres  standard uncertainty in metres
         * @param expected     expected intensity, or NaN
         * @param name         label, or null
         * @param spreadMetres the components' span, metres; finite, not negative
         * @return this builder
         */
        public Builder addBlend(Species s, double vacuumMetres, double sigmaMetres, double expected, String name,
                double spreadMetres) {
            if (!(spreadMetres >= 0) || Double.isInfinite(spreadMetres)) {
                throw new IllegalArgumentException("line " + size + ": a blend's spread must be finite and >= 0, got "
                        + spreadMetres + " m");
            }
            add(s, vacuumMetres, sigmaMetres, expected, name, true);
            spread[size - 1] = spreadMetres;
            return this;
        }

        /**
         * Adds a blend with its components' wavelengths and strengths: it spreads over them
         * (longest minus shortest), and a peak may be matched to it at its wavelength (the
         * components' weighted centroid, as an instrument that does not resolve them shows it) or
         * at the centroid of a group of components it can tell apart (as one that resolves them
         * shows them; {@link LineCatalog#nearestPosition}).
         *
         * @param s                species
         * @param vacuumMetres     vacuum wavelength in metres (the weighted mean of the components)
         * @param sigmaMetres      standard uncertainty in metres
         * @param expected         expected intensity, or NaN
         * @param name             label, or null
         * @param componentsMetres the components' vacuum wavelengths, metres; finite, positive
         * @param weights          their relative strengths (NaN or 0 where not known: then all
         *                         count alike), one per component
         * @return this builder
         */
        public Builder addBlend(Species s, double vacuumMetres, double sigmaMetres, double expected, String name,
                double[] componentsMetres, double[] weights) {
            if (weights.length != componentsMetres.length) {
                throw new IllegalArgumentException("line " + size + ": " + componentsMetres.length + " components but "
                        + weights.length + " weights");
            }
            double shortest = Double.POSITIVE_INFINITY;
            double longest = Double.NEGATIVE_INFINITY;
            boolean allKnown = true;
            for (int k = 0; k < componentsMetres.length; k++) {
                double c = componentsMetres[k];
                if (!(c > 0) || Double.isInfinite(c)) {
                    throw new IllegalArgumentException("line " + size + ": a component's wavelength must be finite and"
                            + " positive, got " + c + " m");
                }
                allKnown &= weights[k] > 0 && Double.isFinite(weights[k]);
                shortest = Math.min(shortest, c);
                longest = Math.max(longest, c);
            }
            addBlend(s, vacuumMetres, sigmaMetres, expected, name,
                    componentsMetres.length == 0 ? 0 : longest - shortest);
            Integer[] order = new Integer[componentsMetres.length];
            for (int k = 0; k < order.length; k++) {
                order[k] = k;
            }
            Arrays.sort(order, (a, b) -> Double.compare(componentsMetres[a], componentsMetres[b]));
            double[] offsets = new double[order.length];
            double[] w = new double[order.length];
            for (int k = 0; k < order.length; k++) {
                offsets[k] = componentsMetres[order[k]] - vacuumMetres;
                w[k] = allKnown ? weights[order[k]] : 1;
            }
            parts[size - 1] = offsets;
            partWeights[size - 1] = w;
            return this;
        }

        private Builder add(Species s, double vacuumMetres, double sigmaMetres, double expected, String name,
                boolean blended) {
            Objects.requireNonNull(s, "species");
            if (!(vacuumMetres > 0) || Double.isInfinite(vacuumMetres)) {
                throw new IllegalArgumentException("line " + size + ": wavelength must be finite and positive, got "
                        + vacuumMetres + " m");
            }
            if (!(sigmaMetres >= 0) || Double.isInfinite(sigmaMetres)) {
                throw new IllegalArgumentException("line " + size + ": uncertainty must be finite and >= 0, got "
                        + sigmaMetres + " m");
            }
            if (!Double.isNaN(expected) && (!(expected >= 0) || Double.isInfinite(expected))) {
                throw new IllegalArgumentException("line " + size + ": expected intensity must be finite and >= 0, got "
                        + expected);
            }
            if (size == wavelength.length) {
                int capacity = 2 * size;
                wavelength = Arrays.copyOf(wavelength, capacity);
                sigma = Arrays.copyOf(sigma, capacity);
                strength = Arrays.copyOf(strength, capacity);
                species = Arrays.copyOf(species, capacity);
                label = Arrays.copyOf(label, capacity);
                blend = Arrays.copyOf(blend, capacity);
                spread = Arrays.copyOf(spread, capacity);
                parts = Arrays.copyOf(parts, capacity);
                partWeights = Arrays.copyOf(partWeights, capacity);
            }
            int index = speciesList.indexOf(s);
            if (index < 0) {
                index = speciesList.size();
                speciesList.add(s);
            }
            wavelength[size] = vacuumMetres;
            sigma[size] = sigmaMetres;
            strength[size] = expected;
            species[size] = index;
            label[size] = name;
            blend[size] = blended;
            spread[size] = 0;
            parts[size] = null;
            partWeights[size] = null;
            size++;
            return this;
        }

        /** @return the catalog, sorted by wavelength, strengths normalised per species */
        public LineCatalog build() {
            if (size == 0) {
                throw new IllegalArgumentException("a line catalog needs at least one line");
            }
            double[] max = new double[speciesList.size()];
            for (int j = 0; j < size; j++) {
                if (strength[j] > 0) {
                    max[species[j]] = Math.max(max[species[j]], strength[j]);
                }
            }
            Integer[] order = new Integer[size];
            for (int j = 0; j < size; j++) {
                order[j] = j;
            }
            Arrays.sort(order, (a, b) -> Double.compare(wavelength[a], wavelength[b]));
            double[] w = new double[size];
            double[] u = new double[size];
            double[] st = new double[size];
            int[] sp = new int[size];
            String[] lb = new String[size];
            boolean[] bl = new boolean[size];
            double[] sp2 = new double[size];
            double[][] pa = new double[size][];
            double[][] pw = new double[size][];
            boolean anyParts = false;
            for (int k = 0; k < size; k++) {
                int j = order[k];
                w[k] = wavelength[j];
                u[k] = sigma[j];
                double m = max[species[j]];
                // Unknown or zero strengths count as 1 when the species has none; otherwise a
                // line of unknown strength is given the weakest known share (it is not favoured).
                st[k] = m == 0 ? 1 : strength[j] > 0 ? strength[j] / m : Math.max(1e-6, minPositive(species[j]) / m);
                sp[k] = species[j];
                lb[k] = label[j];
                bl[k] = blend[j];
                sp2[k] = spread[j];
                pa[k] = parts[j];
                pw[k] = partWeights[j];
                anyParts |= parts[j] != null;
            }
            return new LineCatalog(w, u, st, sp, lb, bl, sp2, anyParts ? pa : null, anyParts ? pw : null,
                    Collections.unmodifiableList(new ArrayList<>(speciesList)));
        }

        private double minPositive(int s) {
            double min = Double.POSITIVE_INFINITY;
            for (int j = 0; j < size; j++) {
                if (species[j] == s && strength[j] > 0) {
                    min = Math.min(min, strength[j]);
                }
            }
            return min;
        }
    }
}
