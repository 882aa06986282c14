package org.ritzwerk.refdata.internal;

import java.util.List;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Origin;
import org.ritzwerk.data.ReferenceDataProvider;
import org.ritzwerk.refdata.LineListFiles;

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
    private static final BuiltInFiles.Folder SETS = BuiltInFiles.Folder.of("lamps/", "lamp set",
            id -> DataKind.LAMP_LINES, LineListFiles::read, "lamp-hg-i", "Hg I", "lamp-ne-i", "Ne I", "lamp-ar-i",
            "Ar I", "lamp-kr-i", "Kr I", "lamp-xe-i", "Xe I", "lamp-cd-i", "Cd I", "lamp-zn-i", "Zn I");

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
        return SETS.infos();
    }

    /** @return the set, read from the jar when first loaded in this JVM and shared from then on */
    @Override
    public DataSet load(String dataSetId) {
        return SETS.load(dataSetId);
    }
}
