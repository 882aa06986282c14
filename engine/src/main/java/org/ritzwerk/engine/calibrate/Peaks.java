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

    /** Where the gain in the pixels' Poisson variance ({@link #countsPerPhoton()}) came from. */
    public enum GainSource {
        /** Given by the caller (the detector's data sheet or a photon-transfer measurement). */
        GIVEN,
        /** The counts' common step (every count the lowest plus a whole multiple of it). */
        STEP,
        /** Estimated from the bright lines' fit residuals ({@link #gainEstimate()}). */
        ESTIMATED,
        /**
         * 1, assumed: too few bright, well-fitted lines for an estimate, or an estimate not clearly
         * above 1 (one below 1 is never used: it would narrow the uncertainties), or pixel
         * uncertainties given (which make the gain irrelevant)
         */
        ASSUMED
    }

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
    private final GainSource gainSource;
    private final GainEstimate gainEstimate;
    private final double readNoise;

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
        this.gainSource = GainSource.ASSUMED;
        this.gainEstimate = GainEstimate.NONE;
        this.readNoise = Double.NaN;
    }

    private Peaks(Peaks p, boolean countedPhotons, double countsPerPhoton, double clampLevel, double clampedShare,
            GainSource gainSource, GainEstimate gainEstimate, double readNoise) {
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
        this.gainSource = gainSource;
        this.gainEstimate = gainEstimate;
        this.readNoise = readNoise;
    }

    /** @return a copy that states the noise model's assumptions (see the accessors) */
    Peaks withNoiseModel(boolean countedPhotons, double countsPerPhoton, double clampLevel, double clampedShare) {
        return new Peaks(this, countedPhotons, countsPerPhoton, clampLevel, clampedShare, gainSource, gainEstimate,
                readNoise);
    }

    /** @return a copy that states where the gain came from, the estimate made and the read noise given */
    Peaks withGain(GainSource source, GainEstimate estimate, double readNoiseGiven) {
        return new Peaks(this, countedPhotons, countsPerPhoton, clampLevel, clampedShare, source, estimate,
                readNoiseGiven);
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
     * @return the counts per photon (or photo-electron), the gain, assumed in the pixels' Poisson
     *         variance, which is this times the line's counts ({@link #gainSource()} says whence):
     *         the gain given; else the step every count is a whole multiple of (above the lowest
     *         count) when the exposure counted photons or that step exceeds 1 (16 for counts that
     *         are all multiples of 16); else the estimate from the bright lines' fit residuals when
     *         it is clearly above 1; else 1. The pooled {@link #noiseScale()} takes up what the
     *         model still misses. Pixel uncertainties given by the caller are used as given.
     */
    public double countsPerPhoton() {
        return countsPerPhoton;
    }

    /** @return where {@link #countsPerPhoton()} came from */
    public GainSource gainSource() {
        return gainSource;
    }

    /**
     * @return the gain in counts per photo-electron that the bright lines' fit residuals estimate
     *         (see {@link PeakFinder}), whether or not it was used ({@link #gainSource()} ESTIMATED
     *         when it was); NaN when none was made (gain given, a step found, pixel uncertainties
     *         given) or too few lines allowed one ({@link #gainFits()} below 3)
     */
    public double gainEstimate() {
        return gainEstimate.value();
    }

    /** @return the standard deviation of {@link #gainEstimate()}, NaN when there is none */
    public double gainEstimateSigma() {
        return gainEstimate.sigma();
    }

    /**
     * @return how many bright, well-fitted, unsaturated profile fits (a blend's peaks share one)
     *         the gain was estimated from, or were found when too few for an estimate; 0 when no
     *         estimate was tried
     */
    public int gainFits() {
        return gainEstimate.fits();
    }

    /** @return the read noise given in counts RMS (a floor under the background noise), NaN when none was given */
    public double readNoise() {
        return readNoise;
    }

    /**
     * @return the gain used and where it came from, in words, e.g. "gain 3.7 counts per
     *         photo-electron (given)" or "gain 3.68 +- 0.11 counts per photo-electron (estimated from
     *         12 bright lines' fit residuals)"; with a read noise given, that too
     */
    public String gainStatement() {
        String read = Double.isNaN(readNoise) ? "" : "; read noise " + plain(readNoise) + " counts (given)";
        if (pixelSigmasGiven) {
            return "gain not used (pixel uncertainties given)" + read;
        }
        String used = "gain " + plain(countsPerPhoton) + " counts per photo-electron";
        switch (gainSource) {
            case GIVEN:
                return used + " (given)" + read;
            case STEP:
                return used + " (every count on a step of " + plain(countsPerPhoton) + ")" + read;
            case ESTIMATED:
                return String.format(java.util.Locale.ROOT, "gain %.3g +- %.2g counts per photo-electron (estimated"
                        + " from %d bright lines' fit residuals)", countsPerPhoton, gainEstimate.sigma(),
                        gainEstimate.fits()) + read;
            default:
                if (gainEstimate.isAvailable() && gainEstimate.profile()) {
                    return String.format(java.util.Locale.ROOT, "gain 1 count per photo-electron (estimated %.3g +-"
                            + " %.2g from %d bright lines' fit residuals, not used: they grow faster than the counts,"
                            + " so the line profile, not the gain, makes them)", gainEstimate.value(),
                            gainEstimate.sigma(), gainEstimate.fits()) + read;
                }
                if (gainEstimate.isAvailable()) {
                    return String.format(java.util.Locale.ROOT, "gain 1 count per photo-electron (estimated %.3g +-"
                            + " %.2g from %d bright lines' fit residuals, not clearly above 1)", gainEstimate.value(),
                            gainEstimate.sigma(), gainEstimate.fits()) + read;
                }
                return "gain 1 count per photo-electron (assumed: " + gainNote() + ")" + read;
        }
    }

    /**
     * @return why the gain could not be estimated, when 1 was assumed for want of bright lines
     *         ("3 bright, well-fitted lines are needed to estimate the gain, 1 found"); null otherwise
     */
    public String gainNote() {
        if (pixelSigmasGiven || gainSource != GainSource.ASSUMED || gainEstimate.isAvailable()) {
            return null;
        }
        return GainEstimate.MIN_FITS + " bright, well-fitted, unsaturated lines are needed to estimate the gain, "
                + gainEstimate.fits() + " found; give the detector's gain if it is not 1";
    }

    /** A whole number without decimals, anything else to 6 significant digits. */
    private static String plain(double value) {
        return value == Math.rint(value) && Math.abs(value) < 1e15 ? Long.toString((long) value)
                : String.format(java.util.Locale.ROOT, "%.6g", value).replaceAll("\\.?0+$", "");
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
