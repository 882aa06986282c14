package org.ritzwerk.refdata.internal;

import java.io.InputStream;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.ritzwerk.atom.Elements;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.MeasuredLevel;
import org.ritzwerk.data.ModelPotential;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.AlkaliHyperfine;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.LevelListFiles;
import org.ritzwerk.refdata.NuclearData;
import org.ritzwerk.refdata.QuantumDefectFiles;
import org.ritzwerk.refdata.ReferenceDataException;

/**
 * Ritzwerk's built-in Rydberg data for Li-6, Li-7, Na-23, K-39, K-40, K-41, Rb-85, Rb-87 and Cs-133
 * (Li-6, K-40 and K-41 share the natural element's quantum defects, limit and higher levels; see the
 * file headers): per isotope a
 * quantum-defect set ({@code quantum-defects-rb-87}, format {@link QuantumDefectFiles}) and the
 * measured levels below its validity ({@code levels-rb-87}, format {@link LevelListFiles}), both
 * under {@code rydberg/} with the script {@code make_rydberg_data.py} that wrote them and
 * {@code fit-residuals.txt}, the comparison that chose each series' valid-from-n; and the
 * Marinescu et al. (1994) model potentials ({@code model-potentials.csv}, format
 * {@code ritzwerk-model-potentials}, see {@link #MODEL_POTENTIAL_COLUMNS}). The file headers and
 * rows name the paper or database of every value, say which values were typed in from memory,
 * and how each row was checked (quantum-defect column {@code checked}, level column
 * {@code note}, model-potential column {@code checked}; the checks are listed in
 * {@code fit-residuals.txt}).
 *
 * <p>Typical use: {@code AlkaliAtom rb = RydbergData.builtIn().atom(Species.parse("Rb-87 I"));}
 *
 * <p>The files are read once per JVM: an isotope's two files when its set is first loaded
 * ({@link #builtInSet}, which the built-in provider uses; listing reads the files' headers only), all
 * of them on first use of {@link #builtIn()}; the sets are shared ({@link BuiltInFiles}), and the
 * object is immutable and thread-safe.
 *
 * <p><b>Built-in default, not a context.</b> {@link #builtIn()} is kept for compatibility and for
 * the built-in provider. Code that needs alkali atoms takes them from a {@link DataContext}
 * ({@link DataContext#alkaliAtom(Species)}), where a user's quantum-defect file or a third-party
 * provider can replace these sets and the nuclear data gives R_M.
 */
public final class RydbergData {

    /** Isotope file stems, in Z order. */
    static final List<String> STEMS = List.of("li-6", "li-7", "na-23", "k-39", "k-40", "k-41", "rb-85", "rb-87",
            "cs-133");

    private static final Pattern LABEL = Pattern.compile("(\\d{1,3})([spdf]) 2([SPDF])(\\d{1,2})/2");
    private static volatile RydbergData builtIn;

    /** One isotope's sets. */
    private record Entry(QuantumDefectFiles.Content content, LevelList levels) {
    }

    private final Map<Species, Entry> entries;
    private final Map<Integer, ModelPotential> potentials;

    private RydbergData(Map<Species, Entry> entries, Map<Integer, ModelPotential> potentials) {
        this.entries = entries;
        this.potentials = potentials;
    }

    /**
     * @return the built-in data, read on first use (thread-safe); the built-in default, for
     *         compatibility: code that needs alkali atoms takes them from a {@link DataContext}
     */
    public static RydbergData builtIn() {
        RydbergData data = builtIn;
        if (data == null) {
            synchronized (RydbergData.class) {
                data = builtIn;
                if (data == null) {
                    data = load();
                    builtIn = data;
                }
            }
        }
        return data;
    }

    private static RydbergData load() {
        Map<Species, Entry> entries = new LinkedHashMap<>();
        for (String stem : STEMS) {
            Entry entry = entry(stem);
            entries.put(entry.content().defects().species(), entry);
        }
        return new RydbergData(Collections.unmodifiableMap(entries), potentials());
    }

