package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.CalibrationRecord;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.medium.Medium;

/**
 * The README's calibration example, compiled and run: a neon exposure of an invented 2048-pixel
 * spectrometer (truth 580 + 0.035 p - 1e-6 p^2 nm, air) calibrated by the job against the
 * built-in lamp set, the solution saved and read back, then applied to a second exposure.
 */
class CalibrationGuideTest {

    private static final int PIXELS = 2048;

    private static double truth(double p) {
        return 580 + 0.035 * p - 1e-6 * p * p;
    }

    /** Renders the lamp set's lines in the window with their table intensities; Poisson + read noise. */
    private static double[] exposure(LineList neon, long seed) {
        PixelGrid detector = PixelGrid.dispersion(new double[] {580, 0.035, -1e-6}, PIXELS);
        double[] nm = new double[neon.size()];
        double[] flux = new double[neon.size()];
        for (int i = 0; i < neon.size(); i++) {
            nm[i] = neon.position(i);
            flux[i] = 2 * neon.intensity(i).orElse(1);
        }
        double[] expected = new double[PIXELS];
        java.util.Arrays.fill(expected, 50);
        new LineRenderer(detector, Instrument.ofFwhm(0.08), 20).render(nm, flux, new double[nm.length],
                new double[nm.length], expected);
        double[] counts = new double[PIXELS];
        Noise.apply(expected, 3, seed, counts);
        return counts;
    }

    @Test
    void calibrateFromRawCountsAndApplyToASecondExposure(@TempDir Path folder) throws Exception {
        DataContext data = DataContext.builtIn();
        double[] countsPerPixel = exposure(data.lampLines(Species.parse("Ne I")), 9L);

        // --- README: Wavelength calibration ---
        LampSet neon = LampSet.of(List.of(data.lampLines(Species.parse("Ne I"))), Medium.air());
        Calibration calibration = Calibrator.defaults()                          // withThreshold, withDegree, ...
                .calibrate(CalibrationProblem.builder(countsPerPixel).lamp(neon).build()); // .prior(...), .sigmas(...)
        DispersionSolution solution = calibration.solution();
        solution.wavelengthAt(1024.0); solution.wavelengthSigmaAt(1024.0); solution.rmsPixels();
        CalibrationFiles.write(folder.resolve("calibration.json"), solution, 2048, calibration.description(),
                calibration.pairLabels());
        // --- end ---

        assertEquals(truth(1024), solution.wavelengthAt(1024.0), 0.05 * 0.033);   // within 0.05 pixel
        assertTrue(calibration.solution().usedCount() >= 8, "lines used: " + solution.usedCount());

        // Apply the saved solution to a second exposure (another noise draw), as `calibrate --apply` does.
        double[] second = exposure(data.lampLines(Species.parse("Ne I")), 10L);
        CalibrationFiles.Calibration saved = CalibrationFiles.read(folder.resolve("calibration.json"));
        String text = SpectrumFiles.withWavelengths(new SpectrumFiles.Spectrum("second.csv", second, null, null,
                java.util.Map.of()), saved.solution(), "calibration.json");
        // the lines span pixels 150-2000 of 2048: the file says where the wavelengths are extrapolated
        assertTrue(text.contains("# valid-pixels: "), text.substring(0, 300));
        Path written = folder.resolve("second-nm.csv");
        OutputFiles.writeString(written, text);
        SpectrumFiles.Spectrum read = SpectrumFiles.read(written);
        assertEquals(PIXELS, read.pixels());
        for (int p = 0; p < PIXELS; p += 101) {
            // within 4 stated standard uncertainties (they grow outside the lines' span, pixels 150-2000)
            assertEquals(truth(p), read.wavelengths()[p], 4 * saved.solution().wavelengthSigmaAt(p) + 1e-6,
                    "pixel " + p);
            assertEquals(second[p], read.counts()[p]);
        }
        // --- README: the file as plain data ---
        CalibrationRecord record = CalibrationFiles.readRecord(folder.resolve("calibration.json"));
        DispersionSolution again = DispersionSolution.of(record.polynomial());   // evaluate it with the engine
        // --- end ---
        assertEquals(saved.solution().wavelengthAt(777.0), again.wavelengthAt(777.0));
        assertEquals(solution.usedCount(), record.linesUsed());
        try (var files = Files.list(folder)) {
            assertEquals(2, files.count(), "no temporary file is left behind");
        }
    }
}
