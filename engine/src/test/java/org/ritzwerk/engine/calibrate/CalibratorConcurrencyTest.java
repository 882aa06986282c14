package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Medium;

/**
 * One {@link Calibrator} shared by several threads gives every calibration bit for bit what it
 * gives run serially (its Javadoc and the README say it may be shared). Synthetic neon-lamp
 * exposures of {@link LampScene} with different contaminants and noise draws, plus one that
 * cannot be calibrated (a flat exposure), whose refusal must be the same too.
 */
class CalibratorConcurrencyTest {

    /** What a user would compare: the coefficients, the uncertainty across the detector, the pairs; or the refusal. */
    private static String outcome(Calibrator calibrator, CalibrationProblem problem) {
        try {
            Calibration calibration = calibrator.calibrate(problem);
            DispersionSolution solution = calibration.solution();
            StringBuilder text = new StringBuilder();
            for (double c : solution.scaledCoefficients()) {
                text.append(Double.doubleToRawLongBits(c)).append(',');
            }
            for (int p = 0; p < LampScene.PIXELS; p += 455) {
                text.append(Double.doubleToRawLongBits(solution.wavelengthSigmaAt(p))).append(',');
            }
            return text.append(solution.usedCount()).append(' ').append(calibration.pairLabels()).toString();
        } catch (RuntimeException e) {
            return e.getClass().getName() + ": " + e.getMessage();
        }
    }

    @Test
    void aSharedCalibratorGivesOnManyThreadsWhatItGivesSerially() throws Exception {
        LampSet lamp = LampSet.of(List.of(CalibratorTest.neonList(Medium.air())), Medium.air());
        List<CalibrationProblem> problems = new ArrayList<>();
        for (long seed = 1; seed <= 5; seed++) {
            problems.add(CalibrationProblem.builder(new LampScene(40, seed, (int) (2 * seed)).exposure(seed))
                    .lamp(lamp).build());
        }
        double[] flat = new double[LampScene.PIXELS];
        java.util.Arrays.fill(flat, 100);
        problems.add(CalibrationProblem.builder(flat).lamp(lamp).build());
        Calibrator calibrator = Calibrator.defaults();
        List<String> serial = new ArrayList<>();
        for (CalibrationProblem problem : problems) {
            serial.add(outcome(calibrator, problem));
        }
        assertEquals(5, serial.stream().filter(s -> !s.contains("Exception")).count(), serial.toString());
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Future<String>> futures = new ArrayList<>();
            for (int round = 0; round < 3; round++) {
                for (CalibrationProblem problem : problems) {
                    futures.add(pool.submit(() -> outcome(calibrator, problem)));
                }
            }
            for (int k = 0; k < futures.size(); k++) {
                assertEquals(serial.get(k % problems.size()), futures.get(k).get(), "problem " + k % problems.size());
            }
        } finally {
            pool.shutdownNow();
        }
    }
}
