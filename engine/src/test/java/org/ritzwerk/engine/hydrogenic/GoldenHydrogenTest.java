package org.ritzwerk.engine.hydrogenic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.testing.Golden;

/**
 * Energies, rates and lifetimes against golden files made by {@code make_hydrogen_golden.py} with
 * sympy 1.11.1 and mpmath 1.2.1 (Debian 12): Dirac energies from sympy.physics.hydrogen.E_nl_dirac
 * (point nucleus of infinite mass; 1e-13), nonrelativistic rates from exact radial integrals
 * (infinite mass; 1e-12), lifetimes (1e-12); each tolerance is read from its file's header. An
 * infinitely heavy nucleus is modelled as 1 kg.
 */
class GoldenHydrogenTest {

    private static final double HARTREE = 2 * PhysicalConstants.RYDBERG.value() * PhysicalConstants.H
            * PhysicalConstants.C;

    @Test
    void diracAndBohrTiersMatchSympy() {
        double tolerance = Golden.tolerance("dirac-energies.csv");
        for (Map<String, String> row : Golden.rows("dirac-energies.csv")) {
            int z = Integer.parseInt(row.get("Z"));
            int n = Integer.parseInt(row.get("n"));
            int l = Integer.parseInt(row.get("l"));
            int twoJ = Integer.parseInt(row.get("two_j"));
            double dirac = HydrogenLikeModel.of(Nuclei.infinitelyHeavy(z), Tier.DIRAC).energy(n, l, twoJ) / HARTREE;
            double bohr = HydrogenLikeModel.of(Nuclei.infinitelyHeavy(z), Tier.BOHR).energy(n, l, twoJ) / HARTREE;
            double expectedDirac = Double.parseDouble(row.get("energy_hartree"));
            assertTrue(Golden.relativeError(expectedDirac, dirac) <= tolerance, () -> row + ": Dirac " + dirac);
            assertTrue(Golden.relativeError(Double.parseDouble(row.get("bohr_hartree")), bohr) <= tolerance,
                    () -> row + ": Bohr " + bohr);
        }
    }

    @Test
    void ratesMatchExactIntegrals() {
        HydrogenLikeLines lines = HydrogenLikeLines.of(HydrogenLikeModel.of(Nuclei.infinitelyHeavy(1), Tier.BOHR));
        int rows = 0;
        double tolerance = Golden.tolerance("hydrogen-rates.csv");
        for (Map<String, String> row : Golden.rows("hydrogen-rates.csv")) {
            int nU = Integer.parseInt(row.get("n_upper"));
            int lU = Integer.parseInt(row.get("l_upper"));
            int nL = Integer.parseInt(row.get("n_lower"));
            int lL = Integer.parseInt(row.get("l_lower"));
            // Sum the fine-structure components of n l -> n' l' (degenerate in the Bohr tier).
            double gA = 0;
            double gF = 0;
            for (int twoJ = Math.max(2 * lU - 1, 1); twoJ <= 2 * lU + 1; twoJ += 2) {
                LineTable decays = lines.decays(nU, lU, twoJ);
                for (int i = 0; i < decays.size(); i++) {
                    if (decays.lowerN(i) == nL && decays.lowerL(i) == lL) {
                        gA += decays.upperWeight(i) * decays.einsteinA(i);
                        gF += decays.lowerWeight(i) * decays.oscillatorStrength(i);
                    }
                }
            }
            double a = gA / (2 * (2 * lU + 1));
            double f = gF / (2 * (2 * lL + 1));
            assertTrue(Golden.relativeError(Double.parseDouble(row.get("einstein_a_per_s")), a) <= tolerance,
                    () -> row + ": A " + a);
            assertTrue(Golden.relativeError(Double.parseDouble(row.get("f_absorption")), f) <= tolerance,
                    () -> row + ": f " + f);
            rows++;
        }
        assertEquals(55, rows);
    }

    @Test
    void lifetimesMatchExactIntegrals() {
        HydrogenLikeLines lines = HydrogenLikeLines.of(HydrogenLikeModel.of(Nuclei.infinitelyHeavy(1), Tier.BOHR));
        double tolerance = Golden.tolerance("hydrogen-lifetimes.csv");
        for (Map<String, String> row : Golden.rows("hydrogen-lifetimes.csv")) {
            int n = Integer.parseInt(row.get("n"));
            int l = Integer.parseInt(row.get("l"));
            double lifetime = lines.lifetime(n, l, 2 * l + 1);
            assertTrue(Golden.relativeError(Double.parseDouble(row.get("lifetime_s")), lifetime) <= tolerance,
                    () -> row + ": " + lifetime);
        }
    }
}
