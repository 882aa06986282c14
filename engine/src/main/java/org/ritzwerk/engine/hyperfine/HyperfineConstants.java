package org.ritzwerk.engine.hyperfine;

import java.util.Objects;

/**
 * The hyperfine constants of one fine-structure level: the magnetic-dipole constant A and the
 * electric-quadrupole constant B, both as frequencies (energy / h) in Hz, with their standard
 * uncertainties where the source states them. B is 0 for J = 1/2 and I &lt; 1, where the quadrupole
 * term vanishes. Immutable and thread-safe.
 *
 * <p>NaN policy: an uncertainty is NaN when not stated (constants given without one); A and B
 * themselves must be finite.
 *
 * @param aHertz            A in Hz; finite (negative for a negative nuclear moment, e.g. K-40)
 * @param bHertz            B in Hz; finite
 * @param source            where the values come from (publication, or {@code from memory}); not blank
 * @param aUncertaintyHertz the standard uncertainty of A, Hz; finite and not negative, or NaN when not stated
 * @param bUncertaintyHertz the standard uncertainty of B, Hz; finite and not negative, or NaN when not stated
 */
public record HyperfineConstants(double aHertz, double bHertz, String source, double aUncertaintyHertz,
        double bUncertaintyHertz) {

    /**
     * Validates the components.
     *
     * @param aHertz            A in Hz; finite (negative for a negative nuclear moment, e.g. K-40)
     * @param bHertz            B in Hz; finite
     * @param source            where the values come from (publication, or {@code from memory}); not blank
     * @param aUncertaintyHertz the standard uncertainty of A, Hz; finite and not negative, or NaN when not stated
     * @param bUncertaintyHertz the standard uncertainty of B, Hz; finite and not negative, or NaN when not stated
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
        checkUncertainty("A", aUncertaintyHertz);
        checkUncertainty("B", bUncertaintyHertz);
    }

    /**
     * Constants without stated uncertainties.
     *
     * @param aHertz A in Hz; finite (negative for a negative nuclear moment, e.g. K-40)
     * @param bHertz B in Hz; finite
     * @param source where the values come from (publication, or {@code from memory}); not blank
     */
    public HyperfineConstants(double aHertz, double bHertz, String source) {
        this(aHertz, bHertz, source, Double.NaN, Double.NaN);
    }

    private static void checkUncertainty(String name, double value) {
        if (!Double.isNaN(value) && !(value >= 0 && value < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("the uncertainty of hyperfine constant " + name + " must be finite and "
                    + "not negative (Hz; NaN for not stated), got " + value);
        }
    }

    /**
     * @param aMegahertz A in MHz; finite
     * @param bMegahertz B in MHz; finite (0 where the level has none)
     * @param source     where the values come from; not blank
     * @return the constants, without stated uncertainties
     */
    public static HyperfineConstants ofMegahertz(double aMegahertz, double bMegahertz, String source) {
        return new HyperfineConstants(aMegahertz * 1e6, bMegahertz * 1e6, source);
    }

    /**
     * @param aMegahertz            A in MHz; finite
     * @param aUncertaintyMegahertz its standard uncertainty, MHz; not negative, or NaN when not stated
     * @param bMegahertz            B in MHz; finite (0 where the level has none)
     * @param bUncertaintyMegahertz its standard uncertainty, MHz; not negative, or NaN when not stated
     * @param source                where the values come from; not blank
     * @return the constants with their uncertainties
     */
    public static HyperfineConstants ofMegahertz(double aMegahertz, double aUncertaintyMegahertz, double bMegahertz,
            double bUncertaintyMegahertz, String source) {
        return new HyperfineConstants(aMegahertz * 1e6, bMegahertz * 1e6, source, aUncertaintyMegahertz * 1e6,
                bUncertaintyMegahertz * 1e6);
    }

    /**
     * @return these constants with every unstated (NaN) uncertainty taken as 0: what propagating only the
     *         stated ones means, for a caller that says so to its users
     */
    public HyperfineConstants withStatedUncertaintiesOnly() {
        return new HyperfineConstants(aHertz, bHertz, source, Double.isNaN(aUncertaintyHertz) ? 0 : aUncertaintyHertz,
                Double.isNaN(bUncertaintyHertz) ? 0 : bUncertaintyHertz);
    }
}
