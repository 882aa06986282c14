package org.ritzwerk.engine.rydberg;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.function.DoubleConsumer;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;

/**
 * Electric-dipole lines of a neutral alkali atom between the levels of its model
 * ({@link AlkaliAtom}): every line in a frequency window, or one line by its two states.
 *
 * <p>Selection rules (common practice for one valence electron, LS coupling): Delta l = +-1 and
 * Delta j = 0, +-1. The oscillator strength of absorption from the lower level is
 * f = (2/3) (Delta E / E_h) S / (2 j_lower + 1), with the line strength S = |&lt;u||d||l&gt;|^2
 * in (e a0)^2 and Delta E / E_h the transition energy in hartrees (e.g. Hilborn, Am. J. Phys.
 * 50, 982 (1982), eq. 16, in atomic units).
 *
 * <p>Stateless and thread-safe (the atom is).
 */
public final class AlkaliLines {

    /** Hartree energy over h c, in cm^-1: 2 R_inf. */
    private static final double HARTREE_PER_CM = 2 * PhysicalConstants.RYDBERG.value() / 100;

    private AlkaliLines() {
    }

    /**
     * One line.
     *
     * @param atom               the atom
     * @param upper              the upper state
     * @param lower              the lower state
     * @param frequency          the line's frequency, Hz
     * @param einsteinA          the spontaneous emission rate upper -&gt; lower, s^-1
     * @param oscillatorStrength the absorption oscillator strength f (lower -&gt; upper)
     * @param lineStrength       the line strength S, (e a0)^2
     * @param frequencyUncertaintyHz the frequency's standard uncertainty, Hz, from its two levels'
     *                           ({@link AlkaliAtom#frequencyUncertaintyHz}), or NaN when not estimated;
     *                           A, f and S carry none
     */
    public record Line(AlkaliAtom atom, State upper, State lower, double frequency, double einsteinA,
            double oscillatorStrength, double lineStrength, double frequencyUncertaintyHz) {

        /**
         * A line without a frequency uncertainty.
         *
         * @param atom               the atom
         * @param upper              the upper state
         * @param lower              the lower state
         * @param frequency          the line's frequency, Hz
         * @param einsteinA          the spontaneous emission rate upper -&gt; lower, s^-1
         * @param oscillatorStrength the absorption oscillator strength f (lower -&gt; upper)
         * @param lineStrength       the line strength S, (e a0)^2
         */
        public Line(AlkaliAtom atom, State upper, State lower, double frequency, double einsteinA,
                double oscillatorStrength, double lineStrength) {
            this(atom, upper, lower, frequency, einsteinA, oscillatorStrength, lineStrength, Double.NaN);
        }

        /** @return the frequency's standard uncertainty, Hz, or empty when not estimated */
        public OptionalDouble frequencyUncertainty() {
            return Double.isNaN(frequencyUncertaintyHz) ? OptionalDouble.empty()
                    : OptionalDouble.of(frequencyUncertaintyHz);
        }

        /**
         * @return the vacuum wavelength's standard uncertainty, metres ({@code c u(nu) / nu^2}), or empty
         *         when not estimated
         */
        public OptionalDouble vacuumWavelengthUncertaintyMetres() {
            return Double.isNaN(frequencyUncertaintyHz) ? OptionalDouble.empty()
                    : OptionalDouble.of(PhysicalConstants.C * frequencyUncertaintyHz / (frequency * frequency));
        }

        /** @return the line's vacuum wavelength, metres */
        public double vacuumWavelengthMetres() {
            return PhysicalConstants.C / frequency;
        }

        /** @return "upper - lower" in spectroscopic notation, e.g. {@code 5p 2P3/2 - 5s 2S1/2} */
        public String label() {
            return upper.notation() + " - " + lower.notation();
        }
    }

