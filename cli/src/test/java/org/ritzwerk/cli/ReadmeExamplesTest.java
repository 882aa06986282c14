package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every command-line example in the README's {@code sh} blocks, run in order in one folder, with
 * its printed output compared with the README's text, so the README cannot drift from the tool.
 *
 * <p>A command is a line starting with {@code ./ritzwerk} (after an optional {@code $ } prompt;
 * lines ending in a backslash are joined with the next). Its expected output is what follows a
 * {@code $} command up to the next {@code $} line or the end of the block; trailing spaces and
 * trailing blank lines do not count. A line {@code ...} in it elides output: the shown parts
 * must then appear in order, each part as consecutive lines, the first at the start and the
 * last at the end unless the elision stands there. A command without shown output must still
 * exit with code 0. The lines of the Quickstart's excerpt of the demo's report (a plain block)
 * must appear, in order, in what {@code ./ritzwerk demo} printed.
 *
 * <p>The commands run in-process ({@link Main#run}), whose working folder cannot be changed;
 * so every argument that is a plain file name ({@code peaks.csv}, {@code scene.png}) is taken
 * inside the test's folder, and that folder's path is removed from what the command prints.
 * Inputs that the README does not create are written by the test before the command that
 * needs them ({@link #writeInputs}); commands that cannot run here are listed in
 * {@link #SKIPPED} with the reason. A fixture or a skip that matches no README command fails
 * the test, so neither can outlive its example.
 */
class ReadmeExamplesTest {

    /** Commands in the README's sh blocks that this test does not run, each with the reason. */
    private static final Map<String, String> SKIPPED = Map.of(
            // The whole build with every test, this one included: it would run itself.
            "mvn -B verify", "the full build, which runs this test",
            // JMH runs of minutes whose printed times depend on the machine; the README quotes
            // ratios from them, not a transcript.
            "benchmarks/quick", "JMH benchmark run (minutes, machine-dependent timings)",
            "benchmarks/quick HydrogenLevels", "JMH benchmark run (minutes, machine-dependent timings)");

    private static final Pattern FILE_NAME = Pattern.compile("[A-Za-z0-9_][A-Za-z0-9_.-]*\\.(csv|json|png|txt)");

    /** One command of a README sh block. */
    record Example(int line, String command, List<String> expected, boolean shown) {
    }

    @Test
    void everyReadmeCommandRunsAndPrintsWhatTheReadmeShows(@TempDir Path dir) throws IOException {
        List<String> readme = Files.readAllLines(readme(), StandardCharsets.UTF_8);
        List<Example> examples = examples(readme);
        String demoOut = null;
        assertTrue(examples.size() >= 20, "sh examples found: " + examples.size());
        Set<String> skipsUsed = new HashSet<>();
        Set<String> fixturesUsed = new HashSet<>();
        List<String> failures = new ArrayList<>();
        int run = 0;
        for (Example example : examples) {
            if (SKIPPED.containsKey(example.command())) {
                skipsUsed.add(example.command());
                continue;
            }
            assertTrue(example.command().startsWith("./ritzwerk "),
                    "README.md:" + example.line() + ": neither a ritzwerk command nor listed as skipped: "
                            + example.command());
            if (writeInputs(example.command(), dir)) {
                fixturesUsed.add(example.command());
            }
            List<String> words = words(example.command());
            String redirect = null;
            int arrow = words.indexOf(">");
            if (arrow >= 0) {
                redirect = words.get(arrow + 1);
                words = words.subList(0, arrow);
            }
            List<String> args = new ArrayList<>();
            for (String word : words.subList(1, words.size())) {
                args.add(FILE_NAME.matcher(word).matches() ? dir.resolve(word).toString() : word);
            }
            if (args.get(0).equals("demo") && !args.contains("--out-dir")) {
                // The demo's default folder is relative to the working folder.
                args.add("--out-dir");
                args.add(dir.resolve("ritzwerk-demo").toString());
            }
            CliTest.Run result = CliTest.run(args.toArray(new String[0]));
            run++;
            String prefix = dir.toString() + dir.getFileSystem().getSeparator();
            String out = result.out().replace(prefix, "");
            String where = "README.md:" + example.line() + ": " + example.command();
            if (result.code() != 0) {
                failures.add(where + "\n  exit " + result.code() + "\n" + result.err());
                continue;
            }
            if (args.get(0).equals("demo")) {
                demoOut = out;
            }
            if (redirect != null) {
                Files.writeString(dir.resolve(redirect), result.out(), StandardCharsets.UTF_8);
            }
            if (example.shown()) {
                String mismatch = mismatch(example.expected(), lines(out));
                if (mismatch != null) {
                    failures.add(where + "\n  " + mismatch + "\n--- printed:\n" + out
                            + (result.err().isEmpty() ? "" : "--- standard error:\n" + result.err()));
                }
            }
        }
        // The Quickstart's excerpt of the demo's report: its lines, in order, among what the demo
        // printed (an excerpt leaves lines out without marking each gap).
        assertTrue(demoOut != null, "README.md: no ./ritzwerk demo example");
        String excerptMismatch = notInOrder(excerpt(readme, "An excerpt of the report:"), lines(demoOut));
        if (excerptMismatch != null) {
            failures.add("README.md: the demo's excerpt\n  " + excerptMismatch + "\n--- printed:\n" + demoOut);
        }
        assertEquals(SKIPPED.keySet(), skipsUsed, "skips that match no README command");
        assertEquals(FIXTURES, fixturesUsed, "input fixtures that match no README command");
        assertTrue(failures.isEmpty(), failures.size() + " of " + run + " README examples differ:\n\n"
                + String.join("\n\n", failures));
    }

    @Test
    void elisionMatchingCanFail() {
        assertEquals(null, mismatch(List.of("a", "...", "d"), List.of("a", "b", "c", "d")));
        assertEquals(null, mismatch(List.of("a", "b", "...", "d"), List.of("a", "b", "c", "d")));
        assertTrue(mismatch(List.of("a", "...", "c"), List.of("a", "b", "c", "d")) != null, "the end is shown");
        assertTrue(mismatch(List.of("b", "...", "d"), List.of("a", "b", "c", "d")) != null, "the start is shown");
        assertTrue(mismatch(List.of("a", "c", "..."), List.of("a", "b", "c", "d")) != null, "shown lines are consecutive");
        assertTrue(mismatch(List.of("a", "b"), List.of("a", "b", "c")) != null, "no elision: all lines");
        assertEquals(null, mismatch(List.of("...", "c", "..."), List.of("a", "b", "c", "d")));
        assertEquals(null, notInOrder(List.of("a", "c"), List.of("a", "b", "c", "d")));
        assertTrue(notInOrder(List.of("c", "a"), List.of("a", "b", "c", "d")) != null, "order counts");
        assertTrue(notInOrder(List.of("a", "e"), List.of("a", "b", "c", "d")) != null, "every line counts");
    }

    // ------------------------------------------------------------------ inputs the README does not make

    private static final Set<String> FIXTURES = Set.of(
            "./ritzwerk identify peaks.csv --species \"H I,He II\" --search-velocity 100",
            "./ritzwerk identify plasma-peaks.csv --species \"H I\" --n-max 9 --plasma --resolving-power 5000",
            "./ritzwerk calibrate sample.csv --apply calibration.json --out sample-nm.csv",
            "./ritzwerk lines --species \"H I\" --from \"121 nm\" --to \"122 nm\" --data my-isotopes.csv",
            "./ritzwerk series rb87-series.csv --predict 60",
            "./ritzwerk fit-levels ca-ii-lines.csv --reference \"4s 2S1/2\" --species \"Ca II\" "
                    + "--levels-out ca-ii-fit.csv",
            "./ritzwerk fit-levels he-lines.csv --reference \"1s2s 1S0\" --reference-energy \"166277.4403 cm-1\" "
                    + "--separate-systems");

    /** The README's example inputs, shipped in the repository for users to run the examples on. */
    static final Path EXAMPLE_DATA = Path.of("..", "examples", "data");

    /**
     * The shipped example inputs are what their generators give, so they cannot drift from the
     * tool: the velocity example's peaks are read off the README's own transcript (positions from
     * its column 3; uncertainties residual / (res/sigma): 4 pm, and 5 pm for Balmer alpha); the
     * plasma example's peaks are synth's truth at 12,000 K and 2e22 m^-3 (counts to six
     * significant digits as intensity, as a measurement would give them, and the Voigt width with
     * the instrument's lambda / R); the series file is the one the cli tests use (members computed
     * from the built-in Rb-87 defects); the Ca II network is {@link FitLevelsToLinesCommandTest}'s, seed 2121;
     * the He I-like singlets and triplets are {@link FitLevelsSystemsCommandTest}'s.
     */
    @Test
    void theShippedExampleInputsAreWhatTheirGeneratorsGive(@TempDir Path dir) throws IOException {
        String peaks = String.join("\n",
                "# ritzwerk-peaks 1",
                "# id: readme-peaks",
                "# title: the README's identification example",
                "# source: invented for the README",
                "# provenance: measured",
                "# version: 1",
                "# position-unit: nm",
                "# medium: air",
                "position,uncertainty",
                "410.2405,0.004",
                "434.1155,0.004",
                "486.2065,0.004",
                "540.157,0.004",
                "656.3745,0.005",
                "700.0,0.004",
                "");
        assertEquals(peaks, Files.readString(EXAMPLE_DATA.resolve("peaks.csv")));
        String plasma = IdentifyCommandTest.plasmaPeaks(dir, "plasma-example", "%.6g");
        Files.writeString(Path.of("target", "plasma-peaks.generated.csv"), plasma, StandardCharsets.UTF_8);
        assertEquals(plasma, Files.readString(EXAMPLE_DATA.resolve("plasma-peaks.csv")),
                "examples/data/plasma-peaks.csv (the generated one is in cli/target/plasma-peaks.generated.csv)");
        assertEquals(Files.readString(Path.of("src", "test", "resources", "org", "ritzwerk", "cli", "series-rb-87.csv")),
                Files.readString(EXAMPLE_DATA.resolve("rb87-series.csv")));
        String network = Files.readString(FitLevelsToLinesCommandTest.measured(dir, 2121));
        Files.writeString(Path.of("target", "ca-ii-lines.generated.csv"), network, StandardCharsets.UTF_8);
        assertEquals(network, Files.readString(EXAMPLE_DATA.resolve("ca-ii-lines.csv")),
                "examples/data/ca-ii-lines.csv (the generated one is in cli/target/ca-ii-lines.generated.csv)");
        assertEquals(Files.readString(FitLevelsSystemsCommandTest.lines(dir)),
                Files.readString(EXAMPLE_DATA.resolve("he-lines.csv")), "examples/data/he-lines.csv");
    }

    /**
     * Writes the input files a README command reads but no earlier README command writes.
     *
     * @return whether the command has such a fixture
     */
    private static boolean writeInputs(String command, Path dir) throws IOException {
        if (!FIXTURES.contains(command)) {
            return false;
        }
        if (command.contains("--search-velocity 100")) {
            Files.copy(EXAMPLE_DATA.resolve("peaks.csv"), dir.resolve("peaks.csv"));
        } else if (command.contains("--plasma")) {
            Files.copy(EXAMPLE_DATA.resolve("plasma-peaks.csv"), dir.resolve("plasma-peaks.csv"));
        } else if (command.contains("sample.csv")) {
            // Another spectrum from the same invented spectrometer as the README's neon lamp.
            CliTest.Run synth = CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "350,0.14,-1.5e-6",
                    "--pixels", "4096", "--medium", "air", "--temperature", "300", "--resolving-power", "2000",
                    "--read-noise", "5", "--seed", "22", "--out", dir.resolve("sample.csv").toString());
            assertEquals(0, synth.code(), synth.err());
        } else if (command.contains("ca-ii-lines.csv")) {
            Files.copy(EXAMPLE_DATA.resolve("ca-ii-lines.csv"), dir.resolve("ca-ii-lines.csv"));
        } else if (command.contains("he-lines.csv")) {
            Files.copy(EXAMPLE_DATA.resolve("he-lines.csv"), dir.resolve("he-lines.csv"));
        } else if (command.contains("rb87-series.csv")) {
            Files.copy(EXAMPLE_DATA.resolve("rb87-series.csv"), dir.resolve("rb87-series.csv"));
        } else {
            // The isotope table the repository ships, in the format --data reads. (`data show
            // nuclear-isotopes --format csv` writes only the columns, no header keys, which
            // --data refuses.)
            Files.copy(Path.of("..", "refdata", "src", "main", "resources", "org", "ritzwerk", "refdata", "nuclear",
                    "isotopes.csv"), dir.resolve("my-isotopes.csv"));
        }
        return true;
    }

    // ------------------------------------------------------------------ reading the README

    static Path readme() {
        Path here = Path.of("README.md").toAbsolutePath();
        Path up = Path.of("..", "README.md").toAbsolutePath();
        // Surefire runs in the module folder; the README is the repository's.
        return Files.isRegularFile(up) ? up.normalize() : here;
    }

    static List<Example> examples(List<String> readme) {
        List<Example> examples = new ArrayList<>();
        boolean inSh = false;
        for (int i = 0; i < readme.size(); i++) {
            String line = readme.get(i);
            if (!inSh) {
                inSh = line.strip().equals("```sh");
                continue;
            }
            if (line.strip().equals("```")) {
                inSh = false;
                continue;
            }
            boolean prompt = line.startsWith("$ ");
            if (!prompt && line.isBlank()) {
                continue;
            }
            int start = i;
            StringBuilder command = new StringBuilder(prompt ? line.substring(2) : line);
            while (command.toString().stripTrailing().endsWith("\\")) {
                String joined = command.toString().stripTrailing();
                command.setLength(0);
                command.append(joined, 0, joined.length() - 1).append(' ').append(readme.get(++i).strip());
            }
            String text = withoutComment(command.toString()).strip().replaceAll(" {2,}", " ");
            List<String> expected = new ArrayList<>();
            if (prompt) {
                while (i + 1 < readme.size() && !readme.get(i + 1).startsWith("$ ")
                        && !readme.get(i + 1).strip().equals("```")) {
                    expected.add(readme.get(++i).stripTrailing());
                }
            }
            expected = trimTrailingBlanks(expected);
            examples.add(new Example(start + 1, text, expected, !expected.isEmpty()));
        }
        assertTrue(!inSh, "README.md: an sh block is not closed");
        return examples;
    }

    /** @return the lines of the fenced block right after the line that ends with {@code intro} */
    static List<String> excerpt(List<String> readme, String intro) {
        for (int i = 0; i + 1 < readme.size(); i++) {
            if (!readme.get(i).stripTrailing().endsWith(intro)) {
                continue;
            }
            int fence = i + 1;
            while (fence < readme.size() && readme.get(fence).isBlank()) {
                fence++;
            }
            if (fence < readme.size() && readme.get(fence).strip().equals("```")) {
                List<String> lines = new ArrayList<>();
                for (int j = fence + 1; j < readme.size() && !readme.get(j).strip().equals("```"); j++) {
                    lines.add(readme.get(j).stripTrailing());
                }
                assertTrue(!lines.isEmpty(), "README.md:" + (i + 2) + ": empty excerpt");
                return trimTrailingBlanks(lines);
            }
        }
        return fail("README.md: no block after '" + intro + "'");
    }

    /** @return the line without a {@code #} comment outside quotes */
    private static String withoutComment(String line) {
        char quote = 0;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (quote != 0) {
                quote = c == quote ? 0 : quote;
            } else if (c == '"' || c == '\'') {
                quote = c;
            } else if (c == '#' && (i == 0 || Character.isWhitespace(line.charAt(i - 1)))) {
                return line.substring(0, i);
            }
        }
        return line;
    }

    /** Splits a command line into words as a POSIX shell would for these examples (quotes only). */
    static List<String> words(String command) {
        List<String> words = new ArrayList<>();
        StringBuilder word = new StringBuilder();
        boolean inWord = false;
        char quote = 0;
        for (int i = 0; i < command.length(); i++) {
            char c = command.charAt(i);
            if (quote != 0) {
                if (c == quote) {
                    quote = 0;
                } else {
                    word.append(c);
                }
            } else if (c == '"' || c == '\'') {
                quote = c;
                inWord = true;
            } else if (Character.isWhitespace(c)) {
                if (inWord) {
                    words.add(word.toString());
                    word.setLength(0);
                    inWord = false;
                }
            } else {
                word.append(c);
                inWord = true;
            }
        }
        if (quote != 0) {
            fail("unclosed quote in: " + command);
        }
        if (inWord) {
            words.add(word.toString());
        }
        return words;
    }

    // ------------------------------------------------------------------ comparing

    private static List<String> lines(String text) {
        List<String> lines = new ArrayList<>();
        for (String line : text.split("\\R", -1)) {
            lines.add(line.stripTrailing());
        }
        return trimTrailingBlanks(lines);
    }

    private static List<String> trimTrailingBlanks(List<String> lines) {
        int end = lines.size();
        while (end > 0 && lines.get(end - 1).isBlank()) {
            end--;
        }
        return new ArrayList<>(lines.subList(0, end));
    }

    /** @return null when the printed lines match the README's, else what differs */
    static String mismatch(List<String> expected, List<String> actual) {
        List<List<String>> parts = new ArrayList<>();
        List<String> part = new ArrayList<>();
        for (String line : expected) {
            if (line.strip().equals("...")) {
                parts.add(part);
                part = new ArrayList<>();
            } else {
                part.add(line);
            }
        }
        parts.add(part);
        if (parts.size() == 1) {
            if (expected.equals(actual)) {
                return null;
            }
            for (int i = 0; i < Math.max(expected.size(), actual.size()); i++) {
                String e = i < expected.size() ? expected.get(i) : "<nothing>";
                String a = i < actual.size() ? actual.get(i) : "<nothing>";
                if (!e.equals(a)) {
                    return "line " + (i + 1) + ": README shows\n    " + e + "\n  printed\n    " + a;
                }
            }
            return "differs";
        }
        int at = 0;
        for (int p = 0; p < parts.size(); p++) {
            List<String> shown = parts.get(p);
            if (shown.isEmpty()) {
                continue;
            }
            int found = -1;
            if (p == 0) {
                found = startsAt(actual, shown, 0) ? 0 : -1;
            } else if (p == parts.size() - 1) {
                int last = actual.size() - shown.size();
                found = last >= at && startsAt(actual, shown, last) ? last : -1;
            } else {
                for (int i = at; i + shown.size() <= actual.size() && found < 0; i++) {
                    found = startsAt(actual, shown, i) ? i : -1;
                }
            }
            if (found < 0) {
                return "these README lines (part " + (p + 1) + " of " + parts.size() + ") are not printed "
                        + (p == 0 ? "at the start" : p == parts.size() - 1 ? "at the end" : "in order")
                        + ":\n    " + String.join("\n    ", shown);
            }
            at = found + shown.size();
        }
        return null;
    }

    /** @return null when every shown line is printed, in order, else the first one that is not */
    static String notInOrder(List<String> shown, List<String> actual) {
        int at = 0;
        for (String line : shown) {
            while (at < actual.size() && !actual.get(at).equals(line)) {
                at++;
            }
            if (at == actual.size()) {
                return "this README line is not printed (in this order):\n    " + line;
            }
            at++;
        }
        return null;
    }

    private static boolean startsAt(List<String> actual, List<String> shown, int at) {
        if (at < 0 || at + shown.size() > actual.size()) {
            return false;
        }
        return actual.subList(at, at + shown.size()).equals(shown);
    }
}
