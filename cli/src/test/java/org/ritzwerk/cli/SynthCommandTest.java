package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code ritzwerk synth} end to end, and its spectrum fed back to {@code identify}. */
class SynthCommandTest {

    private static double[][] columns(String csv) {
        List<double[]> rows = new ArrayList<>();
        for (String line : csv.split("\\R")) {
            if (line.startsWith("#") || line.startsWith("wavelength_nm") || line.isBlank()) {
                continue;
            }
            String[] cells = line.split(",");
            rows.add(new double[] {Double.parseDouble(cells[0]), Double.parseDouble(cells[1]),
                Double.parseDouble(cells[2])});
        }
        return rows.toArray(new double[0][]);
    }

    @Test
    void aSyntheticBalmerSpectrumIsIdentifiedAgain(@TempDir Path dir) throws IOException {
        CliTest.Run synth = CliTest.run("synth", "--species", "H I", "--from", "400 nm air", "--to", "700 nm air",
                "--medium", "air", "--temperature", "12000", "--resolving-power", "5000", "--pixels", "12000",
                "--read-noise", "3", "--seed", "5");
        assertEquals(0, synth.code(), synth.err());
        assertTrue(synth.out().startsWith("# ritzwerk-spectrum 1\n# axis: wavelength nm air"), synth.out());
        double[][] rows = columns(synth.out());
        assertEquals(12000, rows.length);
        // Peaks: local maxima of the noisy counts above 2 % of the brightest, centroided over +-4 pixels.
        double max = 0;
        for (double[] row : rows) {
            max = Math.max(max, row[2]);
        }
        StringBuilder peaks = new StringBuilder("# ritzwerk-peaks 1\n# id: synth-test\n# title: peaks of a synthetic "
                + "spectrum\n# source: ritzwerk synth\n# provenance: computed\n# version: 1\n# position-unit: nm\n"
                + "# medium: air\nposition,uncertainty,intensity\n");
        int found = 0;
        for (int p = 8; p < rows.length - 8; p++) {
            boolean localMax = rows[p][2] > 0.02 * max;
            for (int q = p - 8; q <= p + 8 && localMax; q++) {
                localMax = q == p || rows[q][2] < rows[p][2] || (rows[q][2] == rows[p][2] && q > p);
            }
            if (localMax) {
                double sum = 0;
                double moment = 0;
                for (int q = p - 4; q <= p + 4; q++) {
                    sum += rows[q][2];
                    moment += rows[q][2] * rows[q][0];
                }
                peaks.append(String.format(Locale.ROOT, "%.5f,0.005,%.1f%n", moment / sum, sum));
                found++;
            }
        }
        assertTrue(found >= 4, "peaks found: " + found);
        Path file = dir.resolve("peaks.csv");
        Files.writeString(file, peaks, StandardCharsets.UTF_8);
        CliTest.Run identify = CliTest.run("identify", file.toString(), "--species", "H I", "--tolerance", "0.02 nm");
        assertEquals(0, identify.code(), identify.err());
        for (String line : new String[] {"Balmer alpha", "Balmer beta", "Balmer gamma", "Balmer delta"}) {
            assertTrue(identify.out().contains(line), line + " in\n" + identify.out());
        }
        assertTrue(identify.out().contains(found + " peaks: " + found + " matched"), identify.out());
    }

    @Test
    void aLineListBeyondTheWholeFileReadersLimitsIsStreamed(@TempDir Path dir) throws IOException {
        // 1,000,000 weak invented Ne I lines 1e-4 nm apart from 500 nm, one more than the whole-file
        // reader takes, and one strong line at 550.00005 nm: the file is read as columns instead
        // of refused, and the strong line makes the brightest pixel.
        Path list = dir.resolve("million.csv");
        try (var w = Files.newBufferedWriter(list, StandardCharsets.UTF_8)) {
            w.write("# ritzwerk-lines 1\n# id: million\n# title: invented lines\n# source: invented for tests\n"
                    + "# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: vacuum\n"
                    + "species,position,intensity\n");
            for (int i = 0; i < 1_000_000; i++) {
                w.write(String.format(Locale.ROOT, "Ne I,%.4f,0.001%n", 500 + i * 1e-4));
            }
            w.write("Ne I,550.00005,1000000\n");
        }
        CliTest.Run run = CliTest.run("synth", "--lines", list.toString(), "--from", "549 nm", "--to", "551 nm",
                "--pixels", "400", "--temperature", "300", "--no-noise");
        assertEquals(0, run.code(), run.err());
        double[][] rows = columns(run.out());
        int brightest = 0;
        for (int p = 1; p < rows.length; p++) {
            brightest = rows[p][1] > rows[brightest][1] ? p : brightest;
        }
        assertEquals(550.00005, rows[brightest][0], 0.005, "pixel width 0.005 nm");
    }

    /** A window without lines says what to widen: --n-max only for ions (it was offered for a lamp list too). */
    @Test
    void anEmptyWindowSaysWhatToWiden(@TempDir Path dir) {
        CliTest.Run lamp = CliTest.run("synth", "--lines", "lamp-hg-i", "--dispersion", "700,0.01", "--pixels", "100",
                "--temperature", "300", "--out", dir.resolve("a.csv").toString());
        assertEquals(2, lamp.code());
        assertTrue(lamp.err().contains("widen the range (a line list brings only its own lines)")
                && !lamp.err().contains("--n-max"), lamp.err());
        CliTest.Run ion = CliTest.run("synth", "--species", "H I", "--from", "1000 nm", "--to", "1001 nm",
                "--temperature", "3000", "--n-max", "4", "--out", dir.resolve("b.csv").toString());
        assertEquals(2, ion.code());
        assertTrue(ion.err().contains("widen the range or raise --n-max"), ion.err());
    }

