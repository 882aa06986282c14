package org.ritzwerk.data;

import java.util.List;
import java.util.Objects;

/**
 * Nuclear data of isotopes, ordered by Z and A. Immutable and thread-safe.
 *
 * @param info     what the table is (kind {@link DataKind#NUCLEAR})
 * @param isotopes the rows
 */
public record IsotopeTable(DataSetInfo info, List<Isotope> isotopes) implements DataSet {

    /**
     * Validates and copies.
     *
     * @param info     what the table is (kind {@link DataKind#NUCLEAR})
     * @param isotopes the rows
     */
    public IsotopeTable {
        Objects.requireNonNull(info, "info");
        if (info.kind() != DataKind.NUCLEAR) {
            throw new IllegalArgumentException("an isotope table needs kind nuclear, got " + info.kind().id());
        }
        isotopes = List.copyOf(isotopes);
    }

    @Override
    public int size() {
        return isotopes.size();
    }
}
