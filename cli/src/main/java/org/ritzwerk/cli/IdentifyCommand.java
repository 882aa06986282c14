package org.ritzwerk.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.concurrent.Callable;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.IdentificationException;
import org.ritzwerk.engine.identify.IdentificationSearch;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.ShiftSearch;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.plasma.PlasmaEstimate;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.DataLines;
import org.ritzwerk.refdata.PeakFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code ritzwerk identify}: which lines explain the peaks of a measured spectrum. */
@Command(name = "identify",
        mixinStandardHelpOptions = true,
        header = "Match measured peaks to candidate spectral lines.",
        description = "Match measured peaks (a ritzwerk-peaks file) to candidate lines: one-electron ions "
                + "computed by the engine (--species) and line lists from the data sets or your files "
                + "(--lines). Each peak gets at most one line and each line at most one peak, chosen "
                + "together; optionally a Doppler velocity is found first. Prints every peak with its line, "
                + "residual and status (ambiguous: another line has posterior odds within 20:1), then "
                + "unexplained peaks, missing strong lines and the presence of each species weighed against "
                + "the matches chance gives at the local peak density.",
        footer = {"", "Examples:",
            "  ritzwerk identify peaks.csv --species \"H I,He II\" --tolerance \"5 sigma\"",
            "  ritzwerk identify peaks.csv --lines lamp-ne-i --tolerance \"0.02 nm\"",
            "  ritzwerk identify peaks.json --species H --search-velocity 300 --format json"})
