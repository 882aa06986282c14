package org.ritzwerk.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.pair.DispersionCoefficient;
import org.ritzwerk.engine.pair.DispersionManifold;
import org.ritzwerk.engine.pair.PairInteractions;
import org.ritzwerk.engine.pair.PairState;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.stark.AutlerTownes;
import org.ritzwerk.engine.stark.Electrometry;
import org.ritzwerk.engine.stark.Polarizability;
import org.ritzwerk.engine.stark.PolarizabilityCalculator;
import org.ritzwerk.engine.stark.ResonantTransition;
import org.ritzwerk.engine.stark.StarkMap;
import org.ritzwerk.engine.stark.StarkMapResult;
import org.ritzwerk.refdata.OutputFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code ritzwerk rydberg}: alkali Rydberg atoms in fields and in pairs. Each subcommand parses its
 * options into an engine job (engine packages {@code stark} and {@code pair}), runs it and writes
 * the result with {@link Table}.
 */
@Command(name = "rydberg",
        mixinStandardHelpOptions = true,
        header = "Alkali Rydberg atoms in static and microwave fields, and in pairs.",
        description = "Stark maps, static polarizabilities, microwave (Autler-Townes) electrometry and the "
                + "interaction of two Rydberg atoms (C3, C6, blockade radius), for the alkali atoms with built-in "
                + "quantum defects (Li-6, Li-7, Na-23, K-39, K-40, K-41, Rb-85, Rb-87, Cs-133) or a --data file.",
        footer = {"", "Examples:",
            "  ritzwerk rydberg polarizability --species \"Rb-87 I\" --state 60s1/2",
            "  ritzwerk rydberg stark-map --species \"Rb-87 I\" --state 50d5/2 --mj 1/2 --field-max 2",
            "  ritzwerk rydberg pair --species \"Rb-87 I\" --state 70s1/2 --rabi 1",
            "  ritzwerk rydberg microwave --species \"Rb-87 I\" --state 50d5/2 --to 51p3/2 --splitting 10",
            "  ritzwerk rydberg microwave --species \"Rb-87 I\" --state 50d5/2 --near 17 --window 1"},
        subcommands = {RydbergCommand.Polarize.class, RydbergCommand.Map.class, RydbergCommand.Pair.class,
            RydbergCommand.Microwave.class, PairPotentialCommand.class})
final class RydbergCommand implements Runnable {

    @Spec
    CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    /** The options every subcommand shares: the atom, the state and the output format. */
    static final class Common {
        @Mixin
        DataOptions data;

        @Option(names = "--species", paramLabel = "SPECIES", required = true,
                description = "The alkali atom, e.g. \"Rb-87 I\" or \"Cs I\".")
        String species;

        @Option(names = "--state", paramLabel = "STATE", required = true,
                description = "The Rydberg state as n, the letter of l and j, e.g. 60s1/2, 50d5/2, 43p3/2.")
        String state;

        @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
                description = "text (aligned table), csv or json (one object per line). Default: ${DEFAULT-VALUE}.")
        Table.Format format;

        AlkaliAtom atom() {
            Ions.Atoms atoms = Ions.atoms(data.context(), List.of(species), "qed");
            if (atoms.alkalis().size() != 1 || !atoms.ions().isEmpty()) {
                throw new OptionException("--species must name one alkali atom (e.g. \"Rb-87 I\"), got '" + species
                        + "'");
            }
            return atoms.alkalis().get(0);
        }

