package org.ritzwerk.quantity;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Locale;
import java.util.Objects;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.ritzwerk.internal.DecimalText;
import org.ritzwerk.medium.AirModel;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;

/**
 * Reads and writes quantities as text.
 *
 * <p>Grammar: {@code number [uncertainty] unit [medium]}, blanks between parts optional where
 * unambiguous.
 * <ul>
 *   <li>number: a decimal such as {@code 656.28}, {@code .5} or {@code 3.6e-19}; finite and not
 *       negative (and not zero for wavelengths and frequencies).</li>
 *   <li>uncertainty: concise, digits in parentheses that count in the last digits of the number
 *       ({@code 656.28(2)} is 656.28 with 0.02; {@code 6.62607015(81)e-34}), or after
 *       {@code +-}, {@code +/-} or {@code ±} in the same unit ({@code 656.28 +- 0.02 nm}).</li>
 *   <li>unit: one of {@link Unit}'s symbols or aliases, case-sensitive.</li>
 *   <li>medium, for wavelengths only: {@code vacuum}, {@code air} (this reader's air, by default
 *       {@link org.ritzwerk.medium.StandardAir}) or {@code air(<model spec>)} such as
 *       {@code air(ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm)}. A wavelength without a medium
 *       is in vacuum.</li>
 * </ul>
 *
 * <p>Writing gives the number, the unit and, for wavelengths, the medium. Without a standard
 * uncertainty the number is the shortest decimal that reads back to the same value (or rounded
 * to a requested number of significant digits); with one, the concise form with two significant
 * digits of uncertainty, e.g. {@code 656.4608(20) nm vacuum}.
 *
 * <p>Immutable and thread-safe.
 */
public final class QuantityText {

    private static final QuantityText STANDARD = new QuantityText(Medium.air());

    /** The mantissa of a number, before an optional concise uncertainty and exponent. */
    private static final Pattern MANTISSA = Pattern.compile("[+-]?(\\d+(\\.\\d*)?|\\.\\d+)");
    private static final Pattern CONCISE = Pattern.compile("\\((\\d+)\\)");
    private static final Pattern UNSIGNED_NUMBER = Pattern.compile("(\\d+(\\.\\d*)?|\\.\\d+)([eE][+-]?\\d+)?");
    private static final Pattern EXPONENT = Pattern.compile("[eE][+-]?\\d+");
    private static final Pattern NOT_FINITE_WORD =
            Pattern.compile("[+-]?(nan|inf|infinity)\\b.*", Pattern.CASE_INSENSITIVE);

    private final Medium.Air air;

    private QuantityText(Medium.Air air) {
        this.air = Objects.requireNonNull(air, "air");
    }

    /** @return the reader and writer in which a plain "air" means standard air */
    public static QuantityText standard() {
        return STANDARD;
    }

    /**
     * @param model the air model a plain "air" stands for
     * @return a reader and writer like this one with that meaning of "air"
     */
    public QuantityText withAir(AirModel model) {
        return new QuantityText(Medium.air(model));
    }

    /** @return the medium a plain "air" stands for */
    public Medium.Air air() {
        return air;
    }

    /**
     * @param text e.g. {@code "656.28(2) nm air"}, {@code "15233.1 cm-1"}, {@code "300 K"}
     * @return the quantity
     * @throws QuantityParseException naming the column and what is wrong there
     */
    public Quantity parse(String text) {
        Objects.requireNonNull(text, "text");
        return new Reader(text).read();
    }

    /**
     * @param text a wavelength, wavenumber, frequency or energy
     * @return the quantity
     * @throws QuantityParseException also when the text is a temperature
     */
    public SpectralQuantity parseSpectral(String text) {
        Quantity quantity = parse(text);
        if (!(quantity instanceof SpectralQuantity)) {
            throw new QuantityParseException(QuantityParseException.WRONG_KIND, text, 1,
                    "expected a wavelength, wavenumber, frequency or energy, got a " + quantity.kind().noun());
        }
        return (SpectralQuantity) quantity;
    }

