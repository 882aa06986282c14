package org.ritzwerk.engine.profile;

/**
 * The Faddeeva function {@code w(z) = exp(-z^2) erfc(-i z)} in the upper half-plane
 * ({@code Im z >= 0}); below the real axis {@code w(z) = 2 exp(-z^2) - w(-z)} is used. Two
 * regions:
 * <ul>
 * <li>|z| &lt;= 8: the rational approximation of J. A. C. Weideman, "Computation of the complex
 * error function", SIAM J. Numer. Anal. 31, 1497-1518 (1994), with N = 32 terms:
 * <pre>
 *   w(z) = 2 p(Z) / (L - i z)^2 + (1 / sqrt(pi)) / (L - i z),   Z = (L + i z) / (L - i z),
 * </pre>
 * L = sqrt(N / sqrt 2) and p the polynomial whose coefficients are the discrete Fourier
 * coefficients of {@code exp(-t^2) (L^2 + t^2)} at {@code t = L tan(theta / 2)}, computed once
 * (p is evaluated as four interleaved Horner chains in Z^4). Within 1e-5 of the real axis the
 * real part comes from the Taylor series about the axis, where the rational form's absolute
 * error of about 1e-15 would swamp a real part as small as exp(-x^2).</li>
 * <li>|z| &gt; 8: the asymptotic series (M. Abramowitz and I. A. Stegun, Handbook of Mathematical
 * Functions, NBS Applied Mathematics Series 55 (1964), 7.1.23, in terms of w by 7.1.3; equation
 * numbers from memory, the series checked against mpmath by both golden files)
 * <pre>
 *   w(z) = (i / (sqrt(pi) z)) sum_{k &gt;= 0} (2k - 1)!! / (2 z^2)^k,
 * </pre>
 * truncated where the first omitted term falls below 1e-15 (13 terms beyond the first at
 * |z| = 8, 5 at |z| = 32, 3 at |z| = 320), plus {@code exp(-z^2)} where that can matter (within
 * 1e-8 of the real axis; see {@link #asymptotic}). For Im z &gt; 0 every term adds to Re w with the
 * same sign, so the real part (the Voigt function's far Lorentzian wing) keeps its relative
 * accuracy however small it is. This replaces the Laplace continued fraction used before (W.
 * Gautschi, SIAM J. Numer. Anal. 7, 187 (1970)) with the same accuracy and no division per
 * term: about 3 times as many evaluations per second over the arguments the exact renderer
 * uses ({@code FaddeevaBenchmark}).</li>
 * </ul>
 * Accuracy against mpmath at 40+ digits ({@code FaddeevaTest}, golden/faddeeva.csv on a grid
 * over |x|, y &lt;= 1000 and golden/faddeeva-wide.csv at 1,400 random points): better than
 * 4e-13 relative in the complex value and 6e-8 in the real part (the largest near the real axis
 * just inside |z| = 8); beyond |z| = 8, 2e-15 and 4e-14. Stateless and thread-safe; the tables are
 * constants computed at class initialisation from their formulas, not data.
 */
public final class Faddeeva {

    private static final int N = 32;
    private static final double L = Math.sqrt(N / Math.sqrt(2));
    private static final double INV_SQRT_PI = 1 / Math.sqrt(Math.PI);
    /** Polynomial coefficients, highest degree first (Weideman's a, flipped). */
    private static final double[] A = coefficients();

