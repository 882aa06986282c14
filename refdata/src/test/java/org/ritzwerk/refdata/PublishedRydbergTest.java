package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.DecayChannel;
import org.ritzwerk.engine.rydberg.LadderExcitation;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.internal.RydbergData;

/**
 * The built-in alkali models against published values. Each check names its source; values
 * recalled rather than looked up are marked "from memory". Declared tolerances and why:
 * D lines from the measured levels (NIST ASD levels of the natural element in cm-1, from memory,
 * 2 to 8 decimals): 2e-7 relative for Na, K, Cs, 1e-6 for Rb (natural-Rb levels against
 * isotope-specific lines) and 2e-6 for Li (2 decimals). These checks are what the levels files
 * call "D line". Matrix elements and lifetimes of the resonance lines
 * come from the Coulomb approximation, which has no core potential: the reduced elements come
 * out 1 to 6 % high and the lifetimes 3 to 11 % short, and the tolerances say so per atom.
 */
class PublishedRydbergTest {

    private static final RydbergData DATA = RydbergData.builtIn();

    private static AlkaliAtom atom(String species) {
        return DATA.atom(Species.parse(species));
    }

    private static double vacuumNm(AlkaliAtom atom, State lower, State upper) {
        return PhysicalConstants.C / atom.frequencyHz(lower, upper) * 1e9;
    }

    @Test
    void dLineWavelengthsInVacuum() {
        // D. A. Steck, Rubidium 87 / Rubidium 85 / Cesium / Sodium D Line Data; T. G. Tiecke, Properties of
        // Potassium; Li-7: C. J. Sansonetti et al., Phys. Rev. Lett. 107, 023001 (2011) (all from memory),
        // vacuum wavelengths.
        checkD("Rb-87 I", 5, 794.978851156, 780.241209686, 1e-6);
        checkD("Rb-85 I", 5, 794.979014933, 780.241368271, 1e-6);
        checkD("Cs-133 I", 6, 894.59295986, 852.34727582, 2e-7);
        checkD("Na-23 I", 3, 589.7558147, 589.1583264, 2e-7);
        checkD("K-39 I", 4, 770.108385049, 766.700921822, 2e-7);
        checkD("Li-7 I", 2, 670.976658, 670.961560, 2e-6);
    }

    private static void checkD(String species, int n, double d1Nm, double d2Nm, double relative) {
        AlkaliAtom a = atom(species);
        State ground = State.of(n, 0, 1);
        assertEquals(d1Nm, vacuumNm(a, ground, State.of(n, 1, 1)), relative * d1Nm, species + " D1");
        assertEquals(d2Nm, vacuumNm(a, ground, State.of(n, 1, 3)), relative * d2Nm, species + " D2");
    }

    @Test
    void rubidiumD2InAirAndTheLadderTo60s() {
        AlkaliAtom rb = atom("Rb-87 I");
        LadderExcitation ladder = rb.ladder(State.of(5, 0, 1), State.of(5, 1, 3), State.of(60, 0, 1));
        // 780.241209686 nm vacuum (Steck, from memory) is 780.0268 nm in standard air (Steck's air value
        // 780.032 00 nm uses Edlen 1966 at 760 Torr, 15 C; from memory) -- 2e-5 relative covers the models.
        assertEquals(780.032, ladder.firstMetres(Medium.air()) * 1e9, 2e-5 * 780.032);
        // 5P3/2 -> 60S1/2 near 479.8 nm in vacuum (common practice in Rb Rydberg experiments; from memory)
        assertEquals(479.8, ladder.secondVacuumMetres() * 1e9, 0.1);
        assertEquals(ladder.secondVacuumMetres(), PhysicalConstants.C / rb.frequencyHz(State.of(5, 1, 3),
                State.of(60, 0, 1)), 0.0);
    }

