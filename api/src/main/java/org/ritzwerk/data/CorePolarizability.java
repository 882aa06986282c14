package org.ritzwerk.data;

import java.util.Objects;

/**
 * Static dipole and quadrupole polarizabilities of the singly charged ionic core of an alkali-like
 * atom. The engine takes from them the quantum defects of the high-l (non-penetrating) series and
 * the inner cut-off radius alpha_d^(1/3) of the Coulomb approximation. Immutable and thread-safe.
 *
 * @param dipoleAu     dipole polarizability alpha_d in atomic units (a0^3); finite, positive
 * @param quadrupoleAu quadrupole polarizability alpha_q in atomic units (a0^5); finite, not negative
 * @param source       where the values come from; not blank
 */
public record CorePolarizability(double dipoleAu, double quadrupoleAu, String source) {

    /**
     * Validates the components.
     *
     * @param dipoleAu     dipole polarizability alpha_d in atomic units (a0^3); finite, positive
     * @param quadrupoleAu quadrupole polarizability alpha_q in atomic units (a0^5); finite, not negative
     * @param source       where the values come from; not blank
     */
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
}
