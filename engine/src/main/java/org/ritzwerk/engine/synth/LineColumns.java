package org.ritzwerk.engine.synth;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.ritzwerk.atom.Species;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * A line list with relative intensities held as primitive columns, for lists too big for one
 * object per line (millions of lines read from a file): per line a species number (into a table
 * of the distinct species, in order of first appearance), a position and an intensity (NaN when
 * none is given): 18 bytes a line, no object per line. {@link Scene.Builder#lineColumns} renders it
 * exactly as {@link Scene.Builder#lineList(org.ritzwerk.data.LineList, java.util.function.Function)}
 * renders a {@link org.ritzwerk.data.LineList} with the same rows: the same lines, photon rates,
 * widths and labels, computed on demand instead of stored.
 *
 * <p>Immutable and thread-safe once built; the {@link Builder} is not thread-safe.
 */
public final class LineColumns {

    /** The most distinct species a list may hold (the species number is a {@code short}). */
    public static final int MAX_SPECIES = Short.MAX_VALUE;

    private final String id;
    private final Unit unit;
    private final Medium medium;
    private final List<Species> species;
    private final short[] speciesNumber;
    private final double[] position;
    private final double[] intensity;

    private LineColumns(Builder b) {
        this.id = b.id;
        this.unit = b.unit;
        this.medium = b.medium;
        this.species = List.copyOf(b.species);
        this.speciesNumber = Arrays.copyOf(b.speciesNumber, b.size);
        this.position = Arrays.copyOf(b.position, b.size);
        this.intensity = Arrays.copyOf(b.intensity, b.size);
    }

    /**
     * @param id     the list's id, for messages
     * @param unit   the unit of the positions: a wavelength, wavenumber, frequency or energy unit
     * @param medium the medium of wavelength positions (vacuum or air); null for the other kinds
     * @return an empty builder
     * @throws IllegalArgumentException for a temperature unit, or a medium missing for
     *         wavelengths or given for another kind
     */
    public static Builder builder(String id, Unit unit, Medium medium) {
        return new Builder(id, unit, medium);
    }

    /** @return the list's id */
    public String id() {
        return id;
    }

    /** @return the unit of the positions */
    public Unit unit() {
        return unit;
    }

    /** @return the medium of wavelength positions, null for other kinds */
    public Medium medium() {
        return medium;
    }

    /** @return the number of lines */
    public int size() {
        return position.length;
    }

    /** @return the distinct species of the lines, in order of first appearance */
    public List<Species> coveredSpecies() {
        return species;
    }

    /**
     * @param i the line, 0 to {@link #size()} - 1
     * @return its species
     */
    public Species species(int i) {
        return species.get(speciesNumber[i]);
    }

    /**
     * @param i the line, 0 to {@link #size()} - 1
     * @return its position in {@link #unit()}
     */
    public double position(int i) {
        return position[i];
    }

    /**
     * @param i the line, 0 to {@link #size()} - 1
     * @return its relative intensity, NaN when none is given
     */
    public double intensity(int i) {
        return intensity[i];
    }

    /** The species number of line i, an index into {@link #coveredSpecies()}. */
    int speciesNumber(int i) {
        return speciesNumber[i];
    }

    /** The positions, not copied; callers must not write to it. */
    double[] positions() {
        return position;
    }

    /** Collects lines into growable primitive columns; not thread-safe. */
    public static final class Builder {
        private final String id;
        private final Unit unit;
        private final Medium medium;
        private final List<Species> species = new ArrayList<>();
        private final Map<Species, Integer> numbers = new HashMap<>();
        private int size;
        private short[] speciesNumber = new short[1024];
        private double[] position = new double[1024];
        private double[] intensity = new double[1024];

        private Builder(String id, Unit unit, Medium medium) {
            this.id = Objects.requireNonNull(id, "id");
            this.unit = Objects.requireNonNull(unit, "unit");
            Kind kind = unit.kind();
            if (kind == Kind.TEMPERATURE) {
                throw new IllegalArgumentException("line positions cannot be in " + unit.symbol());
            }
            if (kind == Kind.WAVELENGTH && medium == null) {
                throw new IllegalArgumentException("wavelengths in " + unit.symbol() + " need a medium");
            }
            if (kind != Kind.WAVELENGTH && medium != null) {
                throw new IllegalArgumentException("positions in " + unit.symbol() + " take no medium");
            }
            this.medium = medium;
        }

        /**
         * @param s         the line's species
         * @param value     its position in the builder's unit, finite and positive
         * @param relative  its relative intensity, NaN for none; else finite and not negative
         * @return this builder
         * @throws IllegalArgumentException for a bad position or intensity, or a species beyond
         *         {@link #MAX_SPECIES}
         */
        public Builder add(Species s, double value, double relative) {
            Objects.requireNonNull(s, "species");
            if (!(value > 0) || Double.isInfinite(value)) {
                throw new IllegalArgumentException("position must be finite and positive " + unit.symbol() + ", got "
                        + value);
            }
            if (!Double.isNaN(relative) && (!(relative >= 0) || Double.isInfinite(relative))) {
                throw new IllegalArgumentException("intensity must be finite and not negative, got " + relative);
            }
            Integer number = numbers.get(s);
            if (number == null) {
                if (species.size() == MAX_SPECIES) {
                    throw new IllegalArgumentException("a line list holds at most " + MAX_SPECIES + " species");
                }
                number = species.size();
                species.add(s);
                numbers.put(s, number);
            }
            if (size == position.length) {
                int capacity = size + (size >> 1);
                speciesNumber = Arrays.copyOf(speciesNumber, capacity);
                position = Arrays.copyOf(position, capacity);
                intensity = Arrays.copyOf(intensity, capacity);
            }
            speciesNumber[size] = (short) (int) number;
            position[size] = value;
            intensity[size] = relative;
            size++;
            return this;
        }

        /** @return the number of lines added so far */
        public int size() {
            return size;
        }

        /** @return the immutable columns */
        public LineColumns build() {
            return new LineColumns(this);
        }
    }
}
