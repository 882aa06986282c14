package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.DecayChannel;
import org.ritzwerk.engine.rydberg.PublishedDipole;

/**
 * The built-in published dipole elements (rydberg/dipole-elements.csv) against independent published
 * values. No check compares a lifetime with the measurement its own element was deduced from: each
 * lifetime is held to a second, independent measurement, and each element to a second measurement,
 * a measured line-strength ratio or theory. Sources beside each check; "from memory" marks values
 * recalled rather than looked up (the data file says how each was checked).
 */
class PublishedDipolesTest {

    private static final DataContext CONTEXT = DataContext.builtIn();

    private static AlkaliAtom atom(String species) {
        return CONTEXT.alkaliAtom(Species.parse(species));
    }

    private static double lifetimeNs(String species, String state) {
        return atom(species).radiativeLifetime(State.parse(state)) * 1e9;
    }

    /** |d(p3/2)|^2 / |d(p1/2)|^2 of the first p doublet. */
    private static double lineStrengthRatio(String species, int n) {
        AlkaliAtom a = atom(species);
        State s = State.of(n, 0, 1);
        double d1 = a.reducedDipole(s, State.of(n, 1, 1));
        double d3 = a.reducedDipole(s, State.of(n, 1, 3));
        return d3 * d3 / (d1 * d1);
    }

    @Test
    void firstPLifetimesAgreeWithAnIndependentMeasurementWithinOnePerCent() {
        // The stored rows (Oates et al. 1996, Aubin et al. 2004, Patterson et al. 2015, Rafac et al. 1999,
        // Volz and Schmoranzer 1996) are each held to a different measurement or evaluation:
        // Li 2p (stored: McAlexander et al. 1996, 27.102(9) ns, from memory): U. Volz and H. Schmoranzer,
        // Phys. Scr. T65, 48 (1996): 27.11(6) ns (from memory); the Coulomb approximation gave 26.72 ns (-1.4 %).
        for (String li : new String[] {"Li-6 I", "Li-7 I"}) {
            assertEquals(27.11, lifetimeNs(li, "2p1/2"), 0.01 * 27.11, li);
            assertEquals(27.11, lifetimeNs(li, "2p3/2"), 0.01 * 27.11, li);
        }
        // Na 3p3/2: U. Volz et al., Phys. Rev. Lett. 76, 2862 (1996): 16.254(22) ns (from memory).
        assertEquals(16.254, lifetimeNs("Na-23 I", "3p3/2"), 0.01 * 16.254);
        // K 4p: T. G. Tiecke, Properties of Potassium (data sheet): 26.72 and 26.37 ns (from memory).
        assertEquals(26.72, lifetimeNs("K-39 I", "4p1/2"), 0.01 * 26.72);
        assertEquals(26.37, lifetimeNs("K-39 I", "4p3/2"), 0.01 * 26.37);
        // Rb 5p: U. Volz and H. Schmoranzer, Phys. Scr. T65, 48 (1996): 27.70(4) and 26.24(4) ns (from
        // memory; the 5p3/2 value agrees with the 26.2348 ns of D. A. Steck's sheet within 0.02 %).
        for (String rb : new String[] {"Rb-87 I", "Rb-85 I"}) {
            assertEquals(27.70, lifetimeNs(rb, "5p1/2"), 0.01 * 27.70, rb);
            assertEquals(26.24, lifetimeNs(rb, "5p3/2"), 0.01 * 26.24, rb);
        }
        // Cs 6p3/2: R. J. Rafac et al., Phys. Rev. A 60, 3648 (1999): 30.499(70) ns (from memory);
        // Cs 6p1/2: D. A. Steck, Cesium D Line Data: 34.894 ns (from memory).
        assertEquals(30.499, lifetimeNs("Cs-133 I", "6p3/2"), 0.01 * 30.499);
        assertEquals(34.894, lifetimeNs("Cs-133 I", "6p1/2"), 0.01 * 34.894);
    }

    private static double lifetimeUncertaintyNs(String species, String state) {
        return atom(species).radiativeLifetimeUncertainty(State.parse(state)).orElseThrow() * 1e9;
    }

