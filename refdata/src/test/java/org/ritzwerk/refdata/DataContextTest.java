package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.MeasuredLevel;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.LevelOrigin;
import org.ritzwerk.refdata.internal.RydbergData;
import org.ritzwerk.testing.ProviderJars;

/**
 * The data context: it answers like the built-in data when built from it, and a user's file or a
 * third-party provider jar replaces each kind of data (nuclear, quantum defects, lamp lines) and
 * so changes what is computed. Every replacement value here is invented for the test.
 */
class DataContextTest {

    private static final Species H = Species.parse("H I");
    private static final Species RB87 = Species.parse("Rb-87 I");
    private static final Species NE = Species.parse("Ne I");
    private static final State S50 = State.of(50, 0, 1);

    /** An isotope file in the built-in format: H-1 made 1.5 u heavy, Rb-87 made 88 u (invented for tests). */
    private static final String ISOTOPES = String.join("\n",
            "# id: test-isotopes",
            "# title: invented isotopes for tests",
            "# source: invented for tests",
            "# provenance: published",
            "# version: 1",
            "# a comment line",
            String.join(",", NuclearData.ISOTOPE_COLUMNS),
            "1,1,H,1.5,0,TEST,1/2,2.79284734463,,TEST,0.8414,,TEST",
            "37,87,Rb,88.0,0,TEST,3/2,2.75,,TEST,4.1989,,TEST",
            "");

    /** A third party's nuclear data: the same invented masses as {@link #ISOTOPES}. */
    private static final String NUCLEAR_PROVIDER = String.join("\n",
            "package com.example.nuclear;",
            "import java.util.List;",
            "import java.util.OptionalDouble;",
            "import org.ritzwerk.data.*;",
            "public final class HeavyIsotopes implements ReferenceDataProvider {",
            "  public String id() { return \"example-nuclear\"; }",
            "  private static DataSetInfo info() {",
            "    return new DataSetInfo(\"example-isotopes\", DataKind.NUCLEAR, \"invented isotopes\", \"1\",",
            "        Provenance.published(\"invented for tests\"), List.of());",
            "  }",
            "  public List<DataSetInfo> dataSets() { return List.of(info()); }",
            "  public DataSet load(String id) {",
            "    return new IsotopeTable(info(), List.of(",
            "        new Isotope(1, 1, 1.5, 0, 1, OptionalDouble.of(2.79284734463), OptionalDouble.of(0.8414), \"invented\"),",
            "        new Isotope(37, 87, 88.0, 0, 3, OptionalDouble.of(2.75), OptionalDouble.of(4.1989), \"invented\")));",
            "  }",
            "}");

    /** A third party's neon lamp: one line only (invented for tests). */
    private static final String LAMP_PROVIDER = String.join("\n",
            "package com.example.lamps;",
            "import java.util.List;",
            "import org.ritzwerk.atom.Species;",
            "import org.ritzwerk.data.*;",
            "import org.ritzwerk.medium.Medium;",
            "import org.ritzwerk.quantity.Unit;",
            "public final class OneLineNeon implements ReferenceDataProvider {",
            "  public String id() { return \"example-lamps\"; }",
            "  private static DataSetInfo info() {",
            "    return new DataSetInfo(\"example-ne-i\", DataKind.LAMP_LINES, \"invented neon lamp\", \"1\",",
            "        Provenance.published(\"invented for tests\"), List.of(Species.parse(\"Ne I\")));",
            "  }",
            "  public List<DataSetInfo> dataSets() { return List.of(info()); }",
            "  public DataSet load(String id) {",
            "    return LineList.builder(info(), Unit.NANOMETRE, Medium.air(), \"\")",
            "        .add(Species.parse(\"Ne I\"), 640.225, Double.NaN, Double.NaN, null, Double.NaN, null, null, \"x\")",
            "        .build();",
            "  }",
            "}");

