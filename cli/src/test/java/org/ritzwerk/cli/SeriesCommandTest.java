package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Locale;
import java.util.Random;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code ritzwerk series}: fits, output formats and refusals. */
class SeriesCommandTest {

    /** Limit of the built-in Rb-87 set the example file's members were computed from, cm^-1 (Mack et al. 2011). */
    private static final double LIMIT = 33690.80395355937;

    private static Path example(Path dir) throws IOException {
        Path file = dir.resolve("series-rb-87.csv");
        try (InputStream in = SeriesCommandTest.class.getResourceAsStream("series-rb-87.csv")) {
            Files.copy(in, file);
        }
        return file;
    }

    /** Energies as frequencies E / h (comb and wavemeter data) give the same fit as in cm-1. */
    @Test
    void energiesInGigahertzGiveTheSameFit(@TempDir Path dir) throws IOException {
        Path file = example(dir);
        double ghzPerCm = 29.9792458; // c in cm/ns, exact
        StringBuilder ghz = new StringBuilder();
        for (String line : Files.readAllLines(file)) {
            String[] f = line.split(",");
            if (line.startsWith("# energy-unit:")) {
                line = "# energy-unit: GHz";
            } else if (!line.startsWith("#") && f.length == 4 && !f[0].equals("series")) {
                line = f[0] + "," + f[1] + "," + Double.parseDouble(f[2]) * ghzPerCm + ","
                        + Double.parseDouble(f[3]) * ghzPerCm;
            }
            ghz.append(line).append('\n');
        }
        Path inGhz = dir.resolve("series-ghz.csv");
        Files.writeString(inGhz, ghz);
        assertEquals(limitFrom(CliTest.run("series", file.toString(), "--format", "json")),
                limitFrom(CliTest.run("series", inGhz.toString(), "--format", "json")), 1e-6);
    }

