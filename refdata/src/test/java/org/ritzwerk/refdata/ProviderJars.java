package org.ritzwerk.refdata;

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
import org.ritzwerk.data.ReferenceDataProvider;

/** Compiles a provider's source and packs it, with its ServiceLoader entry, into a jar, as a third party would. */
final class ProviderJars {

    private ProviderJars() {
    }

    /**
     * @param dir       a scratch directory
     * @param className the provider's fully qualified class name
     * @param source    its Java source, compiled against the api module only
     * @return the jar
     */
    static Path build(Path dir, String className, String source) throws IOException {
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

    private static Path location(Class<?> type) {
        try {
            return Path.of(type.getProtectionDomain().getCodeSource().getLocation().toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }
}
