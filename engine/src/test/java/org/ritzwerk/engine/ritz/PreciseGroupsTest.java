package org.ritzwerk.engine.ritz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.testing.Golden;

/**
 * Precise groups of levels hung on the reference by much looser lines (issue 21): their lines' Ritz
 * uncertainties keep all their digits up to the spread of uncertainties the optimizer accepts. References
 * from {@code golden/make_precise_groups_golden.py} (sympy's symbolic least squares, mpmath at 60 digits),
 * independent of the engine; invented levels, only the method is checked.
 */
class PreciseGroupsTest {

    /**
     * The loop of the class comment: A held at 0, B-A of u1 = 1 cm-1, and C-B, D-C, D-B of u2 = u1 / k. With
     * E_B, x = E_C - E_B and y = E_D - E_C as unknowns, B-A alone sets E_B (var u1^2), and x, y are fitted from
     * x, y and x + y of equal weight: normal matrix [[2, 1], [1, 2]] / u2^2, inverse u2^2 / 3 [[2, -1], [-1, 2]],
     * so var x = var y = var(x + y) = 2/3 u2^2 whatever u1 (derived here; sympy's result in precise-loop.csv's
     * header). Before, a fit was refused from k = 1e7 (the covariance difference lost the digits); now each k up
     * to 1e10, the largest spread accepted, gives sqrt(2/3) u2 within 1e-9 of itself, and B keeps u1.
     */
    @Test
    void aLoopHungOnALooseLineKeepsItsRitzUncertaintyUpToTheLargestSpreadAccepted() {
        double tolerance = Golden.tolerance("precise-loop.csv");
        List<Map<String, String>> rows = Golden.rows("precise-loop.csv");
        assertEquals(7, rows.size());
        for (Map<String, String> row : rows) {
            double u1 = Double.parseDouble(row.get("u1_per_cm"));
            double u2 = Double.parseDouble(row.get("u2_per_cm"));
            double expected = Double.parseDouble(row.get("ritz_uncertainty_per_cm"));
            assertEquals(Math.sqrt(2.0 / 3) * u2, expected, expected * 1e-15, "the closed form, k " + row.get("k"));
            LevelOptimum fit = LevelOptimizer.defaults().optimize(loop(u1, u2));
            for (int k = 1; k <= 3; k++) {
                double got = fit.ritzUncertaintyPerCm(k);
                assertTrue(Math.abs(got / expected - 1) < tolerance, "k " + row.get("k") + ", line " + (k + 1)
                        + ": " + got + " against " + expected);
                assertEquals(LevelOptimum.LineFlag.FITTED, fit.flag(k));
            }
            double b = Double.parseDouble(row.get("level_b_uncertainty_per_cm"));
            assertEquals(b, fit.uncertaintyPerCm(fit.levelLabels().indexOf("B")), b * tolerance, "k " + row.get("k"));
            assertEquals(u1, fit.ritzUncertaintyPerCm(0), u1 * tolerance, "B-A alone sets B");
            assertEquals(LevelOptimum.LineFlag.DETERMINES_LEVEL, fit.flag(0));
        }
        // beyond the spread accepted (1e10) the refusal stays, naming both lines
        RitzException spread = assertThrows(RitzException.class,
                () -> LevelOptimizer.defaults().optimize(loop(2, 1e-10)));
        assertEquals(RitzException.BAD_VALUE, spread.code());
        assertTrue(spread.getMessage().startsWith("line 2 (line 2): its uncertainty 1.00e-10 cm-1 is more than 1e+10 "
                + "times smaller than that of line 1 (line 1)"), spread.getMessage());
    }

