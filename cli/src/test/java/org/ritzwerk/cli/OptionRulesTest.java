package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The error contract's option holes, one named test each: numbers that would turn into NaN or
 * infinities are refused at the edge with the allowed range in the option's unit; options that
 * have no effect in the given combination are refused naming both options; a window whose lines
 * all carry no light says why; --transition and --ladder keep to n <= 2000; and parent-level
 * options work wherever picocli accepts them. Every refusal is exit code 2 and one line.
 */
class OptionRulesTest {

    /** Invented peaks: Balmer alpha and beta of hydrogen in standard air, with uncertainties. */
    private static final String PEAKS = "# ritzwerk-peaks 1\n# id: invented\n# title: t\n# source: invented for a test\n"
            + "# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: air\nposition,uncertainty\n"
            + "656.28,0.004\n486.13,0.004\n";

    /** Asserts exit code 2, one line on standard error, nothing on standard output, and every fragment in it. */
    private static void refused(CliTest.Run run, String... fragments) {
        assertEquals(2, run.code(), run.err());
        assertEquals(1, run.err().strip().lines().count(), run.err());
        assertEquals("", run.out(), run.out());
        assertFalse(run.err().contains("NaN") || run.err().contains("Infinity") || run.err().contains("Exception"),
                run.err());
        for (String fragment : fragments) {
            assertTrue(run.err().contains(fragment), () -> "expected '" + fragment + "' in: " + run.err());
        }
    }

    private static Path peaks(Path dir) throws IOException {
        Path file = dir.resolve("peaks.csv");
        Files.writeString(file, PEAKS);
        return file;
    }

    /** A 100-pixel spectrum (invented counts) and a calibration for it. */
    private static Path spectrum(Path dir) throws IOException {
        StringBuilder text = new StringBuilder("# ritzwerk-spectrum 1\npixel,counts\n");
        for (int p = 0; p < 100; p++) {
            text.append(p).append(',').append(10 + p % 7).append('\n');
        }
        Path file = dir.resolve("spectrum.csv");
        Files.writeString(file, text);
        return file;
    }

    private static Path calibration(Path dir, String coefficients) throws IOException {
        Path file = dir.resolve("calibration.json");
        Files.writeString(file, "{\"format\":\"ritzwerk-calibration\",\"version\":1,\"medium\":\"air\",\"pixels\":100,"
                + "\"valid_pixels\":[0,99],\"centre_pixel\":49.5,\"half_range\":49.5,\"coefficients_nm\":["
                + coefficients + "]}");
        return file;
    }

    // --- 1. values that would become NaN or infinities ---

    @Test
    void aCalibrationWithHugeCoefficientsIsRefusedNotAppliedAsInfinity(@TempDir Path dir) throws IOException {
        Path spectrum = spectrum(dir);
        refused(CliTest.run("calibrate", spectrum.toString(), "--apply", calibration(dir, "1e308,1e308,1e308").toString()),
                "calibration.json", "pixel 0", "above 0 and below 1e9 nm", "coefficients_nm");
        refused(CliTest.run("calibrate", spectrum.toString(), "--apply", calibration(dir, "500,1e200").toString()),
                "calibration.json", "pixel 0 the wavelength", "below 1e9 nm");
        refused(CliTest.run("calibrate", spectrum.toString(), "--apply", calibration(dir, "500,5,40").toString()),
                "not monotonic");
        refused(CliTest.run("calibrate", spectrum.toString(), "--apply", calibration(dir, "500,1e400").toString()),
                "\"coefficients_nm\"[1] must be a finite number, got a number too large for a double");
        // The same file with sane coefficients applies.
        CliTest.Run good = CliTest.run("calibrate", spectrum.toString(), "--apply", calibration(dir, "500,5").toString());
        assertEquals(0, good.code(), good.err());
        assertTrue(good.out().contains("\n0,495.000000,"), good.out());
    }

