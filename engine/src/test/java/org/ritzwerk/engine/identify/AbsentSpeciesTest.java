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
