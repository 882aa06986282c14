package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.refdata.NuclearData;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code levels} and {@code lines} end to end: JSON output parsed and checked against the library. */
class LevelsAndLinesCommandTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    private static List<JsonNode> json(CliTest.Run run) {
        assertEquals(0, run.code(), run.err());
        List<JsonNode> nodes = new ArrayList<>();
        for (String line : run.out().strip().split("\\R")) {
            nodes.add(JSON.readTree(line));
        }
        return nodes;
    }

    @Test
    void levelsOfHydrogenInJson() {
        List<JsonNode> levels = json(CliTest.run("levels", "--species", "H I", "--n-max", "2", "--format", "json"));
        assertEquals(4, levels.size());
        JsonNode twoS = levels.get(1);
        assertEquals("H I", twoS.get("species").asString());
        assertEquals("2s 2S1/2", twoS.get("label").asString());
        assertEquals(2, twoS.get("n").asInt());
        assertEquals(0, twoS.get("l").asInt());
        assertEquals("1/2", twoS.get("j").asString());
        assertEquals("qed", twoS.get("model").asString());
        assertTrue(twoS.get("hyperfine_f").isNull());
        // A. E. Kramida, At. Data Nucl. Data Tables 96, 586 (2010): 2s 2S1/2 at 82258.9543992821
        // cm-1 (digits recalled; checked in PublishedHydrogenTest, which names the checks).
        assertEquals(82258.9543992821, twoS.get("energy_per_cm").asDouble(), 1e-4);
        assertEquals(0.0, levels.get(0).get("energy_per_cm").asDouble(), 0.0);
    }

    @Test
    void lifetimesOnRequest() {
        List<JsonNode> levels = json(CliTest.run("levels", "--species", "H", "--n-max", "2", "--lifetimes",
                "--format", "json"));
        assertTrue(levels.get(0).get("lifetime_s").isNull(), "1s has no decay");
        // 2p: 1/A with A = 6.2649e8 s^-1 (Wiese & Fuhr 2009): 1.596 ns.
        assertEquals(1.596e-9, levels.get(2).get("lifetime_s").asDouble(), 1e-12);      // Wiese & Fuhr 2009
        assertTrue(json(CliTest.run("levels", "--species", "H", "--n-max", "1", "--format", "json")).get(0)
                .get("lifetime_s") == null, "no lifetime field unless asked");
        // 2s: its two-photon decay, 0.1216 s (from memory); it was 1.25e9 s from the E1 branch alone.
        assertEquals(0.1216, levels.get(1).get("lifetime_s").asDouble(), 1e-4);
    }

    /**
     * Heavy ions take the dirac model with a note (the qed model's Z alpha expansion of the
     * self-energy fails above Z = 30); an ion whose nucleus lacks the datum qed needs is refused
     * as bad input, not an internal error.
     */
    @Test
    void heavyIonsAndMissingNuclearDataAreSaidPlainly() {
        CliTest.Run heavy = CliTest.run("levels", "--species", "U XCII", "--n-max", "1", "--format", "json");
        assertEquals(0, heavy.code(), heavy.err());
        assertEquals("dirac", json(heavy).get(0).get("model").asString());
        assertTrue(heavy.err().contains("note: levels: U XCII takes the dirac model: the qed model covers Z <= 30"),
                heavy.err());
        CliTest.Run sulphur = CliTest.run("levels", "--species", "S-33 XVI", "--n-max", "1");
        assertEquals(2, sulphur.code(), sulphur.err());
        assertTrue(sulphur.err().contains("S-33 XVI: the qed tier needs the nuclear charge radius of S-33"),
                sulphur.err());
    }

    @Test
    void linesInAnAirWindowMatchTheLibrary() {
        List<JsonNode> lines = json(CliTest.run("lines", "--species", "H I", "--from", "650 nm air", "--to",
                "660 nm air", "--multiplets", "--format", "json"));
        assertEquals(1, lines.size());
        JsonNode alpha = lines.get(0);
        assertEquals("Balmer alpha", alpha.get("line").asString());
        assertEquals("n=3", alpha.get("upper").asString());
        assertEquals("n=2", alpha.get("lower").asString());
        LineTable expected = HydrogenLikeLines.of(HydrogenLikeModel.of(
                NuclearData.builtIn().nucleus(Species.parse("H I")), Tier.QED)).multiplets(3, 4e14, 5e14);
        assertEquals(expected.frequency(0), alpha.get("frequency_hz").asDouble(), 0.0);
        assertEquals(expected.einsteinA(0), alpha.get("einstein_a_per_s").asDouble(), 0.0);
        // Commonly quoted H-alpha: 656.28 nm in air, 656.46 nm in vacuum (common practice; the
        // handbook's strong-lines table gives 6562.79 A in air), 1 / 656.461 nm = 15 233.2 cm-1 by hand.
        assertEquals(656.28, alpha.get("air_wavelength_nm").asDouble(), 0.005);
        assertEquals(656.46, alpha.get("vacuum_wavelength_nm").asDouble(), 0.005);
        assertEquals(15233.2, alpha.get("wavenumber_per_cm").asDouble(), 0.05);
    }

    @Test
    void airIsNullOutsideTheStandardAirRange() {
        List<JsonNode> lyman = json(CliTest.run("lines", "--species", "H I", "--from", "120 nm", "--to", "125 nm",
                "--format", "json"));
        assertEquals(2, lyman.size());
        assertTrue(lyman.get(0).get("air_wavelength_nm").isNull());
        // Lyman alpha 1215.67 A in vacuum (Sansonetti & Martin handbook, H I strong lines; recalled;
        // 1 / 82 259.163 cm-1, the 2p level of Kramida 2010 weighted by 2j + 1, gives 121.5670 nm).
        assertEquals(121.567, lyman.get(0).get("vacuum_wavelength_nm").asDouble(), 0.001);
    }

    @Test
    void csvAndTableCarryTheSameLines() {
        CliTest.Run csv = CliTest.run("lines", "--species", "H I,He II", "--from", "400 nm air", "--to", "700 nm air",
                "--multiplets", "--n-max", "12", "--min-a", "1e5", "--format", "csv");
        assertEquals(0, csv.code(), csv.err());
        String[] rows = csv.out().strip().split("\\R");
        assertTrue(rows[0].startsWith("species,upper,lower,line,vacuum_wavelength_nm,air_wavelength_nm"), rows[0]);
        CliTest.Run text = CliTest.run("lines", "--species", "H I,He II", "--from", "400 nm air", "--to", "700 nm air",
                "--multiplets", "--n-max", "12", "--min-a", "1e5");
        assertEquals(rows.length, text.out().strip().split("\\R").length);
        assertTrue(text.out().contains("He II") && text.out().contains("Balmer alpha"), text.out());
        // He II is named by wavelength and shells (He II 4686, the 4-3 line), never by hydrogen's series.
        assertTrue(csv.out().contains("\"He II\",n=4,n=3,\"4686 (4-3)\","), csv.out());
        assertTrue(csv.out().lines().filter(row -> row.startsWith("\"He II\""))
                .noneMatch(row -> row.matches(".*(Lyman|Balmer|Paschen|Brackett|Pfund|Humphreys).*")), csv.out());
    }

    @Test
    void refusesWhatItCannotDo() {
        // He I has a built-in level list now (its Ritz lines: LevelSetCommandsTest); Ne I has none
        CliTest.Run neon = CliTest.run("lines", "--species", "Ne I", "--from", "400 nm", "--to", "700 nm");
        assertEquals(2, neon.code());
        assertEquals("ritzwerk lines: Ne I: levels and lines cover one-electron ions (H I, D I, He II, C VI, ...), "
                + "the neutral alkali atoms [Li-6 I, Li-7 I, Na-23 I, K-39 I, K-40 I, K-41 I, Rb-85 I, Rb-87 I, "
                + "Cs-133 I]"
                + " and the species with a level list [He I, Sr-88 I]; another species needs a level list of your own "
                + "(ritzwerk-levels format) with --data",
                neon.err().strip());
        CliTest.Run isotope = CliTest.run("levels", "--species", "Fe-60 XXVI");
        assertEquals(2, isotope.code());
        assertTrue(isotope.err().contains("no nuclear data for Fe-60"), isotope.err());
        CliTest.Run model = CliTest.run("levels", "--species", "H", "--model", "exact");
        assertEquals(2, model.code());
        assertTrue(model.err().contains("unknown level model 'exact'; known: bohr, dirac, qed, hyperfine"), model.err());
        CliTest.Run window = CliTest.run("lines", "--species", "H", "--from", "400 nm", "--to", "400 nm");
        assertEquals(2, window.code());
        assertTrue(window.err().contains("give a window"), window.err());
    }

    /** A ladder says that its steps join fine-structure centroids and where the hyperfine components are. */
    @Test
    void aLadderSaysItsStepsAreCentroids() {
        CliTest.Run run = CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,50s1/2");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("780.241210"), run.out());
        assertTrue(run.err().contains("note: --ladder: the steps join fine-structure centroids; hyperfine structure "
                + "is left out") && run.err().contains("ritzwerk lines --species \"Rb-87 I\" --hyperfine"), run.err());
        assertTrue(CliTest.run("lines", "--help").out().contains("fine-structure centroids"));
    }

    /**
     * 0 K is a black-body temperature (none): the library took it, the command now does too, and the effective
     * lifetime there is the spontaneous one; below 0 is still refused.
     */
    @Test
    void zeroKelvinIsNoBlackBodyRadiation() {
        CliTest.Run transition = CliTest.run("lines", "--species", "Rb-87 I", "--transition", "50d5/2 -> 51p3/2",
                "--temperature", "0", "--format", "json");
        assertEquals(0, transition.code(), transition.err());
        JsonNode row = new JsonMapper().readTree(transition.out().strip());
        assertEquals(row.get("upper_lifetime_s").asDouble(), row.get("upper_effective_lifetime_s").asDouble());
        assertEquals(row.get("lower_lifetime_s").asDouble(), row.get("lower_effective_lifetime_s").asDouble());
        // the effective lifetimes' uncertainties are the spontaneous ones at 0 K, and stated at 300 K
        assertEquals(row.get("uncertainty_upper_lifetime_s").asDouble(),
                row.get("uncertainty_upper_effective_lifetime_s").asDouble());
        assertEquals(row.get("uncertainty_lower_lifetime_s").asDouble(),
                row.get("uncertainty_lower_effective_lifetime_s").asDouble());
        CliTest.Run warm = CliTest.run("lines", "--species", "Rb-87 I", "--transition", "50d5/2 -> 51p3/2",
                "--format", "json");
        JsonNode warmRow = new JsonMapper().readTree(warm.out().strip());
        double u = warmRow.get("uncertainty_upper_effective_lifetime_s").asDouble();
        assertTrue(u > 0 && u < 0.2 * warmRow.get("upper_effective_lifetime_s").asDouble(), warmRow.toString());
        CliTest.Run levels = CliTest.run("levels", "--species", "Rb-87 I", "--n-max", "6", "--l-max", "0",
                "--lifetimes", "--temperature", "0", "--format", "json");
        assertEquals(0, levels.code(), levels.err());
        JsonNode six = new JsonMapper().readTree(levels.out().lines().reduce((a, b) -> b).orElseThrow());
        assertEquals(six.get("lifetime_s").asDouble(), six.get("effective_lifetime_s").asDouble(), six.toString());
        // and its uncertainty is the spontaneous one (the model spread: AlkaliAtom.effectiveLifetimeUncertainty)
        assertEquals(six.get("uncertainty_lifetime_s").asDouble(), six.get("uncertainty_effective_lifetime_s")
                .asDouble(), 1e-6 * six.get("lifetime_s").asDouble(), six.toString());
        CliTest.Run cold = CliTest.run("levels", "--species", "Rb-87 I", "--lifetimes", "--temperature", "-1");
        assertEquals(2, cold.code());
        assertTrue(cold.err().contains("a temperature from 0 (no black-body radiation) to below 1e5 K"), cold.err());
    }

    /**
     * lines --transition states the uncertainty of a dipole element, its A and the lifetimes where published
     * elements decide them: Rb 5p3/2, 26.20(9) ns (S. Aubin et al., Phys. Rev. A 70, 042504 (2004), the
     * built-in row's source); Cs 6p3/2 30.462(46) ns (B. M. Patterson et al., Phys. Rev. A 91, 012506
     * (2015)). A Rydberg line's computed element has none: null, with a note.
     */
    @Test
    void aTransitionStatesTheUncertaintyOfPublishedElementsAndSaysWhereThereIsNone() {
        CliTest.Run d2 = CliTest.run("lines", "--species", "Rb-87 I", "--transition", "5s1/2 -> 5p3/2", "--format",
                "json");
        assertEquals(0, d2.code(), d2.err());
        JsonNode row = new JsonMapper().readTree(d2.out().strip());
        assertEquals(26.20e-9, row.get("upper_lifetime_s").asDouble(), 1e-13);
        assertEquals(0.09e-9, row.get("uncertainty_upper_lifetime_s").asDouble(), 1e-15);
        // A = 1 / tau for the level's only channel, so u(A) / A = u(tau) / tau
        assertEquals(0.09 / 26.20, row.get("uncertainty_einstein_a_per_s").asDouble()
                / row.get("einstein_a_per_s").asDouble(), 1e-9);
        assertEquals(0.5 * 0.09 / 26.20, row.get("uncertainty_reduced_dipole_ea0").asDouble()
                / Math.abs(row.get("reduced_dipole_ea0").asDouble()), 1e-9);
        assertTrue(row.get("uncertainty_lower_lifetime_s").isNull(), row.toString());
        assertTrue(!d2.err().contains("not estimated"), d2.err());
        CliTest.Run cs = CliTest.run("lines", "--species", "Cs-133 I", "--transition", "6p3/2 -> 5d5/2", "--format",
                "json");
        JsonNode csRow = new JsonMapper().readTree(cs.out().strip());
        assertEquals(0.046e-9, csRow.get("uncertainty_lower_lifetime_s").asDouble(), 1e-15, csRow.toString());
        CliTest.Run rydberg = CliTest.run("lines", "--species", "Rb-87 I", "--transition", "50d5/2 -> 51p3/2",
                "--format", "json");
        JsonNode far = new JsonMapper().readTree(rydberg.out().strip());
        // computed elements: the spread between the Coulomb approximation and the model potential
        // (AlkaliAtom.withModelSpread; LifetimeModelSpreadTest in refdata holds it to measurements)
        for (String field : new String[] {"uncertainty_reduced_dipole_ea0", "uncertainty_einstein_a_per_s",
            "uncertainty_upper_lifetime_s", "uncertainty_lower_lifetime_s"}) {
            assertTrue(far.get(field).isNumber() && far.get(field).asDouble() > 0, field + " " + far);
        }
        // at 0 K the spread is about 8 % of a Rydberg d lifetime (50d5/2) and 22 % of a p one (51p3/2) (README)
        assertEquals(0.082, far.get("uncertainty_upper_lifetime_s").asDouble()
                / far.get("upper_lifetime_s").asDouble(), 0.01, far.toString());
        assertEquals(0.22, far.get("uncertainty_lower_lifetime_s").asDouble()
                / far.get("lower_lifetime_s").asDouble(), 0.02, far.toString());
        assertTrue(!rydberg.err().contains("u e a0") && !rydberg.err().contains("u tau_u s"), rydberg.err());
    }

    /**
     * levels --lifetimes states a lifetime's uncertainty where published elements decide it: Rb 5p3/2 26.20(9) ns
     * (S. Aubin et al., Phys. Rev. A 70, 042504 (2004), the built-in row's source); for 6s (computed channels) the
     * model spread, 2.8 ns of 47.7 ns, which covers the measured 45.57(17) ns (E. Gomez et al., Phys. Rev. A 72,
     * 012502 (2005); from memory), and no note; one-electron ions keep their columns.
     */
    @Test
    void levelsStateTheLifetimeUncertaintyWherePublishedElementsDecideIt() {
        CliTest.Run rb = CliTest.run("levels", "--species", "Rb-87 I", "--n-max", "6", "--l-max", "1", "--lifetimes",
                "--format", "json");
        assertEquals(0, rb.code(), rb.err());
        java.util.Map<String, JsonNode> rows = new java.util.HashMap<>();
        for (String line : rb.out().strip().split("\\R")) {
            JsonNode row = new JsonMapper().readTree(line);
            rows.put(row.get("label").asString(), row);
        }
        assertEquals(0.09e-9, rows.get("5p 2P3/2").get("uncertainty_lifetime_s").asDouble(), 1e-15);
        assertEquals(0.04e-9, rows.get("5p 2P1/2").get("uncertainty_lifetime_s").asDouble(), 1e-15);
        JsonNode s6 = rows.get("6s 2S1/2");
        assertEquals(2.80e-9, s6.get("uncertainty_lifetime_s").asDouble(), 0.01e-9, s6.toString());
        double gap = Math.abs(s6.get("lifetime_s").asDouble() - 45.57e-9);
        assertTrue(gap < 2 * s6.get("uncertainty_lifetime_s").asDouble(), s6.toString());
        assertTrue(!rb.err().contains("u lifetime s is not estimated"), rb.err());
        CliTest.Run h = CliTest.run("levels", "--species", "H I", "--n-max", "2", "--lifetimes", "--format", "json");
        assertTrue(!h.out().contains("uncertainty_lifetime_s"), h.out());
    }

    /** levels --help says what --lifetimes gives 2s: its two-photon and M1 decays are included (0.1216 s in H). */
    @Test
    void theLifetimesHelpSaysTwoPhotonDecayOf2sIsIncluded() {
        String help = CliTest.run("levels", "--help").out().replaceAll("\\s+", " ");
        assertTrue(help.contains("its two-photon and magnetic-dipole decays to 1s (0.1216 s in H)")
                && !help.contains("which is not included"), help);
        CliTest.Run h = CliTest.run("levels", "--species", "H I", "--n-max", "2", "--lifetimes", "--model", "bohr",
                "--format", "json");
        assertEquals(0, h.code(), h.err());
        JsonNode twoS = new JsonMapper().readTree(h.out().lines().skip(1).findFirst().orElseThrow());
        // 1 / (8.2245 s^-1) for hydrogen's two-photon decay (README, from memory): 0.1216 s
        assertEquals(0.1216, twoS.get("lifetime_s").asDouble(), 0.0001, twoS.toString());
    }

    /** Every field of lines --hyperfine in JSON (with a field, its uncertainty and air) is named in the README. */
    @Test
    void theHyperfineJsonFieldsAreDocumented() throws java.io.IOException {
        String readme = java.nio.file.Files.readString(java.nio.file.Path.of("..", "README.md"));
        CliTest.Run run = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "0.001",
                "--field-uncertainty-tesla", "1e-6", "--medium", "air", "--format", "json");
        assertEquals(0, run.code(), run.err());
        JsonNode row = new JsonMapper().readTree(run.out().lines().findFirst().orElseThrow());
        List<String> missing = new ArrayList<>();
        row.propertyNames().forEach(name -> {
            if (!readme.contains("`" + name + "`")) {
                missing.add(name);
            }
        });
        assertTrue(missing.isEmpty(), "not in the README: " + missing);
        assertTrue(readme.contains("`relative_strength` (the text column `share`"));
    }

    /** A species with neither a model nor a level list names the species that have a level list. */
    @Test
    void anIsotopeWithoutALevelListNamesTheListedOne() {
        CliTest.Run sr = CliTest.run("levels", "--species", "Sr-87 I");
        assertEquals(2, sr.code());
        assertTrue(sr.err().contains("the species with a level list [He I, Sr-88 I] (Sr-88 I is listed, not Sr-87 I)")
                && sr.err().contains("a level list of your own (ritzwerk-levels format) with --data"), sr.err());
    }
}
