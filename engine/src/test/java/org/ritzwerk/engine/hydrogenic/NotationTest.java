package org.ritzwerk.engine.hydrogenic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * Line names of one-electron ions (common practice): hydrogen by its series, He II and other ions
 * by wavelength and shells; He II n -> 3 is the Fowler series and n -> 4 the Pickering series.
 * The vacuum wavelengths below are rounded values of this library's He II and Li III lines
 * (regression inputs); the expected labels follow from the rules in {@link Notation}.
 */
class NotationTest {

    @Test
    void hydrogenKeepsItsSeriesNames() {
        assertEquals("Balmer alpha", Notation.line(1, 3, 2, 656.47e-9));
        assertEquals("Lyman 7-1", Notation.line(1, 7, 1, 93.08e-9));
        assertEquals("109 alpha", Notation.line(1, 110, 109, 0.06));
        assertEquals(Optional.of("Paschen"), Notation.series(1, 3));
        assertEquals(Optional.empty(), Notation.series(1, 7));
    }

    @Test
    void heliumIiIsNamedByWavelengthAndShells() {
        // He II 4686: 468.70 nm in vacuum, 468.57 nm in standard air.
        assertEquals("4686 (4-3)", Notation.line(2, 4, 3, 468.70e-9));
        assertEquals(Optional.of("Fowler"), Notation.series(2, 3));
        // The Pickering line named He II 5411 by tradition (541.313 nm vacuum, 5411.6 A in air)
        // rounds to 5412.
        assertEquals("5412 (7-4)", Notation.line(2, 7, 4, 541.313e-9));
        assertEquals(Optional.of("Pickering"), Notation.series(2, 4));
        // Below 200 nm the vacuum wavelength names the line; below 1000 A to 0.1 A.
        assertEquals("1640 (3-2)", Notation.line(2, 3, 2, 164.04e-9));
        assertEquals("303.8 (2-1)", Notation.line(2, 2, 1, 30.378e-9));
        // X-ray lines of heavy ions keep four significant digits (they all read 0.1 before).
        assertEquals("0.1240 (2-1)", Notation.line(92, 2, 1, 1.23951e-11));
        assertEquals("33.74 (2-1)", Notation.line(6, 2, 1, 3.37362e-9));
        assertEquals(Optional.empty(), Notation.series(2, 2));
        // Beyond 2 um the vacuum wavelength names the line; beyond 10 um only the shells.
        assertEquals("30917 (7-6)", Notation.line(2, 7, 6, 3.0917e-6));
        assertEquals("12-11", Notation.line(2, 12, 11, 20e-6));
        assertEquals("4-3", Notation.shells(4, 3));
    }

    @Test
    void otherIonsHaveNoSeriesNames() {
        // Li III 3 -> 2 at 72.9 nm in vacuum.
        assertEquals("729.1 (3-2)", Notation.line(3, 3, 2, 72.91e-9));
        assertEquals(Optional.empty(), Notation.series(3, 2));
        assertEquals(Optional.empty(), Notation.series(3, 3));
    }

    @Test
    void aWavelengthLabelNeedsAPositiveWavelength() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Notation.wavelengthLabel(-1e-9));
        assertEquals("vacuum wavelength must be positive and finite, got -1.0E-9 m", e.getMessage());
    }
}
