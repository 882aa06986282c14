package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * He I as a first-class species: its Ritz lines with A values (lines-he-i) in {@code lines},
 * {@code synth} and {@code identify}, end to end.
 */
class HeliumCommandsTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    @Test
    void linesGiveAValuesUncertaintiesAndLeaveIntercombinationLinesOutUnlessAsked() {
        CliTest.Run run = CliTest.run("lines", "--species", "He I", "--from", "585 nm air", "--to", "590 nm air",
                "--medium", "air", "--format", "json");
        assertEquals(0, run.code(), run.err());
        List<String> names = new ArrayList<>();
        for (String line : run.out().strip().split("\\R")) {
            JsonNode row = JSON.readTree(line);
            names.add(row.get("line").asString());
            // every line of the level list has a Ritz uncertainty (levels +-5e-5 cm-1: about 2.4e-6 nm here)
            assertEquals(2.4e-6, row.get("uncertainty_nm").asDouble(), 0.2e-6, line);
            assertFalse(row.get("einstein_a_per_s").isNull(), line);
        }
        // 2p 3P - 3d 3D, six components (587.6 nm); no 1s2p 3P - 1s3d 1D2 intercombination line
        assertEquals(6, names.size(), names.toString());
        assertTrue(names.stream().noneMatch(n -> n.endsWith("1D2")), names.toString());
        CliTest.Run all = CliTest.run("lines", "--species", "He I", "--from", "585 nm air", "--to", "590 nm air",
                "--medium", "air", "--intercombination", "--format", "csv");
        assertEquals(0, all.code(), all.err());
        assertTrue(all.out().contains("\"1s3d 1D2 - 1s2p 3P2\""), all.out());
        // the option is refused where no level list is asked for
        CliTest.Run refused = CliTest.run("lines", "--species", "H I", "--from", "400 nm", "--to", "700 nm",
                "--intercombination");
        assertEquals(2, refused.code());
        assertTrue(refused.err().contains("--intercombination"), refused.err());
        // ions alone keep their columns (no uncertainty column)
        CliTest.Run ions = CliTest.run("lines", "--species", "H I", "--from", "650 nm", "--to", "660 nm",
                "--format", "csv");
        assertFalse(ions.out().contains("uncertainty_nm"), ions.out());
    }

    /**
     * A helium lamp calibrated with the Ritz lines of the level list ({@code --lamp "He I"}: no
     * lamp set, so the lines of levels-he-i ranked by g_u A, fine-structure components merged at
     * the default resolving power): the solution recovers the invented dispersion 380 + 0.1 p -
     * 2e-6 p^2 nm (air) of the synthetic exposure to 0.15 pixel and three stated standard
     * uncertainties between its first and last fitted line (RMS 0.07 pixel), with the triplet multiplets (587.6, 706.5, 388.9 nm) among its pairs. The level list
     * holds far-ultraviolet and far-infrared lines too, which an air solution cannot take: they
     * are left out with a note, not refused, also when the list is given as {@code --lines}.
     */
    @Test
    void aHeliumLampIsCalibratedWithTheLevelListsRitzLines(@TempDir Path dir) throws IOException {
        Path spectrum = dir.resolve("he-lamp.csv");
        CliTest.Run synth = CliTest.run("synth", "--species", "He I", "--dispersion", "380,0.1,-2e-6", "--pixels",
                "4096", "--medium", "air", "--temperature", "30000", "--resolving-power", "3000", "--read-noise", "3",
                "--seed", "4", "--out", spectrum.toString());
        assertEquals(0, synth.code(), synth.err());
        Path calibration = dir.resolve("calibration.json");
        CliTest.Run run = CliTest.run("calibrate", spectrum.toString(), "--lamp", "He I", "--out",
                calibration.toString());
        assertEquals(0, run.code(), run.err());
        assertTrue(run.err().matches("(?s)note: He I: no lamp set; using the \\d+ Ritz lines of \\[levels-he-i\\] "
                + "ranked by g_u A .* left out\\), as \\d+ lines at resolving power 5000\\R"), run.err());
        assertTrue(run.out().contains("He I 1s3d 3D3 - 1s2p 3P2 (+5 blended)"), run.out());
        assertTrue(run.out().contains("He I 1s3s 3S1 - 1s2p 3P2 (+2 blended)"), run.out());
        // the level list's lines have no strength class: --min-strength keeps them all, and says so
        // (it ran silently with no effect)
        CliTest.Run strong = CliTest.run("calibrate", spectrum.toString(), "--lamp", "He I", "--min-strength",
                "strong");
        assertEquals(0, strong.code(), strong.err());
        assertTrue(strong.err().matches("(?s).*note: --min-strength strong keeps \\d+ lines of \\d+ whatever their"
                + " strength: they have no strength class .*, so the option leaves the lamp as it was\\R.*"),
                strong.err());
        CliTest.Run list = CliTest.run("calibrate", spectrum.toString(), "--lines", "lines-he-i");
        assertEquals(0, list.code(), list.err());
        assertTrue(list.err().matches("(?s)note: \\d+ lines of \\[lines-he-i\\] lie outside the range of the air "
                + "model.*"), list.err());
        org.ritzwerk.engine.calibrate.DispersionSolution solution =
                org.ritzwerk.refdata.CalibrationFiles.read(calibration).solution();
        org.ritzwerk.data.CalibrationRecord record = org.ritzwerk.refdata.CalibrationFiles.readRecord(calibration);
        double first = Double.POSITIVE_INFINITY;
        double last = Double.NEGATIVE_INFINITY;
        for (org.ritzwerk.data.CalibrationRecord.FittedLine line : record.lines()) {
            first = Math.min(first, line.pixel());
            last = Math.max(last, line.pixel());
        }
        assertTrue(record.lines().size() >= 8 && last - first > 3000, record.lines().size() + " lines, pixels "
                + first + " to " + last);
        for (int s = 0; s <= 100; s++) {
            double p = first + (last - first) * s / 100;
            double truth = 380 + 0.1 * p - 2e-6 * p * p;
            double perPixel = 0.1 - 4e-6 * p;
            // Within 0.15 pixel and three of the solution's own standard uncertainties: the weak
            // lines at the blue end (S/N 10 to 20) are off by up to 2.5 of their centroid
            // uncertainties here, which bends the quadratic by about 0.1 pixel near 706 nm.
            double error = Math.abs(solution.wavelengthAt(p) - truth);
            assertTrue(error < 0.15 * perPixel, "pixel " + p + ": " + error / perPixel + " px");
            assertTrue(error < 3 * solution.wavelengthSigmaAt(p), "pixel " + p + ": " + error / solution
                    .wavelengthSigmaAt(p) + " stated standard uncertainties");
        }
    }

    @Test
    void heliumIsSynthesisedAndItsLinesIdentified(@TempDir Path dir) throws IOException {
        Path truth = dir.resolve("truth.csv");
        CliTest.Run synth = CliTest.run("synth", "--species", "He I,H I", "--from", "380 nm", "--to", "700 nm",
                "--temperature", "30000", "--no-noise", "--truth", truth.toString(), "--out",
                dir.resolve("spectrum.csv").toString());
        assertEquals(0, synth.code(), synth.err());
        // The header names where each kind of species' levels come from.
        assertTrue(Files.readAllLines(dir.resolve("spectrum.csv")).contains(
                "# model: qed levels of the one-electron ions, n <= 30; the level list of He I"));
        double strongestHe = 0;
        String strongestLabel = null;
        List<String[]> rows = new ArrayList<>();
        for (String row : Files.readAllLines(truth)) {
            if (row.startsWith("#") || row.startsWith("wavelength_nm")) {
                continue;
            }
            String[] c = row.split(",");
            rows.add(c);
            if (c[c.length - 1].startsWith("He I") && Double.parseDouble(c[1]) > strongestHe) {
                strongestHe = Double.parseDouble(c[1]);
                strongestLabel = c[c.length - 1];
            }
        }
        // the brightest He I line of a discharge in the visible is 587.6 nm (2p 3P - 3d 3D) (common practice)
        assertEquals("He I 1s3d 3D3 - 1s2p 3P2", strongestLabel);
        // peaks at the singlet lines (no fine structure to blend) and the Balmer lines, as measured
        StringBuilder peaks = new StringBuilder("# ritzwerk-peaks 1\n# id: he-discharge\n# title: synthetic\n"
                + "# source: ritzwerk synth\n# provenance: computed\n# version: 1\n# position-unit: nm\n"
                + "# medium: vacuum\nposition,uncertainty,intensity\n");
        List<String> expected = new ArrayList<>();
        for (String[] c : rows) {
            boolean singlet = c[c.length - 1].startsWith("He I") && !c[c.length - 1].contains(" 3");
            boolean balmer = c[c.length - 1].startsWith("H I");
            double nm = Double.parseDouble(c[0]);
            if ((singlet || balmer) && nm > 380 && nm < 700 && Double.parseDouble(c[1]) > 0.01 * strongestHe) {
                peaks.append(String.format(Locale.ROOT, "%.6f,0.0005,%s%n", nm, c[1]));
                expected.add(c[c.length - 1]);
            }
        }
        Path file = dir.resolve("peaks.csv");
        Files.writeString(file, peaks.toString());
        CliTest.Run run = CliTest.run("identify", file.toString(), "--species", "He I,H I", "--format", "json");
        assertEquals(0, run.code(), run.err());
        String[] out = run.out().strip().split("\\R");
        int helium = 0;
        for (int i = 0; i < expected.size(); i++) {
            JsonNode row = JSON.readTree(out[i]);
            assertEquals("matched", row.get("status").asString(), out[i]);
            String label = expected.get(i);
            if (label.startsWith("He I")) {
                helium++;
                assertEquals("He I", row.get("species").asString(), out[i]);
                // synth's truth and identify both name the line "upper - lower"
                assertEquals(label.substring("He I ".length()), row.get("transition").asString(), out[i]);
            } else {
                assertEquals("H I", row.get("species").asString(), out[i]);
            }
        }
        // 396.5, 492.2, 501.6, 504.8, 667.8 nm, and from the predicted levels n = 5-8 the 2p 1P - nd 1D
        // lines 438.8, 414.4, 401.0, 392.8 nm (air)
        assertEquals(9, helium, String.join("\n", out));
    }
}
