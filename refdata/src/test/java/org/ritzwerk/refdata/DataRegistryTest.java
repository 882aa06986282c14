package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import java.util.stream.Collectors;
import javax.tools.JavaCompiler;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Origin;
import org.ritzwerk.data.ReferenceDataProvider;

/**
 * The registry: built-in sets, discovery of a provider packaged in a separate jar (compiled and
 * packed by the test itself, found through ServiceLoader), and the documented precedence
 * user file &gt; third party &gt; built-in.
 */
class DataRegistryTest {

    /** A third-party provider's source: it offers its own lamp set and one that shadows a built-in id. */
    private static final String PROVIDER_SOURCE = String.join("\n",
            "package com.example.lamps;",
            "import java.util.List;",
            "import org.ritzwerk.atom.Species;",
            "import org.ritzwerk.data.*;",
            "import org.ritzwerk.medium.Medium;",
            "import org.ritzwerk.quantity.Unit;",
            "public final class AcmeLamps implements ReferenceDataProvider {",
            "  public String id() { return \"acme-lamps\"; }",
            "  public List<DataSetInfo> dataSets() { return List.of(info(\"acme-hg-pencil\"), info(\"lamp-ne-i\")); }",
            "  private static DataSetInfo info(String id) {",
            "    return new DataSetInfo(id, DataKind.LAMP_LINES, \"Acme lamp \" + id, \"3\",",
            "        Provenance.published(\"Acme data sheet (invented for tests)\"), List.of(Species.parse(\"Ne I\")));",
            "  }",
            "  public DataSet load(String id) {",
            "    return LineList.builder(info(id), Unit.NANOMETRE, Medium.air(), \"\")",
            "        .add(Species.parse(\"Ne I\"), 640.225, Double.NaN, Double.NaN, null, Double.NaN, null, null, \"acme\")",
            "        .build();",
            "  }",
            "}");

    @Test
    void builtInSetsAreListedWithTheirSources() {
        DataRegistry registry = DataRegistry.builtIn();
        List<String> ids = registry.list().stream().map(l -> l.info().id()).collect(Collectors.toList());
        assertTrue(ids.containsAll(List.of("nuclear-isotopes", "lamp-hg-i", "lamp-ne-i", "lamp-ar-i", "lamp-kr-i",
                "lamp-xe-i", "lamp-cd-i", "lamp-zn-i", "computed-h-i-lines", "computed-d-i-levels",
                "computed-he-ii-lines", "quantum-defects-rb-87", "levels-cs-133")), ids.toString());
        registry.list().forEach(l -> {
            assertEquals(Origin.BUILT_IN, l.origin());
            assertTrue(!l.info().provenance().detail().isBlank());
        });
        assertEquals(List.of("lamp-ne-i"), registry.find(DataKind.LAMP_LINES, Species.parse("Ne I")).stream()
                .map(l -> l.info().id()).collect(Collectors.toList()));
    }

    @Test
    void discoveryFindsTheBuiltInProviders() {
        List<String> providers = DataRegistry.discoverDefault().list().stream().map(DataRegistry.Listing::providerId)
                .distinct().sorted().collect(Collectors.toList());
        assertEquals(List.of("ritzwerk-hydrogen-like", "ritzwerk-lamps", "ritzwerk-levels", "ritzwerk-nuclear",
                "ritzwerk-rydberg"),
                providers);
    }

    @Test
    void aProviderInASeparateJarIsFoundAndRanksAsDocumented(@TempDir Path dir) throws Exception {
        Path jar = buildProviderJar(dir);
        try (URLClassLoader loader = new URLClassLoader(new URL[] {jar.toUri().toURL()}, getClass().getClassLoader())) {
            DataRegistry registry = DataRegistry.discover(loader);
            DataRegistry.Listing acme = registry.find("acme-hg-pencil").orElseThrow();
            assertEquals("acme-lamps", acme.providerId());
            assertEquals(Origin.THIRD_PARTY, acme.origin());
            // The third party shadows the built-in set of the same id...
            DataRegistry.Listing neon = registry.find("lamp-ne-i").orElseThrow();
            assertEquals("acme-lamps", neon.providerId());
            assertEquals(1, registry.load("lamp-ne-i").size());
            // ...and a user file shadows the third party.
            Path user = dir.resolve("mine.csv");
            Files.writeString(user, "# ritzwerk-lines 1\n# id: lamp-ne-i\n# title: my own neon lamp\n"
                    + "# source: measured by me\n# provenance: measured\n# version: 1\n# kind: lamp-lines\n"
                    + "# position-unit: nm\n# medium: air\nspecies,position\nNe I,585.2488\nNe I,640.2249\n",
                    StandardCharsets.UTF_8);
            DataRegistry withUser = registry.withUserFile(user);
            assertEquals(Origin.USER, withUser.find("lamp-ne-i").orElseThrow().origin());
            assertEquals(2, withUser.load("lamp-ne-i").size());
            // The order of the listing is the order of precedence.
            List<Origin> origins = withUser.list().stream().map(DataRegistry.Listing::origin).collect(Collectors.toList());
            assertEquals(Origin.USER, origins.get(0));
            assertEquals(Origin.BUILT_IN, origins.get(origins.size() - 1));
        }
    }

