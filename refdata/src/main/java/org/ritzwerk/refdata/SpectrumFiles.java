package org.ritzwerk.refdata;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import tools.jackson.core.JacksonException;
import tools.jackson.core.StreamReadFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Reads Ritzwerk's spectrum format ({@code ritzwerk-spectrum}, version 1): counts per detector
 * pixel, as {@code ritzwerk synth} writes it and as a spectrometer's export can be turned into.
 *
 * <p>CSV: {@code #} comment lines (the first, if any, {@code # ritzwerk-spectrum 1}; the others
 * {@code # key: value} pairs kept as the header), then a header row naming the columns, then one
 * row per pixel, in pixel order (the first row is pixel 0). Columns: {@code counts} (required),
 * {@code counts_sigma} (the standard uncertainty of each count, optional), {@code pixel}
 * (optional; when given it must be 0, 1, 2, ...), {@code wavelength_nm} and
 * {@code expected_counts}, {@code wavelength_sigma_nm} (optional, for reference; empty where
 * not known, as {@link #withWavelengths} writes it for a solution without a covariance), and
 * {@code extrapolated} (optional, 0 or 1: whether the pixel's wavelength was extrapolated beyond
 * the calibration's fitted range, as {@link #withWavelengths} writes it; checked, not kept).
 * Unknown columns are an error, so a misspelt one is not lost.
 *
 * <p>JSON: one object with {@code "format": "ritzwerk-spectrum"}, {@code "version": 1}, the
 * array {@code counts}, and optionally {@code counts_sigma}, {@code wavelength_nm} and
 * {@code expected_counts} of the same length (other members, such as those {@code synth} writes,
 * are allowed and ignored here; {@link SyntheticSpectrumFiles} reads them all).
 *
 * <p>Every bad row is reported with file, line and column name in one {@link DataFileException}.
 * Stateless and thread-safe.
 */
public final class SpectrumFiles {

    /** The format name. */
    public static final String FORMAT = "ritzwerk-spectrum";
    /** The format version. */
    public static final int VERSION = 1;

    private static final List<String> COLUMNS = List.of("pixel", "wavelength_nm", "expected_counts", "counts",
            "counts_sigma", "wavelength_sigma_nm", "extrapolated");
    private static final int MAX_PROBLEMS = 50;

    private SpectrumFiles() {
    }

    /**
     * A spectrum as read.
     *
     * @param source     the file name, for messages
     * @param counts     counts per pixel
     * @param sigmas     standard uncertainties per pixel, or null when the file gives none
     * @param wavelengths wavelengths in nm per pixel as written, or null
     * @param expectedCounts expected counts per pixel before noise (a synthetic spectrum's), or null
     * @param header     the {@code # key: value} lines of a CSV file, in order (empty for JSON)
     */
    public record Spectrum(String source, double[] counts, double[] sigmas, double[] wavelengths,
            double[] expectedCounts, Map<String, String> header) {

        /**
         * Copies the arrays and the header: the record is immutable, its accessors return copies.
         *
         * @param source         the file name, for messages
         * @param counts         counts per pixel
         * @param sigmas         standard uncertainties per pixel, or null when the file gives none
         * @param wavelengths    wavelengths in nm per pixel as written, or null
         * @param expectedCounts expected counts per pixel before noise, or null
         * @param header         the {@code # key: value} lines of a CSV file, in order (empty for JSON)
         */
        public Spectrum {
            counts = counts.clone();
            sigmas = sigmas == null ? null : sigmas.clone();
            wavelengths = wavelengths == null ? null : wavelengths.clone();
            expectedCounts = expectedCounts == null ? null : expectedCounts.clone();
            header = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(header));
        }

        /** @return a copy of the counts per pixel */
        @Override
        public double[] counts() {
            return counts.clone();
        }

        /** @return a copy of the standard uncertainties per pixel, or null */
        @Override
        public double[] sigmas() {
            return sigmas == null ? null : sigmas.clone();
        }

        /** @return a copy of the wavelengths per pixel, or null */
        @Override
        public double[] wavelengths() {
            return wavelengths == null ? null : wavelengths.clone();
        }

        /** @return a copy of the expected counts per pixel, or null */
        @Override
        public double[] expectedCounts() {
            return expectedCounts == null ? null : expectedCounts.clone();
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof Spectrum s && java.util.Objects.equals(source, s.source)
                    && java.util.Arrays.equals(counts, s.counts) && java.util.Arrays.equals(sigmas, s.sigmas)
                    && java.util.Arrays.equals(wavelengths, s.wavelengths)
                    && java.util.Arrays.equals(expectedCounts, s.expectedCounts) && header.equals(s.header);
        }

        @Override
        public int hashCode() {
            return java.util.Objects.hash(source, java.util.Arrays.hashCode(counts), java.util.Arrays.hashCode(sigmas),
                    java.util.Arrays.hashCode(wavelengths), java.util.Arrays.hashCode(expectedCounts), header);
        }

        @Override
        public String toString() {
            return "Spectrum[" + source + ", " + counts.length + " pixels]";
        }

        /**
         * A spectrum without expected counts.
         *
         * @param source      the file name, for messages
         * @param counts      counts per pixel
         * @param sigmas      standard uncertainties per pixel, or null
         * @param wavelengths wavelengths in nm per pixel, or null
         * @param header      the header entries
         */
        public Spectrum(String source, double[] counts, double[] sigmas, double[] wavelengths,
                Map<String, String> header) {
            this(source, counts, sigmas, wavelengths, null, header);
        }

        /** @return number of pixels */
        public int pixels() {
            return counts.length;
        }
    }

    /**
     * A spectrum with the wavelengths of a dispersion solution, as text: a {@code ritzwerk-spectrum 1}
     * CSV with columns {@code pixel,wavelength_nm,wavelength_sigma_nm,counts} (and
     * {@code counts_sigma} when the spectrum has them), then {@code extrapolated}: 1 where pixel p
     * lies outside the solution's fitted range ({@link DispersionSolution#isWithinFittedRange}),
     * so that its wavelength is extrapolated, else 0 (the last column, so that a reader taking the
     * columns by position still finds the others where they were; a {@code # valid-pixels} header
     * line says the same for readers of the comments). The wavelength of pixel p is the solution at
     * the pixel's centre p; its standard uncertainty is left empty where the solution has none.
     *
     * @param spectrum     the spectrum (counts per pixel)
     * @param solution     the solution, in its medium
     * @param solutionName where the solution came from (a file name), written in the header
     * @return the file's text
     */
    public static String withWavelengths(Spectrum spectrum, DispersionSolution solution, String solutionName) {
        int n = spectrum.pixels();
        double[] nm = solution.pixelCentreWavelengths(n);
        double[] sigma = solution.pixelCentreWavelengthSigmas(n);
        StringBuilder text = new StringBuilder();
        text.append("# ritzwerk-spectrum 1\n");
        text.append("# axis: wavelength nm ").append(solution.medium().label()).append(" (pixel centres; from ")
                .append(solutionName).append(")\n");
        text.append("# source: ").append(spectrum.source()).append('\n');
        if (solution.lowestPixel() > 0 || solution.highestPixel() < n - 1) {
            // pixels outside the fitted range have extrapolated wavelengths; their uncertainty grows fast
            text.append(String.format(Locale.ROOT, "# valid-pixels: %.1f to %.1f (the solution's fitted range; "
                    + "outside it the wavelengths are extrapolated)%n", solution.lowestPixel(),
                    solution.highestPixel()));
        }
        text.append("pixel,wavelength_nm,wavelength_sigma_nm,counts").append(spectrum.sigmas() != null
                ? ",counts_sigma" : "").append(",extrapolated\n");
        double[] counts = spectrum.counts();
        double[] countSigmas = spectrum.sigmas();
        for (int p = 0; p < n; p++) {
            text.append(p).append(',').append(String.format(Locale.ROOT, "%.6f", nm[p])).append(',');
            if (!Double.isNaN(sigma[p])) {
                text.append(String.format(Locale.ROOT, "%.2g", sigma[p]));
            }
            text.append(',').append(counts[p]);
            if (countSigmas != null) {
                text.append(',').append(countSigmas[p]);
            }
            text.append(solution.isWithinFittedRange(p) ? ",0\n" : ",1\n");
        }
        return text.toString();
    }

    /**
     * @param file a CSV or JSON (by its first non-blank character) spectrum file
     * @return the spectrum
     * @throws DataFileException listing every problem, or when the file cannot be read
     */
    public static Spectrum read(Path file) {
        TabularFiles.refuseFolder(file);
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (IOException e) {
            throw DataFileException.unreadable(file.toString(), e);
        }
        return read(TabularFiles.decodeStrict(bytes, file.toString()), file.toString());
    }

    /**
     * @param text   a spectrum file's text, CSV or JSON (by its first non-blank character)
     * @param source the file's name, for messages
     * @return the spectrum
     * @throws DataFileException listing every problem
     */
    public static Spectrum read(String text, String source) {
        String body = TabularFiles.withoutByteOrderMark(text);
        return body.stripLeading().startsWith("{") ? json(source, body) : csv(source, body);
    }

    /**
     * Writes a spectrum in the CSV encoding: the format line, its header entries as
     * {@code # key: value} lines, then {@code pixel}, {@code wavelength_nm} (when it has
     * wavelengths), {@code expected_counts} (when it has them), {@code counts} and
     * {@code counts_sigma} (when it has them), every number the
     * shortest decimal that reads back as the same double, so {@link #read(String, String)} gives
     * the same values bit for bit.
     *
     * @param spectrum the spectrum; its values must be finite and its sigmas positive
     * @return the file's text
     * @throws IllegalArgumentException naming the pixel of a value the format cannot hold, or a
     *         header entry that is not one line
     */
    public static String writeCsv(Spectrum spectrum) {
        StringBuilder text = new StringBuilder("# ").append(FORMAT).append(' ').append(VERSION).append('\n');
        for (Map.Entry<String, String> entry : spectrum.header().entrySet()) {
            String key = entry.getKey();
            String value = entry.getValue();
            if (key.isBlank() || key.contains(":") || (key + value).contains("\n") || (key + value).contains("\r")) {
                throw new IllegalArgumentException("header entry '" + key + "' must be one line, with no ':' in its key");
            }
            text.append("# ").append(key).append(": ").append(value).append('\n');
        }
        double[] counts = spectrum.counts();
        double[] sigmas = spectrum.sigmas();
        double[] wavelengths = spectrum.wavelengths();
        double[] expected = spectrum.expectedCounts();
        text.append("pixel").append(wavelengths != null ? ",wavelength_nm" : "")
                .append(expected != null ? ",expected_counts" : "").append(",counts")
                .append(sigmas != null ? ",counts_sigma" : "").append('\n');
        for (int p = 0; p < counts.length; p++) {
            if (!Double.isFinite(counts[p]) || (wavelengths != null && !Double.isFinite(wavelengths[p]))
                    || (expected != null && !Double.isFinite(expected[p]))
                    || (sigmas != null && !(sigmas[p] > 0 && Double.isFinite(sigmas[p])))) {
                throw new IllegalArgumentException("pixel " + p + ": counts and wavelengths must be finite and "
                        + "sigmas finite and positive");
            }
            text.append(p);
            if (wavelengths != null) {
                text.append(',').append(wavelengths[p]);
            }
            if (expected != null) {
                text.append(',').append(expected[p]);
            }
            text.append(',').append(counts[p]);
            if (sigmas != null) {
                text.append(',').append(sigmas[p]);
            }
            text.append('\n');
        }
        return text.toString();
    }

    static Spectrum csv(String source, String text) {
        List<DataProblem> problems = new ArrayList<>();
        Map<String, String> header = new LinkedHashMap<>();
        String[] lines = text.split("\r?\n", -1);
        int[] column = null;
        List<double[]> rows = new ArrayList<>();
        int dataRows = 0;
        boolean first = true;
        int blank = 0; // an empty line after the header row, reported if pixels follow it
        int headerCells = 0;
        int i = 0;
        for (; i < lines.length && problems.size() < MAX_PROBLEMS; i++) {
            String raw = lines[i];
            String line = raw.strip();
            int lineNo = i + 1;
            if (line.isEmpty()) {
                if (column != null && blank == 0) {
                    blank = lineNo;
                }
                continue;
            }
            if (blank > 0 && !line.startsWith("#")) {
                // one row per pixel: an empty row among them is a pixel missing, and every pixel
                // after it would take its neighbour's place
                problems.add(new DataProblem(source, blank, 0, DataFileException.INVALID,
                        "an empty row among the pixels; a spectrum has one row per pixel (a missing value "
                        + "shifts every pixel after it)", ""));
                blank = 0;
            }
            if (line.startsWith("#")) {
                String body = line.substring(1).strip();
                if (first && body.startsWith(FORMAT)) {
                    if (!body.equals(FORMAT + " " + VERSION)) {
                        problems.add(new DataProblem(source, lineNo, 0, DataFileException.INVALID,
                                "this reader knows " + FORMAT + " " + VERSION + ", the file says '" + body + "'", raw));
                    }
                } else if (first && body.startsWith("ritzwerk-")) {
                    problems.add(new DataProblem(source, lineNo, 0, DataFileException.INVALID,
                            "this is a " + body + " file, not a " + FORMAT + " file", raw));
                } else {
                    int colon = body.indexOf(':');
                    if (colon > 0) {
                        header.put(body.substring(0, colon).strip(), body.substring(colon + 1).strip());
                    }
                }
                first = false;
                continue;
            }
            first = false;
            String[] cells = line.split(",", -1);
            if (column == null) {
                headerCells = cells.length;
                column = new int[COLUMNS.size()];
                java.util.Arrays.fill(column, -1);
                for (int c = 0; c < cells.length; c++) {
                    String name = cells[c].strip();
                    int k = COLUMNS.indexOf(name);
                    if (k < 0) {
                        problems.add(new DataProblem(source, lineNo, c + 1, DataFileException.INVALID,
                                "unknown column '" + name + "'; the columns are " + String.join(", ", COLUMNS), raw));
                    } else if (column[k] >= 0) {
                        problems.add(new DataProblem(source, lineNo, c + 1, DataFileException.INVALID,
                                "column '" + name + "' appears twice", raw));
                    } else {
                        column[k] = c;
                    }
                }
                if (column[3] < 0) {
                    problems.add(new DataProblem(source, lineNo, 0, DataFileException.INVALID,
                            "the header row has no 'counts' column", raw));
                    break;
                }
                continue;
            }
            int pixel = dataRows++;
            if (cells.length != headerCells) {
                // as many fields as the header row names (an unknown column is reported there, once)
                problems.add(new DataProblem(source, lineNo, 0, DataFileException.INVALID,
                        "expected " + headerCells + " fields, as the header row names, got " + cells.length, raw));
                continue;
            }
            double[] row = new double[COLUMNS.size()];
            boolean ok = true;
            for (int k = 0; k < COLUMNS.size(); k++) {
                if (column[k] < 0) {
                    row[k] = Double.NaN;
                    continue;
                }
                String cell = cells[column[k]].strip();
                double v = parse(cell);
                String name = COLUMNS.get(k);
                String reason = null;
                // an empty wavelength_sigma_nm is "not given": withWavelengths leaves it empty where
                // the solution has no uncertainty
                if (Double.isNaN(v) && !(cell.isEmpty() && name.equals("wavelength_sigma_nm"))) {
                    reason = name + " must be a finite number, got '" + cell + "'";
                } else if (name.equals("counts_sigma") && !(v > 0)) {
                    reason = "counts_sigma must be positive, got " + cell;
                } else if (name.equals("extrapolated") && v != 0 && v != 1) {
                    reason = "extrapolated must be 0 or 1, got " + cell;
                } else if (name.equals("pixel") && v != pixel) {
                    reason = "pixel must count up from 0 in row order: expected " + pixel + ", got " + cell;
                }
                if (reason != null) {
                    problems.add(new DataProblem(source, lineNo, column[k] + 1, DataFileException.INVALID, reason, raw));
                    ok = false;
                }
                row[k] = v;
            }
            if (ok) {
                rows.add(row);
            }
        }
        if (problems.size() >= MAX_PROBLEMS && i < lines.length) {
            problems.add(new DataProblem(source, i + 1, 0, DataFileException.INVALID, "reading stopped after "
                    + MAX_PROBLEMS + " problems; lines from here on were not checked (is the whole file in another "
                    + "layout, e.g. decimal commas or another separator?)", ""));
        }
        if (problems.isEmpty() && column == null) {
            throw new DataFileException(DataFileException.INVALID, source, List.of(),
                    "no header row; expected a row naming the columns, e.g. 'counts' or 'pixel,counts'");
        }
        if (problems.isEmpty() && rows.isEmpty()) {
            throw new DataFileException(DataFileException.INVALID, source, List.of(), "no pixels after the header row");
        }
        if (!problems.isEmpty()) {
            throw new DataFileException(DataFileException.INVALID, source, problems, "");
        }
        int n = rows.size();
        double[] counts = new double[n];
        double[] sigmas = column[4] >= 0 ? new double[n] : null;
        double[] wavelengths = column[1] >= 0 ? new double[n] : null;
        double[] expected = column[2] >= 0 ? new double[n] : null;
        for (int p = 0; p < n; p++) {
            if (expected != null) {
                expected[p] = rows.get(p)[2];
            }
            counts[p] = rows.get(p)[3];
            if (sigmas != null) {
                sigmas[p] = rows.get(p)[4];
            }
            if (wavelengths != null) {
                wavelengths[p] = rows.get(p)[1];
            }
        }
        return new Spectrum(source, counts, sigmas, wavelengths, expected, header);
    }

    static Spectrum json(String source, String text) {
        JsonNode root;
        try {
            root = JsonMapper.builder().enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build().readTree(text);
        } catch (JacksonException e) {
            throw new DataFileException(DataFileException.INVALID, source, List.of(),
                    "not valid JSON: " + TabularFiles.readable(e));
        }
        if (!root.isObject() || !FORMAT.equals(root.path("format").asString(null))) {
            throw new DataFileException(DataFileException.INVALID, source, List.of(),
                    "expected a JSON object with \"format\": \"" + FORMAT + "\"");
        }
        if (root.path("version").asInt(-1) != VERSION) {
            throw new DataFileException(DataFileException.INVALID, source, List.of(),
                    "this reader knows " + FORMAT + " version " + VERSION + ", the file says " + root.get("version"));
        }
        double[] counts = array(source, root, "counts", true);
        double[] sigmas = array(source, root, "counts_sigma", false);
        double[] wavelengths = array(source, root, "wavelength_nm", false);
        double[] expected = array(source, root, "expected_counts", false);
        for (double[] other : new double[][] {sigmas, wavelengths, expected}) {
            if (other != null && other.length != counts.length) {
                throw new DataFileException(DataFileException.INVALID, source, List.of(),
                        "counts has " + counts.length + " values but another array has " + other.length);
            }
        }
        if (sigmas != null) {
            for (int p = 0; p < sigmas.length; p++) {
                if (!(sigmas[p] > 0)) {
                    throw new DataFileException(DataFileException.INVALID, source, List.of(),
                            "counts_sigma[" + p + "] must be positive, got " + sigmas[p]);
                }
            }
        }
        return new Spectrum(source, counts, sigmas, wavelengths, expected, Map.of());
    }

    private static double[] array(String source, JsonNode root, String name, boolean required) {
        JsonNode node = root.get(name);
        if (node == null || node.isNull()) {
            if (required) {
                throw new DataFileException(DataFileException.INVALID, source, List.of(), "no \"" + name + "\" array");
            }
            return null;
        }
        if (!node.isArray() || node.isEmpty()) {
            throw new DataFileException(DataFileException.INVALID, source, List.of(),
                    "\"" + name + "\" must be a non-empty array of numbers");
        }
        double[] values = new double[node.size()];
        for (int i = 0; i < values.length; i++) {
            JsonNode v = node.get(i);
            if (!v.isNumber() || !Double.isFinite(v.asDouble())) {
                throw new DataFileException(DataFileException.INVALID, source, List.of(),
                        name + "[" + i + "] must be a finite number, got " + TabularFiles.shown(v));
            }
            values[i] = v.asDouble();
        }
        return values;
    }

    private static double parse(String cell) {
        try {
            double v = Double.parseDouble(cell);
            return Double.isFinite(v) ? v : Double.NaN;
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }
}
