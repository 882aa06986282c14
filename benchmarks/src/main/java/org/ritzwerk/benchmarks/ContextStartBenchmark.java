package org.ritzwerk.benchmarks;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.LevelListFiles;
import org.ritzwerk.refdata.LineListFiles;

/**
 * The first lookup on a new {@link DataContext} (JIT warm): {@code DataContext.builtIn()} then one
 * lookup, beside the naive baseline that also reads every built-in lamp and level file in full,
 * which is what a new context's first lookup did before listing read file headers only (each
 * registry parsed the seven lamp sets, the He I levels and transition probabilities and the Sr I
 * levels to list them; the Rydberg files were already read once per JVM). A third benchmark asks a
 * context made once in setup: the use the documentation recommends.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(2)
public class ContextStartBenchmark {

    /** The built-in files every new context read before (lamp sets, level and line lists). */
    private static final List<String> EVERY_FILE = List.of("lamps/lamp-hg-i", "lamps/lamp-ne-i", "lamps/lamp-ar-i",
            "lamps/lamp-kr-i", "lamps/lamp-xe-i", "lamps/lamp-cd-i", "lamps/lamp-zn-i", "levels/levels-he-i",
            "levels/lines-he-i", "levels/levels-sr-i");

    /** The lookup: a nucleus (H I), a lamp set (Ne I) or an alkali atom (Rb-87 I). */
    @Param({"nucleus", "lampLines", "alkaliAtom"})
    public String lookup;

    Species hydrogen;
    Species neon;
    Species rubidium;
    DataContext shared;

    @Setup
    public void setUp() {
        hydrogen = Species.parse("H I");
        neon = Species.parse("Ne I");
        rubidium = Species.parse("Rb-87 I");
        shared = DataContext.builtIn();
    }

    private Object ask(DataContext data) {
        switch (lookup) {
            case "nucleus":
                return data.nucleus(hydrogen);
            case "lampLines":
                return data.lampLines(neon);
            case "alkaliAtom":
                return data.alkaliAtom(rubidium);
            default:
                throw new IllegalArgumentException("lookup " + lookup);
        }
    }

    /** @return the lookup's answer from a new built-in context */
    @Benchmark
    public Object freshContext() {
        return ask(DataContext.builtIn());
    }

    /**
     * Naive baseline: a new built-in context that, as before, reads every lamp and level file in
     * full before answering (with the same public readers the built-in providers use).
     */
    @Benchmark
    public void freshContextReadingEveryFile(Blackhole hole) {
        for (String file : EVERY_FILE) {
            String resource = file + ".csv";
            try (InputStream in = DataContext.class.getResourceAsStream("/org/ritzwerk/refdata/" + resource)) {
                if (in == null) {
                    throw new IllegalStateException("missing from the jar: " + resource);
                }
                hole.consume(file.startsWith("levels/levels-") ? LevelListFiles.read(in, resource)
                        : LineListFiles.read(in, resource, file.startsWith("lamps/") ? DataKind.LAMP_LINES
                                : DataKind.LINES));
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        hole.consume(ask(DataContext.builtIn()));
    }

    /** @return the lookup's answer from one context made in setup and shared (the recommended use) */
    @Benchmark
    public Object sharedContext() {
        return ask(shared);
    }
}
