package org.ritzwerk.engine.ritz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/** Rydberg-Ritz fits of synthetic series (invented parameters: only the method is checked). */
class SeriesFitterTest {

    private static final double R = 109_722.0;
    private static final double LIMIT = 198_310.67;

    private static RydbergSeries synthetic(String name, Random r, List<Double> defects, int from, int to, double sigma) {
        return synthetic(name, r, defects, from, to, 1, sigma);
    }

    private static RydbergSeries synthetic(String name, Random r, List<Double> defects, int from, int to, int step,
            double sigma) {
        RydbergSeries.Builder b = RydbergSeries.builder(name);
        for (int n = from; n <= to; n += step) {
            b.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT, R, defects, n) + sigma * r.nextGaussian(), sigma);
        }
        return b.build();
    }

    @Test
    void recoversTheLimitAndDefectsWithCoverage() {
        Random r = new Random(1978);
        List<Double> truth = List.of(0.2965, 0.035);
        int trials = 300;
        double[] sumSquares = new double[3];
        int[] within = new int[3];
        for (int t = 0; t < trials; t++) {
            SeriesFit fit = SeriesFitter.defaults().withTerms(2)
                    .fit(R, List.of(synthetic("1sns 3S", r, truth, 4, 25, 0.02)));
            double[] pulls = {
                (fit.limitPerCm() - LIMIT) / fit.limitUncertaintyPerCm(),
                (fit.defects(0)[0] - truth.get(0)) / fit.defectUncertainties(0)[0],
                (fit.defects(0)[1] - truth.get(1)) / fit.defectUncertainties(0)[1]};
            for (int k = 0; k < 3; k++) {
                sumSquares[k] += pulls[k] * pulls[k];
                within[k] += Math.abs(pulls[k]) <= 1.96 ? 1 : 0;
            }
        }
        for (int k = 0; k < 3; k++) {
            // 300 unit normals: rms 1 within about 0.04 (one sigma); share within 1.96 sigma 0.95 within 0.013
            assertEquals(1.0, Math.sqrt(sumSquares[k] / trials), 0.12, "rms pull of parameter " + k);
            assertEquals(0.95, within[k] / (double) trials, 0.04, "coverage of parameter " + k);
        }
    }

    /**
     * Coverage with the terms chosen by the criterion, over 400 seeded trials of two series (n = 20, 22,
     * ..., 60, u = 0.002 cm^-1, invented defects of two terms each; about 10 % of trials gain a spurious
     * term): the chosen model's own uncertainty undercovers (rms pull above 1), the model-averaged limit
     * (Burnham &amp; Anderson 2002, after Buckland et al. 1997) covers at least the nominal rate. Bounds:
     * 400 unit normals give an rms within 0.035 of 1 and a share within 1.96 sigma of 0.95 within 0.011
     * (one sigma each); the averaged interval is known to be somewhat conservative (Burnham &amp;
     * Anderson 2002), so its rms may lie below 1.
     */
    @Test
    void theModelAveragedLimitKeepsItsCoverageWhenTheCriterionChooses() {
        Random r = new Random(1);
        List<List<Double>> truth = List.of(List.of(2.5, -0.6), List.of(1.2, 0.9));
        int trials = 400;
        double selected = 0;
        double averaged = 0;
        int within = 0;
        for (int t = 0; t < trials; t++) {
            RydbergSeries a = synthetic("a", r, truth.get(0), 20, 60, 2, 0.002);
            RydbergSeries b = synthetic("b", r, truth.get(1), 20, 60, 2, 0.002);
            SeriesFit fit = SeriesFitter.defaults().fit(R, List.of(a, b));
            double p = (fit.limitPerCm() - LIMIT) / fit.limitUncertaintyPerCm();
            selected += p * p;
            SeriesFit.ModelAverage m = fit.modelAveragedLimit();
            assertEquals(1.0, m.weights().stream().mapToDouble(Double::doubleValue).sum(), 1e-12);
            double q = (m.limitPerCm() - LIMIT) / m.uncertaintyPerCm();
            averaged += q * q;
            within += Math.abs(q) <= 1.96 ? 1 : 0;
        }
        double rmsSelected = Math.sqrt(selected / trials);
        double rmsAveraged = Math.sqrt(averaged / trials);
        assertTrue(rmsSelected > 1.03, "the chosen model alone undercovers: rms pull " + rmsSelected);
        assertTrue(rmsAveraged > 0.85 && rmsAveraged < 1.05, "averaged rms pull " + rmsAveraged);
        assertTrue(within / (double) trials >= 0.94, "averaged share within 1.96 sigma " + within / (double) trials);
    }

    /** With the terms fixed there is one model: the average is the fit's own limit and uncertainty. */
    @Test
    void withFixedTermsTheAverageIsTheFit() {
        SeriesFit fit = SeriesFitter.defaults().withTerms(2).fit(R, List.of(synthetic("S", new Random(4),
                List.of(0.2965, 0.035), 4, 25, 0.02)));
        SeriesFit.ModelAverage m = fit.modelAveragedLimit();
        assertEquals(fit.limitPerCm(), m.limitPerCm(), 1e-9);
        assertEquals(fit.limitUncertaintyPerCm(), m.uncertaintyPerCm(), 1e-15);
        assertEquals(List.of(1.0), m.weights());
        SeriesFit.Candidate only = fit.candidates().get(0);
        assertEquals(fit.limitPerCm(), only.limitPerCm(), 1e-9);
        // so are the defects and the predictions (the mixture of one model is that model)
        for (int k = 0; k < 2; k++) {
            assertEquals(fit.defects(0)[k], fit.modelAveragedDefects(0)[k], 1e-15);
            assertEquals(fit.defectUncertainties(0)[k], fit.modelAveragedDefectUncertainties(0)[k], 1e-15);
        }
        assertEquals(2, fit.modelAveragedDefects(0).length);
        SeriesFit.Prediction p = fit.predictions(40).get(0);
        SeriesFit.AveragedPrediction q = fit.modelAveragedPredictions(40).get(0);
        assertEquals(p.member().orElseThrow().energyPerCm(), q.energyPerCm().orElseThrow(), 1e-9);
        assertEquals(p.memberOrThrow().uncertaintyPerCm(), q.uncertaintyPerCm().orElseThrow(), 1e-12);
        assertEquals(0, q.leftOutWeight());
        assertThrows(IllegalArgumentException.class, () -> fit.modelAveragedDefects(1));
        assertThrows(IllegalArgumentException.class, () -> fit.modelAveragedPredictions(0));
    }

    @Test
    void theCriterionPicksTheTermsTheDataNeed() {
        SeriesFit two = SeriesFitter.defaults().fit(R, List.of(synthetic("a", new Random(5), List.of(0.2965, 0.035),
                4, 25, 0.002)));
        assertEquals(2, two.terms(0), two.candidates().toString());
        SeriesFit one = SeriesFitter.defaults().fit(R, List.of(synthetic("b", new Random(6), List.of(0.0683),
                6, 25, 0.002)));
        assertEquals(1, one.terms(0), one.candidates().toString());
        assertTrue(one.candidates().size() >= 2, "a second term was tried");
        assertEquals(LIMIT, one.limitPerCm(), 4 * one.limitUncertaintyPerCm());
    }

    @Test
    void seriesShareTheirLimitAndPredictUnmeasuredMembers() {
        Random r = new Random(35);
        RydbergSeries s = synthetic("S", r, List.of(0.2965, 0.035), 4, 18, 0.01);
        RydbergSeries p = synthetic("P", r, List.of(0.0683, -0.018), 3, 15, 0.01);
        SeriesFit fit = SeriesFitter.defaults().withTerms(2, 2).fit(R, List.of(s, p));
        assertEquals(List.of("limit", "S d0", "S d2", "P d0", "P d2"), fit.parameterNames());
        assertEquals(LIMIT, fit.limitPerCm(), 4 * fit.limitUncertaintyPerCm());
        SeriesFit alone = SeriesFitter.defaults().withTerms(2).fit(R, List.of(s));
        assertTrue(fit.limitUncertaintyPerCm() < alone.limitUncertaintyPerCm(), "two series pin the limit better");
        SeriesFit.Member far = fit.prediction(1, 40).memberOrThrow();
        double expected = AlkaliAtom.rydbergRitzEnergy(LIMIT, R, List.of(0.0683, -0.018), 40);
        assertTrue(far.uncertaintyPerCm() > 0);
        assertEquals(expected, far.energyPerCm(), 4 * far.uncertaintyPerCm());
        for (int i = 0; i < s.size(); i++) {
            assertTrue(Math.abs(fit.residualPerCm(0, i)) < 5 * 0.01);
            assertEquals(fit.prediction(0, s.n(i)).memberOrThrow().quantumDefect(), fit.measuredDefect(0, i), 0.01);
        }
        assertEquals(s.size() + p.size() - 5, fit.degreesOfFreedom());
    }

    @Test
    void tooFewMembersAndBadMembersAreRefused() {
        RydbergSeries two = RydbergSeries.builder("x").add(10, 197000, 0.1).add(11, 197400, 0.1).build();
        RitzException e = assertThrows(RitzException.class, () -> SeriesFitter.defaults().fit(R, List.of(two)));
        assertEquals(RitzException.TOO_FEW, e.code());
        // one measurement added twice (the same place); repeated measurements of one n: SeriesRepeatsTest
        RitzException twice = assertThrows(RitzException.class,
                () -> RydbergSeries.builder("x").add(10, 197000, 0.1, "s.csv:3").add(10, 197001, 0.1, "s.csv:3"));
        assertTrue(twice.getMessage().startsWith("s.csv:3: n = 10 of series 'x' is given twice"), twice.getMessage());
        assertThrows(RitzException.class, () -> RydbergSeries.builder("x").add(0, 1, 1));
        assertThrows(RitzException.class, () -> RydbergSeries.builder("x").add(5, 1, 0));
    }
    @Test
    void aKnownLimitIsOneMoreDatumAndFixedTermsMayInterpolate() {
        // three members without noise and the limit as a datum: three terms and the limit interpolate
        // them (no degrees of freedom), and members beyond come back exactly
        List<Double> truth = List.of(0.2966, 0.038, 0.008);
        RydbergSeries.Builder b = RydbergSeries.builder("3S");
        for (int n = 2; n <= 4; n++) {
            b.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT, R, truth, n), 5e-5);
        }
        RydbergSeries three = b.build();
        SeriesFit fit = SeriesFitter.defaults().withTerms(3).withLimit(LIMIT, 1e-3).fit(R, List.of(three));
        assertEquals(0, fit.degreesOfFreedom());
        assertEquals(0.0, fit.chiSquare(), 1e-12);
        assertEquals(LIMIT, fit.limitPerCm(), 1e-7);
        assertEquals(1e-3, fit.limitUncertaintyPerCm(), 1e-6);
        for (int n = 5; n <= 10; n++) {
            SeriesFit.Member m = fit.prediction(0, n).memberOrThrow();
            assertEquals(AlkaliAtom.rydbergRitzEnergy(LIMIT, R, truth, n), m.energyPerCm(), 1e-6, "n = " + n);
            // the covariance carries the data's uncertainties: between the members' and the limit's
            assertTrue(m.uncertaintyPerCm() > 1e-5 && m.uncertaintyPerCm() < 2e-3, "n = " + n + ": " + m);
        }
        // the limit moved by its uncertainty moves the interpolated fit's limit with it
        SeriesFit moved = SeriesFitter.defaults().withTerms(3).withLimit(LIMIT + 1e-3, 1e-3).fit(R, List.of(three));
        assertEquals(LIMIT + 1e-3, moved.limitPerCm(), 1e-7);
        // without the known limit the same three members are too few for four parameters
        RitzException e = assertThrows(RitzException.class,
                () -> SeriesFitter.defaults().withTerms(3).fit(R, List.of(three)));
        assertEquals(RitzException.TOO_FEW, e.code());
        // with the number of terms chosen by the criterion a degree of freedom is still required
        RitzException bic = assertThrows(RitzException.class, () -> SeriesFitter.defaults().withLimit(LIMIT, 1e-3)
                .fit(R, List.of(RydbergSeries.builder("x").add(3, 183236.79, 1e-4).build())));
        assertTrue(bic.getMessage().contains("known limit"), bic.getMessage());
        assertThrows(IllegalArgumentException.class, () -> SeriesFitter.defaults().withLimit(LIMIT, 0));
        assertThrows(IllegalArgumentException.class, () -> SeriesFitter.defaults().withLimit(Double.NaN, 1));
    }

    /**
     * Predictions where the series has no member, or of a series the fit does not hold, are refused
     * (they returned energies below zero, or an index out of bounds); so are a series given twice
     * and an empty one.
     */
    @Test
    void predictionsAndSeriesThatDoNotExistAreRefused() {
        RydbergSeries s = synthetic("nS", new Random(7), List.of(3.1311807, 0.1787), 20, 40, 1e-3);
        SeriesFit fit = SeriesFitter.defaults().fit(R, List.of(s));
        assertTrue(fit.prediction(0, 5).memberOrThrow().energyPerCm() > 0);
        SeriesFit.Prediction low = fit.prediction(0, 2);
        assertTrue(low.member().isEmpty(), low.toString());
        assertTrue(low.note().orElseThrow().startsWith("series nS has no member at n = 2"), low.toString());
        assertTrue(assertThrows(IllegalStateException.class, low::memberOrThrow).getMessage()
                .startsWith("series nS has no member at n = 2"));
        assertThrows(IllegalArgumentException.class, () -> fit.prediction(0, 0));
        assertThrows(IllegalArgumentException.class, () -> fit.prediction(0, -5));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> fit.prediction(5, 60)).getMessage()
                .contains("the fit has 1 series"));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> SeriesFitter.defaults().fit(R, List.of(s, s)))
                .getMessage().contains("two series named 'nS'"));
        assertEquals(RitzException.TOO_FEW, assertThrows(RitzException.class, () -> SeriesFitter.defaults()
                .fit(R, List.of(s, RydbergSeries.builder("nP").build()))).code());
    }

    @Test
    void aKnownLimitWithNoisyMembersKeepsCoverage() {
        // members n = 5..20 with noise and a limit known to 0.01 cm^-1: the fitted limit and d0 lie within
        // 1.96 of their uncertainties at the normal rate
        Random r = new Random(2006);
        List<Double> truth = List.of(0.1397, 0.028);
        int trials = 300;
        int[] within = new int[2];
        int noted = 0;
        for (int t = 0; t < trials; t++) {
            double known = LIMIT + 0.01 * r.nextGaussian();
            RydbergSeries members = synthetic("1S", r, truth, 5, 20, 0.02);
            SeriesFit fit = SeriesFitter.defaults().withTerms(2).withLimit(known, 0.01).fit(R, List.of(members));
            within[0] += Math.abs(fit.limitPerCm() - LIMIT) <= 1.96 * fit.limitUncertaintyPerCm() ? 1 : 0;
            within[1] += Math.abs(fit.defects(0)[0] - truth.get(0)) <= 1.96 * fit.defectUncertainties(0)[0] ? 1 : 0;
            assertEquals(16 + 1 - 3, fit.degreesOfFreedom());
            noted += Math.abs(fit.knownLimitResidualSigma().orElseThrow()) > 3 ? 1 : 0;
            if (t == 0) {
                assertTrue(SeriesFitter.defaults().withTerms(2).fit(R, List.of(members)).knownLimitResidualSigma()
                        .isEmpty(), "no known limit, no residual");
                // the same members with a limit 30 of its uncertainties off: the members hold the fit
                double far = SeriesFitter.defaults().withTerms(2).withLimit(known + 0.3, 0.01).fit(R, List.of(members))
                        .knownLimitResidualSigma().orElseThrow();
                assertTrue(far < -3, "a limit the members contradict: " + far);
            }
        }
        assertEquals(0.95, within[0] / (double) trials, 0.04, "limit coverage");
        assertEquals(0.95, within[1] / (double) trials, 0.04, "d0 coverage");
        // a known limit consistent with the members is rarely beyond 3 of its uncertainties (at most the
        // normal 0.27 %, fewer since the fit is drawn towards it)
        assertTrue(noted <= 3, "consistent limits beyond 3 sigma: " + noted + " of " + trials);
    }
    @Test
    void theCovarianceKeepsItsDigitsWhenUncertaintiesDifferByOrders() {
        // members known to 5e-8 and 5e-5 cm^-1 beside a limit known to 1e-3 (the He I case): the predicted
        // member's uncertainty equals the propagation of each datum's uncertainty through the
        // interpolation, found here by refitting with each datum moved (finite differences)
        List<Double> truth = List.of(0.2966, 0.038, 0.008);
        double[] energy = new double[5];
        double[] sigma = {0, 0, 5e-8, 5e-5, 5e-5};
        for (int n = 2; n <= 4; n++) {
            energy[n] = AlkaliAtom.rydbergRitzEnergy(LIMIT, R, truth, n);
        }
        double u = fitted(energy, sigma, LIMIT).prediction(0, 6).memberOrThrow().uncertaintyPerCm();
        double base = fitted(energy, sigma, LIMIT).prediction(0, 6).memberOrThrow().energyPerCm();
        double variance = 0;
        for (int n = 2; n <= 4; n++) {
            double[] moved = energy.clone();
            moved[n] += 1e-4;
            double slope = (fitted(moved, sigma, LIMIT).prediction(0, 6).memberOrThrow().energyPerCm() - base) / 1e-4;
            variance += slope * slope * sigma[n] * sigma[n];
        }
        double slope = (fitted(energy, sigma, LIMIT + 1e-4).prediction(0, 6).memberOrThrow().energyPerCm() - base)
                / 1e-4;
        variance += slope * slope * 1e-6;
        assertEquals(Math.sqrt(variance), u, 1e-3 * u);
    }

    /**
     * A seeded synthetic series (n = 20, 22, ..., 40, u = 0.002 cm^-1) with one member moved by +5 cm^-1
     * (2500 of its uncertainties): the fit says it is improbable, gives the chance probability and the
     * scale factor, and flags the moved member; the same series unmoved gives no note.
     */
    @Test
    void anImprobableFitIsSaidAndTheWrongMemberFlagged() {
        List<Double> truth = List.of(3.269, -0.3);
        RydbergSeries.Builder clean = RydbergSeries.builder("nS");
        RydbergSeries.Builder moved = RydbergSeries.builder("nS");
        Random r = new Random(30);
        for (int n = 20; n <= 40; n += 2) {
            double e = AlkaliAtom.rydbergRitzEnergy(LIMIT, R, truth, n) + 0.002 * r.nextGaussian();
            clean.add(n, e, 0.002, "s.csv:" + n);
            moved.add(n, e + (n == 30 ? 5 : 0), 0.002, "s.csv:" + n);
        }
        SeriesFit good = SeriesFitter.defaults().fit(R, List.of(clean.build()));
        // seeded noise at its stated size: chi2 near its degrees of freedom, no flag, no note
        assertFalse(good.isImprobable(), good.toString());
        assertTrue(good.chiSquareProbability().orElseThrow() > 1e-3, good.toString());
        assertTrue(good.notes().isEmpty(), good.notes().toString());
        for (int i = 0; i < good.series().get(0).size(); i++) {
            assertFalse(good.isOutlier(0, i), "member " + i);
        }
        SeriesFit bad = SeriesFitter.defaults().fit(R, List.of(moved.build()));
        assertTrue(bad.isImprobable(), bad.toString());
        assertTrue(bad.chiSquareProbability().orElseThrow() < 1e-3);
        // the scale factor is sqrt(chi2 / dof) (its definition) where above 1
        assertEquals(Math.sqrt(bad.chiSquare() / bad.degreesOfFreedom()), bad.uncertaintyScale(), 1e-12);
        assertTrue(bad.isOutlier(0, 5), "the moved member n = 30");
        assertEquals(bad.residualPerCm(0, 5) / 0.002, bad.normalisedResidual(0, 5), 1e-9);
        String notes = String.join("\n", bad.notes());
        assertTrue(notes.contains("the fit is improbable") && notes.contains("stated uncertainties assume the model"),
                notes);
        // the moved member is named first (the largest normalised residual)
        assertTrue(notes.contains("the largest first: nS n = 30 (s.csv:30, residual/u = "), notes);
        assertTrue(notes.contains("chosen by the information criterion from an improbable fit"), notes);
        // deletion diagnostic: refitted without the moved member alone, the fit is consistent again and
        // gives back the seeded limit; a fit that is not improbable has none
        SeriesFit.Deletion without = bad.bestDeletion().orElseThrow();
        assertEquals(30, without.n());
        assertEquals("s.csv:30", without.where());
        assertTrue(without.probability() >= 1e-3, without.toString());
        assertEquals(LIMIT, without.limitPerCm(), 4 * without.limitUncertaintyPerCm());
        assertEquals(bad.series().get(0).size() - 1 - 1 - without.terms().get(0), without.degreesOfFreedom());
        assertTrue(notes.contains("refitted without nS n = 30 (s.csv:30) alone, the fit is consistent"), notes);
        assertTrue(good.bestDeletion().isEmpty());
    }

    /**
     * The chi-square probability is the chi-square distribution's upper tail: for 2 degrees of
     * freedom it is exp(-chi2 / 2) (closed form); without degrees of freedom there is none, and the
     * scale factor is 1.
     */
    @Test
    void theChiSquareProbabilityIsTheUpperTail() {
        SeriesFit fit = SeriesFitter.defaults().withTerms(2).fit(R, List.of(synthetic("S", new Random(11),
                List.of(0.2965, 0.035), 4, 8, 0.02)));
        assertEquals(2, fit.degreesOfFreedom());
        assertEquals(Math.exp(-fit.chiSquare() / 2), fit.chiSquareProbability().orElseThrow(), 1e-12);
        assertEquals(fit.chiSquare() / 2, fit.reducedChiSquare().orElseThrow(), 1e-15);
        assertEquals(Math.max(1, Math.sqrt(fit.chiSquare() / 2)), fit.uncertaintyScale(), 1e-15);
        RydbergSeries.Builder b = RydbergSeries.builder("3S");
        for (int n = 2; n <= 4; n++) {
            b.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT, R, List.of(0.2966, 0.038, 0.008), n), 5e-5);
        }
        SeriesFit exact = SeriesFitter.defaults().withTerms(3).withLimit(LIMIT, 1e-3).fit(R, List.of(b.build()));
        assertTrue(exact.chiSquareProbability().isEmpty() && exact.reducedChiSquare().isEmpty());
        assertFalse(exact.isImprobable());
        assertEquals(1, exact.uncertaintyScale());
    }

    /**
     * Predictions of several n over every series: where one series has no level the others are still
     * predicted and that one says why; below the lowest member the prediction carries a note.
     */
    @Test
    void predictionsOfSeveralNKeepTheSeriesThatHaveTheMember() {
        RydbergSeries s = synthetic("nS", new Random(7), List.of(3.1311807, 0.1787), 20, 40, 1e-3);
        RydbergSeries d = synthetic("nD", new Random(8), List.of(1.3464622, -0.594), 20, 40, 1e-3);
        SeriesFit fit = SeriesFitter.defaults().withTerms(2, 2).fit(R, List.of(s, d));
        List<SeriesFit.Prediction> p = fit.predictions(3, 10, 60);
        assertEquals(6, p.size());
        // nS at n = 3: 3 - 3.13 < 0, no level (the formula's n* = n - delta must be positive)
        assertTrue(p.get(0).member().isEmpty());
        assertTrue(p.get(0).note().orElseThrow().startsWith("series nS has no member at n = 3"), p.get(0).toString());
        assertTrue(p.get(1).note().orElseThrow().contains("below the lowest member of nS (n = 20)"));
        assertEquals(p.get(1), fit.prediction(0, 10));
        assertTrue(p.get(2).note().isEmpty() && p.get(2).member().isPresent());
        // nD at n = 3: 3 - 1.35 > 0, predicted (extrapolated downwards, with the note)
        assertEquals(p.get(3), fit.prediction(1, 3));
        assertTrue(p.get(3).note().orElseThrow().contains("extrapolated downwards"));
        assertThrows(IllegalArgumentException.class, () -> fit.predictions(0));
    }

    /**
     * The measured defect's uncertainty is the derivative of n - sqrt(R_M / (L - E)) in E times u(E)
     * (closed form, checked by a central difference); the fitted defect at a real n agrees with the
     * prediction's at integer n.
     */
    @Test
    void theMeasuredDefectCarriesTheLevelsUncertainty() {
        RydbergSeries s = synthetic("nS", new Random(9), List.of(3.1311807, 0.1787), 20, 40, 1e-3);
        SeriesFit fit = SeriesFitter.defaults().withTerms(2).fit(R, List.of(s));
        double limit = fit.limitPerCm();
        for (int i = 0; i < s.size(); i++) {
            double e = s.energyPerCm(i);
            double h = 1e-3;
            double slope = (Math.sqrt(R / (limit - e - h)) - Math.sqrt(R / (limit - e + h))) / (2 * h);
            assertEquals(Math.abs(slope) * 1e-3, fit.measuredDefectUncertainty(0, i).orElseThrow(),
                    1e-6 * Math.abs(slope) * 1e-3);
            assertEquals(fit.prediction(0, s.n(i)).memberOrThrow().quantumDefect(), fit.fittedDefect(0, s.n(i)), 1e-13);
        }
        assertThrows(IllegalArgumentException.class, () -> fit.fittedDefect(0, 3.0));
        // a member above the fitted limit has no defect, and the fit says so
        RydbergSeries.Builder b = RydbergSeries.builder("nS");
        for (int i = 0; i < s.size(); i++) {
            b.add(s.n(i), s.energyPerCm(i), s.uncertaintyPerCm(i), "s.csv:" + s.n(i));
        }
        b.add(90, LIMIT + 8, 1e-3, "s.csv:90");
        SeriesFit above = SeriesFitter.defaults().withTerms(2).fit(R, List.of(b.build()));
        int last = s.size();
        assertTrue(above.limitPerCm() < LIMIT + 8, above.toString());
        assertTrue(above.measuredDefectUncertainty(0, last).isEmpty());
        assertTrue(String.join("\n", above.notes()).contains("at or above the fitted limit"), above.notes().toString());
        assertTrue(above.isOutlier(0, last) && above.isImprobable(), above.toString());
    }

    private static SeriesFit fitted(double[] energy, double[] sigma, double limit) {
        RydbergSeries.Builder b = RydbergSeries.builder("3S");
        for (int n = 2; n <= 4; n++) {
            b.add(n, energy[n], sigma[n]);
        }
        return SeriesFitter.defaults().withTerms(3).withLimit(limit, 1e-3).fit(R, List.of(b.build()));
    }

    /** Rb-87 R_M, cm^-1 (the README's example: AME2020 mass with CODATA 2018 R_inf, as the example file uses). */
    private static final double R_RB87 = 109736.623008;
    /** Rb-87 limit the example members were computed from, cm^-1 (M. Mack et al., Phys. Rev. A 83, 052515 (2011)). */
    private static final double LIMIT_RB87 = 33690.80395355937;

    /** The README's Rb-87 example: nS1/2 and nD5/2, n = 20-40 step 2, u = 1e-4 cm^-1, no noise. */
    private static SeriesFit rubidium() {
        return SeriesFitter.defaults().withTerms(2, 2).fit(R_RB87, rubidiumSeries(0));
    }

    /** The example's members, nD5/2 with a d4 added (0: as the example). */
    private static List<RydbergSeries> rubidiumSeries(double d4) {
        RydbergSeries.Builder s = RydbergSeries.builder("nS1/2");
        RydbergSeries.Builder d = RydbergSeries.builder("nD5/2");
        for (int n = 20; n <= 40; n += 2) {
            // quantum defects of M. Mack et al., Phys. Rev. A 83, 052515 (2011)
            s.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT_RB87, R_RB87, List.of(3.1311807, 0.1787), n), 1e-4);
            d.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT_RB87, R_RB87, List.of(1.3464622, -0.594, d4), n), 1e-4);
        }
        return List.of(s.build(), d.build());
    }

    /**
     * Below the fitted members the stated uncertainty includes the expansion's truncation and covers the
     * known low levels of Rb, or the prediction is withheld (the reviewer's case: 5s at 476 +- 31.5 cm-1,
     * 4d5/2 at 19051.6 +- 7.25, 4s at -240974.6 before).
     */
    @Test
    void predictionsBelowTheMembersCoverTheKnownLevelsOrAreWithheld() {
        SeriesFit fit = rubidium();
        List<SeriesFit.Prediction> p = fit.predictions(4, 5, 6);
        // Rb I levels, cm^-1 above 5s (from memory): 5s1/2 0, 6s1/2 20132.51, 4d5/2 19355.20, 5d5/2 25703.50,
        // 6d5/2 28687.13; there is no 4s valence level (4s is in the core): the fit puts it below the ground level
        assertTrue(p.get(0).member().isEmpty(), p.get(0).toString());
        assertTrue(p.get(0).note().orElseThrow().contains("series nS1/2 at n = 4 comes out below the ground level"),
                p.get(0).toString());
        double[] known = {Double.NaN, 0, 20132.51, 19355.20, 25703.50, 28687.13};
        for (int k = 1; k < 6; k++) {
            SeriesFit.Prediction one = p.get(k);
            double e = one.member().orElseThrow().energyPerCm();
            double u = one.memberOrThrow().uncertaintyPerCm();
            assertTrue(Math.abs(e - known[k]) <= u, one + ": " + e + " +- " + u + " vs " + known[k]);
            SeriesFit.Member m = one.memberOrThrow();
            assertTrue(m.truncationPerCm() > m.fitUncertaintyPerCm(), one.toString());
            assertTrue(one.note().orElseThrow().contains("for the truncation"), one.toString());
        }
        // the truncation at 6d5/2 is the part of a next term c / (n - d0)^4 that the fit cannot absorb, r per
        // unit c, times c's largest size. r found by refitting: the members with a small d4 = eps added,
        // refitted with two terms; the truth at n = 6 moves by dTrue, the prediction by dFit, r = (dTrue - dFit)
        // / eps (the first-order propagation the fit uses, checked by an actual refit). |c|: the smaller of
        // |d2| (6 - d0)^2 (the first omitted term no larger than the last kept one at n = 6; 12.9 here) and
        // sqrt(c'^2 + u'^2) of the fit with d4 (the data's word on it; smaller here). It was 58.7 cm-1 (the last
        // kept term's full size), now less than half that, and still covers 6d5/2 (above)
        double eps = 1e-3;
        SeriesFit injected = SeriesFitter.defaults().withTerms(2, 2).fit(R_RB87, rubidiumSeries(eps));
        double dTrue = AlkaliAtom.rydbergRitzEnergy(LIMIT_RB87, R_RB87, List.of(1.3464622, -0.594, eps), 6)
                - AlkaliAtom.rydbergRitzEnergy(LIMIT_RB87, R_RB87, List.of(1.3464622, -0.594), 6);
        double dFit = injected.prediction(1, 6).memberOrThrow().energyPerCm() - p.get(5).memberOrThrow().energyPerCm();
        double r = (dTrue - dFit) / eps;
        SeriesFit withD4 = SeriesFitter.defaults().withTerms(2, 3).fit(R_RB87, rubidiumSeries(0));
        double[] dD = fit.defects(1);
        double size = Math.min(Math.abs(dD[1]) * (6 - dD[0]) * (6 - dD[0]),
                Math.hypot(withD4.defects(1)[2], withD4.defectUncertainties(1)[2]));
        assertTrue(size < Math.abs(dD[1]) * (6 - dD[0]) * (6 - dD[0]), "the data bound the next term here");
        double truncation = p.get(5).memberOrThrow().truncationPerCm();
        assertEquals(size * Math.abs(r), truncation, 0.02 * truncation);
        assertTrue(truncation < 0.5 * 58.7, "was 58.7 cm-1: " + truncation);
        assertTrue(p.get(5).memberOrThrow().uncertaintyPerCm() < 0.02 * (LIMIT_RB87 - 28687.13), p.get(5).toString());
        // at and above the lowest member nothing is added
        assertEquals(0, fit.predictions(20, 60).get(1).memberOrThrow().truncationPerCm());
        assertEquals(fit.prediction(0, 60), fit.predictions(60).get(0));
        // with d0 alone the truncation cannot be estimated: withheld below the members, predicted above
        RydbergSeries.Builder b = RydbergSeries.builder("nS1/2");
        for (int n = 20; n <= 40; n += 2) {
            b.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT_RB87, R_RB87, List.of(3.1311807), n), 1e-4);
        }
        SeriesFit one = SeriesFitter.defaults().withTerms(1).fit(R_RB87, List.of(b.build()));
        assertTrue(one.predictions(10).get(0).member().isEmpty()
                && one.predictions(10).get(0).note().orElseThrow().contains("fitted with d0 alone"));
        assertTrue(one.predictions(50).get(0).member().isPresent());
    }

    /**
     * A series whose fitted defect turns the energies over below its members gives no prediction there (the
     * reviewer's ser-ok.csv: nD n = 3 at 45923.14 +- 0.077 cm-1, defect -107, above the n = 20 member).
     */
    @Test
    void aPredictionWhereTheFittedSeriesIsNotOrderedIsWithheld() {
        RydbergSeries.Builder b = RydbergSeries.builder("nD");
        for (int n = 20; n <= 60; n += 2) {
            // invented defects like the reviewer's fit of its Sr-88 file (d0 2.63, d2 -15.0); limit LIMIT
            b.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT, R, List.of(2.63, -15.0), n), 0.002);
        }
        SeriesFit fit = SeriesFitter.defaults().withTerms(2).fit(R, List.of(b.build()));
        SeriesFit.Prediction three = fit.predictions(3).get(0);
        assertTrue(three.member().isEmpty(), three.toString());
        assertTrue(three.note().orElseThrow().startsWith("series nD is not physically ordered from n = 3 to 60")
                && three.note().get().contains("does not rise") && three.note().get().endsWith("n = 3 not predicted"),
                three.toString());
        // one member asked alone follows the same rule (predict(0, 3) gave a member above the n = 20 one)
        assertEquals(three, fit.prediction(0, 3));
        assertTrue(fit.predictions(21).get(0).member().isPresent() && fit.predictions(80).get(0).member().isPresent());
    }

    /**
     * One member asked alone ({@code prediction(s, n)}) is the member of {@link SeriesFit#predictions}, with the
     * truncation below the measured members in its uncertainty (the old {@code predict(s, n)} gave the
     * covariance's part alone, 0.013 cm-1 at n = 16 while 0.14 cm-1 off whenever two terms were chosen, pulls
     * -9 to -12: an atom-sensor review's seeded trials). Truth like a Sr 1P1 series needing a third term (the
     * review's invented d0 2.7295, d2 -4.67, d4 -157) beside an nS-like one, n = 20-60 step 2, u 0.002 cm-1;
     * 60 trials of seed 3. Over them at n = 16 at most 2 members lie beyond 3 of their stated u (0.16 expected
     * for unit normals; before, every trial whose criterion chose two terms, about 30 %).
     */
    @Test
    void oneMemberAskedAloneIsThePredictionWithItsTruncation() {
        Random r = new Random(3);
        List<Double> p = List.of(2.7295, -4.67, -157.0);
        List<Double> sTruth = List.of(3.269, -0.155);
        int beyond = 0;
        int twoTerms = 0;
        for (int t = 0; t < 60; t++) {
            SeriesFit fit = SeriesFitter.defaults().fit(R, List.of(synthetic("P", r, p, 20, 60, 2, 0.002),
                    synthetic("S", r, sTruth, 20, 60, 2, 0.002)));
            twoTerms += fit.terms(0) == 2 ? 1 : 0;
            SeriesFit.Prediction one = fit.prediction(0, 16);
            assertEquals(fit.predictions(16).get(0), one);
            SeriesFit.Member m = one.memberOrThrow();
            assertTrue(m.truncationPerCm() > 0 && m.uncertaintyPerCm() >= m.truncationPerCm(), one.toString());
            assertEquals(Math.hypot(m.fitUncertaintyPerCm(), m.truncationPerCm()), m.uncertaintyPerCm(), 1e-15);
            double e = AlkaliAtom.rydbergRitzEnergy(LIMIT, R, p, 16);
            beyond += Math.abs(m.energyPerCm() - e) > 3 * m.uncertaintyPerCm() ? 1 : 0;
            // n = 3 is where the fitted series turns over: withheld alone as in the list, never a number
            assertTrue(fit.prediction(0, 3).member().isEmpty(), fit.prediction(0, 3).toString());
        }
        assertTrue(twoTerms >= 5, "the criterion should choose two terms in some trials: " + twoTerms);
        assertTrue(beyond <= 2, beyond + " of 60 beyond 3 u");
    }

    /**
     * A chi2 improbably small is said (the reviewer's case: chi2 1.19 for 191 dof called consistent); the scale
     * factor is not applied below 1 (common practice).
     */
    @Test
    void aFitTooGoodForItsUncertaintiesIsSaid() {
        SeriesFit exact = rubidium();     // members computed, no noise: chi2 near 0 for 18 dof
        assertTrue(exact.isTooGood() && !exact.isImprobable());
        assertTrue(exact.lowerChiSquareProbability().orElseThrow() < SeriesFit.TOO_GOOD_PROBABILITY);
        assertTrue(exact.notes().stream().anyMatch(n -> n.startsWith("the fit is too good")
                && n.contains("the uncertainties look overstated")), exact.notes().toString());
        assertEquals(1, exact.uncertaintyScale());
        // seeded noise at the stated uncertainty: neither too good nor improbable, no note
        RydbergSeries s = synthetic("nS", new Random(7), List.of(3.1311807, 0.1787), 20, 40, 1e-3);
        SeriesFit noisy = SeriesFitter.defaults().withTerms(2).fit(R, List.of(s));
        assertFalse(noisy.isTooGood(), noisy.toString());
        assertTrue(noisy.notes().stream().noneMatch(n -> n.contains("too good")), noisy.notes().toString());
        // P + Q = 1 (the two tails of one distribution, common practice)
        assertEquals(1, noisy.lowerChiSquareProbability().orElseThrow() + noisy.chiSquareProbability().orElseThrow(),
                1e-12);
    }

    /**
     * The averaged defects and predictions are the mixture over the models tried, recomputed here by hand:
     * each candidate refitted with its terms fixed (the same model, found from another start), weighted by
     * exp(-BIC / 2), a term the model lacks counted as 0 with no variance, and
     * u^2 = sum w_k (u_k^2 + (x_k - x)^2) (Burnham and Anderson 2002, from memory).
     */
    @Test
    void theAveragesAreTheMixtureOverTheModelsTried() {
        RydbergSeries a = synthetic("a", new Random(12), List.of(2.5, -0.6), 20, 60, 2, 0.002);
        RydbergSeries b = synthetic("b", new Random(13), List.of(1.2, 0.9), 20, 60, 2, 0.002);
        SeriesFit fit = SeriesFitter.defaults().fit(R, List.of(a, b));
        List<SeriesFit.Candidate> models = fit.candidates();
        List<Double> w = fit.modelAveragedLimit().weights();
        assertTrue(models.size() >= 4, models.toString());
        int most = models.stream().mapToInt(c -> c.terms().get(0)).max().orElseThrow();
        assertEquals(most, fit.modelAveragedDefects(0).length);
        double[] x = new double[most];
        double[] v = new double[most];
        double energy = 0;
        double[] e = new double[models.size()];
        double[] ue = new double[models.size()];
        double[][] d = new double[models.size()][most];
        double[][] ud = new double[models.size()][most];
        for (int m = 0; m < models.size(); m++) {
            SeriesFit one = SeriesFitter.defaults().withTerms(models.get(m).terms().stream().mapToInt(t -> t)
                    .toArray()).fit(R, List.of(a, b));
            assertEquals(models.get(m).chiSquare(), one.chiSquare(), 1e-6 * (1 + one.chiSquare()));
            for (int k = 0; k < one.terms(0); k++) {
                d[m][k] = one.defects(0)[k];
                ud[m][k] = one.defectUncertainties(0)[k];
            }
            e[m] = one.prediction(0, 70).memberOrThrow().energyPerCm();
            ue[m] = one.prediction(0, 70).memberOrThrow().uncertaintyPerCm();
            energy += w.get(m) * e[m];
            for (int k = 0; k < most; k++) {
                x[k] += w.get(m) * d[m][k];
            }
        }
        double ve = 0;
        for (int m = 0; m < models.size(); m++) {
            ve += w.get(m) * (ue[m] * ue[m] + (e[m] - energy) * (e[m] - energy));
            for (int k = 0; k < most; k++) {
                v[k] += w.get(m) * (ud[m][k] * ud[m][k] + (d[m][k] - x[k]) * (d[m][k] - x[k]));
            }
        }
        SeriesFit.DefectAverage both = fit.modelAveragedDefectsWithUncertainties(0);
        for (int k = 0; k < most; k++) {
            assertEquals(x[k], fit.modelAveragedDefects(0)[k], 1e-6 * Math.sqrt(v[k]), "d" + 2 * k);
            assertEquals(Math.sqrt(v[k]), fit.modelAveragedDefectUncertainties(0)[k], 1e-4 * Math.sqrt(v[k]),
                    "u(d" + 2 * k + ")");
            // the one-call form gives the same numbers, bit for bit
            assertEquals(fit.modelAveragedDefects(0)[k], both.defects()[k], 0.0);
            assertEquals(fit.modelAveragedDefectUncertainties(0)[k], both.uncertainties()[k], 0.0);
        }
        assertEquals(most, both.uncertainties().length);
        SeriesFit.AveragedPrediction p = fit.modelAveragedPredictions(70).get(0);
        assertEquals(energy, p.energyPerCm().orElseThrow(), 1e-6 * Math.sqrt(ve));
        assertEquals(Math.sqrt(ve), p.uncertaintyPerCm().orElseThrow(), 1e-4 * Math.sqrt(ve));
        // the spread between the models widens the averaged uncertainty beyond the chosen model's here
        assertTrue(fit.modelAveragedDefectUncertainties(0)[0] > fit.defectUncertainties(0)[0], models.toString());
    }

    /**
     * Coverage of the defects and of a prediction beyond the data with the terms chosen by the criterion
     * (issue 21), on the limit's seeded series above (two series, n = 20, 22, ..., 60, u = 0.002 cm^-1,
     * invented defects of two terms each), 600 trials of seed 1, both series' pulls pooled (1200). The band,
     * for a value that covers: rms pull at most 1.03 and at least a lower bound (0.65 for d0, 0.90 for the
     * prediction at n = 70), and |pull| within 1.96 in at least 94.5 % (1200 unit normals: rms within 0.02
     * of 1 and that share within 0.0063 of 95 %, one sigma each; common practice). The chosen model's
     * values fail it (measured: d0 rms 1.14, 91 % within 1.96; n = 70 rms 1.04, 93 %), the averaged ones
     * pass (d0 rms 0.76, 99 %: conservative, as the spread of a model with a spurious third term, whose d0
     * is far less certain, enters with its weight; n = 70 rms 0.95, 96 %).
     */
    @Test
    void theModelAveragedDefectsAndPredictionsKeepTheirCoverage() {
        Random r = new Random(1);
        List<List<Double>> truth = List.of(List.of(2.5, -0.6), List.of(1.2, 0.9));
        int trials = 600;
        int far = 70;
        double[][] chosen = new double[2][2 * trials];
        double[][] averaged = new double[2][2 * trials];
        for (int t = 0; t < trials; t++) {
            RydbergSeries a = synthetic("a", r, truth.get(0), 20, 60, 2, 0.002);
            RydbergSeries b = synthetic("b", r, truth.get(1), 20, 60, 2, 0.002);
            SeriesFit fit = SeriesFitter.defaults().fit(R, List.of(a, b));
            List<SeriesFit.Prediction> p = fit.predictions(far);
            List<SeriesFit.AveragedPrediction> q = fit.modelAveragedPredictions(far);
            for (int s = 0; s < 2; s++) {
                double d0 = truth.get(s).get(0);
                chosen[0][2 * t + s] = (fit.defects(s)[0] - d0) / fit.defectUncertainties(s)[0];
                averaged[0][2 * t + s] = (fit.modelAveragedDefects(s)[0] - d0)
                        / fit.modelAveragedDefectUncertainties(s)[0];
                double e = AlkaliAtom.rydbergRitzEnergy(LIMIT, R, truth.get(s), far);
                chosen[1][2 * t + s] = (p.get(s).member().orElseThrow().energyPerCm() - e)
                        / p.get(s).memberOrThrow().uncertaintyPerCm();
                averaged[1][2 * t + s] = (q.get(s).energyPerCm().orElseThrow() - e)
                        / q.get(s).uncertaintyPerCm().orElseThrow();
            }
        }
        double[] lower = {0.65, 0.90};
        String[] what = {"d0", "E(n = 70)"};
        for (int k = 0; k < 2; k++) {
            assertTrue(covers(averaged[k], lower[k]), "model-averaged " + what[k] + ": " + summary(averaged[k]));
            assertFalse(covers(chosen[k], lower[k]), "the chosen model's " + what[k] + " undercovers: "
                    + summary(chosen[k]));
        }
    }

    private static boolean covers(double[] pulls, double lowestRms) {
        double rms = rms(pulls);
        return rms <= 1.03 && rms >= lowestRms && within(pulls) >= 0.945;
    }

    private static double rms(double[] pulls) {
        double sum = 0;
        for (double p : pulls) {
            sum += p * p;
        }
        return Math.sqrt(sum / pulls.length);
    }

    private static double within(double[] pulls) {
        int in = 0;
        for (double p : pulls) {
            in += Math.abs(p) <= 1.96 ? 1 : 0;
        }
        return in / (double) pulls.length;
    }

    private static String summary(double[] pulls) {
        return String.format(java.util.Locale.ROOT, "rms pull %.3f, within 1.96: %.3f", rms(pulls), within(pulls));
    }

    /**
     * The averaged predictions keep the chosen model's safeguards: withheld where it is (below the ground
     * level, not physically ordered), below the lowest member widened by each model's truncation, and
     * withheld too where models carrying at least 0.1 % of the weight give no member (a model with d0 alone
     * below the members), while such models with less weight are left out with a note.
     */
    @Test
    void theAveragedPredictionsKeepTheSafeguards() {
        // the README's Rb-87 members with the terms chosen by the criterion: [2,2] chosen, [3,2] and [2,3] with
        // weight (the members are exact, so a third term fits as well and costs only ln N)
        RydbergSeries.Builder s = RydbergSeries.builder("nS1/2");
        RydbergSeries.Builder d = RydbergSeries.builder("nD5/2");
        for (int n = 20; n <= 40; n += 2) {
            s.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT_RB87, R_RB87, List.of(3.1311807, 0.1787), n), 1e-4);
            d.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT_RB87, R_RB87, List.of(1.3464622, -0.594), n), 1e-4);
        }
        SeriesFit fit = SeriesFitter.defaults().fit(R_RB87, List.of(s.build(), d.build()));
        assertTrue(fit.modelAveragedLimit().weights().stream().filter(w -> w > 0.1).count() == 3,
                fit.candidates().toString());
        List<SeriesFit.Prediction> p = fit.predictions(4, 5, 6);
        List<SeriesFit.AveragedPrediction> q = fit.modelAveragedPredictions(4, 5, 6);
        // 4s: below the ground level in the chosen model, withheld with its note
        assertTrue(q.get(0).energyPerCm().isEmpty() && q.get(0).uncertaintyPerCm().isEmpty(), q.get(0).toString());
        assertEquals(p.get(0).note(), q.get(0).note());
        // Rb I levels, cm^-1 above 5s (from memory, as above): each averaged prediction covers its level
        double[] known = {Double.NaN, 0, 20132.51, 19355.20, 25703.50, 28687.13};
        for (int k = 1; k < 6; k++) {
            SeriesFit.AveragedPrediction one = q.get(k);
            double e = one.energyPerCm().orElseThrow();
            double u = one.uncertaintyPerCm().orElseThrow();
            assertTrue(Math.abs(e - known[k]) <= u, one + " vs " + known[k]);
            assertTrue(one.note().orElseThrow().contains("below the lowest member"), one.toString());
            // widened: far beyond the fit's covariance alone, at least 0.9 of the chosen model's truncation
            // (each model adds its own; a spurious third term, fitted near 0, estimates a smaller one)
            assertTrue(u > 10 * p.get(k).memberOrThrow().fitUncertaintyPerCm()
                    && u > 0.9 * p.get(k).memberOrThrow().truncationPerCm(), one + " vs " + p.get(k));
        }
        // not physically ordered in the chosen model (the case above): withheld as it is
        RydbergSeries.Builder b = RydbergSeries.builder("nD");
        for (int n = 20; n <= 60; n += 2) {
            b.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT, R, List.of(2.63, -15.0), n), 0.002);
        }
        SeriesFit turned = SeriesFitter.defaults().fit(R, List.of(b.build()));
        SeriesFit.AveragedPrediction three = turned.modelAveragedPredictions(3).get(0);
        assertTrue(three.energyPerCm().isEmpty(), three.toString());
        assertTrue(three.note().orElseThrow().startsWith("series nD is not physically ordered from n = 3 to 60"),
                three.toString());
        // a small d2 (invented): the model with d0 alone keeps 6 % of the weight and cannot be extrapolated
        // below the members, so the average is withheld there although the chosen model predicts
        SeriesFit small = SeriesFitter.defaults().fit(R_RB87, List.of(smallD2(1e-4)));
        assertEquals(2, small.terms(0), small.candidates().toString());
        assertTrue(small.predictions(10).get(0).member().isPresent());
        SeriesFit.AveragedPrediction ten = small.modelAveragedPredictions(10).get(0);
        assertTrue(ten.energyPerCm().isEmpty() && ten.leftOutWeight() > 0.01, ten.toString());
        assertTrue(ten.note().orElseThrow().startsWith("the model-averaged x n = 10 is withheld: the models with "
                + "terms [1], 0.06") && ten.note().get().contains("fitted with d0 alone"), ten.toString());
        assertTrue(small.modelAveragedPredictions(50).get(0).energyPerCm().isPresent());
        // the same members known 3 times better: that model's weight falls far below 0.1 %, it is left out
        SeriesFit sharp = SeriesFitter.defaults().fit(R_RB87, List.of(smallD2(3e-5)));
        SeriesFit.AveragedPrediction left = sharp.modelAveragedPredictions(10).get(0);
        assertTrue(left.energyPerCm().isPresent() && left.leftOutWeight() > 0
                && left.leftOutWeight() < SeriesFit.NEGLIGIBLE_WEIGHT, left.toString());
        assertTrue(left.note().orElseThrow().contains("the models with terms [1], ")
                && left.note().get().contains("are left out of its average"), left.toString());
    }

    /** Rb-87-like nS members n = 20-40 step 2 with d2 = 0.01 (invented), exact, of uncertainty u cm^-1. */
    private static RydbergSeries smallD2(double u) {
        RydbergSeries.Builder b = RydbergSeries.builder("x");
        for (int n = 20; n <= 40; n += 2) {
            b.add(n, AlkaliAtom.rydbergRitzEnergy(LIMIT_RB87, R_RB87, List.of(3.1311807, 0.01), n), u);
        }
        return b.build();
    }
}
