package org.ritzwerk.refdata.sweep;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationException;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.LampMatch;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.refdata.DataContext;

/**
 * A lone pair at an end of the fitted range that the other lines do not confirm, built on purpose
 * (the seeded exposures of 2026-12-05 no longer hold one; see CalibrationSweepTest): at the high end
 * and the low end of the chip, with wavelength rising and falling with pixel, and with a foreign
 * line or a second-order ghost beside the missing lamp line.
 *
 * <p>The first scene: a neon lamp (the built-in Ne I set; its rows and sources in
 * refdata/src/main/resources/org/ritzwerk/refdata/lamps/README.md) on an invented 1024-pixel
 * spectrometer from 578 to 800 nm whose slope grows from 0.180 to 0.265 nm per pixel across the
 * chip, a cubic ({@link LampExposures#dispersion} with kappa 0.4 and a cubic term of 0.05); lines of
 * 2.5 pixels FWHM integrated over the pixels ({@link LineRenderer}), the brightest at 30,000
 * counts, on about 200 counts of background, with Poisson and read noise. Beyond Ne I 748.89 nm
 * (pixel 822) the window's only lamp line is Ne I 794.32 nm at pixel 1001, 180 pixels further on,
 * near the chip's end. That line is missing from the exposure (a weak line, table intensity 80 of
 * 1000, that a lamp or detector may not show), and a foreign line (another gas's, in no lamp list;
 * invented, relative intensity 150) stands a few pixels from where it would fall. Everything here
 * but the lamp's wavelengths is invented. The other scenes:
 * <ul>
 *   <li><b>The low end</b>: the same neon lamp from 535 to 757 nm, the slope falling from 0.265 to
 *       0.180 nm per pixel (kappa -0.4), the first scene's geometry turned end for end: the window's
 *       first line, Ne I 540.06 nm at pixel 19, 179 pixels before the next, Ne I 585.25 nm at pixel
 *       198, is missing, and the foreign line stands a few pixels from its place.</li>
 *   <li><b>Wavelength falling with pixel</b>: the first scene with the detector mirrored (pixel p
 *       read as 1023 - p), so the lone end lies at pixel 22, the chip's start.</li>
 *   <li><b>A second-order ghost</b> instead of a foreign line: a mercury-neon lamp (the built-in
 *       Hg I and Ne I sets) from 589.5 to 811.5 nm on a grating without an order-sorting filter, so
 *       that every lamp line of 294.75 to 405.75 nm shows again at twice its wavelength, at a tenth
 *       of its table intensity (as {@link LampExposures} renders ghosts). Hg I 404.66 nm (table
 *       intensity 400), seen at 809.31 nm, stands 1.07 nm from Ne I 808.25 nm, the window's last
 *       lamp line, which is missing, as is the weak Ne I 794.32 nm before it (table intensities 40
 *       and 80), so that 808.25 nm lies 235 to 300 pixels beyond the last line shown, Ne I 748.89
 *       nm. Two dispersions (kappa 0.4 and -0.3, slopes at the end 0.265 and 0.190 nm per pixel)
 *       put the ghost 4.0 and 5.6 pixels from the missing line's place (kappa 0, 4.8 pixels,
 *       behaves alike: tried by hand).</li>
 * </ul>
 *
 * <p>Why it is a trap (common practice: a point far beyond the others has a leverage near 1, R. D.
 * Cook and S. Weisberg, Residuals and Influence in Regression, Chapman and Hall 1982): a cubic
 * through the other pairs can bend over the last 180 pixels to pass through the foreign peak, so
 * with the pair in, its own residual is a small part of its offset and the solution would be about
 * that many pixels off at the chip's end. The other pairs are what tell: fitted without it (with
 * the matcher's curvature prior), they put Ne I 794.32 nm more than the 3-pixel tolerance from the
 * foreign peak when that stands 4 to 6 pixels from the line's true place. That is the matcher's
 * leave-one-out check (the error of each pair's prediction from the others: cross-validation, M.
 * Stone, J. R. Stat. Soc. B 36, 111 (1974); common practice), which drops such a pair.
 *
 * <p>What must hold: the matcher's pairing ({@link Calibration#firstMatch()}) leaves the lone end
 * pair out, and the calibration either returns a solution that does not use the foreign peak and is
 * right to 0.1 pixel from its first to its last fitted line, or refuses. With the leave-one-out check
 * switched off (tried by hand on 2026-12-05, {@code LampMatcher.dropUnconfirmed} returning at once;
 * it has no setting) the matcher's pairing held the foreign peak in every run of the first four
 * tests but one, which was refused instead, and in the ghost test's runs without second-order
 * images (each test's comment gives its count), and those tests fail; weakened to drop only pairs
 * the others miss by twice the tolerance, the first test failed at 5 pixels (tried earlier, on
 * its former 18 runs). The finished calibrations were still right in those runs (or refused), because the
 * identifier's re-pairing or the final fit's clipping (studentized residuals) left the pair out
 * further on: the check is the first of those guards, and the only one that judges the pair by the
 * others alone, so the tests hold it at the matcher's pairing.
 *
 * <p>A ghost is met first by the matcher's second-order images ({@link Calibrator#withSecondOrder}):
 * with them considered (the default) the ghost peak lies at the image of Hg I 404.66 nm, much nearer
 * than Ne I 808.25 nm, so it is explained as that image and never paired, with or without the
 * leave-one-out check. With them switched off ({@code --no-second-order}, for a spectrometer thought
 * to have an order-sorting filter that lets the ghost through all the same) the ghost is a foreign
 * line to the matcher, and the leave-one-out check is what drops it.
 *
 * <p>Within the tolerance (the foreign peak 2 pixels from the missing line's place,
 * {@code aForeignEndPeakWithinTheToleranceIsLeftOutByTheFit})
 * the others cannot tell it from the line at the matcher's tolerance: the matcher keeps the pair,
 * and the later steps (the identifier's re-pairing, the final fit's clipping) must leave it out or
 * refuse; they do. The same holds at the low end when the slope there is the smaller one (the low
 * end scene with kappa 0.4, 0.180 nm per pixel at the start and 240 pixels from the first line to
 * the next): the others' prediction is then loose enough that the check keeps a foreign peak 4 to 5
 * pixels off in about a third of the runs, and the identifier's re-pairing (at 4.5 and 5 pixels) or
 * the final fit's clipping (at 4 pixels, where the re-pairing, which allows three of the first
 * solution's standard uncertainties where those exceed the tolerance, pairs it again) leaves it out
 * ({@code aForeignPeakBeyondTheChecksReachIsLeftOutFurtherOn}).
 */