    /**
     * @param text a unit and, for wavelength units, an optional medium: {@code "nm vacuum"},
     *             {@code "nm air"}, {@code "THz"}; a wavelength unit without medium means vacuum
     * @return the target
     * @throws QuantityParseException for an unknown unit or medium, or a medium after a unit
     *                                that is not a wavelength unit
     */
    public Target parseTarget(String text) {
        Objects.requireNonNull(text, "text");
        Reader reader = new Reader(text);
        reader.skipBlanks();
        if (reader.atEnd()) {
            throw new QuantityParseException(QuantityParseException.MISSING_UNIT, text, 1,
                    "expected a unit such as nm, cm-1, THz or eV" + knownUnitsHint());
        }
        Unit unit = reader.unit();
        Medium medium = reader.medium(unit);
        reader.expectEnd();
        return new Target(unit, unit.kind() == Kind.WAVELENGTH && medium == null ? Medium.vacuum() : medium);
    }

    /**
     * @param quantity a quantity
     * @param unit     a unit of its kind
     * @return the quantity as text in that unit, e.g. {@code "656.4608(20) nm vacuum"}
     */
    public String format(Quantity quantity, Unit unit) {
        return format(quantity, unit, 0);
    }

    /**
     * @param quantity          a quantity
     * @param unit              a unit of its kind
     * @param significantDigits 1 to 17 to round a value without uncertainty; 0 for the shortest
     *                          text that reads back to the same value. Ignored when the quantity
     *                          has an uncertainty, which sets the digits instead.
     * @return the quantity as text
     */
    public String format(Quantity quantity, Unit unit, int significantDigits) {
        if (significantDigits < 0 || significantDigits > 17) {
            throw new IllegalArgumentException("significant digits must be 0 (shortest) to 17, got "
                    + significantDigits);
        }
        StringBuilder text = new StringBuilder(formatNumber(quantity, unit, significantDigits));
        text.append(' ').append(unit.symbol());
        if (quantity instanceof Wavelength) {
            text.append(' ').append(mediumText(((Wavelength) quantity).medium()));
        }
        return text.toString();
    }

    /**
     * @param quantity          a quantity
     * @param unit              a unit of its kind
     * @param significantDigits as for {@link #format(Quantity, Unit, int)}
     * @return only the number (with a concise uncertainty where stated)
     */
    public String formatNumber(Quantity quantity, Unit unit, int significantDigits) {
        double value = quantity.valueIn(unit);
        if (quantity.hasUncertainty()) {
            return concise(value, quantity.uncertaintyIn(unit).getAsDouble());
        }
        if (significantDigits > 0) {
            return DecimalText.significant(value, significantDigits);
        }
        return exactText(((AbstractQuantity) quantity).si, unit);
    }

    /**
     * @param medium a medium
     * @return how this writer names it: {@code vacuum}, {@code air} for this writer's air,
     *         {@code air(<spec>)} for another model
     */
    public String mediumText(Medium medium) {
        if (medium.equals(air)) {
            return "air";
        }
        if (medium instanceof Medium.Air) {
            return "air(" + ((Medium.Air) medium).model().spec() + ")";
        }
        return medium.spec();
    }

    /** The shortest decimal in {@code unit} whose value in SI is exactly {@code si}, if one is near. */
    private static String exactText(double si, Unit unit) {
        double value = unit.fromSi(si);
        if (unit.toSi(value) == si) {
            return DecimalText.shortest(value);
        }
        double up = value;
        double down = value;
        for (int i = 0; i < 4; i++) {
            up = Math.nextUp(up);
            if (unit.toSi(up) == si) {
                return DecimalText.shortest(up);
            }
            down = Math.nextDown(down);
            if (unit.toSi(down) == si) {
                return DecimalText.shortest(down);
            }
        }
        return DecimalText.shortest(value);
    }

    /** Value and uncertainty in concise form with two significant digits of uncertainty. */
    private static String concise(double value, double uncertainty) {
        if (uncertainty == 0) {
            return DecimalText.shortest(value) + "(0)";
        }
        BigDecimal u = new BigDecimal(uncertainty).round(new MathContext(2, RoundingMode.HALF_UP));
        int scale = u.scale();
        BigDecimal v = new BigDecimal(value).setScale(scale, RoundingMode.HALF_EVEN);
        String digits = u.unscaledValue().toString();
        if (v.signum() == 0) {
            return DecimalText.shortest(value) + " +- " + DecimalText.render(u);
        }
        int exponent = DecimalText.leadingExponent(v);
        if (scale >= 0 && exponent >= -4 && exponent <= 8) {
            return v.toPlainString() + "(" + digits + ")";
        }
        if (scale + exponent < 0) {
            // The uncertainty exceeds the leading digit: the concise form would hide it.
            return DecimalText.shortest(value) + " +- " + DecimalText.render(u);
        }
        return v.movePointLeft(exponent).toPlainString() + "(" + digits + ")e" + exponent;
    }

