package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.refdata.LevelListFiles;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code fit-levels --levels-out} feeds {@code lines --data}: a seeded synthetic network of lines is
 * fitted, the levels are written with their correlations, and the lines computed from that file have
 * the fit's own Ritz uncertainties, not the larger or smaller ones the levels' uncertainties alone give.
 */
class FitLevelsToLinesCommandTest {

    /** Invented Ca II-like levels (labels for parity and J only; the energies check nothing), cm^-1. */
    private static final String[] LABELS = {"4s 2S1/2", "3d 2D3/2", "3d 2D5/2", "4p 2P1/2", "4p 2P3/2", "5s 2S1/2",
        "4d 2D3/2", "4d 2D5/2"};
    private static final double[] ENERGY = {0, 13650.19, 13710.88, 25191.51, 25414.40, 52166.93, 56839.25, 56858.46};
    /** Measured lines (upper, lower): every E1 line among the levels (LS rules). */
    private static final int[][] PAIRS = {{3, 0}, {4, 0}, {3, 1}, {4, 1}, {4, 2}, {5, 3}, {5, 4}, {6, 3}, {6, 4},
        {7, 4}};
    /** Standard uncertainty of each measured wavenumber, cm^-1 (invented). */
    private static final double U = 0.002;

    /** The seeded network's measured lines (Gaussian noise of U), written as ca-ii-lines.csv in dir. */
    static Path measured(Path dir, long seed) throws IOException {
        Random r = new Random(seed);
        StringBuilder b = new StringBuilder("# ritzwerk-measured-lines 1\n# title: invented Ca II network\n"
                + "# position-unit: cm-1\nposition,uncertainty,upper,lower\n");
        for (int[] p : PAIRS) {
            b.append(String.format(Locale.ROOT, "%.6f,%s,%s,%s%n", ENERGY[p[0]] - ENERGY[p[1]] + U * r.nextGaussian(),
                    U, LABELS[p[0]], LABELS[p[1]]));
        }
        Path file = dir.resolve("ca-ii-lines.csv");
        Files.writeString(file, b);
        return file;
    }

    private static List<JsonNode> rows(String out, String kind) {
        JsonMapper json = JsonMapper.builder().build();
        return out.lines().map(json::readTree).filter(n -> kind == null || n.get("kind").asString().equals(kind))
                .toList();
    }

    @Test
    void theFittedLevelsGiveTheFitsOwnLineUncertainties(@TempDir Path dir) throws IOException {
        Path file = measured(dir, 2121);
        for (String name : List.of("ca-ii-fit.csv", "ca-ii-fit.json")) {
            Path levels = dir.resolve(name);
            CliTest.Run fit = CliTest.run("fit-levels", file.toString(), "--reference", "4s 2S1/2", "--format", "json",
                    "--species", "Ca II", "--levels-out", levels.toString());
            assertEquals(0, fit.code(), fit.err());
            LevelList list = LevelListFiles.read(levels);
            CliTest.Run check = CliTest.run("data", "check", levels.toString());
            assertEquals(0, check.code(), check.err());
            assertTrue(check.out().contains(": ok, 8 levels of 1 species in cm-1, 21 correlated pairs (id ca-ii-fit)"),
                    check.out());
            assertEquals("ca-ii-fit", list.info().id());
            assertEquals(LABELS.length, list.size());
            // the held level is exact and correlates with nothing; every other pair of levels is correlated
            int free = LABELS.length - 1;
            assertEquals(free * (free - 1) / 2, list.correlationCount());
            Map<String, Double> fitted = new HashMap<>();
            for (JsonNode line : rows(fit.out(), "line")) {
                fitted.put(line.get("upper").asString() + " - " + line.get("lower").asString(),
                        line.get("ritz_uncertainty_nm").asDouble());
            }
            CliTest.Run lines = CliTest.run("lines", "--data", levels.toString(), "--species", "Ca II", "--from",
                    "150 nm", "--to", "1000 nm", "--format", "json");
            assertEquals(0, lines.code(), lines.err());
            int compared = 0;
            int differ = 0;
            for (JsonNode line : rows(lines.out(), null)) {
                String key = line.get("upper").asString() + " - " + line.get("lower").asString();
                double u = line.get("uncertainty_nm").asDouble();
                if (!fitted.containsKey(key)) {
                    continue;
                }
                compared++;
                // equal to rounding: the file's correlations give the fit's covariance back within a few ulps
                assertEquals(fitted.get(key), u, 1e-9 * u, key);
                // the levels' uncertainties alone, sqrt(u_u^2 + u_l^2) carried to nm (closed form), differ
                double uu = uncertainty(list, line.get("upper").asString());
                double ul = uncertainty(list, line.get("lower").asString());
                double nm = line.get("vacuum_wavelength_nm").asDouble();
                double plain = Math.hypot(uu, ul) * nm * nm * 1e-7;
                if (Math.abs(plain - u) > 0.05 * u) {
                    differ++;
                }
            }
            assertEquals(PAIRS.length, compared, lines.out());
            // lines between two fitted levels (not to the held one) come out smaller than uncorrelated
            assertTrue(differ >= PAIRS.length - 2, differ + " of " + compared + " differ");
        }
    }

    private static double uncertainty(LevelList list, String label) {
        for (int i = 0; i < list.size(); i++) {
            if (list.label(i).equals(label)) {
                return list.uncertainty(i).getAsDouble();
            }
        }
        throw new AssertionError(label);
    }

    @Test
    void levelsOutAndSpeciesComeTogether(@TempDir Path dir) throws IOException {
        Path file = measured(dir, 7);
        CliTest.Run noSpecies = CliTest.run("fit-levels", file.toString(), "--reference", "4s 2S1/2", "--levels-out",
                dir.resolve("x.csv").toString());
        assertEquals(2, noSpecies.code(), noSpecies.err());
        assertTrue(noSpecies.err().contains("--levels-out needs --species"), noSpecies.err());
        assertTrue(Files.notExists(dir.resolve("x.csv")));
        CliTest.Run noFile = CliTest.run("fit-levels", file.toString(), "--reference", "4s 2S1/2", "--species",
                "Ca II");
        assertEquals(2, noFile.code(), noFile.err());
        assertTrue(noFile.err().contains("give --levels-out FILE too"), noFile.err());
        CliTest.Run same = CliTest.run("fit-levels", file.toString(), "--reference", "4s 2S1/2", "--species",
                "Ca II", "--levels-out", file.toString());
        assertTrue(same.code() != 0 && same.err().contains("would destroy the input"), same.err());
    }
}
