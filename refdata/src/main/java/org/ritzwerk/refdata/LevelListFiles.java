package org.ritzwerk.refdata;

import java.io.InputStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
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
 *
 * <p>Shared uncertainty components (optional; the compact form where many levels depend on a few
 * common error sources, such as a series limit): a line {@code # shared-uncertainties}, then rows
 * {@code species,label,component,value} (all four required), each saying that the level's energy
 * depends on the common error source named {@code component} with the signed standard-uncertainty
 * contribution {@code value} (in the energy unit of the file). The covariance of two levels of one
 * species is the sum over the components both have of the products of their values,
 * {@code sum_c v_ic v_jc}, and each level's own, independent part is {@code u_i^2 - sum_c v_ic^2}
 * (common practice: the GUM, JCGM 100:2008, 5.2 and F.1.2.3, inputs common to two results). In JSON
 * the rows are objects under {@code sharedUncertainties}. Each level named must be a level of that
 * species in the file with an uncertainty above 0; every level of a species with components needs
 * an uncertainty; the component's name must not be blank (spaces around it are dropped and a run of
 * them inside reads as one, so {@code " limit"} and {@code "limit"} name one source), and one
 * component is one species'; a level is given a component once; and a level's values squared may
 * add up to its uncertainty squared but not more (beyond {@link LevelList#SHARE_ROUNDING} of it: the
 * rounding of decimal values), refused at the row that makes them so. The matrix is positive
 * semidefinite by construction.
 * <pre>
 * # shared-uncertainties
 * species,label,component,value
 * He I,1s2s 3S1,calibration,0.0015
 * He I,1s2p 3P2,calibration,0.0015
 * </pre>
 * Both sections may appear, in either order, each once: the covariance of a pair is then
 * {@code r u_a u_b + sum_c v_ac v_bc}, and a pair with a correlation must share no component (its
 * covariance would be given twice; refused at the correlation's row); the positive semidefiniteness
 * check of a species with correlations includes its shared parts. The writer writes the correlations
 * first. Each problem names the file, line and column.
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
    /** The line that starts the shared uncertainties in CSV (after {@code #}). */
    public static final String SHARES = "shared-uncertainties";
    /** The JSON key of the shared uncertainties. */
    public static final String SHARES_JSON_KEY = "sharedUncertainties";
    /** Columns of the shared uncertainties, in the order they are written. */
    public static final List<String> SHARE_COLUMNS = List.of("species", "label", "component", "value");
    private static final TabularFiles.Spec SHARE_SPEC = new TabularFiles.Spec(FORMAT, VERSION, "energy-unit",
            SPEC.headerKeys(), SPEC.requiredKeys(), SHARE_COLUMNS, SHARE_COLUMNS, List.of("value"), SHARES_JSON_KEY);
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
        List<Map.Entry<Integer, String>> markers = TabularFiles.sectionLines(text, Set.of(CORRELATIONS, SHARES));
        if (markers.isEmpty()) {
            return build(TabularFiles.parseCsv(SPEC, text, source), null, null);
        }
        TabularFiles.Parsed levels = TabularFiles.parseCsv(SPEC, TabularFiles.before(text, markers.get(0).getKey()),
                source);
        Map<String, TabularFiles.Parsed> sections = new HashMap<>();
        Map<String, Integer> sectionLine = new HashMap<>();
        for (int k = 0; k < markers.size(); k++) {
            int line = markers.get(k).getKey();
            String marker = markers.get(k).getValue();
            Integer first = sectionLine.putIfAbsent(marker, line);
            if (first != null) {
                levels.problem(line, 1, "data.section-twice", "a second '# " + marker + "' section: give its rows "
                        + "in the first (line " + first + ")", "");
                continue;
            }
            int end = k + 1 < markers.size() ? markers.get(k + 1).getKey() : Integer.MAX_VALUE;
            sections.put(marker, TabularFiles.parseCsvSection(marker.equals(CORRELATIONS) ? CORRELATION_SPEC
                    : SHARE_SPEC, text, source, line, end));
        }
        return build(levels, sections.get(CORRELATIONS), sections.get(SHARES));
    }

    /**
     * @param text   the whole file
     * @param source file name for messages
     * @return the table
     * @throws DataFileException with every problem found
     */
    public static LevelList readJson(String text, String source) {
        TabularFiles.Parsed correlations = new TabularFiles.Parsed(CORRELATION_SPEC, source, text, null);
        TabularFiles.Parsed shares = new TabularFiles.Parsed(SHARE_SPEC, source, text, null);
        return build(TabularFiles.parseJson(SPEC, text, source, null, List.of(correlations, shares)), correlations,
                shares);
    }

    /**
     * @param c the correlations as read, or null when the file has none
     * @param s the shared uncertainties as read, or null when the file has none
     */
    private static LevelList build(TabularFiles.Parsed p, TabularFiles.Parsed c, TabularFiles.Parsed s) {
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
        List<Species> levelSpecies = new ArrayList<>();
        List<Double> levelUncertainty = new ArrayList<>();
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
                    p.rowProblem(row, "j", "data.bad-j", "j must be an integer or an odd number over 2 (e.g. 3/2), "
                            + "got '" + j + "'");
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
            levelSpecies.add(species);
            levelUncertainty.add(uncertainty);
        }
        if (c != null || s != null) {
            Levels levels = new Levels(p, levelRows, levelSpecies, levelUncertainty, rowOf, speciesCache);
            List<Share> shares = s == null ? List.of() : shares(levels, s);
            List<Pair> pairs = c == null ? List.of() : pairs(levels, c);
            if ((c == null || c.problems.isEmpty()) && (s == null || s.problems.isEmpty())) {
                covariance(levels, c, shares, pairs);
            }
            for (TabularFiles.Parsed section : new TabularFiles.Parsed[] {s, c}) {
                if (section != null) {
                    p.problems.addAll(section.problems);
                }
            }
            if (p.problems.isEmpty()) {
                shares.forEach(share -> builder.share(share.level, share.component, share.value));
                pairs.forEach(pair -> builder.correlate(pair.level, pair.other, pair.r));
            }
        }
        p.throwIfAny();
        LevelList table = builder.build();
        var info = table.info();
        return table.withInfo(new org.ritzwerk.data.DataSetInfo(info.id(), info.kind(), info.title(), info.version(),
                info.provenance(), covered));
    }

    /** The good level rows of a file, each with its species and uncertainty (NaN: none), and their index. */
    private record Levels(TabularFiles.Parsed p, List<TabularFiles.Row> rows, List<Species> species,
            List<Double> uncertainty, Map<String, Integer> rowOf, Map<String, Species> speciesCache) {

        /**
         * @return the level a column of a section's row names (a level of the row's species in the
         *         file), or -1 when it does not (reported) or the column is empty (reported)
         */
        int level(TabularFiles.Parsed section, TabularFiles.Row row, Species of, String column) {
            String label = section.text(row, column);
            if (label == null) {
                if (row.values().get(column) == null) {
                    section.rowProblem(row, column, "data.missing-value", column + " is required");
                }
                return -1;
            }
            if (of == null) {
                return -1;
            }
            Integer at = rowOf.get(of.notation() + "|" + label);
            if (at == null) {
                section.rowProblem(row, column, "data.unknown-level", "no level '" + label + "' of " + of.notation()
                        + " in this file (or its row has a problem)");
                return -1;
            }
            return at;
        }

        /** @return what a level's uncertainty is, for a message: "no uncertainty" or "uncertainty 0" */
        String exactness(int level) {
            return rows.get(level).values().get("uncertainty") == null ? "no uncertainty" : "uncertainty 0";
        }

        String label(int level) {
            return String.valueOf(rows.get(level).values().get("label"));
        }
    }

    /** A shared-uncertainty contribution as read: level, component, value and its row. */
    private record Share(int level, String component, double value, TabularFiles.Row row) {
    }

    /** A correlation as read: the two levels, the coefficient and its row. */
    private record Pair(int level, int other, double r, TabularFiles.Row row) {
    }

    /**
     * Reads the shared uncertainties, every problem into {@code s}: an unknown level, a missing or
     * blank component, a value that is not a finite number, a level without an uncertainty above 0, a
     * level given a component twice, a component of levels of two species, and contributions whose
     * squares add up to more than the level's uncertainty squared (at the row that makes them so).
     */
    private static List<Share> shares(Levels levels, TabularFiles.Parsed s) {
        List<Share> shares = new ArrayList<>();
        Map<String, TabularFiles.Row> firstOf = new HashMap<>();         // level|component -> its first row
        Map<String, Integer> componentLevel = new HashMap<>();           // component -> a level that has it
        Map<Integer, Double> squares = new HashMap<>();
        java.util.Set<Integer> over = new java.util.HashSet<>();
        for (TabularFiles.Row row : s.rows) {
            int rowBefore = s.problems.size();
            Species species = s.species(row, levels.speciesCache());
            int level = levels.level(s, row, species, "label");
            String component = s.text(row, "component");
            if (component == null) {
                if (row.values().get("component") == null) {
                    s.rowProblem(row, "component", "data.missing-value", "component is required: the name of the "
                            + "common error source");
                }
            } else if (component.isBlank()) {
                s.rowProblem(row, "component", "data.missing-value", "component's name is empty (blank)");
            } else {
                // " limit" and "limit" name one source: spaces around a name and runs of them inside count as one
                component = component.strip().replaceAll("\\s+", " ");
            }
            double value = s.signedNumber(row, "value", true);
            if (s.problems.size() != rowBefore) {
                continue;
            }
            TabularFiles.Row levelRow = levels.rows().get(level);
            double u = levels.uncertainty().get(level);
            if (!(u > 0)) {
                s.rowProblem(row, "label", "data.bad-share", "level '" + levels.label(level) + "' (line "
                        + levelRow.line() + ") has " + levels.exactness(level) + ": only levels with an uncertainty "
                        + "above 0 share uncertainty components");
                continue;
            }
            TabularFiles.Row first = firstOf.putIfAbsent(level + "|" + component, row);
            if (first != null) {
                s.rowProblem(row, "component", "data.duplicate", "level '" + levels.label(level) + "' is given "
                        + "component '" + component + "' on line " + first.line() + " already");
                continue;
            }
            Integer other = componentLevel.putIfAbsent(component, level);
            if (other != null && !levels.species().get(other).equals(species)) {
                s.rowProblem(row, "component", "data.bad-share", "component '" + component + "' is shared by "
                        + levels.species().get(other).notation() + " levels already (level '" + levels.label(other)
                        + "'), and levels of two species have no covariance here: name this one apart");
                continue;
            }
            double sum = squares.getOrDefault(level, 0.0) + value * value;
            squares.put(level, sum);
            if (sum > u * u * (1 + LevelList.SHARE_ROUNDING) && over.add(level)) {
                s.rowProblem(row, "value", "data.share-too-large", String.format(java.util.Locale.ROOT,
                        "the contributions of level '%s' squared add up to %.4g here, more than its uncertainty "
                        + "%s squared (line %d): a level's shared parts cannot exceed its whole uncertainty, "
                        + "its independent part u^2 - sum v^2 would be negative", levels.label(level), sum,
                        levelRow.values().get("uncertainty"), levelRow.line()));
                continue;
            }
            shares.add(new Share(level, component, value, row));
        }
        return shares;
    }

    /**
     * Reads the correlations, every problem into {@code c}: unknown levels, a level with itself, a pair
     * given twice (asymmetric when the values differ), a coefficient outside [-1, 1] and a level without
     * an uncertainty above 0.
     */
    private static List<Pair> pairs(Levels levels, TabularFiles.Parsed c) {
        Map<Long, Pair> given = new HashMap<>();
        List<Pair> pairs = new ArrayList<>();
        for (TabularFiles.Row row : c.rows) {
            int rowBefore = c.problems.size();
            Species species = c.species(row, levels.speciesCache());
            String[] columns = {"label", "other"};
            int[] level = {levels.level(c, row, species, "label"), levels.level(c, row, species, "other")};
            double r = c.signedNumber(row, "correlation", true);
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
                if (!(levels.uncertainty().get(level[k]) > 0)) {
                    c.rowProblem(row, columns[k], "data.bad-correlation", "level '" + levels.label(level[k])
                            + "' (line " + levels.rows().get(level[k]).line() + ") has " + levels.exactness(level[k])
                            + ": only levels with an uncertainty above 0 are correlated");
                    exact = true;
                }
            }
            if (exact) {
                continue;
            }
            long key = ((long) Math.min(level[0], level[1]) << 32) | Math.max(level[0], level[1]);
            Pair pair = new Pair(level[0], level[1], r, row);
            Pair first = given.putIfAbsent(key, pair);
            if (first != null) {
                c.rowProblem(row, "correlation", "data.duplicate", first.r == r
                        ? "the correlation of these two levels is given on line " + first.row.line() + " already"
                        : "the correlation of these two levels is " + first.r + " on line " + first.row.line()
                                + " and " + r + " here: the matrix would not be symmetric");
                continue;
            }
            pairs.add(pair);
        }
        return pairs;
    }

    /**
     * The checks of the whole covariance, once every row is sound: every level of a species with a
     * correlation or a shared component has an uncertainty; a correlated pair shares no component
     * (its covariance would be given twice); and the covariance of a species with correlations (plus
     * its shared parts) is positive semidefinite. A species with shared components only is: its matrix
     * is the independent parts on the diagonal plus a sum of outer products.
     */
    private static void covariance(Levels levels, TabularFiles.Parsed c, List<Share> shares, List<Pair> pairs) {
        TabularFiles.Parsed p = levels.p();
        // every level of a correlated species needs an uncertainty
        Map<Species, List<Integer>> bySpecies = new java.util.LinkedHashMap<>();
        Map<Species, TabularFiles.Row> firstRow = new HashMap<>();
        for (Share share : shares) {
            bySpecies.putIfAbsent(levels.species().get(share.level), new ArrayList<>());
            firstRow.putIfAbsent(levels.species().get(share.level), share.row);
        }
        for (Pair pair : pairs) {
            bySpecies.putIfAbsent(levels.species().get(pair.level), new ArrayList<>());
            firstRow.putIfAbsent(levels.species().get(pair.level), pair.row);
        }
        int before = p.problems.size();
        for (int i = 0; i < levels.rows().size(); i++) {
            List<Integer> rows = bySpecies.get(levels.species().get(i));
            if (rows != null) {
                rows.add(i);
                if (Double.isNaN(levels.uncertainty().get(i))) {
                    p.rowProblem(levels.rows().get(i), "uncertainty", "data.missing-value", "uncertainty is required: "
                            + "levels of this species are correlated (line " + firstRow.get(levels.species().get(i))
                                    .line() + " on), and a covariance needs every level's uncertainty");
                }
            }
        }
        if (p.problems.size() != before) {
            return;
        }
        Map<Integer, Map<String, Double>> componentsOf = new HashMap<>();
        for (Share share : shares) {
            componentsOf.computeIfAbsent(share.level, l -> new HashMap<>()).put(share.component, share.value);
        }
        for (Pair pair : pairs) {
            Map<String, Double> a = componentsOf.getOrDefault(pair.level, Map.of());
            for (String component : componentsOf.getOrDefault(pair.other, Map.of()).keySet()) {
                if (a.containsKey(component)) {
                    c.rowProblem(pair.row, "other", "data.bad-correlation", "levels '" + levels.label(pair.level)
                            + "' and '" + levels.label(pair.other) + "' share the uncertainty component '" + component
                            + "' (" + SHARES + " section): their covariance comes from there, and a correlation "
                            + "would give it twice");
                    break;
                }
            }
        }
        if (c == null || !c.problems.isEmpty()) {
            return;     // no correlations: shared components only, positive semidefinite by construction
        }
        for (Map.Entry<Species, List<Integer>> e : bySpecies.entrySet()) {
            List<Integer> rows = e.getValue();
            List<Pair> own = new ArrayList<>();
            for (Pair pair : pairs) {
                if (levels.species().get(pair.level).equals(e.getKey())) {
                    own.add(pair);
                }
            }
            if (own.isEmpty()) {
                continue;   // shared components only: positive semidefinite by construction
            }
            Map<Integer, Integer> place = new HashMap<>();
            double[] sigma = new double[rows.size()];
            for (int k = 0; k < rows.size(); k++) {
                place.put(rows.get(k), k);
                sigma[k] = levels.uncertainty().get(rows.get(k));
            }
            double[][] v = new double[rows.size()][rows.size()];
            for (int k = 0; k < rows.size(); k++) {
                v[k][k] = sigma[k] * sigma[k];
            }
            for (Pair pair : own) {
                int a = place.get(pair.level);
                int b = place.get(pair.other);
                v[a][b] = pair.r * sigma[a] * sigma[b];
                v[b][a] = v[a][b];
            }
            Map<String, List<Share>> byComponent = new HashMap<>();
            for (Share share : shares) {
                if (place.containsKey(share.level)) {
                    byComponent.computeIfAbsent(share.component, k -> new ArrayList<>()).add(share);
                }
            }
            for (List<Share> members : byComponent.values()) {
                for (int x = 0; x < members.size(); x++) {
                    for (int y = x + 1; y < members.size(); y++) {
                        int a = place.get(members.get(x).level);
                        int b = place.get(members.get(y).level);
                        v[a][b] += members.get(x).value * members.get(y).value;
                        v[b][a] = v[a][b];
                    }
                }
            }
            int at = RitzLevels.firstIndefiniteLevel(v);
            if (at >= 0) {
                // the last row pairing that level with one before it (one exists, else the block stays semidefinite)
                Pair culprit = own.get(0);
                for (Pair pair : own) {
                    int a = place.get(pair.level);
                    int b = place.get(pair.other);
                    if (a == at && b < at || b == at && a < at) {
                        culprit = pair;
                    }
                }
                String label = levels.label(rows.get(at));
                c.rowProblem(culprit.row, "correlation", "data.not-semidefinite", "the correlations of level '" + label
                        + "' (line " + levels.rows().get(rows.get(at)).line() + ") with the " + e.getKey().notation()
                        + " levels before it make a covariance matrix that is not positive semidefinite (no set of "
                        + "energies has it; a variance of some difference of levels would be negative): check this "
                        + "row and the other correlations of '" + label + "'");
            }
        }
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
        StringBuilder text = new StringBuilder(TabularFiles.writeCsv(SPEC, headerOf(table), rows));
        if (table.correlationCount() > 0) {
            List<String[]> correlations = new ArrayList<>();
            for (int k = 0; k < table.correlationCount(); k++) {
                int a = table.correlationRow(k);
                correlations.add(new String[] {table.species(a).notation(), table.label(a),
                    table.label(table.correlationOtherRow(k)), Double.toString(table.correlation(k))});
            }
            text.append(TabularFiles.writeCsvSection(CORRELATIONS, CORRELATION_SPEC, correlations));
        }
        if (table.shareCount() > 0) {
            List<String[]> shares = new ArrayList<>();
            for (int k = 0; k < table.shareCount(); k++) {
                int a = table.shareRow(k);
                shares.add(new String[] {table.species(a).notation(), table.label(a), table.shareComponent(k),
                    Double.toString(table.share(k))});
            }
            text.append(TabularFiles.writeCsvSection(SHARES, SHARE_SPEC, shares));
        }
        return text.toString();
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
        List<ObjectNode> shares = new ArrayList<>();
        for (int k = 0; k < table.shareCount(); k++) {
            int a = table.shareRow(k);
            ObjectNode row = TabularFiles.newRow();
            row.put("species", table.species(a).notation());
            row.put("label", table.label(a));
            row.put("component", table.shareComponent(k));
            row.put("value", table.share(k));
            shares.add(row);
        }
        Map<TabularFiles.Spec, List<ObjectNode>> sections = new java.util.LinkedHashMap<>();
        sections.put(CORRELATION_SPEC, correlations);
        sections.put(SHARE_SPEC, shares);
        return TabularFiles.writeJson(SPEC, headerOf(table), rows, sections);
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
