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
        StateParseException impossible = assertThrows(StateParseException.class, () -> State.parse("43d7/2"));
        assertEquals(StateParseException.IMPOSSIBLE, impossible.code());
        assertEquals("cannot read state \"43d7/2\": j must be l +- 1/2 (and 1/2 for l = 0); got l = 2, 2j = 7",
                impossible.getMessage());
        assertEquals(StateParseException.MALFORMED,
                assertThrows(StateParseException.class, () -> State.parse("5x1/2")).code());
        // Coded as Species.parse's failures are (common practice in this project's api).
        StateParseException noJ = assertThrows(StateParseException.class, () -> State.parse("60s"));
        assertEquals(StateParseException.MALFORMED, noJ.code());
        assertEquals("cannot read state \"60s\": j is missing (write e.g. 60s1/2); expected n, the letter of l and"
                + " j, e.g. 5s1/2, 43d5/2, 60p3/2", noJ.getMessage());
        assertEquals(StateParseException.MALFORMED,
                assertThrows(StateParseException.class, () -> State.parse("abc")).code());
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

    @Test
    void labelsBeyondTheLettersReadBack() {
        // l >= 17 has no letter; label() writes (l=<l>), which parse must read (a JSON round trip needs it).
        qt().withFixedSeed(SEED).forAll(integers().between(18, 100_000), integers().between(17, 99_999),
                integers().between(0, 1)).checkAssert((n, lSeed, j) -> {
                    int l = 17 + lSeed % (n - 17);
                    State s = State.of(n, l, 2 * l - 1 + 2 * j);
                    assertEquals(s, State.parse(s.label()));
                });
        State widest = State.of(Integer.MAX_VALUE, 999_999_999, 1_999_999_999);
        assertEquals("2147483647(l=999999999)1999999999/2", widest.label());
        assertEquals(widest, State.parse(widest.label()));
        assertEquals(State.of(5, 2, 5), State.parse("5(l=2)5/2"));
        StateParseException tooLarge = assertThrows(StateParseException.class, () -> State.parse("2147483648s1/2"));
        assertEquals(StateParseException.IMPOSSIBLE, tooLarge.code());
        assertEquals("cannot read state \"2147483648s1/2\": n = 2147483648 is larger than 2147483647",
                tooLarge.getMessage());
        assertEquals(StateParseException.IMPOSSIBLE,
                assertThrows(StateParseException.class, () -> State.parse("60(l=60)121/2")).code());
        assertEquals(StateParseException.MALFORMED,
                assertThrows(StateParseException.class, () -> State.parse("60(l=)1/2")).code());
    }
}
