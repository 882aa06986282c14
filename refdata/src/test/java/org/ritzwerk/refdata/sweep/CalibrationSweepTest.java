package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
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

    @Test
    void theWrongGasesAreRefused() {
        CalibrationSweep.Outcome outcome = CalibrationSweep.run(101, 12, 0.6, Calibrator.defaults(), true);
        assertEquals(0, outcome.wrong() + outcome.imprecise() + outcome.solved(), outcome.toString());
    }
}
