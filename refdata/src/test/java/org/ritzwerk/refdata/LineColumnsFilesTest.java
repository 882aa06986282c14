package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineColumns;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Renderer;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;

/**
 * Line lists read as columns ({@link LineListFiles#readColumns}) against the same files read
 * whole ({@link LineListFiles#read(Path, DataKind)}): the same rows, the same problems, and a scene
 * rendered from either the same spectrum and truth table, bit for bit and byte for byte.
 */
class LineColumnsFilesTest {

    @TempDir
    Path folder;

    @Test
    void aGeneratedFileReadsAsColumnsAsItReadsWhole() {
        Path file = generated("generated.csv", 20_000, 11L);
        LineList whole = LineListFiles.read(file, DataKind.LINES);
        LineColumns columns = LineListFiles.readColumns(file, DataKind.LINES);
        assertEquals(whole.size(), columns.size());
        assertEquals(whole.coveredSpecies(), columns.coveredSpecies());
        assertEquals(whole.unit(), columns.unit());
        assertEquals(whole.medium(), columns.medium());
        assertEquals(whole.info().id(), columns.id());
        for (int i = 0; i < whole.size(); i++) {
            assertEquals(whole.species(i), columns.species(i), "line " + i);
            assertEquals(Double.doubleToLongBits(whole.position(i)), Double.doubleToLongBits(columns.position(i)));
            assertEquals(Double.doubleToLongBits(whole.intensity(i).orElse(Double.NaN)),
                    Double.doubleToLongBits(columns.intensity(i)), "line " + i);
        }
    }

    /** A scene from the columns gives the same lines, counts and truth file as from the list, for both renderers. */
    @Test
    void aSceneFromColumnsRendersAsTheSceneFromTheList() throws IOException {
        Path file = generated("scene.csv", 3_000, 12L);
        DataContext data = DataContext.builtIn();
        LineList whole = LineListFiles.read(file, DataKind.LINES);
        LineColumns columns = LineListFiles.readColumns(file, DataKind.LINES);
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(data.nucleus(Species.parse("H I")), Tier.DIRAC);
        for (Renderer renderer : Renderer.values()) {
            Scene fromList = scene(renderer, hydrogen).lineList(whole, data::nucleus).build();
            Scene fromColumns = scene(renderer, hydrogen).lineColumns(columns, data::nucleus).build();
            assertEquals(fromList.lines().size(), fromColumns.lines().size());
            for (int i = 0; i < fromList.lines().size(); i++) {
                assertEquals(fromList.lines().label(i), fromColumns.lines().label(i));
                assertEquals(fromList.lines().photons(i), fromColumns.lines().photons(i), 0.0);
                assertEquals(fromList.lines().gaussianFwhm(i), fromColumns.lines().gaussianFwhm(i), 0.0);
            }
            SyntheticSpectrum a = fromList.render(1);
            SyntheticSpectrum b = fromColumns.render(2);
            assertArrayEquals(a.counts(), b.counts(), renderer.name());
            assertEquals(truth(a), truth(b), renderer.name());
        }
    }

    @Test
    void badRowsGiveTheSameProblemsBothWays() throws IOException {
        String text = "# ritzwerk-lines 1\n# id: bad\n# title: t\n# source: s\n# provenance: measured\n# version: 1\n"
                + "# position-unit: nm\n# medium: air\nspecies,position,intensity,strength,lower,upper\n"
                + "Xx I,500,1,,,\n"            // 10: unknown species
                + "Ne I,five,1,,,\n"          // 11: not a number
                + "Ne I,-3,1,,,\n"            // 12: negative
                + "Ne I,501,1,loud,,\n"       // 13: unknown strength
                + "Ne I,502,1,,a,b\n"
                + "Ne I,502,1,,a,c\n"          // 15: same position, other levels: kept
                + "Ne I,502,2,,a,b\n"          // 16: duplicate of 14
                + "Ne I,0,1,,,\n";             // 17: not positive
        Path file = folder.resolve("bad.csv");
        Files.writeString(file, text, StandardCharsets.UTF_8);
        assertEquals(problems(() -> LineListFiles.read(file, DataKind.LINES)),
                problems(() -> LineListFiles.readColumns(file, DataKind.LINES)));
        assertEquals(List.of("10:1 data.unknown-species", "11:2 data.not-a-number", "12:2 data.negative",
                "13:4 data.unknown-strength", "16:2 data.duplicate", "17:2 data.not-positive"),
                problems(() -> LineListFiles.readColumns(file, DataKind.LINES)));
    }

