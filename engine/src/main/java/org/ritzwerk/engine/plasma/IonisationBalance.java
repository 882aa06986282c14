package org.ritzwerk.engine.plasma;

import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;

/**
 * The Saha ionisation balance of an element in local thermodynamic equilibrium at a given
 * temperature and electron density:
 * <pre>
 *   n(k+1) n_e / n(k) = 2 U(k+1) / U(k) (2 pi m_e k T / h^2)^(3/2) exp(-chi(k) / (k T))
 * </pre>
 * for stages k = 0 (neutral), 1, ... (common practice). The electron density is given, not
 * solved for, so each element's balance stands on its own. Ionisation-potential lowering by the
 * plasma is not applied; the partition functions' cutoff stands in for it.
 *
 * <p>For hydrogen and helium, {@link #hydrogen} and {@link #helium} take the one-electron
 * stages' ionisation energies and partition functions from a {@link HydrogenLikeModel}, the
 * partition function summed over n = 1 .. nMax ({@link #hydrogenLikePartition}). Neutral
 * helium's partition function U_I is the caller's ({@link #helium(HydrogenLikeModel, double,
 * double, int, double)}: a synthetic scene with He I levels passes the Boltzmann sum over the same
 * levels it populates, so that the Saha and Boltzmann steps agree), or 1, the 1s^2 ground state
 * alone ({@link #helium(HydrogenLikeModel, double, double, int)}). The built-in He I level list
 * (n &lt;= 10) sums to 1.0004 at 20 000 K, 1.005 at 25 000 K, 1.032 at 30 000 K, 1.31 at 40 000 K
 * and 2.22 at 50 000 K, so U_I = 1 is good to 0.5 % up to 25 000 K only; above that the sum
 * itself depends on where the levels are cut off (each n adds about 4 n^2 states just below the
 * limit), which stands in for the lowering of the ionisation potential that is not applied.
 *
 * <p>Stateless and thread-safe.
 */
public final class IonisationBalance {

    /**
     * Ionisation energy of neutral helium-4, 198 310.666 37 cm^-1, in J: D. Z. Kandula,
     * C. Gohle, T. J. Pinkert, W. Ubachs and K. S. E. Eikema, Phys. Rev. A 84, 062512 (2011),
     * whose abstract gives 5 945 204 212(6) MHz (divided by c = 29 979 245 800 cm/s:
     * 198 310.666 374 cm^-1), which is, as we recall, the value the NIST Atomic Spectra Database
     * lists for He I. Checked against the earlier measurement of K. S. E. Eikema, W. Ubachs,
     * W. Vassen and W. Hogervorst, Phys. Rev. A 55 (March 1997), 198 310.6672(15) cm^-1.
     */
    public static final double HELIUM_I_IONISATION_ENERGY = 198_310.66637e2 * PhysicalConstants.H * PhysicalConstants.C;

    private static final double ELECTRON_MASS = PhysicalConstants.ELECTRON_MASS.value();

    /**
     * The largest ionisation energy taken, 1e-13 J (about 624 keV): above every atom's and ion's,
     * the largest being the 1s binding of one-electron uranium, about 132 keV or 2.1e-14 J (from
     * memory). A larger number is a unit slip: an energy in eV (13.6 for hydrogen) or cm^-1
     * given as J.
     */
    public static final double MAX_IONISATION_ENERGY_J = 1e-13;

    private IonisationBalance() {
    }

    /**
     * The Saha prefactor 2 (2 pi m_e k T / h^2)^(3/2), the number density of free-electron states
     * (spin included) at temperature T (Saha's equation, e.g. Griem, Principles of Plasma
     * Spectroscopy (1997), common practice).
     *
     * @param temperature temperature in K, positive
     * @return the prefactor in m^-3
     * @throws IllegalArgumentException for a temperature that is not finite and positive
     */
    public static double sahaPrefactor(double temperature) {
        positive("temperature", temperature, "K");
        double kT = PhysicalConstants.K * temperature;
        return 2 * Math.pow(2 * Math.PI * ELECTRON_MASS * kT / (PhysicalConstants.H * PhysicalConstants.H), 1.5);
    }

