package org.ritzwerk.spark;

import static org.apache.spark.sql.functions.col;
import static org.apache.spark.sql.functions.collect_list;
import static org.apache.spark.sql.functions.explode;
import static org.apache.spark.sql.functions.forall;
import static org.apache.spark.sql.functions.lit;
import static org.apache.spark.sql.functions.sort_array;
import static org.apache.spark.sql.functions.struct;
import static org.apache.spark.sql.functions.when;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.broadcast.Broadcast;
import org.apache.spark.sql.Column;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Encoders;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.IdentificationSearch;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.ShiftSearch;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.engine.plasma.PlasmaEstimate;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.DataContext;

/**
 * Identification of many peak lists on Spark: for every row of a {@link Schemas#PEAK_LISTS}
 * table, exactly the library's {@code IdentificationSearch.run(peaks, candidates.catalog())}
 * (and, when asked, {@code PlasmaEstimate.estimate}) with the candidates and search the
 * {@link IdentificationParameters} describe; one {@link Schemas#IDENTIFIED_SPECTRA} row per
 * spectrum, and per peak through {@link Result#peaks()}.
 *
 * <p>The parameters are broadcast once; each partition builds the candidate catalogue and the
 * search once and then streams its rows through them. A malformed row (a null or non-finite
 * position, arrays of different lengths, a k-sigma tolerance without uncertainties) fails the
 * job with a {@link SparkRowException} naming the row's id and field. A well-formed spectrum the
 * job refuses gets the job's error code and message in {@code failure_code} and {@code failure}.
 *
 * <p>Immutable and thread-safe; the operation is a lazy transformation.
 */
public final class SurveyIdentification {

    private final IdentificationParameters parameters;

    private SurveyIdentification(IdentificationParameters parameters) {
        this.parameters = Objects.requireNonNull(parameters, "parameters");
    }

    /**
     * @param parameters the candidates, tolerance, searches and units
     * @return the operation; its candidate lines are built once here on the driver as a check
     *         (unknown species or data sets, an empty window), so that a bad setting fails at once
     */
    public static SurveyIdentification of(IdentificationParameters parameters) {
        new Setup(parameters);
        return new SurveyIdentification(parameters);
    }

    /** @return the parameters */
    public IdentificationParameters parameters() {
        return parameters;
    }

    /**
     * @param peakLists a table with the columns of {@link Schemas#PEAK_LISTS}
     * @return the identification of every row (lazy)
     * @throws SparkRowException when a column is missing or has another type
     */
    public Result identify(Dataset<Row> peakLists) {
        Fields fields = Fields.of(peakLists.schema(), Schemas.PEAK_LISTS, "peak-list");
        Broadcast<IdentificationParameters> shared = JavaSparkContext
                .fromSparkContext(peakLists.sparkSession().sparkContext()).broadcast(parameters);
        return new Result(peakLists.mapPartitions(new Setups.PartitionTask<>(shared, fields, (p, f) -> {
            Setup setup = new Setup(p);
            return row -> setup.identify(f, row);
        }), Encoders.row(Schemas.IDENTIFIED_SPECTRA)));
    }

    /**
     * @param peakRows a table with the columns of {@link Schemas#PEAK_ROWS}, one row per peak
     * @return one row per spectrum id with the columns of {@link Schemas#PEAK_LISTS}, each array
     *         ordered by the {@code peak} column; a spectrum's sigmas (intensities, widths) are null
     *         unless every one of its peaks gives one
     */
    public static Dataset<Row> peakLists(Dataset<Row> peakRows) {
        Fields.of(peakRows.schema(), Schemas.PEAK_ROWS, "peak-row");
        Dataset<Row> grouped = peakRows.groupBy(col("id")).agg(sort_array(collect_list(struct(col("peak"),
                col("position"), col("sigma"), col("intensity"), col("width")))).as("p"));
        return grouped.select(col("id"), col("p").getField("position").as("positions"), whole(col("p"), "sigma", "sigmas"),
                whole(col("p"), "intensity", "intensities"), whole(col("p"), "width", "widths"));
    }

    private static Column whole(Column peaks, String field, String name) {
        return when(forall(peaks, x -> x.getField(field).isNotNull()), peaks.getField(field)).otherwise(lit(null))
                .as(name);
    }

