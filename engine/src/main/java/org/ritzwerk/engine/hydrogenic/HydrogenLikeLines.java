package org.ritzwerk.engine.hydrogenic;

import java.util.Locale;
import java.util.Objects;
import java.util.function.DoubleConsumer;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.quantity.SpectralQuantity;
import org.ritzwerk.engine.internal.radial.RadialIntegrals;

/**
 * Electric-dipole lines of a one-electron ion: fine-structure components and n -> n' multiplets
 * within a frequency window, the decays of a level, lifetimes and branching ratios.
 *
 * <p>Selection rules: delta l = +-1, delta j = 0, +-1 (the 6j symbol vanishes otherwise). For a
 * component {@code n l j -> n' l' j'} (Edmonds, Angular Momentum in Quantum Mechanics, eq. 7.1.8;
 * Bethe &amp; Salpeter sec. 59-63; Sobelman, Atomic Spectra and Radiative Transitions, ch. 9):
 * <pre>
 *   S = (2j+1)(2j'+1) {l j 1/2; j' l' 1}^2 max(l, l') (e a R)^2,   a = a_0 / (Z m_r/m_e)
 *   A = 16 pi^3 nu^3 S / (3 h eps_0 c^3 g_u),   f = 8 pi^2 m_e nu S / (3 h e^2 g_l)
 * </pre>
 * with R the radial integral of {@link RadialIntegrals}, nu the vacuum frequency from the
 * model's level energies, g = 2j + 1, a_0 = alpha / (4 pi R_inf) and eps_0 = e^2 / (2 alpha h c).
 * The radial integrals are nonrelativistic, as is usual for one-electron rates: the relative
 * error grows as (Z alpha)^2, about 5e-5 for hydrogen. A multiplet blends every component of
 * n -> n': frequency weighted by line strength, S summed, {@code A = sum g_u A / (2 n^2)},
 * {@code f = sum g_l f / (2 n'^2)}.
 *
 * <p>The lines are E1 only. A lifetime ({@link #lifetime}) sums a level's E1 decays, and for 2s1/2,
 * which has none to 1s, adds its two-photon and magnetic-dipole decays ({@link #metastableDecayRate},
 * about 0.12 s in hydrogen); other M1, E2 and two-photon decays are left out, and 1s has an infinite
 * lifetime.
 *
 * <p>Immutable and thread-safe.
 */
public final class HydrogenLikeLines {

    /** The largest principal quantum number accepted. */
    public static final int MAX_N = 2000;

    private final HydrogenLikeModel model;
    /** e a, the dipole length unit of this ion, C m. */
    private final double dipoleUnit;
    private final double aFactor;
    private final double fFactor;

    private HydrogenLikeLines(HydrogenLikeModel model) {
        this.model = Objects.requireNonNull(model, "model");
        double alpha = model.fineStructureConstant();
        double bohrRadius = alpha / (4 * Math.PI * PhysicalConstants.RYDBERG.value());
        this.dipoleUnit = PhysicalConstants.E * bohrRadius / (model.nucleus().z() * model.reducedMassRatio());
        double h = PhysicalConstants.H;
        double c = PhysicalConstants.C;
        double epsilon0 = PhysicalConstants.E * PhysicalConstants.E / (2 * alpha * h * c);
        this.aFactor = 16 * Math.pow(Math.PI, 3) / (3 * h * epsilon0 * c * c * c);
        // f = 8 pi^2 m_e nu S / (3 h e^2 g_l), written with m_e = 2 h R_inf / (alpha^2 c) so that
        // it rests on the same R_inf and alpha as the energies: f = nu S / (3 R_inf c g_l (e a_0)^2).
        double atomicDipole = PhysicalConstants.E * bohrRadius;
        this.fFactor = 1 / (3 * PhysicalConstants.RYDBERG.value() * c * atomicDipole * atomicDipole);
    }

    /**
     * @param model the level model
     * @return the line generator for that ion and tier
     */
    public static HydrogenLikeLines of(HydrogenLikeModel model) {
        return new HydrogenLikeLines(model);
    }

    /** @return the level model */
    public HydrogenLikeModel model() {
        return model;
    }

    /**
     * @param nMax        highest upper principal quantum number, 1 to {@link #MAX_N}
     * @param minHertz    lower end of the window (vacuum frequency, Hz), not negative
     * @param maxHertz    upper end of the window (Hz), above {@code minHertz}
     * @return every fine-structure component with upper n &lt;= nMax in the window, by frequency
     */
    public LineTable components(int nMax, double minHertz, double maxHertz) {
        return components(nMax, minHertz, maxHertz, fraction -> { });
    }

