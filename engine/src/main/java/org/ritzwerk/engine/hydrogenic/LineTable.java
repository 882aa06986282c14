package org.ritzwerk.engine.hydrogenic;

import java.util.Arrays;
import java.util.Optional;
import org.ritzwerk.constants.PhysicalConstants;

/**
 * Electric-dipole lines of one ion in columns, sorted by increasing frequency: the upper and
 * lower level (l and j are -1 for a multiplet, which blends a whole n -> n' transition), the
 * vacuum frequency (Hz), the line strength S (C^2 m^2), the Einstein A coefficient (s^-1) and the
 * absorption oscillator strength f, with the statistical weights they refer to. Lines are named
 * as {@link Notation} describes: hydrogen by its series ({@code "Balmer alpha"}), every other
 * one-electron ion by wavelength and shells ({@code "4686 (4-3)"}). Immutable and thread-safe.
 */
public final class LineTable {

    private final int[] upper;
    private final int[] lower;
    private final double[] frequency;
    private final double[] strength;
    private final double[] einsteinA;
    private final double[] oscillatorStrength;
    /** Nuclear charge of the ion, for the line names. */
    private final int z;

    /** Columns packed as levels (n, l, 2j) into one int array of 3 per line. */
    LineTable(int z, int[] upper, int[] lower, double[] frequency, double[] strength, double[] einsteinA,
            double[] oscillatorStrength) {
        this.z = z;
        this.upper = upper;
        this.lower = lower;
        this.frequency = frequency;
        this.strength = strength;
        this.einsteinA = einsteinA;
        this.oscillatorStrength = oscillatorStrength;
    }

    /** Sorts a filled builder's columns by frequency and freezes them, for an ion of nuclear charge z. */
    static LineTable sorted(Builder builder, int z) {
        int size = builder.size;
        Integer[] order = new Integer[size];
        for (int i = 0; i < size; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Double.compare(builder.frequency[a], builder.frequency[b]));
        int[] upper = new int[3 * size];
        int[] lower = new int[3 * size];
        double[] frequency = new double[size];
        double[] strength = new double[size];
        double[] a = new double[size];
        double[] f = new double[size];
        for (int k = 0; k < size; k++) {
            int i = order[k];
            System.arraycopy(builder.upper, 3 * i, upper, 3 * k, 3);
            System.arraycopy(builder.lower, 3 * i, lower, 3 * k, 3);
            frequency[k] = builder.frequency[i];
            strength[k] = builder.strength[i];
            a[k] = builder.einsteinA[i];
            f[k] = builder.oscillatorStrength[i];
        }
        return new LineTable(z, upper, lower, frequency, strength, a, f);
    }

    /** @return the number of lines */
    public int size() {
        return frequency.length;
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return upper principal quantum number
     */
    public int upperN(int i) {
        return upper[3 * i];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return upper orbital quantum number, -1 for a multiplet
     */
    public int upperL(int i) {
        return upper[3 * i + 1];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return twice the upper j, -1 for a multiplet
     */
    public int upperTwoJ(int i) {
        return upper[3 * i + 2];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return lower principal quantum number
     */
    public int lowerN(int i) {
        return lower[3 * i];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return lower orbital quantum number, -1 for a multiplet
     */
    public int lowerL(int i) {
        return lower[3 * i + 1];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return twice the lower j, -1 for a multiplet
     */
    public int lowerTwoJ(int i) {
        return lower[3 * i + 2];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the statistical weight of the upper level (2n^2 for a multiplet)
     */
    public int upperWeight(int i) {
        return weight(upper, i);
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the statistical weight of the lower level (2n^2 for a multiplet)
     */
    public int lowerWeight(int i) {
        return weight(lower, i);
    }

    private static int weight(int[] level, int i) {
        return level[3 * i + 2] >= 0 ? level[3 * i + 2] + 1 : 2 * level[3 * i] * level[3 * i];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the vacuum frequency in Hz
     */
    public double frequency(int i) {
        return frequency[i];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the line strength S in C^2 m^2
     */
    public double lineStrength(int i) {
        return strength[i];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the Einstein A coefficient in s^-1
     */
    public double einsteinA(int i) {
        return einsteinA[i];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the absorption oscillator strength (dimensionless)
     */
    public double oscillatorStrength(int i) {
        return oscillatorStrength[i];
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the upper level's label, e.g. {@code "3d 2D5/2"} or {@code "n=3"}
     */
    public String upperLabel(int i) {
        return Notation.level(upperN(i), upperL(i), upperTwoJ(i), -1);
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the lower level's label
     */
    public String lowerLabel(int i) {
        return Notation.level(lowerN(i), lowerL(i), lowerTwoJ(i), -1);
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the line's name after the spectrum symbol: {@code "Balmer alpha"} or
     *         {@code "109 alpha"} for hydrogen, {@code "4686 (4-3)"} for He II and other ions
     *         (see {@link Notation#line(int, int, int, double)})
     */
    public String lineName(int i) {
        return Notation.line(z, upperN(i), lowerN(i), PhysicalConstants.C / frequency[i]);
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the two shells, upper first, e.g. {@code "4-3"}
     */
    public String shells(int i) {
        return Notation.shells(upperN(i), lowerN(i));
    }

    /**
     * @param i the line's index, 0 to {@link #size()} - 1
     * @return the series name where spectroscopists have one ({@code "Balmer"}; He II
     *         {@code "Fowler"} or {@code "Pickering"}), otherwise empty
     */
    public Optional<String> series(int i) {
        return Notation.series(z, lowerN(i));
    }

    /** Growable columns, filled by the line generator. */
    static final class Builder {
        int size;
        int[] upper = new int[48];
        int[] lower = new int[48];
        double[] frequency = new double[16];
        double[] strength = new double[16];
        double[] einsteinA = new double[16];
        double[] oscillatorStrength = new double[16];

        void add(int nU, int lU, int twoJU, int nL, int lL, int twoJL, double hertz, double s, double a, double f) {
            if (size == frequency.length) {
                int capacity = 2 * size;
                upper = Arrays.copyOf(upper, 3 * capacity);
                lower = Arrays.copyOf(lower, 3 * capacity);
                frequency = Arrays.copyOf(frequency, capacity);
                strength = Arrays.copyOf(strength, capacity);
                einsteinA = Arrays.copyOf(einsteinA, capacity);
                oscillatorStrength = Arrays.copyOf(oscillatorStrength, capacity);
            }
            upper[3 * size] = nU;
            upper[3 * size + 1] = lU;
            upper[3 * size + 2] = twoJU;
            lower[3 * size] = nL;
            lower[3 * size + 1] = lL;
            lower[3 * size + 2] = twoJL;
            frequency[size] = hertz;
            strength[size] = s;
            einsteinA[size] = a;
            oscillatorStrength[size] = f;
            size++;
        }
    }
}
