package org.ritzwerk.engine.calibrate;

import org.ritzwerk.medium.Medium;

/**
 * The peak-to-line pairing {@link LampMatcher} found, in columns sorted by pixel, with the
 * figures that say how well the lamp explains the spectrum. Feed it to a {@link DispersionFit}
 * with {@link #fit(DispersionFit)}.
 *
 * <p>Immutable and thread-safe; array accessors return copies.
 */
public final class LampMatch {

    private final int[] peakIndex;
    private final int[] lineIndex;
    private final double[] pixel;
    private final double[] pixelSigma;
    private final double[] wavelength;
    private final double[] wavelengthSigma;
    private final boolean lineSigmasGiven;
    private final double[] residualPixels;
    private final int strongPeaks;
    private final int strongMatched;
    private final int degree;
    private final long hypotheses;
    private final double firstWavelength;
    private final double lastWavelength;
    private final Medium medium;
    private final double chanceMatches;
    private final double chanceProbability;
    private final int distinctHypotheses;
    private final int[] secondOrderPeaks;

    LampMatch(int[] peakIndex, int[] lineIndex, double[] pixel, double[] pixelSigma, double[] wavelength,
            double[] wavelengthSigma, boolean lineSigmasGiven, double[] residualPixels, int strongPeaks,
            int strongMatched, int degree, long hypotheses, double firstWavelength, double lastWavelength,
            Medium medium, double chanceMatches, double chanceProbability, int distinctHypotheses,
            int[] secondOrderPeaks) {
        this.peakIndex = peakIndex;
        this.lineIndex = lineIndex;
        this.pixel = pixel;
        this.pixelSigma = pixelSigma;
        this.wavelength = wavelength;
        this.wavelengthSigma = wavelengthSigma;
        this.lineSigmasGiven = lineSigmasGiven;
        this.residualPixels = residualPixels;
        this.strongPeaks = strongPeaks;
        this.strongMatched = strongMatched;
        this.degree = degree;
        this.hypotheses = hypotheses;
        this.firstWavelength = firstWavelength;
        this.lastWavelength = lastWavelength;
        this.medium = medium;
        this.chanceMatches = chanceMatches;
        this.chanceProbability = chanceProbability;
        this.distinctHypotheses = distinctHypotheses;
        this.secondOrderPeaks = secondOrderPeaks;
    }

    /**
     * @return the indices of the peaks the matcher explained as second-order images of lamp lines
     *         (at twice a line's wavelength), in ascending order; they are counted in
     *         {@link #strongMatched()} but are not pairs (a copy)
     */
    public int[] secondOrderPeaks() {
        return secondOrderPeaks.clone();
    }

    /**
     * @return how many of the strong peaks chance alone would match to some lamp line within the
     *         tolerance, from the local line density (see {@link LampMatcher})
     */
    public double chanceMatches() {
        return chanceMatches;
    }

    /**
     * @return the Poisson probability that chance alone matches at least {@link #strongMatched()}
     *         strong peaks, given {@link #chanceMatches()}
     */
    public double chanceProbability() {
        return chanceProbability;
    }

    /** @return how many distinct grown hypotheses the search verified */
    public int distinctHypotheses() {
        return distinctHypotheses;
    }

    /**
     * @param keep per pair, whether to keep it
     * @return the pairs kept, with the same figures
     */
    LampMatch subset(boolean[] keep) {
        int m = 0;
        for (boolean k : keep) {
            m += k ? 1 : 0;
        }
        int[] pi = new int[m];
        int[] li = new int[m];
        double[] px = new double[m];
        double[] ps = new double[m];
        double[] nm = new double[m];
        double[] ns = new double[m];
        double[] r = new double[m];
        int j = 0;
        for (int i = 0; i < keep.length; i++) {
            if (keep[i]) {
                pi[j] = peakIndex[i];
                li[j] = lineIndex[i];
                px[j] = pixel[i];
                ps[j] = pixelSigma[i];
                nm[j] = wavelength[i];
                ns[j] = wavelengthSigma[i];
                r[j] = residualPixels[i];
                j++;
            }
        }
        return new LampMatch(pi, li, px, ps, nm, ns, lineSigmasGiven, r, strongPeaks, strongMatched, degree,
                hypotheses, firstWavelength, lastWavelength, medium, chanceMatches, chanceProbability,
                distinctHypotheses, secondOrderPeaks);
    }

    /** @return the number of matched pairs */
    public int size() {
        return pixel.length;
    }

    /**
     * @param i pair index
     * @return the index of the pair's peak in the peaks given to the matcher
     */
    public int peakIndex(int i) {
        return peakIndex[i];
    }

    /**
     * @param i pair index
     * @return the index of the pair's line in the {@link LampLines}
     */
    public int lineIndex(int i) {
        return lineIndex[i];
    }

    /**
     * @param i pair index
     * @return the peak's centroid in pixels
     */
    public double pixel(int i) {
        return pixel[i];
    }

    /**
     * @param i pair index
     * @return the centroid's standard uncertainty in pixels
     */
    public double pixelSigma(int i) {
        return pixelSigma[i];
    }

    /**
     * @param i pair index
     * @return the line's wavelength in nm
     */
    public double wavelength(int i) {
        return wavelength[i];
    }

    /**
     * @param i pair index
     * @return the line's standard uncertainty in nm (0 when the list gave none)
     */
    public double wavelengthSigma(int i) {
        return wavelengthSigma[i];
    }

    /**
     * @param i pair index
     * @return the pixel minus where the matcher's own (unweighted) polynomial puts the line; a
     *         coarse check, the {@link DispersionFit} gives the real residuals
     */
    public double residualPixels(int i) {
        return residualPixels[i];
    }

    /** @return the centroids in pixels, a copy */
    public double[] pixels() {
        return pixel.clone();
    }

    /** @return the centroids' standard uncertainties in pixels, a copy */
    public double[] pixelSigmas() {
        return pixelSigma.clone();
    }

    /** @return the matched lines' wavelengths in nm, a copy */
    public double[] wavelengths() {
        return wavelength.clone();
    }

    /** @return the matched lines' uncertainties in nm, a copy */
    public double[] wavelengthSigmas() {
        return wavelengthSigma.clone();
    }

    /** @return how many of the strongest peaks the search used */
    public int strongPeaks() {
        return strongPeaks;
    }

    /** @return how many of those the final pairing matched */
    public int strongMatched() {
        return strongMatched;
    }

    /** @return strongMatched / strongPeaks: the share of the strongest peaks the lamp explains */
    public double inlierFraction() {
        return (double) strongMatched / strongPeaks;
    }

    /** @return the degree of the matcher's own polynomial */
    public int degree() {
        return degree;
    }

    /** @return how many seed hypotheses passed the prior and were grown (a measure of the work done) */
    public long hypotheses() {
        return hypotheses;
    }

    /** @return the matcher's wavelength at the first pixel centre, nm */
    public double firstWavelength() {
        return firstWavelength;
    }

    /** @return the matcher's wavelength at the last pixel centre, nm */
    public double lastWavelength() {
        return lastWavelength;
    }

    /** @return the medium of the wavelengths */
    public Medium medium() {
        return medium;
    }

    /**
     * Fits a dispersion solution to the pairs, weighted by the centroids' uncertainties (and the
     * lines' own, when the lamp list gave them).
     *
     * @param fit the fit to make
     * @return the solution
     */
    public DispersionSolution fit(DispersionFit fit) {
        return fit.fit(pixel, pixelSigma, wavelength, lineSigmasGiven ? wavelengthSigma : null, medium);
    }
}
