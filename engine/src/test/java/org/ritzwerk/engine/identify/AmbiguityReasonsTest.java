package org.ritzwerk.engine.identify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.arbitrary;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.lists;

import java.util.Arrays;
import java.util.EnumSet;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.identify.Identification.Ambiguity;

/**
 * Each ambiguous peak says why ({@link Identification#ambiguity}) and, where another line
 * explains it about as well, which line that is and at what odds ({@link Identification#rival},
 * {@link Identification#rivalOdds}). One invented scene per rule. The expected odds are worked
 * out here from the positions by Bayes' rule with Gaussian likelihoods and equal priors (common
 * practice): for two assignments of the same peaks, exp of half the difference of their sums of
 * squared normalised residuals; where several peaks compete, every assignment is enumerated by
 * hand below.
 */
class AmbiguityReasonsTest {

    private static final Species H = Species.parse("H I");
    private static final Species NA = Species.parse("Na I");
    private static final double NM = 1e-9;

    private static PeakList peaks(double sigmaNm, double... nm) {
        double[] metres = Arrays.stream(nm).map(x -> x * NM).toArray();
        double[] sigma = new double[nm.length];
        Arrays.fill(sigma, sigmaNm * NM);
        return PeakList.ofVacuumMetres(metres, sigma);
    }

    private static void assertNotAmbiguous(Identification result, int i) {
        assertEquals(Set.of(), result.ambiguity(i), "peak " + i);
        assertEquals(-1, result.rival(i), "peak " + i);
        assertTrue(Double.isNaN(result.rivalOdds(i)), "peak " + i);
        assertTrue(Double.isNaN(result.rivalPosition(i)), "peak " + i);
    }

    /** One peak between two equal lines 0.010 nm apart, 0.3 and 0.7 sigma from them. */
    @Test
    void aPeakBetweenTwoLinesNamesTheOtherAndTheOdds() {
        LineCatalog lines = LineCatalog.builder().add(H, 500.000 * NM, 0, 1, "a").add(H, 500.010 * NM, 0, 1, "b")
                .build();
        Identification result = Identifier.of(Tolerance.kSigma(5)).identify(peaks(0.01, 500.003), lines);
        assertEquals(Identification.AMBIGUOUS, result.status(0));
        assertEquals(EnumSet.of(Ambiguity.CLOSE_RIVAL), result.ambiguity(0));
        assertEquals("a", lines.label(result.line(0)));
        assertEquals("b", lines.label(result.rival(0)));
        assertEquals(500.010 * NM, result.rivalPosition(0), 1e-21);
        // exp((0.7^2 - 0.3^2) / 2) = exp(0.2)
        assertEquals(Math.exp(0.2), result.rivalOdds(0), 1e-9);
    }

    /**
     * Two peaks that both lie nearest line b (lines a, b, c at 500.000, 500.010, 500.020 nm;
     * peaks at 500.006 and 500.012 nm, 0.01 nm uncertainty, every line within reach of each).
     * Costs (z^2 / 2): peak 0 on a, b, c 0.18, 0.08, 0.98; peak 1 0.72, 0.02, 0.32. With both
     * matched the six assignments cost (a,b) 0.20, (a,c) 0.50, (b,a) 0.80, (b,c) 0.40,
     * (c,a) 1.70, (c,b) 1.00: the best is (a,b); the best with peak 0 off a, and the best with
     * peak 1 off b, are both (b,c), 0.20 more, in which peak 0 takes b and peak 1 takes c.
     */
    @Test
    void competingPeaksNameTheLineOfTheBestOtherAssignment() {
        LineCatalog lines = LineCatalog.builder().add(H, 500.000 * NM, 0, 1, "a").add(H, 500.010 * NM, 0, 1, "b")
                .add(H, 500.020 * NM, 0, 1, "c").build();
        Identification result = Identifier.of(Tolerance.kSigma(5)).identify(peaks(0.01, 500.006, 500.012), lines);
        assertEquals("a", lines.label(result.line(0)));
        assertEquals("b", lines.label(result.line(1)));
        assertEquals(EnumSet.of(Ambiguity.CLOSE_RIVAL), result.ambiguity(0));
        assertEquals(EnumSet.of(Ambiguity.CLOSE_RIVAL), result.ambiguity(1));
        assertEquals("b", lines.label(result.rival(0)));
        assertEquals("c", lines.label(result.rival(1)));
        assertEquals(Math.exp(0.20), result.rivalOdds(0), 1e-9);
        assertEquals(Math.exp(0.20), result.rivalOdds(1), 1e-9);
    }

