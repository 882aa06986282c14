package org.ritzwerk.engine.pair;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.TestAtoms;

class PairInteractionsTest {

    private static final AlkaliAtom RB = TestAtoms.rubidium();
    private static final PairInteractions PAIRS = PairInteractions.of(RB);

    private static DispersionCoefficient ss(PairInteractions p, int n) {
        State s = State.of(n, 0, 1);
        return p.c6(new PairState(s, 1, s, 1));
    }

    /**
     * Rb nS1/2 + nS1/2 against the fit of K. Singer, J. Stanojevic, M. Weidemueller and R. Cote,
     * J. Phys. B 38, S295 (2005): C6 = n^11 (11.97 - 0.8486 n + 3.385e-3 n^2) a.u., quoted with
     * dE = -C6 / R^6, so negative = repulsive (from memory; checked independently by the n^11
     * scaling below and by the sign: Rb nS pairs are known to repel, Saffman, Walker and Moelmer,
     * Rev. Mod. Phys. 82, 2313 (2010), from memory). Tolerance 3.5 %: the
     * fit is to their own sums with older quantum defects and is good to a few per cent.
     */
    @Test
    void rubidiumNsAgainstThePublishedFit() {
        for (int n : new int[] {43, 60, 70, 80, 100}) {
            double published = -Math.pow(n, 11) * (11.97 - 0.8486 * n + 3.385e-3 * n * n);
            double ours = ss(PAIRS, n).c6Au();
            assertTrue(ours > 0, "nS pairs of Rb repel");
            assertEquals(published, ours, 0.035 * published, "n = " + n);
        }
    }

    /** C6 grows as n*^11 (common practice; Saffman, Walker and Moelmer 2010, from memory). */
    @Test
    void scalesAsTheEleventhPower() {
        for (int n : new int[] {40, 60, 90}) {
            State a = State.of(n, 0, 1);
            State b = State.of(n + 10, 0, 1);
            double slope = Math.log(ss(PAIRS, n + 10).c6Au() / ss(PAIRS, n).c6Au())
                    / Math.log(RB.level(b).effectiveN() / RB.level(a).effectiveN());
            assertEquals(11, slope, 0.6, "d ln C6 / d ln n* at n = " + n);
        }
    }

    @Test
    void basisConvergence() {
        double wide = ss(PAIRS.withNeighbourRange(12), 70).c6Au();
        assertEquals(wide, ss(PAIRS.withNeighbourRange(2), 70).c6Au(), 1e-3 * wide);
        assertEquals(wide, ss(PAIRS, 70).c6Au(), 1e-5 * wide);
        DispersionCoefficient d = ss(PAIRS, 70);
        assertEquals(java.util.Set.of(State.of(69, 1, 3), State.of(70, 1, 3)),
                java.util.Set.of(d.strongest().first(), d.strongest().second()), "the nP + (n-1)P channel");
        assertTrue(d.strongestDefectHz() < 0, "the nP + (n-1)P pair lies below 2 nS for Rb");
    }

    /**
     * Rb nD5/2 pairs (m = 5/2 each) pass a Foerster resonance with (n+2)P3/2 + (n-2)F7/2 between
     * n = 43 and 44: the 43D5/2 pair lies within a few MHz of 45P3/2 + 41F7/2 (A. Reinhard, T.
     * Cubel Liebisch, B. Knuffman and G. Raithel, Phys. Rev. A 75, 032712 (2007); from memory; our
     * defect, from the quantum defects of the test atom, is -8.8 MHz), so that channel dominates
     * and C6 changes sign across the resonance.
     */
    @Test
    void signChangesAcrossTheFoersterResonanceOfRbNd() {
        State d43 = State.of(43, 2, 5);
        State d44 = State.of(44, 2, 5);
        DispersionCoefficient below = PAIRS.c6(new PairState(d43, 5, d43, 5));
        DispersionCoefficient above = PAIRS.c6(new PairState(d44, 5, d44, 5));
        assertEquals(State.of(45, 1, 3), below.strongest().first());
        assertEquals(State.of(41, 3, 7), below.strongest().second());
        assertEquals(0, below.strongestDefectHz(), 20e6, "within 20 MHz of resonance");
        assertTrue(below.strongestDefectHz() < 0 && above.strongestDefectHz() > 0, "the defect crosses zero");
        assertTrue(below.c6Au() > 0 && above.c6Au() < 0, "C6 changes sign: " + below.c6GHzUm6() + " and "
                + above.c6GHzUm6() + " GHz um^6");
        // far from the resonance the dominant channel is much further off, and C6 much smaller
        DispersionCoefficient far = PAIRS.c6(new PairState(State.of(36, 2, 5), 5, State.of(36, 2, 5), 5));
        assertTrue(Math.abs(far.strongestDefectHz()) > 1e9);
    }

