package org.ritzwerk.medium;

import java.util.Locale;
import java.util.Objects;
import org.ritzwerk.internal.DecimalText;

/**
 * The medium in which a wavelength is stated: vacuum, or air under a named refractive-index
 * model. Frequencies, wavenumbers and energies need no medium; wavelengths always carry one.
 *
 * <p>Conversions take and return wavelengths in metres. Vacuum to air is closed form
 * ({@code lambda_air = lambda_vac / n(lambda_vac)}); air to vacuum iterates
 * {@code lambda_vac = lambda_air n(lambda_vac)} until the error left, estimated from the
 * observed contraction (about 1e-5 per step for air), is below a quarter of the last bit: three
 * evaluations of the model in practice. A wavelength outside the air
 * model's validity range is refused with a {@link MediumException}, never extrapolated.
 *
 * <p>Immutable and thread-safe.
 */
public sealed interface Medium permits Medium.Vacuum, Medium.Air {

    /** @return vacuum */
    static Vacuum vacuum() {
        return Vacuum.INSTANCE;
    }

    /** @return air under {@link StandardAir}, the meaning of a plain "air" */
    static Air air() {
        return Air.STANDARD;
    }

    /**
     * @param model the refractive-index model; not null
     * @return air under that model
     */
    static Air air(AirModel model) {
        return new Air(model);
    }

    /**
     * @param text {@code vacuum}, {@code air} (standard air) or {@code air(<model spec>)}, the
     *             form {@link #spec()} writes
     * @return the medium
     * @throws MediumException for any other text, naming the accepted forms
     */
    static Medium parse(String text) {
        String t = text.strip();
        if (t.equals("vacuum")) {
            return vacuum();
        }
        if (t.equals("air")) {
            return air();
        }
        if (t.startsWith("air(") && t.endsWith(")")) {
            return air(AirModels.parse(t.substring(4, t.length() - 1)));
        }
        throw new MediumException(MediumException.UNKNOWN_MODEL, "unknown medium '" + t
                + "'; expected vacuum, air or air(<model>), e.g. air(ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm)");
    }

    /**
     * @param wavelengthMetres a wavelength in this medium, metres; finite and positive
     * @return the vacuum wavelength in metres
     * @throws MediumException when the wavelength is outside the air model's validity range
     */
    double toVacuum(double wavelengthMetres);

    /**
     * @param vacuumWavelengthMetres a vacuum wavelength in metres; finite and positive
     * @return the wavelength in this medium, metres
     * @throws MediumException when the wavelength is outside the air model's validity range
     */
    double fromVacuum(double vacuumWavelengthMetres);

    /**
     * The slope {@code d lambda_medium / d lambda_vac} at a vacuum wavelength, which carries a
     * standard uncertainty from one medium to the other (first order).
     *
     * @param vacuumWavelengthMetres a vacuum wavelength in metres within the validity range
     * @return the dimensionless slope; exactly 1 for vacuum
     */
    double slopeFromVacuum(double vacuumWavelengthMetres);

    /** @return {@code "vacuum"} or {@code "air"} */
    String label();

    /**
     * @return text naming the medium that the quantity parser reads back: {@code "vacuum"},
     *         {@code "air"} (standard air) or {@code "air(<model spec>)"}
     */
    String spec();

    /** Vacuum: the identity medium. */
    enum Vacuum implements Medium {
        /** The one instance. */
        INSTANCE;

        @Override
        public double toVacuum(double wavelengthMetres) {
            return wavelengthMetres;
        }

        @Override
        public double fromVacuum(double vacuumWavelengthMetres) {
            return vacuumWavelengthMetres;
        }

        @Override
        public double slopeFromVacuum(double vacuumWavelengthMetres) {
            return 1;
        }

        @Override
        public String label() {
            return "vacuum";
        }

        @Override
        public String spec() {
            return "vacuum";
        }

        /** @return {@code "vacuum"}, as {@link #spec()} */
        @Override
        public String toString() {
            return spec();
        }
    }

