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
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;

/**
 * Converting a column of measured wavelengths to vacuum wavenumbers: the engine's bulk kernel
 * ({@link SpectralArrays}) beside the naive baseline of one typed object per element, measured in
 * the same run. Inputs are seeded uniform wavelengths between 300 and 1000 nm.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(2)
public class ConversionBenchmark {

    /** Number of wavelengths in the column. */
    @Param({"1000", "100000"})
    public int size;

    /** Medium of the input wavelengths: vacuum (no iteration) or standard air (iterated to vacuum). */
    @Param({"vacuum", "air"})
    public String medium;

    private double[] nanometres;
    private double[] wavenumbers;
    private Medium inputMedium;

    /** Fills the column from a fixed seed. */
    @Setup
    public void setUp() {
        SplittableRandom random = new SplittableRandom(42);
        nanometres = new double[size];
        for (int i = 0; i < size; i++) {
            nanometres[i] = 300 + 700 * random.nextDouble();
        }
        wavenumbers = new double[size];
        inputMedium = medium.equals("air") ? Medium.air() : Medium.vacuum();
    }

    /** @return the filled output column, from the allocation-free kernel */
    @Benchmark
    public double[] bulkKernel() {
        SpectralArrays.convert(nanometres, Unit.NANOMETRE, inputMedium, Unit.PER_CENTIMETRE, null, wavenumbers);
        return wavenumbers;
    }

    /** @return the filled output column, through one Wavelength and one Wavenumber object per element */
    @Benchmark
    public double[] baselineObjectPerElement() {
        for (int i = 0; i < nanometres.length; i++) {
            wavenumbers[i] = Wavelength.ofNanometres(nanometres[i], inputMedium).toWavenumber().inPerCentimetre();
        }
        return wavenumbers;
    }
}
