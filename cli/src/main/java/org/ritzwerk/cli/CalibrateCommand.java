package org.ritzwerk.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.CalibrationRecord;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationException;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampMatch;
import org.ritzwerk.engine.calibrate.LampMatcher;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.calibrate.Peaks;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.CalibrationFiles;
import org.ritzwerk.refdata.DataLines;
import org.ritzwerk.refdata.ReferenceDataException;
import org.ritzwerk.refdata.OutputFiles;
import org.ritzwerk.refdata.SpectrumFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code ritzwerk calibrate}: the pixel-to-wavelength solution of a spectrometer from a lamp spectrum. */
@Command(name = "calibrate",
        mixinStandardHelpOptions = true,
        header = "Find a spectrometer's pixel -> wavelength solution from a lamp spectrum.",
        description = "Find the pixel -> wavelength solution of a spectrometer from a lamp spectrum (counts per "
                + "pixel, a ritzwerk-spectrum file): detect the peaks (baseline, noise, S/N threshold, "
                + "Gaussian least-squares centroids with uncertainties), pair them with the lamp's lines "
                + "without a starting solution, refine the pairs with the line identifier (optimal "
                + "one-to-one), fit a weighted polynomial with outlier clipping, and report the lines used "
                + "and rejected, the RMS and the wavelength uncertainty across the detector. --apply puts a "
                + "saved solution's wavelengths on another spectrum.",
        footer = {"", "Examples:",
            "  ritzwerk calibrate neon.csv --lamp \"Ne I\" --out calibration.json --plot residuals.png",
            "  ritzwerk calibrate arc.csv --lamp \"Ne I,Ar I\" --from \"500 nm\" --to \"900 nm\"",
            "  ritzwerk calibrate arc.csv --lamp \"Ne I,Ar I\" --dispersion-range 0.1,0.3",
            "  ritzwerk calibrate sample.csv --apply calibration.json --out sample-nm.csv",
            "",
            "Lamps: UV and high voltage; see the README's safety section."})
