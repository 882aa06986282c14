package org.ritzwerk.spark;

import static org.apache.spark.sql.functions.col;
import static org.apache.spark.sql.functions.count;
import static org.apache.spark.sql.functions.lit;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import org.apache.spark.api.java.function.MapPartitionsFunction;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Encoders;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.catalyst.InternalRow;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructType;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.data.DispersionPolynomial;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampMatcher;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataLines;

/**
 * Wavelength calibration of many lamp exposures on Spark, and its application to science
 * spectra. {@link #calibrate} gives, for every row of a {@link Schemas#EXPOSURES} table, exactly
 * the library's {@code Calibrator.calibrate(CalibrationProblem)} with the lamp set and settings of
 * the {@link CalibrationParameters}; {@link #apply} gives every science spectrum the wavelengths
 * of its calibration's polynomial, as {@code calibrate --apply} does with a saved calibration
 * ({@code DispersionSolution.of(polynomial).pixelCentreWavelengths(pixels)} and
 * {@code pixelCentreWavelengthSigmas}).
 *
 * <p>Each call of {@link #calibrate} broadcasts the parameters once, when it is called (before any
 * action; every action on its table reuses the broadcast); each partition builds the lamp set and
 * the calibrator once. A malformed row (or one whose id another row has) fails the job with a
 * {@link SparkRowException} naming the row's id and field; an exposure the calibrator refuses gets
 * its error code and message in {@code failure_code} and {@code failure}, and so does each science
 * spectrum that {@link #apply} finds with a refused calibration.
 *
 * <p>Immutable and thread-safe; the operations are lazy transformations.
 * An operation object lives on the driver and is not {@code Serializable}; only its parameter
 * record, which is, travels to the executors.
 */
public final class SurveyCalibration {

    private final CalibrationParameters parameters;
    /** Whether every row's id is checked to be unique (one extra read of the ids and a shuffle). */
    private final boolean checkIds;

    private SurveyCalibration(CalibrationParameters parameters, boolean checkIds) {
        this.parameters = Objects.requireNonNull(parameters, "parameters");
        this.checkIds = checkIds;
    }

