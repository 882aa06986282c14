package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.RitzwerkException;

/**
 * A continuum shape file (invented rows): linear between rows, divided by the largest density
 * the spectrum's range sees, and every bad row named with file, line and field.
 */
class ContinuumFilesTest {

    @Test
    void linearBetweenRowsAndScaledToTheRangesLargestValue(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("shape.csv");
        Files.writeString(file, "# invented shape\nwavelength_nm,density\n500,1\n600,3\n700,2\n900,40\n");
        DoubleUnaryOperator shape = ContinuumFiles.read(file, 550, 650);
        // The range 550-650 nm sees the rows from 500 to 700 nm: the largest is 3 (at 600 nm).
        assertEquals(1.0, shape.applyAsDouble(600), 0);
        assertEquals(2.0 / 3, shape.applyAsDouble(550), 1e-15);       // halfway between 1 and 3
        assertEquals(2.5 / 3, shape.applyAsDouble(650), 1e-15);       // halfway between 3 and 2
    }

    @Test
    void everyBadRowIsNamedAndAShortRangeIsRefused(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("bad.csv");
        Files.writeString(file, "wavelength_nm,density\n500,1\n600,-2\n450,3\nx,1\n700,1\n");
        RitzwerkException bad = assertThrows(RitzwerkException.class, () -> ContinuumFiles.read(file, 550, 650));
        assertEquals(ContinuumFiles.BAD_FILE, bad.code());
        assertTrue(bad.getMessage().startsWith("3 problems in " + file + ":"), bad.getMessage());
        assertTrue(bad.getMessage().contains(file + ":3: density must not be negative, got -2"), bad.getMessage());
        assertTrue(bad.getMessage().contains(file + ":4: wavelength_nm must rise from row to row"), bad.getMessage());
        assertTrue(bad.getMessage().contains(file + ":5: wavelength_nm must be a finite number, got 'x'"),
                bad.getMessage());
        Path shortFile = dir.resolve("short.csv");
        Files.writeString(shortFile, "wavelength_nm,density\n600,1\n620,1\n");
        assertTrue(assertThrows(RitzwerkException.class, () -> ContinuumFiles.read(shortFile, 550, 650)).getMessage()
                .contains("covers 600.0 to 620.0 nm but the spectrum spans 550.0 to 650.0 nm"));
    }
}
