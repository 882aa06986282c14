package org.ritzwerk.engine.ritz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;

/** Level optimisation on synthetic lines (invented levels: only the method is checked). */
class LevelOptimizerTest {

    /** Invented level energies (cm^-1), the first the ground level. */
    private static final double[] TRUE = {0, 15000.1234, 16100.5678, 22000.25, 24500.75, 30100.5, 33333.333, 40000.125};
    /** Pairs (upper, lower) of the lines measured: every level reached by two lines or more. */
    private static final int[][] PAIRS = {{1, 0}, {2, 0}, {3, 1}, {3, 2}, {4, 1}, {4, 2}, {5, 3}, {5, 4}, {6, 3},
        {6, 4}, {7, 5}, {7, 6}, {5, 0}, {6, 1}, {7, 2}};
    /** Standard uncertainties of the lines, cm^-1. */
    private static final double[] SIGMA = {0.002, 0.003, 0.001, 0.004, 0.002, 0.002, 0.005, 0.001, 0.003, 0.002,
        0.002, 0.004, 0.01, 0.003, 0.002};

    private static String label(int i) {
        return "L" + i;
    }

    private static MeasuredLines.Builder noisy(Random r, double[] truth) {
        MeasuredLines.Builder b = MeasuredLines.builder(label(0), 0);
        for (int k = 0; k < PAIRS.length; k++) {
            int u = PAIRS[k][0];
            int l = PAIRS[k][1];
            b.add(label(u), label(l), truth[u] - truth[l] + SIGMA[k] * r.nextGaussian(), SIGMA[k]);
        }
        return b;
    }

    @Test
    void recoversTheSeededLevels() {
        LevelOptimum fit = LevelOptimizer.defaults().optimize(noisy(new Random(21), TRUE).build());
        assertEquals(PAIRS.length - (TRUE.length - 1), fit.degreesOfFreedom());
        for (int i = 0; i < TRUE.length; i++) {
            int at = fit.levelLabels().indexOf(label(i));
            double error = fit.energyPerCm(at) - TRUE[i];
            assertTrue(Math.abs(error) <= 4 * Math.max(fit.uncertaintyPerCm(at), 1e-12),
                    label(i) + ": error " + error + " for sigma " + fit.uncertaintyPerCm(at));
        }
        assertEquals(0.0, fit.uncertaintyPerCm(0), 0.0, "the reference is held");
        // Ritz uncertainties are never larger than the measured ones
        for (int k = 0; k < PAIRS.length; k++) {
            assertTrue(fit.ritzUncertaintyPerCm(k) <= SIGMA[k] * (1 + 1e-12));
        }
        // no lines at all: the library's own refusal, not a linear-algebra exception from inside
        RitzException none = assertThrows(RitzException.class,
                () -> LevelOptimizer.defaults().optimize(MeasuredLines.builder("a", 0).build()));
        assertEquals(RitzException.TOO_FEW, none.code());
    }

    @Test
    void theStatedUncertaintiesCoverTheErrorsAtTheRightRate() {
        Random r = new Random(2011);
        int trials = 500;
        int within = 0;
        int count = 0;
        double sumSquares = 0;
        double ritzSquares = 0;
        int ritzCount = 0;
        for (int t = 0; t < trials; t++) {
            LevelOptimum fit = LevelOptimizer.defaults().optimize(noisy(r, TRUE).build());
            for (int i = 1; i < TRUE.length; i++) {
                int at = fit.levelLabels().indexOf(label(i));
                double pull = (fit.energyPerCm(at) - TRUE[i]) / fit.uncertaintyPerCm(at);
                sumSquares += pull * pull;
                within += Math.abs(pull) <= 1.96 ? 1 : 0;
                count++;
            }
            for (int k = 0; k < PAIRS.length; k++) {
                double pull = (fit.ritzPerCm(k) - (TRUE[PAIRS[k][0]] - TRUE[PAIRS[k][1]])) / fit.ritzUncertaintyPerCm(k);
                ritzSquares += pull * pull;
                ritzCount++;
            }
        }
        double rms = Math.sqrt(sumSquares / count);
        double coverage = within / (double) count;
        // 3500 pulls: the rms of unit normals is 1 within about 0.012 (one sigma), coverage 0.95 within 0.004
        assertEquals(1.0, rms, 0.05, "rms of the level pulls");
        assertEquals(0.95, coverage, 0.015, "share within 1.96 sigma");
        assertEquals(1.0, Math.sqrt(ritzSquares / ritzCount), 0.05, "rms of the Ritz-wavenumber pulls");
    }

