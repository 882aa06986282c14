package org.ritzwerk.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The parameter records refuse what the command line refuses (a species, lamp, line set or data
 * file named twice, which would enter every line twice and leave each peak between two equal
 * candidates), and travel as the Java-serialised bytes every serializer can broadcast.
 */
class ParametersTest {

    @Test
    void aSpeciesLampOrSetNamedTwiceIsRefused() {
        assertEquals("species names 'H' twice (also as 'H I'); give each once", assertThrows(
                IllegalArgumentException.class, () -> IdentificationParameters.perSpectrumWindow(
                        List.of("H I", "He II", "H"), List.of())).getMessage());
        assertEquals("lineSets names 'lamp-ne-i' twice; give each once", assertThrows(IllegalArgumentException.class,
                () -> IdentificationParameters.inWindow(List.of(), List.of("lamp-ne-i", " lamp-ne-i"), 500, 750))
                .getMessage());
        assertEquals("lamps names 'Ne I' twice; give each once", assertThrows(IllegalArgumentException.class,
                () -> CalibrationParameters.of(List.of("Ne I", "Ar I", "Ne I"), List.of())).getMessage());
        assertEquals("dataFiles names 'mine.csv' twice; give each once", assertThrows(IllegalArgumentException.class,
                () -> SynthesisParameters.linear(640, 670, 100).withDataFiles(List.of("mine.csv", "mine.csv")))
                .getMessage());
        // Isotopes are different species.
        assertEquals(List.of("H I", "D I"), IdentificationParameters.perSpectrumWindow(List.of("H I", "D I"),
                List.of()).species());
    }

    @Test
    void theBroadcastBytesGiveTheSameParameters() {
        IdentificationParameters identify = IdentificationParameters.inWindow(List.of("H I"), List.of(), 360, 710)
                .withVelocitySearch(1e5).withUnit("cm-1", "vacuum");
        CalibrationParameters calibrate = CalibrationParameters.of(List.of("Ne I"), List.of()).withSecondOrder(false);
        SynthesisParameters synthesise = SynthesisParameters.linear(640, 670, 100).withMedium("air");
        SynthesisParameters lamp = SynthesisParameters.dispersion(new double[] {580, 0.0735, -1e-6}, 2048)
                .withLineSets(List.of("lamp-ne-i"));
        for (Object p : new Object[] {identify, calibrate, synthesise, lamp}) {
            assertEquals(p, Setups.deserialise(Setups.serialise(p)));
        }
        assertEquals("vacuum", SynthesisParameters.linear(640, 670, 100).medium(),
                "the synth command's default medium");
    }

    /** A dispersion grid is checked as {@code synth --dispersion} checks it. */
    @Test
    void aDispersionGridIsCheckedAsTheCommandChecksIt() {
        SynthesisParameters grid = SynthesisParameters.dispersion(new double[] {580, 0.0735, -1e-6}, 2048);
        assertEquals(List.of(580.0, 0.0735, -1e-6), grid.dispersion());
        assertEquals(Double.NaN, grid.fromNm());
        // The wavelength at the first pixel's lower edge: 580 - 0.0735 / 2 (the centre of pixel 0 is at c0).
        assertEquals(580 - 0.0735 / 2, grid.grid().lowest(), 1e-3);
        assertEquals("dispersion: the wavelength must be above 0 nm on every pixel, but the first pixel's edge is at"
                + " -0.1 nm", assertThrows(IllegalArgumentException.class,
                        () -> SynthesisParameters.dispersion(new double[] {0, 0.2}, 100)).getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> SynthesisParameters.dispersion(new double[] {500, 0.1, -1e-3}, 2048), "turns within the chip");
        assertEquals("give a dispersion or fromNm/toNm, not both (fromNm and toNm must be NaN with a dispersion)",
                assertThrows(IllegalArgumentException.class, () -> new SynthesisParameters(500, 600, 100,
                        false, List.of(500.0, 0.1), "air", "qed", 30, "auto", 1e4, 0, List.of(), List.of(),
                        SynthesisParameters.Shapes.none(), SynthesisParameters.Background.none())).getMessage());
        assertEquals("lineSets names 'lamp-ne-i' twice; give each once", assertThrows(IllegalArgumentException.class,
                () -> grid.withLineSets(List.of("lamp-ne-i", "lamp-ne-i "))).getMessage());
    }

