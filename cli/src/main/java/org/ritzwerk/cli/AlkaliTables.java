package org.ritzwerk.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalInt;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.AlkaliLines;
import org.ritzwerk.engine.rydberg.LadderExcitation;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import org.ritzwerk.refdata.LifetimeChecks;

/**
 * The alkali parts of {@code ritzwerk lines}: reading {@code --transition} and {@code --ladder}
 * and the tables of one transition in detail or a two-photon ladder. The lines themselves come
 * from the engine's {@link AlkaliLines}.
 */
final class AlkaliTables {

    private AlkaliTables() {
    }

    /**
     * @param text "A -> B" or "A - B", states like 50d5/2
     * @return the two states, as written
     */
    static State[] pair(String text) {
        String[] parts = text.split("->|-(?=\\s)|\\s-\\s");
        if (parts.length != 2) {
            throw new OptionException("--transition takes two states, e.g. \"50d5/2 -> 51p3/2\", got '"
                    + text + "'");
        }
        return new State[] {parseState("--transition", parts[0]), parseState("--transition", parts[1])};
    }

    /**
     * @param text "A,B,C" or "A -> B -> C"
     * @return the three states
     */
    static State[] ladder(String text) {
        String[] parts = text.split(",|->");
        if (parts.length != 3) {
            throw new OptionException("--ladder takes three states, e.g. \"5s1/2,5p3/2,60s1/2\", got '"
                    + text + "'");
        }
        return new State[] {parseState("--ladder", parts[0]), parseState("--ladder", parts[1]),
            parseState("--ladder", parts[2])};
    }

    /**
     * A state given to an option, within the documented range of n of {@code levels} and
     * {@code lines} (at most {@link HydrogenLikeLines#MAX_N}).
     *
     * @param option the option, for the message
     * @param text   the state, e.g. 60s1/2
     * @return the state
     * @throws OptionException naming the option when the text does not read or n is too large
     */
    static State parseState(String option, String text) {
        State state;
        try {
            state = State.parse(text.strip());
        } catch (org.ritzwerk.atom.StateParseException e) {
            throw new OptionException(option + ": " + e.getMessage(), e);
        }
        if (state.n() > HydrogenLikeLines.MAX_N) {
            throw new OptionException(option + ": " + state.notation() + " has n = " + state.n()
                    + "; states are computed for n up to " + HydrogenLikeLines.MAX_N + " (as --n-max of levels "
                    + "and lines)");
        }
        return state;
    }

    /**
     * The states of --transition and --ladder (read by {@link #parseState}, n within range) must
     * exist in the atom: n not below the lowest level of its l.
     *
     * @param option the option, for the message
     * @param atom   the atom
     * @param states the states as given
     */
    static void checkRange(String option, AlkaliAtom atom, State[] states) {
        for (State state : states) {
            if (state.n() < atom.lowestN(state.l())) {
                throw new OptionException(option + ": " + atom.species().notation() + " has no "
                        + state.notation() + " level: the lowest n of l = " + state.l() + " is "
                        + atom.lowestN(state.l()) + " (the lower shells are filled by the core)");
            }
        }
    }

