package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.lang.reflect.InvocationTargetException;
import java.net.MalformedURLException;
import java.net.URL;
import java.net.URLClassLoader;
import java.net.URLConnection;
import java.net.URLStreamHandler;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.Callable;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataSet;

/**
 * Which built-in files a lookup reads in full. Each check runs Ritzwerk in a class loader of its
 * own, as in a fresh JVM (nothing read yet, no set shared from another test), whose resources
 * record the files read to their end; reading a file's header to list its set does not count.
 * Before lazy listing, the first lookup of any context read every lamp and level file.
 */
class BuiltInReadsTest {

    private static final String PREFIX = "org/ritzwerk/refdata/";

    @Test
    void aNucleusLookupReadsNoLineOrLevelList() throws Exception {
        try (Fresh fresh = new Fresh()) {
            Object context = fresh.context();
            Object nucleus = fresh.call(context, "nucleus", fresh.species("H I"));
            assertEquals("1", String.valueOf(nucleus.getClass().getMethod("z").invoke(nucleus)));
            // only the nuclear tables: no lamp set, no level or line list, no Rydberg file
            assertEquals(Set.of(), fresh.readOutside("nuclear/"), "read in full: " + fresh.read);
            assertTrue(fresh.read.contains("nuclear/isotopes.csv"), fresh.read.toString());
        }
    }

    @Test
    void aLevelListLookupReadsOnlyThatList() throws Exception {
        try (Fresh fresh = new Fresh()) {
            fresh.call(fresh.context(), "levelList", fresh.species("He I"));
            assertEquals(Set.of("levels/levels-he-i.csv"), fresh.readOutside("nuclear/"));
        }
    }

    @Test
    void anAlkaliAtomReadsItsOwnIsotopesFilesOnly() throws Exception {
        try (Fresh fresh = new Fresh()) {
            fresh.call(fresh.context(), "alkaliAtom", fresh.species("Rb-87 I"));
            Set<String> isotopeFiles = fresh.read.stream().filter(name -> name.startsWith("rydberg/quantum-defects-")
                    || name.startsWith("rydberg/levels-")).collect(Collectors.toCollection(TreeSet::new));
            assertEquals(Set.of("rydberg/levels-rb-87.csv", "rydberg/quantum-defects-rb-87.csv"), isotopeFiles);
            assertTrue(fresh.read.stream().noneMatch(name -> name.startsWith("lamps/") || name.startsWith("levels/")),
                    fresh.read.toString());
        }
    }

    @Test
    void aLampSetLookupReadsOnlyThatSet() throws Exception {
        try (Fresh fresh = new Fresh()) {
            fresh.call(fresh.context(), "lampLines", fresh.species("Ne I"));
            assertEquals(Set.of("lamps/lamp-ne-i.csv"), fresh.readOutside("nuclear/"));
        }
    }

