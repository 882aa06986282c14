package org.ritzwerk.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.lang.reflect.Constructor;
import java.lang.reflect.Field;
import java.lang.reflect.Method;
import java.lang.reflect.Modifier;
import java.lang.reflect.Type;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.internal.angular.WignerSymbols;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/**
 * Implementation packages ({@code org.ritzwerk.engine.internal...}) stay out of the API: no
 * public or protected member of a public type in an API package names an internal type in its
 * signature, so a library user never needs (and, on the module path, cannot reach) an internal
 * class. {@code ModuleExportsTest} checks that module-info exports no internal package; this
 * test checks the signatures that would leak one.
 */
class InternalPackagesTest {

    private static final String INTERNAL = "org.ritzwerk.engine.internal";

    @Test
    void noApiSignatureNamesAnInternalType() throws Exception {
        List<Class<?>> api = apiClasses();
        assertTrue(api.size() > 50, "expected the engine's API classes, found " + api.size());
        List<String> leaks = new ArrayList<>();
        for (Class<?> type : api) {
            leaks.addAll(leaks(type));
        }
        assertTrue(leaks.isEmpty(), String.join("\n", leaks));
    }

    @Test
    void theCheckSeesALeak() {
        // A public API method returning an internal type is what the check must catch.
        List<String> found = leaks(Leaky.class);
        assertEquals(1, found.size(), String.join("\n", found));
        assertTrue(found.get(0).contains("WignerSymbols"), found.get(0));
        assertTrue(leaks(AlkaliAtom.class).isEmpty());
    }

    @Test
    void internalPackagesAreNotExported() {
        Module engine = AlkaliAtom.class.getModule();
        if (engine.isNamed()) {
            assertFalse(engine.getDescriptor().exports().stream().anyMatch(e -> e.source().startsWith(INTERNAL)));
            assertFalse(engine.isExported(WignerSymbols.class.getPackageName()));
        }
        assertTrue(WignerSymbols.class.getPackageName().startsWith(INTERNAL));
    }

    /** Public for the self-test only: a stand-in for an API type that leaks an internal one. */
    public static final class Leaky {
        /** @return an internal type, which the check must report */
        public WignerSymbols leak() {
            return null;
        }
    }

    private static List<String> leaks(Class<?> type) {
        List<String> leaks = new ArrayList<>();
        if (!Modifier.isPublic(type.getModifiers())) {
            return leaks;
        }
        String name = type.getName();
        check(leaks, name + " extends", type.getGenericSuperclass());
        for (Type t : type.getGenericInterfaces()) {
            check(leaks, name + " implements", t);
        }
        for (Method m : type.getDeclaredMethods()) {
            if (visible(m.getModifiers()) && !m.isSynthetic()) {
                String where = name + "." + m.getName();
                check(leaks, where + " returns", m.getGenericReturnType());
                for (Type p : m.getGenericParameterTypes()) {
                    check(leaks, where + " takes", p);
                }
                for (Type e : m.getGenericExceptionTypes()) {
                    check(leaks, where + " throws", e);
                }
            }
        }
        for (Constructor<?> c : type.getDeclaredConstructors()) {
            if (visible(c.getModifiers())) {
                for (Type p : c.getGenericParameterTypes()) {
                    check(leaks, name + " constructor takes", p);
                }
            }
        }
        for (Field f : type.getDeclaredFields()) {
            if (visible(f.getModifiers())) {
                check(leaks, name + "." + f.getName() + " has type", f.getGenericType());
            }
        }
        return leaks;
    }

    private static boolean visible(int modifiers) {
        return Modifier.isPublic(modifiers) || Modifier.isProtected(modifiers);
    }

    private static void check(List<String> leaks, String where, Type type) {
        if (type != null && type.getTypeName().contains(INTERNAL + ".")) {
            leaks.add(where + " " + type.getTypeName());
        }
    }

    /** Every class compiled from engine/src/main outside the internal packages. */
    private static List<Class<?>> apiClasses() throws IOException, URISyntaxException, ClassNotFoundException {
        Path root = Path.of(AlkaliAtom.class.getProtectionDomain().getCodeSource().getLocation().toURI());
        List<Class<?>> classes = new ArrayList<>();
        try (Stream<Path> files = Files.walk(root)) {
            for (Path file : files.filter(f -> f.toString().endsWith(".class")).toList()) {
                String binary = root.relativize(file).toString().replace(file.getFileSystem().getSeparator(), ".");
                binary = binary.substring(0, binary.length() - ".class".length());
                if (binary.startsWith("org.ritzwerk.engine.") && !binary.startsWith(INTERNAL)
                        && !binary.endsWith("package-info") && !binary.contains("$")) {
                    classes.add(Class.forName(binary));
                }
            }
        }
        return classes;
    }
}
