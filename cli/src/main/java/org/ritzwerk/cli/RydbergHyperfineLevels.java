package org.ritzwerk.cli;

import static org.ritzwerk.engine.hydrogenic.Notation.half;

import java.io.PrintWriter;
import java.util.List;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.refdata.AlkaliHyperfine;
import org.ritzwerk.refdata.DataContext;

/**
 * {@code levels --hyperfine --state STATE}: the F levels of one alkali level (a Rydberg level with
 * n*^-3-scaled constants, or a ground, first p, Cs 7p, Rb-85 4d3/2 or Cs 6d level with measured ones), each
 * with its energy and its shift from the hyperfine-free level, and A and B with their standard uncertainties
 * (for scaled constants including the n*^-3 law's own error; {@code -}, null in JSON, where none is stated).
 * Formatting only: the constants and F levels come from {@link DataContext#hyperfineConstants} and
 * {@link DataContext#hyperfineLevels}.
 */
final class RydbergHyperfineLevels {

    /** The option naming the level. */
    static final String STATE_OPTION = "--state";

    private RydbergHyperfineLevels() {
    }

    /**
     * @param context the data context
     * @param atoms   the alkali isotopes asked for
     * @param text    the level as given, e.g. {@code 60s1/2}
     * @param out     where the table goes
     * @param format  the table format
     * @throws OptionException when the level cannot be read, does not exist, or has no constants
     */
    static void print(DataContext context, List<AlkaliAtom> atoms, String text, PrintWriter out, Table.Format format) {
        State state = AlkaliTables.parseState(STATE_OPTION, text);
        Table table = new Table(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("label", "level"),
                Table.Column.text("hyperfine_f", "F"),
                Table.Column.text("g", "g"),
                Table.Column.number("energy_per_cm", "energy cm-1", "%.7f"),
                Table.Column.number("shift_mhz", "shift MHz", "%.6f"),
                Table.Column.number("a_mhz", "A MHz", "%.6f"),
                Table.Column.number("a_uncertainty_mhz", "u A MHz", "%.2g"),
                Table.Column.number("b_mhz", "B MHz", "%.6f"),
                Table.Column.number("b_uncertainty_mhz", "u B MHz", "%.2g"),
                Table.Column.text("constants", "constants")), out, format);
        for (AlkaliAtom atom : atoms) {
            double centroid;
            try {
                centroid = atom.level(state).energyPerCm();
            } catch (RydbergException e) {
                throw new OptionException(STATE_OPTION + ": " + e.getMessage());
            }
            HyperfineConstants constants = context.hyperfineConstants(atom.species(), state).orElseThrow(
                    () -> new OptionException(STATE_OPTION + ": no hyperfine constants for " + state.label() + " of "
                            + atom.species().notation() + " (constants are built in for the ground and first p "
                            + "levels, Cs 7p, Rb-85 4d3/2, Cs 6d and, scaled as n*^-3, for the Rydberg series of "
                            + "rydberg-hyperfine.csv)"));
            List<AlkaliHyperfine.FLevel> levels = context.hyperfineLevels(atom.species(), state);
            for (AlkaliHyperfine.FLevel f : levels) {
                table.add(atom.species().notation(), state.notation(), half(f.twoF()), f.twoF() + 1, f.energyPerCm(),
                        (f.energyPerCm() - centroid) * 100 * PhysicalConstants.C / 1e6, constants.aHertz() / 1e6,
                        constants.aUncertaintyHertz() / 1e6, constants.bHertz() / 1e6,
                        constants.bUncertaintyHertz() / 1e6, constants.source());
            }
        }
        table.finish();
    }
}
