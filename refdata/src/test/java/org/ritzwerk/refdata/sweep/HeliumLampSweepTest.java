package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationException;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampMatcher;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataLines;

/**
 * Helium lamps calibrated with the lamp built from the He I level list ({@link DataLines#lamp},
 * merged at the spectrometer's resolving power, {@link LampSet#blendedAt}): seeded
 * exposures of invented spectrometers (1024 to 4096 pixels, a window starting at 340 to 560 nm
 * and 250 to 420 nm long, slope changing by up to 30 % across the chip, an instrument FWHM of 2 to
 * 4 pixels, excitation temperature 20,000 to 60,000 K, read noise), no prior. The rule that must hold:
 * no run is accepted with an error above 1 pixel anywhere between its first and last fitted line.
 *
 * <p>Over seeds 1 to 16: 10 solved to 0.15 pixel and 6 refused. Helium has few lines in the red:
 * a window from about 500 nm up holds four to seven (501.6, 504.8, 587.6, 667.8, 706.5, 728.1,
 * 781.6 nm), too few to place with no prior among the lamp's 140 lines and their second-order
 * images (which the matcher counts by default, so the chance of a match is judged against twice
 * the line density), so those runs are refused (some beat chance, but not by the required margin
 * after thousands of pairings tried). With the rough prior a user has (the window to 10 nm, the
 * dispersion to 20 %: {@code --from}, {@code --to}, {@code --dispersion-range}) 1 of the 6 is
 * solved, 2 accepted at 0.15 to 0.25 pixel within their stated uncertainties, and 3 are still
 * refused. With the images off ({@code withSecondOrder(false)}, {@code --no-second-order}, a
 * spectrometer with an order-sorting filter): 10 solved, 1 at 0.17 pixel, 5 refused, of which 4
 * are accepted with a prior. No run, with or without a prior, is accepted with
 * an error beyond 1 pixel or beyond three of its own stated standard uncertainties.
 *
 * <p>Since the chance test counts as evidence only the pairs beyond the four a cubic meets by
 * itself (where a quadratic cannot meet them as well), fewer of the refused runs pass with a
 * prior: 2 of the 6 (both at 0.15 to 0.25 pixel, within their stated uncertainties), and without
 * images 2 of the 5 (one solved). The runs solved without a prior are the same 10.
 */
class HeliumLampSweepTest {

    @Test
    void heliumLampsAreSolvedOrRefusedNeverWrong() {
        sweep(Calibrator.defaults(), 10, 2);
    }

    /** A spectrometer with an order-sorting filter: the matcher told there are no second-order images. */
    @Test
    void withoutSecondOrderImagesFewerRunsAreRefused() {
        sweep(Calibrator.defaults().withSecondOrder(false), 10, 2);
    }

