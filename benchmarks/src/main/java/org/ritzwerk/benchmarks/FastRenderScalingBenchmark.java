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
 * How the Fourier-domain renderer's cost grows: with the lines at 1,000,000 pixels (100,000,
 * 1,000,000 and 10,000,000 lines; linear expected) and with the pixels at 1,000,000 lines
 * (250,000, 1,000,000 and 4,000,000 pixels; N log N expected in the internal grid), on the scene
 * of {@link RenderBenchmark} (Gaussian FWHM 3 pixels, Lorentzian 0.3, seeded positions), on one
 * thread. The baseline in the same run is the exact windowed renderer on 10,000 lines onto
 * 1,000,000 pixels ({@link Baseline}), a hundredth of the smallest size here, so the ratio to
 * it is lines x pixels per second of each.
 */
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
@Fork(value = 2, jvmArgs = "-Xmx3g")
public class FastRenderScalingBenchmark {

    /** A scene of the given size. */
    @State(Scope.Benchmark)
    public static class Sized {
        /** Scene size, "lines x pixels". */
        @Param({"100000x1000000", "1000000x1000000", "10000000x1000000", "1000000x250000", "1000000x4000000"})
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
    }

    /** The exact renderer's scene, 10,000 lines onto 1,000,000 pixels. */
    @State(Scope.Benchmark)
    public static class Baseline {
        RenderBenchmark scene;

        /** Builds the scene of {@link RenderBenchmark}. */
        @Setup
        public void setUp() {
            scene = new RenderBenchmark();
            scene.size = "10000x1000000";
            scene.setUp();
        }
    }

    /**
     * @param s the scene
     * @return the pixel fluxes from the Fourier-domain renderer
     */
    @Benchmark
    public double[] fast(Sized s) {
        Arrays.fill(s.scene.out, 0);
        s.fast.render(s.scene.position, s.scene.flux, s.scene.gaussian, s.scene.lorentz, s.scene.out);
        return s.scene.out;
    }

    /**
     * @param b the baseline's scene
     * @return the pixel fluxes from the exact windowed renderer
     */
    @Benchmark
    public double[] exactBaseline(Baseline b) {
        return b.scene.render();
    }
}
