package org.ritzwerk.engine.ritz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.testing.Golden;

/**
 * Level optimisation of systems of levels that no measured line joins ({@link
 * LevelOptimizer#withSeparateSystems}): invented levels, only the method is checked.
 */
class LevelSystemsTest {

    /** Invented energies, cm^-1: the A levels joined to A0 (held at 0), the B levels only among themselves. */
    private static final double[] A = {0, 15000.1234, 16100.5678, 22000.25, 24500.75};
    private static final double[] B = {20000.0, 21234.5678, 23456.789, 26000.125, 27500.5};
    /** Lines (upper, lower) within A and within B; none between. */
    private static final int[][] A_PAIRS = {{1, 0}, {2, 0}, {3, 1}, {3, 2}, {4, 1}, {4, 2}, {3, 0}, {4, 0}};
    private static final int[][] B_PAIRS = {{3, 2}, {1, 0}, {2, 0}, {2, 1}, {3, 1}, {4, 2}, {4, 3}, {4, 0}};
    private static final double[] A_SIGMA = {0.002, 0.003, 0.001, 0.004, 0.002, 0.002, 0.005, 0.003};
    private static final double[] B_SIGMA = {0.003, 0.002, 0.001, 0.004, 0.002, 0.003, 0.001, 0.005};

    private static MeasuredLines noisy(Random r) {
        MeasuredLines.Builder b = MeasuredLines.builder("A0", 0);
        for (int k = 0; k < A_PAIRS.length; k++) {
            int u = A_PAIRS[k][0];
            int l = A_PAIRS[k][1];
            b.add("A" + u, "A" + l, A[u] - A[l] + A_SIGMA[k] * r.nextGaussian(), A_SIGMA[k]);
        }
        for (int k = 0; k < B_PAIRS.length; k++) {
            int u = B_PAIRS[k][0];
            int l = B_PAIRS[k][1];
            b.add("B" + u, "B" + l, B[u] - B[l] + B_SIGMA[k] * r.nextGaussian(), B_SIGMA[k]);
        }
        return b.build();
    }

    private static double truth(String label) {
        int i = label.charAt(1) - '0';
        return label.charAt(0) == 'A' ? A[i] : B[i];
    }

