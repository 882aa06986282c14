package org.ritzwerk.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.spark.api.java.function.VoidFunction2;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.streaming.Trigger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.refdata.DataContext;

/**
 * The README's Spark example, compiled and run in local mode: tables written to Parquet and read
 * back (as a survey keeps them), identified, calibrated, applied and synthesised.
 */
class UserGuideTest {

    @Test
    void theReadmeExampleRunsOnStoredTables(@TempDir Path folder) {
        SparkSession spark = LocalSpark.session();
        String peakFiles = folder.resolve("peaks.parquet").toString();
        String lampFiles = folder.resolve("lamps.parquet").toString();
        String scienceFiles = folder.resolve("science.parquet").toString();
        String sceneFiles = folder.resolve("scenes.parquet").toString();
        String out = folder.toString();
        Fixtures.peakListTable(spark, Fixtures.peakLists(List.of("H I", "He II"), 4, 10, 2, 7L), 2).write()
                .parquet(peakFiles);
        DataContext data = DataContext.builtIn();
        double[] lamp = Fixtures.neonExposure(data.lampLines(Species.parse("Ne I")), 1.0, 3L);
        spark.createDataFrame(List.of(RowFactory.create("lamp-1", lamp, null)), Schemas.EXPOSURES).write()
                .parquet(lampFiles);
        spark.createDataFrame(List.of(RowFactory.create("star-1", "lamp-1", lamp)), Schemas.SCIENCE).write()
                .parquet(scienceFiles);
        List<Row> scenes = new ArrayList<>();
        for (int k = 0; k < 4; k++) {
            scenes.add(RowFactory.create("scene-" + k, new String[] {"H I"}, null, 8000.0 + 1000 * k, 1e20, 0.0,
                    8000.0, 1000L + k));
        }
        spark.createDataFrame(scenes, Schemas.SCENES).write().parquet(sceneFiles);

        // --- README: Spark ---
        // Identification: one row per spectrum (id, positions, sigmas, intensities, widths), nm in vacuum.
        Dataset<Row> peaks = spark.read().parquet(peakFiles);
        SurveyIdentification.Result identified = SurveyIdentification.of(
                IdentificationParameters.inWindow(List.of("H I", "He II"), List.of(), 360, 710)
                        .withTolerance("5 sigma").withVelocitySearch(100e3))
                .identify(peaks);
        identified.spectra().persist();
        identified.spectra().write().parquet(out + "/identified.parquet");   // velocity, presence, ...
        identified.peaks().write().parquet(out + "/identified-peaks.parquet"); // one row per peak

        // Calibration: raw lamp exposures (id, counts, sigmas), then science spectra (id, calibration_id, counts).
        Dataset<Row> calibrations = SurveyCalibration.of(CalibrationParameters.of(List.of("Ne I"), List.of()))
                .calibrate(spark.read().parquet(lampFiles));
        calibrations.write().parquet(out + "/calibrations.parquet");
        Dataset<Row> calibrated = SurveyCalibration.apply(spark.read().parquet(scienceFiles),
                spark.read().parquet(out + "/calibrations.parquet"));          // wavelengths_nm per pixel
        calibrated.write().parquet(out + "/calibrated.parquet");

        // Synthesis: scene parameters (id, species, abundances, temperature_k, electron_density_m3,
        // velocity_m_s, resolving_power, seed) -> spectra with their truth.
        Dataset<Row> spectra = SurveySynthesis.of(SynthesisParameters.linear(380, 700, 4000))
                .synthesise(spark.read().parquet(sceneFiles));
        spectra.write().parquet(out + "/spectra.parquet");
        // --- end ---

        assertEquals(4, spark.read().parquet(out + "/identified.parquet").count());
        assertEquals(48, spark.read().parquet(out + "/identified-peaks.parquet").count());
        Row calibration = spark.read().parquet(out + "/calibrations.parquet").first();
        assertTrue(calibration.isNullAt(calibration.fieldIndex("failure")), "lamp-1 calibrates");
        Row star = spark.read().parquet(out + "/calibrated.parquet").first();
        assertEquals(Fixtures.PIXELS, star.getList(star.fieldIndex("wavelengths_nm")).size());
        assertEquals(4, spark.read().parquet(out + "/spectra.parquet").filter("failure IS NULL").count());
        identified.spectra().unpersist();
    }

