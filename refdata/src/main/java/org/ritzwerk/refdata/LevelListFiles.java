package org.ritzwerk.refdata;

import java.io.InputStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.ritz.LevelDesignation;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.quantity.Kind;
import org.ritzwerk.quantity.Unit;
import tools.jackson.databind.node.ObjectNode;

/**
 * Ritzwerk's own level-table file format ({@code ritzwerk-levels}, version 1), in CSV and JSON,
 * the sibling of {@link LineListFiles} with the same header rules, strictness and exact round
 * trip:
 * <pre>
 * # ritzwerk-levels 1
 * # id: bench-he-levels
 * # title: Helium levels used by the bench software
 * # source: ...
 * # provenance: published
 * # version: 1
 * # energy-unit: cm-1
 * species,label,energy,uncertainty,j,note
 * He I,1s2 1S0,0,,0,
 * He I,1s2s 3S1,159855.9745,0.0005,1,
 * </pre>
 * Header keys {@code id}, {@code title}, {@code source}, {@code provenance}, {@code version} and
 * {@code energy-unit} (a wavenumber or energy unit: cm-1, m-1, eV, meV, J) are required,
 * {@code note} optional. Columns {@code species}, {@code label} and {@code energy} (above the
 * species' ground state, not negative) are required; {@code uncertainty}, {@code j} (an integer
 * or half-integer such as {@code 3/2}) and {@code note} are optional. In JSON the key is
 * {@code energyUnit} and the rows are under {@code levels}. A repeated species and label is
 * refused as a duplicate.
 *
 * <p>Correlated levels (optional): after the levels, a line {@code # correlations}, then rows
 * {@code species,label,other,correlation} (all four required), each the correlation coefficient r
 * (-1 to 1) of the energies of two levels of one species, so that their covariance is
 * {@code r u_label u_other} (common practice: the GUM, JCGM 100:2008, 5.2.2); a pair not given is
 * uncorrelated. In JSON the rows are objects under {@code correlations}. Each level named must be a
 * level of that species in the file, with an uncertainty above 0; every level of a correlated
 * species needs an uncertainty; a pair is given once (in either order; given again with another
 * value it would make the matrix asymmetric, and is refused saying so), a level not with itself; and
 * the covariance matrix the rows make must be positive semidefinite (no set of energies can have
 * one that is not), the row refused being the last of the first level whose correlations with the
 * levels before it make the matrix indefinite. Each problem names the file, line and column.
 * <pre>
 * # correlations
 * species,label,other,correlation
 * He I,1s2s 3S1,1s2p 3P2,0.35
 * </pre>
 * Stateless and thread-safe.
 */
public final class LevelListFiles {

    /** The format name in both encodings. */
    public static final String FORMAT = "ritzwerk-levels";
    /** The format version this reader writes and reads. */
    public static final int VERSION = 1;
    /** Columns in the order they are written. */
    public static final List<String> COLUMNS = List.of("species", "label", "energy", "uncertainty", "j", "note");

    private static final TabularFiles.Spec SPEC = new TabularFiles.Spec(FORMAT, VERSION, "energy-unit",
            List.of("id", "title", "source", "provenance", "version", "energy-unit", "note"),
            List.of("id", "title", "source", "provenance", "version", "energy-unit"), COLUMNS,
            List.of("species", "label", "energy"), List.of("energy", "uncertainty"), "levels");
    /** The line that starts the correlations in CSV (after {@code #}). */
    public static final String CORRELATIONS = "correlations";
    /** Columns of the correlations, in the order they are written. */
    public static final List<String> CORRELATION_COLUMNS = List.of("species", "label", "other", "correlation");
    private static final TabularFiles.Spec CORRELATION_SPEC = new TabularFiles.Spec(FORMAT, VERSION, "energy-unit",
            SPEC.headerKeys(), SPEC.requiredKeys(), CORRELATION_COLUMNS, CORRELATION_COLUMNS, List.of("correlation"),
            CORRELATIONS);
    private static final Pattern J = Pattern.compile("(\\d{1,4})(/2)?");

