package org.ritzwerk.engine.synth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/** Grid edges for the three kinds of grid, and their errors. */
class PixelGridTest {

    @Test
    void linearLogarithmicAndDispersionEdges() {
        PixelGrid linear = PixelGrid.linear(400, 500, 4);
        assertEquals(425, linear.edge(1), 1e-12);
        assertEquals(487.5, linear.centre(3), 1e-12);
        PixelGrid log = PixelGrid.logarithmic(400, 1600, 2);
        assertEquals(800, log.edge(1), 1e-9);
        assertEquals(1600, log.edge(2), 0);
        // Centre of pixel p at 600 + 0.05 p + 1e-6 p^2; edges half a pixel either side.
        PixelGrid polynomial = PixelGrid.dispersion(new double[] {600, 0.05, 1e-6}, 3);
        assertEquals(600 - 0.025 + 0.25e-6, polynomial.edge(0), 1e-12);
        assertEquals(600 + 0.05 * 2.5 + 6.25e-6, polynomial.edge(3), 1e-12);
    }

    @Test
    void fallingDispersionKeepsTheDetectorsOrder() {
        // Centres 700 - 0.05 p: pixel 0 is the longest wavelength, as on a spectrometer that reads red first.
        PixelGrid falling = PixelGrid.dispersion(new double[] {700, -0.05}, 4);
        assertEquals(true, falling.falling());
        assertEquals(700.025, falling.edge(0), 1e-12);
        assertEquals(699.825, falling.edge(4), 1e-12);
        assertEquals(699.85, falling.centre(3), 1e-12);
        assertEquals(699.825, falling.lowest(), 1e-12);
        assertEquals(700.025, falling.highest(), 1e-12);
        PixelGrid rising = falling.rising();
        assertEquals(false, rising.falling());
        for (int p = 0; p < 4; p++) {
            assertEquals(falling.centre(p), rising.centre(3 - p), 1e-12);
        }
        PixelGrid up = PixelGrid.linear(400, 500, 4);
        assertEquals(false, up.falling());
        assertEquals(true, up.rising() == up);
        assertEquals(400, up.lowest(), 0);
        assertEquals(500, up.highest(), 0);
        assertEquals(true, PixelGrid.of(new double[] {3, 2, 1}).falling());
    }

    @Test
    void refusesGridsThatTurn() {
        // Centres 600 + 0.05 p - 0.01 p^2 turn back after p = 2.5: edge 4 (600.0525) < edge 3 (600.0625).
        String message = assertThrows(IllegalArgumentException.class,
                () -> PixelGrid.dispersion(new double[] {600, 0.05, -0.01}, 5)).getMessage();
        assertEquals(true, message.startsWith("pixel edges must rise or fall throughout: edge 4 (600.05"), message);
        assertEquals(true, message.contains("is not above edge 3 (600.06"), message);
        assertEquals("pixel edges must rise or fall throughout: edge 2 (4.0) is not below edge 1 (2.0),"
                + " as the edges before it", assertThrows(IllegalArgumentException.class,
                        () -> PixelGrid.of(new double[] {3, 2, 4})).getMessage());
        assertEquals("pixel edges must rise or fall throughout: edge 1 (3.0) is not above edge 0 (3.0)",
                assertThrows(IllegalArgumentException.class, () -> PixelGrid.of(new double[] {3, 3})).getMessage());
        assertThrows(IllegalArgumentException.class, () -> PixelGrid.linear(5, 5, 10));
        assertThrows(IllegalArgumentException.class, () -> PixelGrid.logarithmic(-1, 5, 10));
        assertEquals("a grid needs at least one pixel, got 0",
                assertThrows(IllegalArgumentException.class, () -> PixelGrid.linear(0, 1, 0)).getMessage());
        assertEquals("dispersion coefficient c1 is not finite: NaN",
                assertThrows(IllegalArgumentException.class,
                        () -> PixelGrid.dispersion(new double[] {600, Double.NaN}, 4)).getMessage());
    }
}
