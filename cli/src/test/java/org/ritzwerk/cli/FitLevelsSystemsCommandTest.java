package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;

/**
 * {@code ritzwerk fit-levels --separate-systems} and {@code --system-reference}: He I-like singlets and
 * triplets (invented wavenumbers; only the method is checked) with no intercombination line.
 */
class FitLevelsSystemsCommandTest {

    private static final String SINGLET = "1s2s 1S0";
    private static final String TRIPLET = "1s2s 3S1";
    /** The anchor given to the triplet system, cm^-1, and its standard uncertainty (invented). */
    private static final double ANCHOR = 159855.9743;
    private static final double ANCHOR_U = 0.0005;

    /** The measured lines, written as he-lines.csv in dir (shipped as examples/data/he-lines.csv for the README). */
    static Path lines(Path dir) throws IOException {
        Path file = dir.resolve("he-lines.csv");
        Files.writeString(file, "# ritzwerk-measured-lines 1\n# title: singlets and triplets, no line between "
                + "(invented values)\n# position-unit: cm-1\nposition,uncertainty,upper,lower\n"
                + "4857.4567,0.0010,1s2p 1P1,1s2s 1S0\n19931.9248,0.0010,1s3p 1P1,1s2s 1S0\n"
                + "15074.4690,0.0015,1s3p 1P1,1s2p 1P1\n14970.0698,0.0010,1s3d 1D2,1s2p 1P1\n"
                + "9231.8571,0.0010,1s2p 3P1,1s2s 3S1\n24355.5421,0.0012,1s3p 3P1,1s2s 3S1\n"
                + "15123.6862,0.0015,1s3p 3P1,1s2p 3P1\n17013.7632,0.0010,1s3d 3D2,1s2p 3P1\n");
        return file;
    }

    private static Map<String, JsonNode> levels(String out) {
        Map<String, JsonNode> byLabel = new HashMap<>();
        for (JsonNode level : FitLevelsCommandTest.rows(out, "level")) {
            byLabel.put(level.get("level").asString(), level);
        }
        return byLabel;
    }

    @Test
    void withoutTheOptionTheRefusalNamesIt(@TempDir Path dir) throws IOException {
        CliTest.Run run = CliTest.run("fit-levels", lines(dir).toString(), "--reference", SINGLET);
        assertEquals(2, run.code());
        assertTrue(run.err().contains("4 levels are not connected to the reference level '1s2s 1S0'")
                && run.err().contains("'1s2s 3S1'") && run.err().contains("--separate-systems"), run.err());
    }

    /**
     * A loop of lines 1e7 times more precise than the one line joining it to the reference (the library's
     * PreciseGroupsTest), refused before as numerically singular, is fitted: each loop line's Ritz uncertainty
     * is sqrt(2/3) of the loop lines' 1e-8 cm-1 (the least-squares solution of a loop of equal weights, derived
     * there and checked with sympy), and the loose line alone sets B, so B keeps its 0.1 cm-1.
     */
    @Test
    void aPreciseLoopOnALooseLineIsFittedWithItsRitzUncertainties(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("loop.csv");
        Files.writeString(file, "# ritzwerk-measured-lines 1\n# position-unit: cm-1\nposition,uncertainty,upper,lower\n"
                + "100,0.1,B,A\n50,1e-8,C,B\n25,1e-8,D,C\n75.000000003,1e-8,D,B\n");
        CliTest.Run run = CliTest.run("fit-levels", file.toString(), "--reference", "A", "--format", "json");
        assertEquals(0, run.code(), run.err());
        assertFalse(run.err().contains("Exception"), run.err());
        List<JsonNode> lines = FitLevelsCommandTest.rows(run.out(), "line");
        assertEquals(4, lines.size());
        for (int k = 1; k <= 3; k++) {
            double u = lines.get(k).get("ritz_uncertainty_per_cm").asDouble();
            assertEquals(Math.sqrt(2.0 / 3) * 1e-8, u, 1e-9 * Math.sqrt(2.0 / 3) * 1e-8, lines.get(k).toString());
            assertEquals("fitted", lines.get(k).get("flag").asString());
        }
        assertEquals(0.1, lines.get(0).get("ritz_uncertainty_per_cm").asDouble(), 1e-12);
        assertEquals(0.1, levels(run.out()).get("B").get("uncertainty_per_cm").asDouble(), 1e-12);
        // a level list would give the loop lines' uncertainties from the levels' covariance, which cannot carry
        // them: refused naming the line, and no file written
        Path out = dir.resolve("levels.csv");
        CliTest.Run list = CliTest.run("fit-levels", file.toString(), "--reference", "A", "--species", "Fe I",
                "--levels-out", out.toString());
        assertEquals(2, list.code(), list.err());
        assertTrue(list.err().contains("line 2 (" + file + ":5): a level list cannot carry its Ritz uncertainty"),
                list.err());
        assertFalse(Files.exists(out) || list.err().contains("Exception"), list.err());
    }

