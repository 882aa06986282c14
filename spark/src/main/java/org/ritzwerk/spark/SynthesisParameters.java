package org.ritzwerk.spark;

import java.io.Serializable;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Renderer;
import org.ritzwerk.medium.Medium;

/**
 * What {@link SurveySynthesis} does with every scene row: the pixel grid, the one-electron ions'
 * level model, the highest n, the renderer, the peak counts and the read noise. The per-scene
 * physics (species, temperature, density, velocity, resolving power, seed) comes from the rows.
 * The same settings as the {@code synth} command's options, with the same defaults.
 *
 * <p>An immutable, serialisable value (Spark broadcasts it once per job); the canonical
 * constructor checks every field as the engine does.
 *
 * @param fromNm     the grid's first pixel edge, nm in {@code medium} (not converted between media)
 * @param toNm       its last pixel edge, nm
 * @param pixels     the number of pixels (a linear grid)
 * @param medium     the axis medium: "air", "vacuum" or "air(&lt;model&gt;)"
 * @param model      level model of the one-electron ions: bohr, dirac, qed or hyperfine
 * @param nMax       highest upper n of their lines
 * @param renderer   auto, exact or fast
 * @param peakCounts the brightest pixel's expected counts
 * @param readNoise  read noise in counts (Poisson noise always, drawn from each row's seed); NaN
 *                   for no noise at all (counts then equal the expected counts)
 * @param dataFiles  the user's data files, first in precedence; readable on every executor
 *
 * <p>Serialisable only to travel from the driver to the executors of the same version, so the
 * serialised form is not part of the API.
 *
 * @serial exclude
 */
public record SynthesisParameters(double fromNm, double toNm, int pixels, String medium, String model, int nMax,
        String renderer, double peakCounts, double readNoise, List<String> dataFiles) implements Serializable {

    private static final long serialVersionUID = 1L;

    /**
     * Checks every field and copies the list.
     *
     * @param fromNm     as above
     * @param toNm       as above
     * @param pixels     as above
     * @param medium     as above
     * @param model      as above
     * @param nMax       as above
     * @param renderer   as above
     * @param peakCounts as above
     * @param readNoise  as above
     * @param dataFiles  as above
     */
    public SynthesisParameters {
        dataFiles = List.copyOf(dataFiles);
        Setups.requireDistinct("dataFiles", dataFiles, String::strip);
        PixelGrid.linear(fromNm, toNm, pixels);
        if (!(fromNm > 0)) {
            throw new IllegalArgumentException("the grid must start above 0 nm, got " + fromNm);
        }
        Medium.parse(Objects.requireNonNull(medium, "medium"));
        Tier.fromId(Objects.requireNonNull(model, "model"));
        if (nMax < 2 || nMax > org.ritzwerk.engine.hydrogenic.HydrogenLikeLines.MAX_N) {
            throw new IllegalArgumentException("nMax must be 2 to " + org.ritzwerk.engine.hydrogenic.HydrogenLikeLines.MAX_N + ", got " + nMax);
        }
        Renderer.valueOf(Objects.requireNonNull(renderer, "renderer").toUpperCase(Locale.ROOT));
        if (!(peakCounts > 0) || Double.isInfinite(peakCounts)) {
            throw new IllegalArgumentException("peakCounts must be finite and positive, got " + peakCounts);
        }
        if (!Double.isNaN(readNoise) && !(readNoise >= 0 && Double.isFinite(readNoise))) {
            throw new IllegalArgumentException("readNoise must be finite and not negative, or NaN, got " + readNoise);
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
        return new SynthesisParameters(fromNm, toNm, pixels, "vacuum", "qed", 30, "auto", 10_000, 0, List.of());
    }

    /**
     * @param mediumSpec the axis medium
     * @return a copy
     */
    public SynthesisParameters withMedium(String mediumSpec) {
        return new SynthesisParameters(fromNm, toNm, pixels, mediumSpec, model, nMax, renderer, peakCounts, readNoise,
                dataFiles);
    }

    /**
     * @param id the level model
     * @param n  the highest upper n
     * @return a copy
     */
    public SynthesisParameters withModel(String id, int n) {
        return new SynthesisParameters(fromNm, toNm, pixels, medium, id, n, renderer, peakCounts, readNoise, dataFiles);
    }

    /**
     * @param counts the brightest pixel's expected counts
     * @param read   read noise in counts, or NaN for no noise
     * @return a copy
     */
    public SynthesisParameters withCounts(double counts, double read) {
        return new SynthesisParameters(fromNm, toNm, pixels, medium, model, nMax, renderer, counts, read, dataFiles);
    }

    /**
     * @param choice auto, exact or fast
     * @return a copy
     */
    public SynthesisParameters withRenderer(String choice) {
        return new SynthesisParameters(fromNm, toNm, pixels, medium, model, nMax, choice, peakCounts, readNoise,
                dataFiles);
    }

    /**
     * @param files the user's data files, readable at these paths on every executor
     * @return a copy
     */
    public SynthesisParameters withDataFiles(List<String> files) {
        return new SynthesisParameters(fromNm, toNm, pixels, medium, model, nMax, renderer, peakCounts, readNoise,
                files);
    }

    /** @return the grid */
    PixelGrid grid() {
        return PixelGrid.linear(fromNm, toNm, pixels);
    }

    /** @return the renderer */
    Renderer rendererChoice() {
        return Renderer.valueOf(renderer.toUpperCase(Locale.ROOT));
    }
}
