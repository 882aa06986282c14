package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The command line end to end, through {@link Main#run}. */
class CliTest {

    /** Output of one run. */
    record Run(int code, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new PrintWriter(out), new PrintWriter(err), args);
        return new Run(code, out.toString(), err.toString());
    }

    @Test
    void convertsTheIssueExamples() {
        Run air = run("convert", "656.279 nm air", "--to", "nm vacuum");
        assertEquals(0, air.code(), air.err());
        assertTrue(air.out().matches("656\\.460\\d+ nm vacuum\\R"), air.out());

        Run thz = run("convert", "15233.07 cm-1", "--to", "THz");
        assertEquals(0, thz.code(), thz.err());
        // 15233.07 cm-1 x c = 456.675949... THz (exact c; common practice).
        assertTrue(thz.out().startsWith("456.6759498"), thz.out());
        assertTrue(thz.out().strip().endsWith(" THz"), thz.out());

        Run ev = run("convert", "1.8886 eV", "--to", "nm air");
        assertEquals(0, ev.code(), ev.err());
        assertTrue(ev.out().matches("656\\.30\\d+ nm air\\R"), ev.out());
    }

    @Test
    void writesJsonObjects() {
        JsonMapper json = JsonMapper.builder().build();
        Run run = run("convert", "656.28(2) nm air", "--to", "nm vacuum", "--to", "THz", "--format", "json");
        assertEquals(0, run.code(), run.err());
        String[] lines = run.out().strip().split("\\R");
        assertEquals(2, lines.length);
        JsonNode wavelength = json.readTree(lines[0]);
        assertEquals("656.28(2) nm air", wavelength.get("input").asString());
        // By hand: 656.28 nm in standard air is 656.4613 nm in vacuum (Morton 2000, eq. 8).
        assertEquals(656.461, wavelength.get("value").asDouble(), 1e-3);
        assertEquals("nm", wavelength.get("unit").asString());
        assertEquals("vacuum", wavelength.get("medium").asString());
        assertEquals(0.02, wavelength.get("uncertainty").asDouble(), 1e-4);
        JsonNode frequency = json.readTree(lines[1]);
        assertEquals("THz", frequency.get("unit").asString());
        assertTrue(frequency.get("medium") == null, "a frequency has no medium");

        JsonNode plain = json.readTree(run("convert", "1.8886 eV", "--to", "nm air", "--format", "json").out());
        assertTrue(plain.get("uncertainty").isNull());
        assertEquals("standard", plain.get("airModel").asString());
    }

    @Test
    void roundsOnRequestAndHonoursTheAirModel() {
        assertEquals("656.46 nm vacuum", run("convert", "656.279 nm air", "--to", "nm", "--digits", "5").out().strip());
        Run ciddor = run("convert", "632.991 nm", "--to", "nm air", "--air", "ciddor1996:T=20C,p=101325Pa,RH=50%,CO2=450ppm",
                "--digits", "8");
        assertEquals(0, ciddor.code(), ciddor.err());
        // NIST calculator: n = 1.000271373 at 633 nm, 20 C, 101.325 kPa, 50 % RH (see api tests).
        assertEquals("632.81927 nm air", ciddor.out().strip());
    }

    @Test
    void readsAListFileAndReportsEveryBadLine(@TempDir Path dir) throws IOException {
        Path good = dir.resolve("good.txt");
        Files.writeString(good, "# two peaks\n412.337 nm air\n\n17298.77 cm-1\n", StandardCharsets.UTF_8);
        Run ok = run("convert", "--input", good.toString(), "--to", "eV", "--digits", "6");
        assertEquals(0, ok.code(), ok.err());
        assertEquals(2, ok.out().strip().split("\\R").length);

        Path bad = dir.resolve("bad.txt");
        Files.writeString(bad, "412.337 nm air\n577.9 furlongs\n-3 eV\n", StandardCharsets.UTF_8);
        Run refused = run("convert", "--input", bad.toString(), "--to", "eV");
        assertEquals(2, refused.code());
        assertEquals("", refused.out(), "nothing is printed when the input is refused");
        assertTrue(refused.err().contains("2 problems in " + bad), refused.err());
        assertTrue(refused.err().contains(bad + ":2:7: unknown unit 'furlongs'"), refused.err());
        assertTrue(refused.err().contains(bad + ":3:1: the value must not be negative"), refused.err());

        Run missing = run("convert", "--input", dir.resolve("nope.txt").toString(), "--to", "eV");
        assertEquals(2, missing.code());
        assertTrue(missing.err().contains("nope.txt: no such file"), missing.err());
    }

    @Test
    void aQuantityOrTargetSplitByTheShellSaysToQuoteIt() {
        // before: "cannot read "656.28" (column 7): no unit after the number; known units: ..." and, for --to nm air,
        // "cannot read "air" (column 1): expected a number", neither saying that the space split the argument
        Run number = run("convert", "656.28", "nm", "--to", "eV");
        assertEquals(2, number.code());
        assertTrue(number.err().contains("no unit after the number")
                && number.err().contains("give the number and its unit as one argument, in quotes: \"656.28 nm\""),
                number.err());
        Run medium = run("convert", "656.28 nm", "--to", "nm", "air");
        assertEquals(2, medium.code());
        assertTrue(medium.err().contains("'air' reads as a unit or medium: quote a quantity or a --to target"),
                medium.err());
        Run unit = run("convert", "656.28 nm air", "--to", "nm vacuum", "THz");
        assertEquals(2, unit.code());
        assertTrue(unit.err().contains("'THz' reads as a unit or medium"), unit.err());
        Run word = run("convert", "656.28 nm", "hello", "--to", "THz");
        assertEquals(2, word.code());
        assertTrue(word.err().contains("cannot read \"hello\"") && !word.err().contains("reads as a unit"), word.err());
        assertEquals(0, run("convert", "656.28 nm", "--to", "THz").code());
    }

    @Test
    void badInputGivesOneClearLineAndExitCode2() {
        Run unit = run("convert", "656.28 furlongs", "--to", "nm");
        assertEquals(2, unit.code());
        assertTrue(unit.err().startsWith("ritzwerk convert: cannot read \"656.28 furlongs\" (column 8): unknown unit"),
                unit.err());
        assertTrue(!unit.err().contains("\tat "), "no stack trace");

        Run target = run("convert", "656.28 nm", "--to", "THz air");
        assertEquals(2, target.code());
        assertTrue(target.err().contains("only wavelengths have a medium"), target.err());

        Run outside = run("convert", "121.567 nm air", "--to", "eV");
        assertEquals(2, outside.code());
        assertTrue(outside.err().contains("below 200 nm wavelengths are given in vacuum"), outside.err());

        Run photon = run("convert", "0 eV", "--to", "nm");
        assertEquals(2, photon.code());
        assertTrue(photon.err().contains("not positive, so no photon has it"), photon.err());

        Run noTarget = run("convert", "656.28 nm");
        assertEquals(2, noTarget.code());
        assertTrue(noTarget.err().contains("Missing required option: '--to"), noTarget.err());
    }

    @Test
    void versionAndHelp() {
        Run version = run("--version");
        assertEquals(0, version.code());
        assertTrue(version.out().startsWith("ritzwerk 0.1.0-SNAPSHOT"), version.out());
        assertTrue(version.out().contains("constants: CODATA 2018"), version.out());
        Run help = run("--help");
        assertEquals(0, help.code());
        assertTrue(help.out().contains("convert") && help.out().contains("demo"), help.out());
        Run convertHelp = run("convert", "--help");
        assertTrue(convertHelp.out().contains("--to"), convertHelp.out());
    }

    @Test
    void theCommandListGivesEachCommandAWholePhraseAndPointsToSafety() {
        String help = run("--help").out();
        String commands = help.substring(help.indexOf("Commands:"), help.indexOf("Safety:"));
        // Each command's entry (possibly wrapped) ends a sentence: no description cut mid-phrase.
        for (String entry : commands.strip().split("\\R(?=  [a-z])")) {
            if (!entry.startsWith("Commands:")) {
                assertTrue(entry.strip().endsWith("."), "cut mid-phrase: " + entry);
            }
        }
        assertTrue(help.replaceAll("\\s+", " ").contains("Read the Safety section of README.md"), help);
        String data = run("data", "--help").out();
        String dataCommands = data.substring(data.indexOf("Commands:"), data.indexOf("Examples:"));
        for (String entry : dataCommands.strip().split("\\R(?=  [a-z])")) {
            if (!entry.startsWith("Commands:")) {
                assertTrue(entry.strip().endsWith("."), "cut mid-phrase: " + entry);
            }
        }
        String lines = run("lines", "--help").out();
        assertTrue(lines.replaceAll("\\s+", " ").contains("Lasers (--ladder) can injure eyes and skin: read the Safety section of README.md"),
                lines);
    }

    @Test
    void debugAddsTheStackTraceAndOnlyThen() {
        Run plain = run("convert", "656.28 furlongs", "--to", "nm vacuum");
        assertEquals(2, plain.code());
        assertFalse(plain.err().contains("\tat "), plain.err());
        Run debug = run("convert", "656.28 furlongs", "--to", "nm vacuum", "--debug");
        assertEquals(2, debug.code());
        assertTrue(debug.err().contains("unknown unit 'furlongs'"), debug.err());
        assertTrue(debug.err().contains("\tat org.ritzwerk"), debug.err());
    }

    @Test
    void filesThatCannotBeReadOrWrittenAreInputErrors(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir) {
        String missingFolder = dir.resolve("no-such-folder").resolve("out.csv").toString();
        Run synth = run("synth", "--species", "H I", "--from", "650 nm", "--to", "660 nm", "--temperature", "8000",
                "--out", missingFolder);
        assertEquals(2, synth.code());
        assertEquals("ritzwerk synth: --out " + missingFolder + ": the folder " + dir.resolve("no-such-folder")
                + " does not exist", synth.err().strip());
        Run calibrate = run("calibrate", dir.resolve("absent.csv").toString(), "--lamp", "Ne I");
        assertEquals(2, calibrate.code());
        assertTrue(calibrate.err().contains("absent.csv: no such file"), calibrate.err());
    }
}
