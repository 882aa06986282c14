package org.ritzwerk.engine.identify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;

/**
 * The three rules of issue 16 on seeded synthetic scenes: presence against chance, blends with
 * geometry, and ambiguity from posterior odds. Every scene is drawn from a fixed seed by the
 * library itself or by invented random catalogs (no real data is claimed).
 */
class IdentificationRulesTest {

    private static final LineCatalog LINES = Scenes.hydrogenAndHelium(30);

    /** H I, He II and C VI multiplets plus two invented random line sets, 350-1000 nm. */
    private static LineCatalog offered(long seed) {
        LineCatalog.Builder builder = LineCatalog.builder();
        for (int j = 0; j < LINES.size(); j++) {
            builder.add(LINES.species(j), LINES.wavelength(j), LINES.sigma(j), LINES.strength(j), LINES.label(j));
        }
        Scenes.add(builder, Species.parse("C VI"), new org.ritzwerk.atom.Nucleus(6, 12,
                org.ritzwerk.atom.Nucleus.nuclearMassKg(6, 12), 0, java.util.OptionalDouble.empty(),
                java.util.OptionalDouble.of(2.4702e-15), "AME2020; Angeli 2013"), 30);
        SplittableRandom random = new SplittableRandom(seed);
        for (String name : new String[] {"Ne I", "Ar I"}) {
            for (int k = 0; k < 150; k++) {
                builder.add(Species.parse(name), (350 + 650 * random.nextDouble()) * 1e-9, 0,
                        Math.exp(Math.log(1e-3) * random.nextDouble()), name + " invented " + k);
            }
        }
        return builder.build();
    }

    private static PeakList randomPeaks(int count, double sigma, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        double[] positions = new double[count];
        for (int i = 0; i < count; i++) {
            positions[i] = (350 + 650 * random.nextDouble()) * 1e-9;
        }
        Arrays.sort(positions);
        double[] sigmas = new double[count];
        Arrays.fill(sigmas, sigma);
        return PeakList.ofVacuumMetres(positions, sigmas);
    }

    /**
     * Random peaks (100,000 and 1,000,000, 1 pm uncertainty, 5-sigma tolerance): every offered
     * species gets low presence (at most 0.1), and the chance model is honest: the strong lines
     * matched stay within five standard deviations (plus 2) of the count chance predicts.
     */
    @Test
    void randomPeaksGiveLowPresenceForEverySpecies() {
        LineCatalog lines = offered(5L);
        for (int count : new int[] {100_000, 1_000_000}) {
            PeakList peaks = randomPeaks(count, 1e-12, 31L + count);
            Identification result = Identifier.of(Tolerance.kSigma(5)).identify(peaks, lines);
            List<Identification.SpeciesPresence> presence = result.speciesPresence();
            assertEquals(5, presence.size());
            for (Identification.SpeciesPresence p : presence) {
                assertTrue(p.strongInRange() >= 1, p.toString());
                assertTrue(p.presence() <= 0.1, count + " random peaks: " + p);
                double sd = Math.sqrt(p.strongByChance() * (1 - p.strongByChance() / p.strongInRange()));
                assertEquals(p.strongByChance(), p.strongMatched(), 5 * sd + 2, p.toString());
                assertTrue(p.matchedByChance() > 0, p.toString());
            }
        }
    }

    /**
     * Short random lists (60 peaks between 350 and 1000 nm, 0.01 nm uncertainty, 400 lists,
     * 2000 judgements): presence stays 0 unless chance gives the observed count at most 1 % of
     * the time, so no more than about 1 % of judgements show any presence (the normal bound alone
     * gave presence 0.2 where chance expected 0.03 strong lines and one came).
     */
    @Test
    void shortRandomListsShowPresenceAtMostAsOftenAsTheBoundAllows() {
        LineCatalog lines = offered(9L);
        int judged = 0;
        int present = 0;
        for (long seed = 1; seed <= 400; seed++) {
            Identification result = Identifier.of(Tolerance.kSigma(5)).identify(randomPeaks(60, 1e-11, seed), lines);
            for (Identification.SpeciesPresence p : result.speciesPresence()) {
                if (p.strongInRange() == 0) {
                    continue;
                }
                judged++;
                if (p.presence() > 0) {
                    present++;
                    assertTrue(p.chanceProbability() <= 0.01, p.toString());
                }
            }
        }
        assertTrue(judged > 1500, "judgements " + judged);
        assertTrue(present <= 0.015 * judged, present + " of " + judged + " judgements show presence");
    }

