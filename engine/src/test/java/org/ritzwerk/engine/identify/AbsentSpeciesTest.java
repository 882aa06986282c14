package org.ritzwerk.engine.identify;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;

/**
 * A peak from a gas that was not offered takes the nearest weak line it finds. When that line's
 * species shows none of its strong lines in the peaks' range, the match is flagged ambiguous
 * (a krypton lamp line was reported as a matched sodium 10d - 3p line while the summary called
 * sodium absent). Invented lines and peaks.
 */
class AbsentSpeciesTest {

    private static final Species H = Species.parse("H I");
    private static final Species NA = Species.parse("Na I");

    private static LineCatalog catalog() {
        return LineCatalog.builder().add(H, 410e-9, 0, 1, "h1").add(H, 434e-9, 0, 1, "h2")
                .add(H, 486e-9, 0, 1, "h3").add(H, 656e-9, 0, 1, "h4")
                .add(NA, 589e-9, 0, 1, "strong").add(NA, 427.36e-9, 0, 0.001, "weak").build();
    }

    private static PeakList peaks(double... metres) {
        double[] sigma = new double[metres.length];
        Arrays.fill(sigma, 0.02e-9);
        return PeakList.ofVacuumMetres(metres, sigma);
    }

    @Test
    void aWeakLineOfASpeciesShowingNoneOfItsStrongLinesIsFlagged() {
        // the peak at 427.3969 nm lies 1.8 sigma from the weak line; the strong line at 589 nm has no peak
        Identification result = Identifier.of(Tolerance.kSigma(5))
                .identify(peaks(410e-9, 427.3969e-9, 434e-9, 486e-9, 656e-9), catalog());
        assertEquals(Identification.AMBIGUOUS, result.status(1));
        for (int i : new int[] {0, 2, 3, 4}) {
            assertEquals(Identification.MATCHED, result.status(i), "hydrogen peak " + i);
        }
    }

    @Test
    void theSameLineIsMatchedWhenItsSpeciesShowsAStrongLine() {
        Identification result = Identifier.of(Tolerance.kSigma(5))
                .identify(peaks(410e-9, 427.3969e-9, 434e-9, 486e-9, 589e-9, 656e-9), catalog());
        assertEquals(Identification.MATCHED, result.status(1));
        assertEquals(Identification.MATCHED, result.status(4));
    }

    /**
     * Twelve strong lines of an invented species X, 20 nm apart from 410 to 630 nm, and a peak
     * list from a gas that was not offered: 30 seeded random peaks over 400-700 nm (0.1 nm
     * uncertainty, 5-sigma tolerance: chance puts a peak near each line about one time in ten)
     * and two more peaks placed 0.15 nm from two of X's lines. Two or three of twelve strong
     * lines found where chance expects about one is what chance gives (presence 0), and a
     * present species would show more than half of them: X is not shown, and its matches are
     * ambiguous (they were matched: an argon lamp's peaks were called krypton lines at -4.8
     * sigma while the summary gave krypton presence 0).
     */
    @Test
    void matchesOfASpeciesShowingNoMoreThanChanceAreFlagged() {
        Species x = Species.parse("Kr I");
        LineCatalog.Builder builder = LineCatalog.builder();
        for (int k = 0; k < 12; k++) {
            builder.add(x, (410 + 20 * k) * 1e-9, 0, 1, "x" + k);
        }
        LineCatalog catalog = builder.build();
        java.util.SplittableRandom random = new java.util.SplittableRandom(12);
        double[] metres = new double[32];
        for (int k = 0; k < 30; k++) {
            metres[k] = (400 + 300 * random.nextDouble()) * 1e-9;
        }
        metres[30] = 450.15e-9;
        metres[31] = 589.85e-9;
        Arrays.sort(metres);
        double[] sigma = new double[metres.length];
        Arrays.fill(sigma, 0.1e-9);
        Identification result = Identifier.of(Tolerance.kSigma(5))
                .identify(PeakList.ofVacuumMetres(metres, sigma), catalog);
        Identification.SpeciesPresence presence = result.speciesPresence().get(0);
        org.junit.jupiter.api.Assertions.assertTrue(presence.strongMatched() >= 2 && presence.presence() == 0
                && presence.strongByChance() > 0.5, presence.toString());
        int flagged = 0;
        for (int i = 0; i < metres.length; i++) {
            if (result.line(i) >= 0) {
                assertEquals(Identification.AMBIGUOUS, result.status(i), "peak " + i + " " + presence);
                assertEquals(true, result.speciesNotShown(i));
                assertEquals(true, result.matchedByOdds(i), "the odds themselves are unchanged");
                flagged++;
            } else {
                assertEquals(false, result.speciesNotShown(i));
            }
        }
        assertEquals(presence.strongMatched(), flagged);
        // the same lines with a peak at every one of them: X is present and its matches stand
        double[] shown = Arrays.copyOf(metres, metres.length + 12);
        for (int k = 0; k < 12; k++) {
            shown[metres.length + k] = (410 + 20 * k + 0.05) * 1e-9;
        }
        Arrays.sort(shown);
        double[] shownSigma = new double[shown.length];
        Arrays.fill(shownSigma, 0.1e-9);
        Identification present = Identifier.of(Tolerance.kSigma(5))
                .identify(PeakList.ofVacuumMetres(shown, shownSigma), catalog);
        org.junit.jupiter.api.Assertions.assertTrue(present.speciesPresence().get(0).presence() > 0.5);
        assertEquals(12, present.count(Identification.MATCHED), present.toString());
    }

