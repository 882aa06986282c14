package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.MeasuredLevel;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.data.ReferenceDataProvider;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.NuclearData;
import org.ritzwerk.testing.ProviderJars;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The command line's data comes from its data context: a user's file given with {@code --data}
 * and a third-party provider jar on the class path each replace the nuclear data, a quantum-defect
 * set and a lamp set, and so change what the commands print. Every replacement value is invented
 * for the test, except where a jar supplies the built-in values to show it gives the same output.
 */
class DataContextCommandTest {

    /** An isotope file in the built-in format: H-1 made 1.5 u heavy (invented for tests). */
    private static final String ISOTOPES = String.join("\n",
            "# id: test-isotopes",
            "# title: invented isotopes for tests",
            "# source: invented for tests",
            "# provenance: published",
            "# version: 1",
            String.join(",", NuclearData.ISOTOPE_COLUMNS),
            "1,1,H,1.5,0,TEST,1/2,2.79284734463,,TEST,0.8414,,TEST",
            "");

    private static final String NUCLEAR_PROVIDER = String.join("\n",
            "package com.example.nuclear;",
            "import java.util.List;",
            "import java.util.OptionalDouble;",
            "import org.ritzwerk.data.*;",
            "public final class HeavyHydrogen implements ReferenceDataProvider {",
            "  public String id() { return \"example-nuclear\"; }",
            "  private static DataSetInfo info() {",
            "    return new DataSetInfo(\"example-isotopes\", DataKind.NUCLEAR, \"invented isotopes\", \"1\",",
            "        Provenance.published(\"invented for tests\"), List.of());",
            "  }",
            "  public List<DataSetInfo> dataSets() { return List.of(info()); }",
            "  public DataSet load(String id) {",
            "    return new IsotopeTable(info(), List.of(",
            "        new Isotope(1, 1, 1.5, 0, 1, OptionalDouble.of(2.79284734463), OptionalDouble.of(0.8414), \"x\")));",
            "  }",
            "}");

    // ------------------------------------------------------------------ nuclear data

    @Test
    void aUserIsotopeFileMovesTheHydrogenLines(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("isotopes.csv");
        Files.writeString(file, ISOTOPES, StandardCharsets.UTF_8);
        double before = lymanAlphaPerCm(CliTest.run(lyman()));
        double after = lymanAlphaPerCm(CliTest.run(lyman("--data", file.toString())));
        assertHeavierHydrogen(before, after);
    }

    @Test
    void aThirdPartyNuclearProviderMovesTheHydrogenLines(@TempDir Path dir) throws Exception {
        double before = lymanAlphaPerCm(CliTest.run(lyman()));
        double after = withProvider(dir, "com.example.nuclear.HeavyHydrogen", NUCLEAR_PROVIDER,
                () -> lymanAlphaPerCm(CliTest.run(lyman())));
        assertHeavierHydrogen(before, after);
    }

    private static String[] lyman(String... more) {
        List<String> args = new ArrayList<>(List.of("lines", "--species", "H I", "--from", "121.5 nm", "--to",
                "121.6 nm", "--format", "csv"));
        args.addAll(List.of(more));
        return args.toArray(new String[0]);
    }

    /** @return the wavenumber of Lyman alpha 2p 2P3/2 - 1s in cm-1, from the csv of {@code lines} */
    private static double lymanAlphaPerCm(CliTest.Run run) {
        assertEquals(0, run.code(), run.err());
        List<String> rows = run.out().lines().collect(Collectors.toList());
        List<String> header = List.of(rows.get(0).split(","));
        int column = header.indexOf("wavenumber_per_cm");
        assertTrue(column >= 0, rows.get(0));
        return rows.stream().skip(1).filter(r -> r.contains("2p 2P3/2")).map(r -> r.split(",")[column])
                .mapToDouble(Double::parseDouble).findFirst().orElseThrow();
    }

    /** H-1 at 1.5 u instead of 1.007825 u: the reduced-mass factor raises Lyman alpha by 1.8e-4 (common practice). */
    private static void assertHeavierHydrogen(double before, double after) {
        double me = 5.48579909e-4; // electron mass in u (CODATA 2018)
        double expected = (1 + me / (1.007825032 - me)) / (1 + me / (1.5 - me)); // nuclear masses, u
        assertEquals(expected, after / before, 1e-7, before + " -> " + after);
    }

    // ------------------------------------------------------------------ quantum defects