    private LevelListFiles() {
    }

    /**
     * @param file a {@code .csv} or {@code .json} file
     * @return the table
     * @throws DataFileException with every problem found
     */
    public static LevelList read(Path file) {
        String name = file.toString();
        String text = TabularFiles.read(file);
        return TabularFiles.isJson(name, text) ? readJson(text, name) : readCsv(text, name);
    }

    /**
     * @param in     the bytes (UTF-8), read to the end; not closed
     * @param source file name for messages; its extension picks the encoding
     * @return the table
     * @throws DataFileException with every problem found
     */
    public static LevelList read(InputStream in, String source) {
        String text = TabularFiles.decode(in, source);
        return TabularFiles.isJson(source, text) ? readJson(text, source) : readCsv(text, source);
    }

    /**
     * @param text   the whole file
     * @param source file name for messages
     * @return the table
     * @throws DataFileException with every problem found
     */
    public static LevelList readCsv(String text, String source) {
        int marker = TabularFiles.sectionLine(text, CORRELATIONS);
        if (marker < 0) {
            return build(TabularFiles.parseCsv(SPEC, text, source), null);
        }
        return build(TabularFiles.parseCsv(SPEC, TabularFiles.before(text, marker), source),
                TabularFiles.parseCsvSection(CORRELATION_SPEC, text, source, marker));
    }

    /**
     * @param text   the whole file
     * @param source file name for messages
     * @return the table
     * @throws DataFileException with every problem found
     */
    public static LevelList readJson(String text, String source) {
        TabularFiles.Parsed correlations = new TabularFiles.Parsed(CORRELATION_SPEC, source, text, null);
        return build(TabularFiles.parseJson(SPEC, text, source, null, correlations), correlations);
    }

    /** @param c the correlations as read, or null when the file has none */
    private static LevelList build(TabularFiles.Parsed p, TabularFiles.Parsed c) {
        boolean sound = p.checkHeader();
        int before = p.problems.size();
        Provenance.Kind provenance = p.provenance();
        Unit unit = p.unit(EnumSet.of(Kind.WAVENUMBER, Kind.ENERGY));
        sound &= p.problems.size() == before;
        LevelList.Builder builder = LevelList.builder(TabularFiles.info(p, DataKind.LEVELS, provenance, sound),
                unit == null ? Unit.PER_CENTIMETRE : unit, p.header.getOrDefault("note", ""));
        Map<String, Species> speciesCache = new HashMap<>();
        Map<String, Integer> seen = new HashMap<>();
        Map<String, Integer> rowOf = new HashMap<>();
        List<TabularFiles.Row> levelRows = new ArrayList<>();
        List<Species> covered = new ArrayList<>();
        for (TabularFiles.Row row : p.rows) {
            int rowBefore = p.problems.size();
            Species species = p.species(row, speciesCache);
            String label = p.text(row, "label");
            if (label == null && row.values().get("label") == null) {
                p.rowProblem(row, "label", "data.missing-value", "label is required");
            }
            double energy = p.number(row, "energy", true);
            double uncertainty = p.number(row, "uncertainty", false);
            int twoJ = -1;
            String j = p.text(row, "j");
            if (j != null) {
                Matcher m = J.matcher(j.strip());
                if (!m.matches() || m.group(2) != null && Integer.parseInt(m.group(1)) % 2 == 0) {
                    p.rowProblem(row, "j", "data.bad-j", "j must be an integer or an odd number over 2 (e.g. 3/2), got '"
                            + j + "'");
                } else {
                    twoJ = m.group(2) != null ? Integer.parseInt(m.group(1)) : 2 * Integer.parseInt(m.group(1));
                }
            }
            String note = p.text(row, "note");
            if (label != null && twoJ >= 0) {
                try {
                    LevelDesignation.parse(label, twoJ); // a J in the label must agree with the j column
                } catch (IllegalArgumentException e) {
                    p.rowProblem(row, "j", "data.bad-j", e.getMessage());
                }
            }
            if (p.problems.size() != rowBefore) {
                continue;
            }
            Integer first = seen.putIfAbsent(species.notation() + "|" + label, row.line());
            if (first != null) {
                p.rowProblem(row, "label", "data.duplicate", "duplicate of the level on line " + first
                        + " (same species and label)");
                continue;
            }
            if (!covered.contains(species)) {
                covered.add(species);
            }
            builder.add(species, label, energy, uncertainty, twoJ, note);
            rowOf.put(species.notation() + "|" + label, levelRows.size());
            levelRows.add(row);
        }
        if (c != null) {
            correlate(p, c, builder, speciesCache, rowOf, levelRows);
        }
        p.throwIfAny();
        LevelList table = builder.build();
        var info = table.info();
        return table.withInfo(new org.ritzwerk.data.DataSetInfo(info.id(), info.kind(), info.title(), info.version(),
                info.provenance(), covered));
    }

