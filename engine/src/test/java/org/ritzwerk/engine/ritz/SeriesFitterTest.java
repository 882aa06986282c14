package org.ritzwerk.engine.ritz;

import static org.junit.jupiter.api.Assertions.assertEquals;
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
        RydbergSeries.Builder b = RydbergSeries.builder(name);
        for (int n = from; n <= to; n++) {
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
        SeriesFit.Member far = fit.predict(1, 40);
        double expected = AlkaliAtom.rydbergRitzEnergy(LIMIT, R, List.of(0.0683, -0.018), 40);
        assertTrue(far.uncertaintyPerCm() > 0);
        assertEquals(expected, far.energyPerCm(), 4 * far.uncertaintyPerCm());
        for (int i = 0; i < s.size(); i++) {
            assertTrue(Math.abs(fit.residualPerCm(0, i)) < 5 * 0.01);
            assertEquals(fit.predict(0, s.n(i)).quantumDefect(), fit.measuredDefect(0, i), 0.01);
        }
        assertEquals(s.size() + p.size() - 5, fit.degreesOfFreedom());
    }

    @Test
    void tooFewMembersAndBadMembersAreRefused() {
        RydbergSeries two = RydbergSeries.builder("x").add(10, 197000, 0.1).add(11, 197400, 0.1).build();
        RitzException e = assertThrows(RitzException.class, () -> SeriesFitter.defaults().fit(R, List.of(two)));
        assertEquals(RitzException.TOO_FEW, e.code());
        RitzException twice = assertThrows(RitzException.class,
                () -> RydbergSeries.builder("x").add(10, 197000, 0.1, "s.csv:3").add(10, 197001, 0.1, "s.csv:4"));
        assertTrue(twice.getMessage().startsWith("s.csv:4: n = 10 is given twice"), twice.getMessage());
        assertThrows(RitzException.class, () -> RydbergSeries.builder("x").add(0, 1, 1));
        assertThrows(RitzException.class, () -> RydbergSeries.builder("x").add(5, 1, 0));
    }
}
