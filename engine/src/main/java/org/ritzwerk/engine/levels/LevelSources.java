package org.ritzwerk.engine.levels;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.Function;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hyperfine.HyperfineLevel;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.rydberg.AlkaliAtom;

/**
 * The sources a {@link LevelQuery} asks, given explicitly by the caller from its own data (a
 * refdata {@code DataContext}, a provider jar, or values in code): one-electron ions with their
 * level models, alkali atoms with their quantum-defect models (and, where known, the hyperfine
 * structure of their levels), and the levels of any species from a level list. Nothing is looked up
 * anywhere else. Sources are asked in the order they were added.
 *
 * <p>Immutable and thread-safe; each {@code with} method returns a new object.
 */
public final class LevelSources {

    /** One source: exactly one of model, atom and levels is set. */
    record Entry(Species species, HydrogenLikeModel model, AlkaliAtom atom,
            Function<State, List<HyperfineLevel>> hyperfine, Function<State, String> hyperfineModel,
            RitzLevels levels) {
    }

    /** What the model column says of an F level when the caller does not say where its constants come from. */
    static final String HYPERFINE_MODEL = "hyperfine A, B";

    private static final LevelSources NONE = new LevelSources(List.of());

    private final List<Entry> entries;

    private LevelSources(List<Entry> entries) {
        this.entries = entries;
    }

    /** @return no sources; add them with the {@code with} methods */
    public static LevelSources none() {
        return NONE;
    }

    /**
     * @param species the one-electron ion, e.g. {@code H I}, {@code He II}
     * @param model   its level model (nucleus and tier)
     * @return these sources and that ion
     * @throws IllegalArgumentException when the species is not the one-electron ion of the model's nucleus
     */
    public LevelSources withHydrogenLike(Species species, HydrogenLikeModel model) {
        Objects.requireNonNull(model, "model").requireIon(species);
        return with(new Entry(species, model, null, null, null, null));
    }

    /**
     * @param atom an alkali atom (its quantum-defect model and measured levels); its levels are not
     *             split into F levels
     * @return these sources and that atom
     */
    public LevelSources withAlkali(AlkaliAtom atom) {
        return with(new Entry(atom.species(), null, atom, state -> List.of(), state -> HYPERFINE_MODEL, null));
    }

    /**
     * @param atom      an alkali isotope
     * @param hyperfine the F levels of a level (shifts from its hyperfine-free energy, e.g. from
     *                  {@code HyperfineStructure.levels} with the isotope's nuclear spin and
     *                  constants), empty for a level without known constants; asked only by a
     *                  query {@linkplain LevelQuery#withHyperfine with hyperfine structure}
     * @return these sources and that atom
     */
    public LevelSources withAlkali(AlkaliAtom atom, Function<State, List<HyperfineLevel>> hyperfine) {
        return withAlkali(atom, hyperfine, state -> HYPERFINE_MODEL);
    }

    /**
     * @param atom           an alkali isotope
     * @param hyperfine      the F levels of a level, as for {@link #withAlkali(AlkaliAtom, Function)}
     * @param hyperfineModel what a level's F levels say after the level's origin in the model column
     *                       ({@link LevelSet#model}), so that measured constants can be told from derived
     *                       ones row by row: e.g. {@code hyperfine A, B measured} or {@code hyperfine A, B
     *                       scaled as n*^-3 from 7s 2S1/2}; asked only for a level with F levels
     * @return these sources and that atom
     */
    public LevelSources withAlkali(AlkaliAtom atom, Function<State, List<HyperfineLevel>> hyperfine,
            Function<State, String> hyperfineModel) {
        return with(new Entry(atom.species(), null, atom, Objects.requireNonNull(hyperfine, "hyperfine"),
                Objects.requireNonNull(hyperfineModel, "hyperfineModel"), null));
    }

    /**
     * @param levels the levels of one species (a level list's rows, or a level optimisation's result)
     * @return these sources and those levels, as listed
     */
    public LevelSources withLevels(RitzLevels levels) {
        return with(new Entry(levels.species(), null, null, null, null, levels));
    }

    /** @return the number of sources */
    public int size() {
        return entries.size();
    }

    /** @return the species of the sources, in order */
    public List<Species> species() {
        return entries.stream().map(Entry::species).toList();
    }

    List<Entry> entries() {
        return entries;
    }

    private LevelSources with(Entry entry) {
        Objects.requireNonNull(entry.species(), "species");
        List<Entry> more = new ArrayList<>(entries);
        more.add(entry);
        return new LevelSources(List.copyOf(more));
    }

    @Override
    public String toString() {
        return "LevelSources" + species().stream().map(Species::notation).toList();
    }
}
