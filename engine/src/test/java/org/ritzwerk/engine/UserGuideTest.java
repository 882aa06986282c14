package org.ritzwerk.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/** The engine examples of the README, compiled and run. */
class UserGuideTest {

    @Test
    void convertAWholeColumn() {
        double[] airNanometres = {412.337, 577.915, 731.26};
        double[] wavenumbers = new double[airNanometres.length];

        SpectralArrays.convert(airNanometres, Unit.NANOMETRE, Medium.air(),
                Unit.PER_CENTIMETRE, null, wavenumbers);

        assertEquals(17298.8, wavenumbers[1], 0.05);
    }
}
