package org.ritzwerk.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.pair.PairPotentialResult;
import org.ritzwerk.engine.pair.PairPotentials;
import org.ritzwerk.engine.pair.PairState;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.refdata.OutputFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code ritzwerk rydberg pair-potential}: the potentials of two atoms against their distance, by
 * diagonalising the dipole-dipole Hamiltonian over a pair basis (the engine's
 * {@link PairPotentials}); every eigenvalue with the share of the chosen pair state in its
 * eigenstate, as a table and optionally a PNG.
 */
@Command(name = "pair-potential", mixinStandardHelpOptions = true,
        description = "Pair potentials of |state, m_j; partner, m_j'> against the interatomic distance: the "
                + "Hamiltonian E_1 + E_2 + V_dd(R) diagonalised at each distance over the pair states whose atoms "
                + "have n within --n-range of the pair's, l up to --l-max and a pair energy within --window of the "
                + "pair's (at --angle 0 only the pair's M = m_j + m_j'). Energies are relative to the pair's energy "
                + "at infinite distance; 'share' is the pair state's weight in each eigenstate. Quadrupole terms "
                + "are left out.")
final class PairPotentialCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    RydbergCommand.Common common;

    @Option(names = "--mj", paramLabel = "MJ", defaultValue = "1/2",
            description = "m_j of the first atom, a half-integer (default: ${DEFAULT-VALUE}).")
    String mj;

    @Option(names = "--partner", paramLabel = "STATE",
            description = "The second atom's state (default: the same as --state).")
    String partner;

    @Option(names = "--partner-mj", paramLabel = "MJ",
            description = "m_j of the second atom (default: the first atom's).")
    String partnerMj;

    @Option(names = "--angle", paramLabel = "DEG", defaultValue = "0",
            description = "Angle between the interatomic axis and the quantisation axis, 0 to 180 degrees "
                    + "(default: ${DEFAULT-VALUE}).")
    double angle;

    @Option(names = "--r-min", paramLabel = "UM", required = true,
            description = "Smallest distance, micrometres, 0.01 to 1e3 (the dipole-dipole form needs the atoms "
                    + "well apart: keep R above their size, about 2 n^2 a0).")
    double rMin;

    @Option(names = "--r-max", paramLabel = "UM", required = true,
            description = "Largest distance, micrometres, at least --r-min and at most 1e3.")
    double rMax;

    @Option(names = "--steps", paramLabel = "N", defaultValue = "20",
            description = "Distance steps from --r-min to --r-max, 1 to 1000 (default: ${DEFAULT-VALUE}).")
    int steps;

    @Option(names = "--n-range", paramLabel = "N", defaultValue = "2",
            description = "Each atom's n within this many of the pair's n, 0 to 10 (default: ${DEFAULT-VALUE}).")
    int nRange;

    @Option(names = "--l-max", paramLabel = "L", defaultValue = "3",
            description = "Highest l of each atom, 0 to 10 (default: ${DEFAULT-VALUE}).")
    int lMax;

    @Option(names = "--window", paramLabel = "GHZ", defaultValue = "25",
            description = "Pair states within this many GHz of the pair's energy, above 0 and at most 1e3 "
                    + "(default: ${DEFAULT-VALUE}).")
    double window;

    @Option(names = "--min-share", paramLabel = "X", defaultValue = "0",
            description = "List only eigenstates holding at least this share of the pair state, 0 to 1 "
                    + "(default: ${DEFAULT-VALUE}, every eigenstate).")
    double minShare;

    @Option(names = "--plot", paramLabel = "FILE.png", description = "Also draw the potentials as a PNG.")
    Path plot;

    @Override
    public Integer call() throws IOException {
        OptionRules.range("--angle", angle, 0, true, 180, "an angle from 0 to 180 degrees");
        OptionRules.range("--r-min", rMin, 0.01, true, 1e3, "a distance from 0.01 to 1e3 micrometres");
        OptionRules.range("--r-max", rMax, rMin, true, 1e3, "a distance from --r-min (" + OptionRules.show(rMin)
                + ") to 1e3 micrometres");
        OptionRules.range("--window", window, 0, false, 1e3, "a window above 0 and at most 1e3 GHz");
        OptionRules.range("--min-share", minShare, 0, true, 1, "a share from 0 to 1");
        if (steps < 1 || steps > 1000) {
            throw new OptionException("--steps must be 1 to 1000, got " + steps);
        }
        if (nRange < 0 || nRange > 10) {
            throw new OptionException("--n-range must be 0 to 10, got " + nRange);
        }
        if (lMax < 0 || lMax > 10) {
            throw new OptionException("--l-max must be 0 to 10, got " + lMax);
        }
        if (rMax == rMin && steps != 1) {
            throw new OptionException("--r-max equals --r-min (" + OptionRules.show(rMin) + " um): give --steps 1 or "
                    + "a larger --r-max");
        }
        State first = common.state();
        int twoM1 = RydbergCommand.parseProjection("--mj", mj, first);
        State second = partner == null ? first : AlkaliTables.parseState("--partner", partner);
        int twoM2 = partnerMj == null ? twoM1 : RydbergCommand.parseProjection("--partner-mj", partnerMj, second);
        if (partnerMj == null && (Math.abs(twoM2) > second.twoJ())) {
            throw new OptionException("--mj " + mj + " is not a projection of the partner " + second.label()
                    + ": give --partner-mj");
        }
        if (first.l() > lMax || second.l() > lMax) {
            throw new OptionException("--l-max " + lMax + " leaves out the pair's own l (" + first.label() + ", "
                    + second.label() + ")");
        }
        AlkaliAtom atom = common.atom();
        if (plot != null) {
            OptionRules.png("--plot", plot);
            OutputFiles.check(List.of(new OutputFiles.Named("--plot", plot)), common.data.inputs(List.of()));
        }
        int count = rMax == rMin ? 1 : steps + 1;
        double[] distances = new double[count];
        for (int k = 0; k < count; k++) {
            distances[k] = (count == 1 ? rMin : rMin + (rMax - rMin) * k / steps) * 1e-6;
        }
        PairState pair = new PairState(first, twoM1, second, twoM2);
        PairPotentialResult result = PairPotentials.of(atom).withBasis(nRange, lMax, window * 1e9)
                .withAngle(Math.toRadians(angle)).potentials(pair, distances);
        Table table = new Table(List.of(Table.Column.number("distance_um", "R um", "%.6g"),
                Table.Column.number("energy_ghz", "energy GHz", "%.6f"),
                Table.Column.number("share", "share of " + pair.label(), "%.4f")),
                spec.commandLine().getOut(), common.format);
        List<double[]> points = new ArrayList<>();
        for (int r = 0; r < distances.length; r++) {
            double[] e = result.energiesHz(r);
            double[] c = result.shares(r);
            double um = distances[r] * 1e6;
            for (int i = 0; i < e.length; i++) {
                if (c[i] >= minShare) {
                    table.add(um, e[i] / 1e9, c[i]);
                    points.add(new double[] {um, e[i] / 1e9, c[i]});
                }
            }
        }
        table.finish();
        if (plot != null) {
            try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
                EigenstateChart.draw(batch, plot, atom.species().notation() + " " + pair.label() + ", "
                        + OptionRules.show(angle) + " deg, " + result.basisSize() + " pair states",
                        EigenstateChart.PAIR, points.stream().mapToDouble(p -> p[0]).toArray(),
                        points.stream().mapToDouble(p -> p[1]).toArray(),
                        points.stream().mapToDouble(p -> p[2]).toArray());
                batch.commit();
            }
        }
        return 0;
    }
}
