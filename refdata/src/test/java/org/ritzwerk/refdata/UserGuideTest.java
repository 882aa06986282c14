package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.StringReader;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.quantity.QuantityText;

/** The refdata examples of the README, compiled and run. */
class UserGuideTest {

    @Test
    void readAListOfQuantities() {
        String file = "# peaks from the bench\n412.337(4) nm air\n17298.77 cm-1\n";
        List<QuantityListReader.Entry> entries =
                new QuantityListReader(QuantityText.standard()).read(new StringReader(file), "peaks.txt");

        assertEquals(2, entries.size());
        assertEquals(3, entries.get(1).line());
    }
}
