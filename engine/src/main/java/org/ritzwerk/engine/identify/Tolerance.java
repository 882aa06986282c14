package org.ritzwerk.engine.identify;

import java.util.Locale;

/**
 * How far a peak may lie from a line and still be matched to it, in vacuum wavelength:
 * <ul>
 *   <li>{@link #absolute(double)}: a fixed half-width in metres;</li>
 *   <li>{@link #relative(double)}: a fraction of the wavelength (1e-6 is 1 ppm; a resolving
 *       power R is {@code relative(1 / R)});</li>
 *   <li>{@link #kSigma(double)}: k combined standard uncertainties,
 *       {@code k sqrt(sigma_peak^2 + sigma_line^2)}.</li>
 * </ul>
 * For the first two the residual is scored against a standard uncertainty of a third of the
 * half-width (common practice: the window is a 3-sigma window). Immutable.
 *
 * @param kind  which model
 * @param value the half-width in metres, the fraction, or k; finite and positive
 */
public record Tolerance(Kind kind, double value) {

    /** The tolerance models. */
    public enum Kind {
        /** A fixed half-width in metres. */
        ABSOLUTE,
        /** A fraction of the wavelength. */
        RELATIVE,
        /** k combined standard uncertainties. */
        K_SIGMA
    }

    /** Validates the value. */
    public Tolerance {
        if (kind == null) {
            throw new IllegalArgumentException("tolerance kind is required");
        }
        if (!(value > 0) || Double.isInfinite(value)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "a %s tolerance must be finite and positive, got %s", kind.name().toLowerCase(Locale.ROOT), value));
        }
    }

    /** @param metres half-width in metres of vacuum wavelength @return the tolerance */
    public static Tolerance absolute(double metres) {
        return new Tolerance(Kind.ABSOLUTE, metres);
    }

    /** @param fraction half-width as a fraction of the wavelength @return the tolerance */
    public static Tolerance relative(double fraction) {
        return new Tolerance(Kind.RELATIVE, fraction);
    }

    /** @param k the number of combined standard uncertainties @return the tolerance */
    public static Tolerance kSigma(double k) {
        return new Tolerance(Kind.K_SIGMA, k);
    }

    /** @return the half-width at a wavelength for given standard uncertainties, metres */
    double halfWidth(double wavelength, double peakSigma, double lineSigma) {
        switch (kind) {
            case ABSOLUTE:
                return value;
            case RELATIVE:
                return value * wavelength;
            default:
                return value * Math.sqrt(peakSigma * peakSigma + lineSigma * lineSigma);
        }
    }

    /** @return the standard uncertainty the residual is scored against, metres */
    double scoringSigma(double wavelength, double peakSigma, double lineSigma) {
        return kind == Kind.K_SIGMA ? Math.sqrt(peakSigma * peakSigma + lineSigma * lineSigma)
                : halfWidth(wavelength, peakSigma, lineSigma) / 3;
    }
}
