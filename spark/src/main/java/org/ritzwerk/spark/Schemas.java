package org.ritzwerk.spark;

import org.apache.spark.sql.types.ArrayType;
import org.apache.spark.sql.types.DataType;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;

/**
 * The tables the operations read and write. Input tables need the named columns with these
 * types (other columns are ignored; column order is free); output tables have exactly these
 * columns in this order. Doubles that a job leaves undefined (a residual of an unexplained peak,
 * a presence without strong lines) are null, never NaN; the one NaN an output holds is an input's
 * own, echoed as the refused {@code value} of a {@link #PEAK_ROW_PROBLEMS} row.
 *
 * <p><b>Input schemas are nullable.</b> {@link #PEAK_LISTS}, {@link #PEAK_ROWS},
 * {@link #EXPOSURES}, {@link #SCIENCE} and {@link #SCENES} declare every column and every array
 * element nullable, as tables read from files have them, so a table built with them
 * ({@code spark.createDataFrame(rows, Schemas.SCENES)}) keeps a null where one was given. Which
 * columns a row must give is said per constant (the others are "nullable" there): a null in a
 * required column or a null array element is refused by the operation, naming the row's id and
 * the field ({@code row 'scene-3', field 'seed': is null}). Output schemas declare the columns
 * that are never null as not nullable.
 *
 * <p><b>Ids are keys.</b> In every input table whose {@code id} names a spectrum, an exposure or
 * a scene ({@link #PEAK_LISTS}, {@link #EXPOSURES}, {@link #SCENES}, {@link #SCIENCE}), and in
 * the {@link #CALIBRATIONS} that {@link SurveyCalibration#apply} joins on, each row needs its own
 * id: the outputs are keyed by it (the per-peak table, a calibration's science spectra), so a
 * repeated id (typically the same file ingested twice) fails the job with a
 * {@link SparkRowException} naming the id, e.g. {@code row 'spectrum-7', field 'id': the
 * peak-list table has 2 rows with this id; each row needs its own id (the outputs are keyed by
 * it)}. The ids are counted by Spark in the operation's own job (one more read of the id column
 * and a shuffle of the distinct ids): persist an input whose making is expensive.
 *
 * <p><b>Array columns.</b> Arrays of doubles may come with or without null elements allowed in
 * their type (Parquet files give them with); a null element is refused naming its row, field and
 * index. The operations read these columns in Spark's own form, each array copied out in one
 * piece, and only the columns named here (others are never read).
 */
public final class Schemas {

    private Schemas() {
    }

    private static final ArrayType DOUBLES = DataTypes.createArrayType(DataTypes.DoubleType, false);
    private static final ArrayType STRINGS = DataTypes.createArrayType(DataTypes.StringType, false);

    private static StructField required(String name, DataType type) {
        return DataTypes.createStructField(name, type, false);
    }

    private static StructField optional(String name, DataType type) {
        return DataTypes.createStructField(name, type, true);
    }

    private static StructType struct(StructField... fields) {
        return DataTypes.createStructType(fields);
    }

    /**
     * @return the columns with every column and every array element nullable: the schema a user
     *         builds an input table with, so that Spark keeps a null for the operation to refuse
     *         by row and field (a column declared not nullable makes Spark read a null as 0, or
     *         fail inside its optimiser)
     */
    private static StructType input(StructType columns) {
        StructField[] fields = columns.fields().clone();
        for (int k = 0; k < fields.length; k++) {
            DataType type = fields[k].dataType();
            if (type instanceof ArrayType array) {
                type = DataTypes.createArrayType(array.elementType(), true);
            }
            fields[k] = DataTypes.createStructField(fields[k].name(), type, true);
        }
        return DataTypes.createStructType(fields);
    }

    /** The columns of {@link #PEAK_LISTS}: required ones not nullable, optional ones nullable. */
    static final StructType PEAK_LISTS_COLUMNS = struct(
            required("id", DataTypes.StringType),
            required("positions", DOUBLES),
            optional("sigmas", DOUBLES),
            optional("intensities", DOUBLES),
            optional("widths", DOUBLES));

