package org.ritzwerk.constants;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.ritzwerk.testing.Golden;

/**
 * The constants against scipy.constants 1.10.1 (CODATA 2018), golden file
 * {@code codata2018-constants.csv} made by {@code make_golden.py}; tolerances as its header declares
 * them (0, i.e. exact, for the constants; 5e-14 relative for values derived from the printed R_inf).
 */
class PhysicalConstantsTest {

    private static final String FILE = "codata2018-constants.csv";
    private static final double EXACT = Golden.tolerance(FILE);
    private static final double DERIVED = Golden.tolerance(FILE, "derived");

    private static final Map<String, Map<String, String>> SCIPY = Golden.rows(FILE).stream()
            .collect(Collectors.toMap(row -> row.get("key"), Function.identity()));

    @Test
    void everyConstantEqualsScipyCodata2018DigitForDigit() {
        for (Constant constant : PhysicalConstants.all()) {
            Map<String, String> row = SCIPY.get(constant.name());
            assertTrue(row != null, "scipy golden file lacks " + constant.name());
            double value = Double.parseDouble(row.get("value"));
            double uncertainty = Double.parseDouble(row.get("standard_uncertainty"));
            assertEquals(value, constant.value(), EXACT * Math.abs(value), constant.name());
            assertEquals(uncertainty, constant.standardUncertainty(), EXACT * uncertainty,
                    constant.name() + " uncertainty");
        }
    }

    @Test
    void plainDoublesAreTheExactSiConstants() {
        assertEquals(PhysicalConstants.PLANCK.value(), PhysicalConstants.H, 0.0);
        assertEquals(PhysicalConstants.SPEED_OF_LIGHT.value(), PhysicalConstants.C, 0.0);
        assertEquals(PhysicalConstants.ELEMENTARY_CHARGE.value(), PhysicalConstants.E, 0.0);
        assertEquals(PhysicalConstants.BOLTZMANN.value(), PhysicalConstants.K, 0.0);
        assertTrue(PhysicalConstants.PLANCK.isExact() && PhysicalConstants.BOLTZMANN.isExact());
    }

    @Test
    void rydbergEnergyAndFrequencyFollowFromTheConstants() {
        // CODATA 2018 derived values as carried by scipy. CODATA derives them from the unrounded
        // R_inf; the printed R_inf (14 digits) is rounded by up to 4.6e-14 relative, hence the
        // header's 5e-14.
        double rydbergEv = PhysicalConstants.RYDBERG.value() * PhysicalConstants.H * PhysicalConstants.C
                / PhysicalConstants.E;
        assertEquals(Double.parseDouble(SCIPY.get("Rydberg constant times hc in eV").get("value")), rydbergEv,
                DERIVED * rydbergEv);
        double rydbergHz = PhysicalConstants.RYDBERG.value() * PhysicalConstants.C;
        assertEquals(Double.parseDouble(SCIPY.get("Rydberg constant times c in Hz").get("value")), rydbergHz,
                DERIVED * rydbergHz);
    }

    @Test
    void editionIsNamedOnce() {
        assertEquals("CODATA 2018", PhysicalConstants.EDITION);
        assertTrue(PhysicalConstants.CITATION.contains("Rev. Mod. Phys. 93, 025010"));
    }
}
