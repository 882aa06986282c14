package org.ritzwerk.engine.identify;

import java.util.Arrays;
import org.ritzwerk.constants.PhysicalConstants;

/**
 * Finds the Doppler shift (or the constant wavelength offset) that explains the most lines, with
 * its uncertainty, so the peaks can then be matched against the shifted catalog.
 *
 * <p>Method: every peak-line pair within the search range votes for the shift it implies
 * (redshift {@code z = lambda_peak / lambda_line - 1}, or offset {@code lambda_peak - lambda_line});
 * the densest window of votes, as wide as the tolerance, gives a first value (a Hough-style
 * vote, common practice). It is then refined twice: match against the shifted catalog and take
 * the inverse-variance weighted mean of the matched pairs' implied shifts (plain mean when the
 * uncertainties are unknown); the uncertainty is that of the mean
 * ({@code 1 / sqrt(sum w)}, or the standard deviation over sqrt(n)). A velocity is {@code v = c z}
 * (first order in v/c). Stateless and thread-safe.
 */
public final class ShiftSearch {

    /** The most votes collected; beyond it, peaks are sampled evenly. */
    static final int MAX_VOTES = 4_000_000;

    private ShiftSearch() {
    }

    /**
     * A fitted shift.
     *
     * @param value       the redshift z (dimensionless) or the offset (metres)
     * @param uncertainty its standard uncertainty, same unit
     * @param matches     the number of matched peaks the refinement used
     */
    public record Fit(double value, double uncertainty, int matches) {

        /** @return for a redshift, the radial velocity c z in m/s (away from the observer positive) */
        public double velocity() {
            return PhysicalConstants.C * value;
        }

        /** @return the velocity's standard uncertainty in m/s */
        public double velocityUncertainty() {
            return PhysicalConstants.C * uncertainty;
        }
    }

    /**
     * @param identifier the matcher, whose tolerance sets the vote window
     * @param peaks      measured peaks
     * @param lines      rest-frame lines
     * @param maxSpeed   the largest |v| to search, m/s; positive, below c / 10
     * @return the redshift with its uncertainty
     * @throws IdentificationException when no peak-line pair lies within the range
     */
    public static Fit redshift(Identifier identifier, PeakList peaks, LineCatalog lines, double maxSpeed) {
        if (!(maxSpeed > 0) || maxSpeed >= PhysicalConstants.C / 10) {
            throw new IllegalArgumentException("the speed range must be positive and below c/10, got " + maxSpeed + " m/s");
        }
        double zMax = maxSpeed / PhysicalConstants.C;
        double width = relativeWidth(identifier.tolerance(), peaks, lines);
        return search(identifier, peaks, lines, zMax, width, true);
    }

    /**
     * The densest window of the votes from the lines' centroids, refined; where some blend has
     * groups of components, also the densest window of the votes from every position a peak may
     * see a line at, refined, and the better of the two kept: more matched peaks, then the
     * smaller chi-square of their implied shifts. (Centroid votes alone find a shift from resolved
     * groups only by the centroid's offset; all votes alone can prefer a shift where groups of
     * several unresolved multiplets line up.)
     */
    private static Fit search(Identifier identifier, PeakList peaks, LineCatalog lines, double range, double width,
            boolean relative) {
        double start = densest(votes(identifier.tolerance(), peaks, lines, range, relative, false), width);
        Refined best = refineTwice(identifier, peaks, lines, start, relative);
        if (lines.partsBelow() > 0 || lines.partsAbove() > 0) {
            double other = densest(votes(identifier.tolerance(), peaks, lines, range, relative, true), width);
            if (other != start) {
                Refined alternative = refineTwice(identifier, peaks, lines, other, relative);
                if (alternative.fit.matches() > best.fit.matches() || alternative.fit.matches() == best.fit.matches()
                        && alternative.chiSquare < best.chiSquare) {
                    best = alternative;
                }
            }
        }
        return best.fit;
    }

    /** A refined shift and the chi-square of its matched peaks' implied shifts about it. */
    private record Refined(Fit fit, double chiSquare) {
    }

    private static Refined refineTwice(Identifier identifier, PeakList peaks, LineCatalog lines, double shift,
            boolean relative) {
        Refined refined = null;
        for (int round = 0; round < 2; round++) {
            refined = refine(identifier, peaks, lines, shift, relative);
            shift = refined.fit.value();
        }
        return refined;
    }

    /**
     * @param identifier the matcher
     * @param peaks      measured peaks
     * @param lines      lines
     * @param maxOffset  the largest |offset| to search, metres; positive
     * @return the offset (peak minus line wavelength, metres) with its uncertainty
     */
    public static Fit offset(Identifier identifier, PeakList peaks, LineCatalog lines, double maxOffset) {
        if (!(maxOffset > 0) || Double.isInfinite(maxOffset)) {
            throw new IllegalArgumentException("the offset range must be finite and positive, got " + maxOffset + " m");
        }
        double mid = peaks.wavelength(peaks.size() / 2);
        double width = relativeWidth(identifier.tolerance(), peaks, lines) * mid;
        return search(identifier, peaks, lines, maxOffset, width, false);
    }

