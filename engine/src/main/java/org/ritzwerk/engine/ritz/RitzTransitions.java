package org.ritzwerk.engine.ritz;

import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;
import org.ritzwerk.medium.Medium;

/**
 * The lines {@link RitzLines} computed from a set of levels, in columns (no object per line), by
 * rising wavenumber: the two levels (indices into {@link #levels()}), the Ritz wavenumber and its
 * standard uncertainty, vacuum and air wavelengths with theirs, Einstein A and f where known.
 *
 * <p>Wavelength uncertainties are first order: {@code u(lambda_vac) = u(sigma) / sigma^2}, and in
 * air {@code u(lambda_air) = (d lambda_air / d lambda_vac) u(lambda_vac)} with the air model's
 * slope ({@link Medium#slopeFromVacuum(double)}). Immutable and thread-safe.
 */
public final class RitzTransitions {

    private final RitzLevels levels;
    private final int[] upper;
    private final int[] lower;
    private final double[] wavenumber;
    private final double[] sigma;
    private final double[] einsteinA;
    private final double[] oscillatorStrength;
    private final List<RitzLines.LevelWithoutLines> withoutLines;

    private RitzTransitions(Builder b) {
        Integer[] order = new Integer[b.size];
        for (int i = 0; i < b.size; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (x, y) -> Double.compare(b.wavenumber[x], b.wavenumber[y]));
        levels = b.levels;
        withoutLines = b.withoutLines;
        upper = new int[b.size];
        lower = new int[b.size];
        wavenumber = new double[b.size];
        sigma = new double[b.size];
        einsteinA = new double[b.size];
        oscillatorStrength = new double[b.size];
        for (int k = 0; k < b.size; k++) {
            int i = order[k];
            upper[k] = b.upper[i];
            lower[k] = b.lower[i];
            wavenumber[k] = b.wavenumber[i];
            sigma[k] = b.sigma[i];
            einsteinA[k] = b.einsteinA[i];
            oscillatorStrength[k] = b.oscillatorStrength[i];
        }
    }

    /** @return the levels the lines come from */
    public RitzLevels levels() {
        return levels;
    }

    /**
     * @return the levels that give no line for want of a parity or a J (whatever the window), in
     *         the levels' order ({@link RitzLines#levelsWithoutLines})
     */
    public List<RitzLines.LevelWithoutLines> levelsWithoutLines() {
        return withoutLines;
    }

    /** @return the number of lines */
    public int size() {
        return wavenumber.length;
    }

    /**
     * @param i line index
     * @return the upper level's index in {@link #levels()}
     */
    public int upper(int i) {
        return upper[i];
    }

    /**
     * @param i line index
     * @return the lower level's index in {@link #levels()}
     */
    public int lower(int i) {
        return lower[i];
    }

    /**
     * @param i line index
     * @return the Ritz wavenumber {@code E_upper - E_lower}, cm^-1
     */
    public double wavenumberPerCm(int i) {
        return wavenumber[i];
    }

    /**
     * @param i line index
     * @return its standard uncertainty, cm^-1, where both levels' uncertainties are known
     */
    public OptionalDouble wavenumberUncertaintyPerCm(int i) {
        return Double.isNaN(sigma[i]) ? OptionalDouble.empty() : OptionalDouble.of(sigma[i]);
    }

    /**
     * @param i line index
     * @return the vacuum wavelength, nm ({@code 1e7 / sigma})
     */
    public double vacuumWavelengthNm(int i) {
        return 1e7 / wavenumber[i];
    }

    /**
     * @param i      line index
     * @param medium vacuum or air under a named model
     * @return the wavelength in that medium, nm
     * @throws org.ritzwerk.medium.MediumException outside the air model's range
     */
    public double wavelengthNm(int i, Medium medium) {
        return medium.fromVacuum(1e-9 * vacuumWavelengthNm(i)) * 1e9;
    }

    /**
     * @param i      line index
     * @param medium vacuum or air under a named model
     * @return the standard uncertainty of the wavelength in that medium, nm, where known
     * @throws org.ritzwerk.medium.MediumException outside the air model's range
     */
    public OptionalDouble wavelengthUncertaintyNm(int i, Medium medium) {
        if (Double.isNaN(sigma[i])) {
            return OptionalDouble.empty();
        }
        double vacuumNm = vacuumWavelengthNm(i);
        double u = sigma[i] / wavenumber[i] * vacuumNm;
        return OptionalDouble.of(u * medium.slopeFromVacuum(1e-9 * vacuumNm));
    }

    /**
     * @param i line index
     * @return Einstein A, s^-1, where the companion list gives it
     */
    public OptionalDouble einsteinA(int i) {
        return Double.isNaN(einsteinA[i]) ? OptionalDouble.empty() : OptionalDouble.of(einsteinA[i]);
    }

    /**
     * @param i line index
     * @return the absorption oscillator strength f, where A and both J are known
     */
    public OptionalDouble oscillatorStrength(int i) {
        return Double.isNaN(oscillatorStrength[i]) ? OptionalDouble.empty() : OptionalDouble.of(oscillatorStrength[i]);
    }

    @Override
    public String toString() {
        return "RitzTransitions[" + size() + " lines of " + levels.species().notation() + "]";
    }

    /** Collects lines for {@link RitzLines}. */
    static final class Builder {
        private final RitzLevels levels;
        private final List<RitzLines.LevelWithoutLines> withoutLines;
        private int size;
        private int[] upper = new int[16];
        private int[] lower = new int[16];
        private double[] wavenumber = new double[16];
        private double[] sigma = new double[16];
        private double[] einsteinA = new double[16];
        private double[] oscillatorStrength = new double[16];

        Builder(RitzLevels levels, List<RitzLines.LevelWithoutLines> withoutLines) {
            this.levels = levels;
            this.withoutLines = withoutLines;
        }

        void add(int u, int l, double perCm, double sigmaPerCm, double a, double f) {
            if (size == upper.length) {
                int c = 2 * size;
                upper = Arrays.copyOf(upper, c);
                lower = Arrays.copyOf(lower, c);
                wavenumber = Arrays.copyOf(wavenumber, c);
                sigma = Arrays.copyOf(sigma, c);
                einsteinA = Arrays.copyOf(einsteinA, c);
                oscillatorStrength = Arrays.copyOf(oscillatorStrength, c);
            }
            upper[size] = u;
            lower[size] = l;
            wavenumber[size] = perCm;
            sigma[size] = sigmaPerCm;
            einsteinA[size] = a;
            oscillatorStrength[size] = f;
            size++;
        }

        RitzTransitions build() {
            return new RitzTransitions(this);
        }
    }
}
