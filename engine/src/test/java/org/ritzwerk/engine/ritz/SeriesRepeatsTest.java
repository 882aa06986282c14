package org.ritzwerk.engine.ritz;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.testing.Golden;

/**
 * Series in which some levels are measured more than once: every measurement is an independent datum of
 * the weighted fit with its own residual, counted in chi^2, the degrees of freedom and the information
 * criterion; pairs that disagree are noted. The series are invented (only the method is checked).
 */
class SeriesRepeatsTest {

    private static final double R = 109_736.623;
    private static final double LIMIT = 33_690.80395;

    /** The two series of golden/series-repeats-members.csv, each member placed by its row. */
    private static List<RydbergSeries> goldenSeries() {
        Map<String, RydbergSeries.Builder> builders = new LinkedHashMap<>();
        int row = 0;
        for (Map<String, String> m : Golden.rows("series-repeats-members.csv")) {
            row++;
            builders.computeIfAbsent(m.get("series"), RydbergSeries::builder).add(Integer.parseInt(m.get("n")),
                    Double.parseDouble(m.get("energy")), Double.parseDouble(m.get("uncertainty")), "row " + row);
        }
        return builders.values().stream().map(RydbergSeries.Builder::build).toList();
    }

    private static Map<String, String> goldenModel(List<Integer> terms) {
        for (Map<String, String> row : Golden.rows("series-repeats-fit.csv")) {
            if (Integer.parseInt(row.get("terms_a")) == terms.get(0)
                    && Integer.parseInt(row.get("terms_b")) == terms.get(1)) {
                return row;
            }
        }
        throw new AssertionError("no golden model " + terms);
    }

    /**
     * Against an independent weighted least-squares fit (scipy 1.10.1 least_squares polished in mpmath 1.2.1
     * at 40 digits, golden/make_series_repeats_golden.py) over the same 38 measurements of 32 levels: every
     * model the criterion tried has the golden chi^2, BIC = chi^2 + p ln 38 (N counts measurements) and limit;
     * the chosen one, [2,2], also its defects, uncertainties and 38 - 5 degrees of freedom. Before repeats were
     * accepted the series could not be built.
     */
    @Test
    void agreesWithAnIndependentWeightedFitOverEveryMeasurement() {
        double limitTol = Golden.absoluteTolerance("series-repeats-fit.csv", "limit");
        double defectTol = Golden.absoluteTolerance("series-repeats-fit.csv", "defect");
        double uTol = Golden.tolerance("series-repeats-fit.csv", "uncertainty");
        double chiTol = Golden.absoluteTolerance("series-repeats-fit.csv", "chi2");
        List<RydbergSeries> series = goldenSeries();
        assertEquals(25, series.get(0).size());
        assertEquals(21, series.get(0).principalNumbers().length);
        assertEquals(3, series.get(0).measurements(30));
        SeriesFit fit = SeriesFitter.defaults().fit(R, series);
        assertEquals(List.of(2, 2), List.of(fit.terms(0), fit.terms(1)), fit.candidates().toString());
        assertEquals(7, fit.candidates().size(), fit.candidates().toString());
        for (SeriesFit.Candidate c : fit.candidates()) {
            Map<String, String> g = goldenModel(c.terms());
            assertEquals(Double.parseDouble(g.get("chi2")), c.chiSquare(), chiTol, c.toString());
            assertEquals(Double.parseDouble(g.get("bic")), c.bic(), chiTol, c.toString());
            assertEquals(Double.parseDouble(g.get("limit")), c.limitPerCm(), limitTol, c.toString());
            assertEquals(Double.parseDouble(g.get("u_limit")), c.limitUncertaintyPerCm(),
                    uTol * c.limitUncertaintyPerCm(), c.toString());
        }
        Map<String, String> g = goldenModel(List.of(2, 2));
        assertEquals(Integer.parseInt(g.get("dof")), fit.degreesOfFreedom());
        assertEquals(38 - 5, fit.degreesOfFreedom());
        assertEquals(32, fit.levelsMeasured(), "38 measurements of 32 levels");
        String[] names = {"a", "b"};
        for (int s = 0; s < 2; s++) {
            for (int k = 0; k < 2; k++) {
                String key = names[s] + "_d" + 2 * k;
                assertEquals(Double.parseDouble(g.get(key)), fit.defects(s)[k], defectTol, key);
                assertEquals(Double.parseDouble(g.get("u_" + key)), fit.defectUncertainties(s)[k],
                        uTol * fit.defectUncertainties(s)[k], key);
            }
        }
        // the fit and the truth it came from agree within the stated uncertainties (a sanity check of the data)
        assertEquals(LIMIT, fit.limitPerCm(), 3 * fit.limitUncertaintyPerCm());
    }