    /** One isotope's quantum-defect set and levels, read when first used and shared in the JVM. */
    private static Entry entry(String stem) {
        return BuiltInFiles.shared("rydberg/" + stem, () -> readEntry(stem));
    }

    private static Entry readEntry(String stem) {
        Listed listed = listing().get(stem);
        String qd = listed.defectsFile();
        QuantumDefectFiles.Content content = BuiltInFiles.read(qd, in -> QuantumDefectFiles.read(in, qd));
        BuiltInFiles.checked(qd, listed.defects(), content.defects());
        String lv = listed.levelsFile(); // named by the same header's 'levels' key, checked when listed
        LevelList levels = BuiltInFiles.read(lv, in -> LevelListFiles.read(in, lv));
        if (levels.unit() != Unit.PER_CENTIMETRE) {
            throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, lv + ": energies must be in cm-1");
        }
        BuiltInFiles.checked(lv, listed.levels(), levels);
        measuredLevels(levels); // checks every label now
        return new Entry(content, levels);
    }

    /** What one isotope's two files are, from their headers. */
    private record Listed(String defectsFile, DataSetInfo defects, String levelsFile, DataSetInfo levels) {
    }

    /** @return each isotope's two sets as listed, by file stem, from the files' headers only; once per JVM */
    private static Map<String, Listed> listing() {
        return BuiltInFiles.shared("rydberg/", () -> {
            Map<String, Listed> listed = new LinkedHashMap<>();
            for (String stem : STEMS) {
                String qd = "rydberg/quantum-defects-" + stem + ".csv";
                Map<String, String> header = BuiltInFiles.header(qd);
                Species species;
                try {
                    species = Species.parse(header.getOrDefault("species", ""));
                } catch (IllegalArgumentException e) {
                    throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, qd + ": species: "
                            + e.getMessage());
                }
                String levelsId = header.getOrDefault("levels", "");
                if (!DataSetInfo.isValidId(levelsId)) {
                    throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, qd + ": names no levels set");
                }
                String lv = "rydberg/" + levelsId + ".csv";
                listed.put(stem, new Listed(qd, BuiltInFiles.listed(qd, header, DataKind.QUANTUM_DEFECTS,
                        List.of(species)), lv, BuiltInFiles.listed(lv, DataKind.LEVELS, List.of(species))));
            }
            return Collections.unmodifiableMap(listed);
        });
    }

    /**
     * @return what every built-in set is (quantum defects and level tables, in file order), from the
     *         files' headers without reading their rows, for the provider
     */
    static List<DataSetInfo> listedInfos() {
        List<DataSetInfo> infos = new ArrayList<>();
        for (Listed listed : listing().values()) {
            infos.add(listed.defects());
            infos.add(listed.levels());
        }
        return infos;
    }

    /**
     * @param id a data set id
     * @return the built-in quantum-defect set or level table of that id, reading only its isotope's
     *         two files (once per JVM, the same instance {@link #builtIn()} holds); empty when no
     *         built-in set has the id
     */
    public static Optional<DataSet> builtInSet(String id) {
        for (Map.Entry<String, Listed> listed : listing().entrySet()) {
            if (listed.getValue().defects().id().equals(id)) {
                return Optional.of(entry(listed.getKey()).content().defects());
            }
            if (listed.getValue().levels().id().equals(id)) {
                return Optional.of(entry(listed.getKey()).levels());
            }
        }
        return Optional.empty();
    }

    /** @return the ids of the built-in sets, in file order */
    static List<String> builtInIds() {
        return listedInfos().stream().map(DataSetInfo::id).collect(Collectors.toList());
    }

    /** @return the model potentials of {@link #readPotentials()}, read once per JVM and shared */
    public static Map<Integer, ModelPotential> potentials() {
        return BuiltInFiles.shared("rydberg/model-potentials.csv", RydbergData::readPotentials);
    }

    /** The model-potential file format name. */
    static final String MODEL_POTENTIAL_FORMAT = "ritzwerk-model-potentials";
    /** The model-potential file's columns, in order. */
    static final List<String> MODEL_POTENTIAL_COLUMNS = List.of("element", "nuclear-charge", "core-polarizability-a0^3",
            "l", "a1-per-a0", "a2-per-a0", "a3-per-a0", "a4-per-a0^2", "cutoff-radius-a0", "checked");
    private static final List<String> MODEL_POTENTIAL_KEYS = List.of("id", "source", "provenance");

    /**
     * Reads {@code rydberg/model-potentials.csv}, Ritzwerk's model-potential format
     * ({@code ritzwerk-model-potentials}, version 1): the format line, header keys (id, title, source,
     * provenance, version, formula, note; the first three required), the column row
     * {@link #MODEL_POTENTIAL_COLUMNS} and one row per element and l, with l = 0, 1, 2, ... in order
     * (the last l of an element serves every higher l); the last column, how the row was checked, is
     * free text.
     */
    public static Map<Integer, ModelPotential> readPotentials() {
        String resource = "rydberg/model-potentials.csv";
        Map<Integer, List<ModelPotential.Parameters>> sets = new LinkedHashMap<>();
        Map<Integer, double[]> heads = new LinkedHashMap<>();
        BuiltInCsv table = BuiltInCsv.read(open(resource), resource, MODEL_POTENTIAL_FORMAT, MODEL_POTENTIAL_COLUMNS,
                true, MODEL_POTENTIAL_KEYS);
        Map<String, String> header = table.header();
        for (BuiltInCsv.Row row : table.rows()) {
            String[] f = row.f();
            try {
                int z = Elements.atomicNumber(f[0]).orElseThrow(() -> new IllegalArgumentException("unknown element " + f[0]));
                if (Integer.parseInt(f[1]) != z) {
                    throw new IllegalArgumentException("nuclear charge " + f[1] + " is not that of " + f[0]);
                }
                int l = Integer.parseInt(f[3]);
                List<ModelPotential.Parameters> list = sets.computeIfAbsent(z, k -> new ArrayList<>());
                if (l != list.size()) {
                    throw new IllegalArgumentException("expected l = " + list.size());
                }
                heads.put(z, new double[] {Double.parseDouble(f[2]), z});
                list.add(new ModelPotential.Parameters(Double.parseDouble(f[4]), Double.parseDouble(f[5]),
                        Double.parseDouble(f[6]), Double.parseDouble(f[7]), Double.parseDouble(f[8])));
            } catch (RuntimeException e) {
                throw bad(resource, row.number(), e.getMessage(), row.raw());
            }
        }
        String source = header.get("source") + " (" + Provenance.Kind.fromId(header.get("provenance")).id() + ")";
        Map<Integer, ModelPotential> out = new LinkedHashMap<>();
        for (Map.Entry<Integer, List<ModelPotential.Parameters>> e : sets.entrySet()) {
            double[] head = heads.get(e.getKey());
            out.put(e.getKey(), new ModelPotential((int) head[1], head[0], e.getValue(), source));
        }
        return Collections.unmodifiableMap(out);
    }

    private static ReferenceDataException bad(String resource, int number, String reason, String line) {
        return BuiltInCsv.bad(resource, number, reason, line);
    }

    private static InputStream open(String resource) {
        InputStream in = RydbergData.class.getResourceAsStream(BuiltInCsv.RESOURCES + resource);
        if (in == null) {
            throw new IllegalStateException("built-in data file missing from the jar: " + resource);
        }
        return in;
    }

    /** @return the isotopes covered, e.g. Rb-87 I; immutable */
    public List<Species> species() {
        return List.copyOf(entries.keySet());
    }

    /** @return the sets by id */
    public Map<String, Object> byId() {
        Map<String, Object> sets = new LinkedHashMap<>();
        for (Entry e : entries.values()) {
            sets.put(e.content().defects().info().id(), e.content().defects());
            sets.put(e.levels().info().id(), e.levels());
        }
        return sets;
    }

    private Entry entry(Species species) {
        Species key = species;
        if (species.massNumber() == 0) {
            int a = NuclearData.builtIn().defaultMassNumber(species.z()).orElse(0);
            key = new Species(species.z(), a, species.charge());
        }
        Entry entry = entries.get(key);
        if (entry == null) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET, "no built-in Rydberg data for "
                    + species + "; available: " + entries.keySet().stream().map(Species::notation)
                            .collect(Collectors.joining(", ")));
        }
        return entry;
    }

    /**
     * @param species a neutral alkali isotope (without mass number: the most abundant one, e.g. Rb-85)
     * @return its quantum-defect set
     * @throws ReferenceDataException when the species is not covered
     */
    public QuantumDefectFiles.Content quantumDefects(Species species) {
        return entry(species).content();
    }

    /**
     * @param species a neutral alkali isotope (without mass number: the most abundant one)
     * @return its measured low-lying levels as tabulated
     * @throws ReferenceDataException when the species is not covered
     */
    public LevelList levels(Species species) {
        return entry(species).levels();
    }

    /**
     * @param species a neutral alkali isotope (without mass number: the most abundant one)
     * @return the engine's model of that atom: the quantum defects, the measured levels and the core
     *         polarizabilities of the built-in data, with the isotope's own D-line centroids as its
     *         first p levels ({@link AlkaliHyperfine#withResonanceLevels}); every dipole element
     *         computed (the bare model, without the published elements that
     *         {@link DataContext#alkaliAtom} adds: {@code atom(s).withPublishedDipoles(
     *         AlkaliDipoles.builtIn().elements(atom(s), s))} gives the same)
     * @throws ReferenceDataException when the species is not covered
     */
    public AlkaliAtom atom(Species species) {
        Entry entry = entry(species);
        return AlkaliAtom.of(entry.content().defects(), AlkaliHyperfine.builtIn().withResonanceLevels(
                entry.content().defects().species(), measuredLevels(entry.levels())));
    }

    /**
     * @param species a neutral alkali atom (any isotope)
     * @return the Marinescu et al. (1994) core model potential of the element, for
     *         {@link AlkaliAtom#withModelPotential}
     * @throws ReferenceDataException when the element has none in the built-in data
     */
    public ModelPotential modelPotential(Species species) {
        ModelPotential potential = potentials.get(species.z());
        if (potential == null || species.charge() != 0) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET, "no built-in model potential for "
                    + species + "; available for Li, Na, K, Rb, Cs");
        }
        return potential;
    }

    /**
     * @param levels a level table in cm^-1 whose labels read like {@code 5p 2P3/2} (n, l letter s to f,
     *               2, the capital letter, j)
     * @return the levels as the engine takes them, each with the table's citation as source
     * @throws ReferenceDataException naming the first label that does not read
     */
    public static List<MeasuredLevel> measuredLevels(LevelList levels) {
        if (levels.unit() != Unit.PER_CENTIMETRE) {
            throw new IllegalArgumentException("measured levels must be in cm-1, got " + levels.unit().symbol());
        }
        List<MeasuredLevel> out = new ArrayList<>();
        String source = levels.info().id() + " (" + levels.info().provenance().render() + ")";
        for (int i = 0; i < levels.size(); i++) {
            Matcher m = LABEL.matcher(levels.label(i));
            if (!m.matches() || !m.group(3).equals(m.group(2).toUpperCase(java.util.Locale.ROOT))) {
                throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, levels.info().id() + ": level "
                        + "label '" + levels.label(i) + "' does not read as n, l and j (e.g. 5p 2P3/2)");
            }
            State state;
            try {
                state = State.of(Integer.parseInt(m.group(1)), "spdf".indexOf(m.group(2).charAt(0)),
                        Integer.parseInt(m.group(4)));
            } catch (IllegalArgumentException e) {
                throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, levels.info().id() + ": level "
                        + "label '" + levels.label(i) + "': " + e.getMessage());
            }
            out.add(new MeasuredLevel(state, levels.energy(i), source, levels.uncertainty(i).orElse(Double.NaN)));
        }
        return out;
    }
}
