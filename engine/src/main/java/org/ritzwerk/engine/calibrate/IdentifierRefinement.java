package org.ritzwerk.engine.calibrate;

import java.util.Arrays;
import java.util.Objects;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.quantity.Unit;

/**
 * The last step of an automatic calibration: with a first solution in hand, every detected peak
 * becomes a wavelength (with the uncertainty of its centroid and of the solution, as
 * {@link CalibratedPeaks} puts them), and the line
 * identifier ({@link Identifier}) pairs all peaks with all lamp lines at once by an optimal
 * one-to-one assignment, within three standard uncertainties of each peak's wavelength but never
 * closer than the tolerance (a few pixels): the uncertainty is the centroid's and the first
 * solution's there, each at least a third of the tolerance, so where the first solution covers the
 * peak the window is the tolerance and a residual is scored as a Gaussian of a third of it, and
 * where the first solution is extrapolated (its lines all in one part of the detector) the window
 * widens with the extrapolation's own uncertainty. (With a fixed window, a first solution from
 * lines at 813-886 nm of a 708-911 nm neon-mercury exposure, refdata's sweep seed 206, missed the
 * bright neon lines at 717 and 724 nm, 13 and 11 pixels from its extrapolation, which stated 10
 * and 8 pixels there: the accepted solution covered 32 % of the detector; now 84 %.) Peaks it calls
 * ambiguous (two lines
 * not separable) are left out. A paired peak that looks like an unresolved blend (a poor profile
 * fit, wider than its neighbours) carries, beside its centroid's statistical uncertainty, a bound
 * on how far the blend's centroid may lie from its brighter line ({@link #blendOffsetBound}). The
 * result is a new {@link LampMatch} to fit again.
 *
 * <p>Stateless and thread-safe.
 */
final class IdentifierRefinement {

    private IdentifierRefinement() {
    }

    /**
     * How many lamp lines the first solution puts on the detector: with fewer than
     * {@link LampMatcher#MIN_MATCHES} there (a few-line lamp, or a window that holds only three of
     * a lamp's lines), three pairs are all a calibration can have, as the matcher allows.
     */
    private static int linesOnDetector(LampLines lines, DispersionSolution solution, int pixels) {
        double a = solution.evaluate(-0.5);
        double b = solution.evaluate(pixels - 0.5);
        double lo = Math.min(a, b);
        double hi = Math.max(a, b);
        int count = 0;
        for (int j = 0; j < lines.size(); j++) {
            count += lines.wavelength(j) >= lo && lines.wavelength(j) <= hi ? 1 : 0;
        }
        return count;
    }

