package org.ritzwerk.refdata;

import java.util.Optional;

/**
 * What Ritzwerk's own providers (the built-in ones and a user's file) know about a set beyond its
 * {@link org.ritzwerk.data.DataSet} record: the default isotopes that go with an isotope table,
 * and the core polarizabilities and the levels set named by a quantum-defect file.
 * {@link DataContext} asks for them; a provider without them (a third party's) gives its records
 * only. Package-private; implementations are thread-safe.
 */
interface SetDetails {

    /**
     * @param dataSetId the id of a {@link org.ritzwerk.data.DataKind#NUCLEAR} set of this provider
     * @return its nuclear data, default isotopes included, if the provider has them
     */
    default Optional<NuclearData> nuclearData(String dataSetId) {
        return Optional.empty();
    }

    /**
     * @param dataSetId the id of a {@link org.ritzwerk.data.DataKind#QUANTUM_DEFECTS} set of this provider
     * @return the whole quantum-defect file behind it, if the provider has it
     */
    default Optional<QuantumDefectFiles.Content> quantumDefects(String dataSetId) {
        return Optional.empty();
    }
}
