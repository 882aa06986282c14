package org.ritzwerk.engine.hydrogenic;

import java.util.OptionalDouble;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.constants.PhysicalConstants;

/** Nuclei for the engine tests, from CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)). */
final class Nuclei {

    /** Proton: m_p, spin 1/2, mu_p = 2.79284734463 mu_N, r_p = 0.8414 fm (CODATA 2018). */
    static final Nucleus PROTON = new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1,
            OptionalDouble.of(2.79284734463), OptionalDouble.of(0.8414e-15), "CODATA 2018");
    /** Deuteron: m_d, spin 1, mu_d = 0.8574382338 mu_N, r_d = 2.12799 fm (CODATA 2018). */
    static final Nucleus DEUTERON = new Nucleus(1, 2, PhysicalConstants.DEUTERON_MASS.value(), 2,
            OptionalDouble.of(0.8574382338), OptionalDouble.of(2.12799e-15), "CODATA 2018");

    private Nuclei() {
    }

    /**
     * @param z atomic number
     * @return a point-like nucleus of charge Z and (for these purposes) infinite mass, 1 kg
     */
    static Nucleus infinitelyHeavy(int z) {
        return new Nucleus(z, Math.max(z, 2 * z), 1.0, 0, OptionalDouble.empty(), OptionalDouble.empty(), "test");
    }
}
