package org.ritzwerk.spark;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.function.DoubleUnaryOperator;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.catalyst.InternalRow;
import org.apache.spark.sql.catalyst.expressions.codegen.UnsafeArrayWriter;
import org.apache.spark.sql.catalyst.expressions.codegen.UnsafeRowWriter;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.LineList;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.ritz.RitzTransitions;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.synth.Continuum;
import org.ritzwerk.engine.synth.DarkLines;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Renderer;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SceneException;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.ContinuumFiles;
import org.ritzwerk.refdata.DataLines;

/**
 * Synthetic spectra in bulk on Spark: for every row of a {@link Schemas#SCENES} table, exactly
 * the library's {@code Scene.builder(grid)...build().render(1)} as the {@code synth} command
 * composes it (one-electron ions first, then alkali atoms, then species with a level list such as
 * He I, each with its abundance, then the parameters' line lists as {@code --lines}; temperature,
 * electron density, velocity, resolving power and the row's own noise seed), giving one
 * {@link Schemas#SPECTRA} row with the counts, the expected counts, the true lines and the count of
 * lines on the grid that carry no light, by cause (the library's {@code SyntheticSpectrum.darkLines()}).
 *
 * <p>Each call of {@link #synthesise} broadcasts the parameters once, when it is called (before
 * any action; every action on its table reuses the broadcast); each partition makes the data
 * context once and each species' level model at its first use. The result of a row depends on that
 * row alone (its seed), so it is the same on any partitioning and any number of cores. A malformed
 * row (or one whose id another row has) fails the job with a {@link SparkRowException} naming the
 * row's id and field; a scene the engine refuses (no line carries light in the grid) gets its code
 * and message in {@code failure_code} and {@code failure}.
 *
 * <p>Immutable and thread-safe; the operation is a lazy transformation.
 * An operation object lives on the driver and is not {@code Serializable}; only its parameter
 * record, which is, travels to the executors.
 */
public final class SurveySynthesis {

    private final SynthesisParameters parameters;
    /** Whether every row's id is checked to be unique (one extra read of the ids and a shuffle). */
    private final boolean checkIds;

    private SurveySynthesis(SynthesisParameters parameters, boolean checkIds) {
        this.parameters = Objects.requireNonNull(parameters, "parameters");
        this.checkIds = checkIds;
    }

    /**
     * @param parameters the grid and the settings shared by every scene
     * @return the operation; the data context and line sets are read once here on the driver as a
     *         check
     * @throws IllegalArgumentException naming a line set that is unknown or cannot be drawn
     */
    public static SurveySynthesis of(SynthesisParameters parameters) {
        // The data context and line sets are read once here on the driver as a check, so a set that
        // is unknown or unusable fails before any job, not in every task.
        new Setup(parameters);
        return new SurveySynthesis(parameters, true);
    }

    /**
     * @param on whether to check that no two rows share an id (on by default): a repeated id
     *           (the same file ingested twice) then fails the job naming the id. Off, a table
     *           whose ids are unique by construction (a primary key) is processed without the
     *           extra read of its ids and the shuffle that counts them; a repeated id then gives
     *           two output rows with that id. The numbers of every row are the same either way.
     *           A table whose plan makes its ids unique (grouped by them, as
     *           {@link SurveyIdentification#peakLists} makes; {@code dropDuplicates("id")}) is
     *           never counted: Spark's optimizer knows its ids are distinct keys.
     * @return the operation with the check on or off
     */
    public SurveySynthesis withIdCheck(boolean on) {
        return new SurveySynthesis(parameters, on);
    }

    /** @return the parameters */
    public SynthesisParameters parameters() {
        return parameters;
    }

    /**
     * @param scenes a table with the columns of {@link Schemas#SCENES}
     * @return one spectrum per scene, {@link Schemas#SPECTRA} (lazy)
     * @throws SparkRowException when a column is missing or has another type
     * @throws IllegalArgumentException when the table is streaming (use {@code foreachBatch})
     */
    public Dataset<Row> synthesise(Dataset<Row> scenes) {
        return Setups.run(scenes, Schemas.SCENES_COLUMNS, "scene", parameters, (p, f) -> {
            Setup setup = new Setup(p);
            return row -> setup.synthesise(f, row);
        }, Schemas.SPECTRA, checkIds);
    }

