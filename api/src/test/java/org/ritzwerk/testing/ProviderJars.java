package org.ritzwerk.testing;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.OutputStream;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import javax.tools.JavaCompiler;
import javax.tools.ToolProvider;
import org.ritzwerk.data.CorePolarizability;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.data.ReferenceDataProvider;

/**
 * Compiles a provider's source and packs it, with its ServiceLoader entry, into a jar, as a third
 * party would; shared by the refdata and command-line tests (api test-jar).
 */
public final class ProviderJars {

    /**
     * The source of a third party's provider of one Rb-87 quantum-defect set as a bare record: one
     * s series with d0 = 3 from n = 5, no core polarizabilities, no levels set (invented for tests).
     * Its class is {@code com.example.rydberg.PlainRubidium}.
     */
    public static final String PLAIN_RB87_SOURCE = String.join("\n",
            "package com.example.rydberg;",
            "import java.util.List;",
            "import org.ritzwerk.atom.Species;",
            "import org.ritzwerk.data.*;",
            "public final class PlainRubidium implements ReferenceDataProvider {",
            "  public String id() { return \"example-rydberg\"; }",
            "  private static DataSetInfo info() {",
            "    return new DataSetInfo(\"example-rb-87\", DataKind.QUANTUM_DEFECTS, \"invented defects\", \"1\",",
            "        Provenance.published(\"invented for tests\"), List.of(Species.parse(\"Rb-87 I\")));",
            "  }",
            "  public List<DataSetInfo> dataSets() { return List.of(info()); }",
            "  public DataSet load(String id) {",
            "    return new QuantumDefects(info(), Species.parse(\"Rb-87 I\"), 33690.8, 109736.0,",
            "        List.of(new QuantumDefects.Series(0, 1, List.of(3.0), 5)));",
            "  }",
            "}");

    private ProviderJars() {
    }

    /**
     * @param dir       a scratch directory
     * @param className the provider's fully qualified class name
     * @param source    its Java source, compiled against the api module only
     * @return the jar
     */
    public static Path build(Path dir, String className, String source) throws IOException {
        String simple = className.substring(className.lastIndexOf('.') + 1);
        String path = className.replace('.', '/');
        Path file = dir.resolve("src/" + path + ".java");
        Files.createDirectories(file.getParent());
        Files.writeString(file, source, StandardCharsets.UTF_8);
        Path classes = dir.resolve("classes");
        Files.createDirectories(classes);
        JavaCompiler compiler = ToolProvider.getSystemJavaCompiler();
        int status = compiler.run(null, null, null, "-d", classes.toString(), "-cp",
                location(ReferenceDataProvider.class).toString(), file.toString());
        assertEquals(0, status, "the test provider compiles");
        Path jar = dir.resolve(simple.toLowerCase(java.util.Locale.ROOT) + ".jar");
        try (JarOutputStream out = new JarOutputStream(Files.newOutputStream(jar))) {
            out.putNextEntry(new JarEntry("META-INF/services/org.ritzwerk.data.ReferenceDataProvider"));
            out.write((className + "\n").getBytes(StandardCharsets.UTF_8));
            out.closeEntry();
            out.putNextEntry(new JarEntry(path + ".class"));
            Files.copy(classes.resolve(path + ".class"), (OutputStream) out);
            out.closeEntry();
        }
        return jar;
    }

