package org.ritzwerk.engine.stark;

/**
 * Reduces a symmetric band matrix to tridiagonal form by Givens rotations with bulge chasing
 * (H. R. Schwarz, "Tridiagonalization of a symmetric band matrix", Numer. Math. 12, 231 (1968);
 * the algorithm behind LAPACK's band reduction; from memory): for each row j, the elements
 * {@code A[j][j+k]}, k = b down to 2, are zeroed by a rotation in the plane (j+k-1, j+k); the
 * element it creates just outside the band, b+1 from the diagonal, is chased down the matrix by
 * further rotations b apart. Every rotation is an orthogonal similarity, so the eigenvalues are
 * those of the band matrix; it costs O(n^2 b) instead of the O(n^3) of a dense reduction. Index 0
 * is never rotated. The rotations are also applied to one vector, so that the share of a chosen
 * basis state in each eigenvector can be had from the tridiagonal eigenvectors. The eigenvalue
 * problem itself is left to LAPACK ({@code TridiagonalEigen}).
 *
 * <p>Storage: the matrix is symmetric and only one bulge exists at a time, so only the upper band
 * with room for that bulge is held: {@code A[i][j]}, {@code 0 <= j - i <= b + 1}, at
 * {@code i (b + 1) + j} of one array ({@code n (b + 2)} doubles, 200 kB at n = 1,008, b = 23).
 * A rotation in the plane (p, q = p + 1) then changes the pairs {@code A[i][p], A[i][q]} of the rows
 * above p (neighbours in memory), the 2 x 2 block and the two rows p and q to the right of q (two
 * contiguous runs), from the row of the element it zeroes to b + 1 beyond: about 2 b pairs, where a
 * rotation of the whole band (both triangles and a margin) costs about 4 b + 10. Element by
 * element the arithmetic is that of the rotation on the full matrix. Not thread-safe (it works in
 * place); an instance is a workspace, reloaded by {@link #load} for the next field.
 */
final class BandReduction {

    /** A[i][j] at i * stride + j, 0 &lt;= j - i &lt;= stride (stride = b + 1, room for the bulge). */
    private final double[] a;
    private final int n;
    private final int band;
    private final int stride;
    private double[] tracked;

    /**
     * An empty workspace for matrices of order n and half-bandwidth at most {@code band}.
     *
     * @param n    the order, at least 1
     * @param band the half-bandwidth b (at least 1 is used)
     */
    BandReduction(int n, int band) {
        this.n = n;
        this.band = Math.max(1, band);
        this.stride = this.band + 1;
        this.a = new double[n * (stride + 1) + stride];
    }

    /**
     * @param diagonal the diagonal, n values
     * @param row      the row of each coupling above the diagonal
     * @param column   its column, within {@code band} of the row
     * @param value    its value, multiplied by {@code scale}
     * @param scale    the factor of every coupling
     * @param band     the half-bandwidth b
     * @param tracked  a vector to which every rotation is applied as well (G^T v), changed in place
     * @return the reduction of that symmetric band matrix
     */
    static BandReduction ofCouplings(double[] diagonal, int[] row, int[] column, double[] value, double scale,
            int band, double[] tracked) {
        BandReduction r = new BandReduction(diagonal.length, band);
        r.load(diagonal, row, column, value, scale, tracked);
        return r;
    }

    /**
     * Loads a matrix into this workspace (the previous one is discarded).
     *
     * @param diagonal the diagonal, n values
     * @param row      the row of each coupling above the diagonal (row &lt; column)
     * @param column   its column, within the workspace's band of the row
     * @param value    its value, multiplied by {@code scale}
     * @param scale    the factor of every coupling
     * @param vector   a vector of n values to which every rotation is applied as well (G^T v), changed in
     *                 place; null for none
     * @return this workspace
     */
    BandReduction load(double[] diagonal, int[] row, int[] column, double[] value, double scale, double[] vector) {
        if (diagonal.length != n) {
            throw new IllegalArgumentException("the workspace holds order " + n + ", got " + diagonal.length);
        }
        java.util.Arrays.fill(a, 0.0);
        for (int i = 0; i < n; i++) {
            a[i * stride + i] = diagonal[i];
        }
        for (int k = 0; k < value.length; k++) {
            int i = row[k];
            int j = column[k];
            if (j <= i || j - i > band) {
                throw new IllegalArgumentException("coupling (" + i + ", " + j + ") is not above the diagonal within "
                        + band);
            }
            a[i * stride + j] = scale * value[k];
        }
        this.tracked = vector;
        return this;
    }