    @Test
    void aFloatingSystemIsMarkedRelativeToItsLowestLevelAndAnAnchorMakesItAbsolute(@TempDir Path dir)
            throws IOException {
        Path file = lines(dir);
        CliTest.Run floating = CliTest.run("fit-levels", file.toString(), "--reference", SINGLET, "--format", "json",
                "--separate-systems");
        assertEquals(0, floating.code(), floating.err());
        assertEquals(2, FitLevelsCommandTest.rows(floating.out(), "fit").get(0).get("systems").asInt());
        List<JsonNode> systems = FitLevelsCommandTest.rows(floating.out(), "system");
        assertEquals("main", systems.get(0).get("standing").asString());
        assertEquals(TRIPLET, systems.get(1).get("reference").asString());
        assertEquals("floating", systems.get(1).get("standing").asString());
        assertEquals("+x2", systems.get(1).get("offset").asString());
        assertTrue(systems.get(1).get("reference_per_cm").isNull(), "no energy for a floating reference");
        assertTrue(floating.err().contains("note: system 2 (4 levels, no line to '1s2s 1S0') floats: its energies "
                + "are relative to '1s2s 3S1' (its lowest level), E = energy + x2 with x2 unknown"), floating.err());
        Map<String, JsonNode> relative = levels(floating.out());
        for (JsonNode level : relative.values()) {
            boolean triplet = level.get("level").asString().contains(" 3");
            assertEquals(triplet ? 2 : 1, level.get("system").asInt(), level.toString());
            assertEquals(triplet ? "+x2" : null, level.get("offset").isNull() ? null
                    : level.get("offset").asString(), level.toString());
        }
        assertEquals(0.0, relative.get(TRIPLET).get("energy_per_cm").asDouble(), 0.0);
        assertEquals(0.0, relative.get(TRIPLET).get("uncertainty_per_cm").asDouble(), 0.0);
        for (JsonNode line : FitLevelsCommandTest.rows(floating.out(), "line")) {
            assertEquals(line.get("upper").asString().contains(" 3") ? 2 : 1, line.get("system").asInt());
        }

        CliTest.Run anchored = CliTest.run("fit-levels", file.toString(), "--reference", SINGLET, "--format", "json",
                "--system-reference", TRIPLET + "@" + ANCHOR + " +- " + ANCHOR_U + " cm-1");
        assertEquals(0, anchored.code(), anchored.err());
        JsonNode system = FitLevelsCommandTest.rows(anchored.out(), "system").get(1);
        assertEquals("anchored", system.get("standing").asString());
        assertEquals(ANCHOR, system.get("reference_per_cm").asDouble(), 1e-9);
        assertEquals(ANCHOR_U, system.get("reference_uncertainty_per_cm").asDouble(), 1e-15);
        Map<String, JsonNode> absolute = levels(anchored.out());
        for (Map.Entry<String, JsonNode> e : relative.entrySet()) {
            JsonNode a = absolute.get(e.getKey());
            assertTrue(a.get("offset").isNull(), a.toString());
            double u = e.getValue().get("uncertainty_per_cm").asDouble();
            if (e.getKey().contains(" 3")) {
                // closed form: E = E_rel + anchor; u^2 = u_rel^2 + u_anchor^2 (the anchor independent of the lines)
                assertEquals(e.getValue().get("energy_per_cm").asDouble() + ANCHOR, a.get("energy_per_cm").asDouble(),
                        1e-8, e.getKey());
                assertEquals(Math.sqrt(u * u + ANCHOR_U * ANCHOR_U), a.get("uncertainty_per_cm").asDouble(), 1e-12,
                        e.getKey());
            } else {
                assertEquals(e.getValue().get("energy_per_cm").asDouble(), a.get("energy_per_cm").asDouble(), 1e-9);
                assertEquals(u, a.get("uncertainty_per_cm").asDouble(), 1e-15);
            }
        }
        // the Ritz wavenumbers and their uncertainties are differences within a system: the anchor changes none
        List<JsonNode> a = FitLevelsCommandTest.rows(anchored.out(), "line");
        List<JsonNode> f = FitLevelsCommandTest.rows(floating.out(), "line");
        for (int k = 0; k < a.size(); k++) {
            assertEquals(f.get(k).get("ritz_per_cm").asDouble(), a.get(k).get("ritz_per_cm").asDouble(), 1e-9);
            assertEquals(f.get(k).get("ritz_uncertainty_per_cm").asDouble(),
                    a.get(k).get("ritz_uncertainty_per_cm").asDouble(), 1e-12);
        }

        CliTest.Run text = CliTest.run("fit-levels", file.toString(), "--reference", SINGLET, "--separate-systems");
        assertEquals(0, text.code(), text.err());
        assertTrue(text.out().contains("2 systems of levels that no line joins"), text.out());
        assertTrue(text.out().contains("offset +xN: relative to system N's reference, E = energy + xN"), text.out());
        assertTrue(text.out().lines().anyMatch(l -> l.startsWith("level  1s2s 3S1") && l.contains("+x2")),
                text.out());
        CliTest.Run csv = CliTest.run("fit-levels", file.toString(), "--reference", SINGLET, "--separate-systems",
                "--format", "csv");
        assertTrue(csv.out().contains("kind,level,energy_per_cm,offset,uncertainty_per_cm,system"), csv.out());
        assertTrue(csv.out().contains("level,\"1s2s 3S1\",0.0,\"+x2\",0.0,2"), csv.out());
    }