    /**
     * The transition table: one row, with both states' lifetimes. The row is computed (which can
     * take a while at high n) while {@code working} runs, which is closed before anything is written;
     * a note on {@code err} after the table names the uncertainties not estimated.
     */
    static void transition(AlkaliAtom atom, State a, State b, double temperature, PrintWriter out, PrintWriter err,
            Table.Format format, Progress.Running working) {
        if (!AlkaliLines.isElectricDipole(a, b)) {
            throw new OptionException("--transition: " + a.notation() + " and " + b.notation()
                    + " are not joined by an electric-dipole line (needs Delta l = 1, Delta j <= 1)");
        }
        LineSet line = LineQuery.defaults().withTransition(a, b).run(LineSources.none().withAlkali(atom));
        State upper = line.upperState(0).orElseThrow();
        State lower = line.lowerState(0).orElseThrow();
        double vacuum = line.vacuumWavelengthMetres(0);
        boolean lowerIsGround = lower.equals(atom.groundState());
        double uHz = atom.frequencyUncertaintyHz(lower, upper).orElse(Double.NaN);
        double uDipole = atom.reducedDipoleUncertainty(upper, lower).orElse(Double.NaN);
        double uA = atom.einsteinAUncertainty(upper, lower).orElse(Double.NaN);
        double uTauUpper = atom.radiativeLifetimeUncertainty(upper).orElse(Double.NaN);
        double uTauLower = lowerIsGround ? 0 : atom.radiativeLifetimeUncertainty(lower).orElse(Double.NaN);
        double uEffectiveUpper = atom.effectiveLifetimeUncertainty(upper, temperature).orElse(Double.NaN);
        double uEffectiveLower = lowerIsGround ? 0
                : atom.effectiveLifetimeUncertainty(lower, temperature).orElse(Double.NaN);
        Object[] row = {atom.species().notation(), upper.notation(), lower.notation(), line.frequencyHz(0), uHz,
            vacuum * 1e9, line.vacuumWavelengthUncertaintyMetres(0).orElse(Double.NaN) * 1e9,
            air(vacuum) * 1e9, line.wavenumberPerCm(0), atom.reducedDipole(upper, lower),
            uDipole, line.einsteinA(0).getAsDouble(), uA, line.oscillatorStrength(0).getAsDouble(),
            atom.radiativeLifetime(upper), uTauUpper, atom.effectiveLifetime(upper, temperature), uEffectiveUpper,
            lowerIsGround ? null : atom.radiativeLifetime(lower), lowerIsGround ? null : uTauLower,
            lowerIsGround ? null : atom.effectiveLifetime(lower, temperature),
            lowerIsGround ? null : uEffectiveLower, temperature};
        working.close();
        Table table = new Table(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("upper", "upper"),
                Table.Column.text("lower", "lower"),
                Table.Column.number("frequency_hz", "Hz", "%.9e"),
                Table.Column.number("uncertainty_hz", "u Hz", "%.2g"),
                Table.Column.number("vacuum_wavelength_nm", "vacuum nm", "%.6f"),
                Table.Column.number("uncertainty_nm", "u nm", "%.1e"),
                Table.Column.number("air_wavelength_nm", "air nm", "%.6f"),
                Table.Column.number("wavenumber_per_cm", "cm-1", "%.6f"),
                Table.Column.number("reduced_dipole_ea0", "<u||d||l> e a0", "%.5g"),
                Table.Column.number("uncertainty_reduced_dipole_ea0", "u e a0", "%.2g"),
                Table.Column.number("einstein_a_per_s", "A s-1", "%.4e"),
                Table.Column.number("uncertainty_einstein_a_per_s", "u A s-1", "%.2g"),
                Table.Column.number("oscillator_strength", "f", "%.4e"),
                Table.Column.number("upper_lifetime_s", "tau_u s", "%.4e"),
                Table.Column.number("uncertainty_upper_lifetime_s", "u tau_u s", "%.2g"),
                Table.Column.number("upper_effective_lifetime_s", "tau_u(T) s", "%.4e"),
                Table.Column.number("uncertainty_upper_effective_lifetime_s", "u tau_u(T) s", "%.2g"),
                Table.Column.number("lower_lifetime_s", "tau_l s", "%.4e"),
                Table.Column.number("uncertainty_lower_lifetime_s", "u tau_l s", "%.2g"),
                Table.Column.number("lower_effective_lifetime_s", "tau_l(T) s", "%.4e"),
                Table.Column.number("uncertainty_lower_effective_lifetime_s", "u tau_l(T) s", "%.2g"),
                Table.Column.number("temperature_k", "T K", "%.1f")), out, format);
        table.add(row);
        table.finish();
        String[] names = {"u Hz", "u e a0", "u A s-1", "u tau_u s", "u tau_u(T) s", "u tau_l s", "u tau_l(T) s"};
        double[] values = {uHz, uDipole, uA, uTauUpper, uEffectiveUpper, uTauLower, uEffectiveLower};
        List<String> missing = new ArrayList<>();
        for (int i = 0; i < names.length; i++) {
            if (Double.isNaN(values[i])) {
                missing.add(names[i]);
            }
        }
        if (!missing.isEmpty()) {
            err.println("note: " + String.join(", ", missing) + ": not estimated ('-', null in JSON); a dipole "
                    + "element, its A and a lifetime carry one where published elements decide them, and where "
                    + "computed elements do only with a second model to compare (the model potential of Li, Na, K, Rb "
                    + "and Cs); u Hz needs stated uncertainties of both levels");
            err.flush();
        }
        edgeNote(atom, err, upper, lower);
        sourcesNote(atom, err, new State[] {upper, lower}, lower, upper);
    }

    /** The ladder table: the two steps' wavelengths and frequencies, with their standard uncertainties. */
    static void ladder(AlkaliAtom atom, State[] states, PrintWriter out, PrintWriter err, Table.Format format) {
        LadderExcitation ladder;
        try {
            ladder = atom.ladder(states[0], states[1], states[2]);
        } catch (IllegalArgumentException e) {
            throw new OptionException("--ladder: " + e.getMessage(), e);
        }
        Table table = new Table(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("step", "step"),
                Table.Column.text("from", "from"),
                Table.Column.text("to", "to"),
                Table.Column.number("vacuum_wavelength_nm", "vacuum nm", "%.6f"),
                Table.Column.number("air_wavelength_nm", "air nm", "%.6f"),
                Table.Column.number("frequency_hz", "Hz", "%.9e"),
                Table.Column.number("uncertainty_hz", "u Hz", "%.2g")), out, format);
        table.add(atom.species().notation(), "1", states[0].notation(), states[1].notation(),
                ladder.firstVacuumMetres() * 1e9, air(ladder.firstVacuumMetres()) * 1e9, ladder.firstHz(),
                ladder.firstUncertaintyHz());
        table.add(atom.species().notation(), "2", states[1].notation(), states[2].notation(),
                ladder.secondVacuumMetres() * 1e9, air(ladder.secondVacuumMetres()) * 1e9, ladder.secondHz(),
                ladder.secondUncertaintyHz());
        table.finish();
        List<String> without = new ArrayList<>();
        for (State state : states) {
            if (!state.equals(atom.groundState()) && atom.level(state).energyUncertaintyPerCm().isEmpty()) {
                without.add(state.notation());
            }
        }
        if (Double.isNaN(ladder.firstUncertaintyHz()) || Double.isNaN(ladder.secondUncertaintyHz())) {
            err.println("note: u Hz: not estimated ('-', null in JSON) for a step with a level whose energy has no "
                    + "stated uncertainty (" + String.join(", ", without) + "); README, standard error, says which "
                    + "levels have one");
            err.flush();
        }
        edgeNote(atom, err, states);
        sourcesNote(atom, err, states);
    }

    /**
     * What a note says of formula levels near their series' edge ({@link AlkaliAtom#seriesEdge}), after
     * naming them.
     */
    static final String EDGE_NOTE = "Rydberg-Ritz formula level(s) fewer than " + AlkaliAtom.SERIES_EDGE_WINDOW
            + " n above their series' lowest valid n, where the formula meets the tabulated levels only within 0.10 "
            + "cm-1 (3 GHz): their stated u covers the published limit and defects, not the formula's truncation, "
            + "and can be far too small there (Rb-87 10s is 0.026 cm-1 from its tabulated level, u 0.003 cm-1); "
            + "README, standard error";

    /**
     * Notes the states given that are formula levels near their series' edge, once each, in the order given;
     * nothing when none is.
     */
    static void edgeNote(AlkaliAtom atom, PrintWriter err, State... states) {
        List<String> near = new ArrayList<>();
        for (State state : states) {
            OptionalInt edge = atom.seriesEdge(state);
            String named = state.notation() + " (valid from n = " + edge.orElse(0) + ")";
            if (edge.isPresent() && !near.contains(named)) {
                near.add(named);
            }
        }
        if (!near.isEmpty()) {
            err.println("note: " + atom.species().notation() + " " + String.join(", ", near) + ": " + EDGE_NOTE);
            err.flush();
        }
    }

    /**
     * The note naming the source of each level energy behind a table (the ground level, the zero of the
     * scale, is left out) and, for the pairs given, of each dipole element.
     *
     * @param pairs lower and upper states of the dipole elements shown, two per pair; empty for none
     */
    static void sourcesNote(AlkaliAtom atom, PrintWriter err, State[] states, State... pairs) {
        // levels with one source (two formula levels of one set) are named together before it
        java.util.Map<String, List<String>> bySource = new java.util.LinkedHashMap<>();
        for (State state : states) {
            List<String> named = bySource.computeIfAbsent(atom.energySource(state), k -> new ArrayList<>());
            if (!state.equals(atom.groundState()) && !named.contains(state.notation())) {
                named.add(state.notation());
            }
        }
        List<String> items = new ArrayList<>();
        bySource.forEach((source, named) -> {
            if (!named.isEmpty()) {
                items.add(String.join(", ", named) + (named.size() > 1 ? " energies: " : " energy: ") + source);
            }
        });
        for (int i = 0; i + 1 < pairs.length; i += 2) {
            State a = pairs[i];
            State b = pairs[i + 1];
            items.add(a.notation() + " - " + b.notation() + " dipole element: " + atom.publishedDipole(a, b)
                    .map(d -> d.source()).orElse("Coulomb approximation (computed; no published element listed)"));
        }
        if (pairs.length > 0) {
            items.add("lifetimes: the sum over each level's decay channels, each with a published element where one "
                    + "is listed, else the Coulomb approximation");
        }
        err.println("note: " + atom.species().notation() + " sources: " + String.join("; ", items));
        err.flush();
    }

    /** Standard-air wavelength in metres, NaN (null in output) outside the air model. */
    /**
     * The note for a level whose computed lifetime misses its measurement beyond its stated uncertainty
     * ({@code LifetimeChecks.miss}).
     */
    static String lifetimeMissNote(Species species, LifetimeChecks.Miss miss) {
        LifetimeChecks.Measured m = miss.measured();
        return String.format(Locale.ROOT, "note: %s %s: the computed lifetime %.4g +- %.2g ns (0 K) is %.0f %% %s the "
                + "measured %s%s ns (%s; %s): more than %.0f times the combined uncertainty, which the stated u does "
                + "not cover (rydberg/lifetime-checks.csv; README, Rydberg states of alkali atoms)",
                species.notation(),
                miss.state().label(), miss.computedSeconds() * 1e9, miss.uncertaintySeconds() * 1e9,
                Math.abs(100 * miss.relative()), miss.relative() < 0 ? "short of" : "above", m.valueText(),
                m.uncertainty().isPresent()
                        ? String.format(Locale.ROOT, " +- %.2g", m.uncertainty().getAsDouble() * 1e9) : "",
                m.source(), m.provenance().id(), LifetimeChecks.COVERAGE);
    }

    static double air(double vacuumMetres) {
        try {
            return Medium.air().fromVacuum(vacuumMetres);
        } catch (MediumException e) {
            return Double.NaN;
        }
    }
}
