package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * The measured members of one Rydberg series: per member its principal quantum number n, its
 * energy above the ground level (cm^-1) and the energy's standard uncertainty, and where it was
 * read (for messages). Built with {@link #builder(String)}; immutable and thread-safe.
 *
 * <p><b>Repeated measurements.</b> A member is one measurement, so one level (one n) may have
 * several: two runs, two papers, two lines reaching the same level. Each enters a fit as an
 * independent datum with its own weight and its own residual ({@link SeriesFitter}); what tells
 * the measurements of one n apart is their place ({@link #where(int)}: a file's line, or a label the
 * caller gives), so two measurements of one n from the same place are refused. Members are kept in
 * the order given.
 */
public final class RydbergSeries {

    private final String name;
    private final int[] n;
    private final double[] energy;
    private final double[] sigma;
    private final String[] where;

    private RydbergSeries(Builder b) {
        name = b.name;
        int m = b.n.size();
        n = new int[m];
        energy = new double[m];
        sigma = new double[m];
        where = b.where.toArray(new String[0]);
        for (int i = 0; i < m; i++) {
            n[i] = b.n.get(i);
            energy[i] = b.values.get(i)[0];
            sigma[i] = b.values.get(i)[1];
        }
    }

    /**
     * @param name the series' name, e.g. {@code 1sns 3S1}, not blank
     * @return a builder
     */
    public static Builder builder(String name) {
        return new Builder(name);
    }

    /** @return the series' name */
    public String name() {
        return name;
    }

    /** @return the number of members */
    public int size() {
        return n.length;
    }

    /**
     * @param i member index
     * @return its principal quantum number
     */
    public int n(int i) {
        return n[i];
    }

    /**
     * @param i member index
     * @return its energy above the ground level, cm^-1
     */
    public double energyPerCm(int i) {
        return energy[i];
    }

    /**
     * @param i member index
     * @return the energy's standard uncertainty, cm^-1
     */
    public double uncertaintyPerCm(int i) {
        return sigma[i];
    }

    /**
     * @param i member index
     * @return where the member was read, e.g. {@code series.csv:7}, or its label; by default the series'
     *         name and n, with the measurement's count for a repeated n ({@link Builder#add(int, double, double)})
     */
    public String where(int i) {
        return where[i];
    }

    /**
     * @return the distinct principal quantum numbers measured, ascending (a level measured several times
     *         once): what to ask {@link SeriesFit#predictions} for to get one fitted member per level
     */
    public int[] principalNumbers() {
        return java.util.Arrays.stream(n).distinct().sorted().toArray();
    }

    /**
     * @param principal a principal quantum number
     * @return how many members measure it (0 where none)
     */
    public int measurements(int principal) {
        int count = 0;
        for (int k : n) {
            count += k == principal ? 1 : 0;
        }
        return count;
    }

    /** Collects members; not thread-safe. */
    public static final class Builder {
        private final String name;
        private final List<Integer> n = new ArrayList<>();
        private final List<double[]> values = new ArrayList<>();
        private final List<String> where = new ArrayList<>();

        private Builder(String name) {
            if (name == null || name.isBlank()) {
                throw new RitzException(RitzException.BAD_VALUE, "a series needs a name");
            }
            this.name = name.strip();
        }

        /**
         * Adds one measurement, placed by the series' name and n ({@code 1sns 3S1 n = 10}), and for a
         * repeated n by its count as well ({@code 1sns 3S1 n = 10, measurement 2}).
         *
         * @param principal  n, 1 to 10000; a level measured several times is added once per measurement
         * @param perCm      the member's energy above the ground level, cm^-1, finite, positive
         * @param sigmaPerCm its standard uncertainty, cm^-1, finite, positive
         * @return this builder
         */
        public Builder add(int principal, double perCm, double sigmaPerCm) {
            int before = 0;
            for (int k : n) {
                before += k == principal ? 1 : 0;
            }
            return add(principal, perCm, sigmaPerCm, name + " n = " + principal
                    + (before == 0 ? "" : ", measurement " + (before + 1)));
        }

        /**
         * @param principal  n, 1 to 10000; a level measured several times is added once per measurement, each
         *                   from its own place
         * @param perCm      the member's energy above the ground level, cm^-1, finite, positive
         * @param sigmaPerCm its standard uncertainty, cm^-1, finite, positive
         * @param place      where it was read, for messages and to tell repeated measurements apart (e.g.
         *                   {@code series.csv:7}, or a label such as {@code run 2})
         * @return this builder
         * @throws RitzException naming the place and the bad value, or an n already given from the same place
         *                       (one measurement added twice)
         */
        public Builder add(int principal, double perCm, double sigmaPerCm, String place) {
            Objects.requireNonNull(place, "place");
            if (principal < 1 || principal > 10000) {
                throw new RitzException(RitzException.BAD_VALUE, place + ": n must be 1 to 10000, got " + principal);
            }
            for (int k = 0; k < n.size(); k++) {
                if (n.get(k) == principal && where.get(k).equals(place)) {
                    throw new RitzException(RitzException.BAD_VALUE, place + ": n = " + principal + " of series '"
                            + name + "' is given twice from this place; repeated measurements of one level each need "
                            + "a place of their own (a file line or a label) to be told apart");
                }
            }
            if (!(perCm > 0) || Double.isInfinite(perCm)) {
                throw new RitzException(RitzException.BAD_VALUE, place + ": energy must be finite and positive cm-1, "
                        + "got " + perCm);
            }
            if (!(sigmaPerCm > 0) || Double.isInfinite(sigmaPerCm)) {
                throw new RitzException(RitzException.BAD_VALUE, place + ": uncertainty must be finite and positive "
                        + "cm-1, got " + sigmaPerCm);
            }
            n.add(principal);
            values.add(new double[] {perCm, sigmaPerCm});
            where.add(place);
            return this;
        }

        /** @return the series */
        public RydbergSeries build() {
            return new RydbergSeries(this);
        }
    }
}
