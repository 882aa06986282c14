package org.ritzwerk.engine.synth;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.DoubleConsumer;
import org.ritzwerk.engine.profile.Profiles;

/**
 * Renders lines with Voigt profiles into the pixels of a {@link PixelGrid}: each pixel receives
 * the line flux that falls between its edges (the integral of the profile over the pixel, not
 * a sample at its centre). Integration is Gauss-Legendre with 8 nodes (4 beyond 8 FWHMs, where
 * the wing bends slowly) on pieces no wider than a quarter of the larger of the line's FWHM and
 * the distance from its centre, which keeps every pixel's share within about 1e-10 of its exact
 * value.
 *
 * <p>Each line is rendered only within a window of {@code window} Voigt FWHMs either side of its
 * centre; the flux beyond is not rendered. The fraction lost is at most
 * {@link #truncationBound(double, double, double)}: for the default window of 50 FWHMs a pure
 * Lorentzian loses 0.6 %, a pure Gaussian nothing measurable. Widen the window where the far
 * Lorentzian wings matter.
 *
 * <p>{@link #render(double[], double[], double[], double[], double[], int)} splits the pixels
 * into contiguous blocks, one task each; every pixel still receives the lines' shares in line
 * order, computed the same way, so the result is the same as single-threaded, bit for bit.
 *
 * <p>Immutable and thread-safe; {@code render} writes only to the caller's output array.
 */
public final class LineRenderer {

    /** The default half-width of the rendering window, in Voigt FWHMs. */
    public static final double DEFAULT_WINDOW = 50;

    private static final double[] X = GaussLegendre.X;
    private static final double[] W = GaussLegendre.W;
    private static final double[] X4 = GaussLegendre.X4;
    private static final double[] W4 = GaussLegendre.W4;
    /** Distance from the centre, in FWHMs, beyond which pixels use the 4-node rule. */
    private static final double FAR_WING = 8;

    /** The grid in rising order; {@link #falling} says whether out is filled the other way. */
    private final PixelGrid grid;
    private final boolean falling;
    private final Instrument instrument;
    private final double window;

    /**
     * @param grid       the pixels
     * @param instrument the spectrometer's response, {@link Instrument#ideal()} for none
     * @param window     half-width of the rendering window in Voigt FWHMs, at least 1
     */
    public LineRenderer(PixelGrid grid, Instrument instrument, double window) {
        java.util.Objects.requireNonNull(grid, "grid");
        java.util.Objects.requireNonNull(instrument, "instrument");
        if (!(window >= 1) || Double.isInfinite(window)) {
            throw new IllegalArgumentException("the rendering window must be a finite number of FWHMs, at least 1, got "
                    + window);
        }
        this.grid = grid.rising();
        this.falling = grid.falling();
        this.instrument = instrument;
        this.window = window;
    }

    /**
     * Adds the lines' pixel fluxes to {@code out}.
     *
     * @param position     line centres in the grid's unit
     * @param flux         integrated line fluxes, finite and not negative
     * @param gaussianFwhm Gaussian (Doppler) FWHMs before the instrument, not negative
     * @param lorentzFwhm  Lorentzian FWHMs, not negative; each line needs some width once the
     *                     instrument's is added
     * @param out          pixel fluxes, one per pixel, added to; untouched when a line is refused
     * @throws IllegalArgumentException naming the first unusable line and field
     */
    public void render(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm, double[] out) {
        // Every line is checked before any is drawn, so a refused call leaves out as it was.
        checkAll(position, flux, gaussianFwhm, lorentzFwhm, out);
        renderBlock(position, flux, gaussianFwhm, lorentzFwhm, out, 0, out.length);
    }