    @Test
    void microwaveTransitionBetweenRydbergStates() {
        // Rb-85 67S1/2 -> 66P3/2 resonant with a microwave cavity at 13.053 GHz (J. D. M. Kondo et al.,
        // "Multiphoton dressed Rydberg excitations in a microwave cavity with ultracold Rb atoms",
        // arXiv:2407.16819 (2024), read in its abstract). A cavity frequency quoted to 1 MHz, not a
        // line-centre measurement, so only a loose check: the Li et al. 2003 defects give 13.0492 GHz,
        // within 5 MHz.
        AlkaliAtom rb = atom("Rb-85 I");
        assertEquals(13.053e9, rb.frequencyHz(State.of(66, 1, 3), State.of(67, 0, 1)), 5e6);
    }

    @Test
    void caesiumLevelsAboveSixPCarryTheirWavenumbersNotAnOldElectronVoltConversion() {
        // Cs 6s 2S1/2 -> 8s 2S1/2 from the two-photon frequency comb measurement of P. Fendel, S. D. Bergeson,
        // Th. Udem and T. W. Haensch, Opt. Lett. 32, 701 (2007), doi:10.1364/OL.32.000701 (from memory):
        // F = 3 -> F' = 3 at 364 507 238.363 MHz per photon. The hyperfine-free interval adds the ground
        // level's F = 3 offset, -9/16 of 9 192.631 770 MHz (the SI second), and removes the 8s F = 3 offset,
        // -9/16 of 4 A(8s), A(8s) = 219.12 MHz (from memory; the published values of that era spread by
        // 0.02 MHz, 0.05 MHz here). Checked: the result is 0.12 MHz (1.6e-10) from the level the levels file
        // holds (NIST ASD, 24 317.149 400 cm-1, from memory), two independent recollections agreeing.
        // The levels once read from a copy in eV converted with an older eV-to-cm-1 factor were 4.4e-8
        // (32 MHz) low here; 1 MHz separates the two.
        double centroidMHz = 2 * 364507238.363 - 9.0 / 16 * 9192.631770 + 9.0 / 16 * 4 * 219.12;
        AlkaliAtom cs = atom("Cs-133 I");
        assertEquals(centroidMHz * 1e6, cs.frequencyHz(State.of(6, 0, 1), State.of(8, 0, 1)), 1e6);
        // 7s 2S1/2 as the ASD prints it in cm-1 (18 535.5286, from memory; the levels file's own digits, so a
        // pin, not a second measurement): the old conversion put it at 18 535.527 826, 0.0008 cm-1 lower, 16
        // times the half unit of its last digit.
        assertEquals(18535.5286, cs.frequencyHz(State.of(6, 0, 1), State.of(7, 0, 1)) / (PhysicalConstants.C * 100),
                5e-5);
    }

    @Test
    void ionisationLimits() {
        // Mack et al., Phys. Rev. A 83, 052515 (2011): 1 010 029.1646(3) GHz = 33 690.946 44 cm-1 from
        // 5S1/2 F = 1, which lies 5/8 of 6 834.682 610 904 MHz (Steck, from memory) below the centroid
        // the model measures from.
        double fromF1 = atom("Rb-87 I").ionisationLimitPerCm() + 5.0 / 8 * 6.834682610904e9 / (PhysicalConstants.C * 100);
        assertEquals(33690.94644, fromF1, 1e-5);
        // Deiglmayr et al., Phys. Rev. A 93, 013424 (2016): 31 406.467 732 5(14) cm-1 (read in the paper,
        // arXiv:1601.08005)
        assertEquals(31406.4677325, atom("Cs-133 I").ionisationLimitPerCm(), 1e-7);
        // NIST ASD ionisation energies (from memory): Na 41 449.451, K 35 009.814, Li 43 487.114 cm-1. Na
        // now carries the ASD value itself and K-39 Peper et al. 2019's (IonisationLimitsTest pins both
        // exactly); Li-7 still carries the limit its quantum defects were fitted with, 0.036 cm-1 above.
        assertEquals(41449.451, atom("Na-23 I").ionisationLimitPerCm(), 0.02);
        assertEquals(35009.814, atom("K-39 I").ionisationLimitPerCm(), 0.01);
        assertEquals(43487.114, atom("Li-7 I").ionisationLimitPerCm(), 0.04);
    }