    @Test
    void givesBackTheLimitAndDefectsTheMembersCameFrom(@TempDir Path dir) throws IOException {
        Path file = example(dir);
        CliTest.Run run = CliTest.run("series", file.toString(), "--predict", "60", "--format", "json");
        assertEquals(0, run.code(), run.err());
        JsonMapper json = JsonMapper.builder().build();
        Map<String, JsonNode> parameters = new HashMap<>();
        int members = 0;
        int predictions = 0;
        int fits = 0;
        double weights = 0;
        for (String line : run.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            switch (row.get("kind").asString()) {
                case "model" -> weights += row.get("weight").asDouble();
                case "parameter" -> parameters.put(row.get("parameter").asString(), row);
                case "member" -> {
                    members++;
                    assertTrue(Math.abs(row.get("normalised_residual").asDouble()) < 1e-3, line);
                }
                case "prediction" -> {
                    predictions++;
                    // the member averaged over the models tried: the same energy here (every model with weight
                    // fits the exact members), its uncertainty with the models' own (Burnham and Anderson 2002)
                    assertEquals(row.get("energy_per_cm").asDouble(), row.get("averaged_energy_per_cm").asDouble(),
                            1e-6, line);
                    assertTrue(row.get("averaged_uncertainty_per_cm").asDouble()
                            >= row.get("uncertainty_per_cm").asDouble(), line);
                }
                case "fit" -> {
                    // the text's first line as a row: species, counts, R_M, chi2 and its degrees of freedom
                    assertEquals("Rb-87 I", row.get("species").asString());
                    assertEquals(22, row.get("members").asInt());
                    assertEquals(17, row.get("degrees_of_freedom").asInt());
                    fits++;
                }
                default -> { }
            }
        }
        assertEquals(22, members);
        assertEquals(2, predictions);
        assertEquals(1, fits);
        assertEquals(LIMIT, parameters.get("limit").get("value").asDouble(), 1e-6);
        // d0, d2 of the built-in set (Mack et al. 2011): nS1/2 3.1311807, 0.1787; nD5/2 1.3464622, -0.594
        assertEquals(3.1311807, parameters.get("nS1/2 d0").get("value").asDouble(), 1e-8);
        assertEquals(0.1787, parameters.get("nS1/2 d2").get("value").asDouble(), 1e-5);
        assertEquals(1.3464622, parameters.get("nD5/2 d0").get("value").asDouble(), 1e-8);
        assertEquals(-0.594, parameters.get("nD5/2 d2").get("value").asDouble(), 1e-5);
        assertTrue(parameters.get("limit").get("uncertainty").asDouble() > 0);
        // the limit averaged over the models tried (BIC weights; Burnham and Anderson 2002): the same limit here,
        // its uncertainty at least the chosen model's (each model's own, plus their spread, weighted)
        JsonNode averaged = parameters.get("limit, model-averaged");
        assertEquals(LIMIT, averaged.get("value").asDouble(), 1e-6);
        assertTrue(averaged.get("uncertainty").asDouble() >= parameters.get("limit").get("uncertainty").asDouble());
        assertEquals(1.0, weights, 1e-9);
        // so are the defects, d4 included (a term only the three-term models hold, 0 in the others)
        for (String d : new String[] {"nS1/2 d0", "nS1/2 d2", "nD5/2 d0", "nD5/2 d2"}) {
            JsonNode one = parameters.get(d + ", model-averaged");
            assertEquals(parameters.get(d).get("value").asDouble(), one.get("value").asDouble(), 1e-8, d);
            assertTrue(one.get("uncertainty").asDouble() > parameters.get(d).get("uncertainty").asDouble(), d);
            assertTrue(one.get("scaled_uncertainty").isNull(), d);
        }
        assertTrue(parameters.containsKey("nS1/2 d4, model-averaged") && !parameters.containsKey("nS1/2 d4"));
        // with the terms fixed there is one model: no averaged rows, the averaged prediction is the fit's
        CliTest.Run fixed = CliTest.run("series", file.toString(), "--terms", "2,2", "--predict", "60", "--format",
                "json");
        assertEquals(0, fixed.code(), fixed.err());
        assertFalse(fixed.out().contains("model-averaged"), fixed.out());
        for (String line : fixed.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            if (row.get("kind").asString().equals("prediction")) {
                assertEquals(row.get("uncertainty_per_cm").asDouble(),
                        row.get("averaged_uncertainty_per_cm").asDouble(), 1e-12, line);
            }
        }

        CliTest.Run text = CliTest.run("series", file.toString());
        assertEquals(0, text.code(), text.err());
        assertTrue(text.out().startsWith("Rb-87 I: 2 series, 22 members, R_M = 109736.6"), text.out());
        assertTrue(text.out().contains("models tried") && text.out().contains("[2,2]"), text.out());
        CliTest.Run csv = CliTest.run("series", file.toString(), "--format", "csv");
        assertEquals(0, csv.code(), csv.err());
        assertTrue(csv.out().startsWith("kind,species,series,members,rydberg_per_cm,chi_square,degrees_of_freedom,"
                + "known_limit,chi_square_probability,fit_quality,uncertainty_scale,term_choice,levels\n"
                + "fit,\"Rb-87 I\",2,22,")
                && csv.out().contains("\nkind,parameter,value,uncertainty,scaled_uncertainty,unit\n"),
                csv.out());
    }

