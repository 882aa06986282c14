package org.ritzwerk.engine.plasma;

import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;

/**
 * The Saha ionisation balance of an element in local thermodynamic equilibrium at a given
 * temperature and electron density:
 * <pre>
 *   n(k+1) n_e / n(k) = 2 U(k+1) / U(k) (2 pi m_e k T / h^2)^(3/2) exp(-(chi(k) - dChi(k)) / (k T))
 * </pre>
 * for stages k = 0 (neutral), 1, ... (common practice). The electron density is given, not
 * solved for, so each element's balance stands on its own.
 *
 * <p><b>Where the bound levels end.</b> The sum U = sum g exp(-E / kT) over a one-electron ion's
 * levels grows without bound (about as n^3 once kT is a fair part of the ionisation energy), so a
 * partition function needs a physical end. With an electron density the plasma lowers the
 * ionisation limit by the Debye-Hueckel amount
 * <pre>
 *   dChi = z e^2 / (4 pi eps0 lambda_D),   lambda_D = sqrt(eps0 k T / (n_e e^2))
 * </pre>
 * (z the charge of the ion left after ionisation: 1 for H I and He I, 2 for He II; H. R. Griem,
 * Plasma Spectroscopy (McGraw-Hill 1964) and Principles of Plasma Spectroscopy (Cambridge 1997),
 * A. Unsoeld, Physik der Sternatmosphaeren (Springer 1955): common practice, quoted from memory).
 * The Debye length here counts the electrons only (the ions would shorten it by up to sqrt 2 in a
 * singly ionised plasma; left out, as the electron density is the one given). Levels bound by
 * less than dChi have merged into the continuum: {@link #boundPartition} sums over the levels
 * bound by more, and the balances ({@link #hydrogen}, {@link #helium}) use that U and the lowered
 * ionisation energy chi - dChi. Neither depends on how many lines a caller draws.
 *
 * <p>Without an electron density there is no such limit: {@link #planckLarkinPartition} gives the
 * Planck-Larkin partition function, which converges without a cutoff (M. Planck, Annalen der
 * Physik (1924); A. I. Larkin, Sov. Phys. JETP 11, 1363 (1960); W. Ebeling, W. D. Kraeft and
 * D. Kremp, Theory of Bound States and Ionization Equilibrium in Plasmas and Solids (1976); from
 * memory).
 *
 * <p>For hydrogen and helium, {@link #hydrogen} and {@link #helium} take the one-electron
 * stages' ionisation energies and levels from a {@link HydrogenLikeModel}. Neutral helium's
 * partition function U_I is the caller's ({@link #helium(HydrogenLikeModel, double, double,
 * double)}: a synthetic scene with He I levels passes the Boltzmann sum over the same levels it
 * populates, cut off where the ionisation limit is lowered to, so that the Saha and Boltzmann
 * steps agree), or 1, the 1s^2 ground state alone ({@link #helium(HydrogenLikeModel, double,
 * double)}). The built-in He I level list (n &lt;= 10) sums to 1.0004 at 20 000 K, 1.005 at
 * 25 000 K, 1.032 at 30 000 K, 1.31 at 40 000 K and 2.22 at 50 000 K, so U_I = 1 is good to
 * 0.5 % up to 25 000 K only.
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

    /** e^2 / (4 pi eps0) = alpha hbar c in J m (CODATA 2018 through {@link PhysicalConstants}). */
    private static final double COULOMB = PhysicalConstants.FINE_STRUCTURE.value() * PhysicalConstants.H
            / (2 * Math.PI) * PhysicalConstants.C;

    /** eps0 = e^2 / (2 alpha h c) in F/m. */
    private static final double EPSILON_0 = PhysicalConstants.E * PhysicalConstants.E
            / (2 * PhysicalConstants.FINE_STRUCTURE.value() * PhysicalConstants.H * PhysicalConstants.C);

    /**
     * Above this n the levels' binding energies are taken as the model's at this n times
     * (this n / n)^2 (the Bohr scaling; the model's fine-structure and QED terms, relative to the
     * binding energy, fall as 1 / n and are below 1e-6 here).
     */
    private static final int MODEL_N = 100;

    /**
     * The Planck-Larkin sum runs over n up to this, its rest by a series: beyond {@link #MODEL_N}
     * the binding energies scale as n^-2 exactly, so the series holds from there (its first
     * neglected term, x^5, is below 1e-12 of the sum at any temperature). Summing to 2000 took as
     * long as a whole small synthetic scene.
     */
    private static final int PLANCK_LARKIN_N = MODEL_N;

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
     * The partition function of a one-electron ion summed to a given n, sum over n = 1 .. nMax of
     * 2 n^2 exp(-(E_n - E_1) / (k T)), E_n the model's n s1/2 energy (fine structure left out
     * of the weights' energies; common practice). This is the plain truncated sum: it depends on
     * nMax wherever kT is a fair part of the ionisation energy. A plasma's partition function is
     * {@link #boundPartition} (with an electron density) or {@link #planckLarkinPartition} (without).
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
     * The Debye length of the electrons, lambda_D = sqrt(eps0 k T / (n_e e^2)) (common practice).
     *
     * @param temperature     electron temperature in K, positive
     * @param electronDensity electron density in m^-3, positive
     * @return the Debye length in m
     * @throws IllegalArgumentException naming the argument out of range
     */
    public static double debyeLength(double temperature, double electronDensity) {
        positive("temperature", temperature, "K");
        positive("electron density", electronDensity, "m^-3");
        return Math.sqrt(EPSILON_0 * PhysicalConstants.K * temperature
                / (electronDensity * PhysicalConstants.E * PhysicalConstants.E));
    }

    /**
     * The lowering of the ionisation energy by the plasma, dChi = z e^2 / (4 pi eps0 lambda_D)
     * (Debye-Hueckel; Griem 1964 and 1997, Unsoeld 1955, from memory; see the class comment).
     *
     * @param temperature     temperature in K, positive
     * @param electronDensity electron density in m^-3, positive
     * @param charge          charge z of the ion left after ionisation (1 for H I and He I, 2 for
     *                        He II), at least 1
     * @return the lowering in J
     * @throws IllegalArgumentException naming the argument out of range
     */
    public static double ionisationLowering(double temperature, double electronDensity, int charge) {
        if (charge < 1) {
            throw new IllegalArgumentException("the charge of the ion left after ionisation must be at least 1, got "
                    + charge);
        }
        return charge * COULOMB / debyeLength(temperature, electronDensity);
    }

    /**
     * The highest n of a one-electron ion still bound in the plasma: the last n whose binding
     * energy exceeds {@link #ionisationLowering} (z = the ion's Z).
     *
     * @param model           the ion
     * @param temperature     temperature in K, positive
     * @param electronDensity electron density in m^-3, positive
     * @return the highest bound n, at least 1 and at most {@link HydrogenLikeLines#MAX_N}
     * @throws IllegalArgumentException when the lowering reaches the ground level's binding energy
     *         (no bound level: the Debye-Hueckel picture fails long before)
     */
    public static int highestBoundN(HydrogenLikeModel model, double temperature, double electronDensity) {
        double lowering = ionisationLowering(temperature, electronDensity, model.nucleus().z());
        double ground = binding(model, 1);
        if (lowering >= ground) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT, "at %.6g K and %.6g m^-3 the"
                    + " Debye lowering of the ionisation limit (%.4g eV) reaches the ground level's binding energy"
                    + " (%.4g eV): no level is bound and the Debye-Hueckel picture does not hold", temperature,
                    electronDensity, lowering / PhysicalConstants.E, ground / PhysicalConstants.E));
        }
        // Bohr scaling gives the start; the model's energies settle it. The models' levels end at
        // HydrogenLikeLines.MAX_N: a lowering too small to end them sooner (a very thin plasma) ends
        // the bound levels there.
        int top = HydrogenLikeLines.MAX_N;
        int n = (int) Math.max(1, Math.min(top, Math.floor(Math.sqrt(ground / lowering))));
        Bindings bindings = new Bindings(model);
        while (n > 1 && bindings.at(n) <= lowering) {
            n--;
        }
        while (n < top && bindings.at(n + 1) > lowering) {
            n++;
        }
        return n;
    }

    /**
     * The partition function of a one-electron ion in a plasma: sum of 2 n^2 exp(-(E_n - E_1) /
     * (k T)) over the levels bound by more than the Debye lowering of the ionisation limit, n = 1
     * .. {@link #highestBoundN} (see the class comment). It does not depend on any drawing cutoff.
     *
     * @param model           the ion
     * @param temperature     temperature in K, positive
     * @param electronDensity electron density in m^-3, positive
     * @return the partition function, at least 2
     */
    public static double boundPartition(HydrogenLikeModel model, double temperature, double electronDensity) {
        int last = highestBoundN(model, temperature, electronDensity);
        double kT = PhysicalConstants.K * temperature;
        Bindings bindings = new Bindings(model);
        double ground = bindings.at(1);
        double sum = 0;
        for (int n = 1; n <= last; n++) {
            sum += 2.0 * n * n * Math.exp(-(ground - bindings.at(n)) / kT);
        }
        return sum;
    }

    /**
     * The Planck-Larkin partition function of a one-electron ion, for when no electron density
     * gives the levels an end:
     * <pre>
     *   U = exp(-I_1 / kT) sum over n of 2 n^2 (exp(I_n / kT) - 1 - I_n / kT)
     * </pre>
     * I_n the binding energy of shell n (Planck 1924, Larkin 1960, Ebeling, Kraeft and Kremp 1976,
     * from memory). Its terms fall as 1 / n^2, so it converges; it equals the plain sum
     * over the low levels where that converges (a cold gas) and stays near the ground level's
     * weight, 2, where the plain sum runs away with n. Summed term by term to n = 2000, the rest
     * by the series of its terms in I_n / kT.
     *
     * @param model       the ion
     * @param temperature temperature in K, positive
     * @return the partition function, positive
     */
    public static double planckLarkinPartition(HydrogenLikeModel model, double temperature) {
        positive("temperature", temperature, "K");
        double kT = PhysicalConstants.K * temperature;
        double ground = binding(model, 1);
        double a = ground / kT;
        double sum = 0;
        for (int n = 1; n <= PLANCK_LARKIN_N; n++) {
            sum += 2.0 * n * n * planckLarkinTerm(binding(model, n) / kT, a);
        }
        // The rest, n > N: 2 n^2 (x^2 / 2 + x^3 / 6 + x^4 / 24 + ...) with x = b / n^2, b = I_N N^2 / kT;
        // the sums of n^-2, n^-4 and n^-6 beyond N by Euler-Maclaurin (common practice):
        // 1/N - 1/(2N^2) + 1/(6N^3) - 1/(30N^5), 1/(3N^3) - 1/(2N^4) + 1/(3N^5), 1/(5N^5) - 1/(2N^6).
        double big = PLANCK_LARKIN_N;
        double b = binding(model, PLANCK_LARKIN_N) * big * big / kT;
        double n2 = big * big;
        double n3 = n2 * big;
        double n5 = n3 * n2;
        double tail = b * b * (1 / big - 1 / (2 * n2) + 1 / (6 * n3) - 1 / (30 * n5))
                + b * b * b / 3 * (1 / (3 * n3) - 1 / (2 * n2 * n2) + 1 / (3 * n5))
                + b * b * b * b / 12 * (1 / (5 * n5) - 1 / (2 * n3 * n3));
        return sum + tail * Math.exp(-a);
    }

    /**
     * One level's Planck-Larkin weight relative to the ground, exp(-a) (exp(x) - 1 - x), without
     * overflow for a cold gas and without cancellation for small x.
     *
     * @param x the level's binding energy over kT
     * @param a the ground level's binding energy over kT
     * @return the weight, to be multiplied by the level's statistical weight
     */
    public static double planckLarkinTerm(double x, double a) {
        return x < 1e-3 ? x * x * (0.5 + x * (1.0 / 6 + x / 24)) * Math.exp(-a)
                : Math.exp(x - a) - (1 + x) * Math.exp(-a);
    }

    /**
     * The hydrogen balance in a plasma: H I's partition function over its bound levels and its
     * ionisation energy both lowered by the Debye amount (see the class comment).
     *
     * @param model           the hydrogen (or deuterium) atom
     * @param temperature     temperature in K
     * @param electronDensity electron density in m^-3
     * @return fractions of H I and H II
     */
    public static double[] hydrogen(HydrogenLikeModel model, double temperature, double electronDensity) {
        requireZ(java.util.Objects.requireNonNull(model, "model"), 1);
        double chi = binding(model, 1) - ionisationLowering(temperature, electronDensity, 1);
        return fractions(temperature, electronDensity, new double[] {chi},
                new double[] {boundPartition(model, temperature, electronDensity), 1});
    }

    /**
     * @param heliumIon       the He II ion (any helium isotope)
     * @param temperature     temperature in K
     * @param electronDensity electron density in m^-3
     * @return fractions of He I, He II and He III, with U(He I) = 1
     */
    public static double[] helium(HydrogenLikeModel heliumIon, double temperature, double electronDensity) {
        return helium(heliumIon, temperature, electronDensity, 1);
    }

    /**
     * The helium balance with neutral helium's partition function given, e.g. the Boltzmann sum
     * over a He I level list at the same temperature (the one the line intensities use), over the
     * levels below the lowered limit. Both ionisation energies are lowered by the Debye amount
     * (z = 1 and 2), and He II's partition function is summed over its bound levels.
     *
     * @param heliumIon        the He II ion (any helium isotope)
     * @param temperature      temperature in K
     * @param electronDensity  electron density in m^-3
     * @param neutralPartition He I's partition function U_I, at least 1 (its ground level's weight)
     * @return fractions of He I, He II and He III
     * @throws IllegalArgumentException for a partition function below 1 or not finite
     */
    public static double[] helium(HydrogenLikeModel heliumIon, double temperature, double electronDensity,
            double neutralPartition) {
        requireZ(java.util.Objects.requireNonNull(heliumIon, "heliumIon"), 2);
        if (!(neutralPartition >= 1) || Double.isInfinite(neutralPartition)) {
            throw new IllegalArgumentException("He I's partition function must be finite and at least 1 (its ground"
                    + " level's weight), got " + neutralPartition);
        }
        double chiI = HELIUM_I_IONISATION_ENERGY - ionisationLowering(temperature, electronDensity, 1);
        double chiII = binding(heliumIon, 1) - ionisationLowering(temperature, electronDensity, 2);
        return fractions(temperature, electronDensity, new double[] {chiI, chiII},
                new double[] {neutralPartition, boundPartition(heliumIon, temperature, electronDensity), 1});
    }

    /** Binding energy of shell n (its n s1/2 level) in J; Bohr-scaled from the model's at n = 100 beyond. */
    private static double binding(HydrogenLikeModel model, int n) {
        return new Bindings(model).at(n);
    }

    /**
     * One ion's shell binding energies, the model's at n = {@value #MODEL_N} asked once: loops over
     * hundreds of shells asked the model for it at every n beyond.
     */
    private static final class Bindings {
        private final HydrogenLikeModel model;
        private double atModelN = Double.NaN;

        Bindings(HydrogenLikeModel model) {
            this.model = model;
        }

        /** @return the binding energy of shell n in J, as {@link IonisationBalance#binding} */
        double at(int n) {
            if (n <= MODEL_N) {
                return -model.energy(n, 0, 1);
            }
            if (Double.isNaN(atModelN)) {
                atModelN = -model.energy(MODEL_N, 0, 1);
            }
            double scale = (double) MODEL_N / n;
            return atModelN * scale * scale;
        }
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
