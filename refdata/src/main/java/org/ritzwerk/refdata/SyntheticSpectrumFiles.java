package org.ritzwerk.refdata;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;
import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonGenerator;
import tools.jackson.core.StreamReadFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Writes a synthetic spectrum ({@link SyntheticSpectrum}) in the {@code ritzwerk-spectrum 1}
 * format, as {@code ritzwerk synth} does, and reads the whole JSON document back.
 *
 * <p>CSV ({@link #writeCsv}): the line {@code # ritzwerk-spectrum 1}, the axis as
 * {@code # axis: wavelength nm MEDIUM (pixel centres; GRID pixels from FIRST_EDGE to LAST_EDGE)},
 * one {@code # key: value} line per entry of the scene's description, then the columns
 * {@code wavelength_nm} (pixel centre, axis medium), {@code expected_counts} (before noise) and
 * {@code counts}. {@link SpectrumFiles#read(String, String)} reads it back: the header entries as
 * text, the three columns as written.
 *
 * <p>JSON ({@link #writeJson}): one object with {@code format}, {@code version}, {@code axis}
 * ({@code quantity}, {@code unit}, {@code medium}, {@code grid}), {@code scene} (the description,
 * numbers and booleans as JSON numbers and booleans), {@code notes}, {@code pixel_edges_nm} (one
 * more than pixels), {@code wavelength_nm}, {@code expected_counts}, {@code counts} and
 * {@code lines} (objects with {@code wavelength_nm}, {@code counts}, {@code counts_in_pixels},
 * {@code doppler_fwhm_nm}, {@code lorentz_fwhm_nm}, {@code line}, as in {@link SpectrumLineFiles}). {@link #readJson}
 * reads it all back.
 *
 * <p>Every number is written as the shortest decimal that reads back as the same double
 * ({@link Double#toString(double)}), so what is written reads back bit for bit. Values a file
 * cannot hold (NaN, infinities, a description entry spanning lines) are refused before anything
 * is written. Rows are streamed: memory does not grow with the number of pixels. Stateless and
 * thread-safe.
 */
public final class SyntheticSpectrumFiles {

    private static final JsonMapper JSON = JsonMapper.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build();

    private SyntheticSpectrumFiles() {
    }

    /**
     * The axis line of the CSV encoding.
     *
     * @param spectrum the spectrum: its grid (nm) and axis medium
     * @param kind     how the pixels are spaced, e.g. {@code linear}, {@code log} or
     *                 {@code dispersion 540,0.06}; checked against the grid's edges
     * @return the value written after {@code # axis: }
     * @throws IllegalArgumentException when the kind is none of those or does not describe the grid
     */
    public static String axis(SyntheticSpectrum spectrum, String kind) {
        checkKind(spectrum.grid(), kind);
        PixelGrid grid = spectrum.grid();
        return "wavelength nm " + spectrum.medium().spec() + " (pixel centres; " + kind + " pixels from "
                + grid.edge(0) + " to " + grid.edge(grid.pixels()) + ")";
    }

    /**
     * Writes the spectrum as CSV.
     *
     * @param spectrum    the spectrum; the axis is labelled with its medium ({@link SyntheticSpectrum#medium()})
     * @param kind        how the pixels are spaced ({@code linear}, {@code log}, {@code dispersion ...}):
     *                    checked against the grid's edges, see {@link #checkKind}
     * @param description the scene, in order: keys one line of text without {@code :} and not
     *                    {@code axis}; values text, numbers or booleans, written with
     *                    {@link String#valueOf(Object)}, one line each
     * @param out         where to write; not closed
     * @throws IOException when writing fails
     * @throws IllegalArgumentException when a value is not finite (naming the pixel), the grid kind is
     *         none of those or does not describe the grid, or a description entry cannot be written as
     *         one header line (all checked before anything is written)
     */
    public static void writeCsv(SyntheticSpectrum spectrum, String kind, Map<String, ?> description, Writer out)
            throws IOException {
        checkDescription(description);
        checkKind(spectrum.grid(), kind);
        double[] expected = spectrum.expectedCounts();
        double[] counts = spectrum.counts();
        checkPixels(expected, counts);
        out.write("# " + SpectrumFiles.FORMAT + " " + SpectrumFiles.VERSION + "\n");
        out.write("# axis: " + axis(spectrum, kind) + "\n");
        for (Map.Entry<String, ?> entry : description.entrySet()) {
            out.write("# " + entry.getKey() + ": " + entry.getValue() + "\n");
        }
        out.write("wavelength_nm,expected_counts,counts\n");
        PixelGrid grid = spectrum.grid();
        StringBuilder row = new StringBuilder();
        for (int p = 0; p < grid.pixels(); p++) {
            row.setLength(0);
            row.append(grid.centre(p)).append(',').append(expected[p]).append(',').append(counts[p]).append('\n');
            out.append(row);
        }
    }

    /**
     * Writes the spectrum as one JSON document.
     *
     * @param spectrum    the spectrum; the axis is labelled with its medium ({@link SyntheticSpectrum#medium()})
     * @param kind        how the pixels are spaced, checked against the grid's edges as by {@link #checkKind}
     * @param description the scene, in order: values text ({@link CharSequence}), booleans, or
     *                    numbers ({@link Double}, {@link Float}, {@link Long}, {@link Integer})
     * @param notes       what the caller should know about the scene (may be empty)
     * @param out         where to write; not closed
     * @throws IOException when writing fails
     * @throws IllegalArgumentException when a value is not finite or of another type, or the grid kind
     *         does not describe the grid (checked before anything is written)
     */
    public static void writeJson(SyntheticSpectrum spectrum, String kind, Map<String, ?> description,
            List<String> notes, Writer out) throws IOException {
        checkDescription(description);
        checkKind(spectrum.grid(), kind);
        double[] expected = spectrum.expectedCounts();
        double[] counts = spectrum.counts();
        checkPixels(expected, counts);
        Scene.Lines lines = spectrum.lines();
        for (int i = 0; i < lines.size(); i++) {
            SpectrumLineFiles.check(i, lines.position(i), spectrum.lineCounts(i), lines.gaussianFwhm(i),
                    lines.lorentzFwhm(i), lines.label(i));
            SpectrumLineFiles.check(i, lines.position(i), spectrum.lineCountsInPixels(i), 0, 0, lines.label(i));
        }
        PixelGrid grid = spectrum.grid();
        try (JsonGenerator g = JSON.createGenerator(new NonClosing(out))) {
            g.writeStartObject();
            g.writeStringProperty("format", SpectrumFiles.FORMAT);
            g.writeNumberProperty("version", SpectrumFiles.VERSION);
            g.writeName("axis");
            g.writeStartObject();
            g.writeStringProperty("quantity", "wavelength");
            g.writeStringProperty("unit", "nm");
            g.writeStringProperty("medium", spectrum.medium().spec());
            g.writeStringProperty("grid", kind);
            g.writeEndObject();
            g.writeName("scene");
            g.writeStartObject();
            for (Map.Entry<String, ?> entry : description.entrySet()) {
                g.writeName(entry.getKey());
                Object v = entry.getValue();
                if (v instanceof Boolean) {
                    g.writeBoolean((Boolean) v);
                } else if (v instanceof Double || v instanceof Float) {
                    g.writeNumber(((Number) v).doubleValue());
                } else if (v instanceof Long || v instanceof Integer) {
                    g.writeNumber(((Number) v).longValue());
                } else {
                    g.writeString(v.toString());
                }
            }
            g.writeEndObject();
            g.writeName("notes");
            g.writeStartArray();
            for (String note : notes) {
                g.writeString(note);
            }
            g.writeEndArray();
            g.writeName("pixel_edges_nm");
            g.writeStartArray();
            for (int p = 0; p <= grid.pixels(); p++) {
                g.writeNumber(grid.edge(p));
            }
            g.writeEndArray();
            g.writeName("wavelength_nm");
            g.writeStartArray();
            for (int p = 0; p < grid.pixels(); p++) {
                g.writeNumber(grid.centre(p));
            }
            g.writeEndArray();
            writeArray(g, "expected_counts", expected);
            writeArray(g, "counts", counts);
            g.writeName("lines");
            g.writeStartArray();
            for (int i = 0; i < lines.size(); i++) {
                g.writeStartObject();
                g.writeNumberProperty("wavelength_nm", lines.position(i));
                g.writeNumberProperty("counts", spectrum.lineCounts(i));
                g.writeNumberProperty("counts_in_pixels", spectrum.lineCountsInPixels(i));
                g.writeNumberProperty("doppler_fwhm_nm", lines.gaussianFwhm(i));
                g.writeNumberProperty("lorentz_fwhm_nm", lines.lorentzFwhm(i));
                g.writeStringProperty("line", lines.label(i));
                g.writeEndObject();
            }
            g.writeEndArray();
            g.writeEndObject();
        } catch (JacksonException e) {
            throw new IOException("cannot write the JSON document: " + TabularFiles.readable(e), e);
        }
        out.write("\n");
    }

    private static void writeArray(JsonGenerator g, String name, double[] values) {
        g.writeName(name);
        g.writeStartArray();
        for (double v : values) {
            g.writeNumber(v);
        }
        g.writeEndArray();
    }

    private static void checkDescription(Map<String, ?> description) {
        for (Map.Entry<String, ?> entry : description.entrySet()) {
            String key = entry.getKey();
            Object v = entry.getValue();
            if (key == null || key.isEmpty() || key.contains(":") || !key.equals(key.strip()) || key.equals("axis")) {
                throw new IllegalArgumentException("description key '" + key + "' must be text without ':' or spaces"
                        + " at its ends, and not 'axis'");
            }
            checkLine("description key", key);
            if (v == null) {
                throw new IllegalArgumentException("description entry '" + key + "' has no value");
            }
            if ((v instanceof Double || v instanceof Float) && !Double.isFinite(((Number) v).doubleValue())) {
                throw new IllegalArgumentException("description entry '" + key + "' must be finite, got " + v);
            }
            if (v instanceof Number && !(v instanceof Double || v instanceof Float || v instanceof Long
                    || v instanceof Integer)) {
                throw new IllegalArgumentException("description entry '" + key + "' is a "
                        + v.getClass().getSimpleName() + "; give a Double, Long, Integer, Boolean or text");
            }
            String text = String.valueOf(v);
            if (!text.equals(text.strip())) {
                throw new IllegalArgumentException("description entry '" + key + "' must not start or end with spaces: '"
                        + text + "'");
            }
            checkLine("description entry '" + key + "'", text);
        }
    }

    /**
     * Checks that a grid kind, as a spectrum file names it, describes the grid: {@code linear}
     * (equal pixels from the first edge to the last), {@code log} (edges in geometric progression
     * from the first to the last, both positive) or {@code dispersion c0,c1,...} (edge i at
     * {@code c0 + c1 (i - 1/2) + ...}, as {@link PixelGrid#dispersion} places it). Every edge must lie
     * where the kind puts it to 1e-6 of the mean pixel width (plus a few units in the last place of
     * the edges): rounding passes, a logarithmic grid called linear does not, down to ranges of a
     * few thousandths of the wavelength over ten pixels.
     *
     * @param grid the pixels, nm
     * @param kind the kind
     * @throws IllegalArgumentException when the kind is none of those, its coefficients are not
     *         numbers, or an edge lies elsewhere (naming the first such edge, both positions, and the
     *         grid's own spacing where it is linear or logarithmic)
     */
    public static void checkKind(PixelGrid grid, String kind) {
        checkLine("grid kind", java.util.Objects.requireNonNull(kind, "kind"));
        int n = grid.pixels();
        double first = grid.edge(0);
        double last = grid.edge(n);
        java.util.function.IntToDoubleFunction edge;
        if (kind.equals("linear")) {
            edge = linearEdges(first, last, n);
        } else if (kind.equals("log")) {
            if (!(first > 0 && last > 0)) {
                throw new IllegalArgumentException("grid kind 'log' needs positive edges, got " + first + " to "
                        + last);
            }
            edge = logEdges(first, last, n);
        } else if (kind.startsWith("dispersion ")) {
            String[] cells = kind.substring("dispersion ".length()).split(",");
            double[] c = new double[cells.length];
            for (int k = 0; k < c.length; k++) {
                try {
                    c[k] = Double.parseDouble(cells[k].strip());
                } catch (NumberFormatException e) {
                    throw new IllegalArgumentException("grid kind '" + kind + "': coefficient c" + k + " '"
                            + cells[k].strip() + "' is not a number");
                }
            }
            edge = i -> {
                double p = i - 0.5;
                double v = 0;
                for (int k = c.length - 1; k >= 0; k--) {
                    v = v * p + c[k];
                }
                return v;
            };
        } else {
            throw new IllegalArgumentException("grid kind must be linear, log or \"dispersion\" followed by its "
                    + "coefficients, got '" + kind + "'");
        }
        double tolerance = 1e-6 * Math.abs(last - first) / n + 4 * Math.ulp(Math.max(Math.abs(first), Math.abs(last)));
        int bad = firstMisplaced(grid, edge, tolerance);
        if (bad < 0) {
            return;
        }
        String actual = firstMisplaced(grid, linearEdges(first, last, n), tolerance) < 0 ? " (the grid is linear)"
                : first > 0 && last > 0 && firstMisplaced(grid, logEdges(first, last, n), tolerance) < 0
                ? " (the grid is log)" : "";
        throw new IllegalArgumentException("grid kind '" + kind + "' does not describe the spectrum's pixels: edge "
                + bad + " is at " + grid.edge(bad) + " nm, where that kind puts it at " + edge.applyAsDouble(bad)
                + " nm" + actual + "; name the spacing the grid was made with");
    }

    private static java.util.function.IntToDoubleFunction linearEdges(double first, double last, int n) {
        double step = (last - first) / n;
        return i -> first + i * step;
    }

    private static java.util.function.IntToDoubleFunction logEdges(double first, double last, int n) {
        double ratio = Math.log(last / first) / n;
        return i -> first * Math.exp(i * ratio);
    }

    /** @return the first edge farther than tolerance from where {@code edge} puts it, or -1 */
    private static int firstMisplaced(PixelGrid grid, java.util.function.IntToDoubleFunction edge, double tolerance) {
        for (int i = 0; i <= grid.pixels(); i++) {
            if (!(Math.abs(grid.edge(i) - edge.applyAsDouble(i)) <= tolerance)) {
                return i;
            }
        }
        return -1;
    }

    private static void checkLine(String what, String text) {
        if (text.indexOf('\n') >= 0 || text.indexOf('\r') >= 0 || text.indexOf('\u0085') >= 0
                || text.indexOf('\u2028') >= 0 || text.indexOf('\u2029') >= 0) {
            throw new IllegalArgumentException(what + " must be one line, got '" + text + "'");
        }
    }

    private static void checkPixels(double[] expected, double[] counts) {
        for (int p = 0; p < counts.length; p++) {
            if (!Double.isFinite(expected[p]) || !Double.isFinite(counts[p])) {
                throw new IllegalArgumentException("pixel " + p + ": counts must be finite, got expected "
                        + expected[p] + ", counts " + counts[p]);
            }
        }
    }

    /** Keeps the generator from closing the caller's writer. */
    private static final class NonClosing extends java.io.FilterWriter {
        NonClosing(Writer out) {
            super(out);
        }

        @Override
        public void close() throws IOException {
            flush();
        }
    }

    // ------------------------------------------------------------------ reading

    /**
     * A synthetic spectrum's JSON document as read.
     *
     * @param source         the file name, for messages
     * @param medium         the axis medium
     * @param grid           how the pixels are spaced, as written
     * @param scene          the scene's description in order: {@link String}, {@link Boolean},
     *                       {@link Double} or (integral JSON numbers) {@link Long} values
     * @param notes          the notes
     * @param pixelEdges     pixel edges in nm, one more than pixels
     * @param wavelengths    pixel centres in nm
     * @param expectedCounts expected counts per pixel
     * @param counts         counts per pixel
     * @param lines          the lines (their file lines are those of the JSON objects)
     */
    public record Document(String source, Medium medium, String grid, Map<String, Object> scene, List<String> notes,
            double[] pixelEdges, double[] wavelengths, double[] expectedCounts, double[] counts,
            SpectrumLineFiles.SpectrumLines lines) {
    }

    /**
     * @param file a synthetic spectrum's JSON file
     * @return the document
     * @throws DataFileException naming the member at fault, or when the file cannot be read
     */
    public static Document readJson(Path file) {
        return readJson(TabularFiles.read(file), file.toString());
    }

    /**
     * @param text   a synthetic spectrum's JSON document
     * @param source the file's name, for messages
     * @return the document
     * @throws DataFileException naming the member at fault (a duplicated key is one)
     */
    public static Document readJson(String text, String source) {
        JsonNode root;
        try {
            root = JSON.readTree(text);
        } catch (JacksonException e) {
            int line = e.getLocation() == null ? 1 : Math.max(1, e.getLocation().getLineNr());
            int column = e.getLocation() == null ? 0 : Math.max(0, e.getLocation().getColumnNr());
            throw new DataFileException(DataFileException.INVALID, source, List.of(new DataProblem(source, line, column,
                    "data.json-syntax", "JSON syntax: " + TabularFiles.readable(e), "")), "");
        }
        SpectrumFiles.Spectrum pixels = SpectrumFiles.json(source, text);
        JsonNode axis = root.path("axis");
        Medium medium;
        try {
            medium = Medium.parse(string(source, axis, "axis.medium", "medium"));
        } catch (RitzwerkException e) {
            throw fail(source, "axis.medium: " + e.getMessage());
        }
        String grid = string(source, axis, "axis.grid", "grid");
        Map<String, Object> scene = new LinkedHashMap<>();
        JsonNode sceneNode = root.path("scene");
        if (!sceneNode.isObject()) {
            throw fail(source, "\"scene\" must be an object");
        }
        for (var property : sceneNode.properties()) {
            JsonNode v = property.getValue();
            Object value;
            if (v.isBoolean()) {
                value = v.asBoolean();
            } else if (v.isIntegralNumber() && v.canConvertToLong()) {
                value = v.asLong();
            } else if (v.isNumber()) {
                value = v.asDouble();
            } else if (v.isString()) {
                value = v.asString();
            } else {
                throw fail(source, "scene." + property.getKey() + " must be text, a number or a boolean");
            }
            scene.put(property.getKey(), value);
        }
        List<String> notes = new ArrayList<>();
        JsonNode notesNode = root.path("notes");
        if (!notesNode.isArray()) {
            throw fail(source, "\"notes\" must be an array of text");
        }
        for (JsonNode note : notesNode) {
            if (!note.isString()) {
                throw fail(source, "\"notes\" must be an array of text");
            }
            notes.add(note.asString());
        }
        double[] edges = numbers(source, root.path("pixel_edges_nm"), "pixel_edges_nm");
        if (edges.length != pixels.pixels() + 1) {
            throw fail(source, "pixel_edges_nm has " + edges.length + " values; " + pixels.pixels() + " pixels need "
                    + (pixels.pixels() + 1));
        }
        if (pixels.wavelengths() == null || pixels.expectedCounts() == null) {
            throw fail(source, "a synthetic spectrum has \"wavelength_nm\" and \"expected_counts\" arrays");
        }
        JsonNode linesNode = root.path("lines");
        if (!linesNode.isArray()) {
            throw fail(source, "\"lines\" must be an array of objects");
        }
        int n = linesNode.size();
        double[] nm = new double[n];
        double[] counts = new double[n];
        // Documents written before counts_in_pixels have none: then null, as in the CSV reader.
        double[] inPixels = n == 0 || linesNode.get(0).has("counts_in_pixels") ? new double[n] : null;
        double[] doppler = new double[n];
        double[] lorentz = new double[n];
        List<String> labels = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            JsonNode line = linesNode.get(i);
            String where = "lines[" + i + "]";
            if (!line.isObject()) {
                throw fail(source, where + " must be an object");
            }
            nm[i] = number(source, line, where, "wavelength_nm");
            counts[i] = number(source, line, where, "counts");
            if (inPixels != null) {
                inPixels[i] = number(source, line, where, "counts_in_pixels");
            }
            doppler[i] = number(source, line, where, "doppler_fwhm_nm");
            lorentz[i] = number(source, line, where, "lorentz_fwhm_nm");
            labels.add(string(source, line, where + ".line", "line"));
            try {
                SpectrumLineFiles.check(i, nm[i], counts[i], doppler[i], lorentz[i], labels.get(i));
                if (inPixels != null) {
                    SpectrumLineFiles.check(i, nm[i], inPixels[i], 0, 0, labels.get(i));
                }
            } catch (IllegalArgumentException e) {
                throw fail(source, where + ": " + e.getMessage());
            }
        }
        SpectrumLineFiles.SpectrumLines lines = new SpectrumLineFiles.SpectrumLines(source, medium, nm, counts,
                inPixels, doppler, lorentz, List.copyOf(labels), new int[n]);
        return new Document(source, medium, grid, Collections.unmodifiableMap(scene), List.copyOf(notes), edges,
                pixels.wavelengths(), pixels.expectedCounts(), pixels.counts(), lines);
    }

    private static String string(String source, JsonNode node, String where, String name) {
        JsonNode v = node.path(name);
        if (!v.isString()) {
            throw fail(source, where + " must be text");
        }
        return v.asString();
    }

    private static double number(String source, JsonNode node, String where, String name) {
        JsonNode v = node.path(name);
        if (!v.isNumber() || !Double.isFinite(v.asDouble())) {
            throw fail(source, where + "." + name + " must be a finite number, got " + TabularFiles.shown(v));
        }
        return v.asDouble();
    }

    private static double[] numbers(String source, JsonNode node, String name) {
        if (!node.isArray() || node.isEmpty()) {
            throw fail(source, "\"" + name + "\" must be a non-empty array of numbers");
        }
        double[] values = new double[node.size()];
        for (int i = 0; i < values.length; i++) {
            JsonNode v = node.get(i);
            if (!v.isNumber() || !Double.isFinite(v.asDouble())) {
                throw fail(source, name + "[" + i + "] must be a finite number, got " + TabularFiles.shown(v));
            }
            values[i] = v.asDouble();
        }
        return values;
    }

    private static DataFileException fail(String source, String reason) {
        return new DataFileException(DataFileException.INVALID, source, List.of(), reason);
    }
}
