package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationException;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.LampMatch;
import org.ritzwerk.engine.calibrate.PeakFlag;
import org.ritzwerk.engine.calibrate.Peaks;

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
 * better than 0.1 pixel is held at what the matcher reaches today: 46 of seeds 1 to 60 on the
 * exposures of 2026-12-05 (below); before them 24 of seeds 1 to 30 (23 before the second-order
 * images, 25 before the chance test counted the four pairs a cubic meets by itself). Full sweeps
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
 *
 * <p>With the width test for unresolved blends ({@code PeakFlag.WIDE}, widened like a poor fit):
 * the same counts, 84 / 7 / 9 / 0 and 84 / 4 / 12 / 0, the same coverage (0.741 / 0.971 and
 * 0.705 / 0.947), and every exposure against the wrong gases refused (82 of 82 in seeds 1 to 100,
 * 85 of 85 in 101 to 200). The flag fires on 11 fitted pairs in seeds 1 to 200, all real blends,
 * 8 with centroids 3.5 to 12 statistical standard uncertainties off; the fit's clipping had
 * already kept those runs right, so the counts do not move. The pulled centroids of seeds 9 and 32
 * lie under foreign lines 0.35 to 1.55 pixels away that change the width too little to be seen
 * (see the test below); seed 139's worst pair has no other line within 8 pixels.
 *
 * <p>With peaks explained as second-order images of the lamp's lines (see the test below):
 * seeds 1 to 100 87 / 4 / 9 / 0, 101 to 200 85 / 4 / 11 / 0, 201 to 300 74 / 6 / 20 / 0, 301 to 400
 * 82 / 7 / 11 / 0 (the same code with images switched off: 84 / 7 / 9 / 0, 84 / 4 / 12 / 0,
 * 73 / 9 / 18 / 0, 81 / 7 / 12 / 0), 328 of 400 solved; every exposure against the wrong gases
 * refused (341 of 341 in seeds 1 to 400). Coverage of the stated uncertainty, within one and two
 * of it: 0.743 / 0.971, 0.702 / 0.947, 0.690 / 0.952, 0.719 / 0.966. The goal of 99 % solved is not
 * reached, and the causes are these. Of the 51 runs accepted with 0.1 to 1 pixel error, 40 have
 * it within a tenth of the fitted range from its first or last line, which in most is a weak line
 * (S/N 5 to 15, centroid uncertainty 0.1 to 0.3 pixel) or an unresolved blend: the error is that
 * line's own, and the stated uncertainty says so (within 2.5 of it in 35 of the 40); the other 11
 * have it inside a long gap between lines (seeds 77, 83, 216, 222, 260, 262, 272, 275, 302, 330,
 * 358), where the degree AICc chose (a quadratic for 7 pairs in seed 275) cannot follow the cubic
 * truth. Two runs exceed five stated standard uncertainties: seed 275 (6.3) and seed 395 (6.1).
 * Of the 21 refused, 12 fail the chance test with few peaks (5 to 16 strong; right pairings whose
 * probability times the 520 to 4809 pairings tried exceeds 0.01),
 * 3 find only 3 peaks, 5 find no pairing of 4 or more (4 to 11 peaks), 1 fails the final fit's
 * chi-square.
 *
 * <p>The figures above are of the exposures before 2026-12-05. Then the lamp sets gained 19 rows
 * (Ne I 594.5-808.2 nm, Hg I 275.3, 289.4 and 334.1 nm, Xe I 452.5-992.3 nm) and each lamp line's
 * scatter and dropout got its own stream (seed, wavelength), which changed every exposure. Seeds 1
 * to 400 (CalibrationSweep's main, {@code 1 400 0.6}): 313 solved / 27 refused / 60 accepted 0.1 to
 * 1 pixel off / 0 worse; by hundreds 80 / 9 / 11 / 0, 86 / 4 / 10 / 0, 82 / 6 / 12 / 0, 65 / 8 / 27 / 0.
 * Coverage 0.776 within one stated standard uncertainty, 0.977 within two; 7 runs beyond three
 * somewhere. The worst is seed 367 (Hg+Kr, 1024 pixels): its last fitted line, Hg 334.148 nm (S/N
 * 117), has a foreign line 0.89 pixel away that pulls the centroid 0.68 pixel, 25 of its statistical
 * standard uncertainties, unflagged; the run is accepted 0.68 pixel off there while stating 0.09
 * pixel (25 stated uncertainties). Every exposure against the wrong gases is refused (341 of 341).
 * Seeds 1 to 30 alone now give coverage 0.807 / 0.997, more cautious than the test's band in so few
 * runs; seeds 1 to 60 give 0.817 / 0.985, so the test below runs 60.
 */
class CalibrationSweepTest {

    @Test
    void curvedDispersionsAreSolvedOrRefusedNeverWrong() {
        // Seeds 1 to 60 since the exposures of 2026-12-05: 46 solved, 8 refused, 6 accepted 0.1 to 1 pixel
        // off (at most 2.9 stated standard uncertainties), none worse.
        CalibrationSweep.Outcome outcome = CalibrationSweep.run(1, 60, 0.6, Calibrator.defaults());
        assertEquals(0, outcome.wrong(), outcome.toString());
        assertTrue(outcome.solved() >= 46, outcome.toString());
        // Where a solution is off by 0.1 to 1 pixel, it says so: the error stays within five of its
        // own stated standard uncertainties.
        assertTrue(outcome.worstImpreciseSigmas() <= 5, outcome.toString());
        // The stated uncertainty is a standard uncertainty, neither too small nor much too large:
        // at 201 pixels of every accepted run, the error is within two of it at 0.985 of them in seeds
        // 1 to 60 (0.954 for Gaussian errors), within one at 0.817 (0.683).
        assertTrue(outcome.within2Sigma() >= 0.9 && outcome.within2Sigma() <= 0.99, outcome.toString());
        assertTrue(outcome.within1Sigma() >= 0.6 && outcome.within1Sigma() <= 0.85, outcome.toString());
    }

    /**
     * Exposures once accepted with a lone foreign line at the end of the pairs given to a lamp line
     * 5 pixels away (seed 163: Ne, 1024 pixels, falling; the cubic bent to take it, and the final
     * fit's clipping then rejected the right pair next to it) or 7 pixels away (seed 223), and one
     * refused before (seed 94: Hg+Kr) whose best pairing held such a pair 10 pixels off. The
     * matcher's leave-one-out check drops such a pair: 163 was then solved, 223 refused, and 94
     * solved. Since peaks may be second-order images, seed 94 (11 ghosts in its window) is refused
     * again, safely: the images of the Hg and Kr lines below 495 nm crowd its window, so its right
     * pairing's 8 pairs within 0.17 pixel are met by 0.2 chance matches, probability 6.4e-6 over
     * 4809 pairings tried, 0.031 in all where 0.01 is accepted (over the 1595 distinct solutions
     * those pairings make, the trials counted now, 0.0102: still refused). With images left out it
     * is solved as before. Since growth leaves a peak alone when a second-order image lies much
     * nearer to it than the lamp line it would take (LampMatcher.IMAGE_PREFERENCE), fewer pairings
     * are tried and seed 94 is solved with images too.
     *
     * <p>The exposures of 2026-12-05 no longer show such a pair in these seeds, and no other seed was
     * found that does (the check leaves no trace in a finished calibration): seed 94 (Hg+Kr, 795.9 to
     * 990.0 nm) has no foreign line now, seed 163 (Ne, 457.7 to 682.9 nm, falling) none near the end of
     * its pairs; both are solved. Seed 223 (Hg+Ne, 470.0 to 603.8 nm, falling) is now accepted 0.37
     * pixel off, within 1.5 of its stated uncertainties, where it was refused. That is all this test
     * holds now: these seeds' outcomes, not the check. The check itself is shown by a scene built for
     * it, LoneEndPairTest (a missing neon line at the chip's end with a foreign line 4 to 6 pixels
     * from its place), which fails with the check switched off.
     */
    @Test
    void theFormerLoneEndPairSeedsAreSolvedOrSayHowFarOff() {
        CalibrationSweep.Outcome outcome = CalibrationSweep.run(163, 1, 0.6, Calibrator.defaults());
        assertEquals(1, outcome.solved(), outcome.toString());
        outcome = CalibrationSweep.run(223, 1, 0.6, Calibrator.defaults());
        assertEquals(1, outcome.imprecise(), outcome.toString());
        assertTrue(outcome.worstImpreciseSigmas() < 2, outcome.toString());
        for (Calibrator settings : new Calibrator[] {Calibrator.defaults(),
            Calibrator.defaults().withSecondOrder(false)}) {
            outcome = CalibrationSweep.run(94, 1, 0.6, settings);
            assertEquals(1, outcome.solved(), outcome.toString());
        }
    }

    /**
     * Exposures whose strongest peaks are partly second-order ghosts (a lamp line at half the
     * wavelength, which a grating without an order-sorting filter puts there), refused while the
     * matcher knew only the first order, solved now that a peak may be explained as such an image
     * (counted among the strong peaks matched, never a pair of the fit):
     * <ul>
     *   <li>seed 17 (Hg+Ar, 1024 pixels, falling, 12 peaks: 6 lamp lines, 5 ghosts, 1 foreign): the
     *       right seed triplets died in the neighbour test, every neighbour being a ghost, and 6 of
     *       12 is below the 60 % share; the best pairing found matched 2 peaks;</li>
     *   <li>seed 24 (Hg+Ar, 12 peaks, 3 ghosts): the right pairing, 7 pairs within 0.16 pixel,
     *       failed the chance test (probability 5.7e-6 over 4234 pairings, 0.024 in all);</li>
     *   <li>seed 38 (Hg+Ne, 10 peaks: 6 lamp lines, 3 foreign, 1 ghost): the best pairing matched
     *       5 of 10 with a robust reduced chi-square of 14.9 (in part wrong);</li>
     *   <li>seed 62 (Hg+Kr, 12 peaks, 11 ghosts in the window): 8 pairs within 0.45 pixel, chance
     *       probability 2.0e-5 over 3605 pairings, 0.072 in all;</li>
     *   <li>seeds 253 and 373 (Hg+Ar and Hg+Kr with 3 and 2 ghosts, refused by the chance test as
     *       24 was: 0.039 and 0.070 in all) are solved as well, and seed
     *       107 (16 ghosts), accepted with 0.39 pixel error, is solved: its ghost peaks no longer
     *       take part in the final one-to-one assignment.</li>
     * </ul>
     * With images switched off ({@code withSecondOrder(false)}, as for a spectrometer with an
     * order-sorting filter) each is refused, or for 107 imprecise, as before. Seeds 17, 38 and 253
     * are refused again since the chance test counts as evidence only the pairs beyond the four a
     * cubic meets by itself, where a quadratic cannot meet them as well (0.042, 0.057 and 0.014
     * expected by chance in all): right pairings, but not told from chance at the 0.01 the test
     * accepts. Seed 253 is solved again since the trials are counted as distinct solutions.
     *
     * <p>On the exposures of 2026-12-05 the seeds above are no longer such cases. Over seeds 1 to 400,
     * three runs are solved with images and not without them: seed 104 (Hg+Kr, 1024 pixels, 773.7 to
     * 990.0 nm, 11 ghosts; refused without images, too small a share of its strongest peaks paired),
     * seed 217 (Hg+Ar, 2048 pixels, 255.6 to 669.9 nm, 9 ghosts; without images accepted 1.6 pixels
     * off, the ghosts taken for lamp lines, which is why a spectrometer without an order-sorting filter
     * must keep images on) and seed 222 (Hg+Kr, 2048 pixels, 767.3 to 896.2 nm, 10 ghosts; without
     * images accepted 0.28 pixel off).
     */
    @Test
    void secondOrderGhostsAreExplainedByTheLamp() {
        for (long seed : new long[] {104, 217, 222}) {
            CalibrationSweep.Outcome outcome = CalibrationSweep.run(seed, 1, 0.6, Calibrator.defaults());
            assertEquals(1, outcome.solved(), outcome.toString());
            CalibrationSweep.Outcome firstOrderOnly = CalibrationSweep.run(seed, 1, 0.6,
                    Calibrator.defaults().withSecondOrder(false));
            assertEquals(0, firstOrderOnly.solved(), firstOrderOnly.toString());
        }
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

    /**
     * The width test ({@code PeakFlag.WIDE}) marks real blends only: over seeds 1 to 50, every
     * paired peak it flags (and the chi-square test did not) has another line of the exposure (a
     * lamp line, a second-order ghost or a foreign line) within 2.5 of its FWHM, which is the
     * reach of a profile fit's group; and of the paired peaks with no other line that near, none
     * is flagged. (Seeds 1 to 200: 11 such flagged pairs, all with a partner; 8 of them had
     * centroids 3.5 to 12 statistical standard uncertainties from their lines.)
     */
    @Test
    void widePeaksAreBlendsAndSingleLinesAreNotFlagged() {
        LampExposures exposures = new LampExposures();
        int flaggedWithPartner = 0;
        int single = 0;
        for (long seed = 1; seed <= 50; seed++) {
            LampExposures.Exposure exposure = exposures.exposure(seed, 0.6);
            Calibration calibration;
            try {
                calibration = settings(exposure).calibrate(CalibrationProblem.builder(exposure.counts())
                        .lamp(exposure.lamp()).build());
            } catch (RuntimeException e) {
                continue;
            }
            Peaks peaks = calibration.peaks();
            LampMatch match = calibration.match();
            for (int i = 0; i < match.size(); i++) {
                int k = match.peakIndex(i);
                double reachNm = 2.5 * peaks.fwhm(k) * Math.abs(exposure.truthDispersionAt(match.pixel(i)));
                boolean partner = otherLineWithin(exposure, match.wavelength(i), reachNm);
                boolean wide = peaks.has(k, PeakFlag.WIDE) && !peaks.has(k, PeakFlag.POOR_FIT);
                if (wide) {
                    assertTrue(partner, "seed " + seed + ": " + match.wavelength(i) + " nm flagged WIDE, no line near");
                    assertTrue(calibration.blendOffsetBound(i) > 0, "seed " + seed + ": flagged but not widened");
                    assertEquals("blend", calibration.solution().pairFlag(i), "seed " + seed);
                    flaggedWithPartner++;
                }
                single += partner ? 0 : 1;
            }
        }
        assertTrue(flaggedWithPartner >= 3, flaggedWithPartner + " flagged pairs (seeds 18, 21, 43)");
        assertTrue(single > 500, single + " single-line pairs checked");
    }

    /**
     * Centroids pulled by several of their standard uncertainties lie under foreign lines no profile
     * test can separate, so they stay unflagged. On the exposures of 2026-12-05: seed 18's Ne
     * 920.176 nm (S/N 88) is pulled 0.10 pixel (4.4 standard uncertainties) by a foreign line 0.12
     * pixel away; seed 48's Ne 702.405 nm (S/N 132) 0.07 pixel (3.5) by one 0.16 pixel away; seed 13's
     * weak Kr 769.454 nm (S/N 9) 1.5 pixels (9.7) by one 1.54 pixels away. (Before, seeds 9 and 32:
     * Kr 877.675 nm with a foreign line 1.55 pixels away, Ne 585.249 and 914.867 nm with foreign
     * lines 0.35 and 0.45 pixel away.)
     */
    @Test
    void theCentroidsPulledInSeeds13And18And48LieUnderForeignLinesTooCloseToSee() {
        LampExposures exposures = new LampExposures();
        Object[][] cases = {{13L, 769.45401, 1.6}, {18L, 920.17591, 0.5}, {48L, 702.40504, 0.5}};
        for (Object[] c : cases) {
            LampExposures.Exposure exposure = exposures.exposure((Long) c[0], 0.6);
            Calibration calibration = settings(exposure).calibrate(CalibrationProblem.builder(exposure.counts())
                    .lamp(exposure.lamp()).build());
            LampMatch match = calibration.match();
            int pair = -1;
            for (int i = 0; i < match.size(); i++) {
                pair = Math.abs(match.wavelength(i) - (Double) c[1]) < 1e-3 ? i : pair;
            }
            assertTrue(pair >= 0, c[1] + " nm paired in seed " + c[0]);
            double perPixel = Math.abs(exposure.truthDispersionAt(match.pixel(pair)));
            double nearest = Double.POSITIVE_INFINITY;
            for (double nm : exposure.foreignNm()) {
                nearest = Math.min(nearest, Math.abs(nm - (Double) c[1]) / perPixel);
            }
            assertTrue(nearest < (Double) c[2], "seed " + c[0] + ": foreign line " + nearest + " px away");
            assertFalse(calibration.peaks().has(match.peakIndex(pair), PeakFlag.WIDE), "seed " + c[0]);
        }
    }

    /**
     * The saved calibration names the widened pairs: seed 43's Ar 794.818 nm, unresolved from Ne
     * 794.318 nm 2 pixels away, is written with {@code "flag": "blend"} and reads back so; pairs
     * without a note have no flag member.
     */
    @Test
    void theSavedCalibrationFlagsTheBlend(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir)
            throws java.io.IOException {
        LampExposures.Exposure exposure = new LampExposures().exposure(43, 0.6);
        Calibration calibration = settings(exposure).calibrate(CalibrationProblem.builder(exposure.counts())
                .lamp(exposure.lamp()).build());
        java.nio.file.Path file = dir.resolve("calibration.json");
        org.ritzwerk.refdata.CalibrationFiles.write(file, calibration.solution(), exposure.counts().length, "seed 43",
                calibration.pairLabels());
        String json = java.nio.file.Files.readString(file);
        org.ritzwerk.data.CalibrationRecord record = org.ritzwerk.refdata.CalibrationFiles.readRecord(file);
        int blends = 0;
        for (int i = 0; i < record.lines().size(); i++) {
            org.ritzwerk.data.CalibrationRecord.FittedLine line = record.lines().get(i);
            assertEquals(calibration.blendOffsetBound(i) > 0 ? "blend" : "", line.flag(), line.line());
            blends += line.flag().isEmpty() ? 0 : 1;
            if (Math.abs(line.wavelengthNm() - 794.8176) < 1e-3) {
                assertEquals("blend", line.flag());
            }
        }
        assertTrue(blends >= 1 && blends < record.lines().size() / 2, blends + " blends");
        assertEquals(blends, json.split("\"flag\" : \"blend\"", -1).length - 1, json);
    }

    private static Calibrator settings(LampExposures.Exposure exposure) {
        return Double.isNaN(exposure.saturation()) ? Calibrator.defaults()
                : Calibrator.defaults().withSaturationLevel(exposure.saturation());
    }

    /** Whether a lamp line, ghost or foreign line other than the one at nm lies within reach (nm). */
    private static boolean otherLineWithin(LampExposures.Exposure exposure, double nm, double reach) {
        for (double[] set : new double[][] {exposure.lamp().lines().wavelengths(), exposure.ghostNm(),
            exposure.foreignNm()}) {
            for (double w : set) {
                double d = Math.abs(w - nm);
                if (d > 1e-9 && d < reach) {
                    return true;
                }
            }
        }
        return false;
    }

    /**
     * The imprecise runs are those whose data cannot give 0.1 pixel, and the solution says so. On
     * the exposures of 2026-12-05, in seeds 1-400 59 of the 60 have a stated standard uncertainty of at
     * least 0.05 pixel where their error is largest (median 0.13); with a required 0.05 pixel: 137
     * solved, 262 refused, 1 imprecise (0.102 pixel off, stating 0.043), none wrong; without it 313,
     * 27, 60 and 0. Before, in seeds 1-400, 48 of the 51 had a stated standard uncertainty of at
     * least 0.05 pixel (median 0.10) where their error is largest. A caller who needs 0.1 pixel
     * requires 0.05 and gets a refusal there instead (seeds 1-400: 204 solved, 193 refused, 3 imprecise at 0.12 to 0.16
     * pixel, none wrong; without the requirement 328, 21, 51 and 0). With the end check and the
     * next degree's widening of a quadratic or straight line (DispersionFit): 188 solved, 210
     * refused, 2 imprecise, none wrong. With the automatic degree up to 5 (328, 25, 47 and 0
     * without the requirement): 178, 220, 2 and 0; with the next degree's Akaike weight between
     * the lines (DispersionSolution.nextDegreeWeight): 156, 244, 0 and 0, all 47 imprecise runs
     * stating at least 0.05 pixel (median 0.15). The uncertainty ceiling of 1 pixel then refused one
     * of the 47 (seed 275, stating 1.01 pixel): 328, 26, 46 and 0 without the requirement, the same
     * counts with it. CalibrationSweep's main prints these counts.
     */
    @Test
    void aRequiredPrecisionRefusesWhatTheDataCannotGive() {
        // Seed 125 (Hg+Kr, 1024 pixels; accepted 0.48 pixel off at its first line) states 0.61 pixel
        // there. (Seed 257, 0.65 pixel off and stating 0.44, before the exposures of 2026-12-05.)
        LampExposures.Exposure exposure = new LampExposures().exposure(125, 0.6);
        CalibrationProblem problem = CalibrationProblem.builder(exposure.counts()).lamp(exposure.lamp()).build();
        Calibrator settings = Double.isNaN(exposure.saturation()) ? Calibrator.defaults()
                : Calibrator.defaults().withSaturationLevel(exposure.saturation());
        Calibration accepted = settings.calibrate(problem);
        assertTrue(accepted.largestSigmaPixels() > 0.4, "stated " + accepted.largestSigmaPixels());
        assertTrue(CalibrationSweep.largestError(exposure, accepted.solution(), accepted) > 0.4);
        CalibrationException refused = assertThrows(CalibrationException.class,
                () -> settings.withRequiredPrecision(0.05).calibrate(problem));
        assertEquals(CalibrationException.IMPRECISE, refused.code());
        assertTrue(refused.getMessage().contains("above the required 0.05000 pixels"), refused.getMessage());
        // A requirement the solution meets changes nothing.
        Calibration loose = settings.withRequiredPrecision(1).calibrate(problem);
        assertEquals(accepted.solution().wavelengthAt(100), loose.solution().wavelengthAt(100));

        CalibrationSweep.Outcome outcome = CalibrationSweep.run(1, 30, 0.6,
                Calibrator.defaults().withRequiredPrecision(0.05));
        assertEquals(0, outcome.wrong() + outcome.imprecise(), outcome.toString());
        // 14 solved on the exposures of 2026-12-05; before them 12 (16 before the end check, which
        // also refuses seed 1: its last line is checked by the others only to 0.63 pixel; 15 before a
        // quadratic's stated uncertainty took in what the next degree leaves open, which states
        // seed 24's right quadratic at 0.17 pixel; 14 before a cubic's took in the next degree's
        // Akaike weight between the lines).
        assertTrue(outcome.solved() >= 14, outcome.toString());
    }

    @Test
    void theWrongGasesAreRefused() {
        CalibrationSweep.Outcome outcome = CalibrationSweep.run(101, 12, 0.6, Calibrator.defaults(), true);
        assertEquals(0, outcome.wrong() + outcome.imprecise() + outcome.solved(), outcome.toString());
    }
}
