package org.ritzwerk.refdata;

import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.ritz.RitzLines;
import org.ritzwerk.medium.Medium;

/**
 * Line sources for the engine's {@link org.ritzwerk.engine.lines.LineQuery} from a
 * {@link DataContext}: the caller names species and line sets, the context passed in supplies
 * their data (nuclei of one-electron ions, alkali atoms, line and lamp lists). Nothing is taken
 * from a global context. Stateless and thread-safe.
 */
public final class DataLines {

    private DataLines() {
    }

    /**
     * @param context where the data comes from
     * @param species one-electron ions ({@code H I}, {@code He II}, ...), neutral alkali atoms
     *                ({@code Rb-87 I}) and species with a level list ({@code He I}) of the context, in
     *                the order the sources are to be asked
     * @param tier    the level model of the one-electron ions
     * @return the sources: each ion with its context nucleus in that tier, each alkali atom as the
     *         context assembles it, each other species' level list ({@link DataContext#levelList})
     *         giving its lines by the Ritz combination principle under the E1 and LS rules, with
     *         the A values of its companion line list ({@link #ritzLines})
     * @throws IllegalArgumentException naming a species that is neither
     * @throws ReferenceDataException   when the context has no data for a species' isotope
     */
    public static LineSources sources(DataContext context, List<Species> species, Tier tier) {
        Objects.requireNonNull(context, "context");
        Objects.requireNonNull(tier, "tier");
        LineSources sources = LineSources.none();
        for (Species s : species) {
            if (s.isHydrogenLike()) {
                sources = sources.withHydrogenLike(s, HydrogenLikeModel.of(context.nucleus(s), tier.forZ(s.z())));
            } else if (s.charge() == 0 && context.alkaliSpecies().stream().anyMatch(a -> a.z() == s.z())) {
                sources = sources.withAlkali(context.alkaliAtom(s));
            } else if (context.levelList(s).isPresent()) {
                sources = sources.withLevels(levels(context, s), ritzLines(context, s));
            } else {
                throw new IllegalArgumentException(s.notation() + " has no line source in this data context: it"
                        + " computes one-electron ions (H I, D I, He II, C VI, ...), the neutral alkali atoms "
                        + context.alkaliSpecies().stream().map(Species::notation).toList()
                        + " and the Ritz lines of the species with a level list "
                        + context.levelSpecies().stream().map(Species::notation).toList());
            }
        }
        return sources;
    }

    /**
     * @param context where the data comes from
     * @param species a species with a level list in the context
     * @return its levels ({@link DataContext#levelList}), labelled with {@code species}
     * @throws IllegalArgumentException when the context has no level list for it
     */
    public static RitzLevels levels(DataContext context, Species species) {
        LevelList list = context.levelList(species).orElseThrow(() -> new IllegalArgumentException(
                species.notation() + " has no level list in this data context"));
        Species own = list.info().species().stream().filter(c -> c.z() == species.z() && c.charge() == species.charge())
                .findFirst().orElse(species);
        return ritzLevels(list, own).withSpecies(species);
    }

    /**
     * Builds the Ritz levels of every species a level list covers, so a list the Ritz job could not
     * use is refused when it is checked ({@code data check}), not when it is first used.
     *
     * @param list a level list
     * @throws ReferenceDataException ({@code inconsistent}) naming the list and the level, e.g. a
     *         label whose J differs from the J column
     */
    public static void checkLevels(LevelList list) {
        Objects.requireNonNull(list, "list");
        for (Species species : list.info().species()) {
            ritzLevels(list, species);
        }
    }

    private static RitzLevels ritzLevels(LevelList list, Species species) {
        try {
            return RitzLevels.of(list, species);
        } catch (IllegalArgumentException e) {
            throw new ReferenceDataException(ReferenceDataException.INCONSISTENT, "level list " + list.info().id()
                    + " (" + species.notation() + "): " + e.getMessage());
        }
    }

    /**
     * @param context where the data comes from
     * @param species a species with a level list
     * @return the Ritz job for its lines: E1 rules and, where both labels give a term, the LS rules
     *         (as the {@code lines} and {@code identify} commands apply them; {@code
     *         .withIntercombination(true)} lets intercombination lines through), and the A values of the
     *         companion line list ({@link DataContext#transitionProbabilities}) where the context has
     *         one
     */
    public static RitzLines ritzLines(DataContext context, Species species) {
        RitzLines job = RitzLines.defaults().withLsRules(true);
        Optional<LineList> companion = context.transitionProbabilities(species);
        return companion.isPresent() ? job.withEinsteinA(companion.get()) : job;
    }

