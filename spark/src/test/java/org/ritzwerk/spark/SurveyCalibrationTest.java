package org.ritzwerk.spark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationException;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.CalibrationFiles;
import org.ritzwerk.refdata.DataContext;

/**
 * Calibration on Spark (local[2]) against the library called directly: the calibrator's solution
 * and quality figures bit for bit, a refused exposure reported in its row, and applying the
 * calibrations bit for bit equal to applying a saved calibration file (what {@code calibrate
 * --apply} does); refusals of malformed rows name the row id and field.
 */
class SurveyCalibrationTest {

    @Test
    void calibrationsAndTheirApplicationAreTheLibrarysBitForBit(@TempDir Path folder) throws Exception {
        calibrationsAndTheirApplicationAreTheLibrarysBitForBit(LocalSpark.session(), folder);
    }

    /**
     * The check of the test above in a session of any deployment ({@link SurveyClusterTest} runs it
     * too); the saved calibration files go to {@code folder}.
     */
    static void calibrationsAndTheirApplicationAreTheLibrarysBitForBit(SparkSession spark, Path folder)
            throws Exception {
        DataContext data = DataContext.builtIn();
        Map<String, double[]> exposures = new HashMap<>();
        exposures.put("lamp-1", Fixtures.neonExposure(data.lampLines(Species.parse("Ne I")), 1.0, 9L));
        exposures.put("lamp-2", Fixtures.neonExposure(data.lampLines(Species.parse("Ne I")), 1.02, 11L));
        exposures.put("lamp-3", Fixtures.neonExposure(data.lampLines(Species.parse("Ne I")), 0.98, 12L));
        double[] flat = new double[Fixtures.PIXELS];
        java.util.Arrays.fill(flat, 100);
        exposures.put("dark", flat);
        List<Row> rows = new ArrayList<>();
        exposures.forEach((id, counts) -> rows.add(RowFactory.create(id, counts, null)));
        Dataset<Row> table = spark.createDataFrame(rows, Schemas.EXPOSURES).repartition(2);

        Dataset<Row> calibrations = SurveyCalibration.of(CalibrationParameters.of(List.of("Ne I"), List.of()))
                .calibrate(table).cache();
        List<Row> out = calibrations.collectAsList();
        assertEquals(4, out.size());

        LampSet neon = LampSet.of(List.of(data.lampLines(Species.parse("Ne I"))), Medium.air());
        Map<String, DispersionSolution> saved = new HashMap<>();
        for (Row row : out) {
            String id = row.getString(0);
            double[] counts = exposures.get(id);
            assertEquals(counts.length, row.getInt(1));
            if (id.equals("dark")) {
                CalibrationException refused = org.junit.jupiter.api.Assertions.assertThrows(
                        CalibrationException.class, () -> Calibrator.defaults().calibrate(
                                CalibrationProblem.builder(counts).lamp(neon).source(id).build()));
                assertEquals(refused.code(), row.getAs("failure_code"));
                assertEquals(refused.getMessage(), row.getAs("failure"));
                assertTrue(row.isNullAt(3), "no degree for a refused exposure");
                continue;
            }
            Calibration c = Calibrator.defaults().calibrate(CalibrationProblem.builder(counts).lamp(neon).source(id)
                    .build());
            DispersionSolution s = c.solution();
            assertNull(row.getAs("failure"), id);
            assertEquals(s.medium().spec(), row.getString(2));
            assertEquals(s.degree(), row.getInt(3));
            assertEquals(s.centrePixel(), row.getDouble(4));
            assertEquals(s.halfRange(), row.getDouble(5));
            assertArrayEquals(s.polynomial().coefficients(), doubles(row.getList(6)), id);
            double[][] covariance = s.polynomial().covariance();
            List<Double> flatCovariance = row.getList(7);
            for (int i = 0; i < covariance.length; i++) {
                for (int j = 0; j < covariance.length; j++) {
                    assertEquals(covariance[i][j], flatCovariance.get(i * covariance.length + j));
                }
            }
            double[] higher = s.polynomial().higherDegreeCoefficients();
            assertTrue(higher != null, id + ": the fit keeps a higher degree's polynomial");
            assertArrayEquals(higher, doubles(row.getList(8)), id);
            if (higher != null) {
                double[][] higherCovariance = s.polynomial().higherDegreeCovariance();
                List<Double> flatHigher = row.getList(9);
                for (int i = 0; i < higher.length; i++) {
                    for (int j = 0; j < higher.length; j++) {
                        assertEquals(higherCovariance[i][j], flatHigher.get(i * higher.length + j));
                    }
                }
            }
            assertEquals(s.lowestPixel(), row.getDouble(10));
            assertEquals(s.highestPixel(), row.getDouble(11));
            assertEquals(s.rmsNm(), row.getDouble(12));
            assertEquals(s.rmsPixels(), row.getDouble(13));
            assertEquals(s.reducedChiSquare(), row.getDouble(14));
            assertEquals(s.usedCount(), row.getInt(15));
            assertEquals(s.rejectedCount(), row.getInt(16));
            assertEquals(c.peaks().size(), row.getInt(17));
            assertEquals(c.strongPeaks(), row.getInt(18));
            assertEquals(c.strongMatched(), row.getInt(19));
            assertEquals(c.matchedFraction(), row.getDouble(20));
            assertEquals(c.coverage(), row.getDouble(21));
            assertEquals(c.saturatedPeaks(), row.getInt(22));
            assertEquals(c.pairLabels(), row.getList(23));
            assertEquals(c.description(), row.getString(24));
            assertEquals(c.endConfirmationPixels(false), row.isNullAt(25) ? Double.NaN : row.getDouble(25));
            assertEquals(c.endConfirmationPixels(true), row.isNullAt(26) ? Double.NaN : row.getDouble(26));
            int weight = row.fieldIndex("higher_degree_weight");
            assertEquals(s.polynomial().higherDegreeWeight(), row.isNullAt(weight) ? Double.NaN
                    : row.getDouble(weight), id);
            assertEquals(c.notes(), row.getList(row.fieldIndex("notes")), id);
            // The saved-file path of the README: write, read, apply.
            Path file = folder.resolve(id + ".json");
            CalibrationFiles.write(file, s, counts.length, c.description(), c.pairLabels());
            saved.put(id, CalibrationFiles.read(file).solution());
        }

        List<Row> science = new ArrayList<>();
        science.add(RowFactory.create("star-a", "lamp-1", Fixtures.neonExposure(data.lampLines(Species.parse("Ne I")),
                1.0, 21L)));
        science.add(RowFactory.create("star-b", "lamp-2", flat));
        science.add(RowFactory.create("star-c", "lamp-3", flat));
        List<Row> applied = SurveyCalibration.apply(spark.createDataFrame(science, Schemas.SCIENCE), calibrations)
                .collectAsList();
        assertEquals(3, applied.size());
        for (Row row : applied) {
            DispersionSolution s = saved.get(row.getString(1));
            assertArrayEquals(s.pixelCentreWavelengths(Fixtures.PIXELS), doubles(row.getList(3)), row.getString(0));
            assertArrayEquals(s.pixelCentreWavelengthSigmas(Fixtures.PIXELS), doubles(row.getList(4)));
            assertEquals(s.medium().spec(), row.getString(5));
        }

        // The next degree's weight reaches apply when it is not null (these neon fits leave it null): with 0.4
        // written into lamp-1's row, the applied sigmas are the library polynomial's with that weight, and wider
        // between the lines than without it (DispersionSolution.wavelengthSigmaAt).
        Dataset<Row> weighted = calibrations.withColumn("higher_degree_weight", org.apache.spark.sql.functions
                .when(org.apache.spark.sql.functions.col("id").equalTo("lamp-1"), 0.4)
                .otherwise(org.apache.spark.sql.functions.col("higher_degree_weight")));
        Row weightedRow = SurveyCalibration.apply(spark.createDataFrame(science.subList(0, 1), Schemas.SCIENCE),
                weighted).collectAsList().get(0);
        org.ritzwerk.data.DispersionPolynomial p = saved.get("lamp-1").polynomial();
        DispersionSolution withWeight = DispersionSolution.of(new org.ritzwerk.data.DispersionPolynomial(p.medium(),
                p.centrePixel(), p.halfRange(), p.coefficients(), p.covariance(), p.lowestPixel(), p.highestPixel(),
                p.higherDegreeCoefficients(), p.higherDegreeCovariance(), 0.4));
        double[] sigmas = doubles(weightedRow.getList(4));
        assertArrayEquals(withWeight.pixelCentreWavelengthSigmas(Fixtures.PIXELS), sigmas);
        double[] without = saved.get("lamp-1").pixelCentreWavelengthSigmas(Fixtures.PIXELS);
        int wider = 0;
        for (int i = 0; i < sigmas.length; i++) {
            wider += sigmas[i] > without[i] ? 1 : 0;
        }
        assertTrue(wider > 0, "the weight widens some sigma");

        // A refused calibration (one bad lamp a night is normal) refuses its spectra in their rows and
        // the others go on (common practice: per-row failures, as calibrate() gives a refused exposure).
        Row dark = out.stream().filter(r -> r.getString(0).equals("dark")).findFirst().orElseThrow();
        List<Row> mixed = List.of(RowFactory.create("star-d", "dark", flat), RowFactory.create("star-g", "lamp-1",
                flat));
        Map<String, Row> byId = new HashMap<>();
        for (Row row : SurveyCalibration.apply(spark.createDataFrame(mixed, Schemas.SCIENCE), calibrations)
                .collectAsList()) {
            byId.put(row.getString(0), row);
        }
        Row refused = byId.get("star-d");
        String code = dark.getAs("failure_code");
        String failure = dark.getAs("failure");
        assertEquals(code, refused.<String>getAs("failure_code"));
        assertEquals("calibration 'dark' was refused (" + code + ": " + failure + "); there is nothing to apply",
                refused.<String>getAs("failure"));
        assertArrayEquals(flat, doubles(refused.getList(2)), "counts as given");
        for (String field : List.of("wavelengths_nm", "wavelength_sigmas_nm", "medium")) {
            assertTrue(refused.isNullAt(refused.fieldIndex(field)), field + " null when refused");
        }
        Row good = byId.get("star-g");
        assertTrue(good.isNullAt(good.fieldIndex("failure_code")) && good.isNullAt(good.fieldIndex("failure")));
        assertArrayEquals(saved.get("lamp-1").pixelCentreWavelengths(Fixtures.PIXELS), doubles(good.getList(3)));

        // Applying a missing calibration, or one made for another pixel count, fails the job naming the spectrum.
        String message;
        List<Row> missing = List.of(RowFactory.create("star-e", "lamp-9", flat));
        message = SurveyIdentificationTest.failure(() -> SurveyCalibration.apply(
                spark.createDataFrame(missing, Schemas.SCIENCE), calibrations).count());
        assertEquals("row 'star-e', field 'calibration_id': no calibration has the id 'lamp-9'", message);
        List<Row> shorter = List.of(RowFactory.create("star-f", "lamp-1", new double[100]));
        message = SurveyIdentificationTest.failure(() -> SurveyCalibration.apply(
                spark.createDataFrame(shorter, Schemas.SCIENCE), calibrations).count());
        assertEquals("row 'star-f', field 'counts': has 100 pixels, but calibration 'lamp-1' was made for 2048",
                message);
        calibrations.unpersist();
    }