    /** Nulls are refused where they are given, with the argument's name. */
    @Test
    void nullArgumentsAreNamed() {
        DataContext data = DataContext.builtIn();
        assertEquals("species", assertThrows(NullPointerException.class, () -> data.nucleus(null)).getMessage());
        assertEquals("file", assertThrows(NullPointerException.class, () -> data.withUserFile(null)).getMessage());
        assertEquals("providers", assertThrows(NullPointerException.class,
                () -> DataRegistry.of(null, org.ritzwerk.data.Origin.values()[0])).getMessage());
    }

    @Test
    void theBuiltInContextAnswersAsTheBuiltInData() {
        DataContext context = DataContext.builtIn();
        assertEquals(NuclearData.builtIn().nucleus(H), context.nucleus(H));
        assertEquals(85, context.defaultMassNumber(37).orElseThrow());
        AlkaliAtom fromContext = context.alkaliAtom(RB87);
        AlkaliAtom builtIn = RydbergData.builtIn().atom(RB87);
        assertEquals(builtIn.rydbergPerCm(), fromContext.rydbergPerCm(), 0.0);
        assertEquals(builtIn.energyPerCm(S50), fromContext.energyPerCm(S50), 0.0);
        assertEquals(builtIn.measuredLevels(), fromContext.measuredLevels());
        assertEquals(builtIn.corePolarizability(), fromContext.corePolarizability());
        assertEquals(RydbergData.builtIn().species(), context.alkaliSpecies());
        assertEquals(Species.parse("Rb-85 I"), context.alkaliAtom(Species.parse("Rb I")).species());
        assertSame(fromContext, context.alkaliAtom(RB87), "assembled once");
        assertEquals(RydbergData.builtIn().modelPotential(RB87), context.modelPotential(RB87));
        assertEquals(DataRegistry.builtIn().lampLines(NE).size(), context.lampLines(NE).size());
    }

    @Test
    void aUserIsotopeFileChangesHydrogenLinesAndRydbergConstants(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("isotopes.csv");
        Files.writeString(file, ISOTOPES, StandardCharsets.UTF_8);
        DataContext builtIn = DataContext.builtIn();
        DataContext mine = builtIn.withUserFile(file);
        assertHeavierHydrogenAndRubidium(builtIn, mine);
        // The user's file names no default isotopes: the built-in ones stay, the other isotopes too.
        assertEquals(85, mine.defaultMassNumber(37).orElseThrow());
        assertEquals(builtIn.nucleus(Species.parse("He II")), mine.nucleus(Species.parse("He II")));
        assertEquals("test-isotopes", mine.registry().list().get(0).info().id());
        // printed in precedence order, the user's file first (it printed Class@hash; library review)
        String built = builtIn.toString();
        assertTrue(built.startsWith("DataContext[built-in ") && built.endsWith("]"), built);
        assertEquals("DataContext[user file:" + file + ", " + built.substring("DataContext[".length()),
                mine.toString());
    }

    @Test
    void aUserIsotopeFileOfTheBuiltInIdReplacesTheBuiltInTableButKeepsTheDefaults(@TempDir Path dir)
            throws IOException {
        Path file = dir.resolve("isotopes.csv");
        Files.writeString(file, ISOTOPES.replace("test-isotopes", NuclearData.DATA_SET_ID), StandardCharsets.UTF_8);
        DataContext mine = DataContext.builtIn().withUserFile(file);
        assertEquals(1.5, mine.isotope(H).atomicMass(), 0.0);
        ReferenceDataException gone = assertThrows(ReferenceDataException.class,
                () -> mine.nucleus(Species.parse("He II")));
        assertEquals(ReferenceDataException.UNKNOWN_ISOTOPE, gone.code());
        assertEquals(87, mine.isotope(Species.parse("Rb-87 I")).massNumber());
        assertEquals(85, mine.defaultMassNumber(37).orElseThrow());
    }

