package org.ritzwerk.spark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Renderer;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataLines;

/**
 * Synthesis on Spark (local[2]) against the library's scenes built directly with the same
 * parameters: counts with noise from each row's seed, expected counts and the true lines, bit for
 * bit; a scene without light reported in its row; malformed rows refused naming id and field.
 */
class SurveySynthesisTest {

    private static final SynthesisParameters GRID = SynthesisParameters.linear(640, 670, 1500).withMedium("air")
            .withModel("qed", 12).withCounts(5000, 3);

    /** The library as the synth command composes one scene (ions, then alkali atoms, then level lists). */
    private static Scene library(DataContext data, String[] species, double[] abundances, double kelvin,
            Double density, double velocity, double resolvingPower, long seed) {
        return library(data, species, abundances, kelvin, density, velocity, resolvingPower, seed, List.of());
    }

    /** As above, then the line lists, as {@code synth --lines} adds them after the species. */
    private static Scene library(DataContext data, String[] species, double[] abundances, double kelvin,
            Double density, double velocity, double resolvingPower, long seed,
            List<org.ritzwerk.data.LineList> lists) {
        Scene.Builder b = Scene.builder(PixelGrid.linear(640, 670, 1500)).medium(Medium.air())
                .instrument(Instrument.ofResolvingPower(resolvingPower)).naturalWidths(false).renderer(Renderer.AUTO)
                .temperature(kelvin).nMax(12).velocity(velocity).peakCounts(5000);
        if (density != null) {
            b.electronDensity(density);
        }
        for (int k = 0; k < species.length; k++) {
            Species s = Species.parse(species[k]);
            if (s.isHydrogenLike()) {
                b.hydrogenLike(s, HydrogenLikeModel.of(data.nucleus(s), Tier.QED), abundances[k]);
            }
        }
        for (int k = 0; k < species.length; k++) {
            Species s = Species.parse(species[k]);
            if (!s.isHydrogenLike() && isAlkali(data, s)) {
                b.alkali(data.alkaliAtom(s), abundances[k], data.nucleus(s));
            }
        }
        b.noise(3, seed);
        for (int k = 0; k < species.length; k++) {
            Species s = Species.parse(species[k]);
            if (!s.isHydrogenLike() && !isAlkali(data, s)) {
                b.levels(DataLines.levels(data, s), DataLines.ritzLines(data, s), abundances[k], data.nucleus(s));
            }
        }
        for (org.ritzwerk.data.LineList list : lists) {
            b.lineList(list, data::nucleus);
        }
        return b.build();
    }

    private static boolean isAlkali(DataContext data, Species s) {
        return data.alkaliSpecies().stream().anyMatch(a -> a.z() == s.z());
    }

    @Test
    void spectraAndTruthAreTheLibrarysBitForBit() {
        spectraAndTruthAreTheLibrarysBitForBit(LocalSpark.session());
    }

