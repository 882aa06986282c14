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
import java.util.Iterator;
import java.util.List;
import java.util.Objects;
import org.apache.spark.api.java.function.FlatMapFunction;
import org.apache.spark.sql.Column;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Encoders;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.api.java.UDF2;
import org.apache.spark.sql.api.java.UDF6;
import org.apache.spark.sql.catalyst.InternalRow;
import org.apache.spark.sql.catalyst.expressions.UnsafeRow;
import org.apache.spark.sql.catalyst.expressions.codegen.UnsafeArrayWriter;
import org.apache.spark.sql.catalyst.expressions.codegen.UnsafeRowWriter;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructField;
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
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataLines;

/**
 * Identification of many peak lists on Spark: for every row of a {@link Schemas#PEAK_LISTS}
 * table, exactly the library's {@code IdentificationSearch.run(peaks, candidates.catalog())}
 * (and, when asked, {@code PlasmaEstimate.estimate}) with the candidates and search the
 * {@link IdentificationParameters} describe; one {@link Schemas#IDENTIFIED_SPECTRA} row per
 * spectrum, and per peak through {@link Result#peaks()}.
 *
 * <p>Each call of {@link #identify} broadcasts the parameters once, when it is called (before any
 * action; every action on its table reuses the broadcast); each partition builds the candidate
 * catalogue and the search once and then streams its rows through them. A malformed row (a null or
 * non-finite position, arrays of different lengths, a k-sigma tolerance without uncertainties, an
 * id that another row also has) fails the job with a {@link SparkRowException} naming the row's id
 * and field. A well-formed spectrum the job refuses gets the job's error code and message in
 * {@code failure_code} and {@code failure}.
 *
 * <p>Immutable and thread-safe; the operation is a lazy transformation.
 * An operation object lives on the driver and is not {@code Serializable}; only its parameter
 * record, which is, travels to the executors.
 */
public final class SurveyIdentification {

    private final IdentificationParameters parameters;
    /** Whether every row's id is checked to be unique (one extra read of the ids and a shuffle). */
    private final boolean checkIds;

    private SurveyIdentification(IdentificationParameters parameters, boolean checkIds) {
        this.parameters = Objects.requireNonNull(parameters, "parameters");
        this.checkIds = checkIds;
    }

    /**
     * @param parameters the candidates, tolerance, searches and units
     * @return the operation; its candidate lines are built once here on the driver as a check
     *         (unknown species or data sets, an empty window), so that a bad setting fails at once
     */
    public static SurveyIdentification of(IdentificationParameters parameters) {
        new Setup(parameters);
        return new SurveyIdentification(parameters, true);
    }

    /**
     * @param on whether to check that no two rows share an id (on by default): a repeated id
     *           (the same file ingested twice) then fails the job naming the id. Off, a table
     *           whose ids are unique by construction (a primary key) is processed without the
     *           extra read of its ids and the shuffle that counts them; a repeated id then gives
     *           two output rows with that id. The numbers of every row are the same either way.
     *           A table whose plan makes its ids unique (grouped by them, as
     *           {@link SurveyIdentification#peakLists} makes; {@code dropDuplicates("id")}) is
     *           never counted: Spark's optimizer knows its ids are distinct keys.
     * @return the operation with the check on or off
     */
    public SurveyIdentification withIdCheck(boolean on) {
        return new SurveyIdentification(parameters, on);
    }

    /** @return the parameters */
    public IdentificationParameters parameters() {
        return parameters;
    }

    /**
     * @param peakLists a table with the columns of {@link Schemas#PEAK_LISTS}
     * @return the identification of every row (lazy)
     * @throws SparkRowException when a column is missing or has another type
     * @throws IllegalArgumentException when the table is streaming (use {@code foreachBatch})
     */
    public Result identify(Dataset<Row> peakLists) {
        return new Result(Setups.run(peakLists, Schemas.PEAK_LISTS_COLUMNS, "peak-list", parameters, (p, f) -> {
            Setup setup = new Setup(p);
            return row -> setup.identify(f, row);
        }, Schemas.IDENTIFIED_SPECTRA, checkIds));
    }

