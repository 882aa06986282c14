package org.ritzwerk.refdata;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.engine.synth.SyntheticSpectrum;
import org.ritzwerk.medium.Medium;

/**
 * The truth of a synthetic spectrum: the lines that went into it, with the counts each put in
 * ({@code ritzwerk-spectrum-lines}, version 1, CSV), as {@code ritzwerk synth --truth} writes it:
 * <pre>
 * # ritzwerk-spectrum-lines 1
 * # medium: air
 * # counts: counts is each line's expected counts over its whole profile, before noise; ...
 * # widths: doppler_fwhm_nm is the Gaussian (Doppler) FWHM, lorentz_fwhm_nm the Lorentzian ...
 * wavelength_nm,counts,counts_in_pixels,doppler_fwhm_nm,lorentz_fwhm_nm,line
 * 656.2799905441436,41263.71902356815,41263.71902356815,0.021418034516043176,0.0,H I Balmer alpha
 * </pre>
 * {@code wavelength_nm} is the line centre in nm in the header's {@code medium} (the spectrum's
 * axis medium, Doppler-shifted by the scene's velocity); {@code counts} (the whole line),
 * {@code counts_in_pixels} (the part of it the pixels hold; optional when reading, for files
 * written before it) and the two widths (nm) are not negative; {@code line} is the line's label
 * (one line of text, at most 500 characters, quoted as CSV when it holds a comma, a quote or
 * spaces at its ends). Numbers are written as the
 * shortest decimal that reads back as the same double, so {@link #read(String, String)} gives back
 * what {@link #writeCsv} was given, bit for bit. The header keys {@code counts} and {@code widths}
 * are explanations for the reader and optional; {@code medium} is required.
 *
 * <p>Every problem of a file is reported with file, line, column and code in one
 * {@link DataFileException}. Stateless and thread-safe.
 */
public final class SpectrumLineFiles {

    /** The format name. */
    public static final String FORMAT = "ritzwerk-spectrum-lines";
    /** The format version. */
    public static final int VERSION = 1;

    /** The explanation written under the key {@code counts}. */
    static final String COUNTS_NOTE = "counts is each line's expected counts over its whole profile, before noise"
            + " (what a fit of the line recovers); counts_in_pixels the part of them the pixels hold (less where the"
            + " line lies near or beyond an end of the spectrum, or has wings beyond the renderer's window)";
    /** The explanation written under the key {@code widths}. */
    static final String WIDTHS_NOTE = "doppler_fwhm_nm is the Gaussian (Doppler) FWHM, lorentz_fwhm_nm the Lorentzian"
            + " FWHM (collisional, natural, Stark), both in nm; the instrument's response is not included";

    private static final List<String> COLUMNS = List.of("wavelength_nm", "counts", "counts_in_pixels",
            "doppler_fwhm_nm", "lorentz_fwhm_nm", "line");
    private static final TabularFiles.Spec SPEC = new TabularFiles.Spec(FORMAT, VERSION, null,
            List.of("medium", "counts", "widths"), List.of("medium"), COLUMNS,
            List.of("wavelength_nm", "counts", "doppler_fwhm_nm", "lorentz_fwhm_nm", "line"),
            COLUMNS.subList(0, 5), "lines");
    private static final int MAX_LABEL = 500;

    private SpectrumLineFiles() {
    }

    /**
     * A truth table as read, in file order.
     *
     * @param source      the file name, for messages
     * @param medium      the medium of the wavelengths
     * @param wavelengths line centres in nm
     * @param counts      each line's expected counts over its whole profile
     * @param countsInPixels the part of them the pixels hold; null for a file without the column
     * @param dopplerFwhm Doppler (Gaussian) FWHM in nm
     * @param lorentzFwhm Lorentzian FWHM in nm
     * @param labels      the lines' labels
     * @param lines       the 1-based file line of each row
     */
    public record SpectrumLines(String source, Medium medium, double[] wavelengths, double[] counts,
            double[] countsInPixels, double[] dopplerFwhm, double[] lorentzFwhm, List<String> labels, int[] lines) {

        /** @return the number of lines */
        public int size() {
            return wavelengths.length;
        }
    }

