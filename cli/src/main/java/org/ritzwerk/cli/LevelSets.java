package org.ritzwerk.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.ritz.RitzLines;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataLines;

/**
 * Species of --species that have a level list in the data context (He I built in, or a user's
 * {@code ritzwerk-levels} file given with --data) and are neither one-electron ions nor alkali
 * atoms: {@code levels} lists their levels and {@code lines} their Ritz lines.
 */
final class LevelSets {

    /** How many levels a note names before it gives the count of the rest. */
    static final int NAMED = 5;

    /**
     * The --species values split in two.
     *
     * @param others the entries for the one-electron ions and alkali atoms ({@link Ions#atoms})
     * @param levels the level lists of the other species, in the order given
     */
    record Split(List<String> others, List<RitzLevels> levels) {
    }

    private LevelSets() {
    }

    /**
     * @param data           the data context
     * @param speciesOptions the --species values, each possibly a comma-separated list
     * @return the entries split: species with a level list (and no model of their own) apart
     */
    static Split split(DataContext data, List<String> speciesOptions) {
        List<String> others = new ArrayList<>();
        List<RitzLevels> levels = new ArrayList<>();
        java.util.Set<Species> named = new java.util.HashSet<>();
        for (String option : speciesOptions) {
            for (String text : option.split(",")) {
                if (text.isBlank()) {
                    others.add(text);       // Ions refuses it with its message
                    continue;
                }
                Species s = Species.parse(text);
                if (!named.add(s)) {
                    throw new OptionException("--species names " + s.notation() + " twice (as '" + text.strip()
                            + "'); give each species once");
                }
                boolean modelled = s.isHydrogenLike()
                        || s.charge() == 0 && data.alkaliSpecies().stream().anyMatch(a -> a.z() == s.z());
                if (!modelled && data.levelList(s).isPresent()) {
                    levels.add(DataLines.levels(data, s));
                } else {
                    others.add(text);
                }
            }
        }
        return new Split(others, levels);
    }

    /**
     * @param data    the data context (each species' companion line list of A values)
     * @param levels  level lists
     * @param intercombination whether lines between terms of different spin are let through (the
     *                         other LS-coupling rules still apply where both levels give a term)
     * @return line sources giving their Ritz lines (E1 and LS rules) with the A values
     *         of the context's companion line list ({@link DataLines#ritzLines})
     */
    static LineSources sources(DataContext data, List<RitzLevels> levels, boolean intercombination) {
        LineSources sources = LineSources.none();
        for (RitzLevels set : levels) {
            sources = sources.withLevels(set, DataLines.ritzLines(data, set.species()).withLsRules(true)
                    .withIntercombination(intercombination));
        }
        return sources;
    }

    /**
     * {@code --n-max} for a command whose species may have level lists: refused when only level
     * lists are given (their lines are those of every listed level; n is not read from the
     * labels), and noted when computed species come with them.
     *
     * @param rules    the command's option rules
     * @param computed whether a one-electron ion or alkali atom is among the species
     * @param levels   the species' level lists
     * @param nMax     the option's value
     * @param err      where the note goes
     */
    static void levelListsAndNMax(OptionRules rules, boolean computed, List<RitzLevels> levels, int nMax,
            PrintWriter err) {
        if (levels.isEmpty()) {
            return;
        }
        rules.refuseUnless("--n-max", computed, "for species with a level list " + names(levels)
                + " (their lines are those of every listed level; n is not read from the labels)");
        if (rules.given("--n-max")) {
            err.println("note: --n-max " + nMax + " limits the computed species' lines, not those of " + names(levels)
                    + " (every listed level gives its lines)");
        }
    }

    /**
     * @param levels level lists
     * @return their species' notations, e.g. {@code [He I]}
     */
    static String names(List<RitzLevels> levels) {
        return levels.stream().map(l -> l.species().notation()).toList().toString();
    }

    /**
     * Notes, one per level list that has them, naming the levels that give no lines because their
     * labels give no parity or no J ({@link RitzLines#levelsWithoutLines}): the first {@link #NAMED}
     * by label with the reason, then the count of the rest.
     *
     * @param levels level lists
     * @param err    where the notes go
     */
    static void noteLevelsWithoutLines(List<RitzLevels> levels, PrintWriter err) {
        for (RitzLevels set : levels) {
            List<RitzLines.LevelWithoutLines> none = RitzLines.levelsWithoutLines(set);
            if (none.isEmpty()) {
                continue;
            }
            String named = none.stream().limit(NAMED).map(l -> "'" + l.label() + "' (" + l.reason() + ")")
                    .collect(Collectors.joining(", "));
            err.println("note: " + set.species().notation() + ": " + none.size() + " of " + set.size()
                    + " level(s) give no lines, since the selection rules need each level's parity (a configuration"
                    + " such as 2p5.3s, or an odd mark as in 3Po) and J (in the term or the j column): " + named
                    + (none.size() > NAMED ? " and " + (none.size() - NAMED) + " more" : ""));
        }
        err.flush();
    }

    /**
     * Notes, per species, of the level lists' lines in the window that a minimum Einstein A leaves
     * out because they have no A at all (a level list without a companion line list of A values).
     *
     * @param all  the level lists' lines in the window before the minimum A
     * @param minA the minimum A, s^-1
     * @param err  where the notes go
     */
    static void noteLinesWithoutA(LineSet all, double minA, PrintWriter err) {
        Map<Species, int[]> counts = new LinkedHashMap<>();
        for (int i = 0; i < all.size(); i++) {
            int[] c = counts.computeIfAbsent(all.species(i), k -> new int[2]);
            c[0]++;
            if (all.einsteinA(i).isEmpty()) {
                c[1]++;
            }
        }
        counts.forEach((species, c) -> {
            if (c[1] > 0) {
                err.println("note: --min-a " + minA + ": " + c[1] + " of " + c[0] + " " + species.notation()
                        + " line(s) in the window are left out for having no Einstein A"
                        + (c[1] == c[0] ? " (no line of its level list has one)" : ""));
            }
        });
        err.flush();
    }
}