    @Test
    void sameSeedSameSpectrumAndTruthAddsUp(@TempDir Path dir) throws IOException {
        String[] args = {"synth", "--species", "H I", "--from", "650 nm", "--to", "660 nm", "--temperature", "8000",
            "--pixels", "500", "--seed", "11"};
        CliTest.Run one = CliTest.run(args);
        CliTest.Run two = CliTest.run(args);
        assertEquals(0, one.code(), one.err());
        assertEquals(one.out(), two.out());
        String[] other = args.clone();
        other[other.length - 1] = "12";
        assertNotEquals(one.out(), CliTest.run(other).out());

        Path truth = dir.resolve("lines.csv");
        CliTest.Run clean = CliTest.run("synth", "--species", "H I", "--from", "650 nm", "--to", "660 nm",
                "--temperature", "8000", "--pixels", "500", "--no-noise", "--truth", truth.toString());
        assertEquals(0, clean.code(), clean.err());
        double total = 0;
        for (double[] row : columns(clean.out())) {
            assertEquals(row[1], row[2], 0, "no noise: counts equal the expectation");
            total += row[1];
        }
        // The only line, H-alpha in vacuum at 656.47 nm, well inside: all its counts are in the pixels.
        List<String> lines = Files.readAllLines(truth, StandardCharsets.UTF_8);
        String last = lines.get(lines.size() - 1);
        assertTrue(last.endsWith("H I Balmer alpha"), last);
        assertEquals(Double.parseDouble(last.split(",")[1]), total, 1e-4 * total);
        // counts_in_pixels is the part the pixels hold: their sum, to the renderer's quadrature.
        assertEquals(Double.parseDouble(last.split(",")[2]), total, 1e-9 * total);
    }