    /** The check of the test above in a session of any deployment ({@link SurveyClusterTest} runs it too). */
    static void spectraAndTruthAreTheLibrarysBitForBit(SparkSession spark) {
        List<Row> scenes = new ArrayList<>();
        scenes.add(RowFactory.create("s0", new String[] {"H I"}, null, 9000.0, null, 0.0, 8000.0, 1L));
        scenes.add(RowFactory.create("s1", new String[] {"H I", "D I"}, new double[] {1, 0.3}, 12000.0, 1e21, 15e3,
                20000.0, 2L));
        scenes.add(RowFactory.create("s2", new String[] {"H I", "Li I"}, new double[] {1, 1e-3}, 6000.0, null,
                -30e3, 5000.0, 3L));
        scenes.add(RowFactory.create("s3", new String[] {"H I"}, null, 9000.0, null, 0.0, 8000.0, 4L));
        scenes.add(RowFactory.create("dark", new String[] {"K I"}, null, 9000.0, null, 0.0, 8000.0, 5L));
        // He I from its level list (667.8 nm in the window), Saha-balanced with He II by the density.
        scenes.add(RowFactory.create("s4", new String[] {"He I", "H I", "He II"}, new double[] {1, 0.5, 1}, 20000.0,
                1e22, 5e3, 10000.0, 6L));
        // Sr I's level list has no A values: the job refuses the scene as the command does.
        scenes.add(RowFactory.create("sr", new String[] {"Sr I"}, null, 9000.0, null, 0.0, 8000.0, 7L));
        List<Row> out = SurveySynthesis.of(GRID).synthesise(spark.createDataFrame(scenes, Schemas.SCENES)
                .repartition(2)).collectAsList();
        assertEquals(scenes.size(), out.size());
        DataContext data = DataContext.discoverDefault();
        for (Row row : out) {
            Row in = scenes.stream().filter(s -> s.getString(0).equals(row.getString(0))).findFirst().orElseThrow();
            String[] species = (String[]) in.get(1);
            double[] abundances = new double[species.length];
            java.util.Arrays.fill(abundances, 1.0);
            if (!in.isNullAt(2)) {
                abundances = (double[]) in.get(2);
            }
            if (row.getString(0).equals("sr")) {
                org.ritzwerk.engine.synth.SceneException refused = org.junit.jupiter.api.Assertions.assertThrows(
                        org.ritzwerk.engine.synth.SceneException.class, () -> library(data, species, new double[] {1},
                                9000, null, 0, 8000, 7L).render(1));
                assertEquals("synth.no-rates", row.getAs("failure_code"));
                assertEquals(refused.getMessage(), row.getAs("failure"));
                continue;
            }
            if (row.getString(0).equals("dark")) {
                // K I has no line between 640 and 670 nm (levels up to n = 12): the job refuses the scene.
                org.ritzwerk.engine.synth.SceneException refused = org.junit.jupiter.api.Assertions.assertThrows(
                        org.ritzwerk.engine.synth.SceneException.class, () -> library(data, species, new double[] {1},
                                9000, null, 0, 8000, 5L).render(1));
                assertEquals(refused.code(), row.getAs("failure_code"));
                assertEquals(refused.getMessage(), row.getAs("failure"));
                assertTrue(row.isNullAt(7), "a refused scene has no dark_lines (null, as its other results)");
                continue;
            }
            Scene scene = library(data, species, abundances, in.getDouble(3),
                    in.isNullAt(4) ? null : in.getDouble(4), in.getDouble(5), in.getDouble(6), in.getLong(7));
            SyntheticSpectrum s = scene.render(1);
            // The scene's notes, as synth prints them (s1 and s4 give an electron density).
            assertEquals(scene.notes(), row.getList(6), row.getString(0));
            if (row.getString(0).equals("s1")) {
                assertFalse(scene.notes().isEmpty(), "a scene with an electron density has notes");
            }
            assertNull(row.getAs("failure"), row.getString(0));
            assertArrayEquals(s.counts(), toArray(row.getList(1)), row.getString(0));
            assertArrayEquals(s.expectedCounts(), toArray(row.getList(2)));
            assertEquals(darkLines(s.darkLines()), row.getStruct(7), row.getString(0));
            List<Row> lines = row.getList(3);
            assertEquals(s.lines().size(), lines.size());
            if (row.getString(0).equals("s4")) {
                assertTrue(lines.stream().anyMatch(l -> l.getString(0).startsWith("He I 1s3d 1D2")), "He I 667.8 nm");
            }
            for (int i = 0; i < lines.size(); i++) {
                Row line = lines.get(i);
                assertEquals(s.lines().label(i), line.getString(0));
                assertEquals(s.lines().position(i), line.getDouble(1));
                assertEquals(s.lines().photons(i), line.getDouble(2));
                assertEquals(s.lines().gaussianFwhm(i), line.getDouble(3));
                assertEquals(s.lines().lorentzFwhm(i), line.getDouble(4));
                assertEquals(s.lineCounts(i), line.getDouble(5));
                assertEquals(s.lineCountsInPixels(i), line.getDouble(6));
            }
        }
        // The seed is the row's: two scenes alike but for the seed differ in their noise only.
        Row s0 = out.stream().filter(r -> r.getString(0).equals("s0")).findFirst().orElseThrow();
        Row s3 = out.stream().filter(r -> r.getString(0).equals("s3")).findFirst().orElseThrow();
        assertEquals(s0.getList(2), s3.getList(2));
        assertFalse(s0.getList(1).equals(s3.getList(1)));
    }

