package org.ritzwerk.refdata;

import java.io.InputStream;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.internal.BuiltInCsv;

/**
 * Measured radiative lifetimes of alkali levels whose computed lifetimes rest on computed dipole
 * elements, and the comparison that says where a computed lifetime misses its measurement by more
 * than its stated uncertainty ({@link #misses}). The built-in file is {@code rydberg/lifetime-checks.csv}
 * (format {@value #FORMAT} 1), each row with its source and provenance; built in only, like
 * {@link AlkaliDipoles}. Immutable and thread-safe.
 */
public final class LifetimeChecks {

    /** The format name. */
    public static final String FORMAT = "ritzwerk-lifetime-checks";
    /** The columns, in order. */
    public static final List<String> COLUMNS = List.of("species", "level", "lifetime", "uncertainty", "unit",
            "provenance", "source");
    /** A miss is a difference above this many combined standard uncertainties. */
    public static final double COVERAGE = 2;

    private static volatile LifetimeChecks builtIn;

    /**
     * One measured lifetime, as its source gives it.
     *
     * @param species     the element (no mass number: every isotope) or an isotope
     * @param state       the level
     * @param valueText   the lifetime as printed, ns
     * @param seconds     the lifetime, s
     * @param uncertainty its standard uncertainty, s; empty where it is not known here
     * @param provenance  published (read in the source) or from-memory
     * @param source      the measurement
     * @param line        the row's 1-based line in the file
     */
    public record Measured(Species species, State state, String valueText, double seconds,
            OptionalDouble uncertainty, Provenance.Kind provenance, String source, int line) {

        /**
         * @param candidate an isotope
         * @return whether this row serves it
         */
        public boolean serves(Species candidate) {
            return AlkaliDipoles.serves(species, candidate);
        }
    }

    /**
     * A computed lifetime that misses its measurement by more than {@value #COVERAGE} combined standard
     * uncertainties.
     *
     * @param state              the level
     * @param computedSeconds    the atom's radiative lifetime (0 K), s
     * @param uncertaintySeconds its stated standard uncertainty, s (0 where it has none)
     * @param measured           the measurement it misses
     */
    public record Miss(State state, double computedSeconds, double uncertaintySeconds, Measured measured) {

        /** @return (computed - measured) / measured: negative where the computed lifetime is short */
        public double relative() {
            return computedSeconds / measured.seconds() - 1;
        }
    }

    private final List<Measured> rows;

    private LifetimeChecks(List<Measured> rows) {
        this.rows = rows;
    }

    /** @return the built-in table, read on first use (thread-safe) */
    public static LifetimeChecks builtIn() {
        LifetimeChecks data = builtIn;
        if (data == null) {
            synchronized (LifetimeChecks.class) {
                data = builtIn;
                if (data == null) {
                    data = BuiltInCsv.resource(LifetimeChecks.class, "rydberg/lifetime-checks.csv",
                            LifetimeChecks::read);
                    builtIn = data;
                }
            }
        }
        return data;
    }

    /**
     * Reads a file of format {@value #FORMAT} 1 (a format line, {@code # key: value} header lines
     * with id, source and provenance, the column row, one row per level; see the built-in file).
     *
     * @param in   the bytes (UTF-8); closed here
     * @param name the file's name, for messages
     * @return the table
     * @throws ReferenceDataException naming file, line and problem
     */
    public static LifetimeChecks read(InputStream in, String name) {
        List<Measured> out = new ArrayList<>();
        for (BuiltInCsv.Row row : BuiltInCsv.read(in, name, FORMAT, COLUMNS, true, List.of("id", "source",
                "provenance")).rows()) {
            String[] f = row.f();
            try {
                Species species = Species.parse(f[0]);
                if (species.charge() != 0) {
                    throw new IllegalArgumentException("species must be a neutral atom, got '" + f[0] + "'");
                }
                State state = State.parse(f[1]);
                if (!f[4].equals("ns")) {
                    throw new IllegalArgumentException("unit must be ns, got '" + f[4] + "'");
                }
                double value = new BigDecimal(f[2]).doubleValue();
                if (!(value > 0) || Double.isInfinite(value)) {
                    throw new IllegalArgumentException("lifetime must be finite and > 0, got '" + f[2] + "'");
                }
                OptionalDouble uncertainty = OptionalDouble.empty();
                if (!f[3].isEmpty()) {
                    double u = new BigDecimal(f[3]).doubleValue();
                    if (!(u >= 0) || Double.isInfinite(u)) {
                        throw new IllegalArgumentException("uncertainty must be finite and not negative, got '" + f[3]
                                + "'");
                    }
                    uncertainty = OptionalDouble.of(u * 1e-9);
                }
                if (out.stream().anyMatch(x -> x.species().equals(species) && x.state().equals(state))) {
                    throw new IllegalArgumentException("second row for " + species.notation() + " " + f[1]);
                }
                out.add(new Measured(species, state, f[2], value * 1e-9, uncertainty, Provenance.Kind.fromId(f[5]),
                        f[6], row.number()));
            } catch (RuntimeException e) {
                throw BuiltInCsv.bad(name, row.number(), e.getMessage(), row.raw());
            }
        }
        return new LifetimeChecks(List.copyOf(out));
    }

    /** @return every row, in file order; immutable */
    public List<Measured> rows() {
        return rows;
    }

    /**
     * @param species an isotope
     * @param state   a level
     * @return the measurement that serves this level of the isotope, if listed
     */
    public Optional<Measured> measured(Species species, State state) {
        Objects.requireNonNull(species, "species");
        Objects.requireNonNull(state, "state");
        return rows.stream().filter(r -> r.serves(species) && r.state().equals(state)).findFirst();
    }

    /**
     * Compares a computed radiative lifetime (0 K) with its measurement: a miss where they differ by more than
     * {@value #COVERAGE} times the combined standard uncertainty, sqrt(u_computed^2 + u_measured^2) (an
     * uncertainty not known counts as 0).
     *
     * @param atom    the isotope's atom
     * @param species the isotope
     * @param state   a level of it
     * @return the miss, or empty when the level has no listed measurement or its lifetime meets it
     */
    public Optional<Miss> miss(AlkaliAtom atom, Species species, State state) {
        Objects.requireNonNull(atom, "atom");
        Optional<Measured> m = measured(species, state);
        if (m.isEmpty()) {
            return Optional.empty();
        }
        double tau = atom.radiativeLifetime(state);
        double u = atom.radiativeLifetimeUncertainty(state).orElse(0);
        double combined = Math.hypot(u, m.get().uncertainty().orElse(0));
        return Math.abs(tau - m.get().seconds()) > COVERAGE * combined
                ? Optional.of(new Miss(state, tau, u, m.get())) : Optional.empty();
    }

    /**
     * @param atom    the isotope's atom
     * @param species the isotope
     * @return every listed level of the isotope whose computed lifetime misses its measurement, in file order
     */
    public List<Miss> misses(AlkaliAtom atom, Species species) {
        List<Miss> out = new ArrayList<>();
        for (Measured m : rows) {
            if (m.serves(species)) {
                miss(atom, species, m.state()).ifPresent(out::add);
            }
        }
        return List.copyOf(out);
    }
}