    /** Line shapes, continua and log grids are refused where the command refuses them. */
    @Test
    void lineShapesAndContinuaAreCheckedAsTheCommandChecksThem() {
        SynthesisParameters p = SynthesisParameters.logarithmic(640, 670, 100);
        assertEquals("natural widths are computed up to n = 60; lower nMax (80) or leave them out",
                assertThrows(IllegalArgumentException.class, () -> p.withModel("qed", 80).withShapes(0, true, false))
                        .getMessage());
        assertEquals(60, p.withModel("qed", 60).withShapes(0, true, false).nMax());
        assertThrows(IllegalArgumentException.class, () -> p.withShapes(-1, false, false));
        assertThrows(IllegalArgumentException.class, () -> p.withShapes(30_001, false, false), "beyond 1000 spans");
        assertEquals("a continuum temperature is for a blackbody, above 0 and below 1e9 K (or NaN for each scene's"
                + " temperature), got 3000.0", assertThrows(IllegalArgumentException.class,
                        () -> p.withContinuum("flat", 3000, 100)).getMessage());
        assertThrows(IllegalArgumentException.class, () -> p.withContinuum("grey", Double.NaN, 100));
        assertThrows(IllegalArgumentException.class, () -> p.withContinuum("flat", Double.NaN, 0));
        assertEquals("a dispersion grid is given by its polynomial; it cannot be logarithmic too",
                assertThrows(IllegalArgumentException.class, () -> new SynthesisParameters(Double.NaN, Double.NaN,
                        100, true, List.of(500.0, 0.1), "air", "qed", 30, "auto", 1e4, 0, List.of(), List.of(),
                        SynthesisParameters.Shapes.none(), SynthesisParameters.Background.none())).getMessage());
        SynthesisParameters all = p.withShapes(0.01, true, true).withContinuum("blackbody", Double.NaN, 100);
        assertEquals(all, Setups.deserialise(Setups.serialise(all)));
    }

    /** Synthesis parameters refuse what the synth command refuses, with messages in its terms. */
    @Test
    void synthesisParametersAreCheckedAsTheCommandChecksThem() {
        SynthesisParameters p = SynthesisParameters.linear(640, 670, 100);
        assertEquals(p, SynthesisParameters.linear(670, 640, 100), "either order, as --from and --to");
        assertEquals("renderer must be auto, exact or fast, got 'bogus'", assertThrows(IllegalArgumentException.class,
                () -> p.withRenderer("bogus")).getMessage());
        assertEquals("fast", p.withRenderer("fast").renderer());
        assertEquals("lineSets element 1 is null", assertThrows(IllegalArgumentException.class,
                () -> p.withLineSets(java.util.Arrays.asList("lamp-ne-i", null))).getMessage());
        assertEquals("lineSets element 0 is blank", assertThrows(IllegalArgumentException.class,
                () -> p.withLineSets(List.of(" "))).getMessage());
        assertEquals("pixels must be 2 to 50000000, as synth --pixels takes them, got 1000000000",
                assertThrows(IllegalArgumentException.class, () -> SynthesisParameters.linear(1, 2, 1_000_000_000))
                        .getMessage());
        assertEquals("a dispersion needs at least c0 and c1, got 0 coefficients", assertThrows(
                IllegalArgumentException.class, () -> SynthesisParameters.dispersion(new double[0], 100)).getMessage());
        assertThrows(IllegalArgumentException.class, () -> p.withCounts(1e18, 3), "beyond exact whole counts");
        assertThrows(IllegalArgumentException.class, () -> p.withCounts(1e4, 1e200));
        assertThrows(IllegalArgumentException.class, () -> p.withContinuum("none", Double.NaN, 5),
                "continuum counts without a continuum");
    }

    /**
     * As the README says: the operation objects stay on the driver (not Serializable) and the
     * parameter records, which travel to the executors, are Serializable (common practice: a
     * documented property is checked).
     */
    @Test
    void operationsStayOnTheDriverAndParametersTravel() {
        for (Class<?> operation : List.of(SurveyIdentification.class, SurveyCalibration.class,
                SurveySynthesis.class)) {
            org.junit.jupiter.api.Assertions.assertFalse(java.io.Serializable.class.isAssignableFrom(operation),
                    operation.getName());
        }
        for (Class<?> parameters : List.of(IdentificationParameters.class, CalibrationParameters.class,
                SynthesisParameters.class)) {
            org.junit.jupiter.api.Assertions.assertTrue(java.io.Serializable.class.isAssignableFrom(parameters),
                    parameters.getName());
        }
    }
}
