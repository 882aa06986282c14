package org.ritzwerk.refdata.sweep;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.synth.Instrument;
import org.ritzwerk.engine.synth.LineRenderer;
import org.ritzwerk.engine.synth.Noise;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.DataContext;

/**
 * Seeded synthetic lamp exposures over a wide space of spectrometers, for sweeps of the
 * calibration job: detectors of 1024 to 4096 pixels, windows anywhere within the built-in lamp
 * sets' reach (about 250 to 980 nm), dispersions whose slope changes by up to {@code curvature}
 * (a fraction) from one end of the chip to the other plus a small cubic term, rising or falling
 * wavelength, lamp intensities scattered about the table's (log-normal, factor about 2), missing
 * lines, foreign lines that are in no lamp list, second-order ghosts of lines at half the
 * wavelength, and sometimes a saturation level that clips the strongest lines. Poisson and read
 * noise on a smooth baseline.
 *
 * <p>Everything here is invented for the tests; the only reference values are the built-in lamp
 * sets (their rows and sources: refdata/src/main/resources/org/ritzwerk/refdata/lamps/README.md).
 */
public final class LampExposures {

    /** Lamp gases a run draws from, in the combinations a spectrometer lab would use. */
    private static final String[][] LAMPS = {
        {"Hg I", "Ar I"}, {"Ne I", "Ar I"}, {"Hg I", "Ne I", "Ar I", "Kr I", "Xe I"}, {"Hg I", "Kr I"},
        {"Ne I"}, {"Hg I", "Ne I"}};

    private final DataContext data = DataContext.builtIn();

    /** One exposure and its truth. */
    public record Exposure(long seed, double[] counts, LampSet lamp, String lampName, double[] truth, boolean falling,
            double saturation, int linesInWindow, int foreign, int ghosts, double curvature, double[] foreignNm,
            double[] ghostNm) {

        /** @return the true wavelength (nm) at a pixel of the counts as given */
        public double truthAt(double pixel) {
            double p = falling ? counts.length - 1 - pixel : pixel;
            return LampExposures.evaluate(truth, p);
        }

        /** @return the true dispersion, nm per pixel of the counts as given (negative when falling) */
        public double truthDispersionAt(double pixel) {
            double p = falling ? counts.length - 1 - pixel : pixel;
            double d = 0;
            for (int k = truth.length - 1; k >= 1; k--) {
                d = d * p + k * truth[k];
            }
            return falling ? -d : d;
        }

        @Override
        public String toString() {
            return String.format(Locale.ROOT, "seed %d: %s, %d px, %.1f-%.1f nm%s, slope change %+.0f%%, %d lines, "
                    + "%d foreign, %d ghosts%s", seed, lampName, counts.length, evaluate(truth, 0),
                    evaluate(truth, counts.length - 1), falling ? " (falling)" : "", 100 * curvature, linesInWindow,
                    foreign, ghosts, Double.isNaN(saturation) ? "" : ", saturated above " + (long) saturation);
        }
    }

    /**
     * @param seed      the run's seed
     * @param curvature the largest relative change of the slope across the chip (0.6 = 60 %)
     * @return one exposure with at least 8 lamp lines in its window
     */
    public Exposure exposure(long seed, double curvature) {
        return exposure(seed, curvature, null, 240, 990);
    }

    /**
     * @param seed      the run's seed
     * @param curvature the largest relative change of the slope across the chip (0.6 = 60 %)
     * @param gases     the lamp's species, or null to draw a combination a lab would use
     * @param lowest    the shortest wavelength a window may start at, nm
     * @param highest   the longest wavelength a window may reach, nm
     * @return one exposure with at least 8 lamp lines in its window
     */
    public Exposure exposure(long seed, double curvature, String[] gases, double lowest, double highest) {
        SplittableRandom random = new SplittableRandom(seed);
        while (true) {
            int pixels = new int[] {1024, 2048, 2048, 4096}[random.nextInt(4)];
            String[] drawn = gases != null ? gases : LAMPS[random.nextInt(LAMPS.length)];
            LampSet lamp = lamp(data, drawn);
            double start = lowest + (highest - lowest - 190) * random.nextDouble();
            double span = Math.min(120 + 580 * random.nextDouble(), highest - start);
            if (span < 80) {
                continue;
            }
            double kappa = curvature * (2 * random.nextDouble() - 1);
            double cubic = 0.1 * (2 * random.nextDouble() - 1);
            double[] truth = dispersion(start, span, pixels, kappa, cubic);
            double end = evaluate(truth, pixels - 1);
            double[] nm = lamp.lines().wavelengths();
            int inWindow = 0;
            for (double w : nm) {
                if (w > start && w < end) {
                    inWindow++;
                }
            }
            if (inWindow < 8) {
                continue;
            }
            boolean falling = random.nextDouble() < 0.25;
            return render(seed, random, pixels, lamp, String.join("+", drawn), truth, falling, inWindow, kappa);
        }
    }

