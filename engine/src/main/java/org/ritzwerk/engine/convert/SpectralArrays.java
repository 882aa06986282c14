package org.ritzwerk.engine.convert;

import java.util.Objects;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * Converts columns of spectral positions (wavelength in a medium, wavenumber, frequency, photon
 * energy) from one unit to another, element by element, with the same physics as the typed
 * quantities ({@code nu = c / lambda_vac = c sigma = E / h}, exact SI h and c) and the same
 * results to the last bit or two.
 *
 * <p>Every element is checked: a non-finite or non-positive value, or a wavelength outside the
 * air model's range, stops the conversion with an exception that names the element's index and
 * value. Allocation-free; stateless and thread-safe (the arrays are the caller's).
 */
public final class SpectralArrays {

    private SpectralArrays() {
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
     * @throws MediumException          (re-thrown with the element index) outside an air model's range
     */
    public static void convert(double[] values, Unit from, Medium fromMedium, Unit to, Medium toMedium,
            double[] out) {
        Objects.requireNonNull(values, "values");
        Objects.requireNonNull(out, "out");
        if (values.length != out.length) {
            throw new IllegalArgumentException("values and out differ in length: " + values.length + " and "
                    + out.length);
        }
        Medium inMedium = requireMedium(from, fromMedium, "fromMedium");
        Medium outMedium = requireMedium(to, toMedium, "toMedium");
        for (int i = 0; i < values.length; i++) {
            double value = values[i];
            if (!(value > 0) || !Double.isFinite(value)) {
                throw new IllegalArgumentException("element " + i + ": " + value + " " + from.symbol()
                        + " is not a finite positive spectral position");
            }
            try {
                out[i] = fromFrequency(toFrequency(from.toSi(value), from.kind(), inMedium), to, outMedium);
            } catch (MediumException e) {
                throw new MediumException(e.code(), "element " + i + ": " + e.getMessage());
            }
        }
    }

    private static Medium requireMedium(Unit unit, Medium medium, String name) {
        if (unit.kind() == Kind.TEMPERATURE) {
            throw new IllegalArgumentException("a temperature unit is not a spectral position: " + unit.symbol());
        }
        if (unit.kind() == Kind.WAVELENGTH) {
            return Objects.requireNonNull(medium, name + " is required for wavelength unit " + unit.symbol());
        }
        return medium;
    }

    private static double toFrequency(double si, Kind kind, Medium medium) {
        switch (kind) {
            case WAVELENGTH:
                return PhysicalConstants.C / medium.toVacuum(si);
            case WAVENUMBER:
                return si * PhysicalConstants.C;
            case FREQUENCY:
                return si;
            default:
                return si / PhysicalConstants.H;
        }
    }

    private static double fromFrequency(double hertz, Unit unit, Medium medium) {
        switch (unit.kind()) {
            case WAVELENGTH:
                return unit.fromSi(medium.fromVacuum(PhysicalConstants.C / hertz));
            case WAVENUMBER:
                return unit.fromSi(hertz / PhysicalConstants.C);
            case FREQUENCY:
                return unit.fromSi(hertz);
            default:
                return unit.fromSi(hertz * PhysicalConstants.H);
        }
    }
}