    @Test
    void aBrokenBuiltInFileIsReportedWhenItsSetIsUsedWithFileAndLine(@TempDir Path folder) throws Exception {
        String resource = "lamps/lamp-ne-i.csv";
        String text;
        try (InputStream in = DataContext.class.getResourceAsStream("/" + PREFIX + resource)) {
            text = new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
        assertTrue(text.split("\n", -1)[12].startsWith("Ne I,540.05618,"), "line 13 of " + resource);
        Path broken = folder.resolve("lamp-ne-i.csv");
        Files.writeString(broken, text.replace("Ne I,540.05618,", "Ne I,540.0x5618,"));
        try (Fresh fresh = new Fresh(Map.of(PREFIX + resource, broken))) {
            Object context = fresh.context();
            // listing reads headers only: the other lookups work
            fresh.call(context, "nucleus", fresh.species("H I"));
            fresh.call(context, "lampLines", fresh.species("Ar I"));
            // the broken set is refused when used, naming the file and the line
            InvocationTargetException e = assertThrows(InvocationTargetException.class,
                    () -> fresh.call(context, "lampLines", fresh.species("Ne I")));
            Throwable cause = e.getCause();
            assertEquals(ReferenceDataException.class.getName(), cause.getClass().getName(), cause.toString());
            assertEquals(ReferenceDataException.BAD_BUILT_IN, cause.getClass().getMethod("code").invoke(cause));
            String message = cause.getMessage();
            assertTrue(message.startsWith("built-in data file " + resource + " does not read"), message);
            assertTrue(message.contains(resource + ":13:"), message);
            assertTrue(message.contains("540.0x5618"), message);
        }
    }

    @Test
    void manyThreadsAskingAFreshContextAtOnceShareOneReadOfEachSet() throws Exception {
        try (Fresh fresh = new Fresh()) {
            Object context = fresh.context();
            Object other = fresh.context();
            ExecutorService pool = Executors.newFixedThreadPool(8);
            try {
                List<Future<Object>> sets = new ArrayList<>();
                for (int k = 0; k < 16; k++) {
                    Object asking = k % 2 == 0 ? context : other;
                    Callable<Object> task = () -> fresh.call(asking, "levelList", fresh.species("Sr-88 I"));
                    sets.add(pool.submit(task));
                }
                Object first = sets.get(0).get();
                first = ((java.util.Optional<?>) first).orElseThrow();
                for (Future<Object> set : sets) {
                    assertSame(first, ((java.util.Optional<?>) set.get()).orElseThrow(),
                            "every context of the JVM gets the one set read");
                }
            } finally {
                pool.shutdownNow();
            }
            assertEquals(1, fresh.reads.get("levels/levels-sr-i.csv").size(), "read once: " + fresh.reads);
        }
    }

    @Test
    void everyBuiltInSetLoadsAsListedAndIsSharedByContexts() {
        DataRegistry registry = DataRegistry.builtIn();
        DataRegistry another = DataRegistry.builtIn();
        for (DataRegistry.Listing listing : registry.list()) {
            DataSet set = registry.load(listing.info().id());
            // what a listing says without reading rows is what the set read says it is
            assertEquals(listing.info(), set.info(), listing.info().id());
            if (List.of("ritzwerk-lamps", "ritzwerk-levels", "ritzwerk-rydberg").contains(listing.providerId())) {
                // the lamp, level and Rydberg files are read once per JVM (computed sets: per registry)
                assertSame(set, another.load(listing.info().id()), listing.info().id());
            }
        }
        assertEquals(registry.list(), another.list());
    }

    @Test
    void aLampSetSharedBetweenContextsGivesTheSameAnswers() {
        Species neon = Species.parse("Ne I");
        assertSame(DataContext.builtIn().lampLines(neon), DataContext.builtIn().lampLines(neon));
    }

    /** Ritzwerk's classes and data in a class loader of their own, recording each built-in file read to its end. */
    private static final class Fresh implements AutoCloseable {
        final Set<String> read = ConcurrentHashMap.newKeySet();
        /** Per file, one entry per stream opened on it that was read to the end. */
        final ConcurrentHashMap<String, List<Integer>> reads = new ConcurrentHashMap<>();
        private final URLClassLoader loader;

        Fresh() {
            this(Map.of());
        }

        /** @param replaced resources (full names) to read from other files instead */
        Fresh(Map<String, Path> replaced) {
            List<URL> urls = new ArrayList<>();
            for (String property : List.of("jdk.module.path", "java.class.path")) {
                String path = System.getProperty(property, "");
                for (String entry : path.split(File.pathSeparator)) {
                    if (!entry.isBlank()) {
                        try {
                            urls.add(new File(entry).toURI().toURL());
                        } catch (MalformedURLException e) {
                            throw new UncheckedIOException(e);
                        }
                    }
                }
            }
            loader = new URLClassLoader(urls.toArray(URL[]::new), ClassLoader.getPlatformClassLoader()) {
                // Child first: the platform loader would hand the test's own (module path) classes back.
                @Override
                protected Class<?> loadClass(String name, boolean resolve) throws ClassNotFoundException {
                    synchronized (getClassLoadingLock(name)) {
                        Class<?> c = findLoadedClass(name);
                        if (c == null) {
                            try {
                                c = findClass(name);
                            } catch (ClassNotFoundException e) {
                                return super.loadClass(name, resolve);
                            }
                        }
                        if (resolve) {
                            resolveClass(c);
                        }
                        return c;
                    }
                }

                @Override
                public URL getResource(String name) {
                    URL url = findResource(name);
                    return url != null ? url : super.getResource(name);
                }

                @Override
                public URL findResource(String name) {
                    URL url = super.findResource(name);
                    if (url != null && replaced.containsKey(name)) {
                        try {
                            url = replaced.get(name).toUri().toURL();
                        } catch (MalformedURLException e) {
                            throw new UncheckedIOException(e);
                        }
                    }
                    if (url == null || !name.startsWith(PREFIX) || !name.endsWith(".csv")) {
                        return url;
                    }
                    return recording(url, name.substring(PREFIX.length()));
                }
            };
        }

        private URL recording(URL url, String name) {
            try {
                return new URL(null, url.toString(), new URLStreamHandler() {
                    @Override
                    protected URLConnection openConnection(URL u) throws IOException {
                        URLConnection real = url.openConnection();
                        return new URLConnection(u) {
                            @Override
                            public void connect() {
                            }

                            @Override
                            public InputStream getInputStream() throws IOException {
                                return new FilterInputStream(real.getInputStream()) {
                                    private boolean ended;

                                    private int ended(int n) {
                                        if (n < 0 && !ended) {
                                            ended = true;
                                            read.add(name);
                                            reads.computeIfAbsent(name, k -> new java.util.concurrent
                                                    .CopyOnWriteArrayList<>()).add(1);
                                        }
                                        return n;
                                    }

                                    @Override
                                    public int read() throws IOException {
                                        return ended(super.read());
                                    }

                                    @Override
                                    public int read(byte[] b, int off, int len) throws IOException {
                                        return ended(super.read(b, off, len));
                                    }
                                };
                            }
                        };
                    }
                });
            } catch (MalformedURLException e) {
                throw new UncheckedIOException(e);
            }
        }

        Object context() throws ReflectiveOperationException {
            return loader.loadClass(DataContext.class.getName()).getMethod("builtIn").invoke(null);
        }

        Object species(String notation) throws ReflectiveOperationException {
            return loader.loadClass(Species.class.getName()).getMethod("parse", String.class).invoke(null, notation);
        }

        Object call(Object context, String method, Object species) throws ReflectiveOperationException {
            return context.getClass().getMethod(method, species.getClass()).invoke(context, species);
        }

        /** @return the files read in full outside the given folder (below the data root) */
        Set<String> readOutside(String folder) {
            return read.stream().filter(name -> !name.startsWith(folder))
                    .collect(Collectors.toCollection(TreeSet::new));
        }

        @Override
        public void close() throws IOException {
            loader.close();
        }
    }
}
