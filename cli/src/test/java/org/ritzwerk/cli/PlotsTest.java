package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Font;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The line chart leaves room above its tallest line for that line's upright label. */
class PlotsTest {

    private static final Font FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 11);

    @Test
    void aLongLabelOnTheTallestLineFitsUnderTheTopOfTheAxis() {
        System.setProperty("java.awt.headless", "true");
        double[] x = {1, 2, 3};
        double[] y = {0, 100, 0};
        String text = "D I Balmer alpha / H I Balmer alpha";
        double top = Plots.axisTop(x, y, 100, List.of(new Plots.Label(2, text)), FONT);
        int width = new java.awt.image.BufferedImage(1, 1, java.awt.image.BufferedImage.TYPE_INT_RGB)
                .createGraphics().getFontMetrics(FONT).stringWidth(text);
        // The label runs from 103 upward over `width` pixels of a data area at least 580 px high.
        assertTrue(top - 103 >= width / 580.0 * top, "top " + top + " for a " + width + " px label");
        // Without labels the axis keeps its usual 35 % head room.
        assertEquals(135, Plots.axisTop(x, y, 100, List.of(), FONT), 1e-9);
    }
}
