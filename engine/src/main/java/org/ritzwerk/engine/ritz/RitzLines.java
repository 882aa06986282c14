package org.ritzwerk.engine.ritz;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.LineList;

/**
 * Lines from levels by the Ritz combination principle: every pair of levels that the
 * electric-dipole selection rules allow gives a line whose wavenumber is the difference of the
 * two energies, {@code sigma = E_upper - E_lower}, with the standard uncertainty
 * {@code u(sigma) = sqrt(V_uu + V_ll - 2 V_ul)} from the levels' covariance V (without a
 * covariance, {@code V_ul = 0}: {@code sqrt(u_u^2 + u_l^2)}) (first-order propagation; JCGM
 * 100:2008, the Guide to the Expression of Uncertainty in Measurement, eq. 13).
 *
 * <h2>Selection rules</h2>
 * Electric-dipole (E1) rules for any atom (common practice; e.g. R. D. Cowan, The Theory of Atomic
 * Structure and Spectra, University of California Press (1981)): the parity changes; {@code Delta J = 0, +-1}; not
 * {@code J = 0 -> 0}. With {@link #withLsRules(boolean) LS rules} on, and where both labels give a
 * term, also {@code Delta S = 0}, {@code Delta L = 0, +-1}, not {@code L = 0 -> 0}; with
 * {@link #withIntercombination(boolean) intercombination lines} let through, all but
 * {@code Delta S = 0} (the spin-changing lines of intermediate coupling, such as Sr I 689.26 nm,
 * keep the orbital rules). A pair whose
 * parity or J is not known for both levels is left out: a line is given only where the rules are
 * known to allow it; {@link #levelsWithoutLines} names the levels left out so, and why. Two levels
 * at the same energy give no line.
 *
 * <h2>Transition probabilities</h2>
 * Where a companion line list ({@link #withEinsteinA(LineList)}) gives A for a pair of level labels
 * (either order), the line carries it, and, where both J are known, the absorption oscillator
 * strength {@code f = (g_u / g_l) A m_e lambda^2 / (4 pi alpha h)}, which is
 * {@code (g_u / g_l) eps0 m_e c lambda^2 A / (2 pi e^2)} with {@code eps0 = e^2 / (2 alpha h c)}
 * (R. C. Hilborn, Am. J. Phys. 50, 982 (1982), from memory; common practice; the tests check it
 * against the numerical form {@code f = 1.4992e-16 lambda^2[A] (g_u / g_l) A}), lambda
 * the vacuum wavelength, {@code g = 2J + 1}.
 *
 * <p>Immutable and thread-safe; configured with {@code withX} methods.
 */
public final class RitzLines {

    /**
     * A level the selection rules cannot be applied to, so that it gives no line: its label gives
     * no parity (no readable configuration and no odd mark: a jK or jj label such as
     * {@code 2p5(2P3/2)3s [3/2]2}, or free text), or neither its label nor its j column gives J.
     *
     * @param index  the level's index in its {@link RitzLevels}
     * @param label  its label
     * @param reason why, in words: {@code "no parity"}, {@code "no J"} or {@code "no parity and no J"}
     */
    public record LevelWithoutLines(int index, String label, String reason) {
        /**
         * Checks the fields.
         *
         * @param index  the level's index in its {@link RitzLevels}
         * @param label  its label
         * @param reason why it gives no line
         */
        public LevelWithoutLines {
            Objects.requireNonNull(label, "label");
            Objects.requireNonNull(reason, "reason");
        }
    }

    private static final RitzLines DEFAULTS = new RitzLines(false, false, 0, Double.POSITIVE_INFINITY, Map.of());

    private final boolean lsRules;
    /** With the LS rules: whether Delta S != 0 is let through (the Delta L rules kept). */
    private final boolean intercombination;
    private final double lowPerCm;
    private final double highPerCm;
    /** "upper|lower" and "lower|upper" labels -> A in s^-1. */
    private final Map<String, Double> einsteinA;

    private RitzLines(boolean lsRules, boolean intercombination, double lowPerCm, double highPerCm,
            Map<String, Double> einsteinA) {
        this.lsRules = lsRules;
        this.intercombination = intercombination;
        this.lowPerCm = lowPerCm;
        this.highPerCm = highPerCm;
        this.einsteinA = einsteinA;
    }

    /** @return parity and J rules only, every wavenumber, no transition probabilities */
    public static RitzLines defaults() {
        return DEFAULTS;
    }

    /**
     * @param on whether the LS-coupling rules apply too where both levels give a term
     * @return this job so
     */
    public RitzLines withLsRules(boolean on) {
        return new RitzLines(on, intercombination, lowPerCm, highPerCm, einsteinA);
    }

    /**
     * @param on whether, under the LS rules, lines between terms of different spin are let
     *           through (intercombination lines), the {@code Delta L} rules still applying
     * @return this job so
     */
    public RitzLines withIntercombination(boolean on) {
        return new RitzLines(lsRules, on, lowPerCm, highPerCm, einsteinA);
    }