    /**
     * Identification input, one row per spectrum: {@code id} string; {@code positions}
     * array&lt;double&gt; (the peaks, in the unit and medium of {@link IdentificationParameters});
     * {@code sigmas} array&lt;double&gt;, nullable (standard uncertainties, same unit; needed by a
     * k-sigma tolerance); {@code intensities} array&lt;double&gt;, nullable (photon counts or
     * proportional); {@code widths} array&lt;double&gt;, nullable (FWHMs, same unit, for the
     * plasma estimate). Arrays of one row have one element per peak.
     */
    public static final StructType PEAK_LISTS = input(PEAK_LISTS_COLUMNS);

    /** The columns of {@link #PEAK_ROWS}: required ones not nullable, optional ones nullable. */
    static final StructType PEAK_ROWS_COLUMNS = struct(
            required("id", DataTypes.StringType),
            required("peak", DataTypes.IntegerType),
            required("position", DataTypes.DoubleType),
            optional("sigma", DataTypes.DoubleType),
            optional("intensity", DataTypes.DoubleType),
            optional("width", DataTypes.DoubleType));

    /**
     * Identification input, one row per peak (turned into {@link #PEAK_LISTS} by
     * {@link SurveyIdentification#peakLists}): {@code id} string (the spectrum); {@code peak} int
     * (the peak's place in its spectrum, 0-based, ordering the arrays); {@code position} double;
     * {@code sigma}, {@code intensity}, {@code width} double, nullable (a spectrum's column is
     * used only when every one of its peaks gives it).
     */
    public static final StructType PEAK_ROWS = input(PEAK_ROWS_COLUMNS);

    /**
     * One identified peak: {@code peak} (0-based index in its spectrum), {@code position} (as
     * given), {@code status} ({@code matched}, {@code ambiguous} or {@code unexplained}),
     * {@code species} and {@code line} (the line's label), {@code line_position} (the line as
     * matched, shifted by the velocity and offset found, in the peaks' unit and medium),
     * {@code residual} (position minus line_position) and {@code residual_sigma} (the residual
     * over its scoring uncertainty); the last four null when unexplained; {@code ambiguity} (why
     * the peak is ambiguous: {@code close_rival}, {@code species_not_shown}, {@code may_be_stray},
     * joined by {@code ;}; null when it is not, the engine's {@code Identification.ambiguity});
     * for a close rival {@code rival_species}, {@code rival_line} (the rival line's label),
     * {@code rival_position} (where it lies, as line_position) and {@code rival_odds} (the
     * posterior odds of the peak's line against it), all four null otherwise.
     */
    public static final StructType IDENTIFIED_PEAK = struct(
            required("peak", DataTypes.IntegerType),
            required("position", DataTypes.DoubleType),
            required("status", DataTypes.StringType),
            optional("species", DataTypes.StringType),
            optional("line", DataTypes.StringType),
            optional("line_position", DataTypes.DoubleType),
            optional("residual", DataTypes.DoubleType),
            optional("residual_sigma", DataTypes.DoubleType),
            optional("ambiguity", DataTypes.StringType),
            optional("rival_species", DataTypes.StringType),
            optional("rival_line", DataTypes.StringType),
            optional("rival_position", DataTypes.DoubleType),
            optional("rival_odds", DataTypes.DoubleType));

    /**
     * A species' presence weighed against chance (the engine's
     * {@code Identification.SpeciesPresence}): {@code species}, {@code matched},
     * {@code matched_by_chance}, {@code strong_in_range}, {@code strong_matched},
     * {@code strong_by_chance}, {@code chance_probability} and {@code presence} (both null when
     * the species has no strong line in range).
     */
    public static final StructType PRESENCE = struct(
            required("species", DataTypes.StringType),
            required("matched", DataTypes.IntegerType),
            required("matched_by_chance", DataTypes.DoubleType),
            required("strong_in_range", DataTypes.IntegerType),
            required("strong_matched", DataTypes.IntegerType),
            required("strong_by_chance", DataTypes.DoubleType),
            optional("chance_probability", DataTypes.DoubleType),
            optional("presence", DataTypes.DoubleType));

