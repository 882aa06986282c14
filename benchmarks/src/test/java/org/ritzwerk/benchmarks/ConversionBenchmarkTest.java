package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.arbitrary;
import static org.quicktheories.generators.SourceDSL.integers;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * A benchmark beside its baseline only means something when both compute the same result: the
 * kernel and the object-per-element baseline fill the same column to 1e-15 relative, for every
 * size and medium (QuickTheories, fixed seed). No timing here; that is JMH's job.
 */
class ConversionBenchmarkTest {

    @Test
    void kernelAndBaselineComputeTheSameColumn() {
        qt().withFixedSeed(37L).withExamples(20)
                .forAll(integers().between(1, 5000), arbitrary().pick(List.of("vacuum", "air")))
                .checkAssert((size, medium) -> {
                    ConversionBenchmark benchmark = new ConversionBenchmark();
                    benchmark.size = size;
                    benchmark.medium = medium;
                    benchmark.setUp();
                    double[] kernel = benchmark.bulkKernel().clone();
                    double[] baseline = benchmark.baselineObjectPerElement();
                    for (int i = 0; i < size; i++) {
                        assertEquals(baseline[i], kernel[i], 1e-15 * baseline[i]);
                    }
                });
    }
}
