package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.pair.DispersionCoefficient;
import org.ritzwerk.engine.pair.PairInteractions;
import org.ritzwerk.engine.pair.PairState;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.stark.AutlerTownes;
import org.ritzwerk.engine.stark.Electrometry;
import org.ritzwerk.engine.stark.Polarizability;
import org.ritzwerk.engine.stark.PolarizabilityCalculator;
import org.ritzwerk.engine.stark.StarkMap;
import org.ritzwerk.engine.stark.StarkMapResult;

/**
 * The README's examples for Rydberg atoms in fields and in pairs, on the built-in Rb-87 data, so
 * they never drift; with the accuracy figures the README quotes against published values.
 */
class RydbergFieldsGuideTest {

    private static final AlkaliAtom RB = DataContext.discoverDefault().alkaliAtom(Species.parse("Rb-87 I"));

    @Test
    void polarizability() {
        Polarizability p = PolarizabilityCalculator.of(RB).compute(State.of(60, 0, 1));
        double mhz = p.scalarMHzPerVPerCmSquared();         // alpha_0 / h in MHz/(V/cm)^2

        // M. S. O'Sullivan and B. P. Stoicheff, Phys. Rev. A 31, 2718 (1985), their fit
        // 2.202e-9 n*^6 + 5.53e-11 n*^7 MHz/(V/cm)^2 (from memory; see PolarizabilityTest)
        double nStar = RB.level(State.of(60, 0, 1)).effectiveN();
        double published = 2.202e-9 * Math.pow(nStar, 6) + 5.53e-11 * Math.pow(nStar, 7);
        assertEquals(published, mhz, 0.015 * published);
    }

    @Test
    void starkMap() {
        StarkMap map = StarkMap.builder(RB).projection(1)     // m_j = 1/2
                .principalRange(48, 52).maxOrbital(10).build();
        double[] fieldsVPerM = {0, 50, 100, 150, 200};
        StarkMapResult result = map.solve(fieldsVPerM, State.of(50, 0, 1));
        double shiftHz = result.referenceShiftHz(2);          // 50S at 1 V/cm

        // quadratic at 1 V/cm: within 1 % of -alpha F^2 / 2 (at 2 V/cm the higher orders add 2.4 %)
        double alpha = PolarizabilityCalculator.of(RB).compute(State.of(50, 0, 1)).scalarMHzPerVPerCmSquared();
        assertEquals(-0.5 * alpha * 1e6, shiftHz, 0.01 * Math.abs(shiftHz));
        double atTwo = result.referenceShiftHz(4);
        assertTrue(atTwo / shiftHz > 4 && atTwo / shiftHz < 4.2, "beyond quadratic at 2 V/cm: " + atTwo / shiftHz);
    }

    @Test
    void starkMapWithAShareWindow() {
        StarkMap map = StarkMap.builder(RB).projection(1).principalRange(48, 52).maxOrbital(10).build();
        double[] fieldsVPerM = {0, 50, 100, 150, 200};
        StarkMapResult windowed = map.withShareWindowHz(-20e9, 20e9)   // 50S's share only within 20 GHz of it
                .solve(fieldsVPerM, State.of(50, 0, 1));
        int strongest = windowed.strongestIndex(2);                     // found in the window
        boolean inside = windowed.hasShare(2, strongest);               // true
        boolean far = windowed.hasShare(2, 0);                          // false: the lowest state, far below

        assertTrue(inside);
        assertTrue(!far);
        assertThrows(IllegalStateException.class, () -> windowed.share(2, 0));  // no share outside, not a zero
        double full = map.solve(fieldsVPerM, State.of(50, 0, 1)).referenceShiftHz(2);
        assertEquals(full, windowed.referenceShiftHz(2), 30);          // 1e-9 cm^-1 = 30 Hz
        // 0.6 % of 50S lies outside: its admixture into the 50P states about 30 GHz above, at 1 V/cm
        double outside = windowed.shareOutsideWindow(2);
        assertTrue(outside > 1e-3 && outside < 0.01, "50S outside the window: " + outside);
    }

    @Test
    void microwaveSplitting() {
        Electrometry em = Electrometry.of(RB);
        AutlerTownes at = em.field(State.of(51, 1, 3), 1,    // lower state and 2 m_j
                State.of(50, 2, 5), 1, 10e6);                  // upper state, 2 m_j, 10 MHz splitting
        double volts = at.fieldVPerM();                        // the field amplitude (pi polarisation)
        assertEquals(10e6, em.splitting(State.of(51, 1, 3), 1, State.of(50, 2, 5), 1, volts).splittingHz(), 1e-3);
    }

    @Test
    void dispersionCoefficientAndBlockadeRadius() {
        State s = State.of(70, 0, 1);
        DispersionCoefficient c6 = PairInteractions.of(RB).c6(new PairState(s, 1, s, 1));
        double gHzUm6 = c6.c6GHzUm6();                        // positive: 70S pairs repel
        double radiusUm = c6.blockadeRadiusMetres(2 * Math.PI * 1e6) * 1e6;  // Omega = 2 pi x 1 MHz

        // K. Singer et al., J. Phys. B 38, S295 (2005), fit n^11 (11.97 - 0.8486 n + 3.385e-3 n^2) a.u.
        // with dE = -C6/R^6 (from memory; see PairInteractionsTest)
        double published = -Math.pow(70, 11) * (11.97 - 0.8486 * 70 + 3.385e-3 * 70 * 70);
        assertEquals(published, c6.c6Au(), 0.035 * published);
        assertTrue(gHzUm6 > 0 && radiusUm > 9 && radiusUm < 11, gHzUm6 + " " + radiusUm);
    }
}
