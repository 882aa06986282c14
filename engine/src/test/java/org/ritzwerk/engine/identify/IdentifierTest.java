package org.ritzwerk.engine.identify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.longs;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/**
 * Identification against ground truth from the library's own synthetic scenes (seeded), against
 * published Balmer wavelengths, and its invariants.
 */
class IdentifierTest {

    private static final LineCatalog LINES = Scenes.hydrogenAndHelium(30);

    /**
     * Documented noise level: peaks with 1 pm standard uncertainty (Gaussian), 10 % spurious
     * peaks, a 5-sigma tolerance, all lines with at least 0.01 % of their species' strongest g A,
     * a source receding at 42 km/s. Precision and recall must be at least 0.99 and the velocity
     * within three of its stated standard uncertainties.
     */
    @Test
    void recoversTheTruthOfASyntheticSceneWithItsVelocity() {
        double velocity = 42_000;
        Scenes.Observation scene = Scenes.observe(LINES, 1e-4, 1e-12, 0.10, velocity / PhysicalConstants.C, 2026L);
        Identifier identifier = Identifier.of(Tolerance.kSigma(5));
        ShiftSearch.Fit fit = ShiftSearch.redshift(identifier, scene.peaks(), LINES, 300_000);
        assertEquals(velocity, fit.velocity(), 3 * fit.velocityUncertainty(),
                "velocity " + fit.velocity() + " +- " + fit.velocityUncertainty());
        Identification result = identifier.identify(scene.peaks(), LINES.shifted(fit.value()));
        int truePositive = 0;
        int claimed = 0;
        int real = 0;
        for (int i = 0; i < scene.truth().length; i++) {
            real += scene.truth()[i] >= 0 ? 1 : 0;
            if (result.line(i) >= 0) {
                claimed++;
                truePositive += result.line(i) == scene.truth()[i] ? 1 : 0;
            }
        }
        double precision = (double) truePositive / claimed;
        double recall = (double) truePositive / real;
        assertTrue(precision >= 0.99, "precision " + precision);
        assertTrue(recall >= 0.99, "recall " + recall);
        assertTrue(real > 100, "a scene worth the name: " + real + " lines");
    }

    @Test
    void balmerAirWavelengthsIdentifyAsBalmerLines() {
        // Air wavelengths of H-alpha to H-epsilon, 6562.79, 4861.35, 4340.47, 4101.74, 3970.07 A:
        // J. E. Sansonetti and W. C. Martin, Handbook of Basic Atomic Spectroscopic Data, J. Phys.
        // Chem. Ref. Data 34, 1559 (2005) (NIST SRD 108), strong lines of H I. Digits recalled
        // (from memory); checked: the hydrogen model's lines converted to standard air, an
        // independent computation, lie within 0.02 nm of each, which this test asserts.
        double[] air = {656.279, 486.135, 434.047, 410.174, 397.007};
        PeakList peaks = PeakList.of(air, null, null, Unit.NANOMETRE, Medium.air());
        Identification result = Identifier.of(Tolerance.absolute(0.02e-9)).identify(peaks, LINES);
        String[] expected = {"Balmer alpha", "Balmer beta", "Balmer gamma", "Balmer delta", "Balmer epsilon"};
        for (int i = 0; i < air.length; i++) {
            assertTrue(result.line(i) >= 0, "peak " + air[i] + " unexplained");
            assertEquals(Species.parse("H I"), LINES.species(result.line(i)));
            assertEquals("H I " + expected[i], LINES.label(result.line(i)));
        }
    }

    @Test
    void heliumIiBesideBalmerIsSeparatedAndTheRivalNamed() {
        // He II 6 -> 4 lies 0.26 nm from H-alpha: a 0.5 nm window sees both; the nearer wins and the
        // other is the runner-up.
        PeakList peaks = PeakList.of(new double[] {656.279}, null, null, Unit.NANOMETRE, Medium.air());
        Identification result = Identifier.of(Tolerance.absolute(0.5e-9)).withStrengthWeight(0).identify(peaks, LINES);
        assertEquals("H I Balmer alpha", LINES.label(result.line(0)));
        assertEquals("He II 6560 (6-4)", LINES.label(result.runnerUp(0)));
        int[] ranked = result.rankedCandidates(0);
        assertEquals(result.line(0), ranked[0]);
        assertEquals(result.runnerUp(0), ranked[1]);
    }

