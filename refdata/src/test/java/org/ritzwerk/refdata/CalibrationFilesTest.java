package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.data.CalibrationRecord;
import org.ritzwerk.engine.calibrate.DispersionFit;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.medium.Medium;

/** Calibration files: a fitted solution written and read back gives the same wavelengths. */
class CalibrationFilesTest {

    /**
     * A quadratic fitted to invented pairs on 400 + 0.1 p + 1e-5 p^2 nm (+-1e-4 nm in turn), with
     * 0.01-pixel centroids, at pixels 10, 200, 400, 650, 800 and 1000.
     */
    static DispersionSolution fitted() {
        double[] pixel = {10, 200, 400, 650, 800, 1000};
        double[] nm = new double[pixel.length];
        double[] sigma = new double[pixel.length];
        for (int i = 0; i < pixel.length; i++) {
            nm[i] = 400 + 0.1 * pixel[i] + 1e-5 * pixel[i] * pixel[i] + (i % 2 == 0 ? 1e-4 : -1e-4);
            sigma[i] = 0.01;
        }
        return DispersionFit.ofDegree(2).fit(pixel, sigma, nm, null, Medium.air());
    }

    @Test
    void aMissingFolderIsNamedWithTheTargetNotTheTemporaryFile(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("no-such-folder").resolve("calibration.json");
        java.nio.file.NoSuchFileException e = assertThrows(java.nio.file.NoSuchFileException.class,
                () -> CalibrationFiles.write(file, fitted(), 1024, "invented pairs", List.of("a", "b", "c", "d", "e",
                        "f")));
        assertEquals(file + ": cannot write it: the folder " + file.getParent().toAbsolutePath()
                + " does not exist", e.getMessage());
        assertTrue(!e.getMessage().contains(".part"), e.getMessage());
        Path plainFile = dir.resolve("plain");
        Files.writeString(plainFile, "x");
        IOException notFolder = assertThrows(IOException.class, () -> CalibrationFiles.write(
                plainFile.resolve("calibration.json"), fitted(), 1024, "invented pairs",
                List.of("a", "b", "c", "d", "e", "f")));
        assertTrue(notFolder.getMessage().endsWith("is not a folder"), notFolder.getMessage());
        try (var files = Files.list(dir)) {
            assertEquals(1, files.count(), "no temporary file left");
        }
    }

    @Test
    void roundTripKeepsTheSolution(@TempDir Path dir) throws IOException {
        DispersionSolution fitted = fitted();
        Path file = dir.resolve("calibration.json");
        CalibrationFiles.write(file, fitted, 1024, "invented pairs",
                List.of("a", "b", "c", "d", "e", "f"));
        CalibrationFiles.Calibration back = CalibrationFiles.read(file);
        assertEquals(1024, back.pixels());
        assertEquals("invented pairs", back.description());
        for (double p = 0; p < 1024; p += 37.5) {
            assertEquals(fitted.wavelengthAt(p), back.solution().wavelengthAt(p), 1e-12);
            assertEquals(fitted.wavelengthSigmaAt(p), back.solution().wavelengthSigmaAt(p), 1e-15);
        }
        assertTrue(Files.readString(file).contains("\"line\" : \"c\""));
    }

    private static Path fixture(String name) throws URISyntaxException {
        return Path.of(CalibrationFilesTest.class.getResource("/spectra/" + name).toURI());
    }

    @Test
    void brokenFilesNameTheirDefect() {
        DataFileException ragged = assertThrows(DataFileException.class,
                () -> CalibrationFiles.read(fixture("calibration-ragged-covariance.json")));
        assertTrue(ragged.getMessage().contains("\"covariance_nm2\" row 1 has 1 values, expected 2"),
                ragged.getMessage());
        DataFileException medium = assertThrows(DataFileException.class,
                () -> CalibrationFiles.read(fixture("calibration-unknown-medium.json")));
        assertTrue(medium.getMessage().contains("\"medium\": unknown medium 'water'"), medium.getMessage());
        DataFileException version = assertThrows(DataFileException.class,
                () -> CalibrationFiles.read(fixture("calibration-future-version.json")));
        assertTrue(version.getMessage().contains("version 1, the file says 2"), version.getMessage());
        // the parser's advice about its own switches is not shown; where it stopped is
        DataFileException nan = assertThrows(DataFileException.class, () -> CalibrationFiles.parseRecord("n.json",
                "{\"format\": \"ritzwerk-calibration\",\n \"rms_nm\": NaN}"));
        assertTrue(nan.getMessage().contains("NaN, which JSON has no number for (line 2, column")
                && !nan.getMessage().contains("Feature"), nan.getMessage());
        // a covariance that is no covariance gave every pixel an uncertainty of 0
        DataFileException negative = assertThrows(DataFileException.class,
                () -> CalibrationFiles.read(fixture("calibration-negative-variance.json")));
        assertTrue(negative.getMessage().contains("is a variance and must not be negative"), negative.getMessage());
        DataFileException indefinite = assertThrows(DataFileException.class,
                () -> CalibrationFiles.read(fixture("calibration-indefinite-covariance.json")));
        assertTrue(indefinite.getMessage().contains("not positive semidefinite"), indefinite.getMessage());
    }