    @Test
    void aUserQuantumDefectFileMovesTheRydbergLevels(@TempDir Path dir) throws IOException {
        String builtIn;
        try (var in = NuclearData.class.getResourceAsStream("rydberg/quantum-defects-rb-87.csv")) {
            builtIn = new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
        assertTrue(builtIn.contains("\n0,1/2,3.1311807,"));
        Path file = dir.resolve("my-rb-87.csv");
        Files.writeString(file, builtIn.replace("# id: quantum-defects-rb-87", "# id: my-rb-87")
                .replace("\n0,1/2,3.1311807,", "\n0,1/2,3.1411807,"), StandardCharsets.UTF_8);
        CliTest.Run checked = CliTest.run("data", "check", file.toString());
        assertEquals(0, checked.code(), checked.err());
        assertTrue(checked.out().strip().matches(java.util.regex.Pattern.quote(file.toString())
                + ": ok, \\d+ quantum-defect series of Rb-87 I \\(id my-rb-87\\)"), checked.out());
        double before = rb50s();
        double after = rb50s("--data", file.toString());
        // d0 up by 0.01 at n* = 46.86: E = limit - R_M / n*^2 drops by 2 R_M 0.01 / n*^3 = 0.0213 cm-1.
        assertEquals(-0.0213, after - before, 0.0005, before + " -> " + after);
        assertTrue(CliTest.run("data", "--data", file.toString()).out().lines()
                .anyMatch(l -> l.startsWith("my-rb-87") && l.contains("user")));
    }

    @Test
    void aThirdPartyQuantumDefectSetMovesTheRydbergLevels(@TempDir Path dir) throws Exception {
        double before = rb50s();
        double after = withProvider(dir, "com.example.rydberg.PlainRubidium", ProviderJars.PLAIN_RB87_SOURCE,
                () -> rb50s());
        double rydberg = DataContext.builtIn().alkaliAtom(Species.parse("Rb-87 I")).rydbergPerCm();
        assertEquals(33690.8 - rydberg / (47.0 * 47.0), after, 1e-6);
        assertNotEquals(before, after);
    }

    /**
     * A third-party jar, compiled against the api only, supplies a whole Rb-87 atom: a quantum-defect
     * set that carries its core polarizabilities and names the jar's own measured-levels set. With
     * the built-in values under other ids, {@code levels} prints exactly what the built-in data gives
     * (measured, fitted and core-polarization levels, and lifetimes).
     */
    @Test
    void aThirdPartyQuantumDefectSetWithCoreAndLevelsGivesTheBuiltInAtom(@TempDir Path dir) throws Exception {
        DataContext builtIn = DataContext.builtIn();
        QuantumDefects defects = (QuantumDefects) builtIn.registry().load("quantum-defects-rb-87");
        LevelList table = (LevelList) builtIn.registry().load(defects.levelsId().orElseThrow());
        // The built-in atom takes Rb-87's own D-line centroids for 5p (AlkaliHyperfine) in place of the
        // natural element's table; a third party's table is taken as it is, so the jar gets the table
        // with those two levels as the built-in atom has them.
        List<MeasuredLevel> measured = builtIn.alkaliAtom(Species.parse("Rb-87 I")).measuredLevels();
        LevelList.Builder copy = LevelList.builder(table.info(), table.unit(), table.note());
        for (int i = 0; i < table.size(); i++) {
            double energy = table.energy(i);
            double uncertainty = table.uncertainty(i).orElse(Double.NaN);
            for (MeasuredLevel m : measured) {
                if (m.state().notation().equals(table.label(i)) && m.source().startsWith("d-lines: ")) {
                    energy = m.energyPerCm();
                    uncertainty = m.uncertaintyPerCm(); // the D-line measurement's, as the built-in atom has it
                }
            }
            copy.add(table.species(i), table.label(i), energy, uncertainty, table.twoJ(i), table.rowNote(i));
        }
        LevelList levels = copy.build();
        String source = ProviderJars.wholeAlkaliSource("com.example.rydberg.WholeRubidium", defects, levels, "example-qd-rb-87",
                "example-levels-rb-87");
        String[] args = {"levels", "--species", "Rb-87 I", "--n-max", "20", "--l-max", "4", "--lifetimes",
            "--format", "csv"};
        CliTest.Run before = CliTest.run(args);
        assertEquals(0, before.code(), before.err());
        assertTrue(before.out().contains("core-polarization") && before.out().contains("measured"), before.out());
        CliTest.Run after = withProvider(dir, "com.example.rydberg.WholeRubidium", source, () -> {
            CliTest.Run listed = CliTest.run("data");
            assertTrue(listed.out().lines().anyMatch(l -> l.startsWith("example-qd-rb-87") && l.contains("third-party")),
                    listed.out());
            assertTrue(listed.out().lines().anyMatch(l -> l.startsWith("example-levels-rb-87")
                    && l.contains("third-party")), listed.out());
            return CliTest.run(args);
        });
        assertEquals(0, after.code(), after.err());
        assertEquals(before.out(), after.out());
        assertEquals(before.err(), after.err());
    }

    /** @return the energy of Rb-87 50s in cm-1 as {@code levels} prints it */
    @Test
    void aUserLevelFileOfAnAlkaliAtomMovesItsLevelsAndLines(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("my-li.csv");
        // Li I levels; the 3s energy 27206.09 cm-1 is invented for the test (the built-in one differs).
        Files.writeString(file, String.join("\n", "# ritzwerk-levels 1", "# id: my-li-levels",
                "# title: invented test levels", "# source: invented for tests", "# provenance: measured",
                "# version: 1", "# energy-unit: cm-1", "species,label,energy,uncertainty,j,note",
                "Li I,2s 2S1/2,0,0.001,1/2,", "Li I,2p 2P3/2,14904.00,0.001,3/2,",
                "Li I,3s 2S1/2,27206.09,0.002,1/2,", ""), StandardCharsets.UTF_8);
        CliTest.Run levels = CliTest.run("levels", "--species", "Li I", "--n-max", "3", "--format", "csv", "--data",
                file.toString());
        assertEquals(0, levels.code(), levels.err());
        List<String> rows = levels.out().lines().collect(Collectors.toList());
        int column = List.of(rows.get(0).split(",")).indexOf("energy_per_cm");
        assertEquals(27206.09, rows.stream().filter(r -> r.contains("3s 2S1/2")).map(r -> r.split(",")[column])
                .mapToDouble(Double::parseDouble).findFirst().orElseThrow(), 0.0, levels.out());
        CliTest.Run lines = CliTest.run("lines", "--species", "Li I", "--transition", "3s1/2 -> 2p3/2", "--format",
                "csv", "--data", file.toString());
        assertEquals(0, lines.code(), lines.err());
        List<String> lineRows = lines.out().lines().collect(Collectors.toList());
        int wavenumber = List.of(lineRows.get(0).split(",")).indexOf("wavenumber_per_cm");
        assertTrue(wavenumber >= 0, lineRows.get(0));
        // 27206.09 - 14904.00 cm-1: the file's two levels (printed to 1e-5 cm-1).
        assertEquals(27206.09 - 14904.00, Double.parseDouble(lineRows.get(1).split(",")[wavenumber]), 2e-5);
    }

    private static double rb50s(String... more) {
        List<String> args = new ArrayList<>(List.of("levels", "--species", "Rb-87 I", "--n-max", "50", "--l-max",
                "0", "--format", "csv"));
        args.addAll(List.of(more));
        CliTest.Run run = CliTest.run(args.toArray(new String[0]));
        assertEquals(0, run.code(), run.err());
        List<String> rows = run.out().lines().collect(Collectors.toList());
        int column = List.of(rows.get(0).split(",")).indexOf("energy_per_cm");
        assertTrue(column >= 0, rows.get(0));
        return rows.stream().filter(r -> r.contains("50s 2S1/2")).map(r -> r.split(",")[column])
                .mapToDouble(Double::parseDouble).findFirst().orElseThrow();
    }

    // ------------------------------------------------------------------ lamp sets

    @Test
    void aUserLampSetAndAThirdPartyLampSetChangeWhatCalibratePairs(@TempDir Path dir) throws Exception {
        Path spectrum = dir.resolve("neon.csv");
        CliTest.Run synth = CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "540,0.06,-2e-6", "--pixels",
                "2048", "--medium", "air", "--temperature", "400", "--resolving-power", "4000", "--read-noise", "4",
                "--seed", "12", "--out", spectrum.toString());
        assertEquals(0, synth.code(), synth.err());
        List<Double> builtIn = calibrate(dir, spectrum, "lamp-ne-i");
        // Our own neon set: the built-in one without the first line the built-in calibration used.
        double dropped = builtIn.get(0);
        LineList neon = DataContext.builtIn().lampLines(Species.parse("Ne I"));
        StringBuilder file = new StringBuilder("# ritzwerk-lines 1\n# id: my-ne-i\n# title: my neon lamp\n"
                + "# source: invented for tests\n# provenance: measured\n# version: 1\n# kind: lamp-lines\n"
                + "# position-unit: nm\n# medium: air\nspecies,position,intensity\n");
        StringBuilder provider = new StringBuilder(String.join("\n",
                "package com.example.lamps;",
                "import java.util.List;",
                "import org.ritzwerk.atom.Species;",
                "import org.ritzwerk.data.*;",
                "import org.ritzwerk.medium.Medium;",
                "import org.ritzwerk.quantity.Unit;",
                "public final class MyNeon implements ReferenceDataProvider {",
                "  public String id() { return \"example-lamps\"; }",
                "  private static DataSetInfo info() {",
                "    return new DataSetInfo(\"example-ne-i\", DataKind.LAMP_LINES, \"neon lamp\", \"1\",",
                "        Provenance.published(\"invented for tests\"), List.of(Species.parse(\"Ne I\")));",
                "  }",
                "  public List<DataSetInfo> dataSets() { return List.of(info()); }",
                "  public DataSet load(String id) {",
                "    Species ne = Species.parse(\"Ne I\");",
                "    return LineList.builder(info(), Unit.NANOMETRE, Medium.air(), \"\")"));
        for (int i = 0; i < neon.size(); i++) {
            if (neon.position(i) == dropped || neon.intensity(i).isEmpty()) {
                continue;
            }
            String position = Double.toString(neon.position(i));
            String intensity = Double.toString(neon.intensity(i).getAsDouble());
            file.append("Ne I,").append(position).append(',').append(intensity).append('\n');
            provider.append("\n        .add(ne, ").append(position).append(", Double.NaN, ").append(intensity)
                    .append(", null, Double.NaN, null, null, null)");
        }
        provider.append("\n        .build();\n  }\n}\n");
        Path mine = dir.resolve("my-neon.csv");
        Files.writeString(mine, file, StandardCharsets.UTF_8);

        List<Double> fromFile = calibrate(dir, spectrum, "my-ne-i", "--data", mine.toString());
        assertFalse(fromFile.contains(dropped), fromFile.toString());
        assertEquals(builtIn.size() - 1, fromFile.size(), builtIn + " vs " + fromFile);

        List<Double> fromJar = withProvider(dir.resolve("jar"), "com.example.lamps.MyNeon", provider.toString(), () -> {
            CliTest.Run listed = CliTest.run("data");
            assertTrue(listed.out().lines().anyMatch(l -> l.startsWith("example-ne-i") && l.contains("third-party")),
                    listed.out());
            return calibrate(dir, spectrum, "example-ne-i");
        });
        assertEquals(fromFile, fromJar);
    }

