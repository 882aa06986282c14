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
import java.util.Map;

/**
 * Reads the committed golden CSV files under {@code src/test/resources/golden/}: lines starting
 * with '#' are the provenance header, then one row of column names, then data rows. The files
 * are simple (no quoting, no commas in fields), written by {@code make_golden.py} beside them.
 */
public final class Golden {

    private Golden() {
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