    @Test
    void resonanceLineMatrixElementsInTheCoulombApproximation() {
        // Steck's <J||er||J'> takes sqrt(2J+1) out of the Wigner-Eckart theorem: ours / sqrt(2).
        // Rb D2 4.227(5) e a0 (Steck, Rubidium 87 D Line Data): Coulomb approximation 4.40, within 5 %.
        checkReduced("Rb-87 I", 5, 3, 4.227, 0.05);
        // Rb D1 2.992 e a0 (Steck, from memory): 3.12, within 5 %.
        checkReduced("Rb-87 I", 5, 1, 2.992, 0.05);
        // Cs D2 4.4786 e a0 (Steck, Cesium D Line Data, from memory): 4.72, within 6 %.
        checkReduced("Cs-133 I", 6, 3, 4.4786, 0.06);
        // Na D2 3.5246 e a0 (Steck, Sodium D Line Data, from memory): 3.57, within 2 %.
        checkReduced("Na-23 I", 3, 3, 3.5246, 0.02);
    }

    private static void checkReduced(String species, int n, int twoJ, double steck, double relative) {
        AlkaliAtom a = atom(species);
        double ours = Math.abs(a.reducedDipole(State.of(n, 0, 1), State.of(n, 1, twoJ))) / Math.sqrt(2);
        assertEquals(steck, ours, relative * steck, species + " n = " + n + " 2j = " + twoJ);
    }

    @Test
    void theModelPotentialIsAnOptionThatDoesNotHelpTheResonanceLines() {
        // With the Marinescu et al. (1994) potential (no core polarization of the dipole operator, same
        // inner cut-off) Rb D2 comes out 4.55 e a0 against the measured 4.227 (Steck) and the Coulomb
        // approximation's 4.40: the option is kept for comparison, not as an improvement. Between
        // Rydberg states both give the same integral: 50s-50p3/2 to 1e-4 for every atom.
        for (String species : new String[] {"Li-7 I", "Na-23 I", "K-39 I", "Rb-87 I", "Cs-133 I"}) {
            AlkaliAtom coulomb = atom(species);
            AlkaliAtom model = coulomb.withModelPotential(DATA.modelPotential(Species.parse(species)));
            double ca = coulomb.radialDipoleBohr(State.of(50, 0, 1), State.of(50, 1, 3));
            assertEquals(ca, model.radialDipoleBohr(State.of(50, 0, 1), State.of(50, 1, 3)), 1e-4 * Math.abs(ca),
                    species);
        }
        // 4.546 e a0: this model's own earlier output, pinned as a regression value (not a published number)
        AlkaliAtom rb = atom("Rb-87 I").withModelPotential(DATA.modelPotential(Species.parse("Rb I")));
        assertEquals(4.546, Math.abs(rb.reducedDipole(State.of(5, 0, 1), State.of(5, 1, 3))) / Math.sqrt(2), 0.005);
    }

    @Test
    void resonanceLevelLifetimes() {
        // 5P3/2 of Rb 26.2348(77) ns (Steck, from memory): 24.2 ns here, within 10 %.
        assertEquals(26.2348e-9, atom("Rb-87 I").radiativeLifetime(State.of(5, 1, 3)), 0.10 * 26.2348e-9);
        // 6P3/2 of Cs 30.473(39) ns (Steck, from memory): 27.4 ns here, within 12 %.
        assertEquals(30.473e-9, atom("Cs-133 I").radiativeLifetime(State.of(6, 1, 3)), 0.12 * 30.473e-9);
        // 3P3/2 of Na 16.2492(77) ns (Steck, from memory): 15.8 ns here, within 4 %.
        assertEquals(16.2492e-9, atom("Na-23 I").radiativeLifetime(State.of(3, 1, 3)), 0.04 * 16.2492e-9);
    }