    @Test
    void aMalformedSceneFailsTheJobNamingItsIdAndField() {
        SparkSession spark = LocalSpark.session();
        SurveySynthesis job = SurveySynthesis.of(GRID);
        List<Row> cold = List.of(RowFactory.create("cold", new String[] {"H I"}, null, -5.0, null, 0.0, 8000.0, 1L));
        String message = SurveyIdentificationTest.failure(() -> job.synthesise(
                spark.createDataFrame(cold, Schemas.SCENES)).count());
        assertEquals("row 'cold', field 'temperature_k': is -5.0; it must be above 0 K", message);
        List<Row> unknown = List.of(RowFactory.create("odd", new String[] {"Fe I"}, null, 5000.0, null, 0.0, 8000.0,
                1L));
        message = SurveyIdentificationTest.failure(() -> job.synthesise(
                spark.createDataFrame(unknown, Schemas.SCENES)).count());
        assertTrue(message.startsWith("row 'odd', field 'species': Fe I: the engine's lines cover one-electron ions"),
                message);
        List<Row> uneven = List.of(RowFactory.create("uneven", new String[] {"H I", "D I"}, new double[] {1}, 5000.0,
                null, 0.0, 8000.0, 1L));
        message = SurveyIdentificationTest.failure(() -> job.synthesise(
                spark.createDataFrame(uneven, Schemas.SCENES)).count());
        assertEquals("row 'uneven', field 'abundances': has 1 elements, but species has 2", message);
        // A species name that cannot be read is the row's, as an unsupported one is.
        List<Row> unreadable = List.of(RowFactory.create("odd2", new String[] {"HI"}, null, 5000.0, null, 0.0,
                8000.0, 1L));
        message = SurveyIdentificationTest.failure(() -> job.synthesise(
                spark.createDataFrame(unreadable, Schemas.SCENES)).count());
        assertTrue(message.startsWith("row 'odd2', field 'species': "), message);
        List<Row> blurred = List.of(RowFactory.create("blur", new String[] {"H I"}, null, 5000.0, null, 0.0, 0.001,
                1L));
        message = SurveyIdentificationTest.failure(() -> job.synthesise(
                spark.createDataFrame(blurred, Schemas.SCENES)).count());
        assertEquals("row 'blur', field 'resolving_power': is 0.001; it must be 1 to 1e9, as synth"
                + " --resolving-power takes it", message);
    }

    /**
     * Lamp spectra for training sets: the built-in Ne I and Cd I lamp lists drawn on an invented
     * spectrometer's dispersion (rising, and falling with the pixel), alone and beside H I, against
     * the library's scene built as {@code synth --lines lamp-ne-i --lines lamp-cd-i --dispersion
     * ...} composes it; a scene without species is a lamp scene only when line sets are given.
     */
    @Test
    void lampScenesOnADispersionGridAreTheLibrarysBitForBit(@org.junit.jupiter.api.io.TempDir java.nio.file.Path folder)
            throws java.io.IOException {
        lampScenesOnADispersionGridAreTheLibrarysBitForBit(LocalSpark.session(), folder);
    }