    /**
     * A level measured twice was refused (data.duplicate); now each row is a member with its own residual
     * row named by its line. The example's members plus a second nS1/2 n = 30 agreeing with the first
     * (0.5e-4 cm-1 apart) and a second nD5/2 n = 30 1e-3 cm-1 off (7.1 standard uncertainties of the
     * difference, sqrt(2) 1e-4): 24 members of 22 levels, 24 - 5 degrees of freedom with two terms per
     * series, both rows of each pair printed, the disagreeing pair flagged on both rows and named in a note
     * with both lines.
     */
    @Test
    void aLevelMeasuredTwicePrintsBothRowsAndNotesADisagreement(@TempDir Path dir) throws IOException {
        Path file = example(dir);
        String text = Files.readString(file);
        double s30 = 33538.79735952799;
        double d30 = 33557.15266266235;
        Path repeats = dir.resolve("repeats.csv");
        Files.writeString(repeats, text + String.format(Locale.ROOT, "nS1/2,30,%.9f,0.0001%nnD5/2,30,%.9f,0.0001%n",
                s30 + 0.5e-4, d30 + 1e-3));
        // the example has 6 header lines and 22 members: the repeats are on lines 29 and 30
        CliTest.Run run = CliTest.run("series", repeats.toString(), "--terms", "2,2", "--format", "json");
        assertEquals(0, run.code(), run.err());
        JsonMapper json = JsonMapper.builder().build();
        int members = 0;
        java.util.List<String> thirty = new java.util.ArrayList<>();
        for (String line : run.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            switch (row.get("kind").asString()) {
                case "fit" -> {
                    assertEquals(24, row.get("members").asInt(), line);
                    assertEquals(22, row.get("levels").asInt(), line);
                    assertEquals(24 - 5, row.get("degrees_of_freedom").asInt(), line);
                }
                case "member" -> {
                    members++;
                    if (row.get("n").asString().equals("30")) {
                        thirty.add(row.get("series").asString() + " " + row.get("where").asString() + " "
                                + (row.get("flag").isNull() ? "-" : row.get("flag").asString()));
                    }
                }
                default -> { }
            }
        }
        assertEquals(24, members);
        String name = repeats.toString();
        assertEquals(java.util.List.of("nS1/2 " + name + ":17 -", "nD5/2 " + name + ":18 repeat disagrees",
                "nS1/2 " + name + ":29 -", "nD5/2 " + name + ":30 outlier, repeat disagrees"), thirty.stream()
                .sorted(java.util.Comparator.comparing(t -> Integer.parseInt(t.replaceAll(".*:(\\d+) .*", "$1"))))
                .toList());
        assertTrue(run.err().contains("note: two measurements of one level disagree by more than 3 standard "
                + "uncertainties of their difference sqrt(u1^2 + u2^2), the largest first: nD5/2 n = 30 (" + name
                + ":18 and " + name + ":30: difference +0.00100 cm-1, 7.07 times"), run.err());
        CliTest.Run table = CliTest.run("series", repeats.toString(), "--terms", "2,2");
        assertEquals(0, table.code(), table.err());
        assertTrue(table.out().startsWith("Rb-87 I: 2 series, 24 members (measurements of 22 levels), R_M"),
                table.out());
        assertTrue(table.out().contains(name + ":29") && table.out().contains(name + ":17"), table.out());
    }

    @Test
    void drawsTheDefectsOfOneSeries(@TempDir Path dir) throws IOException {
        Path file = example(dir);
        Path png = dir.resolve("defects.png");
        CliTest.Run run = CliTest.run("series", file.toString(), "--plot", png.toString(), "--plot-series", "nD5/2");
        assertEquals(0, run.code(), run.err());
        byte[] bytes = Files.readAllBytes(png);
        assertTrue(bytes.length > 1000 && bytes[1] == 'P' && bytes[2] == 'N' && bytes[3] == 'G');
        CliTest.Run unknown = CliTest.run("series", file.toString(), "--plot", png.toString(), "--plot-series", "nP");
        assertEquals(2, unknown.code());
        assertTrue(unknown.err().contains("no series 'nP'") && unknown.err().contains("nS1/2, nD5/2"), unknown.err());
        // A plot into a folder that does not exist is refused before any work, naming the option.
        String before = Files.readString(file);
        CliTest.Run missing = CliTest.run("series", file.toString(), "--plot", dir.resolve("no-such-folder")
                .resolve("d.png").toString());
        assertEquals(2, missing.code());
        assertTrue(missing.err().contains("--plot"), missing.err());
        assertEquals(before, Files.readString(file));
    }

