package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The two sides of {@link RydbergHyperfineBenchmark} give the same constants and uncertainties (the law kept by the
 * context, and worked out anew per level), to the last bit of their sum. No timing here.
 */
class RydbergHyperfineBenchmarkTest {

    @Test
    void bothSidesGiveTheSameConstants() {
        RydbergHyperfineBenchmark benchmark = new RydbergHyperfineBenchmark();
        benchmark.nFrom = 7;
        benchmark.nMax = 30;
        benchmark.setUp();
        double kept = benchmark.keptLaw();
        double naive = benchmark.lawPerLevel();
        assertTrue(kept > 0, "sum " + kept);
        assertEquals(naive, kept, 0);
    }
}
