package org.ritzwerk.engine.hydrogenic;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Levels a few shells at a time, and line generation that reports its progress, give what the whole does. */
class ShellsAndProgressTest {

    @Test
    void shellsTogetherAreTheWholeTable() {
        for (Tier tier : Tier.values()) {
            HydrogenLikeModel model = HydrogenLikeModel.of(tier == Tier.HYPERFINE ? Nuclei.DEUTERON : Nuclei.PROTON, tier);
            LevelTable whole = model.levels(12);
            int i = 0;
            for (int n = 1; n <= 12; n += 3) {
                LevelTable part = model.levels(n, Math.min(n + 2, 12));
                for (int k = 0; k < part.size(); k++, i++) {
                    assertEquals(whole.label(i), part.label(k), tier + " level " + i);
                    assertEquals(whole.energy(i), part.energy(k), 0.0, tier + " " + whole.label(i));
                    assertEquals(whole.statisticalWeight(i), part.statisticalWeight(k));
                }
            }
            assertEquals(whole.size(), i, tier + ": every level once");
        }
        HydrogenLikeModel model = HydrogenLikeModel.of(Nuclei.PROTON, Tier.QED);
        assertEquals(2 * 2000 - 1, model.levels(2000, 2000).size(), "shell n holds 2n - 1 levels");
        assertThrows(IllegalArgumentException.class, () -> model.levels(5, 4));
        assertThrows(IllegalArgumentException.class, () -> model.levels(0, 4));
    }

    @Test
    void progressRisesToOneAndChangesNoLine() {
        HydrogenLikeLines lines = HydrogenLikeLines.of(HydrogenLikeModel.of(Nuclei.PROTON, Tier.QED));
        double lo = 4.0e14;
        double hi = 8.0e14;
        for (boolean multiplets : new boolean[] {false, true}) {
            List<Double> told = new ArrayList<>();
            LineTable with = multiplets ? lines.multiplets(40, lo, hi, told::add) : lines.components(40, lo, hi, told::add);
            LineTable without = multiplets ? lines.multiplets(40, lo, hi) : lines.components(40, lo, hi);
            assertEquals(without.size(), with.size());
            double[] a = new double[with.size()];
            double[] b = new double[with.size()];
            for (int i = 0; i < a.length; i++) {
                a[i] = with.frequency(i);
                b[i] = without.frequency(i);
            }
            assertArrayEquals(b, a, 0.0);
            assertTrue(told.size() > 10);
            for (int k = 1; k < told.size(); k++) {
                assertTrue(told.get(k) >= told.get(k - 1), "never falls: " + told);
            }
            assertTrue(told.get(0) < 1e-3, "starts near 0: " + told.get(0));
            assertEquals(1.0, told.get(told.size() - 1), 0.0);
        }
    }
}
