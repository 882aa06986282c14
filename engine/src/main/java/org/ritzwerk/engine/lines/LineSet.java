package org.ritzwerk.engine.lines;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.function.IntPredicate;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.ritz.RitzLines;
import org.ritzwerk.engine.ritz.RitzTransitions;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.AlkaliLines;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import org.ritzwerk.quantity.Frequency;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;

/**
 * Spectral lines in columns, one primitive array per column and no object per line: the same
 * shape for every source of lines (one-electron ions of every tier, alkali atoms, built-in and
 * user line lists; see {@link LineSources} and {@link LineQuery}).
 *
 * <h2>Columns</h2>
 * Per line: the species; the upper and lower level labels where known; the quantum numbers n, l
 * and 2j of each level where known; the vacuum wavelength (metres) and vacuum frequency (Hz),
 * with the wavenumber derived from the frequency; the wavelength's standard uncertainty where
 * known; Einstein A (s^-1), the absorption oscillator strength f and the line strength S (atomic
 * units, (e a0)^2) where known; the statistical weights g_upper and g_lower where known; the
 * upper level's energy above the species' ground level (J) where known; the relative intensity
 * and {@link StrengthClass} where a list gives them; a name ({@link #name(int)}); the
 * provenance ({@link Source}); and, for multiplets, their components.
 *
 * <p>Wavelength and frequency are both kept as the source computed them: a source that computes
 * frequencies (one-electron ions, alkali atoms) stores {@code nu} and {@code c / nu}; a line list
 * stores its positions converted once to each (the wavelength within an ulp of {@code c / nu}).
 * Air wavelengths are given on request with the air model named ({@link #wavelengthMetres(int,
 * Medium)}).
 *
 * <h2>Multiplets and their components</h2>
 * A line may be a multiplet ({@link #isMultiplet(int)}): a blend of unresolved components, such
 * as a one-electron ion's whole n -&gt; n' transition. Its components, where they were computed,
 * are a child {@code LineSet} ({@link #components(int)}); inside, all components of all
 * multiplets are one columnar set, each multiplet owning an index range of it, so components cost
 * no object per line either. A multiplet whose components were not asked for has an empty set.
 *
 * <p>Quantities a source does not give are absent: {@code OptionalDouble}, {@code OptionalInt},
 * {@code Optional}; never NaN or -1 in the public accessors. Immutable and thread-safe; equality
 * is exact (every column, in order); built by
 * {@link #builder()}, the adapters of {@link LineSources}, or {@link LineQuery}.
 */
public final class LineSet {

    /**
     * Where a line comes from.
     *
     * @param model   the model or kind of source: a one-electron tier id ({@code bohr},
     *                {@code dirac}, {@code qed}, {@code hyperfine}), {@code quantum-defect} for
     *                alkali atoms, {@code line-list} for line lists, or a caller's own label
     * @param dataSet the data set the lines or the model's parameters come from, where one is known
     */
    public record Source(String model, Optional<DataSetInfo> dataSet) {

        /**
         * Validates the components.
         *
         * @param model   the model or kind of source: a one-electron tier id ({@code bohr},
         *                {@code dirac}, {@code qed}, {@code hyperfine}), {@code quantum-defect} for
         *                alkali atoms, {@code line-list} for line lists, or a caller's own label
         * @param dataSet the data set the lines or the model's parameters come from, where one is known
         */
        public Source {
            Objects.requireNonNull(model, "model");
            Objects.requireNonNull(dataSet, "dataSet");
            if (model.isBlank()) {
                throw new IllegalArgumentException("a source's model label must not be blank");
            }
        }

        /**
         * @param model a model label
         * @return a source with no data set
         */
        public static Source of(String model) {
            return new Source(model, Optional.empty());
        }

        /**
         * @param model   a model label
         * @param dataSet the data set
         * @return a source with that data set
         */
        public static Source of(String model, DataSetInfo dataSet) {
            return new Source(model, Optional.of(dataSet));
        }
    }

    private static final LineSet EMPTY = new Builder().build();

    /** The atomic unit of electric dipole, e a0 = e alpha / (4 pi R_inf), C m. */
    private static final double ATOMIC_DIPOLE = PhysicalConstants.E * PhysicalConstants.FINE_STRUCTURE.value()
            / (4 * Math.PI * PhysicalConstants.RYDBERG.value());

    private final List<Species> speciesList;
    private final List<Source> sourceList;
    private final int[] species;
    private final int[] source;
    private final String[] name;
    private final String[] upperLabel;
    private final String[] lowerLabel;
    /** Six per line: n, l, 2j of the upper level, then of the lower; -1 where not known. */
    private final int[] levels;
    private final double[] vacuum;
    private final double[] frequency;
    /** The columns below hold NaN (or 0 for the weights, null for classes) where not known. */
    private final double[] sigma;
    private final double[] einsteinA;
    private final double[] oscillatorStrength;
    private final double[] lineStrength;
    private final double[] upperEnergy;
    private final double[] intensity;
    private final int[] upperWeight;
    private final int[] lowerWeight;
    private final StrengthClass[] strengthClass;
    private final boolean[] multiplet;
    /** The components of every multiplet, one set; null when there are none. */
    private final LineSet components;
    /** Line i's components are components[componentStart[i], componentStart[i + 1]); null when none. */
    private final int[] componentStart;