    /**
     * One plasma diagnostic (the engine's {@code PlasmaEstimate.Row}): {@code species},
     * {@code quantity} (e.g. an excitation temperature or an electron density), {@code value} and
     * {@code uncertainty} in {@code unit} (null when not estimated), {@code lines} used and a
     * {@code note}.
     */
    public static final StructType PLASMA = struct(
            required("species", DataTypes.StringType),
            required("quantity", DataTypes.StringType),
            optional("value", DataTypes.DoubleType),
            optional("uncertainty", DataTypes.DoubleType),
            required("unit", DataTypes.StringType),
            optional("lines", DataTypes.StringType),
            optional("note", DataTypes.StringType));

    /**
     * Identification output, one row per spectrum: {@code id}; {@code peaks} (array of
     * {@link #IDENTIFIED_PEAK}, in the input's order); counts {@code matched}, {@code ambiguous},
     * {@code unexplained}; {@code velocity_m_s}, {@code velocity_sigma_m_s},
     * {@code velocity_lines} (when a velocity is searched: null value when no line matched at any
     * velocity, null sigma from fewer than two lines); {@code offset_nm}, {@code offset_sigma_nm},
     * {@code offset_lines} (the same for an offset search, vacuum nm); {@code missing_strong}
     * (strong lines in range left unmatched, "species label"); {@code presence} (array of
     * {@link #PRESENCE}); {@code plasma} (array of {@link #PLASMA}, null unless asked for);
     * {@code failure_code} and {@code failure} (the job's error code and message when it refused
     * this spectrum, every other result column then null); {@code shifts_tried} (the independent
     * shifts a velocity or offset search tried, {@code Identification.shiftsTried()}, 1 without a
     * search: the presences' chance probabilities are over them, their chance counts one shift's).
     */
    public static final StructType IDENTIFIED_SPECTRA = struct(
            required("id", DataTypes.StringType),
            optional("peaks", DataTypes.createArrayType(IDENTIFIED_PEAK, false)),
            optional("matched", DataTypes.IntegerType),
            optional("ambiguous", DataTypes.IntegerType),
            optional("unexplained", DataTypes.IntegerType),
            optional("velocity_m_s", DataTypes.DoubleType),
            optional("velocity_sigma_m_s", DataTypes.DoubleType),
            optional("velocity_lines", DataTypes.IntegerType),
            optional("offset_nm", DataTypes.DoubleType),
            optional("offset_sigma_nm", DataTypes.DoubleType),
            optional("offset_lines", DataTypes.IntegerType),
            optional("missing_strong", STRINGS),
            optional("presence", DataTypes.createArrayType(PRESENCE, false)),
            optional("plasma", DataTypes.createArrayType(PLASMA, false)),
            optional("failure_code", DataTypes.StringType),
            optional("failure", DataTypes.StringType),
            optional("shifts_tried", DataTypes.DoubleType));

    /**
     * Identification output, one row per peak ({@link SurveyIdentification.Result#peaks()}):
     * {@code id} of the spectrum followed by the columns of {@link #IDENTIFIED_PEAK}.
     */
    public static final StructType IDENTIFIED_PEAKS = struct(concat(
            new StructField[] {required("id", DataTypes.StringType)}, IDENTIFIED_PEAK.fields()));

    /** The columns of {@link #EXPOSURES}: required ones not nullable, optional ones nullable. */
    static final StructType EXPOSURES_COLUMNS = struct(
            required("id", DataTypes.StringType),
            required("counts", DOUBLES),
            optional("sigmas", DOUBLES));

