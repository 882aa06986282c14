package org.ritzwerk.atom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;

import org.junit.jupiter.api.Test;

/** The level notation n l j: labels read back, and impossible quantum numbers are refused. */
class StateTest {

    private static final long SEED = 1979L;

    @Test
    void stateLabelsReadBack() {
        qt().withFixedSeed(SEED).forAll(integers().between(1, 500), integers().between(0, 16), integers().between(0, 1))
                .checkAssert((n, lSeed, j) -> {
                    int l = lSeed % n;
                    State s = State.of(n, l, l == 0 ? 1 : 2 * l - 1 + 2 * j);
                    assertEquals(s, State.parse(s.label()));
                });
        assertEquals("43d 2D5/2", State.parse("43d5/2").notation());
        assertThrows(IllegalArgumentException.class, () -> State.parse("43d7/2"));
        assertThrows(IllegalArgumentException.class, () -> State.parse("5x1/2"));
        assertThrows(IllegalArgumentException.class, () -> State.of(3, 3, 7));
    }

    @Test
    void labelNotationAndJ() {
        State s = State.parse(" 60S1/2 ");
        assertEquals(State.of(60, 0, 1), s);
        assertEquals("60s1/2", s.label());
        assertEquals("60s1/2", s.toString());
        assertEquals("60s 2S1/2", s.notation());
        assertEquals(0.5, s.j(), 0.0);
        assertEquals("60(l=40)81/2", State.of(60, 40, 81).label());
    }
}
