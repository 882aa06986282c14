package org.ritzwerk.engine.synth;

import java.util.Arrays;
import org.ritzwerk.engine.profile.Profiles;

/**
 * Renders many Voigt lines into the pixels of a {@link PixelGrid} through the Fourier domain: the
 * same pixel fluxes as {@link LineRenderer} (each pixel receives the line flux between its
 * edges), at a cost linear in the number of lines and N log N in the number of internal grid
 * points, instead of lines x pixels-per-window Voigt evaluations.
 *
 * <h2>Method</h2>
 * The line list is turned into a distribution over position and the two widths, and the
 * spectrum is that distribution's integral against the Voigt profile, as in the discrete
 * integral transform of D. C. M. van den Bekerom and E. Pannier, "A discrete integral transform
 * for rapid spectral synthesis", J. Quant. Spectrosc. Radiat. Transfer 261, 107476 (2021),
 * doi:10.1016/j.jqsrt.2020.107476. The line shape is applied in Fourier space, where the Voigt
 * profile is a closed form; that representation, and rendering through two Fourier transforms,
 * go back to A. H. Karp, "Efficient computation of spectral line shapes", J. Quant. Spectrosc.
 * Radiat. Transfer 20, 379 (1978) (volume and page from memory; title, author and abstract
 * checked on the journal's abstract page). The steps, as implemented here:
 * <ol>
 * <li><b>Width grids.</b> Each line's Gaussian variance s = sigma^2 (sigma = FWHM_G / (2 sqrt(2
 * ln 2)), the instrument's FWHM added in quadrature as in {@link LineRenderer}) and Lorentzian
 * half width gamma = FWHM_L / 2 are placed on geometric node grids s_min q^b, gamma_min q^c
 * (q = {@value #NODE_RATIO}; a node at 0 for lines with zero width of that kind). The line's
 * flux is shared among the 4 nearest nodes of each grid (a 4 x 4 block) with the Lagrange
 * weights of cubic interpolation in s and in gamma. Since the Fourier transform of the profile
 * is exp(-2 pi^2 s k^2) exp(-2 pi gamma |k|), the shared profile is the cubic interpolant of
 * the exact one in s and gamma: area (the weights sum to 1), position (every share stays at the
 * line's position), and the moments s^0 .. s^3 and gamma^0 .. gamma^3 are kept exactly, so the
 * variance and the far Lorentzian wings (flux x gamma / (pi x^2)) are right, and the error is of
 * fourth order in the node spacing. A line whose width falls on a node goes to that node alone.
 * </li>
 * <li><b>Positions.</b> Each share is spread onto a uniform internal grid of step h with a
 * truncated Gaussian kernel exp(-x^2 / (2 tau^2)) over {@value #SPREAD} points and divided out
 * again in Fourier space, which makes the line positions exact up to the kernel's truncation and
 * aliasing (the Gaussian gridding of L. Greengard and J.-Y. Lee, "Accelerating the nonuniform
 * fast Fourier transform", SIAM Rev. 46, 443 (2004), doi:10.1137/S003614450343200X, with
 * oversampling 1.5 and tau^2 = rho h^2 chosen so both errors are exp(-1.81 x 8), about 5e-7).
 * </li>
 * <li><b>Line shape and pixels in Fourier space.</b> For each occupied width pair the grid is
 * transformed (a real FFT of Apache Commons Math) and multiplied by
 * exp(-2 pi^2 (s_b - tau^2) k^2 - 2 pi gamma_c |k|) h sinc(pi k h) / (sqrt(2 pi) tau), k in
 * cycles per unit: the Voigt profile's transform (the product of the Gaussian's
 * exp(-2 pi^2 sigma^2 k^2) and the Lorentzian's exp(-2 pi gamma |k|), both from
 * integral exp(-2 pi i k x) f(x) dx), the integral over one internal cell of width h (the
 * transform of a box of width h is h sin(pi k h) / (pi k h)) and the kernel divided out. The
 * sum over width pairs is transformed back once: the result is the flux in each internal cell,
 * exactly integrated over the cell.</li>
 * <li><b>Pixels.</b> On a linear grid the step is the pixel width over a whole number, the
 * cells tile the pixels and a pixel's flux is the sum of its cells, with no further error. On
 * any other grid (logarithmic, dispersion polynomial, given edges) the step is at most half the
 * narrowest pixel, and a pixel edge inside a cell takes its share of the cell from the quintic
 * through the cumulative flux at the six nearest cell edges (error below 0.005 h^6 |f^(5)|).</li>
 * </ol>
 * The step h is chosen so that the narrowest occupied profile's transform has fallen to
 * exp(-{@value #BAND_LOG}) at the edge of the accurately represented band, 1 / (3 h).
 *
 * <h2>Accuracy and range</h2>
 * The stated bound: every pixel within 1e-4 of the brightest pixel of the exact result (the
 * exact windowed renderer with a window wide enough that its own truncation does not show). The
 * error's parts: the width nodes' interpolation, fourth order in q - 1 (worst seen 3e-5 at
 * q = 1.1, 6e-7 at q = 1.03; q = {@value #NODE_RATIO} is used); the band cut, exp(-14) = 8e-7
 * of a line's transform; the kernel, 5e-7; on grids that are not linear the pixel edges'
 * interpolation. No light wraps around the periodic internal grid (see below).
 * Tested ({@code FastLineRendererTest}, {@code SceneTest}): single Gaussian and Lorentzian lines
 * 0.05 to 500 pixels wide against the erf and arctan closed forms; random scenes of 20 to 60
 * lines with Gaussian and Lorentzian FWHMs between 0.3 and 6 pixels (some zero, widths within a
 * factor 3 of each other), on linear, logarithmic and dispersion grids, with and without an
 * instrument; the worst difference seen is 1.3e-5 of the brightest pixel, and the tests fail
 * above 3e-5. The pixels hold the share of each line's profile that lies between the grid's ends
 * to 1e-9 of its flux, and the far wings of a line near one end are right to 1e-4 of their own
 * value at the other end (tested against {@code scipy.special.voigt_profile} integrated over the
 * pixels, {@code golden/fast-wings.csv}, and against the exact renderer with a window spanning
 * the grid).
 *
 * <p>Unlike {@link LineRenderer}, this renderer draws the whole profile, no window: its result
 * differs from the windowed one by the wings the window leaves out
 * ({@link LineRenderer#truncationBound}). The internal grid extends a margin of
 * {@value #MARGIN} sqrt(gamma_max FWHM_max) (at least 16 widest FWHMs) beyond both ends of the
 * pixel grid; lines beyond it, whose light in the pixels is below 1e-6 of their own peak, are
 * left out. The internal grid is periodic, so a plain product of transforms would be a circular
 * convolution: a Lorentzian wing leaving one end would come back in at the other (1.9 % of the
 * true wing in the last pixels of a 100 nm grid with a 0.5 nm wide line 1 nm inside the first
 * end). When any line has a Lorentzian width the period is therefore at least twice the pixel
 * range plus the margin, and every profile is cut off at half the period (its wings' transform
 * beyond there subtracted analytically, see {@code tailTransform}): every kept line then reaches
 * every pixel through one image only, and the convolution is the linear one. Gaussian lines need
 * neither (they are below exp(-700) of their peak beyond the margin); the period then holds the
 * pixel range and the margins only. The
 * cost grows with the spread of widths: the number of width pairs is about
 * (ln(s_max / s_min) / ln q + 3) (ln(gamma_max / gamma_min) / ln q + 3) at most, 16 per line.
 *
 * <h2>Cost and memory</h2>
 * Time: lines x (width pairs per line, 1 to 16) x {@value #SPREAD} kernel values, plus one real
 * FFT per occupied width pair and one back. Memory: the spreading grids, 8 bytes per internal
 * point per occupied width pair, in batches of at most 64 MB (or one grid); and 48 bytes per
 * internal point for the transforms and sums (56 with Lorentzian widths). The internal grid has a
 * power-of-two number of points, about (pixel range + 2 margins) / h, twice (pixel range +
 * margin) / h with Lorentzian widths. Lines are read from the caller's arrays, none is
 * copied.
 *
 * <h2>Threads</h2>
 * The computation runs on the caller's thread; its result does not depend on the thread count
 * given to {@link #render(double[], double[], double[], double[], double[], int)}, bit for bit.
 *
 * <p>Immutable and thread-safe; {@code render} writes only to the caller's output array.
 */