    /**
     * @param parameters the lamp and the calibrator's settings
     * @return the operation; the lamp set is built once here on the driver as a check
     */
    public static SurveyCalibration of(CalibrationParameters parameters) {
        new Setup(parameters);
        return new SurveyCalibration(parameters, true);
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
    public SurveyCalibration withIdCheck(boolean on) {
        return new SurveyCalibration(parameters, on);
    }

    /** @return the parameters */
    public CalibrationParameters parameters() {
        return parameters;
    }

    /**
     * @param exposures a table with the columns of {@link Schemas#EXPOSURES}
     * @return one calibration per exposure, {@link Schemas#CALIBRATIONS} (lazy)
     * @throws SparkRowException when a column is missing or has another type
     * @throws IllegalArgumentException when the table is streaming (use {@code foreachBatch})
     */
    public Dataset<Row> calibrate(Dataset<Row> exposures) {
        return Setups.run(exposures, Schemas.EXPOSURES_COLUMNS, "exposure", parameters, (p, f) -> {
            Setup setup = new Setup(p);
            return row -> setup.calibrate(f, row);
        }, Schemas.CALIBRATIONS, checkIds);
    }

    /**
     * Every row {@link #calibrate} would refuse, found in one pass without calibrating: the same
     * schema check, id check (when on, {@link #withIdCheck}) and reading of each row, each refusal
     * returned as a row instead of failing the job. An exposure the calibrator itself refuses (its
     * {@code failure_code}) is not an input problem and is not listed.
     *
     * @param exposures a table with the columns of {@link Schemas#EXPOSURES}
     * @return the problems, {@link Schemas#PROBLEMS} (lazy): one row per row whose id other rows
     *         share, one per row with a malformed field (the first the operation would name), or
     *         a single row for a missing or mistyped column; empty when {@code calibrate} would
     *         refuse no row
     * @throws IllegalArgumentException when the table is streaming
     */
    public Dataset<Row> validate(Dataset<Row> exposures) {
        return Setups.validate(exposures, Schemas.EXPOSURES_COLUMNS, "exposure", parameters,
                (p, f) -> row -> Setup.read(f, row, f.id(row)), checkIds);
    }

    /** The columns of a calibration that applying it reads, in this order after the science columns. */
    private static final String[] APPLIED = {"id", "pixels", "medium", "centre_pixel", "half_range", "coefficients",
        "covariance", "higher_degree_coefficients", "higher_degree_covariance", "lowest_pixel", "highest_pixel",
        "failure_code", "failure", "higher_degree_weight"};

    /**
     * @param science      a table with the columns of {@link Schemas#SCIENCE}
     * @param calibrations a table with the columns of {@link Schemas#CALIBRATIONS} (as
     *                     {@link #calibrate} makes it, or read back from storage); joined on
     *                     {@code science.calibration_id = calibrations.id} (Spark broadcasts the
     *                     calibrations when they are small)
     * @return every science spectrum with its wavelengths, {@link Schemas#CALIBRATED} (lazy); a
     *         spectrum whose calibration was refused keeps its row with the calibration's
     *         {@code failure_code} and a {@code failure} naming the calibration (its wavelengths
     *         null); a spectrum whose calibration is missing, made for another pixel count or not
     *         the only one with its id, and a spectrum whose own id another row has, fail the job
     *         with a {@link SparkRowException} naming the spectrum
     * @throws IllegalArgumentException when either table is streaming (use {@code foreachBatch})
     */
    public static Dataset<Row> apply(Dataset<Row> science, Dataset<Row> calibrations) {
        return joined(science, calibrations).mapPartitions(new ApplyTask(), Encoders.row(Schemas.CALIBRATED));
    }

    /**
     * Every science spectrum {@link #apply} would refuse, found in one pass: the same schema
     * checks, join and checks of each spectrum (a null field, a repeated id, a missing, repeated
     * or unusable calibration, a pixel-count mismatch, a non-finite count), each refusal returned
     * as a row instead of failing the job. A spectrum whose calibration was refused keeps its row
     * in {@code apply} (its {@code failure_code}) and is not listed.
     *
     * @param science      a table with the columns of {@link Schemas#SCIENCE}
     * @param calibrations a table with the columns of {@link Schemas#CALIBRATIONS}
     * @return the problems, {@link Schemas#PROBLEMS} (lazy): one row per refused spectrum, or a
     *         single row for a missing or mistyped column of either table; empty when
     *         {@code apply} would refuse no spectrum
     * @throws IllegalArgumentException when either table is streaming
     */
    public static Dataset<Row> validateApply(Dataset<Row> science, Dataset<Row> calibrations) {
        Dataset<Row> joined;
        try {
            joined = joined(science, calibrations);
        } catch (SparkRowException e) {
            return Setups.problemTable(science.sparkSession(), e);
        }
        return joined.flatMap((org.apache.spark.api.java.function.FlatMapFunction<Row, Row>) row -> {
            try {
                ApplyTask.apply(row);
                return java.util.Collections.emptyIterator();
            } catch (SparkRowException e) {
                return List.of(Setups.problemRow(e)).iterator();
            }
        }, Encoders.row(Schemas.PROBLEMS));
    }

    /** The science spectra, checked, joined to their calibrations as {@link ApplyTask} reads them. */
    private static Dataset<Row> joined(Dataset<Row> science, Dataset<Row> calibrations) {
        Setups.requireBatch(science, "science");
        Setups.requireBatch(calibrations, "calibration");
        Dataset<Row> left = Setups.checkedColumns(science, Fields.of(science.schema(), Schemas.SCIENCE_COLUMNS,
                "science"));
        StructType wanted = new StructType();
        for (String name : APPLIED) {
            wanted = wanted.add(Schemas.CALIBRATIONS.apply(name));
        }
        Fields.of(calibrations.schema(), wanted, "calibration");
        org.apache.spark.sql.Column[] right = new org.apache.spark.sql.Column[APPLIED.length];
        List<String> present = java.util.Arrays.stream(calibrations.columns()).map(c -> c.toLowerCase(Locale.ROOT))
                .toList();
        for (int k = 0; k < APPLIED.length; k++) {
            // a table stored before the higher degree's weight was kept is applied as if it were null
            boolean absentWeight = APPLIED[k].equals("higher_degree_weight") && !present.contains(APPLIED[k]);
            right[k] = (absentWeight ? lit(null).cast(DataTypes.DoubleType) : col(APPLIED[k])).as("c_" + APPLIED[k]);
        }
        // How many calibrations carry each id: the join would give a spectrum one row per copy.
        Dataset<Row> copies = calibrations.groupBy(col("id").as("c_key")).agg(count(lit(1)).as("c_copies"));
        Dataset<Row> solutions = calibrations.select(right);
        solutions = solutions.join(copies, solutions.col("c_id").equalTo(copies.col("c_key")), "left");
        Dataset<Row> joined = left.join(solutions, left.col("calibration_id").equalTo(solutions.col("c_id")), "left")
                .select(left.col("id"), left.col("calibration_id"), left.col("counts"), col("c_id"), col("c_pixels"),
                        col("c_medium"), col("c_centre_pixel"), col("c_half_range"), col("c_coefficients"),
                        col("c_covariance"), col("c_higher_degree_coefficients"), col("c_higher_degree_covariance"),
                        col("c_lowest_pixel"), col("c_highest_pixel"), col("c_failure_code"),
                        col("c_failure"), left.col(Setups.COPIES), col("c_copies"), col("c_higher_degree_weight"));
        return joined;
    }

    /** The lamp set, calibrator and prior of one partition. */
    private static final class Setup {
        private final LampSet lamp;
        private final Calibrator calibrator;
        private final LampMatcher.Prior prior;
        private final List<String> lampNotes;

        Setup(CalibrationParameters p) {
            DataContext data = Setups.context(p.dataFiles());
            List<Species> gases = new ArrayList<>();
            for (String text : p.lamps()) {
                gases.add(Species.parse(text.strip()));
            }
            List<LineList> lists = new ArrayList<>();
            for (String set : p.lineSets()) {
                lists.add(data.lineList(set));
            }
            // As the calibrate command assembles its lamp (gases with only a level list, such as He I,
            // ranked by g_u A and blended at the resolving power).
            Medium medium = Medium.parse(p.medium());
            DataLines.CalibrationLamp assembled = DataLines.calibrationLamp(data, gases, lists, medium,
                    p.resolvingPower());
            this.lampNotes = assembled.notes(medium);
            LampSet all = assembled.lamp();
            this.lamp = p.minStrength() == null ? all : all.atLeast(StrengthClass.fromId(p.minStrength()));
            this.calibrator = p.calibrator();
            this.prior = p.prior();
        }

        /**
         * Reads and checks one exposure's counts, as {@link #calibrate} and
         * {@link SurveyCalibration#validate} both do.
         *
         * @return the counts, then the sigmas (null when not given)
         * @throws SparkRowException naming the row's id and the field
         */
        static double[][] read(Fields f, InternalRow row, String id) {
            double[] counts = f.doubles(row, id, 1, -1, Double.NEGATIVE_INFINITY, false);
            double[] sigmas = f.optionalDoubles(row, id, 2, counts.length, 0, true);
            return new double[][] {counts, sigmas};
        }

        InternalRow calibrate(Fields f, InternalRow row) {
            String id = f.id(row);
            double[][] read = read(f, row, id);
            double[] counts = read[0];
            double[] sigmas = read[1];
            int pixels = counts.length;
            Calibration calibration;
            try {
                calibration = calibrator.calibrate(CalibrationProblem.builder(counts).sigmas(sigmas).lamp(lamp)
                        .prior(prior).source(id).build());
            } catch (RitzwerkException e) {
                return Catalyst.row(Catalyst.utf8(id), pixels, null, null, null, null, null, null, null, null, null,
                        null, null, null, null, null, null, null, null, null, null, null, null, null, null, null, null,
                        Catalyst.utf8(e.code()), Catalyst.utf8(e.getMessage()), null, notes(lampNotes));
            }
            DispersionSolution solution = calibration.solution();
            DispersionPolynomial polynomial = solution.polynomial();
            double[] covariance = flat(polynomial.covariance());
            double[] higherCovariance = flat(polynomial.higherDegreeCovariance());
            List<String> labels = calibration.pairLabels();
            Object[] lines = new Object[labels.size()];
            for (int k = 0; k < lines.length; k++) {
                lines[k] = Catalyst.utf8(labels.get(k));
            }
            return Catalyst.row(Catalyst.utf8(id), pixels, Catalyst.utf8(polynomial.medium().spec()), solution.degree(),
                    polynomial.centrePixel(), polynomial.halfRange(), Catalyst.doubles(polynomial.coefficients()),
                    Catalyst.doubles(covariance), Catalyst.doubles(polynomial.higherDegreeCoefficients()),
                    Catalyst.doubles(higherCovariance), polynomial.lowestPixel(), polynomial.highestPixel(),
                    finite(solution.rmsNm()), finite(solution.rmsPixels()), finite(solution.reducedChiSquare()),
                    solution.usedCount(), solution.rejectedCount(), calibration.peaks().size(),
                    calibration.strongPeaks(), calibration.strongMatched(), finite(calibration.matchedFraction()),
                    finite(calibration.coverage()), calibration.saturatedPeaks(), Catalyst.array(lines),
                    Catalyst.utf8(calibration.description()), finite(calibration.endConfirmationPixels(false)),
                    finite(calibration.endConfirmationPixels(true)), null, null,
                    finite(polynomial.higherDegreeWeight()), notes(lampNotes, calibration.notes()));
        }

        /** A square matrix row by row; null for null. */
        private static double[] flat(double[][] matrix) {
            if (matrix == null) {
                return null;
            }
            int k = matrix.length;
            double[] flat = new double[k * k];
            for (int i = 0; i < k; i++) {
                System.arraycopy(matrix[i], 0, flat, i * k, k);
            }
            return flat;
        }

        @SafeVarargs
        private static Object notes(List<String>... parts) {
            List<Object> all = new ArrayList<>();
            for (List<String> part : parts) {
                for (String note : part) {
                    all.add(Catalyst.utf8(note));
                }
            }
            return Catalyst.array(all.toArray());
        }

        private static Double finite(double value) {
            return Double.isFinite(value) ? value : null;
        }
    }

    /** One partition of science spectra joined to their calibrations. */
    private static final class ApplyTask implements MapPartitionsFunction<Row, Row> {
        private static final long serialVersionUID = 1L;

        @Override
        public Iterator<Row> call(Iterator<Row> rows) {
            return Setups.map(rows, ApplyTask::apply);
        }

        private static SparkRowException bad(String id, String field, String message) {
            return new SparkRowException(SparkRowException.BAD_FIELD, id, field, message);
        }

        private static Row apply(Row row) {
            if (row.isNullAt(0)) {
                throw bad(null, "id", "a row's id is null");
            }
            String id = row.getString(0);
            if (row.isNullAt(1)) {
                throw bad(id, "calibration_id", "is null");
            }
            String calibrationId = row.getString(1);
            if (row.isNullAt(2)) {
                throw bad(id, "counts", "is null");
            }
            if (!row.isNullAt(16)) {
                throw Setups.repeatedId(id, row.getLong(16), "science");
            }
            List<Object> counts = row.getList(2);
            if (row.isNullAt(3)) {
                throw bad(id, "calibration_id", "no calibration has the id '" + calibrationId + "'");
            }
            if (row.getLong(17) > 1) {
                throw bad(id, "calibration_id", "the calibrations table has " + row.getLong(17) + " rows with the id '"
                        + calibrationId + "'; each calibration needs its own id");
            }
            if (row.isNullAt(4)) {
                throw bad(id, "calibration_id", "calibration '" + calibrationId + "' has no pixel count");
            }
            int pixels = row.getInt(4);
            if (counts.size() != pixels) {
                throw bad(id, "counts", "has " + counts.size() + " pixels, but calibration '" + calibrationId
                        + "' was made for " + pixels);
            }
            double[] values = new double[pixels];
            for (int i = 0; i < pixels; i++) {
                Object value = counts.get(i);
                if (value == null) {
                    throw bad(id, "counts", "element " + i + " is null");
                }
                values[i] = (Double) value;
                if (!Double.isFinite(values[i])) {
                    throw bad(id, "counts", "element " + i + " is " + values[i] + "; each must be finite");
                }
            }
            if (!row.isNullAt(14)) {
                // One refused lamp exposure a night is normal: its spectra keep their rows, refused (the
                // calibration's code, and a message naming it), and the job goes on.
                return RowFactory.create(id, calibrationId, values, null, null, null, row.getString(14),
                        "calibration '" + calibrationId + "' was refused (" + row.getString(14) + ": "
                        + row.getString(15) + "); there is nothing to apply");
            }
            double[] coefficients = doubles(row.getList(8));
            double[][] covariance = square(row, 9, coefficients.length, id, calibrationId, "covariance");
            double[] higher = row.isNullAt(10) ? null : doubles(row.getList(10));
            double[][] higherCovariance = higher == null ? null
                    : square(row, 11, higher.length, id, calibrationId, "higher_degree_covariance");
            Medium medium = Medium.parse(row.getString(5));
            DispersionSolution solution;
            try {
                solution = DispersionSolution.of(new DispersionPolynomial(medium, row.getDouble(6), row.getDouble(7),
                        coefficients, covariance, row.getDouble(12), row.getDouble(13), higher, higherCovariance,
                        row.isNullAt(18) ? Double.NaN : row.getDouble(18)));
            } catch (RuntimeException e) {
                throw bad(id, "calibration_id", "calibration '" + calibrationId + "' is not a usable polynomial: "
                        + e.getMessage());
            }
            return RowFactory.create(id, calibrationId, values, solution.pixelCentreWavelengths(pixels),
                    solution.pixelCentreWavelengthSigmas(pixels), medium.spec(), null, null);
        }

        /** The k x k matrix stored row by row in a column; null when the column is null. */
        private static double[][] square(Row row, int column, int k, String id, String calibrationId, String name) {
            if (row.isNullAt(column)) {
                return null;
            }
            double[] flat = doubles(row.getList(column));
            if (flat.length != k * k) {
                throw bad(id, "calibration_id", "calibration '" + calibrationId + "' has " + k
                        + " coefficients but " + flat.length + " " + name + " elements, not " + k * k);
            }
            double[][] matrix = new double[k][k];
            for (int i = 0; i < k; i++) {
                System.arraycopy(flat, i * k, matrix[i], 0, k);
            }
            return matrix;
        }

        private static double[] doubles(List<Object> list) {
            double[] values = new double[list.size()];
            for (int i = 0; i < values.length; i++) {
                values[i] = (Double) list.get(i);
            }
            return values;
        }
    }
}
