package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.synth.Continuum;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.SpectrumFiles;

/**
 * The README's scene (an ion, an alkali atom, a lamp line list, a continuum and noise) built with
 * the library gives the counts {@code synth} writes for the same options, bit for bit: the
 * command only parses, calls the scene job and writes.
 */
class SynthesisUserGuideTest {

    @Test
    void theLibrarySceneIsWhatSynthRenders(@TempDir Path dir) throws IOException {
        Path out = dir.resolve("scene.csv");
        CliTest.Run run = CliTest.run("synth", "--species", "H I,Rb-87 I", "--lines", "lamp-ne-i", "--from",
                "600 nm air", "--to", "800 nm air", "--medium", "air", "--pixels", "8000", "--temperature", "6000",
                "--abundance", "Rb=1e-3", "--resolving-power", "10000", "--continuum", "blackbody",
                "--continuum-counts", "50", "--read-noise", "3", "--seed", "7", "--threads", "2", "--out",
                out.toString());
        assertEquals(0, run.code(), run.err());

        DataContext data = DataContext.builtIn();
        Medium air = Medium.air();
        Scene scene = Scene.builder(PixelGrid.linear(600, 800, 8000))
                .medium(air).instrument(Instrument.ofResolvingPower(10_000)).naturalWidths(false)
                .temperature(6000)
                .hydrogenLike(Species.parse("H I"), HydrogenLikeModel.of(data.nucleus(Species.parse("H I")), Tier.QED), 1)
                .alkali(data.alkaliAtom(Species.parse("Rb-87 I")), 1e-3, data.nucleus(Species.parse("Rb-87 I")))
                .lineList(data.lampLines(Species.parse("Ne I")), data::nucleus)
                .continuum(nm -> Continuum.planckPhotonsPerWavelength(air.toVacuum(nm * 1e-9), 6000), 50)
                .noise(3.0, 7L)
                .build();
        SyntheticSpectrum spectrum = scene.render(2);

        double[] written = SpectrumFiles.read(out).counts();
        assertEquals(spectrum.counts().length, written.length);
        int differ = 0;
        for (int p = 0; p < written.length; p++) {
            differ += Double.compare(spectrum.counts()[p], written[p]) == 0 ? 0 : 1;
        }
        assertEquals(0, differ, "pixels whose counts differ between the library and synth");
        assertTrue(Files.readString(out).contains("# species: H I,Rb-87 I"), "the scene is described in the file");
    }
}
