package org.ritzwerk.spark;

import static org.apache.spark.sql.functions.col;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.types.StructType;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.refdata.DataContext;

/**
 * The operations' {@code validate}: a table with several different bad rows gives one problem
 * per bad row (and one per copy of a repeated id), each with exactly the code, field and message
 * the operation fails with on that row alone; a clean table gives none; the operation runs on the
 * rows validate passed; a missing column is one problem row, the operation's own refusal.
 * Source of every check: {@code common practice} (a validation must agree with the operation it
 * stands for, row by row).
 */
class ValidateTest {

    /** @return the SparkRowException that the action threw or failed the job with */
    private static SparkRowException refusal(Runnable action) {
        Throwable thrown = assertThrows(Exception.class, action::run);
        for (Throwable t = thrown; t != null; t = t.getCause()) {
            if (t instanceof SparkRowException e) {
                return e;
            }
        }
        throw new AssertionError("no SparkRowException in " + thrown, thrown);
    }

    /** @return a problem row's fields as one comparable list */
    private static List<String> key(Row problem) {
        return Arrays.asList(problem.getString(0), problem.getString(1), problem.getString(2),
                problem.getString(3));
    }

    private static List<String> key(SparkRowException e) {
        return Arrays.asList(e.rowId(), e.field(), e.code(), e.getMessage());
    }

    /**
     * Checks validate against the operation: for each group of rows (a bad row alone, or the
     * copies of a repeated id), the operation's refusal on that group alone is the problem
     * validate lists for each of its rows, and validate lists nothing else; then the operation
     * runs on the rows validate passed.
     */
    private static void agrees(SparkSession spark, StructType schema, List<List<Row>> badGroups, List<Row> good,
            Function<Dataset<Row>, Dataset<Row>> validate, Function<Dataset<Row>, Long> operation) {
        List<Row> all = new ArrayList<>(good);
        List<List<String>> expected = new ArrayList<>();
        for (List<Row> group : badGroups) {
            all.addAll(group);
            SparkRowException e = refusal(() -> operation.apply(spark.createDataFrame(group, schema)));
            for (int k = 0; k < group.size(); k++) {
                expected.add(key(e));
            }
        }
        Dataset<Row> table = spark.createDataFrame(all, schema).repartition(2);
        Dataset<Row> problems = validate.apply(table);
        assertEquals(Schemas.PROBLEMS, problems.schema(), "the documented schema (common practice)");
        List<List<String>> found = problems.collectAsList().stream().map(ValidateTest::key)
                .collect(Collectors.toCollection(ArrayList::new));
        java.util.Comparator<List<String>> order = java.util.Comparator.comparing(Object::toString);
        expected.sort(order);
        found.sort(order);
        assertEquals(expected, found, "one problem per bad row, the operation's own (common practice)");

        assertEquals(0, validate.apply(spark.createDataFrame(good, schema)).count(),
                "a clean table has no problem (common practice)");
        // The README's way to keep the rows validate passed.
        Dataset<Row> passed = table.where("id IS NOT NULL").join(problems.select("id"), "id", "left_anti");
        assertEquals(good.size(), passed.count(), "validate flags only the bad rows (common practice)");
        assertEquals(good.size(), operation.apply(passed), "the operation runs on what validate passed"
                + " (common practice)");
    }

    @Test
    void identificationProblemsAreTheOperationsRefusalsRowByRow() {
        SparkSession spark = LocalSpark.session();
        SurveyIdentification job = SurveyIdentification.of(IdentificationParameters.inWindow(List.of("H I",
                "He II"), List.of(), 360, 710));
        List<Row> good = List.of(
                RowFactory.create("good-1", new double[] {486.1, 656.4}, new double[] {1e-3, 1e-3}, null, null),
                RowFactory.create("good-2", new double[] {434.0}, new double[] {1e-3}, null, null));
        List<List<Row>> bad = List.of(
                List.of(RowFactory.create("nan", new double[] {486.1, Double.NaN}, new double[] {1e-3, 1e-3}, null,
                        null)),
                List.of(RowFactory.create("empty", new double[0], null, null, null)),
                List.of(RowFactory.create("no-positions", null, null, null, null)),
                List.of(RowFactory.create(null, new double[] {486.1}, new double[] {1e-3}, null, null)),
                List.of(RowFactory.create("no-sigmas", new double[] {486.1}, null, null, null)),
                List.of(RowFactory.create("twin", new double[] {486.1}, new double[] {1e-3}, null, null),
                        RowFactory.create("twin", new double[] {656.4}, new double[] {1e-3}, null, null)));
        agrees(spark, Schemas.PEAK_LISTS, bad, good, job::validate, t -> job.identify(t).spectra().count());

        // A missing column: one problem row, the refusal identify throws on the driver.
        Dataset<Row> noPositions = spark.createDataFrame(good, Schemas.PEAK_LISTS).drop("positions");
        SparkRowException schema = assertThrows(SparkRowException.class, () -> job.identify(noPositions));
        List<Row> problems = job.validate(noPositions).collectAsList();
        assertEquals(1, problems.size(), "one row for a schema problem (common practice)");
        assertEquals(key(schema), key(problems.get(0)), "the operation's own refusal (common practice)");
        assertEquals(SparkRowException.BAD_SCHEMA, problems.get(0).getString(2), "its code (common practice)");
    }

