package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.ModelPotential;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/**
 * Lifetimes, Einstein A coefficients and dipole elements that rest on computed elements state a
 * model-spread uncertainty: the difference between the two published methods (the Coulomb
 * approximation with the bare dipole operator, and the Marinescu et al. (1994) model potential integrated
 * into the core with the core-polarized operator), taken as a standard uncertainty (common practice in
 * atomic theory), held here to published lifetime measurements.
 */
class LifetimeModelSpreadTest {

    private static final DataContext CONTEXT = DataContext.builtIn();

    private static AlkaliAtom atom(String species) {
        return CONTEXT.alkaliAtom(Species.parse(species));
    }

    private static double lifetimeNs(String species, String state) {
        return atom(species).radiativeLifetime(State.parse(state)) * 1e9;
    }

    private static OptionalDouble uncertaintyNs(String species, String state) {
        OptionalDouble u = atom(species).radiativeLifetimeUncertainty(State.parse(state));
        return u.isPresent() ? OptionalDouble.of(u.getAsDouble() * 1e9) : u;
    }

    /**
     * Every lifetime of the built-in atoms carries an uncertainty, and the published measurements
     * below lie within two combined standard uncertainties (the stated one and the measurement's).
     * Before the model spread, none of these lifetimes had one (their channels are computed).
     */
    @Test
    void publishedLifetimesOfLowLyingStatesLieWithinTwiceTheStatedUncertainty() {
        // {species, state, measured ns, its standard uncertainty ns}
        String[][] checks = {
            // E. Gomez, F. Baumer, A. D. Lange, G. D. Sprouse and L. A. Orozco, Phys. Rev. A 72, 012502 (2005),
            // arXiv:physics/0502090: Rb 6s 45.57(17) ns (from memory; the stored abstract lost its number).
            // Achieved 47.66 +- 2.80 ns (5.9 %), 0.7 u high; before: no uncertainty.
            {"Rb-87 I", "6s1/2", "45.57", "0.17"},
            // D. Sheng, A. Perez Galvan and L. A. Orozco, Phys. Rev. A 78, 062506 (2008), arXiv:0811.4010 (read in
            // the abstract): 5d3/2 246.3(1.6) ns, 5d5/2 238.5(2.3) ns. Achieved 250.5 +- 30.1 and 242.2 +- 28.6 ns.
            {"Rb-87 I", "5d3/2", "246.3", "1.6"},
            {"Rb-87 I", "5d5/2", "238.5", "2.3"},
            // "Inelastic cross-sections and natural lifetimes for 6 2D5/2,3/2 and 8 2S1/2 states of rubidium" (read
            // in the abstract; its authors and journal were not in the stored text): 8s 161(3) ns, 6d3/2 256(4) ns,
            // 6d5/2 249(5) ns.
            {"Rb-87 I", "8s1/2", "161", "3"},
            {"Rb-87 I", "6d3/2", "256", "4"},
            {"Rb-87 I", "6d5/2", "249", "5"},
            // Rb 6p3/2 about 112 ns (the reviewer's figure of issue 17, from memory; uncertainty taken as 1 %).
            // Achieved 107.8 +- 6.3 ns.
            {"Rb-87 I", "6p3/2", "112", "1.12"},
            // Cs 7s: published elements decide it; G. Toh et al., Phys. Rev. A 97, 052507 (2018), arXiv:1803.00339
            // (read in the abstract): 48.28(7) ns.
            {"Cs-133 I", "7s1/2", "48.28", "0.07"},
        };
        StringBuilder failures = new StringBuilder();
        for (String[] c : checks) {
            double tau = lifetimeNs(c[0], c[1]);
            OptionalDouble u = uncertaintyNs(c[0], c[1]);
            double measured = Double.parseDouble(c[2]);
            String line = c[0] + " " + c[1] + ": " + tau + " +- " + (u.isPresent() ? u.getAsDouble() : "none")
                    + " ns against " + measured + "(" + c[3] + ")\n";
            if (u.isEmpty() || Math.abs(tau - measured) > 2 * Math.hypot(u.getAsDouble(), Double.parseDouble(c[3]))) {
                failures.append(line);
            }
        }
        assertTrue(failures.length() == 0, failures.toString());
    }