class LoneEndPairTest {

    private static final int PIXELS = 1024;
    private static final double TOLERANCE = Calibrator.DEFAULT_TOLERANCE;
    /** Ne I, air, nm (the built-in set): the first scene's last line, left out of the exposure. */
    private static final double NE_794 = 794.31814;
    /** Ne I, air, nm (the built-in set): the low-end scene's first line, left out. */
    private static final double NE_540 = 540.05618;
    /** Ne I, air, nm (the built-in set): the ghost scene's last line, left out. */
    private static final double NE_808 = 808.24576;
    /** Hg I, air, nm (the built-in set): its second-order image, at twice it, is the ghost. */
    private static final double HG_404 = 404.6563;

    private final DataContext data = DataContext.builtIn();
    private final LampSet neon = LampExposures.lamp(data, "Ne I");
    private final LampSet mercuryNeon = LampExposures.lamp(data, "Hg I", "Ne I");
    private final Scene high = new Scene(neon, LampExposures.dispersion(578, 222, PIXELS, 0.4, 0.05),
            new double[] {NE_794}, false);

    /**
     * The first scene. By hand, without the check: the matcher's pairing held the foreign peak in
     * all 6 runs (and in all 18 of offsets 4 to 6 either way with seeds 1 to 3).
     */
    @Test
    void aLoneEndPairTheOthersDoNotConfirmIsDropped() {
        assertDroppedAtEveryOffset(high, new double[] {-6, -5, -4, 4, 5, 6});
    }

    /**
     * The low end, the first scene turned end for end. By hand, without the check: the matcher's
     * pairing held the foreign peak in 3 of the 4 runs; the fourth (5 pixels below, seed 1) was
     * refused (calibrate.lamp-mismatch: the pairs scatter too much about the bent polynomial). At 6
     * pixels it was not paired even without the check (seeds 1 and 2), so that offset is not tried.
     */
    @Test
    void aLoneFirstPairAtTheLowEndIsDropped() {
        Scene low = new Scene(neon, LampExposures.dispersion(535, 222, PIXELS, -0.4, 0.05),
                new double[] {NE_540}, false);
        assertDroppedAtEveryOffset(low, new double[] {-5, -4, 4, 5});
    }

