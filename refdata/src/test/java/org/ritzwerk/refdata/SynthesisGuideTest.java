package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.AlkaliLines;
import org.ritzwerk.engine.synth.Continuum;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;

/**
 * The README's scene example, compiled and run: an ion, an alkali atom and a lamp line list with
 * a continuum and noise. Checks: the alkali lines follow Boltzmann's law (the D2/D1 photon ratio
 * is (4 A_D2 / 2 A_D1) exp(-(E_D2 - E_D1) / kT), common practice), and the lamp list's strongest
 * line gets the photon rate of the strongest ion line.
 */
class SynthesisGuideTest {

    @Test
    void aSceneWithAnIonAnAlkaliAtomALampListAContinuumAndNoise() {
        DataContext data = DataContext.builtIn();
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(data.nucleus(Species.parse("H I")), Tier.DIRAC);
        AlkaliAtom rubidium = data.alkaliAtom(Species.parse("Rb-87 I"));
        LineList neon = data.lampLines(Species.parse("Ne I"));

        // --- README: scene with an ion, an alkali atom, a lamp list, a continuum and noise ---
        Scene scene = Scene.builder(PixelGrid.linear(600, 800, 8000))
                .hydrogenLike(Species.parse("H I"), hydrogen, 1)
                .alkali(rubidium, 1e-3, data.nucleus(Species.parse("Rb-87 I")))  // Boltzmann over its levels
                .lineList(neon, data::nucleus)                     // relative intensities, scaled to the ions
                .temperature(6000).medium(Medium.air()).instrument(Instrument.ofResolvingPower(10_000))
                .continuum(nm -> Continuum.planckPhotonsPerWavelength(nm * 1e-9, 6000), 50)
                .noise(3.0, 7L)
                .build();
        SyntheticSpectrum spectrum = scene.render(2);
        // --- end ---

        Scene.Lines lines = scene.lines();
        double d2 = Double.NaN;
        double d1 = Double.NaN;
        double strongestIon = 0;
        double strongestNeon = 0;
        for (int i = 0; i < lines.size(); i++) {
            String label = lines.label(i);
            if (label.equals("Rb-87 I 5p 2P3/2 - 5s 2S1/2")) {
                d2 = lines.photons(i);
            } else if (label.equals("Rb-87 I 5p 2P1/2 - 5s 2S1/2")) {
                d1 = lines.photons(i);
            } else if (label.startsWith("Ne I ")) {
                strongestNeon = Math.max(strongestNeon, lines.photons(i));
            } else if (!label.startsWith("Rb")) {
                strongestIon = Math.max(strongestIon, lines.photons(i));
            }
        }
        double kT = PhysicalConstants.K * 6000;
        double hcPerCm = PhysicalConstants.H * PhysicalConstants.C * 100;
        State ground = State.parse("5s1/2");
        State p32 = State.parse("5p3/2");
        State p12 = State.parse("5p1/2");
        double expected = 4 * rubidium.einsteinA(p32, ground) / (2 * rubidium.einsteinA(p12, ground))
                * Math.exp(-(rubidium.energyPerCm(p32) - rubidium.energyPerCm(p12)) * hcPerCm / kT);
        assertEquals(expected, d2 / d1, 1e-12 * expected);
        assertTrue(AlkaliLines.isElectricDipole(p32, ground));
        assertEquals(strongestIon, strongestNeon, 1e-12 * strongestIon, "lamp list scaled to the ions");
        assertEquals(8000, spectrum.counts().length);
    }

