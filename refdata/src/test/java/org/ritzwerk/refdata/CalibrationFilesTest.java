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
}
