package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.IdentificationSearch;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.NuclearData;
import org.ritzwerk.refdata.PeakFiles;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code ritzwerk identify} end to end on peak files the test writes. */
class IdentifyCommandTest {

    private static final String HEADER = "# ritzwerk-peaks 1\n# id: test-run\n# title: invented peaks\n"
            + "# source: invented test data\n# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: air\n";

    @Test
    void balmerPeaksInAirAreIdentified(@TempDir Path dir) throws IOException {
        // H-alpha to H-delta air wavelengths 656.279, 486.135, 434.047, 410.174 nm (J. E. Sansonetti
        // and W. C. Martin, Handbook of Basic Atomic Spectroscopic Data, J. Phys. Chem. Ref. Data
        // 34, 1559 (2005), strong lines of H I; digits recalled, from memory; checked by the
        // model's lines in air, which must match them), plus a peak that nothing explains.
        Path peaks = dir.resolve("peaks.csv");
        Files.writeString(peaks, HEADER + "position,uncertainty,intensity\n410.174,0.003,80\n434.047,0.003,150\n"
                + "486.135,0.003,400\n656.279,0.003,1500\n700.000,0.003,10\n", StandardCharsets.UTF_8);
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H I,He II", "--format", "json");
        assertEquals(0, run.code(), run.err());
        JsonMapper json = JsonMapper.builder().build();
        String[] rows = run.out().strip().split("\\R");
        assertEquals(5, rows.length);
        String[] expected = {"Balmer delta", "Balmer gamma", "Balmer beta", "Balmer alpha"};
        for (int i = 0; i < 4; i++) {
            JsonNode row = json.readTree(rows[i]);
            assertEquals("matched", row.get("status").asString(), rows[i]);
            assertEquals("H I", row.get("species").asString());
            assertEquals(expected[i], row.get("transition").asString());
            assertEquals(i + 10, row.get("file_line").asInt());
        }
        assertEquals("unexplained", json.readTree(rows[4]).get("status").asString());
        assertTrue(run.err().startsWith("5 peaks: 4 matched, 0 ambiguous, 1 unexplained"), run.err());
    }

