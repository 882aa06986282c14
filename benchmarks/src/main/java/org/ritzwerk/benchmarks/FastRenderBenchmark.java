package org.ritzwerk.benchmarks;

import java.util.Arrays;
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
import org.ritzwerk.engine.synth.FastLineRenderer;
import org.ritzwerk.engine.synth.Instrument;

/**
 * The Fourier-domain renderer beside the exact windowed renderer (its baseline) on the scene of
 * {@link RenderBenchmark} (Voigt lines 3 pixels Gaussian FWHM with a tenth of that Lorentzian,
 * seeded random positions, one unit per pixel), in the same run: 1,000 lines onto 100,000 pixels
 * and 100,000 lines onto 1,000,000 pixels, on one thread. The fast renderer draws whole profiles;
 * the exact one stops at its default window of 50 FWHMs.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(2)
public class FastRenderBenchmark {

    /** Scene size, "lines x pixels". */
    @Param({"1000x100000", "100000x1000000"})
    public String size;

    RenderBenchmark scene;
    FastLineRenderer fast;

    /** Builds the scene of {@link RenderBenchmark} at this size. */
    @Setup
    public void setUp() {
        scene = new RenderBenchmark();
        scene.size = size;
        scene.setUp();
        fast = new FastLineRenderer(scene.grid, Instrument.ideal());
    }

    /** @return the pixel fluxes from the exact windowed renderer (the baseline) */
    @Benchmark
    public double[] exact() {
        return scene.render();
    }

    /** @return the pixel fluxes from the Fourier-domain renderer */
    @Benchmark
    public double[] fast() {
        Arrays.fill(scene.out, 0);
        fast.render(scene.position, scene.flux, scene.gaussian, scene.lorentz, scene.out);
        return scene.out;
    }
}
