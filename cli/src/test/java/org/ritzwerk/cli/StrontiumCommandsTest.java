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
        // 5s40s 3S1 - 5s5p 3P1 near 319 nm in the UV, a Ritz line of the level list
        CliTest.Run lines = CliTest.run("lines", "--species", "Sr I", "--from", "318 nm", "--to", "320 nm",
                "--format", "csv");
        assertEquals(0, lines.code(), lines.err());
        assertTrue(lines.out().contains("\"5s.40s 3S1 - 5s5p 3P1\""), lines.out());
        assertTrue(!lines.out().contains("1S0\""), "no intercombination line from 5s5p 3P1 under the LS rules");
    }

    /**
     * Species whose data lack a quantity a command needs are bad input (exit 2, named), not an
     * internal error: Sr I's level list has no A values, so it gives no light to render and no lamp
     * to rank (nor do the alkali atoms' level lists); a level list carries no hyperfine constants
     * and takes no level model.
     */
    @Test
    void whatALevelListLacksIsRefusedAsInput(@TempDir Path dir) throws IOException {
        CliTest.Run synth = CliTest.run("synth", "--species", "Sr I", "--from", "400 nm", "--to", "500 nm",
                "--temperature", "3000", "--out", dir.resolve("sr.csv").toString());
        assertEquals(2, synth.code(), synth.err());
        assertTrue(synth.err().contains("Sr I: no line between its levels has a transition probability"), synth.err());
        assertTrue(!Files.exists(dir.resolve("sr.csv")));

        Path spectrum = dir.resolve("flat.csv");
        StringBuilder counts = new StringBuilder("counts\n");
        for (int p = 0; p < 64; p++) {
            counts.append(100 + (p % 7)).append('\n');
        }
        Files.writeString(spectrum, counts);
        for (String gas : new String[] {"Sr I", "Na I"}) {
            CliTest.Run lamp = CliTest.run("calibrate", spectrum.toString(), "--lamp", gas);
            assertEquals(2, lamp.code(), lamp.err());
            assertTrue(lamp.err().contains(gas + ": no lamp set, and none of the") && lamp.err().contains(
                    "has an Einstein A"), lamp.err());
        }

        for (String species : new String[] {"He I", "Sr I"}) {
            CliTest.Run hyperfine = CliTest.run("levels", "--species", species, "--hyperfine");
            assertEquals(2, hyperfine.code());
            assertTrue(hyperfine.err().contains("--hyperfine has no effect for species with a level list [" + species
                    + "] (a level list carries no hyperfine constants"), hyperfine.err());
            CliTest.Run model = CliTest.run("levels", "--species", species, "--model", "hyperfine");
            assertEquals(2, model.code());
            assertTrue(model.err().contains("--model has no effect for species with a level list [" + species + "]"),
                    model.err());
        }
    }
}
