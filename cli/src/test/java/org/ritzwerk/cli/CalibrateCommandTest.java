package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.CalibrationFiles;
import org.ritzwerk.refdata.DataRegistry;
import org.ritzwerk.refdata.SpectrumFiles;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code ritzwerk calibrate} end to end on lamp spectra that {@code synth} renders through a
 * known dispersion polynomial, with noise and contaminating lines that are not in the lamp set.
 */
class CalibrateCommandTest {

    /** The truth: pixel p sees 540 + 0.06 p - 2e-6 p^2 nm (standard air); an invented spectrometer. */
    private static final double[] TRUTH = {540, 0.06, -2e-6};
    private static final int PIXELS = 2048;

    /** Invented contaminants (not neon lines), for the demo-style scene. */
    private static final String CONTAMINANTS = """
            # ritzwerk-lines 1
            # id: invented-contaminants
            # title: invented stray lines for a test
            # source: invented for this test
            # provenance: computed
            # version: 1
            # position-unit: nm
            # medium: air
            species,position,intensity
            Fe I,561.3,150
            Fe I,597.7,120
            Fe I,629.95,90
            """;

    private static double truth(double pixel) {
        return TRUTH[0] + TRUTH[1] * pixel + TRUTH[2] * pixel * pixel;
    }

    private static Path lampSpectrum(Path dir, long seed, boolean contaminated) throws IOException {
        Path spectrum = dir.resolve("neon-" + seed + ".csv");
        Path stray = dir.resolve("stray.csv");
        Files.writeString(stray, CONTAMINANTS);
        List<String> args = new java.util.ArrayList<>(List.of("synth", "--lines", "lamp-ne-i", "--dispersion",
                "540,0.06,-2e-6", "--pixels", String.valueOf(PIXELS), "--medium", "air", "--temperature", "400",
                "--resolving-power", "4000", "--read-noise", "4", "--seed", String.valueOf(seed), "--out",
                spectrum.toString()));
        if (contaminated) {
            args.add("--lines");
            args.add(stray.toString());
        }
        CliTest.Run run = CliTest.run(args.toArray(new String[0]));
        assertEquals(0, run.code(), run.err());
        return spectrum;
    }