final class CalibrateCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DataOptions data;

    @Parameters(index = "0", paramLabel = "SPECTRUM_FILE",
            description = "Counts per pixel: a ritzwerk-spectrum CSV or JSON file (rows in pixel order).")
    Path spectrumFile;

    @Option(names = "--lamp", paramLabel = "SPECIES",
            description = "The lamp's species, e.g. \"Ne I\" or \"Ne I,Ar I\": their built-in lamp sets; for a "
                    + "species with a level list and no lamp set (\"He I\"), the Ritz lines of its levels ranked by "
                    + "g_u A.")
    List<String> lamps = new ArrayList<>();

    @Option(names = "--resolving-power", paramLabel = "R",
            description = "The spectrometer's resolving power lambda / FWHM, roughly: lamp lines of one gas closer "
                    + "than half the FWHM are merged into one blend at their intensity-weighted centroid. Given, it "
                    + "applies to every lamp line; by default only lamps built from a level list are merged, at "
                    + "R = " + DataLines.DEFAULT_LEVEL_LAMP_RESOLVING_POWER + " (their fine-structure components are "
                    + "listed one by one).")
    Double resolvingPower;

    @Option(names = "--lines", paramLabel = "SET",
            description = "A line list of your own (file) or a data set id, with relative intensities. Repeatable.")
    List<String> lineSets = new ArrayList<>();

    @Option(names = "--medium", paramLabel = "MEDIUM", defaultValue = "air",
            description = "Medium of the solution's wavelengths: air (standard air) or vacuum. Default: ${DEFAULT-VALUE}.")
    String medium;

    @Option(names = "--from", paramLabel = "QUANTITY", description = "Prior: the lowest wavelength the detector may see.")
    String from;

    @Option(names = "--to", paramLabel = "QUANTITY", description = "Prior: the highest wavelength the detector may see"
            + " (above --from, whichever way wavelength runs across the detector).")
    String to;

    @Option(names = "--dispersion-range", paramLabel = "MIN,MAX",
            description = "Prior: the dispersion in nm per pixel, e.g. 0.05,0.2 (negative when wavelength falls with pixel).")
    String dispersionRange;

    @Option(names = "--degree", paramLabel = "N|auto", defaultValue = "auto",
            description = "Polynomial degree, or auto (chosen by AICc up to --max-degree). Default: ${DEFAULT-VALUE}.")
    String degree;

    @Option(names = "--max-degree", paramLabel = "N", defaultValue = "" + Calibrator.DEFAULT_MAX_DEGREE,
            description = "Highest degree auto may choose. Default: ${DEFAULT-VALUE}.")
    int maxDegree;

    @Option(names = "--threshold", paramLabel = "SNR", defaultValue = "5",
            description = "Peaks need this signal-to-noise ratio. Default: ${DEFAULT-VALUE}.")
    double threshold;

    @Option(names = "--saturation", paramLabel = "COUNTS",
            description = "Counts at which the detector saturates; such peaks are paired, flagged 'saturated' and "
                    + "left out of the fit (kept in it, with a note, when too few pairs would remain for the "
                    + "degree).")
    Double saturation;

    @Option(names = "--gain", paramLabel = "G",
            description = "The detector's gain in counts per photo-electron (its data sheet, or a photon-transfer"
                    + " measurement), e.g. 3.7: a pixel's variance is its background noise plus G times the line's"
                    + " counts. Default: the counts' common step when they have one (counts all multiples of 16: 16);"
                    + " else estimated from the bright lines' fit residuals and used when clearly above 1; else 1."
                    + " The report says which.")
    Double gain;

    @Option(names = "--read-noise", paramLabel = "COUNTS",
            description = "The detector's read noise in counts RMS (not electrons): a floor under the background"
                    + " noise measured in the spectrum. Default: the measured noise alone.")
    Double readNoise;

    @Option(names = "--tolerance", paramLabel = "PIXELS", defaultValue = "3",
            description = "How far (pixels) a peak may lie from a line's predicted place to pair. Default: ${DEFAULT-VALUE}.")
    double tolerance;

    @Option(names = "--min-strength", paramLabel = "CLASS",
            description = "Use only the lamp lines whose set classes them at least this strong: strong, medium or "
                    + "weak (all; lines without a class are always used). For lamps whose weak lines do not "
                    + "show.")
    String minStrength;

    @Option(names = "--min-matched", paramLabel = "FRACTION", defaultValue = "0.6",
            description = "A solution must pair at least this fraction of the strongest peaks with lamp lines; "
                    + "lower it for lamps with many lines missing from the set. Default: ${DEFAULT-VALUE}.")
    double minMatched;

    @Option(names = "--no-second-order",
            description = "Never explain a peak as the second-order image of a lamp line (at twice its wavelength); "
                    + "for a spectrometer with an order-sorting filter, where such ghosts cannot occur.")
    boolean noSecondOrder;

    @Option(names = "--required-precision", paramLabel = "PIXELS",
            description = "Refuse (exit 2) a solution whose stated standard uncertainty exceeds PIXELS anywhere "
                    + "between its first and last fitted line, instead of printing it; 0.05 for work that needs "
                    + "every wavelength within 0.1 pixel. Default: none (the report states the largest uncertainty).")
    Double requiredPrecision;

    @Option(names = "--uncertainty-ceiling", paramLabel = "PIXELS", defaultValue = "1",
            description = "Refuse (exit 2) a solution whose stated standard uncertainty exceeds PIXELS anywhere "
                    + "between its first and last fitted line (two groups of lines with a long gap between them, an "
                    + "end the polynomial was bent to); unlike --required-precision it does not ask the other lines"
                    + " to check each end. Default: ${DEFAULT-VALUE}; 1e6 takes any solution as it is.")
    double uncertaintyCeiling;

    @Option(names = "--unchecked-ends",
            description = "Accept a solution whose outermost line no other line checks (three lines for a straight"
                    + " line, four for a quadratic: a window of three lamp lines); a foreign line beside a missing"
                    + " lamp line there would go unseen, so by default such a solution is refused (exit 2). For a"
                    + " lamp whose lines there are known to be clean.")
    boolean uncheckedEnds;

    @Option(names = "--clip", paramLabel = "K", defaultValue = "3.5",
            description = "Reject pairs beyond K robust standard deviations, one at a time. Default: ${DEFAULT-VALUE}.")
    double clip;

    @Option(names = "--out", paramLabel = "FILE",
            description = "Write the solution (ritzwerk-calibration JSON), or with --apply the spectrum with wavelengths.")
    Path out;

    @Option(names = "--plot", paramLabel = "PNG", description = "Draw the residuals of the fitted lines against pixel.")
    Path plot;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
            description = "text (the report), csv (the fitted lines: pixel, pixel_sigma, line, wavelength_nm, "
                    + "solution_nm, residual_nm, residual_pixels, used, flag: rejected, blend, both, or saturated) or "
                    + "json (the calibration document, as --out writes it). Default: ${DEFAULT-VALUE}.")
    Table.Format format;

    @Option(names = "--apply", paramLabel = "CALIBRATION",
            description = "Instead of calibrating: give SPECTRUM_FILE the wavelengths of this saved solution.")
    Path apply;

    @Override
    public Integer call() throws IOException {
        OptionRules.distinct("--lines", lineSets);
        checkOptions();
        checkOutputs();
        SpectrumFiles.Spectrum spectrum = SpectrumFiles.read(spectrumFile);
        if (apply != null) {
            return applySolution(spectrum);
        }
        if (spectrum.sigmas() != null) {
            new OptionRules(spec).refuseUnless("--gain", false, "with a spectrum that gives counts_sigma (the"
                    + " file's pixel uncertainties are used as given)");
            new OptionRules(spec).refuseUnless("--read-noise", false, "with a spectrum that gives counts_sigma (the"
                    + " file's pixel uncertainties are used as given)");
        }
        CalibrationProblem problem = CalibrationProblem.builder(spectrum.counts()).sigmas(spectrum.sigmas())
                .lamp(lampSet(AxisMedium.of(medium))).prior(prior()).source(spectrum.source()).build();
        Calibration calibration;
        try {
            calibration = calibrator().calibrate(problem);
        } catch (CalibrationException e) {
            if (CalibrationException.UNCHECKED_END.equals(e.code())) {
                throw new CalibrationException(e.code(), e.getMessage() + " (--unchecked-ends)", e);
            }
            throw e;
        }
        for (String note : calibration.notes()) {
            spec.commandLine().getErr().println("note: " + note);
        }
        if (calibration.peaks().gainNote() != null) {
            spec.commandLine().getErr().println("note: " + calibration.peaks().gainNote());
        }
        DispersionSolution solution = calibration.solution();
        String description = calibration.description();
        switch (format) {
            case json:
                spec.commandLine().getOut().print(CalibrationFiles.toJson(solution, spectrum.pixels(), description,
                        calibration.pairLabels(), saturatedLines(calibration)));
                spec.commandLine().getOut().flush();
                break;
            case csv:
                pairs(calibration, spec.commandLine().getOut(), format);
                break;
            default:
                report(spectrum, calibration);
                break;
        }
        // Both files are written to temporary files beside them and moved into place together.
        try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
            if (out != null) {
                batch.text(out, w -> w.write(CalibrationFiles.toJson(solution, spectrum.pixels(), description,
                        calibration.pairLabels(), saturatedLines(calibration))));
            }
            if (plot != null) {
                drawResiduals(batch, calibration);
            }
            batch.commit();
        }
        return 0;
    }

    /**
     * Refuses, before any work, numbers outside their range and options that would have no
     * effect: with --apply every calibration option (a saved solution is applied as it is), and
     * --max-degree with a fixed --degree.
     */
    private void checkOptions() {
        OptionRules rules = new OptionRules(spec);
        if (apply != null) {
            for (String option : new String[] {"--lamp", "--lines", "--medium", "--from", "--to", "--dispersion-range",
                "--degree", "--max-degree", "--threshold", "--saturation", "--gain", "--read-noise", "--tolerance",
                "--min-matched", "--min-strength",
                "--no-second-order", "--required-precision", "--uncertainty-ceiling", "--unchecked-ends", "--clip",
                "--plot", "--format",
                "--data"}) {
                rules.refuseUnless(option, false, "with --apply (the saved solution is applied as it is; "
                        + "--out is the only option --apply takes)");
            }
            return;
        }
        rules.refuseUnless("--max-degree", degree.equals("auto"), "with --degree " + degree
                + " (it bounds the degree --degree auto may choose)");
        if (maxDegree < 1 || maxDegree > 9) {
            throw new OptionException("--max-degree must be a whole number from 1 to 9, got " + maxDegree);
        }
        if (!degree.equals("auto")) {
            parseDegree();
        }
        OptionRules.range("--threshold", threshold, 0, false, 1e12, "a signal-to-noise ratio above 0 (e.g. 5)");
        if (resolvingPower != null) {
            OptionRules.range("--resolving-power", resolvingPower, 1, true, 1e7, "a resolving power from 1 to 1e7"
                    + " (e.g. 3000)");
        }
        OptionRules.range("--tolerance", tolerance, 0, false, 1e9,
                "a distance in pixels above 0 and at most 1e9 (e.g. 3)");
        OptionRules.range("--min-matched", minMatched, 0, true, 1, "a fraction from 0 to 1 (e.g. 0.6)");
        OptionRules.range("--clip", clip, 1, true, 1e12,
                "a number of standard deviations of at least 1 and at most 1e12 (e.g. 3.5)");
        if (requiredPrecision != null) {
            OptionRules.range("--required-precision", requiredPrecision, 0, false, 1e6,
                    "a standard uncertainty in pixels above 0 and at most 1e6 (e.g. 0.05)");
        }
        OptionRules.range("--uncertainty-ceiling", uncertaintyCeiling, 0, false, 1e6,
                "a standard uncertainty in pixels above 0 and at most 1e6 (e.g. 1)");
        if (saturation != null) {
            OptionRules.range("--saturation", saturation, 0, false, 1e15, "a number of counts above 0 and at most 1e15");
        }
        if (gain != null) {
            OptionRules.range("--gain", gain, 0, false, 1e6,
                    "counts per photo-electron above 0 and at most 1e6 (e.g. 3.7)");
        }
        if (readNoise != null) {
            OptionRules.range("--read-noise", readNoise, 0, true, 1e12, "counts RMS from 0 to 1e12 (e.g. 12)");
        }
    }

    /**
     * Refuses, before any work, outputs that name the same file or an input, and outputs whose
     * folder is missing or cannot be written.
     */
    private void checkOutputs() {
        List<OutputFiles.Named> inputs = data.inputs(lineSets);
        inputs.add(new OutputFiles.Named("SPECTRUM_FILE", spectrumFile));
        inputs.add(new OutputFiles.Named("--apply", apply));
        OutputFiles.check(List.of(new OutputFiles.Named("--out", out), new OutputFiles.Named("--plot", plot)), inputs);
        OptionRules.png("--plot", plot);
    }

    private Calibrator calibrator() {
        Calibrator calibrator = Calibrator.defaults().withThreshold(threshold).withTolerance(tolerance)
                .withMinMatchedFraction(minMatched).withClipping(clip).withSecondOrder(!noSecondOrder)
                .withUncheckedEndsAccepted(uncheckedEnds).withUncertaintyCeiling(uncertaintyCeiling);
        calibrator = degree.equals("auto") ? calibrator.withAutomaticDegree(maxDegree)
                : calibrator.withDegree(parseDegree());
        calibrator = requiredPrecision == null ? calibrator : calibrator.withRequiredPrecision(requiredPrecision);
        calibrator = gain == null ? calibrator : calibrator.withGain(gain);
        calibrator = readNoise == null ? calibrator : calibrator.withReadNoise(readNoise);
        return saturation == null ? calibrator : calibrator.withSaturationLevel(saturation);
    }

    private int parseDegree() {
        int fixed;
        try {
            fixed = Integer.parseInt(degree);
        } catch (NumberFormatException e) {
            throw new OptionException("--degree must be a whole number from 1 to 9 or auto, got '" + degree + "'");
        }
        if (fixed < 1 || fixed > 9) {
            throw new OptionException("--degree must be a whole number from 1 to 9 or auto, got " + fixed);
        }
        return fixed;
    }

    /**
     * Whether a bound of the prior is a vacuum wavelength below the air model's range (200 nm for
     * standard air) while the solution is in air: a detector reaching below it. Such a lower bound
     * adds nothing in air (no air wavelength lies there), so the prior has no lower bound.
     */
    private static boolean belowAirModel(String quantity, Medium solutionMedium) {
        if (!(solutionMedium instanceof Medium.Air air)) {
            return false;
        }
        double hertz = AxisMedium.spectral("--from/--to", quantity).toFrequency().inHertz();
        return org.ritzwerk.constants.PhysicalConstants.C / hertz < air.model().minVacuumWavelengthMetres();
    }

    private LampMatcher.Prior prior() {
        if (from == null && to == null && dispersionRange == null) {
            return LampMatcher.Prior.none();
        }
        double lo = 0;
        double hi = Double.POSITIVE_INFINITY;
        if (from != null || to != null) {
            if (from == null || to == null) {
                throw new OptionException("give both --from and --to, or neither");
            }
            Medium m = AxisMedium.of(medium);
            double a;
            double b;
            try {
                a = belowAirModel(from, m) ? 0 : AxisMedium.nanometres("--from", from, m);
                b = belowAirModel(to, m) ? 0 : AxisMedium.nanometres("--to", to, m);
                if (a == 0 && b == 0) {
                    throw new OptionException("--from and --to both lie below the air model's range (200 nm for"
                            + " standard air), where air wavelengths are not defined; calibrate in vacuum (--medium"
                            + " vacuum) for a far-ultraviolet detector");
                }
            } catch (OptionException e) {
                throw new OptionException(e.getMessage() + "; give the wavelength range the detector may see", e);
            } catch (IllegalArgumentException | org.ritzwerk.RitzwerkException e) {
                throw new OptionException("--from/--to (" + from + " to " + to + "): " + e.getMessage()
                        + "; give the wavelength range the detector may see", e);
            }
            if (a >= b) {
                // --from is the lowest wavelength and --to the highest whichever way wavelength runs across
                // the detector (its direction is the sign of --dispersion-range): a reversed pair is a slip
                throw new OptionException("--from " + from + " must lie below --to " + to + " in wavelength (here "
                        + (a == 0 ? "below the air model's range" : String.format(Locale.ROOT, "%.6g nm", a))
                        + " against " + (b == 0 ? "below the air model's range" : String.format(Locale.ROOT,
                                "%.6g nm", b)) + " in " + m.label() + "): --from is the lowest wavelength the detector"
                        + " may see and --to the highest, whichever way wavelength runs across it (a negative"
                        + " --dispersion-range says it falls with pixel)");
            }
            lo = a;
            hi = b;
        }
        double dMin = LampMatcher.Prior.none().minDispersion();
        double dMax = LampMatcher.Prior.none().maxDispersion();
        if (dispersionRange != null) {
            String[] parts = dispersionRange.split(",");
            if (parts.length != 2) {
                throw new OptionException("--dispersion-range takes MIN,MAX in nm per pixel, got '"
                        + dispersionRange + "'");
            }
            try {
                dMin = Double.parseDouble(parts[0].strip());
                dMax = Double.parseDouble(parts[1].strip());
            } catch (NumberFormatException e) {
                throw new OptionException("--dispersion-range: '" + dispersionRange + "' is not two numbers");
            }
            if (!(dMin >= -1000 && dMin < dMax && dMax <= 1000)) {
                throw new OptionException("--dispersion-range must be MIN,MAX in nm per pixel with MIN below"
                        + " MAX, both from -1000 to 1000 (negative when wavelength falls with pixel), got "
                        + OptionRules.show(dMin) + "," + OptionRules.show(dMax));
            }
        }
        try {
            return new LampMatcher.Prior(lo, hi, dMin, dMax);
        } catch (IllegalArgumentException e) {
            throw new OptionException("--from/--to/--dispersion-range: " + e.getMessage(), e);
        }
    }

    /** The lamp lines of every --lamp species and --lines set, in the solution's medium. */
    private LampSet lampSet(Medium solutionMedium) {
        if (lamps.isEmpty() && lineSets.isEmpty()) {
            throw new OptionException("give the lamp: --lamp \"Ne I\" (built-in sets) or --lines FILE");
        }
        List<Species> lampSpecies = new ArrayList<>();
        for (String option : lamps) {
            for (String text : option.split(",")) {
                lampSpecies.add(Species.parse(text.strip()));
            }
        }
        OptionRules.distinct("--lamp", lampSpecies.stream().map(Species::notation).toList());
        OptionRules.distinct("--lines", lineSets);
        List<LineList> lists = new ArrayList<>();
        for (String set : lineSets) {
            lists.add(LineSets.load(data.context(), set, "lamp set"));
        }
        DataLines.CalibrationLamp assembled;
        try {
            assembled = DataLines.calibrationLamp(data.context(), lampSpecies, lists, solutionMedium,
                    resolvingPower == null ? Double.NaN : resolvingPower);
        } catch (ReferenceDataException e) {
            if (ReferenceDataException.UNKNOWN_DATA_SET.equals(e.code())) {
                throw new OptionException("--lamp: " + e.getMessage() + "; see `ritzwerk data`, or give your own"
                        + " list with --lines", e);
            }
            throw e;
        } catch (IllegalArgumentException e) {
            throw new OptionException("--lamp/--lines: " + e.getMessage(), e);
        }
        for (String note : assembled.notes(solutionMedium)) {
            spec.commandLine().getErr().println("note: " + note);
        }
        LampSet lamp = assembled.lamp();
        if (minStrength == null) {
            return lamp;
        }
        LampSet kept;
        try {
            kept = lamp.atLeast(StrengthClass.fromId(minStrength.strip().toLowerCase(java.util.Locale.ROOT)));
        } catch (IllegalArgumentException e) {
            throw new OptionException("--min-strength: " + e.getMessage(), e);
        }
        int unclassified = lamp.unclassifiedLines();
        if (unclassified > 0) {
            spec.commandLine().getErr().println("note: --min-strength " + minStrength.strip() + " keeps "
                    + Words.count(unclassified, "line") + " of " + lamp.size() + " whatever their strength: "
                    + (unclassified == 1 ? "it has" : "they have") + " no strength class (a lamp from a level list,"
                    + " or a line list without the strength column)" + (kept.size() == lamp.size()
                            ? ", so the option leaves the lamp as it was" : ""));
        }
        return kept;
    }

    /** How the peaks' centroid uncertainties were scaled, for the report's peak line. */
    private static String noiseModel(Peaks peaks) {
        if (peaks.pixelSigmasGiven()) {
            return "centroid uncertainties from the file's pixel uncertainties";
        }
        String clamped = Double.isNaN(peaks.clampLevel()) ? "" : String.format(Locale.ROOT,
                "; counts clamped at %s (%.0f %% of the background pixels): background noise from the pixels"
                        + " above it", plain(peaks.clampLevel()), 100 * peaks.clampedShare());
        String gain = "; " + peaks.gainStatement();
        if (peaks.countedPhotons()) {
            // The gain is the counts' step unless it was given or estimated.
            boolean step = peaks.gainSource() == Peaks.GainSource.STEP
                    || peaks.gainSource() == Peaks.GainSource.ASSUMED;
            String counts = plain(peaks.countsPerPhoton());
            return "counted photons: no background noise" + (step ? " and counts in steps of " + counts
                    + ", so a photon is taken as " + counts + " counts" : "") + "; Poisson variances unscaled" + gain;
        }
        if (Double.isNaN(peaks.noiseScale())) {
            return "too few peaks to pool their scatter: each centroid uncertainty is widened by its own fit's,"
                    + " never narrowed" + clamped + gain;
        }
        return String.format(Locale.ROOT, "pixel variance %.3g times the Poisson model's", peaks.noiseScale())
                + gain + clamped;
    }

    /** @return a whole number without decimals, anything else to 6 significant digits */
    private static String plain(double value) {
        return value == Math.rint(value) && Math.abs(value) < 1e15 ? Long.toString((long) value)
                : String.format(Locale.ROOT, "%.6g", value);
    }

    private void report(SpectrumFiles.Spectrum spectrum, Calibration calibration) {
        PrintWriter w = spec.commandLine().getOut();
        DispersionSolution solution = calibration.solution();
        int n = spectrum.pixels();
        w.printf(Locale.ROOT, "Spectrum: %s, %d pixels; lamp: %s%n", spectrum.source(), n,
                String.join(", ", calibration.problem().lamp().setIds()));
        w.printf(Locale.ROOT, "Peaks found: %d above S/N %.3g (%s)%n", calibration.peaks().size(),
                calibration.settings().threshold(), noiseModel(calibration.peaks()));
        int images = calibration.firstMatch().secondOrderPeaks().length;
        w.printf(Locale.ROOT, "Paired with lamp lines: %d of the %d strongest peaks matched (%.0f %%)%s%n",
                calibration.strongMatched(), calibration.strongPeaks(), 100 * calibration.matchedFraction(),
                images == 0 ? "" : String.format(Locale.ROOT, "; %d peak%s explained as second-order image%s of lamp "
                        + "lines, not fitted", images, images == 1 ? "" : "s", images == 1 ? "" : "s"));
        w.printf(Locale.ROOT, "Solution: degree %d in %s wavelengths, %d lines used, %d rejected%n",
                solution.degree(), solution.medium().label(), solution.usedCount(), solution.rejectedCount());
        w.printf(Locale.ROOT, "RMS of the residuals: %.4g nm = %.3g pixel (reduced chi-square %.3g)%n",
                solution.rmsNm(), solution.rmsPixels(), solution.reducedChiSquare());
        w.printf(Locale.ROOT, "Coverage: lines from pixel %.1f to %.1f, %.0f %% of the detector%n",
                calibration.lowestUsedPixel(), calibration.highestUsedPixel(), 100 * calibration.coverage());
        double at = calibration.largestSigmaAtPixel();
        if (Double.isNaN(calibration.largestSigmaPixels())) {
            w.println("Largest stated uncertainty between those lines: none stated (the solution has no covariance)");
        } else {
            w.printf(Locale.ROOT, "Largest stated uncertainty between those lines: %.3g pixel (%.2g nm) near pixel"
                    + " %.1f%n", calibration.largestSigmaPixels(), solution.wavelengthSigmaAt(at), at);
        }
        w.printf(Locale.ROOT, "Outermost lines as the other lines predict them: %s at pixel %.1f, %s at pixel %.1f"
                + " (a wrong pairing at an end shows only when it is well beyond this)%n",
                confirmation(calibration.endConfirmationPixels(false)), calibration.endConfirmationAtPixel(false),
                confirmation(calibration.endConfirmationPixels(true)), calibration.endConfirmationAtPixel(true));
        w.println();
        LampMatch match = calibration.match();
        LampMatch saturatedPairs = calibration.saturatedPairs();
        // The line column is as wide as its longest label (28 at least; blends of level lists run longer).
        int width = 28;
        for (int i = 0; i < solution.size(); i++) {
            width = Math.max(width, calibration.pairLabel(i).length());
        }
        for (int i = 0; i < saturatedPairs.size(); i++) {
            width = Math.max(width, calibration.saturatedPairLabel(i).length());
        }
        // Rows end at their last character (a pair without a note has none), and a residual rounded to
        // zero has no sign, as in the other commands' text tables (Table).
        String row = "%8.3f %8.3f %-" + width + "s %14.5f %11s %9s %s";
        w.println(String.format(Locale.ROOT, "%8s %8s %-" + width + "s %14s %11s %9s", "pixel", "+-", "line",
                "solution nm", "resid nm", "resid px"));
        for (int i = 0; i < solution.size(); i++) {
            w.println(String.format(Locale.ROOT, row, solution.pixel(i), match.pixelSigma(i), calibration.pairLabel(i),
                    solution.wavelengthAt(solution.pixel(i)), residual("%.5f", solution.residualNm(i)),
                    residual("%.4f", solution.residualPixels(i)), pairNote(solution, i)).stripTrailing());
        }
        for (int i = 0; i < saturatedPairs.size(); i++) {
            double p = saturatedPairs.pixel(i);
            w.println(String.format(Locale.ROOT, row, p, saturatedPairs.pixelSigma(i),
                    calibration.saturatedPairLabel(i), solution.wavelengthAt(p),
                    residual("%.5f", calibration.saturatedResidualNm(i)),
                    residual("%.4f", calibration.saturatedResidualPixels(i)), "saturated, not fitted"));
        }
        w.println();
        w.printf(Locale.ROOT, "%10s %14s %12s %12s%n", "pixel", "wavelength nm", "+- nm", "nm/pixel");
        for (double p : new double[] {0, (n - 1) / 4.0, (n - 1) / 2.0, 3 * (n - 1) / 4.0, n - 1}) {
            // Beyond the fitted lines the polynomial is extrapolated: its uncertainty there is a model's.
            boolean outside = p < calibration.lowestUsedPixel() || p > calibration.highestUsedPixel();
            w.printf(Locale.ROOT, "%10.1f %14.5f %12.2g %12.6f%s%n", p, solution.wavelengthAt(p),
                    solution.wavelengthSigmaAt(p), solution.dispersionAt(p), outside ? "  extrapolated" : "");
        }
        int saturated = calibration.saturatedPeaks();
        if (saturated > 0) {
            int fittedSaturated = 0;
            for (int i = 0; i < match.size(); i++) {
                fittedSaturated += calibration.peaks().has(match.peakIndex(i),
                        org.ritzwerk.engine.calibrate.PeakFlag.SATURATED) ? 1 : 0;
            }
            w.printf(Locale.ROOT, "%nNote: %s reached the saturation level; their centroids come from the wings."
                    + " Paired and left out of the fit: %d%s.%n", Words.count(saturated, "peak"), saturatedPairs.size(),
                    fittedSaturated == 0 ? "" : String.format(Locale.ROOT, "; kept in it: %d, since without them"
                            + " too few pairs remain for a degree-%d solution", fittedSaturated, solution.degree()));
        }
        w.flush();
    }

    /** @return a residual as {@code pattern} writes it, "0.00000" rather than "-0.00000" when it rounds to zero */
    private static String residual(String pattern, double value) {
        return Table.unsignedZero(String.format(Locale.ROOT, pattern, value));
    }

    /** "rejected" for a pair the fit clipped, "blend" for one widened as an unresolved blend, or both. */
    private static String pairNote(DispersionSolution solution, int i) {
        String blend = solution.pairFlag(i);
        if (!solution.isRejected(i)) {
            return blend;
        }
        return blend.isEmpty() ? "rejected" : "rejected, " + blend;
    }

    private static List<CalibrationRecord.SaturatedLine> saturatedLines(Calibration calibration) {
        LampMatch left = calibration.saturatedPairs();
        List<CalibrationRecord.SaturatedLine> lines = new ArrayList<>();
        for (int i = 0; i < left.size(); i++) {
            lines.add(new CalibrationRecord.SaturatedLine(left.pixel(i), left.wavelength(i),
                    calibration.saturatedPairLabel(i)));
        }
        return lines;
    }

    private static void pairs(Calibration calibration, PrintWriter out, Table.Format format) {
        DispersionSolution solution = calibration.solution();
        LampMatch match = calibration.match();
        Table table = new Table(List.of(
                Table.Column.number("pixel", "pixel", "%.3f"),
                Table.Column.number("pixel_sigma", "+-", "%.3f"),
                Table.Column.text("line", "line"),
                Table.Column.number("wavelength_nm", "line nm", "%.5f"),
                Table.Column.number("solution_nm", "solution nm", "%.5f"),
                Table.Column.number("residual_nm", "resid nm", "%.5f"),
                Table.Column.number("residual_pixels", "resid px", "%.4f"),
                Table.Column.text("used", "used"),
                Table.Column.text("flag", "flag")), out, format);
        for (int i = 0; i < solution.size(); i++) {
            table.add(solution.pixel(i), match.pixelSigma(i), calibration.pairLabel(i), solution.wavelength(i),
                    solution.wavelengthAt(solution.pixel(i)), solution.residualNm(i), solution.residualPixels(i),
                    solution.isRejected(i) ? "false" : "true", pairNote(solution, i));
        }
        LampMatch saturatedPairs = calibration.saturatedPairs();
        for (int i = 0; i < saturatedPairs.size(); i++) {
            double p = saturatedPairs.pixel(i);
            table.add(p, saturatedPairs.pixelSigma(i), calibration.saturatedPairLabel(i), saturatedPairs.wavelength(i),
                    solution.wavelengthAt(p), calibration.saturatedResidualNm(i), calibration.saturatedResidualPixels(i),
                    "false", "saturated");
        }
        table.finish();
    }

    private void drawResiduals(OutputFiles.Batch batch, Calibration calibration) throws IOException {
        DispersionSolution solution = calibration.solution();
        Plots.calibrationResiduals(batch, plot, String.format(Locale.ROOT, "Dispersion residuals: degree %d, RMS %.3g"
                + " pm (%.3g px)", solution.degree(), solution.rmsNm() * 1e3, solution.rmsPixels()), calibration);
    }

    private int applySolution(SpectrumFiles.Spectrum spectrum) throws IOException {
        CalibrationFiles.Calibration saved = CalibrationFiles.read(apply);
        if (spectrum.pixels() != saved.pixels()) {
            throw new OptionException(spectrumFile + " has " + spectrum.pixels() + " pixels but " + apply
                    + " was made for " + saved.pixels());
        }
        String text = SpectrumFiles.withWavelengths(spectrum, saved.solution(), apply.getFileName().toString());
        if (out == null) {
            spec.commandLine().getOut().print(text);
            spec.commandLine().getOut().flush();
        } else {
            OutputFiles.writeString(out, text);
        }
        return 0;
    }
    /** @return "+-0.70 pixel", or "unchecked" when too few other lines remain */
    private static String confirmation(double pixels) {
        return Double.isNaN(pixels) ? "unchecked (too few other lines)" : String.format(Locale.ROOT, "+-%.3g pixel",
                pixels);
    }
}