    private LineSet(Builder b) {
        int n = b.size;
        this.speciesList = Collections.unmodifiableList(new ArrayList<>(b.speciesList));
        this.sourceList = Collections.unmodifiableList(new ArrayList<>(b.sourceList));
        this.species = Arrays.copyOf(b.species, n);
        this.source = Arrays.copyOf(b.source, n);
        this.name = Arrays.copyOf(b.name, n);
        this.upperLabel = Arrays.copyOf(b.upperLabel, n);
        this.lowerLabel = Arrays.copyOf(b.lowerLabel, n);
        this.levels = Arrays.copyOf(b.levels, 6 * n);
        this.vacuum = Arrays.copyOf(b.vacuum, n);
        this.frequency = Arrays.copyOf(b.frequency, n);
        this.sigma = Arrays.copyOf(b.sigma, n);
        this.einsteinA = Arrays.copyOf(b.einsteinA, n);
        this.oscillatorStrength = Arrays.copyOf(b.oscillatorStrength, n);
        this.lineStrength = Arrays.copyOf(b.lineStrength, n);
        this.upperEnergy = Arrays.copyOf(b.upperEnergy, n);
        this.intensity = Arrays.copyOf(b.intensity, n);
        this.upperWeight = Arrays.copyOf(b.upperWeight, n);
        this.lowerWeight = Arrays.copyOf(b.lowerWeight, n);
        this.strengthClass = Arrays.copyOf(b.strengthClass, n);
        this.multiplet = Arrays.copyOf(b.multiplet, n);
        if (b.components == null) {
            this.components = null;
            this.componentStart = null;
        } else {
            this.components = b.components.build();
            this.componentStart = Arrays.copyOf(b.componentStart, n + 1);
            componentStart[n] = components.size();
        }
    }

    /** @return a builder for a line set of the caller's own lines */
    public static Builder builder() {
        return new Builder();
    }

    /** @return the empty line set */
    public static LineSet empty() {
        return EMPTY;
    }

    /**
     * @param sets line sets
     * @return their lines one after the other, in the order given
     */
    public static LineSet concat(List<LineSet> sets) {
        LineSet only = null;
        int nonEmpty = 0;
        for (LineSet set : sets) {
            if (!set.isEmpty()) {
                only = set;
                nonEmpty++;
            }
        }
        if (nonEmpty <= 1) {
            return only == null ? EMPTY : only;     // immutable: nothing to copy
        }
        Builder b = new Builder();
        for (LineSet set : sets) {
            for (int i = 0; i < set.size(); i++) {
                b.copy(set, i);
            }
        }
        return b.build();
    }

    /**
     * The lines of a one-electron ion as the line generator gave them (any tier): names, labels
     * and quantum numbers, frequency (the wavelength is {@code c / nu}), A, f, S converted to
     * (e a0)^2, the weights, and the upper energy above the ground level 1s1/2 in this model (for a
     * multiplet, that of its upper shell's s1/2 level). Multiplets are marked as such; their
     * components are attached when {@code generator} is given, else left empty.
     *
     * @param species   the ion, e.g. {@code H I}
     * @param model     its model (the table's source), for the energies and the tier id
     * @param table     lines from {@link HydrogenLikeLines} with that model
     * @param generator the generator, to attach each multiplet's components; or null for none
     * @return the lines, in the table's order (rising frequency)
     */
    public static LineSet ofHydrogenLike(Species species, HydrogenLikeModel model, LineTable table,
            HydrogenLikeLines generator) {
        Objects.requireNonNull(species, "species");
        Objects.requireNonNull(model, "model");
        Source from = Source.of(model.tier().id());
        double ground = model.energy(1, 0, 1);
        Builder b = new Builder();
        for (int i = 0; i < table.size(); i++) {
            int n = table.upperN(i);
            boolean blend = table.upperL(i) < 0;
            double upper = blend ? model.energy(n, 0, 1) : model.energy(n, table.upperL(i), table.upperTwoJ(i));
            b.addFrequency(species, from, table.lineName(i), table.frequency(i))
                    .labels(table.upperLabel(i), table.lowerLabel(i));
            if (blend) {
                b.upperShell(n).lowerShell(table.lowerN(i));
            } else {
                b.upper(State.of(n, table.upperL(i), table.upperTwoJ(i)))
                        .lower(State.of(table.lowerN(i), table.lowerL(i), table.lowerTwoJ(i)));
            }
            b.einsteinA(table.einsteinA(i))
                    .oscillatorStrength(table.oscillatorStrength(i))
                    .lineStrength(table.lineStrength(i) / (ATOMIC_DIPOLE * ATOMIC_DIPOLE))
                    .weights(table.upperWeight(i), table.lowerWeight(i))
                    .upperEnergy(Math.max(0, upper - ground));
            if (blend) {
                b.multiplet(generator == null ? EMPTY
                        : ofHydrogenLike(species, model, generator.multipletComponents(n, table.lowerN(i)), null));
            }
        }
        return b.build();
    }

