package org.ritzwerk.medium;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/**
 * Ciddor1996 against published worked values: Ciddor 1996 Tables 1 and 3, and the NIST
 * refractive-index calculator. Sources, provenance and tolerances are in the header of
 * {@code published/ciddor1996-worked-values.csv}.
 */
class CiddorPublishedValuesTest {

    @Test
    void matchesThePublishedValues() throws IOException {
        int checked = 0;
        try (BufferedReader reader = new BufferedReader(new InputStreamReader(
                getClass().getResourceAsStream("/published/ciddor1996-worked-values.csv"), StandardCharsets.UTF_8))) {
            for (String line = reader.readLine(); line != null; line = reader.readLine()) {
                if (line.startsWith("#") || line.startsWith("source,")) {
                    continue;
                }
                String[] f = line.split(",");
                Ciddor1996 air = new Ciddor1996(Double.parseDouble(f[2]), Double.parseDouble(f[3]),
                        Double.parseDouble(f[4]), 450);
                double n = air.refractiveIndex(Double.parseDouble(f[1]) * 1e-9);
                double published = Double.parseDouble(f[5]);
                if (f[0].equals("nist")) {
                    assertEquals(published, n, 1e-9, line);
                } else {
                    assertEquals(published, (n - 1) * 1e8, 0.05, line);
                }
                checked++;
            }
        }
        assertEquals(33, checked);
    }
}
