package org.ritzwerk.engine.levels;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.ritzwerk.atom.Species;

/**
 * Levels as columns (one array per column, no object per level): species, label, quantum numbers
 * where the source gives them, statistical weight, energy in cm^-1, the model the energy comes
 * from, and, when asked, the radiative and black-body lifetimes. Rows keep the order of the
 * {@link LevelQuery} that made them. A set also names the levels its sources could not give
 * ({@link #omissions()}). Immutable and thread-safe.
 */
public final class LevelSet {

    /** Marks an integer column without a value in a row. */
    private static final int NONE = Integer.MIN_VALUE;

    /**
     * Levels of a species that exist but are not in the set, and why.
     *
     * @param species the species
     * @param count   how many
     * @param first   the lowest of them, e.g. {@code 2d3/2}
     * @param reason  why they are not given
     */
    public record Omission(Species species, int count, String first, String reason) {

        /**
         * @param species the species
         * @param count   how many, at least 1
         * @param first   the lowest of them
         * @param reason  why they are not given
         * @throws IllegalArgumentException when count is below 1
         */
        public Omission {
            Objects.requireNonNull(species, "species");
            Objects.requireNonNull(first, "first");
            Objects.requireNonNull(reason, "reason");
            if (count < 1) {
                throw new IllegalArgumentException("an omission counts at least one level, got " + count);
            }
        }
    }

    private final Species[] species;
    private final String[] label;
    private final int[] n;
    private final int[] l;
    private final int[] twoJ;
    private final int[] twoF;
    private final int[] weight;
    private final double[] energy;
    private final double[] energySigma;
    private final String[] model;
    private final double[] lifetime;
    private final double[] lifetimeSigma;
    private final double[] effective;
    private final double[] effectiveSigma;
    private final List<Omission> omissions;

    private LevelSet(Builder b) {
        int size = b.size;
        species = Arrays.copyOf(b.species, size);
        label = Arrays.copyOf(b.label, size);
        n = Arrays.copyOf(b.n, size);
        l = Arrays.copyOf(b.l, size);
        twoJ = Arrays.copyOf(b.twoJ, size);
        twoF = Arrays.copyOf(b.twoF, size);
        weight = Arrays.copyOf(b.weight, size);
        energy = Arrays.copyOf(b.energy, size);
        energySigma = Arrays.copyOf(b.energySigma, size);
        model = Arrays.copyOf(b.model, size);
        lifetime = Arrays.copyOf(b.lifetime, size);
        lifetimeSigma = Arrays.copyOf(b.lifetimeSigma, size);
        effective = Arrays.copyOf(b.effective, size);
        effectiveSigma = Arrays.copyOf(b.effectiveSigma, size);
        omissions = List.copyOf(b.omissions);
    }

    /** @return an empty set */
    public static LevelSet empty() {
        return new Builder().build();
    }

    /**
     * @param parts sets, e.g. the chunks a streaming {@link LevelQuery#run(LevelSources,
     *              LevelQuery.Progress, java.util.function.Consumer)} delivered
     * @return their rows and omissions, in order
     */
    public static LevelSet concat(List<LevelSet> parts) {
        Builder b = new Builder();
        for (LevelSet part : parts) {
            for (int i = 0; i < part.size(); i++) {
                b.add(part.species[i], part.label[i], part.n[i], part.l[i], part.twoJ[i], part.twoF[i],
                        part.weight[i], part.energy[i], part.energySigma[i], part.model[i], part.lifetime[i],
                        part.lifetimeSigma[i], part.effective[i], part.effectiveSigma[i]);
            }
            part.omissions.forEach(b::omit);
        }
        return b.build();
    }

