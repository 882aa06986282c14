package org.ritzwerk.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.function.Function;
import tools.jackson.databind.SequenceWriter;
import tools.jackson.databind.SerializationFeature;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;
import tools.jackson.dataformat.csv.CsvMapper;
import tools.jackson.dataformat.csv.CsvSchema;

/**
 * Rows of results written as an aligned table for people, CSV with a header row, or JSON (one
 * object per line), with the same field names in CSV and JSON. Values are strings, integers,
 * doubles or null; a non-finite double is written as null (JSON), empty (CSV) or "-" (table).
 *
 * <p>Rows are streamed: CSV and JSON rows are written as they are added and nothing is kept. The
 * aligned table holds back its first {@value #SIZING_ROWS} rows (as text) to size the columns from
 * the headings and those rows, then writes them and every later row at once; a later value wider
 * than its column widens that column from its row on. So the memory a table needs does not grow
 * with the number of rows. {@link #finish()} writes what is held back and flushes; call it once,
 * after the last row. Not thread-safe.
 */
final class Table {

    /** Rows the aligned table holds back to size its columns. */
    static final int SIZING_ROWS = 1000;

    /** Output formats shared by the commands. */
    enum Format { text, csv, json }

    /**
     * A column: its stable field name, its heading in the table, and how the table shows a value.
     *
     * @param key     field name in CSV and JSON
     * @param heading heading in the aligned table
     * @param display table text of a non-null value
     */
    record Column(String key, String heading, Function<Object, String> display) {

        static Column text(String key, String heading) {
            return new Column(key, heading, String::valueOf);
        }

        static Column number(String key, String heading, String pattern) {
            return new Column(key, heading, value -> unsignedZero(String.format(Locale.ROOT, pattern, value)));
        }
    }

    /**
     * A formatted number without the sign of a rounded zero: "-0.000000" (a tiny negative value, or
     * -0.0, rounded away) reads "0.000000"; anything with a non-zero digit is kept as it is.
     *
     * @param text a number as {@link String#format} wrote it
     * @return the text
     */
    static String unsignedZero(String text) {
        return text.startsWith("-") && text.chars().noneMatch(c -> c >= '1' && c <= '9') ? text.substring(1) : text;
    }

    private final List<Column> columns;
    private final PrintWriter out;
    private final Format format;
    private final int[] widths;
    /** Text rows held back until the columns are sized; null once they are written. */
    private List<String[]> heldBack = new ArrayList<>();
    private JsonMapper json;
    private SequenceWriter csv;
    private long size;
    private boolean finished;

    /**
     * @param columns the columns
     * @param out     where the rows go
     * @param format  how they are written
     */
    Table(List<Column> columns, PrintWriter out, Format format) {
        this.columns = List.copyOf(columns);
        this.out = out;
        this.format = format;
        this.widths = new int[this.columns.size()];
        for (int c = 0; c < widths.length; c++) {
            widths[c] = this.columns.get(c).heading().length();
        }
        if (format == Format.json) {
            json = JsonMapper.builder().build();
        } else if (format == Format.csv) {
            CsvSchema.Builder schema = CsvSchema.builder().setUseHeader(true);
            for (Column column : this.columns) {
                schema.addColumn(column.key());
            }
            // One flush at the end, not one a row.
            csv = new CsvMapper().writer(schema.build()).without(SerializationFeature.FLUSH_AFTER_WRITE_VALUE)
                    .writeValues(out);
        }
    }

    /**
     * Writes one row (the aligned table may hold it back until its columns are sized).
     *
     * @param values one value per column
     */
    void add(Object... values) {
        if (values.length != columns.size()) {
            throw new IllegalStateException("row has " + values.length + " values for " + columns.size() + " columns");
        }
        if (finished) {
            throw new IllegalStateException("the table is finished");
        }
        size++;
        switch (format) {
            case json:
                writeJson(values);
                break;
            case csv:
                Object[] row = values.clone();
                for (int c = 0; c < row.length; c++) {
                    row[c] = finite(row[c]) ? row[c] : null;
                }
                csv.write(row);
                break;
            default:
                writeText(values);
                break;
        }
    }

    /** @return the number of rows added */
    long size() {
        return size;
    }

    /** Writes what is held back (the header of an empty CSV or table too) and flushes. */
    void finish() {
        if (finished) {
            return;
        }
        finished = true;
        if (format == Format.csv) {
            if (size == 0) {
                // The CSV writer writes its header with the first row; an empty table still gets one.
                out.println(String.join(",", columns.stream().map(Column::key).toList()));
            }
            csv.flush();
        } else if (format == Format.text) {
            release();
        }
        out.flush();
    }

    private static boolean finite(Object value) {
        return !(value instanceof Double && !Double.isFinite((Double) value));
    }

    private void writeJson(Object[] row) {
        ObjectNode node = json.createObjectNode();
        for (int c = 0; c < columns.size(); c++) {
            String key = columns.get(c).key();
            Object value = row[c];
            if (value == null || !finite(value)) {
                node.putNull(key);
            } else if (value instanceof Double) {
                node.put(key, (Double) value);
            } else if (value instanceof Integer) {
                node.put(key, (Integer) value);
            } else {
                node.put(key, String.valueOf(value));
            }
        }
        out.println(json.writeValueAsString(node));
    }

    private void writeText(Object[] row) {
        String[] cells = new String[columns.size()];
        for (int c = 0; c < cells.length; c++) {
            Object value = row[c];
            cells[c] = value == null || !finite(value) ? "-" : columns.get(c).display().apply(value);
        }
        if (heldBack != null) {
            for (int c = 0; c < cells.length; c++) {
                widths[c] = Math.max(widths[c], cells[c].length());
            }
            heldBack.add(cells);
            if (heldBack.size() >= SIZING_ROWS) {
                release();
            }
            return;
        }
        printRow(cells);
    }

    /** Writes the heading and the held-back rows, once the columns are sized. */
    private void release() {
        if (heldBack == null) {
            return;
        }
        String[] heading = new String[columns.size()];
        for (int c = 0; c < heading.length; c++) {
            heading[c] = columns.get(c).heading();
        }
        printRow(heading);
        for (String[] cells : heldBack) {
            printRow(cells);
        }
        heldBack = null;
    }

    private void printRow(String[] cells) {
        StringBuilder text = new StringBuilder();
        for (int c = 0; c < cells.length; c++) {
            widths[c] = Math.max(widths[c], cells[c].length());
            text.append(c == 0 ? "" : "  ").append(cells[c]);
            text.append(" ".repeat(widths[c] - cells[c].length()));
        }
        out.println(text.toString().stripTrailing());
    }

    @Override
    public String toString() {
        return "Table" + Arrays.toString(columns.stream().map(Column::key).toArray()) + ", " + size + " rows";
    }
}