public final class FastLineRenderer {

    /** Ratio of neighbouring width nodes (Gaussian variance and Lorentzian half width). */
    static final double NODE_RATIO = 1.05;
    /** Kernel points per line share. */
    static final int SPREAD = 16;
    /** The narrowest profile's transform falls to exp(-BAND_LOG) at the band's edge. */
    static final double BAND_LOG = 14;
    /** Padding beyond each end of the pixel grid, in sqrt(largest Lorentzian half width x widest FWHM). */
    static final double MARGIN = 1000;
    /** On grids that are not linear, the step is this fraction of the band's (for the pixel edges' interpolation). */
    private static final double NONLINEAR_STEP = 0.7;
    /** The largest internal grid, points. */
    static final int MAX_POINTS = 1 << 26;
    /** {@link Renderer#AUTO} takes this renderer only up to this many occupied width pairs. */
    static final int AUTO_MAX_PAIRS = 256;
    /** Spreading grids held at once, in points (8 bytes each): 64 MB, or one grid if that is larger. */
    private static final long SPREAD_BUDGET = 1L << 23;
    /** Oversampling of the band by the internal grid. */
    private static final double OVERSAMPLING = 1.5;
    private static final double FWHM_TO_SIGMA = 1 / (2 * Math.sqrt(2 * Math.log(2)));
    /** tau^2 / h^2: equal truncation and aliasing errors, exp(-pi w sqrt(1 - 1/R)), w = SPREAD / 2. */
    private static final double RHO = (SPREAD / 2.0) / (2 * Math.PI * Math.sqrt(1 - 1 / OVERSAMPLING));
    private static final double KERNEL_SUM = Math.sqrt(2 * Math.PI * RHO);