    /**
     * The lines of an alkali atom as {@link AlkaliLines} gave them: named by the letters of l
     * ({@code p-s}), labelled in spectroscopic notation, with n l j, frequency (the wavelength is
     * {@code c / nu}), A, f, S, weights 2j + 1, the upper energy above the ground level and, where both
     * levels have one, the vacuum wavelength's standard uncertainty {@code c u(nu) / nu^2}
     * ({@link AlkaliAtom#frequencyUncertaintyHz}).
     *
     * @param atom  the atom
     * @param lines its lines
     * @return the lines, in the order given
     */
    public static LineSet ofAlkali(AlkaliAtom atom, List<AlkaliLines.Line> lines) {
        Objects.requireNonNull(atom, "atom");
        Source from = Source.of("quantum-defect", atom.quantumDefects().info());
        Builder b = new Builder();
        for (AlkaliLines.Line line : lines) {
            State u = line.upper();
            State l = line.lower();
            b.addFrequency(atom.species(), from, u.label().replaceAll("[0-9]", "").charAt(0) + "-"
                    + l.label().replaceAll("[0-9]", "").charAt(0), line.frequency())
                    .labels(u.notation(), l.notation())
                    .upper(u)
                    .lower(l)
                    .einsteinA(line.einsteinA())
                    .oscillatorStrength(line.oscillatorStrength())
                    .lineStrength(line.lineStrength())
                    .weights(u.twoJ() + 1, l.twoJ() + 1)
                    .upperEnergy(Math.max(0, atom.energyJoules(u)));
            if (line.vacuumWavelengthUncertaintyMetres().isPresent()) {
                b.uncertainty(line.vacuumWavelengthUncertaintyMetres().getAsDouble());
            }
        }
        return b.build();
    }

    /**
     * The lines that {@link RitzLines} computed from a species' levels: named by their two labels
     * ({@code 1s2p 3P2 - 1s2s 3S1}, upper first, as every other line's label), labelled, with the
     * frequency {@code c sigma} (the wavelength is {@code c / nu}), the vacuum wavelength's standard uncertainty
     * {@code u(sigma) / sigma^2} where the levels' uncertainties are known, A and f where given,
     * weights {@code 2J + 1} where J is known, the upper energy above the ground level, and n l j
     * where a label reads as a one-electron state ({@code 5p3/2}). Source model {@code ritz}, with
     * the levels' data set where known.
     *
     * @param transitions the Ritz lines
     * @return the lines, in the order given (rising wavenumber)
     */
    public static LineSet ofRitz(RitzTransitions transitions) {
        Objects.requireNonNull(transitions, "transitions");
        RitzLevels levels = transitions.levels();
        Source from = levels.info().map(info -> Source.of("ritz", info)).orElse(Source.of("ritz"));
        Builder b = new Builder();
        double hc = PhysicalConstants.H * PhysicalConstants.C * 100;
        for (int i = 0; i < transitions.size(); i++) {
            int u = transitions.upper(i);
            int l = transitions.lower(i);
            double perCm = transitions.wavenumberPerCm(i);
            b.addFrequency(levels.species(), from, levels.label(u) + " - " + levels.label(l),
                    perCm * 100 * PhysicalConstants.C)
                    .labels(levels.label(u), levels.label(l))
                    .upperEnergy(levels.energyPerCm(u) * hc);
            if (transitions.wavenumberUncertaintyPerCm(i).isPresent()) {
                b.uncertainty(transitions.wavenumberUncertaintyPerCm(i).getAsDouble() / (perCm * perCm) / 100);
            }
            transitions.einsteinA(i).ifPresent(b::einsteinA);
            transitions.oscillatorStrength(i).ifPresent(b::oscillatorStrength);
            int twoJu = levels.designation(u).twoJ();
            int twoJl = levels.designation(l).twoJ();
            if (twoJu >= 0 && twoJl >= 0) {
                b.weights(twoJu + 1, twoJl + 1);
            }
            State upper = parsed(levels.label(u));
            State lower = parsed(levels.label(l));
            if (upper != null) {
                b.upper(upper);
            }
            if (lower != null) {
                b.lower(lower);
            }
        }
        return b.build();
    }

