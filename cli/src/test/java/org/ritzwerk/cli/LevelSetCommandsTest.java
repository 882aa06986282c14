package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code levels} and {@code lines} for species with a level list: the built-in He I and a user's file. */
class LevelSetCommandsTest {

    @Test
    void heliumHasLevelsAndRitzLines() {
        CliTest.Run levels = CliTest.run("levels", "--species", "He I", "--format", "csv");
        assertEquals(0, levels.code(), levels.err());
        // the energy with its uncertainty (half a unit in the last digit of the list)
        assertTrue(levels.out().contains("\"He I\",\"1s2p 1P1\",,,1,,3,171134.897,5.0E-5,\"level list levels-he-i\""),
                levels.out());
        // 2p 1P - 3d 1D: 667.8151 nm in air (NIST Handbook strong lines, from memory; see HeliumLevelsTest)
        CliTest.Run lines = CliTest.run("lines", "--species", "He I", "--from", "667 nm air", "--to", "669 nm air",
                "--medium", "air", "--format", "json");
        assertEquals(0, lines.code(), lines.err());
        JsonMapper json = JsonMapper.builder().build();
        boolean found = false;
        for (String line : lines.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            assertEquals("ritz", row.get("model").asString());
            if (row.get("line").asString().equals("1s3d 1D2 - 1s2p 1P1")) {
                found = true;
                assertEquals(667.8151, row.get("air_wavelength_nm").asDouble(), 2e-4);
                // A from the companion list lines-he-i (Coulomb approximation, 6.388e7 s^-1; Wiese and
                // Fuhr 2009 give 6.3705e7, from memory: see HeliumRatesTest)
                assertEquals(6.3705e7, row.get("einstein_a_per_s").asDouble(), 0.025 * 6.3705e7);
            }
        }
        assertTrue(found, lines.out());
        CliTest.Run mixed = CliTest.run("lines", "--species", "He I,H I", "--from", "480 nm air", "--to", "520 nm air");
        assertEquals(0, mixed.code(), mixed.err());
        assertTrue(mixed.out().contains("Balmer beta") && mixed.out().contains("1s3p 1P1 - 1s2s 1S0"), mixed.out());
    }

    @Test
    void aUsersLevelFileGivesItsSpeciesLines(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("levels.csv");
        // invented levels of an invented configuration list: only the plumbing is checked
        Files.writeString(file, "# ritzwerk-levels 1\n# id: my-levels\n# title: test\n# source: invented for a test\n"
                + "# provenance: from-memory\n# version: 1\n# energy-unit: cm-1\n"
                + "species,label,energy,uncertainty,j,note\nCa I,4s2 1S0,0,0,0,\nCa I,4s4p 1P1,23652.3,0.01,1,\n");
        CliTest.Run lines = CliTest.run("lines", "--data", file.toString(), "--species", "Ca I", "--from", "400 nm",
                "--to", "450 nm", "--format", "csv");
        assertEquals(0, lines.code(), lines.err());
        assertTrue(lines.out().contains("\"4s4p 1P1 - 4s2 1S0\""), lines.out());
        CliTest.Run lifetimes = CliTest.run("levels", "--data", file.toString(), "--species", "Ca I", "--lifetimes");
        assertEquals(2, lifetimes.code());
        assertTrue(lifetimes.err().contains("--lifetimes") && lifetimes.err().contains("[Ca I]"), lifetimes.err());
        CliTest.Run none = CliTest.run("lines", "--species", "Ca I", "--from", "400 nm", "--to", "450 nm");
        assertEquals(2, none.code(), "no level list for Ca I in the built-in data");
    }
}
