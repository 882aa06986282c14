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
    void refusesGridsThatDoNotIncrease() {
        // Centres 600 + 0.05 p - 0.01 p^2 turn back after p = 2.5: edge 4 (600.0525) < edge 3 (600.0625).
        String message = assertThrows(IllegalArgumentException.class,
                () -> PixelGrid.dispersion(new double[] {600, 0.05, -0.01}, 5)).getMessage();
        assertEquals(true, message.startsWith("pixel edges must increase: edge 4 (600.05"), message);
        assertEquals(true, message.contains("is not above edge 3 (600.06"), message);
        assertThrows(IllegalArgumentException.class, () -> PixelGrid.linear(5, 5, 10));
        assertThrows(IllegalArgumentException.class, () -> PixelGrid.logarithmic(-1, 5, 10));
        assertEquals("a grid needs at least one pixel, got 0",
                assertThrows(IllegalArgumentException.class, () -> PixelGrid.linear(0, 1, 0)).getMessage());
        assertEquals("dispersion coefficient c1 is not finite: NaN",
                assertThrows(IllegalArgumentException.class,
                        () -> PixelGrid.dispersion(new double[] {600, Double.NaN}, 4)).getMessage());
    }
}
