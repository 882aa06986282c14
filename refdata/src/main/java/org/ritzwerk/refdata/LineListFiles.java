package org.ritzwerk.refdata;

import java.io.IOException;
import java.io.InputStream;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
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
import java.util.regex.Pattern;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;
import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.core.TokenStreamLocation;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.MappingIterator;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;
import tools.jackson.dataformat.csv.CsvMapper;
import tools.jackson.dataformat.csv.CsvReadFeature;
import tools.jackson.dataformat.csv.CsvSchema;

/**
 * Ritzwerk's own line-list file format, in CSV and in JSON, read and written with Jackson.
 *
 * <p>CSV: a header of {@code # key: value} lines, the first being {@code # ritzwerk-lines 1}
 * (format and version), then a row of column names and one row per line:
 * <pre>
 * # ritzwerk-lines 1
 * # id: lab-ne-lamp
 * # title: Neon lamp lines measured on the bench
 * # source: measured by the optics lab, 2026
 * # provenance: measured
 * # version: 2026-11
 * # position-unit: nm
 * # medium: air
 * species,position,uncertainty,intensity,strength,einstein_a,lower,upper,note
 * Ne I,585.24878,0.00002,500,strong,,,,
 * </pre>
 * Header keys: {@code id}, {@code title}, {@code source}, {@code provenance} (published,
 * from-memory, computed, measured), {@code version}, {@code position-unit} (any unit of
 * {@link Unit} but kelvin) and {@code medium} (vacuum, air, or air(model); required for
 * wavelength units and refused for the others) are required; {@code kind} (lines or lamp-lines)
 * and {@code note} are optional. Columns {@code species} and {@code position} are required, the
 * others optional and may come in any order; an empty field means "not given".
 *
 * <p>JSON: one object with {@code "format": "ritzwerk-lines"}, {@code "formatVersion": 1}, the
 * header keys in camel case ({@code positionUnit}) and {@code "lines"}: an array of objects
 * with the column names as keys, numbers as JSON numbers, and null or absence for "not given".
 *
 * <p>Reading is strict and complete: every problem in the file (unknown unit, missing medium,
 * unreadable or non-finite number, negative value, unknown species or strength, duplicate line,
 * unknown column or key) is collected with line, column and reason, and if there is any, a
 * {@link DataFileException} carries them all and no list is returned. At most
 * {@link #MAX_BYTES} bytes and {@link #MAX_ROWS} rows. What is written reads back equal, value
 * for value and bit for bit. Stateless and thread-safe.
 */
public final class LineListFiles {

    /** The format name in both encodings. */
    public static final String FORMAT = "ritzwerk-lines";
    /** The format version this reader writes and reads. */
    public static final int VERSION = 1;
    /** The largest file read, in bytes (64 MiB). */
    public static final long MAX_BYTES = 64L << 20;
    /** The most rows read. */
    public static final int MAX_ROWS = 1_000_000;
    /** Columns in the order they are written. */
    public static final List<String> COLUMNS =
            List.of("species", "position", "uncertainty", "intensity", "strength", "einstein_a", "lower", "upper",
                    "note");