    /**
     * --limit: a known limit is one more datum. One given 0.001 cm-1 above the members' own limit
     * with 1e-5 cm-1 uncertainty pulls the fit to it (the members, known to 1e-3 cm-1 each, give the
     * limit to 7e-5 cm-1); one with 1 cm-1 uncertainty leaves it where the members put it. Bad
     * values are refused naming the option.
     */
    @Test
    void aKnownLimitIsOneMoreDatum(@TempDir Path dir) throws IOException {
        Path file = example(dir);
        double tight = limitFrom(CliTest.run("series", file.toString(), "--format", "json", "--limit",
                (LIMIT + 0.001) + ",1e-5"));
        assertEquals(LIMIT + 0.001, tight, 5e-5);
        double loose = limitFrom(CliTest.run("series", file.toString(), "--format", "json", "--limit",
                (LIMIT + 0.001) + ",1"));
        assertEquals(LIMIT, loose, 1e-6);
        // neither is noted; a limit 0.01 cm-1 off with 0.001 uncertainty is (the members hold the fit
        // within 7e-5 cm-1 of their own limit, 9.9 of the known limit's uncertainties away)
        assertFalse(CliTest.run("series", file.toString(), "--limit", (LIMIT + 0.001) + ",1e-5").err()
                .contains("note: --limit"));
        CliTest.Run off = CliTest.run("series", file.toString(), "--limit", (LIMIT + 0.01) + ",0.001");
        assertEquals(0, off.code(), off.err());
        assertTrue(off.err().contains("lies -9.9 of its standard uncertainties from it; the members put the limit"
                + " elsewhere"), off.err());
        CliTest.Run text = CliTest.run("series", file.toString(), "--limit", "33690.8,0.01");
        assertEquals(0, text.code(), text.err());
        assertTrue(text.out().contains("Known limit 33690.8 +- 0.01 cm-1 taken as a datum"), text.out());
        for (String bad : new String[] {"33690.8", "0,0.01", "33690.8,-1", "33690.8,0.01,3"}) {
            CliTest.Run run = CliTest.run("series", file.toString(), "--limit", bad);
            assertEquals(2, run.code(), bad);
            assertTrue(run.err().contains("--limit takes two numbers"), run.err());
        }
    }

    private static double limitFrom(CliTest.Run run) {
        assertEquals(0, run.code(), run.err());
        JsonMapper json = JsonMapper.builder().build();
        for (String line : run.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            if (row.get("kind").asString().equals("parameter") && row.get("parameter").asString().equals("limit")) {
                return row.get("value").asDouble();
            }
        }
        throw new AssertionError("no limit in " + run.out());
    }

