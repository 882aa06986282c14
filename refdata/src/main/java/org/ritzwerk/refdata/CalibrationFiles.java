package org.ritzwerk.refdata;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.ritzwerk.data.CalibrationRecord;
import org.ritzwerk.data.DispersionPolynomial;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import tools.jackson.core.JacksonException;
import tools.jackson.core.StreamReadFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Ritzwerk's wavelength-calibration file ({@code ritzwerk-calibration}, version 1), JSON:
 * <pre>
 * {
 *   "format": "ritzwerk-calibration", "version": 1,
 *   "description": "...",                 free text: spectrum and lamp sets it came from
 *   "medium": "air",                      medium of the wavelengths (vacuum, air, air(model))
 *   "pixels": 2048,                       detector pixels the solution was made for
 *   "valid_pixels": [12.4, 2031.9],       pixel range covered by the fitted lines
 *   "centre_pixel": 1023.5, "half_range": 1023.5,
 *   "coefficients_nm": [a0, a1, ...],     wavelength = sum a_k x^k, x = (pixel - centre) / half_range
 *   "covariance_nm2": [[...], ...],       their covariance (null when unknown)
 *   "higher_degree_coefficients_nm": [b0, ...],  a higher degree's polynomial fitted to the same
 *   "higher_degree_covariance_nm2": [[...], ...], lines and its covariance: beyond valid_pixels the
 *                                         stated uncertainty covers it; both absent when unknown
 *   "higher_degree_weight": 0.27,         when that degree is the next one and the degree was chosen:
 *                                         its Akaike weight, with which the stated uncertainty between
 *                                         the lines covers the choice; absent when unknown
 *   "power_coefficients_nm": [c0, c1, ...] the same polynomial in the pixel itself, for reference
 *   "degree": 3, "rms_nm": ..., "rms_pixels": ..., "reduced_chi_square": ...,
 *   "lines_used": 31, "lines_rejected": 2,
 *   "lines": [ {"pixel", "wavelength_nm", "sigma_nm", "residual_nm", "residual_pixels", "used", "line",
 *               "flag"} ],                 flag only when there is one: "blend" for a peak that
 *                                         looks like an unresolved blend (uncertainty widened)
 *   "saturated_lines": [ {"pixel", "wavelength_nm", "line"} ]   paired but left out of the fit
 *                                         (their peaks reached the saturation level); only when any
 * }
 * </pre>
 * Pixel p (0-based) has its centre at p. The file holds a {@link CalibrationRecord} (api): the
 * solution's members (medium, pixels, valid_pixels, centre_pixel, half_range, coefficients_nm,
 * covariance_nm2) are required, and higher_degree_coefficients_nm with higher_degree_covariance_nm2
 * (and higher_degree_weight) are read when present (a file written before they were kept has
 * none: its uncertainty beyond valid_pixels is then the covariance's alone, and between the lines
 * it has no widening for the degree choice); the record of how it was made (description, rms_nm, rms_pixels,
 * reduced_chi_square, lines, saturated_lines) may be absent or null (a hand-written file of
 * stored coefficients), and is checked when present: each line's residual_nm must be its
 * wavelength minus the solution at its pixel (to 1e-6 nm), so a file whose coefficients were
 * changed after the fit is refused. The members that follow from the others
 * (power_coefficients_nm, degree, lines_used, lines_rejected) are written for the reader's
 * convenience; they are not read back, but where a file gives them they must agree with what
 * they follow from, and valid_pixels must lie on the detector and, when the file lists its
 * lines, within the pixels of the lines used (a contradiction is refused naming the member).
 * A missing medium is refused as missing. A record written by {@link #toJson(CalibrationRecord)} reads
 * back equal ({@link #readRecord}). Reading also checks the polynomial across the whole detector
 * with the engine's {@link DispersionSolution#checkAcross(int, double)}. Stateless and
 * thread-safe.
 */
public final class CalibrationFiles {

    /** The format name. */
    public static final String FORMAT = "ritzwerk-calibration";
    /** The format version. */
    public static final int VERSION = 1;

    private CalibrationFiles() {
    }

    /**
     * A calibration read back: the {@link CalibrationRecord} as the file holds it, and the
     * engine's {@link DispersionSolution} that evaluates its polynomial.
     */
    public static final class Calibration {

        private final CalibrationRecord record;
        private final DispersionSolution solution;

        /** @param record a calibration record; its polynomial becomes the {@link #solution()} */
        public Calibration(CalibrationRecord record) {
            this.record = Objects.requireNonNull(record, "record");
            this.solution = DispersionSolution.of(record.polynomial());
        }

        /** @return the calibration as the file holds it */
        public CalibrationRecord record() {
            return record;
        }

        /** @return the dispersion solution of the record's polynomial (no fitted pairs) */
        public DispersionSolution solution() {
            return solution;
        }

        /** @return the detector's pixel count it was made for */
        public int pixels() {
            return record.pixels();
        }

        /** @return the free-text description */
        public String description() {
            return record.description();
        }
    }

    /**
     * Writes through a temporary file renamed into place ({@link OutputFiles}): an old file of that
     * name stays whole until the new one is complete. The first write of the process installs
     * {@link OutputFiles}' shutdown hook (one per JVM), which removes temporary files an
     * interrupted process leaves; a container that redeploys applications in one JVM keeps it.
     *
     * @param file   where to write
     * @param record the calibration
     * @throws IOException when the file cannot be written
     */
    public static void write(Path file, CalibrationRecord record) throws IOException {
        OutputFiles.writeString(file, toJson(record));
    }

    /**
     * @param file        where to write
     * @param solution    the fitted solution
     * @param pixels      the detector's pixel count
     * @param description free text: what it came from
     * @param lineLabels  one label per fitted pair of the solution
     * @throws IOException when the file cannot be written
     */
    public static void write(Path file, DispersionSolution solution, int pixels, String description,
            List<String> lineLabels) throws IOException {
        write(file, solution.toRecord(pixels, description, lineLabels, List.of()));
    }

    /**
     * @param solution    the fitted solution
     * @param pixels      the detector's pixel count; at least 2
     * @param description free text: what it came from
     * @param lineLabels  one label per fitted pair of the solution
     * @return the file's text (see {@link #write}), with no saturated lines
     */
    public static String toJson(DispersionSolution solution, int pixels, String description, List<String> lineLabels) {
        return toJson(solution.toRecord(pixels, description, lineLabels, List.of()));
    }

    /**
     * @param solution    the fitted solution
     * @param pixels      the detector's pixel count; at least 2
     * @param description free text: what it came from
     * @param lineLabels  one label per fitted pair of the solution
     * @param saturated   the pairs left out of the fit because their peaks saturated; written as
     *                    {@code saturated_lines} when there are any
     * @return the file's text (see {@link #write})
     */
    public static String toJson(DispersionSolution solution, int pixels, String description, List<String> lineLabels,
            List<CalibrationRecord.SaturatedLine> saturated) {
        return toJson(solution.toRecord(pixels, description, lineLabels, saturated));
    }

    /**
     * @param record the calibration
     * @return the file's text (see {@link #write}); {@link #readRecord} gives the record back
     *         equal
     */
    public static String toJson(CalibrationRecord record) {
        DispersionPolynomial polynomial = record.polynomial();
        JsonMapper mapper = JsonMapper.builder().build();
        ObjectNode root = mapper.createObjectNode();
        root.put("format", FORMAT);
        root.put("version", VERSION);
        root.put("description", record.description());
        root.put("medium", polynomial.medium().spec());
        root.put("pixels", record.pixels());
        ArrayNode valid = root.putArray("valid_pixels");
        valid.add(polynomial.lowestPixel());
        valid.add(polynomial.highestPixel());
        root.put("centre_pixel", polynomial.centrePixel());
        root.put("half_range", polynomial.halfRange());
        ArrayNode coefficients = root.putArray("coefficients_nm");
        for (double c : polynomial.coefficients()) {
            coefficients.add(c);
        }
        double[][] covariance = polynomial.covariance();
        if (covariance == null) {
            root.putNull("covariance_nm2");
        } else {
            putMatrix(root, "covariance_nm2", covariance);
        }
        if (polynomial.higherDegreeCoefficients() != null) {
            ArrayNode higher = root.putArray("higher_degree_coefficients_nm");
            for (double c : polynomial.higherDegreeCoefficients()) {
                higher.add(c);
            }
            putMatrix(root, "higher_degree_covariance_nm2", polynomial.higherDegreeCovariance());
            if (!Double.isNaN(polynomial.higherDegreeWeight())) {
                root.put("higher_degree_weight", polynomial.higherDegreeWeight());
            }
        }
        ArrayNode power = root.putArray("power_coefficients_nm");
        for (double c : polynomial.powerCoefficients()) {
            power.add(c);
        }
        root.put("degree", record.degree());
        putNumber(root, "rms_nm", record.rmsNm());
        putNumber(root, "rms_pixels", record.rmsPixels());
        putNumber(root, "reduced_chi_square", record.reducedChiSquare());
        root.put("lines_used", record.linesUsed());
        root.put("lines_rejected", record.linesRejected());
        ArrayNode lines = root.putArray("lines");
        for (CalibrationRecord.FittedLine pair : record.lines()) {
            ObjectNode line = lines.addObject();
            line.put("pixel", pair.pixel());
            line.put("wavelength_nm", pair.wavelengthNm());
            putNumber(line, "sigma_nm", pair.sigmaNm());
            line.put("residual_nm", pair.residualNm());
            line.put("residual_pixels", pair.residualPixels());
            line.put("used", pair.used());
            line.put("line", pair.line());
            if (!pair.flag().isEmpty()) {
                line.put("flag", pair.flag());
            }
        }
        if (!record.saturatedLines().isEmpty()) {
            ArrayNode left = root.putArray("saturated_lines");
            for (CalibrationRecord.SaturatedLine pair : record.saturatedLines()) {
                ObjectNode line = left.addObject();
                line.put("pixel", pair.pixel());
                line.put("wavelength_nm", pair.wavelengthNm());
                line.put("line", pair.line());
            }
        }
        return mapper.writerWithDefaultPrettyPrinter().writeValueAsString(root) + System.lineSeparator();
    }

    /**
     * @param file a calibration file
     * @return the calibration, with the engine's solution of its polynomial
     * @throws DataFileException naming the member that is missing or wrong, or when unreadable
     */
    public static Calibration read(Path file) {
        return new Calibration(readRecord(file));
    }

    /**
     * @param file a calibration file
     * @return the calibration as the file holds it (a file {@link #write} wrote reads back equal)
     * @throws DataFileException naming the member that is missing or wrong, or when unreadable
     */
    public static CalibrationRecord readRecord(Path file) {
        String source = file.toString();
        String text;
        try {
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw DataFileException.unreadable(source, e);
        }
        return parseRecord(source, text);
    }

    static Calibration parse(String source, String text) {
        return new Calibration(parseRecord(source, text));
    }

    static CalibrationRecord parseRecord(String source, String text) {
        text = TabularFiles.withoutByteOrderMark(text);
        JsonNode root;
        try {
            root = JsonMapper.builder().enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build().readTree(text);
        } catch (JacksonException e) {
            throw invalid(source, "not valid JSON: " + TabularFiles.readable(e));
        }
        if (!root.isObject() || !FORMAT.equals(root.path("format").asString(null))) {
            throw invalid(source, "expected a JSON object with \"format\": \"" + FORMAT + "\"");
        }
        if (root.path("version").asInt(-1) != VERSION) {
            throw invalid(source, "this reader knows " + FORMAT + " version " + VERSION + ", the file says "
                    + root.get("version"));
        }
        JsonNode mediumNode = root.get("medium");
        if (mediumNode == null || mediumNode.isNull()) {
            throw invalid(source, "\"medium\" is missing: give the medium of the wavelengths, \"vacuum\", \"air\" or"
                    + " \"air(<model>)\"");
        }
        if (!mediumNode.isString()) {
            throw invalid(source, "\"medium\" must be a string (\"vacuum\", \"air\" or \"air(<model>)\"), got "
                    + TabularFiles.shown(mediumNode));
        }
        Medium medium;
        try {
            medium = Medium.parse(mediumNode.asString());
        } catch (MediumException e) {
            throw invalid(source, "\"medium\": " + e.getMessage());
        }
        JsonNode pixelCount = root.path("pixels");
        int pixels = pixelCount.isIntegralNumber() && pixelCount.canConvertToInt() ? pixelCount.asInt() : -1;
        if (pixels < 2) {
            throw invalid(source, "\"pixels\" must be a whole number of at least 2, got "
                    + TabularFiles.shown(root.get("pixels")));
        }
        double[] valid = numbers(source, root, "valid_pixels");
        if (valid.length != 2) {
            throw invalid(source, "\"valid_pixels\" must hold two numbers, the lowest and highest pixel");
        }
        if (valid[0] < -0.5 || valid[1] > pixels - 0.5) {
            // a range beyond the detector would make every pixel look fitted, its extrapolated ones too
            throw invalid(source, "\"valid_pixels\" [" + valid[0] + ", " + valid[1] + "] reaches beyond the detector"
                    + " of \"pixels\" " + pixels + " (pixel p covers p - 0.5 to p + 0.5, so -0.5 to " + (pixels - 0.5)
                    + "): it is the range the fitted lines cover");
        }
        double centre = number(source, root, "centre_pixel");
        double halfRange = number(source, root, "half_range");
        double[] coefficients = numbers(source, root, "coefficients_nm");
        double[][] covariance = matrix(source, root, "covariance_nm2", coefficients.length);
        double[] higher = null;
        double[][] higherCovariance = null;
        if (root.get("higher_degree_coefficients_nm") != null || root.get("higher_degree_covariance_nm2") != null) {
            higher = numbers(source, root, "higher_degree_coefficients_nm");
            higherCovariance = matrix(source, root, "higher_degree_covariance_nm2", higher.length);
            if (higherCovariance == null) {
                throw invalid(source, "\"higher_degree_covariance_nm2\" must be given with "
                        + "\"higher_degree_coefficients_nm\"");
            }
        }
        double higherWeight = optionalNumber(source, root, "higher_degree_weight", "");
        String description = root.path("description").asString("");
        DispersionPolynomial polynomial;
        try {
            polynomial = new DispersionPolynomial(medium, centre, halfRange, coefficients, covariance, valid[0],
                    valid[1], higher, higherCovariance, higherWeight);
        } catch (IllegalArgumentException e) {
            throw invalid(source, e.getMessage());
        }
        checkAcrossTheDetector(source, DispersionSolution.of(polynomial), pixels);
        checkDerivedMembers(source, root, polynomial, pixels);
        double rmsNm = optionalNumber(source, root, "rms_nm", "");
        double rmsPixels = optionalNumber(source, root, "rms_pixels", "");
        double reducedChiSquare = optionalNumber(source, root, "reduced_chi_square", "");
        List<CalibrationRecord.FittedLine> lines = new ArrayList<>();
        for (JsonNode line : objects(source, root, "lines")) {
            String where = "\"lines\"[" + lines.size() + "]";
            try {
                lines.add(new CalibrationRecord.FittedLine(number(source, line, "pixel", where),
                        number(source, line, "wavelength_nm", where), optionalNumber(source, line, "sigma_nm", where),
                        number(source, line, "residual_nm", where), number(source, line, "residual_pixels", where),
                        bool(source, line, "used", where), text(source, line, "line", where),
                        line.get("flag") == null || line.get("flag").isNull() ? ""
                                : text(source, line, "flag", where)));
            } catch (IllegalArgumentException e) {
                throw invalid(source, where + ": " + e.getMessage());
            }
            // The record must agree with its own coefficients: reference minus solution is the residual.
            CalibrationRecord.FittedLine added = lines.get(lines.size() - 1);
            double fitted = DispersionSolution.of(polynomial).wavelengthAt(added.pixel());
            double expected = added.wavelengthNm() - fitted;
            if (!(Math.abs(added.residualNm() - expected) <= Math.max(1e-6, 1e-9 * Math.abs(added.wavelengthNm())))) {
                throw invalid(source, String.format(java.util.Locale.ROOT, "%s: residual_nm is %s, but the coefficients"
                        + " give %.6f nm at pixel %s, a residual of %.6f nm: the file contradicts itself (its"
                        + " coefficients were changed, or its lines belong to another solution)", where,
                        added.residualNm(), fitted, added.pixel(), expected));
            }
        }
        checkLinesAgree(source, root, lines, valid);
        List<CalibrationRecord.SaturatedLine> saturated = new ArrayList<>();
        for (JsonNode line : objects(source, root, "saturated_lines")) {
            String where = "\"saturated_lines\"[" + saturated.size() + "]";
            try {
                saturated.add(new CalibrationRecord.SaturatedLine(number(source, line, "pixel", where),
                        number(source, line, "wavelength_nm", where), text(source, line, "line", where)));
            } catch (IllegalArgumentException e) {
                throw invalid(source, where + ": " + e.getMessage());
            }
        }
        try {
            return new CalibrationRecord(description, pixels, polynomial, rmsNm, rmsPixels, reducedChiSquare, lines,
                    saturated);
        } catch (IllegalArgumentException e) {
            throw invalid(source, e.getMessage());
        }
    }

    /**
     * The members written for the reader's convenience must agree with those they follow from
     * when a file gives them: {@code degree} is the number of {@code coefficients_nm} less one,
     * and {@code power_coefficients_nm} give the same wavelengths as {@code coefficients_nm} at
     * every pixel (checked at evenly spaced pixels across the detector, at least twice as many as
     * coefficients, to max(1e-6 nm, 1e-9 of the wavelength) plus rounding: 1e-12 of the larger of
     * the power terms' magnitudes and those of the binomial expansion that gives the power form,
     * which is badly conditioned). A file that contradicts
     * itself is refused, naming the member, since which of the two a reader believes is a guess.
     */
    private static void checkDerivedMembers(String source, JsonNode root, DispersionPolynomial polynomial,
            int pixels) {
        JsonNode degree = root.get("degree");
        if (degree != null && !degree.isNull()) {
            if (!degree.isIntegralNumber() || !degree.canConvertToInt() || degree.asInt() != polynomial.degree()) {
                throw invalid(source, "\"degree\" is " + TabularFiles.shown(degree) + ", but \"coefficients_nm\" holds "
                        + polynomial.coefficients().length + " coefficients, a polynomial of degree "
                        + polynomial.degree() + ": the file contradicts itself");
            }
        }
        JsonNode power = root.get("power_coefficients_nm");
        if (power == null || power.isNull()) {
            return;
        }
        double[] b = numbers(source, power, "power_coefficients_nm");
        DispersionSolution solution = DispersionSolution.of(polynomial);
        int points = Math.max(8, 2 * Math.max(b.length, polynomial.coefficients().length));
        for (int k = 0; k < points; k++) {
            double p = (pixels - 1) * (double) k / (points - 1);
            double sum = 0;
            double magnitude = 0;
            double term = 1;
            for (double c : b) {
                sum += c * term;
                magnitude += Math.abs(c * term);
                term *= p;
            }
            // the expansion's own terms, sum |a_j| ((|p| + |c|) / h)^j, bound its rounding too
            double reach = (Math.abs(p) + Math.abs(polynomial.centrePixel())) / polynomial.halfRange();
            term = 1;
            double expansion = 0;
            for (double a : polynomial.coefficients()) {
                expansion += Math.abs(a) * term;
                term *= reach;
            }
            magnitude = Math.max(magnitude, expansion);
            double expected = solution.wavelengthAt(p);
            double allowed = Math.max(1e-6, 1e-9 * Math.abs(expected)) + 1e-12 * magnitude;
            if (!(Math.abs(sum - expected) <= allowed)) {
                throw invalid(source, String.format(java.util.Locale.ROOT, "\"power_coefficients_nm\" give %.6f nm at"
                        + " pixel %s, but \"coefficients_nm\" give %.6f nm there: the file contradicts itself (the"
                        + " power form follows from the scaled one; leave it out or write it from the same"
                        + " polynomial)", sum, pixel(p), expected));
            }
        }
    }

    /**
     * When the file lists its fitted lines: {@code lines_used} and {@code lines_rejected}, where
     * given, are their counts, and {@code valid_pixels} reaches no further than the pixels of the
     * lines used (the fitted range; beyond it the wavelengths are extrapolated and must not look
     * valid).
     */
    private static void checkLinesAgree(String source, JsonNode root, List<CalibrationRecord.FittedLine> lines,
            double[] valid) {
        JsonNode listed = root.get("lines");
        if (listed == null || listed.isNull()) {
            return;
        }
        int used = 0;
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (CalibrationRecord.FittedLine line : lines) {
            if (line.used()) {
                used++;
                lo = Math.min(lo, line.pixel());
                hi = Math.max(hi, line.pixel());
            }
        }
        checkCount(source, root, "lines_used", used, "used");
        checkCount(source, root, "lines_rejected", lines.size() - used, "not used");
        if (used > 0 && (valid[0] < lo - 1e-9 * (1 + Math.abs(lo)) || valid[1] > hi + 1e-9 * (1 + Math.abs(hi)))) {
            throw invalid(source, "\"valid_pixels\" [" + valid[0] + ", " + valid[1] + "] reaches beyond the lines"
                    + " used, which lie from pixel " + lo + " to " + hi + ": the valid range is the fitted one (beyond"
                    + " it the wavelengths are extrapolated)");
        }
    }

    private static void checkCount(String source, JsonNode root, String name, int count, String which) {
        JsonNode v = root.get(name);
        if (v != null && !v.isNull()
                && (!v.isIntegralNumber() || !v.canConvertToInt() || v.asInt() != count)) {
            throw invalid(source, "\"" + name + "\" is " + TabularFiles.shown(v) + ", but " + count
                    + " of \"lines\" are " + which + ": the file contradicts itself");
        }
    }

    /** Largest wavelength a solution may give, nm: one metre, far beyond any pixel detector's range. */
    static final double MAX_WAVELENGTH_NM = 1e9;

    /**
     * A solution read from a file must give every pixel of the detector a finite, positive
     * wavelength below {@link #MAX_WAVELENGTH_NM} with a finite uncertainty (when the file gives a
     * covariance; without one there is no uncertainty), rising or falling throughout (a dispersion
     * solution is monotonic): the engine's {@link DispersionSolution#checkAcross(int, double)},
     * its finding put in the file's terms.
     */
    private static void checkAcrossTheDetector(String source, DispersionSolution solution, int pixels) {
        Optional<DispersionSolution.DetectorDefect> found = solution.checkAcross(pixels, MAX_WAVELENGTH_NM);
        if (found.isEmpty()) {
            return;
        }
        DispersionSolution.DetectorDefect defect = found.get();
        double p = defect.pixel();
        double nm = defect.wavelengthNm();
        switch (defect.kind()) {
            case WAVELENGTH_OUT_OF_RANGE:
                throw invalid(source, String.format(java.util.Locale.ROOT, "the solution gives pixel %s %s; every pixel"
                        + " must get a wavelength above 0 and below 1e9 nm (check \"coefficients_nm\", \"centre_pixel\""
                        + " and \"half_range\")", pixel(p), Double.isFinite(nm) ? "the wavelength "
                        + String.format(java.util.Locale.ROOT, "%.6g nm", nm) : "no finite wavelength"));
            case UNCERTAINTY_OUT_OF_RANGE:
                throw invalid(source, "the solution's uncertainty at pixel " + pixel(p) + " is not a finite number of"
                        + " nm below 1e9; check \"covariance_nm2\"");
            default:
                throw invalid(source, "the solution is not monotonic: the wavelength "
                        + (defect.kind() == DispersionSolution.DetectorDefect.Kind.STANDS_STILL ? "stands still"
                                : "turns back") + " near pixel " + pixel(p) + "; a dispersion solution must rise or fall"
                        + " across the whole detector");
        }
    }

    private static String pixel(double p) {
        return p == Math.rint(p) ? String.valueOf((long) p) : String.format(java.util.Locale.ROOT, "%.1f", p);
    }

    private static void putNumber(ObjectNode node, String key, double value) {
        if (Double.isFinite(value)) {
            node.put(key, value);
        } else {
            node.putNull(key);
        }
    }

    private static double number(String source, JsonNode root, String name) {
        JsonNode v = root.get(name);
        if (v == null || !v.isNumber() || !Double.isFinite(v.asDouble())) {
            throw invalid(source, "\"" + name + "\" must be a finite number, got " + TabularFiles.shown(v));
        }
        return v.asDouble();
    }

    private static void putMatrix(ObjectNode root, String member, double[][] matrix) {
        ArrayNode rows = root.putArray(member);
        for (double[] row : matrix) {
            ArrayNode r = rows.addArray();
            for (double v : row) {
                r.add(v);
            }
        }
    }

    /** An n x n matrix member, one row per coefficient; null when absent or null. */
    private static double[][] matrix(String source, JsonNode root, String member, int n) {
        JsonNode node = root.get(member);
        if (node == null || node.isNull()) {
            return null;
        }
        if (!node.isArray() || node.size() != n) {
            throw invalid(source, "\"" + member + "\" must be a " + n + " x " + n
                    + " array (one row per coefficient) or null");
        }
        double[][] matrix = new double[n][];
        for (int r = 0; r < n; r++) {
            matrix[r] = numbers(source, node.get(r), member + " row " + r);
            if (matrix[r].length != n) {
                throw invalid(source, "\"" + member + "\" row " + r + " has " + matrix[r].length
                        + " values, expected " + n);
            }
        }
        return matrix;
    }

    private static double[] numbers(String source, JsonNode node, String name) {
        JsonNode array = node == null ? null : node.isArray() ? node : node.get(name);
        if (array == null || !array.isArray() || array.isEmpty()) {
            throw invalid(source, "\"" + name + "\" must be a non-empty array of numbers");
        }
        double[] values = new double[array.size()];
        for (int i = 0; i < values.length; i++) {
            if (!array.get(i).isNumber() || !Double.isFinite(array.get(i).asDouble())) {
                throw invalid(source, "\"" + name + "\"[" + i + "] must be a finite number, got " + TabularFiles.shown(array.get(i)));
            }
            values[i] = array.get(i).asDouble();
        }
        return values;
    }

    /** A member that may be absent or null (then NaN), else a finite number. */
    private static double optionalNumber(String source, JsonNode node, String name, String where) {
        JsonNode v = node.get(name);
        if (v == null || v.isNull()) {
            return Double.NaN;
        }
        if (!v.isNumber() || !Double.isFinite(v.asDouble())) {
            throw invalid(source, prefix(where) + "\"" + name + "\" must be a finite number or null, got "
                    + TabularFiles.shown(v));
        }
        return v.asDouble();
    }

    private static double number(String source, JsonNode node, String name, String where) {
        JsonNode v = node.get(name);
        if (v == null || !v.isNumber() || !Double.isFinite(v.asDouble())) {
            throw invalid(source, prefix(where) + "\"" + name + "\" must be a finite number, got " + TabularFiles.shown(v));
        }
        return v.asDouble();
    }

    private static boolean bool(String source, JsonNode node, String name, String where) {
        JsonNode v = node.get(name);
        if (v == null || !v.isBoolean()) {
            throw invalid(source, prefix(where) + "\"" + name + "\" must be true or false, got " + TabularFiles.shown(v));
        }
        return v.asBoolean();
    }

    private static String text(String source, JsonNode node, String name, String where) {
        JsonNode v = node.get(name);
        if (v == null || !v.isString()) {
            throw invalid(source, prefix(where) + "\"" + name + "\" must be a string, got " + TabularFiles.shown(v));
        }
        return v.asString();
    }

    /** The objects of an array member that may be absent or null (then none). */
    private static List<JsonNode> objects(String source, JsonNode root, String name) {
        JsonNode array = root.get(name);
        if (array == null || array.isNull()) {
            return List.of();
        }
        if (!array.isArray()) {
            throw invalid(source, "\"" + name + "\" must be an array of objects or null, got " + TabularFiles.shown(array));
        }
        List<JsonNode> objects = new ArrayList<>();
        for (int i = 0; i < array.size(); i++) {
            if (!array.get(i).isObject()) {
                throw invalid(source, "\"" + name + "\"[" + i + "] must be an object, got "
                        + TabularFiles.shown(array.get(i)));
            }
            objects.add(array.get(i));
        }
        return objects;
    }

    private static String prefix(String where) {
        return where.isEmpty() ? "" : where + ": ";
    }

    private static DataFileException invalid(String source, String message) {
        return new DataFileException(DataFileException.INVALID, source, List.of(), message);
    }
}