    /**
     * The look-elsewhere rule itself: an identification kept from a search over a span W has the
     * chance probability 1 - (1 - P)^T of the single-position P, T = W / (2 h) the shifts tried at
     * the tolerance's half-width h (5 sigma = 0.05 nm here, so T = 100 for W = 10 nm; common
     * practice), and no presence where that exceeds 0.01.
     */
    @Test
    void aSearchTakesTheChanceProbabilityOverTheShiftsItTried() {
        LineCatalog lines = offered(9L);
        int checked = 0;
        for (long seed = 1; seed <= 50; seed++) {
            Identification single = Identifier.of(Tolerance.kSigma(5)).identify(randomPeaks(60, 1e-11, seed), lines);
            List<Identification.SpeciesPresence> before = single.speciesPresence();
            Identification searched = single.searchedOver(0, 10e-9);
            assertEquals(1, single.shiftsTried());
            assertEquals(100, searched.shiftsTried(), 1e-6);
            List<Identification.SpeciesPresence> after = searched.speciesPresence();
            for (int k = 0; k < before.size(); k++) {
                double p = before.get(k).chanceProbability();
                if (Double.isNaN(p)) {
                    continue;
                }
                checked++;
                // each test's P becomes 1 - (1 - P)^100, and the figure is twice the smaller of
                // them: never below the single-position figure, never above its transform
                double q = after.get(k).chanceProbability();
                assertTrue(q >= p - 1e-12, q + " < " + p);
                if (p < 1) {
                    assertTrue(q <= Math.min(1, 2 * (1 - Math.pow(1 - p / 2, 100))) + 1e-9, q + " for " + p);
                }
                if (after.get(k).chanceProbability() > 0.01) {
                    assertEquals(0, after.get(k).presence(), 0);
                }
            }
        }
        assertTrue(checked > 100, "species judged " + checked);
    }

    /**
     * The short random lists with a velocity search of +-3000 km/s: the search keeps the best of
     * many shifts, and presence stays as rare as without a search.
     */
    @Test
    void aShiftSearchDoesNotTurnChanceIntoPresence() {
        LineCatalog lines = offered(9L);
        IdentificationSearch search = IdentificationSearch.of(Identifier.of(Tolerance.kSigma(5)))
                .withVelocitySearch(3000e3);
        int judged = 0;
        int present = 0;
        for (long seed = 1; seed <= 200; seed++) {
            Identification result = search.run(randomPeaks(60, 1e-11, 1000 + seed), lines).identification();
            for (Identification.SpeciesPresence p : result.speciesPresence()) {
                if (p.strongInRange() > 0) {
                    judged++;
                    present += p.presence() > 0 ? 1 : 0;
                }
            }
        }
        assertTrue(judged > 700, "judgements " + judged);
        assertTrue(present <= 0.015 * judged, present + " of " + judged + " judgements show presence");
    }

    /**
     * A synthetic real scene (H I and He II lines of at least 0.1 % of their strongest g A, 1 pm
     * noise, 10 % spurious peaks): both species present with presence at least 0.9 and a chance
     * probability below 1 % (He II has a single strong line in range); C VI and the invented sets, offered but absent, stay low.
     */
    @Test
    void aRealSceneKeepsItsSpeciesHigh() {
        LineCatalog lines = offered(5L);
        Scenes.Observation scene = Scenes.observe(LINES, 1e-3, 1e-12, 0.10, 0, 2026L);
        Identification result = Identifier.of(Tolerance.kSigma(5)).identify(scene.peaks(), lines);
        for (Identification.SpeciesPresence p : result.speciesPresence()) {
            String name = p.species().notation();
            if (name.equals("H I") || name.equals("He II")) {
                assertTrue(p.presence() >= 0.9, p.toString());
                assertTrue(p.chanceProbability() < 1e-2, p.toString());
                assertTrue(p.strongByChance() < 0.1 * p.strongMatched(), p.toString());
            } else {
                assertTrue(p.presence() <= 0.1, p.toString());
            }
        }
    }

