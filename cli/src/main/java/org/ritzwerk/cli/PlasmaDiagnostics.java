package org.ritzwerk.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Function;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.plasma.BoltzmannPlot;
import org.ritzwerk.engine.profile.BalmerStark;
import org.ritzwerk.engine.profile.Broadening;
import org.ritzwerk.engine.profile.Profiles;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.refdata.PeakFiles;

/**
 * {@code identify --plasma}: excitation temperatures and electron densities from identified
 * peaks, as a table with the columns {@code species}, {@code quantity}, {@code value},
 * {@code uncertainty}, {@code unit}, {@code lines}, {@code note}.
 */
final class PlasmaDiagnostics {

    /** Default temperature for the Doppler width when no temperature is known, K (common practice). */
    private static final double DEFAULT_TEMPERATURE = 10_000;

    /**
     * The physics of a one-electron multiplet.
     *
     * @param model       the ion's model
     * @param upperN      upper n
     * @param lowerN      lower n
     * @param upperEnergy upper energy above the ground state, J
     * @param weight      upper statistical weight 2 n^2
     * @param einsteinA   the multiplet's A (weight-averaged), s^-1
     * @param frequency   Hz
     */
    record Multiplet(HydrogenLikeModel model, int upperN, int lowerN, double upperEnergy, double weight,
            double einsteinA, double frequency) {
    }

    private PlasmaDiagnostics() {
    }

    static Table table(PeakFiles.Peaks read, Identification result, LineCatalog lines,
            Function<String, Multiplet> multiplets, double instrumentFwhm, Double resolvingPower, Double givenTemperature,
            PrintWriter err) {
        Table table = new Table(List.of(
                Table.Column.text("species", "species"),
                Table.Column.text("quantity", "quantity"),
                Table.Column.number("value", "value", "%.5g"),
                Table.Column.number("uncertainty", "+-", "%.2g"),
                Table.Column.text("unit", "unit"),
                Table.Column.text("lines", "lines"),
                Table.Column.text("note", "note")));
        // Matched peaks of the computed species, grouped by species.
        Map<String, List<int[]>> bySpecies = new LinkedHashMap<>();
        for (int i = 0; i < read.size(); i++) {
            int j = result.line(i);
            if (result.status(i) != Identification.MATCHED || j < 0) {
                continue;
            }
            String key = lines.species(j).notation() + " " + lines.label(j);
            if (multiplets.apply(key) != null) {
                bySpecies.computeIfAbsent(lines.species(j).notation(), k -> new ArrayList<>()).add(new int[] {i, j});
            }
        }
        Map<String, Double> temperatures = new LinkedHashMap<>();
        for (Map.Entry<String, List<int[]>> entry : bySpecies.entrySet()) {
            List<int[]> matched = entry.getValue();
            List<double[]> points = new ArrayList<>();
            for (int[] pair : matched) {
                double intensity = read.intensities()[pair[0]];
                if (!(intensity > 0)) {
                    continue;
                }
                Multiplet m = multiplets.apply(entry.getKey() + " " + lines.label(pair[1]));
                points.add(new double[] {intensity, m.upperEnergy(), m.weight(), m.einsteinA()});
            }
            long levels = points.stream().mapToDouble(p -> p[1]).distinct().count();
            if (levels < 3) {
                table.add(entry.getKey(), "excitation_temperature", null, null, "K", String.valueOf(points.size()),
                        "needs matched lines with intensities from at least 3 upper levels");
                continue;
            }
            BoltzmannPlot.Fit fit = BoltzmannPlot.fit(BoltzmannPlot.Counting.PHOTONS,
                    points.stream().mapToDouble(p -> p[0]).toArray(), null,
                    points.stream().mapToDouble(p -> p[1]).toArray(), points.stream().mapToDouble(p -> p[2]).toArray(),
                    points.stream().mapToDouble(p -> p[3]).toArray(), null);
            temperatures.put(entry.getKey(), fit.temperature());
            table.add(entry.getKey(), "excitation_temperature", fit.temperature(), fit.temperatureUncertainty(), "K",
                    String.valueOf(fit.lines()), "Boltzmann plot; uncertainty from the scatter about the line");
        }
        for (Map.Entry<String, List<int[]>> entry : bySpecies.entrySet()) {
            for (int[] pair : entry.getValue()) {
                Multiplet m = multiplets.apply(entry.getKey() + " " + lines.label(pair[1]));
                BalmerStark.Line balmer = BalmerStark.Line.of(m.upperN(), m.lowerN());
                if (balmer == null || m.model().nucleus().z() != 1) {
                    continue;
                }
                stark(table, read, pair[0], entry.getKey(), lines.label(pair[1]), m, balmer, instrumentFwhm,
                        resolvingPower, temperatures.getOrDefault(entry.getKey(), givenTemperature));
            }
        }
        if (table.size() == 0) {
            err.println("identify: no matched multiplet of a --species line; nothing to diagnose");
            err.flush();
        }
        return table;
    }

    private static void stark(Table table, PeakFiles.Peaks read, int i, String species, String label, Multiplet m,
            BalmerStark.Line balmer, double instrumentFwhm, Double resolvingPower, Double temperature) {
        double width = read.widths()[i];
        if (Double.isNaN(width)) {
            table.add(species, "electron_density", null, null, "m^-3", label, "the peak states no width");
            return;
        }
        if (read.unit().kind() != Kind.WAVELENGTH) {
            table.add(species, "electron_density", null, null, "m^-3", label, "widths are read in wavelength units only");
            return;
        }
        double[] nm = new double[1];
        SpectralArrays.convert(new double[] {read.positions()[i]}, read.unit(), read.medium(), Unit.NANOMETRE,
                read.medium() == null ? Medium.vacuum() : read.medium(), nm);
        double fwhmNm = width * nm[0] / read.positions()[i];
        double t = temperature == null ? DEFAULT_TEMPERATURE : temperature;
        double mass = m.model().nucleus().massKg() + PhysicalConstants.ELECTRON_MASS.value();
        double doppler = Broadening.dopplerFwhm(m.frequency(), t, mass) / m.frequency() * nm[0];
        double response = resolvingPower == null ? instrumentFwhm : nm[0] / resolvingPower;
        double gaussian = Math.hypot(response, doppler);
        String note = String.format(Locale.ROOT, "FWHM %.4g nm less Gaussian %.3g nm (instrument, Doppler at %.0f K%s)",
                fwhmNm, gaussian, t, temperature == null ? " assumed" : "");
        try {
            double stark = Profiles.lorentzFwhmOfVoigt(fwhmNm, gaussian);
            double density = BalmerStark.electronDensity(balmer, stark);
            table.add(species, "electron_density", density, null, "m^-3", label,
                    note + String.format(Locale.ROOT, "; Stark FWHM %.4g nm; Gigosos et al. 2003", stark));
        } catch (IllegalArgumentException e) {
            table.add(species, "electron_density", null, null, "m^-3", label, note + "; " + e.getMessage());
        }
    }
}
