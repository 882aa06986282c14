package org.ritzwerk.engine.calibrate;

import java.util.Arrays;

/**
 * Baseline and noise of a spectrum with emission lines (package-private helper of
 * {@link PeakFinder}).
 *
 * <p><b>Noise</b>: sigma = 1.4826 MAD(d) / sqrt 2 over the first differences d_i = y_{i+1} - y_i
 * (pairs touching a saturated pixel left out). Differences cancel any smooth baseline; the
 * median absolute deviation ignores the minority of differences that fall on lines; 1.4826
 * turns a MAD into a standard deviation for Gaussian noise and sqrt 2 undoes the doubling of the
 * variance by differencing (common practice).
 *
 * <p><b>Baseline</b>: an iteratively clipped running median. The median of the unmasked pixels
 * within +-window/2 is taken at nodes window/8 apart and interpolated linearly between them;
 * every run of pixels more than 3 sigma above it is masked, widened on both sides by its own
 * length (at least 2 pixels) to cover the line wings, and the median is taken again, until the
 * mask no longer changes (at most 6 passes). Where a window has too few unmasked pixels it is
 * widened (common practice).
 *
 * <p><b>Local noise</b>: 1.4826 times the running median of |y - baseline| over the unmasked
 * pixels of the same windows, so a background whose Poisson noise changes along the detector is
 * followed (common practice).
 *
 * <p><b>Clamped counts</b> (negative counts set to the lowest value, as after a dark subtraction
 * in firmware): when more than half of a sample sits at the clamp, its MAD is 0. The noise is
 * then estimated from the sample above the clamp as from a censored normal sample: with p0 the
 * share at the clamp, the quantiles Q at q1 = p0 + (1 - p0) / 4 and q2 = p0 + 3 (1 - p0) / 4 lie
 * at mu + sigma z(q), so sigma = (Q(q2) - Q(q1)) / (z(q2) - z(q1)) (z the standard normal
 * quantile; quantiles of a censored sample, common practice). With no clamped values this is the
 * interquartile range over 1.349. Counts on a lattice of step h (whole ADU times a gain) stand for
 * intervals of width h: the empirical distribution is read at each value's upper edge, v + h/2,
 * and interpolated linearly.
 */
final class Baseline {

    static final double MAD_TO_SIGMA = 1.4826;
    private static final double CLIP = 3;
    private static final int MAX_PASSES = 6;

    /**
     * @param baseline the baseline, one value per pixel
     * @param mask     the pixels left out of it (lines, their wings, saturated pixels)
     */
    record Estimate(double[] baseline, boolean[] mask) {
    }

    private Baseline() {
    }

    /**
     * @param y         counts
     * @param saturated saturated pixels, or null
     * @return the robust noise estimate (may be 0 for a noiseless spectrum)
     */
    static double noise(double[] y, boolean[] saturated) {
        double[] d = new double[y.length - 1];
        int m = 0;
        for (int i = 0; i + 1 < y.length; i++) {
            if (saturated != null && (saturated[i] || saturated[i + 1])) {
                continue;
            }
            d[m++] = y[i + 1] - y[i];
        }
        if (m < 2) {
            return 0;
        }
        double[] used = Arrays.copyOf(d, m);
        double median = median(used, m);
        for (int i = 0; i < m; i++) {
            used[i] = Math.abs(used[i] - median);
        }
        return MAD_TO_SIGMA * median(used, m) / Math.sqrt(2);
    }