    /**
     * Air under a refractive-index model.
     *
     * @param model the refractive-index model
     */
    record Air(AirModel model) implements Medium {

        static final Air STANDARD = new Air(StandardAir.INSTANCE);

        private static final int MAX_ITERATIONS = 50;
        /** Below this, wavelengths are stated in vacuum by convention (common practice). */
        private static final double VACUUM_CONVENTION_METRES = 200e-9;
        /** Relative step of the central difference for dn/d lambda. */
        private static final double SLOPE_STEP = 1e-5;

        /** @param model the refractive-index model; not null */
        public Air {
            Objects.requireNonNull(model, "model");
        }

        @Override
        public double fromVacuum(double vacuumWavelengthMetres) {
            checkRange(vacuumWavelengthMetres, vacuumWavelengthMetres, "vacuum");
            return vacuumWavelengthMetres / model.refractiveIndex(vacuumWavelengthMetres);
        }

        @Override
        public double toVacuum(double wavelengthMetres) {
            // Refuse early what is surely outside (n - 1 < 1e-3 for any air), so the formula is
            // never evaluated near its poles; then check exactly on the vacuum wavelength.
            if (!(wavelengthMetres * 1.001 >= model.minVacuumWavelengthMetres()
                    && wavelengthMetres <= model.maxVacuumWavelengthMetres())) {
                throw outside(wavelengthMetres, "air");
            }
            double vacuum = wavelengthMetres * model.refractiveIndex(wavelengthMetres);
            double previousStep = Double.NaN;
            for (int i = 0; i < MAX_ITERATIONS; i++) {
                double next = wavelengthMetres * model.refractiveIndex(vacuum);
                double step = Math.abs(next - vacuum);
                vacuum = next;
                if (step == 0) {
                    break;
                }
                // Linear convergence with ratio q: the error left after this step is about
                // step q / (1 - q). Stop once that is below a quarter of the last bit.
                double q = step / previousStep;
                if (q < 0.5 && step * q / (1 - q) <= 0.25 * Math.ulp(vacuum)) {
                    break;
                }
                previousStep = step;
            }
            checkRange(vacuum, wavelengthMetres, "air");
            return vacuum;
        }

        @Override
        public double slopeFromVacuum(double vacuumWavelengthMetres) {
            double n = model.refractiveIndex(vacuumWavelengthMetres);
            double h = vacuumWavelengthMetres * SLOPE_STEP;
            double dn = (model.refractiveIndex(vacuumWavelengthMetres + h)
                    - model.refractiveIndex(vacuumWavelengthMetres - h)) / (2 * h);
            return 1 / n - vacuumWavelengthMetres * dn / (n * n);
        }

        @Override
        public String label() {
            return "air";
        }

        @Override
        public String spec() {
            return model.equals(StandardAir.INSTANCE) ? "air" : "air(" + model.spec() + ")";
        }

        /** @return as {@link #spec()}: {@code "air"} or {@code "air(<model spec>)"} */
        @Override
        public String toString() {
            return spec();
        }

        private void checkRange(double vacuumMetres, double givenMetres, String givenMedium) {
            if (!(vacuumMetres >= model.minVacuumWavelengthMetres()
                    && vacuumMetres <= model.maxVacuumWavelengthMetres())) {
                throw outside(givenMetres, givenMedium);
            }
        }

        private MediumException outside(double givenMetres, String givenMedium) {
            String hint = givenMetres < VACUUM_CONVENTION_METRES
                    ? "; below 200 nm wavelengths are given in vacuum by convention, so state 'vacuum'"
                    : "";
            return new MediumException(MediumException.OUTSIDE_VALIDITY, String.format(Locale.ROOT,
                    "wavelength %s nm (%s) is outside the range of the air model %s: %s nm to %s nm in vacuum%s",
                    DecimalText.compact(givenMetres * 1e9, 12), givenMedium, model.spec(),
                    DecimalText.compact(model.minVacuumWavelengthMetres() * 1e9, 12),
                    DecimalText.compact(model.maxVacuumWavelengthMetres() * 1e9, 12), hint));
        }
    }
}