    @Test
    void aMisassignedLineIsFlagged() {
        MeasuredLines.Builder b = noisy(new Random(7), TRUE);
        // a line of L6 - L3 written down as L7 - L3: it lies 6666.8 cm^-1 away from where L7 - L3 is
        b.add(label(7), label(3), TRUE[6] - TRUE[3], 0.002, "misassigned");
        // and a second, honest measurement of L7 - L3 so the wrong one is not alone
        b.add(label(7), label(3), TRUE[7] - TRUE[3] + 0.001, 0.002, "honest");
        MeasuredLines problem = b.build();
        LevelOptimum fit = LevelOptimizer.defaults().optimize(problem);
        int worst = -1;
        for (int k = 0; k < problem.size(); k++) {
            if (worst < 0 || Math.abs(fit.standardisedResidual(k).orElse(0))
                    > Math.abs(fit.standardisedResidual(worst).orElse(0))) {
                worst = k;
            }
        }
        assertEquals("misassigned", problem.name(worst));
        assertEquals(LevelOptimum.LineFlag.OUTLIER, fit.flag(worst));
        // the same system without it: nothing flagged at a looser threshold of 4 sigma
        LevelOptimum clean = LevelOptimizer.defaults().withOutlierThreshold(4)
                .optimize(noisy(new Random(7), TRUE).build());
        for (int k = 0; k < PAIRS.length; k++) {
            assertEquals(LevelOptimum.LineFlag.FITTED, clean.flag(k), "line " + k);
        }
    }

    @Test
    void aLevelReachedByOneLineIsMarkedAndUnconnectedLevelsAreRefused() {
        MeasuredLines.Builder b = noisy(new Random(3), TRUE);
        b.add("lonely", label(2), 1234.5, 0.01, "only line");
        LevelOptimum fit = LevelOptimizer.defaults().optimize(b.build());
        int k = PAIRS.length;
        assertEquals(LevelOptimum.LineFlag.DETERMINES_LEVEL, fit.flag(k));
        assertTrue(fit.standardisedResidual(k).isEmpty());
        assertEquals(0.0, fit.residualPerCm(k), 1e-9);
        int lonely = fit.levelLabels().indexOf("lonely");
        assertEquals(TRUE[2] + 1234.5, fit.energyPerCm(lonely), 0.05);

        MeasuredLines.Builder island = noisy(new Random(3), TRUE);
        island.add("A", "B", 100, 0.01).add("C", "B", 200, 0.01);
        RitzException e = assertThrows(RitzException.class, () -> LevelOptimizer.defaults().optimize(island.build()));
        assertEquals(RitzException.UNCONNECTED, e.code());
        assertTrue(e.getMessage().contains("'A', 'B', 'C'") && e.getMessage().contains("'L0'"), e.getMessage());
        RitzException same = assertThrows(RitzException.class,
                () -> MeasuredLines.builder("g", 0).add("x", "x", 1, 1, "lines.csv:4"));
        assertTrue(same.getMessage().startsWith("lines.csv:4: "), same.getMessage());
        assertThrows(RitzException.class, () -> MeasuredLines.builder("g", 0).add("x", "g", 1, 0));
        assertThrows(RitzException.class, () -> MeasuredLines.builder("g", 0).add("x", "g", Double.NaN, 1));
    }

    @Test
    void theOptimisedLevelsGiveRitzLinesWithTheirCorrelations() {
        LevelOptimum fit = LevelOptimizer.defaults().optimize(noisy(new Random(11), TRUE).build());
        RitzLevels levels = fit.levels(Species.parse("Fe I"));
        assertTrue(levels.hasCovariance());
        List<Double> ratio = new ArrayList<>();
        for (int k = 0; k < PAIRS.length; k++) {
            int u = levels.indexOf(label(PAIRS[k][0]));
            int l = levels.indexOf(label(PAIRS[k][1]));
            assertEquals(fit.ritzUncertaintyPerCm(k), levels.differenceSigma(u, l), 1e-15);
            ratio.add(levels.differenceSigma(u, l) / Math.hypot(fit.uncertaintyPerCm(u), fit.uncertaintyPerCm(l)));
        }
        assertTrue(ratio.stream().anyMatch(x -> Math.abs(x - 1) > 0.05), "correlations matter for some line");
        // a reference that is not the lowest level leaves levels below 0: no level list from that
        MeasuredLines.Builder above = MeasuredLines.builder(label(3), 0);
        for (int k = 0; k < PAIRS.length; k++) {
            above.add(label(PAIRS[k][0]), label(PAIRS[k][1]), TRUE[PAIRS[k][0]] - TRUE[PAIRS[k][1]], SIGMA[k]);
        }
        LevelOptimum shifted = LevelOptimizer.defaults().optimize(above.build());
        RitzException below = assertThrows(RitzException.class, () -> shifted.levels(Species.parse("Fe I")));
        assertTrue(below.getMessage().contains("below the ground level"), below.getMessage());
    }
}