    /**
     * The step of the lattice the counts lie on: the largest h such that every unsaturated count
     * is the lowest one plus a whole multiple of h (Euclid's algorithm on the differences, to a
     * relative 1e-9), e.g. 1 for whole counts and 16 for whole photons times a gain of 16.
     *
     * @param y         counts
     * @param saturated saturated pixels (left out), or null
     * @return the step in counts, or 0 when the counts are not on a lattice of at most 1e7 steps
     *         over their range (or are all equal)
     */
    static double latticeStep(double[] y, boolean[] saturated) {
        double lowest = Double.POSITIVE_INFINITY;
        double highest = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < y.length; i++) {
            if (saturated == null || !saturated[i]) {
                lowest = Math.min(lowest, y[i]);
                highest = Math.max(highest, y[i]);
            }
        }
        double range = highest - lowest;
        if (!(range > 0)) {
            return 0;
        }
        double tolerance = 1e-9 * Math.max(Math.abs(lowest), Math.abs(highest));
        double step = 0;
        for (int i = 0; i < y.length; i++) {
            double d = y[i] - lowest;
            if ((saturated != null && saturated[i]) || d <= tolerance) {
                continue;
            }
            double a = Math.max(step, d);
            double b = step == 0 ? 0 : Math.min(step, d);
            while (b > tolerance) {
                double t = a % b;
                if (b - t <= tolerance) {
                    t = 0;
                }
                a = b;
                b = t;
            }
            step = a;
            if (step < 1e-7 * range) {
                return 0;
            }
        }
        for (int i = 0; i < y.length; i++) {
            if (saturated == null || !saturated[i]) {
                double r = (y[i] - lowest) / step;
                if (Math.abs(r - Math.rint(r)) > 1e-6) {
                    return 0;
                }
            }
        }
        return step;
    }

    /**
     * The noise of clamped counts over the spectrum (see the class comment).
     *
     * @param y         counts
     * @param saturated pixels left out (saturated, or masked as lines), or null
     * @param clamp     the value the counts are clamped at (their lowest)
     * @param step      the lattice step of the counts, 0 for none
     * @return the noise in counts, 0 when too few pixels lie above the clamp
     */
    static double censoredNoise(double[] y, boolean[] saturated, double clamp, double step) {
        double[] values = new double[y.length];
        int count = 0;
        for (int i = 0; i < y.length; i++) {
            if (saturated == null || !saturated[i]) {
                values[count++] = y[i];
            }
        }
        return censoredSigma(values, count, clamp, step);
    }

    /**
     * The local background noise of clamped counts: {@link #censoredNoise} over the unmasked
     * pixels of running windows (as {@link #localNoise}), on the counts themselves.
     *
     * @param y        counts
     * @param estimate the baseline and its mask
     * @param window   window width in pixels
     * @param fallback the noise where a window has no unmasked pixel
     * @param clamp    the clamp value
     * @param step     the lattice step of the counts, 0 for none
     * @return the background noise per pixel, in counts
     */
    static double[] localCensoredNoise(double[] y, Estimate estimate, int window, double fallback, double clamp,
            double step) {
        return runningStatistic(y, estimate.mask(), window, fallback,
                (values, count) -> censoredSigma(values, count, clamp, step));
    }

    /** Sigma of a clamped normal sample from two quantiles above the clamp (reorders the values). */
    static double censoredSigma(double[] values, int count, double clamp, double step) {
        Arrays.sort(values, 0, count);
        int at = 0;
        while (at < count && values[at] <= clamp) {
            at++;
        }
        if (count - at < 4) {
            return 0;
        }
        double p0 = (double) at / count;
        double q1 = p0 + 0.25 * (1 - p0);
        double q2 = p0 + 0.75 * (1 - p0);
        double z1 = Math.sqrt(2) * org.apache.commons.numbers.gamma.InverseErf.value(2 * q1 - 1);
        double z2 = Math.sqrt(2) * org.apache.commons.numbers.gamma.InverseErf.value(2 * q2 - 1);
        return (quantile(values, count, q2, step) - quantile(values, count, q1, step)) / (z2 - z1);
    }

    /**
     * The q-quantile of sorted values on a lattice of step h: the empirical distribution function
     * at each distinct value's upper edge v + h/2, interpolated linearly.
     */
    private static double quantile(double[] sorted, int count, double q, double step) {
        double previousEdge = sorted[0] - step / 2;
        double previousF = 0;
        int i = 0;
        while (i < count) {
            int j = i;
            while (j < count && sorted[j] == sorted[i]) {
                j++;
            }
            double edge = sorted[i] + step / 2;
            double f = (double) j / count;
            if (f >= q) {
                return f == previousF ? edge
                        : previousEdge + (q - previousF) / (f - previousF) * (edge - previousEdge);
            }
            previousEdge = edge;
            previousF = f;
            i = j;
        }
        return sorted[count - 1] + step / 2;
    }

    /**
     * @param y         counts
     * @param saturated saturated pixels (always masked), or null
     * @param window    window width in pixels, at least 3
     * @param noise     the noise in counts, positive
     * @return the baseline, one value per pixel
     */
    static Estimate estimate(double[] y, boolean[] saturated, int window, double noise) {
        int n = y.length;
        boolean[] mask = new boolean[n];
        if (saturated != null) {
            System.arraycopy(saturated, 0, mask, 0, n);
        }
        double[] baseline = runningMedian(y, mask, window, Double.NaN);
        for (int pass = 0; pass < MAX_PASSES; pass++) {
            boolean[] next = new boolean[n];
            int i = 0;
            while (i < n) {
                if (y[i] - baseline[i] > CLIP * noise) {
                    int start = i;
                    while (i < n && y[i] - baseline[i] > CLIP * noise) {
                        i++;
                    }
                    int grow = Math.max(2, i - start);
                    int from = Math.max(0, start - grow);
                    int to = Math.min(n, i + grow);
                    for (int k = from; k < to; k++) {
                        next[k] = true;
                    }
                } else {
                    i++;
                }
            }
            if (saturated != null) {
                for (int k = 0; k < n; k++) {
                    next[k] |= saturated[k];
                }
            }
            if (Arrays.equals(next, mask)) {
                break;
            }
            mask = next;
            baseline = runningMedian(y, mask, window, Double.NaN);
        }
        return new Estimate(baseline, mask);
    }

    /**
     * @param y        counts
     * @param estimate the baseline and its mask
     * @param window   window width in pixels
     * @param fallback the noise where a window has no unmasked pixel
     * @return the background noise per pixel, in counts
     */
    static double[] localNoise(double[] y, Estimate estimate, int window, double fallback) {
        int n = y.length;
        double[] deviation = new double[n];
        for (int i = 0; i < n; i++) {
            deviation[i] = Math.abs(y[i] - estimate.baseline()[i]);
        }
        double[] noise = runningMedian(deviation, estimate.mask(), window, fallback / MAD_TO_SIGMA);
        for (int i = 0; i < n; i++) {
            noise[i] *= MAD_TO_SIGMA;
        }
        return noise;
    }

    /** A statistic of the first count values of a buffer (which it may reorder). */
    private interface Statistic {
        double of(double[] values, int count);
    }

    /** The running median of the unmasked values; where none is left, {@code empty}, or the lower quartile when NaN. */
    private static double[] runningMedian(double[] y, boolean[] mask, int window, double empty) {
        return runningStatistic(y, mask, window, empty, Baseline::median);
    }

    /** As {@link #runningMedian}, for any statistic. */
    private static double[] runningStatistic(double[] y, boolean[] mask, int window, double empty,
            Statistic statistic) {
        int n = y.length;
        int half = Math.max(1, window / 2);
        int step = Math.max(1, window / 8);
        int minCount = Math.max(3, window / 10);
        int nodes = (n - 1) / step + 1;
        boolean extra = (nodes - 1) * step != n - 1;
        int total = nodes + (extra ? 1 : 0);
        int[] position = new int[total];
        double[] value = new double[total];
        double[] buffer = new double[n];
        for (int k = 0; k < total; k++) {
            int c = k < nodes ? k * step : n - 1;
            position[k] = c;
            int h = half;
            int count;
            while (true) {
                count = 0;
                int lo = Math.max(0, c - h);
                int hi = Math.min(n - 1, c + h);
                for (int i = lo; i <= hi; i++) {
                    if (!mask[i]) {
                        buffer[count++] = y[i];
                    }
                }
                if (count >= minCount || (lo == 0 && hi == n - 1)) {
                    break;
                }
                h *= 2;
            }
            if (count == 0 && !Double.isNaN(empty)) {
                value[k] = empty;
            } else if (count == 0) {
                // Everything is masked: fall back on the lower quartile of the window.
                int lo = Math.max(0, c - half);
                int hi = Math.min(n - 1, c + half);
                count = 0;
                for (int i = lo; i <= hi; i++) {
                    buffer[count++] = y[i];
                }
                Arrays.sort(buffer, 0, count);
                value[k] = buffer[count / 4];
            } else {
                value[k] = statistic.of(buffer, count);
            }
        }
        double[] out = new double[n];
        for (int k = 0; k + 1 < total; k++) {
            int a = position[k];
            int b = position[k + 1];
            for (int i = a; i <= b; i++) {
                double t = (double) (i - a) / (b - a);
                out[i] = value[k] + t * (value[k + 1] - value[k]);
            }
        }
        if (total == 1) {
            out[0] = value[0];
        }
        return out;
    }

    /** The median of the first count values (reorders them). */
    static double median(double[] values, int count) {
        Arrays.sort(values, 0, count);
        int mid = count / 2;
        return (count % 2 == 1) ? values[mid] : 0.5 * (values[mid - 1] + values[mid]);
    }
}