    private static String knownUnitsHint() {
        return "; known units: " + String.join(", ", Unit.knownSymbols());
    }

    /** One pass over one input text. */
    private final class Reader {
        private final String text;
        private int pos;

        Reader(String text) {
            this.text = text;
        }

        Quantity read() {
            skipBlanks();
            if (atEnd()) {
                throw fail(QuantityParseException.EMPTY, "empty; expected a number and a unit, e.g. 656.28 nm air");
            }
            int numberColumn = pos;
            Matcher mantissa = MANTISSA.matcher(text).region(pos, text.length());
            if (!mantissa.lookingAt()) {
                if (NOT_FINITE_WORD.matcher(text.substring(pos)).matches()) {
                    throw fail(QuantityParseException.NOT_FINITE, "the value must be a finite number");
                }
                throw fail(QuantityParseException.NO_NUMBER, "expected a number, found '" + word() + "'");
            }
            String mantissaText = mantissa.group();
            pos = mantissa.end();
            String conciseDigits = null;
            int conciseColumn = pos;
            Matcher concise = CONCISE.matcher(text).region(pos, text.length());
            if (concise.lookingAt()) {
                conciseDigits = concise.group(1);
                pos = concise.end();
            } else if (pos < text.length() && text.charAt(pos) == '(') {
                throw fail(QuantityParseException.BAD_UNCERTAINTY,
                        "expected digits in parentheses as a concise uncertainty, e.g. 656.28(2)");
            }
            String exponentText = "";
            Matcher exponent = EXPONENT.matcher(text).region(pos, text.length());
            if (exponent.lookingAt()) {
                exponentText = exponent.group();
                pos = exponent.end();
            }
            BigDecimal decimal = new BigDecimal(mantissaText + exponentText);
            double value = decimal.doubleValue();
            if (!Double.isFinite(value)) {
                pos = numberColumn;
                throw fail(QuantityParseException.NOT_FINITE, "the value is too large for a double");
            }
            if (value < 0 || mantissaText.startsWith("-")) {
                pos = numberColumn;
                throw fail(QuantityParseException.NEGATIVE, "the value must not be negative");
            }
            double uncertainty = Double.NaN;
            if (conciseDigits != null) {
                int decimals = new BigDecimal(mantissaText).scale();
                uncertainty = new BigDecimal(conciseDigits)
                        .movePointLeft(decimals)
                        .scaleByPowerOfTen(exponentOf(exponentText))
                        .doubleValue();
            }
            skipBlanks();
            int plusMinusColumn = pos;
            int plusMinusLength = plusMinusLength();
            if (plusMinusLength > 0) {
                if (conciseDigits != null) {
                    throw fail(QuantityParseException.BAD_UNCERTAINTY,
                            "the uncertainty is given twice (in parentheses at column " + (conciseColumn + 1)
                                    + " and after +-)");
                }
                pos += plusMinusLength;
                skipBlanks();
                Matcher number = UNSIGNED_NUMBER.matcher(text).region(pos, text.length());
                if (!number.lookingAt()) {
                    throw fail(QuantityParseException.BAD_UNCERTAINTY, "expected a number that is not negative"
                            + " after '" + text.substring(plusMinusColumn, plusMinusColumn + plusMinusLength)
                            + "', found '" + word() + "'");
                }
                uncertainty = Double.parseDouble(number.group());
                if (!Double.isFinite(uncertainty)) {
                    throw fail(QuantityParseException.BAD_UNCERTAINTY, "the uncertainty is too large for a double");
                }
                pos = number.end();
                skipBlanks();
            }
            if (atEnd()) {
                throw fail(QuantityParseException.MISSING_UNIT, "no unit after the number" + knownUnitsHint());
            }
            Unit unit = unit();
            if (value == 0 && (unit.kind() == Kind.WAVELENGTH || unit.kind() == Kind.FREQUENCY)) {
                pos = numberColumn;
                throw fail(QuantityParseException.NOT_POSITIVE, "a " + unit.kind().noun() + " must be positive");
            }
            if (!Double.isFinite(unit.toSi(value))) {
                pos = numberColumn;
                throw fail(QuantityParseException.NOT_FINITE, "the value is too large in SI units");
            }
            if (value != 0 && unit.toSi(value) == 0) {
                pos = numberColumn;
                throw fail(QuantityParseException.NOT_FINITE, DecimalText.shortest(value) + " " + unit.symbol()
                        + " is too small for a double in SI units");
            }
            Medium medium = medium(unit);
            expectEnd();
            return build(value, uncertainty, unit, medium);
        }