    /**
     * Reads the correlations into the builder, every problem into {@code p}: unknown levels, a level
     * with itself, a pair given twice (asymmetric when the values differ), a coefficient outside
     * [-1, 1], a level without an uncertainty above 0, and a covariance that is not positive
     * semidefinite.
     */
    private static void correlate(TabularFiles.Parsed p, TabularFiles.Parsed c, LevelList.Builder builder,
            Map<String, Species> speciesCache, Map<String, Integer> rowOf, List<TabularFiles.Row> levelRows) {
        int before = p.problems.size();
        Map<Long, TabularFiles.Row> pairs = new HashMap<>();
        Map<Long, Double> values = new HashMap<>();
        double[] uncertainty = new double[levelRows.size()];   // each level's, read once (NaN: none)
        for (int i = 0; i < uncertainty.length; i++) {
            uncertainty[i] = p.number(levelRows.get(i), "uncertainty", false);
        }
        List<int[]> given = new ArrayList<>();
        List<TabularFiles.Row> givenRows = new ArrayList<>();
        List<Double> givenValues = new ArrayList<>();
        for (TabularFiles.Row row : c.rows) {
            int rowBefore = c.problems.size();
            Species species = c.species(row, speciesCache);
            int[] level = new int[2];
            String[] columns = {"label", "other"};
            for (int k = 0; k < 2; k++) {
                String label = c.text(row, columns[k]);
                level[k] = -1;
                if (label == null) {
                    if (row.values().get(columns[k]) == null) {
                        c.rowProblem(row, columns[k], "data.missing-value", columns[k] + " is required");
                    }
                } else if (species != null) {
                    Integer at = rowOf.get(species.notation() + "|" + label);
                    if (at == null) {
                        c.rowProblem(row, columns[k], "data.unknown-level", "no level '" + label + "' of "
                                + species.notation() + " in this file (or its row has a problem)");
                    } else {
                        level[k] = at;
                    }
                }
            }
            double r = signed(c, row, "correlation");
            if (!Double.isNaN(r) && !(r >= -1 && r <= 1)) {
                c.rowProblem(row, "correlation", "data.out-of-range", "a correlation coefficient is from -1 to 1, got "
                        + row.values().get("correlation"));
            }
            if (c.problems.size() != rowBefore) {
                continue;
            }
            if (level[0] == level[1]) {
                c.rowProblem(row, "other", "data.bad-correlation", "a level is not correlated with itself: its "
                        + "variance is its uncertainty squared");
                continue;
            }
            boolean exact = false;
            for (int k = 0; k < 2; k++) {
                Object u = levelRows.get(level[k]).values().get("uncertainty");
                TabularFiles.Row levelRow = levelRows.get(level[k]);
                double sigma = uncertainty[level[k]];
                if (!(sigma > 0)) {
                    c.rowProblem(row, columns[k], "data.bad-correlation", "level '" + levelRow.values().get("label")
                            + "' (line " + levelRow.line() + ") has " + (u == null ? "no uncertainty" : "uncertainty 0")
                            + ": only levels with an uncertainty above 0 are correlated");
                    exact = true;
                }
            }
            if (exact) {
                continue;
            }
            long key = ((long) Math.min(level[0], level[1]) << 32) | Math.max(level[0], level[1]);
            TabularFiles.Row first = pairs.putIfAbsent(key, row);
            if (first != null) {
                double old = values.get(key);
                c.rowProblem(row, "correlation", "data.duplicate", old == r
                        ? "the correlation of these two levels is given on line " + first.line() + " already"
                        : "the correlation of these two levels is " + old + " on line " + first.line() + " and " + r
                                + " here: the matrix would not be symmetric");
                continue;
            }
            values.put(key, r);
            given.add(level);
            givenRows.add(row);
            givenValues.add(r);
        }
        p.problems.addAll(c.problems);
        c.problems.clear();
        if (p.problems.size() != before) {
            return;
        }
        // every level of a correlated species needs an uncertainty
        Map<Species, List<Integer>> bySpecies = new java.util.LinkedHashMap<>();
        for (int[] pair : given) {
            bySpecies.putIfAbsent(levelSpecies(levelRows, pair[0], speciesCache), new ArrayList<>());
        }
        for (int i = 0; i < levelRows.size(); i++) {
            List<Integer> rows = bySpecies.get(levelSpecies(levelRows, i, speciesCache));
            if (rows != null) {
                rows.add(i);
                if (levelRows.get(i).values().get("uncertainty") == null) {
                    p.rowProblem(levelRows.get(i), "uncertainty", "data.missing-value", "uncertainty is required: "
                            + "levels of this species are correlated (line " + givenRows.get(0).line() + " on), and a "
                            + "covariance needs every level's uncertainty");
                }
            }
        }
        if (p.problems.size() != before) {
            return;
        }
        for (Map.Entry<Species, List<Integer>> e : bySpecies.entrySet()) {
            List<Integer> rows = e.getValue();
            Map<Integer, Integer> place = new HashMap<>();
            double[] sigma = new double[rows.size()];
            for (int k = 0; k < rows.size(); k++) {
                place.put(rows.get(k), k);
                sigma[k] = uncertainty[rows.get(k)];
            }
            double[][] v = new double[rows.size()][rows.size()];
            for (int k = 0; k < rows.size(); k++) {
                v[k][k] = sigma[k] * sigma[k];
            }
            for (int g = 0; g < given.size(); g++) {
                Integer a = place.get(given.get(g)[0]);
                Integer b = place.get(given.get(g)[1]);
                if (a != null) {
                    v[a][b] = givenValues.get(g) * sigma[a] * sigma[b];
                    v[b][a] = v[a][b];
                }
            }
            int at = RitzLevels.firstIndefiniteLevel(v);
            if (at >= 0) {
                // the last row pairing that level with one before it (one exists, else the block stays semidefinite)
                int culprit = -1;
                for (int g = 0; g < given.size(); g++) {
                    Integer a = place.get(given.get(g)[0]);
                    Integer b = place.get(given.get(g)[1]);
                    if (a != null && (a == at && b < at || b == at && a < at)) {
                        culprit = g;
                    }
                }
                String label = String.valueOf(levelRows.get(rows.get(at)).values().get("label"));
                TabularFiles.Row row = givenRows.get(Math.max(culprit, 0));
                c.rowProblem(row, "correlation", "data.not-semidefinite", "the correlations of level '" + label
                        + "' (line " + levelRows.get(rows.get(at)).line() + ") with the " + e.getKey().notation()
                        + " levels before it make a covariance matrix that is not positive semidefinite (no set of "
                        + "energies has it; a variance of some difference of levels would be negative): check this "
                        + "row and the other correlations of '" + label + "'");
            }
        }
        if (!c.problems.isEmpty()) {
            p.problems.addAll(c.problems);
            return;
        }
        for (int g = 0; g < given.size(); g++) {
            builder.correlate(given.get(g)[0], given.get(g)[1], givenValues.get(g));
        }
    }

