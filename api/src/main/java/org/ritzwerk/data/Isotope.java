package org.ritzwerk.data;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Nucleus;

/**
 * One isotope's nuclear data as tabulated. Immutable.
 *
 * <p>An isotope read from an isotope file ({@link #tabulated}) also carries the standard
 * uncertainties of its moment and radius and the separate source keys of its mass, moment (with
 * spin) and radius, so that it can be written back to the same file format;
 * {@link #source()} is then those keys rendered as one text. An isotope made with the
 * eight-argument constructor has a free-text source and no keys.
 *
 * @param z                          atomic number
 * @param massNumber                 mass number
 * @param atomicMass                 neutral-atom mass in u
 * @param atomicMassUncertainty      its standard uncertainty in u
 * @param twiceSpin                  twice the nuclear spin
 * @param magneticMoment             magnetic moment in nuclear magnetons (empty for spin 0)
 * @param chargeRadiusFm             rms charge radius in fm (empty when not tabulated)
 * @param source                     the source keys of the values, as one text
 * @param magneticMomentUncertainty  the moment's standard uncertainty in nuclear magnetons;
 *                                   empty when not given (always when there is no moment)
 * @param chargeRadiusUncertaintyFm  the radius' standard uncertainty in fm; empty when not given
 *                                   (always when there is no radius)
 * @param sourceKeys                 the separate source keys, when the isotope was tabulated with
 *                                   them; then {@code source} is {@link SourceKeys#render()}
 */
