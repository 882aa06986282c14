package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.DecayChannel;
import org.ritzwerk.engine.rydberg.LadderExcitation;
import org.ritzwerk.engine.rydberg.Level;
import org.ritzwerk.engine.rydberg.LevelOrigin;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.internal.RydbergData;

/** Typical uses of the Rydberg API, compiled so they never drift (figures rounded as printed). */
class RydbergExamplesTest {

    @Test
    void levelsLinesMatrixElementsAndLifetimesOfRubidium87() {
        AlkaliAtom rb = RydbergData.builtIn().atom(Species.parse("Rb-87 I"));

        Level level = rb.level(State.parse("60s1/2"));                   // 60s 2S1/2
        assertEquals(LevelOrigin.QUANTUM_DEFECT_FIT, level.origin());
        assertEquals(3.1312, level.quantumDefect(), 1e-4);                // n - n*
        assertEquals(33656.87, level.energyPerCm(), 0.01);                  // cm-1 above 5s1/2

        LadderExcitation ladder = rb.ladder(State.parse("5s1/2"), State.parse("5p3/2"), State.parse("60s1/2"));
        assertEquals(780.2412097, ladder.firstVacuumMetres() * 1e9, 1e-7); // nm, vacuum (Rb-87's own D2 line)
        assertEquals(479.7, ladder.secondMetres(Medium.air()) * 1e9, 0.1); // nm, standard air

        double microwave = rb.frequencyHz(State.parse("60s1/2"), State.parse("60p3/2")); // Hz, may be negative
        assertTrue(Math.abs(microwave) > 1e9);

        double reduced = rb.reducedDipole(State.parse("60s1/2"), State.parse("60p3/2")); // e a0
        double sigmaPlus = rb.dipole(State.parse("60s1/2"), 1, State.parse("60p3/2"), -1, 1); // e a0, q = +1
        assertTrue(Math.abs(sigmaPlus) > 0 && Math.abs(sigmaPlus) < Math.abs(reduced));

        double tau0 = rb.radiativeLifetime(State.parse("60s1/2"));          // s, 0 K
        double tau300 = rb.effectiveLifetime(State.parse("60s1/2"), 300);  // s, 300 K, bound states only
        assertTrue(tau300 < tau0);
        List<DecayChannel> strongest = rb.spontaneousChannels(State.parse("60s1/2"));
        assertTrue(strongest.stream().anyMatch(c -> c.to().equals(State.parse("5p3/2"))));
    }
}
