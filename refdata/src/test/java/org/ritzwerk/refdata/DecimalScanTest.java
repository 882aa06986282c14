package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The number check of the readers is a scan that accepts exactly what its regular expression does. */
class DecimalScanTest {

    @Test
    void acceptsWhatTheExpressionAccepts() {
        for (String yes : new String[] {"0", "5.", ".5", "-1.25e-3", "+7E+10", "656.281", "1e5"}) {
            assertTrue(TabularFiles.isDecimal(yes), yes);
        }
        for (String no : new String[] {"", ".", "+", "e5", "1e", "1e+", "1.2.3", "0x10", "NaN", "Infinity", "1 2",
            "٣"}) {
            assertFalse(TabularFiles.isDecimal(no), no);
        }
        SplittableRandom random = new SplittableRandom(20261203);   // fixed seed; a failure names the text
        String alphabet = "0123456789.+-eE x";
        for (int k = 0; k < 200_000; k++) {
            StringBuilder text = new StringBuilder();
            for (int i = random.nextInt(8); i > 0; i--) {
                text.append(alphabet.charAt(random.nextInt(alphabet.length())));
            }
            String s = text.toString();
            assertEquals(TabularFiles.DECIMAL.matcher(s).matches(), TabularFiles.isDecimal(s), "'" + s + "'");
        }
    }
}