        private Quantity build(double value, double uncertainty, Unit unit, Medium medium) {
            return Quantity.of(value, uncertainty, unit, medium);
        }

        private int exponentOf(String exponentText) {
            return exponentText.isEmpty() ? 0 : Integer.parseInt(exponentText.substring(1).replace("+", ""));
        }

        private int plusMinusLength() {
            if (text.startsWith("+/-", pos)) {
                return 3;
            }
            if (text.startsWith("+-", pos)) {
                return 2;
            }
            if (text.startsWith("\u00b1", pos)) {
                return 1;
            }
            return 0;
        }

        Unit unit() {
            String token = word();
            Unit unit = Unit.fromSymbol(token).orElse(null);
            if (unit == null) {
                throw fail(QuantityParseException.UNKNOWN_UNIT, "unknown unit '" + token + "'" + unitHint(token));
            }
            pos += token.length();
            skipBlanks();
            return unit;
        }

        /** @return the medium after a wavelength unit, or null when none is written */
        Medium medium(Unit unit) {
            if (atEnd()) {
                return null;
            }
            String token = text.startsWith("air(", pos) && text.indexOf(')', pos) > 0
                    ? text.substring(pos, text.indexOf(')', pos) + 1) : word();
            Medium medium;
            if (token.equals("air")) {
                medium = air;
            } else if (token.equals("vacuum") || token.startsWith("air(")) {
                try {
                    medium = Medium.parse(token);
                } catch (MediumException e) {
                    throw fail(QuantityParseException.UNKNOWN_MEDIUM, e.getMessage());
                }
            } else {
                if (unit.kind() != Kind.WAVELENGTH) {
                    throw fail(QuantityParseException.TRAILING_TEXT, "unexpected '" + token + "' after the unit");
                }
                throw fail(QuantityParseException.UNKNOWN_MEDIUM, "unknown medium '" + token
                        + "'; expected vacuum, air or air(<model>), e.g. air(ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm)");
            }
            if (unit.kind() != Kind.WAVELENGTH) {
                throw fail(QuantityParseException.MEDIUM_NOT_ALLOWED, "a medium ('" + token + "') is given for a "
                        + unit.kind().noun() + " (" + unit.symbol() + "); only wavelengths have a medium");
            }
            pos += token.length();
            skipBlanks();
            return medium;
        }

        void expectEnd() {
            skipBlanks();
            if (!atEnd()) {
                throw fail(QuantityParseException.TRAILING_TEXT, "unexpected '" + text.substring(pos).strip() + "'");
            }
        }

        void skipBlanks() {
            while (pos < text.length() && Character.isWhitespace(text.charAt(pos))) {
                pos++;
            }
        }

        boolean atEnd() {
            return pos >= text.length();
        }

        private String word() {
            int end = pos;
            while (end < text.length() && !Character.isWhitespace(text.charAt(end))) {
                end++;
            }
            return text.substring(pos, end);
        }

        private QuantityParseException fail(String code, String reason) {
            return new QuantityParseException(code, text, pos + 1, reason);
        }
    }

    private static String unitHint(String token) {
        if (token.equals("A") || token.equals("AA")) {
            return "; write \u00c5 or Angstrom for the angstrom";
        }
        for (Unit unit : Unit.values()) {
            if (unit.symbol().equalsIgnoreCase(token)) {
                return "; did you mean '" + unit.symbol() + "'? (units are case-sensitive)";
            }
        }
        return knownUnitsHint();
    }

    @Override
    public String toString() {
        return String.format(Locale.ROOT, "QuantityText[air=%s]", air.model().spec());
    }
}