    @Test
    void aThirdPartyNuclearProviderChangesHydrogenLinesAndRydbergConstants(@TempDir Path dir) throws IOException {
        Path jar = ProviderJars.build(dir, "com.example.nuclear.HeavyIsotopes", NUCLEAR_PROVIDER);
        try (URLClassLoader loader = new URLClassLoader(new URL[] {jar.toUri().toURL()}, getClass().getClassLoader())) {
            DataContext theirs = DataContext.of(DataRegistry.discover(loader));
            assertHeavierHydrogenAndRubidium(DataContext.builtIn(), theirs);
            assertEquals(85, theirs.defaultMassNumber(37).orElseThrow());
        }
    }

    /** H-1 at 1.5 u and Rb-87 at 88 u move Lyman alpha and the Rb 50s level as the reduced mass says. */
    private static void assertHeavierHydrogenAndRubidium(DataContext before, DataContext after) {
        Nucleus light = before.nucleus(H);
        Nucleus heavy = after.nucleus(H);
        assertEquals(1.5, after.isotope(H).atomicMass(), 0.0);
        double lymanBefore = lymanAlpha(before);
        double lymanAfter = lymanAlpha(after);
        assertNotEquals(lymanBefore, lymanAfter);
        // Energies scale with the reduced mass m M / (m + M) (common practice); recoil terms beyond it are < 1e-7.
        double me = org.ritzwerk.constants.PhysicalConstants.ELECTRON_MASS.value();
        double expected = (1 + me / light.massKg()) / (1 + me / heavy.massKg());
        assertEquals(expected, lymanAfter / lymanBefore, 1e-7);
        AlkaliAtom rbBefore = before.alkaliAtom(RB87);
        AlkaliAtom rbAfter = after.alkaliAtom(RB87);
        assertEquals(QuantumDefectFiles.rydbergPerCm(88.0), rbAfter.rydbergPerCm(), 0.0);
        double nStar = rbBefore.level(S50).effectiveN();
        assertEquals(-(rbAfter.rydbergPerCm() - rbBefore.rydbergPerCm()) / (nStar * nStar),
                rbAfter.energyPerCm(S50) - rbBefore.energyPerCm(S50), 1e-9);
        assertNotEquals(rbBefore.energyPerCm(S50), rbAfter.energyPerCm(S50));
    }

    private static double lymanAlpha(DataContext context) {
        HydrogenLikeModel model = HydrogenLikeModel.of(context.nucleus(H), Tier.QED);
        return model.energy(2, 1, 3) - model.energy(1, 0, 1);
    }

    @Test
    void aUserQuantumDefectFileChangesRydbergLevels(@TempDir Path dir) throws IOException {
        String builtInText = builtInRb87Defects();
        assertTrue(builtInText.contains("\n0,1/2,3.1311807,"));
        Path file = dir.resolve("my-rb-87.csv");
        // Another id, and an s-series d0 larger by 0.01 (invented for the test); it names the built-in levels.
        Files.writeString(file, builtInText.replace("# id: quantum-defects-rb-87", "# id: my-rb-87")
                .replace("\n0,1/2,3.1311807,", "\n0,1/2,3.1411807,"), StandardCharsets.UTF_8);
        DataContext builtIn = DataContext.builtIn();
        DataContext mine = builtIn.withUserFile(file);
        AlkaliAtom before = builtIn.alkaliAtom(RB87);
        AlkaliAtom after = mine.alkaliAtom(RB87);
        assertEquals("my-rb-87", after.quantumDefects().info().id());
        assertEquals(before.measuredLevels(), after.measuredLevels(), "the levels set it names");
        assertEquals(before.corePolarizability(), after.corePolarizability());
        assertEquals(before.rydbergPerCm(), after.rydbergPerCm(), 0.0);
        double nStar = before.level(S50).effectiveN();
        assertEquals(nStar - 0.01, after.level(S50).effectiveN(), 1e-6);
        assertTrue(after.energyPerCm(S50) < before.energyPerCm(S50) - 0.01);
        // p levels are untouched.
        assertEquals(before.energyPerCm(State.of(50, 1, 3)), after.energyPerCm(State.of(50, 1, 3)), 0.0);
    }