    @Test
    void assignmentIsOneToOneAndGlobal() {
        // Two peaks, two lines: a greedy choice would give the first peak its nearest line and leave
        // the second peak without one; the optimal assignment matches both.
        LineCatalog lines = LineCatalog.builder().add(Species.parse("H I"), 500.000e-9, 0, 1, "a")
                .add(Species.parse("H I"), 500.010e-9, 0, 1, "b").build();
        PeakList peaks = PeakList.ofVacuumMetres(new double[] {500.004e-9, 500.0095e-9}, null);
        Identification result = Identifier.of(Tolerance.absolute(0.012e-9)).identify(peaks, lines);
        assertEquals(0, result.line(0));
        assertEquals(1, result.line(1));
        assertEquals(0, result.count(Identification.UNEXPLAINED));
    }

    @Test
    void aDeclaredBlendMayExplainSeveralPeaks() {
        // Two peaks 2 pm either side of a blended line both take it; an ordinary line beside it
        // still serves one peak only.
        LineCatalog lines = LineCatalog.builder()
                .addBlend(Species.parse("H I"), 656.470e-9, 0, 1, "multiplet")
                .add(Species.parse("H I"), 656.480e-9, 0, 1, "single").build();
        PeakList peaks = PeakList.ofVacuumMetres(new double[] {656.468e-9, 656.472e-9, 656.479e-9, 656.481e-9}, null);
        Identification result = Identifier.of(Tolerance.absolute(0.005e-9)).identify(peaks, lines);
        assertEquals("multiplet", lines.label(result.line(0)));
        assertEquals("multiplet", lines.label(result.line(1)));
        int single = 0;
        for (int i = 2; i < 4; i++) {
            single += result.line(i) >= 0 && lines.label(result.line(i)).equals("single") ? 1 : 0;
        }
        assertEquals(1, single, "the ordinary line explains one peak");
        assertTrue(lines.isBlend(result.line(0)));
    }

    @Test
    void aPeakWithoutCandidatesDoesNotSplitAComponent() {
        // Regression: peaks A and C both reach the one line, B between them reaches nothing
        // (tiny uncertainty). The line must still go to one peak only.
        LineCatalog lines = LineCatalog.builder().add(Species.parse("H I"), 500.000e-9, 0, 1, "a").build();
        PeakList peaks = PeakList.ofVacuumMetres(new double[] {499.999e-9, 500.001e-9, 500.002e-9},
                new double[] {0.002e-9, 1e-15, 0.002e-9});
        Identification result = Identifier.of(Tolerance.kSigma(5)).identify(peaks, lines);
        assertEquals(0, result.line(0));
        assertEquals(-1, result.line(1));
        assertEquals(-1, result.line(2));
        assertEquals(2, result.count(Identification.UNEXPLAINED));
    }

    @Test
    void reportsUnexplainedPeaksMissingLinesAndPresence() {
        Scenes.Observation scene = Scenes.observe(LINES, 0.05, 1e-12, 0.0, 0, 1L);
        // Drop the strongest line's peak: it must be reported missing.
        int strongest = -1;
        for (int j = 0; j < LINES.size(); j++) {
            if (LINES.strength(j) == 1 && LINES.species(j).equals(Species.parse("H I"))) {
                strongest = j;
            }
        }
        List<Double> kept = new ArrayList<>();
        for (int i = 0; i < scene.truth().length; i++) {
            if (scene.truth()[i] != strongest) {
                kept.add(scene.peaks().wavelength(i));
            }
        }
        kept.add(999.999e-9); // far from every line
        double[] positions = kept.stream().mapToDouble(Double::doubleValue).toArray();
        Identification result = Identifier.of(Tolerance.absolute(0.005e-9)).identify(
                PeakList.ofVacuumMetres(positions, null), LINES);
        assertEquals(1, result.unexplained().length);
        boolean missing = false;
        for (int j : result.missingStrongLines()) {
            missing |= j == strongest;
        }
        assertTrue(missing || LINES.wavelength(strongest) > positions[positions.length - 2],
                "the dropped strong line is reported missing");
        for (Identification.SpeciesPresence presence : result.speciesPresence()) {
            assertTrue(presence.matched() > 0, presence.toString());
        }
    }

