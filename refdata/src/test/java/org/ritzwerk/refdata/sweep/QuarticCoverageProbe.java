package org.ritzwerk.refdata.sweep;

import java.util.Arrays;
import java.util.Locale;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.refdata.DataContext;

/**
 * Measures, over many seeds, what {@link QuarticDispersionTest} checks: the neon exposures of its
 * invented spectrometer with a quartic term c4 p^4, calibrated with the defaults, and the errors
 * against the known truth over the stated standard uncertainty at pixels 100 to 1950 (every 50)
 * between the first and last fitted line. Prints, per c4, the degrees chosen, how many runs had
 * the note on structured residuals, the RMS, the shares within one and two stated uncertainties
 * and the largest, for the runs without the note and for all, and where the errors beyond two
 * stated uncertainties sit (runs without the note, by pixel); with a third argument also one line
 * per run (degree, the note, reduced chi-square, the next degree's F-test probability and Akaike
 * weight, the model-selection factor, the largest error and its pixel).
 *
 * <p>Usage: {@code QuarticCoverageProbe seeds c4[,c4...] [runs]}, e.g. {@code 40 0,1e-14,3e-14}.
 * The README's figures on the choice of degree come from it.
 */
public final class QuarticCoverageProbe {

    private static final DataContext DATA = DataContext.builtIn();
    private static final LampSet NEON = LampExposures.lamp(DATA, "Ne I");

    private QuarticCoverageProbe() {
    }

    /**
     * @param args seeds, the c4 values (nm per pixel^4) separated by commas, and optionally
     *             anything to list every run
     */
    public static void main(String[] args) {
        int seeds = Integer.parseInt(args[0]);
        for (String text : args[1].split(",")) {
            double c4 = Double.parseDouble(text);
            double[] sum = new double[2];
            int[] points = new int[2];
            int[] within1 = new int[2];
            int[] within2 = new int[2];
            double[] largest = new double[2];
            int[] degrees = new int[10];
            int noted = 0;
            int[] beyond2At = new int[40];
            StringBuilder runs = new StringBuilder();
            for (long seed = 1; seed <= seeds; seed++) {
                Calibration calibration;
                try {
                    calibration = Calibrator.defaults().calibrate(CalibrationProblem.builder(
                            QuarticDispersionTest.counts(c4, seed)).lamp(NEON).build());
                } catch (RuntimeException e) {
                    runs.append(String.format(Locale.ROOT, "  seed %d refused: %s%n", seed, e.getMessage()));
                    continue;
                }
                DispersionSolution s = calibration.solution();
                degrees[s.degree()]++;
                boolean note = s.residualsStructured();
                noted += note ? 1 : 0;
                double runLargest = 0;
                double runLargestAt = 0;
                for (double p = 100; p <= 1950; p += 50) {
                    if (p < calibration.lowestUsedPixel() || p > calibration.highestUsedPixel()) {
                        continue;
                    }
                    double z = Math.abs(s.wavelengthAt(p) - QuarticDispersionTest.truth(c4, p))
                            / s.wavelengthSigmaAt(p);
                    for (int all = note ? 1 : 0; all < 2; all++) {
                        sum[all] += z * z;
                        points[all]++;
                        within1[all] += z <= 1 ? 1 : 0;
                        within2[all] += z <= 2 ? 1 : 0;
                        largest[all] = Math.max(largest[all], z);
                    }
                    if (!note && z > 2) {
                        beyond2At[(int) (p / 50)]++;
                    }
                    if (z > runLargest) {
                        runLargest = z;
                        runLargestAt = p;
                    }
                }
                runs.append(String.format(Locale.ROOT, "  seed %d degree %d, %d lines%s, reduced chi2 %.2f, next"
                        + " degree F-test %.3g, weight %.2f, model-selection factor %.2f: largest %.2f at %.0f%n",
                        seed, s.degree(), s.usedCount(), note ? ", NOTE" : "", s.reducedChiSquare(),
                        s.nextDegreeProbability(), s.nextDegreeWeight(), s.modelSelectionScale(), runLargest,
                        runLargestAt));
            }
            System.out.printf(Locale.ROOT, "c4 = %s, %d seeds: degrees %s, %d with the note%n", text, seeds,
                    Arrays.toString(degrees), noted);
            for (int all = 0; all < 2; all++) {
                System.out.printf(Locale.ROOT, "  %s: rms %.2f, within 1: %.1f %%, within 2: %.1f %%, largest %.2f"
                        + " (%d points)%n", all == 0 ? "without the note" : "all runs", Math.sqrt(sum[all]
                        / points[all]), 100.0 * within1[all] / points[all], 100.0 * within2[all] / points[all],
                        largest[all], points[all]);
            }
            StringBuilder where = new StringBuilder("  beyond 2 without the note, by pixel:");
            for (int i = 0; i < beyond2At.length; i++) {
                if (beyond2At[i] > 0) {
                    where.append(' ').append(i * 50).append(':').append(beyond2At[i]);
                }
            }
            System.out.println(where);
            if (args.length > 2) {
                System.out.print(runs);
            }
        }
    }
}
