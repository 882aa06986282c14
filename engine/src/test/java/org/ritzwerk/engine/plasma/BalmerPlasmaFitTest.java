package org.ritzwerk.engine.plasma;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.profile.BalmerStark;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.testing.Golden;

/**
 * The Balmer plasma fit on a spectrum made outside the project (balmer-spectrum.csv, by
 * make_balmer_golden.py with scipy's Voigt profile, sympy's exact hydrogen radial integrals and
 * CODATA 2018 constants): it must find the fluxes and Lorentzian widths put in, the Boltzmann
 * temperature the fluxes were made at, and the density the Stark fit gives for the H-beta width.
 */
class BalmerPlasmaFitTest {

    // Nuclear masses: CODATA 2018 (as PhysicalConstants); spins and moments are not used here.
    private static final HydrogenLikeModel H = HydrogenLikeModel.of(new Nucleus(1, 1,
            PhysicalConstants.PROTON_MASS.value(), 1, OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018"),
            Tier.DIRAC);
    private static final HydrogenLikeModel D = HydrogenLikeModel.of(new Nucleus(1, 2,
            PhysicalConstants.DEUTERON_MASS.value(), 2, OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018"),
            Tier.DIRAC);

    private static double[][] spectrum() {
        List<Map<String, String>> rows = Golden.rows("balmer-spectrum.csv");
        double[][] s = new double[2][rows.size()];
        for (int i = 0; i < rows.size(); i++) {
            s[0][i] = Double.parseDouble(rows.get(i).get("vacuum_nm"));
            s[1][i] = Double.parseDouble(rows.get(i).get("counts"));
        }
        return s;
    }

    private static BalmerPlasmaFit.Result fit() {
        double[][] s = spectrum();
        return BalmerPlasmaFit.defaults().withInstrumentFwhm(0.10).fit(BalmerPlasmaFit.problem(s[0], Medium.vacuum(),
                s[1]).readNoise(0).emitter(H).companion(D, 0.5).line(3).line(4).line(5).line(6).build());
    }

    @Test
    void findsTheFluxesWidthsAndTemperaturePutIn() {
        BalmerPlasmaFit.Result result = fit();
        assertTrue(result.notes().isEmpty(), result.notes().toString());
        List<Map<String, String>> truth = Golden.rows("balmer-lines.csv");
        double fluxTolerance = Golden.tolerance("balmer-lines.csv", "flux");
        double lorentzTolerance = Golden.tolerance("balmer-lines.csv", "lorentz");
        assertEquals(truth.size(), result.lines().size());
        for (int i = 0; i < truth.size(); i++) {
            BalmerPlasmaFit.Line line = result.lines().get(i);
            Map<String, String> row = truth.get(i);
            assertEquals(Integer.parseInt(row.get("upper_n")), line.upperN());
            assertEquals(0, Golden.relativeError(Double.parseDouble(row.get("flux")), line.flux()), fluxTolerance,
                    "flux of n = " + line.upperN());
            assertEquals(0, Golden.relativeError(Double.parseDouble(row.get("lorentz_fwhm_nm")), line.lorentzFwhmNm()),
                    lorentzTolerance, "Lorentzian FWHM of n = " + line.upperN());
            // The Gaussian width the fit held is the generator's (same Doppler formula and mass).
            assertEquals(0, Golden.relativeError(Double.parseDouble(row.get("gaussian_fwhm_nm")),
                    line.gaussianFwhmNm()), 1e-4, "Gaussian FWHM of n = " + line.upperN());
            // The centre is the H line's (the generator's Bohr position; fine structure moves the
            // multiplet by under 0.01 nm).
            assertEquals(Double.parseDouble(row.get("h_vacuum_nm")), line.centreNm(), 0.01);
        }
        BalmerPlasmaFit.Temperature t = result.temperature().orElseThrow();
        assertEquals(4, t.lines());
        assertEquals(0, Golden.relativeError(9000, t.kelvin()), Golden.tolerance("balmer-lines.csv", "temperature"),
                "temperature " + t.kelvin());
        BalmerPlasmaFit.Density d = result.density().orElseThrow();
        assertEquals(4, d.upperN());
        assertEquals(BalmerStark.electronDensity(BalmerStark.Line.BETA, 0.10), d.perCubicMetre(),
                1e-3 * d.perCubicMetre());
    }

    @Test
    void withoutTheCompanionTheFluxesComeOutWrong() {
        // The D lines lie within the H lines' windows: leaving them out must show (the test can fail).
        double[][] s = spectrum();
        BalmerPlasmaFit.Result alone = BalmerPlasmaFit.defaults().withInstrumentFwhm(0.10).fit(BalmerPlasmaFit
                .problem(s[0], Medium.vacuum(), s[1]).readNoise(0).emitter(H).line(4).build());
        double flux = Double.parseDouble(Golden.rows("balmer-lines.csv").get(1).get("flux"));
        assertTrue(alone.lines().isEmpty() || Golden.relativeError(flux, alone.lines().get(0).flux()) > 0.05,
                alone.toString());
    }

    @Test
    void missingLinesAndBadSettingsAreReported() {
        double[][] s = spectrum();
        // Balmer-epsilon (397 nm) lies outside the spectrum: it is reported, not fitted.
        BalmerPlasmaFit.Result result = BalmerPlasmaFit.defaults().withInstrumentFwhm(0.10).fit(BalmerPlasmaFit
                .problem(s[0], Medium.vacuum(), s[1]).readNoise(0).emitter(H).companion(D, 0.5).line(4).line(7)
                .build());
        assertEquals(1, result.lines().size());
        assertTrue(result.notes().stream().anyMatch(n -> n.startsWith("Balmer 7-2: only 0 pixels")), result.notes()
                .toString());
        assertTrue(result.notes().stream().anyMatch(n -> n.startsWith("temperature: a Boltzmann plot needs at least 3")),
                result.notes().toString());
        assertTrue(result.density().isPresent());
        assertThrows(IllegalArgumentException.class, () -> BalmerPlasmaFit.defaults().withInstrumentFwhm(-1));
        assertThrows(IllegalArgumentException.class, () -> BalmerPlasmaFit.defaults().withDopplerTemperature(0));
        assertThrows(IllegalArgumentException.class, () -> BalmerPlasmaFit.defaults().withHalfWindow(Double.NaN));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> BalmerPlasmaFit
                .problem(s[0], Medium.vacuum(), s[1]).emitter(H).line(4).build());
        assertTrue(e.getMessage().contains("uncertainties are required"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> BalmerPlasmaFit.problem(new double[] {1, 2, 3, 4, 5, 6,
            7, 3}, Medium.vacuum(), new double[8]));
        assertTrue(e.getMessage().startsWith("pixel 7:"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> BalmerPlasmaFit.problem(s[0], Medium.vacuum(), s[1])
                .line(2));
        assertTrue(e.getMessage().contains("upper n must be 3 to 30, got 2"), e.getMessage());
    }
}
