package org.ritzwerk.refdata;

import java.io.InputStream;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.PublishedDipole;
import org.ritzwerk.refdata.internal.BuiltInCsv;

/**
 * Published reduced electric-dipole matrix elements of low-lying alkali transitions, which the data
 * context's atoms use instead of their computed elements for exactly those pairs
 * ({@link AlkaliAtom#withPublishedDipoles(List)}): the engine uses a published element where one
 * exists. A row gives either the element itself ({@code element}, in a0) or the measured lifetime
 * of an upper level whose only dipole decay is to the row's lower level ({@code lifetime}, in ns),
 * from which the element follows with the isotope's own transition frequency
 * ({@link AlkaliAtom#reducedDipoleFromLifetime}). The built-in file is
 * {@code rydberg/dipole-elements.csv} (format {@value #FORMAT} 1), each row with its source and how
 * it was checked. Immutable and thread-safe.
 */
public final class AlkaliDipoles {

    /** The format name. */
    public static final String FORMAT = "ritzwerk-dipole-elements";
    /** The columns, in order. */
    public static final List<String> COLUMNS = List.of("species", "lower", "upper", "kind", "value", "uncertainty",
            "unit", "provenance", "source", "checked");

    private static volatile AlkaliDipoles builtIn;

    /**
     * One row, as its source gives it.
     *
     * @param species     the element (no mass number: every isotope) or an isotope
     * @param lower       the lower state
     * @param upper       the upper state
     * @param kind        {@code element} or {@code lifetime}
     * @param valueText   the value as printed
     * @param value       the element in a0, or the lifetime in s
     * @param uncertainty its standard uncertainty in the same unit
     * @param provenance  published (read in the source) or from-memory
     * @param source      the publication
     * @param checked     how the value was checked
     * @param line        the row's 1-based line in the file
     */
    public record Row(Species species, State lower, State upper, String kind, String valueText, double value,
            double uncertainty, Provenance.Kind provenance, String source, String checked, int line) {

        /**
         * @param candidate an isotope
         * @return whether this row serves it
         */
        public boolean serves(Species candidate) {
            return AlkaliDipoles.serves(species, candidate);
        }
    }

    /**
     * @param row       a row's species: an element (no mass number) or an isotope
     * @param candidate an isotope
     * @return whether the row serves the isotope: an element's row serves each of its isotopes, an
     *         isotope's row that isotope only (common practice for these tables: isotope effects
     *         lie far below their uncertainties)
     */
    static boolean serves(Species row, Species candidate) {
        return row.z() == candidate.z() && row.charge() == candidate.charge()
                && (row.massNumber() == 0 || row.massNumber() == candidate.massNumber());
    }

    private final List<Row> rows;
    private final String name;

    private AlkaliDipoles(List<Row> rows, String name) {
        this.rows = rows;
        this.name = name;
    }

    /** @return the built-in table, read on first use (thread-safe) */
    public static AlkaliDipoles builtIn() {
        AlkaliDipoles data = builtIn;
        if (data == null) {
            synchronized (AlkaliDipoles.class) {
                data = builtIn;
                if (data == null) {
                    data = BuiltInCsv.resource(AlkaliDipoles.class, "rydberg/dipole-elements.csv", AlkaliDipoles::read);
                    builtIn = data;
                }
            }
        }
        return data;
    }