    /** The grid in rising order; {@link #falling} says whether out is filled the other way. */
    private final PixelGrid grid;
    private final boolean falling;
    private final Instrument instrument;

    /**
     * @param grid       the pixels
     * @param instrument the spectrometer's response, {@link Instrument#ideal()} for none
     */
    public FastLineRenderer(PixelGrid grid, Instrument instrument) {
        this.grid = grid.rising();
        this.falling = grid.falling();
        this.instrument = instrument;
    }

    /**
     * Adds the lines' pixel fluxes to {@code out}.
     *
     * @param position     line centres in the grid's unit
     * @param flux         integrated line fluxes, finite and not negative
     * @param gaussianFwhm Gaussian (Doppler) FWHMs before the instrument, not negative
     * @param lorentzFwhm  Lorentzian FWHMs, not negative; each line needs some width once the
     *                     instrument's is added
     * @param out          pixel fluxes, one per pixel, added to (each addition at least 0: the
     *                     transforms' round-off below zero in dark pixels is set to 0); untouched when a
     *                     line is refused
     * @throws IllegalArgumentException naming the first unusable line and field, when the
     *         internal grid would exceed {@value #MAX_POINTS} points (lines far narrower than the
     *         pixel range, or one line far wider: use {@link LineRenderer}), or when its arrays
     *         ({@link #bytes}) would not fit in the JVM's largest heap ({@code -Xmx}), with both sizes
     */
    public void render(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm, double[] out) {
        LineRenderer.checkLines(grid, instrument, position, flux, gaussianFwhm, lorentzFwhm, out);
        Plan plan = plan(position, flux, gaussianFwhm, lorentzFwhm);
        if (plan == null) {
            return;
        }
        if (plan.points > MAX_POINTS) {
            throw new IllegalArgumentException("the fast renderer would need " + plan.points
                    + " internal points (at most " + MAX_POINTS + "): the lines are too narrow for the pixel range, "
                    + "or one is too wide; use the exact renderer");
        }
        String tooBig = tooBig(plan.points, plan.pairs, out.length, Runtime.getRuntime().maxMemory());
        if (tooBig != null) {
            throw new IllegalArgumentException(tooBig);
        }
        double[] drawn = new double[out.length];
        plan.render(position, flux, gaussianFwhm, lorentzFwhm, drawn);
        // The transforms' round-off leaves dark pixels a hair below zero (1e-12 of the brightest
        // pixel, say): a flux is never negative, so those are set to zero.
        for (int p = 0, n = out.length; p < n; p++) {
            double v = drawn[p] > 0 ? drawn[p] : 0;
            out[falling ? n - 1 - p : p] += v;
        }
    }

    /**
     * As {@link #render(double[], double[], double[], double[], double[])}; the result is the same
     * for any thread count, bit for bit (the work runs on the caller's thread).
     *
     * @param position     line centres in the grid's unit
     * @param flux         integrated line fluxes (any unit, e.g. photons), finite and not negative
     * @param gaussianFwhm Gaussian (Doppler) FWHMs before the instrument, in the grid's unit, not
     *                     negative
     * @param lorentzFwhm  Lorentzian FWHMs in the grid's unit, not negative
     * @param out          pixel fluxes in the unit of {@code flux}, one per pixel, added to
     * @param threads      number of threads, 1 to 1024
     * @throws IllegalArgumentException as the single-threaded form, or for a bad thread count
     */
    public void render(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm, double[] out,
            int threads) {
        if (threads < 1 || threads > 1024) {
            throw new IllegalArgumentException("threads must be 1 to 1024, got " + threads);
        }
        render(position, flux, gaussianFwhm, lorentzFwhm, out);
    }

