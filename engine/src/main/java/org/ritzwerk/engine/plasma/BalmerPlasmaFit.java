package org.ritzwerk.engine.plasma;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeSet;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeLines;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.LineTable;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.profile.BalmerStark;
import org.ritzwerk.engine.profile.Broadening;
import org.ritzwerk.medium.Medium;

/**
 * Temperature and electron density of a hydrogen plasma from its Balmer lines in a calibrated
 * spectrum, fitting each line's profile rather than taking peak widths:
 * <ol>
 *   <li>each Balmer multiplet n -&gt; 2 is fitted as a Voigt profile on a straight baseline
 *       ({@link VoigtLineFit}) over the pixels within a half-window of its predicted position
 *       (rest wavelength in the axis medium, times 1 + z). The Gaussian FWHM is known:
 *       sqrt(w_instrument^2 + w_Doppler^2), the Doppler FWHM
 *       w_D = lambda sqrt(8 k T ln 2 / (m c^2)) at a fixed temperature (10,000 K by default;
 *       it is small beside the response of a compact spectrometer) for the atom's mass m. An
 *       isotope's line (D beside H) rides along at its predicted offset with a fixed flux
 *       ratio and the same widths;</li>
 *   <li>the fitted photon fluxes give the excitation temperature from a Boltzmann plot
 *       ({@link BoltzmannPlot}, I / (g_u A) proportional to exp(-E_u / kT), photons counted),
 *       with g_u = 2 n^2, the multiplet's A and E_u = E(n) - E(1) of the model;</li>
 *   <li>the fitted Lorentzian FWHM of H-beta (else H-alpha) is the Stark width, which gives the
 *       electron density through {@link BalmerStark} (the fit of Gigosos, Gonzalez and Cardenoso,
 *       Spectrochim. Acta B 58, 1489 (2003)).</li>
 * </ol>
 * A line whose fit fails is reported with the reason and left out; so is a temperature with
 * fewer than three fitted lines, or a density whose width lies outside the Stark fit's range.
 *
 * <p>Problem built by {@link #problem}; the solver is configured with {@code withX}, immutable,
 * reusable and thread-safe.
 */
public final class BalmerPlasmaFit {

    /** Doppler temperature used unless another is given, K (common practice for such plasmas). */
    public static final double DEFAULT_DOPPLER_TEMPERATURE = 10_000;
    /** Half-window fitted around each line unless another is given, nm. */
    public static final double DEFAULT_HALF_WINDOW_NM = 1.2;

    private final double instrumentFwhmNm;
    private final double dopplerTemperature;
    private final double halfWindowNm;

    private BalmerPlasmaFit(double instrumentFwhmNm, double dopplerTemperature, double halfWindowNm) {
        this.instrumentFwhmNm = instrumentFwhmNm;
        this.dopplerTemperature = dopplerTemperature;
        this.halfWindowNm = halfWindowNm;
    }

    /** @return a fit with no instrument width, the default Doppler temperature and half-window */
    public static BalmerPlasmaFit defaults() {
        return new BalmerPlasmaFit(0, DEFAULT_DOPPLER_TEMPERATURE, DEFAULT_HALF_WINDOW_NM);
    }

    /**
     * @param fwhmNm the spectrometer's Gaussian response FWHM, nm; finite and &gt;= 0
     * @return a fit with that response
     */
    public BalmerPlasmaFit withInstrumentFwhm(double fwhmNm) {
        if (!(fwhmNm >= 0) || Double.isInfinite(fwhmNm)) {
            throw new IllegalArgumentException("the instrument FWHM must be a finite width >= 0 nm, got " + fwhmNm);
        }
        return new BalmerPlasmaFit(fwhmNm, dopplerTemperature, halfWindowNm);
    }

    /**
     * @param kelvin the temperature of the Doppler width, K; finite and positive
     * @return a fit with that Doppler temperature
     */
    public BalmerPlasmaFit withDopplerTemperature(double kelvin) {
        if (!(kelvin > 0) || Double.isInfinite(kelvin)) {
            throw new IllegalArgumentException("the Doppler temperature must be a positive number of kelvin, got "
                    + kelvin);
        }
        return new BalmerPlasmaFit(instrumentFwhmNm, kelvin, halfWindowNm);
    }