    /**
     * Every row {@link #identify} would refuse, found in one pass without identifying: the same
     * schema check, id check (when on, {@link #withIdCheck}) and reading of each row, each refusal
     * returned as a row instead of failing the job. A spectrum the search itself refuses (its
     * {@code failure_code}) is not an input problem and is not listed.
     *
     * @param peakLists a table with the columns of {@link Schemas#PEAK_LISTS}
     * @return the problems, {@link Schemas#PROBLEMS} (lazy): one row per row whose id other rows
     *         share, one per row with a malformed field (the first the operation would name), or
     *         a single row for a missing or mistyped column; empty when {@code identify} would
     *         refuse no row
     * @throws IllegalArgumentException when the table is streaming
     */
    public Dataset<Row> validate(Dataset<Row> peakLists) {
        return Setups.validate(peakLists, Schemas.PEAK_LISTS_COLUMNS, "peak-list", parameters, (p, f) -> {
            Setup setup = new Setup(p);
            return row -> setup.read(f, row);
        }, checkIds);
    }

    /**
     * @param peakRows a table with the columns of {@link Schemas#PEAK_ROWS}, one row per peak
     * @return one row per spectrum id, of exactly the schema {@link Schemas#PEAK_LISTS} (every
     *         column nullable), each array ordered by the {@code peak} column; a spectrum's sigmas
     *         (intensities, widths) are null unless every one of its peaks gives one. The grouping
     *         is a shuffle, so the table has {@code spark.sql.shuffle.partitions} partitions:
     *         repartition it for a large table. Reading its positions fails the job with a
     *         {@link SparkRowException} ({@link SparkRowException#BAD_FIELD}) naming the
     *         spectrum's id, the column and the value, as {@link #identify} names the fields of a
     *         peak list: a row whose id or peak is null; a position that is null, not finite or
     *         not above 0; a sigma, intensity or width that is not finite or below 0 (each checked
     *         where it is given, so a spectrum never loses a column to a bad value); two rows of
     *         one id with the same peak (the order would be undefined); peaks of a spectrum that
     *         do not run 0, 1, 2, ... (the identified peaks' numbers would not be the input's).
     *         Two peaks at the same position are allowed, as in a peak list. An absent sigma,
     *         intensity or width column is taken as nulls. {@link #validatePeakRows} lists every
     *         row refused here, without failing.
     * @throws SparkRowException ({@link SparkRowException#BAD_SCHEMA}) when a column is missing or
     *                           has another type
     */
    public static Dataset<Row> peakLists(Dataset<Row> peakRows) {
        Dataset<Row> rows = peakRows.select(peakRowColumns(peakRows, Fields.of(peakRows.schema(),
                Schemas.PEAK_ROWS_COLUMNS, "peak-row")));
        // Each row is checked as it enters the grouping, as part of the position the arrays are made
        // of, so that no use of the peak lists escapes it.
        Column checked = udf(new PeakRowCheck(), DataTypes.BooleanType).apply(col("id"), col("peak"), col("position"),
                col("sigma"), col("intensity"), col("width"));
        Dataset<Row> grouped = rows.groupBy(col("id")).agg(sort_array(collect_list(struct(col("peak"),
                when(checked, col("position")).as("position"), col("sigma"), col("intensity"), col("width"))))
                .as("p"));
        // The check is part of the positions column, so that no use of the peak lists escapes it.
        Column unique = udf(new UniquePeaks(), DataTypes.BooleanType).apply(col("id"), col("p").getField("peak"));
        return grouped.select(col("id"), when(unique, col("p").getField("position")).as("positions"),
                whole(col("p"), "sigma", "sigmas"), whole(col("p"), "intensity", "intensities"),
                whole(col("p"), "width", "widths")).to(Schemas.PEAK_LISTS);
    }

