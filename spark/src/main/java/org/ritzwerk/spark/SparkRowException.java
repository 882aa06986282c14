package org.ritzwerk.spark;

import org.ritzwerk.RitzwerkException;

/**
 * A row of an input table that the operations cannot use: a missing or malformed field. The
 * message names the row's id and the field, e.g. {@code row 'exp-17', field 'counts': value 3
 * is NaN}; Spark reports it as the cause of the failed task. Such a row is never turned into a
 * row of NaN and never dropped.
 */
public final class SparkRowException extends RitzwerkException {
    private static final long serialVersionUID = 1L;

    /** A field is missing, null where a value is required, or outside its allowed range. */
    public static final String BAD_FIELD = "spark.bad-field";

    /** A table lacks a column the operation needs, or has it with another type. */
    public static final String BAD_SCHEMA = "spark.bad-schema";

    /**
     * Every field of a row is well-formed, but the engine cannot use them together (values so
     * extreme that a number overflows, say); the message is the engine's.
     */
    public static final String BAD_ROW = "spark.bad-row";

    /** @serial the id of the row, or null for a schema problem */
    private final String rowId;

    /** @serial the column */
    private final String field;

    /**
     * @param code    {@link #BAD_FIELD}, {@link #BAD_SCHEMA} or {@link #BAD_ROW}
     * @param rowId   the row's id (null for a schema problem or a row without an id)
     * @param field   the column (null for {@link #BAD_ROW})
     * @param message what is wrong with it
     */
    SparkRowException(String code, String rowId, String field, String message) {
        super(code, (rowId == null ? "" : "row '" + rowId + "'" + (field == null ? ": " : ", "))
                + (field == null ? "" : "field '" + field + "': ") + message);
        this.rowId = rowId;
        this.field = field;
    }

    /** @return the id of the offending row, or null for a schema problem or a row without an id */
    public String rowId() {
        return rowId;
    }

    /** @return the offending column, or null when the row as a whole is refused ({@link #BAD_ROW}) */
    public String field() {
        return field;
    }
}