    /**
     * The number of internal grid points and occupied width pairs this renderer would use for
     * these (valid) lines, for choosing between renderers; {@code {0, 0}} when no line has flux.
     *
     * @return {points, width pairs}
     */
    long[] size(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm) {
        Plan plan = plan(position, flux, gaussianFwhm, lorentzFwhm);
        return plan == null ? new long[] {0, 0} : new long[] {plan.points, plan.pairs};
    }

    private double variance(double position, double gaussianFwhm) {
        // The squares of finite FWHMs below 1e150 stay finite: no need for hypot's care (and cost).
        double instrumental = instrument.fwhmAt(position);
        return (gaussianFwhm * gaussianFwhm + instrumental * instrumental) * (FWHM_TO_SIGMA * FWHM_TO_SIGMA);
    }

    /**
     * The memory a rendering's arrays take at once, for a plan of {@code points} internal points
     * and {@code pairs} width pairs over {@code pixels} pixels: the batch of spread grids (as many
     * pairs as fit {@value #SPREAD_BUDGET} doubles, at least one), the summed, working and factor
     * transforms, the transform's tables and the result (8 bytes a double).
     *
     * @return bytes, an estimate to within the objects' headers
     */
    static long bytes(long points, long pairs, int pixels) {
        long batch = Math.max(1, Math.min(pairs, SPREAD_BUDGET / Math.max(1, points)));
        long half = points / 2 + 1;
        return 8 * (batch * points + points + 9 * half + points + 2L * pixels) + 4 * pairs;
    }

    /**
     * @param heap the largest heap, bytes
     * @return why a plan's arrays ({@link #bytes}) cannot fit in that heap, or null when they can
     */
    static String tooBig(long points, long pairs, int pixels, long heap) {
        long bytes = bytes(points, pairs, pixels);
        if (bytes <= heap) {
            return null;
        }
        return String.format(java.util.Locale.ROOT, "the fast renderer would need about %.0f MB for its internal "
                + "grid of %d points and %d width pairs, more than the JVM's largest heap of %.0f MB (-Xmx): use the "
                + "exact renderer, or a larger heap", bytes / 1e6, points, pairs, heap / 1e6);
    }