    /**
     * The first scene with wavelength falling with pixel (the lone end at the chip's start). By
     * hand, without the check: the matcher's pairing held the foreign peak in all 4 runs.
     */
    @Test
    void aLoneEndPairIsDroppedWhenWavelengthFallsWithPixel() {
        Scene falling = new Scene(neon, high.truth(), new double[] {NE_794}, true);
        assertDroppedAtEveryOffset(falling, new double[] {-6, -4, 4, 6});
    }

    /**
     * The ghost scene: with second-order images considered (the default) the ghost is explained as
     * the image of Hg I 404.66 nm; with them switched off the leave-one-out check drops it. By hand,
     * without the check: with images considered nothing changed (the ghost was an image in both
     * runs); with them switched off the matcher's pairing held the ghost in both (and at kappa 0,
     * seeds 1 and 2, in both, where with images it was an image).
     */
    @Test
    void aSecondOrderGhostBesideTheMissingEndLineIsNeverPaired() {
        double ghostNm = 2 * HG_404;
        double[] kappas = {0.4, -0.3};
        int solved = 0;
        for (int k = 0; k < kappas.length; k++) {
            Scene scene = new Scene(mercuryNeon, LampExposures.dispersion(589.5, 222, PIXELS, kappas[k], 0.05),
                    new double[] {NE_808, NE_794}, false);
            long seed = 1 + 2 * k;
            double ghostPixel = scene.pixelOf(ghostNm);
            double[] counts = scene.withGhosts(seed);
            String where = String.format(Locale.ROOT, "ghost of Hg I 404.66 nm %.1f px from Ne I 808.25 nm, seed %d",
                    ghostPixel - scene.pixelOf(NE_808), seed);
            Calibration withImages = calibrateOrNull(scene, counts, ghostPixel, Calibrator.defaults(), where);
            if (withImages != null) {
                solved++;
                assertFalse(holds(withImages.firstMatch(), ghostPixel), where + ": the matcher pairs the ghost");
                assertTrue(isImage(withImages, ghostPixel), where + ": the ghost is not explained as an image");
                assertRight(scene, withImages, ghostPixel, where);
            }
            String without = where + ", second-order images not considered";
            Calibration withoutImages = calibrateOrNull(scene, counts, ghostPixel,
                    Calibrator.defaults().withSecondOrder(false), without);
            if (withoutImages != null) {
                solved++;
                assertFalse(holds(withoutImages.firstMatch(), ghostPixel), without
                        + ": the matcher's pairing holds the lone end pair the others put "
                        + String.format(Locale.ROOT, "%.1f", ghostPixel - scene.pixelOf(NE_808)) + " px away");
                assertRight(scene, withoutImages, ghostPixel, without);
            }
        }
        assertTrue(solved >= 3, solved + " of 4 calibrations solved"); // a matcher refusing all cannot pass
    }

    @Test
    void aForeignEndPeakWithinTheToleranceIsLeftOutByTheFit() {
        int solved = 0;
        for (double offset : new double[] {-2, 2}) {
            for (long seed = 1; seed <= 2; seed++) {
                double foreignPixel = high.pixelOf(NE_794) + high.direction() * offset;
                String where = String.format(Locale.ROOT, "foreign peak %+.0f px from Ne I 794.32 nm, seed %d",
                        offset, seed);
                Calibration calibration = calibrateOrNull(high, high.withForeign(offset, seed), foreignPixel,
                        Calibrator.defaults(), where);
                if (calibration != null) {
                    solved++;
                    assertRight(high, calibration, foreignPixel, where);
                }
            }
        }
        assertTrue(solved >= 3, solved + " of 4 runs solved"); // a matcher refusing all cannot pass
    }

    /**
     * The low end with the smaller slope there (kappa 0.4: 0.180 nm per pixel at the start, 240
     * pixels from Ne I 540.06 nm to the next line), where the others cannot judge a foreign peak 4 to
     * 5 pixels off: by hand on 2026-12-05 the check left it in the matcher's pairing in 6 of 16 runs
     * (seeds 1 to 3 at 4.5 and 5 pixels either way, 1 and 2 at 4), among them the 2 tried here. The
     * later steps must leave it out, or the calibration refuse.
     */
    @Test
    void aForeignPeakBeyondTheChecksReachIsLeftOutFurtherOn() {
        Scene fine = new Scene(neon, LampExposures.dispersion(535, 222, PIXELS, 0.4, 0.05), new double[] {NE_540},
                false);
        int solved = 0;
        for (double offset : new double[] {-4.5, 5}) {
            double foreignPixel = fine.pixelOf(NE_540) + offset;
            String where = String.format(Locale.ROOT, "foreign peak %+.1f px from Ne I 540.06 nm, seed 1", offset);
            Calibration calibration = calibrateOrNull(fine, fine.withForeign(offset, 1), foreignPixel,
                    Calibrator.defaults(), where);
            if (calibration != null) {
                solved++;
                assertRight(fine, calibration, foreignPixel, where);
            }
        }
        assertTrue(solved >= 1, solved + " of 2 runs solved"); // a matcher refusing all cannot pass
    }