    @Test
    void badFilesAreRefusedWithFileLineAndColumn(@TempDir Path dir) throws IOException {
        Path bad = dir.resolve("bad.csv");
        Files.writeString(bad, "# ritzwerk-series 1\n# species: Rb-87 I\n# energy-unit: cm-1\n"
                + "series,n,energy,uncertainty\nS,20.5,33305.1,0.001\nS,21,33305.1,-1\nS,22,abc,0.1\nS,23,33400,0.1\n"
                + "S,23,33401,0.1\n");
        CliTest.Run run = CliTest.run("series", bad.toString());
        assertEquals(2, run.code());
        assertTrue(run.err().contains("bad.csv:5:2: column n: n must be an integer"), run.err());
        assertTrue(run.err().contains("bad.csv:6:4: column uncertainty"), run.err());
        assertTrue(run.err().contains("bad.csv:7:3: column energy: energy is not a number: 'abc'"), run.err());
        // n = 23 on lines 8 and 9 is a level measured twice, not a problem (it was refused as a duplicate)
        assertTrue(run.err().contains("3 problems") && !run.err().contains("bad.csv:9"), run.err());
        assertTrue(!run.err().contains("Exception") && !run.err().contains("NaN"), run.err());

        Path noSpecies = dir.resolve("nospecies.csv");
        Files.writeString(noSpecies, "# ritzwerk-series 1\n# energy-unit: cm-1\nseries,n,energy,uncertainty\nS,20,1,1\n");
        CliTest.Run missing = CliTest.run("series", noSpecies.toString());
        assertEquals(2, missing.code());
        assertTrue(missing.err().contains("required header 'species'"), missing.err());

        Path ion = dir.resolve("ion.csv");
        Files.writeString(ion, "# ritzwerk-series 1\n# species: Sr II\n# energy-unit: cm-1\nseries,n,energy,uncertainty\n"
                + "S,20,1,1\n");
        CliTest.Run charged = CliTest.run("series", ion.toString());
        assertEquals(2, charged.code());
        assertTrue(charged.err().contains("ion.csv:2") && charged.err().contains("neutral atoms"), charged.err());

        Path few = dir.resolve("few.csv");
        Files.writeString(few, "# ritzwerk-series 1\n# species: Rb-87 I\n# energy-unit: cm-1\n"
                + "series,n,energy,uncertainty\nS,20,33305.1,0.001\nS,21,33350.1,0.001\n");
        CliTest.Run tooFew = CliTest.run("series", few.toString());
        assertEquals(2, tooFew.code());
        assertTrue(tooFew.err().contains("few.csv: a fit with 2 parameters needs at least 3 members"), tooFew.err());

        // --predict over every series: where one series has no level at an n (nS1/2 at n = 3: 3 - 3.13 < 0)
        // that series says so and the others are still predicted (nD5/2 at n = 3, extrapolated downwards)
        Path good = example(dir);
        CliTest.Run three = CliTest.run("series", good.toString(), "--predict", "10,15,3", "--format", "json");
        assertEquals(0, three.code(), three.err());
        assertTrue(three.err().contains("note: --predict 3: series nS1/2 has no member at n = 3: its fitted defect")
                && three.err().contains("leaves no positive effective n; not predicted"), three.err());
        assertTrue(three.err().contains("note: --predict 3: n = 3 lies below the lowest member of nD5/2 (n = 20)"),
                three.err());
        JsonMapper json = JsonMapper.builder().build();
        int predicted = 0;
        int absent = 0;
        for (String line : three.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            if (row.get("kind").asString().equals("prediction")) {
                boolean none = row.get("energy_per_cm").isNull();
                predicted += none ? 0 : 1;
                absent += none ? 1 : 0;
                assertEquals(none, row.get("series").asString().equals("nS1/2") && row.get("n").asInt() == 3, line);
            }
        }
        assertEquals(5, predicted);
        assertEquals(1, absent);
        CliTest.Run low = CliTest.run("series", good.toString(), "--predict", "8");
        assertEquals(0, low.code(), low.err());
        assertTrue(low.err().contains("note: --predict 8: n = 8 lies below the lowest member of nS1/2 (n = 20)"),
                low.err());

        // a row with an empty series name is refused with its line, not dropped
        Path blank = dir.resolve("blank.csv");
        Files.writeString(blank, "# ritzwerk-series 1\n# species: Rb-87 I\n# energy-unit: cm-1\n"
                + "series,n,energy,uncertainty\nS,20,33305.1,0.001\nS,22,33382.6,0.001\nS,24,33438.8,0.001\n"
                + ",45,33630,0.001\n");
        CliTest.Run unnamed = CliTest.run("series", blank.toString());
        assertEquals(2, unnamed.code(), unnamed.out());
        assertTrue(unnamed.err().contains("blank.csv:8:1: column series: series needs a name"), unnamed.err());

        // energies that fall with n are no Rydberg series: refused with the line, not fitted into nonsense
        Path falling = dir.resolve("falling.csv");
        Files.writeString(falling, "# ritzwerk-series 1\n# species: Rb-87 I\n# energy-unit: cm-1\n"
                + "series,n,energy,uncertainty\nnS1/2,20,33438.82,0.01\nnS1/2,22,33382.57,0.01\nnS1/2,24,33450.1,0.01\n");
        CliTest.Run down = CliTest.run("series", falling.toString());
        assertEquals(2, down.code(), down.out());
        assertTrue(down.err().contains("falling.csv:6:3: column energy: series 'nS1/2': the energy of n = 22 is not"
                + " above that of n = 20 (line 5)"), down.err());
    }