    /** The plan for these lines, or null when no line has flux. */
    private Plan plan(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm) {
        double sMin = Double.POSITIVE_INFINITY;
        double sMax = 0;
        double gMin = Double.POSITIVE_INFINITY;
        double gMax = 0;
        boolean sZero = false;
        boolean gZero = false;
        double widest = 0;
        int lines = 0;
        for (int i = 0; i < position.length; i++) {
            if (flux[i] == 0) {
                continue;
            }
            lines++;
            double s = variance(position[i], gaussianFwhm[i]);
            double g = lorentzFwhm[i] / 2;
            if (s == 0) {
                sZero = true;
            } else {
                sMin = Math.min(sMin, s);
                sMax = Math.max(sMax, s);
            }
            if (g == 0) {
                gZero = true;
            } else {
                gMin = Math.min(gMin, g);
                gMax = Math.max(gMax, g);
            }
            widest = Math.max(widest, Profiles.voigtFwhm(Math.sqrt(s) / FWHM_TO_SIGMA, 2 * g));
        }
        if (lines == 0) {
            return null;
        }
        Nodes sNodes = new Nodes(sZero, sMin, sMax);
        Nodes gNodes = new Nodes(gZero, gMin, gMax);
        boolean[] occupied = new boolean[sNodes.size() * gNodes.size()];
        int[] si = new int[4];
        int[] gi = new int[4];
        double[] sw = new double[4];
        double[] gw = new double[4];
        for (int i = 0; i < position.length; i++) {
            if (flux[i] == 0) {
                continue;
            }
            int ns = sNodes.stencil(variance(position[i], gaussianFwhm[i]), si, sw);
            int ng = gNodes.stencil(lorentzFwhm[i] / 2, gi, gw);
            for (int a = 0; a < ns; a++) {
                for (int b = 0; b < ng; b++) {
                    occupied[si[a] * gNodes.size() + gi[b]] = true;
                }
            }
        }
        // The narrowest occupied profile sets the band: 2 pi^2 s k^2 + 2 pi gamma k = BAND_LOG.
        double band = 0;
        int pairs = 0;
        for (int a = 0; a < sNodes.size(); a++) {
            for (int b = 0; b < gNodes.size(); b++) {
                if (occupied[a * gNodes.size() + b]) {
                    pairs++;
                    band = Math.max(band, bandEdge(sNodes.value(a), gNodes.value(b)));
                }
            }
        }
        double hBand = 1 / (2 * OVERSAMPLING * band);
        int pixels = grid.pixels();
        double lo = grid.edge(0);
        double range = grid.edge(pixels) - lo;
        double mean = range / pixels;
        double narrowest = Double.POSITIVE_INFINITY;
        boolean uniform = true;
        for (int p = 0; p < pixels; p++) {
            double width = grid.edge(p + 1) - grid.edge(p);
            narrowest = Math.min(narrowest, width);
            uniform &= Math.abs(grid.edge(p) - (lo + p * mean)) <= 1e-9 * mean;
        }
        double h;
        if (uniform) {
            h = mean / Math.ceil(mean / hBand);
        } else {
            h = Math.min(NONLINEAR_STEP * hBand, narrowest / 2);
        }
        // A Voigt wing at distance D is about flux gamma / (pi D^2); the peak is at least
        // flux / (pi gamma) (Lorentzian) or about flux / (1.064 FWHM) (Gaussian): at
        // D = MARGIN sqrt(gamma FWHM) the wing is below 1 / MARGIN^2 of the peak.
        double margin = Math.max(Math.max(MARGIN * Math.sqrt(gMax * widest), 16 * widest), 2 * SPREAD * h);
        double cells = Math.ceil(range / h - 1e-9);
        // Lorentzian wings reach everywhere: the grid holds twice the pixels and a margin, so that the
        // profile truncated at half the period (see tailTransform) reaches every pixel from every kept
        // line and no wing wraps around. Gaussian lines are negligible beyond the margin already.
        boolean truncated = gMax > 0;
        double need = truncated ? 2 * (cells + Math.ceil(margin / h) + SPREAD + 4)
                : cells + 2 * Math.ceil(margin / h) + 8;
        long points = Long.highestOneBit((long) Math.min(need, 1L << 40));
        if (points < need) {
            points *= 2;
        }
        points = Math.max(points, 64);
        long first = (points - (long) cells) / 2;
        return new Plan(sNodes, gNodes, occupied, pairs, h, points, first, truncated ? (long) cells : -1);
    }

    /** The positive k where 2 pi^2 s k^2 + 2 pi gamma k = BAND_LOG. */
    private static double bandEdge(double s, double gamma) {
        double a = 2 * Math.PI * Math.PI * s;
        double b = 2 * Math.PI * gamma;
        if (a == 0) {
            return BAND_LOG / b;
        }
        // The root written to avoid cancellation: 2c / (b + sqrt(b^2 + 4ac)).
        return 2 * BAND_LOG / (b + Math.sqrt(b * b + 4 * a * BAND_LOG));
    }

    /**
     * A geometric grid of width nodes v_min q^b (and a node at 0 when some line has zero width of
     * this kind), with the stencil of 4 nodes and cubic Lagrange weights for a width.
     */
    static final class Nodes {
        private final double[] values;
        private final boolean zero;
        private final double min;
        private final int positive;
        private final int last;

        Nodes(boolean zero, double min, double max) {
            this.zero = zero;
            this.min = min;
            int count = 0;
            int lastInterval = 0;
            if (min <= max) {
                if (max == min) {
                    count = 1;
                } else {
                    lastInterval = (int) Math.floor(Math.log(max / min) / Math.log(NODE_RATIO));
                    count = Math.max(4, lastInterval + 3);
                }
            }
            this.positive = count;
            this.last = lastInterval;
            int offset = zero ? 1 : 0;
            values = new double[count + offset];
            for (int b = 0; b < count; b++) {
                values[b + offset] = b == 0 ? min : min * Math.pow(NODE_RATIO, b);
            }
        }

        int size() {
            return values.length;
        }

        double value(int node) {
            return values[node];
        }

        /**
         * @return the number of nodes (1 or 4) that share a width, their indices in {@code index}
         *         and weights in {@code weight}; zero weights are left out
         */
        int stencil(double v, int[] index, double[] weight) {
            if (v == 0) {
                index[0] = 0;
                weight[0] = 1;
                return 1;
            }
            int offset = zero ? 1 : 0;
            if (positive == 1) {
                index[0] = offset;
                weight[0] = 1;
                return 1;
            }
            int interval = (int) Math.floor(Math.log(v / min) / Math.log(NODE_RATIO));
            interval = Math.max(0, Math.min(last, interval));
            int start = Math.max(0, Math.min(positive - 4, interval - 1));
            int used = 0;
            for (int j = 0; j < 4; j++) {
                double w = 1;
                double vj = values[offset + start + j];
                for (int m = 0; m < 4; m++) {
                    if (m != j) {
                        double vm = values[offset + start + m];
                        w *= (v - vm) / (vj - vm);
                    }
                }
                if (w != 0) {
                    index[used] = offset + start + j;
                    weight[used] = w;
                    used++;
                }
            }
            return used;
        }
    }

