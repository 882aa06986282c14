package org.ritzwerk.data;

import java.util.Objects;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Nucleus;

/**
 * One isotope's nuclear data as tabulated. Immutable.
 *
 * @param z                     atomic number
 * @param massNumber            mass number
 * @param atomicMass            neutral-atom mass in u
 * @param atomicMassUncertainty its standard uncertainty in u
 * @param twiceSpin             twice the nuclear spin
 * @param magneticMoment        magnetic moment in nuclear magnetons (empty for spin 0)
 * @param chargeRadiusFm        rms charge radius in fm (empty when not tabulated)
 * @param source                the source keys of the values
 */
public record Isotope(int z, int massNumber, double atomicMass, double atomicMassUncertainty, int twiceSpin,
        OptionalDouble magneticMoment, OptionalDouble chargeRadiusFm, String source) {

    /** Validates the components that must be present. */
    public Isotope {
        Objects.requireNonNull(magneticMoment, "magneticMoment");
        Objects.requireNonNull(chargeRadiusFm, "chargeRadiusFm");
        Objects.requireNonNull(source, "source");
    }

    /** @return the nucleus the level models take */
    public Nucleus nucleus() {
        OptionalDouble radius = chargeRadiusFm.isPresent()
                ? OptionalDouble.of(chargeRadiusFm.getAsDouble() * 1e-15) : OptionalDouble.empty();
        return new Nucleus(z, massNumber, Nucleus.nuclearMassKg(z, atomicMass), twiceSpin, magneticMoment, radius,
                source);
    }
}
