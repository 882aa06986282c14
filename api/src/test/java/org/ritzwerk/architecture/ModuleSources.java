package org.ritzwerk.architecture;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads the project's build files as text, for tests that hold the published modules to their
 * declared shape: the module-info.java of a module (its name, exports and opens) and the
 * project's root folder.
 */
final class ModuleSources {

    /** One exports or opens directive: the package, and the modules it is limited to (empty: all). */
    record Directive(String kind, String packageName, List<String> targets) {
        boolean qualified() {
            return !targets.isEmpty();
        }
    }

    /** A module declaration: its name and its exports and opens directives, in order. */
    record Declaration(String name, List<Directive> directives) {
    }

    private static final Pattern MODULE = Pattern.compile("\\b(?:open\\s+)?module\\s+([\\w.]+)\\s*\\{");
    private static final Pattern DIRECTIVE =
            Pattern.compile("\\b(exports|opens)\\s+([\\w.]+)(?:\\s+to\\s+([\\w.,\\s]+?))?\\s*;");

    private ModuleSources() {
    }

    /**
     * @param text the text of a module-info.java
     * @return its module name and exports and opens directives; comments are ignored
     * @throws IllegalArgumentException when the text declares no module
     */
    static Declaration parse(String text) {
        String code = withoutComments(text);
        Matcher module = MODULE.matcher(code);
        if (!module.find()) {
            throw new IllegalArgumentException("no module declaration found");
        }
        List<Directive> directives = new ArrayList<>();
        Matcher directive = DIRECTIVE.matcher(code);
        while (directive.find()) {
            List<String> targets = new ArrayList<>();
            if (directive.group(3) != null) {
                for (String target : directive.group(3).split(",")) {
                    targets.add(target.strip());
                }
            }
            directives.add(new Directive(directive.group(1), directive.group(2), List.copyOf(targets)));
        }
        return new Declaration(module.group(1), List.copyOf(directives));
    }

    /**
     * @param module a module folder name under the root (api, engine, refdata)
     * @return the declaration in its src/main/java/module-info.java
     */
    static Declaration read(String module) {
        Path file = root().resolve(module).resolve("src/main/java/module-info.java");
        try {
            return parse(Files.readString(file));
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + file, e);
        }
    }

    /**
     * @param relative a file path under the root
     * @return the file's text
     */
    static String text(String relative) {
        Path file = root().resolve(relative);
        try {
            return Files.readString(file);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + file, e);
        }
    }

    /** @return the project's root: the nearest folder up from the working one holding the parent pom */
    static Path root() {
        for (Path dir = Path.of("").toAbsolutePath().normalize(); dir != null; dir = dir.getParent()) {
            Path pom = dir.resolve("pom.xml");
            try {
                if (Files.isRegularFile(pom)
                        && Files.readString(pom).contains("<artifactId>ritzwerk-parent</artifactId>")
                        && Files.isDirectory(dir.resolve("api"))) {
                    return dir;
                }
            } catch (IOException e) {
                throw new UncheckedIOException("cannot read " + pom, e);
            }
        }
        throw new IllegalStateException("no project root (a folder with the ritzwerk-parent pom.xml and api/) above "
                + Path.of("").toAbsolutePath());
    }

    private static String withoutComments(String text) {
        return text.replaceAll("(?s)/\\*.*?\\*/", " ").replaceAll("//[^\\n]*", " ");
    }
}