    /**
     * @param match           the pairing the first solution came from (its strong-peak figures are kept)
     * @param solution        the first solution, in the lines' medium
     * @param peaks           every detected peak
     * @param lines           the lamp's lines
     * @param species         the species of each line, for the identifier
     * @param tolerancePixels how far (pixels) a peak may lie from a line to pair where the first solution is
     *                        tight (wider where it is extrapolated: three of its standard uncertainties), positive
     * @return the refined pairing, sorted by pixel
     * @throws CalibrationException when fewer than {@link LampMatcher#MIN_MATCHES} pairs remain (three
     *         when the first solution puts fewer lamp lines than that on the detector)
     */
    public static LampMatch refine(LampMatch match, DispersionSolution solution, Peaks peaks, LampLines lines,
            Species[] species, double tolerancePixels) {
        Objects.requireNonNull(species, "species");
        if (species.length != lines.size()) {
            throw new IllegalArgumentException(lines.size() + " lines but " + species.length + " species");
        }
        if (!(tolerancePixels > 0) || Double.isInfinite(tolerancePixels)) {
            throw new IllegalArgumentException("tolerance must be a positive number of pixels, got " + tolerancePixels);
        }
        int n = peaks.size();
        CalibratedPeaks calibrated = CalibratedPeaks.of(peaks, solution, solution::covarianceSigmaAt);
        double widest = 0;
        for (double slope : calibrated.dispersionsNmPerPixel()) {
            widest = Math.max(widest, Math.abs(slope));
        }
        // Peaks the matcher explained as second-order images of lamp lines take no part: they are
        // no first-order line, and would otherwise take a line near them from the peak it belongs to.
        int[] images = match.secondOrderPeaks();
        int[] candidate = new int[n - images.length];
        double[] nm = calibrated.wavelengthsNm();
        double[] nmSigma = calibrated.wavelengthSigmasNm();
        double[] flux = calibrated.fluxes(0);
        int c = 0;
        for (int k = 0; k < n; k++) {
            if (Arrays.binarySearch(images, k) < 0) {
                candidate[c] = k;
                nm[c] = nm[k];
                nmSigma[c] = nmSigma[k];
                flux[c] = flux[k];
                c++;
            }
        }
        // Each peak's uncertainty at least a third of the tolerance: the 3-sigma window is then the
        // tolerance wherever the first solution is tight, and wider where it is extrapolated.
        // (Where no peak's uncertainty exceeds a third of the tolerance, the fixed window is the
        // same and the identifier's faster path for it is taken.)
        double floor = tolerancePixels * widest / 3;
        boolean widens = false;
        for (int q = 0; q < c; q++) {
            widens |= nmSigma[q] > floor;
            nmSigma[q] = Math.max(nmSigma[q], floor);
        }
        PeakList peakList = PeakList.of(Arrays.copyOf(nm, c), Arrays.copyOf(nmSigma, c), Arrays.copyOf(flux, c),
                Unit.NANOMETRE, lines.medium());
        LineCatalog.Builder catalog = LineCatalog.builder();
        for (int j = 0; j < lines.size(); j++) {
            double vacuum = lines.medium().toVacuum(lines.wavelength(j) * 1e-9);
            double scale = vacuum / (lines.wavelength(j) * 1e-9);
            catalog.add(species[j], vacuum, lines.sigma(j) * 1e-9 * scale, lines.intensity(j), Integer.toString(j));
        }
        LineCatalog built = catalog.build();
        Tolerance window = widens ? Tolerance.kSigma(3) : Tolerance.absolute(3 * floor * 1e-9);
        // the full strength prior, as this refinement was tuned and measured with (lamp lines show as their
        // intensities say); identification's default tempers it
        Identification id = Identifier.of(window).withStrengthWeight(1).identify(peakList, built);
        int[] peakIndex = new int[n];
        int[] lineIndex = new int[n];
        int m = 0;
        for (int q = 0; q < c; q++) {
            if (id.matchedByOdds(q)) {
                int k = candidate[q];
                peakIndex[m] = k;
                lineIndex[m] = Integer.parseInt(built.label(id.line(q)));
                m++;
            }
        }
        int needed = Math.min(LampMatcher.MIN_MATCHES, Math.max(LampMatcher.MIN_FEW_LINE_MATCHES,
                linesOnDetector(lines, solution, peaks.pixels())));
        if (m < needed) {
            throw new CalibrationException(CalibrationException.TOO_FEW_MATCHES, "after refinement only " + m
                    + " peaks pair with a lamp line without ambiguity; a calibration needs at least " + needed);
        }
        peakIndex = Arrays.copyOf(peakIndex, m);
        lineIndex = Arrays.copyOf(lineIndex, m);
        double[] pixel = new double[m];
        double[] pixelSigma = new double[m];
        double[] wavelength = new double[m];
        double[] wavelengthSigma = new double[m];
        double[] residual = new double[m];
        for (int i = 0; i < m; i++) {
            int k = peakIndex[i];
            pixel[i] = peaks.centre(k);
            pixelSigma[i] = Math.hypot(peaks.centreSigma(k), Math.max(blendOffsetBound(peaks, k),
                    neighbourLineBound(peaks, k, lines, species, lineIndex[i], solution)));
            wavelength[i] = lines.wavelength(lineIndex[i]);
            wavelengthSigma[i] = lines.sigma(lineIndex[i]);
            residual[i] = pixel[i] - solution.pixelAt(wavelength[i]);
        }
        return new LampMatch(peakIndex, lineIndex, pixel, pixelSigma, wavelength, wavelengthSigma,
                lines.sigmasGiven(), residual, match.strongPeaks(), match.strongMatched(), match.degree(),
                match.hypotheses(), solution.evaluate(0), solution.evaluate(peaks.pixels() - 1),
                lines.medium(), match.chanceMatches(), match.chanceProbability(), match.distinctHypotheses(),
                match.secondOrderPeaks());
    }

