package org.ritzwerk.engine.calibrate;

import java.util.EnumSet;
import java.util.Set;

/**
 * The peaks {@link PeakFinder} found in one spectrum, in columns, sorted by centroid.
 *
 * <p><b>Pixel coordinates.</b> Pixel i (0-based) covers [i - 1/2, i + 1/2) and has its centre at
 * i; a centroid of 12.25 lies a quarter pixel to the right of the centre of pixel 12.
 *
 * <p><b>Columns.</b> For peak k: {@link #centre(int) centroid} and its {@link #centreSigma(int)
 * standard uncertainty} in pixels; {@link #flux(int) flux} (the counts the line puts into all
 * pixels together, baseline removed) and its uncertainty; {@link #height(int) height} (counts per
 * pixel at the top of the fitted continuous profile); {@link #fwhm(int) FWHM} in pixels of the
 * fitted Gaussian before pixel integration; {@link #signalToNoise(int) S/N} (height over the
 * spectrum's background noise); the fit's {@link #reducedChiSquare(int) reduced chi-square}; and
 * {@link PeakFlag flags}.
 *
 * <p>Beside the peaks: the baseline and background noise that were estimated, the pooled noise
 * scale, and the pixels of
 * candidate maxima whose profile fit failed ({@link #unfitted()}), so no candidate is dropped
 * silently.
 *
 * <p>Immutable and thread-safe; array accessors return copies.
 */
public final class Peaks {

    private final int pixels;
    private final double[] centre;
    private final double[] centreSigma;
    private final double[] flux;
    private final double[] fluxSigma;
    private final double[] height;
    private final double[] fwhm;
    private final double[] fwhmSigma;
    private final double[] signalToNoise;
    private final double[] reducedChiSquare;
    private final int[] flags;
    private final double[] noise;
    private final double noiseScale;
    private final double[] baseline;
    private final int[] unfitted;
    private final boolean pixelSigmasGiven;
    private final boolean countedPhotons;
    private final double countsPerPhoton;
    private final double clampLevel;
    private final double clampedShare;

    Peaks(int pixels, double[] centre, double[] centreSigma, double[] flux, double[] fluxSigma, double[] height,
            double[] fwhm, double[] fwhmSigma, double[] signalToNoise, double[] reducedChiSquare, int[] flags,
            double[] noise, double noiseScale, double[] baseline, int[] unfitted, boolean pixelSigmasGiven) {
        this.pixels = pixels;
        this.centre = centre;
        this.centreSigma = centreSigma;
        this.flux = flux;
        this.fluxSigma = fluxSigma;
        this.height = height;
        this.fwhm = fwhm;
        this.fwhmSigma = fwhmSigma;
        this.signalToNoise = signalToNoise;
        this.reducedChiSquare = reducedChiSquare;
        this.flags = flags;
        this.noise = noise;
        this.noiseScale = noiseScale;
        this.baseline = baseline;
        this.unfitted = unfitted;
        this.pixelSigmasGiven = pixelSigmasGiven;
        this.countedPhotons = false;
        this.countsPerPhoton = 1;
        this.clampLevel = Double.NaN;
        this.clampedShare = Double.NaN;
    }

    private Peaks(Peaks p, boolean countedPhotons, double countsPerPhoton, double clampLevel, double clampedShare) {
        this.pixels = p.pixels;
        this.centre = p.centre;
        this.centreSigma = p.centreSigma;
        this.flux = p.flux;
        this.fluxSigma = p.fluxSigma;
        this.height = p.height;
        this.fwhm = p.fwhm;
        this.fwhmSigma = p.fwhmSigma;
        this.signalToNoise = p.signalToNoise;
        this.reducedChiSquare = p.reducedChiSquare;
        this.flags = p.flags;
        this.noise = p.noise;
        this.noiseScale = p.noiseScale;
        this.baseline = p.baseline;
        this.unfitted = p.unfitted;
        this.pixelSigmasGiven = p.pixelSigmasGiven;
        this.countedPhotons = countedPhotons;
        this.countsPerPhoton = countsPerPhoton;
        this.clampLevel = clampLevel;
        this.clampedShare = clampedShare;
    }

    /** @return a copy that states the noise model's assumptions (see the accessors) */
    Peaks withNoiseModel(boolean countedPhotons, double countsPerPhoton, double clampLevel, double clampedShare) {
        return new Peaks(this, countedPhotons, countsPerPhoton, clampLevel, clampedShare);
    }

    /** @return the number of peaks */
    public int size() {
        return centre.length;
    }

    /** @return the number of pixels of the spectrum the peaks were found in */
    public int pixels() {
        return pixels;
    }

    /**
     * @param k peak index, 0 .. size - 1
     * @return the centroid in pixels (pixel i centred at i)
     */
    public double centre(int k) {
        return centre[k];
    }

    /**
     * @param k peak index
     * @return the centroid's standard uncertainty in pixels
     */
    public double centreSigma(int k) {
        return centreSigma[k];
    }

    /**
     * @param k peak index
     * @return the line's flux in counts summed over its pixels, baseline removed
     */
    public double flux(int k) {
        return flux[k];
    }