    /**
     * Every row {@link #synthesise} would refuse, found in one pass without rendering: the same
     * schema check, id check (when on, {@link #withIdCheck}) and checks of each row's fields
     * (species that cannot be read, are named twice or have no model; temperatures, densities,
     * velocities and resolving powers out of range), each refusal returned as a row instead of
     * failing the job. A scene the engine refuses while rendering it (its {@code failure_code}, no
     * line carrying light) is not an input problem and is not listed.
     *
     * @param scenes a table with the columns of {@link Schemas#SCENES}
     * @return the problems, {@link Schemas#PROBLEMS} (lazy): one row per row whose id other rows
     *         share, one per row with a malformed field (the first the operation would name), or
     *         a single row for a missing or mistyped column; empty when {@code synthesise} would
     *         refuse no row
     * @throws IllegalArgumentException when the table is streaming
     */
    public Dataset<Row> validate(Dataset<Row> scenes) {
        return Setups.validate(scenes, Schemas.SCENES_COLUMNS, "scene", parameters, (p, f) -> {
            Setup setup = new Setup(p);
            return row -> setup.check(f, row);
        }, checkIds);
    }

    /** The data context, grid and species models of one partition. Not thread-safe (one task). */
    private static final class Setup {
        private final SynthesisParameters p;
        private final DataContext data;
        private final PixelGrid grid;
        private final Medium medium;
        private final Renderer renderer;
        private final Map<String, Setups.Atoms> species = new HashMap<>();
        private final Map<Species, RitzTransitions> transitions = new HashMap<>();
        /** The parameters' continuum file, read once per partition; null without one. */
        private final DoubleUnaryOperator fileContinuum;
        /** The parameters' line lists, read once per partition (an unknown set fails the setup). */
        private final List<LineList> lineLists = new java.util.ArrayList<>();
        private final Catalyst.Strings strings = new Catalyst.Strings();
        /** The output row's writers: the spectrum, its arrays of doubles and its true lines. */
        private final UnsafeRowWriter out = new UnsafeRowWriter(Schemas.SPECTRA.size(), 65536);
        private final UnsafeArrayWriter arrayOut = new UnsafeArrayWriter(out, 8);
        private final UnsafeArrayWriter linesOut = new UnsafeArrayWriter(out, 8);
        private final UnsafeRowWriter lineOut = new UnsafeRowWriter(linesOut, Schemas.TRUE_LINE.size());
        private final UnsafeArrayWriter notesOut = new UnsafeArrayWriter(out, 8);
        private final UnsafeRowWriter darkOut = new UnsafeRowWriter(out, Schemas.DARK_LINES.size());
        /** The field of {@link Schemas#DARK_LINES} counting each cause, by ordinal (its name in lower case). */
        private final int[] causeFields = java.util.Arrays.stream(DarkLines.Cause.values())
                .mapToInt(c -> Schemas.DARK_LINES.fieldIndex(c.name().toLowerCase(java.util.Locale.ROOT))).toArray();

        Setup(SynthesisParameters p) {
            this.p = p;
            this.data = Setups.context(p.dataFiles());
            this.grid = p.grid();
            this.medium = Medium.parse(p.medium());
            this.renderer = p.rendererChoice();
            if (p.background().kind().equals("file")) {
                try {
                    fileContinuum = ContinuumFiles.read(java.nio.file.Path.of(p.background().file()), grid.lowest(),
                            grid.highest());
                } catch (RuntimeException e) {
                    throw new IllegalArgumentException("continuum file " + p.background().file() + ": "
                            + e.getMessage(), e);
                }
            } else {
                fileContinuum = null;
            }
            // Each list is read and checked here, once: a set that is unknown, gives no line an
            // intensity or names an element without nuclear data fails the setup naming it, not
            // every row.
            for (String set : p.lineSets()) {
                try {
                    LineList list = data.lineList(set);
                    Scene.builder(grid).lineList(list, data::nucleus);
                    java.util.Set<Species> seen = new java.util.HashSet<>();
                    for (int i = 0; i < list.size(); i++) {
                        if (seen.add(list.species(i))) {
                            data.nucleus(list.species(i));
                        }
                    }
                    lineLists.add(list);
                } catch (RuntimeException e) {
                    throw new IllegalArgumentException("lineSets " + set + ": " + e.getMessage(), e);
                }
            }
        }

