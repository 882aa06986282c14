package org.ritzwerk.testing;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * Every golden file of every module ({@code <module>/src/test/resources/golden/*.csv}) declares the
 * tolerance its test uses in a {@code # tolerance...} header line that {@link Golden} can read
 * (or {@code # tolerance: none} for a file of inputs), so that no file is compared without a
 * declared error budget.
 */
class GoldenHeadersTest {

    @Test
    void everyGoldenFileDeclaresItsTolerance() throws IOException {
        Path root = projectRoot();
        List<Path> golden = new ArrayList<>();
        try (Stream<Path> modules = Files.list(root)) {
            for (Path module : (Iterable<Path>) modules.filter(Files::isDirectory)::iterator) {
                Path folder = module.resolve("src/test/resources/golden");
                if (Files.isDirectory(folder)) {
                    try (Stream<Path> files = Files.list(folder)) {
                        files.filter(f -> f.getFileName().toString().endsWith(".csv")).sorted().forEach(golden::add);
                    }
                }
            }
        }
        assertTrue(golden.size() >= 14, "golden files found: " + golden);
        List<String> missing = new ArrayList<>();
        for (Path file : golden) {
            List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
            // Golden.tolerances throws on a tolerance line that does not parse or repeats a label.
            if (Golden.tolerances(root.relativize(file).toString(), lines).isEmpty()) {
                missing.add(root.relativize(file).toString());
            }
        }
        assertTrue(missing.isEmpty(), "golden files without a '# tolerance...' header line: " + missing);
    }

    @Test
    void toleranceLinesAreReadAndCheckedStrictly() {
        List<Golden.Tolerance> read = Golden.tolerances("x.csv", List.of("# title", "# tolerance: 1e-12 relative (why)",
                "# Tolerance inversion: 1e-7 relative", "# tolerance intercept: 1e-8 absolute", "a,b", "1,2"));
        assertTrue(read.size() == 3 && read.get(0).label().isEmpty() && read.get(0).value() == 1e-12
                && read.get(1).label().equals("inversion") && !read.get(2).relative(), read.toString());
        assertTrue(Golden.tolerances("x.csv", List.of("# tolerance: none (inputs only)")).get(0).none());
        for (String bad : List.of("# tolerance for the Java test: 1e-12 relative", "# tolerance: 1e-12",
                "# tolerance: small relative", "# tolerance: -1 relative")) {
            assertThrowsState(() -> Golden.tolerances("x.csv", List.of(bad)), bad);
        }
        assertThrowsState(() -> Golden.tolerances("x.csv", List.of("# tolerance: 1 relative", "# tolerance: 2 relative")),
                "twice");
        assertFalse(Golden.tolerances("x.csv", List.of("#   is within tolerance because ...")).size() > 0);
    }

    private static void assertThrowsState(Runnable call, String what) {
        try {
            call.run();
        } catch (IllegalStateException expected) {
            return;
        }
        throw new AssertionError("expected a refusal for: " + what);
    }

    private static Path projectRoot() throws IOException {
        for (Path dir = Paths.get("").toAbsolutePath(); dir != null; dir = dir.getParent()) {
            Path pom = dir.resolve("pom.xml");
            if (Files.isRegularFile(pom) && Files.readString(pom).contains("<modules>")) {
                return dir;
            }
        }
        throw new IllegalStateException("no parent pom.xml above " + Paths.get("").toAbsolutePath());
    }
}
