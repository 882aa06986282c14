package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.identify.Identification;

/**
 * The identification benchmarks compare like with like: on a small scene the naive scan finds
 * exactly the peaks that have a candidate, the bare merge counts every close pair, and the
 * identification matches no more peaks than either allows, in parallel as in sequence.
 */
class IdentifyBenchmarksTest {

    @Test
    void baselinesAndIdentificationAgreeOnTheScene() {
        IdentifyScene scene = new IdentifyScene(2_000, 20_000, 1L); // the seed setUp uses
        IdentifyBenchmark benchmark = new IdentifyBenchmark();
        benchmark.lines = 2_000;
        benchmark.peaks = 20_000;
        benchmark.setUp();
        Identification result = benchmark.identify();
        int withCandidates = 0;
        for (int i = 0; i < result.peaks().size(); i++) {
            withCandidates += result.rankedCandidates(i).length > 0 ? 1 : 0;
        }
        long naive = BareMerge.allPairs(scene.peakWavelengths, scene.lineWavelengths, 0.5e-12);
        long pairs = BareMerge.pairs(scene.peakWavelengths, scene.lineWavelengths, 0.5e-12);
        assertEquals(naive, withCandidates);
        int matched = result.count(Identification.MATCHED) + result.count(Identification.AMBIGUOUS);
        assertTrue(matched <= withCandidates && withCandidates <= pairs, matched + " " + withCandidates + " " + pairs);
        Identification parallel = benchmark.identifyInParallel();
        for (int i = 0; i < result.peaks().size(); i++) {
            assertEquals(result.line(i), parallel.line(i));
        }
    }
}
