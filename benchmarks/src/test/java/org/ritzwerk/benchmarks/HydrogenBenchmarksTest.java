package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.hydrogenic.LevelTable;
import org.ritzwerk.engine.hydrogenic.LineTable;

/**
 * The hydrogen benchmark pairs compute the same things: the same levels in the same order, and
 * the same set of allowed pairs (the generator's components, counted, equal the baseline's pairs).
 */
class HydrogenBenchmarksTest {

    @Test
    void levelBaselineAndColumnsAgree() {
        qt().withFixedSeed(5L).withExamples(10).forAll(integers().between(1, 60)).checkAssert(nMax -> {
            HydrogenLevelsBenchmark benchmark = new HydrogenLevelsBenchmark();
            benchmark.nMax = nMax;
            benchmark.setUp();
            LevelTable columns = benchmark.levelsColumnar();
            List<HydrogenFixture.Level> objects = benchmark.levelsBaselineObjects();
            assertEquals(objects.size(), columns.size());
            for (int i = 0; i < columns.size(); i++) {
                assertEquals(objects.get(i).energy(), columns.energy(i), 0.0);
                assertEquals(objects.get(i).twoJ(), columns.twoJ(i));
            }
        });
    }

    @Test
    void lineGeneratorFindsEveryAllowedPair() {
        HydrogenLinesBenchmark benchmark = new HydrogenLinesBenchmark();
        benchmark.nMax = 6;
        benchmark.setUp();
        LineTable lines = benchmark.linesGenerator();
        int pairs = 0;
        List<HydrogenFixture.Level> levels = HydrogenFixture.objectLevels(HydrogenFixture.hydrogen(), 6);
        for (HydrogenFixture.Level upper : levels) {
            for (HydrogenFixture.Level lower : levels) {
                if (upper.energy() > lower.energy() && Math.abs(upper.l() - lower.l()) == 1
                        && Math.abs(upper.twoJ() - lower.twoJ()) <= 2) {
                    pairs++;
                }
            }
        }
        assertEquals(pairs, lines.size());
    }
}
