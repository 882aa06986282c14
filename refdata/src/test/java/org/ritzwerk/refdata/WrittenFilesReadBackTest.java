package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.booleans;
import static org.quicktheories.generators.SourceDSL.doubles;
import static org.quicktheories.generators.SourceDSL.integers;
import static org.quicktheories.generators.SourceDSL.longs;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/**
 * Every peaks and spectrum file Ritzwerk writes reads back with the same values, bit for bit
 * (properties over seeded random content: any finite doubles, gaps as "not given"); the line and
 * level formats have the same property in their own tests.
 */
class WrittenFilesReadBackTest {

    /** A random double spread over many decades, of either sign when allowed. */
    private static double anyDouble(SplittableRandom r, boolean positive) {
        double magnitude = Math.pow(10, -30 + 60 * r.nextDouble()) * (1 + r.nextDouble());
        if (r.nextInt(10) == 0) {
            magnitude = Double.longBitsToDouble(r.nextLong(0x0010000000000000L, 0x7fefffffffffffffL));
        }
        return positive || r.nextBoolean() ? magnitude : -magnitude;
    }

    @Test
    void peaksReadBackBitForBit() {
        qt().withFixedSeed(20261203L).withExamples(150)
                .forAll(integers().between(1, 40), longs().all(), booleans().all())
                .checkAssert((n, seed, wavelength) -> {
                    SplittableRandom r = new SplittableRandom(seed);
                    double[] positions = new double[n];
                    double[] sigmas = new double[n];
                    double[] intensities = new double[n];
                    double[] widths = new double[n];
                    for (int k = 0; k < n; k++) {
                        positions[k] = wavelength ? 100 + 2000 * r.nextDouble() : anyDouble(r, true);
                        sigmas[k] = r.nextInt(4) == 0 ? Double.NaN : anyDouble(r, true);
                        intensities[k] = r.nextInt(4) == 0 ? Double.NaN : r.nextInt(8) == 0 ? 0.0 : anyDouble(r, true);
                        widths[k] = r.nextInt(4) == 0 ? Double.NaN : anyDouble(r, true);
                    }
                    PeakFiles.Peaks peaks = new PeakFiles.Peaks("run-7", wavelength ? Unit.NANOMETRE : Unit.PER_CENTIMETRE,
                            wavelength ? Medium.air() : null, positions, sigmas, intensities, widths, new int[n]);
                    String text = PeakFiles.writeCsv(peaks, "invented peaks", "a test", "measured", "1");
                    PeakFiles.Peaks back = PeakFiles.read(text, "x.csv");
                    assertEquals(peaks.id(), back.id());
                    assertEquals(peaks.unit(), back.unit());
                    assertEquals(peaks.medium(), back.medium());
                    assertArrayEquals(positions, back.positions());
                    assertArrayEquals(sigmas, back.uncertainties());
                    assertArrayEquals(intensities, back.intensities());
                    assertArrayEquals(widths, back.widths());
                });
    }

    @Test
    void spectraReadBackBitForBit() {
        qt().withFixedSeed(7L).withExamples(150)
                .forAll(integers().between(1, 200), longs().all(), booleans().all(), booleans().all())
                .checkAssert((n, seed, withSigmas, withWavelengths) -> {
                    SplittableRandom r = new SplittableRandom(seed);
                    double[] counts = new double[n];
                    double[] sigmas = withSigmas ? new double[n] : null;
                    double[] nm = withWavelengths ? new double[n] : null;
                    for (int p = 0; p < n; p++) {
                        counts[p] = anyDouble(r, false);
                        if (sigmas != null) {
                            sigmas[p] = anyDouble(r, true);
                        }
                        if (nm != null) {
                            nm[p] = 300 + p * 0.1 + 1e-3 * r.nextDouble();
                        }
                    }
                    Map<String, String> header = new LinkedHashMap<>();
                    header.put("source", "invented exposure " + seed);
                    SpectrumFiles.Spectrum spectrum = new SpectrumFiles.Spectrum("x.csv", counts, sigmas, nm, header);
                    SpectrumFiles.Spectrum back = SpectrumFiles.read(SpectrumFiles.writeCsv(spectrum), "x.csv");
                    assertArrayEquals(counts, back.counts());
                    assertArrayEquals(sigmas, back.sigmas());
                    assertArrayEquals(nm, back.wavelengths());
                    assertEquals(header, back.header());
                });
    }

    @Test
    void valuesTheFormatsCannotHoldAreRefusedNotWritten() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> SpectrumFiles.writeCsv(
                new SpectrumFiles.Spectrum("x", new double[] {1, Double.NaN}, null, null, Map.of())));
        assertTrue(e.getMessage().contains("pixel 1"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> PeakFiles.writeCsv(new PeakFiles.Peaks("a", Unit.NANOMETRE,
                Medium.vacuum(), new double[] {-1}, new double[1], new double[1], new double[1], new int[1]),
                "t", "s", "measured", "1"));
        assertThrows(IllegalArgumentException.class, () -> PeakFiles.writeCsv(new PeakFiles.Peaks("a", Unit.NANOMETRE,
                Medium.vacuum(), new double[] {1}, new double[1], new double[1], new double[1], new int[1]),
                "two\nlines", "s", "measured", "1"));
        IllegalArgumentException negative = assertThrows(IllegalArgumentException.class, () -> PeakFiles.writeCsv(
                new PeakFiles.Peaks("a", Unit.NANOMETRE, Medium.vacuum(), new double[] {1, 2},
                        new double[] {0.1, 0.1}, new double[] {1, -1}, new double[2], new int[2]), "t", "s",
                "measured", "1"));
        assertTrue(negative.getMessage().contains("peak 1: intensity"), negative.getMessage());
    }
}
