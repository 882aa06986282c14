package org.ritzwerk.quantity;

import java.util.OptionalDouble;

/**
 * A typed physical quantity: one value in its kind's canonical SI unit, with an optional
 * standard uncertainty.
 *
 * <p>Every implementation is immutable and thread-safe. {@code equals} is exact (value,
 * uncertainty and, for wavelengths, medium); {@link #isCloseTo(Quantity, double)} compares with a
 * tolerance. Values and uncertainties are finite: NaN and infinities are refused by the factories,
 * never stored.
 */
public sealed interface Quantity permits SpectralQuantity, Temperature {

    /** @return the kind of this quantity */
    Kind kind();

    /**
     * @param unit a unit of this quantity's kind (for a wavelength: in its own medium)
     * @return the value in that unit
     * @throws IllegalArgumentException when the unit is of another kind
     */
    double valueIn(Unit unit);

    /**
     * @param unit a unit of this quantity's kind
     * @return the standard uncertainty in that unit, or empty when none was stated
     * @throws IllegalArgumentException when the unit is of another kind
     */
    OptionalDouble uncertaintyIn(Unit unit);

    /** @return {@code true} when a standard uncertainty was stated */
    boolean hasUncertainty();

    /**
     * @param other  another quantity
     * @param relTol relative tolerance, not negative
     * @return {@code true} when both are of the same type (and medium) and their values differ by
     *         at most {@code relTol} times the larger magnitude; uncertainties are not compared
     */
    boolean isCloseTo(Quantity other, double relTol);
}
