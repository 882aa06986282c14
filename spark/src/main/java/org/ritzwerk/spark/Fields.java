package org.ritzwerk.spark;

import java.io.Serializable;
import java.util.List;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.catalyst.InternalRow;
import org.apache.spark.sql.catalyst.util.ArrayData;
import org.apache.spark.sql.types.DataType;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;
import org.apache.spark.unsafe.types.UTF8String;

/**
 * Where an input table keeps the columns an operation reads, checked against the documented
 * schema once on the driver, and the checked reading of one row's fields inside the tasks. Every
 * refusal names the row's id and the field. Rows are read either as generic {@link Row}s or, on
 * the operations' fast path, in Spark's own form ({@link InternalRow}: arrays of doubles copied
 * out in one piece, no boxing), with the same checks and messages.
 */
final class Fields implements Serializable {
    private static final long serialVersionUID = 1L;

    /** Column index per field of the documented schema; -1 for an absent optional column. */
    private final int[] index;
    private final String[] names;
    /** The table's own name of each field's column (its case may differ); null when absent. */
    private final String[] columns;

    private Fields(int[] index, String[] names, String[] columns) {
        this.index = index;
        this.names = names;
        this.columns = columns;
    }

    /**
     * Finds the documented columns as Spark resolves names by default, regardless of case
     * ({@code Sigmas} is {@code sigmas}), so that an optional column is never passed over for
     * its case.
     *
     * @param actual   the table's schema
     * @param expected the documented schema
     * @param table    the table's role, for messages
     * @return the columns' places
     * @throws SparkRowException when a required column is missing, two columns have a field's name
     *         apart from case, or a column has another type
     */
    static Fields of(StructType actual, StructType expected, String table) {
        StructField[] fields = expected.fields();
        int[] index = new int[fields.length];
        String[] names = new String[fields.length];
        String[] columns = new String[fields.length];
        List<String> present = List.of(actual.fieldNames());
        for (int k = 0; k < fields.length; k++) {
            names[k] = fields[k].name();
            int at = -1;
            for (int c = 0; c < present.size(); c++) {
                if (present.get(c).equalsIgnoreCase(names[k])) {
                    if (at >= 0) {
                        throw new SparkRowException(SparkRowException.BAD_SCHEMA, null, names[k], "the " + table
                                + " table has two columns of this name apart from case ('" + present.get(at) + "', '"
                                + present.get(c) + "'); Spark reads names regardless of case, so keep one");
                    }
                    at = c;
                }
            }
            if (at < 0) {
                if (!fields[k].nullable()) {
                    throw new SparkRowException(SparkRowException.BAD_SCHEMA, null, fields[k].name(), "the " + table
                            + " table has no such column (its columns: " + String.join(", ", present) + ")");
                }
                index[k] = -1;
                continue;
            }
            DataType type = actual.fields()[at].dataType();
            if (!sameType(type, fields[k].dataType())) {
                String wanted = fields[k].dataType().simpleString();
                boolean numeric = wanted.contains("double") && type.simpleString().matches(
                        "(array<)?(tinyint|smallint|int|bigint|float|decimal.*)>?")
                        || wanted.matches("int|bigint") && type.simpleString().matches("tinyint|smallint|int|bigint");
                throw new SparkRowException(SparkRowException.BAD_SCHEMA, null, fields[k].name(), "the " + table
                        + " table has it as " + type.simpleString() + ", not " + wanted + (numeric ? " (JSON and CSV"
                        + " readers choose their own number types: cast it, col(\"" + present.get(at) + "\").cast(\""
                        + wanted + "\"))" : ""));
            }
            index[k] = at;
            columns[k] = present.get(at);
        }
        return new Fields(index, names, columns);
    }

    /** Types compare without their nullability: a nullable array is checked row by row. */
    private static boolean sameType(DataType a, DataType b) {
        return a.simpleString().equals(b.simpleString());
    }

    /** @return the field's name */
    String name(int field) {
        return names[field];
    }

    /** @return the table's own name of the field's column (its case may differ), or null when it is absent */
    String column(int field) {
        return columns[field];
    }

