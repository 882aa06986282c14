package org.ritzwerk.benchmarks;

import java.util.SplittableRandom;
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
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.PixelGrid;

/**
 * Rendering lines into pixels with the windowed, pixel-integrating renderer, at 1,000 lines onto
 * 100,000 pixels and at the full size, 100,000 lines onto 1,000,000 pixels. Its naive baseline,
 * {@link RenderNaiveBenchmark}, runs at the small size only (it costs lines x pixels profile
 * evaluations).
 * Lines are Voigt profiles 3 pixels wide (Gaussian) with a tenth of that Lorentzian, at seeded
 * random positions; the renderer's default window of 50 FWHMs loses at most
 * {@code LineRenderer.truncationBound} of each line's flux (1.2e-3 here; the Lorentzian wings
 * beyond the window hold 6e-4).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(2)
public class RenderBenchmark {

    /** Scene size, "lines x pixels". */
    @Param({"1000x100000", "100000x1000000"})
    public String size;

    double[] position;
    double[] flux;
    double[] gaussian;
    double[] lorentz;
    PixelGrid grid;
    LineRenderer renderer;
    double[] out;

    /** Builds the scene from seed 3. */
    @Setup
    public void setUp() {
        String[] parts = size.split("x");
        int lines = Integer.parseInt(parts[0]);
        int pixels = Integer.parseInt(parts[1]);
        grid = PixelGrid.linear(0, pixels, pixels); // one unit per pixel
        SplittableRandom random = new SplittableRandom(3L);
        position = new double[lines];
        flux = new double[lines];
        gaussian = new double[lines];
        lorentz = new double[lines];
        for (int i = 0; i < lines; i++) {
            position[i] = random.nextDouble(0, pixels);
            flux[i] = random.nextDouble(1, 1000);
            gaussian[i] = 3;
            lorentz[i] = 0.3;
        }
        renderer = new LineRenderer(grid, Instrument.ideal(), LineRenderer.DEFAULT_WINDOW);
        out = new double[pixels];
    }

    /** @return the pixel fluxes */
    @Benchmark
    public double[] render() {
        java.util.Arrays.fill(out, 0);
        renderer.render(position, flux, gaussian, lorentz, out);
        return out;
    }

    /** @return the pixel fluxes, rendered on two threads (the same values bit for bit) */
    @Benchmark
    public double[] renderOnTwoThreads() {
        java.util.Arrays.fill(out, 0);
        renderer.render(position, flux, gaussian, lorentz, out, 2);
        return out;
    }
}
