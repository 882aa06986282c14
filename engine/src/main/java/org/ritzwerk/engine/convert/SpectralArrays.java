package org.ritzwerk.engine.convert;

import java.util.Objects;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.LineList;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * Converts columns of spectral positions (wavelength in a medium, wavenumber, frequency, photon
 * energy) from one unit to another, element by element, with the same physics as the typed
 * quantities: {@code nu = c / lambda_vac = c sigma = E / h}, exact SI h and c.
 *
 * <p>Between vacuum quantities every conversion is {@code out = K x} or {@code out = K / x}
 * (wavelength against the others), with K worked out once per call; an air wavelength is taken to
 * or from vacuum per element by its medium. Results agree with the typed quantities to a few
 * units in the last place (1e-15 relative).
 *
 * <p>Every element is checked: a non-finite or non-positive input, an overflowing result, or a
 * wavelength outside the air model's range stops the conversion with an exception that names the
 * element's index and value. Allocation-free; stateless and thread-safe (the arrays are the
 * caller's).
 */
public final class SpectralArrays {

    private SpectralArrays() {
    }

    /**
     * The positions of a line list (in its own unit and medium) as wavelengths in one unit and
     * medium, by {@link #convert}.
     *
     * @param list   a line list
     * @param unit   the wavelength unit wanted
     * @param medium the medium wanted
     * @return one wavelength per line, in list order
     * @throws IllegalArgumentException naming the list's id and the element that cannot be converted
     */
    public static double[] wavelengths(LineList list, Unit unit, Medium medium) {
        double[] positions = new double[list.size()];
        for (int i = 0; i < positions.length; i++) {
            positions[i] = list.position(i);
        }
        try {
            convert(positions, list.unit(), list.medium(), unit, medium, positions);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("line list " + list.info().id() + ": " + e.getMessage(), e);
        }
        return positions;
    }

    /**
     * @param values     input values in {@code from}, read only
     * @param from       unit of the input: wavelength, wavenumber, frequency or energy
     * @param fromMedium medium of input wavelengths (ignored for other kinds; may then be null)
     * @param to         unit of the output
     * @param toMedium   medium of output wavelengths (ignored for other kinds; may then be null)
     * @param out        output, same length as {@code values}; may be the same array
     * @throws IllegalArgumentException naming the first bad element's index and value, or for
     *                                  mismatched lengths or a temperature unit
     * @throws MediumException          (with the element index) outside an air model's range
     */
    public static void convert(double[] values, Unit from, Medium fromMedium, Unit to, Medium toMedium,
            double[] out) {
        Objects.requireNonNull(values, "values");
        Objects.requireNonNull(out, "out");
        if (values.length != out.length) {
            throw new IllegalArgumentException("values and out differ in length: " + values.length + " and "
                    + out.length);
        }
        Medium inAir = airOrNull(from, fromMedium, "fromMedium");
        Medium outAir = airOrNull(to, toMedium, "toMedium");
        // Between the vacuum ends of the chain the conversion is K x or K / x.
        Unit vacuumFrom = inAir == null ? from : Unit.METRE;
        Unit vacuumTo = outAir == null ? to : Unit.METRE;
        double k = vacuumChain(1.0, vacuumFrom, vacuumTo);
        boolean reciprocal = (vacuumFrom.kind() == Kind.WAVELENGTH) != (vacuumTo.kind() == Kind.WAVELENGTH);
        int i = 0;
        try {
            if (inAir == null && outAir == null) {
                for (; i < values.length; i++) {
                    double x = checked(values, i, from);
                    out[i] = checkedResult(reciprocal ? k / x : k * x, values, i, from);
                }
            } else {
                for (; i < values.length; i++) {
                    double x = checked(values, i, from);
                    double vacuum = inAir == null ? x : inAir.toVacuum(from.toSi(x));
                    double y = reciprocal ? k / vacuum : k * vacuum;
                    out[i] = checkedResult(outAir == null ? y : to.fromSi(outAir.fromVacuum(y)), values, i, from);
                }
            }
        } catch (MediumException e) {
            // (a single value needs no index: its caller names where it came from)
            throw new MediumException(e.code(), values.length == 1 ? e.getMessage() : "element " + i + ": "
                    + e.getMessage());
        }
    }

    /** @return the air medium of a wavelength unit, or null for vacuum and non-wavelength units */
    private static Medium airOrNull(Unit unit, Medium medium, String name) {
        if (unit.kind() == Kind.TEMPERATURE) {
            throw new IllegalArgumentException("a temperature unit is not a spectral position: " + unit.symbol());
        }
        if (unit.kind() != Kind.WAVELENGTH) {
            return null;
        }
        Objects.requireNonNull(medium, () -> name + " is required for wavelength unit " + unit.symbol());
        return medium instanceof Medium.Air ? medium : null;
    }

    private static double checked(double[] values, int i, Unit unit) {
        double value = values[i];
        if (!(value > 0) || !Double.isFinite(value)) {
            throw new IllegalArgumentException("element " + i + ": " + value + " " + unit.symbol()
                    + " is not a finite positive spectral position");
        }
        return value;
    }

    private static double checkedResult(double result, double[] values, int i, Unit unit) {
        if (!Double.isFinite(result) || result == 0) {
            throw new IllegalArgumentException("element " + i + ": " + values[i] + " " + unit.symbol()
                    + " converts to " + result + ", outside the range of a double");
        }
        return result;
    }

    /** One value through the whole chain, for vacuum wavelengths: unit, SI, hertz, SI, unit. */
    private static double vacuumChain(double value, Unit from, Unit to) {
        double si = from.toSi(value);
        double hertz;
        switch (from.kind()) {
            case WAVELENGTH:
                hertz = PhysicalConstants.C / si;
                break;
            case WAVENUMBER:
                hertz = si * PhysicalConstants.C;
                break;
            case FREQUENCY:
                hertz = si;
                break;
            default:
                hertz = si / PhysicalConstants.H;
                break;
        }
        switch (to.kind()) {
            case WAVELENGTH:
                return to.fromSi(PhysicalConstants.C / hertz);
            case WAVENUMBER:
                return to.fromSi(hertz / PhysicalConstants.C);
            case FREQUENCY:
                return to.fromSi(hertz);
            default:
                return to.fromSi(hertz * PhysicalConstants.H);
        }
    }
}
