package org.ritzwerk.refdata;

import java.io.IOException;
import java.io.InputStream;
import java.io.StringWriter;
import java.nio.ByteBuffer;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.regex.Pattern;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;
import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.core.ObjectReadContext;
import tools.jackson.core.StreamReadFeature;
import tools.jackson.core.TokenStreamLocation;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;
import tools.jackson.dataformat.csv.CsvFactory;
import tools.jackson.dataformat.csv.CsvMapper;
import tools.jackson.dataformat.csv.CsvReadFeature;
import tools.jackson.dataformat.csv.CsvSchema;

/**
 * What the project's table file formats (line lists, level tables) share: a header of keys and
 * values, then rows of named columns, in CSV ({@code # key: value} lines, a row of column names,
 * data rows) or JSON (one object with the header keys and an array of row objects), read with
 * Jackson, every problem collected with line, column and code. Package-private; the formats'
 * public faces are {@link LineListFiles} and {@link LevelListFiles}. Stateless and thread-safe.
 */
final class TabularFiles {

    /**
     * A JSON value for a message: a number too large for a double (which the parser turns into an
     * infinity) is said so in words, never printed as "Infinity".
     *
     * @param value a JSON value, or null when missing
     * @return its text
     */
    static String shown(tools.jackson.databind.JsonNode value) {
        return value != null && value.isNumber() && !Double.isFinite(value.asDouble())
                ? "a number too large for a double" : String.valueOf(value);
    }

    /** The largest file read, in bytes (64 MiB). */
    static final long MAX_BYTES = 64L << 20;
    /** The most rows read. */
    static final int MAX_ROWS = 1_000_000;

    /** What {@link #isDecimal} accepts, as a regular expression (the tests compare the two). */
    static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?");
    private static final int MAX_TEXT = 500;
    /**
     * Reads CSV rows as a stream of tokens, each row an array of strings: Jackson's streaming layer
     * alone, without a mapper. Building a {@code CsvMapper} costs about a quarter of a second in a
     * fresh JVM (260-300 ms against 23 ms for the factory, measured 2026-12-05), which every first
     * read of a built-in file paid; the rows and their line numbers are those the mapper's
     * {@code readerFor(String[].class)} gave (compared on every built-in and test CSV file).
     */
    private static final CsvFactory CSV_ROWS = CsvFactory.builder().enable(CsvReadFeature.ALLOW_COMMENTS)
            .enable(CsvReadFeature.WRAP_AS_ARRAY).build();

    /** The mappers, made when first needed (JSON files, and writing): see {@link #CSV_ROWS} for their cost. */
    private static final class Mappers {
        /** Reads values out of a running parser, so a value is not the end of the input. */
        static final JsonMapper JSON = JsonMapper.builder()
                .disable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
                .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build();
        static final CsvMapper CSV = CsvMapper.builder().build();

        private Mappers() {
        }
    }

    private TabularFiles() {
    }

    /**
     * What one format is.
     *
     * @param format          the format name, e.g. {@code ritzwerk-lines}
     * @param version         the format version
     * @param unitKey         the header key of the unit, e.g. {@code position-unit}
     * @param headerKeys      every header key, in the order written
     * @param requiredKeys    the header keys that must be present
     * @param columns         every column, in the order written
     * @param requiredColumns the columns that must be present and filled
     * @param numericColumns  the columns holding numbers
     * @param arrayKey        the JSON key of the rows, e.g. {@code lines}
     */
    record Spec(String format, int version, String unitKey, List<String> headerKeys, List<String> requiredKeys,
            List<String> columns, List<String> requiredColumns, List<String> numericColumns, String arrayKey) {

        /** @return the JSON spelling of a header key: {@code position-unit} becomes {@code positionUnit} */
        String jsonKey(String key) {
            int dash = key.indexOf('-');
            return dash < 0 ? key : key.substring(0, dash) + Character.toUpperCase(key.charAt(dash + 1))
                    + key.substring(dash + 2);
        }
    }

    /**
     * One data row as read: its line, raw text, the value of each column (String, Double or null),
     * and for a JSON file its place in the rows' array (1 for the first; 0 in CSV), which names it
     * where several share a line.
     */
    record Row(int line, String raw, Map<String, Object> values, int entry) {
    }

    /**
     * Takes each data row as it is read, instead of {@link Parsed#rows} keeping them all, so that a
     * reader of a big file can turn rows into columns of numbers at once (a row's map and text are
     * then garbage). Its problems go to the {@link Parsed} as usual.
     */
    @FunctionalInterface
    interface RowSink {
        /**
         * @param p   the file being read (for its problem list and value readers)
         * @param row the row
         */
        void accept(Parsed p, Row row);
    }

    /** A file read into its header and rows, with every problem found; the formats add their own. */
    static final class Parsed {
        final Spec spec;
        final String source;
        private final String text;
        /** Where each line starts in the text (4 bytes a line, no string a line). */
        final int[] lineStarts;
        private final int lineCount;
        final Map<String, String> header = new LinkedHashMap<>();
        final Map<String, Integer> headerLine = new HashMap<>();
        /** The rows read, unless a {@link RowSink} took them. */
        final List<Row> rows = new ArrayList<>();
        final List<DataProblem> problems = new ArrayList<>();
        Map<String, Integer> columnIndex = Map.of();
        private final RowSink sink;
        private int rowCount;
        /** The JSON rows' entries read so far. */
        private int jsonEntries;
        /** The most rows read. */
        int maxRows = MAX_ROWS;
        /** Whether the CSV text is empty or blank: then {@link #throwIfAny} reports that alone. */
        boolean emptyFile;

