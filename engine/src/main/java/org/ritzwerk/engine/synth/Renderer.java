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
     * {@link FastLineRenderer} when lines x pixels is at least {@link #AUTO_THRESHOLD}, its
     * internal grid stays within its limits and its arrays take at most half the JVM's largest heap,
     * otherwise {@link LineRenderer} (which needs no more than the spectrum's own arrays).
     */
    AUTO;

    /**
     * Lines x pixels from which {@link #AUTO} takes the fast renderer: 1e9. On the benchmark's
     * lines the fast renderer is already about 10 times quicker at 1e8 (FastRenderBenchmark); the
     * threshold is set higher so that scenes of up to a few million lines x pixels, as in the
     * tests and examples, stay on the exact renderer with the results they had before.
     */
    public static final double AUTO_THRESHOLD = 1e9;
}