    /**
     * As {@link #render(double[], double[], double[], double[], double[])}, on {@code threads}
     * threads, with the same result bit for bit.
     *
     * @param position     line centres in the grid's unit
     * @param flux         integrated line fluxes (any unit, e.g. photons), finite and not negative
     * @param gaussianFwhm Gaussian (Doppler) FWHMs before the instrument, in the grid's unit, not
     *                     negative
     * @param lorentzFwhm  Lorentzian FWHMs in the grid's unit, not negative
     * @param out          pixel fluxes in the unit of {@code flux}, one per pixel, added to
     * @param threads      number of threads, 1 to 1024; 1 renders on the caller's thread
     * @throws IllegalArgumentException as the single-threaded form, or for a bad thread count
     */
    public void render(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm, double[] out,
            int threads) {
        render(position, flux, gaussianFwhm, lorentzFwhm, out, threads, null);
    }

    /**
     * As {@link #render(double[], double[], double[], double[], double[], int)}, telling
     * {@code progress} (on the caller's thread) the fraction of pixels done as blocks finish.
     *
     * @param position     line centres in the grid's unit
     * @param flux         integrated line fluxes (any unit, e.g. photons), finite and not negative
     * @param gaussianFwhm Gaussian (Doppler) FWHMs before the instrument, in the grid's unit, not
     *                     negative
     * @param lorentzFwhm  Lorentzian FWHMs in the grid's unit, not negative
     * @param out          pixel fluxes in the unit of {@code flux}, one per pixel, added to
     * @param threads      number of threads, 1 to 1024; 1 renders on the caller's thread
     * @param progress     told the fraction done, 0 to 1, in order; null for none
     * @throws IllegalArgumentException as the single-threaded form, or for a bad thread count
     */
    public void render(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm, double[] out,
            int threads, DoubleConsumer progress) {
        if (threads < 1 || threads > 1024) {
            throw new IllegalArgumentException("threads must be 1 to 1024, got " + threads);
        }
        // Every line is checked before any is drawn, so a refused call leaves out as it was.
        checkAll(position, flux, gaussianFwhm, lorentzFwhm, out);
        if (falling) {
            double[] rising = new double[out.length];
            renderRising(position, flux, gaussianFwhm, lorentzFwhm, rising, threads, progress);
            addReversed(rising, out);
        } else {
            renderRising(position, flux, gaussianFwhm, lorentzFwhm, out, threads, progress);
        }
    }

    /** Adds rising[p] to out[out.length - 1 - p]: pixels of a rising grid to its falling twin's. */
    static void addReversed(double[] rising, double[] out) {
        for (int p = 0, n = out.length; p < n; p++) {
            out[n - 1 - p] += rising[p];
        }
    }