    private static Exposure render(long seed, SplittableRandom random, int pixels, LampSet lamp, String lampName,
            double[] truth, boolean falling, int inWindow, double kappa) {
        double start = evaluate(truth, 0);
        double end = evaluate(truth, pixels - 1);
        double meanDispersion = (end - start) / (pixels - 1);
        double fwhmNm = (2 + 1.5 * random.nextDouble()) * meanDispersion;
        double[] tableNm = lamp.lines().wavelengths();
        List<double[]> lines = new ArrayList<>(); // {nm, relative flux}
        for (int i = 0; i < tableNm.length; i++) {
            // Each line's scatter and whether it is missing come from a stream of its own (the run's
            // seed and the line's wavelength), so that a row added to a lamp set changes no other
            // line's draw and no later draw of the run.
            long key = seed * 0x9E3779B97F4A7C15L ^ Double.doubleToLongBits(tableNm[i]);
            SplittableRandom own = new SplittableRandom(key);
            double rel = lamp.lines().intensity(i) * Math.exp(0.7 * gaussian(own));
            if (tableNm[i] > start - 1 && tableNm[i] < end + 1 && own.nextDouble() >= 0.1) {
                lines.add(new double[] {tableNm[i], rel});
            }
        }
        int ghosts = 0;
        List<Double> ghostNm = new ArrayList<>();
        for (int i = 0; i < tableNm.length; i++) {
            double second = 2 * tableNm[i];
            if (second > start && second < end) {
                lines.add(new double[] {second, 0.1 * lamp.lines().intensity(i)});
                ghostNm.add(second);
                ghosts++;
            }
        }
        int foreign = random.nextInt(5);
        double[] foreignNm = new double[foreign];
        for (int k = 0; k < foreign; k++) {
            lines.add(new double[] {start + (end - start) * random.nextDouble(), 50 + 400 * random.nextDouble()});
            foreignNm[k] = lines.get(lines.size() - 1)[0];
        }
        double strongest = 0;
        for (double[] line : lines) {
            strongest = Math.max(strongest, line[1]);
        }
        double peakCounts = 20000 + 30000 * random.nextDouble();
        double sigmaNm = fwhmNm / (2 * Math.sqrt(2 * Math.log(2)));
        double[] position = new double[lines.size()];
        double[] flux = new double[lines.size()];
        for (int k = 0; k < lines.size(); k++) {
            position[k] = lines.get(k)[0];
            flux[k] = peakCounts * lines.get(k)[1] / strongest * sigmaNm * Math.sqrt(2 * Math.PI);
        }
        double[] expected = new double[pixels];
        double tilt = random.nextDouble();
        for (int i = 0; i < pixels; i++) {
            double t = (double) i / pixels;
            expected[i] = 200 + 100 * tilt * t + 40 * Math.sin(4 * t + tilt);
        }
        new LineRenderer(PixelGrid.dispersion(truth, pixels), Instrument.ofFwhm(fwhmNm), 12).render(position, flux,
                new double[flux.length], new double[flux.length], expected);
        double[] counts = new double[pixels];
        Noise.apply(expected, 5, random.nextLong(), counts);
        double saturation = Double.NaN;
        if (random.nextDouble() < 0.3) {
            saturation = 0.6 * Arrays.stream(counts).max().orElse(0);
            for (int i = 0; i < pixels; i++) {
                counts[i] = Math.min(counts[i], saturation);
            }
        }
        if (falling) {
            for (int i = 0, j = pixels - 1; i < j; i++, j--) {
                double t = counts[i];
                counts[i] = counts[j];
                counts[j] = t;
            }
        }
        return new Exposure(seed, counts, lamp, lampName, truth, falling, saturation, inWindow, foreign, ghosts,
                kappa, foreignNm, ghostNm.stream().mapToDouble(Double::doubleValue).toArray());
    }

