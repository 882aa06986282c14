package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import java.util.TreeMap;
import java.util.function.Function;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A fuzz test of the error contract, with fixed seeds: every file reader gets mutated copies of a
 * valid file (lines truncated, fields deleted or swapped, numbers replaced by huge, tiny,
 * negative, NaN or infinite ones, random bytes inserted, lines deleted or doubled, the file cut
 * short), and every command's numeric options get edge values. Each run must exit 0 or 2, never
 * 1; print no stack trace; print no NaN or Infinity that the input did not contain (an error may
 * quote the user's own text); and leave every file in its folder as it was.
 */
class ContractFuzzTest {

    /**
     * Mutants per reader; {@code -Dritzwerk.fuzz.mutants=N} (and {@code -Dritzwerk.fuzz.seed=S},
     * added to every seed) runs a longer or different search by hand.
     */
    private static final int MUTANTS = Integer.getInteger("ritzwerk.fuzz.mutants", 12);
    private static final long SEED = Long.getLong("ritzwerk.fuzz.seed", 0L);

    /** Numbers that break naive readers: huge, tiny, negative, not finite, beyond double, not numbers. */
    private static final String[] NASTY = {"NaN", "Infinity", "-Infinity", "1e308", "-1e308", "1e400", "-1", "0",
        "-0", "4.9e-324", "99999999999999999999", "", "x", "1e", "0x10", "1,5"};

    /** Bytes a text file should not hold, or holds only at its start. */
    private static final byte[][] BYTES = {{0}, {(byte) 0xff}, {(byte) 0xc3}, {(byte) 0xef, (byte) 0xbb, (byte) 0xbf},
        {'\r'}, {'"'}, {','}, {'\n'}, {'#'}, {(byte) 0xe2, (byte) 0x88, (byte) 0x92}};

    // --- the valid fixtures ---

    private static final String PEAKS_CSV = "# ritzwerk-peaks 1\n# id: fuzz-peaks\n# title: invented peaks\n"
            + "# source: invented for a test\n# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: air\n"
            + "position,uncertainty,intensity,width,note\n656.28,0.004,1520,0.09,\n486.13,0.004,600,0.08,b\n"
            + "434.05,0.005,250,0.07,\n410.17,0.006,120,0.07,\n";

    private static final String PEAKS_JSON = "{\n  \"format\": \"ritzwerk-peaks\",\n  \"formatVersion\": 1,\n"
            + "  \"id\": \"fuzz-peaks\",\n  \"title\": \"invented peaks\",\n  \"source\": \"invented for a test\",\n"
            + "  \"provenance\": \"measured\",\n  \"version\": \"1\",\n  \"positionUnit\": \"nm\",\n  \"medium\": \"air\",\n"
            + "  \"peaks\": [\n    {\"position\": 656.28, \"uncertainty\": 0.004, \"intensity\": 1520},\n"
            + "    {\"position\": 486.13, \"uncertainty\": 0.004, \"intensity\": 600}\n  ]\n}\n";

    private static final String CALIBRATION = "{\n\"format\": \"ritzwerk-calibration\",\n\"version\": 1,\n"
            + "\"medium\": \"air\",\n\"pixels\": 64,\n\"valid_pixels\": [2.5, 60.5],\n\"centre_pixel\": 31.5,\n"
            + "\"half_range\": 31.5,\n\"coefficients_nm\": [\n600.0,\n3.15,\n-0.01\n],\n"
            + "\"covariance_nm2\": [[1e-8, 0, 0], [0, 1e-8, 0], [0, 0, 1e-8]]\n}\n";

    private static final String QUANTITIES = "# invented quantities\n412.337(4) nm air\n577.915 +- 0.005 nm air\n"
            + "17298.77 cm-1\n518.6 THz\n2.144775 eV\n";

    private static String spectrumCsv() {
        StringBuilder text = new StringBuilder("# ritzwerk-spectrum 1\n# detector: invented 64-pixel strip\n"
                + "pixel,counts,counts_sigma\n");
        for (int p = 0; p < 64; p++) {
            double counts = 20 + 500 * Math.exp(-0.5 * Math.pow((p - 30) / 1.5, 2));
            text.append(p).append(',').append(String.format(java.util.Locale.ROOT, "%.3f", counts)).append(',')
                    .append(String.format(java.util.Locale.ROOT, "%.3f", Math.sqrt(counts))).append('\n');
        }
        return text.toString();
    }

    private static String spectrumJson() {
        StringBuilder text = new StringBuilder("{\n\"format\": \"ritzwerk-spectrum\",\n\"version\": 1,\n\"counts\": [\n");
        for (int p = 0; p < 64; p++) {
            text.append(10 + p % 5).append(p < 63 ? ",\n" : "\n");
        }
        return text.append("]\n}\n").toString();
    }

    private static String continuum() {
        StringBuilder text = new StringBuilder("wavelength_nm,density\n");
        for (int nm = 590; nm <= 710; nm += 10) {
            text.append(nm).append(',').append(1 + (nm - 590) / 100.0).append('\n');
        }
        return text.toString();
    }

    private static String resource(String path) throws IOException {
        return Files.readString(Path.of("..", "refdata", "src", "main", "resources", "org", "ritzwerk", "refdata")
                .resolve(path), StandardCharsets.UTF_8);
    }

    // --- one test per reader ---

    @Test
    void peakFiles(@TempDir Path dir) throws IOException {
        fuzz(dir, "peaks.csv", PEAKS_CSV, 101, f -> args("identify", f, "--species", "H", "--model", "bohr",
                "--n-max", "8", "--tolerance", "0.05 nm"));
        fuzz(dir, "peaks.json", PEAKS_JSON, 102, f -> args("identify", f, "--species", "H", "--model", "bohr",
                "--n-max", "8"));
    }

    @Test
    void spectrumFiles(@TempDir Path dir) throws IOException {
        Path calibration = dir.resolve("fixed-calibration.json");
        Files.writeString(calibration, CALIBRATION);
        fuzz(dir, "spectrum.csv", spectrumCsv(), 201, f -> args("calibrate", f, "--apply", calibration.toString()));
        fuzz(dir, "spectrum.json", spectrumJson(), 202, f -> args("calibrate", f, "--apply", calibration.toString()));
    }

    @Test
    void calibrationFiles(@TempDir Path dir) throws IOException {
        Path spectrum = dir.resolve("fixed-spectrum.csv");
        Files.writeString(spectrum, spectrumCsv());
        fuzz(dir, "calibration.json", CALIBRATION, 301, f -> args("calibrate", spectrum.toString(), "--apply", f));
    }

    @Test
    void lineAndLevelLists(@TempDir Path dir) throws IOException {
        fuzz(dir, "lines.csv", CliTest.run("data", "show", "lamp-ne-i", "--format", "csv").out(), 401,
                f -> args("data", "check", f));
        fuzz(dir, "lines.json", CliTest.run("data", "show", "lamp-hg-i", "--format", "json").out(), 402,
                f -> args("data", "check", f));
        fuzz(dir, "levels.csv", CliTest.run("data", "show", "levels-rb-87", "--format", "csv").out(), 403,
                f -> args("data", "check", f));
        fuzz(dir, "levels.json", CliTest.run("data", "show", "levels-na-23", "--format", "json").out(), 404,
                f -> args("data", "check", f));
        // A line list used as candidates is read by the same reader.
        Path peaks = dir.resolve("fixed-peaks.csv");
        Files.writeString(peaks, PEAKS_CSV);
        fuzz(dir, "candidates.csv", CliTest.run("data", "show", "lamp-ne-i", "--format", "csv").out(), 405,
                f -> args("identify", peaks.toString(), "--lines", f, "--tolerance", "0.05 nm"));
        // A measured Rydberg series, read by the series command's reader.
        fuzz(dir, "series.csv", Files.readString(Path.of("src", "test", "resources", "org", "ritzwerk", "cli",
                "series-rb-87.csv"), StandardCharsets.UTF_8), 406, f -> args("series", f, "--predict", "60"));
    }

    @Test
    void quantumDefectsAndIsotopes(@TempDir Path dir) throws IOException {
        fuzz(dir, "defects.csv", resource("rydberg/quantum-defects-rb-87.csv"), 501, f -> args("data", "check", f));
        fuzz(dir, "isotopes.csv", resource("nuclear/isotopes.csv"), 502, f -> args("data", "check", f));
        // Given with --data, a quantum-defect set reaches the Rydberg levels.
        fuzz(dir, "data-defects.csv", resource("rydberg/quantum-defects-rb-87.csv"), 503,
                f -> args("levels", "--species", "Rb-87 I", "--n-max", "8", "--data", f));
    }

    @Test
    void continuumAndQuantityLists(@TempDir Path dir) throws IOException {
        fuzz(dir, "continuum.csv", continuum(), 601, f -> args("synth", "--species", "H", "--from", "600 nm", "--to",
                "700 nm", "--pixels", "50", "--temperature", "10000", "--no-noise", "--continuum-file", f));
        fuzz(dir, "quantities.txt", QUANTITIES, 602, f -> args("convert", "--input", f, "--to", "THz", "--to", "nm"));
    }

    /**
     * The readers no command uses (synthetic-spectrum documents and truth tables, read back by
     * library users): a mutant either reads or fails with the project's exception, whose message
     * holds no NaN or Infinity the input did not.
     */
    @Test
    void syntheticSpectrumAndTruthFiles(@TempDir Path dir) throws IOException {
        Path json = dir.resolve("scene.json");
        Path truth = dir.resolve("truth.csv");
        CliTest.Run synth = CliTest.run("synth", "--species", "H", "--from", "640 nm", "--to", "670 nm", "--pixels", "30",
                "--temperature", "10000", "--seed", "3", "--format", "json", "--out", json.toString(), "--truth",
                truth.toString());
        assertEquals(0, synth.code(), synth.err());
        readerHolds(Files.readString(json), 801, text -> org.ritzwerk.refdata.SyntheticSpectrumFiles.readJson(text, "m"));
        readerHolds(Files.readString(truth), 802, text -> org.ritzwerk.refdata.SpectrumLineFiles.read(text, "m"));
    }

    private static void readerHolds(String valid, long seed, java.util.function.Consumer<String> reader) {
        reader.accept(valid);
        Random random = new Random(seed + SEED);
        for (int k = 0; k < MUTANTS; k++) {
            String mutant = new String(mutate(valid.getBytes(StandardCharsets.UTF_8), random), StandardCharsets.UTF_8);
            try {
                reader.accept(mutant);
            } catch (org.ritzwerk.RitzwerkException e) {
                Set<String> inputTokens = tokens(mutant);
                for (String token : tokens(e.getMessage())) {
                    if ((token.contains("NaN") || token.contains("Infinity")) && !inputTokens.contains(token)) {
                        throw new AssertionError("'" + token + "' that the input did not hold: " + e.getMessage());
                    }
                }
            } catch (RuntimeException e) {
                throw new AssertionError("not the project's input error, for the mutant:\n" + mutant, e);
            }
        }
    }

    /** Numeric options of every command, each with the nasty values and seeded random ones. */
    @Test
    void numericOptions(@TempDir Path dir) throws IOException {
        Path peaks = dir.resolve("peaks.csv");
        Files.writeString(peaks, PEAKS_CSV);
        Path spectrum = dir.resolve("spectrum.csv");
        Files.writeString(spectrum, spectrumCsv());
        String[] identify = {"identify", peaks.toString(), "--species", "H", "--model", "bohr"};
        String[] plasma = {"identify", peaks.toString(), "--species", "H", "--model", "bohr", "--n-max", "8",
            "--plasma"};
        String[] calibrate = {"calibrate", spectrum.toString(), "--lamp", "Ne I"};
        String[] synth = {"synth", "--species", "H", "--from", "640 nm", "--to", "670 nm", "--pixels", "40",
            "--temperature", "10000"};
        String[] lines = {"lines", "--species", "H", "--from", "640 nm", "--to", "670 nm"};
        String[] alkali = {"levels", "--species", "Rb-87 I", "--n-max", "7", "--lifetimes"};
        String[] hyperfine = {"lines", "--species", "Rb-87 I", "--hyperfine"};
        String[] zeeman = {"lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "1e-4"};
        Path series = dir.resolve("fixed-series.csv");
        Files.copy(Path.of("src", "test", "resources", "org", "ritzwerk", "cli", "series-rb-87.csv"), series);
        String[] fit = {"series", series.toString()};
        String[] polarizability = {"rydberg", "polarizability", "--species", "Rb-87 I", "--state", "40s1/2"};
        String[] starkMap = {"rydberg", "stark-map", "--species", "Rb-87 I", "--state", "30s1/2", "--l-max", "4",
            "--steps", "3"};
        String[] pair = {"rydberg", "pair", "--species", "Rb-87 I", "--state", "40s1/2"};
        String[] microwave = {"rydberg", "microwave", "--species", "Rb-87 I", "--state", "40s1/2", "--to",
            "40p3/2"};
        Object[][] cases = {
            {identify, "--n-max"}, {identify, "--search-velocity"}, {identify, "--search-offset"},
            {identify, "--excitation-temperature"}, {identify, "--tolerance"}, {plasma, "--instrument-fwhm"},
            {plasma, "--resolving-power"},
            {calibrate, "--threshold"}, {calibrate, "--tolerance"}, {calibrate, "--min-matched"}, {calibrate, "--clip"},
            {calibrate, "--saturation"}, {calibrate, "--max-degree"}, {calibrate, "--degree"},
            {calibrate, "--dispersion-range"},
            {synth, "--temperature"}, {synth, "--velocity"}, {synth, "--collisional-width"},
            {synth, "--resolving-power"}, {synth, "--pixels"}, {synth, "--n-max"}, {synth, "--peak-counts"},
            {synth, "--read-noise"}, {synth, "--electron-density"}, {synth, "--threads"}, {synth, "--dispersion"},
            {lines, "--n-max"}, {lines, "--min-a"}, {alkali, "--temperature"}, {alkali, "--l-max"},
            {hyperfine, "--field-tesla"}, {zeeman, "--field-uncertainty-tesla"},
            {fit, "--predict"}, {fit, "--max-terms"}, {polarizability, "--range"}, {starkMap, "--field-max"},
            {starkMap, "--window"}, {pair, "--rabi"}, {pair, "--angle"}, {pair, "--range"},
            {microwave, "--field"}, {microwave, "--splitting"}, {microwave, "--near"},
            {new String[] {"convert", "656.28 nm", "--to", "THz"}, "--digits"},
            {new String[] {"convert", "--to", "THz"}, null}};
        Random random = new Random(701 + SEED);
        Map<Path, byte[]> before = snapshot(dir);
        for (Object[] c : cases) {
            String[] base = (String[]) c[0];
            String option = (String) c[1];
            List<String> values = new ArrayList<>(List.of("NaN", "Infinity", "-1", "0", "1e400", "4.9e-324",
                    "2147483648"));
            values.add(String.valueOf(Math.pow(10, -300 + 600 * random.nextDouble()) * (random.nextBoolean() ? 1 : -1)));
            for (String value : values) {
                String[] args = option == null ? concat(base, value + " nm") : concat(base, option, value);
                if (option != null && option.equals("--tolerance") && base == identify) {
                    args = concat(base, option, value + " nm");
                }
                holds(args, dir, before, String.join(" ", args));
            }
        }
    }

    // --- what the fuzzing found, kept as plain regression tests ---

    @Test
    void aContinuumWithHugeDensitiesIsScaledNotOverflowed(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("continuum.csv");
        Files.writeString(file, continuum().replace("690,2.0", "690,1e308"));
        CliTest.Run run = CliTest.run("synth", "--species", "H", "--from", "600 nm", "--to", "700 nm", "--pixels", "50",
                "--temperature", "10000", "--no-noise", "--continuum-file", file.toString());
        assertEquals(0, run.code(), run.err());
        assertFalse(run.out().contains("Infinity") || run.out().contains("NaN"), run.out());
        // A huge density beyond the range does not push the densities inside below the smallest double.
        Files.writeString(file, continuum().replace("710,2.2", "710,1e308")
                .replaceAll("\n(6\\d0),[0-9.]+", "\n$1,1e-300"));
        CliTest.Run far = CliTest.run("synth", "--species", "H", "--from", "600 nm", "--to", "700 nm", "--pixels", "50",
                "--temperature", "10000", "--no-noise", "--continuum-file", file.toString());
        assertEquals(0, far.code(), far.err());
        assertFalse(far.out().contains("Infinity") || far.out().contains("NaN"), far.out());
    }

    @Test
    void numbersBeyondADoubleAreNamedInWords(@TempDir Path dir) throws IOException {
        Path peaks = dir.resolve("peaks.json");
        Files.writeString(peaks, PEAKS_JSON.replace("\"formatVersion\": 1", "\"formatVersion\": 1e400"));
        CliTest.Run version = CliTest.run("identify", peaks.toString(), "--species", "H");
        assertEquals(2, version.code(), version.err());
        assertTrue(version.err().contains("'formatVersion' must be 1, got a number too large for a double"),
                version.err());
        CliTest.Run overflow = CliTest.run("convert", "1e-300 nm", "--to", "THz");
        assertEquals(2, overflow.code(), overflow.err());
        assertTrue(overflow.err().contains("got a value too large for a double") && !overflow.err().contains("Infinity"),
                overflow.err());
        CliTest.Run underflow = CliTest.run("convert", "4.9e-324 nm", "--to", "THz");
        assertEquals(2, underflow.code(), underflow.err());
        assertTrue(underflow.err().contains(" nm is too small for a double in SI units"), underflow.err());
    }

    @Test
    void anUnreadableCorePolarizabilityIsReportedOnce(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("defects.csv");
        String valid = resource("rydberg/quantum-defects-rb-87.csv");
        Files.writeString(file, valid.replaceFirst("# core-dipole-polarizability-au: [^\\n]*",
                "# core-dipole-polarizability-au: heavy"));
        CliTest.Run run = CliTest.run("data", "check", file.toString());
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().startsWith("1 problem in ") && run.err().contains("core-dipole-polarizability-au is not a"
                + " finite number: 'heavy'") && !run.err().contains("NaN"), run.err());
    }

    // --- the machinery ---

    private static String[] args(String... args) {
        return args;
    }

    private static String[] concat(String[] a, String... b) {
        String[] all = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, all, a.length, b.length);
        return all;
    }

    /**
     * Runs the command on the valid file (it must succeed, so the fixture is known good) and then
     * on {@link #MUTANTS} mutants of it, made with the given seed.
     */
    private static void fuzz(Path dir, String name, String valid, long seed, Function<String, String[]> command)
            throws IOException {
        Path file = dir.resolve(name);
        Files.writeString(file, valid);
        CliTest.Run good = CliTest.run(command.apply(file.toString()));
        assertEquals(0, good.code(), name + " (the valid fixture): " + good.err());
        Random random = new Random(seed + SEED);
        for (int k = 0; k < MUTANTS; k++) {
            byte[] mutant = mutate(valid.getBytes(StandardCharsets.UTF_8), random);
            Files.write(file, mutant);
            Map<Path, byte[]> before = snapshot(dir);
            String input = new String(mutant, StandardCharsets.ISO_8859_1);
            holds(command.apply(file.toString()), dir, before, input + " " + String.join(" ",
                    command.apply(file.toString())));
        }
    }

    /** One run holds the contract. */
    private static void holds(String[] args, Path dir, Map<Path, byte[]> before, String input) throws IOException {
        CliTest.Run run = CliTest.run(args);
        String what = String.join(" ", args) + "\n--- stdout:\n" + head(run.out()) + "\n--- stderr:\n" + run.err();
        assertTrue(run.code() == 0 || run.code() == 2, "exit " + run.code() + ": " + what);
        assertFalse(run.err().contains("Exception") || run.err().contains("\tat ") || run.err().contains("internal error"),
                what);
        Set<String> inputTokens = tokens(input);
        for (String token : tokens(run.out() + "\n" + run.err())) {
            if ((token.contains("NaN") || token.contains("Infinity")) && !inputTokens.contains(token)) {
                throw new AssertionError("'" + token + "' that the input did not hold: " + what);
            }
        }
        Map<Path, byte[]> after = snapshot(dir);
        assertEquals(before.keySet(), after.keySet(), "files appeared or vanished: " + what);
        for (Path path : before.keySet()) {
            assertArrayEquals(before.get(path), after.get(path), path + " changed: " + what);
        }
    }

    private static String head(String text) {
        return text.length() > 2000 ? text.substring(0, 2000) + "..." : text;
    }

    /** Words of a text, split at anything but letters, digits, dots, signs. */
    private static Set<String> tokens(String text) {
        return new HashSet<>(Arrays.asList(text.split("[^A-Za-z0-9.+\\-]+")));
    }

    private static Map<Path, byte[]> snapshot(Path dir) throws IOException {
        Map<Path, byte[]> files = new TreeMap<>();
        try (Stream<Path> list = Files.list(dir)) {
            for (Path path : (Iterable<Path>) list::iterator) {
                files.put(path, Files.isRegularFile(path) ? Files.readAllBytes(path) : new byte[0]);
            }
        }
        return files;
    }

    /** One or two random mutations of a file. */
    static byte[] mutate(byte[] valid, Random random) {
        byte[] bytes = valid;
        int count = 1 + random.nextInt(2);
        for (int m = 0; m < count; m++) {
            bytes = mutateOnce(bytes, random);
        }
        return bytes;
    }

    private static byte[] mutateOnce(byte[] bytes, Random random) {
        String text = new String(bytes, StandardCharsets.UTF_8);
        List<String> lines = new ArrayList<>(Arrays.asList(text.split("\n", -1)));
        int row = random.nextInt(lines.size());
        String line = lines.get(row);
        switch (random.nextInt(8)) {
            case 0 -> lines.set(row, line.substring(0, line.isEmpty() ? 0 : random.nextInt(line.length())));
            case 1 -> {
                List<String> fields = new ArrayList<>(Arrays.asList(line.split(",", -1)));
                fields.remove(random.nextInt(fields.size()));
                lines.set(row, String.join(",", fields));
            }
            case 2 -> {
                String[] fields = line.split(",", -1);
                int a = random.nextInt(fields.length);
                int b = random.nextInt(fields.length);
                String t = fields[a];
                fields[a] = fields[b];
                fields[b] = t;
                lines.set(row, String.join(",", fields));
            }
            case 3 -> {
                // Replace one number of the file with a nasty value.
                java.util.regex.Matcher numbers = java.util.regex.Pattern.compile("-?\\d+(\\.\\d+)?([eE][-+]?\\d+)?")
                        .matcher(text);
                List<int[]> spans = new ArrayList<>();
                while (numbers.find()) {
                    spans.add(new int[] {numbers.start(), numbers.end()});
                }
                if (spans.isEmpty()) {
                    return bytes;
                }
                int[] span = spans.get(random.nextInt(spans.size()));
                return (text.substring(0, span[0]) + NASTY[random.nextInt(NASTY.length)] + text.substring(span[1]))
                        .getBytes(StandardCharsets.UTF_8);
            }
            case 4 -> {
                int at = random.nextInt(bytes.length + 1);
                byte[] insert = BYTES[random.nextInt(BYTES.length)];
                ByteArrayOutputStream out = new ByteArrayOutputStream();
                out.write(bytes, 0, at);
                out.write(insert, 0, insert.length);
                out.write(bytes, at, bytes.length - at);
                return out.toByteArray();
            }
            case 5 -> lines.remove(row);
            case 6 -> lines.add(row, line);
            default -> {
                return Arrays.copyOf(bytes, random.nextInt(bytes.length + 1));
            }
        }
        return String.join("\n", lines).getBytes(StandardCharsets.UTF_8);
    }
}
