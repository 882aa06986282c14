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

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/**
 * Every peaks, spectrum, synthetic-spectrum (CSV and JSON) and truth file Ritzwerk writes reads
 * back with the same values, bit for bit (properties over seeded random content: any finite
 * doubles, gaps as "not given", labels and descriptions with commas, quotes, spaces and non-ASCII
 * text); the line and level formats have the same property in their own tests.
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
                        // air wavelengths where the standard-air model takes them (200 nm to 2.5 um; outside they are refused)
                        positions[k] = wavelength ? 200.5 + 2000 * r.nextDouble() : anyDouble(r, true);
                        // below the position, as the reader requires
                        sigmas[k] = r.nextInt(4) == 0 ? Double.NaN
                                : Math.min(anyDouble(r, true), Math.nextDown(positions[k]));
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
                    double[] expected = r.nextBoolean() ? new double[n] : null;
                    for (int p = 0; p < n; p++) {
                        counts[p] = anyDouble(r, false);
                        if (expected != null) {
                            expected[p] = anyDouble(r, false);
                        }
                        if (sigmas != null) {
                            sigmas[p] = anyDouble(r, true);
                        }
                        if (nm != null) {
                            nm[p] = 300 + p * 0.1 + 1e-3 * r.nextDouble();
                        }
                    }
                    Map<String, String> header = new LinkedHashMap<>();
                    header.put("source", "invented exposure " + seed);
                    SpectrumFiles.Spectrum spectrum = new SpectrumFiles.Spectrum("x.csv", counts, sigmas, nm, expected,
                            header);
                    SpectrumFiles.Spectrum back = SpectrumFiles.read(SpectrumFiles.writeCsv(spectrum), "x.csv");
                    assertArrayEquals(counts, back.counts());
                    assertArrayEquals(expected, back.expectedCounts());
                    assertArrayEquals(sigmas, back.sigmas());
                    assertArrayEquals(nm, back.wavelengths());
                    assertEquals(header, back.header());
                });
    }

    /** Text with the characters that trouble CSV and JSON: commas, quotes, spaces, '#', non-ASCII. */
    private static String anyText(SplittableRandom r, int min, int max) {
        String alphabet = "abcXYZ019 ,\"#:-+/()'\u00e9\u03b1\u2013\u00b5\\{}[]";
        StringBuilder text = new StringBuilder();
        int n = min + r.nextInt(max - min + 1);
        for (int i = 0; i < n; i++) {
            text.append(alphabet.charAt(r.nextInt(alphabet.length())));
        }
        return text.toString();
    }

    /** A random spectrum and the grid kind that describes its pixels (the writers check it). */
    private record Drawn(SyntheticSpectrum spectrum, String kind) {
    }

    /**
     * A random synthetic spectrum in a random medium: rising edges from a random dispersion
     * polynomial (every edge an awkward double), any finite counts, lines with awkward labels.
     */
    private static Drawn anySpectrum(SplittableRandom r, int pixels, int lineCount) {
        double c1 = 1e-3 * (0.5 + r.nextDouble());
        double[] c = r.nextBoolean() ? new double[] {100 + 1000 * r.nextDouble(), c1}
                : new double[] {100 + 1000 * r.nextDouble(), c1, c1 / pixels * (r.nextDouble() - 0.5) / 2};
        PixelGrid grid = PixelGrid.dispersion(c, pixels);
        StringBuilder kind = new StringBuilder("dispersion ");
        for (int k = 0; k < c.length; k++) {
            kind.append(k == 0 ? "" : ",").append(c[k]);
        }
        double[] expected = new double[pixels];
        double[] counts = new double[pixels];
        for (int p = 0; p < pixels; p++) {
            expected[p] = anyDouble(r, true);
            counts[p] = r.nextBoolean() ? Math.floor(100 * r.nextDouble()) : anyDouble(r, false);
        }
        double[] position = new double[lineCount];
        double[] photons = new double[lineCount];
        double[] gaussian = new double[lineCount];
        double[] lorentz = new double[lineCount];
        double[] lineCounts = new double[lineCount];
        double[] inPixels = new double[lineCount];
        String[] label = new String[lineCount];
        for (int i = 0; i < lineCount; i++) {
            position[i] = r.nextInt(6) == 0 ? anyDouble(r, true) : 90 + 1100 * r.nextDouble();
            photons[i] = anyDouble(r, true);
            gaussian[i] = r.nextInt(5) == 0 ? 0.0 : anyDouble(r, true);
            lorentz[i] = r.nextInt(3) == 0 ? 0.0 : anyDouble(r, true);
            lineCounts[i] = r.nextInt(5) == 0 ? 0.0 : anyDouble(r, true);
            inPixels[i] = r.nextInt(5) == 0 ? 0.0 : anyDouble(r, true);
            label[i] = anyText(r, 1, 40);
        }
        return new Drawn(SyntheticSpectrum.of(grid, anyMedium(r), expected, counts,
                Scene.Lines.of(position, photons, gaussian, lorentz, label), lineCounts, inPixels), kind.toString());
    }

    /** A random scene description: text, doubles, longs and booleans under simple keys. */
    private static Map<String, Object> anyDescription(SplittableRandom r) {
        Map<String, Object> d = new LinkedHashMap<>();
        int n = r.nextInt(8);
        for (int k = 0; k < n; k++) {
            String key = "key-" + k + "-" + anyText(r, 0, 3).replaceAll("[^a-z0-9]", "x");
            switch (r.nextInt(4)) {
                case 0 -> d.put(key, anyText(r, 0, 30).strip());
                case 1 -> d.put(key, anyDouble(r, false));
                case 2 -> d.put(key, r.nextLong());
                default -> d.put(key, r.nextBoolean());
            }
        }
        return d;
    }

    private static Medium anyMedium(SplittableRandom r) {
        return r.nextBoolean() ? Medium.air() : Medium.vacuum();
    }

    private static String write(IoWrite write) {
        StringWriter out = new StringWriter();
        try {
            write.to(out);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toString();
    }

    private interface IoWrite {
        void to(StringWriter out) throws IOException;
    }

    @Test
    void syntheticSpectraAsCsvReadBackBitForBit() {
        qt().withFixedSeed(20261204L).withExamples(120)
                .forAll(integers().between(1, 150), longs().all())
                .checkAssert((n, seed) -> {
                    SplittableRandom r = new SplittableRandom(seed);
                    Drawn drawn = anySpectrum(r, n, r.nextInt(4));
                    SyntheticSpectrum spectrum = drawn.spectrum();
                    Map<String, Object> description = anyDescription(r);
                    String text = write(out -> SyntheticSpectrumFiles.writeCsv(spectrum, drawn.kind(), description,
                            out));
                    SpectrumFiles.Spectrum back = SpectrumFiles.read(text, "s.csv");
                    double[] centres = new double[n];
                    for (int p = 0; p < n; p++) {
                        centres[p] = spectrum.grid().centre(p);
                    }
                    assertArrayEquals(centres, back.wavelengths());
                    assertArrayEquals(spectrum.expectedCounts(), back.expectedCounts());
                    assertArrayEquals(spectrum.counts(), back.counts());
                    Map<String, String> header = new LinkedHashMap<>();
                    header.put("axis", SyntheticSpectrumFiles.axis(spectrum, drawn.kind()));
                    description.forEach((key, value) -> header.put(key, String.valueOf(value)));
                    assertEquals(header, back.header());
                    assertTrue(back.header().get("axis").endsWith(" pixels from " + spectrum.grid().edge(0) + " to "
                            + spectrum.grid().edge(n) + ")"), back.header().get("axis"));
                });
    }

    @Test
    void syntheticSpectraAsJsonReadBackBitForBit() {
        qt().withFixedSeed(20261205L).withExamples(120)
                .forAll(integers().between(1, 150), integers().between(0, 12), longs().all())
                .checkAssert((n, lineCount, seed) -> {
                    SplittableRandom r = new SplittableRandom(seed);
                    Drawn drawn = anySpectrum(r, n, lineCount);
                    SyntheticSpectrum spectrum = drawn.spectrum();
                    Medium medium = spectrum.medium();
                    Map<String, Object> description = anyDescription(r);
                    List<String> notes = new ArrayList<>();
                    for (int k = r.nextInt(3); k > 0; k--) {
                        notes.add(anyText(r, 0, 50));
                    }
                    String grid = drawn.kind();
                    String text = write(out -> SyntheticSpectrumFiles.writeJson(spectrum, grid, description,
                            notes, out));
                    SyntheticSpectrumFiles.Document back = SyntheticSpectrumFiles.readJson(text, "s.json");
                    assertEquals(medium, back.medium());
                    assertEquals(grid, back.grid());
                    assertEquals(description, back.scene());
                    assertEquals(notes, back.notes());
                    double[] edges = new double[n + 1];
                    double[] centres = new double[n];
                    for (int p = 0; p <= n; p++) {
                        edges[p] = spectrum.grid().edge(p);
                    }
                    for (int p = 0; p < n; p++) {
                        centres[p] = spectrum.grid().centre(p);
                    }
                    assertArrayEquals(edges, back.pixelEdges());
                    assertArrayEquals(centres, back.wavelengths());
                    assertArrayEquals(spectrum.expectedCounts(), back.expectedCounts());
                    assertArrayEquals(spectrum.counts(), back.counts());
                    assertSameLines(spectrum, back.lines());
                    // The general spectrum reader takes the same document.
                    assertArrayEquals(spectrum.counts(), SpectrumFiles.read(text, "s.json").counts());
                });
    }

    @Test
    void truthTablesReadBackBitForBit() {
        qt().withFixedSeed(20261206L).withExamples(150)
                .forAll(integers().between(0, 60), longs().all())
                .checkAssert((lineCount, seed) -> {
                    SplittableRandom r = new SplittableRandom(seed);
                    SyntheticSpectrum spectrum = anySpectrum(r, 2, lineCount).spectrum();
                    Medium medium = spectrum.medium();
                    String text = write(out -> SpectrumLineFiles.writeCsv(spectrum, out));
                    SpectrumLineFiles.SpectrumLines back = SpectrumLineFiles.read(text, "truth.csv");
                    assertEquals(medium, back.medium());
                    assertSameLines(spectrum, back);
                });
    }

    private static void assertSameLines(SyntheticSpectrum spectrum, SpectrumLineFiles.SpectrumLines back) {
        Scene.Lines lines = spectrum.lines();
        int n = lines.size();
        assertEquals(n, back.size());
        double[] lineCounts = new double[n];
        double[] inPixels = new double[n];
        double[] nm = new double[n];
        double[] doppler = new double[n];
        double[] lorentz = new double[n];
        List<String> labels = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            lineCounts[i] = spectrum.lineCounts(i);
            inPixels[i] = spectrum.lineCountsInPixels(i);
            nm[i] = lines.position(i);
            doppler[i] = lines.gaussianFwhm(i);
            lorentz[i] = lines.lorentzFwhm(i);
            labels.add(lines.label(i));
        }
        assertArrayEquals(nm, back.wavelengths());
        assertArrayEquals(lineCounts, back.counts());
        assertArrayEquals(inPixels, back.countsInPixels());
        assertArrayEquals(doppler, back.dopplerFwhm());
        assertArrayEquals(lorentz, back.lorentzFwhm());
        assertEquals(labels, back.labels());
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
