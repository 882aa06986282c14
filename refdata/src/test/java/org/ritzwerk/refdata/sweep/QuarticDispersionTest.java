package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.DataContext;

/**
 * Neon exposures of an invented 2048-pixel spectrometer whose dispersion has a quartic term,
 * lambda(p) = 580 + 0.07 p + 4e-6 p^2 - 1e-9 p^3 + c4 p^4 nm (c4 = 1e-14 is 0.18 nm at the last
 * pixel), lines of 0.25 nm FWHM (1.5 pixels' standard deviation), Poisson and read noise, 20
 * seeds each. The dispersion and the instrument are invented; the only reference values are the
 * built-in Ne I lamp set. What is checked is the stated uncertainty against the known truth, at
 * pixels 100 to 1950 (every 50) between the first and last fitted line: a standard uncertainty
 * that holds leaves errors of about 1 stated uncertainty RMS, 68 % of them within one (common
 * practice for a normal error; 1.3 and 60 % allow for 20 seeds and the single covariance factor).
 * A run whose notes say its residuals show structure has told its user its uncertainty may be too
 * small, and is not counted in the first figure.
 *
 * <p>Before the automatic choice could go above a cubic, a cubic was accepted for c4 = 1e-14 with
 * a reduced chi-square of about 1.9, the Birge factor widening every uncertainty alike: errors of
 * 2.3 stated uncertainties RMS, 29 % within one, up to 5.2, with no note; c4 = 3e-14 gave 2.8 RMS,
 * and 1e-13 was refused. A degree held at 3 by the user now carries a note that the residuals
 * show structure the degree does not follow. Where the lines cannot decide between the degree
 * chosen and the next, the stated uncertainty between them covers that choice
 * ({@code DispersionSolution.nextDegreeWeight}). {@link QuarticCoverageProbe} prints the same
 * figures for any number of seeds.
 */
class QuarticDispersionTest {

    private static final int PIXELS = 2048;
    private static final DataContext DATA = DataContext.builtIn();
    private static final LampSet NEON = LampExposures.lamp(DATA, "Ne I");

    /**
     * Errors over stated uncertainties at interior pixels of the runs without the note on
     * structured residuals (a run with it says its uncertainty may be too small), the same over
     * all runs, the degrees chosen and how many runs carried the note.
     */
    private record Coverage(double rmsZ, double within1, double rmsZAll, int[] degrees, int structured,
            double maxZ, double within2) {
    }

    static double[] counts(double c4, long seed) {
        double[] c = {580, 0.07, 4e-6, -1e-9, c4};
        return Scene.builder(PixelGrid.dispersion(c, PIXELS)).medium(Medium.air())
                .instrument(Instrument.ofFwhm(0.25)).temperature(300).peakCounts(30_000)
                .lineList(DATA.lampLines(Species.parse("Ne I")), DATA::nucleus)
                .noise(5, seed).build().render(1).counts();
    }

    static double truth(double c4, double p) {
        return 580 + p * (0.07 + p * (4e-6 + p * (-1e-9 + p * c4)));
    }

    private static Coverage coverage(double c4, Calibrator calibrator, int seeds) {
        double sum = 0;
        int points = 0;
        int within = 0;
        double sumAll = 0;
        int pointsAll = 0;
        int structured = 0;
        double maxZ = 0;
        int within2 = 0;
        int[] degrees = new int[10];
        for (long seed = 1; seed <= seeds; seed++) {
            Calibration calibration = calibrator.calibrate(CalibrationProblem.builder(counts(c4, seed))
                    .lamp(NEON).build());
            DispersionSolution solution = calibration.solution();
            degrees[solution.degree()]++;
            boolean noted = calibration.notes().stream().anyMatch(n -> n.contains("structure"));
            assertEquals(solution.residualsStructured(), noted, "seed " + seed + ": " + calibration.notes());
            structured += noted ? 1 : 0;
            for (double p = 100; p <= 1950; p += 50) {
                if (p < calibration.lowestUsedPixel() || p > calibration.highestUsedPixel()) {
                    continue;
                }
                double z = (solution.wavelengthAt(p) - truth(c4, p)) / solution.wavelengthSigmaAt(p);
                sumAll += z * z;
                pointsAll++;
                if (!noted) {
                    sum += z * z;
                    within += Math.abs(z) <= 1 ? 1 : 0;
                    within2 += Math.abs(z) <= 2 ? 1 : 0;
                    maxZ = Math.max(maxZ, Math.abs(z));
                    points++;
                }
            }
        }
        return new Coverage(Math.sqrt(sum / points), (double) within / points, Math.sqrt(sumAll / pointsAll), degrees,
                structured, maxZ, (double) within2 / points);
    }

