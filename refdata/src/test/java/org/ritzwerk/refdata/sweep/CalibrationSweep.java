package org.ritzwerk.refdata.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.LongFunction;
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

    /**
     * What happened in one sweep.
     *
     * @param runs                 exposures calibrated
     * @param solved               accepted with error below 0.1 pixel
     * @param refused              refused with a {@link CalibrationException}
     * @param imprecise            accepted with error 0.1 to 1 pixel
     * @param wrong                accepted with error above 1 pixel, or failed otherwise
     * @param worstSolvedError     largest error of a solved run, pixels
     * @param worstImpreciseSigmas largest error of an imprecise run in its stated standard uncertainties
     * @param within1Sigma         over every accepted run, at 201 evenly spaced pixels from its first to
     *                             its last fitted line: the share where the error is below the stated
     *                             standard uncertainty (0.683 for Gaussian errors and honest uncertainties)
     * @param within2Sigma         the same below twice the stated uncertainty (0.954 expected)
     * @param beyond3Sigma         accepted runs whose error somewhere in that range exceeds three stated
     *                             standard uncertainties
     * @param worstSigmas          the largest error of any accepted run in stated standard uncertainties
     * @param notSolved            a description of every run not solved
     * @param accepted             for every accepted run: its largest error in pixels, its largest stated
     *                             standard uncertainty in pixels ({@link Calibration#largestSigmaPixels()}) and
     *                             how well the other lines check each end ({@link Calibration#endConfirmationPixels})
     */
    public record Outcome(int runs, int solved, int refused, int imprecise, int wrong, double worstSolvedError,
            double worstImpreciseSigmas, double within1Sigma, double within2Sigma, int beyond3Sigma,
            double worstSigmas, List<String> notSolved, List<double[]> accepted) {

        /**
         * What a required precision ({@link Calibrator#withRequiredPrecision}) would have made of the
         * same runs: it only checks a finished calibration (largest stated uncertainty at most q, each
         * end checked by the others to 6 q), so it refuses accepted runs and changes no solution.
         *
         * @param q the required precision, pixels
         * @return solved, refused, imprecise, wrong, then the imprecise and the solved runs it refused
         */
        public int[] underRequiredPrecision(double q) {
            int[] tally = {0, refused, 0, 0, 0, 0};
            for (double[] run : accepted) {
                boolean refuse = !(run[1] <= q) || !(run[2] <= 6 * q) || !(run[3] <= 6 * q);
                int kind = run[0] < 0.1 ? 0 : run[0] < 1 ? 2 : 3;
                if (refuse) {
                    tally[1]++;
                    tally[4] += kind == 2 ? 1 : 0;
                    tally[5] += kind == 0 ? 1 : 0;
                } else {
                    tally[kind]++;
                }
            }
            return tally;
        }

        @Override
        public String toString() {
            return String.format(Locale.ROOT, "%d runs: %d solved (worst %.3f px), %d refused, %d accepted with "
                    + "0.1-1 px error (at most %.1f stated standard uncertainties), %d accepted with > 1 px error"
                    + "%n  coverage of the stated uncertainty over the accepted runs: %.3f within 1 sigma, %.3f "
                    + "within 2 sigma; %d runs beyond 3 sigma somewhere (worst %.1f sigma)%n  %s", runs, solved,
                    worstSolvedError, refused, imprecise, worstImpreciseSigmas, wrong, within1Sigma, within2Sigma,
                    beyond3Sigma, worstSigmas, String.join("\n  ", notSolved));
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
        return run(firstSeed, runs, seed -> exposures.exposure(seed, curvature), solver, wrongLamp);
    }

    /**
     * @param firstSeed first seed; runs use firstSeed, firstSeed + 1, ...
     * @param runs      how many exposures
     * @param curvature largest relative slope change across the chip
     * @param solver    the calibration settings
     * @param gases     the lamp's species
     * @param lowest    the shortest wavelength a window may start at, nm
     * @param highest   the longest wavelength a window may reach, nm
     * @return the outcome
     */
    public static Outcome run(long firstSeed, int runs, double curvature, Calibrator solver, String[] gases,
            double lowest, double highest) {
        LampExposures exposures = new LampExposures();
        return run(firstSeed, runs, seed -> exposures.exposure(seed, curvature, gases, lowest, highest), solver,
                false);
    }

    private static Outcome run(long firstSeed, int runs, LongFunction<LampExposures.Exposure> exposureOf,
            Calibrator solver, boolean wrongLamp) {
        LampExposures exposures = new LampExposures();
        int solved = 0;
        int refused = 0;
        int imprecise = 0;
        int wrong = 0;
        double worst = 0;
        double worstSigmas = 0;
        double worstAnySigmas = 0;
        long points = 0;
        long within1 = 0;
        long within2 = 0;
        int beyond3 = 0;
        List<String> notSolved = new ArrayList<>();
        List<double[]> accepted = new ArrayList<>();
        int planned = runs;
        for (long seed = firstSeed; seed < firstSeed + planned; seed++) {
            LampExposures.Exposure exposure = exposureOf.apply(seed);
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
            accepted.add(new double[] {error, calibration.largestSigmaPixels(),
                calibration.endConfirmationPixels(false), calibration.endConfirmationPixels(true)});
            double[] z = errorsInSigmas(exposure, calibration.solution(), calibration);
            double runWorst = 0;
            for (double v : z) {
                points++;
                within1 += v < 1 ? 1 : 0;
                within2 += v < 2 ? 1 : 0;
                runWorst = Math.max(runWorst, v);
            }
            beyond3 += runWorst > 3 ? 1 : 0;
            worstAnySigmas = Math.max(worstAnySigmas, runWorst);
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
        return new Outcome(runs, solved, refused, imprecise, wrong, worst, worstSigmas,
                points == 0 ? Double.NaN : (double) within1 / points,
                points == 0 ? Double.NaN : (double) within2 / points,
                beyond3, worstAnySigmas, notSolved, accepted);
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
        double worst = 0;
        for (double z : errorsInSigmas(exposure, solution, calibration)) {
            worst = Math.max(worst, z);
        }
        return worst;
    }

    /** |error| over the stated standard uncertainty at 201 evenly spaced pixels of the same range. */
    static double[] errorsInSigmas(LampExposures.Exposure exposure, DispersionSolution solution,
            Calibration calibration) {
        double from = calibration.lowestUsedPixel();
        double to = calibration.highestUsedPixel();
        double[] z = new double[201];
        for (int s = 0; s <= 200; s++) {
            double p = from + (to - from) * s / 200.0;
            z[s] = Math.abs(solution.wavelengthAt(p) - exposure.truthAt(p)) / solution.wavelengthSigmaAt(p);
        }
        return z;
    }

    /**
     * Prints a sweep: {@code seed runs curvature [wrong]}; with {@code wrong}, against the gases
     * the lamp did not hold.
     *
     * @param args first seed, runs, curvature, optionally {@code wrong}
     */
    public static void main(String[] args) {
        long seed = Long.parseLong(args[0]);
        int runs = Integer.parseInt(args[1]);
        double curvature = Double.parseDouble(args[2]);
        long t0 = System.nanoTime();
        boolean wrongLamp = args.length > 3 && args[3].equals("wrong");
        Outcome outcome = run(seed, runs, curvature, Calibrator.defaults(), wrongLamp);
        System.out.println(outcome);
        for (double q : new double[] {0.1, 0.075, 0.05}) {
            int[] t = outcome.underRequiredPrecision(q);
            System.out.printf(Locale.ROOT, "required precision %s px: %d solved, %d refused, %d imprecise, %d wrong;"
                    + " it refuses %d imprecise and %d solved runs%n", q, t[0], t[1], t[2], t[3], t[4], t[5]);
        }
        List<Double> impreciseSigmas = new ArrayList<>();
        for (double[] run : outcome.accepted()) {
            if (run[0] >= 0.1 && run[0] < 1) {
                impreciseSigmas.add(run[1]);
            }
        }
        java.util.Collections.sort(impreciseSigmas);
        long atLeast = impreciseSigmas.stream().filter(v -> v >= 0.05).count();
        System.out.printf(Locale.ROOT, "imprecise runs stating at least 0.05 px where worst: %d of %d"
                + " (median %.3f px)%n", atLeast, impreciseSigmas.size(), impreciseSigmas.isEmpty() ? Double.NaN
                        : impreciseSigmas.get(impreciseSigmas.size() / 2));
        System.out.printf(Locale.ROOT, "%.1f s%n", (System.nanoTime() - t0) * 1e-9);
    }
}