    /**
     * @param nm the half-width of each line's fitted window, nm; finite and positive
     * @return a fit with that window
     */
    public BalmerPlasmaFit withHalfWindow(double nm) {
        if (!(nm > 0) || Double.isInfinite(nm)) {
            throw new IllegalArgumentException("the half-window must be a finite positive width in nm, got " + nm);
        }
        return new BalmerPlasmaFit(instrumentFwhmNm, dopplerTemperature, nm);
    }

    /** @return the instrument FWHM, nm */
    public double instrumentFwhmNm() {
        return instrumentFwhmNm;
    }

    /** @return the Doppler temperature, K */
    public double dopplerTemperature() {
        return dopplerTemperature;
    }

    /** @return the half-window, nm */
    public double halfWindowNm() {
        return halfWindowNm;
    }

    /**
     * @param wavelengthsNm the pixels' centre wavelengths, nm in {@code medium}, increasing
     * @param medium        their medium
     * @param counts        the counts per pixel, finite
     * @return a builder of the problem
     */
    public static Problem.Builder problem(double[] wavelengthsNm, Medium medium, double[] counts) {
        return new Problem.Builder(wavelengthsNm, medium, counts);
    }

    /**
     * The spectrum and the lines to fit. Immutable (arrays copied).
     */
    public static final class Problem {
        private final double[] x;
        private final Medium medium;
        private final double[] y;
        private final double[] sigma;
        private final HydrogenLikeModel emitter;
        private final HydrogenLikeModel companion;
        private final double companionRatio;
        private final double redshift;
        private final int[] upper;

        private Problem(Builder b) {
            this.x = b.x.clone();
            this.medium = b.medium;
            this.y = b.y.clone();
            this.sigma = b.sigma.clone();
            this.emitter = b.emitter;
            this.companion = b.companion;
            this.companionRatio = b.companionRatio;
            this.redshift = b.redshift;
            this.upper = b.upper.stream().mapToInt(Integer::intValue).toArray();
        }

        /** @return the upper n of the lines to fit, ascending */
        public int[] upperLevels() {
            return upper.clone();
        }

        /** @return the emitter's model */
        public HydrogenLikeModel emitter() {
            return emitter;
        }

        /** Builds a {@link Problem}. Not thread-safe. */
        public static final class Builder {
            private final double[] x;
            private final Medium medium;
            private final double[] y;
            private double[] sigma;
            private HydrogenLikeModel emitter;
            private HydrogenLikeModel companion;
            private double companionRatio;
            private double redshift;
            private final TreeSet<Integer> upper = new TreeSet<>();

            private Builder(double[] x, Medium medium, double[] y) {
                this.x = Objects.requireNonNull(x, "wavelengths");
                this.medium = Objects.requireNonNull(medium, "medium");
                this.y = Objects.requireNonNull(y, "counts");
                if (x.length != y.length || x.length < 8) {
                    throw new IllegalArgumentException("need one count per pixel wavelength and at least 8 pixels, got "
                            + x.length + " wavelengths and " + y.length + " counts");
                }
                for (int i = 0; i < x.length; i++) {
                    if (!Double.isFinite(x[i]) || !Double.isFinite(y[i]) || (i > 0 && !(x[i] > x[i - 1]))) {
                        throw new IllegalArgumentException("pixel " + i + ": wavelengths must be finite and increasing"
                                + " and counts finite, got " + x[i] + " nm and " + y[i]);
                    }
                }
            }

            /**
             * Standard uncertainties of the counts: Poisson plus read noise,
             * sigma = sqrt(max(counts, 1) + r^2) (common practice).
             *
             * @param readNoise the read noise, counts; finite and &gt;= 0
             * @return this builder
             */
            public Builder readNoise(double readNoise) {
                if (!(readNoise >= 0) || Double.isInfinite(readNoise)) {
                    throw new IllegalArgumentException("the read noise must be finite and >= 0 counts, got "
                            + readNoise);
                }
                sigma = new double[y.length];
                for (int i = 0; i < y.length; i++) {
                    sigma[i] = Math.sqrt(Math.max(y[i], 1) + readNoise * readNoise);
                }
                return this;
            }

