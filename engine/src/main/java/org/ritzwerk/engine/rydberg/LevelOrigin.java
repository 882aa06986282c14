package org.ritzwerk.engine.rydberg;

/** Where a level energy comes from. */
public enum LevelOrigin {
    /** A measured energy given to the model (e.g. from NIST ASD). */
    MEASURED,
    /** The modified Rydberg-Ritz formula of a quantum-defect series, within its validity. */
    QUANTUM_DEFECT_FIT,
    /** For l beyond the series: the quantum defect estimated from the core's dipole and quadrupole polarizabilities. */
    CORE_POLARIZATION,
    /** For l beyond the series and no core polarizabilities given: quantum defect zero. */
    HYDROGENIC
}
