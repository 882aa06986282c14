package org.ritzwerk.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.LevelTable;
import org.ritzwerk.engine.hydrogenic.Notation;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code ritzwerk levels}: energy levels of one-electron ions. */
@Command(name = "levels",
        mixinStandardHelpOptions = true,
        description = {
            "Energy levels of one-electron ions (H I, D I, He II, C VI, ... U XCII), in cm-1 above the",
            "ground state, under a chosen model: bohr (reduced mass), dirac (fine structure and",
            "recoil), qed (plus the leading Lamb shift and nuclear size), hyperfine (plus s-level",
            "hyperfine structure). Nuclear data from the built-in set (AME2020 masses, ...)."
        },
        footer = {"", "Examples:",
            "  ritzwerk levels --species \"H I\" --n-max 3",
            "  ritzwerk levels --species D --model hyperfine --n-max 2 --format json",
            "  ritzwerk levels --species \"He II\" --n-max 3 --lifetimes"})
final class LevelsCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    Ions ions;

    @Option(names = "--n-max", paramLabel = "N", defaultValue = "4",
            description = "Highest principal quantum number (default: ${DEFAULT-VALUE}; at most 2000).")
    int nMax;

    @Option(names = "--lifetimes",
            description = {"Add each level's radiative lifetime from E1 decays alone: null for 1s; 2s",
                "decays mainly by two-photon emission (0.12 s in H), which is not included."})
    boolean lifetimes;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
            description = "text (aligned table), csv or json (one object per line). Default: ${DEFAULT-VALUE}.")
    Table.Format format;

    @Override
    public Integer call() {
        if (nMax < 1 || nMax > 2000) {
            throw new IllegalArgumentException("--n-max must be 1 to 2000, got " + nMax);
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
                Table.Column.text("model", "model")));
        if (lifetimes) {
            columns.add(Table.Column.number("lifetime_s", "lifetime s", "%.5e"));
        }
        Table table = new Table(columns);
        double hcPerCm = PhysicalConstants.H * PhysicalConstants.C * 100;
        for (Ions.Ion ion : ions.resolve()) {
            LevelTable levels = ion.model().levels(nMax);
            double ground = Double.POSITIVE_INFINITY;
            for (int i = 0; i < levels.size(); i++) {
                ground = Math.min(ground, levels.energy(i));
            }
            HydrogenLikeLines lines = HydrogenLikeLines.of(ion.model());
            for (int i = 0; i < levels.size(); i++) {
                Object[] row = {ion.species().notation(), levels.label(i), levels.n(i), levels.l(i),
                    Notation.half(levels.twoJ(i)), levels.twoF(i) < 0 ? null : Notation.half(levels.twoF(i)), levels.statisticalWeight(i),
                    (levels.energy(i) - ground) / hcPerCm, ion.model().tier().id(), null};
                if (lifetimes) {
                    row[9] = lines.lifetime(levels.n(i), levels.l(i), levels.twoJ(i));
                }
                table.add(lifetimes ? row : java.util.Arrays.copyOf(row, 9));
            }
        }
        table.write(spec.commandLine().getOut(), format);
        return 0;
    }
}
