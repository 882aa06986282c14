package org.ritzwerk.quantity;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Medium;

/** A conversion whose propagated uncertainty would overflow is refused with a clear message, never printed as Infinity. */
class UncertaintyOverflowTest {

    @Test
    void aHugeUncertaintyIsRefusedNotMadeInfinite() {
        Wavelength huge = Wavelength.of(656.28, 1e308, Unit.NANOMETRE, Medium.vacuum());
        ConversionException e = assertThrows(ConversionException.class, huge::toFrequency);
        assertEquals(ConversionException.UNCERTAINTY_OVERFLOW, e.code());
        assertTrue(e.getMessage().contains("too large to convert") && !e.getMessage().contains("Infinity"),
                e.getMessage());
        // A large but representable uncertainty still converts.
        assertTrue(Wavelength.of(656.28, 1e3, Unit.NANOMETRE, Medium.vacuum()).toFrequency().hasUncertainty());
    }
}
