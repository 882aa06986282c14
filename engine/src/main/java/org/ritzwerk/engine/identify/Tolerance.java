package org.ritzwerk.engine.identify;

import java.util.Locale;
import org.ritzwerk.quantity.Unit;

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

    /**
     * Validates the value.
     *
     * @param kind  which model
     * @param value the half-width in metres, the fraction, or k; finite and positive
     */
    public Tolerance {
        if (kind == null) {
            throw new IllegalArgumentException("tolerance kind is required");
        }
        if (!(value > 0) || Double.isInfinite(value)) {
            String name = kind.name().toLowerCase(Locale.ROOT).replace('_', '-');
            throw new IllegalArgumentException(String.format(Locale.ROOT, "%s %s tolerance must be finite and positive,"
                    + " got %s", name.startsWith("a") ? "an" : "a", name, value));
        }
    }

    /**
     * @param metres half-width in metres of vacuum wavelength
     * @return the tolerance
     */
    public static Tolerance absolute(double metres) {
        return new Tolerance(Kind.ABSOLUTE, metres);
    }

    /**
     * @param fraction half-width as a fraction of the wavelength
     * @return the tolerance
     */
    public static Tolerance relative(double fraction) {
        return new Tolerance(Kind.RELATIVE, fraction);
    }

    /**
     * @param k the number of combined standard uncertainties
     * @return the tolerance
     */
    public static Tolerance kSigma(double k) {
        return new Tolerance(Kind.K_SIGMA, k);
    }

    /**
     * Reads a tolerance as people write it: {@code "5 sigma"} (k combined uncertainties), a
     * wavelength half-width with its unit ({@code "0.02 nm"}, {@code "0.5 Å"}, {@code "1e-11 m"}),
     * {@code "20 ppm"}, or a resolving power {@code "R=20000"} (relative 1/R).
     *
     * @param text the tolerance
     * @return the tolerance
     * @throws IdentificationException naming the text and giving examples when it cannot be read,
     *         or when its value is not finite and positive
     */
    public static Tolerance parse(String text) {
        String t = java.util.Objects.requireNonNull(text, "text").strip();
        try {
            Tolerance parsed = read(t);
            if (parsed != null) {
                return parsed;
            }
        } catch (NumberFormatException e) {
            // reported below
        } catch (IllegalArgumentException e) {
            throw new IdentificationException(IdentificationException.BAD_TOLERANCE, "tolerance '" + text + "': "
                    + e.getMessage(), e);
        }
        throw new IdentificationException(IdentificationException.BAD_TOLERANCE, "cannot read tolerance '" + text
                + "'; examples: \"5 sigma\", \"0.02 nm\", \"20 ppm\", \"R=20000\"");
    }

    /** @return the tolerance the text gives, or null when its form is not one of the known ones */
    private static Tolerance read(String t) {
        if (t.endsWith("sigma")) {
            return kSigma(Double.parseDouble(t.substring(0, t.length() - 5).strip()));
        }
        if (t.endsWith("ppm")) {
            return relative(Double.parseDouble(t.substring(0, t.length() - 3).strip()) * 1e-6);
        }
        if (t.startsWith("R=")) {
            return relative(1 / Double.parseDouble(t.substring(2).strip()));
        }
        String[] parts = t.split("\\s+");
        if (parts.length == 2) {
            Unit unit = Unit.fromSymbol(parts[1]).orElse(null);
            if (unit != null && unit.kind() == org.ritzwerk.quantity.Kind.WAVELENGTH) {
                return absolute(unit.toSi(Double.parseDouble(parts[0])));
            }
            if (unit != null && unit.kind() != org.ritzwerk.quantity.Kind.TEMPERATURE) {
                throw new IdentificationException(IdentificationException.BAD_TOLERANCE, "a tolerance in "
                        + unit.symbol() + " is not supported yet; give a wavelength width (nm, pm as 0.001 nm,"
                        + " Angstrom), ppm or R=");
            }
        }
        return null;
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

    /**
     * Whether this tolerance scores residuals more sharply than the peaks' own uncertainties allow. A
     * width, relative or resolving-power tolerance scores a residual as a Gaussian of a third of its
     * half-width, whatever the peaks state; where that is below a peak's stated uncertainty the posterior
     * odds, and so the ambiguity flag, are overconfident (crowded scenes of peaks of 1 pm: a width of
     * 0.002 nm left 4.3 % of unflagged peaks wrong, 0.003 nm 0.32 %, "5 sigma" 0.21 %;
     * IdentificationRulesTest).
     *
     * @param peaks the peaks to be matched
     * @return a note saying how many peaks state an uncertainty above the scoring width, and what to give
     *         instead; empty for a k-sigma tolerance, for peaks without uncertainties, or where at most a
     *         tenth of the peaks are so affected
     */
    public java.util.Optional<String> sharperThanThePeaksNote(PeakList peaks) {
        if (kind == Kind.K_SIGMA) {
            return java.util.Optional.empty();
        }
        int sharper = 0;
        for (int i = 0; i < peaks.size(); i++) {
            double x = peaks.wavelength(i);
            // (beyond rounding and the air-to-vacuum scaling of the uncertainty, a few parts in 1e4: a width
            // of exactly three uncertainties is not sharper)
            if (peaks.sigma(i) > halfWidth(x, peaks.sigma(i), 0) / 3 * (1 + 1e-3)) {
                sharper++;
            }
        }
        if (sharper * 10 <= peaks.size()) {
            return java.util.Optional.empty();
        }
        return java.util.Optional.of(sharper + " of " + peaks.size() + " peaks state an uncertainty above a third"
                + " of the tolerance's half-width, the width residuals are scored with, so the ambiguity flag is"
                + " overconfident for them; give \"5 sigma\" (the peaks' own uncertainties) or a tolerance at"
                + " least three times their uncertainty");
    }

    /** @return the standard uncertainty the residual is scored against, metres */
    double scoringSigma(double wavelength, double peakSigma, double lineSigma) {
        return kind == Kind.K_SIGMA ? Math.sqrt(peakSigma * peakSigma + lineSigma * lineSigma)
                : halfWidth(wavelength, peakSigma, lineSigma) / 3;
    }
}
