package org.ritzwerk.refdata.internal;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.Origin;
import org.ritzwerk.data.ReferenceDataProvider;
import org.ritzwerk.refdata.LevelListFiles;
import org.ritzwerk.refdata.ReferenceDataException;

/**
 * Built-in level lists of species beyond one-electron ions and alkali atoms, whose lines come by
 * the Ritz combination principle: He I ({@code levels-he-i}, n up to 4, singlets and triplets). Each
 * row is from memory with its independent check named in its note (see {@code levels/README.md}).
 * Thread-safe; files are read on first use.
 */
public final class LevelProvider implements ReferenceDataProvider {

    private static final List<String> FILES = List.of("levels-he-i");

    /** The sets, read from the jar on first use (listing needs their headers anyway). */
    private volatile Map<String, LevelList> sets;

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

    private Map<String, LevelList> sets() {
        Map<String, LevelList> read = sets;
        if (read == null) {
            Map<String, LevelList> all = new LinkedHashMap<>();
            for (String id : FILES) {
                all.put(id, read(id));
            }
            read = Collections.unmodifiableMap(all);
            sets = read;
        }
        return read;
    }

    private static LevelList read(String id) {
        String resource = "levels/" + id + ".csv";
        try (InputStream in = LevelProvider.class.getResourceAsStream(BuiltInCsv.RESOURCES + resource)) {
            if (in == null) {
                throw new IllegalStateException("built-in level file missing from the jar: " + resource);
            }
            return LevelListFiles.read(in, resource);
        } catch (IOException e) {
            throw new UncheckedIOException(resource + ": " + e.getMessage(), e);
        }
    }
}
