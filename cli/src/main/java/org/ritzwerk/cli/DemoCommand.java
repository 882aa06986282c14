package org.ritzwerk.cli;

import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Ciddor1996;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.QuantityText;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;
import picocli.CommandLine.Command;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code ritzwerk demo}: a small built-in scenario run end to end. The station, its conditions
 * and its peaks are invented for the demo; they come from no real instrument.
 */
@Command(name = "demo",
        mixinStandardHelpOptions = true,
        description = "Run a built-in example scenario (invented data) and print the results.")
final class DemoCommand implements Callable<Integer> {

    /** The invented station's air: a cold, dry afternoon at 2900 m. */
    static final Ciddor1996 STATION_AIR = new Ciddor1996(5, 71_800, 30, 415);

    /** Invented peak positions in station air, nm, with standard uncertainties. */
    static final List<String> PEAKS = List.of(
            "412.337(4) nm", "498.102(3) nm", "577.915(5) nm", "640.488(6) nm", "731.26(1) nm");

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        Medium stationAir = Medium.air(STATION_AIR);
        QuantityText text = QuantityText.standard();
        out.println("Ritzwerk demo: the mountain station 'Kestrel Saddle', 2900 m (an invented scenario)");
        out.println();
        out.println("A fibre spectrometer in the station's hut logged five emission peaks. Its wavelength");
        out.println("scale was set up in the hut's own air: " + STATION_AIR.description() + ".");
        out.println("Before the peaks can be compared with line lists, which state vacuum wavelengths or");
        out.println("standard-air wavelengths, they must leave the hut's air. The uncertainties travel along.");
        out.println();
        out.println(String.format(Locale.ROOT, "%-16s %-16s %-16s %8s %6s %-13s %-12s %-11s",
                "peak (hut air)", "vacuum nm", "standard air nm", "diff pm", "diff/u", "wavenumber", "THz", "eV"));
        for (String peak : PEAKS) {
            Wavelength measured = (Wavelength) text.parse(peak.replace(" nm", " nm air(" + STATION_AIR.spec() + ")"));
            Wavelength vacuum = measured.toWavelength(Medium.vacuum());
            Wavelength standard = measured.toWavelength(Medium.air());
            double differencePm = (standard.inMetres() - measured.inMetres()) * 1e12;
            double uncertaintyPm = measured.uncertaintyIn(Unit.NANOMETRE).orElseThrow() * 1e3;
            out.println(String.format(Locale.ROOT, "%-16s %-16s %-16s %8.1f %6.1f %-13s %-12s %-11s",
                    peak.replace(" nm", ""),
                    text.formatNumber(vacuum, Unit.NANOMETRE, 0),
                    text.formatNumber(standard, Unit.NANOMETRE, 0),
                    differencePm, differencePm / uncertaintyPm,
                    text.formatNumber(measured.toWavenumber(), Unit.PER_CENTIMETRE, 0),
                    text.formatNumber(measured.toFrequency(), Unit.TERAHERTZ, 0),
                    text.formatNumber(measured.toEnergy(), Unit.ELECTRONVOLT, 0)));
        }
        out.println();
        out.println("diff pm: standard-air wavelength minus hut-air wavelength, in picometres; diff/u: that");
        out.println("difference over the peak's standard uncertainty. Taking the thin hut air for standard air");
        out.println("would shift every peak by diff, an error of diff/u standard uncertainties.");
        out.println("wavenumber: vacuum cm-1. Values in parentheses: standard uncertainty in the last digits.");
        out.println();
        out.println("Air models: standard air after Morton (2000); hut air after Ciddor (1996).");
        out.println("Constants: " + PhysicalConstants.EDITION + ". Try: ritzwerk convert \"640.488(6) nm air\" --to \"nm vacuum\"");
        return 0;
    }
}
