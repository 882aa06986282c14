package org.ritzwerk.engine.rydberg;

import java.util.Objects;

/**
 * Static dipole and quadrupole polarizabilities of the ionic core, which give the quantum
 * defects of the high-l (non-penetrating) series and the inner cut-off radius of the Coulomb
 * approximation.
 *
 * @param dipoleAu     dipole polarizability alpha_d in atomic units (a0^3); finite, positive
 * @param quadrupoleAu quadrupole polarizability alpha_q in atomic units (a0^5); finite, not negative
 * @param source       where the values come from; not blank
 */
public record CorePolarizability(double dipoleAu, double quadrupoleAu, String source) {

    /** Validates the components. */
    public CorePolarizability {
        Objects.requireNonNull(source, "source");
        if (!(dipoleAu > 0) || Double.isInfinite(dipoleAu) || !(quadrupoleAu >= 0) || Double.isInfinite(quadrupoleAu)) {
            throw new IllegalArgumentException("core polarizabilities must be finite, dipole > 0 and quadrupole >= 0 "
                    + "(atomic units), got " + dipoleAu + " and " + quadrupoleAu);
        }
        if (source.isBlank()) {
            throw new IllegalArgumentException("core polarizabilities need a source");
        }
    }

    /** @return the core radius alpha_d^(1/3) in a0, where the Coulomb approximation stops integrating */
    public double coreRadiusBohr() {
        return Math.cbrt(dipoleAu);
    }
}
