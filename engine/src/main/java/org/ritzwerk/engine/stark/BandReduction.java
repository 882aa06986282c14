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
 * problem itself is left to Commons Math ({@code EigenDecomposition(main, secondary)}).
 * Not thread-safe (it works in place); used inside one call.
 */
final class BandReduction {

    private final double[][] a;
    private final int n;
    private final int band;
    private final double[] tracked;

    /**
     * @param matrix  the symmetric matrix, dense storage, changed in place
     * @param band    its half-bandwidth b: {@code A[i][j] = 0} for {@code |i - j| > b}
     * @param tracked a vector to which every rotation is applied as well (G^T v), changed in place
     */
    BandReduction(double[][] matrix, int band, double[] tracked) {
        this.a = matrix;
        this.n = matrix.length;
        this.band = Math.max(1, band);
        this.tracked = tracked;
    }

    /** Runs the reduction; afterwards the matrix is tridiagonal (up to rounding). */
    void reduce() {
        for (int j = 0; j < n - 2; j++) {
            for (int k = Math.min(band, n - 1 - j); k >= 2; k--) {
                int q = j + k;
                if (a[j][q] == 0) {
                    continue;
                }
                rotateToZero(j, q);
                // chase the bulge created at (q - 1, q - 1 + band + 1) down the band
                int row = q - 1;
                int col = q + band;
                while (col < n && a[row][col] != 0) {
                    rotateToZero(row, col);
                    row = col - 1;
                    col = col + band;
                }
            }
        }
    }

    /** Zeroes {@code A[r][q]} (and {@code A[q][r]}) with a rotation in the plane (q - 1, q). */
    private void rotateToZero(int r, int q) {
        int p = q - 1;
        double x = a[r][q];
        double y = a[r][p];
        double rho = Math.hypot(x, y);
        double c = y / rho;
        double s = x / rho;
        int lo = Math.max(0, p - band - 2);
        int hi = Math.min(n, q + band + 2);
        double[] rowP = a[p];
        double[] rowQ = a[q];
        for (int i = lo; i < hi; i++) {
            double ap = rowP[i];
            double aq = rowQ[i];
            rowP[i] = c * ap + s * aq;
            rowQ[i] = -s * ap + c * aq;
        }
        for (int i = lo; i < hi; i++) {
            double[] row = a[i];
            double ap = row[p];
            double aq = row[q];
            row[p] = c * ap + s * aq;
            row[q] = -s * ap + c * aq;
        }
        a[r][q] = 0;
        a[q][r] = 0;
        double vp = tracked[p];
        double vq = tracked[q];
        tracked[p] = c * vp + s * vq;
        tracked[q] = -s * vp + c * vq;
    }

    /** @return the diagonal after {@link #reduce()} */
    double[] diagonal() {
        double[] d = new double[n];
        for (int i = 0; i < n; i++) {
            d[i] = a[i][i];
        }
        return d;
    }

    /** @return the first off-diagonal after {@link #reduce()} */
    double[] offDiagonal() {
        double[] e = new double[Math.max(0, n - 1)];
        for (int i = 0; i < n - 1; i++) {
            e[i] = a[i][i + 1];
        }
        return e;
    }
}