    /**
     * Writes the lines of a synthetic spectrum, one row per line in the spectrum's order.
     *
     * @param spectrum the spectrum; the header's {@code medium} is its axis medium
     *                 ({@link SyntheticSpectrum#medium()}), in which its lines' positions are
     * @param out      where to write; not closed
     * @throws IOException when writing fails
     * @throws IllegalArgumentException naming the line when a value is not finite, a wavelength not
     *         positive, counts or a width negative, or a label empty, not one line or over 500
     *         characters (checked before anything is written)
     */
    public static void writeCsv(SyntheticSpectrum spectrum, Writer out) throws IOException {
        Scene.Lines lines = spectrum.lines();
        for (int i = 0; i < lines.size(); i++) {
            check(i, lines.position(i), spectrum.lineCounts(i), lines.gaussianFwhm(i), lines.lorentzFwhm(i),
                    lines.label(i));
            check(i, lines.position(i), spectrum.lineCountsInPixels(i), 0, 0, lines.label(i));
        }
        out.write("# " + FORMAT + " " + VERSION + "\n");
        out.write("# medium: " + spectrum.medium().spec() + "\n");
        out.write("# counts: " + COUNTS_NOTE + "\n");
        out.write("# widths: " + WIDTHS_NOTE + "\n");
        out.write(String.join(",", COLUMNS) + "\n");
        StringBuilder row = new StringBuilder();
        for (int i = 0; i < lines.size(); i++) {
            row.setLength(0);
            row.append(lines.position(i)).append(',').append(spectrum.lineCounts(i)).append(',')
                    .append(spectrum.lineCountsInPixels(i)).append(',').append(lines.gaussianFwhm(i)).append(',')
                    .append(lines.lorentzFwhm(i)).append(',');
            csvText(row, lines.label(i));
            out.append(row).append('\n');
        }
    }

    static void check(int i, double nm, double counts, double doppler, double lorentz, String label) {
        if (!(nm > 0) || Double.isInfinite(nm)) {
            throw new IllegalArgumentException("line " + i + ": wavelength must be finite and positive, got " + nm);
        }
        for (double v : new double[] {counts, doppler, lorentz}) {
            if (!(v >= 0) || Double.isInfinite(v)) {
                throw new IllegalArgumentException("line " + i + " (" + label + "): counts and widths must be finite"
                        + " and not negative, got counts " + counts + ", Doppler FWHM " + doppler
                        + ", Lorentzian FWHM " + lorentz);
            }
        }
        if (label == null || label.isEmpty() || label.length() > MAX_LABEL || label.indexOf('\n') >= 0
                || label.indexOf('\r') >= 0) {
            throw new IllegalArgumentException("line " + i + ": the label must be one line of 1 to " + MAX_LABEL
                    + " characters, got '" + label + "'");
        }
    }

    /** Appends text as one CSV field: quoted (quotes doubled) when it holds a comma, a quote or spaces at its ends. */
    static void csvText(StringBuilder row, String text) {
        boolean quote = text.indexOf(',') >= 0 || text.indexOf('"') >= 0 || !text.equals(text.strip())
                || text.startsWith("#");
        if (!quote) {
            row.append(text);
            return;
        }
        row.append('"').append(text.replace("\"", "\"\"")).append('"');
    }

    /**
     * @param file a truth file
     * @return its lines
     * @throws DataFileException with every problem found
     */
    public static SpectrumLines read(Path file) {
        return read(TabularFiles.read(file), file.toString());
    }

    /**
     * @param text   a truth file's text
     * @param source the file's name, for messages
     * @return its lines
     * @throws DataFileException with every problem found (file, line, column, code)
     */
    public static SpectrumLines read(String text, String source) {
        TabularFiles.Parsed p = TabularFiles.parseCsv(SPEC, text, source);
        p.checkHeader();
        Medium medium = null;
        String mediumText = p.header.get("medium");
        if (mediumText != null && !mediumText.isBlank()) {
            try {
                medium = Medium.parse(mediumText);
            } catch (RitzwerkException e) {
                p.headerProblem("medium", "data.unknown-medium", e.getMessage());
            }
        }
        int n = p.rows.size();
        double[] nm = new double[n];
        double[] counts = new double[n];
        double[] inPixels = p.columnIndex.containsKey("counts_in_pixels") ? new double[n] : null;
        double[] doppler = new double[n];
        double[] lorentz = new double[n];
        List<String> labels = new ArrayList<>(n);
        int[] lines = new int[n];
        for (int k = 0; k < n; k++) {
            TabularFiles.Row row = p.rows.get(k);
            nm[k] = p.number(row, "wavelength_nm", true);
            if (nm[k] == 0) {
                p.rowProblem(row, "wavelength_nm", "data.not-positive", "wavelength_nm must be positive, got 0");
            }
            counts[k] = p.number(row, "counts", true);
            if (inPixels != null) {
                inPixels[k] = p.number(row, "counts_in_pixels", true);
            }
            doppler[k] = p.number(row, "doppler_fwhm_nm", true);
            lorentz[k] = p.number(row, "lorentz_fwhm_nm", true);
            String label = p.text(row, "line");
            if (label == null && row.values().get("line") == null) {
                p.rowProblem(row, "line", "data.missing-value", "line is required");
            }
            labels.add(label);
            lines[k] = row.line();
        }
        p.throwIfAny();
        return new SpectrumLines(source, medium, nm, counts, inPixels, doppler, lorentz, List.copyOf(labels), lines);
    }
}
