package org.ritzwerk.engine.identify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;

/**
 * A species with one strong line in range but many weaker lines found is present: its presence
 * was 0 because only the strong lines were weighed against chance (He II's 468.6 nm with 15 more
 * lines matched where chance expected 0.7). Invented lines; peaks seeded.
 */
class PresenceEvidenceTest {

    @Test
    void manyWeakerLinesFoundShowASpeciesWithOneStrongLine() {
        Species x = Species.parse("He II");
        LineCatalog.Builder builder = LineCatalog.builder().add(x, 500e-9, 0, 1, "strong");
        double[] weak = new double[15];
        for (int k = 0; k < weak.length; k++) {
            weak[k] = (410 + 19 * k) * 1e-9;
            builder.add(x, weak[k], 0, 0.1, "weak " + k);
        }
        LineCatalog catalog = builder.build();
        // the 16 lines as peaks, and 40 peaks from nothing offered, 400-700 nm
        SplittableRandom random = new SplittableRandom(5);
        double[] metres = new double[56];
        metres[0] = 500e-9;
        System.arraycopy(weak, 0, metres, 1, weak.length);
        for (int k = 16; k < metres.length; k++) {
            metres[k] = random.nextDouble(400, 700) * 1e-9;
        }
        Arrays.sort(metres);
        double[] sigma = new double[metres.length];
        Arrays.fill(sigma, 0.02e-9);
        Identification result = Identifier.of(Tolerance.kSigma(5)).identify(PeakList.ofVacuumMetres(metres, sigma),
                catalog);
        Identification.SpeciesPresence presence = result.speciesPresence().get(0);
        assertEquals(1, presence.strongInRange());
        assertEquals(1, presence.strongMatched());
        assertTrue(presence.matched() >= 15, "lines matched: " + presence.matched());
        // one strong line alone: chance would give it with probability above 0.01 at this density
        assertTrue(presence.strongByChance() > 0.01, "chance for the strong line: " + presence.strongByChance());
        assertTrue(presence.chanceProbability() < 1e-6, "with all lines: " + presence.chanceProbability());
        assertTrue(presence.presence() > 0.3, "presence " + presence.presence());
    }
}