    /** One rendering's internal grid and width nodes. */
    private final class Plan {
        private final Nodes sNodes;
        private final Nodes gNodes;
        private final boolean[] occupied;
        private final int pairs;
        private final double h;
        private final long points;
        /** Index of the internal cell whose left edge is the grid's first edge. */
        private final long first;
        /**
         * The pixel grid's length in cells when the profiles are truncated at half the period
         * (some line has a Lorentzian width), else -1 (a periodic grid, Gaussian lines only).
         */
        private final long truncatedCells;

        Plan(Nodes sNodes, Nodes gNodes, boolean[] occupied, int pairs, double h, long points, long first,
                long truncatedCells) {
            this.sNodes = sNodes;
            this.gNodes = gNodes;
            this.occupied = occupied;
            this.pairs = pairs;
            this.h = h;
            this.points = points;
            this.first = first;
            this.truncatedCells = truncatedCells;
        }

        void render(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm, double[] out) {
            int n = (int) points;
            int[] pairList = new int[pairs];
            int count = 0;
            for (int k = 0; k < occupied.length; k++) {
                if (occupied[k]) {
                    pairList[count++] = k;
                }
            }
            RealFft fft = new RealFft(n);
            int half = n / 2;
            double[] sumRe = new double[half + 1];
            double[] sumIm = new double[half + 1];
            double[] re = new double[half + 1];
            double[] im = new double[half + 1];
            double[] common = commonFactor(n);
            double[] tail = truncatedCells < 0 ? null : tailTransform(n, common);
            double[] factor = new double[half + 1];
            // Width pairs in batches that fit the memory budget; every pair's grid receives the
            // lines in line order and the spectra are summed in pair order, whatever the batches.
            int batch = (int) Math.max(1, Math.min(pairs, SPREAD_BUDGET / n));
            int[] slot = new int[occupied.length];
            double[][] grids = new double[batch][n];
            for (int from = 0; from < pairs; from += batch) {
                int to = Math.min(pairs, from + batch);
                Arrays.fill(slot, -1);
                for (int k = from; k < to; k++) {
                    slot[pairList[k]] = k - from;
                    if (from > 0) {
                        Arrays.fill(grids[k - from], 0);
                    }
                }
                spread(position, flux, gaussianFwhm, lorentzFwhm, slot, grids);
                for (int k = from; k < to; k++) {
                    int pair = pairList[k];
                    double s = sNodes.value(pair / gNodes.size());
                    double gamma = gNodes.value(pair % gNodes.size());
                    double tau2 = RHO * h * h;
                    for (int q = 0; q <= half; q++) {
                        double f = q / (n * h);
                        factor[q] = common[q] * Math.exp(-2 * Math.PI * Math.PI * (s - tau2) * f * f
                                - 2 * Math.PI * gamma * f);
                    }
                    if (tail != null && gamma > 0) {
                        for (int q = 0; q <= half; q++) {
                            factor[q] -= gamma * tail[q];
                        }
                    }
                    fft.forward(grids[k - from], re, im);
                    for (int q = 0; q <= half; q++) {
                        sumRe[q] += re[q] * factor[q];
                        sumIm[q] += im[q] * factor[q];
                    }
                }
            }
            double[] cells = new double[n];
            fft.inverse(sumRe, sumIm, cells);
            integrate(cells, out);
        }

        /** The factors common to every width pair: the cell's box, the kernel divided out. */
        private double[] commonFactor(int n) {
            int half = n / 2;
            double[] common = new double[half + 1];
            double norm = h / Math.sqrt(2 * Math.PI * RHO * h * h);
            for (int q = 0; q <= half; q++) {
                double x = Math.PI * q / n; // pi k h, k = q / (n h)
                common[q] = norm * (q == 0 ? 1 : Math.sin(x) / x);
            }
            return common;
        }

