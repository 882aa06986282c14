package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.DataContext;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code levels} and {@code lines} on alkali atoms, their JSON checked against the library. */
class AlkaliCommandsTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    @Test
    void levelsSplitIntoHyperfineLevelsWithHyperfine() {
        CliTest.Run run = CliTest.run("levels", "--species", "Rb-87 I", "--n-max", "5", "--l-max", "1", "--hyperfine",
                "--format", "json");
        assertEquals(0, run.code(), run.err());
        JsonMapper json = JsonMapper.builder().build();
        double f1 = Double.NaN;
        double f2 = Double.NaN;
        int p32 = 0;
        for (String line : run.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            if (row.get("label").asString().equals("5s 2S1/2")) {
                if (row.get("hyperfine_f").asString().equals("1")) {
                    f1 = row.get("energy_per_cm").asDouble();
                } else if (row.get("hyperfine_f").asString().equals("2")) {
                    f2 = row.get("energy_per_cm").asDouble();
                    assertEquals(5, row.get("g").asInt(), line);
                }
            }
            p32 += row.get("label").asString().equals("5p 2P3/2") ? 1 : 0;
        }
        // The Rb-87 ground-state splitting, 6 834 682 610.904 Hz (Bize et al., Europhys. Lett. 45,
        // 558 (1999)), to 0.1 MHz; I = 3/2 and J = 3/2 give F' = 0 to 3.
        assertEquals(6834682610.904, (f2 - f1) * 100 * 299_792_458.0, 1e5, run.out());
        assertEquals(4, p32, run.out());
        CliTest.Run ions = CliTest.run("levels", "--species", "H", "--hyperfine");
        assertEquals(2, ions.code(), ions.err());
        assertTrue(ions.err().contains("--hyperfine has no effect for one-electron ions"), ions.err());
    }

    @Test
    void levelsOfRubidiumCarryTheIssueFields() {
        CliTest.Run run = CliTest.run("levels", "--species", "Rb-87 I", "--n-max", "80", "--format", "json");
        assertEquals(0, run.code(), run.err());
        AlkaliAtom rb = DataContext.builtIn().alkaliAtom(Species.parse("Rb-87 I"));
        int rows = 0;
        for (String line : run.out().split("\n")) {
            JsonNode node = JSON.readTree(line);
            State state = State.of(node.get("n").asInt(), node.get("l").asInt(),
                    (int) Math.round(2 * fraction(node.get("j").asString())));
            assertEquals(rb.energyPerCm(state), node.get("energy_per_cm").asDouble(), 1e-9, line);
            assertEquals("Rb-87 I", node.get("species").asString());
            rows++;
        }
        assertTrue(rows > 300, "rows " + rows);
        // 5s1/2 is the zero; D2 upper level 5p3/2 at 12 816.549 cm-1: the D2 line's centroid
        // frequency 384 230.484 468 5(62) GHz (J. Ye, S. Swartz, P. Jungner and J. L. Hall, Opt.
        // Lett. 21, 1280 (1996), as tabulated in D. A. Steck, Rubidium 87 D Line Data, rev. 2.1.5
        // (2015)) divided by c. Digits recalled (from memory); checked: c / nu = 780.241 210 nm,
        // the vacuum wavelength recalled independently from the same data sheet.
        assertTrue(run.out().contains("\"label\":\"5s 2S1/2\",\"n\":5,\"l\":0,\"j\":\"1/2\""), run.out());
        assertTrue(run.out().contains("\"energy_per_cm\":12816.5"), run.out());
    }

    @Test
    void oneTransitionInDetail() {
        CliTest.Run run = CliTest.run("lines", "--species", "Rb-87 I", "--transition", "50d5/2 -> 51p3/2",
                "--format", "json");
        assertEquals(0, run.code(), run.err());
        JsonNode node = JSON.readTree(run.out());
        AlkaliAtom rb = DataContext.builtIn().alkaliAtom(Species.parse("Rb-87 I"));
        State d = State.parse("50d5/2");
        State p = State.parse("51p3/2");
        assertEquals(Math.abs(rb.frequencyHz(p, d)), node.get("frequency_hz").asDouble(), 1);
        assertEquals(rb.reducedDipole(d, p), node.get("reduced_dipole_ea0").asDouble(), 1e-9);
        assertEquals(rb.radiativeLifetime(d), node.get("upper_lifetime_s").asDouble(), 1e-15);
        assertEquals(rb.effectiveLifetime(p, 300), node.get("lower_effective_lifetime_s").asDouble(), 1e-15);
        assertTrue(node.get("air_wavelength_nm").isNull(), "no air wavelength at 17 GHz");
    }

    @Test
    void theLadderWavelengths() {
        CliTest.Run run = CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,60s1/2", "--format",
                "csv");
        assertEquals(0, run.code(), run.err());
        String[] rows = run.out().split("\n");
        assertEquals("species,step,from,to,vacuum_wavelength_nm,air_wavelength_nm,frequency_hz,uncertainty_hz",
                rows[0]);
        // Rb D2, 780.241 nm in vacuum (D. A. Steck, Rubidium 87 D Line Data, rev. 2.1.5 (2015):
        // 780.241 209 686 nm; digits recalled, from memory; checked: c divided by the D2 frequency
        // 384 230.484 468 5 GHz of Ye et al., Opt. Lett. 21, 1280 (1996), gives the same digits).
        assertEquals(780.241, Double.parseDouble(rows[1].split(",")[4]), 0.001);
        assertTrue(Double.parseDouble(rows[2].split(",")[4]) > 479 && Double.parseDouble(rows[2].split(",")[4]) < 481);
    }

    @Test
    void linesInAMicrowaveWindowComeFromTheModel() {
        CliTest.Run run = CliTest.run("lines", "--species", "Rb-87 I", "--from", "16.9GHz", "--to", "17.2GHz",
                "--n-max", "55", "--format", "json");
        assertEquals(0, run.code(), run.err());
        AlkaliAtom rb = DataContext.builtIn().alkaliAtom(Species.parse("Rb-87 I"));
        boolean found = false;
        for (String line : run.out().split("\n")) {
            JsonNode node = JSON.readTree(line);
            double hz = node.get("frequency_hz").asDouble();
            assertTrue(hz >= 16.9e9 && hz <= 17.2e9, line);
            State upper = State.parse(node.get("upper").asString().replace(" 2", "").replaceAll("[SPDF]", ""));
            State lower = State.parse(node.get("lower").asString().replace(" 2", "").replaceAll("[SPDF]", ""));
            assertEquals(rb.einsteinA(upper, lower), node.get("einstein_a_per_s").asDouble(), 1e-12);
            found |= node.get("upper").asString().equals("50d 2D5/2") && node.get("lower").asString().equals("51p 2P3/2");
        }
        assertTrue(found, run.out());
    }

    @Test
    void identifyFindsTheAlkaliResonanceLines(@TempDir java.nio.file.Path dir) throws java.io.IOException {
        // Rb D2 780.241 nm, Rb D1 794.979 nm and Cs D2 852.347 nm in vacuum, as a spectrometer
        // reading vacuum wavelengths would give them: D. A. Steck, Rubidium 87 D Line Data, rev.
        // 2.1.5 (2015), 780.241 209 686 and 794.978 851 156 nm, and Cesium D Line Data, rev. 2.1.4
        // (2010), 852.347 275 82 nm. Digits recalled (from memory); checked: each equals c divided
        // by the line frequency recalled from the same sheets (384 230.484 468 5, 377 107.463 380
        // and 351 725.718 50 GHz) to all digits shown.
        java.nio.file.Path peaks = dir.resolve("alkali-peaks.csv");
        java.nio.file.Files.writeString(peaks, "# ritzwerk-peaks 1\n# id: alkali-test\n# title: D lines\n"
                + "# source: Steck, Rubidium 87 and Cesium D Line Data (digits recalled)\n"
                + "# provenance: from-memory\n# version: 1\n# position-unit: nm\n"
                + "# medium: vacuum\nposition,uncertainty\n780.241,0.002\n794.979,0.002\n852.347,0.002\n");
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "Rb-87 I,Cs I", "--n-max", "12",
                "--format", "json");
        assertEquals(0, run.code(), run.err());
        String[] rows = run.out().split("\n");
        assertEquals(3, rows.length, run.out());
        String[] expected = {"5p 2P3/2 - 5s 2S1/2", "5p 2P1/2 - 5s 2S1/2", "6p 2P3/2 - 6s 2S1/2"};
        String[] species = {"Rb-87 I", "Rb-87 I", "Cs-133 I"};
        for (int i = 0; i < 3; i++) {
            JsonNode node = JSON.readTree(rows[i]);
            assertEquals("matched", node.get("status").asString(), rows[i]);
            assertEquals(species[i], node.get("species").asString(), rows[i]);
            assertEquals(expected[i], node.get("transition").asString(), rows[i]);
        }
    }

    @Test
    void clearErrors() {
        assertTrue(CliTest.run("lines", "--species", "Rb-87 I", "--transition", "50d5/2 -> 51d5/2").err()
                .contains("are not joined by an electric-dipole line"));
        assertTrue(CliTest.run("lines", "--species", "H I", "--transition", "2p1/2 -> 1s1/2").err()
                .contains("--transition needs exactly one alkali atom"));
        assertTrue(CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2").err()
                .contains("--ladder takes three states"));
        // steps that are not electric-dipole lines were printed; states out of order were an internal error
        for (String[] bad : new String[][] {{"5s1/2,5p1/2,50d5/2", "the step 5p 2P1/2 -> 50d 2D5/2 is not an"},
            {"5s1/2,5p3/2,50p3/2", "the step 5p 2P3/2 -> 50p 2P3/2"}, {"5s1/2,5d5/2,50p3/2", "the step 5s 2S1/2 -> "},
            {"5p3/2,5s1/2,6p3/2", "a ladder needs ascending energies"}, {"5s1/2,5p3/2,5p3/2", "is not an electric"}}) {
            CliTest.Run run = CliTest.run("lines", "--species", "Rb-87 I", "--ladder", bad[0]);
            assertEquals(2, run.code(), bad[0] + ": " + run.err());
            assertTrue(run.err().startsWith("ritzwerk lines: --ladder: ") && run.err().contains(bad[1]), run.err());
        }
        assertTrue(CliTest.run("levels", "--species", "Fe I").err()
                .contains("levels and lines cover one-electron ions"));
        assertTrue(CliTest.run("lines", "--species", "Rb-87 I").err().contains("give --from and --to"));
        CliTest.Run low = CliTest.run("lines", "--species", "Rb-87 I", "--transition", "2p3/2 -> 3s1/2");
        assertEquals(2, low.code());
        assertTrue(low.err().contains("2p"), low.err());
    }

    private static double fraction(String text) {
        String[] parts = text.split("/");
        return parts.length == 1 ? Double.parseDouble(parts[0]) : Double.parseDouble(parts[0]) / Double.parseDouble(parts[1]);
    }
}
