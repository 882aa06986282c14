package org.ritzwerk.quantity;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.testing.Golden;

/**
 * Every conversion between vacuum wavelength, wavenumber, frequency, energy (J and eV) and the
 * temperature E/k, against mpmath 1.2.1 at 40 digits from the exact SI constants, golden file
 * {@code spectral-conversions.csv} made by {@code make_golden.py}. Tolerance as the file's header
 * declares it (1e-14 relative), over 51 rows from 1e-6 eV to 1e5 eV.
 */
class SpectralConversionGoldenTest {

    private static final double TOLERANCE = Golden.tolerance("spectral-conversions.csv");
    private static final List<Map<String, String>> ROWS = Golden.rows("spectral-conversions.csv");

    @Test
    void everyKindConvertsToEveryOtherAsMpmathSays() {
        for (Map<String, String> row : ROWS) {
            List<SpectralQuantity> inputs = List.of(
                    Wavelength.ofMetres(value(row, "wavelength_vacuum_m"), Medium.vacuum()),
                    Wavenumber.of(value(row, "wavenumber_per_m"), Unit.PER_METRE),
                    Frequency.ofHertz(value(row, "frequency_hz")),
                    Energy.ofJoules(value(row, "energy_j")),
                    Energy.ofElectronVolts(value(row, "energy_ev")));
            for (SpectralQuantity input : inputs) {
                check(row, "wavelength_vacuum_m", input.toWavelength(Medium.vacuum()).inMetres(), input);
                check(row, "wavenumber_per_m", input.toWavenumber().inPerMetre(), input);
                check(row, "frequency_hz", input.toFrequency().inHertz(), input);
                check(row, "energy_j", input.toEnergy().inJoules(), input);
                check(row, "energy_ev", input.toEnergy().inElectronVolts(), input);
                check(row, "temperature_k", input.toEnergy().toTemperature().inKelvin(), input);
            }
            Temperature temperature = Temperature.ofKelvin(value(row, "temperature_k"));
            check(row, "energy_j", temperature.toThermalEnergy().inJoules(), temperature);
        }
    }

    @Test
    void unitScalesMatchTheGoldenColumns() {
        for (Map<String, String> row : ROWS) {
            Wavelength wavelength = Wavelength.ofMetres(value(row, "wavelength_vacuum_m"), Medium.vacuum());
            check(row, "wavenumber_per_m", wavelength.toWavenumber().valueIn(Unit.PER_CENTIMETRE) * 100, wavelength);
            check(row, "frequency_hz", wavelength.toFrequency().valueIn(Unit.TERAHERTZ) * 1e12, wavelength);
            check(row, "energy_ev", wavelength.toEnergy().valueIn(Unit.MILLIELECTRONVOLT) / 1e3, wavelength);
            check(row, "wavelength_vacuum_m", wavelength.valueIn(Unit.NANOMETRE) / 1e9, wavelength);
        }
    }

    private static double value(Map<String, String> row, String column) {
        return Double.parseDouble(row.get(column));
    }

    private static void check(Map<String, String> row, String column, double actual, Object input) {
        double expected = value(row, column);
        double error = Golden.relativeError(expected, actual);
        assertTrue(error <= TOLERANCE, () -> column + " from " + input + ": expected " + expected + ", got "
                + actual + " (relative error " + error + ")");
    }
}
