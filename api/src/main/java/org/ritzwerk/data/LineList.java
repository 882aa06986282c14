package org.ritzwerk.data;

import java.util.Arrays;
import java.util.Objects;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Species;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Energy;
import org.ritzwerk.quantity.Frequency;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.SpectralQuantity;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;
import org.ritzwerk.quantity.Wavenumber;

/**
 * A list of spectral lines in columns: species, position (in the list's unit and, for
 * wavelengths, medium) with an optional standard uncertainty, optional relative intensity,
 * strength class and Einstein A coefficient (s^-1), optional level labels and a note. Values are kept exactly as given, in the
 * given order; typed accessors convert. Immutable and thread-safe; equality is exact.
 */
public final class LineList implements DataSet {

    private final DataSetInfo info;
    private final Unit unit;
    private final Medium medium;
    private final String note;
    private final Species[] species;
    private final double[] position;
    private final double[] uncertainty;
    private final double[] intensity;
    private final StrengthClass[] strength;
    private final double[] einsteinA;
    private final String[] lower;
    private final String[] upper;
    private final String[] rowNote;

    private LineList(LineList list, DataSetInfo info) {
        this.info = info;
        this.unit = list.unit;
        this.medium = list.medium;
        this.note = list.note;
        this.species = list.species;
        this.position = list.position;
        this.uncertainty = list.uncertainty;
        this.intensity = list.intensity;
        this.strength = list.strength;
        this.einsteinA = list.einsteinA;
        this.lower = list.lower;
        this.upper = list.upper;
        this.rowNote = list.rowNote;
    }

    private LineList(Builder b) {
        this.info = b.info;
        this.unit = b.unit;
        this.medium = b.medium;
        this.note = b.note;
        int n = b.size;
        this.species = Arrays.copyOf(b.species, n);
        this.position = Arrays.copyOf(b.position, n);
        this.uncertainty = Arrays.copyOf(b.uncertainty, n);
        this.intensity = Arrays.copyOf(b.intensity, n);
        this.strength = Arrays.copyOf(b.strength, n);
        this.einsteinA = Arrays.copyOf(b.einsteinA, n);
        this.lower = Arrays.copyOf(b.lower, n);
        this.upper = Arrays.copyOf(b.upper, n);
        this.rowNote = Arrays.copyOf(b.rowNote, n);
    }

    /**
     * @param info   what the list is (kind {@link DataKind#LINES} or {@link DataKind#LAMP_LINES})
     * @param unit   the unit of every position: a wavelength, wavenumber, frequency or energy unit
     * @param medium the medium of wavelength positions; must be null for the other kinds
     * @param note   a free note about the whole list, or empty
     * @return a builder for the rows
     */
    public static Builder builder(DataSetInfo info, Unit unit, Medium medium, String note) {
        return new Builder(info, unit, medium, note);
    }

    @Override
    public DataSetInfo info() {
        return info;
    }

    /**
     * @param newInfo what the list is (same kind)
     * @return the same rows under that info
     */
    public LineList withInfo(DataSetInfo newInfo) {
        if (newInfo.kind() != info.kind()) {
            throw new IllegalArgumentException("the kind cannot change: " + info.kind().id() + " to "
                    + newInfo.kind().id());
        }
        return new LineList(this, newInfo);
    }

    /** @return the distinct species of the rows, in order of first appearance */
    public java.util.List<Species> coveredSpecies() {
        return java.util.List.copyOf(new java.util.LinkedHashSet<>(java.util.Arrays.asList(species)));
    }

    @Override
    public int size() {
        return position.length;
    }

    /** @return the unit of the positions */
    public Unit unit() {
        return unit;
    }

    /** @return the medium of wavelength positions, or null when the positions are not wavelengths */
    public Medium medium() {
        return medium;
    }

    /** @return the list's note, possibly empty */
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
     * @return the position in {@link #unit()} as given
     */
    public double position(int i) {
        return position[i];
    }

    /**
     * @param i row
     * @return the position as a typed quantity (in its medium for wavelengths)
     */
    public SpectralQuantity positionQuantity(int i) {
        double u = uncertainty[i];
        boolean stated = !Double.isNaN(u);
        switch (unit.kind()) {
            case WAVELENGTH:
                return stated ? Wavelength.of(position[i], u, unit, medium) : Wavelength.of(position[i], unit, medium);
            case WAVENUMBER:
                return stated ? Wavenumber.of(position[i], u, unit) : Wavenumber.of(position[i], unit);
            case FREQUENCY:
                return stated ? Frequency.of(position[i], u, unit) : Frequency.of(position[i], unit);
            default:
                return stated ? Energy.of(position[i], u, unit) : Energy.of(position[i], unit);
        }
    }

    /**
     * @param i row
     * @return the standard uncertainty in {@link #unit()}, if stated
     */
    public OptionalDouble uncertainty(int i) {
        return optional(uncertainty[i]);
    }

    /**
     * @param i row
     * @return the relative intensity, if given
     */
    public OptionalDouble intensity(int i) {
        return optional(intensity[i]);
    }

    /**
     * @param i row
     * @return the strength class, or null
     */
    public StrengthClass strength(int i) {
        return strength[i];
    }

    /**
     * @param i row
     * @return the Einstein A coefficient in s^-1, if given
     */
    public OptionalDouble einsteinA(int i) {
        return optional(einsteinA[i]);
    }

    /**
     * @param i row
     * @return the lower level's label, or null
     */
    public String lower(int i) {
        return lower[i];
    }

    /**
     * @param i row
     * @return the upper level's label, or null
     */
    public String upper(int i) {
        return upper[i];
    }

    /**
     * @param i row
     * @return the row's note, or null
     */
    public String rowNote(int i) {
        return rowNote[i];
    }

    private static OptionalDouble optional(double value) {
        return Double.isNaN(value) ? OptionalDouble.empty() : OptionalDouble.of(value);
    }

    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (!(o instanceof LineList)) {
            return false;
        }
        LineList that = (LineList) o;
        return info.equals(that.info) && unit == that.unit && Objects.equals(medium, that.medium)
                && note.equals(that.note) && Arrays.equals(species, that.species)
                && Arrays.equals(position, that.position) && Arrays.equals(uncertainty, that.uncertainty)
                && Arrays.equals(intensity, that.intensity) && Arrays.equals(strength, that.strength)
                && Arrays.equals(einsteinA, that.einsteinA)
                && Arrays.equals(lower, that.lower) && Arrays.equals(upper, that.upper)
                && Arrays.equals(rowNote, that.rowNote);
    }

