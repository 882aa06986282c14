package org.ritzwerk.engine.calibrate;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;

/**
 * A synthetic neon-lamp exposure with a known dispersion: 4096 pixels whose centres follow a
 * cubic from 460 nm (pixel 0) to 940 nm (pixel 4095), Gaussian lines of 0.4 nm FWHM rendered
 * into the pixels (each pixel receives the flux between its edges), a smooth baseline, a few
 * contaminating lines that are not in the lamp list, then Poisson and read noise.
 *
 * <p>The lamp lines are the 43 rows of the built-in lamp-ne-i.csv (Ne I air wavelengths and
 * relative intensities; Sansonetti and Martin, J. Phys. Chem. Ref. Data 34, 1559 (2005), from
 * memory and checked row by row, see refdata/src/main/resources/org/ritzwerk/refdata/lamps/README.md),
 * copied here because the engine's tests cannot read refdata. The detector sees 460 to 940 nm, where
 * those rows lie. The tests check that the invented dispersion is recovered from this pattern; the
 * instrument, baseline, line strengths and contaminants are invented.
 */
final class LampScene {

    static final int PIXELS = 4096;
    /** The true dispersion: wavelength in nm of pixel p's centre is C0 + C1 p + C2 p^2 + C3 p^3. */
    static final double[] TRUTH;
    static final double READ_NOISE = 5;

    /** Ne I, air, nm, and the table's relative intensities (lamp-ne-i.csv). */
    static final double[] NEON_NM = {
        470.88594, 482.7338, 540.05618, 585.24879, 588.18952, 602.99969, 607.43377, 614.30626, 616.35939,
        621.72812, 626.64950, 633.44278, 638.29917, 640.2248, 650.65281, 659.89529, 692.94673, 702.40504,
        703.24131, 705.91074, 717.39381, 724.51666, 748.88712, 794.31814, 813.64054, 826.60772, 830.03258,
        841.84274, 849.53598, 859.12584, 863.46470, 865.43831, 867.94925, 868.19211, 877.16563, 878.06226,
        878.37533, 885.38668, 886.57552, 914.86716, 920.17591, 930.08527, 932.65068};
    static final double[] NEON_INTENSITY = {
        120, 100, 200, 200, 100, 100, 100, 100, 100, 100, 100, 100, 100, 200, 150, 100, 1000, 300, 800, 100, 800,
        800, 300, 80, 170, 70, 300, 250, 700, 400, 350, 600, 130, 150, 100, 600, 400, 300, 150, 120, 90, 80, 70};

    static {
        double c0 = 460;
        double c1 = 0.13;
        double c3 = 1.0e-10;
        double last = PIXELS - 1;
        double c2 = (940 - c0 - c1 * last - c3 * last * last * last) / (last * last);
        TRUTH = new double[] {c0, c1, c2, c3};
    }

    final double[] expected;
    final double[] contaminants;

    /**
     * @param peakCountsPerUnit peak height in counts of a line of relative intensity 1
     * @param contaminantSeed   seed of the contaminating lines' wavelengths and strengths
     * @param contaminantCount  how many contaminating lines
     */
    LampScene(double peakCountsPerUnit, long contaminantSeed, int contaminantCount) {
        this(NEON_NM, NEON_INTENSITY, peakCountsPerUnit, contaminantSeed, contaminantCount);
    }

    LampScene(double[] linesNm, double[] intensity, double peakCountsPerUnit, long contaminantSeed,
            int contaminantCount) {
        PixelGrid grid = PixelGrid.dispersion(TRUTH, PIXELS);
        double fwhmNm = 0.4;
        SplittableRandom random = new SplittableRandom(contaminantSeed);
        contaminants = new double[contaminantCount];
        double[] contaminantIntensity = new double[contaminantCount];
        for (int k = 0; k < contaminantCount; k++) {
            double nm;
            do {
                nm = 465 + 470 * random.nextDouble();
            } while (distanceToNearest(linesNm, nm) < 1.5);
            contaminants[k] = nm;
            contaminantIntensity[k] = 100 + 400 * random.nextDouble();
        }
        int n = linesNm.length + contaminantCount;
        double[] position = Arrays.copyOf(linesNm, n);
        double[] flux = new double[n];
        // Flux = height x sigma x sqrt(2 pi), with sigma in nm for a grid in nm.
        double sigmaNm = fwhmNm / (2 * Math.sqrt(2 * Math.log(2)));
        for (int k = 0; k < n; k++) {
            double rel = k < linesNm.length ? intensity[k] : contaminantIntensity[k - linesNm.length];
            if (k >= linesNm.length) {
                position[k] = contaminants[k - linesNm.length];
            }
            flux[k] = rel * peakCountsPerUnit * sigmaNm * Math.sqrt(2 * Math.PI);
        }
        expected = new double[PIXELS];
        for (int i = 0; i < PIXELS; i++) {
            double t = (double) i / PIXELS;
            expected[i] = 300 + 150 * t + 60 * Math.sin(5 * t); // a smooth lamp continuum plus dark level
        }
        new LineRenderer(grid, Instrument.ofFwhm(fwhmNm), 12).render(position, flux, new double[n], new double[n],
                expected);
    }

    private static double distanceToNearest(double[] values, double x) {
        double best = Double.POSITIVE_INFINITY;
        for (double v : values) {
            best = Math.min(best, Math.abs(v - x));
        }
        return best;
    }

    /** @return one noisy exposure */
    double[] exposure(long seed) {
        double[] out = new double[PIXELS];
        Noise.apply(expected, READ_NOISE, seed, out);
        return out;
    }

    static double truthAt(double pixel) {
        return TRUTH[0] + pixel * (TRUTH[1] + pixel * (TRUTH[2] + pixel * TRUTH[3]));
    }

    static double truthDispersionAt(double pixel) {
        return TRUTH[1] + pixel * (2 * TRUTH[2] + pixel * 3 * TRUTH[3]);
    }

    /** @return the true pixel position of a wavelength, by Newton's method */
    static double truthPixelOf(double nm) {
        double p = (nm - TRUTH[0]) / TRUTH[1];
        for (int i = 0; i < 50; i++) {
            double step = (truthAt(p) - nm) / truthDispersionAt(p);
            p -= step;
            if (Math.abs(step) < 1e-12) {
                break;
            }
        }
        return p;
    }
}