    /** Runs the reduction; afterwards the matrix is tridiagonal (up to rounding). */
    void reduce() {
        for (int j = 0; j < n - 2; j++) {
            for (int k = Math.min(band, n - 1 - j); k >= 2; k--) {
                int q = j + k;
                if (a[j * stride + q] == 0) {
                    continue;
                }
                rotateToZero(j, q);
                // chase the bulge created at (q - 1, q - 1 + band + 1) down the band
                int row = q - 1;
                int col = q + band;
                while (col < n && a[row * stride + col] != 0) {
                    rotateToZero(row, col);
                    row = col - 1;
                    col = col + band;
                }
            }
        }
    }

    /**
     * Zeroes {@code A[r][q]} (and {@code A[q][r]}) with a rotation in the plane (q - 1, q); the rows
     * above r hold nothing in columns q - 1 and q (they are tridiagonal already, or beyond the band).
     */
    private void rotateToZero(int r, int q) {
        int p = q - 1;
        double[] m = a;
        int w = stride;
        double x = m[r * w + q];
        double y = m[r * w + p];
        double ax = Math.abs(x);
        double ay = Math.abs(y);
        double big = Math.max(ax, ay);
        double xs = x / big;
        double ys = y / big;
        double norm = Math.sqrt(xs * xs + ys * ys);
        double c = ys / norm;
        double s = xs / norm;
        // the pairs (A[i][p], A[i][q]) of the rows above p
        for (int at = r * w + p, end = p * w + p; at < end; at += w) {
            double ap = m[at];
            double aq = m[at + 1];
            m[at] = c * ap + s * aq;
            m[at + 1] = -s * ap + c * aq;
        }
        m[r * w + q] = 0;
        // the 2 x 2 block: rows first, then columns, as on the full matrix
        int pp = p * w + p;
        int qq = q * w + q;
        double app = m[pp];
        double apq = m[pp + 1];
        double aqq = m[qq];
        double rowPp = c * app + s * apq;
        double rowPq = c * apq + s * aqq;
        double rowQp = -s * app + c * apq;
        double rowQq = -s * apq + c * aqq;
        m[pp] = c * rowPp + s * rowPq;
        m[pp + 1] = -s * rowPp + c * rowPq;
        m[qq] = -s * rowQp + c * rowQq;
        // rows p and q to the right of q
        int count = Math.min(n - 1, p + w) - q;
        int atP = pp + 2;
        int atQ = qq + 1;
        for (int k = 0; k < count; k++) {
            double ap = m[atP + k];
            double aq = m[atQ + k];
            m[atP + k] = c * ap + s * aq;
            m[atQ + k] = -s * ap + c * aq;
        }
        if (tracked != null) {
            double vp = tracked[p];
            double vq = tracked[q];
            tracked[p] = c * vp + s * vq;
            tracked[q] = -s * vp + c * vq;
        }
    }

    /** @return the largest |A[i][j]| with j - i &ge; 2 held now (zero after {@link #reduce()}; for the tests) */
    double largestBeyondTridiagonal() {
        double largest = 0;
        for (int i = 0; i < n; i++) {
            for (int j = i + 2; j <= Math.min(n - 1, i + stride); j++) {
                largest = Math.max(largest, Math.abs(a[i * stride + j]));
            }
        }
        return largest;
    }

    /** @return the diagonal after {@link #reduce()} */
    double[] diagonal() {
        double[] d = new double[n];
        for (int i = 0; i < n; i++) {
            d[i] = a[i * stride + i];
        }
        return d;
    }

    /** @return the first off-diagonal after {@link #reduce()} */
    double[] offDiagonal() {
        double[] e = new double[Math.max(0, n - 1)];
        for (int i = 0; i < n - 1; i++) {
            e[i] = a[i * stride + i + 1];
        }
        return e;
    }
}