    /**
     * The identified spectra. The per-peak table is derived from them: persist {@link #spectra()}
     * when both are used, or Spark identifies twice.
     *
     * @param spectra one row per spectrum, {@link Schemas#IDENTIFIED_SPECTRA}
     */
    public record Result(Dataset<Row> spectra) {

        /** @return one row per peak, {@link Schemas#IDENTIFIED_PEAKS} (spectra the job refused have none) */
        public Dataset<Row> peaks() {
            return spectra.select(col("id"), explode(col("peaks")).as("p")).select(col("id"), col("p.*"));
        }
    }

    /** The candidate lines and the search of one partition. Not thread-safe (one task). */
    private static final class Setup {
        private final IdentificationParameters p;
        private final DataContext data;
        private final Setups.Atoms atoms;
        private final IdentificationSearch search;
        private final PlasmaEstimate estimate;
        private final Unit unit;
        private final Medium medium;
        private final boolean kSigma;
        /** The fixed window's candidates, or null for a window per spectrum. */
        private final Candidates fixed;

        Setup(IdentificationParameters p) {
            this.p = p;
            this.data = Setups.context(p.dataFiles());
            this.atoms = Setups.atoms(data, p.species(), p.model());
            Tolerance tolerance = Tolerance.parse(p.tolerance());
            this.kSigma = tolerance.kind() == Tolerance.Kind.K_SIGMA;
            IdentificationSearch s = IdentificationSearch.of(Identifier.of(tolerance));
            if (!Double.isNaN(p.searchVelocity())) {
                s = s.withVelocitySearch(p.searchVelocity());
            }
            if (!Double.isNaN(p.searchOffsetNm())) {
                s = s.withOffsetSearch(p.searchOffsetNm() * 1e-9);
            }
            this.search = s;
            PlasmaEstimate e = Double.isNaN(p.resolvingPower())
                    ? PlasmaEstimate.defaults().withInstrumentFwhm(p.instrumentFwhmNm())
                    : PlasmaEstimate.defaults().withResolvingPower(p.resolvingPower());
            this.estimate = Double.isNaN(p.excitationTemperature()) ? e : e.withTemperature(p.excitationTemperature());
            this.unit = p.positionUnit();
            this.medium = p.positionMedium();
            for (String set : p.lineSets()) {
                data.lineList(set); // an unknown set fails here, in the setup
            }
            this.fixed = Double.isNaN(p.windowFromNm()) ? null
                    : candidates(new double[] {p.windowFromNm() * 1e-9, p.windowToNm() * 1e-9});
        }

        /** The command line's candidates: alkali atoms, then one-electron ions, then line sets. */
        private Candidates candidates(double[] window) {
            Candidates.Builder builder = Candidates.inWindow(window[0], window[1]);
            if (!Double.isNaN(p.excitationTemperature())) {
                builder.excitationTemperature(p.excitationTemperature());
            }
            for (AlkaliAtom atom : atoms.alkalis()) {
                builder.alkali(atom, p.nMax(), done -> { });
            }
            for (Setups.Ion ion : atoms.ions()) {
                builder.hydrogenLike(ion.species(), ion.model(), p.nMax(), p.components());
            }
            for (String set : p.lineSets()) {
                builder.lineList(data.lineList(set));
            }
            return builder.build();
        }

        Row identify(Fields f, Row row) {
            String id = f.id(row);
            double[] positions = f.doubles(row, id, 1, -1, 0, true);
            int n = positions.length;
            double[] sigmas = f.optionalDoubles(row, id, 2, n, 0, false);
            double[] intensities = f.optionalDoubles(row, id, 3, n, 0, false);
            double[] widths = f.optionalDoubles(row, id, 4, n, 0, false);
            if (kSigma) {
                if (sigmas == null) {
                    throw new SparkRowException(SparkRowException.BAD_FIELD, id, "sigmas", "is null, but the tolerance '"
                            + p.tolerance() + "' needs every peak's standard uncertainty; give them or a width"
                            + " tolerance such as \"0.02 nm\"");
                }
                for (int i = 0; i < n; i++) {
                    if (sigmas[i] == 0) {
                        throw new SparkRowException(SparkRowException.BAD_FIELD, id, "sigmas", "element " + i
                                + " is 0, which can never match under the tolerance '" + p.tolerance() + "'");
                    }
                }
            }
            PeakList peaks;
            try {
                peaks = PeakList.of(positions, sigmas, intensities, unit, medium);
            } catch (RuntimeException e) {
                throw new SparkRowException(SparkRowException.BAD_FIELD, id, "positions", e.getMessage());
            }
            try {
                Candidates candidates = fixed != null ? fixed : candidates(search.candidateWindow(peaks));
                IdentificationSearch.Report report = search.run(peaks, candidates.catalog());
                List<Row> plasma = null;
                if (p.plasma()) {
                    plasma = plasmaRows(estimate.estimate(new PlasmaEstimate.Peaks(positions, unit, medium,
                            orNaN(intensities, n), orNaN(widths, n)), report.identification(), report.lines(),
                            candidates));
                }
                return row(id, positions, report, plasma == null ? null : plasma.toArray(new Row[0]));
            } catch (RitzwerkException e) {
                return RowFactory.create(id, null, null, null, null, null, null, null, null, null, null, null, null,
                        null, e.code(), e.getMessage());
            }
        }

