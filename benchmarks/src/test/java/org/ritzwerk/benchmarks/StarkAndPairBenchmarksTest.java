package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.stark.StarkMapResult;

/** The engine paths and the naive baselines of the Stark-map and C6 benchmarks agree. No timing here. */
class StarkAndPairBenchmarksTest {

    @Test
    void bandedAndDenseMapsAgree() {
        StarkMapBenchmark b = new StarkMapBenchmark();
        b.nMax = 61;
        b.fields = 2;
        b.threads = 2;
        b.windowGHz = 20;
        b.setUp();
        StarkMapResult banded = b.banded();
        StarkMapResult windowed = b.bandedWindowed();
        StarkMapResult energies = b.bandedEnergies();
        StarkMapResult dense = b.naiveDense();
        for (int f = 0; f < 2; f++) {
            double[] e1 = banded.energiesPerCm(f);
            double[] e2 = dense.energiesPerCm(f);
            double[] e3 = energies.energiesPerCm(f);
            double[] c1 = banded.characters(f);
            double[] c2 = dense.characters(f);
            double[] e4 = windowed.energiesPerCm(f);
            double[] hz = windowed.energiesRelativeHz(f);
            int shared = 0;
            for (int i = 0; i < e1.length; i++) {
                assertEquals(e2[i], e1[i], 1e-9);
                assertEquals(e2[i], e3[i], 1e-9);
                assertEquals(e2[i], e4[i], 1e-9);
                assertEquals(c2[i], c1[i], 1e-6);
                assertEquals(Math.abs(hz[i]) <= 20e9, windowed.hasShare(f, i));
                if (windowed.hasShare(f, i)) {
                    assertEquals(c2[i], windowed.share(f, i), 1e-6);
                    shared++;
                }
            }
            assertTrue(shared > 0 && shared < e1.length, shared + " of " + e1.length + " in the window");
        }
    }

    @Test
    void oneCoreMapAndItsDenseBaselineAgree() {
        StarkMapOneCoreBenchmark b = new StarkMapOneCoreBenchmark();
        b.nMax = 61;
        b.fields = 2;                     // 250 and 500 V/m; the baseline solves 250 V/m
        b.windowGHz = 20;
        b.setUp();
        StarkMapResult energies = b.energies();
        StarkMapResult windowed = b.windowed();
        StarkMapResult dense = b.naiveDenseOneField();
        assertEquals(2, energies.fieldCount());
        assertEquals(2, windowed.fieldCount());
        assertEquals(250, dense.fieldsVPerM()[0]);
        assertEquals(250, energies.fieldsVPerM()[0]);
        double[] ed = dense.energiesPerCm(0);
        double[] ee = energies.energiesPerCm(0);
        double[] ew = windowed.energiesPerCm(0);
        double[] cd = dense.characters(0);
        int shared = 0;
        for (int i = 0; i < ed.length; i++) {
            assertEquals(ed[i], ee[i], 1e-9);
            assertEquals(ed[i], ew[i], 1e-9);
            if (windowed.hasShare(0, i)) {
                assertEquals(cd[i], windowed.share(0, i), 1e-6);
                shared++;
            }
        }
        assertTrue(shared > 0 && shared < ed.length, shared + " of " + ed.length + " in the window");
    }

    @Test
    void engineAndNaiveC6Agree() {
        PairC6Benchmark b = new PairC6Benchmark();
        b.n = 70;
        b.setUp();
        double engine = b.engine();
        assertEquals(engine, b.naive(), 1e-9 * Math.abs(engine));
    }
}