    /**
     * A lamp given twice (its lines each with a twin: no peak could choose, and the pairing matched
     * none) is refused; a user's list repeating some built-in lines has them used once, with a
     * note (they vanished from the fit without a word); a list in the wrong unit is refused by
     * file and line (it was an internal error).
     */
    @Test
    void duplicateLampLinesAndListsInTheWrongUnit(@TempDir Path dir) throws IOException {
        Path spectrum = lampSpectrum(dir, 3, false);
        CliTest.Run twice = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I,Ne I");
        assertEquals(2, twice.code());
        assertTrue(twice.err().contains("--lamp names 'Ne I' twice"), twice.err());
        CliTest.Run setTwice = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--lines", "lamp-ne-i");
        assertEquals(2, setTwice.code());
        assertTrue(setTwice.err().contains("the line list lamp-ne-i is given twice"), setTwice.err());
        String header = "# ritzwerk-lines 1\n# id: extra\n# title: t\n# source: invented\n# provenance: measured\n"
                + "# version: 1\n# kind: lamp-lines\n# position-unit: nm\n# medium: air\nspecies,position,intensity\n";
        Path extra = dir.resolve("extra.csv");
        Files.writeString(extra, header + "Ne I,585.24879,500\nNe I,640.2248,1000\n");
        CliTest.Run merged = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--lines",
                extra.toString());
        assertEquals(0, merged.code(), merged.err());
        assertTrue(merged.err().contains("note: 2 lines of [lamp-ne-i, extra] repeat an earlier list's line"),
                merged.err());
        Path angstrom = dir.resolve("angstrom.csv");
        Files.writeString(angstrom, header.replace("position-unit: nm", "position-unit: Å") + "Ne I,585.24879,500\n");
        CliTest.Run unit = CliTest.run("calibrate", spectrum.toString(), "--lines", angstrom.toString());
        assertEquals(2, unit.code(), unit.err());
        assertTrue(unit.err().contains("angstrom.csv:11:2: column position: 585.24879 Å air cannot be converted"),
                unit.err());
    }

    /**
     * A window holding three of the mercury lamp's lines (404.66, 433.92 and 435.83 nm on an
     * invented 1024-pixel spectrometer, 395 + 0.05 p nm) calibrates with a prior, with a straight
     * line right within 3 stated uncertainties at the window's middle, from a photon-counting
     * exposure (no read noise) and from one with read noise. The report states how the centroid
     * uncertainties were scaled in words: with three peaks it had printed "pixel variance NaN".
     * Before, the first was refused ("matches 0 of the 3 strongest peaks") and the second after
     * refinement ("a calibration needs at least 4"). No other line checks an end of three, so the
     * solution is given only with --unchecked-ends, and refused without it, saying so.
     */
    @Test
    void aWindowWithThreeLampLinesCalibratesWithAPrior(@TempDir Path dir) throws IOException {
        for (String readNoise : new String[] {"0", "3"}) {
            Path spectrum = dir.resolve("mercury-" + readNoise + ".csv");
            CliTest.Run synth = CliTest.run("synth", "--lines", "lamp-hg-i", "--temperature", "5000", "--dispersion",
                    "395,0.05", "--pixels", "1024", "--resolving-power", "4000", "--medium", "air", "--read-noise",
                    readNoise, "--seed", "2", "--out", spectrum.toString());
            assertEquals(0, synth.code(), synth.err());
            Path out = dir.resolve("solution-" + readNoise + ".json");
            CliTest.Run refused = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Hg I", "--from", "394 nm",
                    "--to", "447 nm", "--dispersion-range", "0.049,0.051", "--out", out.toString());
            assertEquals(2, refused.code(), refused.err());
            assertTrue(refused.err().contains("is checked by no other line (3 pairs for a degree-1 solution")
                    && refused.err().contains("accept unchecked ends (--unchecked-ends)"), refused.err());
            assertFalse(Files.exists(out), "nothing written for a refused solution");
            CliTest.Run run = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Hg I", "--from", "394 nm",
                    "--to", "447 nm", "--dispersion-range", "0.049,0.051", "--unchecked-ends", "--out", out.toString());
            assertEquals(0, run.code(), run.err());
            assertTrue(run.err().contains("checked by the other lines not at all"), run.err());
            assertTrue(run.out().contains("Solution: degree 1 in air wavelengths, 3 lines used"), run.out());
            assertFalse(run.out().contains("NaN"), run.out());
            assertTrue(run.out().contains(readNoise.equals("0")
                    ? "(counted photons: no background noise and counts in steps of 1, so a photon is taken as 1"
                            + " counts"
                    : "(too few peaks to pool their scatter"), run.out());
            DispersionSolution solution = CalibrationFiles.read(out).solution();
            assertEquals(395 + 0.05 * 500, solution.wavelengthAt(500), 3 * solution.wavelengthSigmaAt(500));
        }
    }

    @Test
    void theCommandGivesWhatTheLibraryJobGives(@TempDir Path dir) throws IOException {
        Path spectrum = lampSpectrum(dir, 12, true);
        Path calibration = dir.resolve("calibration.json");
        CliTest.Run run = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--tolerance", "2.5",
                "--out", calibration.toString());
        assertEquals(0, run.code(), run.err());
        DispersionSolution fromCommand = CalibrationFiles.read(calibration).solution();

        SpectrumFiles.Spectrum counts = SpectrumFiles.read(spectrum);
        DataRegistry registry = DataRegistry.builtIn();
        LampSet neon = LampSet.of(List.of(registry.lampLines(Species.parse("Ne I"))), Medium.air());
        Calibration job = Calibrator.defaults().withTolerance(2.5)
                .calibrate(CalibrationProblem.builder(counts.counts()).lamp(neon).build());
        assertArrayEquals(job.solution().scaledCoefficients(), fromCommand.scaledCoefficients(), 0.0,
                "the command is the job: same coefficients bit for bit");
        for (int i = 0; i < fromCommand.covariance().length; i++) {
            assertArrayEquals(job.solution().covariance()[i], fromCommand.covariance()[i], 0.0);
        }
        assertTrue(run.out().contains(job.solution().usedCount() + " lines used"), run.out());
    }

    @Test
    void recoversTheDispersionWithinAFiftiethOfAPixel(@TempDir Path dir) throws IOException {
        Path spectrum = lampSpectrum(dir, 11, true);
        Path calibration = dir.resolve("calibration.json");
        Path png = dir.resolve("residuals.png");
        CliTest.Run run = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--out",
                calibration.toString(), "--plot", png.toString());
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("Solution: degree"), run.out());
        DispersionSolution solution = CalibrationFiles.read(calibration).solution();
        // Error against the truth over the whole detector, in pixels (local dispersion).
        double sum = 0;
        for (int p = 0; p < PIXELS; p++) {
            double errorPixels = (solution.wavelengthAt(p) - truth(p)) / (TRUTH[1] + 2 * TRUTH[2] * p);
            sum += errorPixels * errorPixels;
        }
        double rms = Math.sqrt(sum / PIXELS);
        assertTrue(rms < 0.05, "RMS error " + rms + " pixel");
        // The contaminants are not neon lines: none of them is among the fitted lines.
        JsonNode root = JsonMapper.builder().build().readTree(Files.readString(calibration));
        assertEquals("ritzwerk-calibration", root.get("format").asString());
        for (JsonNode line : root.get("lines")) {
            assertTrue(line.get("line").asString().startsWith("Ne I"), line.toString());
        }
        assertTrue(root.get("lines_used").asInt() >= 12, root.toString());
        assertTrue(Files.size(png) > 1000);
    }

    /**
     * Ghosts: the second orders of Hg 296.728 and 312.567 nm (invented strengths, given as lines of
     * an invented list at 593.456 and 625.134 nm) on the neon spectrum, calibrated against neon and
     * mercury (whose first-order lines do not show here). The report says the two peaks were
     * explained as second-order images and fitted neither; with --no-second-order it does not, and
     * the fitted lines are neon lines either way.
     */
    @Test
    void ghostsOfTheLampsSecondOrderAreNamedAndNotFitted(@TempDir Path dir) throws IOException {
        Path ghosts = dir.resolve("ghosts.csv");
        Files.writeString(ghosts, """
                # ritzwerk-lines 1
                # id: invented-ghosts
                # title: second orders of two Hg lines, strengths invented for a test
                # source: invented for this test (positions twice the lamp-hg-i rows)
                # provenance: computed
                # version: 1
                # position-unit: nm
                # medium: air
                species,position,intensity
                Fe I,593.456,400
                Fe I,625.1336,400
                """);
        Path spectrum = dir.resolve("ghosts-neon.csv");
        CliTest.Run synth = CliTest.run("synth", "--lines", "lamp-ne-i", "--lines", ghosts.toString(), "--dispersion",
                "540,0.06,-2e-6", "--pixels", String.valueOf(PIXELS), "--medium", "air", "--temperature", "400",
                "--resolving-power", "4000", "--read-noise", "4", "--seed", "13", "--out", spectrum.toString());
        assertEquals(0, synth.code(), synth.err());
        CliTest.Run run = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I,Hg I", "--format", "csv");
        assertEquals(0, run.code(), run.err());
        CliTest.Run text = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I,Hg I");
        assertTrue(text.out().contains("2 peaks explained as second-order images of lamp lines, not fitted"),
                text.out());
        CliTest.Run firstOrder = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I,Hg I",
                "--no-second-order");
        assertEquals(0, firstOrder.code(), firstOrder.err());
        assertTrue(!firstOrder.out().contains("second-order"), firstOrder.out());
        for (String row : run.out().split("\\R")) {
            assertTrue(row.startsWith("pixel") || row.isBlank() || row.contains("Ne I"), row);
        }
    }

    @Test
    void appliesASavedSolutionToAnotherSpectrum(@TempDir Path dir) throws IOException {
        Path calibration = dir.resolve("calibration.json");
        assertEquals(0, CliTest.run("calibrate", lampSpectrum(dir, 12, false).toString(), "--lamp", "Ne I",
                "--out", calibration.toString()).code());
        Path other = lampSpectrum(dir, 13, false);
        CliTest.Run applied = CliTest.run("calibrate", other.toString(), "--apply", calibration.toString());
        assertEquals(0, applied.code(), applied.err());
        String[] lines = applied.out().split("\n");
        assertTrue(lines[0].equals("# ritzwerk-spectrum 1"), lines[0]);
        String[] pixel1000 = null;
        for (String line : lines) {
            if (line.startsWith("1000,")) {
                pixel1000 = line.split(",");
            }
        }
        assertEquals(truth(1000), Double.parseDouble(pixel1000[1]), 0.05 * 0.056);
        assertTrue(Double.parseDouble(pixel1000[2]) > 0);
        // A spectrum of another length is refused.
        Path shortFile = dir.resolve("short.csv");
        Files.writeString(shortFile, "counts\n1\n2\n3\n", StandardCharsets.UTF_8);
        CliTest.Run refused = CliTest.run("calibrate", shortFile.toString(), "--apply", calibration.toString());
        assertEquals(2, refused.code());
        assertTrue(refused.err().contains("has 3 pixels but"), refused.err());
    }

    @Test
    void saturatedPeaksAreFlaggedInEveryOutputAndLeftOutOfTheFit(@TempDir Path dir) throws IOException {
        Path spectrum = lampSpectrum(dir, 15, false);
        double max = java.util.Arrays.stream(org.ritzwerk.refdata.SpectrumFiles.read(spectrum).counts()).max()
                .orElseThrow();
        String level = String.valueOf(0.4 * max);
        CliTest.Run text = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--saturation", level);
        assertEquals(0, text.code(), text.err());
        assertTrue(text.out().contains("saturated, not fitted"), text.out());
        CliTest.Run csv = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--saturation", level,
                "--format", "csv");
        assertTrue(csv.out().contains(",false,saturated"), csv.out());
        Path file = dir.resolve("saturated.json");
        CliTest.Run json = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--saturation", level,
                "--out", file.toString());
        assertEquals(0, json.code(), json.err());
        String written = Files.readString(file);
        assertTrue(written.contains("\"saturated_lines\""), written);
        DispersionSolution solution = CalibrationFiles.read(file).solution();
        assertEquals(truth(1000), solution.wavelengthAt(1000), 0.05 * 0.056);
    }

    @Test
    void csvAndJsonForScripts(@TempDir Path dir) throws IOException {
        Path spectrum = lampSpectrum(dir, 15, false);
        CliTest.Run json = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--format", "json");
        assertEquals(0, json.code(), json.err());
        Path file = dir.resolve("from-stdout.json");
        Files.writeString(file, json.out());
        DispersionSolution solution = CalibrationFiles.read(file).solution();
        assertEquals(truth(1000), solution.wavelengthAt(1000), 0.05 * 0.056);
        CliTest.Run csv = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--format", "csv");
        assertEquals(0, csv.code(), csv.err());
        String[] rows = csv.out().split("\n");
        assertEquals("pixel,pixel_sigma,line,wavelength_nm,solution_nm,residual_nm,residual_pixels,used,flag", rows[0]);
        assertTrue(rows.length > 10, csv.out());
    }

    /**
     * A camera at 3.7 counts per photo-electron: the neon exposure's expected photo-electrons
     * (synth, which renders through the engine's forward model: enough for a test of the noise the
     * fits are told) times 20 (a longer exposure), Poisson and 4 electrons of read noise, then
     * counts = round(3.7 electrons), on no common step. Over 4 exposures (52 fitted pairs each way),
     * the fitted lines' pixels against the true pixels of their lines (the invented dispersion
     * above), in stated standard uncertainties: read as gain 1 (what the tool did before, here
     * forced with --gain 1) their RMS is 1.17 (when written; 2 of 52 beyond 3: in this scene the
     * pooled noise scale and the poor-fit scaling hide much of it), with the gain estimated 0.95
     * and with --gain 3.7 0.93, none beyond 3. Asked: gain 1 at least 1.1 times the estimate's RMS,
     * and with the estimate or the given gain at most 2 % beyond 3 (0.3 % for normal errors, common
     * practice) and an RMS from 0.75 to 1.25. The report's peak line and the saved calibration's
     * description say which gain was used and whence.
     */
    @Test
    void aDetectorsFractionalGainIsEstimatedOrGivenAndSaid(@TempDir Path dir) throws IOException {
        double[] expected = SpectrumFiles.read(lampSpectrum(dir, 31, false)).expectedCounts();
        for (int i = 0; i < expected.length; i++) {
            expected[i] *= 20; // a longer exposure: lines whose photon noise dominates their pixels
        }
        int[] beyond = new int[3];
        double[] squares = new double[3];
        int[] count = new int[3];
        String[][] options = {{"--gain", "1"}, {}, {"--gain", "3.7"}};
        for (long seed = 1; seed <= 4; seed++) {
            double[] electrons = new double[expected.length];
            org.ritzwerk.engine.synth.Noise.apply(expected, 4, seed, electrons);
            StringBuilder text = new StringBuilder("# ritzwerk-spectrum 1\ncounts\n");
            for (double e : electrons) {
                text.append((long) Math.rint(3.7 * e)).append('\n');
            }
            Path spectrum = dir.resolve("camera-" + seed + ".csv");
            Files.writeString(spectrum, text);
            for (int o = 0; o < options.length; o++) {
                List<String> args = new java.util.ArrayList<>(List.of("calibrate", spectrum.toString(), "--lamp",
                        "Ne I", "--format", "csv"));
                args.addAll(List.of(options[o]));
                CliTest.Run run = CliTest.run(args.toArray(new String[0]));
                assertEquals(0, run.code(), run.err());
                for (String row : run.out().split("\n")) {
                    String[] f = row.split(",");
                    if (f[0].equals("pixel") || !f[7].equals("true")) {
                        continue;
                    }
                    double z = (Double.parseDouble(f[0]) - truePixel(Double.parseDouble(f[3])))
                            / Double.parseDouble(f[1]);
                    beyond[o] += Math.abs(z) > 3 ? 1 : 0;
                    squares[o] += z * z;
                    count[o]++;
                }
            }
        }
        double[] rms = new double[3];
        for (int o = 0; o < 3; o++) {
            rms[o] = Math.sqrt(squares[o] / count[o]);
        }
        String what = java.util.Arrays.toString(beyond) + " beyond 3 of " + java.util.Arrays.toString(count)
                + ", RMS " + java.util.Arrays.toString(rms) + " (gain 1, estimated, given)";
        assertTrue(rms[0] > 1.1 * rms[1], "read as gain 1 they are stated too precise: " + what);
        for (int o = 1; o < 3; o++) {
            assertTrue(beyond[o] <= 0.02 * count[o] && rms[o] > 0.75 && rms[o] < 1.25, what);
        }
        Path spectrum = dir.resolve("camera-1.csv");
        Path out = dir.resolve("camera.json");
        CliTest.Run estimated = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--out",
                out.toString());
        assertEquals(0, estimated.code(), estimated.err());
        assertTrue(estimated.out().contains(" counts per photo-electron (estimated from "), estimated.out());
        String description = JsonMapper.builder().build().readTree(Files.readString(out)).get("description")
                .asString();
        assertTrue(description.contains(" counts per photo-electron (estimated from "), description);
        CliTest.Run given = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--gain", "3.7",
                "--read-noise", "20");
        assertEquals(0, given.code(), given.err());
        assertTrue(given.out().contains("gain 3.7 counts per photo-electron (given); read noise 20 counts (given)"),
                given.out());
    }

    /** Bad --gain and --read-noise values, and where they have no effect, are refused naming them. */
    @Test
    void badGainsAndReadNoisesAreRefused(@TempDir Path dir) throws IOException {
        Path spectrum = lampSpectrum(dir, 16, false);
        String[][] cases = {
            {"--gain", "0", "--gain must be counts per photo-electron above 0 and at most 1e6 (e.g. 3.7), got 0"},
            {"--gain", "NaN", "--gain must be counts per photo-electron above 0"},
            {"--gain", "-2", "--gain must be counts per photo-electron above 0"},
            {"--read-noise", "-1", "--read-noise must be counts RMS from 0 to 1e12 (e.g. 12), got -1"},
            {"--read-noise", "Infinity", "--read-noise must be counts RMS from 0 to 1e12"}};
        for (String[] c : cases) {
            CliTest.Run run = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", c[0], c[1]);
            assertEquals(2, run.code(), run.err());
            assertTrue(run.err().contains(c[2]), run.err());
        }
        CliTest.Run apply = CliTest.run("calibrate", spectrum.toString(), "--apply", spectrum.toString(), "--gain",
                "3.7");
        assertEquals(2, apply.code(), apply.err());
        assertTrue(apply.err().contains("--gain has no effect with --apply"), apply.err());
        Path withSigmas = dir.resolve("sigmas.csv");
        StringBuilder text = new StringBuilder("# ritzwerk-spectrum 1\ncounts,counts_sigma\n");
        for (double c : SpectrumFiles.read(spectrum).counts()) {
            text.append(c).append(',').append(Math.sqrt(Math.abs(c) + 16)).append('\n');
        }
        Files.writeString(withSigmas, text);
        CliTest.Run sigmas = CliTest.run("calibrate", withSigmas.toString(), "--lamp", "Ne I", "--read-noise", "4");
        assertEquals(2, sigmas.code(), sigmas.err());
        assertTrue(sigmas.err().contains("--read-noise has no effect with a spectrum that gives counts_sigma"),
                sigmas.err());
    }

    /** The pixel where the truth puts an air wavelength in nm, by Newton's method. */
    private static double truePixel(double nm) {
        double p = (nm - TRUTH[0]) / TRUTH[1];
        for (int i = 0; i < 50; i++) {
            p -= (truth(p) - nm) / (TRUTH[1] + 2 * TRUTH[2] * p);
        }
        return p;
    }

    /**
     * The report states the largest standard uncertainty between the first and last fitted line
     * (the library's Calibration.largestSigmaPixels); --required-precision below it refuses with
     * exit 2 and the figures and writes no file, above it changes nothing.
     */
    @Test
    void aRequiredPrecisionRefusesALessPreciseSolution(@TempDir Path dir) throws IOException {
        Path spectrum = lampSpectrum(dir, 11, false);
        CliTest.Run run = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I");
        assertEquals(0, run.code(), run.err());
        java.util.regex.Matcher m = java.util.regex.Pattern
                .compile("Largest stated uncertainty between those lines: ([0-9.eE+-]+) pixel").matcher(run.out());
        assertTrue(m.find(), run.out());
        double largest = Double.parseDouble(m.group(1));
        SpectrumFiles.Spectrum counts = SpectrumFiles.read(spectrum);
        LampSet neon = LampSet.of(List.of(DataRegistry.builtIn().lampLines(Species.parse("Ne I"))), Medium.air());
        Calibration job = Calibrator.defaults().calibrate(CalibrationProblem.builder(counts.counts()).lamp(neon)
                .build());
        assertEquals(job.largestSigmaPixels(), largest, largest * 5e-3);

        Path out = dir.resolve("calibration.json");
        CliTest.Run strict = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--required-precision",
                String.valueOf(largest / 2), "--out", out.toString());
        assertEquals(2, strict.code(), strict.err());
        assertTrue(strict.err().contains("stated standard uncertainty of") && strict.err().contains("above the required"),
                strict.err());
        assertFalse(Files.exists(out));
        CliTest.Run loose = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--required-precision",
                String.valueOf(largest * 2));
        assertEquals(0, loose.code(), loose.err());
        assertEquals(run.out(), loose.out());
        CliTest.Run bad = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--required-precision", "0");
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("--required-precision must be a standard uncertainty in pixels above 0"),
                bad.err());

        // The uncertainty ceiling (1 pixel by default) refuses on the stated uncertainty alone.
        CliTest.Run capped = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--uncertainty-ceiling",
                String.valueOf(largest / 2), "--out", out.toString());
        assertEquals(2, capped.code(), capped.err());
        assertTrue(capped.err().contains("raise the uncertainty ceiling"), capped.err());
        assertFalse(Files.exists(out));
        assertEquals(run.out(), CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I",
                "--uncertainty-ceiling", "1e6").out());
        CliTest.Run zero = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--uncertainty-ceiling",
                "0");
        assertEquals(2, zero.code());
        assertTrue(zero.err().contains("--uncertainty-ceiling must be a standard uncertainty in pixels above 0"),
                zero.err());
    }

    @Test
    void failuresSayWhatWentWrong(@TempDir Path dir) throws IOException {
        Path spectrum = lampSpectrum(dir, 14, false);
        // The wrong lamp: argon lines for a neon spectrum.
        CliTest.Run argon = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ar I");
        assertEquals(2, argon.code());
        assertTrue(argon.err().contains("calibrate:"), argon.err());
        // A prior that excludes the truth.
        CliTest.Run wrongRange = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I",
                "--dispersion-range", "0.2,0.5");
        assertEquals(2, wrongRange.code());
        assertTrue(wrongRange.err().contains("no solution within the prior"), wrongRange.err());
        // A dark frame: nothing to find.
        Path dark = dir.resolve("dark.csv");
        StringBuilder zeros = new StringBuilder("# ritzwerk-spectrum 1\ncounts\n");
        java.util.SplittableRandom random = new java.util.SplittableRandom(5);
        for (int p = 0; p < 512; p++) {
            zeros.append(100 + random.nextGaussian() * 3).append('\n');
        }
        Files.writeString(dark, zeros);
        CliTest.Run none = CliTest.run("calibrate", dark.toString(), "--lamp", "Ne I");
        assertEquals(2, none.code());
        assertTrue(none.err().toLowerCase().contains("peak"), none.err());
        // An all-saturated frame.
        Path flat = dir.resolve("flat.csv");
        Files.writeString(flat, "counts\n65535\n65535\n65535\n65535\n65535\n65535\n65535\n65535\n65535\n");
        CliTest.Run saturated = CliTest.run("calibrate", flat.toString(), "--lamp", "Ne I", "--saturation", "65535");
        assertEquals(2, saturated.code());
        assertTrue(saturated.err().contains("flat.csv"), saturated.err());
        // No lamp at all.
        assertTrue(CliTest.run("calibrate", spectrum.toString()).err().contains("give the lamp"));
        CliTest.Run strength = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--min-strength",
                "bright");
        assertEquals(2, strength.code());
        assertTrue(strength.err().contains("--min-strength: unknown strength 'bright'; known: strong, medium, weak"),
                strength.err());
        assertTrue(CliTest.run("calibrate", spectrum.toString(), "--lamp", "Xe II").err()
                .contains("no built-in lamp set or level list for Xe II"));
        // A fixed degree too low for a curved dispersion (the README's lamp: the slope falls by 9 %
        // across 4096 pixels) is named as the likely cause.
        Path curved = dir.resolve("curved.csv");
        assertEquals(0, CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "350,0.14,-1.5e-6", "--pixels",
                "4096", "--medium", "air", "--temperature", "300", "--resolving-power", "2000", "--read-noise", "5",
                "--seed", "21", "--out", curved.toString()).code());
        CliTest.Run straight = CliTest.run("calibrate", curved.toString(), "--lamp", "Ne I", "--degree", "1");
        assertEquals(2, straight.code(), straight.err());
        assertTrue(straight.err().contains("fixed degree-1 polynomial") && straight.err().contains("fix a higher one"),
                straight.err());
        // A fixed degree the pairs cannot carry is refused in the user's terms (it was an internal error).
        Path few = dir.resolve("few.csv");
        assertEquals(0, CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "700,0.06", "--pixels", "1024",
                "--medium", "air", "--temperature", "400", "--resolving-power", "4000", "--read-noise", "4",
                "--seed", "3", "--out", few.toString()).code());
        CliTest.Run high = CliTest.run("calibrate", few.toString(), "--lamp", "Ne I", "--degree", "9");
        assertEquals(2, high.code(), high.err());
        // 7 pairs since the neon set gained its 590-810 nm rows (2026-12-05; 6 before).
        assertTrue(high.err().contains("a degree-9 solution needs at least 11 paired lines; 7 were paired"),
                high.err());
        // Saturation that leaves too few unsaturated pairs for the degree keeps the saturated pairs in
        // the fit, flagged, instead of refusing a right pairing (a straight line through 4 pairs of a
        // curved dispersion was refused as a wrong pairing). Argon at 100,000 counts clipped at 20,000.
        Path bright = dir.resolve("bright.csv");
        assertEquals(0, CliTest.run("synth", "--lines", "lamp-ar-i", "--dispersion", "690,0.12,-1e-5", "--pixels",
                "2048", "--medium", "air", "--temperature", "300", "--resolving-power", "3000", "--peak-counts",
                "100000", "--read-noise", "5", "--seed", "4", "--out", bright.toString()).code());
        StringBuilder clipped = new StringBuilder();
        for (String row : Files.readAllLines(bright)) {
            String[] c = row.split(",");
            clipped.append(row.startsWith("#") || row.startsWith("wavelength") ? row
                    : c[0] + "," + c[1] + "," + Math.min(20_000, Double.parseDouble(c[2]))).append('\n');
        }
        Files.writeString(bright, clipped.toString());
        CliTest.Run clippedRun = CliTest.run("calibrate", bright.toString(), "--lamp", "Ar I", "--saturation",
                "20000");
        assertEquals(0, clippedRun.code(), clippedRun.err());
        assertTrue(clippedRun.out().contains(" saturated\n") && clippedRun.out().contains("kept in it: 15, since"
                + " without them too few pairs remain"), clippedRun.out());
        // A prior without a wavelength range says so instead of printing infinity.
        CliTest.Run falling = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--dispersion-range",
                "-0.2,-0.1");
        assertEquals(2, falling.code());
        assertTrue(falling.err().contains("(any wavelength, -0.200000 to -0.100000 nm/pixel)"), falling.err());
        assertTrue(!falling.err().contains("Infinity"), falling.err());
        // A range in a unit that is no wavelength the air model takes names the options.
        CliTest.Run hertz = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--from", "5 GHz", "--to",
                "10 GHz");
        assertEquals(2, hertz.code());
        assertTrue(hertz.err().contains("--from/--to (5 GHz to 10 GHz): "), hertz.err());
    }

    /**
     * The text report's lines carried a trailing space (a pair without a note, and the heading), and
     * a residual rounded to zero printed as "-0.00000" (a review's leftover). The README's lamp with
     * seed 4 had a pair (Ne I 650.65 nm) whose residual printed as -0.00000 nm and -0.0000 pixel; since
     * the neon set gained its 590-810 nm rows (2026-12-05) that pair is 0.00031 nm off, and seed 10's
     * Ne I 614.31 nm is the pair whose residual rounds to zero.
     */
    @Test
    void theTextReportHasNoTrailingSpaceAndNoSignedZero(@TempDir Path dir) throws IOException {
        Path lamp = dir.resolve("neon-4.csv");
        assertEquals(0, CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "350,0.14,-1.5e-6", "--pixels",
                "4096", "--medium", "air", "--temperature", "300", "--resolving-power", "2000", "--read-noise", "5",
                "--seed", "10", "--out", lamp.toString()).code());
        CliTest.Run run = CliTest.run("calibrate", lamp.toString(), "--lamp", "Ne I");
        assertEquals(0, run.code(), run.err());
        for (String line : run.out().split("\n", -1)) {
            assertFalse(line.endsWith(" "), "a trailing space: '" + line + "'");
            assertFalse(line.matches(".*-0\\.0+( .*)?"), "a signed zero: " + line);
        }
        assertTrue(run.out().contains("Ne I 614.30626 nm air             614.30626     0.00000    0.0000\n"),
                run.out());
    }

    /**
     * A prior whose --from lies above its --to was silently taken the other way round (a review's
     * leftover). --from is the lowest wavelength and --to the highest (the help and the README's
     * options table); which way wavelength runs across the detector is the sign of
     * --dispersion-range. So a reversed pair is refused naming both options and values, and a
     * falling dispersion is calibrated with the pair in order.
     */
    @Test
    void aPriorWhoseFromLiesAboveItsToIsRefused(@TempDir Path dir) throws IOException {
        Path falling = dir.resolve("falling.csv");
        assertEquals(0, CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "700,-0.06", "--pixels",
                String.valueOf(PIXELS), "--medium", "air", "--temperature", "400", "--resolving-power", "4000",
                "--read-noise", "4", "--seed", "5", "--out", falling.toString()).code());
        CliTest.Run reversed = CliTest.run("calibrate", falling.toString(), "--lamp", "Ne I", "--from", "720 nm",
                "--to", "560 nm", "--dispersion-range", "-0.07,-0.05");
        assertEquals(2, reversed.code(), reversed.out() + reversed.err());
        // (a wavelength without a medium is in vacuum; the prior is in the solution's medium, air)
        assertTrue(reversed.err().contains("--from 720 nm must lie below --to 560 nm in wavelength (here 719.802 nm"
                + " against 559.845 nm in air): --from is the lowest wavelength"), reversed.err());
        CliTest.Run same = CliTest.run("calibrate", falling.toString(), "--lamp", "Ne I", "--from", "600 nm", "--to",
                "600 nm");
        assertEquals(2, same.code(), same.out() + same.err());
        assertTrue(same.err().contains("--from 600 nm must lie below --to 600 nm"), same.err());
        // In frequency the order is the other way: 500 THz is the longer wavelength.
        CliTest.Run hertz = CliTest.run("calibrate", falling.toString(), "--lamp", "Ne I", "--from", "500 THz",
                "--to", "600 THz");
        assertEquals(2, hertz.code(), hertz.out() + hertz.err());
        assertTrue(hertz.err().contains("--from 500 THz must lie below --to 600 THz in wavelength (here 599.419 nm"
                + " against 499.515 nm in air)"), hertz.err());
        CliTest.Run ordered = CliTest.run("calibrate", falling.toString(), "--lamp", "Ne I", "--from", "560 nm",
                "--to", "720 nm", "--dispersion-range", "-0.07,-0.05");
        assertEquals(0, ordered.code(), ordered.err());
        assertTrue(ordered.out().contains("Solution: degree "), ordered.out());
    }

    @Test
    void outputsAreCheckedBeforeAnyWorkAndOldFilesSurviveAFailure(@TempDir Path dir) throws IOException {
        Path spectrum = lampSpectrum(dir, 13, false);
        byte[] original = Files.readAllBytes(spectrum);
        CliTest.Run overInput = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--out",
                spectrum.toString());
        assertEquals(2, overInput.code(), overInput.err());
        assertTrue(overInput.err().contains("--out") && overInput.err().contains("SPECTRUM_FILE"), overInput.err());
        assertArrayEquals(original, Files.readAllBytes(spectrum), "the input is untouched");

        Path same = dir.resolve("same.json");
        CliTest.Run twice = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--out", same.toString(),
                "--plot", same.toString());
        assertEquals(2, twice.code(), twice.err());
        assertTrue(twice.err().contains("--out") && twice.err().contains("--plot"), twice.err());
        assertTrue(Files.notExists(same));

        CliTest.Run noFolder = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--out",
                dir.resolve("no/such/folder/c.json").toString());
        assertEquals(2, noFolder.code(), noFolder.err());
        assertTrue(noFolder.err().contains("does not exist"), noFolder.err());

        // A calibration that fails (the argon list does not explain a neon lamp) leaves an old file as it was.
        Path keep = dir.resolve("keep.json");
        Files.writeString(keep, "precious", StandardCharsets.UTF_8);
        CliTest.Run fails = CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ar I", "--out", keep.toString(),
                "--plot", dir.resolve("keep.png").toString());
        assertEquals(2, fails.code(), fails.err());
        assertEquals("precious", Files.readString(keep));
        assertTrue(Files.notExists(dir.resolve("keep.png")));
        try (var files = Files.list(dir)) {
            assertTrue(files.noneMatch(f -> f.getFileName().toString().endsWith(".part")), "no temporary file left");
        }
    }
}
