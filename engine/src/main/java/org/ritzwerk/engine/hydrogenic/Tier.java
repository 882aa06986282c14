package org.ritzwerk.engine.hydrogenic;

import java.util.Locale;
import org.ritzwerk.RitzwerkException;

/**
 * The level models of a one-electron ion, each adding to the one before. Expected accuracy is
 * for hydrogen; it worsens with Z roughly as the next omitted order, (Z alpha)^2 relative to the
 * last included correction.
 */
public enum Tier {
    /**
     * Bohr levels with the reduced mass: {@code E_n = -(m_r/m_e) Z^2 E_h / (2 n^2)}, E_h = 2 R_inf hc.
     * Misses the fine structure, about (Z alpha)^2 / n relative: 5e-5 for hydrogen's n = 1.
     */
    BOHR,
    /**
     * Dirac energies of n l j levels with the reduced-mass and recoil corrections as written in the
     * theory of hydrogen energy levels of the CODATA adjustments (e.g. Mohr, Newell, Taylor, Rev.
     * Mod. Phys. 88, 035009 (2016), appendix; written from memory, checked against sympy's Dirac
     * energies to 1e-13 in the golden tests and, with the QED terms, against Kramida's levels to
     * 1e-9). Misses the Lamb shift, about 3e-6 relative for hydrogen 1s.
     */
    DIRAC,
    /**
     * Dirac plus the leading QED corrections, one-loop self-energy (with Bethe logarithms) and
     * vacuum polarization to order alpha (Z alpha)^5, and the finite nuclear size of s and p1/2
     * levels: the Lamb shift to leading order, good to about 1 % of it for hydrogen (a few
     * parts in 1e9 of a transition frequency).
     */
    QED,
    /**
     * QED plus the hyperfine structure of s levels (Fermi contact interaction, with the electron
     * moment anomaly and the reduced mass), splitting each s level of a nucleus with spin into
     * F = I +- 1/2. Good to about 1e-4 for hydrogen's 21-cm line. Levels with l &gt; 0 stay
     * unsplit.
     */
    HYPERFINE;

    /**
     * The tier to use for an ion of nuclear charge z: this one, except that {@link #QED} and
     * {@link #HYPERFINE} become {@link #DIRAC} above {@link HydrogenLikeModel#QED_MAX_Z}, where
     * their expansion of the self-energy in Z alpha no longer holds (see there).
     *
     * @param z the nuclear charge
     * @return the tier for that ion
     */
    public Tier forZ(int z) {
        return (this == QED || this == HYPERFINE) && z > HydrogenLikeModel.QED_MAX_Z ? DIRAC : this;
    }

    /** Error code of a tier name that is not one of the known ones. */
    public static final String UNKNOWN = "level-model.unknown";

    /** @return the lower-case name used on the command line, e.g. {@code "qed"} */
    public String id() {
        return name().toLowerCase(Locale.ROOT);
    }

    /**
     * @param id a tier name, case-insensitive: bohr, dirac, qed or hyperfine
     * @return the tier
     * @throws RitzwerkException with code {@link #UNKNOWN}, naming the known tiers
     */
    public static Tier fromId(String id) {
        for (Tier tier : values()) {
            if (tier.id().equalsIgnoreCase(id.strip())) {
                return tier;
            }
        }
        throw new RitzwerkException(UNKNOWN, "unknown level model '" + id + "'; known: bohr, dirac, qed, hyperfine");
    }
}