    @Override
    public int hashCode() {
        return Objects.hash(info, unit, medium, Arrays.hashCode(position), Arrays.hashCode(species));
    }

    @Override
    public String toString() {
        return "LineList[" + info.id() + ", " + size() + " lines in " + unit.symbol()
                + (medium == null ? "" : " " + medium.spec()) + "]";
    }

    /** Collects rows; not thread-safe. */
    public static final class Builder {
        private final DataSetInfo info;
        private final Unit unit;
        private final Medium medium;
        private final String note;
        private int size;
        private Species[] species = new Species[16];
        private double[] position = new double[16];
        private double[] uncertainty = new double[16];
        private double[] intensity = new double[16];
        private StrengthClass[] strength = new StrengthClass[16];
        private double[] einsteinA = new double[16];
        private String[] lower = new String[16];
        private String[] upper = new String[16];
        private String[] rowNote = new String[16];

        private Builder(DataSetInfo info, Unit unit, Medium medium, String note) {
            this.info = Objects.requireNonNull(info, "info");
            this.unit = Objects.requireNonNull(unit, "unit");
            this.note = Objects.requireNonNull(note, "note");
            if (info.kind() != DataKind.LINES && info.kind() != DataKind.LAMP_LINES) {
                throw new IllegalArgumentException("a line list needs kind lines or lamp-lines, got " + info.kind().id());
            }
            if (unit.kind() == Kind.TEMPERATURE) {
                throw new IllegalArgumentException("line positions cannot be temperatures (" + unit.symbol() + ")");
            }
            if ((unit.kind() == Kind.WAVELENGTH) != (medium != null)) {
                throw new IllegalArgumentException(unit.kind() == Kind.WAVELENGTH
                        ? "wavelength positions need a medium" : "only wavelength positions have a medium");
            }
            this.medium = medium;
        }

        /**
         * @param s           the species
         * @param value       position in the list's unit; finite, positive
         * @param u           standard uncertainty, or NaN when not stated; else finite, not negative
         * @param relative    relative intensity, or NaN; else finite, not negative
         * @param strengthClass strength class or null
         * @param rate        Einstein A in s^-1, or NaN; else finite, not negative
         * @param lowerLevel  lower level label or null
         * @param upperLevel  upper level label or null
         * @param text        note or null
         * @return this builder
         */
        public Builder add(Species s, double value, double u, double relative, StrengthClass strengthClass,
                double rate, String lowerLevel, String upperLevel, String text) {
            Objects.requireNonNull(s, "species");
            if (!(value > 0) || !Double.isFinite(value)) {
                throw new IllegalArgumentException("position must be finite and positive " + unit.symbol() + ", got "
                        + value);
            }
            checkOptional("uncertainty", u);
            checkOptional("intensity", relative);
            checkOptional("Einstein A", rate);
            if (size == position.length) {
                int capacity = 2 * size;
                species = Arrays.copyOf(species, capacity);
                position = Arrays.copyOf(position, capacity);
                uncertainty = Arrays.copyOf(uncertainty, capacity);
                intensity = Arrays.copyOf(intensity, capacity);
                strength = Arrays.copyOf(strength, capacity);
                einsteinA = Arrays.copyOf(einsteinA, capacity);
                lower = Arrays.copyOf(lower, capacity);
                upper = Arrays.copyOf(upper, capacity);
                rowNote = Arrays.copyOf(rowNote, capacity);
            }
            species[size] = s;
            position[size] = value;
            uncertainty[size] = u;
            intensity[size] = relative;
            strength[size] = strengthClass;
            einsteinA[size] = rate;
            lower[size] = lowerLevel;
            upper[size] = upperLevel;
            rowNote[size] = text;
            size++;
            return this;
        }

        private static void checkOptional(String what, double value) {
            if (!Double.isNaN(value) && (!(value >= 0) || Double.isInfinite(value))) {
                throw new IllegalArgumentException(what + " must be finite and not negative, got " + value);
            }
        }

        /** @return the immutable list */
        public LineList build() {
            return new LineList(this);
        }
    }
}