    /** nP + nP and nD + nD pairs are computed alike and converge with the range. */
    @Test
    void pAndDPairsConverge() {
        for (State s : new State[] {State.of(60, 1, 3), State.of(60, 2, 5)}) {
            PairState pair = new PairState(s, s.twoJ(), s, s.twoJ());
            double wide = PAIRS.withNeighbourRange(10).c6(pair).c6Au();
            assertEquals(wide, PAIRS.c6(pair).c6Au(), 1e-3 * Math.abs(wide), s.label());
        }
    }

    /** At theta = 0 the weights are -2 for q1 = q2 = 0 and -1 for q1 = -q2 = +-1; 1 - 3 cos^2 for (0,0). */
    @Test
    void angularWeights() {
        assertEquals(-2, PAIRS.weight(0, 0), 1e-15);
        assertEquals(-1, PAIRS.weight(1, -1), 1e-15);
        assertEquals(-1, PAIRS.weight(-1, 1), 1e-15);
        assertEquals(0, PAIRS.weight(1, 1), 1e-15);
        double theta = 0.7;
        PairInteractions tilted = PAIRS.withAngle(theta);
        assertEquals(1 - 3 * Math.cos(theta) * Math.cos(theta), tilted.weight(0, 0), 1e-14);
        // the operator is Hermitian and real: w(q1, q2) = (-1)^(q1+q2) w(-q1, -q2)
        for (int q1 = -1; q1 <= 1; q1++) {
            for (int q2 = -1; q2 <= 1; q2++) {
                double sign = ((q1 + q2) & 1) == 0 ? 1 : -1;
                assertEquals(tilted.weight(q1, q2), sign * tilted.weight(-q1, -q2), 1e-14);
            }
        }
    }

    /** C3 of |nS, nP> -> |nP, nS> is the product of the two dipole elements times the angular weight. */
    @Test
    void c3IsAProductOfTwoDipoleElements() {
        State s = State.of(60, 0, 1);
        State p = State.of(60, 1, 3);
        PairState ket = new PairState(s, 1, p, 3);
        PairState bra = ket.swapped();
        // q1 = +1 on atom 1 (s 1/2 -> p 3/2), q2 = -1 on atom 2 (p 3/2 -> s 1/2): weight -1 at theta = 0
        double expected = -RB.dipole(p, 3, s, 1, 1) * RB.dipole(s, 1, p, 3, -1);
        assertEquals(expected, PAIRS.c3Au(bra, ket), 1e-12 * Math.abs(expected));
        assertTrue(Math.abs(expected) > 1e5, "|C3| of n = 60 is of order n^4 a.u.: " + expected);
        // m = 1/2 on both: only q = 0 for the s 1/2 m=1/2 -> p 3/2 m=1/2 step; C3 ~ (1 - 3 cos^2 theta)
        PairState k2 = new PairState(s, 1, p, 1);
        double zero = PAIRS.c3Au(k2.swapped(), k2);
        double tilted = PAIRS.withAngle(0.5).c3Au(k2.swapped(), k2);
        double d0 = RB.dipole(p, 1, s, 1, 0) * RB.dipole(s, 1, p, 1, 0);
        assertEquals(-2 * d0, zero, 1e-12 * Math.abs(d0));
        assertTrue(Math.abs(tilted) < Math.abs(zero));
    }

    /**
     * Blockade radius (|C6| / hbar Omega)^(1/6): 70S with Omega = 2 pi x 1 MHz, about 9.8 um
     * ((C6 / 1 MHz)^(1/6) in um with C6 in MHz um^6).
     */
    @Test
    void blockadeRadius() {
        DispersionCoefficient d = ss(PAIRS, 70);
        double r = d.blockadeRadiusMetres(2 * Math.PI * 1e6);
        assertEquals(Math.pow(d.c6GHzUm6() * 1e3, 1.0 / 6) * 1e-6, r, 1e-12);
        assertEquals(9.78e-6, r, 0.05e-6);
        assertThrows(IllegalArgumentException.class, () -> d.blockadeRadiusMetres(0));
        assertThrows(IllegalArgumentException.class, () -> PairInteractions.blockadeRadiusMetres(Double.NaN, 1));
        assertThrows(IllegalArgumentException.class, () -> PAIRS.withAngle(4));
    }
}
