package org.ritzwerk.refdata.internal;

import java.util.Optional;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.NuclearData;

/**
 * What Ritzwerk's own nuclear providers (the built-in one and a user's isotope file) know about an
 * isotope table beyond its {@link org.ritzwerk.data.IsotopeTable} record: the default isotopes
 * that go with it (with their own provenance) and the name messages give it. {@link DataContext}
 * asks for them; a third party's isotope table gives its record only (the built-in default
 * isotopes then stay in force below it). Quantum-defect sets need nothing here: their record
 * carries core polarizabilities and the id of their levels set. Not exported; implementations
 * are thread-safe.
 */
public interface SetDetails {

    /**
     * @param dataSetId the id of a {@link org.ritzwerk.data.DataKind#NUCLEAR} set of this provider
     * @return its nuclear data, default isotopes included, if the provider has them
     */
    default Optional<NuclearData> nuclearData(String dataSetId) {
        return Optional.empty();
    }
}
