package org.ritzwerk.engine.calibrate;

/**
 * Conditions noted on a detected peak. A peak may carry several; {@link Peaks#has(int, PeakFlag)}
 * tests one.
 */
public enum PeakFlag {
    /**
     * At least one pixel within one FWHM of the centroid reached the saturation level. Saturated
     * pixels are left out of the profile fit, so the centroid comes from the unsaturated wings
     * and its uncertainty says so; a dispersion fit may prefer to leave such peaks out.
     */
    SATURATED,
    /**
     * The peak was fitted together with at least one neighbour as a sum of Gaussians, because
     * their fit windows overlapped.
     */
    BLENDED,
    /** The peak's fit window was cut by the first or last pixel of the detector. */
    EDGE,
    /**
     * The profile fit's chi-square is improbably large for the noise (above its 99th percentile):
     * most often an unresolved blend or a profile that is not Gaussian. The peak's uncertainties
     * were scaled by its own fit's reduced chi-square.
     */
    POOR_FIT,
    /**
     * The peak's fitted width exceeds the instrument's there by more than
     * {@value PeakFinder#WIDE_SIGMAS} combined standard uncertainties, although its profile fit may
     * pass the chi-square test: most often two lines closer than the resolution. The instrument's
     * width across the detector is a quadratic fitted to the widths of the peaks that are neither
     * poorly fitted nor saturated (see {@link PeakFinder}).
     */
    WIDE;

    int bit() {
        return 1 << ordinal();
    }
}