    /**
     * A level list gives a line's uncertainty from the levels' covariance, sqrt(V_uu + V_ll - 2 V_ul), which
     * loses the digits the fit keeps: within 1e-6 of the fit's (the closed form sqrt(2/3) u2) it is given, beyond
     * it refused naming the line (before, such fits were refused from a ratio of 1e7 on).
     */
    @Test
    void aLevelListIsRefusedWhereItsCovarianceCannotCarryALinesRitzUncertainty() {
        Species species = Species.parse("Fe I");
        LevelOptimum near = LevelOptimizer.defaults().optimize(loop(1, 1e-3));
        RitzLevels list = near.levels(species);
        int b = list.indexOf("B");
        int c = list.indexOf("C");
        assertEquals(Math.sqrt(2.0 / 3) * 1e-3, list.differenceSigma(c, b), Math.sqrt(2.0 / 3) * 1e-3 * 1e-6);
        LevelOptimum far = LevelOptimizer.defaults().optimize(loop(1, 1e-7));
        RitzException e = assertThrows(RitzException.class, () -> far.levels(species));
        assertEquals(RitzException.SINGULAR, e.code());
        assertTrue(e.getMessage().startsWith("line 2 (line 2): a level list cannot carry its Ritz uncertainty "
                + "8.16e-08 cm-1 in double precision"), e.getMessage());
        assertThrows(RitzException.class, () -> far.absoluteLevels(species));
        assertThrows(RitzException.class, () -> far.systemLevels(species, 0));
    }

    private static MeasuredLines loop(double u1, double u2) {
        return MeasuredLines.builder("A", 0).add("B", "A", 100, u1).add("C", "B", 50, u2)
                .add("D", "C", 25, u2).add("D", "B", 75 + 0.3 * u2, u2).build();
    }

    /** The network of precise-groups-lines.csv, the outlier line included. */
    private static MeasuredLines network() {
        MeasuredLines.Builder b = MeasuredLines.builder("G", 0);
        for (Map<String, String> row : Golden.rows("precise-groups-lines.csv")) {
            b.add(row.get("upper"), row.get("lower"), Double.parseDouble(row.get("wavenumber_per_cm")),
                    Double.parseDouble(row.get("uncertainty_per_cm")));
        }
        return b.build();
    }

    /** @return the network without its outlier line (the last) */
    private static MeasuredLines networkWithoutTheOutlier() {
        MeasuredLines.Builder b = MeasuredLines.builder("G", 0);
        for (Map<String, String> row : Golden.rows("precise-groups-lines.csv")) {
            if (row.get("outlier").equals("0")) {
                b.add(row.get("upper"), row.get("lower"), Double.parseDouble(row.get("wavenumber_per_cm")),
                        Double.parseDouble(row.get("uncertainty_per_cm")));
            }
        }
        return b.build();
    }

