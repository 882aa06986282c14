package org.ritzwerk.quantity;

import java.util.OptionalDouble;
import org.ritzwerk.medium.Medium;

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

    /**
     * The quantity of the unit's kind: a {@link Wavelength} in the given medium, a
     * {@link Wavenumber}, {@link Frequency}, {@link Energy} or {@link Temperature}.
     *
     * @param value       the value in that unit
     * @param uncertainty its standard uncertainty in that unit, or NaN when none is stated
     * @param unit        the unit, whose kind chooses the type
     * @param medium      a wavelength's medium (vacuum when null); not used for the other kinds
     * @return the quantity, through the type's own factory and its checks
     * @throws IllegalArgumentException as that factory refuses the value or the uncertainty
     */
    static Quantity of(double value, double uncertainty, Unit unit, Medium medium) {
        boolean stated = !Double.isNaN(uncertainty);
        switch (unit.kind()) {
            case WAVELENGTH: {
                Medium m = medium == null ? Medium.vacuum() : medium;
                return stated ? Wavelength.of(value, uncertainty, unit, m) : Wavelength.of(value, unit, m);
            }
            case WAVENUMBER:
                return stated ? Wavenumber.of(value, uncertainty, unit) : Wavenumber.of(value, unit);
            case FREQUENCY:
                return stated ? Frequency.of(value, uncertainty, unit) : Frequency.of(value, unit);
            case ENERGY:
                return stated ? Energy.of(value, uncertainty, unit) : Energy.of(value, unit);
            default:
                return stated ? Temperature.of(value, uncertainty, unit) : Temperature.of(value, unit);
        }
    }
}
