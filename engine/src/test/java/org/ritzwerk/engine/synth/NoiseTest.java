package org.ritzwerk.engine.synth;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;

/** Poisson and read noise: the right distributions, reproducible from the seed. */
class NoiseTest {

    @Test
    void poissonCountsFollowThePoissonDistribution() {
        // Chi-square against the Poisson pmf (computed here by its recurrence), over bins
        // expecting at least 20 counts, for a mean drawn by inversion and two by PTRS; the
        // limit dof + 6 sqrt(2 dof) is far beyond chance for a correct sampler (common practice).
        for (double mean : new double[] {3, 25, 1e4}) {
            int n = 200_000;
            double[] expected = new double[n];
            Arrays.fill(expected, mean);
            double[] counts = new double[n];
            Noise.apply(expected, 0, 42L + (long) mean, counts);
            int lo = (int) Math.max(0, Math.floor(mean - 6 * Math.sqrt(mean)));
            int hi = (int) Math.ceil(mean + 6 * Math.sqrt(mean));
            double[] observed = new double[hi - lo + 1];
            double sum = 0;
            double sumSquares = 0;
            for (double c : counts) {
                assertEquals(Math.rint(c), c, 0, "counts are whole numbers");
                sum += c;
                sumSquares += c * c;
                if (c >= lo && c <= hi) {
                    observed[(int) c - lo]++;
                }
            }
            double sampleMean = sum / n;
            double sampleVariance = sumSquares / n - sampleMean * sampleMean;
            assertEquals(mean, sampleMean, 5 * Math.sqrt(mean / n), "mean " + mean);
            assertEquals(mean, sampleVariance, 6 * mean * Math.sqrt(2.0 / n), "variance " + mean);
            double chi = 0;
            int dof = -1;
            double logPmf = -mean; // ln P(0)
            for (int k = 0; k <= hi; k++) {
                if (k > 0) {
                    logPmf += Math.log(mean / k);
                }
                if (k < lo) {
                    continue;
                }
                double e = n * Math.exp(logPmf);
                if (e >= 20) {
                    double d = observed[k - lo] - e;
                    chi += d * d / e;
                    dof++;
                }
            }
            assertTrue(dof > 3 && chi < dof + 6 * Math.sqrt(2.0 * dof), "mean " + mean + ": chi2 " + chi + " dof " + dof);
        }
    }

    @Test
    void stirlingMeetsTheTableOfLogFactorials() {
        double direct = 0;
        for (int k = 1; k <= 1000; k++) {
            direct += Math.log(k);
            if (k >= 256) {
                assertEquals(direct, Noise.logFactorial(k), 1e-13 * direct, "k " + k);
            }
        }
    }

    @Test
    void sameSeedSameCountsWhateverTheLength() {
        double[] expected = new double[10_000];
        for (int i = 0; i < expected.length; i++) {
            expected[i] = 0.5 + i % 97;
        }
        double[] a = new double[expected.length];
        double[] b = new double[expected.length];
        Noise.apply(expected, 3.5, 7L, a);
        Noise.apply(expected, 3.5, 7L, b);
        assertArrayEquals(a, b, 0);
        double[] prefix = Arrays.copyOf(expected, 5000);
        double[] c = new double[5000];
        Noise.apply(prefix, 3.5, 7L, c);
        assertArrayEquals(Arrays.copyOf(a, 5000), c, 0);
        Noise.apply(expected, 3.5, 8L, b);
        assertFalse(Arrays.equals(a, b));
    }

    @Test
    void readNoiseHasItsStandardDeviation() {
        double[] zero = new double[100_000];
        double[] out = new double[zero.length];
        Noise.apply(zero, 2, 99L, out);
        double sum = 0;
        double sumSquares = 0;
        for (double v : out) {
            sum += v;
            sumSquares += v * v;
        }
        double mean = sum / out.length;
        assertEquals(0, mean, 5 * 2 / Math.sqrt(out.length));
        assertEquals(2, Math.sqrt(sumSquares / out.length - mean * mean), 0.02);
    }

    @Test
    void refusesUnusableExpectations() {
        assertEquals("pixel 2: expected counts must be finite and not negative, got -1.0",
                assertThrows(IllegalArgumentException.class,
                        () -> Noise.apply(new double[] {1, 2, -1}, 0, 1L, new double[3])).getMessage());
        assertEquals("read noise must be finite and not negative, got NaN",
                assertThrows(IllegalArgumentException.class,
                        () -> Noise.apply(new double[] {1}, Double.NaN, 1L, new double[1])).getMessage());
    }
}