        /**
         * The transform of the Lorentzian wings beyond half the period, a = n h / 2, per unit half
         * width gamma, times the common factors and the kernel's deconvolution: subtracted from a
         * pair's factor, it makes the profile the Voigt profile cut off at |x| = a, so that with the
         * pixels and the kept lines within a of each other (see the plan) the circular convolution
         * is the linear one and no light wraps around the grid.
         *
         * <p>Beyond a (at least {@value #MARGIN} sqrt(gamma FWHM) and 16 FWHMs from the line) the
         * Voigt profile is gamma / (pi x^2) to a relative 3 sigma^2 / x^2 (the Lorentzian's
         * 1 / (x^2 + gamma^2) expanded, averaged over the Gaussian; common practice). Its two wings'
         * transform at k = q / (n h) is (2 gamma / pi) J, J = integral from a to infinity of
         * cos(2 pi k x) / x^2 dx = (2 / (n h)) (-1)^q G(pi q), where (integrating by parts, with
         * pi / 2 - Si(pi q) = (-1)^q f(pi q) in the auxiliary function f of the sine integral;
         * Abramowitz and Stegun 5.2.8 and 5.2.12, from memory)
         * G(x) = 1 - x f(x) = integral from 0 to infinity of 2 t exp(-x t) / (1 + t^2)^2 dt:
         * summed from its asymptotic series sum_m (-1)^m 2 (m + 1) (2m + 1)! / x^(2m + 2) for
         * x from 20 pi (terms down to exp(-x)), by composite 8-node Gauss-Legendre quadrature below.
         */
        private double[] tailTransform(int n, double[] common) {
            int half = n / 2;
            double[] out = new double[half + 1];
            double period = n * h;
            double tau2 = RHO * h * h;
            for (int q = 0; q <= half; q++) {
                double k = q / period;
                double j = 2 / period * ((q & 1) == 0 ? 1 : -1) * wingIntegral(Math.PI * q);
                out[q] = common[q] * Math.exp(2 * Math.PI * Math.PI * tau2 * k * k) * (2 / Math.PI) * j;
            }
            return out;
        }

        /** Spreads every line's shares of the pairs that have a slot into those slots' grids. */
        private void spread(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm,
                int[] slot, double[][] grids) {
            int n = (int) points;
            int gSize = gNodes.size();
            double lo = grid.edge(0);
            double[] kernelTail = new double[SPREAD];
            int w = SPREAD / 2;
            for (int m = -w + 1; m <= w; m++) {
                kernelTail[m + w - 1] = Math.exp(-m * m / (2 * RHO));
            }
            double[] kernel = new double[SPREAD];
            int[] si = new int[4];
            int[] gi = new int[4];
            double[] sw = new double[4];
            double[] gw = new double[4];
            for (int i = 0; i < position.length; i++) {
                if (flux[i] == 0) {
                    continue;
                }
                // Fractional index of the line among the cell centres (cell j is centred on
                // lo + (j - first + 1/2) h).
                double xi = (position[i] - lo) / h + first - 0.5;
                boolean kept = truncatedCells >= 0
                        ? xi >= truncatedCells / 2.0 + SPREAD && xi <= n - truncatedCells / 2.0 - SPREAD
                        : xi >= 0 && xi < n - 1;
                if (!kept) {
                    continue; // beyond the margin: see the class comment
                }
                int j0 = (int) Math.floor(xi);
                double d = xi - j0;
                // exp(-(m - d)^2 / 2 rho) = exp(-m^2 / 2 rho) exp(m d / rho) exp(-d^2 / 2 rho)
                double e1 = Math.exp(-d * d / (2 * RHO));
                double e2 = Math.exp(d / RHO);
                double up = e1;
                for (int m = 0; m <= w; m++) {
                    kernel[m + w - 1] = kernelTail[m + w - 1] * up;
                    up *= e2;
                }
                double down = e1 / e2;
                for (int m = -1; m > -w; m--) {
                    kernel[m + w - 1] = kernelTail[m + w - 1] * down;
                    down /= e2;
                }
                // The untruncated kernel's samples sum to sqrt(2 pi rho) (to exp(-2 pi^2 rho),
                // 1e-18): scaled to that sum, the truncated kernel keeps every line's flux.
                double sum = 0;
                for (int m = 0; m < SPREAD; m++) {
                    sum += kernel[m];
                }
                double scale = KERNEL_SUM / sum;
                int ns = sNodes.stencil(variance(position[i], gaussianFwhm[i]), si, sw);
                int ng = gNodes.stencil(lorentzFwhm[i] / 2, gi, gw);
                int start = j0 - w + 1;
                boolean wraps = start < 0 || start + SPREAD > n;
                for (int a = 0; a < ns; a++) {
                    for (int b = 0; b < ng; b++) {
                        int target = slot[si[a] * gSize + gi[b]];
                        if (target < 0) {
                            continue;
                        }
                        double[] into = grids[target];
                        double share = flux[i] * sw[a] * gw[b] * scale;
                        if (wraps) {
                            for (int m = 0; m < SPREAD; m++) {
                                into[Math.floorMod(start + m, n)] += share * kernel[m];
                            }
                        } else {
                            for (int m = 0; m < SPREAD; m++) {
                                into[start + m] += share * kernel[m];
                            }
                        }
                    }
                }
            }
        }

