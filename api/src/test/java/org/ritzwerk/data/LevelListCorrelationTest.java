package org.ritzwerk.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.quantity.Unit;

/** What {@link LevelList.Builder#correlate} refuses, and that correlations count in equality (invented levels). */
class LevelListCorrelationTest {

    private static final Species HE = Species.parse("He I");
    private static final DataSetInfo INFO = new DataSetInfo("x", DataKind.LEVELS, "t", "1",
            Provenance.computedBy("the test"), List.of());

    private static LevelList.Builder three() {
        return LevelList.builder(INFO, Unit.PER_CENTIMETRE, "").add(HE, "1s2 1S0", 0, 0, 0, null)
                .add(HE, "1s2s 3S1", 159855.97, 0.002, 2, null).add(HE, "1s2p 3P2", 169086.77, 0.003, 4, null)
                .add(Species.parse("Li II"), "1s2s 3S1", 476034.98, 0.002, 2, null);
    }

    private static String refused(LevelList.Builder b, int i, int j, double r) {
        return assertThrows(IllegalArgumentException.class, () -> b.correlate(i, j, r)).getMessage();
    }

    @Test
    void refusesWhatNoCovarianceCanBe() {
        assertTrue(refused(three(), 1, 1, 0.5).contains("variance"));
        assertTrue(refused(three(), 1, 3, 0.5).contains("two species"));
        assertTrue(refused(three(), 1, 2, 1.0000001).contains("from -1 to 1"));
        assertTrue(refused(three(), 1, 2, Double.NaN).contains("from -1 to 1"));
        assertTrue(refused(three(), 0, 2, 0.5).contains("uncertainty 0 (exact)"));
        assertTrue(refused(three(), 1, 9, 0.5).contains("the table has 4 rows"));
        LevelList.Builder once = three().correlate(1, 2, 0.5);
        assertTrue(refused(once, 2, 1, 0.5).contains("given twice"));
        // a correlated species with a level of unknown uncertainty is refused when built
        LevelList.Builder unknown = three().add(HE, "1s3s 3S1", 183236.79, Double.NaN, 2, null).correlate(1, 2, 0.5);
        assertTrue(assertThrows(IllegalArgumentException.class, unknown::build).getMessage()
                .contains("'1s3s 3S1' of He I has no uncertainty"));
    }

    @Test
    void correlationsAreKeptInOrderAndCountInEquality() {
        LevelList a = three().correlate(2, 1, -0.25).build();
        assertEquals(1, a.correlationCount());
        assertEquals(2, a.correlationRow(0));
        assertEquals(1, a.correlationOtherRow(0));
        assertEquals(-0.25, a.correlation(0), 0.0);
        assertEquals(a, three().correlate(2, 1, -0.25).build());
        assertNotEquals(a, three().build());
        assertNotEquals(a, three().correlate(2, 1, -0.5).build());
        assertEquals(a, a.withInfo(INFO));
    }
}
