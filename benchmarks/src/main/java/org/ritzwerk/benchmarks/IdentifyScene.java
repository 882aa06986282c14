package org.ritzwerk.benchmarks;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.identify.PeakList;

/**
 * The identification benchmarks' input, from a fixed seed: lines spread uniformly over
 * 300-1000 nm with random strengths, and sorted peaks of which one per line is real (0.1 pm
 * noise) and the rest fall at random.
 */
final class IdentifyScene {

    final LineCatalog lines;
    final PeakList peaks;
    final double[] lineWavelengths;
    final double[] peakWavelengths;

    IdentifyScene(int lineCount, int peakCount, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        lineWavelengths = new double[lineCount];
        LineCatalog.Builder builder = LineCatalog.builder();
        Species[] species = {Species.parse("Ne I"), Species.parse("Ar I"), Species.parse("Fe I")};
        for (int j = 0; j < lineCount; j++) {
            lineWavelengths[j] = (300 + 700 * random.nextDouble()) * 1e-9;
            builder.add(species[j % 3], lineWavelengths[j], 0, random.nextDouble(), null);
        }
        lines = builder.build();
        Arrays.sort(lineWavelengths);
        peakWavelengths = new double[peakCount];
        for (int i = 0; i < peakCount; i++) {
            peakWavelengths[i] = i < Math.min(lineCount, peakCount)
                    ? lineWavelengths[i] + 0.1e-12 * (random.nextDouble() - 0.5)
                    : (300 + 700 * random.nextDouble()) * 1e-9;
        }
        Arrays.sort(peakWavelengths);
        peaks = PeakList.ofVacuumMetres(peakWavelengths, null);
    }
}
