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
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Origin;
import org.ritzwerk.data.ReferenceDataProvider;
import org.ritzwerk.refdata.LineListFiles;
import org.ritzwerk.refdata.ReferenceDataException;

/**
 * Built-in calibration-lamp line sets in air (Hg I, Ne I, Ar I, Kr I, Xe I, Cd I, Zn I) with the wavelengths
 * and intensities of the strong-lines tables of the NIST Handbook of Basic Atomic Spectroscopic
 * Data (Sansonetti &amp; Martin 2005), marked from memory, each row carrying the independent check
 * it passed (see {@code lamps/README.md}); stored in the project's own line-list format under
 * {@code lamps/} with the full citation in each header.
 * Users should check their own lamp's data. Thread-safe; files are read when a set is loaded.
 */
public final class LampProvider implements ReferenceDataProvider {

    private static final List<String> FILES = List.of("lamp-hg-i", "lamp-ne-i", "lamp-ar-i", "lamp-kr-i", "lamp-xe-i",
            "lamp-cd-i", "lamp-zn-i");

    @Override
    public String id() {
        return "ritzwerk-lamps";
    }

    @Override
    public Origin origin() {
        return Origin.BUILT_IN;
    }

    /** The sets, read from the jar on first use (listing needs their headers anyway). */
    private volatile Map<String, LineList> sets;

    @Override
    public List<DataSetInfo> dataSets() {
        List<DataSetInfo> infos = new ArrayList<>();
        sets().values().forEach(set -> infos.add(set.info()));
        return infos;
    }

    private Map<String, LineList> sets() {
        Map<String, LineList> read = sets;
        if (read == null) {
            Map<String, LineList> all = new LinkedHashMap<>();
            for (String id : FILES) {
                all.put(id, read(id));
            }
            read = Collections.unmodifiableMap(all);
            sets = read;
        }
        return read;
    }

    @Override
    public DataSet load(String dataSetId) {
        if (!FILES.contains(dataSetId)) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET,
                    "no lamp set '" + dataSetId + "'; known: " + String.join(", ", FILES));
        }
        return sets().get(dataSetId);
    }

    private static LineList read(String id) {
        String resource = "lamps/" + id + ".csv";
        try (InputStream in = LampProvider.class.getResourceAsStream(BuiltInCsv.RESOURCES + resource)) {
            if (in == null) {
                throw new IllegalStateException("built-in lamp file missing from the jar: " + resource);
            }
            return LineListFiles.read(in, resource, DataKind.LAMP_LINES);
        } catch (IOException e) {
            throw new UncheckedIOException(resource + ": " + e.getMessage(), e);
        }
    }
}
