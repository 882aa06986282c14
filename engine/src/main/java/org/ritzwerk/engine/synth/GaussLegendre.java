package org.ritzwerk.engine.synth;

import java.util.function.DoubleUnaryOperator;

/**
 * Gauss-Legendre quadrature on [-1, 1] with 8 nodes (and a 4-node rule for smooth far wings),
 * nodes by Newton's method on P_n (common practice).
 */
final class GaussLegendre {

    static final int NODES = 8;
    /** Nodes on [-1, 1]; callers must not write to it. */
    static final double[] X = new double[NODES];
    /** Weights; callers must not write to it. */
    static final double[] W = new double[NODES];
    /** The 4-node rule's nodes; callers must not write to it. */
    static final double[] X4 = new double[4];
    /** The 4-node rule's weights; callers must not write to it. */
    static final double[] W4 = new double[4];

    static {
        rule(X, W);
        rule(X4, W4);
    }

    /** Fills the nodes and weights of the rule with x.length nodes. */
    private static void rule(double[] nodes, double[] weights) {
        int n = nodes.length;
        for (int i = 0; i < n; i++) {
            double x = Math.cos(Math.PI * (i + 0.75) / (n + 0.5));
            double derivative = 0;
            for (int iteration = 0; iteration < 100; iteration++) {
                double p0 = 1;
                double p1 = x;
                for (int k = 2; k <= n; k++) {
                    double p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
                    p0 = p1;
                    p1 = p2;
                }
                derivative = n * (x * p1 - p0) / (x * x - 1);
                double step = p1 / derivative;
                x -= step;
                if (Math.abs(step) < 1e-16) {
                    break;
                }
            }
            nodes[i] = x;
            weights[i] = 2 / ((1 - x * x) * derivative * derivative);
        }
    }

    private GaussLegendre() {
    }

    /**
     * @param f a function smooth over [a, b]
     * @param a lower limit
     * @param b upper limit
     * @return the 8-node estimate of its integral over [a, b]
     */
    static double integrate(DoubleUnaryOperator f, double a, double b) {
        double mid = 0.5 * (a + b);
        double half = 0.5 * (b - a);
        double sum = 0;
        for (int j = 0; j < NODES; j++) {
            sum += W[j] * f.applyAsDouble(mid + half * X[j]);
        }
        return sum * half;
    }
}