    /**
     * Writes the source of a provider that supplies a whole alkali atom as a third party would,
     * against the api module only: a quantum-defect set that carries its core polarizabilities and
     * names its levels set, and that levels set. The numbers are those of the records given,
     * written as Java literals that read back to the same doubles.
     *
     * @param className the provider's fully qualified class name
     * @param defects   the series, limit, R_M and core polarizabilities to supply (under the id {@code qdId})
     * @param levels    the measured levels to supply (under the id {@code levelsId}), in cm^-1
     * @param qdId      the id of the supplied quantum-defect set
     * @param levelsId  the id of the supplied levels set
     * @return the Java source
     */
    public static String wholeAlkaliSource(String className, QuantumDefects defects, LevelList levels, String qdId,
            String levelsId) {
        int dot = className.lastIndexOf('.');
        StringBuilder src = new StringBuilder();
        src.append("package ").append(className, 0, dot).append(";\n")
                .append("import java.util.List;\nimport java.util.Optional;\nimport org.ritzwerk.atom.Species;\n")
                .append("import org.ritzwerk.data.*;\nimport org.ritzwerk.quantity.Unit;\n")
                .append("public final class ").append(className.substring(dot + 1))
                .append(" implements ReferenceDataProvider {\n")
                .append("  private static final Species ATOM = Species.parse(").append(quote(defects.species().notation()))
                .append(");\n")
                .append("  public String id() { return \"example-whole-alkali\"; }\n")
                .append("  private static DataSetInfo defects() {\n")
                .append("    return new DataSetInfo(").append(quote(qdId)).append(", DataKind.QUANTUM_DEFECTS, ")
                .append("\"quantum defects\", \"1\", ").append(provenance(defects.info().provenance()))
                .append(", List.of(ATOM));\n  }\n")
                .append("  private static DataSetInfo levels() {\n")
                .append("    return new DataSetInfo(").append(quote(levelsId)).append(", DataKind.LEVELS, ")
                .append("\"measured levels\", \"1\", ").append(provenance(levels.info().provenance()))
                .append(", List.of(ATOM));\n  }\n")
                .append("  public List<DataSetInfo> dataSets() { return List.of(defects(), levels()); }\n")
                .append("  public DataSet load(String id) {\n")
                .append("    if (id.equals(").append(quote(levelsId)).append(")) {\n")
                .append("      return LevelList.builder(levels(), Unit.PER_CENTIMETRE, \"\")");
        for (int i = 0; i < levels.size(); i++) {
            src.append("\n          .add(ATOM, ").append(quote(levels.label(i))).append(", ")
                    .append(literal(levels.energy(i))).append(", ")
                    .append(literal(levels.uncertainty(i).orElse(Double.NaN))).append(", ").append(levels.twoJ(i))
                    .append(", null)");
        }
        src.append("\n          .build();\n    }\n")
                .append("    return new QuantumDefects(defects(), ATOM, ").append(literal(defects.limitPerCm()))
                .append(", ").append(literal(defects.rydbergPerCm())).append(", List.of(");
        for (int i = 0; i < defects.series().size(); i++) {
            QuantumDefects.Series series = defects.series().get(i);
            src.append(i == 0 ? "" : ",").append("\n        new QuantumDefects.Series(").append(series.l()).append(", ")
                    .append(series.twoJ()).append(", List.of(");
            for (int k = 0; k < series.coefficients().size(); k++) {
                src.append(k == 0 ? "" : ", ").append(literal(series.coefficients().get(k)));
            }
            src.append("), ").append(series.validFromN()).append(", List.of(");
            for (int k = 0; k < series.uncertainties().size(); k++) {
                src.append(k == 0 ? "" : ", ").append(literal(series.uncertainties().get(k)));
            }
            src.append("))");
        }
        CorePolarizability core = defects.corePolarizability().orElseThrow();
        src.append("),\n        Optional.of(new CorePolarizability(").append(literal(core.dipoleAu())).append(", ")
                .append(literal(core.quadrupoleAu())).append(", ").append(quote(core.source())).append(")),\n")
                .append("        Optional.of(").append(quote(levelsId)).append("), ")
                .append(literal(defects.limitUncertaintyPerCm())).append(");\n  }\n}\n");
        return src.toString();
    }

    private static String provenance(org.ritzwerk.data.Provenance provenance) {
        return "new Provenance(Provenance.Kind." + provenance.kind().name() + ", " + quote(provenance.detail()) + ")";
    }

    private static String literal(double value) {
        return Double.isNaN(value) ? "Double.NaN" : Double.toString(value);
    }

    /** @return a Java string literal of {@code text}, ASCII only (so the platform encoding does not matter) */
    private static String quote(String text) {
        StringBuilder out = new StringBuilder("\"");
        for (char c : text.toCharArray()) {
            if (c == '"' || c == '\\') {
                out.append('\\').append(c);
            } else if (c < 0x20 || c > 0x7e) {
                out.append(String.format("\\u%04x", (int) c));
            } else {
                out.append(c);
            }
        }
        return out.append('"').toString();
    }

    private static Path location(Class<?> type) {
        try {
            return Path.of(type.getProtectionDomain().getCodeSource().getLocation().toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }
}