    private static String describe(Coverage c) {
        return String.format(Locale.ROOT, "without the note: rms error/sigma %.2f, %.0f %% within 1 sigma, %.0f %%"
                + " within 2, largest %.2f; all runs: rms %.2f; degrees %s, %d noted", c.rmsZ(), 100 * c.within1(),
                100 * c.within2(), c.maxZ(), c.rmsZAll(), java.util.Arrays.toString(c.degrees()), c.structured());
    }

    @Test
    void aQuarticDispersionIsFittedWithAnUncertaintyThatHoldsOrANote() {
        Coverage c = coverage(1e-14, Calibrator.defaults(), 40);
        // Honest standard uncertainties leave errors of 1 RMS, 68 % within one and almost none
        // beyond 4 among these ~1100 points (normal errors; common practice). Before degrees above 3
        // were tried: 2.3 RMS, 29 % within one, degree 3 in every run and no note. Then, with a
        // cubic kept where the quartic is not yet significant stating its uncertainty as if the
        // cubic were certain: 1.11 RMS without the note, 1.19 over all runs, up to 4.49 (seed 12,
        // pixel 400, whose cubic scattered less than stated so the quartic was not even weighed).
        // Now the choice between the degree and the next one is in the stated uncertainty
        // (Buckland, Burnham and Augustin 1997): 1.02, 66 %, 1.00 over all runs, at most 3.6.
        assertTrue(c.rmsZ() <= 1.08 && c.within1() >= 0.6 && c.maxZ() <= 4, describe(c));
        assertTrue(c.rmsZAll() <= 1.1, describe(c));
        assertTrue(c.degrees()[4] >= 10, "the quartic is taken where the lines show it: " + describe(c));
    }

    @Test
    void aStrongerQuarticIsFittedWithAnUncertaintyThatHolds() {
        // 0.53 nm at the last pixel: refused before (reduced chi-square 86 for the cubic)
        Coverage c = coverage(3e-14, Calibrator.defaults(), 10);
        assertTrue(c.rmsZAll() <= 1.3 && c.within1() >= 0.6, describe(c));
        assertEquals(10, c.degrees()[4], describe(c));
    }

    @Test
    void aCubicDispersionStillTakesACubicMostly() {
        Coverage c = coverage(0, Calibrator.defaults(), 40);
        // Where the cubic is right the uncertainty holds and is not much more cautious than that:
        // 68 % within one and 95 % within two for normal errors (common practice); 77 % and 97 %
        // before the degree choice entered the stated uncertainty, 80 % and 98 % now (0.88 and
        // 0.83 RMS). 88 % within one would be a standard uncertainty stated 1.4 times too large.
        assertTrue(c.rmsZ() <= 1.15 && c.within1() >= 0.6 && c.within2() >= 0.93, describe(c));
        assertTrue(c.within1() <= 0.88 && c.rmsZ() >= 0.7, "not much more cautious than honest: " + describe(c));
        assertTrue(c.degrees()[3] >= 28, describe(c));
        assertEquals(0, c.structured(), describe(c));
    }

    @Test
    void aDegreeHeldBelowTheDispersionsSaysSo() {
        // the user holds the automatic choice at 3 (withAutomaticDegree(3), calibrate --max-degree 3)
        Coverage c = coverage(3e-14, Calibrator.defaults().withAutomaticDegree(3), 5);
        assertEquals(5, c.structured(), describe(c));
        List<String> notes = Calibrator.defaults().withAutomaticDegree(3)
                .calibrate(CalibrationProblem.builder(counts(3e-14, 1)).lamp(NEON).build()).notes();
        assertTrue(notes.stream().anyMatch(n -> n.contains("allow a higher degree")), notes.toString());
        assertFalse(notes.isEmpty());
    }
}
