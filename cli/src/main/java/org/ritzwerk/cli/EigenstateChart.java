package org.ritzwerk.cli;

import java.awt.Color;
import java.awt.geom.Ellipse2D;
import java.io.IOException;
import java.nio.file.Path;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.ritzwerk.refdata.OutputFiles;

/**
 * The PNG of eigenvalues against a parameter (a Stark map against the field, pair potentials
 * against the distance): every eigenvalue as a grey dot, and the eigenstates holding at least a
 * tenth of the reference state drawn over them in blue, so the reference level can be followed
 * through its avoided crossings. Drawn headless, like {@link Plots}.
 */
final class EigenstateChart {

    /**
     * What the axes and series are called.
     *
     * @param x             the horizontal axis, with its unit
     * @param xIncludesZero whether the horizontal axis always reaches 0
     * @param y             the vertical axis, with its unit
     * @param reference     the highlighted series' legend
     */
    record Labels(String x, boolean xIncludesZero, String y, String reference) {
    }

    /** A Stark map: field in V/cm, energy from the reference at zero field in GHz. */
    static final Labels STARK = new Labels("field (V/cm)", true,
            "energy relative to the reference at zero field (GHz)", "share of the reference >= 0.1");

    /** Pair potentials: distance in um, energy from the pair at infinite distance in GHz. */
    static final Labels PAIR = new Labels("interatomic distance (um)", false,
            "energy relative to the pair at infinite distance (GHz)", "share of the pair state >= 0.1");

    private EigenstateChart() {
    }

    /**
     * @param batch     the batch the PNG joins
     * @param file      the PNG
     * @param title     chart title
     * @param labels    the axes' and series' names
     * @param xs        each point's horizontal value, in the unit of {@code labels.x()}
     * @param energies  energy of each point, GHz
     * @param shares    the reference's share in each point's eigenstate, 0 to 1
     * @throws IOException when the temporary file cannot be written
     */
    static void draw(OutputFiles.Batch batch, Path file, String title, Labels labels, double[] xs,
            double[] energies, double[] shares) throws IOException {
        System.setProperty("java.awt.headless", "true");
        javax.imageio.ImageIO.setUseCache(false);
        XYSeries all = new XYSeries("eigenstates", false, true);
        XYSeries reference = new XYSeries(labels.reference(), false, true);
        for (int i = 0; i < xs.length; i++) {
            all.add(xs[i], energies[i]);
            if (shares[i] >= 0.1) {
                reference.add(xs[i], energies[i]);
            }
        }
        XYSeriesCollection data = new XYSeriesCollection();
        data.addSeries(all);
        data.addSeries(reference);
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(false, true);
        renderer.setSeriesShape(0, new Ellipse2D.Double(-1, -1, 2, 2));
        renderer.setSeriesPaint(0, new Color(0x99, 0x99, 0x99));
        renderer.setSeriesShape(1, new Ellipse2D.Double(-2, -2, 4, 4));
        renderer.setSeriesPaint(1, new Color(0x1f, 0x4e, 0x79));
        NumberAxis x = new NumberAxis(labels.x());
        x.setAutoRangeIncludesZero(labels.xIncludesZero());
        NumberAxis y = new NumberAxis(labels.y());
        y.setAutoRangeIncludesZero(false);
        XYPlot plot = new XYPlot(data, x, y, renderer);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        plot.setRangeGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        JFreeChart chart = new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
        chart.setBackgroundPaint(Color.WHITE);
        batch.bytes(file, out -> ChartUtils.writeChartAsPNG(out, chart, 1200, 800));
    }
}