        /**
         * The checks {@link #synthesise} makes of a row before it renders, without rendering: the
         * fields read, the species parsed, told apart and modelled, the ranges checked and the
         * engine's own range checks of the scene's settings ({@link #read}, which both use, then
         * each species' model in the row's order, as {@code synthesise} asks for them).
         *
         * @throws SparkRowException naming the row's id and the field, as {@code synthesise} would
         */
        void check(Fields f, InternalRow row) {
            Read scene = read(f, row);
            for (String name : scene.names()) {
                atoms(scene.id(), name);
            }
        }

        /** A scene row read and checked: what {@link #synthesise} needs before it adds the species. */
        private record Read(String id, String[] names, double[] abundances, double temperature, long seed,
                Scene.Builder builder) {
        }

        /**
         * @return the row's fields, each checked, and a scene builder with the grid, the parameters'
         *         settings and the row's instrument, temperature, velocity and density
         * @throws SparkRowException naming the row's id and the field
         */
        private Read read(Fields f, InternalRow row) {
            String id = f.id(row);
            String[] names = f.strings(row, id, 1, !lineLists.isEmpty());
            // A lamp scene (no species) may give an empty abundance list, as long as its species.
            double[] abundances = names.length == 0 ? null : f.optionalDoubles(row, id, 2, names.length, 0, true);
            double temperature = f.number(row, id, 3);
            double density = f.optionalNumber(row, id, 4);
            double velocity = f.number(row, id, 5);
            double resolvingPower = f.number(row, id, 6);
            long seed = f.whole(row, id, 7);
            java.util.Set<Species> named = new java.util.HashSet<>();
            for (String name : names) {
                Species species;
                try {
                    species = Species.parse(name.strip());
                } catch (RuntimeException e) {
                    throw new SparkRowException(SparkRowException.BAD_FIELD, id, "species", e.getMessage());
                }
                if (!named.add(species)) {
                    throw new SparkRowException(SparkRowException.BAD_FIELD, id, "species", "names "
                            + species.notation() + " twice (as '" + name.strip() + "'); give each species once");
                }
            }
            if (!(temperature > 0)) {
                throw new SparkRowException(SparkRowException.BAD_FIELD, id, "temperature_k", "is " + temperature
                        + "; it must be above 0 K");
            }
            if (!Double.isNaN(density) && !(density > 0)) {
                throw new SparkRowException(SparkRowException.BAD_FIELD, id, "electron_density_m3", "is " + density
                        + "; it must be above 0 per cubic metre, or null");
            }
            if (!(Math.abs(velocity) < PhysicalConstants.C / 10)) {
                throw new SparkRowException(SparkRowException.BAD_FIELD, id, "velocity_m_s", "is " + velocity
                        + "; its magnitude must be below a tenth of the speed of light");
            }
            if (!(resolvingPower >= 1 && resolvingPower <= 1e9)) {
                throw new SparkRowException(SparkRowException.BAD_FIELD, id, "resolving_power", "is "
                        + resolvingPower + "; it must be 1 to 1e9, as synth --resolving-power takes it");
            }
            Scene.Builder builder = Scene.builder(grid).medium(medium).naturalWidths(p.shapes().naturalWidths())
                    .components(p.shapes().components()).renderer(renderer).nMax(p.nMax()).peakCounts(p.peakCounts())
                    .collisionalFwhm(p.shapes().collisionalFwhmNm());
            // The engine's own range checks, each refusal naming the row's field.
            set(id, "resolving_power", () -> builder.instrument(Instrument.ofResolvingPower(resolvingPower)));
            set(id, "temperature_k", () -> builder.temperature(temperature));
            set(id, "velocity_m_s", () -> builder.velocity(velocity));
            if (!Double.isNaN(density)) {
                set(id, "electron_density_m3", () -> builder.electronDensity(density));
            }
            return new Read(id, names, abundances, temperature, seed, builder);
        }

