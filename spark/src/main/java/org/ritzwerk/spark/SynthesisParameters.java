package org.ritzwerk.spark;

import java.io.Serializable;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Renderer;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.medium.Medium;

/**
 * What {@link SurveySynthesis} does with every scene row: the pixel grid (linear, logarithmic, or
 * a spectrometer's dispersion polynomial), the one-electron ions' level model, the highest n, the
 * renderer, the peak counts, the read noise, the line lists every scene also draws, the line
 * shapes' extra widths and a continuum. The
 * per-scene physics (species, temperature, density, velocity, resolving power, seed) comes from
 * the rows. The same settings as the {@code synth} command's options, with the same defaults.
 *
 * <p>An immutable, serialisable value (Spark broadcasts it once per job); the canonical
 * constructor checks every field as the engine does.
 *
 * @param fromNm     the linear grid's first pixel edge, nm in {@code medium} (not converted between
 *                   media); NaN with a dispersion
 * @param toNm       its last pixel edge, nm; NaN with a dispersion
 * @param pixels     the number of pixels
 * @param logarithmic whether the grid between fromNm and toNm is logarithmic (pixels of equal
 *                   lambda / d lambda, as {@code synth --grid log}) rather than linear
 * @param dispersion empty for the linear grid; else the coefficients c0, c1, ... of the wavelength
 *                   in nm at pixel p (centre of pixel p, from 0), as {@code synth --dispersion}
 *                   takes them ({@link PixelGrid#dispersion}); rising or falling with the pixel
 * @param medium     the axis medium: "air", "vacuum" or "air(&lt;model&gt;)"
 * @param model      level model of the one-electron ions: bohr, dirac, qed or hyperfine
 * @param nMax       highest upper n of their lines
 * @param renderer   auto, exact or fast
 * @param peakCounts the brightest pixel's expected counts
 * @param readNoise  read noise in counts (Poisson noise always, drawn from each row's seed); NaN
 *                   for no noise at all (counts then equal the expected counts)
 * @param dataFiles  the user's data files, first in precedence; readable on every executor
 * @param lineSets   line lists every scene also draws, as {@code synth --lines}: data set ids (such
 *                   as {@code lamp-ne-i}) or line-list files readable on every executor; with
 *                   them a scene's {@code species} may be empty (a lamp spectrum)
 * @param shapes     widths added to every line, and fine-structure components
 * @param background the continuum under the lines
 *
 * <p>Serialisable only to travel from the driver to the executors of the same version, so the
 * serialised form is not part of the API.
 *
 * @serial exclude
 */