    @Test
    void aUserQuantumDefectFileMustNameALevelsSetThatExists(@TempDir Path dir) throws IOException {
        String text = builtInRb87Defects();
        Path file = dir.resolve("my-rb-87.csv");
        Files.writeString(file, text.replace("# id: quantum-defects-rb-87", "# id: my-rb-87")
                .replace("# levels: levels-rb-87", "# levels: my-missing-levels"), StandardCharsets.UTF_8);
        DataContext mine = DataContext.builtIn().withUserFile(file);
        ReferenceDataException e = assertThrows(ReferenceDataException.class, () -> mine.alkaliAtom(RB87));
        assertEquals("quantum-defect set 'my-rb-87' names levels 'my-missing-levels': no data set 'my-missing-levels';"
                + " 'ritzwerk data' lists the sets available", e.getMessage());
    }

    @Test
    void aThirdPartyQuantumDefectSetChangesRydbergLevels(@TempDir Path dir) throws IOException {
        Path jar = ProviderJars.build(dir, "com.example.rydberg.PlainRubidium", ProviderJars.PLAIN_RB87_SOURCE);
        try (URLClassLoader loader = new URLClassLoader(new URL[] {jar.toUri().toURL()}, getClass().getClassLoader())) {
            DataContext theirs = DataContext.of(DataRegistry.discover(loader));
            AlkaliAtom rb = theirs.alkaliAtom(RB87);
            assertEquals("example-rb-87", rb.quantumDefects().info().id());
            // A bare record: no measured levels, no core; R_M from the context's nuclear data, not the record's.
            assertTrue(rb.measuredLevels().isEmpty());
            assertTrue(rb.corePolarizability().isEmpty());
            double rydberg = QuantumDefectFiles.rydbergPerCm(theirs.isotope(RB87).atomicMass());
            assertEquals(rydberg, rb.rydbergPerCm(), 0.0);
            assertEquals(LevelOrigin.QUANTUM_DEFECT_FIT, rb.level(S50).origin());
            assertEquals(33690.8 - rydberg / (47.0 * 47.0), rb.energyPerCm(S50), 1e-9);
            assertNotEquals(DataContext.builtIn().alkaliAtom(RB87).energyPerCm(S50), rb.energyPerCm(S50));
        }
    }