    /**
     * How far (pixels) the centroid of the peak paired with line {@code line} may be pulled by
     * another lamp line closer to it than the peak's FWHM, which the spectrometer does not resolve
     * from it: the separation times the other line's share of their light, I_o / (I + I_o) from the
     * lamp list for two lines of one gas, and one half for lines of two gases (their lamps'
     * relative brightness is not known); the largest over such lines, 0 when there is none. The
     * profile may not show such a blend (a cadmium line 3.3 pixels from a zinc line, FWHM 4.4
     * pixels: the peak passed as single, its centroid 1.25 pixels off while stating 0.045, and a
     * fixed cubic through it was accepted 2.2 pixels off).
     */
    static double neighbourLineBound(Peaks peaks, int k, LampLines lines, Species[] species, int line,
            DispersionSolution solution) {
        double fwhm = peaks.fwhm(k);
        double dispersion = Math.abs(solution.dispersionAt(peaks.centre(k)));
        if (!(fwhm > 0) || !(dispersion > 0) || Double.isInfinite(fwhm)) {
            return 0;
        }
        double reach = fwhm * dispersion;
        double here = lines.wavelength(line);
        double bound = 0;
        for (int j = 0; j < lines.size(); j++) {
            double separation = Math.abs(lines.wavelength(j) - here);
            if (j == line || !(separation < reach)) {
                continue;
            }
            double share = 0.5;
            if (species[j].equals(species[line]) && lines.intensity(j) > 0 && lines.intensity(line) > 0) {
                share = lines.intensity(j) / (lines.intensity(j) + lines.intensity(line));
            }
            bound = Math.max(bound, separation / dispersion * share);
        }
        return bound;
    }

    /** Well-fitted neighbours whose widths give the instrument's width near a peak. */
    static final int WIDTH_NEIGHBOURS = 6;

    /**
     * How far (pixels) the centroid of a peak that looks like an unresolved blend may lie from its
     * brighter component, 0 for a peak that does not. A peak whose profile fit failed the
     * chi-square test ({@link PeakFlag#POOR_FIT}), or whose width alone exceeds the instrument's
     * by more than its uncertainty allows ({@link PeakFlag#WIDE}), and is wider than the instrument
     * there (the median FWHM of the {@value #WIDTH_NEIGHBOURS} nearest peaks that are neither
     * poorly fitted, too wide nor saturated) is taken to be two lines closer than the resolution. Peaks fitted together
     * ({@link PeakFlag#BLENDED}) share one width, so an excess width cannot be laid on one of them:
     * every member of such a group gets the bound, which costs a group with one unresolved member
     * some weight but never trusts the wrong one. (Limiting the bound to peaks fitted alone solved
     * one run fewer in seeds 1 to 30 of the sweep, within its scatter.) For components of the
     * instrument's width s, flux shares f &gt;= 1/2 and 1 - f, separated by d, the blend's variance
     * is s^2 + f (1 - f) d^2 and its centroid lies (1 - f) d from the brighter one; so that offset
     * is at most sqrt(S^2 - s^2), S the fitted width (standard deviation; second moments of a
     * mixture, common practice). The bound is added in quadrature to the centroid's statistical
     * uncertainty, so such a pair weighs in the dispersion fit only as much as it can be trusted.
     * (Seeded sweeps, refdata's CalibrationSweep seed 107: the Hg 576.96 nm line, unresolved from
     * 579.07 nm, fitted as one peak of FWHM 7.6 pixels where its neighbours had 3.5, centroid 1.4
     * pixels off; as the lone end pair it bent the cubic by 0.74 pixel.)
     */
    static double blendOffsetBound(Peaks peaks, int k) {
        if (!peaks.has(k, PeakFlag.POOR_FIT) && !peaks.has(k, PeakFlag.WIDE)) {
            return 0;
        }
        int n = peaks.size();
        double[] width = new double[WIDTH_NEIGHBOURS];
        int found = 0;
        int left = k - 1;
        int right = k + 1;
        double centre = peaks.centre(k);
        // Peaks are sorted by centre: walk outwards, nearest first.
        while (found < WIDTH_NEIGHBOURS && (left >= 0 || right < n)) {
            int next;
            if (left < 0) {
                next = right++;
            } else if (right >= n) {
                next = left--;
            } else if (centre - peaks.centre(left) <= peaks.centre(right) - centre) {
                next = left--;
            } else {
                next = right++;
            }
            if (!peaks.has(next, PeakFlag.POOR_FIT) && !peaks.has(next, PeakFlag.SATURATED)
                    && !peaks.has(next, PeakFlag.WIDE)
                    && Double.isFinite(peaks.fwhm(next))) {
                width[found++] = peaks.fwhm(next);
            }
        }
        if (found == 0) {
            return 0;
        }
        Arrays.sort(width, 0, found);
        double reference = found % 2 == 1 ? width[found / 2] : 0.5 * (width[found / 2 - 1] + width[found / 2]);
        double fwhmToSigma = 1 / (2 * Math.sqrt(2 * Math.log(2)));
        double excess = Math.pow(peaks.fwhm(k) * fwhmToSigma, 2) - Math.pow(reference * fwhmToSigma, 2);
        return excess > 0 ? Math.sqrt(excess) : 0;
    }
}