    @Test
    void synthesisProblemsAreTheOperationsRefusalsRowByRow() {
        SparkSession spark = LocalSpark.session();
        SurveySynthesis job = SurveySynthesis.of(SynthesisParameters.linear(640, 670, 400).withMedium("air")
                .withCounts(5000, 3));
        List<Row> good = List.of(
                RowFactory.create("good-1", new String[] {"H I"}, null, 5000.0, null, 0.0, 8000.0, 1L),
                RowFactory.create("good-2", new String[] {"H I", "D I"}, new double[] {1, 0.5}, 8000.0, 1e20,
                        1000.0, 8000.0, 2L));
        List<List<Row>> bad = List.of(
                List.of(RowFactory.create("nan", new String[] {"H I"}, null, Double.NaN, null, 0.0, 8000.0, 1L)),
                List.of(RowFactory.create("nan-abundance", new String[] {"H I"}, new double[] {Double.NaN}, 5000.0,
                        null, 0.0, 8000.0, 1L)),
                List.of(RowFactory.create("empty", new String[0], null, 5000.0, null, 0.0, 8000.0, 1L)),
                List.of(RowFactory.create("no-seed", new String[] {"H I"}, null, 5000.0, null, 0.0, 8000.0, null)),
                List.of(RowFactory.create("unknown", new String[] {"Fe I"}, null, 5000.0, null, 0.0, 8000.0, 1L)),
                List.of(RowFactory.create("twice", new String[] {"H I", " H I"}, null, 5000.0, null, 0.0, 8000.0,
                        1L)),
                List.of(RowFactory.create("fast", new String[] {"H I"}, null, 5000.0, null, 4e7, 8000.0, 1L)),
                List.of(RowFactory.create("twin", new String[] {"H I"}, null, 5000.0, null, 0.0, 8000.0, 1L),
                        RowFactory.create("twin", new String[] {"H I"}, null, 6000.0, null, 0.0, 8000.0, 2L)));
        agrees(spark, Schemas.SCENES, bad, good, job::validate, t -> job.synthesise(t).count());
    }

    @Test
    void calibrationProblemsAreTheOperationsRefusalsRowByRow() {
        SparkSession spark = LocalSpark.session();
        SurveyCalibration job = SurveyCalibration.of(CalibrationParameters.of(List.of("Ne I"), List.of()));
        double[] lamp = Fixtures.neonExposure(DataContext.builtIn().lampLines(Species.parse("Ne I")), 1.0, 9L);
        double[] dark = new double[Fixtures.PIXELS];
        Arrays.fill(dark, 100);
        double[] nan = lamp.clone();
        nan[17] = Double.NaN;
        double[] zeroSigma = new double[lamp.length];
        Arrays.fill(zeroSigma, 1.0);
        zeroSigma[5] = 0;
        // The dark exposure is refused by the calibrator (its failure_code), which is not an input problem.
        List<Row> good = List.of(RowFactory.create("lamp", lamp, null), RowFactory.create("dark", dark, null));
        List<List<Row>> bad = List.of(
                List.of(RowFactory.create("nan", nan, null)),
                List.of(RowFactory.create("empty", new double[0], null)),
                List.of(RowFactory.create("no-counts", null, null)),
                List.of(RowFactory.create("zero-sigma", lamp, zeroSigma)),
                List.of(RowFactory.create("twin", dark, null), RowFactory.create("twin", dark, null)));
        agrees(spark, Schemas.EXPOSURES, bad, good, job::validate, t -> job.calibrate(t).count());
        Dataset<Row> calibrations = job.calibrate(spark.createDataFrame(good, Schemas.EXPOSURES)).cache();
        assertNotNull(calibrations.where("id = 'dark'").first().getAs("failure_code"),
                "the dark exposure is refused by the calibrator (common practice)");

        // Applying: a spectrum of the refused calibration keeps its row (not a problem); the others are refused.
        double[] star = new double[Fixtures.PIXELS];
        Arrays.fill(star, 50);
        double[] starNan = star.clone();
        starNan[3] = Double.POSITIVE_INFINITY;
        List<Row> science = List.of(RowFactory.create("star-1", "lamp", star), RowFactory.create("star-2", "dark",
                star));
        List<List<Row>> refused = List.of(
                List.of(RowFactory.create("star-missing", "lamp-9", star)),
                List.of(RowFactory.create("star-short", "lamp", new double[100])),
                List.of(RowFactory.create("star-inf", "lamp", starNan)),
                List.of(RowFactory.create("star-null", null, star)),
                List.of(RowFactory.create("star-twin", "lamp", star), RowFactory.create("star-twin", "lamp", star)));
        agrees(spark, Schemas.SCIENCE, refused, science, t -> SurveyCalibration.validateApply(t, calibrations),
                t -> SurveyCalibration.apply(t, calibrations).count());
        Dataset<Row> noCounts = spark.createDataFrame(science, Schemas.SCIENCE).drop("counts");
        SparkRowException schema = assertThrows(SparkRowException.class, () -> SurveyCalibration.apply(noCounts,
                calibrations));
        List<Row> problems = SurveyCalibration.validateApply(noCounts, calibrations).collectAsList();
        assertEquals(List.of(key(schema)), problems.stream().map(ValidateTest::key).toList(),
                "a schema problem is one row, the operation's own refusal (common practice)");
        calibrations.unpersist();
    }
}
