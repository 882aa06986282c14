package org.ritzwerk.refdata.internal;

import java.util.List;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Origin;
import org.ritzwerk.data.ReferenceDataProvider;
import org.ritzwerk.refdata.LevelListFiles;
import org.ritzwerk.refdata.LineListFiles;

/**
 * Built-in level lists of species beyond one-electron ions and alkali atoms, whose lines come by
 * the Ritz combination principle: He I ({@code levels-he-i}, n up to 10, singlets and triplets; n = 5
 * to 10 predicted by {@code make_helium_levels.py}'s Rydberg-Ritz fit of the recalled n = 2-4) and
 * Sr-88 I ({@code levels-sr-i}: five Rydberg series n = 20 to 60 computed by
 * {@code make_strontium_levels.py} from the published Rydberg-Ritz parameters in
 * {@code rydberg-ritz-sr-88.csv} and the published Sr-88 limit, with 5s5p 3P1 and 1P1). Each row is
 * from memory or computed from values from memory, with its independent check named in its note or
 * in the checks file beside it (see {@code levels/README.md}).
 * Beside each level list, its companion line list of transition probabilities
 * ({@code lines-he-i}: A between the same level labels, by the Coulomb approximation from the level
 * energies, the lines to the ground level from memory; see {@code levels/README.md}), which
 * {@link DataContext#transitionProbabilities} finds. The Sr list's covariance comes as shared
 * uncertainty components (935 contributions of 17 components, about half the file). Thread-safe.
 * Listing reads the files' headers only; a set's rows (and the Sr covariance) are read when it is
 * first loaded, once per JVM, and shared by every registry ({@link BuiltInFiles}).
 */
public final class LevelProvider implements ReferenceDataProvider {

    /** Each set's id and the species its rows cover. */
    private static final BuiltInFiles.Folder SETS = BuiltInFiles.Folder.of("levels/", "level set",
            id -> id.startsWith("lines-") ? DataKind.LINES : DataKind.LEVELS,
            (in, resource, kind) -> kind == DataKind.LINES ? LineListFiles.read(in, resource, kind)
                    : LevelListFiles.read(in, resource),
            "levels-he-i", "He I", "lines-he-i", "He I", "levels-sr-i", "Sr-88 I");

    @Override
    public String id() {
        return "ritzwerk-levels";
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
