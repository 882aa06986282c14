package org.ritzwerk.atom;

import java.util.Objects;
import java.util.OptionalDouble;
import org.ritzwerk.constants.PhysicalConstants;

/**
 * What the level models need to know about a nucleus: charge, mass, spin, magnetic moment and
 * rms charge radius, with the source of the values. Immutable and thread-safe.
 *
 * @param z                atomic number
 * @param massNumber       mass number A
 * @param massKg           nuclear mass in kg (without electrons); finite, positive
 * @param twiceSpin        twice the nuclear spin I (0 for spin 0, 1 for I = 1/2, ...)
 * @param magneticMoment   magnetic dipole moment in nuclear magnetons; empty when unknown
 *                         (and for spin 0, where it is zero)
 * @param chargeRadius     rms nuclear charge radius in metres; empty when unknown
 * @param source           where the values come from, e.g. "mass AME2020; moment Stone 2019"
 */
public record Nucleus(int z, int massNumber, double massKg, int twiceSpin, OptionalDouble magneticMoment,
        OptionalDouble chargeRadius, String source) {

    /**
     * Validates the components.
     *
     * @param z                atomic number
     * @param massNumber       mass number A
     * @param massKg           nuclear mass in kg (without electrons); finite, positive
     * @param twiceSpin        twice the nuclear spin I (0 for spin 0, 1 for I = 1/2, ...)
     * @param magneticMoment   magnetic dipole moment in nuclear magnetons; empty when unknown
     *                         (and for spin 0, where it is zero)
     * @param chargeRadius     rms nuclear charge radius in metres; empty when unknown
     * @param source           where the values come from, e.g. "mass AME2020; moment Stone 2019"
     */
    public Nucleus {
        if (z < 1 || z > Elements.MAX_Z) {
            throw new IllegalArgumentException("atomic number must be 1 to " + Elements.MAX_Z + ", got " + z);
        }
        if (massNumber < z || massNumber > Species.MAX_MASS_NUMBER) {
            throw new IllegalArgumentException("mass number must be " + z + " to " + Species.MAX_MASS_NUMBER
                    + ", got " + massNumber);
        }
        if (!(massKg > 0) || !Double.isFinite(massKg)) {
            throw new IllegalArgumentException("nuclear mass must be finite and positive kg, got " + massKg);
        }
        if (twiceSpin < 0) {
            throw new IllegalArgumentException("twice the nuclear spin must be >= 0, got " + twiceSpin);
        }
        Objects.requireNonNull(magneticMoment, "magneticMoment");
        Objects.requireNonNull(chargeRadius, "chargeRadius");
        Objects.requireNonNull(source, "source");
        if (magneticMoment.isPresent() && !Double.isFinite(magneticMoment.getAsDouble())) {
            throw new IllegalArgumentException("magnetic moment must be finite, got " + magneticMoment);
        }
        if (chargeRadius.isPresent() && !(chargeRadius.getAsDouble() > 0 && chargeRadius.getAsDouble() < 1e-13)) {
            throw new IllegalArgumentException("charge radius must be positive and below 1e-13 m, got " + chargeRadius);
        }
    }

    /**
     * The nuclear mass from a tabulated atomic mass: {@code M_nuc = M_atom - Z m_e + B_e / c^2},
     * with the total electron binding energy
     * {@code B_e = 14.4381 Z^2.39 + 1.55468e-6 Z^5.35} eV (D. Lunney, J. M. Pearson, C. Thibault,
     * Rev. Mod. Phys. 75, 1021 (2003), eq. A4; coefficients from memory, checked: for helium the
     * fit gives 75.7 eV against 79.0 eV, the sum of its two ionisation energies 24.587 eV and
     * 54.418 eV (NIST Atomic Spectra Database), and {@code NucleusTest} finds the CODATA 2018
     * alpha-particle mass from the AME2020 mass of 4He to 1.5e-9 relative, where leaving out
     * {@code B_e} would miss by 2e-8), good to a few eV, far below what level energies can feel
     * through the reduced mass. For hydrogen (Z = 1), whose binding the fit overstates by 0.8 eV,
     * the Rydberg energy {@code R_inf hc} is used instead (the 0.05 % reduced-mass difference is
     * 7 meV).
     *
     * @param z                atomic number
     * @param atomicMassDalton neutral-atom mass in u (daltons); finite, positive
     * @return the nuclear mass in kg
     */
    public static double nuclearMassKg(int z, double atomicMassDalton) {
        if (!(atomicMassDalton > 0) || !Double.isFinite(atomicMassDalton)) {
            throw new IllegalArgumentException("atomic mass must be finite and positive u, got " + atomicMassDalton);
        }
        double bindingJ = z == 1
                ? PhysicalConstants.RYDBERG.value() * PhysicalConstants.H * PhysicalConstants.C
                : (14.4381 * Math.pow(z, 2.39) + 1.55468e-6 * Math.pow(z, 5.35)) * PhysicalConstants.E;
        double bindingKg = bindingJ / (PhysicalConstants.C * PhysicalConstants.C);
        return atomicMassDalton * PhysicalConstants.ATOMIC_MASS_CONSTANT.value()
                - z * PhysicalConstants.ELECTRON_MASS.value() + bindingKg;
    }

    /** @return {@code true} when the spin is not zero (the nucleus has hyperfine structure) */
    public boolean hasSpin() {
        return twiceSpin > 0;
    }
}
