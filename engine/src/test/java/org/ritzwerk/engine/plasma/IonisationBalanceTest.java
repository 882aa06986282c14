package org.ritzwerk.engine.plasma;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Map;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.testing.Golden;

/** The Saha balance against golden values from mpmath (make_saha_golden.py). */
class IonisationBalanceTest {

    private static final Nucleus PROTON = new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1,
            OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018");

    @Test
    void fractionsMatchTheGoldenBalances() {
        // saha.csv: mpmath 1.2.1 at 50 digits, scipy 1.10.1 constants; tolerance from its header.
        double tolerance = Golden.tolerance("saha.csv");
        for (Map<String, String> row : Golden.rows("saha.csv")) {
            double[] chi = split(row.get("ionisation_energies_j"));
            double[] u = split(row.get("partition_functions"));
            double[] expected = split(row.get("fractions"));
            double[] got = IonisationBalance.fractions(Double.parseDouble(row.get("temperature_k")),
                    Double.parseDouble(row.get("electron_density_m3")), chi, u);
            for (int k = 0; k < expected.length; k++) {
                assertEquals(expected[k], got[k], tolerance * expected[k], row + " stage " + k);
            }
        }
    }

    @Test
    void hydrogenPartitionFunctionMatchesTheGoldenSums() {
        // hydrogen-partition.csv: Bohr levels of 1H with the reduced mass, mpmath at 50 digits;
        // tolerance from its header.
        double tolerance = Golden.tolerance("hydrogen-partition.csv");
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(PROTON, Tier.BOHR);
        for (Map<String, String> row : Golden.rows("hydrogen-partition.csv")) {
            double expected = Double.parseDouble(row.get("partition_function"));
            double got = IonisationBalance.hydrogenLikePartition(hydrogen,
                    Double.parseDouble(row.get("temperature_k")), Integer.parseInt(row.get("n_max")));
            assertEquals(expected, got, tolerance * expected, row.toString());
        }
    }

    @Test
    void hydrogenAndHeliumUseTheirIonsLevels() {
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(PROTON, Tier.BOHR);
        double[] h = IonisationBalance.hydrogen(hydrogen, 12_000, 1e21, 20);
        double[] direct = IonisationBalance.fractions(12_000, 1e21, new double[] {-hydrogen.energy(1, 0, 1)},
                new double[] {IonisationBalance.hydrogenLikePartition(hydrogen, 12_000, 20), 1});
        assertEquals(Arrays.toString(direct), Arrays.toString(h));
        // He I ionisation energy 5 945 204 212(6) MHz = 24.5874 eV (Kandula et al., Phys. Rev. A
        // 84, 062512 (2011), abstract; converted with the CODATA 2018 h, c and e).
        assertEquals(24.5874, IonisationBalance.HELIUM_I_IONISATION_ENERGY / PhysicalConstants.E, 1e-4);
        // Alpha-particle mass 6.6446573357e-27 kg (CODATA 2018, Tiesinga et al., Rev. Mod. Phys.
        // 93, 025010 (2021); the same digits as Debian scipy 1.10.1's
        // scipy.constants.physical_constants["alpha particle mass"]).
        Nucleus alpha = new Nucleus(2, 4, 6.6446573357e-27, 0, OptionalDouble.empty(), OptionalDouble.empty(), "test");
        double[] he = IonisationBalance.helium(HydrogenLikeModel.of(alpha, Tier.BOHR), 30_000, 1e22, 20);
        assertEquals(3, he.length);
        assertEquals(1, he[0] + he[1] + he[2], 1e-15);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> IonisationBalance.helium(hydrogen, 30_000, 1e22, 20));
        assertTrue(e.getMessage().contains("Z = 2"), e.getMessage());
        // He I's partition function given: Saha's n(He II) / n(He I) is proportional to 1 / U(He I)
        // (common practice), so U = 2.2168 (the built-in list's sum at 50,000 K) divides it by that
        HydrogenLikeModel heII = HydrogenLikeModel.of(alpha, Tier.BOHR);
        double[] one = IonisationBalance.helium(heII, 50_000, 1e22, 20, 1);
        double[] listed = IonisationBalance.helium(heII, 50_000, 1e22, 20, 2.2168);
        assertEquals(Arrays.toString(IonisationBalance.helium(heII, 50_000, 1e22, 20)), Arrays.toString(one));
        assertEquals(one[1] / one[0] / 2.2168, listed[1] / listed[0], 1e-12 * one[1] / one[0]);
        assertEquals(one[2] / one[1], listed[2] / listed[1], 1e-12 * one[2] / one[1], "He III / He II unchanged");
        IllegalArgumentException low = assertThrows(IllegalArgumentException.class,
                () -> IonisationBalance.helium(heII, 50_000, 1e22, 20, 0.5));
        assertTrue(low.getMessage().contains("at least 1") && low.getMessage().contains("0.5"), low.getMessage());
    }

    @Test
    void ionisationGrowsWithTemperatureAndFallsWithDensity() {
        // Common practice: hotter means more ionised, denser (more recombination) means less.
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(PROTON, Tier.BOHR);
        double previous = 0;
        for (double t = 4000; t < 40_000; t *= 1.2) {
            double ionised = IonisationBalance.hydrogen(hydrogen, t, 1e21, 10)[1];
            assertTrue(ionised > previous, "T = " + t);
            previous = ionised;
        }
        assertTrue(IonisationBalance.hydrogen(hydrogen, 10_000, 1e23, 10)[1]
                < IonisationBalance.hydrogen(hydrogen, 10_000, 1e20, 10)[1]);
    }

    @Test
    void badArgumentsAreNamed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> IonisationBalance.fractions(-5, 1e20, new double[] {1e-18}, new double[] {2, 1}));
        assertTrue(e.getMessage().startsWith("temperature"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> IonisationBalance.fractions(5000, 1e20, new double[] {1e-18}, new double[] {2, 0}));
        assertTrue(e.getMessage().contains("partition function of stage 1"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> IonisationBalance.fractions(5000, 1e20, new double[] {1e-18, 2e-18}, new double[] {2, 1}));
        assertTrue(e.getMessage().contains("one ionisation energy fewer"), e.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> IonisationBalance.fractions(5000, Double.NaN, new double[] {1e-18}, new double[] {2, 1}));
    }

    private static double[] split(String text) {
        return Arrays.stream(text.split(";")).mapToDouble(Double::parseDouble).toArray();
    }
}
