package org.ritzwerk.engine.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;

import org.junit.jupiter.api.Test;

/**
 * The Balmer Stark widths against the published fits of Gigosos, Gonzalez and Cardenoso,
 * Spectrochim. Acta B 58, 1489 (2003): FWHM(H-beta) = 4.800 nm (Ne / 1e23 m^-3)^0.68116 and
 * FWHM(H-alpha) = 0.549 nm (Ne / 1e23 m^-3)^0.67082 (1.098 nm, used before, is the fit of the full
 * width at half area). The coefficients are from memory (neither
 * the paper nor a publication quoting the fits could be read; see {@link BalmerStark}); the
 * values below are those fits evaluated by hand (4 digits), and {@link #exponentsFollowTheQuasiStaticLaw}
 * is the independent check of the density dependence.
 */
class BalmerStarkTest {

    @Test
    void hBetaWidthsFollowThePublishedFit() {
        assertEquals(4.800, BalmerStark.fwhmNanometres(BalmerStark.Line.BETA, 1e23), 1e-12);
        // 4.8 * 10^-0.68116 = 1.0002; 4.8 * 10^0.68116 = 23.04; 4.8 * 10^(-2 * 0.68116) = 0.2085.
        assertEquals(1.0002, BalmerStark.fwhmNanometres(BalmerStark.Line.BETA, 1e22), 1e-4);
        assertEquals(23.04, BalmerStark.fwhmNanometres(BalmerStark.Line.BETA, 1e24), 1e-2);
        assertEquals(0.2085, BalmerStark.fwhmNanometres(BalmerStark.Line.BETA, 1e21), 1e-4);
    }

    @Test
    void hAlphaWidthsFollowThePublishedFit() {
        assertEquals(0.549, BalmerStark.fwhmNanometres(BalmerStark.Line.ALPHA, 1e23), 1e-12);
        // 0.549 * 10^-0.67082 = 0.1172.
        assertEquals(0.1172, BalmerStark.fwhmNanometres(BalmerStark.Line.ALPHA, 1e22), 1e-4);
    }

    @Test
    void theDiagnosticInvertsTheWidth() {
        qt().withFixedSeed(41L).withExamples(200)
                .forAll(doubles().between(20.01, 24.99))
                .checkAssert(log -> {
                    double density = Math.pow(10, log);
                    for (BalmerStark.Line line : BalmerStark.Line.values()) {
                        double width = BalmerStark.fwhmNanometres(line, density);
                        assertEquals(density, BalmerStark.electronDensity(line, width), density * 1e-12);
                    }
                });
    }

    @Test
    void theDensityUncertaintyIsTheWidthsOverTheExponent() {
        double d = BalmerStark.electronDensity(BalmerStark.Line.BETA, 1.0);
        assertEquals(d * 0.02 / 0.68116, BalmerStark.electronDensityUncertainty(BalmerStark.Line.BETA, 1.0, 0.02),
                d * 1e-12);
    }

    @Test
    void exponentsFollowTheQuasiStaticLaw() {
        // The local slope d ln(FWHM) / d ln(Ne) of both fits lies within 3 % above 2/3, the
        // Holtsmark (quasi-static ion field) law (Griem, Spectral Line Broadening by Plasmas, 1974).
        for (BalmerStark.Line line : BalmerStark.Line.values()) {
            double slope = Math.log(BalmerStark.fwhmNanometres(line, 1e24) / BalmerStark.fwhmNanometres(line, 1e22))
                    / Math.log(100);
            assertTrue(slope > 2.0 / 3 && slope < 1.03 * 2 / 3, line + " slope " + slope);
        }
    }

    @Test
    void onlyBalmerAlphaAndBetaHaveAFit() {
        assertEquals(BalmerStark.Line.ALPHA, BalmerStark.Line.of(3, 2));
        assertEquals(BalmerStark.Line.BETA, BalmerStark.Line.of(4, 2));
        assertEquals(null, BalmerStark.Line.of(5, 2));
        assertEquals(null, BalmerStark.Line.of(3, 1));
    }

    @Test
    void outsideTheFitsRangeItRefuses() {
        IllegalArgumentException low = assertThrows(IllegalArgumentException.class,
                () -> BalmerStark.fwhmNanometres(BalmerStark.Line.BETA, 1e18));
        assertTrue(low.getMessage().contains("outside"), low.getMessage());
        IllegalArgumentException wide = assertThrows(IllegalArgumentException.class,
                () -> BalmerStark.electronDensity(BalmerStark.Line.BETA, 500));
        assertTrue(wide.getMessage().contains("H-beta Stark FWHM 500.0 nm"), wide.getMessage());
        assertThrows(IllegalArgumentException.class, () -> BalmerStark.electronDensity(BalmerStark.Line.ALPHA, 0));
        assertThrows(IllegalArgumentException.class,
                () -> BalmerStark.electronDensity(BalmerStark.Line.ALPHA, Double.NaN));
    }
}
