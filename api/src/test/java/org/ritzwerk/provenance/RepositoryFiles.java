package org.ritzwerk.provenance;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

/**
 * Finds the project's root folder and lists its files, for tests that look at the whole tree.
 *
 * <p>The root is found by walking up from the working folder (Maven runs tests in the module's
 * folder) to the folder whose {@code pom.xml} lists modules; a folder that also holds
 * {@code .git} (a folder, or a file in a git worktree) is preferred. Files are listed with
 * {@code git ls-files --cached --others --exclude-standard} (committed, staged and new files, not
 * ignored ones) when git answers; otherwise by walking the tree, skipping {@code target/},
 * {@code .git/} and other hidden folders.
 */
final class RepositoryFiles {

    private static final Set<String> SKIPPED_FOLDERS = Set.of("target", ".git", "node_modules", ".idea", ".mvn");

    private RepositoryFiles() {
    }

    /**
     * @return the project's root folder
     * @throws IllegalStateException when no parent {@code pom.xml} with modules is found above the working folder
     */
    static Path root() {
        Path start = Paths.get("").toAbsolutePath().normalize();
        Path topmostParentPom = null;
        for (Path dir = start; dir != null; dir = dir.getParent()) {
            if (isParentPom(dir.resolve("pom.xml"))) {
                if (Files.exists(dir.resolve(".git"))) {
                    return dir;
                }
                topmostParentPom = dir;
            }
        }
        if (topmostParentPom == null) {
            throw new IllegalStateException("no parent pom.xml (with <modules>) above " + start);
        }
        return topmostParentPom;
    }

    private static boolean isParentPom(Path pom) {
        try {
            return Files.isRegularFile(pom) && Files.readString(pom, StandardCharsets.UTF_8).contains("<modules>");
        } catch (IOException e) {
            return false;
        }
    }

    /**
     * @param root the project's root folder
     * @return every file of the project, as paths relative to the root with '/' separators, sorted
     */
    static List<String> list(Path root) {
        List<String> fromGit = gitLsFiles(root);
        return fromGit != null ? fromGit : walk(root);
    }

    private static List<String> gitLsFiles(Path root) {
        try {
            Process git = new ProcessBuilder("git", "ls-files", "--cached", "--others", "--exclude-standard", "-z")
                    .directory(root.toFile()).redirectError(ProcessBuilder.Redirect.DISCARD).start();
            byte[] out;
            try (InputStream in = git.getInputStream()) {
                out = in.readAllBytes();
            }
            if (!git.waitFor(60, TimeUnit.SECONDS) || git.exitValue() != 0) {
                git.destroy();
                return null;
            }
            Set<String> files = new TreeSet<>();
            for (String name : new String(out, StandardCharsets.UTF_8).split("\0")) {
                if (!name.isEmpty() && Files.isRegularFile(root.resolve(name))) {
                    files.add(name);
                }
            }
            return files.isEmpty() ? null : new ArrayList<>(files);
        } catch (IOException e) {
            return null; // no git on this machine
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return null;
        }
    }

    private static List<String> walk(Path root) {
        Set<String> files = new TreeSet<>();
        try (Stream<Path> all = Files.walk(root)) {
            all.filter(Files::isRegularFile)
                    .map(root::relativize)
                    .filter(relative -> {
                        for (Path part : relative.getParent() == null ? List.<Path>of() : relative.getParent()) {
                            String name = part.toString();
                            if (SKIPPED_FOLDERS.contains(name) || name.startsWith(".")) {
                                return false;
                            }
                        }
                        return true;
                    })
                    .forEach(relative -> files.add(relative.toString().replace('\\', '/')));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return new ArrayList<>(files);
    }
}