    /**
     * A third party can supply a whole alkali atom through the api alone: its quantum-defect record
     * carries the core polarizabilities and names its own levels set. Here the jar supplies the
     * built-in Rb-87 values under other ids (so nothing is shadowed and the third-party sets win by
     * precedence), and the context builds the same atom as from the built-in data.
     */
    @Test
    void aThirdPartyQuantumDefectSetWithCoreAndLevelsGivesTheWholeAtom(@TempDir Path dir) throws IOException {
        DataContext builtIn = DataContext.builtIn();
        QuantumDefects defects = (QuantumDefects) builtIn.registry().load("quantum-defects-rb-87");
        LevelList levels = (LevelList) builtIn.registry().load(defects.levelsId().orElseThrow());
        assertTrue(defects.corePolarizability().isPresent(), "the built-in set carries its core polarizabilities");
        String source = ProviderJars.wholeAlkaliSource("com.example.rydberg.WholeRubidium", defects, levels,
                "example-qd-rb-87", "example-levels-rb-87");
        Path jar = ProviderJars.build(dir, "com.example.rydberg.WholeRubidium", source);
        try (URLClassLoader loader = new URLClassLoader(new URL[] {jar.toUri().toURL()}, getClass().getClassLoader())) {
            DataContext theirs = DataContext.of(DataRegistry.discover(loader));
            AlkaliAtom mine = builtIn.alkaliAtom(RB87);
            AlkaliAtom rb = theirs.alkaliAtom(RB87);
            assertEquals("example-qd-rb-87", rb.quantumDefects().info().id());
            assertEquals(Optional.of("example-levels-rb-87"), rb.quantumDefects().levelsId());
            assertEquals(mine.quantumDefects().series(), rb.quantumDefects().series());
            assertEquals(mine.quantumDefects().limitPerCm(), rb.quantumDefects().limitPerCm(), 0.0);
            assertEquals(mine.quantumDefects().limitUncertaintyPerCm(), rb.quantumDefects().limitUncertaintyPerCm(),
                    0.0);
            assertEquals(mine.rydbergPerCm(), rb.rydbergPerCm(), 0.0);
            assertEquals(mine.corePolarizability(), rb.corePolarizability());
            assertEquals(levels.size(), rb.measuredLevels().size());
            for (int i = 0; i < levels.size(); i++) {
                MeasuredLevel a = mine.measuredLevels().get(i);
                MeasuredLevel b = rb.measuredLevels().get(i);
                assertEquals(a.state(), b.state());
                assertTrue(b.source().startsWith("example-levels-rb-87 "), b.source());
                if (a.state().n() == 5 && a.state().l() == 1) {
                    // the built-in atom takes Rb-87's own D-line centroids (AlkaliHyperfine); a third
                    // party's level table is taken as it is
                    assertTrue(a.source().startsWith("d-lines: "), a.source());
                    assertEquals(levels.energy(i), b.energyPerCm(), 0.0);
                } else {
                    assertEquals(a.energyPerCm(), b.energyPerCm(), 0.0);
                }
            }
            // Measured, fitted and core-polarization levels, a dipole element and a lifetime: all the same numbers.
            for (String label : List.of("5s1/2", "4d5/2", "30d5/2", "50s1/2", "60p3/2", "40f7/2", "20g9/2")) {
                State state = State.parse(label);
                assertEquals(mine.level(state).origin(), rb.level(state).origin(), label);
                assertEquals(mine.energyPerCm(state), rb.energyPerCm(state), 0.0, label);
            }
            assertEquals(LevelOrigin.MEASURED, rb.level(State.parse("5p3/2")).origin());
            assertEquals(LevelOrigin.CORE_POLARIZATION, rb.level(State.parse("20g9/2")).origin());
            State s60 = State.parse("60s1/2");
            State p60 = State.parse("60p3/2");
            assertEquals(mine.reducedDipole(s60, p60), rb.reducedDipole(s60, p60), 0.0);
            // the 60s lifetime sums decays to 5p too: the same with the third party's levels once they carry
            // Rb-87's own D-line centroids
            AlkaliAtom rbWithDLines = AlkaliAtom.of(rb.quantumDefects(),
                    builtIn.alkaliHyperfine().withResonanceLevels(RB87, rb.measuredLevels()));
            assertEquals(mine.radiativeLifetime(s60), rbWithDLines.radiativeLifetime(s60), 0.0);
            assertTrue(Math.abs(mine.radiativeLifetime(s60) / rb.radiativeLifetime(s60) - 1) < 1e-5);
        }
    }

    @Test
    void aUserLampFileAndAThirdPartyLampSetReplaceTheBuiltInSet(@TempDir Path dir) throws IOException {
        int builtIn = DataContext.builtIn().lampLines(NE).size();
        assertTrue(builtIn > 10);
        Path file = dir.resolve("my-neon.csv");
        Files.writeString(file, "# ritzwerk-lines 1\n# id: my-neon\n# title: my neon lamp\n# source: measured by me\n"
                + "# provenance: measured\n# version: 1\n# kind: lamp-lines\n# position-unit: nm\n# medium: air\n"
                + "species,position\nNe I,585.2488\nNe I,640.2249\n", StandardCharsets.UTF_8);
        LineList mine = DataContext.builtIn().withUserFile(file).lampLines(NE);
        assertEquals("my-neon", mine.info().id());
        assertEquals(2, mine.size());
        Path jar = ProviderJars.build(dir.resolve("jar"), "com.example.lamps.OneLineNeon", LAMP_PROVIDER);
        try (URLClassLoader loader = new URLClassLoader(new URL[] {jar.toUri().toURL()}, getClass().getClassLoader())) {
            LineList theirs = DataContext.of(DataRegistry.discover(loader)).lampLines(NE);
            assertEquals("example-ne-i", theirs.info().id());
            assertEquals(1, theirs.size());
        }
    }

