package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.StringWriter;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;

/**
 * The synthetic-spectrum and truth formats: what they look like, what the writers refuse, and the
 * truth reader's errors with file, line, column and code.
 */
class SyntheticFilesTest {

    private static SyntheticSpectrum spectrum(double count, double width, String label) {
        return spectrum(Medium.air(), count, width, label);
    }

    private static SyntheticSpectrum spectrum(Medium medium, double count, double width, String label) {
        return SyntheticSpectrum.of(PixelGrid.of(new double[] {656.0, 656.5, 657.0}), medium, new double[] {1.5, 2},
                new double[] {count, 3}, Scene.Lines.of(new double[] {656.28}, new double[] {1}, new double[] {0.02},
                        new double[] {width}, new String[] {label}), new double[] {3.5}, new double[] {3.25});
    }

    @Test
    void theFilesLookAsDocumented() throws IOException {
        Map<String, Object> scene = new LinkedHashMap<>();
        scene.put("species", "H I");
        scene.put("temperature-k", 9000.0);
        scene.put("natural-widths", false);
        StringWriter csv = new StringWriter();
        SyntheticSpectrumFiles.writeCsv(spectrum(1, 0, "H I Balmer alpha"), "linear", scene, csv);
        assertEquals("# ritzwerk-spectrum 1\n"
                + "# axis: wavelength nm air (pixel centres; linear pixels from 656.0 to 657.0)\n"
                + "# species: H I\n# temperature-k: 9000.0\n# natural-widths: false\n"
                + "wavelength_nm,expected_counts,counts\n656.25,1.5,1.0\n656.75,2.0,3.0\n", csv.toString());
        StringWriter truth = new StringWriter();
        SpectrumLineFiles.writeCsv(spectrum(Medium.vacuum(), 1, 0, "Ne I 656, \"strong\""), truth);
        assertEquals("# ritzwerk-spectrum-lines 1\n# medium: vacuum\n# counts: " + SpectrumLineFiles.COUNTS_NOTE
                + "\n# widths: " + SpectrumLineFiles.WIDTHS_NOTE + "\n"
                + "wavelength_nm,counts,counts_in_pixels,doppler_fwhm_nm,lorentz_fwhm_nm,line\n"
                + "656.28,3.5,3.25,0.02,0.0,\"Ne I 656, \"\"strong\"\"\"\n", truth.toString());
        StringWriter json = new StringWriter();
        SyntheticSpectrumFiles.writeJson(spectrum(1, 0, "H I Balmer alpha"), "linear", scene,
                List.of("a note"), json);
        assertEquals("{\"format\":\"ritzwerk-spectrum\",\"version\":1,\"axis\":{\"quantity\":\"wavelength\","
                + "\"unit\":\"nm\",\"medium\":\"air\",\"grid\":\"linear\"},\"scene\":{\"species\":\"H I\","
                + "\"temperature-k\":9000.0,\"natural-widths\":false},\"notes\":[\"a note\"],"
                + "\"pixel_edges_nm\":[656.0,656.5,657.0],\"wavelength_nm\":[656.25,656.75],"
                + "\"expected_counts\":[1.5,2.0],\"counts\":[1.0,3.0],\"lines\":[{\"wavelength_nm\":656.28,"
                + "\"counts\":3.5,\"counts_in_pixels\":3.25,\"doppler_fwhm_nm\":0.02,\"lorentz_fwhm_nm\":0.0,\"line\":\"H I Balmer alpha\"}]}\n",
                json.toString());
    }

