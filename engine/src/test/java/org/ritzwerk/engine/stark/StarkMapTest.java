package org.ritzwerk.engine.stark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.TestAtoms;
import org.ritzwerk.engine.internal.units.AtomicUnits;

class StarkMapTest {

    private static final AlkaliAtom RB = TestAtoms.rubidium();

    /** Hydrogen with an infinitely heavy nucleus and no fine structure: every quantum defect zero. */
    static AlkaliAtom hydrogen() {
        double rInf = PhysicalConstants.RYDBERG.value() / 100;
        Species h = new Species(1, 0, 0);
        DataSetInfo info = new DataSetInfo("test-hydrogen", DataKind.QUANTUM_DEFECTS, "test set", "1",
                Provenance.computedBy("test"), List.of(h));
        return AlkaliAtom.of(new QuantumDefects(info, h, rInf, rInf,
                List.of(new QuantumDefects.Series(0, 1, List.of(0.0), 1))), List.of(), null);
    }

    /**
     * Hydrogen's linear Stark effect in one manifold: E = (3/2) n (n1 - n2) F (atomic units; the
     * parabolic-coordinate result of H. A. Bethe and E. E. Salpeter, Quantum Mechanics of One- and
     * Two-Electron Atoms (1957); common practice). With m_j = 1/2 the manifold holds m_l = 0 (n1 - n2 = -(n-1) ... n-1) and
     * m_l = 1 (n1 - n2 = -(n-2) ... n-2), 2n - 1 states.
     */
    @Test
    void theUsualBasisTakesInTheNearestHydrogenicManifold() {
        // Rb nS has a quantum defect near 3.13 (common practice): 50S has n* = 46.9, so the
        // n = 47 manifold, below n - 2, must be in the basis, with one more n on each side.
        assertTrue(Math.abs(RB.level(State.of(50, 0, 1)).effectiveN() - 46.87) < 0.05);
        assertTrue(Arrays.equals(new int[] {46, 51}, StarkMap.principalRangeAround(RB, State.of(50, 0, 1))));
        // Rb 50d5/2 (n* = 48.65) reaches up to n = 52, whose 52p3/2 (n* = 49.36) is its strongest
        // neighbour; n = 48 to 51 left that state out.
        assertTrue(Arrays.equals(new int[] {48, 52}, StarkMap.principalRangeAround(RB, State.of(50, 2, 5))));
        // A high-l state has n* = n: its own n and one below; above, up to the s states within 1
        // of its n* (44s, n* = 40.87).
        assertTrue(Arrays.equals(new int[] {39, 44}, StarkMap.principalRangeAround(RB, State.of(40, 5, 11))));
    }

    /**
     * The usual basis gives the weak-field shift of the polarizability (an independent sum over
     * dipole couplings, {@link PolarizabilityCalculator}) at every m_j, for states whose strongest
     * neighbour lies above round(n*) + 1, within 1 % of the polarizability's size. Rb 50d5/2 at
     * m_j = 1/2, 3/2, 5/2 was -110, -3 and +213 MHz/(V/cm)^2 with n = 48 to 51, where the sum gives
     * -42, +43 and +213 (an error of a third of the size).
     */
    @Test
    void theUsualBasisGivesThePolarizabilityAtEveryProjection() {
        double field = 0.1; // V/m
        for (State s : new State[] {State.of(50, 2, 5), State.of(50, 2, 3), State.of(60, 2, 5), State.of(50, 1, 3),
            State.of(50, 0, 1)}) {
            Polarizability alpha = PolarizabilityCalculator.of(RB).compute(s);
            for (int twoMj = 1; twoMj <= s.twoJ(); twoMj += 2) {
                StarkMap map = StarkMap.builder(RB).projection(twoMj).principalRangeAround(s).build();
                double shift = map.solve(new double[] {field}, s).referenceShiftHz(0);
                double expected = alpha.shiftHz(twoMj, field);
                // within 1 % of the polarizability's size (alpha_0 and alpha_2 nearly cancel at some m_j)
                double scale = 0.5 * (Math.abs(alpha.scalarMHzPerVPerCmSquared())
                        + Math.abs(alpha.tensorMHzPerVPerCmSquared())) * 1e6 * Math.pow(field / 100, 2);
                assertEquals(expected, shift, 0.01 * scale, s.label() + " m_j = " + twoMj + "/2");
            }
        }
    }