        /** A level list's Ritz lines (E1 and LS rules, the context's A values), computed at first use. */
        private RitzTransitions transitions(RitzLevels levels) {
            return transitions.computeIfAbsent(levels.species(),
                    s -> DataLines.ritzLines(data, s).compute(levels));
        }

        /** The species' model, made at its first use in this partition. */
        private Setups.Atoms atoms(String id, String text) {
            Setups.Atoms atoms = species.get(text);
            if (atoms == null) {
                try {
                    atoms = Setups.atoms(data, List.of(text), p.model());
                } catch (RuntimeException e) {
                    throw new SparkRowException(SparkRowException.BAD_FIELD, id, "species", e.getMessage());
                }
                species.put(text, atoms);
            }
            return atoms;
        }

        /**
         * The settings that do nothing for this scene, as notes: the command refuses such an option,
         * but one table may hold scenes with one-electron ions and scenes without, so a row says
         * it instead. Only settings away from their defaults are named.
         */
        private List<String> withoutEffect(String id, String[] names) {
            boolean ions = false;
            for (String name : names) {
                ions |= !atoms(id, name).ions().isEmpty();
            }
            List<String> notes = new java.util.ArrayList<>(4);
            String noIon = " has no effect on this scene: it holds no one-electron ion";
            if (!ions && !p.model().equals(SynthesisParameters.DEFAULT_MODEL)) {
                notes.add("the level model " + p.model() + noIon + " (alkali atoms, level lists and line lists bring"
                        + " their own levels)");
            }
            if (names.length == 0 && p.nMax() != SynthesisParameters.DEFAULT_N_MAX) {
                notes.add("the highest n (" + p.nMax() + ") has no effect on this scene: it names no species (line"
                        + " lists bring their own lines)");
            }
            if (!ions && p.shapes().naturalWidths()) {
                notes.add("natural widths have no effect on this scene: they are computed for one-electron ions' lines,"
                        + " and it holds none");
            }
            if (!ions && p.shapes().components()) {
                notes.add("drawing fine-structure components" + noIon);
            }
            return notes;
        }