    /**
     * The check of the test above in a session of any deployment ({@link SurveyClusterTest} runs it
     * too); its invented line list goes to {@code folder}.
     */
    static void lampScenesOnADispersionGridAreTheLibrarysBitForBit(SparkSession spark, java.nio.file.Path folder)
            throws java.io.IOException {
        List<Row> scenes = List.of(
                RowFactory.create("lamp-1", new String[0], null, 400.0, null, 0.0, 4000.0, 1L),
                RowFactory.create("lamp-2", new String[0], null, 600.0, null, 0.0, 2500.0, 2L),
                RowFactory.create("lamp-h", new String[] {"H I"}, null, 9000.0, null, 0.0, 4000.0, 3L));
        DataContext data = DataContext.discoverDefault();
        for (double[] c : new double[][] {{580, 0.0735, -1e-6}, {726.3, -0.0735, 1e-6}}) {
            SynthesisParameters lamp = SynthesisParameters.dispersion(c, 2048).withMedium("air")
                    .withLineSets(List.of("lamp-ne-i", "lamp-cd-i")).withCounts(20_000, 4);
            List<Row> out = SurveySynthesis.of(lamp).synthesise(spark.createDataFrame(scenes, Schemas.SCENES)
                    .repartition(2)).collectAsList();
            assertEquals(scenes.size(), out.size());
            for (Row row : out) {
                Row in = scenes.stream().filter(r -> r.getString(0).equals(row.getString(0))).findFirst()
                        .orElseThrow();
                Scene.Builder b = Scene.builder(PixelGrid.dispersion(c, 2048)).medium(Medium.air())
                        .instrument(Instrument.ofResolvingPower(in.getDouble(6))).naturalWidths(false)
                        .renderer(Renderer.AUTO).temperature(in.getDouble(3)).nMax(30).velocity(0).peakCounts(20_000);
                if (((String[]) in.get(1)).length > 0) {
                    Species h = Species.parse("H I");
                    b.hydrogenLike(h, HydrogenLikeModel.of(data.nucleus(h), Tier.QED), 1.0);
                }
                b.noise(4, in.getLong(7));
                b.lineList(data.lineList("lamp-ne-i"), data::nucleus);
                b.lineList(data.lineList("lamp-cd-i"), data::nucleus);
                SyntheticSpectrum s = b.build().render(1);
                assertNull(row.getAs("failure"), row.getString(0));
                assertArrayEquals(s.counts(), toArray(row.getList(1)), row.getString(0));
                assertArrayEquals(s.expectedCounts(), toArray(row.getList(2)), row.getString(0));
                List<Row> lines = row.getList(3);
                assertEquals(s.lines().size(), lines.size());
                for (int i = 0; i < lines.size(); i++) {
                    assertEquals(s.lines().label(i), lines.get(i).getString(0));
                    assertEquals(s.lineCounts(i), lines.get(i).getDouble(5));
                }
                assertTrue(lines.stream().anyMatch(l -> l.getString(0).startsWith("Cd I 643.847")),
                        "the red Cd line is on the chip");
            }
        }
        // Without line sets a scene needs species; an unknown line set fails the job naming it.
        List<Row> none = List.of(RowFactory.create("bare", new String[0], null, 400.0, null, 0.0, 4000.0, 1L));
        assertEquals("row 'bare', field 'species': is empty", SurveyIdentificationTest.failure(() -> SurveySynthesis
                .of(GRID).synthesise(spark.createDataFrame(none, Schemas.SCENES)).count()));
        String unknown = SurveyIdentificationTest.failure(() -> SurveySynthesis.of(GRID.withLineSets(
                List.of("lamp-unobtainium"))).synthesise(spark.createDataFrame(none, Schemas.SCENES)).count());
        assertTrue(unknown.contains("lineSets lamp-unobtainium: no data set 'lamp-unobtainium'"), unknown);
        // A list of an element without nuclear data (osmium: no mass for the Doppler width) fails the
        // setup naming the list, as synth --lines refuses it.
        java.nio.file.Path osmium = java.nio.file.Files.createTempFile(folder, "osmium", ".csv");
        java.nio.file.Files.writeString(osmium, "# ritzwerk-lines 1\n# id: test-osmium\n# title: an invented line\n"
                + "# source: invented for a test\n# provenance: computed\n# version: 1\n# position-unit: nm\n"
                + "# medium: air\nspecies,position,intensity\nOs I,650.0,100\n");
        String noMass = SurveyIdentificationTest.failure(() -> SurveySynthesis.of(GRID.withLineSets(
                List.of(osmium.toString()))).synthesise(spark.createDataFrame(none, Schemas.SCENES)).count());
        assertTrue(noMass.contains("lineSets " + osmium + ": "), noMass);
    }