    /**
     * The lines of a line list (a built-in or user list, or a lamp list): positions converted
     * once from the list's unit and medium to vacuum wavelength and to frequency
     * ({@link SpectralArrays#convert}), the uncertainty scaled by the same factor
     * ({@code |lambda_vac / position| u}, first order), relative intensity, strength class,
     * Einstein A, and the level labels; quantum numbers where a label reads as a state
     * ({@code 5p3/2}, {@link State#parse}). Named by the position as listed ({@code 640.2248 nm air}).
     *
     * @param list the list
     * @return its lines, in the list's order
     * @throws IllegalArgumentException naming the list when a position cannot be converted
     */
    public static LineSet of(LineList list) {
        Objects.requireNonNull(list, "list");
        double[] vacuumMetres = SpectralArrays.wavelengths(list, Unit.METRE, Medium.vacuum());
        double[] hertz = new double[list.size()];
        for (int i = 0; i < hertz.length; i++) {
            hertz[i] = list.position(i);
        }
        try {
            SpectralArrays.convert(hertz, list.unit(), list.medium(), Unit.HERTZ, null, hertz);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("line list " + list.info().id() + ": " + e.getMessage(), e);
        }
        Source from = Source.of("line-list", list.info());
        Builder b = new Builder();
        for (int i = 0; i < hertz.length; i++) {
            b.add(list.species(i), from, list.position(i) + " " + list.unit().symbol()
                    + (list.medium() == null ? "" : " " + list.medium().label()), vacuumMetres[i], hertz[i])
                    .labels(list.upper(i), list.lower(i))
                    .strengthClass(list.strength(i));
            if (list.uncertainty(i).isPresent()) {
                b.uncertainty(Math.abs(vacuumMetres[i] / list.position(i)) * list.uncertainty(i).getAsDouble());
            }
            if (list.intensity(i).isPresent()) {
                b.relativeIntensity(list.intensity(i).getAsDouble());
            }
            if (list.einsteinA(i).isPresent()) {
                b.einsteinA(list.einsteinA(i).getAsDouble());
            }
            State upper = parsed(list.upper(i));
            State lower = parsed(list.lower(i));
            if (upper != null) {
                b.upper(upper);
            }
            if (lower != null) {
                b.lower(lower);
            }
        }
        return b.build();
    }

    private static State parsed(String label) {
        if (label == null) {
            return null;
        }
        try {
            return State.parse(label);
        } catch (org.ritzwerk.atom.StateParseException e) {
            return null;        // a label in another notation: the level's quantum numbers stay unknown
        }
    }

    /** @return the number of lines */
    public int size() {
        return vacuum.length;
    }

    /** @return whether the set has no line */
    public boolean isEmpty() {
        return vacuum.length == 0;
    }

    /**
     * @param i line index
     * @return the species
     */
    public Species species(int i) {
        return speciesList.get(species[i]);
    }

    /** @return the distinct species, in the order of their first line */
    public List<Species> speciesList() {
        return speciesList;
    }

    /**
     * @param i line index
     * @return where the line comes from
     */
    public Source source(int i) {
        return sourceList.get(source[i]);
    }

    /**
     * @param i line index
     * @return the line's name: for hydrogen its series name ({@code Balmer alpha}), for other
     *         one-electron ions wavelength and shells ({@code 4686 (4-3)}), for alkali atoms the
     *         letters of l ({@code p-s}), for a line list the position as listed with its unit
     *         and medium ({@code 640.2248 nm air}); for a caller's own lines what was given
     */
    public String name(int i) {
        return name[i];
    }

    /**
     * @param i line index
     * @return the upper level's label ({@code 3d 2D5/2}, {@code n=3}), where known
     */
    public Optional<String> upperLabel(int i) {
        return Optional.ofNullable(upperLabel[i]);
    }

    /**
     * @param i line index
     * @return the lower level's label, where known
     */
    public Optional<String> lowerLabel(int i) {
        return Optional.ofNullable(lowerLabel[i]);
    }

    /**
     * @param i line index
     * @return the upper principal quantum number, where known
     */
    public OptionalInt upperN(int i) {
        return quantum(6 * i);
    }

    /**
     * @param i line index
     * @return the upper orbital quantum number l, where known (absent for a multiplet)
     */
    public OptionalInt upperL(int i) {
        return quantum(6 * i + 1);
    }

    /**
     * @param i line index
     * @return twice the upper j, where known (absent for a multiplet)
     */
    public OptionalInt upperTwoJ(int i) {
        return quantum(6 * i + 2);
    }

    /**
     * @param i line index
     * @return the lower principal quantum number, where known
     */
    public OptionalInt lowerN(int i) {
        return quantum(6 * i + 3);
    }

    /**
     * @param i line index
     * @return the lower orbital quantum number l, where known
     */
    public OptionalInt lowerL(int i) {
        return quantum(6 * i + 4);
    }

    /**
     * @param i line index
     * @return twice the lower j, where known
     */
    public OptionalInt lowerTwoJ(int i) {
        return quantum(6 * i + 5);
    }

    /**
     * @param i line index
     * @return the upper level as n l j, where all three are known
     */
    public Optional<State> upperState(int i) {
        return state(6 * i);
    }

    /**
     * @param i line index
     * @return the lower level as n l j, where all three are known
     */
    public Optional<State> lowerState(int i) {
        return state(6 * i + 3);
    }

    private OptionalInt quantum(int k) {
        return levels[k] < 0 ? OptionalInt.empty() : OptionalInt.of(levels[k]);
    }

    private Optional<State> state(int k) {
        return levels[k] < 0 || levels[k + 1] < 0 || levels[k + 2] < 0 ? Optional.empty()
                : Optional.of(State.of(levels[k], levels[k + 1], levels[k + 2]));
    }

    /**
     * @param i line index
     * @return the vacuum wavelength in metres
     */
    public double vacuumWavelengthMetres(int i) {
        return vacuum[i];
    }

    /**
     * @param i line index
     * @return the vacuum wavelength in nm (metres times 1e9)
     */
    public double vacuumWavelengthNm(int i) {
        return vacuum[i] * 1e9;
    }