    /**
     * The closed form (derived here; common practice for weighted least squares): for a level measured as
     * E_i +- u_i, {@code sum (E_i - f)^2 / u_i^2 = W (Ebar - f)^2 + sum (E_i - Ebar)^2 / u_i^2} with
     * {@code W = sum 1 / u_i^2} and {@code Ebar = (sum E_i / u_i^2) / W}; the second term is free of the
     * parameters, so the fit to the measurements has the parameters and the covariance of the fit to the
     * weighted means with u = W^-1/2, and a chi^2 larger by that term. Three measurements of n = 30, two of
     * 22 and of the shared-limit partner's 25, with terms fixed so both fits are one model.
     */
    @Test
    void repeatsWeighAsTheirWeightedMean() {
        List<RydbergSeries> series = goldenSeries();
        List<RydbergSeries> means = new ArrayList<>();
        double within = 0;
        for (RydbergSeries one : series) {
            RydbergSeries.Builder b = RydbergSeries.builder(one.name());
            for (int n : one.principalNumbers()) {
                double w = 0;
                double we = 0;
                for (int i = 0; i < one.size(); i++) {
                    if (one.n(i) == n) {
                        w += 1 / (one.uncertaintyPerCm(i) * one.uncertaintyPerCm(i));
                        we += one.energyPerCm(i) / (one.uncertaintyPerCm(i) * one.uncertaintyPerCm(i));
                    }
                }
                double mean = we / w;
                for (int i = 0; i < one.size(); i++) {
                    if (one.n(i) == n) {
                        double r = (one.energyPerCm(i) - mean) / one.uncertaintyPerCm(i);
                        within += r * r;
                    }
                }
                b.add(n, mean, 1 / Math.sqrt(w));
            }
            means.add(b.build());
        }
        SeriesFitter fitter = SeriesFitter.defaults().withTerms(2, 2);
        SeriesFit all = fitter.fit(R, series);
        SeriesFit averaged = fitter.fit(R, means);
        // equal to a millionth of each parameter's uncertainty (Levenberg-Marquardt stops about there)
        assertEquals(averaged.limitPerCm(), all.limitPerCm(), 1e-6 * all.limitUncertaintyPerCm());
        for (int s = 0; s < 2; s++) {
            for (int k = 0; k < 2; k++) {
                assertEquals(averaged.defects(s)[k], all.defects(s)[k], 1e-6 * all.defectUncertainties(s)[k]);
            }
        }
        double[][] ca = all.covariance();
        double[][] cm = averaged.covariance();
        for (int i = 0; i < ca.length; i++) {
            for (int j = 0; j < ca.length; j++) {
                assertEquals(cm[i][j], ca[i][j], 1e-6 * Math.sqrt(cm[i][i] * cm[j][j]), i + "," + j);
            }
        }
        assertTrue(within > 0.5, "the repeats scatter: " + within);
        assertEquals(averaged.chiSquare() + within, all.chiSquare(), 1e-6);
        // the degrees of freedom count measurements: 6 more here than levels
        assertEquals(averaged.degreesOfFreedom() + 6, all.degreesOfFreedom());
    }