    /**
     * Every implied shift of a peak-line pair within range, sampling peaks when there are too many;
     * from the lines' wavelengths (centroids), or with {@code groups} from every position a peak
     * may see a line at ({@link LineCatalog#positions}).
     */
    private static double[] votes(Tolerance tolerance, PeakList peaks, LineCatalog lines, double range,
            boolean relative, boolean groups) {
        double[] lw = lines.wavelengths();
        int n = peaks.size();
        double[] votes = new double[1024];
        int size = 0;
        int stride = 1;
        for (int attempt = 0; attempt < 30; attempt++) {
            size = 0;
            boolean full = false;
            for (int i = 0; i < n && !full; i += stride) {
                double x = peaks.wavelength(i);
                double lo = relative ? x / (1 + range) : x - range;
                double hi = relative ? x / (1 - range) : x + range;
                int j = Identifier.lowerBound(lw, groups ? lo - lines.partsAbove() : lo);
                for (; j < lw.length && lw[j] <= (groups ? hi + lines.partsBelow() : hi) && !full; j++) {
                    double[] seen = groups ? lines.positions(j, tolerance.halfWidth(x, peaks.sigma(i),
                            lines.sigma(j))) : null;
                    for (int k = 0; k < (seen == null ? 1 : seen.length); k++) {
                        double at = seen == null ? lw[j] : seen[k];
                        if (at < lo || at > hi) {
                            continue;
                        }
                        if (size == votes.length) {
                            if (size >= MAX_VOTES) {
                                full = true;
                                break;
                            }
                            votes = Arrays.copyOf(votes, Math.min(2 * size, MAX_VOTES));
                        }
                        votes[size++] = relative ? x / at - 1 : x - at;
                    }
                }
            }
            if (!full) {
                break;
            }
            stride *= 2;
        }
        if (size == 0) {
            throw new IdentificationException(IdentificationException.NO_PAIRS, relative
                    ? String.format(java.util.Locale.ROOT, "no peak lies within +-%.6g km/s of any line; widen the "
                            + "velocity range or check the lines", range * PhysicalConstants.C / 1e3)
                    : String.format(java.util.Locale.ROOT, "no peak lies within +-%.6g nm of any line; widen the "
                            + "offset range or check the lines", range * 1e9));
        }
        return Arrays.copyOf(votes, size);
    }

    /** The centre (median) of the window of the given width holding the most votes. */
    private static double densest(double[] votes, double width) {
        Arrays.sort(votes);
        int best = 0;
        int bestStart = 0;
        int end = 0;
        for (int start = 0; start < votes.length; start++) {
            while (end < votes.length && votes[end] - votes[start] <= width) {
                end++;
            }
            if (end - start > best) {
                best = end - start;
                bestStart = start;
            }
        }
        return votes[bestStart + best / 2];
    }

    private static Refined refine(Identifier identifier, PeakList peaks, LineCatalog lines, double shift,
            boolean relative) {
        LineCatalog moved = relative ? lines.shifted(shift) : lines.offset(shift);
        Identification matches = identifier.identify(peaks, moved);
        double sumW = 0;
        double sumWx = 0;
        double sumWxx = 0;
        double sum = 0;
        double sumSq = 0;
        int count = 0;
        boolean weighted = true;
        for (int i = 0; i < peaks.size(); i++) {
            int j = matches.line(i);
            if (j < 0 || !matches.matchedByOdds(i)) {
                continue;
            }
            double x = peaks.wavelength(i);
            // where the match saw the line (a blend's component or centroid), back in the rest frame
            double seen = matches.matchedPosition(i);
            double rest = relative ? seen / (1 + shift) : seen - shift;
            double implied = relative ? x / rest - 1 : x - rest;
            double sigma = Math.hypot(peaks.sigma(i), lines.sigma(j));
            double s = relative ? sigma / rest : sigma;
            if (s > 0) {
                sumW += 1 / (s * s);
                sumWx += implied / (s * s);
                sumWxx += implied * implied / (s * s);
            } else {
                weighted = false;
            }
            sum += implied;
            sumSq += implied * implied;
            count++;
        }
        if (count == 0) {
            return new Refined(new Fit(shift, Double.NaN, 0), 0);
        }
        double mean = sum / count;
        if (weighted && sumW > 0) {
            return new Refined(new Fit(sumWx / sumW, 1 / Math.sqrt(sumW), count),
                    Math.max(0, sumWxx - sumWx * sumWx / sumW));
        }
        double variance = count > 1 ? (sumSq - count * mean * mean) / (count - 1) : Double.NaN;
        return new Refined(new Fit(mean, Math.sqrt(Math.max(variance, 0) / count), count),
                count > 1 ? Math.max(0, sumSq - count * mean * mean) : 0);
    }

    /** The vote window: the tolerance as a fraction of the wavelength, at the middle peak. */
    private static double relativeWidth(Tolerance tolerance, PeakList peaks, LineCatalog lines) {
        int mid = peaks.size() / 2;
        double x = peaks.wavelength(mid);
        double sigma = peaks.sigma(mid);
        double width = tolerance.halfWidth(x, sigma > 0 ? sigma : 0, lines.maxSigma()) / x;
        if (!(width > 0)) {
            throw new IdentificationException(IdentificationException.NO_WINDOW, "the tolerance gives no window at " + x + " m; give uncertainties or "
                    + "use an absolute or relative tolerance");
        }
        return width;
    }
}
