package org.ritzwerk.benchmarks;

import java.util.Arrays;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import java.util.List;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionFit;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampLines;
import org.ritzwerk.engine.calibrate.LampMatcher;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.calibrate.PeakFinder;
import org.ritzwerk.engine.calibrate.Peaks;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/**
 * Peak detection plus automatic calibration of a 4096-pixel neon lamp spectrum (an invented
 * spectrometer: 460-940 nm, cubic dispersion, 0.4 nm resolution, Poisson and 5-count read noise,
 * seed 7), beside a naive pairing search in the same run: every pair of detected peaks against
 * every pair of lamp lines hypothesises a straight-line solution, each scored by counting the
 * peaks that land within 3 pixels of a line (the brute-force form of what the matcher's local
 * triplets do). Lines: the 43 Ne I rows of the built-in set lamp-ne-i (air wavelengths and
 * relative intensities; Sansonetti and Martin, J. Phys. Chem. Ref. Data 34, 1559 (2005), from
 * memory and checked row by row, see refdata's lamps/README.md), copied so the benchmark needs no
 * data module.
 *
 * <p>The whole calibration job ({@link #calibratorJob}: {@link Calibrator#calibrate}, i.e. peaks,
 * pairing with no prior, refinement of every peak by the line identifier with the blend tests, and
 * the weighted fit with clipping and the plausibility checks) stands beside a naive whole job in
 * the same run ({@link #naiveJob}): the same peak finder; an exhaustive search over every triple of the 15
 * strongest peaks against every triple of lines (rising order), each giving the quadratic through
 * the three pairs, scored by the strong peaks within 3 pixels of a line (a straight line through
 * two pairs, as in {@link #naivePairSearch}, cannot follow this dispersion: its best line explains
 * 15 of the 25 strongest peaks by chance and is 35 nm off in the middle); then five rounds of
 * pairing every peak with the nearest line within 3 pixels under the current solution and
 * refitting a clipped polynomial of degree 2, 2, 3, 3, 3 (no one-to-one assignment, no
 * uncertainty model, no blend test, no chance test). Both must recover the dispersion to 0.1 pixel
 * (CalibrateBenchmarkTest).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(2)
public class CalibrateBenchmark {

    static final int PIXELS = 4096;
    static final double[] NEON_NM = {
        470.88594, 482.7338, 540.05618, 585.24879, 588.18952, 602.99969, 607.43377, 614.30626, 616.35939,
        621.72812, 626.64950, 633.44278, 638.29917, 640.2248, 650.65281, 659.89529, 692.94673, 702.40504,
        703.24131, 705.91074, 717.39381, 724.51666, 748.88712, 794.31814, 813.64054, 826.60772, 830.03258,
        841.84274, 849.53598, 859.12584, 863.46470, 865.43831, 867.94925, 868.19211, 877.16563, 878.06226,
        878.37533, 885.38668, 886.57552, 914.86716, 920.17591, 930.08527, 932.65068};
    static final double[] NEON_INTENSITY = {
        120, 100, 200, 200, 100, 100, 100, 100, 100, 100, 100, 100, 100, 200, 150, 100, 1000, 300, 800, 100, 800,
        800, 300, 80, 170, 70, 300, 250, 700, 400, 350, 600, 130, 150, 100, 600, 400, 300, 150, 120, 90, 80, 70};

    double[] counts;
    LampLines lines;
    CalibrationProblem problem;
    /** The true dispersion c0 + c1 p + c2 p^2 + c3 p^3. */
    double[] truth;

    /** Renders the lamp spectrum. */
    @Setup
    public void setUp() {
        double last = PIXELS - 1;
        double c3 = 1.0e-10;
        double c2 = (940 - 460 - 0.13 * last - c3 * last * last * last) / (last * last);
        truth = new double[] {460, 0.13, c2, c3};
        PixelGrid grid = PixelGrid.dispersion(truth, PIXELS);
        double[] flux = new double[NEON_NM.length];
        for (int i = 0; i < flux.length; i++) {
            flux[i] = NEON_INTENSITY[i] * 40;
        }
        double[] expected = new double[PIXELS];
        Arrays.fill(expected, 300);
        new LineRenderer(grid, Instrument.ofFwhm(0.4), 12).render(NEON_NM, flux, new double[flux.length],
                new double[flux.length], expected);
        counts = new double[PIXELS];
        Noise.apply(expected, 5, 7L, counts);
        lines = LampLines.of(NEON_NM, NEON_INTENSITY, null, Medium.air());
        Species neon = Species.parse("Ne I");
        LineList.Builder list = LineList.builder(new DataSetInfo("benchmark-neon", DataKind.LAMP_LINES,
                "Ne I rows of lamp-ne-i", "1", Provenance.computedBy("benchmark copy"), List.of(neon)),
                Unit.NANOMETRE, Medium.air(), "");
        for (int i = 0; i < NEON_NM.length; i++) {
            list.add(neon, NEON_NM[i], Double.NaN, NEON_INTENSITY[i], null, Double.NaN, null, null, null);
        }
        problem = CalibrationProblem.builder(counts).lamp(LampSet.of(List.of(list.build()), Medium.air())).build();
    }

    /** @return the whole calibration job as the command line runs it */
    @Benchmark
    public Calibration calibratorJob() {
        return Calibrator.defaults().calibrate(problem);
    }

    /** @return the naive whole job: naive pair search, then nearest-line pairing and refits */
    @Benchmark
    public DispersionSolution naiveJob() {
        Peaks peaks = PeakFinder.defaults().find(counts);
        double[] quadratic = naiveTriplets(peaks.centres(), peaks.fluxes(), NEON_NM);
        return naiveRefine(peaks.centres(), peaks.centreSigmas(), quadratic, NEON_NM);
    }

    /** The naive job's rounds: the degree of each refit, raised as the pairs spread. */
    static final int[] NAIVE_DEGREES = {2, 2, 3, 3, 3};

    /**
     * @return the quadratic wavelength(pixel) = q0 + q1 p + q2 p^2 through three of the 15
     *         strongest peaks and three lines (every triple of each, in rising order) that puts the
     *         most of those peaks within 3 pixels of a line, as {q0, q1, q2, peaks explained}
     */
    static double[] naiveTriplets(double[] centres, double[] fluxes, double[] nm) {
        Integer[] byFlux = new Integer[centres.length];
        for (int i = 0; i < byFlux.length; i++) {
            byFlux[i] = i;
        }
        Arrays.sort(byFlux, (a, b) -> Double.compare(fluxes[b], fluxes[a]));
        int n = Math.min(15, centres.length);
        double[] strong = new double[n];
        for (int i = 0; i < n; i++) {
            strong[i] = centres[byFlux[i]];
        }
        Arrays.sort(strong);
        double[] sorted = nm.clone();
        Arrays.sort(sorted);
        int lines = sorted.length;
        double[] best = {0, 0, 0, -1};
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                for (int k = j + 1; k < n; k++) {
                    double x0 = strong[i];
                    double x1 = strong[j];
                    double x2 = strong[k];
                    for (int a = 0; a < lines; a++) {
                        for (int b = a + 1; b < lines; b++) {
                            double s01 = (sorted[b] - sorted[a]) / (x1 - x0);
                            for (int c = b + 1; c < lines; c++) {
                                double s12 = (sorted[c] - sorted[b]) / (x2 - x1);
                                double q2 = (s12 - s01) / (x2 - x0);
                                double q1 = s01 - q2 * (x0 + x1);
                                double q0 = sorted[a] - x0 * (q1 + q2 * x0);
                                int explained = 0;
                                for (double p : strong) {
                                    double at = q0 + p * (q1 + q2 * p);
                                    int m = Arrays.binarySearch(sorted, at);
                                    int hi = m >= 0 ? m : -m - 1;
                                    double near = Math.min(
                                            hi < lines ? Math.abs(sorted[hi] - at) : Double.MAX_VALUE,
                                            hi > 0 ? Math.abs(sorted[hi - 1] - at) : Double.MAX_VALUE);
                                    if (near <= 3 * Math.abs(q1 + 2 * q2 * p)) {
                                        explained++;
                                    }
                                }
                                if (explained > best[3]) {
                                    best = new double[] {q0, q1, q2, explained};
                                }
                            }
                        }
                    }
                }
            }
        }
        return best;
    }

    static DispersionSolution naiveRefine(double[] centres, double[] sigmas, double[] start, double[] nm) {
        double[] sorted = nm.clone();
        Arrays.sort(sorted);
        DispersionSolution solution = null;
        for (int degree : NAIVE_DEGREES) {
            DispersionFit fit = DispersionFit.ofDegree(degree).withClipping(DispersionFit.DEFAULT_CLIP,
                    DispersionFit.DEFAULT_CLIP_ITERATIONS);
            double[] pixel = new double[centres.length];
            double[] sigma = new double[centres.length];
            double[] wavelength = new double[centres.length];
            int m = 0;
            for (int k = 0; k < centres.length; k++) {
                double p = centres[k];
                double at = solution == null ? start[0] + p * (start[1] + start[2] * p) : solution.wavelengthAt(p);
                double perPixel = solution == null ? start[1] + 2 * start[2] * p : solution.dispersionAt(p);
                int i = Arrays.binarySearch(sorted, at);
                int hi = i >= 0 ? i : -i - 1;
                double best = Double.NaN;
                for (int j = Math.max(0, hi - 1); j <= Math.min(sorted.length - 1, hi); j++) {
                    if (Double.isNaN(best) || Math.abs(sorted[j] - at) < Math.abs(best - at)) {
                        best = sorted[j];
                    }
                }
                if (Math.abs(best - at) <= 3 * Math.abs(perPixel)) {
                    pixel[m] = centres[k];
                    sigma[m] = sigmas[k];
                    wavelength[m] = best;
                    m++;
                }
            }
            solution = fit.fit(Arrays.copyOf(pixel, m), Arrays.copyOf(sigma, m), Arrays.copyOf(wavelength, m), null,
                    Medium.air());
        }
        return solution;
    }

    /** @return the solution: peaks found, paired with no prior, cubic fitted with clipping */
    @Benchmark
    public DispersionSolution detectAndCalibrate() {
        Peaks peaks = PeakFinder.defaults().find(counts);
        return LampMatcher.defaults().match(peaks, lines).fit(DispersionFit.automatic(3));
    }

    /** @return the detected peaks alone */
    @Benchmark
    public Peaks detectOnly() {
        return PeakFinder.defaults().find(counts);
    }

    /**
     * @return the best straight-line hypothesis as {offset, slope, peaks explained}, from every
     *         pair of the 25 strongest peaks against every pair of lines
     */
    @Benchmark
    public double[] naivePairSearch() {
        Peaks peaks = PeakFinder.defaults().find(counts);
        return naivePairs(peaks.centres(), peaks.fluxes(), NEON_NM);
    }

    static double[] naivePairs(double[] centres, double[] fluxes, double[] nm) {
        Integer[] byFlux = new Integer[centres.length];
        for (int i = 0; i < byFlux.length; i++) {
            byFlux[i] = i;
        }
        Arrays.sort(byFlux, (a, b) -> Double.compare(fluxes[b], fluxes[a]));
        int n = Math.min(25, centres.length);
        double[] strong = new double[n];
        for (int i = 0; i < n; i++) {
            strong[i] = centres[byFlux[i]];
        }
        double[] sorted = nm.clone();
        Arrays.sort(sorted);
        double[] best = {0, 0, -1};
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (strong[j] <= strong[i]) {
                    continue;
                }
                for (int a = 0; a < sorted.length; a++) {
                    for (int b = a + 1; b < sorted.length; b++) {
                        double slope = (sorted[b] - sorted[a]) / (strong[j] - strong[i]);
                        double offset = sorted[a] - slope * strong[i];
                        int explained = 0;
                        for (double p : strong) {
                            double at = offset + slope * p;
                            int k = Arrays.binarySearch(sorted, at);
                            int hi = k >= 0 ? k : -k - 1;
                            double near = Math.min(hi < sorted.length ? Math.abs(sorted[hi] - at) : Double.MAX_VALUE,
                                    hi > 0 ? Math.abs(sorted[hi - 1] - at) : Double.MAX_VALUE);
                            if (near <= 3 * Math.abs(slope)) {
                                explained++;
                            }
                        }
                        if (explained > best[2]) {
                            best = new double[] {offset, slope, explained};
                        }
                    }
                }
            }
        }
        return best;
    }
}
