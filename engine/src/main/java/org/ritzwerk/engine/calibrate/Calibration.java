package org.ritzwerk.engine.calibrate;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The result of a {@link Calibrator}: the peaks found, the first pairing and the refined one, the
 * fitted {@link DispersionSolution}, a label per fitted pair naming its lamp line, and the
 * problem and settings that made it, so a report can say what was done.
 *
 * <p>Immutable and thread-safe.
 */
public final class Calibration {

    private final CalibrationProblem problem;
    private final Calibrator settings;
    private final Peaks peaks;
    private final LampMatch firstMatch;
    private final LampMatch match;
    private final DispersionSolution solution;
    private final LampMatch saturatedPairs;
    private final List<String> pairLabels;
    /** {@link #largestSigmaPixels()} and the pixel where it is reached, computed once. */
    private final double[] largestSigma;
    /** {low end's check, its pixel, high end's check, its pixel}; see {@link #endConfirmationPixels}. */
    private final double[] endConfirmation;
    private final double inferredSaturation;
    /** Notes on end groups left out as undecided ({@link EndGroups}). */
    private final List<String> leftOut;

    /**
     * @return the saturation level taken from the exposure itself when none was given (its highest
     *         count, held by several pixels exactly, as a clipped exposure shows it), or NaN when
     *         a level was given or the exposure does not look clipped
     */
    public double inferredSaturationLevel() {
        return inferredSaturation;
    }

    Calibration(CalibrationProblem problem, Calibrator settings, Peaks peaks, LampMatch firstMatch, LampMatch match,
            LampMatch saturatedPairs, DispersionSolution solution, double inferredSaturation, List<String> leftOut) {
        this.inferredSaturation = inferredSaturation;
        this.leftOut = List.copyOf(leftOut);
        this.saturatedPairs = saturatedPairs;
        this.problem = problem;
        this.settings = settings;
        this.peaks = peaks;
        this.firstMatch = firstMatch;
        this.match = match;
        this.solution = solution;
        List<String> labels = new ArrayList<>(match.size());
        for (int i = 0; i < match.size(); i++) {
            labels.add(problem.lamp().label(match.lineIndex(i)));
        }
        this.pairLabels = List.copyOf(labels);
        this.largestSigma = findLargestSigma();
        this.endConfirmation = new double[] {confirmation(false), endPixel(false), confirmation(true), endPixel(true)};
    }

    /**
     * How well the other fitted lines check the outermost one at an end of the fitted range: the
     * standard uncertainty, in pixels, with which the polynomial of the solution's degree, fitted
     * to every other pair used, predicts that line's pixel. A wrong pairing at an end (a foreign
     * line beside a missing or weak lamp line, a few pixels off) moves the solution there by its
     * offset while its own residual stays small; the other lines show it only when this figure is
     * well below the offset. It grows with the gap between the end line and the rest.
     *
     * @param high the end at the highest pixel, else the lowest
     * @return the uncertainty in pixels; NaN when too few pairs remain for the degree or the fit
     *         has no covariance
     */
    public double endConfirmationPixels(boolean high) {
        return endConfirmation[high ? 2 : 0];
    }

    /**
     * @param high the end at the highest pixel, else the lowest
     * @return whether near that end the solution rests on its one outermost pairing: the other
     *         lines check it ({@link #endConfirmationPixels}) only beyond 0.1 pixel and six times
     *         the largest stated uncertainty, or not at all, so the stated uncertainty there holds
     *         only if that pairing is right
     */
    public boolean restsOnItsEndLine(boolean high) {
        return !(endConfirmationPixels(high) <= Math.max(0.1, 6 * largestSigmaPixels()));
    }

    /**
     * @param high the end at the highest pixel, else the lowest
     * @return the pixel of the outermost used pair at that end
     */
    public double endConfirmationAtPixel(boolean high) {
        return endConfirmation[high ? 3 : 1];
    }

    /**
     * What a user should know beside the figures, one sentence each: a saturation level taken
     * from the exposure itself ({@link #inferredSaturationLevel}), residuals with structure the
     * polynomial does not follow ({@link DispersionSolution#residualsStructured()}: its stated
     * uncertainties may be too small), and each end where the solution rests on one pairing
     * ({@link #restsOnItsEndLine}). The {@code calibrate} command prints them
     * as notes; the Spark operation puts them in each row's notes.
     *
     * @return the notes, possibly none
     */
    public List<String> notes() {
        List<String> notes = new ArrayList<>();
        if (!Double.isNaN(inferredSaturation)) {
            notes.add("several pixels hold exactly the exposure's highest count, "
                    + java.math.BigDecimal.valueOf(inferredSaturation).stripTrailingZeros().toPlainString()
                    + ": the exposure looks clipped there, so that is taken as the saturation level (peaks reaching"
                    + " it are centred from their wings; a saturation level given overrides it)");
        }
        notes.addAll(leftOut);
        if (solution.residualsStructured()) {
            notes.add(structureNote());
        }
        for (boolean high : new boolean[] {false, true}) {
            if (restsOnItsEndLine(high)) {
                double check = endConfirmationPixels(high);
                String how = Double.isNaN(check) ? "not at all"
                        : String.format(Locale.ROOT, "only to +-%.3g pixel", check);
                notes.add(String.format(Locale.ROOT, "the outermost line at pixel %.1f is checked by the other lines"
                        + " %s; near it the solution rests on that one pairing (its stated uncertainty assumes the"
                        + " pairing is right; a required precision refuses such solutions)",
                        endConfirmationAtPixel(high), how));
            }
        }
        return notes;
    }

