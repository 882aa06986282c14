package org.ritzwerk.engine.stark;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.TestAtoms;

/**
 * A Stark map solved with a share window ({@link StarkMap#withShareWindowHz}) against the same map
 * solved with every share: the same energies (to 1e-9 cm^-1) and, in the window, the same shares (to
 * 1e-9); outside the window no share, said plainly.
 */
class StarkMapShareWindowTest {

    private static final AlkaliAtom RB = TestAtoms.rubidium();
    private static final State REFERENCE = State.of(45, 2, 5);
    /** Fields, V/m: zero, then weak to past the first crossings of 45D with the n = 42 manifold. */
    private static final double[] FIELDS = {0, 150, 1500, 15000, 40000};

    private static StarkMap map() {
        return StarkMap.builder(RB).projection(1).principalRange(43, 46).build();
    }

    @Test
    void windowedEnergiesAndSharesEqualTheFullSolve() {
        StarkMap map = map();
        double lower = -30e9;
        double upper = 20e9;
        StarkMapResult full = map.solve(FIELDS, REFERENCE);
        StarkMap windowedMap = map.withShareWindowHz(lower, upper);
        StarkMapResult windowed = windowedMap.solve(FIELDS, REFERENCE);
        assertTrue(windowedMap.hasShareWindow());
        assertFalse(map.hasShareWindow());
        assertEquals(lower, windowed.shareWindowLowerHz());
        assertEquals(upper, windowed.shareWindowUpperHz());
        assertTrue(windowed.hasShareWindow());
        assertFalse(windowed.hasCharacters(), "a windowed result does not have every character");
        int sharedSomewhere = 0;
        int unsharedSomewhere = 0;
        for (int f = 0; f < FIELDS.length; f++) {
            double[] ef = full.energiesPerCm(f);
            double[] ew = windowed.energiesPerCm(f);
            double[] hz = windowed.energiesRelativeHz(f);
            double[] cf = full.characters(f);
            assertEquals(ef.length, ew.length);
            int[] shared = windowed.sharedIndices(f);
            int k = 0;
            for (int i = 0; i < ew.length; i++) {
                assertEquals(ef[i], ew[i], 1e-9, "field " + FIELDS[f] + " V/m, eigenvalue " + i);
                boolean inside = hz[i] >= lower && hz[i] <= upper;
                assertEquals(inside, windowed.hasShare(f, i), "field " + FIELDS[f] + ", eigenstate " + i + " at "
                        + hz[i] + " Hz");
                if (inside) {
                    assertEquals(i, shared[k++], "shared indices list the eigenstates in the window");
                    sharedSomewhere++;
                    if (f > 0) { // at zero field degenerate hydrogenic levels may mix differently
                        assertEquals(cf[i], windowed.share(f, i), 1e-9, "field " + FIELDS[f] + ", share " + i);
                    }
                } else {
                    unsharedSomewhere++;
                    int state = i;
                    int field = f;
                    IllegalStateException e = assertThrows(IllegalStateException.class,
                            () -> windowed.share(field, state));
                    assertTrue(e.getMessage().contains("outside the share window"), e.getMessage());
                }
            }
            assertEquals(shared.length, k);
            double outside = 0;
            for (int i = 0; i < cf.length; i++) {
                if (!windowed.hasShare(f, i)) {
                    outside += cf[i];
                }
            }
            assertEquals(outside, windowed.shareOutsideWindow(f), 1e-9, "field " + FIELDS[f]);
        }
        assertTrue(sharedSomewhere > 10 && unsharedSomewhere > 100, sharedSomewhere + " shared, " + unsharedSomewhere
                + " not: the window must cut the basis for the test to mean anything");
        // In weak fields 45D's weight lies in one eigenstate in the window, found as the strongest; in
        // strong fields (past the crossings with the n = 42 and 44 manifolds) it spreads beyond the
        // window, and the result refuses to name a strongest eigenstate rather than guess.
        int found = 0;
        for (int f = 0; f < FIELDS.length; f++) {
            int field = f;
            double inside = 0;
            for (int i : windowed.sharedIndices(f)) {
                inside = Math.max(inside, windowed.share(f, i));
            }
            if (inside >= windowed.shareOutsideWindow(f)) {
                assertEquals(full.strongestIndex(f), windowed.strongestIndex(f), "field " + FIELDS[f]);
                assertEquals(full.referenceShiftHz(f), windowed.referenceShiftHz(f), 30,
                        "field " + FIELDS[f] + " (1e-9 cm^-1 = 30 Hz)");
                found++;
            } else {
                IllegalStateException e = assertThrows(IllegalStateException.class,
                        () -> windowed.strongestIndex(field));
                assertTrue(e.getMessage().contains("widen the window"), e.getMessage());
            }
        }
        assertTrue(found >= 2, "45D is the strongest in the window at 0 and 1.5 V/cm, found at " + found + " fields");
    }

    @Test
    void aWindowOverEveryStateGivesEveryShare() {
        StarkMap map = map();
        StarkMapResult full = map.solve(FIELDS, REFERENCE);
        StarkMapResult all = map.withShareWindowHz(-1e16, 1e16).solve(FIELDS, REFERENCE);
        for (int f = 1; f < FIELDS.length; f++) {
            double[] cf = full.characters(f);
            assertEquals(cf.length, all.sharedIndices(f).length);
            for (int i = 0; i < cf.length; i++) {
                assertEquals(cf[i], all.share(f, i), 1e-9, "field " + FIELDS[f] + ", share " + i);
            }
            assertEquals(0, all.shareOutsideWindow(f), 1e-9);
        }
    }

