package org.ritzwerk.cli;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.function.DoubleConsumer;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.LadderExcitation;
import org.ritzwerk.engine.rydberg.Level;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.engine.rydberg.State;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;

/**
 * Electric-dipole lines of a neutral alkali atom for {@code ritzwerk lines}: all lines between
 * the model's levels in a frequency window, one transition in detail, or a two-photon ladder.
 */
final class AlkaliLines {

    /** Hartree energy over h c, for f from S: f = 2/3 (Delta E / E_h) S / g_lower (atomic units). */
    private static final double HARTREE_PER_CM = 2 * PhysicalConstants.RYDBERG.value() / 100;

    private AlkaliLines() {
    }

    /** One line: upper and lower state, frequency, A, f, S. */
    record Line(AlkaliAtom atom, State upper, State lower, double frequency, double einsteinA,
            double oscillatorStrength, double lineStrength) {
    }

    /**
     * @param atom     the atom
     * @param lowHz    window start, Hz
     * @param highHz   window end, Hz
     * @param nMax     highest n of both levels
     * @param lMax     highest l
     * @param minA     smallest Einstein A kept
     * @param progress told the fraction done
     * @return the lines in the window
     */
    static List<Line> window(AlkaliAtom atom, double lowHz, double highHz, int nMax, int lMax, double minA,
            DoubleConsumer progress) {
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
                if (hz < lowHz || hz > highHz || !allowed(upper.state(), lower.state())) {
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

    /** @return whether an E1 line joins the two states (Delta l = 1, Delta j <= 1) */
    static boolean allowed(State a, State b) {
        return Math.abs(a.l() - b.l()) == 1 && Math.abs(a.twoJ() - b.twoJ()) <= 2;
    }

    /**
     * @param atom  the atom
     * @param upper the upper state
     * @param lower the lower state
     * @return the line's figures
     */
    static Line line(AlkaliAtom atom, State upper, State lower) {
        double hz = atom.frequencyHz(lower, upper);
        double reduced = atom.reducedDipole(upper, lower);
        double strength = reduced * reduced;
        double deltaHartree = hz / PhysicalConstants.C / 100 / HARTREE_PER_CM;
        double f = 2.0 / 3.0 * deltaHartree * strength / (lower.twoJ() + 1);
        return new Line(atom, upper, lower, hz, atom.einsteinA(upper, lower), f, strength);
    }

    /**
     * @param text "A -> B" or "A - B", states like 50d5/2
     * @return the two states, as written
     */
    static State[] pair(String text) {
        String[] parts = text.split("->|-(?=\\s)|\\s-\\s");
        if (parts.length != 2) {
            throw new IllegalArgumentException("--transition takes two states, e.g. \"50d5/2 -> 51p3/2\", got '"
                    + text + "'");
        }
        return new State[] {state(parts[0], "--transition"), state(parts[1], "--transition")};
    }

    /**
     * @param text "A,B,C" or "A -> B -> C"
     * @return the three states
     */
    static State[] ladder(String text) {
        String[] parts = text.split(",|->");
        if (parts.length != 3) {
            throw new IllegalArgumentException("--ladder takes three states, e.g. \"5s1/2,5p3/2,60s1/2\", got '"
                    + text + "'");
        }
        return new State[] {state(parts[0], "--ladder"), state(parts[1], "--ladder"), state(parts[2], "--ladder")};
    }

    private static State state(String text, String option) {
        try {
            return State.parse(text.strip());
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(option + ": " + e.getMessage(), e);
        }
    }

    /** The transition table: one row, with both states' lifetimes. */
    static Table transition(AlkaliAtom atom, State a, State b, double temperature) {
        if (!allowed(a, b)) {
            throw new IllegalArgumentException("--transition: " + a.notation() + " and " + b.notation()
                    + " are not joined by an electric-dipole line (needs Delta l = 1, Delta j <= 1)");
        }
        boolean aUpper = atom.energyPerCm(a) > atom.energyPerCm(b);
        State upper = aUpper ? a : b;
        State lower = aUpper ? b : a;
        Line line = line(atom, upper, lower);
        Table table = new Table(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("upper", "upper"),
                Table.Column.text("lower", "lower"),
                Table.Column.number("frequency_hz", "Hz", "%.9e"),
                Table.Column.number("vacuum_wavelength_nm", "vacuum nm", "%.6f"),
                Table.Column.number("air_wavelength_nm", "air nm", "%.6f"),
                Table.Column.number("wavenumber_per_cm", "cm-1", "%.6f"),
                Table.Column.number("reduced_dipole_ea0", "<u||d||l> e a0", "%.5g"),
                Table.Column.number("einstein_a_per_s", "A s-1", "%.4e"),
                Table.Column.number("oscillator_strength", "f", "%.4e"),
                Table.Column.number("upper_lifetime_s", "tau_u s", "%.4e"),
                Table.Column.number("upper_effective_lifetime_s", "tau_u(T) s", "%.4e"),
                Table.Column.number("lower_lifetime_s", "tau_l s", "%.4e"),
                Table.Column.number("lower_effective_lifetime_s", "tau_l(T) s", "%.4e"),
                Table.Column.number("temperature_k", "T K", "%.1f")));
        double vacuum = PhysicalConstants.C / line.frequency();
        boolean lowerIsGround = lower.equals(atom.groundState());
        table.add(atom.species().notation(), upper.notation(), lower.notation(), line.frequency(), vacuum * 1e9,
                air(vacuum) * 1e9, line.frequency() / PhysicalConstants.C / 100, atom.reducedDipole(upper, lower),
                line.einsteinA(), line.oscillatorStrength(), atom.radiativeLifetime(upper),
                atom.effectiveLifetime(upper, temperature),
                lowerIsGround ? null : atom.radiativeLifetime(lower),
                lowerIsGround ? null : atom.effectiveLifetime(lower, temperature), temperature);
        return table;
    }

    /** The ladder table: the two steps' wavelengths. */
    static Table ladder(AlkaliAtom atom, State[] states) {
        LadderExcitation ladder = atom.ladder(states[0], states[1], states[2]);
        Table table = new Table(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("step", "step"),
                Table.Column.text("from", "from"),
                Table.Column.text("to", "to"),
                Table.Column.number("vacuum_wavelength_nm", "vacuum nm", "%.6f"),
                Table.Column.number("air_wavelength_nm", "air nm", "%.6f"),
                Table.Column.number("frequency_hz", "Hz", "%.9e")));
        table.add(atom.species().notation(), "1", states[0].notation(), states[1].notation(),
                ladder.firstVacuumMetres() * 1e9, air(ladder.firstVacuumMetres()) * 1e9, ladder.firstHz());
        table.add(atom.species().notation(), "2", states[1].notation(), states[2].notation(),
                ladder.secondVacuumMetres() * 1e9, air(ladder.secondVacuumMetres()) * 1e9, ladder.secondHz());
        return table;
    }

    /** Standard-air wavelength in metres, NaN (null in output) outside the air model. */
    static double air(double vacuumMetres) {
        try {
            return Medium.air().fromVacuum(vacuumMetres);
        } catch (MediumException e) {
            return Double.NaN;
        }
    }
}
