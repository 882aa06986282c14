package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.quantity.QuantityText;

/**
 * A folder where a file is expected and a byte that is not UTF-8 are input errors naming the path,
 * and for the byte its line and column, in every reader that reads files.
 */
class UnreadableInputsTest {

    @Test
    void aFolderIsRefusedNamingThePath(@TempDir Path dir) {
        DataFileException lines = assertThrows(DataFileException.class, () -> LineListFiles.read(dir, DataKind.LINES));
        assertEquals(DataFileException.UNREADABLE, lines.code());
        assertTrue(lines.getMessage().contains(dir.toString()) && lines.getMessage().contains("is a folder"),
                lines.getMessage());
        assertThrows(DataFileException.class, () -> PeakFiles.read(dir));
        assertThrows(DataFileException.class, () -> UserFiles.read(dir));
        assertThrows(DataFileException.class, () -> new QuantityListReader(QuantityText.standard()).read(dir));
    }

    @Test
    void aBadByteIsNamedWithItsLineAndColumn(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("list.txt");
        Files.write(file, new byte[] {'6', '5', '6', ' ', 'n', 'm', '\n', 'a', 'b', 'c', (byte) 0xff, ' ', '\n'});
        DataFileException e = assertThrows(DataFileException.class,
                () -> new QuantityListReader(QuantityText.standard()).read(file));
        assertEquals(1, e.problems().size());
        assertEquals(2, e.problems().get(0).line());
        assertEquals(4, e.problems().get(0).column());
        assertTrue(e.getMessage().contains("0xFF"), e.getMessage());
        // After a multi-byte character the column counts characters, not bytes.
        Path utf = dir.resolve("lines.csv");
        Files.write(utf, new byte[] {'#', ' ', (byte) 0xc3, (byte) 0xa9, (byte) 0xc3, '\n'});
        DataFileException f = assertThrows(DataFileException.class, () -> LineListFiles.read(utf, DataKind.LINES));
        assertEquals(1, f.problems().get(0).line());
        assertEquals(4, f.problems().get(0).column());
    }

    @Test
    void aByteOrderMarkIsAccepted(@TempDir Path dir) throws IOException {
        String bom = "\uFEFF";
        Path list = dir.resolve("list.txt");
        Files.writeString(list, bom + "656.28 nm air\n", java.nio.charset.StandardCharsets.UTF_8);
        assertEquals(1, new QuantityListReader(QuantityText.standard()).read(list).size());
        Path lines = dir.resolve("lines.csv");
        Files.writeString(lines, bom + "# ritzwerk-lines 1\n# id: x\n# title: t\n# source: s\n# provenance: measured\n"
                + "# version: 1\n# position-unit: nm\n# medium: air\nspecies,position\nNe I,640.2248\n",
                java.nio.charset.StandardCharsets.UTF_8);
        assertEquals(1, LineListFiles.read(lines, DataKind.LINES).size());
        Path spectrum = dir.resolve("s.csv");
        Files.writeString(spectrum, bom + "# ritzwerk-spectrum 1\ncounts\n1\n2\n", java.nio.charset.StandardCharsets.UTF_8);
        assertEquals(2, SpectrumFiles.read(spectrum).pixels());
    }
}
