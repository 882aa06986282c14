package org.ritzwerk.engine.plasma;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.plasma.BoltzmannPlot.Counting;
import org.ritzwerk.engine.plasma.BoltzmannPlot.Fit;
import org.ritzwerk.testing.Golden;

/** Boltzmann-plot temperatures against scipy/numpy fits, exact data, and the stated uncertainty. */
class BoltzmannPlotTest {

    private static final double K = PhysicalConstants.K;
    private static final double EV = 1.602176634e-19;

    @Test
    void agreesWithScipyAndNumpyFits() {
        // golden/boltzmann-*.csv: scipy.stats.linregress (unweighted) and numpy.polyfit with
        // cov='unscaled' (weighted), made by make_boltzmann_golden.py; tolerances from its header.
        double slopeTolerance = Golden.tolerance("boltzmann-fit.csv", "slope");
        double slopeSigmaTolerance = Golden.tolerance("boltzmann-fit.csv", "slope_sigma");
        double interceptTolerance = Golden.absoluteTolerance("boltzmann-fit.csv", "intercept");
        List<Map<String, String>> lines = Golden.rows("boltzmann-lines.csv");
        double[] e = column(lines, "upper_energy_j");
        double[] g = column(lines, "g_upper");
        double[] a = column(lines, "einstein_a");
        double[] nu = column(lines, "frequency_hz");
        double[] intensity = column(lines, "intensity");
        double[] sigma = column(lines, "intensity_sigma");
        int rows = 0;
        for (Map<String, String> row : Golden.rows("boltzmann-fit.csv")) {
            Counting counting = row.get("counting").equals("energy") ? Counting.ENERGY : Counting.PHOTONS;
            boolean weighted = Boolean.parseBoolean(row.get("weighted"));
            Fit fit = BoltzmannPlot.fit(counting, intensity, weighted ? sigma : null, e, g, a, nu);
            double slope = Double.parseDouble(row.get("slope"));
            double slopeSigma = Double.parseDouble(row.get("slope_sigma"));
            assertEquals(slope, fit.slope(), slopeTolerance * Math.abs(slope), row.toString());
            assertEquals(slopeSigma, fit.slopeUncertainty(), slopeSigmaTolerance * slopeSigma, row.toString());
            assertEquals(Double.parseDouble(row.get("intercept")), fit.intercept(), interceptTolerance, row.toString());
            assertEquals(-1 / (K * slope), fit.temperature(), slopeTolerance * fit.temperature());
            rows++;
        }
        assertEquals(4, rows);
    }

    @Test
    void recoversTheTemperatureOfExactIntensities() {
        double t = 12_345;
        double[] e = {10.2 * EV, 12.09 * EV, 12.75 * EV, 13.05 * EV};
        double[] g = {8, 18, 32, 50};
        double[] a = {4.7e8, 5.6e7, 8.4e6, 2.5e6};
        double[] intensity = new double[4];
        for (int i = 0; i < 4; i++) {
            intensity[i] = 3.7 * g[i] * a[i] * Math.exp(-e[i] / (K * t));
        }
        Fit fit = BoltzmannPlot.fit(Counting.PHOTONS, intensity, null, e, g, a, null);
        assertEquals(t, fit.temperature(), 1e-9 * t);
        assertTrue(fit.temperatureUncertainty() < 1e-6 * t, "scatter-free data, uncertainty " + fit.temperatureUncertainty());
    }

