package org.ritzwerk.engine.identify;

import java.util.ArrayList;
import java.util.List;
import org.ritzwerk.atom.Species;

/**
 * The result of {@link Identifier#identify}: per peak (in the peaks' order) the status, the line
 * it is matched to, the residual and the cost, the runner-up line; and the summaries a report
 * needs: unexplained peaks, strong lines that are missing, and the presence of each species.
 * Immutable and thread-safe.
 */
public final class Identification {

    /** Status: no candidate line within the tolerance was left for this peak. */
    public static final byte UNEXPLAINED = 0;
    /** Status: matched to one line that no close rival explains as well. */
    public static final byte MATCHED = 1;
    /** Status: matched, but another line close by explains the peak nearly as well. */
    public static final byte AMBIGUOUS = 2;

    private final PeakList peaks;
    private final LineCatalog lines;
    private final byte[] status;
    private final int[] linePlusOne;
    private final boolean[] used;
    private final int greedyComponents;
    private final double strongLine;
    private final Tolerance tolerance;
    private final double strengthWeight;
    private final Identifier.IntensityTerm intensityTerm;

    Identification(PeakList peaks, LineCatalog lines, byte[] status, int[] linePlusOne, boolean[] used,
            int greedyComponents, double strongLine, Tolerance tolerance, double strengthWeight,
            Identifier.IntensityTerm intensityTerm) {
        this.peaks = peaks;
        this.lines = lines;
        this.status = status;
        this.linePlusOne = linePlusOne;
        this.used = used;
        this.greedyComponents = greedyComponents;
        this.strongLine = strongLine;
        this.tolerance = tolerance;
        this.strengthWeight = strengthWeight;
        this.intensityTerm = intensityTerm;
    }

    /**
     * @return the intensity scale ln A the second pass used (median of ln I - ln S over the first
     *         matches), NaN when the observed intensities were not used
     */
    public double intensityScale() {
        return intensityTerm.weight() == 0 ? Double.NaN : intensityTerm.scale();
    }

    /** Presence of one species among the identified lines. */
    public record SpeciesPresence(Species species, int matched, int strongInRange, int strongMatched) {

        /**
         * @return the share of the species' strong lines in the observed range that were found,
         *         in [0, 1]; NaN when it has no strong line in range
         */
        public double confidence() {
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

    /** @param i peak index @return {@link #MATCHED}, {@link #AMBIGUOUS} or {@link #UNEXPLAINED} */
    public int status(int i) {
        return status[i];
    }

    /** @param i peak index @return the matched line's index in {@link #lines()}, or -1 */
    public int line(int i) {
        return linePlusOne[i] - 1;
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
        double reach = tolerance.halfWidth(x, sigma, lines.maxSigma());
        int j = java.util.Arrays.binarySearch(lines.wavelengths(), x - reach);
        j = j < 0 ? -j - 1 : j;
        List<double[]> found = new ArrayList<>();
        for (; j < lines.size() && lines.wavelength(j) <= x + reach; j++) {
            double r = x - lines.wavelength(j);
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

    /** @param i peak index @return peak minus line vacuum wavelength, metres; NaN when unexplained */
    public double residual(int i) {
        return line(i) < 0 ? Double.NaN : peaks.wavelength(i) - lines.wavelength(line(i));
    }

    /** @param i peak index @return the residual over its scoring uncertainty; NaN when unexplained */
    public double normalizedResidual(int i) {
        if (line(i) < 0) {
            return Double.NaN;
        }
        double s = tolerance.scoringSigma(peaks.wavelength(i), peaks.sigma(i), lines.sigma(line(i)));
        return s > 0 ? residual(i) / s : 0;
    }

    /** @param i peak index @return the cost of the chosen candidate (see {@link Identifier}); NaN when unexplained */
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

    /** @param wanted a status @return how many peaks have it */
    public int count(int wanted) {
        int count = 0;
        for (byte s : status) {
            count += s == wanted ? 1 : 0;
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
        for (int i = 0; i < status.length; i++) {
            if (status[i] == wanted) {
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
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < peaks.size(); i++) {
            lo = Math.min(lo, peaks.wavelength(i));
            hi = Math.max(hi, peaks.wavelength(i));
        }
        List<Integer> missing = new ArrayList<>();
        for (int j = 0; j < lines.size(); j++) {
            double w = lines.wavelength(j);
            if (w >= lo && w <= hi && lines.strength(j) >= strongLine && !used[j]) {
                missing.add(j);
            }
        }
        return missing.stream().mapToInt(Integer::intValue).toArray();
    }

    /** @return per species of the catalog, matched lines and strong lines found and expected */
    public List<SpeciesPresence> speciesPresence() {
        int count = lines.speciesList().size();
        int[] matched = new int[count];
        int[] strong = new int[count];
        int[] strongMatched = new int[count];
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < peaks.size(); i++) {
            lo = Math.min(lo, peaks.wavelength(i));
            hi = Math.max(hi, peaks.wavelength(i));
        }
        for (int j = 0; j < lines.size(); j++) {
            int s = lines.speciesIndex(j);
            matched[s] += used[j] ? 1 : 0;
            double w = lines.wavelength(j);
            if (w >= lo && w <= hi && lines.strength(j) >= strongLine) {
                strong[s]++;
                strongMatched[s] += used[j] ? 1 : 0;
            }
        }
        List<SpeciesPresence> presence = new ArrayList<>();
        for (int s = 0; s < count; s++) {
            presence.add(new SpeciesPresence(lines.speciesList().get(s), matched[s], strong[s], strongMatched[s]));
        }
        return presence;
    }
}