    @Test
    void outsideTheWindowNoShareIsGivenAndNoneIsGuessed() {
        StarkMap map = map();
        // A window far above the reference: 45D is not in it, so its character is not computed.
        // At 0 and 1.5 V/cm (fields below the first crossing of 45D with a manifold) nearly all of
        // 45D lies outside.
        StarkMapResult r = map.withShareWindowHz(100e9, 200e9).solve(new double[] {0, 150}, REFERENCE);
        for (int f = 0; f < r.fieldCount(); f++) {
            assertTrue(r.shareOutsideWindow(f) > 0.99, "45D's weight lies outside: " + r.shareOutsideWindow(f));
            int field = f;
            IllegalStateException e = assertThrows(IllegalStateException.class, () -> r.strongestIndex(field));
            assertTrue(e.getMessage().contains("widen the window") || e.getMessage().contains("no eigenstate"),
                    e.getMessage());
            assertThrows(IllegalStateException.class, () -> r.referenceShiftHz(field));
        }
        IllegalStateException all = assertThrows(IllegalStateException.class, () -> r.characters(0));
        assertTrue(all.getMessage().contains("share window"), all.getMessage());
        // A window between two zero-field levels holds no eigenstate at zero field.
        StarkMapResult empty = map.withShareWindowHz(1, 2).solve(new double[] {0}, REFERENCE);
        assertEquals(0, empty.sharedIndices(0).length);
        assertEquals(1, empty.shareOutsideWindow(0), 1e-12);
        assertThrows(IllegalStateException.class, () -> empty.strongestIndex(0));
        for (int i = 0; i < empty.energiesPerCm(0).length; i++) {
            assertFalse(empty.hasShare(0, i));
        }
        assertThrows(IndexOutOfBoundsException.class, () -> empty.hasShare(0, map.size()));
        assertThrows(IndexOutOfBoundsException.class, () -> empty.hasShare(1, 0));
    }

    @Test
    void threadsChangeNothingAndTheWindowIsKept() {
        StarkMap windowed = map().withShareWindowHz(-25e9, 25e9);
        StarkMap threaded = windowed.withThreads(2);
        assertTrue(threaded.hasShareWindow());
        assertEquals(-25e9, threaded.shareWindowLowerHz());
        assertEquals(25e9, threaded.shareWindowUpperHz());
        StarkMapResult one = windowed.solve(FIELDS, REFERENCE);
        StarkMapResult two = threaded.solve(FIELDS, REFERENCE);
        for (int f = 0; f < FIELDS.length; f++) {
            assertArrayEquals(one.energiesPerCm(f), two.energiesPerCm(f));
            assertArrayEquals(one.sharedIndices(f), two.sharedIndices(f));
            for (int i : one.sharedIndices(f)) {
                assertEquals(one.share(f, i), two.share(f, i), 0.0);
            }
        }
        StarkMap plain = threaded.withoutShareWindow();
        assertFalse(plain.hasShareWindow());
        assertThrows(IllegalStateException.class, plain::shareWindowLowerHz);
        assertTrue(plain.solve(FIELDS, REFERENCE).hasCharacters());
    }

    @Test
    void energiesOnlyAndDenseSolvesIgnoreTheWindow() {
        StarkMap map = map();
        StarkMap windowed = map.withShareWindowHz(-5e9, 5e9);
        double[] fields = {1500};
        StarkMapResult energies = windowed.solveEnergies(fields, REFERENCE);
        assertFalse(energies.hasCharacters());
        assertFalse(energies.hasShareWindow());
        assertFalse(energies.hasShare(0, 0));
        assertThrows(IllegalStateException.class, () -> energies.share(0, 0));
        assertThrows(IllegalStateException.class, () -> energies.sharedIndices(0));
        StarkMapResult dense = windowed.solveDense(fields, REFERENCE);
        assertTrue(dense.hasCharacters());
        assertEquals(map.size(), dense.sharedIndices(0).length);
        assertTrue(Arrays.stream(dense.characters(0)).sum() > 0.999);
    }

    @Test
    void badWindowsAreRefusedWithTheReason() {
        StarkMap map = map();
        assertRefused(() -> map.withShareWindowHz(5e9, -5e9), "must be below its upper edge");
        assertRefused(() -> map.withShareWindowHz(1e9, 1e9), "must be below its upper edge");
        assertRefused(() -> map.withShareWindowHz(Double.NaN, 1e9), "lower edge must be a finite frequency");
        assertRefused(() -> map.withShareWindowHz(-1e9, Double.NaN), "upper edge must be a finite frequency");
        assertRefused(() -> map.withShareWindowHz(Double.NEGATIVE_INFINITY, 1e9), "lower edge must be a finite");
        assertRefused(() -> map.withShareWindowHz(-1e9, Double.POSITIVE_INFINITY), "upper edge must be a finite");
        assertThrows(IllegalStateException.class, map::shareWindowUpperHz);
    }

    private static void assertRefused(org.junit.jupiter.api.function.Executable call, String reason) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call);
        assertTrue(e.getMessage().contains(reason), e.getMessage());
        assertFalse(e.getMessage().contains("NaN") || e.getMessage().contains("Infinity"), e.getMessage());
    }
}