    /**
     * Reads a file of format {@value #FORMAT} 1 (a format line, {@code # key: value} header lines
     * with id, source and provenance, the column row, one row per pair of states; see the built-in
     * file).
     *
     * @param in   the bytes (UTF-8); closed here
     * @param name the file's name, for messages
     * @return the table
     * @throws ReferenceDataException naming file, line and problem
     */
    public static AlkaliDipoles read(InputStream in, String name) {
        List<Row> out = new ArrayList<>();
        for (BuiltInCsv.Row row : BuiltInCsv.read(in, name, FORMAT, COLUMNS, true, List.of("id", "source",
                "provenance")).rows()) {
            String[] f = row.f();
            try {
                Species species = Species.parse(f[0]);
                if (species.charge() != 0) {
                    throw new IllegalArgumentException("species must be a neutral atom, got '" + f[0] + "'");
                }
                State lower = State.parse(f[1]);
                State upper = State.parse(f[2]);
                String kind = f[3];
                double scale;
                if (kind.equals("element")) {
                    if (!f[6].equals("a0")) {
                        throw new IllegalArgumentException("unit of an element must be a0, got '" + f[6] + "'");
                    }
                    scale = 1;
                } else if (kind.equals("lifetime")) {
                    if (!f[6].equals("ns")) {
                        throw new IllegalArgumentException("unit of a lifetime must be ns, got '" + f[6] + "'");
                    }
                    scale = 1e-9;
                } else {
                    throw new IllegalArgumentException("kind must be 'element' or 'lifetime', got '" + kind + "'");
                }
                double value = positive("value", f[4]) * scale;
                double uncertainty = new BigDecimal(f[5]).doubleValue() * scale;
                if (!(uncertainty >= 0)) {
                    throw new IllegalArgumentException("uncertainty must not be negative, got '" + f[5] + "'");
                }
                // the record checks the pair (l changes by one, j by at most one)
                new PublishedDipole(lower, upper, 1, 0, f[8]);
                Row parsed = new Row(species, lower, upper, kind, f[4], value, uncertainty,
                        Provenance.Kind.fromId(f[7]), f[8], f[9], row.number());
                if (out.stream().anyMatch(x -> x.species().equals(species)
                        && (x.lower().equals(lower) && x.upper().equals(upper)
                                || x.lower().equals(upper) && x.upper().equals(lower)))) {
                    throw new IllegalArgumentException("second row for " + species.notation() + " " + f[1] + " - "
                            + f[2]);
                }
                out.add(parsed);
            } catch (RuntimeException e) {
                throw BuiltInCsv.bad(name, row.number(), e.getMessage(), row.raw());
            }
        }
        return new AlkaliDipoles(List.copyOf(out), name);
    }

    private static double positive(String field, String text) {
        double v = new BigDecimal(text).doubleValue();
        if (!(v > 0) || Double.isInfinite(v)) {
            throw new IllegalArgumentException(field + " must be finite and > 0, got '" + text + "'");
        }
        return v;
    }

    /** @return every row, in file order; immutable */
    public List<Row> rows() {
        return rows;
    }

    /**
     * @param species an isotope
     * @return the rows that serve it, in file order
     */
    public List<Row> rows(Species species) {
        Objects.requireNonNull(species, "species");
        return rows.stream().filter(r -> r.serves(species)).toList();
    }

    /**
     * The published elements of one isotope, lifetimes turned into elements with the atom's own
     * transition frequencies.
     *
     * @param atom    the isotope's atom (its levels give the frequencies of lifetime rows)
     * @param species the isotope
     * @return the elements, in file order
     * @throws ReferenceDataException when a row's upper level is not above its lower one in the atom
     */
    public List<PublishedDipole> elements(AlkaliAtom atom, Species species) {
        Objects.requireNonNull(atom, "atom");
        List<PublishedDipole> out = new ArrayList<>();
        for (Row r : rows(species)) {
            double value = r.value();
            double uncertainty = r.uncertainty();
            String how = r.source() + " (" + r.provenance().id() + ")";
            if (r.kind().equals("lifetime")) {
                double nu = atom.frequencyHz(r.lower(), r.upper());
                if (!(nu > 0)) {
                    throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, name + ":" + r.line()
                            + ": " + r.upper().label() + " is not above " + r.lower().label() + " in "
                            + species.notation());
                }
                value = AlkaliAtom.reducedDipoleFromLifetime(nu, r.value(), r.upper().twoJ());
                // d ~ tau^(-1/2): relative uncertainty halves
                uncertainty = value * r.uncertainty() / (2 * r.value());
                how = "deduced from the lifetime " + r.valueText() + " ns of " + r.upper().label() + ": " + how;
            }
            out.add(new PublishedDipole(r.lower(), r.upper(), value, uncertainty, how));
        }
        return List.copyOf(out);
    }
}