    @Test
    void theRendererCanBeChosen() {
        String[] common = {"synth", "--species", "H I", "--from", "650 nm", "--to", "660 nm", "--temperature",
            "10000", "--no-noise", "--pixels", "500"};
        CliTest.Run auto = CliTest.run(common);
        CliTest.Run exact = CliTest.run(concat(common, "--renderer", "exact"));
        CliTest.Run fast = CliTest.run(concat(common, "--renderer", "fast"));
        assertEquals(0, fast.code(), fast.err());
        assertEquals(auto.out(), exact.out());
        assertNotEquals(exact.out(), fast.out());
        CliTest.Run bad = CliTest.run(concat(common, "--renderer", "quick"));
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("--renderer must be exact, fast or auto, got 'quick'"), bad.err());
    }

    @Test
    void clearErrors() {
        CliTest.Run grid = CliTest.run("synth", "--species", "H I", "--from", "650 nm", "--to", "660 nm",
                "--temperature", "8000", "--grid", "cubic");
        assertEquals(2, grid.code());
        assertTrue(grid.err().contains("--grid must be linear or log, got 'cubic'"), grid.err());
        CliTest.Run empty = CliTest.run("synth", "--species", "H I", "--from", "700 nm", "--to", "800 nm",
                "--temperature", "8000");
        assertEquals(2, empty.code());
        assertTrue(empty.err().contains("no line of H I falls between 700 nm and 800 nm"), empty.err());
        CliTest.Run water = CliTest.run("synth", "--species", "H I", "--from", "650 nm", "--to", "660 nm",
                "--temperature", "8000", "--medium", "water");
        assertTrue(water.err().contains("--medium must be vacuum or air, got 'water'"), water.err());
        assertTrue(CliTest.run("lines", "--species", "H I", "--from", "650 nm", "--to", "660 nm", "--medium", "water")
                .err().contains("--medium must be vacuum or air, got 'water'"));
        CliTest.Run cold = CliTest.run("synth", "--species", "H I", "--from", "650 nm", "--to", "660 nm",
                "--temperature", "-3");
        assertTrue(cold.err().contains("--temperature must be a temperature above 0 and below 1e9 K, got -3"), cold.err());
    }

    /**
     * --grid with --dispersion is named for what it is, whether or not --from/--to are given too
     * (and an explicit --grid linear counts: the polynomial places the pixels); --peak-counts says
     * it sets the lines' peak, a continuum on top; a bare wavelength on an air axis is noted as
     * read in vacuum, with the axis it gives (656.28 nm in vacuum is 656.0987 nm in standard air,
     * the 0.181 nm shift of the air model at that wavelength).
     */
    @Test
    void gridDispersionPeakCountsAndBareWavelengthsAreExplained() {
        for (String kind : new String[] {"log", "linear"}) {
            CliTest.Run run = CliTest.run("synth", "--lines", "lamp-ne-i", "--grid", kind, "--dispersion", "500,0.1",
                    "--temperature", "400");
            assertEquals(2, run.code(), run.err());
            assertTrue(run.err().contains("ritzwerk synth: --grid does not apply with --dispersion (its polynomial"
                    + " places the pixels)"), run.err());
            assertTrue(!run.err().contains("not both"), run.err());
        }
        CliTest.Run both = CliTest.run("synth", "--lines", "lamp-ne-i", "--grid", "log", "--dispersion", "500,0.1",
                "--from", "500 nm", "--to", "600 nm", "--temperature", "400");
        assertTrue(both.err().contains("give --dispersion or --from/--to, not both; --grid does not apply with"
                + " --dispersion"), both.err());
        String help = CliTest.run("synth", "--help").out().replaceAll("\\s+", " ");
        assertTrue(help.contains("Expected counts in the brightest pixel of the lines alone, before noise; a"
                + " continuum is added on top (its own brightest pixel at --continuum-counts), so a pixel may exceed"
                + " it."), help);
        CliTest.Run bare = CliTest.run("synth", "--species", "H I", "--from", "656.28nm", "--to", "660 nm air",
                "--medium", "air", "--temperature", "8000", "--pixels", "100", "--no-noise");
        assertEquals(0, bare.code(), bare.err());
        assertTrue(bare.err().contains("note: 656.28nm names no medium and is read as vacuum (as every wavelength"
                + " without one): the air axis runs from 656.0987"), bare.err());
        CliTest.Run stated = CliTest.run("synth", "--species", "H I", "--from", "656.28 nm vacuum", "--to",
                "660 nm air", "--medium", "air", "--temperature", "8000", "--pixels", "100", "--no-noise");
        assertEquals(0, stated.code(), stated.err());
        assertTrue(!stated.err().contains("names no medium"), stated.err());
    }

    @Test
    void velocityShiftsEveryLineByTheDopplerFactor(@TempDir Path dir) throws IOException {
        // lambda_observed = lambda sqrt((1 + v/c) / (1 - v/c)) (relativistic Doppler; common practice).
        Path rest = dir.resolve("rest.csv");
        Path moving = dir.resolve("moving.csv");
        String[] common = {"synth", "--species", "H I", "--from", "600 nm", "--to", "700 nm", "--temperature", "8000",
            "--no-noise"};
        assertEquals(0, CliTest.run(concat(common, "--truth", rest.toString())).code());
        CliTest.Run run = CliTest.run(concat(common, "--truth", moving.toString(), "--velocity", "-1500",
                "--collisional-width", "0.05"));
        assertEquals(0, run.code(), run.err());
        double beta = -1500e3 / 299_792_458.0;
        double restNm = Double.parseDouble(lastRow(rest)[0]);
        double movingNm = Double.parseDouble(lastRow(moving)[0]);
        assertEquals(restNm * Math.sqrt((1 + beta) / (1 - beta)), movingNm, 1e-9 * restNm);
        assertTrue(run.out().contains("# velocity-km-s: -1500.0\n# collisional-fwhm-nm: 0.05\n"), run.out());
        assertTrue(CliTest.run(concat(common, "--velocity", "40000")).err()
                .contains("--velocity must be a line-of-sight speed in km/s below a tenth of the speed of light"));
    }

    @Test
    void jsonPlotAndPlasmaOptionsWorkTogether(@TempDir Path dir) throws IOException {
        Path png = dir.resolve("scene.png");
        CliTest.Run run = CliTest.run("synth", "--species", "H I,He II", "--from", "440 nm", "--to", "500 nm",
                "--temperature", "25000", "--electron-density", "1e22", "--abundance", "He=0.1", "--pixels", "3000",
                "--continuum", "blackbody", "--continuum-counts", "50", "--format", "json", "--plot", png.toString(),
                "--seed", "3", "--threads", "2");
        assertEquals(0, run.code(), run.err());
        tools.jackson.databind.JsonNode root = tools.jackson.databind.json.JsonMapper.builder().build()
                .readTree(run.out());
        assertEquals("ritzwerk-spectrum", root.get("format").asString());
        assertEquals(3000, root.get("counts").size());
        assertEquals(3001, root.get("pixel_edges_nm").size());
        assertEquals(1e22, root.get("scene").get("electron-density-m3").asDouble());
        // H-beta carries its Stark width, 4.8 nm (1e22 / 1e23)^0.68116 = 1.0002 nm (Gigosos et al. 2003),
        // written in the axis medium (vacuum here, so as is).
        boolean beta = false;
        for (tools.jackson.databind.JsonNode line : root.get("lines")) {
            if (line.get("line").asString().equals("H I Balmer beta")) {
                assertEquals(1.0002, line.get("lorentz_fwhm_nm").asDouble(), 1e-4);
                beta = true;
            }
        }
        assertTrue(beta);
        // The continuum's brightest pixel, the bluest, expects 50 counts plus the Stark-broadened
        // wing of H-gamma (434 nm), a few counts.
        double bluest = root.get("expected_counts").get(0).asDouble();
        assertTrue(bluest > 50 && bluest < 55, "bluest pixel " + bluest);
        byte[] head = Arrays.copyOf(Files.readAllBytes(png), 8);
        assertEquals("\u0089PNG", new String(head, 0, 4, StandardCharsets.ISO_8859_1));
        // A logarithmic counts axis; the option means nothing without a plot.
        Path log = dir.resolve("log.png");
        CliTest.Run logRun = CliTest.run("synth", "--species", "H I", "--from", "440 nm", "--to", "500 nm",
                "--temperature", "25000", "--pixels", "300", "--plot", log.toString(), "--plot-scale", "log",
                "--out", dir.resolve("log.csv").toString());
        assertEquals(0, logRun.code(), logRun.err());
        assertEquals("\u0089PNG", new String(Files.readAllBytes(log), 0, 4, StandardCharsets.ISO_8859_1));
        CliTest.Run noPlot = CliTest.run("synth", "--species", "H I", "--from", "440 nm", "--to", "500 nm",
                "--temperature", "25000", "--plot-scale", "log");
        assertEquals(2, noPlot.code(), noPlot.err());
        assertEquals("ritzwerk synth: --plot-scale has no effect without --plot", noPlot.err().strip());
        assertTrue(CliTest.run("synth", "--species", "H I", "--from", "440 nm", "--to", "500 nm", "--temperature",
                "25000", "--plot", log.toString(), "--plot-scale", "ln").err().contains("--plot-scale must be linear or log"));
    }

    @Test
    void aContinuumFileOfYourOwn(@TempDir Path dir) throws IOException {
        Path shape = dir.resolve("shape.csv");
        Files.writeString(shape, "# a ramp\nwavelength_nm,density\n600,0\n700,10\n");
        CliTest.Run run = CliTest.run("synth", "--species", "H I", "--from", "640 nm", "--to", "700 nm",
                "--temperature", "8000", "--continuum-file", shape.toString(), "--continuum-counts", "30",
                "--no-noise", "--pixels", "600");
        assertEquals(0, run.code(), run.err());
        double[][] rows = columns(run.out());
        // The ramp's last pixel is its brightest: 30 counts, and no line reaches it.
        assertEquals(30, rows[rows.length - 1][1], 1e-6);
        Files.writeString(shape, "wavelength_nm,density\n600,0\n650,x\n");
        CliTest.Run bad = CliTest.run("synth", "--species", "H I", "--from", "640 nm", "--to", "700 nm",
                "--temperature", "8000", "--continuum-file", shape.toString());
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("shape.csv:3: density must be a finite number, got 'x'"), bad.err());
        // Every bad row is named, not only the first.
        Files.writeString(shape, "wavelength_nm,density\n600,0\n650,x\n660,-1\n670\n680,1\n");
        CliTest.Run several = CliTest.run("synth", "--species", "H I", "--from", "640 nm", "--to", "700 nm",
                "--temperature", "8000", "--continuum-file", shape.toString());
        assertEquals(2, several.code());
        assertTrue(several.err().contains("3 problems in"), several.err());
        assertTrue(several.err().contains("shape.csv:3: density must be a finite number, got 'x'"), several.err());
        assertTrue(several.err().contains("shape.csv:4: density must not be negative, got -1"), several.err());
        assertTrue(several.err().contains("shape.csv:5: expected 2 fields (wavelength_nm,density), got 1"),
                several.err());
        Files.writeString(shape, "wavelength_nm,density\n600,0\n650,1\n");
        CliTest.Run shortFile = CliTest.run("synth", "--species", "H I", "--from", "640 nm", "--to", "700 nm",
                "--temperature", "8000", "--continuum-file", shape.toString());
        assertTrue(shortFile.err().contains("covers 600.0 to 650.0 nm but the spectrum spans"), shortFile.err());
    }

    @Test
    void plasmaOptionErrorsNameTheOption() {
        String[] common = {"synth", "--species", "H I", "--from", "640 nm", "--to", "670 nm", "--temperature", "8000"};
        assertTrue(CliTest.run(concat(common, "--abundance", "Xq=2")).err()
                .contains("--abundance: unknown element 'Xq'"));
        assertTrue(CliTest.run(concat(common, "--abundance", "He=0.1")).err()
                .contains("--abundance names He, which is not among --species"));
        assertTrue(CliTest.run(concat(common, "--electron-density", "1e30")).err()
                .contains("--electron-density must be a density above 0 and at most 1e25 per cubic metre"));
        assertTrue(CliTest.run(concat(common, "--natural-widths", "--n-max", "100")).err()
                .contains("lower --n-max (100)"));
        assertTrue(CliTest.run(concat(common, "--format", "xml")).err().contains("--format must be csv or json"));
        CliTest.Run low = CliTest.run(concat(common, "--electron-density", "1e17", "--no-noise"));
        assertEquals(0, low.code());
        assertTrue(low.err().contains("note: electron density 1.0E17 m^-3 is below the Balmer Stark fit's range"),
                low.err());
    }

    @Test
    void aDispersionReachingZeroWavelengthIsBadInputNotABug() {
        // -5 + p nm: the first pixel's edge (p = -0.5) is at -5.5 nm.
        CliTest.Run run = CliTest.run("synth", "--species", "H", "--dispersion", "-5,1", "--pixels", "100",
                "--temperature", "9000");
        assertEquals(2, run.code(), run.err());
        assertEquals("ritzwerk synth: --dispersion: the wavelength must be above 0 nm on every pixel, but the first"
                + " pixel's edge is at -5.5 nm", run.err().strip());
    }

    @Test
    void aLampSeenThroughADispersionPolynomial() {
        // Ne I 585.24879 nm air (lamp-ne-i, Sansonetti & Martin 2005) lands where the polynomial
        // 540 + 0.06 p - 2e-6 p^2 reaches it: p = 862.16 (solved by hand below).
        CliTest.Run run = CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "540,0.06,-2e-6",
                "--pixels", "2048", "--medium", "air", "--temperature", "400", "--resolving-power", "4000",
                "--no-noise");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("# axis: wavelength nm air (pixel centres; dispersion 540,0.06,-2e-6"), run.out());
        double[][] rows = columns(run.out());
        assertEquals(2048, rows.length);
        double a = -2e-6;
        double b = 0.06;
        double c = 540 - 585.24879;
        double expected = (-b + Math.sqrt(b * b - 4 * a * c)) / (2 * a);
        expected = expected > 0 && expected < 2048 ? expected : (-b - Math.sqrt(b * b - 4 * a * c)) / (2 * a);
        int top = (int) Math.round(expected);
        double sum = 0;
        double moment = 0;
        for (int p = top - 6; p <= top + 6; p++) {
            sum += rows[p][1];
            moment += rows[p][1] * p;
        }
        // The centroid of a symmetric line in a gently curved dispersion: within 0.02 pixel.
        assertEquals(expected, moment / sum, 0.02);
        assertTrue(CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "540,0.06", "--from", "500 nm",
                "--temperature", "400").err().contains("give --dispersion or --from/--to, not both"));
        assertTrue(CliTest.run("synth", "--from", "500 nm", "--to", "600 nm", "--temperature", "400").err()
                .contains("give --species (one-electron ions, alkali atoms), --lines (line lists), or both"));
        assertTrue(CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "540,x", "--temperature", "400").err()
                .contains("--dispersion: coefficient c1 'x' is not a number"));
    }

    /**
     * A spectrometer that reads red first: 660 - 0.06 p - 2e-6 p^2 falls across the chip, the
     * rows follow the pixels, and Ne I 585.24879 nm air (lamp-ne-i, Sansonetti & Martin 2005)
     * lands where the polynomial reaches it, p = 1014.34 (solved by hand below). A polynomial that
     * turns on the chip is refused, naming where.
     */
    @Test
    void aFallingDispersionKeepsThePixelsInTheDetectorsOrder() {
        CliTest.Run run = CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "660,-0.06,-2e-6",
                "--pixels", "2048", "--medium", "air", "--temperature", "400", "--resolving-power", "4000",
                "--no-noise");
        assertEquals(0, run.code(), run.err());
        double[][] rows = columns(run.out());
        assertEquals(2048, rows.length);
        // The mean of the edges at p -+ 1/2 lies c2 / 4 = -5e-7 nm from the polynomial's value.
        assertEquals(660 - 5e-7, rows[0][0], 1e-12);
        for (int p = 1; p < rows.length; p++) {
            assertTrue(rows[p][0] < rows[p - 1][0], "row " + p);
        }
        double a = -2e-6;
        double b = -0.06;
        double c = 660 - 585.24879;
        double expected = (-b - Math.sqrt(b * b - 4 * a * c)) / (2 * a);
        int top = (int) Math.round(expected);
        double sum = 0;
        double moment = 0;
        for (int p = top - 6; p <= top + 6; p++) {
            sum += rows[p][1];
            moment += rows[p][1] * p;
        }
        assertEquals(expected, moment / sum, 0.02);
        CliTest.Run turning = CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "600,0.05,-1e-4",
                "--pixels", "1000", "--temperature", "400");
        assertEquals(2, turning.code(), turning.err());
        assertTrue(turning.err().contains("--dispersion: pixel edges must rise or fall throughout: edge 251 ("),
                turning.err());
    }

    /**
     * A lamp list beside a plasma is scaled to the strongest ion line as drawn: with a density
     * the Saha balance leaves little H I at 20,000 K, and the neon list must follow it (it was
     * scaled to un-ionised hydrogen, 553 times brighter than the H-alpha drawn).
     */
    @Test
    void aLineListBesideIonsMatchesTheStrongestIonLineAsDrawn(@TempDir Path dir) throws IOException {
        Path truth = dir.resolve("t.csv");
        CliTest.Run run = CliTest.run("synth", "--species", "H I", "--lines", "lamp-ne-i", "--from", "580 nm air",
                "--to", "700 nm air", "--medium", "air", "--temperature", "20000", "--electron-density", "1e21",
                "--no-noise", "--truth", truth.toString(), "--out", dir.resolve("s.csv").toString());
        assertEquals(0, run.code(), run.err());
        double hydrogen = 0;
        double neon = 0;
        for (String row : Files.readAllLines(truth, StandardCharsets.UTF_8)) {
            if (row.startsWith("#") || row.startsWith("wavelength_nm")) {
                continue;
            }
            String[] c = row.split(",");
            double counts = Double.parseDouble(c[1]);
            if (c[c.length - 1].startsWith("H I")) {
                hydrogen = Math.max(hydrogen, counts);
            } else if (c[c.length - 1].startsWith("Ne I")) {
                neon = Math.max(neon, counts);
            }
        }
        assertTrue(hydrogen > 0 && neon > 0, hydrogen + " " + neon);
        assertEquals(hydrogen, neon, 1e-9 * hydrogen);
    }

    /**
     * A scene whose one-electron lines would take days (the exact radial integrals of every pair
     * of shells up to n = 2000) is refused with the estimate, as lines and identify refuse them;
     * one of about ten seconds starts with a note.
     */
    @Test
    void aSceneOfDaysIsRefusedWithItsEstimate() {
        CliTest.Run run = CliTest.run("synth", "--species", "H", "--from", "100000 nm", "--to", "1e7 nm",
                "--temperature", "9e8", "--n-max", "2000", "--pixels", "100");
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains("the lines of the one-electron ions up to n = 2000 would take about"),
                run.err());
    }

    /**
     * A dense plasma's notes: Stark widths only for H-alpha and H-beta, the Balmer lines above
     * the Inglis-Teller limit (n = 8 at 3e22 m^-3: log10 3e16 = 16.48 = 23.26 - 7.5 log10 n, the
     * relation from memory) drawn as separate lines up to the last bound level, and no line from
     * above the ionisation limit lowered by Debye screening (0.0256 eV at 20,000 K: n = 23 for H,
     * 13.6 eV / 23^2 &gt; 0.0256 eV &gt; 13.6 eV / 24^2; IonisationBalanceTest's golden file).
     */
    @Test
    void aDensePlasmaSaysWhatItDrawsWithoutStarkWidths() {
        CliTest.Run run = CliTest.run("synth", "--species", "H I,He II", "--from", "380 nm", "--to", "700 nm",
                "--temperature", "20000", "--electron-density", "3e22", "--no-noise");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.err().contains("note: Stark widths are drawn for H-alpha and H-beta of hydrogen and deuterium"
                + " only (the fits cover those); H-gamma and higher and the He II lines are drawn without"), run.err());
        // without He II the note does not name its lines
        CliTest.Run hydrogen = CliTest.run("synth", "--species", "H I", "--from", "380 nm", "--to", "700 nm",
                "--temperature", "20000", "--electron-density", "3e22", "--no-noise");
        assertTrue(hydrogen.err().contains("(the fits cover those); H-gamma and higher are drawn without")
                && !hydrogen.err().contains("He II"), hydrogen.err());
        assertTrue(run.err().contains("note: at this density the Balmer lines above n = 8 merge into a continuum"
                + " (Inglis-Teller); they are drawn as separate lines up to n = 23"), run.err());
        assertTrue(run.err().contains("note: H I: levels above n = 23 lie above the ionisation limit lowered by the"
                + " plasma (Debye screening, by 0.0256 eV); their lines are not drawn (nMax 30)"), run.err());
    }

    /**
     * --components draws H-alpha as its seven fine-structure components (the lines command lists
     * the same seven between 656.45 and 656.48 nm vacuum); without one-electron ions it is refused.
     */
    @Test
    void componentsDrawTheFineStructure(@TempDir Path dir) throws IOException {
        Path truth = dir.resolve("t.csv");
        CliTest.Run run = CliTest.run("synth", "--species", "H I", "--from", "656.3 nm", "--to", "656.6 nm",
                "--temperature", "1000", "--resolving-power", "1e7", "--no-noise", "--pixels", "300", "--components",
                "--truth", truth.toString(), "--out", dir.resolve("s.csv").toString());
        assertEquals(0, run.code(), run.err());
        List<String> rows = Files.readAllLines(truth, StandardCharsets.UTF_8).stream()
                .filter(r -> r.startsWith("656.")).toList();
        assertEquals(7, rows.size(), rows.toString());
        assertTrue(rows.stream().anyMatch(r -> r.endsWith(",H I 3d 2D5/2 - 2p 2P3/2")), rows.toString());
        assertTrue(Files.readString(dir.resolve("s.csv")).contains("# fine-structure: components\n"));
        assertTrue(CliTest.run("synth", "--lines", "lamp-ne-i", "--from", "600 nm", "--to", "700 nm",
                "--temperature", "400", "--components").err().contains("--components has no effect without a"
                        + " one-electron ion in --species"));
        // A --lines name that looks like a file is reported as a missing file, not an unknown data set.
        assertTrue(CliTest.run("synth", "--lines", "nosuch.csv", "--from", "600 nm", "--to", "700 nm",
                "--temperature", "400").err().contains("--lines nosuch.csv: no such file"));
    }

    /**
     * --lines entries that put no light in the spectrum are each named with their own cause: an
     * entry without an intensity (left out), an intensity of 0, and one so faint beside the
     * strongest (1e-308 beside 1e308) that its counts underflow; with and without --species. None
     * is blamed on Boltzmann populations (a line list has none), and none goes unmentioned.
     */
    @Test
    void linesWithoutLightAreNamedWithTheirCause(@TempDir Path dir) throws IOException {
        String head = "# ritzwerk-lines 1\n# id: dark\n# title: t\n# source: s\n# provenance: computed\n# version: 1\n"
                + "# position-unit: nm\n# medium: vacuum\nspecies,position,intensity\n";
        Path list = dir.resolve("dark.csv");
        Files.writeString(list, head + "Ar I,501.0,1e308\nAr I,520.0,\nAr I,540.0,0\nAr I,560.0,1e-308\n");
        for (boolean ions : new boolean[] {false, true}) {
            List<String> args = new ArrayList<>(List.of("synth", "--lines", list.toString(), "--from", "500nm", "--to",
                    "600nm", "--pixels", "2000", "--temperature", "300", "--no-noise", "--out",
                    dir.resolve("s.csv").toString()));
            if (ions) {
                args.addAll(List.of("--species", "H"));
            }
            CliTest.Run run = CliTest.run(args.toArray(String[]::new));
            assertEquals(0, run.code(), run.err());
            assertTrue(run.err().contains("note: line list dark: 1 line between the grid's ends gives no intensity and"
                    + " is left out (Ar I 520.0 nm vacuum)"), run.err());
            if (ions) {
                // scaled to the ions' reference rate, an intensity of 0 and one that vanishes in the
                // scaling are one case (the note names both causes)
                assertTrue(run.err().contains("note: 2 of the 3 lines inside the range carry no light (Ar I 540.0 nm"
                        + " vacuum, Ar I 560.0 nm vacuum): their --lines intensity is 0 (or so small beside the"
                        + " list's strongest line that it vanishes"), run.err());
            } else {
                assertTrue(run.err().contains("note: 1 of the 3 lines inside the range carries no light (Ar I 540.0"
                        + " nm vacuum): their --lines intensity is 0"), run.err());
                assertTrue(run.err().contains("note: 1 of the 3 lines inside the range carries no light (Ar I 560.0"
                        + " nm vacuum): their --lines intensities are so small beside the brightest line's"), run.err());
            }
            assertTrue(!run.err().contains("Boltzmann"), run.err());
        }
        // Only entries of intensity 0 on the grid: the run fails, saying so.
        Files.writeString(list, head + "Ar I,540.0,0\nAr I,700.0,1\n");
        CliTest.Run dark = CliTest.run("synth", "--lines", list.toString(), "--from", "500nm", "--to", "600nm",
                "--temperature", "300", "--no-noise");
        assertEquals(2, dark.code(), dark.err());
        assertTrue(dark.err().contains("1 line(s) of " + list + " fall between 500nm and 600nm, but none carries any"
                + " light: 1 of the 1 lines inside the range carries no light (Ar I 540.0 nm vacuum): their --lines"
                + " intensity is 0"), dark.err());
    }

    /** Noise from the default seed is noted: spectra made in bulk without --seed would share it. */
    @Test
    void theDefaultSeedIsNoted() {
        CliTest.Run plain = CliTest.run("synth", "--species", "H", "--from", "400 nm", "--to", "700 nm",
                "--temperature", "9000", "--pixels", "200");
        assertEquals(0, plain.code(), plain.err());
        assertTrue(plain.err().contains("note: the noise is drawn from the default --seed 1; spectra made without"
                + " --seed share their noise"), plain.err());
        CliTest.Run seeded = CliTest.run("synth", "--species", "H", "--from", "400 nm", "--to", "700 nm",
                "--temperature", "9000", "--pixels", "200", "--seed", "1");
        assertEquals(0, seeded.code(), seeded.err());
        assertTrue(!seeded.err().contains("--seed"), seeded.err());
    }

    /** Abundances a double cannot carry through the photon rates are bad input, not an internal error. */
    @Test
    void anAbundanceBeyondWhatTheRatesCarryIsRefused() {
        for (String value : new String[] {"1e-320", "1e200"}) {
            CliTest.Run run = CliTest.run("synth", "--species", "H", "--from", "400 nm", "--to", "700 nm",
                    "--temperature", "9000", "--abundance", "H=" + value);
            assertEquals(2, run.code(), run.err());
            assertTrue(run.err().contains("--abundance of H must be 1e-100 to 1e100 (relative to 1 for each other"
                    + " element)"), run.err());
        }
    }

    @Test
    void alkaliAtomsShineByBoltzmannsLaw(@TempDir Path dir) throws IOException {
        // D2 over D1 of Rb: (g A)_D2 / (g A)_D1 exp(-(E_D2 - E_D1) / kT), both from the library's
        // model; at 2000 K about 1.77 (common practice: optically thin Boltzmann populations).
        Path truth = dir.resolve("rb.csv");
        CliTest.Run run = CliTest.run("synth", "--species", "Rb-87 I", "--from", "770 nm", "--to", "800 nm",
                "--temperature", "2000", "--no-noise", "--truth", truth.toString());
        assertEquals(0, run.code(), run.err());
        double d2 = Double.NaN;
        double d1 = Double.NaN;
        for (String row : Files.readAllLines(truth, StandardCharsets.UTF_8)) {
            if (row.endsWith("5p 2P3/2 - 5s 2S1/2")) {
                d2 = Double.parseDouble(row.split(",")[1]);
            } else if (row.endsWith("5p 2P1/2 - 5s 2S1/2")) {
                d1 = Double.parseDouble(row.split(",")[1]);
            }
        }
        // the command's atom is the data context's, with the published resonance-line elements
        org.ritzwerk.engine.rydberg.AlkaliAtom rb = org.ritzwerk.refdata.DataContext.builtIn()
                .alkaliAtom(org.ritzwerk.atom.Species.parse("Rb-87 I"));
        org.ritzwerk.atom.State g = org.ritzwerk.atom.State.parse("5s1/2");
        org.ritzwerk.atom.State p1 = org.ritzwerk.atom.State.parse("5p1/2");
        org.ritzwerk.atom.State p3 = org.ritzwerk.atom.State.parse("5p3/2");
        double kT = 1.380649e-23 * 2000;
        double hcPerCm = 6.62607015e-34 * 299_792_458.0 * 100;
        double expected = 4 * rb.einsteinA(p3, g) / (2 * rb.einsteinA(p1, g))
                * Math.exp(-(rb.energyPerCm(p3) - rb.energyPerCm(p1)) * hcPerCm / kT);
        assertEquals(expected, d2 / d1, 1e-4 * expected);
    }

    private static final String[] SCENE = {"synth", "--species", "H I", "--from", "650 nm", "--to", "660 nm",
        "--temperature", "8000", "--pixels", "200", "--no-noise"};

    private static List<String> folder(Path dir) throws IOException {
        try (var files = Files.list(dir)) {
            return files.map(f -> f.getFileName().toString()).sorted().toList();
        }
    }

    @Test
    void twoOutputsOnOneFileAreRefusedBeforeAnyWork(@TempDir Path dir) throws IOException {
        Path a = dir.resolve("a.csv");
        Files.writeString(a, "precious\n");
        CliTest.Run run = CliTest.run(concat(SCENE, "--out", a.toString(), "--truth", a.toString()));
        assertEquals(2, run.code());
        assertEquals("ritzwerk synth: --out and --truth name the same file: " + a + "; give each output its own file",
                run.err().strip());
        assertEquals("precious\n", Files.readString(a));
        // The same file by another spelling, and the plot.
        CliTest.Run other = CliTest.run(concat(SCENE, "--truth", a.toString(), "--plot",
                dir.resolve(".").resolve("a.csv").toString()));
        assertEquals(2, other.code());
        assertTrue(other.err().contains("--truth and --plot name the same file"), other.err());
        assertEquals("precious\n", Files.readString(a));
        assertEquals(List.of("a.csv"), folder(dir));
    }

    @Test
    void anOutputThatIsAnInputIsRefused(@TempDir Path dir) throws IOException {
        Path shape = dir.resolve("shape.csv");
        String ramp = "wavelength_nm,density\n600,0\n700,10\n";
        Files.writeString(shape, ramp);
        CliTest.Run continuum = CliTest.run(concat(SCENE, "--continuum-file", shape.toString(), "--out",
                shape.toString()));
        assertEquals(2, continuum.code());
        assertEquals("ritzwerk synth: --out " + shape + " is the input given with --continuum-file; writing it would"
                + " destroy the input", continuum.err().strip());
        assertEquals(ramp, Files.readString(shape));
        Path list = dir.resolve("my-lines.csv");
        String lines = "# ritzwerk-lines 1\n# id: my-lines\n# title: two invented lines\n# source: invented for tests\n"
                + "# provenance: measured\n# version: 1\n# kind: lamp-lines\n# position-unit: nm\n# medium: vacuum\n"
                + "species,position,intensity\nNe I,652,100\nNe I,655,50\n";
        Files.writeString(list, lines);
        CliTest.Run truth = CliTest.run(concat(SCENE, "--lines", list.toString(), "--truth", list.toString()));
        assertEquals(2, truth.code());
        assertTrue(truth.err().contains("--truth " + list + " is the input given with --lines"), truth.err());
        CliTest.Run plot = CliTest.run(concat(SCENE, "--data", list.toString(), "--plot", list.toString()));
        assertEquals(2, plot.code());
        assertTrue(plot.err().contains("--plot " + list + " is the input given with --data"), plot.err());
        assertEquals(lines, Files.readString(list));
        // Given as a data set, not as an output, the same file draws its lines.
        assertEquals(0, CliTest.run(concat(SCENE, "--lines", list.toString(), "--out",
                dir.resolve("s.csv").toString())).code());
    }

    @Test
    void anUnwritableOutputIsRefusedBeforeTheOthersAreTouched(@TempDir Path dir) throws IOException {
        Path keep = dir.resolve("keep.csv");
        Files.writeString(keep, "precious\n");
        String missing = dir.resolve("no-such-folder").resolve("t.csv").toString();
        CliTest.Run run = CliTest.run(concat(SCENE, "--out", keep.toString(), "--truth", missing));
        assertEquals(2, run.code());
        assertEquals("ritzwerk synth: --truth " + missing + ": the folder " + dir.resolve("no-such-folder")
                + " does not exist", run.err().strip());
        assertEquals("precious\n", Files.readString(keep));
        CliTest.Run folderAsFile = CliTest.run(concat(SCENE, "--out", keep.toString(), "--plot", dir.toString()));
        assertEquals(2, folderAsFile.code());
        assertTrue(folderAsFile.err().contains("--plot " + dir + ": is a folder, not a file"), folderAsFile.err());
        if (Files.isDirectory(Path.of("/proc/self"))) {
            // A folder nobody can create files in, not even root.
            CliTest.Run locked = CliTest.run(concat(SCENE, "--out", keep.toString(), "--truth", "/proc/t.csv"));
            assertEquals(2, locked.code());
            assertTrue(locked.err().startsWith("ritzwerk synth: --truth /proc/t.csv: cannot write in the folder /proc ("),
                    locked.err());
        }
        assertEquals("precious\n", Files.readString(keep));
        assertEquals(List.of("keep.csv"), folder(dir));
    }

    @Test
    void aFailingRunLeavesThePreviousFilesAsTheyWere(@TempDir Path dir) throws IOException {
        Path keep = dir.resolve("keep.csv");
        Path truth = dir.resolve("truth.csv");
        Files.writeString(keep, "precious\n");
        Files.writeString(truth, "also precious\n");
        // Passes the checks, then fails while rendering: no line of H I between 700 and 800 nm.
        CliTest.Run run = CliTest.run("synth", "--species", "H I", "--from", "700 nm", "--to", "800 nm",
                "--temperature", "8000", "--out", keep.toString(), "--truth", truth.toString());
        assertEquals(2, run.code());
        assertEquals("precious\n", Files.readString(keep));
        assertEquals("also precious\n", Files.readString(truth));
        assertEquals(List.of("keep.csv", "truth.csv"), folder(dir));
        // A run that succeeds replaces both and leaves no temporary file.
        assertEquals(0, CliTest.run(concat(SCENE, "--out", keep.toString(), "--truth", truth.toString())).code());
        assertTrue(Files.readString(keep).startsWith("# ritzwerk-spectrum 1\n"));
        assertTrue(Files.readString(truth).startsWith("# ritzwerk-spectrum-lines 1\n# medium: vacuum\n"));
        assertEquals(List.of("keep.csv", "truth.csv"), folder(dir));
    }

    @Test
    void everyOutputReadsBackWithTheLibrarysReaders(@TempDir Path dir) throws IOException {
        Path csv = dir.resolve("s.csv");
        Path json = dir.resolve("s.json");
        Path truth = dir.resolve("t.csv");
        String[] scene = {"synth", "--species", "H I", "--from", "640 nm air", "--to", "670 nm air", "--medium", "air",
            "--temperature", "9000", "--pixels", "300", "--read-noise", "2", "--seed", "4"};
        assertEquals(0, CliTest.run(concat(scene, "--out", csv.toString(), "--truth", truth.toString())).code());
        assertEquals(0, CliTest.run(concat(scene, "--out", json.toString(), "--format", "json")).code());
        org.ritzwerk.refdata.SpectrumFiles.Spectrum fromCsv = org.ritzwerk.refdata.SpectrumFiles.read(csv);
        org.ritzwerk.refdata.SyntheticSpectrumFiles.Document fromJson =
                org.ritzwerk.refdata.SyntheticSpectrumFiles.readJson(json);
        // The same scene and seed: the CSV's columns are the JSON's arrays, bit for bit.
        assertTrue(Arrays.equals(fromJson.counts(), fromCsv.counts()));
        assertTrue(Arrays.equals(fromJson.expectedCounts(), fromCsv.expectedCounts()));
        assertTrue(Arrays.equals(fromJson.wavelengths(), fromCsv.wavelengths()));
        assertEquals("9000.0", fromCsv.header().get("temperature-k"));
        assertEquals(9000.0, fromJson.scene().get("temperature-k"));
        assertEquals(org.ritzwerk.medium.Medium.air(), fromJson.medium());
        org.ritzwerk.refdata.SpectrumLineFiles.SpectrumLines lines = org.ritzwerk.refdata.SpectrumLineFiles.read(truth);
        assertEquals(org.ritzwerk.medium.Medium.air(), lines.medium());
        assertEquals(fromJson.lines().labels(), lines.labels());
        assertTrue(Arrays.equals(fromJson.lines().counts(), lines.counts()));
        assertTrue(lines.labels().contains("H I Balmer alpha"), lines.labels().toString());
    }

    private static String[] lastRow(Path file) throws IOException {
        List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        return lines.get(lines.size() - 1).split(",");
    }

    private static String[] concat(String[] head, String... tail) {
        String[] all = java.util.Arrays.copyOf(head, head.length + tail.length);
        System.arraycopy(tail, 0, all, head.length, tail.length);
        return all;
    }
}