    /**
     * A lifetime decided by published elements carries their uncertainty, and it covers a second,
     * independent measurement: |tau - tau'| within 2 combined standard uncertainties.
     */
    @Test
    void lifetimesFromPublishedElementsStateUncertaintiesThatCoverIndependentMeasurements() {
        // A row taken from one measured lifetime gives that measurement's uncertainty back (the rows:
        // Oates et al. 1996, Aubin et al. 2004, Patterson et al. 2015, Pucher et al. 2020).
        assertEquals(0.035, lifetimeUncertaintyNs("Na-23 I", "3p3/2"), 1e-6);
        assertEquals(0.09, lifetimeUncertaintyNs("Rb-87 I", "5p3/2"), 1e-6);
        assertEquals(0.046, lifetimeUncertaintyNs("Cs-133 I", "6p3/2"), 1e-6);
        assertEquals(5, lifetimeUncertaintyNs("Cs-133 I", "5d5/2"), 1e-4);
        // Held to the second measurements of the test above, with their stated uncertainties:
        // Li 2p3/2 27.11(6) ns (Volz and Schmoranzer 1996, from memory); Na 3p3/2 16.254(22) ns and Rb 5p
        // 27.70(4), 26.24(4) ns (Volz et al. 1996, from memory);
        // Cs 6p3/2 30.499(70) ns (Rafac et al. 1999, from memory); Cs 5d5/2 1250(115) ns (Sasso et al.
        // 1992, read in the abstract); Cs 5d3/2 909(15) ns (DiBerardino and Tanner 1998, from memory).
        String[][] checks = {{"Li-7 I", "2p3/2", "27.11", "0.06"}, {"Na-23 I", "3p3/2", "16.254", "0.022"},
            {"Rb-87 I", "5p1/2", "27.70", "0.04"},
            {"Rb-87 I", "5p3/2", "26.24", "0.04"}, {"Cs-133 I", "6p3/2", "30.499", "0.070"},
            {"Cs-133 I", "5d5/2", "1250", "115"}, {"Cs-133 I", "5d3/2", "909", "15"}};
        for (String[] c : checks) {
            double u = lifetimeUncertaintyNs(c[0], c[1]);
            double other = Double.parseDouble(c[2]);
            double combined = Math.hypot(u, Double.parseDouble(c[3]));
            assertTrue(Math.abs(lifetimeNs(c[0], c[1]) - other) <= 2 * combined, c[0] + " " + c[1] + ": "
                    + lifetimeNs(c[0], c[1]) + " +- " + u + " ns against " + other);
        }
        // Cs 5d3/2 decays by two elements scaled from one by LS line strengths, 3 % each (the data file),
        // added as fully correlated: 6 % of the lifetime (934 +- 56 ns).
        assertEquals(0.06 * lifetimeNs("Cs-133 I", "5d3/2"), lifetimeUncertaintyNs("Cs-133 I", "5d3/2"),
                0.002 * lifetimeNs("Cs-133 I", "5d3/2"));
        // Computed channels (Rb 6p decays to 6s and 4d by the Coulomb approximation; Rydberg states): none from
        // the published elements alone; the data context's atoms add the model spread (LifetimeModelSpreadTest).
        AlkaliAtom alone = atom("Rb-87 I").withModelSpread(null);
        assertTrue(alone.radiativeLifetimeUncertainty(State.parse("6p3/2")).isEmpty());
        assertTrue(alone.radiativeLifetimeUncertainty(State.parse("40d5/2")).isEmpty());
        assertTrue(alone.einsteinAUncertainty(State.parse("6p3/2"), State.parse("6s1/2")).isEmpty());
    }

    @Test
    void firstPLineStrengthRatiosMatchMeasuredRatiosAndTheNonRelativisticLimit() {
        // Rb: R. H. Leonard et al., Phys. Rev. A 92, 052501 (2015), arXiv:1507.07898 (tune-out wavelength,
        // read in the abstract): 1.99221(3). Achieved 1.99476 (+0.13 %).
        assertEquals(1.99221, lineStrengthRatio("Rb-87 I", 5), 0.003 * 1.99221);
        // Cs: R. J. Rafac and C. E. Tanner, Phys. Rev. A 58, 1087 (1998): 1.9809(9) (from memory).
        // Achieved 1.98375 (+0.14 %).
        assertEquals(1.9809, lineStrengthRatio("Cs-133 I", 6), 0.003 * 1.9809);
        // Na and K: the non-relativistic ratio 2 (common practice); relativistic corrections are below
        // 0.1 % for these light atoms. Achieved Na 2.0015, K 1.9998.
        assertEquals(2.0, lineStrengthRatio("Na-23 I", 3), 0.003 * 2);
        assertEquals(2.0, lineStrengthRatio("K-39 I", 4), 0.003 * 2);
        assertEquals(2.0, lineStrengthRatio("Li-7 I", 2), 0.003 * 2);
    }