    @Test
    void valuesTheFilesCannotHoldAreRefusedBeforeWriting() {
        StringWriter out = new StringWriter();
        IllegalArgumentException nan = assertThrows(IllegalArgumentException.class, () -> SyntheticSpectrumFiles
                .writeCsv(spectrum(Double.NaN, 0, "x"), "linear", Map.of(), out));
        assertTrue(nan.getMessage().startsWith("pixel 0: counts must be finite"), nan.getMessage());
        assertThrows(IllegalArgumentException.class, () -> SyntheticSpectrumFiles.writeJson(spectrum(1, 0, "x"),
                "linear", Map.of("temperature-k", Double.POSITIVE_INFINITY), List.of(), out));
        assertThrows(IllegalArgumentException.class, () -> SyntheticSpectrumFiles.writeCsv(spectrum(1, 0, "x"),
                "linear", Map.of("lines", "a\nb"), out));
        // a grid kind the spectrum files do not know was written as "banana pixels"
        assertTrue(assertThrows(IllegalArgumentException.class, () -> SyntheticSpectrumFiles.writeCsv(
                spectrum(1, 0, "x"), "banana", Map.of(), out)).getMessage()
                .contains("grid kind must be linear, log or"));
        assertThrows(IllegalArgumentException.class, () -> SyntheticSpectrumFiles.writeCsv(spectrum(1, 0, "x"),
                "linear", Map.of("axis", "mine"), out));
        assertThrows(IllegalArgumentException.class, () -> SyntheticSpectrumFiles.writeCsv(spectrum(1, 0, "x"),
                "linear", Map.of("a: b", "c"), out));
        IllegalArgumentException width = assertThrows(IllegalArgumentException.class, () -> SpectrumLineFiles
                .writeCsv(spectrum(1, Double.NaN, "H I Balmer alpha"), out));
        assertTrue(width.getMessage().startsWith("line 0 (H I Balmer alpha): counts and widths must be finite"),
                width.getMessage());
        assertThrows(IllegalArgumentException.class, () -> SpectrumLineFiles.writeCsv(spectrum(1, 0, ""),
                out));
        assertThrows(IllegalArgumentException.class, () -> SpectrumLineFiles.writeCsv(spectrum(1, 0, "two\nlines"),
                out));
        assertEquals("", out.toString(), "nothing written");
    }

    @Test
    void badTruthFilesAreReportedWithLineColumnAndCode() {
        String head = "# ritzwerk-spectrum-lines 1\n# medium: air\n"
                + "wavelength_nm,counts,doppler_fwhm_nm,lorentz_fwhm_nm,line\n";
        DataFileException e = assertThrows(DataFileException.class, () -> SpectrumLineFiles.read(head
                + "656.28,-3,0.02,0,H I Balmer alpha\n486.1,12,x,0,H I Balmer beta\n0,1,0,0,\n", "t.csv"));
        List<DataProblem> problems = e.problems();
        assertEquals(4, problems.size(), e.getMessage());
        assertEquals("t.csv:4:2: column counts: counts must not be negative, got -3", problems.get(0).render()
                .lines().findFirst().orElseThrow());
        assertEquals("data.negative", problems.get(0).code());
        assertEquals(5, problems.get(1).line());
        assertEquals(3, problems.get(1).column());
        assertEquals("data.not-a-number", problems.get(1).code());
        assertEquals(6, problems.get(2).line());
        assertEquals("data.not-positive", problems.get(2).code());
        assertEquals("data.missing-value", problems.get(3).code());
        assertEquals(5, problems.get(3).column());
        DataFileException medium = assertThrows(DataFileException.class, () -> SpectrumLineFiles.read(
                "# ritzwerk-spectrum-lines 1\n# medium: water\nwavelength_nm,counts,doppler_fwhm_nm,lorentz_fwhm_nm,line\n"
                + "656.28,3,0.02,0,H I Balmer alpha\n", "t.csv"));
        assertEquals("data.unknown-medium", medium.problems().get(0).code());
        assertEquals(2, medium.problems().get(0).line());
        DataFileException none = assertThrows(DataFileException.class, () -> SpectrumLineFiles.read(
                "# ritzwerk-spectrum-lines 1\nwavelength_nm,counts,doppler_fwhm_nm,lorentz_fwhm_nm,line\n", "t.csv"));
        assertTrue(none.getMessage().contains("required header 'medium' is missing"), none.getMessage());
        DataFileException spectrum = assertThrows(DataFileException.class, () -> SpectrumLineFiles.read(
                "# ritzwerk-spectrum 1\n# medium: air\nwavelength_nm,counts,doppler_fwhm_nm,lorentz_fwhm_nm,line\n",
                "t.csv"));
        assertTrue(spectrum.getMessage().contains("t.csv:1:1: the first line must be '# ritzwerk-spectrum-lines 1'"),
                spectrum.getMessage());
    }

    @Test
    void aDuplicatedKeyInTheJsonDocumentIsRefused() throws IOException {
        StringWriter json = new StringWriter();
        SyntheticSpectrumFiles.writeJson(spectrum(1, 0, "x"), "linear", Map.of(), List.of(), json);
        String twice = json.toString().replace("\"notes\":[]", "\"notes\":[],\"notes\":[\"again\"]");
        DataFileException e = assertThrows(DataFileException.class, () -> SyntheticSpectrumFiles.readJson(twice,
                "s.json"));
        assertTrue(e.getMessage().startsWith("1 problem in s.json:\ns.json:1:"), e.getMessage());
        assertTrue(e.getMessage().contains("Duplicate"), e.getMessage());
    }
}