        Parsed(Spec spec, String source, String text, RowSink sink) {
            this.spec = spec;
            this.source = source;
            this.text = text;
            this.sink = sink;
            // Line breaks as the regular expression \R takes them: \r\n, or one of \n \u000B \f \r
            // \u0085 \u2028 \u2029.
            int[] starts = new int[16];
            int count = 0;
            starts[count++] = 0;
            for (int i = 0; i < text.length(); i++) {
                char c = text.charAt(i);
                if (c == '\n' || c == '\u000B' || c == '\f' || c == '\r' || c == '\u0085' || c == '\u2028'
                        || c == '\u2029') {
                    if (c == '\r' && i + 1 < text.length() && text.charAt(i + 1) == '\n') {
                        i++;
                    }
                    if (count == starts.length) {
                        starts = java.util.Arrays.copyOf(starts, 2 * count);
                    }
                    starts[count++] = i + 1;
                }
            }
            this.lineStarts = starts;
            this.lineCount = count;
        }

        /** @return the number of lines (a text ending in a line break has an empty last line) */
        int lineCount() {
            return lineCount;
        }

        String raw(int line) {
            if (line < 1 || line > lineCount) {
                return "";
            }
            int start = lineStarts[line - 1];
            int end = line < lineCount ? lineStarts[line] : text.length();
            if (line < lineCount) {     // leave out the line break: \r\n or one character
                end -= end - start >= 2 && text.charAt(end - 1) == '\n' && text.charAt(end - 2) == '\r' ? 2 : 1;
            }
            return text.substring(start, end);
        }

        void problem(int line, int column, String code, String reason, String raw) {
            String text = raw.isEmpty() ? raw(line) : raw;
            problems.add(new DataProblem(source, Math.max(line, 1), Math.max(column, 0), code, reason,
                    text.length() > 200 ? text.substring(0, 200) + "..." : text));
        }

        void headerProblem(String key, String code, String reason) {
            problem(headerLine.getOrDefault(key, 1), 0, code, reason, "");
        }

        void rowProblem(Row row, String column, String code, String reason) {
            problem(row.line(), columnIndex.getOrDefault(column, 0), code, (row.entry() > 0 ? "entry " + row.entry()
                    + " of '" + spec.arrayKey() + "', " : "") + "column " + column + ": " + reason, row.raw());
        }

        /** Throws every problem, in file order (line, then column), if there is any. */
        void throwIfAny() {
            if (emptyFile) {
                // one problem, not one per missing header line and the missing column names
                problems.clear();
                problem(1, 0, "data.empty", "the file is empty (a " + spec.format() + " file holds its header"
                        + " lines, a row of column names and the rows)", "");
            }
            if (!problems.isEmpty()) {
                List<DataProblem> ordered = new ArrayList<>(problems);
                ordered.sort(java.util.Comparator.comparingInt(DataProblem::line).thenComparingInt(DataProblem::column));
                throw new DataFileException(DataFileException.INVALID, source, ordered, "");
            }
        }

        // ---- header values

        /** Checks required keys and one-line values; @return whether the header so far is sound */
        boolean checkHeader() {
            int before = problems.size();
            for (String key : spec.requiredKeys()) {
                String value = header.get(key);
                if (value == null || value.isBlank()) {
                    problem(1, 0, "data.header", "required header '" + key + "' is missing or empty", "");
                }
            }
            for (Map.Entry<String, String> entry : header.entrySet()) {
                String value = entry.getValue();
                if (value.indexOf('\n') >= 0 || value.indexOf('\r') >= 0 || value.length() > 2000) {
                    headerProblem(entry.getKey(), "data.header", "header '" + entry.getKey()
                            + "' must be one line of at most 2000 characters");
                }
            }
            String id = header.getOrDefault("id", "");
            if (!id.isBlank() && !DataSetInfo.isValidId(id)) {
                headerProblem("id", "data.header", "id '" + id + "' must be lower-case letters, digits, dots and dashes");
            }
            return problems.size() == before;
        }

        Provenance.Kind provenance() {
            if (header.containsKey("provenance")) {
                try {
                    return Provenance.Kind.fromId(header.get("provenance"));
                } catch (IllegalArgumentException e) {
                    headerProblem("provenance", "data.header", e.getMessage());
                }
            }
            return Provenance.Kind.PUBLISHED;
        }

        /** @return the unit of the spec's unit key if it is one of the allowed kinds, else null (reported) */
        Unit unit(Set<Kind> allowed) {
            String text = header.get(spec.unitKey());
            if (text == null || text.isBlank()) {
                return null;
            }
            Unit unit = Unit.fromSymbol(text).orElse(null);
            if (unit == null || !allowed.contains(unit.kind())) {
                List<String> known = new ArrayList<>();
                for (Unit u : Unit.values()) {
                    if (allowed.contains(u.kind())) {
                        known.add(u.symbol());
                    }
                }
                headerProblem(spec.unitKey(), "data.unknown-unit", "unknown " + spec.unitKey().replace('-', ' ') + " '"
                        + text + "'; known: " + String.join(", ", known));
                return null;
            }
            return unit;
        }

        /** @return the medium for a wavelength unit (reported when missing or unknown), null otherwise */
        Medium medium(Unit unit) {
            String text = header.get("medium");
            if (unit == null) {
                return null;
            }
            if (unit.kind() == Kind.WAVELENGTH) {
                if (text == null || text.isBlank()) {
                    headerProblem(spec.unitKey(), "data.missing-medium",
                            "wavelengths need a 'medium' header: vacuum, air or air(<model>)");
                    return null;
                }
                try {
                    return Medium.parse(text);
                } catch (RitzwerkException e) {
                    headerProblem("medium", "data.unknown-medium", e.getMessage());
                    return null;
                }
            }
            if (text != null) {
                headerProblem("medium", "data.medium-not-allowed", "a medium is given for " + unit.kind().noun()
                        + " values (" + unit.symbol() + "); only wavelengths have one");
            }
            return null;
        }

