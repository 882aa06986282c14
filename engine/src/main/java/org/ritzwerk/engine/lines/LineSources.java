package org.ritzwerk.engine.lines;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.ritz.RitzLines;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/**
 * The sources a {@link LineQuery} asks, given explicitly by the caller from its own data (a
 * refdata {@code DataContext}, a provider jar, or values in code): one-electron ions with their
 * level models, alkali atoms with their quantum-defect models, the levels of any species (lines by
 * the Ritz combination principle), line lists, and ready-made line sets. Nothing is looked up anywhere else. Sources are asked in the order they were added.
 *
 * <p>Immutable and thread-safe; each {@code with} method returns a new object, and refuses with an
 * {@link IllegalArgumentException} a source given already (the same species from a model or its
 * levels, or the same list or set object), whose lines would all come twice.
 */
public final class LineSources {

    /** One source: exactly one of model, atom, list, set and levels is set (levels with its job). */
    record Entry(Species species, HydrogenLikeModel model, AlkaliAtom atom, LineList list, LineSet set,
            RitzLevels levels, RitzLines job) {
        Entry(Species species, HydrogenLikeModel model, AlkaliAtom atom, LineList list, LineSet set) {
            this(species, model, atom, list, set, null, null);
        }
    }

    private static final LineSources NONE = new LineSources(List.of());

    private final List<Entry> entries;

    private LineSources(List<Entry> entries) {
        this.entries = entries;
    }

    /** @return no sources; add them with the {@code with} methods */
    public static LineSources none() {
        return NONE;
    }

    /**
     * @param species the one-electron ion, e.g. {@code H I}, {@code He II}
     * @param model   its level model (nucleus and tier; a query may ask for another tier)
     * @return these sources and that ion
     * @throws IllegalArgumentException when the species is not the one-electron ion of the model's nucleus
     */
    public LineSources withHydrogenLike(Species species, HydrogenLikeModel model) {
        Objects.requireNonNull(model, "model").requireIon(species);
        return with(new Entry(species, model, null, null, null));
    }

    /**
     * @param atom an alkali atom (its quantum-defect model and measured levels)
     * @return these sources and that atom
     */
    public LineSources withAlkali(AlkaliAtom atom) {
        return with(new Entry(Objects.requireNonNull(atom, "atom").species(), null, atom, null, null));
    }

    /**
     * @param list a line list: a built-in or user list, or a lamp list
     * @return these sources and that list
     */
    public LineSources withLineList(LineList list) {
        return with(new Entry(null, null, null, Objects.requireNonNull(list, "list"), null));
    }

    /**
     * @param set lines already in a line set (the caller's own, or another query's result)
     * @return these sources and those lines
     */
    public LineSources withLineSet(LineSet set) {
        return with(new Entry(null, null, null, null, Objects.requireNonNull(set, "set")));
    }

    /**
     * The Ritz job of {@link #withLevels(RitzLevels)} and {@link #withLevelList(LevelList)}: the
     * electric-dipole parity and J rules and, where both labels give an LS term, the LS-coupling
     * rules (no spin change, Delta L = 0, +-1, not L = 0 to 0), as refdata's {@code DataLines} and
     * the {@code lines} command apply them. For the parity and J rules only, give
     * {@link RitzLines#defaults()} to {@link #withLevels(RitzLevels, RitzLines)} or
     * {@link #withLevelList(LevelList, RitzLines)}; for intercombination lines,
     * {@code RITZ_RULES.withIntercombination(true)}.
     */
    public static final RitzLines RITZ_RULES = RitzLines.defaults().withLsRules(true);

    /**
     * @param levels the levels of one species (a level list's rows, or a level optimisation's
     *               result with its covariance)
     * @return these sources and the lines of those levels by the Ritz combination principle,
     *         under the electric-dipole and LS rules of {@link #RITZ_RULES}
     */
    public LineSources withLevels(RitzLevels levels) {
        return withLevels(levels, RITZ_RULES);
    }

    /**
     * @param levels the levels of one species
     * @param job    the Ritz job to compute their lines with (its selection rules, A values; a
     *               query's window is applied on top)
     * @return these sources and those lines
     */
    public LineSources withLevels(RitzLevels levels, RitzLines job) {
        Objects.requireNonNull(levels, "levels");
        Objects.requireNonNull(job, "job");
        return with(new Entry(levels.species(), null, null, null, null, levels, job));
    }

    /**
     * @param list a level list (built-in or a user's {@code ritzwerk-levels} file)
     * @return these sources and the Ritz lines of each species in the list, in the order the species
     *         first appear, under the electric-dipole and LS rules of {@link #RITZ_RULES} (the lines
     *         refdata's {@code DataLines} gives; it adds the A values of a companion line list)
     */
    public LineSources withLevelList(LevelList list) {
        return withLevelList(list, RITZ_RULES);
    }

    /**
     * @param list a level list
     * @param job  the Ritz job to compute each species' lines with (its selection rules, A values;
     *             a query's window is applied on top), e.g. {@link RitzLines#defaults()} for the
     *             parity and J rules only
     * @return these sources and the Ritz lines of each species in the list, in the order the species
     *         first appear
     */
    public LineSources withLevelList(LevelList list, RitzLines job) {
        Objects.requireNonNull(list, "list");
        Objects.requireNonNull(job, "job");
        LineSources more = this;
        Set<Species> seen = new LinkedHashSet<>();
        for (int i = 0; i < list.size(); i++) {
            seen.add(list.species(i));
        }
        for (Species s : seen) {
            more = more.withLevels(RitzLevels.of(list, s), job);
        }
        return more;
    }

    /** @return the number of sources */
    public int size() {
        return entries.size();
    }

    List<Entry> entries() {
        return entries;
    }

    /**
     * Adds a source; refuses one given already (the same species from a model or levels, or the
     * same list or set), whose lines would all come twice.
     */
    private LineSources with(Entry entry) {
        for (Entry e : entries) {
            boolean sameModelled = entry.list() == null && entry.set() == null && e.list() == null && e.set() == null
                    && entry.species().equals(e.species());
            boolean sameList = entry.list() != null && entry.list() == e.list()
                    || entry.set() != null && entry.set() == e.set();
            if (sameModelled || sameList) {
                throw new IllegalArgumentException((sameModelled ? entry.species().notation() + " is"
                        : "this " + (entry.list() != null ? "line list" : "line set") + " is")
                        + " a source already: its lines would all come twice; give each source once");
            }
        }
        List<Entry> more = new ArrayList<>(entries);
        more.add(entry);
        return new LineSources(List.copyOf(more));
    }
}