    /**
     * Calibration input, one row per raw lamp exposure: {@code id} string; {@code counts}
     * array&lt;double&gt; (counts per pixel, pixel 0 first); {@code sigmas} array&lt;double&gt;,
     * nullable (their standard uncertainties; from the counts when null).
     */
    public static final StructType EXPOSURES = input(EXPOSURES_COLUMNS);

    /**
     * Calibration output, one row per exposure: {@code id}; {@code pixels}; the dispersion
     * polynomial (the api's {@code DispersionPolynomial}): {@code medium} ({@code air} or
     * {@code vacuum}), {@code degree}, {@code centre_pixel}, {@code half_range},
     * {@code coefficients} (a_0 .. a_d in nm of x = (pixel - centre_pixel) / half_range),
     * {@code covariance} (their (d + 1) x (d + 1) covariance in nm^2, row by row),
     * {@code higher_degree_coefficients} and {@code higher_degree_covariance} (a higher degree's
     * polynomial fitted to the same lines, b_0 .. b_e, and its (e + 1) x (e + 1) covariance row by
     * row: beyond the fitted range the stated uncertainty covers it, as the api's
     * {@code DispersionPolynomial} keeps it), {@code lowest_pixel}, {@code highest_pixel}; quality:
     * {@code rms_nm}, {@code rms_pixels},
     * {@code reduced_chi_square}, {@code lines_used}, {@code lines_rejected},
     * {@code peaks_found}, {@code strong_peaks}, {@code strong_matched},
     * {@code matched_fraction}, {@code coverage} (fraction of the detector between the outermost
     * lines used), {@code saturated_peaks}, {@code lines} (the pairs' labels, in the solution's
     * order), {@code description}, {@code end_check_low_pixels} and {@code end_check_high_pixels}
     * (how well the other fitted lines predict each outermost line's pixel, the engine's
     * {@code Calibration.endConfirmationPixels}; null when too few lines remain for the degree);
     * {@code failure_code} and {@code failure} when the job refused
     * the exposure (every other column but id, pixels and notes then null);
     * {@code higher_degree_weight} (the Akaike weight of the higher degree against the chosen one
     * when it is the next degree and the degree was chosen, the api's
     * {@code DispersionPolynomial.higherDegreeWeight}: with it the stated uncertainty between the
     * lines covers the choice of degree; null when not known, and a table without the column is
     * applied as if null); {@code notes} (what the
     * {@code calibrate} command prints as notes: how a lamp without a lamp set was built from its
     * level list, lines of the lists used once or left out, a saturation level taken from the
     * exposure, an end where the solution rests on one pairing; empty when there is nothing to
     * say).
     *
     * <p><b>Nulls</b>, as the schema declares them (arrays never hold a null element):
     * <ul>
     * <li>never null: {@code id}, {@code pixels} (the exposure's length), {@code notes} (empty,
     * not null, when there is nothing to say; a refused exposure keeps the lamp's notes);</li>
     * <li>null exactly when the exposure was refused: {@code medium}, {@code degree},
     * {@code centre_pixel}, {@code half_range}, {@code coefficients}, {@code lowest_pixel},
     * {@code highest_pixel}, {@code lines_used}, {@code lines_rejected}, {@code peaks_found},
     * {@code strong_peaks}, {@code strong_matched}, {@code saturated_peaks}, {@code lines},
     * {@code description};</li>
     * <li>null when refused, and in an accepted row when the figure is not a finite number
     * ({@code rms_nm} and {@code rms_pixels} without a used pair, {@code reduced_chi_square}
     * without a degree of freedom; {@code matched_fraction} and {@code coverage} are written null
     * if not finite, which an accepted calibration does not give);</li>
     * <li>null when refused, and in an accepted row when the solution has no covariance (an
     * element of it undefined): {@code covariance};</li>
     * <li>null when refused, and in an accepted row when the lines did not determine a higher
     * degree with a degree of freedom to spare, or the solution has no covariance (both then null
     * together): {@code higher_degree_coefficients}, {@code higher_degree_covariance};</li>
     * <li>null when refused, and in an accepted row when too few pairs remain for the degree to
     * predict an outermost line, or the fit has no covariance: {@code end_check_low_pixels},
     * {@code end_check_high_pixels};</li>
     * <li>null exactly when the exposure was accepted: {@code failure_code}, {@code failure};</li>
     * <li>null when refused, and in an accepted row when not known (see above):
     * {@code higher_degree_weight}.</li>
     * </ul>
     */
    public static final StructType CALIBRATIONS = struct(
            required("id", DataTypes.StringType),
            required("pixels", DataTypes.IntegerType),
            optional("medium", DataTypes.StringType),
            optional("degree", DataTypes.IntegerType),
            optional("centre_pixel", DataTypes.DoubleType),
            optional("half_range", DataTypes.DoubleType),
            optional("coefficients", DOUBLES),
            optional("covariance", DOUBLES),
            optional("higher_degree_coefficients", DOUBLES),
            optional("higher_degree_covariance", DOUBLES),
            optional("lowest_pixel", DataTypes.DoubleType),
            optional("highest_pixel", DataTypes.DoubleType),
            optional("rms_nm", DataTypes.DoubleType),
            optional("rms_pixels", DataTypes.DoubleType),
            optional("reduced_chi_square", DataTypes.DoubleType),
            optional("lines_used", DataTypes.IntegerType),
            optional("lines_rejected", DataTypes.IntegerType),
            optional("peaks_found", DataTypes.IntegerType),
            optional("strong_peaks", DataTypes.IntegerType),
            optional("strong_matched", DataTypes.IntegerType),
            optional("matched_fraction", DataTypes.DoubleType),
            optional("coverage", DataTypes.DoubleType),
            optional("saturated_peaks", DataTypes.IntegerType),
            optional("lines", STRINGS),
            optional("description", DataTypes.StringType),
            optional("end_check_low_pixels", DataTypes.DoubleType),
            optional("end_check_high_pixels", DataTypes.DoubleType),
            optional("failure_code", DataTypes.StringType),
            optional("failure", DataTypes.StringType),
            optional("higher_degree_weight", DataTypes.DoubleType),
            required("notes", STRINGS));