    @Test
    void agreesWithAnIndependentWeightedLeastSquaresFitOfEachSystem() {
        // golden/level-systems-*.csv: each system fitted on its own by scipy.linalg.lstsq, covariance
        // numpy.linalg.inv(A^T W A), made by make_level_systems_golden.py; tolerances from its header
        double energyTolerance = Golden.absoluteTolerance("level-systems-fit.csv", "energy");
        double uTolerance = Golden.tolerance("level-systems-fit.csv", "uncertainty");
        double chi2Tolerance = Golden.tolerance("level-systems-fit.csv", "chi2");
        MeasuredLines.Builder b = MeasuredLines.builder("A0", 0);
        for (Map<String, String> row : Golden.rows("level-systems-lines.csv")) {
            b.add(row.get("upper"), row.get("lower"), Double.parseDouble(row.get("wavenumber_per_cm")),
                    Double.parseDouble(row.get("uncertainty_per_cm")));
        }
        MeasuredLines problem = b.build();
        Map<String, List<SystemReference>> cases = Map.of("floating", List.of(),
                "named", List.of(SystemReference.floating("B2")),
                "anchored", List.of(SystemReference.at("B0", 20000.0, 0.05)));
        int checked = 0;
        for (Map.Entry<String, List<SystemReference>> c : cases.entrySet()) {
            LevelOptimum fit = LevelOptimizer.defaults().withSeparateSystems(c.getValue()).optimize(problem);
            assertEquals(2, fit.systems().size());
            LevelOptimum.LevelSystem main = fit.systems().get(0);
            LevelOptimum.LevelSystem other = fit.systems().get(1);
            assertEquals(LevelOptimum.Standing.MAIN, main.standing());
            assertEquals("A0", main.reference());
            assertEquals(c.getKey().equals("anchored") ? LevelOptimum.Standing.ANCHORED
                    : LevelOptimum.Standing.FLOATING, other.standing());
            assertEquals(c.getKey().equals("named") ? "B2" : "B0", other.reference(), c.getKey());
            assertEquals(!c.getKey().equals("floating"), other.named());
            // 16 lines, 10 levels, one held in each system (the first B level named is B3, not the lowest)
            assertEquals(16 - (10 - 2), fit.degreesOfFreedom());
            assertEquals(8 - 4, other.degreesOfFreedom());
            for (Map<String, String> row : Golden.rows("level-systems-fit.csv")) {
                if (!row.get("case").equals(c.getKey())) {
                    continue;
                }
                String name = row.get("name");
                double value = Double.parseDouble(row.get("value"));
                int system = Integer.parseInt(row.get("system")) - 1;
                switch (row.get("kind")) {
                    case "level" -> {
                        int i = fit.levelLabels().indexOf(name);
                        assertEquals(system, fit.systemOf(i), name);
                        assertEquals(system == 0 || c.getKey().equals("anchored"), fit.isAbsolute(i), name);
                        assertEquals(value, fit.energyPerCm(i), energyTolerance, c.getKey() + " " + name);
                        double u = Double.parseDouble(row.get("uncertainty"));
                        assertEquals(u, fit.uncertaintyPerCm(i), uTolerance * u, c.getKey() + " " + name);
                    }
                    case "chi2" -> assertEquals(value, fit.systems().get(system).chiSquare(), chi2Tolerance * value,
                            c.getKey() + " " + name);
                    case "ritz" -> {
                        int k = Integer.parseInt(name) - 1;
                        assertEquals(value, fit.ritzPerCm(k), energyTolerance, c.getKey() + " line " + name);
                        double u = Double.parseDouble(row.get("uncertainty"));
                        assertEquals(u, fit.ritzUncertaintyPerCm(k), uTolerance * u, c.getKey() + " line " + name);
                    }
                    default -> throw new AssertionError(row.toString());
                }
                checked++;
            }
            double[][] v = fit.covariance();
            for (int i = 0; i < v.length; i++) {
                for (int j = 0; j < v.length; j++) {
                    if (fit.systemOf(i) != fit.systemOf(j)) {
                        assertEquals(0.0, v[i][j], 0.0, "no covariance between systems");
                    }
                }
            }
            assertEquals(main.chiSquare() + other.chiSquare(), fit.chiSquare(), 1e-12 * fit.chiSquare());
        }
        assertEquals(3 * (10 + 2 + 16), checked);
    }