    /**
     * Settings that do nothing for a scene are said in its notes, not dropped without a word: the
     * command refuses them (synth --lines lamp-ne-i --model dirac: "has no effect without a
     * one-electron ion"), but one table may mix lamp scenes with hydrogen scenes, so each lamp
     * row names the level model, the highest n, natural widths and components it ignored, and the
     * hydrogen row, which uses them, names none. The spectra are unchanged by the notes.
     */
    @Test
    void settingsWithoutEffectOnAScenesAreNamedInItsNotes() {
        SparkSession spark = LocalSpark.session();
        List<Row> scenes = List.of(
                RowFactory.create("lamp", new String[0], null, 400.0, null, 0.0, 4000.0, 1L),
                RowFactory.create("hydrogen", new String[] {"H I"}, null, 9000.0, null, 0.0, 4000.0, 2L));
        SynthesisParameters base = SynthesisParameters.linear(640, 670, 600).withMedium("air")
                .withLineSets(List.of("lamp-ne-i"));
        SynthesisParameters odd = base.withModel("dirac", 12).withShapes(0, true, true);
        List<Row> plain = SurveySynthesis.of(base).synthesise(spark.createDataFrame(scenes, Schemas.SCENES))
                .orderBy("id").collectAsList();
        List<Row> out = SurveySynthesis.of(odd).synthesise(spark.createDataFrame(scenes, Schemas.SCENES))
                .orderBy("id").collectAsList();
        List<String> hydrogen = out.get(0).getList(6);
        List<String> lamp = out.get(1).getList(6);
        assertEquals(List.of("the level model dirac has no effect on this scene: it holds no one-electron ion"
                + " (alkali atoms, level lists and line lists bring their own levels)",
                "the highest n (12) has no effect on this scene: it names no species (line lists bring their own"
                        + " lines)",
                "natural widths have no effect on this scene: they are computed for one-electron ions' lines, and it"
                        + " holds none",
                "drawing fine-structure components has no effect on this scene: it holds no one-electron ion"), lamp);
        assertTrue(hydrogen.stream().noneMatch(n -> n.contains("no effect")), hydrogen.toString());
        assertTrue(plain.get(1).getList(6).isEmpty(), "defaults say nothing");
        assertEquals(plain.get(1).getList(1), out.get(1).getList(1), "the lamp's counts are the same");
    }