    /**
     * The example's members (exact, u = 1e-4 cm^-1) with nS1/2 n = 30 moved by +5 cm^-1: the fit is
     * improbable, and the command says so (summary, notes on standard error, the fit row's quality and
     * probability), shows the uncertainties scaled by S = sqrt(chi2 / dof), and flags the moved member
     * first; the unmoved file (computed members) is too good and flags no member.
     */
    @Test
    void anImprobableFitIsSaidAndItsWrongMemberFlagged(@TempDir Path dir) throws IOException {
        Path file = example(dir);
        StringBuilder moved = new StringBuilder();
        for (String line : Files.readAllLines(file)) {
            String[] f = line.split(",");
            if (line.startsWith("nS1/2,30,")) {
                line = f[0] + "," + f[1] + "," + (Double.parseDouble(f[2]) + 5) + "," + f[3];
            }
            moved.append(line).append('\n');
        }
        Path bad = dir.resolve("moved.csv");
        Files.writeString(bad, moved);
        CliTest.Run text = CliTest.run("series", bad.toString());
        assertEquals(0, text.code(), text.err());
        assertTrue(text.out().lines().findFirst().orElseThrow().contains("IMPROBABLE"), text.out());
        assertTrue(text.err().contains("note: the fit is improbable") && text.err().contains("stated uncertainties "
                + "assume the model and the data are right"), text.err());
        int line = Files.readAllLines(bad).indexOf(Files.readAllLines(bad).stream()
                .filter(l -> l.startsWith("nS1/2,30,")).findFirst().orElseThrow()) + 1;
        assertTrue(text.err().contains("the largest first: nS1/2 n = 30 (" + bad + ":" + line), text.err());
        // refitted without that member alone, the fit is consistent again (a deletion diagnostic)
        assertTrue(text.err().contains("refitted without nS1/2 n = 30 (" + bad + ":" + line + ") alone, the fit is "
                + "consistent"), text.err());

        CliTest.Run run = CliTest.run("series", bad.toString(), "--format", "json");
        JsonMapper json = JsonMapper.builder().build();
        double scale = Double.NaN;
        boolean flaggedMoved = false;
        for (String row : run.out().strip().split("\\R")) {
            JsonNode node = json.readTree(row);
            switch (node.get("kind").asString()) {
                case "fit" -> {
                    assertEquals("improbable", node.get("fit_quality").asString());
                    assertTrue(node.get("chi_square_probability").asDouble() < 1e-3, row);
                    scale = node.get("uncertainty_scale").asDouble();
                    // S = sqrt(chi2 / dof), its definition
                    assertEquals(Math.sqrt(node.get("chi_square").asDouble() / node.get("degrees_of_freedom")
                            .asDouble()), scale, 1e-6 * scale);
                }
                case "parameter" -> {
                    // the model-averaged limit carries no scaled uncertainty (its spread is its own)
                    if (!node.get("parameter").asString().endsWith("model-averaged")) {
                        assertEquals(scale * node.get("uncertainty").asDouble(),
                                node.get("scaled_uncertainty").asDouble(),
                                1e-9 * scale * node.get("uncertainty").asDouble());
                    }
                }
                case "member" -> {
                    boolean outlier = Math.abs(node.get("normalised_residual").asDouble()) > 3;
                    assertEquals(outlier, "outlier".equals(node.get("flag").asString(null)), row);
                    flaggedMoved |= outlier && node.get("series").asString().equals("nS1/2")
                            && node.get("n").asInt() == 30;
                }
                default -> { }
            }
        }
        assertTrue(scale > 1 && flaggedMoved, run.out());

        // the unmoved file's members are computed (no noise): chi2 6.7e-15 for 17 dof is too good, and said so in
        // the one note, the fit row's quality and the summary; S below 1 is not applied (common practice)
        CliTest.Run clean = CliTest.run("series", file.toString(), "--format", "json");
        assertEquals(0, clean.code(), clean.err());
        assertEquals(1, clean.err().split("note:", -1).length - 1, clean.err());
        assertTrue(clean.err().startsWith("note: the fit is too good: chi2 = ")
                && clean.err().contains("the uncertainties look overstated"), clean.err());
        assertTrue(CliTest.run("series", file.toString()).out()
                .contains("TOO GOOD, the uncertainties look overstated"));
        for (String row : clean.out().strip().split("\\R")) {
            JsonNode node = json.readTree(row);
            if (node.get("kind").asString().equals("fit")) {
                assertEquals("too-good", node.get("fit_quality").asString());
                assertEquals(1.0, node.get("uncertainty_scale").asDouble());
            } else if (node.get("kind").asString().equals("member")) {
                assertTrue(node.get("flag").isNull(), row);
            }
        }
    }

