package org.ritzwerk.refdata;

import java.util.Objects;

/**
 * One problem found in a data file: where (source, 1-based line and column), what (a stable
 * code and a reason) and the raw line as read. Immutable.
 *
 * @param source the file name or other label of the input
 * @param line   1-based line number
 * @param column 1-based column, or 0 when the whole line is meant
 * @param code   stable error code, e.g. {@code quantity.unknown-unit}
 * @param reason what is wrong, in words
 * @param raw    the raw line
 */
public record DataProblem(String source, int line, int column, String code, String reason, String raw) {

    /**
     * Validates the components.
     *
     * @param source the file name or other label of the input
     * @param line   1-based line number
     * @param column 1-based column, or 0 when the whole line is meant
     * @param code   stable error code, e.g. {@code quantity.unknown-unit}
     * @param reason what is wrong, in words
     * @param raw    the raw line
     */
    public DataProblem {
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(code, "code");
        Objects.requireNonNull(reason, "reason");
        Objects.requireNonNull(raw, "raw");
        if (line < 1 || column < 0) {
            throw new IllegalArgumentException("line must be >= 1 and column >= 0, got " + line + ":" + column);
        }
    }

    /** @return {@code source:line:column: reason} followed by the raw line, as compilers print it */
    public String render() {
        return source + ":" + line + (column > 0 ? ":" + column : "") + ": " + reason + "\n    " + raw;
    }
}