    @Test
    void loadsOnceAndIsSafeFromManyThreads() throws Exception {
        DataRegistry registry = DataRegistry.builtIn();
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Future<DataSet>> results = pool.invokeAll(java.util.Collections.nCopies(16,
                    () -> registry.load("computed-he-ii-lines")));
            DataSet first = results.get(0).get();
            for (Future<DataSet> result : results) {
                assertSame(first, result.get());
            }
        } finally {
            pool.shutdown();
        }
        // a registry's cache is its own (a computed set is computed per registry) ...
        assertNotSame(registry.load("computed-he-ii-lines"), DataRegistry.builtIn().load("computed-he-ii-lines"),
                "no global cache of loaded sets");
        // ... but a built-in file is read once per JVM: the immutable set is shared by every registry
        assertSame(registry.load("lamp-ar-i"), DataRegistry.builtIn().load("lamp-ar-i"), "built-in file read once");
    }

    @Test
    void unknownIdsAreRefusedWithAHint() {
        ReferenceDataException e = assertThrows(ReferenceDataException.class,
                () -> DataRegistry.builtIn().load("lamp-unobtainium"));
        assertEquals("no data set 'lamp-unobtainium'; 'ritzwerk data' lists the sets available", e.getMessage());
    }

    @Test
    void computedSetsComeFromTheEngine() {
        LineList lines = (LineList) DataRegistry.builtIn().load("computed-he-ii-lines");
        assertTrue(lines.info().provenance().render().startsWith("computed by Ritzwerk hydrogen-like model, qed tier"));
        boolean found = false;
        for (int i = 0; i < lines.size(); i++) {
            // He II 4 -> 3 near 468.7 nm in vacuum (common practice: 468.57 nm in air).
            found |= Math.abs(lines.position(i) - 468.70) < 0.05 && lines.einsteinA(i).isPresent();
        }
        assertTrue(found);
    }

    private static Path buildProviderJar(Path dir) throws IOException {
        Path source = dir.resolve("src/com/example/lamps/AcmeLamps.java");
        Files.createDirectories(source.getParent());
        Files.writeString(source, PROVIDER_SOURCE, StandardCharsets.UTF_8);
        Path classes = dir.resolve("classes");
        Files.createDirectories(classes);
        String apiLocation = Path.of(pathOf(ReferenceDataProvider.class)).toString();
        JavaCompiler compiler = ToolProvider.getSystemJavaCompiler();
        int status = compiler.run(null, null, null, "-d", classes.toString(), "-cp", apiLocation, source.toString());
        assertEquals(0, status, "the test provider compiles");
        Path jar = dir.resolve("acme-lamps.jar");
        try (JarOutputStream out = new JarOutputStream(Files.newOutputStream(jar))) {
            out.putNextEntry(new JarEntry("META-INF/services/org.ritzwerk.data.ReferenceDataProvider"));
            out.write("com.example.lamps.AcmeLamps\n".getBytes(StandardCharsets.UTF_8));
            out.closeEntry();
            out.putNextEntry(new JarEntry("com/example/lamps/AcmeLamps.class"));
            Files.copy(classes.resolve("com/example/lamps/AcmeLamps.class"), (OutputStream) out);
            out.closeEntry();
        }
        return jar;
    }

    private static java.net.URI pathOf(Class<?> type) {
        try {
            return type.getProtectionDomain().getCodeSource().getLocation().toURI();
        } catch (java.net.URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }
}
