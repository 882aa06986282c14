package org.ritzwerk.engine.internal.angular;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;

import org.junit.jupiter.api.Test;

/** Wigner 3j and 6j symbols: closed-form values and orthogonality on seeded random arguments. */
class WignerSymbolsTest {

    @Test
    void knownThreeJValues() {
        // (1 1 0; 0 0 0) = -1/sqrt(3); (1/2 1/2 1; 1/2 -1/2 0) = 1/sqrt(6) (Edmonds table 2; sympy wigner_3j).
        assertEquals(-1 / Math.sqrt(3), WignerSymbols.threeJ(2, 2, 0, 0, 0, 0), 1e-15);
        assertEquals(1 / Math.sqrt(6), WignerSymbols.threeJ(1, 1, 2, 1, -1, 0), 1e-15);
        // (1 1 2; 0 0 0) = sqrt(2/15) (sympy wigner_3j(1, 1, 2, 0, 0, 0)).
        assertEquals(Math.sqrt(2.0 / 15), WignerSymbols.threeJ(2, 2, 4, 0, 0, 0), 1e-15);
        // (3/2 1 5/2; 1/2 0 -1/2) = -0.31622776601683793 (sympy 1.11 wigner_3j, evaluated to 17 digits).
        assertEquals(-0.31622776601683793, WignerSymbols.threeJ(3, 2, 5, 1, 0, -1), 1e-15);
        // Projection and triangle rules give exact zeros.
        assertEquals(0.0, WignerSymbols.threeJ(2, 2, 2, 0, 0, 0), 0.0);
        assertEquals(0.0, WignerSymbols.threeJ(2, 2, 6, 0, 0, 0), 0.0);
        assertEquals(0.0, WignerSymbols.threeJ(2, 2, 2, 2, 2, 0), 0.0);
        assertThrows(IllegalArgumentException.class, () -> WignerSymbols.threeJ(-1, 1, 0, 1, -1, 0));
    }

    @Test
    void threeJOrthogonality() {
        // sum over m1, m2 of (j1 j2 j3; m1 m2 m3)(j1 j2 j3'; m1 m2 m3) = delta(j3, j3') / (2 j3 + 1) (Edmonds eq. 3.7.8).
        qt().withFixedSeed(3L).withExamples(150).forAll(integers().between(0, 12), integers().between(0, 12),
                integers().between(0, 24)).checkAssert((a, b, c) -> {
                    int twoJ1 = a;
                    int twoJ2 = b;
                    int twoJ3 = Math.abs(twoJ1 - twoJ2) + 2 * (c % (Math.min(twoJ1, twoJ2) + 1));
                    for (int twoJ3b = Math.abs(twoJ1 - twoJ2); twoJ3b <= twoJ1 + twoJ2; twoJ3b += 2) {
                        double sum = 0;
                        int twoM3 = twoJ3 % 2;
                        for (int twoM1 = -twoJ1; twoM1 <= twoJ1; twoM1 += 2) {
                            int twoM2 = -twoM3 - twoM1;
                            sum += WignerSymbols.threeJ(twoJ1, twoJ2, twoJ3, twoM1, twoM2, twoM3)
                                    * WignerSymbols.threeJ(twoJ1, twoJ2, twoJ3b, twoM1, twoM2, twoM3);
                        }
                        double expected = twoJ3b == twoJ3 ? 1.0 / (twoJ3 + 1) : 0;
                        assertEquals(expected, sum, 1e-12, "j1=" + twoJ1 + "/2 j2=" + twoJ2 + "/2 j3=" + twoJ3
                                + "/2 j3'=" + twoJ3b + "/2");
                    }
                });
    }

    @Test
    void sixJSpecialValue() {
        // {0 1/2 1/2; 1/2 1 1} = 1/sqrt(6) and {1 2 1; 0 1 2} = 1/sqrt(15) (sympy 1.11 wigner_6j; Edmonds eq. 6.3.2).
        assertEquals(1 / Math.sqrt(6), WignerSymbols.sixJ(0, 1, 1, 1, 2, 2), 1e-15);
        assertEquals(1 / Math.sqrt(15), WignerSymbols.sixJ(2, 4, 2, 0, 2, 4), 1e-15);
    }
}
