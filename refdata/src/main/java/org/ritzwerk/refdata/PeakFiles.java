package org.ritzwerk.refdata;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
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
 * {@code position} is required; {@code uncertainty} (standard uncertainty in the position unit, below the
 * position), {@code intensity}, {@code width} (FWHM in the position unit) and {@code note} are optional.
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
     * line of each peak and, in JSON, its entry of {@code peaks} for messages ({@link #where}).
     *
     * @param id          the file's id
     * @param unit        the position unit
     * @param medium      the medium of wavelength positions, else null
     * @param positions   positions
     * @param uncertainties standard uncertainties (NaN when not given)
     * @param intensities intensities (NaN when not given)
     * @param widths      widths (NaN when not given)
     * @param lines       the 1-based file line of each peak
     * @param entries     the 1-based entry of each peak in a JSON file's {@code peaks} array, 0 for a
     *                    CSV file (a JSON file on one line has every peak on line 1)
     */
    public record Peaks(String id, Unit unit, Medium medium, double[] positions, double[] uncertainties,
            double[] intensities, double[] widths, int[] lines, int[] entries) {

        /**
         * Copies the arrays: the record is immutable, its accessors return copies.
         *
         * @param id            the file's id
         * @param unit          the position unit
         * @param medium        the medium of wavelength positions, else null
         * @param positions     positions
         * @param uncertainties standard uncertainties (NaN when not given)
         * @param intensities   intensities (NaN when not given)
         * @param widths        widths (NaN when not given)
         * @param lines         the 1-based file line of each peak
         * @param entries       the 1-based entry of each peak in a JSON file's {@code peaks} array, 0 for
         *                      a CSV file
         * @throws IllegalArgumentException when {@code entries} is not as long as {@code lines}
         */
        public Peaks {
            positions = positions.clone();
            uncertainties = uncertainties.clone();
            intensities = intensities.clone();
            widths = widths.clone();
            lines = lines.clone();
            entries = entries.clone();
            if (entries.length != lines.length) {
                throw new IllegalArgumentException("entries must give one entry per peak (" + lines.length
                        + "), got " + entries.length);
            }
        }

        /**
         * Peaks of a CSV file, or of none: every entry 0.
         *
         * @param id            the file's id
         * @param unit          the position unit
         * @param medium        the medium of wavelength positions, else null
         * @param positions     positions
         * @param uncertainties standard uncertainties (NaN when not given)
         * @param intensities   intensities (NaN when not given)
         * @param widths        widths (NaN when not given)
         * @param lines         the 1-based file line of each peak
         */
        public Peaks(String id, Unit unit, Medium medium, double[] positions, double[] uncertainties,
                double[] intensities, double[] widths, int[] lines) {
            this(id, unit, medium, positions, uncertainties, intensities, widths, lines, new int[lines.length]);
        }

        /** @return a copy of the positions */
        @Override
        public double[] positions() {
            return positions.clone();
        }

        /** @return a copy of the uncertainties (NaN where not given) */
        @Override
        public double[] uncertainties() {
            return uncertainties.clone();
        }

        /** @return a copy of the intensities (NaN where not given) */
        @Override
        public double[] intensities() {
            return intensities.clone();
        }

        /** @return a copy of the widths (NaN where not given) */
        @Override
        public double[] widths() {
            return widths.clone();
        }

        /** @return a copy of the 1-based file lines */
        @Override
        public int[] lines() {
            return lines.clone();
        }

        /** @return a copy of the 1-based JSON entries (0 for a CSV file) */
        @Override
        public int[] entries() {
            return entries.clone();
        }

        /**
         * Where peak {@code k} stands in its file, as the reader's own messages name a row: its line
         * in CSV ({@code "line 12"}), its entry in JSON ({@code "entry 3 of 'peaks'"}), since every
         * entry of a JSON file on one line is on line 1.
         *
         * @param k the peak, 0-based
         * @return the place
         * @throws IndexOutOfBoundsException unless 0 &lt;= k &lt; {@link #size()}
         */
        public String where(int k) {
            return entries[k] > 0 ? "entry " + entries[k] + " of '" + SPEC.arrayKey() + "'" : "line " + lines[k];
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof Peaks p && java.util.Objects.equals(id, p.id) && unit.equals(p.unit)
                    && java.util.Objects.equals(medium, p.medium) && java.util.Arrays.equals(positions, p.positions)
                    && java.util.Arrays.equals(uncertainties, p.uncertainties)
                    && java.util.Arrays.equals(intensities, p.intensities) && java.util.Arrays.equals(widths, p.widths)
                    && java.util.Arrays.equals(lines, p.lines) && java.util.Arrays.equals(entries, p.entries);
        }

        @Override
        public int hashCode() {
            return java.util.Objects.hash(id, unit, medium, java.util.Arrays.hashCode(positions),
                    java.util.Arrays.hashCode(uncertainties), java.util.Arrays.hashCode(intensities),
                    java.util.Arrays.hashCode(widths), java.util.Arrays.hashCode(lines),
                    java.util.Arrays.hashCode(entries));
        }

        @Override
        public String toString() {
            return "Peaks[" + id + ", " + positions.length + " peaks in " + unit.symbol()
                    + (medium == null ? "" : " " + medium) + "]";
        }

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
        return read(TabularFiles.read(file), name);
    }

    /**
     * @param text   a peaks file's text, CSV or JSON (told apart by the source's extension or the
     *               first non-blank character)
     * @param source the file's name, for messages
     * @return the peaks
     * @throws DataFileException with every problem found
     */
    public static Peaks read(String text, String source) {
        String name = source;
        // Rows become columns of numbers as they are read (40 bytes a peak), not a map a row.
        Columns columns = new Columns();
        TabularFiles.Parsed p = TabularFiles.isJson(name, text) ? TabularFiles.parseJson(SPEC, text, name, columns)
                : TabularFiles.parseCsv(SPEC, text, name, columns);
        p.checkHeader();
        p.provenance();
        Unit unit = p.unit(EnumSet.of(Kind.WAVELENGTH, Kind.WAVENUMBER, Kind.FREQUENCY, Kind.ENERGY));
        Medium medium = p.medium(unit);
        int n = columns.size;
        double[] positions = Arrays.copyOf(columns.positions, n);
        double[] uncertainties = Arrays.copyOf(columns.uncertainties, n);
        double[] intensities = Arrays.copyOf(columns.intensities, n);
        double[] widths = Arrays.copyOf(columns.widths, n);
        int[] lines = Arrays.copyOf(columns.lines, n);
        int[] entries = Arrays.copyOf(columns.entries, n);
        if (n == 0 && p.problems.isEmpty()) {
            p.problem(1, 0, "data.empty", "the file has no peaks", "");
        }
        if (p.problems.isEmpty() && unit.kind() == Kind.WAVELENGTH && medium != null) {
            // every position must lie where the medium's model converts it (air: 200 nm to 2.5 um)
            for (int k = 0; k < n; k++) {
                try {
                    medium.toVacuum(unit.toSi(positions[k]));
                } catch (org.ritzwerk.medium.MediumException e) {
                    p.problem(lines[k], p.columnIndex.getOrDefault("position", 0), "data.outside-medium",
                            "column position: " + e.getMessage(), "");
                }
            }
        }
        p.throwIfAny();
        return new Peaks(p.header.get("id"), unit, unit.kind() == Kind.WAVELENGTH ? medium : null, positions,
                uncertainties, intensities, widths, lines, entries);
    }

    /** The peaks' columns, filled row by row as the file is read. */
    private static final class Columns implements TabularFiles.RowSink {
        double[] positions = new double[64];
        double[] uncertainties = new double[64];
        double[] intensities = new double[64];
        double[] widths = new double[64];
        int[] lines = new int[64];
        int[] entries = new int[64];
        int size;

        @Override
        public void accept(TabularFiles.Parsed p, TabularFiles.Row row) {
            if (size == positions.length) {
                int grown = size + (size >> 1);
                positions = Arrays.copyOf(positions, grown);
                uncertainties = Arrays.copyOf(uncertainties, grown);
                intensities = Arrays.copyOf(intensities, grown);
                widths = Arrays.copyOf(widths, grown);
                lines = Arrays.copyOf(lines, grown);
                entries = Arrays.copyOf(entries, grown);
            }
            int k = size++;
            positions[k] = p.number(row, "position", true);
            if (positions[k] == 0) {
                p.rowProblem(row, "position", "data.not-positive", "position must be positive, got 0");
            }
            uncertainties[k] = p.number(row, "uncertainty", false);
            if (uncertainties[k] >= positions[k] && positions[k] > 0) {
                // a standard uncertainty as large as the position itself places the peak nowhere (a
                // review's 1e308 matched a line 170 nm away); most likely a unit or column slip
                p.rowProblem(row, "uncertainty", "data.out-of-range", "uncertainty must be below the position ("
                        + positions[k] + "), got " + uncertainties[k]);
            }
            intensities[k] = p.number(row, "intensity", false);
            widths[k] = p.number(row, "width", false);
            p.text(row, "note");
            lines[k] = row.line();
            entries[k] = row.entry();
        }
    }

    /**
     * Writes peaks in the CSV encoding; every number is written with the shortest decimal that
     * reads back as the same double, so {@link #read(String, String)} gives the same values bit
     * for bit (NaN, "not given", as an empty field).
     *
     * @param peaks      the peaks (their {@code lines} and {@code entries} are not written)
     * @param title      the file's title
     * @param source     where the peaks come from (instrument, run, date)
     * @param provenance published, from-memory, computed or measured
     * @param version    the file's version
     * @return the file's text
     * @throws IllegalArgumentException when a header value spans lines, a position is not finite and
     *         positive, an uncertainty is not below its position (as the reader refuses it), or an
     *         uncertainty, intensity or width is negative or infinite (naming the peak)
     */
    public static String writeCsv(Peaks peaks, String title, String source, String provenance, String version) {
        Map<String, String> header = new LinkedHashMap<>();
        header.put("id", peaks.id());
        header.put("title", title);
        header.put("source", source);
        header.put("provenance", provenance);
        header.put("version", version);
        header.put("position-unit", peaks.unit().symbol());
        if (peaks.medium() != null) {
            header.put("medium", peaks.medium().spec());
        }
        for (Map.Entry<String, String> entry : header.entrySet()) {
            if (entry.getValue() == null || entry.getValue().contains("\n") || entry.getValue().contains("\r")) {
                throw new IllegalArgumentException("header " + entry.getKey() + " must be one line of text, got "
                        + entry.getValue());
            }
        }
        List<String[]> rows = new ArrayList<>();
        double[] positions = peaks.positions();
        double[] uncertainties = peaks.uncertainties();
        double[] intensities = peaks.intensities();
        double[] widths = peaks.widths();
        for (int k = 0; k < positions.length; k++) {
            if (!(positions[k] > 0) || Double.isInfinite(positions[k])) {
                throw new IllegalArgumentException("peak " + k + ": position must be finite and positive, got "
                        + positions[k]);
            }
            if (uncertainties[k] >= positions[k]) {
                throw new IllegalArgumentException("peak " + k + ": uncertainty must be below the position ("
                        + positions[k] + "), got " + uncertainties[k]);
            }
            rows.add(new String[] {Double.toString(positions[k]), number(k, "uncertainty", uncertainties[k]),
                number(k, "intensity", intensities[k]), number(k, "width", widths[k]), ""});
        }
        return TabularFiles.writeCsv(SPEC, header, rows);
    }

    /** An optional non-negative number as the reader takes it: NaN is "not given". */
    private static String number(int k, String column, double value) {
        if (Double.isNaN(value)) {
            return "";
        }
        if (!(value >= 0) || Double.isInfinite(value)) {
            throw new IllegalArgumentException("peak " + k + ": " + column + " must be finite and not negative, got "
                    + value);
        }
        return Double.toString(value);
    }
}
