package org.ritzwerk.engine.internal.radial;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.testing.Golden;

/**
 * Radial dipole integrals against {@code golden/radial-dipole-integrals.csv}: sympy 1.11.1 exact
 * integrals for every pair with n &lt;= 8, and Gordon's formula in mpmath at 60 digits up to
 * n = 600 (made by {@code make_hydrogen_golden.py}). Tolerance as the file's header declares it
 * (1e-12 relative).
 */
class RadialIntegralsTest {

    @Test
    void agreeWithSympyAndMpmath() {
        int rows = 0;
        double tolerance = Golden.tolerance("radial-dipole-integrals.csv");
        for (Map<String, String> row : Golden.rows("radial-dipole-integrals.csv")) {
            int n = Integer.parseInt(row.get("n"));
            int l = Integer.parseInt(row.get("l"));
            int n2 = Integer.parseInt(row.get("n_prime"));
            int l2 = Integer.parseInt(row.get("l_prime"));
            double expected = Double.parseDouble(row.get("integral_bohr"));
            double actual = RadialIntegrals.dipole(n, l, n2, l2);
            assertTrue(Golden.relativeError(expected, actual) <= tolerance,
                    () -> row + ": got " + actual);
            // The integral is symmetric in its two states.
            assertEquals(actual, RadialIntegrals.dipole(n2, l2, n, l), 0.0);
            rows++;
        }
        assertEquals(152, rows);
    }

    @Test
    void sameShellIntegralHasItsClosedForm() {
        // <n l-1 | r | n l> = -(3/2) n sqrt(n^2 - l^2) (checked with sympy for n <= 5; Bethe & Salpeter eq. 63.5).
        assertEquals(-3 * Math.sqrt(3), RadialIntegrals.dipole(2, 1, 2, 0), 1e-14);
        assertEquals(-15 * Math.sqrt(21) / 2, RadialIntegrals.dipole(5, 2, 5, 1), 1e-13);
    }

    @Test
    void refusesImpossibleStates() {
        refuses(() -> RadialIntegrals.dipole(0, 0, 1, 1),
                "principal quantum number n of the first state must be >= 1, got 0");
        refuses(() -> RadialIntegrals.dipole(2, 2, 1, 1),
                "orbital quantum number l of the first state must be 0 to n - 1 = 1, got 2");
        refuses(() -> RadialIntegrals.dipole(3, 2, 3, 0), "a dipole integral needs l' = l +- 1, got l = 2, l' = 0");
    }

    private static void refuses(org.junit.jupiter.api.function.Executable call, String message) {
        assertEquals(message, assertThrows(IllegalArgumentException.class, call).getMessage());
    }
}