    /**
     * Every peak row {@link #peakLists} would refuse, found in one pass without failing: the same
     * schema check and the same checks of each row and of each spectrum's peak numbers, each
     * refusal returned as a row. A pipeline drops or fixes the rows (or the spectra) it lists, and
     * then groups the rest with {@code peakLists}; {@link #validate} then finds what
     * {@link #identify} would refuse in the peak lists (a k-sigma tolerance without sigmas, say).
     *
     * <p>One row per peak row that is refused, with the first problem {@code peakLists} names for
     * it, in its order: a null id; a null peak; a null position, then a position that is not finite
     * or not above 0; a sigma, an intensity, a width that is given but not finite or below 0; then,
     * counted over the rows of the spectrum whose id and peak are given, a peak whose place among
     * the spectrum's distinct peaks in ascending order is not its number (the numbering 0, 1, 2,
     * ... has a gap before it, or starts elsewhere; after a gap every later peak is out of place
     * too, and each is listed, since each would carry another number once renumbered); and a peak
     * given by more than one row of the spectrum (each of those rows listed). The first row of a spectrum whose
     * place is not its number, and each row of a repeated peak, carry exactly the message
     * {@code peakLists} fails with for that spectrum when that is its first problem; so does each
     * row's own problem. A row's second problem (a NaN sigma and a NaN width) is found once the
     * first is fixed.
     *
     * <p>Dropping the spectra listed (a left anti join on {@code id}) leaves a table that
     * {@code peakLists} groups without refusal. Dropping only the rows listed can leave a gap in a
     * spectrum's numbering (both rows of a repeated peak go): validate again, or renumber.
     *
     * @param peakRows a table with the columns of {@link Schemas#PEAK_ROWS}
     * @return the problems, {@link Schemas#PEAK_ROW_PROBLEMS} (lazy; the spectra are grouped by
     *         their ids in a shuffle, as by {@code peakLists}): empty when {@code peakLists} would
     *         refuse no row; a single row (code {@link SparkRowException#BAD_SCHEMA}, id and peak
     *         null) for a missing or mistyped column
     * @throws IllegalArgumentException when the table is streaming
     */
    public static Dataset<Row> validatePeakRows(Dataset<Row> peakRows) {
        Setups.requireBatch(peakRows, "peak-row");
        Fields fields;
        try {
            fields = Fields.of(peakRows.schema(), Schemas.PEAK_ROWS_COLUMNS, "peak-row");
        } catch (SparkRowException e) {
            return peakRows.sparkSession().createDataFrame(List.of(RowFactory.create(e.rowId(), null, e.field(),
                    null, e.code(), e.getMessage())), Schemas.PEAK_ROW_PROBLEMS);
        }
        return peakRows.select(peakRowColumns(peakRows, fields)).groupBy(col("id"))
                .agg(collect_list(struct(col("peak"), col("position"), col("sigma"), col("intensity"), col("width")))
                        .as("p"))
                .flatMap(new PeakRowProblems(), Encoders.row(Schemas.PEAK_ROW_PROBLEMS));
    }

    /**
     * @return the columns of {@link Schemas#PEAK_ROWS} under their documented names, whatever their
     *         case in the table; an absent optional column (sigma, intensity, width) as nulls
     */
    private static Column[] peakRowColumns(Dataset<Row> peakRows, Fields fields) {
        StructField[] wanted = Schemas.PEAK_ROWS_COLUMNS.fields();
        Column[] columns = new Column[wanted.length];
        for (int k = 0; k < wanted.length; k++) {
            String own = fields.column(k);
            columns[k] = (own == null ? lit(null).cast(wanted[k].dataType()) : peakRows.col(own)).as(wanted[k].name());
        }
        return columns;
    }

    /**
     * The check of one peak row, as {@link #identify} checks a peak list's arrays: true, or a
     * {@link SparkRowException} naming the spectrum's id, the column, the peak and the value.
     */
    static final class PeakRowCheck implements UDF6<String, Integer, Double, Double, Double, Double, Boolean> {
        private static final long serialVersionUID = 1L;

        @Override
        public Boolean call(String id, Integer peak, Double position, Double sigma, Double intensity, Double width) {
            SparkRowException problem = problem(id, peak, position, sigma, intensity, width);
            if (problem != null) {
                throw problem;
            }
            return Boolean.TRUE;
        }

