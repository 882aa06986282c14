package org.ritzwerk.spark;

import java.lang.management.ManagementFactory;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.BenchmarkParams;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.IdentificationSearch;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Renderer;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.DataContext;

/**
 * Throughput of the Spark operations in local mode on 1 and 2 cores against the plain library on
 * as many threads over the same data, in one run: identification of {@code lists} peak lists of
 * {@code peaks} peaks (H I and He II multiplets, n up to 30, 360 to 710 nm, 5 sigma) and synthesis
 * of {@code scenes} spectra (H I, 2000 pixels, per-row seeds). Each measurement is one pass over
 * the whole table (single-shot time); the inputs are cached in Spark before the measurement, so it
 * times the operation, not the making of the table. The Spark operations write every column of
 * every output row to Spark's no-op sink (counting one column would let Spark skip making the
 * others). The identification baseline computes what an output row holds (the identification, the
 * matched lines' positions, the peaks' statuses, the missing strong lines, the species' presence);
 * {@code identifyLibrarySearchOnly} is the search alone (one thread), for the engine's share.
 * Per-core overhead = Spark local[1] / library on one thread; Spark's scaling = local[1] /
 * local[2], beside the library's own scaling from one thread to two on the same machine.
 *
 * <p>Not a test; run it with {@code spark/benchmark} (see that script). Spark needs the JVM
 * options of the module's surefire configuration, given to the forks here.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2)
@Measurement(iterations = 4)
@Fork(value = 1, jvmArgsAppend = {"-Xmx4g", "-XX:+IgnoreUnrecognizedVMOptions",
    "--add-opens=java.base/java.lang=ALL-UNNAMED", "--add-opens=java.base/java.lang.invoke=ALL-UNNAMED",
    "--add-opens=java.base/java.lang.reflect=ALL-UNNAMED", "--add-opens=java.base/java.io=ALL-UNNAMED",
    "--add-opens=java.base/java.net=ALL-UNNAMED", "--add-opens=java.base/java.nio=ALL-UNNAMED",
    "--add-opens=java.base/java.util=ALL-UNNAMED", "--add-opens=java.base/java.util.concurrent=ALL-UNNAMED",
    "--add-opens=java.base/java.util.concurrent.atomic=ALL-UNNAMED",
    "--add-opens=java.base/jdk.internal.ref=ALL-UNNAMED", "--add-opens=java.base/sun.nio.ch=ALL-UNNAMED",
    "--add-opens=java.base/sun.nio.cs=ALL-UNNAMED", "--add-opens=java.base/sun.security.action=ALL-UNNAMED",
    "--add-opens=java.base/sun.util.calendar=ALL-UNNAMED", "-Djdk.reflect.useDirectMethodHandle=false",
    "-Dio.netty.tryReflectionSetAccessible=true"})
public class SparkThroughputBenchmark {

    /** Spark's master: local[1] or local[2]. */
    @Param({"1", "2"})
    public int cores;

    /** Peak lists per pass. */
    @Param({"20000"})
    public int lists;

    /** Peaks per list (45 drawn from the lines, 5 spurious). */
    @Param({"50"})
    public int peaks;

    /** Scenes per pass. */
    @Param({"400"})
    public int scenes;

    private SparkSession spark;
    private List<Fixtures.PeakListData> peakLists;
    private Dataset<Row> peakTable;
    private Dataset<Row> sceneTable;
    private LineCatalog catalog;
    private IdentificationSearch search;
    private DataContext data;
    private SurveyIdentification identification;
    private SurveySynthesis synthesis;
    /** The library baselines' threads, as many as Spark's cores. */
    private ExecutorService pool;

    @Setup(Level.Trial)
    public void setUp() {
        spark = SparkSession.builder().master("local[" + cores + "]").appName("ritzwerk-benchmark")
                .config("spark.ui.enabled", "false").config("spark.driver.host", "127.0.0.1")
                .config("spark.driver.bindAddress", "127.0.0.1").config("spark.sql.shuffle.partitions", "4")
                .getOrCreate();
        spark.sparkContext().setLogLevel("WARN");
        List<String> species = List.of("H I", "He II");
        peakLists = Fixtures.peakLists(species, lists, peaks - 5, 5, 2026L);
        // Two partitions per core: each partition pays its setup (data context, catalogue) once per pass.
        // The tables are made from distributed collections, not from driver-side lists: a table made
        // from a list keeps every row inside its query plan, which Spark then analyses, compares with
        // the cache and hashes on the driver at every pass (a serial cost growing with the table, seen
        // on the driver thread in a profile), and holds a second, boxed copy of every array. The
        // repartition ends the lineage at a shuffle: without it every task of every pass would carry
        // its slice of the driver's collection (serialised on the driver, a serial cost again).
        JavaSparkContext context = JavaSparkContext.fromSparkContext(spark.sparkContext());
        List<Row> listRows = new ArrayList<>(lists);
        for (Fixtures.PeakListData list : peakLists) {
            listRows.add(list.row());
        }
        peakTable = spark.createDataFrame(context.parallelize(listRows, 2 * cores), Schemas.PEAK_LISTS)
                .repartition(2 * cores).cache();
        peakTable.count();
        List<Row> sceneRows = new ArrayList<>(scenes);
        for (int k = 0; k < scenes; k++) {
            sceneRows.add(RowFactory.create("scene-" + k, new String[] {"H I"}, null, 6000.0 + 10 * k, null,
                    (k % 100 - 50) * 1e3, 8000.0, (long) k));
        }
        sceneTable = spark.createDataFrame(context.parallelize(sceneRows, 2 * cores), Schemas.SCENES)
                .repartition(2 * cores).cache();
        sceneTable.count();
        data = DataContext.discoverDefault();
        Candidates.Builder builder = Candidates.inWindow(360e-9, 710e-9);
        for (String text : species) {
            Species s = Species.parse(text);
            builder.hydrogenLike(s, HydrogenLikeModel.of(data.nucleus(s), Tier.QED), 30, false);
        }
        catalog = builder.build().catalog();
        search = IdentificationSearch.of(Identifier.of(Tolerance.parse("5 sigma")));
        identification = SurveyIdentification.of(IdentificationParameters.inWindow(species, List.of(), 360, 710));
        pool = Executors.newFixedThreadPool(cores);
        synthesis = SurveySynthesis.of(SynthesisParameters.linear(640, 670, 2000).withMedium("air")
                .withModel("qed", 30));
    }

    /** The process's CPU time at the start of the pass, ns. */
    private long cpuAtStart;

    @Setup(Level.Iteration)
    public void startPass() {
        cpuAtStart = processCpuNanos();
    }

    /**
     * Prints the CPU time of the whole process (every thread: Spark's tasks and services, the
     * garbage collector, the compiler) during the pass, a figure that a busy machine disturbs
     * less than wall time: {@code cpu-ms <benchmark> cores=<n> <ms>}.
     */
    @TearDown(Level.Iteration)
    public void endPass(BenchmarkParams params) {
        long used = processCpuNanos() - cpuAtStart;
        String name = params.getBenchmark().substring(params.getBenchmark().lastIndexOf('.') + 1);
        System.out.printf(Locale.ROOT, "cpu-ms %s cores=%d %.1f%n", name, cores, used / 1e6);
    }

    private static long processCpuNanos() {
        return ((com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean())
                .getProcessCpuTime();
    }

    @TearDown(Level.Trial)
    public void tearDown() {
        pool.shutdownNow();
        spark.stop();
    }

    /**
     * Baseline: the library on {@code cores} threads (the Spark master's core count), each taking
     * a contiguous share of the peak lists one after another, computing what a row of the Spark
     * operation's output holds: the identification, each matched line's position in the peaks'
     * unit, each peak's status, the missing strong lines and the species' presence (the identify
     * command's report).
     * On two cores its time against one core is what the machine itself gives two threads of this
     * work (the garbage collector and the JIT compiler share the same cores), the ceiling for
     * Spark's scaling.
     */
    @Benchmark
    public double identifyLibrary() throws Exception {
        return onThreads(peakLists.size(), (from, to) -> {
            double total = 0;
            for (Fixtures.PeakListData list : peakLists.subList(from, to)) {
                total += identifyOne(list);
            }
            return total;
        });
    }

    private double identifyOne(Fixtures.PeakListData list) {
        PeakList p = PeakList.of(list.nm(), list.sigma(), list.photons(), Unit.NANOMETRE, Medium.vacuum());
        IdentificationSearch.Report report = search.run(p, catalog);
        Identification id = report.identification();
        LineCatalog lines = report.lines();
        int n = list.nm().length;
        double[] matched = new double[n];
        int m = 0;
        for (int i = 0; i < n; i++) {
            int j = id.line(i);
            if (j >= 0) {
                matched[m++] = lines.wavelength(j);
            }
        }
        double[] converted = new double[m];
        SpectralArrays.convert(Arrays.copyOf(matched, m), Unit.METRE, Medium.vacuum(), Unit.NANOMETRE,
                Medium.vacuum(), converted);
        double total = m == 0 ? 0 : converted[0];
        // Each peak's status, as the output row gives it (its species shown, not taken for a stray).
        for (int i = 0; i < n; i++) {
            total += id.status(i);
        }
        total += id.missingStrongLines().length;
        for (Identification.SpeciesPresence s : id.speciesPresence()) {
            total += s.matchedByChance();
        }
        return total;
    }

    /** Work on the rows from (inclusive) to (exclusive); returns a sum that keeps the work alive. */
    private interface Share {
        double run(int from, int to);
    }

    /**
     * Splits rows 0 to n into {@code cores} contiguous shares, one per thread of the pool, and adds
     * their results: the library's own parallelism at Spark's core count.
     */
    private double onThreads(int n, Share share) throws Exception {
        List<Future<Double>> parts = new ArrayList<>(cores);
        for (int t = 0; t < cores; t++) {
            int from = (int) ((long) n * t / cores);
            int to = (int) ((long) n * (t + 1) / cores);
            parts.add(pool.submit(() -> share.run(from, to)));
        }
        double total = 0;
        for (Future<Double> part : parts) {
            total += part.get();
        }
        return total;
    }

    /** The library's search alone (no presence, no line positions): the engine's share of the baseline. */
    @Benchmark
    public long identifyLibrarySearchOnly() {
        long matched = 0;
        for (Fixtures.PeakListData list : peakLists) {
            PeakList p = PeakList.of(list.nm(), list.sigma(), list.photons(), Unit.NANOMETRE, Medium.vacuum());
            matched += search.run(p, catalog).identification().count(Identification.MATCHED);
        }
        return matched;
    }

    /** The Spark operation over the cached table, every column of every output row written (to Spark's no-op sink). */
    @Benchmark
    public void identifySpark() {
        identification.identify(peakTable).spectra().write().format("noop").mode("overwrite").save();
    }

    /** The Spark operation without the id check ({@code withIdCheck(false)}): no count of the ids, no shuffle. */
    @Benchmark
    public void identifySparkNoIdCheck() {
        identification.withIdCheck(false).identify(peakTable).spectra().write().format("noop").mode("overwrite")
                .save();
    }

    /** Baseline: the library on {@code cores} threads, each taking a contiguous share of the scenes. */
    @Benchmark
    public double synthesiseLibrary() throws Exception {
        PixelGrid grid = PixelGrid.linear(640, 670, 2000);
        Species h = Species.parse("H I");
        HydrogenLikeModel model = HydrogenLikeModel.of(data.nucleus(h), Tier.QED);
        return onThreads(scenes, (from, to) -> {
            double total = 0;
            for (int k = from; k < to; k++) {
                double[] counts = Scene.builder(grid).medium(Medium.air())
                        .instrument(Instrument.ofResolvingPower(8000)).naturalWidths(false).renderer(Renderer.AUTO)
                        .temperature(6000.0 + 10 * k).nMax(30).velocity((k % 100 - 50) * 1e3).peakCounts(10_000)
                        .hydrogenLike(h, model, 1.0).noise(0, k).build().render(1).counts();
                total += counts[counts.length / 2];
            }
            return total;
        });
    }

    /** The Spark operation over the cached scenes, every column of every spectrum written (to the no-op sink). */
    @Benchmark
    public void synthesiseSpark() {
        synthesis.synthesise(sceneTable).write().format("noop").mode("overwrite").save();
    }

    /** The Spark operation without the id check. */
    @Benchmark
    public void synthesiseSparkNoIdCheck() {
        synthesis.withIdCheck(false).synthesise(sceneTable).write().format("noop").mode("overwrite").save();
    }
}
