package org.ritzwerk.engine.synth;

import java.util.Arrays;

/**
 * The pixels of a detector along the spectral axis, as {@code pixels + 1} edges in one unit of
 * the caller's choice (nm, Hz, cm-1, ...), strictly rising or strictly falling with the pixel
 * index, as the detector reads them. Pixel i lies between edge(i) and edge(i + 1). Renderers
 * fill their output in this order, so a falling grid gives counts in the detector's order.
 * Because the unit is the caller's, edges may be 0 or negative (pixel positions from -0.5, an
 * axis centred on a line); a wavelength grid that does not start above 0 is refused where it is
 * first known to be one, by {@link Scene#builder(PixelGrid)}.
 * Immutable.
 */
public final class PixelGrid {

    private final double[] edges;
    private final boolean falling;
    /** This grid with its pixels in rising order: itself when it rises. */
    private final PixelGrid rising;

    private PixelGrid(double[] edges) {
        this.edges = edges;
        this.falling = edges[1] < edges[0];
        if (falling) {
            double[] r = new double[edges.length];
            for (int i = 0; i < r.length; i++) {
                r[i] = edges[edges.length - 1 - i];
            }
            this.rising = new PixelGrid(r);
        } else {
            this.rising = this;
        }
    }

    /**
     * @param start first edge
     * @param end   last edge, above start
     * @param pixels number of pixels, at least 1
     * @return equal pixels from start to end
     */
    public static PixelGrid linear(double start, double end, int pixels) {
        checkRange(start, end, pixels);
        double[] e = new double[pixels + 1];
        double step = (end - start) / pixels;
        for (int i = 0; i <= pixels; i++) {
            e[i] = start + i * step;
        }
        e[pixels] = end;
        return new PixelGrid(e);
    }

    /**
     * Pixels of constant relative width (constant resolving power per pixel), as from a
     * spectrograph sampled in log wavelength.
     *
     * @param start  first edge, positive
     * @param end    last edge, above start
     * @param pixels number of pixels, at least 1
     * @return edges in geometric progression
     */
    public static PixelGrid logarithmic(double start, double end, int pixels) {
        checkRange(start, end, pixels);
        if (!(start > 0)) {
            throw new IllegalArgumentException("a logarithmic grid needs a positive start, got " + start);
        }
        double[] e = new double[pixels + 1];
        double ratio = Math.log(end / start) / pixels;
        for (int i = 0; i <= pixels; i++) {
            e[i] = start * Math.exp(i * ratio);
        }
        e[pixels] = end;
        return new PixelGrid(e);
    }

    /**
     * Pixels whose centres follow a dispersion polynomial: the centre of pixel p (0-based) is
     * {@code c0 + c1 p + c2 p^2 + ...}; edges lie at p -+ 1/2.
     *
     * @param coefficients c0, c1, ... (at least c0 and c1)
     * @param pixels       number of pixels, at least 1
     * @return the grid, falling when the polynomial falls (a spectrometer that reads long
     *         wavelengths first)
     * @throws IllegalArgumentException when the polynomial turns within the pixels (neither
     *         rises nor falls across every pixel), naming the first edge where it turns
     */
    public static PixelGrid dispersion(double[] coefficients, int pixels) {
        if (coefficients.length < 2) {
            throw new IllegalArgumentException("a dispersion polynomial needs at least two coefficients, got "
                    + coefficients.length);
        }
        for (int k = 0; k < coefficients.length; k++) {
            if (!Double.isFinite(coefficients[k])) {
                throw new IllegalArgumentException("dispersion coefficient c" + k + " is not finite: " + coefficients[k]);
            }
        }
        if (pixels < 1) {
            throw new IllegalArgumentException("a grid needs at least one pixel, got " + pixels);
        }
        double[] e = new double[pixels + 1];
        for (int i = 0; i <= pixels; i++) {
            double p = i - 0.5;
            double v = 0;
            for (int k = coefficients.length - 1; k >= 0; k--) {
                v = v * p + coefficients[k];
            }
            e[i] = v;
        }
        return of(e);
    }

    /**
     * @param edges pixel edges in the detector's order, at least two, finite and strictly rising
     *              or strictly falling
     * @return a grid over a copy of them
     */
    public static PixelGrid of(double[] edges) {
        if (java.util.Objects.requireNonNull(edges, "edges").length < 2) {
            throw new IllegalArgumentException("a grid needs at least two edges, got " + edges.length);
        }
        for (int i = 0; i < edges.length; i++) {
            if (!Double.isFinite(edges[i])) {
                throw new IllegalArgumentException("pixel edge " + i + " is not finite: " + edges[i]);
            }
        }
        boolean fall = edges[1] < edges[0];
        for (int i = 1; i < edges.length; i++) {
            if (!(fall ? edges[i] < edges[i - 1] : edges[i] > edges[i - 1])) {
                throw new IllegalArgumentException("pixel edges must rise or fall throughout: edge " + i + " ("
                        + edges[i] + ") is not " + (fall ? "below" : "above") + " edge " + (i - 1) + " ("
                        + edges[i - 1] + ")" + (i > 1 ? ", as the edges before it" : ""));
            }
        }
        return new PixelGrid(edges.clone());
    }

    private static void checkRange(double start, double end, int pixels) {
        if (!Double.isFinite(start) || !Double.isFinite(end) || !(end > start)) {
            throw new IllegalArgumentException("a grid needs finite start < end, got " + start + " to " + end);
        }
        if (pixels < 1) {
            throw new IllegalArgumentException("a grid needs at least one pixel, got " + pixels);
        }
    }

    /** @return the number of pixels */
    public int pixels() {
        return edges.length - 1;
    }

    /**
     * @return whether the edges fall with the pixel index (the detector reads the high end of the
     *         axis first)
     */
    public boolean falling() {
        return falling;
    }

    /**
     * @return the same pixels in rising order: this grid when it rises; otherwise pixel p of the
     *         result is pixel {@code pixels() - 1 - p} of this one
     */
    public PixelGrid rising() {
        return rising;
    }

    /** @return the lowest edge, at one end of the grid */
    public double lowest() {
        return rising.edges[0];
    }

    /** @return the highest edge, at one end of the grid */
    public double highest() {
        return rising.edges[edges.length - 1];
    }

    /**
     * @param i edge index, 0 .. pixels
     * @return the edge
     */
    public double edge(int i) {
        return edges[i];
    }

    /**
     * @param i pixel index
     * @return the pixel's midpoint
     */
    public double centre(int i) {
        return 0.5 * (edges[i] + edges[i + 1]);
    }

    /**
     * @param position a position on the axis
     * @return the index of the first edge above position (0 .. pixels + 1), on a rising grid
     */
    int firstEdgeAbove(double position) {
        assert !falling : "firstEdgeAbove needs a rising grid";
        int k = Arrays.binarySearch(edges, position);
        return k >= 0 ? k + 1 : -k - 1;
    }
}
