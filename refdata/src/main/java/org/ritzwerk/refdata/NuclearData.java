package org.ritzwerk.refdata;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.ritzwerk.atom.Elements;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Isotope;
import org.ritzwerk.data.IsotopeTable;
import org.ritzwerk.data.Provenance;

/**
 * Nuclear data of isotopes (atomic mass, spin, magnetic moment, charge radius), each value with
 * its source, and the isotope a species means when its mass number is not given.
 *
 * <p>The built-in set ({@link #builtIn()}) covers the stable isotopes of Z = 1 to 30 and the
 * heavier ones the models are asked for (Kr, Rb, Xe, Cs, Pb, U): masses from AME2020, moments
 * from the IAEA recommended table (Stone 2019) or CODATA 2018, charge radii from Angeli &amp;
 * Marinova 2013 or CODATA 2018, spins from the Blue Obelisk data repository; the file header of
 * {@code nuclear/isotopes.csv} gives every citation and how the values were checked. It is read
 * once, on first use. Immutable and thread-safe.
 *
 * <p>Both files it reads ({@code nuclear/isotopes.csv} and {@code nuclear/most-abundant.csv})
 * start with the standard header keys of the project's data files ({@code # id:},
 * {@code # title:}, {@code # source:}, {@code # provenance:}, {@code # version:}); they are
 * required, each once, and {@link #info()} and {@link #defaultsInfo()} expose them. Other
 * {@code #} lines are comments.
 *
 * <p><b>Built-in default, not a context.</b> {@link #builtIn()} is Ritzwerk's built-in data set,
 * kept for compatibility and for the built-in providers. Code that needs nuclear data should take
 * it from a {@link DataContext} ({@link DataContext#nucleus(Species)}), where a user's isotope
 * file ({@link #read(InputStream, String)}) or a third-party provider can replace it.
 */
public final class NuclearData {

    /** The id of the built-in isotope table. */
    public static final String DATA_SET_ID = "nuclear-isotopes";
    /** The id of the built-in table of default isotopes (the most abundant one of each element). */
    public static final String DEFAULTS_ID = "nuclear-most-abundant";
    /** The standard header keys every built-in nuclear file carries, in order. */
    static final List<String> HEADER_KEYS = List.of("id", "title", "source", "provenance", "version");

    /** The columns of an isotope file (the built-in one and a user's), in order. */
    public static final List<String> ISOTOPE_COLUMNS = List.of("z", "a", "symbol", "mass_u", "mass_unc_u",
            "mass_source", "spin", "moment_nm", "moment_unc_nm", "moment_source", "radius_fm", "radius_unc_fm",
            "radius_source");

    private static final String ISOTOPES = "nuclear/isotopes.csv";
    private static final String DEFAULTS = "nuclear/most-abundant.csv";
    private static volatile NuclearData builtIn;

    private final Map<Integer, Map<Integer, Isotope>> byElement;
    private final Map<Integer, Integer> defaults;
    private final DataSetInfo info;
    private final DataSetInfo defaultsInfo;
    /** How messages name this data: "the built-in set" or "the nuclear data in use". */
    private final String name;

    private NuclearData(Map<Integer, Map<Integer, Isotope>> byElement, Map<Integer, Integer> defaults,
            DataSetInfo info, DataSetInfo defaultsInfo, String name) {
        this.byElement = byElement;
        this.defaults = defaults;
        this.info = info;
        this.defaultsInfo = defaultsInfo;
        this.name = name;
    }

