package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.arbitrary;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.integers;
import static org.quicktheories.generators.SourceDSL.lists;
import static org.quicktheories.generators.SourceDSL.longs;
import static org.quicktheories.generators.SourceDSL.strings;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Random;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.quicktheories.core.Gen;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.medium.Ciddor1996;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/**
 * The line-list file format: good files read, every defect reported with line and column, and
 * what is written reads back bit for bit. Fixtures under {@code files/} are named after their
 * defect; malformed files are also generated with QuickTheories from fixed seeds.
 */
class LineListFilesTest {

    @Test
    void readsAGoodCsvFile() {
        LineList list = fixture("lines-good.csv");
        assertEquals("bench-ne-2026", list.info().id());
        assertEquals(DataKind.LINES, list.info().kind());
        assertEquals(Provenance.Kind.MEASURED, list.info().provenance().kind());
        assertEquals(Unit.NANOMETRE, list.unit());
        assertEquals(Medium.air(), list.medium());
        assertEquals(3, list.size());
        assertEquals(585.24879, list.position(0), 0.0);
        assertEquals(2e-5, list.uncertainty(0).getAsDouble(), 0.0);
        assertEquals(StrengthClass.STRONG, list.strength(1));
        assertEquals(1.4e7, list.einsteinA(1).getAsDouble(), 0.0);
        assertEquals("a note, with a comma", list.rowNote(1));
        assertFalse(list.intensity(2).isPresent());
        assertEquals(List.of(Species.parse("Ne I"), Species.parse("He II")), list.info().species());
    }

    @Test
    void readsAGoodJsonFile() {
        LineList list = fixture("lines-good.json");
        assertEquals(Unit.TERAHERTZ, list.unit());
        assertEquals(null, list.medium());
        assertEquals(430.42, list.position(0), 0.0);
        assertEquals(StrengthClass.WEAK, list.strength(1));
    }

    @Test
    void reportsAMissingMedium() {
        DataFileException e = refused("lines-missing-medium.csv");
        assertEquals(1, e.problems().size());
        assertEquals("data.missing-medium", e.problems().get(0).code());
        assertEquals(7, e.problems().get(0).line());
    }

    @Test
    void reportsEveryBadRowAtOnce() {
        DataFileException e = refused("lines-every-row-bad.csv");
        List<String> codes = e.problems().stream().map(p -> p.line() + ":" + p.column() + " " + p.code())
                .collect(Collectors.toList());
        assertEquals(List.of("9:1 data.unknown-species", "10:2 data.not-a-number", "11:2 data.negative",
                "12:2 data.not-finite", "13:3 data.negative", "14:5 data.unknown-strength", "16:2 data.duplicate"),
                codes);
        assertTrue(e.getMessage().startsWith("7 problems in lines-every-row-bad.csv:\n"), e.getMessage());
        assertTrue(e.getMessage().contains("lines-every-row-bad.csv:16:2: column position: duplicate of the line on "
                + "line 15 (same species, position and levels)\n    Ne I,17002,,,"), e.getMessage());
    }

    @Test
    void reportsWrongJsonTypes() {
        DataFileException e = refused("lines-wrong-types.json");
        List<String> reasons = e.problems().stream().map(p -> p.line() + " " + p.code()).collect(Collectors.toList());
        assertEquals(List.of("10 data.medium-not-allowed", "12 data.wrong-type", "13 data.wrong-type",
                "14 data.unknown-field"), reasons);
    }

    @Test
    void writtenFilesReadBackBitForBit() {
        qt().withFixedSeed(20261201L).withExamples(200).forAll(lineLists()).checkAssert(list -> {
            assertEquals(list, LineListFiles.readCsv(LineListFiles.writeCsv(list), "x.csv", DataKind.LINES));
            assertEquals(list, LineListFiles.readJson(LineListFiles.writeJson(list), "x.json", DataKind.LINES));
        });
    }

    @Test
    void malformedFilesAlwaysGiveAReportNeverAnotherException() {
        String good = LineListFiles.writeCsv(fixture("lines-good.csv"));
        String goodJson = LineListFiles.writeJson(fixture("lines-good.csv"));
        qt().withFixedSeed(7L).withExamples(400)
                .forAll(arbitrary().pick(List.of(good, goodJson)), integers().between(0, 5), longs().all())
                .checkAssert((text, damage, seed) -> {
                    String broken = damage(text, damage, new Random(seed));
                    try {
                        LineListFiles.read(new java.io.ByteArrayInputStream(broken.getBytes(StandardCharsets.UTF_8)),
                                text == good ? "broken.csv" : "broken.json", DataKind.LINES);
                    } catch (DataFileException e) {
                        assertFalse(e.getMessage().isBlank());
                        e.problems().forEach(p -> assertTrue(p.line() >= 1));
                    }
                });
        // Garbage bytes that are not UTF-8.
        DataFileException bytes = assertThrows(DataFileException.class, () -> LineListFiles.read(
                new java.io.ByteArrayInputStream(new byte[] {(byte) 0xff, (byte) 0xfe, 0, 1}), "bytes.csv", DataKind.LINES));
        assertEquals("data.not-utf8", bytes.problems().get(0).code());
    }