        /** Adds each pixel's flux, from the cells, to out. */
        private void integrate(double[] cells, double[] out) {
            double lo = grid.edge(0);
            int pixels = grid.pixels();
            double left = first;
            for (int p = 0; p < pixels; p++) {
                double right = (grid.edge(p + 1) - lo) / h + first;
                out[p] += between(cells, left, right);
                left = right;
            }
        }

        /** The flux between two cell-edge coordinates a < b. */
        private double between(double[] cells, double a, double b) {
            long ra = Math.round(a);
            long rb = Math.round(b);
            boolean aOnEdge = Math.abs(a - ra) < 1e-9;
            boolean bOnEdge = Math.abs(b - rb) < 1e-9;
            int ja = aOnEdge ? (int) ra : (int) Math.floor(a);
            int jb = bOnEdge ? (int) rb : (int) Math.floor(b);
            double sum = 0;
            if (!aOnEdge) {
                sum -= partial(cells, ja, a - ja);
            }
            for (int j = ja; j < jb; j++) {
                sum += cells[j];
            }
            if (!bOnEdge) {
                sum += partial(cells, jb, b - jb);
            }
            return sum;
        }
    }

    /**
     * G(x) = 1 - x f(x) = integral from 0 to infinity of 2 t exp(-x t) / (1 + t^2)^2 dt for
     * x = 0 or x &gt;= pi (f the auxiliary function of the sine integral), see the plan's
     * {@code tailTransform}: 1 at x = 0, about 2 / x^2 for large x.
     */
    static double wingIntegral(double x) {
        if (x == 0) {
            return 1;
        }
        if (x >= 20 * Math.PI) {
            // sum_m (-1)^m 2 (m + 1) (2m + 1)! / x^(2m + 2), up to its smallest term
            double inv2 = 1 / (x * x);
            double power = 2 * inv2; // 2 (2m + 1)! / x^(2m + 2) at m = 0
            double sum = 0;
            double previous = Double.POSITIVE_INFINITY;
            for (int m = 0; m < 200; m++) {
                double term = (m + 1) * power;
                if (term >= previous || term < 1e-18 * Math.abs(sum)) {
                    break;
                }
                sum += (m & 1) == 0 ? term : -term;
                previous = term;
                power *= (2 * m + 2) * (2 * m + 3) * inv2;
            }
            return sum;
        }
        // exp(-x t) is below exp(-60) beyond t = 60 / x: 240 panels of the 8-node rule.
        double end = 60 / x;
        int panels = 240;
        double width = end / panels;
        double sum = 0;
        for (int p = 0; p < panels; p++) {
            double a = p * width;
            sum += GaussLegendre.integrate(t -> 2 * t * Math.exp(-x * t) / ((1 + t * t) * (1 + t * t)), a, a + width);
        }
        return sum;
    }

    /**
     * The flux from the left edge of cell j to theta cells into it (0 &lt; theta &lt; 1): the
     * quintic through the cumulative flux at the edges j - 2 .. j + 3, evaluated at theta.
     */
    static double partial(double[] cells, int j, double theta) {
        double c0 = -(cells[j - 2] + cells[j - 1]);
        double c1 = -cells[j - 1];
        double c3 = cells[j];
        double c4 = cells[j] + cells[j + 1];
        double c5 = cells[j] + cells[j + 1] + cells[j + 2];
        double t = theta;
        // Lagrange basis on the nodes -2, -1, 0, 1, 2, 3 (the node 0 carries 0).
        double l0 = (t + 1) * t * (t - 1) * (t - 2) * (t - 3) / -120.0;
        double l1 = (t + 2) * t * (t - 1) * (t - 2) * (t - 3) / 24.0;
        double l3 = (t + 2) * (t + 1) * t * (t - 2) * (t - 3) / 12.0;
        double l4 = (t + 2) * (t + 1) * t * (t - 1) * (t - 3) / -24.0;
        double l5 = (t + 2) * (t + 1) * t * (t - 1) * (t - 2) / 120.0;
        return l0 * c0 + l1 * c1 + l3 * c3 + l4 * c4 + l5 * c5;
    }
}
