package org.ritzwerk.engine.hydrogenic;

import java.util.Locale;
import org.ritzwerk.quantity.Energy;
import java.util.Objects;
import org.ritzwerk.atom.Elements;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.internal.radial.RadialIntegrals;

/**
 * Energy levels of a one-electron ion (H, D, He II, ..., U XCII) under one {@link Tier}.
 *
 * <p>Energies are binding energies in joules, relative to the ionization limit of the ion (so
 * negative), for the level n l j (and F in the {@link Tier#HYPERFINE} tier). With
 * {@code E_h = 2 R_inf h c}, {@code m_e c^2 = E_h / alpha^2}, the reduced mass
 * {@code m_r = m_e M / (m_e + M)} of the nucleus mass M and {@code rho = m_r / m_e}:
 * <pre>
 *   BOHR:   E = -rho Z^2 E_h / (2 n^2)
 *   DIRAC:  E = m_r c^2 (f - 1) - m_r^2 c^2 (f - 1)^2 / (2 (M + m_e))
 *               + (1 - delta_l0) (Z alpha)^4 m_r^3 c^2 / (2 kappa (2l+1) n^3 M^2),
 *           f = [1 + (Z alpha / (n - d))^2]^(-1/2), d = j + 1/2 - sqrt((j + 1/2)^2 - (Z alpha)^2),
 *           kappa = -(l + 1) for j = l + 1/2 and l for j = l - 1/2
 *   QED:    DIRAC + (alpha/pi) (Z alpha)^4 / n^3 rho^3 m_e c^2 [ SE + VP ] + NS, with
 *           SE = 4/3 delta_l0 ln[(Z alpha)^-2 / rho] - 4/3 ln k0(n,l) + 10/9 delta_l0
 *                - (1 - delta_l0) / (2 kappa (2l+1)) + (139/32 - 2 ln 2) pi Z alpha delta_l0,
 *           VP = -4/15 delta_l0 + 5 pi / 48 Z alpha delta_l0,
 *           NS = 2/3 (Z alpha)^4 / n^3 rho^3 m_e c^2 (R / lambda_C)^2 for s levels, times
 *                (Z alpha)^2 (n^2 - 1) / (4 n^2) for p1/2 levels (lambda_C = hbar / (m_e c))
 *   HYPERFINE: QED + (a/2) [F(F+1) - I(I+1) - 3/4] for s levels,
 *           a = 4/3 alpha^2 E_h Z^3 / n^3 (m_e/m_p) (mu / I) (1 + a_e) rho^3  (mu in nuclear magnetons)
 * </pre>
 * Sources: the Dirac-with-recoil and QED expressions follow the theory of hydrogen levels in the
 * CODATA adjustments (Mohr, Taylor, Newell; Eides, Grotch, Shelyuto, Phys. Rep. 342, 63 (2001)),
 * written here from memory; the Fermi contact formula is the textbook one (Bethe &amp; Salpeter,
 * sec. 22); the Bethe logarithms are recomputed (see {@code BetheLogarithms}). The tests check
 * every tier against outside values (sympy's Dirac energies, hydrogen levels of Kramida 2010 to
 * 1e-9, the measured 1S-2S to 1e-10, Lamb shift, fine-structure and 21-cm frequencies), which is
 * how the formulas written from memory are checked.
 *
 * <p>Immutable and thread-safe. The physical constants are those of
 * {@link PhysicalConstants}; {@link #withFineStructureConstant(double)} varies alpha alone, for
 * studies and tests.
 */
public final class HydrogenLikeModel {

    /**
     * The highest nuclear charge of the {@link Tier#QED} and {@link Tier#HYPERFINE} tiers (zinc).
     * Their one-loop self-energy is its expansion in Z alpha, whose 1s coefficient is 3 % above
     * the all-order value at Z = 10 and grows to three times it at Z = 92 (Mohr's all-order
     * values, from memory): there it would put U XCII's 1s level 600 eV off, worse than leaving
     * the Lamb shift out. Heavier ions take the Dirac tier ({@link Tier#forZ}).
     */
    public static final int QED_MAX_Z = 30;

    private final Nucleus nucleus;
    private final Tier tier;
    private final double alpha;
    private final double hartree;
    private final double electronRestEnergy;
    private final double rho;
    private final double electronToNucleusMass;

