package org.ritzwerk.benchmarks;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.ritzwerk.engine.profile.Faddeeva;
import org.ritzwerk.engine.profile.Profiles;

/**
 * The Faddeeva function w(z) of the engine beside its previous implementation,
 * {@link FaddeevaBaseline} (the naive baseline: the continued fraction in the far wings), in the
 * same run; the score is evaluations per second on one thread. Arguments, by {@code @Param}:
 * <ul>
 * <li>{@code renderer}: the arguments the exact renderer evaluates for one line of
 * {@link RenderBenchmark}'s scene (Gaussian FWHM 3 pixels, Lorentzian 0.3, window 50 FWHMs): 8
 * points per integration piece within 8 FWHMs of the centre, 4 beyond, pieces a quarter of the
 * larger of the FWHM and the distance, as {@code LineRenderer} places them (evenly spread within a
 * piece here instead of at the Gauss-Legendre nodes; the |z| distribution is the same to a piece's
 * width). About 1,560 points, 80 % with |z| &gt; 8;</li>
 * <li>{@code core}: |z| &lt; 8, x uniform in [-8, 8], y log-uniform in [1e-4, 8], seed 5;</li>
 * <li>{@code wing}: 8 &lt; |z| &lt; 1000, |z| log-uniform, argument uniform in (0, pi), seed 7.</li>
 * </ul>
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(2)
public class FaddeevaBenchmark {

    /** Points per invocation (the argument arrays are cycled to this length). */
    static final int POINTS = 4096;

    /** Distribution of the arguments: renderer, core or wing. */
    @Param({"renderer", "core", "wing"})
    public String arguments;

    double[] x;
    double[] y;
    private final double[] out = new double[2];

    /** Builds the arguments. */
    @Setup
    public void setUp() {
        double[][] z = switch (arguments) {
            case "renderer" -> rendererArguments();
            case "core" -> randomArguments(5L, false);
            case "wing" -> randomArguments(7L, true);
            default -> throw new IllegalArgumentException("unknown argument distribution " + arguments);
        };
        x = new double[POINTS];
        y = new double[POINTS];
        for (int i = 0; i < POINTS; i++) {
            x[i] = z[0][i % z[0].length];
            y[i] = z[1][i % z[1].length];
        }
    }

    /** @return the sum of Re w and Im w over the points, by the engine's Faddeeva function */
    @Benchmark
    @OperationsPerInvocation(POINTS)
    public double faddeeva() {
        double sum = 0;
        for (int i = 0; i < POINTS; i++) {
            Faddeeva.w(x[i], y[i], out);
            sum += out[0] + out[1];
        }
        return sum;
    }

    /** @return the same sum by the previous implementation (the baseline) */
    @Benchmark
    @OperationsPerInvocation(POINTS)
    public double baseline() {
        double sum = 0;
        for (int i = 0; i < POINTS; i++) {
            FaddeevaBaseline.w(x[i], y[i], out);
            sum += out[0] + out[1];
        }
        return sum;
    }

    /**
     * The points at which the exact renderer evaluates w for one line of {@link RenderBenchmark}
     * (centre 0.37 pixels into a one-unit pixel grid).
     */
    static double[][] rendererArguments() {
        double gaussian = 3;
        double lorentz = 0.3;
        double centre = 0.37;
        double fwhm = Profiles.voigtFwhm(gaussian, lorentz);
        double sigma = gaussian / (2 * Math.sqrt(2 * Math.log(2)));
        double scale = 1 / (sigma * Math.sqrt(2));
        double imaginary = lorentz / 2 * scale;
        double lo = centre - 50 * fwhm;
        double hi = centre + 50 * fwhm;
        List<Double> real = new ArrayList<>();
        for (int p = (int) Math.floor(lo); p < hi; p++) {
            double a = Math.max(p, lo);
            double b = Math.min(p + 1, hi);
            if (a < centre && centre < b) {
                piece(a, centre, centre, fwhm, scale, real);
                piece(centre, b, centre, fwhm, scale, real);
            } else {
                piece(a, b, centre, fwhm, scale, real);
            }
        }
        double[][] z = new double[2][real.size()];
        for (int i = 0; i < real.size(); i++) {
            z[0][i] = real.get(i);
            z[1][i] = imaginary;
        }
        return z;
    }

    private static void piece(double a, double b, double centre, double fwhm, double scale, List<Double> real) {
        double nearest = Math.min(Math.abs(a - centre), Math.abs(b - centre));
        int pieces = (int) Math.ceil((b - a) / (Math.max(fwhm, nearest) / 4));
        int nodes = nearest > 8 * fwhm ? 4 : 8;
        double h = (b - a) / pieces;
        for (int k = 0; k < pieces; k++) {
            for (int j = 0; j < nodes; j++) {
                real.add((a + (k + (j + 0.5) / nodes) * h - centre) * scale);
            }
        }
    }

    private static double[][] randomArguments(long seed, boolean wing) {
        SplittableRandom random = new SplittableRandom(seed);
        double[][] z = new double[2][POINTS];
        for (int i = 0; i < POINTS; i++) {
            if (wing) {
                double modulus = 8 * Math.pow(125, random.nextDouble());
                double angle = Math.PI * random.nextDouble();
                z[0][i] = modulus * Math.cos(angle);
                z[1][i] = modulus * Math.sin(angle);
            } else {
                double modulus;
                do {
                    z[0][i] = random.nextDouble(-8, 8);
                    z[1][i] = 1e-4 * Math.pow(8e4, random.nextDouble());
                    modulus = Math.hypot(z[0][i], z[1][i]);
                } while (modulus >= 8);
            }
        }
        return z;
    }
}