    @Test
    void lineListsByIdOrPathAndTheWrongKindIsRefused(@TempDir Path dir) throws IOException {
        DataContext context = DataContext.builtIn();
        assertEquals("lamp-ar-i", context.lineList("lamp-ar-i").info().id());
        ReferenceDataException e = assertThrows(ReferenceDataException.class,
                () -> context.lineList("computed-h-i-levels"));
        assertEquals(ReferenceDataException.WRONG_KIND, e.code());
        assertEquals("computed-h-i-levels is a levels set, not a line list", e.getMessage());
        Path file = dir.resolve("isotopes.csv");
        Files.writeString(file, ISOTOPES, StandardCharsets.UTF_8);
        assertEquals(ReferenceDataException.WRONG_KIND,
                assertThrows(ReferenceDataException.class, () -> context.lineList(file.toString())).code());
    }

    @Test
    void aBadIsotopeFileIsRefusedWithFileLineAndField(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("bad.csv");
        Files.writeString(file, ISOTOPES.replace("1,1,H,1.5,", "1,1,H,heavy,").replace("37,87,Rb,", "37,87,Kr,")
                .replace("# version: 1\n", ""), StandardCharsets.UTF_8);
        DataFileException e = assertThrows(DataFileException.class, () -> DataContext.builtIn().withUserFile(file));
        assertEquals(DataFileException.INVALID, e.code());
        assertEquals(List.of("nuclear.bad-field", "nuclear.bad-field", "nuclear.missing-key"),
                e.problems().stream().map(DataProblem::code).toList());
        assertEquals(file + ":7:7: field mass_u is not a finite number: 'heavy'", e.problems().get(0).render()
                .lines().findFirst().orElseThrow());
        assertEquals(file + ":8:7: field symbol: Kr does not match Z = 37", e.problems().get(1).render()
                .lines().findFirst().orElseThrow());
        assertEquals(file + ":1: required header '# version: ...' is missing or empty", e.problems().get(2).render()
                .lines().findFirst().orElseThrow());
        Files.writeString(file, ISOTOPES.replace("3/2,2.75", "-3/2,2.75") + "1,1,H,1.6,0,TEST,1/2,,,TEST,,,TEST\n",
                StandardCharsets.UTF_8);
        DataFileException twice = assertThrows(DataFileException.class, () -> UserFiles.read(file));
        assertEquals(List.of("nuclear.bad-field", "nuclear.duplicate-isotope"),
                twice.problems().stream().map(DataProblem::code).toList());
        assertTrue(twice.getMessage().contains(":10: isotope H-1 is given twice"), twice.getMessage());
        // A carriage return inside a source key (a file edited on two systems) was an internal error.
        Files.writeString(file, ISOTOPES.replace("4.1989,,TEST", "4.1989,,TE\rST"), StandardCharsets.UTF_8);
        DataFileException cr = assertThrows(DataFileException.class, () -> UserFiles.read(file));
        assertEquals(file + ":9:45: field radius_source: a source key must hold no comma or line break",
                cr.problems().get(0).render().lines().findFirst().orElseThrow());
    }

    @Test
    void aQuantumDefectFileForAnIsotopeWithoutNuclearDataIsRefused(@TempDir Path dir) throws IOException {
        String text = builtInRb87Defects();
        Path file = dir.resolve("rb-84.csv");
        Files.writeString(file, text.replace("# species: Rb-87 I", "# species: Rb-84 I"), StandardCharsets.UTF_8);
        DataFileException e = assertThrows(DataFileException.class, () -> DataContext.builtIn().withUserFile(file));
        assertEquals("qd.no-mass", e.problems().get(0).code());
        assertTrue(e.getMessage().contains(file + ":4: no nuclear data for Rb-84"), e.getMessage());
    }

