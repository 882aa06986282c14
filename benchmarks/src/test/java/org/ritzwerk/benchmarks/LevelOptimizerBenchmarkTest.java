package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.ritz.LevelOptimum;

/**
 * The downdate and the full-refit baseline only compare when they solve the same problem the same way:
 * the same lines left out, in the same order, and the same levels and chi^2 (both end on a fit of the
 * lines kept from scratch). No timing here; that is JMH's job.
 */
class LevelOptimizerBenchmarkTest {

    @Test
    void downdateAndFullRefitsLeaveOutTheSameLinesAndGiveTheSameLevels() {
        LevelOptimizerBenchmark benchmark = new LevelOptimizerBenchmark();
        benchmark.levels = 50;
        benchmark.linesPerLevel = 4;
        benchmark.outlierEvery = 33;
        benchmark.setUp();
        LevelOptimum down = benchmark.downdate();
        LevelOptimum full = benchmark.fullRefits();
        // the lines moved are 7, 40, 73, ... (k % 33 == 7): the ones moved by enough are left out
        assertTrue(down.leftOut().size() >= 4, down.leftOut().toString());
        for (int k : down.leftOut()) {
            assertEquals(7, k % 33, "only moved lines are left out: " + down.leftOut());
        }
        assertEquals(full.leftOut(), down.leftOut());
        for (int i = 0; i < benchmark.levels; i++) {
            assertEquals(full.energyPerCm(i), down.energyPerCm(i), 0.0);
        }
        assertEquals(full.chiSquare(), down.chiSquare(), 0.0);
    }
}