        // ---- row values

        Species species(Row row, Map<String, Species> cache) {
            Object value = row.values().get("species");
            if (value == null) {
                rowProblem(row, "species", "data.missing-value", "species is required");
                return null;
            }
            if (!(value instanceof String)) {
                rowProblem(row, "species", "data.wrong-type", "species must be text such as 'Ne I'");
                return null;
            }
            String text = (String) value;
            Species cached = cache.get(text);
            if (cached != null) {
                return cached;
            }
            try {
                Species species = Species.parse(text);
                cache.put(text, species);
                return species;
            } catch (RitzwerkException e) {
                rowProblem(row, "species", "data.unknown-species", e.getMessage());
                return null;
            }
        }

        /** @return the value, NaN when absent and optional (or when a problem was recorded) */
        double number(Row row, String column, boolean required) {
            double number = signedNumber(row, column, required);
            if (number < 0) {
                rowProblem(row, column, "data.negative", column + " must not be negative, got "
                        + row.values().get(column));
                return Double.NaN;
            }
            return number;
        }

        /** @return the value, which may be negative; NaN when absent and optional (or when a problem was recorded) */
        double signedNumber(Row row, String column, boolean required) {
            Object value = row.values().get(column);
            if (value == null) {
                if (required) {
                    rowProblem(row, column, "data.missing-value", column + " is required");
                }
                return Double.NaN;
            }
            double number;
            if (value instanceof Double) {
                number = (Double) value;
            } else {
                String text = ((String) value).strip();
                if (!isDecimal(text)) {
                    rowProblem(row, column, "data.not-a-number", column + " is not a number: '" + value + "'");
                    return Double.NaN;
                }
                number = Double.parseDouble(text);
            }
            if (!Double.isFinite(number)) {
                rowProblem(row, column, "data.not-finite", column + " is too large for a double"
                        + (value instanceof String ? ": '" + ((String) value).strip() + "'" : ""));
                return Double.NaN;
            }
            return number;
        }

        String text(Row row, String column) {
            Object value = row.values().get(column);
            if (value == null) {
                return null;
            }
            if (!(value instanceof String)) {
                rowProblem(row, column, "data.wrong-type", column + " must be text");
                return null;
            }
            String text = (String) value;
            if (text.length() > MAX_TEXT || text.indexOf('\n') >= 0 || text.indexOf('\r') >= 0) {
                rowProblem(row, column, "data.bad-text", column + " must be one line of at most " + MAX_TEXT
                        + " characters");
                return null;
            }
            return text;
        }
    }

    // ------------------------------------------------------------------ reading

    /** @return the file's text, refusing files above the size limit or not in UTF-8 */
    static String read(Path file) {
        String name = file.toString();
        refuseFolder(file);
        try {
            long size = Files.size(file);
            if (size > MAX_BYTES) {
                throw new DataFileException(DataFileException.TOO_LARGE, name, List.of(),
                        "file is " + size + " bytes, more than the limit of " + MAX_BYTES + "; split it");
            }
            try (InputStream in = Files.newInputStream(file)) {
                return decode(in, name);
            }
        } catch (IOException e) {
            throw DataFileException.unreadable(name, e);
        }
    }

    /**
     * @param text a value's text, stripped
     * @return whether it matches {@code [+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?} (a decimal number
     *         in plain or exponent form); a scan, as a regular expression costs several times more
     *         on a million rows
     */
    static boolean isDecimal(String text) {
        int i = 0;
        int n = text.length();
        if (i < n && (text.charAt(i) == '+' || text.charAt(i) == '-')) {
            i++;
        }
        int digits = 0;
        while (i < n && isDigit(text.charAt(i))) {
            i++;
            digits++;
        }
        if (i < n && text.charAt(i) == '.') {
            i++;
            while (i < n && isDigit(text.charAt(i))) {
                i++;
                digits++;
            }
        }
        if (digits == 0) {
            return false;
        }
        if (i < n && (text.charAt(i) == 'e' || text.charAt(i) == 'E')) {
            i++;
            if (i < n && (text.charAt(i) == '+' || text.charAt(i) == '-')) {
                i++;
            }
            int exponent = 0;
            while (i < n && isDigit(text.charAt(i))) {
                i++;
                exponent++;
            }
            if (exponent == 0) {
                return false;
            }
        }
        return i == n;
    }

    private static boolean isDigit(char c) {
        return c >= '0' && c <= '9';
    }

    /** @throws DataFileException when the path is a folder, naming it */
    static void refuseFolder(Path file) {
        if (Files.isDirectory(file)) {
            throw new DataFileException(DataFileException.UNREADABLE, file.toString(), List.of(),
                    "is a folder, not a file; give the file's path");
        }
    }

    /** @return the stream's text (UTF-8), refusing more than the size limit or malformed bytes */
    static String decode(InputStream in, String source) {
        byte[] bytes;
        try {
            bytes = in.readNBytes((int) Math.min(MAX_BYTES + 1, Integer.MAX_VALUE - 8));
        } catch (IOException e) {
            throw DataFileException.unreadable(source, e);
        }
        if (bytes.length > MAX_BYTES) {
            throw new DataFileException(DataFileException.TOO_LARGE, source, List.of(),
                    "more than " + MAX_BYTES + " bytes; split the file");
        }
        return decodeStrict(bytes, source);
    }