            /**
             * @param sigmas the counts' standard uncertainties, finite and positive, one per pixel
             * @return this builder
             */
            public Builder sigmas(double[] sigmas) {
                if (sigmas.length != y.length) {
                    throw new IllegalArgumentException("one uncertainty per pixel: " + sigmas.length + " for "
                            + y.length + " pixels");
                }
                for (int i = 0; i < sigmas.length; i++) {
                    if (!(sigmas[i] > 0) || Double.isInfinite(sigmas[i])) {
                        throw new IllegalArgumentException("pixel " + i + ": uncertainty must be finite and positive, "
                                + "got " + sigmas[i]);
                    }
                }
                this.sigma = sigmas.clone();
                return this;
            }

            /**
             * @param model the emitting hydrogen isotope's model (nuclear charge 1)
             * @return this builder
             */
            public Builder emitter(HydrogenLikeModel model) {
                if (model.nucleus().z() != 1) {
                    throw new IllegalArgumentException("Balmer lines of hydrogen: the emitter's nuclear charge must be "
                            + "1, got " + model.nucleus().z());
                }
                this.emitter = model;
                return this;
            }

            /**
             * @param model         the other isotope's model, whose lines ride along unresolved or
             *                      resolved
             * @param fluxPerEmitter its line flux per emitter line flux, finite and &gt;= 0
             * @return this builder
             */
            public Builder companion(HydrogenLikeModel model, double fluxPerEmitter) {
                if (!(fluxPerEmitter >= 0) || Double.isInfinite(fluxPerEmitter)) {
                    throw new IllegalArgumentException("the companion's flux ratio must be finite and >= 0, got "
                            + fluxPerEmitter);
                }
                this.companion = Objects.requireNonNull(model, "companion");
                this.companionRatio = fluxPerEmitter;
                return this;
            }

            /**
             * @param z the lines' redshift (v / c), |z| below 0.1
             * @return this builder
             */
            public Builder redshift(double z) {
                if (!(Math.abs(z) < 0.1)) {
                    throw new IllegalArgumentException("the redshift must lie within +-0.1, got " + z);
                }
                this.redshift = z;
                return this;
            }

            /**
             * @param n upper n of a Balmer line to fit, 3 to 30
             * @return this builder
             */
            public Builder line(int n) {
                if (n < 3 || n > 30) {
                    throw new IllegalArgumentException("a Balmer line's upper n must be 3 to 30, got " + n);
                }
                upper.add(n);
                return this;
            }

            /**
             * Adds every Balmer multiplet of the emitter's species matched in an identification.
             *
             * @param identification the identification
             * @param lines          the catalog it matched (as shifted)
             * @param candidates     the candidates the catalog came from
             * @return this builder
             */
            public Builder matchedLines(Identification identification, LineCatalog lines, Candidates candidates) {
                for (int k = 0; k < identification.peaks().size(); k++) {
                    int j = identification.line(k);
                    if (identification.status(k) != Identification.MATCHED || j < 0) {
                        continue;
                    }
                    Candidates.Multiplet m = candidates.multiplet(lines, j);
                    if (m != null && m.lowerN() == 2 && emitter != null && m.model().nucleus().equals(emitter.nucleus())) {
                        line(m.upperN());
                    }
                }
                return this;
            }

            /**
             * @return the problem
             * @throws IllegalArgumentException when the emitter, the uncertainties or the lines are missing
             */
            public Problem build() {
                if (emitter == null) {
                    throw new IllegalArgumentException("the emitter's model is required");
                }
                if (sigma == null) {
                    throw new IllegalArgumentException("the counts' uncertainties are required (readNoise or sigmas)");
                }
                return new Problem(this);
            }
        }
    }

