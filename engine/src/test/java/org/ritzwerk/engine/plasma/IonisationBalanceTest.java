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
    /**
     * Alpha particle, 6.6446573357e-27 kg (CODATA 2018, Tiesinga et al., Rev. Mod. Phys. 93,
     * 025010 (2021); the golden script types in the same digits).
     */
    private static final Nucleus ALPHA = new Nucleus(2, 4, 6.6446573357e-27, 0, OptionalDouble.empty(),
            OptionalDouble.empty(), "CODATA 2018");

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
    void thePlasmaEndsTheBoundLevelsAsTheGoldenDebyeLowering() {
        // plasma-partition.csv: make_plasma_partition_golden.py, mpmath 1.3.0 at 50 digits, CODATA
        // 2018 constants typed in; Debye length, lowering z e^2 / (4 pi eps0 lambda_D), the last bound n,
        // U over the bound levels and the Saha fractions with the lowered ionisation energy,
        // computed there from the formulas, not from this code. Tolerance from its header.
        double tolerance = Golden.tolerance("plasma-partition.csv");
        Map<String, HydrogenLikeModel> models = Map.of("H", HydrogenLikeModel.of(PROTON, Tier.BOHR),
                "He", HydrogenLikeModel.of(ALPHA, Tier.BOHR));
        int rows = 0;
        for (Map<String, String> row : Golden.rows("plasma-partition.csv")) {
            HydrogenLikeModel model = models.get(row.get("element"));
            double t = Double.parseDouble(row.get("temperature_k"));
            double ne = Double.parseDouble(row.get("electron_density_m3"));
            close(Double.parseDouble(row.get("debye_length_m")), IonisationBalance.debyeLength(t, ne), tolerance, row);
            close(Double.parseDouble(row.get("lowering_j")),
                    IonisationBalance.ionisationLowering(t, ne, model.nucleus().z()), tolerance, row);
            assertEquals(Integer.parseInt(row.get("highest_bound_n")), IonisationBalance.highestBoundN(model, t, ne),
                    row.toString());
            close(Double.parseDouble(row.get("bound_partition")), IonisationBalance.boundPartition(model, t, ne),
                    tolerance, row);
            double[] expected = split(row.get("fractions"));
            double[] got = row.get("element").equals("H") ? IonisationBalance.hydrogen(model, t, ne)
                    : IonisationBalance.helium(model, t, ne);
            for (int k = 0; k < expected.length; k++) {
                close(expected[k], got[k], tolerance, row);
            }
            rows++;
        }
        assertEquals(10, rows);
    }

    @Test
    void thePlanckLarkinPartitionFunctionMatchesTheWholeGoldenSum() {
        // planck-larkin.csv: the infinite sum by mpmath.nsum (make_plasma_partition_golden.py,
        // mpmath 1.3.0, 50 digits); tolerance from its header.
        double tolerance = Golden.tolerance("planck-larkin.csv");
        Map<String, HydrogenLikeModel> models = Map.of("H", HydrogenLikeModel.of(PROTON, Tier.BOHR),
                "He", HydrogenLikeModel.of(ALPHA, Tier.BOHR));
        for (Map<String, String> row : Golden.rows("planck-larkin.csv")) {
            close(Double.parseDouble(row.get("planck_larkin_partition")), IonisationBalance.planckLarkinPartition(
                    models.get(row.get("element")), Double.parseDouble(row.get("temperature_k"))), tolerance, row);
        }
    }

    /**
     * The review's case: H at 20,000 K and 1e22 m^-3 gave an H I fraction of 0.0046, 0.018, 0.33,
     * 0.93 and 0.9997 for a drawing cutoff nMax of 10, 30, 100, 300 and 2000 (U summed to nMax).
     * The balance now has no nMax: the plasma ends the levels (n = 30 there, the golden file) and
     * more drawn lines cannot change it.
     */
    @Test
    void theBalanceNoLongerDependsOnHowManyLinesAreDrawn() {
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(PROTON, Tier.BOHR);
        double[] stages = IonisationBalance.hydrogen(hydrogen, 20_000, 1e22);
        assertEquals(0.0177, stages[0], 0.0001, "golden 0.017660 (plasma-partition.csv)");
        double bound = IonisationBalance.boundPartition(hydrogen, 20_000, 1e22);
        double atThirty = IonisationBalance.hydrogenLikePartition(hydrogen, 20_000, 30);
        assertEquals(atThirty, bound, 1e-12 * bound, "n = 30 is the last bound level there");
        assertTrue(IonisationBalance.hydrogenLikePartition(hydrogen, 20_000, 300) > 700 * bound,
                "the plain sum runs away with the cutoff, which is what the plasma's end replaces");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> IonisationBalance.highestBoundN(hydrogen, 20, 1e25));
        assertTrue(e.getMessage().contains("Debye") && e.getMessage().contains("no level is bound"), e.getMessage());
    }

    @Test
    void hydrogenAndHeliumUseTheirIonsLevels() {
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(PROTON, Tier.BOHR);
        double[] h = IonisationBalance.hydrogen(hydrogen, 12_000, 1e21);
        double lowered = -hydrogen.energy(1, 0, 1) - IonisationBalance.ionisationLowering(12_000, 1e21, 1);
        double[] direct = IonisationBalance.fractions(12_000, 1e21, new double[] {lowered},
                new double[] {IonisationBalance.boundPartition(hydrogen, 12_000, 1e21), 1});
        assertEquals(Arrays.toString(direct), Arrays.toString(h));
        // He I ionisation energy 5 945 204 212(6) MHz = 24.5874 eV (Kandula et al., Phys. Rev. A
        // 84, 062512 (2011), abstract; converted with the CODATA 2018 h, c and e).
        assertEquals(24.5874, IonisationBalance.HELIUM_I_IONISATION_ENERGY / PhysicalConstants.E, 1e-4);
        // Alpha-particle mass 6.6446573357e-27 kg (CODATA 2018, Tiesinga et al., Rev. Mod. Phys.
        // 93, 025010 (2021); the same digits as Debian scipy 1.10.1's
        // scipy.constants.physical_constants["alpha particle mass"]).
        Nucleus alpha = new Nucleus(2, 4, 6.6446573357e-27, 0, OptionalDouble.empty(), OptionalDouble.empty(), "test");
        double[] he = IonisationBalance.helium(HydrogenLikeModel.of(alpha, Tier.BOHR), 30_000, 1e22);
        assertEquals(3, he.length);
        assertEquals(1, he[0] + he[1] + he[2], 1e-15);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> IonisationBalance.helium(hydrogen, 30_000, 1e22));
        assertTrue(e.getMessage().contains("Z = 2"), e.getMessage());
        // He I's partition function given: Saha's n(He II) / n(He I) is proportional to 1 / U(He I)
        // (common practice), so U = 2.2168 (the built-in list's sum at 50,000 K) divides it by that
        HydrogenLikeModel heII = HydrogenLikeModel.of(alpha, Tier.BOHR);
        double[] one = IonisationBalance.helium(heII, 50_000, 1e22, 1);
        double[] listed = IonisationBalance.helium(heII, 50_000, 1e22, 2.2168);
        assertEquals(Arrays.toString(IonisationBalance.helium(heII, 50_000, 1e22)), Arrays.toString(one));
        assertEquals(one[1] / one[0] / 2.2168, listed[1] / listed[0], 1e-12 * one[1] / one[0]);
        assertEquals(one[2] / one[1], listed[2] / listed[1], 1e-12 * one[2] / one[1], "He III / He II unchanged");
        IllegalArgumentException low = assertThrows(IllegalArgumentException.class,
                () -> IonisationBalance.helium(heII, 50_000, 1e22, 0.5));
        assertTrue(low.getMessage().contains("at least 1") && low.getMessage().contains("0.5"), low.getMessage());
    }

    @Test
    void ionisationGrowsWithTemperatureAndFallsWithDensity() {
        // Common practice: hotter means more ionised, denser (more recombination) means less.
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(PROTON, Tier.BOHR);
        double previous = 0;
        for (double t = 4000; t < 40_000; t *= 1.2) {
            double ionised = IonisationBalance.hydrogen(hydrogen, t, 1e21)[1];
            assertTrue(ionised > previous, "T = " + t);
            previous = ionised;
        }
        assertTrue(IonisationBalance.hydrogen(hydrogen, 10_000, 1e23)[1]
                < IonisationBalance.hydrogen(hydrogen, 10_000, 1e20)[1]);
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

    private static void close(double expected, double got, double relative, Map<String, String> row) {
        assertEquals(expected, got, relative * Math.abs(expected), row.toString());
    }

    private static double[] split(String text) {
        return Arrays.stream(text.split(";")).mapToDouble(Double::parseDouble).toArray();
    }
}
