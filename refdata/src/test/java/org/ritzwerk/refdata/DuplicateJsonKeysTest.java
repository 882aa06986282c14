package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.data.DataKind;

/**
 * A JSON object that names a key twice is refused by every JSON reader, naming the key and where
 * it is, instead of keeping one of the two values silently.
 */
class DuplicateJsonKeysTest {

    private static void assertNamesTheDuplicate(RuntimeException e, String key) {
        String m = e.getMessage();
        assertTrue(m.contains("Duplicate") && m.contains(key), m);
    }

    @Test
    void lineListsAndPeaksThroughTheSharedTabularReader() {
        String lines = "{\"format\":\"ritzwerk-lines\",\"formatVersion\":1,\"id\":\"x\",\"title\":\"t\","
                + "\"source\":\"s\",\"provenance\":\"measured\",\"version\":\"1\",\"positionUnit\":\"THz\","
                + "\"lines\":[{\"species\":\"Ar I\",\"position\":430.42,\"position\":431.0}]}";
        DataFileException e = assertThrows(DataFileException.class,
                () -> LineListFiles.readJson(lines, "dup.json", DataKind.LINES));
        assertNamesTheDuplicate(e, "position");
        assertTrue(e.getMessage().contains("dup.json:1:"), e.getMessage());
        String header = "{\"format\":\"ritzwerk-lines\",\"formatVersion\":1,\"id\":\"x\",\"id\":\"y\",\"title\":\"t\","
                + "\"source\":\"s\",\"provenance\":\"measured\",\"version\":\"1\",\"positionUnit\":\"THz\",\"lines\":[]}";
        assertNamesTheDuplicate(assertThrows(DataFileException.class,
                () -> LineListFiles.readJson(header, "dup.json", DataKind.LINES)), "id");
        String peaks = "{\"format\":\"ritzwerk-peaks\",\"formatVersion\":1,\"id\":\"x\",\"title\":\"t\","
                + "\"source\":\"s\",\"provenance\":\"measured\",\"version\":\"1\",\"positionUnit\":\"nm\","
                + "\"medium\":\"air\",\"peaks\":[{\"position\":656.28,\"intensity\":1,\"intensity\":2}]}";
        assertNamesTheDuplicate(assertThrows(DataFileException.class, () -> PeakFiles.read(peaks, "dup.json")),
                "intensity");
    }

    @Test
    void spectraAndCalibrations() {
        String spectrum = "{\"format\":\"ritzwerk-spectrum\",\"version\":1,\"counts\":[1,2],\"counts\":[3,4]}";
        assertNamesTheDuplicate(assertThrows(DataFileException.class,
                () -> SpectrumFiles.read(spectrum, "dup.json")), "counts");
        String calibration = "{\"format\":\"ritzwerk-calibration\",\"version\":1,\"medium\":\"air\",\"pixels\":100,"
                + "\"pixels\":200,\"valid_pixels\":[0,99],\"centre_pixel\":49.5,\"half_range\":49.5,"
                + "\"coefficients_nm\":[500,5]}";
        assertNamesTheDuplicate(assertThrows(RuntimeException.class,
                () -> CalibrationFiles.parse("dup.json", calibration)), "pixels");
    }
}
