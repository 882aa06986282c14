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
import java.util.TreeMap;
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
 */
public final class NuclearData {

    /** The id of the built-in isotope table. */
    public static final String DATA_SET_ID = "nuclear-isotopes";
    /** What the built-in isotope table is. */
    public static final DataSetInfo INFO = new DataSetInfo(DATA_SET_ID, DataKind.NUCLEAR,
            "Nuclear masses, spins, moments and charge radii of 88 isotopes", "2021",
            Provenance.published("M. Wang et al., Chin. Phys. C 45, 030003 (2021) (AME2020 masses); N. J. Stone, "
                    + "INDC(NDS)-0794 (2019) and CODATA 2018 (moments); I. Angeli and K. P. Marinova, At. Data "
                    + "Nucl. Data Tables 99, 69 (2013) and CODATA 2018 (radii); Blue Obelisk data (spins)"),
            java.util.List.of());

    private static final String ISOTOPES = "nuclear/isotopes.csv";
    private static final String DEFAULTS = "nuclear/most-abundant.csv";
    private static volatile NuclearData builtIn;

    private final Map<Integer, Map<Integer, Isotope>> byElement;
    private final Map<Integer, Integer> defaults;

    private NuclearData(Map<Integer, Map<Integer, Isotope>> byElement, Map<Integer, Integer> defaults) {
        this.byElement = byElement;
        this.defaults = defaults;
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
        return new IsotopeTable(INFO, isotopes());
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
        for (Row row : rows(ISOTOPES)) {
            Isotope isotope = row.isotope();
            Map<Integer, Isotope> isotopes = byElement.computeIfAbsent(isotope.z(), z -> new TreeMap<>());
            if (isotopes.put(isotope.massNumber(), isotope) != null) {
                throw row.problem("duplicate isotope " + isotope.z() + "," + isotope.massNumber());
            }
        }
        Map<Integer, Integer> defaults = new TreeMap<>();
        for (Row row : rows(DEFAULTS)) {
            int z = row.integer(0, "z");
            int a = row.integer(1, "a");
            if (!byElement.getOrDefault(z, Map.of()).containsKey(a)) {
                throw row.problem("default isotope " + z + "," + a + " has no row in " + ISOTOPES);
            }
            defaults.put(z, a);
        }
        byElement.replaceAll((z, map) -> Collections.unmodifiableMap(map));
        return new NuclearData(Collections.unmodifiableMap(byElement), Collections.unmodifiableMap(defaults));
    }

    private static List<Row> rows(String resource) {
        InputStream in = NuclearData.class.getResourceAsStream(resource);
        if (in == null) {
            throw new IllegalStateException("built-in data file missing from the jar: " + resource);
        }
        List<Row> rows = new ArrayList<>();
        try (BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            boolean header = true;
            int number = 0;
            for (String line = reader.readLine(); line != null; line = reader.readLine()) {
                number++;
                if (line.startsWith("#") || line.isBlank()) {
                    continue;
                }
                if (header) {
                    header = false;
                    continue;
                }
                rows.add(new Row(resource, number, line, line.split(",", -1)));
            }
        } catch (IOException e) {
            throw new UncheckedIOException(resource + ": " + e.getMessage(), e);
        }
        return rows;
    }

    /** One line of a built-in file, with the context its errors report. */
    private record Row(String source, int line, String raw, String[] fields) {

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
