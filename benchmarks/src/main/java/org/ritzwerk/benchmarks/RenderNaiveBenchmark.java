package org.ritzwerk.benchmarks;

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
import org.ritzwerk.engine.profile.Profiles;

/**
 * The naive baseline of {@link RenderBenchmark}: every line's profile evaluated at every pixel
 * centre, beside the renderer on the same scene in the same run, at 1,000 lines onto 100,000
 * pixels.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(2)
public class RenderNaiveBenchmark {

    /** Scene size, "lines x pixels". */
    @Param({"1000x100000"})
    public String size;

    private RenderBenchmark scene;

    /** Builds the scene of {@link RenderBenchmark} at this size. */
    @Setup
    public void setUp() {
        scene = new RenderBenchmark();
        scene.size = size;
        scene.setUp();
    }

    /** @return the pixel fluxes from the renderer */
    @Benchmark
    public double[] render() {
        return scene.render();
    }

    /** @return the pixel fluxes, every profile sampled at every pixel centre */
    @Benchmark
    public double[] naiveEveryPixel() {
        double[] out = scene.out;
        for (int p = 0; p < out.length; p++) {
            double x = scene.grid.centre(p);
            double sum = 0;
            for (int i = 0; i < scene.position.length; i++) {
                sum += scene.flux[i] * Profiles.voigt(x - scene.position[i], scene.gaussian[i], scene.lorentz[i]);
            }
            out[p] = sum;
        }
        return out;
    }
}
