package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Font;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.jfree.chart.plot.XYPlot;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.CalibrationProblem;
import org.ritzwerk.engine.calibrate.Calibrator;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.SpectrumFiles;

/**
 * The line chart leaves room above its tallest line for that line's upright label, on a linear
 * and a logarithmic axis; the residual chart shows only the classes that have members and keeps
 * its scale to the fitted pairs, a wild pair drawn on the edge.
 */
class PlotsTest {

    private static final Font FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 11);

    @Test
    void aLongLabelOnTheTallestLineFitsUnderTheTopOfTheAxis() {
        System.setProperty("java.awt.headless", "true");
        double[] x = {1, 2, 3};
        double[] y = {0, 100, 0};
        String text = "D I Balmer alpha / H I Balmer alpha";
        double top = Plots.axisTop(x, y, 100, List.of(new Plots.Label(2, text)), FONT);
        int width = new java.awt.image.BufferedImage(1, 1, java.awt.image.BufferedImage.TYPE_INT_RGB)
                .createGraphics().getFontMetrics(FONT).stringWidth(text);
        // The label runs from 103 upward over `width` pixels of a data area at least 580 px high.
        assertTrue(top - 103 >= width / 580.0 * top, "top " + top + " for a " + width + " px label");
        // Without labels the axis keeps its usual 35 % head room.
        assertEquals(135, Plots.axisTop(x, y, 100, List.of(), FONT), 1e-9);
    }

    @Test
    void onALogarithmicAxisLabelsFitAndEmptyPixelsSitOnTheFloor() {
        System.setProperty("java.awt.headless", "true");
        double[] x = {1, 2, 3, 4};
        double[] y = {0, 1e4, 3, 0.5};
        double floor = Plots.logFloor(y, 1e4);
        assertEquals(0.4, floor, 1e-12, "the smallest positive value, less a fifth");
        assertEquals(1e4 * 1e-6 * 0.8, Plots.logFloor(new double[] {1e-9, 1e4}, 1e4), 1e-18, "at least 1e-6 of the top");
        String text = "H I Balmer alpha";
        double top = Plots.logAxisTop(x, y, 1e4, floor, List.of(new Plots.Label(2, text)), FONT);
        int width = new java.awt.image.BufferedImage(1, 1, java.awt.image.BufferedImage.TYPE_INT_RGB)
                .createGraphics().getFontMetrics(FONT).stringWidth(text);
        double decades = Math.log10(top / floor);
        // The label starts at 1.5e4 and runs up `width` pixels of a data area at least 580 px high.
        assertTrue(Math.log10(top) - Math.log10(1.5e4) >= width / 580.0 * decades, "top " + top);
        assertEquals(1e5, Plots.logAxisTop(x, y, 1e4, floor, List.of(), FONT), 1e-6, "a decade of head room");
    }

    @Test
    void theResidualChartShowsOnlyClassesWithMembersAndKeepsItsScale(@TempDir Path dir) throws IOException {
        // A neon lamp through the polynomial 540 + 0.06 p - 2e-6 p^2 (invented), its brightest
        // lines saturated at half the peak counts.
        Path spectrum = dir.resolve("neon.csv");
        CliTest.Run synth = CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "540,0.06,-2e-6", "--pixels",
                "2048", "--medium", "air", "--temperature", "400", "--resolving-power", "4000", "--read-noise", "4",
                "--seed", "3", "--out", spectrum.toString());
        assertEquals(0, synth.code(), synth.err());
        double[] counts = SpectrumFiles.read(spectrum).counts();
        double top = java.util.Arrays.stream(counts).max().orElseThrow();
        for (int p = 0; p < counts.length; p++) {
            counts[p] = Math.min(counts[p], 0.5 * top);
        }
        DataContext data = DataContext.builtIn();
        LampSet neon = LampSet.of(List.of(data.lampLines(Species.parse("Ne I"))), Medium.air());
        Calibration calibration = Calibrator.defaults().withSaturationLevel(0.5 * top)
                .calibrate(CalibrationProblem.builder(counts).lamp(neon).build());
        assertTrue(calibration.saturatedPairs().size() > 0, "some pairs saturated");
        XYPlot plot = Plots.residualChart("t", calibration).getXYPlot();
        List<String> keys = new ArrayList<>();
        for (int k = 0; k < plot.getDataset().getSeriesCount(); k++) {
            keys.add(plot.getDataset().getSeriesKey(k).toString());
        }
        assertEquals("fitted", keys.get(0));
        assertTrue(keys.contains("saturated (not fitted)") || keys.contains("saturated (not fitted), beyond the scale"),
                keys.toString());
        boolean anyRejected = false;
        for (int i = 0; i < calibration.solution().size(); i++) {
            anyRejected |= calibration.solution().isRejected(i);
        }
        assertEquals(anyRejected, keys.stream().anyMatch(key -> key.startsWith("rejected")), keys.toString());
        // The scale is the fitted pairs': every fitted point inside it, and points beyond it on the edge.
        double limit = plot.getRangeAxis().getUpperBound();
        assertEquals(-limit, plot.getRangeAxis().getLowerBound(), 0);
        for (int k = 0; k < keys.size(); k++) {
            for (int i = 0; i < plot.getDataset().getItemCount(k); i++) {
                double y = plot.getDataset().getYValue(k, i);
                assertTrue(keys.get(k).endsWith("beyond the scale") ? Math.abs(y) == limit : Math.abs(y) <= limit,
                        keys.get(k) + ": " + y + " against " + limit);
            }
        }
    }

    /**
     * The README's neon lamp has one pair taken for a blend (877.17 nm, its centroid uncertainty
     * widened to about 1.2 pixels by design): the residual chart's scale follows the other pairs
     * and that pair's residual, not its wide bar.
     */
    @Test
    void aBlendsWideErrorBarDoesNotSetTheScale(@TempDir Path dir) throws IOException {
        Path spectrum = dir.resolve("neon-lamp.csv");
        assertEquals(0, CliTest.run("synth", "--lines", "lamp-ne-i", "--dispersion", "350,0.14,-1.5e-6", "--pixels",
                "4096", "--medium", "air", "--temperature", "300", "--resolving-power", "2000", "--read-noise", "5",
                "--seed", "21", "--out", spectrum.toString()).code());
        DataContext data = DataContext.builtIn();
        LampSet neon = LampSet.of(List.of(data.lampLines(Species.parse("Ne I"))), Medium.air());
        Calibration c = Calibrator.defaults().calibrate(CalibrationProblem.builder(SpectrumFiles.read(spectrum)
                .counts()).lamp(neon).build());
        var s = c.solution();
        double widestBlend = 0;
        double scale = 3 * s.rmsNm() * 1e3;
        for (int i = 0; i < s.size(); i++) {
            boolean blend = "blend".equals(s.pairFlag(i));
            if (blend) {
                widestBlend = Math.max(widestBlend, s.sigmaNm(i) * 1e3);
            }
            if (!s.isRejected(i)) {
                scale = Math.max(scale, 1.3 * (Math.abs(s.residualNm(i)) + (blend ? 0 : s.sigmaNm(i))) * 1e3);
            }
        }
        assertTrue(widestBlend > 0, "the example has a blend");
        XYPlot plot = (XYPlot) Plots.residualChart("t", c).getPlot();
        assertEquals(scale, plot.getRangeAxis().getUpperBound(), 1e-9 * scale);
        assertTrue(plot.getRangeAxis().getUpperBound() < widestBlend, "the blend's bar reaches beyond the scale");
    }
    /**
     * The defect chart's axis spans the data, not 0 to the largest defect: defects 3.131-3.136 with
     * bars of 1e-4 (numbers invented, only the range rule is checked) give the span of the bars plus 8 %
     * each side; a flagged member far off does not widen it (it is drawn on the edge); a flat series
     * with tiny bars still gets the least span.
     */
    @Test
    void theDefectAxisSpansTheDataNotZero() {
        double[] delta = {3.131, 3.132, 3.1335, 3.136};
        double[] u = {1e-4, 1e-4, 1e-4, 1e-4};
        boolean[] none = new boolean[4];
        double[] curve = {3.1311, 3.1359};
        double[] range = Plots.defectAxisRange(delta, u, none, curve);
        double span = 3.1361 - 3.1309;
        assertEquals(3.1309 - 0.08 * span, range[0], 1e-12);
        assertEquals(3.1361 + 0.08 * span, range[1], 1e-12);
        double[] withOutlier = {3.131, 3.132, 3.5, 3.136};
        boolean[] flagged = {false, false, true, false};
        double[] same = Plots.defectAxisRange(withOutlier, u, flagged, curve);
        assertEquals(range[0], same[0], 1e-12);
        assertEquals(3.1361 + 0.08 * span, same[1], 1e-12);
        double[] flat = Plots.defectAxisRange(new double[] {2.5, 2.5}, new double[] {1e-12, 1e-12},
                new boolean[2], new double[] {2.5});
        assertEquals(Plots.LEAST_DEFECT_SPAN, flat[1] - flat[0], 1e-12);
        assertEquals(2.5, (flat[0] + flat[1]) / 2, 1e-12);

        System.setProperty("java.awt.headless", "true");
        XYPlot plot = (XYPlot) Plots.defectChart("t", new double[] {20, 22, 24, 26}, withOutlier, u, flagged,
                new double[] {20, 26}, curve).getPlot();
        assertEquals(same[0], plot.getRangeAxis().getLowerBound(), 1e-12);
        assertEquals(same[1], plot.getRangeAxis().getUpperBound(), 1e-12);
        // the members with their bars, the flagged one on the edge, and the fitted curve
        assertEquals(2, plot.getDataset(0).getSeriesCount());
        assertEquals(3, plot.getDataset(0).getItemCount(0));
        assertEquals(same[1], plot.getDataset(0).getYValue(1, 0), 1e-12);
        assertEquals(2, plot.getDataset(1).getItemCount(0));
    }
}
