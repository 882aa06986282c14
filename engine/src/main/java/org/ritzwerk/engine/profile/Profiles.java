package org.ritzwerk.engine.profile;

/**
 * Line profiles normalised to unit area, as functions of the offset from the line centre:
 * <pre>
 *   Gaussian:   G(x) = exp(-x^2 / (2 s^2)) / (s sqrt(2 pi)),        s = FWHM_G / (2 sqrt(2 ln 2))
 *   Lorentzian: L(x) = (g / pi) / (x^2 + g^2),                       g = FWHM_L / 2
 *   Voigt:      V(x) = Re w((x + i g) / (s sqrt 2)) / (s sqrt(2 pi))  (their convolution)
 * </pre>
 * with w the {@link Faddeeva} function (common practice; e.g. Olivero &amp; Longbothum, J. Quant.
 * Spectrosc. Radiat. Transfer 17, 233 (1977)). Offsets and widths are in one unit of the
 * caller's choice; the densities are per that unit. The Voigt profile falls back to the exact
 * Gaussian or Lorentzian when the other width is zero. Stateless and thread-safe.
 */
public final class Profiles {

    private static final double SQRT_2PI = Math.sqrt(2 * Math.PI);
    private static final double FWHM_TO_SIGMA = 1 / (2 * Math.sqrt(2 * Math.log(2)));

    private Profiles() {
    }

    /**
     * @param x    offset from the centre
     * @param fwhm full width at half maximum, finite and positive
     * @return the Gaussian density at x
     */
    public static double gaussian(double x, double fwhm) {
        check("Gaussian", fwhm, false);
        double s = fwhm * FWHM_TO_SIGMA;
        return Math.exp(-0.5 * (x / s) * (x / s)) / (s * SQRT_2PI);
    }

    /**
     * @param x    offset from the centre
     * @param fwhm full width at half maximum, finite and positive
     * @return the Lorentzian density at x
     */
    public static double lorentzian(double x, double fwhm) {
        check("Lorentzian", fwhm, false);
        double g = fwhm / 2;
        return g / Math.PI / (x * x + g * g);
    }

    /**
     * @param x            offset from the centre
     * @param gaussianFwhm Gaussian FWHM, finite and not negative
     * @param lorentzFwhm  Lorentzian FWHM, finite and not negative; not both zero
     * @return the Voigt density at x
     */
    public static double voigt(double x, double gaussianFwhm, double lorentzFwhm) {
        check("Gaussian", gaussianFwhm, true);
        check("Lorentzian", lorentzFwhm, true);
        if (gaussianFwhm == 0 && lorentzFwhm == 0) {
            throw new IllegalArgumentException("a Voigt profile needs a Gaussian or a Lorentzian width above zero");
        }
        if (lorentzFwhm == 0) {
            return gaussian(x, gaussianFwhm);
        }
        if (gaussianFwhm == 0) {
            return lorentzian(x, lorentzFwhm);
        }
        double s = gaussianFwhm * FWHM_TO_SIGMA;
        double scale = 1 / (s * Math.sqrt(2));
        double[] w = new double[2];
        Faddeeva.w(x * scale, lorentzFwhm / 2 * scale, w);
        return w[0] / (s * SQRT_2PI);
    }

    /**
     * The Voigt profile over a column of offsets, allocation-free.
     *
     * @param offsets      offsets from the centre
     * @param gaussianFwhm Gaussian FWHM, finite and positive
     * @param lorentzFwhm  Lorentzian FWHM, finite and positive
     * @param out          densities, same length as offsets
     */
    public static void voigt(double[] offsets, double gaussianFwhm, double lorentzFwhm, double[] out) {
        if (offsets.length != out.length) {
            throw new IllegalArgumentException("offsets and out differ in length: " + offsets.length + " and "
                    + out.length);
        }
        check("Gaussian", gaussianFwhm, false);
        check("Lorentzian", lorentzFwhm, false);
        double s = gaussianFwhm * FWHM_TO_SIGMA;
        double scale = 1 / (s * Math.sqrt(2));
        double y = lorentzFwhm / 2 * scale;
        double norm = 1 / (s * SQRT_2PI);
        double[] w = new double[2];
        for (int i = 0; i < offsets.length; i++) {
            Faddeeva.w(offsets[i] * scale, y, w);
            out[i] = w[0] * norm;
        }
    }

    /**
     * The Voigt FWHM by the approximation of J. J. Olivero and R. L. Longbothum (1977):
     * {@code f_V = 0.5346 f_L + sqrt(0.2166 f_L^2 + f_G^2)}, good to about 0.02 %.
     *
     * @param gaussianFwhm Gaussian FWHM
     * @param lorentzFwhm  Lorentzian FWHM
     * @return the approximate Voigt FWHM
     */
    public static double voigtFwhm(double gaussianFwhm, double lorentzFwhm) {
        check("Gaussian", gaussianFwhm, true);
        check("Lorentzian", lorentzFwhm, true);
        return 0.5346 * lorentzFwhm + Math.sqrt(0.2166 * lorentzFwhm * lorentzFwhm + gaussianFwhm * gaussianFwhm);
    }

    /**
     * The inverse of {@link #voigtFwhm}: the Lorentzian FWHM that, with the given Gaussian FWHM,
     * makes the given Voigt FWHM under the same approximation (the smaller root of its quadratic
     * in f_L), for taking a known Gaussian part out of a measured width.
     *
     * @param voigtFwhm    the Voigt FWHM, at least the Gaussian FWHM
     * @param gaussianFwhm the Gaussian FWHM, not negative
     * @return the Lorentzian FWHM, 0 when the two are equal
     * @throws IllegalArgumentException when the Voigt FWHM is below the Gaussian one
     */
    public static double lorentzFwhmOfVoigt(double voigtFwhm, double gaussianFwhm) {
        check("Voigt", voigtFwhm, true);
        check("Gaussian", gaussianFwhm, true);
        if (voigtFwhm < gaussianFwhm) {
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT, "a Voigt FWHM of %.6g is"
                    + " narrower than its Gaussian part %.6g; no Lorentzian width fits", voigtFwhm, gaussianFwhm));
        }
        // (f_V - 0.5346 f_L)^2 = 0.2166 f_L^2 + f_G^2, i.e. a f_L^2 - 1.0692 f_V f_L + f_V^2 - f_G^2 = 0.
        double a = 0.5346 * 0.5346 - 0.2166;
        double b = 2 * 0.5346 * voigtFwhm;
        double c = voigtFwhm * voigtFwhm - gaussianFwhm * gaussianFwhm;
        if (c == 0) {
            return 0;
        }
        return 2 * c / (b + Math.sqrt(b * b - 4 * a * c));
    }

    private static void check(String what, double fwhm, boolean zeroAllowed) {
        if (!Double.isFinite(fwhm) || fwhm < 0 || !zeroAllowed && fwhm == 0) {
            throw new IllegalArgumentException(what + " FWHM must be finite and " + (zeroAllowed ? "not negative"
                    : "positive") + ", got " + fwhm);
        }
    }
}
