package org.ritzwerk.refdata;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
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
 *   "power_coefficients_nm": [c0, c1, ...] the same polynomial in the pixel itself, for reference
 *   "degree": 3, "rms_nm": ..., "rms_pixels": ..., "reduced_chi_square": ...,
 *   "lines_used": 31, "lines_rejected": 2,
 *   "lines": [ {"pixel", "wavelength_nm", "sigma_nm", "residual_nm", "residual_pixels", "used", "line"} ],
 *   "saturated_lines": [ {"pixel", "wavelength_nm", "line"} ]   paired but left out of the fit
 *                                         (their peaks reached the saturation level); only when any
 * }
 * </pre>
 * Pixel p (0-based) has its centre at p. Reading uses only the solution's members (medium,
 * pixels, valid_pixels, centre_pixel, half_range, coefficients_nm, covariance_nm2); the rest is
 * the record of how it was made. Stateless and thread-safe.
 */
public final class CalibrationFiles {

    /** The format name. */
    public static final String FORMAT = "ritzwerk-calibration";
    /** The format version. */
    public static final int VERSION = 1;

    private CalibrationFiles() {
    }

    /**
     * A calibration read back.
     *
     * @param solution    the dispersion solution (no fitted pairs)
     * @param pixels      the detector's pixel count it was made for
     * @param description the free-text description
     */
    public record Calibration(DispersionSolution solution, int pixels, String description) {
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
        OutputFiles.writeString(file, toJson(solution, pixels, description, lineLabels, List.of()));
    }

    /**
     * A pair whose peak reached the detector's saturation level: paired with its lamp line but
     * left out of the fit.
     *
     * @param pixel        the peak's centroid, pixels
     * @param wavelengthNm the line's wavelength, nm, in the solution's medium
     * @param line         the line's label
     */
    public record SaturatedLine(double pixel, double wavelengthNm, String line) {
    }

    /**
     * @return the file's text (see {@link #write}), with no saturated lines
     */
    public static String toJson(DispersionSolution solution, int pixels, String description, List<String> lineLabels) {
        return toJson(solution, pixels, description, lineLabels, List.of());
    }