    /**
     * @param k peak index
     * @return the flux's standard uncertainty in counts
     */
    public double fluxSigma(int k) {
        return fluxSigma[k];
    }

    /**
     * @param k peak index
     * @return the fitted line's counts in a pixel centred on it, above the baseline (for a line
     *         of 3 pixels FWHM, 2.3 % below the top of the continuous profile)
     */
    public double height(int k) {
        return height[k];
    }

    /**
     * @param k peak index
     * @return the fitted Gaussian's FWHM in pixels (before pixel integration)
     */
    public double fwhm(int k) {
        return fwhm[k];
    }

    /**
     * @param k peak index
     * @return the standard uncertainty of {@link #fwhm(int)} in pixels, from the profile fit's
     *         covariance scaled as the centroid's is; peaks fitted together share one width and so
     *         one uncertainty
     */
    public double fwhmSigma(int k) {
        return fwhmSigma[k];
    }

    /**
     * @param k peak index
     * @return height over the background noise {@link #noise()} at the centroid's pixel
     */
    public double signalToNoise(int k) {
        return signalToNoise[k];
    }

    /**
     * @param k peak index
     * @return chi-square per degree of freedom of the profile fit the peak came from (shared by
     *         the peaks of one blend), before any scaling; near {@link #noiseScale()} when the
     *         Gaussian model fits
     */
    public double reducedChiSquare(int k) {
        return reducedChiSquare[k];
    }

    /**
     * @param k peak index
     * @param flag a condition
     * @return whether the peak carries it
     */
    public boolean has(int k, PeakFlag flag) {
        return (flags[k] & flag.bit()) != 0;
    }

    /**
     * @param k peak index
     * @return the peak's flags (a new set)
     */
    public Set<PeakFlag> flags(int k) {
        EnumSet<PeakFlag> set = EnumSet.noneOf(PeakFlag.class);
        for (PeakFlag f : PeakFlag.values()) {
            if (has(k, f)) {
                set.add(f);
            }
        }
        return set;
    }

    /** @return the centroids in pixels, a copy */
    public double[] centres() {
        return centre.clone();
    }

    /** @return the centroids' standard uncertainties in pixels, a copy */
    public double[] centreSigmas() {
        return centreSigma.clone();
    }

    /** @return the fluxes in counts, a copy */
    public double[] fluxes() {
        return flux.clone();
    }

    /**
     * @return the background noise in counts, one value per pixel, a copy: 1.4826 times the
     *         running median of |counts - baseline| over the pixels the baseline clipping kept
     */
    public double[] noise() {
        return noise.clone();
    }

    /**
     * @return the pooled reduced chi-square F by which the modelled pixel variances were scaled
     *         (near 1 when the Poisson-like model with gain 1 fits); 1 when the caller gave pixel
     *         uncertainties or the exposure counted photons (no background noise, see
     *         {@link #countsPerPhoton()});
     *         NaN when there were too few fits to pool and each was scaled by its own
     */
    public double noiseScale() {
        return noiseScale;
    }

    /** @return the estimated baseline in counts, one value per pixel, a copy */
    public double[] baseline() {
        return baseline.clone();
    }

    /**
     * @return pixels of candidate maxima above the threshold whose profile fit failed (did not
     *         converge, or left its window, or gave a width or flux out of range), a copy
     */
    public int[] unfitted() {
        return unfitted.clone();
    }

    /**
     * @return whether the exposure was taken as counted photons: no background noise, every count
     *         the lowest plus a whole multiple of one step; its Poisson variances are then used
     *         unscaled ({@link #noiseScale()} 1)
     */
    public boolean countedPhotons() {
        return countedPhotons;
    }

    /**
     * @return the counts per photon (or photo-electron) assumed in the pixels' Poisson variance,
     *         which is this times the line's counts: the step every count is a whole multiple of
     *         (above the lowest count) when the exposure counted photons or that step exceeds 1
     *         (16 for counts that are all multiples of 16); otherwise 1, and the pooled
     *         {@link #noiseScale()} takes up any other gain. Pixel uncertainties given by the caller
     *         are used as given.
     */
    public double countsPerPhoton() {
        return countsPerPhoton;
    }

    /**
     * @return the value at which the counts were found clamped (at least a tenth of the pixels hold
     *         exactly the lowest value, as when negative counts after a dark subtraction are set to
     *         0), whose background noise was then estimated from the pixels above it; NaN when not
     *         clamped
     */
    public double clampLevel() {
        return clampLevel;
    }

    /**
     * @return the share of the background pixels (those the baseline kept) at {@link #clampLevel()},
     *         0 to 1; NaN when not clamped
     */
    public double clampedShare() {
        return clampedShare;
    }

    /**
     * @return true when the caller gave per-pixel uncertainties (centroid uncertainties come from
     *         them unscaled, except for poor fits); false when they were modelled and scaled by
     *         {@link #noiseScale()}
     */
    public boolean pixelSigmasGiven() {
        return pixelSigmasGiven;
    }
}
