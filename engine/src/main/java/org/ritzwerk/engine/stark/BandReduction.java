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
 * <p>Storage: only the band is held, row by row, {@code b + 3} on each side of the diagonal (the
 * band, the bulge one further out and the reach of a rotation's window), so the working set is
 * about {@code n (2b + 7)} doubles instead of the {@code n^2} of a dense matrix; the arithmetic is
 * the same, element by element, as on the dense matrix. Not thread-safe (it works in place); used
 * inside one call.
 */
final class BandReduction {

    /** rows[i][reach + j - i] = A[i][j] for |i - j| &lt;= reach. */
    private final double[][] rows;
    private final int n;
    private final int band;
    private final int reach;
    private final double[] tracked;

    private BandReduction(int n, int band, double[] tracked) {
        this.n = n;
        this.band = Math.max(1, band);
        this.reach = this.band + 3;
        this.rows = new double[n][2 * reach + 1];
        this.tracked = tracked;
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
        BandReduction r = new BandReduction(diagonal.length, band, tracked);
        for (int i = 0; i < diagonal.length; i++) {
            r.rows[i][r.reach] = diagonal[i];
        }
        for (int k = 0; k < value.length; k++) {
            double x = scale * value[k];
            r.rows[row[k]][r.reach + column[k] - row[k]] = x;
            r.rows[column[k]][r.reach + row[k] - column[k]] = x;
        }
        return r;
    }

    /** Runs the reduction; afterwards the matrix is tridiagonal (up to rounding). */
    void reduce() {
        for (int j = 0; j < n - 2; j++) {
            for (int k = Math.min(band, n - 1 - j); k >= 2; k--) {
                int q = j + k;
                if (rows[j][reach + k] == 0) {
                    continue;
                }
                rotateToZero(j, q);
                // chase the bulge created at (q - 1, q - 1 + band + 1) down the band
                int row = q - 1;
                int col = q + band;
                while (col < n && rows[row][reach + col - row] != 0) {
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
        double[] rowR = rows[r];
        double x = rowR[reach + q - r];
        double y = rowR[reach + p - r];
        double rho = Math.hypot(x, y);
        double c = y / rho;
        double s = x / rho;
        int lo = Math.max(0, p - band - 2);
        int hi = Math.min(n, q + band + 2);
        double[] rowP = rows[p];
        double[] rowQ = rows[q];
        int offP = reach - p;
        int offQ = reach - q;
        for (int i = lo; i < hi; i++) {
            double ap = rowP[offP + i];
            double aq = rowQ[offQ + i];
            rowP[offP + i] = c * ap + s * aq;
            rowQ[offQ + i] = -s * ap + c * aq;
        }
        for (int i = lo; i < hi; i++) {
            double[] row = rows[i];
            int atP = reach + p - i;
            double ap = row[atP];
            double aq = row[atP + 1];
            row[atP] = c * ap + s * aq;
            row[atP + 1] = -s * ap + c * aq;
        }
        rowR[reach + q - r] = 0;
        rows[q][reach + r - q] = 0;
        double vp = tracked[p];
        double vq = tracked[q];
        tracked[p] = c * vp + s * vq;
        tracked[q] = -s * vp + c * vq;
    }

    /** @return the diagonal after {@link #reduce()} */
    double[] diagonal() {
        double[] d = new double[n];
        for (int i = 0; i < n; i++) {
            d[i] = rows[i][reach];
        }
        return d;
    }

    /** @return the first off-diagonal after {@link #reduce()} */
    double[] offDiagonal() {
        double[] e = new double[Math.max(0, n - 1)];
        for (int i = 0; i < n - 1; i++) {
            e[i] = rows[i][reach + 1];
        }
        return e;
    }
}
