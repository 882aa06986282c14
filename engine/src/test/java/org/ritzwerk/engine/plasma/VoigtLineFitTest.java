package org.ritzwerk.engine.plasma;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.profile.Profiles;

/** The Voigt line fit on lines drawn from the profile itself, with and without a companion. */
class VoigtLineFitTest {

    private static double[][] line(double l, double ratio, double offset, double noise, long seed) {
        int n = 300;
        double[] x = new double[n];
        double[] y = new double[n];
        double[] s = new double[n];
        SplittableRandom random = new SplittableRandom(seed);
        for (int i = 0; i < n; i++) {
            x[i] = 485 + 2.0 * i / n;
            double v = 50 + 10 * (x[i] - 486) + 20_000 * (Profiles.voigt(x[i] - 486.1, 0.1, l)
                    + ratio * Profiles.voigt(x[i] - 486.1 - offset, 0.1, l)) * (2.0 / n);
            s[i] = Math.sqrt(v);
            y[i] = v + noise * s[i] * random.nextGaussian();
        }
        return new double[][] {x, y, s};
    }

    @Test
    void recoversTheLorentzianWidthOfANoiselessLine() {
        double[][] d = line(0.2, 0, 0, 0, 1);
        VoigtLineFit.Result fit = VoigtLineFit.fit(d[0], d[1], d[2], 0.1, new double[0], new double[0], 486.05);
        // Pixel values are the profile at the centre times the width, as the model: exact.
        assertEquals(0.2, fit.lorentzFwhm(), 1e-6);
        assertEquals(486.1, fit.centre(), 1e-7);
        assertEquals(20_000, fit.flux(), 1e-2);
    }

    @Test
    void recoversItUnderACompanionAndNoiseWithinItsUncertainty() {
        int inside = 0;
        for (long seed = 0; seed < 40; seed++) {
            double[][] d = line(0.15, 0.5, -0.132, 1, seed);
            VoigtLineFit.Result fit = VoigtLineFit.fit(d[0], d[1], d[2], 0.1, new double[] {-0.132},
                    new double[] {0.5}, 486.08);
            if (Math.abs(fit.lorentzFwhm() - 0.15) < 2 * fit.lorentzFwhmSigma()) {
                inside++;
            }
        }
        // About 95 % of 40 within 2 sigma if the stated uncertainty is right: at least 33.
        assertTrue(inside >= 33, inside + " of 40 within 2 sigma");
    }

    @Test
    void badInputIsRefused() {
        assertThrows(IllegalArgumentException.class, () -> VoigtLineFit.fit(new double[3], new double[3], null, 0.1,
                new double[0], new double[0], 0));
        double[][] d = line(0.2, 0, 0, 0, 1);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> VoigtLineFit.fit(d[0], d[1], null, 0.1, new double[] {0.1}, new double[0], 486));
        assertTrue(e.getMessage().contains("one ratio per companion"), e.getMessage());
    }
}
