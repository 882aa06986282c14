package org.ritzwerk.engine.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.testing.Golden;

/** Line profiles: agreement with scipy, unit area, the Gaussian and Lorentzian limits of the Voigt profile, its width. */
class ProfilesTest {

    @Test
    void everyProfileHasUnitArea() {
        qt().withFixedSeed(8L).withExamples(12).forAll(doubles().between(0.1, 3), doubles().between(0.01, 3))
                .checkAssert((g, l) -> {
                    // Trapezoid over +-2000 widths; the Lorentzian tails beyond hold l / (pi 2000 l ...) < 2e-4.
                    double span = 2000 * (g + l);
                    int steps = 400_000;
                    double h = 2 * span / steps;
                    double voigt = 0;
                    for (int k = 0; k <= steps; k++) {
                        double x = -span + k * h;
                        double weight = k == 0 || k == steps ? 0.5 : 1;
                        voigt += weight * Profiles.voigt(x, g, l) * h;
                    }
                    double tail = 2 * (l / 2) / Math.PI / span; // the Lorentzian area beyond +-span
                    assertEquals(1, voigt + tail, 2e-5, "g " + g + " l " + l);
                });
    }

    @Test
    void voigtAgreesWithScipy() {
        // golden/voigt.csv: scipy.special.voigt_profile, cross-checked there by mpmath quadrature;
        // tolerance as its header declares.
        double tolerance = Golden.tolerance("voigt.csv");
        int rows = 0;
        for (Map<String, String> row : Golden.rows("voigt.csv")) {
            double x = Double.parseDouble(row.get("x"));
            double g = Double.parseDouble(row.get("gaussian_fwhm"));
            double l = Double.parseDouble(row.get("lorentz_fwhm"));
            double expected = Double.parseDouble(row.get("value"));
            assertEquals(expected, Profiles.voigt(x, g, l), tolerance * expected, row.toString());
            double[] bulk = new double[1];
            Profiles.voigt(new double[] {x}, g, l, bulk);
            assertEquals(expected, bulk[0], tolerance * expected, "bulk " + row);
            rows++;
        }
        assertEquals(54, rows);
    }

    @Test
    void voigtTendsToItsLimits() {
        qt().withFixedSeed(9L).withExamples(50).forAll(doubles().between(-5, 5), doubles().between(0.2, 2))
                .checkAssert((x, width) -> {
                    assertEquals(Profiles.gaussian(x, width), Profiles.voigt(x, width, width * 1e-9),
                            1e-8 * Profiles.gaussian(0, width) + 1e-9 * Profiles.gaussian(x, width));
                    assertEquals(Profiles.lorentzian(x, width), Profiles.voigt(x, width * 1e-7, width),
                            1e-6 * Profiles.lorentzian(x, width));
                });
    }

    @Test
    void voigtWidthFollowsOliveroAndLongbothum() {
        // The FWHM found numerically matches f_V = 0.5346 f_L + sqrt(0.2166 f_L^2 + f_G^2) to
        // 0.02 %: J. J. Olivero and R. L. Longbothum, "Empirical fits to the Voigt line width: a
        // brief review", J. Quant. Spectrosc. Radiat. Transfer 17, 233 (1977), which states that
        // accuracy. The numerical width below is the independent check of the coefficients.
        for (double ratio : new double[] {0.1, 0.5, 1, 2, 10}) {
            double g = 1;
            double l = ratio;
            double peak = Profiles.voigt(0, g, l);
            double lo = 0;
            double hi = 10 * (g + l);
            for (int k = 0; k < 200; k++) {
                double mid = (lo + hi) / 2;
                if (Profiles.voigt(mid, g, l) > peak / 2) {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
            double fwhm = 2 * lo;
            assertEquals(Profiles.voigtFwhm(g, l), fwhm, 2.5e-4 * fwhm, "ratio " + ratio);
        }
    }

    @Test
    void refusesBadWidths() {
        assertEquals("Gaussian FWHM must be finite and positive, got 0.0",
                assertThrows(IllegalArgumentException.class, () -> Profiles.gaussian(0, 0)).getMessage());
        assertEquals("a Voigt profile needs a Gaussian or a Lorentzian width above zero",
                assertThrows(IllegalArgumentException.class, () -> Profiles.voigt(0, 0, 0)).getMessage());
        assertThrows(IllegalArgumentException.class, () -> Profiles.voigt(0, -1, 1));
    }

    @Test
    void theLorentzianPartOfAVoigtWidthInvertsTheApproximation() {
        qt().withFixedSeed(61L).withExamples(300)
                .forAll(doubles().between(0, 5), doubles().between(0, 5))
                .checkAssert((g, l) -> {
                    double v = Profiles.voigtFwhm(g, l);
                    assertEquals(l, Profiles.lorentzFwhmOfVoigt(v, g), 1e-12 * (1 + v));
                });
        assertEquals(0, Profiles.lorentzFwhmOfVoigt(0.3, 0.3), 1e-15);
        assertThrows(IllegalArgumentException.class, () -> Profiles.lorentzFwhmOfVoigt(0.2, 0.3));
    }
}
