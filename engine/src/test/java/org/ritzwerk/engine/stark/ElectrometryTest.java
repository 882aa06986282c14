package org.ritzwerk.engine.stark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.integers;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.TestAtoms;

class ElectrometryTest {

    private static final AlkaliAtom RB = TestAtoms.rubidium();
    private static final Electrometry EM = Electrometry.of(RB);

    /** Splitting -> field -> splitting is the identity, for fields from 1e-6 to 1e3 V/m and n from 30 to 90. */
    @Test
    void splittingToFieldAndBackIsTheIdentity() {
        qt().withFixedSeed(22L).withExamples(40)
                .forAll(integers().between(30, 90), doubles().between(-6, 3))
                .checkAssert((n, exponent) -> {
                    State lower = State.of(n, 2, 5);
                    State upper = State.of(n + 1, 1, 3);
                    double field = Math.pow(10, exponent);
                    AutlerTownes forward = EM.splitting(lower, 1, upper, 1, field);
                    AutlerTownes back = EM.field(lower, 1, upper, 1, forward.splittingHz());
                    assertEquals(field, back.fieldVPerM(), 1e-12 * field);
                    assertEquals(forward.dipoleEa0(), back.dipoleEa0());
                });
    }

    /**
     * Delta f = |d| e a0 E / h: with |d| = 1000 e a0 and E = 1 V/m, 1000 x 1.602176634e-19 C x
     * 5.29177210903e-11 m / 6.62607015e-34 J s = 12.795 MHz (CODATA 2018 constants).
     */
    @Test
    void splittingScalesWithTheDipoleElement() {
        State lower = State.of(50, 2, 5);
        AutlerTownes pi = EM.splitting(lower, 1, State.of(51, 1, 3), 1, 1.0);
        assertEquals(Math.abs(pi.dipoleEa0()) * 12.795e3, pi.splittingHz(), 1e-4 * pi.splittingHz());
        AutlerTownes sigma = EM.splitting(lower, 1, State.of(51, 1, 3), 3, 1.0);
        assertEquals(Math.abs(sigma.dipoleEa0() / pi.dipoleEa0()), sigma.splittingHz() / pi.splittingHz(), 1e-12);
        assertEquals(1, sigma.polarisation());
        assertEquals(0, pi.polarisation());
        // doubling the field doubles the splitting
        assertEquals(2 * pi.splittingHz(), EM.splitting(lower, 1, State.of(51, 1, 3), 1, 2.0).splittingHz(),
                1e-9 * pi.splittingHz());
    }

    @Test
    void transitionsNearAFrequency() {
        State from = State.of(50, 2, 5);
        double target = Math.abs(RB.frequencyHz(from, State.of(51, 1, 3)));
        List<ResonantTransition> near = EM.transitionsNear(from, target + 1e6, 5e9, 10);
        assertFalse(near.isEmpty());
        ResonantTransition first = near.get(0);
        assertEquals(State.of(51, 1, 3), first.to());
        assertEquals(-1e6, first.detuningHz(), 1);
        for (int i = 1; i < near.size(); i++) {
            assertTrue(Math.abs(near.get(i).detuningHz()) >= Math.abs(near.get(i - 1).detuningHz()));
            assertTrue(Math.abs(near.get(i).detuningHz()) <= 5e9);
        }
        assertEquals(RB.reducedDipole(State.of(51, 1, 3), from), first.reducedDipoleEa0(), 1e-9);
    }

    @Test
    void badInputIsRefused() {
        State lower = State.of(50, 2, 5);
        assertEquals(StarkException.NO_COUPLING,
                assertThrows(StarkException.class, () -> EM.splitting(lower, 1, State.of(51, 1, 3), 5, 1)).code());
        assertEquals(StarkException.NO_COUPLING,
                assertThrows(StarkException.class, () -> EM.splitting(State.of(50, 2, 5), 1, State.of(51, 1, 1), 1, 1))
                        .code());
        assertThrows(IllegalArgumentException.class, () -> EM.field(lower, 1, State.of(51, 1, 3), 1, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> EM.splitting(lower, 1, State.of(51, 1, 3), 1, -1));
        assertThrows(IllegalArgumentException.class, () -> EM.transitionsNear(lower, 0, 1, 5));
    }
}