    /**
     * Saha's ratio of the number densities of two successive stages,
     * n_(k+1) / n_k = (prefactor / n_e) (U_(k+1) / U_k) exp(-chi_k / kT).
     *
     * @param temperature      temperature in K, positive
     * @param electronDensity  electron density in m^-3, positive
     * @param ionisationEnergy ionisation energy chi_k of the lower stage in J, positive and at most
     *                         {@value #MAX_IONISATION_ENERGY_J} (above every ion's: a larger value is
     *                         an energy in eV or cm^-1 given as J)
     * @param lowerPartition   partition function U_k of the lower stage, positive
     * @param upperPartition   partition function U_(k+1) of the upper stage, positive
     * @return n_(k+1) / n_k; may overflow to infinity or underflow to 0 at extreme conditions
     *         (use {@link #fractions} for the stages' shares, which stays finite)
     * @throws IllegalArgumentException naming the argument out of range
     */
    public static double sahaRatio(double temperature, double electronDensity, double ionisationEnergy,
            double lowerPartition, double upperPartition) {
        positive("electron density", electronDensity, "m^-3");
        ionisationEnergy("ionisation energy", ionisationEnergy);
        positive("partition function of the lower stage", lowerPartition, "");
        positive("partition function of the upper stage", upperPartition, "");
        return sahaPrefactor(temperature) / electronDensity * upperPartition / lowerPartition
                * Math.exp(-ionisationEnergy / (PhysicalConstants.K * temperature));
    }

    /**
     * @param temperature       temperature in K, positive
     * @param electronDensity   electron density in m^-3, positive
     * @param ionisationEnergies ionisation energy of stage k to k+1 in J, one per stage but the
     *                           last, positive and at most {@value #MAX_IONISATION_ENERGY_J}
     * @param partitionFunctions partition function of each stage, positive
     * @return the fraction of the element's atoms in each stage, summing to 1
     * @throws IllegalArgumentException naming the argument out of range
     */
    public static double[] fractions(double temperature, double electronDensity, double[] ionisationEnergies,
            double[] partitionFunctions) {
        positive("temperature", temperature, "K");
        positive("electron density", electronDensity, "m^-3");
        int stages = partitionFunctions.length;
        if (stages < 2 || ionisationEnergies.length != stages - 1) {
            throw new IllegalArgumentException("give at least two stages and one ionisation energy fewer than stages: "
                    + stages + " partition functions, " + ionisationEnergies.length + " ionisation energies");
        }
        for (int k = 0; k < stages; k++) {
            positive("partition function of stage " + k, partitionFunctions[k], "");
        }
        for (int k = 0; k < stages - 1; k++) {
            ionisationEnergy("ionisation energy of stage " + k, ionisationEnergies[k]);
        }
        double kT = PhysicalConstants.K * temperature;
        // ln of (2 pi m_e k T / h^2)^(3/2) / n_e, the free-electron states per electron.
        double lnThermal = 1.5 * Math.log(2 * Math.PI * ELECTRON_MASS * kT
                / (PhysicalConstants.H * PhysicalConstants.H)) - Math.log(electronDensity);
        double[] lnN = new double[stages];
        for (int k = 1; k < stages; k++) {
            lnN[k] = lnN[k - 1] + Math.log(2 * partitionFunctions[k] / partitionFunctions[k - 1]) + lnThermal
                    - ionisationEnergies[k - 1] / kT;
        }
        double max = Double.NEGATIVE_INFINITY;
        for (double v : lnN) {
            max = Math.max(max, v);
        }
        double sum = 0;
        double[] fraction = new double[stages];
        for (int k = 0; k < stages; k++) {
            fraction[k] = Math.exp(lnN[k] - max);
            sum += fraction[k];
        }
        for (int k = 0; k < stages; k++) {
            fraction[k] /= sum;
        }
        return fraction;
    }

