package org.ritzwerk.engine.synth;

/**
 * A rendered {@link Scene}: the pixel grid, the expected counts per pixel before noise, the
 * counts with noise (equal to the expected counts for a noise-free scene), and the lines with
 * the counts each put into the spectrum. Arrays are copied out; the value is immutable.
 */
public final class SyntheticSpectrum {

    private final PixelGrid grid;
    private final double[] expected;
    private final double[] counts;
    private final Scene.Lines lines;
    private final double[] lineCounts;

    SyntheticSpectrum(PixelGrid grid, double[] expected, double[] counts, Scene.Lines lines, double[] lineCounts) {
        this.grid = grid;
        this.expected = expected;
        this.counts = counts;
        this.lines = lines;
        this.lineCounts = lineCounts;
    }

    /**
     * A spectrum from its parts, for instance as read back from a file; the arrays are copied.
     *
     * @param grid           the pixels
     * @param expectedCounts expected counts per pixel, one per pixel
     * @param counts         counts per pixel with noise, one per pixel
     * @param lines          the lines that went in
     * @param lineCounts     each line's expected counts summed over the pixels, one per line
     * @return the spectrum
     * @throws IllegalArgumentException when an array's length does not match the grid or the lines
     */
    public static SyntheticSpectrum of(PixelGrid grid, double[] expectedCounts, double[] counts, Scene.Lines lines,
            double[] lineCounts) {
        if (expectedCounts.length != grid.pixels() || counts.length != grid.pixels()) {
            throw new IllegalArgumentException("a grid of " + grid.pixels() + " pixels needs as many expected counts ("
                    + expectedCounts.length + " given) and counts (" + counts.length + " given)");
        }
        if (lineCounts.length != lines.size()) {
            throw new IllegalArgumentException(lines.size() + " lines need as many line counts, got "
                    + lineCounts.length);
        }
        return new SyntheticSpectrum(grid, expectedCounts.clone(), counts.clone(), lines, lineCounts.clone());
    }

    /** @return the pixels */
    public PixelGrid grid() {
        return grid;
    }

    /** @return expected counts per pixel, before noise (a copy) */
    public double[] expectedCounts() {
        return expected.clone();
    }

    /** @return counts per pixel with noise (a copy) */
    public double[] counts() {
        return counts.clone();
    }

    /** @return the lines that went in */
    public Scene.Lines lines() {
        return lines;
    }

    /**
     * @param i line index
     * @return the line's expected counts summed over all pixels, before noise (less where the
     *         line lies near or beyond an end of the grid)
     */
    public double lineCounts(int i) {
        return lineCounts[i];
    }
}
