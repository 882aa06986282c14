package org.ritzwerk.engine.internal.units;

import org.ritzwerk.constants.PhysicalConstants;

/**
 * Conversions between atomic units and SI, from the CODATA constants of
 * {@link PhysicalConstants} ({@value PhysicalConstants#EDITION}): {@code E_h = 2 R_inf h c},
 * {@code a0 = alpha / (4 pi R_inf)}. Public so that the pair-interaction package and the
 * command line convert alike; stateless.
 */
public final class AtomicUnits {

    /** R_inf in cm^-1. */
    private static final double R_INF_PER_CM = PhysicalConstants.RYDBERG.value() / 100;
    /** The Hartree energy in cm^-1 (2 R_inf). */
    public static final double HARTREE_PER_CM = 2 * R_INF_PER_CM;
    /** The Hartree energy in J. */
    public static final double HARTREE_JOULES = HARTREE_PER_CM * 100 * PhysicalConstants.H * PhysicalConstants.C;
    /** The Hartree energy over h, Hz. */
    public static final double HARTREE_HZ = HARTREE_PER_CM * 100 * PhysicalConstants.C;
    /** The Bohr radius a0 in m. */
    public static final double BOHR_METRES = PhysicalConstants.FINE_STRUCTURE.value()
            / (4 * Math.PI * PhysicalConstants.RYDBERG.value());
    /** The atomic unit of electric field, E_h / (e a0), in V/m. */
    public static final double FIELD_V_PER_M = HARTREE_JOULES / (PhysicalConstants.E * BOHR_METRES);
    /** The atomic unit of dipole moment, e a0, in C m. */
    public static final double DIPOLE_C_M = PhysicalConstants.E * BOHR_METRES;
    /** One atomic unit of polarizability over h, in Hz/(V/m)^2: (e a0)^2 / (E_h h). */
    public static final double POLARIZABILITY_HZ_PER_V2M2 =
            DIPOLE_C_M * DIPOLE_C_M / (HARTREE_JOULES * PhysicalConstants.H);

    private AtomicUnits() {
    }

    /**
     * @param perCm an energy in cm^-1
     * @return the same in hartree
     */
    public static double hartreeFromPerCm(double perCm) {
        return perCm / HARTREE_PER_CM;
    }
}
