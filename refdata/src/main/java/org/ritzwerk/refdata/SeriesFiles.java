package org.ritzwerk.refdata;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.ritzwerk.RitzwerkException;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.convert.SpectralArrays;
import org.ritzwerk.engine.ritz.RydbergSeries;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;

/**
 * Ritzwerk's own file of measured Rydberg-series members ({@code ritzwerk-series}, version 1), in
 * CSV or JSON with the header rules and strictness of the other tabular files:
 * <pre>
 * # ritzwerk-series 1
 * # species: He-4 I
 * # energy-unit: cm-1
 * # source: where the energies come from (optional)
 * series,n,energy,uncertainty
 * 1snp 1P1,10,197225.4,0.05
 * </pre>
 * Header keys {@code species} (a neutral atom; its mass number picks the isotope whose R_M is used,
 * none the element's default isotope) and {@code energy-unit} (a wavenumber, energy or frequency
 * unit: cm-1, m-1, eV, meV, J, or Hz to THz for energies E / h as comb and wavemeter data come) are
 * required, {@code title}, {@code source} and {@code note} optional. Every column is required:
 * {@code series} (a name; rows of one name form one series, in the order the names first appear),
 * {@code n} (an integer 1 to 10000), {@code energy} above the ground level and its standard
 * {@code uncertainty} (positive); an empty or blank field in any of them is an error. A row is one
 * measurement: an n given on several rows of one series is a level measured several times (two runs,
 * two papers, two lines reaching it), each row an independent datum of the fit with its own residual,
 * named by its line ({@link RydbergSeries#where}; {@code file:line (entry k)} for JSON entries sharing a
 * line). Energies must rise with n: every measurement of an n above every measurement of the n below. In
 * JSON the key is {@code energyUnit} and the rows are under {@code members}. Every problem is
 * reported with file, line and column, all at once.
 * Stateless and thread-safe.
 */
public final class SeriesFiles {

    /** The format name in both encodings. */
    public static final String FORMAT = "ritzwerk-series";
    /** The format version this reader reads. */
    public static final int VERSION = 1;
    /** Columns in the order they are written. */
    public static final List<String> COLUMNS = List.of("series", "n", "energy", "uncertainty");

    private static final TabularFiles.Spec SPEC = new TabularFiles.Spec(FORMAT, VERSION, "energy-unit",
            List.of("species", "energy-unit", "title", "source", "note"), List.of("species", "energy-unit"), COLUMNS,
            COLUMNS, List.of("n", "energy", "uncertainty"), "members");

    /**
     * A series file as read: the species and its series, energies in cm^-1.
     *
     * @param species the species of the header
     * @param series  the series, in the order their names first appear
     * @param source  the header's source, or empty
     */
    public record Contents(Species species, List<RydbergSeries> series, String source) {
    }

    private SeriesFiles() {
    }

    /**
     * @param file a {@code .csv} or {@code .json} file
     * @return its species and series, energies converted to cm^-1
     * @throws DataFileException with every problem found, each with file, line and column
     */
    public static Contents read(Path file) {
        String name = file.toString();
        String text = TabularFiles.read(file);
        return read(text, name);
    }

