package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.internal.radial.RadialIntegrals;

/**
 * The square-root-grid Numerov and the uniform-grid baseline of {@link RydbergDipoleBenchmark}
 * compute the same dipole integral, to 1e-7 relative at the baseline's step (they differ by
 * about 3e-8 because the core cut-off falls on different grid points), and both agree with the
 * hydrogen closed form to 1e-8 when the quantum defects are zero. No timing here; that is JMH's job.
 */
class RydbergDipoleBenchmarkTest {

    @Test
    void bothIntegratorsAgree() {
        RydbergDipoleBenchmark benchmark = new RydbergDipoleBenchmark();
        benchmark.n = 100;
        benchmark.setUp();
        double numerov = benchmark.numerovSquareRootGrid();
        double naive = benchmark.naiveUniformGrid();
        assertEquals(numerov, naive, 1e-7 * Math.abs(numerov));
        // zero quantum defects, no core: <100s|r|100p> of hydrogen (Gordon's closed form, whose functions
        // are positive near the origin; here they are positive at large r: phase (-1)^(99 + 98) = -1)
        double exact = -RadialIntegrals.dipole(100, 0, 100, 1);
        double dr = RydbergDipoleBenchmark.UNIFORM_STEP;
        double uniform = RydbergDipoleBenchmark.overlap(RydbergDipoleBenchmark.uniform(100, 0, 0, dr),
                RydbergDipoleBenchmark.uniform(100, 1, 0, dr), dr);
        assertEquals(exact, uniform, 1e-8 * Math.abs(exact));
        // n ~ 100: |<ns|r|np>| is of order n*^2 a0
        assertTrue(Math.abs(numerov) > 0.5 * benchmark.sStar * benchmark.sStar, "integral " + numerov);
    }
}
