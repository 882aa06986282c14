package org.ritzwerk.engine.synth;

/**
 * Which renderer draws a scene's lines into its pixels.
 */
public enum Renderer {
    /** {@link LineRenderer}: each line integrated over each pixel within its window. */
    EXACT,
    /** {@link FastLineRenderer}: all lines at once through the Fourier domain, whole profiles. */
    FAST,
    /**
     * {@link FastLineRenderer} when lines x pixels is at least {@link #AUTO_THRESHOLD} and its
     * internal grid stays within its limits, otherwise {@link LineRenderer}.
     */
    AUTO;

    /**
     * Lines x pixels from which {@link #AUTO} takes the fast renderer: 1e9, where the fast
     * renderer is several times quicker on the benchmark's lines (the RenderBenchmark and
     * FastRenderBenchmark figures) and below which scenes stay on the exact renderer, as before it.
     */
    public static final double AUTO_THRESHOLD = 1e9;
}
