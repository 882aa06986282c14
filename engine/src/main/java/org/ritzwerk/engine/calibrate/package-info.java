/**
 * Spectrometer wavelength calibration from a lamp exposure: peaks with centroids and honest
 * uncertainties ({@link org.ritzwerk.engine.calibrate.PeakFinder} -&gt;
 * {@link org.ritzwerk.engine.calibrate.Peaks}), automatic pairing of peaks with a lamp's lines
 * ({@link org.ritzwerk.engine.calibrate.LampMatcher} -&gt;
 * {@link org.ritzwerk.engine.calibrate.LampMatch}), and a clipped weighted polynomial
 * pixel-to-wavelength solution ({@link org.ritzwerk.engine.calibrate.DispersionFit} -&gt;
 * {@link org.ritzwerk.engine.calibrate.DispersionSolution}) that can be applied to other spectra.
 *
 * <p>The whole job, as the command line's {@code calibrate} runs it, is a
 * {@link org.ritzwerk.engine.calibrate.CalibrationProblem} (exposure, lamp lines as a
 * {@link org.ritzwerk.engine.calibrate.LampSet}, prior) solved by an immutable
 * {@link org.ritzwerk.engine.calibrate.Calibrator} into a
 * {@link org.ritzwerk.engine.calibrate.Calibration}:
 *
 * <pre>{@code
 * LampSet neon = LampSet.of(List.of(neonLineList), Medium.air());
 * Calibration c = Calibrator.defaults().withSaturationLevel(65535)
 *         .calibrate(CalibrationProblem.builder(counts).lamp(neon)
 *                 .prior(new LampMatcher.Prior(340, 910, 0.10, 0.18)).build());
 * double nm = c.solution().wavelengthAt(1234.5);
 * double sigmaNm = c.solution().wavelengthSigmaAt(1234.5);
 * }</pre>
 *
 * <p>The steps can also be called one by one:
 *
 * <pre>{@code
 * Peaks peaks = PeakFinder.defaults().withSaturationLevel(65535).find(counts);
 * LampLines neon = LampLines.of(nm, relativeIntensity, null, Medium.air());
 * LampMatch match = LampMatcher.defaults()
 *         .withPrior(new LampMatcher.Prior(340, 910, 0.10, 0.18))
 *         .match(peaks, neon);
 * DispersionSolution solution = match.fit(DispersionFit.automatic(5));
 * }</pre>
 *
 * <p><b>Units.</b> Pixel positions are 0-based, pixel i covering [i - 1/2, i + 1/2) with its
 * centre at i; widths and centroid uncertainties are in pixels. Counts are detector counts per
 * pixel (ideally detected photo-electrons, which the default noise model assumes; see
 * {@link org.ritzwerk.engine.calibrate.PeakFinder}). Wavelengths are in nm, in the medium of the
 * lamp line list (air for the usual lamp tables), and dispersions in nm per pixel. Every
 * uncertainty is a standard uncertainty (one standard deviation).
 *
 * <p><b>Thread-safety.</b> Every public type here is immutable and thread-safe: the finders,
 * matchers and fits are configured with {@code withX} methods that return copies, keep no state
 * between calls, and can be shared between threads; results are immutable values whose array
 * accessors return copies. The engine reads no files and keeps no global state.
 *
 * <p>Failures to calibrate (too few peaks or lines, no solution within the prior, a lamp that
 * does not fit) are {@link org.ritzwerk.engine.calibrate.CalibrationException}s with a stable
 * code; bad arguments are {@link java.lang.IllegalArgumentException}s naming the element.
 */
package org.ritzwerk.engine.calibrate;
