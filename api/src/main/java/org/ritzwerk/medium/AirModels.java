package org.ritzwerk.medium;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.ritzwerk.internal.DecimalText;

/**
 * Reads the text form of the built-in air models, the inverse of {@link AirModel#spec()}.
 *
 * <ul>
 *   <li>{@code standard}: {@link StandardAir}.</li>
 *   <li>{@code ciddor1996}: Ciddor's standard air (15 C, 101325 Pa, 0 % RH, 450 ppm CO2).</li>
 *   <li>{@code ciddor1996:T=20C,p=101.325kPa,RH=40%,CO2=450ppm}: Ciddor at those conditions.
 *       All four conditions are required, each with its unit: T in {@code C} or {@code K};
 *       p in {@code Pa}, {@code hPa} or {@code kPa}; RH in {@code %}; CO2 in {@code ppm}.</li>
 * </ul>
 *
 * <p>Stateless and thread-safe.
 */
public final class AirModels {

    private AirModels() {
    }

    /**
     * @param spec the model text, e.g. {@code "ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm"}
     * @return the model
     * @throws MediumException naming the unknown model, key, unit or the out-of-range value
     */
    public static AirModel parse(String spec) {
        String text = spec.strip();
        if (text.equals(StandardAir.SPEC)) {
            return StandardAir.INSTANCE;
        }
        if (text.equals(Ciddor1996.NAME)) {
            return Ciddor1996.STANDARD_AIR;
        }
        String prefix = Ciddor1996.NAME + ":";
        if (!text.startsWith(prefix)) {
            throw new MediumException(MediumException.UNKNOWN_MODEL, "unknown air model '" + text
                    + "'; known: 'standard', 'ciddor1996', 'ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm'");
        }
        Map<String, String> conditions = new LinkedHashMap<>();
        for (String part : text.substring(prefix.length()).split(",", -1)) {
            int eq = part.indexOf('=');
            if (eq <= 0) {
                throw badCondition(text, "expected key=value, got '" + part + "'");
            }
            String key = part.substring(0, eq).strip().toUpperCase(Locale.ROOT);
            if (conditions.put(key, part.substring(eq + 1).strip()) != null) {
                throw badCondition(text, "condition '" + key + "' is given twice");
            }
        }
        for (String key : conditions.keySet()) {
            if (!key.equals("T") && !key.equals("P") && !key.equals("RH") && !key.equals("CO2")) {
                throw badCondition(text, "unknown condition '" + key + "'; expected T, p, RH and CO2");
            }
        }
        if (conditions.size() != 4) {
            throw badCondition(text, "all four conditions T, p, RH and CO2 are required, each with its unit");
        }
        double celsius = temperatureCelsius(text, conditions.get("T"));
        double pascal = pressurePascal(text, conditions.get("P"));
        double humidity = number(text, "RH", withUnit(text, "RH", conditions.get("RH"), "%"));
        double co2 = number(text, "CO2", withUnit(text, "CO2", conditions.get("CO2"), "ppm"));
        return new Ciddor1996(celsius, pascal, humidity, co2);
    }

    private static double temperatureCelsius(String spec, String value) {
        if (value.endsWith("K")) {
            return number(spec, "T", value.substring(0, value.length() - 1)) - 273.15;
        }
        return number(spec, "T", withUnit(spec, "T", value, "C"));
    }

    private static double pressurePascal(String spec, String value) {
        if (value.endsWith("kPa")) {
            return number(spec, "p", value.substring(0, value.length() - 3)) * 1000;
        }
        if (value.endsWith("hPa")) {
            return number(spec, "p", value.substring(0, value.length() - 3)) * 100;
        }
        return number(spec, "p", withUnit(spec, "p", value, "Pa"));
    }

    private static String withUnit(String spec, String key, String value, String unit) {
        if (!value.endsWith(unit)) {
            throw badCondition(spec, "condition " + key + "='" + value + "' needs its unit " + unit
                    + ("T".equals(key) ? " or K" : "p".equals(key) ? ", hPa or kPa" : ""));
        }
        return value.substring(0, value.length() - unit.length());
    }

    private static double number(String spec, String key, String text) {
        if (DecimalText.isDecimal(text.strip())) {
            double value = Double.parseDouble(text.strip());
            if (Double.isFinite(value)) {
                return value;
            }
        }
        throw badCondition(spec, "condition " + key + " has no readable number: '" + text + "'");
    }

    private static MediumException badCondition(String spec, String what) {
        return new MediumException(MediumException.BAD_CONDITION, "air model '" + spec + "': " + what);
    }

    /** Shortest plain text of a condition value, for specs and messages. */
    static String plain(double value) {
        return DecimalText.shortest(value);
    }
}