    /**
     * As {@link #components(int, double, double)}, telling {@code progress} the fraction done (0 to
     * 1, after each upper shell) so that a long run at large n can show it. The share of a shell
     * pair n, n' in the window is taken as n'^2 (n + n') + 1 (about n' radial integrals, each of
     * about n' terms of numbers that grow with n + n'); pairs outside the window count 1.
     *
     * @param nMax     highest upper principal quantum number, 1 to {@link #MAX_N}
     * @param minHertz lower end of the window (vacuum frequency, Hz), not negative
     * @param maxHertz upper end of the window (Hz), above {@code minHertz}
     * @param progress told the fraction done after each upper shell; may be a no-op
     * @return every fine-structure component with upper n &lt;= nMax in the window, by frequency
     */
    public LineTable components(int nMax, double minHertz, double maxHertz, DoubleConsumer progress) {
        checkWindow(nMax, minHertz, maxHertz);
        Objects.requireNonNull(progress, "progress");
        double[] done = shares(nMax, minHertz, maxHertz, true);
        LineTable.Builder lines = new LineTable.Builder();
        for (int nU = 1; nU <= nMax; nU++) {
            progress.accept(done[nU - 1]);
            for (int nL = 1; nL <= nU; nL++) {
                if (outside(nU, nL, minHertz, maxHertz)) {
                    continue;
                }
                addComponents(nU, nL, minHertz, maxHertz, lines);
            }
        }
        progress.accept(1);
        return LineTable.sorted(lines, model.nucleus().z());
    }

    /**
     * @param nMax highest upper principal quantum number, 1 to {@link #MAX_N}
     * @param one  one end of the window, in any unit and medium (e.g. an air wavelength)
     * @param two  the other end
     * @return every fine-structure component in the window, by frequency
     */
    public LineTable components(int nMax, SpectralQuantity one, SpectralQuantity two) {
        double a = one.toFrequency().inHertz();
        double b = two.toFrequency().inHertz();
        return components(nMax, Math.min(a, b), Math.max(a, b));
    }

    /**
     * @param nMax highest upper principal quantum number, 1 to {@link #MAX_N}
     * @param one  one end of the window, in any unit and medium
     * @param two  the other end
     * @return every n -> n' multiplet whose blended frequency is in the window, by frequency
     */
    public LineTable multiplets(int nMax, SpectralQuantity one, SpectralQuantity two) {
        double a = one.toFrequency().inHertz();
        double b = two.toFrequency().inHertz();
        return multiplets(nMax, Math.min(a, b), Math.max(a, b));
    }

    /**
     * @param nMax     highest upper principal quantum number, 1 to {@link #MAX_N}
     * @param minHertz lower end of the window (Hz)
     * @param maxHertz upper end of the window (Hz)
     * @return every n -> n' multiplet (n' &lt; n &lt;= nMax) whose blended frequency is in the window
     */
    public LineTable multiplets(int nMax, double minHertz, double maxHertz) {
        return multiplets(nMax, minHertz, maxHertz, fraction -> { });
    }

    /**
     * As {@link #multiplets(int, double, double)}, telling {@code progress} the fraction done.
     *
     * @param nMax     highest upper principal quantum number, 1 to {@link #MAX_N}
     * @param minHertz lower end of the window (Hz)
     * @param maxHertz upper end of the window (Hz)
     * @param progress told the fraction done (0 to 1, weighted as in
     *                 {@link #components(int, double, double, DoubleConsumer)}) after each upper
     *                 shell; may be a no-op
     * @return every n -> n' multiplet (n' &lt; n &lt;= nMax) whose blended frequency is in the window
     */
    public LineTable multiplets(int nMax, double minHertz, double maxHertz, DoubleConsumer progress) {
        checkWindow(nMax, minHertz, maxHertz);
        Objects.requireNonNull(progress, "progress");
        double[] done = shares(nMax, minHertz, maxHertz, false);
        LineTable.Builder lines = new LineTable.Builder();
        for (int nU = 2; nU <= nMax; nU++) {
            progress.accept(done[nU - 1]);
            for (int nL = 1; nL < nU; nL++) {
                if (outside(nU, nL, minHertz, maxHertz)) {
                    continue;
                }
                LineTable.Builder parts = new LineTable.Builder();
                addComponents(nU, nL, 0, Double.POSITIVE_INFINITY, parts);
                double strength = 0;
                double weightedFrequency = 0;
                double gA = 0;
                double gF = 0;
                for (int i = 0; i < parts.size; i++) {
                    strength += parts.strength[i];
                    weightedFrequency += parts.strength[i] * parts.frequency[i];
                    gA += (parts.upper[3 * i + 2] + 1) * parts.einsteinA[i];
                    gF += (parts.lower[3 * i + 2] + 1) * parts.oscillatorStrength[i];
                }
                double hertz = weightedFrequency / strength;
                if (hertz >= minHertz && hertz <= maxHertz) {
                    lines.add(nU, -1, -1, nL, -1, -1, hertz, strength, gA / (2.0 * nU * nU), gF / (2.0 * nL * nL));
                }
            }
        }
        progress.accept(1);
        return LineTable.sorted(lines, model.nucleus().z());
    }