    /**
     * @param saturated the pairs left out of the fit because their peaks saturated; written as
     *                  {@code saturated_lines} when there are any
     * @return the file's text (see {@link #write})
     */
    public static String toJson(DispersionSolution solution, int pixels, String description, List<String> lineLabels,
            List<SaturatedLine> saturated) {
        if (lineLabels.size() != solution.size()) {
            throw new IllegalArgumentException(solution.size() + " fitted pairs but " + lineLabels.size() + " labels");
        }
        JsonMapper mapper = JsonMapper.builder().build();
        ObjectNode root = mapper.createObjectNode();
        root.put("format", FORMAT);
        root.put("version", VERSION);
        root.put("description", description);
        root.put("medium", solution.medium().spec());
        root.put("pixels", pixels);
        ArrayNode valid = root.putArray("valid_pixels");
        valid.add(solution.lowestPixel());
        valid.add(solution.highestPixel());
        root.put("centre_pixel", solution.centrePixel());
        root.put("half_range", solution.halfRange());
        ArrayNode coefficients = root.putArray("coefficients_nm");
        for (double c : solution.scaledCoefficients()) {
            coefficients.add(c);
        }
        double[][] covariance = solution.covariance();
        if (covariance == null) {
            root.putNull("covariance_nm2");
        } else {
            ArrayNode rows = root.putArray("covariance_nm2");
            for (double[] row : covariance) {
                ArrayNode r = rows.addArray();
                for (double v : row) {
                    r.add(v);
                }
            }
        }
        ArrayNode power = root.putArray("power_coefficients_nm");
        for (double c : solution.powerCoefficients()) {
            power.add(c);
        }
        root.put("degree", solution.degree());
        putNumber(root, "rms_nm", solution.rmsNm());
        putNumber(root, "rms_pixels", solution.rmsPixels());
        putNumber(root, "reduced_chi_square", solution.reducedChiSquare());
        root.put("lines_used", solution.usedCount());
        root.put("lines_rejected", solution.rejectedCount());
        ArrayNode lines = root.putArray("lines");
        for (int i = 0; i < solution.size(); i++) {
            ObjectNode line = lines.addObject();
            line.put("pixel", solution.pixel(i));
            line.put("wavelength_nm", solution.wavelength(i));
            putNumber(line, "sigma_nm", solution.sigmaNm(i));
            line.put("residual_nm", solution.residualNm(i));
            line.put("residual_pixels", solution.residualPixels(i));
            line.put("used", !solution.isRejected(i));
            line.put("line", lineLabels.get(i));
        }
        if (!saturated.isEmpty()) {
            ArrayNode left = root.putArray("saturated_lines");
            for (SaturatedLine pair : saturated) {
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
     * @return the calibration
     * @throws DataFileException naming the member that is missing or wrong, or when unreadable
     */
    public static Calibration read(Path file) {
        String source = file.toString();
        String text;
        try {
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw DataFileException.unreadable(source, e);
        }
        return parse(source, text);
    }

    static Calibration parse(String source, String text) {
        text = TabularFiles.withoutByteOrderMark(text);
        JsonNode root;
        try {
            root = JsonMapper.builder().enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build().readTree(text);
        } catch (JacksonException e) {
            throw invalid(source, "not valid JSON: " + e.getOriginalMessage());
        }
        if (!root.isObject() || !FORMAT.equals(root.path("format").asString(null))) {
            throw invalid(source, "expected a JSON object with \"format\": \"" + FORMAT + "\"");
        }
        if (root.path("version").asInt(-1) != VERSION) {
            throw invalid(source, "this reader knows " + FORMAT + " version " + VERSION + ", the file says "
                    + root.get("version"));
        }
        Medium medium;
        try {
            medium = Medium.parse(root.path("medium").asString(""));
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
        double centre = number(source, root, "centre_pixel");
        double halfRange = number(source, root, "half_range");
        double[] coefficients = numbers(source, root, "coefficients_nm");
        double[][] covariance = null;
        JsonNode cov = root.get("covariance_nm2");
        if (cov != null && !cov.isNull()) {
            if (!cov.isArray() || cov.size() != coefficients.length) {
                throw invalid(source, "\"covariance_nm2\" must be a " + coefficients.length + " x "
                        + coefficients.length + " array (one row per coefficient) or null");
            }
            covariance = new double[coefficients.length][];
            for (int r = 0; r < coefficients.length; r++) {
                covariance[r] = numbers(source, cov.get(r), "covariance_nm2 row " + r);
                if (covariance[r].length != coefficients.length) {
                    throw invalid(source, "\"covariance_nm2\" row " + r + " has " + covariance[r].length
                            + " values, expected " + coefficients.length);
                }
            }
        }
        String description = root.path("description").asString("");
        DispersionSolution solution;
        try {
            solution = DispersionSolution.of(centre, halfRange, coefficients, covariance, valid[0], valid[1], medium);
        } catch (IllegalArgumentException e) {
            throw invalid(source, e.getMessage());
        }
        checkAcrossTheDetector(source, solution, pixels, covariance != null);
        return new Calibration(solution, pixels, description);
    }

    /** Largest wavelength a solution may give, nm: one metre, far beyond any pixel detector's range. */
    static final double MAX_WAVELENGTH_NM = 1e9;

    /**
     * A solution read from a file must give every pixel of the detector a finite, positive
     * wavelength below {@link #MAX_WAVELENGTH_NM} with a finite uncertainty (when the file gives a
     * covariance; without one there is no uncertainty), rising or falling
     * throughout (a dispersion solution is monotonic); checked at every pixel up to a million
     * pixels, and at a million evenly spaced ones beyond.
     */
    private static void checkAcrossTheDetector(String source, DispersionSolution solution, int pixels,
            boolean withCovariance) {
        int samples = Math.min(pixels, 1_000_000);
        double step = (pixels - 1) / (double) (samples - 1);
        double previous = Double.NaN;
        int direction = 0;
        for (int k = 0; k < samples; k++) {
            double p = k == samples - 1 ? pixels - 1 : k * step;
            double nm = solution.wavelengthAt(p);
            if (!(nm > 0 && nm < MAX_WAVELENGTH_NM)) {
                throw invalid(source, String.format(java.util.Locale.ROOT, "the solution gives pixel %s %s; every pixel"
                        + " must get a wavelength above 0 and below 1e9 nm (check \"coefficients_nm\", \"centre_pixel\""
                        + " and \"half_range\")", pixel(p), Double.isFinite(nm) ? "the wavelength "
                        + String.format(java.util.Locale.ROOT, "%.6g nm", nm) : "no finite wavelength"));
            }
            double sigma = solution.wavelengthSigmaAt(p);
            if (withCovariance && !(sigma >= 0 && sigma < MAX_WAVELENGTH_NM)) {
                throw invalid(source, "the solution's uncertainty at pixel " + pixel(p) + " is not a finite number of"
                        + " nm below 1e9; check \"covariance_nm2\"");
            }
            if (k > 0) {
                int sign = (int) Math.signum(nm - previous);
                if (sign == 0 || (direction != 0 && sign != direction)) {
                    throw invalid(source, "the solution is not monotonic: the wavelength " + (sign == 0 ? "stands still"
                            : "turns back") + " near pixel " + pixel(p) + "; a dispersion solution must rise or fall"
                            + " across the whole detector");
                }
                direction = sign;
            }
            previous = nm;
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

    private static DataFileException invalid(String source, String message) {
        return new DataFileException(DataFileException.INVALID, source, List.of(), message);
    }
}