    /**
     * @param table an isotope table, e.g. from a third-party provider
     * @return its isotopes as nuclear data, with no default isotopes of its own
     * @throws IllegalArgumentException when the table holds an isotope twice
     */
    public static NuclearData of(IsotopeTable table) {
        Map<Integer, Map<Integer, Isotope>> byElement = new TreeMap<>();
        for (Isotope isotope : table.isotopes()) {
            if (byElement.computeIfAbsent(isotope.z(), z -> new TreeMap<>()).put(isotope.massNumber(), isotope) != null) {
                throw new IllegalArgumentException("isotope table '" + table.info().id() + "' holds Z = " + isotope.z()
                        + ", A = " + isotope.massNumber() + " twice");
            }
        }
        return frozen(byElement, Map.of(), table.info(), table.info(), "the nuclear data in use");
    }

    /**
     * Layers nuclear data sets: each isotope from the first set (in the order given) that tabulates
     * it, and each element's default mass number from the first set that names one.
     *
     * @param inPrecedence the sets, highest precedence first; at least one
     * @return the layered data; its {@link #info()} is that of the first set
     */
    static NuclearData layered(List<NuclearData> inPrecedence) {
        if (inPrecedence.size() == 1) {
            return inPrecedence.get(0);
        }
        Map<Integer, Map<Integer, Isotope>> byElement = new TreeMap<>();
        Map<Integer, Integer> defaults = new TreeMap<>();
        DataSetInfo defaultsInfo = null;
        for (NuclearData data : inPrecedence) {
            data.byElement.forEach((z, isotopes) -> isotopes.forEach((a, isotope) ->
                    byElement.computeIfAbsent(z, k -> new TreeMap<>()).putIfAbsent(a, isotope)));
            data.defaults.forEach(defaults::putIfAbsent);
            if (defaultsInfo == null && !data.defaults.isEmpty()) {
                defaultsInfo = data.defaultsInfo;
            }
        }
        DataSetInfo first = inPrecedence.get(0).info;
        return frozen(byElement, defaults, first, defaultsInfo == null ? first : defaultsInfo,
                "the nuclear data in use");
    }

    /** @return the default isotopes of this data and no isotopes, a bottom layer for {@link #layered} */
    NuclearData defaultsOnly() {
        return new NuclearData(Map.of(), defaults, info, defaultsInfo, name);
    }

    private static NuclearData frozen(Map<Integer, Map<Integer, Isotope>> byElement, Map<Integer, Integer> defaults,
            DataSetInfo info, DataSetInfo defaultsInfo, String name) {
        Map<Integer, Map<Integer, Isotope>> copy = new TreeMap<>();
        byElement.forEach((z, map) -> copy.put(z, Collections.unmodifiableMap(new TreeMap<>(map))));
        return new NuclearData(Collections.unmodifiableMap(copy), Collections.unmodifiableMap(new TreeMap<>(defaults)),
                info, defaultsInfo, name);
    }

    /** @return what the isotope table is: id, title, version and provenance from its file header */
    public DataSetInfo info() {
        return info;
    }

    /** @return what the table of default isotopes is, from the header of {@code nuclear/most-abundant.csv} */
    public DataSetInfo defaultsInfo() {
        return defaultsInfo;
    }

    /**
     * @return the built-in data set, read on first use (thread-safe); the built-in default, for
     *         compatibility: code that needs nuclear data takes it from a {@link DataContext}
     */
    public static NuclearData builtIn() {
        NuclearData data = builtIn;
        if (data == null) {
            synchronized (NuclearData.class) {
                data = builtIn;
                if (data == null) {
                    data = load();
                    builtIn = data;
                }
            }
        }
        return data;
    }

    /**
     * @param species a species; its mass number may be 0 (then the most abundant isotope)
     * @return the nucleus of that species' isotope
     * @throws ReferenceDataException when the isotope is not in this data set
     */
    public Nucleus nucleus(Species species) {
        return isotope(species).nucleus();
    }

