package org.ritzwerk.engine;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.plasma.BoltzmannPlot;
import org.ritzwerk.engine.plasma.IonisationBalance;
import org.ritzwerk.engine.profile.BalmerStark;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.PixelGrid;

/**
 * A null where the library needs a value is refused where it is given, with the argument's name
 * (these gave bare NullPointerExceptions from deep inside, or were taken as a default).
 */
class NullArgumentsTest {

    @Test
    void nullArgumentsAreNamed() {
        PixelGrid grid = PixelGrid.linear(400, 500, 10);
        double[] one = {1};
        Map<String, Executable> calls = Map.of(
                "edges", () -> PixelGrid.of(null),
                "line", () -> BalmerStark.electronDensity(null, 1),
                "model", () -> IonisationBalance.hydrogen(null, 1e4, 1e20),
                "text", () -> Tolerance.parse(null),
                "species", () -> LineQuery.defaults().withSpecies(null),
                "indices", () -> LineSet.empty().select(null),
                "grid", () -> new LineRenderer(null, Instrument.ofResolvingPower(1000), 50),
                "instrument", () -> new LineRenderer(grid, null, 50),
                "counting", () -> BoltzmannPlot.fit(null, one, null, one, one, one, null));
        calls.forEach((name, call) -> {
            NullPointerException e = assertThrows(NullPointerException.class, call, name);
            assertTrue(name.equals(e.getMessage()), name + ": " + e.getMessage());
        });
        NullPointerException state = assertThrows(NullPointerException.class, () -> State.parse(null));
        assertTrue("text".equals(state.getMessage()), state.getMessage());
        // an index outside the set is named with the set's size
        assertTrue(assertThrows(IndexOutOfBoundsException.class, () -> LineSet.empty().select(new int[] {3}))
                .getMessage().contains("line index 3 out of range: the set has 0 lines"));
    }
}