    /** The columns of {@link #SCIENCE}: required ones not nullable, optional ones nullable. */
    static final StructType SCIENCE_COLUMNS = struct(
            required("id", DataTypes.StringType),
            required("calibration_id", DataTypes.StringType),
            required("counts", DOUBLES));

    /**
     * Input of applying calibrations, one row per science spectrum: {@code id} string;
     * {@code calibration_id} string (the {@code id} of a row of {@link #CALIBRATIONS});
     * {@code counts} array&lt;double&gt;.
     */
    public static final StructType SCIENCE = input(SCIENCE_COLUMNS);

    /**
     * Output of applying calibrations: {@code id}, {@code calibration_id}, {@code counts} (as
     * given), {@code wavelengths_nm} (each pixel centre's wavelength in the calibration's
     * medium), {@code wavelength_sigmas_nm} (their standard uncertainties from the covariance)
     * and {@code medium}; {@code failure_code} and {@code failure} when the spectrum's
     * calibration was refused (a lamp exposure that did not calibrate): the calibration's
     * {@code failure_code} (such as {@code calibrate.too-few-peaks}) and a message naming the
     * calibration and its failure, {@code wavelengths_nm}, {@code wavelength_sigmas_nm} and
     * {@code medium} then null.
     */
    public static final StructType CALIBRATED = struct(
            required("id", DataTypes.StringType),
            required("calibration_id", DataTypes.StringType),
            required("counts", DOUBLES),
            optional("wavelengths_nm", DOUBLES),
            optional("wavelength_sigmas_nm", DOUBLES),
            optional("medium", DataTypes.StringType),
            optional("failure_code", DataTypes.StringType),
            optional("failure", DataTypes.StringType));

