package org.ritzwerk.refdata;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.LinkedHashMap;
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
 */
public final class NuclearData {

    /** The id of the built-in isotope table. */
    public static final String DATA_SET_ID = "nuclear-isotopes";
    /** The id of the built-in table of default isotopes (the most abundant one of each element). */
    public static final String DEFAULTS_ID = "nuclear-most-abundant";
    /** The standard header keys every built-in nuclear file carries, in order. */
    static final List<String> HEADER_KEYS = List.of("id", "title", "source", "provenance", "version");

    private static final String ISOTOPES = "nuclear/isotopes.csv";
    private static final String DEFAULTS = "nuclear/most-abundant.csv";
    private static volatile NuclearData builtIn;

    private final Map<Integer, Map<Integer, Isotope>> byElement;
    private final Map<Integer, Integer> defaults;
    private final DataSetInfo info;
    private final DataSetInfo defaultsInfo;

    private NuclearData(Map<Integer, Map<Integer, Isotope>> byElement, Map<Integer, Integer> defaults,
            DataSetInfo info, DataSetInfo defaultsInfo) {
        this.byElement = byElement;
        this.defaults = defaults;
        this.info = info;
        this.defaultsInfo = defaultsInfo;
    }

    /** @return what the isotope table is: id, title, version and provenance from its file header */
    public DataSetInfo info() {
        return info;
    }

    /** @return what the table of default isotopes is, from the header of {@code nuclear/most-abundant.csv} */
    public DataSetInfo defaultsInfo() {
        return defaultsInfo;
    }

    /** @return the built-in data set, read on first use (thread-safe) */
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
                    "no nuclear data for " + what + "; isotopes of " + Elements.symbol(z) + " in the built-in set: "
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
            int z = row.integer(0, "z");
            int a = row.integer(1, "a");
            if (!byElement.getOrDefault(z, Map.of()).containsKey(a)) {
                throw row.problem("default isotope " + z + "," + a + " has no row in " + ISOTOPES);
            }
            defaults.put(z, a);
        }
        byElement.replaceAll((z, map) -> Collections.unmodifiableMap(map));
        return new NuclearData(Collections.unmodifiableMap(byElement), Collections.unmodifiableMap(defaults), info,
                defaultsInfo);
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

    /** One line of a built-in file, with the context its errors report. */
    record Row(String source, int line, String raw, String[] fields) {

        Isotope isotope() {
            if (fields.length != 13) {
                throw problem("expected 13 fields, found " + fields.length);
            }
            int z = integer(0, "z");
            int a = integer(1, "a");
            if (!Elements.symbol(z).equals(fields[2])) {
                throw problem("symbol " + fields[2] + " does not match Z = " + z);
            }
            String source = "mass " + fields[5] + "; " + fields[9] + "; radius "
                    + (fields[12].isEmpty() ? "none" : fields[12]);
            return new Isotope(z, a, number(3, "mass_u"), number(4, "mass_unc_u"), twiceSpin(fields[6]),
                    optional(7, "moment_nm"), optional(10, "radius_fm"), source);
        }

        int integer(int index, String field) {
            try {
                return Integer.parseInt(fields[index]);
            } catch (NumberFormatException | ArrayIndexOutOfBoundsException e) {
                throw problem("field " + field + " is not an integer");
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
            throw problem("field " + field + " is not a finite number: '" + fields[index] + "'");
        }

        OptionalDouble optional(int index, String field) {
            return fields[index].isEmpty() ? OptionalDouble.empty() : OptionalDouble.of(number(index, field));
        }

        int twiceSpin(String spin) {
            try {
                return spin.endsWith("/2") ? Integer.parseInt(spin.substring(0, spin.length() - 2))
                        : 2 * Integer.parseInt(spin);
            } catch (NumberFormatException e) {
                throw problem("field spin is not an integer or half-integer: '" + spin + "'");
            }
        }

        ReferenceDataException problem(String reason) {
            return new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN,
                    source + ":" + line + ": " + reason + "\n    " + raw);
        }
    }
}
