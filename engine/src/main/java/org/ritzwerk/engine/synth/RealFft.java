package org.ritzwerk.engine.synth;

import org.apache.commons.math4.transform.FastFourierTransform;

/**
 * Discrete Fourier transforms of real sequences of even length N through one complex transform
 * of length N / 2 (Apache Commons Math's {@link FastFourierTransform#transformInPlace}, which
 * needs a power of two): the even samples go into the real part and the odd samples into the
 * imaginary part, and the two half-length spectra are separated with the symmetry of real
 * sequences' spectra (common practice). With E and O the spectra of the even and odd samples,
 * X_n = E_n + exp(-2 pi i n / N) O_n, E_n = (Z_n + conj Z_(M-n)) / 2,
 * O_n = (Z_n - conj Z_(M-n)) / (2 i), M = N / 2, Z the half-length transform.
 *
 * <p>Forward: X_n = sum_j x_j exp(-2 pi i j n / N), n = 0 .. N / 2 (the rest follow from
 * X_(N-n) = conj X_n). Inverse: x_j = (1 / N) sum_n X_n exp(2 pi i j n / N). Deterministic
 * (the same bits for the same input); one instance holds the twiddle factors of one length and
 * is not shared between threads.
 */
final class RealFft {

    private final int n;
    private final int half;
    private final double[] cos;
    private final double[] sin;
    private final double[][] work;
    private final FastFourierTransform forwardTransform;
    private final FastFourierTransform inverseTransform;

    /** @param n the length, a power of two, at least 4 */
    RealFft(int n) {
        if (n < 4 || Integer.bitCount(n) != 1) {
            throw new IllegalArgumentException("the transform length must be a power of two, at least 4, got " + n);
        }
        this.n = n;
        this.half = n / 2;
        this.cos = new double[half + 1];
        this.sin = new double[half + 1];
        for (int k = 0; k <= half; k++) {
            double angle = 2 * Math.PI * k / n;
            cos[k] = Math.cos(angle);
            sin[k] = Math.sin(angle);
        }
        this.work = new double[2][half];
        this.forwardTransform = new FastFourierTransform(FastFourierTransform.Norm.STD, false);
        this.inverseTransform = new FastFourierTransform(FastFourierTransform.Norm.STD, true);
    }

    /** @return the length N */
    int length() {
        return n;
    }

    /**
     * @param x  N real samples, unchanged
     * @param re the real parts of X_0 .. X_(N/2), N / 2 + 1 values, overwritten
     * @param im their imaginary parts, overwritten
     */
    void forward(double[] x, double[] re, double[] im) {
        double[] zr = work[0];
        double[] zi = work[1];
        for (int j = 0; j < half; j++) {
            zr[j] = x[2 * j];
            zi[j] = x[2 * j + 1];
        }
        forwardTransform.transformInPlace(work);
        for (int k = 0; k <= half; k++) {
            int a = k == half ? 0 : k;
            int b = k == 0 ? 0 : half - k;
            // E = (Z_a + conj Z_b) / 2, O = (Z_a - conj Z_b) / (2 i)
            double er = 0.5 * (zr[a] + zr[b]);
            double ei = 0.5 * (zi[a] - zi[b]);
            double or = 0.5 * (zi[a] + zi[b]);
            double oi = -0.5 * (zr[a] - zr[b]);
            // X_k = E + (cos - i sin) O
            re[k] = er + cos[k] * or + sin[k] * oi;
            im[k] = ei + cos[k] * oi - sin[k] * or;
        }
    }

    /**
     * @param re the real parts of X_0 .. X_(N/2), unchanged
     * @param im their imaginary parts (those of X_0 and X_(N/2) are taken as 0), unchanged
     * @param x  the N real samples, overwritten
     */
    void inverse(double[] re, double[] im, double[] x) {
        double[] zr = work[0];
        double[] zi = work[1];
        for (int k = 0; k < half; k++) {
            int b = half - k;
            double ar = re[k];
            double ai = k == 0 ? 0 : im[k];
            double br = re[b];
            double bi = b == half ? 0 : im[b];
            // E = (X_k + conj X_(M-k)) / 2, O = (X_k - conj X_(M-k)) (cos + i sin) / 2
            double er = 0.5 * (ar + br);
            double ei = 0.5 * (ai - bi);
            double dr = 0.5 * (ar - br);
            double di = 0.5 * (ai + bi);
            double or = dr * cos[k] - di * sin[k];
            double oi = dr * sin[k] + di * cos[k];
            // Z = E + i O
            zr[k] = er - oi;
            zi[k] = ei + or;
        }
        inverseTransform.transformInPlace(work);
        for (int j = 0; j < half; j++) {
            x[2 * j] = zr[j];
            x[2 * j + 1] = zi[j];
        }
    }
}
