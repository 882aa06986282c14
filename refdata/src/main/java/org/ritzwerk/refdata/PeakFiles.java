package org.ritzwerk.refdata;

import java.nio.file.Path;
import java.util.EnumSet;
import java.util.List;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * Ritzwerk's own file format for measured peaks ({@code ritzwerk-peaks}, version 1), in CSV and
 * JSON, with the same header rules and strictness as {@link LineListFiles}:
 * <pre>
 * # ritzwerk-peaks 1
 * # id: run-0412
 * # title: Discharge tube, exposure 12
 * # source: bench spectrometer, 2026-11-30
 * # provenance: measured
 * # version: 1
 * # position-unit: nm
 * # medium: air
 * position,uncertainty,intensity,width,note
 * 656.281,0.004,1520,0.09,
 * </pre>
 * {@code position} is required; {@code uncertainty} (standard uncertainty in the position unit),
 * {@code intensity}, {@code width} (FWHM in the position unit) and {@code note} are optional.
 * In JSON the rows are under {@code peaks}. Stateless and thread-safe.
 */
public final class PeakFiles {

    /** The format name in both encodings. */
    public static final String FORMAT = "ritzwerk-peaks";
    /** The format version. */
    public static final int VERSION = 1;

    private static final TabularFiles.Spec SPEC = new TabularFiles.Spec(FORMAT, VERSION, "position-unit",
            List.of("id", "title", "source", "provenance", "version", "position-unit", "medium", "note"),
            List.of("id", "title", "source", "provenance", "version", "position-unit"),
            List.of("position", "uncertainty", "intensity", "width", "note"), List.of("position"),
            List.of("position", "uncertainty", "intensity", "width"), "peaks");

    private PeakFiles() {
    }

    /**
     * Peaks as read, in file order: positions in {@link #unit()} (and {@link #medium()} for
     * wavelengths), uncertainties, intensities and widths with NaN where not given, and the file
     * line of each peak for messages.
     *
     * @param id          the file's id
     * @param unit        the position unit
     * @param medium      the medium of wavelength positions, else null
     * @param positions   positions
     * @param uncertainties standard uncertainties (NaN when not given)
     * @param intensities intensities (NaN when not given)
     * @param widths      widths (NaN when not given)
     * @param lines       the 1-based file line of each peak
     */
    public record Peaks(String id, Unit unit, Medium medium, double[] positions, double[] uncertainties,
            double[] intensities, double[] widths, int[] lines) {

        /** @return the number of peaks */
        public int size() {
            return positions.length;
        }

        /** @return whether every peak states its uncertainty */
        public boolean allUncertain() {
            for (double u : uncertainties) {
                if (Double.isNaN(u)) {
                    return false;
                }
            }
            return true;
        }

        /** @return whether every peak states its intensity */
        public boolean allIntense() {
            for (double u : intensities) {
                if (Double.isNaN(u)) {
                    return false;
                }
            }
            return true;
        }
    }

    /**
     * @param file a {@code .csv} or {@code .json} peaks file
     * @return the peaks
     * @throws DataFileException with every problem found (also an empty file or a zero position)
     */
    public static Peaks read(Path file) {
        String name = file.toString();
        String text = TabularFiles.read(file);
        TabularFiles.Parsed p = TabularFiles.isJson(name, text) ? TabularFiles.parseJson(SPEC, text, name)
                : TabularFiles.parseCsv(SPEC, text, name);
        p.checkHeader();
        p.provenance();
        Unit unit = p.unit(EnumSet.of(Kind.WAVELENGTH, Kind.WAVENUMBER, Kind.FREQUENCY, Kind.ENERGY));
        Medium medium = p.medium(unit);
        int n = p.rows.size();
        double[] positions = new double[n];
        double[] uncertainties = new double[n];
        double[] intensities = new double[n];
        double[] widths = new double[n];
        int[] lines = new int[n];
        for (int k = 0; k < n; k++) {
            TabularFiles.Row row = p.rows.get(k);
            positions[k] = p.number(row, "position", true);
            if (positions[k] == 0) {
                p.rowProblem(row, "position", "data.not-positive", "position must be positive, got 0");
            }
            uncertainties[k] = p.number(row, "uncertainty", false);
            intensities[k] = p.number(row, "intensity", false);
            widths[k] = p.number(row, "width", false);
            p.text(row, "note");
            lines[k] = row.line();
        }
        if (n == 0 && p.problems.isEmpty()) {
            p.problem(1, 0, "data.empty", "the file has no peaks", "");
        }
        p.throwIfAny();
        return new Peaks(p.header.get("id"), unit, unit.kind() == Kind.WAVELENGTH ? medium : null, positions,
                uncertainties, intensities, widths, lines);
    }
}