    @Test
    void statedUncertaintyMatchesTheScatterOfRepeatedFits() {
        // 2000 seeded repetitions with 5 % Gaussian intensity noise: the pulls
        // (T_fit - T) / sigma_T should have a standard deviation near 1 (common practice).
        double t = 8000;
        double[] e = {9.0 * EV, 10.5 * EV, 11.2 * EV, 12.0 * EV, 12.6 * EV, 13.0 * EV};
        double[] g = {2, 6, 10, 18, 32, 50};
        double[] a = {1e8, 4e7, 2e7, 9e6, 5e6, 2e6};
        SplittableRandom random = new SplittableRandom(20261201L);
        int trials = 2000;
        double sumSquares = 0;
        for (int k = 0; k < trials; k++) {
            double[] intensity = new double[e.length];
            double[] sigma = new double[e.length];
            for (int i = 0; i < e.length; i++) {
                double truth = g[i] * a[i] * Math.exp(-e[i] / (K * t));
                sigma[i] = 0.05 * truth;
                intensity[i] = truth * (1 + 0.05 * gaussian(random));
            }
            Fit fit = BoltzmannPlot.fit(Counting.PHOTONS, intensity, sigma, e, g, a, null);
            double pull = (fit.temperature() - t) / fit.temperatureUncertainty();
            sumSquares += pull * pull;
        }
        double rms = Math.sqrt(sumSquares / trials);
        assertTrue(rms > 0.9 && rms < 1.1, "rms pull " + rms);
    }

    @Test
    void refusesUnusableLines() {
        double[] e = {10 * EV, 12 * EV, 13 * EV};
        double[] ones = {1, 1, 1};
        assertEquals("line 1: intensity must be finite and positive, got 0.0",
                assertThrows(IllegalArgumentException.class,
                        () -> BoltzmannPlot.fit(Counting.PHOTONS, new double[] {1, 0, 1}, null, e, ones, ones, null))
                        .getMessage());
        assertEquals("the Einstein A values must match the 3 intensities, got 2",
                assertThrows(IllegalArgumentException.class,
                        () -> BoltzmannPlot.fit(Counting.PHOTONS, ones, null, e, ones, new double[] {1, 1}, null))
                        .getMessage());
        assertEquals("energy-flux intensities need the line frequencies",
                assertThrows(IllegalArgumentException.class,
                        () -> BoltzmannPlot.fit(Counting.ENERGY, ones, null, e, ones, ones, null)).getMessage());
        assertEquals("all lines share one upper-level energy (" + EV + " J, within 1.0E-12 of it); a Boltzmann plot"
                + " needs lines from upper levels of different energies",
                assertThrows(IllegalArgumentException.class, () -> BoltzmannPlot.fit(Counting.PHOTONS,
                        new double[] {1, 2, 3}, null, new double[] {EV, EV, EV}, ones, ones, null)).getMessage());
        // With unequal weights the weighted mean of equal energies is off by rounding; it was read
        // as a spread of 1e-34 J and a slope of 7e18 J^-1 ("the plot rises").
        assertTrue(assertThrows(IllegalArgumentException.class, () -> BoltzmannPlot.fit(Counting.PHOTONS,
                new double[] {1, 2}, new double[] {0.1, 0.1}, new double[] {1e-18, 1e-18}, new double[] {2, 2},
                new double[] {1e7, 1e7}, null)).getMessage().startsWith("all lines share one upper-level energy"));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> BoltzmannPlot.fit(Counting.PHOTONS,
                new double[] {1, 2, 3}, null, e, ones, ones, null)).getMessage()
                .contains("no positive excitation temperature"));
        assertEquals("a Boltzmann plot needs at least 3 lines without intensity uncertainties, got 2",
                assertThrows(IllegalArgumentException.class, () -> BoltzmannPlot.fit(Counting.PHOTONS,
                        new double[] {1, 2}, null, new double[] {EV, 2 * EV}, new double[] {1, 1},
                        new double[] {1, 1}, null)).getMessage());
    }

    private static double gaussian(SplittableRandom random) {
        // Box-Muller.
        double u = 1 - random.nextDouble();
        return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random.nextDouble());
    }

    private static double[] column(List<Map<String, String>> rows, String name) {
        return rows.stream().mapToDouble(r -> Double.parseDouble(r.get(name))).toArray();
    }
}
