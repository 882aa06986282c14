package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;

/**
 * Seeded sweeps of the calibration job over spectrometers no test was tuned on
 * ({@link LampExposures}: 1024 to 4096 pixels, windows from about 250 to 990 nm, slope changes of up
 * to 60 % across the chip, falling and rising wavelength, foreign lines, second-order ghosts,
 * missing lines, saturation), with the built-in lamp sets and no prior.
 *
 * <p>The rule that must always hold: no run is accepted with a wavelength error above 1 pixel
 * anywhere between its first and last fitted line; the job refuses instead. An accepted run off
 * by more than 0.1 pixel must say so: its error stays within five of the solution's own stated
 * standard uncertainties. The share solved to
 * better than 0.1 pixel is held at what the matcher reaches today: 23 of these 30. Full sweeps
 * (run {@link CalibrationSweep#main} with {@code 1 100 0.6}, {@code 101 100 0.6}, ...), solved /
 * refused / accepted with 0.1 to 1 pixel error (a blended or edge line pulling the cubic) / worse:
 * seeds 1 to 100 84 / 7 / 9 / 0, seeds 101 to 200 85 / 4 / 11 / 0, 201 to 300 72 / 9 / 19 / 0,
 * 301 to 400 80 / 7 / 13 / 0 (before the matcher's leave-one-out check: 82 / 9 / 9 / 0,
 * 83 / 5 / 11 / 1, 72 / 8 / 19 / 1, 80 / 7 / 13 / 0). The goal is 99 % solved.
 *
 * <p>With the dispersion fit's widening for an uncertain degree choice and the blend offset bound
 * of unresolved peaks: seeds 1 to 100 84 / 7 / 9 / 0, 101 to 200 84 / 4 / 12 / 0. The runs off
 * by 0.1 to 1 pixel are limited by their data, not by a wrong pair: their error sits at the end of
 * the fitted range, where one or two weak lines (S/N 6 to 12, centroid uncertainties 0.1 to 0.3
 * pixel) or a long gap between lines hold the cubic. Their stated uncertainty says so: over every
 * accepted run, at 201 pixels from its first to its last fitted line, the error is below one
 * stated standard uncertainty at 0.741 (seeds 1 to 100) and 0.705 (101 to 200) of the points, below
 * two at 0.971 and 0.947 (0.683 and 0.954 for Gaussian errors); 3 and 4 runs exceed three stated
 * uncertainties somewhere (a centroid pulled by an unflagged blend; worst 5.6, an error of 0.083
 * pixel).
 */
class CalibrationSweepTest {

    @Test
    void curvedDispersionsAreSolvedOrRefusedNeverWrong() {
        CalibrationSweep.Outcome outcome = CalibrationSweep.run(1, 30, 0.6, Calibrator.defaults());
        assertEquals(0, outcome.wrong(), outcome.toString());
        assertTrue(outcome.solved() >= 23, outcome.toString());
        // Where a solution is off by 0.1 to 1 pixel, it says so: the error stays within five of its
        // own stated standard uncertainties.
        assertTrue(outcome.worstImpreciseSigmas() <= 5, outcome.toString());
        // The stated uncertainty is a standard uncertainty, neither too small nor much too large:
        // at 201 pixels of every accepted run, the error is within two of it at 0.957 of them
        // (0.954 for Gaussian errors).
        assertTrue(outcome.within2Sigma() >= 0.9 && outcome.within2Sigma() <= 0.99, outcome.toString());
        assertTrue(outcome.within1Sigma() >= 0.6 && outcome.within1Sigma() <= 0.85, outcome.toString());
    }

    /**
     * Exposures once accepted with a lone foreign line at the end of the pairs given to a lamp line
     * 5 pixels away (seed 163: Ne, 1024 pixels, falling; the cubic bent to take it, and the final
     * fit's clipping then rejected the right pair next to it) or 7 pixels away (seed 223), and one
     * refused before (seed 94: Hg+Kr) whose best pairing held such a pair 10 pixels off. The
     * matcher's leave-one-out check drops such a pair: 163 and 94 are now solved, 223 refused.
     */
    @Test
    void aLoneEndPairTheOthersDoNotConfirmIsDropped() {
        for (long seed : new long[] {94, 163}) {
            CalibrationSweep.Outcome outcome = CalibrationSweep.run(seed, 1, 0.6, Calibrator.defaults());
            assertEquals(1, outcome.solved(), outcome.toString());
        }
        CalibrationSweep.Outcome outcome = CalibrationSweep.run(223, 1, 0.6, Calibrator.defaults());
        assertEquals(1, outcome.refused(), outcome.toString());
    }

    /**
     * Seed 107 (Hg+Ar, 1024 pixels, slope change +45 %): Hg 576.96 nm, unresolved from 579.07 nm,
     * is found as one peak of FWHM 7.6 pixels (its neighbours: about 3.5) whose centroid lies 1.4
     * pixels from 576.96 nm, the lone pair at that end. Taken at its statistical uncertainty
     * (0.29 pixel) it bent the cubic by 0.74 pixel, 2.3 stated standard uncertainties there. With
     * the blend's offset bound it weighs little: the largest error is 0.39 pixel, and nowhere more
     * than 1.8 stated standard uncertainties.
     */
    @Test
    void anUnresolvedBlendAtTheEndDoesNotBendTheSolution() {
        LampExposures.Exposure exposure = new LampExposures().exposure(107, 0.6);
        Calibration calibration = Calibrator.defaults().withSaturationLevel(exposure.saturation())
                .calibrate(CalibrationProblem.builder(exposure.counts()).lamp(exposure.lamp()).build());
        double error = CalibrationSweep.largestError(exposure, calibration.solution(), calibration);
        double sigmas = CalibrationSweep.largestErrorInSigmas(exposure, calibration.solution(), calibration);
        assertTrue(error < 0.5, "error " + error + " px");
        assertTrue(sigmas < 2, "error " + sigmas + " stated standard uncertainties");
    }

    @Test
    void theWrongGasesAreRefused() {
        CalibrationSweep.Outcome outcome = CalibrationSweep.run(101, 12, 0.6, Calibrator.defaults(), true);
        assertEquals(0, outcome.wrong() + outcome.imprecise() + outcome.solved(), outcome.toString());
    }
}
