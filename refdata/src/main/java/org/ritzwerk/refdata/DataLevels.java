package org.ritzwerk.refdata;

import java.util.List;
import java.util.Objects;
import java.util.function.Function;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.hyperfine.HyperfineLevel;
import org.ritzwerk.engine.hyperfine.HyperfineStructure;
import org.ritzwerk.engine.levels.LevelSources;

/**
 * Level sources for the engine's {@link org.ritzwerk.engine.levels.LevelQuery} from a
 * {@link DataContext}, as {@link DataLines} gives line sources: the caller names species, the
 * context passed in supplies their data (nuclei of one-electron ions, alkali atoms and their
 * hyperfine constants, level lists). Stateless and thread-safe.
 */
public final class DataLevels {

    private DataLevels() {
    }

    /**
     * @param context where the data comes from
     * @param species one-electron ions ({@code H I}, {@code He II}, ...), neutral alkali atoms
     *                ({@code Rb-87 I}) and species with a level list ({@code He I}) of the context, in
     *                the order the sources are to be asked
     * @param tier    the level model of the one-electron ions
     * @return the sources: each ion with its context nucleus in that tier, each alkali atom as the
     *         context assembles it with its {@linkplain #hyperfine hyperfine structure} (an F level's model
     *         saying whether its constants are measured or scaled: {@link DataContext#hyperfineConstantsOrigin}),
     *         each other
     *         species' level list ({@link DataLines#levels})
     * @throws IllegalArgumentException naming a species that is none of these
     * @throws ReferenceDataException   when the context has no data for a species' isotope
     */
    public static LevelSources sources(DataContext context, List<Species> species, Tier tier) {
        Objects.requireNonNull(context, "context");
        Objects.requireNonNull(tier, "tier");
        LevelSources sources = LevelSources.none();
        for (Species s : species) {
            if (s.isHydrogenLike()) {
                sources = sources.withHydrogenLike(s, HydrogenLikeModel.of(context.nucleus(s), tier.forZ(s.z())));
            } else if (s.charge() == 0 && context.alkaliSpecies().stream().anyMatch(a -> a.z() == s.z())) {
                Species isotope = context.alkaliAtom(s).species();
                sources = sources.withAlkali(context.alkaliAtom(s), hyperfine(context, isotope),
                        hyperfineModel(context, isotope));
            } else if (context.levelList(s).isPresent()) {
                sources = sources.withLevels(DataLines.levels(context, s));
            } else {
                throw new IllegalArgumentException(s.notation() + " has no levels in this data context: it"
                        + " computes one-electron ions (H I, D I, He II, C VI, ...), the neutral alkali atoms "
                        + context.alkaliSpecies().stream().map(Species::notation).toList()
                        + " and lists the levels of the species with a level list "
                        + context.levelSpecies().stream().map(Species::notation).toList());
            }
        }
        return sources;
    }

    /**
     * @param context where the data comes from
     * @param isotope an alkali isotope, e.g. {@code Rb-87 I}
     * @return the F levels of each of its levels with constants in the context
     *         ({@link DataContext#hyperfineConstants}: measured, or n*^-3-scaled for Rydberg series),
     *         by the Casimir formula with the isotope's nuclear spin; empty for a level without
     *         constants. The same F levels as {@link DataContext#hyperfineLevels}.
     */
    public static Function<State, List<HyperfineLevel>> hyperfine(DataContext context, Species isotope) {
        Objects.requireNonNull(context, "context");
        Objects.requireNonNull(isotope, "isotope");
        return state -> context.hyperfineConstants(isotope, state)
                .map(c -> HyperfineStructure.levels(context.nucleus(isotope).twiceSpin(), state.twoJ(), c))
                .orElse(List.of());
    }

    /**
     * @param context where the data comes from
     * @param isotope an alkali isotope, e.g. {@code Rb-87 I}
     * @return what the model column says of a level's F levels after the level's origin
     *         ({@link org.ritzwerk.engine.levels.LevelSources#withAlkali(org.ritzwerk.engine.rydberg.AlkaliAtom,
     *         Function, Function)}): {@code hyperfine A, B} and where the constants come from,
     *         {@link DataContext#hyperfineConstantsOrigin} ({@code measured}, or {@code scaled as n*^-3 from 7s
     *         2S1/2} and the like), so each row tells measured constants from scaled ones
     */
    public static Function<State, String> hyperfineModel(DataContext context, Species isotope) {
        Objects.requireNonNull(context, "context");
        Objects.requireNonNull(isotope, "isotope");
        return state -> "hyperfine A, B " + context.hyperfineConstantsOrigin(isotope, state).orElse("(none)");
    }
}
