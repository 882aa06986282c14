package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Sr I through the commands: the built-in Rydberg levels (levels-sr-i) in {@code levels}, their Ritz
 * lines in {@code lines}, and a series read off {@code levels} fitted back by {@code series}.
 */
class StrontiumCommandsTest {

    /**
     * The first ionization limit of Sr-88, 1 377 012 721(10) MHz (L. Couturier et al., Phys. Rev. A 99,
     * 022503 (2019), as its abstract prints it), in cm^-1.
     */
    private static final double LIMIT = 1377012721e6 / 299792458e2;

    @Test
    void levelsLinesAndASeriesFitOfStrontium(@TempDir Path dir) throws IOException {
        CliTest.Run levels = CliTest.run("levels", "--species", "Sr I", "--format", "json");
        assertEquals(0, levels.code(), levels.err());
        JsonMapper json = JsonMapper.builder().build();
        Pattern triplet = Pattern.compile("5s\\.(\\d+)s 3S1");
        StringBuilder series = new StringBuilder("# ritzwerk-series 1\n# species: Sr-88 I\n# energy-unit: cm-1\n"
                + "# source: ritzwerk levels --species 'Sr I' (levels-sr-i)\nseries,n,energy,uncertainty\n");
        int members = 0;
        for (String line : levels.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            assertEquals("level list levels-sr-i", row.get("model").asString());
            Matcher m = triplet.matcher(row.get("label").asString());
            if (m.matches()) {
                members++;
                // 1e-4 cm^-1 each: the levels command prints 1e-7 cm^-1, the fit needs no more
                series.append("5sns 3S1,").append(m.group(1)).append(',')
                        .append(row.get("energy_per_cm").asString()).append(",1e-4\n");
            }
        }
        assertEquals(41, members, "5sns 3S1, n = 20 to 60");
        Path file = dir.resolve("sr-3s1.csv");
        Files.writeString(file, series.toString());
        CliTest.Run fit = CliTest.run("series", file.toString(), "--terms", "3", "--format", "json");
        assertEquals(0, fit.code(), fit.err());
        boolean limit = false;
        for (String line : fit.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            if (row.get("kind").asString().equals("parameter")) {
                String name = row.get("parameter").asString();
                double value = row.get("value").asDouble();
                if (name.equals("limit")) {
                    limit = true;
                    assertEquals(LIMIT, value, 1e-5, "the published limit");
                } else if (name.equals("5sns 3S1 d0")) {
                    // Couturier et al. (2019), from memory (levels/rydberg-ritz-sr-88.csv)
                    assertEquals(3.370778, value, 1e-6);
                }
            }
        }
        assertTrue(limit, fit.out());
        // 5s5p 3P1 - 5s40s 3S1 near 319 nm in the UV, a Ritz line of the level list
        CliTest.Run lines = CliTest.run("lines", "--species", "Sr I", "--from", "318 nm", "--to", "320 nm",
                "--format", "csv");
        assertEquals(0, lines.code(), lines.err());
        assertTrue(lines.out().contains("\"5s5p 3P1 - 5s.40s 3S1\""), lines.out());
        assertTrue(!lines.out().contains("1S0\""), "no intercombination line from 5s5p 3P1 under the LS rules");
    }
}
