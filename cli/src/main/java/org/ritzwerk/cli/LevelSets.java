package org.ritzwerk.cli;

import java.util.ArrayList;
import java.util.List;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataLines;

/**
 * Species of --species that have a level list in the data context (He I built in, or a user's
 * {@code ritzwerk-levels} file given with --data) and are neither one-electron ions nor alkali
 * atoms: {@code levels} lists their levels and {@code lines} their Ritz lines.
 */
final class LevelSets {

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
     * @param lsRules whether the LS-coupling rules apply where both levels give a term
     * @return line sources giving their Ritz lines (E1 rules, LS rules if asked) with the A values
     *         of the context's companion line list ({@link DataLines#ritzLines})
     */
    static LineSources sources(DataContext data, List<RitzLevels> levels, boolean lsRules) {
        LineSources sources = LineSources.none();
        for (RitzLevels set : levels) {
            sources = sources.withLevels(set, DataLines.ritzLines(data, set.species()).withLsRules(lsRules));
        }
        return sources;
    }
}
