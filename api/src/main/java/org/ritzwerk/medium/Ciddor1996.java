package org.ritzwerk.medium;

import java.util.Locale;

/**
 * Refractive index of moist air after P. E. Ciddor, "Refractive index of air: new equations for
 * the visible and near infrared", Appl. Opt. 35, 1566-1573 (1996), at the given temperature,
 * pressure, relative humidity and CO2 mole fraction.
 *
 * <p>The computation follows the paper's appendix: the dispersion of standard air (15 &deg;C,
 * 101 325 Pa, dry, 450 ppm CO2) and of water vapour (20 &deg;C, 1333 Pa), scaled by the densities
 * of the dry-air and water-vapour components from the BIPM compressibility equation (Davis 1992);
 * the saturation vapour pressure over liquid water and the enhancement factor also from Davis
 * (1992), Metrologia 29, 67. At the standard conditions the result equals the standard-air
 * dispersion {@code (n-1) 1e8 = 5792105/(238.0185 - s^2) + 167917/(57.362 - s^2)} exactly, which
 * {@code AirVacuumTest} checks (with the CO2 scaling of eq. 2, at 450 and 400 ppm) against the
 * paper's formula evaluated in mpmath at 40 digits; at other conditions
 * {@code CiddorPublishedValuesTest} checks it against the paper's Tables 1 and 3 (to 0.05e-8)
 * and the NIST refractive-index calculator (to 1e-9).
 *
 * <p>Validity as stated for the equation in J. A. Stone and J. H. Zimmerman, NIST Engineering
 * Metrology Toolbox, "Index of refraction of air" (online documentation of NIST's calculator;
 * ranges from memory, checked only in part: the wavelength range is that of the Peck &amp; Reeder
 * (1972) dispersion data the paper builds on, 0.23 um to 1.69 um, and the published values in
 * {@code CiddorPublishedValuesTest} span 0 &deg;C to 60 &deg;C, 10 kPa to 140 kPa and 0 % to 100 %
 * relative humidity): vacuum wavelength 300 nm
 * to 1690 nm, temperature -40 &deg;C to 100 &deg;C, pressure 10 kPa to 140 kPa, relative
 * humidity 0 % to 100 %, CO2 0 to 2000 ppm. Conditions outside these ranges are
 * refused by the constructor; wavelengths outside are refused by {@link Medium.Air}. Below
 * 0 &deg;C the saturation vapour pressure over water is used, as in the paper.
 *
 * <p>Immutable and thread-safe; equality is exact on the four conditions.
 *
 * @param temperatureCelsius       air temperature in degrees Celsius
 * @param pressurePascal           total air pressure in pascals
 * @param relativeHumidityPercent  relative humidity in percent (0 to 100)
 * @param co2PartsPerMillion       CO2 mole fraction in micromoles per mole (ppm)
 */
