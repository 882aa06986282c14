package org.ritzwerk.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;
import org.junit.jupiter.api.Test;

/**
 * {@link SurveyIdentification#validatePeakRows} against {@link SurveyIdentification#peakLists}:
 * a table with every kind of bad peak row gives exactly those rows, each with the column, value and
 * code expected; each bad spectrum alone makes {@code peakLists} fail with a message that
 * validation lists for it; the rows it does not list group without refusal; a clean table gives
 * none; a missing column is one row, the grouping's own refusal. Source of every check:
 * {@code common practice} (a validation must agree with the operation it stands for, row by row).
 */
class PeakRowValidationTest {

    /** The per-peak schema with a nullable peak column, as a table read from files may have it. */
    private static final StructType ROWS = new StructType(Arrays.stream(Schemas.PEAK_ROWS.fields())
            .map(f -> new StructField(f.name(), f.dataType(), true, f.metadata())).toArray(StructField[]::new));

    /** A peak row of the test table and the problem expected for it: its column, or null for none. */
    private record Case(Row row, String field) {
    }

    private static Case ok(String id, Integer peak, Double position, Double sigma, Double intensity, Double width) {
        return new Case(RowFactory.create(id, peak, position, sigma, intensity, width), null);
    }

    private static Case bad(String field, String id, Integer peak, Double position, Double sigma, Double intensity,
            Double width) {
        return new Case(RowFactory.create(id, peak, position, sigma, intensity, width), field);
    }

    /** @return the refused value a problem row should carry: the named double column's, null for id and peak */
    private static Double value(Case c) {
        return switch (c.field()) {
            case "position" -> (Double) c.row().get(2);
            case "sigma" -> (Double) c.row().get(3);
            case "intensity" -> (Double) c.row().get(4);
            case "width" -> (Double) c.row().get(5);
            default -> null;
        };
    }

    /** @return a problem's id, peak, field, value and code as one comparable list */
    private static List<Object> key(Row problem) {
        return Arrays.asList(problem.get(0), problem.get(1), problem.get(2), problem.get(3), problem.get(4));
    }

    private static List<Object> expectedKey(Case c) {
        return Arrays.asList(c.row().get(0), c.row().get(1), c.field(), value(c), SparkRowException.BAD_FIELD);
    }