    /** The columns of {@link #SCENES}: required ones not nullable, optional ones nullable. */
    static final StructType SCENES_COLUMNS = struct(
            required("id", DataTypes.StringType),
            required("species", STRINGS),
            optional("abundances", DOUBLES),
            required("temperature_k", DataTypes.DoubleType),
            optional("electron_density_m3", DataTypes.DoubleType),
            required("velocity_m_s", DataTypes.DoubleType),
            required("resolving_power", DataTypes.DoubleType),
            required("seed", DataTypes.LongType));

    /**
     * Synthesis input, one row per scene: {@code id} string; {@code species} array&lt;string&gt;
     * (one-electron ions such as {@code "H I"}, {@code "He II"}, neutral alkali atoms such as
     * {@code "Na I"}, and species with a level list whose lines have A values, such as
     * {@code "He I"}); {@code abundances} array&lt;double&gt;, nullable (relative numbers of
     * atoms, one per species; 1 each when null); {@code temperature_k}; {@code electron_density_m3},
     * nullable (Saha balance and Stark widths when given); {@code velocity_m_s} (line-of-sight,
     * positive away); {@code resolving_power} (the instrument's lambda / FWHM); {@code seed} long
     * (the noise draw of this row).
     */
    public static final StructType SCENES = input(SCENES_COLUMNS);

    /**
     * One line of a synthetic spectrum's truth (the engine's {@code Scene.Lines}):
     * {@code label}, {@code position_nm} (centre in the grid's medium, Doppler-shifted),
     * {@code photons} (photon rate before scaling), {@code gaussian_fwhm_nm} (Doppler),
     * {@code lorentz_fwhm_nm} (collisional, natural and Stark), {@code counts} (the line's
     * expected counts over its whole profile) and {@code counts_in_pixels} (the part of them the
     * pixels hold; less for a line near or beyond an end of the grid).
     */
    public static final StructType TRUE_LINE = struct(
            required("label", DataTypes.StringType),
            required("position_nm", DataTypes.DoubleType),
            required("photons", DataTypes.DoubleType),
            required("gaussian_fwhm_nm", DataTypes.DoubleType),
            required("lorentz_fwhm_nm", DataTypes.DoubleType),
            required("counts", DataTypes.DoubleType),
            required("counts_in_pixels", DataTypes.DoubleType));

    /**
     * The lines of a synthetic spectrum that lie on its grid but carry no light (the engine's
     * {@code SyntheticSpectrum.darkLines()}, a {@code DarkLines}): {@code on_grid} (the scene's
     * lines whose centre lies on the grid, ends included, dark or not), {@code dark} (how many of
     * them carry no light: their counts are 0), and that number split by cause, one column per
     * {@code DarkLines.Cause} in lower case: {@code zero_intensity} (a line list gave intensity 0,
     * or one that became 0 when the list was scaled to the one-electron ions),
     * {@code intensity_underflow} (a line list gave a rate above 0, but its counts scaled to the
     * scene's peak counts are below the smallest double), {@code population_underflow} (the scene
     * computed the rate, Boltzmann population and Saha balance, and it or its scaled counts are
     * below the smallest double: too cold, or no emitters left). The three sum to {@code dark}.
     */
    public static final StructType DARK_LINES = struct(
            required("on_grid", DataTypes.IntegerType),
            required("dark", DataTypes.IntegerType),
            required("zero_intensity", DataTypes.IntegerType),
            required("intensity_underflow", DataTypes.IntegerType),
            required("population_underflow", DataTypes.IntegerType));