    @Test
    void chanceProbabilityIsThePoissonBinomialTail() {
        // Three lines with chance rates 0.5, 0.5, 0.5: P(N >= 2) = 4/8 (binomial).
        assertEquals(0.5, Identification.chanceProbability(List.of(0.5, 0.5, 0.5), 2, 1.5, 0.75), 1e-15);
        // Rates 0.1 and 0.2: P(N >= 1) = 1 - 0.9 x 0.8 = 0.28, P(N >= 2) = 0.02.
        assertEquals(0.28, Identification.chanceProbability(List.of(0.1, 0.2), 1, 0.3, 0.25), 1e-15);
        assertEquals(0.02, Identification.chanceProbability(List.of(0.1, 0.2), 2, 0.3, 0.25), 1e-15);
        assertEquals(1, Identification.chanceProbability(List.of(0.1, 0.2), 0, 0.3, 0.25));
        // The presence bound's z: 1 - Phi(z) = 0.01 (an independent relation, via erfc).
        assertEquals(0.01, 0.5 * org.apache.commons.numbers.gamma.Erfc.value(Identification.Z_99 / Math.sqrt(2)), 1e-15);
        // Past the exact work limit, the normal approximation: 50,000 lines at p = 0.5 and k = 25,000
        // give P(N >= k) = 1 - Phi((k - 1/2 - mu) / sqrt(v)) = 1 - Phi(-0.5 / sqrt(12,500)).
        List<Double> many = java.util.Collections.nCopies(50_000, 0.5);
        double tail = Identification.chanceProbability(many, 25_000, 25_000, 12_500);
        assertEquals(0.5 * org.apache.commons.numbers.gamma.Erfc.value(-0.5 / Math.sqrt(12_500) / Math.sqrt(2)), tail,
                1e-15);
        // Uniform peaks 1 per nm, a 0.1 nm window: p = 1 - exp(-0.1) within the estimator's spread.
        double[] sorted = new double[2001];
        for (int i = 0; i < sorted.length; i++) {
            sorted[i] = (100 + i) * 1e-9;
        }
        double p = Identification.chanceRate(sorted, 1000.5e-9, 0.05e-9);
        assertEquals(-Math.expm1(-0.1), p, 0.2 * p);
        // A window wider than every peak's spread holds them all: chance certainly puts one there
        // (it gave 0, no peak being left outside to measure a density from).
        assertEquals(1.0, Identification.chanceRate(sorted, 1000e-9, 1e-3), 0.0);
        assertEquals(1.0, Identification.chanceRate(new double[] {500e-9}, 500e-9, 1e-9), 0.0);
    }

    /**
     * The local peak density's k-th nearest peak outside a window, found by halving, is the one a
     * merge of the peaks below and above the window reaches after k steps (the plain way, kept
     * here as the reference): the same double for random sorted peaks with repeats, windows
     * anywhere (also beyond either end) and every k the peaks allow.
     */
    @Test
    void theKthNearestPeakIsTheOneAMergeReaches() {
        SplittableRandom random = new SplittableRandom(31);
        for (int trial = 0; trial < 3000; trial++) {
            double[] sorted = new double[1 + random.nextInt(40)];
            for (int i = 0; i < sorted.length; i++) {
                sorted[i] = random.nextInt(60) * 0.25;
            }
            Arrays.sort(sorted);
            double w = random.nextDouble(-2, 17);
            double h = random.nextDouble(0, 3);
            int right = 0;
            while (right < sorted.length && sorted[right] < w - h) {
                right++;
            }
            int left = right - 1;
            while (right < sorted.length && sorted[right] <= w + h) {
                right++;
            }
            int outside = left + 1 + sorted.length - right;
            for (int k = 1; k <= outside; k++) {
                int l = left;
                int r = right;
                double radius = Double.NaN;
                for (int step = 0; step < k; step++) {
                    double dl = l >= 0 ? w - sorted[l] : Double.POSITIVE_INFINITY;
                    double dr = r < sorted.length ? sorted[r] - w : Double.POSITIVE_INFINITY;
                    radius = dl <= dr ? dl : dr;
                    l -= dl <= dr ? 1 : 0;
                    r += dl <= dr ? 0 : 1;
                }
                assertEquals(radius, Identification.nearest(sorted, w, left, right, k), 0.0,
                        Arrays.toString(sorted) + " w " + w + " h " + h + " k " + k);
            }
        }
    }