    /** @return the lamp wavelengths (nm, air) the calibration used, after checking which set it named */
    private static List<Double> calibrate(Path dir, Path spectrum, String expectedSet, String... more)
            throws IOException {
        Path out = dir.resolve("calibration-" + expectedSet + ".json");
        List<String> args = new ArrayList<>(List.of("calibrate", spectrum.toString(), "--lamp", "Ne I", "--out",
                out.toString()));
        args.addAll(List.of(more));
        CliTest.Run run = CliTest.run(args.toArray(new String[0]));
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("lamp: " + expectedSet), run.out());
        JsonNode root = JsonMapper.builder().build().readTree(Files.readString(out));
        List<Double> used = new ArrayList<>();
        for (JsonNode line : root.get("lines")) {
            if (line.get("used").asBoolean()) {
                used.add(line.get("wavelength_nm").asDouble());
            }
        }
        return used;
    }

    // ------------------------------------------------------------------ provider jars

    /**
     * Compiles a provider, packs it into a jar with its ServiceLoader entry, and runs {@code body}
     * with the jar on the context class loader, which the command line's discovery searches.
     */
    private static <T> T withProvider(Path dir, String className, String source, Callable<T> body) throws Exception {
        Path jar = ProviderJars.build(dir, className, source);
        Thread thread = Thread.currentThread();
        ClassLoader previous = thread.getContextClassLoader();
        try (URLClassLoader loader = new URLClassLoader(new URL[] {jar.toUri().toURL()},
                DataContextCommandTest.class.getClassLoader())) {
            thread.setContextClassLoader(loader);
            return body.call();
        } finally {
            thread.setContextClassLoader(previous);
        }
    }
}