    /**
     * The command's other scene settings on Spark: a logarithmic grid ({@code --grid log}), a
     * collisional width, natural widths and fine-structure components, and a continuum (blackbody
     * at each scene's temperature, then at a fixed one, then flat), against the library's scene
     * built as {@code synth} composes it, bit for bit.
     */
    @Test
    void logGridsLineShapesAndContinuaAreTheLibrarysBitForBit() {
        SparkSession spark = LocalSpark.session();
        List<Row> scenes = List.of(
                RowFactory.create("hot", new String[] {"H I", "He II"}, null, 20000.0, 1e21, 0.0, 30000.0, 1L),
                RowFactory.create("warm", new String[] {"H I"}, null, 8000.0, null, 12e3, 20000.0, 2L));
        DataContext data = DataContext.discoverDefault();
        SynthesisParameters base = SynthesisParameters.logarithmic(640, 670, 600).withMedium("air")
                .withModel("qed", 12).withCounts(5000, 3).withShapes(0.002, true, true);
        for (SynthesisParameters p : List.of(base.withContinuum("blackbody", Double.NaN, 300),
                base.withContinuum("blackbody", 3000, 50), base.withContinuum("flat", Double.NaN, 80))) {
            List<Row> out = SurveySynthesis.of(p).synthesise(spark.createDataFrame(scenes, Schemas.SCENES))
                    .collectAsList();
            for (Row row : out) {
                Row in = scenes.stream().filter(r -> r.getString(0).equals(row.getString(0))).findFirst()
                        .orElseThrow();
                double kelvin = in.getDouble(3);
                Scene.Builder b = Scene.builder(PixelGrid.logarithmic(640, 670, 600)).medium(Medium.air())
                        .instrument(Instrument.ofResolvingPower(in.getDouble(6))).naturalWidths(true).components(true)
                        .renderer(Renderer.AUTO).temperature(kelvin).nMax(12).velocity(in.getDouble(5))
                        .collisionalFwhm(0.002).peakCounts(5000);
                if (!in.isNullAt(4)) {
                    b.electronDensity(in.getDouble(4));
                }
                for (String name : (String[]) in.get(1)) {
                    Species s = Species.parse(name);
                    b.hydrogenLike(s, HydrogenLikeModel.of(data.nucleus(s), Tier.QED), 1.0);
                }
                double t = Double.isNaN(p.background().temperatureK()) ? kelvin : p.background().temperatureK();
                java.util.function.DoubleUnaryOperator density = p.background().kind().equals("flat") ? nm -> 1
                        : nm -> org.ritzwerk.engine.synth.Continuum.planckPhotonsPerWavelength(
                                Medium.air().toVacuum(nm * 1e-9), t);
                b.continuum(density, p.background().counts());
                b.noise(3, in.getLong(7));
                SyntheticSpectrum s = b.build().render(1);
                String what = row.getString(0) + " " + p.background();
                assertNull(row.getAs("failure"), what);
                assertArrayEquals(s.counts(), toArray(row.getList(1)), what);
                assertArrayEquals(s.expectedCounts(), toArray(row.getList(2)), what);
                List<Row> lines = row.getList(3);
                assertEquals(s.lines().size(), lines.size(), what);
                for (int i = 0; i < lines.size(); i++) {
                    assertEquals(s.lines().label(i), lines.get(i).getString(0));
                    assertEquals(s.lines().lorentzFwhm(i), lines.get(i).getDouble(4));
                }
            }
        }
    }

    /**
     * A continuum of the user's own ({@code synth --continuum-file}): an invented ramp read once per
     * partition, the same spectrum as the library's with the same file; a missing file fails when
     * the operation is made, naming it.
     */
    @Test
    void aContinuumFileIsTheLibrarysBitForBit(@org.junit.jupiter.api.io.TempDir java.nio.file.Path folder)
            throws java.io.IOException {
        SparkSession spark = LocalSpark.session();
        java.nio.file.Path ramp = folder.resolve("ramp.csv");
        java.nio.file.Files.writeString(ramp, "# an invented ramp\nwavelength_nm,density\n630,1\n650,3\n680,2\n");
        List<Row> scenes = List.of(RowFactory.create("ramp", new String[] {"H I"}, null, 9000.0, null, 0.0, 8000.0,
                1L));
        Row row = SurveySynthesis.of(GRID.withContinuumFile(ramp.toString(), 250)).synthesise(spark.createDataFrame(
                scenes, Schemas.SCENES)).collectAsList().get(0);
        DataContext data = DataContext.discoverDefault();
        PixelGrid grid = PixelGrid.linear(640, 670, 1500);
        Species h = Species.parse("H I");
        SyntheticSpectrum s = Scene.builder(grid).medium(Medium.air()).instrument(Instrument.ofResolvingPower(8000))
                .naturalWidths(false).renderer(Renderer.AUTO).temperature(9000).nMax(12).velocity(0)
                .peakCounts(5000).hydrogenLike(h, HydrogenLikeModel.of(data.nucleus(h), Tier.QED), 1.0)
                .continuum(org.ritzwerk.refdata.ContinuumFiles.read(ramp, grid.lowest(), grid.highest()), 250)
                .noise(3, 1).build().render(1);
        assertNull(row.getAs("failure"));
        assertArrayEquals(s.counts(), toArray(row.getList(1)));
        assertArrayEquals(s.expectedCounts(), toArray(row.getList(2)));
        String missing = SurveyIdentificationTest.failure(() -> SurveySynthesis.of(GRID.withContinuumFile(
                folder.resolve("nosuch.csv").toString(), 250)));
        assertTrue(missing.startsWith("continuum file " + folder.resolve("nosuch.csv")), missing);
    }