        InternalRow synthesise(Fields f, InternalRow row) {
            Read read = read(f, row);
            String id = read.id();
            String[] names = read.names();
            double[] abundances = read.abundances();
            double temperature = read.temperature();
            long seed = read.seed();
            Scene.Builder builder = read.builder();
            // The command line's order: one-electron ions first, then alkali atoms.
            for (int k = 0; k < names.length; k++) {
                for (Setups.Ion ion : atoms(id, names[k]).ions()) {
                    builder.hydrogenLike(ion.species(), ion.model(), abundances == null ? 1.0 : abundances[k]);
                }
            }
            for (int k = 0; k < names.length; k++) {
                for (AlkaliAtom atom : atoms(id, names[k]).alkalis()) {
                    builder.alkali(atom, abundances == null ? 1.0 : abundances[k], data.nucleus(atom.species()));
                }
            }
            if (!Double.isNaN(p.readNoise())) {
                builder.noise(p.readNoise(), seed);
            }
            SyntheticSpectrum spectrum;
            Scene scene;
            try {
                // Then the level-list species (He I), as the command adds them.
                for (int k = 0; k < names.length; k++) {
                    for (RitzLevels levels : atoms(id, names[k]).levels()) {
                        builder.levels(transitions(levels), abundances == null ? 1.0 : abundances[k],
                                data.nucleus(levels.species()));
                    }
                }
                for (LineList list : lineLists) {
                    builder.lineList(list, data::nucleus);
                }
                continuum(builder, temperature);
                scene = builder.build();
                spectrum = scene.render(1);
            } catch (SceneException e) {
                out.reset();
                out.zeroOutNullBytes();
                out.write(0, f.utf8Id(row));
                out.setNullAt(1);
                out.setNullAt(2);
                out.setNullAt(3);
                Catalyst.string(out, 4, Catalyst.utf8(e.code()));
                Catalyst.string(out, 5, Catalyst.utf8(e.getMessage()));
                out.setNullAt(6);
                out.setNullAt(7);
                return out.getRow();
            }
            // Written straight into Spark's binary row form (see SurveyIdentification): no copies of
            // the arrays in between, no boxed values; the row is overwritten by the next one.
            out.reset();
            out.zeroOutNullBytes();
            out.write(0, f.utf8Id(row));
            doubles(1, spectrum.counts());
            doubles(2, spectrum.expectedCounts());
            Scene.Lines lines = spectrum.lines();
            int start = out.cursor();
            linesOut.initialize(lines.size());
            for (int i = 0; i < lines.size(); i++) {
                int at = linesOut.cursor();
                lineOut.resetRowWriter();
                Catalyst.string(lineOut, 0, strings.of(lines.label(i)));
                lineOut.write(1, lines.position(i));
                lineOut.write(2, lines.photons(i));
                lineOut.write(3, lines.gaussianFwhm(i));
                lineOut.write(4, lines.lorentzFwhm(i));
                lineOut.write(5, spectrum.lineCounts(i));
                lineOut.write(6, spectrum.lineCountsInPixels(i));
                linesOut.setOffsetAndSizeFromPreviousCursor(i, at);
            }
            out.setOffsetAndSizeFromPreviousCursor(3, start);
            out.setNullAt(4);
            out.setNullAt(5);
            List<String> notes = new java.util.ArrayList<>(scene.notes());
            notes.addAll(withoutEffect(id, names));
            start = out.cursor();
            notesOut.initialize(notes.size());
            for (int k = 0; k < notes.size(); k++) {
                notesOut.write(k, strings.of(notes.get(k)));
            }
            out.setOffsetAndSizeFromPreviousCursor(6, start);
            // The library's own classification of the dark lines, counted by cause.
            DarkLines dark = spectrum.darkLines();
            start = out.cursor();
            darkOut.resetRowWriter();
            darkOut.write(0, dark.onGrid());
            darkOut.write(1, dark.size());
            for (DarkLines.Cause cause : DarkLines.Cause.values()) {
                darkOut.write(causeFields[cause.ordinal()], dark.count(cause));
            }
            out.setOffsetAndSizeFromPreviousCursor(7, start);
            return out.getRow();
        }

        /** The parameters' continuum, as the command draws it (a blackbody at the scene's temperature by default). */
        private void continuum(Scene.Builder builder, double temperature) {
            SynthesisParameters.Background background = p.background();
            DoubleUnaryOperator density;
            switch (background.kind()) {
                case "flat" -> density = nm -> 1;
                case "file" -> density = fileContinuum;
                case "blackbody" -> {
                    double t = Double.isNaN(background.temperatureK()) ? temperature : background.temperatureK();
                    density = Continuum.blackbodyPhotons(medium, t);
                }
                default -> {
                    return;
                }
            }
            builder.continuum(density, background.counts());
        }

        /** Applies one setting of the scene, an engine refusal naming the row's field. */
        private static void set(String id, String field, Runnable setting) {
            try {
                setting.run();
            } catch (IllegalArgumentException e) {
                throw new SparkRowException(SparkRowException.BAD_FIELD, id, field, e.getMessage());
            }
        }

        /** Writes the doubles as the output row's field. */
        private void doubles(int field, double[] values) {
            int start = out.cursor();
            arrayOut.initialize(values.length);
            for (int i = 0; i < values.length; i++) {
                arrayOut.write(i, values[i]);
            }
            out.setOffsetAndSizeFromPreviousCursor(field, start);
        }
    }
}
