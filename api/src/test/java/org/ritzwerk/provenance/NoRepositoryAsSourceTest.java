package org.ritzwerk.provenance;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * No committed data file, script, source, test or document names a software repository or a
 * commit as a source (issue 13): every value cites a publication, a handbook or standard
 * database, a reference library with its version, common practice, or "from memory". The
 * patterns are those of {@link RepositorySourceGuard}; each failure names file, line and the
 * matched text.
 */
class NoRepositoryAsSourceTest {

    /** What is scanned: data, scripts, sources, tests and documents. */
    private static final Set<String> EXTENSIONS = Set.of("java", "py", "csv", "txt", "md", "json", "xml", "sh",
            "properties", "yml", "yaml");

    @Test
    void noFileNamesARepositoryOrCommitAsASource() throws IOException {
        Path root = RepositoryFiles.root();
        List<String> files = RepositoryFiles.list(root);
        Set<String> localFolders = new TreeSet<>();
        try (Stream<Path> top = Files.list(root)) {
            top.filter(Files::isDirectory).forEach(dir -> localFolders.add(dir.getFileName().toString()));
        }
        RepositorySourceGuard guard = new RepositorySourceGuard(localFolders);
        List<RepositorySourceGuard.Finding> findings = new ArrayList<>();
        int scanned = 0;
        for (String file : files) {
            Path path = root.resolve(file);
            if (!scanned(file, path)) {
                continue;
            }
            scanned++;
            findings.addAll(guard.scan(file, lines(path)));
        }
        assertTrue(scanned > 50, "scanned only " + scanned + " files under " + root + ": is this the project root?");
        // The whole list also goes to a file: a long failure message may be cut by the test report.
        Path report = Path.of("target", "repository-source-findings.txt");
        Files.createDirectories(report.getParent());
        Files.write(report, findings.stream().map(Object::toString).collect(Collectors.toList()), StandardCharsets.UTF_8);
        assertTrue(findings.isEmpty(), () -> findings.size() + " line(s) name a repository or commit as a source "
                + "(cite the publication, handbook or library version instead; full list in " + report.toAbsolutePath()
                + "):\n"
                + findings.stream().map(Object::toString).collect(Collectors.joining("\n")));
    }

    private static boolean scanned(String file, Path path) throws IOException {
        String name = file.substring(file.lastIndexOf('/') + 1);
        int dot = name.lastIndexOf('.');
        if (dot > 0 && EXTENSIONS.contains(name.substring(dot + 1).toLowerCase(Locale.ROOT))) {
            return true;
        }
        if (dot >= 0 || Files.size(path) > 1_000_000) {
            return false;
        }
        // Files without an extension: scripts (first line "#!").
        try (var in = Files.newInputStream(path)) {
            byte[] start = in.readNBytes(2);
            return start.length == 2 && start[0] == '#' && start[1] == '!';
        }
    }

    private static List<String> lines(Path path) {
        try {
            byte[] bytes = Files.readAllBytes(path);
            String text;
            try {
                text = StandardCharsets.UTF_8.newDecoder().decode(ByteBuffer.wrap(bytes)).toString();
            } catch (CharacterCodingException e) {
                text = new String(bytes, StandardCharsets.ISO_8859_1);
            }
            return text.lines().collect(Collectors.toList());
        } catch (IOException e) {
            throw new UncheckedIOException(path + ": " + e.getMessage(), e);
        }
    }
}
