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
 * standard uncertainty, optional j and a note. Kept exactly as given. Immutable and thread-safe;
 * equality is exact.
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
                && Arrays.equals(twoJ, that.twoJ) && Arrays.equals(rowNote, that.rowNote);
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

        /** @return the immutable table */
        public LevelList build() {
            return new LevelList(this);
        }
    }
}
