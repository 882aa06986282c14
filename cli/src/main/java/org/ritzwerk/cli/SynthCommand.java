package org.ritzwerk.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.profile.Broadening;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.QuantityText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code ritzwerk synth}: a synthetic emission spectrum of one-electron ions with known truth. */
@Command(name = "synth",
        mixinStandardHelpOptions = true,
        description = {
            "Render a synthetic emission spectrum: the n -> n' lines of one-electron ions, upper",
            "levels populated by Boltzmann's law at --temperature (which also sets the Doppler",
            "width), seen through a Gaussian instrument of --resolving-power, integrated over",
            "each pixel, scaled so the brightest pixel expects --peak-counts, then given Poisson",
            "and read noise from --seed. Writes a ritzwerk-spectrum CSV; --truth also writes the",
            "lines that went in."
        },
        footer = {"", "Examples:",
            "  ritzwerk synth --species \"H I\" --from \"640 nm air\" --to \"670 nm air\" --medium air --temperature 9000",
            "  ritzwerk synth --species \"H I,He II\" --from \"380 nm air\" --to \"700 nm air\" --medium air --temperature 20000 \\",
            "      --resolving-power 5000 --pixels 20000 --seed 7 --out scene.csv --truth scene-lines.csv"})
final class SynthCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    Ions ions;

    @Option(names = "--from", required = true, paramLabel = "QUANTITY", description = "One end of the spectrum.")
    String from;

    @Option(names = "--to", required = true, paramLabel = "QUANTITY", description = "The other end.")
    String to;

    @Option(names = "--medium", paramLabel = "MEDIUM", defaultValue = "vacuum",
            description = "Wavelengths of the pixel axis: vacuum or air (standard air). Default: ${DEFAULT-VALUE}.")
    String medium;

    @Option(names = "--temperature", required = true, paramLabel = "K",
            description = "Excitation and kinetic temperature of the emitters, kelvin.")
    double temperature;

    @Option(names = "--velocity", paramLabel = "KM_S", defaultValue = "0",
            description = {"Line-of-sight velocity of the emitters in km/s, positive away: every line is",
                "shifted by the relativistic Doppler factor sqrt((1 + v/c) / (1 - v/c)). Default: ${DEFAULT-VALUE}."})
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
            description = "Expected counts in the brightest pixel, before noise. Default: ${DEFAULT-VALUE}.")
    double peakCounts;

    @Option(names = "--read-noise", paramLabel = "COUNTS", defaultValue = "0",
            description = "Gaussian read noise per pixel, standard deviation in counts. Default: ${DEFAULT-VALUE}.")
    double readNoise;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1",
            description = "Seed of the noise; the same seed gives the same counts. Default: ${DEFAULT-VALUE}.")
    long seed;

    @Option(names = "--no-noise", description = "Write the expected counts without noise.")
    boolean noNoise;

    @Option(names = "--out", paramLabel = "FILE", description = "Write the spectrum here instead of to the output.")
    Path out;

    @Option(names = "--truth", paramLabel = "FILE", description = "Also write the rendered lines, with their counts, here.")
    Path truth;

    @Override
    public Integer call() throws IOException {
        if (!(temperature > 0 && temperature < 1e9)) {
            throw new IllegalArgumentException("--temperature must be a positive number of kelvin below 1e9, got "
                    + temperature);
        }
        if (!(resolvingPower > 0) || Double.isInfinite(resolvingPower)) {
            throw new IllegalArgumentException("--resolving-power must be a finite positive number, got " + resolvingPower);
        }
        if (pixels < 2 || pixels > 50_000_000) {
            throw new IllegalArgumentException("--pixels must be 2 to 50000000, got " + pixels);
        }
        if (nMax < 2 || nMax > HydrogenLikeLines.MAX_N) {
            throw new IllegalArgumentException("--n-max must be 2 to " + HydrogenLikeLines.MAX_N + ", got " + nMax);
        }
        if (!(peakCounts > 0) || Double.isInfinite(peakCounts)) {
            throw new IllegalArgumentException("--peak-counts must be a finite positive number, got " + peakCounts);
        }
        if (!(Math.abs(velocity) < 0.1 * PhysicalConstants.C / 1e3)) {
            throw new IllegalArgumentException("--velocity must be below a tenth of the speed of light (29979 km/s), got "
                    + velocity);
        }
        if (!(collisionalWidth >= 0) || Double.isInfinite(collisionalWidth)) {
            throw new IllegalArgumentException("--collisional-width must be a finite width >= 0 nm, got " + collisionalWidth);
        }
        Medium axisMedium = AxisMedium.of(medium);
        double oneEnd = axisNanometres(from, axisMedium);
        double otherEnd = axisNanometres(to, axisMedium);
        double lo = Math.min(oneEnd, otherEnd);
        double hi = Math.max(oneEnd, otherEnd);
        if (!(hi > lo)) {
            throw new IllegalArgumentException("--from and --to are the same position; give a range");
        }
        PixelGrid grid = switch (gridKind) {
            case "linear" -> PixelGrid.linear(lo, hi, pixels);
            case "log" -> PixelGrid.logarithmic(lo, hi, pixels);
            default -> throw new IllegalArgumentException("--grid must be linear or log, got '" + gridKind + "'");
        };

        // Lines just beyond the ends still spill light into the edge pixels.
        double margin = 50 * (hi / resolvingPower + collisionalWidth);
        Scene scene = new Scene();
        for (Ions.Ion ion : ions.resolve()) {
            addLines(scene, ion, axisMedium, lo - margin, hi + margin);
        }
        double[] expected = new double[grid.pixels()];
        new LineRenderer(grid, Instrument.ofResolvingPower(resolvingPower), LineRenderer.DEFAULT_WINDOW)
                .render(scene.positions(), scene.fluxes(), scene.gaussianWidths(), lorentzWidths(scene.size), expected);
        double brightest = 0;
        for (double v : expected) {
            brightest = Math.max(brightest, v);
        }
        if (brightest == 0) {
            throw new IllegalArgumentException("no line of " + String.join(", ", ions.species) + " falls between "
                    + from + " and " + to + " (n <= " + nMax + "); widen the range or raise --n-max");
        }
        double scale = peakCounts / brightest;
        for (int p = 0; p < expected.length; p++) {
            expected[p] *= scale;
        }
        double[] counts = expected.clone();
        if (!noNoise) {
            Noise.apply(expected, readNoise, seed, counts);
        }
        writeSpectrum(grid, expected, counts);
        if (truth != null) {
            writeTruth(scene, scale);
        }
        return 0;
    }

    /** A --from or --to value (any spectral unit) as a wavelength in nm in the axis medium. */
    private static double axisNanometres(String quantity, Medium axisMedium) {
        double hertz = QuantityText.standard().parseSpectral(quantity).toFrequency().inHertz();
        return axisMedium.fromVacuum(PhysicalConstants.C / hertz) * 1e9;
    }

    private double[] lorentzWidths(int lines) {
        double[] widths = new double[lines];
        Arrays.fill(widths, collisionalWidth);
        return widths;
    }

    /** Lines of all species in the columns the renderer takes. */
    private static final class Scene {
        int size;
        double[] position = new double[64];
        double[] flux = new double[64];
        double[] gaussian = new double[64];
        String[] label = new String[64];

        void add(double positionNm, double relativeFlux, double gaussianNm, String text) {
            if (size == position.length) {
                position = Arrays.copyOf(position, 2 * size);
                flux = Arrays.copyOf(flux, 2 * size);
                gaussian = Arrays.copyOf(gaussian, 2 * size);
                label = Arrays.copyOf(label, 2 * size);
            }
            position[size] = positionNm;
            flux[size] = relativeFlux;
            gaussian[size] = gaussianNm;
            label[size] = text;
            size++;
        }

        double[] positions() {
            return Arrays.copyOf(position, size);
        }

        double[] fluxes() {
            return Arrays.copyOf(flux, size);
        }

        double[] gaussianWidths() {
            return Arrays.copyOf(gaussian, size);
        }
    }

    private void addLines(Scene scene, Ions.Ion ion, Medium axisMedium, double loNm, double hiNm) {
        HydrogenLikeModel model = ion.model();
        HydrogenLikeLines generator = HydrogenLikeLines.of(model);
        double kT = PhysicalConstants.K * temperature;
        double ground = model.energy(1, 0, 1);
        // Partition function of the ion, cut off at n-max: sum of 2 n^2 exp(-(E_n - E_1) / kT).
        double partition = 0;
        for (int n = 1; n <= nMax; n++) {
            partition += 2.0 * n * n * Math.exp(-(model.energy(n, 0, 1) - ground) / kT);
        }
        double doppler = dopplerFactor();
        double vacuumLo = axisMedium.toVacuum(Math.max(loNm, 1e-3) * 1e-9) / doppler;
        double vacuumHi = axisMedium.toVacuum(hiNm * 1e-9) / doppler;
        LineTable table = generator.multiplets(nMax, PhysicalConstants.C / vacuumHi, PhysicalConstants.C / vacuumLo);
        double mass = model.nucleus().massKg() + (model.nucleus().z() - ion.species().charge())
                * PhysicalConstants.ELECTRON_MASS.value();
        for (int i = 0; i < table.size(); i++) {
            double upper = model.energy(table.upperN(i), 0, 1);
            // Photons per second per emitter: population g exp(-E / kT) / Z times A.
            double photons = table.upperWeight(i) * table.einsteinA(i) * Math.exp(-(upper - ground) / kT) / partition;
            double nu = table.frequency(i);
            double positionNm = axisMedium.fromVacuum(doppler * PhysicalConstants.C / nu) * 1e9;
            double dopplerNm = positionNm * Broadening.dopplerFwhm(nu, temperature, mass) / nu;
            scene.add(positionNm, photons, dopplerNm, ion.species().notation() + " " + table.seriesName(i));
        }
    }

    /** The relativistic Doppler factor on wavelengths, observed over emitted. */
    private double dopplerFactor() {
        double beta = velocity * 1e3 / PhysicalConstants.C;
        return Math.sqrt((1 + beta) / (1 - beta));
    }

    private void writeSpectrum(PixelGrid grid, double[] expected, double[] counts) throws IOException {
        StringWriter text = new StringWriter();
        PrintWriter w = new PrintWriter(text);
        w.println("# ritzwerk-spectrum 1");
        w.println("# axis: wavelength nm " + medium + " (pixel centres; " + gridKind + " pixels from "
                + fmt(grid.edge(0)) + " to " + fmt(grid.edge(grid.pixels())) + ")");
        w.println("# species: " + String.join(",", ions.species) + " (" + ions.model + " levels, n <= " + nMax + ")");
        w.println("# temperature-k: " + temperature);
        w.println("# resolving-power: " + resolvingPower);
        w.println("# velocity-km-s: " + velocity);
        w.println("# collisional-fwhm-nm: " + collisionalWidth);
        w.println("# noise: " + (noNoise ? "none" : "poisson, read " + readNoise + " counts, seed " + seed));
        w.println("wavelength_nm,expected_counts,counts");
        for (int p = 0; p < grid.pixels(); p++) {
            w.println(fmt(grid.centre(p)) + "," + String.format(Locale.ROOT, "%.6g", expected[p]) + ","
                    + String.format(Locale.ROOT, "%.6g", counts[p]));
        }
        w.flush();
        emit(out, text.toString());
    }

    private void writeTruth(Scene scene, double scale) throws IOException {
        StringWriter text = new StringWriter();
        PrintWriter w = new PrintWriter(text);
        w.println("# ritzwerk-spectrum-lines 1");
        w.println("# counts: the line's expected counts summed over all pixels (before noise; less where it");
        w.println("#   lies near or beyond an end of the spectrum)");
        w.println("wavelength_nm,counts,doppler_fwhm_nm,line");
        for (int i = 0; i < scene.size; i++) {
            w.println(fmt(scene.position[i]) + "," + String.format(Locale.ROOT, "%.6g", scene.flux[i] * scale) + ","
                    + String.format(Locale.ROOT, "%.4g", scene.gaussian[i]) + "," + scene.label[i]);
        }
        w.flush();
        emit(truth, text.toString());
    }

    private void emit(Path path, String content) throws IOException {
        if (path == null) {
            spec.commandLine().getOut().print(content);
            spec.commandLine().getOut().flush();
            return;
        }
        try (Writer writer = Files.newBufferedWriter(path, StandardCharsets.UTF_8)) {
            writer.write(content);
        }
    }

    private static String fmt(double nm) {
        return String.format(Locale.ROOT, "%.6f", nm);
    }
}
