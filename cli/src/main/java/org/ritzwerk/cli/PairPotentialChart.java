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
 * The PNG of pair potentials: every eigenvalue as a grey dot against the distance, and the
 * eigenstates holding at least a tenth of the chosen pair state drawn over them in blue. Drawn
 * headless, like {@link Plots}.
 */
final class PairPotentialChart {

    private PairPotentialChart() {
    }

    /**
     * @param batch     the batch the PNG joins
     * @param file      the PNG
     * @param title     chart title
     * @param distances distance of each point, micrometres
     * @param energies  energy of each point relative to the pair at infinite distance, GHz
     * @param shares    the pair state's share in each point's eigenstate, 0 to 1
     * @throws IOException when the temporary file cannot be written
     */
    static void draw(OutputFiles.Batch batch, Path file, String title, double[] distances, double[] energies,
            double[] shares) throws IOException {
        System.setProperty("java.awt.headless", "true");
        javax.imageio.ImageIO.setUseCache(false);
        XYSeries all = new XYSeries("pair eigenstates", false, true);
        XYSeries pair = new XYSeries("share of the pair state >= 0.1", false, true);
        for (int i = 0; i < distances.length; i++) {
            all.add(distances[i], energies[i]);
            if (shares[i] >= 0.1) {
                pair.add(distances[i], energies[i]);
            }
        }
        XYSeriesCollection data = new XYSeriesCollection();
        data.addSeries(all);
        data.addSeries(pair);
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(false, true);
        renderer.setSeriesShape(0, new Ellipse2D.Double(-1, -1, 2, 2));
        renderer.setSeriesPaint(0, new Color(0x99, 0x99, 0x99));
        renderer.setSeriesShape(1, new Ellipse2D.Double(-2, -2, 4, 4));
        renderer.setSeriesPaint(1, new Color(0x1f, 0x4e, 0x79));
        NumberAxis x = new NumberAxis("interatomic distance (um)");
        x.setAutoRangeIncludesZero(false);
        NumberAxis y = new NumberAxis("energy relative to the pair at infinite distance (GHz)");
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
