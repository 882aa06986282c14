package org.ritzwerk.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.calibrate.CalibratedPeaks;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.calibrate.PeakFinder;
import org.ritzwerk.engine.calibrate.Peaks;
import org.ritzwerk.engine.hyperfine.HyperfineComponent;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.IdentificationSearch;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.ShiftSearch;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.engine.plasma.BalmerPlasmaFit;
import org.ritzwerk.engine.plasma.IsotopePairs;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.engine.rydberg.LadderExcitation;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.AlkaliHyperfine;
import org.ritzwerk.refdata.CalibrationFiles;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.OutputFiles;
import org.ritzwerk.refdata.PeakFiles;
import org.ritzwerk.refdata.SpectrumFiles;

/**
 * The demo's invented scenario, run end to end with the library on data it generates itself
 * from fixed seeds: the optics lab "Wrenfield Bench" calibrates its compact grating
 * spectrometer with a neon lamp, measures a hydrogen-deuterium-helium discharge with it,
 * identifies the lines (with the plasma's velocity and the H-D isotope shift), estimates the
 * discharge's temperature and electron density, and plans the lasers and microwaves of a
 * rubidium Rydberg sensor. Every number of the scenario (spectrometer, lamp exposure,
 * discharge conditions) is invented; the physics and the neon lines are the library's.
 */
final class DemoScenario {

    /** The spectrometer: pixel p sees 400 + 0.0700 p - 1.0e-6 p^2 nm in standard air (invented). */
    static final double[] DISPERSION = {400, 0.0700, -1.0e-6};
    /** Detector pixels. */
    static final int PIXELS = 4096;
    /** The spectrometer's Gaussian response, nm FWHM (invented). */
    static final double RESPONSE_FWHM = 0.10;
    /** The discharge's invented conditions. */
    static final double DISCHARGE_TEMPERATURE = 9000;
    static final double DISCHARGE_DENSITY = 3e20;
    static final double DISCHARGE_VELOCITY = 6e3;
    static final double CORE_TEMPERATURE = 60_000;
    /** Deuterium atoms per hydrogen atom in the discharge (invented). */
    static final double DEUTERIUM_RATIO = 0.5;

    /** What the demo found, for its report and its tests. */
    static final class Results {
        double calibrationRmsPixels;
        double calibrationWorstErrorPixels;
        int calibrationLinesUsed;
        double velocity;
        double velocityUncertainty;
        final List<String> identified = new ArrayList<>();
        double isotopeShiftMeasured = Double.NaN;
        double isotopeShiftPredicted = Double.NaN;
        double temperature = Double.NaN;
        double temperatureUncertainty = Double.NaN;
        double density = Double.NaN;
        double deuteriumRatio = Double.NaN;
        final List<Double> rydbergMicrowaveGhz = new ArrayList<>();
        final List<Double> rydbergSecondLaserNm = new ArrayList<>();
        final List<Double> rydbergSecondLaserLockNm = new ArrayList<>();
        double rydbergLockTerahertz = Double.NaN;
        final List<Path> files = new ArrayList<>();
    }

    private final Path folder;
    private final PrintWriter out;
    private final int threads;
    private final DataContext data;

    /**
     * @param folder  where the files go
     * @param out     where the report goes
     * @param threads rendering threads (the results do not depend on it)
     * @param data    the reference data (lamp lines, nuclei, the rubidium atom)
     */
    DemoScenario(Path folder, PrintWriter out, int threads, DataContext data) {
        this.folder = folder;
        this.out = out;
        this.threads = threads;
        this.data = data;
    }

    /** The file that marks a folder as the demo's own, so a later run may replace its files. */
    static final String MARKER = ".ritzwerk-demo";

    Results run() throws IOException {
        claimFolder();
        Results results = new Results();
        PixelGrid detector = PixelGrid.dispersion(DISPERSION, PIXELS);
        out.println("Ritzwerk demo: the Wrenfield Bench optics lab (an invented scenario; all data generated here)");
        out.println();
        DispersionSolution solution = calibrate(detector, results);
        discharge(detector, solution, results);
        rydbergSensor(results);
        out.println("Files written to " + folder.toAbsolutePath() + ":");
        for (Path file : results.files) {
            out.println("  " + file.getFileName());
        }
        out.println();
        out.println("Next, with the commands themselves:");
        out.println("  ./ritzwerk calibrate " + folder.resolve("neon-lamp.csv") + " --lamp \"Ne I\"");
        out.println("  ./ritzwerk identify " + folder.resolve("discharge-peaks.csv")
                + " --species \"H I,D I,He II\" --search-velocity 50 --tolerance \"0.06 nm\"");
        out.println("  (the unresolved H+D pairs sit between the H and D lines, hence the wide tolerance; the command");
        out.println("  pairs each with its H line, so its velocity comes out about 2 km/s lower than the report's,");
        out.println("  which places those pairs at their flux-weighted mean)");
        out.flush();
        return results;
    }