    @Test
    void hydrogenLinearStarkEffectInOneManifold() {
        AlkaliAtom h = hydrogen();
        for (int n : new int[] {3, 6, 10}) {
            StarkMap map = StarkMap.builder(h).projection(1).principalRange(n, n).build();
            assertEquals(2 * n - 1, map.size());
            double fieldAu = 1e-7;
            StarkMapResult r = map.solve(new double[] {fieldAu * AtomicUnits.FIELD_V_PER_M}, State.of(n, 0, 1));
            List<Double> expected = new ArrayList<>();
            for (int k = -(n - 1); k <= n - 1; k += 2) {
                expected.add(1.5 * n * k);
            }
            for (int k = -(n - 2); k <= n - 2; k += 2) {
                expected.add(1.5 * n * k);
            }
            double[] want = expected.stream().mapToDouble(Double::doubleValue).sorted().toArray();
            double[] got = r.energiesPerCm(0);
            for (int i = 0; i < got.length; i++) {
                double slope = AtomicUnits.hartreeFromPerCm(got[i] - r.referenceEnergyPerCm()) / fieldAu;
                assertEquals(want[i], slope, 1e-6 * n * n, "n = " + n + ", eigenvalue " + i);
            }
        }
    }

    /** In a basis of several manifolds, the linear slopes of the middle manifold survive (up to F^2 terms). */
    @Test
    void hydrogenSlopesInAWiderBasis() {
        AlkaliAtom h = hydrogen();
        int n = 8;
        StarkMap map = StarkMap.builder(h).projection(1).principalRange(6, 10).build();
        double fieldAu = 1e-9;
        StarkMapResult r = map.solve(new double[] {fieldAu * AtomicUnits.FIELD_V_PER_M}, State.of(n, 0, 1));
        double e8 = r.referenceEnergyPerCm();
        double spacing = AtomicUnits.HARTREE_PER_CM * 1.5 * n * fieldAu;
        double[] slopes = Arrays.stream(r.energiesPerCm(0)).filter(e -> Math.abs(e - e8) < 20 * spacing * n)
                .map(e -> AtomicUnits.hartreeFromPerCm(e - e8) / fieldAu / (1.5 * n)).sorted().toArray();
        assertEquals(2 * n - 1, slopes.length);
        for (double s : slopes) {
            assertEquals(Math.rint(s), s, 1e-3, "slope / (3n/2) must be an integer n1 - n2");
        }
        assertEquals(-(n - 1), slopes[0], 1e-3);
        assertEquals(n - 1, slopes[slopes.length - 1], 1e-3);
    }

    /**
     * Rb 50S in a weak field: the tracked eigenvalue's shift is the second-order -alpha F^2 / 2 of
     * the polarizability (same atom, same n range), and it converges as the basis grows in n and
     * in l.
     */
    @Test
    void rubidiumShiftAgreesWithThePolarizabilityAndConverges() {
        State s = State.of(50, 0, 1);
        double field = 50; // V/m = 0.5 V/cm, far below the first crossing of 50S with a manifold
        double[] shifts = new double[4];
        for (int half = 1; half <= 3; half++) {
            StarkMap map = StarkMap.builder(RB).projection(1).principalRange(50 - half, 50 + half).maxOrbital(10).build();
            shifts[half] = map.solve(new double[] {field}, s).referenceShiftHz(0);
        }
        assertTrue(Math.abs(shifts[3] - shifts[2]) < Math.abs(shifts[2] - shifts[1]), "converging in n");
        assertEquals(shifts[3], shifts[2], 3e-3 * Math.abs(shifts[3]), "n +- 2 against n +- 3");
        double allL = StarkMap.builder(RB).projection(1).principalRange(48, 52).build().solve(new double[] {field}, s)
                .referenceShiftHz(0);
        assertEquals(allL, shifts[2], 1e-4 * Math.abs(allL), "l <= 10 against every l");
        double expected = PolarizabilityCalculator.of(RB).withNeighbourRange(3).compute(s).shiftHz(1, field);
        assertEquals(expected, shifts[3], 0.005 * Math.abs(expected), "second order against the diagonalisation");
    }

