package org.ritzwerk.benchmarks;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.DispersionSolution;

/** The benchmark's scene calibrates right, and the naive search finds a sensible straight line. */
class CalibrateBenchmarkTest {

    @Test
    void bothFormsFindTheSolution() {
        CalibrateBenchmark bench = new CalibrateBenchmark();
        bench.setUp();
        DispersionSolution solution = bench.detectAndCalibrate();
        double worst = 0;
        for (int p = 0; p < CalibrateBenchmark.PIXELS; p += 64) {
            double truth = bench.truth[0] + p * (bench.truth[1] + p * (bench.truth[2] + p * bench.truth[3]));
            worst = Math.max(worst, Math.abs(solution.wavelengthAt(p) - truth) / solution.dispersionAt(p));
        }
        assertTrue(worst < 0.1, "worst error " + worst + " pixel");
        // The whole job and the naive whole job both recover the dispersion to 0.1 pixel.
        for (DispersionSolution job : new DispersionSolution[] {bench.calibratorJob().solution(), bench.naiveJob()}) {
            double jobWorst = 0;
            for (int p = 200; p < CalibrateBenchmark.PIXELS - 200; p += 64) {
                double truth = bench.truth[0] + p * (bench.truth[1] + p * (bench.truth[2] + p * bench.truth[3]));
                jobWorst = Math.max(jobWorst, Math.abs(job.wavelengthAt(p) - truth) / job.dispersionAt(p));
            }
            assertTrue(jobWorst < 0.1, "worst error " + jobWorst + " pixel, " + job.usedCount() + " pairs, " + java.util.Arrays.toString(bench.naivePairSearch()));
        }
        double[] naive = bench.naivePairSearch();
        // A straight line through a cubic of 0.134 nm/pixel on average: slope within 20 %.
        assertTrue(Math.abs(naive[1] - 0.1343) < 0.03, "naive slope " + naive[1]);
    }
}
