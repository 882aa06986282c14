package org.ritzwerk.refdata.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationException;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionSolution;

/**
 * Runs the calibration job on many {@link LampExposures} and sorts the outcomes: solved (largest
 * error between the first and last fitted line below 0.1 pixel), refused (a
 * {@link CalibrationException}), and accepted but wrong (larger errors), keeping a description of
 * every run that was not solved.
 */
public final class CalibrationSweep {

    /** What happened in one sweep. */
    public record Outcome(int runs, int solved, int refused, int imprecise, int wrong, double worstSolvedError,
            double worstImpreciseSigmas, List<String> notSolved) {

        @Override
        public String toString() {
            return String.format(Locale.ROOT, "%d runs: %d solved (worst %.3f px), %d refused, %d accepted with "
                    + "0.1-1 px error (at most %.1f stated standard uncertainties), %d accepted with > 1 px error"
                    + "%n  %s", runs, solved, worstSolvedError, refused, imprecise, worstImpreciseSigmas, wrong,
                    String.join("\n  ", notSolved));
        }
    }

    private CalibrationSweep() {
    }

    /**
     * @param firstSeed first seed; runs use firstSeed, firstSeed + 1, ...
     * @param runs      how many exposures
     * @param curvature largest relative slope change across the chip
     * @param solver    the calibration settings
     * @return the outcome
     */
    public static Outcome run(long firstSeed, int runs, double curvature, Calibrator solver) {
        return run(firstSeed, runs, curvature, solver, false);
    }

    /**
     * @param firstSeed first seed; runs use firstSeed, firstSeed + 1, ...
     * @param runs      how many exposures
     * @param curvature largest relative slope change across the chip
     * @param solver    the calibration settings
     * @param wrongLamp calibrate against the gases the lamp did not hold (exposures that held every
     *                  gas are skipped and not counted)
     * @return the outcome
     */
    public static Outcome run(long firstSeed, int runs, double curvature, Calibrator solver, boolean wrongLamp) {
        LampExposures exposures = new LampExposures();
        int solved = 0;
        int refused = 0;
        int imprecise = 0;
        int wrong = 0;
        double worst = 0;
        double worstSigmas = 0;
        List<String> notSolved = new ArrayList<>();
        int planned = runs;
        for (long seed = firstSeed; seed < firstSeed + planned; seed++) {
            LampExposures.Exposure exposure = exposures.exposure(seed, curvature);
            org.ritzwerk.engine.calibrate.LampSet lamp = wrongLamp ? exposures.otherGases(exposure) : exposure.lamp();
            if (lamp == null) {
                runs--;
                continue;
            }
            Calibrator settings = Double.isNaN(exposure.saturation()) ? solver
                    : solver.withSaturationLevel(exposure.saturation());
            Calibration calibration;
            try {
                calibration = settings.calibrate(CalibrationProblem.builder(exposure.counts())
                        .lamp(lamp).build());
            } catch (CalibrationException e) {
                refused++;
                notSolved.add(exposure + " -> refused: " + e.getMessage());
                continue;
            } catch (RuntimeException e) {
                wrong++;
                notSolved.add(exposure + " -> failed: " + e);
                continue;
            }
            double error = largestError(exposure, calibration.solution(), calibration);
            if (error < 0.1) {
                solved++;
                worst = Math.max(worst, error);
            } else {
                if (error < 1) {
                    imprecise++;
                    worstSigmas = Math.max(worstSigmas, largestErrorInSigmas(exposure, calibration.solution(),
                            calibration));
                } else {
                    wrong++;
                }
                notSolved.add(String.format(Locale.ROOT, "%s -> accepted, error %.3g px, %d pairs, rms %.3g px",
                        exposure, error, calibration.solution().usedCount(), calibration.solution().rmsPixels()));
            }
        }
        return new Outcome(runs, solved, refused, imprecise, wrong, worst, worstSigmas, notSolved);
    }

    /** The largest error in pixels between the lowest and highest pixel of the fitted pairs. */
    static double largestError(LampExposures.Exposure exposure, DispersionSolution solution, Calibration calibration) {
        double from = calibration.lowestUsedPixel();
        double to = calibration.highestUsedPixel();
        double worst = 0;
        for (int s = 0; s <= 200; s++) {
            double p = from + (to - from) * s / 200.0;
            double error = (solution.wavelengthAt(p) - exposure.truthAt(p)) / exposure.truthDispersionAt(p);
            worst = Math.max(worst, Math.abs(error));
        }
        return worst;
    }

    /** The largest error over the solution's own stated standard uncertainty, same range. */
    static double largestErrorInSigmas(LampExposures.Exposure exposure, DispersionSolution solution,
            Calibration calibration) {
        double from = calibration.lowestUsedPixel();
        double to = calibration.highestUsedPixel();
        double worst = 0;
        for (int s = 0; s <= 200; s++) {
            double p = from + (to - from) * s / 200.0;
            worst = Math.max(worst, Math.abs(solution.wavelengthAt(p) - exposure.truthAt(p))
                    / solution.wavelengthSigmaAt(p));
        }
        return worst;
    }

    /**
     * Prints a sweep: {@code seed runs curvature}.
     *
     * @param args first seed, runs, curvature
     */
    public static void main(String[] args) {
        long seed = Long.parseLong(args[0]);
        int runs = Integer.parseInt(args[1]);
        double curvature = Double.parseDouble(args[2]);
        long t0 = System.nanoTime();
        Outcome outcome = run(seed, runs, curvature, Calibrator.defaults());
        System.out.println(outcome);
        System.out.printf(Locale.ROOT, "%.1f s%n", (System.nanoTime() - t0) * 1e-9);
    }
}
