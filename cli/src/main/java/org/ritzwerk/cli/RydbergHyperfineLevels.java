package org.ritzwerk.cli;

import static org.ritzwerk.engine.hydrogenic.Notation.half;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;
import org.ritzwerk.engine.hyperfine.ZeemanState;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.RydbergException;
import org.ritzwerk.refdata.AlkaliHyperfine;
import org.ritzwerk.refdata.DataContext;

/**
 * {@code levels --hyperfine --state STATE}: the F levels of one alkali level (a Rydberg level with
 * n*^-3-scaled constants, or a ground, first p, Cs 7p, Rb 6s, Rb-85 4d3/2 or Cs 6d level with measured ones), each
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
                    () -> noConstants(context, atom, state));
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

    /**
     * {@code levels --hyperfine --state STATE --field-tesla B}: the level's Zeeman states
     * ({@link DataContext#zeemanStates}), each with its zero-field F and m_F, its shift from the hyperfine-free
     * level and the shift's standard uncertainty, its field slope and its largest |m_J m_I> component.
     *
     * @param context               the data context
     * @param atoms                 the alkali isotopes asked for
     * @param text                  the level as given, e.g. {@code 5s1/2}
     * @param fieldTesla            the field, tesla (checked)
     * @param fieldUncertaintyTesla its standard uncertainty, tesla (checked), or null when not given (exact)
     * @param out                   where the table goes
     * @param err                   where the notes go
     * @param format                the table format
     * @throws OptionException when the level cannot be read, does not exist, or has no constants
     */
    static void printZeeman(DataContext context, List<AlkaliAtom> atoms, String text, double fieldTesla,
            Double fieldUncertaintyTesla, PrintWriter out, PrintWriter err, Table.Format format) {
        State state = AlkaliTables.parseState(STATE_OPTION, text);
        List<Table.Column> columns = new ArrayList<>(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("label", "level"),
                Table.Column.text("hyperfine_f", "F"),
                Table.Column.text("m_f", "mF"),
                Table.Column.number("shift_mhz", "shift MHz", "%.6f"),
                Table.Column.number("shift_uncertainty_mhz", "u MHz", "%.2g"),
                HyperfineTables.slopeColumn("dE/dB MHz/mT"),
                Table.Column.text("m_j", "mJ"),
                Table.Column.text("m_i", "mI"),
                Table.Column.number("weight", "weight", "%.4f"),
                Table.Column.number("field_tesla", "T", "%.6g")));
        // the field's uncertainty as a column only when it is given, as lines prints it
        if (fieldUncertaintyTesla != null) {
            columns.add(Table.Column.number("field_uncertainty_tesla", "u T", "%.2g"));
        }
        Table table = new Table(columns, out, format);
        double uField = fieldUncertaintyTesla == null ? 0 : fieldUncertaintyTesla;
        List<String> mixing = new ArrayList<>();
        for (AlkaliAtom atom : atoms) {
            try {
                atom.level(state);
            } catch (RydbergException e) {
                throw new OptionException(STATE_OPTION + ": " + e.getMessage());
            }
            List<ZeemanState> states = context.zeemanStates(atom.species(), state, fieldTesla, uField);
            if (states.isEmpty()) {
                throw noConstants(context, atom, state);
            }
            for (ZeemanState z : states) {
                List<Object> row = new ArrayList<>(List.of(atom.species().notation(), state.notation(), half(z.twoF()),
                        half(z.twoMF()), z.energyHertz() / 1e6, z.energyUncertaintyHertz() / 1e6,
                        z.fieldSlopeHertzPerTesla(), z.dominant().mJLabel(), z.dominant().mILabel(),
                        z.dominant().weight(), fieldTesla));
                if (fieldUncertaintyTesla != null) {
                    row.add(fieldUncertaintyTesla);
                }
                table.add(row.toArray());
            }
            if (state.l() > 0 && fieldTesla > 0) {
                try {
                    mixing.add(String.format(Locale.ROOT, "%s %s: up to %.2g MHz", atom.species().notation(),
                            state.notation(), AlkaliHyperfine.fineStructureMixingHertz(atom, state, fieldTesla) / 1e6));
                } catch (RydbergException e) {
                    mixing.add(atom.species().notation() + " " + state.notation() + ": not estimated ("
                            + e.getMessage() + ")");
                }
            }
        }
        table.finish();
        err.println("note: each state's shift is from the level's hyperfine-free energy; u MHz holds the A and B "
                + "constants' stated uncertainties (for scaled constants with the n*^-3 law's error) and "
                + (fieldUncertaintyTesla != null ? "|dE/dB| times the field's " + HyperfineTables.fieldText(
                        fieldUncertaintyTesla) + " T (first order)" : "not the field's (taken as exact; give "
                        + HyperfineTables.FIELD_UNCERTAINTY_OPTION + ")") + ", not the level energy's own nor that of "
                + "a constant a Rydberg series' row does not give (B of Rb nP3/2, nD5/2); g_J is the Lande value, g_I "
                + "the bare nucleus'; F and mF name the zero-field state each one is followed from");
        if (!mixing.isEmpty()) {
            err.println("note: the level is diagonalised on its own: the field's mixing with its fine-structure "
                    + "partner, left out, moves the states by " + String.join("; ", mixing) + " (second order; "
                    + "lines --hyperfine --field-tesla diagonalises the whole first p term)");
        }
    }

    private static OptionException noConstants(DataContext context, AlkaliAtom atom, State state) {
        List<String> measured = context.alkaliHyperfine().constants(atom.species()).stream()
                .map(c -> c.state().label()).toList();
        return new OptionException(STATE_OPTION + ": no hyperfine constants for " + state.label() + " of "
                + atom.species().notation() + " (measured constants here for " + (measured.isEmpty() ? "no level"
                        : String.join(", ", measured)) + "; and, scaled as n*^-3, for the Rydberg levels of the "
                + "series in rydberg-hyperfine.csv)");
    }
}
