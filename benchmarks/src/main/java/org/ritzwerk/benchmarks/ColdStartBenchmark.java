package org.ritzwerk.benchmarks;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Warmup;
import org.ritzwerk.atom.Species;
import org.ritzwerk.refdata.DataContext;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.core.ObjectReadContext;
import tools.jackson.databind.MappingIterator;
import tools.jackson.dataformat.csv.CsvFactory;
import tools.jackson.dataformat.csv.CsvMapper;
import tools.jackson.dataformat.csv.CsvReadFeature;

/**
 * The first read of a built-in file in a fresh JVM (one shot per fork, no warm-up): what a small
 * tool pays before its first answer. {@link #firstLampSet} is the user's view (a new context's
 * Ne I lamp set). The other two isolate the CSV reading of that file: its rows through Jackson's
 * streaming CSV factory, as the readers now read them, beside the naive baseline of a
 * {@code CsvMapper} and {@code readerFor(String[].class)}, as they read them before (the mapper's
 * construction loads Jackson's databind layer).
 */
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 0)
@Measurement(iterations = 1)
@Fork(10)
public class ColdStartBenchmark {

    private static final String NEON = "/org/ritzwerk/refdata/lamps/lamp-ne-i.csv";

    private static String text() {
        try (InputStream in = ColdStartBenchmark.class.getResourceAsStream(NEON)) {
            if (in == null) {
                throw new IllegalStateException(NEON + " is not on the class path");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** @return a new built-in context's Ne I lamp set */
    @Benchmark
    public Object firstLampSet() {
        return DataContext.builtIn().lampLines(Species.parse("Ne I"));
    }

    /** @return the number of fields in the file's rows, read with the streaming factory */
    @Benchmark
    public int factoryRows() {
        CsvFactory csv = CsvFactory.builder().enable(CsvReadFeature.ALLOW_COMMENTS)
                .enable(CsvReadFeature.WRAP_AS_ARRAY).build();
        int fields = 0;
        try (JsonParser rows = csv.createParser(ObjectReadContext.empty(), text())) {
            for (JsonToken t = rows.nextToken(); t != null; t = rows.nextToken()) {
                fields += t == JsonToken.VALUE_STRING ? 1 : 0;
            }
        }
        return fields;
    }

    /** @return the same count through a mapper, the naive baseline */
    @Benchmark
    public int mapperRows() {
        CsvMapper csv = CsvMapper.builder().enable(CsvReadFeature.ALLOW_COMMENTS)
                .enable(CsvReadFeature.WRAP_AS_ARRAY).build();
        int fields = 0;
        try (MappingIterator<String[]> rows = csv.readerFor(String[].class).readValues(text())) {
            while (rows.hasNextValue()) {
                fields += rows.nextValue().length;
            }
        }
        return fields;
    }
}