    /**
     * The rival is the line of the best other assignment, which need not be the peak's cheapest
     * other candidate: peak p at 500.004 nm lies 0.4 sigma from A (500.000), 0.6 from B
     * (500.010) and 2.4 from C (499.980); peak q at 500.040 nm lies 3 sigma from B and 4 from A
     * (C beyond reach). Optimum p-A, q-B: 0.08 + 4.5 = 4.58. Without p on A: p-B, q-A costs
     * 0.18 + 8 = 8.18; p-C, q-B costs 2.88 + 4.5 = 7.38, the better, so p's rival is C at odds
     * exp(2.8), though B is its cheaper other candidate ({@link Identification#runnerUp}).
     */
    @Test
    void theRivalMayDifferFromTheCheapestOtherCandidate() {
        LineCatalog lines = LineCatalog.builder().add(H, 499.980 * NM, 0, 1, "C").add(H, 500.000 * NM, 0, 1, "A")
                .add(H, 500.010 * NM, 0, 1, "B").build();
        Identification result = Identifier.of(Tolerance.kSigma(5)).identify(peaks(0.01, 500.004, 500.040), lines);
        assertEquals("A", lines.label(result.line(0)));
        assertEquals("B", lines.label(result.line(1)));
        assertEquals("B", lines.label(result.runnerUp(0)));
        assertEquals(EnumSet.of(Ambiguity.CLOSE_RIVAL), result.ambiguity(0));
        assertEquals("C", lines.label(result.rival(0)));
        assertEquals(499.980 * NM, result.rivalPosition(0), 1e-21);
        assertEquals(Math.exp(2.8), result.rivalOdds(0), 1e-6);
    }

    /** {@link AbsentSpeciesTest}'s krypton peak beside a weak sodium line, sodium's D line missing. */
    @Test
    void aLineOfASpeciesNotShownSaysSoAndHasNoRival() {
        LineCatalog lines = LineCatalog.builder().add(H, 410 * NM, 0, 1, "h1").add(H, 434 * NM, 0, 1, "h2")
                .add(H, 486 * NM, 0, 1, "h3").add(H, 656 * NM, 0, 1, "h4")
                .add(NA, 589 * NM, 0, 1, "strong").add(NA, 427.36 * NM, 0, 0.001, "weak").build();
        Identification result = Identifier.of(Tolerance.kSigma(5))
                .identify(peaks(0.02, 410, 427.3969, 434, 486, 656), lines);
        assertEquals(Identification.AMBIGUOUS, result.status(1));
        assertEquals(EnumSet.of(Ambiguity.SPECIES_NOT_SHOWN), result.ambiguity(1));
        assertEquals(-1, result.rival(1));
        assertTrue(Double.isNaN(result.rivalOdds(1)));
        for (int i : new int[] {0, 2, 3, 4}) {
            assertNotAmbiguous(result, i);
        }
    }

    /**
     * Balmer-like invented lines, each with a peak, one of them 4.5 sigma off its line, and five
     * peaks no line explains over 410-700 nm: at their density a stray explains the far peak
     * better than a 4.5-sigma residual does (the rule flags below about 2.9 sigma here), and the
     * peaks on their lines keep their status.
     */
    @Test
    void aPeakFarFromItsLineAmongStraysSaysItMayBeStray() {
        LineCatalog lines = LineCatalog.builder().add(H, 410 * NM, 0, 1, "h1").add(H, 434 * NM, 0, 1, "h2")
                .add(H, 486 * NM, 0, 1, "h3").add(H, 656 * NM, 0, 1, "h4").build();
        Identification result = Identifier.of(Tolerance.kSigma(5))
                .identify(peaks(0.02, 410, 434.001, 450, 486.09, 520, 560, 600, 656, 700), lines);
        assertTrue(result.strayDensity() > 0);
        assertEquals(Identification.AMBIGUOUS, result.status(3));
        assertEquals(EnumSet.of(Ambiguity.MAY_BE_STRAY), result.ambiguity(3));
        assertEquals(-1, result.rival(3));
        for (int i : new int[] {0, 1, 7}) {
            assertEquals(Identification.MATCHED, result.status(i));
            assertNotAmbiguous(result, i);
        }
        for (int i : new int[] {2, 4, 5, 6, 8}) {
            assertEquals(Identification.UNEXPLAINED, result.status(i));
            assertNotAmbiguous(result, i);
        }
    }