public record Ciddor1996(double temperatureCelsius, double pressurePascal, double relativeHumidityPercent,
        double co2PartsPerMillion) implements AirModel {

    /** The model name in {@link #spec()}. */
    public static final String NAME = "ciddor1996";

    /** Ciddor's standard air: 15 &deg;C, 101 325 Pa, dry, 450 ppm CO2. */
    public static final Ciddor1996 STANDARD_AIR = new Ciddor1996(15, 101_325, 0, 450);

    private static final double ZERO_CELSIUS_KELVIN = 273.15;

    /**
     * Validates the conditions; each message names the parameter, value, unit and allowed range.
     *
     * @param temperatureCelsius       air temperature in degrees Celsius
     * @param pressurePascal           total air pressure in pascals
     * @param relativeHumidityPercent  relative humidity in percent (0 to 100)
     * @param co2PartsPerMillion       CO2 mole fraction in micromoles per mole (ppm)
     */
    public Ciddor1996 {
        checkRange("temperature", temperatureCelsius, -40, 100, "C");
        checkRange("pressure", pressurePascal, 10_000, 140_000, "Pa");
        checkRange("relative humidity", relativeHumidityPercent, 0, 100, "%");
        checkRange("CO2 mole fraction", co2PartsPerMillion, 0, 2000, "ppm");
    }

    private static void checkRange(String what, double value, double min, double max, String unit) {
        if (!(value >= min && value <= max)) {
            throw new MediumException(MediumException.BAD_CONDITION, String.format(Locale.ROOT,
                    "Ciddor 1996 air model: %s %s %s is outside the model's range %s to %s %s",
                    what, value, unit, AirModels.plain(min), AirModels.plain(max), unit));
        }
    }

    @Override
    public String spec() {
        return NAME + ":T=" + AirModels.plain(temperatureCelsius) + "C,p=" + AirModels.plain(pressurePascal)
                + "Pa,RH=" + AirModels.plain(relativeHumidityPercent) + "%,CO2="
                + AirModels.plain(co2PartsPerMillion) + "ppm";
    }

    @Override
    public String description() {
        return "Ciddor 1996 moist air at " + AirModels.plain(temperatureCelsius) + " C, "
                + AirModels.plain(pressurePascal) + " Pa, " + AirModels.plain(relativeHumidityPercent) + " % RH, "
                + AirModels.plain(co2PartsPerMillion) + " ppm CO2";
    }

    @Override
    public String citation() {
        return "P. E. Ciddor, Appl. Opt. 35, 1566-1573 (1996)";
    }

    @Override
    public double minVacuumWavelengthMetres() {
        return 300e-9;
    }

    @Override
    public double maxVacuumWavelengthMetres() {
        return 1690e-9;
    }

    @Override
    public double refractiveIndex(double vacuumWavelengthMetres) {
        double s = 1e-6 / vacuumWavelengthMetres;
        double s2 = s * s;
        // Dispersion of standard air (Ciddor eq. 1) with the CO2 correction (eq. 2).
        double nAs = 1e-8 * (5_792_105.0 / (238.0185 - s2) + 167_917.0 / (57.362 - s2));
        double nAxs = nAs * (1 + 0.534e-6 * (co2PartsPerMillion - 450));
        // Dispersion of water vapour at 20 C, 1333 Pa (eq. 3, with the correction factor 1.022).
        double nWs = 1.022e-8 * (295.235 + s2 * (2.6422 + s2 * (-0.032380 + s2 * 0.004028)));
        // Molar mass of dry air with xc ppm CO2, kg/mol (eq. 4); of water vapour.
        double molarMassAir = 1e-3 * (28.9635 + 12.011e-6 * (co2PartsPerMillion - 400));
        double molarMassWater = 0.018015;

        double t = temperatureCelsius;
        double tKelvin = t + ZERO_CELSIUS_KELVIN;
        double p = pressurePascal;
        double xw = waterMoleFraction(t, tKelvin, p, relativeHumidityPercent / 100);

        // The gas constant R cancels in the density ratios below, so it is left out.
        double densityAxs = 101_325 * molarMassAir / (compressibility(15, 288.15, 101_325, 0) * 288.15);
        double densityWs = 1333 * molarMassWater / (compressibility(20, 293.15, 1333, 1) * 293.15);
        double z = compressibility(t, tKelvin, p, xw);
        double densityA = p * molarMassAir * (1 - xw) / (z * tKelvin);
        double densityW = p * molarMassWater * xw / (z * tKelvin);
        return 1 + (densityA / densityAxs) * nAxs + (densityW / densityWs) * nWs;
    }

    /** Mole fraction of water vapour from relative humidity (fraction), Davis (1992). */
    private static double waterMoleFraction(double t, double tKelvin, double p, double relativeHumidity) {
        double saturation = Math.exp(1.2378847e-5 * tKelvin * tKelvin - 1.9121316e-2 * tKelvin + 33.93711047
                - 6.3431645e3 / tKelvin);
        double enhancement = 1.00062 + 3.14e-8 * p + 5.6e-7 * t * t;
        return enhancement * relativeHumidity * saturation / p;
    }

    /** Compressibility of moist air, BIPM 1981/91 equation (Davis 1992), as used by Ciddor eq. 12. */
    private static double compressibility(double t, double tKelvin, double p, double xw) {
        double pt = p / tKelvin;
        return 1 - pt * (1.58123e-6 + t * (-2.9331e-8 + t * 1.1043e-10) + (5.707e-6 - 2.051e-8 * t) * xw
                + (1.9898e-4 - 2.376e-6 * t) * xw * xw) + pt * pt * (1.83e-11 - 0.765e-8 * xw * xw);
    }
}
