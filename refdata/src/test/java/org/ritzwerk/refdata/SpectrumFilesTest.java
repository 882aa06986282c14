package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URISyntaxException;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/** The spectrum reader on good files and on broken fixtures named after their defect. */
class SpectrumFilesTest {

    private static Path fixture(String name) throws URISyntaxException {
        return Path.of(SpectrumFilesTest.class.getResource("/spectra/" + name).toURI());
    }

    @Test
    void readsCsvWithSigmasAndHeader() throws URISyntaxException {
        SpectrumFiles.Spectrum s = SpectrumFiles.read(fixture("spectrum-good.csv"));
        assertArrayEquals(new double[] {10, 12.5, 400, 11}, s.counts());
        assertArrayEquals(new double[] {3.2, 3.5, 20, 3.3}, s.sigmas());
        assertNull(s.wavelengths());
        assertEquals("invented 8-pixel strip", s.header().get("detector"));
    }

    /**
     * What a reader returns cannot be changed through its accessors, and two reads of one file are
     * equal (the records exposed their arrays and header, and compared them by identity).
     */
    @Test
    void readResultsAreImmutableAndEqualByContent() throws URISyntaxException {
        SpectrumFiles.Spectrum s = SpectrumFiles.read(fixture("spectrum-good.csv"));
        s.counts()[0] = -1;
        assertEquals(10, s.counts()[0]);
        assertThrows(UnsupportedOperationException.class, () -> s.header().put("x", "y"));
        assertEquals(s, SpectrumFiles.read(fixture("spectrum-good.csv")));
        assertEquals(s.hashCode(), SpectrumFiles.read(fixture("spectrum-good.csv")).hashCode());
        String text = "# ritzwerk-peaks 1\n# id: p\n# title: t\n# source: invented\n# provenance: measured\n"
                + "# version: 1\n# position-unit: nm\n# medium: air\nposition,uncertainty\n500.1,0.01\n600.2,\n";
        PeakFiles.Peaks peaks = PeakFiles.read(text, "p.csv");
        peaks.positions()[0] = 1;
        peaks.lines()[0] = 99;
        assertEquals(500.1, peaks.positions()[0]);
        assertEquals(10, peaks.lines()[0]);
        assertEquals(peaks, PeakFiles.read(text, "p.csv"));
    }

    /**
     * One row per pixel: an empty row among the pixels (a missing value) shifted every pixel after
     * it by one and the calibration with them, with exit 0. Empty lines after the last pixel are
     * fine. A file that is bad throughout says where reading stopped.
     */
    @Test
    void anEmptyRowAmongThePixelsIsRefusedAndAStopIsSaid() {
        StringBuilder gap = new StringBuilder("counts\n");
        for (int p = 0; p < 20; p++) {
            gap.append(p == 7 ? "" : Integer.toString(100 + p)).append('\n');
        }
        DataFileException e = assertThrows(DataFileException.class,
                () -> SpectrumFiles.read(gap.toString(), "gap.csv"));
        assertEquals(1, e.problems().size(), e.getMessage());
        assertEquals(9, e.problems().get(0).line(), e.getMessage());
        assertTrue(e.getMessage().contains("an empty row among the pixels"), e.getMessage());
        assertEquals(3, SpectrumFiles.read("counts\n1\n2\n3\n\n\n", "tail.csv").pixels());
        StringBuilder commas = new StringBuilder("pixel,counts\n");
        for (int p = 0; p < 80; p++) {
            commas.append(p).append(",1,5\n");
        }
        DataFileException many = assertThrows(DataFileException.class,
                () -> SpectrumFiles.read(commas.toString(), "comma.csv"));
        assertEquals(51, many.problems().size());
        // an unknown column is reported once, at the header row, not again on every row
        DataFileException extra = assertThrows(DataFileException.class,
                () -> SpectrumFiles.read("pixel,counts,gain\n0,1,2\n1,2,2\n2,3,2\n", "extra.csv"));
        assertEquals(1, extra.problems().size(), extra.getMessage());
        assertTrue(extra.getMessage().contains("unknown column 'gain'"), extra.getMessage());
        assertTrue(many.getMessage().contains("reading stopped after 50 problems"), many.getMessage());
    }

    @Test
    void readsJson() throws URISyntaxException {
        SpectrumFiles.Spectrum s = SpectrumFiles.read(fixture("spectrum-good.json"));
        assertArrayEquals(new double[] {1, 2, 3.5}, s.counts());
        assertNull(s.sigmas());
    }

