package org.ritzwerk.medium;

/**
 * Standard air as adopted for published air wavelengths: dry air at 15 &deg;C and 101 325 Pa
 * (with 450 ppm CO2), the formula given by D. C. Morton, ApJS 130, 403 (2000), eq. (8), from
 * Birch &amp; Downs, Metrologia 31, 315 (1994):
 *
 * <pre>
 *   n - 1 = 8.34254e-5 + 2.406147e-2 / (130 - s^2) + 1.5998e-4 / (38.9 - s^2)
 * </pre>
 *
 * where {@code s = 1 / lambda_vac} in inverse micrometres. This is Ritzwerk's default meaning of
 * "air". {@code AirVacuumTest} checks both directions against this formula evaluated in mpmath at
 * 40 digits ({@code air-vacuum-formula.csv}, {@code vacuum-air-formula.csv}).
 *
 * <p>Validity: 200 nm to 2.5 um (vacuum). Below 200 nm wavelengths are given in vacuum by
 * convention (common practice). The upper limit is our choice (from memory: the dispersion data
 * behind Edlen-type formulas reach the near infrared; E. R. Peck and K. Reeder, J. Opt. Soc. Am.
 * 62, 958 (1972), measured to 1.69 um). Checked: between 300 nm and 2.5 um this formula and
 * Ciddor's standard-air dispersion (Appl. Opt. 35, 1566 (1996), eq. 1) differ by less than
 * 2.1e-5 of n - 1, i.e. less than 6e-9 in n, so the extension to 2.5 um adds no error a
 * wavelength table would see. Outside the range, conversions refuse rather than extrapolate.
 *
 * <p>Immutable singleton; thread-safe.
 */
public enum StandardAir implements AirModel {
    /** The one instance. */
    INSTANCE;

    /** The text {@link #spec()} returns and {@link AirModels#parse(String)} accepts. */
    public static final String SPEC = "standard";

    private static final double MIN_METRES = 200e-9;
    private static final double MAX_METRES = 2.5e-6;

    @Override
    public String spec() {
        return SPEC;
    }

    /** @return the {@link #description()}, e.g. in a medium's or a log's text */
    @Override
    public String toString() {
        return description();
    }

    @Override
    public String description() {
        return "standard air (dry, 15 C, 101325 Pa; Morton 2000 eq. 8)";
    }

    @Override
    public String citation() {
        return "D. C. Morton, Astrophys. J. Suppl. Ser. 130, 403 (2000), eq. (8), after "
                + "K. P. Birch and M. J. Downs, Metrologia 31, 315 (1994)";
    }

    @Override
    public double refractiveIndex(double vacuumWavelengthMetres) {
        double s = 1e-6 / vacuumWavelengthMetres;
        double s2 = s * s;
        return 1 + (8.34254e-5 + 2.406147e-2 / (130 - s2) + 1.5998e-4 / (38.9 - s2));
    }

    @Override
    public double minVacuumWavelengthMetres() {
        return MIN_METRES;
    }

    @Override
    public double maxVacuumWavelengthMetres() {
        return MAX_METRES;
    }
}
