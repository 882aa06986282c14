package org.ritzwerk.quantity;

import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;
import org.ritzwerk.internal.DecimalText;

/**
 * What every quantity shares: the value in the canonical SI unit and the standard uncertainty in
 * the same unit, NaN standing for "not stated" (never exposed as NaN).
 */
abstract class AbstractQuantity {

    /** The value in the canonical SI unit of the kind. */
    final double si;
    /** The standard uncertainty in the canonical SI unit, NaN when not stated. */
    final double u;

    AbstractQuantity(double si, double u) {
        if (Double.isInfinite(u)) {
            // Only a conversion can get here (factories refuse infinite uncertainties): first-order
            // propagation of a huge uncertainty through a steep conversion overflowed.
            throw new ConversionException(ConversionException.UNCERTAINTY_OVERFLOW, "the standard uncertainty is "
                    + "too large to convert: it becomes infinite for the " + getClass().getSimpleName().toLowerCase(
                            java.util.Locale.ROOT) + " " + DecimalText.significant(displayUnit().fromSi(si), 6) + " "
                    + displayUnit().symbol() + "; give a smaller uncertainty");
        }
        this.si = si;
        this.u = u;
    }

    abstract Kind kind();

    /** @return the unit {@link #toString()} prints in */
    abstract Unit displayUnit();

    /**
     * @param unit a unit of this quantity's kind (for a wavelength: in its own medium)
     * @return the value in that unit
     * @throws IllegalArgumentException when the unit is of another kind
     */
    public final double valueIn(Unit unit) {
        unit.requireKind(kind());
        return unit.fromSi(si);
    }

    /**
     * @param unit a unit of this quantity's kind
     * @return the standard uncertainty in that unit (not negative), or empty when none was stated
     * @throws IllegalArgumentException when the unit is of another kind
     */
    public final OptionalDouble uncertaintyIn(Unit unit) {
        unit.requireKind(kind());
        return Double.isNaN(u) ? OptionalDouble.empty() : OptionalDouble.of(Math.abs(unit.fromSi(u)));
    }

    /** @return {@code true} when a standard uncertainty was stated */
    public final boolean hasUncertainty() {
        return !Double.isNaN(u);
    }

    /** @return the relative standard uncertainty, NaN when none was stated */
    final double relativeUncertainty() {
        return u / Math.abs(si);
    }

    /**
     * @param other  another quantity
     * @param relTol relative tolerance (dimensionless), not negative
     * @return {@code true} when both are of the same type (and medium) and their SI values differ by
     *         at most {@code relTol} times the larger magnitude; uncertainties are not compared
     * @throws IllegalArgumentException when {@code relTol} is negative or NaN
     */
    public boolean isCloseTo(Quantity other, double relTol) {
        if (!(relTol >= 0)) {
            throw new IllegalArgumentException("relative tolerance must be >= 0, got " + relTol);
        }
        if (other == null || other.getClass() != getClass() || !sameFrame((AbstractQuantity) other)) {
            return false;
        }
        double a = si;
        double b = ((AbstractQuantity) other).si;
        return Math.abs(a - b) <= relTol * Math.max(Math.abs(a), Math.abs(b));
    }

    /** @return {@code true} when {@code other} (of the same class) is stated in the same frame (medium) */
    boolean sameFrame(AbstractQuantity other) {
        return true;
    }

    @Override
    public boolean equals(Object o) {
        if (this == o) {
            return true;
        }
        if (o == null || o.getClass() != getClass()) {
            return false;
        }
        AbstractQuantity that = (AbstractQuantity) o;
        return Double.compare(si, that.si) == 0 && Double.compare(u, that.u) == 0 && sameFrame(that);
    }

    @Override
    public int hashCode() {
        return Objects.hash(getClass(), si, u);
    }

    @Override
    public String toString() {
        Unit unit = displayUnit();
        String value = DecimalText.shortest(unit.fromSi(si));
        String uncertainty = Double.isNaN(u) ? "" : " +- " + DecimalText.shortest(Math.abs(unit.fromSi(u)));
        return String.format(Locale.ROOT, "%s[%s%s %s]", getClass().getSimpleName(), value, uncertainty,
                unit.symbol()) ;
    }

    /**
     * Checks a factory's value.
     *
     * @param what     the parameter, e.g. "wavelength"
     * @param value    the value in {@code unit}
     * @param unit     the unit the caller used
     * @param positive whether zero and negative values are refused (else any finite value)
     */
    static void checkValue(String what, double value, Unit unit, boolean positive) {
        if (!Double.isFinite(value) || !Double.isFinite(unit.toSi(value))) {
            throw new IllegalArgumentException(what + " must be a finite number of " + unit.symbol() + ", got "
                    + shown(value) + (Double.isFinite(value) ? " " + unit.symbol() + ", which overflows in SI" : ""));
        }
        if (positive && !(value > 0)) {
            throw new IllegalArgumentException(what + " must be positive, got " + DecimalText.shortest(value)
                    + " " + unit.symbol());
        }
        if (value != 0 && unit.toSi(value) == 0) {
            throw new IllegalArgumentException(what + " of " + DecimalText.shortest(value) + " " + unit.symbol()
                    + " is too small for a double in SI units");
        }
    }

    /**
     * A value for a message: the shortest decimal that reads back to it, or words for NaN and the
     * infinities (which a message never prints as such; they come from the user's or a
     * conversion's overflow).
     *
     * @param value the value
     * @return its text
     */
    static String shown(double value) {
        if (Double.isNaN(value)) {
            return "a value that is not a number";
        }
        if (Double.isInfinite(value)) {
            return (value > 0 ? "" : "minus ") + "a value too large for a double";
        }
        return DecimalText.shortest(value);
    }

    /**
     * Checks a factory's standard uncertainty.
     *
     * @return the uncertainty in SI
     */
    static double checkedUncertainty(String what, double uncertainty, Unit unit) {
        if (!Double.isFinite(uncertainty) || uncertainty < 0) {
            throw new IllegalArgumentException("standard uncertainty of the " + what
                    + " must be a finite number >= 0 " + unit.symbol() + ", got " + shown(uncertainty));
        }
        return Math.abs(unit.toSi(uncertainty));
    }
}