    /**
     * Not every miss is covered: Cs 7p3/2 and 7p1/2 come out 116.9 and 131.4 ns against about 133 and 155 ns
     * (the reviewer's figures of issue 17, from memory), 12 and 15 % short, while both models give nearly the
     * same 7p -> 7s rates and the model potential makes 7p -> 5d stronger still: the spread (3.3 and 3.9 %)
     * does not reach the miss. The README says so; this test keeps it true (it fails once the miss is gone or
     * is covered, and then the README must change).
     */
    @Test
    void caesiumSevenPLifetimesAreAKnownMissThatTheSpreadDoesNotCover() {
        String[][] misses = {{"7p3/2", "133"}, {"7p1/2", "155"}};
        for (String[] m : misses) {
            double tau = lifetimeNs("Cs-133 I", m[0]);
            double u = uncertaintyNs("Cs-133 I", m[0]).orElseThrow();
            double measured = Double.parseDouble(m[1]);
            assertTrue(measured - tau > 0.10 * measured && measured - tau > 2 * u, m[0] + ": " + tau + " +- " + u);
        }
    }

    /**
     * The spread is the whole difference between the two published methods, the reviewer's figures of issue
     * 17 included: Rb 60s 243.9 against 225.1 us at 0 K, Cs 60s 227.4 against 206.6 us. An atom built on the
     * model potential gets the same spread against the Coulomb approximation.
     */
    @Test
    void theSpreadIsTheDifferenceBetweenTheTwoPublishedMethods() {
        for (String species : new String[] {"Rb-87 I", "Cs-133 I"}) {
            AlkaliAtom coulomb = atom(species);
            ModelPotential p = CONTEXT.modelPotential(Species.parse(species));
            AlkaliAtom potential = coulomb.withModelPotential(p).withInnerRadius(0.01).withCorePolarizedDipole(p);
            State s = State.parse("60s1/2");
            double tau = coulomb.radiativeLifetime(s);
            double other = potential.radiativeLifetime(s);
            assertEquals(Math.abs(tau - other), coulomb.radiativeLifetimeUncertainty(s).orElseThrow(),
                    1e-9 * tau, species);
            assertEquals(Math.abs(tau - other), potential.radiativeLifetimeUncertainty(s).orElseThrow(),
                    1e-9 * tau, species);
            State d = State.parse("60d5/2");
            State p32 = State.parse("5p3/2");
            if (species.startsWith("Cs")) {
                p32 = State.parse("6p3/2");
            }
            // a computed element and its A: the difference of the two models' values
            assertEquals(Math.abs(Math.abs(coulomb.reducedDipole(d, p32)) - Math.abs(potential.reducedDipole(d, p32))),
                    coulomb.reducedDipoleUncertainty(d, p32).orElseThrow(), 1e-12, species);
            assertEquals(Math.abs(coulomb.einsteinA(d, p32) - potential.einsteinA(d, p32)),
                    coulomb.einsteinAUncertainty(d, p32).orElseThrow(), 1e-9, species);
        }
        // Rb 60s: 243.9 and 225.1 us (issue 17): a spread of 7.7 %
        assertEquals(243.9e3, lifetimeNs("Rb-87 I", "60s1/2"), 0.1e3);
        assertEquals(0.077, uncertaintyNs("Rb-87 I", "60s1/2").orElseThrow() / lifetimeNs("Rb-87 I", "60s1/2"),
                0.002);
    }