    /**
     * Every E1 line between the model's levels with both levels at n &lt;= nMax and l &lt;= lMax
     * whose frequency lies in the window; levels without an energy in the model (below a
     * quantum-defect fit's validity and not measured) give no lines.
     *
     * @param atom     the atom
     * @param lowHz    window start, Hz
     * @param highHz   window end, Hz (at least lowHz)
     * @param nMax     highest n of both levels, at least 1
     * @param lMax     highest l, 0 or more
     * @param minA     smallest Einstein A kept, s^-1 (0 for all)
     * @param progress told the fraction done, 0 to 1, after each upper level; may be a no-op
     * @return the lines, highest frequency first
     */
    public static List<Line> window(AlkaliAtom atom, double lowHz, double highHz, int nMax, int lMax, double minA,
            DoubleConsumer progress) {
        Objects.requireNonNull(atom, "atom");
        Objects.requireNonNull(progress, "progress");
        if (!(lowHz <= highHz) || Double.isNaN(lowHz)) {
            throw new IllegalArgumentException("the window must run from low to high frequency, got " + lowHz + " to "
                    + highHz + " Hz");
        }
        if (nMax < 1 || lMax < 0) {
            throw new IllegalArgumentException("nMax must be at least 1 and lMax at least 0, got " + nMax + ", " + lMax);
        }
        List<Level> levels = new ArrayList<>();
        for (int n = 1; n <= nMax; n++) {
            for (int l = 0; l <= Math.min(lMax, n - 1); l++) {
                for (int twoJ = Math.max(1, 2 * l - 1); twoJ <= 2 * l + 1; twoJ += 2) {
                    if (n < atom.lowestN(l)) {
                        continue;
                    }
                    try {
                        levels.add(atom.level(State.of(n, l, twoJ)));
                    } catch (RydbergException e) {
                        // No energy for it (below a fit's validity, nothing measured): no lines either.
                    }
                }
            }
        }
        levels.sort(Comparator.comparingDouble(Level::energyPerCm));
        double hzPerCm = PhysicalConstants.C * 100;
        List<Line> found = new ArrayList<>();
        for (int u = 0; u < levels.size(); u++) {
            Level upper = levels.get(u);
            for (int k = 0; k < u; k++) {
                Level lower = levels.get(k);
                double hz = (upper.energyPerCm() - lower.energyPerCm()) * hzPerCm;
                if (hz < lowHz || hz > highHz || !isElectricDipole(upper.state(), lower.state())) {
                    continue;
                }
                Line line = line(atom, upper.state(), lower.state());
                if (line.einsteinA() >= minA) {
                    found.add(line);
                }
            }
            progress.accept((u + 1.0) / levels.size());
        }
        found.sort(Comparator.comparingDouble(Line::frequency).reversed());
        return found;
    }

    /**
     * @param a a state
     * @param b another state
     * @return whether an E1 line joins them (Delta l = 1, Delta j &lt;= 1)
     */
    public static boolean isElectricDipole(State a, State b) {
        return Math.abs(a.l() - b.l()) == 1 && Math.abs(a.twoJ() - b.twoJ()) <= 2;
    }

    /**
     * The line joining two states named in either order: the one of higher energy in the atom's
     * model is the upper state.
     *
     * @param atom the atom
     * @param a    one state
     * @param b    the other
     * @return the line's frequency, A, f and S, with its upper and lower state
     * @throws IllegalArgumentException when the two are not joined by an electric-dipole line
     * @throws RydbergException when either state has no energy in the model
     */
    public static Line between(AlkaliAtom atom, State a, State b) {
        if (!isElectricDipole(a, b)) {
            throw new IllegalArgumentException(a.notation() + " and " + b.notation()
                    + " are not joined by an electric-dipole line (needs Delta l = 1, Delta j <= 1)");
        }
        return atom.energyPerCm(a) > atom.energyPerCm(b) ? line(atom, a, b) : line(atom, b, a);
    }

    /**
     * @param atom  the atom
     * @param upper the upper state
     * @param lower the lower state
     * @return the line's frequency, A, f and S
     * @throws RydbergException when either state has no energy in the model
     */
    public static Line line(AlkaliAtom atom, State upper, State lower) {
        double hz = atom.frequencyHz(lower, upper);
        double reduced = atom.reducedDipole(upper, lower);
        double strength = reduced * reduced;
        double deltaHartree = hz / PhysicalConstants.C / 100 / HARTREE_PER_CM;
        double f = 2.0 / 3.0 * deltaHartree * strength / (lower.twoJ() + 1);
        return new Line(atom, upper, lower, hz, atom.einsteinA(upper, lower), f, strength,
                atom.frequencyUncertaintyHz(lower, upper).orElse(Double.NaN));
    }
}
