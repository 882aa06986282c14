package org.ritzwerk.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.Callable;
import java.util.function.DoubleUnaryOperator;
import org.ritzwerk.atom.Elements;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.synth.Continuum;
import org.ritzwerk.engine.synth.DarkLines;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineColumns;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Renderer;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SceneException;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.ContinuumFiles;
import org.ritzwerk.refdata.DataFileException;
import org.ritzwerk.refdata.DataLines;
import org.ritzwerk.refdata.OutputFiles;
import org.ritzwerk.refdata.SpectrumLineFiles;
import org.ritzwerk.refdata.SyntheticSpectrumFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code ritzwerk synth}: a synthetic emission spectrum of one-electron ions with known truth. */
@Command(name = "synth",
        mixinStandardHelpOptions = true,
        header = "Render a synthetic emission spectrum.",
        description = "Render a synthetic emission spectrum: the n -> n' lines of one-electron ions (and the "
                + "Ritz lines with A of species with a level list such as He I, the "
                + "lines of alkali atoms, and line lists with --lines), upper levels populated by "
                + "Boltzmann's law at --temperature (which also sets the Doppler width), seen through a "
                + "Gaussian instrument of --resolving-power, integrated over each pixel, scaled so the "
                + "lines' brightest pixel expects --peak-counts (a continuum is added on top), then given Poisson "
                + "and read noise from --seed. "
                + "Writes a ritzwerk-spectrum CSV; --truth also writes the lines that went in.",
        footer = {"", "Examples:",
            "  ritzwerk synth --species \"H I\" --from \"640 nm air\" --to \"670 nm air\" --temperature 9000",
            "  ritzwerk synth --species \"H I,He II\" --from 380nm --to 700nm --temperature 20000 --seed 7",
            "  ritzwerk synth --lines lamp-ne-i --dispersion 540,0.06,-2e-6 --pixels 2048 --temperature 400",
            "  ritzwerk synth --species H --from 380nm --to 700nm --temperature 9000 --out s.csv --truth t.csv"})
