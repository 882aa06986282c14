package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;
import static org.quicktheories.generators.SourceDSL.longs;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.data.CalibrationRecord;
import org.ritzwerk.data.DispersionPolynomial;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.medium.Medium;

/**
 * A calibration record (api) written by {@link CalibrationFiles} reads back equal, member for
 * member and bit for bit (property over seeded random records: any monotonic polynomial with or
 * without covariance, any finite figures, NaN for "not known", labels and descriptions with
 * commas, quotes and non-ASCII text); writing it again gives the same text.
 */
class CalibrationRecordReadBackTest {

    private static final String[] MEDIA = {"vacuum", "air", "air(ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm)"};

    private static String anyText(SplittableRandom r, int min, int max) {
        String alphabet = "abcXYZ019 ,\"#:-+/()'\u00e9\u03b1\u2013\u00b5\\{}[]\n\t";
        StringBuilder text = new StringBuilder();
        int n = min + r.nextInt(max - min + 1);
        for (int i = 0; i < n; i++) {
            text.append(alphabet.charAt(r.nextInt(alphabet.length())));
        }
        return text.toString();
    }

    /** A finite double over many decades, of either sign, now and then a signed zero or an extreme. */
    private static double anyDouble(SplittableRandom r) {
        int pick = r.nextInt(20);
        if (pick == 0) {
            return r.nextBoolean() ? 0.0 : -0.0;
        }
        double magnitude = pick == 1 ? Double.longBitsToDouble(r.nextLong(1L, 0x7fefffffffffffffL))
                : Math.pow(10, -30 + 60 * r.nextDouble()) * (1 + r.nextDouble());
        return r.nextBoolean() ? magnitude : -magnitude;
    }

    private static double anyPositiveOrNaN(SplittableRandom r) {
        return r.nextInt(4) == 0 ? Double.NaN : Math.abs(anyDouble(r));
    }

    /** L L^T of a random lower-triangular L: a covariance (positive semidefinite), exactly symmetric. */
    private static double[][] anyCovariance(SplittableRandom r, int k) {
        double[][] l = new double[k][k];
        for (int i = 0; i < k; i++) {
            l[i][i] = Math.sqrt(Math.pow(10, -14 + 10 * r.nextDouble()));
            for (int j = 0; j < i; j++) {
                l[i][j] = (r.nextDouble() - 0.5) * l[i][i];
            }
        }
        double[][] covariance = new double[k][k];
        for (int i = 0; i < k; i++) {
            for (int j = 0; j < k; j++) {
                double v = 0;
                for (int m = 0; m <= Math.min(i, j); m++) {
                    v += l[i][m] * l[j][m];
                }
                covariance[i][j] = v;
            }
        }
        return covariance;
    }

