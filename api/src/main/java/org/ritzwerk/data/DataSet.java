package org.ritzwerk.data;

/** A loaded reference data set: lines, levels, isotopes or quantum defects, with what it is. */
public sealed interface DataSet permits LineList, LevelList, IsotopeTable, QuantumDefects {

    /** @return the id, kind, title, version, provenance and coverage */
    DataSetInfo info();

    /** @return the number of entries */
    int size();
}