        /** @return the row's first problem, or null when the row is well-formed */
        static SparkRowException problem(String id, Integer peak, Double position, Double sigma, Double intensity,
                Double width) {
            if (id == null) {
                return new SparkRowException(SparkRowException.BAD_FIELD, null, "id", "a peak row's id is null (peak "
                        + peak + ", position " + position + "); each peak row needs the id of its spectrum");
            }
            if (peak == null) {
                return new SparkRowException(SparkRowException.BAD_FIELD, id, "peak", "is null in one of this"
                        + " spectrum's peak rows (position " + position + "); each peak row needs its index in the"
                        + " spectrum");
            }
            if (position == null) {
                return new SparkRowException(SparkRowException.BAD_FIELD, id, "position", "peak " + peak + " has"
                        + " none; each peak needs a position");
            }
            SparkRowException problem = check(id, peak, "position", position, true);
            if (problem == null) {
                problem = check(id, peak, "sigma", sigma, false);
            }
            if (problem == null) {
                problem = check(id, peak, "intensity", intensity, false);
            }
            if (problem == null) {
                problem = check(id, peak, "width", width, false);
            }
            return problem;
        }

        /** @return the refusal of a given value that is not finite, or below 0 (or at 0 when {@code above}), or null */
        private static SparkRowException check(String id, int peak, String field, Double value, boolean above) {
            if (value != null && !(Double.isFinite(value) && (above ? value > 0 : value >= 0))) {
                return new SparkRowException(SparkRowException.BAD_FIELD, id, field, "peak " + peak + " has " + value
                        + "; " + (field.equals("intensity") ? "an " : "a ") + field + " must be finite and "
                        + (above ? "above 0" : "at least 0"));
            }
            return null;
        }
    }

    /**
     * The check of one spectrum's peak indices, sorted ascending (nulls first): true, or a
     * {@link SparkRowException} naming the id and the first repeated, null or missing peak.
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
                    throw repeated(id, peak, copies);
                }
                if (peak != k) {
                    throw misplaced(id, k, peak);
                }
                previous = peak;
            }
            return Boolean.TRUE;
        }

        /** @return the refusal of a peak that {@code copies} rows of the spectrum give */
        static SparkRowException repeated(String id, int peak, int copies) {
            return new SparkRowException(SparkRowException.BAD_FIELD, id, "peak", "peak " + peak + " is given by "
                    + copies + " rows of this spectrum; each peak of a spectrum needs its own index (the arrays are"
                    + " ordered by it)");
        }

        /** @return the refusal of the first peak (in ascending order) that is not numbered by its place {@code k} */
        static SparkRowException misplaced(String id, int k, int peak) {
            return new SparkRowException(SparkRowException.BAD_FIELD, id, "peak", NUMBERING + "; after "
                    + (k == 0 ? "none" : "peak " + (k - 1)) + " comes peak " + peak + RENUMBER);
        }

        /**
         * @return the refusal of a later peak whose place {@code k} is not its number, {@code first}
         *         being the place where the spectrum's numbering first breaks
         */
        static SparkRowException misplacedAfter(String id, int k, int peak, int first) {
            return new SparkRowException(SparkRowException.BAD_FIELD, id, "peak", NUMBERING + "; peak " + peak
                    + " comes in place " + k + " (0-based), after the numbering breaks at place " + first + RENUMBER);
        }

