package org.ritzwerk.testing;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads the committed golden CSV files under {@code src/test/resources/golden/}: lines starting
 * with '#' are the provenance header, then one row of column names, then data rows. The files
 * are simple (no quoting, no commas in fields), written by the {@code make_*.py} scripts beside them.
 *
 * <p>Every golden file declares the tolerance its test uses in header lines of the form
 * {@code # tolerance: 1e-12 relative (why)} or, for a second tolerance in the same file,
 * {@code # tolerance <label>: 1e-7 relative (why)}; {@code absolute} instead of {@code relative}
 * for an absolute tolerance, and {@code # tolerance: none (why)} for a file of inputs that is not
 * compared. Tests read their tolerance with {@link #tolerance(String)} or
 * {@link #tolerance(String, String)} so that the header and the check cannot drift apart.
 */
public final class Golden {

    /** A tolerance line: {@code # tolerance[ label]: value kind ...}; the word "tolerance" in any case. */
    private static final Pattern TOLERANCE = Pattern.compile(
            "#\\s*tolerance(?:\\s+([a-z0-9_-]+))?\\s*:\\s*(none\\b.*|(\\S+)\\s+(relative|absolute)\\b.*)",
            Pattern.CASE_INSENSITIVE);
    /** Any header line that mentions a tolerance at its start, to catch lines the pattern above misreads. */
    private static final Pattern TOLERANCE_LIKE = Pattern.compile("#\\s*tolerances?\\b.*", Pattern.CASE_INSENSITIVE);

    /**
     * A tolerance a golden file declares.
     *
     * @param label    empty for the file's main tolerance, else the label after the word "tolerance"
     * @param value    the tolerance; NaN for {@code none}
     * @param relative whether it is relative (else absolute); false for {@code none}
     * @param line     the header line it was read from
     */
    public record Tolerance(String label, double value, boolean relative, String line) {

        /** @return whether the file declares that it is not compared (inputs only) */
        public boolean none() {
            return Double.isNaN(value);
        }
    }

    private Golden() {
    }

    /**
     * @param name file name under {@code /golden/}
     * @return the file's main relative tolerance ({@code # tolerance: <value> relative})
     * @throws IllegalStateException when the file declares no such tolerance, or it is absolute
     */
    public static double tolerance(String name) {
        return tolerance(name, "");
    }

    /**
     * @param name  file name under {@code /golden/}
     * @param label the tolerance's label ({@code # tolerance <label>: <value> relative}); empty for the main one
     * @return that relative tolerance
     * @throws IllegalStateException when the file declares no such tolerance, or it is absolute
     */
    public static double tolerance(String name, String label) {
        return find(name, label, true);
    }

    /**
     * @param name  file name under {@code /golden/}
     * @param label the tolerance's label; empty for the main one
     * @return that absolute tolerance ({@code # tolerance <label>: <value> absolute})
     * @throws IllegalStateException when the file declares no such tolerance, or it is relative
     */
    public static double absoluteTolerance(String name, String label) {
        return find(name, label, false);
    }

    private static double find(String name, String label, boolean relative) {
        List<Tolerance> declared = tolerances(name, headerLines(name));
        for (Tolerance tolerance : declared) {
            if (tolerance.label().equals(label)) {
                if (tolerance.none() || tolerance.relative() != relative) {
                    throw new IllegalStateException(name + ": tolerance '" + label + "' is not "
                            + (relative ? "relative" : "absolute") + ": " + tolerance.line());
                }
                return tolerance.value();
            }
        }
        throw new IllegalStateException(name + ": no header line '# tolerance" + (label.isEmpty() ? "" : " " + label)
                + ": <value> " + (relative ? "relative" : "absolute") + "'; declared: " + declared);
    }

    /**
     * Reads the tolerance lines of a golden file's header.
     *
     * @param name  the file's name, for messages
     * @param lines the file's lines (only those starting with '#' are looked at)
     * @return the declared tolerances, in file order
     * @throws IllegalStateException on a tolerance line that does not parse, a label given twice, or a
     *                               negative or non-finite value
     */
    public static List<Tolerance> tolerances(String name, List<String> lines) {
        List<Tolerance> found = new ArrayList<>();
        for (String line : lines) {
            if (!line.startsWith("#") || !TOLERANCE_LIKE.matcher(line).matches()) {
                continue;
            }
            Matcher m = TOLERANCE.matcher(line);
            if (!m.matches()) {
                throw new IllegalStateException(name + ": tolerance line must read '# tolerance[ <label>]: <value> "
                        + "relative|absolute (why)' or '# tolerance: none (why)', got: " + line);
            }
            String label = m.group(1) == null ? "" : m.group(1).toLowerCase(Locale.ROOT);
            double value = Double.NaN;
            boolean relative = false;
            if (m.group(3) != null) {
                try {
                    value = Double.parseDouble(m.group(3));
                } catch (NumberFormatException e) {
                    throw new IllegalStateException(name + ": tolerance value is not a number: " + line);
                }
                if (!(value >= 0) || Double.isInfinite(value)) {
                    throw new IllegalStateException(name + ": tolerance must be finite and >= 0: " + line);
                }
                relative = m.group(4).equalsIgnoreCase("relative");
            }
            for (Tolerance earlier : found) {
                if (earlier.label().equals(label)) {
                    throw new IllegalStateException(name + ": tolerance '" + label + "' declared twice: " + line);
                }
            }
            found.add(new Tolerance(label, value, relative, line));
        }
        return found;
    }

    private static List<String> headerLines(String name) {
        InputStream in = Golden.class.getResourceAsStream("/golden/" + name);
        if (in == null) {
            throw new IllegalStateException("golden file missing: " + name);
        }
        List<String> header = new ArrayList<>();
        try (BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            for (String line = reader.readLine(); line != null && (line.startsWith("#") || line.isBlank());
                    line = reader.readLine()) {
                header.add(line);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return header;
    }

    /**
     * @param name file name under {@code /golden/}
     * @return rows as column-name to text maps, in file order
     */
    public static List<Map<String, String>> rows(String name) {
        InputStream in = Golden.class.getResourceAsStream("/golden/" + name);
        if (in == null) {
            throw new IllegalStateException("golden file missing: " + name);
        }
        try (BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            List<String> header = null;
            List<Map<String, String>> rows = new ArrayList<>();
            for (String line = reader.readLine(); line != null; line = reader.readLine()) {
                if (line.startsWith("#") || line.isBlank()) {
                    continue;
                }
                List<String> fields = Arrays.asList(line.split(",", -1));
                if (header == null) {
                    header = fields;
                    continue;
                }
                if (fields.size() != header.size()) {
                    throw new IllegalStateException(name + ": row has " + fields.size() + " fields, header "
                            + header.size() + ": " + line);
                }
                Map<String, String> row = new LinkedHashMap<>();
                for (int i = 0; i < header.size(); i++) {
                    row.put(header.get(i), fields.get(i));
                }
                rows.add(row);
            }
            if (rows.isEmpty()) {
                throw new IllegalStateException(name + ": no data rows");
            }
            return rows;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * @param expected reference value
     * @param actual   computed value
     * @return |actual - expected| / |expected|
     */
    public static double relativeError(double expected, double actual) {
        return Math.abs(actual - expected) / Math.abs(expected);
    }
}