    /**
     * @param bytes  a file's bytes
     * @param source the file's name, for messages
     * @return the text (UTF-8, a leading byte-order mark removed)
     * @throws DataFileException naming the line and column of the first byte that is not UTF-8
     */
    static String decodeStrict(byte[] bytes, String source) {
        ByteBuffer buffer = ByteBuffer.wrap(bytes);
        // Checked through a small buffer of characters, then made a string once: decoding into one
        // buffer of the whole text would need twice the file's size in characters besides.
        java.nio.charset.CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
        java.nio.CharBuffer chunk = java.nio.CharBuffer.allocate(8192);
        boolean valid;
        while (true) {
            java.nio.charset.CoderResult result = decoder.decode(buffer, chunk, true);
            if (result.isUnderflow()) {
                result = decoder.flush(chunk);
            }
            if (result.isError()) {
                valid = false;
                break;
            }
            if (result.isUnderflow()) {
                valid = true;
                break;
            }
            chunk.clear();
        }
        if (valid) {
            return withoutByteOrderMark(new String(bytes, StandardCharsets.UTF_8));
        }
        // The decoder stops with the buffer at the first bad byte: name its line and column.
        int at = Math.min(buffer.position(), bytes.length);
        int line = 1;
        int lineStart = 0;
        for (int i = 0; i < at; i++) {
            if (bytes[i] == '\n') {
                line++;
                lineStart = i + 1;
            }
        }
        int column = new String(bytes, lineStart, at - lineStart, StandardCharsets.UTF_8).length() + 1;
        throw new DataFileException(DataFileException.INVALID, source, List.of(new DataProblem(source, line, column,
                "data.not-utf8", String.format(Locale.ROOT, "byte 0x%02X is not valid UTF-8 text here",
                        bytes[at] & 0xff), "")), "");
    }

    /**
     * @param text a file's text
     * @return the text without a leading UTF-8 byte-order mark (U+FEFF), which some editors write
     *         and which is invisible; accepted, not reported
     */
    static String withoutByteOrderMark(String text) {
        return text.startsWith("\uFEFF") ? text.substring(1) : text;
    }

    /** @return whether to read as JSON: by extension, else by a leading '{' */
    static boolean isJson(String source, String text) {
        String lower = source.toLowerCase(Locale.ROOT);
        return lower.endsWith(".json") || !lower.endsWith(".csv") && text.stripLeading().startsWith("{");
    }

    static Parsed parseCsv(Spec spec, String text, String source) {
        return parseCsv(spec, text, source, null);
    }

    /**
     * @param sink takes each row as it is read (then {@link Parsed#rows} stays empty); null to keep
     *             the rows in {@link Parsed#rows}
     */
    static Parsed parseCsv(Spec spec, String text, String source, RowSink sink) {
        Parsed p = new Parsed(spec, source, text, sink);
        p.emptyFile = text.isBlank();
        int lineNumber = readHeader(p, p::raw, p.lineCount());
        try (JsonParser rows = CSV_ROWS.createParser(ObjectReadContext.empty(), text)) {
            readRows(p, rows, lineNumber);
        } catch (JacksonException e) {
            csvSyntax(p, e);
        }
        return p;
    }

    /**
     * Where a CSV file's further tables start: every line that reads {@code # <marker>} for one of
     * the markers (spaces around either part ignored), after which come the section's row of column
     * names and its rows, up to the next such line or the end.
     *
     * @param text    the whole file
     * @param markers the sections' names, e.g. {@code correlations}
     * @return the 1-based lines of the markers found, in file order, each with its marker
     */
    static List<Map.Entry<Integer, String>> sectionLines(String text, Set<String> markers) {
        Parsed lines = new Parsed(null, "", text, null);
        List<Map.Entry<Integer, String>> found = new ArrayList<>();
        for (int l = 1; l <= lines.lineCount(); l++) {
            String stripped = lines.raw(l).strip();
            if (stripped.startsWith("#") && markers.contains(stripped.substring(1).strip())) {
                found.add(Map.entry(l, stripped.substring(1).strip()));
            }
        }
        return found;
    }

    /**
     * @param text a CSV file's text
     * @param line a 1-based line
     * @return the text before that line (the lines before it keep their numbers)
     */
    static String before(String text, int line) {
        Parsed lines = new Parsed(null, "", text, null);
        return text.substring(0, lines.lineStarts[line - 1]);
    }

    /**
     * Reads a further table of a CSV file, after its marker line ({@link #sectionLines}) and before
     * the line {@code endLine}: a row of column names, then rows, with the lines numbered as in the
     * whole file. The spec's header keys are not read (the file's header is the first table's).
     *
     * @param spec       the section's columns (its format and version are the file's)
     * @param text       the whole file
     * @param source     file name for messages
     * @param markerLine the marker's line
     * @param endLine    the line after the section's last (the next marker's), or beyond the last line
     * @return the rows and problems
     */
    static Parsed parseCsvSection(Spec spec, String text, String source, int markerLine, int endLine) {
        Parsed p = new Parsed(spec, source, text, null);
        // the lines up to the marker become empty lines, so the parser's line numbers stay the file's
        int end = endLine <= p.lineCount() ? p.lineStarts[endLine - 1] : text.length();
        String rest = "\n".repeat(markerLine) + (markerLine < p.lineCount() ? text.substring(p.lineStarts[markerLine],
                Math.max(end, p.lineStarts[markerLine])) : "");
        try (JsonParser rows = CSV_ROWS.createParser(ObjectReadContext.empty(), rest)) {
            readRows(p, rows, markerLine);
        } catch (JacksonException e) {
            csvSyntax(p, e);
        }
        return p;
    }

