package org.ritzwerk.engine.plasma;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.profile.BalmerStark;
import org.ritzwerk.engine.profile.Broadening;
import org.ritzwerk.engine.profile.Profiles;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * Plasma conditions from identified peaks: the excitation temperature of each species from a
 * Boltzmann plot of its matched lines whose upper level, weight and A are known (one-electron
 * n -&gt; n' multiplets, level-list lines with A such as He I's; {@link Candidates#emission};
 * {@link BoltzmannPlot}, peak intensities counted as photons), and the electron density from the measured width of each
 * matched H or D Balmer-alpha and -beta peak ({@link BalmerStark}): the instrument's Gaussian
 * (a FWHM, or lambda / R) and the Doppler width (at the species' temperature, else the given
 * one, else 10,000 K) are taken out of the Voigt width ({@link Profiles#lorentzFwhmOfVoigt})
 * and the remaining Lorentzian is the Stark width.
 *
 * <p>Configured with {@code withX}; immutable and thread-safe.
 */
public final class PlasmaEstimate {

    /** Temperature for the Doppler width when none is known, K (common practice for such plasmas). */
    public static final double DEFAULT_TEMPERATURE = 10_000;

    /** What an estimate row gives. */
    public enum Quantity {
        /** Excitation temperature, K. */
        EXCITATION_TEMPERATURE("excitation_temperature", "K"),
        /** Electron density, m^-3. */
        ELECTRON_DENSITY("electron_density", "m^-3");

        private final String id;
        private final String unit;

        Quantity(String id, String unit) {
            this.id = id;
            this.unit = unit;
        }

        /** @return the name used in tables, e.g. {@code excitation_temperature} */
        public String id() {
            return id;
        }

        /** @return the unit's symbol, {@code K} or {@code m^-3} */
        public String unit() {
            return unit;
        }
    }

    /**
     * One estimate, or the reason there is none.
     *
     * @param species     the species
     * @param quantity    what is estimated
     * @param value       the value in the quantity's unit; empty when it could not be estimated
     * @param uncertainty its standard uncertainty; empty when not known
     * @param lines       the lines used: a count for a temperature, the line's label for a density
     * @param note        how it was made, or why it was not
     */
    public record Row(Species species, Quantity quantity, OptionalDouble value, OptionalDouble uncertainty,
            String lines, String note) {
    }

    /**
     * The peaks as measured: positions in their unit and medium, intensities, and FWHMs in the
     * same unit (NaN where a peak states none).
     *
     * @param positions   peak positions
     * @param unit        their unit
     * @param medium      their medium (null for non-wavelength units)
     * @param intensities peak intensities (photon counts or proportional), NaN where unknown
     * @param widths      peak FWHMs in {@code unit}, NaN where unknown
     */
    public record Peaks(double[] positions, Unit unit, Medium medium, double[] intensities, double[] widths) {

        /**
         * Checks the lengths.
         *
         * @param positions   peak positions
         * @param unit        their unit
         * @param medium      their medium (null for non-wavelength units)
         * @param intensities peak intensities (photon counts or proportional), NaN where unknown
         * @param widths      peak FWHMs in {@code unit}, NaN where unknown
         */
        public Peaks {
            Objects.requireNonNull(unit, "unit");
            if (intensities.length != positions.length || widths.length != positions.length) {
                throw new IllegalArgumentException("positions, intensities and widths need one value per peak: "
                        + positions.length + ", " + intensities.length + ", " + widths.length);
            }
            positions = positions.clone();
            intensities = intensities.clone();
            widths = widths.clone();
        }

        /** @return a copy of the positions */
        @Override
        public double[] positions() {
            return positions.clone();
        }

        /** @return a copy of the intensities */
        @Override
        public double[] intensities() {
            return intensities.clone();
        }

        /** @return a copy of the widths */
        @Override
        public double[] widths() {
            return widths.clone();
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof Peaks p && unit.equals(p.unit) && Objects.equals(medium, p.medium)
                    && java.util.Arrays.equals(positions, p.positions) && java.util.Arrays.equals(intensities,
                            p.intensities) && java.util.Arrays.equals(widths, p.widths);
        }

        @Override
        public int hashCode() {
            return Objects.hash(unit, medium, java.util.Arrays.hashCode(positions),
                    java.util.Arrays.hashCode(intensities), java.util.Arrays.hashCode(widths));
        }

        @Override
        public String toString() {
            return "Peaks[" + positions.length + " peaks in " + unit.symbol() + "]";
        }
    }

    private final double instrumentFwhmNm;
    private final double resolvingPower;
    private final double temperature;

    private PlasmaEstimate(double instrumentFwhmNm, double resolvingPower, double temperature) {
        this.instrumentFwhmNm = instrumentFwhmNm;
        this.resolvingPower = resolvingPower;
        this.temperature = temperature;
    }

    /** @return an estimate with no instrument width and no given temperature */
    public static PlasmaEstimate defaults() {
        return new PlasmaEstimate(0, Double.NaN, Double.NaN);
    }

    /**
     * @param fwhmNm the spectrometer's Gaussian FWHM, nm; finite and &gt;= 0
     * @return an estimate with that instrument width (and no resolving power)
     */
    public PlasmaEstimate withInstrumentFwhm(double fwhmNm) {
        if (!(fwhmNm >= 0) || Double.isInfinite(fwhmNm)) {
            throw new IllegalArgumentException("the instrument FWHM must be a finite width >= 0 nm, got " + fwhmNm);
        }
        return new PlasmaEstimate(fwhmNm, Double.NaN, temperature);
    }

    /**
     * @param r the resolving power: the response's FWHM is lambda / r at each line; finite, positive
     * @return an estimate with that resolving power (and no fixed instrument width)
     */
    public PlasmaEstimate withResolvingPower(double r) {
        if (!(r > 0) || Double.isInfinite(r)) {
            throw new IllegalArgumentException("the resolving power must be finite and positive, got " + r);
        }
        return new PlasmaEstimate(0, r, temperature);
    }

    /**
     * @param kelvin the temperature for the Doppler width where a species has no Boltzmann-plot
     *               temperature of its own; positive
     * @return an estimate with that temperature
     */
    public PlasmaEstimate withTemperature(double kelvin) {
        if (!(kelvin > 0) || Double.isInfinite(kelvin)) {
            throw new IllegalArgumentException("the temperature must be a positive number of kelvin, got " + kelvin);
        }
        return new PlasmaEstimate(instrumentFwhmNm, resolvingPower, kelvin);
    }

    /**
     * @param peaks          the peaks as measured
     * @param identification their identification
     * @param lines          the catalog they were identified against (as shifted)
     * @param candidates     the candidates the catalog came from, for the lines' physics
     * @return the temperature rows (one per species with matched lines of known upper level, weight
     *         and A), then the density rows
     *         (one per matched Balmer-alpha or -beta peak of H or D); empty when nothing matched
     * @throws IllegalArgumentException when the peaks are not the identification's, peak for peak
     *                                  (another count, or a position elsewhere)
     */
    public List<Row> estimate(Peaks peaks, Identification identification, LineCatalog lines, Candidates candidates) {
        Objects.requireNonNull(peaks, "peaks");
        Objects.requireNonNull(identification, "identification");
        Objects.requireNonNull(lines, "lines");
        Objects.requireNonNull(candidates, "candidates");
        PeakList identified = identification.peaks();
        if (peaks.positions.length != identified.size()) {
            throw new IllegalArgumentException("the identification has " + identified.size() + " peaks, the plasma "
                    + "estimate was given " + peaks.positions.length + "; give it the peaks that were identified");
        }
        PeakList given = PeakList.of(peaks.positions(), null, null, peaks.unit(), peaks.medium());
        for (int i = 0; i < identified.size(); i++) {
            if (Math.abs(given.wavelength(i) - identified.wavelength(i)) > 1e-9 * identified.wavelength(i)) {
                throw new IllegalArgumentException("peak " + i + " lies elsewhere than the identification's peak " + i
                        + "; give the peaks in the order they were identified");
            }
        }
        Map<Species, List<int[]>> bySpecies = new LinkedHashMap<>();
        for (int i = 0; i < peaks.positions.length; i++) {
            int j = identification.line(i);
            if (identification.status(i) != Identification.MATCHED || j < 0) {
                continue;
            }
            if (candidates.emission(lines, j) != null) {
                bySpecies.computeIfAbsent(lines.species(j), k -> new ArrayList<>()).add(new int[] {i, j});
            }
        }
        List<Row> rows = new ArrayList<>();
        Map<Species, Double> temperatures = new LinkedHashMap<>();
        for (Map.Entry<Species, List<int[]>> entry : bySpecies.entrySet()) {
            List<double[]> points = new ArrayList<>();
            for (int[] pair : entry.getValue()) {
                double intensity = peaks.intensities[pair[0]];
                if (!(intensity > 0)) {
                    continue;
                }
                // the fit uses g_u A only as a product: it goes in as the weight, with A = 1
                Candidates.Emission e = candidates.emission(lines, pair[1]);
                points.add(new double[] {intensity, e.upperEnergy(), e.weightTimesEinsteinA(), 1});
            }
            long levels = points.stream().mapToDouble(p -> p[1]).distinct().count();
            if (levels < 3) {
                rows.add(new Row(entry.getKey(), Quantity.EXCITATION_TEMPERATURE, OptionalDouble.empty(),
                        OptionalDouble.empty(), String.valueOf(points.size()),
                        "needs matched lines with intensities from at least 3 upper levels"));
                continue;
            }
            Optional<BoltzmannPlot.Fit> falling = BoltzmannPlot.fitIfFalling(BoltzmannPlot.Counting.PHOTONS,
                    points.stream().mapToDouble(p -> p[0]).toArray(), null,
                    points.stream().mapToDouble(p -> p[1]).toArray(), points.stream().mapToDouble(p -> p[2]).toArray(),
                    points.stream().mapToDouble(p -> p[3]).toArray(), null);
            if (falling.isEmpty()) {
                rows.add(new Row(entry.getKey(), Quantity.EXCITATION_TEMPERATURE, OptionalDouble.empty(),
                        OptionalDouble.empty(), String.valueOf(points.size()), "the Boltzmann plot rises with"
                        + " upper-level energy: no positive temperature fits these intensities"));
                continue;
            }
            BoltzmannPlot.Fit fit = falling.get();
            temperatures.put(entry.getKey(), fit.temperature());
            rows.add(new Row(entry.getKey(), Quantity.EXCITATION_TEMPERATURE, OptionalDouble.of(fit.temperature()),
                    OptionalDouble.of(fit.temperatureUncertainty()), String.valueOf(fit.lines()),
                    "Boltzmann plot; uncertainty from the scatter about the line"));
        }
        for (Map.Entry<Species, List<int[]>> entry : bySpecies.entrySet()) {
            for (int[] pair : entry.getValue()) {
                Candidates.Multiplet m = candidates.multiplet(lines, pair[1]);
                BalmerStark.Line balmer = m == null ? null : BalmerStark.Line.of(m.upperN(), m.lowerN());
                if (balmer == null || m.model().nucleus().z() != 1) {
                    continue;
                }
                Double known = temperatures.get(entry.getKey());
                rows.add(density(peaks, pair[0], entry.getKey(), lines.label(pair[1]), m, balmer,
                        known != null ? known : temperature));
            }
        }
        return rows;
    }

    private Row density(Peaks peaks, int i, Species species, String label, Candidates.Multiplet m,
            BalmerStark.Line balmer, double t) {
        double width = peaks.widths[i];
        if (Double.isNaN(width)) {
            return noDensity(species, label, "the peak states no width");
        }
        if (peaks.unit().kind() != Kind.WAVELENGTH) {
            return noDensity(species, label, "widths are read in wavelength units only");
        }
        double[] nm = new double[1];
        SpectralArrays.convert(new double[] {peaks.positions[i]}, peaks.unit(), peaks.medium(), Unit.NANOMETRE,
                peaks.medium() == null ? Medium.vacuum() : peaks.medium(), nm);
        double fwhmNm = width * nm[0] / peaks.positions[i];
        boolean assumed = Double.isNaN(t);
        double kelvin = assumed ? DEFAULT_TEMPERATURE : t;
        double mass = m.model().nucleus().massKg() + PhysicalConstants.ELECTRON_MASS.value();
        double doppler = Broadening.dopplerFwhm(m.frequency(), kelvin, mass) / m.frequency() * nm[0];
        double response = Double.isNaN(resolvingPower) ? instrumentFwhmNm : nm[0] / resolvingPower;
        double gaussian = Math.hypot(response, doppler);
        boolean noInstrument = !(response > 0);
        String note = String.format(Locale.ROOT, "FWHM %.4g nm less Gaussian %.3g nm (%sDoppler at %.0f K%s)",
                fwhmNm, gaussian, noInstrument ? "no instrument width given, so only " : "instrument, ", kelvin,
                assumed ? " assumed" : "");
        try {
            double stark = Profiles.lorentzFwhmOfVoigt(fwhmNm, gaussian);
            double density = BalmerStark.electronDensity(balmer, stark);
            return new Row(species, Quantity.ELECTRON_DENSITY, OptionalDouble.of(density), OptionalDouble.empty(),
                    label, note + String.format(Locale.ROOT, "; Stark FWHM %.4g nm; Gigosos et al. 2003", stark));
        } catch (IllegalArgumentException e) {
            return noDensity(species, label, note + "; " + e.getMessage());
        }
    }

    private static Row noDensity(Species species, String label, String note) {
        return new Row(species, Quantity.ELECTRON_DENSITY, OptionalDouble.empty(), OptionalDouble.empty(), label, note);
    }
}
