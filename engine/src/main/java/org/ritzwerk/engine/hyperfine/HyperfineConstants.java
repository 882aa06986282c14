package org.ritzwerk.engine.hyperfine;

import java.util.Objects;

/**
 * The hyperfine constants of one fine-structure level: the magnetic-dipole constant A and the
 * electric-quadrupole constant B, both as frequencies (energy / h) in Hz. B is 0 for J = 1/2 and
 * I &lt; 1, where the quadrupole term vanishes. Immutable and thread-safe.
 *
 * @param aHertz A in Hz; finite (negative for a negative nuclear moment, e.g. K-40)
 * @param bHertz B in Hz; finite
 * @param source where the values come from (publication, or {@code from memory}); not blank
 */
public record HyperfineConstants(double aHertz, double bHertz, String source) {

    /**
     * Validates the components.
     *
     * @param aHertz A in Hz; finite (negative for a negative nuclear moment, e.g. K-40)
     * @param bHertz B in Hz; finite
     * @param source where the values come from (publication, or {@code from memory}); not blank
     */
    public HyperfineConstants {
        Objects.requireNonNull(source, "source");
        if (!Double.isFinite(aHertz)) {
            throw new IllegalArgumentException("hyperfine constant A must be finite (Hz), got " + aHertz);
        }
        if (!Double.isFinite(bHertz)) {
            throw new IllegalArgumentException("hyperfine constant B must be finite (Hz), got " + bHertz);
        }
        if (source.isBlank()) {
            throw new IllegalArgumentException("hyperfine constants need a source");
        }
    }

    /**
     * @param aMegahertz A in MHz; finite
     * @param bMegahertz B in MHz; finite (0 where the level has none)
     * @param source     where the values come from; not blank
     * @return the constants
     */
    public static HyperfineConstants ofMegahertz(double aMegahertz, double bMegahertz, String source) {
        return new HyperfineConstants(aMegahertz * 1e6, bMegahertz * 1e6, source);
    }
}
