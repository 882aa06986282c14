package org.ritzwerk.refdata.internal;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Isotope;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Origin;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.ReferenceDataProvider;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LevelTable;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.NuclearData;
import org.ritzwerk.refdata.ReferenceDataException;

/**
 * Computed data sets: the levels and lines (n &lt;= 10, QED tier; Dirac above Z = 30) of the
 * one-electron ion of every isotope in the built-in nuclear data that the engine can model,
 * e.g. {@code computed-he-ii-levels} and {@code computed-he-ii-lines}. Lines are vacuum wavelengths in nm with Einstein A. Computed
 * when loaded. Thread-safe.
 *
 * <p>Found by ServiceLoader, it computes from the built-in nuclear data; {@link #HydrogenLikeProvider(NuclearData)}
 * computes the sets of other nuclear data (for instance a {@link DataContext}'s).
 */
public final class HydrogenLikeProvider implements ReferenceDataProvider {

    /** The highest principal quantum number of the computed sets. */
    public static final int N_MAX = 10;

    private volatile Map<String, Entry> entries;
    private final java.util.function.Supplier<NuclearData> nuclear;

    /** A provider computing from the built-in nuclear data (the one ServiceLoader makes). */
    public HydrogenLikeProvider() {
        this.nuclear = NuclearData::builtIn;
    }

    /** @param nuclear the nuclear data to compute the sets from */
    public HydrogenLikeProvider(NuclearData nuclear) {
        java.util.Objects.requireNonNull(nuclear, "nuclear");
        this.nuclear = () -> nuclear;
    }

    /** One offered set: its info, the species and whether it is the level or the line set. */
    private record Entry(DataSetInfo info, Species species, boolean levels) {
    }

    @Override
    public String id() {
        return "ritzwerk-hydrogen-like";
    }

    @Override
    public Origin origin() {
        return Origin.BUILT_IN;
    }

    @Override
    public List<DataSetInfo> dataSets() {
        List<DataSetInfo> infos = new ArrayList<>();
        entries().values().forEach(entry -> infos.add(entry.info()));
        return infos;
    }

    @Override
    public DataSet load(String dataSetId) {
        Entry entry = entries().get(dataSetId);
        if (entry == null) {
            throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET,
                    "no computed set '" + dataSetId + "'");
        }
        HydrogenLikeModel model = HydrogenLikeModel.of(nuclear.get().nucleus(entry.species()),
                Tier.QED.forZ(entry.species().z()));
        return entry.levels() ? levels(entry.info(), entry.species(), model) : lines(entry.info(), entry.species(), model);
    }

    private Map<String, Entry> entries() {
        Map<String, Entry> listed = entries;
        if (listed == null) {
            Map<String, Entry> made = new LinkedHashMap<>();
            NuclearData data = nuclear.get();
            for (Isotope isotope : data.isotopes()) {
                boolean defaultIsotope = data.defaultMassNumber(isotope.z()).orElse(-1) == isotope.massNumber();
                boolean hydrogenIsotope = isotope.z() == 1;
                if (!(defaultIsotope || hydrogenIsotope) || isotope.chargeRadiusFm().isEmpty()) {
                    continue;
                }
                Species species = new Species(isotope.z(), defaultIsotope && !hydrogenIsotope ? 0
                        : isotope.massNumber() == 1 ? 0 : isotope.massNumber(), isotope.z() - 1);
                String stem = "computed-" + species.notation().toLowerCase(Locale.ROOT).replace(' ', '-');
                String tier = Tier.QED.forZ(isotope.z()).id();
                Provenance provenance = Provenance.computedBy("Ritzwerk hydrogen-like model, " + tier + " tier, n <= "
                        + N_MAX + ", nuclear data " + data.info().id());
                made.put(stem + "-levels", new Entry(new DataSetInfo(stem + "-levels", DataKind.LEVELS,
                        species.notation() + " levels n <= " + N_MAX + " (computed)", tier, provenance,
                        List.of(species)), species, true));
                made.put(stem + "-lines", new Entry(new DataSetInfo(stem + "-lines", DataKind.LINES,
                        species.notation() + " E1 lines, upper n <= " + N_MAX + " (computed)", tier, provenance,
                        List.of(species)), species, false));
            }
            listed = java.util.Collections.unmodifiableMap(made);
            entries = listed;
        }
        return listed;
    }

    private static LevelList levels(DataSetInfo info, Species species, HydrogenLikeModel model) {
        LevelTable table = model.levels(N_MAX);
        double ground = table.energy(0);
        double hcPerCm = PhysicalConstants.H * PhysicalConstants.C * 100;
        LevelList.Builder builder = LevelList.builder(info, Unit.PER_CENTIMETRE, "energies above the ground state");
        for (int i = 0; i < table.size(); i++) {
            builder.add(species, table.label(i), (table.energy(i) - ground) / hcPerCm, Double.NaN, table.twoJ(i), null);
        }
        return builder.build();
    }

    private static LineList lines(DataSetInfo info, Species species, HydrogenLikeModel model) {
        LineTable table = HydrogenLikeLines.of(model).components(N_MAX, 1e9, Double.MAX_VALUE);
        LineList.Builder builder = LineList.builder(info, Unit.NANOMETRE, Medium.vacuum(),
                "vacuum wavelengths; fine-structure components; Einstein A in s^-1");
        for (int i = 0; i < table.size(); i++) {
            builder.add(species, PhysicalConstants.C / table.frequency(i) * 1e9, Double.NaN, Double.NaN, null,
                    table.einsteinA(i), table.lowerLabel(i), table.upperLabel(i), table.lineName(i));
        }
        return builder.build();
    }
}