    /**
     * Reads a CSV file as it streams from the disk, for files beyond {@link #MAX_BYTES} and
     * {@link #MAX_ROWS} (a line list of millions of lines): the header as
     * {@link #parseCsv(Spec, String, String, RowSink)} reads it, then each row handed to the sink
     * and dropped. No text of the whole file is held, so problems show no excerpt of their line
     * (file, line and column are given as always). At most {@code maxRows} rows.
     *
     * @param maxRows the most rows read; beyond, a {@link DataFileException#TOO_LARGE} problem
     */
    static Parsed parseCsvStreaming(Spec spec, Path file, RowSink sink, int maxRows) {
        String name = file.toString();
        refuseFolder(file);
        Parsed p = new Parsed(spec, name, "", sink);
        p.maxRows = maxRows;
        List<String> head = new ArrayList<>();
        try (java.io.BufferedReader in = strictReader(file)) {
            String line;
            boolean end = true;
            while ((line = in.readLine()) != null) {
                head.add(head.isEmpty() ? withoutByteOrderMark(line) : line);
                String stripped = line.strip();
                if (!stripped.isEmpty() && !stripped.startsWith("#") && !stripped.startsWith("\uFEFF#")) {
                    end = false;
                    break;
                }
            }
            if (end && endsWithLineBreak(file)) {
                head.add(""); // as the whole-file reader counts lines: a final line break starts an empty line
            }
        } catch (java.nio.charset.CharacterCodingException e) {
            throw notUtf8(file);
        } catch (IOException e) {
            throw DataFileException.unreadable(name, e);
        }
        int lineNumber = readHeader(p, l -> l >= 1 && l <= head.size() ? head.get(l - 1) : "", head.size());
        try (java.io.Reader in = strictReader(file)) {
            in.mark(1);
            if (in.read() != '\uFEFF') {
                in.reset();
            }
            try (JsonParser rows = CSV_ROWS.createParser(ObjectReadContext.empty(), in)) {
                readRows(p, rows, lineNumber);
            }
        } catch (JacksonException e) {
            if (e.getCause() instanceof java.nio.charset.CharacterCodingException) {
                throw notUtf8(file);
            }
            csvSyntax(p, e);
        } catch (java.nio.charset.CharacterCodingException e) {
            throw notUtf8(file);
        } catch (IOException e) {
            throw DataFileException.unreadable(name, e);
        }
        return p;
    }

    /**
     * The file's first byte that is not UTF-8, found by decoding it again in chunks, as the
     * problem {@link #decodeStrict} reports for a file read whole (line and column).
     */
    private static DataFileException notUtf8(Path file) {
        String name = file.toString();
        java.nio.charset.CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer bytes = ByteBuffer.allocate(1 << 16);
        java.nio.CharBuffer chars = java.nio.CharBuffer.allocate(1 << 16);
        int line = 1;
        int column = 1;
        try (InputStream in = Files.newInputStream(file)) {
            while (true) {
                int read = in.read(bytes.array(), bytes.position(), bytes.remaining());
                if (read > 0) {
                    bytes.position(bytes.position() + read);
                }
                bytes.flip();
                java.nio.charset.CoderResult result = decoder.decode(bytes, chars, read < 0);
                chars.flip();
                while (chars.hasRemaining()) {
                    if (chars.get() == '\n') {
                        line++;
                        column = 1;
                    } else {
                        column++;
                    }
                }
                chars.clear();
                if (result.isError()) {
                    int bad = bytes.get(bytes.position()) & 0xff;
                    return new DataFileException(DataFileException.INVALID, name, List.of(new DataProblem(name, line,
                            column, "data.not-utf8", String.format(Locale.ROOT,
                                    "byte 0x%02X is not valid UTF-8 text here", bad), "")), "");
                }
                bytes.compact();
                if (read < 0) {
                    break;
                }
            }
        } catch (IOException e) {
            return DataFileException.unreadable(name, e);
        }
        return new DataFileException(DataFileException.INVALID, name, List.of(new DataProblem(name, line, column,
                "data.not-utf8", "the file is not valid UTF-8 text", "")), "");
    }

    private static boolean endsWithLineBreak(Path file) throws IOException {
        try (java.nio.channels.SeekableByteChannel channel = Files.newByteChannel(file)) {
            long size = channel.size();
            if (size == 0) {
                return false;
            }
            ByteBuffer last = ByteBuffer.allocate(1);
            channel.position(size - 1).read(last);
            return last.get(0) == '\n' || last.get(0) == '\r';
        }
    }

    /** A reader of the file's UTF-8 text that fails on a malformed byte instead of replacing it. */
    private static java.io.BufferedReader strictReader(Path file) throws IOException {
        java.nio.charset.CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
        return new java.io.BufferedReader(new java.io.InputStreamReader(Files.newInputStream(file), decoder), 1 << 16);
    }

    /**
     * A parser's message without the parts that describe the parser rather than the file (the
     * "[Source: ...]" location note the reader prints when it hides the source).
     *
     * @param e the parser's exception
     * @return its message for a user
     */
    static String readable(JacksonException e) {
        String text = e.getOriginalMessage();
        if (text == null) {
            return "";
        }
        text = text.replaceAll("\\s*\\(start marker at \\[Source:[^\\]]*\\]\\)", "")
                .replaceAll("\\s*\\[Source:[^\\]]*\\]", "").strip();
        // the parser's advice names its own switches, which mean nothing in a data file
        text = text.replaceAll(":?\\s*enable `?[A-Za-z_.]+`? to allow", "")
                .replace("Non-standard token 'NaN'", "NaN, which JSON has no number for")
                .replace("Non-standard token 'Infinity'", "Infinity, which JSON has no number for")
                .replace("Non-standard token '-Infinity'", "-Infinity, which JSON has no number for");
        TokenStreamLocation where = e.getLocation();
        if (where != null && where.getLineNr() > 0) {
            text += " (line " + where.getLineNr() + (where.getColumnNr() > 0 ? ", column " + where.getColumnNr() : "")
                    + ")";
        }
        return text;
    }

