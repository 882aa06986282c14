package org.ritzwerk.engine.hydrogenic;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.testing.Golden;

/**
 * The 36 Bethe logarithms of the QED tier against {@code bethe-logarithms.csv}, recomputed by
 * {@code make_bethe_golden.py} (mpmath 1.2.1, Debian 12) from the definition by exact sums over
 * the bound states and integrals over the continuum. The table keeps nine decimals, so every value
 * must equal the recomputed one rounded to nine decimals: each of the 36 is checked digit by digit.
 */
class BetheLogarithmsTest {

    @Test
    void everyTabulatedValueIsTheRecomputedOneToNineDecimals() {
        int rows = 0;
        for (Map<String, String> row : Golden.rows("bethe-logarithms.csv")) {
            int n = Integer.parseInt(row.get("n"));
            int l = Integer.parseInt(row.get("l"));
            double recomputed = Double.parseDouble(row.get("ln_k0"));
            // Half a unit of the ninth decimal, plus the file's declared 1e-11.
            assertEquals(recomputed, BetheLogarithms.of(n, l), 5e-10 + 1e-11, "ln k0(" + n + ", " + l + ")");
            assertEquals(Math.round(recomputed * 1e9), Math.round(BetheLogarithms.of(n, l) * 1e9),
                    "ln k0(" + n + ", " + l + ") to nine decimals");
            rows++;
        }
        assertEquals(36, rows);
    }

    @Test
    void beyondTheTableTheLastRowStandsIn() {
        // n > 8 uses the n = 8 value of the same l, and 0 for l > 7 (see the class comment).
        assertEquals(BetheLogarithms.of(8, 0), BetheLogarithms.of(20, 0), 0.0);
        assertEquals(BetheLogarithms.of(8, 7), BetheLogarithms.of(9, 7), 0.0);
        assertEquals(0.0, BetheLogarithms.of(9, 8), 0.0);
    }
}
