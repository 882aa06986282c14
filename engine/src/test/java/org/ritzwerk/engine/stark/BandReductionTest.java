package org.ritzwerk.engine.stark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.apache.commons.math4.legacy.linear.Array2DRowRealMatrix;
import org.apache.commons.math4.legacy.linear.EigenDecomposition;
import org.junit.jupiter.api.Test;

/**
 * The band reduction on seeded random symmetric band matrices, against Commons Math's dense
 * decomposition of the same matrix: the eigenvalues, the tracked vector's shares, the zeros it
 * leaves outside the tridiagonal, and a reused workspace.
 */
class BandReductionTest {

    /** A random symmetric band matrix as couplings above the diagonal, with some zeros inside the band. */
    private static final class Band {
        final double[] diagonal;
        final int[] rows;
        final int[] columns;
        final double[] values;
        final int band;

        Band(int n, int band, long seed) {
            Random random = new Random(seed);
            this.band = band;
            diagonal = new double[n];
            List<int[]> at = new ArrayList<>();
            List<Double> v = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                diagonal[i] = random.nextDouble() * 2 - 1;
                for (int j = i + 1; j <= Math.min(n - 1, i + band); j++) {
                    if (j - i == band || random.nextInt(4) != 0) {
                        at.add(new int[] {i, j});
                        v.add(random.nextDouble() - 0.5);
                    }
                }
            }
            rows = at.stream().mapToInt(x -> x[0]).toArray();
            columns = at.stream().mapToInt(x -> x[1]).toArray();
            values = v.stream().mapToDouble(Double::doubleValue).toArray();
        }

        double[][] dense(double scale) {
            int n = diagonal.length;
            double[][] h = new double[n][n];
            for (int i = 0; i < n; i++) {
                h[i][i] = diagonal[i];
            }
            for (int k = 0; k < values.length; k++) {
                h[rows[k]][columns[k]] = scale * values[k];
                h[columns[k]][rows[k]] = scale * values[k];
            }
            return h;
        }
    }

    @Test
    void eigenvaluesAndSharesMatchTheDenseDecomposition() {
        int[][] cases = {{1, 1}, {2, 1}, {3, 2}, {5, 4}, {12, 11}, {40, 3}, {120, 7}, {160, 23}};
        for (int[] c : cases) {
            int n = c[0];
            int b = c[1];
            Band m = new Band(n, b, 1000L * n + b);
            double scale = 0.7;
            int ref = n / 3;
            double[] tracked = new double[n];
            tracked[ref] = 1;
            BandReduction r = BandReduction.ofCouplings(m.diagonal, m.rows, m.columns, m.values, scale, b, tracked);
            r.reduce();
            assertEquals(0, r.largestBeyondTridiagonal(), 0, "n = " + n + ", b = " + b + ": beyond the tridiagonal");
            double[] shares = new double[n];
            double[] e = n == 1 ? new double[] {r.diagonal()[0]}
                    : TridiagonalEigen.eigenvaluesAndShares(r.diagonal(), r.offDiagonal(), tracked, shares);
            if (n == 1) {
                shares[0] = tracked[0] * tracked[0];
            }
            EigenDecomposition dense = new EigenDecomposition(new Array2DRowRealMatrix(m.dense(scale), false));
            double[] want = dense.getRealEigenvalues().clone();
            Integer[] order = new Integer[n];
            for (int i = 0; i < n; i++) {
                order[i] = i;
            }
            Arrays.sort(order, (x, y) -> Double.compare(want[x], want[y]));
            double sum = 0;
            for (int i = 0; i < n; i++) {
                assertEquals(want[order[i]], e[i], 1e-12, "n = " + n + ", b = " + b + ", eigenvalue " + i);
                double component = dense.getEigenvector(order[i]).getEntry(ref);
                assertEquals(component * component, shares[i], 1e-9, "n = " + n + ", b = " + b + ", share " + i);
                sum += shares[i];
            }
            assertEquals(1, sum, 1e-12, "n = " + n + ", b = " + b + ": the shares add up to 1");
        }
    }

    @Test
    void aReusedWorkspaceGivesTheSameNumbersAsAFreshOne() {
        Band first = new Band(90, 9, 7);
        Band second = new Band(90, 9, 8);
        BandReduction fresh = BandReduction.ofCouplings(first.diagonal, first.rows, first.columns, first.values, 1.3, 9,
                unit(90, 4));
        fresh.reduce();
        BandReduction reused = new BandReduction(90, 9);
        reused.load(second.diagonal, second.rows, second.columns, second.values, 0.2, unit(90, 50)).reduce();
        double[] tracked = unit(90, 4);
        reused.load(first.diagonal, first.rows, first.columns, first.values, 1.3, tracked).reduce();
        double[] freshTracked = unit(90, 4);
        BandReduction again = BandReduction.ofCouplings(first.diagonal, first.rows, first.columns, first.values, 1.3, 9,
                freshTracked);
        again.reduce();
        assertArrayEquals(fresh.diagonal(), reused.diagonal());
        assertArrayEquals(fresh.offDiagonal(), reused.offDiagonal());
        assertArrayEquals(freshTracked, tracked);
        // without a tracked vector the matrix is reduced the same way
        BandReduction untracked = new BandReduction(90, 9);
        untracked.load(first.diagonal, first.rows, first.columns, first.values, 1.3, null).reduce();
        assertArrayEquals(fresh.diagonal(), untracked.diagonal());
        assertArrayEquals(fresh.offDiagonal(), untracked.offDiagonal());
    }

    @Test
    void refusesACouplingOutsideTheBandOrAnotherOrder() {
        BandReduction r = new BandReduction(10, 2);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> r.load(new double[10], new int[] {1}, new int[] {4}, new double[] {1}, 1, null));
        assertEquals("coupling (1, 4) is not above the diagonal within 2", e.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> r.load(new double[10], new int[] {3}, new int[] {3}, new double[] {1}, 1, null));
        e = assertThrows(IllegalArgumentException.class,
                () -> r.load(new double[9], new int[0], new int[0], new double[0], 1, null));
        assertEquals("the workspace holds order 10, got 9", e.getMessage());
    }

    private static double[] unit(int n, int at) {
        double[] v = new double[n];
        v[at] = 1;
        return v;
    }
}
