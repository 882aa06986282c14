package org.ritzwerk.refdata;

import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.Collectors;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.Isotope;
import org.ritzwerk.data.IsotopeTable;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.MeasuredLevel;
import org.ritzwerk.data.ModelPotential;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.hyperfine.ZeemanState;
import org.ritzwerk.engine.hyperfine.ZeemanStructure;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.internal.RydbergData;

/**
 * The data a computation uses, passed explicitly: a {@link DataRegistry} (user files first, then
 * third-party providers, then Ritzwerk's built-in data) and typed answers built from it.
 *
 * <ul>
 * <li><b>Nuclear data</b> ({@link #nucleus}, {@link #isotope}, {@link #defaultMassNumber}): each
 * isotope from the {@link DataKind#NUCLEAR} set of highest precedence that tabulates it; each
 * element's default mass number from the first set in precedence that names one (a user's
 * isotope file names none, so the built-in table of most abundant isotopes stays in force).</li>
 * <li><b>Alkali atoms</b> ({@link #alkaliSpecies()}, {@link #alkaliAtom(Species)}): the
 * {@link DataKind#QUANTUM_DEFECTS} set of highest precedence for the isotope, with the core
 * polarizabilities its {@link QuantumDefects} record carries and the measured levels of the
 * {@link DataKind#LEVELS} set it names (looked up in this context, so whichever provider supplies
 * the record, a user's file, a third party's jar or the built-in data, supplies a whole atom);
 * where a {@link DataKind#LEVELS} set of higher precedence covers the isotope (a user's level file
 * of {@code Li I}, which {@link #levelList} returns), its levels replace those of the same n l j,
 * so your file wins in levels and lines as it does in {@link #levelList};
 * and R_M computed from this context's nuclear data
 * ({@link QuantumDefectFiles#rydbergPerCm(double)}). The atoms use the Coulomb approximation,
 * except for the low-lying pairs of states with a published dipole element
 * ({@link #alkaliDipoles()}; {@link AlkaliAtom#withPublishedDipoles}), whose element is the
 * published one; the element's built-in model potential is their second model
 * ({@link AlkaliAtom#withModelSpread}), whose spread states the uncertainty of computed dipole elements,
 * rates and lifetimes;
 * {@link #modelPotential(Species)} gives the built-in core potential for
 * {@link AlkaliAtom#withModelPotential}.</li>
 * <li><b>Level lists</b> ({@link #levelList(Species)}, {@link #levelSpecies()}): the
 * {@link DataKind#LEVELS} set of highest precedence for a species, whose lines come by the Ritz
 * combination principle.</li>
 * <li><b>Line lists</b> ({@link #lampLines(Species)}, {@link #lineList(String)}): the lamp set of
 * highest precedence for a species; a set by id, or a user's file by path.</li>
 * </ul>
 *
 * <p>A context is an immutable value: {@link #withUserFile(Path)} returns a new one. Nothing is
 * global: {@link #builtIn()} and {@link #discoverDefault()} make a new context on every call (the
 * latter is the opt-in way to use every provider on the class path) and are never kept in a
 * static field. Everything is loaded on first use and kept, once, however many threads ask; all
 * methods are safe to call from many threads.
 *
 * <p><b>Make one context and share it.</b> Build a context once (at start-up, or per user file set)
 * and pass it to every call and thread that needs data; do not build one per call. What a context
 * has read (its nuclear data, each data set, each alkali atom it assembled, the n*^-3 law's error
 * figures of the Rydberg hyperfine constants) is kept in it, so a
 * new context repeats that work. What its first use costs: listing the data sets reads only the
 * built-in files' headers; a set's rows are read when the set is first asked for. The built-in
 * files are read at most once per JVM and the sets shared by every built-in context (they cannot
 * change, and the sets are immutable), so in a warm JVM a new context's first
 * {@link #nucleus} takes about a millisecond or less and its first {@link #alkaliAtom} about as
 * long as assembling the atom; the first built-in lookup in a fresh JVM takes a few hundred
 * milliseconds, and the first line or level list read about a second more, mostly class loading
 * (README, "Using the library", has figures). A user's file is read and checked once, by
 * {@link #withUserFile(Path)}.
 *
 * <p>Typical use:
 * <pre>{@code
 * DataContext data = DataContext.builtIn();                 // once, shared by every call and thread
 * AlkaliAtom rb = data.alkaliAtom(Species.parse("Rb-87 I"));
 * Nucleus hydrogen = data.nucleus(Species.parse("H I"));
 * }</pre>
 */
