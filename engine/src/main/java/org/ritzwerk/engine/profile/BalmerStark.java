package org.ritzwerk.engine.profile;

/**
 * Stark broadening of the hydrogen Balmer-alpha and Balmer-beta lines by the plasma's electrons
 * and ions, from the power-law fits of M. A. Gigosos, M. A. Gonzalez and V. Cardenoso,
 * "Computer simulated Balmer-alpha, -beta and -gamma Stark line profiles for non-equilibrium
 * plasmas diagnostics", Spectrochim. Acta B 58, 1489 (2003):
 *
 * <pre>
 *   H-alpha: FWHM = 0.549 nm (Ne / 1e23 m^-3)^0.67082
 *   H-beta:  FWHM = 4.800 nm (Ne / 1e23 m^-3)^0.68116
 * </pre>
 *
 * The coefficients are from memory: neither the paper nor a publication quoting its fits could
 * be read for this project, so the digits could not be compared with print. The H-alpha fit was
 * 1.098 nm (Ne / 1e23)^0.67965 until a review recalled, as we do now, 0.549 nm and 0.67082 for
 * the full width at half maximum, 1.098 nm (with 0.67671) being the paper's fit of the full width
 * at half area (two recollections that agree; still not compared with print). Independent check:
 * the Stark width of a hydrogen line is set mainly by the quasi-static ion microfield, whose
 * Holtsmark normal field grows as Ne^(2/3) (H. R. Griem, Spectral Line Broadening by Plasmas
 * (Academic Press, 1974)); both exponents lie above 2/3, by 0.6 % and 2.2 %, as expected from
 * the electrons' impact broadening, which grows about as Ne. The prefactors have no independent
 * numeric check here. The fits are nearly independent of temperature and of the reduced mass of
 * emitter and perturber for these two lines, which is why they are the usual density diagnostic
 * (common practice).
 *
 * <p>The fits are used for densities from {@link #MIN_DENSITY} to {@link #MAX_DENSITY} m^-3,
 * the range the simulations cover as far as we recall it (from memory); outside it both
 * directions refuse. The true H-beta profile has a central dip and is not a Lorentzian; a
 * renderer that draws it as a Lorentzian of this FWHM (as the synthesiser does) matches the
 * width, not the shape. The widths are for hydrogen; deuterium lines are treated the same (the
 * ion-dynamics difference is within the fit's scatter for these lines, common practice).
 *
 * <p>Stateless and thread-safe.
 */
public final class BalmerStark {

    /** Lowest electron density the fits are used for, m^-3. */
    public static final double MIN_DENSITY = 1e20;

    /** Highest electron density the fits are used for, m^-3. */
    public static final double MAX_DENSITY = 1e25;

    private static final double REFERENCE_DENSITY = 1e23;

    /** The two Balmer lines with a published fit. */
    public enum Line {
        /** n = 3 to 2, 656.3 nm. */
        ALPHA(3, 0.549, 0.67082),
        /** n = 4 to 2, 486.1 nm. */
        BETA(4, 4.800, 0.68116);

        private final int upperN;
        private final double widthAtReference;
        private final double exponent;

        Line(int upperN, double widthAtReference, double exponent) {
            this.upperN = upperN;
            this.widthAtReference = widthAtReference;
            this.exponent = exponent;
        }

        /** @return the upper principal quantum number (the lower is 2) */
        public int upperN() {
            return upperN;
        }

        /**
         * @param upperN upper principal quantum number of a Balmer line
         * @param lowerN lower principal quantum number
         * @return the line, or null when the pair is not Balmer-alpha or -beta
         */
        public static Line of(int upperN, int lowerN) {
            if (lowerN != 2) {
                return null;
            }
            for (Line line : values()) {
                if (line.upperN == upperN) {
                    return line;
                }
            }
            return null;
        }
    }

    private BalmerStark() {
    }

    /**
     * @param line            Balmer-alpha or -beta
     * @param electronDensity electron density in m^-3, {@link #MIN_DENSITY} to {@link #MAX_DENSITY}
     * @return the Stark FWHM in nm
     * @throws IllegalArgumentException when the density is outside the fit's range
     */
    public static double fwhmNanometres(Line line, double electronDensity) {
        if (!(electronDensity >= MIN_DENSITY && electronDensity <= MAX_DENSITY)) {
            throw new IllegalArgumentException("electron density " + electronDensity + " m^-3 is outside "
                    + MIN_DENSITY + " to " + MAX_DENSITY + " m^-3, where the " + name(line) + " Stark fit is used");
        }
        return line.widthAtReference * Math.pow(electronDensity / REFERENCE_DENSITY, line.exponent);
    }

    /**
     * The inverse: the electron density that gives a measured Stark FWHM (the Doppler and
     * instrumental parts already removed).
     *
     * @param line          Balmer-alpha or -beta
     * @param fwhmNanometres Stark FWHM in nm, positive
     * @return the electron density in m^-3
     * @throws IllegalArgumentException when the width is not positive or corresponds to a
     *         density outside the fit's range
     */
    public static double electronDensity(Line line, double fwhmNanometres) {
        java.util.Objects.requireNonNull(line, "line");
        if (!(fwhmNanometres > 0) || Double.isInfinite(fwhmNanometres)) {
            throw new IllegalArgumentException(name(line) + " Stark FWHM must be a positive number of nm, got "
                    + fwhmNanometres);
        }
        double density = REFERENCE_DENSITY * Math.pow(fwhmNanometres / line.widthAtReference, 1 / line.exponent);
        if (!(density >= MIN_DENSITY * (1 - 1e-12) && density <= MAX_DENSITY * (1 + 1e-12))) {
            throw new IllegalArgumentException(name(line) + " Stark FWHM " + fwhmNanometres + " nm means an electron "
                    + "density of " + String.format(java.util.Locale.ROOT, "%.3g", density) + " m^-3, outside "
                    + MIN_DENSITY + " to " + MAX_DENSITY + " m^-3 where the fit is used");
        }
        return density;
    }

    /**
     * The standard uncertainty of {@link #electronDensity} from that of the width alone (first
     * order: dNe / Ne = (1 / exponent) dw / w); the fit's own uncertainty (several per cent) is
     * not included.
     *
     * @param line          Balmer-alpha or -beta
     * @param fwhmNanometres Stark FWHM in nm
     * @param fwhmUncertainty its standard uncertainty in nm, not negative
     * @return the density's standard uncertainty in m^-3
     */
    public static double electronDensityUncertainty(Line line, double fwhmNanometres, double fwhmUncertainty) {
        if (!(fwhmUncertainty >= 0) || Double.isInfinite(fwhmUncertainty)) {
            throw new IllegalArgumentException("the width's uncertainty must be a finite number >= 0 nm, got "
                    + fwhmUncertainty);
        }
        return electronDensity(line, fwhmNanometres) * fwhmUncertainty / fwhmNanometres / line.exponent;
    }

    private static String name(Line line) {
        return line == Line.ALPHA ? "H-alpha" : "H-beta";
    }
}
