package org.ritzwerk.engine.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.testing.Golden;

/**
 * The Faddeeva function against {@code golden/faddeeva.csv} (mpmath at 40+ digits, made by
 * {@code make_faddeeva_golden.py}): the complex value to 1e-10 relative, and its real part (the
 * Voigt function) to 1e-6 relative wherever it is above 1e-300, as the file's header declares.
 */
class FaddeevaTest {

    @Test
    void agreesWithMpmath() {
        int rows = 0;
        double complexTolerance = Golden.tolerance("faddeeva.csv");
        double realTolerance = Golden.tolerance("faddeeva.csv", "real-part");
        for (Map<String, String> row : Golden.rows("faddeeva.csv")) {
            double x = Double.parseDouble(row.get("x"));
            double y = Double.parseDouble(row.get("y"));
            double re = Double.parseDouble(row.get("re_w"));
            double im = Double.parseDouble(row.get("im_w"));
            double[] w = Faddeeva.w(x, y);
            double complexError = Math.hypot(w[0] - re, w[1] - im) / Math.hypot(re, im);
            assertTrue(complexError <= complexTolerance, row + ": " + w[0] + " " + w[1] + " (" + complexError + ")");
            if (Math.abs(re) > 1e-300) {
                double realError = Math.abs(w[0] - re) / Math.abs(re);
                assertTrue(realError <= realTolerance, row + ": real part " + w[0] + " (" + realError + ")");
            }
            rows++;
        }
        assertTrue(rows > 300, "rows " + rows);
    }

    /**
     * A property over a wide part of the plane: 1,400 seeded random points (golden/faddeeva-wide.csv,
     * mpmath, made by make_faddeeva_wide_golden.py), by set: the whole plane, near the real axis,
     * around |z| = 8 where the far-wing series takes over, and the far wing where its term count
     * changes, to the file's declared tolerances: the general ones everywhere, and the tighter
     * far-wing one (the asymptotic series) beyond |z| = 8.
     */
    @Test
    void agreesWithMpmathOverAWideGrid() {
        double complexTolerance = Golden.tolerance("faddeeva-wide.csv");
        double realTolerance = Golden.tolerance("faddeeva-wide.csv", "real-part");
        double farTolerance = Golden.tolerance("faddeeva-wide.csv", "far-wing");
        Map<String, Integer> rowsBySet = new java.util.TreeMap<>();
        for (Map<String, String> row : Golden.rows("faddeeva-wide.csv")) {
            double x = Double.parseDouble(row.get("x"));
            double y = Double.parseDouble(row.get("y"));
            double re = Double.parseDouble(row.get("re_w"));
            double im = Double.parseDouble(row.get("im_w"));
            double[] w = Faddeeva.w(x, y);
            boolean far = Math.hypot(x, y) > 8;
            double complexError = Math.hypot(w[0] - re, w[1] - im) / Math.hypot(re, im);
            assertTrue(complexError <= (far ? farTolerance : complexTolerance),
                    row + ": " + w[0] + " " + w[1] + " (" + complexError + ")");
            if (Math.abs(re) > 1e-300) {
                double realError = Math.abs(w[0] - re) / Math.abs(re);
                assertTrue(realError <= (far ? farTolerance : realTolerance),
                        row + ": real part " + w[0] + " (" + realError + ")");
            }
            rowsBySet.merge(row.get("set"), 1, Integer::sum);
        }
        assertEquals(Map.of("axis", 400, "edge", 300, "plane", 400, "wing", 300), rowsBySet);
    }

    @Test
    void symmetriesHold() {
        // w(-conj z) = conj w(z), and w(0) = 1 (common practice).
        double[] a = Faddeeva.w(2.5, 0.7);
        double[] b = Faddeeva.w(-2.5, 0.7);
        assertEquals(a[0], b[0], 1e-15);
        assertEquals(a[1], -b[1], 1e-15);
        assertEquals(1, Faddeeva.w(0, 0)[0], 1e-13);
        double[] lower = Faddeeva.w(0.3, -0.2);
        assertTrue(Double.isFinite(lower[0]) && Double.isFinite(lower[1]));
        assertThrows(IllegalArgumentException.class, () -> Faddeeva.w(Double.NaN, 1));
    }
}