    /**
     * Measured first-p lifetimes, ns, each {species, n, tau(p1/2), tau(p3/2), before, after}: "before" is
     * the bare Coulomb approximation's relative error, "after" the declared tolerance with the
     * core-polarized dipole operator (the achieved error rounded up by about half a per cent).
     * Na, K, Rb: U. Volz and H. Schmoranzer, Phys. Scr. T65, 48 (1996); Cs: R. J. Rafac et al., Phys.
     * Rev. A 60, 3648 (1999). All from memory; checked against a second recalled value each (Steck's
     * data sheets: Na 3p3/2 16.2492 ns, Rb 5p3/2 26.2348 ns of Gutterres et al. 2002, Cs 6p3/2
     * 30.473 ns and 6p1/2 34.894 ns; Tiecke's potassium sheet: 26.72 and 26.37 ns), all within 0.15 %.
     */
    private static final Object[][] FIRST_P_LIFETIMES = {
        {"Na-23 I", 3, 16.299, 16.254, 0.005},
        {"K-39 I", 4, 26.69, 26.34, 0.035},
        {"Rb-87 I", 5, 27.70, 26.24, 0.055},
        {"Cs-133 I", 6, 34.934, 30.499, 0.075},
    };

    @Test
    void theCorePolarizedDipoleLengthensTheFirstPLifetimesTowardsTheMeasuredOnes() {
        // Achieved (ns, per cent from the measurement), bare -> core-polarized, Coulomb approximation:
        // Na 3p1/2 15.856 (-2.7) -> 16.306 (+0.04), 3p3/2 15.810 (-2.7) -> 16.258 (+0.02);
        // K 4p1/2 25.058 (-6.1) -> 27.407 (+2.7), 4p3/2 24.745 (-6.1) -> 27.047 (+2.7);
        // Rb 5p1/2 25.482 (-8.0) -> 28.969 (+4.6), 5p3/2 24.211 (-7.7) -> 27.421 (+4.5);
        // Cs 6p1/2 31.243 (-10.6) -> 37.297 (+6.8), 6p3/2 27.381 (-10.2) -> 32.308 (+5.9).
        // Only Na reaches the 1 % goal: for the heavier atoms the correction overshoots (the Coulomb
        // approximation's wavefunctions inside the core are not those of a real potential).
        for (Object[] row : FIRST_P_LIFETIMES) {
            String species = (String) row[0];
            int n = (Integer) row[1];
            double tolerance = (Double) row[4];
            AlkaliAtom bare = atom(species);
            AlkaliAtom polarized = bare.withCorePolarizedDipole(DATA.modelPotential(Species.parse(species)));
            for (int twoJ = 1; twoJ <= 3; twoJ += 2) {
                double measured = (twoJ == 1 ? (Double) row[2] : (Double) row[3]) * 1e-9;
                State p = State.of(n, 1, twoJ);
                double before = bare.radiativeLifetime(p);
                double after = polarized.radiativeLifetime(p);
                assertEquals(measured, after, tolerance * measured, species + " " + p);
                assertTrue(Math.abs(after - measured) < Math.abs(before - measured), species + " " + p
                        + " closer to the measurement with the correction");
            }
        }
    }