    @Test
    void assemblesOnceFromManyThreads() throws Exception {
        DataContext context = DataContext.builtIn();
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Future<AlkaliAtom>> atoms = pool.invokeAll(Collections.nCopies(16, () -> context.alkaliAtom(RB87)));
            for (Future<AlkaliAtom> atom : atoms) {
                assertSame(atoms.get(0).get(), atom.get());
            }
        } finally {
            pool.shutdown();
        }
        assertTrue(DataContext.builtIn().alkaliAtom(RB87) != context.alkaliAtom(RB87), "no global cache");
    }

    /** A user's Li I level file; its 3s energy 27206.09 cm-1 is invented (the built-in one differs). */
    static final String USER_LI_LEVELS = String.join("\n",
            "# ritzwerk-levels 1",
            "# id: my-li-levels",
            "# title: invented test levels",
            "# source: invented for tests",
            "# provenance: measured",
            "# version: 1",
            "# energy-unit: cm-1",
            "species,label,energy,uncertainty,j,note",
            "Li I,2s 2S1/2,0,0.001,1/2,",
            "Li I,2p 2P1/2,14903.66,0.001,1/2,",
            "Li I,2p 2P3/2,14904.00,0.001,3/2,",
            "Li I,3s 2S1/2,27206.09,0.002,1/2,",
            "") ;

    @Test
    void aUserLevelFileOfAnAlkaliAtomWinsInItsLevelsAndLines(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("my-li.csv");
        Files.writeString(file, USER_LI_LEVELS, StandardCharsets.UTF_8);
        DataContext builtIn = DataContext.builtIn();
        DataContext mine = builtIn.withUserFile(file);
        Species li = Species.parse("Li I");
        State s3 = State.of(3, 0, 1);
        assertNotEquals(27206.09, builtIn.alkaliAtom(li).level(s3).energyPerCm(), 1e-3);
        assertEquals("my-li-levels", mine.levelList(li).orElseThrow().info().id());
        // The file's levels replace the built-in ones of the same n l j (the values above, invented).
        assertEquals(27206.09, mine.alkaliAtom(li).level(s3).energyPerCm(), 0.0);
        assertEquals(14903.66, mine.alkaliAtom(li).level(State.of(2, 1, 1)).energyPerCm(), 0.0);
        // A level the file does not give stays the built-in one.
        State d3 = State.of(3, 2, 5);
        assertEquals(builtIn.alkaliAtom(li).level(d3).energyPerCm(), mine.alkaliAtom(li).level(d3).energyPerCm(),
                0.0);
        // The level query and the line query take them.
        org.ritzwerk.engine.levels.LevelSet levels = org.ritzwerk.engine.levels.LevelQuery.defaults().withMaxN(3)
                .run(DataLevels.sources(mine, List.of(Species.parse("Li-7 I")), Tier.QED));
        int at = java.util.stream.IntStream.range(0, levels.size()).filter(i -> levels.label(i).startsWith("3s"))
                .findFirst().orElseThrow();
        assertEquals(27206.09, levels.energyPerCm(at), 0.0);
        org.ritzwerk.engine.lines.LineSet lines = org.ritzwerk.engine.lines.LineQuery.defaults()
                .withTransition(s3, State.of(2, 1, 3)).run(DataLines.sources(mine, List.of(li), Tier.QED));
        // 3s - 2p3/2 at 1e7 / (27206.09 - 14904.00) cm-1 in vacuum, from the file's two levels.
        assertEquals(1e7 / (27206.09 - 14904.00), lines.vacuumWavelengthNm(0), 1e-9);
    }

    /** The built-in Rb-87 quantum-defect file's text, to edit into a user's file. */
    private static String builtInRb87Defects() throws IOException {
        try (InputStream in = DataContext.class.getResourceAsStream("rydberg/quantum-defects-rb-87.csv")) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }
}
