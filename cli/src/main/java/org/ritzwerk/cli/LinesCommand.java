package org.ritzwerk.cli;

import java.util.List;
import java.util.concurrent.Callable;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.quantity.SpectralQuantity;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code ritzwerk lines}: electric-dipole lines of one-electron ions and alkali atoms, with rates. */
@Command(name = "lines",
        mixinStandardHelpOptions = true,
        header = "Electric-dipole lines of one-electron ions and alkali atoms, with their rates.",
        description = "Electric-dipole lines of one-electron ions between two spectral positions, with Einstein "
                + "A, oscillator strength and line name: fine-structure components, or n -> n' multiplets "
                + "with --multiplets. --from and --to take any unit; a wavelength without a medium is in "
                + "vacuum (write \"400 nm air\" for air). Also the neutral alkali atoms (Li-6, Li-7, Na-23, "
                + "K-39, K-40, K-41, Rb-85, Rb-87, Cs-133): lines between their levels (n <= --n-max, "
                + "l <= --l-max), one --transition in detail, or a two-photon --ladder. --hyperfine: the "
                + "F -> F' components of the D lines of alkali isotopes, each with its share of the line "
                + "strength; with --field-tesla their m_F components.",
        footer = {"", "Examples:",
            "  ritzwerk lines --species \"H I\" --from \"400 nm air\" --to \"700 nm air\" --medium air",
            "  ritzwerk lines --species \"H I,He II\" --from 4.9GHz --to 5.1GHz --n-max 200 --multiplets",
            "  ritzwerk lines --species \"C VI\" --from \"1 nm\" --to \"5 nm\" --format json",
            "  ritzwerk lines --species \"Rb-87 I\" --from 10GHz --to 20GHz --n-max 60",
            "  ritzwerk lines --species \"Rb-87 I\" --transition \"50d5/2 -> 51p3/2\"",
            "  ritzwerk lines --species \"Rb-87 I\" --ladder \"5s1/2,5p3/2,60s1/2\"",
            "  ritzwerk lines --species \"Rb-87 I\" --hyperfine --field-tesla 0.001",
            "", "Lasers (--ladder) can injure eyes and skin: read the Safety section of",
            "README.md first."})