    /**
     * @param species a species; its mass number may be 0 (then the most abundant isotope)
     * @return the tabulated isotope
     * @throws ReferenceDataException when the isotope is not in this data set
     */
    public Isotope isotope(Species species) {
        int z = species.z();
        Map<Integer, Isotope> isotopes = byElement.getOrDefault(z, Map.of());
        int a = species.massNumber() != 0 ? species.massNumber() : defaults.getOrDefault(z, 0);
        Isotope isotope = isotopes.get(a);
        if (isotope == null) {
            String known = isotopes.isEmpty() ? "none" : isotopes.keySet().stream().map(String::valueOf)
                    .collect(Collectors.joining(", "));
            String what = species.massNumber() != 0 ? Elements.symbol(z) + "-" + species.massNumber()
                    : Elements.symbol(z) + " (no default isotope)";
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_ISOTOPE,
                    "no nuclear data for " + what + "; isotopes of " + Elements.symbol(z) + " in " + name + ": "
                            + known);
        }
        return isotope;
    }

    /** @return every isotope, ordered by Z and A; immutable */
    public List<Isotope> isotopes() {
        List<Isotope> all = new ArrayList<>();
        byElement.values().forEach(map -> all.addAll(map.values()));
        return Collections.unmodifiableList(all);
    }

    /** @return the isotopes as a reference data set */
    public IsotopeTable table() {
        return new IsotopeTable(info, isotopes());
    }

    /**
     * @param z atomic number
     * @return the mass number a species of this element means by default, if any
     */
    public Optional<Integer> defaultMassNumber(int z) {
        return Optional.ofNullable(defaults.get(z));
    }

    private static NuclearData load() {
        Map<Integer, Map<Integer, Isotope>> byElement = new TreeMap<>();
        List<Row> isotopeRows = new ArrayList<>();
        DataSetInfo info = read(ISOTOPES, DATA_SET_ID, isotopeRows);
        List<Row> defaultRows = new ArrayList<>();
        DataSetInfo defaultsInfo = read(DEFAULTS, DEFAULTS_ID, defaultRows);
        for (Row row : isotopeRows) {
            Isotope isotope = row.isotope();
            Map<Integer, Isotope> isotopes = byElement.computeIfAbsent(isotope.z(), z -> new TreeMap<>());
            if (isotopes.put(isotope.massNumber(), isotope) != null) {
                throw row.problem("duplicate isotope " + isotope.z() + "," + isotope.massNumber());
            }
        }
        Map<Integer, Integer> defaults = new TreeMap<>();
        for (Row row : defaultRows) {
            int z;
            int a;
            try {
                z = row.integer(0, "z");
                a = row.integer(1, "a");
            } catch (FieldProblem e) {
                throw row.problem(e.getMessage());
            }
            if (!byElement.getOrDefault(z, Map.of()).containsKey(a)) {
                throw row.problem("default isotope " + z + "," + a + " has no row in " + ISOTOPES);
            }
            defaults.put(z, a);
        }
        byElement.replaceAll((z, map) -> Collections.unmodifiableMap(map));
        return new NuclearData(Collections.unmodifiableMap(byElement), Collections.unmodifiableMap(defaults), info,
                defaultsInfo, "the built-in set");
    }

    /**
     * Reads a user's isotope file: the format of the built-in {@code nuclear/isotopes.csv} (header
     * keys {@code # id:}, {@code # title:}, {@code # source:}, {@code # provenance:},
     * {@code # version:}, each once, before the data; other {@code #} lines are comments; the
     * column row {@link #ISOTOPE_COLUMNS}; one row per isotope, the mass the neutral atom's in u,
     * the spin as {@code 0}, {@code 1/2}, {@code 7/2}, empty optional fields meaning "not
     * available"). The id is the file's own (a set of the same id as a built-in one replaces it).
     * The file names no default isotopes: the default mass numbers of a context stay those of the
     * sets below it.
     *
     * @param in     the bytes (UTF-8), read to the end; not closed
     * @param source the file name, for messages
     * @return the isotopes of the file
     * @throws DataFileException with every problem found, each with file, line and field
     */
    public static NuclearData read(InputStream in, String source) {
        return readUser(TabularFiles.decode(in, source), source);
    }

    /** {@link #read(InputStream, String)} on text already read. */
    static NuclearData readUser(String text, String source) {
        List<DataProblem> problems = new ArrayList<>();
        Map<String, String> header = new LinkedHashMap<>();
        Map<String, Integer> headerLine = new LinkedHashMap<>();
        Map<Integer, Map<Integer, Isotope>> byElement = new TreeMap<>();
        boolean columns = false;
        int rows = 0;
        String[] lines = text.split("\r?\n", -1);
        for (int i = 0; i < lines.length; i++) {
            int number = i + 1;
            String line = lines[i];
            if (line.startsWith("#")) {
                Matcher key = HEADER_KEY.matcher(line);
                if (key.matches()) {
                    if (columns) {
                        problems.add(new DataProblem(source, number, 0, "nuclear.header-after-data",
                                "header key '" + key.group(1) + "' after the column row", line));
                    } else if (header.put(key.group(1), key.group(2).strip()) != null) {
                        problems.add(new DataProblem(source, number, 0, "nuclear.duplicate-key",
                                "header key '" + key.group(1) + "' is given twice", line));
                    }
                    headerLine.putIfAbsent(key.group(1), number);
                }
                continue;
            }
            if (line.isBlank()) {
                continue;
            }
            if (!columns) {
                columns = true;
                if (!line.strip().equals(String.join(",", ISOTOPE_COLUMNS))) {
                    problems.add(new DataProblem(source, number, 0, "nuclear.columns",
                            "columns must be " + String.join(",", ISOTOPE_COLUMNS), line));
                    break;
                }
                continue;
            }
            rows++;
            Row row = new Row(source, number, line, line.split(",", -1));
            try {
                Isotope isotope = row.parse();
                if (byElement.computeIfAbsent(isotope.z(), z -> new TreeMap<>())
                        .putIfAbsent(isotope.massNumber(), isotope) != null) {
                    problems.add(new DataProblem(source, number, 0, "nuclear.duplicate-isotope", "isotope "
                            + Elements.symbol(isotope.z()) + "-" + isotope.massNumber() + " is given twice", line));
                }
            } catch (FieldProblem e) {
                problems.add(new DataProblem(source, number, e.column, "nuclear.bad-field", e.getMessage(), line));
            }
        }
        for (String key : HEADER_KEYS) {
            if (header.getOrDefault(key, "").isBlank()) {
                problems.add(new DataProblem(source, headerLine.getOrDefault(key, 1), 0, "nuclear.missing-key",
                        "required header '# " + key + ": ...' is missing or empty", ""));
            }
        }
        String id = header.getOrDefault("id", "");
        if (!id.isBlank() && !DataSetInfo.isValidId(id)) {
            problems.add(new DataProblem(source, headerLine.get("id"), 0, "nuclear.bad-id", "id '" + id
                    + "' must be lower-case letters, digits, dots and dashes", "# id: " + id));
        }
        Provenance.Kind kind = null;
        if (!header.getOrDefault("provenance", "").isBlank()) {
            try {
                kind = Provenance.Kind.fromId(header.get("provenance"));
            } catch (IllegalArgumentException e) {
                problems.add(new DataProblem(source, headerLine.get("provenance"), 0, "nuclear.bad-provenance",
                        e.getMessage(), "# provenance: " + header.get("provenance")));
            }
        }
        if (problems.isEmpty() && rows == 0) {
            problems.add(new DataProblem(source, Math.max(1, lines.length), 0, "nuclear.no-rows",
                    columns ? "no isotope rows" : "no column row and no isotope rows", ""));
        }
        if (!problems.isEmpty()) {
            throw new DataFileException(DataFileException.INVALID, source, problems, "");
        }
        DataSetInfo info = new DataSetInfo(id, DataKind.NUCLEAR, header.get("title"), header.get("version"),
                new Provenance(kind, header.get("source")), List.of());
        return frozen(byElement, Map.of(), info, info, source);
    }

    /**
     * @param text the first lines of a file
     * @return whether it reads as an isotope file: its first row that is neither blank nor a
     *         comment is the column row {@link #ISOTOPE_COLUMNS}
     */
    static boolean looksLikeIsotopes(String text) {
        for (String line : text.split("\r?\n")) {
            if (!line.isBlank() && !line.startsWith("#")) {
                return line.strip().equals(String.join(",", ISOTOPE_COLUMNS));
            }
        }
        return false;
    }

    /**
     * Reads a built-in nuclear file: its standard header keys into a {@link DataSetInfo} (validated),
     * its data rows into {@code rows}.
     */
    private static DataSetInfo read(String resource, String expectedId, List<Row> rows) {
        InputStream in = NuclearData.class.getResourceAsStream(resource);
        if (in == null) {
            throw new IllegalStateException("built-in data file missing from the jar: " + resource);
        }
        try (BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            return read(reader, resource, expectedId, rows);
        } catch (IOException e) {
            throw new UncheckedIOException(resource + ": " + e.getMessage(), e);
        }
    }

    /**
     * The reading itself, open to tests: header keys are lines {@code # key: value} with one of
     * {@link #HEADER_KEYS} as key, each required once and not blank; the id must be
     * {@code expectedId} and the provenance a known kind.
     *
     * @throws ReferenceDataException ({@link ReferenceDataException#BAD_BUILT_IN}) naming the file and line
     */
    static DataSetInfo read(BufferedReader reader, String resource, String expectedId, List<Row> rows)
            throws IOException {
        Map<String, String> header = new LinkedHashMap<>();
        boolean columns = true;
        int number = 0;
        for (String line = reader.readLine(); line != null; line = reader.readLine()) {
            number++;
            if (line.startsWith("#")) {
                Matcher key = HEADER_KEY.matcher(line);
                if (key.matches()) {
                    if (!columns || !rows.isEmpty()) {
                        throw new Row(resource, number, line, new String[0]).problem("header key after the data");
                    }
                    if (header.put(key.group(1), key.group(2).strip()) != null) {
                        throw new Row(resource, number, line, new String[0])
                                .problem("header key '" + key.group(1) + "' is given twice");
                    }
                }
                continue;
            }
            if (line.isBlank()) {
                continue;
            }
            if (columns) {
                columns = false;
                continue;
            }
            rows.add(new Row(resource, number, line, line.split(",", -1)));
        }
        return info(resource, expectedId, header);
    }

    private static final Pattern HEADER_KEY = Pattern.compile(
            "#\\s*(" + String.join("|", HEADER_KEYS) + "):(.*)");

    private static DataSetInfo info(String resource, String expectedId, Map<String, String> header) {
        for (String key : HEADER_KEYS) {
            if (header.getOrDefault(key, "").isBlank()) {
                throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN,
                        resource + ":1: required header '# " + key + ": ...' is missing or empty");
            }
        }
        if (!header.get("id").equals(expectedId)) {
            throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN,
                    resource + ":1: header id '" + header.get("id") + "', expected '" + expectedId + "'");
        }
        Provenance.Kind kind;
        try {
            kind = Provenance.Kind.fromId(header.get("provenance"));
        } catch (IllegalArgumentException e) {
            throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, resource + ":1: " + e.getMessage());
        }
        return new DataSetInfo(expectedId, DataKind.NUCLEAR, header.get("title"), header.get("version"),
                new Provenance(kind, header.get("source")), List.of());
    }

    /** A bad field of an isotope row: the reason, and the 1-based column where the field starts (0: the whole line). */
    static final class FieldProblem extends RuntimeException {
        private static final long serialVersionUID = 1L;
        final int column;

        FieldProblem(String reason, int column) {
            super(reason, null, false, false);
            this.column = column;
        }
    }

    /** One line of a nuclear file, with the context its errors report. */
    record Row(String source, int line, String raw, String[] fields) {

        /** @return the isotope of a built-in row; a bad field is a {@link ReferenceDataException} */
        Isotope isotope() {
            try {
                return parse();
            } catch (FieldProblem e) {
                throw problem(e.getMessage());
            }
        }

        /** @return the isotope of the row; a bad field is a {@link FieldProblem} */
        Isotope parse() {
            if (fields.length != 13) {
                throw new FieldProblem("expected 13 fields, found " + fields.length, 0);
            }
            int z = integer(0, "z");
            int a = integer(1, "a");
            if (z < 1 || z > 118 || !Elements.symbol(z).equals(fields[2])) {
                throw new FieldProblem("field symbol: " + fields[2] + " does not match Z = " + z, column(2));
            }
            if (a < z) {
                throw new FieldProblem("field a: mass number " + a + " is below Z = " + z, column(1));
            }
            double mass = number(3, "mass_u");
            if (!(mass > 0)) {
                throw new FieldProblem("field mass_u must be positive, got " + fields[3], column(3));
            }
            Isotope.SourceKeys keys;
            try {
                keys = new Isotope.SourceKeys(fields[5], fields[9], fields[12]);
            } catch (IllegalArgumentException e) {
                int bad = fields[5].matches(".*[,\r\n].*") ? 5 : fields[9].matches(".*[,\r\n].*") ? 9 : 12;
                throw new FieldProblem("field " + ISOTOPE_COLUMNS.get(bad) + ": a source key must hold no comma or line"
                        + " break", column(bad));
            }
            double massSigma = number(4, "mass_unc_u");
            int twiceSpin = twiceSpin(fields[6]);
            OptionalDouble moment = optional(7, "moment_nm");
            OptionalDouble momentSigma = optional(8, "moment_unc_nm");
            OptionalDouble radius = optional(10, "radius_fm");
            OptionalDouble radiusSigma = optional(11, "radius_unc_fm");
            try {
                return Isotope.tabulated(z, a, mass, massSigma, twiceSpin, moment, momentSigma, radius, radiusSigma,
                        keys);
            } catch (IllegalArgumentException e) {
                throw new FieldProblem(e.getMessage(), 0);
            }
        }

        /** @return the 1-based character column where field {@code index} starts */
        private int column(int index) {
            int column = 1;
            for (int i = 0; i < index && i < fields.length; i++) {
                column += fields[i].length() + 1;
            }
            return column;
        }

        int integer(int index, String field) {
            try {
                return Integer.parseInt(fields[index]);
            } catch (NumberFormatException | ArrayIndexOutOfBoundsException e) {
                throw new FieldProblem("field " + field + " is not an integer", index < fields.length ? column(index) : 0);
            }
        }

        double number(int index, String field) {
            try {
                double value = Double.parseDouble(fields[index]);
                if (Double.isFinite(value)) {
                    return value;
                }
            } catch (NumberFormatException e) {
                // reported below
            }
            throw new FieldProblem("field " + field + " is not a finite number: '" + fields[index] + "'", column(index));
        }

        OptionalDouble optional(int index, String field) {
            return fields[index].isEmpty() ? OptionalDouble.empty() : OptionalDouble.of(number(index, field));
        }

        int twiceSpin(String spin) {
            try {
                int twice = spin.endsWith("/2") ? Integer.parseInt(spin.substring(0, spin.length() - 2))
                        : 2 * Integer.parseInt(spin);
                if (twice >= 0) {
                    return twice;
                }
            } catch (NumberFormatException e) {
                // reported below
            }
            throw new FieldProblem("field spin is not an integer or half-integer: '" + spin + "'", column(6));
        }

        ReferenceDataException problem(String reason) {
            return new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN,
                    source + ":" + line + ": " + reason + "\n    " + raw);
        }
    }
}
