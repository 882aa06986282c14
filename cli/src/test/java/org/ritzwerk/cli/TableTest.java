package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The streaming table writer: rows leave as they come, the aligned table holds back a bounded chunk. */
class TableTest {

    private static final List<Table.Column> COLUMNS = List.of(Table.Column.text("name", "name"),
            Table.Column.number("value", "value", "%.2f"));

    @Test
    void csvAndJsonRowsAreWrittenBeforeTheTableIsFinished() {
        for (Table.Format format : List.of(Table.Format.csv, Table.Format.json)) {
            StringWriter text = new StringWriter();
            PrintWriter out = new PrintWriter(text);
            Table table = new Table(COLUMNS, out, format);
            table.add("a", 1.5);
            table.add("b", Double.NaN);
            int rows = 2;
            while (text.getBuffer().length() == 0 && rows < 10_000) {   // the CSV writer buffers a few KiB
                out.flush();
                table.add("c", 0.5);
                rows++;
            }
            assertTrue(text.getBuffer().length() > 0 && rows < 1000, format + ": nothing written after " + rows + " rows");
            table.finish();
            assertTrue(text.toString().startsWith(format == Table.Format.csv ? "name,value\na,1.5\nb,\n"
                    : "{\"name\":\"a\",\"value\":1.5}\n{\"name\":\"b\",\"value\":null}\n"), text.toString());
            assertEquals(rows + (format == Table.Format.csv ? 1 : 0), text.toString().split("\n").length);
        }
    }

    @Test
    void aRoundedNegativeZeroHasNoSignAndLargeOrSmallValuesReadShort() {
        Table.Column column = Table.Column.number("e", "e", "%.6f");
        assertEquals("0.000000", column.display().apply(-1e-12));
        assertEquals("-0.000001", column.display().apply(-1e-6));
        assertEquals("-1.500000", column.display().apply(-1.5));
        assertEquals("1e9", OptionRules.show(1e9));
        assertEquals("2.5e-7", OptionRules.show(2.5e-7));
        assertEquals("1.23457e-12", OptionRules.show(1.2345678e-12));
    }

    @Test
    void anEmptyTableStillHasItsHeading() {
        StringWriter csv = new StringWriter();
        new Table(COLUMNS, new PrintWriter(csv), Table.Format.csv).finish();
        assertEquals("name,value\n", csv.toString());
        StringWriter text = new StringWriter();
        new Table(COLUMNS, new PrintWriter(text), Table.Format.text).finish();
        assertEquals("name  value\n", text.toString());
    }

    @Test
    void theAlignedTableIsSizedByItsFirstRowsThenWidensAColumnWhereNeeded() {
        StringWriter text = new StringWriter();
        PrintWriter out = new PrintWriter(text);
        Table table = new Table(COLUMNS, out, Table.Format.text);
        for (int i = 0; i < Table.SIZING_ROWS - 1; i++) {
            table.add("r" + i, 1.0);
        }
        out.flush();
        assertEquals("", text.toString(), "held back until the columns are sized");
        table.add("held", 2.0);
        out.flush();
        String[] lines = text.toString().split("\n");
        assertEquals(Table.SIZING_ROWS + 1, lines.length, "heading and the held-back rows");
        assertEquals("name  value", lines[0]);
        assertEquals("r0    1.00", lines[1]);
        table.add("a-much-longer-name", 3.0);
        table.add("x", 4.0);
        table.finish();
        lines = text.toString().split("\n");
        assertEquals("a-much-longer-name  3.00", lines[lines.length - 2]);
        assertEquals("x                   4.00", lines[lines.length - 1], "the column stays widened");
    }

    @Test
    void aRowOfTheWrongLengthOrAfterTheEndIsRefused() {
        Table table = new Table(COLUMNS, new PrintWriter(new StringWriter()), Table.Format.csv);
        assertThrows(IllegalStateException.class, () -> table.add("only one"));
        table.finish();
        assertThrows(IllegalStateException.class, () -> table.add("a", 1.0));
    }
}