    @Test
    void everyBadRowIsReportedWithLineAndColumn() throws URISyntaxException {
        DataFileException e = assertThrows(DataFileException.class,
                () -> SpectrumFiles.read(fixture("spectrum-bad-count-and-pixel-gap.csv")));
        assertEquals(DataFileException.INVALID, e.code());
        assertEquals(2, e.problems().size(), e.getMessage());
        assertEquals(4, e.problems().get(0).line());
        assertEquals(2, e.problems().get(0).column());
        assertTrue(e.problems().get(0).reason().contains("counts must be a finite number, got 'abc'"));
        assertEquals(6, e.problems().get(1).line());
        assertTrue(e.problems().get(1).reason().contains("pixel must count up from 0 in row order: expected 3, got 4"),
                e.problems().get(1).reason());
    }

    @Test
    void aMisspeltColumnIsNotIgnored() throws URISyntaxException {
        DataFileException e = assertThrows(DataFileException.class,
                () -> SpectrumFiles.read(fixture("spectrum-misspelt-column.csv")));
        assertTrue(e.getMessage().contains("unknown column 'count'"), e.getMessage());
        assertTrue(e.getMessage().contains("spectrum-misspelt-column.csv:2:2"), e.getMessage());
    }

    @Test
    void anotherFormatIsNamed() throws URISyntaxException {
        DataFileException e = assertThrows(DataFileException.class,
                () -> SpectrumFiles.read(fixture("spectrum-wrong-format.csv")));
        assertTrue(e.getMessage().contains("this is a ritzwerk-peaks 1 file, not a ritzwerk-spectrum file"),
                e.getMessage());
    }

    @Test
    void jsonArraysMustAgreeInLength() throws URISyntaxException {
        DataFileException e = assertThrows(DataFileException.class,
                () -> SpectrumFiles.read(fixture("spectrum-json-length-mismatch.json")));
        assertTrue(e.getMessage().contains("counts has 3 values but another array has 2"), e.getMessage());
    }

    @Test
    void aMissingFileIsUnreadable() {
        DataFileException e = assertThrows(DataFileException.class,
                () -> SpectrumFiles.read(Path.of("no-such-spectrum.csv")));
        assertEquals(DataFileException.UNREADABLE, e.code());
    }
    /**
     * An applied calibration marks each extrapolated pixel in a column of its own, so a CSV reader
     * that skips comments (and the {@code # valid-pixels} line) still knows them; the format's
     * reader takes the column, and refuses a value other than 0 or 1. Invented solution: 500 +
     * 0.1 (p - 4.5) nm over 10 pixels, fitted over pixels 2 to 7.
     */
    @Test
    void appliedWavelengthsMarkTheExtrapolatedPixels() {
        org.ritzwerk.engine.calibrate.DispersionSolution solution = org.ritzwerk.engine.calibrate.DispersionSolution.of(
                4.5, 1, new double[] {500, 0.1}, null, 2, 7, org.ritzwerk.medium.Medium.air());
        double[] counts = {1, 2, 3, 4, 5, 6, 7, 8, 9, 10};
        String text = SpectrumFiles.withWavelengths(new SpectrumFiles.Spectrum("s.csv", counts, null, null,
                java.util.Map.of()), solution, "c.json");
        assertTrue(text.contains("# valid-pixels: 2.0 to 7.0"), text);
        assertTrue(text.contains("\npixel,wavelength_nm,wavelength_sigma_nm,counts,extrapolated\n"), text);
        String[] rows = text.substring(text.indexOf(",extrapolated\n") + 14).split("\n");
        assertEquals(10, rows.length);
        for (int p = 0; p < 10; p++) {
            String flag = rows[p].substring(rows[p].lastIndexOf(',') + 1);
            assertEquals(p >= 2 && p <= 7 ? "0" : "1", flag, rows[p]);
        }
        SpectrumFiles.Spectrum back = SpectrumFiles.read(text, "applied.csv");
        assertArrayEquals(counts, back.counts());
        assertEquals(500 + 0.1 * (9 - 4.5), back.wavelengths()[9], 1e-6);
        DataFileException bad = assertThrows(DataFileException.class, () -> SpectrumFiles.read(
                "pixel,counts,extrapolated\n0,5,0\n1,6,2\n", "bad.csv"));
        assertTrue(bad.getMessage().contains("extrapolated must be 0 or 1, got 2"), bad.getMessage());
    }
}
