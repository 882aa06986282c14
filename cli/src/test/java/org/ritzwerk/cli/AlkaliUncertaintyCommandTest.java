package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.DataContext;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The alkali uncertainty columns of {@code levels} and {@code lines}: uncertainty_per_cm,
 * uncertainty_hz and uncertainty_nm, filled from the library, null (never 0 or NaN) where not
 * estimated, with a note on standard error.
 */
class AlkaliUncertaintyCommandTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();
    private static final DataContext DATA = DataContext.builtIn();

    @Test
    void ladderStepsCarryTheirFrequencyUncertainty() {
        CliTest.Run run = CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,60d5/2", "--format",
                "json");
        assertEquals(0, run.code(), run.err());
        AlkaliAtom rb = DATA.alkaliAtom(Species.parse("Rb-87 I"));
        String[] rows = run.out().strip().split("\\R");
        JsonNode first = JSON.readTree(rows[0]);
        JsonNode second = JSON.readTree(rows[1]);
        // D2: the 6.2 kHz of the measured centroid (d-lines.csv: Ye et al. 1996, from memory)
        assertEquals(6200.0, first.get("uncertainty_hz").asDouble(), 1e-6, rows[0]);
        assertEquals(rb.frequencyUncertaintyHz(State.parse("5p3/2"), State.parse("60d5/2")).getAsDouble(),
                second.get("uncertainty_hz").asDouble(), 0.0, rows[1]);
        CliTest.Run text = CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,60d5/2");
        assertTrue(text.out().lines().findFirst().orElseThrow().endsWith("u Hz"), text.out());
    }

    @Test
    void transitionShowsFrequencyAndWavelengthUncertainty() {
        CliTest.Run run = CliTest.run("lines", "--species", "Cs-133 I", "--transition", "6s1/2 -> 40p3/2", "--format",
                "csv");
        assertEquals(0, run.code(), run.err());
        String[] lines = run.out().strip().split("\\R");
        java.util.List<String> header = java.util.List.of(lines[0].split(","));
        String[] row = lines[1].split(",");
        AlkaliAtom cs = DATA.alkaliAtom(Species.parse("Cs-133 I"));
        double u = cs.frequencyUncertaintyHz(State.parse("6s1/2"), State.parse("40p3/2")).getAsDouble();
        double nu = cs.frequencyHz(State.parse("6s1/2"), State.parse("40p3/2"));
        assertEquals(u, Double.parseDouble(row[header.indexOf("uncertainty_hz")]), 0.0);
        assertEquals(299_792_458.0 * u / (nu * nu) * 1e9, Double.parseDouble(row[header.indexOf("uncertainty_nm")]),
                1e-12 * 299_792_458.0 * u / (nu * nu) * 1e9);
    }

    /**
     * Formula levels near their series' edge carry a note wherever they are printed (AlkaliAtom.seriesEdge;
     * Rb-87 10s misses the tabulated level by 9 stated uncertainties), and levels further up do not; a ladder
     * step without a frequency uncertainty says why.
     */
    @Test
    void formulaLevelsNearTheEdgeAreNotedAndAMissingLadderUncertaintyIsSaid() {
        CliTest.Run near = CliTest.run("lines", "--species", "Rb-87 I", "--transition", "10s1/2 -> 5p3/2");
        assertEquals(0, near.code(), near.err());
        assertTrue(near.err().contains("note: Rb-87 I 10s 2S1/2 (valid from n = 10): Rydberg-Ritz formula level(s)"
                + " fewer than 4 n above their series' lowest valid n"), near.err());
        CliTest.Run far = CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,60s1/2");
        assertEquals(0, far.code(), far.err());
        // every number's source is named (the data files' own source texts)
        assertTrue(far.err().contains("note: Rb-87 I sources: 5p 2P3/2 energy: d-lines: D2 centroid "
                + "384230484.4685(0.0062) MHz, J. Ye") && far.err().contains("60s 2S1/2 energy: Rydberg-Ritz formula "
                + "of quantum-defects-rb-87 (from memory: J. Han"), far.err());
        assertTrue(near.err().contains("5p 2P3/2 - 10s 2S1/2 dipole element: Coulomb approximation (computed; no "
                + "published element listed)"), near.err());
        CliTest.Run d2 = CliTest.run("lines", "--species", "Rb-87 I", "--transition", "5p3/2 -> 5s1/2");
        assertTrue(d2.err().contains("5s 2S1/2 - 5p 2P3/2 dipole element: deduced from the lifetime 26.20 ns of "
                + "5p3/2: S. Aubin"), d2.err());
        CliTest.Run hyperfine = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--format", "json");
        assertTrue(hyperfine.err().contains("note: Rb-87 I sources: D1 centroid: M. Maric") && hyperfine.err()
                .contains("5s 2S1/2 A, B: S. Bize") && hyperfine.err().contains("(from-memory)"), hyperfine.err());
        assertFalse(far.err().contains("lowest valid n") || far.err().contains("u Hz: not estimated"), far.err());
        CliTest.Run levels = CliTest.run("levels", "--species", "Rb-87 I", "--n-max", "14", "--l-max", "0");
        assertEquals(0, levels.code(), levels.err());
        assertTrue(levels.err().contains("note: Rb-87 I: 4 level(s) (10s 2S1/2, 11s 2S1/2, 12s 2S1/2, 13s 2S1/2) are "
                + "Rydberg-Ritz formula level(s)"), levels.err());
        // Li-7 s: no stated defect uncertainty and no measured level above valid-from-n to derive one from
        CliTest.Run li = CliTest.run("lines", "--species", "Li-7 I", "--ladder", "2s1/2,2p3/2,30s1/2", "--format",
                "json");
        assertEquals(0, li.code(), li.err());
        assertTrue(li.err().contains("note: u Hz: not estimated ('-', null in JSON) for a step with a level whose "
                + "energy has no stated uncertainty (30s 2S1/2)"), li.err());
    }

    /**
     * Na 30s: no paper states its defects' or its limit's uncertainty; the residual-derived ones (from-residuals,
     * check R of fit-residuals.txt: u(d0) = 1.1e-5 from the s levels' residuals, 1.026e-4 cm-1 at 30s; the
     * limit's 0.039 cm-1, check R limit) give sqrt(1.026e-4^2 + 0.039^2) = 0.0390001 cm-1. Before, the row
     * printed null.
     */
    @Test
    void sodiumRydbergLevelsCarryTheResidualDerivedUncertainty() {
        CliTest.Run run = CliTest.run("levels", "--species", "Na-23 I", "--n-max", "30", "--l-max", "0", "--format",
                "json");
        assertEquals(0, run.code(), run.err());
        JsonNode s30 = null;
        for (String line : run.out().strip().split("\\R")) {
            JsonNode node = JSON.readTree(line);
            assertFalse(node.get("uncertainty_per_cm").isNull(), line);
            if (node.get("label").asString().startsWith("30s")) {
                s30 = node;
            }
        }
        assertTrue(s30 != null, run.out());
        assertEquals(Math.hypot(1.0264e-4, 0.039), s30.get("uncertainty_per_cm").asDouble(), 1e-9, s30.toString());
        assertFalse(run.err().contains("u cm-1 is not estimated"), run.err());
    }

    @Test
    void notEstimatedIsNullAndSaid() {
        // Li-7 s: no uncertainty stated for the quantum defects of Goy et al. 1986, none derivable (no measured
        // level at n >= valid-from-n = 10)
        CliTest.Run run = CliTest.run("levels", "--species", "Li-7 I", "--n-max", "30", "--l-max", "0", "--format",
                "json");
        assertEquals(0, run.code(), run.err());
        boolean sawNull = false;
        boolean sawValue = false;
        for (String line : run.out().strip().split("\\R")) {
            JsonNode node = JSON.readTree(line);
            JsonNode u = node.get("uncertainty_per_cm");
            assertTrue(u != null, line);
            if (u.isNull()) {
                sawNull = true;
                assertEquals("quantum-defect-fit", node.get("model").asString(), line);
            } else {
                sawValue = true;
                assertTrue(u.asDouble() >= 0 && Double.isFinite(u.asDouble()), line);
            }
        }
        assertTrue(sawNull && sawValue, run.out());
        assertTrue(run.err().contains("u cm-1 is not estimated"), run.err());
        CliTest.Run lines = CliTest.run("lines", "--species", "Li-7 I", "--from", "225nm", "--to", "240nm",
                "--n-max", "30", "--l-max", "1", "--format", "csv");
        assertEquals(0, lines.code(), lines.err());
        assertTrue(lines.out().lines().findFirst().orElseThrow().contains("uncertainty_nm"), lines.out());
        assertTrue(lines.err().contains("u nm is not estimated"), lines.err());
        assertTrue(!lines.out().contains("NaN"), lines.out());
    }

    /**
     * Cs 7p lifetimes come out 12 and 15 % short of measurement (about 133 and 155 ns, from memory;
     * rydberg/lifetime-checks.csv) while their stated u is 3-4 %: levels --lifetimes
     * and lines --transition say so on standard error; Rb, whose listed lifetimes are met, gets no such note.
     */
    @Test
    void aLifetimeKnownToMissItsMeasurementIsNoted() {
        CliTest.Run cs = CliTest.run("levels", "--species", "Cs I", "--n-max", "8", "--l-max", "1", "--lifetimes",
                "--temperature", "300");
        assertEquals(0, cs.code(), cs.err());
        assertTrue(cs.err().contains("note: Cs-133 I 7p3/2: the computed lifetime 116.9 +- 3.9 ns (0 K) is 12 % short "
                + "of the measured 133 ns"), cs.err());
        assertTrue(cs.err().contains("note: Cs-133 I 7p1/2: the computed lifetime 131.4 +- 5.1 ns (0 K) is 15 % short "
                + "of the measured 155 ns"), cs.err());
        assertFalse(cs.out().contains("note"), cs.out());
        // a list without 7p (l = 0 only) has no such note
        CliTest.Run s = CliTest.run("levels", "--species", "Cs I", "--n-max", "8", "--l-max", "0", "--lifetimes");
        assertFalse(s.err().contains("lifetime-checks"), s.err());
        CliTest.Run rb = CliTest.run("levels", "--species", "Rb-87 I", "--n-max", "8", "--lifetimes");
        assertEquals(0, rb.code(), rb.err());
        assertFalse(rb.err().contains("lifetime-checks"), rb.err());
        CliTest.Run line = CliTest.run("lines", "--species", "Cs-133 I", "--transition", "6s1/2 -> 7p3/2");
        assertEquals(0, line.code(), line.err());
        assertTrue(line.err().contains("note: Cs-133 I 7p3/2: the computed lifetime"), line.err());
    }
}