    /**
     * The multiplet lies between two peaks it cannot both explain. A low-resolution spectrum
     * (absolute tolerance 0.5 nm) shows the H I Balmer-alpha multiplet read 0.26 nm long and the
     * He II 6-4 line, 0.26 nm short of Balmer alpha. Balmer alpha is the cheaper candidate of
     * both peaks (the He II 6-4 line is weak beside He II 4686 in the window), so a blend without
     * geometry took both, leaving He II unused. The peaks are 0.52 nm apart, beyond the
     * multiplet's fine-structure spread (about 0.015 nm) plus the tolerance: He II explains its
     * peak.
     */
    @Test
    void aMultipletDoesNotExplainTwoPeaksFurtherApartThanItsSpreadAllows() {
        Candidates candidates = Candidates.inWindow(440e-9, 700e-9)
                .hydrogenLike(Species.parse("H I"), HydrogenLikeModel.of(Scenes.PROTON, Tier.QED), 10, false)
                .hydrogenLike(Species.parse("He II"), HydrogenLikeModel.of(Scenes.HELIUM4, Tier.QED), 10, false)
                .build();
        LineCatalog lines = candidates.catalog();
        int alpha = find(lines, "H I", "Balmer alpha");
        int helium = find(lines, "He II", "(6-4)");
        double spread = lines.blendSpread(alpha);
        // Balmer alpha's fine structure spans about 0.33 cm-1, lambda^2 x 0.33 cm-1 = 0.014 nm
        // (common practice; checked here against the model's own components, 0.01 to 0.02 nm).
        assertTrue(spread > 0.01e-9 && spread < 0.02e-9, "spread " + spread);
        double gap = lines.wavelength(alpha) - lines.wavelength(helium);
        assertEquals(0.26e-9, gap, 0.02e-9);
        PeakList peaks = PeakList.ofVacuumMetres(
                new double[] {lines.wavelength(helium), lines.wavelength(alpha) + gap}, null);
        // the full strength prior (weight 1), under which the multiplet is cheapest for both peaks
        Identifier identifier = Identifier.of(Tolerance.absolute(0.5e-9)).withStrengthWeight(1);
        Identification result = identifier.identify(peaks, lines);
        assertEquals(helium, result.line(0), "the He II line explains its peak");
        assertEquals(alpha, result.line(1));
        assertTrue(AssignmentOptimalityTest.blendsExplainTheirPeaksTogether(peaks, lines, identifier.tolerance(),
                result::line));
        // Without geometry (a huge spread) the multiplet takes both: the scene does test the rule.
        LineCatalog.Builder wide = LineCatalog.builder();
        for (int j = 0; j < lines.size(); j++) {
            if (lines.isBlend(j)) {
                wide.addBlend(lines.species(j), lines.wavelength(j), 0, lines.strength(j), lines.label(j), 1e-9);
            } else {
                wide.add(lines.species(j), lines.wavelength(j), 0, lines.strength(j), lines.label(j));
            }
        }
        LineCatalog loose = wide.build();
        Identification both = identifier.identify(peaks, loose);
        assertEquals(loose.label(alpha), loose.label(both.line(0)));
        assertEquals(loose.label(alpha), loose.label(both.line(1)));
    }

    private static int find(LineCatalog lines, String species, String label) {
        for (int j = 0; j < lines.size(); j++) {
            if (lines.species(j).notation().equals(species) && lines.label(j).contains(label)) {
                return j;
            }
        }
        throw new AssertionError(species + " " + label + " not in the catalog");
    }

