package org.ritzwerk.refdata;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.MeasuredLevel;
import org.ritzwerk.engine.rydberg.State;
import org.ritzwerk.quantity.Unit;

/**
 * Ritzwerk's built-in Rydberg data for Li-7, Na-23, K-39, Rb-85, Rb-87 and Cs-133: per isotope a
 * quantum-defect set ({@code quantum-defects-rb-87}, format {@link QuantumDefectFiles}) and the
 * measured levels below its validity ({@code levels-rb-87}, format {@link LevelListFiles}), both
 * under {@code rydberg/} with the script {@code make_rydberg_data.py} that wrote them and
 * {@code fit-residuals.txt}, the comparison that chose each series' valid-from-n. The file
 * headers name the paper of every series, the public copy each number was read in, and which
 * values are from memory (the Rb-85 ionisation limit).
 *
 * <p>Typical use: {@code AlkaliAtom rb = RydbergData.builtIn().atom(Species.parse("Rb-87 I"));}
 *
 * <p>The files are read once, on first use of {@link #builtIn()}; the object is immutable and
 * thread-safe.
 */
public final class RydbergData {

    /** Isotope file stems, in Z order. */
    static final List<String> STEMS = List.of("li-7", "na-23", "k-39", "rb-85", "rb-87", "cs-133");

    private static final Pattern LABEL = Pattern.compile("(\\d{1,3})([spdf]) 2([SPDF])(\\d{1,2})/2");
    private static volatile RydbergData builtIn;

    /** One isotope's sets. */
    private record Entry(QuantumDefectFiles.Content content, LevelList levels) {
    }

    private final Map<Species, Entry> entries;

    private RydbergData(Map<Species, Entry> entries) {
        this.entries = entries;
    }

    /** @return the built-in data, read on first use (thread-safe) */
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
            QuantumDefectFiles.Content content;
            String qd = "rydberg/quantum-defects-" + stem + ".csv";
            try (InputStream in = open(qd)) {
                content = QuantumDefectFiles.read(in, qd);
            } catch (IOException e) {
                throw new UncheckedIOException(qd + ": " + e.getMessage(), e);
            }
            String lv = "rydberg/" + content.levelsId() + ".csv";
            LevelList levels;
            try (InputStream in = open(lv)) {
                levels = LevelListFiles.read(in, lv);
            } catch (IOException e) {
                throw new UncheckedIOException(lv + ": " + e.getMessage(), e);
            }
            if (levels.unit() != Unit.PER_CENTIMETRE) {
                throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, lv + ": energies must be in cm-1");
            }
            measuredLevels(levels); // checks every label now
            entries.put(content.defects().species(), new Entry(content, levels));
        }
        return new RydbergData(Collections.unmodifiableMap(entries));
    }

    private static InputStream open(String resource) {
        InputStream in = RydbergData.class.getResourceAsStream(resource);
        if (in == null) {
            throw new IllegalStateException("built-in data file missing from the jar: " + resource);
        }
        return in;
    }

    /** @return the isotopes covered, e.g. Rb-87 I; immutable */
    public List<Species> species() {
        return List.copyOf(entries.keySet());
    }

    /** @return what every set is (quantum defects and level tables), for the provider */
    List<DataSetInfo> infos() {
        List<DataSetInfo> infos = new ArrayList<>();
        for (Entry e : entries.values()) {
            infos.add(e.content().defects().info());
            infos.add(e.levels().info());
        }
        return infos;
    }

    /** @return the sets by id */
    Map<String, Object> byId() {
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
     *         polarizabilities of the built-in data
     * @throws ReferenceDataException when the species is not covered
     */
    public AlkaliAtom atom(Species species) {
        Entry entry = entry(species);
        return AlkaliAtom.of(entry.content().defects(), measuredLevels(entry.levels()), entry.content().core());
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
            out.add(new MeasuredLevel(state, levels.energy(i), source));
        }
        return out;
    }
}