        State state() {
            return AlkaliTables.parseState("--state", state);
        }
    }

    /**
     * @param option the option, for the message
     * @param text   m_j as a half-integer, e.g. 1/2, -3/2
     * @param state  the state it must be a projection of
     * @return twice m_j
     */
    static int parseProjection(String option, String text, State state) {
        String t = text.strip();
        int twice;
        try {
            if (t.endsWith("/2")) {
                twice = Integer.parseInt(t.substring(0, t.length() - 2).strip());
            } else {
                twice = 2 * Integer.parseInt(t);
            }
        } catch (NumberFormatException e) {
            throw new OptionException(option + " must be a half-integer such as 1/2 or -3/2, got '" + text + "'", e);
        }
        if (Math.abs(twice) > state.twoJ() || ((twice + state.twoJ()) & 1) != 0) {
            throw new OptionException(option + " " + text + " is not a projection of j = " + state.twoJ() + "/2 of "
                    + state.label() + " (allowed: -" + state.twoJ() + "/2 to " + state.twoJ() + "/2 in steps of 1)");
        }
        return twice;
    }

    private static String half(int twice) {
        return (twice & 1) == 0 ? Integer.toString(twice / 2) : twice + "/2";
    }

    /** {@code rydberg polarizability}. */
    @Command(name = "polarizability", mixinStandardHelpOptions = true,
            description = "Static scalar and tensor polarizabilities of a state by second-order perturbation "
                    + "theory over the dipole-coupled states n - range to n + range; the shift in a field F "
                    + "along z is -alpha(m_j) F^2 / 2.")
    static final class Polarize implements Callable<Integer> {
        @Spec
        CommandSpec spec;

        @Mixin
        Common common;

        @Option(names = "--range", paramLabel = "N", defaultValue = "20",
                description = "The n' range of the sum, 1 to 200 (default: ${DEFAULT-VALUE}).")
        int range;

        @Override
        public Integer call() {
            if (range < 1 || range > 200) {
                throw new OptionException("--range must be 1 to 200, got " + range);
            }
            State state = common.state();
            AlkaliAtom atom = common.atom();
            Polarizability p = PolarizabilityCalculator.of(atom).withNeighbourRange(range).compute(state);
            Table table = new Table(List.of(Table.Column.text("state", "state"),
                    Table.Column.number("effective_n", "n*", "%.5f"),
                    Table.Column.number("alpha0_au", "alpha0 a.u.", "%.6e"),
                    Table.Column.number("alpha2_au", "alpha2 a.u.", "%.6e"),
                    Table.Column.number("alpha0_mhz_per_v_per_cm_sq", "alpha0 MHz/(V/cm)^2", "%.6g"),
                    Table.Column.number("alpha2_mhz_per_v_per_cm_sq", "alpha2 MHz/(V/cm)^2", "%.6g"),
                    Table.Column.text("states_summed", "states")), spec.commandLine().getOut(), common.format);
            table.add(state.label(), atom.level(state).effectiveN(), p.scalarAu(), p.tensorAu(),
                    p.scalarMHzPerVPerCmSquared(), p.tensorMHzPerVPerCmSquared(), p.statesSummed());
            table.finish();
            return 0;
        }
    }

    /** {@code rydberg stark-map}. */
    @Command(name = "stark-map", mixinStandardHelpOptions = true,
            description = "Energies of one atom in a static field along z from 0 to --field-max, by diagonalisation "
                    + "in the basis n-min to n-max (default: from one below the lower of n and round(n*) to one "
                    + "above the higher, so the nearest hydrogenic manifold is in), l up to --l-max, at one m_j. "
                    + "One row per field and eigenstate within --window of the state: energy relative to the state "
                    + "at zero field, and the state's share in the eigenstate.")
    static final class Map implements Callable<Integer> {
        @Spec
        CommandSpec spec;

        @Mixin
        Common common;

        @Option(names = "--mj", paramLabel = "MJ", defaultValue = "1/2",
                description = "m_j of the map, a half-integer (default: ${DEFAULT-VALUE}).")
        String mj;

        @Option(names = "--n-min", paramLabel = "N", description = "Lowest n of the basis (default: see above).")
        Integer nMin;

        @Option(names = "--n-max", paramLabel = "N", description = "Highest n of the basis (default: see above).")
        Integer nMax;

        @Option(names = "--l-max", paramLabel = "L", defaultValue = "100",
                description = "Highest l of the basis, 0 to 100; l never exceeds n - 1 (default: ${DEFAULT-VALUE}).")
        int lMax;

        @Option(names = "--field-max", paramLabel = "V/CM", required = true,
                description = "Highest field, V/cm, above 0 and at most 1e5.")
        double fieldMax;

        @Option(names = "--steps", paramLabel = "N", defaultValue = "20",
                description = "Field steps from 0 to --field-max, 1 to 1000 (default: ${DEFAULT-VALUE}).")
        int steps;

        @Option(names = "--window", paramLabel = "GHZ", defaultValue = "20",
                description = "List eigenstates within this many GHz of the state, above 0 and at most 1e4 "
                        + "(default: ${DEFAULT-VALUE}).")
        double window;

        @Option(names = "--plot", paramLabel = "FILE.png", description = "Also draw the map as a PNG.")
        Path plot;

        @Override
        public Integer call() throws IOException {
            OptionRules.range("--field-max", fieldMax, 0, false, 1e5, "a field above 0 and at most 1e5 V/cm");
            OptionRules.range("--window", window, 0, false, 1e4, "a window above 0 and at most 1e4 GHz");
            if (steps < 1 || steps > 1000) {
                throw new OptionException("--steps must be 1 to 1000, got " + steps);
            }
            if (lMax < 0 || lMax > 100) {
                throw new OptionException("--l-max must be 0 to 100, got " + lMax);
            }
            State state = common.state();
            int twoMj = parseProjection("--mj", mj, state);
            AlkaliAtom atom = common.atom();
            int[] around = StarkMap.principalRangeAround(atom, state);     // the library's default basis
            int low = nMin != null ? nMin : around[0];
            int high = nMax != null ? nMax : around[1];
            if (low < 1 || high < low || high - low > 20 || state.n() < low || state.n() > high) {
                throw new OptionException("--n-min and --n-max must hold the state's n = " + state.n() + ", with "
                        + "1 <= n-min <= n-max <= n-min + 20; got " + low + " to " + high);
            }
            if (state.l() > lMax) {
                throw new OptionException("--l-max " + lMax + " leaves out the state's l = " + state.l());
            }
            if (plot != null) {
                OptionRules.png("--plot", plot);
                OutputFiles.check(List.of(new OutputFiles.Named("--plot", plot)), common.data.inputs(List.of()));
            }
            StarkMap map = StarkMap.builder(atom).projection(twoMj).principalRange(low, high).maxOrbital(lMax).build()
                    .withThreads(Runtime.getRuntime().availableProcessors());
            if (map.size() > 1500) {
                throw new OptionException("the basis holds " + map.size() + " states, more than 1500: narrow "
                        + "--n-min/--n-max or lower --l-max");
            }
            if ((long) map.size() * map.size() * map.size() * (steps + 1) > 2e9) {
                spec.commandLine().getErr().println("note: " + map.size() + " basis states at " + (steps + 1)
                        + " fields; each field takes an eigen-decomposition (time grows as the cube of the basis):"
                        + " expect about 0.05 s per field and core at 1,000 states");
                spec.commandLine().getErr().flush();
            }
            double[] fields = new double[steps + 1];
            for (int k = 0; k <= steps; k++) {
                fields[k] = fieldMax * k / steps * 100; // V/cm -> V/m
            }
            // Shares only where rows are listed: the window, widened by 1e-9 of itself so that every row
            // the |energy| <= window test below keeps carries its share.
            double edgeHz = window * 1e9 * (1 + 1e-9);
            StarkMapResult result = map.withShareWindowHz(-edgeHz, edgeHz).solve(fields, state);
            Table table = new Table(List.of(Table.Column.number("field_v_per_cm", "field V/cm", "%.6g"),
                    Table.Column.number("energy_ghz", "energy GHz", "%.6f"),
                    Table.Column.number("share", "share of " + state.label(), "%.4f")),
                    spec.commandLine().getOut(), common.format);
            List<double[]> points = new ArrayList<>();
            for (int f = 0; f < result.fieldCount(); f++) {
                double[] e = result.energiesRelativeHz(f);
                for (int i = 0; i < e.length; i++) {
                    double ghz = e[i] / 1e9;
                    if (Math.abs(ghz) <= window) {
                        double share = result.share(f, i);
                        table.add(fields[f] / 100, ghz, share);
                        points.add(new double[] {fields[f] / 100, ghz, share});
                    }
                }
            }
            table.finish();
            if (plot != null) {
                try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
                    EigenstateChart.draw(batch, plot, atom.species().notation() + " " + state.label() + ", m_j = "
                            + half(twoMj) + ", basis of " + map.size() + " states",
                            EigenstateChart.STARK, points.stream().mapToDouble(p -> p[0]).toArray(),
                            points.stream().mapToDouble(p -> p[1]).toArray(),
                            points.stream().mapToDouble(p -> p[2]).toArray());
                    batch.commit();
                }
            }
            return 0;
        }
    }

    /** {@code rydberg pair}. */
    @Command(name = "pair", mixinStandardHelpOptions = true,
            description = "The interaction of two atoms: C6 of the pair |state, m_j; state, m_j> by second-order "
                    + "perturbation theory (dE = C6 / R^6, positive = repulsive) with its strongest channel and "
                    + "Foerster defect, and the blockade radius for --rabi; or, with --partner, the C3 coupling of "
                    + "|state, partner> to |partner, state> (dE = C3 / R^3). Where the pair state shares its "
                    + "energy and M with other pair states of the two atoms (e.g. two nD5/2 with m = 1/2), C6 is "
                    + "the diagonal element of that degenerate manifold's C6 matrix: a note then gives the "
                    + "matrix's eigenvalues, the C6 of the potentials the pair state splits into (see "
                    + "rydberg pair-potential).")
    static final class Pair implements Callable<Integer> {
        @Spec
        CommandSpec spec;

        @Mixin
        Common common;

        @Option(names = "--mj", paramLabel = "MJ", defaultValue = "1/2",
                description = "m_j of each atom, a half-integer (default: ${DEFAULT-VALUE}).")
        String mj;

        @Option(names = "--partner", paramLabel = "STATE",
                description = "The second atom's state for C3, dipole-coupled to --state, e.g. 60p3/2.")
        String partner;

        @Option(names = "--partner-mj", paramLabel = "MJ", defaultValue = "1/2",
                description = "m_j of the partner (default: ${DEFAULT-VALUE}).")
        String partnerMj;

        @Option(names = "--angle", paramLabel = "DEG", defaultValue = "0",
                description = "Angle between the interatomic axis and the quantisation axis, 0 to 180 degrees "
                        + "(default: ${DEFAULT-VALUE}).")
        double angle;

        @Option(names = "--range", paramLabel = "N", defaultValue = "6",
                description = "The n' range of each atom's intermediate states, 1 to 50 (default: ${DEFAULT-VALUE}).")
        int range;

        @Option(names = "--rabi", paramLabel = "MHZ",
                description = "Rabi frequency Omega / 2 pi in MHz, above 0 and at most 1e6: adds the blockade radius.")
        Double rabi;

        @Override
        public Integer call() {
            OptionRules.range("--angle", angle, 0, true, 180, "an angle from 0 to 180 degrees");
            if (range < 1 || range > 50) {
                throw new OptionException("--range must be 1 to 50, got " + range);
            }
            if (rabi != null) {
                OptionRules.range("--rabi", rabi, 0, false, 1e6, "a Rabi frequency above 0 and at most 1e6 MHz");
            }
            OptionRules rules = new OptionRules(spec);
            rules.refuseUnless("--partner-mj", partner != null, "without --partner");
            rules.refuseUnless("--rabi", partner == null, "with --partner (the blockade radius comes from C6)");
            State state = common.state();
            int twoM = parseProjection("--mj", mj, state);
            AlkaliAtom atom = common.atom();
            PairInteractions pairs = PairInteractions.of(atom).withNeighbourRange(range)
                    .withAngle(Math.toRadians(angle));
            if (partner != null) {
                State other = AlkaliTables.parseState("--partner", partner);
                int twoM2 = parseProjection("--partner-mj", partnerMj, other);
                if (Math.abs(other.l() - state.l()) != 1) {
                    throw new OptionException("--partner " + other.label() + " is not dipole-coupled to --state "
                            + state.label() + " (l must differ by one)");
                }
                PairState ket = new PairState(state, twoM, other, twoM2);
                double c3 = pairs.c3Au(ket.swapped(), ket);
                Table table = new Table(List.of(Table.Column.text("pair", "pair"),
                        Table.Column.number("angle_deg", "angle deg", "%.4g"),
                        Table.Column.number("c3_au", "C3 a.u.", "%.6e"),
                        Table.Column.number("c3_ghz_um3", "C3 GHz um^3", "%.6g")), spec.commandLine().getOut(),
                        common.format);
                table.add(ket.label() + " -> " + ket.swapped().label(), angle, c3,
                        PairInteractions.c3HzM3(c3) * 1e18 / 1e9);
                table.finish();
                return 0;
            }
            DispersionCoefficient c6 = pairs.c6(new PairState(state, twoM, state, twoM));
            Table table = new Table(List.of(Table.Column.text("pair", "pair"),
                    Table.Column.number("angle_deg", "angle deg", "%.4g"),
                    Table.Column.number("c6_au", "C6 a.u.", "%.6e"),
                    Table.Column.number("c6_ghz_um6", "C6 GHz um^6", "%.6g"),
                    Table.Column.text("strongest_channel", "strongest channel"),
                    Table.Column.number("foerster_defect_mhz", "defect MHz", "%.6g"),
                    Table.Column.number("blockade_radius_um", "R_b um", "%.5g")), spec.commandLine().getOut(),
                    common.format);
            Double radius = rabi == null ? null : c6.blockadeRadiusMetres(2 * Math.PI * rabi * 1e6) * 1e6;
            noteDegenerate(pairs.c6Manifold(c6.pair()));
            table.add(c6.pair().label(), angle, c6.c6Au(), c6.c6GHzUm6(), c6.strongest().label(),
                    c6.strongestDefectHz() / 1e6, radius);
            table.finish();
            return 0;
        }

        /** A note when the pair state is not an eigenvector of its degenerate manifold's C6 matrix. */
        private void noteDegenerate(DispersionManifold manifold) {
            if (manifold.isEigenstate()) {
                return;
            }
            double[] c6 = manifold.c6GHzUm6();
            double[] shares = manifold.shares();
            List<String> parts = new ArrayList<>();
            double low = Double.POSITIVE_INFINITY;
            double high = 0;
            for (int i = 0; i < c6.length; i++) {
                if (shares[i] >= 1e-3) {
                    parts.add(String.format(Locale.ROOT, "%.6g (share %.4f)", c6[i], shares[i]));
                    low = Math.min(low, Math.abs(c6[i]));
                    high = Math.max(high, Math.abs(c6[i]));
                }
            }
            List<String> others = new ArrayList<>();
            for (PairState p : manifold.states()) {
                if (!p.equals(manifold.pair())) {
                    others.add(p.label());
                }
            }
            int count = others.size();
            if (count > 6) {        // off axis every M enters: name a few
                others = new ArrayList<>(others.subList(0, 5));
                others.add("and " + (count - 5) + " more");
            }
            String blockade = "";
            if (rabi != null && low > 0) {
                double omega = 2 * Math.PI * rabi * 1e6;
                blockade = String.format(Locale.ROOT, "; the blockade radius for those lies from %.5g to %.5g um",
                        PairInteractions.blockadeRadiusMetres(low * 1e-27, omega) * 1e6,
                        PairInteractions.blockadeRadiusMetres(high * 1e-27, omega) * 1e6);
            }
            PrintWriter err = spec.commandLine().getErr();
            err.println("note: " + manifold.pair().label() + " is degenerate with " + count + " other pair "
                    + "state" + (count == 1 ? "" : "s") + (angle == 0 ? " of the same M" : "") + " ("
                    + String.join(", ", others) + ") and mixes with them at second order: the C6 printed is its "
                    + "diagonal element (the share-weighted mean), not one potential's. It splits into potentials "
                    + "with C6 = " + String.join(", ", parts) + " GHz um^6 (eigenvalues of the C6 matrix of the "
                    + "manifold, PairInteractions.c6Manifold)" + blockade + "; see rydberg pair-potential");
            err.flush();
        }
    }

    /** {@code rydberg microwave}. */
    @Command(name = "microwave", mixinStandardHelpOptions = true,
            description = "Microwave electrometry on the transition --state -> --to: the Autler-Townes splitting "
                    + "Omega / 2 pi = |d| E / h for a field amplitude --field, or the field a measured --splitting "
                    + "means, with the dipole element of the polarisation q = m_j(upper) - m_j(lower) stated (the "
                    + "one that drives absorption from the lower of the two states); or, with --near, the dipole "
                    + "transitions from --state within --window of a frequency.")
    static final class Microwave implements Callable<Integer> {
        @Spec
        CommandSpec spec;

        @Mixin
        Common common;

        @Option(names = "--to", paramLabel = "STATE", description = "The other state of the transition, e.g. 51p3/2.")
        String to;

        @Option(names = "--mj", paramLabel = "MJ", defaultValue = "1/2",
                description = "m_j of --state (default: ${DEFAULT-VALUE}).")
        String mj;

        @Option(names = "--to-mj", paramLabel = "MJ", defaultValue = "1/2",
                description = "m_j of --to (default: ${DEFAULT-VALUE}).")
        String toMj;

        @Option(names = "--field", paramLabel = "V/M",
                description = "Field amplitude of that polarisation, V/m, 0 to 1e6: gives the splitting.")
        Double field;

        @Option(names = "--splitting", paramLabel = "MHZ",
                description = "Measured splitting Omega / 2 pi, MHz, 0 to 1e6: gives the field.")
        Double splitting;

        @Option(names = "--near", paramLabel = "GHZ",
                description = "List the transitions from --state near this frequency, GHz, above 0 and at most 1e5.")
        Double near;

        @Option(names = "--window", paramLabel = "GHZ", defaultValue = "1",
                description = "Half-width of the --near window, GHz, above 0 and at most 1e5 "
                        + "(default: ${DEFAULT-VALUE}).")
        double window;

        @Override
        public Integer call() {
            OptionRules rules = new OptionRules(spec);
            int modes = (field != null ? 1 : 0) + (splitting != null ? 1 : 0) + (near != null ? 1 : 0);
            if (modes != 1) {
                throw new OptionException("give exactly one of --field, --splitting or --near");
            }
            rules.refuseUnless("--window", near != null, "without --near");
            State state = common.state();
            AlkaliAtom atom = common.atom();
            Electrometry em = Electrometry.of(atom);
            if (near != null) {
                OptionRules.range("--near", near, 0, false, 1e5, "a frequency above 0 and at most 1e5 GHz");
                OptionRules.range("--window", window, 0, false, 1e5, "a window above 0 and at most 1e5 GHz");
                rules.refuseUnless("--to", false, "with --near (it lists every transition from --state)");
                List<ResonantTransition> found = em.transitionsNear(state, near * 1e9, window * 1e9, 30);
                Table table = new Table(List.of(Table.Column.text("from", "from"), Table.Column.text("to", "to"),
                        Table.Column.number("frequency_ghz", "frequency GHz", "%.6f"),
                        Table.Column.number("detuning_mhz", "detuning MHz", "%.6g"),
                        Table.Column.number("reduced_dipole_ea0", "<to||d||from> e a0", "%.6g"),
                        Table.Column.number("radial_a0", "<r> a0", "%.6g")), spec.commandLine().getOut(),
                        common.format);
                for (ResonantTransition t : found) {
                    table.add(t.from().label(), t.to().label(), t.frequencyHz() / 1e9, t.detuningHz() / 1e6,
                            t.reducedDipoleEa0(), t.radialDipoleBohr());
                }
                table.finish();
                return 0;
            }
            if (to == null) {
                throw new OptionException("--to is required with --field or --splitting");
            }
            State other = AlkaliTables.parseState("--to", to);
            int twoM = parseProjection("--mj", mj, state);
            int twoM2 = parseProjection("--to-mj", toMj, other);
            if (Math.abs(other.l() - state.l()) != 1) {
                throw new OptionException("--to " + other.label() + " is not dipole-coupled to --state " + state.label()
                        + " (l must differ by one)");
            }
            if (Math.abs(twoM2 - twoM) > 2) {
                throw new OptionException("--to-mj " + toMj + " differs from --mj " + mj + " by more than 1");
            }
            boolean upward = atom.frequencyHz(state, other) > 0;
            State lower = upward ? state : other;
            State upper = upward ? other : state;
            int twoMLower = upward ? twoM : twoM2;
            int twoMUpper = upward ? twoM2 : twoM;
            AutlerTownes at;
            if (field != null) {
                OptionRules.range("--field", field, 0, true, 1e6, "a field from 0 to 1e6 V/m");
                at = em.splitting(lower, twoMLower, upper, twoMUpper, field);
            } else {
                OptionRules.range("--splitting", splitting, 0, true, 1e6, "a splitting from 0 to 1e6 MHz");
                at = em.field(lower, twoMLower, upper, twoMUpper, splitting * 1e6);
            }
            Table table = new Table(List.of(Table.Column.text("lower", "lower"), Table.Column.text("upper", "upper"),
                    Table.Column.text("q", "q"),
                    Table.Column.number("frequency_ghz", "frequency GHz", "%.6f"),
                    Table.Column.number("dipole_ea0", "d e a0", "%.6g"),
                    Table.Column.number("field_v_per_m", "field V/m", "%.6g"),
                    Table.Column.number("splitting_mhz", "splitting MHz", "%.6g")), spec.commandLine().getOut(),
                    common.format);
            table.add(lower.label() + " m=" + half(twoMLower), upper.label() + " m=" + half(twoMUpper),
                    at.polarisation(), Math.abs(atom.frequencyHz(lower, upper)) / 1e9, at.dipoleEa0(),
                    at.fieldVPerM(), at.splittingHz() / 1e6);
            table.finish();
            double frequency = Math.abs(atom.frequencyHz(lower, upper));
            if (at.splittingHz() > 0.1 * frequency) {
                spec.commandLine().getErr().println(String.format(java.util.Locale.ROOT, "note: the splitting is %.3g"
                        + " times the transition frequency; the two-level, rotating-wave picture behind it holds only"
                        + " for a splitting well below the frequency (and below the detuning to other transitions),"
                        + " so the figure is not physical here", at.splittingHz() / frequency));
            }
            return 0;
        }
    }
}
