package org.ritzwerk.data;

import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.Set;
import org.ritzwerk.atom.Species;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * A table of energy levels in columns: species, label (e.g. {@code 2p 2P3/2}), energy above the
 * species' ground state in the table's unit (a wavenumber or energy unit) with an optional
 * standard uncertainty, optional j and a note; and, where given, how the energies of levels of one
 * species are correlated, in either or both of two forms:
 * <ul>
 * <li>correlation coefficients of pairs of levels ({@link #correlationCount()}): pair a, b gets
 * {@code r_ab u_a u_b};</li>
 * <li>shared uncertainty components ({@link #shareCount()}): level i's energy depends on a named
 * common error source c (a series limit, a calibration) with the signed standard-uncertainty
 * contribution {@code v_ic} in the table's unit, so pair a, b gets {@code sum_c v_ac v_bc} over the
 * components both have; each level's own, independent part is {@code u_i^2 - sum_c v_ic^2}, not
 * negative.</li>
 * </ul>
 * The covariance of the energies of two levels a and b of one species is the sum of the two, where
 * no pair gets both (a pair with a correlation shares no component): {@code V_ab = r_ab u_a u_b +
 * sum_c v_ac v_bc}, with {@code V_aa = u_a^2} (common practice: the GUM, JCGM 100:2008, 5.2.2 for r,
 * and 5.2 and F.1.2.3 for inputs common to two results); a pair with neither is uncorrelated, and
 * levels of two species are. Kept exactly as given. Immutable and thread-safe; equality is exact.
 */
public final class LevelList implements DataSet {

    private final DataSetInfo info;
    private final Unit unit;
    private final String note;
    private final Species[] species;
    private final String[] label;
    private final double[] energy;
    private final double[] uncertainty;
    private final int[] twoJ;
    private final String[] rowNote;
    /** Correlations: the two rows of each pair and its coefficient, in the order given. */
    private final int[] correlationRow;
    private final int[] correlationOther;
    private final double[] correlation;
    /** Shared uncertainty components: the row, the component's name and the contribution, in the order given. */
    private final int[] shareRow;
    private final String[] shareComponent;
    private final double[] share;
    /** The distinct component names, in the order first given. */
    private final List<String> components;

    private LevelList(LevelList table, DataSetInfo info) {
        this.info = info;
        this.unit = table.unit;
        this.note = table.note;
        this.species = table.species;
        this.label = table.label;
        this.energy = table.energy;
        this.uncertainty = table.uncertainty;
        this.twoJ = table.twoJ;
        this.rowNote = table.rowNote;
        this.correlationRow = table.correlationRow;
        this.correlationOther = table.correlationOther;
        this.correlation = table.correlation;
        this.shareRow = table.shareRow;
        this.shareComponent = table.shareComponent;
        this.share = table.share;
        this.components = table.components;
    }

    private LevelList(Builder b) {
        this.info = b.info;
        this.unit = b.unit;
        this.note = b.note;
        this.species = Arrays.copyOf(b.species, b.size);
        this.label = Arrays.copyOf(b.label, b.size);
        this.energy = Arrays.copyOf(b.energy, b.size);
        this.uncertainty = Arrays.copyOf(b.uncertainty, b.size);
        this.twoJ = Arrays.copyOf(b.twoJ, b.size);
        this.rowNote = Arrays.copyOf(b.rowNote, b.size);
        this.correlationRow = Arrays.copyOf(b.correlationRow, b.correlations);
        this.correlationOther = Arrays.copyOf(b.correlationOther, b.correlations);
        this.correlation = Arrays.copyOf(b.correlation, b.correlations);
        this.shareRow = Arrays.copyOf(b.shareRow, b.shares);
        this.shareComponent = Arrays.copyOf(b.shareComponent, b.shares);
        this.share = Arrays.copyOf(b.share, b.shares);
        this.components = List.copyOf(new LinkedHashSet<>(Arrays.asList(shareComponent)));
    }

    /**
     * @param info what the table is (kind {@link DataKind#LEVELS})
     * @param unit a wavenumber or energy unit
     * @param note a note about the whole table, or empty
     * @return a builder for the rows
     */
    public static Builder builder(DataSetInfo info, Unit unit, String note) {
        return new Builder(info, unit, note);
    }

    @Override
    public DataSetInfo info() {
        return info;
    }

    /**
     * @param newInfo what the table is (kind levels)
     * @return the same rows under that info
     */
    public LevelList withInfo(DataSetInfo newInfo) {
        if (newInfo.kind() != DataKind.LEVELS) {
            throw new IllegalArgumentException("a level list needs kind levels, got " + newInfo.kind().id());
        }
        return new LevelList(this, newInfo);
    }

    @Override
    public int size() {
        return energy.length;
    }

    /** @return the unit of the energies */
    public Unit unit() {
        return unit;
    }

    /** @return the table's note, possibly empty */
    public String note() {
        return note;
    }

    /**
     * @param i row
     * @return the species
     */
    public Species species(int i) {
        return species[i];
    }

    /**
     * @param i row
     * @return the level label
     */
    public String label(int i) {
        return label[i];
    }

    /**
     * @param i row
     * @return the energy above the ground state, in {@link #unit()}
     */
    public double energy(int i) {
        return energy[i];
    }

    /**
     * @param i row
     * @return the standard uncertainty in {@link #unit()}, if stated
     */
    public OptionalDouble uncertainty(int i) {
        return Double.isNaN(uncertainty[i]) ? OptionalDouble.empty() : OptionalDouble.of(uncertainty[i]);
    }

    /**
     * @param i row
     * @return twice j, or -1 when not given
     */
    public int twoJ(int i) {
        return twoJ[i];
    }

    /**
     * @param i row
     * @return the row's note, or null
     */
    public String rowNote(int i) {
        return rowNote[i];
    }

    /** @return the number of correlated pairs of levels given */
    public int correlationCount() {
        return correlation.length;
    }

    /**
     * @param k a correlation, 0 to {@link #correlationCount()} - 1
     * @return the row of its first level
     */
    public int correlationRow(int k) {
        return correlationRow[k];
    }

    /**
     * @param k a correlation
     * @return the row of its second level (another level of the same species)
     */
    public int correlationOtherRow(int k) {
        return correlationOther[k];
    }

    /**
     * @param k a correlation
     * @return the correlation coefficient of the two levels' energies, -1 to 1
     */
    public double correlation(int k) {
        return correlation[k];
    }

    /** @return the number of shared-uncertainty contributions given (rows of level, component and value) */
    public int shareCount() {
        return share.length;
    }

    /**
     * @param k a contribution, 0 to {@link #shareCount()} - 1
     * @return the row of its level
     */
    public int shareRow(int k) {
        return shareRow[k];
    }

    /**
     * @param k a contribution
     * @return the name of the common error source it comes from
     */
    public String shareComponent(int k) {
        return shareComponent[k];
    }

    /**
     * @param k a contribution
     * @return the signed standard-uncertainty contribution of that component to the level's energy, in
     *         {@link #unit()}: its magnitude at most the level's uncertainty
     */
    public double share(int k) {
        return share[k];
    }

    /** @return the distinct names of the shared uncertainty components, in the order first given */
    public List<String> uncertaintyComponents() {
        return components;
    }

    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (!(o instanceof LevelList)) {
            return false;
        }
        LevelList that = (LevelList) o;
        return info.equals(that.info) && unit == that.unit && note.equals(that.note)
                && Arrays.equals(species, that.species) && Arrays.equals(label, that.label)
                && Arrays.equals(energy, that.energy) && Arrays.equals(uncertainty, that.uncertainty)
                && Arrays.equals(twoJ, that.twoJ) && Arrays.equals(rowNote, that.rowNote)
                && Arrays.equals(correlationRow, that.correlationRow)
                && Arrays.equals(correlationOther, that.correlationOther)
                && Arrays.equals(correlation, that.correlation)
                && Arrays.equals(shareRow, that.shareRow) && Arrays.equals(shareComponent, that.shareComponent)
                && Arrays.equals(share, that.share);
    }

    @Override
    public int hashCode() {
        return Objects.hash(info, unit, Arrays.hashCode(energy), Arrays.hashCode(label));
    }

    @Override
    public String toString() {
        return "LevelList[" + info.id() + ", " + size() + " levels in " + unit.symbol() + "]";
    }

    /**
     * How far a level's shared contributions squared may add up beyond its uncertainty squared, relative
     * to it (1e-12): the rounding of decimal values, e.g. u = 0.005 made of 0.003 and 0.004 exactly. The
     * level's independent part is then taken as 0.
     */
    public static final double SHARE_ROUNDING = 1e-12;

    /** Collects rows; not thread-safe. */
    public static final class Builder {
        private final DataSetInfo info;
        private final Unit unit;
        private final String note;
        private int size;
        private Species[] species = new Species[16];
        private String[] label = new String[16];
        private double[] energy = new double[16];
        private double[] uncertainty = new double[16];
        private int[] twoJ = new int[16];
        private String[] rowNote = new String[16];
        private int correlations;
        private int[] correlationRow = new int[16];
        private int[] correlationOther = new int[16];
        private double[] correlation = new double[16];
        /** The pairs given, each as (smaller row, larger row). */
        private final Set<Long> pairs = new HashSet<>();
        private int shares;
        private int[] shareRow = new int[16];
        private String[] shareComponent = new String[16];
        private double[] share = new double[16];
        /** Each component's species (a component is shared by levels of one species). */
        private final Map<String, Species> componentSpecies = new HashMap<>();
        /** Each row's components (row, then name) and the sum of its contributions squared. */
        private final Map<Integer, Set<String>> rowComponents = new HashMap<>();
        private final Map<Integer, Double> rowShareSquares = new HashMap<>();

        private Builder(DataSetInfo info, Unit unit, String note) {
            this.info = Objects.requireNonNull(info, "info");
            this.unit = Objects.requireNonNull(unit, "unit");
            this.note = Objects.requireNonNull(note, "note");
            if (info.kind() != DataKind.LEVELS) {
                throw new IllegalArgumentException("a level list needs kind levels, got " + info.kind().id());
            }
            if (unit.kind() != Kind.WAVENUMBER && unit.kind() != Kind.ENERGY) {
                throw new IllegalArgumentException("level energies need a wavenumber or energy unit, got "
                        + unit.symbol());
            }
        }

        /**
         * @param s        species
         * @param name     level label, not blank
         * @param value    energy above the ground state; finite, not negative
         * @param u        standard uncertainty or NaN; else finite, not negative
         * @param twiceJ   twice j, or -1 when not given
         * @param text     note or null
         * @return this builder
         */
        public Builder add(Species s, String name, double value, double u, int twiceJ, String text) {
            Objects.requireNonNull(s, "species");
            if (name == null || name.isBlank()) {
                throw new IllegalArgumentException("level label must not be blank");
            }
            if (!(value >= 0) || Double.isInfinite(value)) {
                throw new IllegalArgumentException("energy must be finite and not negative, got " + value);
            }
            if (!Double.isNaN(u) && (!(u >= 0) || Double.isInfinite(u))) {
                throw new IllegalArgumentException("uncertainty must be finite and not negative, got " + u);
            }
            if (twiceJ < -1) {
                throw new IllegalArgumentException("twice j must be >= 0 (or -1 for none), got " + twiceJ);
            }
            if (size == energy.length) {
                int capacity = 2 * size;
                species = Arrays.copyOf(species, capacity);
                label = Arrays.copyOf(label, capacity);
                energy = Arrays.copyOf(energy, capacity);
                uncertainty = Arrays.copyOf(uncertainty, capacity);
                twoJ = Arrays.copyOf(twoJ, capacity);
                rowNote = Arrays.copyOf(rowNote, capacity);
            }
            species[size] = s;
            label[size] = name;
            energy[size] = value;
            uncertainty[size] = u;
            twoJ[size] = twiceJ;
            rowNote[size] = text;
            size++;
            return this;
        }

        /**
         * Correlates the energies of two levels already added: their covariance becomes
         * {@code r u_row u_other}. A species with a correlation must give every one of its levels an
         * uncertainty (checked by {@link #build()}).
         *
         * @param row      a level's row (0-based, in the order added)
         * @param otherRow another level's row, of the same species
         * @param r        the correlation coefficient, -1 to 1
         * @return this builder
         * @throws IllegalArgumentException when a row is unknown, the two are one level or of two species,
         *                                  r is outside [-1, 1] or NaN, a level has no uncertainty or an
         *                                  uncertainty of 0 (an exact level correlates with nothing), or the
         *                                  pair was correlated before (in either order)
         */
        public Builder correlate(int row, int otherRow, double r) {
            if (row < 0 || row >= size || otherRow < 0 || otherRow >= size) {
                throw new IllegalArgumentException("correlation of rows " + row + " and " + otherRow
                        + ": the table has " + size + " rows");
            }
            String pair = "correlation of '" + label[row] + "' and '" + label[otherRow] + "'";
            if (row == otherRow) {
                throw new IllegalArgumentException(pair + ": a level's variance is its uncertainty squared, not a "
                        + "correlation");
            }
            if (!species[row].equals(species[otherRow])) {
                throw new IllegalArgumentException(pair + ": the levels are of two species, "
                        + species[row].notation() + " and " + species[otherRow].notation());
            }
            if (!(r >= -1 && r <= 1)) {
                throw new IllegalArgumentException(pair + " must be from -1 to 1, got " + r);
            }
            for (int i : new int[] {row, otherRow}) {
                if (!(uncertainty[i] > 0)) {
                    throw new IllegalArgumentException(pair + ": level '" + label[i] + "' has "
                            + (Double.isNaN(uncertainty[i]) ? "no uncertainty" : "uncertainty 0 (exact)")
                            + ", so it correlates with no level");
                }
            }
            if (!pairs.add(((long) Math.min(row, otherRow) << 32) | Math.max(row, otherRow))) {
                throw new IllegalArgumentException(pair + " is given twice");
            }
            if (correlations == correlation.length) {
                int capacity = 2 * correlations;
                correlationRow = Arrays.copyOf(correlationRow, capacity);
                correlationOther = Arrays.copyOf(correlationOther, capacity);
                correlation = Arrays.copyOf(correlation, capacity);
            }
            correlationRow[correlations] = row;
            correlationOther[correlations] = otherRow;
            correlation[correlations] = r;
            correlations++;
            return this;
        }

        /**
         * Gives a level added before a contribution from a shared uncertainty component: the covariance
         * of two levels with the same component gets the product of their contributions, and the level's
         * independent part is what is left of its variance, {@code u^2 - sum_c v_c^2}. A species with a
         * component must give every one of its levels an uncertainty (checked by {@link #build()}).
         *
         * @param row       a level's row (0-based, in the order added)
         * @param component the name of the common error source, not blank; one species' levels only
         * @param value     the signed standard-uncertainty contribution, in the table's unit; finite
         * @return this builder
         * @throws IllegalArgumentException when the row is unknown, the name is blank, the value is not
         *                                  finite, the level has no uncertainty or 0 (exact: it shares
         *                                  nothing), it has that component already, the component belongs
         *                                  to levels of another species, or the level's contributions
         *                                  squared add up to more than its uncertainty squared (beyond a
         *                                  rounding allowance of {@link #SHARE_ROUNDING} times u^2)
         */
        public Builder share(int row, String component, double value) {
            if (row < 0 || row >= size) {
                throw new IllegalArgumentException("shared uncertainty of row " + row + ": the table has " + size
                        + " rows");
            }
            if (component == null || component.isBlank()) {
                throw new IllegalArgumentException("shared uncertainty of '" + label[row]
                        + "': the component's name must not be blank");
            }
            String what = "shared uncertainty '" + component + "' of '" + label[row] + "'";
            if (!Double.isFinite(value)) {
                throw new IllegalArgumentException(what + " must be finite, got " + value);
            }
            if (!(uncertainty[row] > 0)) {
                throw new IllegalArgumentException(what + ": the level has "
                        + (Double.isNaN(uncertainty[row]) ? "no uncertainty" : "uncertainty 0 (exact)")
                        + ", so it shares no uncertainty component");
            }
            Species owner = componentSpecies.putIfAbsent(component, species[row]);
            if (owner != null && !owner.equals(species[row])) {
                throw new IllegalArgumentException(what + ": the component is shared by levels of "
                        + owner.notation() + " already, and levels of two species have no covariance here");
            }
            if (!rowComponents.computeIfAbsent(row, r -> new HashSet<>()).add(component)) {
                throw new IllegalArgumentException(what + " is given twice");
            }
            double squares = rowShareSquares.getOrDefault(row, 0.0) + value * value;
            double variance = uncertainty[row] * uncertainty[row];
            if (squares > variance * (1 + SHARE_ROUNDING)) {
                throw new IllegalArgumentException(what + ": the level's contributions squared add up to "
                        + squares + ", more than its uncertainty squared, " + variance);
            }
            rowShareSquares.put(row, squares);
            if (shares == share.length) {
                int capacity = 2 * shares;
                shareRow = Arrays.copyOf(shareRow, capacity);
                shareComponent = Arrays.copyOf(shareComponent, capacity);
                share = Arrays.copyOf(share, capacity);
            }
            shareRow[shares] = row;
            shareComponent[shares] = component;
            share[shares] = value;
            shares++;
            return this;
        }

        /**
         * @return the immutable table
         * @throws IllegalArgumentException when a species with a correlation or a shared component has a
         *                                  level without an uncertainty, or a correlated pair shares a
         *                                  component (its covariance would be given twice), naming them
         */
        public LevelList build() {
            Set<Species> correlated = new HashSet<>();
            for (int k = 0; k < correlations; k++) {
                correlated.add(species[correlationRow[k]]);
                Set<String> a = rowComponents.getOrDefault(correlationRow[k], Set.of());
                for (String c : rowComponents.getOrDefault(correlationOther[k], Set.of())) {
                    if (a.contains(c)) {
                        throw new IllegalArgumentException("levels '" + label[correlationRow[k]] + "' and '"
                                + label[correlationOther[k]] + "' share the uncertainty component '" + c
                                + "' and have a correlation: their covariance would be given twice");
                    }
                }
            }
            for (int k = 0; k < shares; k++) {
                correlated.add(species[shareRow[k]]);
            }
            for (int i = 0; i < size; i++) {
                if (Double.isNaN(uncertainty[i]) && correlated.contains(species[i])) {
                    throw new IllegalArgumentException("level '" + label[i] + "' of " + species[i].notation()
                            + " has no uncertainty, and levels of that species are correlated (or share "
                            + "uncertainty components): a covariance needs every level's uncertainty");
                }
            }
            return new LevelList(this);
        }
    }
}
