package org.ritzwerk.engine.stark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.reflect.Field;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.internal.units.AtomicUnits;
import org.ritzwerk.engine.rydberg.TestAtoms;

/**
 * The two routes to the shares of the eigenstates in a window, on the tridiagonal matrices of a Rb
 * Stark map (n = 43 to 46, every l, m_j = 1/2) at many fields: inverse iteration from the DSTERF
 * eigenvalues (DSTEIN) against DSTEMR over the index range, to 1e-9; DSTEIN declines at zero field
 * (the matrix splits) and for a window of more vectors than it is used for.
 */
class WindowedSharesTest {

    @Test
    void inverseIterationAgreesWithDstemrOverTheWindow() throws ReflectiveOperationException {
        StarkMap map = StarkMap.builder(TestAtoms.rubidium()).projection(1).principalRange(43, 46).build();
        int n = map.size();
        int ref = map.indexOf(State.of(45, 2, 5));
        double[] perCm = field(map, "energiesPerCm");
        int[] rows = field(map, "rows");
        int[] columns = field(map, "columns");
        double[] values = field(map, "values");
        double[] diagonal = new double[n];
        for (int i = 0; i < n; i++) {
            diagonal[i] = AtomicUnits.hartreeFromPerCm(perCm[i] - perCm[ref]);
        }
        BandReduction workspace = new BandReduction(n, map.halfBandwidth());
        int used = 0;
        int vectors = 0;
        for (int step = 0; step <= 60; step++) {
            double fieldVPerM = 700.0 * step;               // 0 to 42 kV/m: past 45D's first crossings
            double[] tracked = new double[n];
            tracked[ref] = 1;
            workspace.load(diagonal, rows, columns, values, fieldVPerM / AtomicUnits.FIELD_V_PER_M, tracked).reduce();
            double[] d = workspace.diagonal();
            double[] off = workspace.offDiagonal();
            double[] e = TridiagonalEigen.eigenvalues(d.clone(), off.clone());
            int first = -1;
            int last = -2;
            for (int i = 0; i < n; i++) {
                double hz = StarkMapResult.relativeHz(e[i] * AtomicUnits.HARTREE_PER_CM, 0);
                if (Math.abs(hz) <= 25e9) {
                    first = first < 0 ? i : first;
                    last = i;
                }
            }
            double[] byInverse = TridiagonalEigen.sharesByInverseIteration(d, off, tracked, e, first, last);
            if (step == 0) {
                assertNull(byInverse, "at zero field the matrix splits; DSTEMR gives the shares");
                continue;
            }
            assertNotNull(byInverse, "field " + fieldVPerM + " V/m");
            double[] byDstemr = TridiagonalEigen.sharesOfIndexRange(d, off, tracked, first, last);
            assertEquals(byDstemr.length, byInverse.length);
            for (int i = 0; i < byDstemr.length; i++) {
                assertEquals(byDstemr[i], byInverse[i], 1e-9, "field " + fieldVPerM + " V/m, eigenstate " + (first + i));
            }
            used++;
            vectors += byInverse.length;
            if (step == 30) {
                assertNull(TridiagonalEigen.sharesByInverseIteration(d, off, tracked, e, 0,
                        TridiagonalEigen.MAX_INVERSE_ITERATION_VECTORS), "a run of more vectors goes to DSTEMR");
            }
        }
        assertEquals(60, used);
        assertTrue(vectors > 60 * 10, vectors + " vectors compared");
    }

    @SuppressWarnings("unchecked")
    private static <T> T field(StarkMap map, String name) throws ReflectiveOperationException {
        Field f = StarkMap.class.getDeclaredField(name);
        f.setAccessible(true);
        return (T) f.get(map);
    }
}
