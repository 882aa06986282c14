package org.ritzwerk.engine.calibrate;

import org.apache.commons.math4.legacy.linear.Array2DRowRealMatrix;
import org.apache.commons.math4.legacy.linear.ArrayRealVector;
import org.apache.commons.math4.legacy.linear.QRDecomposition;
import org.apache.commons.math4.legacy.linear.RealMatrix;

/**
 * Weighted least-squares polynomial y = sum_j a_j x^j in a scaled variable x (package-private
 * helper of {@link DispersionFit} and {@link LampMatcher}). Solved by Householder QR of the
 * weighted design matrix (rows sqrt(w_i) x_i^j), never by the normal equations, so the
 * condition number enters once, not squared (common practice); the covariance is
 * (R^T R)^-1 = R^-1 R^-T.
 */
final class PolynomialLeastSquares {

    /**
     * @param coefficients a_0 .. a_degree
     * @param covariance   (A^T W A)^-1, unscaled
     * @param chiSquare    sum of w_i r_i^2
     */
    record Solution(double[] coefficients, double[][] covariance, double chiSquare) {
    }

    private PolynomialLeastSquares() {
    }

    /**
     * @param x      scaled abscissae (ideally within [-1, 1])
     * @param y      ordinates
     * @param weight weights 1 / sigma^2, positive; or null for all 1
     * @param use    which points take part, or null for all
     * @param degree polynomial degree, &gt;= 0
     * @return the solution, or null when the design is singular (too few distinct x)
     */
    static Solution fit(double[] x, double[] y, double[] weight, boolean[] use, int degree) {
        int k = degree + 1;
        int m = 0;
        for (int i = 0; i < x.length; i++) {
            if (use == null || use[i]) {
                m++;
            }
        }
        if (m < k) {
            return null;
        }
        double[][] a = new double[m][k];
        double[] b = new double[m];
        int r = 0;
        for (int i = 0; i < x.length; i++) {
            if (use != null && !use[i]) {
                continue;
            }
            double sw = weight == null ? 1 : Math.sqrt(weight[i]);
            double power = sw;
            for (int j = 0; j < k; j++) {
                a[r][j] = power;
                power *= x[i];
            }
            b[r] = sw * y[i];
            r++;
        }
        QRDecomposition qr = new QRDecomposition(new Array2DRowRealMatrix(a, false), 0);
        RealMatrix upper = qr.getR();
        double largest = 0;
        for (int j = 0; j < k; j++) {
            largest = Math.max(largest, Math.abs(upper.getEntry(j, j)));
        }
        for (int j = 0; j < k; j++) {
            if (!(Math.abs(upper.getEntry(j, j)) > 1e-13 * largest)) {
                return null;
            }
        }
        double[] coefficients = qr.getSolver().solve(new ArrayRealVector(b, false)).toArray();
        // R^-1 by back substitution, then (R^T R)^-1 = R^-1 R^-T.
        double[][] inverse = new double[k][k];
        for (int col = 0; col < k; col++) {
            for (int row = col; row >= 0; row--) {
                double sum = row == col ? 1 : 0;
                for (int j = row + 1; j <= col; j++) {
                    sum -= upper.getEntry(row, j) * inverse[j][col];
                }
                inverse[row][col] = sum / upper.getEntry(row, row);
            }
        }
        double[][] covariance = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                double sum = 0;
                for (int l = Math.max(i, j); l < k; l++) {
                    sum += inverse[i][l] * inverse[j][l];
                }
                covariance[i][j] = sum;
            }
        }
        double chiSquare = 0;
        for (int i = 0; i < x.length; i++) {
            if (use != null && !use[i]) {
                continue;
            }
            double res = y[i] - evaluate(coefficients, x[i]);
            chiSquare += (weight == null ? 1 : weight[i]) * res * res;
        }
        return new Solution(coefficients, covariance, chiSquare);
    }

    /** @param a coefficients @param x scaled abscissa @return the polynomial by Horner's rule */
    static double evaluate(double[] a, double x) {
        double v = 0;
        for (int j = a.length - 1; j >= 0; j--) {
            v = v * x + a[j];
        }
        return v;
    }

    /** @param a coefficients @param x scaled abscissa @return the derivative in x */
    static double derivative(double[] a, double x) {
        double v = 0;
        for (int j = a.length - 1; j >= 1; j--) {
            v = v * x + j * a[j];
        }
        return v;
    }

    /** phi(x)^T C phi(x) with phi(x) = (1, x, x^2, ...): the variance of the polynomial at x. */
    static double quadraticForm(double[][] c, double x) {
        int k = c.length;
        double[] phi = new double[k];
        double power = 1;
        for (int j = 0; j < k; j++) {
            phi[j] = power;
            power *= x;
        }
        double sum = 0;
        for (int r = 0; r < k; r++) {
            for (int col = 0; col < k; col++) {
                sum += phi[r] * c[r][col] * phi[col];
            }
        }
        return sum;
    }
}