public final class DataContext {

    private final DataRegistry registry;
    private final Object lock = new Object();
    private volatile NuclearData nuclear;
    private volatile List<Species> alkaliSpecies;
    private final ConcurrentMap<Species, AlkaliAtom> alkalis = new ConcurrentHashMap<>();
    /**
     * The n*^-3 law's figures of each Rydberg hyperfine data set asked with this context (by identity: the data
     * set keeps identity equality), held weakly, so that a data set read from a user's file and dropped is not
     * kept alive by a long-lived context; the map's lock is held while a set's figures are worked out.
     */
    private final Map<RydbergHyperfine, RydbergHyperfine.Law> scalingLaws =
            java.util.Collections.synchronizedMap(new java.util.WeakHashMap<>());
    private final AtomicInteger scalingLawsWorkedOut = new AtomicInteger();

    private DataContext(DataRegistry registry) {
        this.registry = Objects.requireNonNull(registry, "registry");
    }

    /**
     * @param registry the data sets and their precedence
     * @return a context answering from that registry
     */
    public static DataContext of(DataRegistry registry) {
        return new DataContext(registry);
    }

    /**
     * @return a new context of Ritzwerk's built-in data only ({@link DataRegistry#builtIn()}); make
     *         one and share it (see the class comment): the built-in files it reads are shared with
     *         every other built-in context of the JVM, but what it assembles (nuclear data layers,
     *         alkali atoms) is its own
     */
    public static DataContext builtIn() {
        return new DataContext(DataRegistry.builtIn());
    }

    /**
     * @return a new context of every provider {@link java.util.ServiceLoader} finds (built-in and
     *         third-party jars on the class or module path), the opt-in default
     */
    public static DataContext discoverDefault() {
        return new DataContext(DataRegistry.discoverDefault());
    }

    /**
     * @param file a user's file: a line list, level table, quantum-defect set or isotope table
     *             ({@link UserFiles}); read and checked now (a quantum-defect set against this
     *             context's nuclear data)
     * @return a new context with that file first in precedence
     * @throws DataFileException with every problem in the file
     */
    public DataContext withUserFile(Path file) {
        java.util.Objects.requireNonNull(file, "file");
        return new DataContext(registry.withUserFile(file, this::nuclearData));
    }

    /** @return the registry this context answers from */
    public DataRegistry registry() {
        return registry;
    }

    // ------------------------------------------------------------------ nuclear data

    /**
     * @return the nuclear data of this context: the {@link DataKind#NUCLEAR} sets layered in
     *         precedence order (see the class comment); loaded once
     * @throws ReferenceDataException when the registry has no nuclear data
     */
    public NuclearData nuclearData() {
        NuclearData data = nuclear;
        if (data == null) {
            synchronized (lock) {
                data = nuclear;
                if (data == null) {
                    data = layerNuclearData();
                    nuclear = data;
                }
            }
        }
        return data;
    }