    private static Species levelSpecies(List<TabularFiles.Row> levelRows, int i, Map<String, Species> cache) {
        return cache.get((String) levelRows.get(i).values().get("species"));
    }

    /** @return a number that may be negative, NaN when absent or bad (then reported) */
    private static double signed(TabularFiles.Parsed c, TabularFiles.Row row, String column) {
        Object value = row.values().get(column);
        if (value == null) {
            c.rowProblem(row, column, "data.missing-value", column + " is required");
            return Double.NaN;
        }
        double number;
        if (value instanceof Double) {
            number = (Double) value;
        } else {
            String text = ((String) value).strip();
            if (!TabularFiles.isDecimal(text)) {
                c.rowProblem(row, column, "data.not-a-number", column + " is not a number: '" + value + "'");
                return Double.NaN;
            }
            number = Double.parseDouble(text);
        }
        if (!Double.isFinite(number)) {
            c.rowProblem(row, column, "data.not-finite", column + " is too large for a double");
            return Double.NaN;
        }
        return number;
    }

    /**
     * @param table a level table
     * @return the table in the CSV encoding, reading back equal
     */
    public static String writeCsv(LevelList table) {
        List<String[]> rows = new ArrayList<>();
        for (int i = 0; i < table.size(); i++) {
            rows.add(new String[] {table.species(i).notation(), table.label(i), Double.toString(table.energy(i)),
                TabularFiles.csv(table.uncertainty(i)), j(table.twoJ(i)), TabularFiles.csv(table.rowNote(i))});
        }
        String text = TabularFiles.writeCsv(SPEC, headerOf(table), rows);
        if (table.correlationCount() == 0) {
            return text;
        }
        List<String[]> correlations = new ArrayList<>();
        for (int k = 0; k < table.correlationCount(); k++) {
            int a = table.correlationRow(k);
            correlations.add(new String[] {table.species(a).notation(), table.label(a),
                table.label(table.correlationOtherRow(k)), Double.toString(table.correlation(k))});
        }
        return text + TabularFiles.writeCsvSection(CORRELATIONS, CORRELATION_SPEC, correlations);
    }

