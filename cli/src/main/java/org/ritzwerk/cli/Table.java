package org.ritzwerk.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Function;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;
import tools.jackson.dataformat.csv.CsvMapper;
import tools.jackson.dataformat.csv.CsvSchema;

/**
 * Rows of results written as an aligned table for people, CSV with a header row, or JSON (one
 * object per line), with the same field names in CSV and JSON. Values are strings, integers,
 * doubles or null; a non-finite double is written as null (JSON), empty (CSV) or "-" (table).
 */
final class Table {

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
            return new Column(key, heading, value -> String.format(Locale.ROOT, pattern, value));
        }
    }

    private final List<Column> columns;
    private final List<Object[]> rows = new ArrayList<>();

    Table(List<Column> columns) {
        this.columns = List.copyOf(columns);
    }

    void add(Object... values) {
        if (values.length != columns.size()) {
            throw new IllegalStateException("row has " + values.length + " values for " + columns.size() + " columns");
        }
        rows.add(values);
    }

    int size() {
        return rows.size();
    }

    void write(PrintWriter out, Format format) {
        switch (format) {
            case json:
                writeJson(out);
                break;
            case csv:
                writeCsv(out);
                break;
            default:
                writeText(out);
                break;
        }
        out.flush();
    }

    private void writeJson(PrintWriter out) {
        JsonMapper json = JsonMapper.builder().build();
        for (Object[] row : rows) {
            ObjectNode node = json.createObjectNode();
            for (int c = 0; c < columns.size(); c++) {
                String key = columns.get(c).key();
                Object value = row[c];
                if (value == null || value instanceof Double && !Double.isFinite((Double) value)) {
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
    }

    private void writeCsv(PrintWriter out) {
        CsvSchema.Builder schema = CsvSchema.builder().setUseHeader(true);
        for (Column column : columns) {
            schema.addColumn(column.key());
        }
        List<Map<String, Object>> records = new ArrayList<>();
        for (Object[] row : rows) {
            Map<String, Object> record = new LinkedHashMap<>();
            for (int c = 0; c < columns.size(); c++) {
                Object value = row[c];
                record.put(columns.get(c).key(),
                        value instanceof Double && !Double.isFinite((Double) value) ? null : value);
            }
            records.add(record);
        }
        out.print(new CsvMapper().writer(schema.build()).writeValueAsString(records));
    }

    private void writeText(PrintWriter out) {
        int[] widths = new int[columns.size()];
        List<String[]> cells = new ArrayList<>();
        for (int c = 0; c < columns.size(); c++) {
            widths[c] = columns.get(c).heading().length();
        }
        for (Object[] row : rows) {
            String[] line = new String[columns.size()];
            for (int c = 0; c < columns.size(); c++) {
                Object value = row[c];
                line[c] = value == null || value instanceof Double && !Double.isFinite((Double) value) ? "-"
                        : columns.get(c).display().apply(value);
                widths[c] = Math.max(widths[c], line[c].length());
            }
            cells.add(line);
        }
        StringBuilder heading = new StringBuilder();
        for (int c = 0; c < columns.size(); c++) {
            heading.append(pad(columns.get(c).heading(), widths[c], c));
        }
        out.println(heading.toString().stripTrailing());
        for (String[] line : cells) {
            StringBuilder text = new StringBuilder();
            for (int c = 0; c < columns.size(); c++) {
                text.append(pad(line[c], widths[c], c));
            }
            out.println(text.toString().stripTrailing());
        }
    }

    private static String pad(String text, int width, int column) {
        String separator = column == 0 ? "" : "  ";
        return separator + text + " ".repeat(width - text.length());
    }
}