    private static void csvSyntax(Parsed p, JacksonException e) {
        TokenStreamLocation where = e.getLocation();
        int line = where == null ? 1 : Math.max(where.getLineNr(), 1);
        p.problem(line, where == null ? 0 : Math.max(where.getColumnNr(), 0), "data.csv-syntax",
                "CSV syntax: " + readable(e), "");
    }

    /**
     * Reads the header lines ({@code # key: value}, the first {@code # format version}) up to the
     * first line that is neither blank nor a comment.
     *
     * @param lineAt the text of line l (1-based), without its line break
     * @param lines  the number of lines lineAt knows
     * @return the number of lines looked at
     */
    private static int readHeader(Parsed p, java.util.function.IntFunction<String> lineAt, int lines) {
        Spec spec = p.spec;
        String formatLine = spec.format() + " " + spec.version();
        int lineNumber = 0;
        boolean sawFormat = false;
        for (int l = 1; l <= lines; l++) {
            String line = lineAt.apply(l);
            lineNumber++;
            String stripped = line.strip();
            if (stripped.isEmpty()) {
                continue;
            }
            if (!stripped.startsWith("#")) {
                break;
            }
            String content = stripped.substring(1).strip();
            if (!sawFormat) {
                sawFormat = true;
                if (!content.equals(formatLine)) {
                    p.problem(lineNumber, 1, "data.format", content.startsWith(spec.format() + " ")
                            ? "format version '" + content.substring(spec.format().length()).strip()
                                    + "' is not supported; this reader reads version " + spec.version()
                            : "the first line must be '# " + formatLine + "'", line);
                }
                continue;
            }
            if (content.isEmpty()) {
                continue;
            }
            int colon = content.indexOf(':');
            if (colon <= 0) {
                p.problem(lineNumber, 1, "data.header", "header line must be '# key: value'", line);
                continue;
            }
            String key = content.substring(0, colon).strip();
            if (!spec.headerKeys().contains(key)) {
                p.problem(lineNumber, 1, "data.header", "unknown header key '" + key + "'; known: "
                        + String.join(", ", spec.headerKeys()), line);
            } else if (p.header.put(key, content.substring(colon + 1).strip()) != null) {
                p.problem(lineNumber, 1, "data.header", "header key '" + key + "' is given twice", line);
            }
            p.headerLine.put(key, lineNumber);
        }
        if (!sawFormat) {
            p.problem(1, 1, "data.format", "the file must start with '# " + formatLine + "'", "");
        }
        return lineNumber;
    }

    /** The rows after the header: the row of column names, then the data rows to {@link #addRow}. */
    private static void readRows(Parsed p, JsonParser rows, int lineNumber) {
        String[] columns = null;
        boolean open = rows.nextToken() == JsonToken.START_ARRAY; // the rows wrapped as one array
        List<String> row = new ArrayList<>();
        while (open && rows.nextToken() == JsonToken.START_ARRAY) {
            int line = rows.currentLocation().getLineNr();
            row.clear();
            for (JsonToken t = rows.nextToken(); t != JsonToken.END_ARRAY; t = rows.nextToken()) {
                row.add(t == JsonToken.VALUE_NULL ? "" : rows.getString());
            }
            String[] fields = row.toArray(new String[0]);
            if (fields.length == 1 && fields[0].isBlank()) {
                continue;
            }
            if (columns == null) {
                columns = fields.clone();
                for (int c = 0; c < columns.length; c++) {
                    columns[c] = columns[c].strip();
                }
                columns(p, fields, line);
                continue;
            }
            if (fields.length != columns.length) {
                p.problem(line, 0, "data.field-count", "row has " + fields.length + " fields, the header has "
                        + columns.length, "");
                continue;
            }
            Map<String, Object> values = new HashMap<>();
            for (int c = 0; c < columns.length; c++) {
                values.put(columns[c], fields[c].isEmpty() ? null : fields[c]);
            }
            if (!addRow(p, new Row(line, p.raw(line), values, 0))) {
                break;
            }
        }
        if (columns == null) {
            p.problem(lineNumber, 0, "data.no-columns", "no row of column names after the header", "");
        }
    }

    private static void columns(Parsed p, String[] names, int line) {
        Map<String, Integer> index = new HashMap<>();
        for (int c = 0; c < names.length; c++) {
            String name = names[c].strip();
            if (!p.spec.columns().contains(name)) {
                p.problem(line, c + 1, "data.unknown-column", "unknown column '" + name + "'; known: "
                        + String.join(", ", p.spec.columns()), "");
            } else if (index.put(name, c + 1) != null) {
                p.problem(line, c + 1, "data.duplicate-column", "column '" + name + "' appears twice", "");
            }
        }
        for (String required : p.spec.requiredColumns()) {
            if (!index.containsKey(required)) {
                p.problem(line, 0, "data.missing-column", "required column '" + required + "' is missing", "");
            }
        }
        p.columnIndex = index;
    }

    /** @return false when the row limit is passed and reading should stop */
    private static boolean addRow(Parsed p, Row row) {
        if (p.rowCount >= p.maxRows) {
            p.problem(row.line(), 0, DataFileException.TOO_LARGE, "more than " + p.maxRows + " rows; split the file",
                    row.raw());
            return false;
        }
        p.rowCount++;
        if (p.sink != null) {
            p.sink.accept(p, row);
        } else {
            p.rows.add(row);
        }
        return true;
    }