    @Test
    void levelsOutWritesOnlyAbsoluteSystemsAndNamesTheOneLeftOut(@TempDir Path dir) throws IOException {
        Path file = lines(dir);
        Path out = dir.resolve("he-fit.csv");
        CliTest.Run floating = CliTest.run("fit-levels", file.toString(), "--reference", SINGLET, "--separate-systems",
                "--species", "He I", "--levels-out", out.toString());
        assertEquals(0, floating.code(), floating.err());
        String written = Files.readString(out);
        assertTrue(written.contains("1s3d 1D2") && !written.contains("3S1") && !written.contains("3P1"), written);
        assertTrue(floating.err().contains("note: --levels-out leaves out system 2 (4 levels relative to "
                + "'1s2s 3S1')"), floating.err());
        CliTest.Run anchored = CliTest.run("fit-levels", file.toString(), "--reference", SINGLET,
                "--system-reference", TRIPLET + "@" + ANCHOR + "(5) cm-1", "--species", "He I", "--levels-out",
                out.toString());
        assertEquals(0, anchored.code(), anchored.err());
        assertTrue(Files.readString(out).contains("1s3d 3D2"), Files.readString(out));
        assertFalse(anchored.err().contains("--levels-out leaves out"), anchored.err());
    }

    @Test
    void badSystemReferencesAreRefusedNamingTheOptionAndValue(@TempDir Path dir) throws IOException {
        Path file = lines(dir);
        String[][] cases = {
            {"1s4s 3S1", "--system-reference: system reference '1s4s 3S1' is not a level of any measured line"},
            {"1s2p 1P1", "--system-reference: system reference '1s2p 1P1' is joined by lines to the reference level "
                + "'1s2s 1S0'"},
            {SINGLET, "--system-reference: system reference '1s2s 1S0' is the reference level itself"},
            {TRIPLET + "@159855.9743 cm-1", "--system-reference '1s2s 3S1@159855.9743 cm-1': give the energy's "
                + "standard uncertainty"},
            {TRIPLET + "@500 nm", "--system-reference '1s2s 3S1@500 nm': the energy after '@' is an energy above "
                + "the ground level"},
            {"@5(1) cm-1", "--system-reference '@5(1) cm-1': needs a level label"},
            {TRIPLET + "@lots", "--system-reference '1s2s 3S1@lots': cannot read"}};
        for (String[] c : cases) {
            CliTest.Run run = CliTest.run("fit-levels", file.toString(), "--reference", SINGLET, "--system-reference",
                    c[0]);
            assertEquals(2, run.code(), c[0] + ": " + run.err());
            assertTrue(run.err().contains(c[1]), c[0] + ": " + run.err());
            assertFalse(run.err().contains("Exception"), run.err());
        }
        CliTest.Run two = CliTest.run("fit-levels", file.toString(), "--reference", SINGLET, "--system-reference",
                TRIPLET, "--system-reference", "1s3p 3P1");
        assertEquals(2, two.code());
        assertTrue(two.err().contains("--system-reference: system references '1s2s 3S1' and '1s3p 3P1' are in one "
                + "system (joined by lines); give one reference per system (lines of " + file + ")"), two.err());
    }

    /** A label with an '@' in it is named whole, alone or with an energy after a further '@'. */
    @Test
    void aLabelWithAnAtSignIsNamedWhole(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("at-lines.csv");
        Files.writeString(file, Files.readString(lines(dir)).replace(TRIPLET, "1s2s@3S1"));
        CliTest.Run floating = CliTest.run("fit-levels", file.toString(), "--reference", SINGLET,
                "--system-reference", "1s2s@3S1", "--format", "json");
        assertEquals(0, floating.code(), floating.err());
        assertTrue(floating.err().contains("1s2s@3S1"), floating.err());
        CliTest.Run anchored = CliTest.run("fit-levels", file.toString(), "--reference", SINGLET,
                "--system-reference", "1s2s@3S1@" + ANCHOR + "(5) cm-1", "--format", "json");
        assertEquals(0, anchored.code(), anchored.err());
        JsonNode system = FitLevelsCommandTest.rows(anchored.out(), "system").get(1);
        assertEquals("1s2s@3S1", system.get("reference").asString(), system.toString());
    }
}