    @Test
    void aSpectrumAndItsTruthAreWrittenSafelyAndReadBack(@TempDir Path folder) throws IOException {
        DataContext data = DataContext.builtIn();
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(data.nucleus(Species.parse("H I")), Tier.DIRAC);
        SyntheticSpectrum spectrum = Scene.builder(PixelGrid.linear(640, 670, 600))
                .hydrogenLike(Species.parse("H I"), hydrogen, 1).temperature(8000).medium(Medium.air())
                .instrument(Instrument.ofResolvingPower(5000)).noise(2.0, 3L).build().render(1);
        Path spectrumFile = folder.resolve("scene.csv");
        Path truthFile = folder.resolve("scene-lines.csv");

        // --- README: write a synthetic spectrum and its truth (temporary file, renamed when complete), read back ---
        Map<String, Object> description = Map.of("species", "H I", "temperature-k", 8000.0);
        OutputFiles.writeText(spectrumFile,
                out -> SyntheticSpectrumFiles.writeCsv(spectrum, "linear", description, out));  // medium: the scene's
        OutputFiles.writeText(truthFile, out -> SpectrumLineFiles.writeCsv(spectrum, out));
        SpectrumFiles.Spectrum back = SpectrumFiles.read(spectrumFile);          // counts, expected counts, header
        SpectrumLineFiles.SpectrumLines truth = SpectrumLineFiles.read(truthFile);  // the lines that went in
        // --- end ---

        assertTrue(Arrays.equals(spectrum.counts(), back.counts()), "bit for bit");
        assertTrue(Arrays.equals(spectrum.expectedCounts(), back.expectedCounts()), "bit for bit");
        assertEquals("8000.0", back.header().get("temperature-k"));
        assertEquals(Medium.air(), truth.medium());
        assertTrue(truth.labels().contains("H I Balmer alpha"), truth.labels().toString());
    }
    /**
     * The writers label the axis with the medium the scene was built in (the spectrum carries it)
     * and check the grid kind against the pixels: an air label on vacuum wavelengths, or "linear"
     * on a logarithmic grid, can no longer be written. H-alpha: 656.46 nm in vacuum, 656.28 nm in
     * standard air (from memory; the 0.18 nm between them is what the checks tell apart).
     */
    @Test
    void theWritersTakeTheMediumFromTheSceneAndRefuseAGridKindThatDoesNotFit() throws IOException {
        DataContext data = DataContext.builtIn();
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(data.nucleus(Species.parse("H I")), Tier.DIRAC);
        Scene.Builder builder = Scene.builder(PixelGrid.logarithmic(650, 660, 100))
                .hydrogenLike(Species.parse("H I"), hydrogen, 1).temperature(8000);
        SyntheticSpectrum vacuum = builder.build().render(1);              // medium not set: vacuum
        SyntheticSpectrum air = builder.medium(Medium.air()).build().render(1);
        for (SyntheticSpectrum s : new SyntheticSpectrum[] {vacuum, air}) {
            StringWriter truth = new StringWriter();
            SpectrumLineFiles.writeCsv(s, truth);
            SpectrumLineFiles.SpectrumLines back = SpectrumLineFiles.read(truth.toString(), "t.csv");
            assertEquals(s.medium(), back.medium());
            int alpha = back.labels().indexOf("H I Balmer alpha");
            assertEquals(s == vacuum ? 656.46 : 656.28, back.wavelengths()[alpha], 0.01, truth.toString());
            StringWriter csv = new StringWriter();
            SyntheticSpectrumFiles.writeCsv(s, "log", Map.of(), csv);
            assertTrue(csv.toString().startsWith("# ritzwerk-spectrum 1\n# axis: wavelength nm "
                    + (s == vacuum ? "vacuum" : "air") + " (pixel centres; log pixels from 650.0 to 660.0)\n"),
                    csv.toString());
        }
        assertEquals(Medium.vacuum(), vacuum.medium());
        StringWriter out = new StringWriter();
        IllegalArgumentException linear = assertThrows(IllegalArgumentException.class,
                () -> SyntheticSpectrumFiles.writeCsv(vacuum, "linear", Map.of(), out));
        assertTrue(linear.getMessage().startsWith("grid kind 'linear' does not describe the spectrum's pixels:"
                + " edge 1 is at ") && linear.getMessage().contains("(the grid is log)"), linear.getMessage());
        assertThrows(IllegalArgumentException.class, () -> SyntheticSpectrumFiles.writeJson(vacuum,
                "dispersion 650,0.1", Map.of(), java.util.List.of(), out));
        assertEquals("", out.toString(), "nothing written");
        // A linear grid is not log either; a dispersion grid is named by its coefficients.
        SyntheticSpectrum linearGrid = Scene.builder(PixelGrid.linear(650, 660, 100))
                .hydrogenLike(Species.parse("H I"), hydrogen, 1).temperature(8000).build().render(1);
        assertTrue(assertThrows(IllegalArgumentException.class, () -> SyntheticSpectrumFiles.writeCsv(linearGrid,
                "log", Map.of(), out)).getMessage().contains("(the grid is linear)"));
        SyntheticSpectrumFiles.checkKind(linearGrid.grid(), "linear");
        SyntheticSpectrumFiles.checkKind(PixelGrid.dispersion(new double[] {540, 0.06, -2e-6}, 2048),
                "dispersion 540,0.06,-2e-6");
        assertThrows(IllegalArgumentException.class, () -> SyntheticSpectrumFiles.checkKind(
                PixelGrid.dispersion(new double[] {540, 0.06, -2e-6}, 2048), "dispersion 540,0.06,-2.1e-6"));
    }

    @Test
    void aBigLineListReadAsColumnsAndRenderedThroughTheFourierDomain(@TempDir Path folder) throws IOException {
        Path file = folder.resolve("big-list.csv");
        StringBuilder text = new StringBuilder("# ritzwerk-lines 1\n# id: big-list\n# title: t\n# source: s\n"
                + "# provenance: computed\n# version: 1\n# position-unit: nm\n# medium: air\n"
                + "species,position,intensity\n");
        java.util.SplittableRandom random = new java.util.SplittableRandom(5L);
        for (int i = 0; i < 50_000; i++) {
            text.append(i % 2 == 0 ? "Fe I," : "Fe II,").append(600 + 100 * random.nextDouble()).append(',')
                    .append(random.nextDouble(0, 100)).append('\n');
        }
        java.nio.file.Files.writeString(file, text);
        DataContext data = DataContext.builtIn();

        // --- README: a line list of millions of lines, streamed from its file into columns and rendered ---
        org.ritzwerk.engine.synth.LineColumns lines = LineListFiles.readColumns(file,   // 18 bytes a line
                org.ritzwerk.data.DataKind.LINES);
        SyntheticSpectrum spectrum = Scene.builder(PixelGrid.linear(600, 700, 200_000))
                .lineColumns(lines, data::nucleus)                                // as lineList(LineList, ...)
                .temperature(5000).medium(Medium.air()).instrument(Instrument.ofResolvingPower(50_000))
                .renderer(org.ritzwerk.engine.synth.Renderer.FAST)
                .build().render(1);
        // --- end ---

        assertEquals(50_000, lines.size());
        assertEquals(50_000, spectrum.lines().size());
        assertEquals(200_000, spectrum.counts().length);
        assertTrue(spectrum.lines().label(0).startsWith("Fe I 6"), spectrum.lines().label(0));
    }
}
