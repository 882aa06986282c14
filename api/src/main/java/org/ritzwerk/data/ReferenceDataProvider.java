package org.ritzwerk.data;

import java.util.List;

/**
 * A source of reference data sets, found through {@link java.util.ServiceLoader}: a jar adds data
 * by implementing this interface and declaring it, in {@code module-info.java} with
 * {@code provides org.ritzwerk.data.ReferenceDataProvider with ...} and, for the class path, in
 * {@code META-INF/services/org.ritzwerk.data.ReferenceDataProvider}. Ritzwerk never modifies a
 * provider's data.
 *
 * <p>Implementations must be thread-safe and should load lazily: {@link #dataSets()} is called to
 * list what exists, {@link #load(String)} only when a set is used (the registry caches it).
 */
public interface ReferenceDataProvider {

    /** @return a stable id for this provider, e.g. {@code acme-lamps}; same rules as data set ids */
    String id();

    /**
     * @return where the data comes from; a provider found through ServiceLoader that is not
     *         Ritzwerk's own ranks as {@link Origin#THIRD_PARTY} whatever it says here, except
     *         that it may not claim {@link Origin#USER}
     */
    default Origin origin() {
        return Origin.THIRD_PARTY;
    }

    /** @return among providers of the same origin, higher wins; 0 by default */
    default int priority() {
        return 0;
    }

    /** @return the sets this provider offers, without loading them */
    List<DataSetInfo> dataSets();

    /**
     * @param dataSetId an id from {@link #dataSets()}
     * @return the loaded set, whose {@link DataSet#info()} equals the listed one
     * @throws org.ritzwerk.RitzwerkException when the set cannot be loaded, with the reason
     */
    DataSet load(String dataSetId);
}