    @Test
    void badOptionsAreRefused(@TempDir Path dir) throws IOException {
        Path file = example(dir);
        String[][] cases = {
            {"--terms", "2", "--terms gives 1 count for the 2 series"},
            {"--terms", "0,2", "--terms: each number of terms must be 1 to 6, got 0"},
            {"--max-terms", "7", "--max-terms must be 1 to 6, got 7"},
            {"--predict", "0", "--predict: n must be 1 to 10000, got 0"},
            {"--plot", dir.resolve("x.jpg").toString(), "--plot must name a .png file"},
            {"--plot-series", "nS1/2", "--plot-series"}};
        for (String[] c : cases) {
            CliTest.Run run = CliTest.run("series", file.toString(), c[0], c[1]);
            assertEquals(2, run.code(), String.join(" ", c) + ": " + run.err());
            assertTrue(run.err().contains(c[2]), run.err());
        }
        CliTest.Run both = CliTest.run("series", file.toString(), "--terms", "2,2", "--max-terms", "2");
        assertEquals(2, both.code());
        CliTest.Run none = CliTest.run("series", dir.resolve("missing.csv").toString());
        assertEquals(2, none.code());
        assertTrue(none.err().contains("missing.csv: no such file"), none.err());
    }

    /**
     * The reviewer's --predict 4,5,6 on the example: 4s (below the ground level) is withheld with no value,
     * and 5s, whose stated uncertainty was 31.5 cm-1 at 476 cm-1, now carries the expansion's truncation and
     * covers the real 5s at 0 (Rb I ground level, by definition).
     */
    @Test
    void predictionsBelowTheMembersAreWithheldOrCarryTheTruncation(@TempDir Path dir) throws IOException {
        Path file = example(dir);
        CliTest.Run run = CliTest.run("series", file.toString(), "--predict", "4,5,6", "--format", "json");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.err().contains("note: --predict 4: series nS1/2 at n = 4 comes out below the ground level"),
                run.err());
        JsonMapper json = JsonMapper.builder().build();
        int seen = 0;
        for (String line : run.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            if (!row.get("kind").asString().equals("prediction")) {
                continue;
            }
            boolean fourS = row.get("series").asString().equals("nS1/2") && row.get("n").asInt() == 4;
            assertEquals(fourS, row.get("energy_per_cm").isNull(), line);
            if (row.get("series").asString().equals("nS1/2") && row.get("n").asInt() == 5) {
                assertTrue(Math.abs(row.get("energy_per_cm").asDouble()) <= row.get("uncertainty_per_cm").asDouble()
                        && row.get("truncation_per_cm").asDouble() > 100, line);
                seen++;
            }
        }
        assertEquals(1, seen, run.out());
    }

    /**
     * A series whose d2 is small (invented, 0.01; members exact with the built-in Rb-87 limit of Mack et al.
     * 2011): the criterion keeps d2, but the model with d0 alone keeps about 6 % of the weight and cannot be
     * extrapolated below the members, so the averaged member at n = 10 is withheld with a note naming that
     * model while the chosen model's is given; above the members both are given.
     */
    @Test
    void anAveragedMemberIsWithheldWhereAWeightyModelGivesNone(@TempDir Path dir) throws IOException {
        StringBuilder b = new StringBuilder("# ritzwerk-series 1\n# species: Rb-87 I\n# energy-unit: cm-1\n"
                + "series,n,energy,uncertainty\n");
        double rydberg = 109736.623008; // Rb-87 R_M as the example file's header gives it (SeriesFitterTest)
        for (int n = 20; n <= 40; n += 2) {
            b.append(String.format(java.util.Locale.ROOT, "x,%d,%.9f,0.0001%n", n,
                    org.ritzwerk.engine.rydberg.AlkaliAtom.rydbergRitzEnergy(LIMIT, rydberg, java.util.List.of(
                            3.1311807, 0.01), n)));
        }
        Path file = dir.resolve("small-d2.csv");
        Files.writeString(file, b);
        CliTest.Run run = CliTest.run("series", file.toString(), "--predict", "10,50", "--format", "json");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.err().contains("note: --predict 10: the model-averaged x n = 10 is withheld: the models with "
                + "terms [1], 0.06"), run.err());
        JsonMapper json = JsonMapper.builder().build();
        int seen = 0;
        for (String line : run.out().strip().split("\\R")) {
            JsonNode row = json.readTree(line);
            if (row.get("kind").asString().equals("prediction")) {
                boolean ten = row.get("n").asInt() == 10;
                assertFalse(row.get("energy_per_cm").isNull(), line);
                assertEquals(ten, row.get("averaged_energy_per_cm").isNull(), line);
                assertEquals(ten, "averaged withheld (see note)".equals(row.get("note").asString(null)), line);
                seen++;
            }
        }
        assertEquals(2, seen, run.out());
    }

    /**
     * A series shaped like Sr-88 5snd 1D2 (d0 2.3807, d2 -39.41, d4 -109.25 and limit 45932.2002 cm-1 of
     * C. L. Vaillant, M. P. A. Jones and R. M. Potvliege, J. Phys. B 45, 135004 (2012), from memory), members
     * n = 20-60 step 2 from {@code E = limit - R_M / (n - delta)^2} with R_M of Sr-88 (CODATA 2018 R_inf, AME2020
     * mass 87.9056122571 u, from memory), noise of u = 0.001 cm-1 from seed 2: the criterion drops d4, and the
     * command says the choice is unsettled (summary, note, JSON) and what to quote; the notes follow the tables.
     */
    @Test
    void anUnsettledChoiceOfTermsIsSaid(@TempDir Path dir) throws IOException {
        double electronU = 5.48579909065e-4;
        double rm = 109737.31568160 / (1 + electronU / (87.9056122571 - electronU));
        Random r = new Random(2);
        StringBuilder b = new StringBuilder("# ritzwerk-series 1\n# species: Sr-88 I\n# energy-unit: cm-1\n"
                + "series,n,energy,uncertainty\n");
        for (int n = 20; n <= 60; n += 2) {
            double x = n - 2.3807;
            double delta = 2.3807 - 39.41 / (x * x) - 109.25 / (x * x * x * x);
            b.append(String.format(Locale.ROOT, "5snd 1D2,%d,%.7f,0.001%n", n,
                    45932.2002 - rm / ((n - delta) * (n - delta)) + 0.001 * r.nextGaussian()));
        }
        Path file = dir.resolve("sr-1d2.csv");
        Files.writeString(file, b);
        CliTest.Run text = CliTest.run("series", file.toString());
        assertEquals(0, text.code(), text.err());
        String summary = text.out().lines().findFirst().orElseThrow();
        assertTrue(summary.contains("the choice of terms is UNSETTLED: see the notes"), summary);
        // the chi-square probability with three digits (0.66 and 0.996 told apart)
        assertTrue(summary.matches(".*\\(probability 0\\.\\d{3}\\).*"), summary);
        assertTrue(text.err().contains("note: the choice of terms [2] is unsettled: the model with terms [3], which "
                + "carries 0.4"), text.err());
        assertTrue(text.err().contains("Quote the fit with the terms fixed (--terms 3, SeriesFitter.withTerms)"),
                text.err());
        JsonMapper json = JsonMapper.builder().build();
        CliTest.Run run = CliTest.run("series", file.toString(), "--format", "json");
        JsonNode fit = json.readTree(run.out().lines().findFirst().orElseThrow());
        assertEquals("unsettled", fit.get("term_choice").asString());
        CliTest.Run three = CliTest.run("series", file.toString(), "--format", "json", "--terms", "3");
        assertEquals("one-model", json.readTree(three.out().lines().findFirst().orElseThrow()).get("term_choice")
                .asString());
        assertFalse(three.err().contains("unsettled"), three.err());

        // both streams into one: the tables come first and end their line, then the notes on lines of their own
        StringWriter both = new StringWriter();
        PrintWriter writer = new PrintWriter(both);
        assertEquals(0, Main.run(writer, writer, "series", file.toString(), "--predict", "15"));
        String merged = both.toString();
        int firstNote = merged.indexOf("note: ");
        assertTrue(firstNote > merged.indexOf("models tried") && merged.charAt(firstNote - 1) == '\n', merged);
        assertTrue(merged.lines().filter(l -> l.contains("note: ")).allMatch(l -> l.startsWith("note: ")), merged);
    }
}