    /**
     * The lamp lines of one gas: its lamp set of highest precedence ({@link DataContext#lampLines})
     * where the context has one, else, for a species with a level list (He I), the Ritz lines of
     * its levels under the E1 and LS rules ({@link #ritzLines}) ranked by g_u A
     * ({@link LampSet#ofRates}; lines without an A, such as intercombination lines, left out and
     * counted in {@link LampSet#withoutRate()}). Lines the medium's model cannot take are left out
     * and counted in {@link LampSet#outsideMedium()}.
     *
     * @param context where the data comes from
     * @param species the lamp's gas, e.g. {@code Ne I} or {@code He I}
     * @param medium  the medium of the calibration's wavelengths
     * @return the lamp
     * @throws ReferenceDataException ({@code unknown-data-set}) when the context has neither a lamp
     *         set nor a level list for the species; ({@code missing-quantity}) when its level list's
     *         lines have no transition probabilities to rank them by
     */
    public static LampSet lamp(DataContext context, Species species, Medium medium) {
        Objects.requireNonNull(context, "context");
        Objects.requireNonNull(species, "species");
        if (!context.registry().find(DataKind.LAMP_LINES, species).isEmpty()
                || context.levelList(species).isEmpty()) {
            return LampSet.of(List.of(context.lampLines(species)), medium);
        }
        RitzLevels levels = levels(context, species);
        LineSet lines = LineSet.ofRitz(ritzLines(context, species).compute(levels));
        if (!LampSet.anyRated(lines)) {
            throw new ReferenceDataException(ReferenceDataException.MISSING_QUANTITY, species.notation()
                    + ": no lamp set, and none of the " + lines.size() + " Ritz lines of its level list has an Einstein"
                    + " A (the data have no companion line list with rates), so its lines cannot be ranked as a"
                    + " lamp; give a lamp line list with relative intensities instead");
        }
        return LampSet.ofRates(lines, medium);
    }

    /**
     * The resolving power at which a lamp built from a level list is blended when none is given
     * (a compact spectrometer's, roughly; common practice).
     */
    public static final double DEFAULT_LEVEL_LAMP_RESOLVING_POWER = 5000;

    /**
     * A gas of a calibration lamp that has no lamp set and was built from its level list.
     *
     * @param species        the gas
     * @param components     its rated Ritz lines before blending
     * @param lamp           its lines blended at the resolving power
     * @param resolvingPower the resolving power they were blended at
     */
    public record LevelLamp(Species species, int components, LampSet lamp, double resolvingPower) {
    }

    /**
     * A calibration lamp as the {@code calibrate} command and the Spark operation assemble it.
     *
     * @param lamp       every line: the lists' lines, then those of the gases built from levels
     * @param fromLists  the built-in lamp sets and the given lists together (blended when a resolving
     *                   power was given), or null when there are none
     * @param fromLevels the gases built from their level lists, in the order given
     */
    public record CalibrationLamp(LampSet lamp, LampSet fromLists, List<LevelLamp> fromLevels) {

        /**
         * Copies the list.
         *
         * @param lamp       as above
         * @param fromLists  as above
         * @param fromLevels as above
         */
        public CalibrationLamp {
            Objects.requireNonNull(lamp, "lamp");
            fromLevels = List.copyOf(fromLevels);
        }

        /**
         * What a user should know about how the lamp was made, one sentence each: a gas built
         * from its level list (how many lines, ranked how, left out why, blended at what
         * resolving power), lines of the lists that repeat an earlier list's line, lines outside
         * the medium's range. The {@code calibrate} command prints them as notes; the Spark
         * operation puts them in each row's notes.
         *
         * @param medium the medium the lamp was assembled in (as given to
         *               {@link DataLines#calibrationLamp})
         * @return the notes, possibly none
         */
        public List<String> notes(Medium medium) {
            List<String> notes = new java.util.ArrayList<>();
            for (LevelLamp gas : fromLevels) {
                LampSet rated = gas.lamp();
                notes.add(gas.species().notation() + ": no lamp set; using the " + gas.components() + " Ritz lines of "
                        + rated.setIds() + " ranked by g_u A (equally populated upper states; " + rated.withoutRate()
                        + " lines without an A value and " + rated.outsideMedium() + " outside the " + medium.label()
                        + " model's range left out), as " + rated.size() + " lines at resolving power "
                        + java.math.BigDecimal.valueOf(gas.resolvingPower()).stripTrailingZeros().toPlainString());
            }
            if (fromLists != null && fromLists.duplicatesMerged() > 0) {
                notes.add(fromLists.duplicatesMerged() + " lines of " + fromLists.setIds() + " repeat an earlier list's"
                        + " line of the same species (within 1e-4 nm) and are used once");
            }
            if (fromLists != null && fromLists.outsideMedium() > 0) {
                notes.add(fromLists.outsideMedium() + " lines of " + fromLists.setIds() + " lie outside the range of"
                        + " the " + medium.label() + " model (far ultraviolet or infrared) and are left out; "
                        + fromLists.size() + " lines are used");
            }
            return notes;
        }
    }