    private static final List<String> NUMERIC_COLUMNS = List.of("position", "uncertainty", "intensity", "einstein_a");
    private static final List<String> HEADER_KEYS =
            List.of("id", "title", "source", "provenance", "version", "kind", "position-unit", "medium", "note");
    private static final List<String> REQUIRED_KEYS =
            List.of("id", "title", "source", "provenance", "version", "position-unit");
    private static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?");
    private static final int MAX_TEXT = 500;
    /** Reads values out of a running parser, so a value is not the end of the input. */
    private static final JsonMapper JSON = JsonMapper.builder()
            .disable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS).build();
    private static final CsvMapper CSV = CsvMapper.builder().enable(CsvReadFeature.ALLOW_COMMENTS)
            .enable(CsvReadFeature.WRAP_AS_ARRAY).build();

    private LineListFiles() {
    }

    /**
     * @param file        a {@code .csv} or {@code .json} file
     * @param defaultKind the kind when the file names none ({@link DataKind#LINES} or
     *                    {@link DataKind#LAMP_LINES})
     * @return the list
     * @throws DataFileException with every problem found
     */
    public static LineList read(Path file, DataKind defaultKind) {
        String name = file.toString();
        long size;
        try {
            size = Files.size(file);
        } catch (IOException e) {
            throw new DataFileException(DataFileException.UNREADABLE, name, List.of(), "cannot read: " + e.getMessage());
        }
        if (size > MAX_BYTES) {
            throw new DataFileException(DataFileException.TOO_LARGE, name, List.of(),
                    "file is " + size + " bytes, more than the limit of " + MAX_BYTES + "; split it");
        }
        try (InputStream in = Files.newInputStream(file)) {
            return read(in, name, defaultKind);
        } catch (IOException e) {
            throw new DataFileException(DataFileException.UNREADABLE, name, List.of(), "cannot read: " + e.getMessage());
        }
    }

    /**
     * @param in          the bytes (UTF-8), read to the end; not closed
     * @param source      file name for messages; its extension (.csv or .json) picks the encoding,
     *                    else a first non-blank character '{' means JSON
     * @param defaultKind the kind when the file names none
     * @return the list
     * @throws DataFileException with every problem found
     */
    public static LineList read(InputStream in, String source, DataKind defaultKind) {
        String text = decode(in, source);
        String lower = source.toLowerCase(Locale.ROOT);
        boolean json = lower.endsWith(".json") || !lower.endsWith(".csv") && text.stripLeading().startsWith("{");
        return json ? readJson(text, source, defaultKind) : readCsv(text, source, defaultKind);
    }

    private static String decode(InputStream in, String source) {
        byte[] bytes;
        try {
            bytes = in.readNBytes((int) Math.min(MAX_BYTES + 1, Integer.MAX_VALUE - 8));
        } catch (IOException e) {
            throw new UncheckedIOException(source + ": " + e.getMessage(), e);
        }
        if (bytes.length > MAX_BYTES) {
            throw new DataFileException(DataFileException.TOO_LARGE, source, List.of(),
                    "more than " + MAX_BYTES + " bytes; split the file");
        }
        try {
            return StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new DataFileException(DataFileException.INVALID, source,
                    List.of(new DataProblem(source, 1, 0, "data.not-utf8", "the file is not valid UTF-8 text", "")), "");
        }
    }

    // ------------------------------------------------------------------ CSV

    /**
     * @param text        the whole file
     * @param source      file name for messages
     * @param defaultKind the kind when the file names none
     * @return the list
     * @throws DataFileException with every problem found
     */
    public static LineList readCsv(String text, String source, DataKind defaultKind) {
        Problems problems = new Problems(source);
        String[] lines = text.split("\\R", -1);
        Map<String, String> header = new LinkedHashMap<>();
        Map<String, Integer> headerLine = new HashMap<>();
        int lineNumber = 0;
        boolean sawFormat = false;
        for (String line : lines) {
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
                if (!content.equals(FORMAT + " " + VERSION)) {
                    problems.add(lineNumber, 1, "data.format", content.startsWith(FORMAT + " ")
                            ? "format version '" + content.substring(FORMAT.length()).strip() + "' is not supported; "
                                    + "this reader reads version " + VERSION
                            : "the first line must be '# " + FORMAT + " " + VERSION + "'", line);
                }
                continue;
            }
            if (content.isEmpty()) {
                continue;
            }
            int colon = content.indexOf(':');
            if (colon <= 0) {
                problems.add(lineNumber, 1, "data.header", "header line must be '# key: value'", line);
                continue;
            }
            String key = content.substring(0, colon).strip();
            if (!HEADER_KEYS.contains(key)) {
                problems.add(lineNumber, 1, "data.header", "unknown header key '" + key + "'; known: "
                        + String.join(", ", HEADER_KEYS), line);
            } else if (header.put(key, content.substring(colon + 1).strip()) != null) {
                problems.add(lineNumber, 1, "data.header", "header key '" + key + "' is given twice", line);
            }
            headerLine.put(key, lineNumber);
        }
        if (!sawFormat) {
            problems.add(1, 1, "data.format", "the file must start with '# " + FORMAT + " " + VERSION + "'",
                    lines.length > 0 ? lines[0] : "");
        }
        Metadata metadata = Metadata.of(header, headerLine, defaultKind, problems, false, lines);
        LineList.Builder builder = metadata.builder();
        Rows rows = new Rows(problems, metadata);
        try (MappingIterator<String[]> iterator = CSV.readerFor(String[].class).readValues(text)) {
            String[] columns = null;
            while (iterator.hasNextValue()) {
                int line = iterator.currentLocation().getLineNr();
                String[] fields = iterator.nextValue();
                if (fields.length == 1 && fields[0].isBlank()) {
                    continue;
                }
                if (columns == null) {
                    columns = fields;
                    rows.columns(columns, line, lines[Math.min(line, lines.length) - 1]);
                    continue;
                }
                String raw = line - 1 < lines.length ? lines[line - 1] : "";
                if (fields.length != columns.length) {
                    problems.add(line, 0, "data.field-count", "row has " + fields.length + " fields, the header has "
                            + columns.length, raw);
                    continue;
                }
                Map<String, Object> values = new HashMap<>();
                for (int c = 0; c < columns.length; c++) {
                    values.put(columns[c], fields[c].isEmpty() ? null : fields[c]);
                }
                if (!rows.add(values, line, raw, builder)) {
                    break;
                }
            }
            if (columns == null) {
                problems.add(lineNumber, 0, "data.no-columns", "no row of column names after the header", "");
            }
        } catch (JacksonException e) {
            TokenStreamLocation where = e.getLocation();
            int line = where == null ? 0 : where.getLineNr();
            problems.add(Math.max(line, 1), where == null ? 0 : Math.max(where.getColumnNr(), 0), "data.csv-syntax",
                    "CSV syntax: " + e.getOriginalMessage(), line >= 1 && line <= lines.length ? lines[line - 1] : "");
        }
        problems.throwIfAny();
        return withCoverage(builder.build());
    }

    /** The list with its info naming the species its rows cover. */
    private static LineList withCoverage(LineList list) {
        DataSetInfo info = list.info();
        return list.withInfo(new DataSetInfo(info.id(), info.kind(), info.title(), info.version(), info.provenance(),
                list.coveredSpecies()));
    }

    // ------------------------------------------------------------------ JSON

    /**
     * @param text        the whole file
     * @param source      file name for messages
     * @param defaultKind the kind when the file names none
     * @return the list
     * @throws DataFileException with every problem found
     */
    public static LineList readJson(String text, String source, DataKind defaultKind) {
        Problems problems = new Problems(source);
        String[] lines = text.split("\\R", -1);
        Map<String, String> header = new LinkedHashMap<>();
        Map<String, Integer> headerLine = new HashMap<>();
        List<Object[]> rowNodes = new ArrayList<>();
        boolean sawLines = false;
        try (JsonParser parser = JSON.createParser(text)) {
            if (parser.nextToken() != JsonToken.START_OBJECT) {
                problems.add(1, 1, "data.json-shape", "the file must be one JSON object", lines[0]);
                problems.throwIfAny();
            }
            Object format = null;
            Object version = null;
            int formatLine = 1;
            while (parser.nextToken() == JsonToken.PROPERTY_NAME) {
                String name = parser.currentName();
                int line = parser.currentTokenLocation().getLineNr();
                parser.nextToken();
                if (name.equals("lines")) {
                    sawLines = true;
                    if (parser.currentToken() != JsonToken.START_ARRAY) {
                        problems.add(line, 0, "data.json-shape", "'lines' must be an array", raw(lines, line));
                        parser.skipChildren();
                        continue;
                    }
                    while (parser.nextToken() != JsonToken.END_ARRAY) {
                        TokenStreamLocation at = parser.currentTokenLocation();
                        JsonNode node = JSON.readTree(parser);
                        rowNodes.add(new Object[] {node, at.getLineNr(), at.getColumnNr()});
                        if (rowNodes.size() > MAX_ROWS) {
                            problems.add(at.getLineNr(), 0, DataFileException.TOO_LARGE, "more than " + MAX_ROWS
                                    + " lines; split the file", raw(lines, at.getLineNr()));
                            problems.throwIfAny();
                        }
                    }
                    continue;
                }
                JsonNode value = JSON.readTree(parser);
                if (name.equals("format")) {
                    format = value.isString() ? value.asString() : value.toString();
                    formatLine = line;
                } else if (name.equals("formatVersion")) {
                    version = value.isIntegralNumber() ? (Object) value.asInt() : value.toString();
                } else {
                    String key = name.equals("positionUnit") ? "position-unit" : name;
                    if (!HEADER_KEYS.contains(key) || key.equals("position-unit") && !name.equals("positionUnit")) {
                        problems.add(line, 0, "data.header", "unknown key '" + name + "'; known: format, formatVersion, "
                                + "id, title, source, provenance, version, kind, positionUnit, medium, note, lines",
                                raw(lines, line));
                    } else if (!value.isString()) {
                        problems.add(line, 0, "data.header", "'" + name + "' must be a string", raw(lines, line));
                    } else {
                        header.put(key, value.asString());
                        headerLine.put(key, line);
                    }
                }
            }
            if (!FORMAT.equals(format)) {
                problems.add(formatLine, 0, "data.format", "'format' must be \"" + FORMAT + "\"", raw(lines, formatLine));
            }
            if (!Integer.valueOf(VERSION).equals(version)) {
                problems.add(formatLine, 0, "data.format", "'formatVersion' must be " + VERSION
                        + (version == null ? "" : ", got " + version), raw(lines, formatLine));
            }
            if (parser.nextToken() != null) {
                TokenStreamLocation at = parser.currentTokenLocation();
                problems.add(at.getLineNr(), at.getColumnNr(), "data.json-shape", "text after the end of the object",
                        raw(lines, at.getLineNr()));
            }
        } catch (JacksonException e) {
            TokenStreamLocation where = e.getLocation();
            int line = where == null ? 1 : Math.max(where.getLineNr(), 1);
            problems.add(line, where == null ? 0 : Math.max(where.getColumnNr(), 0), "data.json-syntax",
                    "JSON syntax: " + e.getOriginalMessage(), raw(lines, line));
            problems.throwIfAny();
        }
        if (!sawLines) {
            problems.add(1, 0, "data.json-shape", "the object has no 'lines' array", lines[0]);
        }
        Metadata metadata = Metadata.of(header, headerLine, defaultKind, problems, true, lines);
        LineList.Builder builder = metadata.builder();
        Rows rows = new Rows(problems, metadata);
        rows.columns(COLUMNS.toArray(new String[0]), 0, "");
        for (Object[] entry : rowNodes) {
            JsonNode node = (JsonNode) entry[0];
            int line = (Integer) entry[1];
            String raw = raw(lines, line);
            if (!node.isObject()) {
                problems.add(line, (Integer) entry[2], "data.json-shape", "each line must be a JSON object", raw);
                continue;
            }
            Map<String, Object> values = new HashMap<>();
            boolean ok = true;
            for (var property : node.properties()) {
                String key = property.getKey();
                JsonNode value = property.getValue();
                if (!COLUMNS.contains(key)) {
                    problems.add(line, (Integer) entry[2], "data.unknown-field", "unknown field '" + key + "'; known: "
                            + String.join(", ", COLUMNS), raw);
                    ok = false;
                } else if (value.isNull()) {
                    values.put(key, null);
                } else if (value.isNumber()) {
                    // numberValue().doubleValue() gives infinity for an out-of-range integer,
                    // which is then reported; asDouble() would throw.
                    values.put(key, value.numberValue().doubleValue());
                } else if (value.isString() && NUMERIC_COLUMNS.contains(key)) {
                    problems.add(line, (Integer) entry[2], "data.wrong-type", "field '" + key
                            + "' must be a JSON number, got the string \"" + value.asString() + "\"", raw);
                    ok = false;
                } else if (value.isString()) {
                    values.put(key, value.asString().isEmpty() ? null : value.asString());
                } else {
                    problems.add(line, (Integer) entry[2], "data.wrong-type", "field '" + key
                            + "' must be a number, a string or null, got " + value.getNodeType().name().toLowerCase(
                                    Locale.ROOT), raw);
                    ok = false;
                }
            }
            if (ok && !rows.add(values, line, raw, builder)) {
                break;
            }
        }
        problems.throwIfAny();
        return withCoverage(builder.build());
    }

    private static String raw(String[] lines, int line) {
        return line >= 1 && line <= lines.length ? lines[line - 1] : "";
    }

    // ------------------------------------------------------------------ writing

    /**
     * @param list a line list
     * @return the list in the CSV encoding, reading back equal
     */
    public static String writeCsv(LineList list) {
        StringBuilder text = new StringBuilder();
        text.append("# ").append(FORMAT).append(' ').append(VERSION).append('\n');
        for (Map.Entry<String, String> entry : headerOf(list).entrySet()) {
            text.append("# ").append(entry.getKey()).append(": ").append(entry.getValue()).append('\n');
        }
        CsvSchema schema = CsvSchema.emptySchema().withLineSeparator("\n");
        List<String[]> rows = new ArrayList<>();
        rows.add(COLUMNS.toArray(new String[0]));
        for (int i = 0; i < list.size(); i++) {
            rows.add(new String[] {list.species(i).notation(), Double.toString(list.position(i)),
                number(list.uncertainty(i)), number(list.intensity(i)),
                list.strength(i) == null ? "" : list.strength(i).id(), number(list.einsteinA(i)), text(list.lower(i)),
                text(list.upper(i)),
                text(list.rowNote(i))});
        }
        StringWriter out = new StringWriter();
        CSV.writer(schema).writeValues(out).writeAll(rows).close();
        return text.append(out).toString();
    }

    /**
     * @param list a line list
     * @return the list in the JSON encoding, reading back equal
     */
    public static String writeJson(LineList list) {
        ObjectNode root = JSON.createObjectNode();
        root.put("format", FORMAT);
        root.put("formatVersion", VERSION);
        for (Map.Entry<String, String> entry : headerOf(list).entrySet()) {
            root.put(entry.getKey().equals("position-unit") ? "positionUnit" : entry.getKey(), entry.getValue());
        }
        ArrayNode rows = root.putArray("lines");
        for (int i = 0; i < list.size(); i++) {
            ObjectNode row = rows.addObject();
            row.put("species", list.species(i).notation());
            row.put("position", list.position(i));
            if (list.uncertainty(i).isPresent()) {
                row.put("uncertainty", list.uncertainty(i).getAsDouble());
            }
            if (list.intensity(i).isPresent()) {
                row.put("intensity", list.intensity(i).getAsDouble());
            }
            putText(row, "strength", list.strength(i) == null ? null : list.strength(i).id());
            if (list.einsteinA(i).isPresent()) {
                row.put("einstein_a", list.einsteinA(i).getAsDouble());
            }
            putText(row, "lower", list.lower(i));
            putText(row, "upper", list.upper(i));
            putText(row, "note", list.rowNote(i));
        }
        return JSON.writerWithDefaultPrettyPrinter().writeValueAsString(root) + "\n";
    }

    private static void putText(ObjectNode row, String key, String value) {
        if (value != null) {
            row.put(key, value);
        }
    }

    private static Map<String, String> headerOf(LineList list) {
        DataSetInfo info = list.info();
        Map<String, String> header = new LinkedHashMap<>();
        header.put("id", info.id());
        header.put("title", info.title());
        header.put("source", info.provenance().detail());
        header.put("provenance", info.provenance().kind().id());
        header.put("version", info.version());
        header.put("kind", info.kind().id());
        header.put("position-unit", list.unit().symbol());
        if (list.medium() != null) {
            header.put("medium", list.medium().spec());
        }
        if (!list.note().isEmpty()) {
            header.put("note", list.note());
        }
        return header;
    }

    private static String number(java.util.OptionalDouble value) {
        return value.isPresent() ? Double.toString(value.getAsDouble()) : "";
    }

    private static String text(String value) {
        return value == null ? "" : value;
    }

    // ------------------------------------------------------------------ validation

    /** Collects problems of one file. */
    private static class Problems {
        private final String source;
        private final List<DataProblem> list = new ArrayList<>();

        Problems(String source) {
            this.source = source;
        }

        void add(int line, int column, String code, String reason, String raw) {
            list.add(new DataProblem(source, Math.max(line, 1), Math.max(column, 0), code, reason,
                    raw.length() > 200 ? raw.substring(0, 200) + "..." : raw));
        }

        boolean isEmpty() {
            return list.isEmpty();
        }

        void throwIfAny() {
            if (!list.isEmpty()) {
                throw new DataFileException(DataFileException.INVALID, source, list, "");
            }
        }
    }

    /** The validated header of a file. */
    private static final class Metadata {
        DataSetInfo info;
        Unit unit;
        Medium medium;
        String note = "";
        boolean valid = true;

        static Metadata of(Map<String, String> header, Map<String, Integer> lineOf, DataKind defaultKind,
                Problems problems, boolean json, String[] lines) {
            Metadata m = new Metadata();
            Problems rawProblems = new Problems(problems.source) {
                @Override
                void add(int line, int column, String code, String reason, String raw) {
                    problems.add(line, column, code, reason, raw.isEmpty() ? raw(lines, line) : raw);
                }
            };
            return fill(m, header, lineOf, defaultKind, problems, rawProblems, json);
        }

        private static Metadata fill(Metadata m, Map<String, String> header, Map<String, Integer> lineOf,
                DataKind defaultKind, Problems all, Problems problems, boolean json) {
            int before = all.list.size();
            for (String key : REQUIRED_KEYS) {
                String value = header.get(key);
                if (value == null || value.isBlank()) {
                    problems.add(1, 0, "data.header", "required header '" + (json && key.equals("position-unit")
                            ? "positionUnit" : key) + "' is missing or empty", "");
                }
            }
            for (Map.Entry<String, String> entry : header.entrySet()) {
                if (entry.getValue().indexOf('\n') >= 0 || entry.getValue().indexOf('\r') >= 0
                        || entry.getValue().length() > 2000) {
                    problems.add(lineOf.getOrDefault(entry.getKey(), 1), 0, "data.header", "header '" + entry.getKey()
                            + "' must be one line of at most 2000 characters", "");
                }
            }
            String id = header.getOrDefault("id", "");
            if (!id.isBlank() && !DataSetInfo.isValidId(id)) {
                problems.add(lineOf.getOrDefault("id", 1), 0, "data.header", "id '" + id + "' must be lower-case letters,"
                        + " digits, dots and dashes", "");
            }
            Provenance.Kind provenance = Provenance.Kind.PUBLISHED;
            if (header.containsKey("provenance")) {
                try {
                    provenance = Provenance.Kind.fromId(header.get("provenance"));
                } catch (IllegalArgumentException e) {
                    problems.add(lineOf.getOrDefault("provenance", 1), 0, "data.header", e.getMessage(), "");
                }
            }
            DataKind kind = defaultKind;
            if (header.containsKey("kind")) {
                String k = header.get("kind");
                if (k.equals("lines")) {
                    kind = DataKind.LINES;
                } else if (k.equals("lamp-lines")) {
                    kind = DataKind.LAMP_LINES;
                } else {
                    problems.add(lineOf.getOrDefault("kind", 1), 0, "data.header", "kind must be lines or lamp-lines, got '"
                            + k + "'", "");
                }
            }
            String unitText = header.get("position-unit");
            if (unitText != null && !unitText.isBlank()) {
                Unit unit = Unit.fromSymbol(unitText).orElse(null);
                if (unit == null || unit.kind() == Kind.TEMPERATURE) {
                    problems.add(lineOf.getOrDefault("position-unit", 1), 0, "data.unknown-unit", "unknown position unit '"
                            + unitText + "'; known: " + String.join(", ", Unit.knownSymbols().subList(0,
                                    Unit.knownSymbols().size() - 1)), "");
                } else {
                    m.unit = unit;
                }
            }
            String mediumText = header.get("medium");
            if (m.unit == null) {
                m.unit = Unit.NANOMETRE; // unknown unit, already reported; the medium is not judged
            } else if (m.unit.kind() == Kind.WAVELENGTH) {
                if (mediumText == null || mediumText.isBlank()) {
                    problems.add(lineOf.getOrDefault("position-unit", 1), 0, "data.missing-medium",
                            "wavelengths need a 'medium' header: vacuum, air or air(<model>)", "");
                } else {
                    try {
                        m.medium = Medium.parse(mediumText);
                    } catch (RitzwerkException e) {
                        problems.add(lineOf.getOrDefault("medium", 1), 0, "data.unknown-medium", e.getMessage(), "");
                    }
                }
            } else if (mediumText != null) {
                problems.add(lineOf.getOrDefault("medium", 1), 0, "data.medium-not-allowed", "a medium is given for "
                        + m.unit.kind().noun() + " positions (" + m.unit.symbol() + "); only wavelengths have one", "");
            }
            m.note = header.getOrDefault("note", "");
            m.valid = all.list.size() == before;
            if (m.valid) {
                m.info = new DataSetInfo(id, kind, header.get("title"), header.get("version"),
                        new Provenance(provenance, header.get("source")), List.of());
            } else {
                m.info = new DataSetInfo("invalid", kind, "-", "-", Provenance.published("-"), List.of());
            }
            return m;
        }

        LineList.Builder builder() {
            return LineList.builder(info, unit, unit.kind() == Kind.WAVELENGTH && medium == null ? Medium.vacuum()
                    : medium, note);
        }
    }

    /** Validates rows and adds the good ones. */
    private static final class Rows {
        private final Problems problems;
        private final Map<String, Integer> seen = new HashMap<>();
        private final Map<String, Species> speciesCache = new HashMap<>();
        private Map<String, Integer> columnIndex = Map.of();
        private int count;

        Rows(Problems problems, Metadata metadata) {
            this.problems = problems;
        }

        void columns(String[] names, int line, String raw) {
            Map<String, Integer> index = new HashMap<>();
            for (int c = 0; c < names.length; c++) {
                String name = names[c].strip();
                if (!COLUMNS.contains(name)) {
                    problems.add(line, c + 1, "data.unknown-column", "unknown column '" + name + "'; known: "
                            + String.join(", ", COLUMNS), raw);
                } else if (index.put(name, c + 1) != null) {
                    problems.add(line, c + 1, "data.duplicate-column", "column '" + name + "' appears twice", raw);
                }
            }
            for (String required : List.of("species", "position")) {
                if (!index.containsKey(required)) {
                    problems.add(line, 0, "data.missing-column", "required column '" + required + "' is missing", raw);
                }
            }
            columnIndex = index;
        }

        /** @return false when the row limit is reached and reading should stop */
        boolean add(Map<String, Object> values, int line, String raw, LineList.Builder builder) {
            if (++count > MAX_ROWS) {
                problems.add(line, 0, DataFileException.TOO_LARGE, "more than " + MAX_ROWS + " rows; split the file", raw);
                return false;
            }
            int before = problems.list.size();
            Species species = species(values.get("species"), line, raw);
            double position = number("position", values.get("position"), true, line, raw);
            double uncertainty = number("uncertainty", values.get("uncertainty"), false, line, raw);
            double intensity = number("intensity", values.get("intensity"), false, line, raw);
            double einsteinA = number("einstein_a", values.get("einstein_a"), false, line, raw);
            StrengthClass strength = null;
            Object strengthText = values.get("strength");
            if (strengthText != null) {
                if (!(strengthText instanceof String)) {
                    problem("strength", line, raw, "data.wrong-type", "strength must be text: strong, medium or weak");
                } else {
                    try {
                        strength = StrengthClass.fromId((String) strengthText);
                    } catch (IllegalArgumentException e) {
                        problem("strength", line, raw, "data.unknown-strength", e.getMessage());
                    }
                }
            }
            String lower = text("lower", values.get("lower"), line, raw);
            String upper = text("upper", values.get("upper"), line, raw);
            String note = text("note", values.get("note"), line, raw);
            if (problems.list.size() != before || species == null) {
                return true;
            }
            if (position == 0) {
                problem("position", line, raw, "data.not-positive", "position must be positive, got 0");
                return true;
            }
            String key = species.notation() + "|" + position + "|" + lower + "|" + upper;
            Integer first = seen.putIfAbsent(key, line);
            if (first != null) {
                problem("position", line, raw, "data.duplicate", "duplicate of the line on line " + first
                        + " (same species, position and levels)");
                return true;
            }
            builder.add(species, position, uncertainty, intensity, strength, einsteinA, lower, upper, note);
            return true;
        }

        private Species species(Object value, int line, String raw) {
            if (value == null) {
                problem("species", line, raw, "data.missing-value", "species is required");
                return null;
            }
            if (!(value instanceof String)) {
                problem("species", line, raw, "data.wrong-type", "species must be text such as 'Ne I'");
                return null;
            }
            String text = (String) value;
            Species cached = speciesCache.get(text);
            if (cached != null) {
                return cached;
            }
            try {
                Species species = Species.parse(text);
                speciesCache.put(text, species);
                return species;
            } catch (RitzwerkException e) {
                problem("species", line, raw, "data.unknown-species", e.getMessage());
                return null;
            }
        }

        /** @return the value, NaN when absent and optional (or when a problem was recorded) */
        private double number(String column, Object value, boolean required, int line, String raw) {
            if (value == null) {
                if (required) {
                    problem(column, line, raw, "data.missing-value", column + " is required");
                }
                return Double.NaN;
            }
            double number;
            if (value instanceof Double) {
                number = (Double) value;
            } else {
                String text = ((String) value).strip();
                if (!DECIMAL.matcher(text).matches()) {
                    problem(column, line, raw, "data.not-a-number", column + " is not a number: '" + value + "'");
                    return Double.NaN;
                }
                number = Double.parseDouble(text);
            }
            if (!Double.isFinite(number)) {
                problem(column, line, raw, "data.not-finite", column + " is too large for a double: '" + value + "'");
                return Double.NaN;
            }
            if (number < 0) {
                problem(column, line, raw, "data.negative", column + " must not be negative, got " + value);
                return Double.NaN;
            }
            return number;
        }

        private String text(String column, Object value, int line, String raw) {
            if (value == null) {
                return null;
            }
            if (!(value instanceof String)) {
                problem(column, line, raw, "data.wrong-type", column + " must be text");
                return null;
            }
            String text = (String) value;
            if (text.length() > MAX_TEXT || text.indexOf('\n') >= 0 || text.indexOf('\r') >= 0) {
                problem(column, line, raw, "data.bad-text", column + " must be one line of at most " + MAX_TEXT
                        + " characters");
                return null;
            }
            return text;
        }

        private void problem(String column, int line, String raw, String code, String reason) {
            problems.add(line, columnIndex.getOrDefault(column, 0), code, "column " + column + ": " + reason, raw);
        }
    }
}
