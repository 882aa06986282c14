package org.ritzwerk.engine.synth;

import java.util.Objects;
import org.ritzwerk.medium.Medium;

/**
 * A rendered {@link Scene}: the pixel grid and the medium of its wavelengths (the scene's axis
 * medium, so a writer labels the axis from the spectrum itself), the expected counts per pixel before noise, the
 * counts with noise (equal to the expected counts for a noise-free scene), and the lines with
 * the counts each carries: over its whole profile ({@link #lineCounts}) and the part of them the
 * pixels hold ({@link #lineCountsInPixels}). Arrays are copied out; the value is immutable.
 */
public final class SyntheticSpectrum {

    private final PixelGrid grid;
    private final Medium medium;
    private final double[] expected;
    private final double[] counts;
    private final Scene.Lines lines;
    private final double[] lineCounts;
    private final double[] inPixels;

    SyntheticSpectrum(PixelGrid grid, Medium medium, double[] expected, double[] counts, Scene.Lines lines,
            double[] lineCounts, double[] inPixels) {
        this.grid = grid;
        this.medium = medium;
        this.expected = expected;
        this.counts = counts;
        this.lines = lines;
        this.lineCounts = lineCounts;
        this.inPixels = inPixels;
    }

    /**
     * A spectrum from its parts, for instance as read back from a file; the arrays are copied.
     *
     * @param grid           the pixels, nm
     * @param medium         the medium of the grid's wavelengths and the lines' positions
     * @param expectedCounts expected counts per pixel, one per pixel
     * @param counts         counts per pixel with noise, one per pixel
     * @param lines          the lines that went in
     * @param lineCounts     each line's expected counts over its whole profile, one per line
     * @param inPixels       the part of them the pixels hold, one per line
     * @return the spectrum
     * @throws IllegalArgumentException when an array's length does not match the grid or the lines
     */
    public static SyntheticSpectrum of(PixelGrid grid, Medium medium, double[] expectedCounts, double[] counts,
            Scene.Lines lines, double[] lineCounts, double[] inPixels) {
        Objects.requireNonNull(medium, "medium");
        if (expectedCounts.length != grid.pixels() || counts.length != grid.pixels()) {
            throw new IllegalArgumentException("a grid of " + grid.pixels() + " pixels needs as many expected counts ("
                    + expectedCounts.length + " given) and counts (" + counts.length + " given)");
        }
        if (lineCounts.length != lines.size() || inPixels.length != lines.size()) {
            throw new IllegalArgumentException(lines.size() + " lines need as many line counts and counts in the"
                    + " pixels, got " + lineCounts.length + " and " + inPixels.length);
        }
        return new SyntheticSpectrum(grid, medium, expectedCounts.clone(), counts.clone(), lines, lineCounts.clone(),
                inPixels.clone());
    }

    /** @return the pixels */
    public PixelGrid grid() {
        return grid;
    }

    /**
     * @return the medium of the grid's wavelengths and of the lines' positions: the axis medium
     *         the scene was built with ({@link Scene.Builder#medium}, vacuum by default)
     */
    public Medium medium() {
        return medium;
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
     * @return the line's expected counts over its whole profile, before noise: what a fit of the
     *         line's profile recovers, also where part of the line lies beyond the grid
     */
    public double lineCounts(int i) {
        return lineCounts[i];
    }

    /**
     * @param i line index
     * @return the part of {@link #lineCounts} the pixels hold: the share of the line's profile
     *         (with the instrument's width) between the grid's ends, and for the windowed renderer
     *         within its window; less where the line lies near or beyond an end of the grid, next
     *         to none for a line far beyond it. Summed over the lines, the expected counts' sum
     *         (to the fast renderer's bound, where it is used)
     */
    public double lineCountsInPixels(int i) {
        return inPixels[i];
    }

    /**
     * The lines whose centre lies on the grid but which carry no light in this spectrum (expected
     * counts {@link #lineCounts} of 0), each with its index, label, position and cause
     * ({@link DarkLines}: an intensity of 0 in a line list or one that became 0 in the list's
     * scaling; a list intensity whose counts underflow once scaled to the brightest pixel; a
     * computed population that underflowed), and how many lines lie on the grid. Computed on each
     * call, in one pass over the lines.
     *
     * @return the lines on the grid and the dark ones among them
     */
    public DarkLines darkLines() {
        return DarkLines.find(lines, grid, i -> lineCounts[i] == 0);
    }
}