    /**
     * Makes the output folder, or checks that an existing one is empty or was made by the demo:
     * a folder holding anything else is refused, so no file of the user's is replaced.
     */
    private void claimFolder() throws IOException {
        if (Files.exists(folder) && !Files.isDirectory(folder)) {
            throw new OptionException("--out-dir " + folder + " is a file, not a folder");
        }
        if (Files.isDirectory(folder) && Files.notExists(folder.resolve(MARKER))) {
            List<String> found = new ArrayList<>();
            try (var entries = Files.list(folder)) {
                entries.limit(4).forEach(f -> found.add(f.getFileName().toString()));
            }
            if (!found.isEmpty()) {
                throw new OptionException("--out-dir " + folder + " already holds files the demo did not make ("
                        + String.join(", ", found.subList(0, Math.min(3, found.size())))
                        + (found.size() > 3 ? ", ..." : "") + "); give a new or empty folder");
            }
        }
        Files.createDirectories(folder);
        OutputFiles.writeString(folder.resolve(MARKER), "made by `ritzwerk demo`; a later run replaces the demo's"
                + " files in this folder\n");
    }

    // ---- 1. Calibration -------------------------------------------------------------------

    private DispersionSolution calibrate(PixelGrid detector, Results results) throws IOException {
        out.println("1. Wavelength calibration with a neon lamp");
        out.println("   The lab's compact grating spectrometer (4096 pixels, about 400-670 nm) looks at a small neon");
        out.println("   calibration lamp. Ritzwerk finds the peaks, pairs them with the built-in Ne I lamp lines");
        out.println("   without any starting guess, and fits the pixel -> wavelength polynomial.");
        LineList neon = data.lampLines(Species.parse("Ne I"));
        double[] expected = Scene.builder(detector).medium(Medium.air()).temperature(350)
                .lineList(neon, data::nucleus).instrument(Instrument.ofFwhm(RESPONSE_FWHM))
                .peakCounts(30_000).build().render(threads).expectedCounts();
        for (int p = 0; p < PIXELS; p++) {
            expected[p] += 120; // dark level and stray light (invented)
        }
        double[] counts = new double[PIXELS];
        Noise.apply(expected, 6, 20261202L, counts);
        Path lampFile = folder.resolve("neon-lamp.csv");
        writeCounts(lampFile, counts, "a small neon calibration lamp on the Wrenfield Bench spectrometer (invented)");
        results.files.add(lampFile);

        Calibration calibration = Calibrator.defaults().calibrate(CalibrationProblem.builder(counts)
                .lamp(LampSet.of(List.of(neon), Medium.air())).source("neon-lamp.csv").build());
        Peaks peaks = calibration.peaks();
        DispersionSolution solution = calibration.solution();
        double worst = 0;
        for (int p = 0; p < PIXELS; p++) {
            double truth = DISPERSION[0] + p * (DISPERSION[1] + p * DISPERSION[2]);
            worst = Math.max(worst, Math.abs(solution.wavelengthAt(p) - truth) / solution.dispersionAt(p));
        }
        results.calibrationRmsPixels = solution.rmsPixels();
        results.calibrationWorstErrorPixels = worst;
        results.calibrationLinesUsed = solution.usedCount();
        out.printf(Locale.ROOT, "   %d peaks found; %d paired with neon lines, %d used, %d rejected by clipping%n",
                peaks.size(), solution.size(), solution.usedCount(), solution.rejectedCount());
        out.printf(Locale.ROOT, "   polynomial degree %d; residual RMS %.4f nm = %.3f pixel%n", solution.degree(),
                solution.rmsNm(), solution.rmsPixels());
        out.printf(Locale.ROOT, "   wavelength at the detector's centre: %.4f nm +- %.4f nm (standard air)%n",
                solution.wavelengthAt((PIXELS - 1) / 2.0), solution.wavelengthSigmaAt((PIXELS - 1) / 2.0));
        out.printf(Locale.ROOT, "   against the invented truth: worst error over the detector %.3f pixel%n", worst);
        Path calibrationFile = folder.resolve("calibration.json");
        CalibrationFiles.write(calibrationFile, solution, PIXELS, "demo: neon-lamp.csv, lamp-ne-i",
                calibration.pairLabels());
        results.files.add(calibrationFile);
        Path residuals = folder.resolve("calibration-residuals.png");
        try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
            Plots.calibrationResiduals(batch, residuals, String.format(Locale.ROOT, "Neon calibration residuals:"
                    + " degree %d, RMS %.3f pixel", solution.degree(), solution.rmsPixels()), calibration);
            batch.commit();
        }
        results.files.add(residuals);
        out.println();
        return solution;
    }

    // ---- 2. The discharge -----------------------------------------------------------------

    private void discharge(PixelGrid detector, DispersionSolution solution, Results results) throws IOException {
        out.println("2. A hydrogen-deuterium-helium discharge");
        out.println("   The same spectrometer looks along a discharge tube filled with hydrogen, deuterium and a");
        out.println("   little helium. Its cooler outer plasma shows the Balmer lines of H and D; its hot core");
        out.println("   shows ionised helium. The peaks are put on the neon calibration, identified with a");
        out.println("   velocity search, and used to estimate the plasma's temperature and electron density.");
        List<Ions.Ion> ions = Ions.of(data, List.of("H I", "D I", "He II"), "qed");
        Ions.Ion hydrogen = ions.get(0);
        Ions.Ion deuterium = ions.get(1);
        Ions.Ion helium = ions.get(2);
        double[] outer = Scene.builder(detector).medium(Medium.air()).temperature(DISCHARGE_TEMPERATURE)
                .electronDensity(DISCHARGE_DENSITY).velocity(DISCHARGE_VELOCITY).nMax(12)
                .hydrogenLike(hydrogen.species(), hydrogen.model(), 1)
                .hydrogenLike(deuterium.species(), deuterium.model(), DEUTERIUM_RATIO)
                .instrument(Instrument.ofFwhm(RESPONSE_FWHM)).peakCounts(40_000).build().render(threads)
                .expectedCounts();
        double[] core = Scene.builder(detector).medium(Medium.air()).temperature(CORE_TEMPERATURE)
                .velocity(DISCHARGE_VELOCITY).nMax(12).hydrogenLike(helium.species(), helium.model(), 1)
                .instrument(Instrument.ofFwhm(RESPONSE_FWHM)).peakCounts(8_000).build().render(threads)
                .expectedCounts();
        double[] expected = new double[PIXELS];
        for (int p = 0; p < PIXELS; p++) {
            expected[p] = outer[p] + core[p] + 150;
        }
        double[] counts = new double[PIXELS];
        Noise.apply(expected, 6, 4242L, counts);
        Path dischargeFile = folder.resolve("discharge.csv");
        writeCounts(dischargeFile, counts, "H-D-He discharge on the Wrenfield Bench spectrometer (invented)");
        results.files.add(dischargeFile);

        // Peaks to wavelengths through the calibration.
        Peaks peaks = PeakFinder.defaults().withThreshold(8).find(counts);
        CalibratedPeaks calibrated = CalibratedPeaks.of(peaks, solution);
        int n = calibrated.size();
        double[] nm = calibrated.wavelengthsNm();
        double[] nmSigma = calibrated.wavelengthSigmasNm();
        double[] flux = calibrated.fluxes(1e-9);
        PeakList peakList = calibrated.toPeakList(1e-9);
        Path peaksFile = folder.resolve("discharge-peaks.csv");
        writePeaks(peaksFile, calibrated);
        results.files.add(peaksFile);

        // First pass: every line of H I, D I and He II on its own, with a velocity search.
        Candidates candidates = Candidates.inWindow(395e-9, 680e-9)
                .hydrogenLike(hydrogen.species(), hydrogen.model(), 12, false)
                .hydrogenLike(deuterium.species(), deuterium.model(), 12, false)
                .hydrogenLike(helium.species(), helium.model(), 12, false).build();
        Identifier identifier = Identifier.of(Tolerance.absolute(0.03e-9));
        IdentificationSearch.Report first = IdentificationSearch.of(identifier).withVelocitySearch(100e3)
                .run(peakList, candidates.catalog());
        ShiftSearch.Fit velocity = first.velocity().orElseThrow();
        results.velocity = velocity.velocity();
        results.velocityUncertainty = velocity.velocityUncertainty();
        out.printf(Locale.ROOT, "   %d peaks above S/N 8; line-of-sight velocity %.2f +- %.2f km/s (invented truth %.1f)%n",
                n, velocity.velocity() / 1e3, velocity.velocityUncertainty() / 1e3, DISCHARGE_VELOCITY / 1e3);
        IsotopePairs pairs = IsotopePairs.of(hydrogen.species(), deuterium.species());
        Optional<IsotopePairs.Resolved> alpha = pairs.resolved(first.identification(), first.lines(), "Balmer alpha",
                nm, flux, calibrated.fluxSigmas(), Medium.air());
        double ratio = 0;
        if (alpha.isPresent()) {
            // Balmer-alpha resolves H from D: the pair gives the D/H ratio and the isotope shift.
            IsotopePairs.Resolved pair = alpha.get();
            ratio = pair.heavyPerLight();
            double resolution = calibrated.fwhmsNm()[pair.lightPeak()];
            results.isotopeShiftPredicted = pair.predictedShift();
            results.isotopeShiftMeasured = pair.measuredShift();
            results.deuteriumRatio = ratio;
            out.printf(Locale.ROOT, "   Balmer-alpha of H and D resolved: isotope shift measured %.4f nm, predicted %.4f nm;%n",
                    pair.measuredShift(), pair.predictedShift());
            out.printf(Locale.ROOT, "   D/H from their fluxes %.2f +- %.2f (invented truth %.2f).%n", ratio,
                    pair.heavyPerLightSigma(), DEUTERIUM_RATIO);
            pairs = pairs.withRatio(ratio).withBlendWithin(1.5 * resolution * 1e-9).withResolved("Balmer alpha");
            out.println("   Higher Balmer lines of H and D are closer than the lines' width; they are identified as");
            out.println("   unresolved pairs at the flux-weighted mean position.");
        } else {
            out.println("   Balmer-alpha of H and D not resolved: no isotope shift.");
        }
        // Second pass: unresolved H+D pairs as one line each, at the velocity found.
        IsotopePairs.Merged merged = pairs.merge(candidates.catalog());
        IdentificationSearch.Report second = IdentificationSearch.of(identifier)
                .run(peakList, merged.lines().shifted(velocity.value()));
        Identification id = second.identification();
        out.println();
        out.printf(Locale.ROOT, "   %12s %10s  %-32s %10s%n", "peak nm air", "+- nm", "identified as", "resid pm");
        List<Plots.Label> labels = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            String what = "(unexplained)";
            String residual = "";
            if (id.status(k) != Identification.UNEXPLAINED) {
                String name = merged.name(second.lines(), id.line(k));
                what = name + (id.status(k) == Identification.AMBIGUOUS ? " ?" : "");
                residual = String.format(Locale.ROOT, "%10.2f", id.residual(k) * 1e12);
                if (id.status(k) == Identification.MATCHED) {
                    results.identified.add(name);
                    label(labels, nm[k], name);
                }
            }
            out.printf(Locale.ROOT, "   %12.4f %10.4f  %-32s %s%n", nm[k], nmSigma[k], what, residual);
        }
        out.println();
        plasma(counts, solution, velocity.value(), second, candidates, hydrogen, deuterium, ratio, results);

        Path plotFile = folder.resolve("discharge.png");
        try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
            Plots.lineChart(batch, plotFile, "H-D-He discharge, Wrenfield Bench (invented): identified lines",
                    "wavelength (nm, standard air, from the neon calibration)", "counts per pixel",
                    solution.pixelCentreWavelengths(PIXELS), counts, labels, false);
            batch.commit();
        }
        results.files.add(plotFile);
        out.println();
    }

    /** Adds a plot label, joined to a label closer than 2.5 nm so that they do not overlap. */
    private static void label(List<Plots.Label> labels, double at, String text) {
        int near = -1;
        for (int l = 0; l < labels.size(); l++) {
            near = Math.abs(labels.get(l).x() - at) < 2.5 ? l : near;
        }
        if (near < 0) {
            labels.add(new Plots.Label(at, text));
        } else {
            Plots.Label old = labels.get(near);
            labels.set(near, new Plots.Label(Math.max(old.x(), at), old.text() + " / " + text));
        }
    }

    /**
     * Temperature and density from the Balmer lines matched, by the library's
     * {@link BalmerPlasmaFit} (Voigt fits with the D companion, Boltzmann plot, H-beta Stark width).
     */
    private void plasma(double[] counts, DispersionSolution solution, double redshift,
            IdentificationSearch.Report report, Candidates candidates, Ions.Ion hydrogen, Ions.Ion deuterium,
            double ratio, Results results) {
        BalmerPlasmaFit.Result fit = BalmerPlasmaFit.defaults().withInstrumentFwhm(RESPONSE_FWHM)
                .fit(BalmerPlasmaFit.problem(solution.pixelCentreWavelengths(PIXELS), Medium.air(), counts)
                        .readNoise(6).emitter(hydrogen.model()).companion(deuterium.model(), ratio).redshift(redshift)
                        .matchedLines(report.identification(), report.lines(), candidates).build());
        if (fit.temperature().isPresent()) {
            BalmerPlasmaFit.Temperature t = fit.temperature().get();
            results.temperature = t.kelvin();
            results.temperatureUncertainty = t.sigmaKelvin();
            out.printf(Locale.ROOT, "   Excitation temperature, Boltzmann plot of %d Balmer lines (Voigt-fitted fluxes): "
                    + "%.0f +- %.0f K%n   (invented truth %.0f K)%n", t.lines(), t.kelvin(), t.sigmaKelvin(),
                    DISCHARGE_TEMPERATURE);
        }
        if (fit.density().isPresent()) {
            BalmerPlasmaFit.Density d = fit.density().get();
            results.density = d.perCubicMetre();
            out.printf(Locale.ROOT, "   Electron density from the H-%s Stark width %.4f +- %.4f nm (Voigt fit with the"
                    + " D line):%n   %.2e +- %.1e m^-3 (invented truth %.1e)%n", d.upperN() == 4 ? "beta" : "alpha",
                    d.starkFwhmNm(), d.starkFwhmSigmaNm(), d.perCubicMetre(), d.sigmaPerCubicMetre(), DISCHARGE_DENSITY);
        }
        for (String note : fit.notes()) {
            out.println("   " + note);
        }
    }

    // ---- 3. A rubidium Rydberg sensor ------------------------------------------------------

    private void rydbergSensor(Results results) {
        out.println("3. Planning a rubidium Rydberg electrometer");
        out.println("   The lab's next project senses microwave fields with Rb-87 atoms excited to Rydberg");
        out.println("   states by two lasers (5s1/2 -> 5p3/2 -> nd5/2). For three candidate states, Ritzwerk gives");
        out.println("   the laser wavelengths, the microwave line to the nearest p state, its dipole matrix element");
        out.println("   and the lifetimes at 0 K and in a 300 K enclosure.");
        Species species = Species.parse("Rb-87 I");
        AlkaliAtom rb = data.alkaliAtom(species);
        State ground = State.parse("5s1/2");
        State intermediate = State.parse("5p3/2");
        int[] ns = {40, 50, 60};
        out.println("   Laser wavelengths, nm in standard air. 'centroid' joins the levels' hyperfine-free centroids");
        out.println("   (fine structure only); 'lock' is the hyperfine component a locked laser sits on: laser 1 on");
        out.println("   D2 5s1/2 F=2 -> 5p3/2 F'=3, laser 2 from 5p3/2 F'=3 to the Rydberg level's F''=4. Tune to "
                + "'lock'.");
        out.printf(Locale.ROOT, "   %-8s %17s %14s %17s %14s%n", "state", "laser 1 centroid", "laser 1 lock",
                "laser 2 centroid", "laser 2 lock");
        double secondLockOffsetMhz = Double.NaN;
        for (int n : ns) {
            State rydberg = State.of(n, 2, 5);
            LadderExcitation ladder = rb.ladder(ground, intermediate, rydberg);
            // The lock path F = 2 -> F' = 3 -> F'' = 4 (2F = 4, 6, 8), with the levels' A and B constants.
            AlkaliHyperfine.LadderComponent lock = AlkaliHyperfine.ladderComponents(data, species, ground,
                    intermediate, rydberg).stream().filter(p -> p.twoFLower() == 4 && p.twoFIntermediate() == 6
                            && p.twoFUpper() == 8).findFirst().orElseThrow();
            double secondLockNm = Medium.air().fromVacuum(PhysicalConstants.C / lock.secondHertz()) * 1e9;
            out.printf(Locale.ROOT, "   %-8s %17.6f %14.6f %17.6f %14.6f%n", rydberg.label(),
                    ladder.firstMetres(Medium.air()) * 1e9,
                    Medium.air().fromVacuum(PhysicalConstants.C / lock.firstHertz()) * 1e9,
                    ladder.secondMetres(Medium.air()) * 1e9, secondLockNm);
            results.rydbergSecondLaserNm.add(ladder.secondMetres(Medium.air()) * 1e9);
            results.rydbergSecondLaserLockNm.add(secondLockNm);
            if (n == 50) {
                secondLockOffsetMhz = (lock.secondHertz() - rb.frequencyHz(intermediate, rydberg)) / 1e6;
            }
        }
        out.printf(Locale.ROOT, "   %-8s %10s %14s %12s %10s %10s%n", "state", "to", "microwave GHz", "<d> e a0",
                "tau0 us", "tau300 us");
        double spread0 = 0;
        double spread300 = 0;
        for (int n : ns) {
            State rydberg = State.of(n, 2, 5);
            // The dipole-allowed p3/2 neighbour just below: (n+1)p3/2 lies under nd for rubidium.
            State partner = State.of(n + 1, 1, 3);
            double ghz = rb.frequencyHz(partner, rydberg) / 1e9;
            double dipole = rb.reducedDipole(rydberg, partner);
            double tau0 = rb.radiativeLifetime(rydberg) * 1e6;
            double tau300 = rb.effectiveLifetime(rydberg, 300) * 1e6;
            spread0 = Math.max(spread0, rb.radiativeLifetimeUncertainty(rydberg).orElseThrow() * 1e6 / tau0);
            spread300 = Math.max(spread300, rb.effectiveLifetimeUncertainty(rydberg, 300).orElseThrow() * 1e6 / tau300);
            out.printf(Locale.ROOT, "   %-8s %10s %14.4f %12.1f %10.1f %10.1f%n", rydberg.label(), partner.label(),
                    Math.abs(ghz), Math.abs(dipole), tau0, tau300);
            results.rydbergMicrowaveGhz.add(Math.abs(ghz));
        }
        // The first laser is locked to the strongest hyperfine component of D2.
        HyperfineComponent lock = data.alkaliHyperfine().components(data, species, ground, intermediate).stream()
                .filter(c -> c.twoFLower() == 4 && c.twoFUpper() == 6).findFirst().orElseThrow();
        double centroid = rb.frequencyHz(ground, intermediate);
        double lockVacuum = PhysicalConstants.C / lock.frequencyHertz();
        out.printf(Locale.ROOT, "   Laser 1 locks to D2 5s1/2 F=2 -> 5p3/2 F'=3: %.6f THz (%.5f nm vacuum, %.5f nm "
                + "air),%n   %.1f MHz from the line's hyperfine-free centroid (Rb-87's own D2 measurement and A, B%n"
                + "   constants); laser 2 from F'=3 to 50d5/2 F''=4 is %.1f MHz from its centroid.%n",
                lock.frequencyHertz() / 1e12, lockVacuum * 1e9, Medium.air().fromVacuum(lockVacuum) * 1e9,
                (lock.frequencyHertz() - centroid) / 1e6, secondLockOffsetMhz);
        results.rydbergLockTerahertz = lock.frequencyHertz() / 1e12;
        out.println("   The dipole is the reduced matrix element (Edmonds' convention); lifetimes from the");
        out.printf(Locale.ROOT, "   Coulomb-approximation wavefunctions, uncertain by up to %.1f %% at 0 K and "
                + "%.1f %% at 300 K%n   (the spread of two published methods of computing them).%n", 100 * spread0,
                100 * spread300);
        out.println("   Laser light and the lamps above need the usual protection: see the README's safety section.");
        out.println();
    }

    /** The discharge's peaks in the ritzwerk-peaks format, for {@code ritzwerk identify}. */
    private static void writePeaks(Path file, CalibratedPeaks peaks) throws IOException {
        PeakFiles.Peaks list = new PeakFiles.Peaks("wrenfield-discharge", Unit.NANOMETRE, peaks.medium(),
                peaks.wavelengthsNm(), peaks.wavelengthSigmasNm(), peaks.fluxes(1e-9), peaks.fwhmsNm(),
                new int[peaks.size()]);
        OutputFiles.writeString(file, PeakFiles.writeCsv(list, "peaks of the H-D-He discharge (demo)",
                "ritzwerk demo, invented scenario, calibrated with calibration.json", "computed", "1"));
    }

    private static void writeCounts(Path file, double[] counts, String what) throws IOException {
        OutputFiles.writeString(file, SpectrumFiles.writeCsv(new SpectrumFiles.Spectrum(file.getFileName().toString(),
                counts, null, null, java.util.Map.of("source", what))));
    }
}