        private static final String NUMBERING = "the peaks of a spectrum must be numbered 0, 1, 2, ... without a gap,"
                + " so that the identified peaks carry the same numbers";
        private static final String RENUMBER = " (renumber them, e.g. row_number() over the spectrum's id ordered by"
                + " peak, minus 1)";
    }

    /**
     * The problems of one spectrum's peak rows ({@link SurveyIdentification#validatePeakRows}): its id, then its rows
     * (peak, position, sigma, intensity, width) in any order; each problem a
     * {@link Schemas#PEAK_ROW_PROBLEMS} row.
     */
    static final class PeakRowProblems implements FlatMapFunction<Row, Row> {
        private static final long serialVersionUID = 1L;

        @Override
        public Iterator<Row> call(Row spectrum) {
            String id = spectrum.isNullAt(0) ? null : spectrum.getString(0);
            List<Row> rows = spectrum.getList(1);
            int n = rows.size();
            SparkRowException[] own = new SparkRowException[n];
            // Each given peak's number of rows, over the rows whose id and peak are given (as the grouping sees them).
            java.util.TreeMap<Integer, Integer> copies = new java.util.TreeMap<>();
            for (int i = 0; i < n; i++) {
                Row r = rows.get(i);
                Integer peak = r.isNullAt(0) ? null : r.getInt(0);
                own[i] = PeakRowCheck.problem(id, peak, value(r, 1), value(r, 2), value(r, 3), value(r, 4));
                if (id != null && peak != null) {
                    copies.merge(peak, 1, Integer::sum);
                }
            }
            // Each distinct peak's place in ascending order, and the first place that is not its number.
            java.util.Map<Integer, Integer> place = new java.util.HashMap<>();
            int first = -1;
            int k = 0;
            for (int peak : copies.keySet()) {
                place.put(peak, k);
                if (first < 0 && peak != k) {
                    first = k;
                }
                k++;
            }
            List<Row> problems = new java.util.ArrayList<>();
            for (int i = 0; i < n; i++) {
                Row r = rows.get(i);
                Integer peak = r.isNullAt(0) ? null : r.getInt(0);
                SparkRowException problem = own[i];
                if (problem == null) {
                    // The row is well-formed, so its id and peak are given.
                    int at = place.get(peak);
                    if (at != peak) {
                        problem = at == first ? UniquePeaks.misplaced(id, at, peak)
                                : UniquePeaks.misplacedAfter(id, at, peak, first);
                    } else if (copies.get(peak) > 1) {
                        problem = UniquePeaks.repeated(id, peak, copies.get(peak));
                    }
                }
                if (problem != null) {
                    int field = switch (problem.field()) {
                        case "position" -> 1;
                        case "sigma" -> 2;
                        case "intensity" -> 3;
                        case "width" -> 4;
                        default -> -1;
                    };
                    problems.add(RowFactory.create(id, peak, problem.field(), field < 0 ? null : value(r, field),
                            problem.code(), problem.getMessage()));
                }
            }
            return problems.iterator();
        }

        private static Double value(Row r, int field) {
            return r.isNullAt(field) ? null : r.getDouble(field);
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
        /** The Ritz lines of the level-list species (E1 and LS rules, the context's A values). */
        private final List<LineSet> levelLines = new java.util.ArrayList<>();
        private final IdentificationSearch search;
        private final PlasmaEstimate estimate;
        private final Unit unit;
        private final Medium medium;
        private final boolean kSigma;
        /** The fixed window's candidates, or null for a window per spectrum. */
        private final Candidates fixed;
        private final Catalyst.Strings strings = new Catalyst.Strings();
        /** The output row's writers (one spectrum, its peaks, missing lines, presence and plasma rows). */
        private final UnsafeRowWriter out = new UnsafeRowWriter(Schemas.IDENTIFIED_SPECTRA.size(), 4096);
        private final UnsafeArrayWriter peaksOut = new UnsafeArrayWriter(out, 8);
        private final UnsafeRowWriter peakOut = new UnsafeRowWriter(peaksOut, Schemas.IDENTIFIED_PEAK.size());
        private final UnsafeArrayWriter missingOut = new UnsafeArrayWriter(out, 8);
        private final UnsafeArrayWriter presenceOut = new UnsafeArrayWriter(out, 8);
        private final UnsafeRowWriter presenceRowOut = new UnsafeRowWriter(presenceOut, Schemas.PRESENCE.size());
        private final UnsafeArrayWriter plasmaOut = new UnsafeArrayWriter(out, 8);
        private final UnsafeRowWriter plasmaRowOut = new UnsafeRowWriter(plasmaOut, Schemas.PLASMA.size());
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
            for (RitzLevels levels : atoms.levels()) {
                levelLines.add(LineSet.ofRitz(DataLines.ritzLines(data, levels.species()).withLsRules(true)
                        .compute(levels)));
            }
            Tolerance tolerance = Tolerance.parse(p.tolerance());
            this.kSigma = tolerance.kind() == Tolerance.Kind.K_SIGMA;
            IdentificationSearch s = IdentificationSearch.of(Identifier.of(tolerance)
                    .withStrengthWeight(p.strengthWeight()));
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

        /**
         * The command line's candidates: level-list species' Ritz lines, then alkali atoms, then
         * one-electron ions, then line sets.
         */
        private Candidates candidates(double[] window) {
            Candidates.Builder builder = Candidates.inWindow(window[0], window[1]);
            if (!Double.isNaN(p.excitationTemperature())) {
                builder.excitationTemperature(p.excitationTemperature());
            }
            for (LineSet lines : levelLines) {
                builder.lineSet(lines);
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

        /** One row's fields as the search takes them, read and checked by {@link #read}. */
        private record Read(double[] positions, double[] intensities, double[] widths, PeakList peaks) {
        }

        /**
         * Reads and checks one row, as {@link #identify} and {@link SurveyIdentification#validate}
         * both do: the one place a peak list is refused.
         *
         * @throws SparkRowException naming the row's id and the field
         */
        Read read(Fields f, InternalRow row) {
            String id = f.id(row);
            double[] positions = f.doubles(row, id, 1, -1, 0, true);
            int n = positions.length;
            double[] sigmas = f.optionalDoubles(row, id, 2, n, 0, false);
            double[] intensities = f.optionalDoubles(row, id, 3, n, 0, false);
            double[] widths = f.optionalDoubles(row, id, 4, n, 0, false);
            if (kSigma) {
                if (sigmas == null) {
                    throw new SparkRowException(SparkRowException.BAD_FIELD, id, "sigmas", "is null, but the"
                            + " tolerance '" + p.tolerance() + "' needs every peak's standard uncertainty; give"
                            + " them or a width tolerance such as \"0.02 nm\"");
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
            return new Read(positions, intensities, widths, peaks);
        }

        InternalRow identify(Fields f, InternalRow row) {
            Read read = read(f, row);
            double[] positions = read.positions();
            int n = positions.length;
            double[] intensities = read.intensities();
            double[] widths = read.widths();
            PeakList peaks = read.peaks();
            try {
                Candidates candidates = fixed != null ? fixed : candidates(search.candidateWindow(peaks));
                IdentificationSearch.Report report = search.run(peaks, candidates.catalog());
                List<PlasmaEstimate.Row> plasma = null;
                if (p.plasma()) {
                    plasma = estimate.estimate(new PlasmaEstimate.Peaks(positions, unit, medium,
                            orNaN(intensities, n), orNaN(widths, n)), report.identification(), report.lines(),
                            candidates);
                }
                return row(f.utf8Id(row), positions, report, plasma);
            } catch (RitzwerkException e) {
                return refused(f.utf8Id(row), e);
            }
        }

        /** The reasons' ids joined by ';', by the set's bits in {@link Identification.Ambiguity} order. */
        private final UTF8String[] ambiguities = new UTF8String[1 << Identification.Ambiguity.values().length];
        private final double[] rivalPosition = new double[1];

        /**
         * Writes why peak i is ambiguous and its close rival (fields 8 to 12 of
         * {@link Schemas#IDENTIFIED_PEAK}), as the identify command's CSV does; the rival's
         * position converted alone (the conversion is element by element, so it is the value the
         * command gives).
         */
        private void ambiguity(Identification result, int i, LineCatalog lines, UTF8String[] notations) {
            java.util.Set<Identification.Ambiguity> why = result.ambiguity(i);
            int bits = 0;
            for (Identification.Ambiguity reason : why) {
                bits |= 1 << reason.ordinal();
            }
            if (bits == 0) {
                peakOut.setNullAt(8);
            } else {
                if (ambiguities[bits] == null) {
                    ambiguities[bits] = Catalyst.utf8(String.join(";",
                            why.stream().map(Identification.Ambiguity::id).toList()));
                }
                Catalyst.string(peakOut, 8, ambiguities[bits]);
            }
            int rival = result.rival(i);
            if (rival < 0) {
                for (int field = 9; field < 13; field++) {
                    peakOut.setNullAt(field);
                }
                return;
            }
            SpectralArrays.convert(new double[] {result.rivalPosition(i)}, Unit.METRE, Medium.vacuum(), unit, medium,
                    rivalPosition);
            Catalyst.string(peakOut, 9, notations[lines.speciesIndex(rival)]);
            Catalyst.string(peakOut, 10, strings.of(lines.label(rival)));
            Catalyst.orNull(peakOut, 11, rivalPosition[0]);
            Catalyst.orNull(peakOut, 12, result.rivalOdds(i));
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
         * The output row, written straight into Spark's binary row form ({@link UnsafeRow}) by
         * writers made once per partition: no boxed values, no intermediate row objects, and
         * Spark's own conversion of the operation's rows then copies each nested array in one
         * piece. Each matched line's position is converted in one call for the whole list (the
         * conversion is element by element, so each value is the one a call per line gives);
         * species names and labels in Spark's form are made once per partition. The row is the
         * writers' and is overwritten by the next one (Spark reads each row before asking for
         * the next).
         */
        private InternalRow row(UTF8String id, double[] positions, IdentificationSearch.Report report,
                List<PlasmaEstimate.Row> plasma) {
            Identification result = report.identification();
            LineCatalog lines = report.lines();
            int n = positions.length;
            UTF8String[] notations = notations(lines);
            double[] matched = new double[n];
            int m = 0;
            for (int i = 0; i < n; i++) {
                int j = result.line(i);
                if (j >= 0) {
                    matched[m++] = result.matchedPosition(i);
                }
            }
            double[] converted = new double[m];
            if (m > 0) {
                SpectralArrays.convert(m == n ? matched : Arrays.copyOf(matched, m), Unit.METRE, Medium.vacuum(), unit,
                        medium, converted);
            }
            out.reset();
            out.zeroOutNullBytes();
            out.write(0, id);
            int start = out.cursor();
            peaksOut.initialize(n);
            for (int i = 0, k = 0; i < n; i++) {
                int j = result.line(i);
                int status = result.status(i);
                int at = peaksOut.cursor();
                peakOut.resetRowWriter();
                peakOut.write(0, i);
                peakOut.write(1, positions[i]);
                peakOut.write(2, status == Identification.MATCHED ? MATCHED
                        : status == Identification.AMBIGUOUS ? AMBIGUOUS : UNEXPLAINED);
                if (j < 0) {
                    for (int field = 3; field < 8; field++) {
                        peakOut.setNullAt(field);
                    }
                } else {
                    double line = converted[k++];
                    Catalyst.string(peakOut, 3, notations[lines.speciesIndex(j)]);
                    Catalyst.string(peakOut, 4, strings.of(lines.label(j)));
                    peakOut.write(5, line);
                    peakOut.write(6, positions[i] - line);
                    Catalyst.orNull(peakOut, 7, result.normalizedResidual(i, unit));
                }
                if (status == Identification.AMBIGUOUS) {
                    ambiguity(result, i, lines, notations);
                } else {
                    for (int field = 8; field < 13; field++) { // why and the rival: only for an ambiguous peak
                        peakOut.setNullAt(field);
                    }
                }
                peaksOut.setOffsetAndSizeFromPreviousCursor(i, at);
            }
            out.setOffsetAndSizeFromPreviousCursor(1, start);
            out.write(2, result.count(Identification.MATCHED));
            out.write(3, result.count(Identification.AMBIGUOUS));
            out.write(4, result.count(Identification.UNEXPLAINED));
            ShiftSearch.Fit velocity = report.velocity().orElse(null);
            if (velocity == null || velocity.matches() == 0) {
                out.setNullAt(5);
            } else {
                out.write(5, velocity.velocity());
            }
            if (velocity == null) {
                out.setNullAt(6);
                out.setNullAt(7);
            } else {
                sigma(out, 6, velocity.velocityUncertainty(), velocity.matches());
                out.write(7, velocity.matches());
            }
            ShiftSearch.Fit offset = report.offset().orElse(null);
            if (offset == null || offset.matches() == 0) {
                out.setNullAt(8);
            } else {
                out.write(8, offset.value() * 1e9);
            }
            if (offset == null) {
                out.setNullAt(9);
                out.setNullAt(10);
            } else {
                sigma(out, 9, offset.uncertainty() * 1e9, offset.matches());
                out.write(10, offset.matches());
            }
            int[] missing = result.missingStrongLines();
            UTF8String[] names = missing.length == 0 ? null : lineNames();
            start = out.cursor();
            missingOut.initialize(missing.length);
            for (int k = 0; k < missing.length; k++) {
                int j = missing[k];
                UTF8String name = names == null ? null : names[j];
                if (name == null) {
                    name = Catalyst.utf8(notationTexts[lines.speciesIndex(j)] + " " + lines.label(j));
                    if (names != null) {
                        names[j] = name;
                    }
                }
                missingOut.write(k, name);
            }
            out.setOffsetAndSizeFromPreviousCursor(11, start);
            List<Identification.SpeciesPresence> presence = result.speciesPresence();
            start = out.cursor();
            presenceOut.initialize(presence.size());
            for (int k = 0; k < presence.size(); k++) {
                Identification.SpeciesPresence s = presence.get(k);
                int at = presenceOut.cursor();
                presenceRowOut.resetRowWriter();
                // In the catalogue's species order; the name made once unless the engine says otherwise.
                Catalyst.string(presenceRowOut, 0, k < notations.length && s.species() == notationsOf.get(k)
                        ? notations[k] : strings.of(s.species().notation()));
                presenceRowOut.write(1, s.matched());
                presenceRowOut.write(2, s.matchedByChance());
                presenceRowOut.write(3, s.strongInRange());
                presenceRowOut.write(4, s.strongMatched());
                presenceRowOut.write(5, s.strongByChance());
                Catalyst.orNull(presenceRowOut, 6, s.chanceProbability());
                Catalyst.orNull(presenceRowOut, 7, s.presence());
                presenceOut.setOffsetAndSizeFromPreviousCursor(k, at);
            }
            out.setOffsetAndSizeFromPreviousCursor(12, start);
            if (plasma == null) {
                out.setNullAt(13);
            } else {
                start = out.cursor();
                plasmaOut.initialize(plasma.size());
                for (int k = 0; k < plasma.size(); k++) {
                    PlasmaEstimate.Row r = plasma.get(k);
                    int at = plasmaOut.cursor();
                    plasmaRowOut.resetRowWriter();
                    Catalyst.string(plasmaRowOut, 0, strings.of(r.species().notation()));
                    Catalyst.string(plasmaRowOut, 1, strings.of(r.quantity().id()));
                    if (r.value().isPresent()) {
                        plasmaRowOut.write(2, r.value().getAsDouble());
                    } else {
                        plasmaRowOut.setNullAt(2);
                    }
                    if (r.uncertainty().isPresent()) {
                        plasmaRowOut.write(3, r.uncertainty().getAsDouble());
                    } else {
                        plasmaRowOut.setNullAt(3);
                    }
                    Catalyst.string(plasmaRowOut, 4, strings.of(r.quantity().unit()));
                    Catalyst.string(plasmaRowOut, 5, Catalyst.utf8(r.lines()));
                    Catalyst.string(plasmaRowOut, 6, Catalyst.utf8(r.note()));
                    plasmaOut.setOffsetAndSizeFromPreviousCursor(k, at);
                }
                out.setOffsetAndSizeFromPreviousCursor(13, start);
            }
            out.setNullAt(14);
            out.setNullAt(15);
            out.write(16, result.shiftsTried());
            return out.getRow();
        }

        /** @return the row of a spectrum the job refused: its id, the error's code and message */
        private InternalRow refused(UTF8String id, RitzwerkException e) {
            out.reset();
            out.zeroOutNullBytes();
            out.write(0, id);
            for (int field = 1; field < 14; field++) {
                out.setNullAt(field);
            }
            Catalyst.string(out, 14, Catalyst.utf8(e.code()));
            Catalyst.string(out, 15, Catalyst.utf8(e.getMessage()));
            out.setNullAt(16);
            return out.getRow();
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

        /** Writes the uncertainty; one line gives none (null), nor does a fit whose uncertainty is not finite. */
        private static void sigma(UnsafeRowWriter writer, int field, double value, int lines) {
            if (lines < 2 || !Double.isFinite(value)) {
                writer.setNullAt(field);
            } else {
                writer.write(field, value);
            }
        }
    }
}