    /** @return the number of levels */
    public int size() {
        return label.length;
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the species of level i
     */
    public Species species(int i) {
        return species[i];
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the label of level i, e.g. {@code 2p3/2}, {@code 5p 2P3/2} or a level list's own
     */
    public String label(int i) {
        return label[i];
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the principal quantum number, when the source gives one
     */
    public OptionalInt n(int i) {
        return optional(n[i]);
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the orbital quantum number, when the source gives one
     */
    public OptionalInt l(int i) {
        return optional(l[i]);
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return 2 J, when the source gives J
     */
    public OptionalInt twoJ(int i) {
        return optional(twoJ[i]);
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return 2 F for a hyperfine level, else empty
     */
    public OptionalInt twoF(int i) {
        return optional(twoF[i]);
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the statistical weight (2J + 1, or 2F + 1 for a hyperfine level), when known
     */
    public OptionalInt statisticalWeight(int i) {
        return optional(weight[i]);
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the energy in cm^-1 above the species' ground level (alkali atoms: above the ground
     *         level's hyperfine-free centroid; a level list: as listed)
     */
    public double energyPerCm(int i) {
        return energy[i];
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the standard uncertainty of the energy in cm^-1, when the source gives one (a level list's
     *         own; an alkali level's as its atom states it, {@code Level.energyUncertaintyPerCm()}, and none
     *         for its hyperfine F levels; none for one-electron ions)
     */
    public OptionalDouble energyUncertaintyPerCm(int i) {
        return Double.isNaN(energySigma[i]) ? OptionalDouble.empty() : OptionalDouble.of(energySigma[i]);
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return where the energy comes from: the tier of a one-electron ion ({@code qed}), the origin of
     *         an alkali level ({@code measured}, {@code quantum-defect}, ...; for an F level followed by where
     *         its constants come from, e.g. {@code , hyperfine A, B measured} or {@code , hyperfine A, B scaled as
     *         n*^-3 from 7s 2S1/2}, as the sources say, {@code , hyperfine A, B} when they do not), or
     *         {@code level list} and the list's id
     */
    public String model(int i) {
        return model[i];
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the radiative lifetime in s from E1 decays, when asked for and finite (empty for a
     *         ground level, a level with no E1 decay, and the levels of a level list)
     */
    public OptionalDouble lifetimeSeconds(int i) {
        return Double.isFinite(lifetime[i]) ? OptionalDouble.of(lifetime[i]) : OptionalDouble.empty();
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the standard uncertainty of {@link #lifetimeSeconds} in s (alkali atoms:
     *         {@code AlkaliAtom.radiativeLifetimeUncertainty}: published elements' stated uncertainties, and for
     *         computed elements the spread of two models where the atom has a second one); empty where it is not
     *         estimated
     */
    public OptionalDouble lifetimeUncertaintySeconds(int i) {
        return Double.isFinite(lifetimeSigma[i]) ? OptionalDouble.of(lifetimeSigma[i]) : OptionalDouble.empty();
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the lifetime in s with black-body stimulated decays and excitation added, when asked
     *         for with a temperature (alkali atoms only)
     */
    public OptionalDouble effectiveLifetimeSeconds(int i) {
        return Double.isFinite(effective[i]) ? OptionalDouble.of(effective[i]) : OptionalDouble.empty();
    }

    /**
     * @param i a level, 0 to size() - 1
     * @return the standard uncertainty of {@link #effectiveLifetimeSeconds} in s (alkali atoms:
     *         {@code AlkaliAtom.effectiveLifetimeUncertainty}, made as {@link #lifetimeUncertaintySeconds});
     *         empty where it is not estimated or no effective lifetime was asked for
     */
    public OptionalDouble effectiveLifetimeUncertaintySeconds(int i) {
        return Double.isFinite(effectiveSigma[i]) ? OptionalDouble.of(effectiveSigma[i]) : OptionalDouble.empty();
    }

    /** @return the levels that exist but could not be given, per species */
    public List<Omission> omissions() {
        return omissions;
    }

    private static OptionalInt optional(int value) {
        return value == NONE ? OptionalInt.empty() : OptionalInt.of(value);
    }

    @Override
    public String toString() {
        return "LevelSet[" + size() + " levels" + (omissions.isEmpty() ? "" : ", " + omissions.size()
                + " omission(s)") + "]";
    }

    /** Collects rows; not thread-safe. */
    static final class Builder {

        private int size;
        private Species[] species = new Species[16];
        private String[] label = new String[16];
        private int[] n = new int[16];
        private int[] l = new int[16];
        private int[] twoJ = new int[16];
        private int[] twoF = new int[16];
        private int[] weight = new int[16];
        private double[] energy = new double[16];
        private double[] energySigma = new double[16];
        private String[] model = new String[16];
        private double[] lifetime = new double[16];
        private double[] lifetimeSigma = new double[16];
        private double[] effective = new double[16];
        private double[] effectiveSigma = new double[16];
        private final List<Omission> omissions = new ArrayList<>();

        /** Integer columns take {@link #NONE} and doubles NaN where a row has no value. */
        void add(Species s, String text, int nValue, int lValue, int twoJValue, int twoFValue, int g, double perCm,
                double sigmaPerCm, String modelName, double lifetimeSeconds, double lifetimeSigmaSeconds,
                double effectiveSeconds, double effectiveSigmaSeconds) {
            if (size == label.length) {
                int grown = size * 2;
                species = Arrays.copyOf(species, grown);
                label = Arrays.copyOf(label, grown);
                n = Arrays.copyOf(n, grown);
                l = Arrays.copyOf(l, grown);
                twoJ = Arrays.copyOf(twoJ, grown);
                twoF = Arrays.copyOf(twoF, grown);
                weight = Arrays.copyOf(weight, grown);
                energy = Arrays.copyOf(energy, grown);
                energySigma = Arrays.copyOf(energySigma, grown);
                model = Arrays.copyOf(model, grown);
                lifetime = Arrays.copyOf(lifetime, grown);
                lifetimeSigma = Arrays.copyOf(lifetimeSigma, grown);
                effective = Arrays.copyOf(effective, grown);
                effectiveSigma = Arrays.copyOf(effectiveSigma, grown);
            }
            species[size] = s;
            label[size] = text;
            n[size] = nValue;
            l[size] = lValue;
            twoJ[size] = twoJValue;
            twoF[size] = twoFValue;
            weight[size] = g;
            energy[size] = perCm;
            energySigma[size] = sigmaPerCm;
            model[size] = modelName;
            lifetime[size] = lifetimeSeconds;
            lifetimeSigma[size] = lifetimeSigmaSeconds;
            effective[size] = effectiveSeconds;
            effectiveSigma[size] = effectiveSigmaSeconds;
            size++;
        }

        void omit(Omission omission) {
            omissions.add(omission);
        }

        int size() {
            return size;
        }

        LevelSet build() {
            return new LevelSet(this);
        }
    }

    /** @return {@link #NONE}, for the builder's callers */
    static int none() {
        return NONE;
    }
}