    /**
     * The lamp of a calibration: for each gas its lamp set of highest precedence
     * ({@link DataContext#lampLines}) where the context has one, else the lines of its level list
     * ranked by g_u A ({@link #lamp}) and blended at the resolving power (by default
     * {@value #DEFAULT_LEVEL_LAMP_RESOLVING_POWER}: a level list gives every fine-structure
     * component, which a spectrometer does not resolve); then the given line lists. A resolving
     * power that is given blends the lamp sets and lists too. The caller checks that no gas or
     * list is named twice.
     *
     * @param context        where the data comes from
     * @param gases          the lamp's gases ({@code Ne I}, {@code He I}); may be empty
     * @param lists          line lists of the lamp (a user's files); may be empty
     * @param medium         the medium of the calibration's wavelengths
     * @param resolvingPower lambda / FWHM of the spectrometer, 1 to 1e7, or NaN for none given
     * @return the lamp and what it was made of
     * @throws IllegalArgumentException when there is no gas and no list, for a resolving power out
     *         of range, or when the lists cannot be joined (the lamp set's own checks)
     * @throws ReferenceDataException   ({@code unknown-data-set}) naming a gas with neither a lamp
     *         set nor a level list; ({@code missing-quantity}) for a level list without rates
     */
    public static CalibrationLamp calibrationLamp(DataContext context, List<Species> gases, List<LineList> lists,
            Medium medium, double resolvingPower) {
        Objects.requireNonNull(context, "context");
        Objects.requireNonNull(medium, "medium");
        if (gases.isEmpty() && lists.isEmpty()) {
            throw new IllegalArgumentException("a lamp needs a gas or a line list");
        }
        if (!Double.isNaN(resolvingPower) && !(resolvingPower >= 1 && resolvingPower <= 1e7)) {
            throw new IllegalArgumentException("resolving power must be 1 to 1e7, got " + resolvingPower);
        }
        List<LineList> all = new java.util.ArrayList<>();
        List<LevelLamp> fromLevels = new java.util.ArrayList<>();
        LampSet levelLines = null;
        for (Species gas : gases) {
            if (!context.registry().find(DataKind.LAMP_LINES, gas).isEmpty()) {
                all.add(context.lampLines(gas));
            } else if (context.levelList(gas).isPresent()) {
                LampSet rated = lamp(context, gas, medium);
                double r = Double.isNaN(resolvingPower) ? DEFAULT_LEVEL_LAMP_RESOLVING_POWER : resolvingPower;
                LampSet blended = rated.blendedAt(r);
                fromLevels.add(new LevelLamp(gas, rated.size(), blended, r));
                levelLines = levelLines == null ? blended : levelLines.plus(blended);
            } else {
                throw new ReferenceDataException(ReferenceDataException.UNKNOWN_DATA_SET, "no built-in lamp set or"
                        + " level list for " + gas.notation());
            }
        }
        all.addAll(lists);
        LampSet fromLists = all.isEmpty() ? null : LampSet.of(all, medium);
        if (fromLists != null && !Double.isNaN(resolvingPower)) {
            fromLists = fromLists.blendedAt(resolvingPower);
        }
        LampSet lamp = fromLists == null ? levelLines : levelLines == null ? fromLists : fromLists.plus(levelLines);
        return new CalibrationLamp(lamp, fromLists, fromLevels);
    }

    /**
     * @param sources    sources so far (e.g. {@link LineSources#none()})
     * @param context    where the data comes from
     * @param idsOrPaths line or lamp set ids ({@code lamp-ne-i}) or line-list files
     * @return the sources and those lists, in order
     * @throws ReferenceDataException when a set is unknown or not a line list
     * @throws DataFileException      when a file does not read
     */
    public static LineSources withLineLists(LineSources sources, DataContext context, List<String> idsOrPaths) {
        LineSources more = Objects.requireNonNull(sources, "sources");
        for (String set : idsOrPaths) {
            more = more.withLineList(context.lineList(set));
        }
        return more;
    }
}
