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

    /** The running median of the unmasked values; where none is left, {@code empty}, or the lower quartile when NaN. */
    private static double[] runningMedian(double[] y, boolean[] mask, int window, double empty) {
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
                value[k] = median(buffer, count);
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