    private Faddeeva() {
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

    /** Beyond this |z| the asymptotic series is used. */
    private static final double FAR = 8;
    /** The truncation error the series' term count aims at, relative to |w|. */
    private static final double SERIES_TOLERANCE = 1e-15;
    /** Coefficients (2k - 1)!! of the asymptotic series, k = 0 .. 15 (the empty product is 1). */
    private static final double[] SERIES = seriesCoefficients(16);
    /**
     * SERIES_FROM[k]: the smallest |z|^2 at which k terms beyond the first leave a truncation
     * estimate, the first omitted term (2k + 1)!! / (2 |z|^2)^(k + 1), below SERIES_TOLERANCE.
     */
    private static final double[] SERIES_FROM = seriesThresholds();
    /** Below this Im z (and |z| &gt; 8) exp(-z^2) can matter against the real part; see {@link #asymptotic}. */
    private static final double EXP_NEEDED_BELOW = 1e-8;

    private static double[] seriesCoefficients(int n) {
        double[] c = new double[n];
        c[0] = 1;
        for (int k = 1; k < n; k++) {
            c[k] = c[k - 1] * (2 * k - 1);
        }
        return c;
    }

    private static double[] seriesThresholds() {
        double[] from = new double[SERIES.length - 1];
        for (int k = 0; k < from.length; k++) {
            double next = SERIES[k] * (2 * k + 1);
            from[k] = 0.5 * Math.pow(next / SERIES_TOLERANCE, 1.0 / (k + 1));
        }
        return from;
    }

    private static void upper(double x, double y, double[] out) {
        double modulusSquared = x * x + y * y;
        if (modulusSquared > FAR * FAR) {
            asymptotic(x, y, modulusSquared, out);
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

    /**
     * The asymptotic series for |z| &gt; 8, {@code w(z) = (i / (sqrt(pi) z)) sum_k (2k - 1)!! / (2 z^2)^k},
     * by Horner's rule in u = 1 / (2 z^2), with as many terms as {@link #SERIES_FROM} asks. For
     * Im z &gt; 0 every term's contribution to Re w has the same sign, so the real part keeps its
     * relative accuracy however small it is. The series misses exp(-z^2), which is all of Re w on
     * the real axis; it is added when it can matter: |exp(-z^2)| = exp(-(x^2 - y^2)) &lt;
     * exp(-63) there, underflows beyond x^2 - y^2 = 745, and Re w is at least about
     * y / (sqrt(pi) |z|^2) &gt; 7e-4 y for |z|^2 &lt; 746, so for y &gt;= 1e-8 it is below
     * 7e-17 of Re w and is skipped.
     */
    private static void asymptotic(double x, double y, double modulusSquared, double[] out) {
        double d = 1 / modulusSquared;
        // q = 1 / z = (x - i y) / |z|^2; u = q^2 / 2.
        double qr = x * d;
        double qi = -y * d;
        double ur = 0.5 * (qr * qr - qi * qi);
        double ui = qr * qi;
        int k = 0;
        while (k < SERIES_FROM.length - 1 && modulusSquared < SERIES_FROM[k]) {
            k++;
        }
        // S = E(u^2) + u O(u^2), the even and the odd terms as two Horner chains side by side.
        double vr = ur * ur - ui * ui;
        double vi = 2 * ur * ui;
        double er = 0;
        double ei = 0;
        double or = 0;
        double oi = 0;
        for (int j = k - (k & 1); j >= 0; j -= 2) {
            double te = er * vr - ei * vi + SERIES[j];
            ei = er * vi + ei * vr;
            er = te;
            double to = or * vr - oi * vi + (j < k ? SERIES[j + 1] : 0);
            oi = or * vi + oi * vr;
            or = to;
        }
        double sr = er + ur * or - ui * oi;
        double si = ei + ur * oi + ui * or;
        // w = (i / sqrt pi) q S, with i q = -qi + i qr.
        double ar = -qi * INV_SQRT_PI;
        double ai = qr * INV_SQRT_PI;
        out[0] = ar * sr - ai * si;
        out[1] = ar * si + ai * sr;
        if (y < EXP_NEEDED_BELOW && x * x - y * y < 745) {
            double e = Math.exp(-(x * x - y * y));
            out[0] += e * Math.cos(2 * x * y);
            out[1] -= e * Math.sin(2 * x * y);
        }
    }

    /** Below this imaginary part the real part comes from the series about the real axis. */
    private static final double NEAR_AXIS = 1e-5;

    private static void rational(double x, double y, double[] out) {
        // iz = -y + i x; L - iz = (L + y) - i x; L + iz = (L - y) + i x.
        double dr = L + y;
        double di = -x;
        double nr = L - y;
        double ni = x;
        double inv = 1 / (dr * dr + di * di);
        // Z = (L + iz) / (L - iz)
        double zr = (nr * dr + ni * di) * inv;
        double zi = (ni * dr - nr * di) * inv;
        // p(Z) = sum_r Z^r p_r(Z^4), r = 0 .. 3: four Horner chains of 8 coefficients in Z^4, which
        // run side by side instead of one chain of 32 (the same polynomial, a quarter of the wait).
        double z2r = zr * zr - zi * zi;
        double z2i = 2 * zr * zi;
        double z4r = z2r * z2r - z2i * z2i;
        double z4i = 2 * z2r * z2i;
        double p0r = 0;
        double p0i = 0;
        double p1r = 0;
        double p1i = 0;
        double p2r = 0;
        double p2i = 0;
        double p3r = 0;
        double p3i = 0;
        for (int k = 0; k < N; k += 4) {
            // A is highest degree first: A[k] multiplies Z^(N - 1 - k), i.e. chain 3 for k = 0.
            double t3 = p3r * z4r - p3i * z4i + A[k];
            p3i = p3r * z4i + p3i * z4r;
            p3r = t3;
            double t2 = p2r * z4r - p2i * z4i + A[k + 1];
            p2i = p2r * z4i + p2i * z4r;
            p2r = t2;
            double t1 = p1r * z4r - p1i * z4i + A[k + 2];
            p1i = p1r * z4i + p1i * z4r;
            p1r = t1;
            double t0 = p0r * z4r - p0i * z4i + A[k + 3];
            p0i = p0r * z4i + p0i * z4r;
            p0r = t0;
        }
        // p = p0 + Z p1 + Z^2 (p2 + Z p3)
        double hr = p2r + zr * p3r - zi * p3i;
        double hi = p2i + zr * p3i + zi * p3r;
        double pr = p0r + zr * p1r - zi * p1i + z2r * hr - z2i * hi;
        double pi = p0i + zr * p1i + zi * p1r + z2r * hi + z2i * hr;
        // 1 / (L - iz) and 1 / (L - iz)^2.
        double ir = dr * inv;
        double ii = -di * inv;
        double i2r = ir * ir - ii * ii;
        double i2i = 2 * ir * ii;
        out[0] = 2 * (pr * i2r - pi * i2i) + INV_SQRT_PI * ir;
        out[1] = 2 * (pr * i2i + pi * i2r) + INV_SQRT_PI * ii;
    }
}
