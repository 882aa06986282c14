package org.ritzwerk.refdata.internal;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentMap;
import java.util.function.Function;
import java.util.function.Supplier;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.refdata.DataFileException;
import org.ritzwerk.refdata.ReferenceDataException;

/**
 * The built-in data files of the refdata jar, listed from their headers and read once per JVM.
 *
 * <p><b>Listing reads headers only.</b> {@link #listed} reads a file's {@code # key: value} lines up
 * to its column row, so the registry can list every built-in set (id, title, version, provenance,
 * kind and species) without parsing any rows. The species a set covers is declared beside the file
 * name by its provider (the rows are what say it); when the set is loaded, {@link #checked}
 * compares the loaded set's info with the listed one and refuses a mismatch as a packaging error.
 *
 * <p><b>Shared per JVM.</b> The built-in files cannot change while the JVM runs, and the sets read
 * from them are immutable; {@link #shared} memoises each one under its resource name, so every
 * built-in registry and context of the JVM gets the same instance, parsed once, when first used.
 * A failed read is not memoised (the next use reads the file again and reports the same error).
 * Thread-safe: two threads asking for the same set at once wait for one read.
 */
public final class BuiltInFiles {

    private static final ConcurrentMap<String, Memo<?>> SHARED = new ConcurrentHashMap<>();

    private BuiltInFiles() {
    }

    /** One memoised value, made once by whichever thread asks first; a failure is not kept. */
    private static final class Memo<T> {
        private final Supplier<T> make;
        private volatile T value;

        Memo(Supplier<T> make) {
            this.make = make;
        }

        T get() {
            T made = value;
            if (made == null) {
                synchronized (this) {
                    made = value;
                    if (made == null) {
                        made = java.util.Objects.requireNonNull(make.get(), "built-in value");
                        value = made;
                    }
                }
            }
            return made;
        }
    }

    /**
     * @param key  a name for the value, unique in the JVM (the resource it is read from)
     * @param make reads the value; called at most once per JVM unless it fails
     * @param <T>  the value's type (immutable, thread-safe)
     * @return the value, the same instance for every caller of the JVM
     */
    @SuppressWarnings("unchecked")
    public static <T> T shared(String key, Supplier<T> make) {
        return ((Memo<T>) SHARED.computeIfAbsent(key, k -> new Memo<>(make))).get();
    }

    /**
     * @param resource a built-in file below {@link BuiltInCsv#RESOURCES}, e.g. {@code lamps/lamp-ne-i.csv}
     * @return its header's keys and values, in file order, up to the column row (no row is read)
     * @throws ReferenceDataException ({@link ReferenceDataException#BAD_BUILT_IN}) when the file is
     *                                missing from the jar
     */
    public static Map<String, String> header(String resource) {
        Map<String, String> header = new LinkedHashMap<>();
        try (InputStream in = open(resource);
                BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            boolean first = true;
            for (String line = reader.readLine(); line != null; line = reader.readLine()) {
                if (first) {
                    first = false;
                    continue; // the format line, checked when the file is read
                }
                if (line.isBlank()) {
                    continue;
                }
                if (!line.startsWith("#")) {
                    break; // the column row
                }
                int colon = line.indexOf(':');
                if (colon > 0) {
                    header.putIfAbsent(line.substring(1, colon).strip(), line.substring(colon + 1).strip());
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(resource + ": " + e.getMessage(), e);
        }
        return header;
    }

    /**
     * @param resource a built-in file in the project's table format (line list, level table,
     *                 quantum-defect set) below {@link BuiltInCsv#RESOURCES}
     * @param kind     the kind of its set
     * @param species  the species its rows cover, as its provider declares them
     * @return what the set is, from the file's header: id, title, version and provenance
     * @throws ReferenceDataException ({@link ReferenceDataException#BAD_BUILT_IN}) naming the file
     *                                when a required header key is missing or does not read
     */
    public static DataSetInfo listed(String resource, DataKind kind, List<Species> species) {
        return listed(resource, header(resource), kind, species);
    }

    /** {@link #listed(String, DataKind, List)} from a header already read. */
    static DataSetInfo listed(String resource, Map<String, String> header, DataKind kind, List<Species> species) {
        for (String key : List.of("id", "title", "source", "provenance", "version")) {
            if (header.getOrDefault(key, "").isEmpty()) {
                throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, resource + ": header key '"
                        + key + "' is missing");
            }
        }
        try {
            return new DataSetInfo(header.get("id"), kind, header.get("title"), header.get("version"),
                    new Provenance(Provenance.Kind.fromId(header.get("provenance")), header.get("source")), species);
        } catch (IllegalArgumentException e) {
            throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, resource + ": " + e.getMessage());
        }
    }

