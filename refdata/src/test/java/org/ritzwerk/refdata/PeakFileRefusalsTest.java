package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Peak files a review broke on purpose: each refusal names the file, the place and what was wrong. */
class PeakFileRefusalsTest {

    private static final String JSON_HEAD = "{\"format\":\"ritzwerk-peaks\",\"formatVersion\":1,\"id\":\"b\","
            + "\"title\":\"t\",\"source\":\"s\",\"provenance\":\"measured\",\"version\":\"1\",\"positionUnit\":\"nm\","
            + "\"medium\":\"air\",";

    private static final String HEADER = "# ritzwerk-peaks 1\n# id: p\n# title: t\n# source: invented\n"
            + "# provenance: measured\n# version: 1\n# position-unit: nm\n# medium: air\n";

    /**
     * An uncertainty of 1e308 nm was taken: the peak then matched a line 170 nm away while a peak on
     * that line went unexplained. An uncertainty as large as the position places the peak nowhere.
     */
    @Test
    void anUncertaintyAsLargeAsThePositionIsRefused() {
        DataFileException e = assertThrows(DataFileException.class, () -> PeakFiles.read(HEADER
                + "position,uncertainty\n486.13,1e308\n656.28,0.01\n600.5,600.5\n", "huge.csv"));
        assertEquals(2, e.problems().size(), e.getMessage());
        assertEquals(10, e.problems().get(0).line());
        assertEquals("data.out-of-range", e.problems().get(0).code());
        assertTrue(e.getMessage().contains("column uncertainty: uncertainty must be below the position (486.13), got"
                + " 1.0E308"), e.getMessage());
        assertEquals(12, e.problems().get(1).line());
        // below the position, or not given: read
        assertEquals(2, PeakFiles.read(HEADER + "position,uncertainty\n486.13,486.12\n656.28,\n", "ok.csv").size());
        String json = JSON_HEAD
                + "\"peaks\":[{\"position\":486.13,\"uncertainty\":0.01},{\"position\":656.28,\"uncertainty\":1e308}]}";
        DataFileException j = assertThrows(DataFileException.class, () -> PeakFiles.read(json, "huge.json"));
        assertTrue(j.getMessage().contains("entry 2 of 'peaks', column uncertainty: uncertainty must be below the"
                + " position"), j.getMessage());
    }

    /** An empty file gave eight problems (no column names, each required header, the format line). */
    @Test
    void anEmptyFileIsOneProblem() {
        for (String text : new String[] {"", "\n\n  \n"}) {
            DataFileException e = assertThrows(DataFileException.class, () -> PeakFiles.read(text, "empty.csv"));
            assertEquals(1, e.problems().size(), e.getMessage());
            assertEquals("data.empty", e.problems().get(0).code());
            assertTrue(e.getMessage().contains("empty.csv:1: the file is empty"), e.getMessage());
        }
    }

    /** A JSON field of the wrong type named its line and column only: every entry of a one-line file is line 1. */
    @Test
    void aJsonFieldOfTheWrongTypeNamesItsEntry() {
        String json = JSON_HEAD
                + "\"peaks\":[{\"position\":486.13},{\"position\":\"NaN\"},{\"position\":500,\"colour\":\"red\"}]}";
        DataFileException e = assertThrows(DataFileException.class, () -> PeakFiles.read(json, "typed.json"));
        assertTrue(e.getMessage().contains("entry 2 of 'peaks': field 'position' must be a JSON number, got the string"
                + " \"NaN\""), e.getMessage());
        assertTrue(e.getMessage().contains("entry 3 of 'peaks': unknown field 'colour'"), e.getMessage());
    }

    /**
     * The peaks read carry their place for a caller's own messages (a repeated peak, a missing
     * intensity): a JSON entry by its place in 'peaks', as the messages above, since every entry of a
     * one-line file is on line 1; a CSV row by its line.
     */
    @Test
    void eachPeakIsNamedAsTheReaderNamesItsRow() {
        PeakFiles.Peaks json = PeakFiles.read(JSON_HEAD + "\"peaks\":[{\"position\":486.13},{\"position\":656.28},"
                + "{\"position\":486.13}]}", "one-line.json");
        assertEquals(1, json.lines()[2]);
        assertEquals("entry 3 of 'peaks'", json.where(2));
        assertEquals(3, json.entries()[2]);
        PeakFiles.Peaks csv = PeakFiles.read(HEADER + "position\n486.13\n656.28\n", "rows.csv");
        assertEquals("line 11", csv.where(1));
        assertEquals(0, csv.entries()[1]);
        assertThrows(IllegalArgumentException.class, () -> new PeakFiles.Peaks("a", csv.unit(), csv.medium(),
                csv.positions(), csv.uncertainties(), csv.intensities(), csv.widths(), csv.lines(), new int[1]));
    }
}
