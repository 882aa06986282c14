package org.ritzwerk.engine.calibrate;

import java.util.Objects;

/**
 * What one calibration starts from: a lamp exposure (counts per pixel, optionally their standard
 * uncertainties), the lamp's lines, what is known about the instrument before the search (a
 * {@link LampMatcher.Prior}), and a name for the exposure used in messages.
 *
 * <p>Built with {@link #builder(double[])}; immutable and thread-safe (arrays are copied in and
 * out).
 */
public final class CalibrationProblem {

    private final double[] counts;
    private final double[] sigmas;
    private final LampSet lamp;
    private final LampMatcher.Prior prior;
    private final String source;

    private CalibrationProblem(Builder b) {
        this.counts = b.counts;
        this.sigmas = b.sigmas;
        this.lamp = b.lamp;
        this.prior = b.prior;
        this.source = b.source;
    }

    /**
     * @param counts detector counts per pixel, in pixel order (copied); values are checked by the
     *               peak finder when the problem is solved
     * @return a builder
     */
    public static Builder builder(double[] counts) {
        return new Builder(counts);
    }

    /** @return the counts per pixel (a copy) */
    public double[] counts() {
        return counts.clone();
    }

    /** @return the counts' standard uncertainties (a copy), or null when not given */
    public double[] sigmas() {
        return sigmas == null ? null : sigmas.clone();
    }

    /** @return the number of pixels */
    public int pixels() {
        return counts.length;
    }

    /** @return the lamp's lines */
    public LampSet lamp() {
        return lamp;
    }

    /** @return the prior; {@link LampMatcher.Prior#none()} when nothing is known */
    public LampMatcher.Prior prior() {
        return prior;
    }

    /** @return the exposure's name, for messages (a file name, say) */
    public String source() {
        return source;
    }

    /** The counts without a copy, for the solver in this package (which only reads them). */
    double[] countsView() {
        return counts;
    }

    /** The count uncertainties without a copy (null when not given), for the solver. */
    double[] sigmasView() {
        return sigmas;
    }

    /** Builds a {@link CalibrationProblem}. Not thread-safe. */
    public static final class Builder {

        private final double[] counts;
        private double[] sigmas;
        private LampSet lamp;
        private LampMatcher.Prior prior = LampMatcher.Prior.none();
        private String source = "the exposure";

        private Builder(double[] counts) {
            this.counts = Objects.requireNonNull(counts, "counts").clone();
        }

        /**
         * @param sigmas standard uncertainties of the counts, one per pixel (copied); null for none
         *               (the peak finder's noise model is then used)
         * @return this builder
         */
        public Builder sigmas(double[] sigmas) {
            this.sigmas = sigmas == null ? null : sigmas.clone();
            return this;
        }

        /**
         * @param lamp the lamp's lines
         * @return this builder
         */
        public Builder lamp(LampSet lamp) {
            this.lamp = Objects.requireNonNull(lamp, "lamp");
            return this;
        }

        /**
         * @param prior the wavelength range and dispersion range the solution must lie in
         * @return this builder
         */
        public Builder prior(LampMatcher.Prior prior) {
            this.prior = Objects.requireNonNull(prior, "prior");
            return this;
        }

        /**
         * @param source a name for the exposure, used in messages and in the result's description
         * @return this builder
         */
        public Builder source(String source) {
            this.source = Objects.requireNonNull(source, "source");
            return this;
        }

        /**
         * @return the problem
         * @throws CalibrationException    ({@link CalibrationException#UNUSABLE_COUNTS}) for an
         *                                  exposure without pixels, as for every unusable count
         * @throws IllegalArgumentException when no lamp is given, or the uncertainties do not have one
         *                                  value per pixel
         */
        public CalibrationProblem build() {
            if (counts.length == 0) {
                throw new CalibrationException(CalibrationException.UNUSABLE_COUNTS, source
                        + ": the exposure has no pixels");
            }
            if (lamp == null) {
                throw new IllegalArgumentException("a calibration needs the lamp's lines (Builder.lamp)");
            }
            if (sigmas != null && sigmas.length != counts.length) {
                throw new IllegalArgumentException(source + ": " + counts.length + " pixels but " + sigmas.length
                        + " count uncertainties");
            }
            return new CalibrationProblem(this);
        }
    }
}
