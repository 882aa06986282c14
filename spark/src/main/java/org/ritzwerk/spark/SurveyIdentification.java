package org.ritzwerk.spark;

import static org.apache.spark.sql.functions.col;
import static org.apache.spark.sql.functions.collect_list;
import static org.apache.spark.sql.functions.explode;
import static org.apache.spark.sql.functions.forall;
import static org.apache.spark.sql.functions.lit;
import static org.apache.spark.sql.functions.sort_array;
import static org.apache.spark.sql.functions.struct;
import static org.apache.spark.sql.functions.udf;
import static org.apache.spark.sql.functions.when;

import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import org.apache.spark.sql.Column;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.api.java.UDF2;
import org.apache.spark.sql.catalyst.InternalRow;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.unsafe.types.UTF8String;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.atom.Species;
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
 * position, arrays of different lengths, a k-sigma tolerance without uncertainties, an id that
 * another row also has) fails the job with a {@link SparkRowException} naming the row's id and
 * field. A well-formed spectrum the
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
        return new Result(Setups.run(peakLists, Schemas.PEAK_LISTS, "peak-list", parameters, (p, f) -> {
            Setup setup = new Setup(p);
            return row -> setup.identify(f, row);
        }, Schemas.IDENTIFIED_SPECTRA));
    }

    /**
     * @param peakRows a table with the columns of {@link Schemas#PEAK_ROWS}, one row per peak
     * @return one row per spectrum id with the columns of {@link Schemas#PEAK_LISTS}, each array
     *         ordered by the {@code peak} column; a spectrum's sigmas (intensities, widths) are null
     *         unless every one of its peaks gives one. Reading its positions fails the job with a
     *         {@link SparkRowException} naming the id and the peak when two rows of one id have the
     *         same peak (the order would be undefined) or a peak is null.
     */
    public static Dataset<Row> peakLists(Dataset<Row> peakRows) {
        Fields.of(peakRows.schema(), Schemas.PEAK_ROWS, "peak-row");
        Dataset<Row> grouped = peakRows.groupBy(col("id")).agg(sort_array(collect_list(struct(col("peak"),
                col("position"), col("sigma"), col("intensity"), col("width")))).as("p"));
        // The check is part of the positions column, so that no use of the peak lists escapes it.
        Column unique = udf(new UniquePeaks(), DataTypes.BooleanType).apply(col("id"), col("p").getField("peak"));
        return grouped.select(col("id"), when(unique, col("p").getField("position")).as("positions"),
                whole(col("p"), "sigma", "sigmas"), whole(col("p"), "intensity", "intensities"),
                whole(col("p"), "width", "widths"));
    }

    /**
     * The check of one spectrum's peak indices, sorted ascending (nulls first): true, or a
     * {@link SparkRowException} naming the id and the first repeated (or null) peak.
     */
    static final class UniquePeaks implements UDF2<String, scala.collection.Seq<Integer>, Boolean> {
        private static final long serialVersionUID = 1L;

        @Override
        public Boolean call(String id, scala.collection.Seq<Integer> peaks) {
            int n = peaks.size();
            Integer previous = null;
            int copies = 1;
            for (int k = 0; k < n; k++) {
                Integer peak = peaks.apply(k);
                if (peak == null) {
                    throw new SparkRowException(SparkRowException.BAD_FIELD, id, "peak", "is null in one of this"
                            + " spectrum's peak rows; each peak row needs its index in the spectrum");
                }
                if (peak.equals(previous)) {
                    copies++;
                    if (k + 1 < n && peak.equals(peaks.apply(k + 1))) {
                        continue;
                    }
                    throw new SparkRowException(SparkRowException.BAD_FIELD, id, "peak", "peak " + peak + " is given"
                            + " by " + copies + " rows of this spectrum; each peak of a spectrum needs its own index"
                            + " (the arrays are ordered by it)");
                }
                previous = peak;
            }
            return Boolean.TRUE;
        }
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

    private static final UTF8String MATCHED = UTF8String.fromString("matched");
    private static final UTF8String AMBIGUOUS = UTF8String.fromString("ambiguous");
    private static final UTF8String UNEXPLAINED = UTF8String.fromString("unexplained");

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
        private final Catalyst.Strings strings = new Catalyst.Strings();
        /** The species list whose names {@link #notations} holds (catalogues of one setup share it). */
        private List<Species> notationsOf;
        private UTF8String[] notations;
        private String[] notationTexts;
        /** The fixed window's missing-line names by line index, made at first use; null until then. */
        private UTF8String[] lineNames;

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

        InternalRow identify(Fields f, InternalRow row) {
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
                Object[] plasma = null;
                if (p.plasma()) {
                    plasma = plasmaRows(estimate.estimate(new PlasmaEstimate.Peaks(positions, unit, medium,
                            orNaN(intensities, n), orNaN(widths, n)), report.identification(), report.lines(),
                            candidates));
                }
                return row(id, positions, report, plasma);
            } catch (RitzwerkException e) {
                return Catalyst.row(Catalyst.utf8(id), null, null, null, null, null, null, null, null, null, null, null,
                        null, null, Catalyst.utf8(e.code()), Catalyst.utf8(e.getMessage()));
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

        /**
         * The output row, in Spark's form: each matched line's position converted in one call for
         * the whole list (the conversion is element by element, so each value is the one a call
         * per line gives), species names and labels in Spark's form made once per partition.
         */
        private InternalRow row(String id, double[] positions, IdentificationSearch.Report report, Object[] plasma) {
            Identification result = report.identification();
            LineCatalog lines = report.lines();
            int n = positions.length;
            UTF8String[] notations = notations(lines);
            double[] matched = new double[n];
            int m = 0;
            for (int i = 0; i < n; i++) {
                int j = result.line(i);
                if (j >= 0) {
                    matched[m++] = lines.wavelength(j);
                }
            }
            double[] converted = new double[m];
            if (m > 0) {
                SpectralArrays.convert(m == n ? matched : Arrays.copyOf(matched, m), Unit.METRE, Medium.vacuum(), unit,
                        medium, converted);
            }
            Object[] peakRows = new Object[n];
            for (int i = 0, k = 0; i < n; i++) {
                int j = result.line(i);
                int status = result.status(i);
                UTF8String statusText = status == Identification.MATCHED ? MATCHED
                        : status == Identification.AMBIGUOUS ? AMBIGUOUS : UNEXPLAINED;
                if (j < 0) {
                    peakRows[i] = Catalyst.row(i, positions[i], statusText, null, null, null, null, null);
                    continue;
                }
                double line = converted[k++];
                peakRows[i] = Catalyst.row(i, positions[i], statusText, notations[lines.speciesIndex(j)],
                        strings.of(lines.label(j)), line, positions[i] - line,
                        Catalyst.orNull(result.normalizedResidual(i)));
            }
            ShiftSearch.Fit velocity = report.velocity().orElse(null);
            ShiftSearch.Fit offset = report.offset().orElse(null);
            int[] missing = result.missingStrongLines();
            Object[] missingNames = new Object[missing.length];
            UTF8String[] names = missing.length == 0 ? null : lineNames();
            for (int k = 0; k < missing.length; k++) {
                int j = missing[k];
                UTF8String name = names == null ? null : names[j];
                if (name == null) {
                    name = Catalyst.utf8(notationTexts[lines.speciesIndex(j)] + " " + lines.label(j));
                    if (names != null) {
                        names[j] = name;
                    }
                }
                missingNames[k] = name;
            }
            List<Identification.SpeciesPresence> presence = result.speciesPresence();
            Object[] presenceRows = new Object[presence.size()];
            for (int k = 0; k < presenceRows.length; k++) {
                Identification.SpeciesPresence s = presence.get(k);
                // In the catalogue's species order; the name made once unless the engine says otherwise.
                UTF8String species = k < notations.length && s.species() == notationsOf.get(k) ? notations[k]
                        : strings.of(s.species().notation());
                presenceRows[k] = Catalyst.row(species, s.matched(), s.matchedByChance(),
                        s.strongInRange(), s.strongMatched(), s.strongByChance(),
                        Catalyst.orNull(s.chanceProbability()), Catalyst.orNull(s.presence()));
            }
            return Catalyst.row(Catalyst.utf8(id), Catalyst.array(peakRows), result.count(Identification.MATCHED),
                    result.count(Identification.AMBIGUOUS), result.count(Identification.UNEXPLAINED),
                    velocity == null || velocity.matches() == 0 ? null : velocity.velocity(),
                    velocity == null ? null : sigma(velocity.velocityUncertainty(), velocity.matches()),
                    velocity == null ? null : velocity.matches(),
                    offset == null || offset.matches() == 0 ? null : offset.value() * 1e9,
                    offset == null ? null : sigma(offset.uncertainty() * 1e9, offset.matches()),
                    offset == null ? null : offset.matches(),
                    Catalyst.array(missingNames), Catalyst.array(presenceRows),
                    plasma == null ? null : Catalyst.array(plasma), null, null);
        }

        /**
         * @return for the fixed window, its lines' "species label" names in Spark's form by line
         *         index, each made at its first use (the same strong lines go missing in spectrum
         *         after spectrum; a shifted or offset catalogue keeps the indices, species and
         *         labels); null for a window per spectrum
         */
        private UTF8String[] lineNames() {
            if (fixed != null && lineNames == null) {
                lineNames = new UTF8String[fixed.catalog().size()];
            }
            return lineNames;
        }

        /** @return the catalogue's species names in Spark's form, by species index */
        private UTF8String[] notations(LineCatalog lines) {
            List<Species> list = lines.speciesList();
            if (list != notationsOf) {
                notations = new UTF8String[list.size()];
                notationTexts = new String[list.size()];
                for (int s = 0; s < notations.length; s++) {
                    notationTexts[s] = list.get(s).notation();
                    notations[s] = strings.of(notationTexts[s]);
                }
                notationsOf = list;
            }
            return notations;
        }

        /** One line gives no uncertainty; nor does a fit whose uncertainty is not finite. */
        private static Double sigma(double value, int lines) {
            return lines < 2 || !Double.isFinite(value) ? null : value;
        }

        private Object[] plasmaRows(List<PlasmaEstimate.Row> rows) {
            Object[] out = new Object[rows.size()];
            for (int k = 0; k < out.length; k++) {
                PlasmaEstimate.Row r = rows.get(k);
                out[k] = Catalyst.row(strings.of(r.species().notation()), strings.of(r.quantity().id()),
                        r.value().isPresent() ? r.value().getAsDouble() : null,
                        r.uncertainty().isPresent() ? r.uncertainty().getAsDouble() : null,
                        strings.of(r.quantity().unit()), Catalyst.utf8(r.lines()), Catalyst.utf8(r.note()));
            }
            return out;
        }
    }
}