    /**
     * @param i line index
     * @return the vacuum wavelength as a typed quantity, with its standard uncertainty where known
     */
    public Wavelength vacuumWavelength(int i) {
        return Double.isNaN(sigma[i]) ? Wavelength.ofMetres(vacuum[i], Medium.vacuum())
                : Wavelength.of(vacuum[i], sigma[i], Unit.METRE, Medium.vacuum());
    }

    /**
     * @param i line index
     * @return the standard uncertainty of the vacuum wavelength in metres, where known
     */
    public OptionalDouble vacuumWavelengthUncertaintyMetres(int i) {
        return optional(sigma[i]);
    }

    /**
     * @param i      line index
     * @param medium vacuum, or air under a named model ({@link Medium#air()} for standard air)
     * @return the wavelength in that medium, metres
     * @throws MediumException when the line lies outside the air model's validity range
     */
    public double wavelengthMetres(int i, Medium medium) {
        return medium.fromVacuum(vacuum[i]);
    }

    /**
     * @param i line index
     * @return the vacuum frequency in Hz
     */
    public double frequencyHz(int i) {
        return frequency[i];
    }

    /**
     * @param i line index
     * @return the frequency as a typed quantity
     */
    public Frequency frequency(int i) {
        return Frequency.ofHertz(frequency[i]);
    }

    /**
     * @param i line index
     * @return the vacuum wavenumber in cm^-1, {@code nu / c / 100}
     */
    public double wavenumberPerCm(int i) {
        return frequency[i] / PhysicalConstants.C / 100;
    }

    /**
     * @param i line index
     * @return the Einstein A coefficient in s^-1, where known
     */
    public OptionalDouble einsteinA(int i) {
        return optional(einsteinA[i]);
    }

    /**
     * @param i line index
     * @return the absorption oscillator strength f, where known
     */
    public OptionalDouble oscillatorStrength(int i) {
        return optional(oscillatorStrength[i]);
    }

    /**
     * @param i line index
     * @return the line strength S in atomic units (e a0)^2, where known
     */
    public OptionalDouble lineStrengthAtomicUnits(int i) {
        return optional(lineStrength[i]);
    }

    /**
     * @param i line index
     * @return the upper level's statistical weight, where known (2 n^2 for a multiplet)
     */
    public OptionalInt upperWeight(int i) {
        return upperWeight[i] == 0 ? OptionalInt.empty() : OptionalInt.of(upperWeight[i]);
    }

    /**
     * @param i line index
     * @return the lower level's statistical weight, where known
     */
    public OptionalInt lowerWeight(int i) {
        return lowerWeight[i] == 0 ? OptionalInt.empty() : OptionalInt.of(lowerWeight[i]);
    }

    /**
     * @param i line index
     * @return the upper level's energy above the species' ground level, J (a multiplet's: its
     *         shell's s1/2 level), where known
     */
    public OptionalDouble upperEnergyJoules(int i) {
        return optional(upperEnergy[i]);
    }

    /**
     * @param i line index
     * @return the relative intensity a line list gives, where given
     */
    public OptionalDouble relativeIntensity(int i) {
        return optional(intensity[i]);
    }

    /**
     * @param i line index
     * @return the strength class a line list gives, where given
     */
    public Optional<StrengthClass> strengthClass(int i) {
        return Optional.ofNullable(strengthClass[i]);
    }

    /**
     * @param i line index
     * @return whether the line is a multiplet (a blend of unresolved components)
     */
    public boolean isMultiplet(int i) {
        return multiplet[i];
    }

    /**
     * @param i line index
     * @return the multiplet's components, in the order they were given; empty for a line that
     *         is not a multiplet, or whose components were not computed
     */
    public LineSet components(int i) {
        if (componentStart == null || componentStart[i] == componentStart[i + 1]) {
            return EMPTY;
        }
        int from = componentStart[i];
        int to = componentStart[i + 1];
        int[] range = new int[to - from];
        for (int k = 0; k < range.length; k++) {
            range[k] = from + k;
        }
        return components.select(range);
    }

    /**
     * @param keep which lines to keep, by index
     * @return the kept lines, in this set's order
     */
    public LineSet filter(IntPredicate keep) {
        int[] kept = new int[size()];
        int n = 0;
        for (int i = 0; i < size(); i++) {
            if (keep.test(i)) {
                kept[n++] = i;
            }
        }
        return n == size() ? this : select(Arrays.copyOf(kept, n));
    }

    /**
     * @param indices line indices, each 0 to size - 1; repeats allowed
     * @return those lines, in that order
     */
    public LineSet select(int[] indices) {
        Builder b = new Builder();
        for (int i : java.util.Objects.requireNonNull(indices, "indices")) {
            if (i < 0 || i >= size()) {
                throw new IndexOutOfBoundsException("line index " + i + " out of range: the set has " + size()
                        + " lines");
            }
            b.copy(this, i);
        }
        return b.build();
    }