    /**
     * The partition function of a one-electron ion, sum over n = 1 .. nMax of
     * 2 n^2 exp(-(E_n - E_1) / (k T)), E_n the model's n s1/2 energy (fine structure left out
     * of the weights' energies; common practice).
     *
     * @param model       the ion
     * @param temperature temperature in K, positive
     * @param nMax        the cutoff, at least 1
     * @return the partition function, at least 2
     */
    public static double hydrogenLikePartition(HydrogenLikeModel model, double temperature, int nMax) {
        positive("temperature", temperature, "K");
        if (nMax < 1) {
            throw new IllegalArgumentException("the partition function's cutoff n must be at least 1, got " + nMax);
        }
        double kT = PhysicalConstants.K * temperature;
        double ground = model.energy(1, 0, 1);
        double sum = 0;
        for (int n = 1; n <= nMax; n++) {
            sum += 2.0 * n * n * Math.exp(-(model.energy(n, 0, 1) - ground) / kT);
        }
        return sum;
    }

    /**
     * @param model           the hydrogen (or deuterium) atom
     * @param temperature     temperature in K
     * @param electronDensity electron density in m^-3
     * @param nMax            cutoff of the neutral's partition function
     * @return fractions of H I and H II
     */
    public static double[] hydrogen(HydrogenLikeModel model, double temperature, double electronDensity, int nMax) {
        requireZ(java.util.Objects.requireNonNull(model, "model"), 1);
        return fractions(temperature, electronDensity, new double[] {-model.energy(1, 0, 1)},
                new double[] {hydrogenLikePartition(model, temperature, nMax), 1});
    }

    /**
     * @param heliumIon       the He II ion (any helium isotope)
     * @param temperature     temperature in K
     * @param electronDensity electron density in m^-3
     * @param nMax            cutoff of the He II partition function
     * @return fractions of He I, He II and He III
     */
    public static double[] helium(HydrogenLikeModel heliumIon, double temperature, double electronDensity, int nMax) {
        return helium(heliumIon, temperature, electronDensity, nMax, 1);
    }

    /**
     * The helium balance with neutral helium's partition function given, e.g. the Boltzmann sum
     * over a He I level list at the same temperature (the one the line intensities use).
     *
     * @param heliumIon        the He II ion (any helium isotope)
     * @param temperature      temperature in K
     * @param electronDensity  electron density in m^-3
     * @param nMax             cutoff of the He II partition function
     * @param neutralPartition He I's partition function U_I, at least 1 (its ground level's weight)
     * @return fractions of He I, He II and He III
     * @throws IllegalArgumentException for a partition function below 1 or not finite
     */
    public static double[] helium(HydrogenLikeModel heliumIon, double temperature, double electronDensity, int nMax,
            double neutralPartition) {
        requireZ(heliumIon, 2);
        if (!(neutralPartition >= 1) || Double.isInfinite(neutralPartition)) {
            throw new IllegalArgumentException("He I's partition function must be finite and at least 1 (its ground"
                    + " level's weight), got " + neutralPartition);
        }
        return fractions(temperature, electronDensity,
                new double[] {HELIUM_I_IONISATION_ENERGY, -heliumIon.energy(1, 0, 1)},
                new double[] {neutralPartition, hydrogenLikePartition(heliumIon, temperature, nMax), 1});
    }

    private static void requireZ(HydrogenLikeModel model, int z) {
        if (model.nucleus().z() != z) {
            throw new IllegalArgumentException("this balance needs a nucleus with Z = " + z + ", got Z = "
                    + model.nucleus().z());
        }
    }

    private static void ionisationEnergy(String what, double joules) {
        positive(what, joules, "J");
        if (joules > MAX_IONISATION_ENERGY_J) {
            double electronVolt = PhysicalConstants.E;
            throw new IllegalArgumentException(what + " must be at most " + MAX_IONISATION_ENERGY_J + " J (above every"
                    + " ion's), got " + joules + " J; an energy in eV? multiply it by " + electronVolt + " J/eV ("
                    + joules + " eV = " + String.format(java.util.Locale.ROOT, "%.4g", joules * electronVolt) + " J)");
        }
    }

    private static void positive(String what, double value, String unit) {
        if (!(Double.isFinite(value) && value > 0)) {
            throw new IllegalArgumentException(what + " must be finite and positive, got " + value
                    + (unit.isEmpty() ? "" : " " + unit));
        }
    }
}