    /** @return the row's id (field 0, a required string) */
    String id(Row row) {
        Object id = row.get(index[0]);
        if (id == null) {
            throw new SparkRowException(SparkRowException.BAD_FIELD, null, names[0], "a row's id is null");
        }
        return (String) id;
    }

    private boolean isNull(Row row, int field) {
        return index[field] < 0 || row.isNullAt(index[field]);
    }

    private SparkRowException bad(String id, int field, String message) {
        return new SparkRowException(SparkRowException.BAD_FIELD, id, names[field], message);
    }

    /** @return the string, checked not null and not blank */
    String string(Row row, String id, int field) {
        if (isNull(row, field)) {
            throw bad(id, field, "is null");
        }
        String value = row.getString(index[field]);
        if (value.isBlank()) {
            throw bad(id, field, "is blank");
        }
        return value;
    }

    /** @return the double, checked not null and finite */
    double number(Row row, String id, int field) {
        if (isNull(row, field)) {
            throw bad(id, field, "is null");
        }
        return finite(id, field, row.getDouble(index[field]));
    }

    /** @return the double, or NaN when the column is absent or null; a present value checked finite */
    double optionalNumber(Row row, String id, int field) {
        return isNull(row, field) ? Double.NaN : number(row, id, field);
    }

    /** @return the long, checked not null */
    long whole(Row row, String id, int field) {
        if (isNull(row, field)) {
            throw bad(id, field, "is null");
        }
        return row.getLong(index[field]);
    }

    /** @return the strings, checked not null, not empty and without null or blank elements */
    String[] strings(Row row, String id, int field) {
        if (isNull(row, field)) {
            throw bad(id, field, "is null");
        }
        List<String> list = row.getList(index[field]);
        if (list.isEmpty()) {
            throw bad(id, field, "is empty");
        }
        String[] values = new String[list.size()];
        for (int i = 0; i < values.length; i++) {
            String value = list.get(i);
            if (value == null || value.isBlank()) {
                throw bad(id, field, "element " + i + " is " + (value == null ? "null" : "blank"));
            }
            values[i] = value;
        }
        return values;
    }

    /**
     * @param length the length the array must have, or -1 for any non-zero length
     * @param floor  the lowest allowed element (elements must be finite and at least this)
     * @param above  whether the floor itself is excluded
     * @return the doubles, or null when the column is absent or null
     */
    double[] optionalDoubles(Row row, String id, int field, int length, double floor, boolean above) {
        if (isNull(row, field)) {
            return null;
        }
        List<Object> list = row.getList(index[field]);
        checkLength(id, field, list.size(), length);
        double[] values = new double[list.size()];
        for (int i = 0; i < values.length; i++) {
            Object element = list.get(i);
            if (element == null) {
                throw bad(id, field, "element " + i + " is null");
            }
            values[i] = element(id, field, i, (Double) element, floor, above);
        }
        return values;
    }

    /** @return the doubles, as {@link #optionalDoubles} but required */
    double[] doubles(Row row, String id, int field, int length, double floor, boolean above) {
        double[] values = optionalDoubles(row, id, field, length, floor, above);
        if (values == null) {
            throw bad(id, field, "is null");
        }
        return values;
    }

    /** @return the column names of the documented fields present in the table, in documented order */
    String[] present() {
        return presentOf(names);
    }

    /** @return the table's own names of the columns {@link #present()} lists, in the same order */
    String[] presentColumns() {
        return presentOf(columns);
    }

    private String[] presentOf(String[] all) {
        int count = 0;
        for (int at : index) {
            count += at < 0 ? 0 : 1;
        }
        String[] out = new String[count];
        int k = 0;
        for (int f = 0; f < index.length; f++) {
            if (index[f] >= 0) {
                out[k++] = all[f];
            }
        }
        return out;
    }

    /** @return the value, checked finite */
    private double finite(String id, int field, double value) {
        if (!Double.isFinite(value)) {
            throw bad(id, field, "is " + value + ", not a finite number");
        }
        return value;
    }

    /** @return element i, checked finite and at least (or, with above, above) the floor */
    private double element(String id, int field, int i, double value, double floor, boolean above) {
        if (!Double.isFinite(value) || value < floor || above && value == floor) {
            throw bad(id, field, "element " + i + " is " + value + "; each must be finite"
                    + (floor == Double.NEGATIVE_INFINITY ? "" : (above ? " and above " : " and at least ") + floor));
        }
        return value;
    }

