package org.ritzwerk.refdata.internal;

import java.util.List;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Origin;
import org.ritzwerk.data.ReferenceDataProvider;
import org.ritzwerk.refdata.ReferenceDataException;

/**
 * The built-in Rydberg data ({@link RydbergData}) as a provider: quantum-defect sets
 * {@code quantum-defects-<atom>} and measured low levels {@code levels-<atom>} for Li-6, Li-7, Na-23,
 * K-39, K-40, K-41, Rb-85, Rb-87 and Cs-133. Each quantum-defect record carries its core polarizabilities and
 * the id of its levels set, as a third party's may. Thread-safe. Listing reads the files' headers
 * only; an isotope's two files are read when one of its sets is first loaded, once per JVM, and
 * shared by every registry ({@link BuiltInFiles}).
 */
public final class RydbergProvider implements ReferenceDataProvider {

    @Override
    public String id() {
        return "ritzwerk-rydberg";
    }

    @Override
    public Origin origin() {
        return Origin.BUILT_IN;
    }

    @Override
    public List<DataSetInfo> dataSets() {
        return RydbergData.listedInfos();
    }

    @Override
    public DataSet load(String dataSetId) {
        return RydbergData.builtInSet(dataSetId).orElseThrow(() -> new ReferenceDataException(
                ReferenceDataException.UNKNOWN_DATA_SET, "no Rydberg set '" + dataSetId + "'; known: "
                        + String.join(", ", RydbergData.builtInIds())));
    }
}
