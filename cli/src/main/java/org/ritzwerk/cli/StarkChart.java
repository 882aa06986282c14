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
 * The PNG of a Stark map: every eigenvalue in the window as a grey dot against the field, and the
 * eigenstates holding at least a tenth of the reference state drawn over them in blue, so the
 * reference level can be followed through its avoided crossings. Drawn headless, like
 * {@link Plots}.
 */
final class StarkChart {

    private StarkChart() {
    }

    /**
     * @param batch     the batch the PNG joins
     * @param file      the PNG
     * @param title     chart title
     * @param fields    field of each point, V/cm
     * @param energies  energy of each point, GHz
     * @param shares    the reference's share in each point's eigenstate, 0 to 1
     * @throws IOException when the temporary file cannot be written
     */
    static void draw(OutputFiles.Batch batch, Path file, String title, double[] fields, double[] energies,
            double[] shares) throws IOException {
        System.setProperty("java.awt.headless", "true");
        javax.imageio.ImageIO.setUseCache(false);
        XYSeries all = new XYSeries("eigenstates", false, true);
        XYSeries reference = new XYSeries("share of the reference >= 0.1", false, true);
        for (int i = 0; i < fields.length; i++) {
            all.add(fields[i], energies[i]);
            if (shares[i] >= 0.1) {
                reference.add(fields[i], energies[i]);
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
        NumberAxis x = new NumberAxis("field (V/cm)");
        NumberAxis y = new NumberAxis("energy relative to the reference at zero field (GHz)");
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