final class IdentifyCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DataOptions data;

    @Parameters(paramLabel = "PEAKS_FILE", description = "Peaks in the ritzwerk-peaks format (CSV or JSON).")
    Path peaksFile;

    @Option(names = "--species", paramLabel = "SPECIES",
            description = "Species whose lines the engine computes: one-electron ions (\"H I\", D, \"He II\"), "
                    + "alkali atoms (\"Rb-87 I\", \"Cs I\", ...) and species with a level list (\"He I\"; Ritz lines). "
                    + "Repeatable.")
    List<String> species = new ArrayList<>();

    @Option(names = "--lines", paramLabel = "SET",
            description = "A data set id (e.g. lamp-ne-i) or a line-list file. Repeatable.")
    List<String> lineSets = new ArrayList<>();

    @Option(names = "--model", paramLabel = "MODEL", defaultValue = "qed",
            description = "Level model for --species: bohr, dirac, qed or hyperfine (default: ${DEFAULT-VALUE}).")
    String model;

    @Option(names = "--n-max", paramLabel = "N", defaultValue = "30",
            description = "Highest upper n for --species lines (default: ${DEFAULT-VALUE}).")
    int nMax;

    @Option(names = "--intercombination",
            description = "Level lists (He I, Sr I): also the lines between terms of different spin (intercombination"
                    + " lines between singlets and triplets, such as Sr I 689.26 nm), the other LS rules still"
                    + " applying; by default only the E1 and LS rules' lines.")
    boolean intercombination;

    @Option(names = "--components",
            description = "Use fine-structure components of --species lines instead of n -> n' multiplets (a "
                    + "multiplet counts as a blend: it may explain more than one peak, but only peaks within "
                    + "its fine-structure spread plus the tolerance of one another).")
    boolean components;

    @Option(names = "--tolerance", paramLabel = "TOL",
            description = "How far a peak may lie from its line: \"5 sigma\" (combined uncertainties; the default "
                    + "when every peak has one), a width such as \"0.02 nm\" or \"20 ppm\", or a "
                    + "resolving power \"R=20000\".")
    String tolerance;

    @Option(names = "--search-velocity", paramLabel = "KM_PER_S",
            description = "First find the Doppler velocity within +-KM_PER_S that explains the most lines.")
    Double searchVelocity;

    @Option(names = "--search-offset", paramLabel = "NM",
            description = "First find the constant wavelength offset within +-NM nm (a shifted scale) that explains"
                    + " the most lines.")
    Double searchOffset;

    @Option(names = "--excitation-temperature", paramLabel = "K",
            description = "Weigh --species lines by g A exp(-E_upper / kT) at this temperature (kelvin) instead of "
                    + "g A alone.")
    Double excitationTemperature;

    @Option(names = "--strength-weight", paramLabel = "W",
            description = "How much the lines' expected strengths count as priors, 0 to 1 (default: 0.5): 1 when "
                    + "each line shows a peak about in proportion to its strength (a faint spectrum near the "
                    + "detection limit), 0 to match by position alone (every line above the noise shows).")
    Double strengthWeight;

    @Option(names = "--plasma",
            description = "Instead of the per-peak table, the plasma diagnostics the identified lines allow: the "
                    + "excitation temperature of each --species from a Boltzmann plot of its matched multiplets "
                    + "(peak intensities as photon counts), and the electron density from the width column of "
                    + "matched H or D Balmer-alpha and -beta peaks (Stark fits of Gigosos et al. 2003, after "
                    + "taking --instrument-fwhm and the Doppler width out).")
    boolean plasma;

    @Option(names = "--instrument-fwhm", paramLabel = "NM", defaultValue = "0",
            description = "With --plasma: the spectrometer's Gaussian FWHM in nm (default: ${DEFAULT-VALUE}).")
    double instrumentFwhm;

    @Option(names = "--resolving-power", paramLabel = "R",
            description = "With --plasma, instead of --instrument-fwhm: the response's FWHM is lambda / R at each line.")
    Double resolvingPower;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
            description = "text (table and summary), csv or json (one object per peak). Default: ${DEFAULT-VALUE}.")
    Table.Format format;

    @Override
    public Integer call() {
        OptionRules.distinct("--lines", lineSets);
        checkOptions();
        PeakFiles.Peaks read = PeakFiles.read(peaksFile);
        refuseRepeatedPeaks(read, peaksFile);
        noteMissingIntensities(read, peaksFile).ifPresent(spec.commandLine().getErr()::println);
        double[] sigmas = read.allUncertain() ? read.uncertainties() : null;
        PeakList peaks = PeakList.of(read.positions(), sigmas, read.allIntense() ? read.intensities() : null,
                read.unit(), read.medium());
        if (searchOffset != null) {
            checkOffset(peaks);
        }
        Tolerance tol = tolerance(read.allUncertain());
        if (tol.kind() == Tolerance.Kind.K_SIGMA) {
            refuseZeroUncertainties(read, peaksFile);
        }
        tol.sharperThanThePeaksNote(peaks).ifPresent(note -> spec.commandLine().getErr().println("note: --tolerance "
                + tolerance + ": " + note));
        Identifier identifier = Identifier.of(tol);
        if (strengthWeight != null) {
            identifier = identifier.withStrengthWeight(strengthWeight);
        }
        IdentificationSearch search = IdentificationSearch.of(identifier);
        if (searchVelocity != null) {
            search = search.withVelocitySearch(searchVelocity * 1e3);
        }
        if (searchOffset != null) {
            search = search.withOffsetSearch(searchOffset * 1e-9);
        }
        // Line generation at large --n-max can take minutes: show a sign of life on a terminal.
        Progress.Running running = Progress.ticking(spec.commandLine().getErr(), "identify: computing the candidate lines");
        Candidates candidates;
        try {
            candidates = candidates(search.candidateWindow(peaks));
        } finally {
            running.close();
        }
        IdentificationSearch.Report report = search.run(peaks, candidates.catalog());
        if (plasma) {
            plasma(read, report, candidates);
            return 0;
        }
        write(read, report.identification(), report.lines(), report.velocity().orElse(null),
                report.offset().orElse(null));
        return 0;
    }

    /** Every option's range, and the options that would have no effect together, before any work. */
    private void checkOptions() {
        OptionRules rules = new OptionRules(spec);
        if (species.isEmpty() && lineSets.isEmpty()) {
            throw new OptionException("give candidate lines: --species (one-electron ions) and/or --lines");
        }
        if (nMax < 1 || nMax > HydrogenLikeLines.MAX_N) {
            throw new OptionException("--n-max must be 1 to " + HydrogenLikeLines.MAX_N + ", got " + nMax);
        }
        rules.refuseUnless("--instrument-fwhm", plasma, "without --plasma (it is the spectrometer width the plasma"
                + " diagnostics take out)");
        rules.refuseUnless("--resolving-power", plasma, "without --plasma (it sets the spectrometer width the plasma"
                + " diagnostics take out)");
        String noSpecies = "without --species (it applies to the lines the engine computes, not to --lines lists)";
        rules.refuseUnless("--model", !species.isEmpty(), noSpecies);
        rules.refuseUnless("--n-max", !species.isEmpty(), noSpecies);
        rules.refuseUnless("--components", !species.isEmpty(), noSpecies);
        rules.refuseUnless("--excitation-temperature", !species.isEmpty(), noSpecies);
        if (excitationTemperature != null) {
            OptionRules.range("--excitation-temperature", excitationTemperature, 0, false, 1e9,
                    "a temperature above 0 and at most 1e9 K");
        }
        if (strengthWeight != null) {
            OptionRules.range("--strength-weight", strengthWeight, 0, true, 1, "a weight from 0 to 1");
        }
        if (plasma && components) {
            throw new OptionException("--plasma works on n -> n' multiplets; leave out --components");
        }
        OptionRules.range("--instrument-fwhm", instrumentFwhm, 0, true, 1e6, "a width from 0 to 1e6 nm");
        if (resolvingPower != null) {
            if (rules.given("--instrument-fwhm")) {
                throw new OptionException("give --instrument-fwhm or --resolving-power, not both");
            }
            OptionRules.range("--resolving-power", resolvingPower, 1, true, 1e9,
                    "a resolving power lambda / FWHM from 1 to 1e9 (e.g. 5000)");
        }
        if (searchVelocity != null) {
            OptionRules.range("--search-velocity", searchVelocity, 0, false, PhysicalConstants.C / 1e4 * 0.999999,
                    String.format(Locale.ROOT, "a speed above 0 and below a tenth of the speed of light (%.0f km/s)",
                            PhysicalConstants.C / 1e4));
        }
        if (searchOffset != null) {
            // A floor far below any real width keeps the width a normal double once converted to metres.
            OptionRules.range("--search-offset", searchOffset, 1e-290, true, Double.MAX_VALUE,
                    "a positive width in nm (at least 1e-290 nm), at most a tenth of the shortest peak's wavelength");
        }
        if (tolerance != null) {
            checkTolerance(tolerance);
        }
    }

    /**
     * An offset must stay small against the wavelengths: one of a tenth of the shortest peak's
     * wavelength already moves a line past its neighbours of the same series (the same bound as
     * the velocity search's c / 10).
     */
    private void checkOffset(PeakList peaks) {
        double shortest = Double.POSITIVE_INFINITY;
        for (int i = 0; i < peaks.size(); i++) {
            shortest = Math.min(shortest, peaks.wavelength(i));
        }
        double limitNm = shortest * 1e9 / 10;
        if (searchOffset > limitNm) {
            throw new OptionException(String.format(Locale.ROOT, "--search-offset must be a positive width in"
                    + " nm, at most a tenth of the shortest peak's wavelength (%.6g nm here, in vacuum), got %s nm",
                    limitNm,
                    OptionRules.show(searchOffset)));
        }
    }

    /**
     * The number of a --tolerance must be finite and positive; refused here in the user's own unit
     * (the library's message would name the value in metres or as a fraction).
     */
    private static void checkTolerance(String text) {
        java.util.regex.Matcher m = java.util.regex.Pattern
                .compile("\\s*(?:[Rr]\\s*=\\s*)?([-+]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][-+]?\\d+)?|[-+]?NaN|[-+]?Infinity)"
                        + "\\s*(.*)").matcher(text);
        if (!m.matches()) {
            return; // Tolerance.parse says what forms it takes
        }
        double value = Double.parseDouble(m.group(1));
        if (!(value > 0) || Double.isInfinite(value)) {
            throw new OptionException("--tolerance must be a positive finite number with its unit: \"5 sigma\","
                    + " a width such as \"0.02 nm\" or \"20 ppm\", or a resolving power \"R=20000\"; got "
                    + (Double.isFinite(value) ? "'" + text.strip() + "'" : OptionRules.show(value)));
        }
    }

    private Tolerance tolerance(boolean uncertain) {
        if (tolerance == null) {
            if (!uncertain) {
                throw new OptionException("the peaks do not all state an uncertainty; give --tolerance, e.g. "
                        + "\"0.02 nm\", \"20 ppm\" or \"R=20000\"");
            }
            return Tolerance.kSigma(5);
        }
        try {
            return Tolerance.parse(tolerance);
        } catch (IdentificationException e) {
            throw new OptionException("--tolerance: " + e.getMessage(), e);
        }
    }

    /**
     * Intensities weigh the matches only when every peak has one: a file where some peaks lack
     * one has them all left out, which a note says, naming the peaks without by their file lines
     * (in JSON by their entries of {@code peaks}, as a file on one line has every peak on line 1).
     */
    static java.util.Optional<String> noteMissingIntensities(PeakFiles.Peaks read, Path file) {
        double[] intensities = read.intensities();
        int[] fileLines = read.lines();
        int[] entries = read.entries();
        boolean json = entries.length > 0 && entries[0] > 0;
        List<String> without = new java.util.ArrayList<>();
        for (int i = 0; i < intensities.length; i++) {
            if (Double.isNaN(intensities[i])) {
                without.add(Integer.toString(json ? entries[i] : fileLines[i]));
            }
        }
        if (without.isEmpty() || without.size() == intensities.length) {
            return java.util.Optional.empty();
        }
        String shown = String.join(", ", without.subList(0, Math.min(10, without.size())))
                + (without.size() > 10 ? " and " + (without.size() - 10) + " more" : "");
        boolean one = without.size() == 1;
        return java.util.Optional.of("note: the intensities are not used (the match ignores them): "
                + without.size() + " of " + intensities.length + " peaks have none (" + file
                + (json ? (one ? " entry " : " entries ") : (one ? " line " : " lines ")) + shown
                + (json ? " of 'peaks'" : "") + "); give every peak an intensity, or none");
    }

    /**
     * @return where peak {@code k} stands, as the peak reader's own messages begin: {@code file:line: },
     *         and in JSON its entry too ({@code file:1: entry 3 of 'peaks': })
     */
    private static String at(PeakFiles.Peaks read, Path file, int[] fileLines, int[] entries, int k) {
        return file + ":" + fileLines[k] + ": " + (entries[k] > 0 ? read.where(k) + ": " : "");
    }

    /**
     * A peak list holds each peak once: a repeated line (a copy and paste) would count its lines
     * twice and narrow the shift's uncertainty. Refuses every repeat, named by its file line and
     * the line it repeats (in JSON by their entries; the engine refuses them too, by peak number).
     */
    static void refuseRepeatedPeaks(PeakFiles.Peaks read, Path file) {
        double[] positions = read.positions();
        int[] fileLines = read.lines();
        int[] entries = read.entries();
        Integer[] order = new Integer[positions.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        java.util.Arrays.sort(order, (a, b) -> Double.compare(positions[a], positions[b]) != 0
                ? Double.compare(positions[a], positions[b]) : Integer.compare(a, b));
        List<String> repeats = new java.util.ArrayList<>();
        for (int k = 1, first = order[0]; k < order.length; k++) {
            if (positions[order[k]] != positions[order[k - 1]]) {
                first = order[k];
            } else {
                repeats.add(at(read, file, fileLines, entries, order[k]) + "the same position as "
                        + read.where(first));
            }
        }
        if (!repeats.isEmpty()) {
            throw new OptionException(repeats.size() + " peak(s) repeat another's position:\n  "
                    + String.join("\n  ", repeats.subList(0, Math.min(repeats.size(), 10)))
                    + (repeats.size() > 10 ? "\n  and " + (repeats.size() - 10) + " more" : "")
                    + "\na peak list holds each peak once (a repeated one would count its lines twice)");
        }
    }

    /**
     * Under a k-sigma tolerance every peak needs a positive uncertainty: one of 0 could only match a
     * line of uncertainty 0 exactly, and one left empty cannot be weighed. Refuses them all, each
     * named by its file line, instead of leaving them unexplained.
     */
    private static void refuseZeroUncertainties(PeakFiles.Peaks read, Path file) {
        List<String> bad = new java.util.ArrayList<>();
        double[] uncertainties = read.uncertainties();
        int[] fileLines = read.lines();
        int[] entries = read.entries();
        for (int i = 0; i < uncertainties.length; i++) {
            double u = uncertainties[i];
            if (u == 0 || Double.isNaN(u)) {
                bad.add(at(read, file, fileLines, entries, i) + "the peak's uncertainty is "
                        + (u == 0 ? "0, which can never match" : "not given, which cannot be weighed"));
            }
        }
        if (!bad.isEmpty()) {
            throw new OptionException(bad.size() + " peak(s) cannot be matched under a sigma tolerance:\n  "
                    + String.join("\n  ", bad.subList(0, Math.min(bad.size(), 10)))
                    + (bad.size() > 10 ? "\n  and " + (bad.size() - 10) + " more" : "")
                    + "\ngive each peak its standard uncertainty, or leave them empty and use a width tolerance such"
                    + " as --tolerance \"0.02 nm\"");
        }
    }

    private Candidates candidates(double[] window) {
        Candidates.Builder builder = Candidates.inWindow(window[0], window[1]);
        if (excitationTemperature != null) {
            builder.excitationTemperature(excitationTemperature);
        }
        LevelSets.Split levelSets = LevelSets.split(data.context(), species);
        Ions.Atoms resolved = levelSets.others().isEmpty() ? new Ions.Atoms(List.of(), List.of())
                : Ions.atoms(data.context(), levelSets.others(), model);
        Ions.tierNotes(resolved.ions(), model, "identify").forEach(spec.commandLine().getErr()::println);
        OptionRules rules = new OptionRules(spec);
        String noIon = "without a one-electron ion in --species (it applies to their lines; alkali atoms and level"
                + " lists bring their own)";
        rules.refuseUnless("--model", !resolved.ions().isEmpty(), noIon);
        rules.refuseUnless("--components", !resolved.ions().isEmpty(), noIon);
        LevelSets.levelListsAndNMax(rules, !levelSets.others().isEmpty(), levelSets.levels(), nMax,
                spec.commandLine().getErr());
        rules.refuseUnless("--intercombination", !levelSets.levels().isEmpty(), "without a species with a level list"
                + " in --species (it lets through the level lists' lines that the LS-coupling rules forbid)");
        for (var levels : levelSets.levels()) {
            // Ritz lines under the E1 rules (and the LS rules unless --intercombination), with the
            // context's A values (He I: lines-he-i)
            builder.lineSet(LineSet.ofRitz(DataLines.ritzLines(data.context(), levels.species())
                    .withLsRules(true).withIntercombination(intercombination).compute(levels)));
        }
        if (!levelSets.others().isEmpty()) {
            Ions.Atoms atoms = resolved;
            for (AlkaliAtom atom : atoms.alkalis()) {
                builder.alkali(atom, nMax, Progress.on(spec.commandLine().getErr(), "identify: "
                        + atom.species().notation() + " lines"));
            }
            double units = 0;
            for (Ions.Ion ion : atoms.ions()) {
                units += HydrogenLikeLines.of(ion.model()).workUnits(nMax, PhysicalConstants.C / window[1],
                        PhysicalConstants.C / window[0], components);
            }
            WorkEstimate.hydrogenLines("identify", "the candidate lines of the one-electron ions up to n = " + nMax,
                    units).ifPresent(note -> {
                        spec.commandLine().getErr().println(note);
                        spec.commandLine().getErr().flush();
                    });
            for (Ions.Ion ion : atoms.ions()) {
                builder.hydrogenLike(ion.species(), ion.model(), nMax, components);
            }
        }
        for (String set : lineSets) {
            builder.lineList(LineSets.load(data.context(), set, "--lines"));
        }
        return builder.build();
    }

    private void plasma(PeakFiles.Peaks read, IdentificationSearch.Report report, Candidates candidates) {
        PlasmaEstimate estimate = resolvingPower == null ? PlasmaEstimate.defaults().withInstrumentFwhm(instrumentFwhm)
                : PlasmaEstimate.defaults().withResolvingPower(resolvingPower);
        if (excitationTemperature != null) {
            estimate = estimate.withTemperature(excitationTemperature);
        }
        List<PlasmaEstimate.Row> rows = estimate.estimate(new PlasmaEstimate.Peaks(read.positions(), read.unit(),
                read.medium(), read.intensities(), read.widths()), report.identification(), report.lines(), candidates);
        Table table = new Table(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("quantity", "quantity"),
                Table.Column.number("value", "value", "%.5g"),
                Table.Column.number("uncertainty", "+-", "%.2g"),
                Table.Column.text("unit", "unit"),
                Table.Column.text("lines", "lines"),
                Table.Column.text("note", "note")), spec.commandLine().getOut(), format);
        for (PlasmaEstimate.Row row : rows) {
            table.add(row.species().notation(), row.quantity().id(),
                    row.value().isPresent() ? row.value().getAsDouble() : null,
                    row.uncertainty().isPresent() ? row.uncertainty().getAsDouble() : null, row.quantity().unit(),
                    row.lines(), row.note());
        }
        if (rows.isEmpty()) {
            spec.commandLine().getErr().println("identify: no matched line with a known upper level, weight and A"
                    + " (a --species line, or a level-list line with A); nothing to diagnose");
            spec.commandLine().getErr().flush();
        }
        table.finish();
    }

    /**
     * One species' presence as the library computed it: matched lines beside the number chance
     * would give, strong lines found beside chance, the chance probability and the presence.
     * After a shift search the counts are those of one shift and the probability is over the
     * shifts tried, and the line says so.
     */
    static String presenceLine(Identification.SpeciesPresence presence, double shiftsTried) {
        String where = shiftsTried > 1 ? " at one shift" : "";
        String head = String.format(Locale.ROOT, "%s: %s matched (%.3g by chance%s)",
                presence.species().notation(), Words.count(presence.matched(), "line"), presence.matchedByChance(),
                where);
        if (presence.strongInRange() == 0) {
            return head + "; no strong line in range, presence not judged";
        }
        String tried = String.format(Locale.ROOT, "%.0f", shiftsTried);
        return head + String.format(Locale.ROOT, "; %d of %s in range found (%.3g by chance, "
                + "chance probability %.2g%s); presence %.2f", presence.strongMatched(),
                Words.count(presence.strongInRange(), "strong line"), presence.strongByChance(),
                presence.chanceProbability(), shiftsTried > 1
                        ? " over the " + tried + (tried.equals("1") ? " shift" : " shifts") + " tried" : "",
                presence.presence());
    }

    private void write(PeakFiles.Peaks read, Identification result, LineCatalog lines, ShiftSearch.Fit fit,
            ShiftSearch.Fit offsetFit) {
        PrintWriter out = spec.commandLine().getOut();
        Unit unit = read.unit();
        Medium medium = read.medium();
        List<Table.Column> columns = new ArrayList<>(List.of(
                Table.Column.text("peak", "peak"),
                Table.Column.text("file_line", "line"),
                Table.Column.number("position", "position " + unit.symbol() + (medium == null ? "" : " "
                        + medium.spec()), "%.6f"),
                Table.Column.text("status", "status"),
                Table.Column.text("species", "species"),
                Table.Column.text("transition", "transition"),
                Table.Column.number("line_position", "line", "%.6f"),
                Table.Column.number("residual", "residual", "%+.6f"),
                Table.Column.number("residual_sigma", "res/sigma", "%+.2f")));
        // Why a peak is ambiguous: one column of words in the text table; in CSV and JSON the
        // reasons' ids and the rival line's fields apart.
        boolean asText = format == Table.Format.text;
        columns.addAll(asText ? List.of(Table.Column.text("why", "why")) : List.of(
                Table.Column.text("ambiguity", "ambiguity"),
                Table.Column.text("rival_species", "rival_species"),
                Table.Column.text("rival_transition", "rival_transition"),
                Table.Column.number("rival_position", "rival_position", "%.6f"),
                Table.Column.number("rival_odds", "rival_odds", "%.3g")));
        Table table = new Table(columns, out, format);
        double[] linePositions = new double[1];
        double[] positions = read.positions();
        int[] fileLines = read.lines();
        // Each reason among the ambiguous peaks, for the summary; a peak with several counts under each.
        int rivals = 0;
        int notShown = 0;
        int stray = 0;
        for (int i = 0; i < positions.length; i++) {
            int j = result.line(i);
            String status = result.status(i) == Identification.MATCHED ? "matched"
                    : result.status(i) == Identification.AMBIGUOUS ? "ambiguous" : "unexplained";
            Double linePosition = null;
            if (j >= 0) {
                SpectralArrays.convert(new double[] {result.matchedPosition(i)}, Unit.METRE, Medium.vacuum(), unit,
                        medium, linePositions);
                linePosition = linePositions[0];
            }
            Set<Identification.Ambiguity> why = result.ambiguity(i); // empty exactly when not ambiguous
            rivals += why.contains(Identification.Ambiguity.CLOSE_RIVAL) ? 1 : 0;
            notShown += why.contains(Identification.Ambiguity.SPECIES_NOT_SHOWN) ? 1 : 0;
            stray += why.contains(Identification.Ambiguity.MAY_BE_STRAY) ? 1 : 0;
            int rival = result.rival(i);
            Double rivalPosition = null;
            if (rival >= 0) {
                SpectralArrays.convert(new double[] {result.rivalPosition(i)}, Unit.METRE, Medium.vacuum(), unit,
                        medium, linePositions);
                rivalPosition = linePositions[0];
            }
            List<Object> row = new ArrayList<>(List.of(i + 1, fileLines[i], positions[i], status));
            row.addAll(Arrays.asList(j < 0 ? null : lines.species(j).notation(), j < 0 ? null : lines.label(j),
                    linePosition, linePosition == null ? null : positions[i] - linePosition,
                    j < 0 ? null : result.normalizedResidual(i, unit)));
            String rivalSpecies = rival < 0 ? null : lines.species(rival).notation();
            if (asText) {
                row.add(why.isEmpty() ? null : whyWords(why, rival < 0 ? null : rivalSpecies + " " + lines.label(rival),
                        rivalPosition, result.rivalOdds(i)));
            } else {
                row.addAll(Arrays.asList(why.isEmpty() ? null
                        : String.join(";", why.stream().map(Identification.Ambiguity::id).toList()),
                        rivalSpecies, rival < 0 ? null : lines.label(rival), rivalPosition,
                        rival < 0 ? null : result.rivalOdds(i)));
            }
            table.add(row.toArray());
        }
        table.finish();
        PrintWriter summary = format == Table.Format.text ? out : spec.commandLine().getErr();
        if (format == Table.Format.text) {
            summary.println();
        }
        List<String> why = new ArrayList<>(3);
        if (rivals > 0) {
            why.add(rivals + " with a close rival");
        }
        if (notShown > 0) {
            why.add(notShown + " of a species not shown beyond chance");
        }
        if (stray > 0) {
            why.add(stray + " that a stray peak may explain");
        }
        summary.println(String.format(Locale.ROOT, "%s: %d matched, %d ambiguous%s, %d unexplained%s",
                Words.count(read.size(), "peak"), result.count(Identification.MATCHED),
                result.count(Identification.AMBIGUOUS),
                why.isEmpty() ? "" : " (" + String.join("; ", why) + ")",
                result.count(Identification.UNEXPLAINED),
                (fit == null ? "" : shift("velocity", fit.velocity() / 1e3, fit.velocityUncertainty() / 1e3, "%.3f",
                        "km/s", fit.matches()))
                        + (offsetFit == null ? "" : shift("offset", offsetFit.value() * 1e9,
                                offsetFit.uncertainty() * 1e9, "%.6f", "nm", offsetFit.matches()))));
        int[] missing = result.missingStrongLines();
        if (missing.length > 0) {
            StringBuilder text = new StringBuilder("missing strong lines: ");
            for (int k = 0; k < Math.min(missing.length, 10); k++) {
                int j = missing[k];
                // in the peaks' unit and medium, as the table's line column, where the fitted shift puts it
                SpectralArrays.convert(new double[] {lines.wavelength(j)}, Unit.METRE, Medium.vacuum(), unit, medium,
                        linePositions);
                text.append(k == 0 ? "" : "; ").append(lines.species(j).notation()).append(' ').append(lines.label(j))
                        .append(String.format(Locale.ROOT, " (%.6f %s%s%s)", linePositions[0], unit.symbol(),
                                medium == null ? "" : " " + medium.label(),
                                fit != null || offsetFit != null ? ", as shifted" : ""));
            }
            if (missing.length > 10) {
                text.append("; and ").append(missing.length - 10).append(" more");
            }
            summary.println(text);
        }
        for (Identification.SpeciesPresence presence : result.speciesPresence()) {
            summary.println(presenceLine(presence, result.shiftsTried()));
        }
        if ((fit != null || offsetFit != null) && !result.someSpeciesBeyondChance()) {
            summary.println("note: at the " + (fit != null ? "velocity" : "offset") + " found no species shows its"
                    + " strong lines beyond chance, so the shift and the matches rest on coincidences: the true shift"
                    + " may lie outside the range searched, or the species offered may be absent");
        } else if (fit == null && offsetFit == null && !result.someSpeciesBeyondChance() && judged(result)
                && result.count(Identification.UNEXPLAINED) < positions.length) {
            summary.println("note: no species shows its strong lines beyond chance, so the matches may rest on"
                    + " coincidences: the peaks may come from a gas or impurity not offered, or lie too densely for"
                    + " the strong lines found to be told from chance");
        }
        summary.flush();
    }

    /**
     * The text table's account of why a peak is ambiguous: the reasons' words, the close rival's
     * line, where it lies (in the peaks' unit and medium) and the odds against it, e.g.
     * {@code close rival He II 6560 (6-4) at 656.019876, odds 3.14:1; may be stray}.
     */
    static String whyWords(Set<Identification.Ambiguity> why, String rival, Double rivalPosition, double odds) {
        List<String> words = new ArrayList<>(why.size());
        for (Identification.Ambiguity reason : why) {
            if (reason == Identification.Ambiguity.CLOSE_RIVAL && rival != null) {
                words.add(reason.words() + " " + rival + " at " + Table.unsignedZero(String.format(Locale.ROOT, "%.6f",
                        rivalPosition))
                        + (Double.isFinite(odds) ? ", odds " + String.format(Locale.ROOT, "%.3g", odds) + ":1" : ""));
            } else {
                words.add(reason.words());
            }
        }
        return String.join("; ", words);
    }

    /** @return whether some species has strong lines in the peaks' range, so that its presence was judged */
    private static boolean judged(Identification result) {
        for (Identification.SpeciesPresence presence : result.speciesPresence()) {
            if (presence.strongInRange() > 0) {
                return true;
            }
        }
        return false;
    }

    /**
     * The summary's account of a velocity or offset search. No matched line: no value is claimed
     * (the search's centre is not a measurement); one line: the value without an uncertainty,
     * which one line cannot give.
     */
    private static String shift(String what, double value, double uncertainty, String format, String unit, int lines) {
        if (lines == 0) {
            return "; no " + what + " in the searched range lets any line match, so none is given";
        }
        // A shift that rounds to zero prints unsigned, as the tables print such numbers.
        String number = Table.unsignedZero(String.format(Locale.ROOT, format, value));
        if (lines == 1 || !Double.isFinite(uncertainty)) {
            return "; " + what + " " + number + " " + unit + " from " + Words.count(lines, "line")
                    + (lines == 1 ? " (one line gives no uncertainty)" : " (uncertainty not determined)");
        }
        return "; " + what + " " + number + " +- " + String.format(Locale.ROOT, format, uncertainty) + " " + unit
                + " from " + lines + " lines";
    }
}
