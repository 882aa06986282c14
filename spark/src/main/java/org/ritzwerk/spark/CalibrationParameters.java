package org.ritzwerk.spark;

import java.io.Serializable;
import java.util.List;
import java.util.Objects;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionFit;
import org.ritzwerk.engine.calibrate.LampMatcher;
import org.ritzwerk.engine.calibrate.PeakFinder;
import org.ritzwerk.medium.Medium;

/**
 * What {@link SurveyCalibration} does with every lamp exposure: the lamp set (built-in lamp
 * species and line lists), the medium of the solutions, the calibrator's settings and the prior.
 * The same settings as the {@code calibrate} command's options, with the same defaults.
 *
 * <p>An immutable, serialisable value (Spark broadcasts it once per job); the canonical
 * constructor checks every field as the engine does.
 *
 * @param lamps             the lamp's gases ("Ne I", "Ar I", ...): their built-in lamp sets, or for a
 *                          gas with a level list and no lamp set ("He I") its Ritz lines ranked by
 *                          g_u A, as {@code calibrate --lamp} takes them
 *                          ({@code DataLines.calibrationLamp}); may be empty
 * @param lineSets          data-set ids or line-list files; may be empty, not together with lamps
 * @param dataFiles         the user's data files, first in precedence; readable on every executor
 * @param medium            medium of the solutions' wavelengths: "air", "vacuum" or "air(&lt;model&gt;)"
 * @param minStrength       the weakest lamp-line strength class to use (its id), or null for all
 * @param threshold         peak detection threshold, signal to noise
 * @param tolerancePixels   how far a peak may lie from its line's predicted pixel
 * @param minMatched        the fraction of the strongest peaks that must pair with lines, 0 to 1
 * @param clip              the fit's outlier clipping, standard deviations
 * @param degree            the polynomial degree, 1 to 9; 0 to choose it (up to maxDegree)
 * @param maxDegree         the highest degree an automatic choice may take, 1 to 9
 * @param saturation        the counts at which a pixel saturates; NaN for none
 * @param priorFromNm       lowest wavelength any pixel may see, nm in the medium; NaN for no bound
 * @param priorToNm         highest such wavelength; NaN with priorFromNm
 * @param minDispersion     lowest dispersion, nm per pixel (negative when wavelength falls)
 * @param maxDispersion     highest dispersion, nm per pixel
 * @param secondOrder       whether a peak may be the second-order image of a lamp line (the
 *                          command's default; false as {@code --no-second-order})
 * @param requiredPrecision the largest accepted stated standard uncertainty, pixels, between the
 *                          first and last fitted line ({@code --required-precision}); NaN for none
 * @param resolvingPower    the spectrometer's resolving power, 1 to 1e7 ({@code --resolving-power}):
 *                          lamp lines of one gas closer than half the FWHM are merged; NaN for the
 *                          command's default (only gases built from levels merged, at 5000)
 * @param uncheckedEnds     whether a solution may rest on an end pairing no other pair checks
 *                          ({@code --unchecked-ends}; {@code Calibrator.withUncheckedEndsAccepted}):
 *                          a window of three lamp lines needs it; by default such a row is refused
 *                          (failure code {@code calibrate.unchecked-end})
 * @param gain              the detector's counts per photo-electron, above 0 ({@code --gain};
 *                          {@code Calibrator.withGain}); NaN to take it from the counts' step or
 *                          estimate it, as the command does without the option
 * @param readNoise         the detector's read noise in counts, at least 0 ({@code --read-noise};
 *                          {@code Calibrator.withReadNoise}), a floor under the measured noise; NaN
 *                          for none
 * @param uncertaintyCeiling the largest stated standard uncertainty, pixels, a solution is returned
 *                          with ({@code --uncertainty-ceiling}; {@code Calibrator.withUncertaintyCeiling}),
 *                          above 0; 1 by default, infinity for none; a row above it is refused
 *                          (failure code {@code calibrate.imprecise})
 *
 * <p>Serialisable only to travel from the driver to the executors of the same version, so the
 * serialised form is not part of the API.
 *
 * @serial exclude
 */