    /** A random record whose polynomial passes the reader's check across the detector. */
    static CalibrationRecord anyRecord(SplittableRandom r, int pixels) {
        double centre = (pixels - 1) / 2.0 + (r.nextDouble() - 0.5) * 0.1 * pixels;
        double halfRange = Math.max(0.5, (pixels - 1) / 2.0 * (0.8 + 0.4 * r.nextDouble()));
        int degree = 1 + r.nextInt(5);
        double[] a = new double[degree + 1];
        // |x| <= 1.5 + ... over the detector; the small higher terms keep the slope's sign.
        double slope = (r.nextBoolean() ? 1 : -1) * (1e-3 + 0.5 * r.nextDouble()) * halfRange;
        a[1] = slope;
        for (int j = 2; j <= degree; j++) {
            a[j] = (r.nextDouble() - 0.5) * 0.02 * Math.abs(slope) / (j * Math.pow(2, j));
        }
        a[0] = 100 + 4 * Math.abs(slope) + 2000 * r.nextDouble();
        double[][] covariance = r.nextInt(3) != 0 ? anyCovariance(r, degree + 1) : null;
        // a fit's higher-degree polynomial (its uncertainty beyond the valid range): the same terms
        // and one or two small ones more, with a covariance of its own
        double[] higher = null;
        double[][] higherCovariance = null;
        if (covariance != null && r.nextBoolean()) {
            higher = java.util.Arrays.copyOf(a, a.length + 1 + r.nextInt(2));
            for (int j = a.length; j < higher.length; j++) {
                higher[j] = (r.nextDouble() - 0.5) * 0.02 * Math.abs(slope) / (j * Math.pow(2, j));
            }
            higherCovariance = anyCovariance(r, higher.length);
        }
        // The valid range lies on the detector (-0.5 to pixels - 0.5), and within the used lines' pixels below.
        double lowest = -0.5 + r.nextDouble() * pixels / 3;
        double highest = lowest + 1e-6 + r.nextDouble() * (pixels - 0.5 - lowest - 1e-6);
        Medium medium = Medium.parse(MEDIA[r.nextInt(MEDIA.length)]);
        DispersionPolynomial polynomial = new DispersionPolynomial(medium, centre, halfRange, a, covariance, lowest,
                highest, higher, higherCovariance);
        if (r.nextInt(5) == 0) {
            return CalibrationRecord.of(anyText(r, 0, 30), pixels, polynomial);
        }
        List<CalibrationRecord.FittedLine> lines = new ArrayList<>();
        int n = r.nextInt(25);
        // Lines agree with the coefficients (the reader checks that residual_nm is the wavelength
        // minus the solution at the pixel); the other members are arbitrary.
        org.ritzwerk.engine.calibrate.DispersionSolution solution =
                org.ritzwerk.engine.calibrate.DispersionSolution.of(polynomial);
        double usedLo = Double.POSITIVE_INFINITY;
        double usedHi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < n; i++) {
            double pixel = -0.5 + r.nextDouble() * pixels;
            double fitted = solution.wavelengthAt(pixel);
            double wavelength = fitted + (r.nextDouble() - 0.5) * 1e-2;
            boolean used = r.nextInt(5) != 0;
            lines.add(new CalibrationRecord.FittedLine(pixel, wavelength, anyPositiveOrNaN(r), wavelength - fitted,
                    anyDouble(r), used, anyText(r, 0, 30), r.nextInt(4) == 0 ? anyText(r, 0, 10) : ""));
            if (used) {
                usedLo = Math.min(usedLo, pixel);
                usedHi = Math.max(usedHi, pixel);
            }
        }
        if (usedLo < usedHi) {
            // a fit's valid range is its used lines' span (the reader refuses one reaching beyond it)
            double span = usedHi - usedLo;
            polynomial = new DispersionPolynomial(medium, centre, halfRange, a, covariance,
                    usedLo + r.nextDouble() * span / 3, usedHi - r.nextDouble() * span / 3, higher, higherCovariance);
        } else if (usedLo == usedHi) {
            // one used line spans no range: a fit never has one alone, so it is left out of the fit here
            for (int i = 0; i < lines.size(); i++) {
                CalibrationRecord.FittedLine line = lines.get(i);
                if (line.used()) {
                    lines.set(i, new CalibrationRecord.FittedLine(line.pixel(), line.wavelengthNm(), line.sigmaNm(),
                            line.residualNm(), line.residualPixels(), false, line.line(), line.flag()));
                }
            }
        }
        List<CalibrationRecord.SaturatedLine> saturated = new ArrayList<>();
        int m = r.nextInt(3) == 0 ? 1 + r.nextInt(4) : 0;
        for (int i = 0; i < m; i++) {
            saturated.add(new CalibrationRecord.SaturatedLine(anyDouble(r), anyDouble(r), anyText(r, 0, 30)));
        }
        return new CalibrationRecord(anyText(r, 0, 60), pixels, polynomial, anyPositiveOrNaN(r), anyPositiveOrNaN(r),
                anyPositiveOrNaN(r), lines, saturated);
    }

    /** A record whose coefficients were changed after the fit contradicts its own lines and is refused. */
    @Test
    void aRecordWhoseCoefficientsWereChangedIsRefused() {
        CalibrationRecord record = null;
        for (long seed = 1; record == null || record.lines().isEmpty(); seed++) {
            record = anyRecord(new SplittableRandom(seed), 2048);
        }
        String text = CalibrationFiles.toJson(record);
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("\"coefficients_nm\"\\s*:\\s*\\[\\s*([^,\\]\\s]+)")
                .matcher(text);
        assertTrue(m.find(), text);
        String edited = text.substring(0, m.start(1)) + (Double.parseDouble(m.group(1)) + 1.0)
                + text.substring(m.end(1));
        DataFileException e = org.junit.jupiter.api.Assertions.assertThrows(DataFileException.class,
                () -> CalibrationFiles.parseRecord("edited.json", edited));
        assertTrue(e.getMessage().contains("the file contradicts itself"), e.getMessage());
    }

    @Test
    void aWrittenRecordReadsBackEqual() {
        qt().withFixedSeed(20261203L).withExamples(200)
                .forAll(integers().between(2, 5000), longs().all())
                .checkAssert((pixels, seed) -> {
                    CalibrationRecord record = anyRecord(new SplittableRandom(seed), pixels);
                    String text = CalibrationFiles.toJson(record);
                    CalibrationRecord back = CalibrationFiles.parseRecord("x.json", text);
                    assertEquals(record, back);
                    assertEquals(text, CalibrationFiles.toJson(back));
                });
    }

    @Test
    void aFittedSolutionSavedAndReadGivesTheSameRecordAndText(@TempDir Path dir) throws IOException {
        DispersionSolution fitted = CalibrationFilesTest.fitted();   // invented pairs on a quadratic
        List<String> labels = List.of("a", "b", "c", "d", "e", "f");
        CalibrationRecord record = fitted.toRecord(1024, "invented pairs", labels,
                List.of(new CalibrationRecord.SaturatedLine(512.25, 456.5, "g")));
        Path file = dir.resolve("calibration.json");
        CalibrationFiles.write(file, record);
        CalibrationRecord back = CalibrationFiles.readRecord(file);
        assertEquals(record, back);
        assertEquals(fitted.usedCount(), back.linesUsed());
        assertEquals(fitted.polynomial(), back.polynomial());
        // The engine's solution of the record gives the fitted solution's wavelengths exactly.
        DispersionSolution again = DispersionSolution.of(back.polynomial());
        for (double p = 0; p < 1024; p += 37.5) {
            assertEquals(fitted.wavelengthAt(p), again.wavelengthAt(p));
            assertEquals(fitted.wavelengthSigmaAt(p), again.wavelengthSigmaAt(p));
        }
        // Beyond the fitted pairs (10 to 1000) the stated uncertainty is bounded by the kept
        // higher-degree polynomial, which the file carries; without it, only the covariance counts.
        DispersionPolynomial kept = back.polynomial();
        assertEquals(3, kept.higherDegreeCoefficients().length - 1);
        DispersionSolution covarianceOnly = DispersionSolution.of(new DispersionPolynomial(kept.medium(),
                kept.centrePixel(), kept.halfRange(), kept.coefficients(), kept.covariance(), kept.lowestPixel(),
                kept.highestPixel()));
        assertTrue(again.wavelengthSigmaAt(1023) > covarianceOnly.wavelengthSigmaAt(1023));
        assertEquals(covarianceOnly.wavelengthSigmaAt(500), again.wavelengthSigmaAt(500));
        // The solution-based writer is the record writer.
        assertEquals(CalibrationFiles.toJson(fitted, 1024, "invented pairs", labels),
                CalibrationFiles.toJson(fitted.toRecord(1024, "invented pairs", labels, List.of())));
        // a detector shorter than the fitted range was written and read back without a word
        IllegalArgumentException short100 = assertThrows(
                IllegalArgumentException.class, () -> CalibrationFiles.write(dir.resolve("short.json"), fitted, 100,
                        "invented pairs", labels));
        assertTrue(short100.getMessage().startsWith("a detector of 100 pixels (0 to 99) cannot hold"),
                short100.getMessage());
        assertTrue(!java.nio.file.Files.exists(dir.resolve("short.json")));
    }

    @Test
    void storedCoefficientsAloneReadAsARecordWithoutFit() {
        String text = "{\"format\":\"ritzwerk-calibration\",\"version\":1,\"medium\":\"air\",\"pixels\":100,"
                + "\"valid_pixels\":[0,99],\"centre_pixel\":49.5,\"half_range\":49.5,\"coefficients_nm\":[500,5]}";
        CalibrationRecord record = CalibrationFiles.parseRecord("stored.json", text);
        assertEquals(CalibrationRecord.of("", 100, new DispersionPolynomial(Medium.air(), 49.5, 49.5,
                new double[] {500, 5}, null, 0, 99)), record);
        assertEquals(0, record.linesUsed());
        assertTrue(Double.isNaN(record.rmsNm()));
    }

    @Test
    void aBadRecordOfHowItWasMadeIsNamed() {
        String head = "{\"format\":\"ritzwerk-calibration\",\"version\":1,\"medium\":\"air\",\"pixels\":100,"
                + "\"valid_pixels\":[0,99],\"centre_pixel\":49.5,\"half_range\":49.5,\"coefficients_nm\":[500,5],";
        DataFileException used = assertThrows(DataFileException.class, () -> CalibrationFiles.parseRecord("c.json",
                head + "\"lines\":[{\"pixel\":3,\"wavelength_nm\":480,\"sigma_nm\":null,\"residual_nm\":0,"
                        + "\"residual_pixels\":0,\"used\":\"yes\",\"line\":\"Ne I\"}]}"));
        assertTrue(used.getMessage().contains("c.json") && used.getMessage().contains("\"lines\"[0]: \"used\" must be"
                + " true or false, got \"yes\""), used.getMessage());
        DataFileException rms = assertThrows(DataFileException.class, () -> CalibrationFiles.parseRecord("c.json",
                head + "\"rms_nm\":\"small\"}"));
        assertTrue(rms.getMessage().contains("\"rms_nm\" must be a finite number or null"), rms.getMessage());
        DataFileException sigma = assertThrows(DataFileException.class, () -> CalibrationFiles.parseRecord("c.json",
                head + "\"lines\":[{\"pixel\":3,\"wavelength_nm\":480,\"sigma_nm\":-1,\"residual_nm\":0,"
                        + "\"residual_pixels\":0,\"used\":true,\"line\":\"Ne I\"}]}"));
        assertTrue(sigma.getMessage().contains("\"lines\"[0]: sigma_nm of line 'Ne I' must be finite and >= 0"),
                sigma.getMessage());
    }

    @Test
    void aBadHigherDegreePolynomialIsNamed() {
        String head = "{\"format\":\"ritzwerk-calibration\",\"version\":1,\"medium\":\"air\",\"pixels\":100,"
                + "\"valid_pixels\":[0,99],\"centre_pixel\":49.5,\"half_range\":49.5,\"coefficients_nm\":[500,5],"
                + "\"covariance_nm2\":[[1e-6,0],[0,1e-6]],";
        String[][] cases = {
            {"\"higher_degree_coefficients_nm\":[500,5,0.01]}",
                "\"higher_degree_covariance_nm2\" must be given with \"higher_degree_coefficients_nm\""},
            {"\"higher_degree_covariance_nm2\":[[1]]}",
                "\"higher_degree_coefficients_nm\" must be a non-empty array of numbers"},
            {"\"higher_degree_coefficients_nm\":[500,5,0.01],\"higher_degree_covariance_nm2\":[[1,0],[0,1]]}",
                "\"higher_degree_covariance_nm2\" must be a 3 x 3 array"},
            {"\"higher_degree_coefficients_nm\":[500,5],\"higher_degree_covariance_nm2\":[[1,0],[0,1]]}",
                "the higher degree's polynomial needs more coefficients than the polynomial's 2, got 2"},
            {"\"higher_degree_coefficients_nm\":[500,5,0.01],"
                + "\"higher_degree_covariance_nm2\":[[1,0,0],[0,-1,0],[0,0,1]]}",
                "higher-degree covariance entry (1, 1) is a variance and must not be negative"},
        };
        for (String[] c : cases) {
            DataFileException e = assertThrows(DataFileException.class,
                    () -> CalibrationFiles.parseRecord("c.json", head + c[0]));
            assertTrue(e.getMessage().contains("c.json") && e.getMessage().contains(c[1]), e.getMessage());
        }
    }
}
