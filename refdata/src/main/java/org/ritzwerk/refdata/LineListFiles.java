package org.ritzwerk.refdata;

import java.io.InputStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.engine.synth.LineColumns;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;
import tools.jackson.databind.node.ObjectNode;

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
    public static final long MAX_BYTES = TabularFiles.MAX_BYTES;
    /** The most rows read. */
    public static final int MAX_ROWS = TabularFiles.MAX_ROWS;
    /** Columns in the order they are written. */
    public static final List<String> COLUMNS = List.of("species", "position", "uncertainty", "intensity", "strength",
            "einstein_a", "lower", "upper", "note");

    private static final TabularFiles.Spec SPEC = new TabularFiles.Spec(FORMAT, VERSION, "position-unit",
            List.of("id", "title", "source", "provenance", "version", "kind", "position-unit", "medium", "note"),
            List.of("id", "title", "source", "provenance", "version", "position-unit"), COLUMNS,
            List.of("species", "position"), List.of("position", "uncertainty", "intensity", "einstein_a"), "lines");
    private static final Set<Kind> POSITION_KINDS = EnumSet.of(Kind.WAVELENGTH, Kind.WAVENUMBER, Kind.FREQUENCY,
            Kind.ENERGY);

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
        String text = TabularFiles.read(file);
        return TabularFiles.isJson(name, text) ? readJson(text, name, defaultKind) : readCsv(text, name, defaultKind);
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
        String text = TabularFiles.decode(in, source);
        return TabularFiles.isJson(source, text) ? readJson(text, source, defaultKind)
                : readCsv(text, source, defaultKind);
    }

    /**
     * @param text        the whole file
     * @param source      file name for messages
     * @param defaultKind the kind when the file names none
     * @return the list
     * @throws DataFileException with every problem found
     */
    public static LineList readCsv(String text, String source, DataKind defaultKind) {
        return build(TabularFiles.parseCsv(SPEC, text, source), defaultKind);
    }

    /**
     * @param text        the whole file
     * @param source      file name for messages
     * @param defaultKind the kind when the file names none
     * @return the list
     * @throws DataFileException with every problem found
     */
    public static LineList readJson(String text, String source, DataKind defaultKind) {
        return build(TabularFiles.parseJson(SPEC, text, source), defaultKind);
    }

    private static LineList build(TabularFiles.Parsed p, DataKind defaultKind) {
        boolean sound = p.checkHeader();
        int before = p.problems.size();
        Provenance.Kind provenance = p.provenance();
        DataKind kind = defaultKind;
        String kindText = p.header.get("kind");
        if (kindText != null) {
            if (kindText.equals("lines")) {
                kind = DataKind.LINES;
            } else if (kindText.equals("lamp-lines")) {
                kind = DataKind.LAMP_LINES;
            } else {
                p.headerProblem("kind", "data.header", "kind must be lines or lamp-lines, got '" + kindText + "'");
            }
        }
        Unit unit = p.unit(POSITION_KINDS);
        Medium medium = p.medium(unit);
        sound &= p.problems.size() == before;
        Unit rowUnit = unit == null ? Unit.NANOMETRE : unit;
        LineList.Builder builder = LineList.builder(TabularFiles.info(p, kind, provenance, sound), rowUnit,
                rowUnit.kind() == Kind.WAVELENGTH ? (medium == null ? Medium.vacuum() : medium) : null,
                p.header.getOrDefault("note", ""));
        Map<String, Species> speciesCache = new HashMap<>();
        Map<String, Integer> seen = new HashMap<>();
        for (TabularFiles.Row row : p.rows) {
            int rowBefore = p.problems.size();
            Species species = p.species(row, speciesCache);
            double position = p.number(row, "position", true);
            double uncertainty = p.number(row, "uncertainty", false);
            double intensity = p.number(row, "intensity", false);
            double einsteinA = p.number(row, "einstein_a", false);
            StrengthClass strength = null;
            String strengthText = p.text(row, "strength");
            if (strengthText != null) {
                try {
                    strength = StrengthClass.fromId(strengthText);
                } catch (IllegalArgumentException e) {
                    p.rowProblem(row, "strength", "data.unknown-strength", e.getMessage());
                }
            }
            String lower = p.text(row, "lower");
            String upper = p.text(row, "upper");
            String note = p.text(row, "note");
            if (p.problems.size() != rowBefore) {
                continue;
            }
            if (position == 0) {
                p.rowProblem(row, "position", "data.not-positive", "position must be positive, got 0");
                continue;
            }
            if (outsideMedium(p, row, position, rowUnit, medium)) {
                continue;
            }
            Integer first = seen.putIfAbsent(species.notation() + "|" + position + "|" + lower + "|" + upper, row.line());
            if (first != null) {
                p.rowProblem(row, "position", "data.duplicate", "duplicate of the line on line " + first
                        + " (same species, position and levels)");
                continue;
            }
            builder.add(species, position, uncertainty, intensity, strength, einsteinA, lower, upper, note);
        }
        p.throwIfAny();
        LineList list = builder.build();
        DataSetInfo info = list.info();
        return list.withInfo(new DataSetInfo(info.id(), info.kind(), info.title(), info.version(), info.provenance(),
                list.coveredSpecies()));
    }

    /**
     * A wavelength in air that the air model cannot convert (in the far ultraviolet, or a list in
     * the wrong unit: Å for nm) is a problem of its row; every command would otherwise refuse the
     * line later without naming the file or the line.
     *
     * @return whether the row had that problem
     */
    private static boolean outsideMedium(TabularFiles.Parsed p, TabularFiles.Row row, double position, Unit unit,
            Medium medium) {
        if (unit.kind() != Kind.WAVELENGTH || medium == null || medium.equals(Medium.vacuum())) {
            return false;
        }
        try {
            medium.toVacuum(unit.toSi(position));
            return false;
        } catch (org.ritzwerk.medium.MediumException e) {
            p.rowProblem(row, "position", "data.outside-medium", position + " " + unit.symbol() + " " + medium.label()
                    + " cannot be converted: " + e.getMessage() + " (is the position-unit right?)");
            return true;
        }
    }

    /** The most lines {@link #readColumns} reads (the columns are Java arrays). */
    public static final int MAX_COLUMN_ROWS = 100_000_000;

    /**
     * Reads a line list into primitive columns for rendering ({@link LineColumns},
     * {@link org.ritzwerk.engine.synth.Scene.Builder#lineColumns}): species, position and
     * intensity, 18 bytes a line and no object a line, for lists of millions of lines. A CSV file is
     * read as it streams from the disk, with no limit of {@link #MAX_BYTES} or {@link #MAX_ROWS}
     * (up to {@link #MAX_COLUMN_ROWS} rows); a JSON file is read as {@link #read(Path, DataKind)}
     * reads it. The file is checked as {@link #read(Path, DataKind)} checks it, every row and
     * header value the same way, and a file either reads both ways or is refused both ways;
     * problems of a streamed file carry no excerpt of their line (file, line and column as
     * always). Duplicates (same species, position and levels) are found after reading, by sorting
     * the positions; the levels are compared by a 64-bit hash of their text, so two lines with the
     * same species and position but different levels could be taken for duplicates only if their
     * hashes collide (about one chance in 2^64 for each such pair).
     *
     * @param file        a {@code .csv} or {@code .json} file
     * @param defaultKind the kind when the file names none ({@link DataKind#LINES} or
     *                    {@link DataKind#LAMP_LINES})
     * @return the lines, in file order
     * @throws DataFileException with every problem found
     */
    public static LineColumns readColumns(Path file, DataKind defaultKind) {
        String name = file.toString();
        String lower = name.toLowerCase(java.util.Locale.ROOT);
        if (lower.endsWith(".json") || !lower.endsWith(".csv") && startsLikeJson(file)) {
            return columnsOf(read(file, defaultKind));
        }
        ColumnSink sink = new ColumnSink();
        TabularFiles.Parsed p = TabularFiles.parseCsvStreaming(SPEC, file, sink, MAX_COLUMN_ROWS);
        sink.start(p, defaultKind);
        LineColumns columns = sink.builder.build();
        sink.refuseDuplicates(p, columns);
        p.throwIfAny();
        return columns;
    }

    private static boolean startsLikeJson(Path file) {
        TabularFiles.refuseFolder(file);
        try (java.io.Reader in = java.nio.file.Files.newBufferedReader(file, java.nio.charset.StandardCharsets.UTF_8)) {
            int c;
            do {
                c = in.read();
            } while (c >= 0 && (Character.isWhitespace(c) || c == '\uFEFF'));
            return c == '{';
        } catch (java.io.IOException e) {
            return false; // the CSV reader reports it
        }
    }

    /**
     * @param list a line list
     * @return its species, positions and intensities as columns
     */
    public static LineColumns columnsOf(LineList list) {
        LineColumns.Builder builder = LineColumns.builder(list.info().id(), list.unit(), list.medium());
        for (int i = 0; i < list.size(); i++) {
            builder.add(list.species(i), list.position(i), list.intensity(i).orElse(Double.NaN));
        }
        return builder.build();
    }

    /** Turns each row into columns as it is read, checking it as {@link #build} does. */
    private static final class ColumnSink implements TabularFiles.RowSink {
        private LineColumns.Builder builder;
        private boolean started;
        private final Map<String, Species> speciesCache = new HashMap<>();
        /** The file line of each line kept, for the duplicate check. */
        private int[] fileLine = new int[1024];
        /** A hash of each kept line's levels (lower and upper); null while no line names one. */
        private long[] levels;

        /** The rows' unit and medium, from the header. */
        private Unit rowUnit;
        private Medium rowMedium;

        void start(TabularFiles.Parsed p, DataKind defaultKind) {
            if (started) {
                return;
            }
            started = true;
            p.checkHeader();
            p.provenance();
            String kindText = p.header.get("kind");
            if (kindText != null && !kindText.equals("lines") && !kindText.equals("lamp-lines")) {
                p.headerProblem("kind", "data.header", "kind must be lines or lamp-lines, got '" + kindText + "'");
            }
            Unit unit = p.unit(POSITION_KINDS);
            Medium medium = p.medium(unit);
            rowUnit = unit == null ? Unit.NANOMETRE : unit;
            rowMedium = rowUnit.kind() == Kind.WAVELENGTH ? (medium == null ? Medium.vacuum() : medium) : null;
            String id = p.header.getOrDefault("id", "");
            builder = LineColumns.builder(id, rowUnit, rowMedium);
        }

        @Override
        public void accept(TabularFiles.Parsed p, TabularFiles.Row row) {
            start(p, DataKind.LINES);
            int rowBefore = p.problems.size();
            Species species = p.species(row, speciesCache);
            double position = p.number(row, "position", true);
            p.number(row, "uncertainty", false);
            double intensity = p.number(row, "intensity", false);
            p.number(row, "einstein_a", false);
            String strengthText = p.text(row, "strength");
            if (strengthText != null) {
                try {
                    StrengthClass.fromId(strengthText);
                } catch (IllegalArgumentException e) {
                    p.rowProblem(row, "strength", "data.unknown-strength", e.getMessage());
                }
            }
            String lower = p.text(row, "lower");
            String upper = p.text(row, "upper");
            p.text(row, "note");
            if (p.problems.size() != rowBefore) {
                return;
            }
            if (position == 0) {
                p.rowProblem(row, "position", "data.not-positive", "position must be positive, got 0");
                return;
            }
            if (outsideMedium(p, row, position, rowUnit, rowMedium)) {
                return;
            }
            int k = builder.size();
            if (k == fileLine.length) {
                fileLine = java.util.Arrays.copyOf(fileLine, k + (k >> 1));
                if (levels != null) {
                    levels = java.util.Arrays.copyOf(levels, fileLine.length);
                }
            }
            if ((lower != null || upper != null) && levels == null) {
                levels = new long[fileLine.length];
            }
            if (levels != null) {
                levels[k] = levelsHash(lower, upper);
            }
            fileLine[k] = row.line();
            builder.add(species, position, intensity);
        }

        /** 64-bit FNV-1a over the two texts, with a separator that neither can hold as given. */
        private static long levelsHash(String lower, String upper) {
            long h = 0xcbf29ce484222325L;
            for (String text : new String[] {lower, upper}) {
                if (text == null) {
                    h = (h ^ 0x1FFFF) * 0x100000001b3L;
                } else {
                    for (int i = 0; i < text.length(); i++) {
                        h = (h ^ text.charAt(i)) * 0x100000001b3L;
                    }
                }
                h = (h ^ 0x2FFFF) * 0x100000001b3L;
            }
            return h;
        }

        /**
         * Reports each line that repeats an earlier one (species, position and levels), as
         * {@link #build} does: positions sorted to find the equal ones, then only those compared.
         */
        void refuseDuplicates(TabularFiles.Parsed p, LineColumns columns) {
            int n = columns.size();
            long[] sorted = new long[n];
            for (int i = 0; i < n; i++) {
                sorted[i] = Double.doubleToLongBits(columns.position(i)); // positive: bits sort as values
            }
            java.util.Arrays.sort(sorted);
            java.util.Set<Long> repeated = new java.util.HashSet<>();
            for (int i = 1; i < n; i++) {
                if (sorted[i] == sorted[i - 1]) {
                    repeated.add(sorted[i]);
                }
            }
            if (repeated.isEmpty()) {
                return;
            }
            Map<String, Integer> seen = new HashMap<>();
            for (int i = 0; i < n; i++) {
                long bits = Double.doubleToLongBits(columns.position(i));
                if (!repeated.contains(bits)) {
                    continue;
                }
                String key = columns.species(i).notation() + "|" + bits + "|" + (levels == null ? 0 : levels[i]);
                Integer first = seen.putIfAbsent(key, fileLine[i]);
                if (first != null) {
                    p.problem(fileLine[i], p.columnIndex.getOrDefault("position", 0), "data.duplicate",
                            "column position: duplicate of the line on line " + first
                                    + " (same species, position and levels)", "");
                }
            }
        }
    }

    /**
     * @param list a line list
     * @return the list in the CSV encoding, reading back equal
     */
    public static String writeCsv(LineList list) {
        List<String[]> rows = new ArrayList<>();
        for (int i = 0; i < list.size(); i++) {
            rows.add(new String[] {list.species(i).notation(), Double.toString(list.position(i)),
                TabularFiles.csv(list.uncertainty(i)), TabularFiles.csv(list.intensity(i)),
                list.strength(i) == null ? "" : list.strength(i).id(), TabularFiles.csv(list.einsteinA(i)),
                TabularFiles.csv(list.lower(i)), TabularFiles.csv(list.upper(i)), TabularFiles.csv(list.rowNote(i))});
        }
        return TabularFiles.writeCsv(SPEC, headerOf(list), rows);
    }

    /**
     * @param list a line list
     * @return the list in the JSON encoding, reading back equal
     */
    public static String writeJson(LineList list) {
        List<ObjectNode> rows = new ArrayList<>();
        for (int i = 0; i < list.size(); i++) {
            ObjectNode row = TabularFiles.newRow();
            row.put("species", list.species(i).notation());
            row.put("position", list.position(i));
            TabularFiles.put(row, "uncertainty", list.uncertainty(i));
            TabularFiles.put(row, "intensity", list.intensity(i));
            TabularFiles.put(row, "strength", list.strength(i) == null ? null : list.strength(i).id());
            TabularFiles.put(row, "einstein_a", list.einsteinA(i));
            TabularFiles.put(row, "lower", list.lower(i));
            TabularFiles.put(row, "upper", list.upper(i));
            TabularFiles.put(row, "note", list.rowNote(i));
            rows.add(row);
        }
        return TabularFiles.writeJson(SPEC, headerOf(list), rows);
    }

    private static Map<String, String> headerOf(LineList list) {
        Map<String, String> header = TabularFiles.header(list.info(), true);
        header.put("position-unit", list.unit().symbol());
        if (list.medium() != null) {
            header.put("medium", list.medium().spec());
        }
        if (!list.note().isEmpty()) {
            header.put("note", list.note());
        }
        return header;
    }
}