    /**
     * Damaged copies of a good file (cut short, a span deleted, garbage characters inserted, a
     * field emptied, a line doubled; seeded) read alike both ways: the same lines, or the same
     * problems (line and code).
     */
    @Test
    void damagedFilesReadAlikeBothWays() throws IOException {
        String good = Files.readString(generated("good.csv", 40, 14L));
        org.quicktheories.QuickTheory.qt().withFixedSeed(15L).withExamples(300)
                .forAll(org.quicktheories.generators.SourceDSL.integers().between(0, 4),
                        org.quicktheories.generators.SourceDSL.longs().all())
                .checkAssert((kind, seed) -> {
                    java.util.Random random = new java.util.Random(seed);
                    int at = random.nextInt(good.length());
                    String text = switch (kind) {
                        case 0 -> good.substring(0, at);
                        case 1 -> good.substring(0, at) + good.substring(Math.min(good.length(), at + 1
                                + random.nextInt(30)));
                        case 2 -> good.substring(0, at) + (char) (random.nextInt(0x250) + 1)
                                + (char) (random.nextInt(0x7e) + 1) + good.substring(at);
                        case 3 -> good.replaceFirst("," + (random.nextInt(9) + 1), ",,");
                        default -> {
                            int start = good.lastIndexOf('\n', at) + 1;
                            int end = good.indexOf('\n', at);
                            yield end < 0 ? good : good.substring(0, end + 1) + good.substring(start);
                        }
                    };
                    Path file = folder.resolve("damaged.csv");
                    try {
                        Files.writeString(file, text, StandardCharsets.UTF_8);
                    } catch (IOException e) {
                        throw new UncheckedIOException(e);
                    }
                    assertEquals(outcome(() -> columnsOf(LineListFiles.read(file, DataKind.LINES))),
                            outcome(() -> columnsOf(LineListFiles.readColumns(file, DataKind.LINES))), text);
                });
    }

    private static String columnsOf(LineList list) {
        return columnsOf(LineListFiles.columnsOf(list));
    }

    private static String columnsOf(LineColumns columns) {
        StringBuilder out = new StringBuilder(columns.unit() + " " + columns.medium() + "\n");
        for (int i = 0; i < columns.size(); i++) {
            out.append(columns.species(i)).append(' ').append(columns.position(i)).append(' ')
                    .append(columns.intensity(i)).append('\n');
        }
        return out.toString();
    }

    private static String outcome(java.util.function.Supplier<String> read) {
        try {
            return read.get();
        } catch (DataFileException e) {
            return e.problems().stream().map(p -> p.line() + " " + p.code()).collect(Collectors.joining("; "));
        }
    }