    /**
     * The effective lifetime with black-body radiation states its uncertainty the same way: at 0 K the
     * spontaneous one; at 300 K the difference of the two models' effective lifetimes.
     */
    @Test
    void effectiveLifetimesStateTheSpreadOfTheTwoModelsToo() {
        AlkaliAtom rb = atom("Rb-87 I");
        ModelPotential p = CONTEXT.modelPotential(Species.parse("Rb-87 I"));
        AlkaliAtom potential = rb.withModelPotential(p).withInnerRadius(0.01).withCorePolarizedDipole(p);
        State s6 = State.parse("6s1/2");
        assertEquals(rb.radiativeLifetimeUncertainty(s6).orElseThrow(), rb.effectiveLifetimeUncertainty(s6, 0)
                .orElseThrow(), 1e-6 * rb.radiativeLifetime(s6));
        State s60 = State.parse("60s1/2");
        double tau = rb.effectiveLifetime(s60, 300);
        double u = rb.effectiveLifetimeUncertainty(s60, 300).orElseThrow();
        assertEquals(Math.abs(tau - potential.effectiveLifetime(s60, 300)), u, 1e-9 * tau);
        // Rb 60s at 300 K: 101.9 +- 3.4 us (3.4 %, less than the 7.7 % at 0 K: black-body rates between Rydberg
        // states barely differ between the models)
        assertEquals(0.034, u / tau, 0.003, "Rb 60s at 300 K: " + tau + " +- " + u);
        // every channel published (Rb 5p3/2: the resonance line; no black-body channel at 0 K): the published part
        assertEquals(0.09e-9, rb.effectiveLifetimeUncertainty(State.parse("5p3/2"), 0).orElseThrow(), 1e-15);
        assertTrue(rb.withModelSpread(null).effectiveLifetimeUncertainty(s60, 300).isEmpty());
    }

    /** Published elements keep their own uncertainty; a mixed lifetime adds both parts in quadrature. */
    @Test
    void publishedElementsKeepTheirUncertaintyAndMixedLifetimesAddBothParts() {
        AlkaliAtom rb = atom("Rb-87 I");
        State p3 = State.parse("5p3/2");
        State s5 = State.parse("5s1/2");
        // the resonance line's element is published: its stated uncertainty, not a spread
        assertEquals(rb.publishedDipole(s5, p3).orElseThrow().uncertaintyBohr(),
                rb.reducedDipoleUncertainty(p3, s5).orElseThrow(), 0);
        assertEquals(0.09, uncertaintyNs("Rb-87 I", "5p3/2").orElseThrow(), 1e-6);
        // an atom without a second model states nothing where a channel is computed (Rb 6s decays to 5p by
        // computed elements), and only the published part where every channel is published (5p3/2)
        AlkaliAtom alone = rb.withModelSpread(null);
        assertTrue(alone.radiativeLifetimeUncertainty(State.parse("6s1/2")).isEmpty());
        assertTrue(alone.reducedDipoleUncertainty(State.parse("6s1/2"), p3).isEmpty());
        assertEquals(0.09e-9, alone.radiativeLifetimeUncertainty(p3).orElseThrow(), 1e-15);
        // Cs 7p3/2 decays to 6s by a published element (Damitz et al. 2019) and to 7s and 5d by computed ones
        AlkaliAtom cs = atom("Cs-133 I");
        State p7 = State.parse("7p3/2");
        double fromPublished = 0;
        double tau = cs.radiativeLifetime(p7);
        for (var c : cs.spontaneousChannels(p7)) {
            if (cs.publishedDipole(c.from(), c.to()).isPresent()) {
                fromPublished += tau * tau * cs.einsteinAUncertainty(p7, c.to()).orElseThrow();
            }
        }
        ModelPotential p = CONTEXT.modelPotential(Species.parse("Cs-133 I"));
        double spread = tau - cs.withModelSpread(null).withModelPotential(p).withInnerRadius(0.01)
                .withCorePolarizedDipole(p).radiativeLifetime(p7);
        assertTrue(fromPublished > 0);
        assertEquals(Math.hypot(fromPublished, spread), cs.radiativeLifetimeUncertainty(p7).orElseThrow(), 1e-6 * tau);
    }
}