    /**
     * The fine-structure components of one n -&gt; n' multiplet, wherever they fall: what
     * {@link #multiplets(int, double, double)} blends into one line.
     *
     * @param upperN upper principal quantum number, 2 to {@link #MAX_N}
     * @param lowerN lower principal quantum number, 1 to upperN - 1
     * @return every E1 component from shell upperN to shell lowerN, by frequency
     */
    public LineTable multipletComponents(int upperN, int lowerN) {
        if (upperN > MAX_N || lowerN < 1 || lowerN >= upperN) {
            throw new IllegalArgumentException("a multiplet needs 1 <= lower n < upper n <= " + MAX_N + ", got "
                    + upperN + " -> " + lowerN);
        }
        LineTable.Builder parts = new LineTable.Builder();
        addComponents(upperN, lowerN, 0, Double.POSITIVE_INFINITY, parts);
        return LineTable.sorted(parts, model.nucleus().z());
    }

    /**
     * @param n    principal quantum number
     * @param l    orbital quantum number
     * @param twoJ twice j
     * @return every E1 decay of the level n l j to a lower level, by frequency
     */
    public LineTable decays(int n, int l, int twoJ) {
        HydrogenLikeModel.checkLevel(n, l, twoJ);
        if (n > MAX_N) {
            throw new IllegalArgumentException("n must be at most " + MAX_N + ", got " + n);
        }
        double energy = model.energy(n, l, twoJ);
        LineTable.Builder lines = new LineTable.Builder();
        for (int nL = 1; nL <= n; nL++) {
            for (int lL = l - 1; lL <= l + 1; lL += 2) {
                if (lL < 0 || lL >= nL) {
                    continue;
                }
                double radial = RadialIntegrals.dipole(n, l, nL, lL);
                for (int twoJL = 2 * lL - 1; twoJL <= 2 * lL + 1; twoJL += 2) {
                    if (twoJL < 1) {
                        continue;
                    }
                    double lowerEnergy = model.energy(nL, lL, twoJL);
                    if (lowerEnergy < energy) {
                        add(lines, n, l, twoJ, nL, lL, twoJL, (energy - lowerEnergy) / PhysicalConstants.H, radial);
                    }
                }
            }
        }
        return LineTable.sorted(lines, model.nucleus().z());
    }