    /** Refuses an empty array, or one whose length differs from the wanted one (-1: any). */
    private void checkLength(String id, int field, int n, int length) {
        if (length >= 0 && n != length) {
            throw bad(id, field, "has " + n + " elements, but " + names[1] + " has " + length);
        }
        if (n == 0) {
            throw bad(id, field, "is empty");
        }
    }

    // ---- Spark's own row form (the fast path) ----

    private boolean isNull(InternalRow row, int field) {
        return index[field] < 0 || row.isNullAt(index[field]);
    }

    /** @return the row's id (field 0, a required string) */
    String id(InternalRow row) {
        if (row.isNullAt(index[0])) {
            throw new SparkRowException(SparkRowException.BAD_FIELD, null, names[0], "a row's id is null");
        }
        return row.getUTF8String(index[0]).toString();
    }

    /** @return the row's id, or null when it has none */
    String idOrNull(InternalRow row) {
        return row.isNullAt(index[0]) ? null : row.getUTF8String(index[0]).toString();
    }

    /** @return the row's id in Spark's form, checked not null; valid until the row is read past */
    UTF8String utf8Id(InternalRow row) {
        if (row.isNullAt(index[0])) {
            throw new SparkRowException(SparkRowException.BAD_FIELD, null, names[0], "a row's id is null");
        }
        return row.getUTF8String(index[0]);
    }

    /** @return the double, checked not null and finite */
    double number(InternalRow row, String id, int field) {
        if (isNull(row, field)) {
            throw bad(id, field, "is null");
        }
        return finite(id, field, row.getDouble(index[field]));
    }

    /** @return the double, or NaN when the column is absent or null; a present value checked finite */
    double optionalNumber(InternalRow row, String id, int field) {
        return isNull(row, field) ? Double.NaN : number(row, id, field);
    }

    /** @return the long, checked not null */
    long whole(InternalRow row, String id, int field) {
        if (isNull(row, field)) {
            throw bad(id, field, "is null");
        }
        return row.getLong(index[field]);
    }

    /** @return the strings, checked not null, not empty and without null or blank elements */
    String[] strings(InternalRow row, String id, int field) {
        return strings(row, id, field, false);
    }

    /**
     * @param emptyAllowed whether an empty array is accepted
     * @return the strings, checked not null and without null or blank elements
     */
    String[] strings(InternalRow row, String id, int field, boolean emptyAllowed) {
        if (isNull(row, field)) {
            throw bad(id, field, "is null");
        }
        ArrayData list = row.getArray(index[field]);
        int n = list.numElements();
        if (n == 0 && !emptyAllowed) {
            throw bad(id, field, "is empty");
        }
        String[] values = new String[n];
        for (int i = 0; i < n; i++) {
            String value = list.isNullAt(i) ? null : list.getUTF8String(i).toString();
            if (value == null || value.isBlank()) {
                throw bad(id, field, "element " + i + " is " + (value == null ? "null" : "blank"));
            }
            values[i] = value;
        }
        return values;
    }

    /**
     * As {@link #optionalDoubles(Row, String, int, int, double, boolean)}: the array copied out
     * in one piece, then checked element by element.
     */
    double[] optionalDoubles(InternalRow row, String id, int field, int length, double floor, boolean above) {
        if (isNull(row, field)) {
            return null;
        }
        ArrayData list = row.getArray(index[field]);
        int n = list.numElements();
        checkLength(id, field, n, length);
        double[] values = list.toDoubleArray(); // a null element's slot holds no value; it is refused below
        for (int i = 0; i < n; i++) {
            if (list.isNullAt(i)) {
                throw bad(id, field, "element " + i + " is null");
            }
            element(id, field, i, values[i], floor, above);
        }
        return values;
    }

    /** @return the doubles, as {@link #optionalDoubles(InternalRow, String, int, int, double, boolean)} but required */
    double[] doubles(InternalRow row, String id, int field, int length, double floor, boolean above) {
        double[] values = optionalDoubles(row, id, field, length, floor, above);
        if (values == null) {
            throw bad(id, field, "is null");
        }
        return values;
    }
}
