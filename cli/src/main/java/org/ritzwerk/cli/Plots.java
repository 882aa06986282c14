package org.ritzwerk.cli;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.chart.util.ShapeUtils;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.ritzwerk.engine.calibrate.Calibration;
import org.ritzwerk.engine.calibrate.DispersionSolution;
import org.ritzwerk.engine.calibrate.LampMatch;
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
     * @param log    a logarithmic y axis (values at or below its floor, a millionth of the top or the
     *               smallest positive value, are drawn on the floor)
     * @throws IOException when the file cannot be written
     */
    static void lineChart(OutputFiles.Batch batch, Path file, String title, String xTitle, String yTitle, double[] x, double[] y,
            List<Label> labels, boolean log) throws IOException {
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
        double floor = log ? logFloor(y, yMax) : 0;
        if (log) {
            for (int k = 0; k < series.getItemCount(); k++) {
                series.updateByIndex(k, Math.max(floor, series.getY(k).doubleValue()));
            }
        }
        org.jfree.chart.axis.ValueAxis yAxis = new NumberAxis(yTitle);
        if (log) {
            LogAxis decades = new LogAxis(yTitle + " (log scale)");
            decades.setTickUnit(new org.jfree.chart.axis.NumberTickUnit(1));   // one tick per decade
            yAxis = decades;
        }
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(true, false);
        renderer.setSeriesPaint(0, new Color(0x1f, 0x4e, 0x79));
        renderer.setSeriesStroke(0, new BasicStroke(1.0f));
        XYPlot plot = new XYPlot(new XYSeriesCollection(series), xAxis, yAxis, renderer);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        plot.setRangeGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        Font font = new Font(Font.SANS_SERIF, Font.PLAIN, 11);
        double upper = log ? logAxisTop(x, y, yMax, floor, labels, font) : axisTop(x, y, yMax, labels, font);
        for (Label label : labels) {
            int i = nearest(x, label.x());
            double base = log ? Math.max(floor, y[i]) * LOG_LABEL_LIFT : y[i] + 0.03 * yMax;
            XYTextAnnotation text = new XYTextAnnotation(label.text(), label.x(), base);
            text.setFont(font);
            text.setRotationAngle(-Math.PI / 2);
            text.setTextAnchor(TextAnchor.CENTER_LEFT);
            text.setRotationAnchor(TextAnchor.CENTER_LEFT);
            plot.addAnnotation(text);
        }
        if (log) {
            yAxis.setRange(floor, upper);
        } else {
            yAxis.setUpperBound(upper);
        }
        JFreeChart chart = new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, false);
        chart.setBackgroundPaint(Color.WHITE);
        batch.bytes(file, out -> ChartUtils.writeChartAsPNG(out, chart, 1400, CHART_PIXELS));
    }

    /**
     * The residuals of a calibration against pixel, in pm, with their standard uncertainties as
     * error bars: the fitted pairs as dots, pairs the fit rejected as crosses, saturated pairs
     * (paired but left out of the fit) as open squares, each class in the legend only when it has
     * members. The scale is set by the fitted pairs (1.3 times their largest residual plus
     * uncertainty, a blend's residual alone, at least 3 RMS); a point beyond it is drawn on the edge as a triangle pointing
     * out, with its error bar cut, so one wild pair cannot flatten the others.
     *
     * @param batch       the batch the PNG joins
     * @param file        the PNG to write
     * @param title       chart title
     * @param calibration the calibration
     * @throws IOException when the temporary file cannot be written
     */
    static void calibrationResiduals(OutputFiles.Batch batch, Path file, String title, Calibration calibration)
            throws IOException {
        JFreeChart chart = residualChart(title, calibration);
        batch.bytes(file, out -> ChartUtils.writeChartAsPNG(out, chart, 1200, 600));
    }

    /**
     * @param title       chart title
     * @param calibration the calibration
     * @return the chart {@link #calibrationResiduals} draws
     */
    static JFreeChart residualChart(String title, Calibration calibration) {
        headless();
        DispersionSolution solution = calibration.solution();
        LampMatch saturated = calibration.saturatedPairs();
        double limit = 3 * solution.rmsNm() * 1e3;
        for (int i = 0; i < solution.size(); i++) {
            if (!solution.isRejected(i)) {
                // a pair taken for an unresolved blend carries a wide error bar by design: its residual
                // counts, its bar does not set the scale (it is cut at the edge instead)
                boolean blend = org.ritzwerk.data.CalibrationRecord.FittedLine.BLEND.equals(solution.pairFlag(i));
                limit = Math.max(limit, 1.3 * (Math.abs(solution.residualNm(i)) + (blend ? 0 : solution.sigmaNm(i)))
                        * 1e3);
            }
        }
        limit = limit > 0 && Double.isFinite(limit) ? limit : 1;
        Classes classes = new Classes(limit);
        for (int i = 0; i < solution.size(); i++) {
            classes.add(solution.isRejected(i) ? "rejected" : "fitted", solution.pixel(i),
                    solution.residualNm(i) * 1e3, solution.sigmaNm(i) * 1e3);
        }
        for (int i = 0; i < saturated.size(); i++) {
            double p = saturated.pixel(i);
            classes.add("saturated (not fitted)", p, calibration.saturatedResidualNm(i) * 1e3,
                    saturated.pixelSigma(i) * Math.abs(solution.dispersionAt(p)) * 1e3);
        }
        NumberAxis xAxis = new NumberAxis("pixel");
        xAxis.setAutoRangeIncludesZero(false);
        NumberAxis yAxis = new NumberAxis("residual (pm, " + solution.medium().label() + ")");
        yAxis.setRange(-limit, limit);
        XYErrorRenderer renderer = new XYErrorRenderer();
        renderer.setDrawXError(false);
        renderer.setDefaultShapesVisible(true);
        renderer.setDefaultLinesVisible(false);
        YIntervalSeriesCollection data = classes.series(renderer);
        XYPlot plot = new XYPlot(data, xAxis, yAxis, renderer);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        plot.setRangeGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        plot.addRangeMarker(new ValueMarker(0, Color.GRAY, new BasicStroke(1.0f)));
        String shownTitle = classes.beyond == 0 ? title : title + String.format(Locale.ROOT,
                " (%d beyond +-%.3g pm, drawn on the edge)", classes.beyond, limit);
        JFreeChart chart = new JFreeChart(shownTitle, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
        chart.setBackgroundPaint(Color.WHITE);
        return chart;
    }

    /**
     * A series' quantum defects against n, staged as a PNG ({@link #defectChart}).
     *
     * @param batch the batch the PNG joins
     * @param file  the PNG to write
     * @param chart the chart
     * @throws IOException when the temporary file cannot be written
     */
    static void writeChart(OutputFiles.Batch batch, Path file, JFreeChart chart) throws IOException {
        batch.bytes(file, out -> ChartUtils.writeChartAsPNG(out, chart, 1200, 700));
    }

    /**
     * A series' quantum defects against n: each member's measured defect with its standard
     * uncertainty as an error bar (dots), flagged members apart (crosses), and the fitted delta(n) as
     * a line. The y axis spans the unflagged members' bars and the curve ({@link #defectAxisRange});
     * a flagged member beyond it is drawn on the edge as a triangle, and the title says how many.
     *
     * @param title      chart title
     * @param n          the members' n
     * @param delta      their measured quantum defects
     * @param u          their standard uncertainties (0 draws no bar)
     * @param flagged    which members the fit flags (outliers)
     * @param curveN     n of the fitted curve's points, ascending
     * @param curveDelta the fitted delta(n) there
     * @return the chart
     */
    static JFreeChart defectChart(String title, double[] n, double[] delta, double[] u, boolean[] flagged,
            double[] curveN, double[] curveDelta) {
        headless();
        double[] range = defectAxisRange(delta, u, flagged, curveDelta);
        YIntervalSeries members = new YIntervalSeries("measured defect +- u");
        YIntervalSeries outliers = new YIntervalSeries("flagged member (|residual/u| > 3)");
        YIntervalSeries beyond = new YIntervalSeries("flagged, beyond the scale (on the edge)");
        int outside = 0;
        for (int i = 0; i < n.length; i++) {
            double s = Double.isFinite(u[i]) ? u[i] : 0;
            if (!flagged[i]) {
                members.add(n[i], delta[i], delta[i] - s, delta[i] + s);
            } else if (delta[i] >= range[0] && delta[i] <= range[1]) {
                outliers.add(n[i], delta[i], delta[i] - s, delta[i] + s);
            } else {
                double edge = delta[i] < range[0] ? range[0] : range[1];
                beyond.add(n[i], edge, edge, edge);
                outside++;
            }
        }
        YIntervalSeriesCollection points = new YIntervalSeriesCollection();
        XYErrorRenderer renderer = new XYErrorRenderer();
        renderer.setDrawXError(false);
        renderer.setDefaultShapesVisible(true);
        renderer.setDefaultLinesVisible(false);
        Color[] colours = {new Color(0x1f, 0x4e, 0x79), new Color(0xb0, 0x3a, 0x2e), new Color(0xb0, 0x3a, 0x2e)};
        java.awt.Shape[] shapes = {new java.awt.geom.Ellipse2D.Double(-3, -3, 6, 6),
            ShapeUtils.createDiagonalCross(4, 0.6f), ShapeUtils.createUpTriangle(5)};
        YIntervalSeries[] all = {members, outliers, beyond};
        for (int k = 0; k < all.length; k++) {
            if (all[k].getItemCount() == 0) {
                continue;
            }
            int index = points.getSeriesCount();
            points.addSeries(all[k]);
            renderer.setSeriesPaint(index, colours[k]);
            renderer.setSeriesShape(index, shapes[k]);
        }
        XYSeries fitted = new XYSeries("fitted delta(n)", false, true);
        for (int k = 0; k < curveN.length; k++) {
            fitted.add(curveN[k], curveDelta[k]);
        }
        NumberAxis xAxis = new NumberAxis("n");
        xAxis.setAutoRangeIncludesZero(false);
        xAxis.setStandardTickUnits(NumberAxis.createIntegerTickUnits());
        NumberAxis yAxis = new NumberAxis("quantum defect n - n*");
        yAxis.setAutoRangeIncludesZero(false);
        yAxis.setRange(range[0], range[1]);
        // plain decimals with a digit below a tenth of the span (the default turns to 3.26945E0)
        int decimals = Math.max(2, (int) Math.ceil(-Math.log10((range[1] - range[0]) / 10)) + 1);
        yAxis.setNumberFormatOverride(new java.text.DecimalFormat("0." + "0".repeat(decimals),
                java.text.DecimalFormatSymbols.getInstance(Locale.ROOT)));
        XYPlot plot = new XYPlot(points, xAxis, yAxis, renderer);
        XYLineAndShapeRenderer line = new XYLineAndShapeRenderer(true, false);
        line.setSeriesPaint(0, new Color(0x4d, 0x4d, 0x4d));
        line.setSeriesStroke(0, new BasicStroke(1.2f));
        plot.setDataset(1, new XYSeriesCollection(fitted));
        plot.setRenderer(1, line);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        plot.setRangeGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        String shownTitle = outside == 0 ? title : title + String.format(Locale.ROOT,
                " (%d flagged beyond the scale, drawn on the edge)", outside);
        JFreeChart chart = new JFreeChart(shownTitle, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
        chart.setBackgroundPaint(Color.WHITE);
        return chart;
    }

    /** The least span of the defect axis: 1e-6, below the digits a quantum defect is published with. */
    static final double LEAST_DEFECT_SPAN = 1e-6;

    /**
     * The y range of the defect chart: from the lowest to the highest of the unflagged members'
     * error bars (every member's where all are flagged) and the fitted curve, widened by 8 % of that
     * span on each side and to at least {@link #LEAST_DEFECT_SPAN}, about the middle. Non-finite
     * values are ignored.
     *
     * @param delta   measured defects
     * @param u       their uncertainties
     * @param flagged which members are flagged
     * @param curve   the fitted curve's values
     * @return {lower, upper}
     */
    static double[] defectAxisRange(double[] delta, double[] u, boolean[] flagged, double[] curve) {
        boolean anyClean = false;
        for (int i = 0; i < delta.length; i++) {
            anyClean |= !flagged[i] && Double.isFinite(delta[i]);
        }
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < delta.length; i++) {
            if ((anyClean && flagged[i]) || !Double.isFinite(delta[i])) {
                continue;
            }
            double s = Double.isFinite(u[i]) ? Math.abs(u[i]) : 0;
            lo = Math.min(lo, delta[i] - s);
            hi = Math.max(hi, delta[i] + s);
        }
        for (double c : curve) {
            if (Double.isFinite(c)) {
                lo = Math.min(lo, c);
                hi = Math.max(hi, c);
            }
        }
        if (!(lo <= hi)) {
            return new double[] {0, 1};
        }
        double margin = 0.08 * (hi - lo);
        lo -= margin;
        hi += margin;
        if (hi - lo < LEAST_DEFECT_SPAN) {
            double middle = (lo + hi) / 2;
            lo = middle - LEAST_DEFECT_SPAN / 2;
            hi = middle + LEAST_DEFECT_SPAN / 2;
        }
        return new double[] {lo, hi};
    }

    /** The residual chart's points sorted into classes, and the ones beyond the scale into their own. */
    private static final class Classes {
        private static final String[] NAMES = {"fitted", "rejected", "saturated (not fitted)"};
        private static final Color[] COLOURS = {new Color(0x1f, 0x4e, 0x79), new Color(0xb0, 0x3a, 0x2e),
            new Color(0x8a, 0x6d, 0x1a)};
        private final double limit;
        private final java.util.Map<String, YIntervalSeries> inside = new java.util.LinkedHashMap<>();
        private final java.util.Map<String, YIntervalSeries> outside = new java.util.LinkedHashMap<>();
        private int beyond;

        Classes(double limit) {
            this.limit = limit;
        }

        void add(String name, double x, double y, double sigma) {
            double s = Double.isFinite(sigma) ? sigma : 0;
            if (Math.abs(y) <= limit) {
                inside.computeIfAbsent(name, YIntervalSeries::new).add(x, y, y - s, y + s);
                return;
            }
            beyond++;
            double edge = Math.copySign(limit, y);
            outside.computeIfAbsent(name, key -> new YIntervalSeries(key + ", beyond the scale")).add(x, edge, edge, edge);
        }

        /** @return the non-empty series, each given its class's colour and shape on the renderer */
        YIntervalSeriesCollection series(XYErrorRenderer renderer) {
            YIntervalSeriesCollection data = new YIntervalSeriesCollection();
            for (int k = 0; k < NAMES.length; k++) {
                for (boolean in : new boolean[] {true, false}) {
                    YIntervalSeries series = (in ? inside : outside).get(NAMES[k]);
                    if (series == null) {
                        continue;
                    }
                    int index = data.getSeriesCount();
                    data.addSeries(series);
                    renderer.setSeriesPaint(index, COLOURS[k]);
                    renderer.setSeriesShape(index, !in ? ShapeUtils.createUpTriangle(5)
                            : k == 0 ? new java.awt.geom.Ellipse2D.Double(-3, -3, 6, 6)
                            : k == 1 ? ShapeUtils.createDiagonalCross(4, 0.6f)
                            : new java.awt.geom.Rectangle2D.Double(-3.5, -3.5, 7, 7));
                    renderer.setSeriesShapesFilled(index, in && k != 2);
                }
            }
            return data;
        }
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

    /** How far above its line a label starts on a logarithmic axis, as a factor. */
    private static final double LOG_LABEL_LIFT = 1.5;

    /** @return the lowest value a logarithmic axis shows: the smallest positive value, at least a millionth of the top */
    static double logFloor(double[] y, double yMax) {
        double top = yMax > 0 ? yMax : 1;
        double smallest = top;
        for (double v : y) {
            if (v > 0 && v < smallest) {
                smallest = v;
            }
        }
        return Math.max(smallest, top * 1e-6) * 0.8;
    }

    /**
     * As {@link #axisTop} on a logarithmic axis: every label, standing from LOG_LABEL_LIFT above
     * its line, ends inside the data area, which reaches at least a decade above the highest value.
     */
    static double logAxisTop(double[] x, double[] y, double yMax, double floor, List<Label> labels, Font font) {
        java.awt.FontMetrics metrics = new java.awt.image.BufferedImage(1, 1, java.awt.image.BufferedImage.TYPE_INT_RGB)
                .createGraphics().getFontMetrics(font);
        double top = Math.log10(Math.max(yMax, floor) * 10);
        double bottom = Math.log10(floor);
        for (Label label : labels) {
            double base = Math.log10(Math.max(floor, y[nearest(x, label.x())]) * LOG_LABEL_LIFT);
            double share = Math.min((metrics.stringWidth(label.text()) + 8.0) / PLOT_PIXELS, 0.8);
            // base + share (top - bottom) <= top
            top = Math.max(top, (base - share * bottom) / (1 - share));
        }
        return Math.pow(10, top);
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
