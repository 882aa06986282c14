package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/**
 * The ritzwerk-series file: every bad row is reported with file, line, column and code, none is
 * dropped. The members are invented (only the reader is checked).
 */
class SeriesFilesTest {

    private static final String HEADER = "# ritzwerk-series 1\n# species: Sr-88 I\n# energy-unit: cm-1\n"
            + "series,n,energy,uncertainty\n";

    /** A row with an empty series name was dropped without a word; it is refused naming line and column. */
    @Test
    void anEmptySeriesNameIsRefusedNotDropped() {
        String text = HEADER + "nS,20,45540.23,0.002\nnS,22,45619.45,0.002\n,45,45900,0.002\n  ,46,45901,0.002\n";
        DataFileException e = assertThrows(DataFileException.class, () -> SeriesFiles.read(text, "blank.csv"));
        assertEquals(List.of("7:1 data.missing-value", "8:1 data.missing-value"), e.problems().stream()
                .map(p -> p.line() + ":" + p.column() + " " + p.code()).collect(Collectors.toList()));
        assertTrue(e.getMessage().contains("blank.csv:7:1: column series: series needs a name"), e.getMessage());
    }

    /** The same in JSON: a member without a series name, or with an empty one, is refused. */
    @Test
    void anEmptySeriesNameInJsonIsRefused() {
        String json = "{\"format\": \"ritzwerk-series\", \"formatVersion\": 1, \"species\": \"Sr-88 I\", "
                + "\"energyUnit\": \"cm-1\", \"members\": [\n"
                + "{\"series\": \"nS\", \"n\": 20, \"energy\": 45540.23, \"uncertainty\": 0.002},\n"
                + "{\"series\": \"\", \"n\": 22, \"energy\": 45619.45, \"uncertainty\": 0.002},\n"
                + "{\"n\": 24, \"energy\": 45676.88, \"uncertainty\": 0.002}]}";
        DataFileException e = assertThrows(DataFileException.class, () -> SeriesFiles.read(json, "blank.json"));
        assertEquals(List.of("3 data.missing-value", "4 data.missing-value"),
                e.problems().stream().map(p -> p.line() + " " + p.code()).collect(Collectors.toList()));
        // the entry in the array names the row where several share a line
        assertTrue(e.getMessage().contains("blank.json:4: entry 3 of 'members', column series: series needs a name"),
                e.getMessage());
    }

    /**
     * A level measured twice (n = 22 on lines 6 and 8) was refused as a duplicate; each row is now one
     * measurement of the series, placed by its own line, in file order.
     */
    @Test
    void aRepeatedNIsOneMoreMeasurement() {
        String text = HEADER + "nS,20,45540.23,0.002\nnS,22,45619.45,0.002\nnS,24,45676.88,0.002\n"
                + "nS,22,45619.452,0.004\nnS,22,45619.45,0.002\n";
        SeriesFiles.Contents c = SeriesFiles.read(text, "repeat.csv");
        var s = c.series().get(0);
        assertEquals(5, s.size());
        assertEquals(List.of("repeat.csv:5", "repeat.csv:6", "repeat.csv:7", "repeat.csv:8", "repeat.csv:9"),
                java.util.stream.IntStream.range(0, 5).mapToObj(s::where).toList());
        assertEquals(3, s.measurements(22));
        assertEquals(45619.452, s.energyPerCm(3));
        assertEquals(3, s.principalNumbers().length);
    }

    /** JSON entries sharing a line, repeating one n, are told apart by their place in the array. */
    @Test
    void repeatedEntriesOnOneJsonLineAreToldApart() {
        String json = "{\"format\": \"ritzwerk-series\", \"formatVersion\": 1, \"species\": \"Sr-88 I\", "
                + "\"energyUnit\": \"cm-1\", \"members\": [\n"
                + "{\"series\": \"nS\", \"n\": 20, \"energy\": 45540.23, \"uncertainty\": 0.002},\n"
                + "{\"series\": \"nS\", \"n\": 22, \"energy\": 45619.45, \"uncertainty\": 0.002}, "
                + "{\"series\": \"nS\", \"n\": 22, \"energy\": 45619.46, \"uncertainty\": 0.003}]}";
        var s = SeriesFiles.read(json, "repeat.json").series().get(0);
        assertEquals(List.of("repeat.json:2", "repeat.json:3 (entry 2)", "repeat.json:3 (entry 3)"),
                java.util.stream.IntStream.range(0, 3).mapToObj(s::where).toList());
    }

    /**
     * Every measurement of an n must lie above every measurement of the n below: a repeat of n = 22 below
     * the highest measurement of n = 20 is refused naming that line.
     */
    @Test
    void aRepeatBelowTheLevelUnderItIsRefused() {
        String text = HEADER + "nS,20,45540.23,0.002\nnS,20,45540.24,0.002\nnS,22,45619.45,0.002\n"
                + "nS,22,45540.235,0.002\n";
        DataFileException e = assertThrows(DataFileException.class, () -> SeriesFiles.read(text, "low.csv"));
        assertEquals(List.of("8 data.not-rising"), e.problems().stream().map(p -> p.line() + " " + p.code())
                .collect(Collectors.toList()));
        assertTrue(e.getMessage().contains("the energy of n = 22 is not above that of n = 20 (line 6)"),
                e.getMessage());
    }

    /** A good file reads every row into its series, in the order the names first appear. */
    @Test
    void everyRowOfAGoodFileIsRead() {
        String text = HEADER + "nS,20,45540.23,0.002\nnD,20,45560.1,0.003\nnS,22,45619.45,0.002\n";
        SeriesFiles.Contents c = SeriesFiles.read(text, "good.csv");
        assertEquals(List.of("nS", "nD"), c.series().stream().map(s -> s.name()).toList());
        assertEquals(2, c.series().get(0).size());
        assertEquals("good.csv:7", c.series().get(0).where(1));
    }
}
