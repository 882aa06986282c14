package org.ritzwerk.cli;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.concurrent.Callable;
import java.util.function.DoubleConsumer;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.hydrogenic.Notation;
import org.ritzwerk.engine.levels.LevelQuery;
import org.ritzwerk.engine.levels.LevelSet;
import org.ritzwerk.engine.levels.LevelSources;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.DataLevels;
import org.ritzwerk.refdata.LifetimeChecks;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code ritzwerk levels}: energy levels of one-electron ions and alkali atoms. */
@Command(name = "levels",
        mixinStandardHelpOptions = true,
        header = "Energy levels of one-electron ions, alkali atoms and species with a level list.",
        description = "Energy levels of one-electron ions (H I, D I, He II, C VI, ... U XCII), in cm-1 above "
                + "the ground state, under a chosen model: bohr (reduced mass), dirac (fine structure and "
                + "recoil), qed (plus the leading Lamb shift and nuclear size), hyperfine (plus s-level "
                + "hyperfine structure). Nuclear data from the built-in set (AME2020 masses, ...). Also the "
                + "neutral alkali atoms (Li-6, Li-7, Na-23, K-39, K-40, K-41, Rb-85, Rb-87, Cs-133): measured "
                + "low levels and quantum-defect (Rydberg-Ritz) levels up to --n-max, l <= --l-max; the model "
                + "column says where each energy comes from. Species with a level list (He I, Sr I, or a "
                + "ritzwerk-levels file given with --data) show every listed level.",
        footer = {"", "Examples:",
            "  ritzwerk levels --species \"H I\" --n-max 3",
            "  ritzwerk levels --species D --model hyperfine --n-max 2 --format json",
            "  ritzwerk levels --species \"He II\" --n-max 3 --lifetimes",
            "  ritzwerk levels --species \"Rb-87 I\" --n-max 80 --format json",
            "  ritzwerk levels --species \"Rb-87 I\" --hyperfine --state 5s1/2 --field-tesla 1e-4",
            "  ritzwerk levels --species \"Cs I\" --n-max 40 --l-max 1 --lifetimes --temperature 300"})