public record Isotope(int z, int massNumber, double atomicMass, double atomicMassUncertainty, int twiceSpin,
        OptionalDouble magneticMoment, OptionalDouble chargeRadiusFm, String source,
        OptionalDouble magneticMomentUncertainty, OptionalDouble chargeRadiusUncertaintyFm,
        Optional<SourceKeys> sourceKeys) {

    /**
     * Validates the components that must be present, and that the extra ones agree with the rest.
     *
     * @param z                          atomic number
     * @param massNumber                 mass number
     * @param atomicMass                 neutral-atom mass in u
     * @param atomicMassUncertainty      its standard uncertainty in u
     * @param twiceSpin                  twice the nuclear spin
     * @param magneticMoment             magnetic moment in nuclear magnetons (empty for spin 0)
     * @param chargeRadiusFm             rms charge radius in fm (empty when not tabulated)
     * @param source                     the source keys of the values, as one text
     * @param magneticMomentUncertainty  the moment's standard uncertainty in nuclear magnetons;
     *                                   empty when not given (always when there is no moment)
     * @param chargeRadiusUncertaintyFm  the radius' standard uncertainty in fm; empty when not given
     *                                   (always when there is no radius)
     * @param sourceKeys                 the separate source keys, when the isotope was tabulated with
     *                                   them; then {@code source} is {@link SourceKeys#render()}
     * @throws IllegalArgumentException when an uncertainty is given without its value, or the
     *                                  source is not the rendered source keys
     */
    public Isotope {
        Objects.requireNonNull(magneticMoment, "magneticMoment");
        Objects.requireNonNull(chargeRadiusFm, "chargeRadiusFm");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(magneticMomentUncertainty, "magneticMomentUncertainty");
        Objects.requireNonNull(chargeRadiusUncertaintyFm, "chargeRadiusUncertaintyFm");
        Objects.requireNonNull(sourceKeys, "sourceKeys");
        if (magneticMomentUncertainty.isPresent() && magneticMoment.isEmpty()) {
            throw new IllegalArgumentException("isotope Z = " + z + ", A = " + massNumber
                    + ": a moment uncertainty without a moment");
        }
        if (chargeRadiusUncertaintyFm.isPresent() && chargeRadiusFm.isEmpty()) {
            throw new IllegalArgumentException("isotope Z = " + z + ", A = " + massNumber
                    + ": a radius uncertainty without a radius");
        }
        if (sourceKeys.isPresent() && !sourceKeys.get().render().equals(source)) {
            throw new IllegalArgumentException("isotope Z = " + z + ", A = " + massNumber + ": source '" + source
                    + "' is not its source keys '" + sourceKeys.get().render() + "'");
        }
    }

    /**
     * An isotope with a free-text source and no uncertainties of moment and radius (the form a
     * provider may build by hand).
     *
     * @param z                     atomic number
     * @param massNumber            mass number
     * @param atomicMass            neutral-atom mass in u
     * @param atomicMassUncertainty its standard uncertainty in u
     * @param twiceSpin             twice the nuclear spin
     * @param magneticMoment        magnetic moment in nuclear magnetons (empty for spin 0)
     * @param chargeRadiusFm        rms charge radius in fm (empty when not tabulated)
     * @param source                the source of the values
     */
    public Isotope(int z, int massNumber, double atomicMass, double atomicMassUncertainty, int twiceSpin,
            OptionalDouble magneticMoment, OptionalDouble chargeRadiusFm, String source) {
        this(z, massNumber, atomicMass, atomicMassUncertainty, twiceSpin, magneticMoment, chargeRadiusFm, source,
                OptionalDouble.empty(), OptionalDouble.empty(), Optional.empty());
    }

    /**
     * An isotope as an isotope file tabulates it: every value with its uncertainty and source key.
     *
     * @param z                         atomic number
     * @param massNumber                mass number
     * @param atomicMass                neutral-atom mass in u
     * @param atomicMassUncertainty     its standard uncertainty in u
     * @param twiceSpin                 twice the nuclear spin
     * @param magneticMoment            magnetic moment in nuclear magnetons (empty for spin 0)
     * @param magneticMomentUncertainty its standard uncertainty (empty when not given)
     * @param chargeRadiusFm            rms charge radius in fm (empty when not tabulated)
     * @param chargeRadiusUncertaintyFm its standard uncertainty in fm (empty when not given)
     * @param keys                      the source keys
     * @return the isotope; its {@link #source()} is {@code keys.render()}
     */
    public static Isotope tabulated(int z, int massNumber, double atomicMass, double atomicMassUncertainty,
            int twiceSpin, OptionalDouble magneticMoment, OptionalDouble magneticMomentUncertainty,
            OptionalDouble chargeRadiusFm, OptionalDouble chargeRadiusUncertaintyFm, SourceKeys keys) {
        return new Isotope(z, massNumber, atomicMass, atomicMassUncertainty, twiceSpin, magneticMoment,
                chargeRadiusFm, keys.render(), magneticMomentUncertainty, chargeRadiusUncertaintyFm, Optional.of(keys));
    }

    /** @return the nucleus the level models take */
    public Nucleus nucleus() {
        OptionalDouble radius = chargeRadiusFm.isPresent()
                ? OptionalDouble.of(chargeRadiusFm.getAsDouble() * 1e-15) : OptionalDouble.empty();
        return new Nucleus(z, massNumber, Nucleus.nuclearMassKg(z, atomicMass), twiceSpin, magneticMoment, radius,
                source);
    }

    /**
     * The source keys of an isotope file row.
     *
     * @param mass   the key of the mass (e.g. {@code AME2020})
     * @param moment the key of the moment and spin (e.g. {@code CODATA2018;spin=bodr10}); may be
     *               empty
     * @param radius the key of the radius; empty when there is no radius
     */
    public record SourceKeys(String mass, String moment, String radius) {

        /**
         * Validates: no key holds a comma or a line break (they are CSV fields).
         *
         * @param mass   the key of the mass (e.g. {@code AME2020})
         * @param moment the key of the moment and spin (e.g. {@code CODATA2018;spin=bodr10}); may be
         *               empty
         * @param radius the key of the radius; empty when there is no radius
         */
        public SourceKeys {
            for (String key : new String[] {mass, moment, radius}) {
                Objects.requireNonNull(key, "key");
                if (key.indexOf(',') >= 0 || key.indexOf('\n') >= 0 || key.indexOf('\r') >= 0) {
                    throw new IllegalArgumentException("a source key must hold no comma or line break, got '" + key
                            + "'");
                }
            }
        }

        /** @return the keys as one text, as {@link Isotope#source()} gives them */
        public String render() {
            return "mass " + mass + "; " + moment + "; radius " + (radius.isEmpty() ? "none" : radius);
        }
    }
}