    /**
     * What the job writes keeps to the nulls {@link Schemas#CALIBRATIONS} declares, for a refused
     * exposure (flat counts, no peak) and an accepted one: a column declared not nullable is never
     * null, no array holds a null element, a refused row has only id, pixels, failure_code, failure
     * and notes, an accepted one has every column but the failure's. The columns never null in
     * either are exactly those declared not nullable (notes was declared nullable, though the job
     * never leaves it null).
     */
    @Test
    void refusedAndAcceptedRowsKeepToTheDeclaredNulls() {
        SparkSession spark = LocalSpark.session();
        DataContext data = DataContext.builtIn();
        double[] flat = new double[Fixtures.PIXELS];
        java.util.Arrays.fill(flat, 100);
        List<Row> rows = List.of(RowFactory.create("lamp", Fixtures.neonExposure(data.lampLines(Species.parse("Ne I")),
                1.0, 9L), null), RowFactory.create("dark", flat, null));
        Dataset<Row> calibrations = SurveyCalibration.of(CalibrationParameters.of(List.of("Ne I"), List.of()))
                .calibrate(spark.createDataFrame(rows, Schemas.EXPOSURES));
        assertEquals(Schemas.CALIBRATIONS, calibrations.schema());
        org.apache.spark.sql.types.StructField[] fields = Schemas.CALIBRATIONS.fields();
        Map<String, Row> byId = new HashMap<>();
        java.util.Set<String> neverNull = new java.util.TreeSet<>();
        for (org.apache.spark.sql.types.StructField field : fields) {
            neverNull.add(field.name());
        }
        for (Row row : calibrations.collectAsList()) {
            byId.put(row.getString(0), row);
            for (int i = 0; i < fields.length; i++) {
                String where = row.getString(0) + " " + fields[i].name();
                if (row.isNullAt(i)) {
                    assertTrue(fields[i].nullable(), where + " is null but declared not nullable");
                    neverNull.remove(fields[i].name());
                } else if (fields[i].dataType() instanceof org.apache.spark.sql.types.ArrayType array
                        && !array.containsNull()) {
                    for (Object element : row.getList(i)) {
                        assertTrue(element != null, where + " holds a null element");
                    }
                }
            }
        }
        java.util.Set<String> declared = new java.util.TreeSet<>();
        for (org.apache.spark.sql.types.StructField field : fields) {
            if (!field.nullable()) {
                declared.add(field.name());
            }
        }
        assertEquals(declared, neverNull);
        assertEquals(java.util.Set.of("id", "pixels", "notes"), declared);

        Row refused = byId.get("dark");
        java.util.Set<String> kept = java.util.Set.of("id", "pixels", "failure_code", "failure", "notes");
        for (int i = 0; i < fields.length; i++) {
            assertEquals(!kept.contains(fields[i].name()), refused.isNullAt(i), "refused: " + fields[i].name());
        }
        assertEquals(Fixtures.PIXELS, refused.getInt(1));
        Row accepted = byId.get("lamp");
        for (int i = 0; i < fields.length; i++) {
            boolean failure = fields[i].name().startsWith("failure");
            if (fields[i].name().equals("higher_degree_weight")) {
                // null when the library's weight is not known, as for this exposure's fit; compared
                // with the library's where the job's rows are compared
                continue;
            }
            assertEquals(failure, accepted.isNullAt(i), "accepted: " + fields[i].name());
        }
    }

