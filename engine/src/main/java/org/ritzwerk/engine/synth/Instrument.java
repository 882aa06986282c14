package org.ritzwerk.engine.synth;

/**
 * A spectrometer's Gaussian response: either a fixed FWHM (in the grid's unit) or a resolving
 * power R, for which the FWHM at a position p is |p| / R (the same relative width in
 * wavelength, frequency or wavenumber). A Gaussian response convolved with a Voigt line is a
 * Voigt line whose Gaussian FWHM adds in quadrature (common practice), which is how it is
 * applied.
 */
public final class Instrument {

    private final double fwhm;
    private final double resolvingPower;

    private Instrument(double fwhm, double resolvingPower) {
        this.fwhm = fwhm;
        this.resolvingPower = resolvingPower;
    }

    /** @return an ideal instrument that adds no width */
    public static Instrument ideal() {
        return new Instrument(0, Double.POSITIVE_INFINITY);
    }

    /**
     * @param fwhm response FWHM in the grid's unit, finite and positive
     * @return an instrument of constant width
     */
    public static Instrument ofFwhm(double fwhm) {
        if (!(Double.isFinite(fwhm) && fwhm > 0)) {
            throw new IllegalArgumentException("instrument FWHM must be finite and positive, got " + fwhm);
        }
        return new Instrument(fwhm, Double.POSITIVE_INFINITY);
    }

    /**
     * @param resolvingPower R = p / FWHM, finite and positive
     * @return an instrument of constant resolving power
     */
    public static Instrument ofResolvingPower(double resolvingPower) {
        if (!(Double.isFinite(resolvingPower) && resolvingPower > 0)) {
            throw new IllegalArgumentException("resolving power must be finite and positive, got " + resolvingPower);
        }
        return new Instrument(0, resolvingPower);
    }

    /**
     * @param position line position in the grid's unit
     * @return the response FWHM there
     */
    public double fwhmAt(double position) {
        return fwhm + Math.abs(position) / resolvingPower;
    }
}
