package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The two sides of {@link AlkaliLifetimesBenchmark} compute the same lifetimes and uncertainties (the query's
 * states side by side, the baseline's one after the other), to the last bit of their sum. No timing here.
 */
class AlkaliLifetimesBenchmarkTest {

    @Test
    void bothSidesGiveTheSameLifetimes() {
        AlkaliLifetimesBenchmark benchmark = new AlkaliLifetimesBenchmark();
        benchmark.nMax = 12;
        benchmark.setUp();
        double query = benchmark.levelQuery();
        benchmark.setUp();
        double naive = benchmark.oneByOne();
        assertTrue(query > 0, "sum " + query);
        assertEquals(naive, query, 1e-12 * query);
    }
}
