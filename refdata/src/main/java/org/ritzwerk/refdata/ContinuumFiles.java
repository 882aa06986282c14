package org.ritzwerk.refdata;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.ritzwerk.RitzwerkException;

/**
 * A continuum shape of the user's own: a CSV file with {@code #} comment lines, a header
 * {@code wavelength_nm,density} and rows with rising positive wavelengths (in the spectrum's axis
 * medium) and densities that are finite and not negative, in any unit (only the shape matters).
 * Between rows the density is linear. Every bad row is reported at once, each with file, line and
 * field. Stateless.
 */
public final class ContinuumFiles {

    /** Error code of a continuum file that cannot be used: bad rows, too few rows, a short range. */
    public static final String BAD_FILE = "continuum.bad-file";

    private ContinuumFiles() {
    }

    /**
     * @param file the file (UTF-8; a byte-order mark is accepted)
     * @param lo   the spectrum's first pixel edge, nm; the file must reach it
     * @param hi   the last pixel edge, nm; the file must reach it
     * @return the density as a function of wavelength in nm, divided by the largest value the
     *         spectrum's range sees
     * @throws DataFileException when the file cannot be read (missing, a folder, not UTF-8)
     * @throws RitzwerkException with code {@link #BAD_FILE}, naming the file, line and field of
     *         every bad row
     */
    public static DoubleUnaryOperator read(Path file, double lo, double hi) {
        List<String> text = TabularFiles.read(file).lines().toList();
        double[] x = new double[text.size()];
        double[] y = new double[text.size()];
        int n = 0;
        boolean header = false;
        // Every bad row is reported, not only the first.
        List<String> problems = new java.util.ArrayList<>();
        for (int i = 0; i < text.size(); i++) {
            String line = text.get(i).strip();
            String where = file + ":" + (i + 1) + ": ";
            if (line.isEmpty() || line.startsWith("#")) {
                continue;
            }
            if (!header) {
                if (!line.replace(" ", "").equals("wavelength_nm,density")) {
                    throw refused(where + "expected the header 'wavelength_nm,density', got '"
                            + line + "'");
                }
                header = true;
                continue;
            }
            String[] cells = line.split(",", -1);
            if (cells.length != 2) {
                problems.add(where + "expected 2 fields (wavelength_nm,density), got " + cells.length);
                continue;
            }
            int before = problems.size();
            double wavelength = number(cells[0], where + "wavelength_nm", problems);
            double density = number(cells[1], where + "density", problems);
            if (problems.size() > before) {
                continue;
            }
            if (density < 0) {
                problems.add(where + "density must not be negative, got " + cells[1].strip());
                continue;
            }
            if (!(wavelength > 0)) {
                problems.add(where + "wavelength_nm must be positive, got " + cells[0].strip());
                continue;
            }
            if (n > 0 && !(wavelength > x[n - 1])) {
                problems.add(where + "wavelength_nm must rise from row to row, got " + cells[0].strip() + " after "
                        + x[n - 1]);
                continue;
            }
            x[n] = wavelength;
            y[n] = density;
            n++;
        }
        if (!problems.isEmpty()) {
            throw refused(problems.size() == 1 ? problems.get(0)
                    : problems.size() + " problems in " + file + ":\n  " + String.join("\n  ", problems));
        }
        if (n < 2) {
            throw refused(file + ": needs at least two rows after the header, found " + n);
        }
        if (x[0] > lo || x[n - 1] < hi) {
            throw refused(file + ": covers " + x[0] + " to " + x[n - 1]
                    + " nm but the spectrum spans " + lo + " to " + hi + " nm");
        }
        double[] xs = Arrays.copyOf(x, n);
        double[] ys = Arrays.copyOf(y, n);
        // Only the shape counts (the continuum is scaled to --continuum-counts): divide by the
        // largest density the spectrum sees (the rows from the last one at or below lo to the
        // first one at or above hi), so that huge but finite densities cannot overflow and a
        // huge one far outside the range cannot leave the rest below the smallest double.
        int first = 0;
        while (first + 1 < n && xs[first + 1] <= lo) {
            first++;
        }
        int last = n - 1;
        while (last - 1 >= 0 && xs[last - 1] >= hi) {
            last--;
        }
        double top = 0;
        for (int k = first; k <= last; k++) {
            top = Math.max(top, ys[k]);
        }
        if (top > 0) {
            for (int k = 0; k < ys.length; k++) {
                ys[k] = Math.min(ys[k] / top, Double.MAX_VALUE);
            }
        }
        return nm -> {
            int k = Arrays.binarySearch(xs, nm);
            if (k >= 0) {
                return ys[k];
            }
            int i = Math.max(1, Math.min(xs.length - 1, -k - 1));
            double t = (nm - xs[i - 1]) / (xs[i] - xs[i - 1]);
            return ys[i - 1] + t * (ys[i] - ys[i - 1]);
        };
    }

    private static RitzwerkException refused(String message) {
        return new RitzwerkException(BAD_FILE, message);
    }

    /** The cell as a finite number, or NaN after adding a problem naming where it is. */
    private static double number(String cell, String where, List<String> problems) {
        try {
            double v = Double.parseDouble(cell.strip());
            if (Double.isFinite(v)) {
                return v;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        problems.add(where + " must be a finite number, got '" + cell.strip() + "'");
        return Double.NaN;
    }
}
