package org.ritzwerk.spark;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;

/**
 * What the id check costs an action, measured in pairs: the synthesis of the benchmark's scenes
 * (as {@link SparkThroughputBenchmark}) with the check, then at once without it, pass after pass,
 * so that a machine whose load drifts disturbs both halves of a pair alike; prints each pair and
 * the medians of the passes after the warm-up and of the pairs' differences; with a fourth
 * argument {@code identify}, the identification of as many of the benchmark's peak lists instead.
 * Not a test; run it with {@code spark/benchmark id-check-cost [cores rows passes [identify]]}
 * (default 2 10000 16).
 */
public final class IdCheckCost {

    private static final int WARM_UP = 4;

    private IdCheckCost() {
    }

    public static void main(String[] args) {
        int cores = args.length > 0 ? Integer.parseInt(args[0]) : 2;
        int scenes = args.length > 1 ? Integer.parseInt(args[1]) : 10_000;
        int passes = args.length > 2 ? Integer.parseInt(args[2]) : 16;
        // A fourth argument 'identify': peak lists of 50 peaks (as the benchmark's) instead of scenes.
        boolean identify = args.length > 3 && args[3].equals("identify");
        SparkSession spark = SparkSession.builder().master("local[" + cores + "]").appName("ritzwerk-id-check-cost")
                .config("spark.ui.enabled", "false").config("spark.driver.host", "127.0.0.1")
                .config("spark.driver.bindAddress", "127.0.0.1").config("spark.sql.shuffle.partitions", "4")
                .getOrCreate();
        spark.sparkContext().setLogLevel("WARN");
        List<Row> rows = new ArrayList<>(scenes);
        List<String> species = List.of("H I", "He II");
        if (identify) {
            for (Fixtures.PeakListData list : Fixtures.peakLists(species, scenes, 45, 5, 2026L)) {
                rows.add(list.row());
            }
        }
        for (int k = 0; k < scenes && !identify; k++) {
            rows.add(RowFactory.create("scene-" + k, new String[] {"H I"}, null, 6000.0 + 10 * k, null,
                    (k % 100 - 50) * 1e3, 8000.0, (long) k));
        }
        JavaSparkContext context = JavaSparkContext.fromSparkContext(spark.sparkContext());
        Dataset<Row> table = spark.createDataFrame(context.parallelize(rows, 2 * cores),
                identify ? Schemas.PEAK_LISTS : Schemas.SCENES).repartition(2 * cores).cache();
        table.count();
        SurveySynthesis synthesis = SurveySynthesis.of(SynthesisParameters.linear(640, 670, 2000).withMedium("air")
                .withModel("qed", 30));
        double[] with = new double[passes - WARM_UP];
        double[] without = new double[passes - WARM_UP];
        double[] difference = new double[passes - WARM_UP];
        SurveyIdentification identification = SurveyIdentification.of(IdentificationParameters.inWindow(species,
                List.of(), 360, 710));
        for (int p = 0; p < passes; p++) {
            double on = identify ? pass(identification.withIdCheck(true), table)
                    : pass(synthesis.withIdCheck(true), table);
            double off = identify ? pass(identification.withIdCheck(false), table)
                    : pass(synthesis.withIdCheck(false), table);
            System.out.printf(Locale.ROOT, "pass %d: with the id check %.0f ms, without %.0f ms%s%n", p, on, off,
                    p < WARM_UP ? " (warm-up)" : "");
            if (p >= WARM_UP) {
                with[p - WARM_UP] = on;
                without[p - WARM_UP] = off;
                difference[p - WARM_UP] = on - off;
            }
        }
        System.out.printf(Locale.ROOT, "local[%d], %d %s, %d pairs after %d warm-up: median with the check %.0f ms,"
                + " without %.0f ms, median difference of a pair %.0f ms%n", cores, scenes,
                identify ? "peak lists" : "scenes",
                passes - WARM_UP, WARM_UP,
                median(with), median(without), median(difference));
        spark.stop();
    }

    /** @return the wall time of one action writing every column of every identification, ms */
    private static double pass(SurveyIdentification identification, Dataset<Row> table) {
        long start = System.nanoTime();
        identification.identify(table).spectra().write().format("noop").mode("overwrite").save();
        return (System.nanoTime() - start) / 1e6;
    }

    /** @return the wall time of one action writing every column of every spectrum, ms */
    private static double pass(SurveySynthesis synthesis, Dataset<Row> table) {
        long start = System.nanoTime();
        synthesis.synthesise(table).write().format("noop").mode("overwrite").save();
        return (System.nanoTime() - start) / 1e6;
    }

    private static double median(double[] values) {
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        int n = sorted.length;
        return n % 2 == 1 ? sorted[n / 2] : (sorted[n / 2 - 1] + sorted[n / 2]) / 2;
    }
}