    /**
     * One Balmer line's fit.
     *
     * @param upperN        upper n (lower n is 2)
     * @param centreNm      the emitter line's fitted centre, nm in the axis medium
     * @param centreSigmaNm its standard uncertainty, nm
     * @param flux          the emitter line's flux (companion excluded), counts
     * @param fluxSigma     its standard uncertainty
     * @param lorentzFwhmNm the fitted Lorentzian FWHM, nm
     * @param lorentzSigmaNm its standard uncertainty, nm
     * @param gaussianFwhmNm the Gaussian FWHM held fixed, nm
     * @param reducedChiSquare chi-square per degree of freedom
     */
    public record Line(int upperN, double centreNm, double centreSigmaNm, double flux, double fluxSigma,
            double lorentzFwhmNm, double lorentzSigmaNm, double gaussianFwhmNm, double reducedChiSquare) {
    }

    /**
     * The Boltzmann-plot temperature.
     *
     * @param kelvin      excitation temperature, K
     * @param sigmaKelvin its standard uncertainty, K
     * @param lines       the number of lines in the plot
     */
    public record Temperature(double kelvin, double sigmaKelvin, int lines) {
    }

    /**
     * The Stark density.
     *
     * @param perCubicMetre        electron density, m^-3
     * @param sigmaPerCubicMetre   its standard uncertainty from the width's alone, m^-3
     * @param upperN               the line used (4 for H-beta, 3 for H-alpha)
     * @param starkFwhmNm          the Lorentzian FWHM used, nm
     * @param starkFwhmSigmaNm     its standard uncertainty, nm
     */
    public record Density(double perCubicMetre, double sigmaPerCubicMetre, int upperN, double starkFwhmNm,
            double starkFwhmSigmaNm) {
    }

    /**
     * What the fit found.
     *
     * @param lines       the fitted lines, ascending in upper n
     * @param temperature the Boltzmann-plot temperature, when three or more lines were fitted
     * @param density     the Stark density, when H-beta or H-alpha was fitted within the fit's range
     * @param notes       why a line, the temperature or the density is missing
     * @param settings    the solver used
     */
    public record Result(List<Line> lines, Optional<Temperature> temperature, Optional<Density> density,
            List<String> notes, BalmerPlasmaFit settings) {

        /**
         * Copies the lists.
         *
         * @param lines       the fitted lines, ascending in upper n
         * @param temperature the Boltzmann-plot temperature, when three or more lines were fitted
         * @param density     the Stark density, when H-beta or H-alpha was fitted within the fit's range
         * @param notes       why a line, the temperature or the density is missing
         * @param settings    the solver used
         */
        public Result {
            lines = List.copyOf(lines);
            notes = List.copyOf(notes);
        }
    }

