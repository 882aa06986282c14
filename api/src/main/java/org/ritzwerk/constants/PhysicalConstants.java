package org.ritzwerk.constants;

import java.util.List;

/**
 * The one place that names the edition of the physical constants Ritzwerk computes with:
 * <b>CODATA 2018</b>.
 *
 * <p>Source: E. Tiesinga, P. J. Mohr, D. B. Newell and B. N. Taylor, "CODATA recommended values of
 * the fundamental physical constants: 2018", Rev. Mod. Phys. 93, 025010 (2021). The values are
 * checked digit for digit against scipy.constants 1.10.1 (which carries CODATA 2018) in
 * {@code PhysicalConstantsTest}; the golden file and the script that made it are committed under
 * {@code api/src/test/resources/golden/}.
 *
 * <p>h, c, e, k and N_A are exact by the definition of the SI (2019). The measured constants carry
 * their standard uncertainty. Every field is a compile-time literal: nothing is loaded from data
 * at class initialisation. Immutable and thread-safe.
 */
public final class PhysicalConstants {

    /** The edition, as printed by {@code ritzwerk --version} and quoted in reports. */
    public static final String EDITION = "CODATA 2018";

    /** The publication of {@link #EDITION}. */
    public static final String CITATION = "E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor, "
            + "CODATA recommended values of the fundamental physical constants: 2018, "
            + "Rev. Mod. Phys. 93, 025010 (2021)";

    /** Planck constant h in J s (exact). */
    public static final Constant PLANCK = new Constant("Planck constant", "h", 6.62607015e-34, 0, "J s");
    /** Speed of light in vacuum c in m s^-1 (exact). */
    public static final Constant SPEED_OF_LIGHT =
            new Constant("speed of light in vacuum", "c", 299_792_458.0, 0, "m s^-1");
    /** Elementary charge e in C (exact). */
    public static final Constant ELEMENTARY_CHARGE =
            new Constant("elementary charge", "e", 1.602176634e-19, 0, "C");
    /** Boltzmann constant k in J K^-1 (exact). */
    public static final Constant BOLTZMANN = new Constant("Boltzmann constant", "k", 1.380649e-23, 0, "J K^-1");
    /** Avogadro constant N_A in mol^-1 (exact). */
    public static final Constant AVOGADRO = new Constant("Avogadro constant", "N_A", 6.02214076e23, 0, "mol^-1");
    /** Rydberg constant R_inf in m^-1. */
    public static final Constant RYDBERG =
            new Constant("Rydberg constant", "R_inf", 10_973_731.568160, 0.000021, "m^-1");
    /** Fine-structure constant alpha (dimensionless). */
    public static final Constant FINE_STRUCTURE =
            new Constant("fine-structure constant", "alpha", 7.2973525693e-3, 0.0000000011e-3, "");
    /** Electron mass m_e in kg. */
    public static final Constant ELECTRON_MASS =
            new Constant("electron mass", "m_e", 9.1093837015e-31, 0.0000000028e-31, "kg");
    /** Proton mass m_p in kg. */
    public static final Constant PROTON_MASS =
            new Constant("proton mass", "m_p", 1.67262192369e-27, 0.00000000051e-27, "kg");
    /** Deuteron mass m_d in kg. */
    public static final Constant DEUTERON_MASS =
            new Constant("deuteron mass", "m_d", 3.3435837724e-27, 0.0000000010e-27, "kg");
    /** Atomic mass constant m_u = 1 u in kg. */
    public static final Constant ATOMIC_MASS_CONSTANT =
            new Constant("atomic mass constant", "m_u", 1.66053906660e-27, 0.00000000050e-27, "kg");

    /** Electron magnetic-moment anomaly a_e (dimensionless). */
    public static final Constant ELECTRON_MOMENT_ANOMALY =
            new Constant("electron mag. mom. anomaly", "a_e", 1.15965218128e-3, 0.00000000018e-3, "");

    /** h in J s, as a plain double for kernels. */
    public static final double H = 6.62607015e-34;
    /** c in m s^-1, as a plain double for kernels. */
    public static final double C = 299_792_458.0;
    /** e in C (and J per eV), as a plain double for kernels. */
    public static final double E = 1.602176634e-19;
    /** k in J K^-1, as a plain double for kernels. */
    public static final double K = 1.380649e-23;

    private static final List<Constant> ALL = List.of(PLANCK, SPEED_OF_LIGHT, ELEMENTARY_CHARGE, BOLTZMANN,
            AVOGADRO, RYDBERG, FINE_STRUCTURE, ELECTRON_MASS, PROTON_MASS, DEUTERON_MASS, ATOMIC_MASS_CONSTANT,
            ELECTRON_MOMENT_ANOMALY);

    private PhysicalConstants() {
    }

    /** @return every constant of this class, in a fixed order; an immutable list */
    public static List<Constant> all() {
        return ALL;
    }
}