    /**
     * The foreign line {@code offset} pixels (towards longer wavelengths when positive) from the
     * scene's missing line, the noise seeds taken 1, 2, 3, 1, ... in turn: the matcher's pairing
     * leaves it out, and the calibration is right or refused; at most one run refused (with the check
     * none was in 2026-12-05's runs), so that a matcher refusing every scene cannot pass.
     */
    private void assertDroppedAtEveryOffset(Scene scene, double[] offsets) {
        int refused = 0;
        for (int i = 0; i < offsets.length; i++) {
            double offset = offsets[i];
            long seed = 1 + i % 3;
            double foreignPixel = scene.pixelOf(scene.missingNm()[0]) + scene.direction() * offset;
            String where = String.format(Locale.ROOT, "foreign peak %+.0f px from Ne I %.2f nm%s, seed %d", offset,
                    scene.missingNm()[0], scene.falling() ? " (wavelength falling)" : "", seed);
            Calibration calibration = calibrateOrNull(scene, scene.withForeign(offset, seed), foreignPixel,
                    Calibrator.defaults(), where);
            if (calibration == null) {
                refused++; // a refusal is allowed, once
                continue;
            }
            assertTrue(Math.abs(offset) > TOLERANCE, where);
            assertFalse(holds(calibration.firstMatch(), foreignPixel), where
                    + ": the matcher's pairing holds the lone end pair the others put " + Math.abs(offset)
                    + " px away");
            assertRight(scene, calibration, foreignPixel, where);
        }
        assertTrue(refused <= 1, refused + " of " + offsets.length + " runs refused");
    }

    /** The calibration, checking that the intruding peak at {@code pixel} was detected; null if refused. */
    private static Calibration calibrateOrNull(Scene scene, double[] counts, double pixel, Calibrator solver,
            String where) {
        try {
            Calibration calibration = solver.calibrate(CalibrationProblem.builder(counts).lamp(scene.lamp()).build());
            boolean found = false;
            for (double centre : calibration.peaks().centres()) {
                found |= Math.abs(centre - pixel) < 1;
            }
            assertTrue(found, where + ": the intruding peak is detected");
            return calibration;
        } catch (CalibrationException e) {
            return null;
        }
    }

    /** Not the intruding peak among the used pairs, and within 0.1 pixel of the truth over the fitted range. */
    private static void assertRight(Scene scene, Calibration calibration, double intruderPixel, String where) {
        for (int i = 0; i < calibration.match().size(); i++) {
            assertFalse(Math.abs(calibration.match().pixel(i) - intruderPixel) < 1
                    && !calibration.solution().isRejected(i), where + ": the fit uses the intruding peak");
        }
        double from = calibration.lowestUsedPixel();
        double to = calibration.highestUsedPixel();
        for (int s = 0; s <= 200; s++) {
            double p = from + (to - from) * s / 200;
            double error = Math.abs(calibration.solution().wavelengthAt(p) - scene.truthAt(p))
                    / scene.dispersionAt(p);
            assertTrue(error < 0.1, String.format(Locale.ROOT, "%s: %.3f pixels off at pixel %.1f", where, error, p));
        }
    }

    private static boolean holds(LampMatch match, double pixel) {
        for (int i = 0; i < match.size(); i++) {
            if (Math.abs(match.pixel(i) - pixel) < 1) {
                return true;
            }
        }
        return false;
    }

    private static boolean isImage(Calibration calibration, double pixel) {
        double[] centres = calibration.peaks().centres();
        for (int k : calibration.firstMatch().secondOrderPeaks()) {
            if (Math.abs(centres[k] - pixel) < 1) {
                return true;
            }
        }
        return false;
    }