    /** One seeded neon exposure (id lamp-1) as counts, as a one-row exposures table, and its lamp. */
    private record NeonExposure(double[] counts, Dataset<Row> table, LampSet lamp) {
        static NeonExposure make() {
            DataContext data = DataContext.builtIn();
            double[] counts = Fixtures.neonExposure(data.lampLines(Species.parse("Ne I")), 1.0, 9L);
            Dataset<Row> table = LocalSpark.session().createDataFrame(List.of(RowFactory.create("lamp-1", counts,
                    null)), Schemas.EXPOSURES);
            return new NeonExposure(counts, table, LampSet.of(List.of(data.lampLines(Species.parse("Ne I"))),
                    Medium.air()));
        }
    }

    /**
     * The command's --gain and --read-noise reach the operation (CalibrationParameters.withDetector):
     * a row calibrated with a stated detector is the library's with the same settings, bit for bit,
     * its description naming the gain given; bad values are refused as the library refuses them.
     */
    @Test
    void aStatedDetectorGainReachesTheOperation() {
        NeonExposure exposure = NeonExposure.make();
        double[] counts = exposure.counts();
        Dataset<Row> table = exposure.table();
        LampSet neon = exposure.lamp();
        Calibration c = Calibrator.defaults().withGain(3.7).withReadNoise(2).calibrate(CalibrationProblem
                .builder(counts).lamp(neon).source("lamp-1").build());
        Row row = SurveyCalibration.of(CalibrationParameters.of(List.of("Ne I"), List.of()).withDetector(3.7, 2))
                .calibrate(table).collectAsList().get(0);
        assertNull(row.getAs("failure"));
        assertArrayEquals(c.solution().polynomial().coefficients(), doubles(row.getList(6)));
        assertEquals(c.description(), row.getAs("description"));
        assertTrue(c.description().contains("3.7"), c.description());
        CalibrationParameters p = CalibrationParameters.of(List.of("Ne I"), List.of());
        org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class, () -> p.withDetector(0, 2));
        org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                () -> p.withDetector(Double.NaN, -1));
    }

    /**
     * The command's --required-precision and --no-second-order reach the operation: a solution
     * less precise than required is refused in its row with the library's code and message, and
     * one within it is the library's, bit for bit.
     */
    @Test
    void aRequiredPrecisionRefusesInTheRowAsTheLibraryDoes() {
        NeonExposure exposure = NeonExposure.make();
        double[] counts = exposure.counts();
        Dataset<Row> table = exposure.table();
        LampSet neon = exposure.lamp();
        CalibrationProblem problem = CalibrationProblem.builder(counts).lamp(neon).source("lamp-1").build();
        double stated = Calibrator.defaults().withSecondOrder(false).calibrate(problem).largestSigmaPixels();

        CalibrationParameters strict = CalibrationParameters.of(List.of("Ne I"), List.of()).withSecondOrder(false)
                .withRequiredPrecision(stated / 2);
        Row refusedRow = SurveyCalibration.of(strict).calibrate(table).collectAsList().get(0);
        CalibrationException refused = org.junit.jupiter.api.Assertions.assertThrows(CalibrationException.class,
                () -> Calibrator.defaults().withSecondOrder(false).withRequiredPrecision(stated / 2).calibrate(problem));
        assertEquals(CalibrationException.IMPRECISE, refusedRow.getAs("failure_code"));
        assertEquals(refused.getMessage(), refusedRow.getAs("failure"));

        CalibrationParameters loose = strict.withRequiredPrecision(stated * 2);
        Row row = SurveyCalibration.of(loose).calibrate(table).collectAsList().get(0);
        assertNull(row.getAs("failure"));
        DispersionSolution s = Calibrator.defaults().withSecondOrder(false).calibrate(problem).solution();
        assertArrayEquals(s.polynomial().coefficients(), doubles(row.getList(6)));
        org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                () -> CalibrationParameters.of(List.of("Ne I"), List.of()).withRequiredPrecision(-1));

        // The uncertainty ceiling refuses in the row as the library does.
        Row cappedRow = SurveyCalibration.of(loose.withUncertaintyCeiling(stated / 2)).calibrate(table)
                .collectAsList().get(0);
        CalibrationException capped = org.junit.jupiter.api.Assertions.assertThrows(CalibrationException.class,
                () -> Calibrator.defaults().withSecondOrder(false).withRequiredPrecision(stated * 2)
                        .withUncertaintyCeiling(stated / 2).calibrate(problem));
        assertEquals(CalibrationException.IMPRECISE, cappedRow.getAs("failure_code"));
        assertEquals(capped.getMessage(), cappedRow.getAs("failure"));
        org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                () -> CalibrationParameters.of(List.of("Ne I"), List.of()).withUncertaintyCeiling(0));
    }

    /**
     * A window holding three of mercury's lines (404.66, 433.92, 435.83 nm on an invented
     * 1024-pixel spectrometer, 395 + 0.05 p nm, with a prior): no other line checks an end of
     * three, so by default the row is refused with the library's code and message, and with
     * {@code withUncheckedEnds(true)} it is the library's solution bit for bit, its notes saying
     * that the ends rest on their pairings.
     */
    @Test
    void aThreeLineWindowNeedsUncheckedEndsAsInTheLibrary() {
        SparkSession spark = LocalSpark.session();
        DataContext data = DataContext.builtIn();
        org.ritzwerk.engine.synth.PixelGrid grid = org.ritzwerk.engine.synth.PixelGrid.linear(395 - 0.025,
                395 + 0.05 * 1023.5, 1024);
        double[] nm = {404.6563, 433.9223, 435.8328};
        double[] fwhm = {0.11, 0.11, 0.11};
        double[] expected = new double[1024];
        new org.ritzwerk.engine.synth.LineRenderer(grid, org.ritzwerk.engine.synth.Instrument.ideal(), 12)
                .render(nm, new double[] {1.03e4, 1.6e3, 2.6e4}, fwhm, new double[3], expected);
        double[] counts = new double[1024];
        org.ritzwerk.engine.synth.Noise.apply(expected, 3, 5, counts);
        Dataset<Row> table = spark.createDataFrame(List.of(RowFactory.create("hg-1", counts, null)),
                Schemas.EXPOSURES);
        CalibrationParameters window = CalibrationParameters.of(List.of("Hg I"), List.of())
                .withPrior(394, 447, 0.049, 0.051);
        LampSet mercury = LampSet.of(List.of(data.lampLines(Species.parse("Hg I"))), Medium.air());
        CalibrationProblem problem = CalibrationProblem.builder(counts).lamp(mercury)
                .prior(new org.ritzwerk.engine.calibrate.LampMatcher.Prior(394, 447, 0.049, 0.051)).source("hg-1")
                .build();
        Row refusedRow = SurveyCalibration.of(window).calibrate(table).collectAsList().get(0);
        CalibrationException refused = org.junit.jupiter.api.Assertions.assertThrows(CalibrationException.class,
                () -> Calibrator.defaults().calibrate(problem));
        assertEquals(CalibrationException.UNCHECKED_END, refusedRow.getAs("failure_code"));
        assertEquals(refused.getMessage(), refusedRow.getAs("failure"));
        Row row = SurveyCalibration.of(window.withUncheckedEnds(true)).calibrate(table).collectAsList().get(0);
        Calibration c = Calibrator.defaults().withUncheckedEndsAccepted(true).calibrate(problem);
        assertNull(row.getAs("failure"));
        assertArrayEquals(c.solution().polynomial().coefficients(), doubles(row.getList(6)));
        assertEquals(c.notes(), row.getList(row.fieldIndex("notes")));
        assertTrue(c.notes().size() == 2, c.notes().toString());
    }

    /**
     * A helium lamp, which has no lamp set: its lamp is built from the He I level list as the
     * calibrate command builds it ({@code DataLines.calibrationLamp}: Ritz lines ranked by g_u A,
     * blended at the resolving power, 5000 by default), and each solution is the library's bit for
     * bit. The exposure is a synthetic helium discharge on an invented spectrometer (4096 pixels,
     * 380 to 756 nm, R = 3000, 30,000 K).
     */
    @Test
    void aHeliumLampFromTheLevelListIsTheLibrarysBitForBit() {
        SparkSession spark = LocalSpark.session();
        DataContext data = DataContext.builtIn();
        Species he = Species.parse("He I");
        org.ritzwerk.engine.synth.PixelGrid grid = org.ritzwerk.engine.synth.PixelGrid.linear(380, 756, 4096);
        double[] counts = org.ritzwerk.engine.synth.Scene.builder(grid).medium(Medium.air())
                .instrument(org.ritzwerk.engine.synth.Instrument.ofResolvingPower(3000)).temperature(30_000)
                .peakCounts(20_000).levels(org.ritzwerk.refdata.DataLines.levels(data, he),
                        org.ritzwerk.refdata.DataLines.ritzLines(data, he), 1.0, data.nucleus(he))
                .noise(3, 5).build().render(1).counts();
        Dataset<Row> table = spark.createDataFrame(List.of(RowFactory.create("he-1", counts, null)),
                Schemas.EXPOSURES);
        for (double r : new double[] {Double.NaN, 3000}) {
            Row row = SurveyCalibration.of(CalibrationParameters.of(List.of("He I"), List.of()).withResolvingPower(r))
                    .calibrate(table).collectAsList().get(0);
            LampSet lamp = org.ritzwerk.refdata.DataLines.calibrationLamp(data, List.of(he), List.of(), Medium.air(),
                    r).lamp();
            Calibration c = Calibrator.defaults().calibrate(CalibrationProblem.builder(counts).lamp(lamp)
                    .source("he-1").build());
            assertNull(row.getAs("failure"), "R " + r);
            assertArrayEquals(c.solution().polynomial().coefficients(), doubles(row.getList(6)), "R " + r);
            assertEquals(c.pairLabels(), row.getList(row.fieldIndex("lines")));
            assertTrue(c.pairLabels().stream().anyMatch(l -> l.contains("blended")), "587.6 nm as one line");
            // The lamp's making is said in the row, as the command says it in a note.
            List<String> notes = new ArrayList<>(org.ritzwerk.refdata.DataLines.calibrationLamp(data, List.of(he),
                    List.of(), Medium.air(), r).notes(Medium.air()));
            notes.addAll(c.notes());
            assertEquals(notes, row.getList(row.fieldIndex("notes")), "R " + r);
            assertTrue(notes.get(0).startsWith("He I: no lamp set; using the "), notes.get(0));
        }
        org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                () -> CalibrationParameters.of(List.of("He I"), List.of()).withResolvingPower(0.5));
    }

    @Test
    void aMalformedExposureFailsTheJobNamingItsIdAndField() {
        SparkSession spark = LocalSpark.session();
        SurveyCalibration job = SurveyCalibration.of(CalibrationParameters.of(List.of("Ne I"), List.of()));
        List<Row> rows = List.of(RowFactory.create("exp-17", new double[] {1, 2, Double.POSITIVE_INFINITY}, null));
        String message = SurveyIdentificationTest.failure(() -> job.calibrate(
                spark.createDataFrame(rows, Schemas.EXPOSURES)).count());
        assertTrue(message.startsWith("row 'exp-17', field 'counts': element 2 is Infinity"), message);
        // Tables read from files have nullable columns; a null where counts are required is refused.
        org.apache.spark.sql.types.StructType nullable = new org.apache.spark.sql.types.StructType()
                .add("id", org.apache.spark.sql.types.DataTypes.StringType, true)
                .add("counts", org.apache.spark.sql.types.DataTypes.createArrayType(
                        org.apache.spark.sql.types.DataTypes.DoubleType, true), true);
        List<Row> noCounts = List.of(RowFactory.create("exp-18", null));
        message = SurveyIdentificationTest.failure(() -> job.calibrate(spark.createDataFrame(noCounts, nullable))
                .count());
        assertEquals("row 'exp-18', field 'counts': is null", message);
    }

    private static double[] doubles(List<Double> list) {
        double[] values = new double[list.size()];
        for (int i = 0; i < values.length; i++) {
            values[i] = list.get(i);
        }
        return values;
    }
}