    @Test
    void caesiumSixSToSevenPElementsAgreeWithTheEarlierMeasurement() {
        // Stored: Damitz et al. (2019). D. Antypas and D. S. Elliott, Phys. Rev. A 88, 052516 (2013),
        // arXiv:1310.7958 (read in the abstract): <7P3/2||r||6S1/2> = 0.5780(7) a0 and
        // <7P1/2||r||6S1/2> = 0.2789(16) a0. The two measurements differ by 0.66 % and 0.29 %.
        AlkaliAtom cs = atom("Cs-133 I");
        State g = State.of(6, 0, 1);
        assertEquals(0.5780, Math.abs(cs.reducedDipole(g, State.of(7, 1, 3))), 0.01 * 0.5780);
        assertEquals(0.2789, Math.abs(cs.reducedDipole(g, State.of(7, 1, 1))), 0.01 * 0.2789);
        // The Coulomb approximation alone is 44 % (7p3/2) and 68 % (7p1/2) high there.
        AlkaliAtom bare = cs.withPublishedDipoles(List.of());
        assertTrue(Math.abs(bare.reducedDipole(g, State.of(7, 1, 3))) > 1.3 * 0.5780);
    }

    @Test
    void caesiumSevenSElementsMatchTheTheoreticalRatio() {
        // G. Toh et al., arXiv:1901.00480 (2019), read in the abstract: the all-order theory gives
        // <7s||r||6p3/2> / <7s||r||6p1/2> = 1.5270(27); the stored elements come from the measured ratio
        // and the 7s lifetime, so the 7s lifetime itself is no check of them and none is made here.
        AlkaliAtom cs = atom("Cs-133 I");
        State s7 = State.of(7, 0, 1);
        double ratio = cs.reducedDipole(s7, State.of(6, 1, 3)) / cs.reducedDipole(s7, State.of(6, 1, 1));
        assertEquals(1.5270, Math.abs(ratio), 2 * 0.0027);
    }

    @Test
    void rubidiumFiveDLifetimesFromComputedElementsOnly() {
        // D. Sheng, A. Perez Galvan and L. A. Orozco, arXiv:0811.4010 (2008), read in the abstract:
        // 5D3/2 246.3(1.6) ns, 5D5/2 238.5(2.3) ns. No stored element enters these decays (5d -> 5p, 6p
        // are computed): achieved 250.5 ns (+1.7 %) and 242.2 ns (+1.5 %); declared 2.5 %.
        assertEquals(246.3, lifetimeNs("Rb-87 I", "5d3/2"), 0.025 * 246.3);
        assertEquals(238.5, lifetimeNs("Rb-87 I", "5d5/2"), 0.025 * 238.5);
    }

    @Test
    void caesiumFiveDFiveHalvesAgainstAnEarlierMeasurement() {
        // Stored: tau(5d5/2) = 1353(5) ns (S. Pucher et al., arXiv:1912.10089, read in the abstract), turned
        // into the 6p3/2 - 5d5/2 element (the level's only dipole decay). Held to a different measurement:
        // A. Sasso et al., Phys. Rev. A 45, 1670 (1992) (journal from memory), read in the abstract as
        // 1250 +- 115 ns: achieved 1353 ns, within that uncertainty.
        assertEquals(1250, lifetimeNs("Cs-133 I", "5d5/2"), 115);
        // The Coulomb approximation alone gives 936 ns (its element 11.60 a0 is 20 % above the deduced
        // 9.65 a0), outside that measurement's uncertainty: the reason for the row.
        AlkaliAtom cs = atom("Cs-133 I");
        AlkaliAtom bare = cs.withPublishedDipoles(List.of());
        double bareNs = bare.radiativeLifetime(State.parse("5d5/2")) * 1e9;
        assertTrue(Math.abs(bareNs - 1250) > 115, "Coulomb approximation " + bareNs + " ns");
        double d = Math.abs(cs.reducedDipole(State.parse("6p3/2"), State.parse("5d5/2")));
        assertEquals(9.65, d, 0.01);
        assertTrue(Math.abs(bare.reducedDipole(State.parse("6p3/2"), State.parse("5d5/2"))) > 1.15 * d);
    }