    /**
     * A network with a group of five levels joined by lines of 2e-9 to 5e-9 cm-1 and hung on the rest by lines
     * of 0.5, 2 and 10 cm-1 (up to 5e9 times looser), a floating system whose lowest level heads a group of 2e-9
     * cm-1 lines and whose first level is loose, and a second measurement of one precise line moved by 40 of its
     * uncertainties: the moved line is left out and every level, Ritz wavenumber, Ritz uncertainty, normalised
     * residual and chi2 is that of mpmath's fit without it (precise-groups-fit.csv). Before, refused.
     */
    @Test
    void aNetworkWithPreciseGroupsAgreesWithAHighPrecisionFitOfTheLinesKept() {
        double tolerance = Golden.tolerance("precise-groups-fit.csv");
        double energyTolerance = Golden.tolerance("precise-groups-fit.csv", "energy");
        double rounding = Golden.absoluteTolerance("precise-groups-fit.csv", "rounding");
        double zTolerance = Golden.absoluteTolerance("precise-groups-fit.csv", "normalised");
        double chi2Tolerance = Golden.tolerance("precise-groups-fit.csv", "chi2");
        MeasuredLines problem = network();
        int outlier = problem.size() - 1;
        for (LevelOptimizer optimizer : List.of(LevelOptimizer.defaults().withSeparateSystems(List.of()),
                LevelOptimizer.defaults().withSeparateSystems(List.of()).withFullRefits())) {
            LevelOptimum fit = optimizer.optimize(problem);
            assertEquals(List.of(outlier), fit.leftOut(), optimizer.toString());
            assertEquals(LevelOptimum.LineFlag.OUTLIER, fit.flag(outlier));
            assertEquals("Q0", fit.systems().get(1).reference(), "a floating system on its lowest level");
            Map<String, Integer> systemIndex = new HashMap<>();
            int checked = 0;
            for (Map<String, String> row : Golden.rows("precise-groups-fit.csv")) {
                double value = Double.parseDouble(row.get("value"));
                switch (row.get("kind")) {
                    case "level" -> {
                        int i = fit.levelLabels().indexOf(row.get("name"));
                        double u = Double.parseDouble(row.get("uncertainty"));
                        assertEquals(value, fit.energyPerCm(i), u * energyTolerance + rounding, row.get("name"));
                        assertEquals(u, fit.uncertaintyPerCm(i), u * tolerance, row.get("name"));
                        systemIndex.put(row.get("name"), fit.systemOf(i));
                    }
                    case "chi2" -> {
                        int s = systemIndex.get(row.get("name"));
                        assertEquals(value, fit.systems().get(s).chiSquare(), value * chi2Tolerance, row.get("name"));
                    }
                    case "ritz" -> {
                        int k = Integer.parseInt(row.get("name")) - 1;
                        double u = Double.parseDouble(row.get("uncertainty"));
                        assertEquals(value, fit.ritzPerCm(k), u * energyTolerance + rounding, "line " + (k + 1));
                        double got = fit.ritzUncertaintyPerCm(k);
                        assertTrue(Math.abs(got / u - 1) < tolerance, "line " + (k + 1) + ": " + got + " against " + u);
                        if (row.get("normalised").isEmpty()) {
                            assertTrue(fit.standardisedResidual(k).isEmpty(), "line " + (k + 1));
                            assertEquals(LevelOptimum.LineFlag.DETERMINES_LEVEL, fit.flag(k));
                        } else {
                            assertEquals(Double.parseDouble(row.get("normalised")),
                                    fit.standardisedResidual(k).getAsDouble(), zTolerance, "line " + (k + 1));
                        }
                    }
                    default -> throw new AssertionError(row.toString());
                }
                checked++;
            }
            assertEquals(13 + 2 + 21, checked);
        }
    }

    /**
     * With the outlier left out, every kept line's Ritz uncertainty (and every level) is that of a fit of the
     * lines kept from scratch: the Ritz uncertainties come from the final set of lines, not from the downdates.
     */
    @Test
    void afterAnOutlierTheRitzUncertaintiesAreThoseOfAFreshFitWithoutIt() {
        LevelOptimizer optimizer = LevelOptimizer.defaults().withSeparateSystems(List.of());
        LevelOptimum fit = optimizer.optimize(network());
        LevelOptimum fresh = optimizer.optimize(networkWithoutTheOutlier());
        assertTrue(fresh.leftOut().isEmpty());
        for (int k = 0; k < fresh.problem().size(); k++) {
            assertEquals(fresh.ritzUncertaintyPerCm(k), fit.ritzUncertaintyPerCm(k),
                    fresh.ritzUncertaintyPerCm(k) * 1e-12, "line " + (k + 1));
            assertEquals(fresh.ritzPerCm(k), fit.ritzPerCm(k), 1e-7 * fresh.ritzUncertaintyPerCm(k) + 2e-13,
                    "line " + (k + 1));
        }
        for (int i = 0; i < fit.levelLabels().size(); i++) {
            int at = fresh.levelLabels().indexOf(fit.levelLabels().get(i));
            assertEquals(fresh.uncertaintyPerCm(at), fit.uncertaintyPerCm(i), fresh.uncertaintyPerCm(at) * 1e-12);
        }
        assertEquals(fresh.chiSquare(), fit.chiSquare(), fresh.chiSquare() * 1e-9);
    }
}
