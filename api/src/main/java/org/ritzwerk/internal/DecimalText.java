package org.ritzwerk.internal;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.regex.Pattern;

/**
 * Decimal text of doubles shared by the quantity and medium packages: the shortest text that
 * reads back to the same double, in plain notation for moderate magnitudes and with an exponent
 * otherwise. Not exported; stateless and thread-safe.
 */
public final class DecimalText {

    /** Smallest magnitude printed without an exponent. */
    private static final int MIN_PLAIN_EXPONENT = -4;
    /** Largest decimal exponent printed without an exponent. */
    private static final int MAX_PLAIN_EXPONENT = 8;

    /** A plain decimal number: optional sign, digits with optional point, optional exponent. */
    private static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?");

    private DecimalText() {
    }

    /**
     * @param text candidate text
     * @return {@code true} when the whole text is a plain decimal number such as {@code -1.5e-3}
     *         (no {@code NaN}, {@code Infinity}, hexadecimal or type suffixes)
     */
    public static boolean isDecimal(String text) {
        return DECIMAL.matcher(text).matches();
    }

    /**
     * @param value a finite double
     * @return text that {@link Double#parseDouble} reads back to exactly {@code value}, e.g.
     *         {@code "656.279"}, {@code "1.5e-19"}, {@code "0"}
     */
    public static String shortest(double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("not a finite number: " + value);
        }
        if (value == 0) {
            return (1 / value < 0) ? "-0" : "0";
        }
        return render(new BigDecimal(Double.toString(value)).stripTrailingZeros());
    }

    /**
     * @param value  a finite double
     * @param digits significant digits, 1 to 17
     * @return {@code value} rounded half-even to {@code digits} significant digits, as text that
     *         keeps trailing zeros ({@code 208.510} for six digits)
     */
    public static String significant(double value, int digits) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("not a finite number: " + value);
        }
        if (digits < 1 || digits > 17) {
            throw new IllegalArgumentException("significant digits must be 1 to 17, got " + digits);
        }
        if (value == 0) {
            return "0";
        }
        BigDecimal rounded = new BigDecimal(value).round(new MathContext(digits, RoundingMode.HALF_EVEN));
        return render(rounded);
    }

    /**
     * @param value  a finite double
     * @param digits significant digits, 1 to 17
     * @return {@code value} rounded to {@code digits} significant digits without trailing zeros,
     *         for messages ({@code 150} rather than {@code 150.000000000})
     */
    public static String compact(double value, int digits) {
        if (value == 0) {
            return "0";
        }
        return render(new BigDecimal(significant(value, digits).replace("e", "E")).stripTrailingZeros());
    }

    /**
     * @param decimal a decimal number
     * @return the decimal exponent of its leading digit, e.g. 2 for 656.28, -7 for 6.5e-7
     */
    public static int leadingExponent(BigDecimal decimal) {
        return decimal.precision() - decimal.scale() - 1;
    }

    /**
     * Renders a decimal in plain notation for leading exponents -4..8, else as mantissa and
     * exponent ({@code 6.62607015e-34}).
     *
     * @param decimal a decimal number, with trailing zeros as they should print
     * @return the text
     */
    public static String render(BigDecimal decimal) {
        if (decimal.signum() == 0) {
            return decimal.scale() > 0 ? decimal.toPlainString() : "0";
        }
        int exponent = leadingExponent(decimal);
        if (exponent >= MIN_PLAIN_EXPONENT && exponent <= MAX_PLAIN_EXPONENT) {
            return decimal.toPlainString();
        }
        BigDecimal mantissa = decimal.movePointLeft(exponent);
        return mantissa.toPlainString() + "e" + exponent;
    }
}