    /**
     * @param problem the spectrum and lines
     * @return the fits, temperature and density
     */
    public Result fit(Problem problem) {
        List<Line> fitted = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        List<double[]> plot = new ArrayList<>();
        double mass = problem.emitter.nucleus().massKg() + PhysicalConstants.ELECTRON_MASS.value();
        double ground = problem.emitter.energy(1, 0, 1);
        for (int n : problem.upper) {
            double[] emitterLine = balmer(problem.emitter, n);
            double centre = problem.medium.fromVacuum(PhysicalConstants.C / emitterLine[0]) * 1e9
                    * (1 + problem.redshift);
            double[] offsets = new double[0];
            double[] ratios = new double[0];
            if (problem.companion != null && problem.companionRatio > 0) {
                double other = problem.medium.fromVacuum(PhysicalConstants.C / balmer(problem.companion, n)[0]) * 1e9
                        * (1 + problem.redshift);
                offsets = new double[] {other - centre};
                ratios = new double[] {problem.companionRatio};
            }
            double doppler = Broadening.dopplerFwhm(emitterLine[0], dopplerTemperature, mass) / emitterLine[0] * centre;
            double gaussian = Math.hypot(instrumentFwhmNm, doppler);
            int from = 0;
            while (from < problem.x.length && problem.x[from] <= centre - halfWindowNm) {
                from++;
            }
            int to = from;
            while (to < problem.x.length && problem.x[to] < centre + halfWindowNm) {
                to++;
            }
            String name = "Balmer " + n + "-2";
            if (to - from < 8) {
                notes.add(String.format(Locale.ROOT, "%s: only %d pixels within %.3g nm of %.4f nm; not fitted", name,
                        to - from, halfWindowNm, centre));
                continue;
            }
            try {
                VoigtLineFit.Result r = VoigtLineFit.fit(java.util.Arrays.copyOfRange(problem.x, from, to),
                        java.util.Arrays.copyOfRange(problem.y, from, to),
                        java.util.Arrays.copyOfRange(problem.sigma, from, to), gaussian, offsets, ratios, centre);
                if (!(r.flux() > 0)) {
                    notes.add(name + ": the fitted flux is not positive; left out");
                    continue;
                }
                fitted.add(new Line(n, r.centre(), r.centreSigma(), r.flux(), r.fluxSigma(), r.lorentzFwhm(),
                        r.lorentzFwhmSigma(), gaussian, r.reducedChiSquare()));
                plot.add(new double[] {r.flux(), r.fluxSigma(), problem.emitter.energy(n, 0, 1) - ground,
                    emitterLine[1], emitterLine[2]});
            } catch (IllegalArgumentException e) {
                notes.add(name + ": " + e.getMessage());
            }
        }
        Optional<Temperature> temperature = Optional.empty();
        if (plot.size() >= 3) {
            try {
                BoltzmannPlot.Fit fit = BoltzmannPlot.fit(BoltzmannPlot.Counting.PHOTONS, column(plot, 0),
                        column(plot, 1), column(plot, 2), column(plot, 3), column(plot, 4), null);
                temperature = Optional.of(new Temperature(fit.temperature(), fit.temperatureUncertainty(), fit.lines()));
            } catch (IllegalArgumentException e) {
                notes.add("temperature: " + e.getMessage());
            }
        } else {
            notes.add("temperature: a Boltzmann plot needs at least 3 fitted lines, got " + plot.size());
        }
        Optional<Density> density = Optional.empty();
        Line stark = find(fitted, 4);
        stark = stark != null ? stark : find(fitted, 3);
        if (stark == null) {
            notes.add("density: neither H-beta nor H-alpha was fitted");
        } else {
            BalmerStark.Line which = BalmerStark.Line.of(stark.upperN(), 2);
            try {
                density = Optional.of(new Density(BalmerStark.electronDensity(which, stark.lorentzFwhmNm()),
                        BalmerStark.electronDensityUncertainty(which, stark.lorentzFwhmNm(), stark.lorentzSigmaNm()),
                        stark.upperN(), stark.lorentzFwhmNm(), stark.lorentzSigmaNm()));
            } catch (IllegalArgumentException e) {
                notes.add("density: " + e.getMessage());
            }
        }
        return new Result(fitted, temperature, density, notes, this);
    }

    private static Line find(List<Line> lines, int n) {
        for (Line line : lines) {
            if (line.upperN() == n) {
                return line;
            }
        }
        return null;
    }

    private static double[] column(List<double[]> rows, int c) {
        return rows.stream().mapToDouble(r -> r[c]).toArray();
    }

    /**
     * @return {frequency Hz, upper weight, Einstein A s^-1} of the model's n -&gt; 2 multiplet
     *         (every Balmer line of hydrogen lies between 300 nm and 1 um)
     */
    private static double[] balmer(HydrogenLikeModel model, int n) {
        LineTable table = HydrogenLikeLines.of(model).multiplets(n, PhysicalConstants.C / 1e-6, PhysicalConstants.C / 300e-9);
        for (int t = 0; t < table.size(); t++) {
            if (table.upperN(t) == n && table.lowerN(t) == 2) {
                return new double[] {table.frequency(t), table.upperWeight(t), table.einsteinA(t)};
            }
        }
        throw new IllegalStateException("the model has no Balmer multiplet from n = " + n);
    }
}
