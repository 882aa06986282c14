package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.hyperfine.HyperfineComponent;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.hyperfine.HyperfineStructure;
import org.ritzwerk.engine.hyperfine.ZeemanComponent;
import org.ritzwerk.engine.hyperfine.ZeemanState;
import org.ritzwerk.engine.hyperfine.ZeemanStructure;

/** Typical uses of the hyperfine and Zeeman API (the README's "Hyperfine and Zeeman structure"), compiled. */
class HyperfineExamplesTest {

    @Test
    void lockLinesOfRubidium87FromTheDataContext() {
        DataContext context = DataContext.builtIn();
        Species rb87 = Species.parse("Rb-87 I");
        AlkaliHyperfine data = context.alkaliHyperfine();

        AlkaliHyperfine.DLine d2 = data.dLines(rb87).get(1);              // as published: 384230484.4685 MHz
        assertEquals("384230484.4685", d2.frequencyText());
        assertEquals("MHz", d2.unit());

        List<HyperfineComponent> lines = data.components(context, rb87, State.parse("5s1/2"), State.parse("5p3/2"));
        HyperfineComponent cooling = lines.get(lines.size() - 1);          // F = 2 -> F' = 3
        assertEquals(4, cooling.twoFLower());
        assertEquals(6, cooling.twoFUpper());
        assertEquals(384228115.2033e6, cooling.frequencyHertz(), 1e3);   // Hz
        assertEquals(0.4375, cooling.relativeStrength(), 1e-12);          // share of the D2 line strength

        List<ZeemanComponent> zeeman = data.zeemanComponents(context, rb87, State.parse("5s1/2"),
                State.parse("5p3/2"), 1e-4);                              // 1 gauss = 1e-4 T
        assertEquals(1, zeeman.stream().mapToDouble(ZeemanComponent::relativeStrength).sum(), 1e-10);

        // at 1 T: the stretched cooling component F = 2, m_F = 2 -> F' = 3, m_F' = 3 with its standard uncertainty
        // (7.7 kHz, as at zero field: its energy stays linear in A and B) and the |m_J m_I> states it joins
        ZeemanComponent stretched = data.zeemanComponents(context, rb87, State.parse("5s1/2"), State.parse("5p3/2"),
                1.0).stream().filter(c -> c.twoMFLower() == 4 && c.twoMFUpper() == 6).findFirst().orElseThrow();
        assertEquals(cooling.frequencyUncertaintyHertz(), stretched.frequencyUncertaintyHertz(), 1e-3);   // Hz
        assertEquals("3/2", stretched.upperDominant().mJLabel());         // |m_J = 3/2, m_I = 3/2>
        assertEquals("3/2", stretched.upperDominant().mILabel());
        assertEquals(1, stretched.upperDominant().weight(), 1e-12);
    }

    @Test
    void withoutTheDataContextForFirmware() {
        // Cs-133 ground level: A = 9 192 631 770 Hz / 4 (the SI second), I = 7/2, J = 1/2
        HyperfineConstants ground = new HyperfineConstants(9192631770.0 / 4, 0, "SI definition of the second");
        assertEquals(9192631770.0, HyperfineStructure.splittingHertz(7, 1, ground), 1e-6);
        double gJ = ZeemanStructure.landeG(0, 1);                           // 2.00231930436256 (CODATA 2018)
        double gI = ZeemanStructure.nuclearG(2.5778, 7);                    // from mu_I / mu_N (Stone 2019)
        // the clock states F = 3, m = 0 and F = 4, m = 0 at 1e-5 T (0.1 G): the quadratic Zeeman shift
        // 427.45 Hz/G^2 (common practice in Cs clocks, from memory) gives 4.27 Hz
        double clock = ZeemanStructure.breitRabiHertz(7, 8, 0, 9192631770.0, gJ, gI, 1e-5)
                - ZeemanStructure.breitRabiHertz(7, 6, 0, 9192631770.0, gJ, gI, 1e-5);
        assertEquals(9192631770.0 + 4.27, clock, 0.01);
        List<ZeemanState> states = ZeemanStructure.eigenstates(7, 1, ground, gJ, gI, 1e-5);
        assertEquals(16, states.size());
    }
}