    /**
     * A lamp, a cubic dispersion (nm at the rising pixel q, {@link LampExposures#dispersion}), the
     * lamp lines left out of the exposure, and whether the detector is mirrored (pixel p = 1023 - q,
     * wavelength falling with p). Pixels below are the detector's, as the calibration sees them.
     */
    private record Scene(LampSet lamp, double[] truth, double[] missingNm, boolean falling) {

        /** +1 when wavelength rises with pixel, -1 when it falls. */
        double direction() {
            return falling ? -1 : 1;
        }

        private double rising(double p) {
            return falling ? PIXELS - 1 - p : p;
        }

        /** The true wavelength at a detector pixel, nm. */
        double truthAt(double p) {
            return LampExposures.evaluate(truth, rising(p));
        }

        /** The true |d lambda / d p| at a detector pixel, nm per pixel. */
        double dispersionAt(double p) {
            double q = rising(p);
            return truth[1] + q * (2 * truth[2] + q * 3 * truth[3]);
        }

        /** The true detector pixel of a wavelength, by Newton's method on the rising pixel. */
        double pixelOf(double nm) {
            double q = (nm - truth[0]) / truth[1];
            for (int k = 0; k < 60; k++) {
                q -= (LampExposures.evaluate(truth, q) - nm) / (truth[1] + q * (2 * truth[2] + q * 3 * truth[3]));
            }
            return rising(q);
        }

        /** The exposure with a foreign line (relative intensity 150) offset rising pixels from the missing line. */
        double[] withForeign(double offset, long seed) {
            double q = rising(pixelOf(missingNm[0])) + offset;
            List<double[]> extra = new ArrayList<>();
            extra.add(new double[] {LampExposures.evaluate(truth, q), 150});
            return counts(extra, seed);
        }

        /** The exposure with the second-order image of every lamp line that has one in the window, at a tenth. */
        double[] withGhosts(long seed) {
            double first = LampExposures.evaluate(truth, 0);
            double last = LampExposures.evaluate(truth, PIXELS - 1);
            List<double[]> extra = new ArrayList<>();
            for (int i = 0; i < lamp.lines().size(); i++) {
                double image = 2 * lamp.lines().wavelength(i);
                if (image > first - 1 && image < last + 1) {
                    extra.add(new double[] {image, 0.1 * lamp.lines().intensity(i)});
                }
            }
            return counts(extra, seed);
        }

        /** The lamp's lines in the window but the missing ones, and the extra {nm, relative intensity}, with noise. */
        private double[] counts(List<double[]> extra, long seed) {
            double first = LampExposures.evaluate(truth, 0);
            double last = LampExposures.evaluate(truth, PIXELS - 1);
            double fwhmNm = 2.5 * (last - first) / (PIXELS - 1);
            List<double[]> lines = new ArrayList<>(); // {nm, relative intensity}
            double strongest = 0;
            for (int i = 0; i < lamp.lines().size(); i++) {
                double nm = lamp.lines().wavelength(i);
                if (nm > first - 1 && nm < last + 1 && !isMissing(nm)) {
                    lines.add(new double[] {nm, lamp.lines().intensity(i)});
                    strongest = Math.max(strongest, lamp.lines().intensity(i));
                }
            }
            lines.addAll(extra);
            double sigmaNm = fwhmNm / (2 * Math.sqrt(2 * Math.log(2)));
            double[] position = new double[lines.size()];
            double[] flux = new double[lines.size()];
            for (int k = 0; k < position.length; k++) {
                position[k] = lines.get(k)[0];
                flux[k] = 30000 * lines.get(k)[1] / strongest * sigmaNm * Math.sqrt(2 * Math.PI);
            }
            double[] expected = new double[PIXELS];
            for (int i = 0; i < PIXELS; i++) {
                expected[i] = 200 + 40 * Math.sin(4.0 * i / PIXELS);
            }
            new LineRenderer(PixelGrid.dispersion(truth, PIXELS), Instrument.ofFwhm(fwhmNm), 12).render(position,
                    flux, new double[position.length], new double[position.length], expected);
            double[] counts = new double[PIXELS];
            Noise.apply(expected, 5, seed, counts);
            if (falling) {
                for (int i = 0, j = PIXELS - 1; i < j; i++, j--) {
                    double t = counts[i];
                    counts[i] = counts[j];
                    counts[j] = t;
                }
            }
            return counts;
        }

        private boolean isMissing(double nm) {
            for (double m : missingNm) {
                if (nm == m) {
                    return true;
                }
            }
            return false;
        }
    }
}
