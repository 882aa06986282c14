package org.ritzwerk.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.quantity.Unit;

/**
 * What {@link LevelList.Builder#share} refuses, the rounding allowance of a level made wholly of shared
 * parts, and that shared uncertainties count in equality (invented levels and values).
 */
class LevelListSharedUncertaintyTest {

    private static final Species HE = Species.parse("He I");
    private static final DataSetInfo INFO = new DataSetInfo("x", DataKind.LEVELS, "t", "1",
            Provenance.computedBy("the test"), List.of());

    private static LevelList.Builder four() {
        return LevelList.builder(INFO, Unit.PER_CENTIMETRE, "").add(HE, "1s2 1S0", 0, 0, 0, null)
                .add(HE, "1s2s 3S1", 159855.97, 0.002, 2, null).add(HE, "1s2p 3P2", 169086.77, 0.003, 4, null)
                .add(Species.parse("Li II"), "1s2s 3S1", 476034.98, 0.002, 2, null);
    }

    private static String refused(LevelList.Builder b, int row, String component, double value) {
        return assertThrows(IllegalArgumentException.class, () -> b.share(row, component, value)).getMessage();
    }

    @Test
    void refusesWhatNoSharedPartCanBe() {
        assertTrue(refused(four(), 9, "limit", 0.001).contains("the table has 4 rows"));
        assertTrue(refused(four(), 1, " ", 0.001).contains("must not be blank"));
        assertTrue(refused(four(), 1, null, 0.001).contains("must not be blank"));
        assertTrue(refused(four(), 1, "limit", Double.NaN).contains("must be finite"));
        assertTrue(refused(four(), 1, "limit", Double.NEGATIVE_INFINITY).contains("must be finite"));
        assertTrue(refused(four(), 0, "limit", 0.0).contains("uncertainty 0 (exact)"));
        assertTrue(refused(four().add(HE, "1s3s 3S1", 183236.79, Double.NaN, 2, null), 4, "limit", 0.001)
                .contains("no uncertainty"));
        assertTrue(refused(four().share(1, "limit", 0.001), 1, "limit", 0.001).contains("given twice"));
        assertTrue(refused(four().share(1, "limit", 0.001), 3, "limit", 0.001).contains("of He I already"));
        // u = 0.002: 0.0015^2 + 0.0014^2 = 4.21e-6 > 4e-6 (arithmetic)
        assertTrue(refused(four().share(1, "limit", 0.0015), 1, "calibration", -0.0014)
                .contains("more than its uncertainty squared"));
        assertTrue(refused(four(), 1, "limit", -0.0021).contains("more than its uncertainty squared"));
        // a species with a shared component needs every level's uncertainty, as a correlated one does
        LevelList.Builder unknown = four().add(HE, "1s3s 3S1", 183236.79, Double.NaN, 2, null).share(1, "limit", 0.001);
        assertTrue(assertThrows(IllegalArgumentException.class, unknown::build).getMessage()
                .contains("'1s3s 3S1' of He I has no uncertainty"));
        // a pair sharing a component and correlated would have its covariance given twice
        LevelList.Builder twice = four().share(1, "limit", 0.001).share(2, "limit", 0.001).correlate(1, 2, 0.2);
        assertTrue(assertThrows(IllegalArgumentException.class, twice::build).getMessage()
                .contains("share the uncertainty component 'limit' and have a correlation"));
    }

    @Test
    void aLevelMadeWhollyOfSharedPartsIsAcceptedDespiteRounding() {
        // u = 0.013 made of 0.005 and 0.012 (a 5-12-13 triple, arithmetic): in doubles the squares add up to one
        // unit in the last place more than 0.013^2, which the allowance LevelList.SHARE_ROUNDING takes
        assertTrue(0.005 * 0.005 + 0.012 * 0.012 > 0.013 * 0.013, "the case needs the allowance");
        LevelList list = four().add(HE, "1s3p 3P2", 185564.6, 0.013, 4, null).share(4, "a", 0.005)
                .share(4, "b", -0.012).build();
        assertEquals(2, list.shareCount());
        // the whole uncertainty as one component is exact: 0.002^2 = 0.002^2
        assertEquals(1, four().share(1, "limit", -0.002).build().shareCount());
        // but not beyond the allowance
        assertThrows(IllegalArgumentException.class, () -> four().share(1, "limit", 0.002 * (1 + 1e-11)));
    }

    @Test
    void sharesAreKeptInOrderAndCountInEquality() {
        LevelList a = four().share(2, "limit", 0.001).share(1, "limit", -0.0005).share(2, "d0", 0.002)
                .share(3, "li limit", 0.001).build();
        assertEquals(4, a.shareCount());
        assertEquals(2, a.shareRow(0));
        assertEquals("limit", a.shareComponent(1));
        assertEquals(-0.0005, a.share(1), 0.0);
        assertEquals(List.of("limit", "d0", "li limit"), a.uncertaintyComponents());
        assertEquals(0, a.correlationCount());
        assertEquals(a, four().share(2, "limit", 0.001).share(1, "limit", -0.0005).share(2, "d0", 0.002)
                .share(3, "li limit", 0.001).build());
        assertNotEquals(a, four().build());
        assertNotEquals(a, four().share(2, "limit", 0.001).share(1, "limit", -0.0004).share(2, "d0", 0.002)
                .share(3, "li limit", 0.001).build());
        assertNotEquals(a, four().share(2, "limit", 0.001).share(1, "limits", -0.0005).share(2, "d0", 0.002)
                .share(3, "li limit", 0.001).build());
        assertEquals(a, a.withInfo(INFO));
        // a correlation of a pair without a common component goes with shared parts
        LevelList both = four().share(1, "limit", 0.001).correlate(1, 2, 0.3).build();
        assertEquals(1, both.shareCount());
        assertEquals(1, both.correlationCount());
    }
}
