package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * The measured members of one Rydberg series: per member its principal quantum number n, its
 * energy above the ground level (cm^-1) and the energy's standard uncertainty, and where it was
 * read (for messages). Built with {@link #builder(String)}; immutable and thread-safe.
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
     * @return where the member was read, e.g. {@code series.csv:7}, or its n
     */
    public String where(int i) {
        return where[i];
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
         * @param principal  n, 1 to 10000, each once
         * @param perCm      the member's energy above the ground level, cm^-1, finite, positive
         * @param sigmaPerCm its standard uncertainty, cm^-1, finite, positive
         * @return this builder
         */
        public Builder add(int principal, double perCm, double sigmaPerCm) {
            return add(principal, perCm, sigmaPerCm, name + " n = " + principal);
        }

        /**
         * @param principal  n, 1 to 10000, each once
         * @param perCm      the member's energy above the ground level, cm^-1, finite, positive
         * @param sigmaPerCm its standard uncertainty, cm^-1, finite, positive
         * @param place      where it was read, for messages (e.g. {@code series.csv:7})
         * @return this builder
         * @throws RitzException naming the place and the bad value
         */
        public Builder add(int principal, double perCm, double sigmaPerCm, String place) {
            Objects.requireNonNull(place, "place");
            if (principal < 1 || principal > 10000) {
                throw new RitzException(RitzException.BAD_VALUE, place + ": n must be 1 to 10000, got " + principal);
            }
            if (n.contains(principal)) {
                throw new RitzException(RitzException.BAD_VALUE, place + ": n = " + principal + " is given twice in "
                        + "series '" + name + "'");
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
