package org.ritzwerk.refdata.internal;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ritzwerk.refdata.ReferenceDataException;

/**
 * A built-in CSV table in the project's simple form: a first line {@code # FORMAT 1},
 * {@code # key: value} header lines, the column row, then one row per line (blank lines
 * skipped). A built-in file that breaks the form is a packaging error, reported with its name
 * and line ({@link ReferenceDataException#BAD_BUILT_IN}).
 *
 * @param header the header's keys and values, in file order
 * @param rows   the data rows
 */
public record BuiltInCsv(Map<String, String> header, List<Row> rows) {

    /**
     * The folder of the built-in data files in the refdata jar ({@code lamps/}, {@code levels/},
     * {@code rydberg/}, ... below it), absolute, for {@link Class#getResourceAsStream}.
     */
    public static final String RESOURCES = "/org/ritzwerk/refdata/";


    /**
     * @param number 1-based line number
     * @param raw    the line as read
     * @param f      its fields
     */
    public record Row(int number, String raw, String[] f) {
    }

    /**
     * @param in           the file's bytes (closed here)
     * @param name         the file's name, for messages
     * @param format       the format name of the first line
     * @param columns      the column row's names, in order
     * @param lastFree     whether the last column is free text that may hold commas
     * @param requiredKeys header keys that must be present and not empty
     * @return the header and rows
     * @throws ReferenceDataException naming the file and line of the first break of the form
     */
    public static BuiltInCsv read(InputStream in, String name, String format, List<String> columns, boolean lastFree,
            List<String> requiredKeys) {
        List<Row> rows = new ArrayList<>();
        Map<String, String> header = new LinkedHashMap<>();
        try (BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            int number = 0;
            boolean seenColumns = false;
            for (String line = reader.readLine(); line != null; line = reader.readLine()) {
                number++;
                if (number == 1) {
                    if (!line.equals("# " + format + " 1")) {
                        throw bad(name, number, "first line must be '# " + format + " 1'", line);
                    }
                    continue;
                }
                if (line.isBlank()) {
                    continue;
                }
                if (line.startsWith("#")) {
                    int colon = line.indexOf(':');
                    if (colon > 0) {
                        header.put(line.substring(1, colon).strip(), line.substring(colon + 1).strip());
                    }
                    continue;
                }
                if (!seenColumns) {
                    if (!line.equals(String.join(",", columns))) {
                        throw bad(name, number, "columns must be " + String.join(",", columns), line);
                    }
                    seenColumns = true;
                    continue;
                }
                String[] f = line.split(",", lastFree ? columns.size() : -1);
                if (f.length != columns.size()) {
                    throw bad(name, number, "expected " + columns.size() + " fields, got " + f.length, line);
                }
                rows.add(new Row(number, line, f));
            }
        } catch (IOException e) {
            throw new UncheckedIOException(name + ": " + e.getMessage(), e);
        }
        for (String key : requiredKeys) {
            if (header.getOrDefault(key, "").isEmpty()) {
                throw new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, name + ": header key '" + key
                        + "' is missing");
            }
        }
        return new BuiltInCsv(Map.copyOf(header), List.copyOf(rows));
    }

    /**
     * Reads a data file built into the jar, beside a class.
     *
     * @param owner the class whose package the file's name is relative to
     * @param file  the file's name
     * @param read  the reader, given the bytes and the name
     * @param <T>   what the reader makes
     * @return what it made
     * @throws IllegalStateException when the jar lacks the file
     */
    public static <T> T resource(Class<?> owner, String file,
            java.util.function.BiFunction<java.io.InputStream, String, T> read) {
        try (java.io.InputStream in = owner.getResourceAsStream(file)) {
            if (in == null) {
                throw new IllegalStateException("built-in data file missing from the jar: " + file);
            }
            return read.apply(in, file);
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e.getMessage(), e);
        }
    }

    /** @return the error for a line of a built-in file, quoting the line */
    public static ReferenceDataException bad(String name, int number, String reason, String line) {
        return new ReferenceDataException(ReferenceDataException.BAD_BUILT_IN, name + ":" + number + ": " + reason
                + "\n    " + line);
    }
}