public record CalibrationParameters(List<String> lamps, List<String> lineSets, List<String> dataFiles, String medium,
        String minStrength, double threshold, double tolerancePixels, double minMatched, double clip, int degree,
        int maxDegree, double saturation, double priorFromNm, double priorToNm, double minDispersion,
        double maxDispersion, boolean secondOrder, double requiredPrecision, double resolvingPower,
        boolean uncheckedEnds, double gain, double readNoise, double uncertaintyCeiling) implements Serializable {

    private static final long serialVersionUID = 1L;

    /**
     * Checks every field and copies the lists.
     *
     * @param lamps           as above
     * @param lineSets        as above
     * @param dataFiles       as above
     * @param medium          as above
     * @param minStrength     as above
     * @param threshold       as above
     * @param tolerancePixels as above
     * @param minMatched      as above
     * @param clip            as above
     * @param degree          as above
     * @param maxDegree       as above
     * @param saturation      as above
     * @param priorFromNm     as above
     * @param priorToNm       as above
     * @param minDispersion   as above
     * @param maxDispersion   as above
     * @param secondOrder     as above
     * @param requiredPrecision as above
     * @param resolvingPower  as above
     * @param uncheckedEnds   as above
     * @param gain            as above
     * @param readNoise       as above
     * @param uncertaintyCeiling as above
     */
    public CalibrationParameters {
        lamps = List.copyOf(lamps);
        lineSets = List.copyOf(lineSets);
        dataFiles = List.copyOf(dataFiles);
        if (lamps.isEmpty() && lineSets.isEmpty()) {
            throw new IllegalArgumentException("give the lamp: lamps (built-in sets) and/or lineSets");
        }
        Setups.requireDistinct("lamps", lamps, text -> Species.parse(text.strip()));
        Setups.requireDistinct("lineSets", lineSets, String::strip);
        Setups.requireDistinct("dataFiles", dataFiles, String::strip);
        Medium.parse(Objects.requireNonNull(medium, "medium"));
        if (minStrength != null) {
            StrengthClass.fromId(minStrength);
        }
        if (Double.isNaN(priorFromNm) != Double.isNaN(priorToNm)) {
            throw new IllegalArgumentException("priorFromNm and priorToNm must both be given or both be NaN");
        }
        calibrator(threshold, tolerancePixels, minMatched, clip, degree, maxDegree, saturation, secondOrder,
                requiredPrecision, uncheckedEnds, gain, readNoise, uncertaintyCeiling);
        prior(priorFromNm, priorToNm, minDispersion, maxDispersion);
        if (!Double.isNaN(resolvingPower) && !(resolvingPower >= 1 && resolvingPower <= 1e7)) {
            throw new IllegalArgumentException("resolvingPower must be 1 to 1e7, or NaN for the default, got "
                    + resolvingPower);
        }
    }

    /**
     * @param lamps    species of built-in lamp sets
     * @param lineSets data-set ids or line-list files
     * @return the {@code calibrate} command's defaults: air, every strength, threshold 5, tolerance
     *         3 pixels, 60 % matched, clipping at 3.5, automatic degree up to 5, no saturation, no prior,
     *         second-order images considered, no required precision, an uncertainty ceiling of 1 pixel
     */
    public static CalibrationParameters of(List<String> lamps, List<String> lineSets) {
        return new CalibrationParameters(lamps, lineSets, List.of(), "air", null, PeakFinder.DEFAULT_THRESHOLD,
                Calibrator.DEFAULT_TOLERANCE, Calibrator.DEFAULT_MIN_MATCHED, DispersionFit.DEFAULT_CLIP, 0,
                Calibrator.DEFAULT_MAX_DEGREE, Double.NaN, Double.NaN, Double.NaN,
                LampMatcher.Prior.none().minDispersion(), LampMatcher.Prior.none().maxDispersion(), true, Double.NaN,
                Double.NaN, false, Double.NaN, Double.NaN, Calibrator.DEFAULT_UNCERTAINTY_CEILING);
    }

    /**
     * @param mediumSpec "air", "vacuum" or "air(&lt;model&gt;)"
     * @return a copy whose solutions give wavelengths in that medium
     */
    public CalibrationParameters withMedium(String mediumSpec) {
        return new CalibrationParameters(lamps, lineSets, dataFiles, mediumSpec, minStrength, threshold,
                tolerancePixels, minMatched, clip, degree, maxDegree, saturation, priorFromNm, priorToNm,
                minDispersion, maxDispersion, secondOrder, requiredPrecision, resolvingPower, uncheckedEnds,
                gain, readNoise, uncertaintyCeiling);
    }

    /**
     * @param files the user's data files, readable at these paths on every executor
     * @return a copy
     */
    public CalibrationParameters withDataFiles(List<String> files) {
        return new CalibrationParameters(lamps, lineSets, files, medium, minStrength, threshold, tolerancePixels,
                minMatched, clip, degree, maxDegree, saturation, priorFromNm, priorToNm, minDispersion, maxDispersion,
                secondOrder, requiredPrecision, resolvingPower, uncheckedEnds, gain, readNoise, uncertaintyCeiling);
    }

    /**
     * @param fixed the polynomial degree, 1 to 9; 0 for an automatic choice up to {@code highest}
     * @param highest the highest automatic degree, 1 to 9
     * @return a copy
     */
    public CalibrationParameters withDegree(int fixed, int highest) {
        return new CalibrationParameters(lamps, lineSets, dataFiles, medium, minStrength, threshold, tolerancePixels,
                minMatched, clip, fixed, highest, saturation, priorFromNm, priorToNm, minDispersion, maxDispersion,
                secondOrder, requiredPrecision, resolvingPower, uncheckedEnds, gain, readNoise, uncertaintyCeiling);
    }

    /**
     * @param counts the level at which a pixel saturates
     * @return a copy
     */
    public CalibrationParameters withSaturation(double counts) {
        return new CalibrationParameters(lamps, lineSets, dataFiles, medium, minStrength, threshold, tolerancePixels,
                minMatched, clip, degree, maxDegree, counts, priorFromNm, priorToNm, minDispersion, maxDispersion,
                secondOrder, requiredPrecision, resolvingPower, uncheckedEnds, gain, readNoise, uncertaintyCeiling);
    }

    /**
     * @param fromNm lowest wavelength any pixel may see, nm in the solutions' medium
     * @param toNm   highest such wavelength
     * @param minNmPerPixel lowest dispersion
     * @param maxNmPerPixel highest dispersion
     * @return a copy with that prior
     */
    public CalibrationParameters withPrior(double fromNm, double toNm, double minNmPerPixel, double maxNmPerPixel) {
        return new CalibrationParameters(lamps, lineSets, dataFiles, medium, minStrength, threshold, tolerancePixels,
                minMatched, clip, degree, maxDegree, saturation, fromNm, toNm, minNmPerPixel, maxNmPerPixel,
                secondOrder, requiredPrecision, resolvingPower, uncheckedEnds, gain, readNoise, uncertaintyCeiling);
    }

    /**
     * @param considered whether a peak may be the second-order image of a lamp line
     * @return a copy
     */
    public CalibrationParameters withSecondOrder(boolean considered) {
        return new CalibrationParameters(lamps, lineSets, dataFiles, medium, minStrength, threshold, tolerancePixels,
                minMatched, clip, degree, maxDegree, saturation, priorFromNm, priorToNm, minDispersion, maxDispersion,
                considered, requiredPrecision, resolvingPower, uncheckedEnds, gain, readNoise, uncertaintyCeiling);
    }

    /**
     * @param pixels the largest accepted stated standard uncertainty between the first and last
     *               fitted line; a less precise solution is refused in its row (failure code
     *               {@code calibrate.imprecise})
     * @return a copy
     */
    public CalibrationParameters withRequiredPrecision(double pixels) {
        return new CalibrationParameters(lamps, lineSets, dataFiles, medium, minStrength, threshold, tolerancePixels,
                minMatched, clip, degree, maxDegree, saturation, priorFromNm, priorToNm, minDispersion, maxDispersion,
                secondOrder, pixels, resolvingPower, uncheckedEnds, gain, readNoise, uncertaintyCeiling);
    }

    /**
     * @param r the spectrometer's resolving power, 1 to 1e7, or NaN for the command's default
     * @return a copy
     */
    public CalibrationParameters withResolvingPower(double r) {
        return new CalibrationParameters(lamps, lineSets, dataFiles, medium, minStrength, threshold, tolerancePixels,
                minMatched, clip, degree, maxDegree, saturation, priorFromNm, priorToNm, minDispersion, maxDispersion,
                secondOrder, requiredPrecision, r, uncheckedEnds, gain, readNoise, uncertaintyCeiling);
    }

    /**
     * @param accepted whether a solution may rest on an end pairing no other pair checks (a window
     *                 of three lamp lines); see {@code Calibrator.withUncheckedEndsAccepted}
     * @return a copy
     */
    public CalibrationParameters withUncheckedEnds(boolean accepted) {
        return new CalibrationParameters(lamps, lineSets, dataFiles, medium, minStrength, threshold, tolerancePixels,
                minMatched, clip, degree, maxDegree, saturation, priorFromNm, priorToNm, minDispersion, maxDispersion,
                secondOrder, requiredPrecision, resolvingPower, accepted, gain, readNoise, uncertaintyCeiling);
    }

    /**
     * @param countsPerElectron the detector's gain, counts per photo-electron, above 0; NaN to take
     *                          it from the counts' step or estimate it
     * @param counts            the read noise in counts, at least 0; NaN for none
     * @return a copy with that detector
     */
    public CalibrationParameters withDetector(double countsPerElectron, double counts) {
        return new CalibrationParameters(lamps, lineSets, dataFiles, medium, minStrength, threshold, tolerancePixels,
                minMatched, clip, degree, maxDegree, saturation, priorFromNm, priorToNm, minDispersion, maxDispersion,
                secondOrder, requiredPrecision, resolvingPower, uncheckedEnds, countsPerElectron, counts,
                uncertaintyCeiling);
    }

    /**
     * @param pixels the largest stated standard uncertainty between the first and last fitted line a
     *               solution is returned with, above 0 (infinity for none; 1 by default); see
     *               {@code Calibrator.withUncertaintyCeiling}
     * @return a copy
     */
    public CalibrationParameters withUncertaintyCeiling(double pixels) {
        return new CalibrationParameters(lamps, lineSets, dataFiles, medium, minStrength, threshold, tolerancePixels,
                minMatched, clip, degree, maxDegree, saturation, priorFromNm, priorToNm, minDispersion, maxDispersion,
                secondOrder, requiredPrecision, resolvingPower, uncheckedEnds, gain, readNoise, pixels);
    }

    /** @return the calibrator these settings describe (as the command configures it) */
    Calibrator calibrator() {
        return calibrator(threshold, tolerancePixels, minMatched, clip, degree, maxDegree, saturation, secondOrder,
                requiredPrecision, uncheckedEnds, gain, readNoise, uncertaintyCeiling);
    }

    /** The calibrator of these settings; built in the constructor too, where its checks refuse a bad setting. */
    private static Calibrator calibrator(double threshold, double tolerancePixels, double minMatched, double clip,
            int degree, int maxDegree, double saturation, boolean secondOrder, double requiredPrecision,
            boolean uncheckedEnds, double gain, double readNoise, double uncertaintyCeiling) {
        Calibrator calibrator = Calibrator.defaults().withThreshold(threshold).withTolerance(tolerancePixels)
                .withMinMatchedFraction(minMatched).withClipping(clip).withSecondOrder(secondOrder)
                .withUncheckedEndsAccepted(uncheckedEnds).withUncertaintyCeiling(uncertaintyCeiling);
        calibrator = degree == 0 ? calibrator.withAutomaticDegree(maxDegree) : calibrator.withDegree(degree);
        calibrator = Double.isNaN(requiredPrecision) ? calibrator : calibrator.withRequiredPrecision(requiredPrecision);
        calibrator = Double.isNaN(gain) ? calibrator : calibrator.withGain(gain);
        calibrator = Double.isNaN(readNoise) ? calibrator : calibrator.withReadNoise(readNoise);
        return Double.isNaN(saturation) ? calibrator : calibrator.withSaturationLevel(saturation);
    }

    /** @return the prior these settings describe */
    LampMatcher.Prior prior() {
        return prior(priorFromNm, priorToNm, minDispersion, maxDispersion);
    }

    private static LampMatcher.Prior prior(double from, double to, double minDispersion, double maxDispersion) {
        if (Double.isNaN(from)) {
            LampMatcher.Prior none = LampMatcher.Prior.none();
            return new LampMatcher.Prior(none.minWavelengthNm(), none.maxWavelengthNm(), minDispersion, maxDispersion);
        }
        return new LampMatcher.Prior(Math.min(from, to), Math.max(from, to), minDispersion, maxDispersion);
    }
}
