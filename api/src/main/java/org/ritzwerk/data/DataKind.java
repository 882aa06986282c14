package org.ritzwerk.data;

import java.util.Locale;

/** The kinds of reference data set. */
public enum DataKind {
    /** Energy levels ({@link LevelList}). */
    LEVELS,
    /** Spectral lines ({@link LineList}). */
    LINES,
    /** Calibration-lamp lines ({@link LineList}, wavelengths in air as lamps are used). */
    LAMP_LINES,
    /** Quantum-defect parameters of alkali atoms ({@link QuantumDefects}). */
    QUANTUM_DEFECTS,
    /** Nuclear data of isotopes ({@link IsotopeTable}). */
    NUCLEAR;

    /** @return the lower-case name with dashes, e.g. {@code lamp-lines} */
    public String id() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }
}