    /**
     * @param table a level table
     * @return the table in the JSON encoding, reading back equal
     */
    public static String writeJson(LevelList table) {
        List<ObjectNode> rows = new ArrayList<>();
        for (int i = 0; i < table.size(); i++) {
            ObjectNode row = TabularFiles.newRow();
            row.put("species", table.species(i).notation());
            row.put("label", table.label(i));
            row.put("energy", table.energy(i));
            TabularFiles.put(row, "uncertainty", table.uncertainty(i));
            TabularFiles.put(row, "j", table.twoJ(i) < 0 ? null : j(table.twoJ(i)));
            TabularFiles.put(row, "note", table.rowNote(i));
            rows.add(row);
        }
        List<ObjectNode> correlations = new ArrayList<>();
        for (int k = 0; k < table.correlationCount(); k++) {
            int a = table.correlationRow(k);
            ObjectNode row = TabularFiles.newRow();
            row.put("species", table.species(a).notation());
            row.put("label", table.label(a));
            row.put("other", table.label(table.correlationOtherRow(k)));
            row.put("correlation", table.correlation(k));
            correlations.add(row);
        }
        return TabularFiles.writeJson(SPEC, headerOf(table), rows, CORRELATION_SPEC, correlations);
    }

    /** @return j as the file writes it: {@code 3/2} for a half-integer, {@code 2} for an integer, empty for none */
    private static String j(int twoJ) {
        if (twoJ < 0) {
            return "";
        }
        return (twoJ & 1) == 0 ? Integer.toString(twoJ / 2) : twoJ + "/2";
    }

    private static Map<String, String> headerOf(LevelList table) {
        Map<String, String> header = TabularFiles.header(table.info(), false);
        header.put("energy-unit", table.unit().symbol());
        if (!table.note().isEmpty()) {
            header.put("note", table.note());
        }
        return header;
    }
}