    @Test
    void theModelPotentialIntoTheCoreWithTheCorePolarizedDipoleComesClosest() {
        // The Marinescu et al. (1994) potential integrated down to 0.01 a0 (converged: 0.002 a0 and the
        // step 0.003 change these by 0.05 % at most), with the core-polarized dipole operator. Achieved
        // (ns, per cent from the measurements of FIRST_P_LIFETIMES): Na 16.203 (-0.59), 16.156 (-0.60);
        // K 26.868 (+0.67), 26.528 (+0.71); Rb 28.305 (+2.2), 26.830 (+2.2); Cs 35.824 (+2.5), 31.161
        // (+2.2). Without the correction the same functions give Rb 24.92 / 23.70 ns (-10 %).
        // Declared: Na and K within 1 % (the goal), Rb and Cs within 3 % (goal not reached).
        double[] tolerance = {0.01, 0.01, 0.03, 0.03};
        for (int i = 0; i < FIRST_P_LIFETIMES.length; i++) {
            Object[] row = FIRST_P_LIFETIMES[i];
            String species = (String) row[0];
            int n = (Integer) row[1];
            var potential = DATA.modelPotential(Species.parse(species));
            AlkaliAtom atom = atom(species).withModelPotential(potential).withInnerRadius(0.01)
                    .withCorePolarizedDipole(potential);
            for (int twoJ = 1; twoJ <= 3; twoJ += 2) {
                double measured = (twoJ == 1 ? (Double) row[2] : (Double) row[3]) * 1e-9;
                State p = State.of(n, 1, twoJ);
                assertEquals(measured, atom.radiativeLifetime(p), tolerance[i] * measured, species + " " + p);
            }
        }
    }

    @Test
    void theCorePolarizedDipoleLeavesRydbergRydbergElementsAndBranchingIntact() {
        for (String species : new String[] {"Li-7 I", "Na-23 I", "K-39 I", "Rb-87 I", "Cs-133 I"}) {
            AlkaliAtom bare = atom(species);
            AlkaliAtom polarized = bare.withCorePolarizedDipole(DATA.modelPotential(Species.parse(species)));
            // alpha_d / r^3 is below 1e-7 where these integrands live (r ~ n*^2, 900 to 2500 a0): the
            // integrals agree to 1e-6 relative (measured: 2e-7 at most, Cs 30p1/2-31s1/2; 1e-8 for n = 50)
            State[][] pairs = {{State.of(50, 0, 1), State.of(50, 1, 3)}, {State.of(40, 2, 5), State.of(41, 1, 3)},
                {State.of(30, 1, 1), State.of(31, 0, 1)}};
            for (State[] pair : pairs) {
                double ca = bare.radialDipoleBohr(pair[0], pair[1]);
                assertEquals(ca, polarized.radialDipoleBohr(pair[0], pair[1]), 1e-6 * Math.abs(ca),
                        species + " " + pair[0] + "-" + pair[1]);
                // the model potential into the core with the correction against the model potential at its
                // default cut-off with the bare r: within 3e-5 (measured: 1.2e-5 at most, Cs 30p1/2-31s1/2).
                // (The model potential itself differs from the Coulomb approximation by up to 2.1e-4, Li
                // 40d5/2-41p3/2, whatever the inner radius and the operator.)
                var potential = DATA.modelPotential(Species.parse(species));
                AlkaliAtom model = bare.withModelPotential(potential);
                AlkaliAtom best = model.withInnerRadius(0.01).withCorePolarizedDipole(potential);
                double mp = model.radialDipoleBohr(pair[0], pair[1]);
                assertEquals(mp, best.radialDipoleBohr(pair[0], pair[1]), 3e-5 * Math.abs(mp),
                        species + " " + pair[0] + "-" + pair[1] + " model potential");
            }
            // the resonance element shrinks (the induced core dipole opposes the electron's)
            State s = polarized.groundState();
            State p = State.of(s.n(), 1, 3);
            assertTrue(Math.abs(polarized.reducedDipole(s, p)) < Math.abs(bare.reducedDipole(s, p)), species);
            // branching ratios of a Rydberg state and of the first p level sum to 1, and every channel's A is
            // the one einsteinA gives for that pair
            for (State upper : new State[] {State.of(40, 1, 3), p}) {
                double total = polarized.spontaneousRate(upper);
                double sum = 0;
                for (DecayChannel c : polarized.spontaneousChannels(upper)) {
                    sum += c.ratePerSecond() / total;
                    assertEquals(polarized.einsteinA(upper, c.to()), c.ratePerSecond(), 1e-12 * c.ratePerSecond());
                }
                assertEquals(1.0, sum, 1e-12, species + " " + upper);
            }
        }
    }