    /**
     * Crowded scenes: four invented species with 50 lines each in a 0.8 nm band (lines 4 pm
     * apart on average, four peak uncertainties, many within one or two), relative strengths
     * log-uniform over 1e-2 to 1, peaks at the line plus Gaussian noise of 1 pm, 5-sigma tolerance,
     * 60 seeded scenes each. Three ways lines come to show a peak: with probability equal to their
     * strength (the strength a fair prior), 0.95 S^0.3 (weak lines show far more often than their
     * strength says, as in a bright spectrum where every line above the noise shows; a review's
     * model), and 0.95 whatever the strength. In each, among matched peaks not flagged ambiguous
     * at most 1 % have the wrong line, and the flagged peaks hold most of the wrong
     * identifications. With the full strength prior (weight 1, the default before) the second
     * gave 1.43 % (34 of 2371) and the third 0.76 %.
     */
    @Test
    void ambiguityFlagsWhereTheErrorsAre() {
        List<String> figures = new ArrayList<>();
        for (double exponent : new double[] {1, 0.3, 0}) {
            int[] counts = crowdedScenes(exponent, Identifier.of(Tolerance.kSigma(5)));
            int clear = counts[0];
            int clearWrong = counts[1];
            int flagged = counts[2];
            int flaggedWrong = counts[3];
            double clearRate = (double) clearWrong / clear;
            double flaggedShare = (double) flaggedWrong / (clearWrong + flaggedWrong);
            String figure = String.format(java.util.Locale.ROOT, "shown as S^%.1f: %d clear peaks, %d wrong (%.2f %%); "
                    + "%d flagged, %d wrong (%.1f %%); flagged peaks hold %.1f %% of the errors", exponent, clear,
                    clearWrong, 100 * clearRate, flagged, flaggedWrong, 100.0 * flaggedWrong / flagged,
                    100 * flaggedShare);
            figures.add(figure);
            assertTrue(clear > 800, figure);
            assertTrue(flagged > 100, figure);
            assertTrue(clearRate <= 0.01, figure);
            assertTrue(flaggedShare > 0.5, figure);
        }
        System.out.println("crowded scenes: " + String.join("; ", figures));
    }

    /** @return clear, clear and wrong, flagged, flagged and wrong peaks over the 60 scenes */
    static int[] crowdedScenes(double exponent, Identifier identifier) {
        return crowdedScenes(exponent, identifier, 0);
    }

    /**
     * @param strays spurious peaks added, as a share of the peaks the lines show, uniform over the
     *               band widened by 0.1 nm on each side (their truth is no line)
     * @return clear, clear and wrong, flagged, flagged and wrong peaks over the 60 scenes, then
     *         the strays matched unflagged and the strays flagged
     */
    static int[] crowdedScenes(double exponent, Identifier identifier, double strays) {
        String[] names = {"Fe I", "Ti I", "Cr I", "Ni I"};
        double sigma = 1e-12;
        int[] counts = new int[6];
        for (long seed = 1; seed <= 60; seed++) {
            SplittableRandom random = new SplittableRandom(1000 + seed);
            LineCatalog.Builder builder = LineCatalog.builder();
            for (String name : names) {
                for (int k = 0; k < 50; k++) {
                    builder.add(Species.parse(name), (500 + 0.8 * random.nextDouble()) * 1e-9, 0,
                            Math.exp(Math.log(1e-2) * random.nextDouble()), name + " " + k);
                }
            }
            LineCatalog lines = builder.build();
            List<double[]> drawn = new ArrayList<>();
            for (int j = 0; j < lines.size(); j++) {
                double shows = exponent == 1 ? lines.strength(j) : 0.95 * Math.pow(lines.strength(j), exponent);
                if (random.nextDouble() < shows) {
                    drawn.add(new double[] {lines.wavelength(j) + sigma * Scenes.gaussian(random), j});
                }
            }
            int shown = drawn.size();
            for (int k = 0; k < Math.round(strays * shown); k++) {
                drawn.add(new double[] {(499.9 + 1.0 * random.nextDouble()) * 1e-9, -1});
            }
            drawn.sort((a, b) -> Double.compare(a[0], b[0]));
            double[] positions = new double[drawn.size()];
            double[] sigmas = new double[drawn.size()];
            int[] truth = new int[drawn.size()];
            for (int i = 0; i < positions.length; i++) {
                positions[i] = drawn.get(i)[0];
                sigmas[i] = sigma;
                truth[i] = (int) drawn.get(i)[1];
            }
            Identification result = identifier.identify(PeakList.ofVacuumMetres(positions, sigmas), lines);
            for (int i = 0; i < positions.length; i++) {
                int at = result.status(i) == Identification.MATCHED ? 0
                        : result.status(i) == Identification.AMBIGUOUS ? 2 : -1;
                if (at >= 0) {
                    counts[at]++;
                    counts[at + 1] += result.line(i) != truth[i] ? 1 : 0;
                    if (truth[i] < 0) {
                        counts[at == 0 ? 4 : 5]++;
                    }
                }
            }
        }
        return counts;
    }

