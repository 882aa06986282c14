package org.ritzwerk.refdata;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.ritz.MeasuredLines;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.medium.MediumException;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * Ritzwerk's own file of measured, assigned lines for a level optimisation
 * ({@code ritzwerk-measured-lines}, version 1), in CSV or JSON with the header rules and
 * strictness of the other tabular files:
 * <pre>
 * # ritzwerk-measured-lines 1
 * # title: He I triplets, discharge run 3
 * # source: where the lines were measured (optional)
 * # position-unit: nm
 * # medium: air
 * position,uncertainty,upper,lower
 * 388.86489,0.00002,1s3p 3P2,1s2s 3S1
 * </pre>
 * Header key {@code position-unit} (a wavelength, wavenumber, frequency or energy unit) is
 * required, with {@code medium} ({@code vacuum}, {@code air} or {@code air(<model>)}) for
 * wavelengths and only for them; {@code title}, {@code source} and {@code note} are optional.
 * Every column is required: {@code position} (above 0), its standard {@code uncertainty} (above 0,
 * same unit), and the labels of the {@code upper} and {@code lower} level. Labels are compared with
 * their ends stripped and internal white space made one blank, as {@link MeasuredLines} does. In
 * JSON the key is {@code positionUnit} and the rows are under {@code lines}.
 *
 * <p>Positions become vacuum wavenumbers (cm^-1) through the medium's dispersion; an uncertainty u
 * becomes {@code u |d sigma / dx|}, the first-order propagation through the conversion (JCGM
 * 100:2008, eq. 10), the derivative by a central difference of step {@code 1e-5 x}, so that for
 * wavelengths in air it includes the air's dispersion. Positions already in cm^-1 (an identity
 * conversion) keep their uncertainty exactly as given.
 *
 * <p>Refused, every problem with file, line and column, all at once: the tabular rules, a
 * position outside the medium's range, upper and lower the same level, and a pair of levels given
 * both ways (A - B on one line, B - A on another: with positive wavenumbers one is reversed).
 * Stateless and thread-safe.
 */
public final class MeasuredLineFiles {

    /** The format name in both encodings. */
    public static final String FORMAT = "ritzwerk-measured-lines";
    /** The format version this reader reads. */
    public static final int VERSION = 1;
    /** Columns in the order they are written. */
    public static final List<String> COLUMNS = List.of("position", "uncertainty", "upper", "lower");

    private static final TabularFiles.Spec SPEC = new TabularFiles.Spec(FORMAT, VERSION, "position-unit",
            List.of("title", "source", "note", "position-unit", "medium"), List.of("position-unit"), COLUMNS,
            COLUMNS, List.of("position", "uncertainty"), "lines");
    private static final Pattern WHITE_SPACE = Pattern.compile("\\p{javaWhitespace}+");

    private MeasuredLineFiles() {
    }

    /**
     * One line as read.
     *
     * @param perCm      its vacuum wavenumber, cm^-1
     * @param sigmaPerCm its standard uncertainty, cm^-1
     * @param upper      the upper level's label, white space normalised
     * @param lower      the lower level's label, white space normalised
     * @param where      {@code file:line}
     */
    public record Line(double perCm, double sigmaPerCm, String upper, String lower, String where) {
    }

    /**
     * A file as read.
     *
     * @param lines  its lines, in file order
     * @param unit   the position unit of the file
     * @param medium the medium of wavelength positions, else null
     * @param source the header's source, or empty
     */
    public record Contents(List<Line> lines, Unit unit, Medium medium, String source) {

        /**
         * Copies the lines.
         *
         * @param lines  its lines, copied
         * @param unit   the position unit of the file
         * @param medium the medium of wavelength positions, else null
         * @param source the header's source, or empty
         */
        public Contents {
            lines = List.copyOf(lines);
        }

        /**
         * @param reference the label of the level held fixed
         * @param perCm     its energy, cm^-1
         * @return the problem of a level optimisation, each line named by {@code file:line}
         * @throws org.ritzwerk.engine.ritz.RitzException for a blank reference or bad energy
         */
        public MeasuredLines problem(String reference, double perCm) {
            MeasuredLines.Builder b = MeasuredLines.builder(reference, perCm);
            for (Line line : lines) {
                b.add(line.upper(), line.lower(), line.perCm(), line.sigmaPerCm(), line.where());
            }
            return b.build();
        }
    }