    /**
     * A file that contradicts itself, or claims a fitted range its lines do not cover, is refused
     * naming the member (invented files; the straight line 495 + (5 / 49.5) p nm on 100 pixels):
     * a valid range beyond the detector was accepted and made every pixel of an applied spectrum
     * look fitted; power coefficients and a degree that disagreed with the coefficients were
     * silently ignored; a missing medium was reported as "unknown medium ''".
     */
    @Test
    void contradictionsAndRangesBeyondTheFitAreRefusedNamingTheMember() throws URISyntaxException {
        assertRefused("calibration-valid-pixels-beyond-detector.json",
                "\"valid_pixels\" [-10.0, 150.0] reaches beyond the detector of \"pixels\" 100");
        assertRefused("calibration-valid-pixels-beyond-lines.json",
                "\"valid_pixels\" [0.0, 99.0] reaches beyond the lines used, which lie from pixel 19.8 to 79.2");
        assertRefused("calibration-power-coefficients-contradict.json",
                "\"power_coefficients_nm\" give 1.000000 nm at pixel 0, but \"coefficients_nm\" give 495.000000 nm");
        assertRefused("calibration-degree-contradicts.json",
                "\"degree\" is 3, but \"coefficients_nm\" holds 2 coefficients, a polynomial of degree 1");
        assertRefused("calibration-lines-used-contradicts-lines.json",
                "\"lines_used\" is 4, but 3 of \"lines\" are used");
        assertRefused("calibration-missing-medium.json", "\"medium\" is missing");
        // the same members, agreeing with the rest, are read (and the degree file's power form is right)
        CalibrationRecord agreeing = CalibrationFiles.readRecord(fixture("calibration-consistent-with-lines.json"));
        assertEquals(3, agreeing.linesUsed());
        assertEquals(19.8, agreeing.polynomial().lowestPixel());
    }

    private static void assertRefused(String fixture, String expected) throws URISyntaxException {
        Path file = fixture(fixture);
        DataFileException e = assertThrows(DataFileException.class, () -> CalibrationFiles.read(file));
        assertTrue(e.getMessage().contains(expected), e.getMessage());
    }

    /**
     * Power coefficients written from the same polynomial pass the check at every degree the fit
     * allows, though the power form is badly conditioned: a written file reads back.
     */
    @Test
    void writtenFilesOfHighDegreeReadBack(@TempDir Path dir) throws IOException {
        double[] pixel = new double[40];
        double[] nm = new double[40];
        double[] sigma = new double[40];
        for (int i = 0; i < pixel.length; i++) {
            pixel[i] = 5 + 100 * i;
            double x = pixel[i] / 4096;
            nm[i] = 350 + 550 * x + 20 * x * x - 8 * x * x * x + 3 * Math.pow(x, 4) - Math.pow(x, 5);
            sigma[i] = 0.01;
        }
        DispersionSolution quintic = DispersionFit.ofDegree(5).fit(pixel, sigma, nm, null, Medium.vacuum());
        List<String> labels = new java.util.ArrayList<>();
        for (int i = 0; i < pixel.length; i++) {
            labels.add("line " + i);
        }
        Path file = dir.resolve("quintic.json");
        CalibrationFiles.write(file, quintic, 4096, "invented quintic", labels);
        assertEquals(quintic.wavelengthAt(3000.0), CalibrationFiles.read(file).solution().wavelengthAt(3000.0), 1e-9);
    }
}