    /**
     * Each measurement has its residual (measured minus the one fitted level), and each level one prediction;
     * the residuals of two measurements of one n differ by their energies' difference.
     */
    @Test
    void everyMeasurementHasItsResidualAndEveryLevelOnePrediction() {
        List<RydbergSeries> series = goldenSeries();
        SeriesFit fit = SeriesFitter.defaults().withTerms(2, 2).fit(R, series);
        RydbergSeries a = series.get(0);
        List<SeriesFit.Prediction> predicted = fit.predictions(a.principalNumbers());
        assertEquals(2 * a.principalNumbers().length, predicted.size(), "one per level and series");
        int i22 = -1;
        int j22 = -1;
        for (int i = 0; i < a.size(); i++) {
            if (a.n(i) == 22) {
                if (i22 < 0) {
                    i22 = i;
                } else {
                    j22 = i;
                }
            }
            double fitted = fit.prediction(0, a.n(i)).memberOrThrow().energyPerCm();
            assertEquals(a.energyPerCm(i) - fitted, fit.residualPerCm(0, i), 1e-9, a.where(i));
        }
        assertEquals(a.energyPerCm(j22) - a.energyPerCm(i22), fit.residualPerCm(0, j22) - fit.residualPerCm(0, i22),
                1e-9);
        assertEquals(fit.normalisedResidual(0, j22) * a.uncertaintyPerCm(j22), fit.residualPerCm(0, j22), 1e-12);
        // the golden repeats agree: the largest pull of a pair is below 3 and no note speaks of them
        assertTrue(fit.repeatedMeasurements().stream().noneMatch(SeriesFit.Repeat::disagrees),
                fit.repeatedMeasurements().toString());
        assertEquals(3 + 1 + 1 + 1 + 1, fit.repeatedMeasurements().size(), "n = 30 gives three pairs");
        assertTrue(fit.notes().stream().noneMatch(n -> n.contains("measurement")), fit.notes().toString());
    }

    /**
     * A second measurement of n = 30 lying 6 standard uncertainties of the difference from the first
     * (u 0.002 and 0.003 cm^-1, difference 6 sqrt(0.002^2 + 0.003^2) = 0.0216 cm^-1), beside a third
     * measurement near the first: the pairs with the far one are noted, naming both places and the pull
     * (6.0 for the constructed pair), and the agreeing pair is not; an identical repeat is noted as counted
     * twice. The threshold is {@link SeriesFit#REPEAT_SIGMA} = 3 (common practice).
     */
    @Test
    void aDisagreeingPairIsNamedWithBothPlaces() {
        List<Double> truth = List.of(3.13, 0.18);
        Random r = new Random(11);
        RydbergSeries.Builder b = RydbergSeries.builder("nS");
        double[] measured = new double[41];
        for (int n = 20; n <= 40; n++) {
            measured[n] = AlkaliAtom.rydbergRitzEnergy(LIMIT, R, truth, n) + 0.002 * r.nextGaussian();
            b.add(n, measured[n], 0.002, "s.csv:" + (n - 15));
        }
        double e30 = AlkaliAtom.rydbergRitzEnergy(LIMIT, R, truth, 30);
        double combined = Math.hypot(0.002, 0.003);
        b.add(30, e30, 0.002, "run2.csv:4");
        b.add(30, e30 + 6 * combined, 0.003, "run2.csv:5");
        b.add(35, measured[35], 0.002, "s.csv:41"); // row 20 copied
        SeriesFit fit = SeriesFitter.defaults().withTerms(2).fit(R, List.of(b.build()));
        // run2.csv:5 disagrees with both other measurements of n = 30; those two agree
        List<SeriesFit.Repeat> disagreeing = fit.repeatedMeasurements().stream().filter(SeriesFit.Repeat::disagrees)
                .toList();
        assertEquals(2, disagreeing.size(), fit.repeatedMeasurements().toString());
        assertTrue(disagreeing.stream().allMatch(p -> p.secondWhere().equals("run2.csv:5")), disagreeing.toString());
        SeriesFit.Repeat pair = disagreeing.stream().filter(p -> p.firstWhere().equals("run2.csv:4")).findFirst()
                .orElseThrow();
        assertEquals("run2.csv:4", pair.firstWhere());
        assertEquals("run2.csv:5", pair.secondWhere());
        assertEquals(6.0, pair.pull(), 1e-6);
        assertEquals(combined, pair.combinedUncertaintyPerCm(), 1e-15);
        String notes = String.join("\n", fit.notes());
        assertTrue(notes.contains("2 pairs of measurements of one level disagree by more than 3 standard "
                + "uncertainties") && notes.contains("nS n = 30 (run2.csv:4 and run2.csv:5: difference +0.0216 cm-1, "
                + "6.00 times its standard uncertainty 0.00361 cm-1)") && notes.contains("nS n = 30 (s.csv:15 and "
                + "run2.csv:5"), notes);
        assertFalse(notes.contains("s.csv:15 and run2.csv:4"), "the agreeing pair is not named: " + notes);
        assertTrue(notes.contains("nS n = 35 is given twice with the same energy and uncertainty (s.csv:20 and "
                + "s.csv:41)"), notes);
        assertEquals(1, fit.repeatedMeasurements().stream().filter(SeriesFit.Repeat::identical).count());
        // both enter the fit: 21 + 3 measurements, 3 parameters
        assertEquals(24 - 3, fit.degreesOfFreedom());
    }

