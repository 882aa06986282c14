package org.ritzwerk.atom;

import java.util.Locale;
import java.util.Objects;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * An atom or ion: element, optionally a mass number, and a charge state with at least one
 * electron left. Immutable and thread-safe; equality is exact on the three components.
 *
 * <p>Text forms read by {@link #parse(String)}:
 * <ul>
 *   <li>spectroscopic notation, the spectrum number in Roman numerals being the charge plus
 *       one: {@code H I}, {@code He II}, {@code C VI}, {@code Rb-87 I}, {@code D I}, {@code T I};</li>
 *   <li>short forms: {@code H}, {@code D}, {@code He+}, {@code He++}, {@code C5+},
 *       {@code 87Rb}, {@code Rb-87+}.</li>
 * </ul>
 * {@code D} and {@code T} are hydrogen-2 and hydrogen-3. Without a mass number the isotope is
 * left to the data that resolves the species (the most abundant one, by convention).
 *
 * @param z          atomic number, 1 to 118
 * @param massNumber mass number A, or 0 when not specified
 * @param charge     charge in units of e, 0 to Z - 1
 */
public record Species(int z, int massNumber, int charge) {

    /** Largest mass number accepted; no nucleus known is heavier (common practice). */
    public static final int MAX_MASS_NUMBER = 300;

    private static final Pattern SPECTROSCOPIC =
            Pattern.compile("(?:(\\d+)\\s*)?([A-Z][a-z]?)(?:-(\\d+))?\\s+([IVXLC]+)");
    private static final Pattern SHORT =
            Pattern.compile("(?:(\\d+)\\s*)?([A-Z][a-z]?)(?:-(\\d+))?\\s*(?:(\\d*)(\\+)|(\\++))?");

    /**
     * Validates the components.
     *
     * @param z          atomic number, 1 to 118
     * @param massNumber mass number A, or 0 when not specified
     * @param charge     charge in units of e, 0 to Z - 1
     */
    public Species {
        if (z < 1 || z > Elements.MAX_Z) {
            throw new IllegalArgumentException("atomic number must be 1 to " + Elements.MAX_Z + ", got " + z);
        }
        if (massNumber != 0 && (massNumber < z || massNumber > MAX_MASS_NUMBER)) {
            throw new IllegalArgumentException("mass number of " + Elements.symbol(z) + " must be " + z + " to "
                    + MAX_MASS_NUMBER + " (or 0 for unspecified), got " + massNumber);
        }
        if (charge < 0 || charge >= z) {
            throw new IllegalArgumentException("charge of " + Elements.symbol(z) + " must be 0 to " + (z - 1)
                    + " (at least one electron), got " + charge);
        }
    }

    /**
     * @param z atomic number
     * @return the one-electron ion of that element (charge Z - 1), isotope unspecified
     */
    public static Species hydrogenLike(int z) {
        return new Species(z, 0, z - 1);
    }

    /**
     * @param text spectroscopic notation or a short form (see the class comment)
     * @return the species
     * @throws SpeciesParseException naming what is wrong
     */
    public static Species parse(String text) {
        Objects.requireNonNull(text, "text");
        String input = text.strip();
        Matcher spectroscopic = SPECTROSCOPIC.matcher(input);
        if (spectroscopic.matches()) {
            int spectrum = roman(input, spectroscopic.group(4));
            return build(input, spectroscopic.group(1), spectroscopic.group(2), spectroscopic.group(3), spectrum - 1);
        }
        Matcher shortForm = SHORT.matcher(input);
        if (shortForm.matches()) {
            int charge = 0;
            if (shortForm.group(5) != null) {
                charge = shortForm.group(4).isEmpty() ? 1 : Integer.parseInt(shortForm.group(4));
            } else if (shortForm.group(6) != null) {
                charge = shortForm.group(6).length();
            }
            return build(input, shortForm.group(1), shortForm.group(2), shortForm.group(3), charge);
        }
        throw new SpeciesParseException(SpeciesParseException.MALFORMED, input,
                "expected spectroscopic notation such as 'He II' or 'Rb-87 I', or a short form such as 'He+' or 'C5+'");
    }

    private static Species build(String input, String massBefore, String symbol, String massAfter, int charge) {
        if (massBefore != null && massAfter != null) {
            throw new SpeciesParseException(SpeciesParseException.MALFORMED, input, "the mass number is given twice");
        }
        int z;
        int massNumber = 0;
        if (symbol.equals("D") || symbol.equals("T")) {
            if (massBefore != null || massAfter != null) {
                throw new SpeciesParseException(SpeciesParseException.MALFORMED, input,
                        symbol + " already names an isotope; write H-" + (symbol.equals("D") ? 2 : 3) + " or " + symbol);
            }
            z = 1;
            massNumber = symbol.equals("D") ? 2 : 3;
        } else {
            z = Elements.atomicNumber(symbol).orElseThrow(() -> new SpeciesParseException(
                    SpeciesParseException.UNKNOWN_ELEMENT, input, "unknown element '" + symbol + "'"));
            String mass = massBefore != null ? massBefore : massAfter;
            if (mass != null) {
                massNumber = mass.length() > 3 ? Integer.MAX_VALUE : Integer.parseInt(mass);
                if (massNumber < z || massNumber > MAX_MASS_NUMBER) {
                    throw new SpeciesParseException(SpeciesParseException.IMPOSSIBLE_ISOTOPE, input,
                            "mass number " + mass + " is impossible for " + symbol + " (Z = " + z + "): it must be "
                                    + z + " to " + MAX_MASS_NUMBER);
                }
            }
        }
        if (charge >= z) {
            throw new SpeciesParseException(SpeciesParseException.IMPOSSIBLE_CHARGE, input, String.format(Locale.ROOT,
                    "charge %d (spectrum %s) is impossible for %s, which has %d electron%s: the highest is %s",
                    charge, romanOf(charge + 1), symbol, z, z == 1 ? "" : "s", romanOf(z)));
        }
        return new Species(z, massNumber, charge);
    }

    private static int roman(String input, String numeral) {
        int value = 0;
        for (int i = 0; i < numeral.length(); i++) {
            int digit = romanDigit(numeral.charAt(i));
            int next = i + 1 < numeral.length() ? romanDigit(numeral.charAt(i + 1)) : 0;
            value += digit < next ? -digit : digit;
        }
        if (value < 1 || !romanOf(value).equals(numeral)) {
            throw new SpeciesParseException(SpeciesParseException.MALFORMED, input,
                    "'" + numeral + "' is not a Roman numeral in canonical form (I, II, ..., IX, X, ...)");
        }
        return value;
    }

    private static int romanDigit(char c) {
        switch (c) {
            case 'I':
                return 1;
            case 'V':
                return 5;
            case 'X':
                return 10;
            case 'L':
                return 50;
            default:
                return 100;
        }
    }

    /**
     * @param value 1 to 399
     * @return the Roman numeral, e.g. {@code "VI"}
     */
    static String romanOf(int value) {
        int[] values = {100, 90, 50, 40, 10, 9, 5, 4, 1};
        String[] numerals = {"C", "XC", "L", "XL", "X", "IX", "V", "IV", "I"};
        StringBuilder text = new StringBuilder();
        int rest = value;
        for (int i = 0; i < values.length; i++) {
            while (rest >= values[i]) {
                text.append(numerals[i]);
                rest -= values[i];
            }
        }
        return text.toString();
    }

    /** @return {@code true} for a one-electron ion (or the hydrogen atom): charge Z - 1 */
    public boolean isHydrogenLike() {
        return charge == z - 1;
    }

    /** @return the element symbol */
    public String symbol() {
        return Elements.symbol(z);
    }

    /** @return the spectrum number, charge + 1 (I for neutral) */
    public int spectrumNumber() {
        return charge + 1;
    }

    /**
     * @return spectroscopic notation that {@link #parse(String)} reads back: {@code "He II"},
     *         {@code "D I"}, {@code "Rb-87 I"}
     */
    public String notation() {
        String element;
        if (z == 1 && massNumber == 2) {
            element = "D";
        } else if (z == 1 && massNumber == 3) {
            element = "T";
        } else {
            element = symbol() + (massNumber == 0 ? "" : "-" + massNumber);
        }
        return element + " " + romanOf(spectrumNumber());
    }

    @Override
    public String toString() {
        return notation();
    }
}