    /**
     * Runs the 16 exposures and asserts: never wrong, at least {@code minSolved} solved with no
     * prior, and at least {@code minWithPrior} of the refused ones accepted with a rough prior.
     */
    private static void sweep(Calibrator calibrator, int minSolved, int minWithPrior) {
        DataContext data = DataContext.builtIn();
        Species he = Species.parse("He I");
        LampSet unmerged = DataLines.lamp(data, he, Medium.air());
        int solved = 0;
        int refused = 0;
        int imprecise = 0;
        int solvedWithPrior = 0;
        int impreciseWithPrior = 0;
        List<String> notSolved = new ArrayList<>();
        for (long seed = 1; seed <= 16; seed++) {
            SplittableRandom random = new SplittableRandom(seed);
            int pixels = new int[] {1024, 2048, 4096}[random.nextInt(3)];
            double start = 340 + 220 * random.nextDouble();
            double span = 250 + 170 * random.nextDouble();
            double change = (random.nextBoolean() ? 1 : -1) * 0.3 * random.nextDouble();
            // slope s(p) = c1 + 2 c2 p, changing by `change` of c1 over the chip; span = c1 N + c2 N^2
            double c1 = span / (pixels * (1 + change / 2));
            double c2 = change * c1 / (2 * pixels);
            // An instrument FWHM of 2 to 4 pixels at the window's middle, as spectrometers are built.
            double resolvingPower = (start + span / 2) / ((2 + 2 * random.nextDouble()) * c1);
            double temperature = 20_000 + 40_000 * random.nextDouble();
            double[] c = {start, c1, c2};
            // Merged at the spectrometer's resolving power, as `--resolving-power` gives it.
            LampSet lamp = unmerged.blendedAt(resolvingPower);
            PixelGrid grid = PixelGrid.dispersion(c, pixels);
            double[] counts = Scene.builder(grid).medium(Medium.air())
                    .instrument(Instrument.ofResolvingPower(resolvingPower)).temperature(temperature)
                    .peakCounts(20_000).levels(DataLines.levels(data, he), DataLines.ritzLines(data, he), 1.0,
                            data.nucleus(he))
                    .noise(3, seed).build().render(1).counts();
            String scene = String.format(Locale.ROOT, "seed %d: %d px, %.1f-%.1f nm, slope change %+.2f, R %.0f, T %.0f K",
                    seed, pixels, start, start + span, change, resolvingPower, temperature);
            Calibration calibration;
            try {
                calibration = calibrator.calibrate(CalibrationProblem.builder(counts).lamp(lamp).build());
            } catch (CalibrationException e) {
                refused++;
                notSolved.add(scene + " -> refused: " + e.getMessage());
                // The same exposure with a rough prior.
                double end = start + span;
                LampMatcher.Prior prior = new LampMatcher.Prior(start - 10, end + 10, 0.8 * span / pixels,
                        1.2 * span / pixels);
                Calibration withPrior;
                try {
                    withPrior = calibrator.calibrate(CalibrationProblem.builder(counts).lamp(lamp)
                            .prior(prior).build());
                } catch (CalibrationException again) {
                    notSolved.add(scene + " -> with a prior refused too: " + again.getMessage());
                    continue;
                }
                double error = worstError(withPrior, c);
                assertTrue(error < 1, scene + ": with a prior, accepted with an error of " + error + " pixel");
                assertTrue(worstSigmas(withPrior, c) < 3, scene + ": with a prior, error beyond 3 stated sigma");
                solvedWithPrior += error < 0.15 ? 1 : 0;
                impreciseWithPrior += error < 0.15 ? 0 : 1;
                continue;
            }
            double worst = worstError(calibration, c);
            assertTrue(worst < 1, scene + ": accepted with an error of " + worst + " pixel");
            assertTrue(worstSigmas(calibration, c) < 3, scene + ": error beyond 3 stated standard uncertainties");
            if (worst < 0.15) {
                solved++;
            } else {
                imprecise++;
                notSolved.add(String.format(Locale.ROOT, "%s -> accepted, error %.3f px, %d pairs", scene, worst,
                        calibration.solution().usedCount()));
            }
        }
        String outcome = solved + " solved, " + imprecise + " imprecise, " + refused + " refused (with a prior "
                + solvedWithPrior + " solved, " + impreciseWithPrior + " imprecise)\n  " + String.join("\n  ", notSolved);
        assertEquals(16, solved + imprecise + refused, outcome);
        assertTrue(solved >= minSolved, outcome);
        assertTrue(solvedWithPrior + impreciseWithPrior >= minWithPrior, outcome);
    }

    /** The largest error over the solution's stated standard uncertainty, same range. */
    private static double worstSigmas(Calibration calibration, double[] c) {
        DispersionSolution solution = calibration.solution();
        double worst = 0;
        for (int s = 0; s <= 200; s++) {
            double p = calibration.lowestUsedPixel()
                    + (calibration.highestUsedPixel() - calibration.lowestUsedPixel()) * s / 200.0;
            double truth = c[0] + c[1] * p + c[2] * p * p;
            worst = Math.max(worst, Math.abs(solution.wavelengthAt(p) - truth) / solution.wavelengthSigmaAt(p));
        }
        return worst;
    }

    /** The largest error in pixels between the first and last fitted line, against the truth c0 + c1 p + c2 p^2. */
    private static double worstError(Calibration calibration, double[] c) {
        DispersionSolution solution = calibration.solution();
        double worst = 0;
        for (int s = 0; s <= 200; s++) {
            double p = calibration.lowestUsedPixel()
                    + (calibration.highestUsedPixel() - calibration.lowestUsedPixel()) * s / 200.0;
            double truth = c[0] + c[1] * p + c[2] * p * p;
            worst = Math.max(worst, Math.abs(solution.wavelengthAt(p) - truth) / (c[1] + 2 * c[2] * p));
        }
        return worst;
    }
}