    /**
     * @param text   the whole file
     * @param source file name for messages; its extension (or the text) picks the encoding
     * @return its species and series, energies converted to cm^-1
     * @throws DataFileException with every problem found
     */
    public static Contents read(String text, String source) {
        TabularFiles.Parsed p = TabularFiles.isJson(source, text) ? TabularFiles.parseJson(SPEC, text, source)
                : TabularFiles.parseCsv(SPEC, text, source);
        p.checkHeader();
        Unit unit = p.unit(EnumSet.of(Kind.WAVENUMBER, Kind.ENERGY, Kind.FREQUENCY));
        Species species = null;
        String speciesText = p.header.get("species");
        if (speciesText != null && !speciesText.isBlank()) {
            try {
                species = Species.parse(speciesText);
                if (species.charge() != 0) {
                    p.headerProblem("species", "data.bad-species", "the series fit is for neutral atoms; "
                            + species.notation() + " has charge " + species.charge());
                    species = null;
                }
            } catch (RitzwerkException e) {
                p.headerProblem("species", "data.unknown-species", e.getMessage());
            }
        }
        double factor = 1;
        if (unit != null) {
            double[] one = {1.0};
            SpectralArrays.convert(one, unit, null, Unit.PER_CENTIMETRE, null, one);
            factor = one[0];
        }
        Map<String, RydbergSeries.Builder> builders = new LinkedHashMap<>();
        // JSON entries sharing a line are told apart by their place in the array
        Map<Integer, Integer> rowsOnLine = new HashMap<>();
        p.rows.forEach(row -> rowsOnLine.merge(row.line(), 1, Integer::sum));
        Map<String, java.util.TreeMap<Integer, List<Map.Entry<Double, TabularFiles.Row>>>> members =
                new LinkedHashMap<>();
        for (TabularFiles.Row row : p.rows) {
            int before = p.problems.size();
            String name = p.text(row, "series");
            // An empty field reads as no value: refused like a blank name, never dropped (a row
            // whose text was refused already has its problem)
            if ((name == null && p.problems.size() == before) || (name != null && name.isBlank())) {
                p.rowProblem(row, "series", "data.missing-value", "series needs a name (rows of one name form "
                        + "one series)");
            }
            double n = p.number(row, "n", true);
            // signed: zero and a negative value get one message each, naming the value
            double energy = p.signedNumber(row, "energy", true);
            double uncertainty = p.signedNumber(row, "uncertainty", true);
            if (!Double.isNaN(n) && (n != Math.rint(n) || n < 1 || n > 10000)) {
                p.rowProblem(row, "n", "data.bad-n", "n must be an integer 1 to 10000, got " + row.values().get("n"));
            }
            if (!Double.isNaN(energy) && !(energy > 0)) {
                p.rowProblem(row, "energy", "data.not-positive", "energy must be above 0 (the ground level), got "
                        + row.values().get("energy"));
            }
            if (!Double.isNaN(uncertainty) && !(uncertainty > 0)) {
                p.rowProblem(row, "uncertainty", "data.not-positive", "uncertainty must be positive, got "
                        + row.values().get("uncertainty"));
            }
            if (p.problems.size() != before || name == null) {
                continue;
            }
            // a repeated n is one more measurement of that level, placed by its own line
            String place = p.source + ":" + row.line() + (row.entry() > 0 && rowsOnLine.get(row.line()) > 1
                    ? " (entry " + row.entry() + ")" : "");
            builders.computeIfAbsent(name.strip(), RydbergSeries::builder).add((int) n, energy * factor,
                    uncertainty * factor, place);
            members.computeIfAbsent(name.strip(), k -> new java.util.TreeMap<>()).computeIfAbsent((int) n,
                    k -> new ArrayList<>()).add(Map.entry(energy * factor, row));
        }
        // A Rydberg series rises towards its limit: a member below one of lower n is a typing error
        // (or a member of another series), which a fit would only turn into nonsense defects. Every
        // measurement of an n must lie above every measurement of the n below.
        members.forEach((name, byN) -> {
            Map.Entry<Integer, List<Map.Entry<Double, TabularFiles.Row>>> previous = null;
            for (Map.Entry<Integer, List<Map.Entry<Double, TabularFiles.Row>>> level : byN.entrySet()) {
                if (previous != null) {
                    Map.Entry<Double, TabularFiles.Row> highest = previous.getValue().get(0);
                    for (Map.Entry<Double, TabularFiles.Row> m : previous.getValue()) {
                        highest = m.getKey() > highest.getKey() ? m : highest;
                    }
                    for (Map.Entry<Double, TabularFiles.Row> m : level.getValue()) {
                        if (!(m.getKey() > highest.getKey())) {
                            p.rowProblem(m.getValue(), "energy", "data.not-rising", String.format(java.util.Locale.ROOT,
                                    "series '%s': the energy of n = %d is not above that of n = %d (line %d); a "
                                    + "Rydberg series rises towards its limit", name, level.getKey(), previous.getKey(),
                                    highest.getValue().line()));
                        }
                    }
                }
                previous = level;
            }
        });
        if (p.problems.isEmpty() && builders.isEmpty()) {
            p.problem(1, 0, "data.empty", "the file has no members", "");
        }
        p.throwIfAny();
        List<RydbergSeries> series = new ArrayList<>();
        builders.values().forEach(b -> series.add(b.build()));
        return new Contents(Objects.requireNonNull(species), series, p.header.getOrDefault("source", ""));
    }

    /**
     * @param context where the isotope's atomic mass comes from
     * @param species a neutral atom; without mass number the element's default isotope
     * @return the isotope's reduced-mass Rydberg constant, cm^-1
     *         ({@link QuantumDefectFiles#rydbergPerCm(double)})
     * @throws ReferenceDataException when the context has no mass for the isotope
     */
    public static double rydbergPerCm(DataContext context, Species species) {
        return QuantumDefectFiles.rydbergPerCm(context.isotope(species).atomicMass());
    }
}