    @Test
    void permutationInvariance() {
        Scenes.Observation scene = Scenes.observe(LINES, 1e-3, 1e-12, 0.1, 0, 9L);
        Identification sorted = Identifier.of(Tolerance.kSigma(5)).identify(scene.peaks(), LINES);
        qt().withFixedSeed(3L).withExamples(10).forAll(longs().all()).checkAssert(seed -> {
            int n = scene.peaks().size();
            List<Integer> order = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                order.add(i);
            }
            Collections.shuffle(order, new Random(seed));
            double[] positions = new double[n];
            double[] sigmas = new double[n];
            for (int k = 0; k < n; k++) {
                positions[k] = scene.peaks().wavelength(order.get(k));
                sigmas[k] = scene.peaks().sigma(order.get(k));
            }
            Identification shuffled = Identifier.of(Tolerance.kSigma(5)).identify(
                    PeakList.ofVacuumMetres(positions, sigmas), LINES);
            for (int k = 0; k < n; k++) {
                assertEquals(sorted.line(order.get(k)), shuffled.line(k));
                assertEquals(sorted.status(order.get(k)), shuffled.status(k));
            }
        });
    }

    @Test
    void shiftingThePeaksShiftsTheVelocity() {
        Scenes.Observation scene = Scenes.observe(LINES, 1e-2, 1e-12, 0.05, 0, 11L);
        Identifier identifier = Identifier.of(Tolerance.kSigma(5));
        double base = ShiftSearch.redshift(identifier, scene.peaks(), LINES, 200_000).velocity();
        qt().withFixedSeed(5L).withExamples(8).forAll(doubles().between(-100_000, 100_000)).checkAssert(dv -> {
            double factor = 1 + dv / PhysicalConstants.C;
            int n = scene.peaks().size();
            double[] moved = new double[n];
            double[] sigmas = new double[n];
            for (int i = 0; i < n; i++) {
                moved[i] = scene.peaks().wavelength(i) * factor;
                sigmas[i] = scene.peaks().sigma(i);
            }
            ShiftSearch.Fit fit = ShiftSearch.redshift(identifier, PeakList.ofVacuumMetres(moved, sigmas), LINES, 200_000);
            assertEquals(base + dv, fit.velocity(), Math.max(3 * fit.velocityUncertainty(), 1e-3 * Math.abs(dv)));
        });
    }

    @Test
    void addingAnUnrelatedSpeciesNeverRemovesACorrectMatch() {
        Scenes.Observation scene = Scenes.observe(LINES, 1e-3, 1e-12, 0.1, 0, 13L);
        Identification alone = Identifier.of(Tolerance.kSigma(5)).identify(scene.peaks(), LINES);
        LineCatalog.Builder more = LineCatalog.builder();
        for (int j = 0; j < LINES.size(); j++) {
            more.add(LINES.species(j), LINES.wavelength(j), LINES.sigma(j), LINES.strength(j), LINES.label(j));
        }
        // C VI lines land in the same range but on none of these peaks' exact positions.
        Scenes.add(more, Species.parse("C VI"), new org.ritzwerk.atom.Nucleus(6, 12,
                org.ritzwerk.atom.Nucleus.nuclearMassKg(6, 12), 0, java.util.OptionalDouble.empty(),
                java.util.OptionalDouble.of(2.4702e-15), "AME2020; Angeli 2013"), 30);
        LineCatalog extended = more.build();
        Identification with = Identifier.of(Tolerance.kSigma(5)).identify(scene.peaks(), extended);
        for (int i = 0; i < scene.truth().length; i++) {
            int truth = scene.truth()[i];
            if (truth >= 0 && alone.line(i) == truth) {
                assertTrue(with.line(i) >= 0, "peak " + i + " lost its match");
                assertEquals(LINES.label(truth), extended.label(with.line(i)));
            }
        }
    }

    @Test
    void theParallelVariantGivesTheSameResultBitForBit() {
        qt().withFixedSeed(21L).withExamples(12).forAll(longs().all()).checkAssert(seed -> {
            Scenes.Observation scene = Scenes.observe(LINES, 1e-4, 1e-12, 3.0, 0, seed);
            for (Tolerance tolerance : new Tolerance[] {Tolerance.kSigma(5), Tolerance.absolute(4e-12),
                Tolerance.relative(1e-8)}) {
                Identifier identifier = Identifier.of(tolerance);
                Identification one = identifier.identify(scene.peaks(), LINES);
                Identification many = identifier.identifyInParallel(scene.peaks(), LINES, 7);
                for (int i = 0; i < scene.peaks().size(); i++) {
                    assertEquals(one.line(i), many.line(i));
                    assertEquals(one.status(i), many.status(i));
                    assertEquals(one.ambiguity(i), many.ambiguity(i));
                    assertEquals(one.rival(i), many.rival(i));
                    assertEquals(Double.doubleToLongBits(one.rivalOdds(i)), Double.doubleToLongBits(many.rivalOdds(i)));
                }
                assertEquals(java.util.Arrays.toString(one.missingStrongLines()),
                        java.util.Arrays.toString(many.missingStrongLines()));
            }
        });
    }

    @Test
    void findsAConstantWavelengthOffset() {
        // An instrument whose scale reads 0.0123 nm long everywhere.
        Scenes.Observation scene = Scenes.observe(LINES, 1e-3, 1e-12, 0.1, 0, 17L);
        int n = scene.peaks().size();
        double[] moved = new double[n];
        double[] sigmas = new double[n];
        for (int i = 0; i < n; i++) {
            moved[i] = scene.peaks().wavelength(i) + 0.0123e-9;
            sigmas[i] = scene.peaks().sigma(i);
        }
        ShiftSearch.Fit fit = ShiftSearch.offset(Identifier.of(Tolerance.kSigma(5)),
                PeakList.ofVacuumMetres(moved, sigmas), LINES, 0.1e-9);
        assertEquals(0.0123e-9, fit.value(), Math.max(3 * fit.uncertainty(), 1e-15));
        assertTrue(fit.matches() > 50);
    }

    @Test
    void observedIntensityDecidesBetweenAStrongAndAWeakNeighbour() {
        // Five isolated lines set the intensity scale (observed = 1000 x expected); then a faint
        // peak sits between a strong line A (slightly nearer) and a weak line B. By position and
        // expected strength alone A wins; the observed intensity says B (documented score).
        LineCatalog.Builder builder = LineCatalog.builder();
        double[] strengths = {1, 0.5, 0.2, 0.1, 0.05};
        double[] positions = new double[6];
        double[] intensities = new double[6];
        for (int k = 0; k < 5; k++) {
            builder.add(Species.parse("Ne I"), (400 + 10 * k) * 1e-9, 0, strengths[k], "ref " + k);
            positions[k] = (400 + 10 * k) * 1e-9;
            intensities[k] = 1000 * strengths[k];
        }
        builder.add(Species.parse("Ne I"), 500.0000e-9, 0, 1, "A").add(Species.parse("Ne I"), 500.0010e-9, 0, 0.001, "B");
        LineCatalog lines = builder.build();
        positions[5] = 500.0004e-9;
        intensities[5] = 1;
        PeakList peaks = PeakList.of(positions, null, intensities, Unit.METRE, Medium.vacuum());
        Identifier identifier = Identifier.of(Tolerance.absolute(0.003e-9));
        assertEquals("A", lines.label(identifier.withIntensityWeight(0).identify(peaks, lines).line(5)));
        Identification weighed = identifier.identify(peaks, lines);
        assertEquals("B", lines.label(weighed.line(5)));
        assertEquals(Math.log(1000), weighed.intensityScale(), 1e-9);
    }

    @Test
    void badInputIsRefusedClearly() {
        assertEquals("the peak list is empty", assertThrows(IllegalArgumentException.class,
                () -> PeakList.ofVacuumMetres(new double[0], null)).getMessage());
        assertEquals("element 1: NaN nm is not a finite positive spectral position", assertThrows(
                IllegalArgumentException.class, () -> PeakList.of(new double[] {500, Double.NaN}, null, null,
                        Unit.NANOMETRE, Medium.vacuum())).getMessage());
        assertEquals("element 0: -500.0 nm is not a finite positive spectral position", assertThrows(
                IllegalArgumentException.class, () -> PeakList.of(new double[] {-500}, null, null, Unit.NANOMETRE,
                        Medium.vacuum())).getMessage());
        assertEquals("an absolute tolerance must be finite and positive, got 0.0",
                assertThrows(IllegalArgumentException.class, () -> Tolerance.absolute(0)).getMessage());
        assertTrue(assertThrows(IdentificationException.class, () -> Identifier.of(Tolerance.kSigma(3)).identify(
                PeakList.ofVacuumMetres(new double[] {500e-9}, null), LINES)).getMessage()
                .startsWith("a k-sigma tolerance needs uncertainties"));
        assertEquals("a line catalog needs at least one line",
                assertThrows(IllegalArgumentException.class, () -> LineCatalog.builder().build()).getMessage());
    }

    @Test
    void aRepeatedPeakIsRefusedNotCountedTwice() {
        // Three copies of one peak were all matched to H-alpha and gave an offset "from 3 lines"
        // with its uncertainty narrowed by sqrt(3). Sorted or not, serial or parallel: refused,
        // naming the first two peaks at the position in the order given.
        double[] sorted = {486.135e-9, 656.28e-9, 656.28e-9, 656.28e-9};
        double[] unsorted = {656.28e-9, 486.135e-9, 700e-9, 656.28e-9};
        double[] sigmas = {1e-12, 1e-12, 1e-12, 1e-12};
        Identifier identifier = Identifier.of(Tolerance.kSigma(5));
        for (double[] positions : List.of(sorted, unsorted)) {
            PeakList peaks = PeakList.ofVacuumMetres(positions, sigmas);
            String expected = positions == sorted ? "peaks 2 and 3" : "peaks 1 and 4";
            IdentificationException serial = assertThrows(IdentificationException.class,
                    () -> identifier.identify(peaks, LINES));
            assertEquals(IdentificationException.REPEATED_PEAK, serial.code());
            assertTrue(serial.getMessage().startsWith(expected + " (in the order given) lie at the same position, "
                    + "656.280000 nm in vacuum"), serial.getMessage());
            assertEquals(serial.getMessage(), assertThrows(IdentificationException.class,
                    () -> identifier.identifyInParallel(peaks, LINES, 2)).getMessage());
        }
        // a hair apart they are two peaks
        PeakList close = PeakList.ofVacuumMetres(new double[] {656.28e-9, Math.nextUp(656.28e-9)}, new double[] {
            1e-12, 1e-12});
        Identification two = identifier.identify(close, LINES);
        assertEquals(2, two.count(Identification.MATCHED) + two.count(Identification.AMBIGUOUS)
                + two.count(Identification.UNEXPLAINED));
        assertEquals("Identification[2 peaks: " + two.count(Identification.MATCHED) + " matched, "
                + two.count(Identification.AMBIGUOUS) + " ambiguous, " + two.count(Identification.UNEXPLAINED)
                + " unexplained]", two.toString());
    }

    /**
     * The search from a guess that the presence figures use gives the index the binary search
     * gives, for any sorted array (with repeats), key (on the values or between them) and guess (also
     * beyond either end), including NaN and keys beyond either end (the lower bound is unique, so any
     * right search must agree).
     */
    @Test
    void theSearchFromAGuessFindsTheBinarySearchsIndex() {
        qt().withFixedSeed(29L).withExamples(400).forAll(longs().all()).checkAssert(seed -> {
            Random random = new Random(seed);
            double[] sorted = new double[random.nextInt(60)];
            for (int i = 0; i < sorted.length; i++) {
                sorted[i] = random.nextInt(40) * 0.5;
            }
            java.util.Arrays.sort(sorted);
            for (int trial = 0; trial < 50; trial++) {
                // half the keys on the values' own grid, where a walk that stops at <= instead of < differs
                double key = trial == 0 ? Double.NaN
                        : trial % 2 == 0 ? random.nextInt(48) * 0.5 - 2 : random.nextDouble() * 24 - 2;
                // guesses beyond either end too, which the search clamps
                int guess = random.nextInt(sorted.length + 11) - 5;
                assertEquals(Identifier.lowerBound(sorted, key), Identifier.lowerBound(sorted, key, guess),
                        () -> java.util.Arrays.toString(sorted) + " key " + key + " guess " + guess);
            }
        });
    }
}