    @Test
    void levelDifferencesWithinEachSystemHaveHonestUncertainties() {
        Random r = new Random(4242);
        int trials = 2000;
        double floatingSquares = 0;
        double mainSquares = 0;
        double ritzSquares = 0;
        double anchoredSquares = 0;
        int floatingCount = 0;
        int mainCount = 0;
        int ritzCount = 0;
        int anchoredCount = 0;
        double anchorU = 0.004;
        // no line left out (threshold 1e9): this checks the covariance of each system's fit; leaving outliers
        // out (LevelOptimizerTest) widens the pulls a little (measured here: 1.042, 1.023, 1.025 for the main,
        // floating and Ritz pulls below with the default threshold of 3, against 1.025, 1.011, 1.012 without)
        LevelOptimizer optimizer = LevelOptimizer.defaults().withOutlierThreshold(1e9);
        for (int t = 0; t < trials; t++) {
            MeasuredLines problem = noisy(r);
            LevelOptimum fit = optimizer.withSeparateSystems(List.of()).optimize(problem);
            // the anchor's energy as another measurement would give it: the truth plus its own noise
            double anchor = B[0] + anchorU * r.nextGaussian();
            LevelOptimum anchored = optimizer
                    .withSeparateSystems(List.of(SystemReference.at("B0", anchor, anchorU))).optimize(problem);
            assertEquals("B0", fit.systems().get(1).reference(), "the lowest B level floats the system");
            for (int i = 0; i < fit.levelLabels().size(); i++) {
                String label = fit.levelLabels().get(i);
                if (label.equals("A0") || label.equals("B0")) {
                    assertEquals(0.0, fit.uncertaintyPerCm(i), 0.0);
                    continue;
                }
                if (label.startsWith("A")) {
                    double pull = (fit.energyPerCm(i) - truth(label)) / fit.uncertaintyPerCm(i);
                    mainSquares += pull * pull;
                    mainCount++;
                } else {
                    // relative to B0: E = value + x with x = E(B0)
                    double pull = (fit.energyPerCm(i) - (truth(label) - B[0])) / fit.uncertaintyPerCm(i);
                    floatingSquares += pull * pull;
                    floatingCount++;
                }
            }
            for (int i = 0; i < anchored.levelLabels().size(); i++) {
                String label = anchored.levelLabels().get(i);
                if (label.startsWith("B")) {
                    double pull = (anchored.energyPerCm(i) - truth(label)) / anchored.uncertaintyPerCm(i);
                    anchoredSquares += pull * pull;
                    anchoredCount++;
                    // closed form: the anchor's variance adds to the relative one (independent sources)
                    double relative = fit.uncertaintyPerCm(fit.levelLabels().indexOf(label));
                    assertEquals(relative * relative + anchorU * anchorU,
                            anchored.uncertaintyPerCm(i) * anchored.uncertaintyPerCm(i), 1e-12, label);
                }
            }
            for (int k = 0; k < problem.size(); k++) {
                double pull = (fit.ritzPerCm(k) - (truth(problem.levels().get(problem.upper(k)))
                        - truth(problem.levels().get(problem.lower(k))))) / fit.ritzUncertaintyPerCm(k);
                ritzSquares += pull * pull;
                ritzCount++;
                // the anchor changes no line: Ritz wavenumbers and uncertainties are differences within a system
                assertEquals(fit.ritzPerCm(k), anchored.ritzPerCm(k), 1e-9);
                assertEquals(fit.ritzUncertaintyPerCm(k), anchored.ritzUncertaintyPerCm(k),
                        1e-9 * fit.ritzUncertaintyPerCm(k));
            }
        }
        // 8000 pulls each (10000 anchored, 32000 Ritz), correlated within a trial: the rms of unit normals is 1
        // within about 1/sqrt(2 N) for N independent ones, 0.016 at N = 2000 trials (one sigma); 0.05 allowed,
        // as in LevelOptimizerTest (measured: 1.025, 1.011, 0.999, 1.012)
        assertEquals(1.0, Math.sqrt(mainSquares / mainCount), 0.05, "rms pull of the main system");
        assertEquals(1.0, Math.sqrt(floatingSquares / floatingCount), 0.05, "rms pull of the floating differences");
        assertEquals(1.0, Math.sqrt(anchoredSquares / anchoredCount), 0.05, "rms pull of the anchored energies");
        assertEquals(1.0, Math.sqrt(ritzSquares / ritzCount), 0.05, "rms pull of the Ritz wavenumbers");
    }

    @Test
    void withoutTheOptionSeparateSystemsAreRefusedNamingIt() {
        MeasuredLines problem = noisy(new Random(1));
        RitzException e = assertThrows(RitzException.class, () -> LevelOptimizer.defaults().optimize(problem));
        assertEquals(RitzException.UNCONNECTED, e.code());
        assertTrue(e.getMessage().contains("5 levels are not connected to the reference level 'A0'")
                && e.getMessage().contains("'B3', 'B2', 'B1', 'B0', 'B4'")
                && e.getMessage().contains("withSeparateSystems"), e.getMessage());
        assertFalse(LevelOptimizer.defaults().separateSystems());
        assertTrue(LevelOptimizer.defaults().withSeparateSystems(List.of()).separateSystems());
    }