    @Test
    void badHeadersAndBytesAreReportedWithTheirLine() throws IOException {
        Path noMedium = folder.resolve("no-medium.csv");
        Files.writeString(noMedium, "# ritzwerk-lines 1\n# id: x\n# title: t\n# source: s\n# provenance: measured\n"
                + "# version: 1\n# position-unit: nm\nspecies,position,intensity\nNe I,500,1\n");
        assertEquals(problems(() -> LineListFiles.read(noMedium, DataKind.LINES)),
                problems(() -> LineListFiles.readColumns(noMedium, DataKind.LINES)));
        // Regression (damagedFilesReadAlikeBothWays, seed 15): a file cut short after its header, ending
        // in a line break, reports the missing column row on the same line both ways.
        Path headerOnly = folder.resolve("header-only.csv");
        Files.writeString(headerOnly, "# ritzwerk-lines 1\n# id: x\n");
        assertEquals(problems(() -> LineListFiles.read(headerOnly, DataKind.LINES)),
                problems(() -> LineListFiles.readColumns(headerOnly, DataKind.LINES)));
        Path bytes = folder.resolve("bytes.csv");
        byte[] good = ("# ritzwerk-lines 1\n# id: x\n# title: t\n# source: s\n# provenance: measured\n# version: 1\n"
                + "# position-unit: cm-1\nspecies,position,intensity\nNe I,500,1\nNe I,5").getBytes(StandardCharsets.UTF_8);
        byte[] broken = java.util.Arrays.copyOf(good, good.length + 2);
        broken[good.length] = (byte) 0xff;
        broken[good.length + 1] = '\n';
        Files.write(bytes, broken);
        assertEquals(problems(() -> LineListFiles.read(bytes, DataKind.LINES)),
                problems(() -> LineListFiles.readColumns(bytes, DataKind.LINES)));
        assertEquals(List.of("10:7 data.not-utf8"), problems(() -> LineListFiles.readColumns(bytes, DataKind.LINES)));
        DataFileException folderRefused = assertThrows(DataFileException.class,
                () -> LineListFiles.readColumns(folder, DataKind.LINES));
        assertEquals(DataFileException.UNREADABLE, folderRefused.code());
    }

    @Test
    void aJsonFileReadsAsColumnsThroughTheWholeReader() throws IOException {
        LineList whole = LineListFiles.read(generated("for-json.csv", 50, 13L), DataKind.LINES);
        Path json = folder.resolve("list.json");
        Files.writeString(json, LineListFiles.writeJson(whole));
        LineColumns columns = LineListFiles.readColumns(json, DataKind.LINES);
        assertEquals(whole.size(), columns.size());
        assertEquals(whole.position(49), columns.position(49), 0.0);
    }

    private static Scene.Builder scene(Renderer renderer, HydrogenLikeModel hydrogen) {
        return Scene.builder(PixelGrid.linear(600, 700, 20_000)).hydrogenLike(Species.parse("H I"), hydrogen, 1)
                .temperature(8000).medium(Medium.air()).instrument(Instrument.ofResolvingPower(20_000))
                .renderer(renderer);
    }

    private static String truth(SyntheticSpectrum spectrum) {
        StringWriter out = new StringWriter();
        try {
            SpectrumLineFiles.writeCsv(spectrum, out);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toString();
    }

    private static List<String> problems(Runnable read) {
        DataFileException e = assertThrows(DataFileException.class, read::run);
        return e.problems().stream().map(p -> p.line() + ":" + p.column() + " " + p.code()).collect(Collectors.toList());
    }

    /**
     * A line list of n lines of Ne I, Ar I and Fe II between 600 and 700 nm (air), seeded: a tenth
     * without an intensity, a fifth with levels, some with a strength or note.
     */
    private Path generated(String name, int n, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        StringBuilder text = new StringBuilder("# ritzwerk-lines 1\n# id: generated\n# title: generated lines\n"
                + "# source: the test's generator\n# provenance: computed\n# version: 1\n# position-unit: nm\n"
                + "# medium: air\nspecies,position,uncertainty,intensity,strength,einstein_a,lower,upper,note\n");
        String[] species = {"Ne I", "Ar I", "Fe II"};
        for (int i = 0; i < n; i++) {
            text.append(species[random.nextInt(3)]).append(',').append(600 + 100 * random.nextDouble()).append(',');
            text.append(random.nextInt(4) == 0 ? "0.001" : "").append(',');
            text.append(random.nextInt(10) == 0 ? "" : Double.toString(random.nextDouble(0, 1000))).append(',');
            text.append(random.nextInt(8) == 0 ? "strong" : "").append(',');
            text.append(random.nextInt(6) == 0 ? "1.5e7" : "").append(',');
            boolean levels = random.nextInt(5) == 0;
            text.append(levels ? "3s" : "").append(',').append(levels ? "3p" : "").append(',');
            text.append(random.nextInt(20) == 0 ? "\"a note, quoted\"" : "").append('\n');
        }
        Path file = folder.resolve(name);
        try {
            Files.writeString(file, text, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return file;
    }
}