    /**
     * The README's peak-row validation and dark-line filter: the spectra with a refused peak row
     * are dropped and the rest group; the scene too cold for He I's lines is found (He I's upper
     * levels near 23 eV at 300 K: exp(-892), below the smallest double, as SurveySynthesisTest
     * works out), the warm one is not.
     */
    @Test
    void peakRowsAreValidatedAndDarkLinesFiltered(@TempDir Path folder) {
        SparkSession spark = LocalSpark.session();
        String peakRowFiles = folder.resolve("peak-rows.parquet").toString();
        spark.createDataFrame(List.of(
                RowFactory.create("spectrum-1", 0, 486.1, 1e-3, null, null),
                RowFactory.create("spectrum-1", 1, 656.4, 1e-3, null, null),
                RowFactory.create("spectrum-2", 0, 486.1, -1e-3, null, null),
                RowFactory.create("spectrum-3", 0, 434.0, 1e-3, null, null),
                RowFactory.create("spectrum-3", 2, 486.1, 1e-3, null, null)), Schemas.PEAK_ROWS).write()
                .parquet(peakRowFiles);
        Dataset<Row> scenes = spark.createDataFrame(List.of(
                RowFactory.create("warm", new String[] {"H I"}, null, 9000.0, null, 0.0, 8000.0, 1L),
                RowFactory.create("cool", new String[] {"H I", "He I"}, null, 300.0, null, 0.0, 8000.0, 2L)),
                Schemas.SCENES);
        Dataset<Row> spectra = SurveySynthesis.of(SynthesisParameters.linear(640, 670, 1500).withMedium("air"))
                .synthesise(scenes);

        // --- README: peak rows ---
        Dataset<Row> peakRows = spark.read().parquet(peakRowFiles);    // id, peak, position, sigma, ...
        Dataset<Row> bad = SurveyIdentification.validatePeakRows(peakRows).cache();
        bad.groupBy("field").count().show();                            // how many of each kind
        Dataset<Row> kept = peakRows.where("id IS NOT NULL").join(bad.select("id").distinct(), "id", "left_anti");
        Dataset<Row> peakLists = SurveyIdentification.peakLists(kept);  // refuses no row now
        // --- end ---
        // --- README: dark lines ---
        Dataset<Row> cold = spectra.where("dark_lines.population_underflow > 0")   // too cold for some lines
                .select("id", "dark_lines.on_grid", "dark_lines.dark");
        // --- end ---

        assertEquals(List.of("spectrum-2", "spectrum-3"), bad.select("id").orderBy("id").collectAsList().stream()
                .map(r -> r.getString(0)).toList());
        assertEquals(List.of("spectrum-1"), peakLists.collectAsList().stream().map(r -> r.getString(0)).toList());
        List<Row> found = cold.collectAsList();
        assertEquals(1, found.size());
        assertEquals("cool", found.get(0).getString(0));
        assertTrue(found.get(0).getInt(2) > 0 && found.get(0).getInt(1) >= found.get(0).getInt(2), found.toString());
        bad.unpersist();
    }

    /**
     * The README's streaming line: the operations take batch tables, so a stream is identified
     * micro-batch by micro-batch in foreachBatch, giving each spectrum what the batch table gives
     * it (common practice: Spark's documented way to reuse batch code on a stream).
     */
    @Test
    void aStreamIsIdentifiedInForeachBatch(@TempDir Path folder) throws Exception {
        SparkSession spark = LocalSpark.session();
        String peakFiles = folder.resolve("peaks").toString();
        String out = folder.toString();
        Fixtures.peakListTable(spark, Fixtures.peakLists(List.of("H I", "He II"), 4, 10, 2, 7L), 2).write()
                .parquet(peakFiles);

        // --- README: streaming ---
        SurveyIdentification identification = SurveyIdentification.of(
                IdentificationParameters.inWindow(List.of("H I", "He II"), List.of(), 360, 710)
                        .withTolerance("5 sigma").withVelocitySearch(100e3));
        Dataset<Row> stream = spark.readStream().schema(Schemas.PEAK_LISTS).parquet(peakFiles);
        stream.writeStream()
                .foreachBatch((VoidFunction2<Dataset<Row>, Long>) (batch, batchId) -> identification.identify(batch)
                        .spectra().write().mode("append").parquet(out + "/identified.parquet"))
                .option("checkpointLocation", out + "/checkpoint")
                .trigger(Trigger.AvailableNow()) // README: .start() alone, a query that keeps running
                .start().awaitTermination();
        // --- end ---

        List<Row> streamed = spark.read().parquet(out + "/identified.parquet").orderBy("id").collectAsList();
        List<Row> batch = identification.identify(spark.read().parquet(peakFiles)).spectra().orderBy("id")
                .collectAsList();
        assertEquals(4, streamed.size());
        assertEquals(batch, streamed);
    }
}
