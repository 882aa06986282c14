package org.ritzwerk.benchmarks;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineColumns;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Renderer;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.LineListFiles;

/**
 * A memory figure, not a timing: writes a line-list file of N lines ({@link LineColumnsBenchmark#write},
 * default 10,000,000), reads it with {@link LineListFiles#readColumns}, renders it through a
 * {@link Scene} with the Fourier-domain renderer onto 1,000,000 pixels (600 to 700 nm, air,
 * resolving power 100,000) and prints the heap kept after each step (after a full collection)
 * and the peak heap, in bytes per line. Run with a heap limit to show the path fits in it:
 * {@code java -Xmx2g -cp benchmarks/target/benchmarks.jar org.ritzwerk.benchmarks.LargeLineListMemory 10000000}.
 */
public final class LargeLineListMemory {

    private LargeLineListMemory() {
    }

    /**
     * @param args the number of lines (default 10,000,000)
     * @throws IOException when the temporary file cannot be written
     */
    public static void main(String[] args) throws IOException {
        int lines = args.length > 0 ? Integer.parseInt(args[0]) : 10_000_000;
        Path file = Files.createTempFile("ritzwerk-lines-", ".csv");
        try {
            LineColumnsBenchmark.write(file, lines, 17L);
            System.out.printf(Locale.ROOT, "file: %d lines, %d bytes%n", lines, Files.size(file));
            long base = used();
            LineColumns columns = LineListFiles.readColumns(file, DataKind.LINES);
            long afterRead = used();
            print("columns kept", afterRead - base, lines);
            DataContext data = DataContext.builtIn();
            Scene scene = Scene.builder(PixelGrid.linear(600, 700, 1_000_000)).temperature(6000)
                    .medium(Medium.air()).instrument(Instrument.ofResolvingPower(100_000)).renderer(Renderer.FAST)
                    .lineColumns(columns, data::nucleus).build();
            long afterScene = used();
            print("scene lines kept (besides the columns)", afterScene - afterRead, scene.lines().size());
            SyntheticSpectrum spectrum = scene.render(1);
            System.out.printf(Locale.ROOT, "rendered %d lines onto %d pixels; brightest pixel %.1f counts%n",
                    scene.lines().size(), spectrum.counts().length, max(spectrum.counts()));
            print("peak heap", peak() - 0, lines);
            System.out.printf(Locale.ROOT, "species: %s%n", columns.coveredSpecies().stream().map(Species::notation)
                    .toList());
        } finally {
            Files.deleteIfExists(file);
        }
    }

    private static void print(String what, long bytes, int lines) {
        System.out.printf(Locale.ROOT, "%s: %.1f MB, %.1f bytes a line%n", what, bytes / 1e6, (double) bytes / lines);
    }

    private static double max(double[] values) {
        double m = 0;
        for (double v : values) {
            m = Math.max(m, v);
        }
        return m;
    }

    private static long used() {
        for (int i = 0; i < 3; i++) {
            System.gc();
        }
        Runtime runtime = Runtime.getRuntime();
        return runtime.totalMemory() - runtime.freeMemory();
    }

    private static long peak() {
        long sum = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP) {
                sum += pool.getPeakUsage().getUsed();
            }
        }
        return sum;
    }
}
