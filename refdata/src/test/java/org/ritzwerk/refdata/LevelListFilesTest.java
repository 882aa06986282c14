package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.integers;
import static org.quicktheories.generators.SourceDSL.lists;

import java.io.IOException;
import java.io.InputStream;
import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.quantity.Unit;

/** The level-table file format: defects reported with line and column; exact round trips. */
class LevelListFilesTest {

    @Test
    void reportsEveryBadRow() {
        DataFileException e;
        try (InputStream in = getClass().getResourceAsStream("/files/levels-bad-rows.csv")) {
            e = assertThrows(DataFileException.class, () -> LevelListFiles.read(in, "levels-bad-rows.csv"));
        } catch (IOException io) {
            throw new java.io.UncheckedIOException(io);
        }
        assertEquals(List.of("11:3 data.negative", "12:5 data.bad-j", "13:2 data.missing-value", "14:2 data.duplicate"),
                e.problems().stream().map(p -> p.line() + ":" + p.column() + " " + p.code()).collect(Collectors.toList()));
    }

    @Test
    void aJColumnThatDisagreesWithTheLabelIsReportedWhereItStands() {
        // 4s4p 3P1 has J = 1 in its label (term notation, common practice) but 2 beside it
        String text = "# ritzwerk-levels 1\n# id: x\n# title: t\n# source: s\n# provenance: measured\n# version: 1\n"
                + "# energy-unit: cm-1\nspecies,label,energy,uncertainty,j\nCa I,4s2 1S0,0,0,0\n"
                + "Ca I,4s4p 3P1,15210.063,0.001,2\n";
        DataFileException e = assertThrows(DataFileException.class, () -> LevelListFiles.read(
                new java.io.ByteArrayInputStream(text.getBytes(java.nio.charset.StandardCharsets.UTF_8)), "jm.csv"));
        assertEquals(List.of("10:5 data.bad-j"), e.problems().stream().map(p -> p.line() + ":" + p.column() + " "
                + p.code()).collect(Collectors.toList()));
        assertEquals(true, e.getMessage().contains("has J = 1 in its label but J = 2 beside it"), e.getMessage());
    }

    @Test
    void refusesANonEnergyUnit() {
        String text = "# ritzwerk-levels 1\n# id: x\n# title: t\n# source: s\n# provenance: measured\n# version: 1\n"
                + "# energy-unit: nm\nspecies,label,energy\nH I,1s,0\n";
        DataFileException e = assertThrows(DataFileException.class, () -> LevelListFiles.readCsv(text, "nm.csv"));
        assertEquals("nm.csv:7: unknown energy unit 'nm'; known: m-1, cm-1, J, eV, meV\n    # energy-unit: nm",
                e.getMessage().substring(e.getMessage().indexOf('\n') + 1));
    }

    @Test
    void writtenTablesReadBackBitForBit() {
        qt().withFixedSeed(42L).withExamples(150).forAll(lists().of(doubles().between(0, 1e7)).ofSizeBetween(0, 25),
                integers().between(0, 2)).checkAssert((energies, variant) -> {
                    Unit unit = variant == 0 ? Unit.PER_CENTIMETRE : variant == 1 ? Unit.ELECTRONVOLT : Unit.JOULE;
                    DataSetInfo info = new DataSetInfo("generated", DataKind.LEVELS, "generated table", "1",
                            Provenance.computedBy("the test's generator"), List.of());
                    LevelList.Builder builder = LevelList.builder(info, unit, variant == 2 ? "" : "a note, with comma");
                    for (int i = 0; i < energies.size(); i++) {
                        builder.add(Species.parse(i % 2 == 0 ? "He I" : "Li II"), "level " + i, energies.get(i),
                                i % 3 == 0 ? Double.NaN : energies.get(i) * 1e-9, i % 4 - 1, i % 5 == 0 ? "n" + i : null);
                    }
                    LevelList table = builder.build();
                    LevelList covered = table.withInfo(new DataSetInfo(info.id(), info.kind(), info.title(),
                            info.version(), info.provenance(), energies.isEmpty() ? List.of()
                                    : energies.size() == 1 ? List.of(Species.parse("He I"))
                                            : List.of(Species.parse("He I"), Species.parse("Li II"))));
                    assertEquals(covered, LevelListFiles.readCsv(LevelListFiles.writeCsv(table), "x.csv"));
                    assertEquals(covered, LevelListFiles.readJson(LevelListFiles.writeJson(table), "x.json"));
                });
    }
}