    /**
     * Synthesis output, one row per scene: {@code id}; {@code counts} (with noise, one per pixel
     * of the grid in {@link SynthesisParameters}); {@code expected_counts} (without noise);
     * {@code lines} (the truth, array of {@link #TRUE_LINE}); {@code failure_code} and
     * {@code failure} when the job refused the scene (e.g. no line carries light in the grid);
     * {@code notes} (what the scene's physics left out or merged, as {@code synth} prints them as
     * notes: Stark widths drawn only for some lines, Balmer lines merged by the density, ...; and
     * settings away from their defaults that do nothing for the scene, such as a level model for a
     * scene without one-electron ions; empty when there is nothing to say, null for a refused
     * scene); {@code dark_lines} ({@link #DARK_LINES}: how many lines on the grid carry no light,
     * by cause, so that {@code where("dark_lines.dark > 0")} finds the scenes with dark lines and
     * {@code dark_lines.population_underflow > 0} those too cold for some of their lines; null for
     * a refused scene, as the other result columns).
     */
    public static final StructType SPECTRA = struct(
            required("id", DataTypes.StringType),
            optional("counts", DOUBLES),
            optional("expected_counts", DOUBLES),
            optional("lines", DataTypes.createArrayType(TRUE_LINE, false)),
            optional("failure_code", DataTypes.StringType),
            optional("failure", DataTypes.StringType),
            optional("notes", STRINGS),
            optional("dark_lines", DARK_LINES));

    /**
     * The problems the operations' {@code validate} methods find in an input table, one row per
     * problem: {@code id} string, nullable (the row's id; null for a schema problem or a row whose
     * id is null); {@code field} string, nullable (the column; null when the row as a whole is
     * refused); {@code code} string ({@link SparkRowException#BAD_FIELD} or
     * {@link SparkRowException#BAD_SCHEMA}; {@link SparkRowException#BAD_ROW} only should a check
     * meet an engine refusal, which the checks are made to foresee); {@code message} string (exactly the message of the
     * {@link SparkRowException} the operation fails with on that row, e.g. {@code row 'exp-17',
     * field 'counts': element 3 is NaN; each must be finite}).
     */
    public static final StructType PROBLEMS = struct(
            optional("id", DataTypes.StringType),
            optional("field", DataTypes.StringType),
            required("code", DataTypes.StringType),
            required("message", DataTypes.StringType));

    /**
     * The problems {@link SurveyIdentification#validatePeakRows} finds in a {@link #PEAK_ROWS}
     * table, one row per refused peak row: the columns of {@link #PROBLEMS} with the row's
     * {@code peak} after {@code id} and its {@code value} after {@code field}. {@code id} string,
     * nullable (the spectrum; null for a row whose id is null, and for a schema problem);
     * {@code peak} int, nullable (the row's peak index as given; null when it is null, and for a
     * schema problem); {@code field} string, nullable (the column: {@code id}, {@code peak},
     * {@code position}, {@code sigma}, {@code intensity} or {@code width}; the column of a schema
     * problem); {@code value} double, nullable (the refused value of a {@code position},
     * {@code sigma}, {@code intensity} or {@code width} exactly as given, NaN and infinities
     * included, which is the one place an output table holds them; null when that value is null,
     * and for a problem of the {@code id} or {@code peak}); {@code code} string
     * ({@link SparkRowException#BAD_FIELD}, or {@link SparkRowException#BAD_SCHEMA} for a missing
     * or mistyped column); {@code message} string (the message of the {@link SparkRowException}
     * that {@link SurveyIdentification#peakLists} fails with on that row, e.g. {@code row 'e',
     * field 'sigma': peak 1 has -0.001; a sigma must be finite and at least 0}).
     */
    public static final StructType PEAK_ROW_PROBLEMS = struct(
            optional("id", DataTypes.StringType),
            optional("peak", DataTypes.IntegerType),
            optional("field", DataTypes.StringType),
            optional("value", DataTypes.DoubleType),
            required("code", DataTypes.StringType),
            required("message", DataTypes.StringType));

    private static StructField[] concat(StructField[] a, StructField[] b) {
        StructField[] all = new StructField[a.length + b.length];
        System.arraycopy(a, 0, all, 0, a.length);
        System.arraycopy(b, 0, all, a.length, b.length);
        return all;
    }
}
