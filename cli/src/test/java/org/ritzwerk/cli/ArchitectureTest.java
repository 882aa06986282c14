package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The command line takes its data from the one {@link org.ritzwerk.refdata.DataContext} each
 * command builds ({@link DataOptions}), never from a built-in singleton: no source file under
 * {@code src/main} calls {@code NuclearData.builtIn()}, {@code RydbergData.builtIn()},
 * {@code DataRegistry.builtIn()} or {@code DataContext.builtIn()}, or names the built-in data
 * classes at all, and only {@link DataOptions} discovers the providers. No command tells a
 * failure's kind by its message text (it uses the exception's type or code), and no command
 * imports a numerical building block (line shapes, angular algebra, radial integrals, fits,
 * Commons Math): commands call jobs.
 */
class ArchitectureTest {

    private static final Path MAIN = Path.of("src/main/java");

    /** Any call of a method named builtIn, however qualified or statically imported. */
    private static final Pattern BUILT_IN_CALL = Pattern.compile("\\bbuiltIn\\s*\\(");
    /** The classes that hold built-in singletons; the command line has no business with them. */
    private static final Pattern SINGLETON_CLASSES = Pattern.compile("\\b(NuclearData|RydbergData)\\b");
    private static final Pattern DISCOVER = Pattern.compile("\\bdiscover(Default)?\\s*\\(");
    /** Telling a failure's kind by its text: getMessage() followed by a comparison or search. */
    private static final Pattern MESSAGE_TEST = Pattern.compile(
            "getMessage\\(\\)\\s*\\.\\s*(contains|startsWith|endsWith|equals|equalsIgnoreCase|matches|indexOf)\\b");

    /** Files left out of the check: none (the demo takes its context like every command). */
    private static final Set<String> NOT_YET_CHECKED = Set.of();

    @Test
    void noCommandReachesForABuiltInSingleton() throws IOException {
        List<String> findings = new ArrayList<>();
        List<Path> sources = sources();
        assertTrue(sources.size() > 10, "found the cli sources under " + MAIN.toAbsolutePath());
        for (Path file : sources) {
            String name = file.getFileName().toString();
            if (NOT_YET_CHECKED.contains(name)) {
                continue;
            }
            List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
            for (int i = 0; i < lines.size(); i++) {
                String line = lines.get(i);
                check(findings, name, i + 1, line, BUILT_IN_CALL, "calls a built-in default");
                check(findings, name, i + 1, line, SINGLETON_CLASSES, "names a built-in singleton class");
                check(findings, name, i + 1, line, MESSAGE_TEST, "tells a failure by its message (use its type or code)");
                if (!name.equals("DataOptions.java")) {
                    check(findings, name, i + 1, line, DISCOVER, "discovers providers outside DataOptions");
                }
            }
        }
        assertTrue(findings.isEmpty(), "take data from the command's DataContext (DataOptions.context()):\n"
                + String.join("\n", findings));
    }

    /**
     * The numerical building blocks a job is made of. A command that imports one computes by
     * itself instead of calling a job (a problem, a solver and its result), and the computation
     * belongs in the engine, where a library user can call it too.
     */
    private static final Pattern COMPUTATION = Pattern.compile(
            "^import (static )?(org\\.apache\\.commons\\.(math3|math4|numbers)\\."
            + "|org\\.ritzwerk\\.engine\\.(profile|internal)\\."
            + "|org\\.ritzwerk\\.engine\\.hydrogenic\\.(AngularFactors|BetheLogarithms)\\b"
            + "|org\\.ritzwerk\\.engine\\.synth\\.(LineRenderer|GaussLegendre)\\b"
            + "|org\\.ritzwerk\\.engine\\.calibrate\\.(PolynomialLeastSquares|CurvedPolynomial|GaussianBlendFit|Baseline"
            + "|DispersionFit)\\b"
            + "|org\\.ritzwerk\\.engine\\.rydberg\\.RadialWavefunction\\b"
            + "|org\\.ritzwerk\\.engine\\.plasma\\.(BoltzmannPlot|VoigtLineFit|IonisationBalance)\\b)");

    @Test
    void commandsCallJobsNotTheirBuildingBlocks() throws IOException {
        List<String> findings = new ArrayList<>();
        for (Path file : sources()) {
            List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
            for (int i = 0; i < lines.size(); i++) {
                check(findings, file.getFileName().toString(), i + 1, lines.get(i), COMPUTATION,
                        "imports a numerical building block");
            }
        }
        assertTrue(findings.isEmpty(), "call the engine's job (problem, solver, result) instead:\n"
                + String.join("\n", findings));
    }

    @Test
    void theCheckFindsWhatItLooksFor() {
        List<String> findings = new ArrayList<>();
        check(findings, "X.java", 1, "Nucleus n = NuclearData.builtIn().nucleus(s);", BUILT_IN_CALL, "b");
        check(findings, "X.java", 2, "var d = builtIn ();", BUILT_IN_CALL, "b");
        check(findings, "X.java", 3, "import org.ritzwerk.refdata.RydbergData;", SINGLETON_CLASSES, "c");
        check(findings, "X.java", 4, "DataRegistry r = DataRegistry.discoverDefault();", DISCOVER, "d");
        check(findings, "X.java", 5, "context.alkaliAtom(species); // builtInSets", BUILT_IN_CALL, "none");
        check(findings, "X.java", 6, "if (e.getMessage().contains(\"no peak\")) {", MESSAGE_TEST, "m");
        check(findings, "X.java", 7, "throw new OptionException(\"--x: \" + e.getMessage(), e);", MESSAGE_TEST, "none");
        check(findings, "X.java", 8, "import org.ritzwerk.engine.profile.Faddeeva;", COMPUTATION, "p");
        check(findings, "X.java", 9, "import org.apache.commons.numbers.gamma.RegularizedGamma;", COMPUTATION, "p");
        check(findings, "X.java", 10, "import org.ritzwerk.engine.calibrate.DispersionFit;", COMPUTATION, "p");
        check(findings, "X.java", 11, "import org.ritzwerk.engine.calibrate.Calibrator;", COMPUTATION, "none");
        check(findings, "X.java", 12, "import org.ritzwerk.engine.calibrate.DispersionSolution;", COMPUTATION, "none");
        check(findings, "X.java", 13, "import org.apache.commons.math4.legacy.linear.QRDecomposition;", COMPUTATION, "p");
        assertTrue(findings.size() == 9, findings.toString());
    }

    private static void check(List<String> findings, String file, int line, String text, Pattern pattern,
            String what) {
        Matcher m = pattern.matcher(text);
        if (m.find()) {
            findings.add(file + ":" + line + ": " + what + ": " + text.strip());
        }
    }

    private static List<Path> sources() throws IOException {
        try (Stream<Path> walk = Files.walk(MAIN)) {
            return walk.filter(p -> p.toString().endsWith(".java")).sorted().toList();
        }
    }
}