    /**
     * A width tolerance scores residuals as a Gaussian of a third of its half-width: below the
     * peaks' own 1 pm that makes the odds overconfident (0.002 nm: over 1 % of unflagged peaks
     * wrong), and the tolerance says so; at 0.003 nm (a third is 1 pm) the flag holds again and
     * no note is given.
     */
    @Test
    void aWidthNarrowerThanThreePeakUncertaintiesIsNoted() {
        Tolerance narrow = Tolerance.absolute(2e-12);
        Tolerance enough = Tolerance.absolute(3e-12);
        int[] sharp = crowdedScenes(1, Identifier.of(narrow));
        int[] fair = crowdedScenes(1, Identifier.of(enough));
        assertTrue(sharp[1] > 0.01 * sharp[0], sharp[1] + " of " + sharp[0]);
        assertTrue(fair[1] <= 0.01 * fair[0], fair[1] + " of " + fair[0]);
        double[] at = {500.1e-9, 500.2e-9, 500.3e-9};
        PeakList peaks = PeakList.ofVacuumMetres(at, new double[] {1e-12, 1e-12, 1e-12});
        assertTrue(narrow.sharperThanThePeaksNote(peaks).orElseThrow().startsWith("3 of 3 peaks state an uncertainty"));
        assertTrue(enough.sharperThanThePeaksNote(peaks).isEmpty());
        assertTrue(Tolerance.kSigma(5).sharperThanThePeaksNote(peaks).isEmpty());
        assertTrue(narrow.sharperThanThePeaksNote(PeakList.ofVacuumMetres(at, null)).isEmpty(), "no uncertainties");
    }

    /**
     * Stray peaks (a review's finding: dust, ghosts and a gas not offered took the nearest line
     * with confidence): the crowded scenes above with 10 % spurious peaks, uniform over the band.
     * A matched peak that a stray at the unexplained peaks' density explains within the ambiguity
     * odds is flagged ({@link Identification#mayBeStray}): 149 of the 204 strays that took a line
     * are flagged (102 before, by the other rules alone), and the strays left unflagged lie close
     * to a line, where no rule can tell them. Scenes without unexplained peaks are unchanged (the
     * test above).
     */
    @Test
    void strayPeaksNearALineAreFlaggedWhereTheyCouldBeStrays() {
        int[] counts = crowdedScenes(1, Identifier.of(Tolerance.kSigma(5)), 0.10);
        int straysWithALine = counts[4] + counts[5];
        assertTrue(straysWithALine > 150, "strays with a line: " + straysWithALine);
        assertTrue(counts[5] >= 0.65 * straysWithALine, counts[5] + " of " + straysWithALine + " flagged");
    }

    /** The full strength prior fails the second way of showing: the test above can fail. */
    @Test
    void theFullStrengthPriorMissesWeakLinesThatShow() {
        int[] counts = crowdedScenes(0.3, Identifier.of(Tolerance.kSigma(5)).withStrengthWeight(1));
        assertTrue(counts[1] > 0.01 * counts[0], counts[1] + " of " + counts[0]);
    }
}