    @Test
    void hugeJsonIntegerIsReportedNotThrown() {
        // Regression: found by malformedFilesAlwaysGiveAReportNeverAnotherException (seed 7).
        String json = LineListFiles.writeJson(fixture("lines-good.csv")).replaceFirst("585\\.24879", "9".repeat(400));
        DataFileException e = assertThrows(DataFileException.class,
                () -> LineListFiles.readJson(json, "huge.json", DataKind.LINES));
        assertEquals("data.not-finite", e.problems().get(0).code());
    }

    @Test
    void refusesFilesAboveTheRowLimit() {
        StringBuilder text = new StringBuilder("# ritzwerk-lines 1\n# id: big\n# title: t\n# source: s\n"
                + "# provenance: measured\n# version: 1\n# position-unit: cm-1\nspecies,position\n");
        for (int i = 1; i <= LineListFiles.MAX_ROWS + 1; i++) {
            text.append("H I,").append(i).append('\n');
        }
        DataFileException e = assertThrows(DataFileException.class,
                () -> LineListFiles.readCsv(text.toString(), "big.csv", DataKind.LINES));
        assertEquals(DataFileException.TOO_LARGE, e.problems().get(e.problems().size() - 1).code());
    }

    /** One of six kinds of damage: truncation, a deleted span, garbage, a huge number, a unit swap, a type swap. */
    private static String damage(String text, int kind, Random random) {
        int at = random.nextInt(Math.max(text.length(), 1));
        switch (kind) {
            case 0:
                return text.substring(0, at);
            case 1:
                return text.substring(0, at) + text.substring(Math.min(text.length(), at + 1 + random.nextInt(20)));
            case 2:
                StringBuilder garbage = new StringBuilder();
                for (int i = 0; i < 1 + random.nextInt(12); i++) {
                    garbage.append((char) (random.nextInt(0x250) + 1));
                }
                return text.substring(0, at) + garbage + text.substring(at);
            case 3:
                return text.replaceFirst("585\\.24879", "9".repeat(400));
            case 4:
                return text.replace("nm", random.nextBoolean() ? "THz" : "K");
            default:
                return text.replaceFirst("585\\.24879", random.nextBoolean() ? "\"five\"" : "true");
        }
    }

    private static Gen<LineList> lineLists() {
        Gen<Double> positions = doubles().between(1e-300, 1e300).mix(doubles().between(100, 2000), 50);
        Gen<Double> optional = doubles().between(0, 1e10).mix(arbitrary().constant(Double.NaN), 40);
        Gen<List<Double>> column = lists().of(positions).ofSizeBetween(0, 20);
        Gen<Integer> variant = integers().between(0, 3);
        return column.zip(optional, variant, strings().basicLatinAlphabet().ofLengthBetween(0, 12),
                (values, extra, v, note) -> {
                    Unit unit = v == 0 ? Unit.NANOMETRE : v == 1 ? Unit.PER_CENTIMETRE : v == 2 ? Unit.ELECTRONVOLT
                            : Unit.ANGSTROM;
                    Medium medium = unit.kind() == org.ritzwerk.quantity.Kind.WAVELENGTH
                            ? (v == 0 ? Medium.air(new Ciddor1996(20, 101_325, 40, 450)) : Medium.vacuum()) : null;
                    String clean = note.replace('\n', ' ').replace('\r', ' ').strip();
                    DataSetInfo info = new DataSetInfo("generated-" + v, DataKind.LINES, "generated list", "1",
                            Provenance.computedBy("the test's generator"), List.of());
                    LineList.Builder builder = LineList.builder(info, unit, medium, clean.isEmpty() ? "" : clean);
                    for (int i = 0; i < values.size(); i++) {
                        // air wavelengths within the air model's range (the reader refuses others)
                        double x = v == 0 ? 310 + 60 * i + values.get(i) % 40 : values.get(i);
                        builder.add(Species.parse(i % 2 == 0 ? "H I" : "He II"), x + i * Math.ulp(x),
                                extra, i % 3 == 0 ? Double.NaN : extra, i % 4 == 0 ? StrengthClass.MEDIUM : null,
                                i % 5 == 0 ? extra : Double.NaN, clean.isEmpty() ? null : clean + "l", null,
                                i % 2 == 0 ? null : "n, \"" + clean + "\"");
                    }
                    LineList list = builder.build();
                    return list.withInfo(new DataSetInfo(info.id(), info.kind(), info.title(), info.version(),
                            info.provenance(), list.coveredSpecies()));
                });
    }

    private static LineList fixture(String name) {
        try (InputStream in = LineListFilesTest.class.getResourceAsStream("/files/" + name)) {
            return LineListFiles.read(in, name, DataKind.LINES);
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    private static DataFileException refused(String name) {
        return assertThrows(DataFileException.class, () -> fixture(name));
    }
}
