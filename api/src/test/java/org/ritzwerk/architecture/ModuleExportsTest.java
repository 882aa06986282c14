package org.ritzwerk.architecture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

/**
 * The published library modules export their API packages and nothing else. The lists below are
 * the API (see the versioning policy): a package that a module-info.java exports or opens without
 * being listed here fails this test, so a new package is not made public by accident. To publish
 * a package on purpose, add it here and note it in CHANGELOG.md; implementation packages go under
 * {@code ...internal} and are not exported.
 */
class ModuleExportsTest {

    /** Module folder -> its stable module name. */
    private static final Map<String, String> MODULE_NAMES = Map.of(
            "api", "org.ritzwerk.api",
            "engine", "org.ritzwerk.engine",
            "refdata", "org.ritzwerk.refdata");

    /** Module folder -> the packages that are its API. */
    private static final Map<String, Set<String>> API_PACKAGES = Map.of(
            "api", Set.of(
                    "org.ritzwerk",
                    "org.ritzwerk.atom",
                    "org.ritzwerk.constants",
                    "org.ritzwerk.data",
                    "org.ritzwerk.medium",
                    "org.ritzwerk.quantity"),
            "engine", Set.of(
                    "org.ritzwerk.engine.calibrate",
                    "org.ritzwerk.engine.convert",
                    "org.ritzwerk.engine.hydrogenic",
                    "org.ritzwerk.engine.hyperfine",
                    "org.ritzwerk.engine.identify",
                    "org.ritzwerk.engine.levels",
                    "org.ritzwerk.engine.lines",
                    "org.ritzwerk.engine.plasma",
                    "org.ritzwerk.engine.profile",
                    "org.ritzwerk.engine.pair",
                    "org.ritzwerk.engine.ritz",
                    "org.ritzwerk.engine.rydberg",
                    "org.ritzwerk.engine.stark",
                    "org.ritzwerk.engine.synth"),
            "refdata", Set.of(
                    "org.ritzwerk.refdata"));

    @Test
    void everyPublishedModuleHasItsStableName() {
        for (Map.Entry<String, String> module : MODULE_NAMES.entrySet()) {
            assertEquals(module.getValue(), ModuleSources.read(module.getKey()).name(),
                    module.getKey() + "/src/main/java/module-info.java");
        }
    }

    @Test
    void noModuleExportsOrOpensAPackageOutsideItsApi() {
        List<String> problems = new ArrayList<>();
        for (String module : MODULE_NAMES.keySet()) {
            problems.addAll(problems(module, ModuleSources.read(module), API_PACKAGES.get(module)));
        }
        assertTrue(problems.isEmpty(), String.join("\n", problems));
    }

    @Test
    void everyApiPackageIsExported() {
        // A listed package that is no longer exported is a removal from the API: update the list
        // and the changelog together (an incompatible change under semantic versioning).
        for (String module : MODULE_NAMES.keySet()) {
            Set<String> exported = new TreeSet<>();
            for (ModuleSources.Directive d : ModuleSources.read(module).directives()) {
                if (d.kind().equals("exports") && !d.qualified()) {
                    exported.add(d.packageName());
                }
            }
            assertEquals(new TreeSet<>(API_PACKAGES.get(module)), exported,
                    module + "/src/main/java/module-info.java: exported packages");
        }
    }

    @Test
    void anAccidentalExportIsCaught() {
        String text = """
                /** A module. exports org.ritzwerk.hidden; in a comment does not count. */
                module org.ritzwerk.engine {
                    requires transitive org.ritzwerk.api;
                    exports org.ritzwerk.engine.convert;
                    // exports org.ritzwerk.engine.commented;
                    exports org.ritzwerk.engine.internal.fit;
                    exports org.ritzwerk.engine.shared to org.ritzwerk.refdata;
                    exports org.ritzwerk.engine.leak to
                        org.ritzwerk.refdata, other.module;
                    opens org.ritzwerk.engine.opened;
                }
                """;
        ModuleSources.Declaration declaration = ModuleSources.parse(text);
        assertEquals("org.ritzwerk.engine", declaration.name());
        List<String> problems = problems("engine", declaration, Set.of("org.ritzwerk.engine.convert"));
        assertEquals(3, problems.size(), String.join("\n", problems));
        assertTrue(problems.get(0).contains("org.ritzwerk.engine.internal.fit"), problems.get(0));
        assertTrue(problems.get(1).contains("org.ritzwerk.engine.leak") && problems.get(1).contains("other.module"),
                problems.get(1));
        assertTrue(problems.get(2).contains("opens org.ritzwerk.engine.opened"), problems.get(2));
        assertThrows(IllegalArgumentException.class, () -> ModuleSources.parse("// module x {"));
    }

    /**
     * @return one line per directive that widens the module beyond its API: an unqualified export
     *         or open of an unlisted package, or a qualified one that reaches outside Ritzwerk
     */
    private static List<String> problems(String module, ModuleSources.Declaration declaration, Set<String> api) {
        List<String> problems = new ArrayList<>();
        for (ModuleSources.Directive d : declaration.directives()) {
            String where = module + "/src/main/java/module-info.java: " + d.kind() + " " + d.packageName();
            if (d.qualified()) {
                for (String target : d.targets()) {
                    if (!target.startsWith("org.ritzwerk.")) {
                        problems.add(where + " to " + target + ": a qualified " + d.kind()
                                + " may only reach Ritzwerk's own modules");
                    }
                }
            } else if (!api.contains(d.packageName())) {
                problems.add(where + ": not on the module's API list (ModuleExportsTest.API_PACKAGES); "
                        + "implementation packages belong under ...internal and are not exported");
            }
        }
        return problems;
    }
}
