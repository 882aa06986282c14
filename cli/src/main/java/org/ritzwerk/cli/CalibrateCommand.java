package org.ritzwerk.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.calibrate.DispersionFit;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.IdentifierRefinement;
import org.ritzwerk.engine.calibrate.LampLines;
import org.ritzwerk.engine.calibrate.LampMatch;
import org.ritzwerk.engine.calibrate.LampMatcher;
import org.ritzwerk.engine.calibrate.PeakFinder;
import org.ritzwerk.engine.calibrate.PeakFlag;
import org.ritzwerk.engine.calibrate.Peaks;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.CalibrationFiles;
import org.ritzwerk.refdata.DataRegistry;
import org.ritzwerk.refdata.SpectrumFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code ritzwerk calibrate}: the pixel-to-wavelength solution of a spectrometer from a lamp spectrum. */
@Command(name = "calibrate",
        mixinStandardHelpOptions = true,
        header = "Find a spectrometer's pixel -> wavelength solution from a lamp spectrum.",
        description = {
            "Find the pixel -> wavelength solution of a spectrometer from a lamp spectrum (counts per",
            "pixel, a ritzwerk-spectrum file): detect the peaks (baseline, noise, S/N threshold,",
            "Gaussian least-squares centroids with uncertainties), pair them with the lamp's lines",
            "without a starting solution, refine the pairs with the line identifier (optimal one-to-one),",
            "fit a weighted polynomial with outlier clipping, and report",
            "the lines used and rejected, the RMS and the wavelength uncertainty across the detector.",
            "--apply puts a saved solution's wavelengths on another spectrum."
        },
        footer = {"", "Examples:",
            "  ritzwerk calibrate neon.csv --lamp \"Ne I\" --out calibration.json --plot residuals.png",
            "  ritzwerk calibrate arc.csv --lamp \"Ne I,Ar I\" --from \"500 nm\" --to \"900 nm\" \\",
            "      --dispersion-range 0.1,0.3",
            "  ritzwerk calibrate sample.csv --apply calibration.json --out sample-nm.csv",
            "",
            "Lamps: UV and high voltage; see the README's safety section."})