    /**
     * @return the lines by falling frequency (rising vacuum wavelength); lines of equal frequency
     *         keep their order (a stable sort)
     */
    public LineSet sortedByFallingFrequency() {
        boolean sorted = true;
        for (int i = 1; i < size() && sorted; i++) {
            sorted = frequency[i - 1] >= frequency[i];
        }
        if (sorted) {
            return this;
        }
        boolean rising = true;
        for (int i = 1; i < size() && rising; i++) {
            rising = frequency[i - 1] <= frequency[i];
        }
        if (rising) {       // e.g. a one-electron line table: walk its groups of equal frequency down
            int[] indices = new int[size()];
            int k = 0;
            int end = size();
            while (end > 0) {
                int start = end - 1;
                while (start > 0 && frequency[start - 1] == frequency[end - 1]) {
                    start--;
                }
                for (int i = start; i < end; i++) {
                    indices[k++] = i;
                }
                end = start;
            }
            return select(indices);
        }
        Integer[] order = new Integer[size()];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Double.compare(frequency[b], frequency[a]));
        int[] indices = new int[order.length];
        for (int i = 0; i < indices.length; i++) {
            indices[i] = order[i];
        }
        return select(indices);
    }

    /** @return the vacuum wavelengths in metres, a copy */
    public double[] vacuumWavelengthsMetres() {
        return vacuum.clone();
    }

    /** @return the vacuum frequencies in Hz, a copy */
    public double[] frequenciesHz() {
        return frequency.clone();
    }

    private static OptionalDouble optional(double value) {
        return Double.isNaN(value) ? OptionalDouble.empty() : OptionalDouble.of(value);
    }

    /** Exact: the same lines, in the same order, with every column equal (doubles bit for bit). */
    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (!(o instanceof LineSet)) {
            return false;
        }
        LineSet t = (LineSet) o;
        return speciesList.equals(t.speciesList) && sourceList.equals(t.sourceList) && Arrays.equals(species, t.species)
                && Arrays.equals(source, t.source) && Arrays.equals(name, t.name)
                && Arrays.equals(upperLabel, t.upperLabel) && Arrays.equals(lowerLabel, t.lowerLabel)
                && Arrays.equals(levels, t.levels) && Arrays.equals(vacuum, t.vacuum)
                && Arrays.equals(frequency, t.frequency) && Arrays.equals(sigma, t.sigma)
                && Arrays.equals(einsteinA, t.einsteinA) && Arrays.equals(oscillatorStrength, t.oscillatorStrength)
                && Arrays.equals(lineStrength, t.lineStrength) && Arrays.equals(upperEnergy, t.upperEnergy)
                && Arrays.equals(intensity, t.intensity) && Arrays.equals(upperWeight, t.upperWeight)
                && Arrays.equals(lowerWeight, t.lowerWeight) && Arrays.equals(strengthClass, t.strengthClass)
                && Arrays.equals(multiplet, t.multiplet) && Objects.equals(components, t.components)
                && Arrays.equals(componentStart, t.componentStart);
    }

    @Override
    public int hashCode() {
        return Objects.hash(speciesList, Arrays.hashCode(frequency), Arrays.hashCode(name));
    }

    @Override
    public String toString() {
        return "LineSet[" + size() + " lines of " + speciesList.stream().map(Species::notation).toList() + "]";
    }

    /**
     * Collects lines, one {@code add} per line followed by setters for that line's known
     * columns; not thread-safe. Every value is checked when set, with a message naming the line
     * and the column.
     */
    public static final class Builder {
        private final List<Species> speciesList = new ArrayList<>();
        private final Map<Species, Integer> speciesIndex = new HashMap<>();
        private final List<Source> sourceList = new ArrayList<>();
        private final Map<Source, Integer> sourceIndex = new HashMap<>();
        private int size;
        private int[] species = new int[16];
        private int[] source = new int[16];
        private String[] name = new String[16];
        private String[] upperLabel = new String[16];
        private String[] lowerLabel = new String[16];
        private int[] levels = new int[96];
        private double[] vacuum = new double[16];
        private double[] frequency = new double[16];
        private double[] sigma = new double[16];
        private double[] einsteinA = new double[16];
        private double[] oscillatorStrength = new double[16];
        private double[] lineStrength = new double[16];
        private double[] upperEnergy = new double[16];
        private double[] intensity = new double[16];
        private int[] upperWeight = new int[16];
        private int[] lowerWeight = new int[16];
        private StrengthClass[] strengthClass = new StrengthClass[16];
        private boolean[] multiplet = new boolean[16];
        private Builder components;
        private int[] componentStart;
        /** The previous line's species and source, to skip the map lookups for runs of equal ones. */
        private Species lastSpecies;
        private Source lastSource;

        private Builder() {
        }

        /**
         * Starts a line given by its vacuum wavelength; its frequency is {@code c / lambda}.
         *
         * @param s            the species
         * @param from         where it comes from
         * @param name         its name, not null
         * @param vacuumMetres vacuum wavelength, metres; finite and positive
         * @return this builder, whose setters now apply to the new line
         */
        public Builder addWavelength(Species s, Source from, String name, double vacuumMetres) {
            positive("vacuum wavelength (m)", vacuumMetres);
            return add(s, from, name, vacuumMetres, PhysicalConstants.C / vacuumMetres);
        }

        /**
         * Starts a line given by its vacuum frequency; its wavelength is {@code c / nu}.
         *
         * @param s     the species
         * @param from  where it comes from
         * @param name  its name, not null
         * @param hertz vacuum frequency, Hz; finite and positive
         * @return this builder, whose setters now apply to the new line
         */
        public Builder addFrequency(Species s, Source from, String name, double hertz) {
            positive("frequency (Hz)", hertz);
            return add(s, from, name, PhysicalConstants.C / hertz, hertz);
        }

        /**
         * Starts a line given by both its vacuum wavelength and frequency, as a source computed
         * them (they should agree to rounding: {@code lambda nu = c}).
         *
         * @param s            the species
         * @param from         where it comes from
         * @param name         its name, not null
         * @param vacuumMetres vacuum wavelength, metres; finite and positive
         * @param hertz        vacuum frequency, Hz; finite and positive
         * @return this builder
         * @throws IllegalArgumentException when {@code lambda nu} differs from c by more than 1e-9 relative
         */
        public Builder add(Species s, Source from, String name, double vacuumMetres, double hertz) {
            Objects.requireNonNull(s, "species");
            Objects.requireNonNull(from, "source");
            Objects.requireNonNull(name, "name");
            positive("vacuum wavelength (m)", vacuumMetres);
            positive("frequency (Hz)", hertz);
            if (Math.abs(vacuumMetres * hertz / PhysicalConstants.C - 1) > 1e-9) {
                throw new IllegalArgumentException("line " + size + ": wavelength " + vacuumMetres + " m and frequency "
                        + hertz + " Hz disagree (their product must be c)");
            }
            grow();
            species[size] = s == lastSpecies ? species[size - 1] : speciesIndex.computeIfAbsent(s, k -> {
                speciesList.add(k);
                return speciesList.size() - 1;
            });
            source[size] = from == lastSource ? source[size - 1] : sourceIndex.computeIfAbsent(from, k -> {
                sourceList.add(k);
                return sourceList.size() - 1;
            });
            lastSpecies = s;
            lastSource = from;
            this.name[size] = name;
            upperLabel[size] = null;
            lowerLabel[size] = null;
            Arrays.fill(levels, 6 * size, 6 * size + 6, -1);
            vacuum[size] = vacuumMetres;
            frequency[size] = hertz;
            sigma[size] = Double.NaN;
            einsteinA[size] = Double.NaN;
            oscillatorStrength[size] = Double.NaN;
            lineStrength[size] = Double.NaN;
            upperEnergy[size] = Double.NaN;
            intensity[size] = Double.NaN;
            upperWeight[size] = 0;
            lowerWeight[size] = 0;
            strengthClass[size] = null;
            multiplet[size] = false;
            size++;
            if (components != null) {
                componentStart[size] = components.size;
            }
            return this;
        }

        /**
         * @param upper the upper level's label, or null when not known
         * @param lower the lower level's label, or null when not known
         * @return this builder
         */
        public Builder labels(String upper, String lower) {
            int i = last();
            upperLabel[i] = upper;
            lowerLabel[i] = lower;
            return this;
        }

        /**
         * @param level the upper level n l j
         * @return this builder
         */
        public Builder upper(State level) {
            return level(0, level.n(), level.l(), level.twoJ());
        }

        /**
         * @param level the lower level n l j
         * @return this builder
         */
        public Builder lower(State level) {
            return level(3, level.n(), level.l(), level.twoJ());
        }

        /**
         * @param n the upper shell's n, at least 1, where l and j are not known (a multiplet)
         * @return this builder
         */
        public Builder upperShell(int n) {
            return level(0, n, -1, -1);
        }

        /**
         * @param n the lower shell's n, at least 1, where l and j are not known
         * @return this builder
         */
        public Builder lowerShell(int n) {
            return level(3, n, -1, -1);
        }

        private Builder level(int offset, int n, int l, int twoJ) {
            int i = last();
            if (n < 1 || l >= n) {
                throw new IllegalArgumentException("line " + i + ": impossible " + (offset == 0 ? "upper" : "lower")
                        + " level n = " + n + ", l = " + l);
            }
            levels[6 * i + offset] = n;
            levels[6 * i + offset + 1] = l;
            levels[6 * i + offset + 2] = twoJ;
            return this;
        }

        /**
         * @param metres the vacuum wavelength's standard uncertainty, finite, not negative
         * @return this builder
         */
        public Builder uncertainty(double metres) {
            sigma[last()] = notNegative("wavelength uncertainty (m)", metres);
            return this;
        }

        /**
         * @param perSecond Einstein A, s^-1, finite, not negative
         * @return this builder
         */
        public Builder einsteinA(double perSecond) {
            einsteinA[last()] = notNegative("Einstein A (s^-1)", perSecond);
            return this;
        }

        /**
         * @param f absorption oscillator strength, finite, not negative
         * @return this builder
         */
        public Builder oscillatorStrength(double f) {
            oscillatorStrength[last()] = notNegative("oscillator strength", f);
            return this;
        }

        /**
         * @param atomicUnits line strength S in (e a0)^2, finite, not negative
         * @return this builder
         */
        public Builder lineStrength(double atomicUnits) {
            lineStrength[last()] = notNegative("line strength ((e a0)^2)", atomicUnits);
            return this;
        }

        /**
         * @param upper the upper level's statistical weight, at least 1
         * @param lower the lower level's statistical weight, at least 1
         * @return this builder
         */
        public Builder weights(int upper, int lower) {
            if (upper < 1 || lower < 1) {
                throw new IllegalArgumentException("line " + last() + ": statistical weights must be at least 1, got "
                        + upper + " and " + lower);
            }
            upperWeight[last()] = upper;
            lowerWeight[last()] = lower;
            return this;
        }

        /**
         * @param joules the upper level's energy above the ground level, finite, not negative
         * @return this builder
         */
        public Builder upperEnergy(double joules) {
            upperEnergy[last()] = notNegative("upper energy (J)", joules);
            return this;
        }

        /**
         * @param relative relative intensity, finite, not negative
         * @return this builder
         */
        public Builder relativeIntensity(double relative) {
            intensity[last()] = notNegative("relative intensity", relative);
            return this;
        }

        /**
         * @param c the strength class, or null
         * @return this builder
         */
        public Builder strengthClass(StrengthClass c) {
            strengthClass[last()] = c;
            return this;
        }

        /**
         * Marks the line a multiplet, with its components (may be empty when they were not computed).
         *
         * @param parts the components
         * @return this builder
         */
        public Builder multiplet(LineSet parts) {
            Objects.requireNonNull(parts, "parts");
            int i = last();
            if (multiplet[i]) {
                throw new IllegalStateException("line " + i + " already has its components");
            }
            multiplet[i] = true;
            if (!parts.isEmpty()) {
                if (components == null) {
                    components = new Builder();
                    componentStart = new int[Math.max(16, vacuum.length + 1)];
                }
                componentStart[i] = components.size;
                for (int k = 0; k < parts.size(); k++) {
                    components.copy(parts, k);
                }
                componentStart[i + 1] = components.size;
            }
            return this;
        }

        /** @return the number of lines added so far */
        public int size() {
            return size;
        }

        /** @return the line set */
        public LineSet build() {
            return new LineSet(this);
        }

        /** Adds line i of a set, with every column and its components. */
        void copy(LineSet set, int i) {
            add(set.species(i), set.source(i), set.name[i], set.vacuum[i], set.frequency[i]);
            int k = size - 1;
            upperLabel[k] = set.upperLabel[i];
            lowerLabel[k] = set.lowerLabel[i];
            System.arraycopy(set.levels, 6 * i, levels, 6 * k, 6);
            sigma[k] = set.sigma[i];
            einsteinA[k] = set.einsteinA[i];
            oscillatorStrength[k] = set.oscillatorStrength[i];
            lineStrength[k] = set.lineStrength[i];
            upperEnergy[k] = set.upperEnergy[i];
            intensity[k] = set.intensity[i];
            upperWeight[k] = set.upperWeight[i];
            lowerWeight[k] = set.lowerWeight[i];
            strengthClass[k] = set.strengthClass[i];
            if (set.multiplet[i]) {
                multiplet(set.components(i));
            }
        }

        private int last() {
            if (size == 0) {
                throw new IllegalStateException("add a line first");
            }
            return size - 1;
        }

        private void positive(String what, double value) {
            if (!(value > 0) || Double.isInfinite(value)) {
                throw new IllegalArgumentException("line " + size + ": " + what + " must be finite and positive, got "
                        + value);
            }
        }

        private double notNegative(String what, double value) {
            if (!(value >= 0) || Double.isInfinite(value)) {
                throw new IllegalArgumentException("line " + last() + ": " + what
                        + " must be finite and not negative, got " + value);
            }
            return value;
        }

        private void grow() {
            if (size < vacuum.length) {
                return;
            }
            int capacity = 2 * size;
            species = Arrays.copyOf(species, capacity);
            source = Arrays.copyOf(source, capacity);
            name = Arrays.copyOf(name, capacity);
            upperLabel = Arrays.copyOf(upperLabel, capacity);
            lowerLabel = Arrays.copyOf(lowerLabel, capacity);
            levels = Arrays.copyOf(levels, 6 * capacity);
            vacuum = Arrays.copyOf(vacuum, capacity);
            frequency = Arrays.copyOf(frequency, capacity);
            sigma = Arrays.copyOf(sigma, capacity);
            einsteinA = Arrays.copyOf(einsteinA, capacity);
            oscillatorStrength = Arrays.copyOf(oscillatorStrength, capacity);
            lineStrength = Arrays.copyOf(lineStrength, capacity);
            upperEnergy = Arrays.copyOf(upperEnergy, capacity);
            intensity = Arrays.copyOf(intensity, capacity);
            upperWeight = Arrays.copyOf(upperWeight, capacity);
            lowerWeight = Arrays.copyOf(lowerWeight, capacity);
            strengthClass = Arrays.copyOf(strengthClass, capacity);
            multiplet = Arrays.copyOf(multiplet, capacity);
            if (componentStart != null) {
                componentStart = Arrays.copyOf(componentStart, capacity + 1);
            }
        }
    }
}
