package org.ritzwerk.benchmarks;

/**
 * The baseline of {@link FaddeevaBenchmark}: the engine's Faddeeva function as it was before the
 * far-wing asymptotic series (ritzwerk 0.x up to the issue-19 work), kept here unchanged so the
 * new {@link org.ritzwerk.engine.profile.Faddeeva} is timed beside it in the same run, and tested
 * against it over a wide grid ({@code FaddeevaBaselineTest}).
 *
 * <p>Method: the rational approximation of J. A. C. Weideman, "Computation of the complex error
 * function", SIAM J. Numer. Anal. 31, 1497-1518 (1994), N = 32, for |z| &lt;= 8 (with the Taylor
 * series about the real axis for the real part within 1e-5 of the axis), and the Laplace continued
 * fraction (W. Gautschi, SIAM J. Numer. Anal. 7, 187 (1970)) with 12, 8 or 6 terms beyond, plus
 * exp(-z^2) whenever Im z &lt; 1 there. Below the real axis w(z) = 2 exp(-z^2) - w(-z).
 * Stateless and thread-safe.
 */
public final class FaddeevaBaseline {

    private static final int N = 32;
    private static final double L = Math.sqrt(N / Math.sqrt(2));
    private static final double INV_SQRT_PI = 1 / Math.sqrt(Math.PI);
    /** Polynomial coefficients, highest degree first (Weideman's a, flipped). */
    private static final double[] A = coefficients();

    private FaddeevaBaseline() {
    }

    private static double[] coefficients() {
        int m = 2 * N;
        int m2 = 2 * m;
        // f at t_k = L tan(theta_k / 2), theta_k = k pi / M for k = -M+1 .. M-1, with f = 0 prepended.
        double[] f = new double[m2];
        f[0] = 0;
        for (int k = -m + 1; k <= m - 1; k++) {
            double t = L * Math.tan(k * Math.PI / m / 2);
            f[k + m] = Math.exp(-t * t) * (L * L + t * t);
        }
        // fftshift, then the real part of the DFT, divided by 2M.
        double[] shifted = new double[m2];
        for (int i = 0; i < m2; i++) {
            shifted[i] = f[(i + m2 / 2) % m2];
        }
        double[] a = new double[N + 1];
        for (int k = 0; k <= N; k++) {
            double sum = 0;
            for (int j = 0; j < m2; j++) {
                sum += shifted[j] * Math.cos(2 * Math.PI * k * j / m2);
            }
            a[k] = sum / m2;
        }
        // Keep a(2 .. N+1) (1-based), flipped: highest degree first.
        double[] flipped = new double[N];
        for (int k = 0; k < N; k++) {
            flipped[k] = a[N - k];
        }
        return flipped;
    }

    /**
     * @param x real part
     * @param y imaginary part
     * @return {re w(z), im w(z)} for z = x + i y
     * @throws IllegalArgumentException for non-finite input
     */
    public static double[] w(double x, double y) {
        double[] out = new double[2];
        w(x, y, out);
        return out;
    }

    /**
     * Allocation-free form of {@link #w(double, double)}.
     *
     * @param x   real part
     * @param y   imaginary part
     * @param out receives {re w, im w}
     */
    public static void w(double x, double y, double[] out) {
        if (!Double.isFinite(x) || !Double.isFinite(y)) {
            throw new IllegalArgumentException("the Faddeeva function needs a finite argument, got " + x + " + " + y + "i");
        }
        if (y < 0) {
            // w(z) = 2 exp(-z^2) - w(-z), -z in the upper half-plane.
            upper(-x, -y, out);
            double re = x * x - y * y;
            double im = 2 * x * y;
            double e = Math.exp(-re);
            out[0] = 2 * e * Math.cos(-im) - out[0];
            out[1] = 2 * e * Math.sin(-im) - out[1];
            return;
        }
        upper(x, y, out);
    }

