package org.ritzwerk.refdata.internal;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
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
 * {@link DataContext#transitionProbabilities} finds. The Sr list's covariance comes as shared
 * uncertainty components (935 contributions of 17 components, about half the file), cheap enough to
 * read whole when the sets are first listed. Thread-safe; files are read on first use.
 */
public final class LevelProvider implements ReferenceDataProvider {

    private static final List<String> FILES = List.of("levels-he-i", "lines-he-i", "levels-sr-i");

    /** The sets, read from the jar on first use (listing needs their headers anyway). */
    private volatile Map<String, DataSet> sets;

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
        sets().values().forEach(set -> infos.add(set.info()));
        return infos;
    }

    @Override
    public DataSet load(String dataSetId) {
        if (!FILES.contains(dataSetId)) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET,
                    "no level set '" + dataSetId + "'; known: " + String.join(", ", FILES));
        }
        return sets().get(dataSetId);
    }

    private Map<String, DataSet> sets() {
        Map<String, DataSet> read = sets;
        if (read == null) {
            Map<String, DataSet> all = new LinkedHashMap<>();
            for (String id : FILES) {
                all.put(id, read(id));
            }
            read = Collections.unmodifiableMap(all);
            sets = read;
        }
        return read;
    }

    private static DataSet read(String id) {
        String resource = "levels/" + id + ".csv";
        try (InputStream in = LevelProvider.class.getResourceAsStream(BuiltInCsv.RESOURCES + resource)) {
            if (in == null) {
                throw new IllegalStateException("built-in level file missing from the jar: " + resource);
            }
            return id.startsWith("lines-") ? LineListFiles.read(in, resource, DataKind.LINES)
                    : LevelListFiles.read(in, resource);
        } catch (IOException e) {
            throw new UncheckedIOException(resource + ": " + e.getMessage(), e);
        }
    }
}