    @Test
    void caesiumFiveDThreeHalvesFromItsPartnerByTheMultipletsLineStrengths() {
        // Stored (computed): the 6p1/2 - 5d3/2 and 6p3/2 - 5d3/2 elements as the 6p3/2 - 5d5/2 element deduced
        // from Pucher et al.'s lifetime times sqrt(5/9) and sqrt(1/9) (LS line strengths 5 : 1 : 9 of a 2P - 2D
        // multiplet, common practice); the digits must follow that row.
        AlkaliAtom cs = atom("Cs-133 I");
        double d55 = Math.abs(cs.reducedDipole(State.parse("6p3/2"), State.parse("5d5/2")));
        assertEquals(d55 * Math.sqrt(5.0 / 9), Math.abs(cs.reducedDipole(State.parse("6p1/2"), State.parse("5d3/2"))),
                5e-4);
        assertEquals(d55 / 3, Math.abs(cs.reducedDipole(State.parse("6p3/2"), State.parse("5d3/2"))), 5e-4);
        // Held to a measurement: tau(5D3/2) = 909(15) ns (M. DiBerardino and C. E. Tanner, 1998, from memory):
        // achieved 934.0 ns (+2.7 %); declared 4 %. The Coulomb approximation alone gives 675.7 ns (-26 %).
        assertEquals(909, lifetimeNs("Cs-133 I", "5d3/2"), 0.04 * 909);
        AlkaliAtom bare = cs.withPublishedDipoles(List.of());
        assertTrue(bare.radiativeLifetime(State.parse("5d3/2")) * 1e9 < 0.8 * 909);
    }

    @Test
    void rydbergElementsAndLifetimesAreUnchanged() {
        // Published elements replace exactly their own pairs: every channel of a Rydberg state is the
        // same with and without the table, to the last bit.
        for (String species : new String[] {"Rb-87 I", "Cs-133 I", "Na-23 I", "K-39 I"}) {
            AlkaliAtom with = atom(species);
            AlkaliAtom without = with.withPublishedDipoles(List.of());
            for (State s : new State[] {State.of(40, 0, 1), State.of(40, 1, 3), State.of(40, 2, 5)}) {
                List<DecayChannel> a = with.spontaneousChannels(s);
                List<DecayChannel> b = without.spontaneousChannels(s);
                assertEquals(b, a, species + " " + s);
                assertEquals(without.blackbodyRate(s, 300), with.blackbodyRate(s, 300), species + " " + s);
            }
        }
        // the 6p states of Rb do change: their 5s channel is Herold et al.'s element (Coulomb
        // approximation 41 % high)
        AlkaliAtom rb = atom("Rb-87 I");
        assertTrue(rb.radiativeLifetime(State.of(6, 1, 1)) > 1.1 * rb.withPublishedDipoles(List.of())
                .radiativeLifetime(State.of(6, 1, 1)));
    }

    @Test
    void lifetimeRowsAreTurnedIntoElementsByTheInverseRate() {
        // A = 1 / tau for a level with one channel: the engine's own rate of the deduced element
        // returns the stored lifetime (a consistency check of the conversion, not of the data).
        AlkaliAtom rb = atom("Rb-87 I");
        assertEquals(27.64e-9, 1 / rb.einsteinA(State.of(5, 1, 1), State.of(5, 0, 1)), 1e-12 * 27.64e-9);
        assertEquals("deduced", rb.publishedDipole(State.of(5, 1, 1), State.of(5, 0, 1)).orElseThrow().source()
                .substring(0, 7));
        assertEquals(19, CONTEXT.alkaliDipoles().rows().size());
    }