public record SynthesisParameters(double fromNm, double toNm, int pixels, boolean logarithmic,
        List<Double> dispersion, String medium, String model, int nMax, String renderer, double peakCounts,
        double readNoise, List<String> dataFiles, List<String> lineSets, Shapes shapes, Background background)
        implements Serializable {

    private static final long serialVersionUID = 1L;

    /** The level model of one-electron ions unless {@link #withModel} says otherwise, as {@code synth}'s. */
    public static final String DEFAULT_MODEL = "qed";
    /** The highest upper n unless {@link #withModel} says otherwise, as {@code synth}'s. */
    public static final int DEFAULT_N_MAX = 30;
    /** The most pixels a grid may have, as {@code synth --pixels} allows. */
    public static final int MAX_PIXELS = 50_000_000;
    private static final double MAX_COUNTS = 1e15;

    /**
     * Line-shape settings of {@code synth}.
     *
     * @param collisionalFwhmNm a Lorentzian FWHM in nm given to every line
     *                          ({@code --collisional-width}), 0 to 1000 times the grid's span
     * @param naturalWidths     whether the lines' natural widths are added ({@code --natural-widths};
     *                          with one-electron ions nMax must be at most
     *                          {@link Scene#MAX_N_WITH_NATURAL_WIDTHS})
     * @param components        whether one-electron ions' fine-structure components are drawn one by
     *                          one ({@code --components})
     *
     * @serial exclude
     */
    public record Shapes(double collisionalFwhmNm, boolean naturalWidths, boolean components)
            implements Serializable {

        private static final long serialVersionUID = 1L;

        /**
         * Checks the width.
         *
         * @param collisionalFwhmNm as above
         * @param naturalWidths     as above
         * @param components        as above
         */
        public Shapes {
            if (!(collisionalFwhmNm >= 0) || Double.isInfinite(collisionalFwhmNm)) {
                throw new IllegalArgumentException("collisionalFwhmNm must be finite and not negative, got "
                        + collisionalFwhmNm);
            }
        }

        /** @return no extra width, no components: the command's defaults */
        public static Shapes none() {
            return new Shapes(0, false, false);
        }
    }

    /**
     * The continuum of {@code synth --continuum} or {@code --continuum-file}.
     *
     * @param kind         none, flat, blackbody (photons per wavelength, as the command draws it), or
     *                     file (a shape of the user's own: {@code file})
     * @param temperatureK the blackbody's temperature; NaN for each scene's own {@code temperature_k}
     *                     (the command's default); NaN unless blackbody
     * @param counts       the expected counts of the continuum's brightest pixel (the command's
     *                     {@code --continuum-counts}, default 100)
     * @param file         for kind file, a continuum CSV ({@code wavelength_nm,density}, as
     *                     {@code --continuum-file} reads it) readable at this path on every executor;
     *                     else null
     *
     * @serial exclude
     */
    public record Background(String kind, double temperatureK, double counts, String file)
            implements Serializable {

        private static final long serialVersionUID = 1L;

        /**
         * Checks every field as the command does.
         *
         * @param kind         as above
         * @param temperatureK as above
         * @param counts       as above
         * @param file         as above
         */
        public Background {
            Objects.requireNonNull(kind, "kind");
            if (!List.of("none", "flat", "blackbody", "file").contains(kind)) {
                throw new IllegalArgumentException("continuum kind must be none, flat, blackbody or file, got '"
                        + kind + "'");
            }
            if (!Double.isNaN(temperatureK) && !(kind.equals("blackbody") && temperatureK > 0
                    && temperatureK < 1e9)) {
                throw new IllegalArgumentException("a continuum temperature is for a blackbody, above 0 and below"
                        + " 1e9 K (or NaN for each scene's temperature), got " + temperatureK);
            }
            if (!(counts > 0 && counts <= 1e15)) {
                throw new IllegalArgumentException("continuum counts must be above 0 and at most 1e15, got " + counts);
            }
            if (kind.equals("none") && counts != 100) {
                throw new IllegalArgumentException("continuum counts are for a flat or blackbody continuum; with"
                        + " none leave the default, 100, got " + counts);
            }
            if (kind.equals("file") != (file != null)) {
                throw new IllegalArgumentException("a continuum file goes with kind file, and kind file needs one");
            }
            if (file != null && file.isBlank()) {
                throw new IllegalArgumentException("the continuum file's path is blank");
            }
        }

        /** @return no continuum */
        public static Background none() {
            return new Background("none", Double.NaN, 100, null);
        }
    }

    /**
     * Checks every field and copies the list.
     *
     * @param fromNm     as above
     * @param toNm       as above
     * @param pixels     as above
     * @param logarithmic as above
     * @param dispersion as above
     * @param medium     as above
     * @param model      as above
     * @param nMax       as above
     * @param renderer   as above
     * @param peakCounts as above
     * @param readNoise  as above
     * @param dataFiles  as above
     * @param lineSets   as above
     * @param shapes     as above
     * @param background as above
     */
    public SynthesisParameters {
        Setups.requireNoNull("dataFiles", dataFiles);
        Setups.requireNoNull("lineSets", lineSets);
        Setups.requireNoNull("dispersion", dispersion);
        if (pixels < 2 || pixels > MAX_PIXELS) {
            throw new IllegalArgumentException("pixels must be 2 to " + MAX_PIXELS + ", as synth --pixels takes them,"
                    + " got " + pixels);
        }
        if (fromNm > toNm) {
            // Either order, as synth --from and --to take them.
            double lower = toNm;
            toNm = fromNm;
            fromNm = lower;
        }
        dataFiles = List.copyOf(dataFiles);
        Setups.requireDistinct("dataFiles", dataFiles, String::strip);
        lineSets = List.copyOf(lineSets);
        Setups.requireDistinct("lineSets", lineSets, String::strip);
        dispersion = List.copyOf(dispersion);
        PixelGrid checked = grid(fromNm, toNm, pixels, logarithmic, dispersion);
        Objects.requireNonNull(shapes, "shapes");
        Objects.requireNonNull(background, "background");
        double span = checked.highest() - checked.lowest();
        if (shapes.collisionalFwhmNm() > 1000 * span) {
            throw new IllegalArgumentException("collisionalFwhmNm must be 0 to 1000 times the spectrum's span ("
                    + 1000 * span + " nm here), got " + shapes.collisionalFwhmNm());
        }
        if (shapes.naturalWidths() && nMax > Scene.MAX_N_WITH_NATURAL_WIDTHS) {
            throw new IllegalArgumentException("natural widths are computed up to n = "
                    + Scene.MAX_N_WITH_NATURAL_WIDTHS + "; lower nMax (" + nMax + ") or leave them out");
        }
        Medium.parse(Objects.requireNonNull(medium, "medium"));
        Tier.fromId(Objects.requireNonNull(model, "model"));
        if (nMax < 2 || nMax > HydrogenLikeLines.MAX_N) {
            throw new IllegalArgumentException("nMax must be 2 to " + HydrogenLikeLines.MAX_N + ", got " + nMax);
        }
        if (!List.of("auto", "exact", "fast").contains(Objects.requireNonNull(renderer, "renderer")
                .toLowerCase(Locale.ROOT))) {
            throw new IllegalArgumentException("renderer must be auto, exact or fast, got '" + renderer + "'");
        }
        // Counts stay exact as whole numbers in a double up to 2^53: the command's cap of 1e15.
        if (!(peakCounts > 0 && peakCounts <= MAX_COUNTS)) {
            throw new IllegalArgumentException("peakCounts must be above 0 and at most 1e15, got " + peakCounts);
        }
        if (!Double.isNaN(readNoise) && !(readNoise >= 0 && readNoise <= MAX_COUNTS)) {
            throw new IllegalArgumentException("readNoise must be 0 to 1e15, or NaN for no noise, got " + readNoise);
        }
    }

    /**
     * @param fromNm first pixel edge, nm in the axis medium (vacuum here; after
     *               {@link #withMedium} in that medium, as {@code synth --from "650 nm air" --medium
     *               air} takes it: the edges are never converted between media)
     * @param toNm   last pixel edge, nm
     * @param pixels number of pixels
     * @return the {@code synth} command's defaults on that grid: vacuum, model qed, n up to 30,
     *         renderer auto, 10000 peak counts, Poisson noise with read noise 0
     */
    public static SynthesisParameters linear(double fromNm, double toNm, int pixels) {
        return new SynthesisParameters(fromNm, toNm, pixels, false, List.of(), "vacuum", DEFAULT_MODEL, DEFAULT_N_MAX,
                "auto", 10_000, 0,
                List.of(), List.of(), Shapes.none(), Background.none());
    }

    /**
     * @param fromNm first pixel edge, nm in the axis medium (as {@link #linear})
     * @param toNm   last pixel edge, nm
     * @param pixels number of pixels
     * @return {@link #linear}'s defaults on a logarithmic grid, as {@code synth --grid log}
     */
    public static SynthesisParameters logarithmic(double fromNm, double toNm, int pixels) {
        return new SynthesisParameters(fromNm, toNm, pixels, true, List.of(), "vacuum", DEFAULT_MODEL, DEFAULT_N_MAX,
                "auto", 10_000, 0,
                List.of(), List.of(), Shapes.none(), Background.none());
    }

    /**
     * @param coefficients c0, c1, ... of the wavelength in nm (in the axis medium, vacuum here; see
     *                     {@link #withMedium}) at the centre of pixel p, counted from 0, as
     *                     {@code synth --dispersion c0,c1,... --pixels N} takes them
     * @param pixels       number of pixels
     * @return the {@code synth} command's defaults on that grid, as {@link #linear}
     */
    public static SynthesisParameters dispersion(double[] coefficients, int pixels) {
        if (coefficients.length < 2) {
            throw new IllegalArgumentException("a dispersion needs at least c0 and c1, got " + coefficients.length
                    + " coefficient" + (coefficients.length == 1 ? "" : "s"));
        }
        List<Double> c = new java.util.ArrayList<>();
        for (double v : coefficients) {
            c.add(v);
        }
        return new SynthesisParameters(Double.NaN, Double.NaN, pixels, false, c, "vacuum", DEFAULT_MODEL, DEFAULT_N_MAX,
                "auto", 10_000, 0, List.of(), List.of(), Shapes.none(), Background.none());
    }

    /**
     * @param mediumSpec the axis medium
     * @return a copy
     */
    public SynthesisParameters withMedium(String mediumSpec) {
        return new SynthesisParameters(fromNm, toNm, pixels, logarithmic, dispersion, mediumSpec, model, nMax,
                renderer, peakCounts, readNoise, dataFiles, lineSets, shapes, background);
    }

    /**
     * @param id the level model
     * @param n  the highest upper n
     * @return a copy
     */
    public SynthesisParameters withModel(String id, int n) {
        return new SynthesisParameters(fromNm, toNm, pixels, logarithmic, dispersion, medium, id, n, renderer,
                peakCounts, readNoise, dataFiles, lineSets, shapes, background);
    }

    /**
     * @param counts the brightest pixel's expected counts
     * @param read   read noise in counts, or NaN for no noise
     * @return a copy
     */
    public SynthesisParameters withCounts(double counts, double read) {
        return new SynthesisParameters(fromNm, toNm, pixels, logarithmic, dispersion, medium, model, nMax, renderer,
                counts, read, dataFiles, lineSets, shapes, background);
    }

    /**
     * @param choice auto, exact or fast
     * @return a copy
     */
    public SynthesisParameters withRenderer(String choice) {
        return new SynthesisParameters(fromNm, toNm, pixels, logarithmic, dispersion, medium, model, nMax, choice,
                peakCounts, readNoise, dataFiles, lineSets, shapes, background);
    }

    /**
     * @param files the user's data files, readable at these paths on every executor
     * @return a copy
     */
    public SynthesisParameters withDataFiles(List<String> files) {
        return new SynthesisParameters(fromNm, toNm, pixels, logarithmic, dispersion, medium, model, nMax, renderer,
                peakCounts, readNoise, files, lineSets, shapes, background);
    }

    /**
     * @param sets line lists every scene also draws (data set ids or line-list files), as
     *             {@code synth --lines}
     * @return a copy
     */
    public SynthesisParameters withLineSets(List<String> sets) {
        return new SynthesisParameters(fromNm, toNm, pixels, logarithmic, dispersion, medium, model, nMax, renderer,
                peakCounts, readNoise, dataFiles, sets, shapes, background);
    }

    /**
     * @param collisionalFwhmNm a Lorentzian FWHM in nm given to every line
     * @param naturalWidths     whether natural widths are added
     * @param components        whether fine-structure components are drawn one by one
     * @return a copy, as {@code synth --collisional-width --natural-widths --components}
     */
    public SynthesisParameters withShapes(double collisionalFwhmNm, boolean naturalWidths, boolean components) {
        return new SynthesisParameters(fromNm, toNm, pixels, logarithmic, dispersion, medium, model, nMax, renderer,
                peakCounts, readNoise, dataFiles, lineSets, new Shapes(collisionalFwhmNm, naturalWidths, components),
                background);
    }

    /**
     * @param kind         none, flat or blackbody
     * @param temperatureK the blackbody's temperature, or NaN for each scene's own
     * @param counts       the continuum's brightest pixel's expected counts
     * @return a copy, as {@code synth --continuum KIND --continuum-temperature K --continuum-counts C}
     */
    public SynthesisParameters withContinuum(String kind, double temperatureK, double counts) {
        return new SynthesisParameters(fromNm, toNm, pixels, logarithmic, dispersion, medium, model, nMax, renderer,
                peakCounts, readNoise, dataFiles, lineSets, shapes,
                new Background(kind, temperatureK, counts, null));
    }

    /**
     * @param file   a continuum CSV ({@code wavelength_nm,density} in the axis medium), readable at
     *               this path on every executor; it must reach both ends of the grid
     * @param counts the continuum's brightest pixel's expected counts
     * @return a copy, as {@code synth --continuum-file FILE --continuum-counts C}
     */
    public SynthesisParameters withContinuumFile(String file, double counts) {
        return new SynthesisParameters(fromNm, toNm, pixels, logarithmic, dispersion, medium, model, nMax, renderer,
                peakCounts, readNoise, dataFiles, lineSets, shapes,
                new Background("file", Double.NaN, counts, file));
    }

    /** @return the grid */
    PixelGrid grid() {
        return grid(fromNm, toNm, pixels, logarithmic, dispersion);
    }

    /** The grid the fields describe, refusing what the engine or the command refuses. */
    private static PixelGrid grid(double fromNm, double toNm, int pixels, boolean logarithmic,
            List<Double> dispersion) {
        if (dispersion.isEmpty()) {
            PixelGrid grid = logarithmic ? PixelGrid.logarithmic(fromNm, toNm, pixels)
                    : PixelGrid.linear(fromNm, toNm, pixels);
            if (!(fromNm > 0)) {
                throw new IllegalArgumentException("the grid must start above 0 nm, got " + fromNm);
            }
            return grid;
        }
        if (logarithmic) {
            throw new IllegalArgumentException("a dispersion grid is given by its polynomial; it cannot be"
                    + " logarithmic too");
        }
        if (!Double.isNaN(fromNm) || !Double.isNaN(toNm)) {
            throw new IllegalArgumentException("give a dispersion or fromNm/toNm, not both (fromNm and toNm must be"
                    + " NaN with a dispersion)");
        }
        double[] c = new double[dispersion.size()];
        for (int k = 0; k < c.length; k++) {
            c[k] = Objects.requireNonNull(dispersion.get(k), "dispersion coefficient");
        }
        PixelGrid grid;
        try {
            grid = PixelGrid.dispersion(c, pixels);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("dispersion: " + e.getMessage(), e);
        }
        if (!(grid.lowest() > 0)) {
            throw new IllegalArgumentException("dispersion: the wavelength must be above 0 nm on every pixel, but the"
                    + " first pixel's edge is at " + grid.lowest() + " nm");
        }
        return grid;
    }

    /** @return the renderer */
    Renderer rendererChoice() {
        return Renderer.valueOf(renderer.toUpperCase(Locale.ROOT));
    }
}