    private NuclearData layerNuclearData() {
        List<NuclearData> winners = new ArrayList<>();
        List<NuclearData> shadowed = new ArrayList<>();
        Set<String> ids = new HashSet<>();
        for (DataRegistry.Listing listing : registry.list()) {
            if (listing.info().kind() != DataKind.NUCLEAR) {
                continue;
            }
            boolean wins = ids.add(listing.info().id());
            Optional<NuclearData> own = registry.nuclearData(listing);
            if (wins) {
                winners.add(own.orElseGet(() -> NuclearData.of(isotopeTable(listing.info().id()))));
            } else {
                // A shadowed set gives no isotopes, but its default isotopes still apply below the winners'.
                own.ifPresent(shadowed::add);
            }
        }
        if (winners.isEmpty()) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET,
                    "no nuclear data set in this context; 'ritzwerk data' lists the sets available");
        }
        if (shadowed.isEmpty()) {
            return NuclearData.layered(winners);
        }
        List<NuclearData> layers = new ArrayList<>(winners);
        for (NuclearData data : shadowed) {
            layers.add(data.defaultsOnly());
        }
        return NuclearData.layered(layers);
    }

    private IsotopeTable isotopeTable(String id) {
        DataSet set = registry.load(id);
        if (!(set instanceof IsotopeTable)) {
            throw new ReferenceDataException(ReferenceDataException.PROVIDER_FAILED, "nuclear set '" + id
                    + "' is not an isotope table");
        }
        return (IsotopeTable) set;
    }

    /**
     * @param species a species; mass number 0 means the element's default isotope
     * @return the nucleus of its isotope
     * @throws ReferenceDataException when this context has no data for the isotope
     */
    public Nucleus nucleus(Species species) {
        return nuclearData().nucleus(java.util.Objects.requireNonNull(species, "species"));
    }

    /**
     * @param species a species; mass number 0 means the element's default isotope
     * @return the tabulated isotope
     * @throws ReferenceDataException when this context has no data for the isotope
     */
    public Isotope isotope(Species species) {
        return nuclearData().isotope(species);
    }

    /**
     * @param z atomic number
     * @return the mass number a species of this element means when it gives none, if any
     */
    public Optional<Integer> defaultMassNumber(int z) {
        return nuclearData().defaultMassNumber(z);
    }

    // ------------------------------------------------------------------ alkali atoms

    /**
     * @return the neutral isotopes with a quantum-defect set in this context, ordered by Z and A;
     *         immutable
     */
    public List<Species> alkaliSpecies() {
        List<Species> species = alkaliSpecies;
        if (species == null) {
            Set<Species> found = new HashSet<>();
            for (DataRegistry.Listing listing : registry.list()) {
                if (listing.info().kind() == DataKind.QUANTUM_DEFECTS) {
                    listing.info().species().stream().filter(s -> s.charge() == 0 && s.massNumber() > 0)
                            .forEach(found::add);
                }
            }
            species = found.stream().sorted(Comparator.comparingInt(Species::z).thenComparingInt(Species::massNumber))
                    .collect(Collectors.toUnmodifiableList());
            alkaliSpecies = species;
        }
        return species;
    }

    /**
     * @param species a neutral alkali isotope (without mass number: the element's default isotope)
     * @return the engine's model of it, assembled once (see the class comment)
     * @throws ReferenceDataException when no quantum-defect set covers the isotope, or its levels
     *                                set is missing or does not read
     */
    public AlkaliAtom alkaliAtom(Species species) {
        Objects.requireNonNull(species, "species");
        Species key = species;
        if (species.massNumber() == 0) {
            key = new Species(species.z(), defaultMassNumber(species.z()).orElse(0), species.charge());
        }
        // assemble() touches no other entry of this map, so computing inside it is safe; each atom is made once.
        return alkalis.computeIfAbsent(key, this::assemble);
    }

    private AlkaliAtom assemble(Species species) {
        DataRegistry.Listing listing = species.charge() != 0 ? null : registry.list().stream()
                .filter(l -> l.info().kind() == DataKind.QUANTUM_DEFECTS && l.info().species().contains(species))
                .findFirst().orElse(null);
        if (listing == null) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET, "no alkali level data "
                    + "(quantum defects and levels, hence no lines, lifetimes or hyperfine structure) for "
                    + species.notation() + "; isotopes with level data: "
                    + alkaliSpecies().stream().map(Species::notation).collect(Collectors.joining(", ")));
        }
        String id = listing.info().id();
        DataSet set = registry.load(id);
        if (!(set instanceof QuantumDefects)) {
            throw new ReferenceDataException(ReferenceDataException.PROVIDER_FAILED, "quantum-defect set '" + id
                    + "' is not a quantum-defect record");
        }
        QuantumDefects defects = (QuantumDefects) set;
        List<MeasuredLevel> measured = defects.levelsId().map(levelsId -> measuredLevels(id, levelsId, species))
                .orElse(List.of());
        // the built-in level tables are the natural element's; the isotope's own D-line centroids replace
        // their first p levels (a user's or third party's level table is taken as it is)
        if (defects.levelsId().isPresent()
                && registry.load(defects.levelsId().get()) == RydbergData.builtInSet(defects.levelsId().get())
                        .orElse(null)) {
            measured = AlkaliHyperfine.builtIn().withResonanceLevels(species, measured);
        }
        measured = withOwnLevels(listing, defects.levelsId().orElse(null), species, measured);
        double rydberg = QuantumDefectFiles.rydbergPerCm(isotope(species).atomicMass());
        AlkaliAtom atom = AlkaliAtom.of(defects.withRydbergPerCm(rydberg), measured);
        // published elements of low-lying pairs replace the computed ones (AlkaliDipoles); the second model,
        // whose spread states computed elements' uncertainty (AlkaliAtom.withModelSpread), is the element's
        // model potential (all built-in alkali elements have one; another element gets none)
        ModelPotential potential = RydbergData.potentials().get(species.z());
        return atom.withPublishedDipoles(alkaliDipoles().elements(atom, species)).withModelSpread(potential);
    }

    /**
     * The measured levels of an alkali atom with those of the level list of highest precedence
     * for it taking their place, when that list is not the one its quantum-defect set names and
     * comes before that set in precedence (a user's file, which {@link #levelList} returns too): a
     * level of the list replaces the same n l j, the other levels stay.
     */
    private List<MeasuredLevel> withOwnLevels(DataRegistry.Listing defects, String namedId, Species species,
            List<MeasuredLevel> measured) {
        List<DataRegistry.Listing> all = registry.list();
        int defectsAt = all.indexOf(defects);
        for (DataRegistry.Listing listing : registry.find(DataKind.LEVELS, species)) {
            if (listing.info().id().equals(namedId) || all.indexOf(listing) > defectsAt) {
                return measured;
            }
            DataSet set = registry.load(listing.info().id());
            if (!(set instanceof LevelList list)) {
                continue;
            }
            if (list.unit() != Unit.PER_CENTIMETRE) {
                throw new ReferenceDataException(ReferenceDataException.INCONSISTENT, "level list '"
                        + list.info().id() + "' covers " + species.notation() + ", whose model takes measured levels"
                        + " in cm-1; it is in " + list.unit().symbol() + ": give the energies in cm-1");
            }
            List<MeasuredLevel> own;
            try {
                own = RydbergData.measuredLevels(list);
            } catch (ReferenceDataException e) {
                throw new ReferenceDataException(ReferenceDataException.INCONSISTENT, "level list '"
                        + list.info().id() + "' covers the alkali atom " + species.notation() + ", whose model takes"
                        + " levels labelled n l j (e.g. 3s 2S1/2): " + e.getMessage());
            }
            Map<State, MeasuredLevel> byState = new java.util.LinkedHashMap<>();
            measured.forEach(m -> byState.put(m.state(), m));
            own.forEach(m -> byState.put(m.state(), m));
            return List.copyOf(byState.values());
        }
        return measured;
    }

    private List<MeasuredLevel> measuredLevels(String setId, String levelsId, Species species) {
        DataSet set;
        try {
            set = registry.load(levelsId);
        } catch (ReferenceDataException e) {
            throw new ReferenceDataException(e.code(), "quantum-defect set '" + setId + "' names levels '"
                    + levelsId + "': " + e.getMessage());
        }
        if (!(set instanceof LevelList) || ((LevelList) set).unit() != Unit.PER_CENTIMETRE
                || !set.info().species().contains(species)) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET, "quantum-defect set '" + setId
                    + "' names levels '" + levelsId + "', which is not a level table of " + species.notation()
                    + " in cm-1");
        }
        return RydbergData.measuredLevels((LevelList) set);
    }

    /**
     * @return the built-in D-line centroids and hyperfine constants of the alkali isotopes (built-in
     *         only: the registry has no data-set kind for them yet); their F -> F' and Zeeman
     *         components take this context for nuclear spins, moments and the atoms' levels
     */
    public AlkaliHyperfine alkaliHyperfine() {
        return AlkaliHyperfine.builtIn();
    }

    /**
     * @return the built-in published dipole elements of low-lying alkali transitions (built-in only,
     *         like {@link #alkaliHyperfine()}), which this context's atoms use instead of computed
     *         ones for exactly those pairs of states
     */
    public AlkaliDipoles alkaliDipoles() {
        return AlkaliDipoles.builtIn();
    }

    /**
     * @return the built-in measured lifetimes of alkali levels whose computed lifetimes rest on computed
     *         dipole elements, with the comparison that names a miss beyond the stated uncertainty (built-in
     *         only, like {@link #alkaliDipoles()})
     */
    public LifetimeChecks lifetimeChecks() {
        return LifetimeChecks.builtIn();
    }

    /**
     * @return the built-in hyperfine constants of alkali Rydberg series, scaled as n*^-3 from
     *         published measurements (built-in only, like {@link #alkaliHyperfine()}); their F
     *         levels take this context for nuclear spins and the atoms' levels
     */
    public RydbergHyperfine rydbergHyperfine() {
        return RydbergHyperfine.builtIn();
    }

    /**
     * The n*^-3 law's error figures of a Rydberg hyperfine data set in this context ({@link
     * RydbergHyperfine#scalingLawError} and each series' drift per n): worked out on first use, from every series'
     * measured levels, and kept, once however many threads and levels ask, since they depend only on this context's
     * data. Kept per data set object (in practice one: {@link #rydbergHyperfine()}'s); a data set is never equal to
     * another ({@code RydbergHyperfine} keeps identity equality).
     *
     * @throws IllegalStateException when no series has two measured levels (nothing is kept then)
     */
    RydbergHyperfine.Law scalingLaw(RydbergHyperfine data) {
        // workOutLaw asks this context for atoms and measured constants, never for a scaling law, so computing
        // inside computeIfAbsent is safe; each data set's figures are worked out once.
        return scalingLaws.computeIfAbsent(data, d -> {
            scalingLawsWorkedOut.incrementAndGet();
            return d.workOutLaw(this);
        });
    }

    /** @return how many times {@link #scalingLaw} has worked the figures out in this context (for tests) */
    int scalingLawsWorkedOut() {
        return scalingLawsWorkedOut.get();
    }

    /**
     * @param species a neutral alkali isotope
     * @param state   a level, e.g. 5p 2P3/2 or 60s 2S1/2
     * @return the hyperfine constants that apply to it: the measured ones where
     *         {@link #alkaliHyperfine()} has them (ground and first p levels, Cs-133 7p), else the n*^-3-scaled
     *         ones of {@link #rydbergHyperfine()}; empty when neither has the level
     */
    public Optional<HyperfineConstants> hyperfineConstants(Species species, State state) {
        Optional<AlkaliHyperfine.LevelConstants> measured = alkaliHyperfine().constants(species, state);
        return measured.isPresent() ? Optional.of(measured.get().constants())
                : rydbergHyperfine().constants(this, species, state);
    }

    /**
     * @param species a neutral alkali isotope
     * @param state   a level
     * @return where {@link #hyperfineConstants} come from, in words: {@code measured} (the measured constants of
     *         {@link #alkaliHyperfine()}, or a Rydberg series' row at the level it was measured at), or
     *         {@link RydbergHyperfine#origin}'s {@code scaled as n*^-3 from ...}; empty when the level has none
     */
    public Optional<String> hyperfineConstantsOrigin(Species species, State state) {
        return alkaliHyperfine().constants(species, state).isPresent() ? Optional.of("measured")
                : rydbergHyperfine().origin(this, species, state);
    }

    /**
     * @param species a neutral alkali isotope
     * @param state   a level
     * @return its F levels from {@link #hyperfineConstants} (Casimir formula), by rising F, energies
     *         above the ground level's hyperfine-free centroid in cm^-1; empty when it has no constants
     */
    public List<AlkaliHyperfine.FLevel> hyperfineLevels(Species species, State state) {
        Optional<HyperfineConstants> constants = hyperfineConstants(species, state);
        return constants.isEmpty() ? List.of() : AlkaliHyperfine.fLevels(this, species, state, constants.get());
    }

    /**
     * The Zeeman states of one level in a magnetic field: its hyperfine-Zeeman Hamiltonian in the |m_J m_I>
     * basis with {@link #hyperfineConstants} (measured, or scaled as n*^-3 for a Rydberg level), g_J by the
     * Lande formula with the CODATA 2018 electron g factor ({@link ZeemanStructure#landeG}) and g_I from the
     * nucleus' moment, diagonalised at any field ({@link ZeemanStructure#eigenstates}; for J = 1/2 the
     * Breit-Rabi levels). The level on its own: the field's mixing with its fine-structure partner is left out
     * ({@link ZeemanStructure#fineStructureMixingHertz} gives its size; the whole first p term is diagonalised
     * in {@link AlkaliHyperfine#zeemanComponents}), and so is the diamagnetic term.
     *
     * @param species               a neutral alkali isotope
     * @param state                 a level with constants
     * @param fieldTesla            the field, tesla, 0 to {@link ZeemanStructure#MAX_FIELD_TESLA}
     * @param fieldUncertaintyTesla the field's standard uncertainty, tesla, finite and not negative
     * @return the states by m_F, then energy; energies relative to the level's hyperfine-free centroid, each
     *         with its standard uncertainty (from the constants' stated u(A), u(B), for scaled constants with
     *         the n*^-3 law's error, by the Hellmann-Feynman theorem, and |dE/dB| u(B); the centroid's own
     *         uncertainty is not in it, nor that of a constant a Rydberg series' row does not give, such as B of
     *         Rb nP3/2) and its field slope dE/dB; empty when the level has no constants
     * @throws ReferenceDataException when the nucleus has a spin but no magnetic moment here
     * @throws IllegalArgumentException when the field or its uncertainty is out of range
     */
    public List<ZeemanState> zeemanStates(Species species, State state, double fieldTesla,
            double fieldUncertaintyTesla) {
        Optional<HyperfineConstants> constants = hyperfineConstants(species, state);
        if (constants.isEmpty()) {
            return List.of();
        }
        int twoI = nucleus(species).twiceSpin();
        double gI = AlkaliHyperfine.nuclearG(this, species);
        // a Rydberg series' constant the row does not give (B of Rb nP3/2, nD5/2) enters without an uncertainty,
        // as in the ladders (AlkaliHyperfine.ladderComponents), so that the stated ones and the field's still count
        HyperfineConstants c = alkaliHyperfine().constants(species, state).isPresent() ? constants.get()
                : constants.get().withStatedUncertaintiesOnly();
        return ZeemanStructure.eigenstates(twoI, state.twoJ(), c,
                ZeemanStructure.landeG(state.l(), state.twoJ()), gI, fieldTesla, fieldUncertaintyTesla);
    }

    /**
     * @param species a neutral alkali atom (any isotope)
     * @return the built-in Marinescu et al. (1994) core model potential of the element (model
     *         potentials are not a kind of data set; a registry cannot replace them)
     * @throws ReferenceDataException when the element has none
     */
    public ModelPotential modelPotential(Species species) {
        ModelPotential potential = RydbergData.potentials().get(species.z());
        if (potential == null || species.charge() != 0) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET, "no model potential for "
                    + species.notation() + "; available for Li, Na, K, Rb, Cs");
        }
        return potential;
    }

    // ------------------------------------------------------------------ level lists

    /**
     * @param species a species (without mass number: any isotope's list; with one: that isotope's
     *                or the natural element's)
     * @return the level list of highest precedence that covers it, whose lines
     *         {@link DataLines#sources} computes by the Ritz combination principle; empty when none
     * @throws ReferenceDataException when the listed set does not load
     */
    public Optional<LevelList> levelList(Species species) {
        Objects.requireNonNull(species, "species");
        for (DataRegistry.Listing listing : registry.find(DataKind.LEVELS, species)) {
            DataSet set = registry.load(listing.info().id());
            if (set instanceof LevelList) {
                return Optional.of((LevelList) set);
            }
        }
        return Optional.empty();
    }

    /**
     * The companion line list that gives a level list's Ritz lines their transition
     * probabilities: the {@link DataKind#LINES} set of highest precedence that covers the species
     * and gives at least one line an Einstein A with both level labels (for He I the built-in
     * {@code lines-he-i}; a user's line list with labels and A, given as a file, comes first).
     *
     * @param species a species with a level list
     * @return that line list; empty when no line list of the context gives A by level labels
     * @throws ReferenceDataException when the listed set does not load
     */
    public Optional<LineList> transitionProbabilities(Species species) {
        Objects.requireNonNull(species, "species");
        for (DataRegistry.Listing listing : registry.find(DataKind.LINES, species)) {
            DataSet set = registry.load(listing.info().id());
            if (set instanceof LineList list) {
                for (int i = 0; i < list.size(); i++) {
                    if (list.einsteinA(i).isPresent() && list.lower(i) != null && list.upper(i) != null
                            && list.species(i).z() == species.z() && list.species(i).charge() == species.charge()) {
                        return Optional.of(list);
                    }
                }
            }
        }
        return Optional.empty();
    }

    /**
     * @return the species of every level list in this context other than one-electron ions' and
     *         alkali atoms' (those have their own models), ordered by Z and charge; immutable
     */
    public List<Species> levelSpecies() {
        Set<Species> found = new HashSet<>();
        for (DataRegistry.Listing listing : registry.list()) {
            if (listing.info().kind() == DataKind.LEVELS) {
                listing.info().species().stream().filter(s -> !s.isHydrogenLike())
                        .filter(s -> alkaliSpecies().stream().noneMatch(a -> a.z() == s.z() && s.charge() == 0))
                        .forEach(found::add);
            }
        }
        return found.stream().sorted(Comparator.comparingInt(Species::z).thenComparingInt(Species::charge)
                .thenComparingInt(Species::massNumber)).collect(Collectors.toUnmodifiableList());
    }

    // ------------------------------------------------------------------ line lists

    /**
     * @param species a lamp's species, e.g. {@code Ne I}
     * @return the lamp line set of highest precedence for it
     * @throws ReferenceDataException ({@code unknown-data-set}) when no lamp set covers the species
     */
    public LineList lampLines(Species species) {
        return registry.lampLines(species);
    }

    /**
     * @param idOrPath a path to an existing user file, else a data set id
     * @return the set: the file as read (a quantum-defect file against this context's nuclear
     *         data), or the registry's set of that id
     * @throws ReferenceDataException ({@code unknown-data-set}) when no set has the id, or
     *                                ({@code no-such-file}) when a name that looks like a file (a
     *                                folder in it, or a .csv, .json or .txt extension) is neither
     * @throws DataFileException      when the file does not read
     */
    public DataSet dataSet(String idOrPath) {
        Objects.requireNonNull(idOrPath, "idOrPath");
        Path path = null;
        try {
            path = Path.of(idOrPath);
        } catch (InvalidPathException e) {
            // not a path: an id
        }
        if (path != null && Files.exists(path)) {
            return UserFiles.read(path, this::nuclearData).set();
        }
        try {
            return registry.load(idOrPath);
        } catch (ReferenceDataException e) {
            // A name that looks like a file (a folder in it, or a file extension) is most likely a
            // missing file: say so, not only that no data set has that id.
            if (ReferenceDataException.UNKNOWN_DATA_SET.equals(e.code()) && (idOrPath.contains("/")
                    || idOrPath.contains("\\") || idOrPath.matches(".*\\.(csv|json|txt)"))) {
                throw new ReferenceDataException(ReferenceDataException.NO_SUCH_FILE, idOrPath
                        + ": no such file (nor a data set of that name; 'ritzwerk data' lists the sets)");
            }
            throw e;
        }
    }

    /**
     * @param idOrPath a path to an existing line-list file, else the id of a line or lamp set
     * @return the line list
     * @throws ReferenceDataException ({@link ReferenceDataException#WRONG_KIND}) when the set is
     *                                not a line list, or ({@code unknown-data-set}, {@code
     *                                no-such-file}) when no set or file has the name
     * @throws DataFileException      when the file does not read
     */
    public LineList lineList(String idOrPath) {
        DataSet set = dataSet(idOrPath);
        if (!(set instanceof LineList)) {
            throw new ReferenceDataException(ReferenceDataException.WRONG_KIND, idOrPath + " is a "
                    + set.info().kind().id() + " set, not a line list");
        }
        return (LineList) set;
    }

    /**
     * @return its registry's providers in precedence order, e.g.
     *         {@code DataContext[built-in ritzwerk-hydrogen-like, ...]} (no data is read)
     */
    @Override
    public String toString() {
        return "DataContext" + registry.toString().substring("DataRegistry".length());
    }
}
