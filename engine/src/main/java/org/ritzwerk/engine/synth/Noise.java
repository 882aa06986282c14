package org.ritzwerk.engine.synth;

import java.util.SplittableRandom;

/**
 * Detector noise on expected pixel counts: Poisson photon noise and Gaussian read noise,
 * seeded and reproducible. Pixels are drawn in blocks of {@value #BLOCK}, each block from its
 * own generator derived from the seed and the block's index, so a result depends only on the
 * seed and the pixel, never on the order or the thread that drew it.
 *
 * <p>Poisson variates: inversion by sequential search below a mean of 10; above it the
 * transformed-rejection method PTRS of W. H&ouml;rmann, "The transformed rejection method for
 * generating Poisson random variables", Insurance: Mathematics and Economics 12, 39-45 (1993).
 */
public final class Noise {

    /** Pixels per independently seeded block. */
    public static final int BLOCK = 4096;

    private static final double[] LOG_FACTORIAL = new double[256];

    static {
        for (int k = 1; k < LOG_FACTORIAL.length; k++) {
            LOG_FACTORIAL[k] = LOG_FACTORIAL[k - 1] + Math.log(k);
        }
    }

    private Noise() {
    }

    /**
     * @param expected      expected counts per pixel, finite and not negative
     * @param readNoise     standard deviation of the Gaussian read noise in counts, not negative
     * @param seed          the seed
     * @param out           receives the noisy counts (may be {@code expected} itself)
     * @throws IllegalArgumentException naming the first pixel whose expectation is unusable
     */
    public static void apply(double[] expected, double readNoise, long seed, double[] out) {
        if (!(Double.isFinite(readNoise) && readNoise >= 0)) {
            throw new IllegalArgumentException("read noise must be finite and not negative, got " + readNoise);
        }
        if (out.length != expected.length) {
            throw new IllegalArgumentException("the output needs one value per pixel (" + expected.length + "), got "
                    + out.length);
        }
        for (int i = 0; i < expected.length; i++) {
            if (!(Double.isFinite(expected[i]) && expected[i] >= 0)) {
                throw new IllegalArgumentException("pixel " + i + ": expected counts must be finite and not negative, got "
                        + expected[i]);
            }
        }
        for (int block = 0; block * BLOCK < expected.length; block++) {
            SplittableRandom random = new SplittableRandom(blockSeed(seed, block));
            int end = Math.min(expected.length, (block + 1) * BLOCK);
            for (int i = block * BLOCK; i < end; i++) {
                double counts = poisson(expected[i], random);
                if (readNoise > 0) {
                    counts += readNoise * gaussian(random);
                }
                out[i] = counts;
            }
        }
    }

    /**
     * A block's seed: the seed and block index through Stafford's "Mix13" 64-bit finaliser
     * (common practice). Seeds one golden-ratio step apart would give one SplittableRandom
     * stream shifted by a draw, so the index is never simply added to the seed.
     */
    private static long blockSeed(long seed, int block) {
        long z = seed + 0x9E3779B97F4A7C15L * (block + 1);
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    /**
     * @param mean   the Poisson mean, finite and not negative
     * @param random the generator
     * @return a Poisson variate
     */
    static double poisson(double mean, SplittableRandom random) {
        if (mean == 0) {
            return 0;
        }
        if (mean < 10) {
            // Inversion: walk the cumulative distribution.
            double u = random.nextDouble();
            double p = Math.exp(-mean);
            double cumulative = p;
            int k = 0;
            while (u > cumulative) {
                k++;
                p *= mean / k;
                double next = cumulative + p;
                if (next == cumulative) {
                    break; // u within rounding of 1: the tail beyond here holds < 1e-15
                }
                cumulative = next;
            }
            return k;
        }
        double logMean = Math.log(mean);
        double smu = Math.sqrt(mean);
        double b = 0.931 + 2.53 * smu;
        double a = -0.059 + 0.02483 * b;
        double invAlpha = 1.1239 + 1.1328 / (b - 3.4);
        double vr = 0.9277 - 3.6224 / (b - 2);
        while (true) {
            double u = random.nextDouble() - 0.5;
            double v = random.nextDouble();
            double us = 0.5 - Math.abs(u);
            double k = Math.floor((2 * a / us + b) * u + mean + 0.43);
            if (us >= 0.07 && v <= vr) {
                return k;
            }
            if (k < 0 || (us < 0.013 && v > us)) {
                continue;
            }
            if (Math.log(v) + Math.log(invAlpha) - Math.log(a / (us * us) + b)
                    <= -mean + k * logMean - logFactorial(k)) {
                return k;
            }
        }
    }

    /** ln k! from a table below 256, Stirling's series above (error below 1e-15 relative there). */
    static double logFactorial(double k) {
        if (k < LOG_FACTORIAL.length) {
            return LOG_FACTORIAL[(int) k];
        }
        double inv = 1 / k;
        double inv2 = inv * inv;
        return k * Math.log(k) - k + 0.5 * Math.log(2 * Math.PI * k)
                + inv * (1.0 / 12 - inv2 * (1.0 / 360 - inv2 / 1260));
    }

    private static double gaussian(SplittableRandom random) {
        // Marsaglia's polar method (common practice); the second variate is discarded so that
        // every pixel draws from its block's stream in a fixed pattern.
        while (true) {
            double x = 2 * random.nextDouble() - 1;
            double y = 2 * random.nextDouble() - 1;
            double s = x * x + y * y;
            if (s > 0 && s < 1) {
                return x * Math.sqrt(-2 * Math.log(s) / s);
            }
        }
    }
}
