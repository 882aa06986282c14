package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import org.junit.jupiter.api.Test;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.synth.LineColumns;

/** Both readers of {@link LineColumnsBenchmark} read its generated file alike. */
class LineColumnsBenchmarkTest {

    @Test
    void bothReadersReadTheSameLines() throws IOException {
        LineColumnsBenchmark benchmark = new LineColumnsBenchmark();
        benchmark.lines = 2_000;
        benchmark.setUp();
        try {
            LineColumns columns = benchmark.columns();
            LineList whole = benchmark.whole();
            assertEquals(2_000, columns.size());
            assertEquals(whole.size(), columns.size());
            for (int i = 0; i < whole.size(); i++) {
                assertEquals(whole.position(i), columns.position(i), 0.0);
                assertEquals(whole.intensity(i).getAsDouble(), columns.intensity(i), 0.0);
                assertEquals(whole.species(i), columns.species(i));
            }
        } finally {
            benchmark.tearDown();
        }
    }
}