    @Test
    void aSearchOffsetBeyondATenthOfTheShortestPeakIsRefused(@TempDir Path dir) throws IOException {
        refused(CliTest.run("identify", peaks(dir).toString(), "--species", "H", "--search-offset", "1e6"),
                "--search-offset", "at most a tenth of the shortest peak's wavelength (48.6266 nm here, in vacuum)", "got 1000000 nm");
        CliTest.Run fine = CliTest.run("identify", peaks(dir).toString(), "--species", "H", "--search-offset", "0.5");
        assertEquals(0, fine.code(), fine.err());
        assertFalse(fine.out().contains("NaN") || fine.out().contains("Lyman"), fine.out());
    }

    @Test
    void anOffsetFromOneLineHasNoUncertaintyInsteadOfNaN(@TempDir Path dir) throws IOException {
        Path one = dir.resolve("one.csv");
        Files.writeString(one, PEAKS.replace("486.13,0.004\n", ""));
        CliTest.Run run = CliTest.run("identify", one.toString(), "--species", "H", "--search-offset", "0.5");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("from 1 line (one line gives no uncertainty)"), run.out());
        assertFalse(run.out().contains("NaN"), run.out());
    }

    @Test
    void aHugeUncertaintyInConvertIsRefused() {
        refused(CliTest.run("convert", "656.28 +- 1e308 nm", "--to", "THz"), "uncertainty is too large");
    }

    @Test
    void aSearchVelocityThatIsNotANumberIsRefusedWithItsRange(@TempDir Path dir) throws IOException {
        refused(CliTest.run("identify", peaks(dir).toString(), "--species", "H", "--search-velocity", "NaN"),
                "--search-velocity must be a speed above 0 and below a tenth of the speed of light (29979 km/s)",
                "got a value that is not a number");
        refused(CliTest.run("identify", peaks(dir).toString(), "--species", "H", "--search-velocity", "Infinity"),
                "got an infinite value");
    }

    @Test
    void aNegativeOrZeroToleranceIsRefusedInTheUsersUnit(@TempDir Path dir) throws IOException {
        refused(CliTest.run("identify", peaks(dir).toString(), "--species", "H", "--tolerance", "-0.1 nm"),
                "--tolerance must be a positive finite number", "got '-0.1 nm'");
        refused(CliTest.run("identify", peaks(dir).toString(), "--species", "H", "--tolerance", "R=0"),
                "--tolerance must be a positive finite number", "\"R=20000\"", "got 'R=0'");
        refused(CliTest.run("identify", peaks(dir).toString(), "--species", "H", "--tolerance", "0 sigma"), "got '0 sigma'");
    }

    @Test
    void aResolvingPowerOfZeroIsRefusedWithItsRange(@TempDir Path dir) throws IOException {
        refused(CliTest.run("synth", "--species", "H", "--from", "600 nm", "--to", "700 nm", "--temperature", "10000",
                "--resolving-power", "0"), "--resolving-power must be a resolving power lambda / FWHM from 1 to 1e9", "got 0");
        refused(CliTest.run("identify", peaks(dir).toString(), "--species", "H", "--plasma", "--resolving-power", "0"),
                "--resolving-power must be", "got 0");
    }

    @Test
    void synthNumbersThatWouldOverflowAreRefusedAtTheEdge() {
        String[] base = {"synth", "--species", "H", "--from", "600 nm", "--to", "700 nm", "--temperature", "10000",
            "--pixels", "100"};
        refused(CliTest.run(concat(base, "--velocity", "1e308")), "--velocity", "-29979 to 29979 km/s", "got 1e308 km/s");
        refused(CliTest.run(concat(base, "--collisional-width", "1e308")), "--collisional-width",
                "1000 times the spectrum's span (100000 nm here)");
        refused(CliTest.run(concat(base, "--read-noise", "1e308")), "--read-noise", "from 0 to 1e15 counts");
        refused(CliTest.run(concat(base, "--peak-counts", "1e308")), "--peak-counts", "at most 1e15");
        refused(CliTest.run(concat(base, "--continuum", "flat", "--continuum-counts", "1e308")), "--continuum-counts");
        refused(CliTest.run(concat(base, "--continuum", "blackbody", "--continuum-temperature", "1e308")),
                "--continuum-temperature", "below 1e9 K");
    }

    @Test
    void calibrateNumbersOutsideTheirRangeAreRefused(@TempDir Path dir) throws IOException {
        Path spectrum = spectrum(dir);
        refused(CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--saturation", "Infinity"),
                "--saturation must be a number of counts above 0", "got an infinite value");
        refused(CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--dispersion-range", "NaN,1"),
                "--dispersion-range must be MIN,MAX in nm per pixel", "from -1000 to 1000");
        refused(CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--threshold", "-Infinity"),
                "--threshold must be a signal-to-noise ratio above 0");
    }

    // --- 2. options without effect in the given combination ---

    @Test
    void lMaxForAOneElectronIonIsRefused() {
        refused(CliTest.run("levels", "--species", "H", "--l-max", "1"), "--l-max has no effect for one-electron ions");
        refused(CliTest.run("lines", "--species", "H", "--from", "600 nm", "--to", "700 nm", "--l-max", "1"),
                "--l-max has no effect for one-electron ions");
        assertEquals(0, CliTest.run("levels", "--species", "H,Rb-87 I", "--n-max", "6", "--l-max", "1").code());
    }

    @Test
    void temperatureWithoutLifetimesIsRefused() {
        refused(CliTest.run("levels", "--species", "Rb-87 I", "--n-max", "6", "--temperature", "300"),
                "--temperature has no effect without --lifetimes");
        refused(CliTest.run("levels", "--species", "H", "--lifetimes", "--temperature", "300"),
                "--temperature has no effect for one-electron ions");
        refused(CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,30s1/2", "--temperature", "300"),
                "--temperature has no effect without --transition");
    }

    @Test
    void fromAndToWithTransitionAreRefused() {
        refused(CliTest.run("lines", "--species", "Rb-87 I", "--transition", "30d5/2 -> 31p3/2", "--from", "1 GHz",
                "--to", "2 GHz"), "--from has no effect with --transition");
        refused(CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,30s1/2", "--n-max", "40"),
                "--n-max has no effect with --ladder");
    }

    @Test
    void lampAndDegreeWithApplyAreRefused(@TempDir Path dir) throws IOException {
        Path spectrum = spectrum(dir);
        Path calibration = calibration(dir, "500,5");
        refused(CliTest.run("calibrate", spectrum.toString(), "--apply", calibration.toString(), "--lamp", "Ne I"),
                "--lamp has no effect with --apply");
        refused(CliTest.run("calibrate", spectrum.toString(), "--apply", calibration.toString(), "--degree", "2"),
                "--degree has no effect with --apply");
        refused(CliTest.run("calibrate", spectrum.toString(), "--lamp", "Ne I", "--degree", "2", "--max-degree", "4"),
                "--max-degree has no effect with --degree 2");
    }

    @Test
    void instrumentFwhmWithoutPlasmaIsRefused(@TempDir Path dir) throws IOException {
        refused(CliTest.run("identify", peaks(dir).toString(), "--species", "H", "--instrument-fwhm", "0.1"),
                "--instrument-fwhm has no effect without --plasma");
        refused(CliTest.run("identify", peaks(dir).toString(), "--species", "H", "--resolving-power", "5000"),
                "--resolving-power has no effect without --plasma");
        refused(CliTest.run("identify", peaks(dir).toString(), "--lines", "lamp-ne-i", "--tolerance", "0.02 nm",
                "--n-max", "10"), "--n-max has no effect without --species");
    }

    @Test
    void synthOptionsWithoutEffectAreRefused() {
        String[] base = {"synth", "--species", "H", "--from", "600 nm", "--to", "700 nm", "--temperature", "10000",
            "--pixels", "100"};
        refused(CliTest.run(concat(base, "--continuum-counts", "50")),
                "--continuum-counts has no effect without --continuum or --continuum-file");
        refused(CliTest.run(concat(base, "--continuum", "flat", "--continuum-temperature", "5000")),
                "--continuum-temperature has no effect without --continuum blackbody");
        refused(CliTest.run(concat(base, "--no-noise", "--seed", "3")), "--seed has no effect with --no-noise");
        String[] lamp = {"synth", "--lines", "lamp-ne-i", "--from", "600 nm air", "--to", "700 nm air", "--medium", "air",
            "--temperature", "300", "--pixels", "100"};
        refused(CliTest.run(concat(lamp, "--natural-widths")),
                "--natural-widths has no effect without a one-electron ion in --species");
        refused(CliTest.run(concat(lamp, "--n-max", "12")), "--n-max has no effect without --species");
        refused(CliTest.run(concat(lamp, "--model", "bohr")), "--model has no effect without a one-electron ion");
    }

    @Test
    void anAirModelWithoutAirIsRefused() {
        refused(CliTest.run("convert", "656 nm", "--to", "THz", "--air", "ciddor1996"), "--air has no effect when no"
                + " quantity and no --to is in air");
        assertEquals(0, CliTest.run("convert", "656 nm", "--to", "nm air", "--air", "ciddor1996").code());
    }

    // --- 3. lines in the window whose populations underflow ---

    @Test
    void synthSaysWhyLinesInTheWindowCarryNoLight() {
        CliTest.Run lines = CliTest.run("lines", "--species", "H", "--from", "100 nm", "--to", "130 nm", "--multiplets");
        assertEquals(0, lines.code(), lines.err());
        assertTrue(lines.out().contains("Lyman alpha"), lines.out());
        refused(CliTest.run("synth", "--species", "H", "--from", "100 nm", "--to", "130 nm", "--temperature", "100",
                "--pixels", "100"), "2 line(s) of H fall between 100 nm and 130 nm, but none carries any light",
                "at --temperature 100 K", "below the smallest number a double holds", "raise --temperature");
    }

    // --- 4. --transition and --ladder within the documented n <= 2000 ---

    @Test
    void transitionAndLadderKeepToTheDocumentedRangeOfN() {
        refused(CliTest.run("lines", "--species", "Rb-87 I", "--transition", "5000d5/2 -> 51p3/2"),
                "--transition: 5000d 2D5/2 has n = 5000; states are computed for n up to 2000");
        refused(CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,9999s1/2"),
                "--ladder: 9999s 2S1/2 has n = 9999; states are computed for n up to 2000");
        refused(CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,3d5/2"),
                "Rb-87 I has no 3d 2D5/2 level: the lowest n of l = 2 is 4");
    }

    // --- 5. options work wherever picocli accepts them ---

    @Test
    void dataOptionsBeforeOrAfterTheSubcommandAreTheSame(@TempDir Path dir) throws IOException {
        Path mine = dir.resolve("mine.csv");
        Files.writeString(mine, CliTest.run("data", "show", "lamp-ne-i", "--format", "csv").out()
                .replace("# id: lamp-ne-i", "# id: my-neon"));
        CliTest.Run after = CliTest.run("data", "show", "my-neon", "--file", mine.toString());
        CliTest.Run before = CliTest.run("data", "--file", mine.toString(), "show", "my-neon");
        assertEquals(0, after.code(), after.err());
        assertEquals(after, before);
        assertEquals(CliTest.run("data", "show", "lamp-ar-i", "--format", "json"),
                CliTest.run("data", "--format", "json", "show", "lamp-ar-i"));
        assertEquals(CliTest.run("data", "show", "my-neon", "--data", mine.toString(), "--format", "csv"),
                CliTest.run("data", "--format", "csv", "--data", mine.toString(), "show", "my-neon"));
        refused(CliTest.run("data", "--format", "csv", "check", mine.toString()),
                "--format has no effect with 'data check'");
        refused(CliTest.run("data", "check", mine.toString(), "--file", mine.toString()),
                "--file has no effect with 'data check'");
        // The top-level --debug reaches every subcommand, before or after its name.
        assertEquals(CliTest.run("--debug", "levels", "--species", "H", "--n-max", "1"),
                CliTest.run("levels", "--species", "H", "--n-max", "1", "--debug"));
    }

    private static String[] concat(String[] a, String... b) {
        String[] all = java.util.Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, all, a.length, b.length);
        return all;
    }
}
