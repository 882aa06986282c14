package org.ritzwerk.data;

import java.util.Arrays;
import java.util.Objects;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Species;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * A table of energy levels in columns: species, label (e.g. {@code 2p 2P3/2}), energy above the
 * species' ground state in the table's unit (a wavenumber or energy unit) with an optional
 * standard uncertainty, optional j and a note; and, where given, the correlation coefficients of
 * pairs of levels of one species ({@link #correlationCount()}): the covariance of the energies of
 * levels a and b is {@code r_ab u_a u_b} (common practice: the GUM, JCGM 100:2008, 5.2.2), and 0 for
 * a pair not given. Kept exactly as given. Immutable and thread-safe; equality is exact.
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
                && Arrays.equals(correlation, that.correlation);
    }

    @Override
    public int hashCode() {
        return Objects.hash(info, unit, Arrays.hashCode(energy), Arrays.hashCode(label));
    }

    @Override
    public String toString() {
        return "LevelList[" + info.id() + ", " + size() + " levels in " + unit.symbol() + "]";
    }

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
        private final java.util.Set<Long> pairs = new java.util.HashSet<>();

        private Builder(DataSetInfo info, Unit unit, String note) {
            this.info = Objects.requireNonNull(info, "info");
            this.unit = Objects.requireNonNull(unit, "unit");
            this.note = Objects.requireNonNull(note, "note");
            if (info.kind() != DataKind.LEVELS) {
                throw new IllegalArgumentException("a level list needs kind levels, got " + info.kind().id());
            }
            if (unit.kind() != Kind.WAVENUMBER && unit.kind() != Kind.ENERGY) {
                throw new IllegalArgumentException("level energies need a wavenumber or energy unit, got " + unit.symbol());
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
         * @return the immutable table
         * @throws IllegalArgumentException when a species with a correlation has a level without an
         *                                  uncertainty (naming it)
         */
        public LevelList build() {
            java.util.Set<Species> correlated = new java.util.HashSet<>();
            for (int k = 0; k < correlations; k++) {
                correlated.add(species[correlationRow[k]]);
            }
            for (int i = 0; i < size; i++) {
                if (Double.isNaN(uncertainty[i]) && correlated.contains(species[i])) {
                    throw new IllegalArgumentException("level '" + label[i] + "' of " + species[i].notation()
                            + " has no uncertainty, and levels of that species are correlated: a covariance needs "
                            + "every level's uncertainty");
                }
            }
            return new LevelList(this);
        }
    }
}
