package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.lists;

import java.io.InputStreamReader;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Quantity;
import org.ritzwerk.quantity.QuantityParseException;
import org.ritzwerk.quantity.QuantityText;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;

/** Reading quantity lists: every line read or reported, nothing altered. */
class QuantityListReaderTest {

    private final QuantityListReader reader = new QuantityListReader(QuantityText.standard());

    @Test
    void readsEveryLineInOrderSkippingComments() {
        List<QuantityListReader.Entry> entries = reader.read(fixture("quantities-good.txt"), "quantities-good.txt");
        assertEquals(List.of(2, 4, 5, 6, 7), entries.stream().map(QuantityListReader.Entry::line)
                .collect(Collectors.toList()));
        assertEquals(Wavelength.of(412.337, 0.004, Unit.NANOMETRE, Medium.air()), entries.get(0).quantity());
        assertEquals("   518.6 THz", entries.get(3).raw());
    }

    @Test
    void reportsEveryBadLineAtOnce() {
        DataFileException e = assertThrows(DataFileException.class,
                () -> reader.read(fixture("quantities-three-bad-lines.txt"), "quantities-three-bad-lines.txt"));
        assertEquals(DataFileException.INVALID, e.code());
        List<DataProblem> problems = e.problems();
        assertEquals(3, problems.size());
        assertEquals(new DataProblem("quantities-three-bad-lines.txt", 3, 9, QuantityParseException.UNKNOWN_UNIT,
                "unknown unit 'furlongs'; known units: m, um, nm, \u00c5, m-1, cm-1, Hz, kHz, MHz, GHz, THz, J, eV, "
                        + "meV, K", "577.915 furlongs"), problems.get(0));
        assertEquals(5, problems.get(1).line());
        assertEquals(QuantityParseException.NEGATIVE, problems.get(1).code());
        assertEquals(6, problems.get(2).line());
        assertEquals(11, problems.get(2).column());
        assertEquals(QuantityParseException.MEDIUM_NOT_ALLOWED, problems.get(2).code());
        assertTrue(e.getMessage().startsWith("3 problems in quantities-three-bad-lines.txt:\n"
                + "quantities-three-bad-lines.txt:3:9: unknown unit 'furlongs'"), e.getMessage());
        assertTrue(e.getMessage().contains("\n    -2.1 eV"), e.getMessage());
    }

    @Test
    void reportsOverlongLines() {
        String line = "1".repeat(QuantityListReader.MAX_LINE_LENGTH + 1) + " nm";
        DataFileException e = assertThrows(DataFileException.class,
                () -> reader.read(new StringReader("500 nm\n" + line + "\n"), "long.txt"));
        assertEquals(2, e.problems().get(0).line());
        assertEquals("line longer than 1000 characters", e.problems().get(0).reason());
    }

    @Test
    void whatIsWrittenReadsBackIdentical() {
        QuantityText text = QuantityText.standard();
        qt().withFixedSeed(7L).forAll(lists().of(doubles().between(200, 2500)).ofSizeBetween(0, 40))
                .checkAssert(nanometres -> {
                    List<Quantity> written = nanometres.stream()
                            .map(nm -> (Quantity) Wavelength.ofNanometres(nm, Medium.air()))
                            .collect(Collectors.toList());
                    String file = written.stream().map(q -> text.format(q, Unit.NANOMETRE))
                            .collect(Collectors.joining("\n", "# written by the test\n", "\n"));
                    List<Quantity> read = reader.read(new StringReader(file), "generated").stream()
                            .map(QuantityListReader.Entry::quantity).collect(Collectors.toList());
                    assertEquals(written, read);
                });
    }

    private static Reader fixture(String name) {
        return new InputStreamReader(QuantityListReaderTest.class.getResourceAsStream("/lists/" + name),
                StandardCharsets.UTF_8);
    }
}