    /**
     * The note on residuals with structure ({@link DispersionSolution#residualsStructured()}),
     * saying what would let the solution follow it.
     */
    private String structureNote() {
        int d = solution.degree();
        String help;
        if (settings.degree() > 0) {
            help = "let the degree be chosen or fix a higher one";
        } else if (d >= settings.maxDegree() && d < DispersionFit.MAX_DEGREE) {
            help = "allow a higher degree (the automatic choice may now take at most " + settings.maxDegree() + ")";
        } else {
            help = "more lamp lines (a second gas, a longer exposure) would let the automatic choice take a higher"
                    + " degree";
        }
        String evidence = solution.nextDegreeProbability() < DispersionSolution.STRUCTURE_PROBABILITY
                ? String.format(Locale.ROOT, "a degree-%d polynomial fits the same %d lines better than chance"
                        + " allows (F-test probability %.2g)", d + 1, solution.usedCount(),
                        solution.nextDegreeProbability())
                : String.format(Locale.ROOT, "%d runs of one sign in %d fitted lines (probability %.2g for"
                        + " independent residuals) with a reduced chi-square of %.3g (probability %.2g)",
                        solution.residualRuns(), solution.usedCount(), solution.residualRunsProbability(),
                        solution.reducedChiSquare(), solution.lackOfFitProbability());
        return String.format(Locale.ROOT, "the residuals show structure along the detector that the degree-%d"
                + " polynomial does not follow: %s; its stated uncertainties are widened by one factor for the whole"
                + " range and may be too small between the lines; %s", d, evidence, help);
    }

    private double endPixel(boolean high) {
        return high ? highestUsedPixel() : lowestUsedPixel();
    }

    private double confirmation(boolean high) {
        int end = -1;
        for (int i = 0; i < solution.size(); i++) {
            if (!solution.isRejected(i) && (end < 0 || (high ? solution.pixel(i) > solution.pixel(end)
                    : solution.pixel(i) < solution.pixel(end)))) {
                end = i;
            }
        }
        int degree = solution.degree();
        int n = 0;
        for (int i = 0; i < solution.size(); i++) {
            n += !solution.isRejected(i) && i != end ? 1 : 0;
        }
        if (end < 0 || n < degree + 2) {
            return Double.NaN;
        }
        double[] pixel = new double[n];
        double[] pixelSigma = new double[n];
        double[] nm = new double[n];
        double[] nmSigma = new double[n];
        int k = 0;
        for (int i = 0; i < solution.size(); i++) {
            if (!solution.isRejected(i) && i != end) {
                pixel[k] = match.pixel(i);
                pixelSigma[k] = match.pixelSigma(i);
                nm[k] = match.wavelength(i);
                nmSigma[k] = match.wavelengthSigma(i);
                k++;
            }
        }
        try {
            DispersionSolution others = DispersionFit.ofDegree(degree).fit(pixel, pixelSigma, nm, nmSigma,
                    solution.medium());
            double p = solution.pixel(end);
            return others.covarianceSigmaAt(p) / Math.abs(others.dispersionAt(p));
        } catch (IllegalArgumentException e) {
            return Double.NaN; // the others alone do not fix a solution of this degree
        }
    }

    /** @return the problem solved */
    public CalibrationProblem problem() {
        return problem;
    }

    /** @return the solver settings used */
    public Calibrator settings() {
        return settings;
    }

    /** @return every peak found in the exposure */
    public Peaks peaks() {
        return peaks;
    }

    /** @return the pairing of the strongest peaks that seeded the solution (its strong-peak figures) */
    public LampMatch firstMatch() {
        return firstMatch;
    }

    /** @return the refined pairing the solution was fitted to, sorted by pixel */
    public LampMatch match() {
        return match;
    }

    /**
     * @return the pairs whose peak reached the saturation level: paired with their lamp lines but
     *         left out of the fit (their centroids come from the wings); empty when none, or when
     *         too few unsaturated pairs remained and they were fitted after all
     */
    public LampMatch saturatedPairs() {
        return saturatedPairs;
    }

    /**
     * @param i a pair of {@link #saturatedPairs()}
     * @return its lamp line as listed
     */
    public String saturatedPairLabel(int i) {
        return problem.lamp().label(saturatedPairs.lineIndex(i));
    }

    /**
     * @param i a pair of {@link #saturatedPairs()}
     * @return its line's wavelength less the solution's at its peak, nm (it took no part in the fit)
     */
    public double saturatedResidualNm(int i) {
        return saturatedPairs.wavelength(i) - solution.wavelengthAt(saturatedPairs.pixel(i));
    }