    /**
     * @param file a {@code .csv} or {@code .json} file
     * @return its lines, positions converted to vacuum cm^-1
     * @throws DataFileException with every problem found, each with file, line and column
     */
    public static Contents read(Path file) {
        String name = file.toString();
        return read(TabularFiles.read(file), name);
    }

    /**
     * @param text   the whole file
     * @param source file name for messages; its extension (or the text) picks the encoding
     * @return its lines, positions converted to vacuum cm^-1
     * @throws DataFileException with every problem found
     */
    public static Contents read(String text, String source) {
        TabularFiles.Parsed p = TabularFiles.isJson(source, text) ? TabularFiles.parseJson(SPEC, text, source)
                : TabularFiles.parseCsv(SPEC, text, source);
        p.checkHeader();
        Unit unit = p.unit(EnumSet.of(Kind.WAVELENGTH, Kind.WAVENUMBER, Kind.FREQUENCY, Kind.ENERGY));
        Medium medium = p.medium(unit);
        boolean convertible = unit != null && (unit.kind() != Kind.WAVELENGTH || medium != null);
        List<Line> lines = new ArrayList<>();
        Map<String, Integer> pairs = new HashMap<>();
        for (TabularFiles.Row row : p.rows) {
            int before = p.problems.size();
            double position = p.number(row, "position", true);
            double uncertainty = p.number(row, "uncertainty", true);
            String upper = label(p, row, "upper");
            String lower = label(p, row, "lower");
            if (!Double.isNaN(position) && !(position > 0)) {
                p.rowProblem(row, "position", "data.not-positive", "position must be above 0");
            }
            if (!Double.isNaN(uncertainty) && !(uncertainty > 0)) {
                p.rowProblem(row, "uncertainty", "data.not-positive", "uncertainty must be above 0");
            }
            if (upper != null && upper.equals(lower)) {
                p.rowProblem(row, "lower", "data.same-level", "upper and lower are the same level '" + upper + "'");
            }
            if (p.problems.size() != before || upper == null || lower == null || !convertible) {
                continue;
            }
            Integer reversed = pairs.get(lower + "\u0000" + upper);
            if (reversed != null) {
                p.rowProblem(row, "upper", "data.reversed-pair", "'" + upper + "' - '" + lower + "' is given the "
                        + "other way round on line " + reversed + "; with positive wavenumbers one is reversed");
                continue;
            }
            pairs.putIfAbsent(upper + "\u0000" + lower, row.line());
            double h = 1e-5 * position;      // rounding and truncation errors both near 1e-11 relative
            double[] x = {position, position + h, position - h};
            try {
                SpectralArrays.convert(x, unit, medium, Unit.PER_CENTIMETRE, null, x);
            } catch (MediumException | IllegalArgumentException e) {
                p.rowProblem(row, "position", "data.outside-medium", e.getMessage());
                continue;
            }
            // an identity conversion (positions in cm-1) keeps the uncertainty as given: the central
            // difference would return it with a rounding error (0.001 as 9.999999999961507e-4)
            boolean identity = x[0] == position && x[1] == position + h && x[2] == position - h;
            double sigma = identity ? uncertainty : uncertainty * Math.abs(x[1] - x[2]) / (2 * h);
            lines.add(new Line(x[0], sigma, upper, lower, source + ":" + row.line()));
        }
        if (p.problems.isEmpty() && lines.isEmpty()) {
            p.problem(1, 0, "data.empty", "the file has no lines", "");
        }
        p.throwIfAny();
        return new Contents(lines, unit, medium, p.header.getOrDefault("source", ""));
    }

    private static String label(TabularFiles.Parsed p, TabularFiles.Row row, String column) {
        String text = p.text(row, column);
        if (text == null) {
            if (row.values().get(column) == null) {
                p.rowProblem(row, column, "data.missing-value", column + " level label is required");
            }
            return null;
        }
        String label = WHITE_SPACE.matcher(text.strip()).replaceAll(" ");
        if (label.isEmpty()) {
            p.rowProblem(row, column, "data.missing-value", column + " level label is required");
            return null;
        }
        return label;
    }
}