    /**
     * Peaks so dense (600 over 300 nm, 0.1 nm uncertainty) that chance puts one near most lines:
     * an invented species showing all twelve of its strong lines has presence 0 there, since
     * chance gives what was found, yet the count's upper bound is that of a present species, so
     * its matches are not flagged for its species (presence alone cannot tell where peaks are
     * this dense, and must not flag every match).
     */
    @Test
    void aSpeciesPresentAmongDensePeaksIsNotFlaggedForItsPresence() {
        Species x = Species.parse("Kr I");
        LineCatalog.Builder builder = LineCatalog.builder();
        for (int k = 0; k < 12; k++) {
            builder.add(x, (410 + 20 * k) * 1e-9, 0, 1, "x" + k);
        }
        LineCatalog catalog = builder.build();
        java.util.SplittableRandom random = new java.util.SplittableRandom(3);
        double[] metres = new double[612];
        for (int k = 0; k < 600; k++) {
            metres[k] = (400 + 300 * random.nextDouble()) * 1e-9;
        }
        for (int k = 0; k < 12; k++) {
            metres[600 + k] = (410 + 20 * k + 0.01) * 1e-9;
        }
        Arrays.sort(metres);
        double[] sigma = new double[metres.length];
        Arrays.fill(sigma, 0.1e-9);
        Identification result = Identifier.of(Tolerance.kSigma(5))
                .identify(PeakList.ofVacuumMetres(metres, sigma), catalog);
        Identification.SpeciesPresence presence = result.speciesPresence().get(0);
        assertEquals(12, presence.strongMatched(), presence.toString());
        assertEquals(0, presence.presence(), 0, presence.toString());
        for (int i = 0; i < metres.length; i++) {
            assertEquals(false, result.speciesNotShown(i), "peak " + i);
        }
    }

    @Test
    void aShiftSearchedOutsideTheTruthShowsNoSpeciesBeyondChance() {
        // four lines of one species seen at +150 km/s among 300 lines of another, invented,
        // spread over 400-700 nm, and 100 peaks from neither (seeded)
        java.util.Random random = new java.util.Random(7);
        LineCatalog.Builder builder = LineCatalog.builder().add(H, 410e-9, 0, 1, "h1").add(H, 434e-9, 0, 1, "h2")
                .add(H, 486e-9, 0, 1, "h3").add(H, 656e-9, 0, 1, "h4");
        for (int k = 0; k < 300; k++) {
            builder.add(NA, (400 + 300 * random.nextDouble()) * 1e-9, 0, random.nextDouble() + 0.01, "x" + k);
        }
        LineCatalog catalog = builder.build();
        double factor = 1 + 150e3 / org.ritzwerk.constants.PhysicalConstants.C;
        double[] metres = new double[104];
        double[] lines = {410e-9, 434e-9, 486e-9, 656e-9};
        for (int k = 0; k < 4; k++) {
            metres[k] = lines[k] * factor;
        }
        for (int k = 4; k < metres.length; k++) {
            metres[k] = (400 + 300 * random.nextDouble()) * 1e-9;
        }
        Arrays.sort(metres);
        PeakList peaks = peaks(metres);
        IdentificationSearch outside = IdentificationSearch.of(Identifier.of(Tolerance.kSigma(5)))
                .withVelocitySearch(100e3);
        assertEquals(false, outside.run(peaks, catalog).identification().someSpeciesBeyondChance());
        // at the true shift the four lines stand out
        Identification atTruth = Identifier.of(Tolerance.kSigma(5)).identify(peaks, catalog.shifted(factor - 1));
        assertEquals(true, atTruth.someSpeciesBeyondChance());
    }
}