    static Parsed parseJson(Spec spec, String text, String source) {
        return parseJson(spec, text, source, null);
    }

    /**
     * @param sink takes each row as it is read (then {@link Parsed#rows} stays empty); null to keep
     *             the rows in {@link Parsed#rows}
     */
    static Parsed parseJson(Spec spec, String text, String source, RowSink sink) {
        return parseJson(spec, text, source, sink, List.of());
    }

    /**
     * @param sections further tables' rows, each read from its own array key ({@link Spec#arrayKey()}
     *                 of the section's spec); none when the format has none; their problems stay in them
     */
    static Parsed parseJson(Spec spec, String text, String source, RowSink sink, List<Parsed> sections) {
        Parsed p = new Parsed(spec, source, text, sink);
        List<String> jsonKeys = new ArrayList<>(List.of("format", "formatVersion"));
        spec.headerKeys().forEach(key -> jsonKeys.add(spec.jsonKey(key)));
        jsonKeys.add(spec.arrayKey());
        Map<String, Parsed> sectionOf = new HashMap<>();
        for (Parsed section : sections) {
            jsonKeys.add(section.spec.arrayKey());
            sectionOf.put(section.spec.arrayKey(), section);
            Map<String, Integer> sectionIndex = new HashMap<>();
            section.spec.columns().forEach(c -> sectionIndex.put(c, 0));
            section.columnIndex = sectionIndex;
        }
        boolean sawRows = false;
        Object format = null;
        Object version = null;
        int formatLine = 1;
        try (JsonParser parser = Mappers.JSON.createParser(text)) {
            if (parser.nextToken() != JsonToken.START_OBJECT) {
                p.problem(1, 1, "data.json-shape", "the file must be one JSON object", "");
                return p;
            }
            while (parser.nextToken() == JsonToken.PROPERTY_NAME) {
                String name = parser.currentName();
                int line = parser.currentTokenLocation().getLineNr();
                parser.nextToken();
                // the rows' array, or a further table's (whose problems stay in it)
                Parsed rowsInto = name.equals(spec.arrayKey()) ? p : sectionOf.get(name);
                if (rowsInto != null) {
                    sawRows |= rowsInto == p;
                    if (!jsonRows(parser, p, rowsInto, name, line)) {
                        return p;
                    }
                    continue;
                }
                JsonNode value = Mappers.JSON.readTree(parser);
                if (name.equals("format")) {
                    format = value.isString() ? value.asString() : value.toString();
                    formatLine = line;
                } else if (name.equals("formatVersion")) {
                    version = value.isIntegralNumber() ? (Object) value.asInt() : shown(value);
                } else {
                    String key = headerKeyOf(spec, name);
                    if (key == null) {
                        p.problem(line, 0, "data.header", "unknown key '" + name + "'; known: "
                                + String.join(", ", jsonKeys), "");
                    } else if (!value.isString()) {
                        p.problem(line, 0, "data.header", "'" + name + "' must be a string", "");
                    } else {
                        p.header.put(key, value.asString());
                        p.headerLine.put(key, line);
                    }
                }
            }
            if (parser.nextToken() != null) {
                TokenStreamLocation at = parser.currentTokenLocation();
                p.problem(at.getLineNr(), at.getColumnNr(), "data.json-shape", "text after the end of the object", "");
            }
        } catch (JacksonException e) {
            TokenStreamLocation where = e.getLocation();
            int line = where == null ? 1 : Math.max(where.getLineNr(), 1);
            p.problem(line, where == null ? 0 : Math.max(where.getColumnNr(), 0), "data.json-syntax",
                    "JSON syntax: " + readable(e), "");
            return p;
        }
        if (!spec.format().equals(format)) {
            p.problem(formatLine, 0, "data.format", "'format' must be \"" + spec.format() + "\"", "");
        }
        if (!Integer.valueOf(spec.version()).equals(version)) {
            p.problem(formatLine, 0, "data.format", "'formatVersion' must be " + spec.version()
                    + (version == null ? "" : ", got " + version), "");
        }
        if (!sawRows) {
            p.problem(1, 0, "data.json-shape", "the object has no '" + spec.arrayKey() + "' array", "");
        }
        Map<String, Integer> index = new HashMap<>();
        for (int c = 0; c < spec.columns().size(); c++) {
            index.put(spec.columns().get(c), 0);
        }
        p.columnIndex = index;
        return p;
    }

    private static String headerKeyOf(Spec spec, String jsonName) {
        for (String key : spec.headerKeys()) {
            if (spec.jsonKey(key).equals(jsonName)) {
                return key;
            }
        }
        return null;
    }

    /** @return false when reading should stop */
    /**
     * Reads the array of rows under key {@code name} into {@code rowsInto}; a value that is not an
     * array is a problem of the file ({@code file}) and skipped.
     *
     * @return false when a row stopped the reading (too many problems)
     */
    private static boolean jsonRows(JsonParser parser, Parsed file, Parsed rowsInto, String name, int line) {
        if (parser.currentToken() != JsonToken.START_ARRAY) {
            file.problem(line, 0, "data.json-shape", "'" + name + "' must be an array", "");
            parser.skipChildren();
            return true;
        }
        while (parser.nextToken() != JsonToken.END_ARRAY) {
            TokenStreamLocation at = parser.currentTokenLocation();
            JsonNode node = Mappers.JSON.readTree(parser);
            if (!jsonRow(rowsInto, node, at.getLineNr(), at.getColumnNr())) {
                return false;
            }
        }
        return true;
    }

