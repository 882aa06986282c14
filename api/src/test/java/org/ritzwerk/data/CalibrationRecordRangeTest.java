package org.ritzwerk.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Medium;

/**
 * A calibration record's valid range is where its polynomial was fitted: on the detector, and
 * within the pixels of the lines used. A range beyond either made an applied spectrum's
 * extrapolated pixels look fitted. Invented polynomial: 500 + 5 x nm, x = (p - 49.5) / 49.5,
 * on 100 pixels.
 */
class CalibrationRecordRangeTest {

    private static DispersionPolynomial line(double lowest, double highest) {
        return new DispersionPolynomial(Medium.air(), 49.5, 49.5, new double[] {500, 5}, null, lowest, highest);
    }

    private static CalibrationRecord.FittedLine pair(double pixel, boolean used) {
        double nm = 500 + 5 * (pixel - 49.5) / 49.5;
        return new CalibrationRecord.FittedLine(pixel, nm, 0.001, 0, 0, used, "line at " + pixel, "");
    }

    @Test
    void theValidRangeLiesOnTheDetector() {
        assertEquals(99.5, CalibrationRecord.of("stored", 100, line(-0.5, 99.5)).polynomial().highestPixel());
        IllegalArgumentException beyond = assertThrows(IllegalArgumentException.class,
                () -> CalibrationRecord.of("stored", 100, line(-100, 9000)));
        assertTrue(beyond.getMessage().contains("reaches beyond the detector of 100 pixels"), beyond.getMessage());
        assertThrows(IllegalArgumentException.class, () -> CalibrationRecord.of("stored", 100, line(0, 99.6)));
    }

    @Test
    void theValidRangeLiesWithinTheUsedLines() {
        List<CalibrationRecord.FittedLine> lines = List.of(pair(10, true), pair(50, true), pair(80, true),
                pair(95, false));
        CalibrationRecord fitted = new CalibrationRecord("fit", 100, line(10, 80), Double.NaN, Double.NaN, Double.NaN,
                lines, List.of());
        assertEquals(3, fitted.linesUsed());
        IllegalArgumentException wider = assertThrows(IllegalArgumentException.class,
                () -> new CalibrationRecord("fit", 100, line(10, 95), Double.NaN, Double.NaN, Double.NaN, lines,
                        List.of()));
        assertTrue(wider.getMessage().contains("reaches beyond the used lines, pixels 10.0 to 80.0"),
                wider.getMessage());
    }
}