    private static AlkaliDipoles parse(String row) {
        String text = "# ritzwerk-dipole-elements 1\n# id: t\n# source: s\n# provenance: mixed\n"
                + String.join(",", AlkaliDipoles.COLUMNS) + "\n" + row + "\n";
        return AlkaliDipoles.read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), "t.csv");
    }

    @Test
    void badRowsAreRefusedWithFileAndLine() {
        String good = "Rb I,5s1/2,6p1/2,element,0.3236,0.0009,a0,published,src,chk";
        assertEquals(1, parse(good).rows().size());
        String[][] bad = {
            {"Rb I,5s1/2,6p1/2,element,0.3236,0.0009,ns,published,src,chk", "unit of an element must be a0"},
            {"Rb I,5s1/2,6p1/2,lifetime,27.6,0.04,a0,published,src,chk", "unit of a lifetime must be ns"},
            {"Rb I,5s1/2,6p1/2,guess,0.3,0.0,a0,published,src,chk", "kind must be"},
            {"Rb I,5s1/2,6d5/2,element,0.3,0.0,a0,published,src,chk", "not an electric-dipole pair"},
            {"Rb I,5s1/2,6p1/2,element,-0.3,0.0,a0,published,src,chk", "value must be finite and > 0"},
            {"Rb I,5s1/2,6p1/2,element,0.3,-1,a0,published,src,chk", "uncertainty must not be negative"},
            {"Rb II,5s1/2,6p1/2,element,0.3,0,a0,published,src,chk", "neutral"},
        };
        for (String[] b : bad) {
            ReferenceDataException e = assertThrows(ReferenceDataException.class, () -> parse(b[0]));
            assertEquals(ReferenceDataException.BAD_BUILT_IN, e.code());
            assertTrue(e.getMessage().contains("t.csv:6: ") && e.getMessage().contains(b[1]), e.getMessage());
        }
    }

    /**
     * The stated uncertainties of A and of a lifetime decided by published elements, against finite
     * differences of the engine's own rates with each element moved by its uncertainty (no use of the
     * closed forms): u(A) = |A(d + u) - A(d)| and u(tau) = sum_i |tau(d_i + u_i) - tau(d)| to first order.
     */
    @Test
    void ratesAndLifetimesCarryTheUncertaintyOfThePublishedElementsThatDecideThem() {
        // without the second model of the data context's atoms, so that only published elements state one
        AlkaliAtom bare = atom("Rb-87 I").withPublishedDipoles(List.of()).withModelSpread(null);
        State s6 = State.of(6, 0, 1); // two channels, to 5p1/2 and 5p3/2
        State p1 = State.of(5, 1, 1);
        State p3 = State.of(5, 1, 3);
        double d1 = Math.abs(bare.reducedDipole(p1, s6));
        double d3 = Math.abs(bare.reducedDipole(p3, s6));
        double u1 = 2e-4 * d1;
        double u3 = 3e-4 * d3;
        AlkaliAtom atom = bare.withPublishedDipoles(List.of(new PublishedDipole(p1, s6, d1, u1, "test value"),
                new PublishedDipole(p3, s6, d3, u3, "test value")));
        AlkaliAtom moved1 = bare.withPublishedDipoles(List.of(new PublishedDipole(p1, s6, d1 + u1, u1, "moved"),
                new PublishedDipole(p3, s6, d3, u3, "test value")));
        AlkaliAtom moved3 = bare.withPublishedDipoles(List.of(new PublishedDipole(p1, s6, d1, u1, "test value"),
                new PublishedDipole(p3, s6, d3 + u3, u3, "moved")));
        assertEquals(u1, atom.reducedDipoleUncertainty(s6, p1).orElseThrow(), 0);
        double uA = atom.einsteinAUncertainty(s6, p3).orElseThrow();
        double stepA = moved3.einsteinA(s6, p3) - atom.einsteinA(s6, p3);
        assertEquals(stepA, uA, 1e-3 * uA);
        double tau = atom.radiativeLifetime(s6);
        double finite = Math.abs(moved1.radiativeLifetime(s6) - tau) + Math.abs(moved3.radiativeLifetime(s6) - tau);
        double stated = atom.radiativeLifetimeUncertainty(s6).orElseThrow();
        assertEquals(finite, stated, 1e-3 * stated);
        // without a second model, a channel with a computed element leaves the lifetime without one, and computed
        // elements have none
        AlkaliAtom half = bare.withPublishedDipoles(List.of(new PublishedDipole(p1, s6, d1, u1, "test value")));
        assertEquals(OptionalDouble.empty(), half.radiativeLifetimeUncertainty(s6));
        assertEquals(OptionalDouble.empty(), half.einsteinAUncertainty(s6, p3));
        assertEquals(OptionalDouble.empty(), half.reducedDipoleUncertainty(p3, s6));
        assertEquals(OptionalDouble.empty(), bare.radiativeLifetimeUncertainty(State.of(40, 1, 3)));
    }
}