    /**
     * @param fromPerCm the lowest wavenumber kept, cm^-1, not negative
     * @param toPerCm   the highest, cm^-1, above {@code fromPerCm} (may be infinite)
     * @return this job keeping lines in that window only
     */
    public RitzLines withWindowPerCm(double fromPerCm, double toPerCm) {
        if (!(fromPerCm >= 0) || !(toPerCm > fromPerCm) || Double.isInfinite(fromPerCm)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "a wavenumber window needs 0 <= from < to (cm-1), got %s to %s", fromPerCm, toPerCm));
        }
        return new RitzLines(lsRules, intercombination, fromPerCm, toPerCm, einsteinA);
    }

    /**
     * @param companion a line list whose rows give Einstein A with their upper and lower level
     *                  labels (rows without A or without both labels are skipped)
     * @return this job giving lines the A of the row with the same two labels
     */
    public RitzLines withEinsteinA(LineList companion) {
        Map<String, Double> a = new HashMap<>(einsteinA);
        for (int i = 0; i < companion.size(); i++) {
            if (companion.einsteinA(i).isPresent() && companion.upper(i) != null && companion.lower(i) != null) {
                double value = companion.einsteinA(i).getAsDouble();
                a.put(companion.upper(i).strip() + "|" + companion.lower(i).strip(), value);
                a.put(companion.lower(i).strip() + "|" + companion.upper(i).strip(), value);
            }
        }
        return new RitzLines(lsRules, intercombination, lowPerCm, highPerCm, Map.copyOf(a));
    }

    /**
     * The E1 rules of the class comment.
     *
     * @param a       one level
     * @param b       the other
     * @param lsRules whether the LS rules apply (where both give a term)
     * @return whether the rules are known to allow a line between them
     */
    public static boolean allowed(LevelDesignation a, LevelDesignation b, boolean lsRules) {
        return allowed(a, b, lsRules, false);
    }

    /**
     * The rules of the class comment, with intercombination lines let through or not.
     *
     * @param a                one level
     * @param b                the other
     * @param lsRules          whether the LS rules apply (where both give a term)
     * @param intercombination whether, under them, Delta S != 0 is let through
     * @return whether the rules are known to allow a line between them
     */
    public static boolean allowed(LevelDesignation a, LevelDesignation b, boolean lsRules, boolean intercombination) {
        if (!a.hasParity() || !b.hasParity() || a.parity() == b.parity() || !a.hasJ() || !b.hasJ()) {
            return false;
        }
        if (Math.abs(a.twoJ() - b.twoJ()) > 2 || a.twoJ() == 0 && b.twoJ() == 0) {
            return false;
        }
        if (lsRules && a.hasTerm() && b.hasTerm()) {
            return (intercombination || a.multiplicity() == b.multiplicity()) && Math.abs(a.l() - b.l()) <= 1
                    && !(a.l() == 0 && b.l() == 0);
        }
        return true;
    }

    /**
     * The levels that give no line whatever their partners, since the rules need a parity and a J
     * that their labels (and j columns) do not give. They are listed by the {@code lines} and
     * {@code levels} commands in a note, never dropped silently.
     *
     * @param levels the levels
     * @return those levels, in the levels' order (empty when every level gives its parity and J)
     */
    public static List<LevelWithoutLines> levelsWithoutLines(RitzLevels levels) {
        List<LevelWithoutLines> found = new ArrayList<>();
        for (int i = 0; i < levels.size(); i++) {
            LevelDesignation d = levels.designation(i);
            if (!d.hasParity() || !d.hasJ()) {
                found.add(new LevelWithoutLines(i, levels.label(i), !d.hasParity() && !d.hasJ() ? "no parity and no J"
                        : d.hasParity() ? "no J" : "no parity"));
            }
        }
        return List.copyOf(found);
    }

    /**
     * @param levels the levels
     * @return every allowed line in the window, by rising wavenumber, with the levels that give no
     *         line for want of a parity or J ({@link RitzTransitions#levelsWithoutLines()})
     */
    public RitzTransitions compute(RitzLevels levels) {
        Objects.requireNonNull(levels, "levels");
        RitzTransitions.Builder b = new RitzTransitions.Builder(levels, levelsWithoutLines(levels));
        int n = levels.size();
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double wavenumber = levels.energyPerCm(i) - levels.energyPerCm(j);
                if (!(wavenumber > 0) || wavenumber < lowPerCm || wavenumber > highPerCm
                        || !allowed(levels.designation(i), levels.designation(j), lsRules, intercombination)) {
                    continue;
                }
                double a = einsteinA.getOrDefault(levels.label(i) + "|" + levels.label(j), Double.NaN);
                double f = Double.NaN;
                LevelDesignation u = levels.designation(i);
                LevelDesignation l = levels.designation(j);
                if (!Double.isNaN(a)) {
                    double lambda = 0.01 / wavenumber;
                    f = (u.twoJ() + 1.0) / (l.twoJ() + 1.0) * a * PhysicalConstants.ELECTRON_MASS.value() * lambda * lambda
                            / (4 * Math.PI * PhysicalConstants.FINE_STRUCTURE.value() * PhysicalConstants.H);
                }
                b.add(i, j, wavenumber, levels.differenceSigma(i, j), a, f);
            }
        }
        return b.build();
    }

    @Override
    public String toString() {
        String rules = !lsRules ? "E1 rules" : intercombination ? "E1 and LS rules but Delta S" : "E1 and LS rules";
        return "RitzLines[" + rules + ", " + lowPerCm + " to " + highPerCm
                + " cm-1" + (einsteinA.isEmpty() ? "" : ", " + einsteinA.size() / 2 + " A values") + "]";
    }
}
