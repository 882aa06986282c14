package org.ritzwerk.constants;

import java.util.Objects;

/**
 * One physical constant of a named edition: value and standard uncertainty in SI units.
 *
 * <p>Immutable and thread-safe. Equality is exact on every component.
 *
 * @param name                the constant's name as the edition prints it, e.g. "Rydberg constant"
 * @param symbol              a short ASCII symbol, e.g. {@code R_inf}
 * @param value               the value in {@code unit}; finite
 * @param standardUncertainty the standard uncertainty in {@code unit}; {@code 0} for a constant
 *                            that is exact by the definition of the SI (2019); finite, not negative
 * @param unit                the SI unit, e.g. {@code "m^-1"}, {@code "J s"}, or {@code ""} for a pure number
 */
public record Constant(String name, String symbol, double value, double standardUncertainty, String unit) {

    /**
     * Validates every component.
     *
     * @param name                the constant's name as the edition prints it, e.g. "Rydberg constant"
     * @param symbol              a short ASCII symbol, e.g. {@code R_inf}
     * @param value               the value in {@code unit}; finite
     * @param standardUncertainty the standard uncertainty in {@code unit}; {@code 0} for a constant
     *                            that is exact by the definition of the SI (2019); finite, not negative
     * @param unit                the SI unit, e.g. {@code "m^-1"}, {@code "J s"}, or {@code ""} for a pure number
     */
    public Constant {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(symbol, "symbol");
        Objects.requireNonNull(unit, "unit");
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("constant " + symbol + ": value must be finite, got " + value);
        }
        if (!(standardUncertainty >= 0) || Double.isInfinite(standardUncertainty)) {
            throw new IllegalArgumentException("constant " + symbol
                    + ": standard uncertainty must be finite and not negative, got " + standardUncertainty);
        }
    }

    /** @return {@code true} when the constant is exact (zero uncertainty) by definition of the SI */
    public boolean isExact() {
        return standardUncertainty == 0;
    }

    /** @return the relative standard uncertainty {@code u / |value|}; {@code 0} for exact constants */
    public double relativeUncertainty() {
        return standardUncertainty == 0 ? 0 : standardUncertainty / Math.abs(value);
    }
}