    /**
     * On seeded crowded scenes (the recipe of {@link IdentificationRulesTest#crowdedScenes}: four
     * invented species of 50 lines in 0.8 nm, lines showing as 0.95 S^0.3, 1 pm peaks, 10 %
     * strays) the reasons agree with the status and the flags peak by peak, and every peak
     * ambiguous by the odds names a rival other than its line, within reach of the peak, at
     * odds from 1 up to the threshold.
     */
    @Test
    void theReasonsAgreeWithTheStatusOnCrowdedScenes() {
        String[] names = {"Fe I", "Ti I", "Cr I", "Ni I"};
        double sigma = 1e-12;
        int rivals = 0;
        int[] reasons = new int[Ambiguity.values().length];
        for (long seed = 1; seed <= 10; seed++) {
            java.util.SplittableRandom random = new java.util.SplittableRandom(1000 + seed);
            LineCatalog.Builder builder = LineCatalog.builder();
            for (String name : names) {
                for (int k = 0; k < 50; k++) {
                    builder.add(Species.parse(name), (500 + 0.8 * random.nextDouble()) * NM, 0,
                            Math.exp(Math.log(1e-2) * random.nextDouble()), name + " " + k);
                }
            }
            LineCatalog lines = builder.build();
            java.util.List<Double> drawn = new java.util.ArrayList<>();
            for (int j = 0; j < lines.size(); j++) {
                if (random.nextDouble() < 0.95 * Math.pow(lines.strength(j), 0.3)) {
                    drawn.add(lines.wavelength(j) + sigma * Scenes.gaussian(random));
                }
            }
            long strays = Math.round(0.10 * drawn.size());
            for (int k = 0; k < strays; k++) {
                drawn.add((499.9 + random.nextDouble()) * NM);
            }
            double[] positions = drawn.stream().mapToDouble(Double::doubleValue).sorted().distinct().toArray();
            double[] sigmas = new double[positions.length];
            Arrays.fill(sigmas, sigma);
            Identification result = Identifier.of(Tolerance.kSigma(5))
                    .identify(PeakList.ofVacuumMetres(positions, sigmas), lines);
            for (int i = 0; i < positions.length; i++) {
                Set<Ambiguity> why = result.ambiguity(i);
                String peak = "scene " + seed + " peak " + i;
                assertEquals(result.status(i) == Identification.AMBIGUOUS, !why.isEmpty(), peak);
                assertEquals(result.line(i) >= 0 && !result.matchedByOdds(i), why.contains(Ambiguity.CLOSE_RIVAL),
                        peak);
                assertEquals(result.speciesNotShown(i), why.contains(Ambiguity.SPECIES_NOT_SHOWN), peak);
                assertEquals(result.mayBeStray(i), why.contains(Ambiguity.MAY_BE_STRAY), peak);
                why.forEach(a -> reasons[a.ordinal()]++);
                if (why.contains(Ambiguity.CLOSE_RIVAL)) {
                    rivals++;
                    int rival = result.rival(i);
                    assertTrue(rival >= 0 && rival != result.line(i), peak);
                    assertTrue(Arrays.stream(result.rankedCandidates(i)).anyMatch(j -> j == rival), peak);
                    double odds = result.rivalOdds(i);
                    assertTrue(odds >= 1 - 1e-9 && odds < Identifier.DEFAULT_AMBIGUITY_ODDS, peak + " odds " + odds);
                } else {
                    assertEquals(-1, result.rival(i), peak);
                    assertTrue(Double.isNaN(result.rivalOdds(i)), peak);
                }
            }
        }
        assertTrue(rivals > 100, "peaks with a rival: " + rivals);
        assertTrue(reasons[Ambiguity.MAY_BE_STRAY.ordinal()] > 10, Arrays.toString(reasons));
    }