    @Test
    void everyRefusedPeakRowIsListedAndNoOther() {
        SparkSession spark = LocalSpark.session();
        double nan = Double.NaN;
        List<Case> good = List.of(
                ok("good-a", 2, 656.4, 1e-3, 10.0, 0.02), ok("good-a", 0, 434.0, 1e-3, 5.0, 0.02),
                ok("good-a", 1, 486.1, 1e-3, 7.0, 0.02),
                // Zero sigma, intensity and width, a null sigma, and two peaks at one position are allowed.
                ok("good-b", 0, 486.1, 0.0, 0.0, 0.0), ok("good-b", 1, 486.1, null, 0.0, null));
        List<Case> cases = new ArrayList<>(good);
        cases.addAll(List.of(
                ok("nan-position", 0, 486.1, 1e-3, null, null),
                bad("position", "nan-position", 1, nan, 1e-3, null, null),
                bad("position", "zero-position", 0, 0.0, 1e-3, null, null),
                bad("position", "null-position", 0, null, 1e-3, null, null),
                bad("sigma", "negative-sigma", 0, 486.1, -1e-3, null, null),
                bad("intensity", "infinite-intensity", 0, 486.1, 1e-3, Double.POSITIVE_INFINITY, null),
                ok("nan-width", 0, 486.1, 1e-3, null, 0.01),
                bad("width", "nan-width", 1, 656.4, 1e-3, null, nan),
                // Two problems in one row: the first the grouping names (sigma before width).
                bad("sigma", "two-problems", 0, 486.1, nan, null, nan),
                bad("id", null, 0, 486.1, 1e-3, null, null),
                ok("null-peak", 0, 486.1, 1e-3, null, null),
                bad("peak", "null-peak", null, 487.1, 1e-3, null, null),
                // Peak 1 twice: both rows.
                ok("twice", 0, 486.1, 1e-3, null, null),
                bad("peak", "twice", 1, 600.0, 1e-3, null, null),
                bad("peak", "twice", 1, 656.4, 1e-3, null, null),
                // A gap after peak 1: peaks 3 and 4 would be renumbered 2 and 3.
                ok("gap", 0, 410.2, 1e-3, null, null), ok("gap", 1, 434.0, 1e-3, null, null),
                bad("peak", "gap", 3, 486.1, 1e-3, null, null), bad("peak", "gap", 4, 656.4, 1e-3, null, null),
                // Numbered from 1.
                bad("peak", "from-one", 1, 486.1, 1e-3, null, null),
                bad("peak", "from-one", 2, 656.4, 1e-3, null, null)));
        List<Row> all = cases.stream().map(Case::row).toList();
        Dataset<Row> table = spark.createDataFrame(all, ROWS).repartition(3);
        Dataset<Row> problems = SurveyIdentification.validatePeakRows(table).cache();
        assertEquals(Schemas.PEAK_ROW_PROBLEMS, problems.schema(), "the documented schema (common practice)");
        List<Row> found = problems.collectAsList();

        // Exactly the bad rows, each with its column, value and code (common practice).
        Comparator<List<Object>> order = Comparator.comparing(Object::toString);
        List<List<Object>> expected = cases.stream().filter(c -> c.field() != null)
                .map(PeakRowValidationTest::expectedKey).sorted(order).toList();
        assertEquals(expected, found.stream().map(PeakRowValidationTest::key).sorted(order).toList(),
                "one problem per refused peak row, none for the others (common practice)");

        // Each bad spectrum alone: the grouping's refusal is one of the messages listed for it, and
        // for a spectrum with one bad row exactly its message (common practice).
        Map<String, List<Case>> spectra = cases.stream().filter(c -> !c.row().isNullAt(0))
                .collect(Collectors.groupingBy(c -> c.row().getString(0)));
        for (Map.Entry<String, List<Case>> spectrum : spectra.entrySet()) {
            String id = spectrum.getKey();
            List<Row> rows = spectrum.getValue().stream().map(Case::row).toList();
            List<String> listed = found.stream().filter(p -> id.equals(p.getString(0))).map(p -> p.getString(5))
                    .toList();
            if (listed.isEmpty()) {
                assertEquals(1, SurveyIdentification.peakLists(spark.createDataFrame(rows, ROWS)).count(), id);
                continue;
            }
            String refusal = SurveyIdentificationTest.failure(() -> SurveyIdentification.peakLists(
                    spark.createDataFrame(rows, ROWS)).collectAsList());
            assertTrue(listed.contains(refusal), id + ": " + refusal + " not in " + listed);
            if (listed.size() == 1) {
                assertEquals(List.of(refusal), listed, id);
            }
        }
        Row nullId = RowFactory.create(null, 0, 486.1, 1e-3, null, null);
        String refusal = SurveyIdentificationTest.failure(() -> SurveyIdentification.peakLists(
                spark.createDataFrame(List.of(nullId), ROWS)).collectAsList());
        assertEquals(List.of(refusal), found.stream().filter(p -> p.isNullAt(0)).map(p -> p.getString(5)).toList(),
                "a row without an id (common practice)");
        // The messages name the spectrum, column and peak, as the grouping does (e.g. the gap's first row).
        assertTrue(found.stream().anyMatch(p -> p.getString(5).equals("row 'gap', field 'peak': the peaks of a"
                + " spectrum must be numbered 0, 1, 2, ... without a gap, so that the identified peaks carry the same"
                + " numbers; after peak 1 comes peak 3 (renumber them, e.g. row_number() over the spectrum's id"
                + " ordered by peak, minus 1)")), found.toString());

        // The rows not listed group without refusal, and validate finds nothing in them (common practice).
        List<Row> passed = cases.stream().filter(c -> c.field() == null).map(Case::row).toList();
        Dataset<Row> kept = spark.createDataFrame(passed, ROWS);
        assertEquals(0, SurveyIdentification.validatePeakRows(kept).count(), "a clean table has no problem");
        long ids = passed.stream().map(r -> r.getString(0)).distinct().count();
        assertEquals(ids, SurveyIdentification.peakLists(kept).count(), "the rows validation passed group");
        // The README's way: drop the spectra listed.
        Dataset<Row> clean = table.where("id IS NOT NULL").join(problems.select("id").distinct(), "id", "left_anti");
        assertEquals(2, SurveyIdentification.peakLists(clean).count(), "good-a and good-b");
        problems.unpersist();
    }

    /**
     * A missing column is one problem row, the grouping's own refusal; absent optional columns
     * (sigma, intensity, width) are nulls, in the validation and in the grouping (which until
     * 2026-12-05 failed on them with Spark's unresolved-column error).
     */
    @Test
    void aMissingColumnIsOneRowAndAbsentOptionalColumnsAreNulls() {
        SparkSession spark = LocalSpark.session();
        List<Row> rows = List.of(RowFactory.create("a", 0, 486.1, 1e-3, null, null),
                RowFactory.create("a", 1, 656.4, 1e-3, null, null));
        Dataset<Row> noPosition = spark.createDataFrame(rows, Schemas.PEAK_ROWS).drop("position");
        SparkRowException schema = assertThrows(SparkRowException.class, () -> SurveyIdentification.peakLists(
                noPosition));
        List<Row> problems = SurveyIdentification.validatePeakRows(noPosition).collectAsList();
        assertEquals(1, problems.size());
        assertEquals(Arrays.asList(null, null, "position", null, SparkRowException.BAD_SCHEMA, schema.getMessage()),
                Arrays.asList(problems.get(0).get(0), problems.get(0).get(1), problems.get(0).get(2),
                        problems.get(0).get(3), problems.get(0).get(4), problems.get(0).get(5)));

        Dataset<Row> bare = spark.createDataFrame(rows, Schemas.PEAK_ROWS).drop("sigma", "intensity", "width")
                .withColumnRenamed("position", "Position");
        assertEquals(0, SurveyIdentification.validatePeakRows(bare).count());
        Row grouped = SurveyIdentification.peakLists(bare).collectAsList().get(0);
        assertEquals(List.of(486.1, 656.4), grouped.getList(1));
        assertTrue(grouped.isNullAt(2) && grouped.isNullAt(3) && grouped.isNullAt(4), grouped.toString());
    }
}
