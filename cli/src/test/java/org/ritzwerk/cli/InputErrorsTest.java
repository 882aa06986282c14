package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A folder given where a file is expected, and a byte that is not UTF-8, are input errors: exit
 * code 2 and one line naming the path (and the line and column of the byte), never an internal
 * error.
 */
class InputErrorsTest {

    @Test
    void aFolderWhereAFileIsExpected(@TempDir Path dir) {
        for (String[] args : new String[][] {
            {"identify", dir.toString(), "--species", "H"},
            {"data", "check", dir.toString()},
            {"calibrate", dir.toString(), "--lamp", "Ne I"},
            {"convert", "--input", dir.toString(), "--to", "THz"}}) {
            CliTest.Run run = CliTest.run(args);
            assertEquals(2, run.code(), String.join(" ", args) + ": " + run.err());
            assertTrue(run.err().contains(dir.toString()) && !run.err().contains("internal error"), run.err());
        }
    }

    @Test
    void aByteThatIsNotUtf8(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("list.txt");
        Files.write(file, new byte[] {'6', '5', '6', ' ', 'n', 'm', ' ', 'a', 'i', 'r', '\n', 'x', (byte) 0xff, '\n'});
        CliTest.Run run = CliTest.run("convert", "--input", file.toString(), "--to", "THz");
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains(file + ":2:2") && run.err().contains("0xFF"), run.err());
    }

    @Test
    void aMistypedCommandLineGivesOneErrorAHintAndNoUsageDump() {
        CliTest.Run typo = CliTest.run("lines", "--specis", "H");
        assertEquals(2, typo.code());
        assertTrue(typo.err().contains("did you mean: --species?"), typo.err());
        assertTrue(typo.err().contains("see 'ritzwerk lines --help'") && !typo.err().contains("Usage:"), typo.err());
        assertTrue(typo.err().lines().count() <= 4, typo.err());
        CliTest.Run negative = CliTest.run("convert", "-656 nm", "--to", "THz");
        assertEquals(2, negative.code());
        assertTrue(negative.err().contains("starts with '-'") && !negative.err().contains("Usage:"), negative.err());
        CliTest.Run command = CliTest.run("convret");
        assertEquals(2, command.code());
        assertTrue(command.err().contains("did you mean: convert?"), command.err());
    }

    @Test
    void aQuantityOptionThatCannotBeReadIsNamed(@TempDir Path dir) {
        // before: "cannot read "300" (column 4): no unit ...", naming neither the option nor which end
        CliTest.Run lines = CliTest.run("lines", "--species", "H I", "--from", "300", "--to", "700 nm");
        assertEquals(2, lines.code());
        assertTrue(lines.err().startsWith("ritzwerk lines: --from: cannot read \"300\""), lines.err());
        CliTest.Run synth = CliTest.run("synth", "--species", "H I", "--from", "300 nm", "--to", "900",
                "--temperature", "3000", "--out", dir.resolve("s.csv").toString());
        assertEquals(2, synth.code());
        assertTrue(synth.err().startsWith("ritzwerk synth: --to: cannot read \"900\""), synth.err());
        CliTest.Run kelvin = CliTest.run("lines", "--species", "H I", "--from", "300 nm", "--to", "3 K");
        assertTrue(kelvin.err().contains("--to: cannot read \"3 K\"") && kelvin.err().contains("temperature"),
                kelvin.err());
    }

    @Test
    void aFullDeviceIsAnInputErrorWithoutAStackTrace(@TempDir Path dir) {
        Path full = Path.of("/dev/full");
        org.junit.jupiter.api.Assumptions.assumeTrue(Files.exists(full) && !Files.isRegularFile(full),
                "a system with /dev/full");
        CliTest.Run run = CliTest.run("synth", "--lines", "lamp-ne-i", "--from", "600 nm air", "--to", "700 nm air",
                "--pixels", "2000", "--medium", "air", "--temperature", "300", "--resolving-power", "4000",
                "--seed", "1", "--out", dir.resolve("s.csv").toString(), "--plot", full.toString());
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains("No space left") && !run.err().contains("Exception"), run.err());
        assertTrue(!Files.isRegularFile(full), "/dev/full is still a device");
    }

    @Test
    void aZeroUncertaintyUnderASigmaToleranceIsExplained(@TempDir Path dir) throws IOException {
        Path peaks = dir.resolve("zero.csv");
        Files.writeString(peaks, "# ritzwerk-peaks 1\n# id: zero\n# title: t\n# source: invented\n# provenance: measured\n"
                + "# version: 1\n# position-unit: nm\n# medium: air\nposition,uncertainty\n656.28,0.004\n486.13,0\n");
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H");
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains(peaks + ":11:") && run.err().contains("uncertainty is 0"), run.err());
        // With a width tolerance the same file is fine.
        assertEquals(0, CliTest.run("identify", peaks.toString(), "--species", "H", "--tolerance", "0.02 nm").code());
    }

    @Test
    void aRepeatedPeakIsRefusedWithItsFileLines(@TempDir Path dir) throws IOException {
        // Three copies of one line gave an offset "from 3 lines" with a sqrt(3) narrower uncertainty.
        Path peaks = dir.resolve("three.csv");
        Files.writeString(peaks, "# ritzwerk-peaks 1\n# id: three\n# title: t\n# source: invented\n"
                + "# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: air\n"
                + "position,uncertainty\n656.30,0.01\n486.13,0.01\n"
                + "656.30,0.01\n656.30,0.01\n");
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H I", "--search-offset", "0.5");
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains("2 peak(s) repeat another's position:\n  " + peaks + ":12: the same position as "
                + "line 10\n  " + peaks + ":13: the same position as line 10\n"), run.err());
    }

    /**
     * In a JSON peaks file on one line every peak is on line 1, so the repeats and the missing
     * uncertainties were all named "line 1" (a review's leftover); they are named by their entry of
     * 'peaks', as the reader's own JSON errors name them.
     */
    @Test
    void peaksOfAOneLineJsonFileAreNamedByTheirEntries(@TempDir Path dir) throws IOException {
        String head = "{\"format\":\"ritzwerk-peaks\",\"formatVersion\":1,\"id\":\"three\",\"title\":\"t\","
                + "\"source\":\"invented\",\"provenance\":\"measured\",\"version\":\"1\",\"positionUnit\":\"nm\","
                + "\"medium\":\"air\",\"peaks\":[";
        Path peaks = dir.resolve("three.json");
        Files.writeString(peaks, head + "{\"position\":656.30,\"uncertainty\":0.01},{\"position\":486.13,"
                + "\"uncertainty\":0.01},{\"position\":656.30,\"uncertainty\":0.01}]}\n");
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H I");
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains("1 peak(s) repeat another's position:\n  " + peaks + ":1: entry 3 of 'peaks':"
                + " the same position as entry 1 of 'peaks'\n"), run.err());
        Path zero = dir.resolve("zero.json");
        Files.writeString(zero, head + "{\"position\":656.28,\"uncertainty\":0.004},{\"position\":486.13,"
                + "\"uncertainty\":0}]}\n");
        CliTest.Run sigma = CliTest.run("identify", zero.toString(), "--species", "H");
        assertEquals(2, sigma.code(), sigma.err());
        assertTrue(sigma.err().contains(zero + ":1: entry 2 of 'peaks': the peak's uncertainty is 0"), sigma.err());
    }

    /**
     * Found by a second review: input that reached an engine precondition (exit 1) or was taken
     * twice. A continuum that is zero on the grid, a level list whose label and J column disagree
     * (also caught by {@code data check}), and a species or line list named twice are exit-2
     * refusals naming what is wrong.
     */
    @Test
    void inputThatUsedToReachAnEnginePreconditionIsRefused(@TempDir Path dir) throws IOException {
        CliTest.Run cold = CliTest.run("synth", "--species", "H I", "--from", "400 nm", "--to", "700 nm",
                "--temperature", "10000", "--continuum", "blackbody", "--continuum-temperature", "1", "--out",
                dir.resolve("s.csv").toString());
        assertEquals(2, cold.code(), cold.err());
        assertTrue(cold.err().contains("the continuum is zero over the whole grid"), cold.err());

        Path levels = dir.resolve("levels.csv");
        Files.writeString(levels, String.join("\n", "# ritzwerk-levels 1", "# id: levels-he-i", "# title: t",
                "# source: invented for a test", "# provenance: computed", "# version: 1", "# energy-unit: cm-1",
                "species,label,energy,uncertainty,j,note", "He I,1s2 1S0,0,,0,", "He I,1s2s 3S1,159855.97,,1,",
                "He I,1s2p 3P2,169086.77,,0,", ""));
        CliTest.Run check = CliTest.run("data", "check", levels.toString());
        assertEquals(2, check.code(), check.out() + check.err());
        assertTrue(check.err().contains("level '1s2p 3P2' has J = 2 in its label but J = 0 beside it"), check.err());
        CliTest.Run lines = CliTest.run("lines", "--species", "He I", "--data", levels.toString(), "--from",
                "300 nm", "--to", "2000 nm");
        assertEquals(2, lines.code(), lines.err());
        // reported where it stands in the file
        assertTrue(lines.err().contains("levels.csv:11:5: column j: level '1s2p 3P2' has J = 2 in its label"),
                lines.err());

        // peaks in air outside the air model are named by file, line and column, every one of them
        Path air = dir.resolve("air.csv");
        Files.writeString(air, String.join("\n", "# ritzwerk-peaks 1", "# id: t", "# title: t", "# source: s",
                "# provenance: measured", "# version: 1", "# position-unit: nm", "# medium: air",
                "position,uncertainty", "121.5,0.01", "500,0.01", "3000,0.01", ""));
        CliTest.Run outside = CliTest.run("identify", air.toString(), "--species", "H I");
        assertEquals(2, outside.code());
        assertTrue(outside.err().contains("air.csv:10:1: column position: wavelength 121.5 nm (air) is outside")
                && outside.err().contains("air.csv:12:1: column position: wavelength 3000 nm (air)"), outside.err());

        // under a sigma tolerance every peak without a usable uncertainty is named, not only the first
        Path mixed = dir.resolve("mixed.csv");
        Files.writeString(mixed, String.join("\n", "# ritzwerk-peaks 1", "# id: t", "# title: t", "# source: s",
                "# provenance: measured", "# version: 1", "# position-unit: nm", "# medium: air",
                "position,uncertainty", "656.27,0.01", "486.13,", "434.04,0", ""));
        CliTest.Run sigma = CliTest.run("identify", mixed.toString(), "--species", "H I", "--tolerance", "5 sigma");
        assertEquals(2, sigma.code());
        assertTrue(sigma.err().contains("mixed.csv:11: the peak's uncertainty is not given")
                && sigma.err().contains("mixed.csv:12: the peak's uncertainty is 0"), sigma.err());

        Path peaks = Path.of("..", "examples", "data", "peaks.csv");
        // a PNG output must be named .png, in every command that draws one
        CliTest.Run txt = CliTest.run("synth", "--species", "H I", "--from", "400 nm", "--to", "700 nm",
                "--temperature", "10000", "--out", dir.resolve("s.csv").toString(), "--plot",
                dir.resolve("s.txt").toString());
        assertEquals(2, txt.code());
        assertTrue(txt.err().contains("--plot must name a .png file"), txt.err());
        assertTrue(!Files.exists(dir.resolve("s.txt")) && !Files.exists(dir.resolve("s.csv")));
        // a truncated JSON file: the parser's syntax message, without its notes about itself
        Path cut = dir.resolve("cut.json");
        Files.writeString(cut, "{\"format\": \"ritzwerk-peaks\", \"peaks\": [{\"position\": 5");
        CliTest.Run truncated = CliTest.run("identify", cut.toString(), "--species", "H I");
        assertEquals(2, truncated.code());
        assertTrue(truncated.err().contains("JSON syntax: Unexpected end-of-input") && !truncated.err().contains(
                "Source: REDACTED"), truncated.err());
        // a peak list or a series given as a data file is named for what it is
        CliTest.Run notData = CliTest.run("data", "check", peaks.toString(),
                Path.of("..", "examples", "data", "rb87-series.csv").toString());
        assertEquals(2, notData.code());
        assertTrue(notData.err().contains("peaks.csv: this is a ritzwerk-peaks file, a peak list")
                && notData.err().contains("rb87-series.csv: this is a ritzwerk-series file"), notData.err());
        CliTest.Run twice = CliTest.run("identify", peaks.toString(), "--species", "H I,H");
        assertEquals(2, twice.code());
        assertTrue(twice.err().contains("--species names H I twice"), twice.err());
        for (String option : new String[] {"--model", "--components"}) {
            CliTest.Run noIon = option.equals("--model")
                    ? CliTest.run("identify", peaks.toString(), "--species", "Rb-87 I", "--model", "bohr")
                    : CliTest.run("identify", peaks.toString(), "--species", "He I", "--components");
            assertEquals(2, noIon.code(), option);
            assertTrue(noIon.err().contains(option + " has no effect without a one-electron ion"), noIon.err());
        }
        CliTest.Run lists = CliTest.run("identify", peaks.toString(), "--species", "H I", "--lines", "lamp-ne-i",
                "--lines", "lamp-ne-i");
        assertEquals(2, lists.code());
        assertTrue(lists.err().contains("--lines names 'lamp-ne-i' twice"), lists.err());
    }

    /**
     * In an energy-like unit the position residual and res/sigma have one sign (res/sigma was the
     * wavelength's, of the other sign, for peaks in cm-1, Hz or eV).
     */
    @Test
    void residualAndNormalisedResidualShareTheirSignInEveryUnit(@TempDir Path dir) throws IOException {
        Path peaks = dir.resolve("peaks-cm.csv");
        // H I Balmer alpha at 15233.07 cm-1 (vacuum), a peak 0.2 cm-1 below it
        Files.writeString(peaks, String.join("\n", "# ritzwerk-peaks 1", "# id: t", "# title: t",
                "# source: invented for a test", "# provenance: measured", "# version: 1", "# position-unit: cm-1",
                "position,uncertainty", "15232.87,0.5", ""));
        CliTest.Run run = CliTest.run("identify", peaks.toString(), "--species", "H I", "--format", "csv");
        assertEquals(0, run.code(), run.err());
        String[] header = run.out().lines().findFirst().orElseThrow().split(",");
        String[] row = run.out().lines().skip(1).findFirst().orElseThrow().split(",");
        int residual = java.util.Arrays.asList(header).indexOf("residual");
        int sigma = java.util.Arrays.asList(header).indexOf("residual_sigma");
        double r = Double.parseDouble(row[residual]);
        double z = Double.parseDouble(row[sigma]);
        assertTrue(r < 0 && z < 0, run.out());
    }

    /** A series file of an isotope without nuclear data says how to give its mass. */
    @Test
    void aSeriesOfAnIsotopeWithoutMassSaysWhatToGive(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("sr87.csv");
        Files.writeString(file, "# ritzwerk-series 1\n# species: Sr-87 I\n# energy-unit: cm-1\n"
                + "series,n,energy,uncertainty\nS,20,45600.1,0.002\nS,22,45650.2,0.002\nS,24,45700.3,0.002\n");
        CliTest.Run run = CliTest.run("series", file.toString());
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains(file + ": '# species: Sr-87 I': no nuclear data for Sr-87")
                && run.err().contains("give an isotope table of your own with --data"), run.err());
    }

    /** An uncertainty of 0 and a negative one get the same message, with the value. */
    @Test
    void aSeriesUncertaintyNotPositiveHasOneMessage(@TempDir Path dir) throws IOException {
        for (String u : new String[] {"0", "-0.002"}) {
            Path file = dir.resolve("s" + u + ".csv");
            Files.writeString(file, "# ritzwerk-series 1\n# species: Rb-87 I\n# energy-unit: cm-1\n"
                    + "series,n,energy,uncertainty\nS,20,33000.1," + u + "\nS,22,33100.2,0.002\n");
            CliTest.Run run = CliTest.run("series", file.toString());
            assertEquals(2, run.code(), run.err());
            assertTrue(run.err().contains(file + ":5:4: column uncertainty: uncertainty must be positive, got " + u),
                    run.err());
        }
    }

    /** fit-levels echoes an uncertainty in cm-1 as given (0.001 came back as 9.999999999961507E-4). */
    @Test
    void fitLevelsEchoesTheUncertaintyAsGiven(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("lines.csv");
        Files.writeString(file, "# ritzwerk-measured-lines 1\n# position-unit: cm-1\nposition,uncertainty,upper,lower\n"
                + "1000.002041,0.001,b 1,a 0\n2500.494889,0.002,c 1,a 0\n1500.49,0.001,c 1,b 1\n");
        CliTest.Run run = CliTest.run("fit-levels", file.toString(), "--reference", "a 0", "--format", "json");
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("\"uncertainty_per_cm\":0.001,") && run.out().contains(
                "\"uncertainty_per_cm\":0.002,"), run.out());
    }
}