    /**
     * @param resource the file the set was read from, for the message
     * @param listed   what the set was listed as
     * @param loaded   the set as read
     * @param <T>      its type
     * @return the set, when its info equals the listed one
     * @throws ReferenceDataException ({@link ReferenceDataException#BAD_BUILT_IN}) when it does not
     *                                (the file's rows cover other species than its provider declares)
     */
    public static <T extends DataSet> T checked(String resource, DataSetInfo listed, T loaded) {
        if (!loaded.info().equals(listed)) {
            throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, resource + ": the set read is "
                    + describe(loaded.info()) + ", but it is listed as " + describe(listed));
        }
        return loaded;
    }

    private static String describe(DataSetInfo info) {
        return "'" + info.id() + "' (" + info.kind().id() + ", species " + info.species() + ")";
    }

    /**
     * @param resource a built-in file below {@link BuiltInCsv#RESOURCES}
     * @param reader   reads its set from the bytes (one of the user-file readers)
     * @param <T>      the set's type
     * @return the set
     * @throws ReferenceDataException ({@link ReferenceDataException#BAD_BUILT_IN}) when the file is
     *                                missing or does not read, with every problem the reader found
     *                                (file, line and the raw line)
     */
    public static <T> T read(String resource, Function<InputStream, T> reader) {
        try (InputStream in = open(resource)) {
            return reader.apply(in);
        } catch (DataFileException e) {
            throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, "built-in data file " + resource
                    + " does not read (a packaging error): " + e.getMessage());
        } catch (IOException e) {
            throw new UncheckedIOException(resource + ": " + e.getMessage(), e);
        }
    }

    /** Reads a built-in set from its file's bytes. */
    @FunctionalInterface
    public interface SetReader {
        /**
         * @param in       the file's bytes
         * @param resource the file, for messages
         * @param kind     the set's kind
         * @return the set
         */
        DataSet read(InputStream in, String resource, DataKind kind);
    }

    /**
     * A provider's built-in sets, one file per set in one folder ({@code <folder><id>.csv}): listed
     * from the files' headers and each loaded when first asked for, both once per JVM.
     *
     * @param folder  the folder below {@link BuiltInCsv#RESOURCES}, ending in '/', e.g. {@code lamps/}
     * @param noun    what a set is called in messages, e.g. {@code lamp set}
     * @param species each set's id and the species notation its rows cover, in listing order
     * @param kind    each set's kind, from its id
     * @param reader  reads a set
     */
    public record Folder(String folder, String noun, Map<String, String> species, Function<String, DataKind> kind,
            SetReader reader) {

        /**
         * @param folder  the folder, ending in '/'
         * @param noun    what a set is called in messages
         * @param species ids and species notations, alternating, in listing order
         * @param kind    each set's kind, from its id
         * @param reader  reads a set
         * @return the folder's sets
         */
        public static Folder of(String folder, String noun, Function<String, DataKind> kind, SetReader reader,
                String... species) {
            Map<String, String> map = new LinkedHashMap<>();
            for (int k = 0; k < species.length; k += 2) {
                map.put(species[k], species[k + 1]);
            }
            return new Folder(folder, noun, Collections.unmodifiableMap(map), kind, reader);
        }

        /** @return every set's info, from the files' headers (no row is read), once per JVM */
        public List<DataSetInfo> infos() {
            return List.copyOf(listed().values());
        }

        private Map<String, DataSetInfo> listed() {
            return shared(folder, () -> {
                Map<String, DataSetInfo> infos = new LinkedHashMap<>();
                species.forEach((id, notation) -> infos.put(id, BuiltInFiles.listed(resource(id), kind.apply(id),
                        List.of(Species.parse(notation)))));
                return Collections.unmodifiableMap(infos);
            });
        }

        /**
         * @param id a set's id
         * @return the set, read from the jar when first loaded in this JVM and shared from then on
         * @throws ReferenceDataException ({@link ReferenceDataException#UNKNOWN_DATA_SET}) naming the
         *                                known ids
         */
        public DataSet load(String id) {
            if (!species.containsKey(id)) {
                throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET,
                        "no " + noun + " '" + id + "'; known: " + String.join(", ", species.keySet()));
            }
            String resource = resource(id);
            return shared(resource, () -> checked(resource, listed().get(id),
                    read(resource, in -> reader.read(in, resource, kind.apply(id)))));
        }

        private String resource(String id) {
            return folder + id + ".csv";
        }
    }

    /**
     * @param resource a built-in file below {@link BuiltInCsv#RESOURCES}
     * @return its bytes
     * @throws ReferenceDataException ({@link ReferenceDataException#BAD_BUILT_IN}) when it is missing
     *                                from the jar
     */
    static InputStream open(String resource) {
        InputStream in = BuiltInFiles.class.getResourceAsStream(BuiltInCsv.RESOURCES + resource);
        if (in == null) {
            throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN,
                    "built-in data file missing from the jar: " + resource);
        }
        return in;
    }
}