    /** The band reduction plus tridiagonal solver gives the dense decomposition's energies and characters. */
    @Test
    void bandedPathAgreesWithTheDenseDecomposition() {
        StarkMap map = StarkMap.builder(RB).projection(3).principalRange(40, 43).build();
        double[] fields = {0, 300, 3000, 30000};
        StarkMapResult band = map.solve(fields, State.of(41, 2, 5));
        StarkMapResult dense = map.solveDense(fields, State.of(41, 2, 5));
        for (int f = 0; f < fields.length; f++) {
            double[] eb = band.energiesPerCm(f);
            double[] ed = dense.energiesPerCm(f);
            double[] cb = band.characters(f);
            double[] cd = dense.characters(f);
            for (int i = 0; i < eb.length; i++) {
                assertEquals(ed[i], eb[i], 1e-9, "field " + fields[f] + ", eigenvalue " + i);
                if (f > 0) { // at zero field degenerate hydrogenic levels may mix differently
                    assertEquals(cd[i], cb[i], 1e-6, "field " + fields[f] + ", character " + i);
                }
            }
        }
    }

    /**
     * The energies-only path (DSTERF) gives the same eigenvalues as the path with characters
     * (DSTEMR) and as the dense decomposition; the number of threads changes nothing; an
     * energies-only result has no characters.
     */
    @Test
    void energiesOnlyAndThreadedSolvesAgree() {
        StarkMap map = StarkMap.builder(RB).projection(1).principalRange(44, 47).build();
        double[] fields = {0, 150, 1500, 15000, 40000};
        State ref = State.of(45, 2, 5);
        StarkMapResult full = map.solve(fields, ref);
        StarkMapResult energies = map.solveEnergies(fields, ref);
        StarkMapResult threaded = map.withThreads(2).solve(fields, ref);
        StarkMapResult dense = map.solveDense(fields, ref);
        assertTrue(full.hasCharacters());
        assertTrue(!energies.hasCharacters());
        assertThrows(IllegalStateException.class, () -> energies.characters(0));
        assertThrows(IllegalStateException.class, () -> energies.referenceShiftHz(0));
        assertThrows(IllegalArgumentException.class, () -> map.withThreads(0));
        assertEquals(2, map.withThreads(2).threads());
        for (int f = 0; f < fields.length; f++) {
            assertTrue(Arrays.equals(full.energiesPerCm(f), threaded.energiesPerCm(f)), "threads change nothing");
            assertTrue(Arrays.equals(full.characters(f), threaded.characters(f)), "threads change nothing");
            double[] e = full.energiesPerCm(f);
            double[] eo = energies.energiesPerCm(f);
            double[] ed = dense.energiesPerCm(f);
            for (int i = 0; i < e.length; i++) {
                assertEquals(ed[i], e[i], 1e-9, "field " + fields[f] + ", eigenvalue " + i);
                assertEquals(ed[i], eo[i], 1e-9, "field " + fields[f] + ", eigenvalue " + i);
            }
        }
    }

    @Test
    void charactersAreSharesOfTheReference() {
        StarkMap map = StarkMap.builder(RB).projection(1).principalRange(48, 51).maxOrbital(10).build();
        StarkMapResult r = map.solve(new double[] {0, 200, 2000}, State.of(50, 0, 1));
        for (int f = 0; f < r.fieldCount(); f++) {
            double sum = Arrays.stream(r.characters(f)).sum();
            assertEquals(1, sum, 1e-9, "the shares of one state over a complete eigenbasis add up to 1");
        }
        assertEquals(1, r.characters(0)[r.strongestIndex(0)], 1e-12);
        assertEquals(0, r.referenceShiftHz(0), 1e-3);
        assertTrue(map.halfBandwidth() < map.size() / 2, "ordered by l, the matrix is banded: " + map.halfBandwidth());
    }

    @Test
    void badInputIsRefused() {
        assertThrows(StarkException.class, () -> StarkMap.builder(RB).build());
        assertThrows(IllegalArgumentException.class, () -> StarkMap.builder(RB).projection(2));
        assertThrows(IllegalArgumentException.class, () -> StarkMap.builder(RB).principalRange(50, 40));
        StarkMap map = StarkMap.builder(RB).principalRange(40, 41).maxOrbital(3).build();
        StarkException e = assertThrows(StarkException.class, () -> map.solve(new double[] {1}, State.of(60, 0, 1)));
        assertEquals(StarkException.BAD_BASIS, e.code());
        assertThrows(IllegalArgumentException.class, () -> map.solve(new double[] {Double.NaN}, State.of(40, 0, 1)));
    }
}