        private static double[] orNaN(double[] values, int n) {
            if (values != null) {
                return values;
            }
            double[] none = new double[n];
            Arrays.fill(none, Double.NaN);
            return none;
        }

        private Row row(String id, double[] positions, IdentificationSearch.Report report, Row[] plasma) {
            Identification result = report.identification();
            LineCatalog lines = report.lines();
            List<Row> peakRows = new ArrayList<>(positions.length);
            double[] converted = new double[1];
            for (int i = 0; i < positions.length; i++) {
                int j = result.line(i);
                String status = result.status(i) == Identification.MATCHED ? "matched"
                        : result.status(i) == Identification.AMBIGUOUS ? "ambiguous" : "unexplained";
                if (j < 0) {
                    peakRows.add(RowFactory.create(i, positions[i], status, null, null, null, null, null));
                    continue;
                }
                SpectralArrays.convert(new double[] {lines.wavelength(j)}, Unit.METRE, Medium.vacuum(), unit, medium,
                        converted);
                peakRows.add(RowFactory.create(i, positions[i], status, lines.species(j).notation(), lines.label(j),
                        converted[0], positions[i] - converted[0], Setups.orNull(result.normalizedResidual(i))));
            }
            ShiftSearch.Fit velocity = report.velocity().orElse(null);
            ShiftSearch.Fit offset = report.offset().orElse(null);
            int[] missing = result.missingStrongLines();
            String[] missingNames = new String[missing.length];
            for (int k = 0; k < missing.length; k++) {
                missingNames[k] = lines.species(missing[k]).notation() + " " + lines.label(missing[k]);
            }
            List<Row> presence = new ArrayList<>();
            for (Identification.SpeciesPresence s : result.speciesPresence()) {
                presence.add(RowFactory.create(s.species().notation(), s.matched(), s.matchedByChance(),
                        s.strongInRange(), s.strongMatched(), s.strongByChance(), Setups.orNull(s.chanceProbability()),
                        Setups.orNull(s.presence())));
            }
            return RowFactory.create(id, peakRows.toArray(new Row[0]), result.count(Identification.MATCHED),
                    result.count(Identification.AMBIGUOUS), result.count(Identification.UNEXPLAINED),
                    velocity == null || velocity.matches() == 0 ? null : velocity.velocity(),
                    velocity == null ? null : sigma(velocity.velocityUncertainty(), velocity.matches()),
                    velocity == null ? null : velocity.matches(),
                    offset == null || offset.matches() == 0 ? null : offset.value() * 1e9,
                    offset == null ? null : sigma(offset.uncertainty() * 1e9, offset.matches()),
                    offset == null ? null : offset.matches(),
                    missingNames, presence.toArray(new Row[0]), plasma, null, null);
        }

        /** One line gives no uncertainty; nor does a fit whose uncertainty is not finite. */
        private static Double sigma(double value, int lines) {
            return lines < 2 || !Double.isFinite(value) ? null : value;
        }

        private static List<Row> plasmaRows(List<PlasmaEstimate.Row> rows) {
            List<Row> out = new ArrayList<>(rows.size());
            for (PlasmaEstimate.Row r : rows) {
                out.add(RowFactory.create(r.species().notation(), r.quantity().id(),
                        r.value().isPresent() ? r.value().getAsDouble() : null,
                        r.uncertainty().isPresent() ? r.uncertainty().getAsDouble() : null, r.quantity().unit(),
                        r.lines(), r.note()));
            }
            return out;
        }
    }
}