    private static boolean jsonRow(Parsed p, JsonNode node, int line, int column) {
        String raw = p.raw(line);
        int entry = ++p.jsonEntries;
        if (!node.isObject()) {
            p.problem(line, column, "data.json-shape", "each entry of '" + p.spec.arrayKey() + "' must be a JSON object",
                    raw);
            return true;
        }
        Map<String, Object> values = new HashMap<>();
        boolean ok = true;
        // which entry, as the row problems say it (a file on one line has every entry at line 1)
        String where = "entry " + entry + " of '" + p.spec.arrayKey() + "': ";
        for (var property : node.properties()) {
            String key = property.getKey();
            JsonNode value = property.getValue();
            if (!p.spec.columns().contains(key)) {
                p.problem(line, column, "data.unknown-field", where + "unknown field '" + key + "'; known: "
                        + String.join(", ", p.spec.columns()), raw);
                ok = false;
            } else if (value.isNull()) {
                values.put(key, null);
            } else if (value.isNumber()) {
                // numberValue().doubleValue() gives infinity for an out-of-range integer, which is
                // then reported; asDouble() would throw.
                values.put(key, value.numberValue().doubleValue());
            } else if (value.isString() && p.spec.numericColumns().contains(key)) {
                p.problem(line, column, "data.wrong-type", where + "field '" + key + "' must be a JSON number, got the"
                        + " string \""
                        + value.asString() + "\"", raw);
                ok = false;
            } else if (value.isString()) {
                values.put(key, value.asString().isEmpty() ? null : value.asString());
            } else {
                p.problem(line, column, "data.wrong-type", where + "field '" + key + "' must be a number, a string or"
                        + " null, got "
                        + value.getNodeType().name().toLowerCase(Locale.ROOT), raw);
                ok = false;
            }
        }
        return !ok || addRow(p, new Row(line, raw, values, entry));
    }

    // ------------------------------------------------------------------ writing

    static String writeCsv(Spec spec, Map<String, String> header, List<String[]> rows) {
        StringBuilder text = new StringBuilder();
        text.append("# ").append(spec.format()).append(' ').append(spec.version()).append('\n');
        for (Map.Entry<String, String> entry : header.entrySet()) {
            text.append("# ").append(entry.getKey()).append(": ").append(entry.getValue()).append('\n');
        }
        List<String[]> all = new ArrayList<>();
        all.add(spec.columns().toArray(new String[0]));
        all.addAll(rows);
        StringWriter out = new StringWriter();
        Mappers.CSV.writer(CsvSchema.emptySchema().withLineSeparator("\n")).writeValues(out).writeAll(all).close();
        return text.append(out).toString();
    }

    static String writeJson(Spec spec, Map<String, String> header, List<ObjectNode> rows) {
        return writeJson(spec, header, rows, Map.of());
    }

    /**
     * @param sections further tables in the order written, each its spec and rows, written under the
     *                 spec's array key when it has rows (none: no key written)
     */
    static String writeJson(Spec spec, Map<String, String> header, List<ObjectNode> rows,
            Map<Spec, List<ObjectNode>> sections) {
        ObjectNode root = Mappers.JSON.createObjectNode();
        root.put("format", spec.format());
        root.put("formatVersion", spec.version());
        header.forEach((key, value) -> root.put(spec.jsonKey(key), value));
        ArrayNode array = root.putArray(spec.arrayKey());
        rows.forEach(array::add);
        sections.forEach((section, sectionRows) -> {
            if (!sectionRows.isEmpty()) {
                ArrayNode more = root.putArray(section.arrayKey());
                sectionRows.forEach(more::add);
            }
        });
        return Mappers.JSON.writerWithDefaultPrettyPrinter().writeValueAsString(root) + "\n";
    }

    /**
     * @param marker the section's name, written as the line {@code # <marker>}
     * @param spec   the section's columns
     * @param rows   its rows
     * @return the second table of a CSV file, to follow the first
     */
    static String writeCsvSection(String marker, Spec spec, List<String[]> rows) {
        List<String[]> all = new ArrayList<>();
        all.add(spec.columns().toArray(new String[0]));
        all.addAll(rows);
        StringWriter out = new StringWriter();
        Mappers.CSV.writer(CsvSchema.emptySchema().withLineSeparator("\n")).writeValues(out).writeAll(all).close();
        return "# " + marker + "\n" + out;
    }

    static ObjectNode newRow() {
        return Mappers.JSON.createObjectNode();
    }

    static void put(ObjectNode row, String key, String value) {
        if (value != null) {
            row.put(key, value);
        }
    }

    static void put(ObjectNode row, String key, OptionalDouble value) {
        if (value.isPresent()) {
            row.put(key, value.getAsDouble());
        }
    }

    static String csv(OptionalDouble value) {
        return value.isPresent() ? Double.toString(value.getAsDouble()) : "";
    }

    static String csv(String value) {
        return value == null ? "" : value;
    }

    /** The header keys every format shares, from a data set's info. */
    static Map<String, String> header(DataSetInfo info, boolean withKind) {
        Map<String, String> header = new LinkedHashMap<>();
        header.put("id", info.id());
        header.put("title", info.title());
        header.put("source", info.provenance().detail());
        header.put("provenance", info.provenance().kind().id());
        header.put("version", info.version());
        if (withKind) {
            header.put("kind", info.kind().id());
        }
        return header;
    }

    /** A data set info from a sound header; a placeholder when the header has problems. */
    static DataSetInfo info(Parsed p, DataKind kind, Provenance.Kind provenance, boolean sound) {
        if (!sound) {
            return new DataSetInfo("invalid", kind, "-", "-", Provenance.published("-"), List.of());
        }
        return new DataSetInfo(p.header.get("id"), kind, p.header.get("title"), p.header.get("version"),
                new Provenance(provenance, p.header.get("source")), List.of());
    }
}
