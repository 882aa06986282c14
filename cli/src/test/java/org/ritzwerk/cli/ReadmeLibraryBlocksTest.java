package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.io.InputStream;
import java.lang.reflect.InvocationTargetException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javax.tools.Diagnostic;
import javax.tools.DiagnosticCollector;
import javax.tools.JavaCompiler;
import javax.tools.JavaFileObject;
import javax.tools.StandardJavaFileManager;
import javax.tools.ToolProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.refdata.NuclearData;

/**
 * Every {@code java} block of the README's "Using the library" section, compiled on its own and
 * run, as the README says a user can paste it: each block goes, with the imports the README
 * names, into a method of its own class; a block that uses a name it does not declare, declares
 * one twice, or throws when run fails the test with its README line.
 *
 * <p>The blocks run in-process, whose working folder cannot be changed, so a file a block names
 * with {@code Path.of("name")} is taken in the test's folder, which holds the inputs the README
 * has the user bring: {@code my-isotopes.csv} (the built-in isotope table under a user's id) and
 * {@code neon-lamp.csv} (written by the README's {@code synth} command of the calibration section,
 * with the same arguments).
 */
class ReadmeLibraryBlocksTest {

    /** The imports the README's "Using the library" section names. */
    private static final String IMPORTS = String.join("\n",
            "import java.io.*;", "import java.nio.file.*;", "import java.util.*;",
            "import org.ritzwerk.*;", "import org.ritzwerk.atom.*;", "import org.ritzwerk.constants.*;",
            "import org.ritzwerk.data.*;", "import org.ritzwerk.medium.*;", "import org.ritzwerk.quantity.*;",
            "import org.ritzwerk.engine.calibrate.*;", "import org.ritzwerk.engine.convert.*;",
            "import org.ritzwerk.engine.hydrogenic.*;", "import org.ritzwerk.engine.hyperfine.*;",
            "import org.ritzwerk.engine.identify.*;", "import org.ritzwerk.engine.levels.*;",
            "import org.ritzwerk.engine.lines.*;", "import org.ritzwerk.engine.pair.*;",
            "import org.ritzwerk.engine.plasma.*;", "import org.ritzwerk.engine.profile.*;",
            "import org.ritzwerk.engine.ritz.*;", "import org.ritzwerk.engine.rydberg.*;",
            "import org.ritzwerk.engine.stark.*;", "import org.ritzwerk.engine.synth.*;",
            "import org.ritzwerk.refdata.*;", "");

    /** One java block: its first README line (the fence) and its text. */
    record Block(int line, String text) {
    }

    @Test
    void everyLibraryBlockCompilesAloneAndRuns(@TempDir Path dir) throws Exception {
        List<Block> blocks = blocks(Files.readAllLines(ReadmeExamplesTest.readme(), StandardCharsets.UTF_8));
        assertTrue(blocks.size() >= 6, "java blocks found in 'Using the library': " + blocks.size());
        Path sources = Files.createDirectories(dir.resolve("src"));
        Path classes = Files.createDirectories(dir.resolve("classes"));
        Path folder = Files.createDirectories(dir.resolve("work"));
        List<Path> files = new ArrayList<>();
        for (int k = 0; k < blocks.size(); k++) {
            String body = blocks.get(k).text().replace("Path.of(\"", "folder.resolve(\"");
            Path file = sources.resolve("ReadmeBlock" + k + ".java");
            // The block's first line is line 3 of the file: README line = file line - 3 + fence line + 1.
            Files.writeString(file, IMPORTS.replace("\n", " ") + "\npublic class ReadmeBlock" + k
                    + " { public static void run(Path folder) throws Exception {\n" + body + "\n}}\n");
            files.add(file);
        }
        compile(files, classes, blocks);
        writeInputs(folder);
        try (URLClassLoader loader = new URLClassLoader(new URL[] {classes.toUri().toURL()},
                getClass().getClassLoader())) {
            for (int k = 0; k < blocks.size(); k++) {
                try {
                    loader.loadClass("ReadmeBlock" + k).getMethod("run", Path.class).invoke(null, folder);
                } catch (InvocationTargetException e) {
                    throw new AssertionError("README.md:" + blocks.get(k).line() + ": the block throws "
                            + e.getCause(), e.getCause());
                }
            }
        }
        // The calibration block wrote its file where the README says.
        assertTrue(Files.isRegularFile(folder.resolve("calibration.json")));
    }

    private static void compile(List<Path> files, Path classes, List<Block> blocks) throws IOException {
        JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
        assertTrue(javac != null, "the tests need a JDK's compiler");
        DiagnosticCollector<JavaFileObject> problems = new DiagnosticCollector<>();
        try (StandardJavaFileManager manager = javac.getStandardFileManager(problems, Locale.ROOT,
                StandardCharsets.UTF_8)) {
            Iterable<? extends JavaFileObject> units = manager.getJavaFileObjectsFromPaths(files);
            List<String> options = List.of("-classpath", System.getProperty("java.class.path"), "-d",
                    classes.toString(), "-proc:none", "-Xlint:none", "-nowarn");
            boolean ok = javac.getTask(null, manager, problems, options, null, units).call();
            List<String> errors = new ArrayList<>();
            for (Diagnostic<? extends JavaFileObject> d : problems.getDiagnostics()) {
                if (d.getKind() == Diagnostic.Kind.ERROR) {
                    String name = Path.of(d.getSource().toUri()).getFileName().toString();
                    int k = Integer.parseInt(name.replaceAll("\\D", ""));
                    errors.add("README.md:" + (blocks.get(k).line() + d.getLineNumber() - 2) + ": "
                            + d.getMessage(Locale.ROOT));
                }
            }
            if (!ok || !errors.isEmpty()) {
                fail("README library blocks do not compile alone:\n" + String.join("\n", errors));
            }
        }
    }

    /** The java blocks between "## Using the library" and the next second-level heading. */
    static List<Block> blocks(List<String> readme) {
        List<Block> blocks = new ArrayList<>();
        int start = readme.indexOf("## Using the library");
        assertTrue(start >= 0, "README has no 'Using the library' section");
        StringBuilder text = null;
        int fence = 0;
        for (int i = start + 1; i < readme.size() && !readme.get(i).startsWith("## "); i++) {
            String line = readme.get(i);
            if (text == null && line.equals("```java")) {
                text = new StringBuilder();
                fence = i + 1;
            } else if (text != null && line.equals("```")) {
                blocks.add(new Block(fence, text.toString()));
                text = null;
            } else if (text != null) {
                text.append(line).append('\n');
            }
        }
        return blocks;
    }

    /** The files the blocks read, in the folder their Path.of names are taken in. */
    private static void writeInputs(Path folder) throws IOException {
        String isotopes;
        try (InputStream in = NuclearData.class.getResourceAsStream("nuclear/isotopes.csv")) {
            isotopes = new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
        assertTrue(isotopes.startsWith("# id: nuclear-isotopes\n"));
        Files.writeString(folder.resolve("my-isotopes.csv"), isotopes.replaceFirst("nuclear-isotopes", "my-isotopes"));
        // The README's calibration-section command, with its arguments.
        CliTest.Run synth = CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "350,0.14,-1.5e-6",
                "--pixels", "4096", "--medium", "air", "--temperature", "300", "--resolving-power", "2000",
                "--read-noise", "5", "--seed", "21", "--out", folder.resolve("neon-lamp.csv").toString());
        assertEquals(0, synth.code(), synth.err());
    }
}