    /**
     * @param i a pair of {@link #saturatedPairs()}
     * @return {@link #saturatedResidualNm} in pixels, at the solution's local dispersion
     */
    public double saturatedResidualPixels(int i) {
        return saturatedResidualNm(i) / Math.abs(solution.dispersionAt(saturatedPairs.pixel(i)));
    }

    /** @return the fitted pixel-to-wavelength solution */
    public DispersionSolution solution() {
        return solution;
    }

    /**
     * @param i a fitted pair, 0 to {@code solution().size() - 1}
     * @return the lamp line of that pair as listed ({@link LampSet#label})
     */
    public String pairLabel(int i) {
        return pairLabels.get(i);
    }

    /**
     * @param i a fitted pair, 0 to {@code solution().size() - 1}
     * @return the extra centroid uncertainty (pixels) the pair carries because its peak may be an
     *         unresolved blend (a poor profile fit, {@link PeakFlag#POOR_FIT}, a width beyond the
     *         instrument's, {@link PeakFlag#WIDE}, or another lamp line closer than the peak's
     *         width): the most its centroid can sit from its line, added in quadrature to the
     *         statistical uncertainty; 0 when it carries none
     */
    public double blendOffsetBound(int i) {
        return blendBound(match, peaks, i);
    }

    /** The part of a pair's centroid uncertainty beyond the peak's statistical one. */
    static double blendBound(LampMatch pairs, Peaks peaks, int i) {
        double total = pairs.pixelSigma(i);
        double statistical = peaks.centreSigma(pairs.peakIndex(i));
        double extra = total * total - statistical * statistical;
        return extra > 1e-12 * total * total ? Math.sqrt(extra) : 0;
    }

    /** @return the lamp line of every fitted pair, in pair order */
    public List<String> pairLabels() {
        return pairLabels;
    }

    /** @return how many of the strongest peaks the first pairing matched */
    public int strongMatched() {
        return match.strongMatched();
    }

    /** @return how many strongest peaks the first pairing used */
    public int strongPeaks() {
        return match.strongPeaks();
    }

    /** @return the fraction of the strongest peaks matched, 0 to 1 */
    public double matchedFraction() {
        return match.inlierFraction();
    }

    /** @return the lowest pixel of a pair used in the fit */
    public double lowestUsedPixel() {
        double lowest = Double.POSITIVE_INFINITY;
        for (int i = 0; i < solution.size(); i++) {
            if (!solution.isRejected(i)) {
                lowest = Math.min(lowest, solution.pixel(i));
            }
        }
        return lowest;
    }

    /** @return the highest pixel of a pair used in the fit */
    public double highestUsedPixel() {
        double highest = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < solution.size(); i++) {
            if (!solution.isRejected(i)) {
                highest = Math.max(highest, solution.pixel(i));
            }
        }
        return highest;
    }

    /**
     * The largest stated standard uncertainty of the solution, in pixels (the wavelength's
     * standard uncertainty over the local dispersion), at 201 evenly spaced pixels from the lowest
     * to the highest pixel used; the ends of that range are where it is usually largest. What a
     * user who needs a given precision compares with ({@link Calibrator#withRequiredPrecision}).
     *
     * @return the uncertainty in pixels; NaN when the solution has no covariance
     */
    public double largestSigmaPixels() {
        return largestSigma[0];
    }

    /** @return the pixel where {@link #largestSigmaPixels()} is reached */
    public double largestSigmaAtPixel() {
        return largestSigma[1];
    }

    private double[] findLargestSigma() {
        double from = lowestUsedPixel();
        double to = highestUsedPixel();
        double worst = Double.NEGATIVE_INFINITY;
        double at = from;
        for (int s = 0; s <= 200; s++) {
            double p = from + (to - from) * s / 200.0;
            double sigma = solution.wavelengthSigmaAt(p) / Math.abs(solution.dispersionAt(p));
            if (Double.isNaN(sigma)) {
                return new double[] {Double.NaN, Double.NaN};
            }
            if (sigma > worst) {
                worst = sigma;
                at = p;
            }
        }
        return new double[] {worst, at};
    }

    /** @return the fraction of the detector between the lowest and highest pixel used, 0 to 1 */
    public double coverage() {
        return (highestUsedPixel() - lowestUsedPixel()) / Math.max(1, problem.pixels() - 1);
    }

    /** @return how many peaks reached the saturation level (their centroids come from the wings) */
    public int saturatedPeaks() {
        int n = 0;
        for (int k = 0; k < peaks.size(); k++) {
            n += peaks.has(k, PeakFlag.SATURATED) ? 1 : 0;
        }
        return n;
    }

    /**
     * @return a one-line description: the exposure, the lamp sets and the gain of the peaks' noise
     *         model ({@link Peaks#gainStatement()}); the saved calibration file carries it
     */
    public String description() {
        return "spectrum " + problem.source() + "; lamp sets " + String.join(", ", problem.lamp().setIds()) + "; "
                + peaks.gainStatement();
    }

    @Override
    public String toString() {
        return "Calibration[" + description() + ", degree " + solution.degree() + ", " + solution.usedCount()
                + " lines used, rms " + solution.rmsNm() + " nm]";
    }
}