    private HydrogenLikeModel(Nucleus nucleus, Tier tier, double alpha) {
        this.nucleus = Objects.requireNonNull(nucleus, "nucleus");
        this.tier = Objects.requireNonNull(tier, "tier");
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("fine-structure constant must be between 0 and 1, got " + alpha);
        }
        this.alpha = alpha;
        this.hartree = 2 * PhysicalConstants.RYDBERG.value() * PhysicalConstants.H * PhysicalConstants.C;
        this.electronRestEnergy = hartree / (alpha * alpha);
        this.electronToNucleusMass = PhysicalConstants.ELECTRON_MASS.value() / nucleus.massKg();
        this.rho = 1 / (1 + electronToNucleusMass);
        double zAlpha = nucleus.z() * alpha;
        if (tier != Tier.BOHR && zAlpha >= 1) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "the %s tier needs Z alpha < 1, got Z alpha = %s for Z = %d", tier.id(), zAlpha, nucleus.z()));
        }
        if ((tier == Tier.QED || tier == Tier.HYPERFINE) && nucleus.z() > QED_MAX_Z) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "the %s tier covers Z <= %d (its"
                    + " self-energy, an expansion in Z alpha, fails beyond); Z = %d takes the dirac tier"
                    + " (Tier.forZ), without the Lamb shift", tier.id(), QED_MAX_Z, nucleus.z()));
        }
        if ((tier == Tier.QED || tier == Tier.HYPERFINE) && nucleus.chargeRadius().isEmpty()) {
            throw new IllegalArgumentException("the " + tier.id() + " tier needs the nuclear charge radius of "
                    + Elements.symbol(nucleus.z()) + "-" + nucleus.massNumber() + ", which is not given");
        }
        if (tier == Tier.HYPERFINE && nucleus.hasSpin() && nucleus.magneticMoment().isEmpty()) {
            throw new IllegalArgumentException("the hyperfine tier needs the nuclear magnetic moment of "
                    + Elements.symbol(nucleus.z()) + "-" + nucleus.massNumber() + ", which is not given");
        }
    }

    /**
     * @param nucleus the nucleus; its charge radius is needed from {@link Tier#QED} on, its
     *                moment for {@link Tier#HYPERFINE} when it has spin
     * @param tier    the level model
     * @return the model
     * @throws IllegalArgumentException naming a missing nuclear datum, Z alpha &gt;= 1, or the qed
     *         or hyperfine tier above {@link #QED_MAX_Z}
     */
    public static HydrogenLikeModel of(Nucleus nucleus, Tier tier) {
        return new HydrogenLikeModel(nucleus, tier, PhysicalConstants.FINE_STRUCTURE.value());
    }

    /**
     * @param alpha a fine-structure constant, 0 &lt; alpha &lt; 1 (E_h = 2 R_inf hc stays fixed)
     * @return this model with that alpha
     */
    public HydrogenLikeModel withFineStructureConstant(double alpha) {
        return new HydrogenLikeModel(nucleus, tier, alpha);
    }

    /** @return the nucleus */
    public Nucleus nucleus() {
        return nucleus;
    }

    /**
     * Checks that a species is the one-electron ion of this model's nucleus, as every job that
     * takes a species beside its model does.
     *
     * @param species the species a caller pairs with this model
     * @return the species
     * @throws IllegalArgumentException when it is not the one-electron ion of this nucleus
     *                                  (H I with a helium model, He II with a hydrogen model)
     */
    public Species requireIon(Species species) {
        Objects.requireNonNull(species, "species");
        if (!species.isHydrogenLike() || species.z() != nucleus.z()) {
            throw new IllegalArgumentException(species.notation() + " is not the one-electron ion of the model's "
                    + "nucleus (Z = " + nucleus.z() + ")");
        }
        return species;
    }

    /** @return the tier */
    public Tier tier() {
        return tier;
    }

    /** @return the fine-structure constant in use */
    public double fineStructureConstant() {
        return alpha;
    }

    /** @return the ratio of reduced to electron mass, m_r / m_e */
    public double reducedMassRatio() {
        return rho;
    }

    /**
     * @param n    principal quantum number, at least 1
     * @param l    orbital quantum number, 0 to n - 1
     * @param twoJ twice the total angular momentum, 2l - 1 or 2l + 1 (and positive)
     * @return the binding energy of the level n l j in J (negative), hyperfine centroid in the
     *         {@link Tier#HYPERFINE} tier
     * @throws IllegalArgumentException naming the quantum number out of range
     */
    public double energy(int n, int l, int twoJ) {
        checkLevel(n, l, twoJ);
        return centroid(n, l, twoJ);
    }

    /**
     * The level's energy above the ground level 1s1/2, as a typed quantity (what level tables
     * and spectroscopists list).
     *
     * @param n    principal quantum number, at least 1
     * @param l    orbital quantum number, 0 to n - 1
     * @param twoJ twice the total angular momentum, 2l - 1 or 2l + 1 (and positive)
     * @return {@code energy(n, l, twoJ) - energy(1, 0, 1)}, zero for the ground level, hyperfine
     *         centroids in the {@link Tier#HYPERFINE} tier
     * @throws IllegalArgumentException naming the quantum number out of range
     */
    public Energy excitationEnergy(int n, int l, int twoJ) {
        return Energy.ofJoules(energy(n, l, twoJ) - energy(1, 0, 1));
    }

    /**
     * The energy needed to ionise the ion from the level, as a positive typed quantity.
     *
     * @param n    principal quantum number, at least 1
     * @param l    orbital quantum number, 0 to n - 1
     * @param twoJ twice the total angular momentum, 2l - 1 or 2l + 1 (and positive)
     * @return {@code -energy(n, l, twoJ)}: from the ground level, the ionisation energy of the ion
     * @throws IllegalArgumentException naming the quantum number out of range
     */
    public Energy ionisationEnergy(int n, int l, int twoJ) {
        return Energy.ofJoules(-energy(n, l, twoJ));
    }

    /**
     * @param n    principal quantum number, at least 1
     * @param l    orbital quantum number, 0 to n - 1
     * @param twoJ twice j, 2l +- 1
     * @param twoF twice the total angular momentum F including the nuclear spin, |2j - 2I| to
     *             2j + 2I in steps of 2
     * @return the binding energy of the hyperfine level in J; outside the {@link Tier#HYPERFINE}
     *         tier and for l &gt; 0 the same as {@link #energy(int, int, int)}
     */
    public double energy(int n, int l, int twoJ, int twoF) {
        checkLevel(n, l, twoJ);
        int twoI = nucleus.twiceSpin();
        if (twoF < Math.abs(twoJ - twoI) || twoF > twoJ + twoI || ((twoF - twoJ - twoI) & 1) != 0) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "F = %s is impossible for j = %s and nuclear spin I = %s: F runs from |j - I| to j + I",
                    Notation.half(twoF), Notation.half(twoJ), Notation.half(twoI)));
        }
        return centroid(n, l, twoJ) + hyperfine(n, l, twoJ, twoF);
    }

    /**
     * @param nMax highest principal quantum number, 1 to {@link HydrogenLikeLines#MAX_N}
     * @return every level n l j (and F where this tier resolves it) with n &lt;= nMax, in the order
     *         n, l, j, F; about nMax^2 levels, no object per level
     */
    public LevelTable levels(int nMax) {
        return levels(1, nMax);
    }

    /**
     * The levels of the shells nMin to nMax only, so that a caller can go through many levels a
     * few shells at a time: shell n holds 2n - 1 levels (one more where this tier resolves the
     * hyperfine structure of s levels of a nucleus with spin), 24 bytes of table each.
     *
     * @param nMin lowest principal quantum number, 1 to nMax
     * @param nMax highest principal quantum number, nMin to {@link HydrogenLikeLines#MAX_N}
     * @return every level n l j (and F where this tier resolves it) with nMin &lt;= n &lt;= nMax,
     *         in the order n, l, j, F; no object per level
     */
    public LevelTable levels(int nMin, int nMax) {
        if (nMax < 1 || nMax > HydrogenLikeLines.MAX_N) {
            throw new IllegalArgumentException("n-max must be 1 to " + HydrogenLikeLines.MAX_N + ", got " + nMax);
        }
        if (nMin < 1 || nMin > nMax) {
            throw new IllegalArgumentException("n-min must be 1 to n-max = " + nMax + ", got " + nMin);
        }
        boolean hyperfine = resolvesHyperfine();
        int twoI = nucleus.twiceSpin();
        int shells = nMax - nMin + 1;
        int count = nMax * nMax - (nMin - 1) * (nMin - 1) + (hyperfine ? shells * (Math.min(twoI, 1)) : 0);
        int[] ns = new int[count];
        int[] ls = new int[count];
        int[] twoJs = new int[count];
        int[] twoFs = new int[count];
        double[] energies = new double[count];
        int i = 0;
        for (int n = nMin; n <= nMax; n++) {
            for (int l = 0; l < n; l++) {
                for (int twoJ = Math.max(2 * l - 1, 1); twoJ <= 2 * l + 1; twoJ += 2) {
                    double centroid = centroid(n, l, twoJ);
                    if (hyperfine && l == 0) {
                        for (int twoF = Math.abs(twoJ - twoI); twoF <= twoJ + twoI; twoF += 2) {
                            ns[i] = n;
                            ls[i] = l;
                            twoJs[i] = twoJ;
                            twoFs[i] = twoF;
                            energies[i++] = centroid + hyperfine(n, l, twoJ, twoF);
                        }
                    } else {
                        ns[i] = n;
                        ls[i] = l;
                        twoJs[i] = twoJ;
                        twoFs[i] = -1;
                        energies[i++] = centroid;
                    }
                }
            }
        }
        return new LevelTable(ns, ls, twoJs, twoFs, energies);
    }

    /** @return {@code true} when the hyperfine energy of s levels is resolved */
    public boolean resolvesHyperfine() {
        return tier == Tier.HYPERFINE && nucleus.hasSpin();
    }

    static void checkLevel(int n, int l, int twoJ) {
        RadialIntegrals.checkState(n, l, "");
        if (twoJ != 2 * l + 1 && twoJ != 2 * l - 1 || twoJ < 1) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "j = %s is impossible for l = %d: j must be l +- 1/2 and positive", Notation.half(twoJ), l));
        }
    }


    private double centroid(int n, int l, int twoJ) {
        int z = nucleus.z();
        if (tier == Tier.BOHR) {
            return -rho * z * z * hartree / (2.0 * n * n);
        }
        double zAlpha = z * alpha;
        double za2 = zAlpha * zAlpha;
        double k = (twoJ + 1) / 2.0;
        double delta = za2 / (k + Math.sqrt(k * k - za2));
        double u = za2 / ((n - delta) * (n - delta));
        double root = Math.sqrt(1 + u);
        double fMinusOne = -u / (root * (1 + root));
        double kappa = twoJ == 2 * l + 1 ? -(l + 1) : l;
        double mrc2 = rho * electronRestEnergy;
        double n3 = (double) n * n * n;
        double energy = mrc2 * fMinusOne
                - electronRestEnergy * rho * rho * fMinusOne * fMinusOne * electronToNucleusMass / (2 * (1 + electronToNucleusMass));
        if (l > 0) {
            energy += electronRestEnergy * za2 * za2 * rho * rho * rho * electronToNucleusMass * electronToNucleusMass
                    / (2 * kappa * (2 * l + 1) * n3);
        }
        if (tier == Tier.DIRAC) {
            return energy;
        }
        double scale = alpha / Math.PI * za2 * za2 / n3 * rho * rho * rho * electronRestEnergy;
        double selfEnergy = -4.0 / 3 * BetheLogarithms.of(n, l);
        double vacuumPolarization = 0;
        if (l == 0) {
            selfEnergy += 4.0 / 3 * Math.log(1 / (za2 * rho)) + 10.0 / 9
                    + (139.0 / 32 - 2 * Math.log(2)) * Math.PI * zAlpha;
            vacuumPolarization = -4.0 / 15 + 5 * Math.PI / 48 * zAlpha;
        } else {
            selfEnergy -= 1 / (2 * kappa * (2 * l + 1));
        }
        energy += scale * (selfEnergy + vacuumPolarization);
        if (l == 0 || l == 1 && twoJ == 1) {
            double reducedCompton = PhysicalConstants.H / (2 * Math.PI * PhysicalConstants.ELECTRON_MASS.value()
                    * PhysicalConstants.C);
            double radius = nucleus.chargeRadius().getAsDouble() / reducedCompton;
            double finiteSize = 2.0 / 3 * za2 * za2 / n3 * rho * rho * rho * electronRestEnergy * radius * radius;
            energy += l == 0 ? finiteSize : finiteSize * za2 * ((double) n * n - 1) / (4.0 * n * n);
        }
        return energy;
    }

    private double hyperfine(int n, int l, int twoJ, int twoF) {
        if (tier != Tier.HYPERFINE || l != 0 || !nucleus.hasSpin()) {
            return 0;
        }
        int z = nucleus.z();
        double spin = nucleus.twiceSpin() / 2.0;
        double gNuclear = nucleus.magneticMoment().getAsDouble() / spin;
        double electronToProton = PhysicalConstants.ELECTRON_MASS.value() / PhysicalConstants.PROTON_MASS.value();
        double a = 4.0 / 3 * alpha * alpha * hartree * z * z * z / ((double) n * n * n) * electronToProton * gNuclear
                * (1 + PhysicalConstants.ELECTRON_MOMENT_ANOMALY.value()) * rho * rho * rho;
        double f = twoF / 2.0;
        double j = twoJ / 2.0;
        return a / 2 * (f * (f + 1) - spin * (spin + 1) - j * (j + 1));
    }

    @Override
    public String toString() {
        return String.format(Locale.ROOT, "HydrogenLikeModel[%s-%d, %s]", Elements.symbol(nucleus.z()),
                nucleus.massNumber(), tier.id());
    }
}
