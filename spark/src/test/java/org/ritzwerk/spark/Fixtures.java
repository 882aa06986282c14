package org.ritzwerk.spark;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.refdata.DataContext;

/**
 * Invented survey data for the tests and the benchmark, made from the engine's own lines with
 * seeded generators: peak lists, lamp exposures, scene parameters.
 */
final class Fixtures {

    private Fixtures() {
    }

    /** One peak list: vacuum nm, standard uncertainties (nm), photon counts, FWHMs (nm). */
    record PeakListData(String id, double[] nm, double[] sigma, double[] photons, double[] width) {
        Row row() {
            return RowFactory.create(id, nm, sigma, photons, width);
        }
    }

    /**
     * Peak lists drawn from the multiplets of one-electron ions (QED model, upper n up to 30) between 370
     * and 700 nm in vacuum: per list a random subset of {@code lines} lines moved by a random
     * velocity within +-50 km/s and jittered by their uncertainty (2e-4 nm), plus
     * {@code spurious} peaks at random places; photon counts from a Boltzmann population (g A exp(-E_upper / kT), T from 8000 to 20000 K), the spurious ones dim; a width on every peak.
     */
    static List<PeakListData> peakLists(List<String> species, int count, int lines, int spurious, long seed) {
        DataContext data = DataContext.builtIn();
        Candidates.Builder builder = Candidates.inWindow(370e-9, 700e-9);
        for (String text : species) {
            Species s = Species.parse(text);
            builder.hydrogenLike(s, HydrogenLikeModel.of(data.nucleus(s), Tier.QED), 30, false);
        }
        Candidates candidates = builder.build();
        LineCatalog catalog = candidates.catalog();
        SplittableRandom random = new SplittableRandom(seed);
        List<PeakListData> lists = new ArrayList<>(count);
        int take = Math.min(lines, catalog.size());
        for (int s = 0; s < count; s++) {
            double z = random.nextDouble(-50e3, 50e3) / PhysicalConstants.C;
            double temperature = random.nextDouble(8000, 20000);
            int[] chosen = random.ints(0, catalog.size()).distinct().limit(take).sorted().toArray();
            int n = take + spurious;
            double[] nm = new double[n];
            double[] sigma = new double[n];
            double[] photons = new double[n];
            double[] width = new double[n];
            for (int k = 0; k < n; k++) {
                nm[k] = k < take ? catalog.wavelength(chosen[k]) * (1 + z) * 1e9 + 2e-4 * random.nextGaussian()
                        : random.nextDouble(375, 695);
                sigma[k] = 2e-4;
                photons[k] = k < take ? boltzmann(candidates.multiplet(catalog, chosen[k]), temperature)
                        : random.nextDouble(1, 10);
                width[k] = random.nextDouble(0.05, 0.3);
            }
            // By wavelength, every column alike.
            Integer[] order = new Integer[n];
            for (int k = 0; k < n; k++) {
                order[k] = k;
            }
            Arrays.sort(order, (a, b) -> Double.compare(nm[a], nm[b]));
            lists.add(new PeakListData("spectrum-" + s, pick(nm, order), pick(sigma, order), pick(photons, order),
                    pick(width, order)));
        }
        return lists;
    }

    private static double[] pick(double[] values, Integer[] order) {
        double[] picked = new double[values.length];
        for (int k = 0; k < order.length; k++) {
            picked[k] = values[order[k]];
        }
        return picked;
    }

    /** Photon counts of a multiplet at an excitation temperature: g A exp(-E / kT), scaled. */
    private static double boltzmann(Candidates.Multiplet m, double kelvin) {
        return 1e-4 * m.weight() * m.einsteinA()
                * Math.exp(-(m.upperEnergy() - 10.2 * 1.602176634e-19) / (PhysicalConstants.K * kelvin));
    }

    static Dataset<Row> peakListTable(SparkSession spark, List<PeakListData> lists, int partitions) {
        List<Row> rows = new ArrayList<>(lists.size());
        for (PeakListData list : lists) {
            rows.add(list.row());
        }
        return spark.createDataFrame(rows, Schemas.PEAK_LISTS).repartition(partitions);
    }

    /** The detector of refdata's calibration guide: 2048 pixels, 580 + 0.035 p - 1e-6 p^2 nm (air). */
    static final int PIXELS = 2048;

    /**
     * A neon exposure of that detector: the built-in lamp set's lines with their table
     * intensities over 50 counts of background, an 0.08 nm instrument, Poisson and 3-count read
     * noise from the seed; the dispersion's linear term scaled by {@code stretch}.
     */
    static double[] neonExposure(LineList neon, double stretch, long seed) {
        PixelGrid detector = PixelGrid.dispersion(new double[] {580, 0.035 * stretch, -1e-6}, PIXELS);
        double[] nm = new double[neon.size()];
        double[] flux = new double[neon.size()];
        for (int i = 0; i < neon.size(); i++) {
            nm[i] = neon.position(i);
            flux[i] = 2 * neon.intensity(i).orElse(1);
        }
        double[] expected = new double[PIXELS];
        Arrays.fill(expected, 50);
        new LineRenderer(detector, Instrument.ofFwhm(0.08), 20).render(nm, flux, new double[nm.length],
                new double[nm.length], expected);
        double[] counts = new double[PIXELS];
        Noise.apply(expected, 3, seed, counts);
        return counts;
    }
}
