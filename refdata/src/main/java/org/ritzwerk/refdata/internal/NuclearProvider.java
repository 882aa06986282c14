package org.ritzwerk.refdata.internal;

import java.util.List;
import java.util.Optional;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Origin;
import org.ritzwerk.data.ReferenceDataProvider;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.NuclearData;
import org.ritzwerk.refdata.ReferenceDataException;

/**
 * The built-in nuclear data ({@link NuclearData#builtIn()}) as a provider, with its table of
 * default isotopes for a {@link DataContext}. Thread-safe.
 */
public final class NuclearProvider implements ReferenceDataProvider, SetDetails {

    @Override
    public String id() {
        return "ritzwerk-nuclear";
    }

    @Override
    public Origin origin() {
        return Origin.BUILT_IN;
    }

    @Override
    public List<DataSetInfo> dataSets() {
        return List.of(NuclearData.builtIn().info());
    }

    @Override
    public DataSet load(String dataSetId) {
        if (!NuclearData.DATA_SET_ID.equals(dataSetId)) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET,
                    "no nuclear set '" + dataSetId + "'; known: " + NuclearData.DATA_SET_ID);
        }
        return NuclearData.builtIn().table();
    }

    @Override
    public Optional<NuclearData> nuclearData(String dataSetId) {
        return NuclearData.DATA_SET_ID.equals(dataSetId) ? Optional.of(NuclearData.builtIn()) : Optional.empty();
    }
}