    @Test
    void badSystemReferencesAreRefusedNamingTheLabel() {
        MeasuredLines problem = noisy(new Random(2));
        for (Object[] bad : new Object[][] {
            {List.of(SystemReference.floating("C9")), "system reference 'C9' is not a level of any measured line"},
            {List.of(SystemReference.at("A3", 22000, 0.1)), "system reference 'A3' is joined by lines to the "
                    + "reference level 'A0'"},
            {List.of(SystemReference.floating("B1"), SystemReference.at(" B4 ", 27500, 0.1)),
                "system references 'B1' and 'B4' are in one system"},
            {List.of(SystemReference.floating("A0")), "system reference 'A0' is the reference level itself"}}) {
            @SuppressWarnings("unchecked")
            List<SystemReference> refs = (List<SystemReference>) bad[0];
            RitzException e = assertThrows(RitzException.class,
                    () -> LevelOptimizer.defaults().withSeparateSystems(refs).optimize(problem));
            assertEquals(RitzException.BAD_REFERENCE, e.code());
            assertTrue(e.getMessage().startsWith((String) bad[1]), e.getMessage());
        }
        assertThrows(IllegalArgumentException.class, () -> SystemReference.at("B0", -1, 0.1));
        assertThrows(IllegalArgumentException.class, () -> SystemReference.at("B0", 1, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> SystemReference.floating(" "));
        // a reference level in no line: nothing would be absolute
        MeasuredLines lonely = MeasuredLines.builder("G", 0).add("B1", "B0", 10, 0.1).build();
        RitzException e = assertThrows(RitzException.class,
                () -> LevelOptimizer.defaults().withSeparateSystems(List.of()).optimize(lonely));
        assertEquals(RitzException.BAD_ASSIGNMENT, e.code());
        assertTrue(e.getMessage().contains("'G' is in no measured line"), e.getMessage());
    }

    @Test
    void noLineIsPredictedBetweenAFloatingSystemAndAnother() {
        Species species = Species.parse("Fe I");
        MeasuredLines problem = noisy(new Random(3));
        LevelOptimum floating = LevelOptimizer.defaults().withSeparateSystems(List.of()).optimize(problem);
        RitzException e = assertThrows(RitzException.class, () -> floating.levels(species));
        assertEquals(RitzException.UNCONNECTED, e.code());
        assertTrue(e.getMessage().contains("'B0' (5 levels)"), e.getMessage());
        RitzLevels absolute = floating.absoluteLevels(species);
        assertEquals(5, absolute.size());
        // within the floating system, Ritz lines are exact: the fit's own Ritz uncertainty of B4 - B0
        RitzLevels b = floating.systemLevels(species, 1);
        assertEquals(5, b.size());
        int k = problem.size() - 1;             // B4 - B0
        assertEquals(floating.ritzUncertaintyPerCm(k), b.differenceSigma(b.indexOf("B4"), b.indexOf("B0")), 1e-12);
        // anchored: every level absolute; a line between systems has both sides' variance, the anchor's included
        LevelOptimum anchored = LevelOptimizer.defaults()
                .withSeparateSystems(List.of(SystemReference.at("B0", 20000, 0.05))).optimize(problem);
        RitzLevels all = anchored.levels(species);
        double uB2 = anchored.uncertaintyPerCm(anchored.levelLabels().indexOf("B2"));
        double uA1 = anchored.uncertaintyPerCm(anchored.levelLabels().indexOf("A1"));
        double expected = Math.sqrt(uB2 * uB2 + uA1 * uA1);
        assertEquals(expected, all.differenceSigma(all.indexOf("B2"), all.indexOf("A1")), 1e-12);
        assertTrue(expected > 0.05, "the anchor's 0.05 cm-1 is in it");
    }
}