    /** @return the library's dark lines as a row of {@link Schemas#DARK_LINES}, counted by the library itself */
    private static Row darkLines(org.ritzwerk.engine.synth.DarkLines dark) {
        return RowFactory.create(dark.onGrid(), dark.size(),
                dark.count(org.ritzwerk.engine.synth.DarkLines.Cause.ZERO_INTENSITY),
                dark.count(org.ritzwerk.engine.synth.DarkLines.Cause.INTENSITY_UNDERFLOW),
                dark.count(org.ritzwerk.engine.synth.DarkLines.Cause.POPULATION_UNDERFLOW));
    }

    /**
     * The lines on the grid that carry no light, counted by cause in {@code dark_lines}, are the
     * library's own {@code SyntheticSpectrum.darkLines()} for the same scene. An invented line list
     * gives each cause: a line of intensity 0 ({@code ZERO_INTENSITY}); a line of 1e-300 beside one
     * of 1e300, whose counts once the brightest pixel is scaled to 5,000 are about 1e-300 * 5e3 /
     * 1e300 = 5e-597, below the smallest positive double, about 4.9e-324 ({@code
     * INTENSITY_UNDERFLOW}, common practice: IEEE 754), or whose rate becomes 0 beside H I's when
     * the list is scaled to the ions' ({@code ZERO_INTENSITY}); and He I at 300 K, whose 1s3d 1D2
     * level 23.07 eV up (from memory; the built-in level list gives it) has the Boltzmann factor
     * exp(-23.07 eV / kT) = exp(-892) with kT = 0.02585 eV, far below the smallest double
     * (exp(-744.4)), while H-alpha's upper level at 12.09 eV gives exp(-468), about 1e-203, still
     * a double ({@code POPULATION_UNDERFLOW}). A scene the engine refuses keeps dark_lines null.
     */
    @Test
    void darkLinesAreTheLibrarysCountsByCause(@org.junit.jupiter.api.io.TempDir java.nio.file.Path folder)
            throws java.io.IOException {
        SparkSession spark = LocalSpark.session();
        java.nio.file.Path file = folder.resolve("dark.csv");
        java.nio.file.Files.writeString(file, "# ritzwerk-lines 1\n# id: test-dark\n# title: invented lines\n"
                + "# source: invented for a test\n# provenance: computed\n# version: 1\n# position-unit: nm\n"
                + "# medium: air\nspecies,position,intensity\nNe I,645.0,1e300\nNe I,650.0,0\nNe I,662.0,1e-300\n");
        SynthesisParameters parameters = GRID.withLineSets(List.of(file.toString()));
        List<Row> scenes = List.of(
                RowFactory.create("lamp", new String[0], null, 400.0, null, 0.0, 8000.0, 1L),
                RowFactory.create("warm", new String[] {"H I"}, null, 9000.0, null, 0.0, 8000.0, 2L),
                RowFactory.create("cool", new String[] {"H I", "He I"}, null, 300.0, null, 0.0, 8000.0, 3L),
                RowFactory.create("cold", new String[] {"H I"}, null, 100.0, null, 0.0, 8000.0, 4L));
        List<Row> out = SurveySynthesis.of(parameters).synthesise(spark.createDataFrame(scenes, Schemas.SCENES)
                .repartition(2)).collectAsList();
        assertEquals(Schemas.DARK_LINES, out.get(0).getStruct(7).schema(), "the documented struct");
        DataContext data = DataContext.discoverDefault();
        List<org.ritzwerk.data.LineList> lists = List.of(data.lineList(file.toString()));
        java.util.Map<String, Row> found = new java.util.HashMap<>();
        for (Row row : out) {
            Row in = scenes.stream().filter(r -> r.getString(0).equals(row.getString(0))).findFirst().orElseThrow();
            String[] species = (String[]) in.get(1);
            double[] abundances = new double[species.length];
            java.util.Arrays.fill(abundances, 1.0);
            Scene scene = library(data, species, abundances, in.getDouble(3), null, 0, 8000, in.getLong(7), lists);
            String id = row.getString(0);
            SyntheticSpectrum s;
            try {
                s = scene.render(1);
            } catch (org.ritzwerk.engine.synth.SceneException e) {
                assertEquals(e.code(), row.getAs("failure_code"), id);
                assertTrue(row.isNullAt(7), id + ": a refused scene keeps dark_lines null");
                found.put(id, null);
                continue;
            }
            assertNull(row.getAs("failure"), id);
            assertArrayEquals(s.counts(), toArray(row.getList(1)), id);
            Row dark = row.getStruct(7);
            assertEquals(darkLines(s.darkLines()), dark, id);
            assertEquals(dark.getInt(1), dark.getInt(2) + dark.getInt(3) + dark.getInt(4), id + ": causes sum to dark");
            found.put(id, dark);
        }
        // Each cause is met (so the comparison above is not of zeros only), as the Javadoc works out.
        assertEquals(RowFactory.create(3, 2, 1, 1, 0), found.get("lamp"), "lamp: 650 nm at 0, 662 nm underflows");
        assertEquals(2, found.get("warm").getInt(2), "warm: both faint list lines scaled to 0 beside H I");
        assertTrue(found.get("cool").getInt(4) > 0, "cool: He I's populations underflow at 300 K " + found);
        assertEquals(0, found.get("warm").getInt(4), "warm: H-alpha is lit");
        // A pipeline's filter on the column.
        java.util.Set<String> withDark = found.entrySet().stream().filter(e -> e.getValue() != null
                && e.getValue().getInt(1) > 0).map(java.util.Map.Entry::getKey).collect(java.util.stream.Collectors
                .toSet());
        assertTrue(withDark.containsAll(List.of("lamp", "warm", "cool")), withDark.toString());
        assertEquals(withDark, SurveySynthesis.of(parameters).synthesise(
                spark.createDataFrame(scenes, Schemas.SCENES)).where("dark_lines.dark > 0").select("id")
                .collectAsList().stream().map(r -> r.getString(0)).collect(java.util.stream.Collectors.toSet()));
    }

    /** One column of {@link Schemas#DARK_LINES} per cause the library knows, named after it (common practice). */
    @Test
    void darkLinesHaveOneCountPerCause() {
        List<String> names = new ArrayList<>(List.of("on_grid", "dark"));
        for (org.ritzwerk.engine.synth.DarkLines.Cause cause : org.ritzwerk.engine.synth.DarkLines.Cause.values()) {
            names.add(cause.name().toLowerCase(java.util.Locale.ROOT));
        }
        assertEquals(names, List.of(Schemas.DARK_LINES.fieldNames()));
        assertEquals("dark_lines", Schemas.SPECTRA.fields()[Schemas.SPECTRA.size() - 1].name(),
                "appended, so the earlier columns keep their places");
    }

    private static double[] toArray(List<Double> list) {
        double[] values = new double[list.size()];
        for (int i = 0; i < values.length; i++) {
            values[i] = list.get(i);
        }
        return values;
    }
}
