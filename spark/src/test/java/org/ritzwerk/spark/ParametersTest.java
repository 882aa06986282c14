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
        for (Object p : new Object[] {identify, calibrate, synthesise}) {
            assertEquals(p, Setups.deserialise(Setups.serialise(p)));
        }
        assertEquals("vacuum", SynthesisParameters.linear(640, 670, 100).medium(),
                "the synth command's default medium");
    }
}
