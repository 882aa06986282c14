package org.ritzwerk.refdata.internal;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ritzwerk.atom.Species;
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
 * Users should check their own lamp's data. Thread-safe. Listing reads the files' headers only; a set's
 * rows are read when it is first loaded, once per JVM, and shared by every registry ({@link BuiltInFiles}).
 */
public final class LampProvider implements ReferenceDataProvider {

    /** Each set's id and the species its rows cover. */
    private static final Map<String, String> FILES = orderedMap("lamp-hg-i", "Hg I", "lamp-ne-i", "Ne I",
            "lamp-ar-i", "Ar I", "lamp-kr-i", "Kr I", "lamp-xe-i", "Xe I", "lamp-cd-i", "Cd I", "lamp-zn-i", "Zn I");

    @Override
    public String id() {
        return "ritzwerk-lamps";
    }

    @Override
    public Origin origin() {
        return Origin.BUILT_IN;
    }

    /** @return every set's info, from the files' headers (no row is read), once per JVM */
    @Override
    public List<DataSetInfo> dataSets() {
        return List.copyOf(infos().values());
    }

    private static Map<String, DataSetInfo> infos() {
        return BuiltInFiles.shared("lamps/", () -> {
            Map<String, DataSetInfo> infos = new LinkedHashMap<>();
            FILES.forEach((id, species) -> infos.put(id, BuiltInFiles.listed(resource(id), DataKind.LAMP_LINES,
                    List.of(Species.parse(species)))));
            return Collections.unmodifiableMap(infos);
        });
    }

    /** @return the set, read from the jar when first loaded in this JVM and shared from then on */
    @Override
    public DataSet load(String dataSetId) {
        if (!FILES.containsKey(dataSetId)) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET,
                    "no lamp set '" + dataSetId + "'; known: " + String.join(", ", FILES.keySet()));
        }
        String resource = resource(dataSetId);
        return BuiltInFiles.shared(resource, () -> BuiltInFiles.checked(resource, infos().get(dataSetId),
                read(resource)));
    }

    private static String resource(String id) {
        return "lamps/" + id + ".csv";
    }

    static Map<String, String> orderedMap(String... keysAndValues) {
        Map<String, String> map = new LinkedHashMap<>();
        for (int k = 0; k < keysAndValues.length; k += 2) {
            map.put(keysAndValues[k], keysAndValues[k + 1]);
        }
        return Collections.unmodifiableMap(map);
    }

    private static LineList read(String resource) {
        return BuiltInFiles.read(resource, in -> LineListFiles.read(in, resource, DataKind.LAMP_LINES));
    }
}