    @Test
    void anInnerRadiusOutsideItsRangeIsRefusedByName() {
        AlkaliAtom rb = atom("Rb-87 I");
        for (double bad : new double[] {0, -1, 11, Double.POSITIVE_INFINITY}) {
            IllegalArgumentException e = org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                    () -> rb.withInnerRadius(bad));
            assertTrue(e.getMessage().startsWith("inner radius must be 1e-4 to 10 a0"), e.getMessage());
        }
        assertEquals(Math.cbrt(rb.corePolarizability().orElseThrow().dipoleAu()), rb.innerRadiusBohr(), 0.0);
        assertEquals(0.01, rb.withInnerRadius(0.01).innerRadiusBohr(), 0.0);
        assertEquals(rb.innerRadiusBohr(), rb.withInnerRadius(0.01).withInnerRadius(Double.NaN).innerRadiusBohr(), 0.0);
    }

    @Test
    void blackbodyRatesFollowBeterov2009() {
        // I. I. Beterov et al., Phys. Rev. A 79, 052504 (2009), fit of the black-body-induced
        // depopulation rate of Rb at temperature T: A / n*^D * 2.14e10 / (exp(315780 B / (n*^C T)) - 1) s^-1,
        // parameters (A, B, C, D) of its table for Rb (from memory, the paper was not re-read):
        // nS (0.134, 0.251, 2.567, 4.426), nP3/2 (0.046, 0.109, 2.085, 3.901), nD5/2 (0.032, 0.082, 1.898, 3.703).
        // Here at 300 K, n = 30 and 60: within 5 % (bound states only in both); our rates are an independent
        // calculation, so agreement at six points checks the recalled parameters as well.
        double[][] fit = {{0.134, 0.251, 2.567, 4.426}, {0.046, 0.109, 2.085, 3.901}, {0.032, 0.082, 1.898, 3.703}};
        AlkaliAtom rb = atom("Rb-87 I");
        for (int n : new int[] {30, 60}) {
            for (State s : new State[] {State.of(n, 0, 1), State.of(n, 1, 3), State.of(n, 2, 5)}) {
                double[] p = fit[s.l()];
                double nStar = rb.level(s).effectiveN();
                double beterov = p[0] / Math.pow(nStar, p[3]) * 2.14e10
                        / Math.expm1(315780 * p[1] / (Math.pow(nStar, p[2]) * 300));
                assertEquals(beterov, rb.blackbodyRate(s, 300), 0.05 * beterov, s.toString());
            }
        }
    }

    @Test
    void rydbergLifetimesAtZeroKelvin() {
        // tau = tau' n*^alpha with tau' = 1.43 ns, alpha = 2.94 for Rb nS and tau' = 2.09 ns, alpha = 2.85
        // for nD (T. F. Gallagher, Rydberg Atoms (1994), table of lifetime scalings; from memory, so only
        // a loose check): 50S and 50D5/2 within 20 %.
        AlkaliAtom rb = atom("Rb-87 I");
        double sStar = rb.level(50, 0, 1).effectiveN();
        double dStar = rb.level(50, 2, 5).effectiveN();
        double s = 1.43e-9 * Math.pow(sStar, 2.94);
        double d = 2.09e-9 * Math.pow(dStar, 2.85);
        assertEquals(s, rb.radiativeLifetime(State.of(50, 0, 1)), 0.2 * s);
        assertEquals(d, rb.radiativeLifetime(State.of(50, 2, 5)), 0.2 * d);
    }
}