    private void renderRising(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm,
            double[] out, int threads, DoubleConsumer progress) {
        int blocks = progress == null && threads == 1 ? 1 : Math.min(out.length, 16 * threads);
        if (threads == 1) {
            for (int b = 0; b < blocks; b++) {
                renderBlock(position, flux, gaussianFwhm, lorentzFwhm, out, blockStart(out.length, b, blocks),
                        blockStart(out.length, b + 1, blocks));
                if (progress != null) {
                    progress.accept((b + 1.0) / blocks);
                }
            }
            return;
        }
        ExecutorService pool = Executors.newFixedThreadPool(threads, task -> {
            Thread thread = new Thread(task, "ritzwerk-render");
            thread.setDaemon(true);
            return thread;
        });
        try {
            List<Future<?>> parts = new ArrayList<>();
            for (int b = 0; b < blocks; b++) {
                int from = blockStart(out.length, b, blocks);
                int to = blockStart(out.length, b + 1, blocks);
                parts.add(pool.submit(() -> renderBlock(position, flux, gaussianFwhm, lorentzFwhm, out, from, to)));
            }
            for (int b = 0; b < blocks; b++) {
                parts.get(b).get();
                if (progress != null) {
                    progress.accept((b + 1.0) / blocks);
                }
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("rendering was interrupted", e);
        } catch (ExecutionException e) {
            throw new IllegalStateException("a rendering task failed: " + e.getCause(), e.getCause());
        } finally {
            pool.shutdownNow();
        }
    }

    private static int blockStart(int pixels, int block, int blocks) {
        return (int) ((long) pixels * block / blocks);
    }

    private void checkAll(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm,
            double[] out) {
        checkLines(grid, instrument, position, flux, gaussianFwhm, lorentzFwhm, out);
    }

    /**
     * The checks both renderers make of their input: one value per line in every column, one
     * output value per pixel, finite values, widths and fluxes not negative, and some width for
     * every line.
     *
     * @throws IllegalArgumentException naming the first line or array that breaks them
     */
    static void checkLines(PixelGrid grid, Instrument instrument, double[] position, double[] flux,
            double[] gaussianFwhm, double[] lorentzFwhm, double[] out) {
        int n = position.length;
        if (flux.length != n || gaussianFwhm.length != n || lorentzFwhm.length != n) {
            throw new IllegalArgumentException("positions, fluxes and widths must have one value per line: "
                    + n + ", " + flux.length + ", " + gaussianFwhm.length + ", " + lorentzFwhm.length);
        }
        if (out.length != grid.pixels()) {
            throw new IllegalArgumentException("the output needs one value per pixel (" + grid.pixels() + "), got "
                    + out.length);
        }
        for (int i = 0; i < n; i++) {
            check(i, "position", position[i], true);
            check(i, "flux", flux[i], false);
            check(i, "Gaussian FWHM", gaussianFwhm[i], false);
            check(i, "Lorentzian FWHM", lorentzFwhm[i], false);
            if (gaussianFwhm[i] == 0 && lorentzFwhm[i] == 0 && instrument.fwhmAt(position[i]) == 0) {
                throw new IllegalArgumentException("line " + i + " has no width: give a Gaussian or Lorentzian FWHM "
                        + "or an instrument response");
            }
        }
    }

    /** Adds every line's share to the pixels from (inclusive) to (exclusive), lines in order. */
    private void renderBlock(double[] position, double[] flux, double[] gaussianFwhm, double[] lorentzFwhm,
            double[] out, int from, int to) {
        for (int i = 0; i < position.length; i++) {
            double g = Math.hypot(gaussianFwhm[i], instrument.fwhmAt(position[i]));
            renderOne(position[i], flux[i], g, lorentzFwhm[i], out, from, to);
        }
    }

    private static void check(int line, String field, double value, boolean anySign) {
        if (!Double.isFinite(value) || (!anySign && value < 0)) {
            throw new IllegalArgumentException("line " + line + ": " + field + " must be finite"
                    + (anySign ? "" : " and not negative") + ", got " + value);
        }
    }

    private void renderOne(double centre, double flux, double g, double l, double[] out, int from, int to) {
        if (flux == 0) {
            return;
        }
        double fwhm = Profiles.voigtFwhm(g, l);
        double lo = centre - window * fwhm;
        double hi = centre + window * fwhm;
        if (hi <= grid.edge(from) || lo >= grid.edge(to)) {
            return;
        }
        int first = Math.max(from, grid.firstEdgeAbove(lo) - 1);
        for (int p = first; p < to && grid.edge(p) < hi; p++) {
            double a = Math.max(grid.edge(p), lo);
            double b = Math.min(grid.edge(p + 1), hi);
            if (b <= a) {
                continue;
            }
            double share;
            if (a < centre && centre < b) {
                share = integrate(a, centre, centre, g, l, fwhm) + integrate(centre, b, centre, g, l, fwhm);
            } else {
                share = integrate(a, b, centre, g, l, fwhm);
            }
            out[p] += flux * share;
        }
    }

    /** The profile's integral over [a, b], a side of the centre (or touching it). */
    private static double integrate(double a, double b, double centre, double g, double l, double fwhm) {
        double nearest = Math.min(Math.abs(a - centre), Math.abs(b - centre));
        double piece = Math.max(fwhm, nearest) / 4;
        int pieces = (int) Math.min(1_000_000, Math.ceil((b - a) / piece));
        double h = (b - a) / pieces;
        // Beyond FAR_WING FWHMs the profile is a smooth, slowly bending wing over a piece no wider
        // than a quarter of the distance: the 4-node rule (exact to degree 7) is as good there.
        boolean far = nearest > FAR_WING * fwhm;
        double[] x = far ? X4 : X;
        double[] w = far ? W4 : W;
        double sum = 0;
        for (int k = 0; k < pieces; k++) {
            double mid = a + (k + 0.5) * h;
            for (int j = 0; j < x.length; j++) {
                sum += w[j] * Profiles.voigt(mid + 0.5 * h * x[j] - centre, g, l);
            }
        }
        return sum * 0.5 * h;
    }

    /** Beyond this many FWHMs from the centre a tail is the Lorentzian's with its Gaussian correction. */
    private static final double NEAR_TAIL = 12;

    /**
     * The fraction of a Voigt line's flux between a and b: the pixel quadrature of
     * {@link #render} within {@value #NEAR_TAIL} FWHMs of the centre, and beyond, the Lorentzian
     * tail gamma / (pi d) with its first Gaussian correction sigma^2 gamma d / (pi (d^2 +
     * gamma^2)^2) (X = G + L: P(X &gt; d) = E P(L &gt; d - G), expanded in G; relative error
     * below (sigma / d)^4 there, and the Gaussian's own tail below 1e-150).
     *
     * @param a      one end
     * @param b      the other, above a (else 0)
     * @param centre the line's centre
     * @param g      Gaussian FWHM (instrument included)
     * @param l      Lorentzian FWHM
     * @return the fraction, 0 to 1
     */
    static double fractionBetween(double a, double b, double centre, double g, double l) {
        if (!(b > a)) {
            return 0;
        }
        double f = cdf(b - centre, g, l) - cdf(a - centre, g, l);
        return Math.min(1, Math.max(0, f));
    }

    private static double cdf(double x, double g, double l) {
        return x >= 0 ? 1 - tail(x, g, l) : tail(-x, g, l);
    }

    /** P(X &gt; d), d not negative. */
    private static double tail(double d, double g, double l) {
        double fwhm = Profiles.voigtFwhm(g, l);
        double far = NEAR_TAIL * fwhm;
        double beyond = farTail(Math.max(d, far), g, l);
        return d >= far ? beyond : integrate(d, far, 0, g, l, fwhm) + beyond;
    }

    private static double farTail(double d, double g, double l) {
        if (l == 0) {
            return 0;
        }
        double gamma = l / 2;
        double sigma = g / (2 * Math.sqrt(2 * Math.log(2)));
        double s = d * d + gamma * gamma;
        return Math.atan2(gamma, d) / Math.PI + sigma * sigma * gamma * d / (Math.PI * s * s);
    }

    /**
     * A bound on the fraction of a Voigt line's flux beyond +-halfWidth of its centre: the sum of
     * the Gaussian's and the Lorentzian's shares beyond +-halfWidth / 2 (a Voigt variate is the
     * sum of the two, and exceeds halfWidth only if one of them exceeds half of it).
     *
     * @param gaussianFwhm Gaussian FWHM
     * @param lorentzFwhm  Lorentzian FWHM
     * @param halfWidth    half-width of the window, same unit
     * @return the bound, 0 .. 1
     */
    public static double truncationBound(double gaussianFwhm, double lorentzFwhm, double halfWidth) {
        double half = halfWidth / 2;
        double lorentz = lorentzFwhm == 0 ? 0 : 1 - 2 / Math.PI * Math.atan(half / (lorentzFwhm / 2));
        double gauss = 0;
        if (gaussianFwhm > 0) {
            // erfc(u) <= exp(-u^2) for u >= 0 (common practice).
            double sigma = gaussianFwhm / (2 * Math.sqrt(2 * Math.log(2)));
            double u = half / (sigma * Math.sqrt(2));
            gauss = Math.exp(-u * u);
        }
        return Math.min(1, lorentz + gauss);
    }
}