final class LevelsCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    Ions ions;

    @Mixin
    DataOptions data;

    @Option(names = "--n-max", paramLabel = "N",
            description = "Highest principal quantum number (default: 4, and for alkali atoms two above the ground "
                    + "level's n, e.g. 7 for Rb, so the ground and first p levels show; at most 2000).")
    Integer nMax;

    @Option(names = "--lifetimes",
            description = "Add each level's radiative lifetime from its E1 decays: null for 1s; for 2s1/2 of "
                    + "one-electron ions, which has no E1 decay, its two-photon and magnetic-dipole decays to 1s "
                    + "(0.1216 s in H); other M1, E2 and two-photon decays are left out. Alkali atoms also get "
                    + "'u lifetime s': the published dipole elements' uncertainty and, for computed elements, the "
                    + "spread between the Coulomb approximation and the model potential (a model-spread estimate; "
                    + "about 6 to 8 %% for s and d, 22 %% for Rydberg p states).")
    boolean lifetimes;

    @Option(names = "--l-max", paramLabel = "L", defaultValue = "3",
            description = "Alkali atoms: highest orbital quantum number listed (default: ${DEFAULT-VALUE}).")
    int lMax;

    @Option(names = "--temperature", paramLabel = "K",
            description = "Alkali atoms with --lifetimes: also the effective lifetime with black-body radiation at "
                    + "this temperature, 0 (no black-body radiation: the spontaneous lifetime) to below 1e5 K "
                    + "(bound states only; photoionisation left out), with its uncertainty 'u at T s' made as "
                    + "'u lifetime s'.")
    Double temperature;

    @Option(names = "--hyperfine",
            description = "Alkali isotopes: split the levels with published hyperfine constants (the ground and "
                    + "first p levels, Cs 7p, Rb 6s, Rb-85 4d3/2, Cs 6d, and Rydberg series with n*^-3-scaled "
                    + "constants) "
                    + "into their F levels, "
                    + "each with its energy (Casimir formula with A and B) and g = 2F + 1.")
    boolean hyperfine;

    @Option(names = RydbergHyperfineLevels.STATE_OPTION, paramLabel = "STATE",
            description = "With --hyperfine: only this alkali level (e.g. 60s1/2, 7s1/2, 5p3/2), split into its F "
                    + "levels with their shift from the hyperfine-free level in MHz and the A and B used (measured "
                    + "for the ground and first p levels, Cs 7p, Rb 6s, Rb-85 4d3/2 and Cs 6d, scaled as n*^-3 for "
                    + "Rydberg "
                    + "series); with --field-tesla its Zeeman states instead.")
    String state;

    @Option(names = HyperfineTables.FIELD_OPTION, paramLabel = "TESLA", converter = HyperfineTables.Tesla.class,
            description = "With --state: the level's Zeeman states in this magnetic field, tesla as a plain number "
                    + "(1e-4 for 1 G; 0 to 1000): its hyperfine-Zeeman Hamiltonian diagonalised (Breit-Rabi for "
                    + "J = 1/2), each state's shift from the hyperfine-free level, its uncertainty and field slope.")
    Double fieldTesla;

    @Option(names = HyperfineTables.FIELD_UNCERTAINTY_OPTION, paramLabel = "TESLA",
            converter = HyperfineTables.FieldUncertainty.class,
            description = "With --field-tesla: the field's standard uncertainty, tesla as a plain number (1e-6 for "
                    + "10 mG); each state's uncertainty takes |dE/dB| times it in quadrature (first order). "
                    + "Default: the field taken as exact.")
    Double fieldUncertaintyTesla;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
            description = "text (aligned table), csv or json (one object per line). Default: ${DEFAULT-VALUE}.")
    Table.Format format;

    @Override
    public Integer call() {
        if (nMax != null && (nMax < 1 || nMax > 2000)) {
            throw new OptionException("--n-max must be 1 to 2000, got " + nMax);
        }
        List<Table.Column> columns = new ArrayList<>(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("label", "level"),
                Table.Column.text("n", "n"),
                Table.Column.text("l", "l"),
                Table.Column.text("j", "j"),
                Table.Column.text("hyperfine_f", "F"),
                Table.Column.text("g", "g"),
                Table.Column.number("energy_per_cm", "energy cm-1", "%.7f"),
                Table.Column.number("uncertainty_per_cm", "u cm-1", "%.2g"),
                Table.Column.text("model", "model")));
        if (temperature != null) {
            OptionRules.range("--temperature", temperature, 0, true, Math.nextDown(1e5),
                    "a temperature from 0 (no black-body radiation) to below 1e5 K");
        }
        if (lMax < 0 || lMax > 50) {
            throw new OptionException("--l-max must be 0 to 50, got " + lMax);
        }
        LevelSets.Split levelSets = LevelSets.split(data.context(), ions.species);
        Ions.Atoms atoms = levelSets.levels().isEmpty() ? ions.resolveAtoms(data.context())
                : Ions.atoms(data.context(), levelSets.others(), ions.model);
        Ions.tierNotes(atoms.ions(), ions.model, "levels").forEach(spec.commandLine().getErr()::println);
        OptionRules rules = new OptionRules(spec);
        rules.refuseUnless("--lifetimes", levelSets.levels().isEmpty(), "for species with a level list "
                + levelSets.levels().stream().map(l -> l.species().notation()).toList() + " (a level list gives no"
                + " lifetimes)");
        boolean alkali = !atoms.alkalis().isEmpty();
        boolean computed = alkali || !atoms.ions().isEmpty();
        rules.refuseUnless("--n-max", computed, "for species with a level list " + LevelSets.names(levelSets.levels())
                + " (every listed level is shown; n is not read from the labels)");
        if (computed && !levelSets.levels().isEmpty() && nMax != null) {
            spec.commandLine().getErr().println("note: --n-max " + nMax + " limits the computed species' levels, not"
                    + " those of " + LevelSets.names(levelSets.levels()) + " (every listed level is shown)");
        }
        int highestN = nMax != null ? nMax
                : Math.max(4, atoms.alkalis().stream().mapToInt(a -> a.groundState().n() + 2).max().orElse(4));
        rules.refuseUnless("--temperature", lifetimes, "without --lifetimes (it sets the black-body temperature of the"
                + " effective lifetimes)");
        String listed = levelSets.levels().stream().map(l -> l.species().notation()).toList().toString();
        String notAlkali = atoms.ions().isEmpty() ? "for species with a level list " + listed : "for one-electron ions";
        rules.refuseUnless("--temperature", alkali, notAlkali + " (--species names no alkali atom; the"
                + " effective lifetimes are computed for alkali atoms)");
        rules.refuseUnless("--l-max", alkali, notAlkali + " (--species names no alkali atom; every l of a"
                + " one-electron ion up to n - 1 is listed, and every level of a level list)");
        rules.refuseUnless("--hyperfine", alkali, atoms.ions().isEmpty()
                ? "for species with a level list " + listed + " (a level list carries no hyperfine constants;"
                        + " --hyperfine splits the levels of alkali atoms)"
                : "for one-electron ions (--species names no alkali atom; give --model hyperfine for their F levels)");
        if (hyperfine) {
            for (AlkaliAtom atom : atoms.alkalis()) {
                if (data.context().alkaliHyperfine().constants(atom.species()).isEmpty()) {
                    throw new OptionException("--hyperfine: no hyperfine constants for " + atom.species().notation()
                            + "; isotopes with constants: " + String.join(", ", data.context().alkaliHyperfine()
                                    .species().stream().map(org.ritzwerk.atom.Species::notation).toList()));
                }
            }
        }
        rules.refuseUnless(HyperfineTables.FIELD_OPTION, state != null, "without " + RydbergHyperfineLevels.STATE_OPTION
                + " (it gives the Zeeman states of one level: --hyperfine --state 5s1/2 --field-tesla 1e-4)");
        rules.refuseUnless(HyperfineTables.FIELD_UNCERTAINTY_OPTION, fieldTesla != null, "without "
                + HyperfineTables.FIELD_OPTION + " (it is that field's standard uncertainty)");
        if (state != null) {
            rules.refuseUnless(RydbergHyperfineLevels.STATE_OPTION, hyperfine && alkali && atoms.ions().isEmpty()
                    && levelSets.levels().isEmpty() && !lifetimes, "without --hyperfine, for other species than alkali "
                    + "atoms, or with --lifetimes (it lists the F levels of one alkali level)");
            for (String listing : List.of("--n-max", "--l-max", "--model")) {
                rules.refuseUnless(listing, false, "with " + RydbergHyperfineLevels.STATE_OPTION + " (it lists the one "
                        + "level it names)");
            }
            if (fieldTesla != null) {
                OptionRules.range(HyperfineTables.FIELD_OPTION, fieldTesla, 0, true, 1000, "a field of 0 to 1000 T");
                if (fieldUncertaintyTesla != null) {
                    OptionRules.range(HyperfineTables.FIELD_UNCERTAINTY_OPTION, fieldUncertaintyTesla, 0, true, 1000,
                            "a standard uncertainty of 0 to 1000 T");
                }
                RydbergHyperfineLevels.printZeeman(data.context(), atoms.alkalis(), state, fieldTesla,
                        fieldUncertaintyTesla, spec.commandLine().getOut(), spec.commandLine().getErr(), format);
                return 0;
            }
            RydbergHyperfineLevels.print(data.context(), atoms.alkalis(), state, spec.commandLine().getOut(), format);
            return 0;
        }
        rules.refuseUnless("--model", !atoms.ions().isEmpty(), alkali
                ? "for alkali atoms (--species names no one-electron ion; the model column says where each alkali"
                        + " energy comes from)"
                : "for species with a level list " + listed + " (--species names no one-electron ion; their"
                        + " energies are the list's)");
        if (lifetimes) {
            WorkEstimate.hydrogenLifetimes(highestN, atoms.ions().size()).ifPresent(note -> {
                spec.commandLine().getErr().println(note);
                spec.commandLine().getErr().flush();
            });
        }
        LevelSources sources = LevelSources.none();
        for (Ions.Ion ion : atoms.ions()) {
            sources = sources.withHydrogenLike(ion.species(), ion.model());
        }
        for (AlkaliAtom atom : atoms.alkalis()) {
            sources = sources.withAlkali(atom, DataLevels.hyperfine(data.context(), atom.species()),
                    DataLevels.hyperfineModel(data.context(), atom.species()));
        }
        for (RitzLevels set : levelSets.levels()) {
            sources = sources.withLevels(set);
        }
        LevelQuery query = LevelQuery.defaults().withMaxN(highestN).withMaxL(lMax).withLifetimes(lifetimes)
                .withHyperfine(hyperfine);
        if (temperature != null) {
            query = query.withBlackBodyTemperature(temperature);
        }
        LevelSets.noteLevelsWithoutLines(levelSets.levels(), spec.commandLine().getErr());
        // alkali lifetimes carry an uncertainty: published elements' and, for computed ones, the model spread
        boolean lifetimeSigmas = lifetimes && alkali;
        if (lifetimes) {
            columns.add(Table.Column.number("lifetime_s", "lifetime s", "%.5e"));
            if (lifetimeSigmas) {
                columns.add(Table.Column.number("uncertainty_lifetime_s", "u lifetime s", "%.2g"));
            }
            if (temperature != null) {
                columns.add(Table.Column.number("effective_lifetime_s", "at T s", "%.5e"));
                if (lifetimeSigmas) {
                    columns.add(Table.Column.number("uncertainty_effective_lifetime_s", "u at T s", "%.2g"));
                }
            }
        }
        Table table = new Table(columns, spec.commandLine().getOut(), format);
        Map<Species, List<String>> unsplit = new java.util.LinkedHashMap<>();
        // alkali levels whose energy has no estimated uncertainty (shown '-'), to say so once per species
        java.util.Set<Species> alkaliSpecies = new java.util.HashSet<>();
        atoms.alkalis().forEach(atom -> alkaliSpecies.add(atom.species()));
        Map<Species, AlkaliAtom> atomOf = new HashMap<>();
        atoms.alkalis().forEach(atom -> atomOf.put(atom.species(), atom));
        // formula levels near their series' edge, where the stated u says least (AlkaliAtom.seriesEdge)
        Map<Species, List<String>> nearEdge = new java.util.LinkedHashMap<>();
        Map<Species, List<String>> notEstimated = new java.util.LinkedHashMap<>();
        Map<Species, Integer> lifetimeNotEstimated = new java.util.LinkedHashMap<>();
        Map<Species, java.util.Set<State>> listedStates = new HashMap<>();
        Map<Species, DoubleConsumer> progress = new HashMap<>();
        query.run(sources, (species, fraction) -> progress.computeIfAbsent(species, s -> Progress.on(
                spec.commandLine().getErr(), "levels: " + s.notation() + (lifetimes ? " lifetimes" : "")))
                .accept(fraction), part -> {
                    for (int i = 0; i < part.size(); i++) {
                        List<Object> row = new ArrayList<>(Arrays.asList(part.species(i).notation(), part.label(i),
                                boxed(part.n(i)), boxed(part.l(i)),
                                part.twoJ(i).isPresent() ? Notation.half(part.twoJ(i).getAsInt()) : null,
                                part.twoF(i).isPresent() ? Notation.half(part.twoF(i).getAsInt()) : null,
                                boxed(part.statisticalWeight(i)), part.energyPerCm(i),
                                boxed(part.energyUncertaintyPerCm(i)), part.model(i)));
                        if (lifetimes) {
                            row.add(boxed(part.lifetimeSeconds(i)));
                            if (lifetimeSigmas) {
                                row.add(boxed(part.lifetimeUncertaintySeconds(i)));
                                if (part.lifetimeSeconds(i).isPresent() && part.lifetimeUncertaintySeconds(i).isEmpty()
                                        && alkaliSpecies.contains(part.species(i))) {
                                    lifetimeNotEstimated.merge(part.species(i), 1, Integer::sum);
                                }
                            }
                            if (temperature != null) {
                                row.add(boxed(part.effectiveLifetimeSeconds(i)));
                                if (lifetimeSigmas) {
                                    row.add(boxed(part.effectiveLifetimeUncertaintySeconds(i)));
                                }
                            }
                        }
                        table.add(row.toArray());
                        if (part.energyUncertaintyPerCm(i).isEmpty() && alkaliSpecies.contains(part.species(i))) {
                            notEstimated.computeIfAbsent(part.species(i), k -> new ArrayList<>()).add(part.label(i));
                        }
                        AlkaliAtom atom = atomOf.get(part.species(i));
                        if (atom != null && part.n(i).isPresent() && part.l(i).isPresent()
                                && part.twoJ(i).isPresent()) {
                            State state = new State(part.n(i).getAsInt(), part.l(i).getAsInt(),
                                    part.twoJ(i).getAsInt());
                            listedStates.computeIfAbsent(part.species(i), k -> new java.util.HashSet<>()).add(state);
                            List<String> near = nearEdge.computeIfAbsent(part.species(i), k -> new ArrayList<>());
                            if (atom.seriesEdge(state).isPresent() && !near.contains(state.notation())) {
                                near.add(state.notation());
                            }
                        }
                        if (hyperfine && part.twoF(i).isEmpty() && atoms.ions().isEmpty()) {
                            unsplit.computeIfAbsent(part.species(i), k -> new ArrayList<>()).add(part.label(i));
                        }
                    }
                    for (LevelSet.Omission omitted : part.omissions()) {
                        spec.commandLine().getErr().println("note: " + omitted.species().notation() + ": "
                                + omitted.count() + " level(s) with " + omitted.reason() + " are not listed (first: "
                                + omitted.first() + "); they are not extrapolated");
                        spec.commandLine().getErr().flush();
                    }
                });
        table.finish();
        notEstimated.forEach((species, labels) -> spec.commandLine().getErr().println("note: " + species.notation()
                + ": u cm-1 is not estimated ('-', null in JSON) for " + labels.size() + " level(s) (first: "
                + labels.get(0) + "): no uncertainty is stated for their series' quantum defects or the ionisation"
                + " limit, or they are core-polarization, hydrogenic or hyperfine F levels; README, Rydberg states of"
                + " alkali atoms, says which levels have one"));
        nearEdge.forEach((species, states) -> {
            if (!states.isEmpty()) {
                spec.commandLine().getErr().println("note: " + species.notation() + ": " + states.size()
                        + " level(s) (" + String.join(", ", states.subList(0, Math.min(8, states.size())))
                        + (states.size() > 8 ? ", ..." : "") + ") are " + AlkaliTables.EDGE_NOTE);
            }
        });
        lifetimeNotEstimated.forEach((species, count) -> spec.commandLine().getErr().println("note: "
                + species.notation() + ": u lifetime s is not estimated ('-', null in JSON) for " + count + " level(s):"
                + " a lifetime carries one where published dipole elements decide its decay channels, and where"
                + " computed elements do only with a second model to compare (the model potential of Li, Na, K, Rb"
                + " and Cs); README, Accuracy, says how it is made"));
        if (lifetimes) {
            // computed lifetimes known to miss their measurement beyond the stated u (rydberg/lifetime-checks.csv)
            for (AlkaliAtom atom : atoms.alkalis()) {
                java.util.Set<State> shown = listedStates.getOrDefault(atom.species(), java.util.Set.of());
                for (LifetimeChecks.Miss miss : data.context().lifetimeChecks().misses(atom, atom.species())) {
                    if (shown.contains(miss.state())) {
                        spec.commandLine().getErr().println(AlkaliTables.lifetimeMissNote(atom.species(), miss));
                    }
                }
            }
        }
        unsplit.forEach((species, labels) -> spec.commandLine().getErr().println("note: " + species.notation()
                + ": no hyperfine constants for " + labels.size() + " level(s), listed unsplit (F -): "
                + String.join(", ", labels.subList(0, Math.min(8, labels.size()))) + (labels.size() > 8 ? ", ..." : "")
                + "; README, Built-in reference data, names the levels that have them"));
        return 0;
    }

    private static Integer boxed(OptionalInt value) {
        return value.isPresent() ? value.getAsInt() : null;
    }

    private static Double boxed(OptionalDouble value) {
        return value.isPresent() ? value.getAsDouble() : null;
    }
}