    @Test
    void intensitiesGivenForSomePeaksOnlyAreLeftOutWithANote(@TempDir Path dir) throws IOException {
        // the Balmer peaks above, the third without an intensity
        Path peaks = dir.resolve("some.csv");
        Files.writeString(peaks, HEADER + "position,uncertainty,intensity\n410.174,0.003,80\n434.047,0.003,150\n"
                + "486.135,0.003,\n656.279,0.003,1500\n", StandardCharsets.UTF_8);
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H I");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.err().contains("note: the intensities are not used (the match ignores them): 1 of 4 peaks have"
                + " none (" + peaks + " line 12)"), run.err());
        Path all = dir.resolve("all.csv");
        Files.writeString(all, HEADER + "position,uncertainty,intensity\n410.174,0.003,80\n434.047,0.003,150\n"
                + "486.135,0.003,400\n656.279,0.003,1500\n", StandardCharsets.UTF_8);
        assertFalse(CliTest.run("identify", all.toString(), "--species", "H I").err().contains("intensities"));
    }

    /** In a JSON file on one line the note named "line 1" for every peak; it names their entries of 'peaks'. */
    @Test
    void peaksWithoutIntensityInAJsonFileAreNamedByTheirEntries(@TempDir Path dir) throws IOException {
        Path peaks = dir.resolve("some.json");
        Files.writeString(peaks, "{\"format\":\"ritzwerk-peaks\",\"formatVersion\":1,\"id\":\"some\",\"title\":"
                + "\"t\",\"source\":\"invented\",\"provenance\":\"measured\",\"version\":\"1\",\"positionUnit\":"
                + "\"nm\",\"medium\":\"air\",\"peaks\":[{\"position\":410.174,\"uncertainty\":0.003,\"intensity\":80},"
                + "{\"position\":434.047,\"uncertainty\":0.003},{\"position\":486.135,\"uncertainty\":0.003},"
                + "{\"position\":656.279,\"uncertainty\":0.003,\"intensity\":1500}]}", StandardCharsets.UTF_8);
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H I");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.err().contains("2 of 4 peaks have none (" + peaks + " entries 2, 3 of 'peaks'); give every"
                + " peak an intensity, or none"), run.err());
    }

    /**
     * Peaks of a gas that was not offered (30 seeded random peaks over 400-700 nm, 0.1 nm
     * uncertainty, and two 0.15 nm from lines of the list) against an invented list of twelve
     * equally strong lines 20 nm apart: what the list's species shows is what chance gives, so its
     * matches are ambiguous, the summary says why, and a note says that the matches may rest on
     * coincidences (it was given only after a shift search; an argon lamp's peaks were reported
     * as matched krypton and neon lines).
     */
    @Test
    void peaksOfAGasNotOfferedAreNotReportedAsMatched(@TempDir Path dir) throws IOException {
        StringBuilder list = new StringBuilder("# ritzwerk-lines 1\n# id: invented-x\n# title: t\n# source: invented\n"
                + "# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: air\n"
                + "species,position,intensity\n");
        for (int k = 0; k < 12; k++) {
            list.append("Kr I,").append(410 + 20 * k).append(",100\n");
        }
        Path lines = dir.resolve("lines.csv");
        Files.writeString(lines, list, StandardCharsets.UTF_8);
        java.util.SplittableRandom random = new java.util.SplittableRandom(12);
        List<Double> positions = new ArrayList<>(List.of(450.15, 589.85));
        for (int k = 0; k < 30; k++) {
            positions.add(400 + 300 * random.nextDouble());
        }
        positions.sort(null);
        StringBuilder rows = new StringBuilder("position,uncertainty\n");
        for (double x : positions) {
            rows.append(String.format(java.util.Locale.ROOT, "%.5f,0.1%n", x));
        }
        Path peaks = dir.resolve("foreign.csv");
        Files.writeString(peaks, HEADER + rows, StandardCharsets.UTF_8);
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--lines", lines.toString());
        assertEquals(0, run.code(), run.err());
        assertFalse(java.util.regex.Pattern.compile("(?m)^\\d+ +\\d+ +\\S+ +matched ").matcher(run.out()).find(),
                run.out());
        // the summary counts each reason the table gives (a peak with two counts under both)
        java.util.regex.Matcher summary = java.util.regex.Pattern.compile("32 peaks: 0 matched, ([1-9]) ambiguous "
                + "\\(\\1 of a species not shown beyond chance(; ([1-9]) that a stray peak may explain)?\\), ")
                .matcher(run.out());
        assertTrue(summary.find(), run.out());
        // each ambiguous peak says why
        assertTrue(java.util.regex.Pattern
                .compile("(?m)^\\d+ +\\d+ +\\S+ +ambiguous .* species not shown(; may be stray)?$")
                .matcher(run.out()).find(), run.out());
        long strayRows = java.util.regex.Pattern.compile("(?m)^\\d+ +\\d+ +\\S+ +ambiguous .*; may be stray$")
                .matcher(run.out()).results().count();
        assertEquals(strayRows, summary.group(3) == null ? 0 : Long.parseLong(summary.group(3)), run.out());
        assertFalse(java.util.regex.Pattern.compile("(?m)^\\d+ +\\d+ +\\S+ +ambiguous .* -$").matcher(run.out())
                .find(), run.out());
        assertTrue(run.out().contains("note: no species shows its strong lines beyond chance, so the matches may rest"
                + " on coincidences"), run.out());
    }

    @Test
    void findsTheVelocityFirst(@TempDir Path dir) throws IOException {
        // The same lines seen from a source receding at 60 km/s (lambda times 1 + v/c).
        double factor = 1 + 60e3 / 299_792_458.0;
        StringBuilder rows = new StringBuilder("position,uncertainty\n");
        for (double air : new double[] {410.174, 434.047, 486.135, 656.279}) {
            rows.append(String.format(java.util.Locale.ROOT, "%.5f,0.002%n", air * factor));
        }
        Path peaks = dir.resolve("moving.csv");
        Files.writeString(peaks, HEADER + rows, StandardCharsets.UTF_8);
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H", "--search-velocity", "200");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("4 peaks: 4 matched"), run.out());
        java.util.regex.Matcher velocity = java.util.regex.Pattern.compile("velocity ([0-9.]+) \\+- ([0-9.]+) km/s")
                .matcher(run.out());
        assertTrue(velocity.find(), run.out());
        assertEquals(60, Double.parseDouble(velocity.group(1)), 3 * Double.parseDouble(velocity.group(2)) + 1);
        assertFalse(run.out().contains("rest on coincidences"), run.out());
    }

    @Test
    void findsAConstantOffsetAndWeighsByTemperature(@TempDir Path dir) throws IOException {
        // The Balmer lines read 0.03 nm long on a miscalibrated scale.
        StringBuilder rows = new StringBuilder("position,uncertainty\n");
        for (double air : new double[] {410.174, 434.047, 486.135, 656.279}) {
            rows.append(String.format(java.util.Locale.ROOT, "%.5f,0.002%n", air + 0.03));
        }
        Path peaks = dir.resolve("offset.csv");
        Files.writeString(peaks, HEADER + rows, StandardCharsets.UTF_8);
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H", "--search-offset", "0.1",
                "--excitation-temperature", "12000");
        assertEquals(0, run.code(), run.err());
        java.util.regex.Matcher offset = java.util.regex.Pattern.compile("offset ([0-9.]+) \\+- ([0-9.]+) nm")
                .matcher(run.out());
        assertTrue(offset.find(), run.out());
        // 0.03 nm in air is 0.03 x n = 0.030008 nm in vacuum (n - 1 = 2.8e-4; common practice).
        assertEquals(0.03, Double.parseDouble(offset.group(1)), 3 * Double.parseDouble(offset.group(2)) + 1e-4);
        assertTrue(run.out().contains("4 peaks: 4 matched"), run.out());
    }

    @Test
    void badInputGivesOneClearMessage(@TempDir Path dir) throws IOException {
        Path noSigma = dir.resolve("nosigma.csv");
        Files.writeString(noSigma, HEADER + "position\n656.28\n", StandardCharsets.UTF_8);
        CliTest.Run tolerance = CliTest.run("identify", noSigma.toString(), "--species", "H");
        assertEquals(2, tolerance.code());
        assertTrue(tolerance.err().contains("the peaks do not all state an uncertainty; give --tolerance"),
                tolerance.err());
        Path bad = dir.resolve("bad.csv");
        Files.writeString(bad, HEADER + "position,uncertainty\n-656.28,0.01\nabc,0.01\n", StandardCharsets.UTF_8);
        CliTest.Run rows = CliTest.run("identify", bad.toString(), "--species", "H");
        assertEquals(2, rows.code());
        assertTrue(rows.err().contains(bad + ":10:1: column position: position must not be negative"), rows.err());
        assertTrue(rows.err().contains(bad + ":11:1: column position: position is not a number"), rows.err());
        CliTest.Run none = CliTest.run("identify", noSigma.toString(), "--tolerance", "0.01 nm");
        assertEquals(2, none.code());
        assertTrue(none.err().contains("give candidate lines"), none.err());
        CliTest.Run zero = CliTest.run("identify", noSigma.toString(), "--species", "H", "--tolerance", "0 nm");
        assertEquals(2, zero.code());
        assertTrue(zero.err().contains("--tolerance must be a positive finite number") && zero.err().contains("got '0 nm'"),
                zero.err());
    }

    @Test
    void plasmaDiagnosticsRecoverTheSynthesisedConditions(@TempDir Path dir) throws IOException {
        // synth's truth file: each line's position, counts and widths at T = 12,000 K and
        // n_e = 2e22 m^-3. Peaks with those intensities and Voigt widths (plus the instrument's
        // lambda / R) must give back the temperature (Boltzmann plot) and the density (H-beta,
        // H-alpha Stark widths, Gigosos et al. 2003).
        Path file = dir.resolve("peaks.csv");
        Files.writeString(file, plasmaPeaks(dir, "plasma-test", "%s"));
        CliTest.Run run = CliTest.run("identify", file.toString(), "--species", "H I", "--n-max", "9", "--plasma",
                "--resolving-power", "5000", "--format", "json");
        assertEquals(0, run.code(), run.err());
        double temperature = Double.NaN;
        List<Double> densities = new ArrayList<>();
        JsonMapper json = JsonMapper.builder().build();
        for (String row : run.out().split("\n")) {
            JsonNode node = json.readTree(row);
            if (node.get("quantity").asString().equals("excitation_temperature")) {
                temperature = node.get("value").asDouble();
            } else {
                densities.add(node.get("value").asDouble());
            }
        }
        assertEquals(12_000, temperature, 12, run.out());
        // H-alpha and H-beta; the Voigt-width approximation is good to 0.02 %: within 1 %.
        assertEquals(2, densities.size(), run.out());
        for (double density : densities) {
            assertEquals(2e22, density, 0.01 * 2e22, run.out());
        }
        assertTrue(CliTest.run("identify", file.toString(), "--species", "H I", "--plasma", "--components").err()
                .contains("--plasma works on n -> n' multiplets"));
        assertTrue(CliTest.run("identify", file.toString(), "--species", "H I", "--plasma", "--resolving-power", "5000",
                "--instrument-fwhm", "0.1").err().contains("not both"));
    }

    /**
     * --strength-weight: a peak 2 sigma from a line and 1.3 sigma from a line of the same species
     * 100 times weaker (costs 2 against 0.89 + w ln 100) takes the strong line, unflagged at
     * weight 1 (odds 33 to 1) and flagged at the default 1/2 (3.3 to 1), and the weak line by
     * position alone (weight 0). Invented lines.
     */
    @Test
    void theStrengthWeightDecidesBetweenAStrongLineAndANearerWeakOne(@TempDir Path dir) throws IOException {
        Path lines = dir.resolve("two.csv");
        Files.writeString(lines, "# ritzwerk-lines 1\n# id: invented-two\n# title: t\n# source: invented\n"
                + "# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: air\n"
                + "species,position,intensity\nKr I,500.000,100\nKr I,500.010,1\n", StandardCharsets.UTF_8);
        Path peaks = dir.resolve("one.csv");
        Files.writeString(peaks, HEADER + "position,uncertainty\n500.006,0.003\n", StandardCharsets.UTF_8);
        String strong = "\"invented-two 500.0 nm air\"";
        String weak = "\"invented-two 500.01 nm air\"";
        for (String[] c : new String[][] {{null, "ambiguous", strong}, {"1", "matched", strong},
            {"0.5", "ambiguous", strong}, {"0", "ambiguous", weak}}) {
            List<String> args = new ArrayList<>(List.of("identify", peaks.toString(), "--lines", lines.toString(),
                    "--format", "csv"));
            if (c[0] != null) {
                args.addAll(List.of("--strength-weight", c[0]));
            }
            CliTest.Run run = CliTest.run(args.toArray(new String[0]));
            assertEquals(0, run.code(), run.err());
            String row = run.out().lines().skip(1).findFirst().orElseThrow();
            assertTrue(row.contains("," + c[1] + ",\"Kr I\"," + c[2] + ","), c[0] + ": " + row);
            // one peak, one line: singular (it read "1 peaks", "1 lines matched")
            assertTrue(run.err().startsWith("1 peak: ") && run.err().contains("Kr I: 1 line matched"), run.err());
        }
        CliTest.Run bad = CliTest.run("identify", peaks.toString(), "--lines", lines.toString(), "--strength-weight",
                "1.5");
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("--strength-weight"), bad.err());
    }

    /**
     * A peak 3 sigma from its line among twelve peaks no line explains (about one per 24 nm) could
     * as well be one of them: flagged, and the summary says why; the peaks on their lines stay
     * matched. Invented peaks near the Balmer lines (the engine's multiplets).
     */
    @Test
    void aPeakThatAStrayCouldExplainIsFlagged(@TempDir Path dir) throws IOException {
        StringBuilder rows = new StringBuilder("position,uncertainty\n410.174,0.01\n434.077,0.01\n486.133,0.01\n");
        for (int x = 500; x <= 635; x += 15) {
            rows.append(x).append(".5,0.01\n");
        }
        rows.append("656.279,0.01\n670.5,0.01\n685.5,0.01\n");
        Path peaks = dir.resolve("strays.csv");
        Files.writeString(peaks, HEADER + rows, StandardCharsets.UTF_8);
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H I");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("16 peaks: 3 matched, 1 ambiguous (1 that a stray peak may explain), 12"
                + " unexplained"), run.out());
        assertTrue(run.out().matches("(?s).*\\n2 +11 +434\\.077000 +ambiguous +H I +Balmer gamma .*"), run.out());
        // the row says why, and no other row is ambiguous
        assertTrue(run.out().matches("(?s).*\\n2 +11 +434\\.077000 +ambiguous [^\\n]* may be stray\\n.*"), run.out());
        CliTest.Run csv = CliTest.run("identify", peaks.toString(), "--species", "H I", "--format", "csv");
        assertEquals(0, csv.code(), csv.err());
        assertTrue(csv.out().lines().skip(2).findFirst().orElseThrow().endsWith(",may_be_stray,,,,"), csv.out());
    }

    /**
     * Why a peak is ambiguous, in each format: a peak 2 sigma from a line and 1.3 sigma from a
     * line of the same species 100 times weaker takes the strong line at odds of about 3.3 to 1
     * (the test above): the text table names the close rival with its position and odds, CSV and
     * JSON give the reason's id and the rival's fields apart, and a matched or unexplained peak
     * has them empty (CSV) or null (JSON). The odds, exp(z_weak^2 / 2 + ln(100) / 2 - z_strong^2 /
     * 2) with z = 0.004 / 0.003 and 0.006 / 0.003, are Bayes' rule with Gaussian likelihoods and
     * the strength prior at weight 1/2 (common practice; {@code Identifier}'s cost).
     */
    @Test
    void anAmbiguousPeakSaysWhyAndNamesItsRival(@TempDir Path dir) throws IOException {
        Path lines = dir.resolve("two.csv");
        Files.writeString(lines, "# ritzwerk-lines 1\n# id: invented-two\n# title: t\n# source: invented\n"
                + "# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: air\n"
                + "species,position,intensity\nKr I,500.000,100\nKr I,500.010,1\nKr I,520.000,100\n",
                StandardCharsets.UTF_8);
        Path peaks = dir.resolve("two-peaks.csv");
        Files.writeString(peaks, HEADER + "position,uncertainty\n500.006,0.003\n519.999,0.003\n530.000,0.003\n",
                StandardCharsets.UTF_8);
        double odds = Math.exp(0.5 * (4.0 / 3) * (4.0 / 3) + 0.5 * Math.log(100) - 0.5 * 2 * 2);

        CliTest.Run text = CliTest.run("identify", peaks.toString(), "--lines", lines.toString());
        assertEquals(0, text.code(), text.err());
        String first = text.out().lines().skip(1).findFirst().orElseThrow();
        assertTrue(first.matches("1 +10 +500\\.006000 +ambiguous +Kr I +invented-two 500\\.0 nm air +500\\.000000 .*"
                + " close rival Kr I invented-two 500\\.01 nm air at 500\\.010000, odds "
                + String.format(java.util.Locale.ROOT, "%.3g", odds) + ":1"), first);
        assertTrue(text.out().lines().skip(2).findFirst().orElseThrow().endsWith(" -"), text.out());
        assertTrue(text.out().lines().findFirst().orElseThrow().endsWith("res/sigma  why"), text.out());

        CliTest.Run csv = CliTest.run("identify", peaks.toString(), "--lines", lines.toString(), "--format", "csv");
        assertEquals(0, csv.code(), csv.err());
        List<String> rows = csv.out().lines().toList();
        assertEquals("peak,file_line,position,status,species,transition,line_position,residual,residual_sigma,"
                + "ambiguity,rival_species,rival_transition,rival_position,rival_odds", rows.get(0));
        assertTrue(rows.get(1).contains(",ambiguous,\"Kr I\",\"invented-two 500.0 nm air\","), rows.get(1));
        assertTrue(rows.get(1).matches(".*,close_rival,\"Kr I\",\"invented-two 500.01 nm air\",500\\.01(0*\\d*)?,"
                + "[0-9.]+"), rows.get(1));
        assertTrue(rows.get(2).endsWith(",,,,,"), rows.get(2));
        assertTrue(rows.get(3).contains(",unexplained,") && rows.get(3).endsWith(",,,,,"), rows.get(3));

        CliTest.Run json = CliTest.run("identify", peaks.toString(), "--lines", lines.toString(), "--format", "json");
        assertEquals(0, json.code(), json.err());
        JsonMapper mapper = JsonMapper.builder().build();
        String[] objects = json.out().strip().split("\\R");
        JsonNode ambiguous = mapper.readTree(objects[0]);
        assertEquals("close_rival", ambiguous.get("ambiguity").asString());
        assertEquals("Kr I", ambiguous.get("rival_species").asString());
        assertEquals("invented-two 500.01 nm air", ambiguous.get("rival_transition").asString());
        assertEquals(500.010, ambiguous.get("rival_position").asDouble(), 1e-9, "in the peaks' unit and medium");
        // the peaks are in air: positions scale by the refractive index, residuals with them (1e-3 relative)
        assertEquals(odds, ambiguous.get("rival_odds").asDouble(), 1e-3 * odds);
        for (int k = 1; k < 3; k++) {
            JsonNode row = mapper.readTree(objects[k]);
            for (String field : new String[] {"ambiguity", "rival_species", "rival_transition", "rival_position",
                "rival_odds"}) {
                assertTrue(row.get(field).isNull(), objects[k]);
            }
        }
        assertEquals("matched", mapper.readTree(objects[1]).get("status").asString());
    }

    /** A width tolerance under three of the peaks' uncertainties is noted (its odds are overconfident). */
    @Test
    void aToleranceSharperThanThePeaksIsNoted(@TempDir Path dir) throws IOException {
        Path peaks = dir.resolve("balmer.csv");
        Files.writeString(peaks, HEADER + "position,uncertainty\n486.135,0.001\n656.279,0.001\n",
                StandardCharsets.UTF_8);
        CliTest.Run narrow = CliTest.run("identify", peaks.toString(), "--species", "H I", "--tolerance", "0.002 nm");
        assertEquals(0, narrow.code(), narrow.err());
        assertTrue(narrow.err().contains("note: --tolerance 0.002 nm: 2 of 2 peaks state an uncertainty above a third"
                + " of the tolerance's half-width"), narrow.err());
        for (String fine : new String[] {"0.003 nm", "0.01 nm", "5 sigma"}) { // 0.003 nm: exactly three, in air
            CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H I", "--tolerance", fine);
            assertEquals(0, run.code(), run.err());
            assertFalse(run.err().contains("note: --tolerance"), run.err());
        }
    }

    /** @return the engine's H I model at the QED tier */
    private static HydrogenLikeModel hydrogen() {
        return HydrogenLikeModel.of(NuclearData.builtIn().nucleus(Species.parse("H I")), Tier.QED);
    }

    /** @return the engine's H I multiplets between 400 and 700 nm (vacuum), n up to 6: the Balmer lines */
    private static LineCatalog balmerMultiplets(HydrogenLikeModel hydrogen) {
        return Candidates.inWindow(400e-9, 700e-9).hydrogenLike(Species.parse("H I"), hydrogen, 6, false).build()
                .catalog();
    }

    /** A velocity that rounds to zero at the printed digits reads 0.000, not -0.000. */
    @Test
    void aShiftThatRoundsToZeroPrintsUnsigned(@TempDir Path dir) throws IOException {
        // Invented peaks: Balmer multiplets of the engine moved by -0.2 m/s (-0.0002 km/s), in vacuum.
        LineCatalog rest = balmerMultiplets(hydrogen());
        StringBuilder rows = new StringBuilder("position,uncertainty\n");
        for (int j = 0; j < rest.size(); j++) {
            rows.append(String.format(java.util.Locale.ROOT, "%.9f,0.001%n",
                    rest.wavelength(j) * (1 - 0.2 / 299_792_458.0) * 1e9));
        }
        Path file = dir.resolve("still.csv");
        Files.writeString(file, HEADER.replace("# medium: air", "# medium: vacuum") + rows, StandardCharsets.UTF_8);
        CliTest.Run run = CliTest.run("identify", file.toString(), "--species", "H I", "--search-velocity", "100");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("; velocity 0.000 +- "), run.out());
    }

    @Test
    void theCommandGivesWhatTheLibraryJobGives(@TempDir Path dir) throws IOException {
        // Invented peaks: four Balmer multiplets of the engine moved by 25 km/s, in air, and a stray peak.
        HydrogenLikeModel hydrogen = hydrogen();
        LineCatalog rest = balmerMultiplets(hydrogen);
        StringBuilder rows = new StringBuilder("position,uncertainty\n");
        for (int j = 0; j < rest.size(); j++) {
            double air = Medium.air().fromVacuum(rest.wavelength(j) * (1 + 25e3 / 299_792_458.0)) * 1e9;
            rows.append(String.format(java.util.Locale.ROOT, "%.6f,0.001%n", air));
        }
        rows.append("600.000000,0.001\n");
        Path file = dir.resolve("moving.csv");
        Files.writeString(file, HEADER + rows, StandardCharsets.UTF_8);
        CliTest.Run run = CliTest.run("identify", file.toString(), "--species", "H I", "--search-velocity", "100",
                "--format", "json");
        assertEquals(0, run.code(), run.err());

        PeakFiles.Peaks read = PeakFiles.read(file);
        PeakList peaks = PeakList.of(read.positions(), read.uncertainties(), null, read.unit(), read.medium());
        IdentificationSearch search = IdentificationSearch.of(Identifier.of(Tolerance.parse("5 sigma")))
                .withVelocitySearch(100e3);
        double[] window = search.candidateWindow(peaks);
        IdentificationSearch.Report report = search.run(peaks, Candidates.inWindow(window[0], window[1])
                .hydrogenLike(Species.parse("H I"), hydrogen, 30, false).build().catalog());
        JsonMapper json = JsonMapper.builder().build();
        String[] lines = run.out().strip().split("\\R");
        assertEquals(read.size(), lines.length);
        for (int i = 0; i < read.size(); i++) {
            JsonNode row = json.readTree(lines[i]);
            int j = report.identification().line(i);
            int status = report.identification().status(i);
            assertEquals(status == Identification.UNEXPLAINED ? "unexplained"
                    : status == Identification.AMBIGUOUS ? "ambiguous" : "matched", row.get("status").asString(), lines[i]);
            if (j >= 0) {
                assertEquals(report.lines().label(j), row.get("transition").asString());
            }
        }
        String velocity = String.format(java.util.Locale.ROOT, "velocity %.3f",
                report.velocity().orElseThrow().velocity() / 1e3);
        assertTrue(run.err().contains(velocity), velocity + " in " + run.err());
        // The presence line is the library's record, printed.
        Identification.SpeciesPresence presence = report.identification().speciesPresence().get(0);
        assertTrue(run.err().contains(IdentifyCommand.presenceLine(presence,
                report.identification().shiftsTried())), run.err());
        // A velocity search: the chance counts are one shift's, the probability is over the shifts.
        assertTrue(report.identification().shiftsTried() > 1, "shifts " + report.identification().shiftsTried());
        assertTrue(run.err().contains("by chance at one shift") && run.err().contains(" shifts tried)"),
                run.err());
        assertTrue(presence.presence() >= 0.9, presence.toString());
    }

    @Test
    void presenceIsWeighedAgainstChance(@TempDir Path dir) throws IOException {
        // The Balmer peaks of balmerPeaksInAirAreIdentified: H I strong lines found among sparse
        // peaks (chance expects almost none), He II's strong line missing.
        Path sparse = dir.resolve("sparse.csv");
        Files.writeString(sparse, HEADER + "position,uncertainty\n410.174,0.003\n434.047,0.003\n486.135,0.003\n"
                + "656.279,0.003\n700.000,0.003\n", StandardCharsets.UTF_8);
        CliTest.Run real = CliTest.run("identify", sparse.toString(), "--species", "H I,He II");
        assertEquals(0, real.code(), real.err());
        java.util.regex.Matcher h = java.util.regex.Pattern.compile(
                "H I: 4 lines matched \\(([0-9.e+-]+) by chance\\); 2 of 2 strong lines in range found \\(([0-9.e+-]+) by "
                        + "chance, chance probability ([0-9.e+-]+)\\); presence ([0-9.]+)").matcher(real.out());
        assertTrue(h.find(), real.out());
        assertTrue(Double.parseDouble(h.group(1)) < 0.1 && Double.parseDouble(h.group(2)) < 0.01, h.group());
        assertTrue(Double.parseDouble(h.group(4)) >= 0.9, h.group());
        assertTrue(real.out().contains("He II: 0 lines matched"), real.out());
        assertTrue(real.out().matches("(?s).*He II: .*; 0 of 1 strong line in range found .*presence 0\\.00.*"),
                real.out());
        // 20,000 random peaks (seeded) over 400-700 nm with 3 pm uncertainties: about 86 % of the
        // lines have a peak within 5 sigma by chance; no species may look present.
        java.util.SplittableRandom random = new java.util.SplittableRandom(16L);
        StringBuilder rows = new StringBuilder("position,uncertainty\n");
        double[] positions = new double[20_000];
        for (int i = 0; i < positions.length; i++) {
            positions[i] = 400 + 300 * random.nextDouble();
        }
        java.util.Arrays.sort(positions);
        for (double x : positions) {
            rows.append(String.format(java.util.Locale.ROOT, "%.6f,0.003%n", x));
        }
        Path noise = dir.resolve("noise.csv");
        Files.writeString(noise, HEADER + rows, StandardCharsets.UTF_8);
        CliTest.Run random20k = CliTest.run("identify", noise.toString(), "--species", "H I,He II", "--format", "csv");
        assertEquals(0, random20k.code(), random20k.err());
        java.util.regex.Matcher p = java.util.regex.Pattern.compile("(H I|He II): .*presence ([0-9.]+)")
                .matcher(random20k.err());
        int species = 0;
        while (p.find()) {
            species++;
            assertTrue(Double.parseDouble(p.group(2)) <= 0.1, p.group());
        }
        assertEquals(2, species, random20k.err());
    }

    /**
     * A peaks file made from synth's truth at T = 12,000 K and n_e = 2e22 m^-3 (H I, 380-700 nm,
     * R = 5000, no noise): each line's position, its counts as intensity (written with
     * {@code intensityFormat}, e.g. "%s" exactly or "%.6g"), and its Voigt width (Olivero and
     * Longbothum, J. Quant. Spectrosc. Radiat. Transfer 17, 233 (1977)) with the instrument's
     * lambda / R.
     */
    @Test
    void intercombinationLinesOfALevelListAreCandidatesOnRequest(@TempDir Path dir) throws IOException {
        // Sr I 460.733 nm (5s5p 1P1 - 5s2 1S0) and the intercombination line 689.259 nm (5s5p 3P1 -
        // 5s2 1S0), air (J. E. Sansonetti and W. C. Martin, Handbook of Basic Atomic Spectroscopic
        // Data, J. Phys. Chem. Ref. Data 34, 1559 (2005), strong lines of Sr I; from memory)
        Path peaks = dir.resolve("sr.csv");
        Files.writeString(peaks, HEADER + "position,uncertainty\n460.733,0.002\n689.259,0.002\n",
                StandardCharsets.UTF_8);
        CliTest.Run plain = CliTest.run("identify", peaks.toString(), "--species", "Sr I", "--format", "csv");
        assertEquals(0, plain.code(), plain.err());
        assertTrue(plain.out().contains("unexplained"), plain.out());
        CliTest.Run with = CliTest.run("identify", peaks.toString(), "--species", "Sr I", "--intercombination",
                "--format", "csv");
        assertEquals(0, with.code(), with.err());
        assertTrue(with.out().contains("5s5p 3P1 - 5s2 1S0"), with.out());
        assertFalse(with.out().contains("unexplained"), with.out());
        CliTest.Run refused = CliTest.run("identify", peaks.toString(), "--species", "H I", "--intercombination");
        assertEquals(2, refused.code());
        assertTrue(refused.err().contains("--intercombination has no effect without a species with a level list"),
                refused.err());
    }

    @Test
    void heliumLinesGiveAnExcitationTemperature(@TempDir Path dir) throws IOException {
        // synth's He I truth at T = 30,000 K (photons from g A exp(-E / kT), the Boltzmann
        // relation, common practice), each LS multiplet's components summed into one peak at their
        // intensity-weighted mean, as a spectrometer that does not resolve them shows it. The
        // Boltzmann plot over the matched lines and multiplets must give the temperature back; the
        // multiplets' upper energies are their g A-weighted means, off by far less than kT.
        Path truth = dir.resolve("he-truth.csv");
        CliTest.Run synth = CliTest.run("synth", "--species", "He I", "--from", "380 nm", "--to", "700 nm",
                "--temperature", "30000", "--resolving-power", "5000", "--no-noise", "--truth", truth.toString(),
                "--out", dir.resolve("he-spectrum.csv").toString());
        assertEquals(0, synth.code(), synth.err());
        java.util.Map<String, double[]> multiplets = new java.util.LinkedHashMap<>();
        for (String row : Files.readAllLines(truth)) {
            if (row.startsWith("#") || row.startsWith("wavelength_nm")) {
                continue;
            }
            String[] c = row.split(",");
            double nm = Double.parseDouble(c[0]);
            double counts = Double.parseDouble(c[1]);
            if (nm < 380 || nm > 700 || counts <= 0) {
                continue;
            }
            String term = c[5].replaceAll("(\\d[SPDF])\\d+( |$)", "$1$2");
            double[] sum = multiplets.computeIfAbsent(term, k -> new double[2]);
            sum[0] += counts;
            sum[1] += counts * nm;
        }
        StringBuilder peaks = new StringBuilder("# ritzwerk-peaks 1\n# id: he\n# title: synthetic\n"
                + "# source: ritzwerk synth\n# provenance: computed\n# version: 1\n# position-unit: nm\n"
                + "# medium: vacuum\nposition,uncertainty,intensity\n");
        multiplets.values().forEach(sum -> peaks.append(String.format(java.util.Locale.ROOT, "%.6f,0.002,%s%n",
                sum[1] / sum[0], sum[0])));
        assertTrue(multiplets.size() > 10, multiplets.keySet().toString());
        Path file = dir.resolve("he-peaks.csv");
        Files.writeString(file, peaks);
        CliTest.Run run = CliTest.run("identify", file.toString(), "--species", "He I", "--plasma", "--format",
                "json");
        assertEquals(0, run.code(), run.err());
        JsonNode row = JsonMapper.builder().build().readTree(run.out().strip().split("\\R")[0]);
        assertEquals("excitation_temperature", row.get("quantity").asString(), run.out());
        assertEquals(30_000, row.get("value").asDouble(), 30, run.out());
    }

    static String plasmaPeaks(Path dir, String id, String intensityFormat) throws IOException {
        Path truth = dir.resolve(id + "-truth.csv");
        CliTest.Run synth = CliTest.run("synth", "--species", "H I", "--from", "380 nm", "--to", "700 nm",
                "--temperature", "12000", "--electron-density", "2e22", "--resolving-power", "5000", "--no-noise",
                "--n-max", "9", "--truth", truth.toString(), "--out", dir.resolve(id + "-spectrum.csv").toString());
        assertEquals(0, synth.code(), synth.err());
        StringBuilder peaks = new StringBuilder("# ritzwerk-peaks 1\n# id: " + id + "\n# title: synthetic\n"
                + "# source: ritzwerk synth\n# provenance: computed\n# version: 1\n# position-unit: nm\n"
                + "# medium: vacuum\nposition,uncertainty,intensity,width\n");
        for (String row : Files.readAllLines(truth)) {
            if (row.startsWith("#") || row.startsWith("wavelength_nm")) {
                continue;
            }
            String[] c = row.split(",");
            double nm = Double.parseDouble(c[0]);
            if (nm < 380 || nm > 700) {
                continue;
            }
            double gauss = Math.hypot(Double.parseDouble(c[3]), nm / 5000);
            double lorentz = Double.parseDouble(c[4]);
            double voigt = 0.5346 * lorentz + Math.sqrt(0.2166 * lorentz * lorentz + gauss * gauss);
            String intensity = intensityFormat.equals("%s") ? c[1]
                    : String.format(java.util.Locale.ROOT, intensityFormat, Double.parseDouble(c[1]));
            peaks.append(String.format(java.util.Locale.ROOT, "%.6f,0.001,%s,%.6f%n", nm, intensity, voigt));
        }
        return peaks.toString();
    }

    /** Without --instrument-fwhm or --resolving-power the density note says only Doppler was taken out. */
    @Test
    void thePlasmaNoteSaysWhenNoInstrumentWidthWasGiven() {
        CliTest.Run run = CliTest.run("identify", java.nio.file.Path.of("..", "examples", "data", "plasma-peaks.csv")
                .toString(), "--species", "H I", "--n-max", "9", "--plasma");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("(no instrument width given, so only Doppler at 12000 K)"), run.out());
        assertTrue(!run.out().contains("(instrument, Doppler"), run.out());
    }

    /**
     * A velocity search that matches no line (here every peak is ambiguous between fine-structure
     * components) claims no velocity, and the peaks are identified against the lines at rest, not
     * at the search's densest vote (which the table used to show while the summary said none).
     */
    @Test
    void aSearchThatMatchesNothingLeavesTheLinesAtRest() {
        CliTest.Run run = CliTest.run("identify", java.nio.file.Path.of("..", "examples", "data", "peaks.csv")
                .toString(), "--species", "H I", "--components", "--search-velocity", "100", "--format", "csv");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.err().contains("no velocity in the searched range lets any line match, so none is given"),
                run.err());
        CliTest.Run rest = CliTest.run("identify", java.nio.file.Path.of("..", "examples", "data", "peaks.csv")
                .toString(), "--species", "H I", "--components", "--format", "csv");
        assertEquals(rest.out(), run.out(), "the same identification as without a search");
    }
}