    /**
     * The rival and its odds are those of an exhaustive search: on small random crowded scenes
     * (up to 6 peaks and 6 ordinary lines; QuickTheories, fixed seed) every assignment is
     * enumerated, and for each matched peak the best one with the most matches in which the peak
     * explains a different line is found. A peak flagged as a close rival has that assignment's
     * cost over the optimum's as ln of its odds, and its rival is a line it takes in such an
     * assignment; an unflagged matched peak has no such assignment with as many matches, or one
     * at least 20 times less probable.
     */
    @Test
    void theRivalAndItsOddsAreThoseOfAnExhaustiveSearch() {
        int[] checked = new int[2];
        qt().withFixedSeed(78L).withExamples(400)
                .forAll(lists().of(doubles().between(0, 10)).ofSizeBetween(1, 6),
                        lists().of(doubles().between(0, 10)).ofSizeBetween(1, 6),
                        lists().of(doubles().between(0.05, 1)).ofSizeBetween(6, 6),
                        arbitrary().pick(java.util.List.of(Tolerance.absolute(1.5e-12), Tolerance.kSigma(3))))
                .checkAssert((peakOffsets, lineOffsets, strengths, tolerance) -> {
                    LineCatalog.Builder builder = LineCatalog.builder();
                    for (int j = 0; j < lineOffsets.size(); j++) {
                        builder.add(H, 500e-9 + lineOffsets.get(j) * 1e-12, 0.3e-12, strengths.get(j), null);
                    }
                    LineCatalog lines = builder.build();
                    double[] positions = peakOffsets.stream().mapToDouble(d -> 500e-9 + d * 1e-12).distinct()
                            .toArray();
                    double[] sigmas = new double[positions.length];
                    Arrays.fill(sigmas, 0.4e-12);
                    PeakList peaks = PeakList.ofVacuumMetres(positions, sigmas);
                    Identification result = Identifier.of(tolerance).identify(peaks, lines);
                    double[][] cost = costs(peaks, lines, tolerance);
                    double[] optimum = best(cost, -1, -1, new int[peaks.size()]);
                    for (int i = 0; i < peaks.size(); i++) {
                        int j = result.line(i);
                        if (j < 0) {
                            continue;
                        }
                        int[] taken = new int[peaks.size()];
                        double[] other = best(cost, i, j, taken);
                        String where = "peak " + i + " of " + Arrays.toString(positions) + ", lines "
                                + lineOffsets + ", " + tolerance;
                        checked[result.matchedByOdds(i) ? 0 : 1]++;
                        if (!result.matchedByOdds(i)) {
                            assertEquals(optimum[0], other[0], where);
                            assertEquals(other[1] - optimum[1], Math.log(result.rivalOdds(i)), 1e-9, where);
                            int rival = result.rival(i);
                            int[] onRival = new int[peaks.size()];
                            double[] viaRival = best(cost, i, -2 - rival, onRival);
                            assertEquals(other[0], viaRival[0], where);
                            assertEquals(other[1], viaRival[1], 1e-9, where + ": the rival " + rival
                                    + " gives the best other assignment (" + taken[i] + " does)");
                        } else {
                            assertTrue(other[0] < optimum[0]
                                    || other[1] - optimum[1] >= Math.log(Identifier.DEFAULT_AMBIGUITY_ODDS) - 1e-9,
                                    where);
                        }
                    }
                });
        // the scenes hold both kinds of peak (418 unflagged matches and 287 close rivals)
        assertTrue(checked[0] > 100 && checked[1] > 100, Arrays.toString(checked));
    }

    /** @return cost[i][j] of peak i on line j (0.5 z^2 - w ln S), NaN where j lies beyond i's tolerance */
    private static double[][] costs(PeakList peaks, LineCatalog lines, Tolerance tolerance) {
        double[][] cost = new double[peaks.size()][lines.size()];
        for (int i = 0; i < peaks.size(); i++) {
            double x = peaks.wavelength(i);
            for (int j = 0; j < lines.size(); j++) {
                double r = x - lines.wavelength(j);
                double s = tolerance.scoringSigma(x, peaks.sigma(i), lines.sigma(j));
                cost[i][j] = Math.abs(r) > tolerance.halfWidth(x, peaks.sigma(i), lines.sigma(j)) ? Double.NaN
                        : 0.5 * (r / s) * (r / s) - Identifier.DEFAULT_STRENGTH_WEIGHT * Math.log(lines.strength(j));
            }
        }
        return cost;
    }

    /**
     * The best one-to-one assignment by exhaustive search: the most matches, then the least cost.
     *
     * @param peak  a peak the assignment must match, or -1
     * @param line  with {@code peak}: a line it must not take (0 and up), or -2 - the line it must take
     * @param taken filled with the best assignment's line per peak (-1 for none)
     * @return {matches, cost}; matches -1 when no assignment meets the condition
     */
    private static double[] best(double[][] cost, int peak, int line, int[] taken) {
        double[] best = {-1, Double.POSITIVE_INFINITY};
        enumerate(cost, 0, new boolean[cost[0].length], new int[cost.length], 0, 0, peak, line, best, taken);
        return best;
    }

    private static void enumerate(double[][] cost, int i, boolean[] used, int[] assigned, int matches, double total,
            int peak, int line, double[] best, int[] taken) {
        if (i == cost.length) {
            if (matches > best[0] || matches == best[0] && total < best[1]) {
                best[0] = matches;
                best[1] = total;
                System.arraycopy(assigned, 0, taken, 0, assigned.length);
            }
            return;
        }
        if (i != peak) {
            assigned[i] = -1;
            enumerate(cost, i + 1, used, assigned, matches, total, peak, line, best, taken);
        }
        for (int j = 0; j < cost[i].length; j++) {
            boolean allowed = i != peak || (line >= 0 ? j != line : j == -2 - line);
            if (used[j] || Double.isNaN(cost[i][j]) || !allowed) {
                continue;
            }
            used[j] = true;
            assigned[i] = j;
            enumerate(cost, i + 1, used, assigned, matches + 1, total + cost[i][j], peak, line, best, taken);
            used[j] = false;
        }
        assigned[i] = -1;
    }
}