final class CalibrateCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SPECTRUM_FILE",
            description = "Counts per pixel: a ritzwerk-spectrum CSV or JSON file (rows in pixel order).")
    Path spectrumFile;

    @Option(names = "--lamp", paramLabel = "SPECIES",
            description = "The lamp's species, e.g. \"Ne I\" or \"Ne I,Ar I\": their built-in lamp sets.")
    List<String> lamps = new ArrayList<>();

    @Option(names = "--lines", paramLabel = "SET",
            description = "A line list of your own (file) or a data set id, with relative intensities. Repeatable.")
    List<String> lineSets = new ArrayList<>();

    @Option(names = "--medium", paramLabel = "MEDIUM", defaultValue = "air",
            description = "Medium of the solution's wavelengths: air (standard air) or vacuum. Default: ${DEFAULT-VALUE}.")
    String medium;

    @Option(names = "--from", paramLabel = "QUANTITY", description = "Prior: the lowest wavelength the detector may see.")
    String from;

    @Option(names = "--to", paramLabel = "QUANTITY", description = "Prior: the highest wavelength the detector may see.")
    String to;

    @Option(names = "--dispersion-range", paramLabel = "MIN,MAX",
            description = "Prior: the dispersion in nm per pixel, e.g. 0.05,0.2 (negative when wavelength falls with pixel).")
    String dispersionRange;

    @Option(names = "--degree", paramLabel = "N|auto", defaultValue = "auto",
            description = "Polynomial degree, or auto (chosen by AICc up to --max-degree). Default: ${DEFAULT-VALUE}.")
    String degree;

    @Option(names = "--max-degree", paramLabel = "N", defaultValue = "3",
            description = "Highest degree auto may choose. Default: ${DEFAULT-VALUE}.")
    int maxDegree;

    @Option(names = "--threshold", paramLabel = "SNR", defaultValue = "5",
            description = "Peaks need this signal-to-noise ratio. Default: ${DEFAULT-VALUE}.")
    double threshold;

    @Option(names = "--saturation", paramLabel = "COUNTS",
            description = "Counts at which the detector saturates; such peaks are flagged and left out of the fit.")
    Double saturation;

    @Option(names = "--tolerance", paramLabel = "PIXELS", defaultValue = "3",
            description = "How far (pixels) a peak may lie from a line's predicted place to pair. Default: ${DEFAULT-VALUE}.")
    double tolerance;

    @Option(names = "--min-matched", paramLabel = "FRACTION", defaultValue = "0.6",
            description = {"A solution must pair at least this fraction of the strongest peaks with lamp",
                "lines; lower it for lamps with many lines missing from the set. Default: ${DEFAULT-VALUE}."})
    double minMatched;

    @Option(names = "--clip", paramLabel = "K", defaultValue = "3.5",
            description = "Reject pairs beyond K robust standard deviations, one at a time. Default: ${DEFAULT-VALUE}.")
    double clip;

    @Option(names = "--out", paramLabel = "FILE",
            description = "Write the solution (ritzwerk-calibration JSON), or with --apply the spectrum with wavelengths.")
    Path out;

    @Option(names = "--plot", paramLabel = "PNG", description = "Draw the residuals of the fitted lines against pixel.")
    Path plot;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
            description = {"text (the report), csv (the fitted lines: pixel, pixel_sigma, line,",
                "wavelength_nm, solution_nm, residual_nm, residual_pixels, used) or json (the",
                "calibration document, as --out writes it). Default: ${DEFAULT-VALUE}."})
    Table.Format format;

    @Option(names = "--apply", paramLabel = "CALIBRATION",
            description = "Instead of calibrating: give SPECTRUM_FILE the wavelengths of this saved solution.")
    Path apply;

    @Override
    public Integer call() throws IOException {
        SpectrumFiles.Spectrum spectrum = SpectrumFiles.read(spectrumFile);
        if (apply != null) {
            return applySolution(spectrum);
        }
        Medium solutionMedium = AxisMedium.of(medium);
        LampSet lampSet = lampLines(solutionMedium);
        PeakFinder finder = PeakFinder.defaults().withThreshold(threshold).withNegativeCountsAllowed(true);
        if (saturation != null) {
            finder = finder.withSaturationLevel(saturation);
        }
        Peaks peaks;
        try {
            peaks = finder.find(spectrum.counts(), spectrum.sigmas());
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(spectrumFile + ": " + e.getMessage(), e);
        }
        LampMatcher matcher = LampMatcher.defaults().withTolerance(tolerance).withPrior(prior())
                .withMinInlierFraction(minMatched);
        LampMatch match = matcher.match(peaks, lampSet.lines);
        DispersionFit fit = degree.equals("auto") ? DispersionFit.automatic(maxDegree)
                : DispersionFit.ofDegree(parseDegree());
        fit = fit.withClipping(clip, DispersionFit.DEFAULT_CLIP_ITERATIONS);
        // Refine through the line identifier: every peak against every line, assigned optimally.
        match = IdentifierRefinement.refine(match, match.fit(fit), peaks, lampSet.lines, lampSet.species(), tolerance);
        DispersionSolution solution = match.fit(fit);
        switch (format) {
            case json:
                spec.commandLine().getOut().print(CalibrationFiles.toJson(solution, spectrum.pixels(),
                        describe(spectrum, lampSet), lampSet.labelsOf(match)));
                spec.commandLine().getOut().flush();
                break;
            case csv:
                pairs(solution, match, lampSet).write(spec.commandLine().getOut(), format);
                break;
            default:
                report(spectrum, peaks, match, solution, lampSet);
                break;
        }
        if (out != null) {
            CalibrationFiles.write(out, solution, spectrum.pixels(), describe(spectrum, lampSet), lampSet.labelsOf(match));
        }
        if (plot != null) {
            drawResiduals(solution);
        }
        return 0;
    }

    private int parseDegree() {
        try {
            return Integer.parseInt(degree);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("--degree must be a whole number or auto, got '" + degree + "'");
        }
    }

    private LampMatcher.Prior prior() {
        if (from == null && to == null && dispersionRange == null) {
            return LampMatcher.Prior.none();
        }
        double lo = 0;
        double hi = Double.POSITIVE_INFINITY;
        if (from != null || to != null) {
            if (from == null || to == null) {
                throw new IllegalArgumentException("give both --from and --to, or neither");
            }
            Medium m = AxisMedium.of(medium);
            double a = AxisMedium.nanometres(from, m);
            double b = AxisMedium.nanometres(to, m);
            lo = Math.min(a, b);
            hi = Math.max(a, b);
        }
        double dMin = LampMatcher.Prior.none().minDispersion();
        double dMax = LampMatcher.Prior.none().maxDispersion();
        if (dispersionRange != null) {
            String[] parts = dispersionRange.split(",");
            if (parts.length != 2) {
                throw new IllegalArgumentException("--dispersion-range takes MIN,MAX in nm per pixel, got '"
                        + dispersionRange + "'");
            }
            try {
                dMin = Double.parseDouble(parts[0].strip());
                dMax = Double.parseDouble(parts[1].strip());
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException("--dispersion-range: '" + dispersionRange + "' is not two numbers");
            }
        }
        try {
            return new LampMatcher.Prior(lo, hi, dMin, dMax);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("--from/--to/--dispersion-range: " + e.getMessage(), e);
        }
    }

    /** The lamp lines of every --lamp species and --lines set, in the solution's medium. */
    private record LampSet(LampLines lines, List<String> labels, List<String> sets, Species[] species) {

        List<String> labelsOf(LampMatch match) {
            List<String> result = new ArrayList<>();
            for (int i = 0; i < match.size(); i++) {
                result.add(labels.get(match.lineIndex(i)));
            }
            return result;
        }
    }

    private LampSet lampLines(Medium solutionMedium) throws IOException {
        if (lamps.isEmpty() && lineSets.isEmpty()) {
            throw new IllegalArgumentException("give the lamp: --lamp \"Ne I\" (built-in sets) or --lines FILE");
        }
        DataRegistry registry = DataRegistry.discoverDefault();
        List<String> sets = new ArrayList<>();
        for (String option : lamps) {
            for (String text : option.split(",")) {
                Species species = Species.parse(text.strip());
                List<DataRegistry.Listing> found = registry.find(DataKind.LAMP_LINES, species);
                if (found.isEmpty()) {
                    throw new IllegalArgumentException("--lamp: no built-in lamp set for " + species.notation()
                            + "; see `ritzwerk data`, or give your own list with --lines");
                }
                sets.add(found.get(0).info().id());
            }
        }
        sets.addAll(lineSets);
        List<Double> nm = new ArrayList<>();
        List<Double> intensity = new ArrayList<>();
        List<Double> sigma = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        List<Species> speciesOfLine = new ArrayList<>();
        boolean allSigmas = true;
        for (String set : sets) {
            LineList list = LineSets.load(set, "lamp set");
            double[] converted = LineSets.wavelengths(list, Unit.NANOMETRE, solutionMedium);
            for (int i = 0; i < list.size(); i++) {
                nm.add(converted[i]);
                intensity.add(list.intensity(i).orElse(1));
                double u = list.uncertainty(i).orElse(Double.NaN);
                allSigmas &= !Double.isNaN(u);
                sigma.add(Math.abs(converted[i] / list.position(i)) * u);
                speciesOfLine.add(list.species(i));
                labels.add(list.species(i).notation() + " " + list.position(i) + " " + list.unit().symbol()
                        + (list.medium() == null ? "" : " " + list.medium().label()));
            }
        }
        double[] w = nm.stream().mapToDouble(Double::doubleValue).toArray();
        double[] in = intensity.stream().mapToDouble(Double::doubleValue).toArray();
        double[] s = allSigmas ? sigma.stream().mapToDouble(Double::doubleValue).toArray() : null;
        return new LampSet(LampLines.of(w, in, s, solutionMedium), labels, sets, speciesOfLine.toArray(new Species[0]));
    }

    private String describe(SpectrumFiles.Spectrum spectrum, LampSet lampSet) {
        return "spectrum " + spectrum.source() + "; lamp sets " + String.join(", ", lampSet.sets());
    }

    private void report(SpectrumFiles.Spectrum spectrum, Peaks peaks, LampMatch match, DispersionSolution solution,
            LampSet lampSet) {
        PrintWriter w = spec.commandLine().getOut();
        int n = spectrum.pixels();
        w.printf(Locale.ROOT, "Spectrum: %s, %d pixels; lamp: %s%n", spectrum.source(), n,
                String.join(", ", lampSet.sets()));
        w.printf(Locale.ROOT, "Peaks found: %d above S/N %.3g (noise scale %.3g counts)%n", peaks.size(), threshold,
                peaks.noiseScale());
        w.printf(Locale.ROOT, "Paired with lamp lines: %d of the %d strongest peaks matched (%.0f %%)%n",
                match.strongMatched(), match.strongPeaks(), 100 * match.inlierFraction());
        double lowest = Double.POSITIVE_INFINITY;
        double highest = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < solution.size(); i++) {
            if (!solution.isRejected(i)) {
                lowest = Math.min(lowest, solution.pixel(i));
                highest = Math.max(highest, solution.pixel(i));
            }
        }
        w.printf(Locale.ROOT, "Solution: degree %d in %s wavelengths, %d lines used, %d rejected%n",
                solution.degree(), solution.medium().label(), solution.usedCount(), solution.rejectedCount());
        w.printf(Locale.ROOT, "RMS of the residuals: %.4g nm = %.3g pixel (reduced chi-square %.3g)%n",
                solution.rmsNm(), solution.rmsPixels(), solution.reducedChiSquare());
        w.printf(Locale.ROOT, "Coverage: lines from pixel %.1f to %.1f, %.0f %% of the detector%n", lowest, highest,
                100 * (highest - lowest) / Math.max(1, n - 1));
        w.println();
        w.printf(Locale.ROOT, "%8s %8s %-28s %14s %11s %9s %s%n", "pixel", "+-", "line", "solution nm", "resid nm",
                "resid px", "");
        List<String> labels = lampSet.labelsOf(match);
        for (int i = 0; i < solution.size(); i++) {
            w.printf(Locale.ROOT, "%8.3f %8.3f %-28s %14.5f %11.5f %9.4f %s%n", solution.pixel(i),
                    match.pixelSigma(i), labels.get(i), solution.wavelengthAt(solution.pixel(i)),
                    solution.residualNm(i), solution.residualPixels(i), solution.isRejected(i) ? "rejected" : "");
        }
        w.println();
        w.printf(Locale.ROOT, "%10s %14s %12s %12s%n", "pixel", "wavelength nm", "+- nm", "nm/pixel");
        for (double p : new double[] {0, (n - 1) / 4.0, (n - 1) / 2.0, 3 * (n - 1) / 4.0, n - 1}) {
            w.printf(Locale.ROOT, "%10.1f %14.5f %12.2g %12.6f%n", p, solution.wavelengthAt(p),
                    solution.wavelengthSigmaAt(p), solution.dispersionAt(p));
        }
        long saturated = 0;
        for (int k = 0; k < peaks.size(); k++) {
            saturated += peaks.has(k, PeakFlag.SATURATED) ? 1 : 0;
        }
        if (saturated > 0) {
            w.printf(Locale.ROOT, "%nNote: %d peak(s) reached the saturation level; their centroids come from the wings.%n",
                    saturated);
        }
        w.flush();
    }

    private static Table pairs(DispersionSolution solution, LampMatch match, LampSet lampSet) {
        Table table = new Table(List.of(
                Table.Column.number("pixel", "pixel", "%.3f"),
                Table.Column.number("pixel_sigma", "+-", "%.3f"),
                Table.Column.text("line", "line"),
                Table.Column.number("wavelength_nm", "line nm", "%.5f"),
                Table.Column.number("solution_nm", "solution nm", "%.5f"),
                Table.Column.number("residual_nm", "resid nm", "%.5f"),
                Table.Column.number("residual_pixels", "resid px", "%.4f"),
                Table.Column.text("used", "used")));
        List<String> labels = lampSet.labelsOf(match);
        for (int i = 0; i < solution.size(); i++) {
            table.add(solution.pixel(i), match.pixelSigma(i), labels.get(i), solution.wavelength(i),
                    solution.wavelengthAt(solution.pixel(i)), solution.residualNm(i), solution.residualPixels(i),
                    solution.isRejected(i) ? "false" : "true");
        }
        return table;
    }

    private void drawResiduals(DispersionSolution solution) throws IOException {
        List<double[]> used = new ArrayList<>();
        List<double[]> rejected = new ArrayList<>();
        for (int i = 0; i < solution.size(); i++) {
            double[] point = {solution.pixel(i), solution.residualNm(i) * 1e3, solution.sigmaNm(i) * 1e3};
            (solution.isRejected(i) ? rejected : used).add(point);
        }
        Plots.residuals(plot, String.format(Locale.ROOT, "Dispersion residuals: degree %d, RMS %.3g pm (%.3g px)",
                solution.degree(), solution.rmsNm() * 1e3, solution.rmsPixels()), "pixel",
                "residual (pm, " + solution.medium().label() + ")", used, rejected);
    }

    private int applySolution(SpectrumFiles.Spectrum spectrum) throws IOException {
        CalibrationFiles.Calibration calibration = CalibrationFiles.read(apply);
        DispersionSolution solution = calibration.solution();
        int n = spectrum.pixels();
        if (n != calibration.pixels()) {
            throw new IllegalArgumentException(spectrumFile + " has " + n + " pixels but " + apply
                    + " was made for " + calibration.pixels());
        }
        StringBuilder text = new StringBuilder();
        text.append("# ritzwerk-spectrum 1\n");
        text.append("# axis: wavelength nm ").append(solution.medium().label()).append(" (pixel centres; from ")
                .append(apply.getFileName()).append(")\n");
        text.append("# source: ").append(spectrumFile.getFileName()).append('\n');
        text.append("pixel,wavelength_nm,wavelength_sigma_nm,counts").append(spectrum.sigmas() != null
                ? ",counts_sigma" : "").append('\n');
        double[] counts = spectrum.counts();
        for (int p = 0; p < n; p++) {
            text.append(p).append(',').append(String.format(Locale.ROOT, "%.6f", solution.wavelengthAt(p))).append(',')
                    .append(String.format(Locale.ROOT, "%.2g", solution.wavelengthSigmaAt(p))).append(',')
                    .append(counts[p]);
            if (spectrum.sigmas() != null) {
                text.append(',').append(spectrum.sigmas()[p]);
            }
            text.append('\n');
        }
        if (out == null) {
            spec.commandLine().getOut().print(text);
            spec.commandLine().getOut().flush();
        } else {
            Files.writeString(out, text, StandardCharsets.UTF_8);
        }
        return 0;
    }
}
