package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.ritz.MeasuredLines;

/** The {@code ritzwerk-measured-lines} file: both encodings, unit conversion and refusals. */
class MeasuredLineFilesTest {

    private static final String CSV = "# ritzwerk-measured-lines 1\n# position-unit: cm-1\n"
            + "position,uncertainty,upper,lower\n"
            + "4857.4567,0.0010,1s2p 1P1,1s2s 1S0\n"
            + "19931.9248,0.0010,1s3p  1P1,1s2s 1S0\n";

    @Test
    void jsonAndCsvGiveTheSameLines() {
        String json = "{\"format\":\"ritzwerk-measured-lines\",\"formatVersion\":1,\"positionUnit\":\"cm-1\","
                + "\"lines\":[{\"position\":4857.4567,\"uncertainty\":0.0010,\"upper\":\"1s2p 1P1\","
                + "\"lower\":\"1s2s 1S0\"},{\"position\":19931.9248,\"uncertainty\":0.0010,\"upper\":\"1s3p 1P1\","
                + "\"lower\":\"1s2s 1S0\"}]}";
        MeasuredLineFiles.Contents a = MeasuredLineFiles.read(CSV, "he.csv");
        MeasuredLineFiles.Contents b = MeasuredLineFiles.read(json, "he.json");
        assertEquals(2, a.lines().size());
        for (int k = 0; k < 2; k++) {
            assertEquals(a.lines().get(k).perCm(), b.lines().get(k).perCm(), 0.0);
            assertEquals(a.lines().get(k).sigmaPerCm(), b.lines().get(k).sigmaPerCm(), 0.0);
            assertEquals(a.lines().get(k).upper(), b.lines().get(k).upper(), "white space normalised");
        }
        assertEquals("he.csv:5", a.lines().get(1).where());
        MeasuredLines problem = a.problem("1s2s 1S0", 0);
        assertEquals(List.of("1s2s 1S0", "1s2p 1P1", "1s3p 1P1"), problem.levels());
        assertEquals("he.csv:4", problem.name(0));
    }

    @Test
    void frequenciesAndVacuumWavelengthsConvertWithTheirUncertainties() {
        // closed forms: sigma = f / c, u_sigma = u_f / c; sigma = 1e7 / lambda nm, u_sigma = 1e7 u / lambda^2
        // (the uncertainty by a central difference: within 1e-9 relative)
        double c = 29.9792458;                  // GHz cm, exact (SI definition of c)
        MeasuredLineFiles.Contents ghz = MeasuredLineFiles.read("# ritzwerk-measured-lines 1\n# position-unit: GHz\n"
                + "position,uncertainty,upper,lower\n" + (4857.4567 * c) + "," + (0.001 * c) + ",B,A\n", "f.csv");
        assertEquals(4857.4567, ghz.lines().get(0).perCm(), 1e-9);
        assertEquals(0.001, ghz.lines().get(0).sigmaPerCm(), 1e-12 + 1e-9 * 0.001);
        MeasuredLineFiles.Contents nm = MeasuredLineFiles.read("# ritzwerk-measured-lines 1\n# position-unit: nm\n"
                + "# medium: vacuum\nposition,uncertainty,upper,lower\n500,0.0001,B,A\n", "v.csv");
        assertEquals(20000, nm.lines().get(0).perCm(), 1e-9);
        assertEquals(1e7 * 1e-4 / 500 / 500, nm.lines().get(0).sigmaPerCm(), 1e-9 * 0.004);
    }

    @Test
    void badFilesAreRefusedWithFileLineAndColumn() {
        DataFileException noMedium = assertThrows(DataFileException.class, () -> MeasuredLineFiles.read(
                "# ritzwerk-measured-lines 1\n# position-unit: nm\nposition,uncertainty,upper,lower\n500,1e-4,B,A\n",
                "m.csv"));
        assertTrue(noMedium.getMessage().contains("medium"), noMedium.getMessage());
        DataFileException bad = assertThrows(DataFileException.class, () -> MeasuredLineFiles.read(
                "# ritzwerk-measured-lines 1\n# position-unit: cm-1\nposition,uncertainty,upper,lower\n"
                        + "100,0.1,B,A\n100,0.1, ,A\n120,0.1,A,B\n0,0.1,C,A\n", "b.csv"));
        String m = bad.getMessage();
        assertTrue(m.contains("b.csv:5:3: column upper: upper level label is required"), m);
        assertTrue(m.contains("b.csv:6:3: column upper") && m.contains("other way round on line 4"), m);
        assertTrue(m.contains("b.csv:7:1: column position: position must be above 0"), m);
        DataFileException empty = assertThrows(DataFileException.class, () -> MeasuredLineFiles.read(
                "# ritzwerk-measured-lines 1\n# position-unit: cm-1\nposition,uncertainty,upper,lower\n", "e.csv"));
        assertTrue(empty.getMessage().contains("no lines"), empty.getMessage());
    }
}