    /**
     * One line found by its two levels: the E1 transition from the upper level n l j to the lower
     * level n' l' j', with its frequency, line strength, A and f.
     *
     * @param upperN    upper principal quantum number, at most {@value #MAX_N}
     * @param upperL    upper orbital quantum number
     * @param upperTwoJ twice the upper j
     * @param lowerN    lower principal quantum number
     * @param lowerL    lower orbital quantum number
     * @param lowerTwoJ twice the lower j
     * @return a table of that one line
     * @throws IllegalArgumentException naming the quantum number out of range, when the levels are
     *         not joined by an electric-dipole line (Delta l = +-1, Delta j = 0, +-1), or when the
     *         first level does not lie above the second in this model
     */
    public LineTable line(int upperN, int upperL, int upperTwoJ, int lowerN, int lowerL, int lowerTwoJ) {
        HydrogenLikeModel.checkLevel(upperN, upperL, upperTwoJ);
        HydrogenLikeModel.checkLevel(lowerN, lowerL, lowerTwoJ);
        if (upperN > MAX_N || lowerN > MAX_N) {
            throw new IllegalArgumentException("n must be at most " + MAX_N + ", got " + Math.max(upperN, lowerN));
        }
        if (Math.abs(upperL - lowerL) != 1 || Math.abs(upperTwoJ - lowerTwoJ) > 2) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT,
                    "%s and %s are not joined by an electric-dipole line (needs Delta l = +-1, Delta j = 0, +-1)",
                    Notation.level(upperN, upperL, upperTwoJ, -1), Notation.level(lowerN, lowerL, lowerTwoJ, -1)));
        }
        double upper = model.energy(upperN, upperL, upperTwoJ);
        double lower = model.energy(lowerN, lowerL, lowerTwoJ);
        if (!(upper > lower)) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT,
                    "%s does not lie above %s in the %s model", Notation.level(upperN, upperL, upperTwoJ, -1),
                    Notation.level(lowerN, lowerL, lowerTwoJ, -1), model.tier().id()));
        }
        LineTable.Builder lines = new LineTable.Builder();
        add(lines, upperN, upperL, upperTwoJ, lowerN, lowerL, lowerTwoJ, (upper - lower) / PhysicalConstants.H,
                RadialIntegrals.dipole(upperN, upperL, lowerN, lowerL));
        return LineTable.sorted(lines, model.nucleus().z());
    }

    /**
     * @param n    principal quantum number
     * @param l    orbital quantum number
     * @param twoJ twice j
     * @return the radiative lifetime 1 / sum(A) in s from E1 decays, and for 2s1/2 also from
     *         {@link #metastableDecayRate}; positive infinity when the level has none (see the
     *         class comment). The branching ratio of E1 decay i is
     *         {@code decays(n, l, twoJ).einsteinA(i) * lifetime(n, l, twoJ)} (for 2s1/2 they add up to
     *         less than 1: the rest goes to 1s by two photons or a magnetic-dipole photon).
     */
    public double lifetime(int n, int l, int twoJ) {
        LineTable decays = decays(n, l, twoJ);
        double total = n == 2 && l == 0 ? metastableDecayRate() : 0;
        for (int i = 0; i < decays.size(); i++) {
            total += decays.einsteinA(i);
        }
        return 1 / total;
    }

    /**
     * The decay of 2s1/2 to 1s1/2 that is not an E1 line, s^-1: two photons (2E1),
     * 8.2290 Z^6 (m_r / m_e), and one magnetic-dipole photon, 2.496e-6 Z^10 (nonrelativistic
     * two-photon rate and the leading-order M1 rate, both from memory; relativistic corrections,
     * tens of per cent for the heaviest ions, left out). For hydrogen 8.2245 s^-1, a lifetime of
     * 0.1216 s; for U XCII the M1 decay dominates, about 1e-14 s.
     *
     * @return the rate in s^-1
     */
    public double metastableDecayRate() {
        double z = model.nucleus().z();
        double electronToNucleus = PhysicalConstants.ELECTRON_MASS.value() / model.nucleus().massKg();
        return 8.2290 * Math.pow(z, 6) / (1 + electronToNucleus) + 2.496e-6 * Math.pow(z, 10);
    }

    private void addComponents(int nU, int nL, double minHertz, double maxHertz, LineTable.Builder lines) {
        for (int lU = 0; lU < nU; lU++) {
            for (int lL = lU - 1; lL <= lU + 1; lL += 2) {
                if (lL < 0 || lL >= nL || nU == nL && lL > lU) {
                    continue; // within one shell, each pair of l once
                }
                double radial = Double.NaN;
                for (int twoJU = 2 * lU - 1; twoJU <= 2 * lU + 1; twoJU += 2) {
                    for (int twoJL = 2 * lL - 1; twoJL <= 2 * lL + 1; twoJL += 2) {
                        if (twoJU < 1 || twoJL < 1 || Math.abs(twoJU - twoJL) > 2) {
                            continue;
                        }
                        double delta = model.energy(nU, lU, twoJU) - model.energy(nL, lL, twoJL);
                        double hertz = Math.abs(delta) / PhysicalConstants.H;
                        if (hertz == 0 || hertz < minHertz || hertz > maxHertz) {
                            continue;
                        }
                        if (Double.isNaN(radial)) {
                            radial = RadialIntegrals.dipole(nU, lU, nL, lL);
                        }
                        if (delta > 0) {
                            add(lines, nU, lU, twoJU, nL, lL, twoJL, hertz, radial);
                        } else {
                            add(lines, nL, lL, twoJL, nU, lU, twoJU, hertz, radial);
                        }
                    }
                }
            }
        }
    }

    private void add(LineTable.Builder lines, int nU, int lU, int twoJU, int nL, int lL, int twoJL, double hertz,
            double radial) {
        double dipole = radial * dipoleUnit;
        double s = AngularFactors.fineStructureShare(lU, twoJU, lL, twoJL) * Math.max(lU, lL) * dipole * dipole;
        if (s == 0) {
            return;
        }
        double a = aFactor * hertz * hertz * hertz * s / (twoJU + 1);
        double f = fFactor * hertz * s / (twoJL + 1);
        lines.add(nU, lU, twoJU, nL, lL, twoJL, hertz, s, a, f);
    }

    /** Whether every line n -> n' surely lies outside the window (bounds from the shells' extreme levels). */
    private boolean outside(int nU, int nL, double minHertz, double maxHertz) {
        return outside(shellBounds(nU), shellBounds(nL), nU == nL, minHertz, maxHertz);
    }

    private static boolean outside(double[] upper, double[] lower, boolean sameShell, double minHertz,
            double maxHertz) {
        double low = (upper[0] - lower[1]) / PhysicalConstants.H;
        double high = (upper[1] - lower[0]) / PhysicalConstants.H;
        double margin = 0.01 * Math.abs(high - low) + 1e-9 * Math.abs(high);
        return high + margin < minHertz || Math.max(low, 0) - margin > maxHertz || sameShell && high <= 0;
    }

    /** {lowest, highest} binding energy in shell n among s1/2, p1/2 and the top j. */
    private double[] shellBounds(int n) {
        double a = model.energy(n, 0, 1);
        double b = n > 1 ? model.energy(n, 1, 1) : a;
        double c = model.energy(n, n - 1, 2 * n - 1);
        return new double[] {Math.min(a, Math.min(b, c)), Math.max(a, Math.max(b, c))};
    }

    /**
     * @return element n: the share of the work done after the upper shells 1 to n (0 for n = 0),
     *         each pair of shells in the window weighted by n'^2 (n + n') + 1, each pair outside by 1
     */
    private double[] shares(int nMax, double minHertz, double maxHertz, boolean sameShell) {
        double[] done = work(nMax, minHertz, maxHertz, sameShell);
        double total = done[nMax];
        for (int n = 0; n <= nMax; n++) {
            done[n] = total > 0 ? done[n] / total : 1;
        }
        return done;
    }

    /**
     * The work a window of lines takes, in the units the progress of
     * {@link #components(int, double, double, DoubleConsumer)} is weighted by: each pair of shells
     * n &gt; n' whose lines can fall in the window counts n'^2 (n + n') + 1 (the exact radial
     * integrals of the pair), each pair outside 1. For an estimate before a long run; the time per
     * unit depends on the machine (about 1e-8 s on one core of a 2020s build machine).
     *
     * @param nMax       highest upper principal quantum number, 1 to {@link #MAX_N}
     * @param minHertz   lower end of the window (vacuum frequency, Hz), not negative
     * @param maxHertz   upper end of the window (Hz), above {@code minHertz}
     * @param components whether fine-structure components (which include n -&gt; n lines) or n -&gt;
     *                   n' multiplets are asked for
     * @return the work units
     */
    public double workUnits(int nMax, double minHertz, double maxHertz, boolean components) {
        checkWindow(nMax, minHertz, maxHertz);
        return work(nMax, minHertz, maxHertz, components)[nMax];
    }

    /** @return element n: the work units of the upper shells 1 to n, unnormalised */
    private double[] work(int nMax, double minHertz, double maxHertz, boolean sameShell) {
        double[][] bounds = new double[nMax + 1][];
        for (int n = 1; n <= nMax; n++) {
            bounds[n] = shellBounds(n);
        }
        double[] done = new double[nMax + 1];
        for (int nU = 1; nU <= nMax; nU++) {
            double shell = 0;
            for (int nL = 1; nL < nU || sameShell && nL == nU; nL++) {
                shell += outside(bounds[nU], bounds[nL], nU == nL, minHertz, maxHertz) ? 1
                        : (double) nL * nL * (nU + nL) + 1;
            }
            done[nU] = done[nU - 1] + shell;
        }
        return done;
    }

    private static void checkWindow(int nMax, double minHertz, double maxHertz) {
        if (nMax < 1 || nMax > MAX_N) {
            throw new IllegalArgumentException("n-max must be 1 to " + MAX_N + ", got " + nMax);
        }
        if (!(minHertz >= 0) || !(maxHertz > minHertz)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "the window must have 0 <= from < to, got %s Hz to %s Hz", minHertz, maxHertz));
        }
    }
}