final class LinesCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    Ions ions;

    @Mixin
    DataOptions data;

    @Option(names = "--from", paramLabel = "QUANTITY", description = "One end of the window.")
    String from;

    @Option(names = "--to", paramLabel = "QUANTITY", description = "The other end of the window.")
    String to;

    @Option(names = "--transition", paramLabel = "STATE -> STATE",
            description = "Alkali atoms: one transition in detail, e.g. \"50d5/2 -> 51p3/2\": frequency, "
                    + "wavelengths, reduced dipole matrix element, A, f, and both states' lifetimes.")
    String transition;

    @Option(names = "--ladder", paramLabel = "S1,S2,S3",
            description = "Alkali atoms: the two laser wavelengths of a ladder, e.g. \"5s1/2,5p3/2,60s1/2\", between "
                    + "fine-structure centroids; with --hyperfine, every F -> F' -> F'' path with each step's "
                    + "offset from its centroid.")
    String ladder;

    @Option(names = "--temperature", paramLabel = "K", defaultValue = "300",
            description = "With --transition: the black-body temperature of the effective lifetimes, 0 (none) to "
                    + "below 1e5 K (default: ${DEFAULT-VALUE}).")
    double temperature;

    @Option(names = "--l-max", paramLabel = "L", defaultValue = "3",
            description = "Alkali atoms: highest orbital quantum number of the levels (default: ${DEFAULT-VALUE}).")
    int lMax;

    @Option(names = "--medium", paramLabel = "MEDIUM", defaultValue = "vacuum",
            description = "Medium of the wavelength column in the table: vacuum or air (default: ${DEFAULT-VALUE}).")
    String medium;

    @Option(names = "--n-max", paramLabel = "N", defaultValue = "30",
            description = "Highest upper principal quantum number (default: ${DEFAULT-VALUE}; at most 2000).")
    int nMax;

    @Option(names = "--min-a", paramLabel = "RATE", defaultValue = "0",
            description = "Leave out lines whose Einstein A (s^-1) is below RATE (default: ${DEFAULT-VALUE}).")
    double minA;

    @Option(names = "--multiplets", description = "Blend each n -> n' transition into one line.")
    boolean multiplets;

    @Option(names = "--hyperfine",
            description = "Alkali isotopes: the F -> F' components of the D1 and D2 lines (published A, B and "
                    + "centroids); with --ladder, the ladder's F-resolved paths.")
    boolean hyperfine;

    @Option(names = HyperfineTables.FIELD_OPTION, paramLabel = "TESLA", converter = HyperfineTables.Tesla.class,
            description = "With --hyperfine: the m_F-resolved Zeeman components in this magnetic field, tesla as a "
                    + "plain number (1e-4 for 1 G; 0 to 1000; the ground level and the whole first p term "
                    + "diagonalised, so p1/2 and p3/2 mix as the field grows, up to the Paschen-Back regime), each "
                    + "with its field slope (dnu/dB).")
    Double fieldTesla;

    @Option(names = HyperfineTables.FIELD_UNCERTAINTY_OPTION, paramLabel = "TESLA",
            converter = HyperfineTables.FieldUncertainty.class,
            description = "With --field-tesla: the field's standard uncertainty, tesla as a plain number (1e-6 for "
                    + "10 mG); each component's u Hz takes |dnu/dB| times it in quadrature (first order). Default: "
                    + "the field taken as exact.")
    Double fieldUncertaintyTesla;

    @Option(names = "--intercombination",
            description = "Level lists (He I, Sr I): also the lines between terms of different spin (intercombination "
                    + "lines between singlets and triplets), the other LS rules (Delta L = 0, +-1) still applying; by "
                    + "default only the E1 and LS rules' lines.")
    boolean intercombination;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
            description = "text (aligned table), csv or json (one object per line). Default: ${DEFAULT-VALUE}.")
    Table.Format format;

    @Override
    public Integer call() {
        if (nMax < 1 || nMax > HydrogenLikeLines.MAX_N) {
            throw new OptionException("--n-max must be 1 to " + HydrogenLikeLines.MAX_N + ", got " + nMax);
        }
        OptionRules.range("--min-a", minA, 0, true, Double.MAX_VALUE, "a rate of 0 s^-1 or more (e.g. 1e6)");
        boolean air = AxisMedium.isAir(medium);
        LevelSets.Split levelSets = LevelSets.split(data.context(), ions.species);
        Ions.Atoms atoms = levelSets.levels().isEmpty() ? ions.resolveAtoms(data.context())
                : Ions.atoms(data.context(), levelSets.others(), ions.model);
        Ions.tierNotes(atoms.ions(), ions.model, "lines").forEach(spec.commandLine().getErr()::println);
        OptionRules rules = new OptionRules(spec);
        boolean single = transition != null || ladder != null;
        String singleOption = transition != null ? "--transition" : "--ladder";
        for (String option : new String[] {"--from", "--to", "--n-max", "--l-max", "--min-a", "--multiplets",
            "--medium"}) {
            rules.refuseUnless(option, !single, "with " + singleOption + " (it shapes the table of lines in a window;"
                    + " " + singleOption + " prints its states' lines in vacuum and air)");
        }
        rules.refuseUnless("--temperature", transition != null, "without --transition (it sets the black-body"
                + " temperature of the effective lifetimes --transition prints)");
        rules.refuseUnless(HyperfineTables.FIELD_UNCERTAINTY_OPTION, fieldTesla != null, "without "
                + HyperfineTables.FIELD_OPTION + " (it is that field's standard uncertainty, carried into the Zeeman "
                + "components' u Hz)");
        String listed = LevelSets.names(levelSets.levels());
        boolean lists = !levelSets.levels().isEmpty();
        rules.refuseUnless("--l-max", !atoms.alkalis().isEmpty(), (atoms.ions().isEmpty()
                ? "for species with a level list " + listed : "for one-electron ions")
                + " (--species names no alkali atom; every l of a one-electron ion is listed, and every level of a"
                + " level list)");
        String notIons = atoms.alkalis().isEmpty() ? "for species with a level list " + listed
                : lists ? "for alkali atoms and species with a level list " + listed : "for alkali atoms";
        rules.refuseUnless("--multiplets", !atoms.ions().isEmpty(), notIons + " (--species names no one-electron"
                + " ion; their lines are listed by level)");
        rules.refuseUnless("--model", !atoms.ions().isEmpty(), notIons + " (--species names no one-electron ion)");
        if (!single) {
            LevelSets.levelListsAndNMax(rules, !atoms.ions().isEmpty() || !atoms.alkalis().isEmpty(),
                    levelSets.levels(), nMax, spec.commandLine().getErr());
        }
        rules.refuseUnless("--intercombination", !levelSets.levels().isEmpty(), "without a species with a level list in"
                + " --species (it lets through the level lists' lines that the LS-coupling rules forbid)");
        if (hyperfine || fieldTesla != null) {
            return hyperfine(atoms, rules);
        }
        if (single) {
            return single(atoms);
        }
        if (from == null || to == null) {
            throw new OptionException("give --from and --to (or, for alkali atoms, --transition or --ladder)");
        }
        if (lMax < 0 || lMax > 50) {
            throw new OptionException("--l-max must be 0 to 50, got " + lMax);
        }
        SpectralQuantity one = AxisMedium.spectral("--from", from);
        SpectralQuantity two = AxisMedium.spectral("--to", to);
        if (one.toFrequency().inHertz() == two.toFrequency().inHertz()) {
            throw new OptionException("--from and --to are the same position; give a window");
        }
        double units = 0;
        double lowHz = Math.min(one.toFrequency().inHertz(), two.toFrequency().inHertz());
        double highHz = Math.max(one.toFrequency().inHertz(), two.toFrequency().inHertz());
        for (Ions.Ion ion : atoms.ions()) {
            units += HydrogenLikeLines.of(ion.model()).workUnits(nMax, lowHz, highHz, !multiplets);
        }
        WorkEstimate.hydrogenLines("lines", "the one-electron lines up to n = " + nMax + " in the window", units)
                .ifPresent(note -> {
                    spec.commandLine().getErr().println(note);
                    spec.commandLine().getErr().flush();
                });
        LineQuery query = LineQuery.defaults().withWindow(one, two).withMaxN(nMax).withMinEinsteinA(minA);
        LineSources ionSources = LineSources.none();
        for (Ions.Ion ion : atoms.ions()) {
            ionSources = ionSources.withHydrogenLike(ion.species(), ion.model());
        }
        LineSources alkaliSources = LineSources.none();
        for (AlkaliAtom atom : atoms.alkalis()) {
            alkaliSources = alkaliSources.withAlkali(atom);
        }
        LineQuery.Progress progress = progress();
        LevelSets.noteLevelsWithoutLines(levelSets.levels(), spec.commandLine().getErr());
        LineSources listSources = LevelSets.sources(data.context(), levelSets.levels(), intercombination);
        if (minA > 0 && lists) {
            LevelSets.noteLinesWithoutA(query.withMinEinsteinA(0).run(listSources), minA, spec.commandLine().getErr());
        }
        LineSet lines = LineSet.concat(List.of(query.withMultiplets(multiplets).run(ionSources, progress),
                query.withMaxL(lMax).run(alkaliSources, progress), query.run(listSources)))
                .sortedByFallingFrequency();
        // Lines of level lists carry the Ritz wavelength's standard uncertainty, alkali lines the one of their
        // levels (where estimated): a column for it then.
        boolean uncertainties = !levelSets.levels().isEmpty() || !atoms.alkalis().isEmpty();
        List<Table.Column> columns = new java.util.ArrayList<>(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("upper", "upper"),
                Table.Column.text("lower", "lower"),
                Table.Column.text("line", "line"),
                new Table.Column(air ? "air_wavelength_nm" : "vacuum_wavelength_nm",
                        air ? "air nm" : "vacuum nm", value -> String.format(java.util.Locale.ROOT, "%.6f", value)),
                new Table.Column(air ? "vacuum_wavelength_nm" : "air_wavelength_nm",
                        air ? "vacuum nm" : "air nm", value -> String.format(java.util.Locale.ROOT, "%.6f", value)),
                Table.Column.number("wavenumber_per_cm", "cm-1", "%.5f"),
                Table.Column.number("frequency_hz", "Hz", "%.9e"),
                Table.Column.number("einstein_a_per_s", "A s-1", "%.4e"),
                Table.Column.number("oscillator_strength", "f", "%.4e"),
                Table.Column.number("line_strength_au", "S (e a0)^2", "%.4e"),
                Table.Column.text("model", "model")));
        if (uncertainties) {
            columns.add(6, Table.Column.number("uncertainty_nm", "u nm", "%.1e"));
        }
        Table output = new Table(columns, spec.commandLine().getOut(), format);
        int alkaliWithout = 0;
        for (int i = 0; i < lines.size(); i++) {
            if (lines.source(i).model().equals("quantum-defect")
                    && lines.vacuumWavelengthUncertaintyMetres(i).isEmpty()) {
                alkaliWithout++;
            }
            double vacuumMetres = lines.vacuumWavelengthMetres(i);
            double airMetres = AlkaliTables.air(vacuumMetres);
            List<Object> row = new java.util.ArrayList<>(java.util.Arrays.asList(lines.species(i).notation(),
                    lines.upperLabel(i).orElse(null), lines.lowerLabel(i).orElse(null),
                    lines.name(i), (air ? airMetres : vacuumMetres) * 1e9, (air ? vacuumMetres : airMetres) * 1e9,
                    lines.wavenumberPerCm(i), lines.frequencyHz(i), lines.einsteinA(i).orElse(Double.NaN),
                    lines.oscillatorStrength(i).orElse(Double.NaN), lines.lineStrengthAtomicUnits(i).orElse(Double.NaN),
                    lines.source(i).model()));
            if (uncertainties) {
                // the vacuum value's uncertainty; in air it is smaller by the index (1.0003), below the digits shown
                row.add(6, lines.vacuumWavelengthUncertaintyMetres(i).isPresent()
                        ? lines.vacuumWavelengthUncertaintyMetres(i).getAsDouble() * 1e9 : null);
            }
            output.add(row.toArray());
        }
        output.finish();
        if (alkaliWithout > 0) {
            spec.commandLine().getErr().println("note: u nm is not estimated ('-', null in JSON) for " + alkaliWithout
                    + " alkali line(s): a level of each has no stated uncertainty (README, Rydberg states of alkali"
                    + " atoms)");
        }
        return 0;
    }

    /** --hyperfine (with --field-tesla): the D lines' hyperfine and Zeeman components (HyperfineTables). */
    private int hyperfine(Ions.Atoms atoms, OptionRules rules) {
        if (!hyperfine) {
            throw new OptionException(HyperfineTables.FIELD_OPTION + " needs --hyperfine (it gives the Zeeman"
                    + " components of the hyperfine lines)");
        }
        if (ladder != null && fieldTesla == null) {
            return hyperfineLadder(atoms, rules);
        }
        for (String option : new String[] {"--from", "--to", "--n-max", "--l-max", "--min-a", "--multiplets",
            "--transition", "--ladder", "--temperature"}) {
            rules.refuseUnless(option, false, "with --hyperfine (it lists the D lines' hyperfine components)");
        }
        if (atoms.alkalis().isEmpty() || !atoms.ions().isEmpty()) {
            throw new OptionException("--hyperfine needs alkali isotopes only in --species, e.g. \"Rb-87 I\"");
        }
        if (fieldTesla != null) {
            OptionRules.range(HyperfineTables.FIELD_OPTION, fieldTesla, 0, true, 1000, "a field of 0 to 1000 T");
        }
        if (fieldUncertaintyTesla != null) {
            OptionRules.range(HyperfineTables.FIELD_UNCERTAINTY_OPTION, fieldUncertaintyTesla, 0, true, 1000,
                    "a standard uncertainty of 0 to 1000 T");
        }
        HyperfineTables.print(data.context(), atoms.alkalis(), fieldTesla, fieldUncertaintyTesla,
                AxisMedium.isAir(medium), spec.commandLine().getOut(), format);
        for (AlkaliAtom atom : atoms.alkalis()) {
            spec.commandLine().getErr().println(HyperfineTables.sourcesNote(data.context(), atom));
        }
        if (fieldTesla != null && fieldTesla > 0) {
            for (AlkaliAtom atom : atoms.alkalis()) {
                spec.commandLine().getErr().println(HyperfineTables.diamagneticNote(atom, fieldTesla));
            }
        }
        if (fieldTesla != null) {
            spec.commandLine().getErr().println(HyperfineTables.zeemanNote(fieldUncertaintyTesla));
            spec.commandLine().getErr().flush();
        }
        return 0;
    }

    /** --ladder with --hyperfine: the ladder's F-resolved paths (HyperfineTables.ladder). */
    private int hyperfineLadder(Ions.Atoms atoms, OptionRules rules) {
        for (String option : new String[] {"--from", "--to", "--n-max", "--l-max", "--min-a", "--multiplets",
            "--transition", "--temperature"}) {
            rules.refuseUnless(option, false, "with --ladder and --hyperfine (they list the ladder's F-resolved "
                    + "paths)");
        }
        if (atoms.alkalis().size() != 1 || !atoms.ions().isEmpty()) {
            throw new OptionException("--ladder needs exactly one alkali atom in --species, e.g. \"Rb-87 I\"");
        }
        AlkaliAtom atom = atoms.alkalis().get(0);
        State[] states = AlkaliTables.ladder(ladder);
        AlkaliTables.checkRange("--ladder", atom, states);
        HyperfineTables.ladder(data.context(), atom, states, spec.commandLine().getOut(), format);
        spec.commandLine().getErr().println(HyperfineTables.ladderUncertaintyNote(data.context(), atom, states));
        AlkaliTables.edgeNote(atom, spec.commandLine().getErr(), states);
        AlkaliTables.sourcesNote(atom, spec.commandLine().getErr(), states);
        spec.commandLine().getErr().println(HyperfineTables.sourcesNote(data.context(), atom) + "; a Rydberg "
                + "level's A and B are scaled with n* (README, Hyperfine and Zeeman structure)");
        spec.commandLine().getErr().flush();
        return 0;
    }

    /** --transition or --ladder: one alkali atom's single transition or ladder. */
    private int single(Ions.Atoms atoms) {
        if (transition != null && ladder != null) {
            throw new OptionException("give --transition or --ladder, not both");
        }
        if (atoms.alkalis().size() != 1 || !atoms.ions().isEmpty()) {
            throw new OptionException((transition != null ? "--transition" : "--ladder")
                    + " needs exactly one alkali atom in --species, e.g. \"Rb-87 I\"");
        }
        OptionRules.range("--temperature", temperature, 0, true, Math.nextDown(1e5),
                "a temperature from 0 (no black-body radiation) to below 1e5 K");
        AlkaliAtom atom = atoms.alkalis().get(0);
        if (transition != null) {
            State[] pair = AlkaliTables.pair(transition);
            AlkaliTables.checkRange("--transition", atom, pair);
            // Both states' lifetimes sum over many states at high n: show a sign of life.
            try (Progress.Running running = Progress.ticking(spec.commandLine().getErr(), "lines: "
                    + atom.species().notation() + " " + transition + ": rates and lifetimes")) {
                AlkaliTables.transition(atom, pair[0], pair[1], temperature, spec.commandLine().getOut(),
                        spec.commandLine().getErr(), format, running);
            }
            for (State state : pair) {
                data.context().lifetimeChecks().miss(atom, atom.species(), state).ifPresent(miss -> spec.commandLine()
                        .getErr().println(AlkaliTables.lifetimeMissNote(atom.species(), miss)));
            }
        } else {
            State[] states = AlkaliTables.ladder(ladder);
            AlkaliTables.checkRange("--ladder", atom, states);
            AlkaliTables.ladder(atom, states, spec.commandLine().getOut(), spec.commandLine().getErr(), format);
            spec.commandLine().getErr().println("note: --ladder: the steps join fine-structure centroids; hyperfine "
                    + "structure is left out, and a laser locked to a hyperfine component is MHz to GHz away from "
                    + "them (ritzwerk lines --species \"" + atom.species().notation() + "\" --hyperfine lists the "
                    + "D-line components' offsets from the centroid; levels --hyperfine --state STATE a Rydberg "
                    + "level's F levels)");
            spec.commandLine().getErr().flush();
        }
        return 0;
    }

    /** A progress line per species, on a terminal. */
    private LineQuery.Progress progress() {
        Species[] current = {null};
        Progress[] shown = {null};
        return (species, fraction) -> {
            if (!species.equals(current[0])) {
                current[0] = species;
                shown[0] = Progress.on(spec.commandLine().getErr(), "lines: " + species.notation());
            }
            shown[0].accept(fraction);
        };
    }
}
