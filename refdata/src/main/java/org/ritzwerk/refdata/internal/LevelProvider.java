package org.ritzwerk.refdata.internal;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Origin;
import org.ritzwerk.data.ReferenceDataProvider;
import org.ritzwerk.refdata.LevelListFiles;
import org.ritzwerk.refdata.LineListFiles;
import org.ritzwerk.refdata.ReferenceDataException;

/**
 * Built-in level lists of species beyond one-electron ions and alkali atoms, whose lines come by
 * the Ritz combination principle: He I ({@code levels-he-i}, n up to 10, singlets and triplets; n = 5
 * to 10 predicted by {@code make_helium_levels.py}'s Rydberg-Ritz fit of the recalled n = 2-4) and
 * Sr-88 I ({@code levels-sr-i}: five Rydberg series n = 20 to 60 computed by
 * {@code make_strontium_levels.py} from the published Rydberg-Ritz parameters in
 * {@code rydberg-ritz-sr-88.csv} and the published Sr-88 limit, with 5s5p 3P1 and 1P1). Each row is
 * from memory or computed from values from memory, with its independent check named in its note or
 * in the checks file beside it (see {@code levels/README.md}).
 * Beside each level list, its companion line list of transition probabilities
 * ({@code lines-he-i}: A between the same level labels, by the Coulomb approximation from the level
 * energies, the lines to the ground level from memory; see {@code levels/README.md}), which
 * {@link DataContext#transitionProbabilities} finds. Thread-safe; files are read on first use.
 */
public final class LevelProvider implements ReferenceDataProvider {

    private static final List<String> FILES = List.of("levels-he-i", "lines-he-i", "levels-sr-i");

    /** The sets, read from the jar on first use (listing needs their headers anyway). */
    private volatile Map<String, Entry> sets;

    /**
     * One built-in file: its info for listing and the set, read whole on first load. A level list with
     * correlations (levels-sr-i: 20,503 pairs, most of the file) is listed from its levels alone, so
     * that listing the data (every command does) does not read and check the correlations; the set
     * with them is read when it is first loaded.
     */
    private static final class Entry {
        final DataSetInfo info;
        final String resource;
        final String text;
        private volatile DataSet set;

        Entry(DataSetInfo info, String resource, String text, DataSet set) {
            this.info = info;
            this.resource = resource;
            this.text = text;
            this.set = set;
        }

        DataSet set() {
            DataSet read = set;
            if (read == null) {
                synchronized (this) {
                    read = set;
                    if (read == null) {
                        read = LevelListFiles.readCsv(text, resource);
                        set = read;
                    }
                }
            }
            return read;
        }
    }

    @Override
    public String id() {
        return "ritzwerk-levels";
    }

    @Override
    public Origin origin() {
        return Origin.BUILT_IN;
    }

    @Override
    public List<DataSetInfo> dataSets() {
        List<DataSetInfo> infos = new ArrayList<>();
        sets().values().forEach(entry -> infos.add(entry.info));
        return infos;
    }

    @Override
    public DataSet load(String dataSetId) {
        if (!FILES.contains(dataSetId)) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET,
                    "no level set '" + dataSetId + "'; known: " + String.join(", ", FILES));
        }
        return sets().get(dataSetId).set();
    }

    private Map<String, Entry> sets() {
        Map<String, Entry> read = sets;
        if (read == null) {
            Map<String, Entry> all = new LinkedHashMap<>();
            for (String id : FILES) {
                all.put(id, read(id));
            }
            read = Collections.unmodifiableMap(all);
            sets = read;
        }
        return read;
    }

    private static Entry read(String id) {
        String resource = "levels/" + id + ".csv";
        try (InputStream in = LevelProvider.class.getResourceAsStream(BuiltInCsv.RESOURCES + resource)) {
            if (in == null) {
                throw new IllegalStateException("built-in level file missing from the jar: " + resource);
            }
            if (id.startsWith("lines-")) {
                DataSet set = LineListFiles.read(in, resource, DataKind.LINES);
                return new Entry(set.info(), resource, null, set);
            }
            String text = new String(in.readAllBytes(), StandardCharsets.UTF_8);
            int correlations = text.indexOf("\n# " + LevelListFiles.CORRELATIONS + "\n");
            if (correlations < 0) {
                DataSet set = LevelListFiles.readCsv(text, resource);
                return new Entry(set.info(), resource, null, set);
            }
            // listed from the levels alone (the same header, so the same info); read whole on first load
            DataSet levels = LevelListFiles.readCsv(text.substring(0, correlations + 1), resource);
            return new Entry(levels.info(), resource, text, null);
        } catch (IOException e) {
            throw new UncheckedIOException(resource + ": " + e.getMessage(), e);
        }
    }
}