final class SynthCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    Ions ions;

    @Mixin
    DataOptions data;

    @Option(names = "--from", paramLabel = "QUANTITY", description = "One end of the spectrum (or give --dispersion).")
    String from;

    @Option(names = "--to", paramLabel = "QUANTITY", description = "The other end.")
    String to;

    @Option(names = "--dispersion", paramLabel = "C0,C1,...",
            description = "Instead of --from/--to: pixel p (0-based) sees c0 + c1 p + c2 p^2 + ... nm in the axis "
                    + "medium at its centre (its edges where the polynomial gives p -+ 1/2; the file's wavelength is "
                    + "the mean of the edges), for --pixels pixels, as a spectrometer's dispersion does; rising or "
                    + "falling with p, the rows in pixel order.")
    String dispersion;

    @Option(names = "--lines", paramLabel = "SET",
            description = "Also draw a line list: a data set id (e.g. lamp-ne-i) or a line-list file, with its "
                    + "relative intensities (lines without one are left out). Repeatable. With --species too, "
                    + "each list is scaled so its strongest line carries as many photons as the strongest ion "
                    + "line as drawn (abundances, Saha balance). A file beyond 64 MiB or a million lines is "
                    + "streamed from the disk as columns (about 18 bytes a line).")
    List<String> lineSets = new ArrayList<>();

    @Option(names = "--medium", paramLabel = "MEDIUM", defaultValue = "vacuum",
            description = "Wavelengths of the pixel axis: vacuum or air (standard air). Default: ${DEFAULT-VALUE}.")
    String medium;

    @Option(names = "--temperature", required = true, paramLabel = "K",
            description = "Excitation and kinetic temperature of the emitters, kelvin.")
    double temperature;

    @Option(names = "--velocity", paramLabel = "KM_S", defaultValue = "0",
            description = "Line-of-sight velocity of the emitters in km/s, positive away: every line is shifted by "
                    + "the relativistic Doppler factor sqrt((1 + v/c) / (1 - v/c)). Default: ${DEFAULT-VALUE}.")
    double velocity;

    @Option(names = "--collisional-width", paramLabel = "NM", defaultValue = "0",
            description = "Lorentzian FWHM in nm given to every line (pressure broadening). Default: ${DEFAULT-VALUE}.")
    double collisionalWidth;

    @Option(names = "--resolving-power", paramLabel = "R", defaultValue = "10000",
            description = "Instrument resolving power lambda / FWHM (Gaussian response). Default: ${DEFAULT-VALUE}.")
    double resolvingPower;

    @Option(names = "--pixels", paramLabel = "N", defaultValue = "4000",
            description = "Number of pixels. Default: ${DEFAULT-VALUE}.")
    int pixels;

    @Option(names = "--grid", paramLabel = "KIND", defaultValue = "linear",
            description = "Pixel spacing: linear or log (constant lambda per pixel ratio). Default: ${DEFAULT-VALUE}.")
    String gridKind;

    @Option(names = "--n-max", paramLabel = "N", defaultValue = "30",
            description = "Highest upper n; also the cutoff of the partition function. Default: ${DEFAULT-VALUE}.")
    int nMax;

    @Option(names = "--peak-counts", paramLabel = "COUNTS", defaultValue = "10000",
            description = "Expected counts in the brightest pixel of the lines alone, before noise; a continuum is "
                    + "added on top (its own brightest pixel at --continuum-counts), so a pixel may exceed it. "
                    + "Default: ${DEFAULT-VALUE}.")
    double peakCounts;

    @Option(names = "--read-noise", paramLabel = "COUNTS", defaultValue = "0",
            description = "Gaussian read noise per pixel, standard deviation in counts. Default: ${DEFAULT-VALUE}.")
    double readNoise;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1",
            description = "Seed of the noise; the same seed gives the same counts. Default: ${DEFAULT-VALUE}.")
    long seed;

    @Option(names = "--no-noise", description = "Write the expected counts without noise.")
    boolean noNoise;

    @Option(names = "--electron-density", paramLabel = "PER_M3",
            description = "Electron density in m^-3: weights H I, He I and He II by the Saha balance at "
                    + "--temperature (other species get none; a note says so) and gives H-alpha and H-beta their "
                    + "Stark widths (Gigosos et al. 2003 fits).")
    Double electronDensity;

    @Option(names = "--abundance", paramLabel = "ELEMENT=N",
            description = "Relative number of atoms of an element, e.g. He=0.1 (repeatable; default 1 each).")
    java.util.List<String> abundances = new java.util.ArrayList<>();

    @Option(names = "--components", description = "Draw the one-electron ions' fine-structure components (n l j "
            + "-> n' l' j', each at its own position) instead of one line per n -> n' multiplet; they show at a "
            + "resolving power of a few 1e5 or in a cold scene. Hyperfine structure is not drawn.")
    boolean components;

    @Option(names = "--natural-widths", description = "Add the lines' natural (radiative) widths; needs --n-max <= 60.")
    boolean naturalWidths;

    @Option(names = "--continuum", paramLabel = "KIND", defaultValue = "none",
            description = "none, flat, or blackbody (at --continuum-temperature, in photons per wavelength like "
                    + "the lines). Default: ${DEFAULT-VALUE}.")
    String continuumKind;

    @Option(names = "--continuum-file", paramLabel = "FILE",
            description = "A continuum of your own: CSV with a header wavelength_nm,density (axis medium), "
                    + "wavelengths rising and covering the range; linear between points.")
    Path continuumFile;

    @Option(names = "--continuum-temperature", paramLabel = "K",
            description = "Temperature of a blackbody continuum. Default: --temperature.")
    Double continuumTemperature;

    @Option(names = "--continuum-counts", paramLabel = "COUNTS", defaultValue = "100",
            description = "Expected counts of the continuum's brightest pixel. Default: ${DEFAULT-VALUE}.")
    double continuumCounts;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "csv",
            description = "csv (ritzwerk-spectrum 1) or json (one document with the pixels and the lines). Default: "
                    + "${DEFAULT-VALUE}.")
    String format;

    @Option(names = "--plot", paramLabel = "PNG", description = "Also draw the spectrum, strongest lines labelled, into this PNG.")
    Path plot;

    @Option(names = "--plot-scale", paramLabel = "SCALE", defaultValue = "linear",
            description = "Counts axis of --plot: linear, or log where weak lines matter. Default: ${DEFAULT-VALUE}.")
    String plotScale;

    @Option(names = "--threads", paramLabel = "N",
            description = "Threads for rendering; the result is the same for any number. Default: all processors.")
    Integer threads;

    @Option(names = "--renderer", paramLabel = "KIND", defaultValue = "auto",
            description = "exact (each line integrated over each pixel within 50 FWHMs), fast (all lines at once in "
                    + "the Fourier domain, whole profiles, within 1e-4 of the peak), or auto (fast from 1e9 "
                    + "lines x pixels). Default: ${DEFAULT-VALUE}.")
    String renderer;

    @Option(names = "--out", paramLabel = "FILE", description = "Write the spectrum here instead of to the output.")
    Path out;

    @Option(names = "--truth", paramLabel = "FILE", description = "Also write the rendered lines, with their counts, here.")
    Path truth;

    @Override
    public Integer call() throws IOException {
        OptionRules.distinct("--lines", lineSets);
        checkOptions();
        checkOutputs();
        if (!format.equals("csv") && !format.equals("json")) {
            throw new OptionException("--format must be csv or json, got '" + format + "'");
        }
        int threadCount = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (threadCount < 1 || threadCount > 1024) {
            throw new OptionException("--threads must be 1 to 1024, got " + threadCount);
        }
        Medium axisMedium = AxisMedium.of(medium);
        PixelGrid grid = grid(axisMedium);
        double span = grid.highest() - grid.lowest();
        if (collisionalWidth > 1000 * span) {
            throw new OptionException("--collisional-width must be a Lorentzian FWHM from 0 to 1000 times the"
                    + " spectrum's span (" + OptionRules.show(1000 * span) + " nm here), got "
                    + OptionRules.show(collisionalWidth) + " nm");
        }
        Scene.Builder builder = Scene.builder(grid)
                .medium(axisMedium)
                .instrument(Instrument.ofResolvingPower(resolvingPower))
                .naturalWidths(naturalWidths).components(components);
        builder.renderer(renderer());
        option("--temperature", () -> builder.temperature(temperature));
        option("--n-max", () -> builder.nMax(nMax));
        option("--velocity", () -> builder.velocity(velocity * 1e3));
        option("--collisional-width", () -> builder.collisionalFwhm(collisionalWidth));
        option("--peak-counts", () -> builder.peakCounts(peakCounts));
        if (electronDensity != null) {
            option("--electron-density", () -> builder.electronDensity(electronDensity));
        }
        Map<Integer, Double> abundance = abundances();
        LevelSets.Split levelSets = LevelSets.split(data.context(), ions.species);
        Ions.Atoms atoms = levelSets.others().isEmpty() ? new Ions.Atoms(List.of(), List.of())
                : Ions.atoms(data.context(), levelSets.others(), ions.model);
        Ions.tierNotes(atoms.ions(), ions.model, "synth").forEach(spec.commandLine().getErr()::println);
        List<Ions.Ion> resolved = atoms.ions();
        OptionRules rules = new OptionRules(spec);
        String noIon = "without a one-electron ion in --species (";
        rules.refuseUnless("--model", !resolved.isEmpty(), noIon + "it is their level model; alkali atoms and --lines"
                + " lists bring their own levels)");
        rules.refuseUnless("--natural-widths", !resolved.isEmpty(), noIon + "natural widths are computed for their"
                + " lines)");
        rules.refuseUnless("--components", !resolved.isEmpty(), noIon + "it draws their fine structure)");
        rules.refuseUnless("--n-max", !ions.species.isEmpty(), "without --species (--lines lists bring their own"
                + " lines)");
        LevelSets.levelListsAndNMax(rules, !resolved.isEmpty() || !atoms.alkalis().isEmpty(), levelSets.levels(), nMax,
                spec.commandLine().getErr());
        if (resolved.isEmpty() && atoms.alkalis().isEmpty() && levelSets.levels().isEmpty() && lineSets.isEmpty()) {
            throw new OptionException("give --species (one-electron ions, alkali atoms), --lines (line lists),"
                    + " or both");
        }
        List<String> models = new ArrayList<>();
        if (!resolved.isEmpty()) {
            models.add(ions.model + " levels of the one-electron ions, n <= " + nMax);
        }
        if (!atoms.alkalis().isEmpty()) {
            models.add("quantum-defect levels of the alkali atoms, n <= " + nMax);
        }
        for (var levels : levelSets.levels()) {
            models.add("the level list of " + levels.species().notation());
        }
        modelDescription = models.isEmpty() ? "none (line lists only)" : String.join("; ", models);
        for (Ions.Ion ion : resolved) {
            builder.hydrogenLike(ion.species(), ion.model(), abundance.getOrDefault(ion.species().z(), 1.0));
        }
        for (AlkaliAtom atom : atoms.alkalis()) {
            builder.alkali(atom, abundance.getOrDefault(atom.species().z(), 1.0),
                    data.context().nucleus(atom.species()));
            if (electronDensity != null) {
                spec.commandLine().getErr().println("note: " + atom.species().notation() + ": no ionisation balance for"
                        + " alkali atoms; --abundance counts its neutral atoms");
            }
        }
        for (var levels : levelSets.levels()) {
            builder.levels(levels, DataLines.ritzLines(data.context(), levels.species()),
                    abundance.getOrDefault(levels.species().z(), 1.0), data.context().nucleus(levels.species()));
        }
        for (int z : abundance.keySet()) {
            if (resolved.stream().noneMatch(ion -> ion.species().z() == z)
                    && levelSets.levels().stream().noneMatch(levels -> levels.species().z() == z)
                    && atoms.alkalis().stream().noneMatch(atom -> atom.species().z() == z)) {
                throw new OptionException("--abundance names " + Elements.symbol(z)
                        + ", which is not among --species");
            }
        }
        for (String set : lineSets) {
            try {
                addLines(builder, set);
            } catch (IllegalArgumentException e) {
                throw new OptionException("--lines " + set + ": " + e.getMessage(), e);
            }
        }
        addContinuum(builder, grid);
        if (!noNoise) {
            option("--read-noise", () -> builder.noise(readNoise, seed));
        }
        if (naturalWidths && nMax > Scene.MAX_N_WITH_NATURAL_WIDTHS && !resolved.isEmpty()) {
            throw new OptionException("--natural-widths are computed up to n = "
                    + Scene.MAX_N_WITH_NATURAL_WIDTHS + "; lower --n-max (" + nMax + ") or leave them out");
        }
        WorkEstimate.hydrogenLines("synth", "the lines of the one-electron ions up to n = " + nMax,
                builder.ionLineWorkUnits()).ifPresent(note -> {
                    spec.commandLine().getErr().println(note);
                    spec.commandLine().getErr().flush();
                });
        Scene scene = builder.build();
        SyntheticSpectrum spectrum;
        try {
            spectrum = scene.render(threadCount, Progress.on(spec.commandLine().getErr(),
                    "synth: rendering " + scene.lines().size() + " lines onto " + grid.pixels() + " pixels"));
        } catch (SceneException e) {
            if (e.code().equals(SceneException.NO_LIGHT)) {
                String range = dispersion == null ? from + " and " + to : fmt(spectrumEdge(0)) + " nm and "
                        + fmt(spectrumEdge(1)) + " nm";
                DarkLines dark = e.darkLines().orElseGet(scene::darkLines);
                List<String> unlit = unlit(dark);
                if (!unlit.isEmpty()) {
                    throw new OptionException(dark.onGrid() + " line(s) of " + emitters() + " fall"
                            + " between " + range + ", but none carries any light: " + String.join("; ", unlit), e);
                }
                throw new OptionException("no line of " + emitters() + " falls between " + range
                        + (ions.species.isEmpty() ? "; widen the range (a line list brings only its own lines)"
                                : " (n <= " + nMax + "); widen the range or raise --n-max"), e);
            }
            throw e;
        } catch (IllegalArgumentException e) {
            if (renderer() == Renderer.FAST) {
                // the fast renderer's limits (internal grid, heap) are the chosen renderer's, not a bug
                throw new OptionException("--renderer fast: " + e.getMessage(), e);
            }
            throw e;
        }
        for (String note : scene.notes()) {
            spec.commandLine().getErr().println("note: " + note);
        }
        if (!noNoise && !new OptionRules(spec).given("--seed")) {
            spec.commandLine().getErr().println("note: the noise is drawn from the default --seed " + seed
                    + "; spectra made without --seed share their noise, so give each its own seed");
        }
        for (String unlit : unlit(spectrum.darkLines())) {
            spec.commandLine().getErr().println("note: " + unlit);
        }
        spec.commandLine().getErr().flush();
        Map<String, Object> description = description();
        OutputFiles.TextContent spectrumText = format.equals("json")
                ? w -> SyntheticSpectrumFiles.writeJson(spectrum, gridName(), description, scene.notes(), w)
                : w -> SyntheticSpectrumFiles.writeCsv(spectrum, gridName(), description, w);
        // Every file is written to a temporary file beside it and moved into place only at the end.
        try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
            if (out != null) {
                batch.text(out, spectrumText);
            }
            if (truth != null) {
                batch.text(truth, w -> SpectrumLineFiles.writeCsv(spectrum, w));
            }
            if (plot != null) {
                drawPlot(batch, spectrum);
            }
            if (out == null) {
                PrintWriter stdout = spec.commandLine().getOut();
                spectrumText.writeTo(stdout);
                stdout.flush();
            }
            batch.commit();
        }
        return 0;
    }

    /**
     * One --lines set into the scene: read whole, or, for a file beyond the whole-file reader's
     * limits, streamed as columns (millions of lines, no object a line; the same lines, counts
     * and truth as the whole-file path gives for a smaller file).
     */
    private void addLines(Scene.Builder builder, String set) {
        LineList list;
        try {
            list = LineSets.load(data.context(), set, "--lines");
        } catch (DataFileException e) {
            LineColumns columns = LineSets.streamedWhenTooLarge(set, e).orElseThrow(() -> e);
            builder.lineColumns(columns, data.context()::nucleus);
            return;
        }
        builder.lineList(list, data.context()::nucleus);
    }

    /** Counts are kept exact as whole numbers in a double up to 2^53 (about 9e15): the cap of every count option. */
    private static final double MAX_COUNTS = 1e15;

    /**
     * Refuses, before any work, numbers outside their range (said in the option's unit) and
     * options that would have no effect in this combination.
     */
    /** The renderer named by --renderer. */
    private Renderer renderer() {
        return switch (renderer) {
            case "exact" -> Renderer.EXACT;
            case "fast" -> Renderer.FAST;
            case "auto" -> Renderer.AUTO;
            default -> throw new OptionException("--renderer must be exact, fast or auto, got '" + renderer
                    + "'");
        };
    }

    private void checkOptions() {
        OptionRules rules = new OptionRules(spec);
        if (pixels < 2 || pixels > 50_000_000) {
            throw new OptionException("--pixels must be 2 to 50000000, got " + pixels);
        }
        OptionRules.range("--resolving-power", resolvingPower, 1, true, 1e9,
                "a resolving power lambda / FWHM from 1 to 1e9 (e.g. 5000)");
        OptionRules.range("--temperature", temperature, 0, false, Math.nextDown(1e9), "a temperature above 0 and below 1e9 K");
        double maxSpeed = org.ritzwerk.constants.PhysicalConstants.C / 1e4;
        if (!(Math.abs(velocity) < maxSpeed)) {
            throw new OptionException(String.format(Locale.ROOT, "--velocity must be a line-of-sight speed in"
                    + " km/s below a tenth of the speed of light in size (-%.0f to %.0f km/s), got %s km/s",
                    maxSpeed, maxSpeed, OptionRules.show(velocity)));
        }
        OptionRules.range("--collisional-width", collisionalWidth, 0, true, Double.MAX_VALUE,
                "a Lorentzian FWHM of 0 nm or more");
        OptionRules.range("--peak-counts", peakCounts, 0, false, MAX_COUNTS,
                "a number of counts above 0 and at most 1e15");
        OptionRules.range("--read-noise", readNoise, 0, true, MAX_COUNTS,
                "a standard deviation from 0 to 1e15 counts");
        boolean continuum = continuumFile != null || !continuumKind.equals("none");
        rules.refuseUnless("--continuum-counts", continuum, "without --continuum or --continuum-file");
        rules.refuseUnless("--continuum-temperature", continuumKind.equals("blackbody"),
                "without --continuum blackbody");
        OptionRules.range("--continuum-counts", continuumCounts, 0, false, MAX_COUNTS,
                "a number of counts above 0 and at most 1e15");
        if (continuumTemperature != null) {
            OptionRules.range("--continuum-temperature", continuumTemperature, 0, false, Math.nextDown(1e9),
                    "a temperature above 0 and below 1e9 K");
        }
        rules.refuseUnless("--plot-scale", plot != null, "without --plot");
        if (!plotScale.equals("linear") && !plotScale.equals("log")) {
            throw new OptionException("--plot-scale must be linear or log, got '" + plotScale + "'");
        }
        rules.refuseUnless("--read-noise", !noNoise, "with --no-noise");
        rules.refuseUnless("--seed", !noNoise, "with --no-noise");
        if (electronDensity != null) {
            OptionRules.range("--electron-density", electronDensity, 0, false, 1e25,
                    "a density above 0 and at most 1e25 per cubic metre (the Stark fits' range)");
        }
    }

    private PixelGrid grid(Medium axisMedium) {
        if (dispersion != null) {
            boolean range = from != null || to != null;
            boolean spacing = new OptionRules(spec).given("--grid");
            String gridUnused = "--grid does not apply with --dispersion (its polynomial places the pixels)";
            if (range) {
                throw new OptionException("give --dispersion or --from/--to, not both" + (spacing ? "; " + gridUnused
                        : ""));
            }
            if (spacing) {
                throw new OptionException(gridUnused);
            }
            String[] cells = dispersion.split(",");
            double[] c = new double[cells.length];
            for (int k = 0; k < cells.length; k++) {
                try {
                    c[k] = Double.parseDouble(cells[k].strip());
                } catch (NumberFormatException e) {
                    throw new OptionException("--dispersion: coefficient c" + k + " '" + cells[k].strip()
                            + "' is not a number");
                }
            }
            PixelGrid grid;
            try {
                grid = PixelGrid.dispersion(c, pixels);
            } catch (IllegalArgumentException e) {
                throw new OptionException("--dispersion: " + e.getMessage(), e);
            }
            double first = grid.lowest();
            if (!(first > 0)) {
                throw new OptionException("--dispersion: the wavelength must be above 0 nm on every pixel, but the"
                        + " first pixel's edge is at " + OptionRules.show(first) + " nm");
            }
            return grid;
        }
        if (from == null || to == null) {
            throw new OptionException("give --from and --to (or --dispersion)");
        }
        double oneEnd = AxisMedium.nanometres("--from", from, axisMedium);
        double otherEnd = AxisMedium.nanometres("--to", to, axisMedium);
        if (!axisMedium.equals(Medium.vacuum()) && !noted) {
            noted = true;
            List<String> bare = new ArrayList<>();
            for (String end : List.of(from, to)) {
                String text = end.toLowerCase(Locale.ROOT);
                if (AxisMedium.spectral("--from", end) instanceof org.ritzwerk.quantity.Wavelength
                        && !text.contains("air") && !text.contains("vac")) {
                    bare.add(end);
                }
            }
            if (!bare.isEmpty()) {
                boolean one = bare.size() == 1;
                spec.commandLine().getErr().println("note: " + String.join(" and ", bare) + (one ? " names" : " name")
                        + " no medium and " + (one ? "is" : "are") + " read as vacuum (as every"
                        + " wavelength without one): the air axis runs from " + fmt(Math.min(oneEnd, otherEnd))
                        + " to " + fmt(Math.max(oneEnd, otherEnd)) + " nm air; write e.g. \"" + bare.get(0).strip()
                        + " air\" for an air wavelength");
            }
        }
        double lo = Math.min(oneEnd, otherEnd);
        double hi = Math.max(oneEnd, otherEnd);
        if (!(hi > lo)) {
            throw new OptionException("--from and --to are the same position; give a range");
        }
        return switch (gridKind) {
            case "linear" -> PixelGrid.linear(lo, hi, pixels);
            case "log" -> PixelGrid.logarithmic(lo, hi, pixels);
            default -> throw new OptionException("--grid must be linear or log, got '" + gridKind + "'");
        };
    }

    /**
     * The lines between the grid's ends that carry no light, as the library classifies them
     * ({@link DarkLines}), one sentence per cause in the options' words, naming how many and the
     * first three: a --lines entry of intensity 0; a --lines entry too faint beside the brightest
     * line for its counts to be held by a double; a line whose population the scene computed
     * (Boltzmann, Saha) too small to be held.
     */
    private List<String> unlit(DarkLines dark) {
        List<String> out = new ArrayList<>();
        for (DarkLines.Cause cause : DarkLines.Cause.values()) {
            List<DarkLines.Line> lines = dark.withCause(cause);
            if (lines.isEmpty()) {
                continue;
            }
            List<String> first = new ArrayList<>();
            for (DarkLines.Line line : lines.subList(0, Math.min(3, lines.size()))) {
                first.add(line.label());
            }
            out.add(lines.size() + " of the " + dark.onGrid() + " lines inside the range "
                    + (lines.size() == 1 ? "carries" : "carry") + " no light (" + String.join(", ", first)
                    + (lines.size() > first.size() ? ", ..." : "") + "): " + why(cause));
        }
        return out;
    }

    /** Why lines of one cause carry no light, in the options' words. */
    private String why(DarkLines.Cause cause) {
        return switch (cause) {
            case ZERO_INTENSITY -> "their --lines intensity is 0" + (ions.species.isEmpty() ? "" : " (or so small"
                    + " beside the list's strongest line that it vanishes when the list is scaled to the strongest"
                    + " one-electron line)");
            case INTENSITY_UNDERFLOW -> "their --lines intensities are so small beside the brightest line's that,"
                    + " scaled so the brightest pixel expects --peak-counts, their counts are below the smallest number"
                    + " a double holds (about 4.9e-324)";
            case POPULATION_UNDERFLOW -> "at --temperature " + OptionRules.show(temperature) + " K the Boltzmann"
                    + " populations of their upper levels, exp(-E / kT), are below the smallest number a double holds"
                    + " (about 1e-308)" + (electronDensity == null ? "" : ", or the ionisation balance at"
                    + " --electron-density leaves no emitters") + "; raise --temperature";
        };
    }

    /** Runs a builder step, naming the option when the engine refuses its value. */
    private static void option(String name, Runnable step) {
        try {
            step.run();
        } catch (IllegalArgumentException e) {
            throw new OptionException(name + ": " + e.getMessage(), e);
        }
    }

    private Map<Integer, Double> abundances() {
        Map<Integer, Double> result = new TreeMap<>();
        for (String entry : abundances) {
            for (String item : entry.split(",")) {
                int eq = item.indexOf('=');
                if (eq < 0) {
                    throw new OptionException("--abundance takes ELEMENT=NUMBER, e.g. He=0.1, got '" + item + "'");
                }
                String symbol = item.substring(0, eq).strip();
                int z = Elements.atomicNumber(symbol).orElseThrow(() -> new OptionException(
                        "--abundance: unknown element '" + symbol + "' in '" + item + "'"));
                double value;
                try {
                    value = Double.parseDouble(item.substring(eq + 1).strip());
                } catch (NumberFormatException e) {
                    throw new OptionException("--abundance: '" + item.substring(eq + 1).strip()
                            + "' is not a number in '" + item + "'");
                }
                OptionRules.range("--abundance of " + symbol, value, 1e-100, true, 1e100,
                        "1e-100 to 1e100 (relative to 1 for each other element)");
                if (result.put(z, value) != null) {
                    throw new OptionException("--abundance gives " + symbol + " twice");
                }
            }
        }
        return result;
    }

    private void addContinuum(Scene.Builder builder, PixelGrid grid) throws IOException {
        DoubleUnaryOperator density;
        if (continuumFile != null) {
            if (!continuumKind.equals("none")) {
                throw new OptionException("give --continuum or --continuum-file, not both");
            }
            density = ContinuumFiles.read(continuumFile, grid.lowest(), grid.highest());
        } else {
            switch (continuumKind) {
                case "none":
                    return;
                case "flat":
                    density = nm -> 1;
                    break;
                case "blackbody":
                    double t = continuumTemperature == null ? temperature : continuumTemperature;
                    Medium axisMedium = AxisMedium.of(medium);
                    density = Continuum.blackbodyPhotons(axisMedium, t);
                    break;
                default:
                    throw new OptionException("--continuum must be none, flat or blackbody, got '"
                            + continuumKind + "'");
            }
        }
        option("--continuum-counts", () -> builder.continuum(density, continuumCounts));
    }

    /**
     * Refuses, before any work, outputs that name the same file or an input, and outputs whose
     * folder is missing or cannot be written.
     */
    private void checkOutputs() {
        List<OutputFiles.Named> inputs = data.inputs(lineSets);
        inputs.add(new OutputFiles.Named("--continuum-file", continuumFile));
        OutputFiles.check(List.of(new OutputFiles.Named("--out", out), new OutputFiles.Named("--truth", truth),
                new OutputFiles.Named("--plot", plot)), inputs);
        OptionRules.png("--plot", plot);
    }

    /** Where the scene's levels come from, per kind of species, for the files' headers; set by the run. */
    private String modelDescription = "none";

    /** The scene as written in the files' headers (CSV comments, the JSON "scene" object), one line per value. */
    private Map<String, Object> description() {
        Map<String, Object> d = scene();
        d.replaceAll((key, value) -> value instanceof String ? ((String) value).replaceAll("\\s+", " ").strip() : value);
        return d;
    }

    private Map<String, Object> scene() {
        Map<String, Object> d = new LinkedHashMap<>();
        d.put("species", ions.species.isEmpty() ? "none" : String.join(",", ions.species));
        d.put("lines", lineSets.isEmpty() ? "none" : String.join(",", lineSets));
        d.put("model", modelDescription);
        d.put("temperature-k", temperature);
        d.put("electron-density-m3", electronDensity == null ? "none" : electronDensity);
        d.put("abundance", abundances.isEmpty() ? "1 each" : String.join(",", abundances));
        d.put("resolving-power", resolvingPower);
        d.put("velocity-km-s", velocity);
        d.put("collisional-fwhm-nm", collisionalWidth);
        d.put("natural-widths", naturalWidths);
        d.put("fine-structure", components ? "components" : "multiplets");
        d.put("continuum", continuumFile != null ? "file " + continuumFile.getFileName() + ", brightest pixel "
                + continuumCounts : continuumKind.equals("none") ? "none" : continuumKind + ", brightest pixel "
                + continuumCounts);
        d.put("noise", noNoise ? "none" : "poisson, read " + readNoise + " counts, seed " + seed);
        return d;
    }

    private void drawPlot(OutputFiles.Batch batch, SyntheticSpectrum spectrum) throws IOException {
        PixelGrid grid = spectrum.grid();
        double[] x = new double[grid.pixels()];
        for (int p = 0; p < x.length; p++) {
            x[p] = grid.centre(p);
        }
        // Label the strongest lines inside the range, at most 25.
        Scene.Lines lines = spectrum.lines();
        Integer[] order = new Integer[lines.size()];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Double.compare(spectrum.lineCountsInPixels(b), spectrum.lineCountsInPixels(a)));
        List<Plots.Label> labels = new ArrayList<>();
        double span = grid.highest() - grid.lowest();
        boolean log = plotScale.equals("log");
        // Only lines that show on the chosen scale get a label: on a linear axis a line with a
        // hundredth of the strongest line's counts is a bump a few pixels high at best.
        double visible = (order.length == 0 ? 0 : spectrum.lineCountsInPixels(order[0])) * (log ? 1e-5 : 1e-2);
        for (int i : order) {
            double at = lines.position(i);
            boolean crowded = labels.stream().anyMatch(label -> Math.abs(label.x() - at) < 0.012 * span);
            if (labels.size() < 25 && !crowded && at > grid.lowest() && at < grid.highest()
                    && spectrum.lineCountsInPixels(i) > 0 && spectrum.lineCountsInPixels(i) >= visible) {
                labels.add(new Plots.Label(at, lines.label(i)));
            }
        }
        Plots.lineChart(batch, plot, "Synthetic spectrum: " + emitters() + ", T = " + OptionRules.show(temperature)
                + " K" + (electronDensity == null ? "" : ", ne = " + OptionRules.show(electronDensity) + " m^-3"),
                "wavelength (nm, " + medium + ")", "counts per pixel", x, spectrum.counts(), labels, log);
    }

    private String emitters() {
        List<String> all = new ArrayList<>(ions.species);
        all.addAll(lineSets);
        return String.join(", ", all);
    }

    private double spectrumEdge(int end) {
        return grid(AxisMedium.of(medium)).edge(end == 0 ? 0 : pixels);
    }

    /** Whether the note on --from/--to without a medium has been printed (the grid is made more than once). */
    private boolean noted;

    private String gridName() {
        return dispersion == null ? gridKind : "dispersion " + dispersion;
    }

    private static String fmt(double nm) {
        return String.format(Locale.ROOT, "%.6f", nm);
    }
}