    /**
     * @param exposure an exposure
     * @return the lamp gases not in the exposure's lamp, as a lamp set, or null when it used them all
     */
    public LampSet otherGases(Exposure exposure) {
        String[] others = Arrays.stream(new String[] {"Hg I", "Ne I", "Ar I", "Kr I", "Xe I"})
                .filter(gas -> !exposure.lampName().contains(gas)).toArray(String[]::new);
        return others.length == 0 ? null : lamp(data, others);
    }

    /**
     * A cubic in the pixel p whose slope runs from d0 (1 - kappa/2) to d0 (1 + kappa/2) plus a
     * cubic wiggle of relative size {@code cubic}, scaled so that pixel 0 is {@code start} and the
     * last pixel is {@code start + span}.
     */
    /**
     * A cadmium-zinc lamp exposure on a spectrometer whose wavelength at pixel p is the
     * polynomial c (nm, air), drawn from the built-in Cd I and Zn I sets as
     * {@code synth --lines lamp-cd-i --lines lamp-zn-i} draws it.
     *
     * @param data           the data context
     * @param c              the dispersion's coefficients
     * @param pixels         number of pixels
     * @param kelvin         the lamp's temperature (its Doppler widths)
     * @param resolvingPower the instrument's
     * @param peakCounts     expected counts of the brightest pixel
     * @param readNoise      read noise, counts
     * @param seed           the noise seed
     * @return the counts
     */
    static double[] cadmiumZinc(DataContext data, double[] c, int pixels, double kelvin, double resolvingPower,
            double peakCounts, double readNoise, long seed) {
        return Scene.builder(PixelGrid.dispersion(c, pixels)).medium(Medium.air())
                .instrument(Instrument.ofResolvingPower(resolvingPower)).temperature(kelvin).peakCounts(peakCounts)
                .lineList(data.lampLines(Species.parse("Cd I")), data::nucleus)
                .lineList(data.lampLines(Species.parse("Zn I")), data::nucleus)
                .noise(readNoise, seed).build().render(1).counts();
    }

    /** @return the built-in lamp sets of the given gases, in air */
    static LampSet lamp(DataContext data, String... gases) {
        List<LineList> lists = new ArrayList<>();
        for (String gas : gases) {
            lists.add(data.lampLines(Species.parse(gas)));
        }
        return LampSet.of(lists, Medium.air());
    }

    static double[] dispersion(double start, double span, int pixels, double kappa, double cubic) {
        double last = pixels - 1;
        // slope(t) = 1 + kappa (t - 1/2) + cubic (t - 1/2)^2 * 3, t = p / last; integrate, then scale.
        double[] shape = new double[4];
        // integral of 1 + kappa (t - 1/2) + 3 cubic (t - 1/2)^2 dt from 0 to t, as a power series in t
        shape[1] = 1 - kappa / 2 + 3 * cubic / 4;
        shape[2] = kappa / 2 - 3 * cubic / 2;
        shape[3] = cubic;
        double total = shape[1] + shape[2] + shape[3];
        double[] c = new double[4];
        c[0] = start;
        for (int k = 1; k < 4; k++) {
            c[k] = span * shape[k] / total / Math.pow(last, k);
        }
        return c;
    }

    static double evaluate(double[] c, double p) {
        double v = 0;
        for (int k = c.length - 1; k >= 0; k--) {
            v = v * p + c[k];
        }
        return v;
    }

    private static double gaussian(SplittableRandom random) {
        double u = random.nextDouble();
        double v = random.nextDouble();
        return Math.sqrt(-2 * Math.log(1 - u)) * Math.cos(2 * Math.PI * v);
    }
}