    /**
     * One measurement of a repeated level is wrong by 50 of its uncertainties: the fit is improbable, the
     * deletion diagnostic names that measurement (not its partner), and the refit without it is consistent.
     */
    @Test
    void theDeletionDiagnosticNamesTheWrongMeasurement() {
        List<Double> truth = List.of(3.13, 0.18);
        Random r = new Random(12);
        RydbergSeries.Builder b = RydbergSeries.builder("nS");
        for (int n = 20; n <= 40; n++) {
            b.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT, R, truth, n) + 0.002 * r.nextGaussian(), 0.002);
        }
        b.add(25, AlkaliAtom.rydbergRitzEnergy(LIMIT, R, truth, 25) + 0.1, 0.002);
        RydbergSeries s = b.build();
        assertEquals("nS n = 25, measurement 2", s.where(s.size() - 1));
        SeriesFit fit = SeriesFitter.defaults().withTerms(2).fit(R, List.of(s));
        assertTrue(fit.isImprobable());
        SeriesFit.Deletion d = fit.bestDeletion().orElseThrow();
        assertEquals("nS n = 25, measurement 2", d.where());
        assertTrue(d.probability() > SeriesFit.IMPROBABLE_PROBABILITY, d.toString());
    }

    /**
     * One measurement added twice from the same place is refused (the place is what tells repeated
     * measurements apart); the same n from another place, or without a place, is one more measurement.
     */
    @Test
    void theSameMeasurementTwiceIsRefused() {
        RitzException twice = assertThrows(RitzException.class,
                () -> RydbergSeries.builder("x").add(10, 197000, 0.1, "s.csv:3").add(10, 197001, 0.1, "s.csv:3"));
        assertEquals(RitzException.BAD_VALUE, twice.code());
        assertTrue(twice.getMessage().startsWith("s.csv:3: n = 10 of series 'x' is given twice from this place"),
                twice.getMessage());
        RydbergSeries ok = RydbergSeries.builder("x").add(10, 197000, 0.1, "s.csv:3").add(10, 197001, 0.1, "s.csv:4")
                .add(11, 197400, 0.1, "s.csv:3").add(10, 197000.5, 0.2).add(10, 197000.7, 0.2).build();
        assertEquals(5, ok.size());
        assertEquals(List.of("s.csv:3", "s.csv:4", "s.csv:3", "x n = 10, measurement 3", "x n = 10, measurement 4"),
                java.util.stream.IntStream.range(0, 5).mapToObj(ok::where).toList());
        assertArrayEquals(new int[] {10, 11}, ok.principalNumbers());
        assertEquals(4, ok.measurements(10));
        assertEquals(0, ok.measurements(12));
    }
}
