package org.ritzwerk.cli;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.chart.util.ShapeUtils;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.ritzwerk.refdata.OutputFiles;

/** PNG charts drawn with JFreeChart, headless. */
final class Plots {

    /** A text label at a position on the x axis, drawn above the data there. */
    record Label(double x, String text) {
    }

    /** Height of the line chart in pixels, and a lower bound of its data area's height. */
    private static final int CHART_PIXELS = 700;
    private static final double PLOT_PIXELS = 580;

    private Plots() {
    }

    /**
     * A line chart of y against x, with labels, staged as a PNG (moved into place when the batch
     * commits).
     *
     * @param batch  the batch of the command's outputs
     * @param file   the PNG to write
     * @param title  chart title
     * @param xTitle x axis title with its unit
     * @param yTitle y axis title with its unit
     * @param x      x values, ascending
     * @param y      y values
     * @param labels labels to draw (at most a few dozen read well)
     * @throws IOException when the file cannot be written
     */
    static void lineChart(OutputFiles.Batch batch, Path file, String title, String xTitle, String yTitle, double[] x, double[] y,
            List<Label> labels) throws IOException {
        headless();
        XYSeries series = new XYSeries(yTitle, false, true);
        // A chart cannot show more points than it has pixels; keep each bin's extremes.
        int bins = Math.min(x.length, 4000);
        double yMax = 0;
        for (int b = 0; b < bins; b++) {
            int from = (int) ((long) x.length * b / bins);
            int to = (int) ((long) x.length * (b + 1) / bins);
            int lo = from;
            int hi = from;
            for (int i = from; i < to; i++) {
                lo = y[i] < y[lo] ? i : lo;
                hi = y[i] > y[hi] ? i : hi;
            }
            series.add(x[Math.min(lo, hi)], y[Math.min(lo, hi)]);
            if (lo != hi) {
                series.add(x[Math.max(lo, hi)], y[Math.max(lo, hi)]);
            }
            yMax = Math.max(yMax, y[hi]);
        }
        NumberAxis xAxis = new NumberAxis(xTitle);
        xAxis.setAutoRangeIncludesZero(false);
        NumberAxis yAxis = new NumberAxis(yTitle);
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(true, false);
        renderer.setSeriesPaint(0, new Color(0x1f, 0x4e, 0x79));
        renderer.setSeriesStroke(0, new BasicStroke(1.0f));
        XYPlot plot = new XYPlot(new XYSeriesCollection(series), xAxis, yAxis, renderer);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        plot.setRangeGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        Font font = new Font(Font.SANS_SERIF, Font.PLAIN, 11);
        double upper = axisTop(x, y, yMax, labels, font);
        for (Label label : labels) {
            int i = nearest(x, label.x());
            XYTextAnnotation text = new XYTextAnnotation(label.text(), label.x(), y[i] + 0.03 * yMax);
            text.setFont(font);
            text.setRotationAngle(-Math.PI / 2);
            text.setTextAnchor(TextAnchor.CENTER_LEFT);
            text.setRotationAnchor(TextAnchor.CENTER_LEFT);
            plot.addAnnotation(text);
        }
        yAxis.setUpperBound(upper);
        JFreeChart chart = new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, false);
        chart.setBackgroundPaint(Color.WHITE);
        batch.bytes(file, out -> ChartUtils.writeChartAsPNG(out, chart, 1400, CHART_PIXELS));
    }

    /**
     * A scatter chart of residuals with error bars: used points filled, rejected ones as crosses,
     * and the zero line.
     *
     * @param file     the PNG to write
     * @param title    chart title
     * @param xTitle   x axis title
     * @param yTitle   y axis title
     * @param used     points {x, y, sigma} that were used
     * @param rejected points {x, y, sigma} that were rejected
     * @throws IOException when the file cannot be written
     */
    static void residuals(Path file, String title, String xTitle, String yTitle, List<double[]> used,
            List<double[]> rejected) throws IOException {
        try (OutputFiles.Batch batch = new OutputFiles.Batch()) {
            residuals(batch, file, title, xTitle, yTitle, used, rejected);
            batch.commit();
        }
    }

    /**
     * As {@link #residuals(Path, String, String, String, List, List)}, staged in a batch that the
     * caller commits with its other outputs.
     *
     * @param batch    the batch the PNG joins
     * @param file     the PNG to write
     * @param title    chart title
     * @param xTitle   x axis title
     * @param yTitle   y axis title
     * @param used     points {x, y, sigma} that were used
     * @param rejected points {x, y, sigma} that were rejected
     * @throws IOException when the temporary file cannot be written
     */
    static void residuals(OutputFiles.Batch batch, Path file, String title, String xTitle, String yTitle,
            List<double[]> used, List<double[]> rejected) throws IOException {
        headless();
        YIntervalSeriesCollection data = new YIntervalSeriesCollection();
        YIntervalSeries usedSeries = new YIntervalSeries("used");
        for (double[] p : used) {
            double s = Double.isFinite(p[2]) ? p[2] : 0;
            usedSeries.add(p[0], p[1], p[1] - s, p[1] + s);
        }
        YIntervalSeries rejectedSeries = new YIntervalSeries("rejected");
        for (double[] p : rejected) {
            double s = Double.isFinite(p[2]) ? p[2] : 0;
            rejectedSeries.add(p[0], p[1], p[1] - s, p[1] + s);
        }
        data.addSeries(usedSeries);
        data.addSeries(rejectedSeries);
        NumberAxis xAxis = new NumberAxis(xTitle);
        xAxis.setAutoRangeIncludesZero(false);
        NumberAxis yAxis = new NumberAxis(yTitle);
        XYErrorRenderer renderer = new XYErrorRenderer();
        renderer.setDrawXError(false);
        renderer.setSeriesPaint(0, new Color(0x1f, 0x4e, 0x79));
        renderer.setSeriesPaint(1, new Color(0xb0, 0x3a, 0x2e));
        renderer.setSeriesShape(0, new java.awt.geom.Ellipse2D.Double(-3, -3, 6, 6));
        renderer.setSeriesShape(1, ShapeUtils.createDiagonalCross(4, 0.6f));
        renderer.setDefaultShapesVisible(true);
        renderer.setDefaultLinesVisible(false);
        XYPlot plot = new XYPlot(data, xAxis, yAxis, renderer);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        plot.setRangeGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        plot.addRangeMarker(new ValueMarker(0, Color.GRAY, new BasicStroke(1.0f)));
        JFreeChart chart = new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
        chart.setBackgroundPaint(Color.WHITE);
        batch.bytes(file, out -> ChartUtils.writeChartAsPNG(out, chart, 1200, 600));
    }

    /**
     * The top of the y axis so that every label, standing upright from just above its line,
     * ends inside the data area: the label's base plus its length in pixels (the data area is at
     * least PLOT_PIXELS high) scaled to data units, and at least 1.35 times the highest value.
     */
    static double axisTop(double[] x, double[] y, double yMax, List<Label> labels, Font font) {
        java.awt.FontMetrics metrics = new java.awt.image.BufferedImage(1, 1, java.awt.image.BufferedImage.TYPE_INT_RGB)
                .createGraphics().getFontMetrics(font);
        double upper = yMax * 1.35 + (yMax == 0 ? 1 : 0);
        for (Label label : labels) {
            double base = y[nearest(x, label.x())] + 0.03 * yMax;
            double share = (metrics.stringWidth(label.text()) + 8.0) / PLOT_PIXELS;
            upper = Math.max(upper, base / (1 - Math.min(share, 0.8)));
        }
        return upper;
    }

    private static int nearest(double[] x, double at) {
        int k = java.util.Arrays.binarySearch(x, at);
        if (k >= 0) {
            return k;
        }
        int i = -k - 1;
        if (i == 0) {
            return 0;
        }
        if (i == x.length) {
            return x.length - 1;
        }
        return at - x[i - 1] < x[i] - at ? i - 1 : i;
    }

    /**
     * Headless drawing, and PNGs encoded in memory: without ImageIO's file cache no background
     * thread is left to fail (with a stack trace) after a write error such as a full disk.
     */
    private static void headless() {
        System.setProperty("java.awt.headless", "true");
        javax.imageio.ImageIO.setUseCache(false);
    }
}