    /** Beyond this |z| the continued fraction is used. */
    private static final double FAR = 8;
    /**
     * Terms of the continued fraction by |z|: 12 below 12, 8 below 30, 6 beyond. A double-precision
     * evaluation against mpmath (make_faddeeva_golden.py's reference, off-line) needed at most 10,
     * 7, 4 terms there for both the complex value to 2e-15 and the real part to 1e-13 relative.
     */
    private static int terms(double modulusSquared) {
        return modulusSquared < 144 ? 12 : modulusSquared < 900 ? 8 : 6;
    }

    private static void upper(double x, double y, double[] out) {
        if (x * x + y * y > FAR * FAR) {
            // t = z - (k/2) / t, from the deepest term up; w = (i / sqrt(pi)) / t.
            double tr = x;
            double ti = y;
            for (int k = terms(x * x + y * y); k >= 1; k--) {
                double d = tr * tr + ti * ti;
                tr = x - 0.5 * k * tr / d;
                ti = y + 0.5 * k * ti / d;
            }
            double d = tr * tr + ti * ti;
            // i / t = i (tr - i ti) / d = (ti + i tr) / d
            out[0] = INV_SQRT_PI * ti / d;
            out[1] = INV_SQRT_PI * tr / d;
            if (y < 1) {
                // Near the real axis the truncated fraction misses the exponentially small
                // exp(-z^2) that the real part is made of when y is tiny (the Gaussian core's far
                // reach); it is added back. Here x^2 - y^2 > 63, so it cannot disturb the rest.
                double e = Math.exp(-(x * x - y * y));
                out[0] += e * Math.cos(2 * x * y);
                out[1] -= e * Math.sin(2 * x * y);
            }
            return;
        }
        if (y < NEAR_AXIS) {
            // Within 1e-5 of the real axis the real part can fall to exp(-x^2) (1e-28 at x = 8),
            // far below the rational form's absolute error. It is taken from the Taylor series
            // about the real axis instead, where Re w(x) = exp(-x^2) exactly and
            // d/dy Re w = (2 / sqrt pi) (2 x D(x) - 1), D the Dawson function
            // (D = (sqrt pi / 2) Im w(x), large and accurate); the next term is
            // -(2x^2 - 1) exp(-x^2) y^2, and the one after is below 1e-10 relative here.
            rational(x, 0, out);
            double imOnAxis = out[1];
            rational(x, y, out);
            double gauss = Math.exp(-x * x);
            out[0] = gauss * (1 - (2 * x * x - 1) * y * y) + y * 2 * INV_SQRT_PI * (x * imOnAxis / INV_SQRT_PI - 1);
            return;
        }
        rational(x, y, out);
    }

    /** Below this imaginary part the real part comes from the series about the real axis. */
    private static final double NEAR_AXIS = 1e-5;

    private static void rational(double x, double y, double[] out) {
        // iz = -y + i x; L - iz = (L + y) - i x; L + iz = (L - y) + i x.
        double dr = L + y;
        double di = -x;
        double nr = L - y;
        double ni = x;
        double den = dr * dr + di * di;
        // Z = (L + iz) / (L - iz)
        double zr = (nr * dr + ni * di) / den;
        double zi = (ni * dr - nr * di) / den;
        // p(Z) by Horner.
        double pr = A[0];
        double pi = 0;
        for (int k = 1; k < N; k++) {
            double tr = pr * zr - pi * zi + A[k];
            pi = pr * zi + pi * zr;
            pr = tr;
        }
        // 1 / (L - iz) and 1 / (L - iz)^2.
        double ir = dr / den;
        double ii = -di / den;
        double i2r = ir * ir - ii * ii;
        double i2i = 2 * ir * ii;
        out[0] = 2 * (pr * i2r - pi * i2i) + INV_SQRT_PI * ir;
        out[1] = 2 * (pr * i2i + pi * i2r) + INV_SQRT_PI * ii;
    }
}
